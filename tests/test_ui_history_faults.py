"""The app when the history server goes away, against the real test server stopped with
``pg_ctl stop``: confirming a decision gives one clear message, the open document is kept
as it was, and the dialog stays open, so confirming again once the server is back records
the decision (exactly once).

Outside reference: an independent store object (its own connection) counts what reached
the server.
"""

from __future__ import annotations

from PySide6.QtWidgets import QDialogButtonBox

from dispatcher.history import open_history
from dispatcher.io.shopfile import shop_to_dict
from dispatcher.shop import DOWN
from ui_support import make_window, wait_plan


def test_server_stopped_when_confirming_keeps_the_document_and_allows_a_retry(
        qtbot, tmp_path, monkeypatch, samples, pg_server, pg_location):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")
    assert window.settings_ctl.apply(pg_location, "", 1), window.messenger.messages
    assert window.history.kind == "postgresql" and window.history.count() == 0
    shop = window.doc.shop
    col = shop.machine_names().index(window.plan.assignments[0].machine)
    dialog = window.decisions.machine_event("down", col)
    qtbot.waitUntil(dialog.isVisible)
    before, steps, dirty = shop_to_dict(shop), window.doc.undo_stack.count(), window.doc.dirty
    pg_server.stop()
    try:
        dialog.confirm("late-shift lead", "hydraulic leak")
        [(kind, title, text)] = window.messenger.messages
        assert (kind, title) == ("error", "Decision not recorded")
        assert "cannot be reached" in text and "confirm again" in text
        assert dialog.isVisible() and dialog.retry_note.isVisible()
        assert dialog.by.text() == "late-shift lead"
        assert dialog.note.toPlainText() == "hydraulic leak"
        assert shop_to_dict(window.doc.shop) == before and window.doc.shop is shop
        assert window.doc.undo_stack.count() == steps and window.doc.dirty == dirty
        assert shop.machines[col].state != DOWN
    finally:
        pg_server.start()
    # Back: the same dialog, confirmed again, records the decision once.
    with qtbot.waitSignal(window.decision_recorded):
        dialog.buttons.button(QDialogButtonBox.StandardButton.Ok).click()
    wait_plan(qtbot, window)
    qtbot.waitUntil(lambda: window.decisions.dialog is None)  # closed (and deleted)
    assert len(window.messenger.messages) == 1
    assert shop.machines[col].state == DOWN
    other = open_history(pg_location)
    try:
        assert other.count() == 1
        latest = other.latest()
        assert (latest.by, latest.note) == ("late-shift lead", "hydraulic leak")
    finally:
        other.close()
        window.history.close()
