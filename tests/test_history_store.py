"""The decision history's behaviour: recording, searching, comparing, restoring, exporting,
migrations, locations and shifts.

Outside references named beside the checks: SQLite itself (a raw sqlite3 connection to the
same file), the csv module reading the export, set arithmetic on the plans for the diff,
the XDG Base Directory Specification for locations.
"""

from __future__ import annotations

import csv
import json
import sqlite3
from datetime import date, datetime, time, timedelta, timezone
from pathlib import Path

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from dispatcher.history import (
    LATEST,
    REASON_KINDS,
    DecisionConflict,
    DecisionNotFound,
    HistoryError,
    HistoryInputError,
    HistoryStore,
    ShiftStart,
    check_plan,
    data_folder,
    default_history_path,
    diff_plans,
    open_history,
    parse_reason_kind,
    shift_of,
)
from dispatcher.history.schema import APPLICATION_ID, MIGRATIONS, Migration

UTC = timezone.utc
T0 = datetime(2026, 3, 14, 5, 0, tzinfo=UTC)


def plan(placed: dict[str, str], waiting=(), idle=(), total=None, objective="total",
         verified=True) -> dict:
    assignments = [{"job": j, "machine": m, "cost": 10 + i}
                   for i, (j, m) in enumerate(placed.items())]
    return {"status": "optimal", "objective": objective,
            "total": sum(a["cost"] for a in assignments) if total is None else total,
            "assignments": assignments, "waiting_jobs": list(waiting),
            "idle_machines": list(idle), "certificate": {"verified": verified}}


@pytest.fixture(params=["sqlite", "postgresql"])
def store(request, tmp_path):
    """The same suite against both stores: an SQLite file, and a fresh schema on a real
    PostgreSQL server started for the session (tests/pg_server.py)."""
    if request.param == "sqlite":
        return HistoryStore(tmp_path / "history.sqlite", tz=UTC)
    return open_history(request.getfixturevalue("pg_location"), tz=UTC)


@pytest.fixture
def sqlite_store(tmp_path) -> HistoryStore:
    return HistoryStore(tmp_path / "history.sqlite", tz=UTC)


def test_nothing_is_created_by_reading(tmp_path):
    store = HistoryStore(tmp_path / "sub" / "history.sqlite")
    assert store.list() == [] and store.count() == 0 and store.latest() is None
    assert not (tmp_path / "sub").exists()
    with pytest.raises(HistoryError, match="the history file does not exist, so no decision #1"):
        store.get(1)


def test_record_and_read_back(store, tmp_path):
    shop = {"format": "dispatcher-shop", "name": "Press shop", "jobs": ["WO-1"]}
    p = plan({"WO-1": "Press 1"}, waiting=["WO-2"], idle=["Press 2"])
    n = store.record(json.dumps(shop), p, by="  Supervisor A  ", reason="Shift Start", note="monday",
                     time=T0)
    d = store.get(n)
    assert (d.id, d.by, d.reason, d.note, d.shop) == (1, "Supervisor A", "shift-start", "monday",
                                                      "Press shop")
    assert d.time == T0 and d.shift_date == date(2026, 3, 13) and d.shift == "night"
    assert d.shop_document == shop and d.plan == p
    assert (d.total, d.objective, d.certificate, d.replaces) == (10, "total", "verified", None)
    assert [(r["state"], r["machine"], r["job"], r["value"]) for r in store.rows()] == [
        ("assigned", "Press 1", "WO-1", 10), ("waiting", None, "WO-2", None),
        ("idle", "Press 2", None, None)]


