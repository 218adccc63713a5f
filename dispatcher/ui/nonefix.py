"""Keep ``None`` (and ``True``/``False``) alive despite a reference leak in PySide6 6.12
on CPython 3.11.

With PySide6/shiboken6 6.12.0 on CPython 3.11, each call of a Qt method returning
``void`` (``QLabel.setText``, ``QObject.setObjectName``...) gives back ``None`` without
taking a reference to it, so ``sys.getrefcount(None)`` falls by one per call (measured:
1000 ``setText`` calls, 1000 references lost). CPython before 3.12 counts references to
``None``; a desktop session makes many thousands of such calls, and when the count reaches
zero the interpreter aborts ("none_dealloc: deallocating None").

The sheet package guards its own bounded blocks of calls
(:func:`dispatcher.sheet.refguard.none_refcount_guard`); an interactive window has no
bounded block, so :func:`keep_none_alive` adds a very large number of references to
``None`` once, doing by hand what CPython 3.12 does for every ``None`` (PEP 683, immortal
objects). ``None`` is a static object that is never freed, so extra references cannot leak
memory. On Python 3.12 and later this does nothing.
"""

from __future__ import annotations

import ctypes
import sys

#: References added once; at the measured rate this outlasts any session by far.
EXTRA_REFERENCES = 1 << 40

_done = False


def keep_none_alive() -> None:
    """Add :data:`EXTRA_REFERENCES` references to ``None``, ``True`` and ``False`` (once per
    process; 3.11 only)."""
    global _done
    if _done or sys.version_info >= (3, 12):
        return
    # ob_refcnt is the first field of every PyObject (Include/object.h); the GIL is held.
    # True and False are static singletons too, and lose references the same way in a
    # long session (seen as "bool_dealloc: deallocating True or False" at exit).
    for singleton in (None, True, False):
        ctypes.c_ssize_t.from_address(id(singleton)).value += EXTRA_REFERENCES
    _done = True
