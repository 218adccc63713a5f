"""``dispatcher history``: list, show, compare, restore and export recorded decisions.

Also holds what ``dispatcher solve --record`` needs (:func:`add_record_arguments`,
:func:`record_decision`) so the solve command only wires them in.

History problems (missing, damaged, read-only, busy or full file, a server that cannot be
reached) exit with code 4; an unknown decision number or reason kind is bad input (exit 2);
a decision based on a plan another station has replaced since is refused with exit code 5.
"""

from __future__ import annotations

import argparse
import sys
from datetime import date
from pathlib import Path
from typing import Any

from dispatcher.commands.common import (
    EXIT_BAD_INPUT,
    CliError,
    print_json,
    print_plan,
)
from dispatcher.history import (
    HISTORY_ENV,
    REASON_KINDS,
    UNCHECKED,
    DecisionSummary,
    HistoryError,
    HistoryInputError,
    open_history,
    parse_reason_kind,
    reason_label,
)

_HISTORY_HELP = (f"history file, or a PostgreSQL server as postgresql://... or service=NAME "
                 f"(default: ${HISTORY_ENV}, else the per-user data folder, "
                 "e.g. ~/.local/share/dispatcher/history.sqlite)")


def open_store(location):
    """The history store named by ``--history`` (exit 4 if its driver is missing)."""
    return open_history(location)


# ---------------------------------------------------------------- solve --record

def add_record_arguments(parser: argparse.ArgumentParser) -> None:
    """The ``--record --by --reason --note --history`` options of ``dispatcher solve``."""
    group = parser.add_argument_group("recording the decision")
    group.add_argument("--record", action="store_true",
                       help="record the plan as a decision in the history")
    group.add_argument("--by", metavar="NAME", help="supervisor making the decision")
    group.add_argument("--reason", metavar="KIND",
                       help="why: " + ", ".join(REASON_KINDS))
    group.add_argument("--note", metavar="TEXT", default="", help="free text about the reason")
    group.add_argument("--history", metavar="PATH", help=_HISTORY_HELP)
    group.add_argument("--based-on", metavar="N", type=_based_on, default=argparse.SUPPRESS,
                       help="the decision the plan in force came from ('none' if none yet): "
                            "refuse (exit 5) if another decision for this shop was recorded "
                            "since")


def _based_on(text: str) -> int | None:
    if text.strip().lower() == "none":
        return None
    return _whole(text, minimum=1)


def _whole(text: str, minimum: int = 0) -> int:
    try:
        value = int(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"expected a whole number, got {text!r}") from None
    if value < minimum:
        raise argparse.ArgumentTypeError(f"expected a whole number >= {minimum}, got {text}")
    return value


def check_record_arguments(args: argparse.Namespace) -> None:
    """Before solving: ``--record`` needs ``--by`` and a known ``--reason`` (exit 2 if not)."""
    if not getattr(args, "record", False):
        if getattr(args, "by", None) or getattr(args, "reason", None):
            raise CliError("--by and --reason are used with --record")
        return
    if not (args.by or "").strip():
        raise CliError("--record needs --by NAME (the supervisor making the decision)")
    if not args.reason:
        raise CliError("--record needs --reason KIND, one of: " + ", ".join(REASON_KINDS))
    parse_reason_kind(args.reason)


def record_decision(args: argparse.Namespace, shop_document: Any, plan: Any) -> int | None:
    """Record ``plan`` for ``shop_document`` if ``--record`` was given; prints the number.

    The message goes to stderr so that ``--json`` output stays one JSON object.
    """
    if not getattr(args, "record", False):
        return None
    store = open_store(args.history)
    based_on = getattr(args, "based_on", UNCHECKED)
    number = store.record(shop_document, plan, by=args.by,
                          reason=args.reason, note=args.note,
                          based_on=based_on)
    print(f"Recorded decision #{number} in {store.location}", file=sys.stderr)
    return number


# ---------------------------------------------------------------- history sub-commands

