"""The printed dispatch sheet: real PDFs made headless with Qt, read back with pypdf.

Checks are against things outside the renderer: the text pypdf extracts from the PDF,
the page sizes ISO 216 and ANSI define (A4 = 210 x 297 mm = 595.3 x 841.9 pt; Letter =
8.5 x 11 in = 612 x 792 pt), and Qt's own locale data for territories.
"""

from __future__ import annotations

import datetime as dt
import re
import sys
from pathlib import Path

import pypdf
import PySide6.QtGui  # noqa: F401  (a runtime dependency)
import pytest
from PySide6.QtCore import (
    QLocale,
    QMarginsF,
)
from PySide6.QtGui import QPageLayout, QPageSize

from dispatcher.sheet.content import (
    SAFETY_CAUTIONS,
    SheetContent,
    SheetDownMachine,
    SheetJob,
    SheetMachine,
    SheetTotals,
    SheetWaitingJob,
)
from dispatcher.sheet.render import (
    MARGIN_MM,
    SheetRenderError,
    ensure_gui_application,
    page_size_for,
    paper_for_locale,
    print_sheet,
    sheet_body_html,
    write_pdf,
)

SHIFT_DAY = dt.date(2026, 3, 9)


def make_content(n_machines: int, *, decision: int | None = 7, fill: bool = False) -> SheetContent:
    """An invented shop: every 7th machine down, every 5th idle, the rest with jobs."""
    machines, down = [], []
    for i in range(1, n_machines + 1):
        name = f"Cell-{i:03d}"
        if i % 7 == 0:
            machines.append(SheetMachine(name, "down" if i % 2 else "maintenance", (), "spindle"))
            down.append(SheetDownMachine(name, "down" if i % 2 else "maintenance",
                                         "spindle noise", dt.datetime(2026, 3, 9, 5, 0)))
            continue
        if i % 5 == 0:
            machines.append(SheetMachine(name))
            continue
        count = 3 if fill and i % 3 == 0 else 1
        jobs = tuple(SheetJob(f"J{i:03d}-{k}", f"WO-{i:03d}{k}", 10.0 + i + k / 2, "min",
                              rush=(i == 1 and k == 1), hours=1.5 if fill else None)
                     for k in range(1, count + 1))
        machines.append(SheetMachine(name, "up", jobs))
    waiting = (SheetWaitingJob("Late flange", "WO-9001", "no available machine can run it"),)
    return SheetContent(
        shop_name="Invented test shop", shift_date=SHIFT_DAY, shift_label="early",
        supervisor="early-shift lead", decision_number=decision,
        decision_time=dt.datetime(2026, 3, 9, 5, 55, tzinfo=dt.timezone.utc) if decision else None,
        printed_at=dt.datetime(2026, 3, 9, 6, 1),
        machines=tuple(machines), waiting=waiting, down=tuple(down),
        totals=SheetTotals(machines=n_machines, machines_down=len(down), jobs_waiting=1,
                           jobs_dispatched=sum(len(m.jobs) for m in machines), total=321.5,
                           unit="min", objective="least total setup", status="proven optimal"))


def pdf_pages(path: Path) -> list[str]:
    """Text of each page with runs of whitespace collapsed (lines wrap anywhere)."""
    reader = pypdf.PdfReader(str(path))
    return [re.sub(r"\s+", " ", page.extract_text() or "") for page in reader.pages]


@pytest.fixture
def app(qapp):
    """pytest-qt's QApplication, so later widget tests in the same run still get one."""
    assert ensure_gui_application() is qapp
    return qapp


