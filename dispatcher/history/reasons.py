"""The kinds of reason a supervisor gives for a dispatch decision.

The kind is a fixed keyword so decisions can be counted and searched; the free text that
goes with it (the note) says the rest.
"""

from __future__ import annotations

from .errors import HistoryInputError

#: Keyword -> label shown to people. Order is the order offered in lists.
REASON_KINDS: dict[str, str] = {
    "shift-start": "shift start",
    "breakdown": "breakdown",
    "repair": "repair",
    "rush-job": "rush job",
    "manual-change": "manual change",
    "restored": "restored",
    "other": "other",
}


def parse_reason_kind(text: str) -> str:
    """The keyword for ``text``; accepts ``rush-job``, ``rush job``, ``Rush_Job`` alike.

    Raises :class:`HistoryInputError` listing the accepted kinds when ``text`` is none of them.
    """
    key = "-".join(str(text).strip().lower().replace("_", " ").replace("-", " ").split())
    if key not in REASON_KINDS:
        kinds = ", ".join(REASON_KINDS)
        raise HistoryInputError(f"reason: unknown kind {text!r}; use one of: {kinds}")
    return key


def reason_label(kind: str) -> str:
    """Readable label of a keyword (the keyword itself if unknown, e.g. from a newer version)."""
    return REASON_KINDS.get(kind, kind)
