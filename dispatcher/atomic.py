"""Crash-safe file writing shared by every module that saves a user's file.

A file is written to a temporary name in the same folder, flushed to disk, and then put
in place with one ``os.replace``; the folder entry is synced too where the platform
allows. A crash or a full disk at any moment leaves either the old file or the new one,
never a half-written mix.
"""

from __future__ import annotations

import os
import tempfile
from collections.abc import Callable
from pathlib import Path


def fsync_file(path: str | os.PathLike) -> None:
    """Flush a closed file's contents to disk."""
    fd = os.open(path, os.O_RDONLY)
    try:
        os.fsync(fd)
    finally:
        os.close(fd)


def fsync_folder(folder: str | os.PathLike) -> None:
    """Make a rename in ``folder`` durable (POSIX only; elsewhere, and on error, a no-op)."""
    if os.name != "posix":
        return
    try:
        fd = os.open(folder, os.O_RDONLY)
    except OSError:
        return
    try:
        os.fsync(fd)
    except OSError:
        pass
    finally:
        os.close(fd)


def _new_file_mode(path: Path) -> int:
    """Keep an existing file's permissions; a new file gets the usual 0o666 minus umask."""
    try:
        return path.stat().st_mode & 0o777
    except OSError:
        mask = os.umask(0)
        os.umask(mask)
        return 0o666 & ~mask


def atomic_write(path: str | os.PathLike, write: Callable[[Path], None], *,
                 suffix: str = ".tmp") -> None:
    """Call ``write(tmp_path)`` and then replace ``path`` with the result in one step.

    ``suffix`` is the temporary file's ending, for writers that choose a format by it.
    Raises ``OSError`` (the caller words the message); on any failure the temporary file
    is removed and ``path`` is left as it was.
    """
    path = Path(path)
    folder = path.parent  # "." for a bare file name
    fd, tmp_name = tempfile.mkstemp(prefix=f".{path.name}.", suffix=suffix, dir=folder)
    os.close(fd)
    tmp = Path(tmp_name)
    try:
        os.chmod(tmp, _new_file_mode(path))
        write(tmp)
        fsync_file(tmp)
        os.replace(tmp, path)
    except BaseException:
        try:
            tmp.unlink()
        except OSError:
            pass
        raise
    fsync_folder(folder)


def atomic_write_bytes(path: str | os.PathLike, data: bytes) -> None:
    """Write ``data`` to ``path`` atomically."""
    atomic_write(path, lambda tmp: tmp.write_bytes(data))
