"""One error root: every error class derives from it, carries its exit code and source, and
the command line reports them all through one handler with its own hints.

The exit codes checked here are the documented ones (README, "Exit codes").
"""

from __future__ import annotations

import importlib
import inspect
import pkgutil
from datetime import datetime

import pytest

from dispatcher.cli import main
from dispatcher.commands.common import CliError
from dispatcher.engine import DispatchInputError, InfeasibleError, solve
from dispatcher.engine.certificate import CertificateError
from dispatcher.engine.fill_shift import ShiftCancelled, ShiftInfeasibleError, ShiftSearchError
from dispatcher.errors import (
    HINT_OTHER_HISTORY_FILE,
    BadInputError,
    DispatcherError,
    HistoryUnusableError,
    Infeasible,
    InternalError,
)
from dispatcher.history import DecisionNotFound, HistoryError, HistoryInputError, HistoryStore
from dispatcher.io.grid import GridFileError
from dispatcher.io.shopfile import ShopFileError, save_shop
from dispatcher.io.spreadsheet import ExportError
from dispatcher.shop import MUST, Job, Machine, Pin, PlanFormatError, Shift, Shop, ShopError
from dispatcher.shop.translate import ShopInfeasibleError

CORE_PACKAGES = ("engine", "shop", "io", "history", "sheet", "commands")


def _error_classes():
    """Every exception class defined in the core packages and the command line."""
    found = {}
    names = [
        "dispatcher.cli",
        "dispatcher.errors",
        "dispatcher.atomic",
        "dispatcher.jsonnum",
        "dispatcher.resources",
        "dispatcher.qt_platform",
    ]
    for package in CORE_PACKAGES:
        pkg = importlib.import_module(f"dispatcher.{package}")
        names += [m.name for m in pkgutil.iter_modules(pkg.__path__, f"{pkg.__name__}.")]
    for name in names:
        module = importlib.import_module(name)
        for _, obj in inspect.getmembers(module, inspect.isclass):
            # A private class (leading underscore) is a signal caught inside its own
            # module (history.postgres._Stale: retry on a fresh connection), never raised
            # to a caller, so it needs no exit code.
            if (
                issubclass(obj, BaseException)
                and obj.__module__ == module.__name__
                and not obj.__name__.startswith("_")
            ):
                found[f"{obj.__module__}.{obj.__qualname__}"] = obj
    return found


def test_every_error_class_of_the_core_derives_from_the_root():
    classes = _error_classes()
    assert len(classes) >= 17  # the classes that existed before the root, and the root's own
    strays = [name for name, cls in classes.items() if not issubclass(cls, DispatcherError)]
    assert strays == []


@pytest.mark.parametrize(
    "cls, code",
    [
        (DispatchInputError, 2),
        (GridFileError, 2),
        (ShopError, 2),
        (ShopFileError, 2),
        (PlanFormatError, 2),
        (HistoryInputError, 2),
        (DecisionNotFound, 2),
        (ExportError, 2),
        (CliError, 2),
        (BadInputError, 2),
        (InfeasibleError, 3),
        (ShiftInfeasibleError, 3),
        (ShopInfeasibleError, 3),
        (ShiftSearchError, 3),
        (HistoryError, 4),
        (HistoryUnusableError, 4),
        (CertificateError, 1),
        (ShiftCancelled, 130),
    ],
)
def test_exit_code_lives_on_the_class(cls, code):
    assert cls.exit_code == code


def test_the_three_infeasible_errors_are_one_family():
    for cls in (InfeasibleError, ShiftInfeasibleError, ShopInfeasibleError):
        assert issubclass(cls, Infeasible)
    with pytest.raises(Infeasible) as info:
        solve([[1.0], [2.0]], must_run=[0, 1])  # two must-run jobs, one machine
    assert list(info.value.jobs) == [0, 1] and list(info.value.machines) == [0]


def test_sheet_render_error_is_bad_input():
    from dispatcher.sheet.render import SheetRenderError  # Qt: imported only here

    assert issubclass(SheetRenderError, BadInputError)
    assert issubclass(SheetRenderError, RuntimeError)


def test_source_is_carried_and_prefixes_the_message():
    err = BadInputError("must be a number >= 0", source="grid.csv", row=3, column=28)
    assert str(err) == "grid.csv: row 3, column 28 (AB): must be a number >= 0"
    assert (err.source, err.row, err.column, err.message) == ("grid.csv", 3, 28, "must be a number >= 0")
    err = BadInputError("must be >= 0", source="shop.dshop", where="job 'WO-1', field 'due'")
    assert str(err) == "shop.dshop: job 'WO-1', field 'due': must be >= 0"
    assert str(BadInputError("plain")) == "plain"


