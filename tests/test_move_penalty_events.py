"""Move penalties together with other events, against brute-force enumeration.

A move penalty alone never changes a plan (the plan in force is still optimal), so these
tests combine it with what makes jobs move: a rush job arriving and a machine going down.
Reference: every plan of the problem after the events enumerated here (each job takes a
free allowed machine or waits; kept when it places the maximum number of jobs and every
must-run job), costed by the definition: values of placed pairs, wait penalties of
waiting jobs, and the move penalty of every job the plan in force placed that the new
plan puts anywhere else, waiting included (engine), or anywhere else unless its machine
went down (shop). The example counts are high enough that the enumeration meets plans
where a placed job left waiting pays its move penalty and that penalty changes the plan
(asserted by ``test_the_cases_that_matter_are_drawn``).
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from dispatcher.engine import InfeasibleError, redispatch, solve
from dispatcher.shop import Job, Machine, Shop
from dispatcher.shop.redispatch import ShopEvent, redispatch_shop
from dispatcher.shop.translate import ShopInfeasibleError


def best_by_enumeration(values, allowed, penalty, must, before, move, exempt=(), *,
                        charge_waiting=True, rush=None):
    """Least total over every plan (None: no plan places every must-run job), by brute
    force; ``before[i]`` is job i's machine in force (-1: none); jobs in ``exempt`` pay no
    move penalty (their machine went down). ``charge_waiting=False`` is the bug of a
    placed job left waiting paying nothing."""
    n_jobs, n_machines = values.shape
    plans = []

    def extend(i, used, chosen):
        if i == n_jobs:
            plans.append(tuple(chosen))
            return
        if not must[i]:
            extend(i + 1, used, chosen + [-1])
        for m in range(n_machines):
            if allowed[i, m] and m not in used:
                extend(i + 1, used | {m}, chosen + [m])

    extend(0, frozenset(), [])
    # The most jobs any plan places, must-run or not (every plan counts for the maximum).
    most = _most_placed(allowed)
    plans = [p for p in plans if sum(c >= 0 for c in p) == most]
    if rush is not None and plans:
        top = max(sum(1 for i, c in enumerate(p) if c >= 0 and rush[i]) for p in plans)
        plans = [p for p in plans if sum(1 for i, c in enumerate(p) if c >= 0 and rush[i]) == top]
    best = None
    for plan in plans:
        total = 0.0
        for i, c in enumerate(plan):
            total += values[i, c] if c >= 0 else penalty[i]
            if before[i] >= 0 and c != before[i] and i not in exempt and (c >= 0 or charge_waiting):
                total += move[i]
        best = total if best is None else min(best, total)
    return best


def _most_placed(allowed):
    n_jobs, n_machines = allowed.shape
    most = 0

    def extend(i, used, placed):
        nonlocal most
        most = max(most, placed)
        if i == n_jobs or placed + (n_jobs - i) <= most:
            return
        for m in range(n_machines):
            if allowed[i, m] and m not in used:
                extend(i + 1, used | {m}, placed + 1)
        extend(i + 1, used, placed)

    extend(0, frozenset(), 0)
    return most


@st.composite
def shops_with_a_plan(draw):
    n_jobs = draw(st.integers(1, 5))
    n_machines = draw(st.integers(1, 4))
    rng = np.random.default_rng(draw(st.integers(0, 2**32 - 1)))
    values = rng.integers(0, 6, (n_jobs, n_machines)).astype(float)
    allowed = rng.random((n_jobs, n_machines)) < draw(st.sampled_from([1.0, 0.75]))
    penalty = rng.integers(0, 8, n_jobs).astype(float)
    move = rng.integers(0, 8, n_jobs).astype(float)
    n_new = draw(st.integers(1, 2))
    new_values = rng.integers(0, 6, (n_new, n_machines)).astype(float)
    new_allowed = rng.random((n_new, n_machines)) < 0.8
    down = draw(st.sampled_from([None] + list(range(n_machines))))
    return values, allowed, penalty, move, new_values, new_allowed, down


# --------------------------------------------------------------------------- engine

def engine_case(case):
    values, allowed, penalty, move, new_values, new_allowed, down = case
    prev = solve(values, allowed, wait_penalty=penalty)
    n_new = len(new_values)
    all_values = np.vstack([values, new_values])
    all_allowed = np.vstack([allowed, new_allowed])
    if down is not None:
        all_allowed[:, down] = False
    all_penalty = np.r_[penalty, np.zeros(n_new)]
    must = np.r_[np.zeros(len(values), bool), np.ones(n_new, bool)]
    before = np.r_[prev.machine_of_job, np.full(n_new, -1)]
    moves = np.r_[move, np.zeros(n_new)]
    kw = dict(machines_down=[] if down is None else [down], new_jobs=new_values,
              new_allowed=new_allowed, new_wait_penalty=np.zeros(n_new),
              new_must_run=np.ones(n_new, bool), move_penalty=moves)
    return prev, kw, (all_values, all_allowed, all_penalty, must, before, moves)


@pytest.mark.slow
@settings(max_examples=400, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(shops_with_a_plan())
def test_engine_rush_arrival_with_move_penalties_equals_brute_force(case):
    prev, kw, problem = engine_case(case)
    expect = best_by_enumeration(*problem)
    try:
        warm = redispatch(prev, **kw)
    except InfeasibleError:
        assert expect is None, "brute force places every rush job"
        return
    assert expect is not None
    assert warm.verify()
    assert warm.total == pytest.approx(expect)
    all_values, _, all_penalty, _, before, moves = problem
    # The total by the definition, recomputed from the plan with the grid values.
    plan = warm.machine_of_job
    own = sum(all_values[i, c] if c >= 0 else all_penalty[i] for i, c in enumerate(plan))
    own += sum(moves[i] for i, c in enumerate(plan) if before[i] >= 0 and c != before[i])
    assert warm.total == pytest.approx(own)


# --------------------------------------------------------------------------- shop

def shop_case(case):
    """The same draw as a shop: plan in force = the cold plan; a rush job arrives."""
    values, allowed, penalty, move, new_values, new_allowed, down = case
    n_jobs, n_machines = values.shape
    new = new_values[:1]
    shop = Shop(name="invented move-penalty shop")
    shop.machines = [Machine(id=f"M{k}", name=f"Machine {k}") for k in range(n_machines)]
    shop.jobs = [Job(id=f"J{i}", name=f"WO-{i}", wait_penalty=float(penalty[i]),
                     move_penalty=float(move[i])) for i in range(n_jobs)]
    shop.jobs.append(Job(id="R", name="WO-rush", wait_penalty=0.0))
    all_values = np.vstack([values, new])
    all_allowed = np.vstack([allowed, new_allowed[:1]])
    shop.grid = {(f"J{i}" if i < n_jobs else "R", f"M{k}"): float(all_values[i, k])
                 for i in range(n_jobs + 1) for k in range(n_machines) if all_allowed[i, k]}
    prev = solve(values, allowed, wait_penalty=penalty)
    shop.plan_in_force = {f"M{k}": [f"J{i}"] for i, k in enumerate(prev.machine_of_job) if k >= 0}
    events = [ShopEvent("rush", "WO-rush")]
    exempt = ()
    if down is not None:
        events.append(ShopEvent("down", f"Machine {down}"))
        all_allowed[:, down] = False
        exempt = tuple(i for i, k in enumerate(prev.machine_of_job) if k == down)
    penalties = np.r_[penalty, 0.0]
    must = np.zeros(n_jobs + 1, bool)  # a rush job is a priority, not a hard constraint
    before = np.r_[prev.machine_of_job, -1]
    moves = np.r_[move, 0.0]
    return shop, events, (all_values, all_allowed, penalties, must, before, moves, exempt), \
        np.r_[np.zeros(n_jobs, bool), True]


@pytest.mark.slow
@settings(max_examples=300, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(shops_with_a_plan())
def test_shop_rush_arrival_with_move_penalties_equals_brute_force(case):
    shop, events, problem, rush = shop_case(case)
    expect = best_by_enumeration(*problem, rush=rush)
    try:
        out = redispatch_shop(shop, events)
    except ShopInfeasibleError:
        assert expect is None, "brute force places the rush job"
        return
    assert expect is not None
    assert out.result.verify()
    grid_total = out.plan.total  # setups and wait penalties of the new plan
    assert grid_total + out.move_penalties_paid == pytest.approx(expect)


def test_the_cases_that_matter_are_drawn():
    # Draws like the ones above often have a job placed in force left waiting whose move
    # penalty changes the best total: brute force with and without that penalty differ.
    rng = np.random.default_rng(0)
    found = 0
    for _ in range(300):
        n_jobs, n_machines = int(rng.integers(1, 6)), int(rng.integers(1, 5))
        case = (rng.integers(0, 6, (n_jobs, n_machines)).astype(float),
                rng.random((n_jobs, n_machines)) < 0.9, rng.integers(0, 8, n_jobs).astype(float),
                rng.integers(0, 8, n_jobs).astype(float),
                rng.integers(0, 6, (1, n_machines)).astype(float),
                rng.random((1, n_machines)) < 0.8, None)
        _, _, problem = engine_case(case)
        with_move = best_by_enumeration(*problem)
        if with_move is not None:
            found += with_move != best_by_enumeration(*problem, charge_waiting=False)
    assert found >= 10
