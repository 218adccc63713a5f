"""Speed of warm re-dispatch after one machine goes down, against a cold scipy re-solve.

A 1000 x 1000 plan (every pair allowed) is solved once with ``dispatcher.engine.solve``.
Then, for several machines that had a job, the machine goes down and the new optimal
plan is found two ways in the same run, alternating order:

* cold: ``scipy.optimize.linear_sum_assignment`` on the grid without that machine's column
  (the plan only, no potentials). Timed from the same starting point as the warm side:
  the previous grid and the event, so dropping the column (one copy of the grid, as our
  side copies its square matrix once) is counted on both sides;
* warm: ``dispatcher.engine.redispatch(previous, machines_down=[m])`` (plan, potentials
  and Konig cover: a full certified result).

Both totals must agree and the warm result must ``verify()`` (checked, not timed).

For information a third column times the tool's own cold path, ``solve`` of the modified
grid (scipy plus the potentials and cover that make the result certified, like ours).

Values: setup minutes as whole numbers 1..240 (shops record setups in whole minutes,
common practice), the case the tool is built for. A second line reports real-valued
setups in [0, 240), where ties are rare and the shortest path search scans one row at a
time, as information.

Usage: python benchmarks/redispatch.py [--n 1000] [--repeat 9] [--seed 1]
The last line printed is ``ratio <median cold time / median warm time>`` (whole minutes).
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

from dispatcher.engine import redispatch, solve  # noqa: E402


def measure(values: np.ndarray, repeat: int, rng: np.random.Generator) -> tuple[float, float, float]:
    """Median seconds (cold scipy, warm, cold certified) over ``repeat`` machines going down."""
    previous = solve(values)
    redispatch(previous, machines_down=[int(previous.machine_of_job[0])])  # one-time costs
    busy = previous.machine_of_job[previous.machine_of_job >= 0]
    cold_times, warm_times, certified_times = [], [], []
    for r, machine in enumerate(rng.choice(busy, repeat, replace=False)):
        machine = int(machine)
        runs = ["cold", "warm", "certified"] if r % 2 else ["warm", "certified", "cold"]
        for who in runs:
            start = time.perf_counter()
            if who == "cold":
                rest = np.delete(values, machine, axis=1)
                rows, cols = linear_sum_assignment(rest)
                cold_times.append(time.perf_counter() - start)
            elif who == "warm":
                warm = redispatch(previous, machines_down=[machine])
                warm_times.append(time.perf_counter() - start)
            else:
                allowed = np.ones(values.shape, dtype=bool)
                allowed[:, machine] = False
                solve(values, allowed)
                certified_times.append(time.perf_counter() - start)
        if not np.isclose(warm.total, rest[rows, cols].sum()) or not warm.verify():
            raise SystemExit(f"warm re-dispatch disagrees with scipy for machine {machine}")
    return (statistics.median(cold_times), statistics.median(warm_times),
            statistics.median(certified_times))


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--n", type=int, default=1000)
    parser.add_argument("--repeat", type=int, default=9)
    parser.add_argument("--seed", type=int, default=1)
    args = parser.parse_args()
    rng = np.random.default_rng(args.seed)
    n = args.n
    print(f"{'values':<22}{'n':>6}{'cold scipy ms':>15}{'warm ms':>10}{'ratio':>8}"
          f"{'cold solve() ms':>17}{'ratio':>8}")
    floats = rng.random((n, n)) * 240
    minutes = rng.integers(1, 240, (n, n), endpoint=True).astype(float)
    for label, values in (("real-valued [0,240)", floats), ("whole minutes 1..240", minutes)):
        cold, warm, certified = measure(values, args.repeat, rng)
        print(f"{label:<22}{n:>6}{cold * 1e3:>15.2f}{warm * 1e3:>10.2f}{cold / warm:>8.1f}"
              f"{certified * 1e3:>17.2f}{certified / warm:>8.1f}")
    print(f"ratio {cold / warm:.1f}")


if __name__ == "__main__":
    main()
