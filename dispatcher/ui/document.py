"""The open shop document: the Shop, its file path, its undo stack and change signals.

Every change to the shop goes through an undoable edit (:mod:`dispatcher.ui.edits`) that
calls one of the ``_apply_*`` methods here; those change the Qt-free
:class:`~dispatcher.shop.model.Shop` and say precisely what changed, so the grid model can
emit ``dataChanged`` for just those cells and the plan can be re-solved.
"""

from __future__ import annotations

import gc
from pathlib import Path

from PySide6.QtCore import QObject, Signal, Slot
from PySide6.QtGui import QUndoStack

from dispatcher.shop.model import MUST, MUST_NOT, Pin, Shop


class ShopDocument(QObject):
    """The shop being edited. Signals carry row and column indices (plain data).

    ``reset`` - a different shop (new, opened, restored): views rebuild.
    ``cells_changed(rows, cols)`` - grid values or pins of these (row, col) pairs changed.
    ``jobs_changed(rows)`` - per-job fields (rush, wait penalty, state) changed.
    ``machines_changed(cols)`` - per-machine fields (state, slots) changed.
    ``edited`` - any change at all (the plan must be re-solved).
    ``path_changed`` / ``dirty_changed(bool)`` - for the window title.
    """

    reset = Signal()
    cells_changed = Signal(object, object)
    jobs_changed = Signal(object)
    machines_changed = Signal(object)
    edited = Signal()
    path_changed = Signal()
    dirty_changed = Signal(bool)

    def __init__(self, shop: Shop | None = None, parent: QObject | None = None):
        super().__init__(parent)
        self.undo_stack = QUndoStack(self)
        self.undo_stack.cleanChanged.connect(self._on_clean_changed)
        self.path: Path | None = None
        self.shop = shop or Shop(name="Untitled shop")
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
        # A big shop is hundreds of thousands of long-lived objects; moving them out of the
        # cyclic collector's reach keeps its full passes from pausing the window.
        gc.collect()
        gc.freeze()
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
        return self.shop.grid.get((self.job_ids[row], self.machine_ids[col]))

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

    def _apply_job_field(self, row: int, field: str, value) -> None:
        setattr(self.shop.jobs[row], field, value)
        self.jobs_changed.emit([row])
        self.edited.emit()

    def _apply_machine_fields(self, col: int, fields: dict) -> None:
        machine = self.shop.machines[col]
        for name, value in fields.items():
            setattr(machine, name, value)
        self.machines_changed.emit([col])
        self.edited.emit()

    def _apply_jobs_state(self, jobs: list[tuple[int, dict]]) -> None:
        for row, fields in jobs:
            for name, value in fields.items():
                setattr(self.shop.jobs[row], name, value)
        self.jobs_changed.emit([r for r, _ in jobs])
        self.edited.emit()

    def _apply_shop(self, shop: Shop) -> None:
        """Swap the whole shop (an import that may add jobs and machines); views rebuild."""
        self.shop = shop
        self._index()
        self.reset.emit()
        self.edited.emit()

    def _apply_plan_in_force(self, plan_in_force: dict[str, list[str]]) -> None:
        self.shop.plan_in_force = {k: list(v) for k, v in plan_in_force.items()}
        self.edited.emit()
