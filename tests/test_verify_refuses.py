"""Every ``verify()`` says no when its claim is false.

A check that can only say "yes" proves nothing. Each test takes a correct result (which
must verify), breaks one claim the way a bug would (a corrupted potential, two jobs
swapped to a worse plan, a non-optimal permutation, a dropped wait penalty, a square that
is not the problem), and expects the check to refuse it. Which plan is worse is decided by
the totals recomputed here, and the optimum by scipy's ``linear_sum_assignment`` on a
rectangular encoding built in tests/helpers_reference.py (independent of the engine).
"""

from __future__ import annotations

import dataclasses

import numpy as np
import pytest
from helpers_reference import check_result, scipy_reference
from hypothesis import given, settings
from hypothesis import strategies as st

from dispatcher.engine import fill_shift, solve
from dispatcher.engine.certificate import (
    Certificate,
    CertificateError,
    potentials_from_plan,
)
from dispatcher.engine.fill_shift import _plan_total as shift_total
from dispatcher.engine.fill_shift import run_order


def _replace_certificate(result, **fields):
    cert = dataclasses.replace(result.certificate, **fields)
    return dataclasses.replace(result, certificate=cert)


def _square_problem(seed: int, n: int = 6):
    rng = np.random.default_rng(seed)
    return rng.integers(1, 30, (n, n)).astype(float)


# --------------------------------------------------------------------------- certificate

@pytest.mark.parametrize("seed", range(5))
def test_certificate_refuses_a_planned_pair_made_loose(seed):
    result = solve(_square_problem(seed))
    cert = result.certificate
    assert cert.verify()
    u = cert.row_potential.copy()
    u[seed % len(u)] -= 1.0  # planned pair now has reduced cost 1, not 0
    assert not dataclasses.replace(cert, row_potential=u).verify()
    v = cert.col_potential.copy()
    v[seed % len(v)] += 1.0  # planned pair now has reduced cost -1
    assert not dataclasses.replace(cert, col_potential=v).verify()


@pytest.mark.parametrize("seed", range(5))
def test_certificate_refuses_a_negative_reduced_cost_off_the_plan(seed):
    # Shift potential from a row to its planned column: every planned pair stays tight,
    # but the row's other pairs drop below zero once the shift exceeds their slack.
    result = solve(_square_problem(seed))
    cert = result.certificate
    i = seed % cert.cost.shape[0]
    slack = cert.reduced_costs()[i]
    shift = float(np.sort(slack)[1]) + 1.0  # more than the least slack off the plan
    u, v = cert.row_potential.copy(), cert.col_potential.copy()
    u[i] += shift
    v[cert.col_of_row[i]] -= shift
    broken = dataclasses.replace(cert, row_potential=u, col_potential=v)
    red = broken.reduced_costs()
    assert np.allclose(red[np.arange(len(u)), cert.col_of_row], 0)  # plan still tight
    assert red.min() < 0
    assert not broken.verify()


@pytest.mark.parametrize("seed", range(5))
def test_certificate_refuses_two_jobs_swapped_to_a_worse_plan(seed):
    values = _square_problem(seed)
    result = solve(values)
    cert = result.certificate
    best = float(values[np.arange(6), cert.col_of_row].sum())
    for a in range(6):
        for b in range(a + 1, 6):
            cols = cert.col_of_row.copy()
            cols[[a, b]] = cols[[b, a]]
            worse = float(values[np.arange(6), cols].sum()) > best
            swapped = dataclasses.replace(cert, col_of_row=cols)
            assert swapped.verify() is not worse  # an equally cheap swap is still optimal
            # A dispatch result claiming the swapped plan is refused when it is worse.
            plan = np.where(cols < 6, cols, -1)
            claim = dataclasses.replace(result, machine_of_job=plan, certificate=swapped,
                                        total=float(values[np.arange(6), cols].sum()))
            assert claim.verify() is not worse


def test_certificate_refuses_what_is_not_a_plan():
    cert = solve(_square_problem(0)).certificate
    cols = cert.col_of_row.copy()
    cols[0] = cols[1]  # two rows on one column
    assert not dataclasses.replace(cert, col_of_row=cols).verify()
    cost = cert.cost.copy()
    cost[0, cert.col_of_row[0]] = np.inf  # a planned pair that is not allowed
    assert not dataclasses.replace(cert, square=cost).verify()
    assert not dataclasses.replace(cert, square=cert.cost[:, :5]).verify()  # not square


