"""What-if costs and ranked plans for shops with a crew (dispatcher.engine.staffed_choices).

External check: brute force over every assignment of jobs to machines and of operators to
machines (tests/helpers_crew.py, nothing from the code under test): the what-if cost of a
pair is the best score among plans with the pair that place as many jobs and rush jobs as
the best plan; the ranked totals are the best totals among all such plans, in order.
"""

from __future__ import annotations

import itertools
import json
import subprocess
import sys
from pathlib import Path

import numpy as np
import pytest
from helpers_crew import _staffable, brute_force
from hypothesis import given, settings
from hypothesis import strategies as st

from dispatcher.engine.staffed_choices import ranked_staffed_plans, staffed_what_if
from dispatcher.engine.staffing import staffed_dispatch

ROOT = Path(__file__).resolve().parent.parent
SAMPLE = ROOT / "sample_shops" / "crewed_fabrication_cell.dshop"


@st.composite
def crews(draw):
    n = draw(st.integers(1, 4))
    m = draw(st.integers(1, 3))
    n_ops = draw(st.integers(1, 3))
    values = np.array([[draw(st.integers(0, 9)) for _ in range(m)] for _ in range(n)], float)
    allowed = np.array([[draw(st.integers(0, 4)) > 0 for _ in range(m)] for _ in range(n)])
    qualified = np.array([[draw(st.booleans()) for _ in range(m)] for _ in range(n_ops)])
    capacity = np.array([draw(st.integers(1, 2)) for _ in range(n_ops)])
    needs = np.array([draw(st.integers(0, 3)) > 0 for _ in range(m)])
    penalty = np.array([draw(st.integers(0, 5)) for _ in range(n)], float)
    rush = np.array([draw(st.booleans()) for _ in range(n)])
    return values, allowed, qualified, capacity, needs, penalty, rush


def _plans(values, allowed, qualified, capacity, needs, penalty, rush):
    """Brute force: (placed, rush placed, total) of every staffed plan."""
    n, m = values.shape
    for choice in itertools.product(range(-1, m), repeat=n):
        if any(k >= 0 and not allowed[i, k] for i, k in enumerate(choice)):
            continue
        if any(choice.count(k) > 1 for k in range(m)):
            continue
        if not _staffable(sorted({k for k in choice if k >= 0}), qualified, capacity, needs):
            continue
        total = sum(values[i, k] for i, k in enumerate(choice) if k >= 0) \
            + sum(penalty[i] for i, k in enumerate(choice) if k < 0)
        yield (sum(k >= 0 for k in choice), sum(bool(rush[i]) and k >= 0 for i, k in enumerate(choice)),
               total)


@settings(max_examples=50, deadline=None)
@given(crews())
def test_what_if_matches_brute_force(case):
    values, allowed, qualified, capacity, needs, penalty, rush = case
    plan = staffed_dispatch(values, allowed, qualified=qualified, capacity=capacity,
                            needs_operator=needs, wait_penalty=penalty, rush=rush)
    extra, wait_extra = staffed_what_if(plan)
    no_must = np.zeros(len(rush), bool)
    best = brute_force(values, allowed, qualified, capacity, needs, penalty, rush, no_must)
    n, m = values.shape
    for i in range(n):
        for k in range(m):
            only = allowed.copy()
            only[i] = False
            only[i, k] = allowed[i, k]
            must = no_must.copy()
            must[i] = True
            forced = brute_force(values, only, qualified, capacity, needs, penalty, rush, must) \
                if allowed[i, k] else None
            if forced is None or forced[:2] != best[:2]:
                assert np.isnan(extra[i, k])
            else:
                assert extra[i, k] == pytest.approx(best[2] - forced[2])
        none = allowed.copy()
        none[i] = False
        forced = brute_force(values, none, qualified, capacity, needs, penalty, rush, no_must)
        if forced is None or forced[:2] != best[:2]:
            assert np.isnan(wait_extra[i])
        else:
            assert wait_extra[i] == pytest.approx(best[2] - forced[2])


@settings(max_examples=50, deadline=None)
@given(crews(), st.integers(1, 6))
def test_ranked_plans_match_brute_force(case, k):
    values, allowed, qualified, capacity, needs, penalty, rush = case
    plan = staffed_dispatch(values, allowed, qualified=qualified, capacity=capacity,
                            needs_operator=needs, wait_penalty=penalty, rush=rush)
    ranked = ranked_staffed_plans(plan, k)
    assert all(p.verify() for p in ranked)
    pairs = [tuple(p.machine_of_job.tolist()) for p in ranked]
    assert len(set(pairs)) == len(pairs)  # distinct as (job, machine) choices
    plans = list(_plans(values, allowed, qualified, capacity, needs, penalty, rush))
    top = max(p[:2] for p in plans)
    totals = sorted(p[2] for p in plans if p[:2] == top)[:k]
    assert [p.total for p in ranked] == pytest.approx(totals)


def test_command_line_what_if_and_alternatives_on_a_crewed_shop():
    proc = subprocess.run([sys.executable, "-m", "dispatcher", "solve", str(SAMPLE), "--json",
                           "--what-if", "--alternatives=3"], capture_output=True, text=True,
                          check=False, cwd=ROOT)
    assert proc.returncode == 0, proc.stderr
    data = json.loads(proc.stdout)
    assert len(data["alternatives"]) == 3
    assert all("operator" in a for alt in data["alternatives"] for a in alt["assignments"])
    totals = [alt["total"] for alt in data["alternatives"]]
    assert totals == sorted(totals) and totals[0] == data["total"]
    placed = {a["job"]: a["machine"] for a in data["assignments"]}
    for job, machine in placed.items():
        assert data["what_if"][job][machine] == 0
