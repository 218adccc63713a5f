"""Every mark of the grid and the crew table stays readable with a high-contrast palette
(black, white and yellow, as a platform's high-contrast scheme sets it) and with the
default light one: the text of each marked cell and heading against its background has a
contrast ratio of at least 4.5 : 1, the WCAG 2.x level AA minimum for normal text
(W3C, Web Content Accessibility Guidelines 2.1, success criterion 1.4.3, with its
relative luminance and contrast ratio definitions; computed independently here).

The colours come from the models' roles composited over the view's base colour as the
item delegate paints them; the painted pixels of the screenshot (PNG in tmp_path) are
compared with that composite so the check reads what is on screen.
"""

from __future__ import annotations

import pytest
from PySide6.QtCore import Qt
from PySide6.QtGui import QColor, QPalette
from PySide6.QtWidgets import QApplication
from ui_support import activate, make_window, save_shot, wait_plan

from conftest import SAMPLES
from dispatcher.shop import MUST, MUST_NOT
from dispatcher.shop.proposal import EVENT_DOWN
from dispatcher.ui.crew_model import FIRST_MACHINE as CREW_FIRST_MACHINE
from dispatcher.ui.grid_model import COL_PLAN, COL_RUSH, FIRST_MACHINE_COL, PinRole, RunningRole, SourceRole

AA_NORMAL_TEXT = 4.5  # WCAG 2.1 SC 1.4.3 (level AA, normal text)
BG, FG = Qt.ItemDataRole.BackgroundRole, Qt.ItemDataRole.ForegroundRole


def _linear(channel: float) -> float:
    # sRGB to linear light, as in WCAG 2.1's definition of relative luminance
    return channel / 12.92 if channel <= 0.03928 else ((channel + 0.055) / 1.055) ** 2.4


def luminance(c: QColor) -> float:
    return 0.2126 * _linear(c.redF()) + 0.7152 * _linear(c.greenF()) + 0.0722 * _linear(c.blueF())


def contrast(a: QColor, b: QColor) -> float:
    """WCAG 2.x contrast ratio (L1 + 0.05) / (L2 + 0.05), lighter over darker."""
    la, lb = sorted((luminance(a), luminance(b)), reverse=True)
    return (la + 0.05) / (lb + 0.05)


def over(colour: QColor, base: QColor) -> QColor:
    """``colour`` painted over ``base`` (source-over with its alpha)."""
    a = colour.alphaF()
    return QColor(round(colour.red() * a + base.red() * (1 - a)),
                  round(colour.green() * a + base.green() * (1 - a)),
                  round(colour.blue() * a + base.blue() * (1 - a)))


def high_contrast_palette() -> QPalette:
    """Black backgrounds, white text, yellow selection and links (a platform's
    high-contrast scheme in its usual colours)."""
    p = QPalette()
    black, white, yellow = QColor("#000000"), QColor("#FFFFFF"), QColor("#FFFF00")
    for role, colour in ((QPalette.ColorRole.Window, black), (QPalette.ColorRole.WindowText, white),
                         (QPalette.ColorRole.Base, black), (QPalette.ColorRole.AlternateBase, black),
                         (QPalette.ColorRole.Text, white), (QPalette.ColorRole.Button, black),
                         (QPalette.ColorRole.ButtonText, white), (QPalette.ColorRole.BrightText, yellow),
                         (QPalette.ColorRole.Highlight, yellow), (QPalette.ColorRole.HighlightedText, black),
                         (QPalette.ColorRole.ToolTipBase, black), (QPalette.ColorRole.ToolTipText, white),
                         (QPalette.ColorRole.Link, yellow), (QPalette.ColorRole.PlaceholderText, white)):
        p.setColor(role, colour)
    return p


@pytest.fixture(params=["light", "high_contrast"])
def scheme(request, qapp):
    before = QApplication.palette()
    if request.param == "high_contrast":
        QApplication.setPalette(high_contrast_palette())
    yield request.param
    QApplication.setPalette(before)


