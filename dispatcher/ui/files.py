"""Files for the window: new, open, save, save as, grid import/export, recent files,
the unsaved-changes prompt, and autosave with recovery after a crash.

Opening reads the file off the GUI thread (:meth:`FileController.open_path` returns at
once; ``loaded(bool)`` says how it ended): in a background thread, or for a file over
:data:`LOAD_IN_PROCESS_BYTES` in a worker process, which a cancel (Esc) stops at once. A
file that cannot be read shows one message naming the file and the problem and leaves the
open document exactly as it was. Autosave writes a copy of the unsaved document
to a per-user folder every :data:`AUTOSAVE_MS` in a background thread (the GUI thread only
takes a cheap snapshot; a shop over :data:`AUTOSAVE_IN_PROCESS_CELLS` is written by a
worker process); a clean save or close removes it, so a copy found at start-up
means the app did not close normally and the user is offered to recover it.
"""

from __future__ import annotations

import hashlib
import os
from pathlib import Path

from PySide6.QtCore import QObject, QRunnable, QSettings, QStandardPaths, QThreadPool, QTimer, Signal

from dispatcher.io.grid import GridFileError
from dispatcher.io.reading import problem_texts, read_document, read_document_packed, write_copy_packed
from dispatcher.io.shopfile import SHOP_SUFFIX, load_shop, save_shop
from dispatcher.io.spreadsheet import export_grid, export_plan, import_grid_file
from dispatcher.shop import Shop, ShopError
from dispatcher.shop.packing import pack_shop, unpack_shop
from dispatcher.errors import Cancelled
from dispatcher.ui.document import ShopDocument
from dispatcher.ui.messages import CANCEL, SAVE, Messenger
from dispatcher.ui.settings_keys import KEY_RECENT
from dispatcher.ui.worker import BackgroundRunner, WorkerProcess

AUTOSAVE_MS = 60_000
# Files larger than this are parsed in the worker process: parsing the 2.5 MB document
# of a 1000 x 200 shop holds the interpreter lock for about 0.7 s, which in a thread
# would stop the window as surely as on the GUI thread. Smaller files (every sample
# shop) are read in a background thread, quicker than starting the process.
LOAD_IN_PROCESS_BYTES = 1_000_000
_LOADER = WorkerProcess()
# Shops with more grid cells than this are autosaved by a worker process: writing the
# document is mostly one json call that holds the interpreter lock (and so the window)
# for about as long as parsing it; the autosave thread only packs the copy.
AUTOSAVE_IN_PROCESS_CELLS = 50_000
_AUTOSAVER = WorkerProcess()


def read_for_window(path: Path, cancel=None) -> tuple:
    """``("ok", shop)`` or ``("refused", text, detail)``: the file read off the GUI
    thread (in the worker process when it is large)."""
    try:
        size = path.stat().st_size
    except OSError:
        size = 0   # the reader reports the missing or unreadable file itself
    if size > LOAD_IN_PROCESS_BYTES:
        outcome = _LOADER.call(read_document_packed, str(path), cancel=cancel)
        if outcome[0] == "ok":
            return "ok", unpack_shop(outcome[1])
        return outcome
    try:
        return "ok", read_document(path)
    except (ShopError, GridFileError) as exc:
        return ("refused",) + problem_texts(exc)
MAX_RECENT = 8
RECENT_KEY = KEY_RECENT


def autosave_folder() -> Path:
    """Per-user folder for autosaved copies (``DISPATCHER_AUTOSAVE_DIR`` overrides)."""
    env = os.environ.get("DISPATCHER_AUTOSAVE_DIR")
    if env:
        return Path(env)
    base = QStandardPaths.writableLocation(QStandardPaths.StandardLocation.AppLocalDataLocation)
    return Path(base or Path.home() / ".dispatcher") / "autosave"


class _AutosaveJob(QRunnable):
    def __init__(self, shop: Shop, target: Path):
        super().__init__()
        self._shop, self._target = shop, target

    def run(self) -> None:
        # An autosave that cannot be written must never disturb the user's work.
        try:
            if len(self._shop.grid) > AUTOSAVE_IN_PROCESS_CELLS:
                _AUTOSAVER.call(write_copy_packed, pack_shop(self._shop), str(self._target))
                return
            self._target.parent.mkdir(parents=True, exist_ok=True)
            save_shop(self._shop, self._target, check=False)
        except (OSError, ShopError, Cancelled):
            pass


