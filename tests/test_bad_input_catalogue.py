"""The bad-input catalogue: every refusal of a file or option, end to end through the CLI.

Each case builds its bad file here (generated, never a committed copy), runs
:func:`dispatcher.cli.main` in-process and asserts: the exit code, no traceback (an
uncaught exception would fail the test itself, and stderr must not hold one), a message
naming the file and the place (row and column, cell address, or job/machine and field),
and every file in the folder unchanged byte for byte (SHA-256 of each, before and after;
no file added or removed). The history's own cases live with the history tests.
"""

from __future__ import annotations

import hashlib
import json
import re
import struct
import zipfile
from collections.abc import Callable
from dataclasses import dataclass
from pathlib import Path

import openpyxl
import pytest

from dispatcher.cli import main
from dispatcher.limits import MAX_JOBS, MAX_PINS, MAX_SLOTS, MAX_XLSX_UNPACKED_BYTES

GOOD_CSV = "setup minutes,Lathe,Mill\nJ1,4,x\nJ2,0,3\n"


def base_doc(**changes) -> dict:
    """A small invented shop document (two jobs, two presses) as a dict."""
    doc = {"format": "dispatcher-shop", "format_version": 1, "name": "invented test shop",
           "machines": [{"id": "M1", "name": "Press 1"}, {"id": "M2", "name": "Press 2"}],
           "jobs": [{"id": "J1", "name": "WO-1 lid"}, {"id": "J2", "name": "WO-2 clip"}],
           "grid": {"J1": {"M1": 5, "M2": 7}, "J2": {"M1": 3}}}
    doc.update(changes)
    return doc


def write_doc(folder: Path, doc: dict | str, name: str = "shop.dshop") -> Path:
    path = folder / name
    path.write_text(doc if isinstance(doc, str) else json.dumps(doc), encoding="utf-8")
    return path


def write_text(folder: Path, name: str, text: str) -> Path:
    path = folder / name
    path.write_text(text, encoding="utf-8", newline="")
    return path


def write_book(folder: Path, cells: dict[tuple[int, int], object], name: str = "grid.xlsx") -> Path:
    """A workbook written by openpyxl with the given (row, column) -> value cells."""
    book = openpyxl.Workbook()
    sheet = book.active
    for (r, c), v in cells.items():
        sheet.cell(row=r, column=c, value=v)
    path = folder / name
    book.save(path)
    return path


def good_book_cells() -> dict[tuple[int, int], object]:
    return {(1, 1): "setup minutes", (1, 2): "Lathe", (1, 3): "Mill",
            (2, 1): "J1", (2, 2): 4, (2, 3): 2, (3, 1): "J2", (3, 2): 1, (3, 3): 3}


def rewrite_member(path: Path, member: str, change: Callable[[bytes], bytes]) -> None:
    """Rewrite one part of a zip archive (the rest copied as it is)."""
    with zipfile.ZipFile(path) as src:
        parts = [(info, src.read(info)) for info in src.infolist()]
    with zipfile.ZipFile(path, "w", zipfile.ZIP_DEFLATED) as out:
        for info, data in parts:
            out.writestr(info, change(data) if info.filename == member else data)


def forge_unpacked_size(path: Path, member: str, size: int) -> None:
    """Overwrite a member's uncompressed size in the zip central directory (a forged entry)."""
    data = bytearray(path.read_bytes())
    name = member.encode()
    at = 0
    while True:
        at = data.index(b"PK\x01\x02", at)
        name_len = struct.unpack_from("<H", data, at + 28)[0]
        if bytes(data[at + 46:at + 46 + name_len]) == name:
            struct.pack_into("<I", data, at + 24, size)
            break
        at += 4
    path.write_bytes(bytes(data))


# ----------------------------------------------------------------------------- the cases

@dataclass
class Case:
    """``make(folder)`` writes the files and returns (argv, the path the message must name)."""

    id: str
    make: Callable[[Path], tuple[list[str], Path]]
    exit_code: int
    message: str  # regex the stderr must match (place and problem)


def _solve(path: Path, *more: str) -> tuple[list[str], Path]:
    return ["solve", str(path), *more], path


def xlsx_far_machine(folder):
    cells = good_book_cells()
    cells[(1, 16384)] = "Far press"  # column XFD, the last one a sheet has
    return _solve(write_book(folder, cells))


