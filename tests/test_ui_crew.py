"""The crew tab and the crew in the plan panel and grid headers, driven through the real
widgets (clicks, keys, Edit > Paste), on the invented crewed sample shop."""

from __future__ import annotations

from PySide6.QtCore import QPoint, Qt
from PySide6.QtGui import QGuiApplication
from ui_support import activate, wait_plan

from dispatcher.ui.crew_model import COL_PRESENT, FIRST_MACHINE
from dispatcher.ui.grid_model import FIRST_MACHINE_COL

SAMPLE = "crewed_fabrication_cell.dshop"


def _crew_tab(qtbot, window):
    activate(qtbot, window)
    window.tabs.setCurrentWidget(window.crew_tab.view)
    table = window.crew_tab.table
    table.setFocus()
    return table


def _click(qtbot, table, row, col):
    rect = table.visualRect(table.model().index(row, col))
    table.scrollTo(table.model().index(row, col))
    rect = table.visualRect(table.model().index(row, col))
    # The check box sits at the left of the cell.
    qtbot.mouseClick(table.viewport(), Qt.MouseButton.LeftButton,
                     pos=QPoint(rect.left() + 10, rect.center().y()))


def _crew(window):
    return window.doc.shop.crew


def test_headers_and_plan_panel_show_who_minds_each_machine(open_window):
    window = open_window(SAMPLE)
    header = window.model.headerData(FIRST_MACHINE_COL + 3, Qt.Orientation.Horizontal)
    assert header.splitlines()[-1] == "Robot cell minder"
    panel = window.plan_panel.tree
    texts = [panel.topLevelItem(i).text(0) for i in range(panel.topLevelItemCount())]
    assert "Crew (4 present)" in texts
    machines = panel.topLevelItem(texts.index("Machines (6)"))
    labels = [machines.child(i).text(0) for i in range(machines.childCount())]
    assert "Robot welder A (Robot cell minder)" in labels
    crew = panel.topLevelItem(texts.index("Crew (4 present)"))
    lines = [(crew.child(i).text(0), crew.child(i).text(1)) for i in range(crew.childCount())]
    assert ("Cell lead", "absent") in lines and ("Trainee", "not here yet") in lines


