"""The best run order on one machine: the changeover sequencing problem.

``changeover[i, j]`` is the time (or cost) to change the machine from the setup of
``i`` to the setup of ``j``. Index ``start`` is the setup mounted now; every other index
is a job that runs exactly once. The machine must finish in the setup of ``end``
(``None``: anywhere). ``end == start`` asks for the machine to be back in its mounted
setup, which is the asymmetric travelling salesman problem (ATSP); ``end`` is ``None``
or another job for a shortest Hamiltonian path. NaN or infinite entries mean that the
change is not allowed. The diagonal is never used (a job follows itself only in the
sense of another job of the same family, which is another index).

Changeovers are **not** assumed to obey the triangle inequality (a wash-up between two
colours can be cheaper than the direct change): the method below is exact whatever the
entries are.

Method (exact branch and cut through ``scipy.optimize.milp``):

1. a first run order from the assignment relaxation patched into one tour (Karp 1979),
   improved by Or-opt and 2-opt moves (Or 1976; Croes 1958); the assignment relaxation
   is also the first lower bound (``scipy.optimize.linear_sum_assignment``);
2. the linear relaxation of the Dantzig-Fulkerson-Johnson model with subtour
   elimination constraints separated on the fractional solution (strongly connected
   components, then minimum cuts from maximum flows), until no cut is violated
   (Padberg and Rinaldi 1991; Fischetti and Toth 1997);
3. arcs whose reduced cost proves that they cannot be in a tour cheaper than the best one
   known are fixed to zero, and the integer program is solved by HiGHS with the cuts
   found and a cutoff below the best tour; subtours of an integer solution become new
   cuts (and are patched into a tour) until the solution is one tour or none cheaper
   exists.
"""

from __future__ import annotations

import itertools
import math
import time
from dataclasses import dataclass

import numpy as np
from scipy.optimize import (
    Bounds,
    LinearConstraint,
    linear_sum_assignment,
    linprog,
    milp,
)
from scipy.sparse import coo_array, csr_array
from scipy.sparse.csgraph import breadth_first_order, connected_components, maximum_flow

from dispatcher.errors import Infeasible

from .assignment import DispatchInputError

__all__ = ["RunOrder", "RunOrderInfeasibleError", "order_runs"]

#: Relative gap under which an order with non-integer changeovers counts as optimal.
REL_TOLERANCE = 1e-7
_FLOW_SCALE = 1_000_000
_CUT_EPS = 1e-4
_MAX_CUT_ROUNDS = 200
_CORE_K = 8                # cheapest arcs per node in the first LP (others by pricing)


class RunOrderInfeasibleError(Infeasible):
    """No run order exists: the allowed changeovers cannot chain all the jobs (exit 3)."""


@dataclass(frozen=True)
class RunOrder:
    """A run order for one machine and what is proven about it.

    ``order`` lists the job indices in run order (``start`` excluded, and ``end``
    excluded when it equals ``start``); ``total`` is the sum of the changeovers along it,
    from ``start`` and, with ``end == start``, back to ``start``; ``lower_bound`` is a
    proven lower bound on the best possible total; ``proven_optimal`` is true when the
    two meet (exactly for integer changeovers, within a relative ``REL_TOLERANCE``
    otherwise). ``status`` is ``"optimal"`` or ``"time_limit"``.
    """

    order: np.ndarray
    total: float
    lower_bound: float
    proven_optimal: bool
    status: str = "optimal"

    @property
    def gap(self) -> float:
        """Relative gap ``(total - lower_bound) / max(1, |total|)`` (0 when proven)."""
        return 0.0 if self.proven_optimal else (self.total - self.lower_bound) / max(1.0, abs(self.total))

    def verify(self, changeover, *, start: int = 0, end: int | None = None) -> None:
        """Check the order against the matrix: every job once, allowed changes, total.

        Raises ``AssertionError`` naming the first claim that does not hold.
        """
        c = np.asarray(changeover, dtype=float)
        n = c.shape[0]
        jobs = sorted(set(range(n)) - {start})
        order = [int(v) for v in self.order]
        assert sorted(order) == jobs, f"order {order} is not each job once ({jobs})"
        if end is not None and end != start and order:
            assert order[-1] == end, f"order ends in {order[-1]}, not in {end}"
        seq = [start, *order] + ([start] if end == start and order else [])
        steps = [c[a, b] for a, b in itertools.pairwise(seq)]
        assert all(np.isfinite(steps)), "order uses a changeover that is not allowed"
        total = float(sum(steps))
        assert math.isclose(total, self.total, rel_tol=1e-9, abs_tol=1e-9), \
            f"total {self.total} but the changeovers add up to {total}"
        assert self.lower_bound <= self.total + 1e-9 * max(1.0, abs(self.total)), \
            f"lower bound {self.lower_bound} above the total {self.total}"


