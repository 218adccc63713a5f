"""Fill a whole shift: each machine runs several jobs, one after another, within its hours.

Shop rules in this mode (the one-job-per-machine rules are in :mod:`.translate`):

* done jobs take no part; running jobs stay on their machine and count their run hours
  against its hours (the whole run, since how much is left is not recorded);
* only ``up`` machines take jobs. A machine has ``shift_hours`` (or the shift length)
  times ``slots`` hours of work this shift (a machine with two slots runs two jobs side by
  side), less the hours of the jobs running on it;
* a job's hours on a machine are the pair's own ``hours`` entry, else the job's
  ``run_hours`` times the machine's ``speed_factor``; a waiting job that a machine can
  run needs one of these, and so does a running job;
* ``must`` pins put the job on that machine (several jobs may be pinned to one machine:
  the hours, not the slots, limit them); ``must_not`` pins remove the pair; rush and
  pinned jobs must run; wait penalties count for jobs left for the next shift;
* the engine (:func:`dispatcher.engine.fill_shift`) runs as many waiting jobs as the hours
  permit and, among those plans, gives the least setup plus wait penalties (or the most
  value less penalties). Each machine's jobs are listed in run order: rush first, then
  by due time.
"""

from __future__ import annotations

import math
from collections.abc import Iterable
from dataclasses import dataclass, field, replace
from typing import Any

import numpy as np

from dispatcher.engine import (
    DispatchInputError,
    ShiftInfeasibleError,
    ShiftPlan,
    ShiftSearchError,
    fill_shift,
)

from dispatcher.engine.staffed_shift import staffed_fill_shift

from .crew import refuse_with_crew
from .model import DONE, MUST, MUST_NOT, RUNNING, UP, Problem, Shop, ShopError
from .plan import Assignment, RunningJob, WaitReason, contract_json, json_number
from .staffed_shift import crew_hours, shift_staffing
from .translate import ShopInfeasibleError
from .validate import check_shop

__all__ = ["MachineShift", "ShiftFill", "fill_shop_shift"]


@dataclass(frozen=True)
class MachineShift:
    """One machine's share of the shift: jobs in run order, hours used out of capacity.

    ``running`` are jobs already on it (they stay, first); ``jobs`` are newly planned.
    ``capacity`` is the machine's hours this shift (shift hours x slots); ``hours_used``
    counts running and planned jobs.
    """

    machine: str
    jobs: list[str]
    hours_used: float
    capacity: float
    running: list[str] = field(default_factory=list)
    runs: list[dict[str, Any]] | None = None       # shops with families: each run's change
    end_change: float | None = None                 # and the change into the end family
    operators: list[dict[str, Any]] | None = None   # shops with a crew: who minds it, hours


@dataclass
class ShiftFill:
    """A filled shift in shop terms, and what is proven about it.

    ``status`` is ``"optimal"`` (proven) or ``"time_limit"`` (best plan found, with
    ``bound`` and ``gap`` from the solver). :meth:`to_json` gives the ``dispatcher solve
    --json`` contract plus ``machines`` (per machine its ordered jobs and hours).
    """

    objective: str
    total: float
    status: str
    status_text: str
    proven_optimal: bool
    bound: float
    gap: float
    machines: list[MachineShift]
    assignments: list[Assignment]
    waiting_jobs: list[str]
    idle_machines: list[str]
    waiting_reasons: dict[str, WaitReason]
    verified: bool
    running: list[RunningJob] = field(default_factory=list)
    unavailable_machines: list[str] = field(default_factory=list)
    engine_plan: ShiftPlan | None = field(default=None, repr=False, compare=False)
    rush_waiting: list[str] = field(default_factory=list)
    staffing: dict[str, Any] | None = None          # shops with a crew (see docs/crew.md)

    def jobs_on(self, machine: str) -> list[str]:
        """Running then planned jobs of a machine, in run order (empty if unknown)."""
        for m in self.machines:
            if m.machine == machine:
                return m.running + m.jobs
        return []

    def to_json(self) -> dict[str, Any]:
        """The solve contract plus ``machines``: per machine its ordered jobs and hours."""
        certificate = {"verified": self.verified, "proven_optimal": self.proven_optimal,
                       "bound": _json_float(self.bound), "gap": _json_float(self.gap),
                       "text": self.status_text}
        data = contract_json(self, bottleneck=None, certificate=certificate)
        data["machines"] = [{"machine": m.machine, "jobs": list(m.jobs),
                             "hours_used": json_number(m.hours_used, digits=9),
                             "capacity": json_number(m.capacity), "running": list(m.running),
                             **({} if m.runs is None else
                                {"runs": [dict(r) for r in m.runs],
                                 "end_change": None if m.end_change is None else json_number(m.end_change)}),
                             **({} if m.operators is None else
                                {"operators": [dict(o) for o in m.operators]})}
                            for m in self.machines]
        return data


