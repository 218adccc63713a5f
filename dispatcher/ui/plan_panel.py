"""The plan panel: per machine its job and value, waiting jobs with reasons, idle machines,
the total, the objective (switchable) and whether the optimality certificate checked out."""

from __future__ import annotations

from PySide6.QtCore import QT_TRANSLATE_NOOP, QEvent, Qt, Signal
from PySide6.QtWidgets import (
    QComboBox,
    QFormLayout,
    QHeaderView,
    QHBoxLayout,
    QLabel,
    QPushButton,
    QProgressBar,
    QTreeWidget,
    QTreeWidgetItem,
    QVBoxLayout,
    QWidget,
)

from dispatcher.shop.staffed import operators_by_machine
from dispatcher.shop import Plan
from dispatcher.shop.fill_shift import ShiftFill
from dispatcher.ui import palette
from dispatcher.ui.format import fmt, unit_text, waiting_text
from dispatcher.shop.plan import parts_word, total_parts
from dispatcher.shop.planning import MODE_ROUND, MODE_SHIFT
from dispatcher.ui.solving import machine_entries, shift_hours

#: Waiting jobs listed one by one in the panel; the rest are counted (the grid shows all).
MAX_LISTED = 150

OBJECTIVE_LABELS = {
    "total": QT_TRANSLATE_NOOP("PlanPanel", "Least total (setup + wait penalties)"),
    "maximize": QT_TRANSLATE_NOOP("PlanPanel", "Most total value (values are gains)"),
    "bottleneck": QT_TRANSLATE_NOOP("PlanPanel", "Smallest largest single value, then least total"),
}
MODE_LABELS = {
    MODE_ROUND: QT_TRANSLATE_NOOP("PlanPanel", "One round: one job per free machine slot"),
    MODE_SHIFT: QT_TRANSLATE_NOOP("PlanPanel", "Whole shift: several jobs per machine within its hours"),
}


