"""The decision history on a PostgreSQL server, for a plant with several supervisor stations.

The same behaviour as the SQLite file (:class:`dispatcher.history.HistoryStore`), shared
through :class:`dispatcher.history.store.DecisionStore`: the same columns, the same seal
over every column, the same JSON. What the server adds:

* Append-only enforced by the database: triggers refuse UPDATE, DELETE and TRUNCATE of
  decisions and their rows, an INSERT of an existing number (``ON CONFLICT DO UPDATE``
  fires the UPDATE trigger), and rows added to an older decision.
* One total order: every write takes the same transaction-level advisory lock, so numbers
  follow each other without gaps and each decision's ``replaces`` is the previous decision
  of its shop, whichever station records.
* Schema version in ``dispatcher_schema`` (one row per applied step) and ordered
  migrations, each in the transaction that records its version; a database of a newer
  schema is refused.
* Connection faults (server stopped, connection refused, authentication failed, a
  statement timeout) become one :class:`HistoryError`; a transaction that did not commit
  left nothing behind.

Credentials come only from libpq's own mechanisms (password file ``~/.pgpass``,
``PGPASSFILE``, service file ``pg_service.conf``/``PGSERVICEFILE``, ``PGUSER``,
``PGPASSWORD`` and the other ``PG*`` variables); a location holding a password is refused
so that no password ends up in settings or scripts. Driver: psycopg 3, installed with
``pip install 'dispatcher[postgres]'``.
"""

from __future__ import annotations

import re
import threading
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from datetime import tzinfo
from typing import Any, TypeVar
from urllib.parse import parse_qs, urlsplit

from .errors import HistoryError, HistoryInputError
from .shifts import DEFAULT_SHIFTS, ShiftStart
from .store import DecisionStore, _Cx, _station_default

T = TypeVar("T")

#: Same number as the SQLite file's application id: the advisory lock all writers take.
WRITE_LOCK = 0x44535048

_MISSING_DRIVER = ("a PostgreSQL history needs the psycopg driver, which is not installed; "
                   "install it with: pip install 'dispatcher[postgres]'")


class _Stale(Exception):
    """A kept connection turned out dead before anything was sent."""

    def __init__(self, error: Exception):
        super().__init__(str(error))
        self.error = error


@dataclass(frozen=True)
class PgMigration:
    version: int
    description: str
    sql: str


_V1 = """
CREATE TABLE dispatcher_schema (
    version    integer PRIMARY KEY,
    applied_at timestamptz NOT NULL DEFAULT now(),
    note       text NOT NULL
);
CREATE TABLE decisions (
    id            bigint PRIMARY KEY CHECK (id > 0),
    time_utc      text NOT NULL,
    shift_date    text NOT NULL,
    shift_label   text NOT NULL,
    supervisor    text NOT NULL,
    reason_kind   text NOT NULL,
    reason_text   text NOT NULL DEFAULT '',
    shop_name     text NOT NULL DEFAULT '',
    objective     text NOT NULL,
    total         double precision,
    certificate   text NOT NULL,
    replaces      bigint REFERENCES decisions(id),
    restored_from bigint REFERENCES decisions(id),
    shop_json     text NOT NULL,
    plan_json     text NOT NULL,
    diff_json     text,
    digest        text NOT NULL,
    station       text NOT NULL DEFAULT '',
    based_on      bigint,
    seal          text NOT NULL
);
CREATE INDEX decisions_time ON decisions(time_utc);
CREATE INDEX decisions_shift ON decisions(shift_date, shift_label);
CREATE INDEX decisions_supervisor ON decisions(lower(supervisor));
CREATE INDEX decisions_reason ON decisions(reason_kind);
CREATE INDEX decisions_shop ON decisions(shop_name, id);
CREATE TABLE decision_rows (
    decision_id bigint NOT NULL REFERENCES decisions(id),
    position    integer NOT NULL,
    state       text NOT NULL,
    machine     text,
    job         text,
    value       double precision,
    PRIMARY KEY (decision_id, position)
);
CREATE INDEX decision_rows_machine ON decision_rows(machine, decision_id);
CREATE INDEX decision_rows_job ON decision_rows(job, decision_id);

CREATE FUNCTION dispatcher_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
    RAISE EXCEPTION 'the decision history is append-only: % of % refused', TG_OP, TG_TABLE_NAME
        USING ERRCODE = 'insufficient_privilege';
END $$;
CREATE FUNCTION dispatcher_rows_of_newest() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
    IF NEW.decision_id IS DISTINCT FROM (SELECT max(id) FROM decisions) THEN
        RAISE EXCEPTION 'the decision history is append-only: rows belong to the newest decision only'
            USING ERRCODE = 'insufficient_privilege';
    END IF;
    RETURN NEW;
END $$;
CREATE TRIGGER decisions_append_only BEFORE UPDATE OR DELETE ON decisions
    FOR EACH ROW EXECUTE FUNCTION dispatcher_refuse_change();
CREATE TRIGGER decisions_no_truncate BEFORE TRUNCATE ON decisions
    FOR EACH STATEMENT EXECUTE FUNCTION dispatcher_refuse_change();
CREATE TRIGGER decision_rows_append_only BEFORE UPDATE OR DELETE ON decision_rows
    FOR EACH ROW EXECUTE FUNCTION dispatcher_refuse_change();
CREATE TRIGGER decision_rows_no_truncate BEFORE TRUNCATE ON decision_rows
    FOR EACH STATEMENT EXECUTE FUNCTION dispatcher_refuse_change();
CREATE TRIGGER decision_rows_newest BEFORE INSERT ON decision_rows
    FOR EACH ROW EXECUTE FUNCTION dispatcher_rows_of_newest();
CREATE TRIGGER dispatcher_schema_append_only BEFORE UPDATE OR DELETE ON dispatcher_schema
    FOR EACH ROW EXECUTE FUNCTION dispatcher_refuse_change();
CREATE TRIGGER dispatcher_schema_no_truncate BEFORE TRUNCATE ON dispatcher_schema
    FOR EACH STATEMENT EXECUTE FUNCTION dispatcher_refuse_change();
"""