def _cell_findings(view, what_of, name: str, image) -> tuple[list[str], dict[str, float]]:
    """(cells below the minimum, the lowest ratio per kind of mark) for a table view;
    ``what_of(index)`` names the mark a cell shows (None: no mark)."""
    model = view.model()
    bases = (view.palette().color(QPalette.ColorRole.Base),
             view.palette().color(QPalette.ColorRole.AlternateBase if view.alternatingRowColors()
                                  else QPalette.ColorRole.Base))
    text = view.palette().color(QPalette.ColorRole.Text)
    bad, lowest = [], {}
    for r in range(model.rowCount()):
        for c in range(model.columnCount()):
            index = model.index(r, c)
            kind = what_of(index)
            if kind is None:
                continue
            base = bases[r % 2]
            bg = model.data(index, BG)
            fg = model.data(index, FG)
            painted_bg = over(QColor(bg), base) if bg is not None else base
            painted_fg = QColor(fg) if fg is not None else text
            ratio = contrast(painted_fg, painted_bg)
            lowest[kind] = min(ratio, lowest.get(kind, 99.0))
            rect = view.visualRect(index)
            if image is not None and rect.isValid() and view.viewport().rect().contains(rect):
                pixel = image.pixelColor(rect.left() + 2, rect.top() + 2)
                assert max(abs(pixel.red() - painted_bg.red()), abs(pixel.green() - painted_bg.green()),
                           abs(pixel.blue() - painted_bg.blue())) <= 3, \
                    f"{name} cell ({r}, {c}): painted {pixel.name()}, expected {painted_bg.name()}"
            if ratio < AA_NORMAL_TEXT:
                bad.append(f"{name} {kind} ({r}, {c}) {model.data(index)!r}: {painted_fg.name()} on "
                           f"{painted_bg.name()} = {ratio:.2f} : 1")
    return bad, lowest


def _header_findings(view, name: str) -> tuple[list[str], dict[str, float]]:
    header = view.horizontalHeader()
    model = view.model()
    button = header.palette().color(QPalette.ColorRole.Button)
    text = header.palette().color(QPalette.ColorRole.ButtonText)
    bad, lowest = [], {}
    for s in range(model.columnCount()):
        bg = model.headerData(s, Qt.Orientation.Horizontal, BG)
        if bg is None:
            continue
        fg = model.headerData(s, Qt.Orientation.Horizontal, FG)
        painted_bg = over(QColor(bg), button)
        painted_fg = QColor(fg) if fg is not None else text
        ratio = contrast(painted_fg, painted_bg)
        lowest["machine state heading"] = min(ratio, lowest.get("machine state heading", 99.0))
        if ratio < AA_NORMAL_TEXT:
            label = str(model.headerData(s, Qt.Orientation.Horizontal) or "").replace("\n", " / ")
            bad.append(f"{name} heading {s} {label!r}: {painted_fg.name()} on {painted_bg.name()} = "
                       f"{ratio:.2f} : 1")
    return bad, lowest


def _grid_mark(window):
    model = window.model

    def what(index):
        r, c = index.row(), index.column()
        if c == COL_RUSH:
            return "rush" if window.doc.job_at(r).rush else None
        if c == COL_PLAN:
            return "waiting" if model.data(index, BG) is not None else "planned job"
        if c < FIRST_MACHINE_COL:
            return None
        if model.data(index, RunningRole):
            return "running"
        if model.data(index, PinRole) == MUST:
            return "pinned"
        if model.data(index, PinRole) == MUST_NOT:
            return "forbidden"
        if model.data(index, Qt.ItemDataRole.UserRole + 1) is None:
            return "incompatible"
        if model.data(index, Qt.ItemDataRole.UserRole + 2):
            return "planned"
        if window.doc.machine_at(c - FIRST_MACHINE_COL).state != "up":
            return "machine down or in maintenance"
        source = model.data(index, SourceRole)
        return f"{source} value" if source else "value"

    return what


