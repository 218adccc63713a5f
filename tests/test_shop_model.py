"""The shop model and its translation to the engine.

References outside the translation under test:
* brute-force enumeration of every way to place the waiting jobs, straight from the
  definition in dispatcher/shop/translate.py (up machines only, free slots, pins, rush jobs
  placed, as many jobs placed as possible, then the best total);
* dispatcher.engine.solve on the expanded matrix written out independently in this file.
"""

from __future__ import annotations

import itertools
import math
import random
from datetime import datetime

import numpy as np
import pytest

from dispatcher.engine import solve
from dispatcher.shop import (
    DOWN,
    MAINTENANCE,
    MUST,
    MUST_NOT,
    RUNNING,
    UP,
    Job,
    Machine,
    Pin,
    Plan,
    Shop,
    ShopError,
    ShopInfeasibleError,
    build_problem,
    shop_from_grid,
    shop_problems,
    solve_shop,
)


def random_shop(rng: random.Random) -> Shop:
    """A small consistent shop: states, slots, running jobs, pins, rush jobs, penalties."""
    n_jobs, n_machines = rng.randint(1, 6), rng.randint(1, 4)
    shop = Shop(name="random")
    for k in range(n_machines):
        state = rng.choices([UP, DOWN, MAINTENANCE], weights=[6, 1, 1])[0]
        shop.machines.append(Machine(id=f"M{k}", name=f"m{k}", state=state, slots=rng.randint(1, 3)))
    for i in range(n_jobs):
        shop.jobs.append(Job(id=f"J{i}", name=f"j{i}", rush=rng.random() < 0.2,
                             wait_penalty=rng.choice([0, 0, 3, 10, 40])))
        for m in shop.machines:
            if rng.random() < 0.75:
                shop.grid[(f"J{i}", m.id)] = float(rng.randint(0, 20))
    # some jobs running on up machines with room
    for j in shop.jobs:
        if rng.random() < 0.2:
            room = [m for m in shop.machines if m.state == UP
                    and sum(x.machine == m.id for x in shop.jobs) < m.slots]
            if room:
                j.state, j.machine, j.since = RUNNING, rng.choice(room).id, datetime(2026, 1, 5, 6)
        elif rng.random() < 0.1:
            j.state = "done"
    for _ in range(rng.randint(0, 3)):
        j, m = rng.choice(shop.jobs), rng.choice(shop.machines)
        shop.pins.append(Pin(j.id, m.id, rng.choice([MUST, MUST_NOT])))
    # drop pins until the shop is consistent (pins are the only random source of problems)
    while shop_problems(shop) and shop.pins:
        shop.pins.pop()
    assert not shop_problems(shop)
    return shop


def brute_force(shop: Shop, objective: str):
    """Best (placed count, score, max value) over every placement allowed by the definition.

    Rush and must-pinned jobs are a priority: among the placements with the most jobs,
    only those with the most rush/pinned jobs placed count (never None).
    """
    waiting = [j for j in shop.jobs if j.state == "waiting"]
    up = [m for m in shop.machines if m.state == UP]
    free = {m.id: m.slots - sum(j.machine == m.id for j in shop.jobs if j.state == RUNNING)
            for m in up}
    forced = {p.job: p.machine for p in shop.pins if p.kind == MUST}
    banned = {(p.job, p.machine) for p in shop.pins if p.kind == MUST_NOT}
    options = []
    for j in waiting:
        opts = [None]
        for m in up:
            if (j.id, m.id) in shop.grid and (j.id, m.id) not in banned and \
                    forced.get(j.id, m.id) == m.id:
                opts.append(m.id)
        options.append(opts)
    best = None
    for choice in itertools.product(*options):
        load: dict[str, int] = {}
        for mid in choice:
            if mid is not None:
                load[mid] = load.get(mid, 0) + 1
        if any(load[m] > free[m] for m in load):
            continue
        placed = sum(c is not None for c in choice)
        rush = sum(c is not None and (j.rush or j.id in forced) for j, c in zip(waiting, choice))
        vals = [shop.grid[(j.id, c)] for j, c in zip(waiting, choice) if c is not None]
        pen = sum(j.wait_penalty for j, c in zip(waiting, choice) if c is None)
        if objective == "maximize":
            key = (-placed, -rush, -(sum(vals) - pen))
        elif objective == "bottleneck":
            key = (-placed, -rush, max(vals, default=0), sum(vals) + pen)
        else:
            key = (-placed, -rush, sum(vals) + pen)
        if best is None or key < best:
            best = key
    return best


