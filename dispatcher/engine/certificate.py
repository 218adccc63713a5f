"""Dual potentials for an optimal assignment, and their check.

scipy's ``linear_sum_assignment`` returns only the primal plan. A plan is proven
cheapest by potentials u (rows) and v (columns) of the LP dual (Kuhn 1955; Kuhn-Munkres):
every allowed pair has reduced cost c(i, j) - u(i) - v(j) >= 0 and every planned pair
has reduced cost 0. Summing over the plan then shows that no other perfect matching
can cost less than sum(u) + sum(v), which is the plan's own total.

Given an optimal permutation sigma, such potentials are shortest-path distances in the
residual graph on columns, where going from column sigma(i) to column j costs
c(i, j) - c(i, sigma(i)) (Ford and Fulkerson 1962, ch. III; the same fact powers the
shortest augmenting path method of Jonker and Volgenant 1987). Optimality of sigma means
the graph has no negative cycle, so a Bellman-Ford relaxation (Bellman 1958) converges.
We relax all columns whose distance changed at once, as numpy array operations.
"""

from __future__ import annotations

from dataclasses import dataclass, field

import numpy as np

from dispatcher.errors import InternalError

_BLOCK = 32  # rows per relaxation block; measured fastest at n = 300..2000


class CertificateError(InternalError, RuntimeError):
    """The primal plan could not be certified optimal (a bug, never a user error)."""


def tolerance(cost: np.ndarray) -> float:
    """Absolute slack allowed in reduced costs, scaled to the magnitude of the finite costs.

    Parameters
    ----------
    cost : array
        The costs of the problem (``inf`` entries are ignored).

    Returns
    -------
    float
        ``1e-9 * max(1, largest |finite cost|) * max(1, rows)``.

    References
    ----------
    None: floating-point slack scaled to the data (common practice, no published method).
    """
    scale = float(np.max(np.abs(cost), where=np.isfinite(cost), initial=1.0))
    return 1e-9 * scale * max(1, cost.shape[0])


