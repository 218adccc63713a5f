"""SQLite errors put into words a supervisor can act on (dispatcher.history.schema).

Reference: the errors real SQLite raises (a lock held by a second connection, a page
limit reached, a read-only connection, a file that is not a database, a folder that does
not exist, a syntax error) with the primary result codes of SQLite's documentation
("Result and Error Codes": BUSY 5, READONLY 8, IOERR 10, CORRUPT 11, FULL 13, CANTOPEN 14,
NOTADB 26). Errors carrying only a code or only a text (other drivers, older Pythons) are
built by hand, since SQLite itself always sends both. Creating and upgrading a history:
the file's own ``application_id`` and ``user_version`` read back with plain sqlite3, and
the folder listed with pathlib.
"""

from __future__ import annotations

import os
import re
import sqlite3
import struct
import time
from datetime import datetime, timedelta, timezone
from pathlib import Path

import pytest

from dispatcher.errors import HINT_OTHER_HISTORY_FILE
from dispatcher.history import HistoryError
from dispatcher.history.schema import (
    APPLICATION_ID,
    MIGRATIONS,
    SCHEMA_VERSION,
    Migration,
    apply_migrations,
    backup_path,
    check_header,
    check_identity,
    create_history,
    is_busy,
    migrate,
    primary_code,
    quick_check,
    read_only_file,
    store_error,
)
from test_history_append_only import record_two

FULL = ("no room left to write (the disk or the file's size limit is full); "
        "free some space and try again")
READ_ONLY = "the file or its folder is read-only; make it writable or choose another file"
DAMAGED = ("the file is damaged or is not a dispatcher history; it was left as it is "
           "(restore it from a backup or choose another file)")
CANNOT_OPEN = "the file cannot be opened (check the folder exists and is accessible)"
IO = "the disk reported an input/output error"


def raised(action) -> sqlite3.Error:
    with pytest.raises(sqlite3.Error) as info:
        action()
    return info.value


def by_hand(text: str, code: int | None = None) -> sqlite3.Error:
    exc = sqlite3.OperationalError(text)
    if code is not None:
        exc.sqlite_errorcode = code
    return exc


def message(exc: sqlite3.Error, why: str) -> str:
    return f"/h.sqlite: recording failed: {why} [sqlite: {exc}]"


def words(exc: sqlite3.Error) -> str:
    return str(store_error(Path("/h.sqlite"), exc, "recording"))


def locked_error(tmp_path) -> sqlite3.Error:
    path = tmp_path / "locked.sqlite"
    first = sqlite3.connect(path, isolation_level=None)
    first.execute("CREATE TABLE t (x)")
    first.execute("BEGIN IMMEDIATE")
    second = sqlite3.connect(path, timeout=0, isolation_level=None)
    try:
        return raised(lambda: second.execute("BEGIN IMMEDIATE"))
    finally:
        second.close()
        first.execute("ROLLBACK")
        first.close()


def test_a_lock_held_elsewhere_is_busy(tmp_path):
    exc = locked_error(tmp_path)
    assert primary_code(exc) == 5
    assert is_busy(exc)
    assert words(exc) == message(exc, str(exc))  # passed on as SQLite words it


def test_extended_codes_reduce_to_their_primary_code():
    # SQLITE_BUSY_SNAPSHOT = 517 = BUSY | (2 << 8); SQLITE_IOERR_WRITE = 778 = IOERR | (3 << 8).
    assert primary_code(by_hand("x", 517)) == 5
    assert primary_code(by_hand("x", 778)) == 10
    assert is_busy(by_hand("x", 517))
    assert words(by_hand("x", 778)) == message(by_hand("x", 778), IO)


def test_without_a_code_the_text_decides_busy():
    assert primary_code(by_hand("database is locked")) is None
    assert is_busy(by_hand("database is locked"))
    assert is_busy(by_hand("Database Is Busy"))
    assert not is_busy(by_hand("no such table: t"))
    assert not is_busy(by_hand("database is locked", 1))  # the code wins over the text


