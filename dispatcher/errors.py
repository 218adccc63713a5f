"""The root of every error dispatcher raises on purpose, with its exit code and its source.

Every package may import this module; it imports nothing of ours and nothing of Qt, so
the engine stays free of files and names and the core stays free of Qt.

Families (each class sets ``exit_code``; the command line exits with it):

* :class:`BadInputError` (exit 2): a file, a value or an option the user gave cannot be
  used. The message names the file and, where it applies, the row and column, or the
  job or machine and field.
* :class:`Infeasible` (exit 3): must-run (rush or pinned) jobs cannot all be placed, or
  no plan placing them was found in the time allowed. ``jobs`` and ``machines`` say which
  (indices in the engine, names in the shop model).
* :class:`HistoryUnusableError` (exit 4): the decision history cannot be used; nothing
  was written. (Its member ``history.DecisionConflict``, a decision based on a plan in
  force another station has replaced, exits 5.)
* :class:`InternalError` (exit 1): a bug, never the user's doing; the command line shows
  the traceback.
* :class:`Cancelled` (exit 130): the caller asked to stop; no result.

``source`` is the file (or label) the error is about, ``row`` and ``column`` its 1-based
place in a table, ``where`` the job, machine or field ("job 'WO-1' (id J1), field 'due'").
When they are given to the constructor the message is prefixed with them, so a new error
is written as ``BadInputError("must be a number >= 0", source=path, row=3, column=2)``.

``hint`` names a remedy that only one front end can phrase (see ``HINT_*``): the message
itself stays neutral ("choose another file") and the command line adds its own words
(" with --history PATH") from its table in :mod:`dispatcher.cli`; the app says nothing
more, because its settings dialog is where the file is chosen.
"""

from __future__ import annotations

from collections.abc import Sequence

EXIT_OK = 0
EXIT_INTERNAL = 1
EXIT_BAD_INPUT = 2
EXIT_INFEASIBLE = 3
EXIT_HISTORY = 4
EXIT_CONFLICT = 5
EXIT_INTERRUPTED = 130

#: The message ends with "choose another file"; the front end may say how.
HINT_OTHER_HISTORY_FILE = "other_history_file"


def column_letter(column: int) -> str:
    """Spreadsheet letters for a 1-based column number (1 -> A, 27 -> AA)."""
    letters = ""
    while column > 0:
        column, rem = divmod(column - 1, 26)
        letters = chr(ord("A") + rem) + letters
    return letters


def location_text(source: str = "", row: int | None = None, column: int | None = None, where: str = "") -> str:
    """``"file: row 3, column 2 (B): job 'WO-1', field 'due'"`` (empty parts left out)."""
    parts = []
    if source:
        parts.append(source)
    if row is not None:
        cell = f"row {row}"
        if column is not None:
            cell += f", column {column} ({column_letter(column)})"
        parts.append(cell)
    elif column is not None:
        parts.append(f"column {column} ({column_letter(column)})")
    if where:
        parts.append(where)
    return ": ".join(parts)


class DispatcherError(Exception):
    """Root of our errors: a message, an exit code, and where the problem is.

    ``message`` is the text without the location; ``str(error)`` is the full line.
    """

    exit_code: int = EXIT_BAD_INPUT  #: set by each family; an instance may override it

    def __init__(
        self,
        message: str = "",
        *,
        source: str = "",
        row: int | None = None,
        column: int | None = None,
        where: str = "",
        hint: str | None = None,
    ):
        self.message = message
        self.source = source
        self.row = row
        self.column = column
        self.where = where
        self.hint = hint
        head = location_text(source, row, column, where)
        super().__init__(f"{head}: {message}" if head and message else head or message)


class BadInputError(DispatcherError):
    """Something the user gave (file, value, option) cannot be used. Exit code 2."""

    exit_code = EXIT_BAD_INPUT


class Infeasible(DispatcherError):
    """Must-run jobs cannot all be placed. Exit code 3.

    ``jobs`` and ``machines`` name the jobs involved and the machines they compete for:
    indices in the engine, names in the shop model.
    """

    exit_code = EXIT_INFEASIBLE

    def __init__(self, message: str = "", jobs: Sequence = (), machines: Sequence = (), **where):
        super().__init__(message, **where)
        self.jobs = jobs
        self.machines = machines


class HistoryUnusableError(DispatcherError):
    """The decision history cannot be used; nothing was written. Exit code 4."""

    exit_code = EXIT_HISTORY


class InternalError(DispatcherError):
    """A bug, never a user error (for example a plan that fails its own certificate)."""

    exit_code = EXIT_INTERNAL


class Cancelled(DispatcherError):
    """The caller asked to stop; no result is returned."""

    exit_code = EXIT_INTERRUPTED
