"""Grid files: a table of setup values, jobs as rows and machines as columns.

Layout (CSV or XLSX, first sheet): the first row holds machine names (its first cell is a
label and is ignored); the first column holds job names; every other cell is a number
>= 0, or empty / ``x`` / ``X`` when the machine cannot run the job. CSV may use comma,
semicolon or tab between cells; with semicolons a decimal comma (``12,5``) is accepted,
as European spreadsheets write it. Text is read as UTF-8 (a byte-order mark is fine).

Nothing in a file is ever executed: CSV is parsed as text, and XLSX is read for its stored
cell values only (a formula counts as the value it last showed; one that was never
calculated is refused). In delimited text a leading apostrophe before ``=``, ``+``, ``-``,
``@`` or another apostrophe is the spreadsheet escape our exports write (so no program
opening them runs a formula) and is dropped on reading.

XLSX sheets are read by the cells they hold, never by the size the sheet declares (a
stale ``<dimension>`` would hide columns and rows); the zip directory's unpacked sizes are
checked against :data:`~dispatcher.limits.MAX_XLSX_UNPACKED_BYTES` before anything is
unpacked, and the zip reader never returns more than the size the directory declares (a
member that would unpack to more fails its checksum and is refused).

Every problem is reported as :class:`GridFileError` naming the file and, where it
applies, the spreadsheet row and column (both counted from 1, as a spreadsheet shows them).
"""

from __future__ import annotations

import csv
import io
import math
import os
import re
import zipfile
import zlib
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from dispatcher.errors import BadInputError
from dispatcher.errors import column_letter as column_letter  # part of this module's API

# Limits that keep a wrong file from hanging the tool (see dispatcher.limits).
from dispatcher.limits import (
    MAX_CELLS,
    MAX_FILE_BYTES,
    MAX_JOBS,
    MAX_MACHINES,
    MAX_XLSX_MEMBERS,
    MAX_XLSX_TEXT_PART_BYTES,
    MAX_XLSX_UNPACKED_BYTES,
    name_problem,
    value_problem,
)

CANNOT_RUN = {"", "x", "X"}
GRID_SUFFIXES = (".csv", ".tsv", ".txt", ".xlsx")


class GridFileError(BadInputError, ValueError):
    """A grid file or block could not be read. The message names file, row and column."""

    def __init__(self, source: str, message: str, row: int | None = None, column: int | None = None):
        super().__init__(message, source=source, row=row,
                         column=column if row is not None else None)
        self.column = column


@dataclass(frozen=True)
class GridTable:
    """Job and machine names with a values grid; ``allowed`` is False where a cell said cannot-run."""

    jobs: list[str]
    machines: list[str]
    values: np.ndarray
    allowed: np.ndarray
    label: str = ""


_NUMBER = re.compile(r"[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?")
_NOT_FINITE = re.compile(r"[+-]?(?:nan|inf|infinity)", re.IGNORECASE)
_ESCAPED = ("'=", "'+", "'-", "'@", "''")


def _parse_number(text: str, decimal_comma: bool) -> float:
    """A plain decimal number (``12``, ``7.5``, ``1e3``; ``12,5`` with a decimal comma).

    Python's own literal forms (``1_000``, ``0x10``) and words are refused: a spreadsheet
    would not read them as numbers either.
    """
    cleaned = text.strip()
    if decimal_comma:
        cleaned = cleaned.replace(",", ".")
    if _NOT_FINITE.fullmatch(cleaned):
        return math.nan
    if not _NUMBER.fullmatch(cleaned):
        raise ValueError(cleaned)
    return float(cleaned)


def address(row: int, column: int) -> str:
    """A cell's spreadsheet address (row 3, column 28 -> ``AB3``)."""
    return f"{column_letter(column)}{row}"


def unescape_text(text: str) -> str:
    """Drop the leading apostrophe our CSV exports put before formula-like text."""
    return text[1:] if text.startswith(_ESCAPED) else text


def _name(cell: object, source: str, what: str, row: int, column: int, escaped: bool) -> str:
    name = "" if cell is None else str(cell).strip()
    if escaped:
        name = unescape_text(name)
    if not name:
        raise GridFileError(source, f"{what} name is empty", row=row, column=column)
    problem = name_problem(name)
    if problem is not None:
        if "\t" in name:
            problem += " (a tab: does the file mix tab and another separator?)"
        raise GridFileError(source, f"{what} name {problem}", row=row, column=column)
    return name


