"""The crew of a shift: operators, what each is authorised to run, who is here, and how
many machines each can mind at once; and the staffed plan built from them.

A shop without operators is planned exactly as before (no staffing constraint). With
operators, every machine that gets a job gets a present operator authorised for it,
within each operator's minding capacity (:func:`dispatcher.engine.staffing.staffed_dispatch`).

Who counts as present for a round: attendance ``present``, arrived by the round's time
(``arrives`` empty or not later) and not yet gone (``leaves`` empty or later). The round's
time is the shift's start unless the caller gives one. An authorisation with an
``expires`` date before the shift's day counts as none; authorisations expiring within
``warn_days`` days of it are listed as warnings.

Running jobs keep their machine: their machines are staffed first (before rush jobs),
and a running machine for which no qualified operator is present is reported, never
stopped by the plan: stopping a running machine follows the site's procedure.
"""

from __future__ import annotations

import copy
from collections import Counter
from dataclasses import dataclass, field
from datetime import date, datetime, time, timedelta

import numpy as np

from dispatcher.errors import BadInputError
from dispatcher.limits import name_problem


class CrewUnsupportedError(BadInputError, ValueError):
    """A feature that does not yet plan with the crew was asked for on a shop with one."""


def refuse_with_crew(active: bool, what: str, source: str = "") -> None:
    """Raise :class:`CrewUnsupportedError` when ``active``: ``what`` ignores the crew."""
    if active:
        raise CrewUnsupportedError(
            f"{what}: not available yet for a shop with a crew (it ignores who is present "
            "and could suggest a plan nobody can run); the one-round plan staffs every machine",
            source=source)


#: Attendance states.
PRESENT, ABSENT = "present", "absent"
ATTENDANCE = (PRESENT, ABSENT)

#: Upper limit of an operator's minding capacity (a document limit, like slots).
MAX_MINDING = 50


@dataclass
class Operator:
    """One operator: ``label`` is what the site chooses to show (a name, badge or role)."""

    id: str
    label: str
    capacity: int = 1
    attendance: str = PRESENT
    arrives: time | None = None
    leaves: time | None = None
    notes: str = ""


@dataclass
class Authorisation:
    """``operator`` (id) may run ``machine`` (a machine id) or every machine of ``group``."""

    operator: str
    machine: str = ""
    group: str = ""
    expires: date | None = None


@dataclass
class Crew:
    """Operators, machine groups, authorisations, unattended machines, warning horizon."""

    operators: list[Operator] = field(default_factory=list)
    groups: dict[str, list[str]] = field(default_factory=dict)
    authorisations: list[Authorisation] = field(default_factory=list)
    unattended: list[str] = field(default_factory=list)
    warn_days: int = 14

    def copy(self) -> Crew:
        """An independent copy (records and containers copied, values shared)."""
        return Crew(operators=[copy.copy(o) for o in self.operators],
                    groups={k: list(v) for k, v in self.groups.items()},
                    authorisations=[copy.copy(a) for a in self.authorisations],
                    unattended=list(self.unattended), warn_days=self.warn_days)

    @property
    def active(self) -> bool:
        """True when the shop plans with a crew (it has at least one operator)."""
        return bool(self.operators)

    def operator(self, operator_id: str) -> Operator:
        for o in self.operators:
            if o.id == operator_id:
                return o
        raise KeyError(f"no operator with id {operator_id!r}")

    def operator_by_label(self, label: str) -> Operator:
        for o in self.operators:
            if o.label == label or o.id == label:
                return o
        raise KeyError(f"no operator labelled {label!r}")

    def machines_of(self, auth: Authorisation) -> list[str]:
        return [auth.machine] if auth.machine else list(self.groups.get(auth.group, []))


def crew_problems(shop) -> list:
    """Every problem of the shop's crew, each with the operator (or group) and field."""
    from .model import Problem

    crew: Crew = shop.crew
    out: list[Problem] = []

    def add(where, msg):
        out.append(Problem(where, msg))

    machine_ids = {m.id for m in shop.machines}
    op_ids = {o.id for o in crew.operators}
    for ident, n in Counter(o.id for o in crew.operators).items():
        if n > 1:
            add(f"operator id {ident!r}", f"is used by {n} operators; ids must be unique")
    for label, n in Counter(o.label for o in crew.operators).items():
        if n > 1:
            add(f"operator label {label!r}", f"is used by {n} operators; labels must be unique")
    start, end = _shift_window(shop)
    for n, o in enumerate(crew.operators, start=1):
        where = describe_operator(o, n)
        for key in ("id", "label", "notes"):
            v = getattr(o, key)
            problem = name_problem(v, free_text=key == "notes") if isinstance(v, str) else None
            if problem:
                add(f"{where}, field '{key}'", problem)
        if not isinstance(o.id, str) or not o.id.strip():
            add(f"operator {o.label!r}, field 'id'", "must be a non-empty text")
        if not isinstance(o.label, str) or not o.label.strip():
            add(f"operator id {o.id!r}, field 'label'", "must be a non-empty text")
        if isinstance(o.capacity, bool) or not isinstance(o.capacity, int) \
                or not 1 <= o.capacity <= MAX_MINDING:
            add(f"{where}, field 'capacity'",
                f"{o.capacity!r} must be a whole number from 1 to {MAX_MINDING} (machines minded at once)")
        if o.attendance not in ATTENDANCE:
            add(f"{where}, field 'attendance'", f"{o.attendance!r} is not one of {', '.join(ATTENDANCE)}")
        for key in ("arrives", "leaves"):
            t = getattr(o, key)
            if t is not None and start is not None and not _within(t, start, end):
                add(f"{where}, field '{key}'",
                    f"{t.strftime('%H:%M')} is outside the shift ({start.strftime('%H:%M')} to "
                    f"{end.strftime('%H:%M')})")
        if o.arrives is not None and o.leaves is not None and start is not None \
                and _minutes_from(o.leaves, start) <= _minutes_from(o.arrives, start):
            add(f"{where}, field 'leaves'", "must be after the time the operator arrives")
    for n, (name, members) in enumerate(crew.groups.items(), start=1):
        if not name.strip():
            add("crew, field 'groups'", "a group name must be a non-empty text")
        problem = name_problem(name)
        if problem:
            add(f"machine group #{n}, field 'name'", problem)
            name = f"#{n}"
        for mid in members:
            if mid not in machine_ids:
                add(f"machine group {name!r}", f"names machine id {mid!r}, which the shop does not have")
    for n, a in enumerate(crew.authorisations, start=1):
        where = f"authorisation {n}"
        if a.operator not in op_ids:
            add(f"{where}, field 'operator'", f"operator id {a.operator!r} does not exist")
        if bool(a.machine) == bool(a.group):
            add(where, "give exactly one of 'machine' and 'group'")
        elif a.machine and a.machine not in machine_ids:
            add(f"{where}, field 'machine'", f"machine id {a.machine!r} does not exist")
        elif a.group and a.group not in crew.groups:
            add(f"{where}, field 'group'", f"machine group {a.group!r} does not exist")
    for mid in crew.unattended:
        if mid not in machine_ids:
            add("crew, field 'unattended'", f"machine id {mid!r} does not exist")
    if isinstance(crew.warn_days, bool) or not isinstance(crew.warn_days, int) \
            or not 0 <= crew.warn_days <= 366:
        add("crew, field 'warn_days'", f"{crew.warn_days!r} must be a whole number from 0 to 366")
    return out


