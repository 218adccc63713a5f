"""The what-if map: for every job and machine, how much worse the plan gets if that job
is forced onto that machine. A light-to-dark single-hue ramp (readable in grayscale)
plus the number itself; the plan's own cells carry a check mark; impossible pairs a dash.
Hovering a cell explains it: its value, the plan's choice for that job, the best other
machine and the extra cost."""

from __future__ import annotations

import math

from PySide6.QtCore import QAbstractTableModel, QModelIndex, QPersistentModelIndex, Qt
from PySide6.QtWidgets import QLabel, QTableView, QVBoxLayout, QWidget

from dispatcher.shop import UP, Shop
from dispatcher.ui import palette
from dispatcher.ui.format import fmt, unit_text
from dispatcher.shop.whatif import WhatIfGrid

ExtraRole = Qt.ItemDataRole.UserRole + 11


class WhatIfModel(QAbstractTableModel):
    """Jobs x machines of extra costs (read-only)."""

    def __init__(self, parent=None):
        super().__init__(parent)
        self.shop: Shop | None = None
        self.grid: WhatIfGrid | None = None
        self.unit = ""

    def set_grid(self, shop: Shop | None, grid: WhatIfGrid | None, unit: str = "") -> None:
        self.beginResetModel()
        self.shop, self.grid, self.unit = shop, grid, unit
        self.endResetModel()

    def rowCount(self, parent: QModelIndex | QPersistentModelIndex = QModelIndex()) -> int:
        return 0 if parent.isValid() or self.grid is None else self.grid.extra.shape[0]

    def columnCount(self, parent: QModelIndex | QPersistentModelIndex = QModelIndex()) -> int:
        return 0 if parent.isValid() or self.grid is None else self.grid.extra.shape[1]

    def headerData(self, section: int, orientation: Qt.Orientation, role: int = Qt.ItemDataRole.DisplayRole):
        if self.shop is None or role not in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.ToolTipRole):
            return None
        if orientation == Qt.Orientation.Horizontal:
            m = self.shop.machines[section]
            if m.state == UP:
                return m.name
            state = {"down": self.tr("down"), "maintenance": self.tr("maintenance")}.get(m.state, m.state)
            return f"{m.name}\n{palette.MARK_DOWN} {state}"
        return self.shop.jobs[section].name

    def _word(self) -> str:
        return self.tr("less value") if self.grid and self.grid.objective == "maximize" else self.tr("more")

    def data(self, index: QModelIndex | QPersistentModelIndex, role: int = Qt.ItemDataRole.DisplayRole):
        if not index.isValid() or self.grid is None or self.shop is None:
            return None
        g, i, k = self.grid, index.row(), index.column()
        x = float(g.extra[i, k])
        if role == ExtraRole:
            return None if math.isnan(x) else x
        planned = g.planned[i] == k
        if role == Qt.ItemDataRole.DisplayRole:
            if not g.in_problem[i]:
                return "\u00b7"
            if planned:
                return f"{palette.MARK_PLANNED} 0"
            return palette.MARK_CANNOT if math.isnan(x) else f"+{fmt(x, 2)}"
        if role == Qt.ItemDataRole.TextAlignmentRole:
            return int(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
        if role == Qt.ItemDataRole.BackgroundRole:
            if not g.in_problem[i] or math.isnan(x):
                return palette.colour("cannot", 22)
            top = g.largest or 1.0
            return palette.heat_colour(x / top)
        if role == Qt.ItemDataRole.ForegroundRole:
            if g.in_problem[i] and not math.isnan(x):
                return palette.text_on(palette.heat_colour(x / (g.largest or 1.0)))
            return None
        if role == Qt.ItemDataRole.ToolTipRole:
            return self.tooltip(i, k)
        return None

    def tooltip(self, i: int, k: int) -> str:
        """The explanation of one cell, as shown on hover."""
        g, shop = self.grid, self.shop
        job, machine = shop.jobs[i], shop.machines[k]
        value = shop.value(job.id, machine.id)
        names = {"job": job.name, "machine": machine.name}
        lines = [self.tr("{job} on {machine}: value - (cannot run)").format(**names) if value is None else
                 self.tr("{job} on {machine}: value {value} {unit}").format(
                     value=fmt(value), unit=unit_text(self.unit), **names)]
        if not g.in_problem[i]:
            lines.append(self.tr("{job} is {state}: it is not dispatched this round").format(
                job=job.name, state={"running": self.tr("running"), "done": self.tr("done")}.get(job.state,
                                                                                                  job.state)))
            return "\n".join(lines)
        p = int(g.planned[i])
        if p >= 0:
            pv = shop.value(job.id, shop.machines[p].id)
            lines.append(self.tr("The plan puts {job} on {machine} (value {value})").format(
                job=job.name, machine=shop.machines[p].name, value=fmt(pv)))
        else:
            lines.append(self.tr("The plan leaves {job} waiting").format(job=job.name))
        b = int(g.best_other[i])
        if b >= 0:
            lines.append(self.tr("Best other machine: {machine} (+{extra} {more} in total)").format(
                machine=shop.machines[b].name, extra=fmt(g.best_other_extra[i], 2), more=self._word()))
        else:
            lines.append(self.tr("No other machine can take it in any plan"))
        x = float(g.extra[i, k])
        if p == k:
            lines.append(self.tr("This is the plan's choice: extra cost 0"))
        elif math.isnan(x):
            lines.append(self.tr("Forcing this pair is impossible: no plan placing as many jobs contains it"))
        else:
            lines.append(self.tr("Forcing this pair: +{extra} {more} in total than the plan").format(
                extra=fmt(x, 2), more=self._word()))
        if not math.isnan(float(g.wait_extra[i])) and p >= 0:
            lines.append(self.tr("Keeping it waiting instead: +{extra}").format(extra=fmt(g.wait_extra[i], 2)))
        return "\n".join(lines)


class WhatIfView(QWidget):
    """The map and a one-line explanation of what it shows."""

    def __init__(self, parent: QWidget | None = None):
        super().__init__(parent)
        self.setObjectName("whatIfView")
        layout = QVBoxLayout(self)
        self.caption = QLabel(self.tr(
            "Extra cost against the plan shown if a job is forced onto a machine. {planned} = the plan's "
            "choice (0); darker = dearer; {cannot} = impossible; {idle} = running or done. Hover a cell "
            "for details.").format(planned=palette.MARK_PLANNED, cannot=palette.MARK_CANNOT, idle="\u00b7"))
        self.caption.setWordWrap(True)
        self.caption.setAccessibleName(self.tr("What the map shows"))
        self.caption.setAccessibleDescription(self.caption.text())
        self.status = QLabel("")
        self.status.setObjectName("whatIfStatus")
        self.status.setAccessibleName(self.tr("What-if status"))
        self.status.setAccessibleDescription(self.tr("The dearest forced pair, or why the map is empty"))
        self.model = WhatIfModel(self)
        self.table = QTableView()
        self.table.setObjectName("whatIfTable")
        self.table.setModel(self.model)
        self.table.setAccessibleName(self.tr("What-if map"))
        self.table.setAccessibleDescription(self.tr(
            "Jobs as rows, machines as columns: the extra cost if the job is forced onto the machine"))
        self.table.horizontalHeader().setDefaultSectionSize(84)
        self.table.verticalHeader().setDefaultSectionSize(22)
        layout.addWidget(self.caption)
        layout.addWidget(self.status)
        layout.addWidget(self.table, 1)

    def show_grid(self, shop: Shop, grid: WhatIfGrid, unit: str) -> None:
        self.model.set_grid(shop, grid, unit)
        # each machine column as wide as its name needs (never narrower than the default)
        header = self.table.horizontalHeader()
        for k in range(min(self.model.columnCount(), 400)):
            header.resizeSection(k, max(header.defaultSectionSize(),
                                        min(header.sectionSizeFromContents(k).width(), 220)))
        self.status.setText(self.tr("Largest extra: {extra} {unit}").format(extra=fmt(grid.largest, 2),
                                                                            unit=unit_text(unit)))
        self.status.setToolTip(self.tr("The dearest single forced pair, against the plan shown"))

    def show_message(self, text: str) -> None:
        self.model.set_grid(None, None)
        self.status.setText(text)
