"""Crew edits in the app beyond presence and authorisation checks: arrival and leaving
times, expiry dates, unattended machines, machine groups, removing an operator, notes,
the warning days and the length limits, each through the real widgets (keys, clicks, menu
actions, dialogs), with undo and redo, and each refusal leaving the shop as it was.

Expected values come from the sample document's JSON (read here with the json module)
and from the rules the core states (a time within the 06:00 to 14:00 shift).
"""

from __future__ import annotations

import copy
import json
from datetime import date, time

import pytest
from PySide6.QtCore import QPoint, Qt, QTimer
from PySide6.QtWidgets import QAbstractItemView, QApplication, QDialogButtonBox, QInputDialog, QLineEdit, QPlainTextEdit
from test_ui_accessibility import missing
from ui_support import activate, wait_plan

from conftest import SAMPLES
from dispatcher import limits
from dispatcher.ui.crew_model import COL_ARRIVES, COL_LABEL, COL_LEAVES, COL_NOTES, FIRST_MACHINE

SAMPLE = "crewed_fabrication_cell.dshop"
RAW = json.loads((SAMPLES / SAMPLE).read_text(encoding="utf-8"))
CTRL = Qt.KeyboardModifier.ControlModifier
SHIFT = Qt.KeyboardModifier.ShiftModifier


@pytest.fixture
def window(qtbot, open_window):
    w = open_window(SAMPLE)
    activate(qtbot, w)
    w.tabs.setCurrentWidget(w.crew_tab.view)
    w.crew_tab.table.setFocus()
    return w


def _crew(window):
    return window.doc.shop.crew


def _row(window, label: str) -> int:
    return [o.label for o in _crew(window).operators].index(label)


def _col(window, machine: str) -> int:
    return FIRST_MACHINE + window.doc.shop.machine_names().index(machine)


def _undo(qtbot, window) -> None:
    activate(qtbot, window)      # a closed dialog leaves no active window offscreen
    qtbot.keyClick(window.crew_tab.table, Qt.Key.Key_Z, CTRL)


def _redo(qtbot, window) -> None:
    activate(qtbot, window)
    qtbot.keyClick(window.crew_tab.table, Qt.Key.Key_Z, CTRL | SHIFT)


def _type_in_cell(qtbot, window, row: int, col: int, text: str) -> QLineEdit:
    """F2 on the cell, select what is there, type ``text`` and press Return."""
    table = window.crew_tab.table
    table.setFocus()
    table.setCurrentIndex(table.model().index(row, col))
    qtbot.keyClick(table, Qt.Key.Key_F2)
    editor = table.indexWidget(table.currentIndex())
    assert isinstance(editor, QLineEdit)
    editor.selectAll()
    qtbot.keyClick(editor, Qt.Key.Key_Backspace)
    qtbot.keyClicks(editor, text)
    qtbot.keyClick(editor, Qt.Key.Key_Return)   # the delegate commits on the next turn
    qtbot.waitUntil(lambda: table.state() != QAbstractItemView.State.EditingState, timeout=5000)
    return editor


def _answer(qtbot, fill, seen: list) -> None:
    """Answer the next one-value dialog: ``fill(dialog)`` types into it, then OK is clicked."""
    tries = [0]

    def attempt() -> None:
        dialog = QApplication.activeModalWidget()
        if not isinstance(dialog, QInputDialog):
            tries[0] += 1
            if tries[0] < 500:
                QTimer.singleShot(10, attempt)
            return
        seen.append((dialog.labelText(), missing(dialog)))
        fill(dialog)
        ok = dialog.findChild(QDialogButtonBox).button(QDialogButtonBox.StandardButton.Ok)
        qtbot.mouseClick(ok, Qt.MouseButton.LeftButton)

    QTimer.singleShot(0, attempt)


def _type_line(qtbot, text):
    def fill(dialog):
        field = dialog.findChild(QLineEdit)
        field.selectAll()
        qtbot.keyClicks(field, text)
    return fill


def _warning(window) -> str:
    return window.statusBar().currentMessage()


# ---- arrival and leaving -----------------------------------------------------------------