def test_the_sqlite_file_seen_with_plain_sqlite3(sqlite_store):
    store = sqlite_store
    p = plan({"WO-1": "Press 1"}, waiting=["WO-2"], idle=["Press 2"])
    store.record({"name": "Press shop"}, p, by="Supervisor A", reason="other", time=T0)
    # Independent look at the file with plain sqlite3: WAL, foreign keys declared, our id.
    conn = sqlite3.connect(store.path)
    assert conn.execute("PRAGMA journal_mode").fetchone()[0] == "wal"
    assert conn.execute("PRAGMA application_id").fetchone()[0] == APPLICATION_ID
    assert conn.execute("PRAGMA foreign_key_check").fetchall() == []
    rows = conn.execute("SELECT state, machine, job, value FROM decision_rows "
                        "WHERE decision_id = 1 ORDER BY rowid").fetchall()
    conn.close()
    assert rows == [("assigned", "Press 1", "WO-1", 10.0), ("waiting", None, "WO-2", None),
                    ("idle", "Press 2", None, None)]


def test_objects_with_to_json_are_accepted(store):
    class Doc:
        def to_json(self):
            return {"name": "from object"}

    class PlanLike:
        def to_json(self):
            return plan({"A": "M"})

    n = store.record(Doc(), PlanLike(), by="Supervisor A", reason="other")
    assert store.get(n).shop == "from object"


@pytest.mark.parametrize("bad, message", [
    ({"objective": "total"}, "missing key 'status'"),
    (dict(plan({"A": "M"}), total="12"), "total: expected a finite number"),
    (dict(plan({"A": "M"}), assignments=[{"job": "A", "cost": 1}]),
     r"assignments\[0\].machine: expected a non-empty name"),
    (dict(plan({"A": "M", "B": "M2"}), waiting_jobs=["B"]),
     r"waiting_jobs\[0\]: 'B' is also placed"),
    (dict(plan({"A": "M"}), assignments=[{"job": "A", "machine": "M", "cost": 1},
                                         {"job": "A", "machine": "N", "cost": 2}]),
     r"assignments\[1\].job: 'A' is placed twice"),
    (dict(plan({"A": "M"}), running=[{"job": "R", "cost": 1}]),
     r"running\[0\].machine: expected a non-empty name"),
    ("{not json", "plan: not JSON"),
    ([1, 2], "expected a JSON object"),
])
def test_bad_plans_are_refused_before_the_file_is_touched(store, bad, message):
    with pytest.raises(HistoryInputError, match=message):
        store.record({}, bad, by="Supervisor A", reason="other")
    assert not store.exists()


def test_bad_supervisor_and_reason(store):
    with pytest.raises(HistoryInputError, match="supervisor's name is required"):
        store.record({}, plan({"A": "M"}), by=" ", reason="other")
    with pytest.raises(HistoryInputError, match="unknown kind 'coffee'; use one of: shift-start"):
        store.record({}, plan({"A": "M"}), by="Supervisor A", reason="coffee")
    assert {parse_reason_kind(label) for label in REASON_KINDS.values()} == set(REASON_KINDS)


def test_history_is_append_only_even_through_raw_sql(sqlite_store):
    store = sqlite_store
    store.record({}, plan({"A": "M"}), by="Supervisor A", reason="other")
    conn = sqlite3.connect(store.path)
    for sql in ("UPDATE decisions SET supervisor = 'Eve'", "DELETE FROM decisions",
                "UPDATE decision_rows SET job = 'X'", "DELETE FROM decision_rows"):
        with pytest.raises(sqlite3.DatabaseError, match="append-only"):
            conn.execute(sql)
    conn.close()
    assert store.get(1).by == "Supervisor A"


def test_replaces_links_decisions_of_the_same_shop_with_their_diff(store):
    a = store.record({"name": "north"}, plan({"J1": "M1", "J2": "M2"}), by="A", reason="other")
    b = store.record({"name": "south"}, plan({"K1": "N1"}), by="A", reason="other")
    c = store.record({"name": "north"}, plan({"J1": "M2"}, waiting=["J2"], idle=["M1"]),
                     by="B", reason="breakdown", note="M1 hydraulic leak")
    d = store.record({"name": "north"}, plan({"J1": "M1"}), by="B", reason="other",
                     replaces=None)
    assert [store.get(x).replaces for x in (a, b, c, d)] == [None, None, a, None]
    diff = store.get(c).diff_from_replaced
    assert (diff.from_id, diff.to_id) == (a, c)
    assert diff.lines() == ["moved: J1 from M1 to M2", "now waiting: J2",
                            "machine now idle: M1", "total: 21 -> 10 (-11)"]
    e = store.record({"name": "north"}, plan({"J1": "M1"}), by="B", reason="other",
                     replaces=b)
    assert store.get(e).replaces == b
    with pytest.raises(DecisionNotFound, match="no decision #99"):
        store.record({"name": "north"}, plan({"J1": "M1"}), by="B", reason="other",
                     replaces=99)
    assert LATEST == "latest"


