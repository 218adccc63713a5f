"""The grid model without a window: shape, roles, undoable edits, explicit dataChanged
roles, pins, and the clipboard block round trip."""

from __future__ import annotations

import pytest
from PySide6.QtCore import QModelIndex, Qt

from dispatcher.io.shopfile import load_shop
from dispatcher.shop import MUST_NOT, solve_shop
from dispatcher.ui.clipboard import PasteError, copy_block, paste_changes
from dispatcher.ui.document import ShopDocument
from dispatcher.ui.grid_model import (
    COL_PENALTY,
    COL_RUSH,
    FIRST_MACHINE_COL,
    GridModel,
    PinRole,
    PlannedRole,
    ValueRole,
)
from dispatcher.ui.edits import SetPin


@pytest.fixture
def doc(samples):
    return ShopDocument(load_shop(samples / "small_moulding_cell.dshop"))


def test_shape_and_valid_parent(doc):
    model = GridModel(doc)
    assert model.rowCount() == len(doc.shop.jobs)
    assert model.columnCount() == FIRST_MACHINE_COL + len(doc.shop.machines)
    parent = model.index(0, 0)
    assert model.rowCount(parent) == 0 and model.columnCount(parent) == 0
    assert model.rowCount(QModelIndex()) == len(doc.shop.jobs)


def test_edit_is_undoable_and_emits_explicit_roles(qtbot, doc):
    model = GridModel(doc)
    job, machine = doc.shop.jobs[0], doc.shop.machines[0]
    idx = model.index(0, FIRST_MACHINE_COL)
    old = idx.data(ValueRole)
    with qtbot.waitSignal(model.dataChanged) as blocker:
        assert model.setData(idx, "12,5")
    top, bottom, roles = blocker.args
    assert (top.row(), top.column()) == (0, FIRST_MACHINE_COL) and roles
    assert ValueRole in roles and Qt.ItemDataRole.DisplayRole in roles
    assert doc.shop.value(job.id, machine.id) == 12.5
    assert idx.data(Qt.ItemDataRole.DisplayRole).endswith("12.5")
    doc.undo_stack.undo()
    assert doc.shop.value(job.id, machine.id) == old
    doc.undo_stack.redo()
    assert doc.shop.value(job.id, machine.id) == 12.5
    assert model.setData(idx, "x")
    assert doc.shop.value(job.id, machine.id) is None
    # the pair had a value from the changeover table: "cannot run" is typed over it (pencil)
    assert idx.data(Qt.ItemDataRole.DisplayRole) == "\u270e\u2014"


def test_rush_and_penalty_columns(doc):
    model = GridModel(doc)
    row = next(i for i, j in enumerate(doc.shop.jobs) if not j.rush)
    assert model.setData(model.index(row, COL_RUSH), Qt.CheckState.Checked.value,
                         Qt.ItemDataRole.CheckStateRole)
    assert doc.shop.jobs[row].rush
    assert "RUSH" in model.index(row, COL_RUSH).data()
    assert model.setData(model.index(row, COL_PENALTY), "40")
    assert doc.shop.jobs[row].wait_penalty == 40
    assert not model.setData(model.index(row, COL_PENALTY), "x")
    doc.undo_stack.undo()
    doc.undo_stack.undo()
    assert not doc.shop.jobs[row].rush and doc.shop.jobs[row].wait_penalty != 40


def test_pins_show_a_mark_and_reach_the_solver(doc):
    model = GridModel(doc)
    shop = doc.shop
    plan = solve_shop(shop)
    a = next(a for a in plan.assignments if not shop.job_by_name(a.job).rush
             and not shop.pins_of(shop.job_by_name(a.job).id))
    row, col = shop.job_names().index(a.job), shop.machine_names().index(a.machine)
    doc.undo_stack.push(SetPin(doc, row, col, MUST_NOT, "forbid"))
    idx = model.index(row, FIRST_MACHINE_COL + col)
    assert idx.data(PinRole) == MUST_NOT and "\u2715" in idx.data()
    assert solve_shop(shop).machine_of(a.job) != a.machine
    doc.undo_stack.undo()
    assert idx.data(PinRole) is None
    assert solve_shop(shop).machine_of(a.job) == a.machine


