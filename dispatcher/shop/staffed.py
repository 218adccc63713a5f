"""Plans for shops with a crew: the shop problem solved with an operator on every machine.

:func:`solve_staffed` takes the problem :func:`~dispatcher.shop.translate.build_problem`
builds (waiting jobs x free machine slots) and folds the slots back into machines,
because an operator minds a machine, not a slot. Machines with running jobs get a kept
placeholder so that they are staffed before any new job (and reported when nobody
qualified is present: the plan never stops a running machine). Rush and pinned jobs
are a priority (as many as possible, after the most jobs), jobs named must-run a hard
constraint, as for a shop without a crew.
"""

from __future__ import annotations

from collections.abc import Iterable

import numpy as np

from dispatcher.engine import InfeasibleError
from dispatcher.engine.staffing import StaffedPlan, staffed_dispatch

from .crew import PRESENT, authorised, expiring, present_at, warning_text
from .model import Shop
from .plan import Assignment, Plan, RunningJob, WaitReason


def staffing_inputs(problem, *, at=None):
    """Engine arrays of a shop problem with a crew (machines, not slots, as columns).

    Returns a dict with ``values``, ``allowed``, ``qualified``, ``capacity``,
    ``needs_operator``, ``wait_penalty``, ``rush``, ``must_run``, ``keep``, ``slots`` and
    ``placeholder_machine`` (machine index of each kept placeholder row, after the
    waiting jobs' rows).
    """
    shop: Shop = problem.shop
    n_rows, n_machines = len(problem.rows), len(shop.machines)
    cols = np.asarray(problem.columns, dtype=np.int64)
    free = np.bincount(cols, minlength=n_machines) if cols.size else np.zeros(n_machines, np.int64)
    running_on = sorted({k for _, k in problem.running})
    first_col = {}
    for c, k in enumerate(problem.columns):
        first_col.setdefault(k, c)
    n_jobs = n_rows + len(running_on)
    values = np.zeros((n_jobs, n_machines))
    allowed = np.zeros((n_jobs, n_machines), bool)
    for k, c in first_col.items():
        values[:n_rows, k] = problem.values[:, c]
        allowed[:n_rows, k] = problem.allowed[:, c]
    for n, k in enumerate(running_on):
        allowed[n_rows + n, k] = True
    slots = free.copy()
    slots[running_on] += 1
    slots = np.maximum(slots, 1)
    # Rush and pinned jobs are a priority, jobs named must-run a hard constraint, exactly
    # as the problem marks them for the unstaffed plan.
    rush = np.zeros(n_jobs, bool)
    must = np.zeros(n_jobs, bool)
    rush[:n_rows] = problem.rush if problem.rush is not None else False
    must[:n_rows] = problem.must_run
    keep = np.zeros(n_jobs, bool)
    keep[n_rows:] = True
    crew = shop.crew
    qualified = authorised(shop)
    here = np.array([present_at(o, shop, at) for o in crew.operators], bool)
    qualified &= here[:, None]
    unattended = set(crew.unattended)
    needs = np.array([m.id not in unattended for m in shop.machines], bool)
    penalty = np.r_[problem.wait_penalty, np.zeros(len(running_on))]
    return {"values": values, "allowed": allowed, "qualified": qualified,
            "capacity": np.array([o.capacity for o in crew.operators], np.int64),
            "needs_operator": needs, "wait_penalty": penalty, "rush": rush, "must_run": must,
            "keep": keep, "slots": slots, "placeholder_machine": np.array(running_on, np.int64),
            "present": here}


def solve_staffed(problem, objective: str = "total", *, source: str = "", at=None) -> Plan:
    """The certified staffed plan of a shop problem (see the module docstring).

    Raises :class:`~dispatcher.shop.translate.ShopInfeasibleError` when pinned or
    must-run jobs cannot all be placed with the crew present.
    """
    from .translate import ShopInfeasibleError

    if objective not in ("total", "maximize"):
        from dispatcher.errors import BadInputError

        raise BadInputError(f"objective {objective!r} is not available for a shop with a crew "
                            "(use total or maximize)", source=source)
    shop: Shop = problem.shop
    x = staffing_inputs(problem, at=at)
    n_rows = len(problem.rows)
    try:
        sp = staffed_dispatch(x["values"], x["allowed"], qualified=x["qualified"],
                              capacity=x["capacity"], needs_operator=x["needs_operator"],
                              objective=objective, wait_penalty=x["wait_penalty"],
                              rush=x["rush"], must_run=x["must_run"], keep=x["keep"],
                              slots=x["slots"] if (x["slots"] > 1).any() else None)
    except InfeasibleError as exc:
        jobs = [problem.job_name(int(i)) for i in exc.witness.jobs if i < n_rows]
        machines = [shop.machines[int(k)].name for k in exc.witness.machines]
        raise ShopInfeasibleError(
            f"infeasible: must-run jobs {', '.join(jobs)} cannot all be placed with the crew "
            f"present (machines they can use: {', '.join(machines) or 'none'})",
            jobs, machines, source) from None
    return _plan(problem, sp, x)