def register(sub: argparse._SubParsersAction) -> None:
    p = sub.add_parser("history", help="list, show, compare, restore and export decisions",
                       description="The record of confirmed dispatch decisions.")
    cmds = p.add_subparsers(dest="history_command", metavar="ACTION")
    common = argparse.ArgumentParser(add_help=False)
    common.add_argument("--history", metavar="PATH", help=_HISTORY_HELP)
    filters = argparse.ArgumentParser(add_help=False)
    filters.add_argument("--from", dest="date_from", metavar="DATE", type=_date,
                         help="first shift date (YYYY-MM-DD)")
    filters.add_argument("--to", dest="date_to", metavar="DATE", type=_date,
                         help="last shift date (YYYY-MM-DD)")
    filters.add_argument("--shift", metavar="LABEL", help="shift label, e.g. night")
    filters.add_argument("--machine", metavar="NAME", help="decisions whose plan names it")
    filters.add_argument("--job", metavar="NAME", help="decisions whose plan names it")
    filters.add_argument("--by", metavar="NAME", help="supervisor")
    filters.add_argument("--reason", metavar="KIND", help=", ".join(REASON_KINDS))

    q = cmds.add_parser("list", parents=[common, filters], help="list decisions")
    q.add_argument("--json", action="store_true", help="print a JSON list")
    q.add_argument("--limit", type=lambda t: _whole(t, 1), metavar="N",
                   help="only the newest N (N >= 1)")
    q.set_defaults(func=run_list)

    q = cmds.add_parser("show", parents=[common], help="show one decision")
    q.add_argument("number", type=int, metavar="N")
    q.add_argument("--json", action="store_true", help="print one JSON object")
    q.set_defaults(func=run_show)

    q = cmds.add_parser("diff", parents=[common], help="what changed from decision A to B")
    q.add_argument("a", type=int, metavar="A")
    q.add_argument("b", type=int, metavar="B")
    q.add_argument("--json", action="store_true", help="print one JSON object")
    q.set_defaults(func=run_diff)

    q = cmds.add_parser("export", parents=[common, filters],
                        help="write decisions to a CSV file (one line per placement)")
    q.add_argument("target", metavar="FILE.csv")
    q.add_argument("--no-operators", action="store_true",
                   help="leave the operator column out (operator labels are personal data "
                        "at some sites)")
    q.set_defaults(func=run_export)

    q = cmds.add_parser("init", help="create an empty history (and its folder) explicitly")
    q.add_argument("location", metavar="PATH",
                   help="history file to create, or postgresql://... / service=NAME")
    q.set_defaults(func=run_init)

    q = cmds.add_parser("copy", help="copy every decision from one history to another "
                                     "(SQLite or PostgreSQL), verifying counts and checksums")
    q.add_argument("--from", dest="source", metavar="A", required=True)
    q.add_argument("--to", dest="target", metavar="B", required=True)
    q.add_argument("--append", action="store_true",
                   help="add to a target that already holds decisions (numbers must follow)")
    q.set_defaults(func=run_copy)

    q = cmds.add_parser("restore", parents=[common],
                        help="record an earlier plan again as a new decision")
    q.add_argument("number", type=int, metavar="N")
    q.add_argument("--by", metavar="NAME", required=True, help="supervisor restoring it")
    q.add_argument("--note", metavar="TEXT", default="")
    q.add_argument("--in-force", metavar="SHOP", default=None,
                   help="also save the restored shop, with the restored plan in force, into "
                   "this shop document (checked writable before anything is recorded)")
    q.set_defaults(func=run_restore)

    p.set_defaults(func=lambda args: _usage(p))


def _usage(parser: argparse.ArgumentParser) -> int:
    parser.print_help()
    return EXIT_BAD_INPUT


def _date(text: str) -> date:
    try:
        return date.fromisoformat(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"expected a date YYYY-MM-DD, got {text!r}") from None


def _filters(args: argparse.Namespace) -> dict[str, Any]:
    keys = ("date_from", "date_to", "shift", "machine", "job", "by", "reason")
    return {k: getattr(args, k) for k in keys if getattr(args, k, None) is not None}


def _total(x: float | int | None) -> str:
    return "-" if x is None else f"{x:g}"


def _must_exist(store) -> None:
    if not store.exists():
        raise HistoryError(f"{store.location}: the history does not exist (no file there); "
                           "nothing was created. Check --history PATH or "
                           f"${HISTORY_ENV}, or create it with: dispatcher history init PATH")


def run_list(args: argparse.Namespace) -> int:
    store = open_store(args.history)
    _must_exist(store)
    found = store.list(**_filters(args), limit=args.limit,
                       newest_first=args.limit is not None)
    if args.limit is not None:
        found.reverse()
    if args.json:
        print_json([d.to_json() for d in found])
        return 0
    if not found:
        print(f"No decisions{' match' if _filters(args) else ' recorded yet'} ({store.location})")
        return 0
    _print_table(found)
    return 0


def _print_table(found: list[DecisionSummary]) -> None:
    head = ("#", "Time (UTC)", "Shift", "By", "Reason", "Total", "Replaces", "Note")
    rows = [(str(d.id), d.time.strftime("%Y-%m-%d %H:%M"),
             f"{d.shift_date.isoformat()} {d.shift}", d.by, reason_label(d.reason),
             _total(d.total), "" if d.replaces is None else f"#{d.replaces}", d.note)
            for d in found]
    widths = [max(len(r[i]) for r in rows + [head]) for i in range(len(head))]
    print("  ".join(h.ljust(w) for h, w in zip(head, widths)).rstrip())
    print("  ".join("-" * w for w in widths))
    for r in rows:
        print("  ".join(c.ljust(w) for c, w in zip(r, widths)).rstrip())