def test_grid_and_crew_marks_are_readable(qtbot, tmp_path, monkeypatch, scheme):
    window = make_window(qtbot, tmp_path, monkeypatch, SAMPLES / "crewed_fabrication_cell.dshop")
    activate(qtbot, window)
    # a pin, a ban, a machine in maintenance and one down (confirmed as a decision)
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL))
    window.edits.pin(MUST_NOT)
    window.view.setCurrentIndex(window.model.index(1, FIRST_MACHINE_COL + 1))
    window.edits.pin(MUST)
    window.view.setCurrentIndex(window.model.index(0, FIRST_MACHINE_COL + 6))
    window.edits.toggle_maintenance()
    wait_plan(qtbot, window)
    window.decisions.machine_event(EVENT_DOWN, 4).confirm("Supervisor A", reason="breakdown")
    wait_plan(qtbot, window)
    window.view.clearSelection()
    window.view.setCurrentIndex(window.model.index(-1, -1))
    window.view.horizontalScrollBar().setValue(0)  # the job columns (rush, plan) in view
    QApplication.processEvents()
    shot = save_shot(window.view, tmp_path, f"grid_{scheme}")
    from PySide6.QtGui import QImage

    image = window.view.viewport().grab().toImage()
    bad, lowest = _cell_findings(window.view, _grid_mark(window), "grid", image)
    more, low2 = _header_findings(window.view, "grid")
    bad += more
    lowest.update(low2)

    window.tabs.setCurrentWidget(window.crew_tab.view)
    QApplication.processEvents()
    table = window.crew_tab.table
    save_shot(window.crew_tab.view, tmp_path, f"crew_{scheme}")
    crew_image = table.viewport().grab().toImage()
    crew_bad, crew_low = _cell_findings(
        table, lambda i: ("crew authorisation" if i.column() >= CREW_FIRST_MACHINE else "crew cell")
        if table.model().data(i, BG) is not None or i.column() >= CREW_FIRST_MACHINE else None,
        "crew", crew_image)
    bad += crew_bad
    lowest.update({k: min(v, lowest.get(k, 99.0)) for k, v in crew_low.items()})
    (tmp_path / "contrast.txt").write_text(
        "\n".join(f"{k}: {v:.2f} : 1" for k, v in sorted(lowest.items())) + "\n", encoding="utf-8")
    for kind in ("rush", "waiting", "running", "pinned", "forbidden", "incompatible", "planned",
                 "machine down or in maintenance", "machine state heading", "crew authorisation"):
        assert kind in lowest, f"no {kind} cell in the test shop ({sorted(lowest)})"
    assert shot.exists() and isinstance(image, QImage)
    assert not bad, f"marks below {AA_NORMAL_TEXT} : 1 ({scheme}):\n" + "\n".join(bad)


def test_typed_and_derived_values_are_readable(qtbot, tmp_path, monkeypatch, scheme):
    window = make_window(qtbot, tmp_path, monkeypatch, SAMPLES / "small_moulding_cell.dshop")
    activate(qtbot, window)
    model = window.model
    derived = [model.index(r, c) for r in range(model.rowCount())
               for c in range(FIRST_MACHINE_COL, model.columnCount())
               if model.data(model.index(r, c), SourceRole) == "derived"
               and _grid_mark(window)(model.index(r, c)) == "derived value"]
    assert len(derived) > 1, "the moulding sample derives values from its changeover tables"
    value = model.data(derived[0], Qt.ItemDataRole.UserRole + 1)
    assert model.setData(derived[0], str(value + 1000), Qt.ItemDataRole.EditRole)
    wait_plan(qtbot, window)
    window.view.clearSelection()
    window.view.setCurrentIndex(model.index(-1, -1))
    QApplication.processEvents()
    save_shot(window.view, tmp_path, f"values_{scheme}")
    image = window.view.viewport().grab().toImage()
    bad, lowest = _cell_findings(window.view, _grid_mark(window), "grid", image)
    assert "typed value" in lowest and "derived value" in lowest, sorted(lowest)
    assert not bad, f"marks below {AA_NORMAL_TEXT} : 1 ({scheme}):\n" + "\n".join(bad)


def test_the_contrast_formula_against_known_pairs():
    """Black on white is 21 : 1 and a colour on itself 1 : 1 (WCAG 2.1 definitions);
    #777777 on white is about 4.48 : 1 (from memory: the grey usually quoted as just
    failing AA)."""
    assert contrast(QColor("#000000"), QColor("#FFFFFF")) == pytest.approx(21.0)
    assert contrast(QColor("#56B4E9"), QColor("#56B4E9")) == pytest.approx(1.0)
    assert contrast(QColor("#777777"), QColor("#FFFFFF")) == pytest.approx(4.48, abs=0.01)
