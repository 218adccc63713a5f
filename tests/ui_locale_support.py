"""A pseudo-locale for the app tests, and the checks run on every widget shown in it.

:func:`build_pseudo_qm` runs ``pyside6-lupdate`` over the app and sheet sources into a
``.ts`` in a temporary folder, fills every entry with :func:`pseudo` (letters accented,
about 40 % longer, placeholders ``{name}``, ``%n``, ``%1``, HTML tags and entities and
``&`` mnemonics kept) and compiles it with ``pyside6-lrelease``; nothing is committed.
Pseudo-localisation is common practice for finding clipped text and strings that
escaped translation before real translations exist.

:func:`clipped` and :func:`escaped` walk the visible widgets of a window and list every
offender with its class, object name and parent chain, so that one failing run names
everything to fix.
"""

from __future__ import annotations

import math
import re
import subprocess
import sys
from dataclasses import dataclass
from pathlib import Path
from xml.etree import ElementTree as ET

from PySide6.QtCore import QModelIndex, Qt
from PySide6.QtGui import QTextDocument
from PySide6.QtWidgets import (
    QAbstractButton,
    QAbstractItemView,
    QComboBox,
    QDockWidget,
    QGroupBox,
    QHeaderView,
    QLabel,
    QLineEdit,
    QPlainTextEdit,
    QStyle,
    QStyleOptionComboBox,
    QTabBar,
    QTextEdit,
    QToolButton,
    QWidget,
)

ROOT = Path(__file__).resolve().parent.parent
SOURCE_DIRS = ("dispatcher/ui", "dispatcher/sheet")  # what tools/resources.py scans
#: Where the words the app shows come from (the command line's own words stay English).
SHOWN_DIRS = (*SOURCE_DIRS, "dispatcher/shop", "dispatcher/history", "dispatcher/engine")

#: Letters and their accented stand-ins (each stays one character, so a word keeps its shape).
_PLAIN = "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ"
_ACCENTED = "åƀçðéƒĝĥîĵķļɱñöþǫŕšţûṽŵẋýžÅƁÇÐÉƑĜĤÎĴĶĻṀÑÖÞǪŔŠŢÛṼŴẊÝŽ"
_TO_PSEUDO = str.maketrans(_PLAIN, _ACCENTED)
#: The padding that makes a string about 40 % longer; also the pseudo marker.
PAD = "\u00b7"
MARKERS = set(_ACCENTED) | {PAD}
#: Kept as they are: HTML tags and entities, mnemonics (& and the next character),
#: str.format fields, Qt's %n / %1 / %L1 arguments.
_KEEP = re.compile(r"(<[^>]*>|&[a-zA-Z]+;|&#\d+;|&&|&.|\{[^{}]*\}|%L?\d|%n)", re.DOTALL)
GROWTH = 0.4


def pseudo(text: str) -> str:
    """``text`` with every letter accented and padded to about 1.4 times its visible length.

    Placeholders, tags, entities and the mnemonic letter after ``&`` stay exactly as they
    are, so formatting, rich text and keyboard mnemonics still work."""
    parts = _KEEP.split(text)
    out, visible = [], 0
    for k, part in enumerate(parts):
        if k % 2:
            out.append(part)
        else:
            out.append(part.translate(_TO_PSEUDO))
            visible += len(part)
    extra = max(2, math.ceil(GROWTH * visible))
    return "".join(out) + " " + PAD * (extra - 1)


def has_marker(text: str) -> bool:
    return any(c in MARKERS for c in text)


def _fill(message: ET.Element) -> None:
    source = message.findtext("source", "")
    translation = message.find("translation")
    translation.attrib.pop("type", None)
    for child in list(translation):
        translation.remove(child)
    if message.get("numerus") == "yes":
        translation.text = None
        for _ in range(2):  # English-like rules: one and other
            ET.SubElement(translation, "numerusform").text = pseudo(source)
    else:
        translation.text = pseudo(source)


def _tool(name: str) -> str:
    here = Path(sys.executable).parent / name
    return str(here) if here.exists() else name


