"""The what-if tab: the map of :mod:`dispatcher.ui.whatif_view` and the background job that
fills it.

:class:`WhatIfTab` is a part of the main window, created in its constructor. It computes
only while its view is the current tab (so it never slows down editing), in its own
:class:`~dispatcher.ui.worker.BackgroundRunner`; a newer plan or a cancel drops the
result of an older one.
"""

from __future__ import annotations

from PySide6.QtCore import QObject

from dispatcher.shop.planning import MODE_ROUND
from dispatcher.shop.whatif import what_if_grid
from dispatcher.ui.whatif_view import WhatIfView
from dispatcher.ui.worker import BackgroundRunner


class WhatIfTab(QObject):
    """``view`` (the widget the window puts in its tabs) and ``runner`` (its worker)."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.view = WhatIfView(window)
        self.runner = BackgroundRunner(self)
        self.runner.finished.connect(self._on_done)
        self.runner.failed.connect(lambda exc: window.show_warning(
            self.tr("what-if costs failed: {error}").format(error=exc)))
        self.runner.cancelled.connect(lambda: self.view.show_message(self.tr("What-if costs cancelled")))

    def is_current(self) -> bool:
        return self.window.tabs.currentWidget() is self.view

    def refresh(self) -> None:
        """Compute the map for the plan shown, if the tab is showing."""
        if not self.is_current():
            return
        window, view = self.window, self.view
        plan = window.plan
        if plan is None:
            view.show_message(self.tr("No plan yet"))
            return
        if window.mode != MODE_ROUND:
            view.show_message(self.tr("What-if costs are for one dispatch round (Plan menu: One round)"))
            return
        if plan.objective == "bottleneck":
            view.show_message(self.tr("What-if costs are for the 'least total' and 'most value' objectives "
                                      "(switch in the Plan menu)"))
            return
        shop = window.doc.shop.copy()
        unit = window.doc.shop.unit.label()
        view.status.setText(self.tr("Computing\u2026"))
        self.runner.submit(lambda cancel: (shop, what_if_grid(plan, cancel), unit), "what-if")

    def _on_done(self, result) -> None:
        shop, grid, unit = result
        self.view.show_grid(shop, grid, unit)
