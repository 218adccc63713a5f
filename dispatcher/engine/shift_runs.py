"""Whole-shift plans with changeovers: which jobs run on which machine, and in what order.

The problem (what the tests check a plan against):

* ``changeover[k]`` is an ``(n + 1) x (n + 1)`` array for machine ``k``: index 0 is the
  setup mounted on it now, index ``i + 1`` job ``i``; entry ``[a, b]`` is the change from
  ``a``'s setup to ``b``'s (NaN or inf: not allowed). ``end_change[k, a]`` is the change
  from ``a`` into the family the machine must end the shift in (``a = 0``: nothing ran;
  NaN: not allowed), or 0 when the machine may end anywhere;
* a plan gives each machine a run order of distinct jobs (each job on at most one
  machine, only where ``hours[i, k]`` is finite); its total is the sum of every change
  along each order (from the mounted setup, into the end family) plus the wait penalty
  of every job that does not run;
* on each machine, run hours plus ``changeover_hours`` x the changes (1/60 when the
  changes are minutes, 0 when they are a cost) fit within ``capacity[k]``;
* must-run jobs always run; with ``most_jobs_first`` (the default, as in
  :func:`dispatcher.engine.fill_shift`) the plan runs as many jobs as fit, and among
  those has the least total.

Two methods, chosen by size: an exact mixed-integer program (Dantzig-Fulkerson-Johnson
style arcs per machine, generalised subtour cuts separated on the LP relaxation with
maximum flows, then HiGHS with cuts added on integer solutions) for small shops, and a
construction (cheapest insertion) plus local search (moving jobs between machines,
every machine's order made exact by :func:`dispatcher.engine.order_runs`) for large
ones. Both report a proven lower bound, the best of: the assignment relaxation (every job
pays at least the cheapest change into it from a distinct predecessor, or its wait
penalty), solved and certified by :func:`dispatcher.engine.solve`; a linear relaxation
that keeps the hours and charges each machine at least one change into every family it
runs (Potts and Kovalyov 2000: a family setup per batch); and, from the exact method, the
integer program's bound.
"""

from __future__ import annotations

import itertools
import math
import time
from dataclasses import dataclass

import numpy as np
from scipy.optimize import Bounds, LinearConstraint, milp
from scipy.sparse import coo_array, csr_array
from scipy.sparse.csgraph import breadth_first_order, maximum_flow

from .assignment import DispatchInputError, InfeasibleError, solve
from .order_runs import RunOrderInfeasibleError, order_runs

__all__ = ["EXACT_MAX_ARCS", "ShiftRuns", "plan_shift_runs"]

#: The exact method is used when the arc model has at most this many arcs.
EXACT_MAX_ARCS = 6000
_SCALE = 1_000_000


@dataclass(frozen=True)
class ShiftRuns:
    """A whole-shift plan with run orders.

    ``orders[k]`` lists machine ``k``'s jobs in run order; ``machine_of_job[i]`` is the
    machine of job ``i`` or -1 (waits). ``total = changeovers + penalties``.
    ``lower_bound`` is proven: no plan has a smaller total. ``proven_optimal`` says the
    plan is the best one under the rules (``most_jobs_first`` included); ``gap`` is
    ``(total - lower_bound) / max(1, |total|)``; ``method`` is ``"exact"`` or ``"search"``.
    """

    orders: list[list[int]]
    machine_of_job: np.ndarray
    total: float
    changeovers: float
    penalties: float
    lower_bound: float
    proven_optimal: bool
    gap: float
    method: str
    status: str

    @property
    def placed(self) -> int:
        return int((self.machine_of_job >= 0).sum())


