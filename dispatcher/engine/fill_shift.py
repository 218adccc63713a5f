"""Fill the shift: several jobs per machine, within the hours each machine has.

This is the generalised assignment problem (GAP): job i on machine j takes ``hours[i, j]``
of that machine's ``capacity[j]`` hours in the shift. What a plan is (the definition the
tests check against):

* every job runs on at most one machine, only on allowed pairs, and the hours of the jobs
  on a machine do not exceed its capacity; must-run jobs (and pinned jobs) always run,
  pinned jobs on their pinned machine, never on a forbidden one;
* with ``most_jobs_first=True`` (the default, as in the one-to-one engine) the plan runs
  as many jobs as the hours permit, and among those as many ``priority`` (rush) jobs as
  possible; among those plans
* it minimises ``sum(planned setup values) + sum(wait penalties of waiting jobs)``, or
  with ``maximize=True`` maximises ``sum(planned values) - sum(wait penalties)``.

With one job's worth of hours per machine (all hours 1, all capacities 1) this is exactly
the plan of :func:`dispatcher.engine.solve`. The published GAP instances (Beasley 1990)
put every job on a machine: pass ``all_jobs=True``.

Solved exactly as a mixed-integer linear program with ``scipy.optimize.milp`` (the HiGHS
branch-and-cut solver), in two lexicographic stages when ``most_jobs_first`` is on: the
largest number of jobs that fit, then the best objective among plans running that many.
Under a time limit the result is the best plan found with the solver's proven bound; the
plan's feasibility is re-checked here by :meth:`ShiftPlan.verify`.
"""

from __future__ import annotations

import time
from collections.abc import Mapping
from dataclasses import dataclass

import numpy as np
from scipy.optimize import Bounds, LinearConstraint, milp
from scipy.sparse import coo_array

from dispatcher.errors import EXIT_INFEASIBLE, Cancelled, DispatcherError, Infeasible

from .assignment import DispatchInputError, _check_inputs

#: Relative gap under which HiGHS stops and the plan counts as proven optimal.
MIP_REL_GAP = 1e-9

STATUS_OPTIMAL = "optimal"
STATUS_TIME_LIMIT = "time_limit"

__all__ = [
    "MIP_REL_GAP",
    "STATUS_OPTIMAL",
    "STATUS_TIME_LIMIT",
    "ShiftCancelled",
    "ShiftInfeasibleError",
    "ShiftPlan",
    "ShiftSearchError",
    "fill_shift",
    "run_order",
]


class ShiftInfeasibleError(Infeasible):
    """Must-run or pinned jobs cannot all fit in the machines' hours.

    ``jobs`` and ``machines`` are index arrays of the jobs and machines involved. ``kind``
    says which reason was found, so callers can phrase it with names: ``"pin_not_allowed"``
    (a job pinned to a machine that cannot run it), ``"pinned_over"`` (jobs pinned to one
    machine need ``needed`` hours, it has ``available``), ``"no_machine"`` (a must-run job
    needs at least ``needed`` hours, its machines have at most ``available``; NaN when no
    machine can run it), ``"total_hours"`` (must-run jobs need ``needed`` hours in total,
    their machines have ``available``), ``"proven"`` (the solver proved no plan runs them).
    """

    def __init__(self, message: str, jobs, machines=(), *, kind: str = "proven",
                 needed: float = float("nan"), available: float = float("nan")):
        super().__init__(message, np.asarray(jobs, dtype=np.int64),
                         np.asarray(machines, dtype=np.int64))
        self.kind = kind
        self.needed = needed
        self.available = available


class ShiftCancelled(Cancelled):
    """The caller's ``cancel`` event was set; no plan is returned."""


class ShiftSearchError(DispatcherError, RuntimeError):
    """The time limit ran out before any plan placing all must-run jobs was found.

    Not a proof of infeasibility, but the command line treats it like one (exit code 3):
    the must-run jobs could not be placed.
    """

    exit_code = EXIT_INFEASIBLE