def test_pdf_has_every_machine_job_and_the_safety_footer(app, tmp_path):
    content = make_content(14)
    out = tmp_path / "sheet.pdf"
    pages = write_pdf(content, out, paper="a4")
    texts = pdf_pages(out)
    assert len(texts) == pages >= 1
    text = " ".join(texts)
    for m in content.machines:
        assert m.name in text
    jobs = content.dispatched_jobs()
    assert jobs, "the test shop must dispatch something"
    for job in jobs:
        assert job.name in text and job.work_order in text
    for caution in SAFETY_CAUTIONS:
        assert caution in text
    assert "Late flange" in text and "no available machine can run it" in text
    assert "Decision #7" in text
    assert "RUSH J001-1" in text
    # machines down are named as such in words, not only by shading
    assert "DOWN" in text and "MAINT." in text and "MAINTENANCE" in text
    # no half-written temporary file is left beside the PDF
    assert [p.name for p in tmp_path.iterdir()] == ["sheet.pdf"]


def test_sixty_machines_paginate_with_page_numbers_and_repeated_headers(app, tmp_path):
    content = make_content(60)
    out = tmp_path / "big.pdf"
    pages = write_pdf(content, out, paper="a4")
    texts = pdf_pages(out)
    assert pages == len(texts) >= 2
    for i, text in enumerate(texts, start=1):
        assert f"Page {i} of {pages}" in text
        assert "Dispatch sheet - Invented test shop" in text
        assert "Shift early" in text and "Supervisor early-shift lead" in text
        assert "SAFETY:" in text and SAFETY_CAUTIONS[0] in text
    # the machine table spans pages: its title and column headings repeat on each of them
    spanned = [t for t in texts if "Cell-0" in t or "Cell-1" in t]
    assert len(spanned) >= 2
    for text in spanned:
        assert "Machines and jobs (60 machines" in text
        assert "Work order" in text and "Initials" in text and "Finish" in text
    # every machine row is printed exactly once: none lost or doubled at a page break
    joined = " ".join(texts)
    for m in content.machines:
        assert len(re.findall(rf"\b{m.name}\b", joined)) == (2 if m.is_down else 1), m.name


def test_jobs_in_run_order_per_machine(app, tmp_path):
    content = make_content(9, fill=True)
    out = tmp_path / "fill.pdf"
    write_pdf(content, out, paper="letter")
    text = " ".join(pdf_pages(out))
    positions = [text.index(f"J003-{k}") for k in (1, 2, 3)]
    assert positions == sorted(positions)
    for k in (1, 2, 3):
        assert f"{k} of 3" in text
    assert "run 1.5 h" in text


@pytest.mark.parametrize(("paper", "points"), [("a4", (595.3, 841.9)), ("letter", (612.0, 792.0))])
def test_paper_sizes(app, tmp_path, paper, points):
    out = tmp_path / f"{paper}.pdf"
    write_pdf(make_content(5), out, paper=paper)
    box = pypdf.PdfReader(str(out)).pages[0].mediabox
    assert float(box.width) == pytest.approx(points[0], abs=1.0)
    assert float(box.height) == pytest.approx(points[1], abs=1.0)


@pytest.mark.parametrize(("name", "expected"), [
    ("en_US", QPageSize.PageSizeId.Letter), ("en_CA", QPageSize.PageSizeId.Letter),
    ("fr_CA", QPageSize.PageSizeId.Letter), ("es_MX", QPageSize.PageSizeId.Letter),
    ("en_GB", QPageSize.PageSizeId.A4), ("de_DE", QPageSize.PageSizeId.A4),
    ("ja_JP", QPageSize.PageSizeId.A4), ("pt_BR", QPageSize.PageSizeId.A4),
])
def test_paper_by_locale(name, expected):
    assert paper_for_locale(QLocale(name)) == expected
    assert page_size_for(None, QLocale(name)).id() == expected


def test_paper_override_beats_locale():
    assert page_size_for("A4", QLocale("en_US")).id() == QPageSize.PageSizeId.A4
    assert page_size_for("Letter", QLocale("de_DE")).id() == QPageSize.PageSizeId.Letter
    with pytest.raises(ValueError, match="unknown paper size 'a3'"):
        page_size_for("a3")