def test_restore_records_a_new_decision_and_changes_nothing_old(store):
    first = store.record({"name": "s"}, plan({"J1": "M1"}), by="Supervisor A", reason="shift start")
    second = store.record({"name": "s"}, plan({"J1": "M2"}), by="Supervisor B", reason="breakdown")
    before = [store.get(i) for i in (first, second)]
    third = store.restore(first, by="Supervisor C", note="M1 repaired")
    d = store.get(third)
    assert (d.reason, d.note, d.by, d.restored_from, d.replaces) == (
        "restored", "restored from #1: M1 repaired", "Supervisor C", first, second)
    assert d.plan == store.get(first).plan
    assert d.diff_from_replaced.lines()[0] == "moved: J1 from M2 to M1"
    assert [store.get(i) for i in (first, second)] == before
    with pytest.raises(DecisionNotFound):
        store.restore(42, by="Supervisor C")


def test_queries_match_a_plain_python_filter(store):
    people = ["Supervisor A", "Supervisor B", "Supervisor C"]
    reasons = ["shift start", "breakdown", "repair", "rush job"]
    made = []
    for i in range(24):
        moment = T0 + timedelta(hours=3 * i)
        machine = f"M{i % 4}"
        p = plan({f"J{i}": machine}, waiting=[f"W{i % 3}"], idle=[f"M{(i + 1) % 4}"])
        n = store.record({"name": "s"}, p, by=people[i % 3], reason=reasons[i % 4], time=moment)
        made.append((n, moment, machine, people[i % 3], parse_reason_kind(reasons[i % 4]), p))

    def ids(**filters):
        return [d.id for d in store.list(**filters)]

    day = date(2026, 3, 15)
    assert ids(date_from=day, date_to=day) == [
        n for n, t, *_ in made if shift_of(t, tz=UTC)[0] == day]
    assert ids(time_from=T0 + timedelta(hours=6), time_to=T0 + timedelta(hours=12)) == [
        n for n, t, *_ in made if T0 + timedelta(hours=6) <= t < T0 + timedelta(hours=12)]
    assert ids(shift="night") == [n for n, t, *_ in made if shift_of(t, tz=UTC)[1] == "night"]
    assert ids(machine="M2") == [n for n, _, _, _, _, p in made
                                 if "M2" in [a["machine"] for a in p["assignments"]]
                                 + p["idle_machines"]]
    assert ids(job="W1") == [n for n, *_, p in made if "W1" in p["waiting_jobs"]]
    assert ids(by="supervisor b") == [n for n, _, _, who, *_ in made if who == "Supervisor B"]
    assert ids(reason="Rush Job", by="Supervisor C") == [n for n, _, _, who, why, _ in made
                                              if why == "rush-job" and who == "Supervisor C"]
    assert ids(limit=3, newest_first=True) == [24, 23, 22]
    assert store.latest().id == 24


