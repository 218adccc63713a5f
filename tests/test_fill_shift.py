"""Fill-the-shift engine (generalised assignment) against references outside the project.

* OR-Library (Beasley 1990), gap1..gap8, five sets each: the published optima listed in
  the data folder's README must be reached and proven.
* Brute-force enumeration of every plan on tiny instances (:func:`brute_force_fill_shift`,
  the reference), applying the definition in dispatcher/engine/fill_shift.py word for word.
* With one job's worth of hours per machine the problem is the one-to-one assignment
  problem; the plan must agree with scipy's linear_sum_assignment through
  dispatcher.engine.solve (itself checked against scipy and networkx elsewhere).
"""

from __future__ import annotations

import itertools
import re
from functools import lru_cache
from pathlib import Path

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from dispatcher.engine import (
    DispatchInputError,
    ShiftInfeasibleError,
    ShiftPlan,
    fill_shift,
    solve,
)
from dispatcher.engine.fill_shift import run_order

GAP_FILES = [f"gap{k}.txt" for k in range(1, 9)]


@lru_cache(maxsize=None)
def read_gap_file(path: Path) -> tuple[tuple[np.ndarray, np.ndarray, np.ndarray], ...]:
    """OR-Library GAP format: P; per set m, n, profits (m x n), resources (m x n), capacities.

    Returned per set as (values jobs x machines, hours jobs x machines, capacity).
    """
    tokens = np.array(path.read_text().split(), dtype=float)
    sets, k = [], 1
    for _ in range(int(tokens[0])):
        m, n = int(tokens[k]), int(tokens[k + 1])
        k += 2
        profit = tokens[k:k + m * n].reshape(m, n)
        k += m * n
        resource = tokens[k:k + m * n].reshape(m, n)
        k += m * n
        capacity = tokens[k:k + m]
        k += m
        sets.append((profit.T.copy(), resource.T.copy(), capacity.copy()))
    assert k == tokens.size, f"{path.name}: {tokens.size - k} numbers left over"
    return tuple(sets)


@lru_cache(maxsize=None)
def published_gap_optima(readme: Path) -> dict[str, list[int]]:
    """The table of published optima (maximisation) from the OR-Library folder's README."""
    rows = re.findall(r"^\|\s*(gap\d\.txt)\s*\|[^|]*\|([\d\s]+)\|\s*$", readme.read_text(), re.M)
    return {name: [int(v) for v in optima.split()] for name, optima in rows}


@pytest.mark.parametrize("set_index", range(5))
@pytest.mark.parametrize("name", GAP_FILES)
def test_or_library_gap_published_optimum(or_library, name, set_index):
    # Reference: OR-Library (Beasley 1990), published optimum of each GAP set (maximisation,
    # every job assigned), as listed in or-library/README.md.
    optima = published_gap_optima(or_library / "README.md")
    assert sorted(optima) == GAP_FILES and all(len(v) == 5 for v in optima.values())
    sets = read_gap_file(or_library / "generalised-assignment" / name)
    assert len(sets) == 5
    values, hours, capacity = sets[set_index]
    plan = fill_shift(values, hours, capacity, maximize=True, all_jobs=True, time_limit=60)
    assert plan.proven_optimal, plan.status_text
    assert plan.total == optima[name][set_index]
    assert (plan.machine_of_job >= 0).all()
    assert (plan.hours_used <= capacity).all()
    assert plan.verify()


def brute_force_fill_shift(values, hours, capacity, allowed, penalty, must, pinned, *,
                           maximize, most_jobs_first):
    """Reference: enumerate every plan ((machines + 1) ** jobs of them) and keep the best.

    Returns (best total, number of jobs run) or None when no plan is feasible.
    """
    n_jobs, n_machines = values.shape
    best = None
    for choice in itertools.product(range(-1, n_machines), repeat=n_jobs):
        mj = np.array(choice)
        placed = mj >= 0
        if (must & ~placed).any() or ((pinned >= 0) & (mj != pinned)).any():
            continue
        rows = np.flatnonzero(placed)
        if not allowed[rows, mj[placed]].all():
            continue
        used = np.zeros(n_machines)
        np.add.at(used, mj[placed], hours[rows, mj[placed]])
        if (used > capacity).any():
            continue
        planned = values[rows, mj[placed]].sum()
        total = planned - penalty[~placed].sum() if maximize else planned + penalty[~placed].sum()
        score = -total if maximize else total
        key = (-int(placed.sum()) if most_jobs_first else 0, score)
        if best is None or key < best[0]:
            best = (key, total, int(placed.sum()))
    return None if best is None else (best[1], best[2])


