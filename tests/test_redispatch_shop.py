"""Shop-level re-dispatch (dispatcher.shop.redispatch) against brute-force enumeration.

Reference: every way to give the waiting jobs of the shop after the event a free slot or
leave them waiting, enumerated by brute force, scored by the rules in the module docstring
(grid value, wait penalty, move penalty for a dispatched job that is moved off a machine
that is still up). Shops are random and invented for the test.
"""

from __future__ import annotations

import itertools

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from helpers_shops import small_shop

from dispatcher.shop import (
    DOWN,
    MUST,
    MUST_NOT,
    RUNNING,
    UP,
    WAITING,
    Job,
    Machine,
    Pin,
    Shop,
    ShopError,
    solve_shop,
)
from dispatcher.shop.redispatch import ShopEvent, apply_events, redispatch_shop


def random_shop(rng: np.random.Generator) -> Shop:
    n_jobs, n_machines = int(rng.integers(1, 6)), int(rng.integers(1, 4))
    shop = Shop(name="test shop (invented)", move_penalty=float(rng.integers(0, 4)))
    shop.machines = [Machine(id=f"M{k}", name=f"Machine {k}", slots=int(rng.integers(1, 3)),
                             state=UP if rng.random() < 0.85 else DOWN)
                     for k in range(n_machines)]
    shop.jobs = [Job(id=f"J{i}", name=f"Job {i}", wait_penalty=float(rng.integers(0, 8)),
                     rush=bool(rng.random() < 0.15),
                     move_penalty=None if rng.random() < 0.7 else float(rng.integers(0, 4)))
                 for i in range(n_jobs)]
    for j in shop.jobs:
        for m in shop.machines:
            if rng.random() < 0.8:
                shop.grid[(j.id, m.id)] = float(rng.integers(0, 6))
    # Some jobs already running on machines that are up and can run them.
    used = {m.id: 0 for m in shop.machines}
    for j in shop.jobs:
        if rng.random() < 0.25:
            for m in shop.machines:
                if m.state == UP and used[m.id] < m.slots and (j.id, m.id) in shop.grid:
                    j.state, j.machine = RUNNING, m.id
                    j.rush = False
                    used[m.id] += 1
                    break
    if rng.random() < 0.3:
        j = shop.jobs[int(rng.integers(n_jobs))]
        m = shop.machines[int(rng.integers(n_machines))]
        if j.state == WAITING and (j.id, m.id) in shop.grid:
            shop.pins.append(Pin(j.id, m.id, MUST_NOT))
    return shop


def brute_force_total(shop: Shop, after: Shop, in_force: dict[str, str], left: set[str],
                      move_default: float | None) -> float | None:
    """Least total over the plans of ``after`` with the most jobs placed and, among those,
    the most rush (or pinned) jobs placed (rush is a priority, so a plan always exists)."""
    rows = [j for j in after.jobs if j.state == WAITING and j.id not in left]
    free = {}
    for m in after.machines:
        running = sum(1 for j in after.jobs if j.state == RUNNING and j.machine == m.id)
        free[m.id] = m.slots - running if m.state == UP else 0
    best: tuple[int, int, float] | None = None
    options = []
    rush_rows = []
    for j in rows:
        pins = [p for p in after.pins if p.job == j.id]
        must_on = [p.machine for p in pins if p.kind == MUST]
        never = {p.machine for p in pins if p.kind == MUST_NOT}
        choices = [m.id for m in after.machines if (j.id, m.id) in after.grid
                   and free[m.id] > 0 and m.id not in never
                   and (not must_on or m.id in must_on)]
        rush_rows.append(j.rush or bool(must_on))
        options.append(choices + [None])
    for combo in itertools.product(*options):
        load = {}
        for k in combo:
            if k is not None:
                load[k] = load.get(k, 0) + 1
        if any(load[k] > free[k] for k in load):
            continue
        total = 0.0
        for j, k in zip(rows, combo):
            total += after.grid[(j.id, k)] if k is not None else j.wait_penalty
            was = in_force.get(j.id)
            if was is not None and after.machine(was).state == UP and k != was:
                p = j.move_penalty if j.move_penalty is not None else (
                    move_default if move_default is not None else after.move_penalty)
                total += p
        placed = sum(k is not None for k in combo)
        rush_placed = sum(k is not None and r for k, r in zip(combo, rush_rows))
        key = (-placed, -rush_placed, total)
        if best is None or key < best:
            best = key
    return None if best is None else best[2]


