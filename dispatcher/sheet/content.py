"""What a printed dispatch sheet says, as plain data (no Qt, no shop objects).

The sheet is built once from a shop, a plan and optionally a recorded decision
(:mod:`dispatcher.sheet.build`), and then rendered by :mod:`dispatcher.sheet.render` to
a printer, a print preview or a PDF file. Keeping the content separate from the layout
lets tests check what the sheet says without reading a PDF, and lets the layout change
without touching the shop model.

Every field is text, a number, a date/time or ``None``; nothing here is executed or
looked up later.
"""

from __future__ import annotations

import datetime as dt
import math
from dataclasses import dataclass, field

from dispatcher.shop.model import DOWN, MAINTENANCE, UP

def QT_TRANSLATE_NOOP(context: str, text: str) -> str:
    """Mark ``text`` for translation in ``context`` without translating it here.

    Qt's ``pyside6-lupdate`` collects every call of this name into the translation
    sources; the renderer (:mod:`dispatcher.sheet.render`) translates the English text
    when it paints, so the content stays Qt-free and the command line stays English.
    """
    return text


#: The cautions printed at the foot of every page. Wording is ours; the points are the
#: ones every sheet must carry (see the Safety section of the README).
SAFETY_CAUTIONS: tuple[str, ...] = (
    QT_TRANSLATE_NOOP("Sheet", "Apply lockout/tagout before any work on a machine that is down."),
    QT_TRANSLATE_NOOP("Sheet", "Only operators trained and authorised for a machine may run it, "
                      "whatever this sheet says."),
    QT_TRANSLATE_NOOP("Sheet", "Follow the machine's own setup instructions for every changeover."),
    QT_TRANSLATE_NOOP("Sheet", "Site safety rules and local regulations take precedence over "
                      "this sheet."),
)

#: Machine states as printed. Words, never colour, carry the meaning.
STATE_WORDS = {
    UP: QT_TRANSLATE_NOOP("Sheet", "Up"),
    DOWN: QT_TRANSLATE_NOOP("Sheet", "DOWN"),
    MAINTENANCE: QT_TRANSLATE_NOOP("Sheet", "MAINTENANCE"),
}
#: The same in the narrow State column of the machine table (translated by the renderer's
#: ``Sheet.state_short``, which may abbreviate differently in each language).
STATE_SHORT = {
    UP: "Up",
    DOWN: "DOWN",
    MAINTENANCE: "MAINT.",
}


@dataclass(frozen=True)
class SheetJob:
    """One job on a machine's list, in run order.

    ``setup`` is the grid value of the (job, machine) pair in ``unit`` (``None`` when the
    value is not known, for example a job that was already running before the plan).
    ``continuing`` marks a job already running on the machine that simply carries on.
    ``hours`` is the planned run time in fill-shift mode, ``None`` otherwise. ``pinned``
    marks a job a "must go to" pin holds on this machine, ``pin_note`` is that pin's note.
    In a shop with setup families ``change`` says which changeover comes before the job and
    ``planned`` its planned start and end times.
    """

    name: str
    work_order: str = ""
    setup: float | None = None
    unit: str = ""
    notes: str = ""
    rush: bool = False
    continuing: bool = False
    running_since: dt.datetime | None = None
    hours: float | None = None
    pinned: bool = False
    pin_note: str = ""
    change: str = ""          # shops with families: "change from family A to B: 25 min"
    planned: str = ""         # planned start and end ("06:25-08:10"), whole-shift plans

    def all_notes(self) -> str:
        """The pin (if any) and the job's own notes, as the text sheet prints them."""
        pin = ("pinned here" + (f" ({self.pin_note})" if self.pin_note else "")
               if self.pinned else "")
        return "; ".join(t for t in (pin, self.notes) if t)


@dataclass(frozen=True)
class SheetMachine:
    """One machine and the jobs it is to run this round, in order (empty: idle or down)."""

    name: str
    state: str = UP
    jobs: tuple[SheetJob, ...] = ()
    notes: str = ""
    operator: str = ""   # who minds it this round (shops with a crew); "" otherwise
    slots: int = 1

    def all_notes(self) -> str:
        """Slots (when more than one) and the machine's notes, as the text sheet prints them."""
        slots = f"{self.slots} slots" if self.slots > 1 else ""
        return "; ".join(t for t in (slots, self.notes) if t)

    @property
    def is_down(self) -> bool:
        return self.state != UP


