"""Maximum-cardinality matching facts on the allowed pairs: size, Konig cover, Hall witness.

A dispatch plan must place as many jobs as the allowed pairs permit. These helpers find
that number and, when some jobs cannot be placed, *prove* it: by Konig's theorem
(Konig 1931) the vertices reachable by alternating paths from the unmatched jobs form a
set S of jobs whose allowed machines N(S) number |S| - (unmatched jobs) < |S|, which is a
violation of Hall's condition (Hall 1935) that any supervisor can check by hand.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from scipy.sparse import bmat, csr_matrix
from scipy.sparse.csgraph import connected_components, maximum_bipartite_matching


@dataclass(frozen=True)
class HallWitness:
    """A set of jobs that together can use fewer machines than there are jobs.

    ``jobs`` and ``machines`` are index arrays. Every allowed machine of every job in
    ``jobs`` is in ``machines`` and ``len(machines) < len(jobs)``, so at least
    ``len(jobs) - len(machines)`` of these jobs must wait whatever the plan.
    """

    jobs: np.ndarray
    machines: np.ndarray

    @property
    def deficiency(self) -> int:
        """How many of these jobs must wait in every plan."""
        return int(len(self.jobs) - len(self.machines))

    def holds(self, allowed: np.ndarray) -> bool:
        """Check the witness against a mask: neighbours within ``machines``, fewer than jobs."""
        if len(self.jobs) == 0:
            return False
        neighbours = np.flatnonzero(allowed[self.jobs].any(axis=0))
        return bool(set(neighbours.tolist()) <= set(self.machines.tolist())
                    and len(self.machines) < len(self.jobs))


def maximum_matching(allowed: np.ndarray) -> np.ndarray:
    """Machine index per job (-1 = unmatched) of one maximum matching (Hopcroft-Karp, in scipy).

    Parameters
    ----------
    allowed : boolean jobs x machines array

    Returns
    -------
    numpy.ndarray of int
        Machine per job, -1 when unmatched.

    References
    ----------
    J. E. Hopcroft and R. M. Karp, "An n^5/2 algorithm for maximum matchings in bipartite
    graphs", SIAM J. Computing 2 (1973) 225-231, doi:10.1137/0202019.
    """
    n_jobs, n_machines = allowed.shape
    if n_jobs == 0 or n_machines == 0:
        return np.full(n_jobs, -1, dtype=np.int64)
    graph = csr_matrix(allowed.astype(np.int8))
    match = maximum_bipartite_matching(graph, perm_type="column")
    return np.asarray(match, dtype=np.int64)


def alternating_reach(allowed: np.ndarray, machine_of_job: np.ndarray,
                      start_jobs: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Jobs and machines reachable from ``start_jobs`` by alternating paths.

    Paths leave a job along any allowed pair and leave a machine along its matched pair.
    Returns boolean masks (jobs, machines).

    Parameters
    ----------
    allowed : boolean jobs x machines array
    machine_of_job : int array
        A matching (-1 = unmatched).
    start_jobs : int array
        Job indices.

    Returns
    -------
    (jobs, machines) : boolean arrays

    References
    ----------
    A. L. Dulmage and N. S. Mendelsohn, "Coverings of bipartite graphs", Canadian J.
    Math. 10 (1958) 517-534, doi:10.4153/CJM-1958-052-0.
    R. Burkard, M. Dell'Amico and S. Martello, "Assignment Problems", SIAM (2009),
    doi:10.1137/1.9781611972238.
    """
    n_jobs, n_machines = allowed.shape
    job_of_machine = np.full(n_machines, -1, dtype=np.int64)
    placed = machine_of_job >= 0
    job_of_machine[machine_of_job[placed]] = np.flatnonzero(placed)
    seen_jobs = np.zeros(n_jobs, dtype=bool)
    seen_machines = np.zeros(n_machines, dtype=bool)
    frontier = np.asarray(start_jobs, dtype=np.int64)
    seen_jobs[frontier] = True
    while frontier.size:
        # Only machines not seen yet are read: after the first steps few remain, so a
        # large frontier costs little (a 1000 x 1000 mask is not scanned again and again).
        unseen = np.flatnonzero(~seen_machines)
        if unseen.size == 0:
            break
        reach = unseen[allowed[np.ix_(frontier, unseen)].any(axis=0)]
        seen_machines[reach] = True
        nxt = job_of_machine[reach]
        nxt = nxt[nxt >= 0]
        nxt = nxt[~seen_jobs[nxt]]
        seen_jobs[nxt] = True
        frontier = nxt
    return seen_jobs, seen_machines


