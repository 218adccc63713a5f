"""Rebuild what resources/ derives from its sources.

    python tools/resources.py icons          # PNG sizes from resources/icons/dispatcher.svg
    python tools/resources.py translations   # pyside6-lupdate the sources into the .ts,
                                             # then pyside6-lrelease them into .qm
    python tools/resources.py all            # both
    python tools/resources.py merge-translations REF
                                             # copy the finished translations of the .ts
                                             # files at git revision REF into today's .ts
                                             # where an entry is missing or unfinished

The last one settles a conflict in the .ts files while rebasing a branch that added
strings (take main's side of each .ts, run ``translations`` to add the branch's strings,
then ``merge-translations REBASE_HEAD`` to bring back the branch's translations).

Run from the checkout's root with the project's Python environment (PySide6-Essentials
brings QtSvg and the two translation tools). Commit the results: the tests check that
every PNG matches the SVG's sizes and that every .qm is what lrelease makes of its .ts.
"""

from __future__ import annotations

import argparse
import copy
import os
import shutil
import subprocess
import sys
from pathlib import Path
from xml.etree import ElementTree as ET

ROOT = Path(__file__).resolve().parent.parent
RESOURCES = ROOT / "resources"
ICON_SVG = RESOURCES / "icons" / "dispatcher.svg"
ICON_SIZES = (16, 24, 32, 48, 64, 128, 256)
TRANSLATIONS = RESOURCES / "translations"
LANGUAGES = ("en", "de", "es")  # en: the plural forms of the English source only
#: Sources scanned for translatable strings: the app and the printed sheet.
SOURCE_DIRS = ("dispatcher/ui", "dispatcher/sheet")


def png_path(size: int) -> Path:
    return RESOURCES / "icons" / f"dispatcher-{size}.png"


def build_icons() -> list[Path]:
    """Render the SVG at every size with Qt's SVG renderer (antialiased, transparent)."""
    os.environ.setdefault("QT_QPA_PLATFORM", "offscreen")
    from PySide6.QtCore import Qt
    from PySide6.QtGui import QGuiApplication, QImage, QPainter
    from PySide6.QtSvg import QSvgRenderer

    _app = QGuiApplication.instance() or QGuiApplication(sys.argv[:1])
    renderer = QSvgRenderer(str(ICON_SVG))
    if not renderer.isValid():
        raise SystemExit(f"{ICON_SVG}: not a valid SVG")
    written = []
    for size in ICON_SIZES:
        image = QImage(size, size, QImage.Format.Format_ARGB32)
        image.fill(Qt.GlobalColor.transparent)
        painter = QPainter(image)
        painter.setRenderHint(QPainter.RenderHint.Antialiasing)
        renderer.render(painter)
        painter.end()
        if not image.save(str(png_path(size)), "PNG"):
            raise SystemExit(f"{png_path(size)}: cannot be written")
        written.append(png_path(size))
    return written


def tool(name: str) -> str:
    """A Qt tool shipped with PySide6 (beside this Python, else on PATH)."""
    here = Path(sys.executable).parent / name
    found = str(here) if here.exists() else shutil.which(name)
    if not found:
        raise SystemExit(f"{name} not found: install PySide6-Essentials into this environment")
    return found


def source_files() -> list[Path]:
    return sorted(p for d in SOURCE_DIRS for p in (ROOT / d).rglob("*.py"))


def ts_path(language: str) -> Path:
    return TRANSLATIONS / f"dispatcher_{language}.ts"


def qm_path(language: str) -> Path:
    return TRANSLATIONS / f"dispatcher_{language}.qm"


def lupdate(ts_files: list[Path], extra: tuple[str, ...] = ()) -> None:
    """Extract the source strings into ``ts_files`` (kept translations stay)."""
    sources = [str(p.relative_to(ROOT)) for p in source_files()]
    subprocess.run([tool("pyside6-lupdate"), *extra, *sources, "-ts", *map(str, ts_files)],
                   cwd=ROOT, check=True, stdout=subprocess.DEVNULL)


def lrelease(ts: Path, qm: Path) -> None:
    subprocess.run([tool("pyside6-lrelease"), "-silent", str(ts), "-qm", str(qm)],
                   cwd=ROOT, check=True)


LUPDATE_OPTIONS = ("-no-obsolete", "-locations", "none")


def build_translations() -> None:
    lupdate([ts_path(lang) for lang in LANGUAGES if lang != "en"], LUPDATE_OPTIONS)
    lupdate([ts_path("en")], (*LUPDATE_OPTIONS, "-pluralonly"))
    for lang in LANGUAGES:
        lrelease(ts_path(lang), qm_path(lang))


def _message_key(context: ET.Element, message: ET.Element) -> tuple[str, str, str]:
    return (context.findtext("name", ""), message.findtext("source", ""),
            message.findtext("comment", ""))


def _finished(message: ET.Element) -> bool:
    translation = message.find("translation")
    return translation is not None and translation.get("type") is None


def merge_translations(revision: str) -> int:
    """Copy finished entries of the .ts files at ``revision`` into today's where today's
    entry is unfinished; returns how many entries were filled. Only entries whose context,
    source and comment match are touched, so nothing today's sources do not use comes back."""
    filled = 0
    for lang in LANGUAGES:
        path = ts_path(lang)
        shown = subprocess.run(["git", "show", f"{revision}:{path.relative_to(ROOT).as_posix()}"],
                               cwd=ROOT, capture_output=True, check=False)
        if shown.returncode != 0:
            continue  # that revision has no such file: nothing to bring back
        theirs = {}
        for context in ET.fromstring(shown.stdout).iter("context"):
            for message in context.iter("message"):
                if _finished(message):
                    theirs[_message_key(context, message)] = message.find("translation")
        tree = ET.parse(path)
        for context in tree.getroot().iter("context"):
            for message in context.iter("message"):
                key = _message_key(context, message)
                if not _finished(message) and key in theirs:
                    old = message.find("translation")
                    message.insert(list(message).index(old), copy.deepcopy(theirs[key]))
                    message.remove(old)
                    filled += 1
        body = ET.tostring(tree.getroot(), encoding="unicode")
        path.write_text('<?xml version="1.0" encoding="utf-8"?>\n<!DOCTYPE TS>\n' + body + "\n",
                        encoding="utf-8")
    build_translations()  # lupdate puts the files back in its own layout; lrelease the .qm
    return filled


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description=__doc__.split("\n\n")[0])
    parser.add_argument("what", choices=("icons", "translations", "all", "merge-translations"))
    parser.add_argument("revision", nargs="?", help="git revision (merge-translations only)")
    args = parser.parse_args(argv)
    if args.what == "merge-translations":
        if not args.revision:
            parser.error("merge-translations needs a git revision")
        print(f"{merge_translations(args.revision)} entries filled")
        return 0
    if args.what in ("icons", "all"):
        for path in build_icons():
            print(path.relative_to(ROOT))
    if args.what in ("translations", "all"):
        build_translations()
        for lang in LANGUAGES:
            print(qm_path(lang).relative_to(ROOT))
    return 0


if __name__ == "__main__":
    sys.exit(main())
