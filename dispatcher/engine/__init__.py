"""Numeric solvers (numpy and scipy only; no Qt, no files).

The public entry point is :func:`solve`; see :mod:`dispatcher.engine.assignment` for the
exact definition of a plan and of the certificate that proves it optimal.
"""

from .assignment import (
    MAX_CELLS,
    OBJECTIVES,
    DispatchInputError,
    DispatchResult,
    InfeasibleError,
    solve,
)
from .certificate import Certificate, CertificateError
from .fill_shift import ShiftInfeasibleError, ShiftPlan, ShiftSearchError, fill_shift
from .matching import HallWitness
from .order_runs import RunOrder, RunOrderInfeasibleError, order_runs
from .ranking import RankedPlan, ranked_plans
from .redispatch import redispatch, shortest_augmenting_path
from .shift_runs import ShiftRuns, plan_shift_runs
from .whatif import WhatIf, what_if

__all__ = [
    "MAX_CELLS",
    "OBJECTIVES",
    "Certificate",
    "CertificateError",
    "DispatchInputError",
    "DispatchResult",
    "HallWitness",
    "InfeasibleError",
    "RankedPlan",
    "RunOrder",
    "RunOrderInfeasibleError",
    "ShiftInfeasibleError",
    "ShiftPlan",
    "ShiftRuns",
    "ShiftSearchError",
    "WhatIf",
    "fill_shift",
    "order_runs",
    "plan_shift_runs",
    "ranked_plans",
    "redispatch",
    "shortest_augmenting_path",
    "solve",
    "what_if",
]
