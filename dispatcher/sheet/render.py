"""Lay out a :class:`~dispatcher.sheet.content.SheetContent` on paper with Qt's own printing.

One function, :func:`print_sheet`, paints the sheet onto any paged paint device: a
``QPrinter`` (a real printer, or the one a print preview hands out) or a ``QPdfWriter``
(:func:`write_pdf`). Print preview, printer and PDF therefore share one layout.

How a page is made:

* the body (machine table, waiting jobs, machines down, totals, sign-off) is one
  ``QTextDocument`` laid out once in device-independent layout pixels, with a page
  height equal to the space between the page header and the safety footer, and painted
  through a scaled painter (as ``QTextDocument.print`` does), so every device gets the
  same page breaks. Qt paginates it and repeats each table's
  header rows (``QTextTableFormat.setHeaderRowCount``) at the top of every page the table
  continues on;
* the page header (shop, date, shift, supervisor, decision, printed time, "Page X of Y")
  and the safety footer are painted by us on every page, so they appear on every page
  whatever the body contains.

Nothing relies on colour: states are words ("DOWN"), rush jobs say "RUSH", shading is a
light grey behind text that already says what it means.

Every word the sheet prints goes through Qt's translation (context ``Sheet``), so the
app's sheet prints in the app's language once its translator is installed; without one
(the command line) it prints English. ``text_locale`` chooses how numbers, dates and
times are written (the app passes its locale); ``None`` keeps the command line's fixed
formats (``1,234.5``, ``2026-03-14 06:00``).

This module imports QtGui only (no widgets). A Qt application must exist before
painting; :func:`ensure_gui_application` returns the running one (the app's
``QApplication``) or makes a ``QGuiApplication`` (offscreen when there is no display).
"""

from __future__ import annotations

import datetime as dt
import html
import math
import os
import sys
from dataclasses import dataclass
from pathlib import Path

from PySide6.QtCore import (
    QCoreApplication,
    QDate,
    QDateTime,
    QLineF,
    QLocale,
    QMarginsF,
    QRectF,
    QSizeF,
    Qt,
    QTime,
)
from PySide6.QtGui import (
    QFont,
    QGuiApplication,
    QPagedPaintDevice,
    QPageLayout,
    QPageSize,
    QPainter,
    QPdfWriter,
    QPen,
    QTextDocument,
)

from dispatcher.atomic import atomic_write
from dispatcher.errors import BadInputError
from dispatcher.sheet.build import NO_MACHINE
from dispatcher.translation import ensure_plurals

from .content import (
    STATE_WORDS,
    SheetContent,
    SheetJob,
    SheetMachine,
    format_time,
    format_value,
)

__all__ = [
    "PAPER_SIZES",
    "SheetRenderError",
    "ensure_gui_application",
    "page_size_for",
    "paper_for_locale",
    "print_sheet",
    "sheet_body_html",
    "sheet_title",
    "write_pdf",
]

#: Paper names accepted by ``--paper`` and :func:`write_pdf`.
PAPER_SIZES = {"a4": QPageSize.PageSizeId.A4, "letter": QPageSize.PageSizeId.Letter}

#: Territories where US Letter is the usual office paper (common practice: the Americas
#: that follow the US paper series, and the Philippines); everywhere else uses ISO A4.
LETTER_TERRITORIES = frozenset({
    QLocale.Country.UnitedStates, QLocale.Country.Canada, QLocale.Country.Mexico,
    QLocale.Country.PuertoRico, QLocale.Country.Chile, QLocale.Country.Colombia,
    QLocale.Country.Venezuela, QLocale.Country.CostaRica, QLocale.Country.Guatemala,
    QLocale.Country.Panama, QLocale.Country.DominicanRepublic, QLocale.Country.Philippines,
})

