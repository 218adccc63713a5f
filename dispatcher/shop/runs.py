"""The best run order of given jobs on one machine, priced by the changeovers they need.

The shop-level face of :func:`dispatcher.engine.order_runs`: it builds the changeover
matrix of the jobs from the machine's changeover table and mounted family, orders them,
and reads the order back in shop terms (each run with the change before it, from and to
which family, and planned start and end hours from the shift start).

How a change is priced (``c[a, b]`` between consecutive runs):

* into the first job: the pair's grid value (typed, else derived: the change from the
  mounted family; see :meth:`Shop.value`);
* from a job of family A into a job of family B: the table's change A -> B;
* into a job without a family, or on a machine without a table: the pair's grid value
  (the job's own setup whatever ran before), and after such a job the machine counts as
  cleaned (the table's "nothing mounted" row) when the next job has a family;
* at the end, with the machine's ``end_family`` set: the change from the last job's
  family into it.

A missing table entry means the change is not allowed. No triangle inequality is assumed.
When the shop's unit is setup minutes, changeovers take machine time (minutes / 60
hours) before the run; with a cost unit they take none.
"""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from dispatcher.engine import RunOrder, order_runs

from .model import Problem, Shop, ShopError
from .plan import json_number

__all__ = ["MachineRuns", "Run", "changeover_matrix", "machine_run_order"]


@dataclass(frozen=True)
class Run:
    """One job in a machine's run order, with the change before it."""

    job: str
    work_order: str
    from_family: str | None
    to_family: str | None
    changeover: float
    start_hour: float | None
    end_hour: float | None

    def to_json(self) -> dict[str, Any]:
        return {"job": self.job, "work_order": self.work_order, "from_family": self.from_family,
                "to_family": self.to_family, "changeover": json_number(self.changeover),
                "start_hour": _hour(self.start_hour), "end_hour": _hour(self.end_hour)}


@dataclass(frozen=True)
class MachineRuns:
    """A machine's run order and what is proven about it.

    ``total`` sums every change (into each run and, with an end family, out of the last
    one); ``lower_bound`` is a proven bound on the least possible total, ``gap`` the
    relative distance. ``hours_used`` counts runs and (in setup minutes) changes;
    ``fits`` says whether that is within ``shift_hours``.
    """

    machine: str
    mounted: str | None
    end_family: str | None
    runs: list[Run]
    end_change: float | None
    total: float
    lower_bound: float
    proven_optimal: bool
    gap: float
    hours_used: float | None
    shift_hours: float
    unit: str
    engine: RunOrder | None = field(default=None, repr=False, compare=False)

    @property
    def fits(self) -> bool | None:
        return None if self.hours_used is None else bool(self.hours_used <= self.shift_hours + 1e-9)

    def to_json(self) -> dict[str, Any]:
        return {"machine": self.machine, "mounted": self.mounted, "end_family": self.end_family,
                "runs": [r.to_json() for r in self.runs],
                "end_change": None if self.end_change is None else json_number(self.end_change),
                "total": json_number(self.total), "lower_bound": json_number(self.lower_bound),
                "proven_optimal": self.proven_optimal, "gap": json_number(round(self.gap, 9)),
                "hours_used": _hour(self.hours_used), "shift_hours": json_number(self.shift_hours),
                "fits": self.fits, "unit": self.unit}

    def text(self) -> str:
        """The run order as lines a supervisor reads."""
        unit = "min" if self.unit == "setup_minutes" else ""
        head = (f"{self.machine}: mounted {self.mounted or 'nothing'}"
                + (f", must end in {self.end_family}" if self.end_family else ""))
        lines = [head]
        for n, r in enumerate(self.runs, 1):
            when = ("" if r.start_hour is None else
                    f"  {_clock(r.start_hour)}-{_clock(r.end_hour)}")
            change = (f"change from family {r.from_family or 'nothing mounted'} to "
                      f"{r.to_family}: {_num(r.changeover)} {unit}".rstrip()
                      if r.to_family is not None else f"setup {_num(r.changeover)} {unit}".rstrip())
            lines.append(f"  {n}. {r.job}  ({change}){when}")
        if self.end_change is not None:
            lines.append(f"  then change to {self.end_family}: {_num(self.end_change)} {unit}".rstrip())
        proof = ("proven best" if self.proven_optimal else
                 f"best found, at most {100 * self.gap:.1f}% above the proven bound {_num(self.lower_bound)}")
        lines.append(f"  total changeover {_num(self.total)} {unit} ({proof})".replace("  (", " ("))
        if self.hours_used is not None:
            lines.append(f"  hours used {_num(round(self.hours_used, 2))} of {_num(self.shift_hours)}"
                         + ("" if self.fits else "  (beyond the shift)"))
        return "\n".join(lines)


