"""Input validation of :func:`dispatcher.engine.solve` and degenerate shapes.

Each refusal has its own message, checked with ``pytest.raises(match=...)``. Degenerate
shapes are checked against what the definition says by hand (no jobs: nothing to plan; no
machines: every job waits) and against brute-force enumeration.
"""

from __future__ import annotations

import numpy as np
import pytest

from dispatcher.engine import MAX_CELLS, DispatchInputError, InfeasibleError, solve
from helpers_reference import brute_force, check_result

OBJECTIVES = ("total", "maximize", "bottleneck")


@pytest.mark.parametrize("kwargs, message", [
    (dict(costs=[["a", "b"]]), r"costs must be numbers"),
    (dict(costs=[[1, 2], [3]]), r"costs must be numbers"),
    (dict(costs=[1.0, 2.0]), r"costs must be a 2-D grid \(jobs x machines\), got 1-D"),
    (dict(costs=np.zeros((2, 2, 2))), r"got 3-D"),
    (dict(costs=5.0), r"got 0-D"),
    (dict(costs=np.zeros((2, 3)), allowed=np.ones((3, 2), bool)),
     r"allowed mask has shape \(3, 2\), costs have shape \(2, 3\)"),
    (dict(costs=np.zeros((2, 2)), allowed=np.ones((2, 2), dtype=int)), r"allowed mask must be boolean"),
    (dict(costs=[[1.0, np.nan]]), r"value at job 0, machine 1 is nan: values must be finite"),
    (dict(costs=[[1.0], [np.inf]]), r"value at job 1, machine 0 is inf: values must be finite"),
    (dict(costs=[[1.0, -np.inf]]), r"is -inf: values must be finite"),
    (dict(costs=[[1.0, -2.0]]), r"value at job 0, machine 1 is -2.0: values must be >= 0"),
    (dict(costs=np.zeros((2, 2)), wait_penalty=[1.0]), r"wait_penalty needs 2 entries, got 1"),
    (dict(costs=np.zeros((2, 2)), wait_penalty=[1.0, -1.0]), r"wait penalties must be finite numbers >= 0"),
    (dict(costs=np.zeros((2, 2)), wait_penalty=[1.0, np.nan]), r"wait penalties must be finite numbers >= 0"),
    (dict(costs=np.zeros((2, 2)), wait_penalty=[np.inf, 1.0]), r"wait penalties must be finite numbers >= 0"),
    (dict(costs=np.zeros((2, 2)), must_run=[True, False, True]), r"must_run mask needs 2 entries, got 3"),
    (dict(costs=np.zeros((2, 2)), must_run=[2]), r"must_run names a job outside 0\.\.1"),
    (dict(costs=np.zeros((2, 2)), must_run=[-1]), r"must_run names a job outside 0\.\.1"),
    (dict(costs=np.zeros((2, 2)), objective="fastest"),
     r"objective must be one of total, maximize, bottleneck, got 'fastest'"),
    (dict(costs=np.zeros((2, 2)), maximize=True, objective="bottleneck"),
     r"maximize=True conflicts with objective='bottleneck'"),
])
def test_bad_input_messages(kwargs, message):
    kwargs = dict(kwargs)  # the parameter table is shared by every run of the test
    costs = kwargs.pop("costs")
    with pytest.raises(DispatchInputError, match=message):
        solve(costs, **kwargs)


def test_grid_over_the_cell_limit_is_refused_before_any_work():
    # A broadcast view takes no memory; the limit must be checked before anything is built.
    side = int(MAX_CELLS ** 0.5) + 1
    huge = np.broadcast_to(np.zeros(1), (side, side))
    with pytest.raises(DispatchInputError, match=rf"grid of {side} x {side} exceeds the limit of {MAX_CELLS} cells"):
        solve(huge)


def test_invalid_values_in_incompatible_cells_are_ignored():
    # Cells marked incompatible carry no value: NaN, inf or negatives there are not errors.
    costs = np.array([[np.nan, 3.0], [2.0, -5.0], [np.inf, 1.0]])
    allowed = np.array([[False, True], [True, False], [False, True]])
    result = solve(costs, allowed)
    assert result.verify()
    check_result(result, np.nan_to_num(costs, nan=0, posinf=0, neginf=0).clip(0), allowed)
    # Brute force by hand: jobs 0 and 2 both want machine 1 (3 vs 1); job 1 takes machine 0.
    assert result.machine_of_job.tolist() == [-1, 0, 1]
    assert result.total == 3.0