def order_runs(changeover, *, start: int = 0, end: int | None = None,
               time_limit: float | None = None) -> RunOrder:
    """Order the runs on one machine so that the changeovers add up to the least total.

    Parameters
    ----------
    changeover : (n, n) array_like of float
        ``changeover[i, j]`` is the change from the setup of ``i`` to that of ``j``,
        >= 0; NaN or inf: not allowed. The diagonal is ignored. No triangle inequality
        is assumed.
    start : int
        Index of the setup mounted now (not a job).
    end : int or None
        Index whose setup the machine must finish in: ``start`` for a closed tour (the
        asymmetric travelling salesman problem), another index for a job that must run
        last, ``None`` for anywhere.
    time_limit : float or None
        Seconds for the exact search; when it runs out the best order found is returned
        with ``proven_optimal`` false and the proven ``lower_bound``.

    Returns
    -------
    RunOrder
        ``order``, ``total``, ``lower_bound``, ``proven_optimal`` (and ``status``).

    Raises
    ------
    DispatchInputError
        The matrix is not square, not numbers, negative, or an index is out of range.
    RunOrderInfeasibleError
        The allowed changeovers admit no order at all (proven by the assignment
        relaxation or by the integer program).

    Notes
    -----
    The path cases reduce to a tour: with ``end=None`` every change back to ``start``
    costs 0; with ``end=e`` the only change out of ``e`` is a free one back to
    ``start``. The tour problem is solved by branch and cut (see the module docstring);
    each round of the linear relaxation costs one HiGHS solve and at most ``n - 1``
    maximum flows (scipy.sparse.csgraph.maximum_flow).

    References
    ----------
    .. [1] G. Dantzig, R. Fulkerson and S. Johnson, "Solution of a large-scale
       traveling-salesman problem", Operations Research 2(4) (1954) 393-410,
       doi:10.1287/opre.2.4.393 (the subtour elimination model).
    .. [2] R. M. Karp, "A patching algorithm for the nonsymmetric traveling-salesman
       problem", SIAM J. Computing 8(4) (1979) 561-573, doi:10.1137/0208045.
    .. [3] I. Or, "Traveling salesman-type combinatorial problems and their relation to
       the logistics of regional blood banking", PhD thesis, Northwestern University
       (1976) (Or-opt); G. A. Croes, "A method for solving traveling-salesman problems",
       Operations Research 6(6) (1958) 791-812, doi:10.1287/opre.6.6.791 (2-opt).
    .. [4] M. Padberg and G. Rinaldi, "A branch-and-cut algorithm for the resolution of
       large-scale symmetric traveling salesman problems", SIAM Review 33(1) (1991)
       60-100, doi:10.1137/1033004; M. Fischetti and P. Toth, "A polyhedral approach to
       the asymmetric traveling salesman problem", Management Science 43(11) (1997)
       1520-1536, doi:10.1287/mnsc.43.11.1520 (cut separation, reduced-cost fixing).
    .. [5] Q. Huangfu and J. A. J. Hall, "Parallelizing the dual revised simplex
       method", Mathematical Programming Computation 10 (2018) 119-142 (HiGHS).

    Examples
    --------
    >>> import numpy as np
    >>> c = np.array([[0, 5, 1], [1, 0, 9], [9, 2, 0]])
    >>> r = order_runs(c)          # from setup 0, ending anywhere
    >>> r.order.tolist(), r.total, r.proven_optimal
    ([2, 1], 3.0, True)
    """
    c, start, end, deadline = _check(changeover, start, end, time_limit)
    n = c.shape[0]
    if n == 1:
        return RunOrder(np.zeros(0, dtype=np.int64), 0.0, 0.0, True)
    tour_cost = c.copy()
    np.fill_diagonal(tour_cost, np.inf)
    if end is None:
        tour_cost[:, start] = 0.0
        tour_cost[start, start] = np.inf
    elif end != start:
        tour_cost[end, :] = np.inf
        tour_cost[end, start] = 0.0
    tour, total, lower, proven, status = _solve_tour(tour_cost, deadline)
    k = int(np.flatnonzero(tour == start)[0])
    order = np.roll(tour, -k)[1:].astype(np.int64)
    return RunOrder(order, float(total), float(min(lower, total)), proven, status)


