"""Matching facts on the allowed pairs (dispatcher.engine.matching), checked from outside.

References: networkx's Hopcroft-Karp matching (``networkx.bipartite.maximum_matching``) for
the matching size and its connected components for the groups; brute force over every
subset of vertices for the smallest vertex cover (Konig 1931: it has as many vertices as a
maximum matching has pairs); Hall's condition checked by hand with plain loops over the
mask (every allowed machine of the witness jobs is among its machines, and there are
fewer machines than jobs).
"""

from __future__ import annotations

from itertools import combinations

import networkx as nx
import numpy as np
import pytest

from dispatcher.engine.matching import (
    HallWitness,
    alternating_reach,
    hall_witness,
    hall_witness_groups,
    konig_cover,
    maximum_matching,
)


def masks(count: int, seed: int = 11):
    rng = np.random.default_rng(seed)
    for _ in range(count):
        n_jobs, n_machines = int(rng.integers(1, 7)), int(rng.integers(1, 6))
        yield rng.random((n_jobs, n_machines)) < rng.choice([0.2, 0.4, 0.7])


def networkx_size(allowed: np.ndarray) -> int:
    graph = nx.Graph()
    jobs = [("j", i) for i in range(allowed.shape[0])]
    graph.add_nodes_from(jobs)
    graph.add_nodes_from(("m", k) for k in range(allowed.shape[1]))
    graph.add_edges_from((("j", i), ("m", k)) for i, k in zip(*np.nonzero(allowed)))
    return len(nx.bipartite.maximum_matching(graph, top_nodes=jobs)) // 2


def smallest_cover_by_brute_force(allowed: np.ndarray) -> int:
    n_jobs, n_machines = allowed.shape
    pairs = list(zip(*np.nonzero(allowed)))
    vertices = [("j", i) for i in range(n_jobs)] + [("m", k) for k in range(n_machines)]
    for size in range(len(vertices) + 1):
        for chosen in combinations(vertices, size):
            picked = set(chosen)
            if all(("j", i) in picked or ("m", k) in picked for i, k in pairs):
                return size
    raise AssertionError("the set of all vertices is a cover")


def holds_by_hand(allowed: np.ndarray, jobs, machines) -> bool:
    jobs, machines = list(jobs), set(machines)
    neighbours = {k for i in jobs for k in range(allowed.shape[1]) if allowed[i, k]}
    return bool(jobs) and neighbours <= machines and len(machines) < len(jobs)


def check_matching(allowed: np.ndarray, machine_of_job: np.ndarray) -> int:
    assert machine_of_job.shape == (allowed.shape[0],)
    placed = [(i, int(k)) for i, k in enumerate(machine_of_job) if k >= 0]
    assert all(allowed[i, k] for i, k in placed)
    assert len({k for _, k in placed}) == len(placed)
    return len(placed)


def test_maximum_matching_has_the_size_networkx_finds():
    for allowed in masks(150):
        machine_of_job = maximum_matching(allowed)
        assert check_matching(allowed, machine_of_job) == networkx_size(allowed)


@pytest.mark.parametrize("shape", [(0, 3), (3, 0), (0, 0)])
def test_nothing_to_match_leaves_every_job_unmatched(shape):
    machine_of_job = maximum_matching(np.zeros(shape, dtype=bool))
    assert machine_of_job.tolist() == [-1] * shape[0]
    assert machine_of_job.dtype == np.int64


def test_konig_cover_is_a_smallest_cover():
    for allowed in masks(80, seed=12):
        machine_of_job = maximum_matching(allowed)
        cover_jobs, cover_machines = konig_cover(allowed, machine_of_job)
        for i, k in zip(*np.nonzero(allowed)):
            assert cover_jobs[i] or cover_machines[k]
        size = int(cover_jobs.sum() + cover_machines.sum())
        assert size == smallest_cover_by_brute_force(allowed) == networkx_size(allowed)


def test_hall_witness_proves_how_many_jobs_must_wait():
    seen_waiting = 0
    for allowed in masks(150, seed=13):
        machine_of_job = maximum_matching(allowed)
        waiting = int((machine_of_job < 0).sum())
        witness = hall_witness(allowed, machine_of_job)
        if waiting == 0:
            assert witness is None
            continue
        seen_waiting += 1
        assert holds_by_hand(allowed, witness.jobs, witness.machines)
        assert witness.holds(allowed)
        # Hall's theorem with deficiency: at most n - d jobs can be placed.
        assert witness.deficiency == waiting == allowed.shape[0] - networkx_size(allowed)
        # One waiting job alone: its own witness, a subset of the whole one.
        first = int(np.flatnonzero(machine_of_job < 0)[0])
        own = hall_witness(allowed, machine_of_job, waiting=[first])
        assert first in own.jobs.tolist() and own.deficiency == 1
        assert holds_by_hand(allowed, own.jobs, own.machines)
        assert set(own.jobs.tolist()) <= set(witness.jobs.tolist())
        assert hall_witness(allowed, machine_of_job, waiting=[]) is None
    assert seen_waiting > 30


