"""Whole-shift plans for shops with setup families: changeovers priced in run order.

:func:`dispatcher.shop.fill_shift.fill_shop_shift` hands over to :func:`fill_with_changeovers`
when the shop has changeover tables and job families (and values are setup times or
costs, not gains). The jobs' changes are priced along each machine's run order from the
family it has mounted (and into its end family), by
:func:`dispatcher.engine.plan_shift_runs`; the result is the same :class:`ShiftFill`
as today's whole-shift mode, with each machine's ``runs`` (the change before each job,
from and to which family, and planned start and end hours from the shift start) and the
proven bound and gap.

When the unit is setup minutes, changes take machine time (minutes / 60); pins are kept
(a job pinned to a machine may run only there and must run; a forbidden pair is left
out).
"""

from __future__ import annotations

import math

import numpy as np

from dispatcher.engine import (
    DispatchInputError,
    RunOrderInfeasibleError,
    plan_shift_runs,
)

from .model import DONE, MUST, MUST_NOT, RUNNING, UP, Problem, Shop, ShopError
from .plan import Assignment, RunningJob, WaitReason
from .runs import changeover_matrix
from .translate import ShopInfeasibleError

__all__ = ["fill_with_changeovers"]


def fill_with_changeovers(shop: Shop, *, extra_must_run=(), time_limit: float | None = None,
                          source: str = "", cancel=None, progress=None):
    """The whole-shift plan of a shop with families (see the module text).

    Raises :class:`ShopError` (located) for missing run hours, :class:`ShopInfeasibleError`
    when rush or pinned jobs cannot all run, and
    :class:`~dispatcher.engine.fill_shift.ShiftCancelled` when ``cancel`` (a
    ``threading.Event``) is set before or right after the search; ``progress`` is called
    with a short text per stage.
    """
    from dispatcher.engine.fill_shift import ShiftCancelled

    def stage(text: str) -> None:
        if cancel is not None and cancel.is_set():
            raise ShiftCancelled("cancelled")
        if progress is not None:
            progress(text)

    from .fill_shift import MachineShift, ShiftFill  # the container types of today's mode

    hours_all = shop.hours_matrix()
    mindex = {m.id: k for k, m in enumerate(shop.machines)}
    up = [k for k, m in enumerate(shop.machines) if m.state == UP]
    rows = [i for i, j in enumerate(shop.jobs) if j.state not in (RUNNING, DONE)]
    jobs = [shop.jobs[i] for i in rows]
    extra = set(extra_must_run)
    unknown = extra - {j.name for j in jobs}
    problems = [Problem(f"must-run job {n!r}", "is not a waiting job of this shop") for n in sorted(unknown)]
    capacity_all = shop.capacity() * np.array([m.slots for m in shop.machines], dtype=float)
    used_running = np.zeros(len(shop.machines))
    running = []
    for i, j in enumerate(shop.jobs):
        if j.state == RUNNING:
            k = mindex[j.machine]
            running.append((i, k))
            if not math.isnan(hours_all[i, k]):
                used_running[k] += hours_all[i, k]
    n, m = len(rows), len(up)
    ids = [j.id for j in jobs]
    change = np.full((m, n + 1, n + 1), np.nan)
    end = np.zeros((m, n + 1))
    hours = np.full((n, m), np.nan)
    for col, k in enumerate(up):
        mach = shop.machines[k]
        c, end_node = changeover_matrix(shop, mach.id, ids)
        change[col] = c[:n + 1, :n + 1]
        if end_node is not None:
            end[col] = c[:n + 1, end_node]
        for r, i in enumerate(rows):
            if not np.all(np.isnan(np.delete(c[:n + 1, r + 1], r + 1))):
                if math.isnan(hours_all[i, k]):
                    problems.append(Problem(f"{shop.describe_job(shop.jobs[i].id)}, field 'run_hours'",
                                            f"no run hours on {shop.describe_machine(mach.id)}: give the "
                                            "job's run_hours or the pair's hours (needed to fill the shift)"))
                else:
                    hours[r, col] = hours_all[i, k]
    if problems:
        raise ShopError(problems, source)
    must = np.array([j.rush or j.name in extra for j in jobs], dtype=bool)
    row_of = {jid: r for r, jid in enumerate(ids)}
    col_of = {shop.machines[k].id: col for col, k in enumerate(up)}
    for p in shop.pins:
        r, col = row_of.get(p.job), col_of.get(p.machine)
        if r is None or col is None:
            continue
        if p.kind == MUST:
            keep = hours[r, col]
            hours[r, :] = np.nan
            hours[r, col] = keep
            must[r] = True
        elif p.kind == MUST_NOT:
            hours[r, col] = np.nan
    capacity = np.maximum(capacity_all[up] - used_running[up], 0.0)
    penalty = np.array([j.wait_penalty for j in jobs], dtype=float)
    tau = 1 / 60 if shop.unit.kind == "setup_minutes" else 0.0
    stage("whole shift with changeovers: ordering the runs on each machine")
    try:
        plan = plan_shift_runs(change, hours, capacity, end_change=end, wait_penalty=penalty,
                               must_run=must, changeover_hours=tau,
                               time_limit=10.0 if time_limit is None else time_limit)
    except RunOrderInfeasibleError:
        names = [j.name for j in jobs if must[row_of[j.id]]]
        raise ShopInfeasibleError("infeasible: must-run jobs " + ", ".join(names) + " cannot all run "
                                  "within their machines' hours and allowed changeovers",
                                  names, [shop.machines[k].name for k in up], source) from None
    except DispatchInputError as exc:
        raise ShopError([Problem("shop", str(exc))], source) from None

    stage("whole shift with changeovers: " + ("proven optimal" if plan.proven_optimal else
                                               f"best found, gap {100 * plan.gap:.1f}%"))
    machines, assignments, idle = [], [], []
    running_on: dict[int, list[str]] = {}
    for i, k in running:
        running_on.setdefault(k, []).append(shop.jobs[i].name)
    for col, k in enumerate(up):
        mach = shop.machines[k]
        table = shop.table_of(mach.id)
        order = plan.orders[col]
        t = used_running[k]
        runs, prev, prev_family = [], 0, mach.mounted
        for r in order:
            job = jobs[r]
            ch = float(change[col, prev, r + 1])
            start = t + ch * tau
            stop = start + hours[r, col]
            runs.append({"job": job.name, "work_order": job.work_order,
                         "from_family": prev_family if table is not None else None,
                         "to_family": job.family if table is not None else None,
                         "changeover": _num(ch), "start_hour": _num(round(start, 6)),
                         "end_hour": _num(round(stop, 6))})
            assignments.append(Assignment(job.name, mach.name, ch))
            t, prev, prev_family = stop, r + 1, job.family
        end_change = float(end[col, prev]) if mach.end_family is not None else None
        used = t + (end_change * tau if end_change else 0.0)
        machines.append(MachineShift(mach.name, [jobs[r].name for r in order], float(used),
                                     float(capacity_all[k]), running_on.get(k, []), runs, end_change))
        if not order and k not in running_on:
            idle.append(mach.name)
    waiting = [jobs[r].name for r in range(n) if plan.machine_of_job[r] < 0]
    reasons = {jobs[r].name: _reason(shop, jobs[r], [shop.machines[k] for k in up], hours[r])
               for r in range(n) if plan.machine_of_job[r] < 0}
    run_list = [RunningJob(shop.jobs[i].name, shop.machines[k].name,
                           shop.jobs[i].since.isoformat() if shop.jobs[i].since else None,
                           shop.value(shop.jobs[i].id, shop.machines[k].id)) for i, k in running]
    status = "optimal" if plan.proven_optimal else "time_limit"
    text = ("proven optimal" if plan.proven_optimal else
            f"best plan found ({plan.method}); proven lower bound {plan.lower_bound:g}, "
            f"gap at most {100 * plan.gap:.1f}%")
    fill = ShiftFill(objective="total", total=plan.total, status=status, status_text=text,
                     proven_optimal=plan.proven_optimal, bound=plan.lower_bound, gap=plan.gap,
                     machines=machines, assignments=assignments, waiting_jobs=waiting,
                     idle_machines=idle, waiting_reasons=reasons, verified=True, running=run_list,
                     unavailable_machines=[mm.name for mm in shop.machines if mm.state != UP])
    return fill


def _num(x: float):
    from .plan import json_number
    return json_number(x)


def _reason(shop: Shop, job, machines, hours_row) -> WaitReason:
    """Why a job waits: its family in no table of the machines, or the hours are full."""
    if np.all(np.isnan(hours_row)):
        tables = {t.id for t in (shop.table_of(mm.id) for mm in machines) if t is not None}
        missing = [t for t in sorted(tables)
                   if job.family is not None and job.family not in
                   next(tt for tt in shop.changeover_tables if tt.id == t).families]
        if missing:
            return WaitReason([job.name], [], f"{job.name}: family {job.family!r} is not in changeover "
                              f"table {', '.join(map(repr, missing))}; no available machine can run it")
        return WaitReason([job.name], [], f"{job.name}: no available machine can run it")
    can = [mm.name for mm, h in zip(machines, hours_row, strict=True) if not np.isnan(h)]
    return WaitReason([job.name], can, f"{job.name}: the hours of its machines ({', '.join(can)}) are "
                      "taken by jobs that together cost less (changeovers and wait penalties)")
