"""Column widths of the dispatch grid, fitted a few columns per turn of the event loop.

When a plan arrives, machine headings can change (a machine down, its operator named),
and a freshly opened shop needs every column fitted. Measuring all headings of a
1000 x 200 shop at once held the window for 40-80 ms on top of showing the plan, so
:class:`ColumnSizer` does the work in chunks of :data:`CHUNK` machine columns, returning to
the event loop between chunks; the window keeps answering keys and repaints meanwhile.
"""

from __future__ import annotations

from collections.abc import Iterator

from PySide6.QtCore import QObject, QTimer
from PySide6.QtWidgets import QTableView

from dispatcher.ui.grid_model import COL_PLAN, FIRST_MACHINE_COL

#: Machine columns measured per turn of the event loop (about 5 ms on a 2-core machine).
CHUNK = 40
#: A machine column sized to its heading grows no wider (px).
MAX_MACHINE_WIDTH = 220
#: The plan column is at least this wide (px): "Machine name (slot 2)" fits.
MIN_PLAN_WIDTH = 170


class ColumnSizer(QObject):
    """Fits (once per opened shop) or widens (after every plan) the grid's columns."""

    def __init__(self, view: QTableView, n_machines, parent=None):
        super().__init__(parent)
        self._view = view
        self._n_machines = n_machines      # callable: the shop's machine count now
        self._steps: Iterator[None] | None = None
        self._fit_pending = True           # the next sizing fits every column
        self._timer = QTimer(self)
        self._timer.setInterval(0)
        self._timer.timeout.connect(self._next)

    def start_over(self) -> None:
        """A new shop: the next sizing fits every column; a sizing under way is dropped."""
        self._fit_pending = True
        self._steps = None
        self._timer.stop()

    def size_soon(self) -> None:
        """Size the columns from the headings as they are now (a fit when one is pending,
        else a widening), starting over when a sizing is under way."""
        self._steps = self._chunks(self._fit_pending)
        self._timer.start()

    def settled(self) -> bool:
        """True when no sizing is under way."""
        return self._steps is None

    def _next(self) -> None:
        if self._steps is None or next(self._steps, StopIteration) is StopIteration:
            self._steps = None
            self._timer.stop()

    def header_need(self, k: int) -> int:
        """The width machine column ``k``'s heading needs in the header's style."""
        return self._view.horizontalHeader().sectionSizeFromContents(FIRST_MACHINE_COL + k).width()

    def _chunks(self, fit: bool) -> Iterator[None]:
        """Fit: the job columns measured on a sample of rows, the machine columns from their
        heading (cell values are short numbers; measuring every machine column's cells
        stalled the window for over a second on a 1000 x 200 shop). Widen: a heading that
        grew widens its column up to the limit; columns never shrink, so a hand-set width
        stays."""
        view = self._view
        header = view.horizontalHeader()
        if fit:
            header.setResizeContentsPrecision(60)
            for column in range(FIRST_MACHINE_COL):
                view.resizeColumnToContents(column)
                if column == COL_PLAN:
                    view.setColumnWidth(COL_PLAN, max(view.columnWidth(COL_PLAN), MIN_PLAN_WIDTH))
                yield
        floor = header.fontMetrics().horizontalAdvance("000000.0") + 16
        k = 0
        while k < self._n_machines():
            for k in range(k, min(k + CHUNK, self._n_machines())):
                column = FIRST_MACHINE_COL + k
                need = min(self.header_need(k), MAX_MACHINE_WIDTH)
                if fit:
                    view.setColumnWidth(column, min(max(need, floor), MAX_MACHINE_WIDTH))
                elif view.columnWidth(column) < need:
                    view.setColumnWidth(column, need)
            k += 1
            yield
        if fit:
            self._fit_pending = False
