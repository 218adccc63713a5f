"""Two stations deciding for the same shop through the app: the second confirmation,
based on a plan another station has replaced meanwhile, is refused with who, where and
when, and the open document stays as it was.

Outside reference: a second, independent store object on the same history file stands
for the other station (its own connection, its own station label).
"""

from __future__ import annotations

from dispatcher.history import HistoryStore
from dispatcher.io.shopfile import shop_to_dict
from dispatcher.shop import DOWN
from ui_support import make_window, wait_plan


def test_confirming_after_another_station_recorded_is_refused(qtbot, tmp_path, monkeypatch,
                                                              samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")
    shop = window.doc.shop
    busy = window.plan.assignments[0].machine
    col = shop.machine_names().index(busy)
    dialog = window.decisions.machine_event("down", col)
    before = shop_to_dict(shop)
    other = HistoryStore(tmp_path / "history.sqlite", station="B")
    number = other.record(shop_to_dict(shop), window.plan.to_json(), by="early-shift lead",
                          reason="manual change")
    dialog.confirm("late-shift lead", "hydraulic leak")
    wait_plan(qtbot, window)
    [(kind, title, text)] = window.messenger.messages
    assert (kind, title) == ("error", "Decision not recorded")
    assert f"Decision #{number}, by early-shift lead at station B" in text
    assert "review the new proposal" in text and "plan in force is unchanged" in text
    assert shop.machines[col].state != DOWN and shop_to_dict(shop) == before
    assert other.count() == 1
    # Opened again, the dialog starts from the newer decision and is recorded.
    window.messenger.messages.clear()
    window.decisions.machine_event("down", col).confirm("late-shift lead", "hydraulic leak")
    wait_plan(qtbot, window)
    assert window.messenger.messages == [] and shop.machines[col].state == DOWN
    latest = other.latest()
    assert (latest.id, latest.replaces, latest.based_on) == (2, 1, 1)


def test_history_dock_shows_another_stations_decision_within_seconds(qtbot, tmp_path,
                                                                     monkeypatch, samples):
    from dispatcher.ui.history_dock import POLL_MS

    window = make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")
    window.show()
    dock = window.history_dock
    dock.toggleViewAction().trigger()
    qtbot.waitUntil(dock.isVisible)
    assert dock.panel.model.rowCount() == 0 and dock.poll_timer.isActive()
    other = HistoryStore(tmp_path / "history.sqlite", station="B")
    number = other.record(shop_to_dict(window.doc.shop), window.plan.to_json(),
                          by="night-shift lead", reason="other")
    qtbot.waitUntil(lambda: dock.panel.model.rowCount() == 1, timeout=POLL_MS + 7000)
    assert dock.panel.model.decision(0).id == number
    assert dock.panel.model.decision(0).station == "B"
    dock.toggleViewAction().trigger()
    qtbot.waitUntil(lambda: not dock.isVisible())
    assert not dock.poll_timer.isActive()
