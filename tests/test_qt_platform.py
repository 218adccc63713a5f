"""`dispatcher app` checks the Qt platform plugin before Qt starts (dispatcher.qt_platform).

The checks run on the real PySide6 plugin files and this machine's linker cache; the
outside reference is the system's own dynamic linker, asked through ``ldd``."""

from __future__ import annotations

import os
import shutil
import subprocess
import sys
from pathlib import Path

import pytest

from dispatcher import qt_platform

ROOT = Path(__file__).resolve().parent.parent
pytestmark = pytest.mark.skipif(not sys.platform.startswith("linux"),
                                reason="the platform check applies on Linux only")


def pyside_dir() -> Path:
    import PySide6

    return Path(PySide6.__file__).parent


def xcb_plugin() -> Path:
    return pyside_dir() / "Qt" / "plugins" / "platforms" / "libqxcb.so"


def real_listing() -> str:
    return subprocess.run(["ldconfig", "-p"], capture_output=True, text=True,
                          check=True).stdout


def test_needed_libraries_are_read_from_the_plugin_file():
    needed = qt_platform.elf_needed(xcb_plugin())
    assert "libxcb-cursor.so.0" in needed and "libQt6XcbQpa.so.6" in needed
    assert qt_platform.elf_needed(ROOT / "README.md") == []
    readelf = shutil.which("readelf")
    if readelf is not None:  # binutils' reader of the same entries, as the reference
        out = subprocess.run([readelf, "-d", str(xcb_plugin())], capture_output=True,
                             text=True, check=True).stdout
        listed = [line.split("[")[1].split("]")[0] for line in out.splitlines()
                  if "(NEEDED)" in line]
        assert needed == listed


def test_missing_libraries_agree_with_the_dynamic_linker():
    """ldd (the system's loader, run on the plugin) is the reference: what it cannot find
    is exactly what the check reports missing, on whatever this machine has installed."""
    ldd = shutil.which("ldd")
    if ldd is None:
        pytest.skip("ldd not available")
    out = subprocess.run([ldd, str(xcb_plugin())], capture_output=True, text=True,
                         check=False).stdout
    not_found = {line.split()[0] for line in out.splitlines() if "not found" in line}
    found = set(qt_platform.missing_libraries(
        xcb_plugin(), qt_platform.linker_cache(real_listing()), [pyside_dir() / "Qt" / "lib"]))
    assert found == not_found


def test_a_library_taken_out_of_the_listing_is_named_with_its_package():
    listing = "\n".join(line for line in real_listing().splitlines()
                        if "libxcb-cursor.so.0 " not in line)
    env = {"QT_QPA_PLATFORM": "xcb", "DISPLAY": ":0"}
    problem = qt_platform.check_platform(env, listing=listing)
    assert problem is not None and "libxcb-cursor.so.0" in problem.missing
    assert "libxcb-cursor.so.0" in problem.message
    assert "apt install" in problem.message and "libxcb-cursor0" in problem.message
    assert "\n" not in problem.message


def test_complete_listing_with_a_display_passes():
    listing = real_listing()
    cache = qt_platform.linker_cache(listing)
    # pretend every library the loader could not find were installed, at a path of its own
    extra = "".join(f"\t{name} (libc6,x86-64) => /nonexistent/{name}\n"
                    for name in qt_platform.missing_libraries(xcb_plugin(), cache,
                                                              [pyside_dir() / "Qt" / "lib"]))
    assert qt_platform.check_platform({"QT_QPA_PLATFORM": "xcb", "DISPLAY": ":0"},
                                      listing=listing + extra) is None
    no_display = qt_platform.check_platform({"QT_QPA_PLATFORM": "xcb"}, listing=listing + extra)
    assert no_display is not None and "DISPLAY" in no_display.message


def test_headless_unknown_and_fallback_platforms():
    assert qt_platform.check_platform({"QT_QPA_PLATFORM": "offscreen"}, listing="") is None
    problem = qt_platform.check_platform({"QT_QPA_PLATFORM": "nosuch"}, listing="")
    assert problem is not None and "libqnosuch.so" in problem.message
    # a wayland session tries wayland, then xcb; the first one's problem is reported
    env = {"XDG_SESSION_TYPE": "wayland", "WAYLAND_DISPLAY": "wayland-0"}
    assert qt_platform.chosen_platforms(env) == ["wayland", "xcb"]
    assert qt_platform.chosen_platforms({"QT_QPA_PLATFORM": "xcb:dpi=96;offscreen"}) == [
        "xcb", "offscreen"]
    assert qt_platform.check_platform({"QT_QPA_PLATFORM": "nosuch;offscreen"}, listing="") is None
    empty = qt_platform.check_platform({"QT_QPA_PLATFORM": "xcb", "DISPLAY": ":0"}, listing="")
    assert empty is not None and "libxcb.so.1" in empty.missing


@pytest.mark.parametrize(("library", "package"), [
    ("libxcb-cursor.so.0", "libxcb-cursor0"), ("libxkbcommon-x11.so.0", "libxkbcommon-x11-0"),
    ("libX11-xcb.so.1", "libx11-xcb1"), ("libxcb-icccm.so.4", "libxcb-icccm4"),
    ("libdbus-1.so.3", "libdbus-1-3"),
])
def test_debian_package_names(library, package):
    """Expected names as Debian ships them (from memory, Debian package archive)."""
    assert qt_platform.debian_package(library) == package


def test_app_command_without_a_display_exits_2_with_one_line(tmp_path):
    """A real `dispatcher app` start on the xcb platform with no display: one line, exit 2,
    and not Qt's abort."""
    env = {k: v for k, v in os.environ.items()
           if k not in ("DISPLAY", "WAYLAND_DISPLAY", "XDG_SESSION_TYPE")}
    env.update(QT_QPA_PLATFORM="xcb", PYTHONPATH=str(ROOT))
    done = subprocess.run([sys.executable, "-m", "dispatcher", "app"], cwd=tmp_path, env=env,
                          capture_output=True, text=True, timeout=120, check=False)
    assert done.returncode == 2, done.stderr
    lines = done.stderr.strip().splitlines()
    assert len(lines) == 1, done.stderr
    assert lines[0].startswith(("dispatcher: the Qt platform plugin 'xcb' cannot load: ",
                                "dispatcher: no X display")), done.stderr
    assert "could not load the Qt platform plugin" not in done.stderr