def describe_operator(o: Operator, n: int) -> str:
    """``operator 'Trainee' (id O6)``, or by position when the label or id is not a short
    one-line text (so that a message never repeats a runaway label)."""
    label_ok = isinstance(o.label, str) and name_problem(o.label) is None
    id_ok = isinstance(o.id, str) and name_problem(o.id) is None
    if label_ok and id_ok:
        return f"operator {o.label!r} (id {o.id})"
    if id_ok:
        return f"operator #{n} (id {o.id})"
    return f"operator {o.label!r} (#{n})" if label_ok else f"operator #{n}"


def _shift_window(shop) -> tuple[time | None, time | None]:
    start = shop.shift.start
    if start is None:
        return None, None
    end = (datetime.combine(date(2000, 1, 1), start) + timedelta(hours=shop.shift.hours)).time()
    return start, end


def _minutes_from(t: time, start: time) -> int:
    """Minutes from the shift's start to ``t`` (a shift may run past midnight)."""
    return ((t.hour * 60 + t.minute) - (start.hour * 60 + start.minute)) % (24 * 60)


def _within(t: time, start: time, end: time) -> bool:
    span = _minutes_from(end, start) or 24 * 60
    return _minutes_from(t, start) <= span


def present_at(op: Operator, shop, at: time | None = None) -> bool:
    """Is the operator here at time ``at`` (default: the shift's start)?"""
    if op.attendance != PRESENT:
        return False
    start = shop.shift.start
    at = at or start
    if at is None or start is None:
        return True
    now = _minutes_from(at, start)
    if op.arrives is not None and _minutes_from(op.arrives, start) > now:
        return False
    return not (op.leaves is not None and _minutes_from(op.leaves, start) <= now)


def authorised(shop, *, on: date | None = None) -> np.ndarray:
    """operators x machines: authorised and not expired on ``on`` (default: the shift's day)."""
    crew: Crew = shop.crew
    day = on or shop.shift.day
    opos = {o.id: i for i, o in enumerate(crew.operators)}
    mpos = {m.id: k for k, m in enumerate(shop.machines)}
    out = np.zeros((len(crew.operators), len(shop.machines)), bool)
    for a in crew.authorisations:
        if a.operator not in opos or (a.expires is not None and day is not None and a.expires < day):
            continue
        for mid in crew.machines_of(a):
            if mid in mpos:
                out[opos[a.operator], mpos[mid]] = True
    return out


def expiring(shop, *, on: date | None = None) -> list[dict]:
    """Authorisations that expire within ``warn_days`` of the shift's day (or already did)."""
    crew: Crew = shop.crew
    day = on or shop.shift.day or date.today()
    out = []
    for a in crew.authorisations:
        if a.expires is None:
            continue
        left = (a.expires - day).days
        if left <= crew.warn_days:
            try:
                label = crew.operator(a.operator).label
            except KeyError:
                continue
            what = a.machine and _machine_name(shop, a.machine) or f"group {a.group}"
            out.append({"operator": label, "for": what, "expires": a.expires.isoformat(),
                        "days_left": left})
    return sorted(out, key=lambda w: (w["days_left"], w["operator"]))


def _machine_name(shop, machine_id: str) -> str:
    try:
        return shop.machine(machine_id).name
    except KeyError:
        return machine_id


def warning_text(w: dict) -> str:
    """One line a supervisor reads: who, for what, and when it runs out."""
    if w["days_left"] < 0:
        return (f"{w['operator']}: authorisation for {w['for']} expired on {w['expires']} "
                "(counts as none)")
    days = "today" if w["days_left"] == 0 else f"in {w['days_left']} day(s)"
    return f"{w['operator']}: authorisation for {w['for']} expires {days} ({w['expires']})"
