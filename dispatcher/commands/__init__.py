"""Sub-commands of the ``dispatcher`` command line, one module each."""

from dispatcher.commands import convert, history, solve

COMMAND_MODULES = [solve, convert, history]
