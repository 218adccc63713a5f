"""Print preview, print and PDF export of the daily dispatch sheet.

The layout is the sheet package's (:func:`dispatcher.sheet.build.build_sheet` for the
content, :mod:`dispatcher.sheet.render` for paper and PDF), so the preview, the printer and
the PDF are the same pages. The sheet prints the decision in force when one is recorded
for this shop, otherwise the plan shown (and says it is not recorded).

:class:`SheetPrinting` is the main window's part for the File menu's three entries.
"""

from __future__ import annotations

import os
from pathlib import Path

from PySide6.QtCore import QCoreApplication, QObject
from PySide6.QtWidgets import QFileDialog
from PySide6.QtPrintSupport import QPrintDialog, QPrinter, QPrinterInfo, QPrintPreviewDialog

from dispatcher.history import HistoryError
from dispatcher.translation import app_locale
from dispatcher.shop import Plan, PlanFormatError
from dispatcher.sheet.build import build_sheet
from dispatcher.sheet.content import SheetContent
from dispatcher.sheet.render import SheetRenderError, page_size_for, print_sheet, write_pdf
from dispatcher.ui.settings_keys import KEY_SUPERVISOR

translate = QCoreApplication.translate   # the name pyside6-lupdate collects


def _nothing_to_print(window) -> None:
    window.messenger.error(translate("SheetPrinting", "Nothing to print"),
                           translate("SheetPrinting", "There is no plan yet: fix the grid first."))


def sheet_content(window) -> SheetContent | None:
    """The sheet for the window's shop: the recorded decision in force, else the plan shown."""
    shop = window.doc.shop
    supervisor = str(window.settings.value(KEY_SUPERVISOR, ""))
    if shop.plan_in_force:
        try:
            decision = window.history.latest(shop.name)
        except HistoryError:
            decision = None
        if decision is not None and decision.plan:
            try:
                return build_sheet(shop, Plan.from_json(decision.plan, f"decision #{decision.id}"),
                                   decision, supervisor=supervisor)
            except PlanFormatError:
                pass
    if window.plan is None:
        return None
    return build_sheet(shop, window.plan, None, supervisor=supervisor)


def export_pdf(window, path: str | os.PathLike) -> int | None:
    """Write the sheet to ``path``; returns the page count (None, with a message, on failure)."""
    content = sheet_content(window)
    if content is None:
        _nothing_to_print(window)
        return None
    try:
        pages = write_pdf(content, Path(path), text_locale=app_locale())
    except (SheetRenderError, OSError) as exc:
        window.messenger.error(translate("SheetPrinting", "PDF not written"), str(exc))
        return None
    window.statusBar().showMessage(window.printing.wrote_text(pages, path), 8000)
    return pages


def _printer() -> QPrinter:
    """A high-resolution printer on the default page size. Without any installed printer
    it prints to PDF (Qt's native preview crashes when no printer exists at all)."""
    printer = QPrinter(QPrinter.PrinterMode.HighResolution)
    if not QPrinterInfo.availablePrinters():
        printer.setOutputFormat(QPrinter.OutputFormat.PdfFormat)
    printer.setPageSize(page_size_for(None))
    return printer


def preview(window) -> QPrintPreviewDialog | None:
    """Open the print preview (non-blocking); printing from it uses the same layout."""
    content = sheet_content(window)
    if content is None:
        _nothing_to_print(window)
        return None
    printer = _printer()
    dialog = QPrintPreviewDialog(printer, window)
    dialog.printer_ref = printer   # the dialog does not own the printer: keep it alive
    dialog.setWindowTitle(translate("SheetPrinting", "Dispatch sheet - print preview"))
    dialog.paintRequested.connect(lambda printer: print_sheet(content, printer, app_locale()))
    dialog.open()
    return dialog


def print_now(window) -> None:
    content = sheet_content(window)
    if content is None:
        _nothing_to_print(window)
        return
    printer = _printer()
    dialog = QPrintDialog(printer, window)
    if dialog.exec() == QPrintDialog.DialogCode.Accepted:
        print_sheet(content, printer, app_locale())


class SheetPrinting(QObject):
    """Print preview, print and PDF export for the window's shop. ``preview_dialog`` is
    the last preview opened."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.preview_dialog: QPrintPreviewDialog | None = None

    def wrote_text(self, pages: int, path) -> str:
        """The status line after writing a PDF (a plural lupdate collects from ``self.tr``)."""
        return self.tr("Wrote %n page(s) to {path}", "", pages).format(path=path)

    def preview(self) -> QPrintPreviewDialog | None:
        self.preview_dialog = preview(self.window)
        return self.preview_dialog

    def print_now(self) -> None:
        print_now(self.window)

    def ask_export_pdf(self) -> int | None:
        path, _ = QFileDialog.getSaveFileName(self.window, self.tr("Export dispatch sheet"),
                                              self.window.folder(), self.tr("PDF (*.pdf)"))
        if not path:
            return None
        return export_pdf(self.window, path if path.lower().endswith(".pdf") else path + ".pdf")
