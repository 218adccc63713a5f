"""The flows of docs/app.md that had no key-driven test yet, driven from the keyboard alone:
menus through their access keys (Alt and the underlined letter, then the entry's letter),
tabs by Alt and their letter, buttons by their mnemonics, values typed into the grid,
dialogs answered by typing and Return. test_ui_flows.py and test_ui_window.py drive the
shortcut keys (Ctrl+D, Ctrl+R, Ctrl+Return, ...); this file covers the rest, and checks
that no two entries of a menu share an access key (in English, German and Spanish), which
would make the letter cycle between them instead of choosing one.
"""

from __future__ import annotations

import re

import pytest
from PySide6.QtCore import Qt, QTimer
from PySide6.QtWidgets import QApplication, QInputDialog, QMenu
from ui_support import activate, make_window, save_shot, wait_plan

from conftest import SAMPLES
from dispatcher import translation
from dispatcher.shop import DONE, MAINTENANCE
from dispatcher.ui.grid_model import FIRST_MACHINE_COL

ALT = Qt.KeyboardModifier.AltModifier
CTRL = Qt.KeyboardModifier.ControlModifier
MOULDING = "small_moulding_cell.dshop"
CREWED = "crewed_fabrication_cell.dshop"


@pytest.fixture
def window(qtbot, tmp_path, monkeypatch):
    w = make_window(qtbot, tmp_path, monkeypatch, SAMPLES / MOULDING)
    activate(qtbot, w)
    w.view.setFocus()
    return w


def _key(qtbot, widget, key, modifiers=Qt.KeyboardModifier.NoModifier) -> None:
    qtbot.keyClick(widget, key, modifiers)


def _menu_entry(qtbot, window, menu_key, entry_key) -> None:
    """Alt+menu_key opens a menu of the menu bar, entry_key chooses its entry."""
    activate(qtbot, window)
    window.view.setFocus()
    _key(qtbot, window.view, menu_key, ALT)
    qtbot.waitUntil(lambda: isinstance(QApplication.activePopupWidget(), QMenu), timeout=5000)
    _key(qtbot, QApplication.activePopupWidget(), entry_key)


def _type_into_next_dialog(qtbot, text: str, seen: list) -> None:
    """Type ``text`` into the next modal dialog's focused field and press Return."""

    tries = [0]

    def attempt() -> None:
        dialog = QApplication.activeModalWidget()
        if not isinstance(dialog, QInputDialog):
            tries[0] += 1
            if tries[0] < 500:  # gives up after about 5 s, so no timer outlives its test
                QTimer.singleShot(10, attempt)
            return
        field = dialog.focusWidget()
        field.selectAll() if hasattr(field, "selectAll") else None
        qtbot.keyClicks(field, text)
        seen.append(dialog.windowTitle())
        qtbot.keyClick(field, Qt.Key.Key_Return)

    QTimer.singleShot(0, attempt)


def _access_keys(menu: QMenu) -> list[str]:
    keys = []
    for a in menu.actions():
        m = re.search(r"&([^&])", a.text().replace("&&", ""))
        if m and a.isVisible() and not a.isSeparator():
            keys.append(m.group(1).lower())
    return keys


@pytest.mark.parametrize("language", ["en", "de", "es"])
def test_no_two_entries_of_a_menu_share_an_access_key(qtbot, tmp_path, monkeypatch, language):
    translation.install(language)
    try:
        w = make_window(qtbot, tmp_path, monkeypatch, SAMPLES / MOULDING)
        clashes = []
        tops = [a.text() for a in w.menuBar().actions()]
        top_keys = [re.search(r"&([^&])", t).group(1).lower() for t in tops if "&" in t]
        if len(top_keys) != len(set(top_keys)):
            clashes.append(f"menu bar: {tops}")
        for top in w.menuBar().actions():
            keys = _access_keys(top.menu())
            dup = sorted({k for k in keys if keys.count(k) > 1})
            if dup:
                clashes.append(f"{top.text()}: {dup} in {[a.text() for a in top.menu().actions() if a.text()]}")
        assert not clashes, "\n".join(clashes)
    finally:
        translation.install("en")


