"""The decision history: a crash-safe, append-only record of every dispatch decision.

Stdlib sqlite3 only (pandas for the CSV export); no Qt and no import of the shop model:
a decision stores the shop document as JSON text and the plan in the solve JSON contract.

Typical use::

    store = HistoryStore(path)                      # None: the per-user default file
    n = store.record(shop_doc, plan, by="Supervisor A", reason="breakdown", note="press 2 down")
    store.list(machine="Press 2", date_from=date(2026, 12, 1))
    store.get(n).plan
    store.diff(n - 1, n).lines()
    store.restore(n - 1, by="Supervisor A")         # a new decision "restored from #..."
    store.export_csv("history.csv", by="Supervisor A")
"""

from .errors import DecisionConflict, DecisionNotFound, HistoryError, HistoryInputError
from .location import (
    HISTORY_ENV,
    data_folder,
    default_history_path,
    resolve_history_path,
)
from .opening import is_postgres_location, missing_driver, open_history
from .plans import Move, PlanDiff, certificate_status, check_plan, diff_plans
from .reasons import REASON_KINDS, parse_reason_kind, reason_label
from .schema import SCHEMA_VERSION
from .shifts import DEFAULT_SHIFTS, ShiftStart, shift_of
from .store import (
    LATEST,
    STATION_ENV,
    UNCHECKED,
    Decision,
    DecisionStore,
    DecisionSummary,
    HistoryStore,
    default_station,
)

__all__ = [
    "DEFAULT_SHIFTS",
    "HISTORY_ENV",
    "LATEST",
    "REASON_KINDS",
    "SCHEMA_VERSION",
    "STATION_ENV",
    "UNCHECKED",
    "Decision",
    "DecisionConflict",
    "DecisionNotFound",
    "DecisionStore",
    "DecisionSummary",
    "HistoryError",
    "HistoryInputError",
    "HistoryStore",
    "Move",
    "PlanDiff",
    "ShiftStart",
    "certificate_status",
    "check_plan",
    "data_folder",
    "default_history_path",
    "default_station",
    "diff_plans",
    "is_postgres_location",
    "missing_driver",
    "open_history",
    "parse_reason_kind",
    "reason_label",
    "resolve_history_path",
    "shift_of",
]
