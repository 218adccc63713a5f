"""Check, before Qt starts, that the Qt platform plugin the app will use can load.

On a Linux desktop without Qt's X11 helper libraries (``libxcb-cursor0`` and the other
xcb libraries the ``xcb`` plugin links to), creating the application aborts the process
with Qt's generic "could not load the Qt platform plugin". :func:`check_platform` finds
the plugin file shipped with PySide6, reads the shared libraries it and the Qt libraries
beside it need (the ELF ``DT_NEEDED`` entries), and looks each one up in the system's
linker cache (``ldconfig -p``) and in PySide6's own library folder, so that the app can
name the missing library in one line instead. Qt-free and never imports PySide6.
"""

from __future__ import annotations

import importlib.util
import os
import re
import struct
import subprocess
import sys
from collections.abc import Iterable
from dataclasses import dataclass
from pathlib import Path

__all__ = [
    "PlatformProblem",
    "check_platform",
    "chosen_platforms",
    "debian_package",
    "elf_needed",
    "linker_cache",
    "missing_libraries",
]

#: Platforms that draw without a window system and need nothing from the desktop.
HEADLESS = frozenset({"offscreen", "minimal", "vnc", "linuxfb", "eglfs", "minimalegl"})


@dataclass(frozen=True)
class PlatformProblem:
    """Why the platform plugin cannot start: a one-line ``message``, the libraries missing."""

    platform: str
    message: str
    missing: tuple[str, ...] = ()


def chosen_platforms(environ: dict[str, str] | None = None) -> list[str]:
    """The platform plugins Qt will try on Linux, in order: ``QT_QPA_PLATFORM``'s entries
    (``;`` separates fallbacks, ``:`` starts a plugin's options), else ``wayland`` then
    ``xcb`` in a Wayland session, else ``xcb``."""
    env = os.environ if environ is None else environ
    wanted = [p.split(":")[0].strip() for p in env.get("QT_QPA_PLATFORM", "").split(";")]
    wanted = [p for p in wanted if p]
    if wanted:
        return wanted
    if env.get("XDG_SESSION_TYPE") == "wayland" and env.get("WAYLAND_DISPLAY"):
        return ["wayland", "xcb"]
    return ["xcb"]


def elf_needed(path: Path) -> list[str]:
    """The ``DT_NEEDED`` shared-library names of an ELF file (empty if it is not ELF).

    Reads the section headers, the ``SHT_DYNAMIC`` section and its linked string table.

    References
    ----------
    .. [1] Tool Interface Standard (TIS) Committee, "Executable and Linking Format (ELF)
       Specification", version 1.2 (1995), Book I ch. 1 (ELF header, sections) and
       Book III ch. 2 (dynamic section, DT_NEEDED = 1); the 64-bit layout from the System
       V Application Binary Interface, ELF-64 object file format.
    """
    try:
        data = path.read_bytes()
    except OSError:
        return []
    if data[:4] != b"\x7fELF" or len(data) < 64:
        return []
    is64, little = data[4] == 2, data[5] == 1
    end = "<" if little else ">"
    if is64:
        shoff, = struct.unpack_from(end + "Q", data, 0x28)
        shentsize, shnum = struct.unpack_from(end + "HH", data, 0x3A)
        sec_fmt, dyn_fmt = end + "IIQQQQIIQQ", end + "qQ"
    else:
        shoff, = struct.unpack_from(end + "I", data, 0x20)
        shentsize, shnum = struct.unpack_from(end + "HH", data, 0x2E)
        sec_fmt, dyn_fmt = end + "IIIIIIIIII", end + "iI"
    sections = []
    for k in range(shnum):
        at = shoff + k * shentsize
        if at + struct.calcsize(sec_fmt) > len(data):
            return []
        _name, kind, _flags, _addr, offset, size, link, _info, _align, _entsize = \
            struct.unpack_from(sec_fmt, data, at)
        sections.append((kind, offset, size, link))
    names = []
    dyn_size = struct.calcsize(dyn_fmt)
    for kind, offset, size, link in sections:
        if kind != 6 or link >= len(sections):  # SHT_DYNAMIC
            continue
        _k, str_off, str_size, _l = sections[link]
        strings = data[str_off:str_off + str_size]
        for at in range(offset, offset + size - dyn_size + 1, dyn_size):
            tag, value = struct.unpack_from(dyn_fmt, data, at)
            if tag == 0:  # DT_NULL
                break
            if tag == 1 and value < len(strings):  # DT_NEEDED
                names.append(strings[value:strings.index(b"\0", value)].decode("utf-8", "replace"))
    return names


_CACHE_LINE = re.compile(r"^\s*(\S+)\s+\(([^)]*)\)\s+=>\s+(\S+)\s*$")


