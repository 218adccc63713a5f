"""Ranked plans on machines that take several jobs, against brute-force enumeration.

A machine with capacity c is c identical slot columns of the engine problem. Reference:
every plan over (job, machine) choices enumerated by brute force here (each job takes an
allowed machine with a slot left, or waits; kept when it places the maximum number of
jobs and every must-run job), one entry per set of (job, machine) pairs, sorted by total.
The engine's ranking, given which columns belong to which machine, must list the same
totals and never two plans that differ only in slots.
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from dispatcher.engine import InfeasibleError, ranked_plans, solve


def plans_by_machine(values, allowed, capacity, penalty, must, objective):
    """{frozenset of (job, machine): total} for every plan, by brute force over machines."""
    n_jobs, n_machines = values.shape
    found = []

    def extend(job, left, chosen):
        if job == n_jobs:
            found.append(tuple(chosen))
            return
        if not must[job]:
            extend(job + 1, left, chosen + [-1])
        for m in range(n_machines):
            if allowed[job, m] and left[m] > 0:
                extend(job + 1, left[:m] + (left[m] - 1,) + left[m + 1:], chosen + [m])

    extend(0, tuple(capacity), [])
    if not found:
        return {}
    most = max(sum(m >= 0 for m in p) for p in found)
    out = {}
    for plan in found:
        if sum(m >= 0 for m in plan) != most:
            continue
        placed = sum(values[j, m] for j, m in enumerate(plan) if m >= 0)
        waiting = sum(penalty[j] for j, m in enumerate(plan) if m < 0)
        out[frozenset((j, m) for j, m in enumerate(plan) if m >= 0)] = (
            placed - waiting if objective == "maximize" else placed + waiting)
    return out


def slot_problem(values, allowed, capacity):
    """The engine's columns: machine m repeated capacity[m] times (as the shop builds them)."""
    groups = np.repeat(np.arange(len(capacity)), capacity)
    return values[:, groups], allowed[:, groups], groups


def check_ranked(values, allowed, capacity, penalty, must, objective, count):
    reference = plans_by_machine(values, allowed, capacity, penalty, must, objective)
    cols_values, cols_allowed, groups = slot_problem(values, allowed, capacity)
    try:
        base = solve(cols_values, cols_allowed, wait_penalty=penalty, must_run=must,
                     objective=objective)
    except InfeasibleError:
        assert reference == {}, "brute force finds a plan placing every must-run job"
        return []
    plans = ranked_plans(base, count, groups=groups)
    best_first = sorted(reference.values(), reverse=objective == "maximize")
    assert [p.total for p in plans] == pytest.approx(best_first[:count])
    assert plans[0].machine_of_job.tolist() == base.machine_of_job.tolist()
    seen = set()
    for plan in plans:
        cols = plan.machine_of_job
        assert len(set(cols[cols >= 0].tolist())) == int((cols >= 0).sum())  # one job a slot
        pairs = frozenset((j, int(groups[c])) for j, c in enumerate(cols.tolist()) if c >= 0)
        assert pairs not in seen, "two ranked plans differ only in slots"
        seen.add(pairs)
        assert reference[pairs] == pytest.approx(plan.total)
    return plans


@settings(max_examples=80, deadline=None)
@given(st.integers(0, 7), st.lists(st.sampled_from([1, 2, 3]), min_size=1, max_size=3),
       st.integers(0, 2**32 - 1), st.sampled_from([1.0, 0.7, 0.45]),
       st.sampled_from(["total", "maximize"]), st.booleans(), st.integers(1, 80))
def test_k_best_over_machines_equal_brute_force(n_jobs, capacity, seed, density, objective,
                                                rush, count):
    if max(capacity) == 1:
        capacity[0] = 2
    rng = np.random.default_rng(seed)
    n_machines = len(capacity)
    values = rng.integers(0, 4, (n_jobs, n_machines)).astype(float)
    allowed = rng.random((n_jobs, n_machines)) < density
    penalty = rng.integers(0, 5, n_jobs).astype(float)
    must = (rng.random(n_jobs) < 0.3) if rush else np.zeros(n_jobs, dtype=bool)
    check_ranked(values, allowed, capacity, penalty, must, objective, count)


@pytest.mark.parametrize("capacity", [(2, 2, 1), (3, 1, 2), (3, 3)])
def test_every_plan_listed_once(capacity):
    # Asking for more plans than exist lists each plan over machines exactly once.
    rng = np.random.default_rng(sum(capacity))
    values = rng.integers(0, 5, (6, len(capacity))).astype(float)
    allowed = rng.random(values.shape) < 0.8
    penalty = np.full(6, 3.0)
    must = np.zeros(6, dtype=bool)
    plans = check_ranked(values, allowed, list(capacity), penalty, must, "total", 10_000)
    assert len(plans) == len(plans_by_machine(values, allowed, capacity, penalty, must, "total"))


def test_two_slot_machine_regression_slot_copies():
    # One machine with 2 slots, 2 jobs: one plan (both on it). Ranked over slots there
    # were two (the jobs swapped between the slots).
    base = solve(np.array([[1.0, 1.0], [2.0, 2.0]]))
    assert len(ranked_plans(base, 5)) == 2
    plans = ranked_plans(base, 5, groups=[0, 0])
    assert len(plans) == 1 and plans[0].total == 3.0


def test_groups_length_checked():
    with pytest.raises(ValueError, match="one entry per machine column"):
        ranked_plans(solve(np.ones((2, 2))), 3, groups=[0])
