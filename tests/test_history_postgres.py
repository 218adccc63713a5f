"""The PostgreSQL store against a real server started by the tests (tests/pg_server.py).

Outside references: the server itself (raw psycopg connections issuing UPDATE, DELETE,
TRUNCATE and INSERT ... ON CONFLICT against the tables, and superuser access that
disables the triggers to stand for an outside tool), the server's own error for a
refused login, and the SQLite file read back with plain sqlite3 after a copy.
"""

from __future__ import annotations

import json
import os
import sqlite3
import subprocess
import sys
from datetime import datetime, timezone
from pathlib import Path

import pytest

from dispatcher.cli import main
from dispatcher.commands.common import EXIT_BAD_INPUT, EXIT_STORE
from dispatcher.errors import EXIT_CONFLICT
from dispatcher.history import (
    HistoryError,
    HistoryInputError,
    HistoryStore,
    open_history,
)
from dispatcher.history.postgres import PG_MIGRATIONS, PostgresStore
from dispatcher.history.seal import SEALED_COLUMNS

try:
    import psycopg
except ImportError:  # the optional extra; CI installs it and requires these tests
    if os.environ.get("DISPATCHER_REQUIRE_POSTGRES"):
        raise
    pytest.skip("psycopg is not installed (pip install '.[postgres]')",
                allow_module_level=True)

ROOT = Path(__file__).resolve().parent.parent
UTC = timezone.utc
T0 = datetime(2026, 3, 14, 5, 0, tzinfo=UTC)
SHOP = {"name": "Press shop (invented)"}
PLAN = {"status": "optimal", "objective": "total", "total": 448,
        "assignments": [{"job": "WO-1", "machine": "Press 1", "cost": 400},
                        {"job": "WO-2", "machine": "Press 2", "cost": 48}],
        "waiting_jobs": [], "idle_machines": ["Press 3"], "certificate": {"verified": True}}
CHANGED = {"time_utc": "2026-03-14T06:00:00.000000Z", "shift_date": "2026-03-15",
           "shift_label": "late", "supervisor": "Supervisor B", "reason_kind": "repair",
           "reason_text": "edited", "shop_name": "Other shop", "objective": "maximize",
           "total": 1, "certificate": "failed", "replaces": 2, "restored_from": 2,
           "shop_json": '{"name":"x"}', "plan_json": json.dumps(dict(PLAN, total=1)),
           "diff_json": "{}", "digest": "0" * 64, "station": "station Z", "based_on": 2,
           "seal": "f" * 64}


def record_two(location: str) -> PostgresStore:
    store = open_history(location, tz=UTC, station="station A")
    store.record(SHOP, PLAN, by="Supervisor A", reason="shift start", time=T0)
    store.record(SHOP, dict(PLAN, total=450), by="Supervisor A", reason="other", time=T0)
    return store


def raw(location: str):
    return psycopg.connect(location, autocommit=True)


def test_every_column_is_sealed(pg_location):
    record_two(pg_location)
    with raw(pg_location) as conn:
        stored = [r[0] for r in conn.execute(
            "SELECT column_name FROM information_schema.columns WHERE table_name = "
            "'decisions' AND table_schema = current_schema()")]
    assert sorted(stored) == sorted((*SEALED_COLUMNS, "seal")) == sorted({"id", *CHANGED})


@pytest.mark.parametrize("column", sorted(CHANGED))
def test_update_of_any_column_is_refused_by_the_server(pg_location, column):
    store = record_two(pg_location)
    with raw(pg_location) as conn:
        with pytest.raises(psycopg.errors.InsufficientPrivilege, match="append-only"):
            conn.execute(f"UPDATE decisions SET {column} = %s WHERE id = 1",
                         (CHANGED[column],))
        names = [r[0] for r in conn.execute(
            "SELECT column_name FROM information_schema.columns WHERE table_name = "
            "'decisions' AND table_schema = current_schema() ORDER BY ordinal_position")]
        row = dict(zip(names, conn.execute("SELECT * FROM decisions WHERE id = 1").fetchone()))
        row[column] = CHANGED[column]
        marks = ", ".join("%s" for _ in row)
        with pytest.raises(psycopg.errors.InsufficientPrivilege, match="append-only"):
            conn.execute(f"INSERT INTO decisions ({', '.join(row)}) VALUES ({marks}) "
                         f"ON CONFLICT (id) DO UPDATE SET {column} = EXCLUDED.{column}",
                         list(row.values()))
        with pytest.raises(psycopg.errors.UniqueViolation):
            conn.execute(f"INSERT INTO decisions ({', '.join(row)}) VALUES ({marks})",
                         list(row.values()))
    d = store.get(1)
    assert (d.total, d.by, d.note, d.station) == (448, "Supervisor A", "", "station A")


