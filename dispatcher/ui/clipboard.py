"""Tab-separated blocks to and from a spreadsheet (Qt-free).

Pasting accepts two kinds of block:

* a named block - its first row holds machine names and its first column job names (what
  "Copy with names" or a whole grid copied from a spreadsheet gives): cells go to the jobs
  and machines of those names wherever they are in the grid;
* a plain block of values - cells go to the grid from the current cell right and down.

Both are parsed by :func:`dispatcher.io.grid.table_from_rows` / ``parse_grid_text``, so a
pasted block is checked exactly like a grid file, and every refusal names the row and
column of the block.
"""

from __future__ import annotations

from PySide6.QtCore import QT_TRANSLATE_NOOP, QCoreApplication

from dispatcher.io.grid import GridFileError, column_letter, parse_grid_text, table_from_rows
from dispatcher.shop import Shop
from dispatcher.ui.format import fmt

SOURCE = QT_TRANSLATE_NOOP("Clipboard", "pasted block")   # the grid reader's source name
translate = QCoreApplication.translate   # the name pyside6-lupdate collects


class PasteError(ValueError):
    """The block cannot be pasted here; the message says where and why."""


def _rows_of(text: str) -> list[list[str]]:
    text = text.replace("\r\n", "\n").replace("\r", "\n")
    if text.endswith("\n"):
        text = text[:-1]
    return [line.split("\t") for line in text.split("\n")]


def paste_changes(text: str, shop: Shop, anchor_row: int, anchor_col: int
                  ) -> list[tuple[int, int, float | None]]:
    """``(row, machine col, value or None)`` for each pasted cell; raises :class:`PasteError`."""
    rows = _rows_of(text)
    if not rows or rows == [[""]]:
        raise PasteError(translate("Clipboard", "the clipboard holds no text to paste"))
    machines = {m.name: k for k, m in enumerate(shop.machines)}
    jobs = {j.name: i for i, j in enumerate(shop.jobs)}
    header = [c.strip() for c in rows[0][1:]]
    named = len(rows) > 1 and header and all(h in machines for h in header if h) and any(header)
    if named:
        try:
            table = parse_grid_text(text, SOURCE)
        except GridFileError as exc:
            raise PasteError(str(exc)) from None
        unknown = [n for n in table.jobs if n not in jobs]
        if unknown:
            raise PasteError(translate("Clipboard", "{source}: job(s) not in this shop: {jobs}").format(
                source=translate("Clipboard", SOURCE),
                jobs=", ".join(unknown[:5]) + (" ..." if len(unknown) > 5 else "")))
        out = []
        for i, job in enumerate(table.jobs):
            for k, machine in enumerate(table.machines):
                value = float(table.values[i, k]) if table.allowed[i, k] else None
                out.append((jobs[job], machines[machine], value))
        return out
    width = max(len(r) for r in rows)
    rows = [r + [""] * (width - len(r)) for r in rows]
    if anchor_row + len(rows) > len(shop.jobs) or anchor_col + width > len(shop.machines):
        raise PasteError(translate(
            "Clipboard", "{source}: {rows} x {width} cells do not fit from {job} / {machine}: the grid has "
            "{free_rows} rows and {free_columns} machine columns from there").format(
            source=translate("Clipboard", SOURCE), rows=len(rows), width=width, job=shop.jobs[anchor_row].name,
            machine=shop.machines[anchor_col].name, free_rows=len(shop.jobs) - anchor_row,
            free_columns=len(shop.machines) - anchor_col))
    # Give the plain block a synthetic header and job column so the grid reader checks it.
    framed = [[""] + [f"c{k}" for k in range(width)]] + [[f"r{i}"] + r for i, r in enumerate(rows)]
    try:
        table = table_from_rows(framed, SOURCE)
    except GridFileError as exc:
        text = str(exc)
        prefix = SOURCE
        if exc.row is not None:
            prefix += f": row {exc.row}"
            if exc.column is not None:
                prefix += f", column {exc.column} ({column_letter(exc.column)})"
        msg = text[len(prefix) + 2:] if text.startswith(prefix + ": ") else text
        where = ""
        if exc.row is not None:
            where = (translate("Clipboard", "row {row}, column {column}: ") if exc.column else
                     translate("Clipboard", "row {row}: ")).format(row=exc.row - 1, column=(exc.column or 1) - 1)
        raise PasteError(f"{translate('Clipboard', SOURCE)}: {where}{msg}") from None
    return [(anchor_row + i, anchor_col + k,
             float(table.values[i, k]) if table.allowed[i, k] else None)
            for i in range(len(rows)) for k in range(width)]


def copy_block(shop: Shop, rows: list[int], cols: list[int], with_names: bool = False) -> str:
    """Tab-separated text of the cells ``rows x cols`` (``x`` = cannot run)."""
    lines = []
    if with_names:
        lines.append("\t".join([""] + [shop.machines[k].name for k in cols]))
    for i in rows:
        jid = shop.jobs[i].id
        cells = []
        for k in cols:
            v = shop.value(jid, shop.machines[k].id)
            cells.append("x" if v is None else fmt(v, 10, plain=True))
        lines.append("\t".join(([shop.jobs[i].name] if with_names else []) + cells))
    return "\n".join(lines) + "\n"
