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


_BLOCK = 32  # rows per relaxation block; measured fastest at n = 300..2000


class CertificateError(RuntimeError):
    """The primal plan could not be certified optimal (a bug, never a user error)."""


def tolerance(cost: np.ndarray) -> float:
    """Absolute slack allowed in reduced costs, scaled to the magnitude of the finite costs."""
    finite = np.isfinite(cost)
    high = float(np.max(cost, where=finite, initial=0.0))
    low = float(np.min(cost, where=finite, initial=0.0))
    scale = max(abs(high), abs(low))
    return 1e-9 * max(1.0, scale) * max(1, cost.shape[0])


def potentials_from_plan(cost: np.ndarray, col_of_row: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Row and column potentials proving a perfect matching of a square matrix optimal.

    ``cost`` may hold ``inf`` for forbidden pairs; ``col_of_row`` is a permutation using
    only finite pairs. Raises :class:`CertificateError` if the plan is not optimal
    (a negative cycle keeps the relaxation from settling).
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
    # Start from v = 0 everywhere (a virtual source joined to every column).
    v = np.minimum((cost - planned[:, None]).min(axis=0), 0.0)
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


@dataclass(frozen=True)
class Certificate:
    """The square problem the engine actually solved, its plan and its dual potentials.

    What it proves, checked by :meth:`verify`:

    1. ``col_of_row`` is a perfect matching of ``cost`` using only finite entries;
    2. every finite entry has reduced cost ``cost - row_potential - col_potential >= -tol``
       and every planned entry has reduced cost within ``tol`` of 0.

    Together these prove the plan is a minimum-cost perfect matching of ``cost``. How the
    square matrix encodes the shop (dummy columns for waiting, dummy rows for idle
    machines, a fixed number of waiting slots so that the number of dispatched jobs is the
    maximum) is described by ``row_kind`` and ``col_kind``; the maximality of that number
    is proven separately by the Konig cover carried in the result.
    """

    cost: np.ndarray
    col_of_row: np.ndarray
    row_potential: np.ndarray
    col_potential: np.ndarray
    row_kind: np.ndarray = field(repr=False)
    col_kind: np.ndarray = field(repr=False)

    def reduced_costs(self) -> np.ndarray:
        """cost - u - v (inf on forbidden entries)."""
        return self.cost - self.row_potential[:, None] - self.col_potential[None, :]

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
        red = self.reduced_costs()
        finite = np.isfinite(self.cost)
        return bool((red[finite] >= -tol).all()
                    and np.abs(red[rows, self.col_of_row]).max() <= tol)
