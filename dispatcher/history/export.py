"""CSV export of the history with pandas: one line per placement, waiting job and idle machine.

Text cells that a spreadsheet would read as a formula (starting with ``=``, ``+``, ``-``,
``@``, tab or carriage return) get a leading apostrophe, as the OWASP guidance on CSV
injection advises (common practice), so opening the export never runs anything.
The file is written under a temporary name and renamed, so a failed export never leaves a
half-written file in place of an earlier one.
"""

from __future__ import annotations

import os
from pathlib import Path
from typing import TYPE_CHECKING, Any

from dispatcher.atomic import atomic_write

from .errors import HistoryError

if TYPE_CHECKING:
    import pandas as pd

    from .store import HistoryStore

COLUMNS = ["decision", "time", "shift_date", "shift", "by", "reason", "note", "shop",
           "objective", "total", "certificate", "replaces", "restored_from", "state",
           "machine", "job", "value", "operator"]

_FORMULA_START = ("=", "+", "-", "@", "\t", "\r")


def _defuse(value: Any) -> Any:
    if isinstance(value, str) and value.startswith(_FORMULA_START):
        return "'" + value
    return value


def to_dataframe(store: HistoryStore, **filters: Any) -> pd.DataFrame:
    """The rows of :meth:`HistoryStore.rows` as a DataFrame with columns :data:`COLUMNS`."""
    import pandas as pd

    frame = pd.DataFrame(store.rows(**filters), columns=COLUMNS)
    for column in ("decision", "replaces", "restored_from"):
        frame[column] = frame[column].astype("Int64")
    return frame


def export_csv(store: HistoryStore, target: str | os.PathLike, *, operators: bool = True,
               **filters: Any) -> int:
    """Write the matching decisions' rows to ``target`` (UTF-8 CSV); returns the row count.

    ``operators=False`` leaves the ``operator`` column out: operator labels are personal
    data at some sites (they stay in the history itself, inside each decision's shop and
    plan; see docs/crew.md).
    """
    frame = to_dataframe(store, **filters)
    if not operators:
        frame = frame.drop(columns=["operator"])
    import pandas as pd

    for column in [c for c in frame.columns if not pd.api.types.is_numeric_dtype(frame[c])]:
        frame[column] = frame[column].map(_defuse)
    target = Path(target)
    try:
        atomic_write(target, lambda tmp: frame.to_csv(tmp, index=False, encoding="utf-8"))
    except OSError as exc:
        raise HistoryError(f"{target}: cannot write the export: {exc.strerror or exc}") from None
    return len(frame)
