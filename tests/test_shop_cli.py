"""`dispatcher solve` on shop documents and `dispatcher convert`, through the real entry point."""

from __future__ import annotations

import csv
import json
from pathlib import Path

import numpy as np
import pytest
from helpers_reference import scipy_reference

from dispatcher.cli import main
from dispatcher.io.grid import read_grid
from dispatcher.io.shopfile import load_shop, save_shop
from dispatcher.shop import Job, Machine, Shop

ROOT = Path(__file__).resolve().parent.parent
SAMPLES = ROOT / "sample_shops"
SHOP_SAMPLES = sorted(SAMPLES.glob("*.dshop"))


def run_json(capsys, *argv) -> tuple[int, dict]:
    code = main(list(argv))
    out = capsys.readouterr().out
    return code, json.loads(out) if code == 0 else {}


@pytest.mark.parametrize("sample", SHOP_SAMPLES, ids=[p.name for p in SHOP_SAMPLES])
def test_every_sample_shop_solves_optimal(capsys, sample):
    code, data = run_json(capsys, "solve", str(sample), "--json")
    assert code == 0 and data["status"] == "optimal" and data["certificate"]["verified"] is True
    shop = load_shop(sample)
    rush = {j.name for j in shop.jobs if j.rush and j.state == "waiting"}
    assert rush <= {a["job"] for a in data["assignments"]}


def test_sample_shops_have_the_promised_shape():
    sizes = {p.name: load_shop(p) for p in SHOP_SAMPLES}
    small, medium, large = (sizes["small_moulding_cell.dshop"], sizes["medium_machining_shop.dshop"],
                            sizes["large_print_plant.dshop"])
    assert (len(small.jobs), len(small.machines)) == (8, 5)
    assert sum(j.rush for j in small.jobs) == 2 and len(small.pins) == 1
    assert len(small.grid) < 8 * 5  # some pairs cannot run
    assert (len(medium.jobs), len(medium.machines)) == (40, 15)
    assert any(m.slots == 2 for m in medium.machines)
    assert sum(m.state == "down" for m in medium.machines) == 1
    assert any(j.state == "running" for j in medium.jobs)
    assert (len(large.jobs), len(large.machines)) == (300, 60)


def test_converted_grid_solves_exactly_like_the_grid(capsys, tmp_path):
    grid = SAMPLES / "sheet_metal_grid.csv"
    shop_path = tmp_path / "sheet.dshop"
    assert main(["convert", str(grid), str(shop_path)]) == 0
    assert "12 job(s) added" in capsys.readouterr().out
    for flag in ([], ["--maximize"], ["--bottleneck"]):
        _, from_grid = run_json(capsys, "solve", str(grid), "--json", *flag)
        _, from_shop = run_json(capsys, "solve", str(shop_path), "--json", *flag)
        assert from_shop == from_grid
    # and back to a grid file: the same grid as the CSV read by the csv module (not by our
    # reader), whose best total by scipy's linear_sum_assignment (reference library) is
    # the total the shop gives
    back = tmp_path / "back.xlsx"
    assert main(["convert", str(shop_path), str(back)]) == 0
    with grid.open(newline="", encoding="utf-8") as fh:
        header, *rows = list(csv.reader(fh))
    jobs = [r[0] for r in rows]
    allowed = np.array([[c.strip() != "x" for c in r[1:]] for r in rows])
    values = np.array([[float(c) if c.strip() != "x" else 0.0 for c in r[1:]] for r in rows])
    t1 = read_grid(back)
    assert t1.jobs == jobs and t1.machines == header[1:]
    assert (t1.allowed == allowed).all() and (t1.values[allowed] == values[allowed]).all()
    _, from_shop = run_json(capsys, "solve", str(shop_path), "--json")
    assert from_shop["total"] == scipy_reference(values, allowed).total


def test_convert_into_existing_shop_reports_and_keeps_states(capsys, tmp_path):
    shop = load_shop(SAMPLES / "small_moulding_cell.dshop")
    old = tmp_path / "old.dshop"
    save_shop(shop, old)
    old_bytes = old.read_bytes()
    grid = tmp_path / "update.csv"
    grid.write_text("setup,Press 80t,Press 120t,New oven\nWO-7001 lid,30,20,5\nWO-9999 new part,x,8,9\n",
                    encoding="utf-8")
    out = tmp_path / "new.dshop"
    assert main(["convert", str(grid), str(out), "--into", str(old)]) == 0
    text = capsys.readouterr().out
    assert "1 job(s) added: WO-9999 new part" in text
    assert "1 machine(s) added: New oven" in text
    assert "1 value(s) changed" in text  # lid on Press 80t: 35 -> 30
    assert "7 job(s) of the shop not in the table" in text
    assert "3 machine(s) of the shop not in the table" in text
    merged = load_shop(out)
    assert merged.pins == shop.pins and merged.job_by_name("WO-7001 lid").rush
    assert merged.value(merged.job_by_name("WO-7001 lid").id, merged.machine_by_name("Press 80t").id) == 30
    assert old.read_bytes() == old_bytes  # the shop merged into is not touched


