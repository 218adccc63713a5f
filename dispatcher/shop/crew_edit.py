"""Edits of a shop's crew, checked by the same rules as a document that is read.

Each function takes the shop and returns a *new* :class:`~dispatcher.shop.crew.Crew` with
one change made (the shop itself is not touched), or raises
:class:`~dispatcher.shop.model.ShopError` naming the operator (or group, authorisation)
and the field, so that the app changes nothing on a refusal. The checks are those of
:func:`~dispatcher.shop.crew.crew_problems` (attendance times within the shift, unique
labels, name and note lengths, groups naming existing machines): a change is refused when
it brings a problem the crew did not have before.

Texts typed by a person are read here too: a time of day as ``HH:MM`` and a date as
``YYYY-MM-DD``, an empty text meaning none.
"""

from __future__ import annotations

import copy
from datetime import date, time

from .crew import Authorisation, Crew, crew_problems, describe_operator
from .model import Problem, ShopError

__all__ = [
    "authorisation_for",
    "group_authorised",
    "parse_clock",
    "parse_day",
    "with_expiry",
    "with_group_authorisation",
    "with_groups",
    "with_operator_text",
    "with_times",
    "with_unattended",
    "with_warn_days",
    "without_operator",
]


def _refuse(where: str, message: str) -> ShopError:
    return ShopError([Problem(where, message)])


def _checked(shop, crew: Crew) -> Crew:
    """``crew`` if it brings no problem the shop's crew did not have, else ShopError."""
    before = {str(p) for p in crew_problems(shop)}
    trial = copy.copy(shop)
    trial.crew = crew
    new = [p for p in crew_problems(trial) if str(p) not in before]
    if new:
        raise ShopError(new)
    return crew


def _index(crew: Crew, operator_id: str) -> int:
    for n, o in enumerate(crew.operators):
        if o.id == operator_id:
            return n
    raise _refuse(f"operator id {operator_id!r}", "is not in the crew")


def _where(crew: Crew, n: int) -> str:
    return describe_operator(crew.operators[n], n + 1)


def parse_clock(text: str, where: str) -> time | None:
    """A time of day typed as ``H:MM`` or ``HH:MM``; empty means none."""
    text = text.strip()
    if not text:
        return None
    hours, sep, minutes = text.partition(":")
    if sep and hours.isdigit() and minutes.isdigit() and len(minutes) == 2 and len(hours) <= 2:
        h, m = int(hours), int(minutes)
        if h < 24 and m < 60:
            return time(h, m)
    raise _refuse(where, f"{text!r} is not a time of day like '06:00' (HH:MM; empty: the whole shift)")


def parse_day(text: str, where: str) -> date | None:
    """A date typed as ``YYYY-MM-DD``; empty means none."""
    text = text.strip()
    if not text:
        return None
    try:
        if len(text) != 10:
            raise ValueError(text)
        return date.fromisoformat(text)
    except ValueError:
        raise _refuse(where, f"{text!r} is not a date like '2026-03-24' (YYYY-MM-DD; empty: "
                             "never expires)") from None


def with_times(shop, operator_id: str, *, arrives: str | None = None,
               leaves: str | None = None) -> Crew:
    """The crew with the operator's arrival and/or leaving time typed as ``HH:MM`` (an
    empty text: from the shift's start / until its end); a time outside the shift, or
    leaving before arriving, is refused with the operator and field named."""
    crew = shop.crew.copy()
    n = _index(crew, operator_id)
    op = crew.operators[n]
    for key, text in (("arrives", arrives), ("leaves", leaves)):
        if text is not None:
            setattr(op, key, parse_clock(text, f"{_where(crew, n)}, field '{key}'"))
    return _checked(shop, crew)


def with_operator_text(shop, operator_id: str, key: str, text: str) -> Crew:
    """The crew with the operator's ``label`` or ``notes`` changed (a label is stripped,
    must be non-empty and unique; both keep to the length limits)."""
    if key not in ("label", "notes"):
        raise ValueError(f"not a text field of an operator: {key!r}")
    crew = shop.crew.copy()
    n = _index(crew, operator_id)
    setattr(crew.operators[n], key, text.strip() if key == "label" else text)
    return _checked(shop, crew)