@pytest.mark.parametrize("sql", [
    "DELETE FROM decisions WHERE id = 2", "DELETE FROM decision_rows",
    "TRUNCATE decisions CASCADE", "TRUNCATE decision_rows",
    "UPDATE decision_rows SET value = 1", "UPDATE decision_rows SET machine = 'Press 9'",
    "UPDATE decision_rows SET job = 'WO-9'", "UPDATE decision_rows SET state = 'idle'",
    "UPDATE decision_rows SET position = 9", "UPDATE decision_rows SET decision_id = 2",
    "INSERT INTO decision_rows VALUES (1, 9, 'idle', 'Press 9', NULL, NULL)",
    "DELETE FROM dispatcher_schema", "UPDATE dispatcher_schema SET version = 99",
])
def test_delete_truncate_and_row_changes_are_refused(pg_location, sql):
    store = record_two(pg_location)
    with raw(pg_location) as conn, pytest.raises(psycopg.errors.InsufficientPrivilege,
                                                 match="append-only"):
        conn.execute(sql)
    assert store.count() == 2 and len(store.rows()) == 6


def _disable_triggers(conn) -> None:
    for table in ("decisions", "decision_rows"):
        conn.execute(f"ALTER TABLE {table} DISABLE TRIGGER USER")


@pytest.mark.parametrize("column", sorted(set(CHANGED)))
def test_a_change_to_any_column_is_caught_by_every_read(pg_location, column, tmp_path,
                                                        capsys):
    store = record_two(pg_location)
    with raw(pg_location) as conn:
        _disable_triggers(conn)
        conn.execute(f"UPDATE decisions SET {column} = %s WHERE id = 1", (CHANGED[column],))
    for read in (lambda: store.get(1), store.list, store.rows, lambda: store.diff(1, 2),
                 lambda: store.export_csv(tmp_path / "o.csv"),
                 lambda: store.restore(1, by="Supervisor A")):
        with pytest.raises(HistoryError, match="#1 no longer matches its checksum"):
            read()
    assert main(["history", "list", "--history", pg_location]) == EXIT_STORE
    assert "#1 no longer matches" in capsys.readouterr().err
    assert store.count() == 2 and not (tmp_path / "o.csv").exists()


def test_a_change_to_the_rows_is_caught(pg_location):
    store = record_two(pg_location)
    with raw(pg_location) as conn:
        _disable_triggers(conn)
        conn.execute("UPDATE decision_rows SET value = 1 WHERE decision_id = 1 AND "
                     "position = 0")
    with pytest.raises(HistoryError, match="#1 no longer matches"):
        store.rows()


# ---------------------------------------------------------------- faults

def test_refused_connection_is_one_clear_message(tmp_path, capsys):
    location = f"postgresql://postgres@/dispatcher_test?host={tmp_path}"  # no server there
    store = open_history(location, timeout=2)
    with pytest.raises(HistoryError, match="cannot be reached"):
        store.record(SHOP, PLAN, by="Supervisor A", reason="other")
    code = main(["history", "list", "--history", location])
    err = capsys.readouterr().err
    assert code == EXIT_STORE and err.count("\n") == 1 and "cannot be reached" in err


def test_failed_login_is_one_clear_message(pg_server, capsys, monkeypatch):
    monkeypatch.delenv("PGPASSWORD", raising=False)
    monkeypatch.setenv("PGPASSFILE", "/nonexistent")
    location = pg_server.uri(user="pw_user")
    with pytest.raises(HistoryError, match="authentication failed"):
        open_history(location, timeout=3).list()
    assert main(["history", "list", "--history", location]) == EXIT_STORE
    assert "refused the login" in capsys.readouterr().err


