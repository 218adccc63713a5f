"""The decision history: an append-only SQLite file of confirmed dispatch decisions.

Each decision keeps who decided, when (UTC, with the local shift date and label), why
(a reason kind and free text), the shop snapshot as JSON text, the plan in the solve JSON
contract, its total, objective and certificate status, the decision it replaced and the
difference from it. Searches by machine or job use a child table of (machine, job, value)
rows. Nothing is ever updated or deleted; restoring an old plan records a new decision.

Durability: WAL journal with ``synchronous=FULL`` (a decision whose :meth:`record` returned
survives a crash or a power cut), one IMMEDIATE transaction per decision, foreign keys on.
A busy file is retried for a bounded time (SQLite's busy timeout plus our own retry with
back-off), then reported as :class:`HistoryError`. Every connection is opened for one
operation and closed, so no lock outlives a call.
"""

from __future__ import annotations

import dataclasses
import json
import os
import socket
import sqlite3
import time as _time
from collections.abc import Callable, Iterator, Sequence
from contextlib import contextmanager
from dataclasses import dataclass
from datetime import date, datetime, tzinfo
from pathlib import Path
from typing import Any, TypeVar

from dispatcher.errors import HINT_OTHER_HISTORY_FILE
from dispatcher.jsonnum import json_number

from . import schema
from .errors import DecisionConflict, DecisionNotFound, HistoryError, HistoryInputError
from .location import HISTORY_ENV, resolve_history_path
from .plans import (
    PlanDiff,
    certificate_status,
    check_plan,
    diff_plans,
    json_text,
    plan_operators,
    plan_rows,
)
from .reasons import parse_reason_kind
from .seal import SEALED_COLUMNS, content_digest, seal_of
from .shifts import DEFAULT_SHIFTS, ShiftStart, format_utc, parse_utc, shift_of, utc_now

T = TypeVar("T")

#: Environment variable naming this station (recorded with each decision); default: the
#: host name.
STATION_ENV = "DISPATCHER_STATION"

#: Pass as ``replaces`` to :meth:`HistoryStore.record` to link to the latest decision of the
#: same shop (the default).
LATEST = "latest"

#: Pass as ``based_on`` to :meth:`record` to skip the concurrency check (the default).
UNCHECKED = "unchecked"

_SELECT = ", ".join(SEALED_COLUMNS) + ", seal"


@dataclass(frozen=True)
class DecisionSummary:
    """One decision without its snapshot and plan (what lists and searches return)."""

    id: int
    time: datetime
    shift_date: date
    shift: str
    by: str
    reason: str
    note: str
    shop: str
    objective: str
    total: float | int | None
    certificate: str
    replaces: int | None
    restored_from: int | None
    station: str = ""
    based_on: int | None = None

    def to_json(self) -> dict[str, Any]:
        return {
            "id": self.id, "time": format_utc(self.time),
            "shift_date": self.shift_date.isoformat(), "shift": self.shift,
            "by": self.by, "reason": self.reason, "note": self.note, "shop": self.shop,
            "objective": self.objective, "total": self.total,
            "certificate": self.certificate, "replaces": self.replaces,
            "restored_from": self.restored_from, "station": self.station,
            "based_on": self.based_on,
        }


@dataclass(frozen=True)
class Decision(DecisionSummary):
    """A full decision: the summary plus the shop snapshot, the plan and the stored diff."""

    shop_json: str = "{}"
    plan: dict[str, Any] | None = None
    diff_from_replaced: PlanDiff | None = None

    @property
    def shop_document(self) -> Any:
        """The shop snapshot parsed with the json module."""
        return json.loads(self.shop_json)

    def to_json(self) -> dict[str, Any]:
        data = super().to_json()
        data["plan"] = self.plan
        data["shop_snapshot"] = self.shop_document
        data["diff_from_replaced"] = (None if self.diff_from_replaced is None
                                      else self.diff_from_replaced.to_json())
        return data


