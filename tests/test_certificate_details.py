"""The parts of an optimality certificate, each pinned where a slip would still pass the plan tests.

References, named at each test: the formula in ``tolerance``'s docstring (a slack scaled to
the data, common practice); scipy's ``linear_sum_assignment`` for the optimum that the
potentials must prove, and LP duality for assignment (Kuhn 1955: the potentials' sum equals
the optimum, every reduced cost is >= 0); the dispatch layout of the square (jobs then idle
rows, machines then wait slots), built here entry by entry.
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st
from scipy.optimize import linear_sum_assignment

from dispatcher.engine.certificate import (
    Certificate,
    CertificateError,
    potentials_from_plan,
    tolerance,
)


def certificate(square, col_of_row=None, u=None, v=None) -> Certificate:
    n = square.shape[0]
    cols = np.arange(n) if col_of_row is None else np.asarray(col_of_row)
    u = np.zeros(n) if u is None else np.asarray(u, dtype=float)
    v = np.zeros(square.shape[1]) if v is None else np.asarray(v, dtype=float)
    return Certificate(square, cols, u, v, np.zeros(n), np.zeros(n))


# --------------------------------------------------------------------------- tolerance

@pytest.mark.parametrize(("cost", "expected"), [
    (np.zeros((0, 0)), 1e-9),                             # no rows: max(1, 0) = 1
    (np.array([[0.5]]), 1e-9),                            # |cost| < 1 counts as 1
    (np.array([[-5.0, np.inf], [2.0, 3.0]]), 1e-9 * 5 * 2),  # largest |finite|, inf ignored
    (np.array([[1.0, 7.0, 0.0], [2.0, 3.0, 4.0], [6.0, 5.0, 1.0]]), 1e-9 * 7 * 3),
    (np.full((4, 4), np.inf), 1e-9 * 4),                  # nothing finite: scale 1
])
def test_tolerance_follows_its_documented_formula(cost, expected):
    # Reference: the docstring's 1e-9 * max(1, largest |finite cost|) * max(1, rows).
    assert tolerance(cost) == pytest.approx(expected, rel=1e-15)


# --------------------------------------------------------------------------- verify's slack

@pytest.mark.parametrize("cost", [np.zeros((1, 1)), np.zeros((2, 2)),
                                  np.array([[0.0, 8.0], [8.0, 0.0]])])
def test_verify_allows_slack_up_to_its_tolerance_and_no_more(cost):
    # Row 0's potential raised by exactly the tolerance: its planned pair has reduced cost
    # -tol (|.| <= tol) and any other pair of the row at least -tol; a little more is refused.
    tol = tolerance(cost)
    n = cost.shape[0]
    at_limit = certificate(cost, u=np.r_[tol, np.zeros(n - 1)])
    assert at_limit.reduced_costs()[0].min() == -tol
    assert at_limit.verify()
    assert not certificate(cost, u=np.r_[1.01 * tol, np.zeros(n - 1)]).verify()
    assert not certificate(cost, u=np.r_[-1.01 * tol, np.zeros(n - 1)]).verify()


def test_verify_refuses_a_nan_anywhere():
    cost = np.array([[0.0, np.nan], [1.0, 0.0]])
    assert not certificate(cost).verify()


# --------------------------------------------------------------------------- potentials

@settings(max_examples=30, deadline=None)
@given(st.sampled_from([1, 2, 5, 33, 70]), st.integers(0, 2**32 - 1),
       st.sampled_from([1.0, 1e-9]), st.sampled_from([0.0, 0.3]))
def test_potentials_prove_scipys_optimum(n, seed, unit, forbidden):
    # Reference: scipy's linear_sum_assignment gives an optimal plan and its total; LP
    # duality (Kuhn 1955) says potentials proving it have sum(u) + sum(v) = that total and
    # reduced costs >= 0 up to the relaxation's slack (1e-3 of the tolerance). Costs in
    # steps of 1e-9 put every improvement below verify's tolerance but above that slack;
    # n = 33 and 70 relax the rows in more than one block.
    rng = np.random.default_rng(seed)
    cost = rng.integers(0, 5, (n, n)) * unit
    cost[rng.random((n, n)) < forbidden] = np.inf
    try:
        rows, cols = linear_sum_assignment(cost)
    except ValueError:  # scipy: no plan uses only allowed pairs
        return
    u, v = potentials_from_plan(cost, cols)
    assert u.shape == v.shape == (n,)
    red = cost - u[:, None] - v[None, :]
    slack = 1e-3 * tolerance(cost)
    assert (red[np.isfinite(cost)] >= -slack).all()
    assert np.abs(red[rows, cols]).max() <= slack
    assert u.sum() + v.sum() == pytest.approx(cost[rows, cols].sum(), abs=n * slack)


def test_potentials_of_an_empty_problem_are_empty():
    u, v = potentials_from_plan(np.zeros((0, 0)), np.zeros(0, dtype=np.int64))
    assert u.shape == v.shape == (0,)


def test_a_non_optimal_plan_is_refused_with_the_reason():
    # Reference: by hand, the plan (0->1, 1->0) costs 2 and the diagonal 0.
    cost = np.array([[0.0, 1.0], [1.0, 0.0]])
    with pytest.raises(CertificateError,
                       match=r"^plan is not optimal: the residual graph has a negative cycle$"):
        potentials_from_plan(cost, np.array([1, 0]))


# --------------------------------------------------------------------------- encodes

def layout(job_cost, wait_cost, n_idle, n_wait, last_wait_cost=None, n_last=0):
    """The dispatch square built entry by entry from the layout rule."""
    n_jobs, n_machines = job_cost.shape
    size = n_jobs + n_idle
    assert size == n_machines + n_wait
    out = np.empty((size, size))
    for i in range(size):
        for j in range(size):
            if i >= n_jobs:
                out[i, j] = 0.0 if j < n_machines else np.inf
            elif j < n_machines:
                out[i, j] = job_cost[i, j]
            elif j >= size - n_last:
                out[i, j] = last_wait_cost[i]
            else:
                out[i, j] = wait_cost[i]
    return out


JOB = np.array([[1.0, np.inf], [0.25, 0.5], [0.75, 1.0]])
WAIT = np.array([0.5, np.inf, 0.125])
LAST = np.array([np.inf, 0.375, np.inf])


def test_encodes_accepts_the_layout_and_refuses_each_wrong_part():
    square = layout(JOB, WAIT, 1, 2)  # 3 jobs + 1 idle row, 2 machines + 2 wait slots
    cert = certificate(square)
    no_last = np.full(3, np.inf)
    assert cert.encodes(JOB, WAIT, no_last, 0)
    for i, j, value in [(3, 0, 5.0),       # an idle row costing something on a machine
                        (3, 2, 0.0),       # an idle row that may wait
                        (0, 2, 0.75),      # a wait penalty changed
                        (1, 2, 0.0),       # a must-run job allowed to wait
                        (0, 1, 2.0),       # a forbidden pair made allowed
                        (2, 0, np.inf),    # an allowed pair forbidden
                        (2, 1, np.nan)]:
        wrong = square.copy()
        wrong[i, j] = value
        assert not certificate(wrong).encodes(JOB, WAIT, no_last, 0), (i, j, value)


def test_encodes_compares_within_rounding_only():
    # Reference: the slack documented at the check, 1e-12 relative plus 1e-3 of the
    # tolerance; costs here are at most 1, so 1e-14 is rounding and 1e-10 a real change.
    square = layout(JOB, WAIT, 1, 2)
    for delta, same in [(1e-14, True), (1e-10, False)]:
        near = square.copy()
        near[2, 1] += delta
        assert certificate(near).encodes(JOB, WAIT, np.full(3, np.inf), 0) is same, delta


def test_encodes_reads_the_last_wait_slots_as_kept_for_rush_jobs():
    square = layout(JOB, WAIT, 1, 2, LAST, 1)
    cert = certificate(square)
    assert cert.encodes(JOB, WAIT, LAST, 1)
    assert not cert.encodes(JOB, WAIT, LAST, 0)
    # Every wait slot kept for rush jobs: the largest count that leaves the machines alone.
    every = certificate(layout(JOB, WAIT, 1, 2, LAST, 2))
    assert every.encodes(JOB, WAIT, LAST, 2)
    assert not every.encodes(JOB, WAIT, LAST, 1)


def test_encodes_refuses_rush_slots_reaching_into_the_machines():
    # 2 jobs, 1 machine, 1 wait slot; "2 rush slots" would cover the machine column. Its
    # costs equal the rush wait costs here, so only the count check can tell.
    job = np.array([[3.0], [4.0]])
    last = np.array([3.0, 4.0])
    square = layout(job, np.full(2, np.inf), 0, 1, last, 1)
    assert certificate(square).encodes(job, np.full(2, np.inf), last, 1)
    assert not certificate(square).encodes(job, np.full(2, np.inf), last, 2)


def test_encodes_refuses_parts_of_the_wrong_size():
    square = layout(JOB, WAIT, 1, 2)
    cert = certificate(square)
    no_last = np.full(3, np.inf)
    big = np.zeros((5, 2))  # more jobs than the square has rows
    assert not cert.encodes(big, np.zeros(5), np.zeros(5), 0)
    assert not cert.encodes(JOB, np.r_[WAIT, 0.0], no_last, 0)  # one wait cost too many
    assert not certificate(square[:, :3]).encodes(JOB, WAIT, no_last, 0)  # not square


def test_potentials_are_the_shortest_path_distances_of_the_residual_graph():
    # Reference: networkx's Bellman-Ford on the residual graph of the identity plan (column
    # i -> column j costs cost(i, j) - cost(i, i)) from a source joined to every column at
    # 0; the potentials v are those distances. The chain 40 -> 5 -> 6 -> 7 settles only in a
    # third pass, and another improvement (35 -> 36) lands in the second block of rows
    # relaxed in the same pass, so the columns changed by the first block must be kept.
    import networkx as nx
    n = 64
    cost = np.full((n, n), 10.0)
    np.fill_diagonal(cost, 0.0)
    cost[63, :40] = -0.5
    for i, j in [(40, 5), (5, 6), (6, 7), (35, 36)]:
        cost[i, j] = -1.0
    plan = np.arange(n)
    assert cost[np.arange(n), linear_sum_assignment(cost)[1]].sum() == 0.0  # identity optimal
    graph = nx.DiGraph()
    graph.add_weighted_edges_from(("s", j, 0.0) for j in range(n))
    graph.add_weighted_edges_from((i, j, cost[i, j]) for i in range(n) for j in range(n)
                                  if i != j)
    distance = nx.single_source_bellman_ford_path_length(graph, "s")
    u, v = potentials_from_plan(cost, plan)
    assert v.tolist() == [distance[j] for j in range(n)]
    assert v[7] == -3.0
    assert (cost - u[:, None] - v[None, :] >= 0).all()
