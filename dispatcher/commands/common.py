"""What every sub-command shares: exit codes, the command-line error, the plan output contract."""

from __future__ import annotations

import json
import sys
from typing import Any

import numpy as np

from dispatcher.engine import DispatchResult
from dispatcher.errors import (
    EXIT_BAD_INPUT,
    EXIT_CONFLICT,
    EXIT_HISTORY,
    EXIT_INFEASIBLE,
    EXIT_INTERNAL,
    EXIT_OK,
    BadInputError,
    InternalError,
)
from dispatcher.jsonnum import json_number
from dispatcher.shop.plan import parts_text, parts_word

EXIT_STORE = EXIT_HISTORY  # the name the commands used before the error root
__all__ = ["EXIT_BAD_INPUT", "EXIT_CONFLICT", "EXIT_HISTORY", "EXIT_INFEASIBLE", "EXIT_INTERNAL", "EXIT_OK",
           "EXIT_STORE", "CliError", "plan_json", "print_json", "print_plan",
           "wait_reason_text", "parts_text", "parts_word"]


class CliError(BadInputError):
    """A command-line problem (an option, a name given on the command line) with no other
    home in the core: one line on stderr, exit code 2 unless ``exit_code`` says otherwise.

    Errors from the core are not wrapped in it: they carry their own exit code and
    :func:`dispatcher.cli.main` reports them all the same way.
    """

    def __init__(self, message: str, exit_code: int = EXIT_BAD_INPUT, **where):
        super().__init__(message, **where)
        self.exit_code = exit_code


def plan_json(result: DispatchResult, jobs: list[str], machines: list[str]) -> dict[str, Any]:
    """The solve output contract for an engine result with names attached.

    Keys fixed by the contract: status, objective, total, assignments (job, machine, cost),
    waiting_jobs, idle_machines. Ours: bottleneck, waiting_reasons (job -> group number and
    sentence), wait_groups (the jobs competing for the same machines, and those machines),
    certificate.
    """
    assignments = []
    for j in np.flatnonzero(result.machine_of_job >= 0):
        m = int(result.machine_of_job[j])
        assignments.append({"job": jobs[j], "machine": machines[m],
                            "cost": json_number(result.values[j, m])})
    reasons: dict[str, dict[str, Any]] = {}
    groups = []
    for g, w in enumerate(result.wait_groups()):
        groups.append({"jobs": [jobs[i] for i in w.jobs], "machines": [machines[i] for i in w.machines]})
        for j in w.jobs[result.machine_of_job[w.jobs] < 0]:
            reasons[jobs[j]] = {"group": g,
                                "text": wait_reason_text(jobs, machines, int(j), w)}
    reasons = {jobs[j]: reasons[jobs[j]] for j in result.waiting_jobs}
    return {
        "status": "optimal",
        "objective": result.objective,
        "total": json_number(result.total),
        "assignments": assignments,
        "waiting_jobs": [jobs[j] for j in result.waiting_jobs],
        "idle_machines": [machines[m] for m in result.idle_machines],
        "bottleneck": None if result.bottleneck is None else json_number(result.bottleneck),
        "waiting_reasons": reasons,
        "wait_groups": groups,
        "certificate": {"verified": result.verify()},
        "rush_waiting": [],
        "total_parts": _grid_parts(result),
    }


def _grid_parts(result: DispatchResult) -> dict[str, Any]:
    placed = result.machine_of_job >= 0
    planned = float(result.values[np.flatnonzero(placed), result.machine_of_job[placed]].sum())
    return {"planned": json_number(planned), "wait_penalties": json_number(result.wait_penalty[~placed].sum()),
            "move_penalties": 0}


def wait_reason_text(jobs: list[str], machines: list[str], job: int, witness) -> str:
    """One sentence a supervisor can check by hand."""
    if len(witness.machines) == 0:
        return f"{jobs[job]}: no available machine can run it"
    if len(witness.machines) == len(machines) and len(witness.jobs) == len(jobs):
        return (f"{jobs[job]}: more jobs than free machine slots ({len(jobs)} jobs, "
                f"{len(machines)} free slots), so {witness.deficiency} of them must wait")
    names = ", ".join(machines[m] for m in witness.machines)
    return (f"{jobs[job]}: {len(witness.jobs)} jobs can only run on {len(witness.machines)} "
            f"machine(s) ({names}), so {witness.deficiency} of them must wait")


def print_json(obj: Any) -> None:
    """Print strict JSON: a non-finite number (which JSON cannot spell) prints nothing."""
    try:
        text = json.dumps(obj, indent=2, ensure_ascii=False, allow_nan=False)
    except ValueError as exc:
        raise InternalError(f"{exc}; nothing was printed") from None
    sys.stdout.write(text + "\n")


def print_plan(data: dict[str, Any], unit: str = "", marks: dict[str, str] | None = None) -> None:
    """Readable table of a plan in the solve contract; ``marks`` adds a tag after a job's
    name (rush, pinned). A plan of a shop with a crew gets an operator column."""
    marks = marks or {}

    def tagged(job: str) -> str:
        return f"{job} {marks[job]}" if job in marks else job

    staffed = "staffing" in data
    rows = [(tagged(a["job"]), a["machine"], f"{a['cost']:g}")
            + ((a.get("operator") or "(runs unattended)",) if staffed else ())
            for a in data["assignments"]]
    head = ("Job", "Machine", f"Value{(' (' + unit + ')') if unit else ''}") \
        + (("Operator",) if staffed else ())
    widths = [max(len(str(r[i])) for r in rows + [head]) for i in range(len(head))]
    line = "  ".join(h.ljust(w) for h, w in zip(head, widths))
    print(line.rstrip())
    print("  ".join("-" * w for w in widths))
    for r in rows:
        cells = [r[0].ljust(widths[0]), r[1].ljust(widths[1]), r[2].rjust(widths[2])] + list(r[3:])
        print("  ".join(cells))
    print()
    if data["waiting_jobs"]:
        print(f"Waiting jobs ({len(data['waiting_jobs'])}):")
        # One sentence per reason: jobs of one group share it (the sheet does the same).
        by_reason: dict[str, list[str]] = {}
        for name in data["waiting_jobs"]:
            reason = data.get("waiting_reasons", {}).get(name, {}).get("text", "")
            by_reason.setdefault(reason.split(": ", 1)[-1] if reason else "", []).append(name)
        for why, names in by_reason.items():
            print("  " + ", ".join(tagged(n) for n in names) + (f"  - {why}" if why else ""))
    else:
        print("Waiting jobs: none")
    idle = data["idle_machines"]
    print(f"Idle machines: {', '.join(idle) if idle else 'none'}")
    label = {"total": "Total", "maximize": "Total value", "bottleneck": "Total"}[data["objective"]]
    print(f"{label}: {data['total']:g}" + parts_text(data, unit))
    if data.get("bottleneck") is not None:
        print(f"Largest single value: {data['bottleneck']:g}")
    cert = data.get("certificate", {})
    if cert:
        print("Optimality certificate: " + ("checked" if cert.get("verified") else "FAILED"))
