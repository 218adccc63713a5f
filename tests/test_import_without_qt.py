"""The core imports without Qt: importing the engine, shop, io, history and sheet content
(content.py, build.py), the command line and its commands loads no PySide6 module.

Run in a fresh interpreter (a subprocess), since this test process has Qt loaded already.
"""

from __future__ import annotations

import os
import subprocess
import sys
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent

QT_FREE = [
    "dispatcher.errors",
    "dispatcher.jsonnum",
    "dispatcher.atomic",
    "dispatcher.engine",
    "dispatcher.shop",
    "dispatcher.io",
    "dispatcher.history",
    "dispatcher.sheet.content",
    "dispatcher.sheet.build",
    "dispatcher.cli",
]


def _submodules(package: str) -> list[str]:
    folder = ROOT.joinpath(*package.split("."))
    return [f"{package}.{p.stem}" for p in sorted(folder.glob("*.py")) if p.stem != "__init__"]


MODULES = QT_FREE + [
    m
    for pkg in ("dispatcher.engine", "dispatcher.shop", "dispatcher.io", "dispatcher.history", "dispatcher.commands")
    for m in _submodules(pkg)
]


def _loaded_qt(modules: list[str]) -> list[str]:
    code = (
        "import importlib, sys\n"
        f"for name in {modules!r}:\n"
        "    importlib.import_module(name)\n"
        "print(' '.join(sorted(m for m in sys.modules if m.split('.')[0] == 'PySide6')))\n"
    )
    env = {**os.environ, "PYTHONPATH": str(ROOT) + os.pathsep + os.environ.get("PYTHONPATH", "")}
    done = subprocess.run([sys.executable, "-c", code], cwd=ROOT, env=env, capture_output=True, text=True, timeout=120)
    assert done.returncode == 0, done.stderr
    return done.stdout.split()


def test_core_packages_import_without_pyside6():
    assert _loaded_qt(MODULES) == []


@pytest.mark.parametrize("module", ["dispatcher.sheet.render", "dispatcher.ui.main_window"])
def test_the_check_sees_qt_when_it_is_there(module):
    """The same check reports Qt for modules that do use it (so it can say no)."""
    assert "PySide6.QtGui" in _loaded_qt([module])
