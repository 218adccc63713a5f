"""Spreadsheets and shops: import a grid into a shop, export a shop's grid and plan.

Import reads the grid layout of :mod:`dispatcher.io.grid` (CSV, XLSX cell values only, or a
tab-separated block pasted from a spreadsheet: all through the same parser,
:func:`~dispatcher.io.grid.parse_grid_text` / :func:`~dispatcher.io.grid.read_grid`) and
merges it into a new or an existing shop, matching jobs and machines by name. It never
changes the shop it is given: it returns a new shop and a report of what was added,
changed and left unmatched, so the caller can show the report and keep or drop the result.

Export builds the tables with pandas and writes CSV with ``to_csv`` and XLSX with openpyxl
(every text as a text cell, so a name such as ``=SUM(A1)`` is never stored as a live
formula), through a temporary file in the same folder replaced in one step, so an existing
file is never left half-written. In CSV, text starting with ``=``, ``+``, ``-``, ``@`` (or an
apostrophe, tab or carriage return) gets a leading apostrophe, as the OWASP note on CSV
injection advises (common practice); :func:`~dispatcher.io.grid.read_grid` drops it again,
so every export reads back equal.
"""

from __future__ import annotations

import os
from dataclasses import dataclass, field
from pathlib import Path

import numpy as np
import pandas as pd

from dispatcher.atomic import atomic_write
from dispatcher.errors import BadInputError
from dispatcher.io.grid import GridFileError, GridTable, parse_grid_text, read_grid
from dispatcher.shop.model import Job, Machine, Shop, shop_from_grid
from dispatcher.shop.plan import Plan, json_number

EXPORT_SUFFIXES = (".csv", ".xlsx")
CANNOT_RUN_MARK = "x"
_FORMULA_START = ("=", "+", "-", "@", "'", "\t", "\r")


def escape_csv_text(value: object) -> object:
    """Text a spreadsheet would run as a formula, with a leading apostrophe; else unchanged."""
    if isinstance(value, str) and value.startswith(_FORMULA_START):
        return "'" + value
    return value


def _escaped_frame(frame: pd.DataFrame) -> pd.DataFrame:
    out = frame.map(escape_csv_text)
    out.index = pd.Index([escape_csv_text(v) for v in frame.index], name=escape_csv_text(frame.index.name))
    out.columns = [escape_csv_text(v) for v in frame.columns]
    return out


def _write_xlsx(path: Path, sheets: list[tuple[str, pd.DataFrame, bool]]) -> None:
    """Write each ``(title, frame, with_index)`` as a sheet; text always as text cells."""
    import openpyxl
    from openpyxl.cell import WriteOnlyCell

    book = openpyxl.Workbook(write_only=True)
    for title, frame, with_index in sheets:
        sheet = book.create_sheet(title)

        def cell(v: object, sheet=sheet):
            if v is None or (isinstance(v, float) and np.isnan(v)):
                return None
            if isinstance(v, np.generic):
                v = v.item()
            if isinstance(v, str):
                c = WriteOnlyCell(sheet, value=v)
                c.data_type = "s"  # openpyxl would store text starting with "=" as a formula
                return c
            return v

        head = ([frame.index.name] if with_index else []) + list(frame.columns)
        sheet.append([cell(v) for v in head])
        for label, row in zip(frame.index, frame.itertuples(index=False, name=None)):
            sheet.append([cell(v) for v in (([label] if with_index else []) + list(row))])
    book.save(path)


class ExportError(BadInputError, OSError):
    """A table could not be written; the message names the file (exit code 2)."""


@dataclass
class ImportReport:
    """What an import did, by name: new jobs and machines, changed cells, names not in the table."""

    shop: Shop
    added_jobs: list[str] = field(default_factory=list)
    added_machines: list[str] = field(default_factory=list)
    changed_cells: list[tuple[str, str, float | None, float | None]] = field(default_factory=list)
    unmatched_jobs: list[str] = field(default_factory=list)
    unmatched_machines: list[str] = field(default_factory=list)

    def summary(self) -> str:
        """A few lines for a message box or the terminal."""
        def names(xs: list[str]) -> str:
            return ", ".join(xs[:8]) + (f" and {len(xs) - 8} more" if len(xs) > 8 else "")
        lines = [f"{len(self.added_jobs)} job(s) added" + (f": {names(self.added_jobs)}" if self.added_jobs else ""),
                 f"{len(self.added_machines)} machine(s) added"
                 + (f": {names(self.added_machines)}" if self.added_machines else ""),
                 f"{len(self.changed_cells)} value(s) changed"]
        if self.unmatched_jobs:
            lines.append(f"{len(self.unmatched_jobs)} job(s) of the shop not in the table, kept as "
                         f"they were: {names(self.unmatched_jobs)}")
        if self.unmatched_machines:
            lines.append(f"{len(self.unmatched_machines)} machine(s) of the shop not in the table, "
                         f"kept as they were: {names(self.unmatched_machines)}")
        return "\n".join(lines)


