"""The checksum ("seal") that covers every stored column of a decision and its rows.

Both stores (SQLite and PostgreSQL) compute the same seal from the same values, so a
decision copied between them keeps its seal and is verified the same way. The seal is a
SHA-256 over a canonical JSON text of every column of the decision (its number included)
followed by its (state, machine, job, value) rows in order: changing, adding or removing
anything stored about a decision makes it disagree with its seal.

The seal detects changes made outside dispatcher (an edited file, a row changed with the
append-only triggers dropped); it is not a signature: someone who can rewrite the whole
decision can also recompute its seal.
"""

from __future__ import annotations

import hashlib
import json
from collections.abc import Mapping, Sequence
from typing import Any

#: Every stored column of a decision, in the order the seal reads them. Never reorder a
#: released list: append new columns at the end (and give old decisions their seal in a
#: migration).
SEALED_COLUMNS = ("id", "time_utc", "shift_date", "shift_label", "supervisor",
                  "reason_kind", "reason_text", "shop_name", "objective", "total",
                  "certificate", "replaces", "restored_from", "shop_json", "plan_json",
                  "diff_json", "digest", "station", "based_on")


def _real(x: Any) -> float | None:
    return None if x is None else float(x)


def _int(x: Any) -> int | None:
    return None if x is None else int(x)


_NORMAL = {"id": _int, "total": _real, "replaces": _int, "restored_from": _int,
           "based_on": _int}


def seal_of(values: Mapping[str, Any], rows: Sequence[Sequence[Any]]) -> str:
    """The seal of one decision: ``values`` maps every :data:`SEALED_COLUMNS` name to its
    stored value, ``rows`` are its (state, machine, job, value) rows in stored order.

    Numbers are normalised the way both databases store them (REAL / double precision for
    totals and row values, integers for decision numbers), so the seal computed before the
    insert equals the one computed from what is read back.
    """
    cells = [(_NORMAL.get(c, lambda v: v))(values[c]) for c in SEALED_COLUMNS]
    body = [cells, [[r[0], r[1], r[2], _real(r[3])] for r in rows]]
    text = json.dumps(body, ensure_ascii=False, separators=(",", ":"), allow_nan=False)
    return hashlib.sha256(text.encode("utf-8")).hexdigest()


def content_digest(shop_json: str, plan_json: str) -> str:
    """The schema-1 checksum of the snapshot and plan only (kept for every decision)."""
    return hashlib.sha256((shop_json + "\x00" + plan_json).encode("utf-8")).hexdigest()