def build_pseudo_qm(folder: Path) -> tuple[Path, int]:
    """Extract, pseudo-translate and compile into ``folder``; returns the .qm and how many
    source strings it covers."""
    ts = folder / "dispatcher_pseudo.ts"
    qm = folder / "dispatcher_pseudo.qm"
    sources = sorted(str(p.relative_to(ROOT)) for d in SOURCE_DIRS for p in (ROOT / d).rglob("*.py"))
    subprocess.run([_tool("pyside6-lupdate"), "-no-obsolete", "-locations", "none", *sources,
                    "-ts", str(ts)], cwd=ROOT, check=True, capture_output=True)
    tree = ET.parse(ts)
    tree.getroot().set("language", "en")
    count = 0
    for message in tree.getroot().iter("message"):
        _fill(message)
        count += 1
    tree.write(ts, encoding="utf-8", xml_declaration=True)
    subprocess.run([_tool("pyside6-lrelease"), "-silent", str(ts), "-qm", str(qm)],
                   cwd=ROOT, check=True, capture_output=True)
    return qm, count


# ---- where a widget is ---------------------------------------------------------------------
def chain(widget: QWidget) -> str:
    """``Class#objectName`` of the widget and its parents, innermost first."""
    names = []
    w = widget
    while w is not None:
        name = type(w).__name__
        if w.objectName():
            name += f"#{w.objectName()}"
        names.append(name)
        w = w.parentWidget()
    return " < ".join(names)


def shown(widget: QWidget) -> bool:
    """Visible on screen: shown with its parents and of non-zero size."""
    return widget.isVisible() and widget.width() > 0 and widget.height() > 0


def widgets_of(top: QWidget) -> list[QWidget]:
    return [top, *top.findChildren(QWidget)]


def plain(text: str) -> str:
    """Rich text as the reader sees it."""
    if "<" in text and ">" in text:
        doc = QTextDocument()
        doc.setHtml(text)
        return doc.toPlainText()
    return text


def no_mnemonic(text: str) -> str:
    return re.sub(r"&(.)", r"\1", text)


# ---- clipping -----------------------------------------------------------------------------
@dataclass
class Finding:
    widget: QWidget
    text: str
    what: str

    def __str__(self) -> str:
        return f"{chain(self.widget)}: {self.text!r}: {self.what}"


def _header_findings(header: QHeaderView) -> list[Finding]:
    """Sections narrower (or, across, lower) than the size the header's style asks for
    their text (QHeaderView.sectionSizeFromContents)."""
    model = header.model()
    if model is None:
        return []
    found = []
    horizontal = header.orientation() == Qt.Orientation.Horizontal
    for i in range(min(header.count(), 60)):
        if header.isSectionHidden(i) or header.sectionSize(i) == 0:
            continue
        text = str(model.headerData(i, header.orientation(), Qt.ItemDataRole.DisplayRole) or "")
        if not text:
            continue
        need = header.sectionSizeFromContents(i)
        along, across = (need.width(), need.height()) if horizontal else (need.height(), need.width())
        have_along = header.sectionSize(i)
        have_across = header.height() if horizontal else header.width()
        if have_along < along:
            found.append(Finding(header, text, f"section {i} is {have_along} px, its text needs {along}"))
        elif have_across < across:
            found.append(Finding(header, text, f"section {i}: header is {have_across} px across, "
                                               f"its text needs {across}"))
    return found


