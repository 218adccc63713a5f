"""The decision flow: an event (machine down or back up, rush job, job pulled) -> the proposed new plan
shown as a difference against the plan in force -> confirmed with a reason and a name ->
recorded in the history and put in force.

:func:`propose` is Qt-free: it applies the event to a copy of the shop and solves it with
the core; :class:`DecisionDialog` shows the proposal (with the safety reminder when a
machine goes down) and is non-blocking (``open()``), so tests drive it directly.
"""

from __future__ import annotations

import html
from dataclasses import dataclass, field

from PySide6.QtCore import Qt, Signal
from PySide6.QtWidgets import (
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QFormLayout,
    QFrame,
    QLabel,
    QLineEdit,
    QPlainTextEdit,
    QVBoxLayout,
    QWidget,
)

from dispatcher.history import REASON_KINDS, PlanDiff, diff_plans
from dispatcher.shop.redispatch import ShopEvent, redispatch_shop
from dispatcher.shop import DOWN, RUNNING, UP, WAITING, Plan, Shop, ShopError, ShopInfeasibleError
from dispatcher.ui import palette
from dispatcher.ui.format import fmt
from dispatcher.ui.solving import MODE_ROUND, snapshot, solve_for_mode

SAFETY_REMINDER = (
    "\u26a0 Safety first: before anyone works on this machine, apply lockout/tagout and "
    "follow the site's isolation procedure. Operators run only machines they are trained "
    "and authorised for. Follow each machine's setup instructions. Local regulations and "
    "the site's safety rules take precedence over this plan.")

EVENT_DOWN, EVENT_UP, EVENT_RUSH, EVENT_CONFIRM = "down", "up", "rush", "confirm"
EVENT_PULL = "pulled"
EVENT_REASON = {EVENT_DOWN: "breakdown", EVENT_UP: "repair", EVENT_RUSH: "rush-job",
                EVENT_CONFIRM: "shift-start", EVENT_PULL: "manual-change"}


@dataclass
class Proposal:
    """The shop after the event, its plan, and the difference from the plan in force."""

    event: str
    title: str
    shop: Shop
    plan: Plan | None
    diff: PlanDiff | None
    machine: int | None = None
    job: int | None = None
    job_changes: list[tuple[int, dict]] = field(default_factory=list)
    problem: str = ""
    move_penalties: float | None = None   # paid by the warm re-dispatch, when it was used
    pulled_job: str = ""                  # the job this decision takes out of the shop


NOTE_HINTS = {
    EVENT_DOWN: "What happened (for example: hydraulic leak, waiting for fitter)",
    EVENT_UP: "What was done (for example: seal replaced, checked by maintenance)",
    EVENT_RUSH: "Why it is urgent (for example: customer line stopped)",
    EVENT_PULL: "Why the job is pulled (for example: order cancelled, material not arrived)",
    EVENT_CONFIRM: "Anything the next shift should know",
}


def _empty_plan_json(objective: str) -> dict:
    return {"status": "optimal", "objective": objective, "total": 0, "assignments": [],
            "waiting_jobs": [], "idle_machines": []}


def propose(shop: Shop, event: str, objective: str, before: dict | None, *,
            machine: int | None = None, job: int | None = None, note: str = "",
            mode: str = MODE_ROUND) -> Proposal:
    """Apply ``event`` to a copy of ``shop`` and solve it; ``before`` is the plan in force (JSON).

    Machine down: it takes nothing; jobs running on it go back to waiting (they need a new
    setup elsewhere). Machine up: it takes jobs again. Rush: the job becomes a rush job.
    Pulled: the job leaves the shop (its pins and its place in the plan in force with it;
    if it was running, its machine is free again); the history keeps the shop as it was.
    """
    if event == EVENT_PULL:
        return _propose_pull(shop, objective, before, job, mode)
    new = snapshot(shop)
    job_changes: list[tuple[int, dict]] = []
    if event in (EVENT_DOWN, EVENT_UP):
        m = new.machines[machine]
        m.state = DOWN if event == EVENT_DOWN else UP
        m.state_note = note
        title = f"{m.name} {'is down' if event == EVENT_DOWN else 'is back up'}"
        if event == EVENT_DOWN:
            for i, j in enumerate(new.jobs):
                if j.state == RUNNING and j.machine == m.id:
                    j.state, j.machine, j.since = WAITING, None, None
                    job_changes.append((i, {"state": WAITING, "machine": None, "since": None}))
    elif event == EVENT_RUSH:
        new.jobs[job].rush = True
        title = f"Rush job: {new.jobs[job].name}"
        job_changes.append((job, {"rush": True}))
    elif event == EVENT_CONFIRM:
        title = "Put the plan shown in force"
    else:
        raise ValueError(f"unknown event {event!r}")
    warm = _warm_redispatch(shop, event, objective, machine, job) if mode == MODE_ROUND else None
    if warm is not None:
        after = warm.shop
        for m_new, m_old in zip(after.machines, shop.machines):
            if m_new.state != m_old.state:
                m_new.state_note = note
        changes = _job_changes(shop, after)
        diff = diff_plans(before or _empty_plan_json(objective), warm.plan.to_json())
        return Proposal(event, title, after, warm.plan, diff, machine, job, changes, "",
                        warm.move_penalties_paid)
    try:
        plan, note_text = solve_for_mode(new, objective, mode)
    except (ShopError, ShopInfeasibleError) as exc:
        return Proposal(event, title, new, None, None, machine, job, job_changes, str(exc))
    diff = diff_plans(before or _empty_plan_json(objective), plan.to_json())
    return Proposal(event, title, new, plan, diff, machine, job, job_changes, note_text)


