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
from dispatcher.ui.format import fmt, unit_text


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
        count_label = QLabel(self.tr("How man&y plans:"))
        row.addWidget(count_label)
        self.count = QSpinBox()
        self.count.setRange(2, 50)
        self.count.setValue(5)
        self.count.setToolTip(self.tr("The best plans to list, best first"))
        self.count.setAccessibleName(self.tr("How many plans"))
        self.count.setAccessibleDescription(self.count.toolTip())
        count_label.setBuddy(self.count)
        self.find = QPushButton(self.tr("Find best pla&ns"))
        self.find.setAccessibleName(self.tr("Find best plans"))
        self.find.setAccessibleDescription(self.tr("Rank the best plans of the shop as it is now"))
        row.addWidget(self.count)
        row.addWidget(self.find)
        row.addStretch(1)
        layout.addLayout(row)
        self.status = QLabel("")
        self.status.setAccessibleName(self.tr("Ranking status"))
        self.status.setAccessibleDescription(self.tr("How many plans were found, or why none"))
        layout.addWidget(self.status)
        split = QSplitter(Qt.Orientation.Horizontal)
        self.list = QListWidget()
        self.list.setObjectName("alternativesList")
        self.list.setAccessibleName(self.tr("Ranked plans"))
        self.list.setAccessibleDescription(self.tr("The best plans, best first, with their gap to the best"))
        self.details = QPlainTextEdit()
        self.details.setReadOnly(True)
        self.details.setAccessibleName(self.tr("Plan details"))
        self.details.setAccessibleDescription(self.tr("The selected plan and what it changes against the best"))
        split.addWidget(self.list)
        split.addWidget(self.details)
        split.setSizes([380, 500])
        layout.addWidget(split, 1)
        buttons = QHBoxLayout()
        buttons.addStretch(1)
        self.use = QPushButton(self.tr("Put this plan &in force\u2026"))
        self.use.setEnabled(False)
        self.use.setAccessibleName(self.tr("Put this plan in force"))
        self.use.setAccessibleDescription(self.tr("Confirm and record the selected plan as the decision in force"))
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
            self.status.setText(self.tr("No plan to rank"))
            return
        best = plans[0]
        word = self.tr("less value") if best.objective == "maximize" else self.tr("more")
        unit = unit_text(unit)
        for rank, p in enumerate(plans, 1):
            gap = abs(p.total - best.total)
            names = {"rank": rank, "total": fmt(p.total), "unit": unit, "gap": fmt(gap), "more": word}
            text = (self.tr("#{rank}  total {total} {unit}  (best)") if rank == 1 else
                    self.tr("#{rank}  total {total} {unit}  (+{gap} {more})")).format(**names)
            item = QListWidgetItem(text)
            item.setToolTip((self.tr("Plan #{rank}: total {total} {unit}; the optimal plan") if rank == 1 else
                             self.tr("Plan #{rank}: total {total} {unit}; {gap} {more} than the best")).format(**names))
            self.list.addItem(item)
        if len(plans) < self.count.value():
            self.status.setText(self.tr("%n distinct plan(s) found near the best (machines that take several "
                                        "jobs repeat the same plan in other slots), best first", "", len(plans)))
        else:
            self.status.setText(self.tr("%n best plan(s), best first", "", len(plans)))
        self.list.setCurrentRow(0)

    def _show(self, row: int) -> None:
        self.use.setEnabled(row >= 0)
        if row < 0 or row >= len(self.plans):
            self.details.clear()
            return
        p = self.plans[row]
        lines = [self.tr("Plan #{rank}: total {total}").format(rank=row + 1, total=fmt(p.total)), ""]
        lines += [f"{a.machine}: {a.job}  {fmt(a.cost)}" for a in p.assignments]
        if p.waiting_jobs:
            lines.append(self.tr("Waiting: {jobs}").format(jobs=", ".join(p.waiting_jobs)))
        if row > 0:
            diff = diff_plans(self.plans[0].to_json(), p.to_json())
            lines += ["", self.tr("Against the best plan:")] + ["  " + x for x in diff.lines()]
        self.details.setPlainText("\n".join(lines))

    def _use(self) -> None:
        row = self.list.currentRow()
        if 0 <= row < len(self.plans):
            self.put_in_force.emit(self.plans[row], row + 1)