def random_instance(rng, n_jobs, n_machines):
    values = rng.integers(0, 20, (n_jobs, n_machines)).astype(float)
    hours = rng.integers(1, 6, (n_jobs, n_machines)).astype(float)
    capacity = rng.integers(0, 10, n_machines).astype(float)
    allowed = rng.random((n_jobs, n_machines)) < 0.8
    penalty = rng.integers(0, 15, n_jobs).astype(float)
    must = rng.random(n_jobs) < 0.25
    pinned = np.full(n_jobs, -1)
    if rng.random() < 0.3:
        i, j = rng.integers(n_jobs), rng.integers(n_machines)
        if allowed[i, j]:
            pinned[i] = j
    return values, hours, capacity, allowed, penalty, must, pinned


@pytest.mark.parametrize("most_jobs_first", [True, False])
@pytest.mark.parametrize("maximize", [False, True])
def test_against_brute_force_enumeration(maximize, most_jobs_first):
    rng = np.random.default_rng(20261202 + 2 * maximize + most_jobs_first)
    solved = infeasible = 0
    for _ in range(60):
        n_jobs, n_machines = int(rng.integers(1, 6)), int(rng.integers(1, 4))
        values, hours, capacity, allowed, penalty, must, pinned = random_instance(
            rng, n_jobs, n_machines)
        # Reference: brute-force enumeration of every plan.
        expected = brute_force_fill_shift(values, hours, capacity, allowed, penalty, must,
                                          pinned, maximize=maximize,
                                          most_jobs_first=most_jobs_first)
        pins = {(int(i), int(pinned[i])): True for i in np.flatnonzero(pinned >= 0)}
        kwargs = dict(allowed=allowed, maximize=maximize, wait_penalty=penalty, must_run=must,
                      pins=pins, most_jobs_first=most_jobs_first)
        if expected is None:
            with pytest.raises(ShiftInfeasibleError, match="must-run|pinned"):
                fill_shift(values, hours, capacity, **kwargs)
            infeasible += 1
            continue
        plan = fill_shift(values, hours, capacity, **kwargs)
        assert plan.proven_optimal and plan.verify()
        assert plan.total == pytest.approx(expected[0])
        if most_jobs_first:
            assert plan.planned_count == expected[1]
        solved += 1
    # Both kinds of instance must occur, or the loop tests less than it claims.
    assert solved >= 20 and infeasible >= 3


@settings(max_examples=40, deadline=None)
@given(data=st.data(), n_jobs=st.integers(0, 6), n_machines=st.integers(0, 6),
       maximize=st.booleans())
def test_one_job_per_machine_agrees_with_one_to_one_engine(data, n_jobs, n_machines, maximize):
    values = np.array(data.draw(st.lists(st.integers(0, 30), min_size=n_jobs * n_machines,
                                         max_size=n_jobs * n_machines)),
                      dtype=float).reshape(n_jobs, n_machines)
    allowed = np.array(data.draw(st.lists(st.booleans(), min_size=n_jobs * n_machines,
                                          max_size=n_jobs * n_machines)),
                       dtype=bool).reshape(n_jobs, n_machines)
    penalty = np.array(data.draw(st.lists(st.integers(0, 40), min_size=n_jobs,
                                          max_size=n_jobs)), dtype=float)
    ones = np.ones((n_jobs, n_machines))
    plan = fill_shift(values, ones, np.ones(n_machines), allowed=allowed, maximize=maximize,
                      wait_penalty=penalty)
    # Reference: dispatcher.engine.solve (scipy linear_sum_assignment with a checked
    # dual certificate) on the same grid.
    one = solve(values, allowed, maximize=maximize, wait_penalty=penalty)
    assert one.verify() and plan.verify() and plan.proven_optimal
    assert plan.total == pytest.approx(one.total)
    assert plan.planned_count == one.planned_count
    assert all(len(jobs) <= 1 for jobs in plan.jobs_on_machine)


def test_several_jobs_share_a_machine_and_run_in_order():
    values = np.array([[3, 9], [4, 8], [5, 1], [2, 7]], dtype=float)
    hours = np.array([[2, 4], [2, 4], [2, 4], [2, 4]], dtype=float)
    plan = fill_shift(values, hours, [6, 4], rush=[1], due=[5.0, np.nan, 9.0, 1.0])
    # Three jobs of 2 h fit on machine 0 (6 h), one of 4 h on machine 1: 4 jobs run.
    assert plan.planned_count == 4
    assert plan.total == 2 + 3 + 4 + 1
    assert plan.jobs_on_machine[0].tolist() == [1, 3, 0]  # rush, then due 1.0, then 5.0
    assert plan.jobs_on_machine[1].tolist() == [2]
    assert plan.hours_used.tolist() == [6.0, 4.0]


