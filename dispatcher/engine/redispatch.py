"""Warm re-dispatch: repair an optimal plan after an event instead of solving from scratch.

After a machine goes down (or comes back), a rush job arrives, a job finishes or is
pulled, most of the previous plan and most of its dual potentials are still valid. We
map the previous square problem (see :mod:`dispatcher.engine.assignment`: jobs plus idle
rows by machines plus wait slots) onto the new one, keep every potential that is still
dual feasible, drop the planned pairs that lost their zero reduced cost, and re-place only
the rows left free by shortest augmenting paths on reduced costs (Dijkstra), as in the
successive shortest path method (Tomizawa 1971; Edmonds and Karp 1972) in the form of
Jonker and Volgenant (1987). Every result carries a :class:`~.certificate.Certificate`
and is a full :class:`~.assignment.DispatchResult`: ``verify()`` re-checks it.

References
----------
N. Tomizawa, "On some techniques useful for solution of transportation network problems",
Networks 1 (1971) 173-194.
J. Edmonds and R. M. Karp, "Theoretical improvements in algorithmic efficiency for network
flow problems", J. ACM 19(2) (1972) 248-264. doi:10.1145/321694.321699
R. Jonker and A. Volgenant, "A shortest augmenting path algorithm for dense and sparse
linear assignment problems", Computing 38 (1987) 325-340. doi:10.1007/BF02278710
"""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass

import numpy as np

from .assignment import (
    COL_MACHINE,
    COL_WAIT,
    ROW_IDLE,
    ROW_JOB,
    DispatchInputError,
    DispatchResult,
    _check_inputs,
    _check_must_run,
    _plan_total,
    job_mask,
    rush_cover,
    rush_waits,
    solve,
)
from .certificate import Certificate, CertificateError, StructuredSquare
from .matching import konig_cover, maximum_matching

__all__ = ["redispatch", "shortest_augmenting_path"]

_CHUNK = 64  # rows per block in a search step (64 x 1000 floats = 512 kB)


def shortest_augmenting_path(cost: np.ndarray, col_of_row: np.ndarray, row_of_col: np.ndarray,
                             u: np.ndarray, v: np.ndarray, start: int) -> bool:
    """Place the free row ``start`` by one shortest augmenting path; update in place.

    Parameters
    ----------
    cost : (n, n) array, ``inf`` where a pair is forbidden.
    col_of_row, row_of_col : int arrays, -1 for free rows / columns; a partial matching.
    u, v : row and column potentials, dual feasible (``cost - u - v >= 0`` on finite
        entries) and tight (``== 0``) on every matched pair.
    start : a free row.

    Returns
    -------
    bool
        False when no augmenting path exists (the row cannot be placed); nothing changes.

    Notes
    -----
    Dijkstra's method on reduced costs from ``start`` to the nearest free column. As in
    Jonker and Volgenant (1987), all columns at the current least distance are made final
    together and their rows scanned in one numpy block operation (many at once when costs
    are whole minutes and distances tie); then the dual update that
    keeps feasibility and tightness (Tomizawa 1971; Jonker and Volgenant 1987; the update
    follows Crouse 2016, Algorithm 1). O(n) per scanned row, O(n^2) per call at worst.

    References
    ----------
    R. Jonker and A. Volgenant, "A shortest augmenting path algorithm for dense and sparse
    linear assignment problems", Computing 38 (1987) 325-340, doi:10.1007/BF02278710.
    D. F. Crouse, "On implementing 2D rectangular assignment algorithms", IEEE Trans.
    Aerospace and Electronic Systems 52 (2016) 1679-1696, doi:10.1109/TAES.2016.140952.
    E. W. Dijkstra, "A note on two problems in connexion with graphs", Numerische
    Mathematik 1 (1959) 269-271, doi:10.1007/BF01386390.
    """
    placed, _ = _sap(cost, col_of_row, row_of_col, u, v, start)
    return placed


