"""The history dock: the decision list of :mod:`dispatcher.ui.history_panel` in a dock
widget (View ▸ History, Ctrl+H), and *Restore…*.

:class:`HistoryDock` is a part of the main window, created in its constructor.
"""

from __future__ import annotations

from PySide6.QtCore import QCoreApplication, QTimer
from PySide6.QtGui import QKeySequence
from PySide6.QtWidgets import QDockWidget, QInputDialog

from dispatcher.history import HistoryError, HistoryInputError, HistoryStore
from dispatcher.io.shopfile import ShopFileError, shop_from_dict
from dispatcher.ui.history_panel import HistoryPanel
from dispatcher.ui.settings_keys import KEY_SUPERVISOR
from dispatcher.ui.worker import BackgroundRunner

#: While the dock is shown, how often it looks for decisions recorded by other stations.
POLL_MS = 3000


class HistoryDock(QDockWidget):
    """The dock (hidden at start) with ``panel``; its toggle action has Ctrl+H.

    ``restored(decision_id)`` after a restore recorded a new decision.
    """

    def __init__(self, window):
        super().__init__(QCoreApplication.translate("HistoryDock", "History"), window)
        self.setObjectName("historyDock")
        self.window_ = window
        self.panel = HistoryPanel(window.history, self)
        self.setWidget(self.panel)
        self.setAccessibleName(self.tr("History"))
        self.setAccessibleDescription(self.tr("The decisions recorded for this shop: filter, compare, restore"))
        self.toggleViewAction().setShortcut(QKeySequence("Ctrl+H"))
        self.toggleViewAction().setStatusTip(self.tr("Show or hide the recorded decisions"))
        self.visibilityChanged.connect(lambda visible: self.panel.refresh() if visible else None)
        self.panel.message.connect(window.show_warning)
        self.panel.restore_requested.connect(lambda n: self.restore(n))
        # Other stations' decisions appear within a few seconds: a cheap newest-number check
        # off the GUI thread while the dock is visible; the list is re-read when it changes.
        self._seen = -1
        self.poller = BackgroundRunner(self)
        self.poller.finished.connect(self._polled)
        self.poll_timer = QTimer(self)
        self.poll_timer.setInterval(POLL_MS)
        self.poll_timer.timeout.connect(self._poll)
        self.visibilityChanged.connect(
            lambda visible: self.poll_timer.start() if visible else self.poll_timer.stop())

    def _poll(self) -> None:
        if not self.poller.is_busy():
            store = self.window_.history
            self.poller.submit(lambda cancel: (store, store.newest_id()), "history poll")

    def _polled(self, result) -> None:
        store, newest = result
        if store is self.window_.history and newest != self._seen:
            self._seen = newest
            self.panel.refresh()

    def set_store(self, store: HistoryStore) -> None:
        self.panel.set_store(store)

    def refresh(self) -> None:
        self.panel.refresh()

    def restore(self, decision_id: int, by: str | None = None) -> int | None:
        """Record "restored from #decision_id" and open that decision's shop; asks for the
        supervisor name when ``by`` is None. Returns the new decision's number."""
        window = self.window_
        if by is None:
            by = str(window.settings.value(KEY_SUPERVISOR, ""))
            by, ok = QInputDialog.getText(window, self.tr("Restore decision"),
                                          self.tr("Restore decision #{number}: supervisor name").format(
                                              number=decision_id), text=by)
            if not ok or not by.strip():
                return None
        try:
            decision = window.history.get(decision_id)
            shop = shop_from_dict(decision.shop_document, f"decision #{decision_id}", check=False)
        except (HistoryError, ShopFileError) as exc:
            window.messenger.error(self.tr("Cannot restore"), str(exc))
            return None
        if not window.files.maybe_keep_changes():
            return None
        try:
            number = window.history.restore(decision_id, by=by)
        except (HistoryError, HistoryInputError) as exc:
            window.messenger.error(self.tr("Cannot restore"), str(exc))
            return None
        doc = window.doc
        doc.replace(shop, doc.path)
        doc.undo_stack.resetClean()
        doc.dirty_changed.emit(True)
        window.statusBar().showMessage(self.tr("Decision #{number} restored as #{new}").format(
            number=decision_id, new=number), 8000)
        window.decision_recorded.emit(number)
        return number
