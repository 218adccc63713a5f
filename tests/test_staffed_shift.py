"""Whole-shift plans with a crew (dispatcher.engine.staffed_shift and the shop's fill).

External checks, named at each test: brute force over every assignment of jobs to
machines (or to waiting), each checked for the crew's hours by networkx's maximum flow
on the period network (machine -> machine in period -> operator in period -> sink); the
plain whole-shift plan without the crew (a relaxation: it runs at least as many jobs,
and with the same count costs no more) from dispatcher.engine.fill_shift.
"""

from __future__ import annotations

import itertools
import json
import subprocess
import sys
from datetime import time
from pathlib import Path

import networkx as nx
import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from dispatcher.engine import DispatchInputError, ShiftInfeasibleError, fill_shift
from dispatcher.engine.staffed_shift import shift_periods, staffed_fill_shift
from dispatcher.io.shopfile import load_shop
from dispatcher.shop.fill_shift import fill_shop_shift

ROOT = Path(__file__).resolve().parent.parent
SAMPLE = ROOT / "sample_shops" / "crewed_fabrication_cell.dshop"


def crew_can_mind(busy, qualified, present, period_hours, capacity, needs) -> bool:
    """networkx maximum flow: can the crew mind every busy hour? (integer data)"""
    g = nx.DiGraph()
    n_ops, n_t = present.shape
    total = 0
    for m, b in enumerate(busy):
        if not needs[m] or b == 0:
            continue
        total += b
        g.add_edge("s", ("m", m), capacity=int(b))
        for t in range(n_t):
            g.add_edge(("m", m), ("mt", m, t), capacity=int(period_hours[t]))
            for o in range(n_ops):
                if qualified[o, m] and present[o, t]:
                    g.add_edge(("mt", m, t), ("ot", o, t), capacity=int(period_hours[t]))
    for o in range(n_ops):
        for t in range(n_t):
            g.add_edge(("ot", o, t), "z", capacity=int(capacity[o] * period_hours[t]))
    if total == 0:
        return True
    g.add_node("z")
    return nx.maximum_flow_value(g, "s", "z") == total


def brute_force(values, hours, capacity, qualified, present, period_hours, op_cap, needs, rush, penalty):
    """Every assignment (each job to a machine or waiting); best by (jobs, rush, -total)."""
    n, m = values.shape
    best = None
    for choice in itertools.product(range(-1, m), repeat=n):
        mj = np.array(choice)
        load = np.zeros(m)
        for i, k in enumerate(mj):
            if k >= 0:
                load[k] += hours[i, k]
        if (load > capacity).any():
            continue
        if not crew_can_mind(load, qualified, present, period_hours, op_cap, needs):
            continue
        placed = mj >= 0
        total = sum(values[i, k] for i, k in enumerate(mj) if k >= 0) + penalty[~placed].sum()
        key = (int(placed.sum()), int((placed & rush).sum()), -total)
        if best is None or key > best:
            best = key
    return best


@st.composite
def tiny_shifts(draw):
    n = draw(st.integers(1, 4))
    m = draw(st.integers(1, 3))
    n_ops = draw(st.integers(1, 3))
    values = np.array([[draw(st.integers(0, 9)) for _ in range(m)] for _ in range(n)], float)
    hours = np.array([[draw(st.integers(1, 5)) for _ in range(m)] for _ in range(n)], float)
    capacity = np.array([draw(st.integers(2, 8)) for _ in range(m)], float)
    qualified = np.array([[draw(st.booleans()) for _ in range(m)] for _ in range(n_ops)])
    arrives = [draw(st.sampled_from([np.nan, 2.0, 4.0])) for _ in range(n_ops)]
    leaves = [draw(st.sampled_from([np.nan, 4.0, 6.0])) for _ in range(n_ops)]
    leaves = [lv if np.isnan(a) or np.isnan(lv) or lv > a else np.nan for a, lv in zip(arrives, leaves)]
    op_cap = np.array([draw(st.integers(1, 2)) for _ in range(n_ops)])
    needs = np.array([draw(st.integers(0, 3)) > 0 for _ in range(m)])
    rush = np.array([draw(st.booleans()) for _ in range(n)])
    penalty = np.array([draw(st.integers(0, 5)) for _ in range(n)], float)
    return values, hours, capacity, qualified, arrives, leaves, op_cap, needs, rush, penalty