def test_input_arrays_are_not_modified():
    costs = np.array([[1.0, np.nan], [2.0, 3.0]])
    allowed = np.array([[True, False], [True, True]])
    penalty = np.array([4.0, 5.0])
    copies = costs.copy(), allowed.copy(), penalty.copy()
    assert solve(costs, allowed, wait_penalty=penalty, must_run=[0]).verify()
    np.testing.assert_array_equal(costs, copies[0])
    np.testing.assert_array_equal(allowed, copies[1])
    np.testing.assert_array_equal(penalty, copies[2])


@pytest.mark.parametrize("objective", OBJECTIVES)
@pytest.mark.parametrize("shape", [(0, 0), (2, 0), (0, 3), (1, 1), (1, 5), (5, 1), (1, 0), (0, 1)])
def test_degenerate_shapes(shape, objective):
    # By the definition: no jobs -> empty plan; no machines -> every job waits and the total
    # is the sum of the wait penalties (negated when maximising); cross-checked by brute force.
    m, n = shape
    rng = np.random.default_rng(m * 7 + n)
    costs = rng.integers(1, 9, size=shape).astype(float)
    penalty = np.arange(1, m + 1, dtype=float)
    result = solve(costs, objective=objective, wait_penalty=penalty)
    assert result.verify()
    check_result(result, costs, None, penalty)
    assert result.machine_of_job.shape == (m,)
    assert result.job_potential.shape == (m,) and result.machine_potential.shape == (n,)
    assert result.planned_count == min(m, n)
    assert len(result.idle_machines) == n - min(m, n)
    assert result.total == pytest.approx(brute_force(costs, None, penalty, None, objective).total)
    if n == 0:
        assert result.total == (-penalty.sum() if objective == "maximize" else penalty.sum())
        assert result.witness() is None if m == 0 else result.witness().deficiency == m


@pytest.mark.parametrize("shape", [(3, 0), (1, 0)])
def test_must_run_with_no_machines_is_infeasible(shape):
    with pytest.raises(InfeasibleError, match=r"1 must-run jobs can use only 0 machines") as info:
        solve(np.zeros(shape), must_run=[0])
    assert info.value.witness.jobs.tolist() == [0]
    assert info.value.witness.machines.size == 0


def test_no_allowed_pair_at_all():
    # Every job waits; the only Hall witness is all jobs with no machine (Hall 1935).
    allowed = np.zeros((3, 4), dtype=bool)
    for objective in OBJECTIVES:
        result = solve(np.ones((3, 4)), allowed, objective=objective, wait_penalty=[1, 2, 3])
        assert result.verify()
        assert result.machine_of_job.tolist() == [-1, -1, -1]
        assert result.bottleneck is None
        assert result.total == (-6 if objective == "maximize" else 6)
        assert result.wait_reason(1).machines.size == 0


@pytest.mark.parametrize("must_run", [[0, 2], np.array([True, False, True]), (0, 2), np.array([0, 2, 2])])
def test_must_run_accepts_indices_or_mask(must_run):
    # Three jobs, one machine: with jobs 0 and 2 both must-run it is infeasible (Hall 1935).
    with pytest.raises(InfeasibleError):
        solve(np.ones((3, 1)), must_run=must_run)


def test_list_input_and_integer_dtype():
    # Reference: brute force by hand, 2 x 2: the anti-diagonal costs 2 + 3 = 5 < 1 + 9.
    result = solve([[1, 2], [3, 9]])
    assert result.verify()
    assert result.machine_of_job.dtype.kind == "i"
    assert result.machine_of_job.tolist() == [1, 0]
    assert isinstance(result.total, float) and result.total == 5.0


@pytest.mark.parametrize(("costs", "allowed", "penalty", "words"), [
    ([["a", "1"]], None, None,
     "costs must be numbers, got list: could not convert string to float: 'a'"),
    ([[1.0, np.inf]], None, None,
     "value at job 0, machine 1 is inf: values must be finite (mark incompatible pairs in "
     "the allowed mask)"),
    ([[0.0, 0.5, -1.0]], None, None, "value at job 0, machine 2 is -1.0: values must be >= 0"),
    ([[1.0], [2.0]], None, [1.0, -0.5], "wait penalties must be finite numbers >= 0"),
])
def test_bad_input_is_named_in_full(costs, allowed, penalty, words):
    # The cell named is the first offending one in reading order (job, then machine).
    with pytest.raises(DispatchInputError) as info:
        solve(costs, allowed, wait_penalty=penalty)
    assert str(info.value) == words
