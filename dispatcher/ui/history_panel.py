"""The history panel: recorded decisions, filtered, two compared, one restored.

Reads :class:`dispatcher.history.HistoryStore` (Qt-free, append-only); restoring records a
new decision "restored from #N" there and then opens that decision's shop snapshot.
"""

from __future__ import annotations

from datetime import timezone

from PySide6.QtCore import QT_TRANSLATE_NOOP, QAbstractTableModel, QModelIndex, QPersistentModelIndex, Qt, Signal
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

from dispatcher.history import REASON_KINDS, DecisionSummary, HistoryError, HistoryStore
from dispatcher.ui.format import fmt, reason_text, when_text

COL_ID, COL_TIME, COL_SHIFT, COL_BY, COL_REASON, COL_NOTE, COL_TOTAL, COL_PROOF = range(8)
#: Column heads (English; the model shows them translated).
HEADERS = ["#", QT_TRANSLATE_NOOP("DecisionListModel", "Time (local)"), QT_TRANSLATE_NOOP("DecisionListModel", "Shift"),
           QT_TRANSLATE_NOOP("DecisionListModel", "Supervisor"), QT_TRANSLATE_NOOP("DecisionListModel", "Reason"),
           QT_TRANSLATE_NOOP("DecisionListModel", "Note"), QT_TRANSLATE_NOOP("DecisionListModel", "Total"),
           QT_TRANSLATE_NOOP("DecisionListModel", "Proof")]
DecisionIdRole = Qt.ItemDataRole.UserRole + 1

