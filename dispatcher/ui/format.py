"""Number and unit formatting shared by the app's views (QtCore only, no widgets).

Numbers shown follow the interface's locale (:func:`dispatcher.translation.decimal_point`:
``12,5`` in German); text meant for other programs (the clipboard, files) uses
``fmt(value, plain=True)``, always with a decimal point.
"""

from __future__ import annotations

import datetime as dt
import math

from PySide6.QtCore import QT_TRANSLATE_NOOP, QCoreApplication, QDate, QDateTime, QLocale, QTime

from dispatcher import translation
from dispatcher.io.grid import CANNOT_RUN


def fmt(value: float | None, digits: int = 4, plain: bool = False) -> str:
    """A value as a supervisor reads it: no exponent, no trailing zeros; '' for None.

    The decimal separator is the interface locale's unless ``plain``.
    """
    if value is None or (isinstance(value, float) and math.isnan(value)):
        return ""
    v = float(value)
    if v.is_integer() and abs(v) < 1e15:
        return str(int(v))
    text = f"{v:.{digits}f}".rstrip("0").rstrip(".")
    point = "." if plain else translation.decimal_point()
    return text if point == "." else text.replace(".", point)


#: Reason kinds (:data:`dispatcher.history.REASON_KINDS`) as shown; English, translated.
REASON_WORDS = {
    "shift-start": QT_TRANSLATE_NOOP("Format", "shift start"),
    "breakdown": QT_TRANSLATE_NOOP("Format", "breakdown"),
    "repair": QT_TRANSLATE_NOOP("Format", "repair"),
    "rush-job": QT_TRANSLATE_NOOP("Format", "rush job"),
    "manual-change": QT_TRANSLATE_NOOP("Format", "manual change"),
    "restored": QT_TRANSLATE_NOOP("Format", "restored"),
    "other": QT_TRANSLATE_NOOP("Format", "other"),
}


def reason_text(kind: str) -> str:
    """A decision's reason kind in the interface's language (the keyword if unknown)."""
    return QCoreApplication.translate("Format", REASON_WORDS[kind]) if kind in REASON_WORDS else kind


def when_text(value: dt.datetime | dt.date | dt.time) -> str:
    """A date, time or both as shown: the interface locale's short format (``09.03.26 06:30``
    in German); ISO order (``2026-03-09 06:30``) in English and before a language is
    installed, as the shop's files and the command line write it."""
    locale = translation.app_locale()
    if locale is None or translation.current_language() == "en":
        if isinstance(value, dt.datetime):
            return f"{value:%Y-%m-%d %H:%M}"
        return f"{value:%H:%M}" if isinstance(value, dt.time) else f"{value:%Y-%m-%d}"
    short = QLocale.FormatType.ShortFormat
    if isinstance(value, dt.datetime):
        return locale.toString(QDateTime(value), short)
    if isinstance(value, dt.time):
        return locale.toString(QTime(value.hour, value.minute, value.second), short)
    return locale.toString(QDate(value.year, value.month, value.day), short)


def waiting_text(plan, job: str) -> str:
    """Why ``job`` waits in ``plan``, in the interface's language where the reason comes in
    parts (the printed sheet's words: "3 jobs can only run on A, B, so 1 of them must
    wait"); in English, and for reasons the core words alone, the core's sentence."""
    reason = plan.waiting_reasons.get(job) if plan is not None else None
    if reason is None:
        return ""
    if translation.current_language() == "en":
        return reason.text
    from dispatcher.sheet.build import NO_MACHINE
    from dispatcher.sheet.render import Sheet

    if reason.machines:
        waiting = set(plan.waiting_jobs)
        return Sheet().why_waits(len(reason.competing_jobs), ", ".join(reason.machines),
                                 sum(1 for j in reason.competing_jobs if j in waiting))
    text = reason.text.removeprefix(f"{job}: ")
    if text.startswith(NO_MACHINE):
        return QCoreApplication.translate("Sheet", NO_MACHINE) + text[len(NO_MACHINE):]
    return reason.text


def unit_text(label: str) -> str:
    """A shop's unit label (:meth:`dispatcher.shop.model.Unit.label`) in the interface's
    language: ``setup min`` and ``cost`` are ours; a currency stays as the shop names it."""
    words = {"setup min": QCoreApplication.translate("Format", "setup min"),
             "cost": QCoreApplication.translate("Format", "cost"),
             "value": QCoreApplication.translate("Format", "value")}
    return words.get(label, label)


class CellTextError(ValueError):
    """Text typed into a grid cell that is neither a number >= 0 nor a cannot-run mark."""


def parse_cell(text: str) -> float | None:
    """A typed cell: a number >= 0, or None for cannot-run (empty, ``x`` or ``X``).

    A decimal comma is accepted when there is no dot (``12,5``).
    """
    t = text.strip()
    if t in CANNOT_RUN:
        return None
    if "," in t and "." not in t:
        t = t.replace(",", ".")
    try:
        v = float(t)
    except ValueError:
        raise CellTextError(QCoreApplication.translate(
            "Format", "{text} is not a number (type x or leave empty when the machine cannot "
            "run the job)").format(text=repr(text.strip()))) from None
    if not math.isfinite(v):
        raise CellTextError(QCoreApplication.translate("Format", "{text} is not a finite number").format(
            text=repr(text.strip())))
    if v < 0:
        raise CellTextError(QCoreApplication.translate(
            "Format", "{value} is negative; values must be >= 0").format(value=fmt(v)))
    return v