def without_job(shop: Shop, index: int) -> Shop:
    """A copy of ``shop`` without job ``index``: its grid values and run hours, its pins and
    its place in the plan in force go too."""
    new = snapshot(shop)
    gone = new.jobs.pop(index)
    new.grid = {k: v for k, v in new.grid.items() if k[0] != gone.id}
    new.hours = {k: v for k, v in new.hours.items() if k[0] != gone.id}
    new.pins = [p for p in new.pins if p.job != gone.id]
    new.plan_in_force = {m: [j for j in js if j != gone.id]
                         for m, js in new.plan_in_force.items()}
    new.plan_in_force = {m: js for m, js in new.plan_in_force.items() if js}
    return new


def _propose_pull(shop: Shop, objective: str, before: dict | None, job: int, mode: str) -> Proposal:
    """The job is pulled: re-dispatch without it (warm from the plan in force when there is
    one, as for the other events), then take it out of the shop."""
    name = shop.jobs[job].name
    title = f"Job pulled: {name}"
    warm = _warm_redispatch(shop, EVENT_PULL, objective, None, job) if mode == MODE_ROUND else None
    if warm is not None:
        plan, problem, moves = warm.plan, "", warm.move_penalties_paid
    else:
        try:
            plan, problem = solve_for_mode(without_job(shop, job), objective, mode)
        except (ShopError, ShopInfeasibleError) as exc:
            return Proposal(EVENT_PULL, title, without_job(shop, job), None, None, None, job,
                            [], str(exc), None, name)
        moves = None
    diff = diff_plans(before or _empty_plan_json(objective), plan.to_json())
    return Proposal(EVENT_PULL, title, without_job(shop, job), plan, diff, None, job, [],
                    problem, moves, name)


def _warm_redispatch(shop: Shop, event: str, objective: str, machine: int | None,
                     job: int | None):
    """The core's warm re-dispatch from the plan in force (with move penalties), or None
    when it does not apply (no plan in force, bottleneck objective, or no feasible plan:
    then the caller solves from scratch and explains)."""
    if not shop.plan_in_force or objective not in ("total", "maximize") or event == EVENT_CONFIRM:
        return None
    name = shop.machines[machine].name if event in (EVENT_DOWN, EVENT_UP) else shop.jobs[job].name
    try:
        return redispatch_shop(shop, [ShopEvent(event, name)], objective=objective,
                               move_penalty=0.0 if objective == "maximize" else None)
    except (ShopError, ShopInfeasibleError):
        return None


def _job_changes(before: Shop, after: Shop) -> list[tuple[int, dict]]:
    """Per job, the fields the event changed (state, machine, since, rush)."""
    out = []
    for i, (a, b) in enumerate(zip(before.jobs, after.jobs)):
        fields = {f: getattr(b, f) for f in ("state", "machine", "since", "rush")
                  if getattr(a, f) != getattr(b, f)}
        if fields:
            out.append((i, fields))
    return out


def diff_html(diff: PlanDiff | None, unit: str, before: dict | None = None,
              pulled: str | None = None) -> str:
    """The difference as a short list a supervisor reads at a glance (marks, not colour only).
    ``pulled`` names a job taken out of the shop by this decision."""
    if diff is None:
        return "<p>No plan in force to compare with.</p>"
    e = html.escape
    items = []
    was_on = {a["job"]: a["machine"] for a in (before or {}).get("assignments", [])}
    if pulled is not None:
        running = {r["job"]: r["machine"] for r in (before or {}).get("running", [])}
        was = was_on.get(pulled) or running.get(pulled)
        where = f" (frees {e(was)})" if was else ""
        items.append(f"<li>{palette.MARK_FORBIDDEN} <b>pulled</b>: {e(pulled)} leaves the "
                     f"shop{where}</li>")
    for m in diff.moved:
        items.append(f"<li>\u2192 <b>moves</b>: {e(m.job)} from {e(m.from_machine)} to {e(m.to_machine)}</li>")
    for j, m in diff.newly_placed:
        items.append(f"<li>{palette.MARK_PLANNED} <b>starts</b>: {e(j)} on {e(m)}</li>")
    for j in diff.now_waiting:
        where = f" (was on {e(was_on[j])})" if j in was_on else ""
        items.append(f"<li>\u25cb <b>now waits</b>: {e(j)}{where}</li>")
    for m in diff.machines_now_idle:
        items.append(f"<li>\u25c7 <b>now idle</b>: {e(m)}</li>")
    for m in diff.machines_gone:
        items.append(f"<li>{palette.MARK_DOWN} <b>out of the plan</b>: {e(m)}</li>")
    if not items:
        items.append("<li>No job changes machine.</li>")
    total = ""
    if diff.total_change is not None:
        sign = "+" if diff.total_change > 0 else ""
        total = (f"<p>Total: {fmt(diff.total_before)} \u2192 <b>{fmt(diff.total_after)}</b> {unit} "
                 f"({sign}{fmt(diff.total_change)})")
        if diff.now_waiting and diff.total_change < 0:
            total += (" - lower only because fewer jobs are dispatched: a waiting job adds "
                      "just its wait penalty")
        total += "</p>"
    return "<ul>" + "".join(items) + "</ul>" + total


