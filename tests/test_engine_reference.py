"""The engine against published optima, brute-force enumeration and mathematical facts.

Every check names its outside reference beside it.
"""

from __future__ import annotations

import itertools
from pathlib import Path

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from dispatcher.engine import InfeasibleError, solve
from helpers_reference import brute_force, check_result, enumerate_plans

OBJECTIVES = ("total", "maximize", "bottleneck")


def read_or_library_assignment(path: Path) -> np.ndarray:
    """OR-Library assignment format (its README): n, then the n x n costs row by row."""
    numbers = path.read_text().split()
    n = int(numbers[0])
    cells = np.array([int(x) for x in numbers[1:]], dtype=float)
    assert cells.size == n * n, f"{path.name}: expected {n * n} costs, found {cells.size}"
    return cells.reshape(n, n)


# ----------------------------------------------------------------- OR-Library (Beasley 1990)

@pytest.mark.parametrize("name, optimum", [("assign100.txt", 305), ("assign500.txt", 991)])
def test_or_library_published_optimum(or_library, name, optimum):
    # Published optima: OR-Library (J. E. Beasley 1990), assignment/README.md.
    costs = read_or_library_assignment(or_library / "assignment" / name)
    result = solve(costs)
    assert result.verify()
    check_result(result, costs)
    assert result.total == optimum
    # A permutation (square, all allowed): everyone placed.
    assert sorted(result.machine_of_job.tolist()) == list(range(costs.shape[0]))
    # LP duality: the potentials sum to the published optimum (Kuhn 1955).
    assert np.isclose(result.job_potential.sum() + result.machine_potential.sum(), optimum)


def test_or_library_assign100_transposed_and_maximized(or_library):
    # Published optimum 305 (Beasley 1990) also for the transpose; maximising 101 - c is the
    # same problem, so its optimum is 100 * 101 - 305.
    costs = read_or_library_assignment(or_library / "assignment" / "assign100.txt")
    result_t = solve(costs.T)
    assert result_t.verify() and result_t.total == 305
    result_max = solve(101 - costs, maximize=True)
    assert result_max.verify()
    check_result(result_max, 101 - costs)
    assert result_max.total == 100 * 101 - 305


# ----------------------------------------------------------------- brute force (the definition)

def _random_problem(rng: np.random.Generator, m: int, n: int, density: float, with_extras: bool):
    values = rng.integers(0, 20, size=(m, n))
    allowed = rng.random((m, n)) < density
    penalty = rng.integers(0, 30, size=m) if with_extras else None
    must = (rng.random(m) < 0.25) if with_extras else None
    return values, allowed, penalty, must


def _compare_with_brute(values, allowed, penalty, must, objective):
    # Reference: enumeration of every plan (brute force), issue 2's definition.
    expect = brute_force(values, allowed, penalty, must, objective)
    if not expect.feasible:
        with pytest.raises(InfeasibleError) as info:
            solve(values, allowed, objective=objective, wait_penalty=penalty, must_run=must)
        witness = info.value.witness
        assert witness.holds(allowed)
        return
    result = solve(values, allowed, objective=objective, wait_penalty=penalty, must_run=must)
    assert result.verify()
    check_result(result, values, allowed, penalty, must)
    assert result.planned_count == expect.placed
    assert result.total == pytest.approx(expect.total)
    assert result.bottleneck == expect.bottleneck


@pytest.mark.parametrize("objective", OBJECTIVES)
@pytest.mark.parametrize("m, n", [(m, n) for m in range(0, 6) for n in range(0, 6)])
def test_brute_force_small_shapes(objective, m, n):
    # Reference: brute-force enumeration of every plan, each shape 0..5 x 0..5, two masks.
    rng = np.random.default_rng(1000 * m + 10 * n + OBJECTIVES.index(objective))
    for density, extras in ((1.0, False), (0.6, True), (0.35, True)):
        _compare_with_brute(*_random_problem(rng, m, n, density, extras), objective)


@pytest.mark.parametrize("seed", range(3))
@pytest.mark.parametrize("objective", OBJECTIVES)
def test_brute_force_eight_by_eight(seed, objective):
    # Reference: brute-force enumeration of all 8! = 40320 permutations (dense) and of
    # every plan of a sparse 8 x 8 grid with wait penalties and must-run jobs.
    rng = np.random.default_rng(seed)
    dense = rng.integers(0, 1000, size=(8, 8))
    assert sum(1 for _ in enumerate_plans(np.ones((8, 8), bool), np.zeros(8, bool), 8)) == 40320
    _compare_with_brute(dense, None, None, None, objective)
    _compare_with_brute(*_random_problem(rng, 8, 8, 0.3, True), objective)


