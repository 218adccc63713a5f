"""Every flow of docs/app.md driven as a supervisor would: menu entries (QAction.trigger
on the action found in its menu), keyboard shortcuts (key clicks on the active window),
buttons; then the resulting state is checked. Windows come from the ``open_window``
fixture; screenshots go to each test's tmp_path."""

from __future__ import annotations

import time

import numpy as np
import pytest
from pypdf import PdfReader
from PySide6.QtCore import QCoreApplication, QEvent, QItemSelection, QItemSelectionModel, Qt
from PySide6.QtGui import QGuiApplication
from PySide6.QtWidgets import QApplication, QDialogButtonBox, QMenu

from dispatcher.history import HistoryStore
from dispatcher.io.shopfile import shop_to_dict
from dispatcher.shop import DOWN, MAINTENANCE, MUST, MUST_NOT, UP, shop_from_grid
from dispatcher.ui import printing
from dispatcher.ui.grid_model import FIRST_MACHINE_COL
from ui_support import activate, answer_next_dialog, press, reference_total, save_shot, wait_plan

CTRL = Qt.KeyboardModifier.ControlModifier
SHIFT = Qt.KeyboardModifier.ShiftModifier
MOULDING = "small_moulding_cell.dshop"
GRID = "sheet_metal_grid.csv"


def menu_action(window, menu: str, text: str):
    """The action labelled ``text`` in the menu bar's ``menu`` (labels without '&')."""
    for top in window.menuBar().actions():
        if top.text().replace("&", "") == menu:
            for a in top.menu().actions():
                if a.text().replace("&", "") == text:
                    return a
    raise AssertionError(f"no {menu} > {text}")


def select_block(window, rows, cols) -> None:
    """Select the machine cells rows x cols; the current cell is the top-left one."""
    model, view = window.model, window.view
    top = model.index(rows[0], FIRST_MACHINE_COL + cols[0])
    view.setCurrentIndex(top)
    sel = QItemSelection(top, model.index(rows[-1], FIRST_MACHINE_COL + cols[-1]))
    view.selectionModel().select(sel, QItemSelectionModel.SelectionFlag.ClearAndSelect)


def confirm_by_keys(qtbot, dialog, name: str) -> None:
    dialog.by.setFocus()
    dialog.by.clear()
    qtbot.keyClicks(dialog.by, name)
    qtbot.keyClick(dialog, Qt.Key.Key_Return)


def flush_deletes() -> None:
    QCoreApplication.sendPostedEvents(None, QEvent.Type.DeferredDelete)
    QCoreApplication.processEvents()


def test_machine_down_then_back_up_by_keys(qtbot, open_window, tmp_path):
    window = open_window(MOULDING)
    activate(qtbot, window)
    col = window.doc.shop.machine_names().index("Trim bench")
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL + col))
    press(qtbot, window, Qt.Key.Key_D, CTRL)
    confirm_by_keys(qtbot, window.decisions.dialog, "Supervisor A")
    wait_plan(qtbot, window)
    assert window.doc.shop.machines[col].state == DOWN
    press(qtbot, window, Qt.Key.Key_U, CTRL)
    dialog = window.decisions.dialog
    assert "back up" in dialog.windowTitle() and dialog.findChild(object, "safetyReminder") is None
    save_shot(dialog, tmp_path, "machine_up_dialog")
    dialog.buttons.button(QDialogButtonBox.StandardButton.Ok).click()
    wait_plan(qtbot, window)
    assert window.doc.shop.machines[col].state == UP
    assert "Trim bench" in {a.machine for a in window.plan.assignments} | set(window.plan.idle_machines)
    reasons = {d.id: d.reason for d in HistoryStore(tmp_path / "history.sqlite").list()}
    assert reasons == {1: "breakdown", 2: "repair"}
    # Pressing Ctrl+U on a machine that is up only says so.
    with qtbot.waitSignal(window.warning) as warned:
        press(qtbot, window, Qt.Key.Key_U, CTRL)
    assert "already up" in warned.args[0]


