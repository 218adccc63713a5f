"""Shops with a crew: the document, the checks, and plans with an operator per machine.

References: brute force over every assignment of jobs to machines and of operators to
machines (tests/test_staffing.py's ``brute_force``), fed with arrays built here straight
from the shop's own fields, not by the code under test.
"""

from __future__ import annotations

import json
import os
import subprocess
import sys
from datetime import date, time
from pathlib import Path

import numpy as np
import pytest
from helpers_crew import brute_force
from hypothesis import given, settings
from hypothesis import strategies as st

from dispatcher.io.shopfile import (
    ShopFileError,
    dump_shop_text,
    load_shop,
    parse_shop_text,
    save_shop,
)
from dispatcher.shop import RUNNING, Job, Machine, Shop, solve_shop
from dispatcher.shop.crew import Authorisation, Crew, Operator

ROOT = Path(__file__).resolve().parent.parent
SAMPLE = ROOT / "sample_shops" / "crewed_fabrication_cell.dshop"


def _shop(n_jobs, n_machines, grid, ops, auths, unattended=(), rush=()):
    shop = Shop(name="test shop (invented)")
    shop.machines = [Machine(id=f"M{k}", name=f"machine {k}") for k in range(n_machines)]
    shop.jobs = [Job(id=f"J{i}", name=f"job {i}", rush=i in rush) for i in range(n_jobs)]
    shop.grid = {(f"J{i}", f"M{k}"): v for (i, k), v in grid.items()}
    shop.crew = Crew(operators=[Operator(f"O{o}", f"operator role {o}", cap) for o, cap in enumerate(ops)],
                     authorisations=[Authorisation(f"O{o}", machine=f"M{k}") for o, k in auths],
                     unattended=[f"M{k}" for k in unattended])
    return shop


@st.composite
def crewed_shops(draw):
    n = draw(st.integers(1, 4))
    m = draw(st.integers(1, 3))
    grid = {(i, k): float(draw(st.integers(0, 9))) for i in range(n) for k in range(m)
            if draw(st.booleans())}
    ops = draw(st.lists(st.integers(1, 2), min_size=1, max_size=3))
    auths = [(o, k) for o in range(len(ops)) for k in range(m) if draw(st.booleans())]
    unattended = [k for k in range(m) if draw(st.booleans()) and draw(st.booleans())]
    rush = [i for i in range(n) if draw(st.booleans())]
    return _shop(n, m, grid, ops, auths, unattended, rush)


@settings(max_examples=120, deadline=None)
@given(shop=crewed_shops())
def test_staffed_shop_plans_match_brute_force(shop):
    """Reference: brute force on arrays read straight from the shop's fields."""
    n, m = len(shop.jobs), len(shop.machines)
    values = np.zeros((n, m))
    allowed = np.zeros((n, m), bool)
    for (jid, mid), v in shop.grid.items():
        i, k = int(jid[1:]), int(mid[1:])
        values[i, k], allowed[i, k] = v, True
    qualified = np.zeros((len(shop.crew.operators), m), bool)
    for a in shop.crew.authorisations:
        qualified[int(a.operator[1:]), int(a.machine[1:])] = True
    capacity = np.array([o.capacity for o in shop.crew.operators])
    needs = np.array([f"M{k}" not in shop.crew.unattended for k in range(m)])
    rush = np.array([j.rush for j in shop.jobs])
    ref = brute_force(values, allowed, qualified, capacity, needs, np.zeros(n), rush,
                      np.zeros(n, bool))
    plan = solve_shop(shop)
    assert plan.verified
    placed = len(plan.assignments)
    rush_placed = sum(shop.job_by_name(a.job).rush for a in plan.assignments)
    assert (placed, rush_placed, round(-plan.total, 9)) == ref
    # Every running machine's operator is authorised and within capacity.
    load: dict[str, int] = {}
    for a in plan.assignments:
        k = int(shop.machine_by_name(a.machine).id[1:])
        if needs[k]:
            o = shop.crew.operator_by_label(a.operator)
            assert qualified[int(o.id[1:]), k]
            load[o.label] = load.get(o.label, 0) + 1
        else:
            assert a.operator is None
    for label, count in load.items():
        assert count <= shop.crew.operator_by_label(label).capacity


def test_plain_shop_json_has_no_crew_fields():
    shop = _shop(2, 2, {(0, 0): 1.0, (1, 1): 2.0}, [], [])
    shop.crew = Crew()
    data = solve_shop(shop).to_json()
    assert "staffing" not in data and all("operator" not in a for a in data["assignments"])
    assert json.loads(dump_shop_text(shop))["format_version"] == 1