def random_event(shop: Shop, rng: np.random.Generator) -> list[ShopEvent]:
    kind = ["down", "up", "rush", "done", "pulled"][int(rng.integers(5))]
    if kind in ("down", "up"):
        return [ShopEvent(kind, shop.machines[int(rng.integers(len(shop.machines)))].name)]
    candidates = [j for j in shop.jobs if (j.state == WAITING if kind == "rush" else True)]
    if not candidates:
        return [ShopEvent("down", shop.machines[0].name)]
    return [ShopEvent(kind, candidates[int(rng.integers(len(candidates)))].name)]


@settings(max_examples=80, deadline=None)
@given(st.integers(0, 2**32 - 1), st.sampled_from([None, 0.0, 2.0]))
def test_new_plan_is_the_best_by_brute_force(seed, move_default):
    rng = np.random.default_rng(seed)
    shop = random_shop(rng)
    shop.plan_in_force = solve_shop(shop).in_force(shop)
    events = random_event(shop, rng)
    after, left_idx, _ = apply_events(shop, events)
    left = {shop.jobs[i].id for i in left_idx}
    in_force = {jid: mid for mid, jids in shop.plan_in_force.items() for jid in jids}
    expected = brute_force_total(shop, after, in_force, left, move_default)
    # Rush jobs are a priority: a plan always exists (never ShopInfeasibleError).
    out = redispatch_shop(shop, events, move_penalty=move_default)
    assert out.plan.certificate["verified"]
    assert out.plan.total + out.move_penalties_paid == pytest.approx(expected)
    # Running jobs on machines that stay up keep running there.
    for j in shop.jobs:
        if j.state == RUNNING and after.machine(j.machine).state == UP and j.id not in left:
            assert out.plan.machine_of(j.name) == shop.machine(j.machine).name
    # A job running on a machine that went down is no longer running there.
    for ev in events:
        if ev.kind == "down":
            assert all(r.machine != ev.name for r in out.plan.running)
            assert all(a.machine != ev.name for a in out.plan.assignments)
    # The changes are exactly the jobs whose machine differs from the plan in force.
    names = {m.id: m.name for m in shop.machines}
    for j in after.jobs:
        if j.id in left:
            assert [(c.before, c.after, c.left) for c in out.changes if c.job == j.name] == [
                (names.get(in_force.get(j.id)), None, events[0].kind)]
            continue
        if j.state not in (WAITING, RUNNING):
            continue
        before = names.get(in_force.get(j.id))
        now = out.plan.machine_of(j.name)
        listed = [c for c in out.changes if c.job == j.name]
        assert (before != now) == bool(listed)
        if listed:
            assert (listed[0].before, listed[0].after) == (before, now)


def test_machine_down_moves_the_running_job_and_reports_the_difference():
    shop = small_shop()
    out = redispatch_shop(shop, [ShopEvent("down", "Press A")])
    # By hand: only Press B and the Saw are free, so two of WO-1..WO-4 run. Moving WO-2 or
    # WO-3 costs 4. WO-2 on B (10) + WO-3 on Saw (9) + WO-4 waits (1) + WO-1 waits (0) = 20
    # beats e.g. WO-1 on B (6) + WO-3 on Saw (9) + WO-2 waits (30 + 4) + WO-4 (1) = 50 and
    # WO-3 on B (2 + 4) + WO-4 on Saw (8) + WO-2 waits (34) = 48.
    assert out.plan.total == 20
    assert out.move_penalties_paid == 0
    assert [(c.job, c.before, c.after) for c in out.changes] == [("WO-1", "Press A", None)]
    assert out.now_waiting == ["WO-1"]
    assert out.machines_now_idle == []
    # In force: WO-2 on B (10) + WO-3 on S (9) + WO-4 waits (1) = 20; WO-1 ran (not counted).
    assert out.total_in_force == 20
    assert out.total_change == 0
    assert "Press A" in out.plan.unavailable_machines
    assert shop.machine("A").state == UP  # the shop passed in is untouched


