"""Brute-force reference for staffed plans, shared by the crew tests.

Enumerates every assignment of jobs to machines (or waiting) and checks staffing by
enumerating every assignment of operators to the running machines: no flow, no
matching, nothing from the code under test.
"""

from __future__ import annotations

import itertools

import numpy as np


def _staffable(machines, qualified, capacity, needs) -> bool:
    """Brute force: can the running machines each get a distinct-capacity operator?"""
    staffed = [m for m in machines if needs[m]]
    n_ops = qualified.shape[0]
    for choice in itertools.product(range(n_ops), repeat=len(staffed)):
        if all(qualified[o, m] for o, m in zip(choice, staffed)) and all(
                choice.count(o) <= capacity[o] for o in range(n_ops)):
            return True
    return not staffed


def brute_force(values, allowed, qualified, capacity, needs, penalty, rush, must,
                slots=None, objective="total"):
    """Best (placed, must placed, rush placed, -cost) over every plan; None if must fails."""
    n_jobs, n_machines = values.shape
    slots = np.ones(n_machines, int) if slots is None else slots
    best = None
    for choice in itertools.product(range(-1, n_machines), repeat=n_jobs):
        if any(m >= 0 and not allowed[i, m] for i, m in enumerate(choice)):
            continue
        if any(choice.count(m) > slots[m] for m in range(n_machines)):
            continue
        if any(must[i] and choice[i] < 0 for i in range(n_jobs)):
            continue
        running = sorted({m for m in choice if m >= 0})
        if not _staffable(running, qualified, capacity, needs):
            continue
        setups = sum(values[i, m] for i, m in enumerate(choice) if m >= 0)
        pen = sum(penalty[i] for i, m in enumerate(choice) if m < 0)
        score = setups - pen if objective == "maximize" else -(setups + pen)
        key = (sum(m >= 0 for m in choice), sum(rush[i] and m >= 0 for i, m in enumerate(choice)),
               round(score, 9))
        if best is None or key > best:
            best = key
    return best