def test_a_syntax_error_is_neither_busy_nor_translated(tmp_path):
    conn = sqlite3.connect(tmp_path / "a.sqlite")
    exc = raised(lambda: conn.execute("SELEC 1"))
    conn.close()
    assert primary_code(exc) == 1
    assert not is_busy(exc)
    assert words(exc) == message(exc, str(exc))


def test_real_sqlite_errors_get_their_words(tmp_path):
    full = sqlite3.connect(tmp_path / "full.sqlite")
    full.execute("PRAGMA max_page_count = 2")
    exc = raised(lambda: full.execute("CREATE TABLE t (x)").execute(
        "INSERT INTO t VALUES (zeroblob(100000))"))
    full.close()
    assert primary_code(exc) == 13 and words(exc) == message(exc, FULL)

    sqlite3.connect(tmp_path / "ro.sqlite").execute("CREATE TABLE t (x)").connection.close()
    ro = sqlite3.connect(f"file:{tmp_path / 'ro.sqlite'}?mode=ro", uri=True)
    exc = raised(lambda: ro.execute("INSERT INTO t VALUES (1)"))
    ro.close()
    assert primary_code(exc) == 8 and words(exc) == message(exc, READ_ONLY)

    junk = tmp_path / "junk.sqlite"
    junk.write_bytes(b"not a database at all " * 100)
    conn = sqlite3.connect(junk)
    exc = raised(lambda: conn.execute("SELECT * FROM sqlite_master"))
    conn.close()
    assert primary_code(exc) == 26 and words(exc) == message(exc, DAMAGED)

    exc = raised(lambda: sqlite3.connect(tmp_path / "no such folder" / "h.sqlite"))
    assert primary_code(exc) == 14 and words(exc) == message(exc, CANNOT_OPEN)


@pytest.mark.parametrize(("code", "why"), [
    (13, FULL), (8, READ_ONLY), (11, DAMAGED), (26, DAMAGED), (14, CANNOT_OPEN), (10, IO),
    (12, "something else"), (9, "something else"), (27, "something else"),
    (15, "something else"),
])
def test_the_code_alone_decides(code, why):
    exc = by_hand("something else", code)
    assert words(exc) == message(exc, why)


@pytest.mark.parametrize(("text", "why"), [
    ("database or disk is full", FULL),
    ("attempt to write a readonly database", READ_ONLY),
    ("the folder is read-only", READ_ONLY),
    ("database disk image is malformed", DAMAGED),
    ("file is not a database", DAMAGED),
    ("unable to open database file", CANNOT_OPEN),
    ("disk I/O error", "disk I/O error"),  # no code: passed on as it is
])
def test_the_text_alone_decides(text, why):
    exc = by_hand(text)
    assert words(exc) == message(exc, why)


def test_backup_name_carries_the_version_and_the_utc_time(monkeypatch):
    # Reference: the clock in UTC, with the process in a zone five hours behind it.
    monkeypatch.setenv("TZ", "EST+5")
    time.tzset()
    try:
        before = datetime.now(timezone.utc)
        name = backup_path(Path("/plant/history.sqlite"), 1).name
        after = datetime.now(timezone.utc)
    finally:
        monkeypatch.undo()
        time.tzset()
    found = re.fullmatch(r"history\.sqlite\.backup-v1-(\d{8}T\d{12})Z", name)
    assert found, name
    stamp = datetime.strptime(found.group(1), "%Y%m%dT%H%M%S%f").replace(tzinfo=timezone.utc)
    assert before - timedelta(microseconds=1) <= stamp <= after


# --------------------------------------------------------------------------- creating, migrating

def connect(path: Path) -> sqlite3.Connection:
    return sqlite3.connect(path, isolation_level=None)


def identity(path: Path) -> tuple[int, int]:
    conn = sqlite3.connect(path)
    try:
        return (conn.execute("PRAGMA application_id").fetchone()[0],
                conn.execute("PRAGMA user_version").fetchone()[0])
    finally:
        conn.close()


