"""What the app hands to the worker thread: a cheap snapshot of the shop and the solve call.

The worker must never read the live shop (the user keeps editing it), so each solve gets
its own snapshot. :func:`snapshot` copies the containers (the grid dict, the job and
machine records, pins, plan in force) rather than deep-copying every value: on a
1000 x 200 shop that keeps the GUI thread's share of a re-solve to a few milliseconds.
All numbers come from :func:`dispatcher.shop.solve_shop` (Qt-free).
"""

from __future__ import annotations

import copy
import threading
import time
from dataclasses import dataclass, replace

from dispatcher.shop import Plan, Shop, ShopError, ShopInfeasibleError, solve_shop


def snapshot(shop: Shop) -> Shop:
    """An independent copy of ``shop`` safe to read in another thread while the user edits."""
    return replace(
        shop,
        unit=copy.copy(shop.unit),
        shift=copy.copy(shop.shift),
        jobs=[copy.copy(j) for j in shop.jobs],
        machines=[copy.copy(m) for m in shop.machines],
        grid=dict(shop.grid),
        pins=[copy.copy(p) for p in shop.pins],
        hours=dict(shop.hours),
        plan_in_force={k: list(v) for k, v in shop.plan_in_force.items()},
    )


@dataclass
class SolveOutcome:
    """Plain result of one background solve: a plan, or the reason there is none."""

    objective: str
    plan: Plan | None
    problem: str = ""          # message when the shop cannot be solved as it is
    infeasible: bool = False   # True when rush/pinned jobs cannot all be placed
    seconds: float = 0.0


def solve_relaxing_rush(shop: Shop, objective: str) -> tuple[Plan, str]:
    """The plan for ``shop``; if its rush jobs cannot all be placed, the plan that treats
    the rush jobs named by the core's witness as ordinary jobs, with a sentence saying so.

    Raises :class:`ShopInfeasibleError` when that does not help (pinned jobs collide) and
    :class:`ShopError` for an inconsistent shop.
    """
    try:
        return solve_shop(shop, objective), ""
    except ShopInfeasibleError as exc:
        relaxed = [n for n in exc.jobs if shop.job_by_name(n).rush]
        if not relaxed:
            raise
        trial = snapshot(shop)
        for n in relaxed:
            trial.job_by_name(n).rush = False
        plan = solve_shop(trial, objective)
        return plan, (f"{exc}. The plan shown treats rush job(s) {', '.join(relaxed)} as "
                      "ordinary jobs for this round; their rush flags stay set.")


def solve_outcome(shop: Shop, objective: str, cancel: threading.Event | None = None) -> SolveOutcome:
    """Solve a snapshot; turn the core's own errors into a message (never raises them)."""
    start = time.perf_counter()
    try:
        plan, note = solve_relaxing_rush(shop, objective)
    except ShopInfeasibleError as exc:
        return SolveOutcome(objective, None, str(exc), True, time.perf_counter() - start)
    except ShopError as exc:
        return SolveOutcome(objective, None, str(exc), False, time.perf_counter() - start)
    return SolveOutcome(objective, plan, note, bool(note), time.perf_counter() - start)