def test_arrival_typed_as_hh_mm_replans_and_undoes(qtbot, window):
    assert RAW["shift"]["start"] == "06:00" and RAW["crew"]["operators"][0]["arrives"] is None
    laser = _row(window, "Laser operator")
    _type_in_cell(qtbot, window, laser, COL_ARRIVES, "10:30")
    assert _crew(window).operators[laser].arrives == time(10, 30)
    wait_plan(qtbot, window)
    assert "Laser operator" in window.plan.staffing["operators_not_yet_here"]
    assert window.doc.undo_stack.undoText() == "Laser operator arrives at 10:30"
    _undo(qtbot, window)
    assert _crew(window).operators[laser].arrives is None
    wait_plan(qtbot, window)
    assert "Laser operator" in window.plan.staffing["operators_present"]
    _redo(qtbot, window)
    assert _crew(window).operators[laser].arrives == time(10, 30)
    # empty: the whole shift again
    _type_in_cell(qtbot, window, laser, COL_ARRIVES, "")
    assert _crew(window).operators[laser].arrives is None


@pytest.mark.parametrize("col, text, field, words", [
    (COL_ARRIVES, "15:00", "field 'arrives'", "15:00 is outside the shift (06:00 to 14:00)"),
    (COL_LEAVES, "05:00", "field 'leaves'", "05:00 is outside the shift"),
    (COL_LEAVES, "9:00", "field 'leaves'", "must be after the time the operator arrives"),
    (COL_ARRIVES, "10h", "field 'arrives'", "'10h' is not a time of day like '06:00'"),
])
def test_a_time_outside_the_shift_is_refused_naming_operator_and_field(qtbot, window, col, text, field, words):
    trainee = _row(window, "Trainee")      # arrives 10:00 in the sample
    assert RAW["crew"]["operators"][trainee]["arrives"] == "10:00"
    before, steps = copy.deepcopy(_crew(window)), window.doc.undo_stack.count()
    _type_in_cell(qtbot, window, trainee, col, text)
    assert _crew(window) == before and window.doc.undo_stack.count() == steps
    message = _warning(window)
    assert "operator 'Trainee' (id O6)" in message and field in message and words in message
    assert "nothing changed" in message


# ---- labels and their limit --------------------------------------------------------------

def test_label_editor_holds_the_name_limit_and_a_duplicate_is_refused(qtbot, window):
    laser = _row(window, "Laser operator")
    editor = _type_in_cell(qtbot, window, laser, COL_LABEL, "L" * (limits.MAX_NAME_CHARS + 5))
    assert editor.maxLength() == limits.MAX_NAME_CHARS
    assert _crew(window).operators[laser].label == "L" * limits.MAX_NAME_CHARS
    _undo(qtbot, window)
    assert _crew(window).operators[laser].label == "Laser operator"
    steps = window.doc.undo_stack.count()
    _type_in_cell(qtbot, window, laser, COL_LABEL, "Brake operator")
    assert _crew(window).operators[laser].label == "Laser operator"
    assert window.doc.undo_stack.count() == steps
    assert "labels must be unique" in _warning(window) and "nothing changed" in _warning(window)


def test_time_editor_takes_five_characters(qtbot, window):
    editor = _type_in_cell(qtbot, window, 0, COL_LEAVES, "13:3099")
    assert editor.maxLength() == 5
    assert _crew(window).operators[0].leaves == time(13, 30)


# ---- expiry ------------------------------------------------------------------------------

def test_expiry_date_by_f2_on_a_machine_cell(qtbot, window):
    welder = _row(window, "Welder (manual)")
    raw = [a for a in RAW["crew"]["authorisations"] if a["operator"] == "O4" and a["group"]]
    assert raw == [{"operator": "O4", "machine": "", "group": "robot welders", "expires": "2026-03-24"}]
    table = window.crew_tab.table
    table.setCurrentIndex(table.model().index(welder, _col(window, "Robot welder A")))
    seen: list = []
    _answer(qtbot, _type_line(qtbot, "2026-04-30"), seen)
    qtbot.keyClick(table, Qt.Key.Key_F2)
    qtbot.waitUntil(lambda: bool(seen), timeout=5000)
    label, lacking = seen[0]
    assert "Welder (manual) for group robot welders" in label and not lacking
    auth = next(a for a in _crew(window).authorisations if a.operator == "O4" and a.group)
    assert auth.expires == date(2026, 4, 30)
    cell = table.model().index(welder, _col(window, "Robot welder A"))
    assert table.model().data(cell, Qt.ItemDataRole.BackgroundRole) is None   # 44 days: beyond 14
    _undo(qtbot, window)
    auth = next(a for a in _crew(window).authorisations if a.operator == "O4" and a.group)
    assert auth.expires == date(2026, 3, 24)
    _redo(qtbot, window)
    auth = next(a for a in _crew(window).authorisations if a.operator == "O4" and a.group)
    assert auth.expires == date(2026, 4, 30)


