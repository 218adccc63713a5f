"""The k best plans, for the app's alternatives tab and ``solve --alternatives``.

The ranking is the engine's (:func:`dispatcher.engine.ranking.ranked_plans`, Murty's
partitioning over (job, machine) choices, so slots of one machine never make repeated
plans); :func:`ranked_choices` is the one call both use, and :func:`alternative_plans`
turns each ranked plan back into a :class:`~dispatcher.shop.Plan` with job and machine
names.
"""

from __future__ import annotations

from dataclasses import dataclass

from dispatcher.engine import DispatchResult
from dispatcher.engine.ranking import ranked_plans
from dispatcher.engine.staffed_choices import ranked_staffed_plans

from .plan import Assignment, Plan
from .planning import Cancelled


@dataclass(frozen=True)
class RankedChoice:
    """One ranked plan: its total and its (row, column) pairs of placed rows."""

    total: float
    pairs: tuple[tuple[int, int], ...]


def ranked_choices(result: DispatchResult, count: int, columns, cancel=None) -> list[RankedChoice]:
    """The ``count`` best plans of ``result``, best first, distinct as sets of (job,
    machine) pairs: ``columns[c]`` labels the machine of engine column c, and columns with
    one label are slots of one machine. Raises :class:`~dispatcher.shop.planning.Cancelled`
    when ``cancel`` is set."""
    ranked = ranked_plans(result, count, groups=list(columns), cancel=cancel)
    if cancel is not None and cancel.is_set():
        raise Cancelled("ranking cancelled")
    return [RankedChoice(float(p.total), tuple((j, int(c)) for j, c in enumerate(p.machine_of_job.tolist())
                                                if c >= 0))
            for p in ranked]


def alternative_plans(plan: Plan, count: int, cancel=None) -> list[Plan]:
    """Up to ``count`` best distinct plans, best first (the first is ``plan`` itself).

    Raises ValueError for the bottleneck objective (the engine ranks total and maximize)
    and :class:`~dispatcher.shop.planning.Cancelled` when ``cancel`` is set.
    """
    problem, result = plan.problem, plan.result
    if problem is None or result is None:
        raise ValueError("this plan carries no solver result to rank alternatives from")
    if plan.staffing is not None:
        return _staffed_alternatives(plan, count, cancel)
    shop = problem.shop
    out: list[Plan] = []
    busy_running = {r.machine for r in plan.running}
    unavailable = set(plan.unavailable_machines)
    for rank, choice in enumerate(ranked_choices(result, count, problem.columns, cancel), 1):
        if rank == 1:
            out.append(plan)
            continue
        busy = set(busy_running)
        assignments = []
        placed = set()
        for n, c in choice.pairs:
            machine = problem.machine_name(c)
            assignments.append(Assignment(problem.job_name(n), machine, float(problem.values[n, c])))
            busy.add(machine)
            placed.add(n)
        waiting = [problem.job_name(n) for n in range(len(problem.rows)) if n not in placed]
        idle = [m.name for m in shop.machines if m.name not in busy and m.name not in unavailable]
        out.append(Plan(objective=plan.objective, total=choice.total, assignments=assignments,
                        waiting_jobs=waiting, idle_machines=idle, certificate={"rank": rank},
                        status="alternative", running=list(plan.running),
                        unavailable_machines=list(plan.unavailable_machines)))
    return out


def _staffed_alternatives(plan: Plan, count: int, cancel=None) -> list[Plan]:
    """Ranked plans of a shop with a crew: each staffed (an operator on every running
    machine), with its own staffing summary (:func:`ranked_staffed_plans`)."""
    from dataclasses import replace

    from .staffed import _plan, staffing_inputs

    problem = plan.problem
    ranked = ranked_staffed_plans(plan.result, count, cancel)
    if cancel is not None and cancel.is_set():
        raise Cancelled("ranking cancelled")
    x = staffing_inputs(problem)
    out = [plan]
    for rank, sp in enumerate(ranked[1:], start=2):
        p = _plan(problem, sp, x)
        out.append(replace(p, certificate={"rank": rank, "verified": p.certificate["verified"]},
                           status="alternative"))
    return out