class FileController(QObject):
    """File actions on one :class:`ShopDocument`. ``recent_changed`` when the list changes."""

    recent_changed = Signal()
    status = Signal(str)
    problem = Signal(str)   # a file could not be opened or saved (the message shown)
    loaded = Signal(bool)   # an open_path ended: True opened, False refused, kept or cancelled

    def __init__(self, doc: ShopDocument, messenger: Messenger, settings: QSettings,
                 parent: QObject | None = None):
        super().__init__(parent)
        self.doc = doc
        self.messenger = messenger
        self.settings = settings
        self._autosave_timer = QTimer(self)
        self._autosave_timer.setInterval(AUTOSAVE_MS)
        self._autosave_timer.timeout.connect(self.autosave_now)
        self._autosave_timer.start()
        self._pool = QThreadPool(self)
        self._pool.setMaxThreadCount(1)
        self._opening = Path()
        self._loading = False
        self.loaded.connect(self._loaded)
        self.loader = BackgroundRunner(self, QThreadPool(self))
        self.loader.finished.connect(self._on_read)
        self.loader.failed.connect(self._on_read_failed)
        self.loader.cancelled.connect(self._on_read_cancelled)
        self.loader.slow.connect(
            lambda _: self.status.emit(self.tr("Opening {path}\u2026 (Esc cancels)").format(path=self._opening)))

    def set_autosave_minutes(self, minutes: int) -> None:
        """Autosave every ``minutes`` (from the settings; the timer restarts)."""
        self._autosave_timer.start(max(1, int(minutes)) * 60_000)

    def autosave_interval_ms(self) -> int:
        return self._autosave_timer.interval()

    # ---- recent files ---------------------------------------------------------------------
    def recent(self) -> list[str]:
        value = self.settings.value(RECENT_KEY, [])
        if isinstance(value, str):
            value = [value]
        return [str(v) for v in (value or [])]

    def _remember(self, path: Path) -> None:
        items = [p for p in self.recent() if p != str(path)]
        self.settings.setValue(RECENT_KEY, [str(path)] + items[:MAX_RECENT - 1])
        self.recent_changed.emit()

    # ---- unsaved changes ------------------------------------------------------------------
    def maybe_keep_changes(self) -> bool:
        """True when it is fine to replace the document (saved, discarded, or not dirty)."""
        if not self.doc.dirty:
            return True
        name = self.doc.path.name if self.doc.path else (self.doc.shop.name or self.tr("the new shop"))
        answer = self.messenger.ask_save(self.tr("{name} has changes that are not saved. Save them?").format(name=name))
        if answer == CANCEL:
            return False
        if answer == SAVE:
            return self.save()
        self.discard_autosave()
        return True

    # ---- new / open -----------------------------------------------------------------------
    def new(self, shop: Shop | None = None) -> bool:
        if not self.maybe_keep_changes():
            return False
        self.discard_autosave()
        self.doc.replace(shop or Shop(name=self.tr("New shop")), None)
        return True

    def open_path(self, path: str | os.PathLike, wait: bool = False) -> bool:
        """Open a shop document or a grid file; on failure a message and the document as
        it was. The file is read in the background and ``loaded(bool)`` is emitted when
        done (True: opened); returns True once the read has started. With ``wait`` the
        call reads at once and returns whether the file was opened (start-up)."""
        path = Path(path)
        self.status.emit(self.tr("Opening {path}\u2026").format(path=path))
        if wait:
            self.loader.cancel()
            return self._finish_open(path, read_for_window(path))
        self._opening = path
        self._loading = True
        self.loader.submit(lambda cancel: read_for_window(path, cancel), "opening")
        return True

    def is_loading(self) -> bool:
        """True from :meth:`open_path` until ``loaded`` (a cancelled read is over at once,
        though its process may take a moment to stop)."""
        return self._loading

    def cancel_open(self) -> None:
        """Stop reading the file being opened (the document stays as it is)."""
        self.loader.cancel()

    def _loaded(self, _opened: bool) -> None:
        self._loading = False

    def _on_read(self, outcome: tuple) -> None:
        self._finish_open(self._opening, outcome)

    def _on_read_failed(self, exc: Exception) -> None:
        text = self.tr("{path}: cannot be read ({error})").format(path=self._opening, error=exc)
        self.messenger.error(self.tr("Cannot open file"), text)
        self.problem.emit(text)
        self.status.emit(self.tr("Not opened: {problem}").format(problem=text))
        self.loaded.emit(False)

    def _on_read_cancelled(self) -> None:
        self.status.emit(self.tr("Not opened: reading {path} was cancelled").format(path=self._opening))
        self.loaded.emit(False)

    def _finish_open(self, path: Path, outcome: tuple) -> bool:
        if outcome[0] != "ok":
            _, short, detail = outcome
            self.messenger.error(self.tr("Cannot open file"), short, detail)
            self.problem.emit(short)
            self.status.emit(self.tr("Not opened: {problem}").format(problem=short.splitlines()[0]))
            self.loaded.emit(False)
            return False
        if not self.maybe_keep_changes():
            self.status.emit(self.tr("Not opened: {problem}").format(problem=path))
            self.loaded.emit(False)
            return False
        self.discard_autosave()
        is_document = path.suffix.lower() == SHOP_SUFFIX
        self.doc.replace(outcome[1], path if is_document else None)
        if is_document:
            self._remember(path)
        self.status.emit(self.tr("Opened {path}").format(path=path))
        self.loaded.emit(True)
        return True

    # ---- save -----------------------------------------------------------------------------
    def save(self) -> bool:
        if self.doc.path is None or self.doc.path.suffix.lower() != SHOP_SUFFIX:
            return False
        return self.save_as(self.doc.path)

    def save_as(self, path: str | os.PathLike) -> bool:
        path = Path(path)
        if path.suffix.lower() != SHOP_SUFFIX:
            path = path.with_suffix(path.suffix + SHOP_SUFFIX if path.suffix else SHOP_SUFFIX)
        try:
            save_shop(self.doc.shop, path)
        except ShopError as exc:
            short, detail = problem_texts(exc)
            self.messenger.error(self.tr("Cannot save"), short, detail)
            self.problem.emit(short)
            self.status.emit(self.tr("Not saved: {problem}").format(problem=short.splitlines()[0]))
            return False
        self.discard_autosave()
        self.doc.set_path(path)
        self._remember(path)
        self.status.emit(self.tr("Saved {path}").format(path=path))
        return True

    def export_grid(self, path: str | os.PathLike) -> bool:
        """Write the grid (values, ``x`` for cannot run) to CSV or XLSX (the grid layout)."""
        try:
            export_grid(self.doc.shop, Path(path))
        except (OSError, ValueError) as exc:
            self.messenger.error(self.tr("Cannot export"), f"{path}: {exc}")
            return False
        self.status.emit(self.tr("Exported the grid to {path}").format(path=path))
        return True

    def export_plan(self, plan, path: str | os.PathLike) -> bool:
        """Write a plan to CSV or XLSX (the core's plan table)."""
        try:
            export_plan(plan, Path(path), self.doc.shop)
        except (OSError, ValueError) as exc:
            self.messenger.error(self.tr("Cannot export"), f"{path}: {exc}")
            return False
        self.status.emit(self.tr("Exported the plan to {path}").format(path=path))
        return True

    def import_into(self, path: str | os.PathLike) -> str | None:
        """Merge a grid file into the open shop by job and machine names, as one undoable
        edit; returns the core's report (None, with a message, when the file is refused)."""
        try:
            report = import_grid_file(Path(path), self.doc.shop.copy())
        except (GridFileError, ShopError, OSError) as exc:
            self.messenger.error(self.tr("Cannot import"), str(exc))
            self.problem.emit(str(exc))
            return None
        from dispatcher.ui.edits import ReplaceShop
        self.doc.undo_stack.push(ReplaceShop(self.doc, report.shop, self.tr("Import {file}").format(
            file=Path(path).name)))
        summary = report.summary()
        self.messenger.info(self.tr("Grid imported"), f"{path}:\n{summary}")
        self.status.emit(self.tr("Imported {path}").format(path=path))
        return summary

    # ---- autosave -------------------------------------------------------------------------
    def autosave_path(self) -> Path:
        key = str(self.doc.path.resolve()) if self.doc.path else f"untitled-{os.getpid()}"
        digest = hashlib.sha1(key.encode("utf-8")).hexdigest()[:16]
        return autosave_folder() / f"{digest}{SHOP_SUFFIX}"

    def autosave_now(self, wait: bool = False) -> None:
        if not self.doc.dirty:
            return
        self._pool.start(_AutosaveJob(self.doc.shop.copy(), self.autosave_path()))
        if wait:
            self._pool.waitForDone(30_000)

    def discard_autosave(self) -> None:
        self._pool.waitForDone(30_000)
        try:
            self.autosave_path().unlink(missing_ok=True)
        except OSError:
            pass

    def recover(self) -> bool:
        """Offer the newest autosaved copy left by a session that did not close normally."""
        folder = autosave_folder()
        if not folder.is_dir():
            return False
        copies = sorted(folder.glob(f"*{SHOP_SUFFIX}"), key=lambda p: p.stat().st_mtime, reverse=True)
        if not copies:
            return False
        newest = copies[0]
        if not self.messenger.ask_yes_no(
                self.tr("Recover unsaved work"),
                self.tr("The app did not close normally last time. Recover the unsaved copy "
                        "saved at {time}?").format(time=newest.stat().st_mtime and _mtime_text(newest))):
            return False
        try:
            shop = load_shop(newest, check=False)
        except ShopError as exc:
            self.messenger.error(self.tr("Cannot recover"), str(exc))
            return False
        self.doc.replace(shop, None)
        # The recovered shop is unsaved work: mark it dirty so closing asks to save it.
        self.doc.undo_stack.resetClean()
        self.doc.dirty_changed.emit(True)
        for p in copies:
            p.unlink(missing_ok=True)
        self.status.emit(self.tr("Recovered unsaved work; save it under a name"))
        return True

    def shutdown(self) -> None:
        self._autosave_timer.stop()
        self.loader.shutdown()
        self._pool.waitForDone(30_000)


def _mtime_text(path: Path) -> str:
    from datetime import datetime

    from dispatcher.ui.format import when_text
    return when_text(datetime.fromtimestamp(path.stat().st_mtime))
