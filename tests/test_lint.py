"""ruff lint (rules in pyproject.toml ``[tool.ruff]``) over the whole tree, and the format
check over the files listed in ``[tool.dispatcher.format-checked]``; .ci/run runs the same.

Skips when ruff is not installed (it is in the ``test`` extra); fails instead when
``DISPATCHER_REQUIRE_TOOLS`` is set, as in CI.
"""

from __future__ import annotations

import os
import shutil
import subprocess
import sys
import tomllib
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parent.parent
TREE = ["dispatcher", "tests", "benchmarks", "tools", "setup.py"]


def _ruff() -> list[str]:
    found = shutil.which("ruff", path=str(Path(sys.executable).parent)) or shutil.which("ruff")
    if found is None:
        if os.environ.get("DISPATCHER_REQUIRE_TOOLS"):
            pytest.fail("ruff is not installed (pip install -e '.[test]')")
        pytest.skip("ruff is not installed (it comes with pip install -e '.[test]')")
    return [found]


def format_checked_files() -> list[str]:
    config = tomllib.loads((ROOT / "pyproject.toml").read_text(encoding="utf-8"))
    return config["tool"]["dispatcher"]["format-checked"]["files"]


def test_lint_passes():
    done = subprocess.run([*_ruff(), "check", "--no-cache", *TREE], cwd=ROOT, capture_output=True, text=True)
    assert done.returncode == 0, done.stdout + done.stderr


def test_listed_files_are_formatted():
    files = format_checked_files()
    assert all((ROOT / f).is_file() for f in files), "a listed file does not exist"
    done = subprocess.run(
        [*_ruff(), "format", "--no-cache", "--check", *files], cwd=ROOT, capture_output=True, text=True
    )
    assert done.returncode == 0, done.stdout + done.stderr