FILTER_FIELDS = {"job": QT_TRANSLATE_NOOP("HistoryPanel", "Job"),
                 "machine": QT_TRANSLATE_NOOP("HistoryPanel", "Machine"),
                 "by": QT_TRANSLATE_NOOP("HistoryPanel", "Supervisor")}


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
            return self.tr(HEADERS[section])
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
                COL_TIME: when_text(d.time.replace(tzinfo=d.time.tzinfo or timezone.utc).astimezone()
                                    .replace(tzinfo=None)),
                COL_SHIFT: f"{when_text(d.shift_date)} {d.shift}",
                COL_BY: d.by,
                COL_REASON: reason_text(d.reason),
                COL_NOTE: d.note,
                COL_TOTAL: fmt(d.total),
                COL_PROOF: self.tr("\u2713 checked") if d.certificate == "verified" else d.certificate,
            }[col]
        if role == Qt.ItemDataRole.ToolTipRole:
            if col == COL_TOTAL:
                return self.tr("Total of decision #{number} ({objective}); replaces #{replaces}").format(
                    number=d.id, objective=d.objective, replaces=d.replaces or "-")
            if col == COL_ID:
                return (self.tr("Decision #{number}, restored from #{restored}") if d.restored_from else
                        self.tr("Decision #{number}")).format(number=d.id, restored=d.restored_from)
            if col == COL_TIME:
                return self.tr("Recorded at {time} UTC").format(time=f"{d.time:%Y-%m-%d %H:%M:%S}")
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
            self.field.addItem(self.tr(label), key)
        self.field.setAccessibleName(self.tr("Filter by"))
        self.field.setAccessibleDescription(self.tr("Which name the filter text looks for"))
        self.text = QLineEdit()
        self.text.setPlaceholderText(self.tr("name to look for (exact), empty = all"))
        self.text.setClearButtonEnabled(True)
        self.text.setAccessibleName(self.tr("Filter text"))
        self.text.setAccessibleDescription(self.tr("name to look for (exact), empty = all"))
        self.reason = QComboBox()
        self.reason.addItem(self.tr("any reason"), None)
        for key in REASON_KINDS:
            self.reason.addItem(reason_text(key), key)
        self.reason.setAccessibleName(self.tr("Reason filter"))
        self.reason.setAccessibleDescription(self.tr("Show only decisions with this kind of reason"))
        self.refresh_button = QPushButton(self.tr("Refresh"))
        self.refresh_button.setAccessibleName(self.tr("Refresh"))
        self.refresh_button.setAccessibleDescription(self.tr("Read the decisions again with these filters"))
        filter_label = QLabel(self.tr("Filter:"))
        filter_label.setBuddy(self.field)
        filters.addWidget(filter_label)
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
        self.table.setAccessibleName(self.tr("Recorded decisions"))
        self.table.setAccessibleDescription(self.tr("Newest first; select one to see its plan, two to compare them"))
        self.details = QPlainTextEdit()
        self.details.setObjectName("historyDetails")
        self.details.setReadOnly(True)
        self.details.setPlaceholderText(self.tr("Select one decision to see its plan, or two to compare them."))
        self.details.setAccessibleName(self.tr("Decision details"))
        self.details.setAccessibleDescription(self.tr("The plan of the selected decision, or the changes between two"))
        split = QSplitter(Qt.Orientation.Horizontal)
        split.addWidget(self.table)
        split.addWidget(self.details)
        split.setSizes([650, 350])
        layout.addWidget(split, 1)
        buttons = QHBoxLayout()
        self.where = QLabel()
        self.where.setObjectName("historyFile")
        self.where.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.where.setToolTip(self.tr("The history file these decisions come from (Edit \u25b8 Settings to change it)"))
        self.where.setAccessibleName(self.tr("History file"))
        self.where.setAccessibleDescription(self.where.toolTip())
        buttons.addWidget(self.where, 1)
        self.compare_button = QPushButton(self.tr("&Compare two"))
        self.compare_button.setToolTip(self.tr("Select two decisions (Ctrl+click) and compare their plans"))
        self.compare_button.setAccessibleName(self.tr("Compare two"))
        self.compare_button.setAccessibleDescription(self.compare_button.toolTip())
        self.restore_button = QPushButton(self.tr("Re&store\u2026"))
        self.restore_button.setToolTip(self.tr("Record a new decision that puts this one's plan back in force"))
        self.restore_button.setAccessibleName(self.tr("Restore"))
        self.restore_button.setAccessibleDescription(self.restore_button.toolTip())
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
        self.where.setText(self.tr("File: {path}").format(path=self.store.path))
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
        lines = [self.tr("Decision #{number} - {reason} by {supervisor}").format(
                     number=d.id, reason=reason_text(d.reason), supervisor=d.by),
                 f"{d.note}" if d.note else "",
                 self.tr("Total: {total} ({objective})").format(total=fmt(plan.get("total")),
                                                                objective=plan.get("objective")), ""]
        for a in plan.get("running", []):
            lines.append(self.tr("\u25b6 {machine}: {job} (running)").format(machine=a["machine"], job=a["job"]))
        for a in plan.get("assignments", []):
            lines.append(f"\u2713 {a['machine']}: {a['job']}  {fmt(a['cost'])}")
        if plan.get("waiting_jobs"):
            lines.append(self.tr("Waiting: {jobs}").format(jobs=", ".join(plan["waiting_jobs"])))
        if plan.get("idle_machines"):
            lines.append(self.tr("Idle: {machines}").format(machines=", ".join(plan["idle_machines"])))
        if d.diff_from_replaced is not None:
            lines += ["", self.tr("Changes from #{number}:").format(number=d.diff_from_replaced.from_id)]
            lines += ["  " + x for x in d.diff_from_replaced.lines()]
        self.details.setPlainText("\n".join(x for x in lines))

    def compare_selected(self) -> None:
        ids = self.selected_ids()
        if len(ids) != 2:
            self.message.emit(self.tr("select exactly two decisions to compare"))
            return
        a, b = sorted(ids)
        try:
            diff = self.store.diff(a, b)
        except HistoryError as exc:
            self.details.setPlainText(str(exc))
            return
        self.details.setPlainText(self.tr("From decision #{first} to #{second}:").format(first=a, second=b)
                                  + "\n" + "\n".join(diff.lines()))

    def _restore_selected(self) -> None:
        ids = self.selected_ids()
        if len(ids) != 1:
            self.message.emit(self.tr("select one decision to restore"))
            return
        self.restore_requested.emit(ids[0])
