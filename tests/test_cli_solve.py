"""``dispatcher solve``: the JSON contract, plain output, exit codes 0/2/3 and error lines.

Run in-process through :func:`dispatcher.cli.main` (with capsys) and, for the end-to-end
checks, as a real ``python -m dispatcher`` process. Plans are checked against scipy
(reference library) on grids read here with the standard csv module, not our reader.
"""

from __future__ import annotations

import csv
import json
import re
import subprocess
import sys
from pathlib import Path

import numpy as np
import openpyxl
import pytest

from dispatcher.cli import main
from helpers_reference import brute_force, scipy_reference

ROOT = Path(__file__).resolve().parent.parent
SAMPLE = ROOT / "sample_shops" / "sheet_metal_grid.csv"
CONTRACT_KEYS = {"status", "objective", "total", "assignments", "waiting_jobs", "idle_machines"}


def read_csv_independently(path: Path):
    """Names, values and mask of a comma CSV grid, read with the csv module only."""
    with open(path, newline="", encoding="utf-8") as f:
        rows = [r for r in csv.reader(f) if r]
    machines = [c.strip() for c in rows[0][1:]]
    jobs = [r[0].strip() for r in rows[1:]]
    cells = [[c.strip() for c in r[1:]] for r in rows[1:]]
    allowed = np.array([[c not in ("", "x", "X") for c in r] for r in cells], dtype=bool)
    values = np.array([[float(c) if ok else 0.0 for c, ok in zip(r, a)] for r, a in zip(cells, allowed)])
    return jobs, machines, values, allowed


def run_cli(capsys, *argv):
    code = main(["solve", *map(str, argv)])
    out, err = capsys.readouterr()
    return code, out, err


def assert_contract(data, path: Path, objective: str):
    """The JSON contract of issue 2, checked against the file read independently."""
    jobs, machines, values, allowed = read_csv_independently(path)
    assert CONTRACT_KEYS <= set(data)
    assert data["status"] == "optimal"
    assert data["objective"] == objective
    assert isinstance(data["total"], (int, float))
    assert isinstance(data["assignments"], list)
    planned = []
    for a in data["assignments"]:
        assert set(a) == {"job", "machine", "cost"}
        i, j = jobs.index(a["job"]), machines.index(a["machine"])
        assert allowed[i, j], f"{a} is an incompatible pair in the file"
        assert a["cost"] == values[i, j]
        planned.append((a["job"], a["machine"]))
    assigned_jobs = [p[0] for p in planned]
    assigned_machines = [p[1] for p in planned]
    assert len(set(assigned_jobs)) == len(assigned_jobs)
    assert len(set(assigned_machines)) == len(assigned_machines)
    assert sorted(assigned_jobs + data["waiting_jobs"]) == sorted(jobs)
    assert sorted(assigned_machines + data["idle_machines"]) == sorted(machines)
    # No wait penalties from a grid file: the total is the sum of the planned values.
    assert data["total"] == pytest.approx(sum(a["cost"] for a in data["assignments"]))
    return jobs, machines, values, allowed


# ----------------------------------------------------------------- the sample, end to end

def test_sample_solves_as_a_real_process():
    proc = subprocess.run([sys.executable, "-m", "dispatcher", "solve", str(SAMPLE), "--json"],
                          capture_output=True, text=True, cwd=ROOT, timeout=120)
    assert proc.returncode == 0, proc.stderr
    assert proc.stderr == ""
    data = json.loads(proc.stdout)  # exactly one JSON object, nothing else on stdout
    _, _, values, allowed = assert_contract(data, SAMPLE, "total")
    # Reference library: scipy.optimize.linear_sum_assignment on a big-M encoding.
    expect = scipy_reference(values.astype(int), allowed)
    assert data["total"] == expect.total
    assert len(data["assignments"]) == expect.placed
    assert data["certificate"]["verified"] is True


def test_sample_plain_output(capsys):
    code, out, err = run_cli(capsys, SAMPLE)
    assert code == 0 and err == ""
    jobs, machines, values, allowed = read_csv_independently(SAMPLE)
    expect = scipy_reference(values.astype(int), allowed)  # reference: scipy
    lines = out.splitlines()
    assert lines[0].split() == ["Job", "Machine", "Value"]
    # The total says what it is made of (no wait penalties in a plain grid).
    assert f"Total: {expect.total:g} (setups {expect.total:g} + wait penalties 0)" in lines
    assert any(line.startswith("Waiting jobs (4):") for line in lines)  # 12 jobs, 8 machines
    assert "Idle machines: none" in lines
    planned_rows = lines[2:lines.index("")]  # the table ends at the first blank line
    assert all(row.startswith("WO-") for row in planned_rows)
    assert len(planned_rows) == expect.placed


@pytest.mark.parametrize("flag, objective", [("", "total"), ("--maximize", "maximize"),
                                             ("--bottleneck", "bottleneck")])
