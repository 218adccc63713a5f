"""Staffed dispatch (engine/staffing.py) against outside references.

References named beside each check: brute force over every assignment of jobs to
machines and of operators to machines; networkx's ``max_flow_min_cost`` on the same flow
network built here independently; total unimodularity (the LP relaxation of the
one-slot model, solved by scipy's ``linprog``, is integral); Hall's theorem in its
deficiency form (König 1931, Ore 1955) for the number of jobs that must wait.
"""

from __future__ import annotations

import networkx as nx
import numpy as np
import pytest
from helpers_crew import brute_force
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.optimize import linprog

from dispatcher.engine import DispatchInputError, InfeasibleError
from dispatcher.engine.staffing import restaff, staffed_dispatch


@st.composite
def crews(draw, max_jobs=4, max_machines=3, max_ops=3, multi_slot=False):
    n = draw(st.integers(1, max_jobs))
    m = draw(st.integers(1, max_machines))
    p = draw(st.integers(0, max_ops))
    vals = np.array(draw(st.lists(st.integers(0, 9), min_size=n * m, max_size=n * m)),
                    float).reshape(n, m)
    allowed = np.array(draw(st.lists(st.booleans(), min_size=n * m, max_size=n * m))).reshape(n, m)
    qualified = np.array(draw(st.lists(st.booleans(), min_size=p * m, max_size=p * m)),
                         bool).reshape(p, m)
    capacity = np.array(draw(st.lists(st.integers(1, 2), min_size=p, max_size=p)), int)
    needs = np.array(draw(st.lists(st.booleans(), min_size=m, max_size=m)))
    penalty = np.array(draw(st.lists(st.integers(0, 6), min_size=n, max_size=n)), float)
    rush = np.array(draw(st.lists(st.booleans(), min_size=n, max_size=n)))
    must = np.array(draw(st.lists(st.booleans(), min_size=n, max_size=n))) & draw(st.booleans())
    slots = (np.array(draw(st.lists(st.integers(1, 2), min_size=m, max_size=m)))
             if multi_slot else None)
    return vals, allowed, qualified, capacity, needs, penalty, rush, must, slots


def _key(plan, rush, objective):
    placed = plan.machine_of_job >= 0
    score = plan.total if objective == "maximize" else -plan.total
    return (int(placed.sum()), int((placed & rush).sum()), round(score, 9))


@pytest.mark.parametrize("objective", ["total", "maximize"])
@settings(max_examples=150, deadline=None)
@given(case=crews())
def test_one_slot_plans_match_brute_force(case, objective):
    """Reference: brute force over every assignment of jobs and operators."""
    vals, allowed, qualified, capacity, needs, penalty, rush, must, _ = case
    ref = brute_force(vals, allowed, qualified, capacity, needs, penalty, rush, must,
                      objective=objective)
    if ref is None:
        with pytest.raises(InfeasibleError):
            staffed_dispatch(vals, allowed, qualified=qualified, capacity=capacity,
                             needs_operator=needs, wait_penalty=penalty, rush=rush,
                             must_run=must, objective=objective)
        return
    plan = staffed_dispatch(vals, allowed, qualified=qualified, capacity=capacity,
                            needs_operator=needs, wait_penalty=penalty, rush=rush, must_run=must,
                            objective=objective)
    assert plan.method == "flow"
    assert plan.verify()
    assert _key(plan, rush, objective) == ref


@settings(max_examples=80, deadline=None)
@given(case=crews(max_jobs=4, max_machines=3, multi_slot=True))
def test_several_slots_match_brute_force(case):
    """Reference: brute force, machines taking up to two jobs minded by one operator."""
    vals, allowed, qualified, capacity, needs, penalty, rush, must, slots = case
    ref = brute_force(vals, allowed, qualified, capacity, needs, penalty, rush, must, slots)
    if ref is None:
        with pytest.raises(InfeasibleError):
            staffed_dispatch(vals, allowed, qualified=qualified, capacity=capacity,
                             needs_operator=needs, wait_penalty=penalty, rush=rush,
                             must_run=must, slots=slots)
        return
    plan = staffed_dispatch(vals, allowed, qualified=qualified, capacity=capacity,
                            needs_operator=needs, wait_penalty=penalty, rush=rush, must_run=must,
                            slots=slots)
    assert plan.verify()
    assert _key(plan, rush, "total") == ref


