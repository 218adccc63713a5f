"""The installed data files: icon, desktop entry, AppStream metainfo (tools from Debian's
desktop-file-utils and appstream check the last two), and a wheel installed into a fresh
virtual environment finding every one of them without the checkout."""

from __future__ import annotations

import os
import shutil
import subprocess
import sys
import venv
import xml.etree.ElementTree as ET
import zipfile
from configparser import ConfigParser
from pathlib import Path

import pytest

from dispatcher import __version__, resources

ROOT = Path(__file__).resolve().parent.parent


def system_tool(name: str, package: str) -> str:
    """Path of a system command the test needs; skip without it, fail under CI."""
    found = shutil.which(name)
    if found is None:
        reason = f"{name} not installed (Debian package {package}); install it to run this check"
        if os.environ.get("DISPATCHER_REQUIRE_TOOLS"):
            pytest.fail(reason)
        pytest.skip(reason)
    return found


def test_every_resource_is_found_and_not_empty():
    found = resources.all_resources()
    assert len(found) == 1 + len(resources.ICON_SIZES) + 2 + 2 * len(resources.LANGUAGES)
    for item in found:
        assert item.read_bytes(), item


def test_unknown_icon_size_and_language_are_refused():
    with pytest.raises(ValueError, match="no icon of size 20"):
        resources.icon_png(20)
    with pytest.raises(ValueError, match="no translation for 'xx'"):
        resources.translation("xx")


