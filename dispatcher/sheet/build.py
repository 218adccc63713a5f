"""Build a :class:`SheetContent` from a shop, its plan and optionally a recorded decision.

Qt-free. The decision is read by attribute only (``id``, ``time``, ``by``, and optionally
``shift_date``/``shift``), so this module does not depend on the history package: any
object with those attributes, such as :class:`dispatcher.history.Decision`, will do.

Run order on a machine: jobs already running come first (they carry on), then the newly
dispatched jobs with rush jobs first, then by due time, then in the plan's order. This is
common practice on the shop floor; the plan itself fixes which jobs go where, not their
order.
"""

from __future__ import annotations

import dataclasses
import datetime as dt
from typing import Any, Protocol

from dispatcher.shop.staffed import operators_by_machine
from dispatcher.shop import MUST, UP, Shop

from .content import (
    QT_TRANSLATE_NOOP,
    SAFETY_CAUTIONS,
    SheetContent,
    SheetDownMachine,
    SheetJob,
    SheetMachine,
    SheetTotals,
    SheetWaitingJob,
    format_value,
)

#: How a waiting reason starts when no machine can take the job (shop.translate's words).
NO_MACHINE = QT_TRANSLATE_NOOP("Sheet", "no available machine can run it")
#: Printed for a shop without a name.
UNNAMED_SHOP = QT_TRANSLATE_NOOP("Sheet", "(unnamed shop)")

__all__ = ["DecisionLike", "build_sheet", "change_text", "objective_phrase", "planned_text", "run_order",
           "value_heading"]


class DecisionLike(Protocol):
    """What the sheet needs of a recorded decision."""

    id: int
    time: dt.datetime
    by: str


def value_heading(shop: Shop, objective: str) -> str:
    """Heading of the value column: what the grid numbers mean for this shop."""
    if objective == "maximize":
        return QT_TRANSLATE_NOOP("Sheet", "Value")
    return QT_TRANSLATE_NOOP("Sheet", "Cost") if shop.unit.kind == "cost" else \
        QT_TRANSLATE_NOOP("Sheet", "Setup")


def value_unit(shop: Shop) -> str:
    """Unit printed after each value: ``min`` for setup minutes, else the currency label."""
    return shop.unit.currency if shop.unit.kind == "cost" else "min"


def objective_phrase(shop: Shop, objective: str) -> str:
    """The plan's aim in a few words, for the totals."""
    if shop.unit.kind == "cost":
        phrases = {"total": QT_TRANSLATE_NOOP("Sheet", "least total cost"),
                   "bottleneck": QT_TRANSLATE_NOOP("Sheet", "smallest largest cost, then least total")}
    else:
        phrases = {"total": QT_TRANSLATE_NOOP("Sheet", "least total setup"),
                   "bottleneck": QT_TRANSLATE_NOOP("Sheet", "smallest largest setup, then least total")}
    phrases["maximize"] = QT_TRANSLATE_NOOP("Sheet", "greatest total value")
    return phrases.get(objective, objective)


def _status(plan: Any) -> str:
    # a filled shift says "proven optimal" or "best found, gap x%" in its own words
    extra = getattr(plan, "status_text", None)
    if not extra and isinstance(getattr(plan, "certificate", None), dict):
        extra = plan.certificate.get("text")
    if isinstance(extra, str) and extra:
        return QT_TRANSLATE_NOOP("Sheet", "proven optimal") if extra == "proven optimal" else extra
    if plan.verified:
        if plan.status == "optimal":
            return QT_TRANSLATE_NOOP("Sheet", "optimal, proven by its certificate")
        return f"{plan.status}, proven by its certificate"
    return f"{plan.status} (certificate NOT verified: check the plan before use)"


def _reason_text(plan: Any, job: str) -> str:
    reason = plan.waiting_reasons.get(job)
    if reason is None or not reason.text:
        return QT_TRANSLATE_NOOP("Sheet", "not placed in this round")
    text = reason.text
    prefix = f"{job}: "
    return text.removeprefix(prefix)


def _order_key(shop: Shop, name: str, position: int) -> tuple:
    try:
        job = shop.job_by_name(name)
    except KeyError:
        return (1, dt.datetime.max, position)
    due = job.due
    if due is not None and due.tzinfo is not None:
        due = due.astimezone(dt.UTC).replace(tzinfo=None)
    return (0 if job.rush else 1, due or dt.datetime.max, position)


def _sheet_job(shop: Shop, name: str, value: float | None, running: bool, unit: str) -> SheetJob:
    try:
        job = shop.job_by_name(name)
    except KeyError:  # a recorded plan naming a job the snapshot lacks: print what we know
        return SheetJob(name=name, setup=None if running else value, unit=unit,
                        continuing=running)
    return SheetJob(
        name=job.name, work_order=job.work_order, setup=None if running else value, unit=unit,
        notes=job.notes, rush=job.rush, continuing=running,
        running_since=job.since if running else None,
    )


