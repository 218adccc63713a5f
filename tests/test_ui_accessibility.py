"""Every focusable control of the main window (each tab, the plan panel, the history panel)
and of its dialogs has an accessible name and an accessible description, as a screen
reader gets them: through Qt's accessibility interface (QAccessible), which falls back
to a button's text, a field's buddy label and a tooltip where the widget sets none.

A failure lists every control without one, with its class, object name and parent chain.
"""

from __future__ import annotations

import pytest
from PySide6.QtCore import QTimer
from PySide6.QtGui import QAccessible
from PySide6.QtWidgets import (
    QAbstractButton,
    QAbstractItemView,
    QAbstractSpinBox,
    QApplication,
    QComboBox,
    QDialog,
    QInputDialog,
    QLineEdit,
    QPlainTextEdit,
    QTabBar,
    QTextEdit,
    QWidget,
)
from ui_locale_support import chain
from ui_support import activate, make_window, wait_plan

from conftest import SAMPLES
from dispatcher.shop.proposal import EVENT_DOWN
from dispatcher.ui.grid_model import FIRST_MACHINE_COL

CREWED = "crewed_fabrication_cell.dshop"
CONTROLS = (QAbstractButton, QLineEdit, QAbstractItemView, QComboBox, QAbstractSpinBox, QPlainTextEdit,
            QTextEdit, QTabBar)
Name, Description = QAccessible.Text.Name, QAccessible.Text.Description


def _internal(w: QWidget) -> bool:
    """Parts Qt builds inside another control (the line edit of a spin box or an editable
    combo box, a tab bar's scroll buttons, a dock's title buttons): the outer control
    carries the name."""
    parent = w.parentWidget()
    return (isinstance(parent, (QAbstractSpinBox, QComboBox, QTabBar))
            or w.objectName().startswith("qt_dockwidget_"))


def missing(top: QWidget) -> list[str]:
    """Every focusable control of ``top`` without an accessible name or description."""
    out = []
    for w in [top, *top.findChildren(QWidget)]:
        if not isinstance(w, CONTROLS) or not w.isVisible() or _internal(w):
            continue
        if w.focusPolicy().value == 0:  # Qt.FocusPolicy.NoFocus
            continue
        face = QAccessible.queryAccessibleInterface(w)
        assert face is not None, chain(w)
        # what the interface reports, else the widget's own property (a tab bar's interface
        # reports its current tab's text only)
        given = {"name": face.text(Name) or w.accessibleName(),
                 "description": face.text(Description) or w.accessibleDescription()}
        lacks = [what for what, text in given.items() if not text.strip()]
        if lacks:
            out.append(f"{chain(w)}: no accessible {' and no '.join(lacks)}")
        if isinstance(w, QTabBar):
            for i in range(w.count()):
                if not w.tabText(i).strip() or not w.tabToolTip(i).strip():
                    out.append(f"{chain(w)}: tab {i} {w.tabText(i)!r} has no text or no tooltip "
                               "(its accessible name and description)")
    return out


@pytest.fixture
def window(qtbot, tmp_path, monkeypatch):
    w = make_window(qtbot, tmp_path, monkeypatch, SAMPLES / CREWED)
    activate(qtbot, w)
    return w


def test_main_window_every_tab_plan_and_history_panel(qtbot, window):
    window.decisions.confirm_plan().confirm("Supervisor A")
    wait_plan(qtbot, window)
    window.history_dock.show()
    found = []
    for k in range(window.tabs.count()):
        window.tabs.setCurrentIndex(k)
        QApplication.processEvents()
        found += [f"[tab {k}] {line}" for line in missing(window)]
    assert not found, "controls without an accessible name or description:\n" + "\n".join(
        dict.fromkeys(found))


def test_settings_and_decision_dialogs(qtbot, window):
    found = []
    settings = window.settings_ctl.open()
    qtbot.waitExposed(settings)
    found += [f"[settings] {line}" for line in missing(settings)]
    settings.reject()
    for name, dialog in (("machine down", lambda: window.decisions.machine_event(EVENT_DOWN, 0)),
                         ("put in force", window.decisions.confirm_plan)):
        d = dialog()
        qtbot.waitExposed(d)
        found += [f"[{name}] {line}" for line in missing(d)]
        d.reject()
    assert not found, "controls without an accessible name or description:\n" + "\n".join(found)


@pytest.mark.parametrize("name", ["add_job", "add_machine", "wait_penalty", "slots", "restore"])
def test_input_dialogs(qtbot, window, name):
    """The one-value dialogs (dispatcher.ui.asking): the field, OK and Cancel."""
    if name == "restore":
        window.decisions.confirm_plan().confirm("Supervisor A")
        wait_plan(qtbot, window)
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    found: list[str] = []
    seen: list[QDialog] = []

    def attempt() -> None:
        dialog = QApplication.activeModalWidget()
        if not isinstance(dialog, QInputDialog):
            QTimer.singleShot(10, attempt)
            return
        seen.append(dialog)
        found.extend(missing(dialog))
        dialog.reject()

    QTimer.singleShot(0, attempt)
    {"add_job": window.edits.ask_add_job, "add_machine": window.edits.ask_add_machine,
     "wait_penalty": window.edits.ask_penalty, "slots": window.edits.ask_slots,
     "restore": lambda: window.history_dock.restore(window.history.list(limit=1)[0].id)}[name]()
    assert seen
    assert not found, "controls without an accessible name or description:\n" + "\n".join(found)


def test_the_walk_finds_a_control_without_a_name(qtbot):
    """The check can say no: a bare line edit has neither."""
    bare = QWidget()
    qtbot.addWidget(bare)
    edit = QLineEdit(bare)
    bare.show()
    assert missing(bare) == [f"{chain(edit)}: no accessible name and no description"]
    edit.setAccessibleName("Name")
    edit.setToolTip("What it is for")
    assert missing(bare) == []