def linker_cache(listing: str | None = None) -> dict[str, Path]:
    """Library name -> path from ``ldconfig -p`` output (run when ``listing`` is None).

    Only entries for this machine's word size are kept (``x86-64``, ``AArch64`` and the
    like are in the parenthesis for 64-bit libraries).
    """
    if listing is None:
        listing = ""
        for tool in ("/sbin/ldconfig", "/usr/sbin/ldconfig", "ldconfig"):
            try:
                listing = subprocess.run([tool, "-p"], capture_output=True, text=True,
                                         check=False, timeout=20).stdout
            except (OSError, subprocess.SubprocessError):
                continue
            if listing:
                break
    want64 = sys.maxsize > 2**32
    out: dict[str, Path] = {}
    for line in listing.splitlines():
        m = _CACHE_LINE.match(line)
        if not m:
            continue
        is64 = "64" in m.group(2)
        if is64 == want64:
            out.setdefault(m.group(1), Path(m.group(3)))
    return out


def _pyside_dir() -> Path | None:
    spec = importlib.util.find_spec("PySide6")  # finds the folder without importing Qt
    if spec is None or not spec.submodule_search_locations:
        return None
    return Path(next(iter(spec.submodule_search_locations)))


def missing_libraries(plugin: Path, cache: dict[str, Path], bundled: Iterable[Path] = ()
                      ) -> list[str]:
    """Shared libraries ``plugin`` needs, directly or through others, found nowhere.

    A library is found when a folder in ``bundled`` (PySide6's Qt/lib) holds it or the
    linker cache names it; found libraries are followed for their own needs.
    """
    folders = list(bundled)
    missing: list[str] = []
    seen: set[str] = set()
    todo = [plugin]
    while todo:
        for name in elf_needed(todo.pop()):
            if name in seen:
                continue
            seen.add(name)
            here = next((f / name for f in folders if (f / name).exists()), None)
            if here is None:
                here = cache.get(name)
            if here is None:
                missing.append(name)
            elif here.exists():
                todo.append(here)
    return missing


def debian_package(library: str) -> str:
    """The Debian/Ubuntu package that usually ships ``library`` (``libxcb-cursor.so.0``
    -> ``libxcb-cursor0``): Debian's shared-library naming (Debian Policy Manual 8.1,
    package name from the soname, a hyphen before the version when the name ends in a
    digit, lower case). A guess for libraries named otherwise."""
    m = re.match(r"^(lib.+?)\.so\.(\d+)", library)
    if not m:
        return library
    name, version = m.group(1).lower(), m.group(2)
    return f"{name}-{version}" if name[-1].isdigit() else f"{name}{version}"


def check_platform(environ: dict[str, str] | None = None, listing: str | None = None,
                   plugin_dir: Path | None = None) -> PlatformProblem | None:
    """``None`` when a platform plugin Qt will try can start, else the first one's problem.

    Checked on Linux only (elsewhere Qt ships what its plugins need). ``listing`` is an
    ``ldconfig -p`` output (default: run it); ``plugin_dir`` the PySide6 package folder
    (default: the installed one).
    """
    env = os.environ if environ is None else environ
    if not sys.platform.startswith("linux"):
        return None
    base = plugin_dir if plugin_dir is not None else _pyside_dir()
    cache: dict[str, Path] | None = None
    problems = []
    for platform in chosen_platforms(env):
        if platform in HEADLESS:
            return None
        if cache is None:
            cache = linker_cache(listing)
        problem = _plugin_problem(platform, base, cache, env)
        if problem is None:
            return None
        problems.append(problem)
    return problems[0]


def _plugin_problem(platform: str, base: Path | None, cache: dict[str, Path],
                    env) -> PlatformProblem | None:
    if base is None:
        return PlatformProblem(platform, "PySide6 is not installed: reinstall the application")
    plugin = base / "Qt" / "plugins" / "platforms" / f"libq{platform}.so"
    if not plugin.exists():
        return PlatformProblem(platform, f"the Qt platform plugin '{platform}' is not part "
                               f"of the installed PySide6 (no {plugin.name} in {plugin.parent})")
    missing = missing_libraries(plugin, cache, [base / "Qt" / "lib"])
    if missing:
        packages = " ".join(dict.fromkeys(debian_package(n) for n in missing))
        return PlatformProblem(
            platform,
            f"the Qt platform plugin '{platform}' cannot load: {', '.join(missing)} "
            f"{'is' if len(missing) == 1 else 'are'} not installed (Debian/Ubuntu: "
            f"sudo apt install {packages}; see the README, 'Starting on a Linux desktop')",
            tuple(missing))
    if platform == "xcb" and not env.get("DISPLAY"):
        return PlatformProblem(platform, "no X display to open the window on (DISPLAY is "
                               "not set); start the app from the desktop session, or set "
                               "QT_QPA_PLATFORM=offscreen for a run without a screen")
    if platform == "wayland" and not env.get("WAYLAND_DISPLAY"):
        return PlatformProblem(platform, "no Wayland display to open the window on "
                               "(WAYLAND_DISPLAY is not set)")
    return None