def xlsx_last_row(folder):
    cells = good_book_cells()
    cells[(1048576, 2)] = 5  # the last row a sheet has
    return _solve(write_book(folder, cells))


def xlsx_renamed_zip(folder):
    path = folder / "letter.xlsx"
    with zipfile.ZipFile(path, "w") as z:
        z.writestr("[Content_Types].xml", "<Types/>")
        z.writestr("word/document.xml", "<document/>")
    return _solve(path)


def xlsx_bomb_directory(folder):
    path = write_book(folder, good_book_cells())
    forge_unpacked_size(path, "xl/worksheets/sheet1.xml", MAX_XLSX_UNPACKED_BYTES + 1)
    return _solve(path)


def xlsx_unpacks_past_its_directory(folder):
    # The directory says 200 bytes; the part holds more. The zip reader stops at 200 bytes
    # and the checksum then fails: nothing past the declared size is ever unpacked.
    path = write_book(folder, good_book_cells())
    forge_unpacked_size(path, "xl/worksheets/sheet1.xml", 200)
    return _solve(path)


def shop_over_slots(folder):
    doc = base_doc()
    doc["machines"][0]["slots"] = 2_000_000
    return _solve(write_doc(folder, doc))


def shop_too_many_jobs(folder):
    doc = base_doc(jobs=[{"id": f"J{i}", "name": f"WO-{i}"} for i in range(MAX_JOBS + 1)])
    return _solve(write_doc(folder, doc))


def shop_too_many_pins(folder):
    doc = base_doc(pins=[{"job": "J1", "machine": "M1"}] * (MAX_PINS + 1))
    return _solve(write_doc(folder, doc))


def shop_long_name(folder):
    doc = base_doc()
    doc["machines"][1]["name"] = "P" * 201
    return _solve(write_doc(folder, doc))


def shop_long_note(folder):
    doc = base_doc()
    doc["jobs"][0]["notes"] = "n" * 10_001
    return _solve(write_doc(folder, doc))


def shop_deep_nesting(folder):
    return _solve(write_doc(folder, '{"format": "dispatcher-shop", "x": ' + "[" * 100_000))


def shop_huge_value(folder):
    doc = base_doc(grid={"J1": {"M1": 1e308, "M2": 1e308}, "J2": {"M1": 3}})
    return _solve(write_doc(folder, doc))


def shop_control_name(folder):
    doc = base_doc()
    doc["jobs"][1]["name"] = "WO-2 \x1b[31mred"
    return _solve(write_doc(folder, doc))


def shop_newline_name(folder):
    doc = base_doc()
    doc["machines"][0]["name"] = "Press\n1"
    return _solve(write_doc(folder, doc))


def shop_202_bad_values(folder):
    jobs = [{"id": f"J{i}", "name": f"WO-{i}"} for i in range(202)]
    doc = base_doc(jobs=jobs, grid={f"J{i}": {"M1": "fast"} for i in range(202)})
    return _solve(write_doc(folder, doc))


def shop_rush_all_busy(folder):
    doc = base_doc(machines=[{"id": "M1", "name": "Press 1", "state": "down"},
                             {"id": "M2", "name": "Press 2"}],
                   jobs=[{"id": "J1", "name": "WO-1 lid", "rush": True},
                         {"id": "J2", "name": "WO-2 clip", "state": "running", "machine": "M2"}],
                   grid={"J1": {"M1": 5, "M2": 7}, "J2": {"M2": 3}})
    return _solve(write_doc(folder, doc), "--must-run", "WO-1 lid")


def csv_text(text: str, name: str = "grid.csv"):
    return lambda folder: _solve(write_text(folder, name, text))


def folder_as_grid(folder):
    path = folder / "grids"
    path.mkdir()
    return _solve(path)


def time_limit_alone(folder):
    return _solve(write_text(folder, "grid.csv", GOOD_CSV), "--time-limit", "5")


def sheet_pdf_named_txt(folder):
    path = write_doc(folder, base_doc())
    return ["sheet", str(path), "--pdf", str(folder / "sheet.txt")], folder / "sheet.txt"


def convert_to_json(folder):
    grid = write_text(folder, "grid.csv", GOOD_CSV)
    return ["convert", str(grid), str(folder / "shop.json")], folder / "shop.json"


def convert_over_document(folder):
    grid = write_text(folder, "grid.csv", GOOD_CSV)
    old = write_doc(folder, base_doc(), "old.dshop")
    return ["convert", str(grid), str(old)], old


