"""Import a job list (CSV/XLSX rows) and changeover tables (CSV/XLSX matrices) into a shop.

Job list: one row per job under a header row. The columns are found by name (case,
spaces and underscores do not matter) or by an explicit mapping (field -> column
header): ``work_order``, ``name`` (the job name; the work order when absent), ``family``,
``run_hours``, ``due`` (``YYYY-MM-DD HH:MM`` or an XLSX date), ``rush`` (yes/no, true/
false, 1/0, x), ``wait_penalty``. Unknown columns are ignored. A job whose name is
already in the shop is updated (the fields given), others are added, waiting.

Changeover table: the grid layout (see :mod:`dispatcher.io.grid`) with families as row
(from) and column (to) headers; an empty cell or ``x`` means the change is not allowed;
a row named ``nothing mounted`` (or ``empty``, ``cleaned``) is the change from an empty
machine.

Every problem raises :class:`JobListError` naming the file, row and column; the shop
passed in is never changed (the functions return a new shop).
"""

from __future__ import annotations

import csv
import datetime as dt
import io
import math
import os
import zipfile
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from pathlib import Path

from dispatcher.errors import BadInputError
from dispatcher.shop.model import ChangeoverTable, Job, Shop

from .grid import MAX_FILE_BYTES, MAX_JOBS, _bounded_rows, _sniff_delimiter, read_grid

__all__ = ["FIELDS", "JobListError", "JobRow", "apply_changeover_table", "apply_job_list",
           "guess_columns", "read_changeover_table", "read_job_list", "read_job_list_header"]

#: Fields of a job list row and the column headers recognised for each.
FIELDS = {
    "work_order": ("work order", "work_order", "wo", "order"),
    "name": ("job", "job name", "name"),
    "family": ("family", "setup family", "mould", "die", "colour group", "color group"),
    "run_hours": ("run hours", "hours", "run_hours"),
    "due": ("due", "due date", "due time"),
    "rush": ("rush",),
    "wait_penalty": ("wait penalty", "penalty", "wait_penalty"),
}
EMPTY_ROW_NAMES = {"nothing mounted", "empty", "cleaned", "(nothing mounted)", "none"}
_TRUE = {"yes", "y", "true", "1", "x", "rush"}
_FALSE = {"no", "n", "false", "0", ""}


class JobListError(BadInputError, ValueError):
    """A job list or changeover table that cannot be imported (file, row and column named)."""


@dataclass(frozen=True)
class JobRow:
    """One job of the list; None where the list has no column for the field."""

    row: int
    name: str
    work_order: str | None = None
    family: str | None = None
    run_hours: float | None = None
    due: dt.datetime | None = None
    rush: bool | None = None
    wait_penalty: float | None = None


def _norm(text: object) -> str:
    return " ".join(str(text).replace("_", " ").split()).lower() if text is not None else ""


def _rows(path: Path) -> list[list[object]]:
    source = str(path)
    try:
        size = path.stat().st_size
    except FileNotFoundError:
        raise JobListError("file not found", source=source) from None
    if size > MAX_FILE_BYTES:
        raise JobListError(f"{size} bytes exceed the limit of {MAX_FILE_BYTES} bytes", source=source)
    if path.suffix.lower() == ".xlsx":
        try:
            import openpyxl
            from openpyxl.utils.exceptions import InvalidFileException

            book = openpyxl.load_workbook(path, read_only=True, data_only=True)
        except (zipfile.BadZipFile, InvalidFileException, KeyError, OSError) as exc:
            raise JobListError(f"not an XLSX spreadsheet ({exc.__class__.__name__})", source=source) from None
        try:
            return _bounded_rows(book.worksheets[0].iter_rows(values_only=True), source)
        finally:
            book.close()
    try:
        text = path.read_bytes().decode("utf-8-sig")
    except UnicodeDecodeError:
        raise JobListError("is not UTF-8 text", source=source) from None
    text = text.replace("\r\n", "\n").replace("\r", "\n")
    return _bounded_rows(csv.reader(io.StringIO(text), delimiter=_sniff_delimiter(text, source)), source)


def guess_columns(header: Sequence[object]) -> dict[str, int]:
    """Field -> index of the header cell that names it (the names in :data:`FIELDS`; case,
    spaces and underscores do not matter); fields no header names are left out."""
    names = [_norm(h) for h in header]
    out: dict[str, int] = {}
    for field, known in FIELDS.items():
        for k, h in enumerate(names):
            if h in known:
                out[field] = k
                break
    return out


def read_job_list_header(path: str | os.PathLike) -> tuple[list[str], int]:
    """The header row of a job list (cells as text) and how many rows follow it, read with
    the same checks as :func:`read_job_list` (what a column-mapping dialog shows)."""
    path = Path(path)
    rows = _rows(path)
    while rows and all(c is None or str(c).strip() == "" for c in rows[-1]):
        rows.pop()
    if not rows:
        raise JobListError("expected a header row and one row per job", source=str(path))
    return ["" if c is None else str(c).strip() for c in rows[0]], len(rows) - 1