def test_plan_marks_follow_the_plan(doc):
    model = GridModel(doc)
    plan = solve_shop(doc.shop)
    model.set_plan(plan)
    for a in plan.assignments:
        r, c = doc.shop.job_names().index(a.job), doc.shop.machine_names().index(a.machine)
        idx = model.index(r, FIRST_MACHINE_COL + c)
        assert idx.data(PlannedRole) is True and "\u2713" in idx.data()
    planned = sum(bool(model.index(r, FIRST_MACHINE_COL + c).data(PlannedRole))
                  for r in range(model.rowCount()) for c in range(len(doc.shop.machines)))
    assert planned == len(plan.assignments)


def test_copy_then_paste_round_trips(doc):
    shop = doc.shop
    text = copy_block(shop, [0, 1, 2], [0, 1, 2])
    changes = paste_changes(text, shop, 0, 0)
    assert all(shop.value(shop.jobs[r].id, shop.machines[c].id) == v for r, c, v in changes)
    named = copy_block(shop, [3], [4], with_names=True)
    assert paste_changes(named, shop, 0, 0) == [(3, 4, shop.value(shop.jobs[3].id, shop.machines[4].id))]


@pytest.mark.parametrize("text, message", [
    ("1\t-2\n", "row 1, column 2: -2 is negative"),
    ("1\t2\t3\t4\t5\t6\n", "do not fit"),
    ("nan\n", "not a finite number"),
])
def test_bad_blocks_are_refused_with_their_place(doc, text, message):
    with pytest.raises(PasteError, match=message):
        paste_changes(text, doc.shop, 0, 0)


def _every_role_matches(model, roles):
    """Each cell's answer (cached) equals the one worked out afresh from the document."""
    for r in range(model.rowCount()):
        for c in range(model.columnCount()):
            idx = model.index(r, c)
            for role in roles:
                assert idx.data(role) == model.computed_data(r, c, role), (r, c, role)


def test_cached_cell_answers_follow_every_kind_of_change(doc):
    from dispatcher.shop import DOWN
    from dispatcher.ui.edits import SetJobField, SetMachineFields, SetValues
    from dispatcher.ui.grid_model import CACHED_ROLES
    roles = list(CACHED_ROLES) + [int(Qt.ItemDataRole.ToolTipRole)]
    assert any(j.family for j in doc.shop.jobs) and doc.shop.changeover_tables
    model = GridModel(doc)
    _every_role_matches(model, roles)
    before = model.index(0, FIRST_MACHINE_COL).data()
    model.set_plan(solve_shop(doc.shop))       # plan marks, bold font, colours
    _every_role_matches(model, roles)
    doc.undo_stack.push(SetValues(doc, [(0, 0, 71.0), (1, 1, None)], "two values"))
    assert model.index(0, FIRST_MACHINE_COL).data(ValueRole) == 71.0 != before
    assert model.index(1, FIRST_MACHINE_COL + 1).data(ValueRole) is None
    doc.undo_stack.push(SetPin(doc, 2, 0, MUST_NOT, "forbid"))
    doc.undo_stack.push(SetJobField(doc, 0, "rush", True, "rush"))
    doc.undo_stack.push(SetMachineFields(doc, 1, {"state": DOWN}, "down"))
    families = sorted({j.family for j in doc.shop.jobs if j.family})
    assert len(families) >= 2            # the sample prices changeovers: derived values
    other = next(f for f in families if f != doc.shop.jobs[3].family)
    doc.undo_stack.push(SetJobField(doc, 3, "family", other, "family"))
    _every_role_matches(model, roles)
    # a plan arriving for the edited shop (other cells planned) and no plan at all: the
    # cells it leaves alone keep their cached answers, the others follow
    first = {r: model.planned_col(r) for r in range(model.rowCount())}
    model.set_plan(solve_shop(doc.shop))
    assert {r: model.planned_col(r) for r in range(model.rowCount())} != first
    _every_role_matches(model, roles)
    model.set_plan(None)
    _every_role_matches(model, roles)
    for _ in range(5):
        doc.undo_stack.undo()
    _every_role_matches(model, roles)
    assert model.index(0, FIRST_MACHINE_COL).data() == before
