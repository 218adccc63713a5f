"""Turn a shop into an engine problem, solve it, and read the result back as a Plan.

The rules (the definition the tests check by brute force):

* done jobs take no part; running jobs stay on their machine and use up one of its slots;
* only machines that are ``up`` take jobs; an up machine with ``slots`` k and r running jobs
  offers k - r identical columns (a machine that can take several jobs at once);
* a ``must`` pin restricts the job to that machine's columns and makes it a priority job,
  as a rush job; a ``must_not`` pin removes the pair;
* rush (and pinned) jobs are a priority, not a constraint: the plan places as many jobs
  as possible, among those as many rush jobs as possible, then the best total; the rush
  jobs left waiting are named with the machines they compete for. Only jobs named as
  must-run (``--must-run`` on the command line) are a hard constraint;
* every waiting job's ``wait_penalty`` is the value of leaving it waiting;
* the engine (:func:`dispatcher.engine.solve`) then places as many of the waiting jobs as
  those columns permit, all must-run jobs among them, at the best total.
"""

from __future__ import annotations

from collections.abc import Iterable
from dataclasses import dataclass

import numpy as np

from dispatcher.engine import DispatchResult, InfeasibleError, solve
from dispatcher.errors import Infeasible

from .model import DONE, MUST, MUST_NOT, RUNNING, UP, Problem, Shop, ShopError
from .plan import Assignment, Plan, RushGroup, RunningJob, WaitReason
from .validate import check_shop


class ShopInfeasibleError(Infeasible):
    """Jobs named as must-run cannot all be placed. Names jobs and machines.

    ``jobs`` and ``machines`` are names; ``source`` (the shop file, when known) prefixes
    the message.
    """

    def __init__(self, message: str, jobs: list[str], machines: list[str], source: str = ""):
        super().__init__(message, jobs, machines, source=source)


@dataclass
class ShopProblem:
    """The engine problem of a shop.

    Rows are the waiting jobs (``rows[i]`` is an index into ``shop.jobs``); columns are free
    machine slots (``columns[c]`` is an index into ``shop.machines``; a machine with two free
    slots appears twice). ``values``/``allowed``/``wait_penalty``/``must_run`` are exactly
    what is passed to :func:`dispatcher.engine.solve`.
    """

    shop: Shop
    rows: list[int]
    columns: list[int]
    values: np.ndarray
    allowed: np.ndarray
    wait_penalty: np.ndarray
    must_run: np.ndarray
    running: list[tuple[int, int]]
    unavailable: list[int]
    rush: np.ndarray | None = None

    def machine_name(self, column: int) -> str:
        return self.shop.machines[self.columns[column]].name

    def job_name(self, row: int) -> str:
        return self.shop.jobs[self.rows[row]].name

    def job_name_to_row(self, name: str) -> int:
        return next(n for n, i in enumerate(self.rows) if self.shop.jobs[i].name == name)


def build_problem(shop: Shop, *, extra_must_run: Iterable[str] = (), source: str = "") -> ShopProblem:
    """The engine problem for ``shop`` (checked first: raises :class:`ShopError`).

    ``extra_must_run`` names further jobs (by name, or by work order) that must not
    wait this round: a hard constraint, unlike the rush flag.
    """
    check_shop(shop, source)
    values_all, allowed_all = shop.matrix()
    mindex = {m.id: k for k, m in enumerate(shop.machines)}
    running: list[tuple[int, int]] = []
    used = np.zeros(len(shop.machines), dtype=int)
    for i, j in enumerate(shop.jobs):
        if j.state == RUNNING:
            k = mindex[j.machine]
            running.append((i, k))
            used[k] += 1
    columns: list[int] = []
    unavailable: list[int] = []
    for k, m in enumerate(shop.machines):
        if m.state != UP:
            unavailable.append(k)
            continue
        columns.extend([k] * max(m.slots - int(used[k]), 0))
    rows = [i for i, j in enumerate(shop.jobs) if j.state not in (RUNNING, DONE)]
    extra = _must_run_names(shop, rows, extra_must_run, source)

    cols = np.array(columns, dtype=np.int64)
    r = np.array(rows, dtype=np.int64)
    values = values_all[np.ix_(r, cols)] if len(rows) and len(columns) else np.zeros((len(rows), len(columns)))
    allowed = allowed_all[np.ix_(r, cols)] if len(rows) and len(columns) else np.zeros(values.shape, dtype=bool)
    allowed = allowed.copy()
    row_of = {shop.jobs[i].id: n for n, i in enumerate(rows)}
    must = np.array([shop.jobs[i].name in extra for i in rows], dtype=bool)
    rush = np.array([shop.jobs[i].rush for i in rows], dtype=bool)
    for p in shop.pins:
        n = row_of.get(p.job)
        if n is None:
            continue  # running or done: validation has checked the pin agrees
        on_machine = cols == mindex[p.machine]
        if p.kind == MUST:
            allowed[n] &= on_machine
            rush[n] = True
        elif p.kind == MUST_NOT:
            allowed[n] &= ~on_machine
    penalty = np.array([shop.jobs[i].wait_penalty for i in rows], dtype=float)
    return ShopProblem(shop, rows, columns, values, allowed, penalty, must, running, unavailable,
                       rush & ~must)