def _json_float(x: float) -> int | float | None:
    return json_number(x) if math.isfinite(x) else None


def _check_fill(shop: Shop, source: str) -> None:
    """The shop's own checks, except that one machine may take several pinned jobs."""
    relaxed = shop.copy()
    pinned = {}
    for p in relaxed.pins:
        if p.kind == MUST:
            pinned[p.machine] = pinned.get(p.machine, 0) + 1
    for m in relaxed.machines:
        if isinstance(m.slots, int) and not isinstance(m.slots, bool):
            m.slots += pinned.get(m.id, 0)
    check_shop(relaxed, source)


def fill_shop_shift(shop: Shop, *, maximize: bool = False, extra_must_run: Iterable[str] = (),
                    time_limit: float | None = None, source: str = "", cancel=None,
                    progress=None) -> ShiftFill:
    """Plan the whole shift of ``shop``: several jobs per machine within its hours.

    ``maximize``: grid values are gains. ``extra_must_run``: names of further waiting
    jobs that must run this shift. ``time_limit``: seconds for the solver (the result
    then says whether it is proven optimal). Raises :class:`ShopError` for an
    inconsistent shop or missing run hours (every problem located) and
    :class:`ShopInfeasibleError` when rush or pinned jobs cannot all fit, and
    :class:`~dispatcher.engine.fill_shift.ShiftSearchError` when the time limit ran out
    before any plan running them was found (both name ``source``). ``cancel`` (a
    ``threading.Event``) and ``progress`` (called with a short text per solver stage) are
    passed to :func:`dispatcher.engine.fill_shift`, which raises
    :class:`~dispatcher.engine.fill_shift.ShiftCancelled` when cancelled.
    """
    _check_fill(shop, source)
    if shop.has_families() and not maximize:
        refuse_with_crew(shop.crew.active, "filling the whole shift with changeovers", source)
        # changeovers priced in run order (dispatcher.shop.fill_runs)
        from .fill_runs import fill_with_changeovers
        return fill_with_changeovers(shop, extra_must_run=extra_must_run, time_limit=time_limit,
                                     source=source, cancel=cancel, progress=progress)
    values_all, allowed_all = shop.matrix()
    hours_all = shop.hours_matrix()
    mindex = {m.id: k for k, m in enumerate(shop.machines)}
    up = [k for k, m in enumerate(shop.machines) if m.state == UP]
    rows = [i for i, j in enumerate(shop.jobs) if j.state not in (RUNNING, DONE)]
    extra = set(extra_must_run)
    unknown = extra - {shop.jobs[i].name for i in rows}
    problems = [Problem(f"must-run job {n!r}", "is not a waiting job of this shop")
                for n in sorted(unknown)]

    capacity_all = shop.capacity() * np.array([m.slots for m in shop.machines], dtype=float)
    used_running = np.zeros(len(shop.machines))
    running: list[tuple[int, int]] = []
    for i, j in enumerate(shop.jobs):
        if j.state == RUNNING:
            k = mindex[j.machine]
            running.append((i, k))
            if math.isnan(hours_all[i, k]):
                problems.append(_no_hours(shop, i, k))
            else:
                used_running[k] += hours_all[i, k]
    for i in rows:
        for k in up:
            if allowed_all[i, k] and math.isnan(hours_all[i, k]):
                problems.append(_no_hours(shop, i, k))
    if problems:
        raise ShopError(problems, source)

    r, c = np.array(rows, dtype=np.int64), np.array(up, dtype=np.int64)
    values = values_all[np.ix_(r, c)]
    allowed = allowed_all[np.ix_(r, c)].copy()
    hours = np.where(allowed, np.nan_to_num(hours_all[np.ix_(r, c)]), 0.0)
    capacity = np.maximum(capacity_all[c] - used_running[c], 0.0)
    row_of = {shop.jobs[i].id: n for n, i in enumerate(rows)}
    col_of = {shop.machines[k].id: n for n, k in enumerate(up)}
    pins: dict[tuple[int, int], bool] = {}
    for p in shop.pins:
        n, col = row_of.get(p.job), col_of.get(p.machine)
        if n is None or col is None:
            continue  # running/done jobs, machines not up: the checks cover what matters
        if p.kind == MUST:
            pins[(n, col)] = True
        elif p.kind == MUST_NOT:
            pins[(n, col)] = False
    jobs = [shop.jobs[i] for i in rows]
    # Rush is a priority (as in one round): the most jobs, then the most rush jobs; only
    # jobs named as must-run (and pinned jobs) must run.
    must = np.array([j.name in extra for j in jobs], dtype=bool)
    rush = np.array([j.rush for j in jobs], dtype=bool)
    due = np.array([j.due.timestamp() if j.due else np.nan for j in jobs], dtype=float)
    penalty = np.array([j.wait_penalty for j in jobs], dtype=float)
    names = [j.name for j in jobs]
    mnames = [shop.machines[k].name for k in up]
    args = dict(allowed=allowed.reshape(len(rows), len(up)), maximize=maximize,
                time_limit=time_limit, wait_penalty=penalty, must_run=must, pins=pins, rush=rush,
                due=due, priority=rush)
    shape = (len(rows), len(up))
    try:
        if shop.crew.active:
            if progress is not None:
                progress("planning the shift with the crew's hours")
            plan = staffed_fill_shift(values.reshape(shape), hours.reshape(shape), capacity,
                                      **crew_hours(shop, up, used_running), **args)
        else:
            plan = fill_shift(values.reshape(shape), hours.reshape(shape), capacity,
                              cancel=cancel, progress=progress, **args)
    except ShiftInfeasibleError as exc:
        raise ShopInfeasibleError(_infeasible_text(exc, names, mnames),
                                  [names[i] for i in exc.jobs],
                                  [mnames[k] for k in exc.machines], source) from None
    except ShiftSearchError as exc:
        raise ShiftSearchError(exc.message, source=source) from None
    except DispatchInputError as exc:
        raise ShopError([Problem("shop", str(exc))], source) from None
    fill = _fill_from_plan(shop, plan, rows, up, running, capacity_all, used_running)
    if shop.crew.active:
        plain = None
        if plan.waiting_jobs.size:  # the shift without the crew's limits: how many could run
            plain = fill_shift(values.reshape(shape), hours.reshape(shape), capacity,
                               **args).planned_count
        _add_staffing(fill, shop, plan, rows, up, running, plain)
    return fill


