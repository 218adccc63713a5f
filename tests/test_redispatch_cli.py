"""``dispatcher redispatch``: JSON contract plus changes, plan in force from the document or
--plan, exit codes 0/2/3 and error lines. Run in-process through dispatcher.cli.main.

Reference for the new plan: brute-force enumeration of the small invented shop below.
"""

from __future__ import annotations

import json

import pytest

from helpers_shops import small_shop

from dispatcher.cli import main
from dispatcher.io.shopfile import load_shop, save_shop
from dispatcher.shop import Job, solve_shop

CONTRACT_KEYS = {"status", "objective", "total", "assignments", "waiting_jobs",
                 "idle_machines", "bottleneck", "waiting_reasons", "certificate"}


@pytest.fixture
def shop_file(tmp_path):
    path = tmp_path / "cell.dshop"
    save_shop(small_shop(), path)
    return path


def run(capsys, *argv):
    code = main(["redispatch", *map(str, argv)])
    out = capsys.readouterr()
    return code, out.out, out.err


def test_json_is_the_solve_contract_plus_changes(shop_file, capsys):
    code, out, _ = run(capsys, shop_file, "--down", "Press A", "--json")
    assert code == 0
    data = json.loads(out)
    assert CONTRACT_KEYS <= set(data)
    # Brute force (see tests/test_redispatch_shop.py): WO-2 on B, WO-3 on Saw, 20 in total.
    assert data["total"] == 20
    assert {(a["job"], a["machine"]) for a in data["assignments"]} == {
        ("WO-2", "Press B"), ("WO-3", "Saw")}
    assert data["changes"] == [{"job": "WO-1", "from": "Press A", "to": None}]
    assert data["certificate"]["verified"] is True
    assert data["unavailable_machines"] == ["Press A"]
    assert data["difference"]["now_waiting"] == ["WO-1"]
    assert load_shop(shop_file).machine("A").state == "up"  # the document is not modified


def test_move_penalty_option(shop_file, capsys):
    shop = small_shop()
    shop.grid[("J2", "S")] = 1.0
    save_shop(shop, shop_file)
    code, out, _ = run(capsys, shop_file, "--done", "WO-4", "--move-penalty", "0", "--json")
    assert code == 0
    changes = {(c["job"], c["from"], c["to"]) for c in json.loads(out)["changes"]}
    assert changes == {("WO-2", "Press B", "Saw"), ("WO-3", "Saw", "Press B"),
                       ("WO-4", None, None)}
    code, out, _ = run(capsys, shop_file, "--done", "WO-4", "--move-penalty", "100", "--json")
    assert json.loads(out)["changes"] == [{"job": "WO-4", "from": None, "to": None,
                                           "left": "done"}]


def test_plan_in_force_from_a_plan_file(tmp_path, capsys):
    shop = small_shop()
    shop.plan_in_force = {}
    path = tmp_path / "cell.dshop"
    save_shop(shop, path)
    code, _, err = run(capsys, path, "--down", "Saw")
    assert code == 2 and "holds no plan in force" in err and "--plan" in err
    plan_file = tmp_path / "plan.json"
    plan_file.write_text(json.dumps(solve_shop(shop).to_json()), encoding="utf-8")
    code, out, _ = run(capsys, path, "--down", "Saw", "--plan", plan_file, "--json")
    assert code == 0
    assert json.loads(out)["certificate"]["verified"] is True


def test_text_output_names_changes_and_the_lockout_caution(shop_file, capsys):
    code, out, _ = run(capsys, shop_file, "--down", "Press A")
    assert code == 0
    assert "WO-1" in out and "Press A -> waiting" in out
    assert "Change in total: +0" in out
    assert "lockout/tagout" in out


@pytest.mark.parametrize("argv, message", [
    (["--down", "Press Z"], "event 1 (down 'Press Z'): no machine named 'Press Z'"),
    ([], "redispatch needs an event"),
    (["--done", "WO-9"], "no job named 'WO-9'"),
    (["--down", "Saw", "--move-penalty", "-1"], "move penalty: must be a number >= 0"),
])
def test_bad_input_exits_2_with_one_line(shop_file, capsys, argv, message):
    code, out, err = run(capsys, shop_file, *argv)
    assert code == 2
    assert message in err
    assert err.count("\n") == 1 and out == ""


def test_bad_plan_file(tmp_path, shop_file, capsys):
    bad = tmp_path / "plan.json"
    bad.write_text("{not json", encoding="utf-8")
    code, _, err = run(capsys, shop_file, "--down", "Saw", "--plan", bad)
    assert code == 2 and "plan.json: line 1, column 2: not valid JSON" in err
    other = tmp_path / "other.json"
    plan = solve_shop(small_shop()).to_json()
    plan["assignments"][0]["machine"] = "Press Q"
    other.write_text(json.dumps(plan), encoding="utf-8")
    code, _, err = run(capsys, shop_file, "--down", "Saw", "--plan", other)
    assert code == 2 and "no machine named 'Press Q'" in err


def test_rush_job_that_cannot_be_placed_still_gives_a_plan_exit_0(tmp_path, capsys):
    shop = small_shop()
    shop.jobs.append(Job(id="J5", name="WO-5"))
    shop.grid[("J5", "A")] = 1.0
    path = tmp_path / "cell.dshop"
    save_shop(shop, path)
    code, out, _ = run(capsys, path, "--rush", "WO-5", "--down", "Press A", "--json")
    assert code == 0
    data = json.loads(out)
    assert data["rush_waiting"] == ["WO-5"]
    assert "Press A is down" in data["waiting_reasons"]["WO-5"]["text"]
    code, out, _ = run(capsys, path, "--rush", "WO-5", "--down", "Press A")
    assert code == 0 and "Rush jobs waiting" in out and "WO-5" in out


def test_command_line_loop_solve_in_force_then_breakdown_recorded_and_saved(shop_file, tmp_path,
                                                                           capsys):
    # The supervisor's loop without the app: put the morning plan in force, then a breakdown.
    from dispatcher.history import HistoryStore

    history = tmp_path / "h.sqlite"
    record = ["--record", "--by", "M. Ortega", "--history", str(history)]
    assert main(["solve", str(shop_file), "--json", "--in-force", *record,
                 "--reason", "shift-start"]) == 0
    morning = json.loads(capsys.readouterr().out)
    saved = load_shop(shop_file)
    # The document now holds exactly the printed plan (running jobs first).
    assert saved.plan_in_force == solve_shop(small_shop()).in_force(saved)
    assert main(["redispatch", str(shop_file), "--down", "Press B", "--json", "--in-force",
                 *record, "--reason", "breakdown", "--note", "hydraulic leak"]) == 0
    after = json.loads(capsys.readouterr().out)
    saved = load_shop(shop_file)
    assert saved.machine_by_name("Press B").state == "down"
    placed = {a["machine"] for a in after["assignments"]}
    assert "Press B" not in placed and "B" not in saved.plan_in_force
    store = HistoryStore(history)
    assert [d.reason for d in store.list(newest_first=False)] == ["shift-start", "breakdown"]
    assert store.get(2).plan["total"] == after["total"]
    assert store.get(1).plan["total"] == morning["total"]


def test_in_force_needs_a_shop_document(samples, capsys):
    grid = samples / "sheet_metal_grid.csv"
    before = grid.read_bytes()
    assert main(["solve", str(grid), "--in-force"]) == 2
    assert "--in-force needs a shop document" in capsys.readouterr().err
    assert grid.read_bytes() == before
