"""Decision proposals (Qt-free): the event rules are the re-dispatch's apply_events, the
plan is checked against scipy's linear_sum_assignment (reference library) on the grid
after the event, and the shop passed in never changes."""

from __future__ import annotations

import itertools

import numpy as np
import pytest
from scipy.optimize import linear_sum_assignment

from dispatcher.engine import solve
from dispatcher.io.grid import read_grid
from dispatcher.io.shopfile import load_shop, shop_to_dict
from dispatcher.shop import DOWN, RUNNING, WAITING, shop_from_grid
from dispatcher.shop.alternatives import ranked_choices
from dispatcher.shop.proposal import EVENT_CONFIRM, EVENT_DOWN, EVENT_PULL, EVENT_RUSH, propose
from dispatcher.shop.whatif import machine_minimum

BIG = 1e9


def _scipy_total(values: np.ndarray, allowed: np.ndarray) -> float:
    cost = np.where(allowed, values, BIG)
    r, c = linear_sum_assignment(cost)
    return float(cost[r, c].sum())


@pytest.fixture
def grid_shop(samples):
    t = read_grid(samples / "sheet_metal_grid.csv")
    return shop_from_grid(t.jobs, t.machines, t.values, t.allowed, name="sheet metal")


def test_machine_down_plans_without_it_and_keeps_the_shop(grid_shop):
    before = shop_to_dict(grid_shop)
    values, allowed = grid_shop.matrix()
    p = propose(grid_shop, EVENT_DOWN, "total", machine=2, note="belt torn")
    assert shop_to_dict(grid_shop) == before
    assert p.shop.machines[2].state == DOWN and p.shop.machines[2].state_note == "belt torn"
    assert grid_shop.machines[2].name not in [a.machine for a in p.plan.assignments]
    keep = [k for k in range(values.shape[1]) if k != 2]
    assert p.plan.total == pytest.approx(_scipy_total(values[:, keep], allowed[:, keep]))


def test_pulled_job_leaves_the_shop_and_the_plan(grid_shop):
    values, allowed = grid_shop.matrix()
    name = grid_shop.jobs[1].name
    p = propose(grid_shop, EVENT_PULL, "total", job=1)
    assert p.pulled_job == name and name not in p.shop.job_names()
    assert len(p.shop.jobs) == len(grid_shop.jobs) - 1 and p.job_changes == []
    rest = [i for i in range(values.shape[0]) if i != 1]
    assert p.plan.total == pytest.approx(_scipy_total(values[rest], allowed[rest]))


def test_running_job_on_a_machine_going_down_waits_again(samples):
    shop = load_shop(samples / "medium_machining_shop.dshop")
    row = next(i for i, j in enumerate(shop.jobs) if j.state == RUNNING)
    col = [m.id for m in shop.machines].index(shop.jobs[row].machine)
    p = propose(shop, EVENT_DOWN, "total", machine=col)
    assert shop.jobs[row].state == RUNNING          # the shop passed in is unchanged
    assert p.shop.jobs[row].state == WAITING and p.shop.jobs[row].machine is None
    assert (row, {"state": WAITING, "machine": None, "since": None}) in p.job_changes


def test_an_event_that_does_not_fit_gives_a_proposal_without_a_plan(samples):
    shop = load_shop(samples / "medium_machining_shop.dshop")
    row = next(i for i, j in enumerate(shop.jobs) if j.state == RUNNING)
    p = propose(shop, EVENT_RUSH, "total", job=row)
    assert p.plan is None and "must be waiting" in p.problem and shop.jobs[row].name in p.problem


def test_with_a_plan_in_force_the_proposal_is_the_warm_redispatch(samples):
    shop = load_shop(samples / "medium_machining_shop.dshop")
    first = propose(shop, EVENT_CONFIRM, "total")
    shop.plan_in_force = first.plan.in_force(shop)
    busy = first.plan.assignments[0].machine
    p = propose(shop, EVENT_DOWN, "total", machine=shop.machine_names().index(busy))
    assert p.move_penalties is not None
    assert busy not in [a.machine for a in p.plan.assignments]


def test_machine_minimum_is_the_least_over_each_machines_slots():
    rng = np.random.default_rng(3)
    extra = rng.integers(0, 9, size=(5, 6)).astype(float)
    extra[rng.random(extra.shape) < 0.3] = np.nan
    columns = ["A", "B", "B", "C", "C", "C"]
    got = machine_minimum(extra, columns, ["C", "A", "B", "D"])
    for j in range(5):    # brute force over the columns of each label
        for k, m in enumerate(["C", "A", "B", "D"]):
            xs = [extra[j, c] for c, label in enumerate(columns) if label == m and not np.isnan(extra[j, c])]
            assert (np.isnan(got[j, k]) and not xs) or got[j, k] == min(xs)


def test_ranked_choices_are_the_k_best_distinct_machine_plans_by_brute_force():
    rng = np.random.default_rng(5)
    values = rng.integers(1, 20, size=(4, 2)).astype(float)
    columns = ["A", "A", "B", "B"]            # two machines with two slots each
    wide = values[:, [0, 0, 1, 1]]
    result = solve(wide, np.ones(wide.shape, dtype=bool))
    got = ranked_choices(result, 6, columns)
    # Brute force: every way to give each job a machine, two jobs per machine.
    totals = sorted(sum(values[j, m] for j, m in enumerate(choice))
                    for choice in itertools.product(range(2), repeat=4)
                    if choice.count(0) == 2)
    assert [c.total for c in got] == pytest.approx(totals[:6])
    keys = {frozenset((j, columns[c]) for j, c in ch.pairs) for ch in got}
    assert len(keys) == len(got)
