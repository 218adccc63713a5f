"""Speed of ``dispatcher.engine.fill_shift`` on the OR-Library GAP sets gap1..gap8.

Reference data: J. E. Beasley, "OR-Library: distributing test problems by electronic
mail", JORS 41(11) (1990) 1069-1072; instances read from ../shared/data/or-library/
(or $DISPATCHER_SHARED_DATA/or-library), never copied into the project.

For each file the five sets are solved as published (maximisation, every job assigned)
by ``fill_shift`` and, in the same run, by a plain ``scipy.optimize.milp`` model built
here (one binary per pair, same options), so the printed ratio is our overhead over
calling scipy directly. Both must reach the published optima from the data README.

Usage: python benchmarks/fill_shift.py [--repeat N]
"""

from __future__ import annotations

import argparse
import os
import re
import sys
import time
from pathlib import Path

import numpy as np
from scipy.optimize import Bounds, LinearConstraint, milp
from scipy.sparse import coo_array

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from dispatcher.engine import fill_shift  # noqa: E402
from dispatcher.engine.fill_shift import MIP_REL_GAP  # noqa: E402


def data_dir() -> Path:
    return Path(os.environ.get("DISPATCHER_SHARED_DATA", ROOT.parent / "shared" / "data")) / "or-library"


def read_gap(path: Path) -> list[tuple[np.ndarray, np.ndarray, np.ndarray]]:
    """OR-Library GAP format -> [(values jobs x machines, hours jobs x machines, capacity)]."""
    t = np.array(path.read_text().split(), dtype=float)
    out, k = [], 1
    for _ in range(int(t[0])):
        m, n = int(t[k]), int(t[k + 1])
        k += 2
        profit = t[k:k + m * n].reshape(m, n)
        resource = t[k + m * n:k + 2 * m * n].reshape(m, n)
        capacity = t[k + 2 * m * n:k + 2 * m * n + m]
        k += 2 * m * n + m
        out.append((profit.T.copy(), resource.T.copy(), capacity.copy()))
    return out


def plain_scipy(values: np.ndarray, hours: np.ndarray, capacity: np.ndarray) -> float:
    """The textbook GAP model handed straight to scipy.optimize.milp; returns the optimum."""
    n, m = values.shape
    var = np.arange(n * m)
    assign = coo_array((np.ones(n * m), (np.repeat(np.arange(n), m), var)), shape=(n, n * m))
    load = coo_array((hours.ravel(), (np.tile(np.arange(m), n), var)), shape=(m, n * m))
    res = milp(-values.ravel(), integrality=np.ones(n * m), bounds=Bounds(0, 1),
               constraints=[LinearConstraint(assign, 1, 1), LinearConstraint(load, -np.inf, capacity)],
               options={"mip_rel_gap": MIP_REL_GAP})
    return -res.fun


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--repeat", type=int, default=3, help="best of N runs (default 3)")
    args = parser.parse_args()
    folder = data_dir()
    if not (folder / "README.md").exists():
        print(f"OR-Library data not found at {folder}", file=sys.stderr)
        return 2
    readme = (folder / "README.md").read_text()
    optima = {name: [int(v) for v in opt.split()] for name, opt in
              re.findall(r"^\|\s*(gap\d\.txt)\s*\|[^|]*\|([\d\s]+)\|\s*$", readme, re.M)}
    print("seconds for all five sets of a file, best of", max(1, args.repeat), "runs")
    print(f"{'file':<9} {'size':>7} {'fill_shift s':>13} {'scipy milp s':>13} {'ratio':>6}  optima")
    ok = True
    for k in range(1, 9):
        name = f"gap{k}.txt"
        sets = read_gap(folder / "generalised-assignment" / name)
        ours = plain = np.inf
        for _ in range(max(1, args.repeat)):
            t0 = time.perf_counter()
            totals = [fill_shift(v, h, c, maximize=True, all_jobs=True).total for v, h, c in sets]
            t1 = time.perf_counter()
            ref = [plain_scipy(v, h, c) for v, h, c in sets]
            t2 = time.perf_counter()
            ours, plain = min(ours, t1 - t0), min(plain, t2 - t1)
        good = (np.allclose(totals, optima[name]) and np.allclose(ref, optima[name]))
        ok &= good
        n, m = sets[0][0].shape
        print(f"{name:<9} {m:>3}x{n:<3} {ours:>13.3f} {plain:>13.3f} {ours / plain:>6.2f}  "
              + ("published optima reached" if good else f"MISMATCH {totals} vs {optima[name]}"))
    return 0 if ok else 1


if __name__ == "__main__":
    raise SystemExit(main())
