"""Number and name formatting shared by the app's views (Qt-free)."""

from __future__ import annotations

import math

from dispatcher.io.grid import CANNOT_RUN


def fmt(value: float | None, digits: int = 4) -> str:
    """A value as a supervisor reads it: no exponent, no trailing zeros; '' for None."""
    if value is None or (isinstance(value, float) and math.isnan(value)):
        return ""
    v = float(value)
    if v.is_integer() and abs(v) < 1e15:
        return str(int(v))
    return f"{v:.{digits}f}".rstrip("0").rstrip(".")


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
        raise CellTextError(f"{text.strip()!r} is not a number (type x or leave empty when "
                            "the machine cannot run the job)") from None
    if not math.isfinite(v):
        raise CellTextError(f"{text.strip()!r} is not a finite number")
    if v < 0:
        raise CellTextError(f"{fmt(v)} is negative; values must be >= 0")
    return v