@dataclass(frozen=True)
class ShiftPlan:
    """A shift plan and what is proven about it.

    ``machine_of_job[i]`` is job i's machine or -1 when it waits for the next shift.
    ``total`` follows the objective (see the module docstring). ``bound`` is the solver's
    proven bound on the best possible total (a lower bound when minimising, an upper
    bound when maximising) among plans running ``planned_count`` jobs; ``gap`` is
    ``|total - bound| / max(|total|, 1)``. ``proven_optimal`` is True when the solver
    closed the gap (and, with ``most_jobs_first``, proved the number of placed jobs
    maximal). ``jobs_on_machine[j]`` lists machine j's jobs in run order (rush first,
    then due time, then input order).
    """

    machine_of_job: np.ndarray
    total: float
    proven_optimal: bool
    bound: float
    gap: float
    status: str
    status_text: str
    objective: str
    jobs_on_machine: tuple[np.ndarray, ...]
    hours_used: np.ndarray
    capacity: np.ndarray
    values: np.ndarray
    hours: np.ndarray
    allowed: np.ndarray
    wait_penalty: np.ndarray
    must_run: np.ndarray
    pinned_machine: np.ndarray
    count_proven_maximal: bool
    seconds: float

    @property
    def waiting_jobs(self) -> np.ndarray:
        """Indices of jobs left for the next shift."""
        return np.flatnonzero(self.machine_of_job < 0)

    @property
    def planned_count(self) -> int:
        return int((self.machine_of_job >= 0).sum())

    def verify(self) -> bool:
        """Re-check the plan against the rules: pairs, hours, must-run, pins, total, bound."""
        mj = self.machine_of_job
        n_jobs, n_machines = self.values.shape
        if mj.shape != (n_jobs,) or (mj >= n_machines).any() or (mj < -1).any():
            return False
        placed = mj >= 0
        rows = np.flatnonzero(placed)
        if not self.allowed[rows, mj[placed]].all() or (self.must_run & ~placed).any():
            return False
        pinned = self.pinned_machine >= 0
        if (mj[pinned] != self.pinned_machine[pinned]).any():
            return False
        used = np.bincount(mj[placed], weights=self.hours[rows, mj[placed]], minlength=n_machines)
        # HiGHS accepts rows within its feasibility tolerance (1e-7); allow a little more.
        tol = 1e-6 * max(1.0, float(self.capacity.max(initial=0)))
        if (used > self.capacity + tol).any() or not np.allclose(used, self.hours_used):
            return False
        listed = sorted(int(i) for jobs in self.jobs_on_machine for i in jobs)
        if listed != rows.tolist():
            return False
        if any((mj[jobs] != j).any() for j, jobs in enumerate(self.jobs_on_machine)):
            return False
        total = _plan_total(self.values, mj, self.wait_penalty, self.objective)
        if not np.isclose(total, self.total):
            return False
        slack = 1e-6 * max(1.0, abs(total))
        if not np.isclose(self.gap, abs(total - self.bound) / max(abs(total), 1.0), atol=1e-9):
            return False
        if self.proven_optimal and abs(total - self.bound) > slack:
            return False  # proven optimal means the solver's bound is reached
        return bool(self.bound >= total - slack if self.objective == "maximize"
                    else self.bound <= total + slack)


def _plan_total(values: np.ndarray, machine_of_job: np.ndarray, penalty: np.ndarray,
                objective: str) -> float:
    placed = machine_of_job >= 0
    planned = float(values[np.flatnonzero(placed), machine_of_job[placed]].sum())
    waiting = float(penalty[~placed].sum())
    return planned - waiting if objective == "maximize" else planned + waiting


def run_order(jobs: np.ndarray, rush: np.ndarray, due: np.ndarray) -> np.ndarray:
    """Jobs in run order: rush jobs first, then by due time (none = last), then by index.

    Parameters
    ----------
    jobs : int array
        The jobs of one machine.
    rush : boolean array, one per job
    due : float array, one per job
        Due times as timestamps, NaN when none.

    Returns
    -------
    numpy.ndarray of int
        ``jobs`` in run order.

    References
    ----------
    None: a stable sort by rush flag, due time and input order (common practice, no published method).
    """
    jobs = np.asarray(jobs, dtype=np.int64)
    due_key = np.where(np.isnan(due[jobs]), np.inf, due[jobs])
    return jobs[np.lexsort((jobs, due_key, ~rush[jobs]))]


def _job_vector(data, n_jobs: int, what: str, fill: float) -> np.ndarray:
    if data is None:
        return np.full(n_jobs, fill, dtype=float)
    try:
        arr = np.asarray(data, dtype=float).reshape(-1)
    except (TypeError, ValueError) as exc:
        raise DispatchInputError(f"{what} must be numbers: {exc}") from None
    if arr.shape != (n_jobs,):
        raise DispatchInputError(f"{what} needs {n_jobs} entries (one per job), got {arr.size}")
    return arr


