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
import hashlib
import json
import os
import sqlite3
import time as _time
from collections.abc import Callable, Iterator, Sequence
from contextlib import contextmanager
from dataclasses import dataclass
from datetime import date, datetime, tzinfo
from pathlib import Path
from typing import Any, TypeVar

from . import schema
from .errors import DecisionNotFound, HistoryError, HistoryInputError
from .location import resolve_history_path
from .plans import PlanDiff, certificate_status, check_plan, diff_plans, json_text, plan_rows
from .reasons import parse_reason_kind
from .shifts import DEFAULT_SHIFTS, ShiftStart, format_utc, parse_utc, shift_of, utc_now

T = TypeVar("T")

#: Pass as ``replaces`` to :meth:`HistoryStore.record` to link to the latest decision of the
#: same shop (the default).
LATEST = "latest"

_SUMMARY_COLUMNS = ("id, time_utc, shift_date, shift_label, supervisor, reason_kind, "
                    "reason_text, shop_name, objective, total, certificate, replaces, "
                    "restored_from")


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

    def to_json(self) -> dict[str, Any]:
        return {
            "id": self.id, "time": format_utc(self.time),
            "shift_date": self.shift_date.isoformat(), "shift": self.shift,
            "by": self.by, "reason": self.reason, "note": self.note, "shop": self.shop,
            "objective": self.objective, "total": self.total,
            "certificate": self.certificate, "replaces": self.replaces,
            "restored_from": self.restored_from,
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


def _number(x: float | None) -> float | int | None:
    if x is None:
        return None
    return int(x) if float(x).is_integer() and abs(x) < 2**53 else x


def _digest(shop_json: str, plan_json: str) -> str:
    return hashlib.sha256((shop_json + "\x00" + plan_json).encode("utf-8")).hexdigest()


def _summary(row: Sequence[Any]) -> DecisionSummary:
    return DecisionSummary(
        id=row[0], time=parse_utc(row[1]), shift_date=date.fromisoformat(row[2]),
        shift=row[3], by=row[4], reason=row[5], note=row[6], shop=row[7], objective=row[8],
        total=_number(row[9]), certificate=row[10], replaces=row[11], restored_from=row[12])


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


class HistoryStore:
    """The decision history in one SQLite file.

    Parameters
    ----------
    path
        The history file; ``None`` uses :func:`dispatcher.history.default_history_path`.
        The file is created on the first :meth:`record`, never by reading.
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

    Attributes
    ----------
    last_backup
        The backup written by an upgrade during this store's first use, else None.
    """

    def __init__(self, path: str | os.PathLike | None = None, *, timeout: float = 10.0,
                 max_pages: int | None = None,
                 shifts: tuple[ShiftStart, ...] = DEFAULT_SHIFTS, tz: tzinfo | None = None,
                 migrations: Sequence[schema.Migration] = schema.MIGRATIONS):
        self.path = resolve_history_path(path)
        self.timeout = float(timeout)
        self.max_pages = max_pages
        self.shifts = shifts
        self.tz = tz
        self._migrations = tuple(migrations)
        self._checked = False
        self.last_backup: Path | None = None

    def __repr__(self) -> str:
        return f"HistoryStore({str(self.path)!r})"

    # ------------------------------------------------------------ connections

    def exists(self) -> bool:
        return self.path.exists()

    def read_only(self) -> bool:
        return schema.read_only_file(self.path)

    def _connect(self, path: Path, mode: str) -> sqlite3.Connection:
        uri = path.absolute().as_uri() + f"?mode={mode}"
        conn = sqlite3.connect(uri, uri=True, isolation_level=None,
                               timeout=min(self.timeout, 1.0))
        try:
            conn.execute(f"PRAGMA busy_timeout = {int(min(self.timeout, 1.0) * 1000)}")
            conn.execute("PRAGMA foreign_keys = ON")
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
                    raise schema.store_error(self.path, exc, doing) from None
                left = deadline - _time.monotonic()
                if left <= 0:
                    raise HistoryError(
                        f"{self.path}: {doing} failed: the history file stayed busy (another "
                        f"program was writing to it) for {self.timeout:g} s; nothing was "
                        "changed. Try again in a moment") from None
                _time.sleep(min(delay, left))
                delay = min(delay * 2, 0.1)
            except sqlite3.Error as exc:
                raise schema.store_error(self.path, exc, doing) from None

    def _prepare(self, create: bool) -> bool:
        """Check (once) and if needed create or migrate the file; False if it does not exist."""
        if self._checked:
            return True
        if not self.path.exists():
            if not create:
                return False
            if self.path.parent.exists() and not os.access(self.path.parent, os.W_OK):
                raise HistoryError(f"{self.path}: cannot create the history: the folder "
                                   f"{self.path.parent} is not writable")
            self._retry(lambda: schema.create_history(
                self.path, lambda p: self._connect(p, "rwc"), self._migrations),
                "creating the history")
        if self.path.is_dir():
            raise HistoryError(f"{self.path}: is a folder, not a history file")
        schema.check_header(self.path)

        def check() -> None:
            with self._connection(write=False) as conn:
                version = schema.check_identity(conn, self.path,
                                                 self._migrations[-1].version)
                schema.quick_check(conn, self.path)
                if version < self._migrations[-1].version:
                    if self.read_only():
                        raise HistoryError(
                            f"{self.path}: the history needs an upgrade (schema {version}) "
                            "but the file is read-only; it was left as it is")
                    self.last_backup = schema.migrate(conn, self.path, version,
                                                      self._migrations)

        self._retry(check, "opening the history")
        self._checked = True
        return True

    @contextmanager
    def _connection(self, write: bool) -> Iterator[sqlite3.Connection]:
        if write and self.read_only():
            raise HistoryError(f"{self.path}: the history file is read-only; nothing was "
                               "recorded. Make it writable or choose another file with "
                               "--history PATH")
        mode = "ro" if self.read_only() else "rw"
        conn = self._connect(self.path, mode)
        try:
            yield conn
        finally:
            conn.close()

    def _read(self, action: Callable[[sqlite3.Connection], T], doing: str, empty: T) -> T:
        if not self._prepare(create=False):
            return empty

        def run() -> T:
            with self._connection(write=False) as conn:
                conn.execute("BEGIN")
                try:
                    return action(conn)
                finally:
                    conn.execute("ROLLBACK")
        return self._retry(run, doing)

    # ------------------------------------------------------------ writing

    def record(self, shop: Any, plan: Any, *, by: str, reason: str, note: str = "",
               replaces: int | str | None = LATEST, time: datetime | None = None,
               shift_date: date | None = None, shift: str | None = None,
               restored_from: int | None = None) -> int:
        """Append one decision and return its number.

        ``shop`` is the shop document (JSON text, a dict, or an object with ``to_json()``);
        ``plan`` follows the solve JSON contract (text, dict or ``to_json()``). ``reason``
        is a kind from :data:`REASON_KINDS` (``note`` carries the free text). ``replaces``
        is the decision this one supersedes: by default the latest of the same shop.
        When the call returns, the decision is on disk.
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
            "digest": _digest(shop_text, plan_text),
        }
        rows = plan_rows(plan_data)
        self._prepare(create=True)

        def write() -> int:
            with self._connection(write=True) as conn:
                conn.execute("BEGIN IMMEDIATE")
                try:
                    new_id = self._insert(conn, values, rows, plan_data, replaces)
                    conn.execute("COMMIT")
                except BaseException:
                    if conn.in_transaction:
                        conn.execute("ROLLBACK")
                    raise
                return new_id
        return self._retry(write, "recording the decision")

    def _insert(self, conn: sqlite3.Connection, values: dict[str, Any],
                rows: list[tuple[Any, ...]], plan: dict[str, Any],
                replaces: int | str | None) -> int:
        if replaces == LATEST:
            row = conn.execute("SELECT id, plan_json FROM decisions WHERE shop_name = ? "
                               "ORDER BY id DESC LIMIT 1", (values["shop_name"],)).fetchone()
        elif replaces is None:
            row = None
        else:
            row = conn.execute("SELECT id, plan_json FROM decisions WHERE id = ?",
                               (int(replaces),)).fetchone()
            if row is None:
                raise DecisionNotFound(f"replaces: no decision #{replaces} in {self.path}")
        if values["restored_from"] is not None and conn.execute(
                "SELECT 1 FROM decisions WHERE id = ?", (values["restored_from"],)
        ).fetchone() is None:
            raise DecisionNotFound(f"restored_from: no decision #{values['restored_from']}")
        values = dict(values, replaces=None, diff_json=None)
        if row is not None:
            values["replaces"] = row[0]
            diff = diff_plans(json.loads(row[1]), plan, from_id=row[0])
            values["diff_json"] = json.dumps(diff.to_json(), ensure_ascii=False)
        names = ", ".join(values)
        marks = ", ".join(f":{k}" for k in values)
        cur = conn.execute(f"INSERT INTO decisions ({names}) VALUES ({marks})", values)
        new_id = int(cur.lastrowid)
        conn.executemany("INSERT INTO decision_rows (decision_id, state, machine, job, value) "
                         "VALUES (?, ?, ?, ?, ?)", [(new_id, *r) for r in rows])
        return new_id

    def restore(self, decision_id: int, *, by: str, note: str = "",
                time: datetime | None = None) -> int:
        """Record a new decision re-using the shop snapshot and plan of ``decision_id``.

        Its reason is ``restored`` with the text "restored from #N" (and ``note``); nothing
        about the old decision changes.
        """
        old = self.get(decision_id)
        text = f"restored from #{old.id}" + (f": {note.strip()}" if note and note.strip() else "")
        return self.record(old.shop_json, old.plan, by=by, reason="restored", note=text,
                           time=time, restored_from=old.id)

    # ------------------------------------------------------------ reading

    def list(self, *, date_from: date | None = None, date_to: date | None = None,
             time_from: datetime | None = None, time_to: datetime | None = None,
             shift: str | None = None, machine: str | None = None, job: str | None = None,
             by: str | None = None, reason: str | None = None, shop: str | None = None,
             limit: int | None = None, newest_first: bool = False) -> list[DecisionSummary]:
        """Decisions matching every given filter, oldest first (or newest first).

        ``date_from``/``date_to`` are shift dates (inclusive); ``time_from``/``time_to`` UTC
        instants (from inclusive, to exclusive); ``machine``/``job`` match decisions whose
        plan names them (placed, waiting or idle); ``by`` compares case-insensitively.
        """
        where, params = self._filters(date_from, date_to, time_from, time_to, shift, machine,
                                      job, by, reason, shop)
        sql = f"SELECT {_SUMMARY_COLUMNS} FROM decisions"
        if where:
            sql += " WHERE " + " AND ".join(where)
        sql += " ORDER BY id DESC" if newest_first else " ORDER BY id"
        if limit is not None:
            sql += " LIMIT ?"
            params.append(int(limit))
        return self._read(lambda c: [_summary(r) for r in c.execute(sql, params)],
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
            where.append("id IN (SELECT decision_id FROM decision_rows WHERE machine = ?)")
            params.append(machine)
        if job is not None:
            where.append("id IN (SELECT decision_id FROM decision_rows WHERE job = ?)")
            params.append(job)
        if by is not None:
            where.append("supervisor = ? COLLATE NOCASE")
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

        The stored checksum is verified: a decision whose snapshot or plan no longer matches
        it raises :class:`HistoryError` rather than being shown as if intact.
        """
        def read(conn: sqlite3.Connection) -> Decision:
            row = conn.execute(f"SELECT {_SUMMARY_COLUMNS}, shop_json, plan_json, diff_json, "
                               "digest FROM decisions WHERE id = ?", (int(decision_id),)
                               ).fetchone()
            if row is None:
                raise DecisionNotFound(f"no decision #{decision_id} in {self.path}")
            return self._decision(row)
        if not self._prepare(create=False):
            raise HistoryError(f"{self.path}: there is no history file here yet, so no "
                               f"decision #{decision_id}")
        return self._read(read, "reading the history", None)  # type: ignore[arg-type]

    def _decision(self, row: Sequence[Any]) -> Decision:
        summary = _summary(row[:13])
        shop_text, plan_text, diff_text, digest = row[13:17]
        if _digest(shop_text, plan_text) != digest:
            raise HistoryError(f"{self.path}: decision #{summary.id} does not match its "
                               "checksum (the file was changed outside dispatcher)")
        diff = None
        if diff_text is not None:
            diff = PlanDiff.from_json(json.loads(diff_text))
            diff = dataclasses.replace(diff, to_id=summary.id)
        return Decision(**summary.__dict__, shop_json=shop_text, plan=json.loads(plan_text),
                        diff_from_replaced=diff)

    def latest(self, shop: str | None = None) -> Decision | None:
        """The newest decision (of ``shop`` if given), or None in an empty history."""
        found = self.list(shop=shop, limit=1, newest_first=True)
        return self.get(found[0].id) if found else None

    def count(self) -> int:
        return self._read(lambda c: c.execute("SELECT count(*) FROM decisions").fetchone()[0],
                          "reading the history", 0)

    def diff(self, a: int, b: int) -> PlanDiff:
        """What changed from decision ``a`` to decision ``b`` (any two, in either order)."""
        first, second = self.get(a), self.get(b)
        return diff_plans(first.plan, second.plan, from_id=first.id, to_id=second.id)

    def rows(self, **filters: Any) -> list[dict[str, Any]]:
        """One dict per (decision, row) for the decisions matching ``filters`` (see :meth:`list`).

        Keys: decision, time, shift_date, shift, by, reason, note, shop, objective, total,
        certificate, replaces, restored_from, state (assigned/waiting/idle), machine, job,
        value.
        """
        where, params = self._filters(
            filters.pop("date_from", None), filters.pop("date_to", None),
            filters.pop("time_from", None), filters.pop("time_to", None),
            filters.pop("shift", None), filters.pop("machine", None), filters.pop("job", None),
            filters.pop("by", None), filters.pop("reason", None), filters.pop("shop", None))
        if filters:
            raise TypeError(f"unknown filters: {', '.join(filters)}")
        sql = (f"SELECT {', '.join('d.' + c.strip() for c in _SUMMARY_COLUMNS.split(','))}, "
               "r.state, r.machine, r.job, r.value FROM decisions d "
               "JOIN decision_rows r ON r.decision_id = d.id")
        if where:
            sql += " WHERE " + " AND ".join(w.replace("id IN", "d.id IN") for w in where)
        sql += " ORDER BY d.id, r.rowid"

        def read(conn: sqlite3.Connection) -> list[dict[str, Any]]:
            out = []
            for r in conn.execute(sql, params):
                s = _summary(r[:13]).to_json()
                s["decision"] = s.pop("id")
                s.update(state=r[13], machine=r[14], job=r[15], value=_number(r[16]))
                out.append(s)
            return out
        return self._read(read, "reading the history", [])

    def check(self) -> list[str]:
        """``PRAGMA integrity_check`` of the file: ``["ok"]`` when sound."""
        return self._read(lambda c: [r[0] for r in c.execute("PRAGMA integrity_check")],
                          "checking the history", ["ok"])

    def export_csv(self, target: str | os.PathLike, **filters: Any) -> int:
        """Write the rows of the matching decisions to a CSV file; returns the row count."""
        from .export import export_csv
        return export_csv(self, target, **filters)
