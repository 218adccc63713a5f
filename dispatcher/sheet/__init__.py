"""The printed dispatch sheet: plain content, and its layout on paper and in PDF.

:mod:`dispatcher.sheet.content` is Qt-free; :mod:`dispatcher.sheet.render` uses QtGui
printing only (no widgets). Import the renderer from its module so that code needing only
the content never loads Qt.
"""

from .content import (
    SAFETY_CAUTIONS,
    SheetContent,
    SheetDownMachine,
    SheetJob,
    SheetMachine,
    SheetTotals,
    SheetWaitingJob,
)

__all__ = [
    "SAFETY_CAUTIONS",
    "SheetContent",
    "SheetDownMachine",
    "SheetJob",
    "SheetMachine",
    "SheetTotals",
    "SheetWaitingJob",
]
