"""``history restore N --in-force SHOP``: the restored decision becomes the plan in force.

Kept beside the history command so that the history package never imports the shop model:
the decision's shop snapshot is read back here, its plan put in force, and the document is
checked writable (and checked to be the same shop) before the restore is recorded.
"""

from __future__ import annotations

from pathlib import Path

from dispatcher.commands.common import CliError
from dispatcher.commands.shop_input import check_writable, read_shop_arg
from dispatcher.io.shopfile import shop_from_dict
from dispatcher.shop import Plan, Shop


def restored_shop(store, number: int, path: str) -> Shop:
    """The shop of decision ``number`` with its plan in force, to save into ``path``."""
    decision = store.get(number)
    where = f"{store.location}: decision #{decision.id}"
    snapshot = shop_from_dict(decision.shop_document, source=f"{where}, shop snapshot")
    plan = Plan.from_json(decision.plan, source=f"{where}, plan")
    if Path(path).exists():
        current = read_shop_arg(path)
        if current.name != snapshot.name:
            raise CliError(f"{where} is for shop {snapshot.name!r}, not {current.name!r} "
                           f"({path}); nothing was recorded")
    check_writable(path)
    try:
        snapshot.plan_in_force = plan.in_force(snapshot)
    except KeyError as exc:
        raise CliError(f"{where}: its plan names {exc.args[0]}") from None
    return snapshot
