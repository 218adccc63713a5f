"""The app lists every problem of a refused document: the first few in the message, all in
its scrollable details (the command line prints them all, see the bad-input catalogue)."""

from __future__ import annotations

import json

from PySide6.QtWidgets import QMessageBox
from ui_support import make_window, open_file

from dispatcher.ui.messages import Messenger


def test_every_problem_reaches_the_message_details(qtbot, tmp_path, monkeypatch):
    window = make_window(qtbot, tmp_path, monkeypatch)
    doc = {"format": "dispatcher-shop", "format_version": 1,
           "machines": [{"id": "M1", "name": "Press 1"}],
           "jobs": [{"id": f"J{i}", "name": f"WO-{i}"} for i in range(202)],
           "grid": {f"J{i}": {"M1": "fast"} for i in range(202)}}
    path = tmp_path / "bad.dshop"
    path.write_text(json.dumps(doc), encoding="utf-8")
    before = path.read_bytes()
    assert not open_file(qtbot, window, path)
    kind, _title, text = window.messenger.messages[-1]
    detail = window.messenger.details[-1]
    assert kind == "error" and "202 problems:" in text and "and 194 more" in text
    assert len(text.splitlines()) == 10
    listed = [line for line in detail.splitlines() if line.startswith("  grid, job 'WO-")]
    assert len(listed) == 202
    assert path.read_bytes() == before


def test_the_message_box_carries_the_detail(qtbot):
    box = Messenger(None).error_box("Cannot open file", "3 problems", "a\nb\nc")
    qtbot.addWidget(box)
    assert box.detailedText() == "a\nb\nc" and box.icon() == QMessageBox.Icon.Warning
    plain = Messenger(None).error_box("Cannot open file", "one problem")
    qtbot.addWidget(plain)
    assert plain.detailedText() == ""
