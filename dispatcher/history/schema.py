"""The history file: its schema, ordered migrations, and the checks made before using it.

Rules this module keeps:

* A file we did not create is never written to. A new history is built under a temporary
  name and linked into place only when complete, so a file at the history path is either a
  finished history or someone else's file (which is refused, never "repaired").
* ``PRAGMA application_id`` marks the file as ours; ``PRAGMA user_version`` is the schema
  version. Migrations run in order, in one transaction, after a copy of the file has been
  written beside it (``<name>.backup-v<old>-<UTC time>``).
* Decisions are append-only: triggers abort any UPDATE or DELETE, and any INSERT that
  would replace an existing decision or add rows to an older one (``INSERT OR REPLACE``
  deletes without firing delete triggers, so inserts are guarded too). Since schema 2 a
  seal covers every stored column (:mod:`dispatcher.history.seal`).
"""

from __future__ import annotations

import os
import sqlite3
import struct
import uuid
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from datetime import datetime, timezone
from pathlib import Path

from dispatcher.atomic import fsync_file, fsync_folder
from dispatcher.errors import HINT_OTHER_HISTORY_FILE

from .errors import HistoryError

#: "DSPH" as a big-endian 32-bit number: marks an SQLite file as a dispatcher history.
APPLICATION_ID = 0x44535048

SQLITE_MAGIC = b"SQLite format 3\x00"


@dataclass(frozen=True)
class Migration:
    """Brings a file from schema ``version - 1`` to ``version``."""

    version: int
    description: str
    apply: Callable[[sqlite3.Connection], None]


_V1 = """
CREATE TABLE decisions (
    id            INTEGER PRIMARY KEY AUTOINCREMENT,
    time_utc      TEXT NOT NULL,
    shift_date    TEXT NOT NULL,
    shift_label   TEXT NOT NULL,
    supervisor    TEXT NOT NULL,
    reason_kind   TEXT NOT NULL,
    reason_text   TEXT NOT NULL DEFAULT '',
    shop_name     TEXT NOT NULL DEFAULT '',
    objective     TEXT NOT NULL,
    total         REAL,
    certificate   TEXT NOT NULL,
    replaces      INTEGER REFERENCES decisions(id),
    restored_from INTEGER REFERENCES decisions(id),
    shop_json     TEXT NOT NULL,
    plan_json     TEXT NOT NULL,
    diff_json     TEXT,
    digest        TEXT NOT NULL
);
CREATE INDEX decisions_time ON decisions(time_utc);
CREATE INDEX decisions_shift ON decisions(shift_date, shift_label);
CREATE INDEX decisions_supervisor ON decisions(supervisor);
CREATE INDEX decisions_reason ON decisions(reason_kind);
CREATE INDEX decisions_shop ON decisions(shop_name, id);
CREATE INDEX decisions_replaces ON decisions(replaces);

CREATE TABLE decision_rows (
    decision_id INTEGER NOT NULL REFERENCES decisions(id),
    state       TEXT NOT NULL,
    machine     TEXT,
    job         TEXT,
    value       REAL
);
CREATE INDEX decision_rows_decision ON decision_rows(decision_id);
CREATE INDEX decision_rows_machine ON decision_rows(machine, decision_id);
CREATE INDEX decision_rows_job ON decision_rows(job, decision_id);

CREATE TRIGGER decisions_append_only_update BEFORE UPDATE ON decisions
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: decisions cannot be changed'); END;
CREATE TRIGGER decisions_append_only_delete BEFORE DELETE ON decisions
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: decisions cannot be deleted'); END;
CREATE TRIGGER decision_rows_append_only_update BEFORE UPDATE ON decision_rows
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: rows cannot be changed'); END;
CREATE TRIGGER decision_rows_append_only_delete BEFORE DELETE ON decision_rows
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: rows cannot be deleted'); END;
"""


def _run_script(sql: str) -> Callable[[sqlite3.Connection], None]:
    def apply(conn: sqlite3.Connection) -> None:
        # executescript() would COMMIT the open transaction; run statement by statement.
        statement = ""
        for line in sql.splitlines(keepends=True):
            statement += line
            if sqlite3.complete_statement(statement):
                conn.execute(statement)
                statement = ""
    return apply