def test_objectives_against_references(capsys, flag, objective):
    jobs, machines, values, allowed = read_csv_independently(SAMPLE)
    code, out, err = run_cli(capsys, SAMPLE, "--json", *([flag] if flag else []))
    assert code == 0, err
    data = json.loads(out)
    assert_contract(data, SAMPLE, objective)
    # Reference library: scipy (big-M encoding, threshold scan for the bottleneck).
    expect = scipy_reference(values.astype(int), allowed, objective=objective)
    assert data["total"] == expect.total
    if objective == "bottleneck":
        assert data["bottleneck"] == expect.bottleneck
        assert max(a["cost"] for a in data["assignments"]) == expect.bottleneck


def test_waiting_reasons_are_checkable(capsys):
    # Hall's theorem (Hall 1935): each reason names more jobs than machines, and every
    # machine any of those jobs can run is among the machines named (checked from the file).
    jobs, machines, values, allowed = read_csv_independently(SAMPLE)
    code, out, _ = run_cli(capsys, SAMPLE, "--json")
    data = json.loads(out)
    assert set(data["waiting_reasons"]) == set(data["waiting_jobs"])
    waiting_in_groups = 0
    for group in data["wait_groups"]:
        waiting = [j for j in group["jobs"] if j in data["waiting_jobs"]]
        waiting_in_groups += len(waiting)
        # Konig (1931): the group has exactly as many jobs too many as it has waiting jobs.
        assert len(group["jobs"]) - len(group["machines"]) == len(waiting) > 0
        rows = [jobs.index(j) for j in group["jobs"]]
        usable = {machines[k] for i in rows for k in np.flatnonzero(allowed[i])}
        assert usable <= set(group["machines"])
    assert waiting_in_groups == len(data["waiting_jobs"])
    for job, reason in data["waiting_reasons"].items():
        assert job in data["wait_groups"][reason["group"]]["jobs"]
        assert job in reason["text"]


def test_must_run_changes_the_plan(capsys, tmp_path):
    # Reference: brute-force enumeration with the must-run job; by hand C must take M1 (50)
    # and A or B takes M2 (2), although A and B alone would cost 1 + 2.
    grid = tmp_path / "g.csv"
    grid.write_text("l,M1,M2\nA,1,2\nB,1,2\nC,50,x\n")
    code, out, err = run_cli(capsys, grid, "--json", "--must-run", "C")
    assert code == 0, err
    data = json.loads(out)
    _, _, values, allowed = assert_contract(data, grid, "total")
    must = np.array([False, False, True])
    assert data["total"] == brute_force(values, allowed, None, must).total == 52
    assert {"job": "C", "machine": "M1", "cost": 50} in data["assignments"]


def test_xlsx_grid(capsys, tmp_path):
    book = openpyxl.Workbook()
    for row in [["minutes", "M1", "M2"], ["A", 3, "x"], ["B", 1, 2.5]]:
        book.active.append(row)
    path = tmp_path / "g.xlsx"
    book.save(path)
    code, out, err = run_cli(capsys, path, "--json")
    assert code == 0, err
    data = json.loads(out)
    # Brute force by hand: A can only use M1, so B takes M2: 3 + 2.5.
    assert data["total"] == 5.5
    assert sorted((a["job"], a["machine"]) for a in data["assignments"]) == [("A", "M1"), ("B", "M2")]


def test_more_machines_than_jobs_lists_idle(capsys, tmp_path):
    grid = tmp_path / "g.csv"
    grid.write_text("l,M1,M2,M3\nA,5,1,7\n")
    code, out, _ = run_cli(capsys, grid, "--json")
    data = json.loads(out)
    assert code == 0 and data["total"] == 1
    assert data["waiting_jobs"] == [] and sorted(data["idle_machines"]) == ["M1", "M3"]


# ----------------------------------------------------------------- exit code 3: infeasible

def test_infeasible_must_run_exit_3(capsys, tmp_path):
    grid = tmp_path / "tight.csv"
    grid.write_text("l,Lathe,Mill,Press\nA,1,x,x\nB,2,x,x\nC,x,3,x\nD,4,5,6\n")
    code, out, err = run_cli(capsys, grid, "--must-run", "A,B,D", "--json")
    assert code == 3
    assert out == ""
    lines = err.strip().splitlines()
    assert len(lines) == 1 and "Traceback" not in err
    assert str(grid) in err
    # Hall witness checked by hand: A and B (2 jobs) can only use the Lathe (1 machine).
    assert "A, B (2)" in err and "1 machine(s): Lathe" in err
    assert "D" not in err.split("must-run jobs", 1)[1].split("(")[0]


def test_infeasible_as_a_real_process(tmp_path):
    grid = tmp_path / "tight.csv"
    grid.write_text("l,M1\nA,1\nB,2\n")
    proc = subprocess.run([sys.executable, "-m", "dispatcher", "solve", str(grid), "--must-run", "A,B"],
                          capture_output=True, text=True, cwd=ROOT, timeout=120)
    assert proc.returncode == 3
    assert "Traceback" not in proc.stderr
    assert "A, B" in proc.stderr and "M1" in proc.stderr


# ----------------------------------------------------------------- exit code 2: bad input

