"""The safety cautions, as literal required phrases in what a person actually reads.

Required points (README, Safety): lockout/tagout before any work on a down machine;
operators run only machines they are trained and authorised for; follow the machine's
setup instructions; local regulations and the site's safety rules take precedence. Each
is checked as a fixed phrase in the printed PDF (text extracted by pypdf), the text sheet
of the command line, the re-dispatch text and the breakdown dialog as shown, never by
comparing with the constant that produced the text.
"""

from __future__ import annotations

import re
from pathlib import Path

import pytest
from pypdf import PdfReader

from dispatcher.cli import main
from dispatcher.shop import Machine

SAMPLE = Path(__file__).resolve().parent.parent / "sample_shops" / "small_moulding_cell.dshop"

@pytest.fixture(autouse=True)
def _qt_app(qapp):
    """The sheet command draws with Qt in this process: pytest-qt's QApplication is the one."""
    return qapp


PHRASES = ["lockout/tagout", "trained and authorised", "setup instructions", "local regulations"]


def flat(text: str) -> str:
    """Lower case, one space between words (PDF lines wrap anywhere)."""
    return re.sub(r"\s+", " ", text).lower()


def assert_phrases(text: str, where: str) -> None:
    shown = flat(text)
    missing = [p for p in PHRASES if p not in shown]
    assert not missing, f"{where} lacks {missing}"


def test_printed_pdf_carries_every_caution_on_every_page(tmp_path, capsys):
    out = tmp_path / "sheet.pdf"
    assert main(["sheet", str(SAMPLE), "--pdf", str(out)]) == 0
    pages = [page.extract_text() for page in PdfReader(str(out)).pages]
    assert pages
    for n, text in enumerate(pages, 1):
        assert_phrases(text, f"PDF page {n}")


def test_text_sheet_carries_every_caution(capsys):
    assert main(["sheet", str(SAMPLE)]) == 0
    assert_phrases(capsys.readouterr().out, "text sheet")


def test_redispatch_text_names_lockout_tagout_for_the_machine_down(tmp_path, capsys):
    shop_file = tmp_path / "cell.dshop"
    shop_file.write_bytes(SAMPLE.read_bytes())
    assert main(["solve", str(shop_file), "--in-force"]) == 0
    from dispatcher.io.shopfile import load_shop
    shown = {}
    for machine in (m.name for m in load_shop(shop_file).machines if m.state == "up"):
        capsys.readouterr()
        if main(["redispatch", str(shop_file), "--down", machine]) == 0:
            shown[machine] = flat(capsys.readouterr().out)
    assert shown, "some breakdown of the sample leaves a plan"
    for machine, out in shown.items():
        assert "lockout/tagout" in out and flat(machine) in out


def test_breakdown_dialog_shows_every_caution(qtbot, tmp_path, monkeypatch):
    from PySide6.QtWidgets import QLabel
    from ui_support import make_window
    window = make_window(qtbot, tmp_path, monkeypatch, SAMPLE)
    shop = window.doc.shop
    col = next(k for k, m in enumerate(shop.machines) if m.state == "up")
    dialog = window.decisions.machine_event("down", col)
    assert dialog is not None and dialog.isVisible()
    shown = " ".join(label.text() for label in dialog.findChildren(QLabel) if label.isVisible())
    assert_phrases(shown, "breakdown dialog")


@pytest.mark.parametrize("phrase", PHRASES)
def test_readme_safety_section_carries_the_phrase(phrase):
    readme = (Path(__file__).resolve().parent.parent / "README.md").read_text(encoding="utf-8")
    section = readme.split("## Safety", 1)[1].split("\n## ", 1)[0]
    assert phrase in flat(section)


def test_machine_down_sheet_heading_names_lockout_tagout(tmp_path, capsys):
    from dispatcher.io.shopfile import load_shop, save_shop
    shop = load_shop(SAMPLE)
    doc, out = tmp_path / "down.dshop", tmp_path / "down.pdf"
    for k in reversed(range(len(shop.machines))):  # a breakdown that leaves a plan
        down = load_shop(SAMPLE)
        down.machines[k] = Machine(**{**down.machines[k].__dict__, "state": "down"})
        save_shop(down, doc)
        if main(["sheet", str(doc), "--pdf", str(out)]) == 0:
            break
    else:
        pytest.fail("every breakdown of the sample is infeasible")
    text = flat(" ".join(p.extract_text() for p in PdfReader(str(out)).pages))
    assert "lockout/tagout before any work" in text