def _networkx_network(vals, allowed, qualified, capacity, needs, penalty):
    """The flow network, built independently of the engine, for networkx."""
    g = nx.DiGraph()
    g.add_nodes_from(["s", "t"])
    n, m = vals.shape
    big = int(vals.max(initial=0) + penalty.max(initial=0) + 1)
    for i in range(n):
        g.add_edge("s", ("j", i), capacity=1, weight=0)
        for k in range(m):
            if allowed[i, k]:
                # Placing a job earns its wait penalty; a constant keeps weights >= 0.
                g.add_edge(("j", i), ("mi", k), capacity=1,
                           weight=int(vals[i, k] - penalty[i]) + big)
    for k in range(m):
        g.add_edge(("mi", k), ("mo", k), capacity=1, weight=0)
        if not needs[k]:
            g.add_edge(("mo", k), "t", capacity=1, weight=0)
    for o in range(qualified.shape[0]):
        g.add_edge(("o", o), "t", capacity=int(capacity[o]), weight=0)
        for k in range(m):
            if qualified[o, k] and needs[k]:
                g.add_edge(("mo", k), ("o", o), capacity=1, weight=0)
    return g, big


@settings(max_examples=60, deadline=None)
@given(case=crews(max_jobs=6, max_machines=4, max_ops=4))
def test_min_cost_max_flow_matches_networkx(case):
    """Reference: networkx.max_flow_min_cost on the same network (no rush, no must-run)."""
    vals, allowed, qualified, capacity, needs, penalty, _, _, _ = case
    g, big = _networkx_network(vals, allowed, qualified, capacity, needs, penalty)
    flow = nx.max_flow_min_cost(g, "s", "t")
    value = sum(flow["s"].values())
    cost = nx.cost_of_flow(g, flow) - big * value + penalty.sum()
    plan = staffed_dispatch(vals, allowed, qualified=qualified, capacity=capacity,
                            needs_operator=needs, wait_penalty=penalty)
    assert plan.verify()
    assert plan.planned_count == value
    assert plan.total == pytest.approx(cost)


@settings(max_examples=40, deadline=None)
@given(case=crews(max_jobs=5, max_machines=4, max_ops=3))
def test_lp_relaxation_is_integral(case):
    """Total unimodularity: scipy's linprog on the one-slot model's LP returns 0/1 values.

    The LP here maximises the number of placed jobs (an arc-flow LP written independently
    of the engine); its optimum equals the engine's placed count.
    """
    vals, allowed, qualified, capacity, needs, _, _, _, _ = case
    n, m = vals.shape
    jm = [(i, k) for i in range(n) for k in range(m) if allowed[i, k]]
    mo = [(k, o) for o in range(qualified.shape[0]) for k in range(m)
          if qualified[o, k] and needs[k]]
    mt = [k for k in range(m) if not needs[k]]
    nv = len(jm) + len(mo) + len(mt)
    if nv == 0:
        return
    a_ub, b_ub, a_eq, b_eq = [], [], [], []
    for i in range(n):
        a_ub.append([1.0 if a < len(jm) and jm[a][0] == i else 0.0 for a in range(nv)])
        b_ub.append(1.0)
    for o in range(qualified.shape[0]):
        row = np.zeros(nv)
        for b, (k, oo) in enumerate(mo):
            if oo == o:
                row[len(jm) + b] = 1
        a_ub.append(row)
        b_ub.append(float(capacity[o]))
    for k in range(m):
        into = np.zeros(nv)
        for a, (_, kk) in enumerate(jm):
            if kk == k:
                into[a] = 1
        a_ub.append(into.copy())
        b_ub.append(1.0)
        out = -into
        for b, (kk, _) in enumerate(mo):
            if kk == k:
                out[len(jm) + b] = 1
        for c, kk in enumerate(mt):
            if kk == k:
                out[len(jm) + len(mo) + c] = 1
        a_eq.append(out)
        b_eq.append(0.0)
    c = -np.r_[np.ones(len(jm)), np.zeros(len(mo) + len(mt))]
    res = linprog(c, A_ub=np.array(a_ub), b_ub=b_ub, A_eq=np.array(a_eq), b_eq=b_eq,
                  bounds=(0, 1), method="highs-ds")
    assert res.status == 0
    assert np.allclose(res.x, np.round(res.x), atol=1e-9)
    plan = staffed_dispatch(vals, allowed, qualified=qualified, capacity=capacity,
                            needs_operator=needs)
    assert plan.planned_count == round(-res.fun)