def plan_shift_runs(changeover, hours, capacity, *, end_change=None, wait_penalty=None,
                    must_run=None, changeover_hours: float = 0.0, most_jobs_first: bool = True,
                    time_limit: float | None = 10.0, method: str = "auto") -> ShiftRuns:
    """Best whole-shift plan with changeovers priced in run order (see the module text).

    Parameters
    ----------
    changeover : (m, n + 1, n + 1) array_like
        Per machine, the changes between the mounted setup (index 0) and the jobs.
    hours : (n, m) array_like
        Run hours of each job on each machine; NaN: the machine cannot run the job.
    capacity : (m,) array_like
        Hours each machine has in the shift.
    end_change : (m, n + 1) array_like, optional
        Change into each machine's end family from the mounted setup (0) or a job.
    wait_penalty : (n,) array_like, optional
        Counted when the job waits.
    must_run : boolean mask or indices, optional
        Jobs that must run.
    changeover_hours : float
        Machine hours per unit of change (1/60 for minutes; 0 for a cost).
    most_jobs_first : bool
        Run as many jobs as fit first, then least total.
    time_limit : float or None
        Seconds (default 10); the best plan found is returned with its proven bound.
    method : {"auto", "exact", "search"}

    Returns
    -------
    ShiftRuns

    Raises
    ------
    DispatchInputError
        Shapes or numbers that do not describe the problem.
    RunOrderInfeasibleError
        Must-run jobs cannot all run (none of the plans found runs them all).

    References
    ----------
    .. [1] G. Dantzig, R. Fulkerson and S. Johnson, Operations Research 2(4) (1954)
       393-410, doi:10.1287/opre.2.4.393 (subtour elimination).
    .. [2] M. Fischetti, J. J. Salazar Gonzalez and P. Toth, "A branch-and-cut algorithm
       for the symmetric generalized traveling salesman problem", Operations Research
       45(3) (1997) 378-394, doi:10.1287/opre.45.3.378 (generalised subtour cuts with
       node variables, separated by maximum flows).
    .. [3] D. J. Rosenkrantz, R. E. Stearns and P. M. Lewis, "An analysis of several
       heuristics for the traveling salesman problem", SIAM J. Computing 6(3) (1977)
       563-581, doi:10.1137/0206041 (cheapest insertion).
    .. [4] H. W. Kuhn, Naval Research Logistics Quarterly 2 (1955) 83-97 (the assignment
       relaxation; solved by :func:`dispatcher.engine.solve`).
    .. [5] C. N. Potts and M. Y. Kovalyov, "Scheduling with batching: a review", European
       Journal of Operational Research 120(2) (2000) 228-249,
       doi:10.1016/S0377-2217(99)00153-8 (at least one family setup per batch: the
       family-block relaxation of the bound).
    """
    p = _check(changeover, hours, capacity, end_change, wait_penalty, must_run, changeover_hours,
               time_limit, method, most_jobs_first)
    deadline = None if time_limit is None else time.monotonic() + float(time_limit)
    lower = max(_assignment_bound(p), _capacity_bound(p))
    n_arcs = sum(int(np.isfinite(p.c[k][np.ix_(p.nodes[k], p.nodes[k])]).sum()) for k in range(p.m))
    use_exact = method == "exact" or (method == "auto" and n_arcs <= EXACT_MAX_ARCS)
    best = _search(p, deadline if not use_exact else _split(deadline, 0.2))
    if use_exact:
        exact = _exact(p, deadline, best, lower)
        if exact is not None:
            return exact
    if best is None:
        raise RunOrderInfeasibleError("no plan found that runs every must-run job within the hours")
    return _result(p, best, lower, False, "search", "time_limit" if use_exact else "search")


# --------------------------------------------------------------------------- problem

@dataclass
class _Problem:
    n: int
    m: int
    c: np.ndarray             # (m, n+1, n+1), inf = not allowed, diagonal inf except [0, 0]
    end: np.ndarray           # (m, n+1)
    hours: np.ndarray         # (n, m), inf = cannot run
    cap: np.ndarray
    pen: np.ndarray
    must: np.ndarray
    tau: float
    most: bool
    nodes: list[np.ndarray]   # per machine: node indices 0 and 1 + allowed jobs
    weight: float             # per placed job when most_jobs_first


def _split(deadline, share):
    if deadline is None:
        return None
    return time.monotonic() + share * max(0.0, deadline - time.monotonic())


