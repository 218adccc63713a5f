"""The whole-shift plan as a timeline: one lane per machine, a bar per job on the shift's
hour axis, changeovers drawn hatched (a pattern as well as a colour) before each job.

:class:`TimelineView` paints the lanes of :func:`dispatcher.shop.timeline.shift_timeline`
itself (a custom-painted widget: a few hundred bars need no scene graph). Hover a bar, or
step through the bars with the arrow keys, for the job, its family, start and end and the
changeover before it. :class:`TimelineTab` is the main window's part holding it.
"""

from __future__ import annotations

import datetime as dt

from PySide6.QtCore import QObject, QPointF, QRectF, QSize, Qt, Signal
from PySide6.QtGui import QBrush, QColor, QFontMetrics, QPainter, QPen
from PySide6.QtWidgets import QLabel, QScrollArea, QToolTip, QVBoxLayout, QWidget

from dispatcher.shop.fill_shift import ShiftFill
from dispatcher.shop.timeline import CHANGE, END_CHANGE, JOB, RUNNING, Bar, Lane, shift_timeline
from dispatcher.ui import palette
from dispatcher.ui.format import fmt, unit_text

NAME_WIDTH = 150
AXIS_HEIGHT = 26
LANE_HEIGHT = 34
BAR_MARGIN = 5
MIN_MARK = 6  # pixels: a changeover that takes no time is drawn this wide at the job's start

#: Fill colour and pattern of each kind of bar (never colour alone).
STYLE = {
    RUNNING: ("started", Qt.BrushStyle.Dense4Pattern),
    JOB: ("planned", Qt.BrushStyle.SolidPattern),
    CHANGE: ("orange", Qt.BrushStyle.BDiagPattern),
    END_CHANGE: ("reddish_purple", Qt.BrushStyle.DiagCrossPattern),
}


