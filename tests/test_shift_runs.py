"""Whole-shift plans with changeovers (dispatcher.engine.plan_shift_runs).

References: brute force over every assignment of jobs to machines (or waiting) and every
run order (tests/helpers_sequencing.py, no engine code); today's whole-shift mode
(dispatcher.engine.fill_shift, the generalised assignment MILP) when every changeover is
the same; the theorem that a relaxation bounds the optimum from below.
"""

from __future__ import annotations

import itertools

import numpy as np
import pytest

from dispatcher.engine import fill_shift
from dispatcher.engine.order_runs import RunOrderInfeasibleError
from dispatcher.engine.shift_runs import plan_shift_runs
from tests.helpers_sequencing import brute_force_shift


def family_shop(rng, n, m, families=3, forbid=0.0, tight=1.0):
    """Invented shop: jobs of a few families, one table per machine, mounted families."""
    fam = rng.integers(families, size=n)
    c = np.zeros((m, n + 1, n + 1))
    for k in range(m):
        table = rng.integers(0, 40, size=(families, families)).astype(float)
        np.fill_diagonal(table, rng.integers(0, 4, size=families))
        table[rng.random(table.shape) < forbid] = np.nan
        mounted = rng.integers(families)
        nodes = np.concatenate([[mounted], fam])
        c[k] = table[np.ix_(nodes, nodes)]
    hours = rng.integers(1, 4, size=(n, m)).astype(float)
    hours[rng.random((n, m)) < 0.2] = np.nan
    capacity = np.full(m, tight * n * 2.0 / m)
    return c, hours, capacity


def check_plan(plan, c, hours, capacity, end=None, pen=None, must=None, tau=0.0):
    """The plan's own claims recomputed here from the inputs."""
    m, n = len(capacity), hours.shape[0]
    end = np.zeros((m, n + 1)) if end is None else end
    pen = np.zeros(n) if pen is None else pen
    seen = []
    total = 0.0
    for k, order in enumerate(plan.orders):
        seq = [0] + [i + 1 for i in order]
        cost = sum(c[k, a, b] for a, b in itertools.pairwise(seq)) + end[k, seq[-1]]
        assert np.isfinite(cost)
        assert sum(hours[i, k] for i in order) + tau * cost <= capacity[k] + 1e-6
        total += cost
        seen += order
    assert len(seen) == len(set(seen))
    total += sum(pen[i] for i in range(n) if i not in seen)
    if must is not None:
        assert set(np.flatnonzero(must)) <= set(seen)
    assert plan.total == pytest.approx(total)
    assert plan.lower_bound <= plan.total + 1e-9


@pytest.mark.parametrize("seed", range(8))
@pytest.mark.parametrize("m", [2, 3])
def test_exact_plan_is_the_brute_force_optimum(seed, m):
    rng = np.random.default_rng(seed)
    n = 5 if m == 2 else 4
    c, hours, capacity = family_shop(rng, n, m, forbid=0.15 if seed % 2 else 0.0, tight=0.6)
    pen = rng.integers(0, 30, size=n).astype(float)
    tau = 1 / 60 if seed % 3 == 0 else 0.0
    end = None
    if seed % 4 == 1:                      # an end family on every machine
        end = rng.integers(0, 20, size=(m, n + 1)).astype(float)
    expect = brute_force_shift(c, hours, capacity, end, pen, tau=tau)   # every plan tried
    plan = plan_shift_runs(c, hours, capacity, end_change=end, wait_penalty=pen,
                           changeover_hours=tau, method="exact", time_limit=None)
    check_plan(plan, c, hours, capacity, end, pen, tau=tau)
    assert plan.proven_optimal and plan.method == "exact"
    assert (plan.placed, plan.total) == (expect[0], pytest.approx(expect[1]))
    assert plan.lower_bound <= expect[1] + 1e-9


@pytest.mark.parametrize("seed", range(6))
def test_search_plan_is_feasible_and_its_bound_holds(seed):
    rng = np.random.default_rng(50 + seed)
    n, m = 5, 2
    c, hours, capacity = family_shop(rng, n, m, tight=0.7)
    pen = rng.integers(0, 30, size=n).astype(float)
    must = np.zeros(n, dtype=bool)
    must[0] = True
    expect = brute_force_shift(c, hours, capacity, None, pen, must)
    if expect is None:
        with pytest.raises(RunOrderInfeasibleError):
            plan_shift_runs(c, hours, capacity, wait_penalty=pen, must_run=must, method="search")
        return
    plan = plan_shift_runs(c, hours, capacity, wait_penalty=pen, must_run=must, method="search")
    check_plan(plan, c, hours, capacity, None, pen, must)
    assert plan.lower_bound <= expect[1] + 1e-9        # a relaxation bounds the optimum
    assert plan.placed <= expect[0]
    if plan.placed == expect[0]:
        assert plan.total >= expect[1] - 1e-9