def _check(changeover, hours, capacity, end_change, wait_penalty, must_run, tau, time_limit, method,
           most_jobs_first):
    try:
        c = np.array(changeover, dtype=float)
        h = np.array(hours, dtype=float)
        cap = np.array(capacity, dtype=float).reshape(-1)
    except (TypeError, ValueError) as exc:
        raise DispatchInputError(f"changeover, hours and capacity must be numbers: {exc}") from None
    if h.ndim != 2:
        raise DispatchInputError(f"hours must be a jobs x machines array, got shape {h.shape}")
    n, m = h.shape
    if c.shape != (m, n + 1, n + 1):
        raise DispatchInputError(f"changeover must have shape ({m}, {n + 1}, {n + 1}) "
                                 f"(machines, 1 + jobs, 1 + jobs), got {c.shape}")
    if cap.shape != (m,) or np.any(~np.isfinite(cap)) or np.any(cap < 0):
        raise DispatchInputError(f"capacity needs {m} numbers >= 0")
    c[np.isnan(c)] = np.inf
    if np.any(c < 0):
        raise DispatchInputError("changeovers must be >= 0")
    h[np.isnan(h)] = np.inf
    if np.any(h < 0):
        raise DispatchInputError("hours must be >= 0")
    if end_change is None:
        end = np.zeros((m, n + 1))
    else:
        end = np.array(end_change, dtype=float)
        if end.shape != (m, n + 1):
            raise DispatchInputError(f"end_change must have shape ({m}, {n + 1}), got {end.shape}")
        end[np.isnan(end)] = np.inf
        if np.any(end < 0):
            raise DispatchInputError("end changes must be >= 0")
    pen = np.zeros(n) if wait_penalty is None else np.array(wait_penalty, dtype=float).reshape(-1)
    if pen.shape != (n,) or np.any(~np.isfinite(pen)) or np.any(pen < 0):
        raise DispatchInputError(f"wait_penalty needs {n} numbers >= 0")
    must = np.zeros(n, dtype=bool)
    if must_run is not None:
        arr = np.asarray(must_run)
        if arr.dtype == bool:
            if arr.shape != (n,):
                raise DispatchInputError(f"must_run mask needs {n} entries")
            must = arr.copy()
        elif arr.size:
            idx = arr.astype(np.int64).reshape(-1)
            if idx.min() < 0 or idx.max() >= n:
                raise DispatchInputError(f"must_run names a job outside 0..{n - 1}")
            must[idx] = True
    if not (isinstance(tau, (int, float)) and math.isfinite(tau) and tau >= 0):
        raise DispatchInputError(f"changeover_hours must be a number >= 0, got {tau!r}")
    if time_limit is not None and not (isinstance(time_limit, (int, float)) and time_limit > 0):
        raise DispatchInputError(f"time_limit must be a positive number of seconds, got {time_limit!r}")
    if method not in ("auto", "exact", "search"):
        raise DispatchInputError(f"method must be auto, exact or search, got {method!r}")
    for k in range(m):
        np.fill_diagonal(c[k], np.inf)
    nodes = [np.concatenate([[0], 1 + np.flatnonzero(np.isfinite(h[:, k]) & (h[:, k] <= cap[k]))])
             for k in range(m)]
    # more than any plan's total: the dearest change into each job, the dearest end per
    # machine, every penalty (so one more job run always outweighs any total)
    into = np.where(np.isfinite(c), c, -np.inf).max(axis=(0, 1))[1:]
    ends = np.where(np.isfinite(end), end, -np.inf).max(axis=1)
    scale = (float(np.maximum(into, 0).sum()) + float(np.maximum(ends, 0).sum())
             + float(pen.sum()) + 1.0)
    return _Problem(n, m, c, end, h, cap, pen, must, float(tau), bool(most_jobs_first), nodes, scale)


# ------------------------------------------------------------------------ evaluation

def _route_cost(p: _Problem, k: int, order: list[int]) -> float:
    seq = [0] + [i + 1 for i in order]
    cost = sum(p.c[k, a, b] for a, b in itertools.pairwise(seq)) + p.end[k, seq[-1]]
    return float(cost)


def _route_hours(p: _Problem, k: int, order: list[int], cost: float | None = None) -> float:
    if cost is None:
        cost = _route_cost(p, k, order)
    return float(sum(p.hours[i, k] for i in order) + p.tau * cost)


def _objective(p: _Problem, orders: list[list[int]]) -> tuple[int, float]:
    placed = sum(len(o) for o in orders)
    placed_mask = np.zeros(p.n, dtype=bool)
    for o in orders:
        placed_mask[o] = True
    total = sum(_route_cost(p, k, o) for k, o in enumerate(orders)) + float(p.pen[~placed_mask].sum())
    return placed, total


def _better(a: tuple[int, float], b: tuple[int, float] | None, most: bool) -> bool:
    if b is None:
        return True
    if most and a[0] != b[0]:
        return a[0] > b[0]
    return a[1] < b[1] - 1e-9 * max(1.0, abs(b[1]))


