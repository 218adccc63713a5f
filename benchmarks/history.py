"""Record and list latency of the decision history with 10,000 decisions, on both stores.

An SQLite file and a PostgreSQL database (a throw-away server started here with initdb and
pg_ctl, exactly as the tests do, but with ``fsync = on`` so commits are durable as in a
plant) are each filled with the same 10,000 sealed decisions of one invented shop (20
jobs, 8 machines; appended in batches through the copy path, which keeps every seal), then
timed in the same run, alternating stores:

* record: one ``record()`` call (a new decision linked to the shop's latest, committed
  durably), median of ``--repeat`` calls;
* list newest 100: ``list(limit=100, newest_first=True)`` including the seal check of the
  100 decisions read, median of ``--repeat`` calls.

* list, new store: the same list from a store object made for the call, as one command
  line run does (the PostgreSQL number includes connecting over the Unix socket).

Goal (issue): listing the newest 100 under 50 ms on both stores, as the app does it (the
store keeps one connection per thread). The tables are timed right after the bulk fill,
before autovacuum has analysed them, as after ``history copy``.

Usage: python benchmarks/history.py [--decisions 10000] [--repeat 30]
The last line printed is ``ratio <PostgreSQL / SQLite median list-newest-100 time>``.
"""

from __future__ import annotations

import argparse
import json
import statistics
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))
sys.path.insert(0, str(ROOT / "tests"))

from pg_server import PgServer, unavailable_reason  # noqa: E402

from dispatcher.history import HistoryStore, open_history  # noqa: E402
from dispatcher.history.plans import diff_plans, plan_rows  # noqa: E402
from dispatcher.history.seal import content_digest, seal_of  # noqa: E402

SHOP = "benchmark shop (invented)"


def decision(i: int) -> tuple[dict, dict]:
    jobs = [f"WO-{i}-{j}" for j in range(20)]
    machines = [f"Machine {k}" for k in range(8)]
    assignments = [{"job": jobs[k], "machine": machines[(i + k) % 8], "cost": (i * 7 + k) % 60}
                   for k in range(8)]
    plan = {"status": "optimal", "objective": "total",
            "total": sum(a["cost"] for a in assignments), "assignments": assignments,
            "waiting_jobs": jobs[8:], "idle_machines": [], "certificate": {"verified": True}}
    shop = {"name": SHOP, "jobs": [{"id": j, "work_order": j} for j in jobs],
            "machines": [{"id": m} for m in machines], "note": "invented benchmark data"}
    return shop, plan


def sealed_items(n: int) -> list[tuple[dict, list]]:
    """n decisions with their rows and seals, each replacing the one before."""
    items, previous = [], None
    for i in range(1, n + 1):
        shop, plan = decision(i)
        shop_json = json.dumps(shop, separators=(",", ":"))
        plan_json = json.dumps(plan, separators=(",", ":"))
        diff = None if previous is None else json.dumps(
            diff_plans(previous, plan, from_id=i - 1).to_json())
        v = {"id": i, "time_utc": f"2026-03-{1 + i % 28:02d}T05:00:00.000000Z",
             "shift_date": f"2026-03-{1 + i % 28:02d}", "shift_label": "early",
             "supervisor": "Supervisor A", "reason_kind": "other", "reason_text": "",
             "shop_name": SHOP, "objective": "total", "total": plan["total"],
             "certificate": "verified", "replaces": i - 1 if i > 1 else None,
             "restored_from": None, "shop_json": shop_json, "plan_json": plan_json,
             "diff_json": diff, "digest": content_digest(shop_json, plan_json),
             "station": "A", "based_on": None}
        rows = plan_rows(plan)
        v["seal"] = seal_of(v, rows)
        items.append((v, rows))
        previous = plan
    return items


def list_once(location) -> list:
    """The newest 100 through a store made for this call (as one command line run)."""
    store = open_history(location)
    try:
        return store.list(limit=100, newest_first=True)
    finally:
        close = getattr(store, "close", None)
        if close is not None:
            close()


def timed(action) -> float:
    start = time.perf_counter()
    action()
    return time.perf_counter() - start


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--decisions", type=int, default=10_000)
    ap.add_argument("--repeat", type=int, default=30)
    args = ap.parse_args()
    reason = unavailable_reason()
    if reason:
        sys.exit(f"cannot run: {reason}")
    server = PgServer(fsync=True)
    tmp = Path(tempfile.mkdtemp(prefix="dispatcher-bench-"))
    try:
        server.init()
        stores = {"SQLite": HistoryStore(tmp / "history.sqlite"),
                  "PostgreSQL": open_history(server.uri())}
        items = sealed_items(args.decisions)
        for store in stores.values():
            store.init(make_folder=False)
            for i in range(0, len(items), 1000):
                store.append_sealed(items[i:i + 1000])
            assert store.count() == args.decisions
        times = {name: {"record": [], "list": [], "list, new store": []} for name in stores}
        for r in range(args.repeat):
            order = list(stores.items()) if r % 2 == 0 else list(stores.items())[::-1]
            for name, store in order:
                shop, plan = decision(args.decisions + r)
                times[name]["record"].append(timed(lambda: store.record(
                    shop, plan, by="Supervisor A", reason="other")))
                found = []
                times[name]["list"].append(timed(lambda: found.append(
                    store.list(limit=100, newest_first=True))))
                assert len(found[0]) == 100
                location = store.path if name == "SQLite" else server.uri()
                times[name]["list, new store"].append(timed(lambda: found.append(
                    list_once(location))))
        print(f"{args.decisions} decisions in each store, median of {args.repeat} calls")
        print(f"{'store':<12}{'record (ms)':>14}{'list newest 100 (ms)':>24}"
              f"{'same, new store (ms)':>24}")
        med = {}
        for name in stores:
            med[name] = {k: statistics.median(v) * 1000 for k, v in times[name].items()}
            print(f"{name:<12}{med[name]['record']:>14.2f}{med[name]['list']:>24.2f}"
                  f"{med[name]['list, new store']:>24.2f}")
        print(f"record ratio PostgreSQL/SQLite "
              f"{med['PostgreSQL']['record'] / med['SQLite']['record']:.2f}")
        goal = all(m["list"] < 50 for m in med.values())
        print(f"list newest 100 under 50 ms on both: {'yes' if goal else 'NO'}")
        print(f"ratio {med['PostgreSQL']['list'] / med['SQLite']['list']:.2f}")
    finally:
        server.cleanup()
        for p in sorted(tmp.iterdir()):
            p.unlink()
        tmp.rmdir()


if __name__ == "__main__":
    main()
