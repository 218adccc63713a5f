"""Shop documents: one JSON file per shop (extension ``.dshop``), read and written safely.

The format is described in docs/shop-format.md. Reading parses JSON with the standard
``json`` module only (nothing is executed), checks every field's type, reports unknown
fields, refuses documents from a newer ``format_version``, and then checks the shop as a
whole (:func:`dispatcher.shop.shop_problems`). Every problem is reported at once, each with
its place in the document (job or machine name and field).

Writing is atomic: the document goes to a temporary file in the same folder, is flushed
and fsync'ed, and replaces the old file with ``os.replace`` in one step, so a crash or a
full disk never leaves a half-written document (the old one stays as it was).
"""

from __future__ import annotations

import json
import math
import os
import re
from collections import defaultdict
from datetime import date, datetime, time
from pathlib import Path
from typing import Any

import numpy as np

from dispatcher.atomic import atomic_write_bytes
from dispatcher.jsonnum import EXACT_INTS
from dispatcher.io.crewfile import CREW_VERSION, crew_to_dict, has_crew, read_crew
from dispatcher.limits import (
    MAX_CELLS,
    MAX_DOCUMENT_BYTES,
    MAX_JOBS,
    MAX_JSON_DEPTH,
    MAX_MACHINES,
    MAX_PINS,
    MAX_SLOTS,
    MAX_TOTAL_SLOTS,
    name_problem,
    value_problem,
)
from dispatcher.shop.model import (
    ChangeoverTable,
    Job,
    Machine,
    Pin,
    Problem,
    Shift,
    Shop,
    ShopError,
    Unit,
)
from dispatcher.shop.model import UP
from dispatcher.shop.plan import json_number
from dispatcher.shop.validate import shop_problems

FORMAT_NAME = "dispatcher-shop"
#: Newest format this program reads. A document is written with the lowest version that
#: holds everything in it (:func:`_needed_version`), so older programs still open plain
#: shops: version 2 added the crew block, version 3 setup families (job ``family``),
#: ``changeover_tables`` and the machines' ``mounted`` and ``end_family``.
FORMAT_VERSION = 3
CHANGEOVER_VERSION = 3
SHOP_SUFFIX = ".dshop"

#: Fields holding free text (notes); every other text field is a name or an id.
_FREE_TEXT = {"description", "notes", "state_note", "note"}

_TOP = {"format", "format_version", "name", "description", "unit", "shift", "move_penalty",
        "machines", "jobs", "grid", "hours", "pins", "plan_in_force", "crew",
        "changeover_tables"}
_UNIT = {"kind", "currency"}
_SHIFT = {"date", "label", "start", "hours"}
_MACHINE = {"id", "name", "state", "state_note", "state_changed", "slots", "shift_hours",
            "speed_factor", "notes", "mounted", "end_family"}
_JOB = {"id", "name", "work_order", "rush", "wait_penalty", "due", "notes", "state",
        "machine", "since", "run_hours", "move_penalty", "family"}
_TABLE = {"id", "name", "machines", "families", "changes", "from_empty"}
_PIN = {"job", "machine", "kind", "note"}


class ShopFileError(ShopError):
    """A shop document that cannot be read or written; lists every problem with its place."""


def _reject_constant(name: str) -> float:
    raise ValueError(f"{name} is not a number JSON allows")


def _no_duplicate_keys(pairs: list[tuple[str, Any]]) -> dict[str, Any]:
    out: dict[str, Any] = {}
    for k, v in pairs:
        if k in out:
            raise ValueError(f"key {k!r} appears twice in one object")
        out[k] = v
    return out


