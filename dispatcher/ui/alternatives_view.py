"""Alternatives: the k best plans side by side with what each changes against the best;
pick one and put it in force (through the usual confirm-and-record dialog)."""

from __future__ import annotations

from PySide6.QtCore import Qt, Signal
from PySide6.QtWidgets import (
    QHBoxLayout,
    QLabel,
    QListWidget,
    QListWidgetItem,
    QPlainTextEdit,
    QPushButton,
    QSpinBox,
    QSplitter,
    QVBoxLayout,
    QWidget,
)

from dispatcher.history import diff_plans
from dispatcher.shop import Plan
from dispatcher.ui.format import fmt


class AlternativesView(QWidget):
    """``find_requested(k)``; ``put_in_force(plan, rank)``."""

    find_requested = Signal(int)
    put_in_force = Signal(object, int)

    def __init__(self, parent: QWidget | None = None):
        super().__init__(parent)
        self.setObjectName("alternativesView")
        self.plans: list[Plan] = []
        layout = QVBoxLayout(self)
        row = QHBoxLayout()
        row.addWidget(QLabel("How many plans:"))
        self.count = QSpinBox()
        self.count.setRange(2, 50)
        self.count.setValue(5)
        self.count.setToolTip("The best plans to list, best first")
        self.find = QPushButton("&Find best plans")
        row.addWidget(self.count)
        row.addWidget(self.find)
        row.addStretch(1)
        layout.addLayout(row)
        self.status = QLabel("")
        layout.addWidget(self.status)
        split = QSplitter(Qt.Orientation.Horizontal)
        self.list = QListWidget()
        self.list.setObjectName("alternativesList")
        self.details = QPlainTextEdit()
        self.details.setReadOnly(True)
        split.addWidget(self.list)
        split.addWidget(self.details)
        split.setSizes([380, 500])
        layout.addWidget(split, 1)
        buttons = QHBoxLayout()
        buttons.addStretch(1)
        self.use = QPushButton("&Put this plan in force\u2026")
        self.use.setEnabled(False)
        buttons.addWidget(self.use)
        layout.addLayout(buttons)
        self.find.clicked.connect(lambda: self.find_requested.emit(self.count.value()))
        self.list.currentRowChanged.connect(self._show)
        self.use.clicked.connect(self._use)

    def show_message(self, text: str) -> None:
        self.status.setText(text)

    def show_plans(self, plans: list[Plan], unit: str) -> None:
        self.plans = plans
        self.list.clear()
        if not plans:
            self.status.setText("No plan to rank")
            return
        best = plans[0]
        word = "less value" if best.objective == "maximize" else "more"
        for rank, p in enumerate(plans, 1):
            gap = abs(p.total - best.total)
            text = (f"#{rank}  total {fmt(p.total)} {unit}" +
                    ("  (best)" if rank == 1 else f"  (+{fmt(gap)} {word})"))
            item = QListWidgetItem(text)
            item.setToolTip(f"Plan #{rank}: total {fmt(p.total)} {unit}; "
                            + ("the optimal plan" if rank == 1 else f"{fmt(gap)} {word} than the best"))
            self.list.addItem(item)
        if len(plans) < self.count.value():
            self.status.setText(f"{len(plans)} distinct plans found near the best (machines that "
                                "take several jobs repeat the same plan in other slots), best first")
        else:
            self.status.setText(f"{len(plans)} best plans, best first")
        self.list.setCurrentRow(0)

    def _show(self, row: int) -> None:
        self.use.setEnabled(row >= 0)
        if row < 0 or row >= len(self.plans):
            self.details.clear()
            return
        p = self.plans[row]
        lines = [f"Plan #{row + 1}: total {fmt(p.total)}", ""]
        lines += [f"{a.machine}: {a.job}  {fmt(a.cost)}" for a in p.assignments]
        if p.waiting_jobs:
            lines.append("Waiting: " + ", ".join(p.waiting_jobs))
        if row > 0:
            diff = diff_plans(self.plans[0].to_json(), p.to_json())
            lines += ["", "Against the best plan:"] + ["  " + x for x in diff.lines()]
        self.details.setPlainText("\n".join(lines))

    def _use(self) -> None:
        row = self.list.currentRow()
        if 0 <= row < len(self.plans):
            self.put_in_force.emit(self.plans[row], row + 1)
