"""Setup families and changeover tables in the shop model and the shop document.

External references: scipy.optimize.linear_sum_assignment on a value matrix built here
by hand from the table (outside the model), and the definition of the derived grid
(value = change from the mounted family to the job's family) applied cell by cell.
Invented shop: a moulding cell with two presses sharing one table and a third with none.
"""

from __future__ import annotations

import json
import math

import numpy as np
import pytest
from scipy.optimize import linear_sum_assignment

from dispatcher.io.shopfile import (
    FORMAT_VERSION,
    ShopFileError,
    dump_shop_text,
    parse_shop_text,
    shop_to_dict,
)
from dispatcher.shop import (
    ChangeoverTable,
    Job,
    Machine,
    Shop,
    ShopError,
    check_shop,
    solve_shop,
)
from dispatcher.shop.redispatch import ShopEvent, apply_events, redispatch_shop

TABLE = {("mould A", "mould A"): 0.0, ("mould A", "mould B"): 40.0, ("mould B", "mould A"): 35.0,
         ("mould B", "mould B"): 5.0, (None, "mould A"): 20.0, (None, "mould B"): 20.0}


def moulding_cell() -> Shop:
    shop = Shop(name="Invented moulding cell")
    shop.machines = [Machine("M1", "Press 1", mounted="mould A"),
                     Machine("M2", "Press 2", mounted="mould B"),
                     Machine("M3", "Press 3")]
    shop.jobs = [Job("J1", "WO-1 lid", family="mould A"), Job("J2", "WO-2 cap", family="mould B"),
                 Job("J3", "WO-3 tray", family="mould B"), Job("J4", "WO-4 clip")]
    shop.changeover_tables = [ChangeoverTable("T1", "presses 80-200 t", ["M1", "M2"],
                                              ["mould A", "mould B"], dict(TABLE))]
    shop.grid = {("J4", "M1"): 12.0, ("J4", "M3"): 9.0, ("J1", "M3"): 30.0, ("J2", "M1"): 3.0}
    return shop


def test_derived_values_follow_the_definition_and_typed_ones_override():
    shop = moulding_cell()
    check_shop(shop)
    mounted = {"M1": "mould A", "M2": "mould B", "M3": None}
    for j in shop.jobs:
        for m in shop.machines:
            typed = shop.grid.get((j.id, m.id))
            derived = (TABLE.get((mounted[m.id], j.family))
                       if j.family is not None and m.id in ("M1", "M2") else None)
            assert shop.value(j.id, m.id) == (typed if typed is not None else derived)
            assert shop.value_source(j.id, m.id) == (
                "typed" if typed is not None else "derived" if derived is not None else None)
    assert shop.value("J2", "M1") == 3.0 and shop.derived_value("J2", "M1") == 40.0


def test_plan_uses_the_derived_grid():
    shop = moulding_cell()
    values, allowed = shop.matrix()
    # the same matrix written out by hand from the table (rows J1..J4, columns M1..M3)
    nan = math.nan
    expect = np.array([[0, 35, 30], [3, 5, nan], [40, 5, nan], [12, nan, 9]])
    assert np.array_equal(np.where(allowed, values, nan), expect, equal_nan=True)
    plan = solve_shop(shop, objective="total")
    big = np.where(np.isnan(expect), 1e6, expect)
    rows, cols = linear_sum_assignment(big)               # scipy, on the hand-made matrix
    assert plan.total == pytest.approx(big[rows, cols].sum())


def test_mounted_family_follows_a_job_that_starts_and_is_done():
    shop = moulding_cell()
    shop.mark_running("J2", "M1")
    assert shop.machine("M1").mounted == "mould B"
    assert shop.value("J3", "M1") == 5.0                    # B -> B now
    shop.mark_done("J2")
    assert shop.job("J2").state == "done" and shop.machine("M1").mounted == "mould B"


def test_redispatch_done_event_keeps_the_family_mounted():
    shop = moulding_cell()
    shop.mark_running("J3", "M1")
    after, _left, _arrived = apply_events(shop, [ShopEvent("done", "WO-3 tray")])
    assert after.machine("M1").mounted == "mould B"
    assert after.value("J2", "M1") == 3.0 and after.value("J1", "M1") == 35.0


def test_redispatch_after_a_breakdown_uses_the_mounted_families():
    """Press 2 goes down: its B jobs move; on Press 1 (mould A mounted) B costs 40 unless typed."""
    shop = moulding_cell()
    result = redispatch_shop(shop, [ShopEvent("down", "Press 2")])
    values = {(a.job, a.machine): a.cost for a in result.plan.assignments}
    for (job, machine), cost in values.items():
        j, m = shop.job_by_name(job), shop.machine_by_name(machine)
        assert cost == shop.value(j.id, m.id)
    assert ("WO-3 tray", "Press 1") not in values or values[("WO-3 tray", "Press 1")] == 40.0


def test_document_round_trip_and_version():
    shop = moulding_cell()
    shop.machines[1].end_family = "mould A"
    text = dump_shop_text(shop)
    data = json.loads(text)
    assert data["format_version"] == FORMAT_VERSION == 3
    back = parse_shop_text(text)
    assert back.changeover_tables == shop.changeover_tables
    assert [(m.mounted, m.end_family) for m in back.machines] == [
        ("mould A", None), ("mould B", "mould A"), (None, None)]
    assert [j.family for j in back.jobs] == ["mould A", "mould B", "mould B", None]
    assert data["changeover_tables"][0]["from_empty"] == {"mould A": 20, "mould B": 20}