def _job_mask(data, n_jobs: int, what: str) -> np.ndarray:
    mask = np.zeros(n_jobs, dtype=bool)
    if data is None:
        return mask
    arr = np.asarray(data)
    if arr.dtype == bool:
        if arr.shape != (n_jobs,):
            raise DispatchInputError(f"{what} mask needs {n_jobs} entries, got {arr.size}")
        return arr.copy()
    idx = arr.astype(np.int64).reshape(-1)
    if idx.size and (idx.min() < 0 or idx.max() >= n_jobs):
        raise DispatchInputError(f"{what} names a job outside 0..{n_jobs - 1}")
    mask[idx] = True
    return mask


def _check_hours(hours, machine_factor, shape: tuple[int, int], mask: np.ndarray) -> np.ndarray:
    n_jobs, n_machines = shape
    try:
        arr = np.asarray(hours, dtype=float)
    except (TypeError, ValueError) as exc:
        raise DispatchInputError(f"hours must be numbers: {exc}") from None
    if arr.ndim == 1 and arr.shape == (n_jobs,):
        arr = np.repeat(arr[:, None], n_machines, axis=1)
    if arr.shape != shape:
        raise DispatchInputError(
            f"hours have shape {arr.shape}; expected {shape} (jobs x machines) or ({n_jobs},)")
    if machine_factor is not None:
        factor = np.asarray(machine_factor, dtype=float).reshape(-1)
        if factor.shape != (n_machines,) or not np.isfinite(factor).all() or (factor <= 0).any():
            raise DispatchInputError(
                f"machine_factor needs {n_machines} finite numbers > 0 (one per machine)")
        arr = arr * factor[None, :]
    bad = mask & ~(np.isfinite(arr) & (arr >= 0))
    if bad.any():
        i, j = np.argwhere(bad)[0]
        raise DispatchInputError(
            f"hours at job {i}, machine {j} is {arr[i, j]}: hours must be finite and >= 0")
    return np.where(mask, arr, 0.0)


def _check_capacity(capacity, n_machines: int) -> np.ndarray:
    try:
        cap = np.asarray(capacity, dtype=float).reshape(-1)
    except (TypeError, ValueError) as exc:
        raise DispatchInputError(f"capacity must be numbers: {exc}") from None
    if cap.size == 1 and n_machines != 1:
        cap = np.full(n_machines, cap[0])
    if cap.shape != (n_machines,):
        raise DispatchInputError(
            f"capacity needs {n_machines} entries (hours per machine), got {cap.size}")
    if not np.isfinite(cap).all() or (cap < 0).any():
        j = int(np.flatnonzero(~(np.isfinite(cap) & (cap >= 0)))[0])
        raise DispatchInputError(f"capacity of machine {j} is {cap[j]}: must be finite and >= 0")
    return cap


def _check_pins(pins, shape: tuple[int, int]) -> tuple[np.ndarray, np.ndarray]:
    """Pinned machine per job (-1 = none) and a mask of forbidden pairs."""
    n_jobs, n_machines = shape
    pinned = np.full(n_jobs, -1, dtype=np.int64)
    forbidden = np.zeros(shape, dtype=bool)
    if pins is None:
        return pinned, forbidden
    if not isinstance(pins, Mapping):
        raise DispatchInputError("pins must map (job, machine) to True (forced) or False (forbidden)")
    for key, force in pins.items():
        try:
            i, j = (int(k) for k in key)
        except (TypeError, ValueError):
            raise DispatchInputError(f"pin key {key!r} is not a (job, machine) pair") from None
        if not (0 <= i < n_jobs and 0 <= j < n_machines):
            raise DispatchInputError(f"pin ({i}, {j}) is outside the {n_jobs} x {n_machines} grid")
        if force:
            if pinned[i] >= 0 and pinned[i] != j:
                raise DispatchInputError(
                    f"job {i} is pinned to two machines ({pinned[i]} and {j})")
            pinned[i] = j
        else:
            forbidden[i, j] = True
    for i in np.flatnonzero(pinned >= 0):
        if forbidden[i, pinned[i]]:
            raise DispatchInputError(f"job {i} is both pinned to and forbidden on machine {pinned[i]}")
    return pinned, forbidden