def test_a_missing_folder_is_refused_unless_asked_for(tmp_path):
    path = tmp_path / "plant" / "line 2" / "history.sqlite"
    with pytest.raises(HistoryError) as info:
        create_history(path, connect)
    assert str(info.value) == (
        f"{path}: the folder {path.parent} does not exist, so no history was created and "
        "nothing was recorded. Check the path, or create the history with: dispatcher "
        "history init PATH")
    assert not (tmp_path / "plant").exists()
    create_history(path, connect, make_folder=True)  # two missing levels
    assert identity(path) == (APPLICATION_ID, SCHEMA_VERSION)
    again = path.parent / "second.sqlite"
    create_history(again, connect, make_folder=True)  # the folder exists now
    assert identity(again) == (APPLICATION_ID, SCHEMA_VERSION)


def test_a_folder_that_cannot_be_made_is_reported(tmp_path):
    (tmp_path / "a file").write_text("not a folder")
    path = tmp_path / "a file" / "history.sqlite"
    with pytest.raises(HistoryError,
                       match=rf"^{re.escape(str(path))}: cannot create the folder for the "
                             r"history: \w[\w ]+$"):
        create_history(path, connect, make_folder=True)


def test_only_the_given_migrations_are_run(tmp_path):
    path = tmp_path / "v1.sqlite"
    create_history(path, connect, MIGRATIONS[:1])
    assert identity(path) == (APPLICATION_ID, 1)


def test_a_failing_step_creates_nothing_and_says_so(tmp_path):
    path = tmp_path / "h.sqlite"
    broken = (Migration(1, "broken", lambda conn: conn.execute("SELEC 1")),)
    with pytest.raises(HistoryError) as info:
        create_history(path, connect, broken)
    assert str(info.value) == (f'{path}: creating the history failed: near "SELEC": syntax '
                               'error [sqlite: near "SELEC": syntax error]')
    assert list(tmp_path.iterdir()) == []


def test_without_hard_links_the_new_history_is_moved_into_place(tmp_path, monkeypatch):
    # A file system without hard links: os.link fails with EPERM (injected).
    def no_links(src, dst):
        raise PermissionError(1, "Operation not permitted")
    monkeypatch.setattr(os, "link", no_links)
    path = tmp_path / "h.sqlite"
    create_history(path, connect)
    assert identity(path) == (APPLICATION_ID, SCHEMA_VERSION)
    assert [p.name for p in tmp_path.iterdir()] == ["h.sqlite"]
    # Another program's file already there: it is kept as it is, ours discarded.
    theirs = tmp_path / "theirs.sqlite"
    theirs.write_bytes(b"someone else's file")
    create_history(theirs, connect)
    assert theirs.read_bytes() == b"someone else's file"
    assert sorted(p.name for p in tmp_path.iterdir()) == ["h.sqlite", "theirs.sqlite"]


def test_a_current_file_is_not_migrated_nor_backed_up(tmp_path):
    path = tmp_path / "h.sqlite"
    create_history(path, connect)
    conn = connect(path)
    try:
        assert migrate(conn, path, SCHEMA_VERSION) is None
    finally:
        conn.close()
    assert [p.name for p in tmp_path.iterdir() if "backup" in p.name] == []


def test_a_backup_that_cannot_be_written_stops_the_upgrade(tmp_path):
    path = tmp_path / "v1.sqlite"
    create_history(path, connect, MIGRATIONS[:1])
    conn = connect(path)
    elsewhere = tmp_path / "no such folder" / "v1.sqlite"  # its backup has nowhere to go
    try:
        with pytest.raises(HistoryError,
                           match=rf"^{re.escape(str(elsewhere))}: could not write a backup to "
                                 rf"{re.escape(str(elsewhere))}\.backup-v1-\d{{8}}T\d{{12}}Z "
                                 r"before upgrading the history \(unable to open database "
                                 r"file\); nothing was changed$"):
            migrate(conn, elsewhere, 1)
    finally:
        conn.close()
    assert identity(path) == (APPLICATION_ID, 1)


