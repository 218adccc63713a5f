"""Whole-shift plans with a crew: several jobs per machine within its hours, and an
operator's hours over the shift minding the machines while they run.

The shift is cut into periods at every time an operator arrives or leaves, so that the
operators present are the same throughout a period. In period ``t`` of ``L[t]`` hours:

* machine ``m`` is busy ``r[m, t] <= L[t]`` hours, and over the shift it is busy
  ``(running hours + hours of its planned jobs) / slots`` hours (a machine with two slots
  runs two jobs side by side under one operator); machines that need no operator are
  not staffed;
* operator ``o`` minds machine ``m`` for ``w[o, m, t] <= L[t]`` hours, only when present
  in ``t`` and authorised for ``m``, and at most ``capacity[o] * L[t]`` machine-hours in
  the period (``capacity`` machines at once);
* every busy hour is minded: ``sum_o w[o, m, t] = r[m, t]``. Hours of jobs already
  running that no operator present can mind are allowed (``uncovered``), never planned
  away: the plan reports them, and a running machine is stopped only by the site's
  procedure.

Within one period these amounts are a timetable: split each operator into ``capacity``
hands and spread their hours by McNaughton's wrap-around rule (each hand at most ``L[t]``
hours, no machine on two hands at once), then hands and machines, each loaded at most
``L[t]``, have a preemptive open-shop schedule of length ``L[t]`` (Gonzalez and Sahni
1976). A machine's work may therefore pass from one operator to another, and pause while
nobody minds it, within the period.

Order of aims: the fewest uncovered running hours, then as many jobs as possible, then
as many priority (rush) jobs, then the least setup plus wait penalties (or the most
value less penalties); must-run and pinned jobs run or the plan is refused. Each aim is
one HiGHS MILP (scipy ``milp``) with the earlier aims' optima as constraints.

References
----------
McNaughton, R. (1959). Scheduling with deadlines and loss functions. Management Science
6(1), 1-12. doi:10.1287/mnsc.6.1.1
Gonzalez, T. and Sahni, S. (1976). Open shop scheduling to minimize finish time. J. ACM
23(4), 665-679. doi:10.1145/321978.321985
Huangfu, Q. and Hall, J. A. J. (2018). Parallelizing the dual revised simplex method.
Mathematical Programming Computation 10, 119-142. doi:10.1007/s12532-017-0130-5
"""

from __future__ import annotations

import time
from dataclasses import dataclass, field

import numpy as np
from scipy.optimize import Bounds, LinearConstraint
from scipy.sparse import coo_array, hstack

from .assignment import DispatchInputError
from .fill_shift import (
    STATUS_OPTIMAL,
    STATUS_TIME_LIMIT,
    ShiftInfeasibleError,
    ShiftPlan,
    _build_model,
    _checked_problem,
    _diagnose,
    _job_mask,
    _milp,
    _plan_total,
    _Search,
    run_order,
)

__all__ = ["StaffedShiftPlan", "shift_periods", "staffed_fill_shift"]

_TOL = 1e-6


@dataclass(frozen=True)
class StaffedShiftPlan(ShiftPlan):
    """A shift plan with the crew's hours, and what is proven about it.

    Besides :class:`~dispatcher.engine.fill_shift.ShiftPlan`'s fields: ``minding[o, m, t]``
    hours operator o minds machine m in period t; ``uncovered[m]`` busy hours of machine
    m's running jobs that nobody present can mind; ``busy[m]`` the machine's busy hours
    (running and planned work divided by its slots); and the crew as given.
    """

    minding: np.ndarray = field(default=None)
    uncovered: np.ndarray = field(default=None)
    busy: np.ndarray = field(default=None)
    qualified: np.ndarray = field(default=None)
    present: np.ndarray = field(default=None)
    period_hours: np.ndarray = field(default=None)
    capacity_of_operator: np.ndarray = field(default=None)
    needs_operator: np.ndarray = field(default=None)
    slots: np.ndarray = field(default=None)
    running_hours: np.ndarray = field(default=None)

    def minded_hours(self) -> np.ndarray:
        """operators x machines: hours over the shift."""
        return self.minding.sum(axis=2)

    def verify(self) -> bool:
        """Re-check the shift rules (:meth:`ShiftPlan.verify`) and the crew's hours."""
        if not super().verify():
            return False
        w, L = self.minding, self.period_hours
        n_ops, n_machines, n_t = w.shape
        tol = _TOL * max(1.0, float(L.sum()))
        may = self.qualified[:, :, None] & self.needs_operator[None, :, None] & self.present[:, None, :]
        if (w < -tol).any() or (w[~may] > tol).any() or (w > L[None, None, :] + tol).any():
            return False
        if (w.sum(axis=1) > self.capacity_of_operator[:, None] * L[None, :] + tol).any():
            return False
        busy = (self.running_hours + self.hours_used) / self.slots
        if not np.allclose(busy, self.busy, atol=tol):
            return False
        if (self.uncovered < -tol).any() or (self.uncovered > self.running_hours / self.slots + tol).any():
            return False
        covered = np.minimum(w.sum(axis=0), L[None, :]).sum(axis=1)
        need = self.needs_operator
        if (covered[need] + self.uncovered[need] < busy[need] - tol).any():
            return False
        return bool((busy[need] <= L.sum() + tol).all())


