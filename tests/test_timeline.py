"""The whole-shift timeline's lanes (shop/timeline.py), checked against the sample files
read as plain JSON: each job bar lasts its run hours times the machine's speed factor,
each changeover bar the table's minutes from the previous family, nothing overlaps and no
lane runs past its machine's hours."""

from __future__ import annotations

import json

import pytest

from dispatcher.io.shopfile import load_shop, save_shop
from dispatcher.shop.fill_shift import fill_shop_shift
from dispatcher.shop.timeline import CHANGE, END_CHANGE, JOB, RUNNING, shift_timeline

PRINT = "print_plant_changeovers.dshop"


def small_print_plant(samples, tmp_path, keep=("J1", "J2", "J3", "J4", "J7", "J13", "J14", "J15")):
    """The print-plant sample cut down to a few jobs (fast to prove optimal), saved."""
    shop = load_shop(samples / PRINT)
    shop.jobs = [j for j in shop.jobs if j.id in keep]
    path = tmp_path / "small_print.dshop"
    save_shop(shop, path)
    return path


def _raw(path):
    data = json.loads(path.read_text(encoding="utf-8"))
    tables = {}
    for t in data["changeover_tables"]:
        changes = {(a, b): v for a, row in t["changes"].items() for b, v in row.items()}
        changes.update({(None, b): v for b, v in t.get("from_empty", {}).items()})
        for mid in t["machines"]:
            tables[mid] = changes
    return data, tables


def test_print_plant_lanes_follow_the_tables(samples, tmp_path):
    path = small_print_plant(samples, tmp_path)
    data, tables = _raw(path)
    machines = {m["name"]: m for m in data["machines"]}
    jobs = {j["name"]: j for j in data["jobs"]}
    shop = load_shop(path)
    fill = fill_shop_shift(shop, time_limit=20)
    lanes = shift_timeline(shop, fill)
    assert [lane.machine for lane in lanes] == [m.machine for m in fill.machines]
    placed = []
    for lane in lanes:
        m = machines[lane.machine]
        assert lane.used() <= lane.capacity + 1e-9
        previous_end, family = 0.0, m["mounted"]
        for bar in lane.bars:
            assert bar.start >= previous_end - 1e-9 and bar.end >= bar.start
            if bar.kind == CHANGE:
                minutes = tables[m["id"]][(family, jobs[bar.job]["family"])]
                assert bar.end - bar.start == pytest.approx(minutes / 60, abs=1e-5)  # hours kept to 6 places
            elif bar.kind == JOB:
                job = jobs[bar.job]
                assert bar.end - bar.start == pytest.approx(job["run_hours"] * m.get("speed_factor", 1.0), abs=1e-5)
                assert bar.from_family == family and bar.family == job["family"]
                change = tables[m["id"]][(family, job["family"])]
                assert bar.changeover == change
                if change == 0:  # a change that costs nothing gets no bar of its own
                    assert not any(b.kind == CHANGE and b.job == bar.job for b in lane.bars)
                family = job["family"]
                placed.append(bar.job)
            elif bar.kind == END_CHANGE:
                assert bar.family == m["end_family"]
                assert bar.changeover == tables[m["id"]][(family, m["end_family"])]
            previous_end = bar.end
    assert sorted(placed) == sorted(a.job for a in fill.assignments)
    assert any(lane.machine == "Sheet press A" and lane.bars[-1].kind == END_CHANGE for lane in lanes)


def test_plain_grid_lanes_use_the_hours(samples):
    path = samples / "medium_machining_shop.dshop"
    data = json.loads(path.read_text(encoding="utf-8"))
    jobs = {j["name"]: j for j in data["jobs"]}
    machines = {m["name"]: m for m in data["machines"]}
    shop = load_shop(path)
    fill = fill_shop_shift(shop, time_limit=20)
    lanes = shift_timeline(shop, fill)
    kinds = {b.kind for lane in lanes for b in lane.bars}
    assert CHANGE not in kinds and RUNNING in kinds and JOB in kinds
    for lane in lanes:
        t = 0.0
        for bar in lane.bars:
            assert bar.start == pytest.approx(t)
            pair = data.get("hours", {}).get(jobs[bar.job]["id"], {}).get(machines[lane.machine]["id"])
            hours = (
                pair
                if pair is not None
                else jobs[bar.job]["run_hours"] * machines[lane.machine].get("speed_factor", 1.0)
            )
            assert bar.end - bar.start == pytest.approx(hours)
            t = bar.end
        assert lane.used() <= lane.capacity + 1e-9
