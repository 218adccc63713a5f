"""Grid files: a table of setup values, jobs as rows and machines as columns.

Layout (CSV or XLSX, first sheet): the first row holds machine names (its first cell is a
label and is ignored); the first column holds job names; every other cell is a number
>= 0, or empty / ``x`` / ``X`` when the machine cannot run the job. CSV may use comma,
semicolon or tab between cells; with semicolons a decimal comma (``12,5``) is accepted,
as European spreadsheets write it. Text is read as UTF-8 (a byte-order mark is fine).

Nothing in a file is ever executed: CSV is parsed as text, and XLSX is read for its stored
cell values only (a formula counts as the value it last showed; one that was never
calculated is refused).

Every problem is reported as :class:`GridFileError` naming the file and, where it
applies, the spreadsheet row and column (both counted from 1, as a spreadsheet shows them).
"""

from __future__ import annotations

import csv
import io
import math
import os
import zipfile
from dataclasses import dataclass
from pathlib import Path

import numpy as np

from dispatcher.errors import BadInputError
from dispatcher.errors import column_letter as column_letter  # part of this module's API

#: Limits that keep a wrong file from hanging the tool. Refused before parsing the cells.
MAX_JOBS = 10_000
MAX_MACHINES = 2_000
MAX_CELLS = 4_000_000
MAX_FILE_BYTES = 64 * 1024 * 1024

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


def _parse_number(text: str, decimal_comma: bool) -> float:
    cleaned = text.strip()
    if decimal_comma:
        cleaned = cleaned.replace(",", ".")
    return float(cleaned)


def table_from_rows(rows: list[list[object]], source: str, *, decimal_comma: bool = False) -> GridTable:
    """Build a :class:`GridTable` from raw cell rows (strings or numbers), checking everything."""
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
        name = "" if blank(header[col]) else str(header[col]).strip()
        if not name:
            raise GridFileError(source, "machine name is empty", row=1, column=col + 1)
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
        if len(row) != width:
            raise GridFileError(source, f"has {len(row)} cells, the header has {width}", row=r + 1)
        name = "" if blank(row[0]) else str(row[0]).strip()
        if not name:
            raise GridFileError(source, "job name is empty", row=r + 1, column=1)
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
            values[r - 1, c - 1] = value
    label = "" if blank(header[0]) else str(header[0]).strip()
    return GridTable(jobs, machines, values, allowed, label)


def _bounded_rows(rows, source: str) -> list[list[object]]:
    """Collect rows, refusing as soon as a non-empty row lies past the job-row limit.

    Without this a huge file (an XLSX sheet especially, read cell by cell) would be read
    whole before :func:`table_from_rows` could refuse it; this way the refusal comes after
    at most ``MAX_JOBS + 2`` rows of data.
    """
    out: list[list[object]] = []
    for row in rows:
        row = list(row)
        out.append(row)
        if len(out) > MAX_JOBS + 1 and any(
                c is not None and not (isinstance(c, str) and c.strip() == "") for c in row):
            raise GridFileError(source, f"more than {MAX_JOBS} job rows exceed the limit of "
                                f"{MAX_JOBS} (the rest of the file was not read)")
    return out


def _sniff_delimiter(text: str) -> str:
    first = text.split("\n", 1)[0]
    counts = {d: first.count(d) for d in ("\t", ";", ",")}
    best = max(counts, key=lambda d: counts[d])
    return best if counts[best] else ","


def parse_grid_text(text: str, source: str = "pasted block") -> GridTable:
    """Parse delimited text (CSV, semicolon CSV, or a tab-separated clipboard block)."""
    if text.startswith("\ufeff"):
        text = text[1:]
    text = text.replace("\r\n", "\n").replace("\r", "\n")
    delimiter = _sniff_delimiter(text)
    try:
        rows = _bounded_rows(csv.reader(io.StringIO(text), delimiter=delimiter), source)
    except csv.Error as exc:
        raise GridFileError(source, f"not readable as delimited text: {exc}") from None
    return table_from_rows(rows, source, decimal_comma=(delimiter == ";"))


def _read_xlsx(path: Path) -> GridTable:
    source = str(path)
    try:
        import openpyxl
        from openpyxl.utils.exceptions import InvalidFileException

        book = openpyxl.load_workbook(path, read_only=True, data_only=True)
        formulas = openpyxl.load_workbook(path, read_only=True, data_only=False)
    except (zipfile.BadZipFile, InvalidFileException, KeyError, OSError) as exc:
        raise GridFileError(source, f"not an XLSX spreadsheet ({exc.__class__.__name__})") from None
    try:
        sheet = book.worksheets[0]
        rows = _bounded_rows(sheet.iter_rows(values_only=True), source)
        raw = _bounded_rows(formulas.worksheets[0].iter_rows(values_only=True), source)
    finally:
        book.close()
        formulas.close()
    for r, row in enumerate(rows):
        for c, cell in enumerate(row):
            formula = raw[r][c] if r < len(raw) and c < len(raw[r]) else None
            if cell is None and isinstance(formula, str) and formula.startswith("="):
                raise GridFileError(source, "formula has no stored value; open and save the file "
                                    "in a spreadsheet program first", row=r + 1, column=c + 1)
    return table_from_rows(rows, source)


def read_grid(path: str | os.PathLike) -> GridTable:
    """Read a grid file (.csv, .tsv, .txt or .xlsx). Raises :class:`GridFileError`."""
    path = Path(path)
    source = str(path)
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
    if path.is_dir():
        raise GridFileError(source, "is a folder, not a file")
    if size == 0:
        raise GridFileError(source, "the file is empty; expected a header row of machine names")
    if size > MAX_FILE_BYTES:
        raise GridFileError(source, f"{size} bytes exceed the limit of {MAX_FILE_BYTES} bytes")
    if suffix == ".xlsx":
        return _read_xlsx(path)
    data = path.read_bytes()
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
