"""``dispatcher redispatch``: a new plan after a breakdown or another event, and what changed.

The plan in force comes from the shop document's ``plan_in_force`` (machine id -> job
ids, written when a decision is recorded) or from ``--plan PLANFILE``, a plan in the
``dispatcher solve --json`` format. The new plan is printed in the solve contract, plus
``changes`` (every job whose machine differs from the plan in force) and ``difference``.
"""

from __future__ import annotations

import argparse
import datetime as dt
import json
from pathlib import Path

from dispatcher.commands.common import CliError, parts_word, print_json
from dispatcher.commands.history import (
    add_record_arguments,
    check_record_arguments,
    record_decision,
)
from dispatcher.commands.shop_input import (
    add_in_force_argument,
    check_writable,
    job_name,
    print_shop_plan,
    read_shop_arg,
    save_in_force,
)
from dispatcher.io.shopfile import shop_to_dict
from dispatcher.shop import Plan
from dispatcher.shop.redispatch import (
    EVENT_DONE,
    EVENT_DOWN,
    EVENT_PULLED,
    EVENT_RUSH,
    EVENT_UP,
    ShopEvent,
    ShopRedispatch,
    redispatch_shop,
)

#: Largest plan file read with --plan (a plan of a very large shop is well under this).
MAX_PLAN_BYTES = 16 * 1024 * 1024


def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser(
        "redispatch", help="re-plan after a machine goes down (or another event)",
        description="Re-dispatch a shop document after an event, starting from the plan in "
                    "force, and print the new plan and what changed. Jobs running on working "
                    "machines stay; a job running on a machine that goes down waits for a "
                    "new machine.")
    p.add_argument("shop", metavar="SHOP", help="shop document (.dshop)")
    p.set_defaults(events=[])
    p.add_argument("--down", metavar="MACHINE", action=_EventAction, dest="down", event=EVENT_DOWN,
                   help="machine that went down (repeatable; events apply in the order given)")
    p.add_argument("--up", metavar="MACHINE", action=_EventAction, dest="up", event=EVENT_UP,
                   help="machine that is back up (repeatable)")
    p.add_argument("--rush", metavar="JOB", action=_EventAction, dest="rush", event=EVENT_RUSH,
                   help="waiting job that arrived as a rush job: placed first (repeatable; "
                   "a job may be given by name or work order)")
    p.add_argument("--done", metavar="JOB", action=_EventAction, dest="done", event=EVENT_DONE,
                   help="job that finished (repeatable)")
    p.add_argument("--pull", metavar="JOB", action=_EventAction, dest="pull", event=EVENT_PULLED,
                   help="job pulled from this round (repeatable)")
    p.add_argument("--operator-out", metavar="LABEL", action=_EventAction, dest="operator_out",
                   event="operator_out",
                   help="operator who left (sick, called away): machines they ran get another "
                        "qualified operator present, or their jobs wait (shops with a crew; "
                        "repeatable)")
    p.add_argument("--operator-in", metavar="LABEL", action=_EventAction, dest="operator_in",
                   event="operator_in",
                   help="operator who arrived: plan to use them (shops with a crew; repeatable)")
    p.add_argument("--move-penalty", metavar="X", type=float, default=None,
                   help="cost of moving a dispatched job that has not started "
                        "(default: the shop's; a job's own value wins)")
    p.add_argument("--plan", metavar="PLANFILE", default=None,
                   help="plan in force as 'dispatcher solve --json' output "
                        "(default: the shop document's plan_in_force)")
    p.add_argument("--maximize", action="store_true", help="values are gains: maximise the total")
    p.add_argument("--json", action="store_true", help="print one JSON object")
    add_in_force_argument(p)
    add_record_arguments(p)
    p.set_defaults(func=run)


class _EventAction(argparse.Action):
    """Collect events in the order they are given on the command line (``args.events``)."""

    def __init__(self, option_strings, dest, event: str, **kwargs):
        self.event = event
        super().__init__(option_strings, dest, default=[], **kwargs)

    def __call__(self, parser, namespace, values, option_string=None):
        getattr(namespace, self.dest).append(values)
        namespace.events = [*namespace.events, (self.event, values)]


