"""Helpers shared by the app tests (pytest-qt, headless)."""

from __future__ import annotations

from pathlib import Path

import numpy as np
from PySide6.QtCore import QSettings
from scipy.optimize import linear_sum_assignment

from dispatcher import translation
from dispatcher.ui.main_window import MainWindow
from dispatcher.ui.messages import RecordingMessenger


def make_window(qtbot, tmp_path: Path, monkeypatch, path: Path | None = None) -> MainWindow:
    """A main window with its own settings file, history file and autosave folder."""
    monkeypatch.setenv("DISPATCHER_AUTOSAVE_DIR", str(tmp_path / "autosave"))
    # English as `dispatcher app` shows it: with the English plural forms ("7 days"),
    # whatever earlier tests installed or removed.
    translation.ensure_plurals()
    settings = QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)
    window = MainWindow(settings=settings, messenger=RecordingMessenger(),
                        history_path=tmp_path / "history.sqlite")
    qtbot.addWidget(window)
    if path is not None:
        assert open_file(qtbot, window, path), window.messenger.messages
    wait_plan(qtbot, window)
    return window


def open_file(qtbot, window: MainWindow, path: Path, timeout: int = 20_000) -> bool:
    """Open ``path`` as the File menu does (read in the background) and wait until it
    ends; True when the file was opened."""
    with qtbot.waitSignal(window.files.loaded, timeout=timeout) as blocker:
        assert window.open_path(path)
    return blocker.args[0]


def activate(qtbot, window) -> None:
    """Show the window and make it the active one, so keyboard shortcuts reach it
    (the offscreen platform does not activate windows by itself)."""
    import warnings

    from PySide6.QtWidgets import QApplication

    window.show()
    qtbot.waitExposed(window)
    # activateWindow() has no effect offscreen; the deprecated call is the one that works.
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", DeprecationWarning)
        QApplication.setActiveWindow(window)


def wait_plan(qtbot, window: MainWindow) -> None:
    """Wait until the background solve of the newest edit has been shown."""
    qtbot.waitUntil(lambda: not window.runner.is_busy(), timeout=20_000)
    window.runner.wait_idle()
    qtbot.waitUntil(lambda: not window.runner.is_busy(), timeout=20_000)
    # the grid's columns follow the new headings a chunk per turn of the event loop
    qtbot.waitUntil(window.columns.settled, timeout=20_000)


def reference_total(values: np.ndarray, allowed: np.ndarray) -> float:
    """Least total placing min(jobs, machines) jobs, by scipy's linear_sum_assignment
    (reference library) with forbidden pairs priced out of reach."""
    big = 1e9
    cost = np.where(allowed, values, big)
    rows, cols = linear_sum_assignment(cost)
    total = float(cost[rows, cols].sum())
    assert total < big, "reference needs a grid where every machine can be used"
    return total


def save_shot(widget, tmp_path: Path, name: str) -> Path:
    """Render ``widget`` to PNG in the test's tmp_path (look at it when a view changes)."""
    image = widget.grab()
    out = tmp_path / f"{name}.png"
    assert image.save(str(out)), f"could not write {out}"
    return out


def answer_next_dialog(fill) -> None:
    """Answer the next modal dialog (QInputDialog.getText/getInt/getDouble) the app opens:
    ``fill(dialog)`` sets its value, then it is accepted, as a user pressing OK would."""
    from PySide6.QtCore import QTimer
    from PySide6.QtWidgets import QApplication

    def attempt() -> None:
        dialog = QApplication.activeModalWidget()
        if dialog is None:
            QTimer.singleShot(10, attempt)
            return
        fill(dialog)
        dialog.accept()

    QTimer.singleShot(0, attempt)


def press(qtbot, window, key, modifiers=None) -> None:
    """Send a key press to the grid of the window, made the active window first (a closed
    dialog leaves no active window offscreen, and shortcuts need one)."""
    from PySide6.QtCore import Qt

    activate(qtbot, window)
    qtbot.keyClick(window.view, key, modifiers or Qt.KeyboardModifier.NoModifier)