def _must_run_names(shop: Shop, rows: list[int], names: Iterable[str], source: str) -> set[str]:
    """Job names of the must-run jobs given by name or work order; unknown ones refused."""
    waiting = [shop.jobs[i] for i in rows]
    by_name = {j.name: j.name for j in waiting}
    by_order: dict[str, list[str]] = {}
    for j in waiting:
        if j.work_order:
            by_order.setdefault(j.work_order, []).append(j.name)
    out: set[str] = set()
    problems = []
    for n in names:
        if n in by_name:
            out.add(n)
        elif len(by_order.get(n, [])) == 1:
            out.add(by_order[n][0])
        elif n in by_order:
            problems.append(Problem(f"must-run job {n!r}", "names several jobs by work order ("
                                    + ", ".join(by_order[n]) + "); give the job's name"))
        else:
            problems.append(Problem(f"must-run job {n!r}", "is not a waiting job of this shop "
                                    "(give its name or its work order)"))
    if problems:
        raise ShopError(problems, source)
    return out


def solve_problem(problem: ShopProblem, objective: str = "total", source: str = "") -> DispatchResult:
    """Run the engine on a built problem; infeasible must-run jobs raise ShopInfeasibleError
    (its message prefixed with ``source`` when given)."""
    try:
        return solve(problem.values, problem.allowed, objective=objective,
                     wait_penalty=problem.wait_penalty, must_run=problem.must_run,
                     rush=problem.rush)
    except InfeasibleError as exc:
        w = exc.witness
        jobs = [problem.job_name(int(i)) for i in w.jobs]
        machines = _unique(problem.machine_name(int(c)) for c in w.machines)
        slots = len(w.machines)
        if not machines:
            msg = (f"infeasible: must-run jobs {', '.join(jobs)} ({len(jobs)}) have no free slot: "
                   + unavailable_text(problem.shop, jobs))
        else:
            msg = (f"infeasible: must-run jobs {', '.join(jobs)} ({len(jobs)}) compete for only "
                   f"{slots} free slot(s) on: {', '.join(machines)}")
        raise ShopInfeasibleError(msg, jobs, machines, source) from None


def unavailable_text(shop: Shop, job_names: list[str]) -> str:
    """Why no machine can take any of ``job_names`` now: each capable machine and what holds it.

    Said when must-run jobs compete for no free slot at all, so the supervisor sees which
    machines could run them and why each is unavailable (down, or its slots all running).
    """
    ids = {shop.job_by_name(n).id for n in job_names}
    barred = {(p.job, p.machine) for p in shop.pins if p.kind == MUST_NOT}
    pinned = {p.job: p.machine for p in shop.pins if p.kind == MUST and p.job in ids}
    running: dict[str, list[str]] = {}
    for j in shop.jobs:
        if j.state == RUNNING and j.machine is not None:
            running.setdefault(j.machine, []).append(j.name)
    reasons = []
    for m in shop.machines:
        if not any((jid, m.id) in shop.grid and (jid, m.id) not in barred
                   and pinned.get(jid, m.id) == m.id for jid in ids):
            continue
        if m.state != UP:
            reasons.append(f"{m.name} ({m.state})")
        else:
            busy = running.get(m.id, [])
            reasons.append(f"{m.name} (all {m.slots} slot(s) running: {', '.join(busy)})")
    if not reasons:
        return "no machine can run them (the grid and the pins allow none)"
    return "the machines that can run them are all taken: " + "; ".join(reasons)


def solve_shop(shop: Shop, objective: str = "total", *, extra_must_run: Iterable[str] = (),
               source: str = "") -> Plan:
    """The certified plan for ``shop``: per machine its jobs, waiting jobs with reasons.

    ``objective`` is ``"total"`` (least setup plus wait penalties), ``"maximize"`` (values
    are gains) or ``"bottleneck"``. A shop with a crew is planned with an operator on every
    running machine (:mod:`dispatcher.shop.staffed`; objectives total and maximize).
    Raises :class:`ShopError` for an inconsistent shop and
    :class:`ShopInfeasibleError` when jobs named in ``extra_must_run`` cannot all be
    placed (rush and pinned jobs that cannot all be placed wait and are named in
    ``plan.rush_waiting`` with their reasons).
    """
    problem = build_problem(shop, extra_must_run=extra_must_run, source=source)
    if shop.crew.active:
        from .staffed import solve_staffed

        return solve_staffed(problem, objective, source=source)
    result = solve_problem(problem, objective, source)
    return plan_from_result(problem, result)


def _unique(names: Iterable[str]) -> list[str]:
    return list(dict.fromkeys(names))


