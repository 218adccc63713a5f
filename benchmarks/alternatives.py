"""Speed of the 10 best plans at n = 100, against Murty's method with cold scipy subproblems.

An n x n grid (n = 100, every pair allowed, whole-minute setups 1..240) is solved once.
Ours: ``dispatcher.engine.ranked_plans(result, 10)`` (Murty partitioning, subproblems
solved warm and lazily). Reference: Murty's method as published (Murty 1968), each
subproblem (fixed pairs, one forbidden pair) solved from scratch by
``scipy.optimize.linear_sum_assignment`` on the grid with forbidden entries set to
infinity. Both lists of totals must agree (checked, not timed).

Usage: python benchmarks/alternatives.py [--n 100] [--k 10] [--seed 1] [--repeat 5]
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


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--n", type=int, default=100)
    parser.add_argument("--k", type=int, default=10)
    parser.add_argument("--seed", type=int, default=1)
    parser.add_argument("--repeat", type=int, default=5)
    args = parser.parse_args()
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