def test_move_penalty_decides_whether_a_dispatched_job_moves():
    shop = small_shop()
    shop.grid[("J2", "S")] = 1.0  # WO-2 would be cheaper on the saw, WO-3 on Press B
    stay = redispatch_shop(shop, [ShopEvent("done", "WO-4")], move_penalty=100.0)
    assert [(c.job, c.left) for c in stay.changes] == [("WO-4", "done")]
    moved = redispatch_shop(shop, [ShopEvent("done", "WO-4")], move_penalty=0.0)
    # Without a penalty: WO-2 on S (1) + WO-3 on B (2) = 3 beats 10 + 9 = 19.
    assert moved.plan.total == 3
    assert {(c.job, c.before, c.after) for c in moved.moved} == {
        ("WO-2", "Press B", "Saw"), ("WO-3", "Saw", "Press B")}


def test_rush_job_arrival_and_done_job():
    shop = small_shop()
    shop.jobs.append(Job(id="J5", name="WO-5"))
    shop.grid[("J5", "S")] = 4.0
    out = redispatch_shop(shop, [ShopEvent("rush", "WO-5"), ShopEvent("done", "WO-1")])
    assert out.plan.machine_of("WO-5") == "Saw"
    assert "WO-5" in out.newly_dispatched
    # A job that finished is a change too: it leaves its machine.
    assert [(c.before, c.after, c.left) for c in out.changes if c.job == "WO-1"] == [
        ("Press A", None, "done")]
    assert [c.job for c in out.left_round] == ["WO-1"]


@pytest.mark.parametrize("events, message", [
    ([ShopEvent("down", "Press Z")], "no machine named 'Press Z'"),
    ([ShopEvent("done", "WO-9")], "no job named 'WO-9'"),
    ([ShopEvent("rush", "WO-1")], "a job that arrives must be waiting"),
    ([ShopEvent("explode", "Press A")], "kind must be one of"),
])
def test_bad_events_name_the_event(events, message):
    with pytest.raises(ShopError, match=message):
        redispatch_shop(small_shop(), events, source="shop.dshop")


def test_plan_in_force_naming_unknown_ids_is_refused():
    with pytest.raises(ShopError, match="job id 'J9' is not a job of the shop"):
        redispatch_shop(small_shop(), [ShopEvent("down", "Saw")], plan_in_force={"A": ["J9"]})


def test_without_penalties_matches_a_cold_solve_of_the_shop_after_the_event():
    # Reference: the shop translator's own cold solve (dispatcher.shop.solve_shop -> scipy).
    rng = np.random.default_rng(3)
    for _ in range(30):
        shop = random_shop(rng)
        # Rush jobs are a priority, so both solves have a plan (never ShopInfeasibleError).
        shop.plan_in_force = solve_shop(shop).in_force(shop)
        events = random_event(shop, rng)
        after, left, _ = apply_events(shop, events)
        for i in left:
            after.jobs[i].state = "done"
        ref = solve_shop(after)
        for j in shop.jobs:
            j.move_penalty = None
        out = redispatch_shop(shop, events, move_penalty=0.0)
        assert out.plan.total == pytest.approx(ref.total)


def test_total_in_force_counts_the_arriving_rush_job_as_waiting():
    shop = small_shop()
    shop.jobs.append(Job(id="J5", name="WO-5", wait_penalty=50.0))
    shop.grid[("J5", "S")] = 4.0
    out = redispatch_shop(shop, [ShopEvent("rush", "WO-5")])
    # The plan in force on the shop after the event: WO-2 on B (10) + WO-3 on Saw (9) +
    # WO-4 waits (1) + WO-5 waits (50) = 70.
    assert out.total_in_force == 70
    assert out.total_change == pytest.approx(out.plan.total - 70)