def _diagnose(usable: np.ndarray, hours: np.ndarray, cap: np.ndarray, must: np.ndarray,
              pinned: np.ndarray, mask: np.ndarray) -> None:
    """Raise ShiftInfeasibleError with a hand-checkable reason, if a simple one exists."""
    for i in np.flatnonzero(pinned >= 0):
        j = pinned[i]
        if not mask[i, j]:
            raise ShiftInfeasibleError(f"job {i} is pinned to machine {j}, which cannot run it",
                                       [i], [j], kind="pin_not_allowed")
    for j in np.unique(pinned[pinned >= 0]):
        jobs = np.flatnonzero(pinned == j)
        need = float(hours[jobs, j].sum())
        if need > cap[j] * (1 + 1e-12):
            raise ShiftInfeasibleError(
                f"jobs {', '.join(map(str, jobs))} are pinned to machine {j}: they need "
                f"{need:g} hours, the machine has {cap[j]:g}", jobs, [j], kind="pinned_over",
                needed=need, available=float(cap[j]))
    for i in np.flatnonzero(must & ~usable.any(axis=1)):
        allowed = np.flatnonzero(mask[i])
        need = float(hours[i, allowed].min()) if allowed.size else float("nan")
        have = float(cap[allowed].max()) if allowed.size else float("nan")
        detail = ("no machine can run it" if allowed.size == 0 else
                  f"it needs at least {need:g} hours, its machines "
                  f"({', '.join(map(str, allowed))}) have at most {have:g}")
        raise ShiftInfeasibleError(f"must-run job {i} fits on no machine: {detail}", [i], allowed,
                                   kind="no_machine", needed=need, available=have)
    rows = np.flatnonzero(must)
    if rows.size:
        least = np.where(usable[rows], hours[rows], np.inf).min(axis=1)
        machines = np.flatnonzero(usable[rows].any(axis=0))
        if least.sum() > cap[machines].sum() * (1 + 1e-12):
            raise ShiftInfeasibleError(
                f"must-run jobs need at least {least.sum():g} hours (each on its quickest "
                f"machine) but their machines have {cap[machines].sum():g} hours in total",
                rows, machines, kind="total_hours", needed=float(least.sum()),
                available=float(cap[machines].sum()))


def _milp(c, integrality, bounds, constraints, time_left):
    options = {"mip_rel_gap": MIP_REL_GAP}
    if time_left is not None:
        options["time_limit"] = max(float(time_left), 0.01)
    return milp(c, integrality=integrality, bounds=bounds, constraints=constraints,
                options=options)


