"""Undoable edits of the shop document (Qt's QUndoCommand: Ctrl+Z / Ctrl+Shift+Z work).

Each edit remembers the old and the new state of exactly what it touches and applies it
through :class:`~dispatcher.ui.document.ShopDocument`, which announces the change.
"""

from __future__ import annotations

from typing import Any

from PySide6.QtGui import QUndoCommand

from dispatcher.ui.document import RemovedRecord, ShopDocument


class SetValues(QUndoCommand):
    """Set grid values of several cells at once (one cell edit, a paste, or a clear).

    Undo puts back what was typed before, so a cell whose value came from the changeover
    table goes back to following the table (not to a typed copy of the derived value).
    """

    def __init__(self, doc: ShopDocument, cells: list[tuple[int, int, float | None]], text: str):
        super().__init__(text)
        self._doc = doc
        self._new = list(cells)
        self._old = [(r, c, *doc.cell_state(r, c)) for r, c, _ in cells]

    def redo(self) -> None:
        self._doc._apply_values(self._new)

    def undo(self) -> None:
        self._doc._restore_cells(self._old)


class UseTable(QUndoCommand):
    """Drop what is typed in cells, so that their values come from the changeover table."""

    def __init__(self, doc: ShopDocument, cells: list[tuple[int, int]], text: str):
        super().__init__(text)
        self._doc = doc
        self._old = [(r, c, *doc.cell_state(r, c)) for r, c in cells]

    def redo(self) -> None:
        self._doc._restore_cells([(r, c, None, False) for r, c, _, _ in self._old])

    def undo(self) -> None:
        self._doc._restore_cells(self._old)


class SetChanges(QUndoCommand):
    """Set entries of one changeover table (a typed cell or a pasted block)."""

    def __init__(self, doc: ShopDocument, index: int, cells: list[tuple[str | None, str, float | None]],
                 text: str):
        super().__init__(text)
        self._doc, self._index = doc, index
        self._new = list(cells)
        changes = doc.shop.changeover_tables[index].changes
        self._old = [(a, b, changes.get((a, b))) for a, b, _ in cells]

    def redo(self) -> None:
        self._doc._apply_changes(self._index, self._new)

    def undo(self) -> None:
        self._doc._apply_changes(self._index, self._old)


class SetPin(QUndoCommand):
    """Pin a pair (``"must"``), forbid it (``"must_not"``) or clear its pin (``None``)."""

    def __init__(self, doc: ShopDocument, row: int, col: int, kind: str | None, text: str):
        super().__init__(text)
        self._doc, self._row, self._col = doc, row, col
        self._new = kind
        jid, mid = doc.job_ids[row], doc.machine_ids[col]
        old = [p for p in doc.shop.pins if p.job == jid and p.machine == mid]
        self._old = old[0].kind if old else None
        self._old_note = old[0].note if old else ""

    def redo(self) -> None:
        self._doc._apply_pin(self._row, self._col, self._new)

    def undo(self) -> None:
        self._doc._apply_pin(self._row, self._col, self._old, self._old_note)


class SetJobField(QUndoCommand):
    """Change one field of one job (rush flag, wait penalty)."""

    def __init__(self, doc: ShopDocument, row: int, field: str, value: Any, text: str):
        super().__init__(text)
        self._doc, self._row, self._field = doc, row, field
        self._new = value
        self._old = getattr(doc.job_at(row), field)

    def redo(self) -> None:
        self._doc._apply_job_field(self._row, self._field, self._new)

    def undo(self) -> None:
        self._doc._apply_job_field(self._row, self._field, self._old)


class SetMachineFields(QUndoCommand):
    """Change fields of one machine (state with its note and time, slots)."""

    def __init__(self, doc: ShopDocument, col: int, fields: dict[str, Any], text: str):
        super().__init__(text)
        self._doc, self._col = doc, col
        self._new = dict(fields)
        machine = doc.machine_at(col)
        self._old = {name: getattr(machine, name) for name in fields}

    def redo(self) -> None:
        self._doc._apply_machine_fields(self._col, self._new)

    def undo(self) -> None:
        self._doc._apply_machine_fields(self._col, self._old)


class SetJobsState(QUndoCommand):
    """Change state fields of several jobs (a running job put back to waiting)."""

    def __init__(self, doc: ShopDocument, jobs: list[tuple[int, dict[str, Any]]], text: str,
                 parent: QUndoCommand | None = None):
        super().__init__(text, parent)
        self._doc = doc
        self._new = [(r, dict(f)) for r, f in jobs]
        self._old = [(r, {n: getattr(doc.job_at(r), n) for n in f}) for r, f in jobs]

    def redo(self) -> None:
        self._doc._apply_jobs_state(self._new)

    def undo(self) -> None:
        self._doc._apply_jobs_state(self._old)