class _Reader:
    """Checks one field at a time, collecting problems instead of stopping at the first."""

    def __init__(self) -> None:
        self.problems: list[Problem] = []

    def bad(self, where: str, msg: str) -> None:
        self.problems.append(Problem(where, msg))

    def obj(self, x: Any, where: str, keys: set[str]) -> dict[str, Any] | None:
        if not isinstance(x, dict):
            self.bad(where, f"expected an object {{...}}, got {_kind(x)}")
            return None
        for k in x:
            if k not in keys:
                self.bad(where, f"unknown field {k!r} (known: {', '.join(sorted(keys))})")
        return x

    def checked(self, v: str, key: str, where: str, default: str) -> str:
        """``v`` if it is plain text within the length limit (names: one line), else ``default``."""
        problem = name_problem(v, free_text=key in _FREE_TEXT)
        if problem is not None:
            self.bad(f"{where}, field '{key}'", problem)
            return default
        return v

    def text(self, d: dict, key: str, where: str, default: str = "", required: bool = False) -> str:
        if key not in d:
            if required:
                self.bad(f"{where}, field '{key}'", "is missing")
            return default
        v = d[key]
        if not isinstance(v, str):
            self.bad(f"{where}, field '{key}'", f"expected text, got {_kind(v)}")
            return default
        return self.checked(v, key, where, default)

    def opt_text(self, d: dict, key: str, where: str) -> str | None:
        v = d.get(key)
        if v is None:
            return None
        if not isinstance(v, str):
            self.bad(f"{where}, field '{key}'", f"expected text or null, got {_kind(v)}")
            return None
        return self.checked(v, key, where, None)

    def number(self, d: dict, key: str, where: str, default: float | None,
               optional: bool = False) -> float | None:
        if key not in d or (optional and d[key] is None):
            return default
        v = d[key]
        if isinstance(v, bool) or not isinstance(v, (int, float)) or not math.isfinite(v):
            self.bad(f"{where}, field '{key}'", f"expected a number, got {_kind(v)}")
            return default
        too_big = value_problem(float(v))
        if too_big:
            self.bad(f"{where}, field '{key}'", too_big)
            return default
        return float(v)

    def integer(self, d: dict, key: str, where: str, default: int, maximum: int | None = None) -> int:
        if key not in d:
            return default
        v = d[key]
        if (isinstance(v, bool) or not isinstance(v, (int, float))
                or not math.isfinite(v) or not float(v).is_integer()):
            self.bad(f"{where}, field '{key}'", f"expected a whole number, got {_kind(v)}")
            return default
        if maximum is not None and v > maximum:
            self.bad(f"{where}, field '{key}'", f"{int(v):,} is more than the limit of {maximum:,}")
            return default
        return int(v)

    def boolean(self, d: dict, key: str, where: str, default: bool = False) -> bool:
        if key not in d:
            return default
        v = d[key]
        if not isinstance(v, bool):
            self.bad(f"{where}, field '{key}'", f"expected true or false, got {_kind(v)}")
            return default
        return v

    def stamp(self, d: dict, key: str, where: str, kind: type) -> Any:
        v = self.opt_text(d, key, where)
        if v is None:
            return None
        try:
            return kind.fromisoformat(v)
        except ValueError:
            example = {date: "2026-03-14", time: "06:00", datetime: "2026-03-14T06:30"}[kind]
            self.bad(f"{where}, field '{key}'", f"{v!r} is not a {kind.__name__} like {example!r}")
            return None


def _kind(x: Any) -> str:
    if x is None:
        return "null"
    if isinstance(x, bool):
        return "true/false"
    if isinstance(x, (int, float)):
        return f"the number {x!r}" if len(repr(x)) < 40 else "a number"
    if isinstance(x, str):
        return f"the text {x!r}" if len(x) < 40 else "a text"
    if isinstance(x, list):
        return "a list"
    if isinstance(x, dict):
        return "an object"
    return type(x).__name__


