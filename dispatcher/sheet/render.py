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

This module imports QtGui only (no widgets). A Qt application must exist before
painting; :func:`ensure_gui_application` returns the running one (the app's
``QApplication``) or makes a ``QGuiApplication`` (offscreen when there is no display).
"""

from __future__ import annotations

import datetime as dt
import html
import os
import sys
from dataclasses import dataclass
from pathlib import Path

from PySide6.QtCore import QLineF, QLocale, QMarginsF, QRectF, QSizeF, Qt
from PySide6.QtGui import (
    QFont,
    QGuiApplication,
    QPageLayout,
    QPageSize,
    QPagedPaintDevice,
    QPainter,
    QPdfWriter,
    QPen,
    QTextDocument,
)

from dispatcher.atomic import atomic_write
from dispatcher.errors import BadInputError

from .content import (
    STATE_SHORT,
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
    "paper_for_locale",
    "page_size_for",
    "print_sheet",
    "sheet_body_html",
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


#: Main table columns: (heading, width in percent of the text width).
_MACHINE_COLUMNS = (
    ("Machine", 13), ("State", 8), ("Seq.", 6), ("Work order", 10), ("Job", 16),
    ("Setup", 10), ("Notes", 13), ("Initials", 8), ("Start", 8), ("Finish", 8),
)


def _nb(text: str) -> str:
    """Escaped text that does not wrap at its spaces ("12.5 min" stays on one line)."""
    return _e(text).replace(" ", "&nbsp;")


def _short_time(t: dt.datetime | None, day: dt.date | None) -> str:
    """``HH:MM`` when ``t`` falls on ``day`` (the shift date), else the full date and time."""
    if t is None:
        return ""
    local = t.astimezone() if t.tzinfo is not None else t
    return local.strftime("%H:%M") if day is not None and local.date() == day else format_time(t)


def _job_cells(job: SheetJob, day: dt.date | None) -> tuple[str, str, str]:
    """Job, setup and notes cells of one job row."""
    name = _e(job.name)
    if job.rush:
        name = f"<b>RUSH</b> {name}"
    notes = []
    if job.continuing:
        since = _short_time(job.running_since, day)
        notes.append("<b>carries on</b>" + (f", running since {_nb(since)}" if since else ""))
    if job.hours is not None:
        notes.append(f"run {_nb(format_value(job.hours, 'h'))}")
    if job.notes:
        notes.append(_e(job.notes))
    return name, _nb(format_value(job.setup, job.unit)), "; ".join(notes)


#: The same with the operator of each machine beside the initials box (shops with a crew).
_STAFFED_COLUMNS = (
    ("Machine", 12), ("State", 7), ("Seq.", 6), ("Work order", 10), ("Job", 14),
    ("Setup", 8), ("Notes", 10), ("Operator", 11), ("Initials", 8), ("Start", 7), ("Finish", 7),
)


def _machine_rows(machine: SheetMachine, day: dt.date | None, staffed: bool = False) -> list[str]:
    state = STATE_SHORT.get(machine.state, machine.state.upper())
    state_cell = f"<b>{_e(state)}</b>" if machine.is_down else _e(state)
    shade = f' bgcolor="{DOWN_SHADE}"' if machine.is_down else ""
    note = _e(machine.notes)
    op = f"<td>{_e(machine.operator)}</td>" if staffed else ""
    if not machine.jobs:
        what = ("no work: see Machines down" if machine.is_down else "idle: no job this round")
        box = "&#8212;" if machine.is_down else ""
        return [f"<tr{shade}><td><b>{_e(machine.name)}</b></td><td>{state_cell}</td>"
                f"<td></td><td></td><td><i>{what}</i></td><td></td><td>{note}</td>"
                + ("<td></td>" if staffed else "") + f"<td align=center>{box}</td><td align=center>{box}</td>"
                f"<td align=center>{box}</td></tr>"]
    rows = []
    count = len(machine.jobs)
    for k, job in enumerate(machine.jobs, start=1):
        name, setup, notes = _job_cells(job, day)
        if k == 1 and note:
            notes = f"{note}; {notes}" if notes else note
        seq = f"{k} of {count}" if count > 1 else "1"
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


def sheet_body_html(content: SheetContent) -> str:
    """The body of the sheet as Qt rich-text HTML (tables get their borders afterwards)."""
    parts: list[str] = []
    columns = _STAFFED_COLUMNS if content.staffed else _MACHINE_COLUMNS
    machine_rows = [row for m in content.machines
                    for row in _machine_rows(m, content.shift_date, content.staffed)]
    if not machine_rows:
        machine_rows = [f"<tr><td colspan={len(columns)}><i>No machines in this shop."
                        "</i></td></tr>"]
    n_jobs = len(content.dispatched_jobs())
    parts.append(_table(
        f"Machines and jobs ({len(content.machines)} machines, {n_jobs} jobs)",
        tuple((content.value_heading if h == "Setup" else h, w) for h, w in columns),
        machine_rows, write_in=True))
    if content.staffed:
        parts.append(_SPACER)
        crew_rows = [f"<tr><td>{_e(line)}</td></tr>" for line in content.crew_notes] or [
            "<tr><td><i>Every running machine has a present, authorised operator.</i></td></tr>"]
        parts.append(_table("Crew", (("", 100),), crew_rows, headings=False))

    parts.append(_SPACER)
    wait_cols = (("Job", 26), ("Work order", 14), ("Why it waits", 60))
    wait_rows = []
    first_with: dict[str, str] = {}
    for w in content.waiting:
        # a long reason shared by many jobs is printed once, then referred to by job name
        why = w.why if w.why not in first_with else f"same reason as {first_with[w.why]}"
        first_with.setdefault(w.why, w.name)
        wait_rows.append(f"<tr><td>{'<b>RUSH</b> ' if w.rush else ''}{_e(w.name)}</td>"
                         f"<td>{_e(w.work_order)}</td><td>{_e(why)}</td></tr>")
    if not wait_rows:
        wait_rows = ["<tr><td colspan=3><i>No job waits.</i></td></tr>"]
    parts.append(_table(f"Waiting jobs ({len(content.waiting)})", wait_cols, wait_rows))

    parts.append(_SPACER)
    down_cols = (("Machine", 22), ("State", 18), ("Since", 18), ("Note", 42))
    down_rows = [f"<tr><td><b>{_e(d.name)}</b></td>"
                 f"<td><b>{_e(STATE_WORDS.get(d.state, d.state.upper()))}</b></td>"
                 f"<td>{_e(format_time(d.since))}</td><td>{_e(d.note)}</td></tr>"
                 for d in content.down]
    if not down_rows:
        down_rows = ["<tr><td colspan=4><i>No machine is down.</i></td></tr>"]
    parts.append(_table(f"Machines down ({len(content.down)}) - lockout/tagout before any work",
                        down_cols, down_rows))

    parts.append(_SPACER)
    t = content.totals
    total_rows = [
        ("Machines", f"{t.machines} ({t.machines_down} down, {t.machines_idle} idle)"),
        ("Jobs dispatched", str(t.jobs_dispatched)),
        ("Jobs already running (carry on)", str(t.jobs_continuing)),
        ("Jobs waiting", str(t.jobs_waiting)),
        ("Plan total" + (f" ({t.objective})" if t.objective else ""),
         content.total_line().split(": ", 1)[-1]),
    ]
    if t.status:
        total_rows.append(("Plan status", t.status))
    rows = [f'<tr><td width="30%">{_e(a)}</td><td width="70%">{_e(b)}</td></tr>'
            for a, b in total_rows]
    parts.append(_table("Totals", (("", 30), ("", 70)), rows, headings=False))

    parts.append(_SPACER)
    sign = ['<tr><td width="13%">Supervisor</td><td width="30%"></td>'
            '<td width="12%">Signature</td><td width="27%"></td>'
            '<td width="7%">Time</td><td width="11%"></td></tr>']
    parts.append(_table("Sign-off", (("", 13), ("", 30), ("", 12), ("", 27), ("", 7), ("", 11)),
                        sign, headings=False, write_in=True))
    if content.shop_note:
        parts.append(f'<p style="font-size:7.5pt"><i>About this shop: {_e(content.shop_note)}</i></p>')
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


def _header_html(content: SheetContent, page: int, pages: int) -> str:
    decision = (_e(content.decision_line()) if content.decision_number is not None
                or content.in_force else "Decision: <b>not recorded</b> (draft plan)")
    date = content.shift_date.isoformat() if content.shift_date else ""
    return (
        '<table width="100%" cellspacing=0 cellpadding=0><tr>'
        f'<td width="75%"><span style="font-size:13pt"><b>Dispatch sheet - {_e(content.shop_name)}'
        "</b></span></td>"
        f'<td width="25%" align=right><span style="font-size:12pt"><b>Page {page} of {pages}'
        "</b></span></td></tr>"
        f"<tr><td>Date <b>{_e(date) or '__________'}</b> &nbsp;&nbsp; "
        f"Shift <b>{_e(content.shift_label) or '__________'}</b> &nbsp;&nbsp; "
        f"Supervisor <b>{_e(content.supervisor) or '____________________'}</b></td>"
        f"<td align=right>Printed {_e(format_time(content.printed_at))}</td></tr>"
        f"<tr><td colspan=2>{decision}</td></tr></table>")


def _footer_html(content: SheetContent) -> str:
    items = " ".join(f"<b>{k}.</b> {_e(text)}" for k, text in enumerate(content.safety, start=1))
    return ('<table width="100%" cellspacing=0 cellpadding=4 style="border-collapse:collapse">'
            f'<tr><td style="border: 2px solid black"><b>SAFETY:</b> {items}</td></tr></table>')


def print_sheet(content: SheetContent, device: QPagedPaintDevice) -> int:
    """Paint the whole sheet onto ``device`` (``QPrinter`` or ``QPdfWriter``); return pages.

    The device's page size, orientation and margins are used as set by the caller (a
    print dialog, a print preview's ``paintRequested`` printer, :func:`write_pdf`). The
    caller owns the device; this function opens and ends its own ``QPainter``.
    """
    ensure_gui_application()
    body, m = _lay_out(content, device)
    pages = body.pageCount()
    painter = QPainter()
    started = painter.begin(device)
    if not started:
        raise SheetRenderError("could not start painting on the printer or file")
    try:
        for i in range(pages):
            if i:
                device.newPage()
            _paint_page(painter, content, body, m, i, pages)
    finally:
        painter.end()
    return pages


def _lay_out(content: SheetContent, device: QPagedPaintDevice) -> tuple[QTextDocument, _Metrics]:
    """The paginated body document and the bands of the pages of ``device``."""
    if device.width() <= 0 or device.height() <= 0:
        raise SheetRenderError("the printer reports an empty page")
    unit = _layout_px_per_pt()
    scale_x = device.logicalDpiX() / (72.0 * unit)
    scale_y = device.logicalDpiY() / (72.0 * unit)
    width, height = device.width() / scale_x, device.height() / scale_y
    footer = _document(_footer_html(content), width, SMALL_PT)
    probe = _document(_header_html(content, 999, 999), width, BODY_PT)
    m = _Metrics(unit, width, height,
                 header_h=probe.size().height() + GAP_PT * unit,
                 footer_h=footer.size().height() + GAP_PT * unit,
                 scale_x=scale_x, scale_y=scale_y)
    if m.body_h < 72 * unit:
        raise SheetRenderError("the page is too small for the sheet (less than an inch of body)")
    style = BODY_STYLE.format(rule=max(1, round(0.6 * unit)), tall=round(6 * unit))
    body = _document(sheet_body_html(content), width, BODY_PT, style)
    body.setPageSize(QSizeF(width, m.body_h))
    return body, m


def _paint_page(painter: QPainter, content: SheetContent, body: QTextDocument, m: _Metrics,
                index: int, pages: int) -> None:
    """Header band, the body's page ``index``, and the safety footer."""
    painter.save()
    painter.scale(m.scale_x, m.scale_y)
    pen = QPen(Qt.GlobalColor.black)
    pen.setWidthF(0.8 * m.px_per_pt)
    gap = GAP_PT * m.px_per_pt
    header = _document(_header_html(content, index + 1, pages), m.width, BODY_PT)
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
              locale: QLocale | None = None, resolution: int = 300) -> int:
    """Write the sheet to a PDF file; return the number of pages.

    ``paper`` is "a4" or "letter"; ``None`` picks by ``locale`` (default: the system's).
    The file is written to a temporary name in the same folder and then moved into place,
    so a failure never leaves a half-written PDF under the requested name.
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
        writer.setTitle(f"Dispatch sheet - {content.shop_name}")
        writer.setCreator("dispatcher")
        writer.setPageLayout(QPageLayout(size, QPageLayout.Orientation.Portrait,
                                         QMarginsF(MARGIN_MM, MARGIN_MM, MARGIN_MM, MARGIN_MM),
                                         QPageLayout.Unit.Millimeter))
        try:
            pages = print_sheet(content, writer)
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