def test_rush_jobs_placed_first_when_not_all_can_be():
    """Presses P1, P2; rush A and B only on P1, rush C only on P2, ordinary D on either.

    Brute force: the best plan places C and one of A/B; D waits (checked against the
    brute-force reference above as well).
    """
    vals = np.array([[1.0, 0], [1.0, 0], [0, 1.0], [0.0, 0.0]])
    allowed = np.array([[1, 0], [1, 0], [0, 1], [1, 1]], bool)
    rush = np.array([True, True, True, False])
    plan = staffed_dispatch(vals, allowed, qualified=np.ones((2, 2), bool), rush=rush)
    assert plan.machine_of_job[2] == 1
    assert plan.machine_of_job[3] == -1
    assert sorted(plan.machine_of_job[:2].tolist()) == [-1, 0]
    assert plan.rush_waiting.size == 1
    assert plan.verify()


def test_shortage_counts_jobs_waiting_for_operators():
    """Hall's theorem, deficiency form: 3 machines, one operator minding two: one job waits."""
    vals = np.ones((3, 3))
    qualified = np.array([[True, True, True]])
    plan = staffed_dispatch(vals, qualified=qualified, capacity=[2])
    assert plan.planned_count == 2
    s = plan.shortage
    assert s is not None and s.could_run == 3 and s.waiting == 1
    assert s.operators.tolist() == [0] and s.capacity == 2


def test_machines_that_need_nobody_run_without_an_operator():
    plan = staffed_dispatch(np.ones((2, 2)), qualified=np.zeros((0, 2), bool),
                            needs_operator=[False, True])
    assert plan.planned_count == 1
    assert plan.operator_of_machine.tolist() == [-1, -1]
    assert plan.verify()


def test_must_run_without_crew_is_infeasible():
    with pytest.raises(InfeasibleError, match="must-run"):
        staffed_dispatch(np.ones((2, 2)), qualified=np.array([[True, True]]), must_run=[0, 1])


@pytest.mark.parametrize("kwargs, match", [
    ({"qualified": np.ones((1, 3), bool)}, "operators x machines"),
    ({"qualified": np.ones((1, 2))}, "boolean"),
    ({"qualified": np.ones((1, 2), bool), "capacity": [0]}, "at least 1"),
    ({"qualified": np.ones((1, 2), bool), "capacity": [1, 1]}, "capacity needs 1"),
    ({"qualified": np.ones((1, 2), bool), "objective": "bottleneck"}, "supports"),
])
def test_bad_crew_input_is_refused(kwargs, match):
    with pytest.raises(DispatchInputError, match=match):
        staffed_dispatch(np.ones((2, 2)), **kwargs)


def _plan(seed=3):
    rng = np.random.default_rng(seed)
    vals = rng.integers(0, 20, (6, 4)).astype(float)
    qualified = rng.random((3, 4)) < 0.7
    return vals, qualified, staffed_dispatch(vals, qualified=qualified, capacity=[1, 2, 1])


def test_verify_refuses_a_corrupted_potential():
    _, _, plan = _plan()
    assert plan.verify()
    bad = plan.potential.copy()
    bad[plan._network.job0] += 1e3
    object.__setattr__(plan, "potential", bad)
    assert not plan.verify()