@pytest.mark.parametrize("seed", range(5))
def test_all_changeovers_equal_gives_todays_whole_shift_plan(seed):
    """Equal changeovers cost the same per job run: the plan of fill_shift (GAP MILP)."""
    rng = np.random.default_rng(200 + seed)
    n, m, v = 9, 3, 7.0
    hours = rng.integers(1, 5, size=(n, m)).astype(float)
    hours[rng.random((n, m)) < 0.2] = np.nan
    capacity = np.array([6.0, 7.0, 5.0])
    pen = rng.integers(0, 20, size=n).astype(float)
    c = np.full((m, n + 1, n + 1), v)
    plan = plan_shift_runs(c, hours, capacity, wait_penalty=pen, time_limit=None)
    allowed = np.isfinite(hours)
    today = fill_shift(np.where(allowed, v, 0.0), np.where(allowed, hours, 0.0), capacity,
                       allowed=allowed, wait_penalty=pen)
    assert plan.proven_optimal
    assert plan.total == pytest.approx(today.total)
    assert plan.placed == int((today.machine_of_job >= 0).sum())


def test_larger_shop_returns_a_plan_with_its_gap():
    """60 jobs x 6 machines, 8 families: the search with a bound, within a short limit."""
    rng = np.random.default_rng(9)
    n, m = 60, 6
    c, hours, capacity = family_shop(rng, n, m, families=8, tight=0.8)
    pen = rng.integers(10, 60, size=n).astype(float)
    plan = plan_shift_runs(c, hours, capacity, wait_penalty=pen, changeover_hours=1 / 60,
                           time_limit=3.0)
    check_plan(plan, c, hours, capacity, None, pen, tau=1 / 60)
    assert plan.method == "search" and 0.0 <= plan.gap < 1.0


def test_bad_shapes_are_refused():
    from dispatcher.engine import DispatchInputError
    with pytest.raises(DispatchInputError, match="changeover must have shape"):
        plan_shift_runs(np.zeros((2, 3, 3)), np.ones((3, 2)), [5, 5])
    with pytest.raises(DispatchInputError, match="changeovers must be >= 0"):
        plan_shift_runs(-np.ones((1, 2, 2)), np.ones((1, 1)), [5])


@pytest.mark.parametrize("seed", range(12))
def test_family_block_bound_never_exceeds_the_brute_force_optimum(seed):
    """The relaxation with one change into every family a machine runs (Potts and
    Kovalyov 2000) is a lower bound: checked against every plan tried by brute force."""
    from dispatcher.engine.shift_runs import _assignment_bound, _capacity_bound, _check

    rng = np.random.default_rng(300 + seed)
    m = 2 if seed % 2 else 3
    n = 6 if m == 2 else 5
    c, hours, capacity = family_shop(rng, n, m, families=2 + seed % 2, forbid=0.1 if seed % 3 else 0.0,
                                     tight=0.5 + 0.1 * (seed % 4))
    pen = rng.integers(0, 40, size=n).astype(float)
    tau = 1 / 60 if seed % 3 == 0 else 0.0
    end = rng.integers(0, 20, size=(m, n + 1)).astype(float) if seed % 4 == 1 else None
    must = np.zeros(n, dtype=bool)
    must[0] = seed % 5 == 0
    for most in (True, False):
        expect = brute_force_shift(c, hours, capacity, end, pen, must, tau=tau, most_jobs_first=most)
        if expect is None:
            continue
        p = _check(c, hours, capacity, end, pen, must, tau, None, "auto", most)
        assert _capacity_bound(p) <= expect[1] + 1e-6
        assert _assignment_bound(p) <= expect[1] + 1e-6


def test_family_block_bound_is_stronger_when_families_repeat():
    """Two families, every machine with many jobs of each: the family blocks lift the
    bound above the cheapest-change-in relaxation (all same-family changes cost 0)."""
    from dispatcher.engine.shift_runs import _capacity_bound, _check

    fam = np.array([0, 0, 0, 1, 1, 1])
    table = np.array([[0.0, 30.0], [30.0, 0.0]])
    mounted = 0
    nodes = np.concatenate([[mounted], fam])
    c = np.stack([table[np.ix_(nodes, nodes)]] * 2)
    hours = np.ones((6, 2))
    capacity = np.full(2, 6.0)
    p = _check(c, hours, capacity, None, np.full(6, 100.0), None, 0.0, None, "auto", True)
    bound = _capacity_bound(p)
    best = brute_force_shift(c, hours, capacity, None, np.full(6, 100.0))
    # every job runs; family 1 must be changed into on some machine at least once: 30
    assert best == (6, pytest.approx(30.0))
    assert bound == pytest.approx(30.0, abs=1e-3)   # the LP optimum less its tolerance
