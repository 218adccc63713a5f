"""Shop documents on the command line: recognise, load and solve them for ``dispatcher solve``.

Kept apart from the grid path so that commands taking "a grid file or a shop document"
share one way of reading and reporting errors: bad documents exit 2 with every problem
located, rush or pinned jobs that cannot all be placed exit 3.
"""

from __future__ import annotations

import sys
from pathlib import Path

from dispatcher.commands.common import CliError, print_json, print_plan
from dispatcher.io.shopfile import SHOP_SUFFIX, ShopFileError, load_shop, save_shop
from dispatcher.shop import Plan, Shop, solve_shop
from dispatcher.shop.staffed import staffing_lines

SHOP_SUFFIXES = (SHOP_SUFFIX, ".json")


def is_shop_document(path: str) -> bool:
    """True for a ``.dshop`` (or ``.json``) path: read it as a shop, not as a grid."""
    return Path(path).suffix.lower() in SHOP_SUFFIXES


def read_shop_arg(path: str) -> Shop:
    """Load a shop document given on the command line (problems raise ShopFileError, exit 2)."""
    return load_shop(path)


def add_in_force_argument(parser) -> None:
    """``--in-force``: write the new plan (and the shop after any event) into the document."""
    parser.add_argument("--in-force", action="store_true",
                        help="shop documents: save this plan into the document as the plan in "
                        "force (with --record, only after the decision is recorded)")


def check_writable(path: str) -> None:
    """Refuse (exit 2) before anything is recorded when the document cannot be saved, so
    the history and the document never disagree (a rerun then records once)."""
    target = Path(path)
    folder = target.parent if str(target.parent) else Path(".")
    problem = ""
    try:
        if target.exists():
            with open(target, "ab"):
                pass  # opened for writing, nothing written
        probe = folder / f".{target.name}.write-check"
        with open(probe, "xb"):
            pass
        probe.unlink()
    except FileExistsError:
        pass
    except OSError as exc:
        problem = exc.strerror or str(exc)
    if problem:
        raise CliError(f"{path}: the document cannot be saved ({problem}); nothing was "
                       "recorded and the document was not changed")


def save_in_force(shop: Shop, in_force: dict[str, list[str]], path: str) -> None:
    """Save ``shop`` to ``path`` with ``in_force`` as its plan in force (atomic; exit 2 on failure)."""
    shop.plan_in_force = {machine: list(jobs) for machine, jobs in in_force.items()}
    try:
        save_shop(shop, path)
    except ShopFileError as exc:  # the command line says what became of the document
        raise CliError(f"{exc} (the document was not changed)") from None
    print(f"Saved the plan in force into {path}", file=sys.stderr)


def job_name(shop: Shop, given: str, source: str) -> str:
    """The job's name for a job given on the command line by name or by work order."""
    names = {j.name for j in shop.jobs}
    if given in names:
        return given
    by_order = [j.name for j in shop.jobs if j.work_order and j.work_order == given]
    if len(by_order) == 1:
        return by_order[0]
    if by_order:
        raise CliError(f"{source}: work order {given!r} names several jobs "
                       f"({', '.join(by_order)}); give the job's name")
    return given  # unknown: the core names the event that does not fit


def split_names(values: str | list[str]) -> list[str]:
    """Names from ``--must-run``: repeat the option for a name containing a comma, or give
    several comma-separated names in one option."""
    if isinstance(values, str):
        values = [values]
    out: list[str] = []
    for text in values:
        out += [n.strip() for n in text.split(",") if n.strip()]
    return out


def solve_shop_arg(shop: Shop, source: str, objective: str, must_run: str | list[str] = "") -> Plan:
    """Solve a loaded shop; ``must_run`` is the ``--must-run`` text (or texts, if repeated)."""
    return solve_shop(shop, objective, extra_must_run=must_run_names(shop, must_run),
                      source=source)


def must_run_names(shop: Shop, must_run: str | list[str]) -> list[str]:
    """``--must-run`` names: a whole option naming a job (even with a comma in its name)
    is that job; otherwise the option is split at commas."""
    texts = [must_run] if isinstance(must_run, str) else list(must_run)
    known = {j.name for j in shop.jobs} | {j.work_order for j in shop.jobs if j.work_order}
    out: list[str] = []
    for text in texts:
        if text.strip() in known:
            out.append(text.strip())
        else:
            out += split_names(text)
    return out


def print_shop_plan(plan: Plan, shop: Shop, as_json: bool) -> None:
    """Print a shop's plan: the solve JSON contract, or the readable table."""
    data = plan.to_json()
    if as_json:
        print_json(data)
        return
    print_plan(data, shop.unit.label(), marks=_marks(shop))
    if plan.rush_groups:
        print(f"Rush jobs waiting ({len(plan.rush_waiting)}): " + ", ".join(plan.rush_waiting))
        for g in plan.rush_groups:
            print(f"  {g.text}")
    if plan.running:
        print("Already running (stay): " + ", ".join(f"{r.job} on {r.machine}" for r in plan.running))
    if plan.unavailable_machines:
        print("Not available: " + ", ".join(
            f"{m} ({shop.machine_by_name(m).state})" for m in plan.unavailable_machines))
    if plan.staffing is not None:
        for line in staffing_lines(plan.staffing):
            print(line)


def _marks(shop: Shop) -> dict[str, str]:
    """Job name -> its mark in text output: [rush], [pinned] or both."""
    pinned = {p.job for p in shop.pins if p.kind == "must"}
    out = {}
    for j in shop.jobs:
        tags = (["rush"] if j.rush else []) + (["pinned"] if j.id in pinned else [])
        if tags:
            out[j.name] = "[" + ", ".join(tags) + "]"
    return out


def run_shop(path: str, objective: str, must_run: str, as_json: bool) -> int:
    """``dispatcher solve SHOP.dshop``: load, solve, print. Returns the exit code."""
    shop = read_shop_arg(path)
    plan = solve_shop_arg(shop, path, objective, must_run)
    print_shop_plan(plan, shop, as_json)
    return 0
