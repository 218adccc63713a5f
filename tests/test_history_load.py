"""Several processes recording into one shop's history at once, on both stores, and the
PostgreSQL server killed with SIGKILL in the middle of writes.

Sizes: the suite runs 8 processes x 25 decisions on PostgreSQL and 4 x 25 on SQLite to
keep CI short; ``DISPATCHER_LOAD_FULL=1`` runs the full 8 x 200 and 4 x 200 (about a
minute more here). What is checked against: what each child printed after each record
call returned (its decisions are regenerated from their tokens by ``make_decision``), and
the server's own recovery after the kill.
"""

from __future__ import annotations

import os
import time

import pytest
from test_history_child import SHOP_NAME, make_decision
from test_history_reliability import acknowledged, child

from dispatcher.history import open_history

PER_PROCESS = 200 if os.environ.get("DISPATCHER_LOAD_FULL") else 25


def _load(location: str, processes: int) -> None:
    store = open_history(location)
    store.init(make_folder=False)
    procs = [child(location, f"p{i}", str(PER_PROCESS), "--wait-go")
             for i in range(processes)]
    for p in procs:
        assert p.stdout.readline() == "ready\n", p.stderr.read()
    for p in procs:  # start every loop together
        p.stdin.write("go\n")
        p.stdin.flush()
    outputs = [p.communicate(timeout=600) for p in procs]
    for p, (_, err) in zip(procs, outputs):
        assert p.returncode == 0, err
    acks: dict[int, str] = {}
    for out, _ in outputs:
        got = acknowledged(out)
        assert not set(got) & set(acks), "two processes were given the same number"
        acks.update(got)
    total = processes * PER_PROCESS
    assert len(acks) == total and len(set(acks.values())) == total  # none lost, no dupes
    chain = store.list()  # every seal verified
    assert [d.id for d in chain] == list(range(1, total + 1))
    assert [d.replaces for d in chain] == [None] + [d.id for d in chain[:-1]]
    for number, token in list(acks.items())[:: max(1, total // 50)]:
        decision = store.get(number)
        assert decision.note == token
        assert (decision.shop_document, decision.plan) == make_decision(token)
    writers = [acks[i].split("-")[0] for i in sorted(acks)]
    assert len({w for w in writers[: total // 2]}) > 1, "the writers never overlapped"


@pytest.mark.slow
def test_eight_processes_on_postgresql(pg_location):
    _load(pg_location, 8)


@pytest.mark.slow
def test_four_processes_on_sqlite(tmp_path):
    _load(str(tmp_path / "history.sqlite"), 4)


@pytest.mark.slow
def test_server_killed_during_fifty_writes_keeps_every_returned_decision(pg_server,
                                                                          pg_location):
    open_history(pg_location).init()
    proc = child(pg_location, "k", "50", "--keep-going")
    assert proc.stdout.readline() == "ready\n", proc.stderr.read()
    seen = []
    while len(seen) < 15:  # let some decisions land, then kill the server mid-loop
        line = proc.stdout.readline()
        assert line, proc.stderr.read()
        seen.append(line)
    pg_server.kill()
    time.sleep(0.5)
    pg_server.start()
    out, err = proc.communicate(timeout=300)
    assert proc.returncode == 0, err
    lines = seen + out.splitlines(keepends=True)
    acks = acknowledged("".join(lines))
    assert len(acks) == 50
    assert any(line.startswith("error") for line in lines), "the kill hit no write"
    store = open_history(pg_location)
    listed = store.list()  # every seal verified after the server's crash recovery
    # A call cut off after the server committed may have been retried: at most one extra.
    assert 50 <= len(listed) <= 50 + sum(line.startswith("error") for line in lines)
    for number, token in acks.items():
        d = store.get(number)
        assert d.note == token and (d.shop_document, d.plan) == make_decision(token)
    assert {d.note for d in listed} == set(acks.values())
    assert store.check() == ["ok"]
    assert [d.shop for d in listed] == [SHOP_NAME] * len(listed)