def fill_shift(values, hours, capacity, *, allowed=None, maximize: bool = False,
               time_limit: float | None = None, wait_penalty=None, must_run=None,
               all_jobs: bool = False, pins: Mapping | None = None, rush=None, due=None,
               machine_factor=None, most_jobs_first: bool = True, cancel=None,
               progress=None, priority=None) -> ShiftPlan:
    """Best shift plan running several jobs per machine within each machine's hours.

    Parameters
    ----------
    values : jobs x machines array
        Setup value of each pair (minimised), or gain with ``maximize=True``; finite and
        >= 0 wherever allowed.
    hours : jobs x machines array, or one number per job
        Run hours of each pair (>= 0). One number per job means the same on every machine;
        ``machine_factor`` (one number > 0 per machine) then scales them per machine.
    capacity : one number per machine (or a single number for all)
        Hours each machine has in this shift.
    allowed : boolean jobs x machines mask, optional
        False where the machine cannot run the job.
    maximize : bool
        Values are gains: maximise ``sum(values) - sum(wait penalties)``.
    time_limit : float, optional
        Seconds for the solver in total; the result then may be best found, not proven.
    wait_penalty : one number >= 0 per job, optional
        Counted against any plan that leaves the job waiting.
    must_run : boolean mask or indices of jobs, optional
        Jobs that must run in this shift. ``all_jobs=True`` makes every job must-run
        (the published GAP definition).
    pins : mapping ``{(job, machine): bool}``, optional
        True forces the job onto that machine (and makes it must-run); False forbids it.
    rush, due : optional
        Run order keys only (mask/indices, and one due time per job, NaN = none). ``rush``
        defaults to the ``must_run`` jobs given (not to ``all_jobs`` or pinned ones).
    most_jobs_first : bool
        Run as many jobs as fit before optimising values (as the one-to-one engine does).
    priority : boolean mask or indices of jobs, optional
        Jobs placed first (rush jobs): with ``most_jobs_first``, among the plans running
        the most jobs only those running the most priority jobs count. Not a constraint:
        priority jobs that do not fit wait.
    cancel : threading.Event, optional
        Checked before each solver stage; when set, :class:`ShiftCancelled` is raised. A
        stage already running is not interrupted (scipy offers no hook): pair it with a
        ``time_limit`` so a cancelled solve ends soon.
    progress : callable, optional
        Called with a short text as each solver stage starts (for a progress display).

    Returns
    -------
    ShiftPlan

    Raises
    ------
    DispatchInputError
        Numbers that do not describe a shift (shapes, NaN, negative hours, bad pins).
    ShiftInfeasibleError
        Must-run or pinned jobs cannot all fit; the message names them.
    ShiftSearchError
        The time limit ran out before any plan placing the must-run jobs was found.
    ShiftCancelled
        ``cancel`` was set.

    Notes
    -----
    One binary variable per usable pair (allowed, not forbidden, hours within the
    machine's capacity); rows ``sum_j x[i, j] <= 1`` (``== 1`` for must-run jobs) and
    ``sum_i hours[i, j] x[i, j] <= capacity[j]``. Waiting is the slack of the first rows,
    so the wait penalty folds into the pair coefficients. Solved by HiGHS branch and cut
    (Huangfu and Hall 2018) through ``scipy.optimize.milp``; problem definition as in
    Ross and Soland (1975) and the OR-Library instances of Beasley (1990).

    References
    ----------
    G. T. Ross and R. M. Soland, "A branch and bound algorithm for the generalized
    assignment problem", Mathematical Programming 8 (1975) 91-103.
    Q. Huangfu and J. A. J. Hall, "Parallelizing the dual revised simplex method",
    Mathematical Programming Computation 10 (2018) 119-142.

    Examples
    --------
    >>> plan = fill_shift([[3, 9], [4, 8], [5, 1]], [[4, 4], [4, 4], [4, 4]], [8, 4])
    >>> plan.machine_of_job.tolist(), plan.total
    ([0, 0, 1], 8.0)
    """
    started = time.perf_counter()
    if time_limit is not None and not (np.isfinite(time_limit) and time_limit > 0):
        raise DispatchInputError(f"time_limit must be a number of seconds > 0, got {time_limit!r}")
    problem = _checked_problem(values, hours, capacity, allowed=allowed, maximize=maximize,
                               wait_penalty=wait_penalty, must_run=must_run, all_jobs=all_jobs,
                               pins=pins, rush=rush, due=due, machine_factor=machine_factor)
    problem.priority = _job_mask(priority, problem.shape[0], "priority") if priority is not None \
        else np.zeros(problem.shape[0], dtype=bool)
    _diagnose(problem.usable, problem.hours, problem.capacity, problem.must, problem.pinned,
              problem.mask)
    model = _build_model(problem)
    search = _Search(started, time_limit, cancel, progress)
    outcome = _solve_model(problem, model, search, most_jobs_first)
    return _shift_plan(problem, model, outcome, search)


@dataclass
class _ShiftProblem:
    """The checked inputs of :func:`fill_shift`, and which pairs may be used."""

    values: np.ndarray
    mask: np.ndarray        # allowed pairs as given
    forbidden: np.ndarray   # pairs a pin forbids
    hours: np.ndarray
    capacity: np.ndarray
    penalty: np.ndarray
    must: np.ndarray        # must-run, including all_jobs and pinned jobs
    pinned: np.ndarray      # pinned machine per job, -1 = none
    rush: np.ndarray
    due: np.ndarray
    maximize: bool
    usable: np.ndarray      # pairs the model gets a variable for
    priority: np.ndarray | None = None  # placed first (rush), not a constraint

    @property
    def objective(self) -> str:
        return "maximize" if self.maximize else "total"

    @property
    def shape(self) -> tuple[int, int]:
        return self.values.shape