def _check(changeover, start, end, time_limit):
    try:
        c = np.array(changeover, dtype=float)
    except (TypeError, ValueError) as exc:
        raise DispatchInputError(f"changeover must be numbers: {exc}") from None
    if c.ndim != 2 or c.shape[0] != c.shape[1]:
        raise DispatchInputError(f"changeover must be a square matrix, got shape {c.shape}")
    n = c.shape[0]
    if n == 0:
        raise DispatchInputError("changeover is empty: it needs at least the mounted setup")
    off = ~np.eye(n, dtype=bool)
    c[np.isnan(c)] = np.inf
    if np.any(c[off] < 0):
        i, j = np.argwhere((c < 0) & off)[0]
        raise DispatchInputError(f"changeover[{i}, {j}] is negative ({c[i, j]:g}): changes are >= 0")
    for name, value in (("start", start), ("end", end)):
        if value is None and name == "end":
            continue
        if isinstance(value, bool) or not isinstance(value, (int, np.integer)):
            raise DispatchInputError(f"{name} must be an index, got {value!r}")
        if not 0 <= value < n:
            raise DispatchInputError(f"{name}={value} is outside 0..{n - 1}")
    if time_limit is not None and not (isinstance(time_limit, (int, float)) and time_limit > 0):
        raise DispatchInputError(f"time_limit must be a positive number of seconds, got {time_limit!r}")
    deadline = None if time_limit is None else time.monotonic() + float(time_limit)
    return c, int(start), (None if end is None else int(end)), deadline


# --------------------------------------------------------------------------- tours

def _tour_cost(c: np.ndarray, tour: np.ndarray) -> float:
    return float(c[tour, np.roll(tour, -1)].sum())


def _cycles(succ: np.ndarray) -> list[np.ndarray]:
    """The cycles of a permutation given as successor array."""
    seen = np.zeros(succ.size, dtype=bool)
    out = []
    for s in range(succ.size):
        if seen[s]:
            continue
        cyc = []
        v = s
        while not seen[v]:
            seen[v] = True
            cyc.append(v)
            v = succ[v]
        out.append(np.array(cyc, dtype=np.int64))
    return out