@dataclass(frozen=True)
class SheetWaitingJob:
    """A job that is not dispatched this round and the plain reason why.

    ``competing`` (the jobs of its wait group), ``machines`` (the only machines they can
    use) and ``must_wait`` (how many of them wait whatever the plan) let a translated
    sheet say ``why`` in its own language; they are empty when the job has no machine
    at all.
    """

    name: str
    work_order: str = ""
    why: str = ""
    rush: bool = False
    competing: tuple[str, ...] = ()
    machines: tuple[str, ...] = ()
    must_wait: int = 0


@dataclass(frozen=True)
class SheetDownMachine:
    """A machine that takes no work, with its state, note and the time the state changed."""

    name: str
    state: str = "down"
    note: str = ""
    since: dt.datetime | None = None


@dataclass(frozen=True)
class SheetTotals:
    """Counts and the plan's total, as printed under the tables.

    ``jobs_dispatched`` counts jobs newly given to a machine; ``jobs_continuing`` those
    already running that carry on. ``objective`` is a short phrase such as "least total
    setup"; ``status`` says whether the plan is proven best or the best found with its gap.
    """

    machines: int = 0
    machines_down: int = 0
    machines_idle: int = 0
    jobs_dispatched: int = 0
    jobs_continuing: int = 0
    jobs_waiting: int = 0
    total: float | None = None
    planned: float | None = None   # the grid values of the jobs dispatched (setups, costs)
    unit: str = ""
    objective: str = ""
    status: str = ""


@dataclass(frozen=True)
class SheetContent:
    """Everything one dispatch sheet prints.

    ``decision_number`` and ``decision_time`` are ``None`` when the plan has not been
    recorded in the history; the sheet then says "not recorded" so nobody mistakes a
    draft for a confirmed decision. ``printed_at`` is when the sheet was made.
    ``value_heading`` names the value column ("Setup", "Cost", "Value"); ``shop_note`` is
    the shop's own description, printed small at the end.
    """

    shop_name: str
    shift_date: dt.date | None = None
    shift_label: str = ""
    supervisor: str = ""
    decision_number: int | None = None
    decision_time: dt.datetime | None = None
    printed_at: dt.datetime = field(default_factory=lambda: dt.datetime.now().astimezone())
    machines: tuple[SheetMachine, ...] = ()
    waiting: tuple[SheetWaitingJob, ...] = ()
    down: tuple[SheetDownMachine, ...] = ()
    totals: SheetTotals = field(default_factory=SheetTotals)
    safety: tuple[str, ...] = SAFETY_CAUTIONS
    value_heading: str = "Setup"
    shop_note: str = ""
    in_force: bool = False   # the shop's plan in force (else a draft when not recorded)
    maximize: bool = False
    staffed: bool = False    # the shop has a crew: print the operator of each machine
    crew_notes: tuple[str, ...] = ()   # shortages, cautions, expiring authorisations

    def decision_line(self) -> str:
        """``Decision #12 of ... (plan in force)`` / ``Plan in force (...)`` / draft."""
        if self.decision_number is not None:
            when = format_time(self.decision_time)
            return (f"Decision #{self.decision_number}" + (f" of {when}" if when else "")
                    + (" (plan in force)" if self.in_force else ""))
        if self.in_force:
            return "Plan in force (its decision is not in the history read)"
        return "Decision: not recorded (draft plan)"

    def total_line(self) -> str:
        """``Total (least total setup): 418 min = setups 208 + wait penalties 210``."""
        t = self.totals
        head = f"Total ({t.objective or 'plan'}): {format_value(t.total, t.unit) or '-'}"
        if t.total is not None and t.planned is not None:
            word = "values" if self.maximize else (
                "costs" if "cost" in (t.objective or "") else "setups")
            waits = (t.planned - t.total) if self.maximize else (t.total - t.planned)
            sign = "-" if self.maximize else "+"
            head += (f" = {word} {format_value(t.planned, t.unit)} {sign} wait penalties "
                     f"{format_value(round(waits, 9), t.unit)}")
        return head

    def dispatched_jobs(self) -> list[SheetJob]:
        """Every job on every machine, in sheet order."""
        return [job for m in self.machines for job in m.jobs]


