"""The one JSON number helper: whole values as ``int`` so they print without ``.0``.

Used by every JSON the project writes (solve contract, shop documents, history, exports).
Imports nothing, so the history (which never imports the shop model) can use it too.
"""

from __future__ import annotations

import math

#: Beyond this, not every whole float is exactly an int in JSON readers (2**53).
EXACT_INTS = 2**53


def json_number(x: float | None, *, digits: int | None = None) -> int | float | None:
    """``x`` for JSON: a whole finite value as ``int``, else the float; ``None`` stays None.

    ``digits`` rounds first (for totals and differences: ``0.1 + 0.2`` gives ``0.3``).
    NaN and infinities are returned as floats; the caller decides whether JSON may hold them.

    >>> json_number(12.0), json_number(7.5), json_number(0.1 + 0.2, digits=9), json_number(None)
    (12, 7.5, 0.3, None)
    """
    if x is None:
        return None
    x = float(x)
    if digits is not None and math.isfinite(x):
        x = round(x, digits)
    return int(x) if math.isfinite(x) and x.is_integer() and abs(x) < EXACT_INTS else x