def test_sample_shop_plans_operators_out_of_the_box():
    out = subprocess.run([sys.executable, "-m", "dispatcher", "solve", str(SAMPLE), "--json"],
                         capture_output=True, text=True, check=True).stdout
    data = json.loads(out)
    assert data["certificate"]["verified"] is True
    assert all("operator" in a for a in data["assignments"])
    staffing = data["staffing"]
    # Invented scenario: the cell lead is absent, so one press brake has nobody.
    assert staffing["operators_absent"] == ["Cell lead"]
    assert staffing["shortage"]["waiting"] == 1
    assert "Press brake 2 stays idle" in staffing["shortage"]["text"]
    assert [w["operator"] for w in staffing["expiring"]] == ["Welder (manual)"]
    assert staffing["minding"]["Robot cell minder"] == ["Robot welder A", "Robot welder B"]
    text = subprocess.run([sys.executable, "-m", "dispatcher", "solve", str(SAMPLE)],
                          capture_output=True, text=True, check=True).stdout
    assert "Operator" in text and "Shortage:" in text and "Warning: Welder (manual)" in text


def test_crew_round_trips_through_the_document(tmp_path):
    shop = load_shop(SAMPLE)
    path = tmp_path / "copy.dshop"
    save_shop(shop, path)
    again = load_shop(path)
    assert again.crew == shop.crew
    assert json.loads(path.read_text())["format_version"] == 2


def test_expired_authorisation_counts_as_none():
    shop = _shop(1, 1, {(0, 0): 1.0}, [1], [])
    shop.shift.day = date(2026, 3, 17)
    shop.crew.authorisations = [Authorisation("O0", machine="M0", expires=date(2026, 3, 16))]
    plan = solve_shop(shop)
    assert plan.assignments == [] and plan.waiting_jobs == ["job 0"]
    assert "no present operator is authorised" in plan.waiting_reasons["job 0"].text
    assert plan.staffing["expiring"][0]["days_left"] == -1
    shop.crew.authorisations[0].expires = date(2026, 3, 17)
    assert [a.operator for a in solve_shop(shop).assignments] == ["operator role 0"]


def test_operator_not_yet_arrived_is_not_planned():
    shop = _shop(1, 1, {(0, 0): 1.0}, [1], [(0, 0)])
    shop.shift.start = time(6, 0)
    shop.crew.operators[0].arrives = time(10, 0)
    plan = solve_shop(shop)
    assert plan.assignments == []
    assert plan.staffing["operators_not_yet_here"] == ["operator role 0"]


def test_running_machine_without_operator_is_reported_not_stopped():
    shop = _shop(2, 2, {(0, 0): 1.0, (1, 1): 1.0}, [1], [(0, 1)])
    shop.jobs[0].state, shop.jobs[0].machine = RUNNING, "M0"
    plan = solve_shop(shop)
    assert plan.staffing["unstaffed_running"] == [{"job": "job 0", "machine": "machine 0"}]
    assert [r.job for r in plan.running] == ["job 0"]
    assert [a.job for a in plan.assignments] == ["job 1"]


def test_running_machine_is_staffed_before_a_rush_job():
    """The only operator stays at the running machine; the rush job waits."""
    shop = _shop(2, 2, {(0, 0): 1.0, (1, 1): 1.0}, [1], [(0, 0), (0, 1)], rush=[1])
    shop.jobs[0].state, shop.jobs[0].machine = RUNNING, "M0"
    plan = solve_shop(shop)
    assert plan.running[0].operator == "operator role 0"
    assert plan.waiting_jobs == ["job 1"] and plan.rush_waiting == ["job 1"]


def _document(crew: dict) -> str:
    shop = _shop(1, 1, {(0, 0): 1.0}, [1], [(0, 0)])
    data = json.loads(dump_shop_text(shop))
    data["crew"].update(crew)
    return json.dumps(data)