_V2_TRIGGERS = """
CREATE TRIGGER decisions_append_only_update BEFORE UPDATE ON decisions
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: decisions cannot be changed'); END;
CREATE TRIGGER decisions_append_only_delete BEFORE DELETE ON decisions
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: decisions cannot be deleted'); END;
CREATE TRIGGER decisions_append_only_replace BEFORE INSERT ON decisions
WHEN EXISTS (SELECT 1 FROM decisions WHERE id = NEW.id)
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: a decision with this number exists'); END;
CREATE TRIGGER decision_rows_append_only_update BEFORE UPDATE ON decision_rows
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: rows cannot be changed'); END;
CREATE TRIGGER decision_rows_append_only_delete BEFORE DELETE ON decision_rows
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: rows cannot be deleted'); END;
CREATE TRIGGER decision_rows_append_only_insert BEFORE INSERT ON decision_rows
WHEN EXISTS (SELECT 1 FROM decision_rows WHERE rowid = NEW.rowid)
  OR NEW.decision_id IS NOT (SELECT max(id) FROM decisions)
BEGIN SELECT RAISE(ABORT, 'the decision history is append-only: rows belong to the newest decision only'); END;
"""

_V1_TRIGGERS = ("decisions_append_only_update", "decisions_append_only_delete",
                "decision_rows_append_only_update", "decision_rows_append_only_delete")


def _seal_everything(conn: sqlite3.Connection) -> None:
    """Schema 2: station and based-on columns, a seal over every column, stricter triggers.

    Each existing decision is sealed only if it still matches its schema-1 checksum (of its
    snapshot and plan); one that does not keeps no seal and is reported as changed outside
    dispatcher whenever it is read, exactly as before the upgrade.
    """
    from .seal import SEALED_COLUMNS, content_digest, seal_of

    for name in _V1_TRIGGERS:
        conn.execute(f"DROP TRIGGER IF EXISTS {name}")
    conn.execute("ALTER TABLE decisions ADD COLUMN station TEXT NOT NULL DEFAULT ''")
    conn.execute("ALTER TABLE decisions ADD COLUMN based_on INTEGER")
    conn.execute("ALTER TABLE decisions ADD COLUMN seal TEXT")
    rows: dict[int, list[tuple]] = {}
    for r in conn.execute("SELECT decision_id, state, machine, job, value FROM decision_rows "
                          "ORDER BY rowid"):
        rows.setdefault(r[0], []).append(tuple(r[1:]))
    columns = ", ".join(SEALED_COLUMNS)
    for r in conn.execute(f"SELECT {columns} FROM decisions ORDER BY id").fetchall():
        values = dict(zip(SEALED_COLUMNS, r))
        if content_digest(values["shop_json"], values["plan_json"]) != values["digest"]:
            continue
        conn.execute("UPDATE decisions SET seal = ? WHERE id = ?",
                     (seal_of(values, rows.get(values["id"], [])), values["id"]))
    _run_script(_V2_TRIGGERS)(conn)


#: Every schema step ever released, in order. Never edit a released step: append one.
MIGRATIONS: tuple[Migration, ...] = (
    Migration(1, "decisions, their rows, append-only triggers", _run_script(_V1)),
    Migration(2, "station, based-on, a seal over every column, no replacing",
              _seal_everything),
)
SCHEMA_VERSION = MIGRATIONS[-1].version


# ---------------------------------------------------------------- error translation

_BUSY_CODES = {5, 6}  # SQLITE_BUSY, SQLITE_LOCKED (primary codes)


def primary_code(exc: sqlite3.Error) -> int | None:
    code = getattr(exc, "sqlite_errorcode", None)
    return None if code is None else code & 0xFF


def is_busy(exc: sqlite3.Error) -> bool:
    code = primary_code(exc)
    if code is not None:
        return code in _BUSY_CODES
    text = str(exc).lower()
    return "locked" in text or "busy" in text


