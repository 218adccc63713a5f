"""Shop documents: round trips, atomic saving, and every kind of bad input.

Each bad document must be refused with a message naming the file, the place (job or
machine name, field) and the problem, and must leave every file as it was.
"""

from __future__ import annotations

import json
import os
from pathlib import Path

import pytest

from dispatcher.io import shopfile
from dispatcher.io.shopfile import (
    FORMAT_VERSION,
    ShopFileError,
    dump_shop_text,
    load_shop,
    save_shop,
    shop_to_dict,
)
from dispatcher.shop import Job, Machine, Pin, Shop

SAMPLES = sorted((Path(__file__).resolve().parent.parent / "sample_shops").glob("*.dshop"))


def base_doc() -> dict:
    shop = Shop(name="t", description="invented test shop",
                jobs=[Job("J1", "WO-1 lid"), Job("J2", "WO-2 clip")],
                machines=[Machine("M1", "Press 1"), Machine("M2", "Press 2")])
    shop.grid = {("J1", "M1"): 5, ("J1", "M2"): 7, ("J2", "M1"): 3}
    return shop_to_dict(shop)


def write(tmp_path: Path, text: str) -> Path:
    path = tmp_path / "shop.dshop"
    path.write_text(text, encoding="utf-8")
    return path


def test_sample_documents_round_trip_byte_for_byte(tmp_path):
    assert len(SAMPLES) >= 3
    for sample in SAMPLES:
        shop = load_shop(sample)
        assert "invented" in shop.description.lower()
        out = tmp_path / sample.name
        save_shop(shop, out)
        assert load_shop(out) == shop
        assert out.read_text(encoding="utf-8") == sample.read_text(encoding="utf-8")


def test_optional_fields_default(tmp_path):
    doc = {"format": "dispatcher-shop", "format_version": 1,
           "jobs": [{"id": "a", "name": "A"}], "machines": [{"id": "m", "name": "M"}],
           "grid": {"a": {"m": 2}}}
    shop = load_shop(write(tmp_path, json.dumps(doc)))
    assert shop.machines[0].slots == 1 and shop.jobs[0].state == "waiting"
    assert shop.value("a", "m") == 2 and shop.plan_in_force == {}


def test_plan_in_force_round_trips(tmp_path):
    doc = base_doc()
    doc["plan_in_force"] = {"M1": ["J2"], "M2": ["J1"]}
    path = write(tmp_path, json.dumps(doc))
    assert load_shop(path).plan_in_force == {"M1": ["J2"], "M2": ["J1"]}


def edit(doc: dict, change) -> dict:
    change(doc)
    return doc


