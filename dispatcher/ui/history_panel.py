"""The history panel: recorded decisions, filtered, two compared, one restored.

Reads :class:`dispatcher.history.HistoryStore` (Qt-free, append-only); restoring records a
new decision "restored from #N" there and then opens that decision's shop snapshot.
"""

from __future__ import annotations

from datetime import timezone

from PySide6.QtCore import QAbstractTableModel, QModelIndex, QPersistentModelIndex, Qt, Signal
from PySide6.QtWidgets import (
    QAbstractItemView,
    QComboBox,
    QHBoxLayout,
    QHeaderView,
    QLabel,
    QLineEdit,
    QPlainTextEdit,
    QPushButton,
    QSplitter,
    QTableView,
    QVBoxLayout,
    QWidget,
)

from dispatcher.history import REASON_KINDS, DecisionSummary, HistoryError, HistoryStore, reason_label
from dispatcher.ui.format import fmt

COL_ID, COL_TIME, COL_SHIFT, COL_BY, COL_REASON, COL_NOTE, COL_TOTAL, COL_PROOF = range(8)
HEADERS = ["#", "Time (local)", "Shift", "Supervisor", "Reason", "Note", "Total", "Proof"]
DecisionIdRole = Qt.ItemDataRole.UserRole + 1

FILTER_FIELDS = {"job": "Job", "machine": "Machine", "by": "Supervisor"}