def clipped(top: QWidget) -> list[Finding]:
    """Every visible label, button, group box title, combo box text, tab and header section
    of ``top`` whose text does not fit the room it has."""
    found: list[Finding] = []
    for w in widgets_of(top):
        if not shown(w):
            continue
        if isinstance(w, QLabel):
            text = w.text()
            if not text.strip() or w.pixmap() is not None and not w.pixmap().isNull():
                continue
            if w.wordWrap():
                room = w.contentsRect().width()
                need = w.heightForWidth(w.width())
                if need > w.height() + 1:
                    found.append(Finding(w, plain(text), f"wrapped at {room} px it needs {need} px of "
                                                         f"height, has {w.height()}"))
            else:
                need = w.sizeHint().width()
                if need > w.width() + 1:
                    found.append(Finding(w, plain(text), f"{w.width()} px wide, needs {need}"))
        elif isinstance(w, QAbstractButton):
            if not w.text().strip() or isinstance(w, QToolButton) and isinstance(w.parentWidget(), QTabBar):
                continue
            need = w.sizeHint().width()
            if need > w.width() + 1:
                found.append(Finding(w, w.text(), f"{w.width()} px wide, needs {need}"))
        elif isinstance(w, QGroupBox):
            need = w.fontMetrics().horizontalAdvance(no_mnemonic(w.title())) + 16
            if w.title() and need > w.width():
                found.append(Finding(w, w.title(), f"{w.width()} px wide, title needs {need}"))
        elif isinstance(w, QComboBox):
            text = w.currentText()
            if not text:
                continue
            opt = QStyleOptionComboBox()
            w.initStyleOption(opt)
            field = w.style().subControlRect(QStyle.ComplexControl.CC_ComboBox, opt,
                                             QStyle.SubControl.SC_ComboBoxEditField, w)
            need = w.fontMetrics().horizontalAdvance(text)
            if need > field.width():
                found.append(Finding(w, text, f"text field {field.width()} px wide, needs {need}"))
        elif isinstance(w, QTabBar):
            pad = 2 * w.style().pixelMetric(QStyle.PixelMetric.PM_TabBarTabHSpace, None, w) // 2
            for i in range(w.count()):
                need = w.fontMetrics().horizontalAdvance(no_mnemonic(w.tabText(i))) + pad
                have = w.tabRect(i).width()
                if need > have:
                    found.append(Finding(w, w.tabText(i), f"tab {i} is {have} px wide, needs {need}"))
        elif isinstance(w, QHeaderView):
            found.extend(_header_findings(w))
    return found


# ---- strings that escaped translation -----------------------------------------------------
#: Qt's own words (standard buttons and dialogs): translated by Qt's qtbase catalogue in a
#: real language, not by ours, so the pseudo-locale leaves them in English.
QT_OWN = {"OK", "Cancel", "Apply", "Close", "Yes", "No", "Save", "Discard", "Reset", "Help",
          "Open", "Restore Defaults", "Yes to All", "No to All", "Abort", "Retry", "Ignore"}
_WORD = re.compile(r"[A-Za-z][A-Za-z']+")
_PHRASE = re.compile(r"[A-Za-z][A-Za-z' ,]*[A-Za-z]")


def visible_texts(top: QWidget, rows: int = 30) -> list[tuple[QWidget, str]]:
    """Every text a reader sees in ``top``: labels, buttons, titles, tabs, combo items,
    placeholders, header sections, menus' actions, text boxes and the first ``rows`` rows
    of item views."""
    out: list[tuple[QWidget, str]] = []
    for w in widgets_of(top):
        if w.isWindow() and w.windowTitle():
            out.append((w, w.windowTitle().replace("[*]", "")))
        if not shown(w):
            continue
        if isinstance(w, QLabel):
            out.append((w, plain(w.text())))
        elif isinstance(w, QAbstractButton):
            out.append((w, w.text()))
        elif isinstance(w, QGroupBox):
            out.append((w, w.title()))
        elif isinstance(w, QDockWidget):
            out.append((w, w.windowTitle()))
        elif isinstance(w, QTabBar):
            out.extend((w, w.tabText(i)) for i in range(w.count()))
        elif isinstance(w, QComboBox):
            out.extend((w, w.itemText(i)) for i in range(w.count()))
        elif isinstance(w, QLineEdit):
            out.append((w, w.placeholderText()))
        elif isinstance(w, QPlainTextEdit):
            out.append((w, w.toPlainText() or w.placeholderText()))
        elif isinstance(w, QTextEdit):
            out.append((w, w.toPlainText()))
        elif isinstance(w, QHeaderView) and w.model() is not None:
            for i in range(min(w.count(), 60)):
                out.append((w, str(w.model().headerData(i, w.orientation()) or "")))
        elif isinstance(w, QAbstractItemView) and w.model() is not None:
            model = w.model()
            out.extend(_item_texts(w, model, QModelIndex(), rows))
    for action in top.actions() if hasattr(top, "actions") else ():
        out.append((top, action.text()))
    return [(w, t) for w, t in out if t and t.strip()]