def read_job_list(path: str | os.PathLike, columns: Mapping[str, str] | None = None,
                  ignore: Sequence[str] = ()) -> list[JobRow]:
    """The rows of a job list; ``columns`` maps a field to its column header, ``ignore``
    names fields not to read even where a header names them."""
    path = Path(path)
    source = str(path)
    rows = _rows(path)
    while rows and all(c is None or str(c).strip() == "" for c in rows[-1]):
        rows.pop()
    if len(rows) < 2:
        raise JobListError("expected a header row and one row per job", source=source)
    if len(rows) - 1 > MAX_JOBS:
        raise JobListError(f"{len(rows) - 1} job rows exceed the limit of {MAX_JOBS}", source=source)
    header = [_norm(h) for h in rows[0]]
    where: dict[str, int] = {}
    for field, given in (columns or {}).items():
        if field not in FIELDS:
            raise JobListError(f"unknown field {field!r} in the column mapping (fields: "
                               f"{', '.join(FIELDS)})", source=source)
        if _norm(given) not in header:
            raise JobListError(f"no column {given!r} for field {field!r} in the header row",
                               source=source, row=1)
        where[field] = header.index(_norm(given))
    for field, k in guess_columns(rows[0]).items():
        if field not in ignore:
            where.setdefault(field, k)
    if "name" not in where and "work_order" not in where:
        raise JobListError("no job name or work order column (map one with a column option)",
                           source=source, row=1)
    out: list[JobRow] = []
    seen: dict[str, int] = {}
    for r, row in enumerate(rows[1:], start=2):
        if all(c is None or str(c).strip() == "" for c in row):
            continue

        def cell(field, row=row):
            k = where.get(field)
            if k is None or k >= len(row) or row[k] is None:
                return None
            return row[k]

        def text(field):
            v = cell(field)
            return None if v is None or str(v).strip() == "" else str(v).strip()

        def number(field, r=r):
            v = cell(field)
            if v is None or (isinstance(v, str) and not v.strip()):
                return None
            try:
                x = float(str(v).strip().replace(",", ".")) if not isinstance(v, (int, float)) else float(v)
            except ValueError:
                raise JobListError(f"{str(v).strip()!r} is not a number ({field})", source=source,
                                   row=r, column=where[field] + 1) from None
            if not math.isfinite(x) or x < 0:
                raise JobListError(f"{x:g} must be a number >= 0 ({field})", source=source, row=r,
                                   column=where[field] + 1)
            return x

        name = text("name") or text("work_order")
        if not name:
            raise JobListError("job name is empty", source=source, row=r,
                               column=where.get("name", where.get("work_order", 0)) + 1)
        if name in seen:
            raise JobListError(f"job {name!r} repeats row {seen[name]}", source=source, row=r,
                               column=where.get("name", where.get("work_order", 0)) + 1)
        seen[name] = r
        rush = None
        v = cell("rush")
        if v is not None:
            t = _norm(v)
            if isinstance(v, bool):
                rush = v
            elif t in _TRUE:
                rush = True
            elif t in _FALSE:
                rush = False
            else:
                raise JobListError(f"{str(v).strip()!r} is not yes/no (rush)", source=source, row=r,
                                   column=where["rush"] + 1)
        due = None
        v = cell("due")
        if isinstance(v, dt.datetime):
            due = v
        elif isinstance(v, dt.date):
            due = dt.datetime(v.year, v.month, v.day)
        elif v is not None and str(v).strip():
            try:
                due = dt.datetime.fromisoformat(str(v).strip())
            except ValueError:
                raise JobListError(f"{str(v).strip()!r} is not a date-time like 2026-03-14 14:00 (due)",
                                   source=source, row=r, column=where["due"] + 1) from None
        out.append(JobRow(r, name, text("work_order"), text("family"), number("run_hours"), due, rush,
                          number("wait_penalty")))
    return out


def apply_job_list(shop: Shop, rows: Sequence[JobRow]) -> Shop:
    """A copy of ``shop`` with the listed jobs updated (by name) or added (waiting)."""
    out = shop.copy()
    by_name = {j.name: j for j in out.jobs}
    used = {j.id for j in out.jobs}
    n = len(out.jobs)
    for r in rows:
        job = by_name.get(r.name)
        if job is None:
            n += 1
            while f"J{n}" in used:
                n += 1
            job = Job(id=f"J{n}", name=r.name)
            used.add(job.id)
            out.jobs.append(job)
            by_name[r.name] = job
        for field in ("work_order", "family", "run_hours", "due", "rush", "wait_penalty"):
            v = getattr(r, field)
            if v is not None:
                setattr(job, field, v)
    return out


def read_changeover_table(path: str | os.PathLike) -> tuple[list[str], dict[tuple[str | None, str], float]]:
    """``(families, changes)`` from a matrix file (rows: from, columns: to)."""
    source = str(path)
    try:
        table = read_grid(path)
    except BadInputError as exc:
        raise JobListError(exc.message.replace("machine name", "family name (column)")
                           .replace("job name", "family name (row)"),
                           source=source, row=getattr(exc, "row", None), column=getattr(exc, "column", None)) from None
    families = list(table.machines)
    changes: dict[tuple[str | None, str], float] = {}
    for r, name in enumerate(table.jobs):
        frm = None if _norm(name) in EMPTY_ROW_NAMES else name
        if frm is not None and frm not in families:
            raise JobListError(f"row family {name!r} is not one of the column families", source=source,
                               row=r + 2, column=1)
        for c, to in enumerate(families):
            if table.allowed[r, c]:
                changes[(frm, to)] = float(table.values[r, c])
    return families, changes


def apply_changeover_table(shop: Shop, path: str | os.PathLike, *, table_id: str, name: str,
                           machines: Sequence[str]) -> Shop:
    """A copy of ``shop`` with the table from ``path`` for the named machines (replacing a
    table of the same id). Machine names that do not exist are refused."""
    families, changes = read_changeover_table(path)
    out = shop.copy()
    ids = []
    for m in machines:
        try:
            ids.append(out.machine_by_name(m).id)
        except KeyError:
            raise JobListError(f"no machine named {m!r} for changeover table {table_id!r}",
                               source=str(path)) from None
    out.changeover_tables = [t for t in out.changeover_tables if t.id != table_id]
    out.changeover_tables.append(ChangeoverTable(table_id, name, ids, families, changes))
    return out
