"""Run orders on one machine (dispatcher.engine.order_runs) against outside references.

References: published TSPLIB optima (Reinelt 1991, files in ../shared/data/tsplib-atsp),
brute force over every order (itertools.permutations), the Held-Karp dynamic program
(Held and Karp 1962) written in tests/helpers_sequencing.py, and the theorem that any
relaxation (here the assignment relaxation, solved by scipy.optimize.linear_sum_assignment)
bounds the optimum from below.
"""

from __future__ import annotations

import time

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st
from scipy.optimize import linear_sum_assignment

from dispatcher.engine import DispatchInputError, RunOrderInfeasibleError, order_runs
from tests.helpers_sequencing import (
    brute_force_order,
    held_karp_order,
    order_total,
    read_tsplib_atsp,
    tsplib_atsp_optima,
)

TSPLIB = ["br17", "ftv33", "ftv38", "ftv47", "ft53", "ftv70"]


def random_changeovers(rng, n, forbidden=0.0, integer=True, scale=50):
    c = rng.integers(0, scale, size=(n, n)).astype(float) if integer else rng.random((n, n)) * scale
    c[rng.random((n, n)) < forbidden] = np.nan
    np.fill_diagonal(c, 0.0)
    return c


def ends_for(n, start):
    other = (start + 1) % n
    return [None, start] + ([other] if other != start else [])


# -- published optima (TSPLIB, Reinelt 1991) -------------------------------------------------

@pytest.mark.parametrize("name", TSPLIB)
def test_tsplib_published_optimum_reached_and_proven(tsplib_atsp, name):
    optimum = tsplib_atsp_optima(tsplib_atsp / "README.md")[name]   # published by TSPLIB
    d = read_tsplib_atsp(tsplib_atsp / f"{name}.atsp")
    t0 = time.process_time()
    result = order_runs(d, start=0, end=0)
    seconds = time.process_time() - t0
    result.verify(d, start=0, end=0)
    assert result.total == optimum, f"{name}: {result.total} != published {optimum}"
    assert result.proven_optimal and result.lower_bound == optimum
    # the tour recomputed here from the file, not from the engine's own total
    assert order_total(d, result.order.tolist(), 0, 0) == optimum
    print(f"{name}: {seconds:.2f} CPU s")


def test_tsplib_time_limit_keeps_a_valid_bound(tsplib_atsp):
    """Under a tight limit the answer is still an order with a lower bound below it."""
    d = read_tsplib_atsp(tsplib_atsp / "ftv70.atsp")
    optimum = tsplib_atsp_optima(tsplib_atsp / "README.md")["ftv70"]
    result = order_runs(d, start=0, end=0, time_limit=0.05)
    result.verify(d, start=0, end=0)
    assert result.lower_bound <= optimum <= result.total
    assert result.proven_optimal == (result.status == "optimal")


# -- brute force and Held-Karp ---------------------------------------------------------------

@pytest.mark.parametrize("jobs", range(9))
def test_brute_force_every_end_rule(jobs):
    rng = np.random.default_rng(100 + jobs)
    n = jobs + 1
    for trial in range(3 if jobs < 8 else 1):
        c = random_changeovers(rng, n, forbidden=0.15 if trial else 0.0, integer=trial != 2)
        start = int(rng.integers(n))
        for end in ends_for(n, start):
            expect = brute_force_order(c, start, end)            # every order tried
            if not np.isfinite(expect):
                with pytest.raises(RunOrderInfeasibleError):
                    order_runs(c, start=start, end=end)
                continue
            result = order_runs(c, start=start, end=end)
            result.verify(c, start=start, end=end)
            assert result.proven_optimal
            assert result.total == pytest.approx(expect, rel=1e-9, abs=1e-9)


@pytest.mark.parametrize("jobs,seed", [(10, 1), (11, 2), (12, 3), (12, 4)])
def test_held_karp_up_to_twelve_jobs(jobs, seed):
    rng = np.random.default_rng(seed)
    c = random_changeovers(rng, jobs + 1, forbidden=0.2 if seed % 2 else 0.0, scale=100)
    for end in (None, 0, 5):
        expect = held_karp_order(c, 0, end)                       # Held and Karp (1962)
        if not np.isfinite(expect):
            with pytest.raises(RunOrderInfeasibleError):
                order_runs(c, start=0, end=end)
            continue
        result = order_runs(c, start=0, end=end)
        result.verify(c, start=0, end=end)
        assert result.proven_optimal and result.total == pytest.approx(expect)


