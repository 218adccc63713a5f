"""Shop.copy: an independent copy, so the app's background solves and decision proposals
never see (or cause) a change of the shop being edited."""

from __future__ import annotations

import copy
import dataclasses

from dispatcher.io.shopfile import load_shop, shop_to_dict

_MUTABLE = (list, dict, set, bytearray)


def _mutable_objects(obj, seen: dict[int, object]) -> None:
    """Every mutable object reachable from ``obj`` (containers and dataclass records)."""
    if isinstance(obj, _MUTABLE) or (dataclasses.is_dataclass(obj) and not isinstance(obj, type)):
        if id(obj) in seen:
            return
        seen[id(obj)] = obj
    if dataclasses.is_dataclass(obj) and not isinstance(obj, type):
        for f in dataclasses.fields(obj):
            _mutable_objects(getattr(obj, f.name), seen)
    elif isinstance(obj, dict):
        for k, v in obj.items():
            _mutable_objects(k, seen)
            _mutable_objects(v, seen)
    elif isinstance(obj, (list, tuple, set, frozenset)):
        for v in obj:
            _mutable_objects(v, seen)


def test_copy_shares_no_mutable_object_and_equals_a_deep_copy(samples):
    for name in ("medium_machining_shop.dshop", "small_moulding_cell.dshop"):
        shop = load_shop(samples / name)
        twin = shop.copy()
        original, copied = {}, {}
        _mutable_objects(shop, original)
        _mutable_objects(twin, copied)
        shared = set(original) & set(copied)
        # A new list, dict or set field must be copied in Shop.copy: this names it.
        assert not shared, [type(original[i]).__name__ for i in shared]
        assert len(copied) == len(original)
        # The reference is the standard library's deepcopy: same content.
        assert shop_to_dict(twin) == shop_to_dict(copy.deepcopy(shop))


def test_changing_the_copy_leaves_the_shop_alone(samples):
    shop = load_shop(samples / "medium_machining_shop.dshop")
    before = shop_to_dict(shop)
    twin = shop.copy()
    twin.jobs[0].rush = not twin.jobs[0].rush
    twin.machines[0].state = "down"
    twin.grid[next(iter(twin.grid))] = 123456.0
    twin.pins.clear()
    twin.plan_in_force.setdefault(twin.machines[0].id, []).append("ghost")
    twin.unit.kind = "cost"
    twin.jobs.pop()
    assert shop_to_dict(shop) == before