def shift_periods(hours: float, arrives, leaves) -> tuple[np.ndarray, np.ndarray]:
    """Periods of a shift cut at every arrival and departure, and who is present in each.

    Parameters
    ----------
    hours : float
        Length of the shift (> 0).
    arrives, leaves : arrays (operators)
        Hours from the shift's start when each operator arrives and leaves (NaN: from
        the start, to the end); values are clipped to the shift.

    Returns
    -------
    period_hours : array (periods)
        Lengths, each > 0, summing to ``hours``.
    present : bool array (operators x periods)

    References
    ----------
    None: cutting a horizon at its events (common practice).
    """
    a = np.clip(np.nan_to_num(np.asarray(arrives, float), nan=0.0), 0.0, hours)
    lv = np.clip(np.nan_to_num(np.asarray(leaves, float), nan=hours), 0.0, hours)
    cuts = np.unique(np.r_[0.0, hours, a, lv])
    cuts = cuts[(cuts >= 0) & (cuts <= hours)]
    lengths = np.diff(cuts)
    keep = lengths > 1e-9
    starts, ends = cuts[:-1][keep], cuts[1:][keep]
    present = (a[:, None] <= starts[None, :] + 1e-9) & (lv[:, None] >= ends[None, :] - 1e-9)
    return ends - starts, present


