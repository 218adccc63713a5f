"""Dispatch with a crew: every machine that gets a job gets a present, qualified operator.

The one-round model with one job per machine is a flow network::

    source -> tier hub -> job -> machine(in) -> machine(out) -> operator -> sink
                                                  \\-> sink   (machines that need no operator)

with unit capacities on jobs and machines and an operator's minding capacity (how many
machines one person runs at once) on the operator's arc to the sink. A plan is, in
order of aims:

1. as many jobs placed as the allowed pairs *and the crew* permit;
2. among those, as many must-run jobs as possible (all of them, or
   :class:`~dispatcher.engine.assignment.InfeasibleError`), then as many kept jobs (a
   running machine's own job, never refused), then as many rush jobs as possible;
3. among those, the cheapest (objective ``"total"``) or most valuable (``"maximize"``).

The sets of jobs that can be routed to the sink together are the independent sets of a
gammoid (Perfect 1968), so the three maxima are reached together (Mendelsohn and Dulmage
1958 for the matching case) and a greedy choice of tier counts is exact. The tier counts
are found by maximum flows (scipy's ``maximum_flow``); the cheapest plan with those
counts is a minimum-cost flow computed here by successive shortest paths with node
potentials (Edmonds and Karp 1972; Tomizawa 1971), each shortest path by scipy's
Dijkstra on reduced costs. The network matrix is totally unimodular, so the LP
relaxation is integral and the potentials are an optimal dual: :meth:`StaffedPlan.verify`
re-checks them together with one minimum cut per tier that proves each count maximal
(max-flow min-cut, Ford and Fulkerson 1956).

For machines that take several jobs at once an operator still minds the machine, not
the jobs, which no flow models; :func:`staffed_dispatch` then solves the same aims as a
mixed-integer program with scipy's ``milp`` (HiGHS).

References
----------
Edmonds, J. and Karp, R. M. (1972). Theoretical improvements in algorithmic efficiency
for network flow problems. J. ACM 19(2), 248-264. doi:10.1145/321694.321699
Tomizawa, N. (1971). On some techniques useful for solution of transportation network
problems. Networks 1(2), 173-194. doi:10.1002/net.3230010206
Ford, L. R. and Fulkerson, D. R. (1956). Maximal flow through a network. Canadian J.
Math. 8, 399-404. doi:10.4153/CJM-1956-045-5
Perfect, H. (1968). Applications of Menger's graph theorem. J. Math. Anal. Appl. 22(1),
96-111. doi:10.1016/0022-247X(68)90163-7
Mendelsohn, N. S. and Dulmage, A. L. (1958). Some generalizations of the problem of
distinct representatives. Canadian J. Math. 10, 230-241. doi:10.4153/CJM-1958-024-4
"""

from __future__ import annotations

import itertools
from dataclasses import dataclass, field

import numpy as np
from scipy.sparse import csr_matrix
from scipy.sparse.csgraph import breadth_first_order, dijkstra, maximum_flow

from .assignment import DispatchInputError, InfeasibleError, _check_inputs
from .matching import HallWitness, maximum_matching

__all__ = ["StaffedPlan", "StaffingShortage", "restaff", "staffed_dispatch"]

#: Tiers of jobs, highest priority first: must-run, kept (placed before rush jobs but
#: never refused: a running machine's own job), rush, the others.
TIER_MUST, TIER_KEEP, TIER_RUSH, TIER_OTHER = 0, 1, 2, 3
_TIERS = 4


@dataclass(frozen=True)
class StaffingShortage:
    """Why jobs that machines could take wait for want of operators.

    ``could_run`` jobs could be placed if every machine had an operator, ``placed`` are
    placed with the crew present; the difference waits. ``machines`` are the machines
    behind the bottleneck (source side of a minimum cut) and ``operators`` the present,
    qualified operators who can mind them, with ``capacity`` machines between them.
    """

    could_run: int
    placed: int
    machines: np.ndarray
    operators: np.ndarray
    capacity: int

    @property
    def waiting(self) -> int:
        return self.could_run - self.placed