def potentials_from_plan(cost: np.ndarray, col_of_row: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Row and column potentials proving a perfect matching of a square matrix optimal.

    ``cost`` may hold ``inf`` for forbidden pairs; ``col_of_row`` is a permutation using
    only finite pairs. Raises :class:`CertificateError` if the plan is not optimal
    (a negative cycle keeps the relaxation from settling).

    Parameters
    ----------
    cost : (n, n) array, ``inf`` where forbidden
    col_of_row : int array
        A permutation using finite pairs only.

    Returns
    -------
    (u, v) : float arrays
        Row and column potentials: ``cost - u - v >= 0`` on finite pairs, ``== 0`` on the
        plan.

    Raises
    ------
    CertificateError
        The plan is not optimal.

    References
    ----------
    H. W. Kuhn, "The Hungarian method for the assignment problem", Naval Research
    Logistics Quarterly 2 (1955) 83-97, doi:10.1002/nav.3800020109.
    L. R. Ford and D. R. Fulkerson, "Flows in Networks", Princeton University Press (1962).
    R. Bellman, "On a routing problem", Quarterly of Applied Mathematics 16 (1958) 87-90.
    R. Jonker and A. Volgenant, "A shortest augmenting path algorithm for dense and sparse
    linear assignment problems", Computing 38 (1987) 325-340, doi:10.1007/BF02278710.
    """
    n = cost.shape[0]
    if n == 0:
        return np.zeros(0), np.zeros(0)
    rows = np.arange(n)
    row_of_col = np.empty(n, dtype=np.int64)
    row_of_col[col_of_row] = rows
    planned = cost[rows, col_of_row]
    tol = tolerance(cost) * 1e-3
    # Distance to column j through row i is v[sigma(i)] - planned(i) + cost(i, j).
    # Start from v = 0 everywhere (a virtual source joined to every column) and relax once;
    # the planned pair makes every column's minimum <= 0.
    v = (cost - planned[:, None]).min(axis=0)
    active = row_of_col[v < 0]
    for _ in range(n + 1):
        if active.size == 0:
            break
        # Rows are relaxed in small blocks, each seeing the updates of the blocks before
        # it (Gauss-Seidel order): same result, fewer passes over the matrix.
        changed = np.zeros(n, dtype=bool)
        for start in range(0, active.size, _BLOCK):
            block = active[start:start + _BLOCK]
            offset = v[col_of_row[block]] - planned[block]
            cand = (cost[block] + offset[:, None]).min(axis=0)
            improved = cand < v - tol
            if improved.any():
                np.minimum(v, cand, out=v)
                changed |= improved
        active = row_of_col[changed]
    else:
        raise CertificateError("plan is not optimal: the residual graph has a negative cycle")
    u = planned - v[col_of_row]
    return u, v


class StructuredSquare:
    """A dispatch problem's square cost matrix held as its parts, built densely only on demand.

    Layout (the one :mod:`dispatcher.engine.assignment` builds): rows are the jobs then
    ``n_idle`` idle rows, columns the machines then ``n_wait`` wait slots.

    * job i, machine j: ``base[i, j]``, except ``inf`` on every ``blocked`` machine;
    * job i, wait slot: ``wait[i]`` (``inf`` for a job that must run);
    * idle row, machine: 0; idle row, wait slot: ``inf``.

    Why: after a machine goes down the new square problem is the old one with one column
    forbidden (plus an idle row and a wait slot); holding ``base`` by reference instead of
    copying a 1000 x 1000 matrix is most of the time of a warm re-dispatch. ``base`` is
    never written to. Indexing supports what the shortest path searches use: ``m[i]`` and
    ``m[rows]`` (whole rows), ``m[rows, cols]`` (element-wise, numpy broadcasting, which
    covers ``np.ix_``) and ``m[:, cols]``; :meth:`dense` gives the full matrix.
    """

    __slots__ = ("base", "blocked", "wait", "n_idle", "n_wait", "shape", "_is_blocked")

    def __init__(self, base: np.ndarray, blocked: np.ndarray, wait: np.ndarray,
                 n_idle: int, n_wait: int):
        n_jobs, n_machines = base.shape
        if wait.shape != (n_jobs,):
            raise ValueError(f"wait needs {n_jobs} entries, got {wait.shape}")
        if n_jobs + n_idle != n_machines + n_wait:
            raise ValueError("rows (jobs + idle) and columns (machines + wait) differ")
        self.base = base
        self.blocked = np.unique(np.asarray(blocked, dtype=np.int64))
        self.wait = wait
        self.n_idle, self.n_wait = int(n_idle), int(n_wait)
        size = n_jobs + self.n_idle
        self.shape = (size, size)
        self._is_blocked = np.zeros(n_machines, dtype=bool)
        self._is_blocked[self.blocked] = True

    def dense(self) -> np.ndarray:
        """The full square matrix (a new array)."""
        n_jobs, n_machines = self.base.shape
        out = np.empty(self.shape)
        out[:n_jobs, :n_machines] = self.base
        if self.blocked.size:
            out[:n_jobs, self.blocked] = np.inf
        out[:n_jobs, n_machines:] = self.wait[:, None]
        out[n_jobs:, :n_machines] = 0.0
        out[n_jobs:, n_machines:] = np.inf
        return out

    def _row(self, i: int) -> np.ndarray:
        n_jobs, n_machines = self.base.shape
        out = np.empty(self.shape[1])
        if i < n_jobs:
            out[:n_machines] = self.base[i]
            out[self.blocked] = np.inf
            out[n_machines:] = self.wait[i]
        else:
            out[:n_machines] = 0.0
            out[n_machines:] = np.inf
        return out

    def _rows(self, idx: np.ndarray) -> np.ndarray:
        n_jobs, n_machines = self.base.shape
        out = np.empty((idx.size, self.shape[1]))
        if idx.size and idx.max() < n_jobs:
            out[:, :n_machines] = self.base[idx]
            out[:, n_machines:] = self.wait[idx][:, None]
            if self.blocked.size:
                out[:, self.blocked] = np.inf
            return out
        job = idx < n_jobs
        jobs = np.flatnonzero(job)
        out[jobs, :n_machines] = self.base[idx[jobs]]
        out[jobs, n_machines:] = self.wait[idx[jobs]][:, None]
        idle = np.flatnonzero(~job)
        out[idle, :n_machines] = 0.0
        out[idle, n_machines:] = np.inf
        if self.blocked.size:
            out[np.ix_(jobs, self.blocked)] = np.inf
        return out

    def _column(self, j: int) -> np.ndarray:
        n_jobs, n_machines = self.base.shape
        out = np.empty(self.shape[0])
        if j < n_machines:
            out[:n_jobs] = np.inf if self._is_blocked[j] else self.base[:, j]
            out[n_jobs:] = 0.0
        else:
            out[:n_jobs] = self.wait
            out[n_jobs:] = np.inf
        return out

    def _entries(self, rows: np.ndarray, cols: np.ndarray) -> np.ndarray:
        n_jobs, n_machines = self.base.shape
        if rows.ndim == 2 and rows.shape[1] == 1 and cols.ndim <= 2 and cols.size == cols.shape[-1]:
            # Outer form (m[np.ix_(r, c)], m[:, c]): a few whole columns, then the rows.
            r, c = rows[:, 0], cols.ravel()
            out = np.empty((r.size, c.size))
            for k, j in enumerate(c.tolist()):
                out[:, k] = self._column(j)[r]
            return out
        rows, cols = np.broadcast_arrays(rows, cols)
        if rows.size and rows.max() < n_jobs and cols.max() < n_machines:
            out = self.base[rows, cols]
            if self.blocked.size:
                out[self._is_blocked[cols]] = np.inf
            return out
        out = np.full(rows.shape, np.inf)
        job, machine = rows < n_jobs, cols < n_machines
        pick = job & machine
        out[pick] = self.base[rows[pick], cols[pick]]
        if self.blocked.size:
            out[pick & self._is_blocked[np.where(machine, cols, 0)]] = np.inf
        pick = job & ~machine
        out[pick] = self.wait[rows[pick]]
        out[~job & machine] = 0.0
        return out

    def __getitem__(self, key):
        if isinstance(key, tuple):
            rows, cols = key
            if isinstance(rows, slice):
                if isinstance(cols, slice) or np.ndim(cols) != 1:
                    raise TypeError("m[:, cols] needs a 1-D array of columns")
                rows = np.arange(self.shape[0])[rows][:, None]
            elif isinstance(cols, slice):
                raise TypeError("column slices are not supported")
            rows, cols = np.asarray(rows, dtype=np.int64), np.asarray(cols, dtype=np.int64)
            if rows.ndim == 0 and cols.ndim == 0:
                return float(self._entries(rows[None], cols[None])[0])
            return self._entries(rows, cols)
        if isinstance(key, (int, np.integer)):
            return self._row(int(key))
        idx = np.asarray(key)
        if idx.dtype == bool or idx.ndim != 1:
            raise TypeError("rows are selected by an int or a 1-D array of ints")
        return self._rows(np.asarray(idx, dtype=np.int64))


@dataclass(frozen=True)
class Certificate:
    """The square problem the engine actually solved, its plan and its dual potentials.

    What it proves, checked by :meth:`verify`:

    1. ``col_of_row`` is a perfect matching of ``cost`` using only finite entries;
    2. every finite entry has reduced cost ``cost - row_potential - col_potential >= -tol``
       and every planned entry has reduced cost within ``tol`` of 0.

    Together these prove the plan is a minimum-cost perfect matching of ``cost``.
    ``square`` is that matrix as given, dense or as a :class:`StructuredSquare` (a warm
    re-dispatch shares the previous matrix instead of copying it); ``cost`` is always the
    dense array, built on first use. How the
    square matrix encodes the shop (dummy columns for waiting, dummy rows for idle
    machines, a fixed number of waiting slots so that the number of dispatched jobs is the
    maximum) is described by ``row_kind`` and ``col_kind``; the maximality of that number
    is proven separately by the Konig cover carried in the result.
    """

    square: np.ndarray | StructuredSquare
    col_of_row: np.ndarray
    row_potential: np.ndarray
    col_potential: np.ndarray
    row_kind: np.ndarray = field(repr=False)
    col_kind: np.ndarray = field(repr=False)
    _dense: np.ndarray | None = field(default=None, init=False, repr=False, compare=False)

    @property
    def cost(self) -> np.ndarray:
        """The square matrix as a dense array (built once from a :class:`StructuredSquare`)."""
        if isinstance(self.square, np.ndarray):
            return self.square
        if self._dense is None:
            object.__setattr__(self, "_dense", self.square.dense())
        return self._dense

    def reduced_costs(self) -> np.ndarray:
        """cost - u - v (inf on forbidden entries)."""
        return self.cost - self.row_potential[:, None] - self.col_potential[None, :]

    def encodes(self, job_cost: np.ndarray, wait_cost: np.ndarray,
                last_wait_cost: np.ndarray, n_last: int) -> bool:
        """True when ``cost`` is the dispatch layout of these jobs x machines costs.

        ``job_cost`` holds the cost of each (job, machine) pair (``inf`` = not allowed),
        ``wait_cost`` each job's cost of waiting (``inf`` = must run); the last ``n_last``
        wait slots cost ``last_wait_cost`` instead (slots kept for rush jobs). The layout (see
        :class:`StructuredSquare`): jobs then idle rows, machines then wait slots; an idle
        row costs 0 on every machine and cannot wait. Without this check a certificate
        only proves its plan optimal for whatever square it carries.
        """
        job_cost, wait_cost = np.asarray(job_cost), np.asarray(wait_cost)
        n_jobs, n_machines = job_cost.shape
        cost = self.cost
        size = cost.shape[0]
        if cost.shape != (size, size) or size < max(n_jobs, n_machines) or wait_cost.shape != (n_jobs,):
            return False
        expect = np.empty((size, size))
        expect[:n_jobs, :n_machines] = job_cost
        expect[:n_jobs, n_machines:] = wait_cost[:, None]
        if n_last:
            if size - n_last < n_machines:
                return False
            expect[:n_jobs, size - n_last:] = np.asarray(last_wait_cost)[:, None]
        expect[n_jobs:, :n_machines] = 0.0
        expect[n_jobs:, n_machines:] = np.inf
        # allclose counts inf as equal only to inf (and NaN as equal to nothing).
        return bool(np.allclose(cost, expect, rtol=1e-12, atol=tolerance(cost) * 1e-3))

    def verify(self) -> bool:
        """True when the potentials prove the plan optimal for ``cost``."""
        n = self.cost.shape[0]
        if self.cost.shape != (n, n) or sorted(self.col_of_row.tolist()) != list(range(n)):
            return False
        if n == 0:
            return True
        rows = np.arange(n)
        if not np.isfinite(self.cost[rows, self.col_of_row]).all():
            return False
        tol = tolerance(self.cost)
        red = self.reduced_costs()  # inf on forbidden pairs, which passes
        return bool((red >= -tol).all()
                    and np.abs(red[rows, self.col_of_row]).max() <= tol)
