"""The confirm dialog of a decision: an event (machine down or back up, rush job, job
pulled) -> the proposed new plan shown as a difference against the plan in force ->
confirmed with a reason and a name.

The proposal comes from the Qt-free core (:func:`dispatcher.shop.proposal.propose`);
:class:`DecisionDialog` shows it (with the safety reminder when a machine goes down) and
is non-blocking (``open()``), so tests drive it directly.
"""

from __future__ import annotations

import html

from PySide6.QtCore import QT_TRANSLATE_NOOP, QCoreApplication, Qt, Signal
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
from dispatcher.shop.plan import parts_word
from dispatcher.ui import palette
from dispatcher.ui.format import fmt, reason_text, unit_text

translate = QCoreApplication.translate   # the name pyside6-lupdate collects

#: English; shown through ``tr`` in the dialog (context DecisionDialog).
SAFETY_REMINDER = QT_TRANSLATE_NOOP(
    "DecisionDialog",
    "\u26a0 Safety first: before anyone works on this machine, apply lockout/tagout and "
    "follow the site's isolation procedure. Operators run only machines they are trained "
    "and authorised for. Follow each machine's setup instructions. Local regulations and "
    "the site's safety rules take precedence over this plan.")

NOTE_HINTS = {
    EVENT_DOWN: QT_TRANSLATE_NOOP("DecisionDialog", "What happened (for example: hydraulic leak, waiting for fitter)"),
    EVENT_UP: QT_TRANSLATE_NOOP("DecisionDialog", "What was done (for example: seal replaced, checked by maintenance)"),
    EVENT_RUSH: QT_TRANSLATE_NOOP("DecisionDialog", "Why it is urgent (for example: customer line stopped)"),
    EVENT_PULL: QT_TRANSLATE_NOOP("DecisionDialog",
                                  "Why the job is pulled (for example: order cancelled, material not arrived)"),
    EVENT_CONFIRM: QT_TRANSLATE_NOOP("DecisionDialog", "Anything the next shift should know"),
}


def proposal_title(proposal: Proposal) -> str:
    """The proposal's title (:func:`dispatcher.shop.proposal.propose`'s words) in the
    interface's language; a title the app wrote itself (already translated) stays."""
    shop, event = proposal.shop, proposal.event
    try:
        if event == EVENT_DOWN:
            return translate("DecisionDiff", "{machine} is down").format(machine=shop.machines[proposal.machine].name)
        if event == EVENT_UP:
            return translate("DecisionDiff", "{machine} is back up").format(
                machine=shop.machines[proposal.machine].name)
        if event == EVENT_RUSH:
            return translate("DecisionDiff", "Rush job: {job}").format(job=shop.jobs[proposal.job].name)
        if event == EVENT_PULL and proposal.pulled_job:
            return translate("DecisionDiff", "Job pulled: {job}").format(job=proposal.pulled_job)
        if event == EVENT_CONFIRM and proposal.title == "Put the plan shown in force":
            return translate("DecisionDiff", "Put the plan shown in force")
    except (IndexError, TypeError):
        pass
    return proposal.title


def parts_change_html(before: dict | None, after: dict, unit: str,
                      move_penalties: float | None = None) -> str:
    """``setups 208 -> 215, wait penalties 210 -> 180; move penalties 4 (apart)`` in the
    interface's language (:func:`dispatcher.shop.plan.parts_change_text`'s words)."""
    a = (before or {}).get("total_parts")
    b = after.get("total_parts")
    if not isinstance(a, dict) or not isinstance(b, dict):
        return ""
    word = {"values": translate("DecisionDiff", "values"), "costs": translate("DecisionDiff", "costs"),
            "setups": translate("DecisionDiff", "setups")}[
        parts_word(after.get("objective", "total"), unit)]
    text = translate("DecisionDiff", "{planned_word} {before} \u2192 {after}, wait penalties {penalties_before} \u2192 "
               "{penalties_after}").format(
        planned_word=word, before=fmt(a["planned"], 6), after=fmt(b["planned"], 6),
        penalties_before=fmt(a["wait_penalties"], 6), penalties_after=fmt(b["wait_penalties"], 6))
    if move_penalties:
        text += translate("DecisionDiff", "; move penalties {value} (apart)").format(value=fmt(move_penalties, 6))
    return text


