"""The background runner: only the newest result is shown, stale ones are discarded,
cancellation is explicit, errors come back as signals (never escape the event loop)."""

from __future__ import annotations

import threading

from dispatcher.ui.worker import BackgroundRunner


def test_a_stale_result_is_discarded(qtbot):
    runner = BackgroundRunner()
    gate = threading.Event()
    results = []
    runner.finished.connect(results.append)

    def slow(cancel):
        gate.wait(10)
        return "old"

    runner.submit(slow)
    runner.submit(lambda cancel: "middle")   # replaced by the next request before it starts
    runner.submit(lambda cancel: "new")
    gate.set()
    qtbot.waitUntil(lambda: not runner.is_busy(), timeout=10_000)
    runner.wait_idle()
    assert results == ["new"]


def test_cancel_discards_the_running_result_and_sets_its_event(qtbot):
    runner = BackgroundRunner()
    seen = threading.Event()
    started = threading.Event()
    results = []
    runner.finished.connect(results.append)

    def long(cancel):
        started.set()
        cancel.wait(10)
        seen.set()
        return "too late"

    runner.submit(long)
    assert started.wait(5)
    with qtbot.waitSignal(runner.cancelled, timeout=2000):
        runner.cancel()
    qtbot.waitUntil(lambda: not runner.is_busy(), timeout=10_000)
    assert seen.is_set() and results == []


def test_a_slow_job_reports_slow_and_errors_arrive_as_signals(qtbot):
    runner = BackgroundRunner()
    gate = threading.Event()
    with qtbot.waitSignal(runner.slow, timeout=3000):
        runner.submit(lambda cancel: gate.wait(10))
    gate.set()
    qtbot.waitUntil(lambda: not runner.is_busy(), timeout=10_000)

    def broken(cancel):
        raise ValueError("bad numbers")

    with qtbot.waitSignal(runner.failed, timeout=5000) as blocker:
        runner.submit(broken)
    assert isinstance(blocker.args[0], ValueError)


def test_a_burst_of_deferred_requests_prepares_and_runs_once(qtbot):
    runner = BackgroundRunner()
    gate = threading.Event()
    results, prepared = [], []
    runner.finished.connect(results.append)
    state = {"n": 0}

    def prepare():
        prepared.append(state["n"])          # the state when the delay ends
        n = state["n"]
        return lambda cancel: f"solved {n}"

    runner.submit(lambda cancel: gate.wait(10) and "stale")
    for n in range(1, 6):                     # five edits in a row
        state["n"] = n
        runner.submit_deferred(prepare, delay_ms=50)
        assert runner.is_busy()
    gate.set()
    qtbot.waitUntil(lambda: not runner.is_busy(), timeout=10_000)
    runner.wait_idle()
    assert prepared == [5] and results == ["solved 5"]
    runner.submit_deferred(prepare, delay_ms=50)
    runner.cancel()                            # a cancel drops a deferred request too
    qtbot.wait(120)
    assert prepared == [5] and not runner.is_busy()