#: Page margins in millimetres (inside most printers' unprintable border).
MARGIN_MM = 12.0
BODY_PT = 9.0          # body text size
SMALL_PT = 8.0         # footer text size
GAP_PT = 6.0           # space between the header/footer bands and the body
HEADING_SHADE = "#d9d9d9"   # column headings: light grey on any printer
TITLE_SHADE = "#bfbfbf"     # table titles: a step darker
#: Rules and padding of the body tables, in Qt text-layout pixels (see _layout_px_per_pt);
#: ``{rule}`` and ``{tall}`` are filled in for the device.
BODY_STYLE = ("td, th {{ border: {rule}px solid black; }} "
              "td.w {{ padding-top: {tall}px; padding-bottom: {tall}px; }}")
DOWN_SHADE = "#eeeeee"


translate = QCoreApplication.translate


class Sheet:
    """The sheet's words with plural forms (translation context ``Sheet``).

    ``pyside6-lupdate`` reads plural forms from ``self.tr(text, "", n)`` calls, so the
    phrases that count something live here; the rest call ``translate("Sheet", ...)``.
    """

    def tr(self, text: str, disambiguation: str = "", n: int = -1) -> str:
        return QCoreApplication.translate("Sheet", text, disambiguation, n)

    def state_short(self, state: str) -> str:
        """A machine state in the machine table's narrow State column."""
        words = {"up": self.tr("Up", "state column"), "down": self.tr("DOWN", "state column"),
                 "maintenance": self.tr("MAINT.", "state column")}
        return words.get(state, state.upper())

    def machines_and_jobs(self, machines: int, jobs: int) -> str:
        title = translate("Sheet", "Machines and jobs ({machines}, {jobs})")
        return title.format(machines=self.tr("%n machine(s)", "", machines),
                            jobs=self.tr("%n job(s)", "", jobs))

    def waiting_title(self, count: int) -> str:
        return self.tr("Waiting jobs (%n)", "", count)

    def down_title(self, count: int) -> str:
        return self.tr("Machines down (%n) - lockout/tagout before any work", "", count)

    def slots(self, count: int) -> str:
        return self.tr("%n slot(s)", "", count)

    def machines_line(self, machines: int, down: int, idle: int) -> str:
        text = translate("Sheet", "{machines} ({down} down, {idle} idle)")
        return text.format(machines=machines, down=down, idle=idle)

    def why_waits(self, competing: int, machines: str, must_wait: int) -> str:
        first = self.tr("%n job(s) can only run on {machines}", "", competing)
        second = self.tr("so %n of them must wait", "", must_wait)
        return f"{first.format(machines=machines)}, {second}"


class _Formats:
    """Numbers, dates and times as the sheet prints them: ``locale``'s conventions, or
    the command line's fixed formats when ``locale`` is ``None``."""

    def __init__(self, locale: QLocale | None) -> None:
        self.locale = locale

    def value(self, value: float | None, unit: str = "") -> str:
        loc = self.locale
        if loc is None or value is None or not math.isfinite(value):
            return format_value(value, unit)
        if value == int(value):
            text = loc.toString(int(value))
        else:
            text = loc.toString(float(value), "f", 2)
            point = loc.decimalPoint()
            if point in text:
                text = text.rstrip("0").rstrip(point)
        return f"{text} {unit}".strip()

    def number(self, n: int) -> str:
        return str(n) if self.locale is None else self.locale.toString(int(n))

    def time(self, t: dt.datetime | None) -> str:
        if t is None or self.locale is None:
            return format_time(t)
        local = t.astimezone() if t.tzinfo is not None else t
        return self.locale.toString(_qdatetime(local), QLocale.FormatType.ShortFormat)

    def clock(self, t: dt.datetime) -> str:
        """Only the time of day (``HH:MM`` on the command line)."""
        if self.locale is None:
            return t.strftime("%H:%M")
        return self.locale.toString(QTime(t.hour, t.minute), QLocale.FormatType.ShortFormat)

    def date(self, day: dt.date | None) -> str:
        if day is None:
            return ""
        if self.locale is None:
            return day.isoformat()
        return self.locale.toString(QDate(day.year, day.month, day.day),
                                    QLocale.FormatType.ShortFormat)


def _qdatetime(t: dt.datetime) -> QDateTime:
    return QDateTime(QDate(t.year, t.month, t.day), QTime(t.hour, t.minute, t.second))