class TimelineView(QWidget):
    """Custom-painted lanes; ``current_changed(str)`` with the description of the bar the
    keyboard stepped to."""

    current_changed = Signal(str)

    def __init__(self, parent: QWidget | None = None):
        super().__init__(parent)
        self.setObjectName("shiftTimeline")
        self.setMouseTracking(True)
        self.setFocusPolicy(Qt.FocusPolicy.StrongFocus)
        self.setAccessibleName(self.tr("Shift timeline"))
        self.setAccessibleDescription(
            self.tr(
                "One lane per machine; a bar per job on the shift's hours, "
                "changeovers hatched; arrow keys step through the bars"
            )
        )
        self._lanes: list[Lane] = []
        self._hours = 8.0
        self._start: dt.time | None = None
        self._unit = ""
        self._current: tuple[int, int] | None = None

    # ---- content --------------------------------------------------------------------------
    def set_lanes(self, lanes: list[Lane], shift_hours: float, start: dt.time | None, unit: str) -> None:
        self._lanes = lanes
        longest = max([shift_hours, *(lane.capacity for lane in lanes), *(lane.used() for lane in lanes)])
        self._hours = max(longest, 1.0)
        self._start, self._unit = start, unit
        self._current = None
        self.updateGeometry()
        self.update()

    def lanes(self) -> list[Lane]:
        return list(self._lanes)

    def sizeHint(self) -> QSize:
        return QSize(NAME_WIDTH + 720, AXIS_HEIGHT + LANE_HEIGHT * max(len(self._lanes), 1) + 8)

    def minimumSizeHint(self) -> QSize:
        return QSize(NAME_WIDTH + 240, AXIS_HEIGHT + LANE_HEIGHT * max(len(self._lanes), 1) + 8)

    # ---- geometry -------------------------------------------------------------------------
    def _scale(self) -> float:
        return max(self.width() - NAME_WIDTH - 36, 60) / self._hours

    def _x(self, hour: float) -> float:
        return NAME_WIDTH + hour * self._scale()

    def bar_rect(self, lane: int, index: int) -> QRectF:
        """Where bar ``index`` of lane ``lane`` is drawn (widget coordinates)."""
        bar = self._lanes[lane].bars[index]
        top = AXIS_HEIGHT + lane * LANE_HEIGHT + BAR_MARGIN
        left, right = self._x(bar.start), self._x(bar.end)
        if bar.kind in (CHANGE, END_CHANGE) and right - left < MIN_MARK:
            right = left + MIN_MARK
            if bar.kind == CHANGE:  # a change that takes no time: a mark just before the job
                left, right = left - MIN_MARK / 2, left + MIN_MARK / 2
        return QRectF(left, top, max(right - left, 1.0), LANE_HEIGHT - 2 * BAR_MARGIN)

    def bar_at(self, pos: QPointF) -> tuple[int, int] | None:
        """``(lane, bar)`` under a point; changeovers win over the job they precede."""
        lane = int((pos.y() - AXIS_HEIGHT) // LANE_HEIGHT)
        if pos.y() < AXIS_HEIGHT or not 0 <= lane < len(self._lanes):
            return None
        hits = [i for i in range(len(self._lanes[lane].bars)) if self.bar_rect(lane, i).contains(pos)]
        if not hits:
            return None
        changes = [i for i in hits if self._lanes[lane].bars[i].kind in (CHANGE, END_CHANGE)]
        return lane, (changes or hits)[0]

    # ---- words ----------------------------------------------------------------------------
    def _clock(self, hour: float) -> str:
        if self._start is None:
            return self.tr("{hours} h").format(hours=fmt(round(hour, 2)))
        base = dt.datetime.combine(dt.date(2000, 1, 1), self._start)
        return (base + dt.timedelta(hours=hour)).strftime("%H:%M")

    def describe(self, lane: int, index: int) -> str:
        """The tooltip of a bar: job, family, start and end, and the changeover."""
        machine = self._lanes[lane].machine
        bar = self._lanes[lane].bars[index]
        family = bar.family if bar.family is not None else self.tr("no family")
        span = self.tr("{start} to {end}").format(start=self._clock(bar.start), end=self._clock(bar.end))
        if bar.kind == RUNNING:
            return self.tr("{machine}: {job} already running ({family}), until {end}").format(
                machine=machine, job=bar.job, family=family, end=self._clock(bar.end)
            )
        if bar.kind == END_CHANGE:
            return self.tr("{machine}: change from {a} to the end family {b}: {value} {unit}, {span}").format(
                machine=machine,
                a=bar.from_family or self.tr("nothing mounted"),
                b=bar.family,
                value=fmt(bar.changeover),
                unit=self._unit,
                span=span,
            )
        change = (
            self.tr("change from {a} to {b}: {value} {unit}").format(
                a=bar.from_family or self.tr("nothing mounted"), b=family, value=fmt(bar.changeover), unit=self._unit
            )
            if bar.changeover is not None
            else self.tr("no changeover priced")
        )
        if bar.kind == CHANGE:
            return self.tr("{machine}: before {job}, {change} ({span})").format(
                machine=machine, job=bar.job, change=change, span=span
            )
        return self.tr("{machine}: {job}, family {family}, {span}; {change}").format(
            machine=machine, job=bar.job, family=family, span=span, change=change
        )

    # ---- events ---------------------------------------------------------------------------
    def event(self, event) -> bool:
        if event.type() == event.Type.ToolTip:
            hit = self.bar_at(QPointF(event.pos()))
            if hit is None:
                QToolTip.hideText()
                event.ignore()
            else:
                QToolTip.showText(event.globalPos(), self.describe(*hit), self)
            return True
        return super().event(event)

    def _flat(self) -> list[tuple[int, int]]:
        return [(k, i) for k, lane in enumerate(self._lanes) for i in range(len(lane.bars))]

    def keyPressEvent(self, event) -> None:
        flat = self._flat()
        step = {Qt.Key.Key_Right: 1, Qt.Key.Key_Left: -1, Qt.Key.Key_Down: 1, Qt.Key.Key_Up: -1}.get(event.key())
        if step is None or not flat:
            super().keyPressEvent(event)
            return
        if event.key() in (Qt.Key.Key_Down, Qt.Key.Key_Up) and self._current is not None:
            lane = min(max(self._current[0] + step, 0), len(self._lanes) - 1)
            while not self._lanes[lane].bars and 0 < lane < len(self._lanes) - 1:
                lane += step
            target = (lane, 0) if self._lanes[lane].bars else self._current
        else:
            at = flat.index(self._current) if self._current in flat else -1
            target = flat[min(max(at + step, 0), len(flat) - 1)]
        self.set_current(*target)

    def set_current(self, lane: int, index: int) -> None:
        self._current = (lane, index)
        text = self.describe(lane, index)
        self.setAccessibleDescription(text)
        self.update()
        self.current_changed.emit(text)

    def current(self) -> tuple[int, int] | None:
        return self._current

    # ---- painting -------------------------------------------------------------------------
    def paintEvent(self, event) -> None:
        p = QPainter(self)
        p.setRenderHint(QPainter.RenderHint.Antialiasing, False)
        pal = self.palette()
        p.fillRect(self.rect(), pal.base())
        metrics = QFontMetrics(self.font())
        text_pen = QPen(pal.text().color())
        grid_pen = QPen(pal.mid().color())
        # hour axis
        step = 1.0 if self._hours <= 16 else 2.0
        hour = 0.0
        while hour <= self._hours + 1e-9:
            x = self._x(hour)
            p.setPen(grid_pen)
            p.drawLine(QPointF(x, AXIS_HEIGHT - 4), QPointF(x, self.height()))
            p.setPen(text_pen)
            p.drawText(QRectF(x - 30, 2, 60, AXIS_HEIGHT - 6), Qt.AlignmentFlag.AlignCenter, self._clock(hour))
            hour += step
        for k, lane in enumerate(self._lanes):
            top = AXIS_HEIGHT + k * LANE_HEIGHT
            if k % 2:
                p.fillRect(QRectF(0, top, self.width(), LANE_HEIGHT), pal.alternateBase())
            p.setPen(text_pen)
            name = metrics.elidedText(lane.machine, Qt.TextElideMode.ElideRight, NAME_WIDTH - 8)
            p.drawText(
                QRectF(4, top, NAME_WIDTH - 8, LANE_HEIGHT),
                Qt.AlignmentFlag.AlignVCenter | Qt.AlignmentFlag.AlignLeft,
                name,
            )
            # past the machine's hours: greyed, with a dashed limit line
            limit = self._x(lane.capacity)
            p.fillRect(
                QRectF(limit, top + 1, max(self.width() - limit, 0), LANE_HEIGHT - 2),
                QBrush(palette.colour("cannot", 22)),
            )
            p.setPen(QPen(palette.colour("down"), 1.5, Qt.PenStyle.DashLine))
            p.drawLine(QPointF(limit, top + 2), QPointF(limit, top + LANE_HEIGHT - 2))
            # jobs first, changeovers over them
            order = sorted(range(len(lane.bars)), key=lambda i: lane.bars[i].kind in (CHANGE, END_CHANGE))
            for i in order:
                self._paint_bar(p, metrics, k, i, lane.bars[i])
        if self._current is not None:
            p.setPen(QPen(pal.highlight().color(), 2.5))
            p.setBrush(Qt.BrushStyle.NoBrush)
            p.drawRect(self.bar_rect(*self._current).adjusted(-2, -2, 2, 2))
        p.end()

    def _paint_bar(self, p: QPainter, metrics: QFontMetrics, lane: int, index: int, bar: Bar) -> None:
        rect = self.bar_rect(lane, index)
        role, pattern = STYLE[bar.kind]
        colour = palette.colour(role)
        p.setPen(QPen(QColor("#000000"), 1))
        p.setBrush(QBrush(colour.lighter(150) if pattern != Qt.BrushStyle.SolidPattern else colour))
        p.drawRect(rect)
        if pattern != Qt.BrushStyle.SolidPattern:
            p.setBrush(QBrush(QColor("#000000"), pattern))
            p.drawRect(rect)
        if bar.kind in (JOB, RUNNING) and rect.width() > 24:
            text = (f"\u25b6 {bar.job}" if bar.kind == RUNNING else bar.job) or ""
            p.setPen(QPen(palette.text_on(colour)))
            inner = rect.adjusted(4, 0, -3, 0)
            p.drawText(
                inner,
                Qt.AlignmentFlag.AlignVCenter | Qt.AlignmentFlag.AlignLeft,
                metrics.elidedText(text, Qt.TextElideMode.ElideRight, int(inner.width())),
            )


class TimelineTab(QObject):
    """The Timeline tab: ``view`` (the tab's widget), ``timeline`` and a note line."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.view = QWidget(window)
        self.view.setObjectName("timelineTab")
        self.view.setAccessibleName(self.tr("Timeline"))
        self.view.setAccessibleDescription(self.tr("The whole-shift plan drawn per machine on the shift's hours"))
        self.note = QLabel(self.view)
        self.note.setWordWrap(True)
        self.legend = QLabel(
            self.tr(
                "Solid: a planned job   dotted: already running   hatched: changeover "
                "before the job   cross-hatched: change into the end family   dashed "
                "line: end of the machine's hours"
            ),
            self.view,
        )
        self.legend.setWordWrap(True)
        self.timeline = TimelineView()
        self.timeline.current_changed.connect(lambda t: window.statusBar().showMessage(t, 8000))
        scroll = QScrollArea(self.view)
        scroll.setWidgetResizable(True)
        scroll.setWidget(self.timeline)
        layout = QVBoxLayout(self.view)
        layout.addWidget(self.note)
        layout.addWidget(scroll, 1)
        layout.addWidget(self.legend)
        window.plan_shown.connect(self.show_plan)
        self.show_plan(None)

    def show_plan(self, plan) -> None:
        shop = self.window.doc.shop
        if not isinstance(plan, ShiftFill):
            self.timeline.set_lanes([], shop.shift.hours, shop.shift.start, unit_text(shop.unit.label()))
            self.note.setText(self.tr("The timeline shows whole-shift plans: choose Plan > Whole shift (Ctrl+5)."))
            return
        lanes = shift_timeline(shop, plan)
        self.timeline.set_lanes(lanes, shop.shift.hours, shop.shift.start, unit_text(shop.unit.label()))
        gap = (
            self.tr("proven optimal")
            if plan.proven_optimal
            else self.tr("gap at most {gap} % (proven lower bound {bound})").format(
                gap=fmt(round(100 * plan.gap, 1)), bound=fmt(plan.bound)
            )
        )
        self.note.setText(
            self.tr("Whole-shift plan: total {total} {unit}, {gap}.").format(
                total=fmt(plan.total), unit=unit_text(shop.unit.label()), gap=gap
            )
        )
