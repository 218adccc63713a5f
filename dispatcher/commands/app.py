"""``dispatcher app [SHOP]``: open the desktop app, optionally on a shop or grid file."""

from __future__ import annotations

import argparse

from dispatcher.commands.common import EXIT_BAD_INPUT, CliError


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser("app", help="open the desktop app",
                       description="Open the desktop app on a shop document or grid file.")
    p.add_argument("shop", metavar="SHOP", nargs="?", default=None,
                   help="shop document (.dshop) or grid file (.csv, .xlsx) to open")
    p.add_argument("--history", metavar="PATH", default=None,
                   help="decision history file, or postgresql://... / service=NAME "
                        "(default: the per-user data folder)")
    p.set_defaults(func=run)


def run(args: argparse.Namespace) -> int:
    # Before Qt starts: a missing X11 helper library would abort the process inside Qt.
    from dispatcher.qt_platform import check_platform

    problem = check_platform()
    if problem is not None:
        raise CliError(problem.message, EXIT_BAD_INPUT)
    from dispatcher.ui.app import run as run_app  # Qt is imported only for this command

    return run_app(args.shop, args.history)