def test_diff_between_any_two_decisions(store):
    a = store.record({"name": "s"}, plan({"J1": "M1", "J2": "M2", "J3": "M3"}, waiting=["J4"]),
                     by="A", reason="other")
    b = store.record({"name": "s"}, plan({"J4": "M1", "J2": "M3"}, waiting=["J3"],
                                         idle=["M4"], total=15), by="A", reason="other")
    diff = store.diff(a, b)
    assert diff.to_json() == {
        "from": a, "to": b, "moved": [{"job": "J2", "from": "M2", "to": "M3"}],
        "newly_placed": [{"job": "J4", "machine": "M1"}], "now_waiting": ["J3"],
        "jobs_gone": ["J1"], "machines_now_idle": ["M4"], "machines_back_in_use": [],
        "machines_gone": ["M2"], "total_before": 33, "total_after": 15,
        "total_change": -18, "objective_changed": False}
    assert store.diff(a, a).is_empty


def test_running_jobs_and_multi_slot_machines(store):
    before = plan({"J1": "M1", "J2": "M2"}, idle=["M3"])
    after = plan({"J2": "M2", "J3": "M3"}, waiting=["J4"])
    after["assignments"].append({"job": "J5", "machine": "M3", "cost": 1})  # two slots
    after["running"] = [{"job": "J1", "machine": "M1", "since": "2026-03-14T06:05", "cost": 7}]
    n = store.record({"name": "s"}, before, by="Supervisor A", reason="other")
    m = store.record({"name": "s"}, after, by="Supervisor A", reason="rush job")
    diff = store.diff(n, m)
    assert diff.jobs_gone == () and diff.machines_gone == ()
    assert diff.newly_placed == (("J3", "M3"), ("J5", "M3"))
    assert diff.machines_back_in_use == ("M3",) and diff.now_waiting == ("J4",)
    assert [d.id for d in store.list(job="J1")] == [n, m]  # the running row is searchable
    assert [d.id for d in store.list(machine="M3")] == [n, m]


NAMES = st.sampled_from([f"J{i}" for i in range(6)])
MACHINES = [f"M{i}" for i in range(5)]


@st.composite
def plans(draw):
    jobs = draw(st.lists(NAMES, unique=True, max_size=6))
    machines = draw(st.permutations(MACHINES))
    k = draw(st.integers(0, min(len(jobs), len(machines))))
    placed = dict(zip(jobs[:k], machines[:k]))
    idle = [m for m in machines[k:] if draw(st.booleans())]
    return plan(placed, waiting=jobs[k:], idle=idle)


@settings(max_examples=80, deadline=None)
@given(plans(), plans())
def test_diff_turns_the_earlier_plan_into_the_later_one(before, after):
    """Set arithmetic on the two plans: applying the diff to `before` gives `after`."""
    d = diff_plans(check_plan(before), check_plan(after))
    place = {a["job"]: a["machine"] for a in before["assignments"]}
    for job in d.jobs_gone + d.now_waiting:
        place.pop(job, None)
    place.update({m.job: m.to_machine for m in d.moved})
    place.update(dict(d.newly_placed))
    assert place == {a["job"]: a["machine"] for a in after["assignments"]}
    waiting = (set(before["waiting_jobs"]) - set(d.jobs_gone)
               - {j for j, _ in d.newly_placed}) | set(d.now_waiting)
    assert waiting == set(after["waiting_jobs"])
    idle = (set(before["idle_machines"]) - set(d.machines_gone)
            - set(d.machines_back_in_use)) | set(d.machines_now_idle)
    assert idle == set(after["idle_machines"])
    assert d.total_change == after["total"] - before["total"]

    def content(p):
        return ({a["job"]: a["machine"] for a in p["assignments"]}, set(p["waiting_jobs"]),
                set(p["idle_machines"]), p["total"])
    assert d.is_empty == (content(before) == content(after))