def _feasible(p: _Problem, orders: list[list[int]]) -> bool:
    placed = np.zeros(p.n, dtype=bool)
    for k, o in enumerate(orders):
        if len(set(o)) != len(o) or placed[o].any():
            return False
        placed[o] = True
        cost = _route_cost(p, k, o)
        if not math.isfinite(cost) or _route_hours(p, k, o, cost) > p.cap[k] + 1e-9:
            return False
    return bool(placed[p.must].all())


def _result(p: _Problem, orders, lower: float, proven: bool, method: str, status: str) -> ShiftRuns:
    machine_of_job = np.full(p.n, -1, dtype=np.int64)
    for k, o in enumerate(orders):
        machine_of_job[o] = k
    _placed, total = _objective(p, orders)
    changes = sum(_route_cost(p, k, o) for k, o in enumerate(orders))
    lower = total if proven else min(lower, total)
    gap = 0.0 if proven else (total - lower) / max(1.0, abs(total))
    return ShiftRuns([list(map(int, o)) for o in orders], machine_of_job, float(total), float(changes),
                     float(total - changes), float(lower), proven, float(gap), method, status)


# ------------------------------------------------------------------ lower bound

def _assignment_bound(p: _Problem) -> float:
    """Every job either waits (its penalty) or pays the change into it from a distinct
    predecessor: one of the machines' mounted setups or another job (each used once);
    capacities dropped. Solved by the certified engine; plus each machine's cheapest end.
    A relaxation of every plan, so a lower bound whatever ``most_jobs_first`` says.
    """
    n, m = p.n, p.m
    if n == 0:
        return float(sum(p.end[k, 0] for k in range(m)))
    cost = np.full((n, m + n + n), np.inf)
    for k in range(m):
        ok = np.isfinite(p.hours[:, k])
        cost[ok, k] = np.minimum(cost[ok, k], p.c[k, 0, 1:][ok])
        into = p.c[k, 1:, 1:]                       # [a, i]: from job a into job i
        both = ok[:, None] & ok[None, :]
        cost[:, m:m + n] = np.minimum(cost[:, m:m + n], np.where(both, into, np.inf).T)
    for i in range(n):
        if not p.must[i]:
            cost[i, m + n + i] = p.pen[i]
    allowed = np.isfinite(cost)
    try:
        result = solve(np.where(allowed, cost, 0.0), allowed, must_run=p.must)
    except InfeasibleError:
        return math.inf     # must-run jobs cannot all run even in the relaxation
    result.verify()
    end_min = sum(float(np.min(p.end[k])) for k in range(m))
    return float(result.total) + end_min


def _setup_groups(p: _Problem, k: int, lo: np.ndarray) -> list[tuple[list[int], float]]:
    """Jobs of machine ``k`` grouped by their setup, each group with its block price.

    Two jobs are grouped when the change from the mounted setup into them, the change out
    of them into the end family and the multiset of changes into them from the other
    jobs agree (what jobs of one family share). The price of a group is the cheapest
    change into one of its jobs from outside the group (the mounted setup or a job of
    another group that may run on ``k``) less the dearest of its jobs' cheapest changes
    in, when positive. Any grouping keeps the bound valid; this one finds the families.
    """
    allowed = np.zeros(p.n + 1, dtype=bool)
    allowed[p.nodes[k]] = True
    groups: dict[tuple, list[int]] = {}
    for node in p.nodes[k][1:]:
        i = int(node) - 1
        col = p.c[k, 1:, i + 1][allowed[1:]]
        key = (float(p.c[k, 0, i + 1]), float(p.end[k, i + 1]), tuple(np.sort(col[np.isfinite(col)])))
        groups.setdefault(key, []).append(i)
    out = []
    for members in groups.values():
        inside = np.zeros(p.n + 1, dtype=bool)
        inside[np.array(members) + 1] = True
        into = p.c[k][np.ix_(allowed & ~inside, np.array(members) + 1)]
        entry = float(np.min(into)) if into.size else math.inf
        price = entry - float(np.max(lo[members]))
        if math.isfinite(price) and price > 1e-9:
            out.append((members, price))
    return out


