"""Reference answers built independently of :mod:`dispatcher.engine`, for the tests.

Nothing here imports the engine. Each reference rests on something outside the project:

* :func:`brute_force` enumerates every plan and applies the definition of issue 2 word
  for word (maximum number of placed jobs, must-run jobs placed, then the objective);
* :func:`scipy_reference` solves a rectangular big-M encoding built here with
  ``scipy.optimize.linear_sum_assignment`` (a reference library);
* :func:`networkx_reference` solves the same problem with ``networkx.max_weight_matching``
  (Edmonds' blossom algorithm in pure Python, ``maxcardinality=True``), which shares no
  code with scipy.

The references want integer values so that big-M arithmetic is exact.
:func:`check_result` checks an engine result's claims directly, without calling its own
``verify`` (tests call both), on a square problem it rebuilds from the values, penalties
and must-run flags, and against :func:`scipy_reference`.
"""

from __future__ import annotations

from dataclasses import dataclass

import networkx as nx
import numpy as np
from scipy.optimize import linear_sum_assignment


@dataclass(frozen=True)
class Reference:
    """What a reference says about a problem. ``total`` follows the objective's sign rule."""

    feasible: bool
    placed: int = 0
    total: float = 0.0
    bottleneck: float | None = None
    rush_placed: int = 0


def _as_problem(values, allowed, penalty, must):
    values = np.asarray(values)
    m, n = values.shape
    allowed = np.ones((m, n), dtype=bool) if allowed is None else np.asarray(allowed, dtype=bool)
    penalty = np.zeros(m) if penalty is None else np.asarray(penalty, dtype=float)
    must = np.zeros(m, dtype=bool) if must is None else np.asarray(must, dtype=bool)
    return values, allowed, penalty, must


# --------------------------------------------------------------------------- brute force

def enumerate_plans(allowed: np.ndarray, must: np.ndarray, size: int):
    """Every plan placing exactly ``size`` jobs and every must-run job (tuples, -1 waits)."""
    m, _ = allowed.shape
    options = [np.flatnonzero(allowed[i]).tolist() for i in range(m)]
    choice = [-1] * m
    used: set[int] = set()

    def rec(i: int, placed: int):
        if placed + (m - i) < size:
            return
        if i == m:
            yield tuple(choice)
            return
        if placed < size:
            for j in options[i]:
                if j not in used:
                    used.add(j)
                    choice[i] = j
                    yield from rec(i + 1, placed + 1)
                    used.discard(j)
            choice[i] = -1
        if not must[i]:
            yield from rec(i + 1, placed)

    yield from rec(0, 0)


def max_placed_brute(allowed: np.ndarray) -> int:
    """Largest number of jobs any plan places, by trying sizes from the top down."""
    no_must = np.zeros(allowed.shape[0], dtype=bool)
    for size in range(min(allowed.shape), -1, -1):
        for _ in enumerate_plans(allowed, no_must, size):
            return size
    return 0  # pragma: no cover - size 0 always has the empty plan


def brute_force(values, allowed=None, penalty=None, must=None, objective="total",
                rush=None) -> Reference:
    """The definition of a plan (issue 2), applied to every plan by enumeration.

    ``rush`` (a mask): among the plans placing the most jobs and every must-run job, only
    those placing the most rush jobs count (issue 11's priority), then the objective.
    """
    values, allowed, penalty, must = _as_problem(values, allowed, penalty, must)
    rush_rows = [] if rush is None else [i for i, r in enumerate(np.asarray(rush).tolist()) if r]
    size = max_placed_brute(allowed)
    vals = values.tolist()
    pen = penalty.tolist()
    best = None
    for plan in enumerate_plans(allowed, must, size):
        planned = [vals[i][j] for i, j in enumerate(plan) if j >= 0]
        waiting = sum(pen[i] for i, j in enumerate(plan) if j < 0)
        if objective == "maximize":
            total = sum(planned) - waiting
            key = (-total,)
        elif objective == "bottleneck":
            total = sum(planned) + waiting
            key = (max(planned, default=-1), total)
        else:
            total = sum(planned) + waiting
            key = (total,)
        rush_placed = sum(1 for i in rush_rows if plan[i] >= 0)
        key = (-rush_placed, *key)
        if best is None or key < best[0]:
            best = (key, total, max(planned) if planned else None, rush_placed)
    if best is None:
        return Reference(False)
    return Reference(True, size, best[1], best[2] if objective == "bottleneck" else None,
                     best[3])


