"""Translations: complete and current .ts files (checked by running Qt's own pyside6-lupdate
over the sources), .qm files that are what pyside6-lrelease makes of them, and the sheet
printed in German and Spanish with the locale's numbers and dates."""

from __future__ import annotations

import datetime as dt
import re
import subprocess
import sys
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

pypdf = pytest.importorskip("pypdf")

from dispatcher import resources, translation  # noqa: E402

ROOT = Path(__file__).resolve().parent.parent
sys.path.insert(0, str(ROOT / "tools"))
import resources as tools_resources  # noqa: E402  (tools/resources.py)

sys.path.pop(0)

PLACEHOLDER = re.compile(r"\{[a-z_]+\}")


def messages(ts: Path) -> dict[tuple[str, str, str], ET.Element]:
    """(context, source, disambiguation) -> message element."""
    root = ET.parse(ts).getroot()
    return {(ctx.findtext("name"), msg.findtext("source"), msg.findtext("comment") or ""): msg
            for ctx in root.iter("context") for msg in ctx.iter("message")}


def qt_tool(name: str) -> str:
    try:
        return tools_resources.tool(name)
    except SystemExit as exc:
        pytest.fail(str(exc))


@pytest.fixture
def installed():
    """Install a language for one test and take it off afterwards."""
    yield translation.install
    translation.remove()


@pytest.mark.parametrize("language", resources.LANGUAGES)
def test_every_source_string_has_a_finished_entry(tmp_path, language):
    """pyside6-lupdate, run over today's sources into a copy of the committed .ts, adds
    every string without an entry as unfinished: there must be none, and nothing the
    committed file holds may have vanished from the sources."""
    committed = resources.translation(language, compiled=False)
    copy = tmp_path / committed.name
    copy.write_bytes(committed.read_bytes())
    options = list(tools_resources.LUPDATE_OPTIONS)
    if language == "en":
        options.append("-pluralonly")
    sources = [str(p.relative_to(ROOT)) for p in tools_resources.source_files()]
    subprocess.run([qt_tool("pyside6-lupdate"), *options, *sources, "-ts", str(copy)],
                   cwd=ROOT, check=True, capture_output=True)
    fresh, before = messages(copy), messages(Path(str(committed)))
    assert set(fresh) == set(before), (
        f"run `python tools/resources.py translations`: new {sorted(set(fresh) - set(before))},"
        f" gone {sorted(set(before) - set(fresh))}")
    unfinished = [key for key, msg in fresh.items()
                  if msg.find("translation").get("type") in ("unfinished", "vanished", "obsolete")]
    assert not unfinished, f"{language}: unfinished entries {unfinished}"
    assert len(fresh) >= (5 if language == "en" else 60)


@pytest.mark.parametrize("language", resources.LANGUAGES)
def test_translations_keep_placeholders_and_fill_every_plural_form(language):
    for (context, source, _d), msg in messages(Path(str(resources.translation(language, False)))).items():
        tr = msg.find("translation")
        if msg.get("numerus") == "yes":
            forms = [f.text or "" for f in tr.findall("numerusform")]
            assert len(forms) == 2 and all(forms), (context, source, forms)
            assert all("%n" in f for f in forms), (context, source)
        else:
            forms = [tr.text or ""]
            assert forms[0].strip(), (context, source)
        for form in forms:
            assert set(PLACEHOLDER.findall(form)) == set(PLACEHOLDER.findall(source)), \
                (language, source, form)


@pytest.mark.parametrize("language", resources.LANGUAGES)
def test_committed_qm_is_compiled_from_the_committed_ts(tmp_path, language):
    """A .qm older than its .ts (the .ts edited after compiling) differs from what
    pyside6-lrelease makes of the .ts now."""
    ts = Path(str(resources.translation(language, compiled=False)))
    out = tmp_path / f"{language}.qm"
    subprocess.run([qt_tool("pyside6-lrelease"), "-silent", str(ts), "-qm", str(out)],
                   check=True)
    assert out.read_bytes() == resources.translation(language).read_bytes(), \
        f"{ts.name} changed after its .qm was compiled: run `python tools/resources.py translations`"


def test_trade_words_and_safety_cautions_in_each_language():
    de, es = ({src: msg.find("translation").text.replace("\u00ad", "") for (_c, src, _d), msg in
               messages(Path(str(resources.translation(lang, False)))).items()
               if msg.find("comment") is None and msg.get("numerus") != "yes"}
              for lang in ("de", "es"))
    assert de["Setup"] == "Rüstzeit" and de["Work order"] == "Arbeitsauftrag"
    assert de["Shift"] == "Schicht" and "Umrüsten" in de[
        "Follow the machine's own setup instructions for every changeover."]
    assert "Sperren und Kennzeichnen" in de[
        "Apply lockout/tagout before any work on a machine that is down."]
    assert es["Work order"] == "Orden de trabajo" and es["Shift"] == "Turno"
    assert "bloqueo y etiquetado" in es[
        "Apply lockout/tagout before any work on a machine that is down."]
    assert "cambio de formato" in es[
        "Follow the machine's own setup instructions for every changeover."]


