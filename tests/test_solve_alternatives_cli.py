"""``dispatcher solve --alternatives K`` and ``--what-if`` on grid files and shop documents.

References: brute-force enumeration of every plan (alternatives), and scipy's
linear_sum_assignment on the grid with the forced pair's row and column removed (what-if).
Grids and shops are invented for the test.
"""

from __future__ import annotations

import itertools
import json

import numpy as np
import pytest
from scipy.optimize import linear_sum_assignment

from dispatcher.cli import main
from dispatcher.io.shopfile import save_shop
from dispatcher.shop import Job, Machine, Shop

JOBS = ["J-a", "J-b", "J-c", "J-d"]
MACHINES = ["M-1", "M-2", "M-3", "M-4"]
VALUES = np.array([[4, 1, 3, 2], [2, 0, 5, 3], [3, 2, 2, 4], [1, 3, 4, 2]], dtype=float)


@pytest.fixture
def grid_file(tmp_path):
    path = tmp_path / "grid.csv"
    lines = ["job," + ",".join(MACHINES)]
    lines += [name + "," + ",".join(f"{v:g}" for v in row) for name, row in zip(JOBS, VALUES)]
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")
    return path


def run(capsys, *argv):
    code = main(["solve", *map(str, argv)])
    out = capsys.readouterr()
    return code, out.out, out.err


def test_alternatives_are_the_k_best_by_brute_force(grid_file, capsys):
    code, out, _ = run(capsys, grid_file, "--alternatives", "30", "--json")
    assert code == 0
    data = json.loads(out)
    alts = data["alternatives"]
    # Brute force: all 4! = 24 plans of the full 4 x 4 grid (so only 24 come back).
    every = sorted(VALUES[range(4), p].sum() for p in itertools.permutations(range(4)))
    assert [a["total"] for a in alts] == every
    assert alts[0]["assignments"] == data["assignments"]
    pair_sets = {frozenset((a["job"], a["machine"]) for a in alt["assignments"]) for alt in alts}
    assert len(pair_sets) == 24
    for alt in alts:
        assert alt["total"] == sum(a["cost"] for a in alt["assignments"])


def test_what_if_matches_forced_scipy_re_solves(grid_file, capsys):
    code, out, _ = run(capsys, grid_file, "--what-if", "--json")
    assert code == 0
    data = json.loads(out)
    for i, j in itertools.product(range(4), range(4)):
        rest = np.delete(np.delete(VALUES, i, axis=0), j, axis=1)
        rows, cols = linear_sum_assignment(rest)
        expected = VALUES[i, j] + rest[rows, cols].sum() - data["total"]
        assert data["what_if"][JOBS[i]][MACHINES[j]] == pytest.approx(expected)


def test_text_output_lists_plans_and_cheapest_other_machine(grid_file, capsys):
    code, out, _ = run(capsys, grid_file, "--alternatives", "3", "--what-if")
    assert code == 0
    assert "Ranked plans (3, best first):" in out and "(this plan)" in out
    assert "What-if: cheapest other machine per job" in out


def slotted_shop() -> Shop:
    """Three jobs, a two-slot oven and a press that is down (invented)."""
    shop = Shop(name="Invented slot shop")
    shop.machines = [Machine(id="O", name="Oven", slots=2), Machine(id="P", name="Press"),
                     Machine(id="Q", name="Old press", state="down")]
    shop.jobs = [Job(id=f"J{i}", name=f"WO-{i}", wait_penalty=5.0) for i in range(3)]
    values = {"J0": {"O": 1, "P": 4, "Q": 0}, "J1": {"O": 2, "P": 1}, "J2": {"O": 3, "P": 3}}
    shop.grid = {(j, m): float(v) for j, row in values.items() for m, v in row.items()}
    return shop


def test_shop_alternatives_count_a_two_slot_machine_once(tmp_path, capsys):
    path = tmp_path / "slots.dshop"
    save_shop(slotted_shop(), path)
    code, out, _ = run(capsys, path, "--alternatives", "50", "--what-if", "--json")
    assert code == 0
    data = json.loads(out)
    # Brute force by machine: each job on Oven (2 places), Press (1) or waiting; all 3 jobs
    # fit, so every plan places all 3: Oven gets two of them and Press one (3 plans).
    values = {"WO-0": {"Oven": 1, "Press": 4}, "WO-1": {"Oven": 2, "Press": 1},
              "WO-2": {"Oven": 3, "Press": 3}}
    totals = sorted(sum(values[j]["Oven"] for j in values if j != p) + values[p]["Press"]
                    for p in values)
    assert [a["total"] for a in data["alternatives"]] == totals
    assert data["what_if"]["WO-0"]["Old press"] is None  # down: no plan can use it
    assert data["what_if"]["WO-1"]["Press"] == 0  # its machine in the best plan


@pytest.mark.parametrize("argv, message", [
    (["--alternatives", "0"], "--alternatives: expected a whole number from 1 to 1000, got 0"),
    (["--bottleneck", "--what-if"], "not --bottleneck"),
])
def test_bad_requests_exit_2(grid_file, capsys, argv, message):
    code, out, err = run(capsys, grid_file, *argv)
    assert code == 2 and message in err and out == ""


def test_large_sample_lists_ten_distinct_plans_over_machines(capsys):
    # Regression: ranked over slots, the large invented sample gave 2 distinct plans for
    # --alternatives 10 (slot copies crowded out the rest) after minutes of ranking.
    from pathlib import Path
    sample = Path(__file__).resolve().parent.parent / "sample_shops" / "large_print_plant.dshop"
    code, out, _ = run(capsys, sample, "--alternatives", "10", "--json")
    assert code == 0
    data = json.loads(out)
    plans = data["alternatives"]
    keys = {frozenset((a["job"], a["machine"]) for a in p["assignments"]) for p in plans}
    assert len(plans) == 10 and len(keys) == 10
    totals = [p["total"] for p in plans]
    assert totals == sorted(totals) and totals[0] == data["total"]
    # Each total is its own setups plus the wait penalties of the round's jobs it leaves
    # waiting, with the penalties read from the document by the json module.
    penalty = {j["name"]: j["wait_penalty"] for j in json.loads(sample.read_text())["jobs"]}
    round_jobs = {a["job"] for a in data["assignments"]} | set(data["waiting_jobs"])
    for p in plans:
        placed = {a["job"] for a in p["assignments"]}
        assert len(placed) == len(p["assignments"])
        assert p["total"] == pytest.approx(sum(a["cost"] for a in p["assignments"])
                                           + sum(penalty[j] for j in round_jobs - placed))