class SetPlanInForce(QUndoCommand):
    """Replace the plan in force (machine id -> job ids) after a confirmed decision."""

    def __init__(self, doc: ShopDocument, plan_in_force: dict[str, list[str]], text: str,
                 parent: QUndoCommand | None = None):
        super().__init__(text, parent)
        self._doc = doc
        self._new = {k: list(v) for k, v in plan_in_force.items()}
        self._old = {k: list(v) for k, v in doc.shop.plan_in_force.items()}

    def redo(self) -> None:
        self._doc._apply_plan_in_force(self._new)

    def undo(self) -> None:
        self._doc._apply_plan_in_force(self._old)


class ReplaceShop(QUndoCommand):
    """Swap in a whole new shop (a merged import); undo brings the old one back."""

    def __init__(self, doc: ShopDocument, shop, text: str):
        super().__init__(text)
        self._doc = doc
        self._new = shop
        self._old = doc.shop

    def redo(self) -> None:
        self._doc._apply_shop(self._new)

    def undo(self) -> None:
        self._doc._apply_shop(self._old)


class AddJob(QUndoCommand):
    """Append a job row (the grid model inserts the row; selection and scroll stay)."""

    def __init__(self, doc: ShopDocument, job, text: str):
        super().__init__(text)
        self._doc = doc
        self._saved = RemovedRecord(job)
        self._row = doc.n_jobs()

    def redo(self) -> None:
        self._doc._insert_job(self._row, self._saved)

    def undo(self) -> None:
        self._saved = self._doc._remove_job(self._row)


class AddMachine(QUndoCommand):
    """Append a machine column."""

    def __init__(self, doc: ShopDocument, machine, text: str):
        super().__init__(text)
        self._doc = doc
        self._saved = RemovedRecord(machine)
        self._col = doc.n_machines()

    def redo(self) -> None:
        self._doc._insert_machine(self._col, self._saved)

    def undo(self) -> None:
        self._saved = self._doc._remove_machine(self._col)


class RemoveJob(QUndoCommand):
    """Take job ``row`` out of the shop with its values, pins and place in the plan in
    force; undo puts back exactly those (a pulled job)."""

    def __init__(self, doc: ShopDocument, row: int, text: str):
        super().__init__(text)
        self._doc = doc
        self._row = row
        self._saved: RemovedRecord | None = None

    def redo(self) -> None:
        self._saved = self._doc._remove_job(self._row)

    def undo(self) -> None:
        self._doc._insert_job(self._row, self._saved)


class SetAuthorisations(QUndoCommand):
    """Give or take operators' own authorisations for machines (a click or a paste)."""

    def __init__(self, doc: ShopDocument, cells: list[tuple[int, int, bool]], text: str):
        super().__init__(text)
        self._doc = doc
        self._new = list(cells)
        self._old = list(doc.shop.crew.authorisations)

    def redo(self) -> None:
        self._doc._apply_authorisations(self._new)

    def undo(self) -> None:
        self._doc._restore_authorisations(self._old)


class SetOperatorField(QUndoCommand):
    """Change one field of one operator (label, attendance, minding capacity)."""

    def __init__(self, doc: ShopDocument, op: int, field: str, value: Any, text: str):
        super().__init__(text)
        self._doc, self._op, self._field = doc, op, field
        self._new = value
        self._old = getattr(doc.shop.crew.operators[op], field)

    def redo(self) -> None:
        self._doc._apply_operator_field(self._op, self._field, self._new)

    def undo(self) -> None:
        self._doc._apply_operator_field(self._op, self._field, self._old)


class AddOperator(QUndoCommand):
    """Add an operator at the end of the crew (undo takes them out again)."""

    def __init__(self, doc: ShopDocument, operator, text: str):
        super().__init__(text)
        self._doc, self._operator = doc, operator

    def redo(self) -> None:
        self._doc._insert_operator(len(self._doc.shop.crew.operators), self._operator)

    def undo(self) -> None:
        self._doc._remove_operator(len(self._doc.shop.crew.operators) - 1)


class SetCrew(QUndoCommand):
    """Put in a crew made by one checked edit of :mod:`dispatcher.shop.crew_edit` (times,
    expiry, groups, unattended machines, notes, removing an operator, warning days).

    Edits with the same ``merge`` key that follow each other (the warning days stepped
    with the arrows) become one step of the undo history.
    """

    MERGE_IDS = {"warn_days": 1701}

    def __init__(self, doc: ShopDocument, crew, text: str, merge: str | None = None):
        super().__init__(text)
        self._doc = doc
        self._old = doc.shop.crew.copy()
        self._new = crew.copy()
        self._id = self.MERGE_IDS.get(merge, -1)

    def id(self) -> int:
        return self._id

    def mergeWith(self, other: QUndoCommand) -> bool:
        if other.id() != self._id or self._id == -1:
            return False
        self._new = other._new.copy()
        self.setText(other.text())
        return True

    def redo(self) -> None:
        self._doc._apply_crew(self._new.copy())

    def undo(self) -> None:
        self._doc._apply_crew(self._old.copy())