def _pair_hours(shop: Shop, job_name: str, machine_name: str) -> float | None:
    """Run hours of a job on a machine: the pair's own entry, else job hours x speed."""
    try:
        job, machine = shop.job_by_name(job_name), shop.machine_by_name(machine_name)
    except KeyError:
        return None
    hours = shop.hours.get((job.id, machine.id))
    if hours is None and job.run_hours is not None:
        hours = job.run_hours * machine.speed_factor
    return hours


def run_order(plan: Any) -> dict[str, list[str]] | None:
    """Machine -> jobs in run order when the plan fixes it (a filled shift), else None.

    Accepts a filled-shift plan object (``machines`` of objects with ``machine``,
    ``running`` and ``jobs``) or its JSON (a ``machines`` list of such objects).
    """
    machines = plan.get("machines") if isinstance(plan, dict) else getattr(plan, "machines", None)
    if not isinstance(machines, list):
        return None
    order: dict[str, list[str]] = {}
    for m in machines:
        get = m.get if isinstance(m, dict) else (lambda key, default=None, m=m: getattr(m, key, default))
        name = get("machine")
        if isinstance(name, str):
            order[name] = [str(j) for j in (get("running", []) or [])] + \
                          [str(j) for j in (get("jobs", []) or [])]
    return order


def _runs(plan: Any) -> dict[tuple[str, str], dict]:
    """(machine, job) -> the run (change before it, planned hours) of a whole-shift plan
    for a shop with setup families; empty for other plans."""
    machines = plan.get("machines") if isinstance(plan, dict) else getattr(plan, "machines", None)
    out: dict[tuple[str, str], dict] = {}
    for m in machines if isinstance(machines, list) else []:
        get = m.get if isinstance(m, dict) else (lambda key, default=None, m=m: getattr(m, key, default))
        for r in get("runs", None) or []:
            if isinstance(r, dict) and isinstance(r.get("job"), str):
                out[(get("machine"), r["job"])] = r
    return out


def change_text(run: dict, unit: str) -> str:
    """``change from family A to B: 25 min`` (or the setup when the job has no family)."""
    value = format_value(run.get("changeover"), unit)
    to_family = run.get("to_family")
    if to_family is None:
        return f"setup {value}" if value else ""
    from_family = run.get("from_family")
    source = f"family {from_family}" if from_family is not None else "nothing mounted"
    if from_family == to_family:
        return f"no change of family ({to_family})"
    return f"change from {source} to {to_family}: {value}"


def planned_text(shop: Shop, run: dict) -> str:
    """Planned start and end: clock times from the shift start, else hours into the shift."""
    start, end = run.get("start_hour"), run.get("end_hour")
    if not isinstance(start, (int, float)) or not isinstance(end, (int, float)):
        return ""

    def clock(hours: float) -> str:
        minutes = round(hours * 60)
        if shop.shift.start is not None:
            base = shop.shift.start.hour * 60 + shop.shift.start.minute + minutes
            return f"{base // 60 % 24:02d}:{base % 60:02d}"
        return f"+{minutes // 60}:{minutes % 60:02d}"

    return f"{clock(start)}-{clock(end)}"


def _must_pins(shop: Shop) -> dict[tuple[str, str], str]:
    """(job name, machine name) -> note of each "must go to" pin."""
    out = {}
    for pin in shop.pins:
        if pin.kind != MUST:
            continue
        try:
            out[(shop.job(pin.job).name, shop.machine(pin.machine).name)] = pin.note
        except KeyError:
            continue
    return out


def _entries(plan: Any) -> dict[str, list[tuple[str, float | None, bool]]]:
    """Machine -> ``(job, value, already_running)`` for a Plan or a filled-shift plan."""
    if hasattr(plan, "by_machine"):
        return plan.by_machine()
    out: dict[str, list[tuple[str, float | None, bool]]] = {}
    for r in plan.running:
        out.setdefault(r.machine, []).append((r.job, r.cost, True))
    for a in plan.assignments:
        out.setdefault(a.machine, []).append((a.job, a.cost, False))
    return out


