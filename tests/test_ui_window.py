"""The main window, driven headless with pytest-qt: edits re-solve the plan, paste, undo and
redo, the breakdown and rush flows record decisions, files round-trip, bad files are
refused without touching the open document."""

from __future__ import annotations

import itertools

import numpy as np
import pytest
from PySide6.QtCore import Qt
from PySide6.QtGui import QGuiApplication

from dispatcher.history import HistoryStore
from dispatcher.io.shopfile import load_shop, shop_to_dict
from dispatcher.shop import DOWN, solve_shop
from dispatcher.shop.translate import build_problem
from dispatcher.ui.decision import SAFETY_REMINDER
from dispatcher.ui.grid_model import COL_HOURS, FIRST_MACHINE_COL, PlannedRole
from helpers_reference import scipy_reference
from ui_support import activate, make_window, open_file, reference_total, save_shot, wait_plan


@pytest.fixture
def grid_window(qtbot, tmp_path, monkeypatch, samples):
    return make_window(qtbot, tmp_path, monkeypatch, samples / "sheet_metal_grid.csv")


@pytest.fixture
def shop_window(qtbot, tmp_path, monkeypatch, samples):
    return make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")


def _edit(qtbot, window, row: int, col: int, text: str) -> None:
    idx = window.model.index(row, FIRST_MACHINE_COL + col)
    assert window.model.setData(idx, text, Qt.ItemDataRole.EditRole)
    wait_plan(qtbot, window)


def test_plan_matches_scipy_after_editing_a_planned_cell(qtbot, grid_window):
    window = grid_window
    values, allowed = window.doc.shop.matrix()
    # scipy's linear_sum_assignment is the reference for the plan's total.
    assert window.plan.total == pytest.approx(reference_total(values, allowed))
    a = window.plan.assignments[0]
    row = window.doc.shop.job_names().index(a.job)
    col = window.doc.shop.machine_names().index(a.machine)
    assert window.model.index(row, FIRST_MACHINE_COL + col).data(PlannedRole) is True
    _edit(qtbot, window, row, col, "5000")
    values, allowed = window.doc.shop.matrix()
    assert values[row, col] == 5000
    assert window.plan.total == pytest.approx(reference_total(values, allowed))
    assert window.plan.machine_of(a.job) != a.machine
    assert window.model.index(row, FIRST_MACHINE_COL + col).data(PlannedRole) is False


def test_typed_text_that_is_not_a_number_is_refused_with_a_message(qtbot, grid_window):
    window = grid_window
    before = shop_to_dict(window.doc.shop)
    with qtbot.waitSignal(window.model.warning) as blocker:
        ok = window.model.setData(window.model.index(0, FIRST_MACHINE_COL), "twelve")
    assert not ok
    assert "'twelve' is not a number" in blocker.args[0]
    assert shop_to_dict(window.doc.shop) == before
    assert window.doc.undo_stack.count() == 0


