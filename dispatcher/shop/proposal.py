"""A decision proposal: an event (machine down or back up, rush job, job pulled, or
putting the plan shown in force) applied to a copy of the shop, and the plan for it.

The event rules are :func:`dispatcher.shop.redispatch.apply_events` (the same the
``redispatch`` command applies); when a plan is in force and the objective allows it,
the plan is the warm re-dispatch of :func:`dispatcher.shop.redispatch.redispatch_shop`
with its move penalties, otherwise a fresh solve in the planning mode. The app shows the
proposal with its difference against the plan in force (``dispatcher.history``'s
``diff_plans``, which the app fills in ``Proposal.diff``) and, once confirmed, records it
and puts it in the document.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

from .fill_shift import ShiftFill
from .model import Shop, ShopError
from .plan import Plan
from .planning import MODE_ROUND, rush_note, solve_for_mode
from .redispatch import (
    EVENT_DOWN,
    EVENT_PULLED,
    EVENT_RUSH,
    EVENT_UP,
    ShopEvent,
    ShopRedispatch,
    apply_events,
    redispatch_shop,
)
from .translate import ShopInfeasibleError

EVENT_CONFIRM = "confirm"  # confirm the plan at shift start: a decision, not a shop event
EVENT_PULL = EVENT_PULLED
#: The reason a decision on each event is recorded with unless the supervisor picks another.
EVENT_REASON = {EVENT_DOWN: "breakdown", EVENT_UP: "repair", EVENT_RUSH: "rush-job",
                EVENT_CONFIRM: "shift-start", EVENT_PULL: "manual-change"}


@dataclass
class Proposal:
    """The shop after the event and its plan (None, with ``problem``, when there is none).
    ``diff`` is the difference against the plan in force, filled in by whoever shows it."""

    event: str
    title: str
    shop: Shop
    plan: Plan | ShiftFill | None
    diff: Any = None
    machine: int | None = None
    job: int | None = None
    job_changes: list[tuple[int, dict]] = field(default_factory=list)
    problem: str = ""
    move_penalties: float | None = None   # paid by the warm re-dispatch, when it was used
    pulled_job: str = ""                  # the job this decision takes out of the shop


def _title(shop: Shop, event: str, machine: int | None, job: int | None) -> str:
    if event == EVENT_DOWN:
        return f"{shop.machines[machine].name} is down"
    if event == EVENT_UP:
        return f"{shop.machines[machine].name} is back up"
    if event == EVENT_RUSH:
        return f"Rush job: {shop.jobs[job].name}"
    if event == EVENT_PULL:
        return f"Job pulled: {shop.jobs[job].name}"
    if event == EVENT_CONFIRM:
        return "Put the plan shown in force"
    raise ValueError(f"unknown event {event!r}")


def propose(shop: Shop, event: str, objective: str, *, machine: int | None = None,
            job: int | None = None, note: str = "", mode: str = MODE_ROUND,
            before: dict | None = None) -> Proposal:
    """Apply ``event`` to a copy of ``shop`` and plan it. ``shop`` is never changed.

    ``machine`` (down, up) and ``job`` (rush, pulled) are indices into the shop. The event
    rules are :func:`~dispatcher.shop.redispatch.apply_events`; a pulled job then leaves
    the shop document (its grid values, pins and place in the plan in force with it), and
    a machine whose state changed gets ``note`` as its state note. An event that does not
    fit the shop, or a shop with no possible plan, gives a proposal without a plan whose
    ``problem`` says why. The plan starts from the plan in force: the document's, else
    ``before`` (the plan shown, in the solve JSON), so a dispatched job keeps its machine
    unless its move penalty is worth paying.
    """
    title = _title(shop, event, machine, job)
    name = ""
    if event == EVENT_CONFIRM:
        after = shop.copy()
    else:
        name = shop.machines[machine].name if event in (EVENT_DOWN, EVENT_UP) else shop.jobs[job].name
        try:
            after, _left, _arrived = apply_events(shop, [ShopEvent(event, name)])
        except ShopError as exc:
            return Proposal(event, title, shop.copy(), None, None, machine, job, [], str(exc))
    pulled = name if event == EVENT_PULL else ""
    warm = _warm_redispatch(shop, event, objective, name, before) if mode == MODE_ROUND else None
    moves = None
    if warm is not None:
        after, plan, moves = warm.shop, warm.plan, warm.move_penalties_paid
        problem = rush_note(plan)
    _note_machines(shop, after, note)
    if pulled:
        after = without_job(after, job)
    changes = [] if pulled else _job_changes(shop, after)
    if warm is None:
        try:
            plan, problem = solve_for_mode(after, objective, mode)
        except (ShopError, ShopInfeasibleError) as exc:
            return Proposal(event, title, after, None, None, machine, job, changes, str(exc),
                            None, pulled)
    return Proposal(event, title, after, plan, None, machine, job, changes, problem, moves, pulled)


def without_job(shop: Shop, index: int) -> Shop:
    """A copy of ``shop`` without job ``index``: its grid values, typed "cannot run" marks
    and run hours, its pins and its place in the plan in force go too."""
    new = shop.copy()
    gone = new.jobs.pop(index)
    new.grid = {k: v for k, v in new.grid.items() if k[0] != gone.id}
    new.hours = {k: v for k, v in new.hours.items() if k[0] != gone.id}
    new.blocked = {k for k in new.blocked if k[0] != gone.id}
    new.pins = [p for p in new.pins if p.job != gone.id]
    new.plan_in_force = {m: [j for j in js if j != gone.id]
                         for m, js in new.plan_in_force.items()}
    new.plan_in_force = {m: js for m, js in new.plan_in_force.items() if js}
    return new


def _warm_redispatch(shop: Shop, event: str, objective: str, name: str,
                     before: dict | None = None) -> ShopRedispatch | None:
    """The core's re-dispatch from the plan in force (the document's, else ``before``),
    with move penalties in both objectives, or None when it does not apply (no plan in
    force, bottleneck objective, an inconsistent shop: then the caller solves from scratch
    and explains)."""
    if objective not in ("total", "maximize") or event == EVENT_CONFIRM:
        return None
    in_force = shop.plan_in_force or _in_force_of(shop, before)
    if not in_force:
        return None
    try:
        return redispatch_shop(shop, [ShopEvent(event, name)], objective=objective,
                               plan_in_force=in_force)
    except (ShopError, ShopInfeasibleError):
        return None


def _in_force_of(shop: Shop, before: dict | None) -> dict[str, list[str]]:
    """A plan in the solve JSON as machine id -> job ids, or {} if it does not fit the shop."""
    if not before:
        return {}
    try:
        return Plan.from_json(before).in_force(shop)
    except (ValueError, KeyError):
        return {}


def _note_machines(before: Shop, after: Shop, note: str) -> None:
    for m_new, m_old in zip(after.machines, before.machines):
        if m_new.state != m_old.state:
            m_new.state_note = note


def _job_changes(before: Shop, after: Shop) -> list[tuple[int, dict]]:
    """Per job, the fields the event changed (state, machine, since, rush)."""
    out = []
    for i, (a, b) in enumerate(zip(before.jobs, after.jobs)):
        fields = {f: getattr(b, f) for f in ("state", "machine", "since", "rush")
                  if getattr(a, f) != getattr(b, f)}
        if fields:
            out.append((i, fields))
    return out