def _sap(cost: np.ndarray, col_of_row: np.ndarray, row_of_col: np.ndarray, u: np.ndarray,
         v: np.ndarray, start: int, limit: float = np.inf) -> tuple[bool, float]:
    """:func:`shortest_augmenting_path` with a distance limit.

    Returns ``(True, length)`` when the row was placed, ``(False, inf)`` when no path
    exists, and ``(False, d)`` with ``d > limit`` a lower bound on the path length when the
    search stopped at the limit; in both failing cases nothing was changed.
    """
    search = sap_search(cost, col_of_row, row_of_col, u, v, start, limit)
    try:
        bound = next(search)
    except StopIteration as done:
        return done.value
    search.close()
    return False, bound


def sap_search(cost: np.ndarray, col_of_row: np.ndarray, row_of_col: np.ndarray,
               u: np.ndarray, v: np.ndarray, start: int, limit: float = np.inf,
               blocked: np.ndarray | None = None, skip: np.ndarray | None = None):
    """Resumable form of :func:`shortest_augmenting_path` (a generator).

    Whenever the next distance would exceed ``limit`` it yields that distance (a lower
    bound on the path length) and waits for a new limit via ``send``; it finishes with
    ``StopIteration.value`` = ``(placed, length)``. Nothing is changed before it finishes.
    ``blocked`` columns are treated as forbidden to every row (their rows stay as they
    are) and ``skip`` columns as forbidden to ``start``: the same search as on a copy of
    ``cost`` with those entries set to ``inf``, without the copy. Used to evaluate
    subproblems lazily (see :mod:`dispatcher.engine.ranking`).

    Parameters
    ----------
    cost, col_of_row, row_of_col, u, v, start
        As for :func:`shortest_augmenting_path`.
    limit : float
        Distance at which to pause.
    blocked, skip : boolean arrays over columns, optional

    Returns
    -------
    generator
        Yields lower bounds; returns ``(placed, length)``.

    References
    ----------
    R. Jonker and A. Volgenant, "A shortest augmenting path algorithm for dense and sparse
    linear assignment problems", Computing 38 (1987) 325-340, doi:10.1007/BF02278710.
    E. W. Dijkstra, "A note on two problems in connexion with graphs", Numerische
    Mathematik 1 (1959) 269-271, doi:10.1007/BF01386390.
    M. L. Miller, H. S. Stone and I. J. Cox, "Optimizing Murty's ranked assignment
    method", IEEE Trans. Aerospace and Electronic Systems 33 (1997) 851-862,
    doi:10.1109/7.599256.
    """
    n = cost.shape[0]
    cand = np.full(n, np.inf)       # tentative distances of columns not yet final
    negv = -v                       # -v, and +inf once a column is final (or blocked)
    if blocked is not None:
        negv[blocked] = np.inf
    dist = np.empty(n)              # distances of final columns
    final_step = np.full(n, -1, dtype=np.int64)
    steps: list[np.ndarray] = []    # rows scanned at each step
    bases: list[float] = []         # their distance (the distance of their column)
    inf = np.inf
    rows = np.array([start], dtype=np.int64)
    base = 0.0
    while True:
        steps.append(rows)
        bases.append(base)
        if rows.size == 1:
            i = int(rows[0])
            red = cost[i] + negv
            red += base - u[i]
            if skip is not None and i == start:
                red[skip] = np.inf
        else:
            # A tie layer can hold hundreds of rows: take them in small chunks so the
            # temporaries stay in cache and reuse memory instead of fresh pages.
            red = None
            for at in range(0, rows.size, _CHUNK):
                part = rows[at:at + _CHUNK]
                block = cost[part]
                block += negv
                block += (base - u[part])[:, None]
                least = block.min(axis=0)
                red = least if red is None else np.minimum(red, least, out=red)
        np.minimum(cand, red, out=cand)
        j = int(cand.argmin())
        d = float(cand[j])
        if not math.isfinite(d):
            return False, d
        while d > limit:
            limit = yield d
        step = len(steps) - 1
        dist[j], negv[j], cand[j], final_step[j] = d, inf, inf, step
        if cand.min() == d:
            # Ties (common with whole-minute values): the whole layer becomes final at once.
            layer = np.flatnonzero(cand == d)
            dist[layer] = d
            negv[layer] = inf
            cand[layer] = inf
            final_step[layer] = step
            layer = np.concatenate((np.array([j]), layer))
            owners = row_of_col[layer]
            free = owners < 0
            if free.any():
                sink = int(layer[np.argmax(free)])
                break
            rows = owners
        else:
            owner = int(row_of_col[j])
            if owner < 0:
                sink = j
                break
            rows = np.array([owner], dtype=np.int64)
        base = d
    # The path, read back from the distances: a column's predecessor is a row scanned no
    # later than the column became final that attains its distance (same float operations
    # as above, so the minimum is met exactly).
    scanned = np.concatenate(steps)
    scanned_base = np.repeat(np.asarray(bases), [len(r) for r in steps])
    upto = np.cumsum([len(r) for r in steps])
    path = []
    skipped = set() if skip is None else set(np.asarray(skip).tolist())
    j = sink
    while True:
        m = upto[final_step[j]]
        cand_rows = scanned[:m]
        reach = cost[cand_rows, j] + (-v[j])
        reach += scanned_base[:m] - u[cand_rows]
        if skip is not None and j in skipped:
            reach[cand_rows == start] = np.inf
        i = int(cand_rows[int(np.argmin(reach))])
        path.append((i, j))
        if i == start:
            break
        j = int(col_of_row[i])
    # Dual update (keeps cost - u - v >= 0 and tight pairs tight).
    d_sink = dist[sink]
    u[start] += d_sink
    if scanned.size > 1:
        others = scanned[1:]
        u[others] += d_sink - dist[col_of_row[others]]
    cols = np.flatnonzero(final_step >= 0)
    v[cols] -= d_sink - dist[cols]
    for i, j in path:
        row_of_col[j] = i
        col_of_row[i] = j
    return True, d_sink


