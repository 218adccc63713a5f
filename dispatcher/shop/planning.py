"""Planning modes shared by the command line and the app: one dispatch round, or the
whole shift (several jobs per machine, in run order, within its hours).

:func:`solve_for_mode` is what the app solves after every edit and what a decision
proposal solves after an event.
"""

from __future__ import annotations

import threading

from dispatcher.errors import Cancelled

from .fill_shift import ShiftFill, fill_shop_shift
from .model import Problem, Shop, ShopError
from .plan import Plan
from .translate import solve_shop

#: Planning modes: one dispatch round (one job per free machine slot) or the whole shift
#: (several jobs per machine, in run order, within its hours).
MODE_ROUND, MODE_SHIFT = "round", "shift"
MODES = {MODE_ROUND: "One round: one job per free machine slot",
         MODE_SHIFT: "Whole shift: several jobs per machine within its hours"}

#: Seconds the whole-shift solver may take before it reports the best plan found (with its
#: proven gap) instead of a proven optimum.
SHIFT_TIME_LIMIT = 30.0

__all__ = ["MODES", "MODE_ROUND", "MODE_SHIFT", "SHIFT_TIME_LIMIT", "Cancelled",
           "plan_in_force_ids", "solve_for_mode", "solve_relaxing_rush"]


def solve_relaxing_rush(shop: Shop, objective: str) -> tuple[Plan, str]:
    """The plan for ``shop`` and, when rush jobs cannot all be placed, a sentence naming
    the rush jobs left waiting and the machines they compete for (the core places as many
    rush jobs as possible; their rush flags stay set). Raises :class:`ShopError` for an
    inconsistent shop."""
    plan = solve_shop(shop, objective)
    return plan, rush_note(plan)


def rush_note(plan: Plan) -> str:
    """One sentence per group of rush jobs left waiting ('' when every rush job is placed)."""
    if not plan.rush_groups:
        return ""
    return (f"rush job(s) {', '.join(plan.rush_waiting)} wait: "
            + "; ".join(g.text for g in plan.rush_groups) + ". Their rush flags stay set.")


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