def test_an_upgrade_runs_the_given_steps_up_to_the_last(tmp_path):
    # A third step after the released ones: the upgrade must go to the last step given,
    # not to the newest released one. Reference: user_version and sqlite_master read back.
    path = tmp_path / "v2.sqlite"
    create_history(path, connect)
    notes = Migration(3, "notes", lambda conn: conn.execute("CREATE TABLE notes (x TEXT)"))
    conn = connect(path)
    try:
        copy = migrate(conn, path, SCHEMA_VERSION, (*MIGRATIONS, notes))
    finally:
        conn.close()
    assert copy is not None and copy.name.startswith("v2.sqlite.backup-v2-")
    assert identity(path) == (APPLICATION_ID, 3)
    assert identity(copy) == (APPLICATION_ID, 2)
    conn = sqlite3.connect(path)
    try:
        tables = {r[0] for r in conn.execute("SELECT name FROM sqlite_master WHERE type = 'table'")}
    finally:
        conn.close()
    assert "notes" in tables


def test_a_failing_upgrade_step_is_undone_and_its_error_passed_on(tmp_path):
    # The step creates a table, then fails: the whole upgrade is rolled back (the table
    # is gone, the version unchanged), the step's own error reaches the caller, and the
    # connection is left outside any transaction. Reference: sqlite_master and
    # user_version read back with a fresh sqlite3 connection.
    path = tmp_path / "v1.sqlite"
    create_history(path, connect, MIGRATIONS[:1])

    def half_done(conn: sqlite3.Connection) -> None:
        conn.execute("CREATE TABLE half (x)")
        conn.execute("SELEC 1")
    conn = connect(path)
    try:
        with pytest.raises(sqlite3.OperationalError, match='near "SELEC": syntax error'):
            migrate(conn, path, 1, (MIGRATIONS[0], Migration(2, "half", half_done)))
        assert not conn.in_transaction
        conn.execute("BEGIN IMMEDIATE")  # usable again
        conn.execute("ROLLBACK")
    finally:
        conn.close()
    assert identity(path) == (APPLICATION_ID, 1)
    fresh = sqlite3.connect(path)
    try:
        assert fresh.execute("SELECT count(*) FROM sqlite_master WHERE name = 'half'").fetchone() == (0,)
    finally:
        fresh.close()


def test_steps_out_of_order_are_refused(tmp_path):
    skipped = (MIGRATIONS[0], Migration(3, "three", lambda conn: None))
    with pytest.raises(RuntimeError, match=r"^history migrations out of order at version 3$"):
        apply_migrations(sqlite3.connect(":memory:"), 0, skipped)


def test_a_failure_moving_the_new_history_into_place_is_reported(tmp_path, monkeypatch):
    # No hard links, and the move fails too (an I/O error, injected): the supervisor gets
    # the system's words, and neither the history nor the half-built file is left behind.
    def no_links(src, dst):
        raise PermissionError(1, "Operation not permitted")

    def failing_move(src, dst):
        raise OSError(5, "Input/output error")
    monkeypatch.setattr(os, "link", no_links)
    monkeypatch.setattr(os, "replace", failing_move)
    path = tmp_path / "h.sqlite"
    with pytest.raises(HistoryError) as info:
        create_history(path, connect)
    assert str(info.value) == f"{path}: cannot create the history: Input/output error"
    assert list(tmp_path.iterdir()) == []


def test_read_only_means_a_file_that_exists_and_may_not_be_written(tmp_path):
    # Reference: the file's mode bits set with os.chmod (a missing file can still be created).
    path = tmp_path / "h.sqlite"
    assert read_only_file(path) is False
    path.write_bytes(b"")
    assert read_only_file(path) is False
    os.chmod(path, 0o444)
    assert read_only_file(path) is True
    os.chmod(path, 0o555)  # executable bits do not make it writable
    assert read_only_file(path) is True


def _damage_index_page(path: Path, index: str) -> None:
    """Point the first cell of an index's root page outside the page (a real b-tree fault)."""
    conn = sqlite3.connect(path)
    try:
        conn.execute("PRAGMA wal_checkpoint(TRUNCATE)")
        page_size = conn.execute("PRAGMA page_size").fetchone()[0]
        root = conn.execute("SELECT rootpage FROM sqlite_master WHERE name = ?", (index,)).fetchone()[0]
    finally:
        conn.close()
    data = bytearray(path.read_bytes())
    start = (root - 1) * page_size
    assert data[start] == 0x0A  # a leaf index page (SQLite file format, section 1.6)
    data[start + 8:start + 10] = b"\xff\xff"
    path.write_bytes(bytes(data))