def test_png_icons_are_the_svg_at_each_size(qapp):
    """Each PNG is what Qt's SVG renderer (an independent rasteriser of the source) draws
    at that size, within antialiasing noise: a changed SVG without re-rendered PNGs fails."""
    from PySide6.QtCore import Qt
    from PySide6.QtGui import QImage, QPainter
    from PySide6.QtSvg import QSvgRenderer

    renderer = QSvgRenderer(resources.icon_svg().read_bytes())
    assert renderer.isValid()
    for size in resources.ICON_SIZES:
        png = QImage.fromData(resources.icon_png(size).read_bytes(), "PNG")
        assert (png.width(), png.height()) == (size, size)
        ref = QImage(size, size, QImage.Format.Format_ARGB32)
        ref.fill(Qt.GlobalColor.transparent)
        painter = QPainter(ref)
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        renderer.render(painter)
        painter.end()
        png = png.convertToFormat(QImage.Format.Format_ARGB32)
        worst = max(abs(a - b) for y in range(0, size, max(1, size // 32))
                    for x in range(0, size, max(1, size // 32))
                    for a, b in zip(png.pixelColor(x, y).getRgb(), ref.pixelColor(x, y).getRgb()))
        assert worst <= 8, f"{size} px icon differs from the SVG: run tools/resources.py icons"
        # the icon has a transparent corner and an opaque middle (it is drawn, not blank)
        assert png.pixelColor(0, 0).alpha() == 0
        assert png.pixelColor(size // 2, size // 2).alpha() == 255


def test_desktop_entry_passes_desktop_file_validate(tmp_path):
    tool = system_tool("desktop-file-validate", "desktop-file-utils")
    path = tmp_path / resources.desktop_entry().name
    path.write_bytes(resources.desktop_entry().read_bytes())
    done = subprocess.run([tool, str(path)], capture_output=True, text=True, check=False)
    assert done.returncode == 0 and not done.stdout.strip(), done.stdout + done.stderr
    entry = ConfigParser(interpolation=None)
    entry.optionxform = str
    entry.read(path, encoding="utf-8")
    desk = entry["Desktop Entry"]
    assert desk["Icon"] == resources.APP_ID
    assert desk["Exec"].split()[:2] == ["dispatcher", "app"]
    assert desk["StartupWMClass"] == "dispatcher"


def test_broken_desktop_entry_is_refused_by_the_validator(tmp_path):
    """The validator can say no: the same entry without its Type key fails."""
    tool = system_tool("desktop-file-validate", "desktop-file-utils")
    text = resources.desktop_entry().read_text(encoding="utf-8")
    path = tmp_path / resources.desktop_entry().name
    path.write_text(text.replace("Type=Application\n", ""), encoding="utf-8")
    assert subprocess.run([tool, str(path)], capture_output=True, check=False).returncode != 0


def test_metainfo_passes_appstreamcli_validate(tmp_path):
    tool = system_tool("appstreamcli", "appstream")
    path = tmp_path / resources.metainfo().name
    path.write_bytes(resources.metainfo().read_bytes())
    done = subprocess.run([tool, "validate", "--no-net", str(path)], capture_output=True,
                          text=True, check=False)
    assert done.returncode == 0, done.stdout + done.stderr
    root = ET.fromstring(path.read_bytes())
    assert root.findtext("id") == resources.APP_ID
    assert root.findtext("launchable") == resources.desktop_entry().name
    assert root.findtext("provides/binary") == "dispatcher"
    # the cautions reach the software centre's description too
    assert "lockout/tagout" in ET.tostring(root.find("description"), encoding="unicode")


def test_broken_metainfo_is_refused_by_the_validator(tmp_path):
    tool = system_tool("appstreamcli", "appstream")
    text = resources.metainfo().read_text(encoding="utf-8")
    path = tmp_path / resources.metainfo().name
    path.write_text(text.replace("<summary>", "<summary>.").replace("<id>", "<id>x y "),
                    encoding="utf-8")
    assert subprocess.run([tool, "validate", "--no-net", str(path)],
                          capture_output=True, check=False).returncode != 0


def test_window_has_the_app_icon(qapp):
    from PySide6.QtWidgets import QMainWindow

    from dispatcher.ui.app import make_application

    app = make_application()
    sizes = {s.width() for s in app.windowIcon().availableSizes()}
    assert sizes == set(resources.ICON_SIZES)
    window = QMainWindow()
    assert not window.windowIcon().isNull()
    assert app.desktopFileName() == resources.APP_ID


FIND_EVERYTHING = r"""
import json, sys
from dispatcher import resources
found = [str(p) for p in resources.all_resources()]
print(json.dumps({"found": found, "prefix": sys.prefix,
                  "root": str(resources.resource_root())}))
"""


@pytest.mark.slow
def test_wheel_installed_in_a_fresh_venv_finds_every_resource(tmp_path):
    """Build the wheel from a copy of the project files, install it (no dependencies, no
    index) into a new virtual environment, and look every resource up from there."""
    src = tmp_path / "src"
    ignore = shutil.ignore_patterns("__pycache__", "*.pyc")
    for name in ("dispatcher", "resources"):
        shutil.copytree(ROOT / name, src / name, ignore=ignore)
    for name in ("pyproject.toml", "setup.py", "README.md", "LICENSE"):
        shutil.copy2(ROOT / name, src / name)
    dist = tmp_path / "dist"
    built = subprocess.run([sys.executable, "-m", "pip", "wheel", "--no-deps", "-v", "-w", str(dist),
                            str(src)], check=True, capture_output=True, text=True)
    (wheel,) = dist.glob("shiftdispatch-*.whl")
    # The build backend does not complain about the project's metadata (it warned about
    # the license as a TOML table before the SPDX string form of PEP 639).
    log = built.stdout + built.stderr
    assert "BuildBackendWarning" not in log and "SetuptoolsDeprecationWarning" not in log, log
    with zipfile.ZipFile(wheel) as archive:
        metadata = archive.read(f"shiftdispatch-{__version__}.dist-info/METADATA").decode()
        assert f"shiftdispatch-{__version__}.dist-info/licenses/LICENSE" in archive.namelist()
    assert "License-Expression: MIT" in metadata.splitlines()

    env_dir = tmp_path / "venv"
    venv.EnvBuilder(with_pip=False).create(env_dir)
    python = env_dir / "bin" / "python"
    subprocess.run([sys.executable, "-m", "pip", "--python", str(python), "install", "-q",
                    "--no-deps", "--no-index", str(wheel)], check=True, capture_output=True)
    shutil.rmtree(src)  # nothing may come from the copy it was built from
    clean = {k: v for k, v in os.environ.items() if k != "PYTHONPATH"}
    done = subprocess.run([str(python), "-I", "-c", FIND_EVERYTHING], cwd=tmp_path,
                          capture_output=True, text=True, env=clean, check=False)
    assert done.returncode == 0, done.stderr
    import json

    answer = json.loads(done.stdout)
    prefix = Path(answer["prefix"]).resolve()
    assert prefix == env_dir.resolve()
    assert len(answer["found"]) == len(resources.all_resources())
    for path in answer["found"]:
        assert Path(path).resolve().is_relative_to(prefix), path
        assert not Path(path).resolve().is_relative_to(ROOT), path
    names = sorted(Path(p).name for p in answer["found"])
    assert names == sorted(p.name for p in resources.all_resources())
    assert (env_dir / "bin" / "dispatcher").exists()  # the command keeps its name