def test_existing_errors_keep_their_wording_and_gain_their_source():
    grid = GridFileError("g.csv", "not a number", row=2, column=3)
    assert str(grid) == "g.csv: row 2, column 3 (C): not a number"
    assert (grid.source, grid.row, grid.column) == ("g.csv", 2, 3)
    assert str(GridFileError("g.csv", "empty file")) == "g.csv: empty file"
    from dispatcher.shop import Problem

    one = ShopError([Problem("job 'WO-1' (id J1), field 'due'", "not a time")], "s.dshop")
    assert str(one) == "s.dshop: job 'WO-1' (id J1), field 'due': not a time"
    assert one.where == "job 'WO-1' (id J1), field 'due'" and one.source == "s.dshop"
    two = ShopError([Problem("a", "x"), Problem("b", "y")], "s.dshop")
    assert str(two) == "s.dshop: 2 problems:\n  a: x\n  b: y"  # every problem, one per line


def _empty_history(tmp_path):
    path = tmp_path / "history.sqlite"
    path.write_bytes(b"")
    return path


def test_history_message_is_neutral_and_the_command_line_adds_its_option(tmp_path, capsys):
    path = _empty_history(tmp_path)
    with pytest.raises(HistoryError) as info:
        HistoryStore(path).list()
    assert "--history" not in str(info.value)
    assert str(info.value).endswith("choose another file")
    assert info.value.hint == HINT_OTHER_HISTORY_FILE
    assert main(["history", "list", "--history", str(path)]) == 4
    err = capsys.readouterr().err.strip()
    assert err == f"dispatcher: {info.value} with --history PATH"
    assert path.read_bytes() == b""  # left as it was


def test_internal_errors_keep_their_traceback(monkeypatch, tmp_path):
    import dispatcher.commands.solve as solve_command

    def broken(*args, **kwargs):
        raise CertificateError("plan is not optimal: the residual graph has a negative cycle")

    monkeypatch.setattr(solve_command, "solve", broken)
    grid = tmp_path / "g.csv"
    grid.write_text("job,M1\nA,1\n", encoding="utf-8")
    with pytest.raises(CertificateError):
        main(["solve", str(grid)])


def _rush_too_long(tmp_path):
    """Invented shop: one pinned rush job longer than any machine's shift (a pin is hard
    in a whole shift; a rush flag alone is a priority and would let the job wait)."""
    shop = Shop(name="Invented cell (test data)", shift=Shift(hours=8))
    shop.machines = [Machine("M1", "Laser")]
    shop.jobs = [Job("J1", "WO-1", run_hours=9, rush=True, due=datetime(2026, 3, 14, 9))]
    shop.grid[("J1", "M1")] = 5
    shop.pins = [Pin("J1", "M1", MUST)]
    path = tmp_path / "cell.dshop"
    save_shop(shop, path)
    return path


def test_same_error_same_line_from_every_command(tmp_path, capsys):
    """The whole-shift planner's refusal reads the same from ``solve`` and ``sheet``."""
    path = _rush_too_long(tmp_path)
    assert main(["solve", str(path), "--fill-shift"]) == 3
    from_solve = capsys.readouterr().err
    assert main(["sheet", str(path), "--fill-shift"]) == 3
    from_sheet = capsys.readouterr().err
    assert from_solve == from_sheet
    assert from_solve == (
        f"dispatcher: {path}: infeasible: jobs WO-1 are pinned to Laser: they need 9 h, it has 8 h free this shift\n"
    )


def test_one_round_infeasible_names_the_file_once(tmp_path, capsys):
    shop = Shop(name="Invented cell (test data)")
    shop.machines = [Machine("M1", "Laser")]
    shop.jobs = [Job("J1", "WO-1", rush=True), Job("J2", "WO-2", rush=True)]
    shop.grid = {("J1", "M1"): 1.0, ("J2", "M1"): 2.0}
    path = tmp_path / "cell.dshop"
    save_shop(shop, path)
    assert main(["solve", str(path)]) == 0  # rush is a priority: WO-2 waits, named
    capsys.readouterr()
    assert main(["solve", str(path), "--must-run", "WO-1,WO-2"]) == 3
    err = capsys.readouterr().err
    assert err.count(str(path)) == 1 and err.startswith(f"dispatcher: {path}: infeasible: ")
    assert "WO-1, WO-2" in err


def test_infeasible_grid_is_named(tmp_path, capsys):
    grid = tmp_path / "g.csv"
    grid.write_text("job,M1\nA,1\nB,2\n", encoding="utf-8")
    assert main(["solve", str(grid), "--must-run", "A,B"]) == 3
    assert capsys.readouterr().err == (
        f"dispatcher: {grid}: infeasible: must-run jobs A, B (2) compete for only 1 machine(s): M1\n"
    )


def test_internal_error_is_not_bad_input():
    assert not issubclass(InternalError, BadInputError)
    assert issubclass(CertificateError, InternalError)