def test_marking_the_cell_lead_present_by_a_click_staffs_press_brake_2(qtbot, open_window):
    window = open_window(SAMPLE)
    assert "Press brake 2" in window.plan.idle_machines
    table = _crew_tab(qtbot, window)
    lead = [o.label for o in _crew(window).operators].index("Cell lead")
    _click(qtbot, table, lead, COL_PRESENT)
    assert _crew(window).operators[lead].attendance == "present"
    wait_plan(qtbot, window)
    assert window.plan.staffing["minding"]["Cell lead"] == ["Press brake 2"]
    qtbot.keyClick(window, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    assert _crew(window).operators[lead].attendance == "absent"
    wait_plan(qtbot, window)
    assert "Press brake 2" in window.plan.idle_machines


def test_space_authorises_and_undo_withdraws(qtbot, open_window):
    window = open_window(SAMPLE)
    table = _crew_tab(qtbot, window)
    model = window.crew_tab.model
    laser = 0   # "Laser operator", not authorised for Press brake 2 (machine 2)
    index = model.index(laser, FIRST_MACHINE + 2)
    assert model.data(index, Qt.ItemDataRole.CheckStateRole) == Qt.CheckState.Unchecked
    table.setCurrentIndex(index)
    qtbot.keyClick(table, Qt.Key.Key_Space)
    assert model.data(index, Qt.ItemDataRole.CheckStateRole) == Qt.CheckState.Checked
    assert any(a.operator == "O1" and a.machine == "M3" for a in _crew(window).authorisations)
    window.doc.undo_stack.undo()
    assert not any(a.operator == "O1" and a.machine == "M3" for a in _crew(window).authorisations)


def test_paste_a_block_of_authorisations_and_refuse_a_bad_one(qtbot, open_window):
    window = open_window(SAMPLE)
    table = _crew_tab(qtbot, window)
    model = window.crew_tab.model
    before = list(_crew(window).authorisations)
    table.setCurrentIndex(model.index(0, FIRST_MACHINE + 1))   # Laser operator, Press brake 1
    QGuiApplication.clipboard().setText("x\t1\n")
    window.act_paste.trigger()
    for col in (FIRST_MACHINE + 1, FIRST_MACHINE + 2):
        assert model.data(model.index(0, col), Qt.ItemDataRole.CheckStateRole) == Qt.CheckState.Checked
    window.doc.undo_stack.undo()
    assert _crew(window).authorisations == before
    QGuiApplication.clipboard().setText("x\tmaybe\n")
    window.act_paste.trigger()
    assert _crew(window).authorisations == before
    assert "'maybe' is neither yes" in window.statusBar().currentMessage()
    assert "nothing changed" in window.statusBar().currentMessage()


def test_expiring_authorisation_is_marked_and_add_operator_is_undoable(qtbot, open_window):
    window = open_window(SAMPLE)
    table = _crew_tab(qtbot, window)
    model = window.crew_tab.model
    welder = [o.label for o in _crew(window).operators].index("Welder (manual)")
    cell = model.index(welder, FIRST_MACHINE + 3)
    assert "7 d" in model.data(cell, Qt.ItemDataRole.DisplayRole)
    assert "expires in 7 days" in model.data(cell, Qt.ItemDataRole.ToolTipRole)
    assert model.data(cell, Qt.ItemDataRole.BackgroundRole) is not None
    n = len(_crew(window).operators)
    qtbot.mouseClick(window.crew_tab.add, Qt.MouseButton.LeftButton)
    assert len(_crew(window).operators) == n + 1 and table.model().rowCount() == n + 1
    window.doc.undo_stack.undo()
    assert len(_crew(window).operators) == n


def test_every_crew_control_has_an_accessible_name(open_window):
    window = open_window(SAMPLE)
    tab = window.crew_tab
    for widget in (tab.view, tab.table):
        assert widget.accessibleName() and widget.accessibleDescription()
    assert tab.add.text() and tab.add.accessibleDescription()


def _wait_side(qtbot, window) -> None:
    runners = (window.whatif_tab.runner, window.alternatives_tab.runner)
    qtbot.waitUntil(lambda: not any(r.is_busy() for r in runners), timeout=20_000)
    for r in runners:
        r.wait_idle()
    qtbot.waitUntil(lambda: not any(r.is_busy() for r in runners), timeout=20_000)


def test_what_if_map_and_alternatives_plan_with_the_crew(qtbot, open_window):
    """The map's numbers are those of the staffed plan (checked against brute force in
    tests/test_staffed_choices.py); every ranked plan staffs its machines."""
    from dispatcher.shop.whatif import what_if_grid
    from dispatcher.ui.whatif_view import ExtraRole

    window = open_window(SAMPLE)
    activate(qtbot, window)
    window.tabs.setCurrentWidget(window.whatif_tab.view)
    _wait_side(qtbot, window)
    model = window.whatif_tab.view.model
    grid = what_if_grid(window.plan)
    shop = window.doc.shop
    press2 = shop.machine_names().index("Press brake 2")
    cover = shop.job_names().index("WO-8103 cover")
    assert model.index(cover, press2).data(ExtraRole) == grid.extra[cover, press2] > 0
    window.tabs.setCurrentWidget(window.alternatives_tab.view)
    window.alternatives_tab.find(3)
    _wait_side(qtbot, window)
    plans = window.alternatives_tab.view.plans
    assert len(plans) == 3 and all(p.staffing is not None for p in plans)
    assert all(a.operator or a.machine in plans[1].staffing["unattended_machines"]
               for a in plans[1].assignments)