def _capacity_bound(p: _Problem) -> float:
    """The linear relaxation that keeps the hours and the setup blocks.

    A job run on machine ``k`` pays at least its cheapest change in from a node that may
    run on ``k`` (and that change's hours), a job that waits its penalty; each machine its
    cheapest end. On top, for every group of jobs sharing a setup (a family, see
    :func:`_setup_groups`), the machine changes into the group at least once when it runs
    any of its jobs: the first job of every block of consecutive jobs of one group comes
    from outside the group, so it pays the group's cheapest change in from outside. With
    ``y[k, g] >= x[i, k]`` for every job ``i`` of group ``g`` this adds ``y[k, g]`` times
    the group's price (and its hours) to the relaxation. Every plan is a solution of the
    linear program, so its optimum is a lower bound, whatever the triangle inequality.

    References
    ----------
    .. [1] C. N. Potts and M. Y. Kovalyov, "Scheduling with batching: a review", European
       Journal of Operational Research 120(2) (2000) 228-249,
       doi:10.1016/S0377-2217(99)00153-8 (a family setup is paid at least once per batch).
    .. [2] G. Cornuejols, G. L. Nemhauser and L. A. Wolsey, "The uncapacitated facility
       location problem", in Discrete Location Theory, Wiley (1990) 119-171 (the
       disaggregated linking ``y >= x`` that makes such a relaxation strong).
    """
    n, m = p.n, p.m
    if n == 0:
        return float(sum(p.end[k, 0] for k in range(m)))
    lo = np.full((n, m), np.inf)                            # cheapest change into i on k
    for k in range(m):
        lo[:, k] = np.min(p.c[k][p.nodes[k]][:, 1:], axis=0)
    ok = np.isfinite(lo) & np.isfinite(p.hours)
    ii, kk = np.nonzero(ok)
    if ii.size == 0:
        return math.inf if p.must.any() else float(p.pen.sum())
    nx = ii.size
    column = {(int(i), int(k)): j for j, (i, k) in enumerate(zip(ii, kk))}
    blocks = [(k, [i for i in members if (i, k) in column], price)
              for k in range(m) for members, price in _setup_groups(p, k, lo[:, k])]
    blocks = [b for b in blocks if b[1]]
    ny = len(blocks)
    cap_rows = list(kk) + [k for k, _, _ in blocks]
    cap_vals = list(p.hours[ii, kk] + p.tau * lo[ii, kk]) + [p.tau * price for _, _, price in blocks]
    a_cap = coo_array((cap_vals, (cap_rows, np.arange(nx + ny))), shape=(m, nx + ny))
    a_job = coo_array((np.ones(nx), (ii, np.arange(nx))), shape=(n, nx + ny))
    constraints = [LinearConstraint(a_cap, -np.inf, p.cap),
                   LinearConstraint(a_job, p.must.astype(float), 1.0)]
    rows, cols, vals, r = [], [], [], 0
    for y, (k, members, _price) in enumerate(blocks):
        for i in members:
            rows += [r, r]
            cols += [column[(i, k)], nx + y]
            vals += [1.0, -1.0]
            r += 1
    if r:
        constraints.append(LinearConstraint(coo_array((vals, (rows, cols)), shape=(r, nx + ny)), -np.inf, 0.0))
    cost = np.concatenate([lo[ii, kk] - p.pen[ii], [price for _, _, price in blocks]])
    res = milp(cost, integrality=np.zeros(nx + ny), bounds=Bounds(0, 1), constraints=constraints)
    if res.status == 2:
        return math.inf
    if res.x is None:
        return -math.inf
    ends = sum(float(np.min(p.end[k])) for k in range(m))
    # the LP optimum minus a small tolerance for the solver's own accuracy
    return float(res.fun + p.pen.sum()) + ends - 1e-7 * max(1.0, abs(res.fun))


# ------------------------------------------------------------------------ search

def _insertion(p: _Problem, k: int, order: list[int], used: float, i: int):
    """Cheapest place for job ``i`` in machine ``k``'s order within its hours:
    ``(delta, position)`` or None."""
    seq = [0] + [j + 1 for j in order]
    best = None
    for pos in range(len(seq)):
        a = seq[pos]
        if pos + 1 < len(seq):
            b = seq[pos + 1]
            delta = p.c[k, a, i + 1] + p.c[k, i + 1, b] - p.c[k, a, b]
        else:
            delta = p.c[k, a, i + 1] + p.end[k, i + 1] - p.end[k, a]
        if not math.isfinite(delta) or used + p.hours[i, k] + p.tau * delta > p.cap[k] + 1e-9:
            continue
        if best is None or delta < best[0]:
            best = (float(delta), pos)
    return best


