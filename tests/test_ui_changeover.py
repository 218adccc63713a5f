"""Changeovers in the app, driven headless with pytest-qt: the family column, the mounted
family in each machine header, derived values against typed overrides, undo of each.

The reference for every derived value is the sample file's own changeover table, read
here as plain JSON (not through the shop model), so a derivation bug cannot hide itself.
"""

from __future__ import annotations

import json

import pytest
from PySide6.QtCore import Qt
from PySide6.QtWidgets import QAbstractItemView, QApplication

from dispatcher.ui import palette
from dispatcher.ui.grid_model import COL_FAMILY, FIRST_MACHINE_COL, SourceRole, ValueRole
from ui_support import activate, answer_next_dialog, make_window, press, save_shot, wait_plan

SAMPLE = "small_moulding_cell.dshop"


@pytest.fixture
def window(qtbot, tmp_path, monkeypatch, samples):
    return make_window(qtbot, tmp_path, monkeypatch, samples / SAMPLE)


@pytest.fixture
def raw(samples):
    """The sample as plain JSON: machine name -> (mounted, table changes by (from, to))."""
    data = json.loads((samples / SAMPLE).read_text(encoding="utf-8"))
    tables = {}
    for t in data["changeover_tables"]:
        changes = {(a, b): v for a, row in t["changes"].items() for b, v in row.items()}
        changes.update({(None, b): v for b, v in t.get("from_empty", {}).items()})
        for mid in t["machines"]:
            tables[mid] = changes
    return data, tables


def _cell(window, job: str, machine: str):
    shop = window.doc.shop
    return window.model.index(shop.job_names().index(job), FIRST_MACHINE_COL + shop.machine_names().index(machine))


def _type_into(qtbot, window, index, text: str) -> None:
    """Type ``text`` into a cell as a user does: select it, F2, type, Return."""
    window.view.setCurrentIndex(index)
    press(qtbot, window, Qt.Key.Key_F2)
    editor = QApplication.focusWidget()
    assert editor is not window.view, "F2 opened no editor"
    editor.selectAll()
    qtbot.keyClicks(editor, text)
    qtbot.keyClick(editor, Qt.Key.Key_Return)
    # the delegate commits the text on a later turn of the event loop
    qtbot.waitUntil(lambda: window.view.state() != QAbstractItemView.State.EditingState)
    wait_plan(qtbot, window)


def test_raw_sample_has_what_the_tests_need(raw):
    data, tables = raw
    # the 80t press has the knob mould mounted and a table that prices the lid mould
    press80 = next(m for m in data["machines"] if m["name"] == "Press 80t")
    assert press80["mounted"] == "knob mould"
    assert ("knob mould", "lid mould") in tables[press80["id"]]


