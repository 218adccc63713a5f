"""Settings of a station, headless with pytest-qt on the real dialog: the station label
every decision recorded from the app carries (empty: the host name), a PostgreSQL history
chosen there, and a clear refusal when the PostgreSQL driver is not installed.

Outside references: an independent store object on the same history (its own
connection) reads back what the app recorded; the host name comes from the operating
system (``socket.gethostname``); a missing driver is a real failed import of psycopg.
"""

from __future__ import annotations

import socket
import sys

import pytest
from PySide6.QtCore import QSettings
from PySide6.QtWidgets import QDialogButtonBox

from dispatcher.history import HistoryStore, STATION_ENV, open_history
from dispatcher.ui.main_window import MainWindow
from dispatcher.ui.messages import RecordingMessenger
from dispatcher.ui.settings_keys import KEY_STATION
from ui_support import make_window


@pytest.fixture
def window(qtbot, tmp_path, monkeypatch, samples):
    monkeypatch.delenv(STATION_ENV, raising=False)
    return make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")


def _open(qtbot, window):
    window.act_settings.trigger()
    dialog = window.settings_ctl.dialog
    qtbot.waitUntil(dialog.isVisible)
    return dialog


def _ok(dialog) -> None:
    dialog.buttons.button(QDialogButtonBox.StandardButton.Ok).click()


def _decide(qtbot, window, note: str) -> int:
    decision = window.decisions.confirm_plan()
    with qtbot.waitSignal(window.decision_recorded) as got:
        decision.confirm("early-shift lead", note)
    return got.args[0]


def test_the_station_label_is_recorded_with_each_decision(qtbot, window, tmp_path, monkeypatch):
    dialog = _open(qtbot, window)
    assert dialog.station.text() == ""
    assert socket.gethostname() in dialog.station.placeholderText()
    assert dialog.station.accessibleName() and dialog.station.accessibleDescription()
    dialog.station.setText("  station B  ")
    _ok(dialog)
    qtbot.waitUntil(lambda: not dialog.isVisible())
    assert window.messenger.messages == []
    assert window.settings.value(KEY_STATION) == "station B"
    first = _decide(qtbot, window, "with a label")
    other = HistoryStore(tmp_path / "history.sqlite")
    assert other.get(first).station == "station B"
    # A new window with the same settings records with the label too.
    settings = QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)
    again = MainWindow(settings=settings, messenger=RecordingMessenger(),
                       history_path=tmp_path / "history.sqlite")
    qtbot.addWidget(again)
    assert again.history.station == "station B"
    again.runner.wait_idle()
    # Emptied, the host name is recorded.
    dialog = _open(qtbot, window)
    assert dialog.station.text() == "station B"
    dialog.station.setText("")
    _ok(dialog)
    qtbot.waitUntil(lambda: not dialog.isVisible())
    second = _decide(qtbot, window, "without a label")
    assert other.get(second).station == socket.gethostname()
    assert other.get(first).station == "station B"


def test_a_postgresql_history_chosen_in_the_settings_records_the_label(qtbot, window,
                                                                        pg_location):
    dialog = _open(qtbot, window)
    dialog.history_path.setText(pg_location)
    assert not dialog.driver_note.isVisible()
    dialog.station.setText("station C")
    _ok(dialog)
    qtbot.waitUntil(lambda: not dialog.isVisible())
    assert window.messenger.messages == []
    assert window.history.kind == "postgresql"
    number = _decide(qtbot, window, "into the server")
    other = open_history(pg_location)
    try:
        decision = other.get(number)
        assert (decision.station, decision.by) == ("station C", "early-shift lead")
        assert other.count() == 1
    finally:
        other.close()
        window.history.close()


def test_a_postgresql_history_without_the_driver_is_refused_clearly(qtbot, window, tmp_path,
                                                                     monkeypatch):
    monkeypatch.setitem(sys.modules, "psycopg", None)  # import psycopg now fails
    dialog = _open(qtbot, window)
    dialog.history_path.setText("service=plant")
    assert dialog.driver_note.isVisible()
    assert "pip install" in dialog.driver_note.text() and "psycopg" in dialog.driver_note.text()
    dialog.history_path.setText(str(tmp_path / "other.sqlite"))
    assert not dialog.driver_note.isVisible()
    dialog.history_path.setText("postgresql://plant-server/dispatch")
    _ok(dialog)
    [(kind, title, text)] = window.messenger.messages
    assert (kind, title) == ("error", "History file not changed")
    assert "psycopg" in text and "pip install" in text
    assert str(tmp_path / "history.sqlite") in text
    assert dialog.isVisible() and window.history.path == tmp_path / "history.sqlite"
    dialog.reject()
