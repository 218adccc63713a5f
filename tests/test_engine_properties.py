"""Property tests: random grids of every shape against reference libraries, and witnesses.

References (outside the project): scipy.optimize.linear_sum_assignment on a big-M
encoding built in tests/helpers_reference.py, and networkx.max_weight_matching (Edmonds'
blossom algorithm, pure Python). Witnesses are checked by Hall's theorem (Hall 1935),
counting machines by hand. Every solve is followed by ``verify()`` and by
:func:`helpers_reference.check_result`, which re-checks the certificate directly.
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st
from hypothesis.extra.numpy import arrays
from scipy.optimize import linear_sum_assignment

from dispatcher.engine import InfeasibleError, solve
from helpers_reference import (
    brute_force,
    check_result,
    networkx_reference,
    scipy_reference,
    witness_holds_by_hand,
)

OBJECTIVES = ("total", "maximize", "bottleneck")
FAST = dict(deadline=None, suppress_health_check=[HealthCheck.too_slow, HealthCheck.data_too_large])


@st.composite
def problems(draw, max_jobs: int = 9, max_machines: int = 9, max_value: int = 40,
             extras: bool = True):
    """A grid of any shape (0 x N, N x 0, 1 x N, ... included) with a mask and options."""
    m = draw(st.integers(0, max_jobs))
    n = draw(st.integers(0, max_machines))
    values = draw(arrays(np.int64, (m, n), elements=st.integers(0, max_value)))
    kind = draw(st.sampled_from(["all", "random", "sparse", "dead rows and columns"]))
    if kind == "all":
        allowed = np.ones((m, n), dtype=bool)
    elif kind == "random":
        allowed = draw(arrays(np.bool_, (m, n)))
    else:
        allowed = draw(arrays(np.int8, (m, n), elements=st.integers(0, 3))) == 0
        if kind == "dead rows and columns" and m and n:
            allowed[draw(st.integers(0, m - 1))] = False
            allowed[:, draw(st.integers(0, n - 1))] = False
    penalty = must = None
    if extras:
        penalty = draw(st.none() | arrays(np.int64, (m,), elements=st.integers(0, 2 * max_value)))
        must = draw(st.none() | arrays(np.bool_, (m,), elements=st.integers(0, 3).map(lambda x: x == 0)))
    objective = draw(st.sampled_from(OBJECTIVES))
    return values, allowed, penalty, must, objective


def _solve_checked(values, allowed, penalty, must, objective, reference=None):
    result = solve(values, allowed, objective=objective, wait_penalty=penalty, must_run=must)
    assert result.verify()
    check_result(result, values, allowed, penalty, must, reference=reference)
    return result


def _compare(problem, reference):
    values, allowed, penalty, must, objective = problem
    expect = reference(values, allowed, penalty, must, objective)
    if not expect.feasible:
        with pytest.raises(InfeasibleError) as info:
            solve(values, allowed, objective=objective, wait_penalty=penalty, must_run=must)
        w = info.value.witness
        assert w.holds(allowed) and witness_holds_by_hand(allowed, w.jobs, w.machines)
        return None
    result = _solve_checked(values, allowed, penalty, must, objective,
                            expect if reference is scipy_reference else None)
    assert result.planned_count == expect.placed
    assert result.total == expect.total
    assert result.bottleneck == expect.bottleneck
    return result


@settings(max_examples=900, **FAST)
@given(problem=problems())
def test_against_scipy(problem):
    # Reference library: scipy.optimize.linear_sum_assignment on a rectangular big-M
    # encoding with one private wait column per job, built independently in the test.
    _compare(problem, scipy_reference)


@settings(max_examples=400, **FAST)
@given(problem=problems(max_jobs=7, max_machines=7, max_value=25))
def test_against_networkx(problem):
    # Reference library: networkx.max_weight_matching(maxcardinality=True), Edmonds'
    # blossom algorithm, which shares no code with scipy.
    _compare(problem, networkx_reference)


@settings(max_examples=60, **FAST)
@given(problem=problems(max_jobs=40, max_machines=40, max_value=1000))
def test_larger_grids_against_scipy(problem):
    # Reference library: scipy, as above, on grids up to 40 x 40.
    _compare(problem, scipy_reference)


@settings(max_examples=200, **FAST)
@given(m=st.integers(1, 12), n=st.integers(1, 12), seed=st.integers(0, 2**32 - 1),
       maximize=st.booleans())
def test_float_values_against_scipy(m, n, seed, maximize):
    # Reference library: scipy.optimize.linear_sum_assignment on the rectangular grid itself
    # (every pair allowed, so the maximum number placed is min(m, n)); non-integer values.
    values = np.random.default_rng(seed).random((m, n)) * 1e4
    result = _solve_checked(values, None, None, None, "maximize" if maximize else "total")
    rows, cols = linear_sum_assignment(values, maximize=maximize)
    assert result.total == pytest.approx(values[rows, cols].sum(), rel=1e-12, abs=1e-9)
    assert result.planned_count == min(m, n)


@settings(max_examples=150, **FAST)
@given(problem=problems(max_jobs=8, max_machines=8, extras=False))
def test_transpose_keeps_the_optimum(problem):
    # Mathematical fact: a plan of the transposed grid is the same set of pairs, so without
    # wait penalties or must-run jobs the optimum (and bottleneck) is unchanged.
    values, allowed, _, _, objective = problem
    a = _solve_checked(values, allowed, None, None, objective)
    b = _solve_checked(values.T, allowed.T, None, None, objective)
    assert a.total == b.total and a.bottleneck == b.bottleneck
    assert a.planned_count == b.planned_count


# ----------------------------------------------------------------- witnesses (Hall 1935)

@settings(max_examples=300, **FAST)
@given(problem=problems(max_jobs=12, max_machines=8))
def test_wait_reasons_are_hall_witnesses(problem):
    # Hall's theorem (Hall 1935) and Konig's theorem (Konig 1931): a set of jobs whose
    # allowed machines number fewer than the jobs forces that many of them to wait, and
    # the deficiency of the worst such set equals the number of jobs that wait.
    values, allowed, penalty, must, objective = problem
    try:
        result = _solve_checked(values, allowed, penalty, must, objective)
    except InfeasibleError as exc:
        w = exc.witness
        assert w.holds(allowed) and witness_holds_by_hand(allowed, w.jobs, w.machines)
        assert result_must_set(must, allowed.shape[0])[w.jobs].all()
        return
    waiting = result.waiting_jobs
    if waiting.size == 0:
        assert result.witness() is None
        return
    # The groups split the waiting jobs: each group's deficiency is its own waiting jobs.
    groups = result.wait_groups()
    assert sum(g.deficiency for g in groups) == waiting.size
    assert all(witness_holds_by_hand(allowed, g.jobs, g.machines) for g in groups)
    overall = result.witness()
    assert overall.holds(allowed)
    assert witness_holds_by_hand(allowed, overall.jobs, overall.machines)
    assert overall.deficiency == waiting.size
    for job in waiting:
        w = result.wait_reason(int(job))
        assert int(job) in w.jobs.tolist()
        assert w.holds(allowed)
        assert witness_holds_by_hand(allowed, w.jobs, w.machines)
        assert w.deficiency >= 1
    placed = np.flatnonzero(result.machine_of_job >= 0)
    if placed.size:
        with pytest.raises(ValueError, match="not waiting"):
            result.wait_reason(int(placed[0]))


def result_must_set(must, m):
    return np.zeros(m, dtype=bool) if must is None else np.asarray(must, dtype=bool)


@settings(max_examples=200, **FAST)
@given(m=st.integers(1, 9), n=st.integers(0, 6), data=st.data())
def test_infeasible_must_run_witness(m, n, data):
    # Hall's theorem (Hall 1935): must-run jobs can all be placed exactly when every set
    # of them has at least as many allowed machines; the error names a set that has fewer.
    allowed = data.draw(arrays(np.int8, (m, n), elements=st.integers(0, 2))) == 0
    must = data.draw(arrays(np.bool_, (m,)))
    assume(must.any())
    values = np.ones((m, n))
    expect = scipy_reference(values, allowed, None, must)  # reference: scipy
    if expect.feasible:
        result = _solve_checked(values, allowed, None, must, "total")
        assert result.planned_count == expect.placed
        return
    with pytest.raises(InfeasibleError) as info:
        solve(values, allowed, must_run=must)
    w = info.value.witness
    assert w.holds(allowed)
    assert witness_holds_by_hand(allowed, w.jobs, w.machines)
    assert must[w.jobs].all(), "the witness names only must-run jobs"
    assert str(len(w.jobs)) in str(info.value)


def test_infeasible_witness_by_hand_example():
    # Checked by hand: jobs 0, 1, 2 are must-run and can only use machines 0 and 1.
    allowed = np.array([[1, 1, 0, 0],
                        [1, 0, 0, 0],
                        [0, 1, 0, 0],
                        [0, 0, 1, 1]], dtype=bool)
    with pytest.raises(InfeasibleError, match="3 must-run jobs can use only 2 machines") as info:
        solve(np.zeros((4, 4)), allowed, must_run=[0, 1, 2, 3])
    assert sorted(info.value.witness.jobs.tolist()) == [0, 1, 2]
    assert sorted(info.value.witness.machines.tolist()) == [0, 1]
    assert info.value.witness.deficiency == 1


def test_wait_reason_by_hand_example():
    # Checked by hand: three jobs can only use machine 0; job 3 has machine 1 to itself.
    allowed = np.array([[1, 0], [1, 0], [1, 0], [0, 1]], dtype=bool)
    result = _solve_checked(np.array([[5, 0], [3, 0], [4, 0], [0, 2]]), allowed, None, None, "total")
    assert result.machine_of_job.tolist() == [-1, 0, -1, 1]  # cheapest of the three runs
    for job in (0, 2):
        # Both waiting jobs and the job holding machine 0 compete for that one machine:
        # three jobs, one machine, so two of them wait whatever the plan.
        w = result.wait_reason(job)
        assert sorted(w.jobs.tolist()) == [0, 1, 2] and w.machines.tolist() == [0]
        assert w.deficiency == 2
        assert witness_holds_by_hand(allowed, w.jobs, w.machines)
    # Job 3 competes with nobody, so it forms no group of its own.
    assert len(result.wait_groups()) == 1
    overall = result.witness()
    assert sorted(overall.jobs.tolist()) == [0, 1, 2] and overall.machines.tolist() == [0]
    assert overall.deficiency == 2


def test_maximize_flag_is_the_maximize_objective():
    # Reference: scipy.optimize.linear_sum_assignment(maximize=True).
    values = np.random.default_rng(7).integers(0, 100, size=(6, 9))
    a = _solve_checked(values, None, None, None, "maximize")
    b = solve(values, maximize=True)
    assert b.verify()
    rows, cols = linear_sum_assignment(values, maximize=True)
    assert a.total == b.total == values[rows, cols].sum()


# ----------------------------------------------------------------- floating point

@settings(max_examples=200, **FAST)
@given(m=st.integers(0, 6), n=st.integers(0, 6), seed=st.integers(0, 2**32 - 1),
       value_exp=st.integers(-8, 12), penalty_exp=st.integers(-8, 12),
       density=st.sampled_from([1.0, 0.7, 0.4]), objective=st.sampled_from(OBJECTIVES))
def test_wide_magnitudes_against_brute_force(m, n, seed, value_exp, penalty_exp, density, objective):
    # Reference: brute-force enumeration of every plan (floats, values and wait penalties
    # of very different magnitudes); verify() must accept every correct plan.
    rng = np.random.default_rng(seed)
    values = rng.random((m, n)) * 10.0 ** value_exp
    allowed = rng.random((m, n)) < density
    penalty = rng.random(m) * 10.0 ** penalty_exp
    must = rng.random(m) < 0.2
    expect = brute_force(values, allowed, penalty, must, objective)
    if not expect.feasible:
        with pytest.raises(InfeasibleError):
            solve(values, allowed, objective=objective, wait_penalty=penalty, must_run=must)
        return
    result = _solve_checked(values, allowed, penalty, must, objective, expect)
    assert result.planned_count == expect.placed
    assert result.total == pytest.approx(expect.total, rel=1e-9)
    assert result.bottleneck == expect.bottleneck


def test_regression_verify_with_wait_penalties_far_above_values():
    # verify() once scaled its tolerance by the values only; with penalties ~1e9 next to
    # values ~50 the potentials' rounding (~1e-7) made it reject a correct plan.
    # Reference: brute-force enumeration.
    values = np.array([[4.48, 10.96, 0.00074], [48.6, 26.9, 0.132],
                       [0.00073, 0.00016, 48.7], [5.05, 0.0000195, 2.04]])
    allowed = np.array([[1, 0, 1], [1, 1, 1], [1, 1, 1], [0, 1, 1]], dtype=bool)
    penalty = np.array([7.044266332682212e9, 3.399675333083312e9, 8.463200240723073e9,
                        8.649757670516403e9])
    result = _solve_checked(values, allowed, penalty, None, "maximize")
    assert result.total == pytest.approx(brute_force(values, allowed, penalty, None, "maximize").total)
