"""Errors raised by the decision history.

Two families, because the command line and the app treat them differently:

* :class:`HistoryError`: the history file cannot be used (missing, damaged, not ours,
  read-only, busy for too long, disk full). Nothing was written; the file is left exactly
  as it was. The command line exits with code 4.
* :class:`HistoryInputError`: the caller passed something wrong (an unknown reason kind,
  no supervisor name, a plan that does not follow the solve contract). Exit code 2.

Both come from the root in :mod:`dispatcher.errors`. A message that ends by suggesting
another file says only "choose another file" and sets
``hint=HINT_OTHER_HISTORY_FILE``; the command line adds how (``--history PATH``).
"""

from __future__ import annotations

from dispatcher.errors import EXIT_CONFLICT, BadInputError, HistoryUnusableError


class HistoryError(HistoryUnusableError):
    """The history file cannot be used; the message names the file and what to do."""


class HistoryInputError(BadInputError, ValueError):
    """A value given to the history is not acceptable; the message names the field."""


class DecisionNotFound(HistoryInputError, LookupError):
    """No decision with the requested number exists in this history."""


class DecisionConflict(HistoryError):
    """Another station recorded a newer decision for the shop after the one this decision
    was based on; nothing was recorded.

    A subclass of :class:`HistoryError` so that callers which only know that family still
    keep their document and let the supervisor retry; the command line gives it an exit
    code of its own (5). ``newer`` is that decision (a :class:`~dispatcher.history.DecisionSummary`) and
    ``based_on`` the number the caller started from (None: no decision yet).
    """

    exit_code = EXIT_CONFLICT

    def __init__(self, message: str, newer, based_on: int | None):
        super().__init__(message)
        self.newer = newer
        self.based_on = based_on