def plan_from_result(problem: ShopProblem, result: DispatchResult) -> Plan:
    """Read an engine result on ``problem`` back into shop terms."""
    shop = problem.shop
    assignments = []
    busy = np.zeros(len(shop.machines), dtype=bool)
    for n, c in enumerate(result.machine_of_job):
        if c >= 0:
            assignments.append(Assignment(problem.job_name(n), problem.machine_name(int(c)),
                                          float(result.values[n, c])))
            busy[problem.columns[int(c)]] = True
    running = []
    for i, k in problem.running:
        j, m = shop.jobs[i], shop.machines[k]
        busy[k] = True
        running.append(RunningJob(j.name, m.name, j.since.isoformat() if j.since else None,
                                  shop.value(j.id, m.id)))
    unavailable = set(problem.unavailable)
    idle = [m.name for k, m in enumerate(shop.machines) if not busy[k] and k not in unavailable]
    waiting = [problem.job_name(int(n)) for n in result.waiting_jobs]
    reasons = _wait_reasons(problem, result)
    return Plan(
        objective=result.objective,
        total=float(result.total),
        assignments=assignments,
        waiting_jobs=waiting,
        idle_machines=idle,
        bottleneck=result.bottleneck,
        waiting_reasons=reasons,
        certificate={"verified": bool(result.verify())},
        rush_waiting=[problem.job_name(int(n)) for n in result.rush_waiting],
        rush_groups=_rush_groups(problem, result),
        running=running,
        unavailable_machines=[shop.machines[k].name for k in problem.unavailable],
        result=result,
        problem=problem,
    )


def _wait_reasons(problem: ShopProblem, result: DispatchResult) -> dict[str, WaitReason]:
    """Hall witness of each waiting job in shop names, with a sentence a supervisor can check.

    Jobs of one group share the group's name lists (built once per group).
    """
    by_row: dict[int, WaitReason] = {}
    for w in result.wait_groups():
        jobs = [problem.job_name(int(i)) for i in w.jobs]
        machines = _unique(problem.machine_name(int(c)) for c in w.machines)
        if len(w.machines) == 0:
            why = None
        elif len(w.machines) == len(problem.columns) and len(w.jobs) == len(problem.rows):
            why = (f"more jobs than free machine slots ({len(jobs)} jobs, {len(w.machines)} "
                   f"free slots), so {w.deficiency} of them must wait")
        elif len(machines) == len(w.machines):
            why = (f"{len(jobs)} jobs can only run on {len(machines)} machine(s) "
                   f"({', '.join(machines)}), so {w.deficiency} of them must wait")
        else:
            why = (f"{len(jobs)} jobs can only use {len(w.machines)} free slot(s) on "
                   f"{len(machines)} machine(s) ({', '.join(machines)}), so {w.deficiency} "
                   "of them must wait")
        for row in w.jobs[result.machine_of_job[w.jobs] < 0]:
            row = int(row)
            name = problem.job_name(row)
            text = (f"{name}: {why}" if why is not None else
                    f"{name}: no available machine can run it" + _why_no_machine(problem, row))
            by_row[row] = WaitReason(jobs, machines, text)
    return {problem.job_name(int(n)): by_row[int(n)] for n in result.waiting_jobs}


def _rush_groups(problem: ShopProblem, result: DispatchResult) -> list[RushGroup]:
    """Per group of rush (or pinned) jobs left waiting: the rush jobs competing for the same
    machines, those machines, and a sentence (a Hall witness among rush jobs)."""
    out = []
    for w in result.rush_wait_groups():
        jobs = [problem.job_name(int(i)) for i in w.jobs]
        waiting = [problem.job_name(int(i)) for i in w.jobs if result.machine_of_job[i] < 0]
        machines = _unique(problem.machine_name(int(c)) for c in w.machines)
        if not machines:
            why = (f"rush job(s) {', '.join(jobs)}: no available machine can run "
                   f"{'it' if len(jobs) == 1 else 'them'}"
                   + "".join(_why_no_machine(problem, problem.job_name_to_row(n)) for n in jobs[:1]))
        else:
            slots = (f"{len(w.machines)} free slot(s) on " if len(w.machines) != len(machines)
                     else "")
            kind = "rush or must-run" if problem.must_run[w.jobs].any() else "rush"
            why = (f"{len(jobs)} {kind} jobs ({', '.join(jobs)}) can only use {slots}"
                   f"{len(machines)} machine(s) ({', '.join(machines)}), so {w.deficiency} of "
                   "them must wait")
        out.append(RushGroup(jobs, machines, waiting, why))
    return out


def _why_no_machine(problem: ShopProblem, row: int) -> str:
    """Which machines could run the job but cannot take it now (down, full, pinned away)."""
    shop = problem.shop
    job = shop.jobs[problem.rows[row]]
    free = set(problem.columns)
    notes = []
    for k, m in enumerate(shop.machines):
        if shop.value(job.id, m.id) is None:
            continue
        if m.state != UP:
            notes.append(f"{m.name} is {'under maintenance' if m.state == 'maintenance' else m.state}")
        elif k not in free:
            notes.append(f"{m.name} is full with running jobs")
        elif any(p.job == job.id and p.machine == m.id and p.kind == MUST_NOT for p in shop.pins):
            notes.append(f"{m.name} is pinned away")
        elif any(p.job == job.id and p.kind == MUST and p.machine != m.id for p in shop.pins):
            notes.append(f"{m.name} is not its pinned machine")
    return f" ({'; '.join(notes)})" if notes else ""
