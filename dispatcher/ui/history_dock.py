"""The history dock: the decision list of :mod:`dispatcher.ui.history_panel` in a dock
widget (View ▸ History, Ctrl+H), and *Restore…*.

:class:`HistoryDock` is a part of the main window, created in its constructor.
"""

from __future__ import annotations

import threading

from PySide6.QtCore import QCoreApplication, QObject, QTimer, Signal
from PySide6.QtGui import QKeySequence
from PySide6.QtWidgets import QDockWidget

from dispatcher.history import HistoryError, HistoryInputError, HistoryStore
from dispatcher.io.shopfile import ShopFileError, shop_from_dict
from dispatcher.ui import asking
from dispatcher.ui.history_panel import HistoryPanel
from dispatcher.ui.settings_keys import KEY_SUPERVISOR
from dispatcher.ui.worker import BackgroundRunner

#: While the dock is shown, how often it looks for decisions recorded by other stations.
POLL_MS = 3000
#: How long the listening thread waits for a notification before looking whether it
#: should stop, and how long it waits after a fault before connecting again (seconds).
LISTEN_WAIT_S, LISTEN_RETRY_S = 1.0, 5.0


class _Relay(QObject):
    """Carries the listening thread's news to the window's thread (a queued signal)."""

    news = Signal()


class NewsListener:
    """Off the GUI thread, waits on the store's listener (PostgreSQL LISTEN/NOTIFY) and
    emits ``relay.news`` when another station has recorded a decision. A fault only
    pauses it (the poll keeps the panel current meanwhile); :meth:`stop` ends it within
    :data:`LISTEN_WAIT_S`."""

    def __init__(self, store):
        self.store = store
        self.relay = _Relay()
        self._stop = threading.Event()
        self.thread = threading.Thread(target=self._run, name="history-listen", daemon=True)
        self.listening = threading.Event()  # set while a LISTEN connection is open

    def start(self) -> None:
        self.thread.start()

    def stop(self) -> None:
        self._stop.set()

    def _run(self) -> None:
        listener = self.store.listener()
        try:
            while not self._stop.is_set():
                try:
                    got = listener.wait(LISTEN_WAIT_S)
                    self.listening.set()
                except HistoryError:
                    self.listening.clear()
                    self._stop.wait(LISTEN_RETRY_S)
                    continue
                if got and not self._stop.is_set():
                    try:
                        self.relay.news.emit()
                    except RuntimeError:  # the window is gone
                        return
        finally:
            listener.close()


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
        self._again = False
        self.poller = BackgroundRunner(self)
        self.poller.finished.connect(self._polled)
        self.poll_timer = QTimer(self)
        self.poll_timer.setInterval(POLL_MS)
        self.poll_timer.timeout.connect(self._poll)
        self.visibilityChanged.connect(self._watch)
        # On PostgreSQL a notification from the recording transaction makes the check at
        # once; the poll stays as the fallback (and is the only way on SQLite).
        self.news: NewsListener | None = None

    def _watch(self, visible: bool) -> None:
        """Watch for other stations' decisions while shown, not while hidden."""
        self.stop_listening()
        if not visible:
            self.poll_timer.stop()
            return
        self.poll_timer.start()
        if self.window_.history.listener() is not None:
            self.news = NewsListener(self.window_.history)
            self.news.relay.news.connect(self._poll)
            self.news.start()

    def stop_listening(self) -> None:
        if self.news is not None:
            self.news.stop()
            self.news = None

    def _poll(self) -> None:
        if self.poller.is_busy():
            self._again = True  # news during a check: check once more after it
            return
        self._again = False
        store = self.window_.history
        self.poller.submit(lambda cancel: (store, store.newest_id()), "history poll")

    def _polled(self, result) -> None:
        store, newest = result
        if self._again:
            QTimer.singleShot(0, self._poll)
        if store is self.window_.history and newest != self._seen:
            self._seen = newest
            self.panel.refresh()

    def set_store(self, store: HistoryStore) -> None:
        self.panel.set_store(store)
        if self.isVisible():
            self._watch(True)

    def refresh(self) -> None:
        self.panel.refresh()

    def restore(self, decision_id: int, by: str | None = None) -> int | None:
        """Record "restored from #decision_id" and open that decision's shop; asks for the
        supervisor name when ``by`` is None. Returns the new decision's number."""
        window = self.window_
        if by is None:
            by = str(window.settings.value(KEY_SUPERVISOR, ""))
            by, ok = asking.get_text(window, self.tr("Restore decision"),
                                     self.tr("Restore decision #{number}: supervisor name").format(
                                         number=decision_id),
                                     self.tr("Who records the restored plan as a new decision"), text=by)
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