@dataclass(frozen=True)
class StaffedPlan:
    """A plan with an operator per running machine, and what proves it optimal.

    ``machine_of_job[i]``: machine of job i, -1 when it waits. ``operator_of_machine[m]``:
    operator minding machine m, -1 when m gets no job or needs nobody. ``tier_counts``:
    jobs placed per tier (must-run, kept, rush, other). ``cuts``: for each cumulative tier
    (must-run; and kept; and rush; all jobs) the node set of a minimum cut of the network
    whose capacity equals the jobs placed from those tiers. ``potential``: node
    potentials with non-negative reduced cost on every residual arc of the final flow
    (``None`` for plans solved as a MILP, whose optimality is HiGHS's).
    """

    machine_of_job: np.ndarray
    operator_of_machine: np.ndarray
    total: float
    objective: str
    values: np.ndarray
    allowed: np.ndarray
    qualified: np.ndarray
    capacity: np.ndarray
    needs_operator: np.ndarray
    wait_penalty: np.ndarray
    tier: np.ndarray
    tier_counts: tuple[int, ...]
    method: str
    slots: np.ndarray | None = None
    cuts: tuple = ()
    potential: np.ndarray | None = None
    shortage: StaffingShortage | None = None
    _network: object = field(default=None, repr=False, compare=False)
    _flow: object = field(default=None, repr=False, compare=False)

    @property
    def planned_count(self) -> int:
        return int((self.machine_of_job >= 0).sum())

    @property
    def waiting_jobs(self) -> np.ndarray:
        return np.flatnonzero(self.machine_of_job < 0)

    @property
    def rush_waiting(self) -> np.ndarray:
        """Rush jobs (tier 1) left waiting."""
        return np.flatnonzero((self.tier == TIER_RUSH) & (self.machine_of_job < 0))

    def setup_total(self) -> float:
        placed = self.machine_of_job >= 0
        return float(self.values[np.flatnonzero(placed), self.machine_of_job[placed]].sum())

    def penalty_total(self) -> float:
        return float(self.wait_penalty[self.machine_of_job < 0].sum())

    def verify(self) -> bool:
        """Re-check feasibility, staffing, the tier counts' cuts and the potentials."""
        _n_jobs, n_machines = self.values.shape
        placed = self.machine_of_job >= 0
        machines = self.machine_of_job[placed]
        slots = np.ones(n_machines, np.int64) if self.slots is None else self.slots
        if (np.bincount(machines, minlength=n_machines) > slots).any():
            return False
        if not self.allowed[np.flatnonzero(placed), machines].all():
            return False
        if ((self.tier == TIER_MUST) & ~placed).any():
            return False
        running = np.zeros(n_machines, dtype=bool)
        running[machines] = True
        op = self.operator_of_machine
        if ((op >= 0) & ~running).any():
            return False
        staffed = running & self.needs_operator
        if (op[staffed] < 0).any() or (op[running & ~self.needs_operator] >= 0).any():
            return False
        ms = np.flatnonzero(staffed)
        if ms.size and not self.qualified[op[ms], ms].all():
            return False
        if (np.bincount(op[ms], minlength=len(self.capacity)) > self.capacity).any():
            return False
        counts = tuple(int((placed & (self.tier == t)).sum()) for t in range(_TIERS))
        if counts != tuple(self.tier_counts):
            return False
        total = self.setup_total()
        total = total - self.penalty_total() if self.objective == "maximize" else total + self.penalty_total()
        if not np.isclose(total, self.total):
            return False
        if self.method != "flow":
            return True
        net = self._network
        # Max-flow min-cut: a cut of capacity equal to the flow proves each count maximal.
        for upto, cut in enumerate(self.cuts):
            sources = self.tier <= upto
            if net.cut_capacity(cut, sources, self.qualified, self.capacity) != sum(counts[: upto + 1]):
                return False
        # Capacities and costs rebuilt from the plan's own inputs, not kept from the solver.
        cap = net.caps(np.asarray(self.tier_counts), self.qualified, self.capacity)
        cost = _arc_costs(net, self.values, self.wait_penalty, self.objective)
        return net.reduced_costs_ok(self.potential, cap, cost, self.machine_of_job,
                                    self.operator_of_machine)