def _repair(cost: np.ndarray, col_of_row: np.ndarray, u: np.ndarray, v: np.ndarray,
            touched_rows: np.ndarray, touched_cols: np.ndarray) -> None:
    """Make (u, v) dual feasible again after the listed rows/columns changed; re-place.

    ``u``/``v`` hold NaN for rows/columns that are new. Columns get the largest feasible
    potential against rows whose potential is known, then rows get theirs against all
    columns; planned pairs that are no longer tight are dropped and their rows re-placed
    by :func:`shortest_augmenting_path`. Entries outside the touched rows and columns must
    be unchanged, so the old potentials stay feasible there.
    """
    n = cost.shape[0]
    known = ~np.isnan(u)
    known[touched_rows] = False
    cols = np.union1d(touched_cols, np.flatnonzero(np.isnan(v)))
    if cols.size:
        if known.any():
            with np.errstate(invalid="ignore"):
                best = (cost[np.ix_(np.flatnonzero(known), cols)] - u[known][:, None]).min(axis=0)
        else:
            best = np.full(cols.size, np.inf)
        old = v[cols]
        v[cols] = np.where(np.isfinite(best), best, np.where(np.isnan(old), 0.0, old))
    # Rows: new, touched, or matched into a touched column (its potential may have dropped).
    matched = col_of_row >= 0
    into_touched = np.zeros(n, dtype=bool)
    if cols.size:
        is_touched = np.zeros(n, dtype=bool)
        is_touched[cols] = True
        into_touched[matched] = is_touched[col_of_row[matched]]
    rows = np.flatnonzero(~known | into_touched)
    if rows.size:
        best = (cost[rows] - v[None, :]).min(axis=1)
        if not np.isfinite(best).all():
            raise CertificateError("a row has no allowed column; the problem is infeasible")
        u[rows] = best
    # Columns that only new rows can use: raise them to their largest feasible potential
    # now that every row has one (a new idle row then meets the down machine at once).
    if cols.size:
        best = (cost[:, cols] - u[:, None]).min(axis=0)
        v[cols] = np.where(np.isfinite(best), np.maximum(v[cols], best), v[cols])
    # Drop planned pairs that are no longer tight.
    scale = max(1.0, float(np.abs(u).max(initial=0.0)), float(np.abs(v).max(initial=0.0)))
    tol = 1e-12 * scale * max(1, n)
    row_of_col = np.full(n, -1, dtype=np.int64)
    placed = np.flatnonzero(col_of_row >= 0)
    slack = cost[placed, col_of_row[placed]] - u[placed] - v[col_of_row[placed]]
    loose = placed[~(np.abs(slack) <= tol)]
    col_of_row[loose] = -1
    placed = np.flatnonzero(col_of_row >= 0)
    row_of_col[col_of_row[placed]] = placed
    free_cols = row_of_col < 0
    for r in np.flatnonzero(col_of_row < 0):
        # A free column already tight for this row needs no search (Jonker and Volgenant
        # 1987, reduction transfer).
        tight = np.flatnonzero(free_cols & (cost[r] - u[r] - v <= tol))
        if tight.size:
            j = int(tight[0])
            col_of_row[r], row_of_col[j], free_cols[j] = j, r, False
            continue
        if not shortest_augmenting_path(cost, col_of_row, row_of_col, u, v, int(r)):
            raise CertificateError("no perfect matching in the re-dispatch problem (a bug)")
        np.less(row_of_col, 0, out=free_cols)