class SheetRenderError(BadInputError, RuntimeError):
    """The sheet could not be painted or written (message names the file when there is one).

    Exit code 2, as for any output file the user named that cannot be written.
    """


def ensure_gui_application() -> QGuiApplication:
    """The running Qt application, or a new ``QGuiApplication`` (offscreen without a display).

    Painting text needs an application object for fonts. On a headless machine (no
    ``DISPLAY``/``WAYLAND_DISPLAY`` on Linux) the offscreen platform is chosen unless the
    caller already set ``QT_QPA_PLATFORM``.
    """
    app = QGuiApplication.instance()
    if app is not None:
        return app
    if (sys.platform.startswith("linux") and not os.environ.get("DISPLAY")
            and not os.environ.get("WAYLAND_DISPLAY")):
        os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    return QGuiApplication(sys.argv[:1])


def paper_for_locale(locale: QLocale | None = None) -> QPageSize.PageSizeId:
    """Letter for the territories in :data:`LETTER_TERRITORIES`, A4 everywhere else."""
    locale = QLocale.system() if locale is None else locale
    return (QPageSize.PageSizeId.Letter if locale.territory() in LETTER_TERRITORIES
            else QPageSize.PageSizeId.A4)


def page_size_for(paper: str | None = None, locale: QLocale | None = None) -> QPageSize:
    """``paper`` ("a4" or "letter", any case) if given, else the locale's usual paper."""
    if paper is None:
        return QPageSize(paper_for_locale(locale))
    key = paper.strip().lower()
    if key not in PAPER_SIZES:
        raise ValueError(f"unknown paper size {paper!r}: expected one of {', '.join(PAPER_SIZES)}")
    return QPageSize(PAPER_SIZES[key])


# ---------------------------------------------------------------- body as HTML

def _e(text: object) -> str:
    return html.escape(str(text), quote=True)


#: Main table columns: (key, width in percent of the text width); headings in _heading.
_MACHINE_COLUMNS = (
    ("machine", 13), ("state", 10), ("seq", 6), ("work_order", 10), ("job", 14),
    ("value", 10), ("notes", 13), ("initials", 8), ("start", 8), ("finish", 8),
)


def _heading(key: str) -> str:
    """A column heading of the machine table (``value`` is the sheet's value heading)."""
    return {
        "machine": translate("Sheet", "Machine"), "state": translate("Sheet", "State"),
        "seq": translate("Sheet", "Seq."), "work_order": translate("Sheet", "Work order"),
        "job": translate("Sheet", "Job"), "notes": translate("Sheet", "Notes"),
        "initials": translate("Sheet", "Initials"), "start": translate("Sheet", "Start"),
        "finish": translate("Sheet", "Finish"), "operator": translate("Sheet", "Operator"),
    }[key]


def _words(text: str) -> str:
    """A phrase the content carries in English (marked for translation where it was made)."""
    return translate("Sheet", text)


def _nb(text: str) -> str:
    """Escaped text that does not wrap at its spaces ("12.5 min" stays on one line)."""
    return _e(text).replace(" ", "&nbsp;")


def _short_time(t: dt.datetime | None, day: dt.date | None, fmt: _Formats) -> str:
    """The time of day when ``t`` falls on ``day`` (the shift date), else date and time."""
    if t is None:
        return ""
    local = t.astimezone() if t.tzinfo is not None else t
    return fmt.clock(local) if day is not None and local.date() == day else fmt.time(t)


def _rush() -> str:
    rush = translate("Sheet", "RUSH")
    return f"<b>{_e(rush)}</b>"


