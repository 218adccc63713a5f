"""The ``crew`` block of a shop document (format version 2): operators, machine groups,
authorisations, unattended machines. Read with the shop reader's checks (every problem
reported with the operator and field), written back in the same order.

See docs/shop-format.md, section "Crew".
"""

from __future__ import annotations

from datetime import date, time
from typing import Any

from dispatcher.limits import name_problem
from dispatcher.shop.crew import Authorisation, Crew, Operator

#: First document format version that may hold a crew.
CREW_VERSION = 2

CREW_FIELDS = {"operators", "groups", "authorisations", "unattended", "warn_days"}
OPERATOR_FIELDS = {"id", "label", "capacity", "attendance", "arrives", "leaves", "notes"}
AUTHORISATION_FIELDS = {"operator", "machine", "group", "expires"}


def read_crew(r, block: Any) -> Crew:
    """The crew from its JSON block; problems go to the reader ``r`` (a ``_Reader``)."""
    crew = Crew()
    block = r.obj(block, "crew", CREW_FIELDS)
    if block is None:
        return crew
    crew.warn_days = r.integer(block, "warn_days", "crew", 14)
    ops = block.get("operators", [])
    if not isinstance(ops, list):
        r.bad("crew, field 'operators'", "expected a list")
        ops = []
    for n, o in enumerate(ops, start=1):
        label = o.get("label") if isinstance(o, dict) else None
        where = (f"operator {label!r} (#{n})" if isinstance(label, str) and name_problem(label) is None
                 else f"operator #{n}")
        o = r.obj(o, where, OPERATOR_FIELDS)
        if o is None:
            continue
        crew.operators.append(Operator(
            id=r.text(o, "id", where, required=True), label=r.text(o, "label", where, required=True),
            capacity=r.integer(o, "capacity", where, 1),
            attendance=r.text(o, "attendance", where, "present"),
            arrives=r.stamp(o, "arrives", where, time), leaves=r.stamp(o, "leaves", where, time),
            notes=r.text(o, "notes", where)))
    groups = block.get("groups", {})
    if not isinstance(groups, dict):
        r.bad("crew, field 'groups'", "expected an object group name -> list of machine ids")
        groups = {}
    for n, (name, members) in enumerate(groups.items(), start=1):
        problem = name_problem(name)
        if problem:
            r.bad(f"crew, machine group #{n}, field 'name'", problem)
            continue
        if not isinstance(members, list) or not all(isinstance(m, str) for m in members):
            r.bad(f"crew, machine group {name!r}", "expected a list of machine ids")
            continue
        crew.groups[name] = list(members)
    auths = block.get("authorisations", [])
    if not isinstance(auths, list):
        r.bad("crew, field 'authorisations'", "expected a list")
        auths = []
    for n, a in enumerate(auths, start=1):
        where = f"authorisation {n}"
        a = r.obj(a, where, AUTHORISATION_FIELDS)
        if a is None:
            continue
        crew.authorisations.append(Authorisation(
            operator=r.text(a, "operator", where, required=True), machine=r.text(a, "machine", where),
            group=r.text(a, "group", where), expires=r.stamp(a, "expires", where, date)))
    unattended = block.get("unattended", [])
    if not isinstance(unattended, list) or not all(isinstance(m, str) for m in unattended):
        r.bad("crew, field 'unattended'", "expected a list of machine ids")
    else:
        crew.unattended = list(unattended)
    return crew


def _hhmm(t: time | None) -> str | None:
    return None if t is None else t.strftime("%H:%M")


def crew_to_dict(crew: Crew) -> dict[str, Any]:
    """The JSON block of a crew (the inverse of :func:`read_crew`)."""
    return {
        "warn_days": crew.warn_days,
        "operators": [{"id": o.id, "label": o.label, "capacity": o.capacity,
                       "attendance": o.attendance, "arrives": _hhmm(o.arrives),
                       "leaves": _hhmm(o.leaves), "notes": o.notes} for o in crew.operators],
        "groups": {name: list(members) for name, members in crew.groups.items()},
        "authorisations": [{"operator": a.operator, "machine": a.machine, "group": a.group,
                            "expires": None if a.expires is None else a.expires.isoformat()}
                           for a in crew.authorisations],
        "unattended": list(crew.unattended),
    }


def has_crew(crew: Crew) -> bool:
    """Whether a document needs the crew block (anything set beyond the defaults)."""
    return bool(crew.operators or crew.groups or crew.authorisations or crew.unattended
                or crew.warn_days != 14)