@settings(max_examples=60, deadline=None)
@given(tiny_shifts())
def test_matches_brute_force_with_networkx_max_flow(case):
    """Brute force over every assignment, staffing checked by networkx.maximum_flow_value."""
    values, hours, capacity, qualified, arrives, leaves, op_cap, needs, rush, penalty = case
    L, present = shift_periods(8.0, arrives, leaves)
    plan = staffed_fill_shift(values, hours, capacity, qualified=qualified, present=present,
                              period_hours=L, operator_capacity=op_cap, needs_operator=needs,
                              wait_penalty=penalty, rush=rush, priority=rush)
    assert plan.verify() and plan.proven_optimal
    best = brute_force(values, hours, capacity, qualified, present, L, op_cap, needs, rush, penalty)
    placed = plan.machine_of_job >= 0
    assert (plan.planned_count, int((placed & rush).sum())) == best[:2]
    assert plan.total == pytest.approx(-best[2])
    # the relaxation without the crew (dispatcher.engine.fill_shift) runs at least as many
    plain = fill_shift(values, hours, capacity, wait_penalty=penalty, rush=rush, priority=rush)
    assert plain.planned_count >= plan.planned_count
    if plain.planned_count == plan.planned_count and int((plain.machine_of_job >= 0)[rush].sum()) \
            == int(placed[rush].sum()):
        assert plain.total <= plan.total + 1e-9


def test_an_ample_crew_gives_the_plain_shift_plan():
    """Relaxation check: with everyone authorised everywhere, here all shift and able to
    mind every machine at once, the crew changes nothing (dispatcher.engine.fill_shift)."""
    rng = np.random.default_rng(7)
    values = rng.integers(0, 20, (9, 4)).astype(float)
    hours = rng.integers(1, 5, (9, 4)).astype(float)
    capacity = np.full(4, 8.0)
    plain = fill_shift(values, hours, capacity)
    plan = staffed_fill_shift(values, hours, capacity, qualified=np.ones((1, 4), bool),
                              present=np.ones((1, 1), bool), period_hours=[8.0],
                              operator_capacity=[4])
    assert plan.verify()
    assert plan.planned_count == plain.planned_count and plan.total == pytest.approx(plain.total)


def test_one_operator_who_leaves_at_noon_limits_the_shift():
    # two machines, one operator here for the first 4 hours minding one machine at once:
    # 4 machine-hours, so only one of the 3-hour jobs runs (by hand: 2 x 3 h > 4 h)
    L, present = shift_periods(8.0, [np.nan], [4.0])
    plan = staffed_fill_shift([[1, 1], [2, 2]], [[3, 3], [3, 3]], [8, 8],
                              qualified=np.ones((1, 2), bool), present=present, period_hours=L)
    assert plan.planned_count == 1 and plan.verify()
    assert plan.minded_hours().sum() == pytest.approx(3.0)
    # with a minding capacity of 2 both run side by side within those 4 hours
    plan = staffed_fill_shift([[1, 1], [2, 2]], [[3, 3], [3, 3]], [8, 8], operator_capacity=[2],
                              qualified=np.ones((1, 2), bool), present=present, period_hours=L)
    assert plan.planned_count == 2 and plan.verify()


def test_running_hours_nobody_can_mind_are_reported_not_planned_away():
    # machine 0 runs a 5-hour job; its only authorised operator is here 3 hours
    L, present = shift_periods(8.0, [5.0], [np.nan])
    plan = staffed_fill_shift([[1, 1]], [[2, 2]], [3, 8], qualified=np.array([[True, False]]),
                              present=present, period_hours=L, running_hours=[5, 0],
                              needs_operator=[True, False])
    assert plan.verify()
    assert plan.uncovered[0] == pytest.approx(2.0, abs=1e-5)
    assert plan.machine_of_job.tolist() == [1]  # the unattended machine takes the new job


def test_must_run_job_the_crew_cannot_mind_is_infeasible():
    with pytest.raises(ShiftInfeasibleError) as err:
        staffed_fill_shift([[1]], [[3]], [8], qualified=np.zeros((1, 1), bool),
                           present=np.ones((1, 1), bool), period_hours=[8.0], must_run=[0])
    assert err.value.kind == "crew"


