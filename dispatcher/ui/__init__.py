"""The desktop app (PySide6 widgets). The only package that imports Qt widgets.

Importing it applies :func:`dispatcher.ui.nonefix.keep_none_alive`, which protects the
interpreter from a reference leak in PySide6 6.12 on CPython 3.11 (see that module).
"""

from dispatcher.ui.nonefix import keep_none_alive

keep_none_alive()
