"""One-round solves of the app run in a worker process: the shop crosses over intact and
the plan that comes back is the one solved here, ready for the what-if map and ranking."""

from __future__ import annotations

import pytest

from dispatcher.io.shopfile import load_shop, shop_to_dict
from dispatcher.shop.alternatives import alternative_plans
from dispatcher.shop.packing import pack_shop, unpack_shop
from dispatcher.shop.whatif import what_if_grid
from dispatcher.ui import solving


def test_the_packed_shop_is_the_same_shop(samples):
    for name in ("medium_machining_shop.dshop", "large_print_plant.dshop"):
        shop = load_shop(samples / name)
        assert shop_to_dict(unpack_shop(pack_shop(shop))) == shop_to_dict(shop)


def test_a_round_solved_in_the_worker_process_is_the_plan_solved_here(samples):
    shop = load_shop(samples / "medium_machining_shop.dshop")
    here = solving.solve_outcome(shop, "total")
    there = solving.solve_round_in_process(shop, "total")
    assert solving._EXECUTOR is not None          # the worker process was used
    assert there.plan.to_json() == here.plan.to_json()
    assert there.plan.problem.shop is shop
    assert there.plan.result.verify()               # its certificate checks out here too
    # The what-if map and the ranking work on the plan that came back.
    assert what_if_grid(there.plan).extra.shape == (len(shop.jobs), len(shop.machines))
    assert alternative_plans(there.plan, 2)[0].total == pytest.approx(here.plan.total)
