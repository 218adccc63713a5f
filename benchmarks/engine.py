"""Speed of ``dispatcher.engine.solve`` (plan plus certificate) against scipy's primal solve.

Dense square grids of random integers 1..10^6 (every pair allowed) at n = 100, 300, 1000
and 2000. For each n the same matrices go to ``scipy.optimize.linear_sum_assignment``
(the plan only: Crouse 2016, the primal solver the engine itself calls) and to
``dispatcher.engine.solve`` (the plan, the dual potentials computed by shortest paths, the
Konig cover), in the same run, alternating, and the medians are compared. Every engine
result is also checked: same optimum as scipy and ``verify()`` true (not timed).

Goal from issue 2: ratio (ours / scipy) <= 1.5 at n = 1000.

Usage: python benchmarks/engine.py [--repeat N] [--sizes 100,300,...] [--seed S]
The last line printed is ``ratio <ratio at n=1000>`` (or at the largest size measured).
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

from dispatcher.engine import solve  # noqa: E402

DEFAULT_SIZES = (100, 300, 1000, 2000)
#: Repeats per size: small grids are cheap and noisy, so they get more.
DEFAULT_REPEATS = {100: 41, 300: 21, 1000: 11, 2000: 5}


def measure(n: int, repeats: int, rng: np.random.Generator) -> tuple[float, float]:
    """Median seconds (scipy primal, ours with certificate) over ``repeats`` fresh grids."""
    scipy_times, our_times = [], []
    for r in range(repeats):
        costs = rng.integers(1, 10**6, size=(n, n), endpoint=True).astype(float)
        pair = [("scipy", scipy_times), ("ours", our_times)]
        if r % 2:  # alternate the order so neither side always runs on a warm cache
            pair.reverse()
        for who, times in pair:
            start = time.perf_counter()
            if who == "scipy":
                rows, cols = linear_sum_assignment(costs)
            else:
                result = solve(costs)
            times.append(time.perf_counter() - start)
        optimum = costs[rows, cols].sum()
        if result.total != optimum or not result.verify():
            raise SystemExit(f"n={n}: engine total {result.total} != scipy {optimum} or unverified")
    return statistics.median(scipy_times), statistics.median(our_times)


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    parser.add_argument("--repeat", type=int, default=0, help="repeats per size (default: by size)")
    parser.add_argument("--sizes", default=",".join(map(str, DEFAULT_SIZES)))
    parser.add_argument("--seed", type=int, default=2024)
    args = parser.parse_args(argv)
    sizes = [int(s) for s in args.sizes.split(",") if s]
    rng = np.random.default_rng(args.seed)

    print("dense integer grids 1..10^6, every pair allowed; median seconds")
    print(f"{'n':>6}  {'repeats':>7}  {'scipy (plan)':>13}  {'ours (+certificate)':>19}  {'ratio':>6}")
    ratios = {}
    for n in sizes:
        repeats = args.repeat or DEFAULT_REPEATS.get(n, 3)
        t_scipy, t_ours = measure(n, repeats, rng)
        ratios[n] = t_ours / t_scipy
        print(f"{n:>6}  {repeats:>7}  {t_scipy:>13.4f}  {t_ours:>19.4f}  {ratios[n]:>6.2f}", flush=True)
    key = 1000 if 1000 in ratios else max(ratios)
    print(f"ratio {ratios[key]:.2f}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
