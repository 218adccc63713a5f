"""Consistency checks of a :class:`~dispatcher.shop.model.Shop`, each problem with its place.

The document reader checks types and fields; this module checks what only the whole shop
can tell: unique ids and names, references that point somewhere, states that agree with
each other (a running job needs a machine that is up and has a slot for it), and pins that
can all hold at once (no pair both forced and forbidden, no job forced onto two machines,
no machine forced to take more jobs than its free slots).
"""

from __future__ import annotations

import math
from collections import Counter, defaultdict

from dispatcher.limits import MAX_SLOTS, MAX_VALUE, name_problem

from .crew import crew_problems
from .model import (
    DONE,
    JOB_STATES,
    MACHINE_STATES,
    MUST,
    MUST_NOT,
    PIN_KINDS,
    RUNNING,
    UNIT_KINDS,
    UP,
    Problem,
    Shop,
    ShopError,
    describe,
)


def _finite(x: object) -> bool:
    """A real number within the value limit (dispatcher.limits.MAX_VALUE, so totals stay finite)."""
    return (isinstance(x, (int, float)) and not isinstance(x, bool) and math.isfinite(x)
            and abs(x) <= MAX_VALUE)


def shop_problems(shop: Shop) -> list[Problem]:
    """Every problem found in ``shop`` (empty list when it can be solved as it is)."""
    out: list[Problem] = []
    add = lambda where, msg: out.append(Problem(where, msg))  # noqa: E731

    if shop.unit.kind not in UNIT_KINDS:
        add("unit, field 'kind'", f"{shop.unit.kind!r} is not one of {', '.join(UNIT_KINDS)}")
    if not _finite(shop.shift.hours) or shop.shift.hours <= 0:
        add("shift, field 'hours'", f"{shop.shift.hours!r} must be a number > 0 and at most 1e12")
    if not _finite(shop.move_penalty) or shop.move_penalty < 0:
        add("shop, field 'move_penalty'", f"{shop.move_penalty!r} must be a number from 0 to 1e12")
    if not shop.jobs:
        add("jobs", "the shop has no jobs; add at least one job")
    if not shop.machines:
        add("machines", "the shop has no machines; add at least one machine")

    for what, items in (("job", shop.jobs), ("machine", shop.machines)):
        for ident, n in Counter(x.id for x in items).items():
            if n > 1:
                add(f"{what} id {ident!r}", f"is used by {n} {what}s; ids must be unique")
        for name, n in Counter(x.name for x in items).items():
            if n > 1:
                add(f"{what} name {name!r}", f"is used by {n} {what}s; names must be unique")
        for x in items:
            if not isinstance(x.id, str) or not x.id.strip():
                add(f"{what} {x.name!r}, field 'id'", "must be a non-empty text")
            if not isinstance(x.name, str) or not x.name.strip():
                add(f"{what} id {x.id!r}, field 'name'", "must be a non-empty text")
            for fname in ("id", "name"):
                v = getattr(x, fname)
                problem = name_problem(v) if isinstance(v, str) else None
                if problem:
                    add(f"{what} #{items.index(x) + 1}, field '{fname}'", problem)

    machine_ids = {m.id for m in shop.machines}
    job_ids = {j.id for j in shop.jobs}
    running_on: dict[str, list[str]] = defaultdict(list)

    # describe_job/describe_machine name the first item with an id; looked up once here
    # (a search per item made checking a 1000-job shop quadratic)
    first_job = {j.id: j for j in reversed(shop.jobs)}
    first_machine = {m.id: m for m in reversed(shop.machines)}
    for m in shop.machines:
        where = describe("machine", first_machine[m.id])
        if m.state not in MACHINE_STATES:
            add(f"{where}, field 'state'", f"{m.state!r} is not one of {', '.join(MACHINE_STATES)}")
        if isinstance(m.slots, bool) or not isinstance(m.slots, int) or not 1 <= m.slots <= MAX_SLOTS:
            add(f"{where}, field 'slots'", f"{m.slots!r} must be a whole number from 1 to {MAX_SLOTS}")
        if m.shift_hours is not None and (not _finite(m.shift_hours) or m.shift_hours < 0):
            add(f"{where}, field 'shift_hours'", f"{m.shift_hours!r} must be a number from 0 to 1e12")
        if not _finite(m.speed_factor) or m.speed_factor <= 0:
            add(f"{where}, field 'speed_factor'", f"{m.speed_factor!r} must be a number > 0 and at most 1e12")

    for j in shop.jobs:
        where = describe("job", first_job[j.id])
        if j.state not in JOB_STATES:
            add(f"{where}, field 'state'", f"{j.state!r} is not one of {', '.join(JOB_STATES)}")
        for fname in ("wait_penalty",):
            v = getattr(j, fname)
            if not _finite(v) or v < 0:
                add(f"{where}, field '{fname}'", f"{v!r} must be a number from 0 to 1e12")
        for fname in ("move_penalty", "run_hours"):
            v = getattr(j, fname)
            if v is not None and (not _finite(v) or v < 0):
                add(f"{where}, field '{fname}'", f"{v!r} must be a number from 0 to 1e12")
        if j.state == RUNNING:
            if j.machine is None:
                add(f"{where}, field 'machine'", "a running job needs the machine it runs on")
            elif j.machine not in machine_ids:
                add(f"{where}, field 'machine'", f"names unknown machine id {j.machine!r}")
            else:
                running_on[j.machine].append(j.id)
                m = shop.machine(j.machine)
                if m.state != UP:
                    add(f"{where}, field 'machine'",
                        f"is running on {shop.describe_machine(m.id)}, which is {m.state}; "
                        "set the job back to waiting (or done) or the machine back up")
        elif j.machine is not None:
            add(f"{where}, field 'machine'", f"only a running job has a machine (state is {j.state})")

    for mid, jobs in running_on.items():
        m = shop.machine(mid)
        if isinstance(m.slots, int) and len(jobs) > m.slots:
            add(f"{shop.describe_machine(mid)}, field 'slots'",
                f"{len(jobs)} jobs are running on it ({', '.join(shop.job(j).name for j in jobs)}) "
                f"but it has {m.slots} slot(s)")

    def pair(block: str, jid: str, mid: str) -> str:
        return f"{block}, {shop.describe_job(jid)}, {shop.describe_machine(mid)}"

    for (jid, mid), v in shop.grid.items():
        # the place is spelled out only for a problem: grids have up to millions of cells,
        # so a sound cell (known ids, a float or int from 0 to the limit; NaN fails the
        # comparison) is passed by the cheapest test first
        if (type(v) is float or type(v) is int) and 0 <= v <= MAX_VALUE and jid in job_ids \
                and mid in machine_ids:
            continue
        if jid not in job_ids:
            add(pair("grid", jid, mid), f"names unknown job id {jid!r}")
        if mid not in machine_ids:
            add(pair("grid", jid, mid), f"names unknown machine id {mid!r}")
        if not _finite(v) or v < 0:
            shown = f"{v:g}" if _finite(v) else repr(v)
            add(pair("grid", jid, mid), f"value {shown} must be a number from 0 to 1e12 (leave the cell "
                "out when the machine cannot run the job)")
    for (jid, mid), v in shop.hours.items():
        if jid not in job_ids or mid not in machine_ids:
            add(pair("hours", jid, mid), "names an unknown job or machine id")
        if not _finite(v) or v < 0:
            add(pair("hours", jid, mid), f"{v!r} must be a number from 0 to 1e12")

    out.extend(pin_problems(shop, running_on))
    out.extend(changeover_problems(shop))

    placed: dict[str, str] = {}
    for mid, jids in shop.plan_in_force.items():
        where = f"plan_in_force, {shop.describe_machine(mid)}"
        if mid not in machine_ids:
            add(where, f"names unknown machine id {mid!r}")
        elif len(jids) > shop.machine(mid).slots:
            add(where, f"holds {len(jids)} jobs but the machine has {shop.machine(mid).slots} "
                "slot(s)")
        for jid in jids:
            if jid not in job_ids:
                add(where, f"names unknown job id {jid!r}")
            elif jid in placed:
                add(where, f"{shop.describe_job(jid)} is also planned on "
                    f"{shop.describe_machine(placed[jid])}")
            placed[jid] = mid
    out.extend(crew_problems(shop))
    return out