class _Network:
    """The flow network of one staffed round: node numbering and a fixed arc layout.

    Arcs, in this order: source -> tier hub (3), hub -> job, job -> machine-in (allowed
    pairs), machine-in -> machine-out, machine-out -> operator (every operator and every
    machine that needs one; capacity 0 where the operator is absent or not authorised),
    machine-out -> sink (machines that need nobody), operator -> sink. The layout depends
    only on the shop and the tiers, so a change of crew changes capacities, never arcs,
    and a warm re-plan keeps every array.
    """

    def __init__(self, allowed, needs_operator, n_ops, tier):
        n_jobs, n_machines = allowed.shape
        self.n_jobs, self.n_machines, self.n_ops = n_jobs, n_machines, n_ops
        self.source = 0
        self.hub0 = 1  # one hub per tier: 1, 2, 3
        self.job0 = 1 + _TIERS
        self.min0 = self.job0 + n_jobs
        self.mout0 = self.min0 + n_machines
        self.op0 = self.mout0 + n_machines
        self.sink = self.op0 + n_ops
        self.n_nodes = self.sink + 1
        self.allowed, self.needs, self.tier = allowed, needs_operator, tier
        self.jm_job, self.jm_machine = np.nonzero(allowed)
        self.mo_op, self.mo_machine = np.nonzero(np.ones((n_ops, n_machines), bool)
                                                 & needs_operator[None, :])
        self.free_machines = np.flatnonzero(~needs_operator)
        sizes = [_TIERS, n_jobs, self.jm_job.size, n_machines, self.mo_op.size,
                 self.free_machines.size, n_ops]
        bounds = np.cumsum([0] + sizes)
        (self.s_hub, self.s_job, self.s_jm, self.s_mm, self.s_mo, self.s_free,
         self.s_op) = (slice(int(x), int(y)) for x, y in itertools.pairwise(bounds))
        j, m, o = self.job0, self.min0, self.mout0
        self.tails = np.concatenate([
            np.full(_TIERS, self.source), self.hub0 + tier, j + self.jm_job,
            m + np.arange(n_machines), o + self.mo_machine, o + self.free_machines,
            self.op0 + np.arange(n_ops)]).astype(np.int64)
        self.heads = np.concatenate([
            self.hub0 + np.arange(_TIERS), j + np.arange(n_jobs), m + self.jm_machine,
            o + np.arange(n_machines), self.op0 + self.mo_op,
            np.full(self.free_machines.size, self.sink), np.full(n_ops, self.sink)]).astype(np.int64)
        # The cut networks feed every job from the first hub (one layout for all tiers).
        self.cut_tails = self.tails.copy()
        self.cut_tails[self.s_job] = self.hub0
        ids = csr_matrix((np.arange(1, self.tails.size + 1), (self.cut_tails, self.heads)),
                         shape=(self.n_nodes,) * 2)
        self._cut_layout = (ids.indptr, ids.indices, ids.data - 1)
        self.residual = _ResidualLayout(self.n_nodes, self.tails, self.heads)

    def caps(self, hub_caps, qualified, capacity) -> np.ndarray:
        cap = np.ones(self.tails.size, np.int64)
        cap[self.s_hub] = hub_caps
        cap[self.s_mo] = qualified[self.mo_op, self.mo_machine]
        cap[self.s_op] = capacity
        return cap

    def costs(self, job_cost) -> np.ndarray:
        cost = np.zeros(self.tails.size)
        cost[self.s_jm] = job_cost
        return cost

    def cut_caps(self, sources, qualified, capacity) -> np.ndarray:
        """Capacities of the network fed by ``sources`` only (through the first hub)."""
        cap = self.caps(np.r_[sources.sum(), np.zeros(_TIERS - 1, np.int64)], qualified, capacity)
        cap[self.s_job] = sources
        return cap

    def max_flow(self, sources, qualified, capacity) -> tuple[int, np.ndarray]:
        """Maximum number of the given jobs routed together, and a minimum cut (node mask)."""
        if not sources.any():
            # Nothing to route: every arc out of the source has capacity 0, so the cut is
            # the source alone (what the search below finds, without building the graph).
            reach = np.zeros(self.n_nodes, bool)
            reach[self.source] = True
            return 0, reach
        cap = self.cut_caps(sources, qualified, capacity)
        indptr, indices, arc = self._cut_layout
        graph = csr_matrix((cap[arc].astype(np.int32), indices, indptr), shape=(self.n_nodes,) * 2)
        result = maximum_flow(graph, self.source, self.sink)
        # scipy's flow is antisymmetric (F[v, u] = -F[u, v]), so capacity minus flow is
        # the residual capacity of forward and backward arcs alike.
        residual = graph - result.flow
        residual.data = (residual.data > 0).astype(np.int8)
        residual.eliminate_zeros()
        order = breadth_first_order(residual, self.source, return_predecessors=False)
        reach = np.zeros(self.n_nodes, bool)
        reach[order] = True
        return int(result.flow_value), reach

    def cut_capacity(self, cut, sources, qualified, capacity) -> int:
        """Capacity of the arcs leaving ``cut`` in the network fed by ``sources`` only."""
        if not cut[self.source] or cut[self.sink]:
            return -1
        cap = self.cut_caps(sources, qualified, capacity)
        crossing = cut[self.cut_tails] & ~cut[self.heads]
        return int(cap[crossing].sum())

    def flow_of(self, machine_of_job, operator_of_machine) -> np.ndarray:
        """Arc flows of a plan, recomputed from the plan itself (not kept from the solver)."""
        flow = np.zeros(self.tails.size, np.int64)
        placed = np.flatnonzero(machine_of_job >= 0)
        machines = machine_of_job[placed]
        np.add.at(flow, self.s_hub.start + self.tier[placed], 1)
        flow[self.s_job.start + placed] = 1
        jm_pos = np.searchsorted(self.jm_job * self.n_machines + self.jm_machine,
                                 placed * self.n_machines + machines)
        flow[self.s_jm.start + jm_pos] = 1
        flow[self.s_mm.start + machines] = 1
        ops = operator_of_machine[machines]
        staffed = ops >= 0
        mo_pos = np.searchsorted(self.mo_op * self.n_machines + self.mo_machine,
                                 ops[staffed] * self.n_machines + machines[staffed])
        flow[self.s_mo.start + mo_pos] = 1
        free_pos = np.searchsorted(self.free_machines, machines[~staffed])
        flow[self.s_free.start + free_pos] = 1
        np.add.at(flow, self.s_op.start + ops[staffed], 1)
        return flow

    def reduced_costs_ok(self, potential, cap, cost, machine_of_job, operator_of_machine) -> bool:
        """Optimality of the plan's flow: reduced cost >= 0 on every residual arc."""
        flow = self.flow_of(machine_of_job, operator_of_machine)
        if (flow > cap).any():
            return False
        red = cost + potential[self.tails] - potential[self.heads]
        tol = 1e-9 * max(1.0, float(np.abs(cost).max(initial=0))) * self.n_nodes
        return bool((red[flow < cap] >= -tol).all() and (red[flow > 0] <= tol).all())


