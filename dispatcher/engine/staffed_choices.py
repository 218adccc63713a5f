"""What-if costs and ranked plans under staffing, by forced re-solves of the staffed plan.

"A plan" keeps the meaning of :func:`~dispatcher.engine.staffing.staffed_dispatch`: as
many jobs of each tier placed (must-run, kept, rush, all) as the machines and the crew
present permit. Forcing a job onto a machine (or to wait) is a re-solve with the job
made must-run on that machine alone (or with no machine); a forced plan that places
fewer jobs of some tier is not such a plan and the pair is reported impossible (NaN).
Because the staffed solve maximises the tier counts before the objective, the forced
optimum's counts say exactly whether any plan of that kind contains the pair.

Ranked plans use Murty's partitioning over the jobs' choices (a machine or waiting): the
best plan's choices ``c_1 .. c_n`` split the rest into subproblems "``c_1 .. c_{t-1}``
kept, ``c_t`` forbidden", each solved as a staffed plan, the best subproblem giving the
next plan. Plans are distinct as sets of (job, machine) pairs; which operator minds a
machine is the solver's choice within a plan, not another plan.

References
----------
Murty, K. G. (1968). An algorithm for ranking all the assignments in order of increasing
cost. Operations Research 16(3), 682-687. doi:10.1287/opre.16.3.682
Lawler, E. L. (1972). A procedure for computing the K best solutions to discrete
optimization problems and its application to the shortest path problem. Management
Science 18(7), 401-405. doi:10.1287/mnsc.18.7.401
"""

from __future__ import annotations

import heapq
import itertools

import numpy as np

from .assignment import InfeasibleError
from .staffing import _TIERS, TIER_KEEP, TIER_MUST, TIER_RUSH, StaffedPlan, staffed_dispatch

__all__ = ["ranked_staffed_plans", "staffed_what_if"]


def _tier_counts(plan: StaffedPlan, tier: np.ndarray) -> tuple[int, ...]:
    placed = plan.machine_of_job >= 0
    return tuple(int((placed & (tier == t)).sum()) for t in range(_TIERS))


def _solve(plan: StaffedPlan, allowed: np.ndarray, must: np.ndarray) -> StaffedPlan | None:
    """The staffed optimum with ``allowed`` and ``must`` (the plan's tiers otherwise), or
    None when it is infeasible or places fewer jobs of some original tier."""
    tier = plan.tier
    try:
        forced = staffed_dispatch(plan.values, allowed, qualified=plan.qualified,
                                  capacity=plan.capacity, needs_operator=plan.needs_operator,
                                  objective=plan.objective, wait_penalty=plan.wait_penalty,
                                  rush=tier == TIER_RUSH, must_run=must, keep=tier == TIER_KEEP,
                                  slots=plan.slots)
    except InfeasibleError:
        return None
    if _tier_counts(forced, tier) != tuple(plan.tier_counts):
        return None
    return forced


def _worse(plan: StaffedPlan, other: StaffedPlan) -> float:
    d = other.total - plan.total if plan.objective != "maximize" else plan.total - other.total
    return max(float(d), 0.0)


def staffed_what_if(plan: StaffedPlan, cancel=None) -> tuple[np.ndarray, np.ndarray]:
    """How much worse the best staffed plan gets with job i on machine m, or waiting.

    Parameters
    ----------
    plan : StaffedPlan
        An optimal plan from :func:`~dispatcher.engine.staffing.staffed_dispatch`.
    cancel : threading.Event, optional
        Checked before each job's re-solves; when set, the function returns early with
        the rest NaN (the caller reports the cancellation).

    Returns
    -------
    extra : array (jobs x machines)
        The rise in total (the fall in value for ``maximize``) of the best plan with the
        pair; 0 on the plan; NaN where no plan of the same kind contains the pair.
    wait_extra : array (jobs)
        The same for keeping the job waiting.

    References
    ----------
    Forced re-solves of the exact staffed plan (common practice for sensitivity of a
    combinatorial optimum); see the module docstring.
    """
    n_jobs, n_machines = plan.values.shape
    extra = np.full((n_jobs, n_machines), np.nan)
    wait_extra = np.full(n_jobs, np.nan)
    must0 = plan.tier == TIER_MUST
    mj = plan.machine_of_job
    for i in range(n_jobs):
        if cancel is not None and cancel.is_set():
            break
        for m in np.flatnonzero(plan.allowed[i]):
            if mj[i] == m:
                extra[i, m] = 0.0
                continue
            allowed = plan.allowed.copy()
            allowed[i] = False
            allowed[i, m] = True
            must = must0.copy()
            must[i] = True
            forced = _solve(plan, allowed, must)
            if forced is not None:
                extra[i, m] = _worse(plan, forced)
        if mj[i] < 0:
            wait_extra[i] = 0.0
        elif not must0[i]:
            allowed = plan.allowed.copy()
            allowed[i] = False
            forced = _solve(plan, allowed, must0)
            if forced is not None:
                wait_extra[i] = _worse(plan, forced)
    return extra, wait_extra


def ranked_staffed_plans(plan: StaffedPlan, count: int, cancel=None) -> list[StaffedPlan]:
    """Up to ``count`` best staffed plans, best first, distinct as (job, machine) pairs.

    Parameters
    ----------
    plan : StaffedPlan
        An optimal plan from :func:`~dispatcher.engine.staffing.staffed_dispatch` (it is
        the first one returned).
    count : int
        How many plans (>= 1).
    cancel : threading.Event, optional
        Checked before each subproblem; when set, the plans found so far are returned.

    Returns
    -------
    list of StaffedPlan
        Every plan places as many jobs of each tier as ``plan``; totals never improve
        along the list.

    References
    ----------
    Murty (1968); Lawler (1972): see the module docstring.
    """
    if count < 1:
        return []
    out = [plan]
    must0 = plan.tier == TIER_MUST
    n_jobs = plan.values.shape[0]
    tie = itertools.count()
    heap: list = []

    def key(p: StaffedPlan) -> float:
        return -p.total if p.objective == "maximize" else p.total

    def branch(base: StaffedPlan, allowed: np.ndarray, must: np.ndarray) -> None:
        allowed, must = allowed.copy(), must.copy()
        for i in range(n_jobs):
            if cancel is not None and cancel.is_set():
                return
            m = int(base.machine_of_job[i])
            # c_i forbidden, c_1 .. c_{i-1} kept
            sub_allowed, sub_must = allowed.copy(), must.copy()
            if m >= 0:
                sub_allowed[i, m] = False
            else:
                sub_must[i] = True
            if sub_must[i] and not sub_allowed[i].any():
                pass
            else:
                found = _solve(plan, sub_allowed, sub_must)
                if found is not None:
                    heapq.heappush(heap, (key(found), next(tie), found, sub_allowed, sub_must))
            # keep c_i for the next subproblems
            if m >= 0:
                row = np.zeros_like(allowed[i])
                row[m] = True
                allowed[i] &= row
                must[i] = True
            else:
                allowed[i] = False

    branch(plan, plan.allowed, must0)
    while heap and len(out) < count:
        if cancel is not None and cancel.is_set():
            break
        _, _, found, sub_allowed, sub_must = heapq.heappop(heap)
        out.append(found)
        branch(found, sub_allowed, sub_must)
    return out