def test_undecided_plan_says_not_recorded_and_names_are_printed_literally(app, tmp_path):
    tricky = SheetMachine("Press <B> & Co", "up", (SheetJob("<i>bolt</i> & nut", "WO-&1", 5, "min"),))
    content = SheetContent("Shop & <Sons>", shift_date=SHIFT_DAY, machines=(tricky,))
    out = tmp_path / "draft.pdf"
    write_pdf(content, out, paper="a4")
    text = " ".join(pdf_pages(out))
    assert "not recorded" in text
    assert "Press <B> & Co" in text and "<i>bolt</i> & nut" in text and "Shop & <Sons>" in text
    assert "No job waits." in text and "No machine is down." in text


def test_only_grey_shades_are_used():
    """Legible in greyscale: every colour in the layout has equal red, green and blue."""
    html = sheet_body_html(make_content(10))
    colours = re.findall(r"#([0-9a-fA-F]{6})\b", html)
    assert colours
    for c in colours:
        assert c[0:2].lower() == c[2:4].lower() == c[4:6].lower(), c


def test_printer_and_pdf_share_the_layout(app, tmp_path):
    """A QPrinter (what print preview and real printers use) gives the same pages."""
    from PySide6.QtPrintSupport import QPrinter

    content = make_content(60)
    direct = tmp_path / "direct.pdf"
    pages = write_pdf(content, direct, paper="letter")
    printer = QPrinter(QPrinter.PrinterMode.HighResolution)
    printer.setOutputFormat(QPrinter.OutputFormat.PdfFormat)
    printer.setOutputFileName(str(tmp_path / "printer.pdf"))
    # The same page layout as write_pdf (paper and margins): the layout is the caller's.
    printer.setPageLayout(QPageLayout(QPageSize(QPageSize.PageSizeId.Letter),
                                      QPageLayout.Orientation.Portrait,
                                      QMarginsF(MARGIN_MM, MARGIN_MM, MARGIN_MM, MARGIN_MM),
                                      QPageLayout.Unit.Millimeter))
    assert print_sheet(content, printer) == pages
    del printer
    ours, theirs = pdf_pages(direct), pdf_pages(tmp_path / "printer.pdf")
    assert len(ours) == len(theirs) == pages
    for i in range(pages):
        assert f"Page {i + 1} of {pages}" in theirs[i]
        # the same words on the same page, whichever way the page was produced
        assert theirs[i].split() == ours[i].split(), f"page {i + 1} differs"


def test_print_preview_paints_every_page(app):
    """Regression: the preview's printer must stay usable for every page (no ownership
    taken by a text layout)."""
    from PySide6.QtPrintSupport import QPrintPreviewWidget

    content = make_content(60)
    painted: list[int] = []
    preview = QPrintPreviewWidget()
    preview.paintRequested.connect(lambda printer: painted.append(print_sheet(content, printer)))
    preview.updatePreview()
    assert painted and painted[-1] == preview.pageCount() >= 2
    preview.deleteLater()


def test_missing_folder_is_reported_and_nothing_written(app, tmp_path):
    target = tmp_path / "nope" / "sheet.pdf"
    with pytest.raises(SheetRenderError, match="does not exist"):
        write_pdf(make_content(3), target, paper="a4")
    assert not target.parent.exists()


def test_existing_pdf_is_replaced_whole(app, tmp_path):
    out = tmp_path / "sheet.pdf"
    out.write_bytes(b"old")
    write_pdf(make_content(3), out, paper="a4")
    assert out.read_bytes().startswith(b"%PDF")


@pytest.mark.skipif(sys.version_info >= (3, 12), reason="None is immortal from Python 3.12")
def test_rendering_does_not_leak_references_to_none(app, tmp_path):
    """Regression: PySide6 6.12.0 void methods drop a reference to None on CPython 3.11
    (why pyproject.toml keeps PySide6 below 6.12)."""
    write_pdf(make_content(3), tmp_path / "warm.pdf", paper="a4")
    before = sys.getrefcount(None)
    write_pdf(make_content(60), tmp_path / "big.pdf", paper="a4")
    assert sys.getrefcount(None) >= before - 50