def _events(args: argparse.Namespace, shop) -> list[ShopEvent]:
    """The events in command-line order; jobs by name or work order; a machine going down
    keeps the decision note (``--note``) and the time as its down note and time."""
    now = dt.datetime.now().replace(microsecond=0)
    note = getattr(args, "note", None) or ""
    out = []
    for kind, name in args.events:
        if kind in (EVENT_RUSH, EVENT_DONE, EVENT_PULLED):
            name = job_name(shop, name, args.shop)
        out.append(ShopEvent(kind, name, note if kind == EVENT_DOWN else "", now))
    return out


def _plan_in_force(args: argparse.Namespace, shop) -> dict[str, list[str]]:
    if args.plan is None:
        if not shop.plan_in_force:
            raise CliError(f"{args.shop}: the document holds no plan in force (field "
                           "'plan_in_force' is empty); record a decision first or pass "
                           "--plan PLANFILE (the output of 'dispatcher solve SHOP --json')")
        return shop.plan_in_force
    path = Path(args.plan)
    try:
        if path.stat().st_size > MAX_PLAN_BYTES:
            raise CliError(f"{args.plan}: plan file larger than {MAX_PLAN_BYTES} bytes")
        data = json.loads(path.read_text(encoding="utf-8"))
    except OSError as exc:
        raise CliError(f"{args.plan}: cannot read the plan file: {exc.strerror or exc}") from None
    except UnicodeDecodeError:
        raise CliError(f"{args.plan}: the plan file is not UTF-8 text") from None
    except json.JSONDecodeError as exc:
        raise CliError(f"{args.plan}: line {exc.lineno}, column {exc.colno}: not valid JSON: "
                       f"{exc.msg}") from None
    plan = Plan.from_json(data, source=args.plan)
    try:
        return plan.in_force(shop)
    except KeyError as exc:
        raise CliError(f"{args.plan}: {exc.args[0]} in {args.shop}") from None


def run(args: argparse.Namespace) -> int:
    if not args.events:
        raise CliError("redispatch needs an event: --down MACHINE (or --up, --rush, --done, "
                       "--pull, --operator-out, --operator-in)")
    check_record_arguments(args)
    shop = read_shop_arg(args.shop)
    events = _events(args, shop)
    in_force = _plan_in_force(args, shop)
    outcome = redispatch_shop(shop, events, plan_in_force=in_force,
                              move_penalty=args.move_penalty,
                              objective="maximize" if args.maximize else "total",
                              source=args.shop)
    if args.json:
        print_json(outcome.to_json())
    else:
        print_outcome(outcome, args)
    if args.in_force:
        check_writable(args.shop)
    record_decision(args, shop_to_dict(outcome.shop), outcome.to_json())
    if args.in_force:
        save_in_force(outcome.shop, outcome.plan.in_force(outcome.shop), args.shop)
    return 0


def print_outcome(outcome: ShopRedispatch, args: argparse.Namespace) -> None:
    """The new plan as 'solve' prints it, then the changes against the plan in force."""
    print_shop_plan(outcome.plan, outcome.shop, False)
    print()
    if outcome.changes:
        print(f"Changes against the plan in force ({len(outcome.changes)}):")
        width = max(len(c.job) for c in outcome.changes)
        for c in outcome.changes:
            after = c.left or c.after or "waiting"
            print(f"  {c.job.ljust(width)}  {c.before or 'waiting'} -> {after}")
    else:
        print("Changes against the plan in force: none")
    if outcome.machines_now_idle:
        print("Machines now idle: " + ", ".join(outcome.machines_now_idle))
    word = parts_word(outcome.plan.objective, outcome.shop.unit.label())
    planned, waits = outcome.in_force_parts
    sign = "-" if outcome.plan.objective == "maximize" else "+"
    print(f"Total in force (on the shop after the event): {outcome.total_in_force:g} "
          f"({word} {planned:g} {sign} wait penalties {waits:g})")
    parts = outcome.change_parts()
    print(f"Change in total: {outcome.total_change:+g} ({word} {parts['planned']:+g}, wait "
          f"penalties {parts['wait_penalties']:+g})"
          + (f"; move penalties paid apart: {outcome.move_penalties_paid:g}"
             if outcome.move_penalties_paid else ""))
    if any(kind == "operator_out" for kind, _ in args.events):
        print("Caution: a machine the operator ran is stopped only by the site's procedure, "
              "never by this plan; operators run only machines they are trained and authorised for.")
    named = {ev[1] for ev in args.events if ev[0] in (EVENT_DOWN, EVENT_UP)}
    for name in outcome.machines_down:
        if name in named:
            print(f"Caution: {name} is down. Apply lockout/tagout and the site's isolation "
                  "procedure before any work on it.")
