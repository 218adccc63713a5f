"""Ranked alternatives (dispatcher.engine.ranking) against brute-force enumeration.

Reference: every plan of the grid enumerated by brute force (each job takes a free allowed
machine or waits; kept when it places the maximum number of jobs and every must-run job),
sorted by total. Small integer values make ties common; ties may come in any order, so
the totals are compared as sorted lists and each returned plan is checked on its own.
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from dispatcher.engine import InfeasibleError, ranked_plans, solve


def all_plans(values, allowed, penalty, must, objective):
    """{pairs: total} for every plan, by brute force."""
    n_jobs, n_machines = values.shape
    found = []

    def extend(job, used, chosen):
        if job == n_jobs:
            found.append(tuple(chosen))
            return
        if not must[job]:
            extend(job + 1, used, chosen + [-1])
        for m in range(n_machines):
            if allowed[job, m] and m not in used:
                extend(job + 1, used | {m}, chosen + [m])

    extend(0, frozenset(), [])
    if not found:
        return {}
    most = max(sum(m >= 0 for m in p) for p in found)
    out = {}
    for plan in found:
        if sum(m >= 0 for m in plan) != most:
            continue
        placed = sum(values[j, m] for j, m in enumerate(plan) if m >= 0)
        waiting = sum(penalty[j] for j, m in enumerate(plan) if m < 0)
        pairs = frozenset((j, m) for j, m in enumerate(plan) if m >= 0)
        out[pairs] = placed - waiting if objective == "maximize" else placed + waiting
    return out


@settings(max_examples=60, deadline=None)
@given(st.integers(0, 7), st.integers(0, 7), st.integers(0, 2**32 - 1),
       st.sampled_from([1.0, 0.7, 0.45]), st.sampled_from(["total", "maximize"]),
       st.booleans(), st.integers(1, 60))
def test_k_best_equal_brute_force(n_jobs, n_machines, seed, density, objective, rush, count):
    if n_jobs * n_machines > 30:  # keep the enumeration quick; 7 x 7 is covered below
        n_machines = min(n_machines, 30 // max(n_jobs, 1))
    rng = np.random.default_rng(seed)
    values = rng.integers(0, 4, (n_jobs, n_machines)).astype(float)
    allowed = rng.random((n_jobs, n_machines)) < density
    penalty = rng.integers(0, 5, n_jobs).astype(float)
    must = (rng.random(n_jobs) < 0.3) if rush else np.zeros(n_jobs, dtype=bool)
    reference = all_plans(values, allowed, penalty, must, objective)
    try:
        base = solve(values, allowed, wait_penalty=penalty, must_run=must, objective=objective)
    except InfeasibleError:
        assert reference == {}, "brute force finds a plan placing every must-run job"
        return
    check(base, reference, count, objective)


def check(base, reference, count, objective):
    plans = ranked_plans(base, count)
    best_first = sorted(reference.values(), reverse=objective == "maximize")
    assert [p.total for p in plans] == pytest.approx(best_first[:count])
    assert plans[0].machine_of_job.tolist() == base.machine_of_job.tolist()
    seen = set()
    for plan in plans:
        pairs = plan.pairs()
        assert pairs not in seen  # distinct sets of (job, machine) pairs
        seen.add(pairs)
        assert reference[pairs] == pytest.approx(plan.total)  # a real plan with that total


@pytest.mark.parametrize("seed", range(3))
def test_seven_by_seven_with_ties(seed):
    rng = np.random.default_rng(100 + seed)
    values = rng.integers(0, 3, (7, 7)).astype(float)
    allowed = rng.random((7, 7)) < 0.8
    base = solve(values, allowed, wait_penalty=np.full(7, 2.0))
    check(base, all_plans(values, allowed, np.full(7, 2.0), np.zeros(7, bool), "total"),
          40, "total")


def test_rectangular_plans_differ_in_which_jobs_wait():
    # 3 jobs, 1 machine: exactly 3 plans (one per job placed), never duplicates for the
    # two wait slots.
    base = solve(np.array([[1.0], [2.0], [3.0]]))
    plans = ranked_plans(base, 10)
    assert [p.total for p in plans] == [1.0, 2.0, 3.0]
    assert [p.machine_of_job.tolist() for p in plans] == [[0, -1, -1], [-1, 0, -1], [-1, -1, 0]]


def test_more_machines_than_jobs_counts_each_choice_once():
    # 1 job, 3 machines: 3 plans; which machines stay idle is not a plan of its own.
    plans = ranked_plans(solve(np.array([[3.0, 1.0, 2.0]])), 10)
    assert [p.total for p in plans] == [1.0, 2.0, 3.0]


def test_bad_requests():
    base = solve(np.ones((2, 2)))
    assert ranked_plans(base, 0) == []
    with pytest.raises(ValueError, match="count must be >= 0"):
        ranked_plans(base, -1)
    with pytest.raises(ValueError, match="'total' and 'maximize'"):
        ranked_plans(solve(np.ones((2, 2)), objective="bottleneck"), 3)


@pytest.mark.parametrize("objective", ["total", "maximize"])
def test_many_float_grids_rank_every_plan_in_order(objective):
    # Reference: brute force (all_plans above). Spread-out float values make ties rare, so
    # a subproblem bound that is not a true lower bound shows as a plan out of order, and
    # cutting the ranking short (count below the number of plans) must keep the best ones.
    rng = np.random.default_rng(2026)
    checked = 0
    for _ in range(120):
        n_jobs, n_machines = int(rng.integers(1, 6)), int(rng.integers(1, 6))
        values = np.round(rng.random((n_jobs, n_machines)) * 100, 3)
        allowed = rng.random((n_jobs, n_machines)) < rng.choice([1.0, 0.7, 0.5])
        penalty = np.round(rng.random(n_jobs) * 60, 3)
        must = rng.random(n_jobs) < 0.2
        reference = all_plans(values, allowed, penalty, must, objective)
        try:
            base = solve(values, allowed, wait_penalty=penalty, must_run=must, objective=objective)
        except InfeasibleError:
            assert reference == {}
            continue
        for count in (len(reference), max(1, len(reference) // 2), len(reference) + 3):
            check(base, reference, count, objective)
        checked += 1
    assert checked > 80