# --------------------------------------------------------------------------- scipy

def _big_m(values: np.ndarray, penalty: np.ndarray) -> float:
    return 4.0 * (float(np.abs(values).sum()) + float(penalty.sum()) + 1.0)


def _scipy_lexicographic(values, allowed, penalty, must, maximize: bool):
    """(feasible, placed, objective total) from a rectangular big-M LSA built here.

    Columns: the machines, then one private "wait" column per job (cost = its wait penalty,
    forbidden for must-run jobs). Each planned pair earns -M, so with M above any possible
    sum of values and penalties the minimum first places as many jobs as possible.
    """
    m, n = values.shape
    if m == 0:
        return True, 0, 0.0
    big = _big_m(values, penalty)
    sign = -1.0 if maximize else 1.0
    cost = np.full((m, n + m), np.inf)
    cost[:, :n] = np.where(allowed, sign * values - big, np.inf)
    cost[np.arange(m), n + np.arange(m)] = np.where(must, np.inf, penalty)
    try:
        rows, cols = linear_sum_assignment(cost)
    except ValueError:  # scipy: "cost matrix is infeasible"
        return False, 0, 0.0
    placed = cols < n
    planned = float(values[rows[placed], cols[placed]].sum())
    waiting = float(penalty[rows[~placed]].sum())
    total = planned - waiting if maximize else planned + waiting
    return True, int(placed.sum()), total


def scipy_reference(values, allowed=None, penalty=None, must=None, objective="total") -> Reference:
    """Optimum by scipy.optimize.linear_sum_assignment on an encoding built here."""
    values, allowed, penalty, must = _as_problem(values, allowed, penalty, must)
    no_must = np.zeros_like(must)
    _, size, _ = _scipy_lexicographic(values, allowed, penalty, no_must, False)
    if objective != "bottleneck":
        ok, placed, total = _scipy_lexicographic(values, allowed, penalty, must,
                                                 objective == "maximize")
        return Reference(ok and placed == size, placed, total)
    if size == 0:
        ok, placed, total = _scipy_lexicographic(values, allowed, penalty, must, False)
        return Reference(ok, 0, total)
    for level in np.unique(values[allowed]):  # ascending: the first that works is the bottleneck
        ok, placed, total = _scipy_lexicographic(values, allowed & (values <= level),
                                                 penalty, must, False)
        if ok and placed == size:
            return Reference(True, placed, total, float(level))
    return Reference(False)


# --------------------------------------------------------------------------- networkx

def _networkx_lexicographic(values, allowed, penalty, must, maximize: bool):
    """(all must-run placed, placed, total) by networkx.max_weight_matching.

    Integer weights: a must-run bonus W dominating everything else, plus the gain of a
    pair (penalty saved minus value, or value plus penalty saved when maximising), shifted
    to be positive. ``maxcardinality=True`` makes the number of pairs the first priority.
    """
    m, n = values.shape
    vals = values.astype(np.int64)
    pen = penalty.astype(np.int64)
    gain = (vals + pen[:, None]) if maximize else (pen[:, None] - vals)
    shift = int(np.abs(gain).max(initial=0)) + 1
    bonus = (shift * 2) * (m + 1)
    graph = nx.Graph()
    graph.add_nodes_from(("job", i) for i in range(m))
    graph.add_nodes_from(("machine", j) for j in range(n))
    for i, j in zip(*np.nonzero(allowed)):
        weight = int(gain[i, j]) + shift + (bonus if must[i] else 0)
        graph.add_edge(("job", int(i)), ("machine", int(j)), weight=weight)
    matching = nx.max_weight_matching(graph, maxcardinality=True)
    machine_of_job = np.full(m, -1)
    for a, b in matching:
        job, machine = (a, b) if a[0] == "job" else (b, a)
        machine_of_job[job[1]] = machine[1]
    placed = machine_of_job >= 0
    planned = float(values[np.flatnonzero(placed), machine_of_job[placed]].sum())
    waiting = float(penalty[~placed].sum())
    total = planned - waiting if maximize else planned + waiting
    return bool(placed[must].all()), int(placed.sum()), total


