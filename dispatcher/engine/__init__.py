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
from .order_runs import RunOrder, RunOrderInfeasibleError, order_runs
from .fill_shift import ShiftInfeasibleError, ShiftPlan, ShiftSearchError, fill_shift
from .matching import HallWitness
from .ranking import RankedPlan, ranked_plans
from .redispatch import redispatch, shortest_augmenting_path
from .whatif import WhatIf, what_if

__all__ = [
    "RankedPlan",
    "RunOrder",
    "RunOrderInfeasibleError",
    "order_runs",
    "WhatIf",
    "ranked_plans",
    "redispatch",
    "shortest_augmenting_path",
    "what_if",
    "MAX_CELLS",
    "OBJECTIVES",
    "Certificate",
    "CertificateError",
    "DispatchInputError",
    "DispatchResult",
    "HallWitness",
    "InfeasibleError",
    "ShiftInfeasibleError",
    "ShiftPlan",
    "ShiftSearchError",
    "fill_shift",
    "solve",
]