def _summary(v: dict[str, Any]) -> DecisionSummary:
    return DecisionSummary(
        id=int(v["id"]), time=parse_utc(v["time_utc"]),
        shift_date=date.fromisoformat(v["shift_date"]), shift=v["shift_label"],
        by=v["supervisor"], reason=v["reason_kind"], note=v["reason_text"],
        shop=v["shop_name"], objective=v["objective"], total=json_number(v["total"]),
        certificate=v["certificate"], replaces=v["replaces"],
        restored_from=v["restored_from"], station=v.get("station") or "",
        based_on=v.get("based_on"))


def shop_name_of(shop_json: str) -> str:
    """The shop's name from its document (a top-level ``name`` text), or ''."""
    try:
        doc = json.loads(shop_json)
    except json.JSONDecodeError:
        return ""
    if isinstance(doc, dict):
        for key in ("name", "shop"):
            if isinstance(doc.get(key), str):
                return doc[key].strip()
    return ""


def shift_of_document(shop_json: str) -> tuple[date | None, str]:
    """The shift date and label the shop document names (its ``shift`` object), or
    (None, ''): a decision belongs to the document's shift, not to the clock's."""
    try:
        doc = json.loads(shop_json)
    except json.JSONDecodeError:
        return None, ""
    shift = doc.get("shift") if isinstance(doc, dict) else None
    if not isinstance(shift, dict):
        return None, ""
    day = None
    if isinstance(shift.get("date"), str):
        try:
            day = date.fromisoformat(shift["date"])
        except ValueError:
            day = None
    label = shift.get("label") if isinstance(shift.get("label"), str) else ""
    return day, label.strip()


def default_station() -> str:
    """The station recorded when none is given: ``$DISPATCHER_STATION``, else the host name."""
    return os.environ.get(STATION_ENV, "").strip() or socket.gethostname()


_station_default = default_station


class _Cx:
    """A connection seen through four calls, SQL written with ``?`` marks."""

    def __init__(self, conn: Any, paramstyle_percent: bool = False):
        self.conn = conn
        self._pct = paramstyle_percent

    def _sql(self, sql: str) -> str:
        return sql.replace("?", "%s") if self._pct else sql

    def all(self, sql: str, params: Sequence[Any] = ()) -> list[tuple]:
        return [tuple(r) for r in self.conn.execute(self._sql(sql), tuple(params)).fetchall()]

    def one(self, sql: str, params: Sequence[Any] = ()) -> tuple | None:
        row = self.conn.execute(self._sql(sql), tuple(params)).fetchone()
        return None if row is None else tuple(row)

    def run(self, sql: str, params: Sequence[Any] = ()) -> None:
        self.conn.execute(self._sql(sql), tuple(params))

    def many(self, sql: str, seq: Sequence[Sequence[Any]]) -> None:
        if self._pct:
            with self.conn.cursor() as cur:
                cur.executemany(self._sql(sql), seq)
        else:
            self.conn.executemany(sql, seq)


