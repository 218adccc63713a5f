"""The shop in a supervisor's terms: jobs, machines, the grid of values, pins, states.

Plain dataclasses, no Qt and no files (reading and writing documents lives in
:mod:`dispatcher.io.shopfile`). Jobs and machines carry a stable ``id`` (what the grid,
pins and the plan in force refer to, so renaming keeps references intact) and a display
``name`` (what plans, tables and printed sheets show; unique within the shop).

Every mutable container is owned by its :class:`Shop`; :meth:`Shop.copy` gives an
independent deep copy for what-if work (re-dispatch, undo snapshots).
"""

from __future__ import annotations

import copy
import math
from dataclasses import dataclass, field, replace
from datetime import date, datetime, time

import numpy as np

from dispatcher.errors import BadInputError

from .crew import Crew

# Job states.
WAITING, RUNNING, DONE = "waiting", "running", "done"
JOB_STATES = (WAITING, RUNNING, DONE)

# Machine states. Only an "up" machine takes jobs.
UP, DOWN, MAINTENANCE = "up", "down", "maintenance"
MACHINE_STATES = (UP, DOWN, MAINTENANCE)

# Pin kinds.
MUST, MUST_NOT = "must", "must_not"
PIN_KINDS = (MUST, MUST_NOT)

# Units of the grid values.
UNIT_KINDS = ("setup_minutes", "cost")


class ShopError(BadInputError, ValueError):
    """A shop that cannot be used as it is (bad references, contradictions, bad numbers).

    ``problems`` lists every problem found, each a :class:`Problem` with its location;
    with a single problem, ``where`` is its location (job or machine and field).
    """

    def __init__(self, problems: list["Problem"], source: str = ""):
        self.problems = list(problems)
        if len(self.problems) == 1:
            super().__init__(self.problems[0].message, source=source,
                             where=self.problems[0].location)
        else:
            super().__init__(self._listing(None), source=source)

    def _listing(self, limit: int | None) -> str:
        shown = self.problems if limit is None else self.problems[:limit]
        text = f"{len(self.problems)} problems:" + "".join(f"\n  {p}" for p in shown)
        if len(shown) < len(self.problems):
            text += f"\n  ... and {len(self.problems) - len(shown)} more (see the details)"
        return text

    def summary(self, limit: int | None = 8) -> str:
        """The problems as text: one line for one problem, else the count then one per line.

        ``str()`` of the error lists every problem (``limit=None``); a message box shows the
        first ``limit`` and the rest in its scrollable detail.
        """
        if len(self.problems) == 1:
            return str(self)
        head = f"{self.source}: " if self.source else ""
        return head + self._listing(limit)


@dataclass(frozen=True)
class Problem:
    """One problem and where it is: ``location`` such as ``job 'WO-1' (id J1), field 'due'``."""

    location: str
    message: str

    def __str__(self) -> str:
        return f"{self.location}: {self.message}" if self.location else self.message


@dataclass
class Unit:
    """What the grid values mean: setup minutes, or a cost in a currency."""

    kind: str = "setup_minutes"
    currency: str = ""

    def label(self) -> str:
        """Short label for column heads: ``setup min`` or the currency (``cost`` if none)."""
        if self.kind == "cost":
            return self.currency or "cost"
        return "setup min"


@dataclass
class Shift:
    """The shift being dispatched: its date, a label ("early", "night"...), start and length."""

    day: date | None = None
    label: str = ""
    start: time | None = None
    hours: float = 8.0


@dataclass
class Job:
    """A job waiting for, running on, or done with a machine.

    ``rush`` jobs must run this round (must-run). ``wait_penalty`` is added to the total
    when the job is left waiting (or subtracted when maximising). ``machine`` and
    ``since`` are set only while the job is running. ``run_hours`` is the job's own run
    time (used when filling a whole shift); ``move_penalty`` overrides the shop's default
    cost of moving a dispatched-but-not-started job during re-dispatch. ``family`` is the
    setup family the job needs (mould, die, colour group...; None: the job's values are
    typed in the grid only).
    """

    id: str
    name: str
    work_order: str = ""
    rush: bool = False
    wait_penalty: float = 0.0
    due: datetime | None = None
    notes: str = ""
    state: str = WAITING
    machine: str | None = None
    since: datetime | None = None
    run_hours: float | None = None
    move_penalty: float | None = None
    family: str | None = None

    @property
    def is_waiting(self) -> bool:
        return self.state == WAITING

    @property
    def is_running(self) -> bool:
        return self.state == RUNNING


