"""``dispatcher sheet``: the daily dispatch sheet as a PDF (or as text), with no window.

``dispatcher sheet SHOP [--decision N|latest] [--history PATH] [--pdf OUT.pdf]
[--paper a4|letter]``

Without ``--decision`` the shop is solved now (least total) and the sheet is marked as a
draft that is not recorded. With ``--decision`` the sheet prints that recorded decision:
its shop snapshot and plan, number, time and supervisor; the decision must belong to
the shop named by SHOP. Without ``--pdf`` the sheet is printed as text on stdout.

Qt is loaded only to write the PDF (offscreen when there is no display).
"""

from __future__ import annotations

import argparse
from pathlib import Path
from typing import Any

from dispatcher.commands.common import EXIT_STORE, CliError
from dispatcher.commands.shop_input import is_shop_document, read_shop_arg, solve_shop_arg
from dispatcher.io.grid import GridFileError, read_grid
from dispatcher.shop import Plan, PlanFormatError, Shop, shop_from_grid
from dispatcher.sheet.build import build_sheet, run_order
from dispatcher.sheet.content import SheetContent, sheet_text


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser("sheet", help="make the printable dispatch sheet (PDF or text)",
                       description="Make the dispatch sheet operators work from: per machine "
                       "its jobs in order, waiting jobs, machines down, totals and the safety "
                       "cautions. Works without a window.")
    p.add_argument("shop", metavar="SHOP", help="shop document (.dshop) or grid file (.csv, .xlsx)")
    p.add_argument("--decision", metavar="N",
                   help="print recorded decision N (or 'latest' for this shop's newest)")
    p.add_argument("--history", metavar="PATH", default=None,
                   help="history file to read --decision from (default: the per-user one)")
    p.add_argument("--pdf", metavar="OUT.pdf", help="write the sheet to this PDF file")
    p.add_argument("--paper", choices=("a4", "letter"), type=str.lower, default=None,
                   help="paper size (default: by the system's locale; Letter in the US, "
                   "Canada, Mexico and a few others, else A4)")
    p.set_defaults(func=run)


def _load(path: str) -> Shop:
    """A shop document, or a plain grid file turned into a shop named after the file."""
    if is_shop_document(path):
        return read_shop_arg(path)
    try:
        table = read_grid(path)
    except GridFileError as exc:
        raise CliError(str(exc)) from None
    return shop_from_grid(table.jobs, table.machines, table.values, table.allowed,
                          name=Path(path).stem)


def _recorded(shop: Shop, source: str, number: str, history: str | None) -> tuple[Shop, Plan, Any]:
    """Shop snapshot, plan and decision of a recorded decision of this shop."""
    try:
        from dispatcher.history import HistoryError, HistoryInputError, HistoryStore
        from dispatcher.history.location import resolve_history_path
    except ImportError:  # pragma: no cover - only in a build without the history package
        raise CliError("--decision needs the decision history, which this installation "
                       "lacks") from None
    from dispatcher.io.shopfile import ShopFileError, shop_from_dict

    path = resolve_history_path(history)
    store = HistoryStore(path)
    try:
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
    except HistoryInputError as exc:
        raise CliError(str(exc)) from None
    except HistoryError as exc:
        raise CliError(str(exc), EXIT_STORE) from None
    where = f"{path}: decision #{decision.id}"
    try:
        snapshot = shop_from_dict(decision.shop_document, source=f"{where}, shop snapshot")
        plan = Plan.from_json(decision.plan, source=f"{where}, plan")
    except (ShopFileError, PlanFormatError) as exc:
        raise CliError(str(exc), EXIT_STORE) from None
    if snapshot.name != shop.name:
        raise CliError(f"{where} is for shop {snapshot.name!r}, not {shop.name!r} ({source})")
    return snapshot, plan, decision


def make_content(args: argparse.Namespace) -> SheetContent:
    """The sheet for the parsed arguments (no Qt involved)."""
    shop = _load(args.shop)
    if args.decision is not None:
        snapshot, plan, decision = _recorded(shop, args.shop, args.decision, args.history)
        # a recorded filled shift keeps each machine's run order in its "machines" list
        return build_sheet(snapshot, plan, decision, order=run_order(decision.plan))
    plan = solve_shop_arg(shop, args.shop, "total")
    return build_sheet(shop, plan)


def run(args: argparse.Namespace) -> int:
    content = make_content(args)
    if not args.pdf:
        print(sheet_text(content))
        return 0
    from dispatcher.sheet.render import SheetRenderError, page_size_for, write_pdf

    try:
        pages = write_pdf(content, args.pdf, paper=args.paper)
    except SheetRenderError as exc:
        raise CliError(str(exc)) from None
    paper = page_size_for(args.paper).name()
    print(f"wrote {args.pdf}: {pages} page{'s' if pages != 1 else ''}, {paper}")
    return 0
