"""Rush jobs as a priority: the most jobs, then the most rush jobs, then the objective.

References: brute-force enumeration of every plan (tests/helpers_reference.py), Konig's
theorem (a vertex cover as large as a matching proves it maximum) and Hall's condition
(a set of rush jobs whose machines are fewer than they are), both checked by hand.
"""

from __future__ import annotations

import numpy as np
import pytest

from dispatcher.engine import InfeasibleError, redispatch, solve
from helpers_reference import brute_force, check_result, witness_holds_by_hand


def _random_case(rng: np.random.Generator):
    m, n = int(rng.integers(1, 6)), int(rng.integers(1, 5))
    values = rng.integers(0, 10, size=(m, n)).astype(float)
    allowed = rng.random((m, n)) < 0.55
    penalty = rng.integers(0, 6, size=m).astype(float)
    rush = rng.random(m) < 0.5
    must = (rng.random(m) < 0.15) & ~rush
    return values, allowed, penalty, rush, must


def test_rush_conflict_places_the_most_rush_jobs_and_the_ordinary_job_waits():
    # Presses P1, P2; rush jobs A and B only on P1, rush job C only on P2, D on either.
    values = np.array([[5, 0], [6, 0], [0, 4], [1, 1]], dtype=float)
    allowed = np.array([[1, 0], [1, 0], [0, 1], [1, 1]], dtype=bool)
    rush = np.array([True, True, True, False])
    result = solve(values, allowed, rush=rush)
    assert result.verify()
    assert result.machine_of_job[2] == 1            # C on P2
    assert result.machine_of_job[3] == -1           # D waits
    assert sorted(result.machine_of_job[:2].tolist()) == [-1, 0]  # one of A/B on P1
    assert result.rush_waiting.size == 1
    (group,) = result.rush_wait_groups()
    assert sorted(group.jobs.tolist()) == [0, 1] and group.machines.tolist() == [0]
    assert witness_holds_by_hand(allowed[:2], [0, 1], [0])


@pytest.mark.parametrize("objective", ["total", "maximize", "bottleneck"])
def test_rush_priority_matches_brute_force(objective):
    rng = np.random.default_rng(11)
    for _ in range(150):
        values, allowed, penalty, rush, must = _random_case(rng)
        ref = brute_force(values, allowed, penalty, must, objective, rush=rush)  # brute force
        if not ref.feasible:
            with pytest.raises(InfeasibleError):
                solve(values, allowed, objective=objective, wait_penalty=penalty,
                      must_run=must, rush=rush)
            continue
        result = solve(values, allowed, objective=objective, wait_penalty=penalty,
                       must_run=must, rush=rush)
        assert result.verify()
        check_result(result, values, allowed, penalty, must, reference=ref, rush=rush)
        placed = result.machine_of_job >= 0
        assert int(placed.sum()) == ref.placed
        assert int((placed & rush).sum()) == ref.rush_placed
        assert np.isclose(result.total, ref.total)
        if objective == "bottleneck":
            assert result.bottleneck == ref.bottleneck
        # Every named group of waiting rush jobs is a Hall witness among rush/must jobs.
        prio = rush | must
        for w in result.rush_wait_groups():
            assert prio[w.jobs].all()
            sub = np.where(prio[:, None], allowed, False)
            assert witness_holds_by_hand(sub, w.jobs, w.machines)
        waiting_named = {int(j) for w in result.rush_wait_groups() for j in w.jobs
                         if result.machine_of_job[j] < 0}
        assert waiting_named == set(result.rush_waiting.tolist())


def test_rush_cover_that_misses_a_rush_pair_fails_verify():
    values = np.array([[5, 0], [6, 0], [0, 4], [1, 1]], dtype=float)
    allowed = np.array([[1, 0], [1, 0], [0, 1], [1, 1]], dtype=bool)
    result = solve(values, allowed, rush=[0, 1, 2])
    assert result.verify()
    cover = result.rush_cover_machines.copy()
    cover[:] = False
    broken = type(result)(**{**result.__dict__, "rush_cover_machines": cover})
    assert not broken.verify()
    assert not type(result)(**{**result.__dict__, "rush_cover_jobs": None}).verify()


def test_plan_that_leaves_a_placeable_rush_job_waiting_fails_verify():
    # Swapping a placed rush job for the ordinary job keeps the job count but not the rush
    # count: the Konig cover restricted to rush rows cannot be as small as the rush placed.
    values = np.array([[5, 0], [6, 0], [0, 4], [1, 1]], dtype=float)
    allowed = np.array([[1, 0], [1, 0], [0, 1], [1, 1]], dtype=bool)
    rush = np.array([True, True, True, False])
    result = solve(values, allowed, rush=rush)
    plan = result.machine_of_job.copy()
    plan[2], plan[3] = -1, 1
    tampered = type(result)(**{**result.__dict__, "machine_of_job": plan})
    assert not tampered._rush_count_proven()


def test_redispatch_with_rush_conflict_equals_cold_solve():
    rng = np.random.default_rng(5)
    for _ in range(80):
        values, allowed, penalty, rush, _ = _random_case(rng)
        first = solve(values, allowed, wait_penalty=penalty, rush=rush)
        down = [int(rng.integers(0, values.shape[1]))]
        after = redispatch(first, machines_down=down)
        cut = allowed.copy()
        cut[:, down] = False
        ref = brute_force(values, cut, penalty, None, "total", rush=rush)  # brute force
        assert after.verify()
        assert np.isclose(after.total, ref.total)
        assert int(((after.machine_of_job >= 0) & rush).sum()) == ref.rush_placed


def test_whole_shift_places_the_most_rush_jobs_among_plans_with_the_most_jobs():
    # Brute force over every assignment of 5 jobs to 2 machines or waiting, with hours.
    import itertools

    from dispatcher.engine import fill_shift

    rng = np.random.default_rng(4)
    for _ in range(25):
        m, n = 5, 2
        values = rng.integers(0, 9, size=(m, n)).astype(float)
        hours = rng.integers(1, 4, size=(m, n)).astype(float)
        cap = rng.integers(2, 6, size=n).astype(float)
        rush = rng.random(m) < 0.5
        best = None
        for combo in itertools.product(range(-1, n), repeat=m):
            load = np.zeros(n)
            for i, j in enumerate(combo):
                if j >= 0:
                    load[j] += hours[i, j]
            if (load > cap).any():
                continue
            placed = sum(j >= 0 for j in combo)
            rush_placed = sum(j >= 0 and rush[i] for i, j in enumerate(combo))
            total = sum(values[i, j] for i, j in enumerate(combo) if j >= 0)
            key = (-placed, -rush_placed, total)
            best = key if best is None or key < best else best
        plan = fill_shift(values, hours, cap, priority=rush)
        got = plan.machine_of_job
        assert plan.verify()
        assert (-(got >= 0).sum(), -((got >= 0) & rush).sum()) == best[:2]
        assert plan.total == pytest.approx(best[2])