def test_maintenance_slots_and_wait_penalty_from_the_menus(qtbot, open_window):
    window = open_window(MOULDING)
    shop = window.doc.shop
    k = shop.machine_names().index("Trim bench")
    window.view.setCurrentIndex(window.model.index(1, FIRST_MACHINE_COL + k))
    name = shop.machines[k].name
    menu_action(window, "Machine", "Machine in maintenance").trigger()
    wait_plan(qtbot, window)
    assert shop.machines[k].state == MAINTENANCE
    header = window.model.headerData(FIRST_MACHINE_COL + k, Qt.Orientation.Horizontal)
    assert "maintenance" in header
    assert name not in [a.machine for a in window.plan.assignments]
    menu_action(window, "Machine", "Machine in maintenance").trigger()
    assert shop.machines[k].state == UP
    answer_next_dialog(lambda d: d.setIntValue(3))
    menu_action(window, "Machine", "Set slots…").trigger()
    assert shop.machines[k].slots == 3
    assert window.doc.undo_stack.undoText() == f"{name} takes 3 jobs"
    answer_next_dialog(lambda d: d.setDoubleValue(77.5))
    menu_action(window, "Job", "Set wait penalty…").trigger()
    assert shop.jobs[1].wait_penalty == 77.5
    wait_plan(qtbot, window)
    # Ctrl+W opens the same dialog.
    activate(qtbot, window)
    answer_next_dialog(lambda d: d.setDoubleValue(5.0))
    press(qtbot, window, Qt.Key.Key_W, CTRL)
    assert shop.jobs[1].wait_penalty == 5.0


def test_add_job_and_machine_insert_a_row_and_a_column_keeping_the_selection(qtbot, open_window):
    window = open_window(MOULDING)
    model = window.model
    resets, rows, cols = [], [], []
    model.modelAboutToBeReset.connect(lambda: resets.append(1))
    model.rowsInserted.connect(lambda _p, a, b: rows.append((a, b)))
    model.columnsInserted.connect(lambda _p, a, b: cols.append((a, b)))
    n_jobs, n_machines = window.doc.n_jobs(), window.doc.n_machines()
    select_block(window, [2, 3], [1, 2])
    answer_next_dialog(lambda d: d.setTextValue("Press C (invented)"))
    menu_action(window, "Machine", "Add machine…").trigger()
    assert cols == [(FIRST_MACHINE_COL + n_machines,) * 2]
    assert window.doc.shop.machines[-1].name == "Press C (invented)"
    selected = window.view.selectionModel()
    assert selected.isSelected(model.index(3, FIRST_MACHINE_COL + 2))
    assert window.view.currentIndex() == model.index(2, FIRST_MACHINE_COL + 1)
    activate(qtbot, window)
    answer_next_dialog(lambda d: d.setTextValue("WO-9001 rush order"))
    press(qtbot, window, Qt.Key.Key_J, CTRL | SHIFT)
    assert rows == [(n_jobs, n_jobs)]
    assert window.doc.shop.jobs[-1].name == "WO-9001 rush order"
    assert window.view.currentIndex().row() == n_jobs      # ready to type its values
    wait_plan(qtbot, window)
    assert "WO-9001 rush order" in window.plan.waiting_jobs  # it cannot run anywhere yet
    press(qtbot, window, Qt.Key.Key_Z, CTRL)
    press(qtbot, window, Qt.Key.Key_Z, CTRL)
    assert (window.doc.n_jobs(), window.doc.n_machines()) == (n_jobs, n_machines)
    assert model.rowCount() == n_jobs and model.columnCount() == FIRST_MACHINE_COL + n_machines
    assert resets == []                                       # inserted and removed, never reset
    # A name in use is refused with a message.
    answer_next_dialog(lambda d: d.setTextValue(window.doc.shop.jobs[0].name))
    with qtbot.waitSignal(window.warning) as warned:
        menu_action(window, "Job", "Add job…").trigger()
    assert "already used" in warned.args[0]


def _cell_text(value) -> str:
    return "x" if value is None else f"{value:g}"


def test_copy_and_copy_with_names_put_the_selection_on_the_clipboard(qtbot, open_window):
    window = open_window(MOULDING)
    activate(qtbot, window)
    shop = window.doc.shop
    select_block(window, [0, 1, 2], [0, 1])
    press(qtbot, window, Qt.Key.Key_C, CTRL)
    lines = QGuiApplication.clipboard().text().rstrip("\n").split("\n")
    expected = [[window.doc.value_at(r, c) for c in (0, 1)] for r in (0, 1, 2)]
    got = [[None if t in ("", "x") else float(t) for t in line.split("\t")] for line in lines]
    assert got == expected
    press(qtbot, window, Qt.Key.Key_C, CTRL | SHIFT)
    lines = QGuiApplication.clipboard().text().rstrip("\n").split("\n")
    assert lines[0].split("\t")[1:] == shop.machine_names()[:2]
    assert [line.split("\t")[0] for line in lines[1:]] == shop.job_names()[:3]


