"""Crash-safe writing (dispatcher.atomic) under injected failures, by observed properties.

What must hold (POSIX rename semantics, the reason for writing to a temporary name and
renaming, common practice for crash-safe saves): whatever step fails (creating the
temporary file, writing it, flushing it, renaming it), the target keeps its old bytes
exactly and no temporary file is left behind; on success the target is a new file put in
place by one rename (a reader that opened the old file keeps reading the complete old
bytes), its contents were flushed before the rename, and the folder was flushed after it.
Failures are injected by replacing the os/tempfile function the step calls.
"""

from __future__ import annotations

import os
import stat
import tempfile

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from dispatcher import atomic
from dispatcher.atomic import atomic_write, atomic_write_bytes, fsync_folder

pytestmark = pytest.mark.skipif(os.name != "posix", reason="rename and folder fsync are POSIX")

STEPS = ["mkstemp", "write", "write-half", "chmod", "fsync", "replace", "interrupt"]


class Injected(OSError):
    """The failure planted at one step."""


def _write_with_failure(path, new: bytes, step: str, monkeypatch) -> None:
    def fail(*args, **kwargs):
        raise Injected(f"injected at {step}")

    if step == "mkstemp":
        monkeypatch.setattr(atomic.tempfile, "mkstemp", fail)
    elif step == "chmod":
        monkeypatch.setattr(atomic.os, "chmod", fail)
    elif step == "fsync":
        monkeypatch.setattr(atomic.os, "fsync", fail)
    elif step == "replace":
        monkeypatch.setattr(atomic.os, "replace", fail)

    def write(tmp):
        if step == "write":
            raise Injected("injected before writing")
        with open(tmp, "wb") as fh:
            if step in ("write-half", "interrupt"):
                fh.write(new[: len(new) // 2])
                fh.flush()
                if step == "interrupt":
                    raise KeyboardInterrupt
                raise Injected("disk full half-way")
            fh.write(new)

    atomic_write(path, write)


def _leftovers(folder, name):
    return sorted(p for p in os.listdir(folder) if p != name)


@settings(max_examples=60, deadline=None,
          suppress_health_check=[HealthCheck.function_scoped_fixture])
@given(old=st.binary(min_size=0, max_size=2000), new=st.binary(min_size=1, max_size=2000),
       step=st.sampled_from(STEPS))
def test_a_failed_write_leaves_the_old_bytes_and_no_temporary_file(old, new, step, monkeypatch):
    with tempfile.TemporaryDirectory() as folder, monkeypatch.context() as patch:
        target = os.path.join(folder, "shop.dshop")
        with open(target, "wb") as fh:
            fh.write(old)
        expected = KeyboardInterrupt if step == "interrupt" else Injected
        with pytest.raises(expected):
            _write_with_failure(target, new, step, patch)
        with open(target, "rb") as fh:
            assert fh.read() == old
        assert _leftovers(folder, "shop.dshop") == []


@pytest.mark.parametrize("step", STEPS)
def test_a_failed_first_save_creates_no_file(tmp_path, step, monkeypatch):
    target = tmp_path / "new.dshop"
    with pytest.raises((Injected, KeyboardInterrupt)):
        _write_with_failure(target, b"content", step, monkeypatch)
    assert list(tmp_path.iterdir()) == []


@settings(max_examples=30, deadline=None)
@given(old=st.binary(min_size=1, max_size=3000), new=st.binary(min_size=0, max_size=3000))
def test_success_replaces_by_rename_and_old_readers_keep_old_bytes(old, new):
    with tempfile.TemporaryDirectory() as folder:
        target = os.path.join(folder, "sheet.pdf")
        with open(target, "wb") as fh:
            fh.write(old)
        before = os.stat(target).st_ino
        with open(target, "rb") as reader:
            atomic_write_bytes(target, new)
            assert reader.read() == old  # a copy over the target would show new bytes here
        with open(target, "rb") as fh:
            assert fh.read() == new
        assert os.stat(target).st_ino != before
        assert _leftovers(folder, "sheet.pdf") == []


def test_flushes_the_file_before_the_rename_and_the_folder_after(tmp_path, monkeypatch):
    events = []
    real_fsync, real_replace = os.fsync, os.replace

    def fsync(fd):
        info = os.fstat(fd)
        events.append(("fsync-folder" if stat.S_ISDIR(info.st_mode) else "fsync-file",
                       info.st_ino))
        real_fsync(fd)

    def replace(src, dst):
        events.append(("replace", os.stat(src).st_ino))
        real_replace(src, dst)

    monkeypatch.setattr(atomic.os, "fsync", fsync)
    monkeypatch.setattr(atomic.os, "replace", replace)
    target = tmp_path / "plan.dshop"
    atomic_write_bytes(target, b"new plan")
    new_inode = target.stat().st_ino
    assert events == [("fsync-file", new_inode), ("replace", new_inode),
                      ("fsync-folder", tmp_path.stat().st_ino)]


def test_the_temporary_file_sits_beside_the_target_with_the_suffix_asked(tmp_path):
    seen = []

    def write(tmp):
        seen.append(tmp)
        tmp.write_text("x", encoding="utf-8")

    atomic_write(tmp_path / "sheet.pdf", write, suffix=".part.pdf")
    (tmp,) = seen
    assert tmp.parent == tmp_path  # same folder: the rename stays on one file system
    assert tmp.name.startswith(".sheet.pdf.") and tmp.name.endswith(".part.pdf")
    assert (tmp_path / "sheet.pdf").read_text(encoding="utf-8") == "x"


def test_keeps_the_permissions_of_the_file_it_replaces(tmp_path):
    target = tmp_path / "shop.dshop"
    target.write_bytes(b"old")
    target.chmod(0o640)
    atomic_write_bytes(target, b"new")
    assert stat.S_IMODE(target.stat().st_mode) == 0o640


@pytest.mark.parametrize("umask, mode", [(0o027, 0o640), (0o022, 0o644), (0o002, 0o664)])
def test_a_new_file_gets_the_usual_mode_minus_the_umask(tmp_path, umask, mode):
    old = os.umask(umask)
    try:
        atomic_write_bytes(tmp_path / "a.dshop", b"x")
        assert os.umask(umask) == umask  # the umask is left as it was
    finally:
        os.umask(old)
    # 0o666 & ~umask, as open() would create it (mkstemp alone would give 0o600)
    assert stat.S_IMODE((tmp_path / "a.dshop").stat().st_mode) == mode


def test_a_bare_file_name_is_written_in_the_current_folder(tmp_path, monkeypatch):
    monkeypatch.chdir(tmp_path)
    seen = []
    atomic_write("plan.json", lambda tmp: (seen.append(tmp), tmp.write_bytes(b"{}")))
    assert (tmp_path / "plan.json").read_bytes() == b"{}"
    assert seen[0].name.endswith(".tmp") and seen[0].parent.resolve() == tmp_path.resolve()


def test_folder_sync_failures_are_ignored_and_the_folder_closed(tmp_path, monkeypatch):
    fsync_folder(tmp_path / "missing")  # cannot open: no error
    closed, real_close = [], os.close

    def fsync(fd):
        raise OSError("fsync not supported on this file system")

    def close(fd):
        closed.append(fd)
        real_close(fd)

    monkeypatch.setattr(atomic.os, "fsync", fsync)
    monkeypatch.setattr(atomic.os, "close", close)
    fsync_folder(tmp_path)
    assert len(closed) == 1