def _hour(x: float | None):
    return None if x is None else json_number(round(x, 6))


def _num(x: float) -> str:
    return f"{x:g}"


def _clock(hour: float | None) -> str:
    """Hours from the shift start as +H:MM."""
    if hour is None:
        return "?"
    minutes = round(hour * 60)
    return f"+{minutes // 60}:{minutes % 60:02d}"


def changeover_matrix(shop: Shop, machine_id: str, job_ids: Sequence[str]) -> tuple[np.ndarray, int | None]:
    """``(c, end)``: node 0 the mounted setup, nodes 1..n the jobs, node n+1 the end family.

    ``end`` is ``n + 1`` when the machine has an end family, else None. NaN: not allowed.
    """
    machine = shop.machine(machine_id)
    table = shop.table_of(machine_id)
    jobs = [shop.job(j) for j in job_ids]
    n = len(jobs)
    size = n + 2 if machine.end_family is not None else n + 1
    c = np.full((size, size), np.nan)
    for b, job in enumerate(jobs, 1):
        v = shop.value(job.id, machine_id)
        c[0, b] = np.nan if v is None else v
        for a, prev in enumerate(jobs, 1):
            if a == b:
                continue
            if table is not None and job.family is not None:
                v = table.change(prev.family, job.family)   # prev.family None: cleaned row
            else:
                v = shop.value(job.id, machine_id)
            c[a, b] = np.nan if v is None else v
    end = None
    if machine.end_family is not None:
        end = n + 1
        for a, prev in enumerate([None, *jobs]):
            fam = machine.mounted if prev is None else prev.family
            v = table.change(fam, machine.end_family) if table is not None else None
            c[a, end] = np.nan if v is None else v
    return c, end


def machine_run_order(shop: Shop, machine_id: str, job_ids: Sequence[str], *,
                      time_limit: float | None = None, source: str = "") -> MachineRuns:
    """Order the given jobs on the machine for the least total changeover.

    Raises :class:`ShopError` naming the job (and the family and table) that cannot be
    placed in any order, or an unknown job or machine.
    """
    try:
        machine = shop.machine(machine_id)
    except KeyError:
        raise ShopError([Problem(f"machine id {machine_id!r}", "no such machine")], source) from None
    problems = []
    for jid in job_ids:
        try:
            shop.job(jid)
        except KeyError:
            problems.append(Problem(f"job id {jid!r}", "no such job"))
    if len(set(job_ids)) != len(job_ids):
        problems.append(Problem(shop.describe_machine(machine_id), "a job is listed twice"))
    if problems:
        raise ShopError(problems, source)
    c, end = changeover_matrix(shop, machine_id, job_ids)
    table = shop.table_of(machine_id)
    for b, jid in enumerate(job_ids, 1):
        if np.all(np.isnan(np.delete(c[:, b], b))):
            job = shop.job(jid)
            why = (f"family {job.family!r} is not in {shop.describe_machine(machine_id)}'s changeover "
                   f"table {table.id!r}" if table is not None and job.family is not None
                   else f"{shop.describe_machine(machine_id)} cannot run it (no value in the grid)")
            problems.append(Problem(f"{shop.describe_job(jid)}, field 'family'", why))
    if problems:
        raise ShopError(problems, source)
    result = order_runs(c, start=0, end=end, time_limit=time_limit)
    order = [int(k) for k in result.order if end is None or k != end]
    minutes = shop.unit.kind == "setup_minutes"
    hours = shop.hours_matrix()
    kpos = [m.id for m in shop.machines].index(machine_id)
    jpos = {j.id: i for i, j in enumerate(shop.jobs)}
    t: float | None = 0.0
    runs = []
    prev_node, prev_family = 0, machine.mounted
    for node in order:
        job = shop.job(job_ids[node - 1])
        change = float(c[prev_node, node])
        h = hours[jpos[job.id], kpos]
        start = None if t is None else float(t + (change / 60.0 if minutes else 0.0))
        stop = None if start is None or math.isnan(h) else float(start + h)
        runs.append(Run(job.name, job.work_order, prev_family if table is not None else None,
                        job.family if table is not None else None, change, start, stop))
        t = stop
        prev_node = node
        prev_family = job.family
    end_change = None if end is None else float(c[prev_node, end])
    used = None if t is None else t + (end_change / 60.0 if minutes and end_change else 0.0)
    capacity = float(shop.capacity()[kpos])
    return MachineRuns(machine.name, machine.mounted, machine.end_family, runs, end_change,
                       result.total, result.lower_bound, result.proven_optimal, result.gap,
                       used, capacity, shop.unit.kind, result)