def test_verify_refuses_minding_beyond_capacity_or_presence():
    L, present = shift_periods(8.0, [np.nan], [4.0])
    plan = staffed_fill_shift([[1, 1]], [[3, 3]], [8, 8], qualified=np.ones((1, 2), bool),
                              present=present, period_hours=L)
    assert plan.verify()
    w = plan.minding.copy()
    w[0, :, 1] = w[0, :, 0]  # minding in the afternoon, when the operator has left
    w[0, :, 0] = 0
    object.__setattr__(plan, "minding", w)
    assert not plan.verify()


def test_bad_crew_arrays_are_refused():
    with pytest.raises(DispatchInputError, match="present must be"):
        staffed_fill_shift([[1]], [[1]], [8], qualified=np.ones((1, 1), bool),
                           present=np.ones((2, 1), bool), period_hours=[8.0])
    with pytest.raises(DispatchInputError, match="period_hours"):
        staffed_fill_shift([[1]], [[1]], [8], qualified=np.ones((1, 1), bool),
                           present=np.ones((1, 1), bool), period_hours=[0.0])


def test_shift_periods_cut_at_arrivals_and_departures():
    L, present = shift_periods(8.0, [np.nan, 2.0], [6.0, np.nan])
    assert L.tolist() == [2.0, 4.0, 2.0]
    assert present.tolist() == [[True, True, False], [False, True, True]]


# ---- the shop: solve --fill-shift on a crewed shop ------------------------------------

def test_sample_shop_fills_its_shift_with_the_crew():
    shop = load_shop(SAMPLE)
    fill = fill_shop_shift(shop)
    assert fill.verified and fill.staffing is not None
    data = fill.to_json()
    assert all("operator" in a for a in data["assignments"])
    by_machine = {m["machine"]: m for m in data["machines"]}
    trainee = data["staffing"]["operator_hours"]["Trainee"]
    assert trainee["from"] == "10:00" and trainee["minding"] <= trainee["present"] + 1e-9
    # every machine that needs an operator and has work is minded for all its busy hours
    for m in shop.machines:
        entry = by_machine[m.name]
        if m.id in shop.crew.unattended:
            assert entry["operators"] == []
        else:
            minded = sum(o["hours"] for o in entry["operators"])
            assert minded == pytest.approx(entry["hours_used"] / m.slots, abs=1e-3)


def test_an_operator_leaving_early_leaves_work_for_the_next_shift():
    shop = load_shop(SAMPLE)
    before = fill_shop_shift(shop)
    for op in shop.crew.operators:
        if op.label == "Welder (manual)":
            op.leaves = time(8, 0)
    after = fill_shop_shift(shop)
    assert after.verified
    assert after.to_json()["staffing"]["operator_hours"]["Welder (manual)"]["present"] == 2
    weld = [m for m in after.machines if m.machine == "Manual weld bay"][0]
    assert weld.hours_used <= 2 + 1e-9 < [m for m in before.machines
                                          if m.machine == "Manual weld bay"][0].hours_used
    if after.waiting_jobs:
        assert after.staffing["shortage"]["waiting"] == len(after.waiting_jobs)


def test_command_line_fills_a_crewed_shift():
    proc = subprocess.run([sys.executable, "-m", "dispatcher", "solve", str(SAMPLE), "--fill-shift",
                           "--json"], capture_output=True, text=True, check=False, cwd=ROOT)
    assert proc.returncode == 0, proc.stderr
    data = json.loads(proc.stdout)
    assert data["certificate"]["verified"] and "staffing" in data
    assert all("operators" in m for m in data["machines"])


def test_nothing_can_run_and_every_job_waits():
    # no usable pair (the job needs 3 h, the machine has 2): no variable at all
    plan = staffed_fill_shift([[0.0]], [[3.0]], [2.0], qualified=np.zeros((1, 1), bool),
                              present=np.ones((1, 1), bool), period_hours=[8.0], wait_penalty=[4.0])
    assert plan.verify() and plan.planned_count == 0 and plan.total == 4.0
