"""Run core computations off the GUI thread and hand back plain data.

:class:`BackgroundRunner` keeps at most one computation running and at most one waiting:
a request made while another runs replaces any earlier waiting request (only the newest
edit matters). Every request carries a generation number; a result whose generation is
not the newest is discarded, so a slow, stale solve can never overwrite a newer plan.

Cancellation is explicit: :meth:`BackgroundRunner.cancel` sets the running job's cancel
event (computations that look at it stop early), discards its result and reports
``cancelled``. A newer request also sets the running job's cancel event (its result would
be discarded anyway), so a superseded whole-shift solve or ranking stops early instead of
holding the pool thread. :meth:`BackgroundRunner.shutdown` cancels without waiting. Long
computations (over :data:`PROGRESS_AFTER_MS`) report ``slow`` so the
window can show progress and a cancel button.

:meth:`BackgroundRunner.submit_deferred` waits :data:`DEFER_MS` before it asks for the
computation, so a burst of edits (typing, undo held down) is copied and solved once, for
the newest state, instead of once per edit; the runner counts as busy meanwhile.

:class:`WorkerProcess` runs a Qt-free core call in a separate Python process (a call
that holds the interpreter lock for long, such as parsing a big file, would stop the
window's thread otherwise), from a background thread of a runner, and stops the process
at once when the runner's cancel event is set.
"""

from __future__ import annotations

import atexit
import multiprocessing
import threading
import traceback
from collections.abc import Callable
from dataclasses import dataclass
from typing import Any

from PySide6.QtCore import QObject, QRunnable, QThreadPool, QTimer, Signal, Slot

from dispatcher.errors import Cancelled

#: A computation taking longer than this shows progress and can be cancelled.
PROGRESS_AFTER_MS = 500
#: A deferred request waits this long, collecting the edits made meanwhile (common practice
#: for "live" recomputation: shorter than a person notices, longer than key repeat).
DEFER_MS = 100


@dataclass
class _Request:
    generation: int
    label: str
    fn: Callable[..., Any]
    with_progress: bool = False


class _Signals(QObject):
    done = Signal(int, object)       # generation, result (plain data)
    failed = Signal(int, object)     # generation, exception (the core's own error types)
    progress = Signal(int, str)      # generation, short text of the stage reached


class _Job(QRunnable):
    def __init__(self, request: _Request, cancel: threading.Event, signals: _Signals):
        super().__init__()
        self.setAutoDelete(True)
        self._request = request
        self._cancel = cancel
        self._signals = signals

    def run(self) -> None:  # runs in a pool thread
        request = self._request
        try:
            if request.with_progress:
                result = request.fn(self._cancel,
                                    lambda text: self._signals.progress.emit(request.generation, str(text)))
            else:
                result = request.fn(self._cancel)
        except Exception as exc:  # reported to the GUI thread, never lost
            exc.__traceback_text__ = traceback.format_exc()  # type: ignore[attr-defined]
            self._signals.failed.emit(self._request.generation, exc)
            return
        self._signals.done.emit(self._request.generation, result)


