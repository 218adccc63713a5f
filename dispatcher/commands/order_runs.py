"""``dispatcher order-runs SHOP --machine NAME``: the best run order for one machine.

``dispatcher order-runs SHOP --machine NAME [--jobs JOB,JOB...] [--time-limit S] [--json]``

Orders the jobs on the machine for the least total changeover, from the family it has
mounted (and into its end family, if set), with the change before each job and the
planned start and end hours. Without ``--jobs`` the jobs are those the whole-shift plan
puts on the machine (``solve --fill-shift``). The work is done by
:func:`dispatcher.shop.runs.machine_run_order`; this module only reads options and
prints. Exit codes: 2 bad input (unknown machine or job, a job that cannot run on the
machine, every problem located), 3 when no order of the jobs is allowed.
"""

from __future__ import annotations

import argparse

from dispatcher.commands.common import CliError, print_json
from dispatcher.commands.shop_input import read_shop_arg
from dispatcher.shop.fill_shift import fill_shop_shift
from dispatcher.shop.runs import machine_run_order


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser("order-runs", help="best run order for one machine by changeover",
                       description="Order the jobs on one machine for the least total "
                       "changeover, from what it has mounted, with the change before each job "
                       "and planned start and end hours.")
    p.add_argument("shop", metavar="SHOP", help="shop document (.dshop)")
    p.add_argument("--machine", required=True, metavar="NAME", help="the machine, by name")
    p.add_argument("--jobs", metavar="JOB,JOB...", default=None,
                   help="jobs to order (comma-separated names); default: the jobs the "
                   "whole-shift plan puts on the machine")
    p.add_argument("--time-limit", metavar="SECONDS", type=float, default=None,
                   help="stop after this many seconds with the best order found and its "
                   "proven gap")
    p.add_argument("--json", action="store_true", help="print one JSON object")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    if args.time_limit is not None and not args.time_limit > 0:
        raise CliError(f"--time-limit must be a number of seconds > 0, got {args.time_limit:g}")
    shop = read_shop_arg(args.shop)
    try:
        machine = shop.machine_by_name(args.machine)
    except KeyError:
        raise CliError(f"{args.shop}: no machine named {args.machine!r} (machines: "
                       f"{', '.join(shop.machine_names())})") from None
    if args.jobs is None:
        fill = fill_shop_shift(shop, source=args.shop)
        names = next((m.jobs for m in fill.machines if m.machine == machine.name), [])
    else:
        names = [n.strip() for n in args.jobs.split(",") if n.strip()]
    ids = []
    for name in names:
        try:
            ids.append(shop.job_by_name(name).id)
        except KeyError:
            raise CliError(f"{args.shop}: --jobs: no job named {name!r}") from None
    runs = machine_run_order(shop, machine.id, ids, time_limit=args.time_limit, source=args.shop)
    if args.json:
        print_json(runs.to_json())
    else:
        print(runs.text())
    return 0
