"""Ranked alternatives: the k best distinct plans, best first.

What "distinct" means. A plan is the set of (job, machine) pairs it dispatches; two plans
are distinct when those sets differ. Jobs outside the set wait; which wait slot a waiting
job occupies, and which idle row holds an unused machine, are bookkeeping of the square
problem (see :mod:`dispatcher.engine.assignment`) and never make two plans distinct. So
in a rectangular grid, plans that differ only in which *jobs* wait are distinct (their
pair sets differ), while the arrangement of wait slots and idle machines is not. Every
plan ranked is a plan in the engine's sense: it places as many jobs as the allowed pairs
permit and places every must-run job.

Method: Murty's partitioning (Murty 1968) over the job rows only, each job row choosing a
machine or "wait", which makes the partition follow the definition above. A machine that
takes several jobs is several identical columns (slots); given ``groups``, a job row
chooses the machine, not the slot, and the slots left are the machine's capacity in each
subproblem, so plans differing only in slots are never generated. Each subproblem
differs from its parent by one forbidden choice plus fixed choices, which only raise
costs, so the parent's potentials stay feasible and one shortest augmenting path from
the freed row solves it (Miller, Stone and Cox 1997). Subproblems are solved lazily: they
wait in the queue under a lower bound (parent total plus the least reduced cost the freed
row and the freed machine must pay, also from Miller, Stone and Cox) and are solved only
when that bound reaches the front. A node is partitioned in an optimized order (also
Miller, Stone and Cox): rows whose cheapest other choice raises the root's total most
come first, so the children most likely to be ranked next have the most rows fixed,
tighter bounds and fewer children of their own.

References
----------
K. G. Murty, "An algorithm for ranking all the assignments in order of increasing cost",
Operations Research 16(3) (1968) 682-687. doi:10.1287/opre.16.3.682
M. L. Miller, H. S. Stone and I. J. Cox, "Optimizing Murty's ranked assignment method",
IEEE Transactions on Aerospace and Electronic Systems 33(3) (1997) 851-862.
doi:10.1109/7.599256
"""

from __future__ import annotations

import heapq
import itertools
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from .assignment import DispatchResult, _plan_total
from .redispatch import sap_search
from .whatif import forced_rise

__all__ = ["RankedPlan", "ranked_plans"]

WAIT = -1


@dataclass(frozen=True)
class RankedPlan:
    """One plan: its total (in the result's objective) and machine per job (-1 = waits)."""

    total: float
    machine_of_job: np.ndarray

    def pairs(self) -> frozenset[tuple[int, int]]:
        """The (job, machine) pairs the plan dispatches: what makes plans distinct."""
        placed = np.flatnonzero(self.machine_of_job >= 0)
        return frozenset(zip(placed.tolist(), self.machine_of_job[placed].tolist()))


@dataclass
class _Node:
    """A subproblem: fixed and forbidden choices of job rows, solved or pending."""

    fixed: dict[int, int]
    forbidden: list[tuple[int, int]]
    col_of_row: np.ndarray
    u: np.ndarray
    v: np.ndarray
    freed: int | None = None          # pending: the row to re-place from the parent's solution
    key: float = field(default=0.0)   # square-problem cost (exact) or lower bound (pending)
    base: float = field(default=0.0)  # pending: the parent's exact cost
    search: Any = field(default=None, repr=False)  # pending: the paused path search
    state: Any = field(default=None, repr=False)   # pending: the arrays it works on
    parent_cost: Any = field(default=None, repr=False)  # pending: the parent's matrix
    blocked: Any = field(default=None, repr=False)      # pending: columns fixed since
    skip: Any = field(default=None, repr=False)         # pending: the forbidden choice
    more_fixed: Any = field(default=None, repr=False)   # (rows, choices) not yet in ``fixed``

    def fixed_choices(self) -> dict[int, int]:
        """All fixed choices (merged on first use: most subproblems never need them)."""
        if self.more_fixed is not None:
            rows, choices = self.more_fixed
            self.fixed = {**self.fixed, **dict(zip(rows.tolist(), choices.tolist()))}
            self.more_fixed = None
        return self.fixed