def test_type_values_into_the_grid_with_arrows_and_enter(qtbot, tmp_path, monkeypatch):
    window = make_window(qtbot, tmp_path, monkeypatch, SAMPLES / MOULDING)
    activate(qtbot, window)
    view, doc = window.view, window.doc
    view.setFocus()
    view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    _key(qtbot, view, Qt.Key.Key_Down)
    _key(qtbot, view, Qt.Key.Key_Right)
    assert (view.currentIndex().row(), view.currentIndex().column()) == (1, FIRST_MACHINE_COL + 1)
    before = doc.value_at(1, 1)
    qtbot.keyClicks(view, "1")                  # the first key opens the cell's editor
    qtbot.keyClicks(view.focusWidget(), "2,5")  # a decimal comma is accepted
    _key(qtbot, view.focusWidget(), Qt.Key.Key_Return)   # the delegate commits on the next turn
    qtbot.waitUntil(lambda: doc.value_at(1, 1) != before, timeout=5000)
    assert doc.value_at(1, 1) == 12.5, (doc.value_at(1, 1), window.statusBar().currentMessage())
    wait_plan(qtbot, window)
    view.setFocus()
    _key(qtbot, view, Qt.Key.Key_Up)
    assert view.currentIndex().row() == 0, view.currentIndex().row()
    qtbot.keyClicks(view, "x")
    _key(qtbot, view.focusWidget(), Qt.Key.Key_Return)
    qtbot.waitUntil(lambda: doc.value_at(0, 1) is None, timeout=5000)
    wait_plan(qtbot, window)                              # "x": the machine cannot run the job
    view.setFocus()
    _key(qtbot, view, Qt.Key.Key_Z, CTRL)
    qtbot.waitUntil(lambda: doc.value_at(0, 1) is not None, timeout=5000)
    wait_plan(qtbot, window)


def test_machine_menu_by_access_keys_add_machine_maintenance_slots(qtbot, window):
    doc = window.doc
    n = doc.n_machines()
    seen: list[str] = []
    _type_into_next_dialog(qtbot, "Press K (keyboard test)", seen)
    _menu_entry(qtbot, window, Qt.Key.Key_M, Qt.Key.Key_M)      # Machine > Add machine...
    qtbot.waitUntil(lambda: doc.n_machines() == n + 1, timeout=5000)
    assert doc.machine_at(n).name == "Press K (keyboard test)" and seen
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    window.view.setFocus()
    _menu_entry(qtbot, window, Qt.Key.Key_M, Qt.Key.Key_N)      # Machine > Machine in maintenance
    qtbot.waitUntil(lambda: doc.machine_at(0).state == MAINTENANCE, timeout=5000)
    _type_into_next_dialog(qtbot, "2", seen)
    _menu_entry(qtbot, window, Qt.Key.Key_M, Qt.Key.Key_S)      # Machine > Set slots...
    qtbot.waitUntil(lambda: doc.machine_at(0).slots == 2, timeout=5000)
    wait_plan(qtbot, window)


def test_job_menu_by_access_keys_mark_done(qtbot, window):
    doc = window.doc
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    job = doc.job_at(0).name
    _menu_entry(qtbot, window, Qt.Key.Key_J, Qt.Key.Key_D)      # Job > Mark job done
    qtbot.waitUntil(lambda: all(j.name != job or j.state == DONE for j in doc.shop.jobs), timeout=5000)
    wait_plan(qtbot, window)


