"""Settings choose the interface language; the app installs it at start (Qt translators)."""

from __future__ import annotations

from PySide6.QtCore import QCoreApplication, QLocale, QSettings

from dispatcher import translation
from dispatcher.ui.app import install_language
from ui_support import make_window


def test_settings_language_is_stored_and_installed_at_start(qtbot, tmp_path, monkeypatch):
    window = make_window(qtbot, tmp_path, monkeypatch)
    dialog = window.settings_ctl.open()
    combo = dialog.language
    assert combo.itemData(0) == "" and combo.currentIndex() == 0  # the system's by default
    combo.setCurrentIndex(combo.findData("de"))
    assert dialog.apply()
    assert window.settings.value(translation.KEY_LANGUAGE) == "de"
    settings = QSettings(str(tmp_path / "settings.ini"), QSettings.Format.IniFormat)
    try:
        assert install_language(settings) == "de"
        # a sheet word and a Qt standard-dialog word are German now; numbers are German
        assert QCoreApplication.translate("Sheet", "Work order").replace("\u00ad", "") == \
            "Arbeitsauftrag"
        assert QLocale().toString(12.5, "f", 1) == "12,5"
        settings.setValue(translation.KEY_LANGUAGE, "")
        assert install_language(settings) == translation.system_language()
    finally:
        translation.remove()
        QLocale.setDefault(QLocale.system())
    assert QCoreApplication.translate("Sheet", "Work order") == "Work order"


def test_numbers_shown_follow_the_language_and_the_clipboard_keeps_a_point(qapp):
    import datetime as dt

    from dispatcher.ui.format import fmt, parse_cell, when_text

    assert when_text(dt.datetime(2026, 3, 9, 6, 30)) == "2026-03-09 06:30"
    try:
        translation.install("de")
        assert fmt(12.5) == "12,5" and fmt(3.0) == "3" and fmt(12.5, plain=True) == "12.5"
        assert when_text(dt.datetime(2026, 3, 9, 6, 30)) == "09.03.26 06:30"   # QLocale's short format
        assert when_text(dt.time(6, 5)) == "06:05" and when_text(dt.date(2026, 3, 9)) == "09.03.26"
        assert parse_cell(fmt(0.25)) == 0.25   # what the grid shows can be typed back
        # the plan panel's words are German too
        assert QCoreApplication.translate("PlanPanel", "Idle machines (%n)", "", 2) == "Freie Maschinen (2)"
    finally:
        translation.remove()
    assert fmt(12.5) == "12.5"


def test_german_window_says_why_a_job_waits_in_the_sheets_words(qtbot, tmp_path, monkeypatch):
    from pathlib import Path

    from PySide6.QtCore import Qt

    from dispatcher.ui.grid_model import COL_PLAN

    shop = Path(__file__).resolve().parent.parent / "sample_shops" / "medium_machining_shop.dshop"
    try:
        translation.install("de")
        window = make_window(qtbot, tmp_path, monkeypatch, shop)
        plan, model = window.plan, window.model
        grouped = [j for j in plan.waiting_jobs if plan.waiting_reasons.get(j) and plan.waiting_reasons[j].machines]
        assert grouped, "the sample shop has jobs waiting for busy machines"
        row = window.doc.shop.job_names().index(grouped[0])
        tip = model.data(model.index(row, COL_PLAN), Qt.ItemDataRole.ToolTipRole)
        assert "wartet in dieser Runde" in tip and "nur auf" in tip and "warten" in tip, tip
        assert "must wait" not in tip
        assert model.headerData(COL_PLAN, Qt.Orientation.Horizontal) == "Plan setzt ihn auf"
    finally:
        translation.remove()
