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


def test_history_dock_learns_of_another_process_decision_by_notification(
        qtbot, tmp_path, monkeypatch, samples, pg_location):
    """On PostgreSQL the panel hears of another process's decision from the NOTIFY its
    recording transaction sends: the poll is slowed to ten minutes here, so only the
    notification can bring the decision in within the few seconds allowed. Outside
    reference: the other station is a separate ``dispatcher solve --record`` process."""
    import os
    import subprocess
    import sys

    window = make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")
    assert window.settings_ctl.apply(pg_location, "", 1), window.messenger.messages
    window.show()
    dock = window.history_dock
    dock.poll_timer.setInterval(600_000)
    dock.toggleViewAction().trigger()
    qtbot.waitUntil(dock.isVisible)
    assert dock.news is not None
    qtbot.waitUntil(dock.news.listening.is_set, timeout=10_000)
    qtbot.waitUntil(lambda: not dock.poller.is_busy())
    assert dock.panel.model.rowCount() == 0
    env = dict(os.environ, DISPATCHER_STATION="B", PYTHONPATH=os.getcwd())
    done = subprocess.run(
        [sys.executable, "-m", "dispatcher", "solve", str(samples / "small_moulding_cell.dshop"),
         "--record", "--by", "night-shift lead", "--reason", "other", "--history", pg_location],
        env=env, capture_output=True, text=True, timeout=120)
    assert done.returncode == 0, done.stderr
    qtbot.waitUntil(lambda: dock.panel.model.rowCount() == 1, timeout=4000)
    assert dock.panel.model.decision(0).station == "B"
    assert dock.panel.model.decision(0).by == "night-shift lead"
    listening = dock.news
    dock.toggleViewAction().trigger()
    qtbot.waitUntil(lambda: not dock.isVisible())
    assert dock.news is None and not dock.poll_timer.isActive()
    listening.thread.join(timeout=5)
    assert not listening.thread.is_alive()
    window.history.close()


def test_history_dock_on_sqlite_polls_without_a_listener(qtbot, tmp_path, monkeypatch,
                                                         samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")
    window.show()
    window.history_dock.toggleViewAction().trigger()
    qtbot.waitUntil(window.history_dock.isVisible)
    assert window.history.listener() is None and window.history_dock.news is None
    assert window.history_dock.poll_timer.isActive()
