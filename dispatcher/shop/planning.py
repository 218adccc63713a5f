"""Planning modes shared by the command line and the app: one dispatch round, or the
whole shift (several jobs per machine, in run order, within its hours).

:func:`solve_for_mode` is what the app solves after every edit and what a decision
proposal solves after an event.
"""

from __future__ import annotations

import threading

from .fill import ShiftFill, fill_shop_shift
from .model import Problem, Shop, ShopError
from .plan import Plan
from .translate import ShopInfeasibleError, solve_shop

#: Planning modes: one dispatch round (one job per free machine slot) or the whole shift
#: (several jobs per machine, in run order, within its hours).
MODE_ROUND, MODE_SHIFT = "round", "shift"
MODES = {MODE_ROUND: "One round: one job per free machine slot",
         MODE_SHIFT: "Whole shift: several jobs per machine within its hours"}

#: Seconds the whole-shift solver may take before it reports the best plan found (with its
#: proven gap) instead of a proven optimum.
SHIFT_TIME_LIMIT = 30.0


class Cancelled(Exception):
    """A computation was stopped by its cancel event (its result is not wanted)."""


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
        trial = shop.copy()
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