def test_password_in_the_location_is_refused(pg_server, capsys):
    location = "postgresql://pw_user:secret@/dispatcher_test?host=/tmp"
    with pytest.raises(HistoryInputError, match="holds a password"):
        open_history(location)
    assert main(["history", "list", "--history", location]) == EXIT_BAD_INPUT
    assert "secret" not in capsys.readouterr().err


def test_password_from_the_environment_is_used(pg_server, monkeypatch, pg_location):
    """libpq's own mechanism (PGPASSWORD here) supplies the password; our files hold none."""
    with raw(pg_location) as conn:
        schema = conn.execute("SELECT current_schema()").fetchone()[0]
        conn.execute(f"GRANT ALL ON SCHEMA {schema} TO pw_user")
    monkeypatch.setenv("PGPASSWORD", "only-for-this-test")
    location = pg_server.uri(schema=schema, user="pw_user")
    store = open_history(location)
    assert store.record(SHOP, PLAN, by="Supervisor A", reason="other") == 1


def test_newer_schema_is_refused_and_left_alone(pg_location, capsys):
    store = record_two(pg_location)
    with raw(pg_location) as conn:
        conn.execute("INSERT INTO dispatcher_schema (version, note) VALUES (99, 'future')")
    fresh = open_history(pg_location)
    with pytest.raises(HistoryError, match="newer version of dispatcher .*schema 99"):
        fresh.record(SHOP, PLAN, by="Supervisor A", reason="other")
    assert main(["history", "show", "1", "--history", pg_location]) == EXIT_STORE
    assert "schema 99" in capsys.readouterr().err
    with raw(pg_location) as conn:
        assert conn.execute("SELECT count(*) FROM decisions").fetchone()[0] == 2
    assert store.last_backup is None


def test_statement_timeout_is_reported_and_nothing_is_written(pg_location):
    store = record_two(pg_location)
    blocker = raw(pg_location)
    try:
        blocker.execute("BEGIN")
        blocker.execute("LOCK TABLE decisions IN ACCESS EXCLUSIVE MODE")
        slow = open_history(pg_location, timeout=1)
        with pytest.raises(HistoryError, match="did not finish within 1 s"):
            slow.record(SHOP, PLAN, by="Supervisor A", reason="other")
    finally:
        blocker.execute("ROLLBACK")
        blocker.close()
    assert store.count() == 2 and store.check() == ["ok"]


def test_stopped_server_then_back(pg_server, pg_location, capsys):
    store = record_two(pg_location)
    pg_server.stop()
    try:
        with pytest.raises(HistoryError, match="cannot be reached"):
            open_history(pg_location, timeout=2).record(SHOP, PLAN, by="Supervisor A",
                                                        reason="other")
        assert main(["history", "show", "1", "--history", pg_location]) == EXIT_STORE
        assert "cannot be reached" in capsys.readouterr().err
    finally:
        pg_server.start()
    assert store.count() == 2
    assert store.record(SHOP, PLAN, by="Supervisor A", reason="other") == 3


def test_missing_driver_says_how_to_install_it(pg_server):
    code = ("import sys; sys.modules['psycopg'] = None\n"
            "from dispatcher.cli import main\n"
            f"sys.exit(main(['history', 'list', '--history', {pg_server.uri()!r}]))")
    done = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True,
                          env=dict(os.environ, PYTHONPATH=str(ROOT)))
    assert done.returncode == EXIT_STORE
    assert "pip install 'dispatcher[postgres]'" in done.stderr
    assert "Traceback" not in done.stderr


def test_schema_steps_are_ordered_and_recorded(pg_location):
    record_two(pg_location)
    with raw(pg_location) as conn:
        versions = [r[0] for r in conn.execute("SELECT version FROM dispatcher_schema "
                                               "ORDER BY version")]
    assert versions == [m.version for m in PG_MIGRATIONS] == list(range(1, len(versions) + 1))