def test_held_karp_agrees_with_brute_force():
    """The two references agree with each other (they share no code)."""
    rng = np.random.default_rng(7)
    for n in range(1, 8):
        c = random_changeovers(rng, n, forbidden=0.1)
        for end in ends_for(n, 0):
            assert held_karp_order(c, 0, end) == brute_force_order(c, 0, end)


def test_no_triangle_inequality_assumed():
    """A wash-up in between can be cheaper than the direct change: the order uses it."""
    # 0 mounted dark colour, 1 light colour, 2 wash-up; dark -> light direct is dear.
    c = np.array([[0, 90, 10], [90, 0, 40], [10, 5, 0]], dtype=float)
    result = order_runs(c, start=0)
    assert result.order.tolist() == [2, 1] and result.total == 15 == brute_force_order(c, 0)
    assert c[0, 2] + c[2, 1] < c[0, 1]                               # the triangle fails


def test_not_allowed_changes_are_avoided():
    c = np.array([[0, 1, np.inf], [np.nan, 0, 1], [1, 1, 0]], dtype=float)
    result = order_runs(c, start=0, end=0)
    assert result.order.tolist() == [1, 2] and result.total == 3


# -- theorems as properties -----------------------------------------------------------------

@settings(max_examples=60, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(n=st.integers(1, 7), seed=st.integers(0, 10_000), forbidden=st.sampled_from([0.0, 0.3]),
       end_kind=st.sampled_from(["none", "start", "other"]), integer=st.booleans())
def test_lower_bound_never_above_total(n, seed, forbidden, end_kind, integer):
    rng = np.random.default_rng(seed)
    c = random_changeovers(rng, n, forbidden=forbidden, integer=integer)
    end = {"none": None, "start": 0, "other": n - 1 if n > 1 else None}[end_kind]
    try:
        result = order_runs(c, start=0, end=end)
    except RunOrderInfeasibleError:
        assert not np.isfinite(brute_force_order(c, 0, end))
        return
    result.verify(c, start=0, end=end)
    assert result.lower_bound <= result.total
    assert result.total == pytest.approx(brute_force_order(c, 0, end))


@pytest.mark.parametrize("seed", range(5))
def test_assignment_relaxation_is_a_lower_bound(seed):
    """Every tour is an assignment, so the assignment optimum bounds the tour optimum."""
    rng = np.random.default_rng(seed)
    c = random_changeovers(rng, 9)
    big = c.copy()
    np.fill_diagonal(big, 1e9)
    rows, cols = linear_sum_assignment(big)                       # scipy, outside the engine
    result = order_runs(c, start=0, end=0)
    assert big[rows, cols].sum() <= result.lower_bound <= result.total


# -- input checks -----------------------------------------------------------------------------

@pytest.mark.parametrize("matrix,kwargs,message", [
    (np.zeros((2, 3)), {}, "square"),
    (np.zeros((0, 0)), {}, "empty"),
    (np.zeros(3), {}, "square"),
    ([["a", "b"], ["c", "d"]], {}, "numbers"),
    ([[0, -1], [1, 0]], {}, r"changeover\[0, 1\] is negative"),
    (np.zeros((3, 3)), {"start": 3}, r"start=3 is outside 0\.\.2"),
    (np.zeros((3, 3)), {"end": -1}, "end=-1 is outside"),
    (np.zeros((3, 3)), {"start": 1.5}, "start must be an index"),
    (np.zeros((3, 3)), {"time_limit": 0}, "time_limit must be a positive"),
])
def test_bad_input_is_refused(matrix, kwargs, message):
    with pytest.raises(DispatchInputError, match=message):
        order_runs(matrix, **kwargs)


def test_negative_diagonal_is_ignored():
    c = np.array([[-5, 2], [3, -1]], dtype=float)
    assert order_runs(c, end=0).total == 5


def test_job_nobody_can_reach_is_infeasible():
    c = np.array([[0, 1, np.nan], [1, 0, np.inf], [1, 1, 0]], dtype=float)
    with pytest.raises(RunOrderInfeasibleError, match="no run order"):
        order_runs(c, start=0, end=0)


def test_only_the_mounted_setup():
    result = order_runs([[7.0]], start=0, end=0)
    assert result.order.tolist() == [] and result.total == 0 and result.proven_optimal
