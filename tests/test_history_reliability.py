"""Crash safety and failure handling of the decision history, each with a real file.

What is checked against: SQLite's own ``PRAGMA integrity_check``; the bytes (SHA-256) of
the file before and after a refused operation; the content each child process says it
recorded (regenerated from its token by ``make_decision``).
"""

from __future__ import annotations

import hashlib
import os
import random
import signal
import sqlite3
import subprocess
import sys
import threading
import time
from pathlib import Path

import pytest

from dispatcher.history import HistoryError, HistoryStore
from dispatcher.history.schema import SCHEMA_VERSION
from test_history_child import SHOP_NAME, make_decision

CHILD = Path(__file__).with_name("test_history_child.py")
ROOT = Path(__file__).resolve().parent.parent


def sha(path: Path) -> str:
    return hashlib.sha256(path.read_bytes()).hexdigest()


def child(path: Path, run: str, *extra: str) -> subprocess.Popen:
    env = dict(os.environ, PYTHONPATH=str(ROOT))
    return subprocess.Popen([sys.executable, str(CHILD), str(path), run, *extra],
                            stdin=subprocess.PIPE, stdout=subprocess.PIPE,
                            stderr=subprocess.PIPE, text=True, env=env)


def acknowledged(output: str) -> dict[int, str]:
    """``{id: token}`` from complete ``<id> <token>`` lines (a cut-off last line is ignored)."""
    acks = {}
    for line in output.splitlines(keepends=True):
        if not line.endswith("\n"):
            continue
        parts = line.split()
        if len(parts) == 2 and parts[0].isdigit():
            acks[int(parts[0])] = parts[1]
    return acks


def assert_intact(store: HistoryStore, acks: dict[int, str]) -> None:
    assert store.check() == ["ok"]  # SQLite's own full integrity check
    for number, token in acks.items():
        decision = store.get(number)  # also verifies the stored checksum
        shop, plan = make_decision(token)
        assert decision.note == token
        assert decision.shop_document == shop
        assert decision.plan == plan
    rows_per_decision: dict[int, int] = {}
    for row in store.rows():
        rows_per_decision[row["decision"]] = rows_per_decision.get(row["decision"], 0) + 1
    for summary in store.list():  # decisions recorded but not acknowledged are whole too
        plan = store.get(summary.id).plan
        expected_rows = (len(plan["assignments"]) + len(plan["waiting_jobs"])
                         + len(plan["idle_machines"]))
        assert rows_per_decision.get(summary.id, 0) == expected_rows, summary.id


def sample_plan(total: float = 3) -> dict:
    return {"status": "optimal", "objective": "total", "total": total,
            "assignments": [{"job": "J1", "machine": "M1", "cost": total}],
            "waiting_jobs": [], "idle_machines": [], "certificate": {"verified": True}}


@pytest.mark.slow
@pytest.mark.skipif(not hasattr(signal, "SIGKILL"), reason="needs SIGKILL (POSIX)")
def test_sigkill_at_random_moments_keeps_every_returned_decision(tmp_path):
    path = tmp_path / "history.sqlite"
    rng = random.Random(20261202)
    acks: dict[int, str] = {}
    mid_loop_kills = 0
    run = 0
    # At least 100 kills; on a loaded machine a child records fewer decisions before its
    # kill, so keep killing (up to 400 runs) until 100 decisions were acknowledged.
    while run < 100 or (len(acks) < 100 and run < 400):
        proc = child(path, f"r{run}")
        if run % 10 == 3:
            # Some kills land while the child starts up or opens (or creates) the file.
            time.sleep(rng.uniform(0.0, 0.08))
        else:
            assert proc.stdout.readline() == "ready\n", proc.stderr.read()
            time.sleep(rng.uniform(0.0, 0.12))
            mid_loop_kills += 1
        proc.send_signal(signal.SIGKILL)
        out, _ = proc.communicate()
        assert proc.returncode == -signal.SIGKILL
        acks.update(acknowledged(out))
        run += 1
    assert mid_loop_kills == run - (run + 6) // 10  # every tenth run, from the fourth, is early
    print(f"{len(acks)} decisions acknowledged over {run} kills")
    assert len(acks) >= 100, "too few decisions recorded for the test to mean anything"
    store = HistoryStore(path)
    assert_intact(store, acks)
    # The file is still fully usable afterwards.
    shop, plan = make_decision("after")
    number = store.record(shop, plan, by="after", reason="other")
    assert store.get(number).plan == plan