def _dense_square(cert: Certificate, size: int, n_old: int, n_keep: int, n_jobs: int,
                  n_machines: int, survivors: np.ndarray, same_jobs: bool, add_cost: np.ndarray,
                  down: np.ndarray, up_cols: list[int], up_cost: dict[int, np.ndarray],
                  move: np.ndarray | None, before: np.ndarray,
                  wait_cost: np.ndarray) -> np.ndarray:
    """The new square matrix as a dense array (events that change rows or restore columns)."""
    sq = np.empty((size, size))
    real = sq[:n_jobs, :n_machines]
    old_real = cert.cost[:n_old, :n_machines]
    if n_keep == n_old:
        real[:n_keep] = old_real
    elif n_keep:
        real[:n_keep] = old_real[survivors]
    if add_cost.shape[0]:
        real[n_keep:] = add_cost
    if down.size:
        real[:, down] = np.inf
    for m in up_cols:
        real[:, m] = up_cost[m]
    if move is not None:
        rows = np.flatnonzero(move > 0)
        real[rows] += move[rows, None]
        real[rows, before[rows]] -= move[rows]
    sq[:n_jobs, n_machines:] = wait_cost[:, None]
    sq[n_jobs:, :n_machines] = 0.0
    sq[n_jobs:, n_machines:] = np.inf
    return sq


def _max_placed(allowed: np.ndarray, machine_of_job: np.ndarray) -> int:
    """Maximum matching size, skipping Hopcroft-Karp when a known matching meets a bound."""
    placed = machine_of_job >= 0
    size = int(placed.sum())
    # A matching never exceeds the machines (or the jobs) that have an allowed pair, so
    # meeting either count proves it maximum; the second pass is needed only if not.
    if size == int(allowed.any(axis=0).sum()) or size == int(allowed.any(axis=1).sum()):
        return size
    return int((maximum_matching(allowed) >= 0).sum())