def _checked_problem(values, hours, capacity, *, allowed, maximize, wait_penalty, must_run,
                     all_jobs, pins, rush, due, machine_factor) -> _ShiftProblem:
    """Step 1: check every input (raising DispatchInputError) and find the usable pairs."""
    values, mask, penalty, must = _check_inputs(values, allowed, wait_penalty, must_run)
    n_jobs, n_machines = values.shape
    hrs = _check_hours(hours, machine_factor, values.shape, mask)
    cap = _check_capacity(capacity, n_machines)
    pinned, forbidden = _check_pins(pins, values.shape)
    rush_mask = must.copy() if rush is None else _job_mask(rush, n_jobs, "rush")
    if all_jobs:
        must[:] = True
    must |= pinned >= 0
    due_time = _job_vector(due, n_jobs, "due", np.nan)
    return _ShiftProblem(values=values, mask=mask, forbidden=forbidden, hours=hrs, capacity=cap,
                         penalty=penalty, must=must, pinned=pinned, rush=rush_mask, due=due_time,
                         maximize=maximize,
                         usable=_usable_pairs(mask, forbidden, hrs, cap, pinned))


def _usable_pairs(mask: np.ndarray, forbidden: np.ndarray, hours: np.ndarray, cap: np.ndarray,
                  pinned: np.ndarray) -> np.ndarray:
    """Allowed, not forbidden pairs whose hours fit the machine; a pinned job only its pin."""
    usable = mask & ~forbidden & (hours <= cap[None, :] * (1 + 1e-12))
    has_pin = pinned >= 0
    rows = np.flatnonzero(has_pin)
    usable[has_pin] = False
    usable[rows, pinned[has_pin]] = mask[rows, pinned[has_pin]]
    return usable


@dataclass
class _Model:
    """The MILP: one binary variable per usable pair (``job_of_var``, ``machine_of_var``)."""

    job_of_var: np.ndarray
    machine_of_var: np.ndarray
    coef: np.ndarray          # objective coefficient per variable (always minimised)
    const: float              # constant added to the objective (all wait penalties)
    constraints: list         # job rows, machine-hour rows (and later the job count)
    bounds: Bounds
    lower: np.ndarray         # 1 where a pin forces the variable
    integrality: np.ndarray

    @property
    def size(self) -> int:
        return self.job_of_var.size


def _build_model(problem: _ShiftProblem) -> _Model:
    """Step 2: the MILP of the Notes of :func:`fill_shift` (waiting is the job row's slack)."""
    n_jobs, n_machines = problem.shape
    usable, values, penalty = problem.usable, problem.values, problem.penalty
    job_of_var, machine_of_var = np.nonzero(usable)
    n_var = job_of_var.size
    coef = (-(values + penalty[:, None]) if problem.maximize
            else (values - penalty[:, None]))[usable]
    constraints = []
    if n_var:
        var = np.arange(n_var)
        job_rows = coo_array((np.ones(n_var), (job_of_var, var)), shape=(n_jobs, n_var))
        hour_rows = coo_array((problem.hours[usable], (machine_of_var, var)),
                              shape=(n_machines, n_var))
        constraints = [LinearConstraint(job_rows, np.where(problem.must, 1.0, 0.0), 1.0),
                       LinearConstraint(hour_rows, -np.inf, problem.capacity)]
    has_pin = problem.pinned >= 0
    lower = np.zeros(n_var)
    lower[has_pin[job_of_var] & (problem.pinned[job_of_var] == machine_of_var)] = 1.0
    return _Model(job_of_var=job_of_var, machine_of_var=machine_of_var, coef=coef,
                  const=float(penalty.sum()), constraints=constraints,
                  bounds=Bounds(lower, np.ones(n_var)), lower=lower,
                  integrality=np.ones(n_var))


class _Search:
    """The time budget, the cancel event and the progress callback of one solve."""

    def __init__(self, started: float, time_limit: float | None, cancel, progress):
        self.started = started
        self.time_limit = time_limit
        self.cancel = cancel
        self.progress = progress

    def time_left(self) -> float | None:
        if self.time_limit is None:
            return None
        return self.time_limit - (time.perf_counter() - self.started)

    def stage(self, text: str) -> None:
        """Start a solver stage: stop here if cancelled, else report it."""
        if self.cancel is not None and self.cancel.is_set():
            raise ShiftCancelled("the shift plan was cancelled")
        if self.progress is not None:
            self.progress(text)

    def no_plan(self, must: np.ndarray) -> ShiftSearchError:
        return ShiftSearchError(_no_plan_text(self.time_limit, must))