class _ResidualLayout:
    """Forward and backward residual arcs of a network in one fixed CSR order."""

    def __init__(self, n_nodes, tails, heads):
        n_arcs = tails.size
        all_t = np.r_[tails, heads]
        all_h = np.r_[heads, tails]
        key = all_t * n_nodes + all_h
        order = np.argsort(key, kind="stable")
        self.n_nodes = n_nodes
        self.key = key[order]
        self.indptr = np.searchsorted(all_t[order], np.arange(n_nodes + 1))
        self.tail, self.head = all_t[order], all_h[order]
        self.arc = np.where(order < n_arcs, order, order - n_arcs)
        self.back = order >= n_arcs


def _min_cost_flow(layout, tails, heads, cap, cost, supply, flow=None, pot=None):
    """Cheapest flow meeting ``supply`` (> 0 source, < 0 sink), warm from ``flow``/``pot``.

    Successive shortest paths on a pseudoflow (Edmonds and Karp 1972; Tomizawa 1971):
    the flow is kept reduced-cost optimal for the potentials (every open arc has
    ``cost + pot[tail] - pot[head] >= 0``) while excess is sent to the nearest deficit
    by Dijkstra on reduced costs. A warm start may begin from any flow: it is clipped to
    the capacities and arcs whose reduced cost is negative are saturated, which keeps
    optimality and only moves imbalance. Returns arc flows, potentials and the supply
    left unmet (0 when every node is balanced).
    """
    n_nodes = layout.n_nodes
    flow = np.zeros(tails.size, np.int64) if flow is None else np.minimum(flow, cap)
    pot = np.zeros(n_nodes) if pot is None else pot.astype(float).copy()
    flow = np.where(cost + pot[tails] - pot[heads] < 0, cap, flow)
    s_cap = cap[layout.arc]
    s_cost = np.where(layout.back, -cost[layout.arc], cost[layout.arc])
    # Node excesses and residual room are worked out once and then moved along each
    # augmenting path (the path's arcs and their twins, its two end nodes) - not recounted
    # over every arc at each step.
    excess = supply + np.bincount(heads, flow, n_nodes) - np.bincount(tails, flow, n_nodes)
    excess = np.rint(excess).astype(np.int64)
    f = flow[layout.arc]
    room = np.where(layout.back, f, s_cap - f)
    while True:
        starts = np.flatnonzero(excess > 0)
        if starts.size == 0:
            return flow, pot, 0
        start = int(starts[0])
        # A closed arc weighs inf (scipy's Dijkstra never takes it); explicit zeros are arcs.
        weight = np.where(room > 0, np.maximum(s_cost + pot[layout.tail] - pot[layout.head], 0.0),
                          np.inf)
        graph = csr_matrix((weight, layout.head, layout.indptr), shape=(n_nodes, n_nodes))
        dist, pred = dijkstra(graph, indices=start, return_predecessors=True)
        deficits = np.flatnonzero((excess < 0) & np.isfinite(dist))
        if deficits.size == 0:
            return flow, pot, int(excess[excess > 0].sum())
        target = int(deficits[np.argmin(dist[deficits])])
        pot += np.minimum(dist, dist[target])
        path = _path_nodes(pred, target)
        pos = np.searchsorted(layout.key, path[1:] * n_nodes + path[:-1])
        delta = int(min(room[pos].min(), excess[start], -excess[target]))
        ids, back = layout.arc[pos], layout.back[pos]
        flow[ids[~back]] += delta
        flow[ids[back]] -= delta
        excess[start] -= delta
        excess[target] += delta
        twins = np.searchsorted(layout.key, path[:-1] * n_nodes + path[1:])
        room[pos] -= delta
        room[twins] += delta


