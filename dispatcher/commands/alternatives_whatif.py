"""``dispatcher solve --alternatives K`` and ``--what-if``: ranked plans and exact what-if costs.

JSON keys added to the solve contract:

* ``"alternatives"``: ``[{"total", "assignments": [{"job", "machine", "cost"}]}, ...]``, best
  first; the first is the plan itself. Plans are distinct as sets of (job, machine) pairs
  (see :mod:`dispatcher.engine.ranking`); a machine with several free slots counts once.
* ``"what_if"``: ``{job: {machine: extra or null}}``: how much worse the best plan that runs
  the job on that machine is than this plan (0 on the plan; null where no plan that places
  as many jobs and every must-run job can contain the pair). For ``--maximize`` it is the
  loss of total value.
"""

from __future__ import annotations

import argparse
from typing import Any

import numpy as np

from dispatcher.commands.common import CliError
from dispatcher.engine import DispatchResult, what_if
from dispatcher.jsonnum import json_number
from dispatcher.shop.alternatives import ranked_choices
from dispatcher.shop.whatif import machine_minimum

MAX_ALTERNATIVES = 1000


def add_arguments(p: argparse.ArgumentParser) -> None:
    p.add_argument("--alternatives", metavar="K", type=int, default=None,
                   help="also list the K best distinct plans, best first (the first is the plan)")
    p.add_argument("--what-if", action="store_true",
                   help="also give, for every job and machine, how much worse the best plan "
                        "with that pair is (null: no plan can contain it)")


def check_arguments(args: argparse.Namespace, objective: str) -> None:
    """Refuse combinations these options do not support, before any work is done."""
    wanted = args.alternatives is not None or args.what_if
    if not wanted:
        return
    if args.alternatives is not None and not 1 <= args.alternatives <= MAX_ALTERNATIVES:
        raise CliError(f"--alternatives: expected a whole number from 1 to {MAX_ALTERNATIVES}, "
                       f"got {args.alternatives}")
    if objective == "bottleneck":
        raise CliError("--alternatives and --what-if work with the least total (default) or "
                       "--maximize, not --bottleneck")
    if getattr(args, "fill_shift", False):
        raise CliError("--alternatives and --what-if cannot be combined with --fill-shift")


def added_keys(result: DispatchResult, args: argparse.Namespace, jobs: list[str],
               columns: list[str], machines: list[str] | None = None) -> dict[str, Any]:
    """The added JSON keys. ``columns[c]`` names the machine of engine column c (a machine
    with several slots appears several times); ``machines`` lists every machine to report
    in ``what_if`` (default: the distinct column names)."""
    out: dict[str, Any] = {}
    if args.alternatives is not None:
        out["alternatives"] = _alternatives(result, args.alternatives, jobs, columns)
    if args.what_if:
        out["what_if"] = _what_if(result, jobs, columns, machines)
    return out


def staffed_added_keys(plan, args: argparse.Namespace, machines: list[str]) -> dict[str, Any]:
    """The same keys for a shop with a crew: ranked staffed plans (each assignment with its
    ``operator``) and staffed what-if costs (:mod:`dispatcher.engine.staffed_choices`)."""
    from dispatcher.shop.alternatives import alternative_plans
    from dispatcher.shop.whatif import what_if_grid

    out: dict[str, Any] = {}
    if args.alternatives is not None:
        out["alternatives"] = [
            {"total": json_number(p.total),
             "assignments": [{"job": a.job, "machine": a.machine, "cost": json_number(a.cost),
                              "operator": a.operator} for a in p.assignments]}
            for p in alternative_plans(plan, args.alternatives)]
    if args.what_if:
        grid = what_if_grid(plan)
        shop = plan.problem.shop
        out["what_if"] = {
            shop.jobs[i].name: {m: (None if np.isnan(grid.extra[i, k]) else json_number(float(grid.extra[i, k])))
                                for k, m in enumerate(machines)}
            for i in np.flatnonzero(grid.in_problem)}
    return out


def _alternatives(result: DispatchResult, k: int, jobs: list[str],
                  columns: list[str]) -> list[dict[str, Any]]:
    # Columns with the same machine name are slots of one machine (ranked over machines).
    return [{"total": json_number(choice.total), "assignments": [
        {"job": jobs[j], "machine": columns[c], "cost": json_number(result.values[j, c])}
        for j, c in choice.pairs]} for choice in ranked_choices(result, k, columns)]


def _what_if(result: DispatchResult, jobs: list[str], columns: list[str],
             machines: list[str] | None) -> dict[str, dict[str, Any]]:
    names = machines if machines is not None else list(dict.fromkeys(columns))
    best = machine_minimum(what_if(result).extra, columns, names)
    return {job: {m: (None if np.isnan(best[j, k]) else json_number(float(best[j, k])))
                  for k, m in enumerate(names)} for j, job in enumerate(jobs)}


def print_text(data: dict[str, Any], plan_assignments: list[dict[str, Any]]) -> None:
    """Readable form of the alternatives and what-if costs after the plan."""
    if "alternatives" in data:
        mine = {(a["job"], a["machine"]) for a in plan_assignments}
        print()
        print(f"Ranked plans ({len(data['alternatives'])}, best first):")
        for n, alt in enumerate(data["alternatives"], 1):
            pairs = {(a["job"], a["machine"]) for a in alt["assignments"]}
            if pairs == mine:
                note = "this plan"
            else:
                moved = sorted(pairs - mine)
                note = "differs: " + ", ".join(f"{j} on {m}" for j, m in moved[:6])
                if len(moved) > 6:
                    note += f" and {len(moved) - 6} more"
                left = {j for j, _ in mine} - {j for j, _ in pairs}
                if left:
                    note += "; waiting: " + ", ".join(sorted(left))
            print(f"  {n:>3}. total {alt['total']:g}  ({note})")
    if "what_if" in data:
        print()
        print("What-if: cheapest other machine per job (extra over this plan):")
        placed = {a["job"]: a["machine"] for a in plan_assignments}
        for job, row in data["what_if"].items():
            others = [(x, m) for m, x in row.items() if x is not None and m != placed.get(job)]
            if others:
                x, m = min(others)
                print(f"  {job}: {m} (+{x:g})")
            else:
                print(f"  {job}: no other machine possible")