def plan_key(plan: Plan, shop: Shop, objective: str):
    placed = len(plan.assignments)
    forced = {p.job for p in shop.pins if p.kind == MUST}
    rush = sum(1 for a in plan.assignments
               if shop.job_by_name(a.job).rush or shop.job_by_name(a.job).id in forced)
    vals = [a.cost for a in plan.assignments]
    if objective == "maximize":
        return (-placed, -rush, -plan.total)
    if objective == "bottleneck":
        return (-placed, -rush, max(vals, default=0), plan.total)
    return (-placed, -rush, plan.total)


def check_plan_rules(plan: Plan, shop: Shop) -> None:
    """The plan obeys the definition: states, slots, pins, rush jobs, running jobs kept."""
    assert plan.verified
    running = {j.name: shop.machine(j.machine).name for j in shop.jobs if j.state == RUNNING}
    assert {r.job: r.machine for r in plan.running} == running
    load: dict[str, int] = {}
    for a in plan.assignments:
        j, m = shop.job_by_name(a.job), shop.machine_by_name(a.machine)
        assert j.state == "waiting" and m.state == UP
        assert shop.value(j.id, m.id) == a.cost
        load[m.name] = load.get(m.name, 0) + 1
    for m in shop.machines:
        assert load.get(m.name, 0) + sum(1 for r in running.values() if r == m.name) <= m.slots
        if m.state != UP:
            assert m.name in plan.unavailable_machines and m.name not in load
    for p in shop.pins:
        j, m = shop.job(p.job), shop.machine(p.machine)
        if j.state != "waiting":
            continue
        if p.kind == MUST:
            assert plan.machine_of(j.name) in (m.name, None)
            assert (plan.machine_of(j.name) is None) == (j.name in plan.rush_waiting)
        else:
            assert plan.machine_of(j.name) != m.name
    for j in shop.jobs:
        if j.rush and j.state == "waiting":
            assert (plan.machine_of(j.name) is not None) != (j.name in plan.rush_waiting)
    waiting = {j.name for j in shop.jobs if j.state == "waiting"} - {a.job for a in plan.assignments}
    assert set(plan.waiting_jobs) == waiting
    assert set(plan.waiting_reasons) == waiting


@pytest.mark.parametrize("objective", ["total", "maximize", "bottleneck"])
def test_random_shops_match_brute_force(objective):
    rng = random.Random(20260314 + len(objective))
    rush_left = 0
    for _ in range(150):
        shop = random_shop(rng)
        expected = brute_force(shop, objective)  # reference: brute-force enumeration
        plan = solve_shop(shop, objective)  # rush is a priority: never infeasible
        check_plan_rules(plan, shop)
        got = plan_key(plan, shop, objective)
        assert got[:2] == expected[:2]
        assert all(math.isclose(a, b, abs_tol=1e-9) for a, b in zip(got[2:], expected[2:]))
        rush_left += bool(plan.rush_waiting)
    assert 0 < rush_left < 150  # both kinds of shop were compared


