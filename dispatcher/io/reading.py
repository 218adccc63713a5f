"""Reading a file the user opens: a shop document or a grid file, as one shop.

One implementation for every front end. :func:`read_document` raises the file's own error
(:class:`~dispatcher.shop.ShopError`, :class:`~dispatcher.io.grid.GridFileError`), whose
message names the file and the row and column (or job, machine and field).
:func:`read_document_packed` is the same read made to run in another process: it never
raises for a bad file but returns the message texts, and it returns the shop packed
(:mod:`dispatcher.shop.packing`) so that it crosses back quickly. Reading never executes
anything from the file. :func:`write_copy_packed` is the other direction, for the app's
autosave: a packed shop written as a document by another process.
"""

from __future__ import annotations

import os
from pathlib import Path

from dispatcher.io.grid import GRID_SUFFIXES, GridFileError, read_grid
from dispatcher.io.shopfile import load_shop, save_shop
from dispatcher.shop import Shop, ShopError, shop_from_grid
from dispatcher.shop.packing import pack_shop, unpack_shop

#: A message box shows at most this many problems; the rest go to its detail text.
SHOWN_PROBLEMS = 8


def read_document(path: str | os.PathLike) -> Shop:
    """The shop in ``path``: a grid file (by its suffix) or a shop document.

    A shop document opens without the whole-shop check: an inconsistent shop still opens
    so that it can be fixed (the plan panel names what is wrong).
    """
    path = Path(path)
    if path.suffix.lower() in GRID_SUFFIXES:
        table = read_grid(path)
        return shop_from_grid(table.jobs, table.machines, table.values, table.allowed, name=path.stem)
    return load_shop(path, check=False)


def problem_texts(exc: Exception) -> tuple[str, str]:
    """A message's text (the first problems) and its detail (every problem, or "")."""
    if isinstance(exc, ShopError) and len(exc.problems) > SHOWN_PROBLEMS:
        return exc.summary(SHOWN_PROBLEMS), str(exc)
    return str(exc), ""


def read_document_packed(path: str) -> tuple:
    """``("ok", packed shop)`` or ``("refused", text, detail)`` for a file that cannot be
    read (for a worker process: plain data back, no exception to pickle)."""
    try:
        return "ok", pack_shop(read_document(path))
    except (ShopError, GridFileError) as exc:
        return ("refused",) + problem_texts(exc)


def write_copy_packed(packed: tuple, path: str) -> str:
    """Write a packed shop to ``path`` as a shop document, without the whole-shop check
    (an autosaved copy of work in progress); "" when written, else the reason."""
    try:
        target = Path(path)
        target.parent.mkdir(parents=True, exist_ok=True)
        save_shop(unpack_shop(packed), target, check=False)
    except (OSError, ShopError) as exc:
        return str(exc)
    return ""
