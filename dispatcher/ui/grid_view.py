"""The table view of the dispatch grid: selection helpers and keyboard-friendly menus."""

from __future__ import annotations

from PySide6.QtCore import QPoint, Qt, Signal
from PySide6.QtGui import QKeySequence
from PySide6.QtWidgets import QAbstractItemView, QHeaderView, QTableView

from dispatcher.ui.grid_model import FIRST_MACHINE_COL


class GridView(QTableView):
    """Jobs x machines table. Emits menu requests for cells and headers (global positions).

    Shift+F10 and the Menu key open the menu of the current cell, so every action is
    reachable without a mouse.
    """

    cell_menu_requested = Signal(QPoint)
    machine_menu_requested = Signal(int, QPoint)
    job_menu_requested = Signal(int, QPoint)

    def __init__(self, parent=None):
        super().__init__(parent)
        self.setObjectName("dispatchGrid")
        self.setSelectionMode(QAbstractItemView.SelectionMode.ExtendedSelection)
        self.setEditTriggers(QAbstractItemView.EditTrigger.DoubleClicked
                             | QAbstractItemView.EditTrigger.EditKeyPressed
                             | QAbstractItemView.EditTrigger.AnyKeyPressed)
        self.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        self.customContextMenuRequested.connect(
            lambda pos: self.cell_menu_requested.emit(self.viewport().mapToGlobal(pos)))
        self.setWordWrap(False)
        self.setCornerButtonEnabled(True)
        h = self.horizontalHeader()
        h.setSectionResizeMode(QHeaderView.ResizeMode.Interactive)
        h.setDefaultSectionSize(92)
        h.setMinimumSectionSize(40)
        h.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        h.customContextMenuRequested.connect(self._machine_menu)
        v = self.verticalHeader()
        v.setSectionResizeMode(QHeaderView.ResizeMode.Fixed)
        v.setDefaultSectionSize(24)
        v.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        v.customContextMenuRequested.connect(self._job_menu)

    def _machine_menu(self, pos: QPoint) -> None:
        column = self.horizontalHeader().logicalIndexAt(pos)
        if column >= FIRST_MACHINE_COL:
            self.machine_menu_requested.emit(column - FIRST_MACHINE_COL,
                                             self.horizontalHeader().mapToGlobal(pos))

    def _job_menu(self, pos: QPoint) -> None:
        row = self.verticalHeader().logicalIndexAt(pos)
        if row >= 0:
            self.job_menu_requested.emit(row, self.verticalHeader().mapToGlobal(pos))

    def keyPressEvent(self, event) -> None:
        if event.key() == Qt.Key.Key_Menu or (event.key() == Qt.Key.Key_F10
                                              and event.modifiers() & Qt.KeyboardModifier.ShiftModifier):
            rect = self.visualRect(self.currentIndex())
            self.cell_menu_requested.emit(self.viewport().mapToGlobal(rect.center()))
            return
        if event.matches(QKeySequence.StandardKey.Copy) or event.matches(QKeySequence.StandardKey.Paste):
            event.ignore()   # handled by the window's Copy/Paste actions
            return
        super().keyPressEvent(event)

    # ---- selection --------------------------------------------------------------------------
    def current_cell(self) -> tuple[int, int] | None:
        """(row, machine index) of the current cell, None if it is not a machine cell."""
        idx = self.currentIndex()
        if not idx.isValid() or idx.column() < FIRST_MACHINE_COL:
            return None
        return idx.row(), idx.column() - FIRST_MACHINE_COL

    def current_row(self) -> int | None:
        idx = self.currentIndex()
        return idx.row() if idx.isValid() else None

    def current_machine(self) -> int | None:
        idx = self.currentIndex()
        if not idx.isValid() or idx.column() < FIRST_MACHINE_COL:
            return None
        return idx.column() - FIRST_MACHINE_COL

    def selected_block(self) -> tuple[list[int], list[int]]:
        """Rows and machine indices covered by the selection (its bounding box)."""
        indexes = [i for i in self.selectedIndexes() if i.column() >= FIRST_MACHINE_COL]
        if not indexes:
            cell = self.current_cell()
            return ([cell[0]], [cell[1]]) if cell else ([], [])
        rows = sorted({i.row() for i in indexes})
        cols = sorted({i.column() - FIRST_MACHINE_COL for i in indexes})
        return list(range(rows[0], rows[-1] + 1)), list(range(cols[0], cols[-1] + 1))