def _plan(problem, sp: StaffedPlan, x) -> Plan:
    shop: Shop = problem.shop
    crew = shop.crew
    n_rows = len(problem.rows)
    label = [o.label for o in crew.operators]
    op_of = sp.operator_of_machine
    assignments = []
    for n in range(n_rows):
        k = int(sp.machine_of_job[n])
        if k >= 0:
            o = int(op_of[k])
            assignments.append(Assignment(problem.job_name(n), shop.machines[k].name,
                                          float(x["values"][n, k]), operator=label[o] if o >= 0 else None))
    running = []
    unstaffed_running = []
    for i, k in problem.running:
        j, m = shop.jobs[i], shop.machines[k]
        o = int(op_of[k])
        needs = bool(x["needs_operator"][k])
        running.append(RunningJob(j.name, m.name, j.since.isoformat() if j.since else None,
                                  shop.value(j.id, m.id), operator=label[o] if o >= 0 else None))
        if needs and o < 0:
            unstaffed_running.append({"job": j.name, "machine": m.name})
    busy = np.zeros(len(shop.machines), bool)
    busy[sp.machine_of_job[sp.machine_of_job >= 0]] = True
    unavailable = set(problem.unavailable)
    idle = [m.name for k, m in enumerate(shop.machines) if not busy[k] and k not in unavailable]
    waiting_rows = [n for n in range(n_rows) if sp.machine_of_job[n] < 0]
    waiting = [problem.job_name(n) for n in waiting_rows]
    reasons = _reasons(problem, sp, x, waiting_rows)
    staffing = _summary(shop, sp, x, label, unstaffed_running)
    rush_waiting = [problem.job_name(n) for n in waiting_rows if x["rush"][n]]
    plan = Plan(objective=sp.objective, total=float(sp.total), assignments=assignments,
                waiting_jobs=waiting, idle_machines=idle, bottleneck=None,
                waiting_reasons=reasons,
                certificate={"verified": bool(sp.verify()), "method": sp.method},
                running=running, unavailable_machines=[shop.machines[k].name for k in problem.unavailable],
                result=sp, problem=problem, staffing=staffing, rush_waiting=rush_waiting)
    return plan


def _summary(shop, sp, x, label, unstaffed_running) -> dict:
    crew = shop.crew
    minding: dict[str, list[str]] = {}
    for k in np.flatnonzero(sp.operator_of_machine >= 0):
        minding.setdefault(label[int(sp.operator_of_machine[k])], []).append(shop.machines[int(k)].name)
    present = [o.label for o, here in zip(crew.operators, x["present"]) if here]
    later = [o.label for o, here in zip(crew.operators, x["present"])
             if not here and o.attendance == PRESENT]
    absent = [o.label for o in crew.operators if o.attendance != PRESENT]
    out = {
        "operators_present": present,
        "operators_not_yet_here": later,
        "operators_absent": absent,
        "minding": minding,
        "unattended_machines": [m.name for m in shop.machines if m.id in set(crew.unattended)],
        "unstaffed_running": unstaffed_running,
        "shortage": None,
        "expiring": [dict(w, text=warning_text(w)) for w in expiring(shop)],
    }
    out["shortage"] = shortage(shop, sp, x, label)
    return out


def operators_by_machine(staffing: dict | None) -> dict[str, str]:
    """Machine name -> who minds it in a plan's staffing summary ("unattended" for
    machines that need nobody); empty for a plan without a crew."""
    if not staffing:
        return {}
    out = {m: "unattended" for m in staffing.get("unattended_machines", [])}
    for who, machines in staffing.get("minding", {}).items():
        out.update({m: who for m in machines})
    return out


def staffing_lines(staffing: dict) -> list[str]:
    """The staffing summary as lines of text (command line and printed sheet)."""
    lines = ["Crew:"]
    for who, machines in staffing.get("minding", {}).items():
        lines.append(f"  {who} minds {', '.join(machines)}")
    if staffing.get("unattended_machines"):
        lines.append(f"  Runs unattended: {', '.join(staffing['unattended_machines'])}")
    idle = [o for o in staffing.get("operators_present", []) if o not in staffing.get("minding", {})]
    if idle:
        lines.append(f"  Present, no machine this round: {', '.join(idle)}")
    for who, h in staffing.get("operator_hours", {}).items():
        if h["present"] > 0:
            when = f", {h['from']} to {h['to']}" if h.get("from") else ""
            lines.append(f"  {who}: minds {h['minding']:g} machine-h of {h['present']:g} h here"
                         f"{when} (up to {h['capacity']} at once)")
    if staffing.get("operators_not_yet_here"):
        lines.append(f"  Not here yet at the round's time: {', '.join(staffing['operators_not_yet_here'])}"
                     " (re-dispatch with --operator-in when they arrive)")
    if staffing.get("operators_absent"):
        lines.append(f"  Absent: {', '.join(staffing['operators_absent'])}")
    for r in staffing.get("unstaffed_running", []):
        lines.append(f"  CAUTION: {r['job']} runs on {r['machine']} with no qualified operator "
                     "present; stop it only by the site's procedure (the plan never stops a "
                     "running machine)")
    if staffing.get("shortage"):
        lines.append(f"  Shortage: {staffing['shortage']['text']}")
    for w in staffing.get("expiring", []):
        lines.append(f"  Warning: {w['text']}")
    return lines