def test_plan_export_csv(capsys, tmp_path):
    out = tmp_path / "plan.csv"
    assert main(["convert", str(SAMPLES / "medium_machining_shop.dshop"), str(out), "--plan"]) == 0
    text = out.read_text(encoding="utf-8")
    assert text.startswith("machine,job,value,status,note")
    assert ",running," in text and ",waiting," in text and ",down," in text


def test_bad_document_exits_2_with_location(capsys, tmp_path):
    bad = tmp_path / "bad.dshop"
    bad.write_text(json.dumps({"format": "dispatcher-shop", "format_version": 1,
                               "jobs": [{"id": "a", "name": "A", "rush": "yes"}],
                               "machines": [{"id": "m", "name": "M"}]}), encoding="utf-8")
    assert main(["solve", str(bad)]) == 2
    err = capsys.readouterr().err
    assert f"{bad}: job 'A' (#1), field 'rush'" in err and "Traceback" not in err


def test_rush_jobs_that_cannot_all_run_still_give_a_plan_exit_0(capsys, tmp_path):
    shop = Shop(name="t", jobs=[Job("a", "A", rush=True), Job("b", "B", rush=True)],
                machines=[Machine("m", "Press")])
    shop.grid = {("a", "m"): 1, ("b", "m"): 2}
    path = tmp_path / "rush.dshop"
    save_shop(shop, path)
    assert main(["solve", str(path)]) == 0
    out = capsys.readouterr().out
    assert "Rush jobs waiting (1): B" in out
    assert "2 rush jobs (A, B) can only use 1 machine(s) (Press), so 1 of them must wait" in out
    assert "A [rush]" in out
    code, data = run_json(capsys, "solve", str(path), "--json")
    assert code == 0 and data["rush_waiting"] == ["B"]


def test_must_run_on_the_command_line_stays_hard_exit_3(capsys, tmp_path):
    shop = Shop(name="t", jobs=[Job("a", "A", rush=True), Job("b", "B", work_order="WO-2")],
                machines=[Machine("m", "Press")])
    shop.grid = {("a", "m"): 1, ("b", "m"): 2}
    path = tmp_path / "rush.dshop"
    save_shop(shop, path)
    assert main(["solve", str(path), "--must-run", "A", "--must-run", "WO-2"]) == 3
    assert "compete for only 1 free slot(s) on: Press" in capsys.readouterr().err


def test_convert_refuses_bad_grid_and_writes_nothing(capsys, tmp_path):
    grid = tmp_path / "bad.csv"
    grid.write_text("label,M1\nJob,-5\n", encoding="utf-8")
    out = tmp_path / "out.dshop"
    assert main(["convert", str(grid), str(out)]) == 2
    assert "row 2, column 2" in capsys.readouterr().err
    assert not out.exists()


def test_must_run_option_on_a_shop_document(capsys):
    sample = str(SAMPLES / "small_moulding_cell.dshop")
    _, plain = run_json(capsys, "solve", sample, "--json")
    waiting = "WO-7008 spacer"
    assert waiting in plain["waiting_jobs"]
    code, forced = run_json(capsys, "solve", sample, "--json", "--must-run", waiting)
    assert code == 0 and waiting in {a["job"] for a in forced["assignments"]}
    assert forced["total"] >= plain["total"]  # a restriction cannot improve the optimum
    assert main(["solve", sample, "--must-run", "No such job"]) == 2
    assert "must-run job 'No such job'" in capsys.readouterr().err
    # the clip runs only on the two small presses, which the two rush jobs need: rush is a
    # priority (the must-run clip takes a press from a rush job), must-run is hard
    code, data = run_json(capsys, "solve", sample, "--json", "--must-run", "WO-7002")
    assert code == 0 and "WO-7002 clip" in {a["job"] for a in data["assignments"]}
    assert data["rush_waiting"]
    assert main(["solve", sample, "--must-run", "WO-7002 clip,WO-7001 lid",
                 "--must-run", "WO-7004 knob", "--must-run", "WO-7003"]) == 3
    assert "Press 80t" in capsys.readouterr().err