def _removal(p: _Problem, k: int, order: list[int], pos: int) -> float:
    """Change of machine ``k``'s cost when the job at ``pos`` leaves (inf: not allowed)."""
    seq = [0] + [j + 1 for j in order]
    a, v = seq[pos], seq[pos + 1]
    if pos + 2 < len(seq):
        b = seq[pos + 2]
        return float(p.c[k, a, b] - p.c[k, a, v] - p.c[k, v, b])
    return float(p.end[k, a] - p.c[k, a, v] - p.end[k, v])


def _search(p: _Problem, deadline) -> list[list[int]] | None:
    """Cheapest insertion (must-run jobs first), then moves of single jobs between
    machines (and in or out of waiting) priced by insertion, with every changed
    machine's order made exact by :func:`order_runs`, until no move helps."""
    orders: list[list[int]] = [[] for _ in range(p.m)]
    used = [p.tau * float(p.end[k, 0]) if math.isfinite(p.end[k, 0]) else 0.0 for k in range(p.m)]
    where = np.full(p.n, -1, dtype=np.int64)
    value = p.pen + (p.weight if p.most else 0.0)          # what running a job is worth
    cache: dict[tuple[int, int], object] = {}

    def insertion(i, k):
        key = (i, k)
        if key not in cache:
            cache[key] = (_insertion(p, k, orders[k], used[k], i)
                          if math.isfinite(p.hours[i, k]) else None)
        return cache[key]

    def place(i, k, pos, delta):
        orders[k].insert(pos, i)
        used[k] += p.hours[i, k] + p.tau * delta
        where[i] = k
        for key in [key for key in cache if key[1] == k]:
            del cache[key]

    def out_of_time():
        return deadline is not None and time.monotonic() > deadline

    for phase in ("must", "rest"):
        while not (phase == "rest" and out_of_time()):
            choice = None
            for i in np.flatnonzero((where < 0) & (p.must if phase == "must" else True)):
                for k in range(p.m):
                    ins = insertion(int(i), k)
                    if ins is not None:
                        gain = ins[0] - value[i]
                        # most jobs first: the insertion using the fewest machine hours
                        # (relative to the machine's hours left) comes first
                        spend = ((p.hours[i, k] + p.tau * ins[0]) / max(1e-9, p.cap[k] - used[k] + 1e-9)
                                 if p.most else 0.0)
                        key = (spend, gain)
                        if choice is None or key < choice[0]:
                            choice = (key, int(i), k, ins[1], ins[0])
            if choice is None or (phase == "rest" and choice[0][1] >= 0):
                break
            place(choice[1], choice[2], choice[3], choice[4])
    if (where[p.must] < 0).any():
        return None

    def reorder(k):
        orders[k] = _exact_order(p, k, orders[k], deadline)
        cost = _route_cost(p, k, orders[k])
        used[k] = _route_hours(p, k, orders[k], cost)
        for key in [key for key in cache if key[1] == k]:
            del cache[key]

    for k in range(p.m):
        reorder(k)
    improved = True
    while improved and not out_of_time():
        improved = False
        changed = set()
        for i in range(p.n):
            if out_of_time():
                break
            src = int(where[i])
            saving = 0.0
            if src >= 0:
                pos = orders[src].index(i)
                saving = _removal(p, src, orders[src], pos)      # <= 0 usually
            best = None
            for k in range(p.m):
                if k == src:
                    continue
                ins = insertion(i, k)
                if ins is None:
                    continue
                delta = ins[0] + saving if src >= 0 else ins[0] - value[i]
                if best is None or delta < best[0]:
                    best = (delta, k, ins)
            if src >= 0 and not p.must[i]:
                leave = saving + value[i]                      # let it wait instead
                if leave < -1e-9 and (best is None or leave < best[0]):
                    best = (leave, -1, None)
            if best is None or best[0] >= -1e-9:
                continue
            if src >= 0:
                orders[src].remove(i)
                where[i] = -1
                used[src] = _route_hours(p, src, orders[src])
                for key in [key for key in cache if key[1] == src]:
                    del cache[key]
                changed.add(src)
            if best[1] >= 0:
                place(i, best[1], best[2][1], best[2][0])
                changed.add(best[1])
            improved = True
        for k in changed:
            reorder(k)
    return orders