def _patch(c: np.ndarray, succ: np.ndarray) -> np.ndarray | None:
    """Merge the cycles of ``succ`` into one tour by the cheapest two-arc exchanges.

    Karp's patching (1979): remove arc (i, succ i) of one cycle and (j, succ j) of
    another and add (i, succ j), (j, succ i). Returns the tour as a node sequence or
    None when no allowed exchange joins two cycles.
    """
    succ = succ.copy()
    n = succ.size
    while True:
        label = np.empty(n, dtype=np.int64)
        cycles = _cycles(succ)
        if len(cycles) == 1:
            break
        for k, cyc in enumerate(cycles):
            label[cyc] = k
        base = c[np.arange(n), succ]
        delta = c[:, succ] + c[:, succ].T - base[:, None] - base[None, :]
        # delta[i, j] = c[i, succ j] + c[j, succ i] - c[i, succ i] - c[j, succ j]
        delta[label[:, None] == label[None, :]] = np.inf
        i, j = np.unravel_index(np.argmin(delta), delta.shape)
        if not np.isfinite(delta[i, j]):
            return None
        succ[i], succ[j] = succ[j], succ[i]
    tour = np.empty(n, dtype=np.int64)
    v = 0
    for k in range(n):
        tour[k] = v
        v = succ[v]
    return tour


def _local_search(c: np.ndarray, tour: np.ndarray, deadline) -> np.ndarray:
    """Or-opt (segments of 1 to 3 moved, not reversed) and 2-opt until no move gains.

    Forbidden changes are priced with a large finite value so that differences stay
    finite; a move that would use one never gains.
    """
    n = tour.size
    if n < 4:
        return tour
    finite = c[np.isfinite(c)]
    big = (np.abs(finite).sum() + 1.0) * 4.0
    w = np.where(np.isfinite(c), c, big)
    tour = tour.copy()
    improved = True
    while improved:
        if deadline is not None and time.monotonic() > deadline:
            break
        improved = False
        # Or-opt
        for length in (1, 2, 3):
            if length >= n - 1:
                break
            i = 0
            while i < n:
                t = tour
                seg = np.arange(i, i + length) % n
                a, b = t[(i - 1) % n], t[(i + length) % n]
                f, g = t[seg[0]], t[seg[-1]]
                gain_remove = w[a, f] + w[g, b] - w[a, b]
                rest = np.roll(t, -((i + length) % n))[:n - length]
                # rest starts at b and ends at a; insertion between rest[p], rest[p+1]
                p_from, p_to = rest[:-1], rest[1:]
                ins = w[p_from, f] + w[g, p_to] - w[p_from, p_to]
                p = int(np.argmin(ins))
                if ins[p] < gain_remove - 1e-9 * max(1.0, abs(gain_remove)):
                    tour = np.concatenate([rest[:p + 1], t[seg], rest[p + 1:]])
                    improved = True
                i += 1
        # 2-opt: reverse tour[i+1 .. j]
        t = tour
        fwd = w[t, np.roll(t, -1)]          # fwd[k] = w[t_k, t_k+1]
        bwd = w[np.roll(t, -1), t]          # bwd[k] = w[t_k+1, t_k]
        cf = np.concatenate([[0.0], np.cumsum(fwd)])
        cb = np.concatenate([[0.0], np.cumsum(bwd)])
        best, move = 0.0, None
        for i in range(n - 2):
            j = np.arange(i + 2, n if i > 0 else n - 1)
            if j.size == 0:
                continue
            jn = (j + 1) % n
            old = fwd[i] + (cf[j] - cf[i + 1]) + fwd[j]
            new = w[t[i], t[j]] + (cb[j] - cb[i + 1]) + w[t[i + 1], t[jn]]
            d = new - old
            k = int(np.argmin(d))
            if d[k] < best - 1e-9 * max(1.0, abs(old[k])):
                best, move = d[k], (i, int(j[k]))
        if move is not None:
            i, j = move
            tour = np.concatenate([t[:i + 1], t[i + 1:j + 1][::-1], t[j + 1:]])
            improved = True
    return tour