@dataclass
class _After:
    """The problem after the event, in the row order of the result: surviving jobs of the
    previous plan, then new jobs. ``before`` is each row's machine in the previous plan
    (-1 for new rows or rows that waited); ``move`` the move penalties (None if none)."""

    survivors: np.ndarray
    n_keep: int
    add_vals: np.ndarray
    add_mask: np.ndarray
    values: np.ndarray
    allowed: np.ndarray
    penalty: np.ndarray
    must: np.ndarray
    rush: np.ndarray
    down: np.ndarray
    up_cols: list[int]
    before: np.ndarray
    same_jobs: bool = False  # no row removed or added: arrays are shared where unchanged
    move: np.ndarray | None = None

    @property
    def n_jobs(self) -> int:
        return self.values.shape[0]


def _rows_after(previous: DispatchResult, jobs_removed, new_jobs, new_allowed,
                new_wait_penalty, new_must_run, new_rush):
    """Surviving rows of ``previous`` and the checked new rows."""
    n_old, n_machines = previous.values.shape
    removed = np.unique(np.asarray(jobs_removed, dtype=np.int64))
    if removed.size and (removed.min() < 0 or removed.max() >= n_old):
        raise DispatchInputError(f"jobs_removed names a job outside 0..{n_old - 1}")
    survivors = np.setdiff1d(np.arange(n_old), removed) if removed.size else np.arange(n_old)
    if new_jobs is None:
        return (survivors, np.zeros((0, n_machines)), np.zeros((0, n_machines), dtype=bool),
                np.zeros(0), np.zeros(0, dtype=bool), np.zeros(0, dtype=bool))
    add_vals, add_mask, add_pen, add_must = _check_inputs(
        np.atleast_2d(np.asarray(new_jobs, dtype=float)), new_allowed,
        new_wait_penalty, new_must_run)
    if add_vals.shape[1] != n_machines:
        raise DispatchInputError(
            f"new jobs have {add_vals.shape[1]} machine values, the plan has {n_machines} machines")
    add_rush = job_mask(new_rush, add_vals.shape[0], "new_rush")
    return survivors, add_vals, add_mask, add_pen, add_must, add_rush


def _problem_after(previous: DispatchResult, rows, machines_down, machines_up) -> _After:
    """The new problem, sharing arrays with the previous one where nothing changed:
    machines going down lose their column, machines coming up get theirs replaced."""
    survivors, add_vals, add_mask, add_pen, add_must, add_rush = rows
    n_old, n_machines = previous.values.shape
    n_keep = survivors.size
    n_jobs = n_keep + add_vals.shape[0]
    down = np.unique(np.asarray(machines_down, dtype=np.int64))
    up = dict(machines_up or {})
    for m in [*down.tolist(), *up]:
        if not 0 <= int(m) < n_machines:
            raise DispatchInputError(f"machine {m} is outside 0..{n_machines - 1}")
    if set(down.tolist()) & set(up):
        raise DispatchInputError("a machine cannot go down and come up in the same event")
    same_jobs = n_keep == n_old and add_vals.shape[0] == 0
    values = previous.values if same_jobs else np.vstack([previous.values[survivors], add_vals])
    allowed = np.vstack([previous.allowed[survivors], add_mask]) if not same_jobs \
        else previous.allowed.copy()
    old_rush = previous.rush if previous.rush is not None else np.zeros(n_old, dtype=bool)
    up_cols = sorted(int(m) for m in up)
    if up_cols and values is previous.values:
        values = values.copy()
    for m in up_cols:
        col_vals, col_mask = up[m]
        col_vals = np.asarray(col_vals, dtype=float).reshape(-1)
        col_mask = np.asarray(col_mask, dtype=bool).reshape(-1)
        if col_vals.shape != (n_jobs,) or col_mask.shape != (n_jobs,):
            raise DispatchInputError(f"machine {m} coming up needs {n_jobs} values and allowed flags")
        sel = col_vals[col_mask]
        if not np.isfinite(sel).all() or (sel < 0).any():
            raise DispatchInputError(f"machine {m} coming up: values must be finite and >= 0")
        values[:, m] = np.where(col_mask, col_vals, 0.0)
        allowed[:, m] = col_mask
    allowed[:, down] = False
    before = np.full(n_jobs, -1, dtype=np.int64)
    before[:n_keep] = previous.machine_of_job[survivors]
    return _After(survivors, n_keep, add_vals, add_mask, values, allowed,
                  np.r_[previous.wait_penalty[survivors], add_pen],
                  np.r_[previous.must_run[survivors], add_must],
                  np.r_[old_rush[survivors], add_rush], down, up_cols, before, same_jobs)


