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

from dispatcher.engine.fill_shift import ShiftCancelled
from dispatcher.shop import Plan, Problem, Shop, ShopError, ShopInfeasibleError, solve_shop
from dispatcher.shop.fill import ShiftFill, fill_shop_shift

#: Planning modes: one dispatch round (one job per free machine slot) or the whole shift
#: (several jobs per machine, in run order, within its hours).
MODE_ROUND, MODE_SHIFT = "round", "shift"
MODES = {MODE_ROUND: "One round: one job per free machine slot",
         MODE_SHIFT: "Whole shift: several jobs per machine within its hours"}

#: Seconds the whole-shift solver may take before it reports the best plan found (with its
#: proven gap) instead of a proven optimum.
SHIFT_TIME_LIMIT = 30.0


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
    plan: Plan | ShiftFill | None
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


def solve_for_mode(shop: Shop, objective: str, mode: str = MODE_ROUND,
                   cancel: threading.Event | None = None, report=None) -> tuple[Plan | ShiftFill, str]:
    """The plan in ``mode`` with a caveat sentence ('' if none). Raises the core's errors."""
    if mode == MODE_SHIFT:
        if objective == "bottleneck":
            raise ShopError([Problem("objective", "the whole-shift mode plans for 'least total' "
                                     "or 'most value'; switch the objective")])
        plan = fill_shop_shift(shop, maximize=objective == "maximize", time_limit=SHIFT_TIME_LIMIT,
                               cancel=cancel, progress=report)
        return plan, ("" if plan.proven_optimal else plan.status_text)
    return solve_relaxing_rush(shop, objective)


def solve_outcome(shop: Shop, objective: str, cancel: threading.Event | None = None,
                  report=None, mode: str = MODE_ROUND) -> SolveOutcome:
    """Solve a snapshot; turn the core's own errors into a message (never raises them)."""
    start = time.perf_counter()
    try:
        plan, note = solve_for_mode(shop, objective, mode, cancel, report)
    except ShiftCancelled:
        return SolveOutcome(objective, None, "cancelled", False, time.perf_counter() - start)
    except ShopInfeasibleError as exc:
        return SolveOutcome(objective, None, str(exc), True, time.perf_counter() - start)
    except ShopError as exc:
        return SolveOutcome(objective, None, str(exc), False, time.perf_counter() - start)
    return SolveOutcome(objective, plan, note, bool(note), time.perf_counter() - start)


def machine_entries(plan: Plan | ShiftFill, order: list[str] | None = None
                    ) -> list[tuple[str, list[tuple[str, float | None, bool]]]]:
    """Per machine (in ``order`` when given) its jobs as ``(job, value, already_running)``:
    running first, then newly dispatched (in run order for a whole-shift plan)."""
    if isinstance(plan, ShiftFill):
        cost = {a.job: a.cost for a in plan.assignments}
        run_cost = {r.job: r.cost for r in plan.running}
        table = {m.machine: [(j, run_cost.get(j), True) for j in m.running]
                 + [(j, cost.get(j), False) for j in m.jobs] for m in plan.machines}
    else:
        table = plan.by_machine()
    table = {m: e for m, e in table.items() if e}
    if order is None:
        return list(table.items())
    rank = {name: k for k, name in enumerate(order)}
    return sorted(table.items(), key=lambda kv: rank.get(kv[0], len(rank)))


def shift_hours(plan: Plan | ShiftFill) -> dict[str, tuple[float, float]]:
    """Machine -> (hours used, hours available) for a whole-shift plan; {} otherwise."""
    if not isinstance(plan, ShiftFill):
        return {}
    return {m.machine: (m.hours_used, m.capacity) for m in plan.machines}


def plan_in_force_ids(plan: Plan | ShiftFill, shop: Shop) -> dict[str, list[str]]:
    """A plan as a shop's ``plan_in_force`` (machine id -> job ids, running first)."""
    if isinstance(plan, Plan):
        return plan.in_force(shop)
    out: dict[str, list[str]] = {}
    for m in plan.machines:
        jobs = m.running + m.jobs
        if jobs:
            out[shop.machine_by_name(m.machine).id] = [shop.job_by_name(j).id for j in jobs]
    return out