def shop_from_dict(data: Any, source: str = "shop document", *, check: bool = True) -> Shop:
    """Build a shop from parsed JSON, reporting every problem (raises :class:`ShopFileError`).

    With ``check=False`` only the document's structure is checked, and a shop with
    consistency problems (say, a pin contradicting another) is returned for editing.
    """
    r = _Reader()
    if not isinstance(data, dict) or "format_version" not in data:
        raise ShopFileError([Problem("", "not a dispatcher shop document (expected a JSON object "
                                     f"with \"format\": \"{FORMAT_NAME}\" and \"format_version\")")],
                            source)
    fmt = data.get("format")
    if fmt != FORMAT_NAME:
        raise ShopFileError([Problem("field 'format'", f"expected {FORMAT_NAME!r}, got {_kind(fmt)}")],
                            source)
    version = data["format_version"]
    if isinstance(version, bool) or not isinstance(version, int) or version < 1:
        raise ShopFileError([Problem("field 'format_version'",
                                     f"expected a whole number >= 1, got {_kind(version)}")], source)
    if version > FORMAT_VERSION:
        raise ShopFileError([Problem("field 'format_version'",
                                     f"the document is format version {version}, newer than this "
                                     f"program reads (up to {FORMAT_VERSION}); update dispatcher "
                                     "to open it")], source)
    _check_counts(data, source)
    r.obj(data, "top level", _TOP)
    shop = Shop(name=r.text(data, "name", "top level"),
                description=r.text(data, "description", "top level"))
    shop.move_penalty = r.number(data, "move_penalty", "top level", 0.0)

    unit = r.obj(data.get("unit", {}), "unit", _UNIT)
    if unit is not None:
        shop.unit = Unit(kind=r.text(unit, "kind", "unit", "setup_minutes"),
                         currency=r.text(unit, "currency", "unit"))
    shift = r.obj(data.get("shift", {}), "shift", _SHIFT)
    if shift is not None:
        shop.shift = Shift(day=r.stamp(shift, "date", "shift", date),
                           label=r.text(shift, "label", "shift"),
                           start=r.stamp(shift, "start", "shift", time),
                           hours=r.number(shift, "hours", "shift", 8.0))

    machines = data.get("machines", [])
    if not isinstance(machines, list):
        r.bad("field 'machines'", f"expected a list, got {_kind(machines)}")
        machines = []
    for n, m in enumerate(machines, start=1):
        where = _item_where("machine", n, m)
        m = r.obj(m, where, _MACHINE)
        if m is None:
            continue
        shop.machines.append(Machine(
            id=r.text(m, "id", where, required=True), name=r.text(m, "name", where, required=True),
            state=r.text(m, "state", where, UP), state_note=r.text(m, "state_note", where),
            state_changed=r.stamp(m, "state_changed", where, datetime),
            slots=r.integer(m, "slots", where, 1, maximum=MAX_SLOTS),
            shift_hours=r.number(m, "shift_hours", where, None, optional=True),
            speed_factor=r.number(m, "speed_factor", where, 1.0),
            notes=r.text(m, "notes", where), mounted=r.opt_text(m, "mounted", where),
            end_family=r.opt_text(m, "end_family", where)))

    jobs = data.get("jobs", [])
    if not isinstance(jobs, list):
        r.bad("field 'jobs'", f"expected a list, got {_kind(jobs)}")
        jobs = []
    for n, j in enumerate(jobs, start=1):
        where = _item_where("job", n, j)
        j = r.obj(j, where, _JOB)
        if j is None:
            continue
        shop.jobs.append(Job(
            id=r.text(j, "id", where, required=True), name=r.text(j, "name", where, required=True),
            work_order=r.text(j, "work_order", where), rush=r.boolean(j, "rush", where),
            wait_penalty=r.number(j, "wait_penalty", where, 0.0), due=r.stamp(j, "due", where, datetime),
            notes=r.text(j, "notes", where), state=r.text(j, "state", where, "waiting"),
            machine=r.opt_text(j, "machine", where), since=r.stamp(j, "since", where, datetime),
            run_hours=r.number(j, "run_hours", where, None, optional=True),
            move_penalty=r.number(j, "move_penalty", where, None, optional=True),
            family=r.opt_text(j, "family", where)))

    tables = data.get("changeover_tables", [])
    if not isinstance(tables, list):
        r.bad("field 'changeover_tables'", f"expected a list, got {_kind(tables)}")
        tables = []
    for n, t in enumerate(tables, start=1):
        table = _read_table(r, t, n, shop)
        if table is not None:
            shop.changeover_tables.append(table)

    total_slots = sum(m.slots for m in shop.machines if isinstance(m.slots, int))
    if total_slots > MAX_TOTAL_SLOTS:
        r.bad("field 'machines'", f"the machines have {total_slots:,} slots in all, more than the "
              f"limit of {MAX_TOTAL_SLOTS:,}")
    shop.grid = _read_pairs(r, data.get("grid", {}), "grid", shop, shop.blocked)
    shop.hours = _read_pairs(r, data.get("hours", {}), "hours", shop)

    pins = data.get("pins", [])
    if not isinstance(pins, list):
        r.bad("field 'pins'", f"expected a list, got {_kind(pins)}")
        pins = []
    for n, p in enumerate(pins, start=1):
        where = f"pin {n}"
        p = r.obj(p, where, _PIN)
        if p is None:
            continue
        shop.pins.append(Pin(job=r.text(p, "job", where, required=True),
                             machine=r.text(p, "machine", where, required=True),
                             kind=r.text(p, "kind", where, "must"), note=r.text(p, "note", where)))

    pif = data.get("plan_in_force", {})
    if not isinstance(pif, dict):
        r.bad("field 'plan_in_force'", f"expected an object machine id -> list of job ids, got {_kind(pif)}")
    else:
        for mid, jids in pif.items():
            where = f"plan_in_force, machine id {mid!r}"
            if not isinstance(jids, list) or not all(isinstance(x, str) for x in jids):
                r.bad(where, "expected a list of job ids")
                continue
            shop.plan_in_force[mid] = list(jids)

    if "crew" in data:
        if version < CREW_VERSION:
            r.bad("field 'crew'", f"needs format_version {CREW_VERSION} or later (the document says {version})")
        shop.crew = read_crew(r, data["crew"])

    problems = list(r.problems)
    if not problems and check:
        problems = shop_problems(shop)
    if problems:
        raise ShopFileError(problems, source)
    return shop