def test_delete_pin_forbid_and_clear_by_key(qtbot, open_window):
    window = open_window(GRID)
    activate(qtbot, window)
    doc = window.doc
    select_block(window, [0, 1], [0, 1])
    press(qtbot, window, Qt.Key.Key_Delete)
    assert all(doc.value_at(r, c) is None for r in (0, 1) for c in (0, 1))
    window.view.setCurrentIndex(window.model.index(3, FIRST_MACHINE_COL + 2))
    press(qtbot, window, Qt.Key.Key_M, CTRL | SHIFT)
    assert doc.pin_at(3, 2) == MUST
    wait_plan(qtbot, window)
    assert window.plan.machine_of(doc.job_at(3).name) == doc.machine_at(2).name
    press(qtbot, window, Qt.Key.Key_F, CTRL | SHIFT)
    assert doc.pin_at(3, 2) == MUST_NOT
    wait_plan(qtbot, window)
    assert window.plan.machine_of(doc.job_at(3).name) != doc.machine_at(2).name
    press(qtbot, window, Qt.Key.Key_U, CTRL | SHIFT)
    assert doc.pin_at(3, 2) is None
    wait_plan(qtbot, window)
    values, allowed = doc.shop.matrix()
    assert window.plan.total == pytest.approx(reference_total(values, allowed))   # scipy


def test_paste_from_the_clipboard_then_undo_and_redo_by_ctrl_shift_z(qtbot, open_window):
    window = open_window(GRID)
    activate(qtbot, window)
    shop = window.doc.shop
    before = shop_to_dict(shop)
    window.view.setCurrentIndex(window.model.index(2, FIRST_MACHINE_COL + 1))
    QGuiApplication.clipboard().setText("11\t12\n13\tx\n")
    press(qtbot, window, Qt.Key.Key_V, CTRL)
    assert [window.doc.value_at(2, 1), window.doc.value_at(2, 2),
            window.doc.value_at(3, 1), window.doc.value_at(3, 2)] == [11, 12, 13, None]
    pasted = shop_to_dict(shop)
    press(qtbot, window, Qt.Key.Key_Z, CTRL)
    assert shop_to_dict(shop) == before
    press(qtbot, window, Qt.Key.Key_Z, CTRL | SHIFT)
    assert shop_to_dict(shop) == pasted
    wait_plan(qtbot, window)
    values, allowed = shop.matrix()
    assert window.plan.total == pytest.approx(reference_total(values, allowed))   # scipy


def test_ctrl_return_puts_the_plan_shown_in_force(qtbot, open_window, tmp_path):
    window = open_window(MOULDING)
    activate(qtbot, window)
    shown = window.plan
    press(qtbot, window, Qt.Key.Key_Return, CTRL)
    dialog = window.decisions.dialog
    assert dialog.reason.currentData() == "shift-start"
    confirm_by_keys(qtbot, dialog, "early-shift lead")
    [entry] = HistoryStore(tmp_path / "history.sqlite").list()
    assert entry.total == pytest.approx(shown.total) and entry.by == "early-shift lead"
    assert window.doc.shop.plan_in_force == shown.in_force(window.doc.shop)


def test_ctrl_1_to_5_switch_objective_and_mode(qtbot, open_window):
    window = open_window("medium_machining_shop.dshop")
    activate(qtbot, window)
    for key, objective in ((Qt.Key.Key_2, "maximize"), (Qt.Key.Key_3, "bottleneck"),
                           (Qt.Key.Key_1, "total")):
        press(qtbot, window, key, CTRL)
        wait_plan(qtbot, window)
        assert window.objective == objective and window.plan.objective == objective
        assert window.plan_panel.objective.currentData() == objective
        assert window.act_objectives[objective].isChecked()
    press(qtbot, window, Qt.Key.Key_5, CTRL)
    wait_plan(qtbot, window)
    assert window.mode == "shift" and type(window.plan).__name__ == "ShiftFill"
    press(qtbot, window, Qt.Key.Key_4, CTRL)
    wait_plan(qtbot, window)
    assert window.mode == "round" and type(window.plan).__name__ == "Plan"


