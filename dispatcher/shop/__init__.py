"""The shop domain model (no Qt): jobs, machines, grid, pins, states, and plans.

Typical use::

    from dispatcher.shop import solve_shop
    from dispatcher.io.shopfile import load_shop
    plan = solve_shop(load_shop("sample_shops/small_press_shop.dshop"), objective="total")
    print(plan.to_json())
"""

from .model import (
    DONE,
    DOWN,
    JOB_STATES,
    MACHINE_STATES,
    MAINTENANCE,
    MUST,
    MUST_NOT,
    PIN_KINDS,
    RUNNING,
    UNIT_KINDS,
    UP,
    WAITING,
    ChangeoverTable,
    Job,
    Machine,
    Pin,
    Problem,
    Shift,
    Shop,
    ShopError,
    Unit,
    shop_from_grid,
)
from .plan import Assignment, Plan, PlanFormatError, RunningJob, RushGroup, WaitReason
from .translate import (
    ShopInfeasibleError,
    ShopProblem,
    build_problem,
    plan_from_result,
    solve_problem,
    solve_shop,
)
from .validate import changeover_problems, check_shop, shop_problems

__all__ = [
    "DONE", "DOWN", "JOB_STATES", "MACHINE_STATES", "MAINTENANCE", "MUST", "MUST_NOT",
    "PIN_KINDS", "RUNNING", "UNIT_KINDS", "UP", "WAITING",
    "Assignment", "ChangeoverTable", "Job", "Machine", "Pin", "Plan", "PlanFormatError", "Problem",
    "RunningJob", "RushGroup", "Shift", "Shop", "ShopError", "ShopInfeasibleError", "ShopProblem",
    "Unit", "WaitReason",
    "build_problem", "changeover_problems", "check_shop", "plan_from_result", "shop_from_grid", "shop_problems",
    "solve_problem", "solve_shop",
]