class _Ranker:
    def __init__(self, result: DispatchResult, groups=None):
        cert = result.certificate
        self.result = result
        self.base = cert.cost
        self.n_jobs, self.n_machines = result.values.shape
        self.size = self.base.shape[0]
        # Group of every square column: machine columns by ``groups`` (renumbered from 0),
        # wait slots all in one group after them; idle rows have no choice to make.
        if groups is None:
            machine_group = np.arange(self.n_machines)
        else:
            machine_group = np.unique(np.asarray(groups), return_inverse=True)[1].reshape(-1)
            if machine_group.shape != (self.n_machines,):
                raise ValueError(f"groups needs one entry per machine column "
                                 f"({self.n_machines}), got {machine_group.size}")
        wait_group = int(machine_group.max(initial=-1)) + 1
        self.group = np.r_[machine_group, np.full(self.size - self.n_machines, wait_group)]
        self.machine_group = machine_group
        self.group_cols = [np.flatnonzero(self.group == g) for g in range(wait_group + 1)]
        # Root what-if: the best plan with row i on column j costs root key + rise[i, j];
        # every subproblem is a restriction of the root problem, so this bounds it below.
        self.rise = forced_rise(cert.cost, cert.col_of_row, cert.row_potential, cert.col_potential)
        self.root_key = float(cert.cost[np.arange(self.size), cert.col_of_row].sum()) if self.size else 0.0

    def matrix(self, node: _Node) -> np.ndarray:
        m = self.base.copy()
        nm = self.n_machines
        fixed_choices = node.fixed_choices()
        fixed_m = [(r, c) for r, c in fixed_choices.items() if c != WAIT]
        fixed_w = [r for r, c in fixed_choices.items() if c == WAIT]
        if fixed_m:
            rows, cols = np.array(fixed_m).T
            keep = self.base[rows, cols]
            m[rows, :] = np.inf
            m[:, cols] = np.inf
            m[rows, cols] = keep
        if fixed_w:
            m[np.array(fixed_w), :nm] = np.inf
        for r, c in node.forbidden:
            # Forbidding a choice forbids every column of its group (every slot of the
            # machine, every wait slot).
            m[r, self.group_cols[self.group[c] if c != WAIT else -1]] = np.inf
        return m

    def key_of(self, cost: np.ndarray, col_of_row: np.ndarray) -> float:
        return float(cost[np.arange(self.size), col_of_row].sum())

    def solve_pending(self, node: _Node, limit: float = np.inf) -> bool | None:
        """Re-place the freed row warm from the parent's potentials.

        True: solved (``node.key`` exact). False: infeasible. None: the subproblem costs
        more than ``limit``; ``node.key`` is raised to the lower bound found.
        """
        try:
            if node.search is None:
                # The parent's matrix plus this node's own constraints, applied inside the
                # search (blocked columns, the skipped choice) instead of on a copy.
                cost = node.parent_cost
                col_of_row = node.col_of_row.copy()
                u, v = node.u.copy(), node.v.copy()
                r = int(node.freed)
                row_of_col = np.empty(self.size, dtype=np.int64)
                row_of_col[col_of_row] = np.arange(self.size)
                row_of_col[col_of_row[r]] = -1
                col_of_row[r] = -1
                node.search = sap_search(cost, col_of_row, row_of_col, u, v, r,
                                         limit - node.base, node.blocked, node.skip)
                node.state = (cost, col_of_row, u, v)
                bound = next(node.search)
            else:
                bound = node.search.send(limit - node.base)
            while node.base + bound <= limit:
                # The search paused on a distance above ``limit - base`` only by rounding:
                # the node is no dearer than the front of the queue, so go on (two such
                # nodes with equal keys would otherwise trade places for ever).
                bound = node.search.send(bound)
        except StopIteration as done:
            placed, _ = done.value
            node.search = None
            if not placed:
                return False
            _, col_of_row, u, v = node.state
            node.state = node.parent_cost = node.blocked = node.skip = None
            node.col_of_row, node.u, node.v, node.freed = col_of_row, u, v, None
            node.key = self.key_of(self.base, col_of_row)
            return True
        node.key = max(node.key, node.base + bound)
        return None

    def children(self, node: _Node) -> list[_Node]:
        """Murty's partition of the node's space minus its own plan, with lower bounds.

        Free rows are taken in decreasing order of their root what-if cost of another
        choice (see the module docstring); any order gives a valid partition.
        Child t keeps the choices of free rows 1..t-1 and forbids row t's choice. Its
        bound is the larger of (a) the node's total plus the least reduced cost row t must
        take elsewhere plus the least reduced cost another row must take on the freed
        machine, and (b) the root's exact what-if cost of row t's best allowed column.
        """
        cost = self.matrix(node)
        nm, size = self.n_machines, self.size
        fixed_choices = node.fixed_choices()
        free_rows = np.array([r for r in range(self.n_jobs) if r not in fixed_choices],
                             dtype=np.int64)
        if free_rows.size == 0:
            return []
        red = cost - node.u[:, None] - node.v[None, :]
        red = np.where(np.isfinite(cost), np.maximum(red, 0.0), np.inf)
        q = free_rows.size
        t = np.arange(q)
        cols = node.col_of_row[free_rows]
        is_wait = cols >= nm
        # Partition order: rows whose cheapest other choice costs the root most come first,
        # so the children likely to be ranked next carry the most fixed rows.
        own = self.group[None, :] == self.group[cols][:, None]
        alt = np.where(own, np.inf, self.rise[free_rows]).min(axis=1)
        order = np.argsort(-alt, kind="stable")
        free_rows, cols, is_wait = free_rows[order], cols[order], is_wait[order]
        # Column j is fixed for child t when a free row before t holds it.
        col_pos = np.full(size, q, dtype=np.int64)
        col_pos[cols] = t
        excluded = (col_pos[None, :] < t[:, None]) | (self.group[None, :] == self.group[cols][:, None])
        row_slack = np.where(excluded, np.inf, red[free_rows]).min(axis=1)
        forced = np.where(excluded, np.inf, self.rise[free_rows]).min(axis=1)
        # Another row must take the freed machine: rows after t (or idle rows), not fixed.
        row_pos = np.full(size, q, dtype=np.int64)
        row_pos[list(fixed_choices)] = -1
        row_pos[free_rows] = t
        taken = row_pos[None, :] <= t[:, None]
        col_slack = np.where(taken, np.inf, red[:, cols].T).min(axis=1)
        col_slack[is_wait] = 0.0
        bound = np.maximum(node.key + row_slack + col_slack, self.root_key + forced)
        out = []
        choices = np.where(is_wait, WAIT, cols)
        for k in np.flatnonzero(np.isfinite(bound)):
            r, choice = int(free_rows[k]), int(choices[k])
            out.append(_Node(fixed_choices, node.forbidden + [(r, choice)],
                             node.col_of_row, node.u, node.v, freed=r,
                             key=float(bound[k]), base=node.key, parent_cost=cost,
                             blocked=cols[:k], skip=self.group_cols[self.group[cols[k]]],
                             more_fixed=(free_rows[:k], choices[:k])))
        return out

    def plan(self, node: _Node) -> RankedPlan:
        cols = node.col_of_row[:self.n_jobs]
        machine_of_job = np.where(cols < self.n_machines, cols, -1)
        res = self.result
        total = _plan_total(res.values, machine_of_job, res.wait_penalty, res.objective)
        return RankedPlan(total, machine_of_job)


