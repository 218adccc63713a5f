"""Decision flows: machine down or back up, rush job, job pulled, put a plan in force.

:class:`DecisionFlow` is a part of the main window, created in its constructor. The
proposal comes from :func:`dispatcher.shop.proposal.propose`; confirming records the
decision in the history first and only then changes the document, as one undoable step.
"""

from __future__ import annotations

from datetime import datetime, timezone

from PySide6.QtCore import QObject, Qt, Signal

from dispatcher.history import (
    UNCHECKED,
    DecisionConflict,
    HistoryError,
    HistoryInputError,
    diff_plans,
)
from dispatcher.io.shopfile import shop_to_dict
from dispatcher.shop import DONE, DOWN, RUNNING, UP, WAITING, Shop
from dispatcher.shop.planning import plan_in_force_ids
from dispatcher.shop.proposal import (
    EVENT_CONFIRM,
    EVENT_DOWN,
    EVENT_PULL,
    EVENT_RUSH,
    EVENT_UP,
    Proposal,
    propose,
)
from dispatcher.ui.decision import DecisionDialog, proposal_title
from dispatcher.ui.edits import RemoveJob, SetJobsState, SetMachineFields, SetPlanInForce
from dispatcher.ui.settings_keys import KEY_SUPERVISOR


class DecisionFlow(QObject):
    """Opens the confirm dialog for an event and applies a confirmed decision.

    ``recorded(decision_id)`` after a decision is in the history and in the document.
    ``dialog`` is the last confirm dialog opened (None before the first).
    """

    recorded = Signal(int)

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.doc = window.doc
        self.view = window.view
        self.dialog: DecisionDialog | None = None
        self.based_on: int | str | None = UNCHECKED  # the shop's latest decision at opening

    def show_warning(self, text: str) -> None:
        self.window.show_warning(text)

    def plan_in_force(self) -> tuple[dict | None, str]:
        """The plan in force (JSON) and how to name it: the latest recorded decision of this
        shop when the shop has one in force, else the plan shown (not yet recorded)."""
        try:
            latest = self.window.history.latest(self.doc.shop.name) if self.doc.shop.plan_in_force else None
        except HistoryError:
            latest = None
        if latest is not None and latest.plan:
            return latest.plan, self.tr("the plan in force (decision #{number})").format(number=latest.id)
        plan = self.window.plan.to_json() if self.window.plan is not None else None
        return plan, self.tr("the plan shown (no decision recorded yet)")

    def _latest_number(self) -> int | str | None:
        """The shop's latest decision now (None: none yet), so that confirming is refused
        if another station records a newer one meanwhile (UNCHECKED if unreadable)."""
        try:
            found = self.window.history.list(shop=self.doc.shop.name, limit=1, newest_first=True)
        except HistoryError:
            return UNCHECKED
        return found[0].id if found else None

    def machine_event(self, event: str, col: int | None = None) -> DecisionDialog | None:
        col = self.view.current_machine() if col is None else col
        if col is None:
            self.show_warning(self.tr("choose a cell in a machine column first (or use the column's menu)"))
            return None
        m = self.doc.machine_at(col)
        if event == EVENT_DOWN and m.state == DOWN:
            self.show_warning(self.tr("{machine} is already down").format(machine=m.name))
            return None
        if event == EVENT_UP and m.state == UP:
            self.show_warning(self.tr("{machine} is already up").format(machine=m.name))
            return None
        return self._open(self.doc.shop, event, machine=col)

    def rush(self, row: int | None = None) -> DecisionDialog | None:
        row = self.view.current_row() if row is None or row is False else row
        if row is None:
            return None
        job = self.doc.job_at(row)
        if job.rush:
            self.show_warning(self.tr("{job} is already a rush job").format(job=job.name))
            return None
        if job.state != WAITING:
            self.show_warning((self.tr("{job} is running: only a waiting job can become a rush job")
                               if job.state == RUNNING else
                               self.tr("{job} is done: only a waiting job can become a rush job")).format(
                job=job.name))
            return None
        return self._open(self.doc.shop, EVENT_RUSH, job=row)

    def pull(self, row: int | None = None) -> DecisionDialog | None:
        """The current job is pulled (order cancelled or put on hold): propose the plan
        without it; confirming records the decision and takes the job out of the shop."""
        row = self.view.current_row() if row is None or row is False else row
        if row is None:
            self.show_warning(self.tr("choose a cell in the job's row first (or use the row's menu)"))
            return None
        job = self.doc.job_at(row)
        if job.state == DONE:
            self.show_warning(self.tr("{job} is already done; there is nothing to pull").format(job=job.name))
            return None
        return self._open(self.doc.shop, EVENT_PULL, job=row)

    def confirm_plan(self) -> DecisionDialog | None:
        return self._open(self.doc.shop, EVENT_CONFIRM)

    def _open(self, shop: Shop, event: str, **where) -> DecisionDialog:
        before, _ = self.plan_in_force()
        objective = self.window.objective
        proposal = propose(shop, event, objective, mode=self.window.mode, before=before, **where)
        if proposal.plan is not None:
            nothing = {"status": "optimal", "objective": objective, "total": 0,
                       "assignments": [], "waiting_jobs": [], "idle_machines": []}
            proposal.diff = diff_plans(before or nothing, proposal.plan.to_json())
        return self.show(proposal)

    def show(self, proposal: Proposal) -> DecisionDialog:
        """Open the confirm dialog for a proposal against the plan in force."""
        before, label = self.plan_in_force()
        self.based_on = self._latest_number()
        dialog = DecisionDialog(proposal, self.doc.shop.unit.label(),
                                str(self.window.settings.value(KEY_SUPERVISOR, "")), self.window,
                                before=before, before_label=label)
        dialog.confirmed.connect(self.apply)
        dialog.setAttribute(Qt.WidgetAttribute.WA_DeleteOnClose)
        self.dialog = dialog
        dialog.destroyed.connect(lambda *_: self._forget(dialog))
        dialog.open()
        return dialog

    def _forget(self, dialog) -> None:
        if self.dialog is dialog:
            self.dialog = None

    def apply(self, proposal: Proposal, by: str, reason: str, note: str) -> int | None:
        """Record the decision first; only if that worked, change the document (undoable)."""
        recorded_shop = proposal.shop
        recorded_shop.plan_in_force = plan_in_force_ids(proposal.plan, recorded_shop)
        try:
            number = self.window.history.record(shop_to_dict(recorded_shop), proposal.plan.to_json(),
                                         by=by, reason=reason, note=note, based_on=self.based_on)
        except DecisionConflict as exc:  # the proposal is out of date: decide again
            self.window.messenger.error(self.tr("Decision not recorded"),
                                        self.tr("{error}\n\nThe plan in force is unchanged.").format(error=exc))
            return None
        except (HistoryError, HistoryInputError, OSError) as exc:
            dialog = self.sender() if isinstance(self.sender(), DecisionDialog) else self.dialog
            retry = isinstance(exc, HistoryError) and dialog is not None
            if retry:  # a passing fault (server away...): keep the dialog for a retry
                dialog.keep_open(self.tr(
                    "Not recorded: the history could not be written. Nothing was changed; "
                    "press Confirm and record to try again."))
                self.window.messenger.error(self.tr("Decision not recorded"), f"{exc}\n\n" + self.tr(
                    "The plan in force and the open document are unchanged; the decision "
                    "dialog stays open so that you can confirm again."))
            else:
                self.window.messenger.error(self.tr("Decision not recorded"),
                                            self.tr("{error}\n\nThe plan in force is unchanged.").format(error=exc))
            return None
        self.window.settings.setValue(KEY_SUPERVISOR, by)
        stack = self.doc.undo_stack
        title = proposal_title(proposal)
        stack.beginMacro(self.tr("{title} (decision #{number})").format(title=title, number=number))
        if proposal.event == EVENT_PULL:
            stack.push(RemoveJob(self.doc, proposal.job, title))
        if proposal.machine is not None and proposal.event in (EVENT_DOWN, EVENT_UP):
            m = recorded_shop.machines[proposal.machine]
            stack.push(SetMachineFields(self.doc, proposal.machine,
                                        {"state": m.state, "state_note": note,
                                         "state_changed": datetime.now(timezone.utc)},
                                        title))
        if proposal.job_changes:
            stack.push(SetJobsState(self.doc, proposal.job_changes, title))
        stack.push(SetPlanInForce(self.doc, recorded_shop.plan_in_force, self.tr("plan in force")))
        stack.endMacro()
        # Show the plan just put in force (not a fresh solve of the same shop, which would
        # ignore the move penalties the re-dispatch paid) until the next edit.
        self.window.show_plan_in_force(proposal.plan, self.tr("decision #{number} ({title})").format(
            number=number, title=title))
        self.window.statusBar().showMessage(self.tr("Decision #{number} recorded: {title}").format(
            number=number, title=title), 8000)
        self.recorded.emit(number)
        return number

