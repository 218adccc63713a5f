"""`dispatcher sheet` and the sheet builder, from a real shop to a real PDF read with pypdf.

The plan printed must be the plan the shop model computes (``solve_shop``) or the plan
recorded in the history, machine by machine; the PDF's extracted text (pypdf) is the
outside witness of what the page says.
"""

from __future__ import annotations

import datetime as dt
import re
from pathlib import Path

import pypdf
import PySide6.QtGui  # noqa: F401  (a runtime dependency: a missing one must fail, not skip)
import pytest

from dispatcher.cli import main
from dispatcher.io.shopfile import save_shop, shop_to_dict
from dispatcher.sheet.build import build_sheet
from dispatcher.sheet.content import SAFETY_CAUTIONS, sheet_text
from dispatcher.shop import (
    DOWN,
    MAINTENANCE,
    MUST,
    RUNNING,
    Job,
    Machine,
    Pin,
    Shift,
    Shop,
    solve_shop,
)

ROOT = Path(__file__).resolve().parent.parent
T0 = dt.datetime(2026, 3, 9, 5, 30)


@pytest.fixture(autouse=True)
def _qt_app(qapp):
    """The command draws with Qt in this process: let pytest-qt's QApplication be the one,
    so widget tests later in the same run still get a QApplication."""
    return qapp


def invented_shop() -> Shop:
    """Five machines (one down, one in maintenance, one with two slots), nine jobs."""
    shop = Shop(name="Invented sheet test shop", shift=Shift(day=dt.date(2026, 3, 9), label="early"))
    shop.machines = [
        Machine("M1", "Lathe A"),
        Machine("M2", "Lathe B", slots=2, notes="chuck jaws in drawer 3"),
        Machine("M3", "Mill C", state=DOWN, state_note="coolant leak, locked out",
                state_changed=dt.datetime(2026, 3, 9, 4, 50)),
        Machine("M4", "Mill D", state=MAINTENANCE, state_note="spindle service"),
        Machine("M5", "Saw E"),
    ]
    shop.jobs = [
        Job("J1", "Shaft 100", work_order="WO-100", state=RUNNING, machine="M1", since=T0),
        Job("J2", "Bracket 200", work_order="WO-200", rush=True),
        Job("J3", "Plate 300", work_order="WO-300", due=dt.datetime(2026, 3, 9, 9, 0)),
        Job("J4", "Ring 400", work_order="WO-400", due=dt.datetime(2026, 3, 9, 8, 0)),
        Job("J5", "Hub 500", work_order="WO-500", notes="first-off inspection"),
        Job("J6", "Cover 600", work_order="WO-600"),
        Job("J7", "Pin 700", work_order="WO-700"),
        Job("J8", "Housing 800", work_order="WO-800"),  # only the down mill can run it
        Job("J9", "Flange 900", work_order="WO-900"),
    ]
    grid = {
        "J1": {"M1": 5},
        "J2": {"M2": 12, "M5": 30},
        "J3": {"M2": 9, "M5": 14},
        "J4": {"M2": 7, "M1": 20},
        "J5": {"M1": 11, "M5": 8},
        "J6": {"M2": 15, "M5": 6},
        "J7": {"M2": 18, "M5": 19},
        "J8": {"M3": 4},
        "J9": {"M4": 3, "M1": 25},
    }
    for job, row in grid.items():
        for machine, value in row.items():
            shop.grid[(job, machine)] = float(value)
    return shop


def pdf_text(path: Path) -> tuple[int, str]:
    reader = pypdf.PdfReader(str(path))
    return len(reader.pages), re.sub(r"\s+", " ", " ".join(p.extract_text() or "" for p in reader.pages))


def test_builder_prints_exactly_the_plan():
    shop = invented_shop()
    plan = solve_shop(shop)
    content = build_sheet(shop, plan)
    assert [m.name for m in content.machines] == [m.name for m in shop.machines]
    on_sheet = {(m.name, j.name) for m in content.machines for j in m.jobs}
    planned = ({(a.machine, a.job) for a in plan.assignments}
               | {(r.machine, r.job) for r in plan.running})
    assert on_sheet == planned
    assert ("Lathe A", "Shaft 100") in on_sheet  # the running job carries on
    carried = [j for m in content.machines for j in m.jobs if j.continuing]
    assert [j.name for j in carried] == ["Shaft 100"] and carried[0].running_since == T0
    assert {w.name for w in content.waiting} == set(plan.waiting_jobs)
    assert "Housing 800" in plan.waiting_jobs
    why = {w.name: w.why for w in content.waiting}["Housing 800"]
    assert why and not why.startswith("Housing 800")
    assert [(d.name, d.state) for d in content.down] == [("Mill C", DOWN), ("Mill D", MAINTENANCE)]
    assert content.totals.jobs_dispatched == len(plan.assignments)
    assert content.totals.jobs_continuing == 1
    assert content.totals.total == plan.total
    assert content.decision_number is None


