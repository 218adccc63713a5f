"""Write the shop's grid to CSV or XLSX in the grid file layout (Qt-free, pandas)."""

from __future__ import annotations

from pathlib import Path

import pandas as pd

from dispatcher.shop import Shop


def grid_frame(shop: Shop) -> pd.DataFrame:
    """Jobs x machines table; ``x`` where the machine cannot run the job."""
    data = {}
    for m in shop.machines:
        col = []
        for j in shop.jobs:
            v = shop.grid.get((j.id, m.id))
            col.append("x" if v is None else (int(v) if float(v).is_integer() else v))
        data[m.name] = col
    frame = pd.DataFrame(data, index=[j.name for j in shop.jobs])
    frame.index.name = shop.unit.label()
    return frame


def write_grid(shop: Shop, path: Path) -> None:
    """CSV (UTF-8, comma) or XLSX by the file's extension; readable back by ``read_grid``."""
    suffix = path.suffix.lower()
    frame = grid_frame(shop)
    if suffix == ".xlsx":
        frame.to_excel(path, engine="openpyxl")
    elif suffix in (".csv", ".txt", ".tsv"):
        frame.to_csv(path, sep="\t" if suffix == ".tsv" else ",", encoding="utf-8")
    else:
        raise ValueError(f"unsupported extension {path.suffix or '(none)'!r}; use .csv or .xlsx")