def test_typing_a_family_derives_the_row_and_undo_restores_it(qtbot, window, raw, tmp_path):
    data, tables = raw
    shop = window.doc.shop
    row = shop.job_names().index("WO-7007 label set")
    assert shop.jobs[row].family is None
    _type_into(qtbot, window, window.model.index(row, COL_FAMILY), "lid mould")
    assert shop.jobs[row].family == "lid mould"
    for m in data["machines"]:
        changes = tables.get(m["id"])
        idx = _cell(window, "WO-7007 label set", m["name"])
        typed = m["id"] in data["grid"].get(shop.jobs[row].id, {})
        if changes is None or typed:
            continue
        expected = changes.get((m["mounted"], "lid mould"))
        assert idx.data(ValueRole) == expected, m["name"]
        assert idx.data(SourceRole) == ("derived" if expected is not None else None)
    save_shot(window, tmp_path, "family-typed")
    press(qtbot, window, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    assert shop.jobs[row].family is None
    assert window.model.index(row, COL_FAMILY).data() == ""


def test_a_bad_family_name_is_refused_and_names_the_job(qtbot, window):
    row = window.doc.shop.job_names().index("WO-7001 lid")
    with qtbot.waitSignal(window.model.warning) as blocker:
        ok = window.model.setData(window.model.index(row, COL_FAMILY), "bad\x1bname")
    assert not ok
    assert "WO-7001 lid" in blocker.args[0] and "U+001B" in blocker.args[0]
    assert window.doc.shop.jobs[row].family == "lid mould"


def test_typed_value_over_the_table_is_marked_and_undo_goes_back_to_derived(qtbot, window, raw):
    data, tables = raw
    press80 = next(m for m in data["machines"] if m["name"] == "Press 80t")
    idx = _cell(window, "WO-7001 lid", "Press 80t")
    derived = tables[press80["id"]][("knob mould", "lid mould")]
    assert idx.data(SourceRole) == "derived" and idx.data(ValueRole) == derived
    assert palette.MARK_TYPED not in idx.data()
    assert "Derived from changeover table" in idx.data(Qt.ItemDataRole.ToolTipRole)
    assert idx.data(Qt.ItemDataRole.FontRole).italic()

    _type_into(qtbot, window, idx, "7")
    assert idx.data(SourceRole) == "typed" and idx.data(ValueRole) == 7
    assert idx.data().startswith(palette.MARK_TYPED)
    tip = idx.data(Qt.ItemDataRole.ToolTipRole)
    assert "typed over changeover table" in tip and f"gives {derived:g}" in tip

    press(qtbot, window, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    # back to following the table, not a typed copy of the derived value
    assert idx.data(SourceRole) == "derived"
    assert window.doc.cell_state(idx.row(), idx.column() - FIRST_MACHINE_COL) == (None, False)

    press(qtbot, window, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier | Qt.KeyboardModifier.ShiftModifier)
    wait_plan(qtbot, window)
    assert idx.data(SourceRole) == "typed" and idx.data(ValueRole) == 7
    window.view.setCurrentIndex(idx)
    press(qtbot, window, Qt.Key.Key_T, Qt.KeyboardModifier.ControlModifier | Qt.KeyboardModifier.ShiftModifier)
    wait_plan(qtbot, window)
    assert idx.data(SourceRole) == "derived" and idx.data(ValueRole) == derived
    press(qtbot, window, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    assert idx.data(ValueRole) == 7


def test_typed_cannot_run_over_the_table_is_marked(qtbot, window):
    idx = _cell(window, "WO-7001 lid", "Press 80t")
    window.view.setCurrentIndex(idx)
    press(qtbot, window, Qt.Key.Key_Delete)
    wait_plan(qtbot, window)
    assert idx.data(ValueRole) is None and idx.data(SourceRole) == "typed"
    assert idx.data() == palette.MARK_TYPED + palette.MARK_CANNOT


def test_plain_grid_cells_carry_no_typed_mark(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "sheet_metal_grid.csv")
    idx = window.model.index(0, FIRST_MACHINE_COL)
    assert idx.data(SourceRole) is None and palette.MARK_TYPED not in idx.data()
    header = window.model.headerData(FIRST_MACHINE_COL, Qt.Orientation.Horizontal)
    assert palette.MARK_MOUNTED not in header


def test_header_shows_mounted_and_the_dialog_changes_it_with_undo(qtbot, window, raw, tmp_path):
    data, tables = raw
    shop = window.doc.shop
    k = shop.machine_names().index("Press 80t")
    header = window.model.headerData(FIRST_MACHINE_COL + k, Qt.Orientation.Horizontal)
    assert f"{palette.MARK_MOUNTED} knob mould" in header
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL + k))

    answer_next_dialog(lambda d: d.setTextValue("clip mould"))
    window.act_mounted.trigger()
    wait_plan(qtbot, window)
    assert shop.machines[k].mounted == "clip mould"
    header = window.model.headerData(FIRST_MACHINE_COL + k, Qt.Orientation.Horizontal)
    assert f"{palette.MARK_MOUNTED} clip mould" in header
    changes = tables[shop.machines[k].id]
    idx = _cell(window, "WO-7001 lid", "Press 80t")
    assert idx.data(ValueRole) == changes.get(("clip mould", "lid mould"))

    answer_next_dialog(lambda d: d.setTextValue("spacer mould"))
    window.act_end_family.trigger()
    wait_plan(qtbot, window)
    header = window.model.headerData(FIRST_MACHINE_COL + k, Qt.Orientation.Horizontal)
    assert f"{palette.MARK_END} spacer mould" in header
    assert "must end the shift in: spacer mould" in window.model.headerData(
        FIRST_MACHINE_COL + k, Qt.Orientation.Horizontal, Qt.ItemDataRole.ToolTipRole
    )
    save_shot(window, tmp_path, "mounted-header")

    press(qtbot, window, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    press(qtbot, window, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    assert shop.machines[k].mounted == "knob mould" and shop.machines[k].end_family is None
    assert idx.data(ValueRole) == changes[("knob mould", "lid mould")]


def test_a_family_the_table_does_not_list_is_refused_naming_machine_and_table(qtbot, window):
    shop = window.doc.shop
    k = shop.machine_names().index("Press 80t")
    with qtbot.waitSignal(window.warning) as blocker:
        assert not window.edits.set_machine_family(k, "no such mould")
    assert "Press 80t" in blocker.args[0] and "no such mould" in blocker.args[0]
    assert shop.table_of(shop.machines[k].id).name in blocker.args[0]
    assert shop.machines[k].mounted == "knob mould"
    assert not window.doc.undo_stack.canUndo()


# ---- the changeover table editor ------------------------------------------------------------
def _open_editor(qtbot, window):
    window.tabs.setCurrentWidget(window.changeover_tab.view)
    tab = window.changeover_tab
    shop = window.doc.shop
    k = shop.machine_names().index("Press 80t")
    t = shop.table_of(shop.machines[k].id)
    tab.chooser.setCurrentIndex(shop.changeover_tables.index(t))
    return tab, t


def test_editor_typing_moves_the_grid_and_undo_restores(qtbot, window, raw, tmp_path):
    data, tables = raw
    tab, t = _open_editor(qtbot, window)
    model = tab.model
    assert model.rowCount() == len(t.families) + 1
    assert tab.model.headerData(len(t.families), Qt.Orientation.Vertical).endswith("nothing mounted")
    r, c = t.families.index("knob mould"), t.families.index("lid mould")
    grid_cell = _cell(window, "WO-7001 lid", "Press 80t")
    before = tables["M1"][("knob mould", "lid mould")]
    assert grid_cell.data(ValueRole) == before
    cell = model.index(r, c)
    tab.table.setCurrentIndex(cell)
    activate(qtbot, window)
    tab.table.setFocus()
    qtbot.keyClick(tab.table, Qt.Key.Key_F2)
    editor = QApplication.focusWidget()
    assert editor is not None and editor is not tab.table, "F2 opened no editor"
    editor.selectAll()
    qtbot.keyClicks(editor, "12")
    qtbot.keyClick(editor, Qt.Key.Key_Return)
    qtbot.waitUntil(lambda: tab.table.state() != QAbstractItemView.State.EditingState)
    wait_plan(qtbot, window)
    assert cell.data() == "12"
    assert grid_cell.data(ValueRole) == 12 and grid_cell.data(SourceRole) == "derived"
    save_shot(window, tmp_path, "changeover-editor")
    qtbot.keyClick(tab.table, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    assert grid_cell.data(ValueRole) == before


def test_editor_paste_block_is_one_undoable_edit(qtbot, window):
    tab, t = _open_editor(qtbot, window)
    tab.table.setCurrentIndex(tab.model.index(0, 0))
    QApplication.clipboard().setText("1\t2\n3\t\n")
    activate_tab = tab.table
    activate(qtbot, window)
    qtbot.keyClick(activate_tab, Qt.Key.Key_V, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    a, b = t.families[0], t.families[1]
    assert (t.change(a, a), t.change(a, b), t.change(b, a), t.change(b, b)) == (1, 2, 3, None)
    qtbot.keyClick(activate_tab, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    assert t.change(b, b) is not None and t.change(a, b) != 2


def test_editor_paste_with_headers_goes_to_the_named_families(qtbot, window):
    tab, t = _open_editor(qtbot, window)
    a, b = t.families[2], t.families[0]
    assert tab.paste_text(f"\t{a}\nnothing mounted\t9\n{b}\t8\n")
    assert t.change(None, a) == 9 and t.change(b, a) == 8


@pytest.mark.parametrize(
    "block, where", [("5\t-3", "row 1, column 2"), ("abc", "row 1, column 1"), ("1\n2\nnan", "row 3, column 1")]
)
def test_editor_bad_paste_is_refused_naming_the_cell(qtbot, window, block, where):
    tab, t = _open_editor(qtbot, window)
    tab.table.setCurrentIndex(tab.model.index(0, 0))
    before = dict(t.changes)
    with qtbot.waitSignal(window.warning) as blocker:
        assert not tab.paste_text(block)
    assert where in blocker.args[0] and "change from" in blocker.args[0]
    assert t.changes == before and not window.doc.undo_stack.canUndo()


def test_editor_bad_typed_text_names_the_change(qtbot, window):
    tab, t = _open_editor(qtbot, window)
    with qtbot.waitSignal(window.warning) as blocker:
        assert not tab.model.setData(tab.model.index(0, 1), "-4")
    assert f"change from {t.families[0]} to {t.families[1]}" in blocker.args[0]
    assert "negative" in blocker.args[0]


def test_editor_delete_disallows_and_the_job_cannot_run_there(qtbot, window):
    tab, t = _open_editor(qtbot, window)
    r, c = t.families.index("knob mould"), t.families.index("lid mould")
    tab.table.setCurrentIndex(tab.model.index(r, c))
    activate(qtbot, window)
    qtbot.keyClick(tab.table, Qt.Key.Key_Delete)
    wait_plan(qtbot, window)
    assert t.change("knob mould", "lid mould") is None
    assert tab.model.index(r, c).data() == palette.MARK_CANNOT
    assert _cell(window, "WO-7001 lid", "Press 80t").data(ValueRole) is None


# ---- the whole-shift timeline ---------------------------------------------------------------
def test_timeline_draws_the_shift_plan_with_hover_and_keys(qtbot, tmp_path, monkeypatch, samples):
    from PySide6.QtCore import QPoint
    from PySide6.QtGui import QHelpEvent
    from PySide6.QtWidgets import QToolTip

    from dispatcher.shop.fill_shift import ShiftFill
    from dispatcher.shop.timeline import CHANGE, JOB
    from test_timeline import small_print_plant

    window = make_window(qtbot, tmp_path, monkeypatch, small_print_plant(samples, tmp_path))
    window.tabs.setCurrentWidget(window.timeline_tab.view)
    assert "Whole shift" in window.timeline_tab.note.text() or "whole-shift" in window.timeline_tab.note.text()
    press(qtbot, window, Qt.Key.Key_5, Qt.KeyboardModifier.ControlModifier)
    qtbot.waitUntil(lambda: isinstance(window.plan, ShiftFill), timeout=60_000)
    wait_plan(qtbot, window)
    view = window.timeline_tab.timeline
    lanes = view.lanes()
    assert [lane.machine for lane in lanes] == [m.machine for m in window.plan.machines]
    assert "proven optimal" in window.timeline_tab.note.text() or "gap at most" in window.timeline_tab.note.text()
    k, i = next((k, i) for k, lane in enumerate(lanes) for i, b in enumerate(lane.bars) if b.kind == CHANGE)
    change = lanes[k].bars[i]
    job_index = next(j for j, b in enumerate(lanes[k].bars) if b.kind == JOB and b.job == change.job)
    window.resize(1400, 700)
    activate(qtbot, window)
    qtbot.waitExposed(view)
    for index, expect in ((job_index, [change.job, change.family, "06:"]), (i, ["before", change.job, "change from"])):
        centre = view.bar_rect(k, index).center().toPoint()
        view.event(QHelpEvent(QHelpEvent.Type.ToolTip, centre, view.mapToGlobal(centre)))
        qtbot.waitUntil(lambda: QToolTip.isVisible())
        for word in expect:
            assert word in QToolTip.text()
    QToolTip.hideText()
    empty = QPoint(5, 5)  # the axis: no bar, no tooltip
    assert view.bar_at(empty) is None
    save_shot(window, tmp_path, "timeline")
    view.setFocus()
    with qtbot.waitSignal(view.current_changed) as blocker:
        qtbot.keyClick(view, Qt.Key.Key_Right)
    assert view.current() == (0, 0) and lanes[0].machine in blocker.args[0]
    assert window.statusBar().currentMessage() == blocker.args[0]
    qtbot.keyClick(view, Qt.Key.Key_Down)
    assert view.current()[0] == 1


def test_timeline_asks_for_whole_shift_mode_in_round_mode(qtbot, window):
    assert window.timeline_tab.timeline.lanes() == []
    assert "Ctrl+5" in window.timeline_tab.note.text()


# ---- job list import with a column mapping --------------------------------------------------
JOB_LIST = (
    "WO No,Description,Tool,Std hrs,Hot,Cost if late\n"
    "WO-9001,WO-9001 grille,lid mould,1.5,yes,12\n"
    "WO-9002,WO-9002 cap,clip mould,0.5,no,4\n"
    "WO-7002,WO-7002 clip,knob mould,2,no,30\n"
)


def test_job_list_import_maps_columns_and_undo_takes_it_back(qtbot, window, tmp_path):
    path = tmp_path / "jobs.csv"
    path.write_text(JOB_LIST, encoding="utf-8")
    before = window.doc.shop.job_names()
    assert window.job_import.open(path)
    dialog = window.job_import.dialog
    qtbot.waitExposed(dialog)
    # nothing in this header is a name the core knows: map every column by hand
    assert all(c.currentIndex() == 0 for c in dialog.combos.values())
    for field, header in (
        ("work_order", "WO No"),
        ("name", "Description"),
        ("family", "Tool"),
        ("run_hours", "Std hrs"),
        ("rush", "Hot"),
        ("wait_penalty", "Cost if late"),
    ):
        dialog.choose(field, header)
    save_shot(dialog, tmp_path, "job-import")
    qtbot.keyClick(dialog.buttons.button(dialog.buttons.StandardButton.Ok), Qt.Key.Key_Space)
    wait_plan(qtbot, window)
    shop = window.doc.shop
    assert shop.job_names() == before + ["WO-9001 grille", "WO-9002 cap"]
    new = shop.job_by_name("WO-9001 grille")
    assert (new.family, new.run_hours, new.rush, new.wait_penalty) == ("lid mould", 1.5, True, 12)
    updated = shop.job_by_name("WO-7002 clip")
    assert (updated.family, updated.run_hours, updated.wait_penalty) == ("knob mould", 2, 30)
    press(qtbot, window, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    assert window.doc.shop.job_names() == before
    assert window.doc.shop.job_by_name("WO-7002 clip").family == "clip mould"


def test_job_list_import_refuses_a_bad_cell_naming_row_and_column(qtbot, window, tmp_path):
    path = tmp_path / "bad.csv"
    path.write_text("job,run hours\nA,1\nB,lots\n", encoding="utf-8")
    before = window.doc.shop.job_names()
    assert window.job_import.open(path)
    dialog = window.job_import.dialog
    assert dialog.combos["name"].currentText() == "job"  # recognised header names preselected
    with qtbot.waitSignal(window.warning) as blocker:
        dialog.accept()
    assert "bad.csv" in blocker.args[0] and "row 3" in blocker.args[0] and "column 2" in blocker.args[0]
    assert window.doc.shop.job_names() == before and not window.doc.undo_stack.canUndo()


def test_job_list_field_left_out_is_not_read(qtbot, window, tmp_path):
    path = tmp_path / "jobs.csv"
    path.write_text("job,family\nWO-7001 lid,spacer mould\n", encoding="utf-8")
    assert window.job_import.open(path)
    dialog = window.job_import.dialog
    dialog.choose("family", None)
    dialog.accept()
    assert window.doc.shop.job_by_name("WO-7001 lid").family == "lid mould"