def store_error(path: Path, exc: sqlite3.Error, doing: str) -> HistoryError:
    """A :class:`HistoryError` with a message a supervisor can act on."""
    code = primary_code(exc)
    text = str(exc)
    if code == 13 or "full" in text:  # SQLITE_FULL
        why = ("no room left to write (the disk or the file's size limit is full); "
               "free some space and try again")
    elif code == 8 or "readonly" in text or "read-only" in text:  # SQLITE_READONLY
        why = "the file or its folder is read-only; make it writable or choose another file"
    elif code in (11, 26) or "malformed" in text or "not a database" in text:
        why = ("the file is damaged or is not a dispatcher history; it was left as it is "
               "(restore it from a backup or choose another file)")
    elif code == 14 or "unable to open" in text:  # SQLITE_CANTOPEN
        why = "the file cannot be opened (check the folder exists and is accessible)"
    elif code == 10:  # SQLITE_IOERR
        why = "the disk reported an input/output error"
    else:
        why = text
    return HistoryError(f"{path}: {doing} failed: {why} [sqlite: {text}]")


# ---------------------------------------------------------------- checks before opening

def read_only_file(path: Path) -> bool:
    """True when the file may not be written: no permission, or no write bit set at all.

    The write bits are checked as well as :func:`os.access` so that a file the user marked
    read-only stays untouched even for an administrator, whom ``access`` always allows.
    """
    try:
        mode = path.stat().st_mode
    except OSError:
        return False
    return not os.access(path, os.W_OK) or not (mode & 0o222)


def check_header(path: Path) -> None:
    """Refuse, before SQLite reads it, a file that is empty, not SQLite, or cut short."""
    try:
        size = path.stat().st_size
        with path.open("rb") as f:
            head = f.read(100)
    except OSError as exc:
        raise HistoryError(f"{path}: cannot read the history file: {exc.strerror}") from None
    if size == 0:
        raise HistoryError(f"{path}: the file is empty (0 bytes), so it is not a dispatcher "
                           "history; it was left as it is. Move it away or choose another "
                           "file", hint=HINT_OTHER_HISTORY_FILE)
    if len(head) < 100 or not head.startswith(SQLITE_MAGIC):
        raise HistoryError(f"{path}: not a dispatcher history (not an SQLite database file); "
                           "it was left as it is. Choose another file",
                           hint=HINT_OTHER_HISTORY_FILE)
    page_size = struct.unpack(">H", head[16:18])[0]
    page_size = 65536 if page_size == 1 else page_size
    change_counter, pages = struct.unpack(">II", head[24:32])
    valid_for = struct.unpack(">I", head[92:96])[0]
    wal = Path(str(path) + "-wal")
    wal_has_data = wal.exists() and wal.stat().st_size > 0
    # The in-header size is meaningful only when valid-for matches the change counter
    # (SQLite file format, section 1.3.8); with a WAL pending, the file may lag behind it.
    if pages and change_counter == valid_for and not wal_has_data and size < pages * page_size:
        raise HistoryError(f"{path}: the history file is truncated ({size} bytes, its header "
                           f"says {pages * page_size}); it was left as it is. Restore it from "
                           "a backup or choose another file",
                           hint=HINT_OTHER_HISTORY_FILE)


def check_identity(conn: sqlite3.Connection, path: Path, newest: int = SCHEMA_VERSION) -> int:
    """The file's schema version, after checking it is a dispatcher history we can read.

    ``newest`` is the latest schema this program knows (files above it are refused).
    """
    app_id = conn.execute("PRAGMA application_id").fetchone()[0]
    version = conn.execute("PRAGMA user_version").fetchone()[0]
    if app_id != APPLICATION_ID:
        raise HistoryError(f"{path}: an SQLite file, but not a dispatcher history; it was left "
                           "as it is. Choose another file",
                           hint=HINT_OTHER_HISTORY_FILE)
    if version > newest:
        raise HistoryError(f"{path}: written by a newer version of dispatcher (history schema "
                           f"{version}, this version reads up to {newest}); update "
                           "dispatcher to use it. The file was left as it is")
    if version < 1:
        raise HistoryError(f"{path}: a dispatcher history without a schema; it was left as it "
                           "is. Choose another file",
                           hint=HINT_OTHER_HISTORY_FILE)
    return version