def test_export_csv_read_back_with_the_csv_module(store, tmp_path):
    store.record({"name": "s"}, plan({"=HYPERLINK(1)": "M1"}, waiting=["J2"], idle=["M2"]),
                 by="Supervisor A", reason="rush job", note="+urgent", time=T0)
    store.record({"name": "s"}, plan({"J2": "M1"}), by="Supervisor B", reason="repair", time=T0)
    target = tmp_path / "out.csv"
    assert store.export_csv(target) == 4
    with target.open(newline="", encoding="utf-8") as f:
        rows = list(csv.DictReader(f))
    assert [(r["decision"], r["state"], r["machine"], r["job"], r["value"]) for r in rows] == [
        ("1", "assigned", "M1", "'=HYPERLINK(1)", "10.0"), ("1", "waiting", "", "J2", ""),
        ("1", "idle", "M2", "", ""), ("2", "assigned", "M1", "J2", "10.0")]
    assert rows[0]["note"] == "'+urgent" and rows[0]["time"] == "2026-03-14T05:00:00.000000Z"
    assert rows[3]["replaces"] == "1" and rows[0]["replaces"] == ""
    assert store.export_csv(target, by="Supervisor B") == 1


def _add_column(conn: sqlite3.Connection) -> None:
    conn.execute("ALTER TABLE decisions ADD COLUMN later_column TEXT")


def test_older_file_is_backed_up_then_migrated(tmp_path):
    path = tmp_path / "history.sqlite"
    HistoryStore(path).record({"name": "s"}, plan({"A": "M"}), by="Supervisor A", reason="other")
    newer = MIGRATIONS + (Migration(MIGRATIONS[-1].version + 1, "station", _add_column),)
    store = HistoryStore(path, migrations=newer)
    assert store.get(1).by == "Supervisor A"
    backup = store.last_backup
    current = MIGRATIONS[-1].version
    assert backup is not None and backup.name.startswith(f"history.sqlite.backup-v{current}-")
    old = sqlite3.connect(backup)
    assert old.execute("PRAGMA user_version").fetchone()[0] == current
    assert old.execute("SELECT supervisor FROM decisions").fetchall() == [("Supervisor A",)]
    old.close()
    conn = sqlite3.connect(path)
    assert conn.execute("PRAGMA user_version").fetchone()[0] == newer[-1].version
    assert "later_column" in [r[1] for r in conn.execute("PRAGMA table_info(decisions)")]
    conn.close()
    # A second open finds nothing to do and writes no second backup.
    again = HistoryStore(path, migrations=newer)
    again.list()
    assert again.last_backup is None


def test_failed_migration_leaves_the_file_at_its_old_version(tmp_path):
    path = tmp_path / "history.sqlite"
    HistoryStore(path).record({"name": "s"}, plan({"A": "M"}), by="Supervisor A", reason="other")

    def broken(conn: sqlite3.Connection) -> None:
        _add_column(conn)
        conn.execute("SELECT no_such_column FROM decisions")

    newer = MIGRATIONS + (Migration(MIGRATIONS[-1].version + 1, "broken", broken),)
    with pytest.raises(HistoryError, match="no_such_column"):
        HistoryStore(path, migrations=newer).list()
    store = HistoryStore(path)
    assert store.get(1).by == "Supervisor A"
    conn = sqlite3.connect(path)
    assert conn.execute("PRAGMA user_version").fetchone()[0] == MIGRATIONS[-1].version
    assert "later_column" not in [r[1] for r in conn.execute("PRAGMA table_info(decisions)")]
    conn.close()
    assert len(list(tmp_path.glob(f"history.sqlite.backup-v{MIGRATIONS[-1].version}-*"))) == 1


def test_tampered_decision_is_reported_not_shown(sqlite_store):
    store = sqlite_store
    store.record({"name": "s"}, plan({"A": "M"}), by="Supervisor A", reason="other")
    conn = sqlite3.connect(store.path)
    conn.execute("DROP TRIGGER decisions_append_only_update")
    conn.execute("UPDATE decisions SET plan_json = replace(plan_json, '\"M\"', '\"X\"')")
    conn.commit()
    conn.close()
    with pytest.raises(HistoryError, match="decision #1 no longer matches its checksum"):
        store.get(1)


