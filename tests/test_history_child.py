"""A child process for the history reliability tests (run as a script, not collected).

``python tests/test_history_child.py PATH RUN [COUNT] [--wait-go]`` records decisions in a
loop (COUNT of them, or forever) and prints ``<id> <token>`` after each record call has
returned, flushing at once, so the parent knows exactly which calls completed. It prints
``ready`` once the history is open; with ``--wait-go`` it then waits for a line on stdin.
PATH may be a PostgreSQL location. With ``--keep-going`` a failed record call (the server
went away) prints ``error ...`` and is retried until COUNT calls have returned.

The content of each decision is a pure function of its token (:func:`make_decision`), so
the parent can check every acknowledged decision is intact.
"""

from __future__ import annotations

import hashlib
import sys
from pathlib import Path

if __name__ == "__main__":
    sys.path.insert(0, str(Path(__file__).resolve().parent.parent))

import time  # noqa: E402

from dispatcher.history import HistoryError, open_history  # noqa: E402

SHOP_NAME = "reliability-test shop (invented)"


def make_decision(token: str) -> tuple[dict, dict]:
    """The (shop document, plan) recorded for ``token``; varied sizes and names."""
    h = hashlib.sha256(token.encode()).digest()
    n_jobs = 2 + h[0] % 9
    n_machines = 2 + h[1] % 7
    jobs = [f"WO-{token}-{i}" for i in range(n_jobs)]
    machines = [f"Machine {k}" for k in range(n_machines)]
    placed = min(n_jobs, n_machines)
    start = h[2] % n_machines
    assignments = [{"job": jobs[i], "machine": machines[(start + i) % n_machines],
                    "cost": (h[3 + i % 20] % 50) / 2} for i in range(placed)]
    used = {a["machine"] for a in assignments}
    plan = {
        "status": "optimal", "objective": "total",
        "total": sum(a["cost"] for a in assignments),
        "assignments": assignments,
        "waiting_jobs": jobs[placed:],
        "idle_machines": [m for m in machines if m not in used],
        "certificate": {"verified": True},
    }
    shop = {"name": SHOP_NAME, "token": token, "jobs": jobs, "machines": machines,
            "padding": "x" * (h[4] * 40)}
    return shop, plan


def main(argv: list[str]) -> None:
    path, run = argv[0], argv[1]
    count = int(argv[2]) if len(argv) > 2 and argv[2].isdigit() else None
    store = open_history(path, timeout=30.0)
    store.count()  # open (and check) the file before saying ready
    print("ready", flush=True)
    if "--wait-go" in argv:
        sys.stdin.readline()
    keep_going = "--keep-going" in argv
    seq = 0
    while count is None or seq < count:
        token = f"{run}-{seq}"
        shop, plan = make_decision(token)
        try:
            number = store.record(shop, plan, by=f"supervisor {run}", reason="other",
                                  note=token)
        except HistoryError as exc:
            if not keep_going:
                raise
            print("error", str(exc).replace("\n", " ")[:200], flush=True)
            time.sleep(0.1)
            continue
        print(number, token, flush=True)
        seq += 1


if __name__ == "__main__":
    main(sys.argv[1:])