def ranked_plans(result: DispatchResult, count: int, groups=None, cancel=None) -> list[RankedPlan]:
    """The ``count`` best distinct plans, best first; the first is ``result``'s own plan.

    Parameters
    ----------
    result : DispatchResult
        An optimal plan with objective ``"total"`` or ``"maximize"``.
    count : int
        How many plans at most; fewer are returned when fewer plans exist.
    groups : sequence, optional
        One label per machine column of ``result``. Columns with the same label are
        slots of one machine that takes several jobs (identical columns: same values,
        same allowed jobs); plans are then distinct over (job, machine) choices, so two
        plans that differ only in which slot of a machine a job takes are one plan and
        only one of them is ranked. Default: every column is a machine of its own.
    cancel : threading.Event, optional
        Checked before each subproblem; once it is set the ranking stops and returns the
        plans found so far (whoever set it drops them).

    Returns
    -------
    list of RankedPlan
        Sorted by total (ascending for ``"total"``, descending for ``"maximize"``); plans
        with equal totals may come in any order. Distinct means distinct sets of
        (job, machine) pairs, a machine being a group of columns; see the module
        docstring for waiting jobs.

    Raises
    ------
    ValueError
        for the ``"bottleneck"`` objective, a negative count, or ``groups`` of the wrong
        length.

    Notes
    -----
    Murty (1968) partitioning with warm, lazily solved subproblems (Miller, Stone and
    Cox 1997): each solved subproblem costs one shortest augmenting path,
    O(n^2) at worst, and the bound lets most subproblems never be solved.

    With ``groups``, the partition runs over (job, machine) choices: a child forbids its
    row's machine on all of that machine's slots, and fixing a row keeps it on the slot
    it holds. Slots of one machine are interchangeable, so a fixed row on one slot stands
    for the row on any slot of the machine, and the machine's remaining slots are its
    remaining capacity in the subproblem. Each plan over machines is thus reached in
    exactly one subproblem and no slot copy is ever generated (Murty's partition holds
    for any set of solutions made of one choice per row; here a choice is a machine).

    References
    ----------
    K. G. Murty, "An algorithm for ranking all the assignments in order of increasing
    cost", Operations Research 16 (1968) 682-687, doi:10.1287/opre.16.3.682.
    M. L. Miller, H. S. Stone and I. J. Cox, "Optimizing Murty's ranked assignment
    method", IEEE Trans. Aerospace and Electronic Systems 33 (1997) 851-862,
    doi:10.1109/7.599256.
    """
    if result.objective not in ("total", "maximize"):
        raise ValueError("ranked alternatives are defined for the 'total' and 'maximize' objectives")
    if count < 0:
        raise ValueError(f"count must be >= 0, got {count}")
    ranker = _Ranker(result, groups)
    cert = result.certificate
    root = _Node({}, [], cert.col_of_row.copy(), cert.row_potential.copy(),
                 cert.col_potential.copy())
    root.key = ranker.key_of(ranker.base, root.col_of_row)
    tick = itertools.count()
    heap: list[tuple[float, int, _Node]] = [(root.key, next(tick), root)]
    plans: list[RankedPlan] = []
    while heap and len(plans) < count:
        if cancel is not None and cancel.is_set():
            break
        _, _, node = heapq.heappop(heap)
        if node.freed is not None:
            # Solve only as far as the next entry of the queue: past it, a better bound
            # is enough to put the subproblem back (lazy evaluation).
            limit = heap[0][0] if heap else np.inf
            if ranker.solve_pending(node, limit) is not False:
                heapq.heappush(heap, (node.key, next(tick), node))
            continue
        plans.append(ranker.plan(node))
        if len(plans) < count:
            for child in ranker.children(node):
                heapq.heappush(heap, (child.key, next(tick), child))
    return plans
