"""One-to-one dispatch of jobs to machines: any shape, incompatible pairs, three objectives.

What a plan is (the definition every test checks against):

* it places as many jobs as the allowed pairs permit (a maximum matching); this number
  is proven maximal by a Konig vertex cover of the same size;
* must-run jobs are always placed (if no maximum matching places them all, the problem
  is infeasible and :class:`InfeasibleError` names a Hall witness among them);
* rush jobs are a priority, not a constraint: among the maximum matchings that place
  every must-run job, the plan places as many rush jobs as possible. By the matroid
  property of matchings (Mendelsohn and Dulmage 1958) both maxima are reached by one
  plan; the rush count is proven maximal by a Konig cover of the rush rows' own grid, and
  the rush jobs left waiting are explained by Hall witnesses among rush jobs;
* among those plans it minimises ``sum(planned values) + sum(wait penalties of waiting
  jobs)`` (objective ``"total"``), maximises ``sum(planned values) - sum(wait penalties)``
  (``"maximize"``), or first minimises the largest planned value and then the total
  (``"bottleneck"``).

The primal plan comes from scipy's ``linear_sum_assignment`` (Crouse 2016, a shortest
augmenting path method) on a square matrix built here; the dual potentials that prove it
optimal are computed by :mod:`dispatcher.engine.certificate`.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from scipy.optimize import linear_sum_assignment

from dispatcher.errors import BadInputError, Infeasible

from .certificate import Certificate, potentials_from_plan
from .matching import (
    HallWitness,
    alternating_reach,
    hall_witness,
    hall_witness_groups,
    konig_cover,
    maximum_matching,
)

OBJECTIVES = ("total", "maximize", "bottleneck")

#: Largest number of grid cells accepted (jobs x machines). Refused early, never attempted.
MAX_CELLS = 25_000_000

# Kinds of rows and columns in the square matrix that is actually solved.
ROW_JOB, ROW_IDLE = 0, 1
COL_MACHINE, COL_WAIT = 0, 1


class DispatchInputError(BadInputError, ValueError):
    """The numbers given to the engine do not describe a dispatch problem."""


class InfeasibleError(Infeasible):
    """Must-run jobs cannot all be placed. ``witness`` names jobs and the machines they share.

    ``jobs`` and ``machines`` (from :class:`dispatcher.errors.Infeasible`) are the
    witness's job and machine indices.
    """

    def __init__(self, message: str, witness: HallWitness):
        super().__init__(message, witness.jobs, witness.machines)
        self.witness = witness


@dataclass(frozen=True)
class DispatchResult:
    """A certified plan.

    ``machine_of_job[i]`` is the machine of job i or -1 when it waits. ``total`` follows
    the objective (see the module docstring). ``job_potential`` and ``machine_potential``
    are the dual potentials restricted to real jobs and machines: for ``"total"`` and
    ``"bottleneck"`` every allowed pair (of the problem solved) has
    ``value - u - v >= 0`` and every planned pair ``== 0``; for ``"maximize"`` every
    allowed pair has ``u + v - value >= 0`` and every planned pair ``== 0``.
    :meth:`reduced_costs` returns that non-negative quantity in both cases.
    """

    machine_of_job: np.ndarray
    total: float
    objective: str
    values: np.ndarray
    allowed: np.ndarray
    solved_allowed: np.ndarray
    job_potential: np.ndarray
    machine_potential: np.ndarray
    wait_penalty: np.ndarray
    must_run: np.ndarray
    certificate: Certificate
    cover_jobs: np.ndarray
    cover_machines: np.ndarray
    bottleneck: float | None
    rush: np.ndarray | None = None
    rush_cover_jobs: np.ndarray | None = None
    rush_cover_machines: np.ndarray | None = None

    @property
    def priority(self) -> np.ndarray:
        """Jobs placed first: must-run and rush jobs (boolean mask)."""
        return self.must_run if self.rush is None else (self.must_run | self.rush)

    @property
    def rush_waiting(self) -> np.ndarray:
        """Indices of rush jobs that wait (no plan placing as many jobs places more rush jobs)."""
        if self.rush is None:
            return np.zeros(0, dtype=np.int64)
        return np.flatnonzero(self.rush & (self.machine_of_job < 0))

    def rush_wait_groups(self) -> list[HallWitness]:
        """Hall witnesses among rush (and must-run) jobs: per group of rush jobs left waiting,
        the rush jobs that compete for the same machines and those machines (fewer)."""
        cached = self.__dict__.get("_rush_wait_groups")
        if cached is None:
            rows = np.flatnonzero(self.priority)
            cached = [HallWitness(rows[w.jobs], w.machines) for w in
                      hall_witness_groups(self.allowed[rows], self.machine_of_job[rows])]
            object.__setattr__(self, "_rush_wait_groups", cached)
        return cached

    @property
    def waiting_jobs(self) -> np.ndarray:
        """Indices of jobs that wait."""
        return np.flatnonzero(self.machine_of_job < 0)

    @property
    def idle_machines(self) -> np.ndarray:
        """Indices of machines that get no job."""
        used = np.zeros(self.values.shape[1], dtype=bool)
        used[self.machine_of_job[self.machine_of_job >= 0]] = True
        return np.flatnonzero(~used)

    @property
    def planned_count(self) -> int:
        return int((self.machine_of_job >= 0).sum())

    def planned_values(self) -> np.ndarray:
        """Value of each job's planned pair; NaN for waiting jobs."""
        out = np.full(len(self.machine_of_job), np.nan)
        placed = self.machine_of_job >= 0
        out[placed] = self.values[np.flatnonzero(placed), self.machine_of_job[placed]]
        return out

    def reduced_costs(self) -> np.ndarray:
        """Non-negative on pairs of the problem solved, zero on planned pairs, inf elsewhere.

        For ``"bottleneck"`` the problem solved keeps only pairs whose value is at most
        the bottleneck value.
        """
        u, v = self.job_potential[:, None], self.machine_potential[None, :]
        red = (u + v - self.values) if self.objective == "maximize" else (self.values - u - v)
        return np.where(self.solved_allowed, red, np.inf)

    def witness(self) -> HallWitness | None:
        """Hall witness for all waiting jobs together (None if nobody waits)."""
        return hall_witness(self.allowed, self.machine_of_job)

    def wait_reason(self, job: int) -> HallWitness:
        """Why ``job`` waits: the group of jobs it competes with and the machines they share.

        The group holds every waiting job that competes for the same machines, so its
        deficiency is the number of those jobs that must wait whatever the plan.
        """
        if self.machine_of_job[job] >= 0:
            raise ValueError(f"job {job} is not waiting")
        for group in self.wait_groups():
            if job in group.jobs:
                return group
        raise AssertionError("a waiting job belongs to one group")  # pragma: no cover

    def wait_groups(self) -> list[HallWitness]:
        """Hall witnesses, one per group of waiting jobs competing for the same machines."""
        cached = self.__dict__.get("_wait_groups")
        if cached is None:
            cached = hall_witness_groups(self.allowed, self.machine_of_job)
            object.__setattr__(self, "_wait_groups", cached)
        return cached

    def verify(self) -> bool:
        """Re-check everything the result claims: certificate, cover, totals."""
        if not self.certificate.verify() or not self._certificate_encodes_problem():
            return False
        placed = self.machine_of_job >= 0
        machines = self.machine_of_job[placed]
        if len(set(machines.tolist())) != len(machines):
            return False
        if not self.allowed[np.flatnonzero(placed), machines].all():
            return False
        if (self.must_run & ~placed).any():
            return False
        # Konig: a vertex cover of size = matching size proves the matching maximum.
        cover_ok = int(self.cover_jobs.sum() + self.cover_machines.sum()) == self.planned_count
        covered = self.cover_jobs[:, None] | self.cover_machines[None, :]
        if not cover_ok or (self.allowed & ~covered).any():
            return False
        if not self._rush_count_proven():
            return False
        red = self.reduced_costs()
        # Potentials carry the wait penalties too, so the slack scales with both.
        scale = max(1.0, float(np.abs(self.values[self.allowed]).max(initial=0)),
                    float(self.wait_penalty.max(initial=0)))
        tol = 1e-9 * scale * max(1, len(red))
        if (red[self.solved_allowed] < -tol).any():
            return False
        if placed.any() and np.abs(red[np.flatnonzero(placed), machines]).max() > tol:
            return False
        return bool(np.isclose(self.total, _plan_total(self.values, self.machine_of_job,
                                                       self.wait_penalty, self.objective)))

    def _certificate_encodes_problem(self) -> bool:
        """The certificate's square is this problem: values, allowed pairs, penalties, must-run.

        When maximising, the square holds ``top - value`` for a constant ``top`` (any
        constant: every plan places the same number of jobs); it is read off one pair.
        """
        job_cost = np.where(self.solved_allowed, self.values, np.inf)
        if self.objective == "maximize" and self.solved_allowed.any():
            i, j = np.argwhere(self.solved_allowed)[0]
            top = float(self.certificate.cost[i, j]) + float(self.values[i, j])
            job_cost = np.where(self.solved_allowed, top - self.values, np.inf)
        # Rush jobs wait only in the last wait slots, as many as rush jobs wait (none:
        # they cannot wait, as must-run jobs); ordinary jobs only in the others.
        rush = self.rush & ~self.must_run if self.rush is not None else np.zeros_like(self.must_run)
        n_rush_wait = int((rush & (self.machine_of_job < 0)).sum())
        return self.certificate.encodes(
            job_cost, np.where(self.must_run | rush, np.inf, self.wait_penalty),
            np.where(rush, self.wait_penalty, np.inf), n_rush_wait)

    def _rush_count_proven(self) -> bool:
        """Konig on the rush rows: a cover of the priority rows' pairs as large as the number
        of priority jobs placed proves no plan places more of them."""
        if self.rush is None or not self.rush.any():
            return True
        if self.rush_cover_jobs is None or self.rush_cover_machines is None:
            return False
        prio = self.priority
        placed = int((prio & (self.machine_of_job >= 0)).sum())
        if (self.rush_cover_jobs & ~prio).any():
            return False
        size = int(self.rush_cover_jobs.sum() + self.rush_cover_machines.sum())
        covered = self.rush_cover_jobs[:, None] | self.rush_cover_machines[None, :]
        return size == placed and not (self.allowed[prio] & ~covered[prio]).any()