def _check_counts(data: dict, source: str) -> None:
    """Refuse a document whose lists exceed the limits, before any object is built."""
    problems = []
    sizes = {}
    for key, limit in (("jobs", MAX_JOBS), ("machines", MAX_MACHINES), ("pins", MAX_PINS)):
        items = data.get(key)
        if isinstance(items, list):
            sizes[key] = len(items)
            if len(items) > limit:
                problems.append(Problem(f"field '{key}'", f"{len(items):,} {key} are more than "
                                        f"the limit of {limit:,}"))
    cells = sizes.get("jobs", 0) * sizes.get("machines", 0)
    if not problems and cells > MAX_CELLS:
        problems.append(Problem("fields 'jobs' and 'machines'",
                                f"{sizes['jobs']:,} jobs x {sizes['machines']:,} machines = "
                                f"{cells:,} grid cells, more than the limit of {MAX_CELLS:,}"))
    if problems:
        raise ShopFileError(problems, source)


def _item_where(what: str, n: int, item: Any) -> str:
    if (isinstance(item, dict) and isinstance(item.get("name"), str)
            and name_problem(item["name"]) is None):
        return f"{what} {item['name']!r} (#{n})"
    return f"{what} #{n}"


def _read_table(r: _Reader, t: Any, n: int, shop: Shop) -> ChangeoverTable | None:
    where = _item_where("changeover table", n, t)
    t = r.obj(t, where, _TABLE)
    if t is None:
        return None
    table = ChangeoverTable(id=r.text(t, "id", where, required=True), name=r.text(t, "name", where))
    for key in ("machines", "families"):
        items = t.get(key, [])
        if not isinstance(items, list) or not all(isinstance(x, str) for x in items):
            r.bad(f"{where}, field '{key}'", f"expected a list of texts, got {_kind(items)}")
            continue
        setattr(table, key, list(items))

    def cell(a: str | None, b: str, v: Any, place: str) -> None:
        if v is None:
            return  # not allowed
        if isinstance(v, bool) or not isinstance(v, (int, float)) or not math.isfinite(v):
            r.bad(place, f"expected a number >= 0 (or null: not allowed), got {_kind(v)}")
        else:
            table.changes[(a, b)] = float(v)

    changes = t.get("changes", {})
    if not isinstance(changes, dict):
        r.bad(f"{where}, field 'changes'", f"expected an object from family -> {{to family: number}}, "
              f"got {_kind(changes)}")
        changes = {}
    for a, row in changes.items():
        if not isinstance(row, dict):
            r.bad(f"{where}, field 'changes', from {a!r}", f"expected an object to family -> number, "
                  f"got {_kind(row)}")
            continue
        for b, v in row.items():
            cell(a, b, v, f"{where}, field 'changes', from {a!r} to {b!r}")
    empty = t.get("from_empty", {})
    if not isinstance(empty, dict):
        r.bad(f"{where}, field 'from_empty'", f"expected an object family -> number, got {_kind(empty)}")
        empty = {}
    for b, v in empty.items():
        cell(None, b, v, f"{where}, field 'from_empty', to {b!r}")
    return table


