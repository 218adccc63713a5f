"""Choosing the store from what the user named: a file path, or a PostgreSQL server.

``postgresql://...`` or ``postgres://...`` (a libpq connection URI) and ``service=NAME``
or any other libpq ``key=value`` connection string select the PostgreSQL store; anything
else is an SQLite file path (``None``: the default file).
"""

from __future__ import annotations

import os
import re
from typing import Any

from .store import DecisionStore, HistoryStore

_CONNINFO = re.compile(r"^\s*(service|host|hostaddr|dbname|port|user)\s*=", re.IGNORECASE)


def is_postgres_location(location: str | os.PathLike | None) -> bool:
    """True when ``location`` names a PostgreSQL server rather than a file."""
    if location is None or isinstance(location, os.PathLike):
        return False
    text = str(location).strip()
    return text.lower().startswith(("postgresql://", "postgres://")) or bool(
        _CONNINFO.match(text))


def missing_driver(location: str | os.PathLike | None) -> str | None:
    """Why ``location`` cannot be used on this installation (a PostgreSQL location without
    the psycopg driver: how to install it), or None."""
    if not is_postgres_location(location):
        return None
    from .postgres import _MISSING_DRIVER
    try:
        import psycopg  # noqa: F401
    except ImportError:
        return _MISSING_DRIVER
    return None


def open_history(location: str | os.PathLike | None = None, **options: Any) -> DecisionStore:
    """The store for ``location``: :class:`HistoryStore` for a file, else the PostgreSQL one.

    ``options`` go to the store (``timeout``, ``station``, ``shifts``, ``tz``...).
    """
    if is_postgres_location(location):
        from .postgres import PostgresStore
        return PostgresStore(str(location), **options)
    return HistoryStore(location, **options)