def rush_cover(allowed: np.ndarray, machine_of_job: np.ndarray,
               priority: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Konig cover of the priority rows' pairs from the plan restricted to those rows.

    The restriction must be a maximum matching of the priority rows' grid; the cover then
    has as many vertices as priority jobs placed (Konig 1931), which proves the count
    maximal. Returns (job mask over all jobs, machine mask).

    Parameters
    ----------
    allowed : boolean jobs x machines array
        The pairs the engine may use.
    machine_of_job : int array
        The plan (-1 = waiting); restricted to the priority rows it must be a maximum
        matching of their grid.
    priority : boolean array, one per job
        The rush (or must-run) jobs.

    Returns
    -------
    (jobs, machines) : boolean arrays
        The cover: every allowed pair of a priority job touches a marked job or machine.

    References
    ----------
    D. Konig, "Grafok es matrixok", Matematikai es Fizikai Lapok 38 (1931) 116-119.
    A. L. Dulmage and N. S. Mendelsohn, "Coverings of bipartite graphs", Canadian J.
    Math. 10 (1958) 517-534, doi:10.4153/CJM-1958-052-0.
    """
    rows = np.flatnonzero(priority)
    cover_jobs = np.zeros(len(machine_of_job), dtype=bool)
    sub_jobs, sub_machines = konig_cover(allowed[rows], machine_of_job[rows])
    cover_jobs[rows] = sub_jobs
    return cover_jobs, sub_machines


def _plan_total(values: np.ndarray, machine_of_job: np.ndarray, wait_penalty: np.ndarray,
                objective: str) -> float:
    placed = machine_of_job >= 0
    planned = float(values[np.flatnonzero(placed), machine_of_job[placed]].sum())
    penalty = float(wait_penalty[~placed].sum())
    return planned - penalty if objective == "maximize" else planned + penalty


def _check_inputs(costs, allowed, wait_penalty, must_run):
    try:
        values = np.asarray(costs, dtype=float)
    except (TypeError, ValueError) as exc:
        raise DispatchInputError(f"costs must be numbers, got {type(costs).__name__}: {exc}") from None
    if values.ndim != 2:
        raise DispatchInputError(f"costs must be a 2-D grid (jobs x machines), got {values.ndim}-D")
    n_jobs, n_machines = values.shape
    if n_jobs * n_machines > MAX_CELLS:
        raise DispatchInputError(
            f"grid of {n_jobs} x {n_machines} exceeds the limit of {MAX_CELLS} cells")
    if allowed is None:
        mask = np.ones(values.shape, dtype=bool)
    else:
        mask = np.asarray(allowed)
        if mask.shape != values.shape:
            raise DispatchInputError(
                f"allowed mask has shape {mask.shape}, costs have shape {values.shape}")
        if mask.dtype != bool:
            raise DispatchInputError(f"allowed mask must be boolean, got {mask.dtype}")
    vals = values if allowed is None else values[mask]
    if not np.isfinite(vals).all():
        i, j = np.argwhere(mask & ~np.isfinite(values))[0]
        raise DispatchInputError(
            f"value at job {i}, machine {j} is {values[i, j]}: values must be finite "
            "(mark incompatible pairs in the allowed mask)")
    if (vals < 0).any():
        i, j = np.argwhere(mask & (values < 0))[0]
        raise DispatchInputError(f"value at job {i}, machine {j} is {values[i, j]}: values must be >= 0")
    if not mask.all():
        values = np.where(mask, values, 0.0)
    if wait_penalty is None:
        penalty = np.zeros(n_jobs)
    else:
        penalty = np.asarray(wait_penalty, dtype=float).reshape(-1)
        if penalty.shape != (n_jobs,):
            raise DispatchInputError(f"wait_penalty needs {n_jobs} entries, got {penalty.size}")
        if not np.isfinite(penalty).all() or (penalty < 0).any():
            raise DispatchInputError("wait penalties must be finite numbers >= 0")
    must = job_mask(must_run, n_jobs, "must_run")
    return values, mask, penalty, must


def job_mask(jobs, n_jobs: int, what: str) -> np.ndarray:
    """A boolean mask over ``n_jobs`` jobs from a mask or from job indices (None: empty).

    Parameters
    ----------
    jobs : boolean mask, job indices, or None
    n_jobs : int
    what : str
        The argument's name, for the error message.

    Returns
    -------
    numpy.ndarray of bool, length ``n_jobs``

    Raises
    ------
    DispatchInputError
        A mask of the wrong length or an index outside the grid.

    References
    ----------
    None: input normalisation (common practice, no published method).
    """
    out = np.zeros(n_jobs, dtype=bool)
    if jobs is None:
        return out
    arr = np.asarray(jobs)
    if arr.dtype == bool:
        if arr.shape != (n_jobs,):
            raise DispatchInputError(f"{what} mask needs {n_jobs} entries, got {arr.size}")
        return arr.copy()
    idx = arr.astype(np.int64).reshape(-1)
    if idx.size and (idx.min() < 0 or idx.max() >= n_jobs):
        raise DispatchInputError(f"{what} names a job outside 0..{n_jobs - 1}")
    out[idx] = True
    return out


def rush_waits(mask: np.ndarray, priority: np.ndarray) -> int:
    """How many priority (must-run or rush) jobs wait in every maximum plan: the rows of
    ``priority`` minus the largest matching of their own grid (Mendelsohn and Dulmage
    1958: a maximum matching reaches that many priority jobs placed).

    Parameters
    ----------
    mask : boolean jobs x machines array
        The pairs the engine may use.
    priority : boolean array, one per job

    Returns
    -------
    int
        The number of priority jobs left waiting by every maximum plan.

    References
    ----------
    A. L. Dulmage and N. S. Mendelsohn, "Coverings of bipartite graphs", Canadian J.
    Math. 10 (1958) 517-534, doi:10.4153/CJM-1958-052-0.
    J. E. Hopcroft and R. M. Karp, "An n^5/2 algorithm for maximum matchings in bipartite
    graphs", SIAM J. Computing 2 (1973) 225-231, doi:10.1137/0202019.
    """
    rows = np.flatnonzero(priority)
    if rows.size == 0:
        return 0
    return int(rows.size - (maximum_matching(mask[rows]) >= 0).sum())


def _check_must_run(mask: np.ndarray, must: np.ndarray) -> None:
    """Raise InfeasibleError unless some matching places every must-run job.

    By the matroid property of matchings (Mendelsohn and Dulmage 1958) such a matching
    then extends to a maximum matching that still places them.
    """
    rows = np.flatnonzero(must)
    if rows.size == 0:
        return
    sub = mask[rows]
    match = maximum_matching(sub)
    if (match >= 0).all():
        return
    unplaced = np.flatnonzero(match < 0)
    jobs, machines = alternating_reach(sub, match, unplaced)
    witness = HallWitness(rows[np.flatnonzero(jobs)], np.flatnonzero(machines))
    raise InfeasibleError(
        f"{witness.jobs.size} must-run jobs can use only {witness.machines.size} machines "
        "between them", witness)


def _solve_min(cost: np.ndarray, mask: np.ndarray, penalty: np.ndarray, must: np.ndarray,
               k: int, rush: np.ndarray | None = None,
               rush_wait: int = 0) -> tuple[np.ndarray, Certificate]:
    """Cheapest plan placing exactly k jobs (k = maximum matching size) on the square matrix.

    With ``rush_wait`` > 0, the last ``rush_wait`` wait slots take only rush jobs and the
    others only ordinary jobs, so exactly that many rush jobs wait (the fewest possible).
    With ``rush_wait`` == 0, rush jobs take no wait slot, as must-run jobs.
    """
    n_jobs, n_machines = cost.shape
    n_wait = n_jobs - k
    n_idle = n_machines - k
    size = n_jobs + n_idle
    full = mask.all()
    if n_wait == 0 and n_idle == 0:
        square = cost if full else np.where(mask, cost, np.inf)
    else:
        square = np.full((size, size), np.inf)
        square[:n_jobs, :n_machines] = cost if full else np.where(mask, cost, np.inf)
        rush = np.zeros(n_jobs, dtype=bool) if rush is None else rush & ~must
        square[:n_jobs, n_machines:] = np.where(must | rush, np.inf, penalty)[:, None]
        if rush_wait:
            first = n_machines + n_wait - rush_wait
            square[:n_jobs, first:] = np.where(rush, penalty, np.inf)[:, None]
        square[n_jobs:, :n_machines] = 0.0
    if size:
        rows, cols = linear_sum_assignment(square)
        col_of_row = np.empty(size, dtype=np.int64)
        col_of_row[rows] = cols
    else:
        col_of_row = np.zeros(0, dtype=np.int64)
    u, v = potentials_from_plan(square, col_of_row)
    row_kind = np.r_[np.full(n_jobs, ROW_JOB), np.full(n_idle, ROW_IDLE)]
    col_kind = np.r_[np.full(n_machines, COL_MACHINE), np.full(n_wait, COL_WAIT)]
    cert = Certificate(square, col_of_row, u, v, row_kind, col_kind)
    job_cols = col_of_row[:n_jobs]
    machine_of_job = np.where(job_cols < n_machines, job_cols, -1)
    return machine_of_job, cert


def _bottleneck_mask(values: np.ndarray, mask: np.ndarray, must: np.ndarray, k: int,
                     priority: np.ndarray | None = None, rush_wait: int = 0) -> np.ndarray:
    """Smallest threshold t such that pairs with value <= t still allow k placed jobs (and
    as many rush jobs placed as without a threshold)."""
    levels = np.unique(values[mask])
    lo, hi = 0, len(levels) - 1
    must_rows = np.flatnonzero(must)
    while lo < hi:
        mid = (lo + hi) // 2
        sub = mask & (values <= levels[mid])
        ok = int((maximum_matching(sub) >= 0).sum()) == k
        if ok and must_rows.size:
            ok = bool((maximum_matching(sub[must_rows]) >= 0).all())
        if ok and priority is not None and priority.any():
            ok = rush_waits(sub, priority) == rush_wait
        if ok:
            hi = mid
        else:
            lo = mid + 1
    return mask & (values <= levels[lo]) if len(levels) else mask


def solve(costs, allowed=None, *, maximize: bool = False, objective: str | None = None,
          wait_penalty=None, must_run=None, rush=None) -> DispatchResult:
    """Certified dispatch plan for a jobs x machines grid.

    ``costs``: jobs x machines values (finite, >= 0 wherever allowed). ``allowed``:
    boolean mask, False = the machine cannot run the job (default: all allowed).
    ``maximize=True`` is shorthand for ``objective="maximize"``. ``objective`` is one of
    ``"total"``, ``"maximize"``, ``"bottleneck"``. ``wait_penalty``: one number >= 0 per
    job, counted against any plan that leaves the job waiting. ``must_run``: boolean mask
    or indices of jobs that must never wait. ``rush``: boolean mask or indices of jobs
    placed first: the plan places as many of them as any plan placing the most jobs (and
    every must-run job) can, then optimises the objective; the rush jobs left waiting are
    ``result.rush_waiting``, explained by ``result.rush_wait_groups()``.

    Raises :class:`DispatchInputError` for bad numbers and :class:`InfeasibleError` when
    must-run jobs cannot all be placed.

    Parameters
    ----------
    costs : jobs x machines array
    allowed : boolean jobs x machines array, optional
    maximize : bool
    objective : {"total", "maximize", "bottleneck"}, optional
    wait_penalty : one number >= 0 per job, optional
    must_run, rush : boolean mask or job indices, optional
        See above.

    Returns
    -------
    DispatchResult
        The plan with its certificate; ``result.verify()`` checks it.

    Notes
    -----
    The square matrix of jobs, idle rows, machines and wait slots is solved by scipy's
    ``linear_sum_assignment`` (Crouse 2016); the dual potentials come from
    :func:`~dispatcher.engine.certificate.potentials_from_plan`; the placed count is proven
    maximal by a Konig cover and waiting jobs are explained by Hall witnesses.

    References
    ----------
    H. W. Kuhn, "The Hungarian method for the assignment problem", Naval Research
    Logistics Quarterly 2 (1955) 83-97, doi:10.1002/nav.3800020109.
    D. F. Crouse, "On implementing 2D rectangular assignment algorithms", IEEE Trans.
    Aerospace and Electronic Systems 52 (2016) 1679-1696, doi:10.1109/TAES.2016.140952.
    D. Konig, "Grafok es matrixok", Matematikai es Fizikai Lapok 38 (1931) 116-119.
    P. Hall, "On representatives of subsets", J. London Math. Soc. 10 (1935) 26-30,
    doi:10.1112/jlms/s1-10.37.26.
    """
    if objective is None:
        objective = "maximize" if maximize else "total"
    elif maximize and objective != "maximize":
        raise DispatchInputError(f"maximize=True conflicts with objective={objective!r}")
    if objective not in OBJECTIVES:
        raise DispatchInputError(f"objective must be one of {', '.join(OBJECTIVES)}, got {objective!r}")
    values, mask, penalty, must = _check_inputs(costs, allowed, wait_penalty, must_run)
    rush_mask = job_mask(rush, values.shape[0], "rush")
    _check_must_run(mask, must)
    k = min(mask.shape) if mask.all() else int((maximum_matching(mask) >= 0).sum())
    priority = must | rush_mask
    n_rush_wait = rush_waits(mask, priority) if rush_mask.any() else 0

    solve_mask = mask
    if objective == "bottleneck":
        solve_mask = _bottleneck_mask(values, mask, must, k, priority, n_rush_wait)
    if objective == "maximize":
        top = float(values[mask].max()) if mask.any() else 0.0
        cost = top - values
    else:
        top = 0.0
        cost = values
    machine_of_job, cert = _solve_min(cost, solve_mask, penalty, must, k, rush_mask, n_rush_wait)

    n_jobs, n_machines = values.shape
    u = cert.row_potential[:n_jobs]
    v = cert.col_potential[:n_machines]
    if objective == "maximize":
        u, v = top - u, -v
    cover_jobs, cover_machines = konig_cover(mask, machine_of_job)
    placed = machine_of_job >= 0
    bottleneck = (float(values[np.flatnonzero(placed), machine_of_job[placed]].max())
                  if objective == "bottleneck" and placed.any() else None)
    rush_jobs = rush_machines = None
    if rush_mask.any():
        rush_jobs, rush_machines = rush_cover(mask, machine_of_job, priority)
    return DispatchResult(
        machine_of_job=machine_of_job,
        total=_plan_total(values, machine_of_job, penalty, objective),
        objective=objective,
        values=values,
        allowed=mask,
        solved_allowed=solve_mask,
        job_potential=u,
        machine_potential=v,
        wait_penalty=penalty,
        must_run=must,
        certificate=cert,
        cover_jobs=cover_jobs,
        cover_machines=cover_machines,
        bottleneck=bottleneck,
        rush=rush_mask,
        rush_cover_jobs=rush_jobs,
        rush_cover_machines=rush_machines,
    )