def test_expiry_that_is_not_a_date_is_refused(qtbot, window):
    table = window.crew_tab.table
    table.setCurrentIndex(table.model().index(_row(window, "Welder (manual)"), _col(window, "Manual weld bay")))
    before = copy.deepcopy(_crew(window))
    seen: list = []
    _answer(qtbot, _type_line(qtbot, "end of March"), seen)
    menu = window.crew_tab.cell_menu(table.currentIndex().row(), table.currentIndex().column())
    next(a for a in menu.actions() if a.text().startswith("&Expiry date")).trigger()
    qtbot.waitUntil(lambda: bool(seen), timeout=5000)
    assert _crew(window) == before
    assert "'end of March' is not a date like '2026-03-24'" in _warning(window)
    assert "field 'expires'" in _warning(window) and "nothing changed" in _warning(window)
    # a cell without any authorisation has no expiry to set
    table.setCurrentIndex(table.model().index(_row(window, "Laser operator"), _col(window, "Press brake 2")))
    qtbot.keyClick(table, Qt.Key.Key_F2)
    assert "Laser operator is not authorised for Press brake 2" in _warning(window)
    assert _crew(window) == before


# ---- unattended machines -----------------------------------------------------------------

def test_runs_unattended_from_the_machine_header_menu(qtbot, window):
    assert RAW["crew"]["unattended"] == ["M7"]
    k = window.doc.shop.machine_names().index("Laser cutter")
    model = window.crew_tab.model
    menu = window.crew_tab.header_menu(k)
    action = next(a for a in menu.actions() if a.isCheckable())
    assert not action.isChecked()
    action.trigger()
    assert _crew(window).unattended == ["M1", "M7"]
    assert model.headerData(FIRST_MACHINE + k, Qt.Orientation.Horizontal).endswith("(unattended)")
    wait_plan(qtbot, window)
    assert "Laser cutter" in window.plan.staffing["unattended_machines"]
    _undo(qtbot, window)
    assert _crew(window).unattended == ["M7"]
    assert model.headerData(FIRST_MACHINE + k, Qt.Orientation.Horizontal) == "Laser cutter"
    _redo(qtbot, window)
    assert _crew(window).unattended == ["M1", "M7"]


def test_header_right_click_opens_the_menu(qtbot, window):
    header = window.crew_tab.table.horizontalHeader()
    k = window.doc.shop.machine_names().index("Deburr tumbler")
    seen: list = []

    def pick() -> None:
        menu = QApplication.activePopupWidget()
        if menu is None:
            QTimer.singleShot(10, pick)
            return
        seen.append([a.text() for a in menu.actions()])
        next(a for a in menu.actions() if a.isCheckable()).trigger()
        menu.close()

    QTimer.singleShot(0, pick)
    x = header.sectionViewportPosition(FIRST_MACHINE + k) + 5
    header.customContextMenuRequested.emit(QPoint(x, 5))
    assert seen and any("unattended" in t.replace("&", "") for t in seen[0])
    assert "M7" not in _crew(window).unattended


# ---- machine groups ----------------------------------------------------------------------

def test_authorise_and_withdraw_a_whole_group_from_the_cell_menu(qtbot, window):
    laser = _row(window, "Laser operator")
    col = _col(window, "Press brake 2")
    model = window.crew_tab.model
    assert model.data(model.index(laser, col), Qt.ItemDataRole.CheckStateRole) == Qt.CheckState.Unchecked
    group = next(a for a in window.crew_tab.cell_menu(laser, col).actions() if a.menu())
    press = next(a for a in group.menu().actions() if a.text() == "press brakes")
    press.trigger()
    for machine in ("Press brake 1", "Press brake 2"):
        index = model.index(laser, _col(window, machine))
        assert model.data(index, Qt.ItemDataRole.CheckStateRole) == Qt.CheckState.Checked
        assert model.data(index, Qt.ItemDataRole.DisplayRole) == "group"
    _undo(qtbot, window)
    assert model.data(model.index(laser, col), Qt.ItemDataRole.CheckStateRole) == Qt.CheckState.Unchecked
    _redo(qtbot, window)
    group = next(a for a in window.crew_tab.cell_menu(laser, col).actions() if a.menu())
    press = next(a for a in group.menu().actions() if a.text() == "press brakes")
    assert press.isChecked()
    press.trigger()                                        # withdraw
    assert model.data(model.index(laser, col), Qt.ItemDataRole.CheckStateRole) == Qt.CheckState.Unchecked