def _charge_moves(previous: DispatchResult, after: _After, move_penalty) -> None:
    """Add each moved job's penalty to its other machines and to waiting (in place)."""
    if move_penalty is None:
        return
    n_jobs = after.n_jobs
    move = np.asarray(move_penalty, dtype=float).reshape(-1)
    if move.shape != (n_jobs,) or not np.isfinite(move).all() or (move < 0).any():
        raise DispatchInputError(f"move_penalty needs {n_jobs} numbers >= 0")
    move = np.where(after.before >= 0, move, 0.0)
    if not move.any():
        return
    if previous.objective == "bottleneck":
        raise DispatchInputError("move penalties apply to the 'total' and 'maximize' objectives")
    rows = np.flatnonzero(move > 0)
    values = after.values.copy() if after.values is previous.values else after.values
    # A move penalty is added to a cost, and counts against a value when maximising
    # (values are gains); either way the square's cost of every other choice rises by it.
    sign = -1.0 if previous.objective == "maximize" else 1.0
    values[rows] += sign * move[rows, None]
    values[rows, after.before[rows]] -= sign * move[rows]
    after.values = values
    after.penalty = after.penalty.copy()
    after.penalty[rows] += move[rows]
    after.move = move


def _cold(after: _After, objective: str) -> DispatchResult:
    return solve(after.values, after.allowed, objective=objective,
                 wait_penalty=after.penalty, must_run=after.must, rush=after.rush)


def _needs_cold(previous: DispatchResult, after: _After) -> bool:
    """Warm repair keeps the previous square's wait slots; rush jobs left waiting split
    them (see :func:`~.assignment.solve`), so such plans, before or after, are solved cold,
    as is the bottleneck objective, whose threshold moves with the event."""
    if previous.objective == "bottleneck":
        return True
    if previous.rush_waiting.size:
        return True
    return bool(after.rush.any()) and rush_waits(after.allowed, after.must | after.rush) > 0


def _top(previous: DispatchResult) -> float:
    """The constant the maximising square subtracts values from (0 when minimising)."""
    if previous.objective != "maximize":
        return 0.0
    ij = np.argwhere(previous.solved_allowed)
    if not len(ij):
        return 0.0
    i, j = ij[0]
    return float(previous.certificate.cost[i, j] + previous.values[i, j])


def _square_after(previous: DispatchResult, after: _After, top: float, idle_new: int,
                  wait_new: int):
    """The new square problem: shared with the previous one when machines only went down."""
    cert = previous.certificate
    n_old, n_machines = previous.values.shape
    n_jobs = after.n_jobs
    maximize = previous.objective == "maximize"

    def cost_of(x: np.ndarray) -> np.ndarray:
        return top - x if maximize else x

    # Rush jobs that can all be placed are placed in every plan: as must-run jobs here.
    wait_cost = np.where(after.must | after.rush, np.inf, after.penalty)
    if after.same_jobs and after.move is None and not after.up_cols:
        # Machines going down only forbid columns: share the previous job x machine costs
        # instead of copying them (see StructuredSquare).
        prev_sq = cert.square
        if isinstance(prev_sq, StructuredSquare):
            base, blocked = prev_sq.base, np.union1d(prev_sq.blocked, after.down)
        else:
            base, blocked = cert.cost[:n_old, :n_machines], after.down
        return StructuredSquare(base, blocked, wait_cost, idle_new, wait_new)
    size = n_jobs + idle_new
    return _dense_square(cert, size, n_old, after.n_keep, n_jobs, n_machines, after.survivors,
                         after.same_jobs,
                         np.where(after.add_mask, cost_of(after.add_vals), np.inf), after.down,
                         after.up_cols,
                         {m: np.where(after.allowed[:, m], cost_of(after.values[:, m]), np.inf)
                          for m in after.up_cols},
                         after.move, after.before, wait_cost)


