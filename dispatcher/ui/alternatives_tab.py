"""The alternatives tab: the ranked plans of :mod:`dispatcher.ui.alternatives_view` and
the background job that ranks them.

:class:`AlternativesTab` is a part of the main window, created in its constructor, with
its own :class:`~dispatcher.ui.worker.BackgroundRunner`. *Put this plan in force…* opens
the window's decision dialog (:class:`~dispatcher.ui.decision_flow.DecisionFlow`).
"""

from __future__ import annotations

from PySide6.QtCore import QObject

from dispatcher.history import diff_plans
from dispatcher.shop.alternatives import alternative_plans
from dispatcher.ui.alternatives_view import AlternativesView
from dispatcher.shop.planning import MODE_ROUND
from dispatcher.shop.proposal import EVENT_CONFIRM, Proposal
from dispatcher.ui.decision import DecisionDialog
from dispatcher.ui.worker import BackgroundRunner


class AlternativesTab(QObject):
    """``view`` (the widget the window puts in its tabs) and ``runner`` (its worker)."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.view = AlternativesView(window)
        self.runner = BackgroundRunner(self)
        self.runner.finished.connect(self._on_done)
        self.runner.failed.connect(lambda exc: window.show_warning(
            self.tr("ranking plans failed: {error}").format(error=exc)))
        self.runner.cancelled.connect(lambda: self.view.show_message(self.tr("Ranking cancelled")))
        self.view.find_requested.connect(self.find)
        self.view.put_in_force.connect(self.put_in_force)

    def find(self, count: int) -> None:
        """Rank the ``count`` best plans of the plan shown, in the background."""
        window, view = self.window, self.view
        plan = window.plan
        if plan is None:
            view.show_message(self.tr("No plan yet"))
            return
        if window.mode != MODE_ROUND:
            view.show_message(self.tr("Alternatives are ranked for one dispatch round (Plan menu: One round)"))
            return
        if plan.objective == "bottleneck":
            view.show_message(self.tr("Alternatives are ranked for the 'least total' and 'most value' objectives"))
            return
        unit = window.doc.shop.unit.label()
        view.show_message(self.tr("Ranking plans\u2026"))
        self.runner.submit(lambda cancel: (alternative_plans(plan, count, cancel), unit),
                           "alternatives")

    def _on_done(self, result) -> None:
        plans, unit = result
        self.view.show_plans(plans, unit)

    def put_in_force(self, plan, rank: int) -> DecisionDialog:
        """Open the decision dialog for alternative number ``rank``."""
        flow = self.window.decisions
        before, _ = flow.plan_in_force()
        shop = self.window.doc.shop.copy()
        diff = diff_plans(before, plan.to_json()) if before else None
        proposal = Proposal(EVENT_CONFIRM, self.tr("Put plan #{rank} of the alternatives in force").format(
            rank=rank), shop, plan, diff)
        return flow.show(proposal)
