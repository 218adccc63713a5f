"""Grid files (CSV and XLSX): the format, the delimiters, and every bad input refused clearly.

Each refusal must be a :class:`GridFileError` whose message names the file and, where it
applies, the spreadsheet row and column (counted from 1, as a spreadsheet shows them).
XLSX files are written here with openpyxl, an outside library.
"""

from __future__ import annotations

import os

import numpy as np
import openpyxl
import pytest

from dispatcher.io.grid import (
    MAX_FILE_BYTES,
    MAX_JOBS,
    MAX_MACHINES,
    GridFileError,
    column_letter,
    parse_grid_text,
    read_grid,
)


def write(tmp_path, name: str, content: str | bytes):
    path = tmp_path / name
    if isinstance(content, bytes):
        path.write_bytes(content)
    else:
        path.write_text(content, encoding="utf-8", newline="")
    return path


def write_xlsx(tmp_path, rows, name="grid.xlsx"):
    book = openpyxl.Workbook()
    sheet = book.active
    for row in rows:
        sheet.append(row)
    path = tmp_path / name
    book.save(path)
    return path


GOOD = [
    ["setup minutes", "Lathe", "Mill", "Press"],
    ["J1", 4, "x", 7.5],
    ["J2", 0, 3, ""],
    ["J3", "X", 2, 1],
]
EXPECT_VALUES = np.array([[4, 0, 7.5], [0, 3, 0], [0, 2, 1]])
EXPECT_ALLOWED = np.array([[1, 0, 1], [1, 1, 0], [0, 1, 1]], dtype=bool)


def _assert_good(table):
    assert table.jobs == ["J1", "J2", "J3"]
    assert table.machines == ["Lathe", "Mill", "Press"]
    np.testing.assert_array_equal(table.allowed, EXPECT_ALLOWED)
    np.testing.assert_array_equal(np.where(table.allowed, table.values, 0), EXPECT_VALUES)


def _csv(delimiter: str, decimal: str = ".") -> str:
    lines = []
    for row in GOOD:
        lines.append(delimiter.join(str(c).replace(".", decimal) for c in row))
    return "\r\n".join(lines) + "\r\n"


@pytest.mark.parametrize("delimiter, decimal, suffix", [
    (",", ".", ".csv"),
    (";", ".", ".csv"),
    (";", ",", ".csv"),   # European spreadsheets: semicolons and a decimal comma
    ("\t", ".", ".tsv"),
    ("\t", ".", ".txt"),
])
def test_delimiters(tmp_path, delimiter, decimal, suffix):
    _assert_good(read_grid(write(tmp_path, "grid" + suffix, _csv(delimiter, decimal))))


def test_decimal_comma_value_with_semicolons(tmp_path):
    table = read_grid(write(tmp_path, "eu.csv", "label;M1;M2\nJ1;12,5;0,25\n"))
    assert table.values.tolist() == [[12.5, 0.25]]


def test_utf8_bom_names_and_quotes(tmp_path):
    text = '\ufefflabel,"Säge, groß",Fräse\n"Auftrag ""7""",1,2\n'
    table = read_grid(write(tmp_path, "bom.csv", text))
    assert table.label == "label"
    assert table.machines == ["Säge, groß", "Fräse"]
    assert table.jobs == ['Auftrag "7"']


def test_trailing_empty_rows_and_cells_are_ignored(tmp_path):
    table = read_grid(write(tmp_path, "t.csv", "l,A,B,,\nJ1,1,2,,\nJ2,3,x\n,,\n\n"))
    assert table.jobs == ["J1", "J2"] and table.machines == ["A", "B"]
    assert table.allowed.tolist() == [[True, True], [True, False]]


def test_pasted_block_source_name():
    with pytest.raises(GridFileError, match=r"^pasted block: row 2, column 2 \(B\): 'oops' is not a number"):
        parse_grid_text("l\tA\nJ1\toops\n")


def test_xlsx_round_trip(tmp_path):
    _assert_good(read_grid(write_xlsx(tmp_path, GOOD)))


def _store_formula_value(path, value: str) -> None:
    """Write a cached value into every formula cell, as a spreadsheet program does on save."""
    import zipfile

    with zipfile.ZipFile(path) as src:
        parts = {name: src.read(name) for name in src.namelist()}
    sheet = "xl/worksheets/sheet1.xml"
    assert b"<v />" in parts[sheet]
    parts[sheet] = parts[sheet].replace(b"<v />", f"<v>{value}</v>".encode())
    with zipfile.ZipFile(path, "w") as dst:
        for name, data in parts.items():
            dst.writestr(name, data)


