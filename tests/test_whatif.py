"""Exact what-if costs (dispatcher.engine.whatif) against forced re-solves.

Reference: for every cell, a re-solve with scipy (through ``solve``) of the grid where the
job may use only that machine and that machine only that job, the job must run, and the
plan must still place as many jobs as the original grid allows; where that is impossible
the what-if must say so (NaN).
"""

from __future__ import annotations

import itertools

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.optimize import linear_sum_assignment

from dispatcher.engine import InfeasibleError, solve, what_if
from dispatcher.engine.whatif import alternating_distances
from helpers_reference import scipy_reference


def forced(values, allowed, penalty, must, objective, job, machine, placed):
    """Total of the best plan with job on machine (machine=-1: job waits), or None."""
    a, m = allowed.copy(), must.copy()
    if machine >= 0:
        a[job, :] = False
        a[:, machine] = False
        a[job, machine] = allowed[job, machine]
        m[job] = True
    else:
        if must[job]:
            return None
        a[job, :] = False
    try:
        res = solve(values, a, wait_penalty=penalty, must_run=m, objective=objective)
    except InfeasibleError:
        return None
    return res.total if res.planned_count == placed else None


@settings(max_examples=60, deadline=None)
@given(st.integers(0, 6), st.integers(0, 6), st.integers(0, 2**32 - 1),
       st.sampled_from([1.0, 0.7, 0.4]), st.sampled_from(["total", "maximize"]),
       st.booleans())
def test_every_cell_equals_a_forced_re_solve(n_jobs, n_machines, seed, density, objective, rush):
    rng = np.random.default_rng(seed)
    values = rng.integers(0, 6, (n_jobs, n_machines)).astype(float)
    allowed = rng.random((n_jobs, n_machines)) < density
    penalty = rng.integers(0, 8, n_jobs).astype(float)
    must = (rng.random(n_jobs) < 0.3) if rush else np.zeros(n_jobs, dtype=bool)
    try:
        base = solve(values, allowed, wait_penalty=penalty, must_run=must, objective=objective)
    except InfeasibleError:
        # Reference: scipy's linear_sum_assignment on an encoding built in the helper.
        assert not scipy_reference(values, allowed, penalty, must).feasible
        return
    result = what_if(base)
    sign = -1.0 if objective == "maximize" else 1.0
    for job, machine in itertools.product(range(n_jobs), range(-1, n_machines)):
        got = result.extra[job, machine] if machine >= 0 else result.wait_extra[job]
        ref = forced(values, allowed, penalty, must, objective, job, machine, base.planned_count)
        if ref is None:
            assert np.isnan(got), (job, machine)
        else:
            assert got == pytest.approx(sign * (ref - base.total), abs=1e-9), (job, machine)
    for job in range(n_jobs):
        on = base.machine_of_job[job]
        if on >= 0:
            assert result.extra[job, on] == 0.0
        others = [(result.extra[job, m], m) for m in range(n_machines)
                  if m != on and not np.isnan(result.extra[job, m])]
        if others:
            assert result.best_other_extra[job] == min(others)[0]
            assert result.extra[job, result.best_other[job]] == min(others)[0]
        else:
            assert result.best_other[job] == -1 and np.isnan(result.best_other_extra[job])


def test_float_grid_matches_scipy_forced_solves():
    # Reference: scipy's linear_sum_assignment with the forced pair removed from the grid.
    rng = np.random.default_rng(11)
    values = rng.random((9, 9)) * 50
    base = solve(values)
    result = what_if(base)
    for job, machine in itertools.product(range(9), range(9)):
        rest = np.delete(np.delete(values, job, axis=0), machine, axis=1)
        rows, cols = linear_sum_assignment(rest)
        expected = values[job, machine] + rest[rows, cols].sum() - base.total
        assert result.extra[job, machine] == pytest.approx(expected, abs=1e-9)


def test_floyd_distances_match_networkx():
    # Reference: networkx Floyd-Warshall on the same weighted digraph (zero arcs included).
    import networkx as nx
    rng = np.random.default_rng(5)
    w = rng.integers(0, 4, (8, 8)).astype(float)
    w[rng.random((8, 8)) < 0.4] = np.inf
    graph = nx.DiGraph()
    graph.add_nodes_from(range(8))
    for a, b in zip(*np.nonzero(np.isfinite(w))):
        if a != b:
            graph.add_edge(int(a), int(b), weight=float(w[a, b]))
    ref = nx.floyd_warshall_numpy(graph, nodelist=range(8))
    assert np.array_equal(alternating_distances(w), ref)


def test_bottleneck_is_refused():
    with pytest.raises(ValueError, match=r"^what-if costs are defined for the 'total' and "
                                         r"'maximize' objectives$"):
        what_if(solve(np.ones((2, 2)), objective="bottleneck"))


@pytest.mark.parametrize("shape", [(0, 0), (2, 0), (0, 3), (1, 4), (4, 1)])
def test_degenerate_shapes(shape):
    result = what_if(solve(np.ones(shape)))
    assert result.extra.shape == shape
    assert result.wait_extra.shape == (shape[0],)
    assert result.best_other.shape == result.best_other_extra.shape == (shape[0],)
    if shape[1] == 0:  # no machine: no other machine for anyone
        assert (result.best_other == -1).all() and np.isnan(result.best_other_extra).all()


@pytest.mark.parametrize(("values", "allowed", "must"), [
    ([[3.0]], [[True]], [True]),        # the only plan: the job on the machine, it cannot wait
    ([[3.0]], [[True]], [False]),
    ([[3.0]], [[False]], [False]),      # the pair is not allowed: the job waits
    ([[3.0, 1.0]], [[True, True]], [True]),
])
def test_tiny_grids_match_forced_re_solves(values, allowed, must):
    # Reference: the forced re-solves above (scipy through solve) and, for a must-run job,
    # the definition: no plan keeps it waiting.
    values, allowed, must = np.array(values), np.array(allowed), np.array(must)
    penalty = np.zeros(len(values))
    base = solve(values, allowed, wait_penalty=penalty, must_run=must)
    result = what_if(base)
    for job, machine in itertools.product(range(values.shape[0]), range(-1, values.shape[1])):
        got = result.extra[job, machine] if machine >= 0 else result.wait_extra[job]
        ref = forced(values, allowed, penalty, must, "total", job, machine, base.planned_count)
        if ref is None:
            assert np.isnan(got), (job, machine)
        else:
            assert got == pytest.approx(ref - base.total, abs=1e-9), (job, machine)


def test_distances_leave_the_weights_as_they_were():
    # The caller's matrix is read, never overwritten (Floyd's updates go to a copy).
    w = np.array([[0.0, 5.0, 1.0], [np.inf, 0.0, np.inf], [np.inf, 1.0, 0.0]])
    before = w.copy()
    assert alternating_distances(w)[0, 1] == 2.0  # 0 -> 2 -> 1
    assert np.array_equal(w, before)