def hall_witness(allowed: np.ndarray, machine_of_job: np.ndarray,
                 waiting: np.ndarray | None = None) -> HallWitness | None:
    """Hall witness for the unmatched jobs of a *maximum* matching, or None if all are placed.

    ``waiting`` restricts the start set to some unmatched jobs (their own witness); by
    default all unmatched jobs are used. The matching must be maximum, otherwise an
    augmenting path exists and the returned set would not be a witness; callers verify
    with :meth:`HallWitness.holds`.

    Parameters
    ----------
    allowed : boolean jobs x machines array
    machine_of_job : int array
        A maximum matching.
    waiting : int array, optional
        Unmatched jobs to start from (default: all).

    Returns
    -------
    HallWitness or None

    References
    ----------
    P. Hall, "On representatives of subsets", J. London Math. Soc. 10 (1935) 26-30,
    doi:10.1112/jlms/s1-10.37.26.
    A. L. Dulmage and N. S. Mendelsohn, "Coverings of bipartite graphs", Canadian J.
    Math. 10 (1958) 517-534, doi:10.4153/CJM-1958-052-0.
    """
    if waiting is None:
        waiting = np.flatnonzero(machine_of_job < 0)
    waiting = np.asarray(waiting, dtype=np.int64)
    if waiting.size == 0:
        return None
    jobs, machines = alternating_reach(allowed, machine_of_job, waiting)
    return HallWitness(np.flatnonzero(jobs), np.flatnonzero(machines))


def hall_witness_groups(allowed: np.ndarray, machine_of_job: np.ndarray) -> list[HallWitness]:
    """One Hall witness per group of waiting jobs that compete for the same machines.

    The vertices reachable by alternating paths from all unmatched jobs of a *maximum*
    matching split into connected groups (an allowed pair from a reached job always
    leads to a reached machine, so groups never share a machine). Every reached machine
    is matched to a reached job, so a group holding w waiting jobs has exactly w more jobs
    than machines: its witness has deficiency w. Groups come in order of their first job.

    Parameters
    ----------
    allowed : boolean jobs x machines array
    machine_of_job : int array
        A maximum matching.

    Returns
    -------
    list of HallWitness

    References
    ----------
    P. Hall, "On representatives of subsets", J. London Math. Soc. 10 (1935) 26-30,
    doi:10.1112/jlms/s1-10.37.26.
    A. L. Dulmage and N. S. Mendelsohn, "Coverings of bipartite graphs", Canadian J.
    Math. 10 (1958) 517-534, doi:10.4153/CJM-1958-052-0.
    """
    waiting = np.flatnonzero(machine_of_job < 0)
    if waiting.size == 0:
        return []
    jobs, machines = alternating_reach(allowed, machine_of_job, waiting)
    job_idx, machine_idx = np.flatnonzero(jobs), np.flatnonzero(machines)
    sub = csr_matrix(allowed[np.ix_(job_idx, machine_idx)].astype(np.int8))
    graph = bmat([[None, sub], [sub.T, None]], format="csr") if sub.shape[1] else \
        csr_matrix((len(job_idx), len(job_idx)), dtype=np.int8)
    _, labels = connected_components(graph, directed=False)
    job_labels = labels[:len(job_idx)]
    machine_labels = labels[len(job_idx):]
    groups = []
    for label in dict.fromkeys(job_labels.tolist()):
        groups.append(HallWitness(job_idx[job_labels == label], machine_idx[machine_labels == label]))
    return groups


def konig_cover(allowed: np.ndarray, machine_of_job: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """A minimum vertex cover (job mask, machine mask) built from a maximum matching.

    Its size equals the matching size, which proves the matching is maximum (Konig 1931):
    no matching can have more pairs than any vertex cover has vertices.

    Parameters
    ----------
    allowed : boolean jobs x machines array
    machine_of_job : int array
        A maximum matching.

    Returns
    -------
    (jobs, machines) : boolean arrays

    References
    ----------
    D. Konig, "Grafok es matrixok", Matematikai es Fizikai Lapok 38 (1931) 116-119.
    R. Burkard, M. Dell'Amico and S. Martello, "Assignment Problems", SIAM (2009),
    doi:10.1137/1.9781611972238.
    """
    start = np.flatnonzero(machine_of_job < 0)
    jobs, machines = alternating_reach(allowed, machine_of_job, start)
    return ~jobs, machines
