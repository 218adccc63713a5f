"""Start the desktop app: ``dispatcher app [SHOP]`` or :func:`run`."""

from __future__ import annotations

import sys
from collections.abc import Sequence

from dispatcher import __version__, resources

ORG, APP = "dispatcher", "Dispatcher"

#: How long (seconds) a thread may hold Python's interpreter lock before handing it over.
#: Solves run in worker threads and partly in Python (building the engine's matrices);
#: every grid cell Qt paints calls back into Python on the GUI thread. With CPython's
#: default 5 ms the painter waits behind the worker and a 1000 x 200 grid stalled for
#: ~100 ms per repaint during a solve; 1 ms measured about half of that.
GUI_SWITCH_INTERVAL = 0.001


def make_application(argv: Sequence[str] | None = None):
    """The QApplication (created once), with names used by QSettings and autosave."""
    from PySide6.QtWidgets import QApplication

    sys.setswitchinterval(GUI_SWITCH_INTERVAL)
    app = QApplication.instance()
    if app is None:
        app = QApplication(list(argv or sys.argv[:1]))
    app.setOrganizationName(ORG)
    app.setApplicationName(APP)
    app.setApplicationVersion(__version__)
    app.setDesktopFileName(resources.APP_ID)
    icon = app_icon()
    if not icon.isNull():
        app.setWindowIcon(icon)
    return app


def settle_start_up_objects() -> None:
    """Take every object made while starting out of the garbage collector's full passes.

    Qt, numpy, scipy, pandas and the window leave about 90,000 tracked objects that live
    as long as the app; a full collection walks them all, on whichever thread happens to
    allocate, and on the GUI thread that measured 117-222 ms (a loaded 2-core machine,
    ``benchmarks/gui_stall.py``) - the longest stall left once solves and file reading
    had moved off the GUI thread. After :func:`gc.freeze` the same collection with a
    1000 x 200 shop open measured 1-23 ms. Called once, at start-up; objects made later
    (shops, plans) are collected as usual, and the frozen ones are freed by reference
    counting when they go (only start-up objects in reference cycles stay).
    """
    import gc

    gc.collect()
    gc.freeze()


def install_language(settings=None) -> str:
    """Install the interface language: Settings' choice, else the system's (QSettings key
    :data:`dispatcher.translation.KEY_LANGUAGE`). Returns the language installed."""
    from PySide6.QtCore import QSettings

    from dispatcher import translation

    settings = QSettings() if settings is None else settings
    chosen = str(settings.value(translation.KEY_LANGUAGE, "") or "")
    return translation.install(chosen or None, set_default_locale=True)


def app_icon():
    """The app icon at every installed size (empty when the installation lacks it)."""
    from PySide6.QtGui import QIcon, QPixmap

    icon = QIcon()
    for size in resources.ICON_SIZES:
        try:
            data = resources.icon_png(size).read_bytes()
        except resources.ResourceMissing:
            continue
        pixmap = QPixmap()
        if pixmap.loadFromData(data, "PNG"):
            icon.addPixmap(pixmap)
    return icon


def default_messenger(window):
    """Message boxes over the window (tests replace this)."""
    from dispatcher.ui.messages import Messenger

    return Messenger(window)


def start(path: str | None = None, history: str | None = None, on_error=None, settings=None):
    """The main window as ``dispatcher app [SHOP] [--history PATH]`` opens it, shown, or
    None when ``path`` cannot be opened (reported on stderr, or to ``on_error``).

    Without ``path`` the window offers to recover work autosaved by a session that did
    not close normally.
    """
    make_application()
    install_language()
    from dispatcher.ui.main_window import MainWindow
    from dispatcher.ui.messages import RecordingMessenger

    # The file named on the command line is opened without message boxes: a failure is
    # reported on stderr (exit code 2) instead of waiting on a dialog.
    window = MainWindow(history_path=history, messenger=RecordingMessenger(), settings=settings)
    settle_start_up_objects()
    opened = window.open_path(path, wait=True) if path else True
    window.messenger = default_messenger(window)
    if not path:
        window.files.recover()
    elif not opened:
        problem = window.last_problem or f"{path}: cannot be opened"
        (on_error or (lambda t: print(f"dispatcher: {t}", file=sys.stderr)))(problem)
        for runner in window.runners():
            runner.shutdown()
        window.files.shutdown()
        window.deleteLater()
        return None
    window.show()
    return window


def run(path: str | None = None, history: str | None = None, on_error=None) -> int:
    """Open the main window (on ``path`` if given) and run the event loop.

    A file that cannot be opened is reported (stderr, or ``on_error``) and gives exit code 2.
    """
    window = start(path, history, on_error)
    if window is None:
        return 2
    return make_application().exec()