def _open_menu(qtbot, before: set) -> QMenu:
    def new_menus():
        return [m for m in QApplication.topLevelWidgets()
                if isinstance(m, QMenu) and m.isVisible() and m not in before]

    # A loaded machine may show the menu a few event-loop turns later: wait for it.
    qtbot.waitUntil(lambda: len(new_menus()) >= 1, timeout=5000)
    menus = new_menus()
    assert len(menus) == 1
    return menus[0]


def test_cell_and_header_menus_run_their_actions_and_are_deleted(qtbot, open_window, tmp_path):
    window = open_window(MOULDING)
    window.show()
    qtbot.waitExposed(window)
    view = window.view
    col = 1
    before = set(QApplication.topLevelWidgets())   # held, so no new widget reuses an id
    # The machine header's menu (what a right click on the header asks for).
    x = view.horizontalHeader().sectionViewportPosition(FIRST_MACHINE_COL + col) + 5
    view.horizontalHeader().customContextMenuRequested.emit(view.horizontalHeader().rect().topLeft()
                                                            + type(view.rect().topLeft())(x, 5))
    menu = _open_menu(qtbot, before)
    save_shot(menu, tmp_path, "machine_menu")
    [maint] = [a for a in menu.actions() if a.text().replace("&", "") == "Machine in maintenance"]
    maint.trigger()
    menu.close()
    assert window.doc.shop.machines[col].state == MAINTENANCE
    flush_deletes()
    assert not [m for m in window.findChildren(QMenu) if m.testAttribute(Qt.WidgetAttribute.WA_DeleteOnClose)]
    # The cell menu from the keyboard (Menu key), then a pin from it.
    activate(qtbot, window)
    view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    view.setFocus()
    before = set(QApplication.topLevelWidgets())   # held, so no new widget reuses an id
    qtbot.keyClick(view, Qt.Key.Key_Menu)
    menu = _open_menu(qtbot, before)
    [pin] = [a for a in menu.actions() if a.text().replace("&", "") == "Pin job to this machine"]
    pin.trigger()
    menu.close()
    assert window.doc.pin_at(0, 0) == MUST
    # The job row's menu.
    y = view.verticalHeader().sectionViewportPosition(2) + 5
    before = set(QApplication.topLevelWidgets())   # held, so no new widget reuses an id
    view.verticalHeader().customContextMenuRequested.emit(type(view.rect().topLeft())(5, y))
    menu = _open_menu(qtbot, before)
    assert [a.text().replace("&", "") for a in menu.actions()][:2] == ["Rush job arrived…", "Job pulled…"]
    assert window.view.current_row() == 2
    menu.close()
    flush_deletes()
    assert not [m for m in window.findChildren(QMenu) if m.testAttribute(Qt.WidgetAttribute.WA_DeleteOnClose)]


def _slow_shop():
    """Big enough for the whole-shift solver to take several seconds (invented)."""
    rng = np.random.default_rng(1)
    n, m = 300, 40
    shop = shop_from_grid([f"Job {i:03d} (invented)" for i in range(n)],
                          [f"Machine {k:02d}" for k in range(m)],
                          rng.integers(1, 500, size=(n, m)).astype(float), rng.random((n, m)) > 0.2,
                          name="Slow whole-shift shop (invented)")
    for j in shop.jobs:
        j.run_hours = float(rng.integers(1, 5))
    return shop


@pytest.mark.slow
def test_a_slow_solve_shows_progress_and_esc_cancels_it(qtbot, open_window, tmp_path):
    window = open_window()
    window.files.new(_slow_shop())
    wait_plan(qtbot, window)
    activate(qtbot, window)
    with qtbot.waitSignal(window.runner.slow, timeout=10_000):
        press(qtbot, window, Qt.Key.Key_5, CTRL)
    panel = window.plan_panel
    qtbot.waitUntil(lambda: panel.cancel.isVisible())
    save_shot(panel, tmp_path, "slow_solve_panel")
    with qtbot.waitSignal(window.runner.cancelled):
        press(qtbot, window, Qt.Key.Key_Escape)
    assert not window.runner.is_busy() or window.runner.generation > 0
    assert "ancel" in panel.status.text()
    assert not panel.cancel.isVisible()
    # The worker saw the cancel event: the pool thread is free again within seconds,
    # long before the 30 s limit of the whole-shift solver.
    start = time.perf_counter()
    assert window.runner.wait_idle(20_000)
    assert time.perf_counter() - start < 20