@pytest.mark.parametrize("m, n", [(8, 5), (5, 8), (7, 3), (3, 7)])
@pytest.mark.parametrize("objective", OBJECTIVES)
def test_brute_force_rectangular_up_to_eight(m, n, objective):
    # Reference: brute-force enumeration of every plan.
    rng = np.random.default_rng(m * 10 + n)
    _compare_with_brute(*_random_problem(rng, m, n, 0.7, True), objective)


problem_sizes = st.tuples(st.integers(0, 6), st.integers(0, 6))


@settings(max_examples=300, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(data=st.data(), shape=problem_sizes, objective=st.sampled_from(OBJECTIVES))
def test_brute_force_hypothesis(data, shape, objective):
    # Reference: brute-force enumeration of every plan, on hypothesis-drawn grids.
    m, n = shape
    seed = data.draw(st.integers(0, 2**32 - 1))
    density = data.draw(st.sampled_from([1.0, 0.7, 0.4, 0.15]))
    extras = data.draw(st.booleans())
    rng = np.random.default_rng(seed)
    _compare_with_brute(*_random_problem(rng, m, n, density, extras), objective)


def test_brute_force_ties_and_zero_values():
    # Reference: brute-force enumeration; all-equal values make every permutation optimal.
    values = np.full((6, 6), 7)
    for objective in OBJECTIVES:
        _compare_with_brute(values, None, None, None, objective)
    _compare_with_brute(np.zeros((4, 6)), None, np.zeros(4), None, "total")


# ----------------------------------------------------------------- rearrangement inequality

@pytest.mark.parametrize("n", [1, 2, 3, 7, 20, 64, 150, 300])
def test_product_grid_rearrangement(n):
    # Mathematical fact (rearrangement inequality, Hardy-Littlewood-Polya 1934, ch. X): for
    # c(i, j) = i * j the minimum pairs the sorted sequences in opposite order, so the
    # optimum is sum of i * (n - 1 - i). A known hard case for augmenting-path codes.
    i = np.arange(n)
    costs = np.outer(i, i).astype(float)
    result = solve(costs)
    assert result.verify()
    check_result(result, costs)
    expect = sum(k * (n - 1 - k) for k in range(n))
    assert result.total == expect
    # The maximum pairs them in the same order: sum of i^2 (same inequality).
    best = solve(costs, maximize=True)
    assert best.verify()
    assert best.total == sum(k * k for k in range(n))


def test_product_grid_rearrangement_brute_force_small():
    # Cross-check of the formula itself by enumeration over all permutations (n <= 7).
    for n in range(1, 8):
        brute = min(sum(i * p for i, p in enumerate(perm)) for perm in itertools.permutations(range(n)))
        assert brute == sum(k * (n - 1 - k) for k in range(n))


# ----------------------------------------------------------------- row/column reduction

@settings(max_examples=150, deadline=None)
@given(n=st.integers(1, 9), seed=st.integers(0, 2**32 - 1), axis=st.sampled_from(["row", "column"]),
       data=st.data())
def test_row_or_column_reduction_shifts_total(n, seed, axis, data):
    # Mathematical fact (the reduction the Hungarian method rests on, Kuhn 1955): every
    # permutation uses each row and each column exactly once, so subtracting a constant
    # from one row or column of a square all-allowed grid lowers every plan's total by
    # exactly that constant; the old optimal plan stays optimal.
    rng = np.random.default_rng(seed)
    costs = rng.integers(0, 100, size=(n, n)).astype(float)
    before = solve(costs)
    assert before.verify()
    k = data.draw(st.integers(0, n - 1))
    line = costs[k] if axis == "row" else costs[:, k]
    shift = data.draw(st.integers(0, int(line.min())))  # values must stay >= 0
    reduced = costs.copy()
    if axis == "row":
        reduced[k] -= shift
    else:
        reduced[:, k] -= shift
    after = solve(reduced)
    assert after.verify()
    check_result(after, reduced)
    assert after.total == before.total - shift
    old_plan_total = reduced[np.arange(n), before.machine_of_job].sum()
    assert old_plan_total == after.total
