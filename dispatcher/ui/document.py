"""The open shop document: the Shop, its file path, its undo stack and change signals.

Every change to the shop goes through an undoable edit (:mod:`dispatcher.ui.edits`) that
calls one of the ``_apply_*`` methods here; those change the Qt-free
:class:`~dispatcher.shop.model.Shop` and say precisely what changed, so the grid model can
emit ``dataChanged`` for just those cells and the plan can be re-solved.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from pathlib import Path

from PySide6.QtCore import QObject, Signal, Slot
from PySide6.QtGui import QUndoStack

from dispatcher.shop.crew import Authorisation
from dispatcher.shop.model import MUST, MUST_NOT, Job, Machine, Pin, Shop


@dataclass
class RemovedRecord:
    """A job or machine taken out of the document with what belonged to it only (so that
    undo puts exactly that back, without keeping a copy of the whole shop)."""

    record: Job | Machine
    grid: dict = field(default_factory=dict)
    hours: dict = field(default_factory=dict)
    pins: list = field(default_factory=list)
    plan_in_force: dict | None = None
    blocked: set = field(default_factory=set)


class ShopDocument(QObject):
    """The shop being edited. Signals carry row and column indices (plain data).

    ``reset`` - a different shop (new, opened, restored): views rebuild.
    ``cells_changed(rows, cols)`` - grid values or pins of these (row, col) pairs changed.
    ``jobs_changed(rows)`` - per-job fields (rush, wait penalty, state) changed.
    ``machines_changed(cols)`` - per-machine fields (state, slots) changed.
    ``crew_changed`` - operators, attendance, capacities, authorisations or groups changed.
    ``tables_changed(index)`` - entries of that changeover table changed (the derived
    values of its machines too, announced with ``cells_changed``).
    ``edited`` - any change at all (the plan must be re-solved).
    ``path_changed`` / ``dirty_changed(bool)`` - for the window title.
    """

    reset = Signal()
    cells_changed = Signal(object, object)
    jobs_changed = Signal(object)
    machines_changed = Signal(object)
    crew_changed = Signal()
    tables_changed = Signal(int)   # entries of changeover table (index) changed
    edited = Signal()
    path_changed = Signal()
    dirty_changed = Signal(bool)
    # Before and after a job row or machine column is inserted or removed (the index), so
    # that models can call beginInsertRows/endInsertRows and keep selection and scroll.
    job_inserting = Signal(int)
    job_inserted = Signal(int)
    job_removing = Signal(int)
    job_removed = Signal(int)
    machine_inserting = Signal(int)
    machine_inserted = Signal(int)
    machine_removing = Signal(int)
    machine_removed = Signal(int)

    def __init__(self, shop: Shop | None = None, parent: QObject | None = None):
        super().__init__(parent)
        self.undo_stack = QUndoStack(self)
        self.undo_stack.cleanChanged.connect(self._on_clean_changed)
        self.path: Path | None = None
        self.shop = shop or Shop(name=self.tr("Untitled shop"))
        self._index()

    @Slot(bool)
    def _on_clean_changed(self, clean: bool) -> None:
        self.dirty_changed.emit(not clean)

    # ---- whole-document -----------------------------------------------------------------
    def replace(self, shop: Shop, path: Path | None = None) -> None:
        """Show another shop (new/open/restore). Clears undo history; marks clean."""
        self.shop = shop
        self.path = Path(path) if path is not None else None
        self._index()
        self.undo_stack.clear()
        self.undo_stack.setClean()
        self.reset.emit()
        self.path_changed.emit()
        self.dirty_changed.emit(False)
        self.edited.emit()

    def set_path(self, path: Path) -> None:
        self.path = Path(path)
        self.undo_stack.setClean()
        self.path_changed.emit()

    @property
    def dirty(self) -> bool:
        return not self.undo_stack.isClean()

    def _index(self) -> None:
        self.job_ids = [j.id for j in self.shop.jobs]
        self.machine_ids = [m.id for m in self.shop.machines]
        self.job_row = {jid: i for i, jid in enumerate(self.job_ids)}
        self.machine_col = {mid: k for k, mid in enumerate(self.machine_ids)}
        self._rebuild_pins()

    def _rebuild_pins(self) -> None:
        self.pin_of: dict[tuple[str, str], str] = {}
        for p in self.shop.pins:
            self.pin_of[(p.job, p.machine)] = p.kind

    # ---- look-ups by position -------------------------------------------------------------
    def n_jobs(self) -> int:
        return len(self.job_ids)

    def n_machines(self) -> int:
        return len(self.machine_ids)

    def job_at(self, row: int):
        return self.shop.jobs[row]

    def machine_at(self, col: int):
        return self.shop.machines[col]

    def value_at(self, row: int, col: int) -> float | None:
        """The pair's value: typed, else derived from the machine's changeover table."""
        jid, mid = self.job_ids[row], self.machine_ids[col]
        typed = self.shop.grid.get((jid, mid))
        if typed is not None or not self.shop.changeover_tables or (jid, mid) in self.shop.blocked:
            return typed
        return self.shop.derived_value(jid, mid)

    def pin_at(self, row: int, col: int) -> str | None:
        return self.pin_of.get((self.job_ids[row], self.machine_ids[col]))

    # ---- primitive changes (called by undoable edits only) --------------------------------
    def _apply_values(self, changes: list[tuple[int, int, float | None]]) -> None:
        for row, col, value in changes:
            self.shop.set_value(self.job_ids[row], self.machine_ids[col], value)
        self.cells_changed.emit([c[0] for c in changes], [c[1] for c in changes])
        self.edited.emit()

    def _apply_pin(self, row: int, col: int, kind: str | None, note: str = "") -> None:
        jid, mid = self.job_ids[row], self.machine_ids[col]
        self.shop.pins = [p for p in self.shop.pins if not (p.job == jid and p.machine == mid)]
        if kind in (MUST, MUST_NOT):
            self.shop.pins.append(Pin(jid, mid, kind, note))
        self._rebuild_pins()
        self.cells_changed.emit([row], [col])
        self.edited.emit()

    def cell_state(self, row: int, col: int) -> tuple[float | None, bool]:
        """What is typed in a cell: ``(typed value or None, typed "cannot run" over the
        changeover table)``; ``(None, False)`` where the value comes from the table."""
        key = (self.job_ids[row], self.machine_ids[col])
        return self.shop.grid.get(key), key in self.shop.blocked

    def _restore_cells(self, states: list[tuple[int, int, float | None, bool]]) -> None:
        """Put back what was typed in cells (see :meth:`cell_state`), table-derived included."""
        for row, col, typed, blocked in states:
            key = (self.job_ids[row], self.machine_ids[col])
            if typed is None:
                self.shop.grid.pop(key, None)
            else:
                self.shop.grid[key] = typed
            if blocked:
                self.shop.blocked.add(key)
            else:
                self.shop.blocked.discard(key)
        self.cells_changed.emit([s[0] for s in states], [s[1] for s in states])
        self.edited.emit()

    def _apply_changes(self, index: int, cells: list[tuple[str | None, str, float | None]]) -> None:
        """Set entries of changeover table ``index``: ``(from family or None, to family,
        value or None = not allowed)``."""
        table = self.shop.changeover_tables[index]
        for frm, to, value in cells:
            if value is None:
                table.changes.pop((frm, to), None)
            else:
                table.changes[(frm, to)] = float(value)
        self.tables_changed.emit(index)
        cols = [self.machine_col[m] for m in table.machines if m in self.machine_col]
        if cols and self.job_ids:
            self.cells_changed.emit([0, len(self.job_ids) - 1], [min(cols), max(cols)])
        self.edited.emit()

    def _apply_job_field(self, row: int, field: str, value) -> None:
        setattr(self.shop.jobs[row], field, value)
        self.jobs_changed.emit([row])
        if field == "family" and self.machine_ids:
            # every derived value of the row follows the job's family
            self.cells_changed.emit([row], [0, len(self.machine_ids) - 1])
        self.edited.emit()

    def _apply_machine_fields(self, col: int, fields: dict) -> None:
        machine = self.shop.machines[col]
        for name, value in fields.items():
            setattr(machine, name, value)
        self.machines_changed.emit([col])
        if {"mounted", "end_family"} & set(fields) and self.job_ids:
            # the derived values of the column follow the mounted family
            self.cells_changed.emit([0, len(self.job_ids) - 1], [col])
        self.edited.emit()

    def _apply_authorisations(self, cells: list[tuple[int, int, bool]]) -> None:
        """Give (True) or take (False) operator ``op``'s own authorisation for machine
        ``col``; authorisations through a machine group are left as they are."""
        crew = self.shop.crew
        for op, col, on in cells:
            oid, mid = crew.operators[op].id, self.machine_ids[col]
            crew.authorisations = [a for a in crew.authorisations
                                   if not (a.operator == oid and a.machine == mid)]
            if on:
                crew.authorisations.append(Authorisation(oid, machine=mid))
        self.crew_changed.emit()
        self.edited.emit()

    def _restore_authorisations(self, authorisations: list) -> None:
        self.shop.crew.authorisations = list(authorisations)
        self.crew_changed.emit()
        self.edited.emit()

    def _apply_operator_field(self, op: int, field: str, value) -> None:
        setattr(self.shop.crew.operators[op], field, value)
        self.crew_changed.emit()
        self.edited.emit()

    def _apply_crew(self, crew) -> None:
        """Put ``crew`` (a whole :class:`~dispatcher.shop.crew.Crew`) in the shop."""
        self.shop.crew = crew
        self.crew_changed.emit()
        self.edited.emit()

    def _insert_operator(self, index: int, operator) -> None:
        self.shop.crew.operators.insert(index, operator)
        self.crew_changed.emit()
        self.edited.emit()

    def _remove_operator(self, index: int):
        operator = self.shop.crew.operators.pop(index)
        self.crew_changed.emit()
        self.edited.emit()
        return operator

    def _apply_jobs_state(self, jobs: list[tuple[int, dict]]) -> None:
        for row, fields in jobs:
            for name, value in fields.items():
                setattr(self.shop.jobs[row], name, value)
        self.jobs_changed.emit([r for r, _ in jobs])
        self.edited.emit()

    def _insert_job(self, row: int, saved: RemovedRecord) -> None:
        """Put a job back at ``row`` with its grid values, run hours, pins and the plan in
        force it had (what :meth:`_remove_job` returned), or add a new one."""
        self.job_inserting.emit(row)
        self.shop.jobs.insert(row, saved.record)
        self._restore(saved)
        self._index()
        self.job_inserted.emit(row)
        self.edited.emit()

    def _remove_job(self, row: int) -> RemovedRecord:
        self.job_removing.emit(row)
        job = self.shop.jobs.pop(row)
        saved = self._take(job, lambda key: key[0] == job.id, lambda p: p.job == job.id)
        self._index()
        self.job_removed.emit(row)
        self.edited.emit()
        return saved

    def _insert_machine(self, col: int, saved: RemovedRecord) -> None:
        self.machine_inserting.emit(col)
        self.shop.machines.insert(col, saved.record)
        self._restore(saved)
        self._index()
        self.machine_inserted.emit(col)
        self.edited.emit()

    def _remove_machine(self, col: int) -> RemovedRecord:
        self.machine_removing.emit(col)
        machine = self.shop.machines.pop(col)
        saved = self._take(machine, lambda key: key[1] == machine.id, lambda p: p.machine == machine.id)
        self._index()
        self.machine_removed.emit(col)
        self.edited.emit()
        return saved

    def _take(self, record, key_of_record, pin_of_record) -> RemovedRecord:
        shop = self.shop
        grid = {k: v for k, v in shop.grid.items() if key_of_record(k)}
        hours = {k: v for k, v in shop.hours.items() if key_of_record(k)}
        for k in grid:
            del shop.grid[k]
        for k in hours:
            del shop.hours[k]
        # Typed "cannot run" marks over a changeover table go too: a saved file naming a
        # job or machine it no longer has would not open again.
        blocked = {k for k in shop.blocked if key_of_record(k)}
        shop.blocked -= blocked
        pins = [p for p in shop.pins if pin_of_record(p)]
        shop.pins = [p for p in shop.pins if not pin_of_record(p)]
        in_force = {m: list(js) for m, js in shop.plan_in_force.items()}
        rid = record.id
        shop.plan_in_force = {m: [j for j in js if j != rid] for m, js in shop.plan_in_force.items()
                              if m != rid}
        shop.plan_in_force = {m: js for m, js in shop.plan_in_force.items() if js}
        return RemovedRecord(record, grid, hours, pins, in_force, blocked)

    def _restore(self, saved: RemovedRecord) -> None:
        self.shop.grid.update(saved.grid)
        self.shop.hours.update(saved.hours)
        self.shop.pins.extend(saved.pins)
        self.shop.blocked |= saved.blocked
        if saved.plan_in_force is not None:
            self.shop.plan_in_force = {m: list(js) for m, js in saved.plan_in_force.items()}

    def _apply_shop(self, shop: Shop) -> None:
        """Swap the whole shop (an import that may add jobs and machines); views rebuild."""
        self.shop = shop
        self._index()
        self.reset.emit()
        self.edited.emit()

    def _apply_plan_in_force(self, plan_in_force: dict[str, list[str]]) -> None:
        self.shop.plan_in_force = {k: list(v) for k, v in plan_in_force.items()}
        self.edited.emit()
