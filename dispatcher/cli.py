"""The ``dispatcher`` command line: a thin shell over the Qt-free core.

Each sub-command lives in its own module under :mod:`dispatcher.commands` and exposes
``register(subparsers)``; the parser sets ``func`` to a callable taking the parsed
arguments and returning an exit code. Errors are raised as
:class:`dispatcher.commands.common.CliError` and printed here as one line on stderr.

Exit codes: 0 done, 2 bad input, 3 infeasible (must-run jobs cannot all be placed),
4 a stored file (history) could not be used, 1 an unexpected internal error.
"""

from __future__ import annotations

import argparse
import os
import sys
from collections.abc import Sequence

from dispatcher import __version__
from dispatcher.commands import COMMAND_MODULES
from dispatcher.commands.common import EXIT_BAD_INPUT, CliError


class _Parser(argparse.ArgumentParser):
    """argparse exits with 2 on usage errors, which matches our 'bad input' code."""


def build_parser() -> argparse.ArgumentParser:
    parser = _Parser(prog="dispatcher", description="Dispatch waiting jobs to machines.")
    parser.add_argument("--version", action="version", version=f"dispatcher {__version__}")
    sub = parser.add_subparsers(dest="command", metavar="COMMAND")
    for module in COMMAND_MODULES:
        module.register(sub)
    return parser


def main(argv: Sequence[str] | None = None) -> int:
    parser = build_parser()
    args = parser.parse_args(argv)
    if not getattr(args, "func", None):
        parser.print_help(sys.stderr)
        return EXIT_BAD_INPUT
    try:
        return int(args.func(args) or 0)
    except CliError as exc:
        print(f"dispatcher: {exc}", file=sys.stderr)
        return exc.exit_code
    except KeyboardInterrupt:
        print("dispatcher: interrupted", file=sys.stderr)
        return 130
    except BrokenPipeError:
        # The reader (for example `head`) closed the pipe: not an error of ours.
        try:
            sys.stdout = open(os.devnull, "w")  # noqa: SIM115 - silence the flush at exit
        except OSError:
            pass
        return 0