def expanded_matrix(shop: Shop):
    """The expanded engine problem written out by hand: rows waiting jobs, columns free slots."""
    waiting = [j for j in shop.jobs if j.state == "waiting"]
    cols = []
    for m in shop.machines:
        if m.state == UP:
            busy = sum(j.machine == m.id for j in shop.jobs if j.state == RUNNING)
            cols += [m] * (m.slots - busy)
    values = np.zeros((len(waiting), len(cols)))
    allowed = np.zeros(values.shape, dtype=bool)
    for i, j in enumerate(waiting):
        for c, m in enumerate(cols):
            v = shop.value(j.id, m.id)
            pins = [p for p in shop.pins if p.job == j.id]
            forced = [p.machine for p in pins if p.kind == MUST]
            if v is None or any(p.kind == MUST_NOT and p.machine == m.id for p in pins):
                continue
            if forced and forced[0] != m.id:
                continue
            values[i, c], allowed[i, c] = v, True
    rush = [i for i, j in enumerate(waiting)
            if j.rush or any(p.kind == MUST for p in shop.pins if p.job == j.id)]
    penalty = [j.wait_penalty for j in waiting]
    return values, allowed, rush, penalty


def test_random_shops_match_engine_on_expanded_matrix():
    rng = random.Random(7)
    compared = 0
    for _ in range(200):
        shop = random_shop(rng)
        values, allowed, rush, penalty = expanded_matrix(shop)
        ref = solve(values, allowed, rush=rush, wait_penalty=penalty)  # reference: engine
        plan = solve_shop(shop)
        assert math.isclose(plan.total, ref.total, abs_tol=1e-9)
        assert len(plan.assignments) == ref.planned_count
        compared += 1
    assert compared > 150


def test_two_slot_machine_takes_two_jobs():
    # Brute force by hand: 3 jobs, one 2-slot machine (values 1, 2, 9) and one 1-slot machine
    # that only job c can use at value 5. Best: a, b on the press (3), c on the saw (5) = 8.
    shop = Shop(jobs=[Job("a", "a"), Job("b", "b"), Job("c", "c")],
                machines=[Machine("P", "press", slots=2), Machine("S", "saw")])
    shop.grid = {("a", "P"): 1, ("b", "P"): 2, ("c", "P"): 9, ("c", "S"): 5}
    plan = solve_shop(shop)
    assert sorted(plan.jobs_on("press")) == ["a", "b"]
    assert plan.jobs_on("saw") == ["c"]
    assert plan.total == 8 and plan.waiting_jobs == [] and plan.idle_machines == []


def test_running_job_uses_a_slot_and_is_not_moved():
    shop = Shop(jobs=[Job("a", "a", state=RUNNING, machine="P"), Job("b", "b")],
                machines=[Machine("P", "press"), Machine("S", "saw")])
    shop.grid = {("a", "P"): 1, ("b", "P"): 0, ("b", "S"): 50}
    plan = solve_shop(shop)
    assert plan.machine_of("a") == "press" and plan.machine_of("b") == "saw"
    assert plan.total == 50  # the running job's setup is done and not counted


def test_down_machine_takes_nothing_and_reason_says_so():
    shop = Shop(jobs=[Job("a", "a")], machines=[Machine("P", "press", state=DOWN)])
    shop.grid = {("a", "P"): 1}
    plan = solve_shop(shop)
    assert plan.waiting_jobs == ["a"] and plan.unavailable_machines == ["press"]
    assert "press is down" in plan.waiting_reasons["a"].text
    assert plan.idle_machines == []


def test_rush_job_displaces_a_cheaper_job():
    shop = Shop(jobs=[Job("a", "a"), Job("r", "r", rush=True)], machines=[Machine("P", "press")])
    shop.grid = {("a", "P"): 1, ("r", "P"): 30}
    assert solve_shop(shop).machine_of("r") == "press"