def table_from_rows(rows: list[list[object]], source: str, *, decimal_comma: bool = False,
                    escaped: bool = False, pad: bool = False) -> GridTable:
    """Build a :class:`GridTable` from raw cell rows (strings or numbers), checking everything.

    ``escaped``: names come from delimited text, where a leading apostrophe before
    formula-like text is an escape to drop (:func:`unescape_text`). ``pad``: a row shorter
    than the header is filled with empty cells (a spreadsheet stores no empty cell).
    """
    # Spreadsheets often carry empty rows and columns after the data: drop them.
    def blank(cell: object) -> bool:
        return cell is None or (isinstance(cell, str) and cell.strip() == "")

    while rows and all(blank(c) for c in rows[-1]):
        rows.pop()
    if not rows:
        raise GridFileError(source, "the file is empty; expected a header row of machine names")
    header = list(rows[0])
    while len(header) > 1 and blank(header[-1]):
        header.pop()
    width = len(header)
    if width < 2:
        raise GridFileError(source, "the header row has no machine names", row=1)
    if len(rows) < 2:
        raise GridFileError(source, "only a header row; expected one row per job below it")
    if len(rows) - 1 > MAX_JOBS:
        raise GridFileError(source, f"{len(rows) - 1} job rows exceed the limit of {MAX_JOBS}")
    if width - 1 > MAX_MACHINES:
        raise GridFileError(source, f"{width - 1} machine columns exceed the limit of {MAX_MACHINES}")
    if (len(rows) - 1) * (width - 1) > MAX_CELLS:
        raise GridFileError(source, f"{(len(rows) - 1) * (width - 1)} cells exceed the limit of {MAX_CELLS}")

    machines: list[str] = []
    seen: dict[str, int] = {}
    for col in range(1, width):
        name = _name(None if blank(header[col]) else header[col], source, "machine", 1, col + 1,
                     escaped)
        if name in seen:
            raise GridFileError(source, f"machine name {name!r} repeats column {seen[name]}",
                                row=1, column=col + 1)
        seen[name] = col + 1
        machines.append(name)

    n_jobs = len(rows) - 1
    values = np.zeros((n_jobs, width - 1))
    allowed = np.ones((n_jobs, width - 1), dtype=bool)
    jobs: list[str] = []
    job_rows: dict[str, int] = {}
    for r in range(1, len(rows)):
        row = list(rows[r])
        while len(row) > width and blank(row[-1]):
            row.pop()
        if pad and len(row) < width:
            row.extend([None] * (width - len(row)))
        if len(row) != width:
            raise GridFileError(source, f"has {len(row)} cells, the header has {width}", row=r + 1)
        name = _name(None if blank(row[0]) else row[0], source, "job", r + 1, 1, escaped)
        if name in job_rows:
            raise GridFileError(source, f"job name {name!r} repeats row {job_rows[name]}", row=r + 1, column=1)
        job_rows[name] = r + 1
        jobs.append(name)
        for c in range(1, width):
            cell = row[c]
            where = dict(row=r + 1, column=c + 1)
            if cell is None or (isinstance(cell, str) and cell.strip() in CANNOT_RUN):
                allowed[r - 1, c - 1] = False
                continue
            if isinstance(cell, bool):
                raise GridFileError(source, f"{cell} is not a number", **where)
            if isinstance(cell, (int, float)):
                value = float(cell)
            else:
                try:
                    value = _parse_number(str(cell), decimal_comma)
                except ValueError:
                    raise GridFileError(
                        source, f"{str(cell).strip()!r} is not a number (use x or leave empty "
                        "when the machine cannot run the job)", **where) from None
            if math.isnan(value) or math.isinf(value):
                raise GridFileError(source, f"{str(cell).strip()!r} is not a finite number", **where)
            if value < 0:
                raise GridFileError(source, f"{value:g} is negative; values must be >= 0", **where)
            too_big = value_problem(value)
            if too_big:
                raise GridFileError(source, too_big, **where)
            values[r - 1, c - 1] = value
    label = "" if blank(header[0]) else str(header[0]).strip()
    if escaped:
        label = unescape_text(label)
    return GridTable(jobs, machines, values, allowed, label)


def _is_blank(cell: object) -> bool:
    return cell is None or (isinstance(cell, str) and cell.strip() == "")