def test_a_damaged_history_is_reported_with_every_fault_sqlite_finds(tmp_path):
    # Reference: PRAGMA quick_check on a plain sqlite3 connection, which reports one row
    # per damaged database; the history and a damaged copy attached beside it give two.
    path = tmp_path / "h.sqlite"
    record_two(path)
    _damage_index_page(path, "decision_rows_job")
    copy = tmp_path / "copy.sqlite"
    copy.write_bytes(path.read_bytes())
    conn = connect(path)
    try:
        conn.execute("ATTACH DATABASE ? AS copy", (str(copy),))
        faults = [r[0] for r in conn.execute("PRAGMA quick_check(5)")]
        assert len(faults) == 2 and all("On tree page" in f for f in faults)
        with pytest.raises(HistoryError) as info:
            quick_check(conn, path)
    finally:
        conn.close()
    assert str(info.value) == (f"{path}: the history file is damaged ({faults[0]}; {faults[1]}); "
                               "it was left as it is. Restore it from a backup or choose another file")
    fresh = connect(tmp_path / "fresh.sqlite")
    try:
        quick_check(fresh, tmp_path / "fresh.sqlite")  # a sound file passes
    finally:
        fresh.close()


def _sqlite_file(path: Path, app_id: int, version: int) -> sqlite3.Connection:
    conn = connect(path)
    conn.execute("CREATE TABLE notes (x TEXT)")
    conn.execute(f"PRAGMA application_id = {app_id}")
    conn.execute(f"PRAGMA user_version = {version}")
    return conn


@pytest.mark.parametrize(("app_id", "version", "newest", "why", "hint"), [
    (0, 0, SCHEMA_VERSION, "an SQLite file, but not a dispatcher history; it was left as it is. "
     "Choose another file", HINT_OTHER_HISTORY_FILE),
    (0x12345678, 2, SCHEMA_VERSION, "an SQLite file, but not a dispatcher history; it was left as "
     "it is. Choose another file", HINT_OTHER_HISTORY_FILE),
    (APPLICATION_ID, SCHEMA_VERSION + 1, SCHEMA_VERSION,
     f"written by a newer version of dispatcher (history schema {SCHEMA_VERSION + 1}, this "
     f"version reads up to {SCHEMA_VERSION}); update dispatcher to use it. The file was left "
     "as it is", None),
    (APPLICATION_ID, 2, 1, "written by a newer version of dispatcher (history schema 2, this "
     "version reads up to 1); update dispatcher to use it. The file was left as it is", None),
    (APPLICATION_ID, 0, SCHEMA_VERSION, "a dispatcher history without a schema; it was left as "
     "it is. Choose another file", HINT_OTHER_HISTORY_FILE),
])
def test_a_file_that_is_not_a_usable_history_is_named_and_refused(tmp_path, app_id, version,
                                                                  newest, why, hint):
    # Reference: the two header fields written with plain sqlite3 PRAGMAs.
    path = tmp_path / "h.sqlite"
    conn = _sqlite_file(path, app_id, version)
    try:
        with pytest.raises(HistoryError) as info:
            check_identity(conn, path, newest)
    finally:
        conn.close()
    assert str(info.value) == f"{path}: {why}"
    assert info.value.hint == hint


@pytest.mark.parametrize("version", [1, SCHEMA_VERSION])
def test_a_history_of_a_known_schema_gives_its_version(tmp_path, version):
    conn = _sqlite_file(tmp_path / "h.sqlite", APPLICATION_ID, version)
    try:
        assert check_identity(conn, tmp_path / "h.sqlite") == version
    finally:
        conn.close()


# --------------------------------------------------------------------------- checks before opening

NOT_SQLITE = ("not a dispatcher history (not an SQLite database file); it was left as it is. "
              "Choose another file")