def _path_nodes(pred, sink) -> np.ndarray:
    nodes = []
    node = sink
    while node >= 0:
        nodes.append(node)
        node = int(pred[node])
    return np.array(nodes, np.int64)


def _check_crew(n_machines, qualified, capacity, needs_operator):
    q = np.asarray(qualified)
    if q.ndim != 2 or q.shape[1] != n_machines:
        raise DispatchInputError(
            f"qualified must be operators x machines ({n_machines} machines), got shape {q.shape}")
    if q.dtype != bool:
        raise DispatchInputError(f"qualified must be boolean, got {q.dtype}")
    n_ops = q.shape[0]
    cap = np.ones(n_ops, np.int64) if capacity is None else np.asarray(capacity).reshape(-1)
    if cap.shape != (n_ops,):
        raise DispatchInputError(f"capacity needs {n_ops} entries, got {cap.size}")
    if not np.issubdtype(cap.dtype, np.integer):
        if not np.all(np.isfinite(cap)) or not np.all(cap == np.round(cap)):
            raise DispatchInputError("operator capacities must be whole numbers")
        cap = cap.astype(np.int64)
    if (cap < 1).any():
        raise DispatchInputError(
            f"operator {int(np.argmax(cap < 1))} has capacity {int(cap.min())}: it must be at least 1")
    needs = np.ones(n_machines, bool) if needs_operator is None else np.asarray(needs_operator, bool)
    if needs.shape != (n_machines,):
        raise DispatchInputError(f"needs_operator needs {n_machines} entries, got {needs.size}")
    return q, cap.astype(np.int64), needs


