"""Settings dialog, headless with pytest-qt: the history file can be switched in the open
window (the history panel follows at once), and a file that cannot serve as a history is
refused with a message, the previous setting kept and the file left untouched."""

from __future__ import annotations

import hashlib
import sqlite3
from pathlib import Path

import pytest
from PySide6.QtCore import QSettings
from PySide6.QtWidgets import QDialogButtonBox

from dispatcher.history import SCHEMA_VERSION, HistoryStore
from dispatcher.io.shopfile import shop_to_dict
from dispatcher.ui.main_window import MainWindow
from dispatcher.ui.messages import RecordingMessenger
from dispatcher.ui.settings_dialog import ScriptedChooser
from dispatcher.ui.settings_keys import KEY_AUTOSAVE, KEY_HISTORY, KEY_SUPERVISOR
from ui_support import activate, make_window, save_shot


@pytest.fixture
def window(qtbot, tmp_path, monkeypatch, samples):
    return make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")


def _other_history(window, path: Path, by: str = "second-station lead") -> None:
    HistoryStore(path).record(shop_to_dict(window.doc.shop), window.plan.to_json(),
                              by=by, reason="other", note="recorded by another station")


def _open(qtbot, window):
    window.act_settings.trigger()
    dialog = window.settings_ctl.dialog
    qtbot.waitUntil(dialog.isVisible)
    return dialog


def _ok(dialog) -> None:
    dialog.buttons.button(QDialogButtonBox.StandardButton.Ok).click()


def test_switching_the_history_file_takes_effect_at_once(qtbot, window, tmp_path):
    assert window.act_settings in window.edit_menu.actions()
    other = tmp_path / "other.sqlite"
    _other_history(window, other)
    window.history_dock.show()
    assert window.history_dock.panel.model.rowCount() == 0
    dialog = _open(qtbot, window)
    assert dialog.history_path.text() == str(tmp_path / "history.sqlite")
    window.settings_ctl.chooser = ScriptedChooser([str(other)])
    dialog.choose_button.click()
    assert window.settings_ctl.chooser.asked == [str(tmp_path / "history.sqlite")]
    assert dialog.history_path.text() == str(other)
    dialog.supervisor.setText("cell lead")
    dialog.autosave.setValue(5)
    save_shot(dialog, tmp_path, "settings_dialog")
    _ok(dialog)
    qtbot.waitUntil(lambda: not dialog.isVisible())
    assert window.messenger.messages == []
    assert window.history.path == other
    # The panel lists the other file's decision without being asked to refresh.
    assert window.history_dock.panel.model.rowCount() == 1
    assert window.history_dock.panel.model.decision(0).by == "second-station lead"
    assert str(other) in window.history_dock.panel.where.text()
    save_shot(window.history_dock.panel, tmp_path, "history_panel_other_file")
    assert window.settings.value(KEY_HISTORY) == str(other)
    assert window.settings.value(KEY_SUPERVISOR) == "cell lead"
    assert window.files.autosave_interval_ms() == 5 * 60_000
    # The next decision goes into the new file, with the default supervisor filled in.
    decision = window.decisions.confirm_plan()
    assert decision.by.text() == "cell lead"
    with qtbot.waitSignal(window.decision_recorded):
        decision.confirm(decision.by.text(), "shift start")
    assert HistoryStore(other).count() == 2
    assert not (tmp_path / "history.sqlite").exists()
    assert window.history_dock.panel.model.rowCount() == 2


def test_a_new_window_uses_the_stored_history_file(qtbot, tmp_path, monkeypatch):
    monkeypatch.setenv("DISPATCHER_AUTOSAVE_DIR", str(tmp_path / "autosave"))
    settings = QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)
    settings.setValue(KEY_HISTORY, str(tmp_path / "kept.sqlite"))
    settings.setValue(KEY_AUTOSAVE, 3)
    window = MainWindow(settings=settings, messenger=RecordingMessenger())
    qtbot.addWidget(window)
    assert window.history.path == tmp_path / "kept.sqlite"
    assert window.files.autosave_interval_ms() == 3 * 60_000
    window.runner.wait_idle()


def _garbage(path: Path, window) -> None:
    path.write_bytes(b"these are not the decisions you are looking for\n" * 40)


def _read_only(path: Path, window) -> None:
    _other_history(window, path)
    path.chmod(0o444)


def _newer(path: Path, window) -> None:
    _other_history(window, path)
    conn = sqlite3.connect(path)
    conn.execute(f"PRAGMA user_version = {SCHEMA_VERSION + 1}")
    conn.commit()
    conn.close()


BAD = {"garbage": (_garbage, "not a dispatcher history"),
       "read-only": (_read_only, "read-only"),
       "newer-schema": (_newer, "newer version"),
       "missing-folder": (None, "does not exist")}


@pytest.mark.parametrize("kind", list(BAD))
def test_an_unusable_history_file_is_refused_and_the_setting_kept(qtbot, window, tmp_path, kind):
    make, words = BAD[kind]
    bad = tmp_path / ("no such folder" if make is None else "") / "bad.sqlite"
    if make is not None:
        make(bad, window)
        before = hashlib.sha256(bad.read_bytes()).hexdigest()
    current = window.history.path
    stored = window.settings.value(KEY_HISTORY)
    dialog = _open(qtbot, window)
    window.settings_ctl.chooser = ScriptedChooser([str(bad)])
    dialog.choose_button.click()
    _ok(dialog)
    [(level, title, text)] = window.messenger.messages
    assert level == "error" and title == "History file not changed"
    assert str(bad) in text and words in text and str(current) in text
    assert "--history" not in text   # the choice is made in this dialog, not on a command line
    assert dialog.isVisible(), "the dialog stays open so another file can be chosen"
    assert window.history.path == current
    assert window.history_dock.panel.store.path == current
    assert window.settings.value(KEY_HISTORY) == stored
    if make is not None:
        assert hashlib.sha256(bad.read_bytes()).hexdigest() == before
        bad.chmod(0o644)
    else:
        assert not bad.parent.exists()
    dialog.reject()


def test_settings_open_from_the_keyboard(qtbot, window):
    activate(qtbot, window)
    [keys] = window.act_settings.shortcuts()[:1]
    qtbot.keySequence(window.view, keys)
    qtbot.waitUntil(lambda: window.settings_ctl.dialog is not None and window.settings_ctl.dialog.isVisible())
    window.settings_ctl.dialog.reject()
