"""What the app hands to its background solve: a copy of the shop and the solve call.

The worker must never read the live shop (the user keeps editing it), so each solve gets
its own copy (:meth:`dispatcher.shop.Shop.copy`, a few milliseconds on a 1000 x 200
shop). The planning modes and the solve itself are the core's
(:mod:`dispatcher.shop.planning`); this module turns the core's errors into a message the
plan panel shows, and lays a plan out per machine for it.
"""

from __future__ import annotations

import atexit
import multiprocessing
import threading
import time
from concurrent.futures import ProcessPoolExecutor
from concurrent.futures.process import BrokenProcessPool
from dataclasses import dataclass

from dispatcher.engine.fill_shift import ShiftCancelled
from dispatcher.shop import Plan, Shop, ShopError, ShopInfeasibleError
from dispatcher.shop.fill_shift import ShiftFill
from dispatcher.shop.packing import pack_shop, unpack_shop
from dispatcher.shop.planning import MODE_ROUND, solve_for_mode



@dataclass
class SolveOutcome:
    """Plain result of one background solve: a plan, or the reason there is none."""

    objective: str
    plan: Plan | ShiftFill | None
    problem: str = ""          # message when the shop cannot be solved as it is
    infeasible: bool = False   # True when rush/pinned jobs cannot all be placed
    seconds: float = 0.0


def solve_outcome(shop: Shop, objective: str, cancel: threading.Event | None = None,
                  report=None, mode: str = MODE_ROUND) -> SolveOutcome:
    """Solve a copy of the shop; turn the core's own errors into a message (never raises them)."""
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


# ---- one-round solves in a worker process ------------------------------------------------
# A one-round solve of a 1000 x 200 shop spends about half a second in C code that holds
# Python's interpreter lock (matrix building, scipy's linear_sum_assignment); in a thread
# the GUI thread cannot run meanwhile, however short the switch interval. In a worker
# process it never competes with the window. The shop is sent packed
# (:mod:`dispatcher.shop.packing`: pickling the 200,000-entry grid dict is one 80 ms call
# holding the lock); the plan comes back without its copy of the shop, which the caller
# already has.

_EXECUTOR: ProcessPoolExecutor | None = None
_EXECUTOR_LOCK = threading.Lock()


def _executor() -> ProcessPoolExecutor:
    global _EXECUTOR
    with _EXECUTOR_LOCK:
        if _EXECUTOR is None:
            _EXECUTOR = ProcessPoolExecutor(max_workers=1,
                                            mp_context=multiprocessing.get_context("spawn"))
            atexit.register(_EXECUTOR.shutdown, wait=False, cancel_futures=True)
        return _EXECUTOR


def _solve_packed(packed: tuple, objective: str) -> SolveOutcome:
    """In the worker process: solve one round; the plan goes back without the shop."""
    outcome = solve_outcome(unpack_shop(packed), objective, mode=MODE_ROUND)
    problem = getattr(outcome.plan, "problem", None)
    if problem is not None:
        problem.shop = None
    return outcome


def solve_round_in_process(shop: Shop, objective: str) -> SolveOutcome:
    """:func:`solve_outcome` for one round, computed in the worker process (called from a
    background thread: it blocks until the result is back). Falls back to this process
    when the worker cannot be started."""
    try:
        outcome = _executor().submit(_solve_packed, pack_shop(shop), objective).result()
    except (BrokenProcessPool, OSError, RuntimeError):
        global _EXECUTOR
        with _EXECUTOR_LOCK:
            _EXECUTOR = None
        return solve_outcome(shop, objective, mode=MODE_ROUND)
    problem = getattr(outcome.plan, "problem", None)
    if problem is not None:
        problem.shop = shop
    return outcome