def _table_to_dict(t: ChangeoverTable) -> dict[str, Any]:
    changes: dict[str, dict[str, int | float]] = {}
    empty: dict[str, int | float] = {}
    order = {f: i for i, f in enumerate(t.families)}
    for (a, b) in sorted(t.changes, key=lambda k: (k[0] is None, order.get(k[0], 1 << 30) if k[0] else 0,
                                                    order.get(k[1], 1 << 30))):
        v = json_number(t.changes[(a, b)])
        if a is None:
            empty[b] = v
        else:
            changes.setdefault(a, {})[b] = v
    return {"id": t.id, "name": t.name, "machines": list(t.machines), "families": list(t.families),
            "changes": changes, "from_empty": empty}


def _read_pairs(r: _Reader, block: Any, field: str, shop: Shop,
                nulls: set[tuple[str, str]] | None = None) -> dict[tuple[str, str], float]:
    out: dict[tuple[str, str], float] = {}
    if not isinstance(block, dict):
        r.bad(f"field '{field}'", f"expected an object job id -> {{machine id: number}}, got {_kind(block)}")
        return out
    for jid, row in block.items():
        if not isinstance(row, dict):
            r.bad(f"{field}, {shop.describe_job(jid)}",
                  f"expected an object machine id -> number, got {_kind(row)}")
            continue
        for mid, v in row.items():
            if v is None:
                if nulls is not None and shop.changeover_tables:
                    nulls.add((jid, mid))   # typed "cannot run" (matters with changeover tables)
                continue  # cannot run
            if isinstance(v, bool) or not isinstance(v, (int, float)) or not math.isfinite(v):
                r.bad(f"{field}, {shop.describe_job(jid)}, {shop.describe_machine(mid)}",
                      f"expected a number (or null: cannot run), got {_kind(v)}")
                continue
            too_big = value_problem(float(v))
            if too_big:
                r.bad(f"{field}, {shop.describe_job(jid)}, {shop.describe_machine(mid)}", too_big)
                continue
            out[(jid, mid)] = float(v)
    return out


_ESCAPE = re.compile(rb"\\.", re.DOTALL)
_SCAN_CHUNK = 1 << 22


def json_depth_problem(text: str, limit: int = MAX_JSON_DEPTH) -> Problem | None:
    """Where ``text`` nests JSON lists and objects deeper than ``limit``, or None.

    A linear scan outside the parser (numpy over the bytes, in chunks): brackets inside
    strings do not count. ``json.loads`` would recurse once per level and fail with a
    RecursionError on a document such as ``[`` x 100000; this refuses it first.
    """
    data = _ESCAPE.sub(b"__", text.encode("utf-8", "surrogatepass"))
    depth, in_string = 0, False
    for start in range(0, len(data), _SCAN_CHUNK):
        b = np.frombuffer(data, np.uint8, count=min(_SCAN_CHUNK, len(data) - start), offset=start)
        quotes = np.cumsum(b == ord('"')) + (1 if in_string else 0)
        outside = (quotes % 2) == 0
        step = (((b == ord("[")) | (b == ord("{"))).astype(np.int64)
                - ((b == ord("]")) | (b == ord("}"))).astype(np.int64)) * outside
        levels = depth + np.cumsum(step)
        deep = np.flatnonzero(levels > limit)
        if deep.size:
            at = start + int(deep[0])
            line = data.count(b"\n", 0, at) + 1
            column = at - (data.rfind(b"\n", 0, at) + 1) + 1
            return Problem(f"line {line}, column {column}",
                           f"lists and objects nest more than {limit} levels deep; a shop "
                           f"document needs at most 3")
        if b.size:
            depth = int(levels[-1])
            in_string = bool(quotes[-1] % 2)
    return None


