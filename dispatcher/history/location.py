"""Where the history file lives when no ``--history PATH`` is given.

A per-user data folder following each platform's convention:

* Linux and other Unix: ``$XDG_DATA_HOME/dispatcher`` when that variable holds an absolute
  path, otherwise ``~/.local/share/dispatcher`` (XDG Base Directory Specification);
* macOS: ``~/Library/Application Support/dispatcher``;
* Windows: ``%APPDATA%\\dispatcher`` (the roaming application data folder).

The environment variable ``DISPATCHER_HISTORY`` overrides all of these with a file path.
"""

from __future__ import annotations

import os
import sys
from collections.abc import Mapping
from pathlib import Path

HISTORY_ENV = "DISPATCHER_HISTORY"
FILE_NAME = "history.sqlite"
APP_FOLDER = "dispatcher"


def data_folder(env: Mapping[str, str] | None = None, platform: str | None = None,
                home: Path | None = None) -> Path:
    """The per-user data folder of the app (not created here)."""
    env = os.environ if env is None else env
    platform = sys.platform if platform is None else platform
    home = Path.home() if home is None else home
    if platform.startswith("win"):
        appdata = env.get("APPDATA", "")
        base = Path(appdata) if appdata else home / "AppData" / "Roaming"
    elif platform == "darwin":
        base = home / "Library" / "Application Support"
    else:
        xdg = env.get("XDG_DATA_HOME", "")
        # The specification says relative values are invalid and must be ignored.
        base = Path(xdg) if xdg and os.path.isabs(xdg) else home / ".local" / "share"
    return base / APP_FOLDER


def default_history_path(env: Mapping[str, str] | None = None, platform: str | None = None,
                         home: Path | None = None) -> Path:
    """The history file to use when none is named: ``$DISPATCHER_HISTORY`` or the data folder."""
    env = os.environ if env is None else env
    override = env.get(HISTORY_ENV, "")
    if override:
        return Path(override).expanduser()
    return data_folder(env, platform, home) / FILE_NAME


def resolve_history_path(path: str | os.PathLike | None) -> Path:
    """``path`` if given (``~`` expanded), else :func:`default_history_path`."""
    if path is None or str(path) == "":
        return default_history_path()
    return Path(path).expanduser()
