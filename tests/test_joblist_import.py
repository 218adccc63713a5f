"""Importing a job list and changeover tables (dispatcher import-jobs, dispatcher.io.joblist).

The files are written here with the csv module and openpyxl (the reference readers of
the formats); the expected shop is checked field by field. Invented print plant.
"""

from __future__ import annotations

import csv
import datetime as dt

import openpyxl
import pytest

from dispatcher.cli import main
from dispatcher.io.joblist import JobListError, read_changeover_table, read_job_list
from dispatcher.io.shopfile import load_shop, save_shop
from dispatcher.shop import Job, Machine, Shop


def base_shop(path):
    shop = Shop(name="Invented print plant", description="Invented demonstration data.")
    shop.machines = [Machine("M1", "Press 1", mounted=None), Machine("M2", "Press 2")]
    shop.jobs = [Job("J1", "PJ-1 flyer")]
    shop.grid = {("J1", "M1"): 10.0}
    save_shop(shop, path)
    return path


def write_csv(path, rows, delimiter=","):
    with open(path, "w", newline="", encoding="utf-8") as f:
        csv.writer(f, delimiter=delimiter).writerows(rows)
    return path


def test_job_list_with_mapped_columns_and_a_changeover_matrix(tmp_path, capsys):
    shop = base_shop(tmp_path / "plant.dshop")
    jobs = write_csv(tmp_path / "jobs.csv", [
        ["Order", "Job", "Colour", "Hrs", "Due", "Rush", "Wait penalty", "Customer"],
        ["WO-1", "PJ-1 flyer", "red", "1.5", "2026-03-14 14:00", "no", "20", "ignored"],
        ["WO-2", "PJ-2 label", "white", "2", "", "yes", "5", ""],
    ])
    matrix = write_csv(tmp_path / "colours.csv", [
        ["from \\ to", "red", "white"],
        ["red", "0", "50"],
        ["white", "10", "x"],
        ["nothing mounted", "15", "15"],
    ])
    out = tmp_path / "new.dshop"
    code = main(["import-jobs", str(shop), str(out), "--jobs", str(jobs), "--column", "family=Colour",
                 "--column", "run_hours=Hrs", "--column", "work_order=Order",
                 "--changeovers", str(matrix), "--table", "T1", "--table-name", "offset presses",
                 "--machines", "Press 1,Press 2"])
    assert code == 0, capsys.readouterr().err
    new = load_shop(out)
    one, two = new.job_by_name("PJ-1 flyer"), new.job_by_name("PJ-2 label")
    assert (one.id, one.family, one.run_hours, one.due, one.rush, one.wait_penalty, one.work_order) == (
        "J1", "red", 1.5, dt.datetime(2026, 3, 14, 14, 0), False, 20.0, "WO-1")
    assert (two.family, two.rush, two.run_hours, two.due) == ("white", True, 2.0, None)
    [table] = new.changeover_tables
    assert table.machines == ["M1", "M2"] and table.families == ["red", "white"]
    assert table.changes == {("red", "red"): 0, ("red", "white"): 50, ("white", "red"): 10,
                             (None, "red"): 15, (None, "white"): 15}
    assert new.value("J2", "M2") == 15 and new.value("J1", "M1") == 10   # typed stays typed
    assert load_shop(shop).job_names() == ["PJ-1 flyer"]                  # input untouched


def test_xlsx_job_list_with_default_headers(tmp_path):
    book = openpyxl.Workbook()
    sheet = book.active
    sheet.append(["Work order", "Job name", "Family", "Run hours", "Due", "Rush", "Wait penalty"])
    sheet.append(["WO-9", "PJ-9 box", "blue", 3, dt.datetime(2026, 3, 15, 6, 0), True, 7])
    book.save(tmp_path / "jobs.xlsx")
    [row] = read_job_list(tmp_path / "jobs.xlsx")
    assert (row.name, row.work_order, row.family, row.run_hours, row.due, row.rush, row.wait_penalty) == (
        "PJ-9 box", "WO-9", "blue", 3.0, dt.datetime(2026, 3, 15, 6, 0), True, 7.0)


@pytest.mark.parametrize("rows,kwargs,message", [
    ([["Job", "Run hours"], ["A", "two"]], {}, r"row 3, column 2 \(B\): 'two' is not a number"),
    ([["Job", "Run hours"], ["A", "-1"]], {}, r"row 2, column 2 \(B\): -1 must be a number >= 0"),
    ([["Job", "Rush"], ["A", "maybe"]], {}, r"row 2, column 2 \(B\): 'maybe' is not yes/no"),
    ([["Job", "Due"], ["A", "tomorrow"]], {}, r"row 2, column 2 \(B\): 'tomorrow' is not a date-time"),
    ([["Job"], ["A"], ["A"]], {}, r"row 3, column 1 \(A\): job 'A' repeats row 2"),
    ([["Customer"], ["A"]], {}, "no job name or work order column"),
    ([["Job"], ["A"]], {"columns": {"family": "Mould"}}, "no column 'Mould' for field 'family'"),
])
def test_bad_job_lists_are_refused_with_their_place(tmp_path, rows, kwargs, message):
    if "'two'" in message:
        rows = [rows[0], ["B", "1"], rows[1]]
    path = write_csv(tmp_path / "jobs.csv", rows)
    with pytest.raises(JobListError, match=message):
        read_job_list(path, **kwargs)


def test_bad_changeover_matrix_is_refused_and_nothing_is_written(tmp_path, capsys):
    shop = base_shop(tmp_path / "plant.dshop")
    matrix = write_csv(tmp_path / "colours.csv", [["", "red", "white"], ["red", "0", "-4"],
                                                  ["white", "1", "0"]])
    with pytest.raises(JobListError, match=r"row 2, column 3 \(C\).*negative"):
        read_changeover_table(matrix)
    out = tmp_path / "new.dshop"
    code = main(["import-jobs", str(shop), str(out), "--changeovers", str(matrix), "--table", "T1",
                 "--machines", "Press 1"])
    assert code == 2 and not out.exists()
    assert "colours.csv" in capsys.readouterr().err
    dup = write_csv(tmp_path / "dup.csv", [["", "red", "red"], ["red", "0", "1"]])
    with pytest.raises(JobListError, match="repeats"):
        read_changeover_table(dup)
    code = main(["import-jobs", str(shop), str(out), "--changeovers", str(tmp_path / "colours.csv"),
                 "--table", "T1", "--machines", "Press 9"])
    assert code == 2 and not out.exists()


def test_header_guess_and_ignored_fields(tmp_path):
    """What the app's column-mapping dialog builds on: the header row with its row count,
    the fields the header names, and a field left out even where a header names it."""
    from dispatcher.io.joblist import guess_columns, read_job_list_header

    path = tmp_path / "jobs.csv"
    write_csv(path, [["Work Order", "Colour group", "X"], ["PJ-7", "spot red", "1"], ["PJ-8", "black", ""]])
    header, n_rows = read_job_list_header(path)
    assert (header, n_rows) == (["Work Order", "Colour group", "X"], 2)
    assert guess_columns(header) == {"work_order": 0, "family": 1}
    assert [r.family for r in read_job_list(path)] == ["spot red", "black"]
    assert [r.family for r in read_job_list(path, ignore=["family"])] == [None, None]
    assert [r.run_hours for r in read_job_list(path, {"run_hours": "X"})] == [1.0, None]
    empty = tmp_path / "empty.csv"
    empty.write_text("", encoding="utf-8")
    with pytest.raises(JobListError, match="header row"):
        read_job_list_header(empty)
