"""Shared fixtures. Qt runs offscreen so the suite needs no display."""

from __future__ import annotations

import os
from pathlib import Path

import pytest

os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")

ROOT = Path(__file__).resolve().parent.parent
SAMPLES = ROOT / "sample_shops"


def shared_data_dir() -> Path:
    """Where the shared published datasets live: ../shared/data beside the checkout."""
    return Path(os.environ.get("DISPATCHER_SHARED_DATA", ROOT.parent / "shared" / "data"))


@pytest.fixture(scope="session")
def or_library() -> Path:
    """OR-Library folder (Beasley 1990). Skips when absent, unless CI requires it."""
    path = shared_data_dir() / "or-library"
    if not (path / "README.md").exists():
        reason = (f"OR-Library data not found at {path}: these published instances are not "
                  "shipped with the project (set DISPATCHER_SHARED_DATA to their folder)")
        if os.environ.get("DISPATCHER_REQUIRE_SHARED"):
            pytest.fail(reason)
        pytest.skip(reason)
    return path


@pytest.fixture
def samples() -> Path:
    return SAMPLES
