"""Views added to the main window beside the grid: the what-if map, alternatives, the
history panel, and printing. Each view is its own module; this one wires them in.

What-if costs and alternatives are computed in their own background runner, only while
their tab is showing, so they never slow down editing.
"""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtGui import QKeySequence
from PySide6.QtWidgets import QDockWidget, QFileDialog, QInputDialog

from dispatcher.history import HistoryError, HistoryInputError
from dispatcher.io.shopfile import ShopFileError, shop_from_dict
from dispatcher.ui.alternatives_data import alternative_plans
from dispatcher.ui.alternatives_view import AlternativesView
from dispatcher.ui.decision import EVENT_CONFIRM, DecisionDialog, Proposal
from dispatcher.ui.history_panel import HistoryPanel
from dispatcher.ui.solving import snapshot
from dispatcher.ui.whatif_data import what_if_grid
from dispatcher.ui.whatif_view import WhatIfView
from dispatcher.ui.worker import BackgroundRunner
from dispatcher.history import diff_plans


def install(window) -> None:
    """Add the extra views and their menu entries to ``window``."""
    window.side_runner = BackgroundRunner(window)
    window.side_handlers = {}
    window.side_runner.finished.connect(
        lambda result: window.side_handlers[result[0]](*result[1:]))
    window.side_runner.failed.connect(lambda exc: window.show_warning(f"background job failed: {exc}"))
    _install_whatif(window)
    _install_alternatives(window)
    _install_history(window)
    _install_printing(window)


# ---- what-if ------------------------------------------------------------------------------
def _install_whatif(window) -> None:
    view = WhatIfView(window)
    window.whatif_view = view
    window.whatif_tab = window.tabs.addTab(view, "&What-if map")

    def refresh() -> None:
        if window.tabs.currentWidget() is not view:
            return
        plan = window.plan
        if plan is None:
            view.show_message("No plan yet")
            return
        if window.mode != "round":
            view.show_message("What-if costs are for one dispatch round (Plan menu: One round)")
            return
        if plan.objective == "bottleneck":
            view.show_message("What-if costs are for the 'least total' and 'most value' objectives "
                              "(switch in the Plan menu)")
            return
        shop = snapshot(window.doc.shop)
        unit = window.doc.shop.unit.label()
        view.status.setText("Computing\u2026")
        window.side_runner.submit(lambda cancel: ("whatif", shop, what_if_grid(plan), unit),
                                  "what-if")

    window.side_handlers["whatif"] = view.show_grid
    window.refresh_whatif = refresh
    window.tabs.currentChanged.connect(lambda _: refresh())
    window.plan_shown.connect(lambda _: refresh())


# ---- alternatives ---------------------------------------------------------------------------
def _install_alternatives(window) -> None:
    view = AlternativesView(window)
    window.alternatives_view = view
    window.tabs.addTab(view, "&Alternatives")

    def find(count: int) -> None:
        plan = window.plan
        if plan is None:
            view.show_message("No plan yet")
            return
        if window.mode != "round":
            view.show_message("Alternatives are ranked for one dispatch round (Plan menu: One round)")
            return
        if plan.objective == "bottleneck":
            view.show_message("Alternatives are ranked for the 'least total' and 'most value' objectives")
            return
        unit = window.doc.shop.unit.label()
        view.show_message("Ranking plans\u2026")
        window.side_runner.submit(
            lambda cancel: ("alternatives", alternative_plans(plan, count), unit), "alternatives")

    def put_in_force(plan, rank: int) -> DecisionDialog:
        before, _ = window.plan_in_force()
        shop = snapshot(window.doc.shop)
        diff = diff_plans(before, plan.to_json()) if before else None
        proposal = Proposal(EVENT_CONFIRM, f"Put plan #{rank} of the alternatives in force",
                            shop, plan, diff)
        return window.show_decision(proposal)

    window.side_handlers["alternatives"] = view.show_plans
    window.find_alternatives = find
    window.put_alternative_in_force = put_in_force
    view.find_requested.connect(find)
    view.put_in_force.connect(put_in_force)


# ---- history ------------------------------------------------------------------------------
def _install_history(window) -> None:
    panel = HistoryPanel(window.history, window)
    window.history_panel = panel
    dock = QDockWidget("History", window)
    dock.setObjectName("historyDock")
    dock.setWidget(panel)
    window.addDockWidget(Qt.DockWidgetArea.BottomDockWidgetArea, dock)
    window.history_dock = dock
    dock.hide()
    window.view_menu.addAction(dock.toggleViewAction())
    dock.toggleViewAction().setShortcut(QKeySequence("Ctrl+H"))
    dock.visibilityChanged.connect(lambda visible: panel.refresh() if visible else None)
    window.decision_recorded.connect(lambda _: panel.refresh())
    panel.message.connect(window.show_warning)

    def restore(decision_id: int, by: str | None = None) -> int | None:
        if by is None:
            by = str(window.settings.value("history/supervisor", ""))
            by, ok = QInputDialog.getText(window, "Restore decision",
                                          f"Restore decision #{decision_id}: supervisor name", text=by)
            if not ok or not by.strip():
                return None
        try:
            decision = window.history.get(decision_id)
            shop = shop_from_dict(decision.shop_document, f"decision #{decision_id}", check=False)
        except (HistoryError, ShopFileError) as exc:
            window.messenger.error("Cannot restore", str(exc))
            return None
        if not window.files.maybe_keep_changes():
            return None
        try:
            number = window.history.restore(decision_id, by=by)
        except (HistoryError, HistoryInputError) as exc:
            window.messenger.error("Cannot restore", str(exc))
            return None
        path = window.doc.path
        window.doc.replace(shop, path)
        window.doc.undo_stack.resetClean()
        window.doc.dirty_changed.emit(True)
        window.statusBar().showMessage(f"Decision #{decision_id} restored as #{number}", 8000)
        window.decision_recorded.emit(number)
        return number

    window.restore_decision = restore
    panel.restore_requested.connect(lambda n: restore(n))


# ---- printing -----------------------------------------------------------------------------
def _install_printing(window) -> None:
    from dispatcher.ui import printing

    def pdf() -> None:
        path, _ = QFileDialog.getSaveFileName(window, "Export dispatch sheet", window._folder(),
                                              "PDF (*.pdf)")
        if path:
            printing.export_pdf(window, path if path.lower().endswith(".pdf") else path + ".pdf")

    acts = [window._action("Print pre&view\u2026", lambda: printing.preview(window), None,
                           "See the dispatch sheet as it will print"),
            window._action("&Print sheet\u2026", lambda: printing.print_now(window),
                           QKeySequence.StandardKey.Print, "Print the dispatch sheet"),
            window._action("Export sheet as P&DF\u2026", pdf, None, "Write the dispatch sheet to a PDF")]
    window.file_menu.insertActions(window._print_anchor, acts)
    window.print_actions = acts
