"""A dispatch plan in shop terms (names, not indices), and its JSON form.

:meth:`Plan.to_json` gives exactly the ``dispatcher solve --json`` contract: the keys
status, objective, total, assignments (``{"job", "machine", "cost"}``), waiting_jobs,
idle_machines, bottleneck, waiting_reasons and certificate. Two keys are added only when a
shop has something to put in them, so a shop made from a plain grid prints exactly what
the grid prints: ``running`` (jobs already running, which stay where they are:
``{"job", "machine", "since", "cost"}``) and ``unavailable_machines`` (down or under
maintenance). Shops with a crew (operators) add ``"operator"`` to every assignment and
running job and a ``staffing`` summary (who minds which machines, shortages with their
explanation, authorisations about to expire). :meth:`Plan.from_json` reads that object
back, checking every field.

``rush_waiting`` (always written) lists rush and pinned jobs left waiting because no plan
placing as many jobs places more of them; ``rush_groups`` (written when that list is not
empty) names per group the rush jobs competing for the same machines, those machines, the
ones that wait and a sentence: ``{"jobs", "machines", "waiting", "text"}``.

``assignments`` are the jobs newly dispatched in this round; ``total`` counts them and the
wait penalties of waiting jobs (running jobs are not counted: their setup is done).
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import Any

from dispatcher.errors import BadInputError
from dispatcher.jsonnum import json_number as json_number  # the one helper, re-exported

OBJECTIVES = ("total", "maximize", "bottleneck")


class PlanFormatError(BadInputError, ValueError):
    """A plan object (JSON) that does not follow the solve contract; names the field."""


def contract_json(plan: Any, *, bottleneck: float | None, certificate: dict[str, Any]) -> dict[str, Any]:
    """The solve output contract for any plan-like object in shop names.

    ``plan`` needs ``status``, ``objective``, ``total``, ``assignments``, ``waiting_jobs``,
    ``idle_machines``, ``waiting_reasons``, ``running`` and ``unavailable_machines``; the
    last two keys are written only when non-empty.
    """
    staffing = getattr(plan, "staffing", None)
    staffed = staffing is not None
    data: dict[str, Any] = {
        "status": plan.status,
        "objective": plan.objective,
        "total": json_number(plan.total),
        "assignments": [_assignment_json(a, staffed) for a in plan.assignments],
        "waiting_jobs": list(plan.waiting_jobs),
        "idle_machines": list(plan.idle_machines),
        "bottleneck": None if bottleneck is None else json_number(bottleneck),
        **reasons_json(plan.waiting_reasons),
        "certificate": certificate,
        "rush_waiting": list(getattr(plan, "rush_waiting", [])),
        "total_parts": total_parts(plan),
    }
    rush_groups = getattr(plan, "rush_groups", [])
    if rush_groups:
        data["rush_groups"] = [{"jobs": list(g.jobs), "machines": list(g.machines),
                                "waiting": list(g.waiting), "text": g.text} for g in rush_groups]
    if plan.running:
        data["running"] = [{"job": r.job, "machine": r.machine, "since": r.since,
                            "cost": None if r.cost is None else json_number(r.cost),
                            **({"operator": r.operator} if staffed else {})}
                           for r in plan.running]
    if plan.unavailable_machines:
        data["unavailable_machines"] = list(plan.unavailable_machines)
    if staffed:
        data["staffing"] = staffing
    return data


def _assignment_json(a: Assignment, staffed: bool) -> dict[str, Any]:
    out: dict[str, Any] = {"job": a.job, "machine": a.machine, "cost": json_number(a.cost)}
    if staffed:
        out["operator"] = a.operator
    return out


def total_parts(plan: Any, move_penalties: float = 0.0) -> dict[str, int | float]:
    """What ``total`` is made of: ``planned`` (grid values of the jobs dispatched: setup
    minutes, cost or value by the shop's unit), ``wait_penalties`` (of the jobs left
    waiting) and ``move_penalties`` (paid by a re-dispatch; reported apart, not in
    ``total``). ``total`` is planned + wait penalties, or planned - wait penalties when
    maximising."""
    planned = float(sum(a.cost for a in plan.assignments))
    wait = plan.total - planned if plan.objective != "maximize" else planned - plan.total
    return {"planned": json_number(planned), "wait_penalties": json_number(round(wait, 9)),
            "move_penalties": json_number(move_penalties)}


def parts_word(objective: str, unit: str = "") -> str:
    """What the planned values are called in a sentence: setups, costs or values."""
    if objective == "maximize":
        return "values"
    unit = unit.lower()
    return "costs" if "cost" in unit or (unit and "min" not in unit and "setup" not in unit) \
        else "setups"


def parts_text(data: dict[str, Any], unit: str = "") -> str:
    """`` (setups 208 + wait penalties 210)``: what a plan's total (solve JSON) is made of;
    '' for a plan written before the split was recorded."""
    parts = data.get("total_parts")
    if not isinstance(parts, dict) or "planned" not in parts:
        return ""
    sign = "-" if data.get("objective") == "maximize" else "+"
    return (f" ({parts_word(data.get('objective', 'total'), unit)} {parts['planned']:g} {sign} "
            f"wait penalties {parts['wait_penalties']:g})")


def parts_change_text(before: dict[str, Any] | None, after: dict[str, Any], unit: str = "",
                      move_penalties: float | None = None) -> str:
    """``setups 208 -> 215, wait penalties 210 -> 180; move penalties 4 (apart)``: the
    change of a total split the same way ('' when either plan lacks the split)."""
    a = (before or {}).get("total_parts")
    b = after.get("total_parts")
    if not isinstance(a, dict) or not isinstance(b, dict):
        return ""
    word = parts_word(after.get("objective", "total"), unit)
    text = (f"{word} {a['planned']:g} \u2192 {b['planned']:g}, wait penalties "
            f"{a['wait_penalties']:g} \u2192 {b['wait_penalties']:g}")
    if move_penalties:
        text += f"; move penalties {move_penalties:g} (apart)"
    return text


def reasons_json(reasons: dict[str, "WaitReason"]) -> dict[str, Any]:
    """``waiting_reasons`` (job -> group number and sentence) and ``wait_groups``.

    Jobs that compete for the same machines share one group, written once: with hundreds
    of waiting jobs in one group, repeating the list per job would make a plan (and every
    history record of it) grow with the square of the shop.
    """
    groups: list[dict[str, list[str]]] = []
    index: dict[tuple[tuple[str, ...], tuple[str, ...]], int] = {}
    out: dict[str, dict[str, Any]] = {}
    for job, w in reasons.items():
        key = (tuple(w.competing_jobs), tuple(w.machines))
        number = index.get(key)
        if number is None:
            number = index[key] = len(groups)
            groups.append({"jobs": list(w.competing_jobs), "machines": list(w.machines)})
        out[job] = {"group": number, "text": w.text}
    return {"waiting_reasons": out, "wait_groups": groups}


@dataclass(frozen=True)
class Assignment:
    """Job newly dispatched to a machine, with the grid value of the pair."""

    job: str
    machine: str
    cost: float
    operator: str | None = None


@dataclass(frozen=True)
class RunningJob:
    """A job already running; it stays where it is. ``cost`` is its grid value if known."""

    job: str
    machine: str
    since: str | None = None
    cost: float | None = None
    operator: str | None = None


@dataclass(frozen=True)
class WaitReason:
    """Why a job waits: jobs competing for the same few machines, and a sentence."""

    competing_jobs: list[str]
    machines: list[str]
    text: str


@dataclass(frozen=True)
class RushGroup:
    """Rush jobs competing for fewer machines than they are (a Hall witness among rush
    jobs): ``waiting`` of them wait in every plan placing as many jobs."""

    jobs: list[str]
    machines: list[str]
    waiting: list[str]
    text: str


@dataclass
class Plan:
    """Per machine its job(s) and value, waiting jobs with reasons, idle machines, totals.

    ``result`` and ``problem`` keep the engine result and the expanded problem (with dual
    potentials) for callers that continue from this plan, such as a warm re-dispatch;
    they are not part of the JSON and not compared.
    """

    objective: str
    total: float
    assignments: list[Assignment] = field(default_factory=list)
    waiting_jobs: list[str] = field(default_factory=list)
    idle_machines: list[str] = field(default_factory=list)
    bottleneck: float | None = None
    waiting_reasons: dict[str, WaitReason] = field(default_factory=dict)
    certificate: dict[str, Any] = field(default_factory=lambda: {"verified": False})
    status: str = "optimal"
    rush_waiting: list[str] = field(default_factory=list)
    rush_groups: list[RushGroup] = field(default_factory=list)
    running: list[RunningJob] = field(default_factory=list)
    unavailable_machines: list[str] = field(default_factory=list)
    result: Any = field(default=None, repr=False, compare=False)
    problem: Any = field(default=None, repr=False, compare=False)
    #: For shops with a crew: who minds what, shortages, warnings (``None`` otherwise).
    staffing: dict[str, Any] | None = None

    # ---- shop-terms views ---------------------------------------------------------------
    @property
    def verified(self) -> bool:
        return bool(self.certificate.get("verified"))

    def machine_of(self, job: str) -> str | None:
        """Machine the job runs on or is dispatched to (None if it waits or is unknown)."""
        for r in self.running:
            if r.job == job:
                return r.machine
        for a in self.assignments:
            if a.job == job:
                return a.machine
        return None

    def by_machine(self) -> dict[str, list[tuple[str, float | None, bool]]]:
        """Machine name -> list of ``(job, value, already_running)``: running jobs first."""
        out: dict[str, list[tuple[str, float | None, bool]]] = {}
        for r in self.running:
            out.setdefault(r.machine, []).append((r.job, r.cost, True))
        for a in self.assignments:
            out.setdefault(a.machine, []).append((a.job, a.cost, False))
        return out

    def jobs_on(self, machine: str) -> list[str]:
        return [j for j, _, _ in self.by_machine().get(machine, [])]

    def in_force(self, shop) -> dict[str, list[str]]:
        """This plan as a shop's ``plan_in_force``: machine id -> job ids (running first)."""
        out: dict[str, list[str]] = {}
        for machine, entries in self.by_machine().items():
            out[shop.machine_by_name(machine).id] = [shop.job_by_name(j).id for j, _, _ in entries]
        return out

    # ---- JSON ---------------------------------------------------------------------------
    def to_json(self) -> dict[str, Any]:
        """The solve output contract (see the module docstring)."""
        return contract_json(self, bottleneck=self.bottleneck, certificate=dict(self.certificate))

    @classmethod
    def from_json(cls, data: Any, source: str = "plan") -> Plan:
        """Read a solve-contract object back. Raises :class:`PlanFormatError` naming the field."""
        def fail(where: str, msg: str) -> PlanFormatError:
            return PlanFormatError(msg, source=source, where=where)

        def num(x: Any, where: str, optional: bool = False) -> float | None:
            if x is None and optional:
                return None
            if isinstance(x, bool) or not isinstance(x, (int, float)) or not math.isfinite(x):
                raise fail(where, f"expected a number, got {x!r}")
            return float(x)

        def text(x: Any, where: str) -> str:
            if not isinstance(x, str):
                raise fail(where, f"expected a text, got {x!r}")
            return x

        def names(x: Any, where: str) -> list[str]:
            if not isinstance(x, list):
                raise fail(where, f"expected a list of names, got {type(x).__name__}")
            return [text(v, f"{where}[{i}]") for i, v in enumerate(x)]

        def obj(x: Any, where: str) -> dict:
            if not isinstance(x, dict):
                raise fail(where, f"expected an object, got {type(x).__name__}")
            return x

        data = obj(data, "top level")
        for key in ("status", "objective", "total", "assignments", "waiting_jobs", "idle_machines"):
            if key not in data:
                raise fail(f"field '{key}'", "is missing")
        objective = text(data["objective"], "field 'objective'")
        if objective not in OBJECTIVES:
            raise fail("field 'objective'", f"{objective!r} is not one of {', '.join(OBJECTIVES)}")
        if not isinstance(data["assignments"], list):
            raise fail("field 'assignments'", "expected a list")
        assignments = []
        for i, a in enumerate(data["assignments"]):
            where = f"assignments[{i}]"
            a = obj(a, where)
            for key in ("job", "machine", "cost"):
                if key not in a:
                    raise fail(f"{where}, field '{key}'", "is missing")
            op = a.get("operator")
            assignments.append(Assignment(text(a["job"], f"{where}, field 'job'"),
                                          text(a["machine"], f"{where}, field 'machine'"),
                                          num(a["cost"], f"{where}, field 'cost'"),
                                          None if op is None else text(op, f"{where}, field 'operator'")))
        groups = []
        raw_groups = data.get("wait_groups", [])
        if not isinstance(raw_groups, list):
            raise fail("field 'wait_groups'", "expected a list")
        for i, g in enumerate(raw_groups):
            g = obj(g, f"wait_groups[{i}]")
            groups.append((names(g.get("jobs", []), f"wait_groups[{i}], field 'jobs'"),
                           names(g.get("machines", []), f"wait_groups[{i}], field 'machines'")))
        reasons = {}
        for job, w in obj(data.get("waiting_reasons", {}), "field 'waiting_reasons'").items():
            where = f"waiting_reasons[{job!r}]"
            w = obj(w, where)
            number = w.get("group")
            if isinstance(number, bool) or not isinstance(number, int) \
                    or not 0 <= number < len(groups):
                raise fail(f"{where}, field 'group'",
                           f"expected a number of one of the {len(groups)} wait_groups, got {number!r}")
            jobs, machines = groups[number]
            reasons[job] = WaitReason(jobs, machines, text(w.get("text", ""), f"{where}, field 'text'"))
        running = []
        for i, r in enumerate(data.get("running", []) or []):
            where = f"running[{i}]"
            r = obj(r, where)
            since = r.get("since")
            if since is not None:
                since = text(since, f"{where}, field 'since'")
            op = r.get("operator")
            running.append(RunningJob(text(r.get("job"), f"{where}, field 'job'"),
                                      text(r.get("machine"), f"{where}, field 'machine'"),
                                      since, num(r.get("cost"), f"{where}, field 'cost'", True),
                                      None if op is None else text(op, f"{where}, field 'operator'")))
        rush_groups = []
        raw = data.get("rush_groups", [])
        if not isinstance(raw, list):
            raise fail("field 'rush_groups'", "expected a list")
        for i, g in enumerate(raw):
            where = f"rush_groups[{i}]"
            g = obj(g, where)
            rush_groups.append(RushGroup(names(g.get("jobs", []), f"{where}, field 'jobs'"),
                                         names(g.get("machines", []), f"{where}, field 'machines'"),
                                         names(g.get("waiting", []), f"{where}, field 'waiting'"),
                                         text(g.get("text", ""), f"{where}, field 'text'")))
        cert = obj(data.get("certificate", {"verified": False}), "field 'certificate'")
        staffing = data.get("staffing")
        if staffing is not None:
            staffing = dict(obj(staffing, "field 'staffing'"))
        return cls(
            status=text(data["status"], "field 'status'"),
            objective=objective,
            total=num(data["total"], "field 'total'"),
            assignments=assignments,
            waiting_jobs=names(data["waiting_jobs"], "field 'waiting_jobs'"),
            idle_machines=names(data["idle_machines"], "field 'idle_machines'"),
            bottleneck=num(data.get("bottleneck"), "field 'bottleneck'", True),
            waiting_reasons=reasons,
            certificate=dict(cert),
            rush_waiting=names(data.get("rush_waiting", []), "field 'rush_waiting'"),
            rush_groups=rush_groups,
            running=running,
            unavailable_machines=names(data.get("unavailable_machines", []),
                                       "field 'unavailable_machines'"),
            staffing=staffing,
        )