@settings(max_examples=40, deadline=None)
@given(st.integers(2, 7), st.integers(0, 2**32 - 1))
def test_potentials_refuse_a_non_optimal_permutation(n, seed):
    rng = np.random.default_rng(seed)
    values = rng.integers(0, 20, (n, n)).astype(float)
    best = scipy_reference(values).total
    perm = rng.permutation(n)
    if float(values[np.arange(n), perm].sum()) > best:
        with pytest.raises(CertificateError, match="not optimal"):
            potentials_from_plan(values, perm)
    else:  # an optimal permutation gets potentials that prove it
        u, v = potentials_from_plan(values, perm)
        assert Certificate(values, perm, u, v, np.zeros(n), np.zeros(n)).verify()


# --------------------------------------------------------------------------- dispatch result

def _waiting_problem():
    # 3 jobs, 2 machines: one job waits. Job 2's wait penalty (50) makes it the one to run.
    values = np.array([[1.0, 1.0], [1.0, 1.0], [3.0, 3.0]])
    penalty = np.array([0.0, 1.0, 50.0])
    return values, penalty


def test_result_refuses_a_square_with_the_wait_penalty_dropped():
    values, penalty = _waiting_problem()
    good = solve(values, wait_penalty=penalty)
    assert good.verify() and good.total == scipy_reference(values, None, penalty).total == 4.0
    # The bug: the engine's square carries no wait penalties. Its plan is then optimal for
    # that square and the potentials prove it, but it is not the problem.
    bad = solve(values)
    assert bad.machine_of_job[2] < 0
    claim = dataclasses.replace(
        bad, wait_penalty=penalty,
        total=float(values[np.flatnonzero(bad.machine_of_job >= 0),
                           bad.machine_of_job[bad.machine_of_job >= 0]].sum() + 50.0))
    assert claim.certificate.verify()  # the square alone cannot tell
    assert not claim.verify()


def test_result_refuses_a_square_that_is_not_the_problem():
    values, penalty = _waiting_problem()
    good = solve(values, wait_penalty=penalty, must_run=[2])
    assert good.verify()
    cost = good.certificate.cost.copy()
    # Must-run dropped from the square: job 2 could wait at some cost.
    other = dataclasses.replace(good, must_run=np.zeros(3, dtype=bool))
    assert not other.verify()
    cost[0, 0] += 1.0  # a value changed in the square
    assert not _replace_certificate(good, square=cost).verify()
    cost = good.certificate.cost.copy()
    cost[-1, 0] = 1.0  # an idle row that costs something
    assert not _replace_certificate(good, square=cost).verify()


def test_maximize_result_refuses_a_value_off_the_constant_shift():
    values = np.array([[5.0, 2.0], [4.0, 1.0], [3.0, 3.0]])
    good = solve(values, objective="maximize", wait_penalty=[1.0, 2.0, 3.0])
    assert good.verify()
    cost = good.certificate.cost.copy()
    cost[1, 1] -= 0.5
    assert not _replace_certificate(good, square=cost).verify()


def test_result_refuses_corrupted_potentials_cover_and_total():
    values, penalty = _waiting_problem()
    good = solve(values, wait_penalty=penalty)
    u = good.job_potential.copy()
    u[0] += 5.0
    assert not dataclasses.replace(good, job_potential=u).verify()
    assert not dataclasses.replace(good, total=good.total - 1).verify()
    assert not dataclasses.replace(good, cover_jobs=np.zeros(3, bool),
                                   cover_machines=np.zeros(2, bool)).verify()
    plan = good.machine_of_job.copy()
    plan[plan >= 0] = plan[plan >= 0][0]  # two jobs on one machine
    assert not dataclasses.replace(good, machine_of_job=plan).verify()
    must = np.zeros(3, dtype=bool)
    must[good.waiting_jobs] = True  # a must-run job left waiting
    assert not dataclasses.replace(good, must_run=must).verify()


# --------------------------------------------------------------------------- shift plan

