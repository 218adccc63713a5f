"""The SQLite history refuses every change to a recorded decision, and every read path
detects a change made with the refusals removed.

Outside references: SQLite itself (raw sqlite3 connections issuing UPDATE, DELETE,
INSERT OR REPLACE and REPLACE against the file, and building a schema-1 file by hand with
the schema-1 statements, independently of the store's code); the csv module is not
needed because a tampered history must refuse to export at all.
"""

from __future__ import annotations

import hashlib
import json
import os
import sqlite3
from datetime import datetime, timezone
from pathlib import Path

import pytest

from dispatcher.cli import main
from dispatcher.commands.common import EXIT_BAD_INPUT, EXIT_STORE
from dispatcher.history import HistoryError, HistoryStore
from dispatcher.history.schema import _V1, APPLICATION_ID, MIGRATIONS
from dispatcher.history.seal import SEALED_COLUMNS

UTC = timezone.utc
T0 = datetime(2026, 3, 14, 5, 0, tzinfo=UTC)
SHOP = {"name": "Press shop (invented)", "jobs": ["WO-1", "WO-2"]}
PLAN = {"status": "optimal", "objective": "total", "total": 448,
        "assignments": [{"job": "WO-1", "machine": "Press 1", "cost": 400},
                        {"job": "WO-2", "machine": "Press 2", "cost": 48}],
        "waiting_jobs": [], "idle_machines": ["Press 3"], "certificate": {"verified": True}}

#: A value of the right type, different from what the store wrote, for every column.
CHANGED = {"id": 99, "time_utc": "2026-03-14T06:00:00.000000Z", "shift_date": "2026-03-15",
           "shift_label": "late", "supervisor": "Supervisor B", "reason_kind": "repair",
           "reason_text": "edited", "shop_name": "Other shop", "objective": "maximize",
           "total": 1, "certificate": "failed", "replaces": 2, "restored_from": 2,
           "shop_json": '{"name":"Press shop (invented)"}',
           "plan_json": json.dumps(dict(PLAN, total=1)), "diff_json": "{}",
           "digest": "0" * 64, "station": "station Z", "based_on": 2, "seal": "f" * 64}
ROW_CHANGED = {"decision_id": 2, "state": "waiting", "machine": "Press 9", "job": "WO-9",
               "value": 1.0}


def record_two(path: Path) -> HistoryStore:
    store = HistoryStore(path, tz=UTC, station="station A")
    store.record(SHOP, PLAN, by="Supervisor A", reason="shift start", time=T0)
    store.record(SHOP, dict(PLAN, total=450), by="Supervisor A", reason="other", time=T0)
    return store


def raw(path: Path) -> sqlite3.Connection:
    return sqlite3.connect(path, isolation_level=None)


def sha(path: Path) -> str:
    return hashlib.sha256(path.read_bytes()).hexdigest()


def test_every_column_is_sealed():
    conn = sqlite3.connect(":memory:")
    for step in MIGRATIONS:
        step.apply(conn)
    stored = [r[1] for r in conn.execute("PRAGMA table_info(decisions)")]
    assert sorted(stored) == sorted((*SEALED_COLUMNS, "seal"))
    assert set(CHANGED) == set(stored)  # the tests below change each of them


@pytest.mark.parametrize("column", sorted(CHANGED))
def test_update_of_any_column_is_refused(tmp_path, column):
    store = record_two(tmp_path / "h.sqlite")
    before = sha(store.path)
    conn = raw(store.path)
    with pytest.raises(sqlite3.DatabaseError, match="append-only"):
        conn.execute(f"UPDATE decisions SET {column} = ? WHERE id = 1", (CHANGED[column],))
    with pytest.raises(sqlite3.DatabaseError, match="append-only"):
        conn.execute(f"UPDATE OR REPLACE decisions SET {column} = ?", (CHANGED[column],))
    conn.close()
    assert sha(store.path) == before and store.get(1).total == 448


@pytest.mark.parametrize("column", sorted(ROW_CHANGED))
def test_update_of_any_row_column_is_refused(tmp_path, column):
    store = record_two(tmp_path / "h.sqlite")
    conn = raw(store.path)
    with pytest.raises(sqlite3.DatabaseError, match="append-only"):
        conn.execute(f"UPDATE decision_rows SET {column} = ?", (ROW_CHANGED[column],))
    conn.close()
    assert [r["value"] for r in store.rows()][:2] == [400, 48]