def staffed_fill_shift(values, hours, capacity, *, qualified, present, period_hours,
                       operator_capacity=None, needs_operator=None, slots=None,
                       running_hours=None, allowed=None, maximize: bool = False,
                       time_limit: float | None = None, wait_penalty=None, must_run=None,
                       pins=None, rush=None, due=None, priority=None) -> StaffedShiftPlan:
    """Best whole-shift plan whose machines are minded by the crew present while they run.

    Parameters
    ----------
    values, hours, capacity, allowed, maximize, time_limit, wait_penalty, must_run, pins,
    rush, due, priority
        As for :func:`dispatcher.engine.fill_shift.fill_shift` (``capacity``: each
        machine's free hours, its running jobs' hours already taken off).
    qualified : bool array (operators x machines)
        Authorised (and not expired) for the machine.
    present : bool array (operators x periods)
        Present throughout the period (see :func:`shift_periods`).
    period_hours : array (periods)
        Length of each period in hours (> 0).
    operator_capacity : int array (operators), optional
        Machines an operator minds at once (default 1).
    needs_operator : bool array (machines), optional
        False for machines that run unattended (default: all need one).
    slots : int array (machines), optional
        Jobs a machine runs side by side (default 1): its busy hours are its work divided
        by its slots.
    running_hours : array (machines), optional
        Hours of the jobs already running on each machine (to be minded as well).

    Returns
    -------
    StaffedShiftPlan
        Call :meth:`StaffedShiftPlan.verify` to re-check it.

    Raises
    ------
    DispatchInputError
        Numbers that do not describe a staffed shift.
    ShiftInfeasibleError
        Must-run or pinned jobs cannot all run with the machines' or the crew's hours
        (``kind="crew"`` when the crew is the reason).

    Notes
    -----
    Variables: one binary per usable (job, machine) pair, one continuous busy-hours
    variable per (machine, period), one minding variable per (operator, machine, period)
    that may be minded, one uncovered-hours variable per machine with running work.
    Four MILPs in sequence (see the module docstring).

    References
    ----------
    See the module docstring (McNaughton 1959; Gonzalez and Sahni 1976; Huangfu and
    Hall 2018).

    Examples
    --------
    >>> import numpy as np
    >>> plan = staffed_fill_shift([[1.0, 2.0], [1.0, 2.0]], [[4, 4], [4, 4]], [8, 8],
    ...                           qualified=np.array([[True, True]]),
    ...                           present=np.array([[True]]), period_hours=[8.0])
    >>> plan.planned_count, plan.verify()
    (2, True)
    """
    started = time.perf_counter()
    if time_limit is not None and not (np.isfinite(time_limit) and time_limit > 0):
        raise DispatchInputError(f"time_limit must be a number of seconds > 0, got {time_limit!r}")
    problem = _checked_problem(values, hours, capacity, allowed=allowed, maximize=maximize,
                               wait_penalty=wait_penalty, must_run=must_run, all_jobs=False,
                               pins=pins, rush=rush, due=due, machine_factor=None)
    n_jobs, n_machines = problem.shape
    problem.priority = _job_mask(priority, n_jobs, "priority") if priority is not None \
        else np.zeros(n_jobs, dtype=bool)
    crew = _check_crew(n_machines, qualified, present, period_hours, operator_capacity,
                       needs_operator, slots, running_hours)
    qual, pres, L, cap, needs, slot, run_h = crew
    _diagnose(problem.usable, problem.hours, problem.capacity, problem.must, problem.pinned,
              problem.mask)
    model = _build_model(problem)
    search = _Search(started, time_limit, None, None)
    x, w, u, proven, count_proven, bound_min = _solve(problem, model, crew, search)
    machine_of_job = np.full(n_jobs, -1, dtype=np.int64)
    chosen = x > 0.5
    machine_of_job[model.job_of_var[chosen]] = model.machine_of_var[chosen]
    total = _plan_total(problem.values, machine_of_job, problem.penalty, problem.objective)
    bound = total if proven else (-bound_min if problem.maximize else bound_min)
    gap = abs(total - bound) / max(abs(total), 1.0)
    placed = machine_of_job >= 0
    hours_used = np.bincount(machine_of_job[placed],
                             weights=problem.hours[np.flatnonzero(placed), machine_of_job[placed]],
                             minlength=n_machines).astype(float)
    order = tuple(run_order(np.flatnonzero(machine_of_job == j), problem.rush, problem.due)
                  for j in range(n_machines))
    text = "proven optimal" if proven else (
        f"best found within {time_limit:g} s; proven gap {gap:.2%}"
        + ("" if count_proven else "; the number of jobs run is not proven maximal"))
    return StaffedShiftPlan(
        machine_of_job=machine_of_job, total=total, proven_optimal=bool(proven), bound=bound,
        gap=gap, status=STATUS_OPTIMAL if proven else STATUS_TIME_LIMIT, status_text=text,
        objective=problem.objective, jobs_on_machine=order, hours_used=hours_used,
        capacity=problem.capacity, values=problem.values, hours=problem.hours,
        allowed=problem.mask & ~problem.forbidden, wait_penalty=problem.penalty,
        must_run=problem.must, pinned_machine=problem.pinned,
        count_proven_maximal=bool(count_proven), seconds=time.perf_counter() - started,
        minding=w, uncovered=u, busy=(run_h + hours_used) / slot, qualified=qual, present=pres,
        period_hours=L, capacity_of_operator=cap, needs_operator=needs, slots=slot,
        running_hours=run_h)