def _assignment(c: np.ndarray):
    """Assignment relaxation: successor array and its cost (None when no cycle cover)."""
    finite = np.isfinite(c)
    if not finite.any(axis=1).all() or not finite.any(axis=0).all():
        return None, np.inf
    big = (np.abs(c[finite]).sum() + 1.0) * (c.shape[0] + 1)
    rows, cols = linear_sum_assignment(np.where(finite, c, big))
    if not finite[rows, cols].all():
        return None, np.inf
    return cols.astype(np.int64), float(c[rows, cols].sum())


# ------------------------------------------------------------------ branch and cut

class _Model:
    """The DFJ model over the allowed arcs, with the subtour cuts found so far."""

    def __init__(self, c: np.ndarray):
        n = c.shape[0]
        self.n = n
        tails, heads = np.nonzero(np.isfinite(c))
        self.tails, self.heads = tails, heads
        self.cost = c[tails, heads]
        m = tails.size
        arcs = np.arange(m)
        self.degree = coo_array(
            (np.ones(2 * m), (np.concatenate([tails, n + heads]), np.concatenate([arcs, arcs]))),
            shape=(2 * n, m)).tocsr()
        self.cuts: list[np.ndarray] = []      # node masks S: arcs inside S <= |S| - 1
        self.cut_keys: set[bytes] = set()
        self.pos = np.full((n, n), -1, dtype=np.int64)
        self.pos[tails, heads] = arcs
        self.integer = bool(np.all(self.cost == np.round(self.cost)))

    def add_cut(self, in_s: np.ndarray) -> bool:
        size = int(in_s.sum())
        if size < 1 or size >= self.n:
            return False
        if size > self.n // 2:               # the smaller side gives the sparser row
            in_s = ~in_s
        if int(in_s.sum()) < 2:
            return False
        key = np.packbits(in_s).tobytes()
        if key in self.cut_keys:
            return False
        self.cut_keys.add(key)
        self.cuts.append(in_s.copy())
        return True

    def cut_matrix(self, keep: np.ndarray):
        rows, cols = [], []
        t, h = self.tails[keep], self.heads[keep]
        for r, in_s in enumerate(self.cuts):
            idx = np.flatnonzero(in_s[t] & in_s[h])
            rows.append(np.full(idx.size, r))
            cols.append(idx)
        if not self.cuts:
            return None, None
        rows = np.concatenate(rows)
        cols = np.concatenate(cols)
        a = coo_array((np.ones(rows.size), (rows, cols)), shape=(len(self.cuts), int(keep.sum()))).tocsr()
        rhs = np.array([s.sum() - 1.0 for s in self.cuts])
        return a, rhs


def _separate(model: _Model, x: np.ndarray) -> int:
    """Add the subtour cuts violated by the LP point ``x``; returns how many were new."""
    n = model.n
    support = x > 1e-9
    t, h = model.tails[support], model.heads[support]
    graph = csr_array((x[support], (t, h)), shape=(n, n))
    k, labels = connected_components(graph, directed=True, connection="strong")
    added = 0
    if k > 1:
        for comp in range(k):
            added += model.add_cut(labels == comp)
        if added:
            return added
    cap = csr_array((np.floor(x[support] * _FLOW_SCALE).astype(np.int32), (t, h)), shape=(n, n))
    cap.sum_duplicates()
    dense_cap = cap.toarray()
    threshold = _FLOW_SCALE * (1.0 - _CUT_EPS)
    done = np.zeros(n, dtype=bool)
    for sink in range(1, n):
        if done[sink]:
            continue
        res = maximum_flow(cap, 0, sink)
        if res.flow_value >= threshold:
            continue
        residual = dense_cap - res.flow.toarray()
        reach = breadth_first_order(csr_array(residual > 0), 0, directed=True, return_predecessors=False)
        in_s = np.zeros(n, dtype=bool)
        in_s[reach] = True
        done[~in_s] = True               # these sinks are cut off by the same set
        added += model.add_cut(in_s)
    return added