def test_delete_is_refused(tmp_path):
    store = record_two(tmp_path / "h.sqlite")
    conn = raw(store.path)
    for sql in ("DELETE FROM decisions WHERE id = 1", "DELETE FROM decisions",
                "DELETE FROM decision_rows WHERE decision_id = 1"):
        with pytest.raises(sqlite3.DatabaseError, match="append-only"):
            conn.execute(sql)
    conn.close()
    assert [d.id for d in store.list()] == [1, 2] and len(store.rows()) == 6


@pytest.mark.parametrize("verb", ["INSERT OR REPLACE", "REPLACE", "INSERT"])
@pytest.mark.parametrize("column", sorted(set(CHANGED) - {"id"}))
def test_replacing_decision_one_is_refused(tmp_path, verb, column):
    """Delete triggers do not fire on REPLACE's implicit delete: the insert is guarded."""
    store = record_two(tmp_path / "h.sqlite")
    conn = raw(store.path)
    names = [r[1] for r in conn.execute("PRAGMA table_info(decisions)")]
    row = dict(zip(names, conn.execute("SELECT * FROM decisions WHERE id = 1").fetchone()))
    row[column] = CHANGED[column]
    marks = ", ".join("?" for _ in row)
    with pytest.raises(sqlite3.DatabaseError, match="append-only|UNIQUE"):
        conn.execute(f"{verb} INTO decisions ({', '.join(row)}) VALUES ({marks})",
                     list(row.values()))
    conn.close()
    d = store.get(1)
    assert (d.total, d.by, d.note) == (448, "Supervisor A", "")


def test_rows_cannot_be_replaced_or_added_to_an_old_decision(tmp_path):
    store = record_two(tmp_path / "h.sqlite")
    conn = raw(store.path)
    with pytest.raises(sqlite3.DatabaseError, match="append-only"):
        conn.execute("INSERT OR REPLACE INTO decision_rows (rowid, decision_id, state, machine,"
                     " job, value) VALUES (1, 1, 'assigned', 'Press 1', 'WO-1', 1)")
    with pytest.raises(sqlite3.DatabaseError, match="append-only"):
        conn.execute("INSERT INTO decision_rows (decision_id, state, machine, job, value) "
                     "VALUES (1, 'assigned', 'Press 3', 'WO-3', 1)")
    conn.close()
    assert store.get(1).total == 448


def _drop_triggers(conn: sqlite3.Connection) -> None:
    for (name,) in conn.execute("SELECT name FROM sqlite_master WHERE type = 'trigger'"
                                ).fetchall():
        conn.execute(f"DROP TRIGGER {name}")


def _every_read_refuses(store: HistoryStore, tmp_path: Path, number: int = 1) -> None:
    for read in (lambda: store.get(number), store.list, lambda: store.list(limit=5),
                 store.rows, lambda: store.export_csv(tmp_path / "out.csv"),
                 lambda: store.diff(1, 2), lambda: store.restore(number, by="Supervisor A")):
        with pytest.raises(HistoryError, match=f"#{number} no longer match"):
            read()
    assert not (tmp_path / "out.csv").exists()


@pytest.mark.parametrize("column", sorted(set(CHANGED) - {"id"}))
def test_a_change_to_any_column_is_caught_by_every_read(tmp_path, column, capsys):
    """With the triggers dropped (another tool), the seal still catches the change."""
    store = record_two(tmp_path / "h.sqlite")
    conn = raw(store.path)
    _drop_triggers(conn)
    conn.execute(f"UPDATE decisions SET {column} = ? WHERE id = 1", (CHANGED[column],))
    conn.close()
    _every_read_refuses(HistoryStore(store.path), tmp_path)
    for argv in (["list"], ["list", "--json"], ["show", "1"], ["export",
                                                               str(tmp_path / "o.csv")]):
        assert main(["history", *argv, "--history", str(store.path)]) == EXIT_STORE
        out, err = capsys.readouterr()
        assert "#1 no longer matches its checksum" in err and "448" not in out
    assert store.count() == 2  # nothing was added by the refused restore


def test_changed_number_is_caught(tmp_path):
    store = record_two(tmp_path / "h.sqlite")
    conn = raw(store.path)
    _drop_triggers(conn)
    conn.execute("PRAGMA foreign_keys = OFF")
    conn.execute("UPDATE decisions SET id = 7 WHERE id = 1")
    conn.execute("UPDATE decision_rows SET decision_id = 7 WHERE decision_id = 1")
    conn.close()
    with pytest.raises(HistoryError, match="#7 no longer matches"):
        HistoryStore(store.path).list()


