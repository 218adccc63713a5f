"""Job pulled, headless with pytest-qt: propose -> difference -> confirm with a reason ->
recorded in the history, like a breakdown; the job leaves the shop (undo brings it back)."""

from __future__ import annotations

import pytest
from PySide6.QtWidgets import QMenu

from dispatcher.history import HistoryStore
from dispatcher.shop import DONE, solve_shop
from dispatcher.shop.proposal import without_job
from dispatcher.ui.edits import SetJobsState
from ui_support import make_window, save_shot, wait_plan


@pytest.fixture
def shop_window(qtbot, tmp_path, monkeypatch, samples):
    return make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")


def _ordinary_planned(window) -> tuple[int, str, str]:
    """Row, name and machine of a planned job that is neither rush nor pinned."""
    shop = window.doc.shop
    a = next(a for a in window.plan.assignments
             if not shop.job_by_name(a.job).rush and not shop.pins_of(shop.job_by_name(a.job).id))
    return shop.job_names().index(a.job), a.job, a.machine


def test_pulled_job_is_proposed_confirmed_and_recorded(qtbot, shop_window, tmp_path):
    window = shop_window
    row, name, machine = _ordinary_planned(window)
    count = len(window.doc.shop.jobs)
    dialog = window.decisions.pull(row)
    assert dialog is not None and dialog.isVisible() and name in dialog.windowTitle()
    assert dialog.findChild(object, "safetyReminder") is None
    text = dialog.findChild(object, "proposalDiff").text()
    assert "pulled" in text and name in text
    assert dialog.reason.currentData() == "manual-change"
    save_shot(dialog, tmp_path, "pull_dialog")
    with qtbot.waitSignal(window.decision_recorded) as rec:
        dialog.confirm("Supervisor P", "order cancelled by the customer")
    wait_plan(qtbot, window)
    shop = window.doc.shop
    assert name not in shop.job_names() and len(shop.jobs) == count - 1
    assert name not in [a.job for a in window.plan.assignments] + window.plan.waiting_jobs
    store = HistoryStore(tmp_path / "history.sqlite")
    [entry] = store.list()
    assert entry.id == rec.args[0] and entry.reason == "manual-change" and entry.by == "Supervisor P"
    decision = store.get(entry.id)
    assert decision.note == "order cancelled by the customer"
    assert name not in [j["name"] for j in decision.shop_document["jobs"]]
    assert name not in [a["job"] for a in decision.plan["assignments"]]
    # No plan was in force: the recorded plan is the core's optimum for the shop without the job.
    assert decision.plan["total"] == pytest.approx(solve_shop(shop, "total").total)
    # Undo brings the job back; the history keeps the decision (append-only).
    window.doc.undo_stack.undo()
    wait_plan(qtbot, window)
    assert window.doc.shop.jobs[row].name == name and len(window.doc.shop.jobs) == count
    assert store.count() == 1


def test_pull_after_a_recorded_plan_redispatches_from_it(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "medium_machining_shop.dshop")
    window.decisions.confirm_plan().confirm("late-shift lead", "shift start")
    wait_plan(qtbot, window)
    in_force = {a.job: a.machine for a in window.plan.assignments}
    row, name, machine = _ordinary_planned(window)
    shop_before = window.doc.shop.copy()
    dialog = window.decisions.pull(row)
    text = dialog.findChild(object, "proposalDiff").text()
    assert "Re-dispatched from the plan in force" in text and "decision #1" in text
    assert f"frees {machine}" in text
    dialog.confirm("late-shift lead", "put on hold")
    wait_plan(qtbot, window)
    decision = HistoryStore(tmp_path / "history.sqlite").get(2)
    after = {a["job"]: a["machine"] for a in decision.plan["assignments"]}
    assert name not in after
    assert decision.diff_from_replaced is not None and name in decision.diff_from_replaced.jobs_gone
    assert window.plan.total == pytest.approx(decision.plan["total"])
    # Move penalties only restrict the choice, so the recorded plan can be no better than
    # the unrestricted optimum of the same shop without the job (a lower bound).
    cold = solve_shop(without_job(shop_before, row), "total").total
    assert decision.plan["total"] >= cold - 1e-9
    kept = sum(1 for j, m in in_force.items() if j != name and after.get(j) == m)
    assert kept >= len(in_force) - 1 - 3


def test_pull_is_in_the_menus_and_refused_for_a_done_job(qtbot, shop_window):
    window = shop_window
    assert window.act_pull in window.menuBar().actions()[2].menu().actions()
    window._job_menu(0, window.view.viewport().mapToGlobal(window.view.rect().center()))
    menus = [m for m in window.findChildren(QMenu) if window.act_pull in m.actions()]
    assert len(menus) >= 2   # the Job menu and the row's context menu
    for m in menus:
        m.close()
    window.doc.undo_stack.push(SetJobsState(window.doc, [(0, {"state": DONE, "machine": None,
                                                              "since": None})], "done"))
    with qtbot.waitSignal(window.warning) as warned:
        assert window.decisions.pull(0) is None
    assert "already done" in warned.args[0]


def test_pulling_a_running_job_frees_its_machine(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "medium_machining_shop.dshop")
    shop = window.doc.shop
    row = next(i for i, j in enumerate(shop.jobs) if j.state == "running")
    name, machine_id = shop.jobs[row].name, shop.jobs[row].machine
    machine = shop.machine(machine_id).name
    assert machine not in [a.machine for a in window.plan.assignments]   # busy: not offered
    dialog = window.decisions.pull(row)
    assert f"frees {machine}" in dialog.findChild(object, "proposalDiff").text()
    dialog.confirm("day-shift lead", "customer cancelled the order")
    wait_plan(qtbot, window)
    plan = HistoryStore(tmp_path / "history.sqlite").get(1).plan
    # The machine is free again: the new plan gives it a job or lists it idle.
    assert machine in [a["machine"] for a in plan["assignments"]] + plan["idle_machines"]
    assert name not in window.doc.shop.job_names()


def test_pulled_job_takes_its_typed_cannot_run_marks_along(qtbot, shop_window, tmp_path):
    """A "cannot run" typed over a changeover table belongs to its job: when the job is
    pulled the mark goes too (else the saved file names a job it lacks and is refused on
    opening), and undo puts it back."""
    from dispatcher.io.shopfile import dump_shop_text, parse_shop_text

    window = shop_window
    shop = window.doc.shop
    assert shop.changeover_tables, "the moulding sample derives its values from tables"
    row, name, machine = _ordinary_planned(window)
    job = shop.jobs[row]
    other = next(m for m in shop.machines if m.name != machine)
    shop.blocked.add((job.id, other.id))
    assert without_job(shop, row).blocked == shop.blocked - {(job.id, other.id)}
    dialog = window.decisions.pull(row)
    with qtbot.waitSignal(window.decision_recorded):
        dialog.confirm("Supervisor P", "order cancelled by the customer")
    wait_plan(qtbot, window)
    after = window.doc.shop
    assert name not in after.job_names()
    assert all(j != job.id for j, _ in after.blocked)
    reopened = parse_shop_text(dump_shop_text(after), str(tmp_path / "saved.dshop"))
    assert name not in reopened.job_names()
    window.doc.undo_stack.undo()
    wait_plan(qtbot, window)
    assert (job.id, other.id) in window.doc.shop.blocked
