"""Start the desktop app: ``dispatcher app [SHOP]`` or :func:`run`."""

from __future__ import annotations

import sys
from collections.abc import Sequence

from dispatcher import __version__

ORG, APP = "dispatcher", "Dispatcher"


def make_application(argv: Sequence[str] | None = None):
    """The QApplication (created once), with names used by QSettings and autosave."""
    from PySide6.QtWidgets import QApplication

    app = QApplication.instance()
    if app is None:
        app = QApplication(list(argv or sys.argv[:1]))
    app.setOrganizationName(ORG)
    app.setApplicationName(APP)
    app.setApplicationVersion(__version__)
    return app


def run(path: str | None = None, history: str | None = None) -> int:
    """Open the main window (on ``path`` if given) and run the event loop."""
    app = make_application()
    from dispatcher.ui.main_window import MainWindow

    window = MainWindow(history_path=history)
    if not path:
        window.files.recover()
    elif not window.open_path(path):
        return 2
    window.show()
    return app.exec()