@pytest.mark.parametrize("change", [
    "UPDATE decision_rows SET value = 1 WHERE rowid = 1",
    "UPDATE decision_rows SET machine = 'Press 9' WHERE rowid = 1",
    "UPDATE decision_rows SET job = 'WO-9' WHERE rowid = 1",
    "UPDATE decision_rows SET state = 'waiting' WHERE rowid = 1",
    "DELETE FROM decision_rows WHERE rowid = 1",
    "INSERT INTO decision_rows VALUES (1, 'idle', 'Press 9', NULL, NULL)",
    "UPDATE decision_rows SET decision_id = 2 WHERE rowid = 1",
])
def test_a_change_to_the_rows_is_caught(tmp_path, change):
    store = record_two(tmp_path / "h.sqlite")
    conn = raw(store.path)
    _drop_triggers(conn)
    conn.execute(change)
    conn.close()
    with pytest.raises(HistoryError, match="no longer match"):
        HistoryStore(store.path).rows()
    with pytest.raises(HistoryError, match="#1"):
        HistoryStore(store.path).get(1)


# ---------------------------------------------------------------- upgrading a schema-1 file

def _schema_1_file(path: Path, n: int, plan_of=lambda i: dict(PLAN, total=440 + i)) -> None:
    """A history as schema 1 wrote it, built with its statements and raw inserts."""
    conn = raw(path)
    conn.execute("PRAGMA journal_mode = WAL")
    conn.execute(f"PRAGMA application_id = {APPLICATION_ID}")
    conn.executescript(_V1)
    conn.execute("PRAGMA user_version = 1")
    for i in range(1, n + 1):
        shop = json.dumps({"name": "s", "n": i})
        plan_i = plan_of(i)
        plan = json.dumps(plan_i, separators=(",", ":"))
        digest = hashlib.sha256((shop + "\x00" + plan).encode()).hexdigest()
        conn.execute(
            "INSERT INTO decisions (time_utc, shift_date, shift_label, supervisor, "
            "reason_kind, reason_text, shop_name, objective, total, certificate, replaces, "
            "shop_json, plan_json, digest) VALUES ('2026-03-14T05:00:00.000000Z', "
            "'2026-03-13', 'night', 'Supervisor A', 'other', '', 's', 'total', ?, "
            "'verified', ?, ?, ?, ?)", (plan_i["total"], i - 1 or None, shop, plan, digest))
        for a in plan_i["assignments"]:
            conn.execute("INSERT INTO decision_rows VALUES (?, 'assigned', ?, ?, ?)",
                         (i, a["machine"], a["job"], a["cost"]))
    conn.close()


def test_schema_1_history_is_upgraded_and_old_decisions_verify(tmp_path):
    path = tmp_path / "h.sqlite"
    _schema_1_file(path, 3)
    conn = raw(path)  # decision 2 was tampered with while schema 1 was in use
    conn.execute("DROP TRIGGER decisions_append_only_update")
    conn.execute("UPDATE decisions SET plan_json = replace(plan_json, 'Press 1', 'Press 7') "
                 "WHERE id = 2")
    conn.close()
    store = HistoryStore(path)
    assert store.get(1).total == 441 and store.get(3).total == 443
    assert store.last_backup is not None and store.last_backup.exists()
    with pytest.raises(HistoryError, match="#2 no longer matches"):
        store.get(2)
    n = store.record({"name": "s"}, PLAN, by="Supervisor B", reason="other")
    assert n == 4 and store.get(n).replaces == 3
    conn = raw(path)
    assert conn.execute("PRAGMA user_version").fetchone()[0] == MIGRATIONS[-1].version
    with pytest.raises(sqlite3.DatabaseError, match="append-only"):
        conn.execute("INSERT OR REPLACE INTO decisions SELECT * FROM decisions WHERE id = 1")
    # A column schema 1 did not check (the total) is now covered for the old decisions too.
    _drop_triggers(conn)
    conn.execute("UPDATE decisions SET total = 1 WHERE id = 1")
    conn.close()
    with pytest.raises(HistoryError, match="#1 no longer matches"):
        HistoryStore(path).get(1)


def test_an_old_decision_without_rows_is_sealed_on_upgrade(tmp_path):
    # A plan for a shop with no jobs and no machines stores no rows at all.
    empty = dict(PLAN, total=0, assignments=[], idle_machines=[])
    path = tmp_path / "h.sqlite"
    _schema_1_file(path, 1, plan_of=lambda i: empty)
    store = HistoryStore(path)
    assert store.get(1).total == 0 and store.rows() == []
    conn = raw(path)
    assert conn.execute("SELECT seal IS NOT NULL FROM decisions WHERE id = 1").fetchone() == (1,)
    _drop_triggers(conn)
    conn.execute("UPDATE decisions SET supervisor = 'Supervisor B' WHERE id = 1")
    conn.close()
    with pytest.raises(HistoryError, match="#1 no longer matches"):
        HistoryStore(path).get(1)


