"""Guard against a reference-count leak of ``None`` in PySide6 6.12 on CPython 3.11.

Observed here with PySide6/shiboken6 6.12.0 on CPython 3.11.7: every call from Python
to a Qt method returning ``void`` (``QTextTableCell.setFormat``, ``QObject.setObjectName``,
``QPainter.drawLine``, ...) hands back ``None`` without taking a reference to it, so
``sys.getrefcount(None)`` drops by one per call. CPython before 3.12 counts references to
``None`` (3.12 made it immortal, PEP 683), and after a few thousand such calls the
interpreter aborts with "none_dealloc: deallocating None". Laying out a 60-machine
sheet makes more calls than that.

:func:`none_refcount_guard` measures ``None``'s count around a block of Qt calls and
gives back what the block lost. It can only over-compensate (when the block also
released genuine references to ``None``), which merely keeps ``None`` alive, as it is
anyway; it never lowers the count. On Python 3.12 and later it does nothing.
"""

from __future__ import annotations

import ctypes
import sys
from collections.abc import Iterator
from contextlib import contextmanager

__all__ = ["none_refcount_guard"]

_NEEDED = sys.version_info < (3, 12)


@contextmanager
def none_refcount_guard() -> Iterator[None]:
    """Restore references to ``None`` lost by Qt calls made inside the ``with`` block."""
    if not _NEEDED:
        yield
        return
    before = sys.getrefcount(None)
    try:
        yield
    finally:
        lost = before - sys.getrefcount(None)
        if lost > 0:
            none = ctypes.py_object(None)
            for _ in range(lost):
                ctypes.pythonapi.Py_IncRef(none)