class DecisionListModel(QAbstractTableModel):
    """Decisions as rows (newest first)."""

    def __init__(self, parent=None):
        super().__init__(parent)
        self._rows: list[DecisionSummary] = []

    def set_decisions(self, rows: list[DecisionSummary]) -> None:
        self.beginResetModel()
        self._rows = list(rows)
        self.endResetModel()

    def decision(self, row: int) -> DecisionSummary:
        return self._rows[row]

    def rowCount(self, parent: QModelIndex | QPersistentModelIndex = QModelIndex()) -> int:
        return 0 if parent.isValid() else len(self._rows)

    def columnCount(self, parent: QModelIndex | QPersistentModelIndex = QModelIndex()) -> int:
        return 0 if parent.isValid() else len(HEADERS)

    def headerData(self, section: int, orientation: Qt.Orientation, role: int = Qt.ItemDataRole.DisplayRole):
        if orientation == Qt.Orientation.Horizontal and role == Qt.ItemDataRole.DisplayRole:
            return HEADERS[section]
        return None

    def data(self, index: QModelIndex | QPersistentModelIndex, role: int = Qt.ItemDataRole.DisplayRole):
        if not index.isValid():
            return None
        d = self._rows[index.row()]
        col = index.column()
        if role == DecisionIdRole:
            return d.id
        if role == Qt.ItemDataRole.DisplayRole:
            return {
                COL_ID: str(d.id),
                COL_TIME: d.time.replace(tzinfo=d.time.tzinfo or timezone.utc).astimezone().strftime("%Y-%m-%d %H:%M"),
                COL_SHIFT: f"{d.shift_date:%Y-%m-%d} {d.shift}",
                COL_BY: d.by,
                COL_REASON: reason_label(d.reason),
                COL_NOTE: d.note,
                COL_TOTAL: fmt(d.total),
                COL_PROOF: "\u2713 checked" if d.certificate == "verified" else d.certificate,
            }[col]
        if role == Qt.ItemDataRole.ToolTipRole:
            if col == COL_TOTAL:
                return f"Total of decision #{d.id} ({d.objective}); replaces #{d.replaces or '-'}"
            if col == COL_ID:
                return (f"Decision #{d.id}" + (f", restored from #{d.restored_from}" if d.restored_from else ""))
            if col == COL_TIME:
                return f"Recorded at {d.time:%Y-%m-%d %H:%M:%S} UTC"
            return str(self.data(index))
        if role == Qt.ItemDataRole.TextAlignmentRole and col in (COL_ID, COL_TOTAL):
            return int(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
        return None


class HistoryPanel(QWidget):
    """List, filter, compare two, restore one. ``restore_requested(decision_id)``."""

    restore_requested = Signal(int)
    message = Signal(str)

    def __init__(self, store: HistoryStore, parent: QWidget | None = None):
        super().__init__(parent)
        self.setObjectName("historyPanel")
        self.store = store
        layout = QVBoxLayout(self)
        filters = QHBoxLayout()
        self.field = QComboBox()
        for key, label in FILTER_FIELDS.items():
            self.field.addItem(label, key)
        self.text = QLineEdit()
        self.text.setPlaceholderText("name to look for (exact), empty = all")
        self.text.setClearButtonEnabled(True)
        self.reason = QComboBox()
        self.reason.addItem("any reason", None)
        for key, label in REASON_KINDS.items():
            self.reason.addItem(label, key)
        self.refresh_button = QPushButton("&Refresh")
        filters.addWidget(QLabel("Filter:"))
        filters.addWidget(self.field)
        filters.addWidget(self.text, 1)
        filters.addWidget(self.reason)
        filters.addWidget(self.refresh_button)
        layout.addLayout(filters)

        self.model = DecisionListModel(self)
        self.table = QTableView()
        self.table.setObjectName("historyTable")
        self.table.setModel(self.model)
        self.table.setSelectionBehavior(QAbstractItemView.SelectionBehavior.SelectRows)
        self.table.setSelectionMode(QAbstractItemView.SelectionMode.ExtendedSelection)
        self.table.verticalHeader().setVisible(False)
        self.table.horizontalHeader().setSectionResizeMode(COL_NOTE, QHeaderView.ResizeMode.Stretch)
        self.table.setAlternatingRowColors(True)
        self.details = QPlainTextEdit()
        self.details.setObjectName("historyDetails")
        self.details.setReadOnly(True)
        self.details.setPlaceholderText("Select one decision to see its plan, or two to compare them.")
        split = QSplitter(Qt.Orientation.Horizontal)
        split.addWidget(self.table)
        split.addWidget(self.details)
        split.setSizes([650, 350])
        layout.addWidget(split, 1)
        buttons = QHBoxLayout()
        self.where = QLabel()
        self.where.setObjectName("historyFile")
        self.where.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.where.setToolTip("The history file these decisions come from (Edit \u25b8 Settings to change it)")
        buttons.addWidget(self.where, 1)
        self.compare_button = QPushButton("&Compare two")
        self.compare_button.setToolTip("Select two decisions (Ctrl+click) and compare their plans")
        self.restore_button = QPushButton("Res&tore\u2026")
        self.restore_button.setToolTip("Record a new decision that puts this one's plan back in force")
        buttons.addWidget(self.compare_button)
        buttons.addWidget(self.restore_button)
        layout.addLayout(buttons)

        self.refresh_button.clicked.connect(self.refresh)
        self.text.returnPressed.connect(self.refresh)
        self.reason.currentIndexChanged.connect(lambda _: self.refresh())
        self.compare_button.clicked.connect(self.compare_selected)
        self.restore_button.clicked.connect(self._restore_selected)
        self.table.selectionModel().selectionChanged.connect(lambda *_: self._show_selected())

    def set_store(self, store: HistoryStore) -> None:
        """Show another history file (chosen in the settings)."""
        self.store = store
        self.details.clear()
        self.refresh()

    def filters(self) -> dict:
        out = {}
        text = self.text.text().strip()
        if text:
            out[self.field.currentData()] = text
        if self.reason.currentData():
            out["reason"] = self.reason.currentData()
        return out

    def refresh(self) -> None:
        self.where.setText(f"File: {self.store.path}")
        try:
            rows = self.store.list(newest_first=True, **self.filters())
        except HistoryError as exc:
            self.details.setPlainText(str(exc))
            self.message.emit(str(exc))
            rows = []
        self.model.set_decisions(rows)
        self.table.resizeColumnsToContents()

    def selected_ids(self) -> list[int]:
        rows = sorted({i.row() for i in self.table.selectionModel().selectedRows()})
        return [self.model.decision(r).id for r in rows]

    def select_ids(self, ids: list[int]) -> None:
        sel = self.table.selectionModel()
        sel.clear()
        for r in range(self.model.rowCount()):
            if self.model.decision(r).id in ids:
                sel.select(self.model.index(r, 0), sel.SelectionFlag.Select | sel.SelectionFlag.Rows)

    def _show_selected(self) -> None:
        ids = self.selected_ids()
        if len(ids) == 1:
            self.show_decision(ids[0])
        elif len(ids) == 2:
            self.compare_selected()

    def show_decision(self, decision_id: int) -> None:
        try:
            d = self.store.get(decision_id)
        except HistoryError as exc:
            self.details.setPlainText(str(exc))
            return
        plan = d.plan or {}
        lines = [f"Decision #{d.id} - {reason_label(d.reason)} by {d.by}",
                 f"{d.note}" if d.note else "", f"Total: {fmt(plan.get('total'))} ({plan.get('objective')})", ""]
        for a in plan.get("running", []):
            lines.append(f"\u25b6 {a['machine']}: {a['job']} (running)")
        for a in plan.get("assignments", []):
            lines.append(f"\u2713 {a['machine']}: {a['job']}  {fmt(a['cost'])}")
        if plan.get("waiting_jobs"):
            lines.append("Waiting: " + ", ".join(plan["waiting_jobs"]))
        if plan.get("idle_machines"):
            lines.append("Idle: " + ", ".join(plan["idle_machines"]))
        if d.diff_from_replaced is not None:
            lines += ["", f"Changes from #{d.diff_from_replaced.from_id}:"]
            lines += ["  " + x for x in d.diff_from_replaced.lines()]
        self.details.setPlainText("\n".join(x for x in lines))

    def compare_selected(self) -> None:
        ids = self.selected_ids()
        if len(ids) != 2:
            self.message.emit("select exactly two decisions to compare")
            return
        a, b = sorted(ids)
        try:
            diff = self.store.diff(a, b)
        except HistoryError as exc:
            self.details.setPlainText(str(exc))
            return
        self.details.setPlainText(f"From decision #{a} to #{b}:\n" + "\n".join(diff.lines()))

    def _restore_selected(self) -> None:
        ids = self.selected_ids()
        if len(ids) != 1:
            self.message.emit("select one decision to restore")
            return
        self.restore_requested.emit(ids[0])