def shortage(shop, sp, x, label) -> dict | None:
    """Jobs that wait for want of an operator, and the idle machines that shows on.

    ``could_run`` is the most jobs the machines could take with one operator each (a
    maximum matching; König 1931), ``placed`` what the crew present allows (the engine's
    maximum flow, proven by its cut). Each idle machine that a waiting job could use is
    named with its present authorised operators and what they mind instead.
    """
    s = sp.shortage
    if s is None:
        return None
    n_rows = len(sp.machine_of_job) - len(x["placeholder_machine"])
    waiting = np.flatnonzero(sp.machine_of_job[:n_rows] < 0)
    busy = np.zeros(len(shop.machines), bool)
    busy[sp.machine_of_job[sp.machine_of_job >= 0]] = True
    wanted = x["allowed"][waiting].any(axis=0) if waiting.size else np.zeros(len(busy), bool)
    idle = np.flatnonzero(wanted & ~busy & x["needs_operator"])
    minds = {}
    for k in np.flatnonzero(sp.operator_of_machine >= 0):
        minds.setdefault(int(sp.operator_of_machine[k]), []).append(shop.machines[int(k)].name)
    machines = []
    for k in idle:
        ops = np.flatnonzero(x["qualified"][:, k])
        machines.append({"machine": shop.machines[int(k)].name,
                         "operators": [label[int(o)] for o in ops],
                         "busy_on": sorted({m for o in ops for m in minds.get(int(o), [])})})
    # Count new jobs only: the kept placeholders of running machines are not jobs to place.
    kept = len(x["placeholder_machine"])
    kept_placed = int((sp.machine_of_job[n_rows:] >= 0).sum())
    could, placed = s.could_run - kept, s.placed - kept_placed
    out = {"could_run": could, "placed": placed, "waiting": could - placed,
           "idle_machines": machines}
    out["text"] = shortage_text(out)
    return out


def shortage_text(s: dict) -> str:
    """"7 jobs could run but the crew present can staff only 4: 3 wait. Press 3 stays
    idle: its present authorised operator (Press operator B) minds Press 1."."""
    parts = [(f"{s['could_run']} jobs could run but the crew present can staff only "
              f"{s['placed']}: {s['waiting']} wait")]
    for m in s["idle_machines"]:
        if not m["operators"]:
            parts.append(f"{m['machine']} stays idle: no present operator is authorised for it")
        else:
            who = ", ".join(m["operators"])
            on = ", ".join(m["busy_on"]) or "other machines"
            parts.append(f"{m['machine']} stays idle: its present authorised operator(s) ({who}) "
                         f"mind {on}")
    return ". ".join(parts)


def _reasons(problem, sp, x, waiting_rows) -> dict[str, WaitReason]:
    """Why each waiting job waits: the machines' own limits (Hall witness of the plain
    problem) when it waits there too, else the crew (the staffing shortage)."""
    from .translate import _wait_reasons, solve_problem

    plain: dict[str, WaitReason] = {}
    try:
        result = solve_problem(problem, sp.objective)
        plain = _wait_reasons(problem, result)
    except Exception:  # noqa: BLE001 - the plain problem may be infeasible; staffing explains
        plain = {}
    s = shortage(problem.shop, sp, x, [o.label for o in problem.shop.crew.operators])
    staffed_jobs = [problem.job_name(n) for n in waiting_rows if problem.job_name(n) not in plain]
    machines = [m["machine"] for m in s["idle_machines"]] if s is not None else []
    out = {}
    for n in waiting_rows:
        name = problem.job_name(n)
        if name in plain:
            out[name] = plain[name]
        elif s is not None:
            out[name] = WaitReason(staffed_jobs, machines, f"{name}: {s['text']}")
        else:
            out[name] = WaitReason([name], [], f"{name}: waits so that jobs of higher "
                                   "priority (rush, running) get the operators present")
    return out


def solve_shop_staffed(shop: Shop, objective: str = "total", *,
                       extra_must_run: Iterable[str] = (), source: str = "") -> Plan:
    """:func:`solve_staffed` on the shop's own problem."""
    from .translate import build_problem

    problem = build_problem(shop, extra_must_run=extra_must_run, source=source)
    return solve_staffed(problem, objective, source=source)