def _check_crew(n_machines, qualified, present, period_hours, operator_capacity,
                needs_operator, slots, running_hours):
    qual = np.asarray(qualified, dtype=bool)
    if qual.ndim != 2 or qual.shape[1] != n_machines:
        raise DispatchInputError(f"qualified must be operators x {n_machines} machines, got shape {qual.shape}")
    n_ops = qual.shape[0]
    L = np.asarray(period_hours, dtype=float).reshape(-1)
    if L.size == 0 or not np.isfinite(L).all() or (L <= 0).any():
        raise DispatchInputError("period_hours must be one or more numbers > 0")
    pres = np.asarray(present, dtype=bool)
    if pres.shape != (n_ops, L.size):
        raise DispatchInputError(f"present must be {n_ops} operators x {L.size} periods, got {pres.shape}")
    cap = np.ones(n_ops, np.int64) if operator_capacity is None \
        else np.asarray(operator_capacity).reshape(-1)
    if cap.shape != (n_ops,) or (cap < 1).any() or not np.equal(np.mod(cap, 1), 0).all():
        raise DispatchInputError(f"operator_capacity needs {n_ops} whole numbers >= 1")
    needs = np.ones(n_machines, bool) if needs_operator is None \
        else np.asarray(needs_operator, bool).reshape(-1)
    slot = np.ones(n_machines, np.int64) if slots is None else np.asarray(slots).reshape(-1)
    run_h = np.zeros(n_machines) if running_hours is None \
        else np.asarray(running_hours, float).reshape(-1)
    for name, arr in (("needs_operator", needs), ("slots", slot), ("running_hours", run_h)):
        if arr.shape != (n_machines,):
            raise DispatchInputError(f"{name} needs {n_machines} entries, got {arr.size}")
    if (slot < 1).any():
        raise DispatchInputError("slots must be whole numbers >= 1")
    if not np.isfinite(run_h).all() or (run_h < 0).any():
        raise DispatchInputError("running_hours must be finite numbers >= 0")
    return qual, pres, L, cap.astype(np.int64), needs, slot.astype(np.int64), run_h


