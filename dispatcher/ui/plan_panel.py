"""The plan panel: per machine its job and value, waiting jobs with reasons, idle machines,
the total, the objective (switchable) and whether the optimality certificate checked out."""

from __future__ import annotations

from PySide6.QtCore import Qt, Signal
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
from dispatcher.shop.plan import parts_text
from dispatcher.ui import palette
from dispatcher.ui.format import fmt
from dispatcher.shop.planning import MODES
from dispatcher.ui.solving import machine_entries, shift_hours

#: Waiting jobs listed one by one in the panel; the rest are counted (the grid shows all).
MAX_LISTED = 150

OBJECTIVE_LABELS = {
    "total": "Least total (setup + wait penalties)",
    "maximize": "Most total value (values are gains)",
    "bottleneck": "Smallest largest single value, then least total",
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
            self.objective.addItem(label, key)
        self.objective.setToolTip("What the plan optimises; changing it re-solves at once")
        self.objective.currentIndexChanged.connect(
            lambda _: self.objective_changed.emit(self.objective.currentData()))
        form.addRow("&Objective:", self.objective)
        self.mode = QComboBox()
        for key, label in MODES.items():
            self.mode.addItem(label, key)
        self.mode.setToolTip("Plan one dispatch round, or fill each machine's whole shift "
                             "(needs run hours; may take longer, with progress and cancel)")
        self.mode.currentIndexChanged.connect(lambda _: self.mode_changed.emit(self.mode.currentData()))
        form.addRow("&Mode:", self.mode)
        self.total = QLabel("-")
        self.total.setTextInteractionFlags(Qt.TextInteractionFlag.TextSelectableByMouse)
        form.addRow("Total:", self.total)
        self.counts = QLabel("-")
        form.addRow("Placed:", self.counts)
        self.proof = QLabel("-")
        form.addRow("Proof:", self.proof)
        layout.addLayout(form)

        status_row = QHBoxLayout()
        self.status = QLabel("No plan yet")
        self.status.setWordWrap(True)
        self.status.setObjectName("planStatus")
        self.progress = QProgressBar()
        self.progress.setRange(0, 0)
        self.progress.setMaximumWidth(90)
        self.progress.setVisible(False)
        self.progress.setToolTip("Solving in the background; the grid stays editable")
        self.cancel = QPushButton("Cancel")
        self.cancel.setToolTip("Stop waiting for this solve (Esc)")
        self.cancel.setVisible(False)
        self.cancel.clicked.connect(self.cancel_requested)
        status_row.addWidget(self.status, 1)
        status_row.addWidget(self.progress)
        status_row.addWidget(self.cancel)
        layout.addLayout(status_row)

        self.tree = QTreeWidget()
        self.tree.setColumnCount(3)
        self.tree.setHeaderLabels(["Machine", "Job / why it waits", "Value"])
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
        self._unit = ""

    # ---- state ----------------------------------------------------------------------------
    def set_mode(self, mode: str) -> None:
        i = self.mode.findData(mode)
        if i >= 0 and i != self.mode.currentIndex():
            self.mode.blockSignals(True)
            self.mode.setCurrentIndex(i)
            self.mode.blockSignals(False)

    def show_progress_text(self, text: str) -> None:
        self.status.setText(f"Solving\u2026 {text}")

    def set_objective(self, objective: str) -> None:
        i = self.objective.findData(objective)
        if i >= 0 and i != self.objective.currentIndex():
            self.objective.blockSignals(True)
            self.objective.setCurrentIndex(i)
            self.objective.blockSignals(False)

    def show_busy(self, busy: bool, slow: bool = False) -> None:
        """busy: a solve is under way; slow: it has taken over half a second."""
        if busy:
            self.status.setText("Solving\u2026")
        self.progress.setVisible(busy and slow)
        self.cancel.setVisible(busy and slow)

    def show_problem(self, message: str) -> None:
        """The shop cannot be solved as it is: say why, keep the last plan visible but stale."""
        self.progress.setVisible(False)
        self.cancel.setVisible(False)
        short = message if len(message) <= 400 else message[:400] + "\u2026 (hover for all)"
        self.status.setText(f"{palette.MARK_FORBIDDEN} No plan: {short}")
        self.status.setToolTip(message)

    def show_note(self, message: str) -> None:
        """A plan is shown, but with a caveat the supervisor must read (e.g. a rush job left out)."""
        self.status.setText(f"{palette.MARK_RUSH} {message}")
        self.status.setToolTip(message)

    def show_cancelled(self) -> None:
        self.progress.setVisible(False)
        self.cancel.setVisible(False)
        self.status.setText("Solve cancelled; the plan shown is out of date (edit or F5 to re-solve)")

    def _crew_section(self, staffing: dict) -> None:
        """Who is short, which running machine has nobody, whose authorisation runs out."""
        lines = []
        for r in staffing.get("unstaffed_running", []):
            lines.append((f"{palette.MARK_FORBIDDEN} {r['machine']}",
                          f"runs {r['job']} with no qualified operator present",
                          "Stop it only by the site's procedure: the plan never stops a "
                          "running machine"))
        shortage = staffing.get("shortage")
        if shortage:
            lines.append((f"{palette.MARK_RUSH} short of operators",
                          f"{shortage['waiting']} job(s) wait for an operator", shortage["text"]))
        for w in staffing.get("expiring", []):
            lines.append((f"{palette.MARK_RUSH} {w['operator']}",
                          f"authorisation ends {w['expires']}", w["text"]))
        for who in staffing.get("operators_not_yet_here", []):
            lines.append((who, "not here yet", f"{who} arrives later in the shift"))
        for who in staffing.get("operators_absent", []):
            lines.append((who, "absent", f"{who} is absent this shift"))
        crew = QTreeWidgetItem(self.tree, [f"Crew ({len(staffing.get('operators_present', []))} "
                                           "present)", "", ""])
        crew.setFirstColumnSpanned(True)
        if not lines:
            QTreeWidgetItem(crew, ["every machine in the plan is staffed", "", ""])
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
        self.status.setText(f"{palette.MARK_PLANNED} Up to date (solved in {seconds * 1000:.0f} ms)")
        self.status.setToolTip("The plan shown matches the grid as it is now")
        label = "value" if plan.objective == "maximize" else unit
        self.total.setText(f"{fmt(plan.total)} {label}" + parts_text(plan.to_json(), unit))
        self.total.setToolTip(
            "Sum of the values of newly dispatched jobs "
            + ("minus" if plan.objective == "maximize" else "plus")
            + " the wait penalties of waiting jobs (running jobs are not counted)")
        placed = len(plan.assignments)
        self.counts.setText(f"{placed} dispatched, {len(plan.running)} running, "
                            f"{len(plan.waiting_jobs)} waiting")
        self.counts.setToolTip("Jobs newly dispatched this round, jobs already running, jobs waiting")
        if isinstance(plan, ShiftFill):
            if plan.proven_optimal and plan.verified:
                self.proof.setText(f"{palette.MARK_PLANNED} optimal (proven by the MILP solver)")
            else:
                self.proof.setText(f"{palette.MARK_RUSH} {plan.status_text}")
            self.proof.setToolTip(plan.status_text)
        elif plan.verified:
            self.proof.setText(f"{palette.MARK_PLANNED} optimal (certificate checked)")
            self.proof.setToolTip("Dual potentials prove no other plan placing as many jobs "
                                  "has a better total")
        else:
            self.proof.setText(f"{palette.MARK_FORBIDDEN} certificate did NOT check")
        if getattr(plan, "bottleneck", None) is not None:
            self.proof.setText(self.proof.text() + f"; largest value {fmt(plan.bottleneck)}")

        entries_by_machine = machine_entries(plan, machine_order)
        hours = shift_hours(plan)
        staffing = getattr(plan, "staffing", None)
        minder = operators_by_machine(staffing)
        machines = QTreeWidgetItem(self.tree, [f"Machines ({len(entries_by_machine)})", "", ""])
        machines.setFirstColumnSpanned(True)
        for machine, entries in entries_by_machine:
            if machine in hours:
                used, cap = hours[machine]
                head = QTreeWidgetItem(machines, [machine, f"{fmt(used, 2)} of {fmt(cap, 2)} h used", ""])
                head.setToolTip(1, f"Run hours planned on {machine} this shift, of the hours it has")
            for n, (job, value, running) in enumerate(entries, 1):
                mark = "\u25b6 " if running else f"{palette.MARK_PLANNED} "
                if machine in hours:   # whole shift: jobs in run order under the machine
                    item = QTreeWidgetItem(machines, [f"   {n}.", mark + job, fmt(value)])
                    item.setToolTip(0, f"Position {n} in {machine}'s run order")
                else:
                    label = f"{machine} ({minder[machine]})" if machine in minder else machine
                    item = QTreeWidgetItem(machines, [label, mark + job, fmt(value)])
                    if machine in minder:
                        item.setToolTip(0, f"{machine} is minded by {minder[machine]} in this plan")
                item.setTextAlignment(2, Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
                item.setToolTip(2, f"Value of {job} on {machine} ({unit})"
                                + (" - already running, not counted in the total" if running else ""))
                item.setToolTip(1, "already running, stays" if running else "newly dispatched")
        machines.setExpanded(True)
        waiting = QTreeWidgetItem(self.tree, [f"Waiting jobs ({len(plan.waiting_jobs)})", "", ""])
        waiting.setFirstColumnSpanned(True)
        for job in plan.waiting_jobs[:MAX_LISTED]:
            reason = plan.waiting_reasons.get(job)
            if reason and reason.machines:
                text = f"{len(reason.competing_jobs)} jobs for {len(reason.machines)} machine(s)"
            elif reason:
                text = "no available machine can run it"
            else:
                text = "cheaper to leave it waiting"
            item = QTreeWidgetItem(waiting, [f"\u25cb {job}", text, ""])
            item.setToolTip(1, reason.text if reason else "left waiting: cheaper overall")
            item.setToolTip(0, reason.text if reason else "")
        if len(plan.waiting_jobs) > MAX_LISTED:
            more = QTreeWidgetItem(waiting, [f"\u2026 and {len(plan.waiting_jobs) - MAX_LISTED} more",
                                             "see the grid's 'Plan puts it on' column", ""])
            more.setToolTip(0, "Long lists are cut here to keep the window quick; every job's "
                               "place or reason is in the grid")
        waiting.setExpanded(True)
        if staffing:
            self._crew_section(staffing)
        idle = QTreeWidgetItem(self.tree, [f"Idle machines ({len(plan.idle_machines)})", "", ""])
        idle.setFirstColumnSpanned(True)
        for m in plan.idle_machines:
            QTreeWidgetItem(idle, [m, "no job this round", ""])
        idle.setExpanded(True)
        if plan.unavailable_machines:
            down = QTreeWidgetItem(self.tree, [f"Not available ({len(plan.unavailable_machines)})", "", ""])
            down.setFirstColumnSpanned(True)
            for m in plan.unavailable_machines:
                QTreeWidgetItem(down, [f"{palette.MARK_DOWN} {m}", "down or in maintenance", ""])
            down.setExpanded(True)
        for column in (0, 2):
            self.tree.resizeColumnToContents(column)
