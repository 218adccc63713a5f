"""Sub-commands of the ``dispatcher`` command line, one module each."""

from dispatcher.commands import app, convert, history, import_jobs, order_runs, redispatch, sheet, solve

COMMAND_MODULES = [solve, convert, history, sheet, app, redispatch, order_runs, import_jobs]
