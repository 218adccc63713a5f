"""Re-dispatch a shop after an event, and say what changed against the plan in force.

Events: a machine goes down or comes back up, a rush job arrives, a job finishes, a job is
pulled, an operator leaves or arrives (shops with a crew). Rules (the definition the tests
check):

* jobs running on machines that stay up keep running where they are;
* a job running on a machine that goes down becomes waiting (it needs a new setup
  elsewhere, which its grid values already price);
* a job finishing or pulled leaves the round; if it was running, its slot becomes free;
* a rush job that arrives (already added to the shop, named in the event) is placed first,
  as every rush or pinned job: the plan places as many jobs as possible, among those as
  many rush jobs as possible (see :func:`dispatcher.engine.solve`); rush jobs that cannot
  all be placed wait, named with the machines they compete for. A breakdown never leaves
  the supervisor without a plan;
* events apply in the order given; a machine's caution is due when it ends down;
* an operator who leaves (sick, called away) is absent from then on; one who arrives is
  present from then on. In a shop with a crew every plan staffs each running machine
  (:mod:`dispatcher.shop.staffed`): machines the leaving operator ran get another
  qualified operator present, else their new jobs wait; a running machine left without
  one is reported, never stopped by the plan (the site's procedure stops it);
* a job dispatched by the plan in force but not started pays a *move penalty* (its own
  ``move_penalty``, else the shop's, unless overridden) if the new plan puts it anywhere
  else, waiting included, so the new plan moves only what the costs justify (added to the
  cost, or counted against the value when maximising). No penalty is due when its
  machine went down: that move is forced.

Warm start: both the state before the event and the state after it are laid out on the
same columns (every slot of every machine; slots not free in a state are forbidden), so
the event becomes a change of some rows and columns. The state before is solved once,
then :func:`dispatcher.engine.redispatch` re-places only what changed, from that plan's
dual potentials (shortest augmenting paths; see that module). The result is certified.

The difference reported is against the plan in force: every change (moved jobs, jobs
newly dispatched, jobs now waiting, jobs that left the round as done or pulled), machines
now idle, and the change in total. The *total in force* is the plan in force evaluated on
the shop after the event with the objective's own rule: a job keeps its machine in force
if that machine can still take it, else it waits; grid values of dispatched jobs that
have not started and wait penalties of waiting jobs (added for "total", subtracted for
"maximize"). The change is the new plan's total (move penalties not included; they are
reported apart) minus the total in force. Feasibility is judged after the events only.
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from dataclasses import dataclass, field, replace
from datetime import datetime
from typing import Any

import numpy as np

from dispatcher.engine import DispatchResult, InfeasibleError, redispatch, solve

from .crew import ABSENT, PRESENT
from .model import DONE, DOWN, MUST, MUST_NOT, RUNNING, UP, WAITING, Problem, Shop, ShopError
from .plan import Plan, json_number
from .in_force import in_force_problems
from .translate import ShopProblem, plan_from_result
from .validate import check_shop

#: Event kinds: a machine goes down or comes back up; a waiting job becomes a rush job;
#: a job is done; a job is pulled from this round; an operator leaves or arrives.
EVENT_DOWN, EVENT_UP, EVENT_RUSH, EVENT_DONE, EVENT_PULLED = "down", "up", "rush", "done", "pulled"
EVENT_OPERATOR_OUT, EVENT_OPERATOR_IN = "operator_out", "operator_in"
EVENT_KINDS = (EVENT_DOWN, EVENT_UP, EVENT_RUSH, EVENT_DONE, EVENT_PULLED, EVENT_OPERATOR_OUT,
               EVENT_OPERATOR_IN)
#: Events about the crew: ``name`` is an operator's label (or id).
OPERATOR_EVENTS = (EVENT_OPERATOR_OUT, EVENT_OPERATOR_IN)


@dataclass(frozen=True)
class ShopEvent:
    """One event: ``kind`` in :data:`EVENT_KINDS`, ``name`` of the machine or job.

    ``note`` and ``time`` are kept on a machine that goes down or comes back up (its
    ``state_note`` and ``state_changed``), so the sheet can say "DOWN since 10:40: leak".
    """

    kind: str
    name: str
    note: str = ""
    time: datetime | None = None


@dataclass(frozen=True)
class Change:
    """A job whose machine differs from the plan in force (None = waiting / not in the round).

    ``left`` is ``"done"`` or ``"pulled"`` for a job that left the round (``after`` None).
    """

    job: str
    before: str | None
    after: str | None
    left: str | None = None


@dataclass
class ShopRedispatch:
    """The new plan and its difference from the plan in force."""

    plan: Plan
    shop: Shop
    changes: list[Change]
    moved: list[Change]
    newly_dispatched: list[str]
    now_waiting: list[str]
    machines_now_idle: list[str]
    total_in_force: float
    total_change: float
    move_penalties_paid: float
    result: DispatchResult = field(repr=False)
    left_round: list[Change] = field(default_factory=list)
    machines_down: list[str] = field(default_factory=list)
    in_force_parts: tuple[float, float] = (0.0, 0.0)  # grid values, wait penalties

    def change_parts(self) -> dict[str, float]:
        """The change in total split: planned values, wait penalties; move penalties paid."""
        parts = self.plan.to_json()["total_parts"]
        return {"planned": parts["planned"] - self.in_force_parts[0],
                "wait_penalties": parts["wait_penalties"] - self.in_force_parts[1],
                "move_penalties": self.move_penalties_paid}

    def to_json(self) -> dict[str, Any]:
        """The solve contract of the new plan plus ``changes`` and ``difference``."""
        data = self.plan.to_json()
        data["total_parts"]["move_penalties"] = json_number(self.move_penalties_paid)
        data["changes"] = [_change_json(c) for c in self.changes]
        data["difference"] = {
            "moved": [{"job": c.job, "from": c.before, "to": c.after} for c in self.moved],
            "newly_dispatched": list(self.newly_dispatched),
            "now_waiting": list(self.now_waiting),
            "left_round": [_change_json(c) for c in self.left_round],
            "machines_now_idle": list(self.machines_now_idle),
            "machines_down": list(self.machines_down),
            "total_in_force": json_number(self.total_in_force),
            "total_in_force_parts": {"planned": json_number(self.in_force_parts[0]),
                                     "wait_penalties": json_number(self.in_force_parts[1])},
            "total_change_parts": {k: json_number(round(v, 9))
                                   for k, v in self.change_parts().items()},
            "total_change": json_number(self.total_change),
            "move_penalties_paid": json_number(self.move_penalties_paid),
        }
        return data


def _change_json(c: Change) -> dict[str, Any]:
    out: dict[str, Any] = {"job": c.job, "from": c.before, "to": c.after}
    if c.left:
        out["left"] = c.left
    return out


@dataclass
class _Layout:
    """Rows (job indices) and slot columns of one state, with the engine arrays."""

    rows: list[int]
    values: np.ndarray      # grid values with move penalties
    grid: np.ndarray        # grid values only
    allowed: np.ndarray
    penalty: np.ndarray     # wait penalty (plus move penalty when minimising)
    wait: np.ndarray        # wait penalty only
    rush: np.ndarray        # rush or pinned: placed first
    move: np.ndarray        # move penalty due when the row leaves its machine in force
    shift: float = 0.0      # constant the engine total exceeds the true one by (maximize)


def apply_events(shop: Shop, events: Sequence[ShopEvent], source: str = "") -> tuple[Shop, set[int], set[int]]:
    """A copy of ``shop`` after the events, the job indices that left, and those that arrived.

    Raises :class:`ShopError` naming the event that does not fit the shop.
    """
    after = shop.copy()
    left: set[int] = set()
    arrived: set[int] = set()
    problems: list[Problem] = []
    jpos = {j.name: i for i, j in enumerate(after.jobs)}
    mpos = {m.name: k for k, m in enumerate(after.machines)}
    for n, ev in enumerate(events, 1):
        where = f"event {n} ({ev.kind} {ev.name!r})"
        if ev.kind not in EVENT_KINDS:
            problems.append(Problem(where, f"kind must be one of {', '.join(EVENT_KINDS)}"))
            continue
        if ev.kind in OPERATOR_EVENTS:
            try:
                op = after.crew.operator_by_label(ev.name)
            except KeyError:
                known = ", ".join(o.label for o in after.crew.operators) or "none"
                problems.append(Problem(where, f"no operator labelled {ev.name!r} (operators: {known})"))
                continue
            op.attendance = PRESENT if ev.kind == "operator_in" else ABSENT
            if ev.kind == "operator_in":
                op.arrives = op.leaves = None  # here from now on
            continue
        if ev.kind in (EVENT_DOWN, EVENT_UP):
            if ev.name not in mpos:
                problems.append(Problem(where, f"no machine named {ev.name!r}"))
                continue
            machine = after.machines[mpos[ev.name]]
            new_state = DOWN if ev.kind == EVENT_DOWN else UP
            if machine.state != new_state or ev.note:
                machine.state_note = ev.note if new_state == DOWN else ""
                machine.state_changed = ev.time or machine.state_changed
            if ev.kind == EVENT_DOWN:
                machine.state = DOWN
                for job in after.jobs:
                    if job.state == RUNNING and job.machine == machine.id:
                        job.state, job.machine, job.since = WAITING, None, None
            else:
                machine.state = UP
            continue
        if ev.name not in jpos:
            problems.append(Problem(where, f"no job named {ev.name!r}"))
            continue
        i = jpos[ev.name]
        job = after.jobs[i]
        if job.state == DONE:
            problems.append(Problem(where, "the job is already done"))
        elif ev.kind == EVENT_RUSH:
            if job.state != WAITING:
                problems.append(Problem(where, "a job that arrives must be waiting"))
            else:
                job.rush = True
                arrived.add(i)
        elif ev.kind == EVENT_DONE:
            after.mark_done(job.id)      # the machine keeps the job's family mounted
            left.add(i)
        else:  # pulled: out of this round; a running job frees its slot
            job.state, job.machine, job.since = WAITING, None, None
            left.add(i)
    if problems:
        raise ShopError(problems, source)
    return after, left, arrived


def _columns(shop: Shop) -> list[int]:
    """Every slot of every machine, as the machine index of each column."""
    return [k for k, m in enumerate(shop.machines) for _ in range(m.slots)]


def _layout(shop: Shop, rows: list[int], columns: list[int], in_force: Mapping[int, int],
            move_default: float | None, maximize: bool = False) -> _Layout:
    """Engine arrays of ``shop`` for ``rows`` on the common slot ``columns``.

    A move penalty p of a row whose machine in force is k: minimising, every other choice
    (waiting included) costs p more; maximising, staying on k is worth p more, which ranks
    the same plans (every plan's value rises by p, kept in ``shift``, against p less for
    every plan that moves the job) and keeps the engine's values >= 0.
    """
    values_all, allowed_all = shop.matrix()
    cols = np.asarray(columns, dtype=np.int64)
    running = np.zeros(len(shop.machines), dtype=int)
    mindex = {m.id: k for k, m in enumerate(shop.machines)}
    for j in shop.jobs:
        if j.state == RUNNING:
            running[mindex[j.machine]] += 1
    # A slot column is free when its machine is up and it is past the running jobs' slots.
    slot_no = np.zeros(len(columns), dtype=int)
    seen: dict[int, int] = {}
    for c, k in enumerate(columns):
        slot_no[c] = seen.get(k, 0)
        seen[k] = slot_no[c] + 1
    up = np.array([m.state == UP for m in shop.machines], dtype=bool)
    free = up[cols] & (slot_no >= running[cols]) if len(columns) else np.zeros(0, dtype=bool)
    r = np.asarray(rows, dtype=np.int64)
    grid = values_all[np.ix_(r, cols)] if len(rows) and len(columns) else np.zeros((len(rows), len(columns)))
    allowed = (allowed_all[np.ix_(r, cols)] & free[None, :]) if len(rows) and len(columns) \
        else np.zeros(grid.shape, dtype=bool)
    rush = np.array([shop.jobs[i].rush for i in rows], dtype=bool)
    row_of = {shop.jobs[i].id: n for n, i in enumerate(rows)}
    for p in shop.pins:
        n = row_of.get(p.job)
        if n is None:
            continue
        on = cols == mindex[p.machine]
        if p.kind == MUST:
            allowed[n] &= on
            rush[n] = True
        elif p.kind == MUST_NOT:
            allowed[n] &= ~on
    grid = np.where(allowed, grid, 0.0)
    wait = np.array([shop.jobs[i].wait_penalty for i in rows], dtype=float)
    move = np.zeros(len(rows))
    values, penalty = grid.copy(), wait.copy()
    for n, i in enumerate(rows):
        k = in_force.get(i)
        if k is None or not up[k]:
            continue  # not dispatched, or its machine went down: moving is forced, no penalty
        job = shop.jobs[i]
        p = job.move_penalty if job.move_penalty is not None else (
            move_default if move_default is not None else shop.move_penalty)
        if p > 0:
            move[n] = p
            if maximize:
                values[n, cols == k] += p
            else:
                values[n, cols != k] += p
                penalty[n] += p
    values = np.where(allowed, values, 0.0)
    shift = float(move.sum()) if maximize else 0.0
    return _Layout(list(rows), values, grid, allowed, penalty, wait, rush, move, shift)


def _in_force_machines(shop: Shop, plan_in_force: Mapping[str, Sequence[str]] | None,
                       source: str) -> dict[int, int]:
    """Job index -> machine index of the plan in force (running and dispatched jobs)."""
    pif = shop.plan_in_force if plan_in_force is None else plan_in_force
    jpos = {j.id: i for i, j in enumerate(shop.jobs)}
    mpos = {m.id: k for k, m in enumerate(shop.machines)}
    out: dict[int, int] = {}
    problems = []
    for mid, jids in pif.items():
        if mid not in mpos:
            problems.append(Problem(f"plan in force, machine id {mid!r}", "is not a machine of the shop"))
            continue
        for jid in jids:
            if jid not in jpos:
                problems.append(Problem(f"plan in force, machine id {mid!r}",
                                        f"job id {jid!r} is not a job of the shop"))
            else:
                out[jpos[jid]] = mpos[mid]
    problems += [p for p in in_force_problems(shop, pif, "plan in force")
                 if "is not a machine" not in p.message and "is not a job" not in p.message]
    if problems:
        raise ShopError(problems, source)
    for i, j in enumerate(shop.jobs):
        if j.state == RUNNING:
            out[i] = mpos[j.machine]
    return out


def _warm(pre: _Layout, pre_result: DispatchResult, post: _Layout) -> tuple[DispatchResult, list[int]]:
    """Post-event result by warm re-dispatch from ``pre_result``; returns it and its row order.

    A row of the state before survives when its job is still waiting with the same
    must-run flag and wait penalty; other rows are removed and, if still waiting, added
    again as new rows. Columns whose entries differ on surviving rows are forbidden (a
    machine going down) or replaced (a machine coming up, a slot freed).
    """
    post_pos = {i: n for n, i in enumerate(post.rows)}
    cand = [n for n, i in enumerate(pre.rows)
            if i in post_pos and pre.rush[n] == post.rush[post_pos[i]]
            and pre.penalty[n] == post.penalty[post_pos[i]]]
    s = np.array(cand, dtype=np.int64)
    ks = np.array([post_pos[pre.rows[n]] for n in cand], dtype=np.int64)
    n_cols = post.values.shape[1]
    diff = np.zeros((len(cand), n_cols), dtype=bool)
    if len(cand):
        diff = (pre.values[s] != post.values[ks]) | (pre.allowed[s] != post.allowed[ks])
    changed = diff.any(axis=0) if len(cand) else np.zeros(n_cols, dtype=bool)
    survivors = cand
    removed = sorted(set(range(len(pre.rows))) - set(survivors))
    kept_rows = [pre.rows[n] for n in survivors]
    kept = set(kept_rows)
    new_rows = [i for i in post.rows if i not in kept]
    order = kept_rows + new_rows
    idx = np.array([post_pos[i] for i in order], dtype=np.int64)
    values, allowed = post.values[idx], post.allowed[idx]
    down = [int(c) for c in np.flatnonzero(changed) if not allowed[:, c].any()]
    up = {int(c): (values[:, c], allowed[:, c]) for c in np.flatnonzero(changed)
          if allowed[:, c].any()}
    nidx = idx[len(kept_rows):]
    fresh = len(new_rows) > 0
    result = redispatch(
        pre_result, machines_down=down, machines_up=up, jobs_removed=removed,
        new_jobs=post.values[nidx] if fresh else None,
        new_allowed=post.allowed[nidx] if fresh else None,
        new_wait_penalty=post.penalty[nidx] if fresh else None,
        new_rush=post.rush[nidx] if fresh else None)
    return result, order


def redispatch_shop(shop: Shop, events: Sequence[ShopEvent], *,
                    plan_in_force: Mapping[str, Sequence[str]] | None = None,
                    move_penalty: float | None = None, objective: str = "total",
                    source: str = "") -> ShopRedispatch:
    """Re-dispatch ``shop`` after ``events`` (in that order), starting from the plan in force.

    ``plan_in_force``: machine id -> job ids (default: ``shop.plan_in_force``).
    ``move_penalty`` overrides the shop's default (a job's own value still wins).
    ``objective``: ``"total"`` or ``"maximize"``. Raises :class:`ShopError` for an
    inconsistent shop or event. Rush and pinned jobs that cannot all be placed wait and
    are named in ``plan.rush_waiting``: a plan is always produced. The shop passed in is
    never modified.
    """
    if objective not in ("total", "maximize"):
        raise ShopError([Problem("objective", "re-dispatch supports 'total' and 'maximize'")], source)
    if move_penalty is not None and not (np.isfinite(move_penalty) and move_penalty >= 0):
        raise ShopError([Problem("move penalty", f"must be a number >= 0, got {move_penalty!r}")], source)
    check_shop(shop, source)
    in_force = _in_force_machines(shop, plan_in_force, source)
    after, left, arrived = apply_events(shop, events, source)
    left_how = _left_how(events, after)
    columns = _columns(shop)
    maximize = objective == "maximize"
    pre_rows = [i for i, j in enumerate(shop.jobs) if j.state == WAITING and i not in arrived]
    post_rows = [i for i, j in enumerate(after.jobs) if j.state == WAITING and i not in left]
    post = _layout(after, post_rows, columns, in_force, move_penalty, maximize)
    if after.crew.active:
        plan, result = _solve_staffed_after(after, post, columns, objective, source)
        return _difference(shop, after, in_force, left, left_how, post, list(post.rows), columns,
                           result, objective, plan=plan)
    pre = _layout(shop, pre_rows, columns, in_force, move_penalty, maximize)
    result, order = _solve_after(pre, post, objective)
    return _difference(shop, after, in_force, left, left_how, post, order, columns, result,
                       objective)


def _solve_staffed_after(after: Shop, post: _Layout, columns: list[int], objective: str,
                         source: str):
    """The staffed plan after the events, on the same arrays (move penalties included)."""
    from .staffed import solve_staffed

    mindex = {m.id: k for k, m in enumerate(after.machines)}
    running = [(i, mindex[j.machine]) for i, j in enumerate(after.jobs) if j.state == RUNNING]
    unavailable = [k for k, m in enumerate(after.machines) if m.state != UP]
    # Only free slots are columns of the staffed problem (as build_problem lays them out):
    # a machine that is up, past the slots its running jobs use.
    busy = np.bincount([k for _, k in running], minlength=len(after.machines))
    slot_no: dict[int, int] = {}
    keep = []
    for c, k in enumerate(columns):
        n = slot_no.get(k, 0)
        slot_no[k] = n + 1
        if after.machines[k].state == UP and n >= busy[k]:
            keep.append(c)
    cols = np.asarray(keep, dtype=np.int64)
    problem = ShopProblem(after, list(post.rows), [columns[c] for c in keep],
                          post.values[:, cols], post.allowed[:, cols], post.penalty,
                          np.zeros(len(post.rows), dtype=bool), running, unavailable, post.rush)
    plan = solve_staffed(problem, objective, source=source)
    return plan, plan.result


def _solve_after(pre: _Layout, post: _Layout, objective: str) -> tuple[DispatchResult, list[int]]:
    """The plan after the event: warm from the state before when that state solves (it
    always does unless the document itself is inconsistent), else cold. Only the state
    after the event is judged."""
    try:
        pre_result = solve(pre.values, pre.allowed, wait_penalty=pre.penalty, rush=pre.rush,
                           objective=objective)
    except InfeasibleError:
        pre_result = None
    if pre_result is not None:
        return _warm(pre, pre_result, post)
    return solve(post.values, post.allowed, wait_penalty=post.penalty, rush=post.rush,
                 objective=objective), list(post.rows)


def _left_how(events: Sequence[ShopEvent], after: Shop) -> dict[int, str]:
    """Job index -> "done" or "pulled" for jobs that left the round (the last event wins)."""
    pos = {j.name: i for i, j in enumerate(after.jobs)}
    out: dict[int, str] = {}
    for ev in events:
        if ev.kind in ("done", "pulled") and ev.name in pos:
            out[pos[ev.name]] = ev.kind
    return out


def total_in_force(shop: Shop, in_force: Mapping[int, int], rows: Sequence[int],
                   maximize: bool) -> tuple[float, float, float]:
    """The plan in force evaluated on ``shop`` (the shop after the event) for the jobs in
    ``rows`` (waiting jobs of the round): a job whose machine in force is up and can run it
    counts its grid value, every other job its wait penalty (subtracted when maximising).
    Free slots are not re-checked: the plan in force already fitted its machines, and the
    event only takes slots away from machines that go down. Returns the total, the grid
    values it counts and the wait penalties it counts."""
    values_all, allowed_all = shop.matrix()
    pinned_away = {(p.job, p.machine) for p in shop.pins if p.kind == MUST_NOT}
    pinned_to = {p.job: p.machine for p in shop.pins if p.kind == MUST}
    planned = waiting = 0.0
    for i in rows:
        job = shop.jobs[i]
        k = in_force.get(i)
        ok = k is not None and shop.machines[k].state == UP and bool(allowed_all[i, k]) \
            and (job.id, shop.machines[k].id) not in pinned_away \
            and pinned_to.get(job.id, shop.machines[k].id) == shop.machines[k].id
        if ok:
            planned += float(values_all[i, k])
        else:
            waiting += job.wait_penalty
    return (planned - waiting if maximize else planned + waiting), planned, waiting


def _difference(shop: Shop, after: Shop, in_force: Mapping[int, int], left: set[int],
                left_how: Mapping[int, str], post: _Layout, order: list[int],
                columns: list[int], result, objective: str,
                plan: Plan | None = None) -> ShopRedispatch:
    """The difference against the plan in force. ``plan`` is given by the staffed path
    (its assignment values include move penalties, corrected here like the engine's)."""
    post_pos = {i: n for n, i in enumerate(post.rows)}
    idx = np.array([post_pos[i] for i in order], dtype=np.int64)
    mindex = {m.id: k for k, m in enumerate(after.machines)}
    running = [(i, mindex[j.machine]) for i, j in enumerate(after.jobs) if j.state == RUNNING]
    unavailable = [k for k, m in enumerate(after.machines) if m.state != UP]
    if plan is None:
        problem = ShopProblem(after, list(order), list(columns), post.grid[idx], post.allowed[idx],
                              post.wait[idx], np.zeros(len(order), dtype=bool), running,
                              unavailable, post.rush[idx])
        plan = plan_from_result(problem, result)
    jpos = {j.name: i for i, j in enumerate(after.jobs)}
    mpos = {m.name: k for k, m in enumerate(after.machines)}
    first_col = {}
    for c, k in enumerate(columns):
        first_col.setdefault(k, c)
    # Assignment values are grid values (the engine's include move penalties).
    plan = replace(plan, assignments=[
        replace(a, cost=float(post.grid[post_pos[jpos[a.job]], first_col[mpos[a.machine]]]))
        for a in plan.assignments])
    machines = after.machines
    now: dict[int, int] = {jpos[a.job]: mpos[a.machine] for a in plan.assignments}
    for i, k in running:
        now[i] = k
    name_j = lambda i: after.jobs[i].name  # noqa: E731
    name_m = lambda k: None if k is None else machines[k].name  # noqa: E731
    changes, moved, newly, waiting, gone = [], [], [], [], []
    for i in sorted(set(in_force) | set(now) | set(left)):
        b, a = in_force.get(i), now.get(i)
        if i in left:
            ch = Change(name_j(i), name_m(b), None, left_how.get(i, "pulled"))
            changes.append(ch)
            gone.append(ch)
            continue
        if b == a:
            continue
        ch = Change(name_j(i), name_m(b), name_m(a))
        changes.append(ch)
        if b is not None and a is not None:
            moved.append(ch)
        elif b is None:
            newly.append(ch.job)
        else:
            waiting.append(ch.job)
    busy_before = {k for i, k in in_force.items()}
    busy_now = set(now.values())
    idle_now = [m.name for k, m in enumerate(machines)
                if k in busy_before and k not in busy_now and m.state == UP]
    maximize = objective == "maximize"
    move_paid = 0.0
    for n, i in enumerate(order):
        if post.move[idx[n]] > 0 and now.get(i) != in_force.get(i):
            move_paid += float(post.move[idx[n]])
    # The engine's total includes the move penalties paid (and, maximising, the shift).
    total = float(result.total) - post.shift + (move_paid if maximize else -move_paid)
    plan = replace(plan, total=total)
    before, planned_before, wait_before = total_in_force(after, in_force, post.rows, maximize)
    return ShopRedispatch(plan=plan, shop=after, changes=changes, moved=moved,
                          newly_dispatched=newly, now_waiting=waiting,
                          machines_now_idle=idle_now, total_in_force=before,
                          total_change=total - before,
                          move_penalties_paid=move_paid, result=result, left_round=gone,
                          machines_down=[m.name for m in machines if m.state == DOWN],
                          in_force_parts=(planned_before, wait_before))
