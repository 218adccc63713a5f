"""StructuredSquare (the shared, undensified square matrix of a warm re-dispatch).

Reference: numpy's own indexing of the dense matrix the parts describe, built here entry by
entry from the layout rule (jobs x machines from the base, inf on blocked machines; wait
cost per job; idle rows 0 on machines, inf on wait slots), and ``solve`` + ``redispatch``
checked against scipy's ``linear_sum_assignment`` for chains of machines going down.
"""

from __future__ import annotations

import numpy as np
import pytest
from scipy.optimize import linear_sum_assignment

from dispatcher.engine import redispatch, solve
from dispatcher.engine.certificate import StructuredSquare


def by_rule(base, blocked, wait, n_idle):
    n_jobs, n_machines = base.shape
    size = n_jobs + n_idle
    out = np.empty((size, size))
    for i in range(size):
        for j in range(size):
            if i < n_jobs and j < n_machines:
                out[i, j] = np.inf if j in blocked else base[i, j]
            elif i < n_jobs:
                out[i, j] = wait[i]
            else:
                out[i, j] = 0.0 if j < n_machines else np.inf
    return out


@pytest.mark.parametrize("seed", range(40))
def test_every_supported_index_matches_the_dense_matrix(seed):
    rng = np.random.default_rng(seed)
    n_jobs, n_machines = int(rng.integers(0, 6)), int(rng.integers(1, 6))
    k = int(rng.integers(0, min(n_jobs, n_machines) + 1))
    base = rng.random((n_jobs, n_machines))
    base[rng.random(base.shape) < 0.2] = np.inf
    wait = rng.random(n_jobs)
    wait[rng.random(n_jobs) < 0.3] = np.inf
    blocked = rng.choice(n_machines, int(rng.integers(0, n_machines + 1)), replace=False)
    sq = StructuredSquare(base, blocked, wait, n_machines - k, n_jobs - k)
    dense = by_rule(base, set(blocked.tolist()), wait, n_machines - k)
    np.testing.assert_array_equal(sq.dense(), dense)
    size = dense.shape[0]
    assert sq.shape == dense.shape
    if size == 0:
        return
    for i in range(size):
        np.testing.assert_array_equal(sq[i], dense[i])
        np.testing.assert_array_equal(sq[np.int64(i)], dense[i])
    rows = rng.integers(0, size, int(rng.integers(0, 6)))
    cols = rng.integers(0, size, rows.size)
    np.testing.assert_array_equal(sq[rows], dense[rows])
    np.testing.assert_array_equal(sq[rows, cols], dense[rows, cols])
    some = rng.integers(0, size, 3)
    np.testing.assert_array_equal(sq[:, some], dense[:, some])
    np.testing.assert_array_equal(sq[np.ix_(rows, some)], dense[np.ix_(rows, some)])
    np.testing.assert_array_equal(sq[rows, int(some[0])], dense[rows, int(some[0])])
    i, j = int(some[1]), int(some[2])
    assert sq[i, j] == dense[i, j]


def test_unsupported_index_is_refused():
    sq = StructuredSquare(np.zeros((2, 2)), [], np.zeros(2), 0, 0)
    with pytest.raises(TypeError, match="column slices"):
        sq[np.array([0]), 0:1]
    with pytest.raises(TypeError, match="1-D array"):
        sq[np.array([True, False])]


def test_machines_going_down_share_the_grid_and_stay_exact():
    rng = np.random.default_rng(7)
    values = rng.integers(1, 30, (40, 40)).astype(float)
    result = solve(values)
    down: list[int] = []
    for machine in (3, 17, 29):
        down.append(machine)
        result = redispatch(result, machines_down=[machine])
        # The grid is shared, not copied: the new problem holds the first one's matrix.
        assert isinstance(result.certificate.square, StructuredSquare)
        assert result.verify()
        # Reference: scipy on the grid without the machines that are down.
        rest = np.delete(values, down, axis=1)
        rows, cols = linear_sum_assignment(rest)
        assert np.isclose(result.total, rest[rows, cols].sum())
    assert values.flags.writeable and np.isfinite(values).all()


@pytest.mark.parametrize(("rows", "cols"), [
    (np.array([[0, 3], [2, 1]]), np.array([[1, 0], [3, 2]])),  # element-wise, 2-D
    (np.array([[0], [3], [1]]), np.array([[1], [3], [2]])),    # two columns of equal length
    (np.array([[0], [3], [1]]), np.array([[[1, 3, 2, 0]]])),   # 3-D columns broadcast
    (np.array([[0], [3], [1]]), np.array([[1, 3, 2, 0]])),     # the outer form (np.ix_)
    (np.array([[0, 3], [2, 1], [3, 3]]), np.array([[1, 3]])),  # rows two wide, one column row
    (np.array([[[0]], [[3]], [[1]]]), np.array([[1, 3, 2, 0]])),  # 3-D rows broadcast
    ([], []),                                                  # nothing selected
])
def test_index_arrays_of_any_shape_match_the_dense_matrix(rows, cols):
    # Reference: numpy's indexing of the dense matrix built by the layout rule; 2 jobs and
    # 3 machines (one blocked), 2 idle rows, 1 wait slot.
    base = np.array([[1.0, 2.0, 3.0], [4.0, np.inf, 6.0]])
    wait = np.array([7.0, np.inf])
    sq = StructuredSquare(base, [1], wait, 2, 1)
    dense = by_rule(base, {1}, wait, 2)
    np.testing.assert_array_equal(sq[rows, cols], dense[rows, cols])
    np.testing.assert_array_equal(sq[[]], dense[[]])
    np.testing.assert_array_equal(sq[:, []], dense[:, []])


def test_unsupported_index_is_refused_with_the_reason():
    sq = StructuredSquare(np.zeros((2, 2)), [], np.zeros(2), 0, 0)
    columns = r"^m\[:, cols\] needs a 1-D array of columns$"
    with pytest.raises(TypeError, match=columns):
        sq[:, :]
    with pytest.raises(TypeError, match=columns):
        sq[:, np.zeros((1, 2), dtype=int)]
    with pytest.raises(TypeError, match=r"^column slices are not supported$"):
        sq[np.array([0]), 0:1]
    rows = r"^rows are selected by an int or a 1-D array of ints$"
    with pytest.raises(TypeError, match=rows):
        sq[np.array([True, False])]
    with pytest.raises(TypeError, match=rows):
        sq[np.zeros((2, 1), dtype=int)]


def test_parts_that_do_not_make_a_square_are_refused():
    with pytest.raises(ValueError, match=r"^wait needs 2 entries, got \(3,\)$"):
        StructuredSquare(np.zeros((2, 2)), [], np.zeros(3), 0, 0)
    with pytest.raises(ValueError,
                       match=r"^rows \(jobs \+ idle\) and columns \(machines \+ wait\) differ$"):
        StructuredSquare(np.zeros((2, 3)), [], np.zeros(2), 0, 0)
