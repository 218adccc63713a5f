"""A shop in a form that crosses to another process quickly.

Pickling a shop's grid (a dict of 200,000 pairs on a 1000 x 200 shop) is one long call
that holds Python's interpreter lock; a window waiting for it cannot repaint. A packed
shop carries the grid and the run hours as three numpy arrays each (job index, machine
index, value), which pickle in one quick copy; building the arrays and the dicts again is
an ordinary Python loop that lets other threads run between its steps.
"""

from __future__ import annotations

from dataclasses import replace

import numpy as np

from .model import Shop


def pack_shop(shop: Shop) -> tuple:
    """``shop`` without its grid and hours, plus both as (job index, machine index, value)."""
    jpos = {j.id: i for i, j in enumerate(shop.jobs)}
    mpos = {m.id: k for k, m in enumerate(shop.machines)}

    def table(cells: dict) -> tuple:
        n = len(cells)
        rows = np.fromiter((jpos[k[0]] for k in cells), dtype=np.int32, count=n)
        cols = np.fromiter((mpos[k[1]] for k in cells), dtype=np.int32, count=n)
        return rows, cols, np.fromiter(cells.values(), dtype=float, count=n)

    return replace(shop, grid={}, hours={}), table(shop.grid), table(shop.hours)


def unpack_shop(packed: tuple) -> Shop:
    """The shop :func:`pack_shop` packed (equal to the original, field by field)."""
    light, grid, hours = packed
    jids = [j.id for j in light.jobs]
    mids = [m.id for m in light.machines]

    def cells(table: tuple) -> dict:
        rows, cols, values = table
        return {(jids[r], mids[c]): v for r, c, v in zip(rows.tolist(), cols.tolist(), values.tolist())}

    return replace(light, grid=cells(grid), hours=cells(hours))