def test_two_slot_machine_lists_rush_first_then_by_due_time():
    shop = invented_shop()
    plan = solve_shop(shop)
    lathe_b = next(m for m in build_sheet(shop, plan).machines if m.name == "Lathe B")
    names = [j.name for j in lathe_b.jobs]
    assert len(names) == 2 and set(names) == set(plan.jobs_on("Lathe B"))
    jobs = {j.name: j for j in shop.jobs}
    keys = [(not jobs[n].rush, jobs[n].due or dt.datetime.max) for n in names]
    assert keys == sorted(keys)
    assert "2 slots" in lathe_b.all_notes()


def test_explicit_run_order_is_kept_and_hours_are_shown():
    shop = invented_shop()
    for job in shop.jobs:
        job.run_hours = 1.5
    shop.machines[1].speed_factor = 2.0  # Lathe B is half as fast
    plan = solve_shop(shop)
    on_lathe = plan.jobs_on("Lathe B")
    assert len(on_lathe) == 2
    shop.hours[(shop.job_by_name(on_lathe[0]).id, "M2")] = 0.75  # a pair's own hours win
    order = {"Lathe B": list(reversed(on_lathe))}
    lathe = next(m for m in build_sheet(shop, plan, order=order).machines if m.name == "Lathe B")
    assert [j.name for j in lathe.jobs] == list(reversed(on_lathe))
    assert {j.name: j.hours for j in lathe.jobs} == {on_lathe[0]: 0.75, on_lathe[1]: 3.0}


def test_cli_writes_a_pdf_with_every_machine_and_job(tmp_path, capsys):
    shop = invented_shop()
    doc = tmp_path / "shop.dshop"
    save_shop(shop, doc)
    out = tmp_path / "sheet.pdf"
    assert main(["sheet", str(doc), "--pdf", str(out), "--paper", "letter"]) == 0
    assert f"wrote {out}" in capsys.readouterr().out
    pages, text = pdf_text(out)
    box = pypdf.PdfReader(str(out)).pages[0].mediabox
    assert (round(float(box.width)), round(float(box.height))) == (612, 792)  # US Letter, 8.5 x 11 in
    plan = solve_shop(shop)
    for m in shop.machines:
        assert m.name in text
    for a in plan.assignments:
        job = shop.job_by_name(a.job)
        assert a.job in text and job.work_order in text
    assert "Shaft 100" in text and "carries on" in text
    for caution in SAFETY_CAUTIONS:
        assert caution in text
    assert "not recorded" in text
    assert "coolant leak, locked out" in text
    assert f"Page {pages} of {pages}" in text


def test_cli_without_pdf_prints_the_sheet_as_text(tmp_path, capsys):
    doc = tmp_path / "shop.dshop"
    save_shop(invented_shop(), doc)
    assert main(["sheet", str(doc)]) == 0
    out = capsys.readouterr().out
    assert "Dispatch sheet - Invented sheet test shop" in out
    assert "Mill C [DOWN]" in out and "SAFETY:" in out and SAFETY_CAUTIONS[-1] in out


def test_cli_accepts_a_grid_file(tmp_path, capsys):
    out = tmp_path / "grid.pdf"
    grid = ROOT / "sample_shops" / "sheet_metal_grid.csv"
    assert main(["sheet", str(grid), "--pdf", str(out), "--paper", "a4"]) == 0
    pages, text = pdf_text(out)
    assert pages >= 1 and "Dispatch sheet - sheet_metal_grid" in text


def test_cli_bad_shop_is_one_clear_error(tmp_path, capsys):
    bad = tmp_path / "broken.dshop"
    bad.write_text("{ not json", encoding="utf-8")
    out = tmp_path / "never.pdf"
    assert main(["sheet", str(bad), "--pdf", str(out)]) == 2
    err = capsys.readouterr().err
    assert "broken.dshop" in err and err.count("\n") == 1
    assert not out.exists()


def test_cli_missing_output_folder(tmp_path, capsys):
    doc = tmp_path / "shop.dshop"
    save_shop(invented_shop(), doc)
    assert main(["sheet", str(doc), "--pdf", str(tmp_path / "no" / "x.pdf")]) == 2
    assert "does not exist" in capsys.readouterr().err


