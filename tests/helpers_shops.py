"""Small invented shops shared by several test modules (demo data, not a reference)."""

from __future__ import annotations

from dispatcher.shop import RUNNING, Job, Machine, Shop


def small_shop() -> Shop:
    """Two presses and a saw; J1 runs on Press A; J2, J3 dispatched; J4 waits (invented)."""
    shop = Shop(name="invented test shop", move_penalty=4.0)
    shop.machines = [Machine(id="A", name="Press A"), Machine(id="B", name="Press B"),
                     Machine(id="S", name="Saw")]
    shop.jobs = [Job(id="J1", name="WO-1", state=RUNNING, machine="A"),
                 Job(id="J2", name="WO-2", wait_penalty=30.0),
                 Job(id="J3", name="WO-3", wait_penalty=30.0),
                 Job(id="J4", name="WO-4", wait_penalty=1.0)]
    grid = {"J1": {"A": 5, "B": 6}, "J2": {"A": 3, "B": 10}, "J3": {"B": 2, "S": 9},
            "J4": {"A": 8, "B": 8, "S": 8}}
    shop.grid = {(j, m): float(v) for j, row in grid.items() for m, v in row.items()}
    shop.plan_in_force = {"A": ["J1"], "B": ["J2"], "S": ["J3"]}
    return shop
