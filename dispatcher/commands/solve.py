"""``dispatcher solve``: the cheapest plan for a grid file."""

from __future__ import annotations

import argparse
from pathlib import Path

from dispatcher.commands.common import (
    CliError,
    plan_json,
    print_json,
    print_plan,
)
from dispatcher.commands.history import (
    add_record_arguments,
    check_record_arguments,
    record_decision,
)
from dispatcher.commands import alternatives_whatif
from dispatcher.commands.fill_shift import run_fill_shift
from dispatcher.commands.shop_input import (
    add_in_force_argument,
    check_writable,
    is_shop_document,
    print_shop_plan,
    read_shop_arg,
    save_in_force,
    solve_shop_arg,
    split_names,
)
from dispatcher.engine import DispatchInputError, InfeasibleError, solve
from dispatcher.errors import Infeasible
from dispatcher.io.grid import read_grid
from dispatcher.io.shopfile import shop_to_dict
from dispatcher.shop import shop_from_grid


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser("solve", help="solve a grid file and print the plan",
                       description="Solve a jobs x machines grid (.csv or .xlsx) and print the plan.")
    p.add_argument("grid", metavar="GRID", help="grid file (.csv, .tsv, .txt or .xlsx) "
                   "or shop document (.dshop)")
    mode = p.add_mutually_exclusive_group()
    mode.add_argument("--maximize", action="store_true", help="values are gains: maximise the total")
    mode.add_argument("--bottleneck", action="store_true",
                      help="minimise the largest single value, then the total")
    p.add_argument("--must-run", metavar="JOB,JOB...", action="append", default=[],
                   help="jobs that must not wait: a hard constraint (exit 3 if impossible). "
                   "Comma-separated names or work orders; repeat the option for a name "
                   "containing a comma")
    p.add_argument("--json", action="store_true", help="print one JSON object")
    p.add_argument("--fill-shift", action="store_true",
                   help="shop documents: plan the whole shift, several jobs per machine "
                   "within each machine's hours")
    p.add_argument("--time-limit", metavar="SECONDS", type=float, default=None,
                   help="with --fill-shift: stop the solver after this many seconds and "
                   "report the best plan found with its proven gap")
    alternatives_whatif.add_arguments(p)
    add_in_force_argument(p)
    add_record_arguments(p)
    p.set_defaults(func=run)


def objective_of(args: argparse.Namespace) -> str:
    if args.maximize:
        return "maximize"
    if args.bottleneck:
        return "bottleneck"
    return "total"


def parse_names(text: str | list[str], known: list[str], what: str, source: str) -> list[int]:
    """Indices of the names given (each option a whole name, else comma-separated names);
    unknown names are bad input."""
    index = {n: i for i, n in enumerate(known)}
    names: list[str] = []
    for part in ([text] if isinstance(text, str) else text):
        names += [part.strip()] if part.strip() in index else split_names(part)
    unknown = [n for n in names if n not in index]
    if unknown:
        raise CliError(f"{source}: unknown {what} {', '.join(map(repr, unknown))}")
    return [index[n] for n in names]


def infeasible_message(exc: InfeasibleError, jobs: list[str], machines: list[str]) -> str:
    w = exc.witness
    return ("infeasible: must-run jobs " + ", ".join(jobs[j] for j in w.jobs)
            + f" ({len(w.jobs)}) compete for only {len(w.machines)} machine(s): "
            + (", ".join(machines[m] for m in w.machines) or "none"))


def run(args: argparse.Namespace) -> int:
    if args.time_limit is not None and not args.fill_shift:
        raise CliError(f"{args.grid}: --time-limit applies to --fill-shift only (one dispatch "
                       "round has no time limit)")
    check_record_arguments(args)
    alternatives_whatif.check_arguments(args, objective_of(args))
    if args.in_force and (args.fill_shift or not is_shop_document(args.grid)):
        raise CliError(f"{args.grid}: --in-force needs a shop document (.dshop) and one "
                       "dispatch round (not --fill-shift)")
    if args.fill_shift:
        return run_fill_shift(args)
    if is_shop_document(args.grid):
        shop = read_shop_arg(args.grid)
        shop_plan = solve_shop_arg(shop, args.grid, objective_of(args), args.must_run)
        problem = shop_plan.problem
        if shop_plan.staffing is not None:
            added = alternatives_whatif.staffed_added_keys(shop_plan, args, shop.machine_names())
        else:
            added = alternatives_whatif.added_keys(
                shop_plan.result, args, [problem.job_name(n) for n in range(len(problem.rows))],
                [problem.machine_name(c) for c in range(len(problem.columns))],
                shop.machine_names())
        if added and args.json:
            print_json({**shop_plan.to_json(), **added})
        else:
            print_shop_plan(shop_plan, shop, args.json)
            if added:
                alternatives_whatif.print_text(added, shop_plan.to_json()["assignments"])
        if args.in_force:
            check_writable(args.grid)
        record_decision(args, shop_to_dict(shop), shop_plan.to_json())
        if args.in_force:
            save_in_force(shop, shop_plan.in_force(shop), args.grid)
        return 0
    table = read_grid(args.grid)
    must = parse_names(args.must_run, table.jobs, "job", args.grid)
    try:
        result = solve(table.values, table.allowed, objective=objective_of(args), must_run=must)
    except DispatchInputError as exc:  # the engine knows no file: name it
        raise DispatchInputError(exc.message, source=args.grid) from None
    except InfeasibleError as exc:  # the engine knows indices: name the jobs and machines
        raise Infeasible(infeasible_message(exc, table.jobs, table.machines),
                         [table.jobs[j] for j in exc.witness.jobs],
                         [table.machines[m] for m in exc.witness.machines],
                         source=args.grid) from None
    data = plan_json(result, table.jobs, table.machines)
    added = alternatives_whatif.added_keys(result, args, table.jobs, table.machines)
    if args.json:
        print_json({**data, **added})
    else:
        print_plan(data)
        if added:
            alternatives_whatif.print_text(added, data["assignments"])
    if args.record:  # the grid as a shop document, so every decision keeps one format
        snapshot = shop_from_grid(table.jobs, table.machines, table.values, table.allowed,
                                  name=Path(args.grid).stem)
        record_decision(args, shop_to_dict(snapshot), data)
    return 0