def staffed_dispatch(costs, allowed=None, *, qualified, capacity=None, needs_operator=None,
                     objective: str = "total", wait_penalty=None, rush=None, must_run=None,
                     keep=None, slots=None) -> StaffedPlan:
    """Certified plan in which every running machine has a present, qualified operator.

    Parameters
    ----------
    costs : array (jobs x machines)
        Setup time or cost of each pair, finite and >= 0 wherever allowed.
    allowed : bool array (jobs x machines), optional
        False where the machine cannot run the job.
    qualified : bool array (operators x machines)
        True where the operator is present and authorised for the machine (absent
        operators and expired authorisations are rows or entries of False).
    capacity : int array (operators), optional
        How many machines each operator can mind at once (default 1).
    needs_operator : bool array (machines), optional
        False for machines that run unattended (default: every machine needs one).
    objective : {"total", "maximize"}
        Minimise ``setups + wait penalties`` or maximise ``values - wait penalties``.
    wait_penalty, rush, must_run : arrays (jobs), optional
        Penalty per waiting job; rush jobs are placed before others when not all can
        be; must-run jobs are never left waiting (else :class:`InfeasibleError`).
    keep : bool array (jobs), optional
        Jobs placed right after the must-run jobs and before rush jobs, but left
        waiting rather than refused when the crew cannot cover them (a machine's
        running job whose operator left).
    slots : int array (machines), optional
        Jobs a machine takes at once (default 1). Any value above 1 switches to the
        mixed-integer model.

    Returns
    -------
    StaffedPlan
        Call :meth:`StaffedPlan.verify` to re-check it.

    Raises
    ------
    DispatchInputError
        Numbers that do not describe a staffed dispatch problem.
    InfeasibleError
        Must-run jobs that cannot all be placed with the crew present.

    Notes
    -----
    One job per machine: two maximum flows per tier and ``k`` Dijkstra runs for ``k``
    placed jobs, ``O(k (E + V log V))``. Several slots: three HiGHS MILPs in sequence.

    References
    ----------
    See the module docstring (Edmonds and Karp 1972; Tomizawa 1971; Ford and Fulkerson
    1956; Perfect 1968; Mendelsohn and Dulmage 1958).

    Examples
    --------
    >>> import numpy as np
    >>> plan = staffed_dispatch(np.array([[1.0, 5.0], [2.0, 1.0]]),
    ...                         qualified=np.array([[True, True]]))
    >>> plan.planned_count, plan.verify()
    (1, True)
    """
    if objective not in ("total", "maximize"):
        raise DispatchInputError(f"a staffed plan supports objectives total and maximize, got {objective!r}")
    values, mask, penalty, must = _check_inputs(costs, allowed, wait_penalty, must_run)
    n_jobs, n_machines = values.shape
    qual, cap, needs = _check_crew(n_machines, qualified, capacity, needs_operator)
    tier = np.full(n_jobs, TIER_OTHER)
    if rush is not None:
        r = np.asarray(rush, bool).reshape(-1)
        if r.shape != (n_jobs,):
            raise DispatchInputError(f"rush needs {n_jobs} entries, got {r.size}")
        tier[r] = TIER_RUSH
    if keep is not None:
        k = np.asarray(keep, bool).reshape(-1)
        if k.shape != (n_jobs,):
            raise DispatchInputError(f"keep needs {n_jobs} entries, got {k.size}")
        tier[k] = TIER_KEEP
    tier[must] = TIER_MUST
    slot = np.ones(n_machines, np.int64) if slots is None else np.asarray(slots, np.int64).reshape(-1)
    if slot.shape != (n_machines,) or (slot < 1).any():
        raise DispatchInputError(f"slots needs {n_machines} whole numbers >= 1")
    if (slot > 1).any():
        return _staffed_milp(values, mask, qual, cap, needs, penalty, tier, slot, objective)
    return _staffed_flow(values, mask, qual, cap, needs, penalty, tier, objective)


def restaff(plan: StaffedPlan, *, qualified, capacity=None, needs_operator=None) -> StaffedPlan:
    """Re-plan warm after the crew changed (an operator left, arrived or was re-authorised).

    Same aims and same certificate as :func:`staffed_dispatch` on the new crew, starting
    from ``plan``'s flow and potentials: the flow through arcs that still exist is kept,
    so only the jobs and machines the change touches are re-routed (a few shortest
    paths instead of one per placed job). Operators keep their row numbers: an operator
    who leaves is a row of False.

    Parameters
    ----------
    plan : StaffedPlan
        A one-slot plan from :func:`staffed_dispatch` (``method == "flow"``).
    qualified, capacity, needs_operator
        The new crew, as for :func:`staffed_dispatch`.

    Returns
    -------
    StaffedPlan

    References
    ----------
    Edmonds and Karp (1972); Tomizawa (1971): successive shortest paths keep any
    reduced-cost optimal pseudoflow optimal, so a warm start is exact.
    """
    if plan.method != "flow":
        raise DispatchInputError("a warm re-plan needs a one-slot plan (machines with several "
                                 "slots are re-solved from scratch)")
    qual, cap, needs = _check_crew(plan.values.shape[1], qualified, capacity, needs_operator)
    if qual.shape != plan.qualified.shape:
        raise DispatchInputError(f"the crew must keep its {plan.qualified.shape[0]} operator rows")
    old = plan._network
    same_layout = bool((needs == old.needs).all())
    net = old if same_layout else _Network(plan.allowed, needs, qual.shape[0], plan.tier)
    flow = plan._flow if same_layout else _carry_flow(net, old, plan._flow)
    return _staffed_flow(plan.values, plan.allowed, qual, cap, needs, plan.wait_penalty, plan.tier,
                         plan.objective, net=net, warm=(flow, plan.potential))


