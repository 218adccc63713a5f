"""Warm re-dispatch (dispatcher.engine.redispatch) against cold solves of the modified problem.

Reference: scipy.optimize.linear_sum_assignment, directly on rectangular grids and through
``solve`` (which hands the square problem to scipy) where incompatible pairs, wait
penalties and must-run jobs are involved. Small integer values make ties common, so the
check is on totals: the warm plan may differ from scipy's among equally cheap plans.
Where the cold solve says a draw is infeasible, ``helpers_reference.scipy_reference`` (a
rectangular encoding built in the helper, solved by scipy) must agree.
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from scipy.optimize import linear_sum_assignment

from dispatcher.engine import DispatchInputError, InfeasibleError, redispatch, solve
from helpers_reference import scipy_reference

SETTINGS = settings(max_examples=120, deadline=None,
                    suppress_health_check=[HealthCheck.too_slow])


@st.composite
def problems(draw, max_side=6):
    n_jobs = draw(st.integers(0, max_side))
    n_machines = draw(st.integers(0, max_side))
    seed = draw(st.integers(0, 2**32 - 1))
    rng = np.random.default_rng(seed)
    values = rng.integers(0, 5, (n_jobs, n_machines)).astype(float)
    allowed = rng.random((n_jobs, n_machines)) < draw(st.sampled_from([1.0, 0.8, 0.5]))
    penalty = rng.integers(0, 6, n_jobs).astype(float)
    must = rng.random(n_jobs) < draw(st.sampled_from([0.0, 0.25]))
    objective = draw(st.sampled_from(["total", "maximize"]))
    return values, allowed, penalty, must, objective, rng


def cold(values, allowed, penalty, must, objective):
    try:
        return solve(values, allowed, wait_penalty=penalty, must_run=must, objective=objective)
    except InfeasibleError:
        return None


def apply_event(kind, prev, values, allowed, penalty, must, rng):
    """The same event twice: as keyword arguments for redispatch, and as the modified grid."""
    n_jobs, n_machines = values.shape
    v, a, p, m = values.copy(), allowed.copy(), penalty.copy(), must.copy()
    if kind == "down" and n_machines:
        j = int(rng.integers(n_machines))
        a[:, j] = False
        return {"machines_down": [j]}, (v, a, p, m)
    if kind == "up" and n_machines:
        j = int(rng.integers(n_machines))
        col = rng.integers(0, 5, n_jobs).astype(float)
        ok = rng.random(n_jobs) < 0.8
        v[:, j], a[:, j] = col, ok
        return {"machines_up": {j: (col, ok)}}, (v, a, p, m)
    if kind == "add":
        r = int(rng.integers(1, 3))
        nv = rng.integers(0, 5, (r, n_machines)).astype(float)
        na = rng.random((r, n_machines)) < 0.8
        npen = rng.integers(0, 6, r).astype(float)
        nmust = rng.random(r) < 0.5
        kw = {"new_jobs": nv, "new_allowed": na, "new_wait_penalty": npen, "new_must_run": nmust}
        return kw, (np.vstack([v, nv]), np.vstack([a, na]), np.r_[p, npen], np.r_[m, nmust])
    if kind == "remove" and n_jobs:
        gone = rng.choice(n_jobs, int(rng.integers(1, n_jobs + 1)), replace=False)
        keep = np.setdiff1d(np.arange(n_jobs), gone)
        return {"jobs_removed": gone.tolist()}, (v[keep], a[keep], p[keep], m[keep])
    if kind == "move" and prev.objective == "total":
        move = rng.integers(0, 4, n_jobs).astype(float)
        for i, machine in enumerate(prev.machine_of_job):
            if machine >= 0:
                v[i] += move[i]
                v[i, machine] -= move[i]
                p[i] += move[i]
        return {"move_penalty": move}, (v, a, p, m)
    return None


@SETTINGS
@given(problems(), st.sampled_from(["down", "up", "add", "remove", "move"]))
def test_warm_equals_cold_after_one_event(problem, kind):
    values, allowed, penalty, must, objective, rng = problem
    prev = cold(values, allowed, penalty, must, objective)
    if prev is None:
        assert not scipy_reference(values, allowed, penalty, must).feasible
        return
    event = apply_event(kind, prev, values, allowed, penalty, must, rng)
    if event is None:
        return
    kw, modified = event
    ref = cold(*modified, objective)  # scipy through solve()
    if ref is None:
        assert not scipy_reference(*modified).feasible
        with pytest.raises(InfeasibleError):
            redispatch(prev, **kw)
        return
    warm = redispatch(prev, **kw)
    assert warm.certificate.verify()
    assert warm.verify()
    assert warm.total == pytest.approx(ref.total)
    assert warm.planned_count == ref.planned_count
    assert warm.values.shape == ref.values.shape


@settings(max_examples=40, deadline=None)
@given(problems(), st.lists(st.sampled_from(["down", "up", "add", "remove", "move"]),
                            min_size=2, max_size=5))
def test_warm_stays_exact_over_a_chain_of_events(problem, kinds):
    values, allowed, penalty, must, objective, rng = problem
    current = cold(values, allowed, penalty, must, objective)
    if current is None:
        assert not scipy_reference(values, allowed, penalty, must).feasible
        return
    state = (values, allowed, penalty, must)
    for kind in kinds:
        event = apply_event(kind, current, current.values, current.allowed,
                            current.wait_penalty, current.must_run, rng)
        if event is None:
            continue
        kw, state = event
        ref = cold(*state, objective)
        if ref is None:
            assert not scipy_reference(*state).feasible
            with pytest.raises(InfeasibleError):
                redispatch(current, **kw)
            return
        current = redispatch(current, **kw)
        assert current.verify()
        assert current.total == pytest.approx(ref.total)


@pytest.mark.parametrize("shape", [(40, 40), (30, 45), (45, 30)])
def test_machine_down_matches_scipy_directly(shape):
    # Reference: scipy's rectangular linear_sum_assignment on the grid without the column.
    rng = np.random.default_rng(sum(shape))
    values = rng.random(shape) * 100
    prev = solve(values)
    for machine in rng.choice(shape[1], 5, replace=False):
        warm = redispatch(prev, machines_down=[int(machine)])
        rest = np.delete(values, machine, axis=1)
        rows, cols = linear_sum_assignment(rest)
        assert warm.verify()
        assert warm.total == pytest.approx(rest[rows, cols].sum(), rel=1e-12)
        assert warm.planned_count == len(rows)
        assert machine in warm.idle_machines


def test_rush_job_displaces_the_job_with_least_to_lose():
    # 2 machines, 2 jobs placed; a must-run job arrives: the job whose waiting costs least waits.
    values = np.array([[1.0, 9.0], [9.0, 1.0]])
    prev = solve(values, wait_penalty=[5.0, 50.0])
    warm = redispatch(prev, new_jobs=[[2.0, 2.0]], new_wait_penalty=[0.0], new_must_run=[True])
    assert warm.verify()
    assert warm.machine_of_job.tolist() == [-1, 1, 0]
    assert warm.total == 1 + 2 + 5  # by hand: beats 1 + 2 + 50 (job 1 waiting instead)


def test_move_penalty_keeps_jobs_where_moving_does_not_pay():
    values = np.array([[5.0, 4.0], [5.0, 9.0]])
    prev = solve(values, allowed=np.array([[True, False], [True, True]]))
    assert prev.machine_of_job.tolist() == [0, 1]
    # Machine 1 comes back to job 0 at 4 (1 cheaper than its machine 0) but moving costs 3.
    back = {0: (np.array([5.0, 5.0]), np.array([True, True])),
            1: (np.array([4.0, 9.0]), np.array([True, True]))}
    warm = redispatch(prev, machines_up=back, move_penalty=[3.0, 3.0])
    assert warm.machine_of_job.tolist() == [0, 1]
    without = redispatch(prev, machines_up=back)
    assert without.machine_of_job.tolist() == [1, 0]  # 4 + 5 = 9 < 5 + 9 = 14


@pytest.mark.parametrize("kwargs, message", [
    ({"machines_down": [7]}, "machine 7 is outside 0..2"),
    ({"jobs_removed": [-1]}, "jobs_removed names a job outside 0..1"),
    ({"move_penalty": [1.0]}, "move_penalty needs 2 numbers >= 0"),
    ({"move_penalty": [1.0, -1.0]}, "move_penalty needs 2 numbers >= 0"),
    ({"new_jobs": [[1.0, 2.0]]}, "new jobs have 2 machine values, the plan has 3 machines"),
    ({"machines_down": [0], "machines_up": {0: ([1, 1], [True, True])}},
     "cannot go down and come up"),
    ({"machines_up": {1: ([1, -1], [True, True])}}, "values must be finite and >= 0"),
])
def test_bad_events_are_refused_with_a_clear_message(kwargs, message):
    prev = solve(np.arange(6.0).reshape(2, 3))
    with pytest.raises(DispatchInputError, match=message):
        redispatch(prev, **kwargs)


def test_bottleneck_plans_are_re_solved_and_match_cold():
    rng = np.random.default_rng(7)
    values = rng.integers(0, 9, (6, 5)).astype(float)
    prev = solve(values, objective="bottleneck")
    machine = int(prev.machine_of_job[prev.machine_of_job >= 0][0])
    warm = redispatch(prev, machines_down=[machine])
    mask = np.ones_like(values, dtype=bool)
    mask[:, machine] = False
    ref = solve(values, mask, objective="bottleneck")
    assert warm.verify()
    assert (warm.bottleneck, warm.total) == (ref.bottleneck, ref.total)


def test_warm_path_never_calls_the_cold_solver(monkeypatch):
    # The re-dispatch must repair the previous plan, not quietly solve from scratch.
    rng = np.random.default_rng(12)
    values = rng.integers(0, 50, (30, 25)).astype(float)
    prev = solve(values, rng.random((30, 25)) < 0.8, wait_penalty=rng.integers(0, 9, 30))
    import dispatcher.engine.assignment as assignment

    def refuse(*args, **kwargs):
        raise AssertionError("cold solve called during a warm re-dispatch")

    monkeypatch.setattr(assignment, "linear_sum_assignment", refuse)
    busy = int(prev.machine_of_job[prev.machine_of_job >= 0][0])
    warm = redispatch(prev, machines_down=[busy], jobs_removed=[1],
                      new_jobs=rng.integers(0, 50, (2, 25)).astype(float))
    assert warm.verify()
