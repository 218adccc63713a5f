"""Speed of the 10 best plans at n = 100, against Murty's method with cold scipy subproblems.

An n x n grid (n = 100, every pair allowed, whole-minute setups 1..240) is solved once.
Ours: ``dispatcher.engine.ranked_plans(result, 10)`` (Murty partitioning, subproblems
solved warm and lazily). Reference: Murty's method as published (Murty 1968), each
subproblem (fixed pairs, one forbidden pair) solved from scratch by
``scipy.optimize.linear_sum_assignment`` on the grid with forbidden entries set to
infinity. Both lists of totals must agree (checked, not timed).

Multi-slot case (``--slots S``): n jobs on machines that take 1..S jobs each, as many
slots as jobs. Ours: ``ranked_plans(result, 10, groups=...)`` over (job, machine) choices.
Reference: Murty's partition over the same choices, each subproblem (rows fixed to a
machine, one machine forbidden to a row on all its slots) solved from scratch by
``scipy.optimize.linear_sum_assignment`` on the slot columns. Both lists of totals must
agree. It also times the 10 best distinct plans of ``sample_shops/large_print_plant.dshop``
(invented demo data; 300 jobs on 60 machines, some with several slots).

Usage: python benchmarks/alternatives.py [--n 100] [--k 10] [--seed 1] [--repeat 5] [--slots S]
The last line printed is ``ratio <reference time / our time>`` (medians).
"""

from __future__ import annotations

import argparse
import heapq
import itertools
import statistics
import sys
import time
from pathlib import Path

import numpy as np
from scipy.optimize import linear_sum_assignment

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from dispatcher.engine import ranked_plans, solve  # noqa: E402


def murty_cold(values: np.ndarray, k: int) -> list[float]:
    """Totals of the k best assignments of a square grid, every subproblem solved cold."""
    n = values.shape[0]

    def solve_cold(fixed: dict[int, int], forbidden: list[tuple[int, int]]):
        cost = values.copy()
        for r, c in fixed.items():
            keep = cost[r, c]
            cost[r, :] = np.inf
            cost[:, c] = np.inf
            cost[r, c] = keep
        for r, c in forbidden:
            cost[r, c] = np.inf
        try:
            rows, cols = linear_sum_assignment(cost)
        except ValueError:  # no finite assignment left
            return None
        total = cost[rows, cols].sum()
        return (total, cols) if np.isfinite(total) else None

    tick = itertools.count()
    first = solve_cold({}, [])
    heap = [(first[0], next(tick), {}, [], first[1])]
    out: list[float] = []
    while heap and len(out) < k:
        total, _, fixed, forbidden, cols = heapq.heappop(heap)
        out.append(float(total))
        fixed = dict(fixed)
        for r in range(n):
            if r in fixed:
                continue
            child = solve_cold(fixed, forbidden + [(r, int(cols[r]))])
            if child is not None:
                heapq.heappush(heap, (child[0], next(tick), dict(fixed),
                                      forbidden + [(r, int(cols[r]))], child[1]))
            fixed[r] = int(cols[r])
    return out


def murty_cold_machines(values: np.ndarray, groups: np.ndarray, k: int) -> list[float]:
    """Totals of the k best plans over (job, machine) choices, every subproblem cold.

    ``values`` is square over slot columns; ``groups[c]`` is the machine of column c.
    """
    n = values.shape[0]

    def solve_cold(fixed: dict[int, int], forbidden: list[tuple[int, int]]):
        cost = values.copy()
        for r, g in fixed.items():
            cost[r, groups != g] = np.inf
        for r, g in forbidden:
            cost[r, groups == g] = np.inf
        try:
            rows, cols = linear_sum_assignment(cost)
        except ValueError:
            return None
        total = cost[rows, cols].sum()
        return (total, groups[cols]) if np.isfinite(total) else None

    tick = itertools.count()
    first = solve_cold({}, [])
    heap = [(first[0], next(tick), {}, [], first[1])]
    out: list[float] = []
    while heap and len(out) < k:
        total, _, fixed, forbidden, machine_of_row = heapq.heappop(heap)
        out.append(float(total))
        fixed = dict(fixed)
        for r in range(n):
            if r in fixed:
                continue
            choice = (r, int(machine_of_row[r]))
            child = solve_cold(fixed, forbidden + [choice])
            if child is not None:
                heapq.heappush(heap, (child[0], next(tick), dict(fixed), forbidden + [choice],
                                      child[1]))
            fixed[r] = choice[1]
    return out