def test_xlsx_formula_counts_as_its_stored_value(tmp_path):
    # Nothing is executed: the formula's text is ignored, only the stored value is read.
    rows = [list(r) for r in GOOD]
    rows[2][2] = "=1+2"
    path = write_xlsx(tmp_path, rows)
    _store_formula_value(path, "3")
    table = read_grid(path)
    assert table.values[1, 1] == 3 and table.allowed[1, 1]


def test_xlsx_formula_without_stored_value_is_refused(tmp_path):
    # openpyxl writes formulas without a cached value: the reader must refuse, naming the cell.
    rows = [list(r) for r in GOOD]
    rows[2][2] = "=1+2"
    path = write_xlsx(tmp_path, rows)
    with pytest.raises(GridFileError, match=r"grid\.xlsx: row 3, column 3 \(C\): formula has no stored value"):
        read_grid(path)


def test_xlsx_text_and_negative_cells(tmp_path):
    rows = [list(r) for r in GOOD]
    rows[1][1] = "fast"
    with pytest.raises(GridFileError, match=r"row 2, column 2 \(B\): 'fast' is not a number"):
        read_grid(write_xlsx(tmp_path, rows, "a.xlsx"))
    rows[1][1] = -4
    with pytest.raises(GridFileError, match=r"row 2, column 2 \(B\): -4 is negative"):
        read_grid(write_xlsx(tmp_path, rows, "b.xlsx"))
    rows[1][1] = True
    with pytest.raises(GridFileError, match=r"row 2, column 2 \(B\): True is not a number"):
        read_grid(write_xlsx(tmp_path, rows, "c.xlsx"))


BAD_CSV = [
    ("header only", "label,A,B\n", r"only a header row"),
    ("no machines", "label\nJ1\n", r"row 1: the header row has no machine names"),
    ("ragged short", "l,A,B\nJ1,1,2\nJ2,1\n", r"row 3: has 2 cells, the header has 3"),
    ("ragged long", "l,A,B\nJ1,1,2,3\n", r"row 2: has 4 cells, the header has 3"),
    ("duplicate job", "l,A,B\nJ1,1,2\nJ1,3,4\n", r"row 3, column 1 \(A\): job name 'J1' repeats row 2"),
    ("duplicate machine", "l,A,A\nJ1,1,2\n", r"row 1, column 3 \(C\): machine name 'A' repeats column 2"),
    ("empty machine name", "l,A,,B\nJ1,1,2,3\n", r"row 1, column 3 \(C\): machine name is empty"),
    ("empty job name", "l,A\n,1\n", r"row 2, column 1 \(A\): job name is empty"),
    ("text cell", "l,A,B\nJ1,1,fast\n", r"row 2, column 3 \(C\): 'fast' is not a number"),
    ("nan", "l,A,B\nJ1,NaN,2\n", r"row 2, column 2 \(B\): 'NaN' is not a finite number"),
    ("inf", "l,A,B\nJ1,1,inf\n", r"row 2, column 3 \(C\): 'inf' is not a finite number"),
    ("minus infinity", "l,A,B\nJ1,1,-Infinity\n", r"column 3 \(C\): '-Infinity' is not a finite number"),
    ("negative", "l,A,B\nJ1,1,-3\n", r"row 2, column 3 \(C\): -3 is negative"),
    ("decimal comma with commas", 'l,A\nJ1,"1,5"\n', r"row 2, column 2 \(B\): '1,5' is not a number"),
]


@pytest.mark.parametrize("content, message", [c[1:] for c in BAD_CSV], ids=[c[0] for c in BAD_CSV])
def test_bad_csv(tmp_path, content, message):
    path = write(tmp_path, "bad.csv", content)
    with pytest.raises(GridFileError, match=message) as info:
        read_grid(path)
    assert str(info.value).startswith(str(path) + ":"), "the message names the file first"


def test_error_row_and_column_attributes(tmp_path):
    with pytest.raises(GridFileError) as info:
        read_grid(write(tmp_path, "g.csv", "l,A,B\nJ1,1,2\nJ2,3,zz\n"))
    assert (info.value.row, info.value.column) == (3, 3)
    assert info.value.source.endswith("g.csv")


def test_missing_file(tmp_path):
    with pytest.raises(GridFileError, match=r"nowhere\.csv: file not found"):
        read_grid(tmp_path / "nowhere.csv")