def parse_shop_text(text: str, source: str = "shop document", *, check: bool = True) -> Shop:
    """Parse a shop document from JSON text."""
    deep = json_depth_problem(text)
    if deep is not None:
        raise ShopFileError([deep], source)
    try:
        data = json.loads(text, parse_constant=_reject_constant, object_pairs_hook=_no_duplicate_keys)
    except RecursionError:
        raise ShopFileError([Problem("", "lists and objects nest too deeply")], source) from None
    except json.JSONDecodeError as exc:
        raise ShopFileError([Problem(f"line {exc.lineno}, column {exc.colno}",
                                     f"not valid JSON: {exc.msg}")], source) from None
    except ValueError as exc:
        raise ShopFileError([Problem("", f"not valid JSON: {exc}")], source) from None
    return shop_from_dict(data, source, check=check)


def load_shop(path: str | os.PathLike, *, check: bool = True) -> Shop:
    """Read a shop document. Raises :class:`ShopFileError` naming the file and each problem."""
    path = Path(path)
    source = str(path)
    try:
        size = path.stat().st_size
        if path.is_dir():
            raise ShopFileError([Problem("", "is a folder, not a file")], source)
        if size > MAX_DOCUMENT_BYTES:
            raise ShopFileError([Problem("", f"{size} bytes exceed the limit of "
                                         f"{MAX_DOCUMENT_BYTES} bytes")], source)
        data = path.read_bytes()
    except FileNotFoundError:
        raise ShopFileError([Problem("", "file not found")], source) from None
    except PermissionError:
        raise ShopFileError([Problem("", "permission denied")], source) from None
    except OSError as exc:
        raise ShopFileError([Problem("", f"cannot read: {exc.strerror}")], source) from None
    if not data.strip():
        raise ShopFileError([Problem("", "the file is empty; expected a shop document (JSON)")], source)
    try:
        text = data.decode("utf-8-sig")
    except UnicodeDecodeError as exc:
        line = data[:exc.start].count(b"\n") + 1
        raise ShopFileError([Problem(f"line {line}", "is not UTF-8 text")], source) from None
    return parse_shop_text(text, source, check=check)


def _stamp(x: date | time | datetime | None) -> str | None:
    if x is None:
        return None
    if isinstance(x, time):
        return x.isoformat(timespec="minutes") if not x.second and not x.microsecond else x.isoformat()
    return x.isoformat()