def pin_problems(shop: Shop, running_on: dict[str, list[str]]) -> list[Problem]:
    """Pins naming unknown ids, contradicting each other, or over-filling a machine."""
    out: list[Problem] = []
    machine_ids = {m.id for m in shop.machines}
    job_ids = {j.id for j in shop.jobs}
    forced: dict[str, list[str]] = defaultdict(list)  # job -> machines it must go to
    kinds: dict[tuple[str, str], set[str]] = defaultdict(set)
    for n, p in enumerate(shop.pins, start=1):
        where = f"pin {n} ({shop.describe_job(p.job)} -> {shop.describe_machine(p.machine)})"
        ok = True
        if p.kind not in PIN_KINDS:
            out.append(Problem(f"{where}, field 'kind'", f"{p.kind!r} is not one of {', '.join(PIN_KINDS)}"))
            ok = False
        if p.job not in job_ids:
            out.append(Problem(f"{where}, field 'job'", f"names unknown job id {p.job!r}"))
            ok = False
        if p.machine not in machine_ids:
            out.append(Problem(f"{where}, field 'machine'", f"names unknown machine id {p.machine!r}"))
            ok = False
        if not ok:
            continue
        kinds[(p.job, p.machine)].add(p.kind)
        job, machine = shop.job(p.job), shop.machine(p.machine)
        if p.kind != MUST or job.state == DONE:
            continue
        if job.state == RUNNING:
            if job.machine != p.machine:
                out.append(Problem(where, f"the job is already running on "
                                   f"{shop.describe_machine(job.machine)}"))
            continue
        if p.machine not in {m for m in forced[p.job]}:
            forced[p.job].append(p.machine)
        if machine.state != UP:
            out.append(Problem(where, f"the machine is {machine.state}; it can take no job"))
        if shop.value(p.job, p.machine) is None:
            out.append(Problem(where, "the grid says this machine cannot run this job"))

    for (jid, mid), ks in kinds.items():
        if ks == {MUST, MUST_NOT}:
            out.append(Problem(f"pins on {shop.describe_job(jid)} and {shop.describe_machine(mid)}",
                               "the job is pinned both to and away from this machine"))
    onto: dict[str, list[str]] = defaultdict(list)
    for jid, mids in forced.items():
        if len(mids) > 1:
            out.append(Problem(f"pins on {shop.describe_job(jid)}",
                               "the job is pinned to more than one machine: "
                               + ", ".join(shop.machine(m).name for m in mids)))
        for mid in mids:
            onto[mid].append(jid)
    for mid, jids in onto.items():
        m = shop.machine(mid)
        free = (m.slots if isinstance(m.slots, int) else 1) - len(running_on.get(mid, []))
        if len(jids) > free:
            out.append(Problem(
                f"pins on {shop.describe_machine(mid)}",
                f"{len(jids)} jobs are pinned to it ({', '.join(shop.job(j).name for j in jids)}) "
                f"but it has {max(free, 0)} free slot(s)"))
    return out