def test_groups_dialog_renames_changes_machines_and_deletes(qtbot, window):
    assert list(RAW["crew"]["groups"]) == ["press brakes", "robot welders"]
    qtbot.mouseClick(window.crew_tab.groups, Qt.MouseButton.LeftButton)
    dialog = QApplication.activeModalWidget()
    assert dialog is not None and not missing(dialog)
    dialog.group_list.setCurrentRow(1)                     # robot welders
    dialog.name.selectAll()
    qtbot.keyClicks(dialog.name, "welding robots")
    qtbot.mouseClick(dialog.rename_button, Qt.MouseButton.LeftButton)
    bay = dialog.machine_list.item(window.doc.shop.machine_names().index("Manual weld bay"))
    rect = dialog.machine_list.visualItemRect(bay)
    qtbot.mouseClick(dialog.machine_list.viewport(), Qt.MouseButton.LeftButton,
                     pos=QPoint(rect.left() + 8, rect.center().y()))
    assert bay.checkState() == Qt.CheckState.Checked
    qtbot.mouseClick(dialog.buttons.button(QDialogButtonBox.StandardButton.Ok), Qt.MouseButton.LeftButton)
    crew = _crew(window)
    assert crew.groups == {"press brakes": ["M2", "M3"], "welding robots": ["M4", "M5", "M6"]}
    assert sorted(a.operator for a in crew.authorisations if a.group == "welding robots") == ["O3", "O4"]
    wait_plan(qtbot, window)
    _undo(qtbot, window)
    assert _crew(window).groups == RAW["crew"]["groups"]
    assert sorted(a.operator for a in _crew(window).authorisations if a.group == "robot welders") == ["O3", "O4"]
    _redo(qtbot, window)
    assert "welding robots" in _crew(window).groups
    # delete a group: its authorisations go with it
    dialog = window.crew_tab.open_groups()
    dialog.group_list.setCurrentRow(0)                     # press brakes
    qtbot.mouseClick(dialog.delete_button, Qt.MouseButton.LeftButton)
    assert "2 authorisations through the deleted group go with it" in dialog.problem.text()
    qtbot.mouseClick(dialog.buttons.button(QDialogButtonBox.StandardButton.Ok), Qt.MouseButton.LeftButton)
    assert "press brakes" not in _crew(window).groups
    assert not any(a.group == "press brakes" for a in _crew(window).authorisations)
    _undo(qtbot, window)
    assert sum(a.group == "press brakes" for a in _crew(window).authorisations) == 2


def test_groups_dialog_refuses_a_bad_name_and_cancel_changes_nothing(qtbot, window):
    before, steps = copy.deepcopy(_crew(window)), window.doc.undo_stack.count()
    dialog = window.crew_tab.open_groups()
    assert dialog.name.maxLength() == limits.MAX_NAME_CHARS
    dialog.name.clear()
    qtbot.keyClicks(dialog.name, "   ")
    qtbot.mouseClick(dialog.new_button, Qt.MouseButton.LeftButton)
    assert "must be a non-empty text" in dialog.problem.text() and "nothing changed" in dialog.problem.text()
    dialog.name.clear()
    qtbot.keyClicks(dialog.name, "robot welders")
    qtbot.mouseClick(dialog.new_button, Qt.MouseButton.LeftButton)
    assert "exists already" in dialog.problem.text()
    assert list(dialog.groups) == ["press brakes", "robot welders"]
    dialog.name.clear()
    qtbot.keyClicks(dialog.name, "lasers")
    qtbot.mouseClick(dialog.new_button, Qt.MouseButton.LeftButton)
    assert dialog.current() == "lasers"
    qtbot.mouseClick(dialog.buttons.button(QDialogButtonBox.StandardButton.Cancel), Qt.MouseButton.LeftButton)
    assert _crew(window) == before and window.doc.undo_stack.count() == steps


# ---- removing an operator ----------------------------------------------------------------

def test_remove_operator_with_their_authorisations_and_undo(qtbot, window):
    lead = _row(window, "Cell lead")
    own = [a for a in RAW["crew"]["authorisations"] if a["operator"] == "O5"]
    assert len(own) == 3
    before = copy.deepcopy(_crew(window))
    table = window.crew_tab.table
    table.setCurrentIndex(table.model().index(lead, COL_LABEL))
    qtbot.mouseClick(window.crew_tab.remove, Qt.MouseButton.LeftButton)
    assert "Cell lead" not in [o.label for o in _crew(window).operators]
    assert len(_crew(window).authorisations) == len(RAW["crew"]["authorisations"]) - 3
    assert table.model().rowCount() == len(RAW["crew"]["operators"]) - 1
    wait_plan(qtbot, window)
    _undo(qtbot, window)
    assert _crew(window) == before
    _redo(qtbot, window)
    assert "Cell lead" not in [o.label for o in _crew(window).operators]


# ---- notes -------------------------------------------------------------------------------