def shop_to_dict(shop: Shop) -> dict[str, Any]:
    """The JSON document of a shop (the inverse of :func:`shop_from_dict`)."""
    def opt(x: float | None) -> int | float | None:
        return None if x is None else json_number(x)

    def pairs(d: dict[tuple[str, str], float]) -> dict[str, dict[str, int | float]]:
        # Jobs in the shop's order, each row's machines in the shop's order, ids the shop
        # does not know after the known ones (in the order met). Rows are gathered in one
        # pass and sorted each by a C-level key, and whole floats are turned into ints
        # inline (json_number's rule), rather than one sort and one call per cell: a
        # 1000 x 200 grid is written in about a third of the time.
        rows: dict[str, dict[str, float | None]] = {}
        for (jid, mid), v in d.items():
            rows.setdefault(jid, {})[mid] = v
        morder = defaultdict(lambda: 1 << 30, {m.id: i for i, m in enumerate(shop.machines)})
        ordered = [j.id for j in shop.jobs if j.id in rows]
        known = set(ordered)
        ordered += [jid for jid in rows if jid not in known]
        out: dict[str, dict[str, int | float]] = {}
        for jid in dict.fromkeys(ordered):
            row = rows[jid]
            written = out[jid] = {}
            for mid in sorted(row, key=morder.__getitem__):
                v = row[mid]
                if type(v) is float and v.is_integer() and -EXACT_INTS < v < EXACT_INTS:
                    written[mid] = int(v)       # json_number's rule, without the call
                else:
                    written[mid] = None if v is None else json_number(v)
        return out

    families = uses_changeovers(shop)
    data = {
        "format": FORMAT_NAME,
        "format_version": _needed_version(shop),
        "name": shop.name,
        "description": shop.description,
        "unit": {"kind": shop.unit.kind, "currency": shop.unit.currency},
        "shift": {"date": _stamp(shop.shift.day), "label": shop.shift.label,
                  "start": _stamp(shop.shift.start), "hours": json_number(shop.shift.hours)},
        "move_penalty": json_number(shop.move_penalty),
        "machines": [{
            "id": m.id, "name": m.name, "state": m.state, "state_note": m.state_note,
            "state_changed": _stamp(m.state_changed), "slots": m.slots,
            "shift_hours": opt(m.shift_hours), "speed_factor": json_number(m.speed_factor),
            "notes": m.notes, **({"mounted": m.mounted, "end_family": m.end_family} if families else {})}
            for m in shop.machines],
        "jobs": [{
            "id": j.id, "name": j.name, "work_order": j.work_order, "rush": j.rush,
            "wait_penalty": json_number(j.wait_penalty), "due": _stamp(j.due), "notes": j.notes,
            "state": j.state, "machine": j.machine, "since": _stamp(j.since),
            "run_hours": opt(j.run_hours), "move_penalty": opt(j.move_penalty),
            **({"family": j.family} if families else {})} for j in shop.jobs],
        "grid": pairs({**shop.grid, **{b: None for b in shop.blocked if b not in shop.grid}}
                      if families else shop.grid),
        "hours": pairs(shop.hours),
        "pins": [{"job": p.job, "machine": p.machine, "kind": p.kind, "note": p.note}
                 for p in shop.pins],
        "plan_in_force": {mid: list(jids) for mid, jids in shop.plan_in_force.items()},
    }
    if has_crew(shop.crew):
        data["crew"] = crew_to_dict(shop.crew)
    if families:
        data["changeover_tables"] = [_table_to_dict(t) for t in shop.changeover_tables]
    return data


def _needed_version(shop: Shop) -> int:
    """The lowest format version that holds everything in ``shop``."""
    if uses_changeovers(shop):
        return CHANGEOVER_VERSION
    return CREW_VERSION if has_crew(shop.crew) else 1


def uses_changeovers(shop: Shop) -> bool:
    """True when the shop has changeover tables, job families or mounted/end families
    (it is then written as format version 3)."""
    return bool(shop.changeover_tables
                or any(j.family is not None for j in shop.jobs)
                or any(m.mounted is not None or m.end_family is not None for m in shop.machines))


def dump_shop_text(shop: Shop) -> str:
    """The document as JSON text (grid rows on one line each, so diffs stay readable)."""
    data = shop_to_dict(shop)
    grid, hours = data.pop("grid"), data.pop("hours")
    text = json.dumps(data, indent=2, ensure_ascii=False, allow_nan=False)
    def block(d: dict) -> str:
        if not d:
            return "{}"
        rows = [f"    {json.dumps(k, ensure_ascii=False)}: "
                f"{json.dumps(v, ensure_ascii=False, allow_nan=False)}"
                for k, v in d.items()]
        return "{\n" + ",\n".join(rows) + "\n  }"
    tail = f',\n  "grid": {block(grid)},\n  "hours": {block(hours)}\n}}\n'
    return text[:-2] + tail


def save_shop(shop: Shop, path: str | os.PathLike, *, check: bool = True) -> None:
    """Write the document atomically (temp file in the same folder, fsync, os.replace).

    With ``check=True`` (default) a shop with consistency problems is refused before any
    file is touched, so what is saved can always be opened again.
    """
    path = Path(path)
    source = str(path)
    if check:
        problems = shop_problems(shop)
        if problems:
            raise ShopFileError(problems, source)
    try:
        text = dump_shop_text(shop).encode("utf-8")
    except ValueError as exc:  # a non-finite number: JSON has no spelling for it
        raise ShopFileError([Problem("", f"cannot save: {exc}; the previous file (if any) is "
                                     "unchanged")], source) from None
    try:
        atomic_write_bytes(path, text)
    except OSError as exc:
        raise ShopFileError([Problem("", f"cannot save: {exc.strerror or exc}; the previous "
                                     "file (if any) is unchanged")], source) from None