def _carry_over(previous: DispatchResult, after: _After, sq, idle_new: int, wait_new: int):
    """Potentials and planned pairs of the previous square mapped onto the new one (NaN /
    -1 where a row or column is new or its pair is no longer allowed)."""
    cert = previous.certificate
    n_old, n_machines = previous.values.shape
    n_jobs = after.n_jobs
    size = n_jobs + idle_new
    k_old = n_old - (cert.col_kind == COL_WAIT).sum()
    idle_old, wait_old = n_machines - k_old, n_old - k_old
    u = np.full(size, np.nan)
    v = np.full(size, np.nan)
    col_of_row = np.full(size, -1, dtype=np.int64)
    keep_idle = min(idle_old, idle_new)
    keep_wait = min(wait_old, wait_new)
    old_rows = np.r_[after.survivors, n_old + np.arange(keep_idle)]
    new_rows = np.r_[np.arange(after.n_keep), n_jobs + np.arange(keep_idle)]
    u[new_rows] = cert.row_potential[old_rows]
    v[:n_machines] = cert.col_potential[:n_machines]
    v[n_machines:n_machines + keep_wait] = cert.col_potential[n_machines:n_machines + keep_wait]
    c = cert.col_of_row[old_rows]
    c = np.where(c < n_machines + keep_wait, c, -1)
    ok = c >= 0
    ok[ok] = np.isfinite(sq[new_rows[ok], c[ok]])
    col_of_row[new_rows[ok]] = c[ok]
    touched_cols = np.union1d(after.down, np.asarray(after.up_cols, dtype=np.int64)).astype(np.int64)
    if wait_new > wait_old:
        touched_cols = np.union1d(touched_cols, n_machines + np.arange(wait_old, wait_new))
    touched_rows = np.arange(after.n_keep, n_jobs)
    if after.move is not None:
        touched_rows = np.union1d(touched_rows, np.flatnonzero(after.move > 0))
    return u, v, col_of_row, touched_rows.astype(np.int64), touched_cols


def _result_after(previous: DispatchResult, after: _After, sq, col_of_row, u, v, top: float,
                  idle_new: int, wait_new: int) -> DispatchResult:
    """The repaired square read back as a certified DispatchResult."""
    n_machines = previous.values.shape[1]
    n_jobs = after.n_jobs
    row_kind = np.r_[np.full(n_jobs, ROW_JOB), np.full(idle_new, ROW_IDLE)]
    col_kind = np.r_[np.full(n_machines, COL_MACHINE), np.full(wait_new, COL_WAIT)]
    certificate = Certificate(sq, col_of_row, u, v, row_kind, col_kind)
    job_cols = col_of_row[:n_jobs]
    machine_of_job = np.where(job_cols < n_machines, job_cols, -1)
    ju, mv = u[:n_jobs], v[:n_machines]
    if previous.objective == "maximize":
        ju, mv = top - ju, -mv
    cover_jobs, cover_machines = konig_cover(after.allowed, machine_of_job)
    rush_jobs = rush_machines = None
    if after.rush.any():
        rush_jobs, rush_machines = rush_cover(after.allowed, machine_of_job, after.must | after.rush)
    return DispatchResult(
        machine_of_job=machine_of_job,
        total=_plan_total(after.values, machine_of_job, after.penalty, previous.objective),
        objective=previous.objective,
        values=after.values,
        allowed=after.allowed,
        solved_allowed=after.allowed,
        job_potential=ju,
        machine_potential=mv,
        wait_penalty=after.penalty,
        must_run=after.must,
        certificate=certificate,
        cover_jobs=cover_jobs,
        cover_machines=cover_machines,
        bottleneck=None,
        rush=after.rush,
        rush_cover_jobs=rush_jobs,
        rush_cover_machines=rush_machines,
    )


