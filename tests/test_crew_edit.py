"""Crew edits in the core (dispatcher.shop.crew_edit) and the crew's text limits.

Each edit returns a new crew or refuses with the operator (or group, authorisation) and
field named; a refusal leaves the shop as it was (compared with a deep copy taken
before). The expected values are read off the sample document's own JSON, parsed here
with the json module, not by the code under test.
"""

from __future__ import annotations

import copy
import json
from datetime import date, time
from pathlib import Path

import pytest

from dispatcher import limits
from dispatcher.io.shopfile import ShopFileError, load_shop
from dispatcher.shop.crew import present_at
from dispatcher.shop.crew_edit import (
    authorisation_for,
    group_authorised,
    parse_clock,
    parse_day,
    with_expiry,
    with_group_authorisation,
    with_groups,
    with_operator_text,
    with_times,
    with_unattended,
    with_warn_days,
    without_operator,
)
from dispatcher.shop.model import ShopError

SAMPLE = Path(__file__).resolve().parent.parent / "sample_shops" / "crewed_fabrication_cell.dshop"
RAW = json.loads(SAMPLE.read_text(encoding="utf-8"))


@pytest.fixture
def shop():
    return load_shop(SAMPLE)


def _refused(shop, edit, where: str, message: str) -> None:
    before = copy.deepcopy(shop)
    with pytest.raises(ShopError) as err:
        edit()
    assert where in str(err.value) and message in str(err.value), str(err.value)
    assert shop == before


def test_times_within_the_shift_are_set_and_plan_presence(shop):
    assert RAW["shift"]["start"] == "06:00" and RAW["shift"]["hours"] == 8
    crew = with_times(shop, "O1", arrives="9:30", leaves="13:00")
    op = crew.operator("O1")
    assert (op.arrives, op.leaves) == (time(9, 30), time(13, 0))
    trial = copy.copy(shop)
    trial.crew = crew
    assert not present_at(op, trial) and present_at(op, trial, time(10, 0))
    assert shop.crew.operator("O1").arrives is None     # the shop itself is untouched
    assert with_times(shop, "O6", arrives="").operator("O6").arrives is None


@pytest.mark.parametrize("arrives, leaves, field, message", [
    ("15:00", None, "'arrives'", "15:00 is outside the shift (06:00 to 14:00)"),
    (None, "05:59", "'leaves'", "05:59 is outside the shift"),
    ("11:00", "10:00", "'leaves'", "must be after the time the operator arrives"),
    ("25:00", None, "'arrives'", "'25:00' is not a time of day like '06:00'"),
    ("7.30", None, "'arrives'", "'7.30' is not a time of day"),
    (None, "noon", "'leaves'", "'noon' is not a time of day"),
])
def test_times_outside_the_shift_or_not_times_are_refused(shop, arrives, leaves, field, message):
    _refused(shop, lambda: with_times(shop, "O1", arrives=arrives, leaves=leaves),
             f"operator 'Laser operator' (id O1), field {field}", message)


def test_parse_clock_and_day_read_what_a_person_types():
    assert parse_clock(" 06:05 ", "x") == time(6, 5) and parse_clock("", "x") is None
    assert parse_day("2026-03-24", "x") == date(2026, 3, 24) and parse_day(" ", "x") is None
    for bad in ("2026-02-30", "24.03.2026", "tomorrow", "20260324"):
        with pytest.raises(ShopError, match="is not a date like '2026-03-24'"):
            parse_day(bad, "authorisation 1, field 'expires'")


def test_expiry_is_set_cleared_and_refused_when_not_a_date(shop):
    k = authorisation_for(shop.crew, "O4", "M4")      # through the group "robot welders"
    raw = RAW["crew"]["authorisations"][k]
    assert raw["group"] == "robot welders" and raw["expires"] == "2026-03-24"
    assert with_expiry(shop, k, "2026-04-30").authorisations[k].expires == date(2026, 4, 30)
    assert with_expiry(shop, k, "").authorisations[k].expires is None
    _refused(shop, lambda: with_expiry(shop, k, "next week"),
             f"authorisation {k + 1} ('Welder (manual)' for group 'robot welders'), field 'expires'",
             "'next week' is not a date")
    own = authorisation_for(shop.crew, "O4", "M6")
    assert shop.crew.authorisations[own].machine == "M6"
    assert authorisation_for(shop.crew, "O1", "M3") is None


def test_unattended_toggles_in_machine_order(shop):
    assert RAW["crew"]["unattended"] == ["M7"]
    crew = with_unattended(shop, "M1", True)
    assert crew.unattended == ["M1", "M7"]
    assert with_unattended(shop, "M7", False).unattended == []
    with pytest.raises(KeyError):
        with_unattended(shop, "M99", True)


