"""``solve SHOP --fill-shift`` on shops with setup families: runs in order with changeovers.

Reference: brute force over every assignment and order (tests/helpers_sequencing.py)
on matrices built here straight from the table written in this file. Invented shop.
"""

from __future__ import annotations

import json

import numpy as np
import pytest

from dispatcher.cli import main
from dispatcher.io.shopfile import save_shop
from dispatcher.shop import ChangeoverTable, Job, Machine, Shop
from dispatcher.shop.fill_shift import fill_shop_shift
from tests.helpers_sequencing import brute_force_shift

FAM = ["red", "blue", "white"]
CHANGE = {("red", "red"): 0, ("red", "blue"): 30, ("red", "white"): 50,
          ("blue", "red"): 20, ("blue", "blue"): 0, ("blue", "white"): 35,
          ("white", "red"): 10, ("white", "blue"): 10, ("white", "white"): 0,
          (None, "red"): 15, (None, "blue"): 15, (None, "white"): 15}
JOBS = [("WO-1 flyer", "red", 1.5, 20), ("WO-2 label", "white", 2.0, 5), ("WO-3 box", "blue", 1.0, 40),
        ("WO-4 card", "red", 2.5, 10), ("WO-5 sleeve", "white", 1.0, 30)]


def print_plant(end_family=None) -> Shop:
    shop = Shop(name="Invented print plant", description="Invented demonstration data.")
    shop.shift.hours = 4.0
    shop.machines = [Machine("M1", "Press 1", mounted="white", end_family=end_family),
                     Machine("M2", "Press 2", mounted="red")]
    shop.jobs = [Job(f"J{n}", name, family=f, run_hours=h, wait_penalty=w)
                 for n, (name, f, h, w) in enumerate(JOBS, 1)]
    shop.changeover_tables = [ChangeoverTable("T1", "offset presses", ["M1", "M2"], FAM,
                                              {k: float(v) for k, v in CHANGE.items()})]
    return shop


def matrices(shop: Shop):
    n, m = len(JOBS), 2
    c = np.zeros((m, n + 1, n + 1))
    end = np.zeros((m, n + 1))
    for k, mach in enumerate(shop.machines):
        fams = [mach.mounted] + [f for _n, f, _h, _w in JOBS]
        for a in range(n + 1):
            for b in range(1, n + 1):
                c[k, a, b] = CHANGE[(fams[a], fams[b])]
            if mach.end_family:
                end[k, a] = CHANGE[(fams[a], mach.end_family)]
    hours = np.array([[h, h] for _n, _f, h, _w in JOBS])
    pen = np.array([w for *_x, w in JOBS], dtype=float)
    return c, end, hours, pen


@pytest.mark.parametrize("end_family", [None, "white"])
def test_plan_is_the_brute_force_optimum(end_family):
    shop = print_plant(end_family)
    fill = fill_shop_shift(shop)
    c, end, hours, pen = matrices(shop)
    placed, total = brute_force_shift(c, hours, np.array([4.0, 4.0]), end, pen, tau=1 / 60)
    assert fill.proven_optimal and fill.total == pytest.approx(total)
    assert sum(len(m.jobs) for m in fill.machines) == placed


def test_json_has_runs_with_changes_and_hours(tmp_path, capsys):
    path = tmp_path / "plant.dshop"
    save_shop(print_plant("white"), path)
    assert main(["solve", str(path), "--fill-shift", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert {"status", "total", "assignments", "waiting_jobs", "machines"} <= set(data)
    for mach in data["machines"]:
        prev = {"Press 1": "white", "Press 2": "red"}[mach["machine"]]
        t = 0.0
        assert [r["job"] for r in mach["runs"]] == mach["jobs"]
        for r in mach["runs"]:
            assert r["from_family"] == prev and r["changeover"] == CHANGE[(prev, r["to_family"])]
            assert r["start_hour"] == pytest.approx(t + r["changeover"] / 60, abs=1e-5)
            t = r["end_hour"]
            prev = r["to_family"]
        assert t <= 4.0 + 1e-9
    assert data["certificate"]["proven_optimal"] is True


def test_sheet_prints_each_change_and_the_planned_times():
    import datetime as dt

    from dispatcher.sheet.build import build_sheet
    from dispatcher.sheet.content import sheet_text

    shop = print_plant()
    shop.shift.start = dt.time(6, 0)
    fill = fill_shop_shift(shop)
    text = sheet_text(build_sheet(shop, fill))
    runs = {(m.machine, r["job"]): r for m in fill.machines for r in m.runs}
    assert runs
    for (machine, job), r in runs.items():
        if r["from_family"] != r["to_family"]:
            phrase = f"change from family {r['from_family']} to {r['to_family']}: {r['changeover']:g} min"
            assert phrase in text, phrase
        start = dt.datetime(2026, 1, 1, 6, 0) + dt.timedelta(hours=r["start_hour"])
        assert f"planned {start:%H:%M}-" in text
    # the cautions stay on the sheet
    assert "lockout/tagout" in text


def test_progress_is_reported_and_cancel_is_honoured():
    import threading

    from dispatcher.engine.fill_shift import ShiftCancelled

    seen = []
    fill_shop_shift(print_plant(), progress=seen.append)
    assert seen and all("changeovers" in t for t in seen)
    stop = threading.Event()
    stop.set()
    with pytest.raises(ShiftCancelled):
        fill_shop_shift(print_plant(), cancel=stop)
