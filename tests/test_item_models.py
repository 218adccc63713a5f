"""Every item model of the app passes pytest-qt's ``qtmodeltester`` (Qt's own model checks:
row and column counts, parents, indexes, data for every role, signals on change).

The models: the shop grid (ui/grid_model.py), the what-if map (ui/whatif_view.py), the
decision list of the history dock (ui/history_panel.py), the crew table
(ui/crew_model.py) and the changeover table editor (ui/changeover_model.py). Each is checked empty, filled
from an invented sample shop, and after a change.
"""

from __future__ import annotations

import pytest

from dispatcher.history import HistoryStore
from dispatcher.io.shopfile import load_shop, shop_to_dict
from dispatcher.shop import solve_shop
from dispatcher.shop.whatif import what_if_grid
from dispatcher.ui.changeover_model import ChangeoverModel
from dispatcher.ui.crew_model import CrewModel
from dispatcher.ui.document import ShopDocument
from dispatcher.ui.edits import SetPin
from dispatcher.ui.grid_model import GridModel
from dispatcher.ui.history_panel import DecisionListModel
from dispatcher.ui.whatif_view import WhatIfModel

ITEM_MODELS = (GridModel, WhatIfModel, DecisionListModel, CrewModel, ChangeoverModel)


@pytest.fixture
def shop(samples):
    return load_shop(samples / "small_moulding_cell.dshop")


def test_every_item_model_of_the_app_is_checked_here():
    """A new item model in ui/ must be added to this module (and to ITEM_MODELS)."""
    import importlib
    import inspect
    import pkgutil

    from PySide6.QtCore import QAbstractItemModel

    import dispatcher.ui as ui

    found = set()
    for info in pkgutil.iter_modules(ui.__path__, "dispatcher.ui."):
        module = importlib.import_module(info.name)
        for _, cls in inspect.getmembers(module, inspect.isclass):
            if issubclass(cls, QAbstractItemModel) and cls.__module__ == module.__name__:
                found.add(cls)
    assert found == set(ITEM_MODELS)


def test_grid_model(qtmodeltester, shop):
    doc = ShopDocument(shop)
    model = GridModel(doc)
    qtmodeltester.check(model)
    model.set_plan(solve_shop(doc.shop))
    qtmodeltester.check(model)
    doc.undo_stack.push(SetPin(doc, 0, 0, "must_not", "forbid"))
    qtmodeltester.check(model)
    doc.undo_stack.undo()
    qtmodeltester.check(model)


def test_what_if_model(qtmodeltester, shop):
    model = WhatIfModel()
    qtmodeltester.check(model)
    plan = solve_shop(shop)
    model.set_grid(shop, what_if_grid(plan), shop.unit.label())
    assert model.rowCount() == len(shop.jobs) and model.columnCount() == len(shop.machines)
    qtmodeltester.check(model)
    model.set_grid(None, None)
    qtmodeltester.check(model)


def test_decision_list_model(qtmodeltester, shop, tmp_path):
    model = DecisionListModel()
    qtmodeltester.check(model)
    store = HistoryStore(tmp_path / "history.sqlite")
    plan = solve_shop(shop).to_json()
    for note in ("first", "second"):
        store.record(shop_to_dict(shop), plan, by="Supervisor A", reason="shift-start", note=note)
    model.set_decisions(store.list())
    assert model.rowCount() == 2
    qtmodeltester.check(model)
    model.set_decisions([])
    qtmodeltester.check(model)


def test_crew_model(qtmodeltester, samples):
    from dispatcher.ui.edits import SetAuthorisations, SetOperatorField

    doc = ShopDocument(load_shop(samples / "small_moulding_cell.dshop"))
    model = CrewModel(doc)
    qtmodeltester.check(model)  # no crew: no rows
    doc.replace(load_shop(samples / "crewed_fabrication_cell.dshop"))
    qtmodeltester.check(model)
    doc.undo_stack.push(SetAuthorisations(doc, [(0, 1, True)], "authorise"))
    doc.undo_stack.push(SetOperatorField(doc, 1, "attendance", "absent", "absent"))
    qtmodeltester.check(model)
    doc.undo_stack.undo()
    doc.undo_stack.undo()
    qtmodeltester.check(model)


def test_changeover_model(qtmodeltester, shop):
    from dispatcher.shop import Shop

    empty = ChangeoverModel(ShopDocument(Shop()))
    qtmodeltester.check(empty)
    assert empty.rowCount() == 0 and empty.columnCount() == 0
    doc = ShopDocument(shop)
    model = ChangeoverModel(doc)
    qtmodeltester.check(model)
    t = doc.shop.changeover_tables[0]
    assert model.rowCount() == len(t.families) + 1 and model.columnCount() == len(t.families)
    assert model.setData(model.index(0, 1), "17")
    qtmodeltester.check(model)
    assert model.setData(model.index(len(t.families), 0), "")  # nothing mounted -> not allowed
    qtmodeltester.check(model)
    model.set_table(len(doc.shop.changeover_tables) - 1)
    qtmodeltester.check(model)
    doc.undo_stack.undo()
    doc.undo_stack.undo()
    qtmodeltester.check(model)
