"""The what-if map, alternatives, history panel and printing, inside the main window."""

from __future__ import annotations

import numpy as np
import pytest
from pypdf import PdfReader
from scipy.optimize import linear_sum_assignment

from dispatcher.history import HistoryStore
from dispatcher.io.shopfile import shop_to_dict
from dispatcher.sheet.content import SAFETY_CAUTIONS
from dispatcher.ui import printing
from dispatcher.ui.whatif_view import ExtraRole
from ui_support import make_window, save_shot, wait_plan

BIG = 1e9


def _wait_side(qtbot, window) -> None:
    runners = (window.whatif_tab.runner, window.alternatives_tab.runner)
    qtbot.waitUntil(lambda: not any(r.is_busy() for r in runners), timeout=20_000)
    for r in runners:
        r.wait_idle()
    qtbot.waitUntil(lambda: not any(r.is_busy() for r in runners), timeout=20_000)


def _forced_total(values: np.ndarray, allowed: np.ndarray, i: int, k: int) -> float:
    """Least total with job i forced onto machine k, by scipy's linear_sum_assignment
    (reference library): solve the rest without row i and column k."""
    cost = np.where(allowed, values, BIG)
    rest = np.delete(np.delete(cost, i, axis=0), k, axis=1)
    r, c = linear_sum_assignment(rest)
    return float(values[i, k] + rest[r, c].sum())


@pytest.fixture
def grid_window(qtbot, tmp_path, monkeypatch, samples):
    return make_window(qtbot, tmp_path, monkeypatch, samples / "sheet_metal_grid.csv")


def test_what_if_map_matches_forced_resolves_and_explains_cells(qtbot, grid_window, tmp_path):
    window = grid_window
    window.resize(1200, 700)
    window.show()
    window.tabs.setCurrentWidget(window.whatif_tab.view)
    _wait_side(qtbot, window)
    model = window.whatif_tab.view.model
    assert model.rowCount() == window.doc.n_jobs()
    values, allowed = window.doc.shop.matrix()
    base = window.plan.total
    checked = 0
    for i in range(values.shape[0]):
        for k in range(values.shape[1]):
            extra = model.index(i, k).data(ExtraRole)
            if not allowed[i, k]:
                assert extra is None
                continue
            forced = _forced_total(values, allowed, i, k)
            if forced >= BIG:       # no full plan contains the pair
                assert extra is None
            else:
                assert extra == pytest.approx(forced - base, abs=1e-6)
                checked += 1
    assert checked > 20
    i = next(i for i in range(values.shape[0]) if window.whatif_tab.view.model.grid.planned[i] >= 0)
    k = int(window.whatif_tab.view.model.grid.planned[i])
    other = next(c for c in range(values.shape[1]) if c != k and allowed[i, c])
    tip = model.tooltip(i, other)
    job, machines = window.doc.shop.jobs[i].name, window.doc.shop.machine_names()
    assert f"The plan puts {job} on {machines[k]}" in tip
    assert "Best other machine:" in tip and "Forcing this pair" in tip
    save_shot(window.whatif_tab.view, tmp_path, "whatif_view")


def test_alternatives_are_ranked_and_one_can_be_put_in_force(qtbot, grid_window, tmp_path):
    window = grid_window
    window.tabs.setCurrentWidget(window.alternatives_tab.view)
    window.alternatives_tab.find(4)
    _wait_side(qtbot, window)
    plans = window.alternatives_tab.view.plans
    assert len(plans) == 4
    totals = [p.total for p in plans]
    assert totals == sorted(totals) and totals[0] == pytest.approx(window.plan.total)
    # The second best plan costs exactly the plan's total plus the least extra of forcing a
    # pair the plan does not use: it holds such a pair (as many pairs, a different set),
    # and the best plan holding any one pair is a plan. Forced totals by scipy, as above.
    values, allowed = window.doc.shop.matrix()
    planned = {(window.doc.shop.job_names().index(a.job),
                window.doc.shop.machine_names().index(a.machine)) for a in window.plan.assignments}
    forced = [_forced_total(values, allowed, i, k) for i, k in zip(*np.nonzero(allowed))
              if (i, k) not in planned]
    least_extra = min(f for f in forced if f < BIG) - window.plan.total
    assert totals[1] == pytest.approx(totals[0] + least_extra)
    assert len({frozenset((a.job, a.machine) for a in p.assignments) for p in plans}) == 4
    dialog = window.alternatives_tab.put_in_force(plans[1], 2)
    dialog.confirm("day-shift lead", "customer asked for the laser on WO-4102")
    [entry] = HistoryStore(tmp_path / "history.sqlite").list()
    assert entry.total == pytest.approx(plans[1].total)


def test_history_panel_lists_filters_compares_and_restores(qtbot, tmp_path, monkeypatch, samples):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")
    window.resize(1200, 800)
    window.show()
    shop = window.doc.shop
    window.decisions.confirm_plan().confirm("early-shift lead", "shift start")
    wait_plan(qtbot, window)
    first_state = shop_to_dict(window.doc.shop)
    col = shop.machine_names().index("Trim bench")
    window.decisions.machine_event("down", col).confirm("early-shift lead", "belt torn")
    wait_plan(qtbot, window)
    panel = window.history_dock.panel
    window.history_dock.show()
    panel.refresh()
    assert panel.model.rowCount() == 2
    assert panel.model.decision(0).reason == "breakdown"     # newest first
    panel.reason.setCurrentIndex(panel.reason.findData("breakdown"))
    assert panel.model.rowCount() == 1
    panel.reason.setCurrentIndex(0)
    panel.field.setCurrentIndex(panel.field.findData("machine"))
    panel.text.setText("Trim bench")
    panel.refresh()
    assert panel.model.rowCount() >= 1
    panel.text.setText("")
    panel.refresh()
    panel.select_ids([1, 2])
    text = panel.details.toPlainText()
    assert "From decision #1 to #2" in text and "Trim bench" in text
    save_shot(window.history_dock, tmp_path, "history_panel")
    number = window.history_dock.restore(1, by="early-shift lead")
    assert number == 3
    wait_plan(qtbot, window)
    assert window.doc.shop.machines[col].state == "up"
    assert shop_to_dict(window.doc.shop)["machines"] == first_state["machines"]
    restored = HistoryStore(tmp_path / "history.sqlite").get(3)
    assert restored.restored_from == 1 and restored.reason == "restored"


def test_sheet_pdf_has_every_machine_and_the_safety_footer(qtbot, grid_window, tmp_path):
    window = grid_window
    out = tmp_path / "sheet.pdf"
    pages = printing.export_pdf(window, out)
    assert pages and pages >= 1
    text = "\n".join(page.extract_text() for page in PdfReader(str(out)).pages)
    flat = " ".join(text.split())
    for name in window.doc.shop.machine_names():
        assert name in flat
    for a in window.plan.assignments:
        assert a.job in flat
    assert "lockout/tagout" in flat.lower()
    assert len(SAFETY_CAUTIONS) >= 4


def test_print_preview_opens_without_blocking(qtbot, grid_window):
    dialog = printing.preview(grid_window)
    assert dialog is not None and dialog.isVisible()
    dialog.close()
