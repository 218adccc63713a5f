"""A large whole-shift plan with changeovers: 200 jobs x 20 machines x 12 families.

The shop is invented and generated here from a fixed seed (no real plant behind it):
four changeover tables of 12 families in minutes (10-60 between families, 0-5 within one,
5 % of the changes not allowed, a nothing-mounted row), five machines per table, each
machine with a mounted family or nothing, run hours 0.5-2.5 h (30 % of the pairs cannot
run), an 8-hour shift, wait penalties 10-60, eight rush jobs. More work than fits, so some
jobs wait.

``plan_shift_runs`` must return a plan with its proven gap within the default time limit
(10 s). Measured in the same run: the wall-clock seconds against that limit, the gap with
today's bound, and the gap the plain assignment relaxation alone would prove (the bound
before the family blocks were added), to show what the stronger bound is worth.
The last line is ``ratio X`` = time limit / seconds taken (at least 1: within the limit).

Usage: python benchmarks/shift_runs.py [--seed N]
"""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

import numpy as np

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from dispatcher.engine.shift_runs import _assignment_bound, _check, plan_shift_runs  # noqa: E402

TIME_LIMIT = 10.0  # the default of plan_shift_runs and of the app's whole-shift mode


def invented_shop(n=200, m=20, families=12, tables=4, seed=7):
    """Arrays for plan_shift_runs: changeover, hours, capacity, wait penalty, must-run."""
    rng = np.random.default_rng(seed)
    family = rng.integers(0, families, n)
    blocks = []
    for _ in range(tables):
        t = rng.integers(10, 61, (families + 1, families)).astype(float)  # last row: nothing mounted
        t[rng.random(t.shape) < 0.05] = np.nan
        for a in range(families):
            t[a, a] = rng.integers(0, 6)
        blocks.append(t)
    mounted = rng.integers(-1, families, m)  # -1: nothing mounted
    change = np.full((m, n + 1, n + 1), np.nan)
    for k in range(m):
        t = blocks[k % tables]
        change[k, 0, 1:] = t[families if mounted[k] < 0 else mounted[k], family]
        change[k, 1:, 1:] = t[family][:, family]
    hours = rng.uniform(0.5, 2.5, (n, m)).round(2)
    hours[rng.random((n, m)) < 0.3] = np.nan
    capacity = np.full(m, 8.0)
    penalty = rng.integers(10, 61, n).astype(float)
    must = np.zeros(n, dtype=bool)
    must[rng.choice(n, 8, replace=False)] = True
    return change, hours, capacity, penalty, must


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--seed", type=int, default=7)
    args = parser.parse_args()
    change, hours, capacity, penalty, must = invented_shop(seed=args.seed)
    t0 = time.monotonic()
    plan = plan_shift_runs(change, hours, capacity, wait_penalty=penalty, must_run=must, changeover_hours=1 / 60)
    seconds = time.monotonic() - t0
    problem = _check(change, hours, capacity, None, penalty, must, 1 / 60, None, "auto", True)
    assignment_only = min(_assignment_bound(problem), plan.total)
    old_gap = (plan.total - assignment_only) / max(1.0, abs(plan.total))
    print("invented shop: 200 jobs x 20 machines x 12 families, seed", args.seed)
    print(
        f"placed {plan.placed} of 200, total {plan.total:g} (changeovers {plan.changeovers:g}, "
        f"penalties {plan.penalties:g}), method {plan.method}"
    )
    print(f"proven lower bound {plan.lower_bound:g}, gap {100 * plan.gap:.1f} %")
    print(f"assignment relaxation alone: bound {assignment_only:g}, gap {100 * old_gap:.1f} %")
    print(f"wall seconds {seconds:.2f} (time limit {TIME_LIMIT:g})")
    ok = seconds <= TIME_LIMIT * 1.05 and plan.lower_bound <= plan.total
    if not ok:
        print("FAILED: over the time limit or a bound above the plan's total", file=sys.stderr)
    print(f"ratio {TIME_LIMIT / seconds:.2f}")
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main())