@dataclass
class _Outcome:
    """What the solver stages found: the chosen variables and what is proven about them."""

    x: np.ndarray
    proven: bool
    count_proven: bool
    bound_min: float          # proven bound on the minimised objective, constant included


def _solve_model(problem: _ShiftProblem, model: _Model, search: _Search,
                 most_jobs_first: bool) -> _Outcome:
    """Step 3: the solver stages (the most jobs, then the best total) with their floors."""
    must, n_var = problem.must, model.size
    if not n_var:
        if must.any():
            _raise_infeasible(must, problem.usable)
        return _Outcome(np.zeros(0), True, True, model.const)  # nothing can run: all wait
    # Under a time limit the solver may stop with a poor plan (or none); a quick greedy
    # plan is kept as a floor. scipy's milp takes no starting plan, so it is compared after.
    fallback = (_greedy(model.job_of_var, model.machine_of_var, problem.hours[problem.usable],
                        problem.capacity, model.coef, must, model.lower, most_jobs_first)
                if search.time_limit is not None else None)
    constraints, count_proven = model.constraints, True
    two_stages = most_jobs_first and not must.all()
    if two_stages:
        fallback, count_proven, constraints = _most_jobs_stage(problem, model, search, fallback)
    search.stage("stage 2 of 2: the best total" if two_stages else "solving")
    return _best_total_stage(problem, model, search, fallback, constraints, count_proven)


def _most_jobs_stage(problem: _ShiftProblem, model: _Model, search: _Search,
                     fallback: np.ndarray | None) -> tuple[np.ndarray | None, bool, list]:
    """Stage 1: the most jobs that fit, in half the time left. Returns the floor plan,
    whether that count is proven maximal, and the constraints with the count required."""
    search.stage("stage 1 of 2: the most jobs that fit")
    n_var = model.size
    left = search.time_left()
    # The most jobs, then the most priority jobs, in one objective: a job counts P + 1, a
    # priority job P + 2 (P priority jobs), so one more job outweighs every priority job.
    prio = problem.priority if problem.priority is not None else np.zeros(problem.shape[0], bool)
    prio_var = prio[model.job_of_var] & ~problem.must[model.job_of_var]
    weight = float(prio_var.sum() + 1)
    first = _milp(-(weight + prio_var.astype(float)), model.integrality, model.bounds,
                  model.constraints, None if left is None else left / 2)
    if first.status == 2:
        _raise_infeasible(problem.must, problem.usable)
    if first.x is not None and (fallback is None or first.x.sum() > fallback.sum() + 0.5):
        fallback = np.round(first.x)
    if fallback is None and problem.must.any():
        raise search.no_plan(problem.must)
    count_needed = 0.0 if fallback is None else float(fallback.sum())
    constraints = model.constraints + [LinearConstraint(np.ones((1, n_var)), count_needed, np.inf)]
    if prio_var.any() and fallback is not None:
        prio_needed = float(fallback[prio_var].sum())
        constraints.append(LinearConstraint(prio_var.astype(float)[None, :], prio_needed, np.inf))
    return fallback, first.status == 0, constraints


def _best_total_stage(problem: _ShiftProblem, model: _Model, search: _Search,
                      fallback: np.ndarray | None, constraints: list,
                      count_proven: bool) -> _Outcome:
    """Stage 2: the best total among plans running the required number of jobs."""
    coef = model.coef
    res = _milp(coef, model.integrality, model.bounds, constraints, search.time_left())
    if res.status == 2:
        _raise_infeasible(problem.must, problem.usable)
    if res.x is not None and (fallback is None or res.status == 0
                              or coef @ np.round(res.x) <= coef @ fallback):
        x = np.round(res.x)
    elif fallback is not None:
        x = fallback
    elif problem.must.any():
        raise search.no_plan(problem.must)
    else:
        x = np.zeros(model.size)
    dual = getattr(res, "mip_dual_bound", None)
    if dual is None or not np.isfinite(dual):
        dual = float(coef[coef < 0].sum())  # every pair at its best: a valid bound
    return _Outcome(x, res.status == 0 and count_proven, count_proven, float(dual) + model.const)