def _rebuilt_shift(plan, machine_of_job, *, keep_total=False):
    """The same shift plan with another placement, every derived field made consistent."""
    placed = machine_of_job >= 0
    rows = np.flatnonzero(placed)
    hours_used = np.bincount(machine_of_job[placed], weights=plan.hours[rows, machine_of_job[placed]],
                             minlength=plan.values.shape[1]).astype(float)
    order = tuple(run_order(np.flatnonzero(machine_of_job == j), plan.must_run,
                            np.full(len(machine_of_job), np.nan))
                  for j in range(plan.values.shape[1]))
    total = plan.total if keep_total else shift_total(plan.values, machine_of_job,
                                                      plan.wait_penalty, plan.objective)
    return dataclasses.replace(plan, machine_of_job=machine_of_job, hours_used=hours_used,
                               jobs_on_machine=order, total=total,
                               gap=abs(total - plan.bound) / max(abs(total), 1.0))


def _shift_example():
    values = np.array([[1.0, 6.0], [6.0, 1.0], [2.0, 2.0]])
    hours = np.full((3, 2), 2.0)
    return fill_shift(values, hours, [4.0, 2.0], wait_penalty=[9.0, 9.0, 9.0])


def test_shift_plan_refuses_a_swap_to_a_worse_plan():
    plan = _shift_example()
    assert plan.verify() and plan.proven_optimal
    worse = plan.machine_of_job.copy()
    worse[[0, 1]] = worse[[1, 0]]  # each job on the other's machine: same hours, more setup
    rebuilt = _rebuilt_shift(plan, worse)
    assert rebuilt.total > plan.total
    assert not rebuilt.verify()  # "proven optimal" no longer holds for this plan
    # Re-labelled as unproven with its gap, the worse plan is an honest answer.
    assert dataclasses.replace(rebuilt, proven_optimal=False).verify()


def test_shift_plan_refuses_a_dropped_wait_penalty_and_broken_fields():
    values = np.array([[1.0, 6.0], [6.0, 1.0], [2.0, 2.0]])
    plan = fill_shift(values, np.full((3, 2), 2.0), [2.0, 2.0], wait_penalty=[9.0, 9.0, 4.0])
    assert plan.verify() and plan.waiting_jobs.tolist() == [2]
    assert plan.total == 1 + 1 + 4
    # The wait penalty dropped from the total, or from the plan's own problem: refused.
    assert not dataclasses.replace(plan, total=plan.total - 4.0).verify()
    assert not dataclasses.replace(plan, wait_penalty=np.zeros(3)).verify()
    over = plan.machine_of_job.copy()
    over[:] = 1  # every job on one 2-hour machine
    assert not _rebuilt_shift(plan, over).verify()
    assert not dataclasses.replace(plan, gap=0.5).verify()
    assert not dataclasses.replace(plan, hours_used=plan.hours_used + 1).verify()
    assert not dataclasses.replace(plan, jobs_on_machine=plan.jobs_on_machine[::-1]).verify()
    assert not dataclasses.replace(plan, must_run=np.ones(3, dtype=bool)).verify()
    pinned = np.array([-1, -1, 0])
    assert not dataclasses.replace(plan, pinned_machine=pinned).verify()


# --------------------------------------------------------------------------- the reference check

def test_reference_check_refuses_a_square_with_the_wait_penalty_dropped():
    # check_result rebuilds the square from the values and penalties and compares the
    # total with scipy: a result whose own square lacks the penalties cannot pass it.
    values, penalty = _waiting_problem()
    check_result(solve(values, wait_penalty=penalty), values, None, penalty)
    bad = solve(values)
    placed = bad.machine_of_job >= 0
    claim = dataclasses.replace(
        bad, wait_penalty=penalty,
        total=float(values[np.flatnonzero(placed), bad.machine_of_job[placed]].sum() + 50.0))
    with pytest.raises(AssertionError):
        check_result(claim, values, None, penalty)
    # Even with the right total claimed, the square is not the problem's.
    with pytest.raises(AssertionError):
        check_result(dataclasses.replace(claim, total=4.0), values, None, penalty)


def test_reference_check_refuses_a_worse_plan_with_consistent_potentials():
    # A plan optimal for a square that differs from the problem in one value: its own
    # potentials prove it, but scipy on the problem finds a cheaper plan.
    values = np.array([[1.0, 5.0], [5.0, 1.0]])
    altered = values.copy()
    altered[0, 0] = 20.0
    bad = solve(altered)
    claim = dataclasses.replace(bad, values=values,
                                total=float(values[[0, 1], bad.machine_of_job].sum()))
    assert claim.certificate.verify()
    with pytest.raises(AssertionError):
        check_result(claim, values)
