"""``dispatcher solve SHOP --fill-shift``: plan the whole shift, several jobs per machine.

Not a sub-command of its own: :mod:`dispatcher.commands.solve` hands over to
:func:`run_fill_shift` when ``--fill-shift`` is given. Exit codes as for ``solve``: 2 bad
input (every problem located), 3 when rush or pinned jobs cannot all fit (or no plan
running them was found within ``--time-limit``).
"""

from __future__ import annotations

import argparse

from dispatcher.commands.common import CliError, print_json
from dispatcher.commands.history import record_decision
from dispatcher.commands.shop_input import is_shop_document, job_name, must_run_names
from dispatcher.io.shopfile import load_shop, shop_to_dict
from dispatcher.shop.fill_shift import ShiftFill, fill_shop_shift
from dispatcher.shop.staffed import staffing_lines


def run_fill_shift(args: argparse.Namespace) -> int:
    """Load the shop document, fill its shift, print the plan (JSON or a table)."""
    path = args.grid
    if not is_shop_document(path):
        raise CliError(f"{path}: --fill-shift needs a shop document (.dshop) with run hours "
                       "and shift hours; a grid file has neither (see dispatcher convert)")
    if args.bottleneck:
        raise CliError("--fill-shift plans the least total or, with --maximize, the most "
                       "value; it cannot be combined with --bottleneck")
    limit = getattr(args, "time_limit", None)
    if limit is not None and not limit > 0:
        raise CliError(f"--time-limit must be a number of seconds > 0, got {limit:g}")
    shop = load_shop(path, check=False)  # fill_shop_shift checks it, with fill rules
    extra = [job_name(shop, n, path) for n in must_run_names(shop, args.must_run)]
    fill = fill_shop_shift(shop, maximize=args.maximize, extra_must_run=extra,
                           time_limit=limit, source=path)
    if args.json:
        print_json(fill.to_json())
    else:
        print_fill(fill, shop.unit.label())
    record_decision(args, shop_to_dict(shop), fill.to_json())
    return 0


def print_fill(fill: ShiftFill, unit: str = "") -> None:
    """Readable shift plan: per machine its jobs in run order, then waiting jobs and totals."""
    cost = {(a.job, a.machine): a.cost for a in fill.assignments}
    for m in fill.machines:
        print(f"{m.machine}  ({m.hours_used:g} of {m.capacity:g} h)")
        if m.operators:
            print("  minded by " + ", ".join(f"{o['operator']} ({o['hours']:g} h)" for o in m.operators))
        for job in m.running:
            print(f"  {job}  (already running)")
        for n, job in enumerate(m.jobs, start=1):
            print(f"  {n}. {job}  {cost[(job, m.machine)]:g}{(' ' + unit) if unit else ''}")
        if not m.running and not m.jobs:
            print("  (no jobs)")
    print()
    if fill.waiting_jobs:
        print(f"Waiting for the next shift ({len(fill.waiting_jobs)}):")
        for name in fill.waiting_jobs:
            print(f"  {name}  - {fill.waiting_reasons[name].text.split(': ', 1)[-1]}")
    else:
        print("Waiting for the next shift: none")
    if fill.unavailable_machines:
        print("Not available: " + ", ".join(fill.unavailable_machines))
    if fill.staffing is not None:
        for line in staffing_lines(fill.staffing):
            print(line)
    label = "Total value" if fill.objective == "maximize" else "Total"
    print(f"{label}: {fill.total:g}")
    print(f"Solver: {fill.status_text}; plan re-checked: {'yes' if fill.verified else 'FAILED'}")