@dataclass
class Machine:
    """A machine: its state (with a note and when it changed), slots per round, shift hours.

    ``slots`` is how many jobs the machine takes at once in one dispatch round (jobs already
    running on it use up slots). ``shift_hours`` is the time it has in this shift (None: the
    shift length); ``speed_factor`` scales a job's ``run_hours`` on this machine.
    ``mounted`` is the setup family mounted now (None: nothing mounted, or cleaned) and
    ``end_family`` the family it must end the shift in (None: any).
    """

    id: str
    name: str
    state: str = UP
    state_note: str = ""
    state_changed: datetime | None = None
    slots: int = 1
    shift_hours: float | None = None
    speed_factor: float = 1.0
    notes: str = ""
    mounted: str | None = None
    end_family: str | None = None

    @property
    def is_up(self) -> bool:
        return self.state == UP


@dataclass
class Pin:
    """``job`` must (or must not) go to ``machine``; both are ids."""

    job: str
    machine: str
    kind: str = MUST
    note: str = ""


@dataclass
class ChangeoverTable:
    """How long (or what it costs) to change a group of machines from one family to another.

    ``machines`` are the ids of the machines sharing the table; ``families`` the family
    names in row/column order. ``changes[(a, b)]`` is the change from family ``a`` to
    family ``b`` (``a`` None: from nothing mounted / a cleaned machine); ``(a, a)`` is
    the no-change value (0 or a short clean). A missing entry means the change is not
    allowed: a job of family ``b`` cannot follow family ``a`` on these machines. The
    entries need not obey the triangle inequality (a wash-up in between can be cheaper
    than the direct change); nothing in the program assumes it.
    """

    id: str
    name: str = ""
    machines: list[str] = field(default_factory=list)
    families: list[str] = field(default_factory=list)
    changes: dict[tuple[str | None, str], float] = field(default_factory=dict)

    def change(self, from_family: str | None, to_family: str) -> float | None:
        """The change from one family (None: nothing mounted) to another; None: not allowed."""
        return self.changes.get((from_family, to_family))

    def matrix(self) -> np.ndarray:
        """``(len(families) + 1) x len(families)``: the rows in family order, then the
        "nothing mounted" row; NaN where a change is not allowed."""
        rows = [*self.families, None]
        return np.array([[self.changes.get((a, b), np.nan) for b in self.families] for a in rows],
                        dtype=float).reshape(len(rows), len(self.families))