BAD_DOCUMENTS = [
    ("malformed JSON", lambda d: '{"format": "dispatcher-shop", "format_version": 1,,}',
     r"line 1, column \d+: not valid JSON"),
    ("not a shop", lambda d: json.dumps({"rows": [1, 2, 3]}), "not a dispatcher shop document"),
    ("a list", lambda d: "[1, 2]", "not a dispatcher shop document"),
    ("other format", lambda d: json.dumps(edit(d, lambda x: x.update(format="other"))),
     "field 'format': expected 'dispatcher-shop'"),
    ("newer version", lambda d: json.dumps(edit(d, lambda x: x.update(format_version=FORMAT_VERSION + 1))),
     "newer than this program reads"),
    ("wrong type slots", lambda d: json.dumps(edit(d, lambda x: x["machines"][0].update(slots="two"))),
     "machine 'Press 1' \\(#1\\), field 'slots': expected a whole number"),
    ("wrong type rush", lambda d: json.dumps(edit(d, lambda x: x["jobs"][1].update(rush="yes"))),
     "job 'WO-2 clip' \\(#2\\), field 'rush': expected true or false"),
    ("wrong type grid value", lambda d: json.dumps(edit(d, lambda x: x["grid"]["J1"].update(M1="5 min"))),
     "grid, job 'WO-1 lid' \\(id J1\\), machine 'Press 1' \\(id M1\\): expected a number"),
    ("bad date", lambda d: json.dumps(edit(d, lambda x: x["jobs"][0].update(due="tomorrow"))),
     "field 'due': 'tomorrow' is not a datetime"),
    ("NaN", lambda d: json.dumps(d).replace('"hours": 8', '"hours": NaN'), "NaN is not a number"),
    ("duplicate key", lambda d: '{"format": "dispatcher-shop", "format": "x", "format_version": 1}',
     "key 'format' appears twice"),
    ("unknown field", lambda d: json.dumps(edit(d, lambda x: x["machines"][1].update(colour="red"))),
     "machine 'Press 2' \\(#2\\): unknown field 'colour'"),
    ("unknown top field", lambda d: json.dumps(edit(d, lambda x: x.update(extra=1))),
     "top level: unknown field 'extra'"),
    ("pin unknown job", lambda d: json.dumps(edit(d, lambda x: x["pins"].append(
        {"job": "J9", "machine": "M1", "kind": "must"}))), "field 'job': names unknown job id 'J9'"),
    ("pin unknown machine", lambda d: json.dumps(edit(d, lambda x: x["pins"].append(
        {"job": "J1", "machine": "M7", "kind": "must_not"}))), "names unknown machine id 'M7'"),
    ("contradicting pins", lambda d: json.dumps(edit(d, lambda x: x["pins"].extend([
        {"job": "J1", "machine": "M1", "kind": "must"}, {"job": "J1", "machine": "M1", "kind": "must_not"}]))),
     "pinned both to and away from this machine"),
    ("two jobs forced onto one slot", lambda d: json.dumps(edit(d, lambda x: x["pins"].extend([
        {"job": "J1", "machine": "M1", "kind": "must"}, {"job": "J2", "machine": "M1", "kind": "must"}]))),
     "machine 'Press 1' \\(id M1\\): 2 jobs are pinned to it \\(WO-1 lid, WO-2 clip\\) but it has 1 free slot"),
    ("running on a down machine", lambda d: json.dumps(edit(d, lambda x: (
        x["machines"][0].update(state="down"),
        x["jobs"][0].update(state="running", machine="M1")))),
     "job 'WO-1 lid' \\(id J1\\), field 'machine': is running on machine 'Press 1' \\(id M1\\), which is down"),
    ("negative slots", lambda d: json.dumps(edit(d, lambda x: x["machines"][1].update(slots=-2))),
     "machine 'Press 2' \\(id M2\\), field 'slots': -2 must be a whole number from 1 to 100"),
    ("duplicate job ids", lambda d: json.dumps(edit(d, lambda x: x["jobs"][1].update(id="J1"))),
     "job id 'J1': is used by 2 jobs"),
    ("duplicate machine names", lambda d: json.dumps(edit(d, lambda x: x["machines"][1].update(name="Press 1"))),
     "machine name 'Press 1': is used by 2 machines"),
    ("empty shop", lambda d: json.dumps(edit(d, lambda x: (x.update(jobs=[], machines=[], grid={})))),
     "(?s)the shop has no jobs.*the shop has no machines"),
    ("negative value", lambda d: json.dumps(edit(d, lambda x: x["grid"]["J1"].update(M2=-1))),
     "value -1 must be a number from 0 to 1e12"),
    ("empty file", lambda d: "", "the file is empty"),
]


@pytest.mark.parametrize("name, make, match", BAD_DOCUMENTS, ids=[b[0] for b in BAD_DOCUMENTS])
def test_bad_documents_are_refused_clearly_and_files_untouched(tmp_path, name, make, match):
    path = write(tmp_path, make(base_doc()))
    before = path.read_bytes()
    listing = sorted(os.listdir(tmp_path))
    with pytest.raises(ShopFileError, match=match) as info:
        load_shop(path)
    assert str(info.value).startswith(str(path))
    assert path.read_bytes() == before and sorted(os.listdir(tmp_path)) == listing


def test_every_problem_is_reported_at_once(tmp_path):
    doc = base_doc()
    doc["machines"][0]["slots"] = "x"
    doc["jobs"][1]["wait_penalty"] = "high"
    doc["jobs"][0]["colour"] = "blue"
    with pytest.raises(ShopFileError) as info:
        load_shop(write(tmp_path, json.dumps(doc)))
    assert len(info.value.problems) == 3
    assert "3 problems" in str(info.value)