def networkx_reference(values, allowed=None, penalty=None, must=None, objective="total") -> Reference:
    """Optimum by networkx's blossom matching (independent of scipy)."""
    values, allowed, penalty, must = _as_problem(values, allowed, penalty, must)
    if objective != "bottleneck":
        ok, placed, total = _networkx_lexicographic(values, allowed, penalty, must,
                                                    objective == "maximize")
        return Reference(ok, placed, total)
    ok, size, total = _networkx_lexicographic(values, allowed, penalty, must, False)
    if not ok or size == 0:
        return Reference(ok, size, total)
    # Whether a threshold works only grows with the threshold: bisect over the levels.
    levels = np.unique(values[allowed])
    lo, hi = 0, len(levels) - 1  # levels[hi] (every allowed pair) always works
    while lo < hi:
        mid = (lo + hi) // 2
        ok, placed, _ = _networkx_lexicographic(values, allowed & (values <= levels[mid]),
                                                penalty, must, False)
        if ok and placed == size:
            hi = mid
        else:
            lo = mid + 1
    ok, placed, total = _networkx_lexicographic(values, allowed & (values <= levels[hi]),
                                                penalty, must, False)
    return Reference(ok and placed == size, placed, total, float(levels[hi]))


# --------------------------------------------------------------------------- checks

def square_by_hand(values, allowed, penalty, must, placed: int, objective: str,
                   top: float = 0.0, rush=None, rush_wait: int = 0) -> np.ndarray:
    """The square problem of the documented layout, built here from the problem itself.

    Rows: the jobs, then one idle row per machine left without a job; columns: the
    machines, then one wait slot per job that waits (``placed`` jobs are placed). A job
    costs its value on an allowed machine (``top - value`` when maximising) and its wait
    penalty on a wait slot (not allowed for a must-run job); an idle row costs 0 on a
    machine and cannot wait. Rush jobs (``rush``, not must-run) wait only on the last
    ``rush_wait`` wait slots, ordinary jobs only on the others.
    """
    m, n = values.shape
    size = m + n - placed
    square = np.full((size, size), np.inf)
    job_cost = top - values if objective == "maximize" else values
    square[:m, :n] = np.where(allowed, job_cost, np.inf)
    rush = np.zeros(m, dtype=bool) if rush is None else np.asarray(rush, dtype=bool) & ~must
    square[:m, n:] = np.where(must | rush, np.inf, penalty)[:, None]
    if rush_wait:
        square[:m, size - rush_wait:] = np.where(rush, penalty, np.inf)[:, None]
    square[m:, :n] = 0.0
    return square