@dataclass
class Shop:
    """A whole shop: jobs, machines, the grid of values, pins and the plan in force.

    ``grid`` maps ``(job id, machine id)`` to a value >= 0; a missing pair means the machine
    cannot run the job. ``hours`` optionally maps pairs to run hours (overriding
    ``job.run_hours * machine.speed_factor``). ``plan_in_force`` maps a machine id to the
    job ids it was given by the decision currently in force (empty when none recorded).
    ``crew`` holds the operators (empty: plans ignore staffing, as for a plain grid).

    ``changeover_tables`` price changeovers between setup families: where a job has a
    family and a machine a table, the value of the pair is derived from the table (the
    change from what the machine has mounted to the job's family); a value typed into
    ``grid`` overrides the derived one (:meth:`value_source` tells which); ``blocked``
    holds the pairs typed as "cannot run", which overrides a derived value too.
    """

    name: str = ""
    unit: Unit = field(default_factory=Unit)
    shift: Shift = field(default_factory=Shift)
    move_penalty: float = 0.0
    description: str = ""
    jobs: list[Job] = field(default_factory=list)
    machines: list[Machine] = field(default_factory=list)
    grid: dict[tuple[str, str], float] = field(default_factory=dict)
    pins: list[Pin] = field(default_factory=list)
    hours: dict[tuple[str, str], float] = field(default_factory=dict)
    plan_in_force: dict[str, list[str]] = field(default_factory=dict)
    crew: Crew = field(default_factory=Crew)
    changeover_tables: list[ChangeoverTable] = field(default_factory=list)
    blocked: set[tuple[str, str]] = field(default_factory=set)

    # ---- look-ups -------------------------------------------------------------------
    def job(self, job_id: str) -> Job:
        """The job with this id (KeyError if none)."""
        for j in self.jobs:
            if j.id == job_id:
                return j
        raise KeyError(f"no job with id {job_id!r}")

    def machine(self, machine_id: str) -> Machine:
        """The machine with this id (KeyError if none)."""
        for m in self.machines:
            if m.id == machine_id:
                return m
        raise KeyError(f"no machine with id {machine_id!r}")

    def job_by_name(self, name: str) -> Job:
        for j in self.jobs:
            if j.name == name:
                return j
        raise KeyError(f"no job named {name!r}")

    def machine_by_name(self, name: str) -> Machine:
        for m in self.machines:
            if m.name == name:
                return m
        raise KeyError(f"no machine named {name!r}")

    def job_names(self) -> list[str]:
        return [j.name for j in self.jobs]

    def machine_names(self) -> list[str]:
        return [m.name for m in self.machines]

    # ---- changeovers ------------------------------------------------------------------
    def table_of(self, machine_id: str) -> ChangeoverTable | None:
        """The changeover table the machine belongs to (None: its values are typed only)."""
        for t in self.changeover_tables:
            if machine_id in t.machines:
                return t
        return None

    def has_families(self) -> bool:
        """True when the shop prices changeovers (some job has a family and a table exists)."""
        return bool(self.changeover_tables) and any(j.family is not None for j in self.jobs)

    def derived_value(self, job_id: str, machine_id: str) -> float | None:
        """The change from the machine's mounted family to the job's family, from its table.

        None when the job has no family, the machine no table, or the change is not allowed.
        """
        family = self.job(job_id).family
        table = self.table_of(machine_id)
        if family is None or table is None:
            return None
        return table.change(self.machine(machine_id).mounted, family)

    def value_source(self, job_id: str, machine_id: str) -> str | None:
        """``"typed"`` (in the grid), ``"derived"`` (from the changeover table) or None."""
        if (job_id, machine_id) in self.grid or (job_id, machine_id) in self.blocked:
            return "typed"
        if self.derived_value(job_id, machine_id) is not None:
            return "derived"
        return None

    def mark_running(self, job_id: str, machine_id: str, since: datetime | None = None) -> None:
        """The job starts on the machine: the machine's mounted family becomes the job's."""
        job, machine = self.job(job_id), self.machine(machine_id)
        job.state, job.machine, job.since = RUNNING, machine.id, since
        if job.family is not None:
            machine.mounted = job.family

    def mark_done(self, job_id: str) -> None:
        """The job is done; the machine it ran on keeps the job's family mounted."""
        job = self.job(job_id)
        if job.machine is not None and job.family is not None:
            try:
                self.machine(job.machine).mounted = job.family
            except KeyError:
                pass
        job.state, job.machine, job.since = DONE, None, None

    # ---- the grid --------------------------------------------------------------------
    def value(self, job_id: str, machine_id: str) -> float | None:
        """Value of a pair: typed in the grid, else derived from the changeover table; None
        when the machine cannot run the job."""
        typed = self.grid.get((job_id, machine_id))
        if typed is not None or not self.changeover_tables or (job_id, machine_id) in self.blocked:
            return typed
        return self.derived_value(job_id, machine_id)

    def set_value(self, job_id: str, machine_id: str, value: float | None) -> None:
        """Set a pair's value (None = cannot run). Checks the ids and the number."""
        self.job(job_id)
        self.machine(machine_id)
        if value is None:
            self.grid.pop((job_id, machine_id), None)
            if self.derived_value(job_id, machine_id) is not None:
                self.blocked.add((job_id, machine_id))   # typed "cannot run" over the table
            return
        value = float(value)
        if not math.isfinite(value) or value < 0:
            raise ValueError(f"value {value!r} for job {job_id!r}, machine {machine_id!r} "
                             "must be a finite number >= 0")
        self.grid[(job_id, machine_id)] = value
        self.blocked.discard((job_id, machine_id))

    def matrix(self) -> tuple[np.ndarray, np.ndarray]:
        """``(values, allowed)`` over all jobs x all machines in list order (typed values
        over derived ones)."""
        jpos = {j.id: i for i, j in enumerate(self.jobs)}
        mpos = {m.id: i for i, m in enumerate(self.machines)}
        values = np.zeros((len(self.jobs), len(self.machines)))
        allowed = np.zeros(values.shape, dtype=bool)
        if self.changeover_tables:
            for k, m in enumerate(self.machines):
                table = self.table_of(m.id)
                if table is None:
                    continue
                for i, j in enumerate(self.jobs):
                    if j.family is not None:
                        v = table.change(m.mounted, j.family)
                        if v is not None:
                            values[i, k] = v
                            allowed[i, k] = True
        for jid, mid in self.blocked:
            i, k = jpos.get(jid), mpos.get(mid)
            if i is not None and k is not None:
                allowed[i, k] = False
        for (jid, mid), v in self.grid.items():
            i, k = jpos.get(jid), mpos.get(mid)
            if i is not None and k is not None:
                values[i, k] = v
                allowed[i, k] = True
        return values, allowed

    def hours_matrix(self) -> np.ndarray:
        """Run hours per (job, machine): the pair's own hours, else job hours x speed factor.

        NaN where neither is known.
        """
        out = np.full((len(self.jobs), len(self.machines)), np.nan)
        for i, j in enumerate(self.jobs):
            for k, m in enumerate(self.machines):
                h = self.hours.get((j.id, m.id))
                if h is None and j.run_hours is not None:
                    h = j.run_hours * m.speed_factor
                if h is not None:
                    out[i, k] = h
        return out

    def capacity(self) -> np.ndarray:
        """Hours each machine has this shift (its own ``shift_hours`` or the shift length)."""
        return np.array([self.shift.hours if m.shift_hours is None else m.shift_hours
                         for m in self.machines], dtype=float)

    # ---- pins ------------------------------------------------------------------------
    def pins_of(self, job_id: str) -> list[Pin]:
        return [p for p in self.pins if p.job == job_id]

    # ---- misc ------------------------------------------------------------------------
    def copy(self) -> "Shop":
        """An independent copy: changing it never changes this shop, and the reverse.

        The containers (job, machine and pin lists, grid and hours dicts, plan in force)
        and the records in them are copied; the values in them are immutable (numbers,
        strings, dates), so they are shared rather than deep-copied. On the generated
        1000 x 200 shop of ``benchmarks/gui_stall.py`` that measured 23 ms against 2.5 s
        for ``copy.deepcopy``, which matters because the app copies the shop on its GUI
        thread for every background solve. A
        field holding a list, dict or set must be copied here too
        (``tests/test_shop_copy.py`` walks every field and fails otherwise).
        """
        return replace(
            self,
            unit=copy.copy(self.unit),
            shift=copy.copy(self.shift),
            jobs=[_record_copy(j) for j in self.jobs],
            machines=[_record_copy(m) for m in self.machines],
            grid=dict(self.grid),
            pins=[copy.copy(p) for p in self.pins],
            hours=dict(self.hours),
            plan_in_force={k: list(v) for k, v in self.plan_in_force.items()},
            crew=self.crew.copy(),
            blocked=set(self.blocked),
            changeover_tables=[replace(t, machines=list(t.machines), families=list(t.families),
                                       changes=dict(t.changes)) for t in self.changeover_tables],
        )

    def describe_job(self, job_id: str) -> str:
        """``job 'Name' (id X)`` for messages; just the id when unknown."""
        try:
            return describe("job", self.job(job_id))
        except KeyError:
            return f"job id {job_id!r}"

    def describe_machine(self, machine_id: str) -> str:
        try:
            return describe("machine", self.machine(machine_id))
        except KeyError:
            return f"machine id {machine_id!r}"