def _job_cells(job: SheetJob, day: dt.date | None, fmt: _Formats) -> tuple[str, str, str]:
    """Job, setup and notes cells of one job row."""
    name = _e(job.name)
    if job.rush:
        name = f"{_rush()} {name}"
    notes = []
    if job.continuing:
        since = _short_time(job.running_since, day, fmt)
        carries = translate("Sheet", "carries on")
        carries = f"<b>{_e(carries)}</b>"
        notes.append(carries + (", " + _e(translate("Sheet", "running since {time}")).format(
            time=_nb(since)) if since else ""))
    if job.change:
        notes.append(_e(job.change))
    if job.hours is not None:
        notes.append(_e(translate("Sheet", "run {hours}")).format(
            hours=_nb(fmt.value(job.hours, translate("Sheet", "h")))))
    if job.pinned:
        pin = translate("Sheet", "pinned here")
        notes.append(_e(pin + (f" ({job.pin_note})" if job.pin_note else "")))
    if job.planned:
        notes.append(f"planned {_nb(job.planned)}")
    if job.notes:
        notes.append(_e(job.notes))
    return name, _nb(fmt.value(job.setup, job.unit)), "; ".join(notes)


#: The same with the operator of each machine beside the initials box (shops with a crew).
_STAFFED_COLUMNS = (
    ("machine", 12), ("state", 7), ("seq", 6), ("work_order", 10), ("job", 14),
    ("value", 8), ("notes", 10), ("operator", 11), ("initials", 8), ("start", 7), ("finish", 7),
)


def _machine_note(machine: SheetMachine) -> str:
    slots = Sheet().slots(machine.slots) if machine.slots > 1 else ""
    return _e("; ".join(t for t in (slots, machine.notes) if t))


def _machine_rows(machine: SheetMachine, day: dt.date | None, fmt: _Formats,
                  staffed: bool = False) -> list[str]:
    state = Sheet().state_short(machine.state)
    state_cell = f"<b>{_e(state)}</b>" if machine.is_down else _e(state)
    shade = f' bgcolor="{DOWN_SHADE}"' if machine.is_down else ""
    note = _machine_note(machine)
    op = f"<td>{_e(machine.operator)}</td>" if staffed else ""
    if not machine.jobs:
        what = _e(translate("Sheet", "no work: see Machines down") if machine.is_down
                  else translate("Sheet", "idle: no job this round"))
        box = "&#8212;" if machine.is_down else ""
        return [(f"<tr{shade}><td><b>{_e(machine.name)}</b></td><td>{state_cell}</td>"
                f"<td></td><td></td><td><i>{what}</i></td><td></td><td>{note}</td>"
                + ("<td></td>" if staffed else "") + f"<td align=center>{box}</td><td align=center>{box}</td>"
                f"<td align=center>{box}</td></tr>")]
    rows = []
    count = len(machine.jobs)
    for k, job in enumerate(machine.jobs, start=1):
        name, setup, notes = _job_cells(job, day, fmt)
        if k == 1 and note:
            notes = f"{note}; {notes}" if notes else note
        seq = (_e(translate("Sheet", "{k} of {count}")).format(k=fmt.number(k),
                                                               count=fmt.number(count))
               if count > 1 else fmt.number(1))
        rows.append(
            f"<tr{shade}><td><b>{_e(machine.name)}</b></td><td>{state_cell}</td>"
            f"<td align=center>{seq}</td><td>{_e(job.work_order)}</td><td>{name}</td>"
            f"<td align=right>{setup}</td><td>{notes}</td>{op}<td></td><td></td><td></td></tr>")
    return rows


def _table(title: str, columns: tuple[tuple[str, float], ...], rows: list[str],
           headings: bool = True, write_in: bool = False) -> str:
    """A ruled table whose header rows (title, column names) repeat on every page.

    Qt's HTML importer turns ``<thead>`` rows into header rows
    (``QTextTableFormat.headerRowCount``), and a paginated layout repeats them at the
    top of every page the table continues on. ``write_in`` gives the body rows room for
    handwriting (class ``w`` in :data:`BODY_STYLE`).
    """
    head = "".join(f'<th width="{w}%" align=left bgcolor="{HEADING_SHADE}">{_e(h)}</th>'
                   for h, w in columns)
    body = "".join(rows)
    if write_in:
        body = body.replace("<td", "<td class=w")
    return (f'<table width="100%" cellspacing=0 cellpadding=3 style="border-collapse:collapse">'
            f'<thead><tr><th colspan={len(columns)} align=left bgcolor="{TITLE_SHADE}">'
            f"{_e(title)}</th></tr>"
            + (f"<tr>{head}</tr>" if headings else "")
            + f"</thead><tbody>{body}</tbody></table>")