def _lp(model: _Model, keep: np.ndarray, deadline):
    a_cut, rhs = model.cut_matrix(keep)
    kw = {}
    if deadline is not None:
        kw["options"] = {"time_limit": max(0.01, deadline - time.monotonic())}
    res = linprog(model.cost[keep], A_ub=a_cut, b_ub=rhs, A_eq=model.degree[:, np.flatnonzero(keep)],
                  b_eq=np.ones(2 * model.n), bounds=(0, None), method="highs", **kw)
    return res


def _reduced_costs(model: _Model, res) -> np.ndarray:
    """Reduced costs of every arc (kept or not) under the duals of an LP solution."""
    n = model.n
    y = res.eqlin.marginals
    d = model.cost - y[model.tails] - y[n + model.heads]
    if model.cuts:
        for in_s, y_s in zip(model.cuts, res.ineqlin.marginals):
            if y_s != 0.0:
                d -= y_s * (in_s[model.tails] & in_s[model.heads])
    return d


def _core(model: _Model, best: np.ndarray | None) -> np.ndarray:
    """Arcs the first linear relaxations use: a few cheapest per node and the best tour.

    The other arcs enter by pricing (their reduced cost under the LP duals), so the LP
    bound is the one of the whole model; without a tour to keep the core feasible every
    arc is in it.
    """
    m = model.cost.size
    if best is None or model.n <= 2 * _CORE_K:
        return np.ones(m, dtype=bool)
    keep = np.zeros(m, dtype=bool)
    n = model.n
    dense = np.full((n, n), np.inf)
    dense[model.tails, model.heads] = model.cost
    out_k = np.argsort(dense, axis=1, kind="stable")[:, :_CORE_K]
    in_k = np.argsort(dense, axis=0, kind="stable")[:_CORE_K, :]
    rows = np.concatenate([np.repeat(np.arange(n), _CORE_K), in_k.ravel(), best])
    cols = np.concatenate([out_k.ravel(), np.tile(np.arange(n), _CORE_K), np.roll(best, -1)])
    idx = model.pos[rows, cols]
    keep[idx[idx >= 0]] = True
    return keep