def test_alternatives_found_and_put_in_force_by_keys(qtbot, window, tmp_path):
    activate(qtbot, window)
    _key(qtbot, window, Qt.Key.Key_A, ALT)                               # the Alternatives tab
    tab = window.alternatives_tab.view
    assert window.tabs.currentWidget() is tab
    tab.find.setFocus()
    _key(qtbot, tab, Qt.Key.Key_N, ALT)                                  # Find best plans
    qtbot.waitUntil(lambda: tab.list.count() > 1, timeout=20_000)
    tab.list.setFocus()
    _key(qtbot, tab.list, Qt.Key.Key_Down)
    assert tab.list.currentRow() >= 0
    save_shot(window, tmp_path, "alternatives_by_keys")
    before = len(window.history.list())
    _key(qtbot, tab, Qt.Key.Key_I, ALT)                                  # Put this plan in force...
    qtbot.waitUntil(lambda: window.decisions.dialog is not None and window.decisions.dialog.isVisible(),
                    timeout=5000)
    dialog = window.decisions.dialog
    dialog.by.setFocus()
    qtbot.keyClicks(dialog.by, "Supervisor A")
    _key(qtbot, dialog, Qt.Key.Key_Return)
    qtbot.waitUntil(lambda: len(window.history.list()) == before + 1, timeout=5000)


def test_crew_tab_by_alt_r_and_space(qtbot, tmp_path, monkeypatch):
    w = make_window(qtbot, tmp_path, monkeypatch, SAMPLES / CREWED)
    activate(qtbot, w)
    _key(qtbot, w, Qt.Key.Key_R, ALT)
    assert w.tabs.currentWidget() is w.crew_tab.view
    table = w.crew_tab.table
    table.setFocus()
    model = table.model()
    table.setCurrentIndex(model.index(0, model.columnCount() - 1))
    before = model.data(table.currentIndex(), Qt.ItemDataRole.CheckStateRole)
    _key(qtbot, table, Qt.Key.Key_Space)
    qtbot.waitUntil(lambda: model.data(table.currentIndex(), Qt.ItemDataRole.CheckStateRole) != before,
                    timeout=5000)
    wait_plan(qtbot, w)


def test_history_restore_by_keys(qtbot, window):
    window.decisions.confirm_plan().confirm("Supervisor A")
    wait_plan(qtbot, window)
    activate(qtbot, window)
    _key(qtbot, window, Qt.Key.Key_H, CTRL)
    panel = window.history_dock.panel
    qtbot.waitUntil(lambda: panel.table.model().rowCount() == 1, timeout=5000)
    panel.table.setFocus()
    _key(qtbot, panel.table, Qt.Key.Key_Home)
    _key(qtbot, panel.table, Qt.Key.Key_Space)
    qtbot.waitUntil(lambda: panel.selected_ids() == [1], timeout=5000)
    seen: list[str] = []
    _type_into_next_dialog(qtbot, "Supervisor B", seen)
    _key(qtbot, panel, Qt.Key.Key_S, ALT)                                 # Restore...
    qtbot.waitUntil(lambda: len(window.history.list()) == 2, timeout=5000)
    assert seen
    wait_plan(qtbot, window)


def test_alt_letters_of_the_window_are_unique_on_every_tab(qtbot, tmp_path, monkeypatch):
    """Alt and a letter opens a menu, switches a tab or presses a button: on each tab, with
    the history panel shown, no two of those visible at once share the letter (Qt would
    then cycle focus between them instead of acting)."""
    from PySide6.QtWidgets import QAbstractButton, QLabel

    w = make_window(qtbot, tmp_path, monkeypatch, SAMPLES / MOULDING)
    activate(qtbot, w)
    w.history_dock.show()
    clashes = []
    for k in range(w.tabs.count()):
        w.tabs.setCurrentIndex(k)
        QApplication.processEvents()
        owners: dict[str, list[str]] = {}
        texts = [a.text() for a in w.menuBar().actions()]
        texts += [w.tabs.tabText(i) for i in range(w.tabs.count())]
        texts += [b.text() for b in w.findChildren(QAbstractButton) if b.isVisible() and b.text()]
        texts += [label.text() for label in w.findChildren(QLabel)   # a label's letter focuses its field
                  if label.isVisible() and label.buddy() is not None]
        for text in texts:
            m = re.search(r"&([^&])", text.replace("&&", ""))
            if m:
                owners.setdefault(m.group(1).lower(), []).append(text)
        clashes += [f"tab {w.tabs.tabText(k)!r}: Alt+{key.upper()} {names}"
                    for key, names in owners.items() if len(names) > 1]
    assert not clashes, "\n".join(dict.fromkeys(clashes))
