"""The grid's columns follow their headings: fitted once per opened shop, widened when a
heading grows, done a chunk of columns per turn of the event loop
(:mod:`dispatcher.ui.column_sizing`)."""

from __future__ import annotations

from PySide6.QtCore import Qt

from dispatcher.shop.model import MAINTENANCE
from dispatcher.ui import column_sizing
from dispatcher.ui.column_sizing import MAX_MACHINE_WIDTH, MIN_PLAN_WIDTH
from dispatcher.ui.edits import SetMachineFields
from dispatcher.ui.grid_model import COL_PLAN, FIRST_MACHINE_COL
from ui_support import make_window, wait_plan


def _settle(qtbot, window) -> None:
    wait_plan(qtbot, window)
    qtbot.waitUntil(window.columns.settled, timeout=10_000)


def test_opening_fits_every_machine_column_to_its_heading(qtbot, tmp_path, monkeypatch, samples):
    # The print plant has more machines than one chunk, so fitting takes several turns.
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "large_print_plant.dshop")
    assert window.doc.n_machines() > column_sizing.CHUNK
    _settle(qtbot, window)
    view = window.view
    floor = view.horizontalHeader().fontMetrics().horizontalAdvance("000000.0") + 16
    for k in range(window.doc.n_machines()):
        need = window.columns.header_need(k)
        assert view.columnWidth(FIRST_MACHINE_COL + k) == min(max(need, floor), MAX_MACHINE_WIDTH), k
    assert view.columnWidth(COL_PLAN) >= MIN_PLAN_WIDTH


def test_a_grown_heading_widens_its_column_and_undo_keeps_the_width(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "large_print_plant.dshop")
    _settle(qtbot, window)
    view, k = window.view, window.doc.n_machines() - 1   # the last column: the last chunk
    before = view.columnWidth(FIRST_MACHINE_COL + k)
    window.doc.undo_stack.push(SetMachineFields(window.doc, k, {"state": MAINTENANCE,
                                                                "state_note": "belt guard check, invented"},
                                                "maintenance"))
    _settle(qtbot, window)
    need = min(window.columns.header_need(k), MAX_MACHINE_WIDTH)
    assert need > before, "the maintenance heading is longer than the 'up' one"
    assert view.columnWidth(FIRST_MACHINE_COL + k) == need
    window.doc.undo_stack.undo()
    _settle(qtbot, window)
    assert view.columnWidth(FIRST_MACHINE_COL + k) == need, "columns never shrink on their own"


def test_a_new_shop_drops_a_sizing_under_way(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "large_print_plant.dshop")
    window.columns.size_soon()
    assert not window.columns.settled()
    window.columns.start_over()
    assert window.columns.settled()


def test_headings_answer_only_the_roles_they_have(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "large_print_plant.dshop")
    model, section = window.model, FIRST_MACHINE_COL
    name = window.doc.machine_at(0).name
    assert model.headerData(section, Qt.Orientation.Horizontal).startswith(name)
    assert name in model.headerData(section, Qt.Orientation.Horizontal, Qt.ItemDataRole.ToolTipRole)
    for role in (Qt.ItemDataRole.FontRole, Qt.ItemDataRole.SizeHintRole, Qt.ItemDataRole.DecorationRole):
        assert model.headerData(section, Qt.Orientation.Horizontal, role) is None
