"""The crew as an editable table: operators (rows) x label, present, minds, then machines.

A machine cell is checked when the operator is authorised for that machine (directly or
through a machine group); its text says how, and an authorisation that runs out within
the crew's warning days (or already has) is marked and shaded. Every change is an
undoable edit (:mod:`dispatcher.ui.edits`) through the document.
"""

from __future__ import annotations

from datetime import date

from PySide6.QtCore import QAbstractTableModel, QModelIndex, Qt

from dispatcher.shop.crew import ABSENT, MAX_MINDING, PRESENT
from dispatcher.ui import palette
from dispatcher.ui.document import ShopDocument
from dispatcher.ui.edits import SetAuthorisations, SetOperatorField

COL_LABEL, COL_PRESENT, COL_MINDS = 0, 1, 2
FIRST_MACHINE = 3
LEADING = ("Operator", "Present", "Minds")

#: Words read as "authorised" / "not authorised" when a block is pasted.
YES = {"1", "x", "y", "yes", "true", "\u2713", "ja", "si", "s\u00ed"}
NO = {"", "0", "n", "no", "false", "-", "nein"}


class CrewModel(QAbstractTableModel):
    """Table model of ``doc.shop.crew`` (rows: operators)."""

    def __init__(self, doc: ShopDocument, parent=None):
        super().__init__(parent)
        self._doc = doc
        doc.reset.connect(self._reset)
        doc.crew_changed.connect(self._reset)
        for sig in (doc.machine_inserted, doc.machine_removed):
            sig.connect(self._reset)

    def _reset(self, *_args) -> None:
        self.beginResetModel()
        self.endResetModel()

    # ---- shape ----------------------------------------------------------------------------
    def rowCount(self, parent: QModelIndex = QModelIndex()) -> int:  # noqa: B008
        return 0 if parent.isValid() else len(self._doc.shop.crew.operators)

    def columnCount(self, parent: QModelIndex = QModelIndex()) -> int:  # noqa: B008
        return 0 if parent.isValid() else FIRST_MACHINE + self._doc.n_machines()

    def flags(self, index: QModelIndex) -> Qt.ItemFlag:
        base = Qt.ItemFlag.ItemIsEnabled | Qt.ItemFlag.ItemIsSelectable
        if not index.isValid():
            return Qt.ItemFlag.NoItemFlags
        if index.column() in (COL_LABEL, COL_MINDS):
            return base | Qt.ItemFlag.ItemIsEditable
        return base | Qt.ItemFlag.ItemIsUserCheckable

    # ---- what an authorisation cell holds -------------------------------------------------------
    def _day(self) -> date:
        return self._doc.shop.shift.day or date.today()

    def authorisation(self, row: int, col: int) -> tuple[bool, str, int | None]:
        """(authorised, how, days left) for operator ``row`` and machine ``col``; days left
        is None without an expiry date, negative when expired (which counts as none)."""
        crew = self._doc.shop.crew
        oid, mid = crew.operators[row].id, self._doc.machine_ids[col]
        best: tuple[bool, str, int | None] = (False, "", None)
        for a in crew.authorisations:
            if a.operator != oid or mid not in crew.machines_of(a):
                continue
            left = None if a.expires is None else (a.expires - self._day()).days
            how = "own authorisation" if a.machine else f"through group {a.group}"
            valid = left is None or left >= 0
            if valid and (not best[0] or left is None or (best[2] is not None and left > best[2])):
                best = (True, how, left)
            elif not best[0] and not valid:
                best = (False, f"expired ({how})", left)
        return best

    def _expiring(self, left: int | None) -> bool:
        return left is not None and left <= self._doc.shop.crew.warn_days

    # ---- data -----------------------------------------------------------------------------
    def data(self, index: QModelIndex, role: int = Qt.ItemDataRole.DisplayRole):
        if not index.isValid():
            return None
        op = self._doc.shop.crew.operators[index.row()]
        col = index.column()
        if col == COL_LABEL:
            if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.EditRole,
                        Qt.ItemDataRole.AccessibleTextRole):
                return op.label
            if role == Qt.ItemDataRole.ToolTipRole:
                return f"{op.label} (id {op.id})" + (f": {op.notes}" if op.notes else "")
            return None
        if col == COL_PRESENT:
            if role == Qt.ItemDataRole.CheckStateRole:
                return Qt.CheckState.Checked if op.attendance == PRESENT else Qt.CheckState.Unchecked
            if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
                text = "present" if op.attendance == PRESENT else "absent"
                if op.attendance == PRESENT and op.arrives is not None:
                    text += f", from {op.arrives:%H:%M}"
                if op.attendance == PRESENT and op.leaves is not None:
                    text += f", until {op.leaves:%H:%M}"
                return text
            if role == Qt.ItemDataRole.ToolTipRole:
                return "Space or click: mark present or absent for this shift"
            return None
        if col == COL_MINDS:
            if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.EditRole,
                        Qt.ItemDataRole.AccessibleTextRole):
                return op.capacity
            if role == Qt.ItemDataRole.ToolTipRole:
                return f"How many machines {op.label} runs at once (1 to {MAX_MINDING})"
            if role == Qt.ItemDataRole.TextAlignmentRole:
                return int(Qt.AlignmentFlag.AlignCenter)
            return None
        k = col - FIRST_MACHINE
        authorised, how, left = self.authorisation(index.row(), k)
        machine = self._doc.machine_at(k).name
        if role == Qt.ItemDataRole.CheckStateRole:
            return Qt.CheckState.Checked if authorised else Qt.CheckState.Unchecked
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
            if left is not None and left < 0:
                return "expired"
            if authorised and self._expiring(left):
                return f"{palette.MARK_RUSH} {left} d"
            return "group" if authorised and how.startswith("through") else ""
        if role == Qt.ItemDataRole.BackgroundRole and self._expiring(left):
            return palette.colour("rush", 70)
        if role == Qt.ItemDataRole.ToolTipRole:
            if not how:
                return f"{op.label} is not authorised for {machine} (Space or click: authorise)"
            tip = f"{op.label} for {machine}: {how}"
            if left is not None:
                tip += (f", expired {-left} day(s) ago (counts as none)" if left < 0
                        else f", expires in {left} day(s)")
            if how.startswith("through"):
                tip += "; a group authorisation is changed in the shop document"
            return tip
        return None

    def headerData(self, section: int, orientation: Qt.Orientation,
                   role: int = Qt.ItemDataRole.DisplayRole):
        if role not in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.ToolTipRole,
                        Qt.ItemDataRole.AccessibleTextRole):
            return None
        if orientation == Qt.Orientation.Vertical:
            return str(section + 1) if section < self.rowCount() else None
        if section < FIRST_MACHINE:
            return LEADING[section]
        if section - FIRST_MACHINE >= self._doc.n_machines():
            return None
        m = self._doc.machine_at(section - FIRST_MACHINE)
        unattended = m.id in set(self._doc.shop.crew.unattended)
        if role == Qt.ItemDataRole.ToolTipRole:
            return f"{m.name}" + (": runs unattended (needs no operator)" if unattended else "")
        return m.name + ("\n(unattended)" if unattended else "")

    # ---- edits ----------------------------------------------------------------------------
    def setData(self, index: QModelIndex, value, role: int = Qt.ItemDataRole.EditRole) -> bool:
        if not index.isValid():
            return False
        doc, row, col = self._doc, index.row(), index.column()
        op = doc.shop.crew.operators[row]
        if col == COL_LABEL and role == Qt.ItemDataRole.EditRole:
            label = str(value).strip()
            if not label or label == op.label or any(o.label == label for o in doc.shop.crew.operators):
                return False
            doc.undo_stack.push(SetOperatorField(doc, row, "label", label, f"Rename {op.label}"))
            return True
        if col == COL_MINDS and role == Qt.ItemDataRole.EditRole:
            try:
                n = int(str(value).strip())
            except ValueError:
                return False
            if not 1 <= n <= MAX_MINDING or n == op.capacity:
                return False
            doc.undo_stack.push(SetOperatorField(doc, row, "capacity", n,
                                                 f"{op.label} minds {n} machine(s)"))
            return True
        if role != Qt.ItemDataRole.CheckStateRole:
            return False
        on = Qt.CheckState(value) == Qt.CheckState.Checked if not isinstance(value, bool) else value
        if col == COL_PRESENT:
            doc.undo_stack.push(SetOperatorField(doc, row, "attendance", PRESENT if on else ABSENT,
                                                 f"{op.label} {'present' if on else 'absent'}"))
            return True
        k = col - FIRST_MACHINE
        machine = doc.machine_at(k).name
        doc.undo_stack.push(SetAuthorisations(
            doc, [(row, k, on)], f"{'Authorise' if on else 'Withdraw'} {op.label} for {machine}"))
        return True

    def paste_cells(self, text: str, row: int, col: int) -> list[tuple[int, int, bool]]:
        """Authorisation changes from a tab-separated block pasted at (row, col).

        Raises ValueError naming the block's row and column of a cell that is neither a
        yes nor a no, or of a block that does not fit the machine columns.
        """
        lines = text.replace("\r\n", "\n").replace("\r", "\n").rstrip("\n").split("\n")
        if col < FIRST_MACHINE:
            raise ValueError("paste authorisations into the machine columns")
        out = []
        for r, line in enumerate(lines):
            for c, cell in enumerate(line.split("\t")):
                rr, kk = row + r, col - FIRST_MACHINE + c
                if rr >= self.rowCount() or kk >= self._doc.n_machines():
                    raise ValueError(f"the pasted block (row {r + 1}, column {c + 1}) reaches past "
                                     "the last operator or machine")
                word = cell.strip().lower()
                if word in YES:
                    out.append((rr, kk, True))
                elif word in NO:
                    out.append((rr, kk, False))
                else:
                    raise ValueError(f"pasted row {r + 1}, column {c + 1}: {cell!r} is neither "
                                     "yes (1, x, yes) nor no (0, empty, no)")
        return out