def test_run_order_rush_first_then_due_then_input_order():
    rush = np.array([False, True, False, True, False])
    due = np.array([3.0, 8.0, np.nan, 2.0, 3.0])
    assert run_order(np.arange(5), rush, due).tolist() == [3, 1, 0, 4, 2]


def test_wait_penalty_decides_who_waits():
    # One machine, 4 h: either job A (3 h, setup 5) or job B (3 h, setup 1) runs.
    values, hours = np.array([[5.0], [1.0]]), np.array([[3.0], [3.0]])
    assert fill_shift(values, hours, [4]).machine_of_job.tolist() == [-1, 0]
    plan = fill_shift(values, hours, [4], wait_penalty=[10, 0])
    assert plan.machine_of_job.tolist() == [0, -1] and plan.total == 5
    # Without the most-jobs rule nothing needs to run when waiting costs nothing.
    idle = fill_shift(values, hours, [4], most_jobs_first=False)
    assert idle.planned_count == 0 and idle.total == 0


def test_pins_force_and_forbid():
    values = np.array([[1.0, 9.0], [1.0, 9.0]])
    hours = np.ones((2, 2))
    plan = fill_shift(values, hours, [2, 2], pins={(0, 1): True, (1, 0): False})
    assert plan.machine_of_job.tolist() == [1, 1] and plan.verify()


def test_one_hours_per_job_and_machine_factor():
    plan = fill_shift(np.zeros((3, 2)), [2.0, 2.0, 2.0], [4, 4], machine_factor=[1.0, 2.0])
    # Machine 1 is half as fast: 4 h there, so 2 jobs on machine 0 and 1 on machine 1.
    assert plan.planned_count == 3
    assert sorted(plan.hours_used.tolist()) == [4.0, 4.0]


@pytest.mark.parametrize("shape", [(0, 0), (2, 0), (0, 3)])
def test_degenerate_shapes(shape):
    plan = fill_shift(np.zeros(shape), np.zeros(shape), np.zeros(shape[1]),
                      wait_penalty=np.full(shape[0], 2.0))
    assert plan.proven_optimal and plan.total == 2.0 * shape[0]
    assert plan.waiting_jobs.tolist() == list(range(shape[0]))


@pytest.mark.parametrize("kwargs, hours, capacity, message", [
    (dict(must_run=[0]), [[5.0, 6.0], [1.0, 1.0]], [4, 4],
     r"must-run job 0 fits on no machine: it needs at least 5 hours"),
    (dict(must_run=[0], allowed=np.array([[False, False], [True, True]])),
     [[1.0, 1.0], [1.0, 1.0]], [4, 4], r"must-run job 0 fits on no machine: no machine can run it"),
    (dict(pins={(0, 0): True, (1, 0): True}), [[3.0, 1.0], [3.0, 1.0]], [4, 4],
     r"jobs 0, 1 are pinned to machine 0: they need 6 hours, the machine has 4"),
    # Machine 1 (1 h) fits neither job: 6 h needed on machine 0's 4 h.
    (dict(all_jobs=True), [[3.0, 2.0], [3.0, 2.0]], [4, 1],
     r"must-run jobs need at least 6 hours .* their machines have 4 hours in total"),
])
def test_infeasible_instances_explain_why(kwargs, hours, capacity, message):
    with pytest.raises(ShiftInfeasibleError, match=message):
        fill_shift(np.zeros((2, 2)), hours, capacity, **kwargs)


def test_infeasible_proven_by_the_solver_names_the_jobs():
    # Three must-run jobs of 2 h, two machines of 3 h: 6 h needed and 6 h available, yet
    # each machine fits only one job (a fact checked by enumeration below).
    hours = np.full((3, 2), 2.0)
    assert brute_force_fill_shift(np.zeros((3, 2)), hours, np.array([3.0, 3.0]),
                                  np.ones((3, 2), bool), np.zeros(3), np.ones(3, bool),
                                  np.full(3, -1), maximize=False, most_jobs_first=True) is None
    with pytest.raises(ShiftInfeasibleError, match=r"must-run jobs 0, 1, 2 cannot all fit") as err:
        fill_shift(np.zeros((3, 2)), hours, [3, 3], all_jobs=True)
    assert err.value.jobs.tolist() == [0, 1, 2] and err.value.machines.tolist() == [0, 1]


