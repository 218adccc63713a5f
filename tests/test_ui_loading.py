"""Opening a file reads it off the GUI thread: large files in the worker process, which a
cancel stops at once; a bad file read there is refused with its file, row and column, and
the open document stays exactly as it was."""

from __future__ import annotations

import time

import pytest
from PySide6.QtCore import QTimer

from dispatcher.io.reading import read_document
from dispatcher.io.shopfile import shop_to_dict
from dispatcher.ui import files
from dispatcher.ui.grid_model import FIRST_MACHINE_COL
from ui_support import make_window, open_file, wait_plan


@pytest.fixture
def in_process(monkeypatch):
    """Every file counts as large: it is read in the worker process."""
    monkeypatch.setattr(files, "LOAD_IN_PROCESS_BYTES", 0)
    yield files._LOADER
    files._LOADER.stop()


def test_a_large_file_is_read_in_the_worker_process_while_the_window_runs(
    qtbot, tmp_path, monkeypatch, samples, in_process
):
    window = make_window(qtbot, tmp_path, monkeypatch)
    path = samples / "medium_machining_shop.dshop"
    ticks = []
    beat = QTimer()
    beat.timeout.connect(lambda: ticks.append(time.perf_counter()))
    beat.start(10)
    assert open_file(qtbot, window, path)
    beat.stop()
    assert in_process.running()  # the worker process did the reading
    assert len(ticks) >= 3  # the GUI thread kept turning meanwhile
    assert shop_to_dict(window.doc.shop) == shop_to_dict(read_document(path))
    assert window.doc.path == path and not window.doc.dirty
    wait_plan(qtbot, window)
    assert window.plan is not None


def test_a_bad_file_read_in_the_worker_process_names_file_row_and_column(
    qtbot, tmp_path, monkeypatch, samples, in_process
):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")
    assert window.model.setData(window.model.index(0, FIRST_MACHINE_COL), "41")
    before, shop = shop_to_dict(window.doc.shop), window.doc.shop
    bad = tmp_path / "bad.csv"
    bad.write_text("job,Press 1,Press 2\nWO-1,1,2\nWO-2,3,4\nWO-3,x,five\n", encoding="utf-8")
    assert not open_file(qtbot, window, bad)
    kind, _title, text = window.messenger.messages[-1]
    assert kind == "error" and str(bad) in text and "row 4, column 3" in text and "'five'" in text
    assert window.doc.shop is shop and window.doc.dirty
    assert shop_to_dict(window.doc.shop) == before
    assert window.last_problem == text


def test_cancelling_a_long_read_keeps_the_document_and_stops_the_process(
    qtbot, tmp_path, monkeypatch, samples, in_process
):
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "small_moulding_cell.dshop")
    before, shop = shop_to_dict(window.doc.shop), window.doc.shop
    in_process.stop()  # a fresh process must start: the read takes a while
    with qtbot.waitSignal(window.files.loaded, timeout=5_000) as ended:
        assert window.open_path(samples / "large_print_plant.dshop")
        qtbot.waitUntil(in_process.running, timeout=5_000)
        assert window.files.is_loading()
        window.cancel_solve()  # Esc: every background job, the read too
    assert ended.args == [False]
    assert not window.files.is_loading()
    qtbot.waitUntil(lambda: not in_process.running(), timeout=5_000)
    assert window.doc.shop is shop and shop_to_dict(window.doc.shop) == before
    assert "cancelled" in window.statusBar().currentMessage()
    # The next open starts a new process and works.
    assert open_file(qtbot, window, samples / "medium_machining_shop.dshop")
    assert window.doc.path == samples / "medium_machining_shop.dshop"


def test_a_big_shop_is_autosaved_by_a_worker_process(qtbot, tmp_path, monkeypatch, samples):
    monkeypatch.setattr(files, "AUTOSAVE_IN_PROCESS_CELLS", 0)
    window = make_window(qtbot, tmp_path, monkeypatch, samples / "medium_machining_shop.dshop")
    assert window.model.setData(window.model.index(1, FIRST_MACHINE_COL + 1), "77")
    try:
        window.files.autosave_now(wait=True)
        assert files._AUTOSAVER.running()  # the copy was written over there
    finally:
        files._AUTOSAVER.stop()
    copy = window.files.autosave_path()
    assert shop_to_dict(read_document(copy)) == shop_to_dict(window.doc.shop)