@pytest.mark.parametrize("crew, where, message", [
    ({"authorisations": [{"operator": "O0", "machine": "M9", "group": "", "expires": None}]},
     "authorisation 1, field 'machine'", "does not exist"),
    ({"operators": [{"id": "O0", "label": "A", "capacity": 0}]}, "field 'capacity'", "from 1"),
    ({"operators": [{"id": "O0", "label": "A"}, {"id": "O1", "label": "A"}]},
     "operator label 'A'", "labels must be unique"),
    ({"operators": [{"id": "O0", "label": "A", "arrives": "23:00"}]},
     "operator 'A' (id O0), field 'arrives'", "outside the shift"),
    ({"authorisations": [{"operator": "O0", "machine": "M0", "expires": "next week"}]},
     "authorisation 1, field 'expires'", "is not a date"),
    ({"operators": [{"id": "O0", "label": "A", "attendance": "maybe"}]},
     "field 'attendance'", "not one of"),
    ({"unattended": ["M7"]}, "crew, field 'unattended'", "does not exist"),
])
def test_bad_crew_is_refused_naming_operator_and_field(crew, where, message, tmp_path):
    text = _document(crew)
    doc = json.loads(text)
    doc["shift"]["start"] = "06:00"
    path = tmp_path / "bad.dshop"
    path.write_text(json.dumps(doc))
    before = path.read_bytes()
    with pytest.raises(ShopFileError) as err:
        load_shop(path)
    assert where in str(err.value) and message in str(err.value)
    assert str(path) in str(err.value)
    proc = subprocess.run([sys.executable, "-m", "dispatcher", "solve", str(path)],
                          capture_output=True, text=True, check=False)
    assert proc.returncode == 2 and "Traceback" not in proc.stderr and where in proc.stderr
    assert path.read_bytes() == before


def test_crew_in_a_version_1_document_is_refused():
    doc = json.loads(_document({}))
    doc["format_version"] = 1
    with pytest.raises(ShopFileError, match="needs format_version 2"):
        parse_shop_text(json.dumps(doc))


# ---- events: an operator leaves or arrives -------------------------------------------

from dispatcher.shop.redispatch import ShopEvent, redispatch_shop  # noqa: E402 - this section's own


@settings(max_examples=60, deadline=None)
@given(shop=crewed_shops(), data=st.data())
def test_operator_leaving_replans_like_brute_force(shop, data):
    """Reference: brute force on the shop after the operator left (no move penalties)."""
    plan = solve_shop(shop)
    shop.plan_in_force = plan.in_force(shop)
    who = data.draw(st.sampled_from(shop.crew.operators))
    out = redispatch_shop(shop, [ShopEvent("operator_out", who.label)], move_penalty=0.0)
    n, m = len(shop.jobs), len(shop.machines)
    values = np.zeros((n, m))
    allowed = np.zeros((n, m), bool)
    for (jid, mid), v in shop.grid.items():
        values[int(jid[1:]), int(mid[1:])], allowed[int(jid[1:]), int(mid[1:])] = v, True
    qualified = np.zeros((len(shop.crew.operators), m), bool)
    for a in shop.crew.authorisations:
        if a.operator != who.id:
            qualified[int(a.operator[1:]), int(a.machine[1:])] = True
    needs = np.array([f"M{k}" not in shop.crew.unattended for k in range(m)])
    rush = np.array([j.rush for j in shop.jobs])
    ref = brute_force(values, allowed, qualified, np.array([o.capacity for o in shop.crew.operators]),
                      needs, np.zeros(n), rush, np.zeros(n, bool))
    new = out.plan
    assert new.verified
    placed = len(new.assignments)
    assert (placed, sum(shop.job_by_name(a.job).rush for a in new.assignments),
            round(-new.total, 9)) == ref
    assert all(a.operator != who.label for a in new.assignments)
    assert out.shop.crew.operator(who.id).attendance == "absent"
    assert shop.crew.operator(who.id).attendance == "present"  # the shop passed in is unchanged


def test_operator_leaving_a_running_machine_is_a_caution_not_a_stop(tmp_path):
    shop = _shop(2, 2, {(0, 0): 1.0, (1, 1): 1.0}, [1, 1], [(0, 0), (1, 1)])
    shop.jobs[0].state, shop.jobs[0].machine = RUNNING, "M0"
    shop.plan_in_force = solve_shop(shop).in_force(shop)
    path = tmp_path / "s.dshop"
    save_shop(shop, path)
    proc = subprocess.run([sys.executable, "-m", "dispatcher", "redispatch", str(path),
                           "--operator-out", "operator role 0", "--json"],
                          capture_output=True, text=True, check=True)
    data = json.loads(proc.stdout)
    assert data["staffing"]["unstaffed_running"] == [{"job": "job 0", "machine": "machine 0"}]
    assert [r["job"] for r in data["running"]] == ["job 0"]
    text = subprocess.run([sys.executable, "-m", "dispatcher", "redispatch", str(path),
                           "--operator-out", "operator role 0"],
                          capture_output=True, text=True, check=True).stdout
    assert "stopped only by the site's procedure" in text
    assert "trained and authorised" in text