def _item_texts(view, model, parent, rows) -> list[tuple[QWidget, str]]:
    out = []
    try:
        columns = model.columnCount(parent)
    except TypeError:  # a list widget's model keeps columnCount private: one column
        columns = 1
    for r in range(min(model.rowCount(parent), rows)):
        for c in range(columns):
            index = model.index(r, c, parent)
            text = model.data(index, Qt.ItemDataRole.DisplayRole)
            if isinstance(text, str):
                out.append((view, text))
        first = model.index(r, 0, parent)
        if model.rowCount(first) > 0:
            out.extend(_item_texts(view, model, first, rows))
    return out


def drop_data(text: str, data: list[str], by: str) -> str:
    """``text`` with every data name (as a whole word or words) replaced by ``by``."""
    for name in sorted(data, key=len, reverse=True):
        if name:
            text = re.sub(rf"(?<!\w){re.escape(name)}(?!\w)", by, text)
    return text


def english_left(text: str, data: list[str]) -> str:
    """What is left of ``text`` in plain English once the pseudo-translated parts, the data
    names (jobs, machines, operators, the shop, files) and Qt's own words are taken out."""
    text = drop_data(no_mnemonic(text), data, " ")
    words = [w for w in _WORD.findall(text) if w not in QT_OWN]
    return " ".join(words)


class SourceIndex:
    """Finds which source files hold an English phrase (to name where an escape comes from)."""

    def __init__(self) -> None:
        # mnemonics taken out, as in the texts looked up
        self.files = {str(p.relative_to(ROOT)): p.read_text(encoding="utf-8").replace("&", "")
                      for d in SHOWN_DIRS for p in sorted((ROOT / d).rglob("*.py"))}

    def files_with(self, text: str, data: list[str]) -> list[str]:
        text = drop_data(no_mnemonic(text), data, "\n")
        phrases = sorted({p.strip() for p in _PHRASE.findall(text)}, key=len, reverse=True)
        for phrase in phrases:
            if not _WORD.search(phrase) or phrase in QT_OWN:
                continue
            hits = [f for f, body in self.files.items() if phrase in body]
            if hits:
                return hits
        # Composed at run time (an f-string around data): the files holding every word.
        words = set(_WORD.findall(" ".join(phrases))) - QT_OWN
        if not words:
            return []
        return [f for f, body in self.files.items()
                if all(re.search(rf"[\"'][^\"'\n]*\b{re.escape(w)}\b", body) for w in words)]


def escaped(texts: list[tuple[QWidget, str]], data: list[str], index: SourceIndex,
            pending: dict[str, str], scope: tuple[str, ...] | None = None) -> tuple[list[str], list[str]]:
    """(escapes to fix, escapes expected) among ``texts``: a text escaped when English words
    are left in it; it is expected when every source file holding it is in ``pending``
    (the files not wrapped in tr() yet). ``scope``: the only folders it can come from."""
    bad, expected, seen = [], [], set()
    for widget, text in texts:
        left = english_left(text, data)
        if not left or (id(widget), text) in seen:
            continue
        seen.add((id(widget), text))
        files = index.files_with(text, data)
        line = f"{chain(widget)}: {text!r} (English: {left!r}; in {', '.join(files) or 'no source file'})"
        # Where the translatable sources hold it, they decide; else the core files do.
        # A short word is in many files: one pending file among them is enough, so the
        # check tightens as the pending list shrinks.
        if scope is not None:
            files = [f for f in files if f.startswith(scope)]
        owners = [f for f in files if f.startswith(SOURCE_DIRS)] or files
        if any(f in pending for f in owners):
            expected.append(line)
        else:
            bad.append(line)
    return bad, expected