class BackgroundRunner(QObject):
    """One-at-a-time runner with stale-result discarding. Signals carry plain data.

    Signals: ``started(label)``, ``slow(label)`` after :data:`PROGRESS_AFTER_MS`,
    ``finished(result)`` for the newest request only, ``failed(exception)``,
    ``cancelled()``, ``idle()`` when nothing runs or waits, ``progress(text)`` from
computations submitted ``with_progress``.
    """

    started = Signal(str)
    slow = Signal(str)
    finished = Signal(object)
    failed = Signal(object)
    progress = Signal(str)
    cancelled = Signal()
    idle = Signal()

    def __init__(self, parent: QObject | None = None, pool: QThreadPool | None = None):
        super().__init__(parent)
        self._pool = pool or QThreadPool.globalInstance()
        # No Qt parent: each job keeps a reference, so a job finishing after the runner
        # (and its window) is gone emits on a live object that nobody listens to.
        self._signals = _Signals()
        self._signals.done.connect(self._on_done)
        self._signals.failed.connect(self._on_failed)
        self._signals.progress.connect(self._on_progress)
        self._generation = 0
        self._running: _Request | None = None
        self._running_cancel: threading.Event | None = None
        self._pending: _Request | None = None
        self._slow_timer = QTimer(self)
        self._slow_timer.setSingleShot(True)
        self._slow_timer.setInterval(PROGRESS_AFTER_MS)
        self._slow_timer.timeout.connect(self._on_slow)
        self._deferred: tuple | None = None
        self._defer_timer = QTimer(self)
        self._defer_timer.setSingleShot(True)
        self._defer_timer.timeout.connect(self._on_deferred)

    @property
    def generation(self) -> int:
        """Number of the newest request."""
        return self._generation

    def is_busy(self) -> bool:
        return self._running is not None or self._pending is not None or self._deferred is not None

    def submit_deferred(self, prepare: Callable[[], Callable[..., Any]], label: str = "solving",
                        with_progress: bool = False, delay_ms: int = DEFER_MS) -> None:
        """Like :meth:`submit`, but ``prepare()`` (on the GUI thread, returning the function
        to run) is called ``delay_ms`` after the first of a burst of calls; later calls in
        the burst only replace ``prepare``. What runs now is superseded at once."""
        self._deferred = (prepare, label, with_progress)
        self._pending = None
        self._generation += 1              # the running job's result is stale already
        if self._running_cancel is not None:
            self._running_cancel.set()
        if not self._defer_timer.isActive():
            self._defer_timer.start(max(0, int(delay_ms)))
            self.started.emit(label)

    @Slot()
    def _on_deferred(self) -> None:
        deferred, self._deferred = self._deferred, None
        if deferred is None:
            return
        prepare, label, with_progress = deferred
        self.submit(prepare(), label, with_progress)

    def submit(self, fn: Callable[..., Any], label: str = "solving", with_progress: bool = False) -> int:
        """Queue ``fn(cancel_event)`` (or ``fn(cancel_event, report)`` with ``with_progress``,
        where ``report(text)`` may be called from the worker); returns its generation.
        Older waiting requests are dropped."""
        self._drop_deferred()
        self._generation += 1
        self._pending = _Request(self._generation, label, fn, with_progress)
        if self._running_cancel is not None:
            self._running_cancel.set()   # superseded: its result would be dropped
        if self._running is None:
            self._start_pending()
        return self._generation

    def cancel(self) -> None:
        """Stop waiting for the running computation and drop any waiting one."""
        self._pending = None
        self._drop_deferred()
        if self._running_cancel is not None:
            self._running_cancel.set()
        if self._running is not None:
            self._generation += 1   # whatever comes back is now stale
            self._slow_timer.stop()
            self.cancelled.emit()

    def discard(self) -> None:
        """Drop the waiting request and ignore the running one's result, without reporting
        a cancellation (used when the window already shows the right plan)."""
        self._pending = None
        self._drop_deferred()
        self._generation += 1
        self._slow_timer.stop()

    def shutdown(self) -> None:
        """Cancel the running job and drop the waiting one, reporting nothing (closing).
        The runner is idle at once; the cancelled job's result, if it still comes, is
        dropped."""
        self._pending = None
        self._drop_deferred()
        if self._running_cancel is not None:
            self._running_cancel.set()
        self._running = None
        self._running_cancel = None
        self._generation += 1
        self._slow_timer.stop()

    def _drop_deferred(self) -> None:
        self._deferred = None
        self._defer_timer.stop()

    def wait_idle(self, timeout_ms: int = 30_000) -> bool:
        """Block until the pool thread is done (for tests only)."""
        return self._pool.waitForDone(timeout_ms)

    def _start_pending(self) -> None:
        request, self._pending = self._pending, None
        if request is None:
            if self._deferred is None:
                self.idle.emit()
            return
        self._running = request
        self._running_cancel = threading.Event()
        self.started.emit(request.label)
        self._slow_timer.start()
        self._pool.start(_Job(request, self._running_cancel, self._signals))

    def _finish_running(self) -> None:
        self._running = None
        self._running_cancel = None
        self._slow_timer.stop()
        self._start_pending()

    @Slot(int, object)
    def _on_done(self, generation: int, result: Any) -> None:
        fresh = generation == self._generation
        self._finish_running()
        if fresh:
            self.finished.emit(result)

    @Slot(int, object)
    def _on_failed(self, generation: int, exc: Exception) -> None:
        fresh = generation == self._generation
        self._finish_running()
        if fresh:
            self.failed.emit(exc)

    @Slot(int, str)
    def _on_progress(self, generation: int, text: str) -> None:
        if generation == self._generation:
            self.progress.emit(text)

    @Slot()
    def _on_slow(self) -> None:
        if self._running is not None:
            self.slow.emit(self._running.label)


class WorkerProcess:
    """One spawned Python process for core calls, started on first use; thread-safe.

    :meth:`call` blocks its (background) thread until the result is back, looking at the
    cancel event every :attr:`poll_s`; when it is set the process is terminated (a parse
    cannot be interrupted any other way) and :class:`~dispatcher.errors.Cancelled` is
    raised. The next call starts a fresh process. ``fn`` and its arguments and result
    must pickle (module-level functions, plain data).
    """

    poll_s = 0.05

    def __init__(self):
        self._lock = threading.Lock()
        self._pool = None
        atexit.register(self.stop)

    def call(self, fn: Callable[..., Any], *args, cancel: threading.Event | None = None) -> Any:
        with self._lock:
            if self._pool is None:
                self._pool = multiprocessing.get_context("spawn").Pool(1)
            pool = self._pool
        pending = pool.apply_async(fn, args)
        while True:
            try:
                return pending.get(timeout=self.poll_s)
            except multiprocessing.TimeoutError:
                if cancel is not None and cancel.is_set():
                    self.stop(pool)
                    raise Cancelled("stopped on request") from None

    def running(self) -> bool:
        """True while the process exists (started and not stopped)."""
        return self._pool is not None

    def stop(self, pool=None) -> None:
        """Terminate the process (``pool``: only if it is still that one)."""
        with self._lock:
            if self._pool is None or (pool is not None and pool is not self._pool):
                return
            pool, self._pool = self._pool, None
        pool.terminate()