def test_verify_refuses_an_unqualified_operator():
    _, qualified, plan = _plan()
    m = int(np.flatnonzero(plan.operator_of_machine >= 0)[0])
    ops = plan.operator_of_machine.copy()
    unq = np.flatnonzero(~qualified[:, m])
    ops[m] = unq[0] if unq.size else -1
    object.__setattr__(plan, "operator_of_machine", ops)
    assert not plan.verify()


def test_verify_refuses_a_worse_plan():
    """Swap two jobs' machines: a different plan whose total no longer matches or is worse."""
    vals, _, plan = _plan()
    placed = np.flatnonzero(plan.machine_of_job >= 0)
    mj = plan.machine_of_job.copy()
    mj[placed[0]], mj[placed[1]] = mj[placed[1]], mj[placed[0]]
    new_total = float(vals[placed, mj[placed]].sum())
    object.__setattr__(plan, "machine_of_job", mj)
    object.__setattr__(plan, "total", new_total)
    assert not plan.verify()


def test_verify_refuses_a_shrunken_cut():
    _, _, plan = _plan()
    cuts = list(plan.cuts)
    cut = cuts[-1].copy()
    cut[plan._network.sink] = True
    cuts[-1] = cut
    object.__setattr__(plan, "cuts", tuple(cuts))
    assert not plan.verify()


@pytest.mark.parametrize("objective", ["total", "maximize"])
@settings(max_examples=60, deadline=None)
@given(case=crews(max_jobs=5, max_machines=4, max_ops=3), data=st.data())
def test_warm_replan_after_a_crew_change_matches_brute_force(case, objective, data):
    """An operator leaves, arrives or changes: the warm re-plan equals brute force on the new crew."""
    vals, allowed, qualified, capacity, needs, penalty, rush, _, _ = case
    if qualified.shape[0] == 0:
        return
    plan = staffed_dispatch(vals, allowed, qualified=qualified, capacity=capacity,
                            needs_operator=needs, wait_penalty=penalty, rush=rush,
                            objective=objective)
    new_q = qualified.copy()
    who = data.draw(st.integers(0, qualified.shape[0] - 1))
    new_q[who] = data.draw(st.lists(st.booleans(), min_size=vals.shape[1], max_size=vals.shape[1]))
    ref = brute_force(vals, allowed, new_q, capacity, needs, penalty, rush,
                      np.zeros(len(rush), bool), objective=objective)
    again = restaff(plan, qualified=new_q, capacity=capacity, needs_operator=needs)
    assert again.verify()
    assert _key(again, rush, objective) == ref


def test_verify_refuses_a_dropped_wait_penalty():
    """A plan that is optimal only if one job's wait penalty is ignored is refused."""
    vals = np.array([[5.0], [1.0]])
    penalty = np.array([100.0, 0.0])
    plan = staffed_dispatch(vals, qualified=np.array([[True]]), wait_penalty=penalty)
    assert plan.machine_of_job.tolist() == [0, -1] and plan.verify()
    cheap = staffed_dispatch(vals, qualified=np.array([[True]]))
    assert cheap.machine_of_job.tolist() == [-1, 0]
    object.__setattr__(cheap, "wait_penalty", penalty)
    object.__setattr__(cheap, "total", 101.0)
    assert not cheap.verify()


def test_kept_jobs_go_before_rush_jobs_and_are_never_refused():
    """A running machine's own job (kept) outranks a rush job for the only operator, and a
    kept job the crew cannot cover waits instead of making the plan infeasible."""
    vals = np.zeros((2, 2))
    allowed = np.array([[True, False], [False, True]])
    plan = staffed_dispatch(vals, allowed, qualified=np.array([[True, True]]),
                            keep=[True, False], rush=[False, True])
    assert plan.machine_of_job.tolist() == [0, -1] and plan.verify()
    nobody = staffed_dispatch(vals, allowed, qualified=np.array([[False, True]]),
                              keep=[True, False])
    assert nobody.machine_of_job.tolist() == [-1, 1] and nobody.verify()