def format_time(t: dt.datetime | None) -> str:
    """``YYYY-MM-DD HH:MM`` in local time (aware times are converted), or an empty string."""
    if t is None:
        return ""
    if t.tzinfo is not None:
        t = t.astimezone()
    return t.strftime("%Y-%m-%d %H:%M")


def format_value(value: float | None, unit: str = "") -> str:
    """A grid value with its unit: ``12 min``, ``7.5 EUR``; empty when unknown."""
    if value is None:
        return ""
    if not math.isfinite(value):
        text = str(value)
    elif value == int(value):
        text = f"{int(value):,}"
    else:
        text = f"{value:,.2f}".rstrip("0").rstrip(".")
    return f"{text} {unit}".strip()


def sheet_text(content: SheetContent) -> str:
    """The sheet as plain text for a terminal: same facts as the printed page, no boxes."""
    out = [f"Dispatch sheet - {content.shop_name}"]
    date = content.shift_date.isoformat() if content.shift_date else "-"
    out.append(f"Date {date}   Shift {content.shift_label or '-'}   "
               f"Supervisor {content.supervisor or '-'}")
    out.append(content.decision_line())
    out.append(f"Printed {format_time(content.printed_at)}")
    out.append("")
    out.append(f"Machines and jobs ({len(content.machines)} machines, "
               f"{len(content.dispatched_jobs())} jobs):")
    for m in content.machines:
        state = STATE_WORDS.get(m.state, m.state.upper())
        notes = m.all_notes()
        if not m.jobs:
            what = "no work: see Machines down" if m.is_down else "idle: no job this round"
            out.append(f"  {m.name} [{state}]: {what}" + (f" ({notes})" if notes else ""))
            continue
        out.append(f"  {m.name} [{state}]" + (f" ({notes})" if notes else "")
                   + (f"  operator: {m.operator}" if m.operator else ""))
        for k, job in enumerate(m.jobs, start=1):
            bits = [f"{k}. " + ("RUSH " if job.rush else "") + job.name]
            if job.work_order:
                bits.append(job.work_order)
            if job.continuing:
                bits.append("carries on" + (f", running since {format_time(job.running_since)}"
                                            if job.running_since else ""))
            value = format_value(job.setup, job.unit)
            if value:
                bits.append(f"{content.value_heading.lower()} {value}")
            if job.change:
                bits.append(job.change)
            if job.hours is not None:
                bits.append(f"run {format_value(job.hours, 'h')}")
            if job.planned:
                bits.append(f"planned {job.planned}")
            if job.all_notes():
                bits.append(job.all_notes())
            out.append("      " + "  |  ".join(bits))
    out.append("")
    out.append(f"Waiting jobs ({len(content.waiting)}):" if content.waiting else "Waiting jobs: none")
    first_with: dict[str, str] = {}
    for w in content.waiting:
        why = w.why if w.why not in first_with else f"same reason as {first_with[w.why]}"
        first_with.setdefault(w.why, w.name)
        out.append(f"  {'RUSH ' if w.rush else ''}{w.name}"
                   + (f" ({w.work_order})" if w.work_order else "") + (f": {why}" if why else ""))
    out.append(f"Machines down ({len(content.down)}):" if content.down else "Machines down: none")
    for d in content.down:
        since = format_time(d.since)
        out.append(f"  {d.name} [{STATE_WORDS.get(d.state, d.state.upper())}]"
                   + (f" since {since}" if since else "") + (f": {d.note}" if d.note else ""))
    if content.staffed:
        out.append("Crew:" if content.crew_notes else "Crew: every running machine is staffed")
        out.extend(f"  {line}" for line in content.crew_notes)
    t = content.totals
    out.append("")
    out.append(content.total_line() + (f"   [{t.status}]" if t.status else ""))
    out.append("")
    out.append("SAFETY:")
    out.extend(f"  {k}. {text}" for k, text in enumerate(content.safety, start=1))
    return "\n".join(out)