def test_rush_jobs_over_one_machine_still_give_a_plan_naming_the_waiting_rush_job():
    shop = Shop(jobs=[Job("a", "a", rush=True), Job("b", "b", rush=True)],
                machines=[Machine("P", "press"), Machine("Q", "lathe")])
    shop.grid = {("a", "P"): 1, ("b", "P"): 2}
    plan = solve_shop(shop)
    assert plan.machine_of("a") == "press" and plan.rush_waiting == ["b"]
    (group,) = plan.rush_groups
    assert sorted(group.jobs) == ["a", "b"] and group.machines == ["press"]
    assert group.waiting == ["b"] and "so 1 of them must wait" in group.text
    data = plan.to_json()
    assert data["rush_waiting"] == ["b"] and data["rush_groups"][0]["machines"] == ["press"]
    assert Plan.from_json(data) == plan


def test_rush_conflict_on_two_presses_places_the_rush_jobs_and_the_ordinary_job_waits():
    # Presses P1, P2; rush jobs A and B run only on P1, rush job C only on P2, ordinary D on
    # either. Brute force by hand: C on P2 and one of A/B on P1; D waits.
    shop = Shop(jobs=[Job("A", "A", rush=True), Job("B", "B", rush=True),
                      Job("C", "C", rush=True), Job("D", "D")],
                machines=[Machine("P1", "P1"), Machine("P2", "P2")])
    shop.grid = {("A", "P1"): 3, ("B", "P1"): 4, ("C", "P2"): 5, ("D", "P1"): 1, ("D", "P2"): 1}
    plan = solve_shop(shop)
    assert plan.machine_of("C") == "P2" and plan.machine_of("D") is None
    assert plan.machine_of("A") == "P1" and plan.rush_waiting == ["B"]
    assert plan.rush_groups[0].machines == ["P1"]


def test_must_run_named_on_the_command_line_stays_a_hard_constraint():
    shop = Shop(jobs=[Job("a", "a", rush=True), Job("b", "b", work_order="WO-2")],
                machines=[Machine("P", "press")])
    shop.grid = {("a", "P"): 1, ("b", "P"): 2}
    assert solve_shop(shop, extra_must_run=["WO-2"]).machine_of("b") == "press"  # by work order
    shop.jobs[0].rush = False
    shop.jobs.append(Job("c", "c"))
    shop.grid[("c", "P")] = 1
    with pytest.raises(ShopInfeasibleError, match="press"):
        solve_shop(shop, extra_must_run=["b", "c"])


def test_plain_grid_shop_equals_engine_and_json_round_trip():
    values = np.array([[4.0, 1, 3], [2, 0, 5], [3, 2, 2], [7, 7, 7]])
    allowed = np.ones(values.shape, dtype=bool)
    allowed[0, 1] = False
    shop = shop_from_grid(list("abcd"), ["x", "y", "z"], values, allowed)
    plan = solve_shop(shop)
    ref = solve(values, allowed)  # reference: the engine on the same grid
    assert plan.total == ref.total
    data = plan.to_json()
    assert set(data) == {"status", "objective", "total", "assignments", "waiting_jobs",
                         "idle_machines", "bottleneck", "waiting_reasons", "wait_groups",
                         "certificate", "rush_waiting", "total_parts"}
    assert Plan.from_json(data) == plan


def test_in_force_maps_ids():
    shop = Shop(jobs=[Job("J1", "a", state=RUNNING, machine="M1"), Job("J2", "b")],
                machines=[Machine("M1", "press", slots=2)])
    shop.grid = {("J2", "M1"): 3}
    assert solve_shop(shop).in_force(shop) == {"M1": ["J1", "J2"]}