def _staffed_flow(values, mask, qual, cap, needs, penalty, tier, objective, net=None, warm=None):
    n_jobs, n_machines = values.shape
    net = net or _Network(mask, needs, qual.shape[0], tier)
    cumulative, cuts = [], []
    for upto in range(_TIERS):
        if upto and not (tier == upto).any():
            # no job in this tier: the same jobs as the tier before, the same flow and cut
            count, cut = cumulative[-1], cuts[-1].copy()
        else:
            count, cut = net.max_flow(tier <= upto, qual, cap)
        cumulative.append(count)
        cuts.append(cut)
    n_must = int((tier == TIER_MUST).sum())
    if cumulative[0] < n_must:
        witness = _must_witness(net, cuts[0], tier)
        raise InfeasibleError(
            f"{n_must - cumulative[0]} of {n_must} must-run jobs cannot be placed with the "
            "crew present", witness)
    arc_cost = _arc_costs(net, values, penalty, objective)
    arc_cap = net.caps(np.diff(np.r_[0, cumulative]), qual, cap)
    supply = np.zeros(net.n_nodes)
    supply[net.source], supply[net.sink] = cumulative[-1], -cumulative[-1]
    start_flow, start_pot = warm if warm is not None else (None, None)
    flow, pot, unmet = _min_cost_flow(net.residual, net.tails, net.heads, arc_cap, arc_cost,
                                      supply, start_flow, start_pot)
    if unmet:  # pragma: no cover - the maximum flow says the supply can be met
        raise AssertionError("the minimum-cost flow fell short of the maximum flow")
    machine_of_job = np.full(n_jobs, -1, np.int64)
    operator_of_machine = np.full(n_machines, -1, np.int64)
    on = flow[net.s_jm] > 0
    machine_of_job[net.jm_job[on]] = net.jm_machine[on]
    on = flow[net.s_mo] > 0
    operator_of_machine[net.mo_machine[on]] = net.mo_op[on]
    shortage = _shortage(mask, qual, cap, net, cuts[-1], cumulative[-1])
    plan = _finish(values, mask, qual, cap, needs, penalty, tier, objective, machine_of_job,
                   operator_of_machine, "flow", tuple(cuts), pot, shortage, net)
    object.__setattr__(plan, "_flow", flow)
    return plan


def _arc_costs(net, values, penalty, objective) -> np.ndarray:
    """Arc costs: placing a job earns its wait penalty; a constant shift keeps every cost
    >= 0 and changes every plan of the same size by the same amount."""
    jm_value = values[net.jm_job, net.jm_machine]
    jm_pen = penalty[net.jm_job]
    gain = jm_value + jm_pen if objective == "maximize" else jm_pen - jm_value
    return net.costs(gain.max(initial=0) - gain)


def _carry_flow(net, old, old_flow) -> np.ndarray:
    """Flow of the old network on the arcs (tail, head) the new network still has."""
    old_key = old.tails * old.n_nodes + old.heads
    key = net.tails * net.n_nodes + net.heads
    order = np.argsort(old_key)
    pos = np.minimum(np.searchsorted(old_key[order], key), len(order) - 1)
    hit = old_key[order][pos] == key
    out = np.zeros(net.tails.size, np.int64)
    out[hit] = old_flow[order][pos[hit]]
    return out


def _finish(values, mask, qual, cap, needs, penalty, tier, objective, machine_of_job,
            operator_of_machine, method, cuts, pot, shortage, net):
    placed = machine_of_job >= 0
    setups = float(values[np.flatnonzero(placed), machine_of_job[placed]].sum())
    pen = float(penalty[~placed].sum())
    total = setups - pen if objective == "maximize" else setups + pen
    counts = tuple(int((placed & (tier == t)).sum()) for t in range(_TIERS))
    return StaffedPlan(machine_of_job=machine_of_job, operator_of_machine=operator_of_machine,
                       total=total, objective=objective, values=values, allowed=mask,
                       qualified=qual, capacity=cap, needs_operator=needs, wait_penalty=penalty,
                       tier=tier, tier_counts=counts, method=method, cuts=cuts, potential=pot,
                       shortage=shortage, _network=net)


def _shortage(mask, qual, cap, net, cut, placed) -> StaffingShortage | None:
    """König–Egerváry on the operator side: the machines and operators a minimum cut holds.

    Machines on the source side of the cut could take more jobs; the operators on that
    side who can mind them are saturated, and their capacity is the bottleneck.
    """
    could = int((maximum_matching(mask) >= 0).sum())
    if could <= placed:
        return None
    machines = np.flatnonzero(cut[net.min0: net.min0 + net.n_machines] & net.needs)
    on_side = cut[net.op0: net.op0 + net.n_ops]
    able = qual[:, machines].any(axis=1) if machines.size else np.zeros(net.n_ops, bool)
    operators = np.flatnonzero(on_side & able)
    return StaffingShortage(could_run=could, placed=placed, machines=machines,
                            operators=operators, capacity=int(cap[operators].sum()))


def _must_witness(net, cut, tier) -> HallWitness:
    jobs = np.flatnonzero((tier == TIER_MUST) & cut[net.job0: net.job0 + net.n_jobs])
    machines = np.flatnonzero(cut[net.min0: net.min0 + net.n_machines])
    return HallWitness(jobs, machines)