class TestRecordedDecision:
    @pytest.fixture
    def recorded(self, tmp_path):
        from dispatcher import history
        shop = invented_shop()
        # one job per machine: the history (as of this writing) refuses a plan that gives
        # a machine two jobs, which a two-slot machine would
        shop.machines[1].slots = 1
        doc = tmp_path / "shop.dshop"
        save_shop(shop, doc)
        db = tmp_path / "history.sqlite"
        store = history.HistoryStore(db)
        plan = solve_shop(shop)
        number = store.record(shop_to_dict(shop), plan.to_json(), by="early-shift lead",
                              reason="shift start", time=dt.datetime(2026, 3, 9, 5, 58,
                                                                     tzinfo=dt.UTC))
        return shop, doc, db, number, plan

    def test_sheet_of_a_recorded_decision(self, recorded, tmp_path, capsys):
        shop, doc, db, number, plan = recorded
        out = tmp_path / "decision.pdf"
        assert main(["sheet", str(doc), "--decision", str(number), "--history", str(db),
                     "--pdf", str(out)]) == 0
        _, text = pdf_text(out)
        assert f"Decision #{number}" in text and "Supervisor early-shift lead" in text
        assert "not recorded" not in text
        for a in plan.assignments:
            assert a.job in text
        assert main(["sheet", str(doc), "--decision", "latest", "--history", str(db)]) == 0
        assert f"Decision #{number}" in capsys.readouterr().out

    def test_sheet_prints_the_snapshot_not_todays_document(self, recorded, tmp_path, capsys):
        shop, doc, db, number, plan = recorded
        changed = invented_shop()
        changed.machines[1].slots = 1
        changed.machines[2].state_note = "edited after the decision"
        save_shop(changed, doc)
        assert main(["sheet", str(doc), "--decision", str(number), "--history", str(db)]) == 0
        out = capsys.readouterr().out
        assert "coolant leak, locked out" in out and "edited after" not in out

    def test_unknown_decision_and_other_shop_are_bad_input(self, recorded, tmp_path, capsys):
        shop, doc, db, number, plan = recorded
        assert main(["sheet", str(doc), "--decision", "999", "--history", str(db)]) == 2
        assert "999" in capsys.readouterr().err
        assert main(["sheet", str(doc), "--decision", "soon", "--history", str(db)]) == 2
        assert "'soon'" in capsys.readouterr().err
        other = invented_shop()
        other.name = "Another invented shop"
        other_doc = tmp_path / "other.dshop"
        save_shop(other, other_doc)
        assert main(["sheet", str(other_doc), "--decision", str(number), "--history", str(db)]) == 2
        err = capsys.readouterr().err
        assert "is for shop 'Invented sheet test shop'" in err and "other.dshop" in err


def test_pinned_job_says_so():
    shop = invented_shop()
    shop.pins.append(Pin("J6", "M5", MUST, "fixture stays on the saw"))
    plan = solve_shop(shop)
    assert plan.machine_of("Cover 600") == "Saw E"
    saw = next(m for m in build_sheet(shop, plan).machines if m.name == "Saw E")
    cover = next(j for j in saw.jobs if j.name == "Cover 600")
    assert cover.pinned and cover.pin_note == "fixture stays on the saw"
    assert cover.all_notes() == "pinned here (fixture stays on the saw)"


def filled_shop() -> Shop:
    """The invented shop with run hours on every job and a 6-hour shift."""
    shop = invented_shop()
    shop.shift.hours = 6.0
    for k, job in enumerate(shop.jobs):
        job.run_hours = 1.0 + (k % 3)
    return shop


def test_filled_shift_keeps_the_planned_run_order_and_hours():
    from dispatcher.shop.fill_shift import fill_shop_shift

    shop = filled_shop()
    fill = fill_shop_shift(shop)
    content = build_sheet(shop, fill)
    assert any(len(m.jobs) > 1 for m in content.machines)
    for m in content.machines:
        assert [j.name for j in m.jobs] == fill.jobs_on(m.name)
        for job in m.jobs:
            machine = shop.machine_by_name(m.name)
            expected = shop.job_by_name(job.name).run_hours * machine.speed_factor
            assert job.hours == pytest.approx(expected)
    assert content.totals.status == fill.status_text
    assert {w.name for w in content.waiting} == set(fill.waiting_jobs)
    # Each machine's hours used, as the app shows them: the run hours of its jobs summed
    # here from the shop (running jobs' hours included by the plan's own count).
    planned = {x.machine: x for x in fill.machines}
    assert planned
    for m in content.machines:
        if m.name not in planned:
            continue
        fm = planned[m.name]
        assert f"{fm.hours_used:g} of {fm.capacity:g} h used" in m.notes
        assert fm.hours_used >= sum(j.hours for j in m.jobs if not j.continuing) - 1e-9


def test_cli_fill_shift_sheet(tmp_path, capsys):
    from dispatcher.shop.fill_shift import fill_shop_shift

    shop = filled_shop()
    doc = tmp_path / "filled.dshop"
    save_shop(shop, doc)
    out = tmp_path / "filled.pdf"
    assert main(["sheet", str(doc), "--fill-shift", "--pdf", str(out)]) == 0
    _, text = pdf_text(out)
    fill = fill_shop_shift(shop)
    for m in fill.machines:
        count = len(m.running) + len(m.jobs)
        for k, job in enumerate(m.running + m.jobs, start=1):
            assert job in text
            if count > 1:
                assert f"{k} of {count}" in text
    grid = ROOT / "sample_shops" / "sheet_metal_grid.csv"
    assert main(["sheet", str(grid), "--fill-shift"]) == 2
    assert "needs a shop document" in capsys.readouterr().err
    assert main(["sheet", str(doc), "--time-limit", "5"]) == 2
    assert "--fill-shift only" in capsys.readouterr().err


def test_text_sheet_of_builder_names_every_job():
    shop = invented_shop()
    plan = solve_shop(shop)
    text = sheet_text(build_sheet(shop, plan))
    for a in plan.assignments:
        assert a.job in text