def _next_id(prefix: str, taken: set[str]) -> str:
    n = len(taken) + 1
    while f"{prefix}{n}" in taken:
        n += 1
    return f"{prefix}{n}"


def import_table(table: GridTable, shop: Shop | None = None, *, name: str = "") -> ImportReport:
    """Merge a grid table into a copy of ``shop`` (or a new shop when None).

    Jobs and machines are matched by name (exact, after trimming). New names are added as
    waiting jobs and working one-slot machines. Cells of the table replace the shop's
    values for matched pairs (an ``x`` / empty cell makes the pair cannot-run); pairs and
    names the table does not mention are kept unchanged.
    """
    if shop is None:
        new = shop_from_grid(table.jobs, table.machines, table.values, table.allowed, name=name)
        return ImportReport(new, added_jobs=list(table.jobs), added_machines=list(table.machines))
    out = shop.copy()
    report = ImportReport(out)
    jobs = {j.name: j for j in out.jobs}
    machines = {m.name: m for m in out.machines}
    job_ids = {j.id for j in out.jobs}
    machine_ids = {m.id for m in out.machines}
    for n in table.jobs:
        if n not in jobs:
            j = Job(id=_next_id("J", job_ids), name=n)
            job_ids.add(j.id)
            out.jobs.append(j)
            jobs[n] = j
            report.added_jobs.append(n)
    for n in table.machines:
        if n not in machines:
            m = Machine(id=_next_id("M", machine_ids), name=n)
            machine_ids.add(m.id)
            out.machines.append(m)
            machines[n] = m
            report.added_machines.append(n)
    for i, jn in enumerate(table.jobs):
        jid = jobs[jn].id
        for k, mn in enumerate(table.machines):
            mid = machines[mn].id
            old = out.grid.get((jid, mid))
            derived = None
            if old is None and out.changeover_tables and (jid, mid) not in out.blocked:
                derived = old = out.derived_value(jid, mid)   # what the shop shows there
            new = float(table.values[i, k]) if table.allowed[i, k] else None
            if old != new:
                if new is None:
                    out.grid.pop((jid, mid), None)
                    if derived is not None:
                        out.blocked.add((jid, mid))
                else:
                    out.grid[(jid, mid)] = new
                    out.blocked.discard((jid, mid))
                if jn not in report.added_jobs and mn not in report.added_machines:
                    report.changed_cells.append((jn, mn, old, new))
    in_table_j, in_table_m = set(table.jobs), set(table.machines)
    report.unmatched_jobs = [j.name for j in shop.jobs if j.name not in in_table_j]
    report.unmatched_machines = [m.name for m in shop.machines if m.name not in in_table_m]
    return report


#: Column headings read as each job's run hours (the same on every machine), not a machine.
RUN_HOURS_HEADINGS = ("run hours", "run_hours", "run hours (h)")


def import_grid_file(path: str | os.PathLike, shop: Shop | None = None,
                     hours: str | os.PathLike | None = None) -> ImportReport:
    """Read a grid file (.csv, .tsv, .txt, .xlsx) and merge it. Raises GridFileError.

    A column headed ``run hours`` gives each job's run hours (needed to fill a shift)
    instead of a machine. ``hours``: a second grid file with the same job and machine
    names whose cells are the run hours of each pair (empty = none given).
    """
    table = read_grid(path)
    run_hours = None
    heads = [m.strip().lower() for m in table.machines]
    col = next((k for k, h in enumerate(heads) if h in RUN_HOURS_HEADINGS), None)
    if col is not None:
        run_hours = {job: float(table.values[n, col]) for n, job in enumerate(table.jobs)
                     if table.allowed[n, col]}
        keep = [k for k in range(len(table.machines)) if k != col]
        table = GridTable(table.jobs, [table.machines[k] for k in keep], table.values[:, keep],
                          table.allowed[:, keep], table.label)
    report = import_table(table, shop, name=Path(path).stem)
    if run_hours:
        for job in report.shop.jobs:
            if job.name in run_hours:
                job.run_hours = run_hours[job.name]
    if hours is not None:
        _merge_hours(report.shop, read_grid(hours), str(hours))
    return report


def _merge_hours(shop: Shop, table: GridTable, source: str) -> None:
    """Pair run hours from a grid of hours; unknown names are refused with their place."""
    jobs = {j.name: j.id for j in shop.jobs}
    machines = {m.name: m.id for m in shop.machines}
    for n, name in enumerate(table.jobs):
        if name not in jobs:
            raise GridFileError(source, f"job {name!r} is not in the grid", row=n + 2, column=1)
    for k, name in enumerate(table.machines):
        if name not in machines:
            raise GridFileError(source, f"machine {name!r} is not in the grid", row=1, column=k + 2)
    for n, name in enumerate(table.jobs):
        for k, mname in enumerate(table.machines):
            if table.allowed[n, k]:
                shop.hours[(jobs[name], machines[mname])] = float(table.values[n, k])


