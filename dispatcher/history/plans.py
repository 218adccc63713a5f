"""Plans as the history sees them: the solve JSON contract, checked, and their differences.

The history never imports the shop model or the engine: a plan arrives as the JSON object
``dispatcher solve --json`` prints (keys ``status``, ``objective``, ``total``,
``assignments`` [{``job``, ``machine``, ``cost``}], ``waiting_jobs``, ``idle_machines``,
optionally ``certificate``) and is stored as that text.
"""

from __future__ import annotations

import json
import math
from dataclasses import dataclass, field
from typing import Any

from dispatcher.jsonnum import json_number

from .errors import HistoryInputError

#: Row states of the per-decision table used for machine and job queries. ``running``:
#: a job already running that the plan leaves where it is (shop documents).
ASSIGNED, RUNNING, WAITING, IDLE = "assigned", "running", "waiting", "idle"


def json_text(value: Any, what: str) -> str:
    """Compact JSON text of ``value``.

    Accepts JSON text (checked by parsing it), a dict or list, or any object with a
    ``to_json()`` method returning one of those (so the shop model's classes need not be
    imported here). Only the json module parses; nothing is evaluated.
    """
    if hasattr(value, "to_json") and callable(value.to_json):
        value = value.to_json()
    if isinstance(value, bytes):
        try:
            value = value.decode("utf-8")
        except UnicodeDecodeError as exc:
            raise HistoryInputError(f"{what}: not UTF-8 text ({exc.reason})") from None
    if isinstance(value, str):
        try:
            json.loads(value)
        except json.JSONDecodeError as exc:
            raise HistoryInputError(f"{what}: not JSON (line {exc.lineno}, column {exc.colno}: "
                                    f"{exc.msg})") from None
        return value
    try:
        return json.dumps(value, ensure_ascii=False, separators=(",", ":"), allow_nan=False)
    except (TypeError, ValueError) as exc:
        raise HistoryInputError(f"{what}: cannot be written as JSON ({exc})") from None


def _number(value: Any, where: str, allow_none: bool = False) -> float | int | None:
    if value is None and allow_none:
        return None
    if isinstance(value, bool) or not isinstance(value, (int, float)) or not math.isfinite(value):
        raise HistoryInputError(f"{where}: expected a finite number, got {value!r}")
    return value


def _name(value: Any, where: str) -> str:
    if not isinstance(value, str) or not value:
        raise HistoryInputError(f"{where}: expected a non-empty name, got {value!r}")
    return value


def check_plan(plan: Any) -> dict[str, Any]:
    """The plan as a dict, after checking it follows the solve contract.

    Raises :class:`HistoryInputError` naming the first wrong field, e.g.
    ``plan: assignments[2].machine: expected a non-empty name, got None``.
    """
    data = json.loads(json_text(plan, "plan"))
    if not isinstance(data, dict):
        raise HistoryInputError(f"plan: expected a JSON object, got {type(data).__name__}")
    for key in ("status", "objective", "total", "assignments", "waiting_jobs", "idle_machines"):
        if key not in data:
            raise HistoryInputError(f"plan: missing key {key!r}")
    for key in ("status", "objective"):
        if not isinstance(data[key], str):
            raise HistoryInputError(f"plan: {key}: expected text, got {data[key]!r}")
    _number(data["total"], "plan: total", allow_none=True)
    for key in ("assignments", "waiting_jobs", "idle_machines"):
        if not isinstance(data[key], list):
            raise HistoryInputError(f"plan: {key}: expected a list")
    seen_jobs: set[str] = set()
    seen_machines: set[str] = set()
    for i, a in enumerate(data["assignments"]):
        where = f"plan: assignments[{i}]"
        if not isinstance(a, dict):
            raise HistoryInputError(f"{where}: expected an object")
        job = _name(a.get("job"), f"{where}.job")
        machine = _name(a.get("machine"), f"{where}.machine")
        _number(a.get("cost"), f"{where}.cost")
        if job in seen_jobs:
            raise HistoryInputError(f"{where}.job: {job!r} is placed twice")
        seen_jobs.add(job)
        seen_machines.add(machine)
    running = data.get("running", [])
    if not isinstance(running, list):
        raise HistoryInputError("plan: running: expected a list")
    for i, r in enumerate(running):
        where = f"plan: running[{i}]"
        if not isinstance(r, dict):
            raise HistoryInputError(f"{where}: expected an object")
        _name(r.get("job"), f"{where}.job")
        _name(r.get("machine"), f"{where}.machine")
        _number(r.get("cost"), f"{where}.cost", allow_none=True)
    for i, job in enumerate(data["waiting_jobs"]):
        if _name(job, f"plan: waiting_jobs[{i}]") in seen_jobs:
            raise HistoryInputError(f"plan: waiting_jobs[{i}]: {job!r} is also placed")
    for i, machine in enumerate(data["idle_machines"]):
        if _name(machine, f"plan: idle_machines[{i}]") in seen_machines:
            raise HistoryInputError(f"plan: idle_machines[{i}]: {machine!r} also runs a job")
    return data