# ---------------------------------------------------------------- command line and copy

def test_command_line_on_a_server(pg_location, samples, capsys, tmp_path):
    grid = str(samples / "sheet_metal_grid.csv")
    for _ in range(2):
        assert main(["solve", grid, "--record", "--by", "Supervisor A", "--reason", "other",
                     "--history", pg_location]) == 0
    capsys.readouterr()
    assert main(["history", "list", "--json", "--history", pg_location]) == 0
    listed = json.loads(capsys.readouterr().out)
    assert [(d["id"], d["replaces"]) for d in listed] == [(1, None), (2, 1)]
    assert main(["history", "show", "2", "--json", "--history", pg_location]) == 0
    shown = json.loads(capsys.readouterr().out)
    assert shown["plan"]["status"] == "optimal" and shown["station"]
    assert main(["history", "export", str(tmp_path / "o.csv"), "--history", pg_location]) == 0
    assert main(["history", "restore", "1", "--by", "Supervisor B",
                 "--history", pg_location]) == 0
    # Based on decision 2, but decision 3 (the restore) replaced it meanwhile: exit 5.
    code = main(["solve", grid, "--record", "--by", "Supervisor A", "--reason", "other",
                 "--based-on", "2", "--history", pg_location])
    err = capsys.readouterr().err
    assert code == EXIT_CONFLICT and "Decision #3, by Supervisor B" in err
    assert "replaced the plan you started from (#2)" in err
    assert open_history(pg_location).count() == 3


def test_copy_between_backends_both_ways(pg_location, tmp_path, capsys):
    source = HistoryStore(tmp_path / "a.sqlite", tz=UTC, station="station A")
    for i in range(5):
        source.record(SHOP, dict(PLAN, total=440 + i), by="Supervisor A", reason="other",
                      note=f"n{i}")
    assert main(["history", "copy", "--from", str(source.path), "--to", pg_location]) == 0
    assert "Copied 5 decisions" in capsys.readouterr().out
    target = open_history(pg_location)
    assert [d.to_json() for d in target.list()] == [d.to_json() for d in source.list()]
    assert main(["history", "copy", "--from", str(source.path), "--to", pg_location]) == \
        EXIT_BAD_INPUT
    assert "already holds 5 decisions" in capsys.readouterr().err
    assert target.count() == 5
    target.record(SHOP, PLAN, by="Supervisor B", reason="repair")
    back = tmp_path / "back.sqlite"
    assert main(["history", "copy", "--from", pg_location, "--to", str(back)]) == 0
    conn = sqlite3.connect(back)  # read back with plain sqlite3
    assert conn.execute("SELECT count(*), max(id) FROM decisions").fetchone() == (6, 6)
    conn.close()
    assert HistoryStore(back).get(6).by == "Supervisor B"
    assert [d.to_json() for d in HistoryStore(back).list()] == [
        d.to_json() for d in target.list()]
    more = HistoryStore(tmp_path / "more.sqlite")
    more.record(SHOP, PLAN, by="Supervisor C", reason="other")
    assert main(["history", "copy", "--from", str(more.path), "--to", str(back),
                 "--append"]) == EXIT_BAD_INPUT  # its #1 cannot follow #6
    assert HistoryStore(back).count() == 6
    assert main(["history", "copy", "--from", str(tmp_path / "none.sqlite"),
                 "--to", str(back)]) == EXIT_STORE


def test_app_settings_location_is_a_server(pg_location):
    from dispatcher.history import is_postgres_location

    assert is_postgres_location(pg_location) and is_postgres_location("service=plant")
    assert not is_postgres_location("/data/history.sqlite")
    assert not is_postgres_location("postgres-notes.sqlite")


def test_settings_accept_a_server_and_refuse_an_unreachable_one(pg_location, tmp_path):
    from dispatcher.ui.settings_dialog import usable_history

    store = usable_history(pg_location)
    assert isinstance(store, PostgresStore) and store.location == pg_location
    with pytest.raises(HistoryError, match="cannot be reached"):
        usable_history(f"postgresql://postgres@/dispatcher_test?host={tmp_path}")
