"""A whole-shift plan laid out in time: per machine its bars on the shift's hour axis.

What the app's timeline draws (and what a printed or exported view may use): for each
machine in the plan, the jobs already running, then each planned job preceded by its
changeover, then the change into the machine's end family, each with its start and end
hour from the start of the shift. Qt-free; built from a
:class:`~dispatcher.shop.fill_shift.ShiftFill` and the shop it was planned for.

For shops with families the hours are the plan's own (``runs``: each run's changeover,
start and end); a changeover priced in minutes takes that time on the machine, one priced
in cost units takes none (it is drawn as a mark at the job's start). For plain grids the
jobs follow each other in run order with the hours of the shop's hours matrix.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from .fill_shift import ShiftFill
from .model import Shop

__all__ = ["CHANGE", "END_CHANGE", "JOB", "RUNNING", "Bar", "Lane", "shift_timeline"]

RUNNING = "running"  # a job already on the machine when the shift plan starts
CHANGE = "change"  # a changeover before a planned job
JOB = "job"  # a planned job
END_CHANGE = "end_change"  # the change into the machine's end family


@dataclass(frozen=True)
class Bar:
    """One stretch of a machine's shift, in hours from the start of the shift."""

    kind: str
    start: float
    end: float
    job: str | None = None
    family: str | None = None
    from_family: str | None = None
    changeover: float | None = None


@dataclass(frozen=True)
class Lane:
    """One machine's row of the timeline; ``capacity`` is its hours this shift."""

    machine: str
    capacity: float
    bars: list[Bar] = field(default_factory=list)
    mounted: str | None = None
    end_family: str | None = None

    def used(self) -> float:
        return max((b.end for b in self.bars), default=0.0)


def _hours(shop: Shop) -> dict[tuple[str, str], float]:
    matrix = shop.hours_matrix()
    out = {}
    for i, j in enumerate(shop.jobs):
        for k, m in enumerate(shop.machines):
            if not math.isnan(matrix[i, k]):
                out[(j.name, m.name)] = float(matrix[i, k])
    return out


def shift_timeline(shop: Shop, fill: ShiftFill) -> list[Lane]:
    """The lanes of ``fill``, one per machine in the plan's order."""
    hours = _hours(shop)
    families = {j.name: j.family for j in shop.jobs}
    tau = 1 / 60 if shop.unit.kind == "setup_minutes" else 0.0
    lanes = []
    for ms in fill.machines:
        try:
            machine = shop.machine_by_name(ms.machine)
        except KeyError:
            continue
        bars: list[Bar] = []
        t = 0.0
        for name in ms.running:
            h = hours.get((name, ms.machine), 0.0)
            bars.append(Bar(RUNNING, t, t + h, name, families.get(name)))
            t += h
        if ms.runs is not None:
            for run in ms.runs:
                start, stop = float(run["start_hour"]), float(run["end_hour"])
                change = run.get("changeover")
                change_from = start - float(change) * tau if change is not None else start
                if change is not None and float(change) > 0:  # no bar for a change that costs nothing
                    bars.append(
                        Bar(
                            CHANGE,
                            max(change_from, t),
                            start,
                            run["job"],
                            run.get("to_family"),
                            run.get("from_family"),
                            float(change),
                        )
                    )
                bars.append(
                    Bar(
                        JOB,
                        start,
                        stop,
                        run["job"],
                        run.get("to_family"),
                        run.get("from_family"),
                        None if change is None else float(change),
                    )
                )
                t = stop
            if ms.end_change is not None and machine.end_family is not None:
                last = ms.runs[-1]["to_family"] if ms.runs else machine.mounted
                bars.append(
                    Bar(END_CHANGE, t, t + ms.end_change * tau, None, machine.end_family, last, float(ms.end_change))
                )
        else:
            for name in ms.jobs:
                h = hours.get((name, ms.machine), 0.0)
                bars.append(Bar(JOB, t, t + h, name, families.get(name)))
                t += h
        lanes.append(Lane(ms.machine, float(ms.capacity), bars, machine.mounted, machine.end_family))
    return lanes
