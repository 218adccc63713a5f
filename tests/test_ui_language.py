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