def test_paste_a_block_then_undo_and_redo_with_the_keyboard(qtbot, grid_window):
    window = grid_window
    shop = window.doc.shop
    original = shop_to_dict(shop)
    window.view.setCurrentIndex(window.model.index(1, FIRST_MACHINE_COL + 2))
    assert window.edits.paste_text("1\t2\n3\tx\n")
    wait_plan(qtbot, window)
    assert shop.value(shop.jobs[1].id, shop.machines[2].id) == 1
    assert shop.value(shop.jobs[1].id, shop.machines[3].id) == 2
    assert shop.value(shop.jobs[2].id, shop.machines[2].id) == 3
    assert shop.value(shop.jobs[2].id, shop.machines[3].id) is None
    values, allowed = shop.matrix()
    assert window.plan.total == pytest.approx(reference_total(values, allowed))  # scipy
    pasted = shop_to_dict(shop)

    activate(qtbot, window)
    window.view.setFocus()
    qtbot.keyClick(window.view, Qt.Key.Key_Z, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    assert shop_to_dict(shop) == original
    values, allowed = shop.matrix()
    assert window.plan.total == pytest.approx(reference_total(values, allowed))
    qtbot.keyClick(window.view, Qt.Key.Key_Y, Qt.KeyboardModifier.ControlModifier)
    wait_plan(qtbot, window)
    assert shop_to_dict(shop) == pasted


def test_paste_with_names_goes_to_the_named_cells(qtbot, grid_window):
    window = grid_window
    shop = window.doc.shop
    job, machine = shop.jobs[5], shop.machines[6]
    text = f"label\t{machine.name}\n{job.name}\t7.5\n"
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    assert window.edits.paste_text(text)
    assert shop.value(job.id, machine.id) == 7.5


def test_a_bad_paste_names_row_and_column_and_changes_nothing(qtbot, grid_window):
    window = grid_window
    before = shop_to_dict(window.doc.shop)
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    with qtbot.waitSignal(window.warning) as blocker:
        assert not window.edits.paste_text("1\t2\n3\tabc\n")
    assert "row 2, column 2" in blocker.args[0] and "'abc' is not a number" in blocker.args[0]
    assert shop_to_dict(window.doc.shop) == before


def test_machine_down_confirmed_is_recorded_with_safety_reminder(qtbot, shop_window, tmp_path):
    window = shop_window
    shop = window.doc.shop
    # A machine running an ordinary (not rush, not pinned) job.
    busy = next(a.machine for a in window.plan.assignments
                if not shop.job_by_name(a.job).rush and not shop.pins_of(shop.job_by_name(a.job).id))
    col = shop.machine_names().index(busy)
    dialog = window.decisions.machine_event("down", col)
    assert dialog is not None and dialog.isVisible()
    texts = " ".join(w.text() for w in dialog.findChildren(type(dialog.findChild(object, "safetyReminder"))))
    assert SAFETY_REMINDER in texts and "lockout/tagout" in SAFETY_REMINDER
    assert busy in dialog.findChild(object, "proposalDiff").text()
    save_shot(dialog, tmp_path, "breakdown_dialog")
    with qtbot.waitSignal(window.decision_recorded) as rec:
        dialog.confirm("Supervisor A", "hydraulic leak")
    wait_plan(qtbot, window)
    assert shop.machines[col].state == DOWN
    assert busy not in [a.machine for a in window.plan.assignments]
    store = HistoryStore(tmp_path / "history.sqlite")
    [entry] = store.list()
    assert entry.id == rec.args[0] and entry.reason == "breakdown" and entry.by == "Supervisor A"
    decision = store.get(entry.id)
    assert decision.note == "hydraulic leak"
    assert busy not in [a["machine"] for a in decision.plan["assignments"]]
    # The recorded plan is what the core computes for the shop after the event.
    assert decision.plan["total"] == pytest.approx(solve_shop(shop, "total").total)
    # Undo puts the machine back up; the history keeps the decision (append-only).
    window.doc.undo_stack.undo()
    assert shop.machines[col].state == "up"
    assert store.count() == 1


def test_breakdown_that_strands_a_rush_job_still_offers_a_plan(qtbot, shop_window, tmp_path):
    window = shop_window
    shop = window.doc.shop
    rush_machine = next(a.machine for a in window.plan.assignments if shop.job_by_name(a.job).rush)
    col = shop.machine_names().index(rush_machine)
    dialog = window.decisions.machine_event("down", col)
    text = dialog.findChild(object, "proposalDiff").text()
    assert "Not every rush job can be placed" in text and "rush flags stay set" in text
    # Brute force over machine choices: with the machine down, how many of the jobs that
    # must run (rush, or pinned to a machine) fit at most; the proposal leaves exactly the
    # others waiting, and names them.
    values, allowed = shop.matrix()
    allowed = allowed.copy()
    allowed[:, col] = False
    for p in shop.pins:
        if p.kind == "must":
            i = next(n for n, j in enumerate(shop.jobs) if j.id == p.job)
            keep = allowed[i, [m.id for m in shop.machines].index(p.machine)]
            allowed[i] = False
            allowed[i, [m.id for m in shop.machines].index(p.machine)] = keep
    pinned = {p.job for p in shop.pins if p.kind == "must"}
    rush = [i for i, j in enumerate(shop.jobs) if (j.rush or j.id in pinned) and j.state == "waiting"]
    most = max(sum(1 for i, k in zip(rush, pick) if k is not None and allowed[i, k])
               for pick in itertools.product(*[[None, *np.flatnonzero(allowed[i])] for i in rush])
               if len({k for k in pick if k is not None}) == sum(k is not None for k in pick))
    waiting_rush = [shop.jobs[i].name for i in rush if shop.jobs[i].name in dialog.proposal.plan.waiting_jobs]
    assert len(waiting_rush) == len(rush) - most >= 1
    assert all(name in text for name in waiting_rush)
    dialog.confirm("night-shift lead")
    wait_plan(qtbot, window)
    assert shop.machines[col].state == DOWN
    assert HistoryStore(tmp_path / "history.sqlite").count() == 1


def test_rush_job_arrival_is_recorded(qtbot, shop_window, tmp_path):
    window = shop_window
    shop = window.doc.shop
    row = shop.job_names().index(window.plan.waiting_jobs[0])
    name = shop.jobs[row].name
    dialog = window.decisions.rush(row)
    assert dialog.findChild(object, "safetyReminder") is None
    dialog.confirm("Supervisor B")
    wait_plan(qtbot, window)
    assert shop.jobs[row].rush
    assert window.plan is not None
    if name in window.plan.waiting_jobs:   # it cannot be placed: the panel says why
        assert "rush" in window.plan_panel.status.text() and name in window.plan_panel.status.text()
    [entry] = HistoryStore(tmp_path / "history.sqlite").list()
    assert entry.reason == "rush-job"


def test_save_and_reopen_gives_the_identical_shop(qtbot, shop_window, tmp_path):
    window = shop_window
    _edit(qtbot, window, 0, 0, "33")
    window.edits.set_slots(1, 2)
    assert window.doc.dirty
    target = tmp_path / "saved.dshop"
    assert window.files.save_as(target)
    assert not window.doc.dirty
    saved = shop_to_dict(window.doc.shop)
    assert shop_to_dict(load_shop(target)) == saved
    window.files.new()
    assert window.doc.n_jobs() == 0
    assert open_file(qtbot, window, target)
    assert shop_to_dict(window.doc.shop) == saved
    assert str(target) in window.files.recent()


@pytest.mark.parametrize("content", ["{ not json", '{"format": "dispatcher-shop", "format_version": 99}',
                                     "", "\x00\x01binary"])
def test_a_bad_file_shows_a_message_and_keeps_the_document(qtbot, shop_window, tmp_path, content):
    window = shop_window
    _edit(qtbot, window, 0, 0, "44")
    before, path, shop = shop_to_dict(window.doc.shop), window.doc.path, window.doc.shop
    bad = tmp_path / "broken.dshop"
    bad.write_text(content, encoding="utf-8")
    assert not open_file(qtbot, window, bad)
    kind, title, text = window.messenger.messages[-1]
    assert kind == "error" and str(bad) in text
    assert window.doc.shop is shop and window.doc.path == path and window.doc.dirty
    assert shop_to_dict(window.doc.shop) == before


def test_unsaved_changes_prompt_can_cancel_opening(qtbot, shop_window, samples):
    window = shop_window
    _edit(qtbot, window, 0, 0, "45")
    window.messenger.save_answer = "cancel"
    shop = window.doc.shop
    assert not open_file(qtbot, window, samples / "sheet_metal_grid.csv")
    assert window.doc.shop is shop
    assert window.messenger.messages[-1][0] == "save?"


def test_autosave_is_offered_back_after_a_crash(qtbot, tmp_path, monkeypatch, samples):
    first = make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")
    _edit(qtbot, first, 1, 1, "99")
    first.files.autosave_now(wait=True)
    expected = shop_to_dict(first.doc.shop)
    # Simulate a crash: the first window never closes normally, so its copy stays.
    second = make_window(qtbot, tmp_path, monkeypatch)
    assert second.files.recover()
    assert shop_to_dict(second.doc.shop) == expected
    assert second.doc.dirty


def test_switching_the_objective_re_solves(qtbot, grid_window):
    window = grid_window
    window.plan_panel.objective.setCurrentIndex(window.plan_panel.objective.findData("bottleneck"))
    wait_plan(qtbot, window)
    assert window.plan.objective == "bottleneck"
    values, allowed = window.doc.shop.matrix()
    # Reference: the smallest threshold t for which scipy still finds a full assignment
    # using only pairs <= t (brute force over the distinct values).
    best = None
    for t in np.unique(values[allowed]):
        ok = allowed & (values <= t)
        try:
            total = reference_total(values, ok)
        except AssertionError:
            continue
        best = t
        break
    assert window.plan.bottleneck == pytest.approx(best)
    # and among plans within that bottleneck, the least total (scipy on those pairs)
    assert window.plan.total == pytest.approx(total)


def test_no_exception_escapes_during_a_session(qtbot, shop_window, samples, tmp_path):
    window = shop_window
    with qtbot.captureExceptions() as exceptions:
        for objective in ("maximize", "bottleneck", "total"):
            window.set_objective(objective)
        window.view.setCurrentIndex(window.model.index(2, FIRST_MACHINE_COL + 1))
        doc = window.doc
        job, machine = doc.job_at(2), doc.machine_at(1)
        value = doc.value_at(2, 1)
        assert value is not None  # the cell has a setup value to take away below
        window.edits.pin("must")
        assert doc.pin_at(2, 1) == "must"
        others = [p for p in doc.shop.pins_of(job.id) if p.machine != machine.id]
        assert [(p.job, p.machine, p.kind) for p in doc.shop.pins_of(job.id)
                if p.machine == machine.id] == [(job.id, machine.id, "must")]
        window.edits.pin("must_not")
        assert doc.pin_at(2, 1) == "must_not"
        window.edits.pin(None)
        assert doc.pin_at(2, 1) is None and doc.shop.pins_of(job.id) == others
        window.edits.cannot_run()
        assert doc.value_at(2, 1) is None and (job.id, machine.id) not in doc.shop.grid
        QGuiApplication.clipboard().clear()
        window.edits.copy(True)
        copied = QGuiApplication.clipboard().text()
        assert job.name in copied and machine.name in copied
        window.edits.paste_text("")
        window.doc.undo_stack.undo()
        assert doc.value_at(2, 1) == value  # the cannot-run edit undone
        window.doc.undo_stack.redo()
        assert doc.value_at(2, 1) is None
        window.request_solve()
        window.runner.cancel()
        wait_plan(qtbot, window)
        assert not open_file(qtbot, window, tmp_path / "missing.dshop")
        assert open_file(qtbot, window, samples / "medium_machining_shop.dshop")
        wait_plan(qtbot, window)
    assert exceptions == []
    assert window.plan is not None


def test_screenshot_of_the_main_window(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "medium_machining_shop.dshop")
    window.show()
    qtbot.waitExposed(window)
    wait_plan(qtbot, window)
    out = save_shot(window, tmp_path, "main_window")
    assert out.stat().st_size > 10_000


def test_breakdown_after_a_recorded_plan_redispatches_from_it(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "medium_machining_shop.dshop")
    window.decisions.confirm_plan().confirm("late-shift lead", "shift start")
    wait_plan(qtbot, window)
    shop = window.doc.shop
    assert shop.plan_in_force
    in_force = window.plan
    busy = next(a.machine for a in in_force.assignments if not shop.job_by_name(a.job).rush)
    col = shop.machine_names().index(busy)
    dialog = window.decisions.machine_event("down", col)
    text = dialog.findChild(object, "proposalDiff").text()
    assert "Re-dispatched from the plan in force" in text and "decision #1" in text
    dialog.confirm("late-shift lead", "spindle fault")
    wait_plan(qtbot, window)
    decision = HistoryStore(tmp_path / "history.sqlite").get(2)
    assert busy not in [a["machine"] for a in decision.plan["assignments"]]
    # The window shows the plan just put in force, not a fresh solve that ignores moves.
    assert window.plan.total == pytest.approx(decision.plan["total"])
    assert "decision #2" in window.plan_panel.status.text()
    assert decision.diff_from_replaced is not None and decision.diff_from_replaced.from_id == 1
    # Jobs dispatched by the plan in force move only when it pays: the new plan plus the
    # move penalties it pays is the optimum of the round with a move penalty on every
    # other choice of a dispatched job (none for the jobs of the broken machine), by
    # scipy's linear_sum_assignment on that problem (encoding in helpers_reference).
    before = {a.job: a.machine for a in in_force.assignments}
    after = {a["job"]: a["machine"] for a in decision.plan["assignments"]}
    problem = build_problem(shop)
    values, penalty = problem.values.copy(), problem.wait_penalty.copy()
    paid = 0.0
    for n in range(len(problem.rows)):
        job = shop.jobs[problem.rows[n]]
        if before.get(job.name) in (None, busy):
            continue
        move = job.move_penalty if job.move_penalty is not None else shop.move_penalty
        values[n, [problem.machine_name(c) != before[job.name] for c in range(len(problem.columns))]] += move
        penalty[n] += move
        paid += move if after.get(job.name) != before[job.name] else 0.0
    reference = scipy_reference(values, problem.allowed, penalty, problem.must_run)
    assert reference.feasible
    assert decision.plan["total"] + paid == pytest.approx(reference.total)


def test_whole_shift_mode_fills_machines_within_their_hours(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "medium_machining_shop.dshop")
    progress = []
    window.runner.progress.connect(progress.append)
    window.set_mode("shift")
    wait_plan(qtbot, window)
    plan = window.plan
    assert type(plan).__name__ == "ShiftFill" and plan.proven_optimal
    shop = window.doc.shop
    hours = shop.hours_matrix()
    # The plan's own promise, checked from the shop's numbers: no machine over its hours.
    for m in plan.machines:
        k = shop.machine_names().index(m.machine)
        used = sum(hours[shop.job_names().index(j), k] for j in m.running + m.jobs)
        cap = shop.capacity()[k] * shop.machines[k].slots
        assert used <= cap + 1e-9
    assert any(len(m.jobs) > 1 for m in plan.machines)
    assert "h used" in " ".join(window.plan_panel.tree.topLevelItem(0).child(i).text(1)
                                for i in range(window.plan_panel.tree.topLevelItem(0).childCount()))
    assert progress, "the whole-shift solver reports its stages"
    window.decisions.confirm_plan().confirm("Supervisor G", "whole shift")
    [entry] = HistoryStore(tmp_path / "history.sqlite").list()
    assert entry.total == pytest.approx(plan.total)


def test_missing_run_hours_in_whole_shift_mode_say_which(qtbot, shop_window):
    window = shop_window
    window.set_mode("shift")
    wait_plan(qtbot, window)
    assert window.plan is None
    assert "run_hours" in window.plan_panel.status.toolTip()
    row = 0
    assert window.model.setData(window.model.index(row, COL_HOURS), "1.5")
    assert window.doc.shop.jobs[row].run_hours == 1.5


def test_keyboard_only_breakdown_and_close_prompt(qtbot, shop_window, tmp_path):
    window = shop_window
    activate(qtbot, window)
    col = window.doc.shop.machine_names().index("Trim bench")
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL + col))
    window.view.setFocus()
    qtbot.keyClick(window.view, Qt.Key.Key_D, Qt.KeyboardModifier.ControlModifier)
    dialog = window.decisions.dialog
    assert dialog is not None and dialog.isVisible() and "Trim bench" in dialog.windowTitle()
    dialog.by.setFocus()
    qtbot.keyClicks(dialog.by, "Supervisor H")
    qtbot.keyClick(dialog, Qt.Key.Key_Return)
    wait_plan(qtbot, window)
    assert window.doc.shop.machines[col].state == DOWN
    assert HistoryStore(tmp_path / "history.sqlite").count() == 1
    # Unsaved changes: closing asks; "cancel" keeps the window and the document.
    window.messenger.save_answer = "cancel"
    assert not window.close()
    assert window.isVisible() and window.doc.dirty