def _add_staffing(fill: ShiftFill, shop: Shop, plan, rows, up, running, plain) -> None:
    """Operators per machine and per assignment, and the plan's staffing summary."""
    staffing, operators_of, main = shift_staffing(shop, plan, up, running, plain)
    fill.staffing = staffing
    fill.machines = [replace(m, operators=operators_of.get(m.machine, [])) for m in fill.machines]
    fill.assignments = [replace(a, operator=main.get(a.machine)) for a in fill.assignments]
    fill.running = [replace(r, operator=main.get(r.machine)) for r in fill.running]
    if staffing["shortage"] is not None:
        text = staffing["shortage"]["text"]
        for name in fill.waiting_jobs:
            reason = fill.waiting_reasons[name]
            if "go to other jobs" in reason.text:  # it fits by hours: the crew holds it back
                fill.waiting_reasons[name] = WaitReason(reason.competing_jobs, reason.machines,
                                                      f"{name}: {text}")


def _no_hours(shop: Shop, i: int, k: int) -> Problem:
    job, machine = shop.jobs[i], shop.machines[k]
    return Problem(f"{shop.describe_job(job.id)}, field 'run_hours'",
                   f"no run hours on {shop.describe_machine(machine.id)}: give the job's "
                   "run_hours or the pair's hours (needed to fill the shift; from a grid "
                   "file: a 'run hours' column, or 'dispatcher convert GRID SHOP.dshop "
                   "--hours HOURS.csv' with the hours of each job on each machine)")


