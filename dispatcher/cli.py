"""The ``dispatcher`` command line: a thin shell over the Qt-free core.

Each sub-command lives in its own module under :mod:`dispatcher.commands` and exposes
``register(subparsers)``; the parser sets ``func`` to a callable taking the parsed
arguments and returning an exit code. Every error the core or a command raises on
purpose derives from :class:`dispatcher.errors.DispatcherError`, which carries its exit
code; :func:`main` prints it here as one line on stderr, with the command-line wording of
its hint from :data:`CLI_HINTS`. Commands do not catch the core's errors to re-label
them.

Exit codes: 0 done, 2 bad input, 3 infeasible (must-run jobs cannot all be placed),
4 a stored file (history) could not be used, 1 an unexpected internal error (with a
traceback, also for :class:`~dispatcher.errors.InternalError`), 130 interrupted.
"""

from __future__ import annotations

import argparse
import os
import sys
from collections.abc import Sequence

from dispatcher import __version__
from dispatcher.commands import COMMAND_MODULES
from dispatcher.errors import (
    EXIT_BAD_INPUT,
    EXIT_INTERNAL,
    EXIT_INTERRUPTED,
    HINT_OTHER_HISTORY_FILE,
    DispatcherError,
)

#: What the command line adds to a message carrying a hint (the core says only what to do).
CLI_HINTS = {
    HINT_OTHER_HISTORY_FILE: " with --history PATH",
}


def error_line(exc: DispatcherError) -> str:
    """The one stderr line for an error: its message and the command line's hint."""
    return f"dispatcher: {exc}{CLI_HINTS.get(exc.hint, '') if exc.hint else ''}"


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
    except DispatcherError as exc:
        if exc.exit_code == EXIT_INTERNAL:
            raise  # a bug: keep the traceback for the report
        print(error_line(exc), file=sys.stderr)
        return exc.exit_code
    except KeyboardInterrupt:
        print("dispatcher: interrupted", file=sys.stderr)
        return EXIT_INTERRUPTED
    except BrokenPipeError:
        # The reader (for example `head`) closed the pipe: not an error of ours.
        try:
            sys.stdout = open(os.devnull, "w")  # noqa: SIM115 - silence the flush at exit
        except OSError:
            pass
        return 0