def import_clipboard(text: str, shop: Shop | None = None) -> ImportReport:
    """Merge a pasted block (tab-separated, as spreadsheets copy it). Raises GridFileError."""
    return import_table(parse_grid_text(text, "pasted block"), shop)


def grid_frame(shop: Shop) -> pd.DataFrame:
    """The shop's grid as a table: jobs as rows, machines as columns, ``x`` = cannot run."""
    values, allowed = shop.matrix()
    cells = np.where(allowed, values.astype(object), CANNOT_RUN_MARK)
    frame = pd.DataFrame(cells, index=pd.Index(shop.job_names(), name=shop.unit.label()),
                         columns=shop.machine_names())
    return frame.map(lambda v: json_number(v) if isinstance(v, float) else v)


def grid_table(shop: Shop) -> GridTable:
    """The shop's grid as a :class:`GridTable` (what a grid file would hold)."""
    values, allowed = shop.matrix()
    return GridTable(shop.job_names(), shop.machine_names(), values, allowed, shop.unit.label())


def clipboard_text(shop: Shop) -> str:
    """The grid as a tab-separated block, which :func:`import_clipboard` reads back."""
    return _escaped_frame(grid_frame(shop)).to_csv(sep="\t", lineterminator="\n")


def plan_frame(plan: Plan, shop: Shop | None = None) -> pd.DataFrame:
    """A plan as a table: one row per machine and job, then waiting jobs and idle machines."""
    rows = []
    for r in plan.running:
        value = None if r.cost is None else json_number(r.cost)
        rows.append({"machine": r.machine, "job": r.job, "value": value, "status": "running",
                     "note": f"since {r.since}" if r.since else ""})
    for a in plan.assignments:
        rows.append({"machine": a.machine, "job": a.job, "value": json_number(a.cost), "status": "dispatched",
                     "note": ""})
    for j in plan.waiting_jobs:
        w = plan.waiting_reasons.get(j)
        rows.append({"machine": "", "job": j, "value": None, "status": "waiting",
                     "note": w.text.split(": ", 1)[-1] if w else ""})
    for m in plan.idle_machines:
        rows.append({"machine": m, "job": "", "value": None, "status": "idle", "note": ""})
    for m in plan.unavailable_machines:
        state = shop.machine_by_name(m).state if shop is not None else "unavailable"
        rows.append({"machine": m, "job": "", "value": None, "status": state, "note": ""})
    frame = pd.DataFrame(rows, columns=["machine", "job", "value", "status", "note"], dtype=object)
    return frame


def plan_summary_frame(plan: Plan) -> pd.DataFrame:
    """Totals of a plan as a two-column table."""
    data = [("objective", plan.objective), ("total", plan.total),
            ("bottleneck", plan.bottleneck if plan.bottleneck is not None else ""),
            ("certificate", "checked" if plan.verified else "not checked")]
    return pd.DataFrame(data, columns=["item", "value"])


def _atomic_write(path: Path, write) -> None:
    """Call ``write(tmp_path)`` then replace ``path`` in one step; clean up on failure."""
    suffix = path.suffix.lower()
    if suffix not in EXPORT_SUFFIXES:
        raise ExportError(f"{path}: unsupported extension {path.suffix or '(none)'!r}; "
                          f"expected one of {', '.join(EXPORT_SUFFIXES)}")
    try:
        atomic_write(path, write, suffix=suffix)
    except OSError as exc:
        raise ExportError(f"{path}: cannot write: {exc.strerror or exc}; any previous file is "
                          "unchanged") from None


def export_grid(shop: Shop, path: str | os.PathLike) -> None:
    """Write the shop's grid as CSV or XLSX (the grid file layout, readable by read_grid)."""
    path = Path(path)
    frame = grid_frame(shop)

    def write(tmp: Path) -> None:
        if path.suffix.lower() == ".csv":
            _escaped_frame(frame).to_csv(tmp, encoding="utf-8")
        else:
            _write_xlsx(tmp, [("grid", frame, True)])

    _atomic_write(path, write)


def export_plan(plan: Plan, path: str | os.PathLike, shop: Shop | None = None) -> None:
    """Write a plan as CSV (one table) or XLSX (sheets ``plan`` and ``totals``)."""
    path = Path(path)
    frame = plan_frame(plan, shop)

    def write(tmp: Path) -> None:
        if path.suffix.lower() == ".csv":
            _escaped_frame(frame).to_csv(tmp, index=False, encoding="utf-8")
        else:
            _write_xlsx(tmp, [("plan", frame, False), ("totals", plan_summary_frame(plan), False)])

    _atomic_write(path, write)


__all__ = [
    "ExportError", "GridFileError", "ImportReport", "clipboard_text", "escape_csv_text", "export_grid",
    "export_plan", "grid_frame", "grid_table", "import_clipboard", "import_grid_file",
    "import_table", "plan_frame", "plan_summary_frame",
]