def test_empty_file(tmp_path):
    with pytest.raises(GridFileError, match=r"empty\.csv: the file is empty"):
        read_grid(write(tmp_path, "empty.csv", ""))


def test_blank_lines_only(tmp_path):
    with pytest.raises(GridFileError, match=r"the file is empty"):
        read_grid(write(tmp_path, "blank.csv", "\n\n  \n"))


def test_folder(tmp_path):
    (tmp_path / "folder.csv").mkdir()
    with pytest.raises(GridFileError, match=r"folder\.csv: is a folder"):
        read_grid(tmp_path / "folder.csv")


@pytest.mark.parametrize("name", ["grid.pdf", "grid.json", "grid", "grid.xls", "grid.csv.exe"])
def test_wrong_extension(tmp_path, name):
    path = write(tmp_path, name, "l,A\nJ1,1\n")
    with pytest.raises(GridFileError, match=r"unsupported extension"):
        read_grid(path)


def test_non_utf8(tmp_path):
    data = "l,A,B\nJ1,1,2\nPièce,3,4\n".encode("latin-1")
    with pytest.raises(GridFileError, match=r"latin\.csv: row 3: is not UTF-8 text"):
        read_grid(write(tmp_path, "latin.csv", data))


def test_binary_file_with_csv_extension(tmp_path):
    png = b"\x89PNG\r\n\x1a\n" + bytes(range(256))
    with pytest.raises(GridFileError, match=r"picture\.csv: row 1: is not UTF-8 text"):
        read_grid(write(tmp_path, "picture.csv", png))
    with pytest.raises(GridFileError, match=r"zeros\.csv: contains binary data"):
        read_grid(write(tmp_path, "zeros.csv", b"l,A\nJ1,\x00\n"))


def test_xlsx_saved_as_csv(tmp_path):
    xlsx = write_xlsx(tmp_path, GOOD)
    with pytest.raises(GridFileError, match=r"looks like a zipped spreadsheet"):
        read_grid(write(tmp_path, "renamed.csv", xlsx.read_bytes()))


@pytest.mark.parametrize("content", [b"l,A\nJ1,1\n", b"PK\x03\x04 not really a zip", b""])
def test_not_a_spreadsheet_with_xlsx_extension(tmp_path, content):
    message = r"fake\.xlsx: (is not an XLSX workbook \(not a zip archive\)|the file is empty)"
    with pytest.raises(GridFileError, match=message):
        read_grid(write(tmp_path, "fake.xlsx", content))


def test_over_the_byte_limit_is_refused_before_reading(tmp_path):
    # A sparse file: its size is over the limit but it occupies no disk; reading its zero
    # bytes would report binary data, so the size message proves nothing was read.
    path = tmp_path / "huge.csv"
    with open(path, "wb") as f:
        f.truncate(MAX_FILE_BYTES + 1)
    with pytest.raises(GridFileError, match=rf"huge\.csv: {MAX_FILE_BYTES + 1} bytes exceed the limit"):
        read_grid(path)


def test_too_many_rows_refused_before_the_cells_are_parsed(tmp_path):
    # Every cell is text: had the cells been parsed, the message would be about a number.
    lines = ["l,A"] + [f"J{i},oops" for i in range(MAX_JOBS + 5)]
    with pytest.raises(GridFileError, match=rf"job rows exceed the limit of {MAX_JOBS}"):
        read_grid(write(tmp_path, "rows.csv", "\n".join(lines)))


def test_too_many_rows_xlsx_stops_reading_early(tmp_path):
    book = openpyxl.Workbook(write_only=True)
    sheet = book.create_sheet()
    sheet.append(["l", "A"])
    for i in range(MAX_JOBS + 50):
        sheet.append([f"J{i}", "oops"])
    path = tmp_path / "rows.xlsx"
    book.save(path)
    with pytest.raises(GridFileError, match=rf"more than {MAX_JOBS} job rows .*not read"):
        read_grid(path)


def test_too_many_machines(tmp_path):
    header = "l," + ",".join(f"M{j}" for j in range(MAX_MACHINES + 1))
    row = "J1," + ",".join("oops" for _ in range(MAX_MACHINES + 1))
    with pytest.raises(GridFileError, match=rf"{MAX_MACHINES + 1} machine columns exceed the limit"):
        read_grid(write(tmp_path, "wide.csv", header + "\n" + row + "\n"))