def _usable_slots(after: Shop, job: Job) -> dict[str, int]:
    """Machine name -> free slots the job could take in ``after`` (read off the shop)."""
    out = {}
    for m in after.machines:
        if m.state != UP or (job.id, m.id) not in after.grid:
            continue
        pins = [p for p in after.pins if p.job == job.id]
        if any(p.kind == MUST_NOT and p.machine == m.id for p in pins):
            continue
        if any(p.kind == MUST and p.machine != m.id for p in pins):
            continue
        running = sum(1 for j in after.jobs if j.state == RUNNING and j.machine == m.id)
        if m.slots - running > 0:
            out[m.name] = m.slots - running
    return out


def _witness_holds_in_the_shop(after: Shop, jobs: list[str], machines: list[str]) -> bool:
    """Hall's condition fails for the named jobs, checked on the shop itself: every free
    slot they could take is on a named machine, and those slots are fewer than the jobs."""
    named = set(machines)
    slots: dict[str, int] = {}
    for name in jobs:
        usable = _usable_slots(after, after.job_by_name(name))
        if not set(usable) <= named:
            return False
        slots.update(usable)
    return sum(slots.values()) < len(jobs)


@settings(max_examples=120, deadline=None)
@given(st.integers(0, 2**32 - 1))
def test_every_named_witness_after_a_breakdown_matches_the_shop(seed):
    # Regression: witnesses after an event were read with the rows of the state after the
    # event in their own order, not in the order of the warm re-dispatch, so they named
    # the wrong jobs. Reference: Hall's condition checked by hand on the shop document.
    rng = np.random.default_rng(seed)
    shop = random_shop(rng)
    for j in shop.jobs:
        j.rush = j.rush or bool(rng.random() < 0.3)
    shop.plan_in_force = solve_shop(shop).in_force(shop)
    events = [random_event(shop, rng), [ShopEvent("down", shop.machines[0].name)]][
        int(rng.integers(2))]
    out = redispatch_shop(shop, events)
    after = out.shop
    for job, reason in out.plan.waiting_reasons.items():
        assert job in reason.competing_jobs
        assert _witness_holds_in_the_shop(after, reason.competing_jobs, reason.machines), job
    rush_named = set()
    for group in out.plan.rush_groups:
        assert all(after.job_by_name(n).rush or any(
            p.kind == MUST for p in after.pins_of(after.job_by_name(n).id)) for n in group.jobs)
        assert _witness_holds_in_the_shop(after, group.jobs, group.machines)
        rush_named |= set(group.waiting)
    assert rush_named == set(out.plan.rush_waiting)


def test_breakdown_of_a_rush_jobs_press_names_the_rush_jobs_competing_for_the_presses():
    # Regression (small moulding cell, invented): after the plan is put in force, a
    # breakdown named two ordinary jobs and refused to plan. Now the plan is produced and
    # the rush jobs competing for the remaining presses are named.
    from pathlib import Path

    from dispatcher.io.shopfile import load_shop

    shop = load_shop(Path(__file__).parent.parent / "sample_shops" / "small_moulding_cell.dshop")
    shop.plan_in_force = solve_shop(shop).in_force(shop)
    out = redispatch_shop(shop, [ShopEvent("down", "Press 120t")])
    assert out.plan.rush_waiting == ["WO-7001 lid"]
    (group,) = out.plan.rush_groups
    assert sorted(group.jobs) == ["WO-7001 lid", "WO-7003 housing", "WO-7004 knob"]
    assert sorted(group.machines) == ["Press 200t", "Press 80t"]
    assert _witness_holds_in_the_shop(out.shop, group.jobs, group.machines)
    pinned = redispatch_shop(shop, [ShopEvent("down", "Press 200t")])
    assert pinned.plan.rush_waiting == ["WO-7003 housing"]
    assert "Press 200t is down" in pinned.plan.waiting_reasons["WO-7003 housing"].text