_SPACER = '<p style="font-size:6pt">&nbsp;</p>'


def _why(w, fmt: _Formats) -> str:
    """Why a job waits, in the sheet's language when the content says it in parts."""
    if w.competing and w.machines:
        return Sheet().why_waits(len(w.competing), ", ".join(w.machines), w.must_wait)
    if w.why.startswith(NO_MACHINE):  # the machine-by-machine detail stays as written
        return _words(NO_MACHINE) + w.why[len(NO_MACHINE):]
    return _words(w.why)


def sheet_body_html(content: SheetContent, text_locale: QLocale | None = None) -> str:
    """The body of the sheet as Qt rich-text HTML (tables get their borders afterwards)."""
    ensure_plurals()
    fmt = _Formats(text_locale)
    words = Sheet()
    parts: list[str] = []
    columns = _STAFFED_COLUMNS if content.staffed else _MACHINE_COLUMNS
    machine_rows = [row for m in content.machines
                    for row in _machine_rows(m, content.shift_date, fmt, content.staffed)]
    if not machine_rows:
        none = translate("Sheet", "No machines in this shop.")
        machine_rows = [f"<tr><td colspan={len(columns)}><i>{_e(none)}</i></td></tr>"]
    n_jobs = len(content.dispatched_jobs())
    parts.append(_table(
        words.machines_and_jobs(len(content.machines), n_jobs),
        tuple((_words(content.value_heading) if key == "value" else _heading(key), w)
              for key, w in columns),
        machine_rows, write_in=True))
    if content.staffed:
        parts.append(_SPACER)
        all_staffed = translate("Sheet", "Every running machine has a present, authorised operator.")
        crew_rows = [f"<tr><td>{_e(line)}</td></tr>" for line in content.crew_notes] or [
            f"<tr><td><i>{_e(all_staffed)}</i></td></tr>"]
        parts.append(_table(translate("Sheet", "Crew"), (("", 100),), crew_rows, headings=False))

    parts.append(_SPACER)
    wait_cols = ((translate("Sheet", "Job"), 26), (translate("Sheet", "Work order"), 14),
                 (translate("Sheet", "Why it waits"), 60))
    wait_rows = []
    first_with: dict[str, str] = {}
    for w in content.waiting:
        # a long reason shared by many jobs is printed once, then referred to by job name
        why = (_why(w, fmt) if w.why not in first_with else
               translate("Sheet", "same reason as {job}").format(job=first_with[w.why]))
        first_with.setdefault(w.why, w.name)
        wait_rows.append(f"<tr><td>{_rush() + ' ' if w.rush else ''}{_e(w.name)}</td>"
                         f"<td>{_e(w.work_order)}</td><td>{_e(why)}</td></tr>")
    if not wait_rows:
        none = translate("Sheet", "No job waits.")
        wait_rows = [f"<tr><td colspan=3><i>{_e(none)}</i></td></tr>"]
    parts.append(_table(words.waiting_title(len(content.waiting)), wait_cols, wait_rows))

    parts.append(_SPACER)
    down_cols = ((translate("Sheet", "Machine"), 22), (translate("Sheet", "State"), 18),
                 (translate("Sheet", "Since"), 18), (translate("Sheet", "Note"), 42))
    down_rows = [f"<tr><td><b>{_e(d.name)}</b></td>"
                 f"<td><b>{_e(_words(STATE_WORDS.get(d.state, d.state.upper())))}</b></td>"
                 f"<td>{_e(fmt.time(d.since))}</td><td>{_e(d.note)}</td></tr>"
                 for d in content.down]
    if not down_rows:
        none = translate("Sheet", "No machine is down.")
        down_rows = [f"<tr><td colspan=4><i>{_e(none)}</i></td></tr>"]
    parts.append(_table(words.down_title(len(content.down)), down_cols, down_rows))

    parts.append(_SPACER)
    t = content.totals
    plan_total = translate("Sheet", "Plan total")
    total_rows = [
        (translate("Sheet", "Machines"),
         words.machines_line(fmt.number(t.machines), fmt.number(t.machines_down),
                             fmt.number(t.machines_idle))),
        (translate("Sheet", "Jobs dispatched"), fmt.number(t.jobs_dispatched)),
        (translate("Sheet", "Jobs already running (carry on)"), fmt.number(t.jobs_continuing)),
        (translate("Sheet", "Jobs waiting"), fmt.number(t.jobs_waiting)),
        (plan_total + (f" ({_words(t.objective)})" if t.objective else ""),
         content.total_line().split(": ", 1)[-1] if fmt.locale is None
         else (fmt.value(t.total, t.unit) or "-")),
    ]
    if t.status:
        total_rows.append((translate("Sheet", "Plan status"), _words(t.status)))
    rows = [f'<tr><td width="30%">{_e(a)}</td><td width="70%">{_e(b)}</td></tr>'
            for a, b in total_rows]
    parts.append(_table(translate("Sheet", "Totals"), (("", 30), ("", 70)), rows,
                        headings=False))

    parts.append(_SPACER)
    who, signature, when = (translate("Sheet", "Supervisor"), translate("Sheet", "Signature"),
                            translate("Sheet", "Time"))
    sign = [(f'<tr><td width="13%">{_e(who)}</td><td width="30%"></td>'
             f'<td width="12%">{_e(signature)}</td><td width="27%"></td>'
             f'<td width="7%">{_e(when)}</td><td width="11%"></td></tr>')]
    parts.append(_table(translate("Sheet", "Sign-off"),
                        (("", 13), ("", 30), ("", 12), ("", 27), ("", 7), ("", 11)),
                        sign, headings=False, write_in=True))
    if content.shop_note:
        about = _e(translate("Sheet", "About this shop: {note}")).format(note=_e(content.shop_note))
        parts.append(f'<p style="font-size:7.5pt"><i>{about}</i></p>')
    return "".join(parts)