# ---------------------------------------------------------------- missing and read-only

def test_no_folder_is_created_for_a_missing_one(tmp_path, capsys):
    target = tmp_path / "typo" / "h.sqlite"
    with pytest.raises(HistoryError, match="folder .*typo does not exist"):
        HistoryStore(target).record(SHOP, PLAN, by="Supervisor A", reason="other")
    assert not target.parent.exists()
    assert main(["history", "list", "--history", str(target)]) == EXIT_STORE
    assert "does not exist" in capsys.readouterr().err
    assert main(["history", "show", "1", "--history", str(target)]) == EXIT_STORE
    err = capsys.readouterr().err
    assert str(target) in err and "does not exist, so no decision #1" in err
    assert not target.parent.exists()
    assert main(["history", "init", str(target)]) == 0
    assert "Created an empty history" in capsys.readouterr().out
    assert main(["history", "list", "--json", "--history", str(target)]) == 0
    assert json.loads(capsys.readouterr().out) == []
    assert main(["history", "init", str(target)]) == 0
    assert "already exists" in capsys.readouterr().out


@pytest.mark.parametrize("argv, message", [
    (["list", "--limit", "-3"], "expected a whole number >= 1"),
    (["list", "--limit", "0"], "expected a whole number >= 1"),
    (["export", "/no/such/dir/o.csv"], "folder /no/such/dir does not exist"),
    (["export", "OUT.xlsx"], "must end in .csv"),
])
def test_bad_arguments_exit_2(tmp_path, capsys, argv, message):
    store = record_two(tmp_path / "h.sqlite")
    before = sha(store.path)
    with pytest.raises(SystemExit) if argv[1] == "--limit" else _no_raise():
        code = main(["history", *argv, "--history", str(store.path)])
        assert code == EXIT_BAD_INPUT
    assert message in capsys.readouterr().err
    assert sha(store.path) == before and not Path("OUT.xlsx").exists()


class _no_raise:
    def __enter__(self):
        return self

    def __exit__(self, *exc):
        return False


def test_list_limit_shows_the_newest(tmp_path, capsys):
    store = record_two(tmp_path / "h.sqlite")
    assert main(["history", "list", "--json", "--limit", "1", "--history",
                 str(store.path)]) == 0
    assert [d["id"] for d in json.loads(capsys.readouterr().out)] == [2]


def _side_files(path: Path) -> list[str]:
    return sorted(p.name for p in path.parent.iterdir() if p.name != path.name)


def test_read_only_file_is_read_without_leaving_side_files(tmp_path):
    path = tmp_path / "h.sqlite"
    record_two(path)
    assert _side_files(path) == []
    path.chmod(0o444)
    try:
        store = HistoryStore(path)
        assert [d.id for d in store.list()] == [1, 2] and store.get(1).total == 448
        assert len(store.rows()) == 6
        assert _side_files(path) == []  # no -shm or -wal outlives the permission
        with pytest.raises(HistoryError, match="read-only"):
            store.record(SHOP, PLAN, by="Supervisor A", reason="other")
    finally:
        path.chmod(0o644)
    assert HistoryStore(path).record(SHOP, PLAN, by="Supervisor A", reason="other") == 3


def test_stale_read_only_side_file_is_named(tmp_path):
    path = tmp_path / "h.sqlite"
    record_two(path)
    shm = Path(f"{path}-shm")
    shm.write_bytes(b"")
    shm.chmod(0o444)
    if os.access(shm, os.W_OK):
        pytest.skip("running with privileges that write read-only files anyway")
    with pytest.raises(HistoryError, match="side file .*-shm is read-only"):
        HistoryStore(path).record(SHOP, PLAN, by="Supervisor A", reason="other")


def test_history_in_a_read_only_folder_can_be_listed(tmp_path, capsys):
    folder = tmp_path / "shared"
    folder.mkdir()
    path = folder / "h.sqlite"
    record_two(path)
    folder.chmod(0o555)
    try:
        if os.access(folder, os.W_OK):
            pytest.skip("running with privileges that write read-only folders anyway")
        store = HistoryStore(path)
        assert [d.id for d in store.list()] == [1, 2] and store.get(2).total == 450
        assert main(["history", "list", "--json", "--history", str(path)]) == 0
        assert [d["id"] for d in json.loads(capsys.readouterr().out)] == [1, 2]
        assert _side_files(path) == []
        with pytest.raises(HistoryError, match="read-only"):
            store.record(SHOP, PLAN, by="Supervisor A", reason="other")
    finally:
        folder.chmod(0o755)