def without_operator(shop, operator_id: str) -> Crew:
    """The crew without the operator and every authorisation of theirs."""
    crew = shop.crew.copy()
    crew.operators.pop(_index(crew, operator_id))
    crew.authorisations = [a for a in crew.authorisations if a.operator != operator_id]
    crew.unattended = list(crew.unattended)
    return _checked(shop, crew)


def authorisation_for(crew: Crew, operator_id: str, machine_id: str) -> int | None:
    """Index of the authorisation that lets the operator run the machine: their own for
    that machine first, else the first through a group holding it; None when neither."""
    own = [k for k, a in enumerate(crew.authorisations)
           if a.operator == operator_id and a.machine == machine_id]
    if own:
        return own[0]
    for k, a in enumerate(crew.authorisations):
        if a.operator == operator_id and not a.machine and machine_id in crew.groups.get(a.group, []):
            return k
    return None


def with_expiry(shop, index: int, text: str) -> Crew:
    """The crew with authorisation ``index`` expiring on the date typed (``YYYY-MM-DD``;
    empty: it never expires)."""
    crew = shop.crew.copy()
    a = crew.authorisations[index]
    try:
        label = crew.operator(a.operator).label
    except KeyError:
        label = a.operator
    what = f"machine {a.machine}" if a.machine else f"group {a.group!r}"
    a.expires = parse_day(text, f"authorisation {index + 1} ({label!r} for {what}), field 'expires'")
    return _checked(shop, crew)


def with_unattended(shop, machine_id: str, unattended: bool) -> Crew:
    """The crew with the machine running without an operator, or needing one again."""
    shop.machine(machine_id)  # KeyError for a machine the shop does not have
    crew = shop.crew.copy()
    crew.unattended = [m for m in crew.unattended if m != machine_id]
    if unattended:
        order = {m.id: k for k, m in enumerate(shop.machines)}
        crew.unattended = sorted([*crew.unattended, machine_id], key=lambda m: order.get(m, len(order)))
    return _checked(shop, crew)


def group_authorised(crew: Crew, operator_id: str, group: str) -> bool:
    """Whether the operator holds an authorisation for the whole group."""
    return any(a.operator == operator_id and a.group == group and not a.machine
               for a in crew.authorisations)


def with_group_authorisation(shop, operator_id: str, group: str, authorised: bool) -> Crew:
    """The crew with the operator authorised for every machine of ``group`` (one
    authorisation, no expiry) or withdrawn from it; own machine authorisations stay."""
    crew = shop.crew.copy()
    _index(crew, operator_id)
    if group not in crew.groups:
        raise _refuse(f"machine group {group!r}", "does not exist")
    crew.authorisations = [a for a in crew.authorisations
                           if not (a.operator == operator_id and a.group == group and not a.machine)]
    if authorised:
        crew.authorisations.append(Authorisation(operator_id, group=group))
    return _checked(shop, crew)


def with_groups(shop, groups: dict[str, list[str]], renamed: dict[str, str] | None = None) -> Crew:
    """The crew with these machine groups (name -> machine ids, in the shop's machine
    order). ``renamed`` maps an old name to its new one: authorisations through it follow.
    Authorisations through a group that is gone are dropped with it."""
    renamed = dict(renamed or {})
    crew = shop.crew.copy()
    for n, name in enumerate(groups, start=1):
        if not name.strip():
            raise _refuse(f"machine group #{n}, field 'name'", "must be a non-empty text")
    if len({name.strip() for name in groups}) < len(groups):
        raise _refuse("crew, field 'groups'", "two groups have the same name")
    order = {m.id: k for k, m in enumerate(shop.machines)}
    crew.groups = {name: sorted(dict.fromkeys(members), key=lambda m: order.get(m, len(order)))
                   for name, members in groups.items()}
    kept = []
    for a in crew.authorisations:
        if not a.machine:
            a.group = renamed.get(a.group, a.group)
            if a.group not in crew.groups:
                continue
        kept.append(a)
    crew.authorisations = kept
    return _checked(shop, crew)


def with_warn_days(shop, days: int) -> Crew:
    """The crew warning about authorisations expiring within ``days`` (0 to 366)."""
    crew = shop.crew.copy()
    crew.warn_days = days
    return _checked(shop, crew)