def build_sheet(shop: Shop, plan: Any, decision: Any | None = None, *,
                order: dict[str, list[str]] | None = None,
                printed_at: dt.datetime | None = None, supervisor: str = "",
                in_force: bool = False) -> SheetContent:
    """Everything the sheet prints for ``plan`` in ``shop``.

    ``plan`` is a :class:`dispatcher.shop.Plan` or a filled-shift plan (several jobs per
    machine in run order, with ``machines``, ``assignments``, ``running``, ``waiting_jobs``,
    ``waiting_reasons``, ``idle_machines``, ``total``, ``objective``, ``status_text``).
    ``order`` (machine -> jobs in run order) overrides the order; by default it is the
    filled-shift order if the plan has one, else running jobs first, then rush, then due.
    A filled shift also prints each job's run hours.

    ``decision`` (optional) is the recorded decision the plan comes from; its number, time
    and supervisor go into the header. Without it the sheet says the plan is not recorded
    and prints ``supervisor`` (or a blank line to fill in). ``in_force``: the plan is the
    shop's plan in force (not a draft, even without a recorded decision).
    """
    unit = value_unit(shop)
    by_machine = _entries(plan)
    pinned = _must_pins(shop)
    order = order if order is not None else run_order(plan)
    staffing = getattr(plan, "staffing", None)
    operator_of = operators_by_machine(staffing)
    runs = _runs(plan)
    machines = []
    # A whole-shift plan says how many of each machine's hours it uses (as the app does).
    hours_used = {m.machine: (m.hours_used, m.capacity) for m in getattr(plan, "machines", [])
                  if hasattr(m, "hours_used")}
    for machine in shop.machines:
        entries = by_machine.get(machine.name, [])
        if order is not None and machine.name in order:
            rank = {name: k for k, name in enumerate(order[machine.name])}
            ordered = sorted(entries, key=lambda e: (rank.get(e[0], len(rank)), not e[2]))
        else:
            carrying = [e for e in entries if e[2]]
            new = sorted(((e, k) for k, e in enumerate(entries) if not e[2]),
                         key=lambda ek: _order_key(shop, ek[0][0], ek[1]))
            ordered = carrying + [e for e, _k in new]
        jobs = []
        for name, value, running in ordered:
            job = _sheet_job(shop, name, value, running, unit)
            pin = pinned.get((name, machine.name))
            if pin is not None:
                job = dataclasses.replace(job, pinned=True, pin_note=pin)
            if order is not None:
                job = dataclasses.replace(job, hours=_pair_hours(shop, name, machine.name))
            run = runs.get((machine.name, name))
            if run is not None:
                job = dataclasses.replace(job, change=change_text(run, unit),
                                          planned=planned_text(shop, run))
            jobs.append(job)
        notes = machine.notes
        if machine.slots > 1:
            notes = f"{machine.slots} slots" + (f"; {notes}" if notes else "")
        if machine.name in hours_used:
            used, capacity = hours_used[machine.name]
            notes = f"{used:g} of {capacity:g} h used" + (f"; {notes}" if notes else "")
        machines.append(SheetMachine(name=machine.name, state=machine.state, jobs=tuple(jobs),
                                     notes=notes, operator=operator_of.get(machine.name, "")))

    down = tuple(SheetDownMachine(name=m.name, state=m.state, note=m.state_note,
                                  since=m.state_changed)
                 for m in shop.machines if m.state != UP)
    waiting = []
    waiting_set = set(plan.waiting_jobs)
    for name in plan.waiting_jobs:
        try:
            job = shop.job_by_name(name)
            work_order, rush = job.work_order, job.rush
        except KeyError:
            work_order, rush = "", False
        reason = plan.waiting_reasons.get(name)
        competing = tuple(reason.competing_jobs) if reason is not None and reason.machines else ()
        waiting.append(SheetWaitingJob(
            name=name, work_order=work_order, why=_reason_text(plan, name), rush=rush,
            competing=competing, machines=tuple(reason.machines) if competing else (),
            must_wait=sum(1 for j in competing if j in waiting_set)))

    totals = SheetTotals(
        machines=len(shop.machines),
        machines_down=len(down),
        machines_idle=len(plan.idle_machines),
        jobs_dispatched=len(plan.assignments),
        jobs_continuing=len(plan.running),
        jobs_waiting=len(plan.waiting_jobs),
        total=plan.total,
        planned=float(sum(getattr(a, "cost", 0.0) or 0.0 for a in plan.assignments)),
        unit=unit,
        objective=objective_phrase(shop, plan.objective),
        status=_status(plan),
    )

    shift_date = shop.shift.day or getattr(decision, "shift_date", None)
    shift_label = shop.shift.label or getattr(decision, "shift", "") or ""
    return SheetContent(
        shop_name=shop.name or UNNAMED_SHOP,
        shift_date=shift_date,
        shift_label=shift_label,
        supervisor=(decision.by if decision is not None else supervisor) or "",
        decision_number=None if decision is None else int(decision.id),
        decision_time=None if decision is None else decision.time,
        printed_at=printed_at or dt.datetime.now().astimezone(),
        machines=tuple(machines),
        waiting=tuple(waiting),
        down=down,
        totals=totals,
        safety=SAFETY_CAUTIONS,
        value_heading=value_heading(shop, plan.objective),
        shop_note=shop.description,
        in_force=in_force,
        maximize=plan.objective == "maximize",
        staffed=staffing is not None,
        crew_notes=tuple(crew_notes(staffing)) if staffing is not None else (),
    )


def crew_notes(staffing: dict) -> list[str]:
    """The sheet's crew lines: running machines nobody qualified minds, the shortage,
    authorisations about to expire, operators not here yet or absent."""
    lines = []
    for r in staffing.get("unstaffed_running", []):
        lines.append(f"CAUTION: {r['machine']} runs {r['job']} with no qualified operator present: "
                     "stop it only by the site's procedure.")
    if staffing.get("shortage"):
        lines.append(f"Short of operators: {staffing['shortage']['text']}.")
    for w in staffing.get("expiring", []):
        lines.append(f"Authorisation: {w['text']}.")
    if staffing.get("operators_not_yet_here"):
        lines.append("Not here yet: " + ", ".join(staffing["operators_not_yet_here"]) + ".")
    if staffing.get("operators_absent"):
        lines.append("Absent: " + ", ".join(staffing["operators_absent"]) + ".")
    return lines