class DecisionDialog(QDialog):
    """Shows a :class:`Proposal`; ``confirmed(proposal, by, reason_kind, note)`` on OK."""

    confirmed = Signal(object, str, str, str)

    def __init__(self, proposal: Proposal, unit: str, supervisor: str = "",
                 parent: QWidget | None = None, before: dict | None = None,
                 before_label: str = "the plan in force"):
        super().__init__(parent)
        self.setObjectName("decisionDialog")
        self.proposal = proposal
        self.setWindowTitle(f"Confirm re-dispatch - {proposal.title}")
        layout = QVBoxLayout(self)
        head = QLabel(f"<h3>{proposal.title}</h3>")
        layout.addWidget(head)
        if proposal.event == EVENT_DOWN:
            safety = QLabel(SAFETY_REMINDER)
            safety.setObjectName("safetyReminder")
            safety.setWordWrap(True)
            safety.setFrameShape(QFrame.Shape.Box)
            safety.setStyleSheet(f"QLabel#safetyReminder {{ border: 2px solid "
                                 f"{palette.OKABE_ITO['vermillion']}; padding: 6px; "
                                 f"background: #FFF4E5; color: black; }}")
            layout.addWidget(safety)
        if proposal.plan is None:
            body = QLabel(f"{palette.MARK_FORBIDDEN} No plan is possible after this event: "
                          f"{html.escape(proposal.problem)}")
        else:
            warn = ""
            if proposal.problem:
                warn = (f"<p>{palette.MARK_RUSH} <b>Not every rush job can be placed:</b> "
                        f"{html.escape(proposal.problem)}</p>")
            moves = ""
            if proposal.move_penalties is not None:
                moves = (f"<p>Re-dispatched from the plan in force; move penalties included: "
                         f"{fmt(proposal.move_penalties)} {html.escape(unit)} (jobs dispatched but not "
                         "started move only when the saving is larger).</p>")
            pulled = proposal.pulled_job or None
            if pulled:
                moves += ("<p>The job is taken out of the shop document (Undo brings it back); "
                          "earlier decisions in the history keep it.</p>")
            body = QLabel(warn + f"<b>Proposed changes against {html.escape(before_label)}:</b>"
                          + diff_html(proposal.diff, unit, before, pulled) + moves)
        body.setObjectName("proposalDiff")
        body.setWordWrap(True)
        body.setTextFormat(Qt.TextFormat.RichText)
        layout.addWidget(body)

        form = QFormLayout()
        self.reason = QComboBox()
        for key, label in REASON_KINDS.items():
            self.reason.addItem(label, key)
        self.reason.setCurrentIndex(self.reason.findData(EVENT_REASON[proposal.event]))
        form.addRow("&Reason:", self.reason)
        self.note = QPlainTextEdit()
        self.note.setPlaceholderText(NOTE_HINTS.get(proposal.event, NOTE_HINTS[EVENT_DOWN]))
        self.note.setMaximumHeight(70)
        self.note.setTabChangesFocus(True)
        form.addRow("&Note:", self.note)
        self.by = QLineEdit(supervisor)
        self.by.setPlaceholderText("Supervisor name (required)")
        form.addRow("&Supervisor:", self.by)
        layout.addLayout(form)
        self.buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok
                                        | QDialogButtonBox.StandardButton.Cancel)
        ok = self.buttons.button(QDialogButtonBox.StandardButton.Ok)
        ok.setText("Confirm and record")
        ok.setEnabled(proposal.plan is not None and bool(supervisor.strip()))
        self.by.textChanged.connect(
            lambda t: ok.setEnabled(proposal.plan is not None and bool(t.strip())))
        self.buttons.accepted.connect(self._accept)
        self.buttons.rejected.connect(self.reject)
        layout.addWidget(self.buttons)
        self.resize(560, self.sizeHint().height())

    def confirm(self, by: str, note: str = "", reason: str | None = None) -> None:
        """Fill in and confirm (what the OK button does; also used by tests)."""
        self.by.setText(by)
        self.note.setPlainText(note)
        if reason:
            self.reason.setCurrentIndex(self.reason.findData(reason))
        self._accept()

    def _accept(self) -> None:
        if self.proposal.plan is None or not self.by.text().strip():
            return
        self.confirmed.emit(self.proposal, self.by.text().strip(), self.reason.currentData(),
                            self.note.toPlainText().strip())
        self.accept()