def test_plain_grid_shop_is_still_written_as_version_one():
    """Older readers keep reading shops without families: nothing new is written."""
    shop = moulding_cell()
    shop.changeover_tables.clear()
    for j in shop.jobs:
        j.family = None
    for m in shop.machines:
        m.mounted = None
    data = json.loads(dump_shop_text(shop))
    assert data["format_version"] == 1 and "changeover_tables" not in data
    assert all("family" not in j for j in data["jobs"])
    assert all("mounted" not in m and "end_family" not in m for m in data["machines"])


def test_version_one_documents_still_read():
    doc = {"format": "dispatcher-shop", "format_version": 1,
           "machines": [{"id": "M1", "name": "Press 1"}], "jobs": [{"id": "J1", "name": "WO-1"}],
           "grid": {"J1": {"M1": 4}}}
    shop = parse_shop_text(json.dumps(doc))
    assert shop.value("J1", "M1") == 4 and shop.changeover_tables == []


def doc_with(edit) -> str:
    data = shop_to_dict(moulding_cell())
    edit(data)
    return json.dumps(data)


def table(data):
    return data["changeover_tables"][0]


@pytest.mark.parametrize("edit,message", [
    (lambda d: table(d)["changes"]["mould A"].update({"mould B": -5}),
     r"changeover table 'presses 80-200 t' \(#1\), change from 'mould A' to 'mould B': "
     r"value -5\.0 must be a number >= 0"),
    (lambda d: table(d)["changes"]["mould A"].update({"mould B": "forty"}),
     r"field 'changes', from 'mould A' to 'mould B': expected a number >= 0 "
     r"\(or null: not allowed\), got the text 'forty'"),
    (lambda d: table(d)["from_empty"].update({"mould A": True}),
     r"field 'from_empty', to 'mould A': expected a number"),
    (lambda d: table(d)["families"].append("mould A"),
     r"field 'families': family 'mould A' is listed 2 times"),
    (lambda d: d["machines"][0].update(mounted="mould Z"),
     r"machine 'Press 1' \(id M1\), field 'mounted': family 'mould Z' is not in the machine's changeover table 'T1'"),
    (lambda d: d["machines"][2].update(end_family="mould Z"),
     r"machine 'Press 3' \(id M3\), field 'end_family': no changeover table knows family 'mould Z'"),
    (lambda d: table(d)["machines"].append("M9"),
     r"field 'machines': names unknown machine id 'M9'"),
    (lambda d: d["changeover_tables"].append(dict(table(d), id="T2")),
     r"Press 1' \(id M1\) is already in changeover table 'T1'"),
    (lambda d: table(d)["changes"]["mould A"].update({"mould C": 3}),
     r"change from 'mould A' to 'mould C': family 'mould C' is not in the table's families"),
    (lambda d: table(d).update(colour="red"), r"unknown field 'colour'"),
    (lambda d: d["jobs"][0].update(family=""), r"job 'WO-1 lid' \(id J1\), field 'family': must be a non-empty"),
])
def test_bad_changeover_input_is_refused_with_its_place(edit, message):
    with pytest.raises(ShopFileError, match=message):
        parse_shop_text(doc_with(edit), "cell.dshop")


def test_nan_entry_in_the_model_is_refused():
    shop = moulding_cell()
    shop.changeover_tables[0].changes[("mould A", "mould B")] = math.nan
    with pytest.raises(ShopError, match="change from 'mould A' to 'mould B': value nan"):
        check_shop(shop)


def test_missing_entry_means_not_allowed():
    shop = moulding_cell()
    del shop.changeover_tables[0].changes[("mould B", "mould A")]
    assert shop.value("J1", "M2") is None and shop.value_source("J1", "M2") is None
    shop.jobs[0].family = "mould X"                     # in no table: cannot run on M1/M2
    check_shop(shop)
    assert shop.value("J1", "M1") is None and shop.value("J1", "M3") == 30.0


def test_table_matrix_has_the_nothing_mounted_row_last():
    t = moulding_cell().changeover_tables[0]
    assert t.matrix().tolist() == [[0, 40], [35, 5], [20, 20]]


def test_copy_shares_no_changeover_table_container():
    shop = moulding_cell()
    twin = shop.copy()
    twin.changeover_tables[0].changes[("mould A", "mould B")] = 99.0
    twin.changeover_tables[0].machines.append("M3")
    twin.changeover_tables[0].families.append("mould C")
    twin.machines[0].mounted = "mould B"
    assert shop.changeover_tables[0].changes[("mould A", "mould B")] == 40.0
    assert shop.changeover_tables[0].machines == ["M1", "M2"]
    assert shop.changeover_tables[0].families == ["mould A", "mould B"]
    assert shop.machines[0].mounted == "mould A"


def test_typed_cannot_run_overrides_a_derived_value_and_is_saved():
    shop = moulding_cell()
    assert shop.value("J1", "M2") == 35.0                 # derived: mould B -> mould A
    shop.set_value("J1", "M2", None)                       # typed "cannot run"
    assert shop.value("J1", "M2") is None and shop.value_source("J1", "M2") == "typed"
    assert not shop.matrix()[1][0, 1]
    back = parse_shop_text(dump_shop_text(shop))
    assert back.value("J1", "M2") is None and back.blocked == {("J1", "M2")}
    back.set_value("J1", "M2", 7.0)
    assert back.value("J1", "M2") == 7.0 and back.blocked == set()
