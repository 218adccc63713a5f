"""The plan in force of a shop document: checked like every input, read back as a Plan.

A shop document's ``plan_in_force`` (machine id -> job ids, running jobs first) is the
plan the supervisor confirmed. The sheet, ``convert --plan`` and ``redispatch`` start from
it, so it is checked as carefully as the rest of the document: every machine and job id
must exist, a job may stand on one machine only, a machine may not hold more jobs than it
has slots, and a dispatched job stands on a machine that can run it. What changed since
the plan was confirmed is not an error: a job done since then drops out, a running job
stays where it runs, a job on a machine now down (or pinned away since) waits.
Every problem is reported with its place (``plan in force, machine id 'A' (Press A)``).

:func:`plan_in_force` reads the plan in force as a :class:`~.plan.Plan` in shop names,
evaluated on the shop as it is now: a job whose machine in force is not up (down since the
plan was confirmed) counts as waiting. Its ``status`` is ``"in force"``.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence

import numpy as np

from dispatcher.engine.matching import hall_witness_groups, maximum_matching

from .model import DONE, RUNNING, UP, Problem, Shop, ShopError
from .plan import Assignment, Plan, RunningJob, WaitReason
from .translate import build_problem

__all__ = ["in_force_problems", "check_in_force", "plan_in_force"]


def in_force_problems(shop: Shop, pif: Mapping[str, Sequence[str]] | None = None,
                      what: str = "plan in force") -> list[Problem]:
    """Every problem of ``pif`` (default: the shop's plan in force) against ``shop``."""
    pif = shop.plan_in_force if pif is None else pif
    machines = {m.id: m for m in shop.machines}
    jobs = {j.id: j for j in shop.jobs}
    seen: dict[str, str] = {}
    problems: list[Problem] = []
    for mid, jids in pif.items():
        m = machines.get(mid)
        where = f"{what}, machine id {mid!r}" + (f" ({m.name})" if m else "")
        if m is None:
            problems.append(Problem(where, "is not a machine of the shop"))
            continue
        if len(jids) > m.slots:
            problems.append(Problem(where, f"holds {len(jids)} jobs but the machine has "
                                    f"{m.slots} slot(s)"))
        for jid in jids:
            j = jobs.get(jid)
            if j is None:
                problems.append(Problem(where, f"job id {jid!r} is not a job of the shop"))
                continue
            label = f"job {j.name!r} (id {jid})"
            if jid in seen:
                problems.append(Problem(where, f"{label} is also on machine id {seen[jid]!r}: "
                                        "a job stands on one machine"))
                continue
            seen[jid] = mid
            if j.state not in (DONE, RUNNING) and shop.value(jid, mid) is None:
                problems.append(Problem(where, f"{label}: the machine cannot run it "
                                        "(no value in the grid)"))
    return problems


def check_in_force(shop: Shop, pif: Mapping[str, Sequence[str]] | None = None,
                   source: str = "", what: str = "plan in force") -> None:
    """Raise :class:`ShopError` listing every problem of the plan in force (none: return)."""
    problems = in_force_problems(shop, pif, what)
    if problems:
        raise ShopError(problems, source)


def plan_in_force(shop: Shop, source: str = "") -> Plan | None:
    """The shop's plan in force as a Plan in shop names (None when the document has none).

    Raises :class:`ShopError` when the plan in force does not fit the shop (see the module
    docstring). Waiting jobs get their Hall witness when the plan in force places as many
    jobs as possible (it does when it came from a plan of this shop); otherwise the
    reason says a machine could still take them.
    """
    if not shop.plan_in_force:
        return None
    check_in_force(shop, source=source)
    problem = build_problem(shop, source=source)
    jpos = {shop.jobs[i].id: n for n, i in enumerate(problem.rows)}
    free: dict[str, list[int]] = {}
    for c, k in enumerate(problem.columns):
        free.setdefault(shop.machines[k].id, []).append(c)
    machine_of_job = np.full(len(problem.rows), -1, dtype=np.int64)
    for mid, jids in shop.plan_in_force.items():
        if shop.machine(mid).state != UP:
            continue
        for jid in jids:
            n = jpos.get(jid)
            if n is None or not free.get(mid):
                continue
            c = free[mid].pop(0)
            if problem.allowed[n, c]:
                machine_of_job[n] = c
    assignments = [Assignment(problem.job_name(n), problem.machine_name(int(c)),
                              float(problem.values[n, c]))
                   for n, c in enumerate(machine_of_job) if c >= 0]
    running = []
    busy = {problem.columns[int(c)] for c in machine_of_job if c >= 0}
    for i, k in problem.running:
        j, m = shop.jobs[i], shop.machines[k]
        busy.add(k)
        running.append(RunningJob(j.name, m.name, j.since.isoformat() if j.since else None,
                                  shop.value(j.id, m.id)))
    waiting_rows = np.flatnonzero(machine_of_job < 0)
    reasons = _reasons(problem, machine_of_job)
    placed = machine_of_job >= 0
    setups = float(sum(a.cost for a in assignments))
    penalties = float(problem.wait_penalty[~placed].sum())
    unavailable = set(problem.unavailable)
    plan = Plan(
        objective="total",
        total=setups + penalties,
        assignments=assignments,
        waiting_jobs=[problem.job_name(int(n)) for n in waiting_rows],
        idle_machines=[m.name for k, m in enumerate(shop.machines)
                       if k not in busy and k not in unavailable],
        waiting_reasons=reasons,
        certificate={"verified": False,
                     "text": "the plan in force, as confirmed (not re-solved)"},
        status="in force",
        running=running,
        unavailable_machines=[shop.machines[k].name for k in problem.unavailable],
        problem=problem,
    )
    rush = problem.rush if problem.rush is not None else np.zeros(len(problem.rows), dtype=bool)
    plan.rush_waiting = [problem.job_name(int(n)) for n in np.flatnonzero(rush & ~placed)]
    return plan


def _reasons(problem, machine_of_job: np.ndarray) -> dict[str, WaitReason]:
    """Hall witnesses of the waiting jobs if the plan in force is a maximum matching."""
    out: dict[str, WaitReason] = {}
    waiting = np.flatnonzero(machine_of_job < 0)
    if waiting.size == 0:
        return out
    maximum = int((maximum_matching(problem.allowed) >= 0).sum()) == int((machine_of_job >= 0).sum())
    if not maximum:
        for n in waiting:
            name = problem.job_name(int(n))
            out[name] = WaitReason([name], [], f"{name}: not dispatched in the plan in force "
                                   "(a free machine could take it: re-plan to use it)")
        return out
    for w in hall_witness_groups(problem.allowed, machine_of_job):
        jobs = [problem.job_name(int(i)) for i in w.jobs]
        machines = list(dict.fromkeys(problem.machine_name(int(c)) for c in w.machines))
        for n in w.jobs[machine_of_job[w.jobs] < 0]:
            name = problem.job_name(int(n))
            if machines:
                text = (f"{name}: {len(jobs)} jobs can only use {len(w.machines)} free slot(s) "
                        f"on {len(machines)} machine(s) ({', '.join(machines)}), so "
                        f"{w.deficiency} of them must wait")
            else:
                text = f"{name}: no available machine can run it"
            out[name] = WaitReason(jobs, machines, text)
    return {problem.job_name(int(n)): out[problem.job_name(int(n))] for n in waiting}