@pytest.mark.parametrize("mutate, match", [
    (lambda s: s.pins.extend([Pin("J1", "M1", MUST), Pin("J1", "M1", MUST_NOT)]), "both to and away"),
    (lambda s: s.pins.extend([Pin("J1", "M1", MUST), Pin("J2", "M1", MUST)]), "0 free slot|1 free slot"),
    (lambda s: s.pins.extend([Pin("J1", "M1", MUST), Pin("J1", "M2", MUST)]), "more than one machine"),
    (lambda s: s.pins.append(Pin("J9", "M1", MUST)), "unknown job id 'J9'"),
    (lambda s: s.pins.append(Pin("J1", "M9", MUST_NOT)), "unknown machine id 'M9'"),
    (lambda s: setattr(s.machines[0], "slots", -1), "slots.*whole number from 1"),
    (lambda s: (setattr(s.machines[0], "state", DOWN), setattr(s.jobs[0], "state", RUNNING),
                setattr(s.jobs[0], "machine", "M1")), "which is down"),
    (lambda s: s.jobs.append(Job("J1", "other")), "id 'J1'.*unique"),
    (lambda s: (s.jobs.clear(), s.grid.clear()), "no jobs"),
])
def test_inconsistent_shops_are_refused_with_location(mutate, match):
    shop = Shop(jobs=[Job("J1", "a"), Job("J2", "b")],
                machines=[Machine("M1", "press"), Machine("M2", "saw")])
    shop.grid = {("J1", "M1"): 1, ("J2", "M1"): 2, ("J1", "M2"): 3}
    mutate(shop)
    with pytest.raises(ShopError, match=match):
        solve_shop(shop)


def test_build_problem_repeats_columns_for_free_slots():
    shop = Shop(jobs=[Job("a", "a"), Job("r", "r", state=RUNNING, machine="P")],
                machines=[Machine("P", "press", slots=3), Machine("D", "drill", state=MAINTENANCE)])
    shop.grid = {("a", "P"): 1, ("a", "D"): 1}
    problem = build_problem(shop)
    assert problem.columns == [0, 0] and problem.rows == [0] and problem.unavailable == [1]


@pytest.mark.parametrize("change, match", [
    (lambda d: d.pop("total"), "field 'total': is missing"),
    (lambda d: d.update(objective="fastest"), "'fastest' is not one of"),
    (lambda d: d["assignments"].append({"job": "a", "machine": "x"}), r"assignments\[\d\], field 'cost'"),
    (lambda d: d.update(waiting_jobs="a"), "field 'waiting_jobs': expected a list"),
    (lambda d: d.update(total="12"), "field 'total': expected a number"),
])
def test_plan_from_json_names_the_bad_field(change, match):
    from dispatcher.shop import PlanFormatError
    shop = shop_from_grid(["a", "b"], ["x"], np.array([[1.0], [2.0]]))
    data = solve_shop(shop).to_json()
    change(data)
    with pytest.raises(PlanFormatError, match=match):
        Plan.from_json(data, "plan.json")


def test_plan_json_round_trip_with_running_and_unavailable():
    shop = Shop(jobs=[Job("J1", "a", state=RUNNING, machine="M1", since=datetime(2026, 1, 5, 6)),
                      Job("J2", "b")],
                machines=[Machine("M1", "press", slots=2), Machine("M2", "saw", state=DOWN)])
    shop.grid = {("J1", "M1"): 4, ("J2", "M1"): 3}
    plan = solve_shop(shop)
    data = plan.to_json()
    assert data["running"] == [{"job": "a", "machine": "press", "since": "2026-01-05T06:00:00", "cost": 4}]
    assert data["unavailable_machines"] == ["saw"]
    assert Plan.from_json(data) == plan
    assert plan.by_machine() == {"press": [("a", 4.0, True), ("b", 3.0, False)]}


def test_plan_json_with_a_wrong_wait_group_is_refused_with_its_field():
    shop = shop_from_grid(list("abc"), ["x"], np.array([[1.0], [2.0], [3.0]]),
                          np.ones((3, 1), dtype=bool))
    data = solve_shop(shop).to_json()
    # two jobs wait, and they compete for the one machine with the placed job: one group
    assert len(data["wait_groups"]) == 1 and len(data["wait_groups"][0]["jobs"]) == 3
    data["waiting_reasons"]["c"]["group"] = 5
    from dispatcher.shop import PlanFormatError

    with pytest.raises(PlanFormatError, match=r"waiting_reasons\['c'\], field 'group'"):
        Plan.from_json(data)
