"""Exact what-if costs: how much worse the best plan gets if one job goes to one machine.

Given an optimal plan with dual potentials, forcing the pair (job i, machine j) costs
exactly ``r(i, j) + D(i', i)`` where ``r`` is the reduced cost, ``i'`` the row now planned
on column j and ``D`` the shortest alternating path from row ``i'`` back to row ``i`` on
reduced costs: the new plan differs from the old one by one alternating cycle through
(i, j), every other cycle can only add non-negative reduced cost, and the cheapest such
cycle is that path. All cells come from one all-pairs shortest path computation on the
square problem, O(n^3) in total, instead of n^2 forced re-solves.

The square problem is the one the engine solved (jobs plus idle rows by machines plus
wait slots, see :mod:`dispatcher.engine.assignment`), so "a plan" keeps its meaning:
as many jobs placed as the allowed pairs permit and every must-run job placed. A pair no
such plan contains is reported as impossible (NaN).
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from .assignment import COL_WAIT, DispatchResult

__all__ = ["WhatIf", "what_if", "forced_rise", "alternating_distances"]


@dataclass(frozen=True)
class WhatIf:
    """What-if costs for every (job, machine) pair of a plan.

    ``extra[i, m]``: how much worse the best plan that runs job i on machine m is than
    the plan itself (0 on the plan, NaN where no plan can contain the pair). For the
    ``"total"`` objective this is the rise in total; for ``"maximize"`` the fall in total
    value. ``wait_extra[i]``: the same for keeping job i waiting. ``best_other[i]``: the
    machine with the least extra other than job i's planned one (-1 if none), and
    ``best_other_extra[i]`` its extra (NaN if none).
    """

    extra: np.ndarray
    wait_extra: np.ndarray
    best_other: np.ndarray
    best_other_extra: np.ndarray


def alternating_distances(weights: np.ndarray) -> np.ndarray:
    """All-pairs shortest path lengths for non-negative arc weights (``inf`` = no arc).

    Floyd's method (R. W. Floyd, "Algorithm 97: Shortest path", Comm. ACM 5(6) (1962) 345,
    doi:10.1145/367766.368168), one numpy outer minimum per pivot: O(n^3) arithmetic in n
    vector steps. Written here rather than taken from ``scipy.sparse.csgraph`` because
    tight pairs are zero-weight arcs, which its dense input reads as missing arcs.

    Parameters
    ----------
    weights : (n, n) array of arc weights >= 0, ``inf`` = no arc

    Returns
    -------
    (n, n) array
        Shortest path lengths (0 on the diagonal).

    References
    ----------
    R. W. Floyd, "Algorithm 97: Shortest path", Comm. ACM 5 (1962) 345,
    doi:10.1145/367766.368168.
    """
    dist = np.array(weights, dtype=float, copy=True)
    n = dist.shape[0]
    np.fill_diagonal(dist, 0.0)
    for k in range(n):
        np.minimum(dist, dist[:, k, None] + dist[None, k, :], out=dist)
    return dist


def forced_rise(cost: np.ndarray, col_of_row: np.ndarray, u: np.ndarray,
                v: np.ndarray) -> np.ndarray:
    """Rise in total of a square assignment problem when each entry (i, j) is forced.

    ``col_of_row`` is optimal with potentials ``u``, ``v``. Entry ``[i, j]`` is
    ``r(i, j) + D(row_of(j), i)`` (see :func:`what_if`), ``inf`` where no perfect matching
    of finite entries contains (i, j), and exactly 0 on the plan.

    Parameters
    ----------
    cost : (n, n) array, ``inf`` where forbidden
    col_of_row : int array
        An optimal permutation.
    u, v : float arrays
        Its dual potentials.

    Returns
    -------
    (n, n) array
        The rise per forced entry, ``inf`` where impossible.

    References
    ----------
    L. R. Ford and D. R. Fulkerson, "Flows in Networks", Princeton University Press (1962).
    R. Burkard, M. Dell'Amico and S. Martello, "Assignment Problems", SIAM (2009),
    doi:10.1137/1.9781611972238.
    """
    size = cost.shape[0]
    finite = np.isfinite(cost)
    red = np.where(finite, np.maximum(cost - u[:, None] - v[None, :], 0.0), np.inf)
    row_of_col = np.empty(size, dtype=np.int64)
    row_of_col[col_of_row] = np.arange(size)
    dist = alternating_distances(red[:, col_of_row])
    rise = red + dist[row_of_col].T
    rise[np.arange(size), col_of_row] = 0.0  # float noise on the plan itself
    return rise


def what_if(result: DispatchResult) -> WhatIf:
    """Exact extra cost of every (job, machine) pair and of every job waiting.

    Parameters
    ----------
    result : DispatchResult
        An optimal plan with objective ``"total"`` or ``"maximize"``.

    Returns
    -------
    WhatIf

    Raises
    ------
    ValueError
        for the ``"bottleneck"`` objective (its plans are ranked by a threshold first, so
        a single extra number per pair does not describe them).

    Notes
    -----
    With reduced costs ``r = c - u - v >= 0`` and the plan ``sigma``, the arc from row a
    to row b has weight ``r(a, sigma(b))``; forcing (i, j) costs
    ``r(i, j) + D(row_of(j), i)`` (Ford and Fulkerson 1962, ch. III: optimal circulations
    differ by cycles of the residual graph). Shortest paths by
    :func:`alternating_distances`, O(n^3) for an n x n square problem.

    References
    ----------
    L. R. Ford and D. R. Fulkerson, "Flows in Networks", Princeton University Press (1962).
    R. Burkard, M. Dell'Amico and S. Martello, "Assignment Problems", SIAM (2009),
    doi:10.1137/1.9781611972238.
    R. W. Floyd, "Algorithm 97: Shortest path", Comm. ACM 5 (1962) 345,
    doi:10.1145/367766.368168.
    """
    if result.objective not in ("total", "maximize"):
        raise ValueError("what-if costs are defined for the 'total' and 'maximize' objectives")
    cert = result.certificate
    n_jobs, n_machines = result.values.shape
    size = cert.cost.shape[0]
    if size == 0:
        empty = np.zeros((n_jobs, n_machines))
        return WhatIf(empty, np.zeros(n_jobs), np.full(n_jobs, -1), np.full(n_jobs, np.nan))
    rise = forced_rise(cert.cost, cert.col_of_row, cert.row_potential, cert.col_potential)
    extra = rise[:n_jobs, :n_machines].copy()
    extra[~np.isfinite(extra) | ~result.solved_allowed] = np.nan
    wait_cols = np.flatnonzero(cert.col_kind == COL_WAIT)
    if wait_cols.size:
        wait_extra = rise[:n_jobs][:, wait_cols].min(axis=1)
        wait_extra[~np.isfinite(wait_extra)] = np.nan
    else:
        wait_extra = np.full(n_jobs, np.nan)
    others = extra.copy()
    placed = np.flatnonzero(result.machine_of_job >= 0)
    others[placed, result.machine_of_job[placed]] = np.nan
    has = ~np.isnan(others).all(axis=1) if n_machines else np.zeros(n_jobs, dtype=bool)
    best = np.full(n_jobs, -1, dtype=np.int64)
    best_extra = np.full(n_jobs, np.nan)
    if has.any():
        best[has] = np.nanargmin(others[has], axis=1)
        best_extra[has] = others[has, best[has]]
    return WhatIf(extra, wait_extra, best, best_extra)