def redispatch(previous: DispatchResult, *, machines_down: Sequence[int] = (),
               machines_up: Mapping[int, tuple[np.ndarray, np.ndarray]] | None = None,
               jobs_removed: Sequence[int] = (), new_jobs=None, new_allowed=None,
               new_wait_penalty=None, new_must_run=None, new_rush=None,
               move_penalty=None) -> DispatchResult:
    """The optimal plan after an event, repaired warm from ``previous``.

    Parameters
    ----------
    previous : DispatchResult
        An optimal plan with its potentials (from :func:`~.assignment.solve` or from an
        earlier call of this function).
    machines_down : machine indices that can no longer run any job (their column becomes
        forbidden; machine indices never shift).
    machines_up : ``{machine: (values_column, allowed_column)}``, one entry per job of the
        new problem: the machine's column is replaced (a machine coming back).
    jobs_removed : indices (in ``previous``) of jobs that finished or were pulled.
    new_jobs, new_allowed, new_wait_penalty, new_must_run, new_rush : rows appended after
        the surviving jobs (a rush job that arrives is a new job with ``new_rush`` True).
    move_penalty : one number >= 0 per job of the new problem. A job that ``previous``
        placed on machine m pays it once if the new plan puts it anywhere else, including
        waiting (counted against its value when maximising). The returned ``values`` and
        ``total`` include these penalties.

    Returns
    -------
    DispatchResult
        Jobs in the order: surviving jobs of ``previous`` (in order), then ``new_jobs``.
        Identical in total to ``solve()`` of the modified problem, and certified.

    Raises
    ------
    DispatchInputError
        bad indices or numbers; :class:`~.assignment.InfeasibleError` when the must-run
        jobs can no longer all be placed.

    Notes
    -----
    Steps: the rows after the event (:func:`_rows_after`), the new problem
    (:func:`_problem_after`), move penalties (:func:`_charge_moves`), the new square
    (:func:`_square_after`), the previous potentials and pairs carried over
    (:func:`_carry_over`), the repair (:func:`_repair`) and the certified result
    (:func:`_result_after`). Only rows and columns the event touched are re-placed, by
    shortest augmenting paths on reduced costs (see the module references). The
    ``"bottleneck"`` objective, and plans with rush jobs left waiting, are re-solved cold.

    References
    ----------
    R. Jonker and A. Volgenant, "A shortest augmenting path algorithm for dense and sparse
    linear assignment problems", Computing 38 (1987) 325-340, doi:10.1007/BF02278710.
    D. F. Crouse, "On implementing 2D rectangular assignment algorithms", IEEE Trans.
    Aerospace and Electronic Systems 52 (2016) 1679-1696, doi:10.1109/TAES.2016.140952.
    """
    rows = _rows_after(previous, jobs_removed, new_jobs, new_allowed, new_wait_penalty,
                       new_must_run, new_rush)
    after = _problem_after(previous, rows, machines_down, machines_up)
    _charge_moves(previous, after, move_penalty)
    _check_must_run(after.allowed, after.must)
    if _needs_cold(previous, after):
        return _cold(after, previous.objective)

    n_machines = previous.values.shape[1]
    still = after.before >= 0
    still[still] = after.allowed[np.flatnonzero(still), after.before[still]]
    k = _max_placed(after.allowed, np.where(still, after.before, -1))
    idle_new, wait_new = n_machines - k, after.n_jobs - k
    top = _top(previous)
    sq = _square_after(previous, after, top, idle_new, wait_new)
    u, v, col_of_row, touched_rows, touched_cols = _carry_over(previous, after, sq, idle_new,
                                                               wait_new)
    _repair(sq, col_of_row, u, v, touched_rows, touched_cols)
    return _result_after(previous, after, sq, col_of_row, u, v, top, idle_new, wait_new)