class DecisionStore:
    """What every decision store does, whatever database keeps it.

    Subclasses provide ``_read(action, doing, empty)`` and ``_write(action, doing)`` (run
    ``action(cx)`` in a read transaction, or in one exclusive write transaction), ``exists``,
    ``_row_order`` (the column keeping rows in their stored order) and ``location``.
    """

    _row_order = "rowid"
    station: str = ""

    # ------------------------------------------------------------ hooks
    def _read(self, action: Callable[[_Cx], T], doing: str, empty: T) -> T:
        raise NotImplementedError

    def _write(self, action: Callable[[_Cx], T], doing: str) -> T:
        raise NotImplementedError

    def exists(self) -> bool:
        raise NotImplementedError

    def _missing(self, what: str) -> HistoryError:
        return HistoryError(f"{self.location}: there is no history here yet, so {what}")

    @property
    def location(self) -> str:
        return str(getattr(self, "path", ""))

    # ------------------------------------------------------------ writing

    def record(self, shop: Any, plan: Any, *, by: str, reason: str, note: str = "",
               replaces: int | str | None = LATEST, time: datetime | None = None,
               shift_date: date | None = None, shift: str | None = None,
               restored_from: int | None = None, station: str | None = None,
               based_on: int | str | None = UNCHECKED) -> int:
        """Append one decision and return its number.

        ``shop`` is the shop document (JSON text, a dict, or an object with ``to_json()``);
        ``plan`` follows the solve JSON contract (text, dict or ``to_json()``). ``reason``
        is a kind from :data:`REASON_KINDS` (``note`` carries the free text). ``replaces``
        is the decision this one supersedes: by default the latest of the same shop.
        ``based_on`` is the decision of the same shop the supervisor started from (None:
        none yet); when another decision of that shop was recorded since,
        :class:`DecisionConflict` is raised and nothing is recorded (the default
        :data:`UNCHECKED` skips this check). ``station`` defaults to the store's.
        When the call returns, the decision is stored durably.
        """
        by = str(by).strip()
        if not by:
            raise HistoryInputError("by: the supervisor's name is required")
        kind = parse_reason_kind(reason)
        note = "" if note is None else str(note).strip()
        shop_text = json_text(shop, "shop")
        plan_data = check_plan(plan)
        plan_text = json.dumps(plan_data, ensure_ascii=False, separators=(",", ":"))
        moment = utc_now() if time is None else time
        auto_date, auto_shift = shift_of(moment, self.shifts, self.tz)
        doc_date, doc_shift = shift_of_document(shop_text)
        auto_date, auto_shift = doc_date or auto_date, doc_shift or auto_shift
        if based_on != UNCHECKED and based_on is not None:
            based_on = int(based_on)
        values = {
            "time_utc": format_utc(moment),
            "shift_date": (shift_date or auto_date).isoformat(),
            "shift_label": shift or auto_shift,
            "supervisor": by, "reason_kind": kind, "reason_text": note,
            "shop_name": shop_name_of(shop_text),
            "objective": plan_data["objective"], "total": plan_data["total"],
            "certificate": certificate_status(plan_data),
            "restored_from": restored_from,
            "shop_json": shop_text, "plan_json": plan_text,
            "digest": content_digest(shop_text, plan_text),
            "station": (self.station if station is None else str(station)).strip(),
            "based_on": None if based_on == UNCHECKED else based_on,
        }
        rows = plan_rows(plan_data)
        return self._write(lambda cx: self._insert(cx, values, rows, plan_data, replaces,
                                                   based_on), "recording the decision")

    def _insert(self, cx: _Cx, values: dict[str, Any], rows: list[tuple[Any, ...]],
                plan: dict[str, Any], replaces: int | str | None,
                based_on: int | str | None) -> int:
        latest = cx.one(f"SELECT {_SELECT} FROM decisions WHERE shop_name = ? "
                        "ORDER BY id DESC LIMIT 1", (values["shop_name"],))
        if based_on != UNCHECKED:
            latest_id = None if latest is None else int(latest[0])
            if latest_id != based_on:
                newer = _summary(dict(zip(SEALED_COLUMNS, latest)))  # type: ignore[arg-type]
                raise DecisionConflict(conflict_message(newer, based_on), newer, based_on)
        if replaces == LATEST:
            row = None if latest is None else (latest[0], latest[SEALED_COLUMNS.index(
                "plan_json")])
        elif replaces is None:
            row = None
        else:
            row = cx.one("SELECT id, plan_json FROM decisions WHERE id = ?", (int(replaces),))
            if row is None:
                raise DecisionNotFound(f"replaces: no decision #{replaces} in {self.location}")
        if values["restored_from"] is not None and cx.one(
                "SELECT 1 FROM decisions WHERE id = ?", (values["restored_from"],)) is None:
            raise DecisionNotFound(f"restored_from: no decision #{values['restored_from']}")
        values = dict(values, replaces=None, diff_json=None)
        if row is not None:
            values["replaces"] = int(row[0])
            diff = diff_plans(json.loads(row[1]), plan, from_id=int(row[0]))
            values["diff_json"] = json.dumps(diff.to_json(), ensure_ascii=False)
        new_id = int(cx.one("SELECT coalesce(max(id), 0) + 1 FROM decisions")[0])
        values["id"] = new_id
        values["seal"] = seal_of(values, rows)
        names = ", ".join(values)
        marks = ", ".join("?" for _ in values)
        cx.run(f"INSERT INTO decisions ({names}) VALUES ({marks})", list(values.values()))
        self._insert_rows(cx, new_id, rows)
        return new_id

    def _insert_rows(self, cx: _Cx, new_id: int, rows: list[tuple[Any, ...]]) -> None:
        cx.many("INSERT INTO decision_rows (decision_id, state, machine, job, value) "
                "VALUES (?, ?, ?, ?, ?)", [(new_id, *r) for r in rows])

    def restore(self, decision_id: int, *, by: str, note: str = "",
                time: datetime | None = None,
                based_on: int | str | None = UNCHECKED) -> int:
        """Record a new decision re-using the shop snapshot and plan of ``decision_id``.

        Its reason is ``restored`` with the text "restored from #N" (and ``note``); nothing
        about the old decision changes.
        """
        old = self.get(decision_id)
        text = f"restored from #{old.id}" + (f": {note.strip()}" if note and note.strip() else "")
        return self.record(old.shop_json, old.plan, by=by, reason="restored", note=text,
                           time=time, restored_from=old.id, based_on=based_on)

    # ------------------------------------------------------------ reading

    def _sealed(self, cx: _Cx, where: list[str], params: list[Any], order: str = "id",
                limit: int | None = None) -> list[tuple[dict[str, Any], list[tuple]]]:
        """Matching decisions with their rows, each checked against its seal."""
        sql = f"SELECT {_SELECT} FROM decisions"
        if where:
            sql += " WHERE " + " AND ".join(where)
        sql += f" ORDER BY {order}"
        if limit is not None:
            sql += " LIMIT ?"
            params = [*params, int(limit)]
        found = [dict(zip((*SEALED_COLUMNS, "seal"), r)) for r in cx.all(sql, params)]
        rows: dict[int, list[tuple]] = {int(v["id"]): [] for v in found}
        ids = list(rows)
        for i in range(0, len(ids), 500):
            chunk = ids[i:i + 500]
            marks = ", ".join("?" for _ in chunk)
            # The range beside the list keeps the planner on the index even when its
            # statistics are stale (a freshly filled or copied PostgreSQL table, before
            # autovacuum analyses it, was read by a full scan: 40 ms of 10,000 decisions).
            for r in cx.all("SELECT decision_id, state, machine, job, value FROM "
                            f"decision_rows WHERE decision_id IN ({marks}) "
                            "AND decision_id BETWEEN ? AND ? "
                            f"ORDER BY decision_id, {self._row_order}",
                            [*chunk, min(chunk), max(chunk)]):
                rows[int(r[0])].append(tuple(r[1:]))
        bad = [v["id"] for v in found if v["seal"] is None
               or seal_of(v, rows[int(v["id"])]) != v["seal"]]
        if bad:
            which = ", ".join(f"#{i}" for i in bad[:10]) + (" ..." if len(bad) > 10 else "")
            raise HistoryError(f"{self.location}: decision{'s' if len(bad) > 1 else ''} "
                               f"{which} no longer match{'' if len(bad) > 1 else 'es'} "
                               "its checksum (the history was changed outside dispatcher); "
                               "nothing was shown. Restore the history from a backup")
        return [(v, rows[int(v["id"])]) for v in found]

    def list(self, *, date_from: date | None = None, date_to: date | None = None,
             time_from: datetime | None = None, time_to: datetime | None = None,
             shift: str | None = None, machine: str | None = None, job: str | None = None,
             by: str | None = None, reason: str | None = None, shop: str | None = None,
             limit: int | None = None, newest_first: bool = False) -> list[DecisionSummary]:
        """Decisions matching every given filter, oldest first (or newest first).

        ``date_from``/``date_to`` are shift dates (inclusive); ``time_from``/``time_to`` UTC
        instants (from inclusive, to exclusive); ``machine``/``job`` match decisions whose
        plan names them (placed, waiting or idle); ``by`` compares case-insensitively.
        Every decision returned has been checked against its seal.
        """
        if limit is not None and (isinstance(limit, bool) or int(limit) < 0):
            raise HistoryInputError(f"limit: expected a whole number >= 0, got {limit!r}")
        where, params = self._filters(date_from, date_to, time_from, time_to, shift, machine,
                                      job, by, reason, shop)
        order = "id DESC" if newest_first else "id"
        return self._read(lambda cx: [_summary(v) for v, _ in
                                      self._sealed(cx, where, params, order, limit)],
                          "reading the history", [])

    @staticmethod
    def _filters(date_from, date_to, time_from, time_to, shift, machine, job, by, reason,
                 shop) -> tuple[list[str], list[Any]]:
        where: list[str] = []
        params: list[Any] = []
        if date_from is not None:
            where.append("shift_date >= ?")
            params.append(date_from.isoformat())
        if date_to is not None:
            where.append("shift_date <= ?")
            params.append(date_to.isoformat())
        if time_from is not None:
            where.append("time_utc >= ?")
            params.append(format_utc(time_from))
        if time_to is not None:
            where.append("time_utc < ?")
            params.append(format_utc(time_to))
        if shift is not None:
            where.append("shift_label = ?")
            params.append(shift)
        if machine is not None:
            # Planned on it, or named elsewhere in the plan (down or under maintenance).
            quoted = json.dumps(machine, ensure_ascii=False)
            pattern = "%" + quoted.replace("\\", "\\\\").replace("%", "\\%").replace("_", "\\_") + "%"
            where.append("(id IN (SELECT decision_id FROM decision_rows WHERE machine = ?)"
                         " OR plan_json LIKE ? ESCAPE '\\')")
            params += [machine, pattern]
        if job is not None:
            where.append("id IN (SELECT decision_id FROM decision_rows WHERE job = ?)")
            params.append(job)
        if by is not None:
            where.append("lower(supervisor) = lower(?)")
            params.append(by.strip())
        if reason is not None:
            where.append("reason_kind = ?")
            params.append(parse_reason_kind(reason))
        if shop is not None:
            where.append("shop_name = ?")
            params.append(shop)
        return where, params

    def get(self, decision_id: int) -> Decision:
        """The full decision ``decision_id``; :class:`DecisionNotFound` if there is none.

        The stored seal is verified: a decision of which any stored column no longer
        matches it raises :class:`HistoryError` rather than being shown as if intact.
        """
        def read(cx: _Cx) -> Decision:
            found = self._sealed(cx, ["id = ?"], [int(decision_id)])
            if not found:
                raise DecisionNotFound(f"no decision #{decision_id} in {self.location}")
            return self._decision(found[0][0])
        if not self.exists():
            raise self._missing(f"no decision #{decision_id}")
        return self._read(read, "reading the history", None)  # type: ignore[arg-type]

    @staticmethod
    def _decision(v: dict[str, Any]) -> Decision:
        summary = _summary(v)
        diff = None
        if v["diff_json"] is not None:
            diff = PlanDiff.from_json(json.loads(v["diff_json"]))
            diff = dataclasses.replace(diff, to_id=summary.id)
        return Decision(**summary.__dict__, shop_json=v["shop_json"],
                        plan=json.loads(v["plan_json"]), diff_from_replaced=diff)

    def latest(self, shop: str | None = None) -> Decision | None:
        """The newest decision (of ``shop`` if given), or None in an empty history."""
        found = self.list(shop=shop, limit=1, newest_first=True)
        return self.get(found[0].id) if found else None

    def count(self) -> int:
        return self._read(lambda c: int(c.one("SELECT count(*) FROM decisions")[0]),
                          "reading the history", 0)

    def listener(self):
        """Something whose ``wait(seconds)`` returns True once another station recorded a
        decision (PostgreSQL: LISTEN/NOTIFY), or None when this store has no such signal
        and a view polls :meth:`newest_id` instead (the SQLite file)."""
        return None

    def newest_id(self) -> int:
        """The newest decision's number (0 when none): a cheap check, for a view that
        refreshes when another station records (the refresh then verifies the seals)."""
        return self._read(lambda c: int(c.one("SELECT coalesce(max(id), 0) FROM decisions")[0]),
                          "reading the history", 0)

    def diff(self, a: int, b: int) -> PlanDiff:
        """What changed from decision ``a`` to decision ``b`` (any two, in either order)."""
        first, second = self.get(a), self.get(b)
        return diff_plans(first.plan, second.plan, from_id=first.id, to_id=second.id)

    def rows(self, **filters: Any) -> list[dict[str, Any]]:
        """One dict per (decision, row) for the decisions matching ``filters`` (see :meth:`list`).

        Keys: decision, time, shift_date, shift, by, reason, note, shop, objective, total,
        certificate, replaces, restored_from, station, based_on, state
        (assigned/running/waiting/idle), machine, job, value, operator (who minds the
        machine in a plan of a shop with a crew, from the sealed plan; else None). Every
        decision is checked against its seal first.
        """
        where, params = self._filters(
            filters.pop("date_from", None), filters.pop("date_to", None),
            filters.pop("time_from", None), filters.pop("time_to", None),
            filters.pop("shift", None), filters.pop("machine", None), filters.pop("job", None),
            filters.pop("by", None), filters.pop("reason", None), filters.pop("shop", None))
        if filters:
            raise TypeError(f"unknown filters: {', '.join(filters)}")

        def read(cx: _Cx) -> list[dict[str, Any]]:
            out = []
            for v, rows in self._sealed(cx, where, params):
                s = _summary(v).to_json()
                s["decision"] = s.pop("id")
                ops = plan_operators(v["plan_json"])
                for r in rows:
                    out.append(dict(s, state=r[0], machine=r[1], job=r[2],
                                    value=json_number(r[3]), operator=ops.get((r[2], r[1]))))
            return out
        return self._read(read, "reading the history", [])

    def all_sealed(self) -> list[tuple[dict[str, Any], list[tuple]]]:
        """Every decision's stored columns and rows, oldest first, seals verified (copying)."""
        return self._read(lambda cx: self._sealed(cx, [], []), "reading the history", [])

    def append_sealed(self, items: Sequence[tuple[dict[str, Any], list[tuple]]]) -> int:
        """Append decisions read by :meth:`all_sealed` of another store, keeping their
        numbers, links and seals, in one transaction; returns how many. Each decision's
        number must follow the last one here (so the copy keeps one total order)."""
        def write(cx: _Cx) -> int:
            last = int(cx.one("SELECT coalesce(max(id), 0) FROM decisions")[0])
            for v, rows in items:
                if int(v["id"]) <= last:
                    raise HistoryInputError(
                        f"decision #{v['id']}: the target already holds decisions up to "
                        f"#{last}; decisions are copied in order after the last one")
                names = ", ".join(v)
                cx.run(f"INSERT INTO decisions ({names}) VALUES "
                       f"({', '.join('?' for _ in v)})", list(v.values()))
                self._insert_rows(cx, int(v["id"]), rows)
                last = int(v["id"])
            return len(items)
        return self._write(write, "copying decisions")

    def export_csv(self, target: str | os.PathLike, **filters: Any) -> int:
        """Write the rows of the matching decisions to a CSV file; returns the row count."""
        from .export import export_csv
        return export_csv(self, target, **filters)