def test_every_number_shown_has_a_tooltip(qtbot, shop_window):
    window = shop_window
    model = window.model
    for row in range(model.rowCount()):
        for column in range(model.columnCount()):
            idx = model.index(row, column)
            if any(ch.isdigit() for ch in str(idx.data() or "")):
                assert idx.data(Qt.ItemDataRole.ToolTipRole), (row, column)
    tree = window.plan_panel.tree
    machines = tree.topLevelItem(0)
    for i in range(machines.childCount()):
        item = machines.child(i)
        if item.text(2):
            assert item.toolTip(2)
    for label in (window.plan_panel.total, window.plan_panel.counts, window.plan_panel.proof):
        assert label.toolTip()


@pytest.mark.parametrize("suffix", [".csv", ".xlsx"])
def test_export_grid_reads_back_and_import_into_the_shop_is_undoable(qtbot, shop_window, tmp_path, suffix):
    from dispatcher.io.grid import read_grid

    window = shop_window
    shop = window.doc.shop
    out = tmp_path / f"grid{suffix}"
    assert window.files.export_grid(out)
    table = read_grid(out)
    values, allowed = shop.matrix()
    assert table.jobs == shop.job_names() and table.machines == shop.machine_names()
    assert (table.allowed == allowed).all() and (table.values[allowed] == values[allowed]).all()
    # A grid naming one known job and one new machine merges by name, as one edit.
    extra = tmp_path / "more.csv"
    extra.write_text(f"label,{shop.machines[0].name},New oven\n{shop.jobs[0].name},3,4\n", encoding="utf-8")
    before = shop_to_dict(window.doc.shop)
    summary = window.files.import_into(extra)
    assert "1 machine(s) added: New oven" in summary
    wait_plan(qtbot, window)
    assert window.doc.n_machines() == len(before["machines"]) + 1
    assert window.model.columnCount() == FIRST_MACHINE_COL + window.doc.n_machines()
    window.doc.undo_stack.undo()
    wait_plan(qtbot, window)
    assert shop_to_dict(window.doc.shop) == before
    plan_out = tmp_path / f"plan{suffix}"
    assert window.files.export_plan(window.plan, plan_out) and plan_out.stat().st_size > 0


def test_a_new_shop_is_built_by_adding_jobs_and_machines(qtbot, tmp_path, monkeypatch):
    window = make_window(qtbot, tmp_path, monkeypatch)
    window.files.new()
    assert window.edits.add_machine("Press A") and window.edits.add_machine("Press B")
    assert not window.edits.add_machine("Press A")
    for name in ("Order 1", "Order 2", "Order 3"):
        assert window.edits.add_job(name)
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    assert window.edits.paste_text("4\t9\n2\t3\n7\t1\n")
    wait_plan(qtbot, window)
    values, allowed = window.doc.shop.matrix()
    # 3 jobs, 2 machines: scipy's rectangular assignment is the reference.
    assert window.plan.total == pytest.approx(reference_total(values, allowed))
    assert len(window.plan.waiting_jobs) == 1
    window.view.setCurrentIndex(window.model.index(2, FIRST_MACHINE_COL))
    window.edits.job_done()
    wait_plan(qtbot, window)
    assert window.doc.shop.jobs[2].state == "done" and not window.plan.waiting_jobs
    for _ in range(6):
        window.doc.undo_stack.undo()
    assert window.doc.n_jobs() == 0 or window.doc.n_machines() < 2
