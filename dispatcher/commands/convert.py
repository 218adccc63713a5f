"""``dispatcher convert IN OUT``: grid file <-> shop document, and plan export.

* ``convert GRID.csv|.xlsx SHOP.dshop``: a new shop (all jobs waiting, all machines up);
* ``convert GRID.csv SHOP.dshop --into OLD.dshop``: merge the grid into an existing shop,
  matching jobs and machines by name, and report what was added, changed and unmatched
  (``OLD.dshop`` is only read: the output must be another file);
* ``convert SHOP.dshop GRID.csv|.xlsx``: the shop's grid as a grid file;
* ``convert SHOP.dshop PLAN.csv|.xlsx --plan``: the shop's plan in force as a table (its
  best plan, marked as a draft on stderr, when the document holds none).

Nothing is written when the input has a problem; files are replaced in one step. An
existing shop document is never replaced without ``--force`` (its states, pins and plan in
force would be lost), and the output's extension must name what is written.
"""

from __future__ import annotations

import argparse
import os
import sys
from pathlib import Path

from dispatcher.commands.common import CliError
from dispatcher.commands.shop_input import is_shop_document, read_shop_arg, solve_shop_arg
from dispatcher.io.grid import GRID_SUFFIXES
from dispatcher.io.shopfile import SHOP_SUFFIX, save_shop
from dispatcher.io.spreadsheet import (
    EXPORT_SUFFIXES,
    export_grid,
    export_plan,
    import_grid_file,
)
from dispatcher.shop.in_force import plan_in_force


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser("convert", help="turn a grid file into a shop document and back",
                       description="Convert a grid file (.csv, .tsv, .txt, .xlsx) into a shop "
                       "document (.dshop), or a shop document into a grid or plan table "
                       "(.csv, .xlsx).")
    p.add_argument("source", metavar="IN", help="grid file or shop document to read")
    p.add_argument("target", metavar="OUT", help="file to write (.dshop, .csv or .xlsx)")
    p.add_argument("--into", metavar="SHOP", default=None,
                   help="merge the grid into this existing shop document (names matched)")
    p.add_argument("--plan", action="store_true",
                   help="from a shop document: write its plan in force (else its best plan) "
                   "instead of its grid")
    p.add_argument("--hours", metavar="HOURS.csv", default=None,
                   help="reading a grid file: a second grid file (same job and machine "
                   "names) whose cells are run hours, for filling a shift; a 'run hours' "
                   "column in the grid gives each job's run hours instead")
    p.add_argument("--force", action="store_true",
                   help="replace OUT when it is an existing shop document")
    p.set_defaults(func=run)


def _same_file(a: str, b: str) -> bool:
    try:
        return os.path.samefile(a, b)
    except OSError:
        return Path(a).resolve() == Path(b).resolve()


def _check_shop_output(out: str, args: argparse.Namespace) -> None:
    """A shop document goes to a new ``.dshop`` path, or over an old one with ``--force``."""
    if Path(out).suffix.lower() != SHOP_SUFFIX:
        raise CliError(f"{out}: a grid file converts to a shop document, so the file name must "
                       f"end in {SHOP_SUFFIX} (got {Path(out).suffix or 'no extension'!r})")
    if args.into and _same_file(args.into, out):
        raise CliError(f"{out}: is the --into document, which is only read; write the merged "
                       "shop to another file (nothing was written)")
    if Path(out).is_dir():
        raise CliError(f"{out}: is a folder; give the path of the shop document to write")
    if Path(out).exists() and not args.force:
        raise CliError(f"{out}: already exists; replacing it would lose its states, pins and "
                       "plan in force. Give a new file name, or --force to replace it "
                       "(nothing was written)")


def run(args: argparse.Namespace) -> int:
    src, out = args.source, args.target
    if Path(src).is_dir():
        raise CliError(f"{src}: is a folder, not a file; give a grid file "
                       f"({', '.join(GRID_SUFFIXES)}) or a shop document ({SHOP_SUFFIX})")
    out_is_shop = is_shop_document(out)
    if is_shop_document(src):
        if out_is_shop:
            raise CliError(f"{out}: both files are shop documents; write a .csv or .xlsx file")
        if Path(out).suffix.lower() not in EXPORT_SUFFIXES:
            raise CliError(f"{out}: unsupported extension {Path(out).suffix or '(none)'!r}; "
                           f"expected one of {', '.join(EXPORT_SUFFIXES)}")
        if args.into:
            raise CliError("--into applies when reading a grid file into a shop document")
        if args.hours:
            raise CliError("--hours applies when reading a grid file into a shop document")
        shop = read_shop_arg(src)
        if args.plan:
            # The plan in force is the plan; a document without one gets its best plan.
            plan = plan_in_force(shop, source=src) or solve_shop_arg(shop, src, "total")
            export_plan(plan, out, shop)
            what = ("the plan in force" if plan.status == "in force"
                    else "the best plan (draft: the document holds no plan in force)")
            print(f"note: wrote {what}", file=sys.stderr)
        else:
            export_grid(shop, out)
            print("note: a grid file holds names and values only; states, pins, rush flags "
                  "and penalties stay in the shop document", file=sys.stderr)
        return 0

    if Path(src).suffix.lower() not in GRID_SUFFIXES:
        raise CliError(f"{src}: unsupported extension {Path(src).suffix or '(none)'!r}; expected a "
                       f"shop document (.dshop) or a grid file ({', '.join(GRID_SUFFIXES)})")
    if not out_is_shop:
        raise CliError(f"{out}: a grid file converts to a shop document; name it *.dshop")
    if args.plan:
        raise CliError("--plan applies when reading a shop document")
    _check_shop_output(out, args)
    existing = read_shop_arg(args.into) if args.into else None
    report = import_grid_file(src, existing, hours=args.hours)
    if existing is None:
        report.shop.description = f"Converted from the grid file {Path(src).name}."
    save_shop(report.shop, out)
    print(report.summary())
    return 0
