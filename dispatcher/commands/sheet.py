"""``dispatcher sheet``: the daily dispatch sheet as a PDF (or as text), with no window.

``dispatcher sheet SHOP [--decision N|latest] [--history PATH] [--pdf OUT.pdf]
[--paper a4|letter] [--fill-shift [--time-limit SECONDS]]``

Without ``--decision`` the sheet prints the document's plan in force when it holds one
(with the number of the recorded decision that put it in force, when the history has it);
otherwise the shop is solved now (least total; one round, or with ``--fill-shift`` the
whole shift) and the sheet is marked as a draft that is not recorded. With ``--decision``
the sheet prints that recorded decision:
its shop snapshot and plan, number, time and supervisor; the decision must belong to
the shop named by SHOP. Without ``--pdf`` the sheet is printed as text on stdout.

Qt is loaded only to write the PDF (offscreen when there is no display).
"""

from __future__ import annotations

import argparse
from pathlib import Path
from typing import Any

from dispatcher.commands.common import CliError
from dispatcher.commands.shop_input import is_shop_document, read_shop_arg, solve_shop_arg
from dispatcher.io.grid import read_grid
from dispatcher.io.shopfile import ShopFileError, load_shop
from dispatcher.shop import Plan, PlanFormatError, Shop, shop_from_grid
from dispatcher.shop.in_force import plan_in_force
from dispatcher.sheet.build import build_sheet, run_order
from dispatcher.sheet.content import SheetContent, sheet_text


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser("sheet", help="make the printable dispatch sheet (PDF or text)",
                       description="Make the dispatch sheet operators work from: per machine "
                       "its jobs in order, waiting jobs, machines down, totals and the safety "
                       "cautions. Works without a window.")
    p.add_argument("shop", metavar="SHOP", help="shop document (.dshop) or grid file (.csv, .xlsx)")
    source = p.add_mutually_exclusive_group()
    source.add_argument("--decision", metavar="N",
                        help="print recorded decision N (or 'latest' for this shop's newest)")
    source.add_argument("--fill-shift", action="store_true",
                        help="plan the whole shift now (several jobs per machine, in run "
                        "order, within each machine's hours) instead of one round")
    p.add_argument("--time-limit", metavar="SECONDS", type=float, default=None,
                   help="with --fill-shift: stop the solver after this long and print the "
                   "best plan found, marked as such")
    p.add_argument("--history", metavar="PATH", default=None,
                   help="history file to read --decision from (default: the per-user one)")
    p.add_argument("--pdf", metavar="OUT.pdf", help="write the sheet to this PDF file")
    p.add_argument("--paper", choices=("a4", "letter"), type=str.lower, default=None,
                   help="paper size (default: by the system's locale; Letter in the US, "
                   "Canada, Mexico and a few others, else A4)")
    p.set_defaults(func=run)


def _load(path: str, check: bool = True) -> Shop:
    """A shop document, or a plain grid file turned into a shop named after the file.

    ``check=False`` leaves the checks to the planner (a filled shift checks by its own
    rules, which allow several jobs pinned to one machine).
    """
    if is_shop_document(path):
        if check:
            return read_shop_arg(path)
        return load_shop(path, check=False)
    table = read_grid(path)
    return shop_from_grid(table.jobs, table.machines, table.values, table.allowed,
                          name=Path(path).stem)