def test_operator_arriving_is_used(tmp_path):
    shop = _shop(2, 2, {(0, 0): 1.0, (1, 1): 1.0}, [1, 1], [(0, 0), (1, 1)])
    shop.crew.operators[1].attendance = "absent"
    shop.plan_in_force = solve_shop(shop).in_force(shop)
    out = redispatch_shop(shop, [ShopEvent("operator_in", "operator role 1")])
    assert sorted(a.operator for a in out.plan.assignments) == ["operator role 0", "operator role 1"]
    assert [c.job for c in out.newly_dispatched and out.changes] == ["job 1"]


def test_unknown_operator_is_refused_with_the_labels(tmp_path):
    path = tmp_path / "s.dshop"
    shop = load_shop(SAMPLE)
    shop.plan_in_force = solve_shop(shop).in_force(shop)
    save_shop(shop, path)
    before = path.read_bytes()
    proc = subprocess.run([sys.executable, "-m", "dispatcher", "redispatch", str(path),
                           "--operator-out", "Night porter"], capture_output=True, text=True,
                          check=False)
    assert proc.returncode == 2 and "no operator labelled 'Night porter'" in proc.stderr
    assert "Laser operator" in proc.stderr and "Traceback" not in proc.stderr
    assert path.read_bytes() == before


# ---- the printed sheet ----------------------------------------------------------------


def test_sheet_prints_the_operator_of_each_machine_and_the_crew_notes(tmp_path):
    from pypdf import PdfReader

    text = subprocess.run([sys.executable, "-m", "dispatcher", "sheet", str(SAMPLE)],
                          capture_output=True, text=True, check=True).stdout
    assert "Robot welder A [Up]  operator: Robot cell minder" in text
    assert "Deburr tumbler [Up]  operator: unattended" in text
    assert "Short of operators: 6 jobs could run but the crew present can staff only 5" in text
    assert "Authorisation: Welder (manual): authorisation for group robot welders expires" in text
    pdf = tmp_path / "sheet.pdf"
    subprocess.run([sys.executable, "-m", "dispatcher", "sheet", str(SAMPLE), "--pdf", str(pdf)],
                   capture_output=True, text=True, check=True,
                   env={**os.environ, "QT_QPA_PLATFORM": "offscreen"})
    words = " ".join(" ".join(page.extract_text().split()) for page in PdfReader(pdf).pages)
    for phrase in ("Operator", "Initials", "Robot cell minder", "Brake operator", "Crew",
                   "Short of operators", "lockout/tagout", "trained and authorised"):
        assert phrase in words, phrase


def test_plain_sheet_has_no_operator_column(tmp_path):
    from dispatcher.sheet.build import build_sheet
    from dispatcher.sheet.content import sheet_text

    shop = _shop(1, 1, {(0, 0): 1.0}, [], [])
    shop.crew = Crew()
    content = build_sheet(shop, solve_shop(shop))
    assert not content.staffed and "operator" not in sheet_text(content).lower().replace(
        "operators trained", "")


def test_history_export_names_operators_unless_asked_not_to(tmp_path):
    import csv

    shop_path = tmp_path / "s.dshop"
    save_shop(load_shop(SAMPLE), shop_path)
    history = tmp_path / "h.sqlite"
    subprocess.run([sys.executable, "-m", "dispatcher", "solve", str(shop_path), "--record",
                    "--history", str(history), "--by", "Supervisor A", "--reason", "shift-start"],
                   capture_output=True, text=True, check=True)
    with_ops, without = tmp_path / "a.csv", tmp_path / "b.csv"
    for target, extra in ((with_ops, []), (without, ["--no-operators"])):
        subprocess.run([sys.executable, "-m", "dispatcher", "history", "export", str(target),
                        "--history", str(history), *extra], capture_output=True, text=True,
                       check=True)
    rows = list(csv.DictReader(with_ops.open(encoding="utf-8")))
    minded = {(r["machine"], r["operator"]) for r in rows if r["state"] == "assigned"}
    assert ("Robot welder A", "Robot cell minder") in minded
    text = without.read_text(encoding="utf-8")
    assert "operator" not in next(csv.reader(without.open(encoding="utf-8")))
    for label in ("Robot cell minder", "Brake operator", "Laser operator"):
        assert label not in text
