"""Staffed dispatch speed: ours against a plain HiGHS MILP of the same model, same run.

Shop (invented, random with a fixed seed): 500 jobs x 100 machines x 60 operators, one
job per machine, 60 % of pairs allowed, each operator authorised for about a quarter of
the machines, a fifth of the operators minding two machines, 5 % rush jobs. The
reference is the model written here directly for scipy's ``milp`` (HiGHS): binary
x (job, machine) and z (operator, machine), the three aims (placed jobs, rush jobs,
cost) weighted into one objective. Both plans are compared (goal: reference time / our
time >= 5). Then the operator minding the most machines leaves: our warm re-plan
(``restaff``) against our own cold solve of the new crew (goal >= 10). The last line is
``ratio X``, the smaller of the two ratios.

Run: ``python benchmarks/crew.py`` (about a minute).
"""

from __future__ import annotations

import sys
import time
from pathlib import Path

import numpy as np
from scipy.optimize import Bounds, LinearConstraint, milp
from scipy.sparse import coo_matrix

sys.path.insert(0, str(Path(__file__).resolve().parent.parent))

from dispatcher.engine.staffing import restaff, staffed_dispatch


def shop(seed=7, n_jobs=500, n_machines=100, n_ops=60):
    rng = np.random.default_rng(seed)
    values = rng.integers(5, 120, (n_jobs, n_machines)).astype(float)
    allowed = rng.random((n_jobs, n_machines)) < 0.6
    qualified = rng.random((n_ops, n_machines)) < 0.25
    capacity = np.where(rng.random(n_ops) < 0.2, 2, 1)
    penalty = rng.integers(0, 60, n_jobs).astype(float)
    rush = rng.random(n_jobs) < 0.05
    return values, allowed, qualified, capacity, penalty, rush


def reference(values, allowed, qualified, capacity, penalty, rush):
    """One weighted HiGHS MILP: placed jobs first, then rush jobs, then the cost."""
    n_jobs, n_machines = values.shape
    jm_j, jm_m = np.nonzero(allowed)
    mo_o, mo_m = np.nonzero(qualified)
    nx_, nz = jm_j.size, mo_o.size
    nv = nx_ + nz
    spread = float(values.max() + penalty.max()) * n_jobs + 1
    w_rush = spread
    w_place = spread * (n_jobs + 1)
    c = np.r_[values[jm_j, jm_m] - penalty[jm_j] - w_rush * rush[jm_j] - w_place, np.zeros(nz)]
    xi, zi = np.arange(nx_), nx_ + np.arange(nz)
    cons = [
        LinearConstraint(coo_matrix((np.ones(nx_), (jm_j, xi)), shape=(n_jobs, nv)), 0, 1),
        # machine: jobs on it equal operators minding it, at most one
        LinearConstraint(coo_matrix((np.r_[np.ones(nx_), -np.ones(nz)], (np.r_[jm_m, mo_m], np.r_[xi, zi])),
                                    shape=(n_machines, nv)), 0, 0),
        LinearConstraint(coo_matrix((np.ones(nx_), (jm_m, xi)), shape=(n_machines, nv)), 0, 1),
        LinearConstraint(coo_matrix((np.ones(nz), (mo_o, zi)), shape=(qualified.shape[0], nv)),
                         0, capacity.astype(float)),
    ]
    res = milp(c, constraints=cons, integrality=np.ones(nv), bounds=Bounds(0, 1))
    x = np.round(res.x[:nx_]).astype(bool)
    placed = int(x.sum())
    return placed, int(rush[jm_j[x]].sum()), float(values[jm_j[x], jm_m[x]].sum() + penalty.sum()
                                                    - penalty[jm_j[x]].sum())


def timed(fn, *args, repeat=3, **kwargs):
    best, out = np.inf, None
    for _ in range(repeat):
        t = time.perf_counter()
        out = fn(*args, **kwargs)
        best = min(best, time.perf_counter() - t)
    return best, out


def main():
    values, allowed, qualified, capacity, penalty, rush = shop()
    t_ours, plan = timed(staffed_dispatch, values, allowed, qualified=qualified,
                         capacity=capacity, wait_penalty=penalty, rush=rush)
    t_ref, ref = timed(reference, values, allowed, qualified, capacity, penalty, rush, repeat=1)
    assert plan.verify()
    ours = (plan.planned_count, int(plan.tier_counts[2]), plan.total)
    print(f"ours:      {t_ours:8.3f} s  placed {ours[0]}, rush {ours[1]}, total {ours[2]:.0f}")
    print(f"reference: {t_ref:8.3f} s  placed {ref[0]}, rush {ref[1]}, total {ref[2]:.0f}")
    if ours[:2] != ref[:2] or not np.isclose(ours[2], ref[2]):
        print("plans differ")
        sys.exit(1)
    milp_ratio = t_ref / t_ours
    print(f"against the MILP: ratio {milp_ratio:.1f} (goal 5)")

    ops = plan.operator_of_machine
    leaving = int(np.bincount(ops[ops >= 0], minlength=len(capacity)).argmax())
    new_q = qualified.copy()
    new_q[leaving] = False
    t_warm, warm = timed(restaff, plan, qualified=new_q, capacity=capacity, repeat=5)
    t_cold, cold = timed(staffed_dispatch, values, allowed, qualified=new_q, capacity=capacity,
                         wait_penalty=penalty, rush=rush)
    assert warm.verify() and cold.verify()
    assert warm.planned_count == cold.planned_count and np.isclose(warm.total, cold.total)
    moved = int((warm.machine_of_job != plan.machine_of_job).sum())
    print(f"operator {leaving} leaves: warm {t_warm:.3f} s, cold {t_cold:.3f} s, "
          f"{moved} jobs change machine or wait")
    warm_ratio = t_cold / t_warm
    print(f"warm against cold: ratio {warm_ratio:.1f} (goal 10)")
    print(f"ratio {min(milp_ratio, warm_ratio):.1f}")


if __name__ == "__main__":
    main()