#: Every schema step ever released, in order. Never edit a released step: append one.
PG_MIGRATIONS: tuple[PgMigration, ...] = (
    PgMigration(1, "decisions, their rows, append-only triggers, schema table", _V1),
)

#: Notified (with the new decision's number) after each recorded decision.
CHANNEL = "dispatcher_decisions"


def _psycopg():
    try:
        import psycopg
    except ImportError:
        raise HistoryError(_MISSING_DRIVER) from None
    return psycopg


class PostgresStore(DecisionStore):
    """The decision history in a PostgreSQL database.

    Parameters
    ----------
    location
        A libpq connection URI (``postgresql://host/dbname``) or connection string
        (``service=plant``); it must not hold a password (use the password or service
        file).
    timeout
        Seconds allowed to connect, and for each statement (``statement_timeout``); a
        write also waits at most this long for another station's write to finish.
    shifts, tz, station
        As for :class:`~dispatcher.history.HistoryStore`.
    migrations
        The schema steps this program knows (default: all released ones).
    """

    kind = "postgresql"
    _row_order = "position"

    def __init__(self, location: str, *, timeout: float = 10.0,
                 shifts: tuple[ShiftStart, ...] = DEFAULT_SHIFTS, tz: tzinfo | None = None,
                 station: str | None = None,
                 migrations: Sequence[PgMigration] = PG_MIGRATIONS, **_ignored: Any):
        self.conninfo = location.strip()
        self.timeout = float(timeout)
        self.shifts = shifts
        self.tz = tz
        self.station = _station_default() if station is None else station
        self._migrations = tuple(migrations)
        self._checked = False
        self._local = threading.local()
        self.last_backup = None
        self._check_no_password()
        self.path = self.location  # what the app shows as "File:"

    def __repr__(self) -> str:
        return f"PostgresStore({self.location!r})"

    @property
    def location(self) -> str:
        return self.conninfo  # never holds a password: those are refused

    def _check_no_password(self) -> None:
        """Refuse a location holding a password (read without the driver, which may be
        missing: the first use then says how to install it)."""
        text = self.conninfo
        if text.lower().startswith(("postgresql://", "postgres://")):
            parts = urlsplit(text)
            query = parse_qs(parts.query)
            has_password = bool(parts.password) or bool(query.get("password"))
        else:
            has_password = re.search(r"(^|\s)password\s*=", text) is not None
        if has_password:
            raise HistoryInputError(
                "--history: the PostgreSQL location holds a password; leave it out and let "
                "libpq find it (password file ~/.pgpass or PGPASSFILE, service file, or "
                "PGPASSWORD), so no password is stored in settings or scripts")

    # ------------------------------------------------------------ connections

    def _connect(self):
        psycopg = _psycopg()
        ms = int(self.timeout * 1000)
        ours = (f"-c statement_timeout={ms} -c lock_timeout={ms} "
                f"-c idle_in_transaction_session_timeout={max(ms, 60000)}")
        try:
            given = psycopg.conninfo.conninfo_to_dict(self.conninfo).get("options") or ""
            conninfo = psycopg.conninfo.make_conninfo(
                self.conninfo, options=f"{given} {ours}".strip(),
                connect_timeout=str(max(1, int(round(self.timeout)))))
            conn = psycopg.connect(conninfo, autocommit=True)
        except psycopg.Error as exc:
            raise self._fault(exc, "connecting to the history server") from None
        return conn

    def _fault(self, exc: Exception, doing: str) -> HistoryError:
        psycopg = _psycopg()
        text = " ".join(str(exc).split()) or type(exc).__name__
        errors = psycopg.errors
        if isinstance(exc, (errors.QueryCanceled, errors.LockNotAvailable)):
            why = (f"the server did not finish within {self.timeout:g} s (statement timeout "
                   "or another station holding the history); nothing was changed. Try again")
        elif isinstance(exc, errors.InsufficientPrivilege) or "append-only" in text:
            why = f"the server refused it ({text}); nothing was changed"
        elif "password authentication failed" in text or "no password supplied" in text \
                or "authentication" in text:
            why = ("the server refused the login (authentication failed); check the user "
                   "and the password file or service file libpq reads (see docs/history.md)")
        elif isinstance(exc, psycopg.OperationalError):
            why = ("the server cannot be reached or closed the connection (stopped, "
                   "restarting, or refusing connections); nothing half-written is kept. "
                   "Try again when it is back")
        else:
            why = "the server reported an error"
        return HistoryError(f"{self.location}: {doing} failed: {why} [postgresql: {text}]")

    def _run(self, body: Callable[[Any], T], doing: str, retry: bool = True) -> T:
        """Run ``body(conn)`` on this thread's open connection (opened when needed).

        A connection kept from an earlier call may have died since (server restarted);
        ``body`` signals that with :class:`_Stale` before sending anything that changes
        data, and reads may always be repeated: then it runs once more on a new connection.
        """
        psycopg = _psycopg()
        conn, fresh = self._conn()
        try:
            return body(conn)
        except _Stale as stale:
            self._drop()
            if fresh or not retry:
                raise self._fault(stale.error, doing) from None
        except (HistoryError, HistoryInputError):
            if conn.broken:
                self._drop()
            raise
        except psycopg.OperationalError as exc:
            self._drop()
            if fresh or not retry:
                raise self._fault(exc, doing) from None
        except psycopg.Error as exc:
            if conn.broken:
                self._drop()
            raise self._fault(exc, doing) from None
        return self._run(body, doing, retry=False)

    def _conn(self):
        conn = getattr(self._local, "conn", None)
        if conn is not None and not conn.closed and not conn.broken:
            return conn, False
        conn = self._connect()
        self._local.conn = conn
        return conn, True

    def _drop(self) -> None:
        conn = getattr(self._local, "conn", None)
        self._local.conn = None
        if conn is not None:
            try:
                conn.close()
            except Exception:  # noqa: BLE001 - a dead connection cannot be closed cleanly
                pass

    def close(self) -> None:
        """Close this thread's connection (the next call opens a new one)."""
        self._drop()

    # ------------------------------------------------------------ schema

    def _version(self, conn) -> int | None:
        """The schema version, or None when the database holds no history."""
        present = conn.execute("SELECT to_regclass('dispatcher_schema') IS NOT NULL, "
                               "to_regclass('decisions') IS NOT NULL").fetchone()
        if not present[0]:
            if present[1]:
                raise HistoryError(f"{self.location}: the database holds a table named "
                                   "decisions that is not a dispatcher history; it was left "
                                   "as it is. Choose another database or schema")
            return None
        version = conn.execute("SELECT max(version) FROM dispatcher_schema").fetchone()[0]
        newest = self._migrations[-1].version
        if version is not None and version > newest:
            raise HistoryError(f"{self.location}: written by a newer version of dispatcher "
                               f"(history schema {version}, this version reads up to "
                               f"{newest}); update dispatcher to use it. Nothing was changed")
        return version or 0

    def _migrate(self, conn, create: bool) -> bool:
        """Create or upgrade the schema under the write lock; False if absent and not create."""
        version = self._version(conn)
        newest = self._migrations[-1].version
        if version == newest:
            return True
        if version is None and not create:
            return False
        with conn.transaction():
            conn.execute("SELECT pg_advisory_xact_lock(%s)", (WRITE_LOCK,))
            version = self._version(conn)  # another station may have done it meanwhile
            if version is None and not create:
                return False
            for step in self._migrations:
                if step.version <= (version or 0):
                    continue
                conn.execute(step.sql)
                conn.execute("INSERT INTO dispatcher_schema (version, note) VALUES (%s, %s)",
                             (step.version, step.description))
        return True

    def _prepare(self, conn, create: bool) -> bool:
        if self._checked:
            return True
        if not self._migrate(conn, create):
            return False
        self._checked = True
        return True

    def exists(self) -> bool:
        return self._run(lambda conn: self._version(conn) is not None,
                         "opening the history")

    def init(self, make_folder: bool = True) -> bool:
        def body(conn) -> bool:
            existed = self._version(conn) is not None
            self._prepare(conn, create=True)
            return not existed
        return self._run(body, "creating the history")

    # ------------------------------------------------------------ the two hooks

    def _read(self, action: Callable[[_Cx], T], doing: str, empty: T) -> T:
        # No transaction needed: a decision and its rows are committed together, so rows
        # read after their decision are all there (READ COMMITTED), and reads may repeat.
        def body(conn) -> T:
            if not self._prepare(conn, create=False):
                return empty
            return action(_Cx(conn, paramstyle_percent=True))
        return self._run(body, doing)

    def _write(self, action: Callable[[_Cx], T], doing: str) -> T:
        psycopg = _psycopg()

        def body(conn) -> T:
            try:
                self._prepare(conn, create=True)
                conn.execute("BEGIN")
            except psycopg.OperationalError as exc:
                raise _Stale(exc) from None  # nothing of this decision was sent yet
            try:
                conn.execute("SELECT pg_advisory_xact_lock(%s)", (WRITE_LOCK,))
                result = action(_Cx(conn, paramstyle_percent=True))
                conn.execute(f"NOTIFY {CHANNEL}")
                conn.execute("COMMIT")
            except BaseException as exc:
                if not conn.broken and not conn.closed:
                    try:
                        conn.execute("ROLLBACK")
                    except psycopg.Error:
                        pass
                if isinstance(exc, psycopg.Error):  # never repeated: it may have committed
                    raise self._fault(exc, doing) from None
                raise
            return result
        return self._run(body, doing)

    def _insert_rows(self, cx: _Cx, new_id: int, rows: list[tuple[Any, ...]]) -> None:
        cx.many("INSERT INTO decision_rows (decision_id, position, state, machine, job, value) "
                "VALUES (?, ?, ?, ?, ?, ?)",
                [(new_id, i, *r) for i, r in enumerate(rows)])

    def check(self) -> list[str]:
        """A count of decisions without rows or rows without decisions: ``["ok"]`` if none."""
        def read(cx: _Cx) -> list[str]:
            orphans = cx.one("SELECT count(*) FROM decision_rows r WHERE NOT EXISTS "
                             "(SELECT 1 FROM decisions d WHERE d.id = r.decision_id)")[0]
            return ["ok"] if not orphans else [f"{orphans} rows without their decision"]
        return self._read(read, "checking the history", ["ok"])

    # ------------------------------------------------------------ other stations

    def listener(self) -> DecisionListener:
        """A :class:`DecisionListener` on its own connection (opened at its first wait)."""
        return DecisionListener(self)

    def wait_for_news(self, seconds: float) -> bool:
        """Block up to ``seconds`` for another station's decision (LISTEN/NOTIFY)."""
        listener = self.listener()
        try:
            return listener.wait(seconds)
        finally:
            listener.close()