def test_system_language_picks_the_first_language_we_have():
    from PySide6.QtCore import QLocale

    assert translation.system_language(QLocale("de_AT")) == "de"
    assert translation.system_language(QLocale("es_MX")) == "es"
    assert translation.system_language(QLocale("fr_FR")) == "en"
    assert translation.locale_for("de", QLocale("de_AT")).name() == "de_AT"
    assert translation.locale_for("de", QLocale("en_US")).name() == "de_DE"


def _content():
    from dispatcher.sheet.content import (
        SheetContent,
        SheetDownMachine,
        SheetJob,
        SheetMachine,
        SheetTotals,
        SheetWaitingJob,
    )

    day = dt.date(2026, 3, 9)
    return SheetContent(
        shop_name="Invented test shop", shift_date=day, shift_label="early",
        supervisor="Supervisor A", decision_number=None, printed_at=dt.datetime(2026, 3, 9, 6, 1),
        machines=(SheetMachine("Press 1", "up", (SheetJob("Bracket", "WO-1", 12.5, "min"),
                                                 SheetJob("Lid", "WO-2", 1250, "min"))),
                  SheetMachine("Press 2", "down")),
        waiting=(SheetWaitingJob("Hinge", "WO-3", "3 jobs can only run on 1 machine(s) ...",
                                 competing=("Hinge", "Lid", "Bracket"), machines=("Press 1",),
                                 must_wait=1),),
        down=(SheetDownMachine("Press 2", "down", "hydraulic leak", dt.datetime(2026, 3, 9, 5)),),
        totals=SheetTotals(machines=2, machines_down=1, jobs_dispatched=2, jobs_waiting=1,
                           total=1262.5, unit="min", objective="least total setup",
                           status="optimal, proven by its certificate"))


def _pdf_text(path: Path) -> str:
    """The PDF's words, whitespace collapsed and words hyphenated at a soft hyphen joined."""
    reader = pypdf.PdfReader(str(path))
    text = re.sub(r"\s+", " ", " ".join(p.extract_text() or "" for p in reader.pages))
    return re.sub(r"(\w)- (\w)", r"\1\2", text.replace("\u00ad", ""))


def _headings(language: str) -> list[str]:
    """The translated column headings and sign-off words (no soft hyphens)."""
    table = {src: (msg.find("translation").text or "") for (_c, src, _d), msg in
             messages(Path(str(resources.translation(language, False)))).items()
             if msg.find("comment") is None and msg.get("numerus") != "yes"}
    return [table[w].replace("\u00ad", "") for w in (
        "Machine", "State", "Seq.", "Work order", "Job", "Setup", "Notes", "Initials", "Start",
        "Finish", "Why it waits", "Since", "Note", "Supervisor", "Signature", "Time")]


def test_sheet_prints_in_german_with_decimal_comma(qapp, installed, tmp_path):
    from dispatcher.sheet.render import write_pdf

    installed("de")
    out = tmp_path / "de.pdf"
    write_pdf(_content(), out, paper="a4", text_locale=translation.app_locale())
    text = _pdf_text(out)
    for phrase in ("Zuteilungsblatt - Invented test shop", "Arbeitsauftrag", "Rüstzeit",
                   "Schicht", "SICHERHEIT:", "Sperren und Kennzeichnen (LOTO)",
                   "Umrüsten", "12,5 min", "1.250 min", "1.262,5 min", "AUSGEFALLEN",
                   "3 Aufträge können nur auf Press 1 laufen, also muss 1 davon warten",
                   "Seite 1 von 1", "09.03.26", "2 Maschinen, 2 Aufträge"):
        assert phrase in text, phrase
    # every heading fits its column: printed whole (or hyphenated where it may break)
    for word in _headings("de"):
        assert re.search(rf"(^| ){re.escape(word)}( |$)", text), word
    assert "Work order" not in text and "SAFETY" not in text


def test_sheet_prints_in_spanish(qapp, installed, tmp_path):
    from dispatcher.sheet.render import write_pdf

    installed("es")
    out = tmp_path / "es.pdf"
    write_pdf(_content(), out, paper="a4", text_locale=translation.app_locale())
    text = _pdf_text(out)
    for phrase in ("Hoja de asignación", "Orden de trabajo", "Preparación", "Turno",
                   "bloqueo y etiquetado", "cambio de formato", "12,5 min", "SEGURIDAD:"):
        assert phrase in text, phrase
    for word in _headings("es"):
        assert re.search(rf"(^| ){re.escape(word)}( |$)", text), word


def test_command_line_sheet_stays_english_with_english_plurals(qapp, tmp_path):
    """Without the app's translator the sheet is English, plurals in English forms."""
    from dispatcher.sheet.render import write_pdf

    translation.remove()
    out = tmp_path / "en.pdf"
    write_pdf(_content(), out, paper="a4")
    text = _pdf_text(out)
    assert "Machines and jobs (2 machines, 2 jobs)" in text
    assert "3 jobs can only run on Press 1, so 1 of them must wait" in text
    assert "1,262.5 min" in text and "SAFETY:" in text and "2026-03-09" in text
    assert "(s)" not in text
    translation.remove()