def _exact_order(p: _Problem, k: int, jobs: list[int], deadline) -> list[int]:
    """The machine's jobs in their best order (by :func:`order_runs`; the input order when
    no order is allowed or time is short)."""
    if len(jobs) < 2:
        return list(jobs)
    idx = [0] + [i + 1 for i in jobs]
    sub = p.c[k][np.ix_(idx, idx)]
    size = len(idx)
    mat = np.full((size + 1, size + 1), np.inf)
    mat[:size, :size] = sub
    mat[:size, size] = p.end[k, idx]
    limit = None if deadline is None else max(0.05, deadline - time.monotonic())
    try:
        r = order_runs(mat, start=0, end=size, time_limit=limit)
    except RunOrderInfeasibleError:
        return list(jobs)
    new = [jobs[v - 1] for v in r.order if v != size]
    return new if _route_cost(p, k, new) <= _route_cost(p, k, jobs) else list(jobs)


# ------------------------------------------------------------------------ exact

def _exact(p: _Problem, deadline, incumbent, lower: float) -> ShiftRuns | None:
    """Arc model per machine; generalised subtour cuts on the LP, then HiGHS with cuts on
    integer solutions. Returns None when time ran out before anything better was proven."""
    var_x, var_arc = [], []           # (i, k) and (k, a, b)
    cost_x, cost = [], []
    for k in range(p.m):
        nodes = p.nodes[k]
        for i in nodes[1:]:
            var_x.append((i - 1, k))
            cost_x.append(-(p.pen[i - 1] + (p.weight if p.most else 0.0)))
        for a in nodes:
            for b in nodes:
                if a == b and a != 0:
                    continue
                v = p.end[k, a] if b == 0 else p.c[k, a, b]
                if a == 0 and b == 0:
                    v = p.end[k, 0]
                if math.isfinite(v):
                    var_arc.append((k, int(a), int(b)))
                    cost.append(v)
    nx, na = len(var_x), len(var_arc)
    nv = nx + na
    cost = np.array(cost_x + cost, dtype=float)
    xpos = {key: t for t, key in enumerate(var_x)}
    rows, cols, vals, lo, hi = [], [], [], [], []
    r = 0

    def row(entries, low, high):
        nonlocal r
        for col, val in entries:
            rows.append(r)
            cols.append(col)
            vals.append(val)
        lo.append(low)
        hi.append(high)
        r += 1

    out_of = {}
    into = {}
    for t, (k, a, b) in enumerate(var_arc):
        out_of.setdefault((k, a), []).append(nx + t)
        into.setdefault((k, b), []).append(nx + t)
    for k in range(p.m):
        row([(c, 1.0) for c in out_of.get((k, 0), [])], 1, 1)
        row([(c, 1.0) for c in into.get((k, 0), [])], 1, 1)
        for i in p.nodes[k][1:]:
            x = xpos[(i - 1, k)]
            row([(c, 1.0) for c in into.get((k, int(i)), [])] + [(x, -1.0)], 0, 0)
            row([(c, 1.0) for c in out_of.get((k, int(i)), [])] + [(x, -1.0)], 0, 0)
        cap_entries = [(xpos[(i - 1, k)], p.hours[i - 1, k]) for i in p.nodes[k][1:]]
        if p.tau:
            cap_entries += [(nx + t, p.tau * cost[nx + t]) for t, (kk, _a, _b) in enumerate(var_arc) if kk == k]
        row(cap_entries, -np.inf, p.cap[k])
    for i in range(p.n):
        entries = [(xpos[(i, k)], 1.0) for k in range(p.m) if (i, k) in xpos]
        if entries:
            row(entries, 1.0 if p.must[i] else 0.0, 1.0)
        elif p.must[i]:
            raise RunOrderInfeasibleError(f"must-run job {i} fits on no machine")
    base = coo_array((vals, (rows, cols)), shape=(r, nv)).tocsr()
    base_lo, base_hi = np.array(lo), np.array(hi)
    cuts: list[tuple[int, np.ndarray, int]] = []   # (machine, node mask S, job node j)
    seen: set[bytes] = set()
    arc_k = np.array([k for k, _a, _b in var_arc])
    arc_a = np.array([a for _k, a, _b in var_arc])
    arc_b = np.array([b for _k, _a, b in var_arc])

    def cut_rows():
        if not cuts:
            return None
        rr, cc, vv = [], [], []
        for q, (k, in_s, j) in enumerate(cuts):
            sel = np.flatnonzero((arc_k == k) & ~in_s[arc_a] & in_s[arc_b])
            rr += [q] * (sel.size + 1)
            cc += list(nx + sel) + [xpos[(j - 1, k)]]
            vv += [1.0] * sel.size + [-1.0]
        return LinearConstraint(coo_array((vv, (rr, cc)), shape=(len(cuts), nv)).tocsr(), 0, np.inf)

    def add_cut(k, in_s, j) -> bool:
        key = bytes([k % 256, (k >> 8) % 256]) + np.packbits(in_s).tobytes() + int(j).to_bytes(4, "little")
        if key in seen:
            return False
        seen.add(key)
        cuts.append((k, in_s.copy(), int(j)))
        return True

    def separate(xv) -> int:
        added = 0
        for k in range(p.m):
            sel = np.flatnonzero((arc_k == k) & (xv[nx:] > 1e-9) & (arc_b != 0) & (arc_a != arc_b))
            size = p.n + 1
            capm = csr_array((np.floor(xv[nx + sel] * _SCALE).astype(np.int32),
                              (arc_a[sel], arc_b[sel])), shape=(size, size))
            capm.sum_duplicates()
            dense = capm.toarray()
            for i in p.nodes[k][1:]:
                need = xv[xpos[(i - 1, k)]]
                if need < 1e-4:
                    continue
                res = maximum_flow(capm, 0, int(i))
                if res.flow_value >= _SCALE * (need - 1e-4):
                    continue
                reach = breadth_first_order(csr_array((dense - res.flow.toarray()) > 0), 0,
                                            directed=True, return_predecessors=False)
                in_s = np.ones(size, dtype=bool)
                in_s[reach] = False
                added += add_cut(k, in_s, int(i))
        return added

    def left():
        return None if deadline is None else max(0.01, deadline - time.monotonic())

    # LP cut loop
    for _ in range(50):
        if deadline is not None and time.monotonic() > deadline:
            return None
        cons = [LinearConstraint(base, base_lo, base_hi)]
        cr = cut_rows()
        if cr is not None:
            cons.append(cr)
        res = milp(cost, integrality=np.zeros(nv), bounds=Bounds(0, 1), constraints=cons,
                   options={} if deadline is None else {"time_limit": left()})
        if res.x is None or separate(res.x) == 0:
            break
    best, best_score = incumbent, (None if incumbent is None else _objective(p, incumbent))
    while True:
        if deadline is not None and time.monotonic() > deadline:
            break
        cons = [LinearConstraint(base, base_lo, base_hi)]
        cr = cut_rows()
        if cr is not None:
            cons.append(cr)
        options = {"mip_rel_gap": 1e-9}
        if deadline is not None:
            options["time_limit"] = left()
        res = milp(cost, integrality=np.ones(nv), bounds=Bounds(0, 1), constraints=cons, options=options)
        if res.x is None:
            if res.status == 2 and best is None:
                raise RunOrderInfeasibleError("must-run jobs cannot all run within the machines' hours")
            break
        xv = np.round(res.x)
        orders, subtours = [], 0
        for k in range(p.m):
            succ = {int(a): int(b) for t, (kk, a, b) in enumerate(var_arc) if kk == k and xv[nx + t] > 0.5}
            seq, v = [], succ.get(0, 0)
            visited = {0}
            while v != 0 and v not in visited:
                visited.add(v)
                seq.append(v - 1)
                v = succ.get(v, 0)
            orders.append(seq)
            on_k = [i for i in p.nodes[k][1:] if xv[xpos[(i - 1, k)]] > 0.5]
            loose = [i for i in on_k if i not in visited]
            while loose:                         # each loose cycle becomes a cut
                cyc, v = [], loose[0]
                while v not in cyc:
                    cyc.append(v)
                    v = succ[v]
                in_s = np.zeros(p.n + 1, dtype=bool)
                in_s[cyc] = True
                subtours += add_cut(k, in_s, cyc[0])
                loose = [i for i in loose if i not in cyc]
        if subtours == 0:
            s = _objective(p, orders)
            if _feasible(p, orders) and _better(s, best_score, p.most) or best is None:
                best, best_score = orders, s
            if res.status == 0:
                return _result(p, best, lower, True, "exact", "optimal")
            break
    if best is None:
        return None
    return _result(p, best, lower, False, "exact", "time_limit")
