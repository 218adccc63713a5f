"""``dispatcher app`` is registered and refuses a bad file with exit code 2 (no window left open)."""

from __future__ import annotations

from dispatcher.cli import build_parser
from dispatcher.commands import app as app_command


def test_app_subcommand_is_registered():
    args = build_parser().parse_args(["app", "sample.dshop", "--history", "h.sqlite"])
    assert args.func is app_command.run
    assert args.shop == "sample.dshop" and args.history == "h.sqlite"


def test_app_on_a_missing_file_exits_2(qapp, tmp_path, monkeypatch):
    monkeypatch.setenv("DISPATCHER_AUTOSAVE_DIR", str(tmp_path / "autosave"))
    from dispatcher.ui import app as ui_app
    from dispatcher.ui.messages import RecordingMessenger

    shown = []
    monkeypatch.setattr(ui_app, "default_messenger", lambda window: RecordingMessenger())
    code = ui_app.run(str(tmp_path / "nope.dshop"), str(tmp_path / "h.sqlite"),
                      on_error=shown.append)
    assert code == 2
    assert "file not found" in shown[0]
