"""Qt translators for the app and the printed sheet (QtCore only, no widgets).

The interface is written in English; ``resources/translations`` holds a translation per
language (:data:`dispatcher.resources.LANGUAGES`) and an English one that only carries
the plural forms ("1 job waits" / "3 jobs wait"), as Qt's plural handling needs.
:func:`install` puts the chosen language's translators on the running application:
ours, and Qt's own (``qtbase``, shipped with PySide6) for the standard dialogs' buttons.
The command line never calls :func:`install`; when it renders a sheet only the English
plural forms are loaded (:func:`ensure_plurals`), so it stays English.
"""

from __future__ import annotations

from pathlib import Path

from PySide6.QtCore import QCoreApplication, QLibraryInfo, QLocale, QTranslator

from dispatcher import resources

__all__ = ["KEY_LANGUAGE", "LANGUAGE_NAMES", "app_locale", "current_language", "decimal_point",
           "ensure_plurals", "install", "remove", "system_language"]

#: QSettings key of the interface language chosen in Settings ("" or absent: the system's).
KEY_LANGUAGE = "interface/language"

#: Languages the interface can be shown in, each named in its own language.
LANGUAGE_NAMES = {"en": "English", "de": "Deutsch", "es": "Español"}

_installed: list[QTranslator] = []
_keep: list[bytes] = []  # QTranslator.load(bytes) reads the data in place: keep it alive
_language: str | None = None
_locale: QLocale | None = None
_decimal = "."   # the decimal separator of _locale, kept as text (read for every grid cell)


def system_language(locale: QLocale | None = None) -> str:
    """The first of the system's preferred interface languages that we have, else English."""
    locale = QLocale.system() if locale is None else locale
    for name in locale.uiLanguages():
        code = name.replace("_", "-").split("-")[0].lower()
        if code in LANGUAGE_NAMES:
            return code
    return "en"


def current_language() -> str:
    """The language installed by :func:`install` (English when none was)."""
    return _language or "en"


def app_locale() -> QLocale | None:
    """The locale :func:`install` chose for numbers, dates and times (None before it ran)."""
    return _locale


def decimal_point() -> str:
    """The decimal separator of :func:`app_locale` ("," in German); "." before :func:`install`."""
    return _decimal


def locale_for(language: str, system: QLocale | None = None) -> QLocale:
    """The system's locale when it speaks ``language`` (keeps its territory: de_AT, es_MX),
    else the language's own default territory."""
    system = QLocale.system() if system is None else system
    if QLocale(language).language() == system.language():
        return system
    return QLocale(language)


def _load(translator: QTranslator, data: bytes) -> bool:
    _keep.append(data)
    return translator.load(data)


def _add(translator: QTranslator) -> None:
    QCoreApplication.installTranslator(translator)
    _installed.append(translator)


def remove() -> None:
    """Take every translator this module installed off the application."""
    global _language, _locale, _decimal
    for translator in _installed:
        QCoreApplication.removeTranslator(translator)
    _installed.clear()
    _keep.clear()
    _language = _locale = None
    _decimal = "."


def ensure_plurals() -> None:
    """Make sure at least the English plural forms are installed (nothing else changes).

    Needs a running application (translators live on it); without one it does nothing.
    """
    if not _installed and QCoreApplication.instance() is not None:
        install("en")


def install(language: str | None = None, set_default_locale: bool = False) -> str:
    """Install the translators of ``language`` (``None``: the system's); return it.

    Translators installed earlier by this module are removed first. Unknown languages
    fall back to English. :func:`app_locale` then gives the locale for numbers and dates
    (:func:`locale_for`); ``set_default_locale`` also makes it Qt's default locale (the
    app does, so that its widgets format numbers the same way).
    """
    global _language, _locale, _decimal
    remove()
    language = system_language() if language is None else language
    if language not in LANGUAGE_NAMES:
        language = "en"
    english = QTranslator()
    if _load(english, resources.translation("en").read_bytes()):
        _add(english)
    if language != "en":
        ours = QTranslator()
        if _load(ours, resources.translation(language).read_bytes()):
            _add(ours)
        qt_own = QTranslator()
        folder = Path(QLibraryInfo.path(QLibraryInfo.LibraryPath.TranslationsPath))
        if qt_own.load(f"qtbase_{language}", str(folder)):
            _add(qt_own)
    _language = language
    _locale = locale_for(language)
    _decimal = _locale.decimalPoint() or "."
    if set_default_locale:
        QLocale.setDefault(_locale)
    return language