def _type_notes(qtbot, text):
    def fill(dialog):
        field = dialog.findChild(QPlainTextEdit)
        field.selectAll()
        qtbot.keyClicks(field, text)
    return fill


def test_notes_by_f2_and_too_long_notes_refused(qtbot, window):
    laser = _row(window, "Laser operator")
    table = window.crew_tab.table
    table.setCurrentIndex(table.model().index(laser, COL_NOTES))
    seen: list = []
    _answer(qtbot, _type_notes(qtbot, "forklift licence"), seen)
    qtbot.keyClick(table, Qt.Key.Key_F2)
    qtbot.waitUntil(lambda: bool(seen), timeout=5000)
    assert not seen[0][1]                                   # the dialog's controls are named
    assert _crew(window).operators[laser].notes == "forklift licence"
    assert table.model().data(table.currentIndex(), Qt.ItemDataRole.DisplayRole) == "forklift licence"
    _undo(qtbot, window)
    assert _crew(window).operators[laser].notes == ""
    _redo(qtbot, window)
    before, steps = copy.deepcopy(_crew(window)), window.doc.undo_stack.count()
    seen.clear()
    _answer(qtbot, lambda d: d.findChild(QPlainTextEdit).setPlainText("n" * (limits.MAX_TEXT_CHARS + 1)), seen)
    qtbot.keyClick(table, Qt.Key.Key_F2)
    qtbot.waitUntil(lambda: bool(seen), timeout=5000)
    assert _crew(window) == before and window.doc.undo_stack.count() == steps
    assert "field 'notes'" in _warning(window) and "the limit is 10,000" in _warning(window)


# ---- warning days ------------------------------------------------------------------------

def test_warning_days_by_the_spin_box_are_one_undo_step(qtbot, window):
    assert RAW["crew"]["warn_days"] == 14
    welder = _row(window, "Welder (manual)")
    cell = window.crew_tab.model.index(welder, _col(window, "Robot welder A"))
    assert window.crew_tab.model.data(cell, Qt.ItemDataRole.BackgroundRole) is not None   # 7 days left
    spin = window.crew_tab.warn
    spin.setFocus()
    for _ in range(8):
        qtbot.keyClick(spin, Qt.Key.Key_Down)
    assert _crew(window).warn_days == 6
    assert window.crew_tab.model.data(cell, Qt.ItemDataRole.BackgroundRole) is None
    wait_plan(qtbot, window)
    assert window.plan.staffing["expiring"] == []
    _undo(qtbot, window)
    assert _crew(window).warn_days == 14 and spin.value() == 14
    _redo(qtbot, window)
    assert _crew(window).warn_days == 6 and spin.value() == 6


def test_new_crew_controls_are_named(qtbot, window):
    assert not missing(window.crew_tab.view)


def test_delete_withdraws_the_selected_own_authorisations_and_leaves_the_grid_alone(qtbot, window):
    from PySide6.QtCore import QItemSelectionModel

    table, model = window.crew_tab.table, window.crew_tab.model
    grid_before = dict(window.doc.shop.grid)
    laser, lead = _row(window, "Laser operator"), _row(window, "Cell lead")
    cutter, brake = _col(window, "Laser cutter"), _col(window, "Press brake 1")
    picked = [(laser, cutter), (lead, cutter), (lead, brake)]
    assert [model.authorisation(r, c - FIRST_MACHINE)[0] for r, c in picked] == [True, True, True]
    assert model.authorisation(lead, brake - FIRST_MACHINE)[1].startswith("through")
    table.setFocus()
    table.clearSelection()
    for r, c in picked:
        table.selectionModel().select(model.index(r, c), QItemSelectionModel.SelectionFlag.Select)
    qtbot.keyClick(table, Qt.Key.Key_Delete)
    wait_plan(qtbot, window)
    assert [model.authorisation(r, c - FIRST_MACHINE)[0] for r, c in picked] == [False, False, True]
    assert window.doc.shop.grid == grid_before, "Delete on the Crew tab never marks grid cells"
    assert window.doc.undo_stack.undoText() == "Withdraw 2 authorisations"
    _undo(qtbot, window)
    assert [model.authorisation(r, c - FIRST_MACHINE)[0] for r, c in picked] == [True, True, True]


def test_delete_on_a_tab_without_the_grid_changes_nothing(qtbot, window):
    window.view.selectAll()
    window.tabs.setCurrentWidget(window.whatif_tab.view)
    before, depth = dict(window.doc.shop.grid), window.doc.undo_stack.count()
    window.act_cannot.trigger()
    assert window.doc.shop.grid == before and window.doc.undo_stack.count() == depth
