"""Filling a shop's shift (dispatcher.shop.fill_shift) and ``dispatcher solve SHOP --fill-shift``.

References outside the code under test: brute-force enumeration of every plan of small
shops, applying the rules of dispatcher/shop/fill_shift.py's docstring and the shop document
definition of run hours (docs/shop-format.md) directly (:func:`brute_force_shop_fill`);
and, with one hour per job and one hour per machine, the one-to-one shop solve.
All shops here are invented test data.
"""

from __future__ import annotations

import itertools
import json
from datetime import datetime, timedelta

import numpy as np
import pytest

from dispatcher.cli import main
from dispatcher.io.shopfile import save_shop
from dispatcher.shop import (
    MUST,
    MUST_NOT,
    Job,
    Machine,
    Pin,
    Shift,
    Shop,
    ShopError,
    ShopInfeasibleError,
    solve_shop,
)
from dispatcher.shop.fill_shift import fill_shop_shift

CONTRACT_KEYS = {"status", "objective", "total", "assignments", "waiting_jobs",
                 "idle_machines", "bottleneck", "waiting_reasons", "certificate"}


def press_shop() -> Shop:
    """Invented shop: three machines (one down), five jobs, one running, one pinned."""
    shop = Shop(name="Invented press shop (test data)", shift=Shift(hours=8))
    shop.machines = [Machine("M1", "Laser"), Machine("M2", "Brake", speed_factor=1.5),
                     Machine("M3", "Punch", state="down")]
    shop.jobs = [
        Job("J1", "WO-1", run_hours=3, rush=True),
        Job("J2", "WO-2", run_hours=2, due=datetime(2026, 3, 14, 9)),
        Job("J3", "WO-3", run_hours=4, wait_penalty=50),
        Job("J4", "WO-4", run_hours=2, state="running", machine="M1"),
        Job("J5", "WO-5", run_hours=5, due=datetime(2026, 3, 14, 8)),
    ]
    for n, j in enumerate(shop.jobs, start=1):
        for m, v in (("M1", 5), ("M2", 7), ("M3", 1)):
            shop.grid[(j.id, m)] = v + n
    shop.pins = [Pin("J2", "M2")]
    return shop


def test_press_shop_plan_facts():
    fill = fill_shop_shift(press_shop())
    assert fill.proven_optimal and fill.verified
    by = {m.machine: m for m in fill.machines}
    # Brake: WO-1 (3 h x 1.5) and pinned WO-2 (2 h x 1.5) = 7.5 of 8 h; rush WO-1 first.
    assert by["Brake"].jobs == ["WO-1", "WO-2"] and by["Brake"].hours_used == 7.5
    # Laser: running WO-4 uses 2 h, 6 h left: WO-3 (4 h, wait penalty 50) beats WO-5 (5 h).
    assert by["Laser"].running == ["WO-4"] and by["Laser"].jobs == ["WO-3"]
    assert by["Laser"].hours_used == 6 and by["Laser"].capacity == 8
    assert "Punch" not in by and fill.unavailable_machines == ["Punch"]
    assert fill.waiting_jobs == ["WO-5"]
    assert fill.total == 8 + 8 + 9  # WO-3 on Laser, WO-1 and WO-2 on Brake


def shop_hours(shop: Shop, job: Job, machine: Machine) -> float | None:
    """Run hours by the document definition: the pair's entry, else run_hours x speed."""
    if (job.id, machine.id) in shop.hours:
        return shop.hours[(job.id, machine.id)]
    return None if job.run_hours is None else job.run_hours * machine.speed_factor


def brute_force_shop_fill(shop: Shop, maximize: bool):
    """Reference: every plan of the waiting jobs over the up machines; best (count, total).

    Returns (total, number of jobs run) or None when no plan runs every pinned job. Rush
    jobs are a priority: among the plans running the most jobs, the most rush jobs.
    """
    waiting = [j for j in shop.jobs if j.state == "waiting"]
    up = [m for m in shop.machines if m.state == "up"]
    free = {}
    for m in up:
        length = shop.shift.hours if m.shift_hours is None else m.shift_hours
        busy = sum(shop_hours(shop, j, m) for j in shop.jobs
                   if j.state == "running" and j.machine == m.id)
        free[m.id] = max(length * m.slots - busy, 0.0)
    best = None
    for choice in itertools.product([None] + up, repeat=len(waiting)):
        used = dict.fromkeys(free, 0.0)
        ok, total, count, rush = True, 0.0, 0, 0
        for j, m in zip(waiting, choice):
            pins = [p for p in shop.pins if p.job == j.id]
            forced = [p.machine for p in pins if p.kind == MUST]
            if m is None:
                ok &= not forced
                total += -j.wait_penalty if maximize else j.wait_penalty
                continue
            value = shop.grid.get((j.id, m.id))
            banned = any(p.kind == MUST_NOT and p.machine == m.id for p in pins)
            if value is None or banned or (forced and forced[0] != m.id):
                ok = False
                break
            used[m.id] += shop_hours(shop, j, m)
            total += value
            count += 1
            rush += j.rush
        if not ok or any(used[k] > free[k] + 1e-9 for k in free):
            continue
        key = (-count, -rush, -total if maximize else total)
        if best is None or key < best[0]:
            best = (key, total, count)
    return None if best is None else (best[1], best[2])