def diff_html(diff: PlanDiff | None, unit: str, before: dict | None = None,
              pulled: str | None = None, after: dict | None = None,
              move_penalties: float | None = None) -> str:
    """The difference as a short list a supervisor reads at a glance (marks, not colour only).
    ``pulled`` names a job taken out of the shop by this decision; ``after`` (the proposed
    plan's JSON) lets the total change be split into setups and wait penalties."""
    if diff is None:
        return "<p>" + translate("DecisionDiff", "No plan in force to compare with.") + "</p>"
    e = html.escape
    items = []
    was_on = {a["job"]: a["machine"] for a in (before or {}).get("assignments", [])}
    if pulled is not None:
        running = {r["job"]: r["machine"] for r in (before or {}).get("running", [])}
        was = was_on.get(pulled) or running.get(pulled)
        text = (translate("DecisionDiff", "<b>pulled</b>: {job} leaves the shop (frees {machine})") if was else
                translate("DecisionDiff", "<b>pulled</b>: {job} leaves the shop"))
        items.append(f"<li>{palette.MARK_FORBIDDEN} " + text.format(job=e(pulled), machine=e(was or ""))
                     + "</li>")
    for m in diff.moved:
        items.append("<li>\u2192 " + translate(
            "DecisionDiff", "<b>moves</b>: {job} from {machine} to {to_machine}").format(
            job=e(m.job), machine=e(m.from_machine), to_machine=e(m.to_machine)) + "</li>")
    for j, m in diff.newly_placed:
        items.append(f"<li>{palette.MARK_PLANNED} " + translate(
            "DecisionDiff", "<b>starts</b>: {job} on {machine}").format(
            job=e(j), machine=e(m)) + "</li>")
    for j in diff.now_waiting:
        text = (translate("DecisionDiff", "<b>now waits</b>: {job} (was on {machine})") if j in was_on else
                translate("DecisionDiff", "<b>now waits</b>: {job}"))
        items.append("<li>\u25cb " + text.format(job=e(j), machine=e(was_on.get(j, ""))) + "</li>")
    for m in diff.machines_now_idle:
        items.append("<li>\u25c7 " + translate("DecisionDiff", "<b>now idle</b>: {machine}").format(
            machine=e(m)) + "</li>")
    for m in diff.machines_gone:
        items.append(f"<li>{palette.MARK_DOWN} " + translate(
            "DecisionDiff", "<b>out of the plan</b>: {machine}").format(
            machine=e(m)) + "</li>")
    if not items:
        items.append("<li>" + translate("DecisionDiff", "No job changes machine.") + "</li>")
    total = ""
    if diff.total_change is not None:
        sign = "+" if diff.total_change > 0 else ""
        total = "<p>" + translate("DecisionDiff", "Total: {before} \u2192 <b>{after}</b> {unit} ({change})").format(
            before=fmt(diff.total_before), after=fmt(diff.total_after), unit=e(unit_text(unit)),
            change=f"{sign}{fmt(diff.total_change)}")
        split = parts_change_html(before, after, unit, move_penalties) if after is not None else ""
        if split:
            total += f" - {e(split)}"
        if diff.now_waiting and diff.total_change < 0:
            total += translate("DecisionDiff", " - lower only because fewer jobs are dispatched: a waiting job adds "
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
        title = proposal_title(proposal)
        self.setWindowTitle(self.tr("Confirm re-dispatch - {title}").format(title=title))
        layout = QVBoxLayout(self)
        head = QLabel(f"<h3>{html.escape(title)}</h3>")
        head.setAccessibleName(self.tr("Event"))
        head.setAccessibleDescription(self.tr("What happened, as the decision will record it"))
        layout.addWidget(head)
        if proposal.event == EVENT_DOWN:
            safety = QLabel(self.tr(SAFETY_REMINDER))
            safety.setAccessibleName(self.tr("Safety reminder"))
            safety.setAccessibleDescription(self.tr("Lockout/tagout and the site's rules come before the plan"))
            safety.setObjectName("safetyReminder")
            safety.setWordWrap(True)
            safety.setFrameShape(QFrame.Shape.Box)
            safety.setStyleSheet(f"QLabel#safetyReminder {{ border: 2px solid "
                                 f"{palette.OKABE_ITO['vermillion']}; padding: 6px; "
                                 f"background: #FFF4E5; color: black; }}")
            layout.addWidget(safety)
        if proposal.plan is None:
            body = QLabel(self.tr("{mark} No plan is possible after this event: {problem}").format(
                mark=palette.MARK_FORBIDDEN, problem=html.escape(proposal.problem)))
        else:
            warn = ""
            if proposal.problem:
                warn = "<p>" + self.tr("{mark} <b>Not every rush job can be placed:</b> {problem}").format(
                    mark=palette.MARK_RUSH, problem=html.escape(proposal.problem)) + "</p>"
            moves = ""
            if proposal.move_penalties is not None:
                moves = "<p>" + self.tr(
                    "Re-dispatched from the plan in force; move penalties included: {value} {unit} "
                    "(jobs dispatched but not started move only when the saving is larger).").format(
                    value=fmt(proposal.move_penalties), unit=html.escape(unit_text(unit))) + "</p>"
            pulled = proposal.pulled_job or None
            if pulled:
                moves += "<p>" + self.tr("The job is taken out of the shop document (Undo brings it back); "
                                         "earlier decisions in the history keep it.") + "</p>"
            body = QLabel(warn + self.tr("<b>Proposed changes against {plan}:</b>").format(
                plan=html.escape(before_label))
                          + diff_html(proposal.diff, unit, before, pulled, proposal.plan.to_json(),
                                      proposal.move_penalties) + moves)
        body.setObjectName("proposalDiff")
        body.setWordWrap(True)
        body.setTextFormat(Qt.TextFormat.RichText)
        body.setAccessibleName(self.tr("Proposed changes"))
        body.setAccessibleDescription(self.tr("How the proposed plan differs from the plan in force"))
        layout.addWidget(body)

        form = QFormLayout()
        self.reason = QComboBox()
        for key, label in REASON_KINDS.items():
            self.reason.addItem(reason_text(key), key)
        self.reason.setCurrentIndex(self.reason.findData(EVENT_REASON[proposal.event]))
        self.reason.setAccessibleName(self.tr("Reason"))
        self.reason.setAccessibleDescription(self.tr("The kind of reason recorded with the decision"))
        form.addRow(self.tr("&Reason:"), self.reason)
        self.note = QPlainTextEdit()
        self.note.setPlaceholderText(self.tr(NOTE_HINTS.get(proposal.event, NOTE_HINTS[EVENT_DOWN])))
        self.note.setMaximumHeight(70)
        self.note.setTabChangesFocus(True)
        self.note.setAccessibleName(self.tr("Note"))
        self.note.setAccessibleDescription(self.note.placeholderText())
        form.addRow(self.tr("&Note:"), self.note)
        self.by = QLineEdit(supervisor)
        self.by.setPlaceholderText(self.tr("Supervisor name (required)"))
        self.by.setAccessibleName(self.tr("Supervisor"))
        self.by.setAccessibleDescription(self.tr("Who takes the decision (required)"))
        form.addRow(self.tr("&Supervisor:"), self.by)
        layout.addLayout(form)
        self._kept = False
        self.retry_note = QLabel()
        self.retry_note.setObjectName("retryNote")
        self.retry_note.setWordWrap(True)
        self.retry_note.setAccessibleName(self.tr("Not recorded yet"))
        self.retry_note.setAccessibleDescription(self.tr(
            "Why the last confirmation was not recorded; confirming again retries"))
        self.retry_note.setVisible(False)
        layout.addWidget(self.retry_note)
        self.buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok
                                        | QDialogButtonBox.StandardButton.Cancel)
        ok = self.buttons.button(QDialogButtonBox.StandardButton.Ok)
        ok.setText(self.tr("Confirm and record"))
        ok.setAccessibleName(self.tr("Confirm and record"))
        ok.setAccessibleDescription(self.tr("Record the decision in the history and put the plan in force"))
        ok.setEnabled(proposal.plan is not None and bool(supervisor.strip()))
        cancel = self.buttons.button(QDialogButtonBox.StandardButton.Cancel)
        cancel.setAccessibleName(self.tr("Cancel"))
        cancel.setAccessibleDescription(self.tr("Close without recording; the plan in force stays"))
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

    def keep_open(self, why: str) -> None:
        """Called while handling ``confirmed`` when the decision could not be recorded
        for a passing reason (server away): the dialog stays open, filled in as it was,
        so confirming again retries; ``why`` is shown above the buttons."""
        self._kept = True
        self.retry_note.setText(why)
        self.retry_note.setVisible(True)

    def _accept(self) -> None:
        if self.proposal.plan is None or not self.by.text().strip():
            return
        self._kept = False
        self.confirmed.emit(self.proposal, self.by.text().strip(), self.reason.currentData(),
                            self.note.toPlainText().strip())
        if not self._kept:
            self.accept()
