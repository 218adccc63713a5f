"""Errors raised by the decision history.

Two families, because the command line and the app treat them differently:

* :class:`HistoryError`: the history file cannot be used (missing, damaged, not ours,
  read-only, busy for too long, disk full). Nothing was written; the file is left exactly
  as it was. The command line exits with code 4.
* :class:`HistoryInputError`: the caller passed something wrong (an unknown reason kind,
  no supervisor name, a plan that does not follow the solve contract). Exit code 2.
"""

from __future__ import annotations


class HistoryError(Exception):
    """The history file cannot be used; the message names the file and what to do."""


class HistoryInputError(ValueError):
    """A value given to the history is not acceptable; the message names the field."""


class DecisionNotFound(HistoryInputError, LookupError):
    """No decision with the requested number exists in this history."""