class PlanPanel(QWidget):
    """Shows one plan. Emits ``objective_changed(str)`` and ``cancel_requested()``."""

    objective_changed = Signal(str)
    mode_changed = Signal(str)
    cancel_requested = Signal()

    def __init__(self, parent: QWidget | None = None):
        super().__init__(parent)
        self.setObjectName("planPanel")
        layout = QVBoxLayout(self)
        form = QFormLayout()
        self.objective = QComboBox()
        for key, label in OBJECTIVE_LABELS.items():
            self.objective.addItem(self.tr(label), key)
        self.objective.setToolTip(self.tr("What the plan optimises; changing it re-solves at once"))
        self.objective.setAccessibleName(self.tr("Objective"))
        self.objective.setAccessibleDescription(self.tr("What the plan optimises; changing it re-solves at once"))
        self.objective.currentIndexChanged.connect(
            lambda _: self.objective_changed.emit(self.objective.currentData()))
        form.addRow(self.tr("O&bjective:"), self.objective)
        self.mode = QComboBox()
        for key, label in MODE_LABELS.items():
            self.mode.addItem(self.tr(label), key)
        self.mode.setToolTip(self.tr("Plan one dispatch round, or fill each machine's whole shift "
                                     "(needs run hours; may take longer, with progress and cancel)"))
        self.mode.setAccessibleName(self.tr("Planning mode"))
        self.mode.setAccessibleDescription(self.mode.toolTip())
        self.mode.currentIndexChanged.connect(lambda _: self.mode_changed.emit(self.mode.currentData()))
        form.addRow(self.tr("Mo&de:"), self.mode)
        self.total = QLabel("-")
        self.total.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        self.total.setAccessibleName(self.tr("Plan total"))
        self.total.setAccessibleDescription(self.tr("The plan's total and what it is made of"))
        form.addRow(self.tr("Total:"), self.total)
        self.counts = QLabel("-")
        self.counts.setAccessibleName(self.tr("Jobs placed"))
        self.counts.setAccessibleDescription(self.tr("Jobs dispatched, running and waiting"))
        form.addRow(self.tr("Placed:"), self.counts)
        self.proof = QLabel("-")
        self.proof.setAccessibleName(self.tr("Proof of optimality"))
        self.proof.setAccessibleDescription(self.tr("Whether the plan is proven the best"))
        form.addRow(self.tr("Proof:"), self.proof)
        layout.addLayout(form)

        status_row = QHBoxLayout()
        self.status = QLabel(self.tr("No plan yet"))
        self.status.setWordWrap(True)
        self.status.setObjectName("planStatus")
        self.status.setAccessibleName(self.tr("Plan status"))
        self.status.setAccessibleDescription(self.tr("Whether the plan shown is up to date, and why not"))
        self.progress = QProgressBar()
        self.progress.setRange(0, 0)
        self.progress.setMaximumWidth(90)
        self.progress.setVisible(False)
        self.progress.setToolTip(self.tr("Solving in the background; the grid stays editable"))
        self.progress.setAccessibleName(self.tr("Solving"))
        self.progress.setAccessibleDescription(self.progress.toolTip())
        self.cancel = QPushButton(self.tr("Cancel"))
        self.cancel.setToolTip(self.tr("Stop waiting for this solve (Esc)"))
        self.cancel.setAccessibleName(self.tr("Cancel solve"))
        self.cancel.setAccessibleDescription(self.cancel.toolTip())
        self.cancel.setVisible(False)
        self.cancel.clicked.connect(self.cancel_requested)
        status_row.addWidget(self.status, 1)
        status_row.addWidget(self.progress)
        status_row.addWidget(self.cancel)
        layout.addLayout(status_row)

        self.tree = QTreeWidget()
        self.tree.setColumnCount(3)
        self.tree.setHeaderLabels([self.tr("Machine"), self.tr("Job / why it waits"), self.tr("Value")])
        self.tree.setAccessibleName(self.tr("Plan by machine"))
        self.tree.setAccessibleDescription(self.tr(
            "Each machine's jobs, the waiting jobs with their reasons, the crew and idle machines"))
        self.tree.setRootIsDecorated(True)
        self.tree.setAlternatingRowColors(True)
        self.tree.setUniformRowHeights(True)
        head = self.tree.header()
        head.setStretchLastSection(False)
        head.setResizeContentsPrecision(80)   # size columns from a sample of rows (big plans)
        head.setSectionResizeMode(0, QHeaderView.ResizeMode.Interactive)
        head.setSectionResizeMode(1, QHeaderView.ResizeMode.Stretch)
        head.setSectionResizeMode(2, QHeaderView.ResizeMode.Interactive)
        layout.addWidget(self.tree, 1)
        self.tree.viewport().installEventFilter(self)  # a scroll bar or a narrower dock
        self._unit = ""

    # ---- state ----------------------------------------------------------------------------
    def set_mode(self, mode: str) -> None:
        i = self.mode.findData(mode)
        if i >= 0 and i != self.mode.currentIndex():
            self.mode.blockSignals(True)
            self.mode.setCurrentIndex(i)
            self.mode.blockSignals(False)

    def show_progress_text(self, text: str) -> None:
        self.status.setText(self.tr("Solving\u2026 {progress}").format(progress=text))

    def set_objective(self, objective: str) -> None:
        i = self.objective.findData(objective)
        if i >= 0 and i != self.objective.currentIndex():
            self.objective.blockSignals(True)
            self.objective.setCurrentIndex(i)
            self.objective.blockSignals(False)

    def show_busy(self, busy: bool, slow: bool = False) -> None:
        """busy: a solve is under way; slow: it has taken over half a second."""
        if busy:
            self.status.setText(self.tr("Solving\u2026"))
        self.progress.setVisible(busy and slow)
        self.cancel.setVisible(busy and slow)

    def show_problem(self, message: str) -> None:
        """The shop cannot be solved as it is: say why, keep the last plan visible but stale."""
        self.progress.setVisible(False)
        self.cancel.setVisible(False)
        short = message if len(message) <= 400 else message[:400] + self.tr("\u2026 (hover for all)")
        self.status.setText(self.tr("{mark} No plan: {why}").format(mark=palette.MARK_FORBIDDEN, why=short))
        self.status.setToolTip(message)

    def show_note(self, message: str) -> None:
        """A plan is shown, but with a caveat the supervisor must read (e.g. a rush job left out)."""
        self.status.setText(f"{palette.MARK_RUSH} {message}")
        self.status.setToolTip(message)

    def show_cancelled(self) -> None:
        self.progress.setVisible(False)
        self.cancel.setVisible(False)
        self.status.setText(self.tr("Solve cancelled; the plan shown is out of date (edit or F5 to re-solve)"))

    def _crew_section(self, staffing: dict) -> None:
        """Who is short, which running machine has nobody, whose authorisation runs out."""
        lines = []
        for r in staffing.get("unstaffed_running", []):
            lines.append((f"{palette.MARK_FORBIDDEN} {r['machine']}",
                          self.tr("runs {job} with no qualified operator present").format(job=r["job"]),
                          self.tr("Stop it only by the site's procedure: the plan never stops a "
                                  "running machine")))
        shortage = staffing.get("shortage")
        if shortage:
            lines.append((self.tr("{mark} short of operators").format(mark=palette.MARK_RUSH),
                          self.tr("%n job(s) wait for an operator", "", int(shortage["waiting"])),
                          shortage["text"]))
        for w in staffing.get("expiring", []):
            lines.append((f"{palette.MARK_RUSH} {w['operator']}",
                          self.tr("authorisation ends {date}").format(date=w["expires"]), w["text"]))
        for who in staffing.get("operators_not_yet_here", []):
            lines.append((who, self.tr("not here yet"),
                          self.tr("{operator} arrives later in the shift").format(operator=who)))
        for who in staffing.get("operators_absent", []):
            lines.append((who, self.tr("absent"), self.tr("{operator} is absent this shift").format(operator=who)))
        crew = QTreeWidgetItem(self.tree, [self.tr("Crew (%n present)", "",
                                                   len(staffing.get("operators_present", []))), "", ""])
        crew.setFirstColumnSpanned(True)
        if not lines:
            QTreeWidgetItem(crew, [self.tr("every machine in the plan is staffed"), "", ""])
        for first, second, tip in lines:
            item = QTreeWidgetItem(crew, [first, second, ""])
            item.setToolTip(0, tip)
            item.setToolTip(1, tip)
        crew.setExpanded(True)

    def show_plan(self, plan: Plan | ShiftFill | None, unit: str, seconds: float = 0.0,
                  machine_order: list[str] | None = None) -> None:
        self._unit = unit
        self.tree.clear()
        self.progress.setVisible(False)
        self.cancel.setVisible(False)
        if plan is None:
            self.total.setText("-")
            self.counts.setText("-")
            self.proof.setText("-")
            return
        self.status.setText(self.tr("{mark} Up to date (solved in {ms} ms)").format(
            mark=palette.MARK_PLANNED, ms=f"{seconds * 1000:.0f}"))
        self.status.setToolTip(self.tr("The plan shown matches the grid as it is now"))
        label = unit_text("value") if plan.objective == "maximize" else unit_text(unit)
        # The split alone: the whole solve JSON (with the reason of every waiting job) took
        # tens of ms on the GUI thread per plan of a 1000 x 200 shop.
        split = {"objective": plan.objective, "total_parts": total_parts(plan)}
        self.total.setText(f"{fmt(plan.total)} {label}" + self._parts_text(split, unit))
        self.total.setToolTip(
            self.tr("Sum of the values of newly dispatched jobs minus the wait penalties of waiting "
                    "jobs (running jobs are not counted)") if plan.objective == "maximize" else
            self.tr("Sum of the values of newly dispatched jobs plus the wait penalties of waiting "
                    "jobs (running jobs are not counted)"))
        placed = len(plan.assignments)
        self.counts.setText(self.tr("{dispatched} dispatched, {running} running, {waiting} waiting").format(
            dispatched=placed, running=len(plan.running), waiting=len(plan.waiting_jobs)))
        self.counts.setToolTip(self.tr("Jobs newly dispatched this round, jobs already running, jobs waiting"))
        if isinstance(plan, ShiftFill):
            if plan.proven_optimal and plan.verified:
                self.proof.setText(self.tr("{mark} optimal (proven by the MILP solver)").format(
                    mark=palette.MARK_PLANNED))
            else:
                self.proof.setText(f"{palette.MARK_RUSH} {plan.status_text}")
            self.proof.setToolTip(plan.status_text)
        elif plan.verified:
            self.proof.setText(self.tr("{mark} optimal (certificate checked)").format(mark=palette.MARK_PLANNED))
            self.proof.setToolTip(self.tr("Dual potentials prove no other plan placing as many jobs "
                                          "has a better total"))
        else:
            self.proof.setText(self.tr("{mark} certificate did NOT check").format(mark=palette.MARK_FORBIDDEN))
        if getattr(plan, "bottleneck", None) is not None:
            self.proof.setText(self.proof.text() + self.tr("; largest value {value}").format(
                value=fmt(plan.bottleneck)))

        entries_by_machine = machine_entries(plan, machine_order)
        hours = shift_hours(plan)
        staffing = getattr(plan, "staffing", None)
        minder = {m: self.tr("unattended") if who == "unattended" else who   # operators_by_machine's word
                  for m, who in operators_by_machine(staffing).items()}
        machines = QTreeWidgetItem(self.tree, [self.tr("Machines (%n)", "", len(entries_by_machine)), "", ""])
        machines.setFirstColumnSpanned(True)
        for machine, entries in entries_by_machine:
            if machine in hours:
                used, cap = hours[machine]
                head = QTreeWidgetItem(machines, [machine, self.tr("{used} of {hours} h used").format(
                    used=fmt(used, 2), hours=fmt(cap, 2)), ""])
                head.setToolTip(1, self.tr("Run hours planned on {machine} this shift, of the hours it has").format(
                    machine=machine))
            for n, (job, value, running) in enumerate(entries, 1):
                mark = "\u25b6 " if running else f"{palette.MARK_PLANNED} "
                if machine in hours:   # whole shift: jobs in run order under the machine
                    item = QTreeWidgetItem(machines, [f"   {n}.", mark + job, fmt(value)])
                    item.setToolTip(0, self.tr("Position {n} in {machine}'s run order").format(n=n, machine=machine))
                else:
                    label = f"{machine} ({minder[machine]})" if machine in minder else machine
                    item = QTreeWidgetItem(machines, [label, mark + job, fmt(value)])
                    if machine in minder:
                        item.setToolTip(0, self.tr("{machine} is minded by {operator} in this plan").format(
                            machine=machine, operator=minder[machine]))
                item.setTextAlignment(2, Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
                item.setToolTip(2, (self.tr("Value of {job} on {machine} ({unit}) - already running, not "
                                            "counted in the total") if running else
                                    self.tr("Value of {job} on {machine} ({unit})")).format(
                    job=job, machine=machine, unit=unit_text(unit)))
                item.setToolTip(1, self.tr("already running, stays") if running else self.tr("newly dispatched"))
        machines.setExpanded(True)
        waiting = QTreeWidgetItem(self.tree, [self.tr("Waiting jobs (%n)", "", len(plan.waiting_jobs)), "", ""])
        waiting.setFirstColumnSpanned(True)
        for job in plan.waiting_jobs[:MAX_LISTED]:
            reason = plan.waiting_reasons.get(job)
            if reason and reason.machines:
                text = self.tr("{jobs} for {machines}").format(
                    jobs=self.tr("%n job(s)", "", len(reason.competing_jobs)),
                    machines=self.tr("%n machine(s)", "", len(reason.machines)))
            elif reason:
                text = self.tr("no available machine can run it")
            else:
                text = self.tr("cheaper to leave it waiting")
            item = QTreeWidgetItem(waiting, [f"\u25cb {job}", text, ""])
            why = waiting_text(plan, job)
            item.setToolTip(1, why if reason else self.tr("left waiting: cheaper overall"))
            item.setToolTip(0, why)
        if len(plan.waiting_jobs) > MAX_LISTED:
            more = QTreeWidgetItem(waiting, [self.tr("\u2026 and %n more", "", len(plan.waiting_jobs) - MAX_LISTED),
                                             self.tr("see the grid's 'Plan puts it on' column"), ""])
            more.setToolTip(0, self.tr("Long lists are cut here to keep the window quick; every job's "
                                       "place or reason is in the grid"))
        waiting.setExpanded(True)
        if staffing:
            self._crew_section(staffing)
        idle = QTreeWidgetItem(self.tree, [self.tr("Idle machines (%n)", "", len(plan.idle_machines)), "", ""])
        idle.setFirstColumnSpanned(True)
        for m in plan.idle_machines:
            QTreeWidgetItem(idle, [m, self.tr("no job this round"), ""])
        idle.setExpanded(True)
        if plan.unavailable_machines:
            down = QTreeWidgetItem(self.tree, [self.tr("Not available (%n)", "", len(plan.unavailable_machines)),
                                               "", ""])
            down.setFirstColumnSpanned(True)
            for m in plan.unavailable_machines:
                QTreeWidgetItem(down, [f"{palette.MARK_DOWN} {m}",
                                       self.tr("down or in maintenance - lockout/tagout before any work"), ""])
            down.setExpanded(True)
        for column in (0, 2):
            self.tree.resizeColumnToContents(column)
        self._keep_heading_room()

    def _keep_heading_room(self) -> None:
        """Narrow the machine column (its names elide) rather than clip the stretched
        column's heading when the panel is narrow (long headings in other languages)."""
        head = self.tree.header()
        need = head.sectionSizeFromContents(1).width()
        room = self.tree.viewport().width() - head.sectionSize(2)
        if head.sectionSize(0) + need > room:
            floor = head.sectionSizeFromContents(0).width()
            self.tree.setColumnWidth(0, max(floor, room - need))

    def eventFilter(self, watched, event) -> bool:
        if watched is self.tree.viewport() and event.type() == QEvent.Type.Resize:
            self._keep_heading_room()
        return super().eventFilter(watched, event)

    def _parts_text(self, data: dict, unit: str) -> str:
        """`` (setups 208 + wait penalties 210)`` in the interface's language (the words of
        :func:`dispatcher.shop.plan.parts_text`); '' for a plan without the split."""
        parts = data.get("total_parts")
        if not isinstance(parts, dict) or "planned" not in parts:
            return ""
        word = {"values": self.tr("values"), "costs": self.tr("costs"), "setups": self.tr("setups")}[
            parts_word(data.get("objective", "total"), unit)]
        template = (self.tr(" ({planned_word} {planned} - wait penalties {penalties})")
                    if data.get("objective") == "maximize" else
                    self.tr(" ({planned_word} {planned} + wait penalties {penalties})"))
        return template.format(planned_word=word, planned=fmt(parts["planned"], 6),
                               penalties=fmt(parts["wait_penalties"], 6))
