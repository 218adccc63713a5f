"""Spreadsheet import into shops and export of grids and plans (pandas and openpyxl)."""

from __future__ import annotations

from pathlib import Path

import openpyxl
import pandas as pd
import pytest

from dispatcher.io.grid import GridFileError, read_grid
from dispatcher.io.shopfile import load_shop
from dispatcher.io.spreadsheet import (
    ExportError,
    clipboard_text,
    export_grid,
    export_plan,
    import_clipboard,
    import_grid_file,
    import_table,
)
from dispatcher.shop import solve_shop

SAMPLES = Path(__file__).resolve().parent.parent / "sample_shops"


@pytest.fixture
def medium():
    return load_shop(SAMPLES / "medium_machining_shop.dshop")


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_grid_export_reads_back_unchanged(tmp_path, medium, suffix):
    path = tmp_path / f"grid{suffix}"
    export_grid(medium, path)
    report = import_table(read_grid(path), medium)
    assert not report.added_jobs and not report.added_machines and not report.changed_cells
    assert not report.unmatched_jobs and not report.unmatched_machines
    assert report.shop == medium


def test_clipboard_block_round_trip_and_changes(medium):
    text = clipboard_text(medium)
    assert "\t" in text.splitlines()[0]
    assert import_clipboard(text, medium).shop == medium
    # change one cell to cannot-run and one to a new value
    lines = [line.split("\t") for line in text.splitlines()]
    lines[1][1] = "x"
    lines[2][2] = "7"
    report = import_clipboard("\n".join("\t".join(r) for r in lines), medium)
    changed = {(j, m): (old, new) for j, m, old, new in report.changed_cells}
    j1, m1 = lines[1][0], lines[0][1]
    j2, m2 = lines[2][0], lines[0][2]
    expect = {}
    if medium.value(medium.job_by_name(j1).id, medium.machine_by_name(m1).id) is not None:
        expect[(j1, m1)] = None
    if medium.value(medium.job_by_name(j2).id, medium.machine_by_name(m2).id) != 7:
        expect[(j2, m2)] = 7.0
    assert expect  # the edit did change something
    assert {k: v[1] for k, v in changed.items()} == expect
    assert medium == load_shop(SAMPLES / "medium_machining_shop.dshop")  # input not modified


def test_clipboard_errors_name_row_and_column(medium):
    with pytest.raises(GridFileError, match="pasted block: row 2, column 3 \\(C\\): 'fast' is not a number"):
        import_clipboard("label\tA\tB\nj\t1\tfast\n", medium)


def test_xlsx_formula_counts_as_stored_value(tmp_path):
    # openpyxl writes the formula without a cached value: it must be refused, not evaluated
    path = tmp_path / "f.xlsx"
    book = openpyxl.Workbook()
    sheet = book.active
    sheet.append(["label", "M"])
    sheet.append(["job", "=1+1"])
    book.save(path)
    with pytest.raises(GridFileError, match="formula has no stored value"):
        import_grid_file(path)


def test_new_shop_from_xlsx(tmp_path):
    path = tmp_path / "g.xlsx"
    pd.DataFrame({"M1": [3, "x"], "M2": [4.5, 1]}, index=["a", "b"]).to_excel(path)
    report = import_grid_file(path)
    assert report.added_jobs == ["a", "b"] and report.added_machines == ["M1", "M2"]
    shop = report.shop
    assert shop.value("J2", "M1") is None and shop.value("J1", "M2") == 4.5


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_plan_export(tmp_path, medium, suffix):
    plan = solve_shop(medium)
    path = tmp_path / f"plan{suffix}"
    export_plan(plan, path, medium)
    frame = pd.read_csv(path) if suffix == ".csv" else pd.read_excel(path, sheet_name="plan")
    dispatched = frame[frame.status == "dispatched"]
    assert sorted(zip(dispatched.job, dispatched.machine)) == sorted((a.job, a.machine) for a in plan.assignments)
    assert dispatched.value.sum() == pytest.approx(sum(a.cost for a in plan.assignments))
    assert set(frame[frame.status == "waiting"].job) == set(plan.waiting_jobs)
    assert set(frame[frame.status == "running"].job) == {r.job for r in plan.running}
    if suffix == ".xlsx":
        totals = pd.read_excel(path, sheet_name="totals")
        assert float(totals.set_index("item").loc["total", "value"]) == pytest.approx(plan.total)


def test_export_refuses_unknown_extension_and_keeps_existing(tmp_path, medium):
    with pytest.raises(ExportError, match="unsupported extension"):
        export_grid(medium, tmp_path / "grid.ods")
    path = tmp_path / "grid.csv"
    path.write_text("keep me", encoding="utf-8")
    with pytest.raises(ExportError, match="cannot write"):
        export_grid(medium, tmp_path / "missing" / "grid.csv")
    assert path.read_text(encoding="utf-8") == "keep me"
