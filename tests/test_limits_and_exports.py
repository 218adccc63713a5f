"""Limits, strict JSON, XLSX read by its cells, and exports that read back equal.

The refusals themselves are in the bad-input catalogue (test_bad_input_catalogue.py);
here: what is accepted, the scanners checked against outside references (the json
module's own parse, openpyxl's view of a cell, the csv module), and the README's table.
"""

from __future__ import annotations

import csv
import json
import math
import re
import zipfile
from pathlib import Path

import openpyxl
import pytest

from dispatcher import limits
from dispatcher.commands.common import print_json
from dispatcher.errors import InternalError
from dispatcher.io import shopfile
from dispatcher.io.grid import read_grid
from dispatcher.io.shopfile import (
    ShopFileError,
    json_depth_problem,
    load_shop,
    parse_shop_text,
    save_shop,
)
from dispatcher.io.spreadsheet import (
    clipboard_text,
    export_grid,
    export_plan,
    import_clipboard,
)
from dispatcher.shop import Job, Machine, Shop, shop_problems, solve_shop

ROOT = Path(__file__).resolve().parent.parent
FORMULA_NAMES = ["=SUM(A1:A9)", "+41 press", "-cut", "@line", "'quoted", "''twice", "plain"]


def test_readme_table_is_the_limits_module():
    readme = (ROOT / "README.md").read_text(encoding="utf-8")
    section = readme.split("## Limits", 1)[1].split("\n## ", 1)[0]
    rows = re.findall(r"^\| (.+?) \| (.+?) \|$", section, flags=re.MULTILINE)
    assert rows[2:] == limits.TABLE, "README's table of limits and dispatcher/limits.py differ"


def test_stale_sheet_dimension_does_not_hide_cells(tmp_path):
    book = openpyxl.Workbook()
    for row in [["l", "A", "B", "C"], ["J1", 1, 2, 3], ["J2", 4, 5, 6], ["J3", 7, 8, 9]]:
        book.active.append(row)
    path = tmp_path / "stale.xlsx"
    book.save(path)
    # Make the stored dimension lie (A1:B2) while cells exist in C, D and rows 3-4.
    member = "xl/worksheets/sheet1.xml"
    with zipfile.ZipFile(path) as z:
        parts = [(i, z.read(i)) for i in z.infolist()]
    with zipfile.ZipFile(path, "w", zipfile.ZIP_DEFLATED) as z:
        for info, data in parts:
            if info.filename == member:
                data, n = re.subn(rb'<dimension ref="[^"]+"', b'<dimension ref="A1:B2"', data)
                assert n == 1
            z.writestr(info, data)
    assert openpyxl.load_workbook(path, read_only=True).active.max_column == 2, "the lie holds"
    table = read_grid(path)
    assert table.machines == ["A", "B", "C"] and table.jobs == ["J1", "J2", "J3"]
    assert table.values.tolist() == [[1, 2, 3], [4, 5, 6], [7, 8, 9]]


def test_cells_at_the_limits_are_read(tmp_path):
    # a sheet exactly as wide and as long as the limits allow, with data in its last cell
    book = openpyxl.Workbook(write_only=True)
    sheet = book.create_sheet()
    sheet.append(["l", *[f"M{c}" for c in range(limits.MAX_MACHINES)]])
    sheet.append(["J0", *([1] * limits.MAX_MACHINES)])
    path = tmp_path / "wide.xlsx"
    book.save(path)
    assert len(read_grid(path).machines) == limits.MAX_MACHINES


def _formula_shop() -> Shop:
    shop = Shop(name="invented export shop",
                jobs=[Job(f"J{i}", n) for i, n in enumerate(FORMULA_NAMES)],
                machines=[Machine("M1", "=cmd|' /C calc'!A0"), Machine("M2", "-Press")])
    for i in range(len(FORMULA_NAMES)):
        shop.grid[(f"J{i}", "M1")] = float(i)
        if i % 2:
            shop.grid[(f"J{i}", "M2")] = 2.5
    return shop


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_grid_exports_with_formula_like_names_read_back_equal(tmp_path, suffix):
    shop = _formula_shop()
    path = tmp_path / f"grid{suffix}"
    export_grid(shop, path)
    table = read_grid(path)
    assert table.jobs == FORMULA_NAMES and table.machines == shop.machine_names()
    values, allowed = shop.matrix()
    assert (table.allowed == allowed).all() and (table.values[allowed] == values[allowed]).all()
    if suffix == ".xlsx":  # outside reader: openpyxl sees text cells, no formula anywhere
        sheet = openpyxl.load_workbook(path).active
        kinds = {c.value: c.data_type for row in sheet.iter_rows() for c in row if isinstance(c.value, str)}
        assert kinds["=SUM(A1:A9)"] == "s" and kinds["=cmd|' /C calc'!A0"] == "s"
        assert "f" not in kinds.values()
    else:  # outside reader: the csv module sees the apostrophe escape (OWASP, common practice)
        with open(path, newline="", encoding="utf-8") as f:
            rows = list(csv.reader(f))
        assert rows[0][1] == "'=cmd|' /C calc'!A0"
        assert [r[0] for r in rows[1:]] == ["'" + n if n[0] in "=+-@'" else n for n in FORMULA_NAMES]