@pytest.mark.slow
def test_closing_during_a_slow_solve_does_not_wait_for_it(qtbot, open_window):
    window = open_window()
    window.files.new(_slow_shop())
    wait_plan(qtbot, window)
    window.set_mode("shift")
    window.tabs.setCurrentWidget(window.alternatives_tab.view)
    qtbot.waitUntil(lambda: window.runner.is_busy())
    window.doc.undo_stack.setClean()
    start = time.perf_counter()
    assert window.close()
    assert time.perf_counter() - start < 1.0
    assert not any(r.is_busy() for r in window.runners())
    assert window.runner.wait_idle(20_000)   # the cancelled solve stops soon after


def test_open_recent_reopens_a_saved_shop(qtbot, open_window, tmp_path):
    window = open_window(MOULDING)
    target = tmp_path / "kept.dshop"
    assert window.files.save_as(target)
    saved = shop_to_dict(window.doc.shop)
    menu_action(window, "File", "New").trigger()
    assert window.doc.n_jobs() == 0
    recent = window.recent_menu.actions()
    assert recent and str(target) in recent[0].text()
    with qtbot.waitSignal(window.files.loaded) as opened:
        recent[0].trigger()
    assert opened.args == [True]
    assert window.doc.path == target and shop_to_dict(window.doc.shop) == saved


def test_autosave_is_removed_on_save_and_on_a_normal_close(qtbot, open_window, tmp_path):
    window = open_window(MOULDING)
    window.model.setData(window.model.index(0, FIRST_MACHINE_COL), "31")
    window.files.autosave_now(wait=True)
    copy = window.files.autosave_path()
    assert copy.exists()
    assert window.files.save_as(tmp_path / "saved.dshop")
    assert not copy.exists()
    window.model.setData(window.model.index(0, FIRST_MACHINE_COL), "32")
    window.files.autosave_now(wait=True)
    copy = window.files.autosave_path()      # named after the saved file now
    assert copy.exists()
    window.messenger.save_answer = "discard"
    assert window.close()
    assert not copy.exists()


def test_the_recovery_offer_at_start(qtbot, tmp_path, monkeypatch, samples):
    from PySide6.QtCore import QSettings

    from dispatcher.ui import app as ui_app
    from dispatcher.ui.messages import RecordingMessenger
    from ui_support import make_window

    crashed = make_window(qtbot, tmp_path, monkeypatch, samples / MOULDING)
    crashed.model.setData(crashed.model.index(1, FIRST_MACHINE_COL), "66")
    crashed.files.autosave_now(wait=True)
    expected = shop_to_dict(crashed.doc.shop)
    answers = RecordingMessenger(yes=True)
    monkeypatch.setattr(ui_app, "default_messenger", lambda window: answers)
    settings = QSettings(str(tmp_path / "start.ini"), QSettings.Format.IniFormat)
    window = ui_app.start(history=str(tmp_path / "start.sqlite"), settings=settings)
    qtbot.addWidget(window)
    assert answers.messages and answers.messages[0][1] == "Recover unsaved work"
    assert shop_to_dict(window.doc.shop) == expected and window.doc.dirty
    # `dispatcher app --history PATH` records into PATH.
    assert window.history.path == tmp_path / "start.sqlite"
    wait_plan(qtbot, window)
    window.messenger.save_answer = "discard"
    window.close()


def _sheet_text(path) -> str:
    return " ".join(" ".join(page.extract_text() for page in PdfReader(str(path)).pages).split())


def test_sheet_pdf_says_not_recorded_until_a_decision_is(qtbot, open_window, tmp_path, monkeypatch):
    window = open_window(MOULDING)
    out = tmp_path / "sheet.pdf"
    monkeypatch.setattr(printing.QFileDialog, "getSaveFileName",
                        staticmethod(lambda *a, **k: (str(out), "PDF (*.pdf)")))
    menu_action(window, "File", "Export sheet as PDF…").trigger()
    text = _sheet_text(out)
    assert "not recorded" in text and "lockout/tagout" in text.lower()
    window.decisions.confirm_plan().confirm("Supervisor S", "shift start")
    wait_plan(qtbot, window)
    menu_action(window, "File", "Export sheet as PDF…").trigger()
    text = _sheet_text(out)
    assert "not recorded" not in text and "Decision #1" in text and "Supervisor S" in text
    preview = menu_action(window, "File", "Print preview…")
    preview.trigger()
    assert window.printing.preview_dialog.isVisible()
    window.printing.preview_dialog.close()