def refusal(path: Path) -> HistoryError:
    with pytest.raises(HistoryError) as info:
        check_header(path)
    return info.value


def _sqlite_with_pages(path: Path, page_size: int, rows: int = 4) -> int:
    """A real SQLite file with the given page size; returns its page count."""
    conn = sqlite3.connect(path)
    conn.execute(f"PRAGMA page_size = {page_size}")
    conn.execute("CREATE TABLE t (x BLOB)")
    for _ in range(rows):
        conn.execute("INSERT INTO t VALUES (zeroblob(?))", (page_size,))
    conn.commit()
    pages = conn.execute("PRAGMA page_count").fetchone()[0]
    conn.close()
    assert path.stat().st_size == pages * page_size
    return pages


def test_an_empty_or_foreign_file_is_refused_by_its_first_bytes(tmp_path):
    path = tmp_path / "h.sqlite"
    path.write_bytes(b"")
    err = refusal(path)
    assert str(err) == (f"{path}: the file is empty (0 bytes), so it is not a dispatcher history; "
                        "it was left as it is. Move it away or choose another file")
    assert err.hint == HINT_OTHER_HISTORY_FILE
    for content in (b"job,machine\nWO-1,Press 1\n" * 10,   # a grid saved under the wrong name
                    b"SQLite format 3\x00" + b"\x00" * 40):  # the magic, but no whole header
        path.write_bytes(content)
        err = refusal(path)
        assert (str(err), err.hint) == (f"{path}: {NOT_SQLITE}", HINT_OTHER_HISTORY_FILE)


def test_a_folder_in_place_of_the_history_is_reported_in_the_system_s_words(tmp_path):
    path = tmp_path / "h.sqlite"
    path.mkdir()
    assert str(refusal(path)) == f"{path}: cannot read the history file: Is a directory"


@pytest.mark.parametrize("page_size", [1024, 32768, 65536])
def test_a_cut_file_is_refused_with_the_size_its_header_gives(tmp_path, page_size):
    # Reference: SQLite writes the file; its header stores 65536 as 1 (file format 1.3.2).
    path = tmp_path / "h.sqlite"
    pages = _sqlite_with_pages(path, page_size)
    assert path.read_bytes()[16:18] == (b"\x00\x01" if page_size == 65536 else
                                        page_size.to_bytes(2, "big"))
    check_header(path)  # whole: accepted
    cut = (pages - 1) * page_size + 10
    with path.open("r+b") as f:
        f.truncate(cut)
    err = refusal(path)
    assert str(err) == (f"{path}: the history file is truncated ({cut} bytes, its header says "
                        f"{pages * page_size}); it was left as it is. Restore it from a backup "
                        "or choose another file")
    assert err.hint == HINT_OTHER_HISTORY_FILE


def test_the_header_size_counts_for_a_file_changed_more_than_two_billion_times(tmp_path):
    # The change counter and its valid-for copy are unsigned 32-bit numbers (file format
    # 1.3.8); set both past 2**31 by hand, as a long-lived file reaches them.
    path = tmp_path / "h.sqlite"
    pages = _sqlite_with_pages(path, 4096)
    data = bytearray(path.read_bytes()[:(pages - 1) * 4096])
    data[24:28] = data[92:96] = struct.pack(">I", 2**31 + 7)
    path.write_bytes(bytes(data))
    assert "is truncated" in str(refusal(path))


def test_a_pending_write_ahead_log_makes_the_header_size_untrusted(tmp_path):
    # With a non-empty "-wal" file beside it the main file may lag behind its header (the
    # log is copied back at the next checkpoint), so a short file is left to SQLite.
    path = tmp_path / "h.sqlite"
    pages = _sqlite_with_pages(path, 4096)
    with path.open("r+b") as f:
        f.truncate((pages - 1) * 4096)
    wal = tmp_path / "h.sqlite-wal"
    wal.write_bytes(b"")
    assert "is truncated" in str(refusal(path))  # an empty log holds nothing
    for log in (b"\x37", b"\x37\x7f\x06\x82" + b"\x00" * 28):  # a torn first byte, a header
        wal.write_bytes(log)
        check_header(path)