def certificate_status(plan: dict[str, Any]) -> str:
    """``verified``, ``failed`` or ``none`` (no certificate in the plan)."""
    cert = plan.get("certificate")
    if not isinstance(cert, dict) or "verified" not in cert:
        return "none"
    return "verified" if cert["verified"] is True else "failed"


def plan_rows(plan: dict[str, Any]) -> list[tuple[str, str | None, str | None, float | None]]:
    """(state, machine, job, value) rows: one per placement, running job, waiting job and
    idle machine. A machine with several slots may appear in several placements."""
    rows: list[tuple[str, str | None, str | None, float | None]] = [
        (ASSIGNED, a["machine"], a["job"], float(a["cost"])) for a in plan["assignments"]]
    rows += [(RUNNING, r["machine"], r["job"], None if r.get("cost") is None else
              float(r["cost"])) for r in plan.get("running", [])]
    rows += [(WAITING, None, job, None) for job in plan["waiting_jobs"]]
    rows += [(IDLE, machine, None, None) for machine in plan["idle_machines"]]
    return rows


def plan_operators(plan_json: str | None) -> dict[tuple[str, str], str]:
    """(job, machine) -> operator label of the placements and running jobs of a stored plan
    (empty for plans of shops without a crew, and for text that is not a plan)."""
    try:
        plan = json.loads(plan_json or "{}")
    except json.JSONDecodeError:
        return {}
    out = {}
    for entry in [*plan.get("assignments", []), *plan.get("running", [])]:
        if isinstance(entry, dict) and isinstance(entry.get("operator"), str):
            out[(entry.get("job"), entry.get("machine"))] = entry["operator"]
    return out


def _tidy(x: float) -> int | float:
    """Difference of two totals without binary noise (1e-9 resolution); whole values as int."""
    return json_number(x, digits=9)


@dataclass(frozen=True)
class Move:
    job: str
    from_machine: str
    to_machine: str