def convert_into_itself(folder):
    grid = write_text(folder, "grid.csv", GOOD_CSV)
    old = write_doc(folder, base_doc(), "old.dshop")
    return ["convert", str(grid), str(old), "--into", str(old), "--force"], old


def convert_folder(folder):
    path = folder / "grids"
    path.mkdir()
    return ["convert", str(path), str(folder / "new.dshop")], path


def history_export_xlsx(folder):
    history = folder / "history.sqlite"
    assert main(["history", "init", str(history)]) == 0
    target = folder / "decisions.xlsx"
    return ["history", "export", str(target), "--history", str(history)], target


CASES = [
    Case("xlsx machine name in column XFD", xlsx_far_machine, 2,
         r"row 1, column 16384 \(XFD\): .*cell XFD1 lies beyond it"),
    Case("xlsx value in the last row", xlsx_last_row, 2,
         r"row 1048576, column 2 \(B\): more than 10000 job rows .*cell B1048576 lies beyond it"),
    Case("xlsx renamed zip", xlsx_renamed_zip, 2,
         r"is a zip archive but not an XLSX workbook \(it looks like a Word document"),
    Case("xlsx directory unpacks past the limit", xlsx_bomb_directory, 2,
         rf"unpacks to [\d,]+ bytes, more than the limit of {MAX_XLSX_UNPACKED_BYTES:,} "
         r"\(refused before unpacking\)"),
    Case("xlsx part larger than its directory says", xlsx_unpacks_past_its_directory, 2,
         r"the XLSX workbook is damaged and cannot be read"),
    Case("shop slots 2000000", shop_over_slots, 2,
         rf"machine 'Press 1' \(#1\), field 'slots': 2,000,000 is more than the limit of {MAX_SLOTS}"),
    Case("shop too many jobs", shop_too_many_jobs, 2,
         rf"field 'jobs': {MAX_JOBS + 1:,} jobs are more than the limit of {MAX_JOBS:,}"),
    Case("shop too many pins", shop_too_many_pins, 2,
         rf"field 'pins': {MAX_PINS + 1:,} pins are more than the limit"),
    Case("shop name over the length limit", shop_long_name, 2,
         r"machine #2, field 'name': is 201 characters long; the limit is 200"),
    Case("shop note over the length limit", shop_long_note, 2,
         r"job 'WO-1 lid' \(#1\), field 'notes': is 10,001 characters long; the limit is 10,000"),
    Case("shop nested 100000 deep", shop_deep_nesting, 2,
         r"line 1, column \d+: lists and objects nest more than 8 levels deep"),
    Case("shop values of 1e308", shop_huge_value, 2,
         r"grid, job 'WO-1 lid' \(id J1\), machine 'Press 1' \(id M1\): 1e\+308 is beyond the limit of 1e12"),
    Case("shop job name with an ANSI escape", shop_control_name, 2,
         r"job #2, field 'name': contains the control character U\+001B"),
    Case("shop machine name with a newline", shop_newline_name, 2,
         r"machine #1, field 'name': contains the control character U\+000A"),
    Case("shop 202 bad values, all listed", shop_202_bad_values, 2,
         r"202 problems:\n(  grid, job 'WO-\d+' .*\n){202}"),
    Case("shop must-run job, capable machines all taken", shop_rush_all_busy, 3,
         r"WO-1 lid \(1\) have no free slot: the machines that can run them are all taken: "
         r"Press 1 \(down\); Press 2 \(all 1 slot\(s\) running: WO-2 clip\)"),
    Case("csv value 1e308", csv_text("l,A,B\nJ1,1e308,1e308\n"), 2,
         r"row 2, column 2 \(B\): 1e\+308 is beyond the limit of 1e12"),
    Case("csv 1_000", csv_text("l,A\nJ1,1_000\n"), 2, r"row 2, column 2 \(B\): '1_000' is not a number"),
    Case("csv header mixes comma and tab", csv_text("job,M1\tM2\nJ1,1\t2\n"), 2,
         r"row 1: the header row mixes tab and ',' between cells"),
    Case("csv row separated by commas under a tab header", csv_text("job\tM1\tM2\nJ1,1,2\n", "g.tsv"), 2,
         r"row 2: this row has no tab between cells but ','"),
    Case("csv tab inside a name of a comma file", csv_text('l,A\n"J\t1",2\n'), 2,
         r"row 2, column 1 \(A\): job name contains the control character U\+0009.*a tab"),
    Case("csv unclosed quote", csv_text('l,A,B\nJ1,"1,2\nJ2,3,4\n'), 2,
         r'row 2: a quote \(\"\) opened in this row is never closed'),
    Case("csv cell over the length limit", csv_text('l,A\nJ1,1\nJ2,"' + "9" * 140_000 + '"\n'), 2,
         r"row 3: a cell is longer than 131,072 characters"),
    Case("csv name over the length limit", csv_text("l,A\n" + "J" * 300 + ",1\n"), 2,
         r"row 2, column 1 \(A\): job name is 300 characters long; the limit is 200"),
    Case("csv machine name with an ANSI escape", csv_text("l,\x1b[2JA\nJ1,1\n"), 2,
         r"row 1, column 2 \(B\): machine name contains the control character U\+001B"),
    Case("folder given as the grid", folder_as_grid, 2, r"is a folder, not a grid file"),
    Case("--time-limit without --fill-shift", time_limit_alone, 2,
         r"--time-limit applies to --fill-shift only"),
    Case("sheet --pdf with a .txt name", sheet_pdf_named_txt, 2,
         r"the sheet is written as PDF, so the file name must end in \.pdf \(got '\.txt'\)"),
    Case("convert a grid to .json", convert_to_json, 2,
         r"must end in \.dshop \(got '\.json'\)"),
    Case("convert over an existing document", convert_over_document, 2,
         r"already exists; replacing it would lose its states, pins and plan in force"),
    Case("convert --into its own output", convert_into_itself, 2,
         r"is the --into document, which is only read"),
    Case("convert a folder", convert_folder, 2, r"is a folder, not a file"),
    Case("history export to .xlsx", history_export_xlsx, 2,
         r"the export is CSV text, so the file name must end in \.csv \(got '\.xlsx'\)"),
]