BAD_FILES = [
    # (name, content, expected fragment of the message after the file name)
    ("missing.csv", None, r"file not found"),
    ("empty.csv", "", r"the file is empty"),
    ("header.csv", "l,A,B\n", r"only a header row"),
    ("ragged.csv", "l,A,B\nJ1,1,2\nJ2,1\n", r"row 3: has 2 cells"),
    ("dupjob.csv", "l,A\nJ1,1\nJ1,2\n", r"row 3, column 1 \(A\): job name 'J1' repeats"),
    ("dupmachine.csv", "l,A,A\nJ1,1,2\n", r"row 1, column 3 \(C\): machine name 'A' repeats"),
    ("text.csv", "l,A,B\nJ1,1,soon\n", r"row 2, column 3 \(C\): 'soon' is not a number"),
    ("nan.csv", "l,A,B\nJ1,nan,1\n", r"row 2, column 2 \(B\): 'nan' is not a finite number"),
    ("inf.csv", "l,A,B\nJ1,1,inf\n", r"row 2, column 3 \(C\): 'inf' is not a finite number"),
    ("negative.csv", "l,A\nJ1,-1\n", r"row 2, column 2 \(B\): -1 is negative"),
    ("latin.csv", "l,A\nPièce,1\n".encode("latin-1"), r"row 2: is not UTF-8 text"),
    ("grid.pdf", "l,A\nJ1,1\n", r"unsupported extension '\.pdf'"),
    ("fake.xlsx", "l,A\nJ1,1\n", r"is not an XLSX workbook \(not a zip archive\)"),
    ("zip.csv", b"PK\x03\x04" + bytes(40), r"looks like a zipped spreadsheet"),
]


def _make(tmp_path, name, content):
    path = tmp_path / name
    if isinstance(content, bytes):
        path.write_bytes(content)
    elif content is not None:
        path.write_text(content, encoding="utf-8")
    return path


@pytest.mark.parametrize("name, content, message", BAD_FILES, ids=[b[0] for b in BAD_FILES])
def test_bad_input_exit_2(capsys, tmp_path, name, content, message):
    path = _make(tmp_path, name, content)
    code, out, err = run_cli(capsys, path, "--json")
    assert code == 2
    assert out == ""
    assert "Traceback" not in err
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    assert lines[0].startswith(f"dispatcher: {path}: ")
    assert re.search(message, lines[0]), lines[0]


def test_over_size_limit_exit_2(capsys, tmp_path):
    from dispatcher.io.grid import MAX_FILE_BYTES

    path = tmp_path / "huge.csv"
    with open(path, "wb") as f:
        f.truncate(MAX_FILE_BYTES + 1)  # sparse: refused from its size, never read
    code, out, err = run_cli(capsys, path)
    assert code == 2 and out == ""
    assert f"{path}: {MAX_FILE_BYTES + 1} bytes exceed the limit" in err


def test_xlsx_formula_without_value_exit_2(capsys, tmp_path):
    book = openpyxl.Workbook()
    for row in [["l", "M1"], ["A", "=2*3"]]:
        book.active.append(row)
    path = tmp_path / "formula.xlsx"
    book.save(path)
    code, _, err = run_cli(capsys, path)
    assert code == 2
    assert f"{path}: row 2, column 2 (B): formula has no stored value" in err


def test_unknown_must_run_job_exit_2(capsys):
    code, out, err = run_cli(capsys, SAMPLE, "--must-run", "WO-4101 bracket,WO-9999")
    assert code == 2 and out == ""
    assert "unknown job 'WO-9999'" in err and str(SAMPLE) in err


def test_conflicting_flags_are_a_usage_error(capsys):
    with pytest.raises(SystemExit) as info:
        main(["solve", str(SAMPLE), "--maximize", "--bottleneck"])
    assert info.value.code == 2
    assert "not allowed with argument" in capsys.readouterr().err


def test_bad_input_as_a_real_process(tmp_path):
    path = _make(tmp_path, "bad.csv", "l,A,B\nJ1,1,two\n")
    proc = subprocess.run([sys.executable, "-m", "dispatcher", "solve", str(path)],
                          capture_output=True, text=True, cwd=ROOT, timeout=120)
    assert proc.returncode == 2
    assert proc.stdout == ""
    assert "Traceback" not in proc.stderr
    assert proc.stderr.strip() == f"dispatcher: {path}: row 2, column 3 (C): 'two' is not a number " \
                                  "(use x or leave empty when the machine cannot run the job)"


def test_no_compatible_pair_everyone_waits(capsys, tmp_path):
    # Hall's theorem with S = {job}: a job with no allowed machine waits in every plan.
    grid = tmp_path / "none.csv"
    grid.write_text("l,M1,M2\nA,x,x\nB,,X\n")
    code, out, err = run_cli(capsys, grid, "--json")
    assert code == 0, err
    data = json.loads(out)
    assert data["assignments"] == [] and data["total"] == 0
    assert data["waiting_jobs"] == ["A", "B"] and data["idle_machines"] == ["M1", "M2"]
    group = data["wait_groups"][data["waiting_reasons"]["A"]["group"]]
    assert group == {"jobs": ["A"], "machines": []}