class DecisionListener:
    """Learns of decisions recorded by any station: LISTEN on channel :data:`CHANNEL`, to
    which every recording transaction sends a NOTIFY as it commits.

    The connection is its own (never the store's) and stays open between waits, so a
    decision recorded between two waits is not missed; after a fault (server stopped or
    restarting) :meth:`wait` raises :class:`HistoryError` and the next call connects
    again. Use from one thread.
    """

    def __init__(self, store: PostgresStore):
        self.store = store
        self._conn = None

    def wait(self, seconds: float) -> bool:
        """Block up to ``seconds``; True when at least one decision was recorded since the
        previous wait (every notification queued so far is taken)."""
        psycopg = _psycopg()
        try:
            if self._conn is None or self._conn.closed or self._conn.broken:
                self._conn = self.store._connect()
                self._conn.execute(f"LISTEN {CHANNEL}")
            got = False
            for _ in self._conn.notifies(timeout=max(0.0, seconds), stop_after=1):
                got = True
            if got:  # take what else is queued, without waiting
                for _ in self._conn.notifies(timeout=0):
                    pass
            return got
        except psycopg.Error as exc:
            self.close()
            raise self.store._fault(exc, "waiting for new decisions") from None

    def close(self) -> None:
        conn, self._conn = self._conn, None
        if conn is not None:
            try:
                conn.close()
            except Exception:  # noqa: BLE001 - a dead connection cannot be closed cleanly
                pass