def _checksums(folder: Path) -> dict[str, str]:
    return {str(p.relative_to(folder)): hashlib.sha256(p.read_bytes()).hexdigest()
            for p in sorted(folder.rglob("*")) if p.is_file()}


@pytest.mark.parametrize("case", CASES, ids=[c.id for c in CASES])
def test_catalogue(case, tmp_path, capsys):
    argv, named = case.make(tmp_path)
    capsys.readouterr()
    before = _checksums(tmp_path)
    code = main(argv)
    out, err = capsys.readouterr()
    assert code == case.exit_code, err
    assert "Traceback" not in err and "Traceback" not in out
    assert err.startswith(f"dispatcher: {named}: "), err[:300]
    assert re.search(case.message, err), err[:2000]
    assert _checksums(tmp_path) == before, "a file was changed, added or removed"


def test_every_problem_is_printed_one_per_line_count_first(tmp_path, capsys):
    argv, path = shop_202_bad_values(tmp_path)
    assert main(argv) == 2
    lines = capsys.readouterr().err.rstrip("\n").split("\n")
    assert lines[0] == f"dispatcher: {path}: 202 problems:"
    assert len(lines) == 203
    named = {re.search(r"job '(WO-\d+)'", line).group(1) for line in lines[1:]}
    assert named == {f"WO-{i}" for i in range(202)}


def test_forced_convert_replaces_the_document_and_new_paths_need_no_force(tmp_path, capsys):
    grid = write_text(tmp_path, "grid.csv", GOOD_CSV)
    old = write_doc(tmp_path, base_doc(), "old.dshop")
    assert main(["convert", str(grid), str(tmp_path / "new.dshop")]) == 0
    assert main(["convert", str(grid), str(old), "--force"]) == 0
    assert json.loads(old.read_text(encoding="utf-8"))["machines"][0]["name"] == "Lathe"
    # --into reads one document and writes another; the one read stays as it was
    into = write_doc(tmp_path, base_doc(), "into.dshop")
    before = into.read_bytes()
    assert main(["convert", str(grid), str(tmp_path / "merged.dshop"), "--into", str(into)]) == 0
    assert into.read_bytes() == before
    merged = json.loads((tmp_path / "merged.dshop").read_text(encoding="utf-8"))
    assert {m["name"] for m in merged["machines"]} == {"Press 1", "Press 2", "Lathe", "Mill"}
    capsys.readouterr()