def _infeasible_text(exc: ShiftInfeasibleError, names: list[str], mnames: list[str]) -> str:
    jobs = ", ".join(names[i] for i in exc.jobs)
    machines = ", ".join(mnames[k] for k in exc.machines) or "none"
    if exc.kind == "no_machine" and math.isnan(exc.needed):
        text = f"must-run job {jobs} fits on no machine: no available machine can run it"
    elif exc.kind == "no_machine":
        text = (f"must-run job {jobs} fits on no machine: it needs at least {exc.needed:g} h, "
                f"its machines ({machines}) have at most {exc.available:g} h free this shift")
    elif exc.kind == "pinned_over":
        text = (f"jobs {jobs} are pinned to {machines}: they need {exc.needed:g} h, it has "
                f"{exc.available:g} h free this shift")
    elif exc.kind == "total_hours":
        text = (f"must-run jobs {jobs} need at least {exc.needed:g} h (each on its quickest "
                f"machine) but their machines ({machines}) have {exc.available:g} h free")
    elif exc.kind == "pin_not_allowed":
        text = f"job {jobs} is pinned to {machines}, which cannot run it"
    else:
        text = (f"must-run jobs {jobs} cannot all fit in the hours of their machines "
                f"({machines}): no plan runs them all")
    return "infeasible: " + text


def _fill_from_plan(shop: Shop, plan: ShiftPlan, rows: list[int], up: list[int],
                    running: list[tuple[int, int]], capacity_all: np.ndarray,
                    used_running: np.ndarray) -> ShiftFill:
    names = [shop.jobs[i].name for i in rows]
    machines, assignments = [], []
    running_on: dict[int, list[str]] = {}
    for i, k in running:
        running_on.setdefault(k, []).append(shop.jobs[i].name)
    idle = []
    for col, k in enumerate(up):
        m = shop.machines[k]
        order = [names[int(n)] for n in plan.jobs_on_machine[col]]
        for n in plan.jobs_on_machine[col]:
            assignments.append(Assignment(names[int(n)], m.name, float(plan.values[n, col])))
        machines.append(MachineShift(m.name, order, float(used_running[k] + plan.hours_used[col]),
                                     float(capacity_all[k]), running_on.get(k, [])))
        if not order and k not in running_on:
            idle.append(m.name)
    reasons = {names[int(n)]: _wait_reason(plan, int(n), names, [shop.machines[k].name for k in up])
               for n in plan.waiting_jobs}
    run_list = []
    for i, k in running:
        j, m = shop.jobs[i], shop.machines[k]
        run_list.append(RunningJob(j.name, m.name, j.since.isoformat() if j.since else None,
                                   shop.value(j.id, m.id)))
    return ShiftFill(
        objective=plan.objective, total=float(plan.total), status=plan.status,
        status_text=plan.status_text, proven_optimal=plan.proven_optimal, bound=plan.bound,
        gap=plan.gap, machines=machines, assignments=assignments,
        waiting_jobs=[names[int(n)] for n in plan.waiting_jobs], idle_machines=idle,
        waiting_reasons=reasons, verified=plan.verify(), running=run_list,
        unavailable_machines=[m.name for m in shop.machines if m.state != UP],
        engine_plan=plan,
        rush_waiting=[names[int(n)] for n in plan.waiting_jobs if shop.jobs[rows[int(n)]].rush])


def _wait_reason(plan: ShiftPlan, n: int, names: list[str], mnames: list[str]) -> WaitReason:
    """Why a job waits, in terms a supervisor can check against the hours."""
    name = names[n]
    fits = np.flatnonzero(plan.allowed[n] & (plan.hours[n] <= plan.capacity))
    can = np.flatnonzero(plan.allowed[n])
    if can.size == 0:
        return WaitReason([name], [], f"{name}: no available machine can run it")
    if fits.size == 0:
        least = float(plan.hours[n, can].min())
        most = float(plan.capacity[can].max())
        return WaitReason([name], [mnames[k] for k in can],
                          f"{name}: needs at least {least:g} h, its machines have at most "
                          f"{most:g} h free this shift")
    others = [names[int(i)] for k in fits for i in plan.jobs_on_machine[k]]
    shown = ", ".join(mnames[k] for k in fits)
    return WaitReason([name] + others, [mnames[k] for k in fits],
                      f"{name}: the hours of its machines ({shown}) go to other jobs in the "
                      "best plan; it waits for the next shift")