def large_sample(k: int) -> None:
    """Time the k best distinct plans of the large invented sample (shop level)."""
    from dispatcher.io.shopfile import load_shop
    from dispatcher.shop.translate import build_problem, solve_problem

    problem = build_problem(load_shop(ROOT / "sample_shops" / "large_print_plant.dshop"))
    result = solve_problem(problem)
    start = time.perf_counter()
    plans = ranked_plans(result, k, groups=problem.columns)
    took = time.perf_counter() - start
    distinct = {frozenset((j, problem.columns[c]) for j, c in enumerate(p.machine_of_job.tolist())
                          if c >= 0) for p in plans}
    print(f"large_print_plant.dshop ({result.values.shape[0]} jobs, {len(problem.columns)} slots "
          f"on {len(set(problem.columns))} machines): {len(distinct)} distinct plans of {k} "
          f"in {took * 1e3:.1f} ms")


def main_slots(args) -> None:
    rng = np.random.default_rng(args.seed)
    large_sample(args.k)
    ours_t, ref_t = [], []
    for r in range(args.repeat):
        capacity = []
        while sum(capacity) < args.n:
            capacity.append(int(rng.integers(1, args.slots, endpoint=True)))
        capacity[-1] -= sum(capacity) - args.n
        groups = np.repeat(np.arange(len(capacity)), capacity)
        machine_values = rng.integers(1, 240, (args.n, len(capacity)), endpoint=True).astype(float)
        values = machine_values[:, groups]
        base = solve(values)
        start = time.perf_counter()
        plans = ranked_plans(base, args.k, groups=groups)
        ours_t.append(time.perf_counter() - start)
        start = time.perf_counter()
        ref = murty_cold_machines(values, groups, args.k)
        ref_t.append(time.perf_counter() - start)
        if not np.allclose([p.total for p in plans], ref):
            raise SystemExit(f"ranked plans disagree with cold Murty over machines on grid {r}")
        print(f"grid {r} ({len(capacity)} machines): ours {ours_t[-1] * 1e3:.1f} ms, "
              f"cold Murty {ref_t[-1] * 1e3:.1f} ms, totals {[float(p.total) for p in plans]}")
    ours, ref = statistics.median(ours_t), statistics.median(ref_t)
    print(f"n = {args.n}, slots 1..{args.slots}, k = {args.k}: ours {ours * 1e3:.1f} ms, "
          f"cold Murty {ref * 1e3:.1f} ms")
    print(f"ratio {ref / ours:.1f}")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--n", type=int, default=100)
    parser.add_argument("--k", type=int, default=10)
    parser.add_argument("--seed", type=int, default=1)
    parser.add_argument("--repeat", type=int, default=5)
    parser.add_argument("--slots", type=int, default=None,
                        help="multi-slot case: machines take 1..SLOTS jobs each")
    args = parser.parse_args()
    if args.slots is not None:
        main_slots(args)
        return
    rng = np.random.default_rng(args.seed)
    warm_up = solve(rng.integers(1, 240, (20, 20)).astype(float))
    ranked_plans(warm_up, args.k)  # first calls pay one-time costs on both sides
    murty_cold(warm_up.values, args.k)
    ours_t, ref_t = [], []
    for r in range(args.repeat):
        values = rng.integers(1, 240, (args.n, args.n), endpoint=True).astype(float)
        base = solve(values)
        start = time.perf_counter()
        plans = ranked_plans(base, args.k)
        ours_t.append(time.perf_counter() - start)
        start = time.perf_counter()
        ref = murty_cold(values, args.k)
        ref_t.append(time.perf_counter() - start)
        if not np.allclose([p.total for p in plans], ref):
            raise SystemExit(f"ranked plans disagree with cold Murty on grid {r}")
        print(f"grid {r}: ours {ours_t[-1] * 1e3:.1f} ms, cold Murty {ref_t[-1] * 1e3:.1f} ms, "
              f"totals {[float(p.total) for p in plans]}")
    ours, ref = statistics.median(ours_t), statistics.median(ref_t)
    print(f"n = {args.n}, k = {args.k}: ours {ours * 1e3:.1f} ms, cold Murty {ref * 1e3:.1f} ms")
    print(f"ratio {ref / ours:.1f}")


if __name__ == "__main__":
    main()