def _recorded(shop: Shop, source: str, number: str, history: str | None) -> tuple[Shop, Plan, Any]:
    """Shop snapshot, plan and decision of a recorded decision of this shop."""
    try:
        from dispatcher.history import HistoryError, open_history
    except ImportError:  # pragma: no cover - only in a build without the history package
        raise CliError("--decision needs the decision history, which this installation "
                       "lacks") from None
    from dispatcher.io.shopfile import shop_from_dict

    store = open_history(history)
    path = store.location
    if number.strip().lower() == "latest":
        decision = store.latest(shop=shop.name)
        if decision is None:
            raise CliError(f"{path}: no recorded decision for shop {shop.name!r}")
    else:
        try:
            wanted = int(number)
        except ValueError:
            raise CliError(f"--decision: expected a decision number or 'latest', "
                           f"got {number!r}") from None
        decision = store.get(wanted)
    where = f"{path}: decision #{decision.id}"
    try:
        snapshot = shop_from_dict(decision.shop_document, source=f"{where}, shop snapshot")
        plan = Plan.from_json(decision.plan, source=f"{where}, plan")
    except (ShopFileError, PlanFormatError) as exc:  # a stored snapshot that cannot be read
        raise HistoryError(str(exc)) from None
    if snapshot.name != shop.name:
        raise CliError(f"{where} is for shop {snapshot.name!r}, not {shop.name!r} ({source})")
    return snapshot, plan, decision


def make_content(args: argparse.Namespace) -> SheetContent:
    """The sheet for the parsed arguments (no Qt involved)."""
    if args.pdf and Path(args.pdf).suffix.lower() != ".pdf":
        raise CliError(f"{args.pdf}: the sheet is written as PDF, so the file name must end in "
                       f".pdf (got {Path(args.pdf).suffix or 'no extension'!r})")
    shop = _load(args.shop, check=not args.fill_shift)
    if args.decision is not None:
        snapshot, plan, decision = _recorded(shop, args.shop, args.decision, args.history)
        # a recorded filled shift keeps each machine's run order in its "machines" list
        return build_sheet(snapshot, plan, decision, order=run_order(decision.plan))
    if args.fill_shift:
        return build_sheet(shop, _filled(shop, args.shop, args.time_limit))
    if args.time_limit is not None:
        raise CliError("--time-limit applies to --fill-shift only")
    in_force = plan_in_force(shop, source=args.shop)
    if in_force is not None:
        # The plan in force is the plan: print it, with its decision number when the
        # history holds the decision that put it in force.
        return build_sheet(shop, in_force, _decision_in_force(shop, args.history), in_force=True)
    plan = solve_shop_arg(shop, args.shop, "total")
    return build_sheet(shop, plan)


def _decision_in_force(shop: Shop, history: str | None) -> Any | None:
    """The newest recorded decision of this shop whose plan is the plan in force, if the
    history can be read (a sheet is printed without it otherwise)."""
    try:
        from dispatcher.history import open_history
        from dispatcher.errors import DispatcherError
    except ImportError:  # pragma: no cover - a build without the history package
        return None
    try:
        store = open_history(history)
        decision = store.latest(shop=shop.name)
    except (DispatcherError, OSError):
        return None
    if decision is None:
        return None
    try:
        recorded = Plan.from_json(decision.plan).in_force(shop)
    except (PlanFormatError, KeyError):
        return None
    same = {m: list(j) for m, j in recorded.items()} == \
        {m: list(j) for m, j in shop.plan_in_force.items() if j}
    return decision if same else None


def _filled(shop: Shop, source: str, time_limit: float | None) -> Any:
    """The filled shift of a shop document (least total), errors as for ``solve --fill-shift``."""
    from dispatcher.shop.fill_shift import fill_shop_shift

    if not is_shop_document(source):
        raise CliError(f"{source}: --fill-shift needs a shop document (.dshop) with run hours "
                       "and shift hours; a grid file has neither (see dispatcher convert)")
    if time_limit is not None and not time_limit > 0:
        raise CliError(f"--time-limit must be a number of seconds > 0, got {time_limit:g}")
    return fill_shop_shift(shop, time_limit=time_limit, source=source)


def run(args: argparse.Namespace) -> int:
    content = make_content(args)
    if not args.pdf:
        print(sheet_text(content))
        return 0
    from dispatcher.sheet.render import page_size_for, write_pdf

    pages = write_pdf(content, args.pdf, paper=args.paper)
    paper = page_size_for(args.paper).name()
    print(f"wrote {args.pdf}: {pages} page{'s' if pages != 1 else ''}, {paper}")
    return 0