def test_history_panel_by_ctrl_h_shows_details_and_restores(qtbot, open_window, tmp_path):
    window = open_window(MOULDING)
    window.decisions.confirm_plan().confirm("early-shift lead", "shift start")
    first = shop_to_dict(window.doc.shop)["machines"]
    col = window.doc.shop.machine_names().index("Trim bench")
    window.decisions.machine_event("down", col).confirm("early-shift lead", "belt torn")
    wait_plan(qtbot, window)
    activate(qtbot, window)
    press(qtbot, window, Qt.Key.Key_H, CTRL)
    dock = window.history_dock
    qtbot.waitUntil(dock.isVisible)
    panel = dock.panel
    assert panel.model.rowCount() == 2
    table = panel.table
    rect = table.visualRect(panel.model.index(1, 0))
    qtbot.mouseClick(table.viewport(), Qt.MouseButton.LeftButton, pos=rect.center())
    assert "#1" in panel.details.toPlainText()
    save_shot(dock, tmp_path, "history_dock")
    answer_next_dialog(lambda d: d.setTextValue("Supervisor R"))
    panel.restore_button.click()
    store = HistoryStore(tmp_path / "history.sqlite")
    restored = store.get(3)
    assert restored.restored_from == 1 and restored.by == "Supervisor R"
    assert shop_to_dict(window.doc.shop)["machines"] == first
    assert panel.model.rowCount() == 3
    press(qtbot, window, Qt.Key.Key_H, CTRL)
    qtbot.waitUntil(lambda: not dock.isVisible())


def test_settings_use_default_and_the_last_name_becomes_the_default(qtbot, open_window, tmp_path,
                                                                    monkeypatch):
    from dispatcher.history import default_history_path

    monkeypatch.setenv("DISPATCHER_HISTORY", str(tmp_path / "per-user" / "history.sqlite"))
    (tmp_path / "per-user").mkdir()
    window = open_window(MOULDING)
    menu_action(window, "Edit", "Settings…").trigger()
    dialog = window.settings_ctl.dialog
    dialog.default_button.click()
    assert dialog.history_path.text() == str(default_history_path())
    dialog.buttons.button(QDialogButtonBox.StandardButton.Ok).click()
    assert window.history.path == default_history_path()
    decision = window.decisions.confirm_plan()
    assert decision.by.text() == ""
    decision.confirm("night-shift lead")
    menu_action(window, "Edit", "Settings…").trigger()
    assert window.settings_ctl.dialog.supervisor.text() == "night-shift lead"
    window.settings_ctl.dialog.reject()
    col = window.doc.shop.machine_names().index("Trim bench")
    assert window.decisions.machine_event("down", col).by.text() == "night-shift lead"


def test_rush_by_ctrl_r_pull_and_done_from_the_job_menu(qtbot, open_window, tmp_path):
    window = open_window(MOULDING)
    shop = window.doc.shop
    row = shop.job_names().index(window.plan.waiting_jobs[0])
    window.view.setCurrentIndex(window.model.index(row, FIRST_MACHINE_COL))
    press(qtbot, window, Qt.Key.Key_R, CTRL)
    dialog = window.decisions.dialog
    assert dialog.reason.currentData() == "rush-job"
    confirm_by_keys(qtbot, dialog, "Early-shift lead")
    wait_plan(qtbot, window)
    assert shop.jobs[row].rush
    name = shop.jobs[0].name
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    menu_action(window, "Job", "Job pulled…").trigger()
    window.decisions.dialog.confirm("Early-shift lead", "order cancelled")
    wait_plan(qtbot, window)
    assert name not in window.doc.shop.job_names()
    reasons = {d.id: d.reason for d in HistoryStore(tmp_path / "history.sqlite").list()}
    assert reasons == {1: "rush-job", 2: "manual-change"}
    window.view.setCurrentIndex(window.model.index(1, FIRST_MACHINE_COL))
    done = window.doc.shop.jobs[1].name
    menu_action(window, "Job", "Mark job done").trigger()
    wait_plan(qtbot, window)
    assert window.doc.shop.jobs[1].state == "done"
    assert done not in [a.job for a in window.plan.assignments] + window.plan.waiting_jobs