def random_shop(rng) -> Shop:
    shop = Shop(name="Invented random shop (test data)",
                shift=Shift(hours=float(rng.integers(4, 9))))
    n_machines, n_jobs = int(rng.integers(1, 4)), int(rng.integers(1, 6))
    shop.machines = [Machine(f"M{k}", f"Machine {k}",
                             state="up" if rng.random() < 0.85 else "down",
                             slots=int(rng.integers(1, 3)),
                             shift_hours=None if rng.random() < 0.5 else float(rng.integers(0, 9)),
                             speed_factor=float(rng.choice([0.5, 1.0, 1.5])))
                     for k in range(n_machines)]
    shop.jobs = [Job(f"J{i}", f"Job {i}", run_hours=float(rng.integers(1, 6)),
                     rush=bool(rng.random() < 0.2), wait_penalty=float(rng.integers(0, 20)),
                     due=datetime(2026, 3, 14) + timedelta(hours=int(rng.integers(0, 24))))
                 for i in range(n_jobs)]
    for j in shop.jobs:
        for m in shop.machines:
            if rng.random() < 0.8:
                shop.grid[(j.id, m.id)] = float(rng.integers(0, 30))
            if rng.random() < 0.2:
                shop.hours[(j.id, m.id)] = float(rng.integers(0, 6))
    up = [m for m in shop.machines if m.state == "up"]
    first = shop.jobs[0]
    if up and len(shop.jobs) > 1 and rng.random() < 0.3 and (first.id, up[0].id) in shop.grid:
        first.state, first.machine, first.rush = "running", up[0].id, False
    last = shop.jobs[-1]
    if up and last.state == "waiting" and rng.random() < 0.3:
        m = up[int(rng.integers(len(up)))]
        if (last.id, m.id) in shop.grid:
            shop.pins.append(Pin(last.id, m.id, MUST if rng.random() < 0.5 else MUST_NOT))
    return shop


@pytest.mark.parametrize("maximize", [False, True])
def test_against_brute_force_enumeration_of_shop_plans(maximize):
    rng = np.random.default_rng(4242 + maximize)
    solved = infeasible = 0
    for _ in range(60):
        shop = random_shop(rng)
        # Reference: brute-force enumeration under the documented shop rules.
        expected = brute_force_shop_fill(shop, maximize)
        if expected is None:
            with pytest.raises(ShopInfeasibleError, match="infeasible"):
                fill_shop_shift(shop, maximize=maximize)
            infeasible += 1
            continue
        fill = fill_shop_shift(shop, maximize=maximize)
        assert fill.verified and fill.proven_optimal
        assert fill.total == pytest.approx(expected[0])
        assert len(fill.assignments) == expected[1]
        for m in fill.machines:
            # A running job may overrun the shift by itself; planned jobs never add to that.
            assert m.hours_used <= m.capacity + 1e-9 or (m.running and not m.jobs) or \
                sum(shop_hours(shop, shop.job_by_name(j), shop.machine_by_name(m.machine))
                    for j in m.jobs) == 0
        solved += 1
    assert solved >= 30  # infeasible only through pins now (rush is a priority)


def test_one_hour_each_agrees_with_one_to_one_shop_solve():
    rng = np.random.default_rng(99)
    for _ in range(20):
        shop = random_shop(rng)
        shop.hours.clear()
        shop.shift.hours = 1.0
        shop.pins.clear()
        for m in shop.machines:
            m.slots, m.shift_hours, m.speed_factor, m.state = 1, None, 1.0, "up"
        for j in shop.jobs:
            j.run_hours, j.state, j.machine, j.rush = 1.0, "waiting", None, False
        # Reference: the one-to-one shop solve (scipy linear_sum_assignment, certified).
        one = solve_shop(shop)
        fill = fill_shop_shift(shop)
        assert fill.total == pytest.approx(one.total)
        assert len(fill.assignments) == len(one.assignments)
        assert all(len(m.jobs) <= 1 for m in fill.machines)


def test_several_jobs_pinned_to_one_machine_are_allowed_when_hours_permit():
    shop = press_shop()
    shop.pins = [Pin("J1", "M1"), Pin("J2", "M1")]  # one slot, but 3 h + 2 h fit in 6 h
    fill = fill_shop_shift(shop)
    assert fill.jobs_on("Laser")[:3] == ["WO-4", "WO-1", "WO-2"]


def test_missing_run_hours_are_located():
    shop = press_shop()
    shop.jobs[2].run_hours = None
    with pytest.raises(ShopError, match=r"job 'WO-3' \(id J3\), field 'run_hours': no run "
                                        r"hours on machine 'Laser' \(id M1\)"):
        fill_shop_shift(shop)