def check_result(result, values, allowed=None, penalty=None, must=None, *,
                 reference: Reference | None = None, rush=None) -> None:
    """Assert every claim of an engine result by hand (independent of ``result.verify``).

    Plan: one machine per placed job, allowed pairs only, must-run jobs placed, total
    recomputed and equal to the optimum of scipy's ``linear_sum_assignment`` on the
    encoding of :func:`scipy_reference` (built here from the values, penalties and
    must-run flags). Certificate: the engine's square equals the square rebuilt here by
    :func:`square_by_hand` (so a square that drops or alters part of the problem fails),
    and the potentials have reduced costs >= -tol on that rebuilt square and 0 on the
    plan; LP duality (sum of potentials = cost of the plan). The potentials the result
    exposes are checked on the values too. Konig: the cover has as many vertices as pairs
    and touches every allowed pair. ``reference``: the caller's own reference answer
    (:func:`scipy_reference` or :func:`brute_force`) for this problem, to save computing
    it twice or where floats of very different magnitudes defeat scipy's big-M encoding.
    """
    values, allowed, penalty, must = _as_problem(values, allowed, penalty, must)
    values = values.astype(float)
    m, n = values.shape
    plan = np.asarray(result.machine_of_job)
    assert plan.shape == (m,)
    assert result.job_potential.shape == (m,) and result.machine_potential.shape == (n,)
    placed = plan >= 0
    jobs, machines = np.flatnonzero(placed), plan[placed]
    assert (machines < n).all()
    assert len(set(machines.tolist())) == len(machines), "a machine got two jobs"
    assert allowed[jobs, machines].all(), "an incompatible pair was planned"
    assert placed[must].all(), "a must-run job waits"
    planned = float(values[jobs, machines].sum())
    waiting = float(penalty[~placed].sum())
    expect = planned - waiting if result.objective == "maximize" else planned + waiting
    assert np.isclose(result.total, expect)
    if reference is None:
        reference = scipy_reference(values, allowed, penalty, must, result.objective)
    assert reference.feasible, "scipy finds no plan placing every must-run job"
    assert reference.placed == int(placed.sum()), "not as many jobs placed as scipy places"
    assert np.isclose(result.total, reference.total, rtol=1e-9, atol=1e-9), (
        f"total {result.total} but scipy's optimum is {reference.total}")
    if result.objective == "bottleneck" and placed.any():
        assert result.bottleneck == reference.bottleneck

    scale = max(1.0, float(np.abs(values[allowed]).max(initial=0)), float(penalty.max(initial=0)))
    tol = 1e-9 * scale * max(1, m + n)
    u, v = result.job_potential[:, None], result.machine_potential[None, :]
    reduced = (u + v - values) if result.objective == "maximize" else (values - u - v)
    solved = np.asarray(result.solved_allowed)
    assert not (solved & ~allowed).any()
    assert (reduced[solved] >= -tol).all(), "negative reduced cost on an allowed pair"
    if placed.any():
        assert np.abs(reduced[jobs, machines]).max() <= tol, "planned pair not tight"
    if result.objective == "bottleneck" and placed.any():
        assert result.bottleneck == values[jobs, machines].max()
        assert (values[solved] <= result.bottleneck).all()
        # The problem solved keeps exactly the allowed pairs up to the bottleneck value.
        np.testing.assert_array_equal(solved, allowed & (values <= result.bottleneck))
    elif placed.any() or m == 0 or n == 0:
        np.testing.assert_array_equal(solved, allowed)

    cert = result.certificate
    size = m + n - int(placed.sum())
    assert cert.cost.shape == (size, size), "the square is not jobs + idle rows by machines + waits"
    assert sorted(cert.col_of_row.tolist()) == list(range(size))
    if size:
        top = 0.0
        if result.objective == "maximize" and solved.any():
            # Any constant works (every plan places the same number of jobs): read it off.
            i, j = np.argwhere(solved)[0]
            top = float(cert.cost[i, j] + values[i, j])
        rush_wait = 0 if rush is None else int((np.asarray(rush) & ~must & ~placed).sum())
        square = square_by_hand(values, solved, penalty, must, int(placed.sum()),
                                result.objective, top, rush, rush_wait)
        np.testing.assert_array_equal(np.isinf(cert.cost), np.isinf(square))
        finite = np.isfinite(square)
        np.testing.assert_allclose(cert.cost[finite], square[finite], rtol=1e-12, atol=tol)
        rows = np.arange(size)
        plan_cost = square[rows, cert.col_of_row]
        assert np.isfinite(plan_cost).all()
        red = square - cert.row_potential[:, None] - cert.col_potential[None, :]
        assert (red[finite] >= -tol * 10).all()
        assert np.abs(red[rows, cert.col_of_row]).max() <= tol * 10
        # Weak duality made tight: sum(u) + sum(v) equals the plan's cost.
        assert np.isclose(cert.row_potential.sum() + cert.col_potential.sum(), plan_cost.sum(),
                          rtol=1e-9, atol=tol * 10)
        # The square's first m rows are the jobs and first n columns the machines.
        np.testing.assert_array_equal(np.where(cert.col_of_row[:m] < n, cert.col_of_row[:m], -1), plan)

    cover_jobs, cover_machines = np.asarray(result.cover_jobs), np.asarray(result.cover_machines)
    assert int(cover_jobs.sum() + cover_machines.sum()) == int(placed.sum())
    assert not (allowed & ~(cover_jobs[:, None] | cover_machines[None, :])).any()


def witness_holds_by_hand(allowed: np.ndarray, jobs, machines) -> bool:
    """Hall's condition fails for ``jobs``: all their allowed machines lie in ``machines``,
    and there are fewer of those than jobs (checked with plain Python sets)."""
    jobs = [int(j) for j in jobs]
    machines = {int(k) for k in machines}
    neighbours = {int(k) for j in jobs for k in range(allowed.shape[1]) if allowed[j, k]}
    return bool(jobs) and neighbours <= machines and len(machines) < len(jobs)
