"""What-if costs per job and machine, for the app's map and ``solve --what-if``.

The numbers are the engine's exact what-if costs (:func:`dispatcher.engine.whatif.what_if`)
on the problem the plan was solved on; this module only maps the problem's rows (waiting
jobs) and columns (machine slots) back to jobs and machines. A machine with several slots
takes the least extra over its slots (any free slot will do): :func:`machine_minimum`,
the one place that rule is written. For a shop with a crew the costs are those of the
staffed plan (:func:`dispatcher.engine.staffed_choices.staffed_what_if`): forcing a pair
keeps a present, qualified operator on every running machine.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from dispatcher.engine.staffed_choices import staffed_what_if
from dispatcher.engine.whatif import what_if

from .model import UP
from .plan import Plan
from .planning import Cancelled

NOT_APPLICABLE = "n/a"


def machine_minimum(extra: np.ndarray, columns, machines) -> np.ndarray:
    """Per row and machine, the least of ``extra`` over that machine's slot columns.

    ``columns[c]`` labels the machine of engine column c (a machine with several slots
    labels several columns); ``machines`` lists the labels to report, in order (a machine
    with no column, for example one that is down, gets NaN). NaN where no slot allows it.
    """
    extra = np.asarray(extra, dtype=float)
    labels = list(columns)
    out = np.full((extra.shape[0], len(machines)), np.nan)
    for k, machine in enumerate(machines):
        slots = [c for c, label in enumerate(labels) if label == machine]
        if not slots:
            continue
        block = extra[:, slots]
        with np.errstate(all="ignore"):
            out[:, k] = np.where(np.isnan(block).all(axis=1), np.nan,
                                 np.nanmin(np.where(np.isnan(block), np.inf, block), axis=1))
    return out


@dataclass(frozen=True)
class WhatIfGrid:
    """``extra[i, k]``: how much worse the best plan with job i on machine k is (0 on the
    plan, NaN where no plan can contain the pair). ``in_problem[i]``: job i was waiting
    (others run already or are done). ``planned[i]``: machine index of job i in the plan or
    -1. ``best_other[i]``/``best_other_extra[i]``: the cheapest other machine (-1/NaN if none).
    ``wait_extra[i]``: extra for keeping job i waiting (NaN if impossible).
    """

    objective: str
    extra: np.ndarray
    in_problem: np.ndarray
    machine_up: np.ndarray
    planned: np.ndarray
    best_other: np.ndarray
    best_other_extra: np.ndarray
    wait_extra: np.ndarray

    @property
    def largest(self) -> float:
        finite = self.extra[np.isfinite(self.extra)]
        return float(finite.max()) if finite.size else 0.0


def what_if_grid(plan: Plan, cancel=None) -> WhatIfGrid:
    """Map the engine's what-if costs for ``plan`` onto its shop (raises ValueError for
    the bottleneck objective, where one number per pair does not describe the plans, and
    :class:`~dispatcher.shop.planning.Cancelled` when ``cancel`` is set)."""
    problem, result = plan.problem, plan.result
    if problem is None or result is None:
        raise ValueError("this plan carries no solver result to compute what-if costs from")
    shop = problem.shop
    n_jobs, n_machines = len(shop.jobs), len(shop.machines)
    rows = np.asarray(problem.rows, dtype=np.int64)
    cols = np.asarray(problem.columns, dtype=np.int64)
    extra = np.full((n_jobs, n_machines), np.nan)
    planned = np.full(n_jobs, -1, dtype=np.int64)
    wait_extra = np.full(n_jobs, np.nan)
    if plan.staffing is not None:
        # staffed: machines are the engine's columns, placeholders of running machines follow
        n = len(rows)
        staffed_extra, staffed_wait = staffed_what_if(result, cancel)
        extra[rows] = staffed_extra[:n]
        wait_extra[rows] = staffed_wait[:n]
        placed = result.machine_of_job[:n] >= 0
        planned[rows[placed]] = result.machine_of_job[:n][placed]
    else:
        w = what_if(result)
        extra[rows] = machine_minimum(w.extra, cols.tolist(), range(n_machines))
        wait_extra[rows] = w.wait_extra
        placed = result.machine_of_job >= 0
        planned[rows[placed]] = cols[result.machine_of_job[placed]]
    if cancel is not None and cancel.is_set():
        raise Cancelled("what-if costs cancelled")
    in_problem = np.zeros(n_jobs, dtype=bool)
    in_problem[rows] = True
    others = extra.copy()
    has_plan = planned >= 0
    others[np.flatnonzero(has_plan), planned[has_plan]] = np.nan
    best_other = np.full(n_jobs, -1, dtype=np.int64)
    best_other_extra = np.full(n_jobs, np.nan)
    ok = ~np.isnan(others).all(axis=1) if n_machines else np.zeros(n_jobs, dtype=bool)
    if ok.any():
        best_other[ok] = np.nanargmin(others[ok], axis=1)
        best_other_extra[ok] = others[np.flatnonzero(ok), best_other[ok]]
    machine_up = np.array([m.state == UP for m in shop.machines], dtype=bool)
    return WhatIfGrid(result.objective, extra, in_problem, machine_up, planned, best_other,
                      best_other_extra, wait_extra)
