"""Every size and value limit of the files dispatcher reads, in one place.

The limits keep a wrong or hostile file from exhausting memory or time and keep every
total finite; each is checked before the work it protects (a file's size before it is
read, a zip directory before it is unpacked, a document's counts before objects are
built). The README's table of limits lists the same numbers; a test compares the two.

The value limit: a plan adds at most ``MAX_JOBS`` values of at most ``MAX_VALUE`` each,
so a total stays below 1e16 (finite, and exact to about one unit in a float64).
"""

from __future__ import annotations

import unicodedata

#: Grid files (CSV, TSV, XLSX) and shop documents alike.
MAX_JOBS = 10_000
MAX_MACHINES = 2_000
MAX_CELLS = 4_000_000
MAX_VALUE = 1e12
#: Grid files.
MAX_FILE_BYTES = 64 * 1024 * 1024
MAX_XLSX_UNPACKED_BYTES = 256 * 1024 * 1024
MAX_XLSX_MEMBERS = 10_000
MAX_XLSX_TEXT_PART_BYTES = 32 * 1024 * 1024  # xl/sharedStrings.xml, read whole by openpyxl
#: Shop documents.
MAX_DOCUMENT_BYTES = 256 * 1024 * 1024
MAX_SLOTS = 100
#: Slots of all machines together: the engine's columns stay within the grid's limit.
MAX_TOTAL_SLOTS = MAX_MACHINES
MAX_PINS = 20_000
MAX_JSON_DEPTH = 8
#: Text: names and ids (jobs, machines, work orders, ...) and free text (notes).
MAX_NAME_CHARS = 200
MAX_TEXT_CHARS = 10_000

#: The rows of the README's table: (what, limit as printed).
TABLE = [
    ("jobs (grid rows, document jobs)", f"{MAX_JOBS:,}"),
    ("machines (grid columns, document machines)", f"{MAX_MACHINES:,}"),
    ("grid cells (jobs x machines)", f"{MAX_CELLS:,}"),
    ("a value (setup, cost, penalty, hours)", "1e12 (absolute)"),
    ("grid file size", f"{MAX_FILE_BYTES // (1024 * 1024)} MB"),
    ("XLSX unpacked size (sum of the zip directory)", f"{MAX_XLSX_UNPACKED_BYTES // (1024 * 1024)} MB"),
    ("XLSX parts (zip members)", f"{MAX_XLSX_MEMBERS:,}"),
    ("XLSX shared text part (unpacked)", f"{MAX_XLSX_TEXT_PART_BYTES // (1024 * 1024)} MB"),
    ("shop document size", f"{MAX_DOCUMENT_BYTES // (1024 * 1024)} MB"),
    ("slots per machine", f"{MAX_SLOTS:,}"),
    ("slots of all machines together", f"{MAX_TOTAL_SLOTS:,}"),
    ("pins", f"{MAX_PINS:,}"),
    ("JSON nesting depth", f"{MAX_JSON_DEPTH}"),
    ("a name or id", f"{MAX_NAME_CHARS:,} characters"),
    ("a note or description", f"{MAX_TEXT_CHARS:,} characters"),
]


def control_character(text: str, *, allow_lines: bool = False) -> str | None:
    """The first control character in ``text`` as ``U+001B``, or None when there is none.

    Control characters (Unicode category Cc: ESC, newline, tab, C1 codes) in a name would
    reach the terminal and the printed sheet as commands or broken lines. Free text
    (``allow_lines``) may hold newlines and tabs.
    """
    for ch in text:
        if unicodedata.category(ch) == "Cc" and not (allow_lines and ch in "\n\t"):
            return f"U+{ord(ch):04X}"
    return None


def name_problem(text: str, *, free_text: bool = False) -> str | None:
    """What is wrong with a name (or, with ``free_text``, a note), or None when it is fine."""
    limit = MAX_TEXT_CHARS if free_text else MAX_NAME_CHARS
    if len(text) > limit:
        return f"is {len(text):,} characters long; the limit is {limit:,}"
    bad = control_character(text, allow_lines=free_text)
    if bad is not None:
        what = "text" if free_text else "names"
        return (f"contains the control character {bad}; {what} must be plain text"
                + ("" if free_text else " on one line"))
    return None


def value_problem(value: float) -> str | None:
    """Why a finite value is outside the limit, or None."""
    if abs(value) > MAX_VALUE:
        return (f"{value:g} is beyond the limit of 1e12 (values are kept below it so that "
                "every total stays finite)")
    return None