def test_two_processes_recording_at_once_lose_nothing(tmp_path):
    path = tmp_path / "history.sqlite"
    HistoryStore(path).record({"name": SHOP_NAME}, sample_plan(), by="setup", reason="other")
    procs = [child(path, name, "40", "--wait-go") for name in ("a", "b")]
    for p in procs:
        assert p.stdout.readline() == "ready\n", p.stderr.read()
    for p in procs:  # start both loops together
        p.stdin.write("go\n")
        p.stdin.flush()
    outputs = [p.communicate(timeout=120) for p in procs]
    for p, (_, err) in zip(procs, outputs):
        assert p.returncode == 0, err
    acks = {}
    for out, _ in outputs:
        acks.update(acknowledged(out))
    assert len(acks) == 80
    store = HistoryStore(path)
    assert store.count() == 81
    assert_intact(store, acks)
    writers = [acks[i][0] for i in sorted(acks)]
    assert any(x != y for x, y in zip(writers, writers[1:])), "the two writers never overlapped"
    # Each decision replaced the one committed just before it: a single unbroken chain.
    chain = store.list()
    assert [d.replaces for d in chain] == [None] + [d.id for d in chain[:-1]]


def _hold_write_lock(path: Path) -> sqlite3.Connection:
    conn = sqlite3.connect(path, isolation_level=None, check_same_thread=False)
    conn.execute("BEGIN IMMEDIATE")
    return conn


def test_busy_file_is_retried_for_a_bounded_time_then_reported(tmp_path):
    path = tmp_path / "history.sqlite"
    store = HistoryStore(path, timeout=0.6)
    store.record({"name": "s"}, sample_plan(), by="Supervisor A", reason="shift start")
    holder = _hold_write_lock(path)
    try:
        start = time.monotonic()
        with pytest.raises(HistoryError, match=r"stayed busy .* for 0\.6 s; nothing was changed"):
            store.record({"name": "s"}, sample_plan(5), by="Supervisor A", reason="repair")
        elapsed = time.monotonic() - start
        assert 0.6 <= elapsed < 5.0
        assert [d.total for d in store.list()] == [3]  # readers are not blocked (WAL)
    finally:
        holder.execute("ROLLBACK")
        holder.close()
    assert store.count() == 1


def test_busy_file_released_in_time_is_written(tmp_path):
    path = tmp_path / "history.sqlite"
    store = HistoryStore(path, timeout=10)
    store.record({"name": "s"}, sample_plan(), by="Supervisor A", reason="shift start")
    holder = _hold_write_lock(path)

    def release() -> None:
        time.sleep(0.4)
        holder.execute("COMMIT")

    thread = threading.Thread(target=release)
    start = time.monotonic()
    thread.start()
    try:
        number = store.record({"name": "s"}, sample_plan(5), by="Supervisor A", reason="repair")
    finally:
        thread.join()
        holder.close()
    assert time.monotonic() - start >= 0.35
    assert store.get(number).total == 5
    assert store.count() == 2


def _history_with_decisions(path: Path, n: int = 20) -> None:
    store = HistoryStore(path)
    for i in range(n):
        shop, plan = make_decision(f"base-{i}")
        store.record(shop, plan, by="Supervisor A", reason="other")


def _foreign_sqlite(path: Path) -> None:
    conn = sqlite3.connect(path)
    conn.execute("CREATE TABLE notes (x TEXT)")
    conn.execute("INSERT INTO notes VALUES ('someone else''s data')")
    conn.commit()
    conn.close()


