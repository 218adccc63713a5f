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


@pytest.fixture(scope="session")
def tsplib_atsp() -> Path:
    """TSPLIB asymmetric instances (Reinelt 1991). Skips when absent, unless CI requires it."""
    path = shared_data_dir() / "tsplib-atsp"
    if not (path / "README.md").exists():
        reason = (f"TSPLIB asymmetric data not found at {path}: these published instances are "
                  "not shipped with the project (set DISPATCHER_SHARED_DATA to their folder)")
        if os.environ.get("DISPATCHER_REQUIRE_SHARED"):
            pytest.fail(reason)
        pytest.skip(reason)
    return path


@pytest.fixture
def samples() -> Path:
    return SAMPLES


@pytest.fixture(scope="session")
def pg_server():
    """A real PostgreSQL server for this test session (see tests/pg_server.py)."""
    from pg_server import REQUIRE_ENV, PgServer, unavailable_reason

    reason = unavailable_reason()
    if reason:
        if os.environ.get(REQUIRE_ENV):
            pytest.fail(f"{REQUIRE_ENV} is set but {reason}")
        pytest.skip(reason)
    server = PgServer()
    try:
        server.init()
    except Exception as exc:
        server.cleanup()
        pytest.fail(f"could not start the test PostgreSQL server: {exc} "
                    f"{getattr(exc, 'stderr', '')}")
    yield server
    server.cleanup()


@pytest.fixture
def pg_location(pg_server, request) -> str:
    """A fresh, empty schema on the test server for one test: its connection URI."""
    import re

    name = "t_" + re.sub(r"[^a-z0-9]+", "_", request.node.name.lower())[:40] + "_" + \
        os.urandom(3).hex()
    pg_server.psql(f"CREATE SCHEMA {name}")
    return pg_server.uri(schema=name)


@pytest.fixture
def open_window(qtbot, tmp_path, monkeypatch):
    """Open the app's main window: ``open_window("small_moulding_cell.dshop")`` on a sample
    shop, ``open_window()`` empty; each with its own settings, history file and autosave
    folder under the test's tmp_path, its plan shown."""
    from ui_support import make_window

    def _open(name: str | None = None):
        return make_window(qtbot, tmp_path, monkeypatch, SAMPLES / name if name else None)

    return _open