def changeover_problems(shop: Shop) -> list[Problem]:
    """Changeover tables and families that cannot be used as they are.

    Refused: a table without an id or with an id used twice, a table naming a machine
    that does not exist (or a machine in two tables), family names empty or listed twice,
    an entry naming a family the table does not list, an entry that is not a number >= 0,
    a job family that is empty text, and a machine whose mounted or end family no table
    knows (its own table when it has one). A job whose family is missing from a
    machine's table is not an error: the job cannot run there (it waits, with the reason).
    """
    out: list[Problem] = []

    def add(where: str, msg: str) -> None:
        out.append(Problem(where, msg))

    machine_ids = {m.id for m in shop.machines}
    owner: dict[str, str] = {}
    for ident, n in Counter(t.id for t in shop.changeover_tables).items():
        if n > 1:
            add(f"changeover table id {ident!r}", f"is used by {n} tables; ids must be unique")
    for n, t in enumerate(shop.changeover_tables, start=1):
        where = f"changeover table {t.name or t.id!r} (#{n})"
        if not isinstance(t.id, str) or not t.id.strip():
            add(f"{where}, field 'id'", "must be a non-empty text")
        for mid in t.machines:
            if mid not in machine_ids:
                add(f"{where}, field 'machines'", f"names unknown machine id {mid!r}")
            elif mid in owner and owner[mid] != t.id:
                add(f"{where}, field 'machines'",
                    f"{shop.describe_machine(mid)} is already in changeover table {owner[mid]!r}; "
                    "a machine belongs to one table")
            else:
                owner[mid] = t.id
        for fam, k in Counter(t.families).items():
            if k > 1:
                add(f"{where}, field 'families'", f"family {fam!r} is listed {k} times; names must be unique")
        for fam in t.families:
            if not isinstance(fam, str) or not fam.strip():
                add(f"{where}, field 'families'", "a family name must be a non-empty text")
        known = set(t.families)
        for (a, b), v in t.changes.items():
            cell = f"{where}, change from {'nothing mounted' if a is None else repr(a)} to {b!r}"
            if a is not None and a not in known:
                add(cell, f"family {a!r} is not in the table's families")
            if b not in known:
                add(cell, f"family {b!r} is not in the table's families")
            if not _finite(v) or v < 0:
                add(cell, f"value {v!r} must be a number >= 0 (leave the entry out when the "
                    "change is not allowed)")
    job_ids = {j.id for j in shop.jobs}
    for jid, mid in sorted(shop.blocked):
        if jid not in job_ids or mid not in machine_ids:
            add(f"grid, {shop.describe_job(jid)}, {shop.describe_machine(mid)}",
                "a pair typed as cannot run names an unknown job or machine id")
    every_family = {f for t in shop.changeover_tables for f in t.families}
    for m in shop.machines:
        table = shop.table_of(m.id)
        for fname in ("mounted", "end_family"):
            fam = getattr(m, fname)
            if fam is None:
                continue
            if table is not None and fam not in table.families:
                add(f"{shop.describe_machine(m.id)}, field '{fname}'",
                    f"family {fam!r} is not in the machine's changeover table {table.id!r}")
            elif table is None and fam not in every_family:
                add(f"{shop.describe_machine(m.id)}, field '{fname}'",
                    f"no changeover table knows family {fam!r}")
    for j in shop.jobs:
        if j.family is not None and (not isinstance(j.family, str) or not j.family.strip()):
            add(f"{shop.describe_job(j.id)}, field 'family'", "must be a non-empty text or null")
    return out


def check_shop(shop: Shop, source: str = "") -> None:
    """Raise :class:`ShopError` listing every problem, if there is any."""
    problems = shop_problems(shop)
    if problems:
        raise ShopError(problems, source)
