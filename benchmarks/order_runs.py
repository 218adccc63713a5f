"""Speed of ``dispatcher.engine.order_runs`` on the TSPLIB asymmetric instances.

Reference data: G. Reinelt, "TSPLIB - A Traveling Salesman Problem Library", ORSA
Journal on Computing 3(4) (1991) 376-384; instances read from
../shared/data/tsplib-atsp/ (or $DISPATCHER_SHARED_DATA/tsplib-atsp), never copied into
the project, with the published optimal tour lengths from that folder's README.

Reference in the same run: the textbook loop written here (Dantzig, Fulkerson and
Johnson 1954, as usually taught): solve the assignment-constrained integer program with
``scipy.optimize.milp`` (HiGHS), add the subtour elimination constraint of every subtour
of the integer solution, repeat until the solution is one tour. Both must reach the
published optimum; ours must also report it proven optimal. The ratio printed per
instance is reference seconds / ours; the last line is the median.

Usage: python benchmarks/order_runs.py [--repeat N] [--only NAME,NAME]
"""

from __future__ import annotations

import argparse
import os
import re
import statistics
import sys
import time
from pathlib import Path

import numpy as np
from scipy.optimize import Bounds, LinearConstraint, milp
from scipy.sparse import coo_array

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT))

from dispatcher.engine import order_runs  # noqa: E402


def data_dir() -> Path:
    return Path(os.environ.get("DISPATCHER_SHARED_DATA", ROOT.parent / "shared" / "data")) / "tsplib-atsp"


def read_atsp(path: Path) -> np.ndarray:
    """TSPLIB FULL_MATRIX -> n x n float matrix (diagonal filler kept as read)."""
    text = path.read_text()
    n = int(re.search(r"DIMENSION\s*:\s*(\d+)", text).group(1))
    body = text.split("EDGE_WEIGHT_SECTION", 1)[1].split()
    return np.array(body[:n * n], dtype=float).reshape(n, n)


def textbook_loop(d: np.ndarray) -> float:
    """Integer program, subtour constraints of the integer solution, repeat."""
    n = d.shape[0]
    tails, heads = np.nonzero(~np.eye(n, dtype=bool))
    m = tails.size
    cost = d[tails, heads]
    arcs = np.arange(m)
    degree = coo_array((np.ones(2 * m), (np.concatenate([tails, n + heads]), np.concatenate([arcs, arcs]))),
                       shape=(2 * n, m))
    cuts: list[np.ndarray] = []
    while True:
        constraints = [LinearConstraint(degree, 1, 1)]
        if cuts:
            constraints.append(LinearConstraint(np.array([s[tails] & s[heads] for s in cuts], dtype=float),
                                                -np.inf, [s.sum() - 1 for s in cuts]))
        res = milp(cost, integrality=np.ones(m), bounds=Bounds(0, 1), constraints=constraints,
                   options={"mip_rel_gap": 0.0})
        x = np.round(res.x).astype(bool)
        succ = np.empty(n, dtype=np.int64)
        succ[tails[x]] = heads[x]
        seen = np.zeros(n, dtype=bool)
        subtours = []
        for s in range(n):
            if seen[s]:
                continue
            mask = np.zeros(n, dtype=bool)
            v = s
            while not seen[v]:
                seen[v] = mask[v] = True
                v = succ[v]
            subtours.append(mask)
        if len(subtours) == 1:
            return float(res.fun)
        cuts.extend(subtours)


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--repeat", type=int, default=1, help="best of N runs (default 1)")
    parser.add_argument("--only", default="", help="comma-separated instance names")
    args = parser.parse_args()
    folder = data_dir()
    if not (folder / "README.md").exists():
        print(f"TSPLIB asymmetric data not found at {folder}", file=sys.stderr)
        return 2
    table = re.findall(r"^\|\s*(\w+)\.atsp\s*\|\s*\d+\s*\|\s*(\d+)\s*\|",
                       (folder / "README.md").read_text(), re.MULTILINE)
    optima = {name: float(opt) for name, opt in table}
    names = [n for n in optima if not args.only or n in args.only.split(",")]
    print("CPU seconds per instance (process time, so other work on shared cores does not skew it),",
          "best of", max(1, args.repeat), "runs")
    print(f"{'instance':<9} {'n':>4} {'optimum':>8} {'ours s':>8} {'textbook s':>11} {'ratio':>7}  proven")
    ratios, ok = [], True
    for name in names:
        d = read_atsp(folder / f"{name}.atsp")
        ours = ref = np.inf
        for _ in range(max(1, args.repeat)):
            t0 = time.process_time()
            result = order_runs(d, start=0, end=0)
            ours = min(ours, time.process_time() - t0)
            t0 = time.process_time()
            ref_total = textbook_loop(d)
            ref = min(ref, time.process_time() - t0)
        good = (result.proven_optimal and result.total == optima[name] and round(ref_total, 6) == optima[name])
        ok &= good and ref >= ours
        ratios.append(ref / ours)
        print(f"{name:<9} {d.shape[0]:>4} {optima[name]:>8.0f} {ours:>8.2f} {ref:>11.2f} {ref / ours:>7.2f}  "
              f"{'yes' if good else f'NO (total {result.total:g})'}")
    if not ok:
        print("FAILED: an instance missed its optimum, was not proven optimal, or was slower", file=sys.stderr)
    print(f"ratio {statistics.median(ratios):.2f}")
    return 0 if ok else 1


if __name__ == "__main__":
    sys.exit(main())
