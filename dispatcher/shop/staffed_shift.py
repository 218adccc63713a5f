"""The whole shift of a shop with a crew: the crew's hours as engine arrays, and the
staffing summary of the filled shift.

An operator counts from ``arrives`` (or the shift's start) to ``leaves`` (or its end)
when attendance is ``present``; authorisations as for one round (expired ones count as
none). The engine (:func:`dispatcher.engine.staffed_shift.staffed_fill_shift`) cuts the
shift at each arrival and departure and keeps every busy hour of a machine that needs an
operator minded by one present and authorised, within each operator's minding capacity.
"""

from __future__ import annotations

from datetime import date, datetime, timedelta

import numpy as np

from dispatcher.engine.staffed_shift import StaffedShiftPlan, shift_periods

from .crew import PRESENT, _minutes_from, authorised, expiring, warning_text
from .model import Shop

__all__ = ["crew_hours", "shift_staffing"]


def crew_hours(shop: Shop, up: list[int], running_hours: np.ndarray) -> dict:
    """Engine inputs of the crew for the machines ``up`` (indices into ``shop.machines``).

    ``running_hours``: hours of the jobs running on each of all the shop's machines.
    """
    crew = shop.crew
    start, hours = shop.shift.start, float(shop.shift.hours)

    def offset(t):
        if t is None or start is None:
            return np.nan
        return _minutes_from(t, start) / 60.0

    arrives = np.array([offset(o.arrives) for o in crew.operators], float)
    leaves = np.array([offset(o.leaves) for o in crew.operators], float)
    period_hours, present = shift_periods(hours, arrives, leaves)
    here = np.array([o.attendance == PRESENT for o in crew.operators], bool)
    present &= here[:, None]
    unattended = set(crew.unattended)
    c = np.asarray(up, dtype=np.int64)
    return {"qualified": authorised(shop)[:, c] if c.size else np.zeros((len(crew.operators), 0), bool),
            "present": present, "period_hours": period_hours,
            "operator_capacity": np.array([o.capacity for o in crew.operators], np.int64),
            "needs_operator": np.array([shop.machines[k].id not in unattended for k in up], bool),
            "slots": np.array([shop.machines[k].slots for k in up], np.int64),
            "running_hours": np.asarray(running_hours, float)[c] if c.size else np.zeros(0)}


def _clock(shop: Shop, hours_from_start: float) -> str | None:
    if shop.shift.start is None:
        return None
    t = datetime.combine(date(2000, 1, 1), shop.shift.start) + timedelta(hours=hours_from_start)
    return t.strftime("%H:%M")


def _h(x: float) -> float:
    return round(float(x), 4)


def shift_staffing(shop: Shop, plan: StaffedShiftPlan, up: list[int], running, plain_count):
    """The staffing summary of a filled shift, operators per machine, and the main operator
    of each machine (most hours minded).

    ``running``: (job index, machine index) of running jobs. ``plain_count``: jobs the
    same shift runs without the crew's limits (None when not computed: nothing waits).
    Returns ``(staffing, operators_of_machine, main_operator)``; the last two are keyed by
    machine name.
    """
    crew = shop.crew
    label = [o.label for o in crew.operators]
    hours = plan.minded_hours()
    operators_of: dict[str, list[dict]] = {}
    main: dict[str, str | None] = {}
    minding: dict[str, list[str]] = {}
    for col, k in enumerate(up):
        name = shop.machines[k].name
        if not plan.needs_operator[col]:
            operators_of[name] = []
            main[name] = None
            continue
        who = [(float(hours[o, col]), o) for o in range(len(label)) if hours[o, col] > 1e-6]
        who.sort(key=lambda t: (-t[0], t[1]))
        operators_of[name] = [{"operator": label[o], "hours": _h(h)} for h, o in who]
        main[name] = label[who[0][1]] if who else None
        for _, o in who:
            minding.setdefault(label[o], []).append(name)
    L = plan.period_hours
    ends = np.cumsum(L)
    starts = ends - L
    # The whole shift counts everyone who is here at some time of it (when: operator_hours).
    present = [label[o] for o in range(len(label)) if plan.present[o].any()]
    later = []
    absent = [o.label for o in crew.operators if o.attendance != PRESENT]
    operator_hours = {}
    for o, op in enumerate(crew.operators):
        here = float(L[plan.present[o]].sum())
        on = np.flatnonzero(plan.present[o])
        operator_hours[label[o]] = {
            "present": _h(here), "minding": _h(hours[o].sum()), "capacity": int(op.capacity),
            "from": _clock(shop, float(starts[on[0]])) if on.size else None,
            "to": _clock(shop, float(ends[on[-1]])) if on.size else None}
    periods = [{"start": _clock(shop, float(s)), "end": _clock(shop, float(e)), "hours": _h(e - s),
                "present": [label[o] for o in range(len(label)) if plan.present[o, t]]}
               for t, (s, e) in enumerate(zip(starts, ends))]
    col_of = {k: col for col, k in enumerate(up)}
    unstaffed = []
    for i, k in running:
        col = col_of.get(k)
        if col is not None and plan.uncovered[col] > 1e-6:
            unstaffed.append({"job": shop.jobs[i].name, "machine": shop.machines[k].name,
                              "hours": _h(plan.uncovered[col] * plan.slots[col])})
    shortage = None
    if plain_count is not None and plain_count > plan.planned_count:
        waiting = plain_count - plan.planned_count
        short = [label[o] for o in range(len(label))
                 if operator_hours[label[o]]["present"] * plan.capacity_of_operator[o]
                 - operator_hours[label[o]]["minding"] < 1e-6 and plan.present[o].any()]
        text = (f"{plain_count} jobs could run this shift but the crew's hours cover only "
                f"{plan.planned_count}: {waiting} wait")
        if short:
            text += f". Fully used: {', '.join(short)}"
        shortage = {"could_run": int(plain_count), "placed": plan.planned_count,
                    "waiting": int(waiting), "idle_machines": [], "text": text}
    staffing = {
        "operators_present": present,
        "operators_not_yet_here": later,
        "operators_absent": absent,
        "minding": minding,
        "unattended_machines": [shop.machines[k].name for col, k in enumerate(up)
                                if not plan.needs_operator[col]],
        "unstaffed_running": unstaffed,
        "shortage": shortage,
        "expiring": [dict(w, text=warning_text(w)) for w in expiring(shop)],
        "operator_hours": operator_hours,
        "periods": periods,
    }
    return staffing, operators_of, main
