"""Speed of exact what-if costs for all cells, against forcing each cell and re-solving.

An n x n plan (n = 200, every pair allowed, whole-minute setups 1..240) is solved once.
Ours: ``dispatcher.engine.what_if`` gives the extra cost of all n^2 (job, machine) pairs
in one call. Reference: for each pair, ``scipy.optimize.linear_sum_assignment`` on the
grid with that job's row and that machine's column removed (the forced re-solve), plus
the forced value. The n^2 re-solves would take minutes, so a random sample of cells is
timed and scaled to n^2; every sampled cell must agree with ours (checked, not timed).

Usage: python benchmarks/whatif.py [--n 200] [--sample 300] [--seed 1]
The last line printed is ``ratio <estimated time of n^2 re-solves / our time>``.
"""

from __future__ import annotations

import argparse
import statistics
import sys
import time
from pathlib import Path

import numpy as np
from scipy.optimize import linear_sum_assignment

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from dispatcher.engine import solve, what_if  # noqa: E402


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--n", type=int, default=200)
    parser.add_argument("--sample", type=int, default=300)
    parser.add_argument("--repeat", type=int, default=5)
    parser.add_argument("--seed", type=int, default=1)
    args = parser.parse_args()
    rng = np.random.default_rng(args.seed)
    n = args.n
    values = rng.integers(1, 240, (n, n), endpoint=True).astype(float)
    base = solve(values)

    ours = []
    for _ in range(args.repeat):
        start = time.perf_counter()
        result = what_if(base)
        ours.append(time.perf_counter() - start)
    our_time = statistics.median(ours)

    cells = rng.integers(0, n, (args.sample, 2))
    start = time.perf_counter()
    forced = []
    for job, machine in cells:
        rest = np.delete(np.delete(values, job, axis=0), machine, axis=1)
        rows, cols = linear_sum_assignment(rest)
        forced.append(values[job, machine] + rest[rows, cols].sum())
    sample_time = time.perf_counter() - start
    for (job, machine), total in zip(cells, forced):
        if not np.isclose(result.extra[job, machine], total - base.total):
            raise SystemExit(f"what-if disagrees with scipy at job {job}, machine {machine}")
    per_cell = sample_time / args.sample
    reference = per_cell * n * n
    print(f"n = {n}: what_if for all {n * n} cells {our_time * 1e3:.1f} ms; "
          f"one forced scipy re-solve {per_cell * 1e3:.3f} ms "
          f"(sample of {args.sample}), x {n * n} = {reference:.1f} s")
    print(f"ratio {reference / our_time:.0f}")


if __name__ == "__main__":
    main()