def _newer_schema(path: Path) -> None:
    _history_with_decisions(path, 2)
    conn = sqlite3.connect(path)
    conn.execute(f"PRAGMA user_version = {SCHEMA_VERSION + 1}")
    conn.commit()
    conn.close()


def _cut(fraction: float):
    def make(path: Path) -> None:
        _history_with_decisions(path, 30)
        data = path.read_bytes()
        path.write_bytes(data[:int(len(data) * fraction)])
    return make


def _garbage(path: Path) -> None:
    path.write_bytes(random.Random(5).randbytes(20000))


def _scribbled(path: Path) -> None:
    """A real history whose pages in the middle were overwritten with noise."""
    _history_with_decisions(path, 30)
    data = bytearray(path.read_bytes())
    data[8192:16384] = random.Random(7).randbytes(8192)
    path.write_bytes(bytes(data))


BAD_FILES = {
    "empty": (lambda p: p.write_bytes(b""), "is empty"),
    "garbage": (_garbage, "not an SQLite database"),
    "text": (lambda p: p.write_text("job,machine\nA,B\n"), "not an SQLite database"),
    "truncated-half": (_cut(0.5), "truncated"),
    "truncated-header": (_cut(0.01), "truncated|not an SQLite"),
    "scribbled": (_scribbled, "damaged"),
    "foreign-sqlite": (_foreign_sqlite, "not a dispatcher history"),
    "newer-schema": (_newer_schema, "newer version"),
}


@pytest.mark.parametrize("kind", list(BAD_FILES))
def test_bad_file_is_reported_and_left_untouched(tmp_path, kind):
    path = tmp_path / "history.sqlite"
    make, message = BAD_FILES[kind]
    make(path)
    before = sha(path)
    for action in (
        lambda s: s.record({"name": "s"}, sample_plan(), by="Supervisor A", reason="other"),
        lambda s: s.list(),
        lambda s: s.get(1),
        lambda s: s.export_csv(tmp_path / "out.csv"),
    ):
        with pytest.raises(HistoryError, match=message) as info:
            action(HistoryStore(path))
        assert str(path) in str(info.value)
        assert sha(path) == before
    assert not (tmp_path / "out.csv").exists()


def test_read_only_file_refuses_to_record_and_still_reads(tmp_path):
    path = tmp_path / "history.sqlite"
    _history_with_decisions(path, 3)
    before = sha(path)
    path.chmod(0o444)
    try:
        store = HistoryStore(path)
        with pytest.raises(HistoryError, match="read-only; nothing was recorded"):
            store.record({"name": "s"}, sample_plan(), by="Supervisor A", reason="other")
        with pytest.raises(HistoryError, match="read-only"):
            store.restore(1, by="Supervisor A")
        assert [d.id for d in store.list()] == [1, 2, 3]
        assert store.get(2).note == ""
    finally:
        path.chmod(0o644)
    assert sha(path) == before


def test_full_disk_is_reported_and_nothing_is_written(tmp_path):
    path = tmp_path / "history.sqlite"
    _history_with_decisions(path, 5)
    before = sha(path)
    conn = sqlite3.connect(path)
    pages = conn.execute("PRAGMA page_count").fetchone()[0]
    conn.close()
    # A size cap equal to the current size: the next decision needs pages it cannot get,
    # exactly as when the disk is full (SQLITE_FULL).
    full = HistoryStore(path, max_pages=pages)
    big_shop = {"name": SHOP_NAME, "padding": "y" * 200_000}
    with pytest.raises(HistoryError, match="no room left to write"):
        full.record(big_shop, sample_plan(), by="Supervisor A", reason="breakdown")
    assert sha(path) == before
    store = HistoryStore(path)
    assert store.count() == 5
    assert store.check() == ["ok"]
    number = store.record(big_shop, sample_plan(), by="Supervisor A", reason="breakdown")
    assert store.get(number).shop_document == big_shop
