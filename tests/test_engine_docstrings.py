"""Every public function of dispatcher.engine has a numpydoc docstring with Parameters,
Returns and a References section (the published method, or a line saying why none)."""

from __future__ import annotations

import ast
from pathlib import Path

import pytest

ENGINE = Path(__file__).resolve().parent.parent / "dispatcher" / "engine"
SECTIONS = ("Parameters", "Returns", "References")


def _public_functions():
    for path in sorted(ENGINE.glob("*.py")):
        for node in ast.parse(path.read_text(encoding="utf-8")).body:
            if isinstance(node, ast.FunctionDef) and not node.name.startswith("_"):
                yield f"{path.stem}.{node.name}", ast.get_docstring(node) or ""


FUNCTIONS = list(_public_functions())


def test_the_engine_has_public_functions():
    assert len(FUNCTIONS) >= 20


@pytest.mark.parametrize("name, doc", FUNCTIONS, ids=[n for n, _ in FUNCTIONS])
def test_numpydoc_sections(name, doc):
    for section in SECTIONS:
        assert f"\n{section}\n{'-' * len(section)}\n" in doc, f"{name}: no {section} section"
