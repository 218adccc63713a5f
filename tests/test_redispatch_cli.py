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
    record = ["--record", "--by", "late-shift lead", "--history", str(history)]
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


def test_up_then_down_leaves_the_machine_down_and_events_apply_in_the_order_given(shop_file,
                                                                                  capsys):
    # Regression: every --down was applied before every --up, whatever the order given.
    code, out, _ = run(capsys, shop_file, "--up", "Press A", "--down", "Press A", "--json")
    data = json.loads(out)
    assert code == 0 and "Press A" in data["unavailable_machines"]
    code, out, _ = run(capsys, shop_file, "--down", "Press A", "--up", "Press A")
    assert code == 0 and "Caution: Press A is down" not in out
    assert "Not available" not in out
    code, out, _ = run(capsys, shop_file, "--up", "Press A", "--down", "Press A")
    assert "Caution: Press A is down" in out


def test_done_job_leaving_its_machine_is_listed_in_the_text(shop_file, capsys):
    # Regression: a job done or pulled was missing from the changes and the text.
    code, out, _ = run(capsys, shop_file, "--pull", "WO-3")
    assert code == 0 and "WO-3  Saw -> pulled" in out


def test_rush_by_work_order_and_breakdown_note_kept_on_the_machine(tmp_path, capsys):
    shop = small_shop()
    shop.jobs[3].work_order = "WO-4104"
    path = tmp_path / "cell.dshop"
    save_shop(shop, path)
    code, out, _ = run(capsys, path, "--rush", "WO-4104", "--down", "Saw", "--json",
                       "--in-force", "--note", "hydraulic leak")
    assert code == 0
    saved = load_shop(path)
    saw = saved.machine("S")
    assert saw.state == "down" and saw.state_note == "hydraulic leak"
    assert saw.state_changed is not None
    assert saved.job("J4").rush


def test_maximize_counts_the_move_penalty_against_the_value(tmp_path, capsys):
    # Regression: with --maximize the move penalty was ignored (and --move-penalty refused).
    # One press in force for J1 (value 10); a second press comes up where J1 is worth 12.
    # Moving gains 2 and costs the penalty: with 5 it stays, with 1 it moves.
    from dispatcher.shop import DOWN, Machine, Shop

    shop = Shop(name="invented", move_penalty=5.0)
    shop.machines = [Machine(id="P", name="P1"), Machine(id="Q", name="P2", state=DOWN)]
    shop.jobs = [Job(id="J1", name="J1")]
    shop.grid = {("J1", "P"): 10.0, ("J1", "Q"): 12.0}
    shop.plan_in_force = {"P": ["J1"]}
    path = tmp_path / "max.dshop"
    save_shop(shop, path)
    code, out, _ = run(capsys, path, "--up", "P2", "--maximize", "--json")
    assert code == 0 and json.loads(out)["changes"] == []
    code, out, _ = run(capsys, path, "--up", "P2", "--maximize", "--move-penalty", "1", "--json")
    data = json.loads(out)
    assert code == 0 and data["changes"] == [{"job": "J1", "from": "P1", "to": "P2"}]
    assert data["total"] == 12 and data["difference"]["move_penalties_paid"] == 1
    assert data["difference"]["total_in_force"] == 10


def test_maximize_total_in_force_subtracts_wait_penalties(tmp_path, capsys):
    # Regression: one job placed at 10, one waiting with penalty 4: total 6, and the total
    # in force was 14 (penalties added) with a change of -8 and no changes.
    from dispatcher.shop import Machine, Shop

    shop = Shop(name="invented")
    shop.machines = [Machine(id="P", name="P1"), Machine(id="S", name="Saw")]
    shop.jobs = [Job(id="J1", name="J1"), Job(id="J2", name="J2", wait_penalty=4.0),
                 Job(id="J3", name="J3")]
    shop.grid = {("J1", "P"): 10.0, ("J2", "P"): 1.0, ("J3", "S"): 3.0}
    shop.plan_in_force = {"P": ["J1"], "S": ["J3"]}
    path = tmp_path / "max.dshop"
    save_shop(shop, path)
    code, out, _ = run(capsys, path, "--done", "J3", "--maximize", "--json")
    data = json.loads(out)
    assert code == 0 and data["total"] == 6
    assert data["difference"]["total_in_force"] == 6 and data["difference"]["total_change"] == 0


def test_event_that_fixes_an_infeasible_document_is_planned(tmp_path, capsys):
    # Regression: a document whose rush jobs could not all be placed was refused (exit 3)
    # even when the event (a press back up) fixed it. Only the state after is judged.
    from dispatcher.shop import DOWN, Machine, Shop

    shop = Shop(name="invented")
    shop.machines = [Machine(id="P", name="P1"), Machine(id="Q", name="P2", state=DOWN)]
    shop.jobs = [Job(id="A", name="A", rush=True), Job(id="B", name="B", rush=True)]
    shop.grid = {("A", "P"): 1.0, ("B", "P"): 1.0, ("B", "Q"): 2.0}
    shop.plan_in_force = {"P": ["A"]}
    path = tmp_path / "fix.dshop"
    save_shop(shop, path)
    code, out, _ = run(capsys, path, "--up", "P2", "--json")
    data = json.loads(out)
    assert code == 0 and data["rush_waiting"] == []
    assert {a["job"]: a["machine"] for a in data["assignments"]} == {"A": "P1", "B": "P2"}
    assert data["changes"] == [{"job": "B", "from": None, "to": "P2"}]


def test_rush_total_in_force_includes_the_arriving_jobs_wait_penalty(tmp_path, capsys):
    # Regression: "--rush J" reported no changes and +5 because the total in force left out
    # the rush job's wait penalty (2 instead of 7 in a three-job shop).
    from dispatcher.shop import Machine, Shop

    shop = Shop(name="invented")
    shop.machines = [Machine(id="P", name="P1"), Machine(id="S", name="Saw")]
    shop.jobs = [Job(id="J1", name="J1"), Job(id="J2", name="J2"),
                 Job(id="J3", name="J3", wait_penalty=5.0)]
    shop.grid = {("J1", "P"): 1.0, ("J2", "S"): 1.0, ("J3", "P"): 9.0}
    shop.plan_in_force = {"P": ["J1"], "S": ["J2"]}
    path = tmp_path / "r.dshop"
    save_shop(shop, path)
    code, out, _ = run(capsys, path, "--rush", "J3", "--json")
    data = json.loads(out)
    assert code == 0 and data["difference"]["total_in_force"] == 7
    assert data["changes"]  # the rush job takes P1