def quick_check(conn: sqlite3.Connection, path: Path) -> None:
    """PRAGMA quick_check; a damaged file is reported, never repaired."""
    rows = [r[0] for r in conn.execute("PRAGMA quick_check(5)").fetchall()]
    if rows != ["ok"]:
        raise HistoryError(f"{path}: the history file is damaged ({'; '.join(rows)}); it was "
                           "left as it is. Restore it from a backup or choose another file")


# ---------------------------------------------------------------- creating and migrating

def apply_migrations(conn: sqlite3.Connection, start: int,
                     migrations: Sequence[Migration] = MIGRATIONS) -> int:
    """Run every step after ``start`` inside the caller's transaction; returns the new version."""
    version = start
    for step in migrations:
        if step.version <= version:
            continue
        if step.version != version + 1:
            raise RuntimeError(f"history migrations out of order at version {step.version}")
        step.apply(conn)
        version = step.version
    conn.execute(f"PRAGMA user_version = {int(version)}")
    return version


def create_history(path: Path, connect: Callable[[Path], sqlite3.Connection],
                   migrations: Sequence[Migration] = MIGRATIONS,
                   make_folder: bool = False) -> None:
    """Build a new history under a temporary name, then link it to ``path``.

    If another process created ``path`` meanwhile, its file wins and ours is discarded.
    The folder is created only when ``make_folder`` (the per-user default folder, or
    ``history init``): a mistyped folder must not split a plant's history in two.
    """
    if make_folder:
        try:
            path.parent.mkdir(parents=True, exist_ok=True)
        except OSError as exc:
            raise HistoryError(f"{path}: cannot create the folder for the history: "
                               f"{exc.strerror}") from None
    elif not path.parent.is_dir():
        raise HistoryError(f"{path}: the folder {path.parent} does not exist, so no history "
                           "was created and nothing was recorded. Check the path, or create "
                           "the history with: dispatcher history init PATH")
    tmp = path.with_name(f".{path.name}.{uuid.uuid4().hex}.creating")
    try:
        conn = connect(tmp)
        try:
            conn.execute("PRAGMA journal_mode = WAL")
            conn.execute("BEGIN IMMEDIATE")
            conn.execute(f"PRAGMA application_id = {APPLICATION_ID}")
            apply_migrations(conn, 0, migrations)
            conn.execute("COMMIT")
        finally:
            conn.close()
        fsync_file(tmp)
        try:
            os.link(tmp, path)
        except FileExistsError:
            pass
        except OSError:
            if not path.exists():  # file systems without hard links
                os.replace(tmp, path)
        fsync_folder(path.parent)
    except sqlite3.Error as exc:
        raise store_error(path, exc, "creating the history") from None
    except OSError as exc:
        raise HistoryError(f"{path}: cannot create the history: {exc.strerror}") from None
    finally:
        for leftover in (tmp, Path(f"{tmp}-wal"), Path(f"{tmp}-shm")):
            try:
                leftover.unlink()
            except OSError:
                pass


def backup_path(path: Path, version: int) -> Path:
    stamp = datetime.now(timezone.utc).strftime("%Y%m%dT%H%M%S%fZ")
    return path.with_name(f"{path.name}.backup-v{version}-{stamp}")


def migrate(conn: sqlite3.Connection, path: Path, version: int,
            migrations: Sequence[Migration] = MIGRATIONS) -> Path | None:
    """Bring an older file up to the newest schema; returns the backup written, if any.

    The backup is a consistent copy made with SQLite's online backup; the migration then
    runs in one IMMEDIATE transaction (re-reading the version under the lock, in case
    another process migrated first).
    """
    target = migrations[-1].version
    if version >= target:
        return None
    copy = backup_path(path, version)
    try:
        dest = sqlite3.connect(copy)
        try:
            conn.backup(dest)
        finally:
            dest.close()
        fsync_file(copy)
    except (sqlite3.Error, OSError) as exc:
        raise HistoryError(f"{path}: could not write a backup to {copy} before upgrading the "
                           f"history ({exc}); nothing was changed") from None
    conn.execute("BEGIN IMMEDIATE")
    try:
        current = conn.execute("PRAGMA user_version").fetchone()[0]
        apply_migrations(conn, current, migrations)
        conn.execute("COMMIT")
    except BaseException:
        conn.execute("ROLLBACK")
        raise
    return copy
