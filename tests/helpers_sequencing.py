"""Exact references for run orders on one machine, independent of the engine.

Nothing here imports :mod:`dispatcher`. Both references read the problem the way
:func:`dispatcher.engine.order_runs` documents it: ``c[i, j]`` is the change from the
setup of i to that of j (NaN or inf: not allowed), index ``start`` is mounted, every
other index is a job run once, the machine finishes in ``end`` (``None``: anywhere;
``end == start``: back in the mounted setup, a closed tour).

* :func:`brute_force_order` tries every order of the jobs (itertools.permutations).
* :func:`held_karp_order` is the dynamic program over subsets of Held and Karp,
  "A dynamic programming approach to sequencing problems", J. SIAM 10(1) (1962)
  196-210, doi:10.1137/0110015: ``best[S, j]`` is the least total of an order that runs
  exactly the jobs of ``S`` and ends with ``j``.

Both return ``inf`` when no order is allowed.
"""

from __future__ import annotations

import itertools
import re
from pathlib import Path

import numpy as np


def _clean(c) -> np.ndarray:
    c = np.array(c, dtype=float)
    c[np.isnan(c)] = np.inf
    return c


def order_total(c, order, start: int = 0, end: int | None = None) -> float:
    """Sum of the changeovers of a run order (inf when one is not allowed)."""
    c = _clean(c)
    seq = [start, *order] + ([start] if end == start and len(order) else [])
    return float(sum(c[a, b] for a, b in itertools.pairwise(seq)))


def brute_force_order(c, start: int = 0, end: int | None = None) -> float:
    """Least total over every order of the jobs (up to about 8 jobs)."""
    c = _clean(c)
    jobs = [j for j in range(c.shape[0]) if j != start]
    best = np.inf
    for perm in itertools.permutations(jobs):
        if end is not None and end != start and perm and perm[-1] != end:
            continue
        best = min(best, order_total(c, perm, start, end))
    return best if jobs else 0.0


def held_karp_order(c, start: int = 0, end: int | None = None) -> float:
    """Least total by the Held-Karp dynamic program over subsets of the jobs."""
    c = _clean(c)
    jobs = np.array([j for j in range(c.shape[0]) if j != start])
    k = jobs.size
    if k == 0:
        return 0.0
    sub = c[np.ix_(jobs, jobs)]                 # changes between jobs
    best = np.full((1 << k, k), np.inf)
    for j in range(k):
        best[1 << j, j] = c[start, jobs[j]]
    for subset in range(1, 1 << k):
        row = best[subset]
        if not np.isfinite(row).any():
            continue
        for j in range(k):
            if subset & (1 << j):
                continue
            bigger = subset | (1 << j)
            best[bigger, j] = min(best[bigger, j], np.min(row + sub[:, j]))
    full = best[(1 << k) - 1]
    if end is None:
        return float(full.min())
    if end == start:
        return float(np.min(full + c[jobs, start]))
    return float(full[int(np.flatnonzero(jobs == end)[0])])


def read_tsplib_atsp(path: Path) -> np.ndarray:
    """TSPLIB FULL_MATRIX file (Reinelt 1991) -> n x n matrix, diagonal as stored."""
    text = path.read_text()
    n = int(re.search(r"DIMENSION\s*:\s*(\d+)", text).group(1))
    numbers = text.split("EDGE_WEIGHT_SECTION", 1)[1].split()[:n * n]
    return np.array(numbers, dtype=float).reshape(n, n)


def tsplib_atsp_optima(readme: Path) -> dict[str, int]:
    """Published optimal tour lengths from the data folder's README table."""
    rows = re.findall(r"^\|\s*(\w+)\.atsp\s*\|\s*(\d+)\s*\|\s*(\d+)\s*\|", readme.read_text(), re.MULTILINE)
    return {name: int(opt) for name, _n, opt in rows}


def brute_force_shift(changeover, hours, capacity, end_change=None, penalty=None, must=None,
                      tau: float = 0.0, most_jobs_first: bool = True):
    """Best whole-shift plan with run orders by trying every assignment and every order.

    Reads the problem as :func:`dispatcher.engine.shift_runs.plan_shift_runs` documents
    it. Returns ``(placed, total)`` of the best plan under the rule (most jobs first,
    then least total), or None when no plan runs every must-run job. Small shops only
    (machines + 1) ** jobs assignments.
    """
    c = _clean(np.asarray(changeover, dtype=float))
    h = np.array(hours, dtype=float)
    m, n1, _ = c.shape
    n = n1 - 1
    end = np.zeros((m, n1)) if end_change is None else _clean(end_change)
    pen = np.zeros(n) if penalty is None else np.asarray(penalty, dtype=float)
    must = np.zeros(n, dtype=bool) if must is None else np.asarray(must, dtype=bool)

    def best_route(k, jobs):
        best = np.inf
        for perm in itertools.permutations(jobs):
            seq = [0] + [j + 1 for j in perm]
            cost = sum(c[k, a, b] for a, b in itertools.pairwise(seq)) + end[k, seq[-1]]
            if not np.isfinite(cost):
                continue
            if sum(h[j, k] for j in perm) + tau * cost > capacity[k] + 1e-9:
                continue
            best = min(best, cost)
        return best

    best = None
    for choice in itertools.product(range(-1, m), repeat=n):
        if any(must[i] and choice[i] < 0 for i in range(n)):
            continue
        if any(choice[i] >= 0 and not np.isfinite(h[i, choice[i]]) for i in range(n)):
            continue
        total = sum(pen[i] for i in range(n) if choice[i] < 0)
        for k in range(m):
            total += best_route(k, [i for i in range(n) if choice[i] == k])
        if not np.isfinite(total):
            continue
        placed = sum(1 for x in choice if x >= 0)
        key = (-placed if most_jobs_first else 0, total)
        if best is None or key < best[0]:
            best = (key, placed, total)
    return None if best is None else (best[1], best[2])