def test_not_utf8_and_missing_file(tmp_path):
    path = tmp_path / "x.dshop"
    path.write_bytes(b'{"format": "\xff"}')
    with pytest.raises(ShopFileError, match="line 1: is not UTF-8"):
        load_shop(path)
    with pytest.raises(ShopFileError, match="file not found"):
        load_shop(tmp_path / "missing.dshop")


def test_check_false_returns_an_editable_inconsistent_shop(tmp_path):
    doc = base_doc()
    doc["pins"] = [{"job": "J1", "machine": "M1", "kind": "must"},
                   {"job": "J1", "machine": "M1", "kind": "must_not"}]
    shop = load_shop(write(tmp_path, json.dumps(doc)), check=False)
    assert len(shop.pins) == 2


def test_saving_an_inconsistent_shop_leaves_the_old_file(tmp_path):
    path = write(tmp_path, json.dumps(base_doc()))
    before = path.read_bytes()
    shop = load_shop(path)
    shop.pins = [Pin("J1", "M1", "must"), Pin("J2", "M1", "must")]
    with pytest.raises(ShopFileError, match="free slot"):
        save_shop(shop, path)
    assert path.read_bytes() == before and os.listdir(tmp_path) == ["shop.dshop"]


def test_failed_write_keeps_the_old_file_and_leaves_no_temp_file(tmp_path, monkeypatch):
    path = write(tmp_path, json.dumps(base_doc()))
    before = path.read_bytes()
    shop = load_shop(path)
    shop.name = "changed"

    def disk_full(fd):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr(shopfile.os, "fsync", disk_full)  # simulate a full disk at flush time
    with pytest.raises(ShopFileError, match="No space left on device.*unchanged"):
        save_shop(shop, path)
    assert path.read_bytes() == before and os.listdir(tmp_path) == ["shop.dshop"]


def test_save_replaces_and_keeps_permissions(tmp_path):
    path = write(tmp_path, json.dumps(base_doc()))
    path.chmod(0o640)
    shop = load_shop(path)
    shop.name = "renamed"
    save_shop(shop, path)
    assert load_shop(path).name == "renamed"
    assert path.stat().st_mode & 0o777 == 0o640
    assert dump_shop_text(shop) == path.read_text(encoding="utf-8")


def test_grid_is_written_in_shop_order_whatever_order_the_cells_were_set():
    # Reference: the plain definition (every cell sorted by the job's then the machine's
    # place in the shop), against the writer's row-by-row gathering; values whole or not,
    # big, and missing (cannot run) on a shuffled dict.
    import random

    jobs = [Job(f"J{i}", f"WO-{i} part (invented)") for i in range(12)]
    machines = [Machine(f"M{k}", f"Cell {k}") for k in range(7)]
    shop = Shop(name="order", jobs=jobs, machines=machines)
    cells = [(j.id, m.id) for j in jobs for m in machines if (hash((j.id, m.id)) % 5)]
    rng = random.Random(3)
    rng.shuffle(cells)
    values = [5.0, 7.5, 2.0**60, 0.0, 12, 1e12]
    shop.grid = {c: values[n % len(values)] for n, c in enumerate(cells)}
    written = shop_to_dict(shop)["grid"]
    jo = {j.id: i for i, j in enumerate(jobs)}
    mo = {m.id: i for i, m in enumerate(machines)}
    expected_order = sorted(shop.grid, key=lambda c: (jo[c[0]], mo[c[1]]))
    assert [(jid, mid) for jid, row in written.items() for mid in row] == expected_order
    for (jid, mid) in expected_order:
        v = shop.grid[(jid, mid)]
        out = written[jid][mid]
        assert out == v and (type(out) is int) == (float(v).is_integer() and abs(v) < 2**53)
    assert load_shop_text_roundtrip(shop) == shop.grid


def load_shop_text_roundtrip(shop) -> dict:
    data = json.loads(dump_shop_text(shop))
    return {(j, m): v for j, row in data["grid"].items() for m, v in row.items()}