def test_witness_groups_are_the_connected_parts_of_the_whole_witness():
    for allowed in masks(150, seed=14):
        machine_of_job = maximum_matching(allowed)
        groups = hall_witness_groups(allowed, machine_of_job)
        waiting = set(np.flatnonzero(machine_of_job < 0).tolist())
        if not waiting:
            assert groups == []
            continue
        whole = hall_witness(allowed, machine_of_job)
        jobs = [j for g in groups for j in g.jobs.tolist()]
        machines = [k for g in groups for k in g.machines.tolist()]
        assert sorted(jobs) == whole.jobs.tolist() and sorted(machines) == whole.machines.tolist()
        assert len(set(jobs)) == len(jobs) and len(set(machines)) == len(machines)
        for g in groups:
            assert holds_by_hand(allowed, g.jobs, g.machines)
            assert g.deficiency == len(waiting & set(g.jobs.tolist()))
        assert [int(g.jobs[0]) for g in groups] == sorted(int(g.jobs[0]) for g in groups)
        # Reference: networkx components of the allowed pairs among the witness vertices.
        graph = nx.Graph()
        graph.add_nodes_from(("j", j) for j in jobs)
        graph.add_edges_from((("j", i), ("m", k)) for i in jobs for k in machines if allowed[i, k])
        parts = {frozenset(c) for c in nx.connected_components(graph)}
        assert parts == {frozenset([("j", j) for j in g.jobs.tolist()]
                                   + [("m", k) for k in g.machines.tolist()]) for g in groups}


def test_a_job_with_no_allowed_machine_is_a_group_of_its_own():
    # Job 0 may run nowhere; jobs 1 and 2 share machine 0 only; job 3 has machine 1.
    allowed = np.array([[0, 0], [1, 0], [1, 0], [0, 1]], dtype=bool)
    groups = hall_witness_groups(allowed, maximum_matching(allowed))
    assert [(g.jobs.tolist(), g.machines.tolist()) for g in groups] == [([0], []), ([1, 2], [0])]
    lonely = np.zeros((2, 3), dtype=bool)
    groups = hall_witness_groups(lonely, maximum_matching(lonely))
    assert [(g.jobs.tolist(), g.machines.tolist()) for g in groups] == [([0], []), ([1], [])]


def test_alternating_reach_follows_allowed_pairs_then_matched_ones():
    # A chain: job 0 (waiting) -> machine 0 -> job 1 -> machine 1 -> job 2; job 3 apart.
    allowed = np.array([[1, 0, 0], [1, 1, 0], [0, 1, 0], [0, 0, 1]], dtype=bool)
    machine_of_job = np.array([-1, 0, 1, 2])
    jobs, machines = alternating_reach(allowed, machine_of_job, np.array([0]))
    assert jobs.tolist() == [True, True, True, False]
    assert machines.tolist() == [True, True, False]
    # No start (an empty array or list): nothing reached.
    for none in (np.array([], dtype=np.int64), []):
        jobs, machines = alternating_reach(allowed, machine_of_job, none)
        assert not jobs.any() and not machines.any()


def test_alternating_reach_stops_at_a_free_machine_of_a_matching_that_is_not_maximum():
    # Job 0 waits and may use machine 0, which is free: the path ends there (it is the
    # augmenting path that proves the matching is not maximum). Job 1 is on machine 1.
    allowed = np.array([[1, 1], [0, 1]], dtype=bool)
    machine_of_job = np.array([-1, 1])
    jobs, machines = alternating_reach(allowed, machine_of_job, np.array([0]))
    assert jobs.tolist() == [True, True] and machines.tolist() == [True, True]
    allowed = np.array([[1, 0], [0, 1]], dtype=bool)
    jobs, machines = alternating_reach(allowed, machine_of_job, np.array([0]))
    assert jobs.tolist() == [True, False] and machines.tolist() == [True, False]


@pytest.mark.parametrize(("jobs", "machines", "expected"), [
    ([], [], False),                 # no jobs: proves nothing
    ([0, 1], [0], True),             # two jobs, both only on machine 0
    ([0, 1], [0, 1], False),         # as many machines as jobs
    ([0, 2], [0], False),            # job 2 may also run on machine 1, outside the set
])
def test_holds_checks_both_halves_of_hall_s_condition(jobs, machines, expected):
    allowed = np.array([[1, 0], [1, 0], [1, 1]], dtype=bool)
    witness = HallWitness(np.array(jobs, dtype=np.int64), np.array(machines, dtype=np.int64))
    assert witness.holds(allowed) is expected
    assert holds_by_hand(allowed, jobs, machines) is expected
    assert witness.deficiency == len(jobs) - len(machines)
