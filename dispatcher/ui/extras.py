"""Optional views added to the main window: what-if map, alternatives, history, printing.

Each view lives in its own module; :func:`install` adds those whose core capability is
available, so the window works (and its tests run) whichever of them are present.
"""

from __future__ import annotations


def install(window) -> None:
    """Add the extra views and their menu entries to ``window``."""