@pytest.mark.parametrize("platform, env, expected", [
    ("linux", {}, "home/.local/share/dispatcher"),
    ("linux", {"XDG_DATA_HOME": "/data/xdg"}, "/data/xdg/dispatcher"),
    ("linux", {"XDG_DATA_HOME": "relative/ignored"}, "home/.local/share/dispatcher"),
    ("darwin", {}, "home/Library/Application Support/dispatcher"),
    ("win32", {"APPDATA": "/roaming"}, "/roaming/dispatcher"),
    ("win32", {}, "home/AppData/Roaming/dispatcher"),
])
def test_per_user_data_folder(platform, env, expected):
    # XDG Base Directory Specification: relative XDG_DATA_HOME values are ignored.
    assert data_folder(env, platform, Path("home")) == Path(expected)
    assert default_history_path(env, platform, Path("home")) == Path(expected) / "history.sqlite"
    override = {"DISPATCHER_HISTORY": "/x/h.sqlite"}
    assert default_history_path(override, platform) == Path("/x/h.sqlite")


@pytest.mark.parametrize("clock, expected", [
    (time(5, 59), (date(2026, 3, 13), "night")),
    (time(6, 0), (date(2026, 3, 14), "early")),
    (time(13, 59), (date(2026, 3, 14), "early")),
    (time(14, 0), (date(2026, 3, 14), "late")),
    (time(23, 30), (date(2026, 3, 14), "night")),
])
def test_shift_of_default_pattern(clock, expected):
    moment = datetime.combine(date(2026, 3, 14), clock, tzinfo=UTC)
    assert shift_of(moment, tz=UTC) == expected


def test_shift_uses_local_time_and_custom_pattern(tmp_path):
    plus2 = timezone(timedelta(hours=2))
    two_shifts = (ShiftStart("day", time(7)), ShiftStart("night", time(19)))
    # 04:30 UTC is 06:30 at UTC+2: still the previous day's night shift.
    assert shift_of(datetime(2026, 3, 14, 4, 30, tzinfo=UTC), two_shifts, plus2) == (
        date(2026, 3, 13), "night")
    store = HistoryStore(tmp_path / "h.sqlite", shifts=two_shifts, tz=plus2)
    n = store.record({}, plan({"A": "M"}), by="Supervisor A", reason="other",
                     time=datetime(2026, 3, 14, 5, 30, tzinfo=UTC))
    assert (store.get(n).shift_date, store.get(n).shift) == (date(2026, 3, 14), "day")
    m = store.record({}, plan({"A": "M"}), by="Supervisor A", reason="other",
                     shift_date=date(2026, 1, 1), shift="special")
    assert (store.get(m).shift_date, store.get(m).shift) == (date(2026, 1, 1), "special")


def test_decision_based_on_a_replaced_plan_is_refused(store):
    """Optimistic concurrency on the shop's latest decision (both stores)."""
    shop, other = {"name": "Press shop"}, {"name": "Paint shop"}
    first = store.record(shop, plan({"A": "M"}), by="early-shift lead", reason="shift start",
                         based_on=None, station="A", time=T0)
    with pytest.raises(DecisionConflict) as info:
        store.record(shop, plan({"B": "M"}), by="late-shift lead", reason="breakdown",
                     based_on=None, station="B")
    assert info.value.newer.id == first and info.value.based_on is None
    assert str(info.value) == ("Decision #1, by early-shift lead at station A at 05:00 UTC, "
                               "replaced the plan you started from: review the new "
                               "proposal; nothing was recorded")
    second = store.record(shop, plan({"B": "M"}), by="late-shift lead", reason="breakdown",
                          based_on=first, station="B", time=T0)
    with pytest.raises(DecisionConflict, match=r"Decision #2, by late-shift lead at station B"
                                                r" .*started from \(#1\)"):
        store.record(shop, plan({"C": "M"}), by="early-shift lead", reason="other",
                     based_on=first)
    assert store.record(other, plan({"C": "M"}), by="Supervisor A", reason="other", based_on=None) == 3
    assert store.count() == 3
    d = store.get(second)
    assert (d.based_on, d.replaces, d.station) == (first, first, "B")
    assert store.get(3).to_json()["station"] != "" and store.get(first).based_on is None