def describe(kind: str, item: Job | Machine) -> str:
    """``job 'Name' (id X)`` (``kind`` 'job' or 'machine') for messages."""
    return f"{kind} {item.name!r} (id {item.id})"


def shop_from_grid(jobs: list[str], machines: list[str], values: np.ndarray,
                   allowed: np.ndarray | None = None, *, name: str = "",
                   unit: Unit | None = None) -> Shop:
    """A shop with all jobs waiting and all machines up, one slot each, ids J1.., M1..."""
    values = np.asarray(values, dtype=float)
    if allowed is None:
        allowed = np.ones(values.shape, dtype=bool)
    shop = Shop(name=name, unit=unit or Unit())
    shop.jobs = [Job(id=f"J{i + 1}", name=n) for i, n in enumerate(jobs)]
    shop.machines = [Machine(id=f"M{k + 1}", name=n) for k, n in enumerate(machines)]
    for i, k in zip(*np.nonzero(allowed)):
        shop.grid[(shop.jobs[i].id, shop.machines[k].id)] = float(values[i, k])
    return shop


def _record_copy(record):
    """A shallow copy of a job or machine record (its fields are immutable values):
    ``copy.copy`` without the pickle protocol, about four times faster on the 1000 jobs
    the app copies for every background solve."""
    new = object.__new__(record.__class__)
    new.__dict__.update(record.__dict__)
    return new
