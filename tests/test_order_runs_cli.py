"""``dispatcher order-runs``: one machine's best run order, checked by brute force.

Reference: every order of the jobs tried with itertools.permutations, each priced
straight from the changeover table written in this file (outside the shop model).
Invented moulding cell.
"""

from __future__ import annotations

import itertools
import json

import pytest

from dispatcher.cli import main
from dispatcher.io.shopfile import save_shop
from dispatcher.shop import ChangeoverTable, Job, Machine, Shop

FAMILIES = ["mould A", "mould B", "mould C"]
# Not metric: A -> C direct is dearer than A -> B -> C (a purge compound in between).
CHANGE = {("mould A", "mould A"): 0, ("mould A", "mould B"): 10, ("mould A", "mould C"): 60,
          ("mould B", "mould A"): 25, ("mould B", "mould B"): 2, ("mould B", "mould C"): 15,
          ("mould C", "mould A"): 30, ("mould C", "mould B"): 45, ("mould C", "mould C"): 0,
          (None, "mould A"): 20, (None, "mould B"): 20, (None, "mould C"): 20}
JOBS = [("WO-1 lid", "mould C", 1.0), ("WO-2 cap", "mould A", 0.5), ("WO-3 tray", "mould B", 2.0),
        ("WO-4 clip", "mould C", 1.5), ("WO-5 hinge", "mould B", 0.25), ("WO-6 knob", "mould A", 1.0)]


def cell(end_family=None) -> Shop:
    shop = Shop(name="Invented moulding cell", description="Invented demonstration data.")
    shop.machines = [Machine("M1", "Press 1", mounted="mould A", end_family=end_family),
                     Machine("M2", "Press 2")]
    shop.jobs = [Job(f"J{n}", name, family=fam, run_hours=h) for n, (name, fam, h) in enumerate(JOBS, 1)]
    shop.changeover_tables = [ChangeoverTable("T1", "presses", ["M1"], FAMILIES,
                                              {k: float(v) for k, v in CHANGE.items()})]
    return shop


def brute(names, end_family=None):
    fam = {n: f for n, f, _h in JOBS}
    best = None
    for perm in itertools.permutations(names):
        seq = ["mould A"] + [fam[n] for n in perm] + ([end_family] if end_family else [])
        total = sum(CHANGE[(a, b)] for a, b in itertools.pairwise(seq))
        best = total if best is None else min(best, total)
    return best


def run_cli(capsys, *argv):
    code = main(list(argv))
    out = capsys.readouterr()
    return code, out.out, out.err


@pytest.mark.parametrize("end_family", [None, "mould A"])
def test_json_order_is_the_brute_force_optimum(tmp_path, capsys, end_family):
    path = tmp_path / "cell.dshop"
    save_shop(cell(end_family), path)
    names = [n for n, _f, _h in JOBS]
    code, out, _err = run_cli(capsys, "order-runs", str(path), "--machine", "Press 1",
                              "--jobs", ",".join(names), "--json")
    assert code == 0
    data = json.loads(out)
    assert data["total"] == brute(names, end_family) and data["proven_optimal"] is True
    assert sorted(r["job"] for r in data["runs"]) == sorted(names)
    # each run's change is the table's change from the previous family
    prev = "mould A"
    for r in data["runs"]:
        assert (r["from_family"], r["changeover"]) == (prev, CHANGE[(prev, r["to_family"])])
        prev = r["to_family"]
    # hours: changes in minutes take machine time, runs follow each other
    hours = {n: h for n, _f, h in JOBS}
    t = 0.0
    for r in data["runs"]:
        assert r["start_hour"] == pytest.approx(t + r["changeover"] / 60, abs=1e-5)
        assert r["end_hour"] == pytest.approx(r["start_hour"] + hours[r["job"]], abs=1e-5)
        t = r["end_hour"]


def test_text_names_each_change(tmp_path, capsys):
    path = tmp_path / "cell.dshop"
    save_shop(cell(), path)
    code, out, _err = run_cli(capsys, "order-runs", str(path), "--machine", "Press 1",
                              "--jobs", "WO-3 tray,WO-1 lid")
    assert code == 0
    assert "change from family mould A to mould B: 10 min" in out
    assert "change from family mould B to mould C: 15 min" in out
    assert "total changeover 25 min (proven best)" in out


def test_default_jobs_come_from_the_whole_shift_plan(tmp_path, capsys):
    shop = cell()
    shop.shift.hours = 8
    path = tmp_path / "cell.dshop"
    save_shop(shop, path)
    code, out, _err = run_cli(capsys, "order-runs", str(path), "--machine", "Press 1", "--json")
    assert code == 0
    data = json.loads(out)
    assert data["runs"] and data["fits"] in (True, False)


@pytest.mark.parametrize("argv,message", [
    (["--machine", "Press 9"], "no machine named 'Press 9'"),
    (["--machine", "Press 1", "--jobs", "WO-99"], "no job named 'WO-99'"),
    (["--machine", "Press 2", "--jobs", "WO-1 lid"], "cannot run it"),
])
def test_bad_input_exits_2_with_its_place(tmp_path, capsys, argv, message):
    path = tmp_path / "cell.dshop"
    save_shop(cell(), path)
    code, _out, err = run_cli(capsys, "order-runs", str(path), *argv)
    assert code == 2 and message in err


def test_family_missing_from_the_table_is_named(tmp_path, capsys):
    shop = cell()
    shop.jobs[0].family = "mould Z"
    path = tmp_path / "cell.dshop"
    save_shop(shop, path)
    code, _out, err = run_cli(capsys, "order-runs", str(path), "--machine", "Press 1", "--jobs", "WO-1 lid")
    assert code == 2
    assert "family 'mould Z' is not in machine 'Press 1' (id M1)'s changeover table 'T1'" in err