def test_exactly_at_the_row_limit_is_accepted(tmp_path):
    lines = ["l,A"] + [f"J{i},1" for i in range(MAX_JOBS)]
    table = read_grid(write(tmp_path, "limit.csv", "\n".join(lines) + "\n\n\n"))
    assert len(table.jobs) == MAX_JOBS


def test_column_letters():
    assert [column_letter(c) for c in (1, 2, 26, 27, 52, 53, 702, 703)] == \
        ["A", "B", "Z", "AA", "AZ", "BA", "ZZ", "AAA"]


def test_sample_grid_reads(samples):
    table = read_grid(samples / "sheet_metal_grid.csv")
    assert len(table.jobs) == 12 and len(table.machines) == 8
    assert not table.allowed.all(), "the sample has incompatible pairs"
    assert os.path.getsize(samples / "sheet_metal_grid.csv") < MAX_FILE_BYTES


# ----------------------------------------------------------------- round trips (hypothesis)

from hypothesis import HealthCheck, assume, given, settings  # noqa: E402
from hypothesis import strategies as st  # noqa: E402

_name = st.text(st.characters(blacklist_categories=("Cs", "Cc", "Zl", "Zp")), min_size=1, max_size=12) \
    .map(str.strip).filter(lambda s: s and not s.startswith("\ufeff") and s not in ("x", "X")
                           and not s.startswith(("'=", "'+", "'-", "'@", "''")))  # escapes
_cell = st.one_of(st.sampled_from(["x", "X", ""]),
                  st.floats(0, 1e9, allow_nan=False, allow_infinity=False),
                  st.integers(0, 10**9))


@st.composite
def grids(draw):
    m = draw(st.integers(1, 6))
    n = draw(st.integers(1, 6))
    jobs = draw(st.lists(_name, min_size=m, max_size=m, unique=True))
    machines = draw(st.lists(_name, min_size=n, max_size=n, unique=True))
    cells = draw(st.lists(st.lists(_cell, min_size=n, max_size=n), min_size=m, max_size=m))
    label = draw(st.one_of(st.just(""), _name))
    return label, jobs, machines, cells


def _check_round_trip(table, jobs, machines, cells, rel=0.0):
    assert table.jobs == jobs and table.machines == machines
    for i, row in enumerate(cells):
        for j, cell in enumerate(row):
            if isinstance(cell, str):
                assert not table.allowed[i, j]
            else:
                assert table.allowed[i, j]
                assert table.values[i, j] == pytest.approx(float(cell), rel=rel, abs=0)


@settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(grid=grids(), style=st.sampled_from([(",", "."), (";", "."), (";", ","), ("\t", ".")]))
def test_csv_round_trip(tmp_path, grid, style):
    # Reference: files written by Python's csv module (an outside writer) in each dialect.
    import csv
    import io

    label, jobs, machines, cells = grid
    delimiter, decimal = style
    buffer = io.StringIO()
    writer = csv.writer(buffer, delimiter=delimiter)
    writer.writerow([label, *machines])
    for name, row in zip(jobs, cells):
        writer.writerow([name, *[c if isinstance(c, str) else repr(c).replace(".", decimal) for c in row]])
    path = tmp_path / "round.csv"
    path.write_text(buffer.getvalue(), encoding="utf-8", newline="")
    try:
        table = read_grid(path)
    except GridFileError as exc:
        # The only refusal allowed: a name that itself holds the delimiter guessed wrongly
        # from the header; the message must still name the file.
        assert str(path) in str(exc)
        assert any(d in "".join([label, *machines]) for d in ",;\t")
        return
    _check_round_trip(table, jobs, machines, cells)


@settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(grid=grids())
def test_xlsx_round_trip_hypothesis(tmp_path, grid):
    # Reference: workbooks written by openpyxl (an outside writer).
    label, jobs, machines, cells = grid
    # openpyxl stores any text starting with "=" as a formula: not a name then.
    assume(not any(name.startswith("=") for name in [label, *jobs, *machines]))
    book = openpyxl.Workbook()
    book.active.append([label or None, *machines])
    for name, row in zip(jobs, cells):
        book.active.append([name, *[None if c == "" else c for c in row]])
    path = tmp_path / "round.xlsx"
    book.save(path)
    # openpyxl may write the last of 17 significant digits differently (spreadsheets keep 15).
    _check_round_trip(read_grid(path), jobs, machines, cells, rel=1e-15)