def _bounded_rows(rows, source: str) -> list[list[object]]:
    """Collect rows, refusing the first non-empty cell that lies past the limits.

    Without this a huge file (an XLSX sheet especially, read cell by cell) would be read
    whole before :func:`table_from_rows` could refuse it; this way the refusal comes after
    at most ``MAX_JOBS + 2`` rows of data and names the cell. Empty rows are counted, not
    stored, until a row with data follows them (a sheet may hold one value in its last
    row, a million rows down); cells past the column limit are dropped once seen empty.
    """
    out: list[list[object]] = []
    pending_blank = 0
    width_limit = MAX_MACHINES + 1
    for number, row in enumerate(rows, start=1):
        if not row:  # openpyxl yields () for each row missing from the sheet
            pending_blank += 1
            continue
        row = list(row)
        if len(row) > width_limit:
            for c in range(width_limit, len(row)):
                if not _is_blank(row[c]):
                    where = address(number, c + 1)
                    head = (f"{c} machine columns exceed the limit of {MAX_MACHINES}" if number == 1
                            else f"more than {MAX_MACHINES} machine columns exceed the limit of "
                            f"{MAX_MACHINES}")
                    raise GridFileError(source, f"{head}: cell {where} lies beyond it (the rest "
                                        "of the file was not read)", row=number, column=c + 1)
            row = row[:width_limit]
        if all(_is_blank(c) for c in row):
            pending_blank += 1
            continue
        if number > MAX_JOBS + 1:
            c = next(k for k, cell in enumerate(row) if not _is_blank(cell))
            raise GridFileError(source, f"more than {MAX_JOBS} job rows exceed the limit of "
                                f"{MAX_JOBS}: cell {address(number, c + 1)} lies beyond it (the "
                                "rest of the file was not read)", row=number, column=c + 1)
        out.extend([] for _ in range(pending_blank))
        pending_blank = 0
        out.append(row)
    return out


_SEPARATORS = {"\t": "tab", ";": "';'", ",": "','"}


def _unquoted(line: str) -> str:
    """``line`` without its double-quoted parts (where separators do not count)."""
    return re.sub(r'"[^"]*"?', "", line)


def _sniff_delimiter(text: str, source: str) -> str:
    """The separator of the header row; a header that mixes separators is refused.

    With semicolons a comma is a decimal comma or part of a name, so only tab with
    anything else, or commas with semicolons where commas lead, count as a mix.
    """
    first = _unquoted(text.split("\n", 1)[0])
    counts = {d: first.count(d) for d in ("\t", ";", ",")}
    best = max(counts, key=lambda d: counts[d])
    if not counts[best]:
        return ","
    mixed = [d for d in counts if d != best and counts[d]
             and not (best == ";" and d == ",")]
    if mixed:
        raise GridFileError(source, f"the header row mixes {_SEPARATORS[best]} and "
                            f"{_SEPARATORS[mixed[0]]} between cells; use one separator throughout",
                            row=1)
    return best


def _csv_rows(text: str, delimiter: str, source: str):
    """Rows of delimited text, each refusal naming the row where it happens."""
    reader = csv.reader(io.StringIO(text), delimiter=delimiter, strict=True)
    number = 0
    while True:
        try:
            row = next(reader)
        except StopIteration:
            return
        except csv.Error as exc:
            where = number + 1
            msg = str(exc)
            if "field larger than field limit" in msg:
                raise GridFileError(source, f"a cell is longer than {csv.field_size_limit():,} "
                                    "characters (is a quote left open?)", row=where) from None
            if "unexpected end of data" in msg:
                raise GridFileError(source, 'a quote (") opened in this row is never closed',
                                    row=where) from None
            if "expected after" in msg:
                raise GridFileError(source, "text follows a closing quote inside a cell; quote "
                                    "the whole cell or none of it", row=where) from None
            raise GridFileError(source, f"not readable as delimited text: {msg}",
                                row=where) from None
        number += 1
        if delimiter == "\t" and number > 1 and len(row) == 1:
            other = next((d for d in (",", ";") if d in row[0]), None)
            if other is not None and row[0].count(other) >= 1:
                raise GridFileError(source, f"this row has no tab between cells but "
                                    f"{_SEPARATORS[other]}, while the header uses tabs; use one "
                                    "separator throughout", row=number)
        yield row


def parse_grid_text(text: str, source: str = "pasted block") -> GridTable:
    """Parse delimited text (CSV, semicolon CSV, or a tab-separated clipboard block)."""
    text = text.removeprefix("\ufeff")
    text = text.replace("\r\n", "\n").replace("\r", "\n")
    delimiter = _sniff_delimiter(text, source)
    rows = _bounded_rows(_csv_rows(text, delimiter, source), source)
    return table_from_rows(rows, source, decimal_comma=(delimiter == ";"), escaped=True)