# ---------------------------------------------------------------- painting

@dataclass(frozen=True)
class _Metrics:
    """A page in layout pixels (see :func:`_layout_px_per_pt`) and its bands.

    The sheet is laid out once in layout pixels, independent of the device, and painted
    with the painter scaled by ``scale_x``/``scale_y`` (device pixels per layout pixel),
    as ``QTextDocument.print`` does. The documents are never bound to the device: Qt's
    bindings would take ownership of a printer handed to ``setPaintDevice``.
    """

    px_per_pt: float
    width: float
    height: float
    header_h: float
    footer_h: float
    scale_x: float
    scale_y: float

    @property
    def body_h(self) -> float:
        return self.height - self.header_h - self.footer_h


def _font(pt: float, bold: bool = False) -> QFont:
    font = QFont()
    font.setFamilies(["DejaVu Sans", "Arial", "Helvetica", "Liberation Sans"])
    font.setStyleHint(QFont.StyleHint.SansSerif)
    font.setPointSizeF(pt)
    font.setBold(bold)
    # No ligatures: "fl" and "ff" must stay two letters so the PDF's text can be searched
    # and copied ("Sign-off", "flange") exactly as typed.
    for tag in ("liga", "clig", "dlig"):
        font.setFeature(QFont.Tag(tag), 0)
    return font


def _layout_px_per_pt() -> float:
    """Qt text-layout pixels per point.

    ``QTextDocument`` scales fixed lengths (borders, padding) from the default DPI that
    Qt uses for text (96 with ``AA_Use96Dpi``, else the primary screen's logical DPI,
    else 100) to the paint device, so lengths we set must be given in those pixels.
    Fonts given in points are converted by Qt directly.
    """
    app = QGuiApplication.instance()
    if app is not None and app.testAttribute(Qt.ApplicationAttribute.AA_Use96Dpi):
        return 96 / 72
    screen = QGuiApplication.primaryScreen()
    return (round(screen.logicalDotsPerInchY()) if screen is not None else 100) / 72


def _document(html_text: str, width: float, pt: float, style: str = "") -> QTextDocument:
    """A rich-text document laid out ``width`` layout pixels wide."""
    doc = QTextDocument()
    doc.setDefaultFont(_font(pt))
    doc.setDocumentMargin(0)
    if style:
        doc.setDefaultStyleSheet(style)
    doc.setHtml(html_text)
    doc.setTextWidth(width)
    return doc