def _solve(problem, model, crew, search):
    """The four aims as MILPs on one variable layout (see the module docstring)."""
    qual, pres, L, cap, needs, slot, run_h = crew
    n_jobs, n_machines = problem.shape
    n_ops, n_t = pres.shape
    n_x = model.size
    need_m = np.flatnonzero(needs)
    # r[m, t] for machines that need an operator
    r_m, r_t = np.repeat(need_m, n_t), np.tile(np.arange(n_t), need_m.size)
    n_r = r_m.size
    may = qual[:, :, None] & needs[None, :, None] & pres[:, None, :]
    w_o, w_m, w_t = np.nonzero(may)
    n_w = w_o.size
    u_m = need_m[run_h[need_m] > 0]
    n_u = u_m.size
    nv = n_x + n_r + n_w + n_u
    xi, ri, wi, ui = (np.arange(n_x), n_x + np.arange(n_r), n_x + n_r + np.arange(n_w),
                      n_x + n_r + n_w + np.arange(n_u))

    def block(rows, cols, data, n_rows):
        return coo_array((np.asarray(data, float), (np.asarray(rows, np.int64), np.asarray(cols, np.int64))),
                         shape=(n_rows, nv))

    cons = []
    for c in model.constraints:  # the shift model's job and machine-hour rows, padded
        a = coo_array(c.A)
        cons.append(LinearConstraint(hstack([a, coo_array((a.shape[0], nv - n_x))]), c.lb, c.ub))
    pos = {int(m): k for k, m in enumerate(need_m)}
    if need_m.size:
        # busy hours: sum_t r + u - sum_j hours/slots x = running/slots
        on_need = np.isin(model.machine_of_var, need_m)
        xr = np.array([pos[int(m)] for m in model.machine_of_var[on_need]], np.int64)
        xs = -problem.hours[model.job_of_var[on_need], model.machine_of_var[on_need]] \
            / slot[model.machine_of_var[on_need]]
        rr = np.array([pos[int(m)] for m in r_m], np.int64)
        ur = np.array([pos[int(m)] for m in u_m], np.int64)
        a = block(np.r_[xr, rr, ur], np.r_[xi[on_need], ri, ui], np.r_[xs, np.ones(n_r), np.ones(n_u)],
                  need_m.size)
        rhs = run_h[need_m] / slot[need_m]
        cons.append(LinearConstraint(a, rhs, rhs))
        # minded: sum_o w[o, m, t] = r[m, t] (nobody minds a machine while it stands)
        row_of_mt = {(int(m), int(t)): k for k, (m, t) in enumerate(zip(r_m, r_t))}
        wr = np.array([row_of_mt[(int(m), int(t))] for m, t in zip(w_m, w_t)], np.int64)
        a = block(np.r_[wr, np.arange(n_r)], np.r_[wi, ri], np.r_[np.ones(n_w), -np.ones(n_r)], n_r)
        cons.append(LinearConstraint(a, 0.0, 0.0))
    if n_w:
        # an operator minds at most capacity machines at once: sum_m w[o, m, t] <= cap L[t]
        a = block(w_o * n_t + w_t, wi, np.ones(n_w), n_ops * n_t)
        cons.append(LinearConstraint(a, -np.inf, (cap[:, None] * L[None, :]).reshape(-1)))
    if nv == 0:  # nothing can run and nothing runs: every job waits
        if problem.must.any():
            raise _infeasible(problem)
        return (np.zeros(0), np.zeros((n_ops, n_machines, n_t)), np.zeros(n_machines), True, True,
                model.const)
    lower = np.r_[model.lower, np.zeros(n_r + n_w + n_u)]
    upper = np.r_[np.ones(n_x), L[r_t], L[w_t], run_h[u_m] / slot[u_m]]
    bounds = Bounds(lower, upper)
    integrality = np.r_[np.ones(n_x), np.zeros(n_r + n_w + n_u)]
    proven = count_proven = True

    def run(c, extra, share):
        nonlocal proven
        left = search.time_left()
        res = _milp(c, integrality, bounds, cons + extra, None if left is None else left * share)
        if res.status == 2:
            raise _infeasible(problem)
        if res.status != 0:
            proven = False
        return res

    extra = []
    if n_u:  # aim 1: the fewest uncovered running hours
        c = np.zeros(nv)
        c[ui] = 1.0
        res = run(c, extra, 0.25)
        if res.x is not None:
            row = np.zeros(nv)
            row[ui] = 1.0
            extra.append(LinearConstraint(row[None, :], -np.inf,
                                          float(res.x[ui].sum()) + 1e-7 * max(1.0, L.sum())))
    if n_x and not problem.must.all():  # aims 2 and 3: most jobs, then most priority jobs
        prio = problem.priority[model.job_of_var] & ~problem.must[model.job_of_var]
        weight = float(prio.sum() + 1)
        c = np.zeros(nv)
        c[xi] = -(weight + prio.astype(float))
        res = run(c, extra, 0.5)
        if res.status != 0:
            count_proven = False
        if res.x is not None:
            xs = np.round(res.x[xi])
            row = np.zeros(nv)
            row[xi] = 1.0
            extra.append(LinearConstraint(row[None, :], float(xs.sum()) - 0.5, np.inf))
            if prio.any():
                row = np.zeros(nv)
                row[xi] = prio.astype(float)
                extra.append(LinearConstraint(row[None, :], float(xs[prio].sum()) - 0.5, np.inf))
    c = np.zeros(nv)
    c[xi] = model.coef
    res = run(c, extra, 1.0)
    if res.x is None:
        if problem.must.any():
            raise search.no_plan(problem.must)
        x_all = np.zeros(nv)
        x_all[ui] = upper[ui]  # nothing planned: running hours nobody minds stay uncovered
        # (a feasible point: the busy rows hold with r = w = 0 only if u covers the running
        # work, and u's bound is exactly that)
        proven = count_proven = False
        bound_min = float(model.coef[model.coef < 0].sum()) + model.const
    else:
        x_all = res.x
        dual = getattr(res, "mip_dual_bound", None)
        if dual is None or not np.isfinite(dual):
            dual = float(model.coef[model.coef < 0].sum())
        bound_min = float(dual) + model.const
    x = np.round(x_all[xi])
    w = np.zeros((n_ops, n_machines, n_t))
    w[w_o, w_m, w_t] = np.clip(x_all[wi], 0.0, None)
    u = np.zeros(n_machines)
    u[u_m] = np.clip(x_all[ui], 0.0, None)
    return x, w, u, proven, count_proven, bound_min


def _infeasible(problem) -> ShiftInfeasibleError:
    must = np.flatnonzero(problem.must)
    machines = np.flatnonzero(problem.usable[must].any(axis=0)) if must.size else np.zeros(0, np.int64)
    return ShiftInfeasibleError("must-run jobs cannot all run with the machines' hours and the "
                                "crew's hours", must, machines, kind="crew")
