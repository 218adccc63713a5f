"""The field lists of io/shopfile.py (what a shop document may hold; unknown fields are
refused) match the model's dataclasses, so a field added to the model cannot be silently
left out of the documents, nor a document field be read into nothing."""

from __future__ import annotations

import dataclasses

import pytest

from dispatcher.io import shopfile
from dispatcher.io.shopfile import load_shop, shop_to_dict
from dispatcher.shop import Job, Machine, Pin, Shift, Shop, Unit

#: Document-only keys of the top level (not model fields).
DOCUMENT_ONLY = {"format", "format_version"}
#: Model field -> document key where the two differ (docs/shop-format.md).
RENAMED = {
    (Shift, "day"): "date",
    # pairs typed as "cannot run" are stored in the grid, as null
    (Shop, "blocked"): "grid",
}


def _document_keys(cls) -> set[str]:
    return {RENAMED.get((cls, f.name), f.name) for f in dataclasses.fields(cls)}


@pytest.mark.parametrize(
    "cls, listed, extra",
    [
        (Shop, shopfile._TOP, DOCUMENT_ONLY),
        (Unit, shopfile._UNIT, set()),
        (Shift, shopfile._SHIFT, set()),
        (Machine, shopfile._MACHINE, set()),
        (Job, shopfile._JOB, set()),
        (Pin, shopfile._PIN, set()),
    ],
)
def test_field_list_matches_dataclass(cls, listed, extra):
    assert _document_keys(cls) | extra == set(listed)


def test_written_documents_use_only_listed_keys(samples):
    for path in sorted(samples.glob("*.dshop")):
        data = shop_to_dict(load_shop(path))
        assert set(data) <= shopfile._TOP, path.name
        assert set(data["unit"]) <= shopfile._UNIT and set(data["shift"]) <= shopfile._SHIFT
        for m in data["machines"]:
            assert set(m) <= shopfile._MACHINE, (path.name, m)
        for j in data["jobs"]:
            assert set(j) <= shopfile._JOB, (path.name, j)
        for p in data["pins"]:
            assert set(p) <= shopfile._PIN, (path.name, p)