@pytest.mark.parametrize("args, kwargs, message", [
    (([[1, 2]], [[1, 2, 3]], [1, 1]), {}, r"hours have shape \(1, 3\); expected \(1, 2\)"),
    (([[1, 2]], [[1, -2]], [1, 1]), {}, r"hours at job 0, machine 1 is -2.0"),
    (([[1, 2]], [[1, np.nan]], [1, 1]), {}, r"hours at job 0, machine 1 is nan"),
    (([[1, 2]], [[1, 2]], [1, 1, 1]), {}, r"capacity needs 2 entries"),
    (([[1, 2]], [[1, 2]], [1, -1]), {}, r"capacity of machine 1 is -1.0"),
    (([[1, 2]], [[1, 2]], [1, 1]), {"time_limit": 0}, r"time_limit must be a number of seconds"),
    (([[1, 2]], [[1, 2]], [1, 1]), {"pins": {(0, 0): True, (0, 1): True}},
     r"job 0 is pinned to two machines"),
    (([[1, 2]], [[1, 2]], [1, 1]), {"pins": {(0, 5): True}}, r"pin \(0, 5\) is outside"),
    (([[1, 2]], [[1, 2]], [1, 1]), {"pins": [(0, 1)]}, r"pins must map"),
    (([[1, 2]], [[1, 2]], [1, 1]), {"machine_factor": [1, 0]}, r"machine_factor needs 2"),
    (([[1, 2]], [[1, 2]], [1, 1]), {"due": [1, 2]}, r"due needs 1 entries"),
])
def test_bad_input_messages(args, kwargs, message):
    with pytest.raises(DispatchInputError, match=message):
        fill_shift(*args, **kwargs)


def test_time_limit_gives_a_checked_plan_and_states_what_is_proven():
    rng = np.random.default_rng(7)
    values = rng.integers(10, 50, (300, 15)).astype(float)
    hours = rng.integers(5, 25, (300, 15)).astype(float)
    capacity = np.full(15, hours.mean() * 300 / 15 * 0.8)
    plan = fill_shift(values, hours, capacity, maximize=True, time_limit=0.5)
    assert isinstance(plan, ShiftPlan) and plan.verify()
    # The machines have 80% of the mean job's hours times the jobs: at least half of the
    # jobs fit (the greedy floor alone runs the shortest first), whatever the solver reached.
    assert plan.planned_count >= 150
    assert plan.bound >= plan.total  # an upper bound when maximising
    if plan.proven_optimal:
        assert plan.status == "optimal" and plan.gap == 0
    else:
        assert plan.status == "time_limit" and "proven gap" in plan.status_text


def test_progress_reports_stages_and_cancel_stops_before_solving():
    import threading

    from dispatcher.engine.fill_shift import ShiftCancelled

    seen: list[str] = []
    fill_shift([[1.0, 2.0], [3.0, 4.0]], np.ones((2, 2)), [1, 1], progress=seen.append)
    assert seen == ["stage 1 of 2: the most jobs that fit", "stage 2 of 2: the best total"]
    stop = threading.Event()
    stop.set()
    with pytest.raises(ShiftCancelled):
        fill_shift([[1.0, 2.0], [3.0, 4.0]], np.ones((2, 2)), [1, 1], cancel=stop)
    # Cancelled while stage 1 runs: stage 2 never starts.
    later, stages = threading.Event(), []
    with pytest.raises(ShiftCancelled):
        fill_shift([[1.0, 2.0], [3.0, 4.0]], np.ones((2, 2)), [1, 1], cancel=later,
                   progress=lambda text: (stages.append(text), later.set()))
    assert stages == ["stage 1 of 2: the most jobs that fit"]


def test_greedy_floor_is_feasible_or_none():
    from dispatcher.engine.fill_shift import _greedy

    rng = np.random.default_rng(11)
    for _ in range(200):
        n_jobs, n_machines = int(rng.integers(1, 7)), int(rng.integers(1, 4))
        values, hours, capacity, allowed, penalty, must, _ = random_instance(rng, n_jobs, n_machines)
        usable = allowed & (hours <= capacity)
        jobs, machines = np.nonzero(usable)
        x = _greedy(jobs, machines, hours[usable], capacity, values[usable], must,
                    np.zeros(jobs.size), True)
        if x is None:
            continue
        # Checked directly: each job at most once, hours within capacity, must-run placed.
        assert (np.bincount(jobs, weights=x, minlength=n_jobs) <= 1).all()
        assert (np.bincount(machines, weights=x * hours[usable], minlength=n_machines)
                <= capacity + 1e-9).all()
        assert (np.bincount(jobs, weights=x, minlength=n_jobs)[must] == 1).all()