def conflict_message(newer: DecisionSummary, based_on: int | None) -> str:
    """'Decision #41, by ... at station B at 10:42, replaced the plan you started from ...'"""
    where = f" at station {newer.station}" if newer.station else ""
    started = ("the plan you started from" if based_on is None
               else f"the plan you started from (#{based_on})")
    return (f"Decision #{newer.id}, by {newer.by}{where} at "
            f"{newer.time.strftime('%H:%M')} UTC, replaced {started}: review the new "
            "proposal; nothing was recorded")


class HistoryStore(DecisionStore):
    """The decision history in one SQLite file.

    Parameters
    ----------
    path
        The history file; ``None`` uses :func:`dispatcher.history.default_history_path`.
        The file is created on the first :meth:`record` (or by :meth:`init`), never by
        reading, and only in a folder that exists (the per-user default folder excepted).
    timeout
        Seconds to keep retrying while another program holds the file busy.
    max_pages
        Optional cap on the file size in database pages (``PRAGMA max_page_count``);
        a write that would exceed it fails like a full disk.
    shifts, tz
        The shift pattern and time zone used to label decisions (default: three shifts
        from 06:00, local time of this computer).
    migrations
        The schema steps this program knows (default: all released ones); a file at an
        older step is copied to a backup and upgraded when first opened.
    station
        Recorded with each decision (default: ``$DISPATCHER_STATION``, else the host name).

    Attributes
    ----------
    last_backup
        The backup written by an upgrade during this store's first use, else None.
    """

    kind = "sqlite"

    def __init__(self, path: str | os.PathLike | None = None, *, timeout: float = 10.0,
                 max_pages: int | None = None,
                 shifts: tuple[ShiftStart, ...] = DEFAULT_SHIFTS, tz: tzinfo | None = None,
                 migrations: Sequence[schema.Migration] = schema.MIGRATIONS,
                 station: str | None = None):
        self._default_folder = (path is None or str(path) == "") and not os.environ.get(
            HISTORY_ENV)
        self.path = resolve_history_path(path)
        self.timeout = float(timeout)
        self.max_pages = max_pages
        self.shifts = shifts
        self.tz = tz
        self.station = _station_default() if station is None else station
        self._migrations = tuple(migrations)
        self._checked = False
        self.last_backup: Path | None = None

    def __repr__(self) -> str:
        return f"HistoryStore({str(self.path)!r})"

    # ------------------------------------------------------------ connections

    def exists(self) -> bool:
        return self.path.exists()

    def _missing(self, what: str) -> HistoryError:
        return HistoryError(f"{self.path}: the history file does not exist, so {what}; "
                            "nothing was created. Check the path (--history PATH or "
                            f"${HISTORY_ENV}), or record a decision first")

    def read_only(self) -> bool:
        return schema.read_only_file(self.path)

    def _read_mode(self) -> str:
        """How to open the file for reading without leaving side files behind.

        ``rw`` when we may write the file and its folder (SQLite's normal WAL reading);
        otherwise ``ro&immutable=1`` when nobody can be writing it (no write bit on the
        file, or a folder we cannot write with no WAL side files in it), so SQLite creates
        no ``-shm`` that would outlive the permission; else ``ro``.
        """
        folder_ok = os.access(self.path.parent, os.W_OK)
        if not self.read_only() and folder_ok:
            return "rw"
        wal = Path(f"{self.path}-wal")
        shm = Path(f"{self.path}-shm")
        no_write_bits = not (self._mode() & 0o222)
        if no_write_bits and not (wal.exists() and wal.stat().st_size > 0):
            return "ro&immutable=1"
        if not folder_ok and not wal.exists() and not shm.exists():
            return "ro&immutable=1"
        return "ro"

    def _mode(self) -> int:
        try:
            return self.path.stat().st_mode
        except OSError:
            return 0

    def _connect(self, path: Path, mode: str) -> sqlite3.Connection:
        uri = path.absolute().as_uri() + f"?mode={mode}"
        conn = sqlite3.connect(uri, uri=True, isolation_level=None,
                               timeout=min(self.timeout, 1.0))
        try:
            conn.execute(f"PRAGMA busy_timeout = {int(min(self.timeout, 1.0) * 1000)}")
            conn.execute("PRAGMA foreign_keys = ON")
            if not mode.startswith("ro"):
                conn.execute("PRAGMA synchronous = FULL")
            if self.max_pages is not None:
                conn.execute(f"PRAGMA max_page_count = {int(self.max_pages)}")
        except BaseException:
            conn.close()
            raise
        return conn

    def _retry(self, action: Callable[[], T], doing: str) -> T:
        """Run ``action``, retrying while the file is busy, for at most ``timeout`` seconds."""
        deadline = _time.monotonic() + self.timeout
        delay = 0.005
        while True:
            try:
                return action()
            except sqlite3.OperationalError as exc:
                if not schema.is_busy(exc):
                    raise self._store_error(exc, doing) from None
                left = deadline - _time.monotonic()
                if left <= 0:
                    raise HistoryError(
                        f"{self.path}: {doing} failed: the history file stayed busy (another "
                        f"program was writing to it) for {self.timeout:g} s; nothing was "
                        "changed. Try again in a moment") from None
                _time.sleep(min(delay, left))
                delay = min(delay * 2, 0.1)
            except sqlite3.Error as exc:
                raise self._store_error(exc, doing) from None

    def _store_error(self, exc: sqlite3.Error, doing: str) -> HistoryError:
        for side in (Path(f"{self.path}-shm"), Path(f"{self.path}-wal")):
            if side.exists() and not os.access(side, os.W_OK) and not self.read_only():
                return HistoryError(
                    f"{self.path}: {doing} failed: its side file {side} is read-only (left by "
                    "a program that read the history while it was read-only). With no "
                    "dispatcher running, delete that side file, then try again")
        return schema.store_error(self.path, exc, doing)

    def init(self, make_folder: bool = True) -> bool:
        """Create an empty history at :attr:`path` (and its folder, if ``make_folder``);
        False if one exists already (it is checked, and upgraded if older)."""
        if self.path.exists():
            self._prepare(create=False)
            return False
        self._create(make_folder=make_folder)
        self._prepare(create=False)
        return True

    def _create(self, make_folder: bool) -> None:
        if self.path.parent.exists() and not os.access(self.path.parent, os.W_OK):
            raise HistoryError(f"{self.path}: cannot create the history: the folder "
                               f"{self.path.parent} is not writable")
        self._retry(lambda: schema.create_history(
            self.path, lambda p: self._connect(p, "rwc"), self._migrations,
            make_folder=make_folder), "creating the history")

    def _prepare(self, create: bool) -> bool:
        """Check (once) and if needed create or migrate the file; False if it does not exist."""
        if self._checked:
            return True
        if not self.path.exists():
            if not create:
                return False
            self._create(make_folder=self._default_folder)
        if self.path.is_dir():
            raise HistoryError(f"{self.path}: is a folder, not a history file")
        schema.check_header(self.path)

        def check() -> None:
            with self._connection(write=False) as conn:
                version = schema.check_identity(conn, self.path,
                                                 self._migrations[-1].version)
                schema.quick_check(conn, self.path)
                if version < self._migrations[-1].version:
                    if self.read_only() or not os.access(self.path.parent, os.W_OK):
                        raise HistoryError(
                            f"{self.path}: the history needs an upgrade (schema {version}) "
                            "but the file or its folder is read-only; it was left as it is")
                    self.last_backup = schema.migrate(conn, self.path, version,
                                                      self._migrations)

        self._retry(check, "opening the history")
        self._checked = True
        return True

    @contextmanager
    def _connection(self, write: bool) -> Iterator[sqlite3.Connection]:
        if write and self.read_only():
            raise HistoryError(f"{self.path}: the history file is read-only; nothing was "
                               "recorded. Make it writable or choose another file",
                               hint=HINT_OTHER_HISTORY_FILE)
        if write and not os.access(self.path.parent, os.W_OK):
            raise HistoryError(f"{self.path}: the history's folder {self.path.parent} is "
                               "read-only (SQLite keeps its journal beside the file); nothing "
                               "was recorded. Make the folder writable or choose another file",
                               hint=HINT_OTHER_HISTORY_FILE)
        conn = self._connect(self.path, "rw" if write else self._read_mode())
        try:
            yield conn
        finally:
            conn.close()

    def _read(self, action: Callable[[_Cx], T], doing: str, empty: T) -> T:
        if not self._prepare(create=False):
            return empty

        def run() -> T:
            with self._connection(write=False) as conn:
                conn.execute("BEGIN")
                try:
                    return action(_Cx(conn))
                finally:
                    conn.execute("ROLLBACK")
        return self._retry(run, doing)

    def _write(self, action: Callable[[_Cx], T], doing: str) -> T:
        self._prepare(create=True)

        def write() -> T:
            with self._connection(write=True) as conn:
                conn.execute("BEGIN IMMEDIATE")
                try:
                    result = action(_Cx(conn))
                    conn.execute("COMMIT")
                except BaseException:
                    if conn.in_transaction:
                        conn.execute("ROLLBACK")
                    raise
                return result
        return self._retry(write, doing)

    def check(self) -> list[str]:
        """``PRAGMA integrity_check`` of the file: ``["ok"]`` when sound."""
        return self._read(lambda c: [r[0] for r in c.all("PRAGMA integrity_check")],
                          "checking the history", ["ok"])