@dataclass(frozen=True)
class PlanDiff:
    """What changed from plan ``before`` to plan ``after``.

    * ``moved``: jobs placed in both, on a different machine;
    * ``newly_placed``: (job, machine) placed now but waiting or absent before;
    * ``now_waiting``: jobs waiting now that were placed or absent before;
    * ``jobs_gone``: jobs in the earlier plan and not in the later one (done or removed;
      a job the later plan lists as already running is not gone);
    * ``machines_now_idle``: idle now, running a job or absent before;
    * ``machines_back_in_use``: running a job now, idle or absent (down) before: the
      mirror of ``machines_gone``, so ``diff(A, B)`` and ``diff(B, A)`` tell the same facts;
    * ``machines_gone``: in the earlier plan and not in the later one (e.g. broken down);
    * ``total_change``: later total minus earlier total (None if either is missing).
    """

    from_id: int | None = None
    to_id: int | None = None
    moved: tuple[Move, ...] = ()
    newly_placed: tuple[tuple[str, str], ...] = ()
    now_waiting: tuple[str, ...] = ()
    jobs_gone: tuple[str, ...] = ()
    machines_now_idle: tuple[str, ...] = ()
    machines_back_in_use: tuple[str, ...] = ()
    machines_gone: tuple[str, ...] = ()
    total_before: float | int | None = None
    total_after: float | int | None = None
    total_change: float | int | None = field(default=None)
    objective_changed: bool = False

    @property
    def is_empty(self) -> bool:
        """True when the placements, waiting jobs, idle machines and total are the same."""
        return not (self.moved or self.newly_placed or self.now_waiting or self.jobs_gone
                    or self.machines_now_idle or self.machines_back_in_use
                    or self.machines_gone or self.total_change or self.objective_changed)

    def to_json(self) -> dict[str, Any]:
        return {
            "from": self.from_id,
            "to": self.to_id,
            "moved": [{"job": m.job, "from": m.from_machine, "to": m.to_machine}
                      for m in self.moved],
            "newly_placed": [{"job": j, "machine": m} for j, m in self.newly_placed],
            "now_waiting": list(self.now_waiting),
            "jobs_gone": list(self.jobs_gone),
            "machines_now_idle": list(self.machines_now_idle),
            "machines_back_in_use": list(self.machines_back_in_use),
            "machines_gone": list(self.machines_gone),
            "total_before": self.total_before,
            "total_after": self.total_after,
            "total_change": self.total_change,
            "objective_changed": self.objective_changed,
        }

    @classmethod
    def from_json(cls, data: dict[str, Any]) -> PlanDiff:
        return cls(
            from_id=data.get("from"), to_id=data.get("to"),
            moved=tuple(Move(m["job"], m["from"], m["to"]) for m in data.get("moved", [])),
            newly_placed=tuple((p["job"], p["machine"]) for p in data.get("newly_placed", [])),
            now_waiting=tuple(data.get("now_waiting", [])),
            jobs_gone=tuple(data.get("jobs_gone", [])),
            machines_now_idle=tuple(data.get("machines_now_idle", [])),
            machines_back_in_use=tuple(data.get("machines_back_in_use", [])),
            machines_gone=tuple(data.get("machines_gone", [])),
            total_before=data.get("total_before"), total_after=data.get("total_after"),
            total_change=data.get("total_change"),
            objective_changed=bool(data.get("objective_changed", False)),
        )

    def lines(self) -> list[str]:
        """Plain sentences for a terminal or a printed sheet, one change per line."""
        out = [f"moved: {m.job} from {m.from_machine} to {m.to_machine}" for m in self.moved]
        out += [f"newly placed: {j} on {m}" for j, m in self.newly_placed]
        out += [f"now waiting: {j}" for j in self.now_waiting]
        out += [f"no longer in the plan: {j}" for j in self.jobs_gone]
        out += [f"machine now idle: {m}" for m in self.machines_now_idle]
        out += [f"machine back in use: {m}" for m in self.machines_back_in_use]
        out += [f"machine no longer in the plan: {m}" for m in self.machines_gone]
        if self.objective_changed:
            out.append("the objective changed, so the totals measure different things")
        if self.total_change is not None:
            out.append(f"total: {self.total_before:g} -> {self.total_after:g} "
                       f"({self.total_change:+g})")
        return out or ["no change"]


def diff_plans(before: dict[str, Any], after: dict[str, Any], from_id: int | None = None,
               to_id: int | None = None) -> PlanDiff:
    """The :class:`PlanDiff` from ``before`` to ``after`` (both in the solve contract).

    Lists keep the order of the later plan (the earlier one for things that disappeared),
    so the result is deterministic.
    """
    old_place = {a["job"]: a["machine"] for a in before["assignments"]}
    new_place = {a["job"]: a["machine"] for a in after["assignments"]}
    old_wait = set(before["waiting_jobs"])
    new_running = {r["job"]: r["machine"] for r in after.get("running", [])}
    new_jobs = set(new_place) | set(after["waiting_jobs"]) | set(new_running)
    old_idle = set(before["idle_machines"])
    old_running = {r["job"]: r["machine"] for r in before.get("running", [])}
    old_machines = set(old_place.values()) | old_idle | set(old_running.values())
    new_machines = (set(new_place.values()) | set(after["idle_machines"])
                    | set(new_running.values()))

    moved = tuple(Move(j, old_place[j], m) for j, m in new_place.items()
                  if j in old_place and old_place[j] != m)
    newly = tuple((j, m) for j, m in new_place.items() if j not in old_place)
    waiting = tuple(j for j in after["waiting_jobs"] if j not in old_wait)
    gone = tuple(j for j in [a["job"] for a in before["assignments"]] + before["waiting_jobs"]
                 + list(old_running) if j not in new_jobs)
    now_idle = tuple(m for m in after["idle_machines"] if m not in old_idle)
    back = tuple(dict.fromkeys(a["machine"] for a in after["assignments"]
                               if a["machine"] in old_idle or a["machine"] not in old_machines))
    machines_gone = tuple(dict.fromkeys(
        m for m in [a["machine"] for a in before["assignments"]] + before["idle_machines"]
        + list(old_running.values()) if m not in new_machines))
    t0, t1 = before.get("total"), after.get("total")
    change = _tidy(t1 - t0) if isinstance(t0, (int, float)) and isinstance(t1, (int, float)) \
        else None
    return PlanDiff(from_id, to_id, moved, newly, waiting, gone, now_idle, back, machines_gone,
                    t0, t1, change, before.get("objective") != after.get("objective"))
