"""The k best plans of a shop, in shop terms (Qt-free).

The ranking is the engine's (:func:`dispatcher.engine.ranking.ranked_plans`, Murty's
partitioning); this module turns each ranked plan over the problem's rows and slot
columns back into a :class:`~dispatcher.shop.Plan` with job and machine names.
"""

from __future__ import annotations

from dispatcher.engine.ranking import ranked_plans
from dispatcher.shop import Assignment, Plan
from dispatcher.ui.whatif_data import Cancelled

#: At most this many engine plans per shop plan asked for are ranked to find distinct shop
#: plans (multi-slot machines repeat plans); it bounds the time on big shops.
ENGINE_PLANS_PER_PLAN = 16


def alternative_plans(plan: Plan, count: int, cancel=None) -> list[Plan]:
    """Up to ``count`` best distinct plans, best first (the first is ``plan`` itself).

    Raises ValueError for the bottleneck objective (the engine ranks total and maximize).
    """
    problem, result = plan.problem, plan.result
    if problem is None or result is None:
        raise ValueError("this plan carries no solver result to rank alternatives from")
    shop = problem.shop
    out: list[Plan] = []
    seen: set[frozenset] = set()
    # A machine with several slots is several engine columns: plans that differ only in
    # which slot a job takes are the same plan in the shop, so rank more engine plans
    # (growing, up to ENGINE_PLANS_PER_PLAN per plan) and skip those repeats.
    several = len(set(problem.columns)) < len(problem.columns)
    asked = count
    while True:
        ranked_list = ranked_plans(result, asked, groups=problem.columns)
        if cancel is not None and cancel.is_set():
            raise Cancelled("ranking cancelled")
        keys = []
        distinct: set[frozenset] = set()
        for ranked in ranked_list:
            key = frozenset((n, problem.columns[c])
                            for n, c in enumerate(ranked.machine_of_job.tolist()) if c >= 0)
            keys.append(key)
            distinct.add(key)
        if (not several or len(distinct) >= count or len(ranked_list) < asked
                or asked >= count * ENGINE_PLANS_PER_PLAN):
            break
        asked = min(asked * 4, count * ENGINE_PLANS_PER_PLAN)
    for ranked, key in zip(ranked_list, keys):
        if len(out) == count:
            break
        if key in seen:
            continue
        seen.add(key)
        rank = len(out) + 1
        if rank == 1:
            out.append(plan)
            continue
        assignments = []
        busy = {r.machine for r in plan.running}
        waiting = []
        for n, c in enumerate(ranked.machine_of_job.tolist()):
            if c >= 0:
                machine = problem.machine_name(c)
                assignments.append(Assignment(problem.job_name(n), machine, float(problem.values[n, c])))
                busy.add(machine)
            else:
                waiting.append(problem.job_name(n))
        unavailable = set(plan.unavailable_machines)
        idle = [m.name for m in shop.machines if m.name not in busy and m.name not in unavailable]
        out.append(Plan(objective=plan.objective, total=float(ranked.total), assignments=assignments,
                        waiting_jobs=waiting, idle_machines=idle, certificate={"rank": rank},
                        status="alternative", running=list(plan.running),
                        unavailable_machines=list(plan.unavailable_machines)))
    return out
