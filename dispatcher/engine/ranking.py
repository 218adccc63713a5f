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
machine or "wait", which makes the partition follow the definition above. Each subproblem
differs from its parent by one forbidden choice plus fixed choices, which only raise
costs, so the parent's potentials stay feasible and one shortest augmenting path from
the freed row solves it (Miller, Stone and Cox 1997). Subproblems are solved lazily: they
wait in the queue under a lower bound (parent total plus the least reduced cost the freed
row and the freed machine must pay, also from Miller, Stone and Cox) and are solved only
when that bound reaches the front.

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

import numpy as np

from .assignment import DispatchResult, _plan_total
from .redispatch import shortest_augmenting_path

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


class _Ranker:
    def __init__(self, result: DispatchResult):
        cert = result.certificate
        self.result = result
        self.base = cert.cost
        self.n_jobs, self.n_machines = result.values.shape
        self.size = self.base.shape[0]

    def choice(self, col: int) -> int:
        return col if col < self.n_machines else WAIT

    def matrix(self, node: _Node) -> np.ndarray:
        m = self.base.copy()
        nm = self.n_machines
        fixed_m = [(r, c) for r, c in node.fixed.items() if c != WAIT]
        fixed_w = [r for r, c in node.fixed.items() if c == WAIT]
        if fixed_m:
            rows, cols = np.array(fixed_m).T
            keep = self.base[rows, cols]
            m[rows, :] = np.inf
            m[:, cols] = np.inf
            m[rows, cols] = keep
        if fixed_w:
            m[np.array(fixed_w), :nm] = np.inf
        forb_m = [(r, c) for r, c in node.forbidden if c != WAIT]
        forb_w = [r for r, c in node.forbidden if c == WAIT]
        if forb_m:
            rows, cols = np.array(forb_m).T
            m[rows, cols] = np.inf
        if forb_w:
            m[np.array(forb_w), nm:] = np.inf
        return m

    def key_of(self, cost: np.ndarray, col_of_row: np.ndarray) -> float:
        return float(cost[np.arange(self.size), col_of_row].sum())

    def solve_pending(self, node: _Node) -> bool:
        """Re-place the freed row warm from the parent's potentials; False if infeasible."""
        cost = self.matrix(node)
        col_of_row = node.col_of_row.copy()
        u, v = node.u.copy(), node.v.copy()
        r = int(node.freed)
        row_of_col = np.empty(self.size, dtype=np.int64)
        row_of_col[col_of_row] = np.arange(self.size)
        row_of_col[col_of_row[r]] = -1
        col_of_row[r] = -1
        if not shortest_augmenting_path(cost, col_of_row, row_of_col, u, v, r):
            return False
        node.col_of_row, node.u, node.v, node.freed = col_of_row, u, v, None
        node.key = self.key_of(cost, col_of_row)
        return True

    def children(self, node: _Node) -> list[_Node]:
        """Murty's partition of the node's space minus its own plan, with lower bounds."""
        cost = self.matrix(node)
        nm = self.n_machines
        red = cost - node.u[:, None] - node.v[None, :]
        red = np.where(np.isfinite(cost), np.maximum(red, 0.0), np.inf)
        col_of_row = node.col_of_row
        free_rows = [r for r in range(self.n_jobs) if r not in node.fixed]
        col_taken = np.zeros(self.size, dtype=bool)
        row_taken = np.zeros(self.size, dtype=bool)
        row_taken[list(node.fixed)] = True
        out = []
        fixed = dict(node.fixed)
        for r in free_rows:
            col = int(col_of_row[r])
            choice = self.choice(col)
            row_taken[r] = True
            excluded = col_taken.copy()
            if choice == WAIT:
                excluded[nm:] = True
                col_slack = 0.0
            else:
                excluded[col] = True
                col_slack = float(np.where(row_taken, np.inf, red[:, col]).min())
            row_slack = float(np.where(excluded, np.inf, red[r]).min())
            bound = node.key + row_slack + col_slack
            if np.isfinite(bound):
                out.append(_Node(dict(fixed), node.forbidden + [(r, choice)],
                                 col_of_row, node.u, node.v, freed=r, key=bound))
            fixed[r] = choice
            col_taken[col] = True
        return out

    def plan(self, node: _Node) -> RankedPlan:
        cols = node.col_of_row[:self.n_jobs]
        machine_of_job = np.where(cols < self.n_machines, cols, -1)
        res = self.result
        total = _plan_total(res.values, machine_of_job, res.wait_penalty, res.objective)
        return RankedPlan(total, machine_of_job)


def ranked_plans(result: DispatchResult, count: int) -> list[RankedPlan]:
    """The ``count`` best distinct plans, best first; the first is ``result``'s own plan.

    Parameters
    ----------
    result : DispatchResult
        An optimal plan with objective ``"total"`` or ``"maximize"``.
    count : int
        How many plans at most; fewer are returned when fewer plans exist.

    Returns
    -------
    list of RankedPlan
        Sorted by total (ascending for ``"total"``, descending for ``"maximize"``); plans
        with equal totals may come in any order. Distinct means distinct sets of
        (job, machine) pairs; see the module docstring for waiting jobs.

    Raises
    ------
    ValueError
        for the ``"bottleneck"`` objective, or a negative count.

    Notes
    -----
    Murty (1968) partitioning with warm, lazily solved subproblems (Miller, Stone and
    Cox 1997): each solved subproblem costs one shortest augmenting path,
    O(n^2) at worst, and the bound lets most subproblems never be solved.
    """
    if result.objective not in ("total", "maximize"):
        raise ValueError("ranked alternatives are defined for the 'total' and 'maximize' objectives")
    if count < 0:
        raise ValueError(f"count must be >= 0, got {count}")
    ranker = _Ranker(result)
    cert = result.certificate
    root = _Node({}, [], cert.col_of_row.copy(), cert.row_potential.copy(),
                 cert.col_potential.copy())
    root.key = ranker.key_of(ranker.base, root.col_of_row)
    tick = itertools.count()
    heap: list[tuple[float, int, _Node]] = [(root.key, next(tick), root)]
    plans: list[RankedPlan] = []
    while heap and len(plans) < count:
        _, _, node = heapq.heappop(heap)
        if node.freed is not None:
            if ranker.solve_pending(node):
                heapq.heappush(heap, (node.key, next(tick), node))
            continue
        plans.append(ranker.plan(node))
        if len(plans) < count:
            for child in ranker.children(node):
                heapq.heappush(heap, (child.key, next(tick), child))
    return plans