def test_group_authorisation_is_given_and_withdrawn(shop):
    assert not group_authorised(shop.crew, "O1", "press brakes")
    crew = with_group_authorisation(shop, "O1", "press brakes", True)
    assert group_authorised(crew, "O1", "press brakes")
    shop.crew = crew
    crew = with_group_authorisation(shop, "O1", "press brakes", False)
    assert not group_authorised(crew, "O1", "press brakes")
    assert any(a.operator == "O1" and a.machine == "M1" for a in crew.authorisations)
    _refused(shop, lambda: with_group_authorisation(shop, "O1", "paint line", True),
             "machine group 'paint line'", "does not exist")


def test_groups_renamed_changed_and_deleted_carry_their_authorisations(shop):
    through = [a["operator"] for a in RAW["crew"]["authorisations"] if a["group"] == "robot welders"]
    assert through == ["O3", "O4"]
    crew = with_groups(shop, {"press brakes": ["M3", "M2"], "welding robots": ["M4", "M5", "M6"]},
                       {"robot welders": "welding robots"})
    assert crew.groups == {"press brakes": ["M2", "M3"], "welding robots": ["M4", "M5", "M6"]}
    assert [a.operator for a in crew.authorisations if a.group == "welding robots"] == through
    crew = with_groups(shop, {"press brakes": ["M2", "M3"]})
    assert not any(a.group == "robot welders" for a in crew.authorisations)
    assert len(crew.authorisations) == len(RAW["crew"]["authorisations"]) - len(through)
    _refused(shop, lambda: with_groups(shop, {"press brakes": ["M2", "M99"]}),
             "machine group 'press brakes'", "names machine id 'M99', which the shop does not have")
    _refused(shop, lambda: with_groups(shop, {" ": ["M2"]}), "machine group #1, field 'name'",
             "must be a non-empty text")
    _refused(shop, lambda: with_groups(shop, {"g" * (limits.MAX_NAME_CHARS + 1): ["M2"]}),
             "machine group #1, field 'name'", f"the limit is {limits.MAX_NAME_CHARS}")


def test_removing_an_operator_takes_their_authorisations(shop):
    own = sum(a["operator"] == "O5" for a in RAW["crew"]["authorisations"])
    assert own == 3
    crew = without_operator(shop, "O5")
    assert "O5" not in [o.id for o in crew.operators]
    assert len(crew.authorisations) == len(RAW["crew"]["authorisations"]) - own
    assert len(shop.crew.operators) == len(RAW["crew"]["operators"])


def test_warn_days_range(shop):
    assert with_warn_days(shop, 30).warn_days == 30
    _refused(shop, lambda: with_warn_days(shop, 400), "crew, field 'warn_days'", "from 0 to 366")


def test_labels_and_notes_keep_to_the_limits(shop):
    at_limit = "L" * limits.MAX_NAME_CHARS
    assert with_operator_text(shop, "O1", "label", at_limit).operator("O1").label == at_limit
    _refused(shop, lambda: with_operator_text(shop, "O1", "label", at_limit + "L"),
             "operator #1 (id O1), field 'label'",
             f"is {limits.MAX_NAME_CHARS + 1} characters long; the limit is {limits.MAX_NAME_CHARS}")
    _refused(shop, lambda: with_operator_text(shop, "O1", "label", "Brake operator"),
             "operator label 'Brake operator'", "labels must be unique")
    _refused(shop, lambda: with_operator_text(shop, "O1", "label", "Laser\x1b[2J"),
             "field 'label'", "U+001B")
    notes = "n" * limits.MAX_TEXT_CHARS
    assert with_operator_text(shop, "O1", "notes", notes).operator("O1").notes == notes
    _refused(shop, lambda: with_operator_text(shop, "O1", "notes", notes + "n"),
             "operator 'Laser operator' (id O1), field 'notes'", "the limit is 10,000")


@pytest.mark.parametrize("change, where", [
    (lambda c: c["operators"][0].update(label="L" * (limits.MAX_NAME_CHARS + 1)),
     "operator #1, field 'label'"),
    (lambda c: c["operators"][1].update(id="I" * (limits.MAX_NAME_CHARS + 1)),
     "operator 'Brake operator' (#2), field 'id'"),
    (lambda c: c["operators"][2].update(notes="n" * (limits.MAX_TEXT_CHARS + 1)),
     "operator 'Robot cell minder' (#3), field 'notes'"),
    (lambda c: c["groups"].update({"g" * (limits.MAX_NAME_CHARS + 1): ["M2"]}),
     "crew, machine group #3, field 'name'"),
])
def test_a_file_beyond_the_crew_limits_is_refused_naming_file_operator_and_field(tmp_path, change, where):
    data = copy.deepcopy(RAW)
    change(data["crew"])
    path = tmp_path / "long.dshop"
    path.write_text(json.dumps(data), encoding="utf-8")
    with pytest.raises(ShopFileError) as err:
        load_shop(path)
    text = str(err.value)
    assert str(path) in text and where in text and "characters long; the limit is" in text, text
    assert len(text) < 2000     # the runaway text is not repeated in the message