def _shift_plan(problem: _ShiftProblem, model: _Model, outcome: _Outcome,
                search: _Search) -> ShiftPlan:
    """Step 4: the plan in job and machine terms, its run order, bound and status text."""
    n_jobs, n_machines = problem.shape
    machine_of_job = np.full(n_jobs, -1, dtype=np.int64)
    chosen = outcome.x > 0.5
    machine_of_job[model.job_of_var[chosen]] = model.machine_of_var[chosen]
    total = _plan_total(problem.values, machine_of_job, problem.penalty, problem.objective)
    bound = -outcome.bound_min if problem.maximize else outcome.bound_min
    if outcome.proven:
        bound = total
    gap = abs(total - bound) / max(abs(total), 1.0)
    placed = machine_of_job >= 0
    hours_used = np.bincount(machine_of_job[placed],
                             weights=problem.hours[np.flatnonzero(placed), machine_of_job[placed]],
                             minlength=n_machines).astype(float)
    order = tuple(run_order(np.flatnonzero(machine_of_job == j), problem.rush, problem.due)
                  for j in range(n_machines))
    return ShiftPlan(
        machine_of_job=machine_of_job, total=total, proven_optimal=bool(outcome.proven),
        bound=bound, gap=gap, status=STATUS_OPTIMAL if outcome.proven else STATUS_TIME_LIMIT,
        status_text=_status_text(outcome, gap, search.time_limit),
        objective=problem.objective, jobs_on_machine=order, hours_used=hours_used,
        capacity=problem.capacity, values=problem.values, hours=problem.hours,
        allowed=problem.mask & ~problem.forbidden, wait_penalty=problem.penalty,
        must_run=problem.must, pinned_machine=problem.pinned,
        count_proven_maximal=bool(outcome.count_proven),
        seconds=time.perf_counter() - search.started)


def _status_text(outcome: _Outcome, gap: float, time_limit: float | None) -> str:
    if outcome.proven:
        return "proven optimal"
    limit = "" if time_limit is None else f" within {time_limit:g} s"
    text = f"best found{limit}; proven gap {gap:.2%}"
    if not outcome.count_proven:
        text += "; the number of jobs run is not proven maximal"
    return text


def _greedy(job_of_var: np.ndarray, machine_of_var: np.ndarray, hours: np.ndarray,
            cap: np.ndarray, coef: np.ndarray, must: np.ndarray, forced: np.ndarray,
            most_jobs_first: bool) -> np.ndarray | None:
    """A quick feasible plan (None if it misses a must-run job), used as a floor under a
    time limit. Common practice for bin packing and GAP heuristics: pinned, then must-run
    jobs first, then the shortest jobs (to run many); each job takes its best-valued pair
    that still fits, and with ``most_jobs_first`` off only pairs that improve the total.
    """
    x = np.zeros(job_of_var.size)
    left = cap.astype(float).copy()
    for v in np.flatnonzero(forced > 0):
        x[v] = 1.0
        left[machine_of_var[v]] -= hours[v]
    done = np.zeros(must.size, dtype=bool)
    done[job_of_var[forced > 0]] = True
    shortest = np.full(must.size, np.inf)
    np.minimum.at(shortest, job_of_var, hours)
    for i in np.lexsort((shortest, ~must)):
        if done[i] or not np.isfinite(shortest[i]):
            continue
        pairs = np.flatnonzero(job_of_var == i)
        for v in pairs[np.argsort(coef[pairs], kind="stable")]:
            if not (must[i] or most_jobs_first or coef[v] < 0):
                break
            if hours[v] <= left[machine_of_var[v]] + 1e-12:
                x[v] = 1.0
                left[machine_of_var[v]] -= hours[v]
                done[i] = True
                break
    if (must & ~done).any() or (left < -1e-9).any():
        return None
    return x


def _no_plan_text(time_limit, must: np.ndarray) -> str:
    return (f"no plan running all {int(must.sum())} must-run jobs was found within "
            f"{time_limit:g} s; allow more time or fewer must-run jobs")


def _raise_infeasible(must: np.ndarray, usable: np.ndarray) -> None:
    jobs = np.flatnonzero(must)
    machines = np.flatnonzero(usable[jobs].any(axis=0)) if jobs.size else np.zeros(0, int)
    raise ShiftInfeasibleError(
        f"must-run jobs {', '.join(map(str, jobs))} cannot all fit in the hours of their "
        f"machines ({', '.join(map(str, machines)) or 'none'}): the solver proved that no "
        "plan runs them all", jobs, machines)