def sheet_title(content: SheetContent) -> str:
    """``Dispatch sheet - SHOP`` in the sheet's language (also the PDF's title)."""
    return translate("Sheet", "Dispatch sheet - {shop}").format(shop=_words(content.shop_name))


def _header_html(content: SheetContent, page: int, pages: int, fmt: _Formats) -> str:
    if content.decision_number is None and content.in_force:
        decision = _e(content.decision_line())
    elif content.decision_number is not None:
        number = fmt.number(content.decision_number)
        decision = (_e(translate("Sheet", "Decision #{number} of {time}")).format(
                        number=number, time=_e(fmt.time(content.decision_time)))
                    if content.decision_time else
                    _e(translate("Sheet", "Decision #{number}")).format(number=number))
    else:
        decision = _e(translate("Sheet", "Decision: {not_recorded} (draft plan)")).format(
            not_recorded="<b>" + _e(translate("Sheet", "not recorded")) + "</b>")
    date = fmt.date(content.shift_date)
    date_word, shift_word, who = (translate("Sheet", "Date"), translate("Sheet", "Shift"),
                                  translate("Sheet", "Supervisor"))
    printed = _e(translate("Sheet", "Printed {time}")).format(time=_e(fmt.time(content.printed_at)))
    page_of = _e(translate("Sheet", "Page {page} of {pages}")).format(
        page=fmt.number(page), pages=fmt.number(pages))
    return (
        '<table width="100%" cellspacing=0 cellpadding=0><tr>'
        f'<td width="75%"><span style="font-size:13pt"><b>{_e(sheet_title(content))}'
        "</b></span></td>"
        f'<td width="25%" align=right><span style="font-size:12pt"><b>{page_of}'
        "</b></span></td></tr>"
        f"<tr><td>{_e(date_word)} <b>{_e(date) or '__________'}</b> &nbsp;&nbsp; "
        f"{_e(shift_word)} <b>{_e(content.shift_label) or '__________'}</b> "
        f"&nbsp;&nbsp; {_e(who)} "
        f"<b>{_e(content.supervisor) or '____________________'}</b></td>"
        f"<td align=right>{printed}"
        "</td></tr>"
        f"<tr><td colspan=2>{decision}</td></tr></table>")


def _footer_html(content: SheetContent) -> str:
    items = " ".join(f"<b>{k}.</b> {_e(_words(text))}"
                     for k, text in enumerate(content.safety, start=1))
    safety = _e(translate("Sheet", "SAFETY:"))
    return ('<table width="100%" cellspacing=0 cellpadding=4 style="border-collapse:collapse">'
            f'<tr><td style="border: 2px solid black"><b>{safety}</b> {items}</td></tr></table>')


def print_sheet(content: SheetContent, device: QPagedPaintDevice,
                text_locale: QLocale | None = None) -> int:
    """Paint the whole sheet onto ``device`` (``QPrinter`` or ``QPdfWriter``); return pages.

    The device's page size, orientation and margins are used as set by the caller (a
    print dialog, a print preview's ``paintRequested`` printer, :func:`write_pdf`). The
    caller owns the device; this function opens and ends its own ``QPainter``.
    ``text_locale`` writes numbers, dates and times by that locale (default: the command
    line's fixed formats).
    """
    ensure_gui_application()
    ensure_plurals()
    fmt = _Formats(text_locale)
    body, m = _lay_out(content, device, fmt)
    pages = body.pageCount()
    painter = QPainter()
    started = painter.begin(device)
    if not started:
        raise SheetRenderError("could not start painting on the printer or file")
    try:
        for i in range(pages):
            if i:
                device.newPage()
            _paint_page(painter, content, body, m, i, pages, fmt)
    finally:
        painter.end()
    return pages


