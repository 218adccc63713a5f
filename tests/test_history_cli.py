"""``dispatcher solve --record`` and ``dispatcher history ...`` on real files.

Outside references: the plans recorded are checked against scipy's
linear_sum_assignment on the same grid (the total), and the history file is inspected
with a plain sqlite3 connection.
"""

from __future__ import annotations

import csv
import hashlib
import json
import os
import sqlite3
import subprocess
import sys
from pathlib import Path

import numpy as np
import pytest
from scipy.optimize import linear_sum_assignment

from dispatcher.cli import main
from dispatcher.commands.common import EXIT_BAD_INPUT, EXIT_STORE
from dispatcher.io.grid import read_grid

ROOT = Path(__file__).resolve().parent.parent


def run(capsys, *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


@pytest.fixture
def hist(tmp_path) -> str:
    return str(tmp_path / "history.sqlite")


def test_solve_record_then_list_show_diff_export(capsys, samples, hist, tmp_path):
    grid = str(samples / "sheet_metal_grid.csv")
    code, out, err = run(capsys, "solve", grid, "--json", "--record", "--by", "Supervisor A",
                         "--reason", "shift start", "--note", "monday", "--history", hist)
    assert code == 0
    plan = json.loads(out)  # stdout stays one JSON object; the receipt goes to stderr
    assert "Recorded decision #1" in err
    table = read_grid(grid)
    # scipy reference: the recorded total is the optimum of the square/rectangular grid
    cost = np.where(table.allowed, table.values, 1e9)
    r, c = linear_sum_assignment(cost)
    assert plan["total"] == pytest.approx(cost[r, c].sum())

    code, out, _ = run(capsys, "solve", grid, "--must-run", plan["waiting_jobs"][0]
                       if plan["waiting_jobs"] else "", "--record", "--by", "Supervisor B",
                       "--reason", "rush-job", "--history", hist)
    assert code == 0

    code, out, _ = run(capsys, "history", "list", "--json", "--history", hist)
    listed = json.loads(out)
    assert [(d["id"], d["by"], d["reason"]) for d in listed] == [
        (1, "Supervisor A", "shift-start"), (2, "Supervisor B", "rush-job")]
    assert all({"id", "time", "by", "reason", "total"} <= set(d) for d in listed)
    assert listed[0]["total"] == plan["total"] and listed[1]["replaces"] == 1

    code, out, _ = run(capsys, "history", "list", "--history", hist, "--by", "supervisor a")
    assert code == 0 and "monday" in out and "Supervisor B" not in out

    code, out, _ = run(capsys, "history", "show", "1", "--history", hist)
    assert code == 0 and "By: Supervisor A" in out and "Reason: shift start - monday" in out
    code, out, _ = run(capsys, "history", "show", "2", "--json", "--history", hist)
    shown = json.loads(out)
    assert shown["diff_from_replaced"]["from"] == 1
    assert shown["shop_snapshot"]["name"] == "sheet_metal_grid"

    code, out, _ = run(capsys, "history", "diff", "1", "2", "--json", "--history", hist)
    assert code == 0 and json.loads(out)["total_change"] == pytest.approx(
        listed[1]["total"] - listed[0]["total"])

    target = tmp_path / "out.csv"
    code, out, _ = run(capsys, "history", "export", str(target), "--history", hist)
    assert code == 0
    with target.open(newline="", encoding="utf-8") as f:
        rows = list(csv.DictReader(f))
    assert {r["decision"] for r in rows} == {"1", "2"}
    assert sum(r["state"] == "assigned" and r["decision"] == "1" for r in rows) == len(
        plan["assignments"])


def test_solve_shop_document_record_and_restore(capsys, samples, hist):
    shop = samples / "small_moulding_cell.dshop"
    before = hashlib.sha256(shop.read_bytes()).hexdigest()
    code, out, err = run(capsys, "solve", str(shop), "--json", "--record", "--by", "Supervisor A",
                         "--reason", "breakdown", "--history", hist)
    assert code == 0, err
    plan = json.loads(out)
    code, out, err = run(capsys, "history", "restore", "1", "--by", "Supervisor C", "--note", "undo",
                         "--history", hist)
    assert code == 0 and "restored from #1" in out
    code, out, _ = run(capsys, "history", "show", "2", "--json", "--history", hist)
    restored = json.loads(out)
    assert restored["plan"] == plan and restored["reason"] == "restored"
    assert restored["note"] == "restored from #1: undo" and restored["restored_from"] == 1
    assert hashlib.sha256(shop.read_bytes()).hexdigest() == before


@pytest.mark.parametrize("argv, message", [
    (["--record", "--reason", "other"], "--record needs --by NAME"),
    (["--record", "--by", "Supervisor A"], "--record needs --reason KIND"),
    (["--record", "--by", "Supervisor A", "--reason", "lunch"], "unknown kind 'lunch'"),
    (["--by", "Supervisor A"], "--by and --reason are used with --record"),
])
def test_solve_record_bad_arguments_exit_2_before_solving(capsys, samples, hist, argv, message):
    code, out, err = run(capsys, "solve", str(samples / "sheet_metal_grid.csv"), *argv,
                         "--history", hist)
    assert code == EXIT_BAD_INPUT and message in err and out == ""
    assert not Path(hist).exists()


def test_unusable_history_exits_4_after_printing_the_plan(capsys, samples, tmp_path):
    bad = tmp_path / "history.sqlite"
    bad.write_text("not a database")
    code, out, err = run(capsys, "solve", str(samples / "sheet_metal_grid.csv"), "--json",
                         "--record", "--by", "Supervisor A", "--reason", "other", "--history", str(bad))
    assert code == EXIT_STORE
    assert json.loads(out)["status"] == "optimal"  # the plan is still shown
    assert err.count("\n") == 1 and str(bad) in err and "not an SQLite database" in err
    assert bad.read_text() == "not a database"
    for argv in (["list"], ["show", "1"], ["diff", "1", "2"], ["export", str(tmp_path / "x.csv")]):
        code, _, err = run(capsys, "history", *argv, "--history", str(bad))
        assert code == EXIT_STORE and "not an SQLite database" in err


def test_missing_history_and_unknown_numbers(capsys, tmp_path, hist, samples):
    code, out, err = run(capsys, "history", "list", "--json", "--history", hist)
    assert (code, out) == (EXIT_STORE, "") and "the history does not exist" in err
    code, _, err = run(capsys, "history", "show", "1", "--history", hist)
    assert code == EXIT_STORE and "the history file does not exist, so no decision #1" in err
    run(capsys, "solve", str(samples / "sheet_metal_grid.csv"), "--record", "--by", "A",
        "--reason", "other", "--history", hist)
    code, _, err = run(capsys, "history", "show", "7", "--history", hist)
    assert code == EXIT_BAD_INPUT and "no decision #7" in err
    assert not (tmp_path / "x.csv").exists()


def test_env_var_chooses_the_file_in_a_real_process(tmp_path, samples):
    target = tmp_path / "from-env.sqlite"
    env = dict(os.environ, DISPATCHER_HISTORY=str(target), PYTHONPATH=str(ROOT))
    subprocess.run([sys.executable, "-m", "dispatcher", "solve",
                    str(samples / "sheet_metal_grid.csv"), "--record", "--by", "Supervisor A",
                    "--reason", "repair"], check=True, env=env, capture_output=True)
    conn = sqlite3.connect(target)
    assert conn.execute("SELECT supervisor, reason_kind FROM decisions").fetchall() == [
        ("Supervisor A", "repair")]
    conn.close()
    listed = subprocess.run([sys.executable, "-m", "dispatcher", "history", "list", "--json"],
                            check=True, env=env, capture_output=True, text=True)
    assert [d["id"] for d in json.loads(listed.stdout)] == [1]