def test_clipboard_block_escapes_and_reads_back():
    shop = _formula_shop()
    text = clipboard_text(shop)
    assert "\n'=SUM(A1:A9)\t" in text
    assert import_clipboard(text).shop.job_names() == FORMULA_NAMES


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_plan_exports_write_text_as_text(tmp_path, suffix):
    shop = _formula_shop()
    path = tmp_path / f"plan{suffix}"
    export_plan(solve_shop(shop), path, shop)
    if suffix == ".xlsx":
        book = openpyxl.load_workbook(path)
        cells = [c for row in book["plan"].iter_rows() for c in row if isinstance(c.value, str)]
        assert {c.data_type for c in cells} == {"s"}
        assert "=SUM(A1:A9)" in {c.value for c in cells}
        assert [c.value for c in book["totals"]["A"]][:2] == ["item", "objective"]
    else:
        with open(path, newline="", encoding="utf-8") as f:
            texts = [c for row in csv.reader(f) for c in row]
        assert "'=SUM(A1:A9)" in texts and "=SUM(A1:A9)" not in texts


def _depth(x) -> int:
    """Nesting depth by the json module's own parse (the reference)."""
    if isinstance(x, list):
        return 1 + max((_depth(v) for v in x), default=0)
    if isinstance(x, dict):
        return 1 + max((_depth(v) for v in x.values()), default=0)
    return 0


@pytest.mark.parametrize("chunk", [3, 7, 1 << 22])
def test_depth_scan_agrees_with_the_json_parser(monkeypatch, chunk):
    monkeypatch.setattr(shopfile, "_SCAN_CHUNK", chunk)
    texts = ['{"a": [[["x"]]]}', '{"a": "[[[[[[[[[[[[[["}', '["\\"[[[[[[[[[[[", [1]]',
             '["\\\\", [[[[[[[[1]]]]]]]]]', '[' * 8 + ']' * 8, '[' * 9 + ']' * 9,
             '{"k\\"{{{{{{{{{": {"v": [{"w": [[[[["\\\\\\""]]]]]}]}}']
    for text in texts:
        deep = json_depth_problem(text)
        assert (deep is not None) == (_depth(json.loads(text)) > limits.MAX_JSON_DEPTH), text


def test_depth_problem_names_line_and_column():
    problem = json_depth_problem('{\n  "x": ' + "[" * 20)
    assert problem.location == "line 2, column 15"


def test_print_json_refuses_non_finite_numbers(capsys):
    with pytest.raises(InternalError) as info:
        print_json({"total": math.inf})
    assert info.value.exit_code == 1 and "nothing was printed" in str(info.value)
    assert capsys.readouterr().out == ""
    print_json({"total": 3})
    assert json.loads(capsys.readouterr().out) == {"total": 3}


def test_shop_checks_hold_the_limits_for_edits_too(tmp_path):
    shop = Shop(name="invented", jobs=[Job("J1", "WO-1")], machines=[Machine("M1", "Press")])
    shop.grid[("J1", "M1")] = 2e12
    shop.machines[0].slots = limits.MAX_SLOTS + 1
    shop.jobs[0].name = "WO\x1b[0m"
    found = {str(p) for p in shop_problems(shop)}
    assert any("field 'slots'" in p and "from 1 to 100" in p for p in found)
    assert any("grid" in p and "from 0 to 1e12" in p for p in found)
    assert any("field 'name'" in p and "U+001B" in p for p in found)
    with pytest.raises(ShopFileError):
        save_shop(shop, tmp_path / "x.dshop")
    assert not (tmp_path / "x.dshop").exists()


def test_limits_themselves_are_accepted(tmp_path):
    doc = {"format": "dispatcher-shop", "format_version": 1,
           "machines": [{"id": "M1", "name": "P" * limits.MAX_NAME_CHARS, "slots": limits.MAX_SLOTS,
                         "notes": "line one\n\tline two"}],
           "jobs": [{"id": "J1", "name": "WO-1", "wait_penalty": limits.MAX_VALUE}],
           "grid": {"J1": {"M1": limits.MAX_VALUE}}}
    shop = parse_shop_text(json.dumps(doc))
    assert shop.machines[0].slots == limits.MAX_SLOTS
    path = tmp_path / "ok.dshop"
    save_shop(shop, path)
    assert load_shop(path) == shop
