"""The confirm dialog of a decision: an event (machine down or back up, rush job, job
pulled) -> the proposed new plan shown as a difference against the plan in force ->
confirmed with a reason and a name.

The proposal comes from the Qt-free core (:func:`dispatcher.shop.proposal.propose`);
:class:`DecisionDialog` shows it (with the safety reminder when a machine goes down) and
is non-blocking (``open()``), so tests drive it directly.
"""

from __future__ import annotations

import html

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

from dispatcher.history import REASON_KINDS, PlanDiff
from dispatcher.shop.proposal import EVENT_CONFIRM, EVENT_DOWN, EVENT_PULL, EVENT_REASON, EVENT_RUSH, EVENT_UP, Proposal
from dispatcher.shop.plan import parts_change_text
from dispatcher.ui import palette
from dispatcher.ui.format import fmt

SAFETY_REMINDER = (
    "\u26a0 Safety first: before anyone works on this machine, apply lockout/tagout and "
    "follow the site's isolation procedure. Operators run only machines they are trained "
    "and authorised for. Follow each machine's setup instructions. Local regulations and "
    "the site's safety rules take precedence over this plan.")

NOTE_HINTS = {
    EVENT_DOWN: "What happened (for example: hydraulic leak, waiting for fitter)",
    EVENT_UP: "What was done (for example: seal replaced, checked by maintenance)",
    EVENT_RUSH: "Why it is urgent (for example: customer line stopped)",
    EVENT_PULL: "Why the job is pulled (for example: order cancelled, material not arrived)",
    EVENT_CONFIRM: "Anything the next shift should know",
}


def diff_html(diff: PlanDiff | None, unit: str, before: dict | None = None,
              pulled: str | None = None, after: dict | None = None,
              move_penalties: float | None = None) -> str:
    """The difference as a short list a supervisor reads at a glance (marks, not colour only).
    ``pulled`` names a job taken out of the shop by this decision; ``after`` (the proposed
    plan's JSON) lets the total change be split into setups and wait penalties."""
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
        split = parts_change_text(before, after, unit, move_penalties) if after is not None else ""
        if split:
            total += f" - {e(split)}"
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
                          + diff_html(proposal.diff, unit, before, pulled, proposal.plan.to_json(),
                                      proposal.move_penalties) + moves)
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
