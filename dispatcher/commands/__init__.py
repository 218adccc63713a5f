"""Sub-commands of the ``dispatcher`` command line, one module each."""

from dispatcher.commands import solve

COMMAND_MODULES = [solve]