def _staffed_milp(values, mask, qual, cap, needs, penalty, tier, slot, objective):
    """Several slots per machine: x (job, machine), y (machine runs), z (operator, machine)."""
    from scipy.optimize import Bounds, LinearConstraint, milp
    from scipy.sparse import coo_matrix

    n_jobs, n_machines = values.shape
    jm_j, jm_m = np.nonzero(mask)
    staff = qual & needs[None, :]
    mo_o, mo_m = np.nonzero(staff)
    nx, ny, nz = jm_j.size, n_machines, mo_o.size
    nv = nx + ny + nz
    xi, yi, zi = np.arange(nx), nx + np.arange(ny), nx + ny + np.arange(nz)

    def rows(row_of, col, data, n_rows):
        return coo_matrix((data, (row_of, col)), shape=(n_rows, nv))

    cons = []
    # each job at most once; must-run exactly once
    a = rows(jm_j, xi, np.ones(nx), n_jobs)
    lo = np.where(tier == TIER_MUST, 1.0, 0.0)
    cons.append(LinearConstraint(a, lo, np.ones(n_jobs)))
    # jobs on a machine <= slots * y, and y <= jobs on it (a machine runs only with a job)
    machine_rows = np.r_[jm_m, np.arange(ny)]
    machine_cols = np.r_[xi, yi]
    cons.append(LinearConstraint(rows(machine_rows, machine_cols,
                                      np.r_[np.ones(nx), -slot.astype(float)], n_machines),
                                 -np.inf, 0.0))
    cons.append(LinearConstraint(rows(machine_rows, machine_cols,
                                      np.r_[-np.ones(nx), np.ones(ny)], n_machines),
                                 -np.inf, 0.0))
    # sum_o z = y for machines that need an operator; z = 0 handled by variable set
    need_rows = np.flatnonzero(needs)
    if need_rows.size:
        pos = {int(m): r for r, m in enumerate(need_rows)}
        zr = np.array([pos[int(m)] for m in mo_m], dtype=np.int64)
        a = (rows(zr, zi, np.ones(nz), need_rows.size)
             + rows(np.arange(need_rows.size), yi[need_rows], -np.ones(need_rows.size), need_rows.size))
        cons.append(LinearConstraint(a, 0.0, 0.0))
    if nz:
        cons.append(LinearConstraint(rows(mo_o, zi, np.ones(nz), qual.shape[0]), 0.0, cap.astype(float)))
    integrality = np.ones(nv)
    bounds = Bounds(np.zeros(nv), np.ones(nv))

    def run(c, extra):
        res = milp(c, constraints=cons + extra, integrality=integrality, bounds=bounds)
        if res.status != 0:
            return None
        return np.round(res.x).astype(int)

    fixed = []
    counts = []
    for upto in range(_TIERS):
        c = np.zeros(nv)
        c[xi] = -(tier[jm_j] <= upto).astype(float)
        x = run(c, fixed)
        if x is None:
            if upto == 0:
                raise InfeasibleError("must-run jobs cannot all be placed with the crew present",
                                      HallWitness(np.flatnonzero(tier == TIER_MUST), np.arange(n_machines)))
            raise AssertionError("staffing MILP failed")  # pragma: no cover
        k = round(-(c @ x))
        counts.append(k)
        row = np.zeros(nv)
        row[xi] = (tier[jm_j] <= upto).astype(float)
        fixed.append(LinearConstraint(row[None, :], k, k))
    n_must = int((tier == TIER_MUST).sum())
    if counts[0] < n_must:
        raise InfeasibleError("must-run jobs cannot all be placed with the crew present",
                              HallWitness(np.flatnonzero(tier == TIER_MUST), np.arange(n_machines)))
    c = np.zeros(nv)
    v = values[jm_j, jm_m]
    p = penalty[jm_j]
    c[xi] = -(v + p) if objective == "maximize" else v - p
    x = run(c, fixed)
    machine_of_job = np.full(n_jobs, -1, np.int64)
    on = x[xi] > 0
    machine_of_job[jm_j[on]] = jm_m[on]
    operator_of_machine = np.full(n_machines, -1, np.int64)
    zon = x[zi] > 0
    operator_of_machine[mo_m[zon]] = mo_o[zon]
    plan = _finish(values, mask, qual, cap, needs, penalty, tier, objective, machine_of_job,
                   operator_of_machine, "milp", (), None, None, None)
    object.__setattr__(plan, "slots", slot)
    return plan