def _solve_tour(c: np.ndarray, deadline):
    """Exact ATSP on ``c`` (inf: not allowed): tour, total, lower bound, proven, status."""
    n = c.shape[0]
    if n == 2:
        total = c[0, 1] + c[1, 0]
        if not np.isfinite(total):
            raise RunOrderInfeasibleError("the two setups cannot change into each other")
        return np.array([0, 1]), total, total, True, "optimal"
    succ, ap_bound = _assignment(c)
    if succ is None:
        raise RunOrderInfeasibleError("the allowed changeovers admit no run order "
                                      "(not even a cover by cycles: assignment relaxation)")
    best = _patch(c, succ)
    if best is not None:
        best = _local_search(c, best, deadline)
    best_cost = np.inf if best is None else _tour_cost(c, best)
    lower = ap_bound
    model = _Model(c)
    tol = 0.5 if model.integer else REL_TOLERANCE

    def closed(lb, ub):
        if not np.isfinite(ub):
            return False
        if model.integer:
            return math.ceil(lb - 1e-6) >= ub
        return ub - lb <= tol * max(1.0, abs(ub))

    def margin(ub):
        return 0.5 if model.integer else tol * max(1.0, abs(ub))

    def out_of_time():
        return deadline is not None and time.monotonic() > deadline

    if closed(lower, best_cost):
        return best, best_cost, best_cost, True, "optimal"
    # 2. cut loop on the linear relaxation
    keep = _core(model, best)
    lp_bound, reduced = lower, None
    for _ in range(_MAX_CUT_ROUNDS):
        if out_of_time():
            return _finish(best, best_cost, lower)
        res = _lp(model, keep, deadline)
        if res.status == 2 and not keep.all():
            keep[:] = True
            continue
        if res.status == 2:
            raise RunOrderInfeasibleError("the allowed changeovers admit no run order (linear relaxation)")
        if res.status != 0:
            return _finish(best, best_cost, lower)
        d = _reduced_costs(model, res)
        priced = np.flatnonzero(~keep & (d < -1e-9 * max(1.0, abs(res.fun))))
        if priced.size:                      # arcs that would improve the LP: add, re-solve
            keep[priced[np.argsort(d[priced])[:max(model.n, 50)]]] = True
            continue
        lp_bound = res.fun
        lower = max(lower, lp_bound)
        reduced = d
        x = np.zeros(model.cost.size)
        x[keep] = res.x
        if closed(lower, best_cost) or _separate(model, x) == 0:
            break
    if closed(lower, best_cost):
        return best, best_cost, best_cost, True, "optimal"
    # 3. reduced-cost fixing against the best tour, then integer solves with cuts
    if np.isfinite(best_cost) and reduced is not None:
        keep = lp_bound + reduced <= best_cost - margin(best_cost) + 1e-9
    while True:
        if out_of_time():
            return _finish(best, best_cost, lower)
        a_cut, rhs = model.cut_matrix(keep)
        cost = model.cost[keep]
        constraints = [LinearConstraint(model.degree[:, np.flatnonzero(keep)], 1, 1)]
        if a_cut is not None:
            constraints.append(LinearConstraint(a_cut, -np.inf, rhs))
        if np.isfinite(best_cost):
            constraints.append(LinearConstraint(cost[None, :], -np.inf, best_cost - margin(best_cost)))
        options = {"mip_rel_gap": 0.0 if model.integer else REL_TOLERANCE / 10}
        if deadline is not None:
            options["time_limit"] = max(0.01, deadline - time.monotonic())
        res = milp(cost, integrality=np.ones(cost.size), bounds=Bounds(0, 1),
                   constraints=constraints, options=options)
        if res.status == 2:                  # nothing cheaper than the best tour
            if best is None:
                raise RunOrderInfeasibleError("the allowed changeovers admit no run order (integer program)")
            return best, best_cost, best_cost, True, "optimal"
        if res.x is None:                    # time limit without an integer point
            bound = getattr(res, "mip_dual_bound", None)
            if bound is not None and np.isfinite(bound):
                lower = max(lower, min(bound, best_cost))
            return _finish(best, best_cost, lower)
        x = np.round(res.x).astype(bool)
        succ = np.empty(n, dtype=np.int64)
        succ[model.tails[keep][x]] = model.heads[keep][x]
        cycles = _cycles(succ)
        if len(cycles) == 1:
            tour = _patch(c, succ)
            cost_now = _tour_cost(c, tour)
            if res.status == 0:
                return tour, cost_now, cost_now, True, "optimal"
            bound = getattr(res, "mip_dual_bound", None)
            if bound is not None and np.isfinite(bound):
                lower = max(lower, bound)
            if cost_now < best_cost:
                best, best_cost = tour, cost_now
            return _finish(best, best_cost, lower)
        if res.status == 0:
            lower = max(lower, min(res.fun, best_cost))
        for cyc in cycles:
            mask = np.zeros(n, dtype=bool)
            mask[cyc] = True
            model.add_cut(mask)
        tour = _patch(c, succ)
        if tour is not None:
            tour = _local_search(c, tour, deadline)
            cost_now = _tour_cost(c, tour)
            if cost_now < best_cost:
                best, best_cost = tour, cost_now
                keep = keep & (lp_bound + reduced <= best_cost - margin(best_cost) + 1e-9) \
                    if reduced is not None else keep
        if closed(lower, best_cost):
            return best, best_cost, best_cost, True, "optimal"


def _finish(best, best_cost, lower):
    if best is None:
        raise RunOrderInfeasibleError("no run order found within the time limit")
    return best, best_cost, min(lower, best_cost), False, "time_limit"