def _lay_out(content: SheetContent, device: QPagedPaintDevice,
             fmt: _Formats) -> tuple[QTextDocument, _Metrics]:
    """The paginated body document and the bands of the pages of ``device``."""
    if device.width() <= 0 or device.height() <= 0:
        raise SheetRenderError("the printer reports an empty page")
    unit = _layout_px_per_pt()
    scale_x = device.logicalDpiX() / (72.0 * unit)
    scale_y = device.logicalDpiY() / (72.0 * unit)
    width, height = device.width() / scale_x, device.height() / scale_y
    footer = _document(_footer_html(content), width, SMALL_PT)
    probe = _document(_header_html(content, 999, 999, fmt), width, BODY_PT)
    m = _Metrics(unit, width, height,
                 header_h=probe.size().height() + GAP_PT * unit,
                 footer_h=footer.size().height() + GAP_PT * unit,
                 scale_x=scale_x, scale_y=scale_y)
    if m.body_h < 72 * unit:
        raise SheetRenderError("the page is too small for the sheet (less than an inch of body)")
    style = BODY_STYLE.format(rule=max(1, round(0.6 * unit)), tall=round(6 * unit))
    body = _document(sheet_body_html(content, fmt.locale), width, BODY_PT, style)
    body.setPageSize(QSizeF(width, m.body_h))
    return body, m


def _paint_page(painter: QPainter, content: SheetContent, body: QTextDocument, m: _Metrics,
                index: int, pages: int, fmt: _Formats) -> None:
    """Header band, the body's page ``index``, and the safety footer."""
    painter.save()
    painter.scale(m.scale_x, m.scale_y)
    pen = QPen(Qt.GlobalColor.black)
    pen.setWidthF(0.8 * m.px_per_pt)
    gap = GAP_PT * m.px_per_pt
    header = _document(_header_html(content, index + 1, pages, fmt), m.width, BODY_PT)
    header.drawContents(painter)
    painter.setPen(pen)
    painter.drawLine(QLineF(0, m.header_h - gap / 2, m.width, m.header_h - gap / 2))

    painter.save()
    painter.translate(0, m.header_h - index * m.body_h)
    body.drawContents(painter, QRectF(0, index * m.body_h, m.width, m.body_h))
    painter.restore()

    footer = _document(_footer_html(content), m.width, SMALL_PT)
    painter.translate(0, m.height - footer.size().height())
    footer.drawContents(painter)
    painter.restore()


def write_pdf(content: SheetContent, path: str | os.PathLike[str], paper: str | None = None,
              locale: QLocale | None = None, resolution: int = 300,
              text_locale: QLocale | None = None) -> int:
    """Write the sheet to a PDF file; return the number of pages.

    ``paper`` is "a4" or "letter"; ``None`` picks by ``locale`` (default: the system's).
    The file is written to a temporary name in the same folder and then moved into place,
    so a failure never leaves a half-written PDF under the requested name.
    ``text_locale`` as for :func:`print_sheet`.
    """
    ensure_gui_application()
    target = Path(path)
    folder = target.parent if str(target.parent) else Path(".")
    if not folder.is_dir():
        raise SheetRenderError(f"{target}: folder {folder} does not exist")
    size = page_size_for(paper, locale)
    pages = 0

    def write(tmp: Path) -> None:
        nonlocal pages
        writer = QPdfWriter(str(tmp))
        writer.setResolution(resolution)
        writer.setTitle(sheet_title(content))
        writer.setCreator("dispatcher")
        writer.setPageLayout(QPageLayout(size, QPageLayout.Orientation.Portrait,
                                         QMarginsF(MARGIN_MM, MARGIN_MM, MARGIN_MM, MARGIN_MM),
                                         QPageLayout.Unit.Millimeter))
        try:
            pages = print_sheet(content, writer, text_locale)
        except SheetRenderError as exc:
            raise SheetRenderError(f"{target}: {exc}") from None
        del writer  # flushes and closes the file
        if tmp.stat().st_size == 0:
            raise SheetRenderError(f"{target}: the PDF could not be written")

    try:
        atomic_write(target, write, suffix=".pdf.tmp")
    except OSError as exc:
        raise SheetRenderError(f"{target}: cannot write the PDF ({exc.strerror or exc})") from None
    return pages