@pytest.mark.parametrize("change, message", [
    # WO-2 is pinned, so must-run too: 3 + 3 + 4 + 5 h on the quickest machines > 6 + 8 h.
    (lambda s: setattr(s.jobs[4], "rush", True) or setattr(s.jobs[2], "rush", True),
     r"infeasible: must-run jobs WO-1, WO-2, WO-3, WO-5 need at least 15 h \(each on its "
     r"quickest machine\) but their machines \(Laser, Brake\) have 14 h free"),
    # Without the pin 12 h of 14 h would do, but no packing exists (Brake is 1.5x slower).
    (lambda s: s.pins.clear() or setattr(s.jobs[4], "rush", True) or setattr(s.jobs[2], "rush", True),
     r"infeasible: must-run jobs WO-1, WO-3, WO-5 cannot all fit in the hours of their "
     r"machines \(Laser, Brake\): no plan runs them all"),
    (lambda s: setattr(s.jobs[4], "run_hours", 9.0) or setattr(s.jobs[4], "rush", True),
     r"infeasible: must-run job WO-5 fits on no machine: it needs at least 9 h, its "
     r"machines \(Laser, Brake\) have at most 8 h free"),
    (lambda s: s.pins.append(Pin("J3", "M2")),
     r"infeasible: jobs WO-2, WO-3 are pinned to Brake: they need 9 h, it has 8 h free"),
])
def test_infeasible_shops_name_jobs_and_machines(change, message):
    # Rush is a priority, so these name the jobs as must-run (a hard constraint).
    shop = press_shop()
    change(shop)
    must = [j.name for j in shop.jobs if j.rush and j.state == "waiting"]
    with pytest.raises(ShopInfeasibleError, match=message):
        fill_shop_shift(shop, source="press.dshop", extra_must_run=must)
    if "must-run" in message:  # without --must-run: a plan, rush jobs wait (pins stay hard)
        fill_shop_shift(shop, source="press.dshop")


def test_whole_shift_rush_jobs_that_do_not_fit_wait_and_are_named():
    shop = press_shop()
    shop.jobs[4].run_hours = 9.0
    shop.jobs[4].rush = True
    fill = fill_shop_shift(shop)
    assert shop.jobs[4].name in fill.rush_waiting
    assert fill.to_json()["rush_waiting"] == fill.rush_waiting


@pytest.fixture
def press_file(tmp_path):
    path = tmp_path / "press.dshop"
    save_shop(press_shop(), path)
    return path


def test_cli_fill_shift_json(press_file, capsys):
    assert main(["solve", str(press_file), "--fill-shift", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert CONTRACT_KEYS <= set(data)
    assert data["status"] == "optimal" and data["certificate"]["verified"] is True
    assert data["machines"] == [
        {"machine": "Laser", "jobs": ["WO-3"], "hours_used": 6, "capacity": 8,
         "running": ["WO-4"]},
        {"machine": "Brake", "jobs": ["WO-1", "WO-2"], "hours_used": 7.5, "capacity": 8,
         "running": []},
    ]
    assert data["waiting_jobs"] == ["WO-5"] and data["unavailable_machines"] == ["Punch"]


def test_cli_fill_shift_text_and_maximize(press_file, capsys):
    assert main(["solve", str(press_file), "--fill-shift", "--maximize",
                 "--time-limit", "30"]) == 0
    out = capsys.readouterr().out
    assert "Brake  (" in out and "Total value:" in out and "proven optimal" in out


@pytest.mark.parametrize("extra, code, message", [
    (["--bottleneck"], 2, "cannot be combined with --bottleneck"),
    (["--time-limit", "0"], 2, "--time-limit must be a number of seconds > 0"),
    (["--must-run", "WO-5,WO-3"], 3, "infeasible: must-run jobs"),
    (["--must-run", "Nobody"], 2, "must-run job 'Nobody': is not a waiting job"),
])
def test_cli_fill_shift_errors(press_file, capsys, extra, code, message):
    assert main(["solve", str(press_file), "--fill-shift", *extra]) == code
    err = capsys.readouterr().err
    assert message in err and err.count("\n") == 1


def test_cli_fill_shift_refuses_a_grid_file(samples, capsys):
    assert main(["solve", str(samples / "sheet_metal_grid.csv"), "--fill-shift"]) == 2
    assert "--fill-shift needs a shop document" in capsys.readouterr().err


def test_cli_fill_shift_record_keeps_run_order_in_history(press_file, tmp_path, capsys):
    # The recorded plan is the printed one: same jobs per machine, same run order.
    from dispatcher.history import HistoryStore

    history = tmp_path / "history.sqlite"
    assert main(["solve", str(press_file), "--fill-shift", "--json", "--record",
                 "--by", "Supervisor R", "--reason", "shift-start", "--history", str(history)]) == 0
    out = capsys.readouterr()
    printed = json.loads(out.out)
    assert "Recorded decision #1" in out.err
    decision = HistoryStore(history).get(1)
    assert decision.plan["machines"] == printed["machines"]
    assert decision.plan["total"] == printed["total"]