def run_show(args: argparse.Namespace) -> int:
    store = open_store(args.history)
    d = store.get(args.number)
    if args.json:
        print_json(d.to_json())
        return 0
    print(f"Decision #{d.id}  {d.time.strftime('%Y-%m-%d %H:%M:%S')} UTC  "
          f"(shift {d.shift_date.isoformat()} {d.shift})")
    print(f"By: {d.by}")
    print(f"Reason: {reason_label(d.reason)}" + (f" - {d.note}" if d.note else ""))
    if d.shop:
        print(f"Shop: {d.shop}")
    if d.station:
        print(f"Station: {d.station}")
    print(f"Certificate: {d.certificate}")
    print()
    print_plan(d.plan)
    _print_shop_states(d.shop_document)
    print()
    if d.replaces is None:
        print("Replaces: none (first decision for this shop)")
    else:
        print(f"Changes from #{d.replaces}:")
        for line in (d.diff_from_replaced.lines() if d.diff_from_replaced else []):
            print(f"  {line}")
    return 0


def _print_shop_states(doc) -> None:
    """Machines not up (with their note and time) and jobs running, from the snapshot."""
    if not isinstance(doc, dict):
        return
    machines = {m.get("id"): m for m in doc.get("machines", []) if isinstance(m, dict)}
    down = [m for m in machines.values() if m.get("state", "up") != "up"]
    if down:
        print("Machines not available: " + "; ".join(
            f"{m.get('name')} ({m.get('state')}" + (f" since {m['state_changed']}"
                                                    if m.get("state_changed") else "")
            + (f": {m['state_note']}" if m.get("state_note") else "") + ")" for m in down))
    running = [j for j in doc.get("jobs", []) if isinstance(j, dict) and j.get("state") == "running"]
    if running:
        print("Running: " + ", ".join(
            f"{j.get('name')} on {machines.get(j.get('machine'), {}).get('name', j.get('machine'))}"
            for j in running))


def run_diff(args: argparse.Namespace) -> int:
    store = open_store(args.history)
    diff = store.diff(args.a, args.b)
    if args.json:
        print_json(diff.to_json())
        return 0
    print(f"From #{args.a} to #{args.b}:")
    for line in diff.lines():
        print(f"  {line}")
    return 0


def run_export(args: argparse.Namespace) -> int:
    target = Path(args.target)
    if target.suffix.lower() != ".csv":
        raise CliError(f"{target}: the export is CSV text, so the file name must end in .csv "
                       f"(got {target.suffix or 'no extension'!r})")
    if not target.parent.is_dir():
        raise CliError(f"{target}: the folder {target.parent} does not exist; nothing was "
                       "written")
    if target.is_dir():
        raise CliError(f"{target}: is a folder; name the CSV file to write")
    store = open_store(args.history)
    if not store.exists():
        raise HistoryError(f"{store.location}: the history does not exist; nothing to export")
    count = store.export_csv(args.target, operators=not args.no_operators, **_filters(args))
    print(f"Wrote {count} rows to {args.target}")
    return 0


def run_restore(args: argparse.Namespace) -> int:
    store = open_store(args.history)
    target = None
    if args.in_force:
        from dispatcher.commands.restore_in_force import restored_shop

        target = restored_shop(store, args.number, args.in_force)
    number = store.restore(args.number, by=args.by, note=args.note)
    print(f"Recorded decision #{number}: restored from #{args.number}")
    if target is not None:
        from dispatcher.commands.shop_input import save_in_force

        save_in_force(target, target.plan_in_force, args.in_force)
    return 0


def run_init(args: argparse.Namespace) -> int:
    store = open_store(args.location)
    made = store.init()
    print(f"{'Created an empty history' if made else 'A history already exists'} at "
          f"{store.location}")
    return 0


def run_copy(args: argparse.Namespace) -> int:
    source, target = open_store(args.source), open_store(args.target)
    _must_exist(source)
    count = copy_history(source, target, append=args.append)
    print(f"Copied {count} decisions from {source.location} to {target.location} "
          "(counts and checksums verified)")
    return 0


def copy_history(source, target, append: bool = False) -> int:
    """Copy every decision of ``source`` into ``target``, keeping numbers and seals.

    Refuses a target that already holds decisions unless ``append``; afterwards reads the
    target back and checks that it holds the copied decisions with the same seals.
    """
    items = source.all_sealed()
    if target.exists():
        held = target.count()
        if held and not append:
            raise HistoryInputError(f"{target.location}: already holds {held} decisions; "
                                    "nothing was copied (use --append to add after them)")
    else:
        target.init(make_folder=False)
    copied = target.append_sealed(items)
    wanted = {int(v["id"]): v["seal"] for v, _ in items}
    back = {int(v["id"]): v["seal"] for v, _ in target.all_sealed() if int(v["id"]) in wanted}
    if back != wanted:
        raise HistoryError(f"{target.location}: the copy does not read back as written "
                           f"({len(back)} of {len(wanted)} decisions match)")
    return copied