def _check_xlsx_archive(path: Path, source: str) -> None:
    """Refuse what is not an XLSX workbook, or would unpack past the limits, before parsing."""
    try:
        with zipfile.ZipFile(path) as archive:
            members = archive.infolist()
    except zipfile.BadZipFile:
        raise GridFileError(source, "is not an XLSX workbook (not a zip archive); if it holds "
                            "text, name it .csv") from None
    except OSError as exc:
        raise GridFileError(source, f"cannot open: {exc.strerror or exc}") from None
    if len(members) > MAX_XLSX_MEMBERS:
        raise GridFileError(source, f"the workbook has {len(members):,} parts, more than the "
                            f"limit of {MAX_XLSX_MEMBERS:,}")
    names = {m.filename for m in members}
    if "xl/workbook.xml" not in names:
        kind = ("a Word document" if "word/document.xml" in names else
                "an OpenDocument file" if "mimetype" in names else "another zip archive")
        raise GridFileError(source, f"is a zip archive but not an XLSX workbook (it looks like "
                            f"{kind}: no xl/workbook.xml inside); was another file renamed to .xlsx?")
    unpacked = sum(m.file_size for m in members)
    if unpacked > MAX_XLSX_UNPACKED_BYTES:
        raise GridFileError(source, f"the workbook unpacks to {unpacked:,} bytes, more than the "
                            f"limit of {MAX_XLSX_UNPACKED_BYTES:,} (refused before unpacking)")
    for m in members:
        if m.filename.lower() == "xl/sharedstrings.xml" and m.file_size > MAX_XLSX_TEXT_PART_BYTES:
            raise GridFileError(source, f"the workbook's shared text unpacks to {m.file_size:,} "
                                f"bytes, more than the limit of {MAX_XLSX_TEXT_PART_BYTES:,}")


#: What a damaged workbook can raise while openpyxl unpacks and parses it.
_DAMAGED = (zipfile.BadZipFile, zlib.error, EOFError, KeyError, ValueError, TypeError,
            IndexError, SyntaxError, OSError)


def _sheet_rows(book, source: str) -> list[list[object]]:
    sheet = book.worksheets[0]
    # Read the cells that exist: a stale <dimension ref="A1:B2"> must not hide any.
    sheet.reset_dimensions()
    return _bounded_rows(sheet.iter_rows(values_only=True), source)


def _read_xlsx(path: Path) -> GridTable:
    source = str(path)
    _check_xlsx_archive(path, source)
    import openpyxl

    book = formulas = None
    try:
        book = openpyxl.load_workbook(path, read_only=True, data_only=True)
        if not book.worksheets:
            raise GridFileError(source, "the workbook has no worksheet")
        rows = _sheet_rows(book, source)
        formulas = openpyxl.load_workbook(path, read_only=True, data_only=False)
        raw = _sheet_rows(formulas, source)
    except GridFileError:
        raise
    except _DAMAGED as exc:
        detail = str(exc).strip() or exc.__class__.__name__
        raise GridFileError(source, f"the XLSX workbook is damaged and cannot be read ({detail})") from None
    finally:
        for b in (book, formulas):
            if b is not None:
                b.close()
    for r, row in enumerate(rows):
        for c, cell in enumerate(row):
            formula = raw[r][c] if r < len(raw) and c < len(raw[r]) else None
            if cell is None and isinstance(formula, str) and formula.startswith("="):
                raise GridFileError(source, "formula has no stored value; open and save the file "
                                    "in a spreadsheet program first", row=r + 1, column=c + 1)
    return table_from_rows(rows, source, pad=True)


def read_grid(path: str | os.PathLike) -> GridTable:
    """Read a grid file (.csv, .tsv, .txt or .xlsx). Raises :class:`GridFileError`."""
    path = Path(path)
    source = str(path)
    if path.is_dir():
        raise GridFileError(source, "is a folder, not a grid file; give the path of a "
                            f"{', '.join(GRID_SUFFIXES)} file")
    suffix = path.suffix.lower()
    if suffix not in GRID_SUFFIXES:
        raise GridFileError(source, f"unsupported extension {path.suffix or '(none)'!r}; "
                            f"expected one of {', '.join(GRID_SUFFIXES)}")
    try:
        size = path.stat().st_size
    except FileNotFoundError:
        raise GridFileError(source, "file not found") from None
    except OSError as exc:
        raise GridFileError(source, f"cannot open: {exc.strerror}") from None
    if size == 0:
        raise GridFileError(source, "the file is empty; expected a header row of machine names")
    if size > MAX_FILE_BYTES:
        raise GridFileError(source, f"{size} bytes exceed the limit of {MAX_FILE_BYTES} bytes")
    if suffix == ".xlsx":
        return _read_xlsx(path)
    try:
        data = path.read_bytes()
    except OSError as exc:
        raise GridFileError(source, f"cannot read: {exc.strerror or exc}") from None
    if data.startswith(b"PK\x03\x04"):
        raise GridFileError(source, "looks like a zipped spreadsheet; save it as .xlsx or as CSV text")
    try:
        text = data.decode("utf-8")
    except UnicodeDecodeError as exc:
        line = data[:exc.start].count(b"\n") + 1
        raise GridFileError(source, "is not UTF-8 text; save it as 'CSV UTF-8'", row=line) from None
    if "\x00" in text:
        raise GridFileError(source, "contains binary data; expected CSV text")
    return parse_grid_text(text, source)
