"""``dispatcher import-jobs``: a job list and changeover tables into a shop document.

``dispatcher import-jobs SHOP.dshop OUT.dshop [--jobs FILE] [--column FIELD=HEADER ...]
[--changeovers FILE --table ID [--table-name NAME] --machines NAME,NAME]``

Reads a job list exported by a planning system (CSV/XLSX; see
:mod:`dispatcher.io.joblist` for the columns and ``--column`` to map them) and/or a
changeover table (a CSV/XLSX matrix with families as row and column headers) and writes
the shop with them to OUT (atomically). SHOP itself is never changed; on any problem
nothing is written (exit 2, with the file, row and column named).
"""

from __future__ import annotations

import argparse
import sys

from dispatcher.commands.common import CliError
from dispatcher.commands.shop_input import read_shop_arg
from dispatcher.io.joblist import (
    FIELDS,
    apply_changeover_table,
    apply_job_list,
    read_job_list,
)
from dispatcher.io.shopfile import save_shop


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser("import-jobs", help="import a job list and changeover tables into a shop",
                       description="Add or update jobs from a job list (CSV/XLSX) and changeover "
                       "tables (CSV/XLSX matrices) and write the shop to a new document.")
    p.add_argument("shop", metavar="SHOP", help="shop document to start from (never changed)")
    p.add_argument("out", metavar="OUT", help="shop document to write")
    p.add_argument("--jobs", metavar="FILE", help="job list (.csv or .xlsx)")
    p.add_argument("--column", metavar="FIELD=HEADER", action="append", default=[],
                   help=f"which column holds a field ({', '.join(FIELDS)}); repeatable")
    p.add_argument("--changeovers", metavar="FILE", help="changeover table (.csv or .xlsx matrix)")
    p.add_argument("--table", metavar="ID", help="id of the changeover table (replaces one with that id)")
    p.add_argument("--table-name", metavar="NAME", default="", help="name of the table")
    p.add_argument("--machines", metavar="NAME,NAME", default="",
                   help="machines sharing the changeover table")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    if not args.jobs and not args.changeovers:
        raise CliError("give --jobs FILE and/or --changeovers FILE")
    mapping = {}
    for item in args.column:
        field, sep, header = item.partition("=")
        if not sep or not header.strip():
            raise CliError(f"--column {item!r}: expected FIELD=HEADER")
        mapping[field.strip()] = header.strip()
    shop = read_shop_arg(args.shop)
    notes = []
    if args.jobs:
        rows = read_job_list(args.jobs, mapping)
        known = set(shop.job_names())
        shop = apply_job_list(shop, rows)
        added = sum(1 for r in rows if r.name not in known)
        notes.append(f"{len(rows)} job(s) read: {added} added, {len(rows) - added} updated")
    if args.changeovers:
        if not args.table or not args.machines.strip():
            raise CliError("--changeovers needs --table ID and --machines NAME,NAME")
        machines = [m.strip() for m in args.machines.split(",") if m.strip()]
        shop = apply_changeover_table(shop, args.changeovers, table_id=args.table,
                                      name=args.table_name or args.table, machines=machines)
        notes.append(f"changeover table {args.table!r} for {', '.join(machines)}")
    save_shop(shop, args.out)
    for line in notes:
        print(line, file=sys.stderr)
    print(f"Saved {args.out}", file=sys.stderr)
    return 0
