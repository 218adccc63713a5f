"""The crew as an editable table: operators (rows) x label, present, arrives, leaves,
minds, notes, then machines.

A machine cell is checked when the operator is authorised for that machine (directly or
through a machine group); its text says how, and an authorisation that runs out within
the crew's warning days (or already has) is marked and shaded. Every change is an
undoable edit (:mod:`dispatcher.ui.edits`) through the document; what is typed is
checked by the core (:mod:`dispatcher.shop.crew_edit`), and a refusal changes nothing and
is announced by ``refused(message)``.
"""

from __future__ import annotations

from datetime import date

from PySide6.QtCore import QT_TRANSLATE_NOOP, QAbstractTableModel, QModelIndex, Qt, Signal

from dispatcher.shop.crew import ABSENT, MAX_MINDING, PRESENT
from dispatcher.shop.crew_edit import with_operator_text, with_times
from dispatcher.shop.model import ShopError
from dispatcher.ui import palette
from dispatcher.ui.document import ShopDocument
from dispatcher.ui.edits import SetAuthorisations, SetCrew, SetOperatorField
from dispatcher.ui.format import when_text

COL_LABEL, COL_PRESENT, COL_ARRIVES, COL_LEAVES, COL_MINDS, COL_NOTES = range(6)
FIRST_MACHINE = 6
TIME_COLUMNS = {COL_ARRIVES: "arrives", COL_LEAVES: "leaves"}
#: Heads of the leading columns (English; the model shows them translated).
LEADING = (QT_TRANSLATE_NOOP("CrewModel", "Operator"), QT_TRANSLATE_NOOP("CrewModel", "Present"),
           QT_TRANSLATE_NOOP("CrewModel", "Arrives"), QT_TRANSLATE_NOOP("CrewModel", "Leaves"),
           QT_TRANSLATE_NOOP("CrewModel", "Minds"), QT_TRANSLATE_NOOP("CrewModel", "Notes"))

#: Words read as "authorised" / "not authorised" when a block is pasted.
YES = {"1", "x", "y", "yes", "true", "\u2713", "ja", "si", "s\u00ed"}
NO = {"", "0", "n", "no", "false", "-", "nein"}


class CrewModel(QAbstractTableModel):
    """Table model of ``doc.shop.crew`` (rows: operators)."""

    #: An edit was refused (the message says why); nothing changed.
    refused = Signal(str)

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
        if index.column() in (COL_LABEL, COL_ARRIVES, COL_LEAVES, COL_MINDS):
            return base | Qt.ItemFlag.ItemIsEditable
        if index.column() == COL_NOTES:
            return base   # several lines: edited in a dialog (the crew tab opens it)
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

    def _how_text(self, how: str) -> str:
        """:meth:`authorisation`'s ``how`` (English, read by the code) as shown."""
        if how.startswith("expired (") and how.endswith(")"):
            return self.tr("expired ({how})").format(how=self._how_text(how[len("expired ("):-1]))
        if how == "own authorisation":
            return self.tr("own authorisation")
        if how.startswith("through group "):
            return self.tr("through group {group}").format(group=how[len("through group "):])
        return how

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
                return (self.tr("{operator} (id {id}): {notes}") if op.notes else
                        self.tr("{operator} (id {id})")).format(operator=op.label, id=op.id, notes=op.notes)
            return None
        if col == COL_PRESENT:
            if role == Qt.ItemDataRole.CheckStateRole:
                return Qt.CheckState.Checked if op.attendance == PRESENT else Qt.CheckState.Unchecked
            if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
                return self.tr("present") if op.attendance == PRESENT else self.tr("absent")
            if role == Qt.ItemDataRole.ToolTipRole:
                return self.tr("Space or click: mark present or absent for this shift")
            return None
        if col in TIME_COLUMNS:
            t = getattr(op, TIME_COLUMNS[col])
            if role == Qt.ItemDataRole.DisplayRole:
                return "" if t is None else when_text(t)
            if role == Qt.ItemDataRole.EditRole:
                return "" if t is None else t.strftime("%H:%M")
            if role == Qt.ItemDataRole.AccessibleTextRole:
                if t is not None:
                    return when_text(t)
                return self.tr("from the shift's start") if col == COL_ARRIVES else self.tr("until the shift's end")
            if role == Qt.ItemDataRole.ToolTipRole:
                return (self.tr("When {operator} arrives: HH:MM within the shift, empty for the shift's start "
                                "(F2 or double-click to type)") if col == COL_ARRIVES else
                        self.tr("When {operator} leaves: HH:MM within the shift, empty for the shift's end "
                                "(F2 or double-click to type)")).format(operator=op.label)
            if role == Qt.ItemDataRole.TextAlignmentRole:
                return int(Qt.AlignmentFlag.AlignCenter)
            return None
        if col == COL_NOTES:
            if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
                first, _, rest = op.notes.strip().partition("\n")
                return first + ("\u2026" if rest.strip() else "")
            if role == Qt.ItemDataRole.EditRole:
                return op.notes
            if role == Qt.ItemDataRole.ToolTipRole:
                return (op.notes + "\n\n" if op.notes else "") + self.tr(
                    "Notes on {operator} (F2 or double-click to edit)").format(operator=op.label)
            return None
        if col == COL_MINDS:
            if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.EditRole,
                        Qt.ItemDataRole.AccessibleTextRole):
                return op.capacity
            if role == Qt.ItemDataRole.ToolTipRole:
                return self.tr("How many machines {operator} runs at once (1 to {most})").format(
                    operator=op.label, most=MAX_MINDING)
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
                return self.tr("expired")
            if authorised and self._expiring(left):
                return self.tr("{mark} {days} d").format(mark=palette.MARK_RUSH, days=left)
            return self.tr("group") if authorised and how.startswith("through") else ""
        if role == Qt.ItemDataRole.BackgroundRole and self._expiring(left):
            return palette.colour("rush", 70)
        if role == Qt.ItemDataRole.ToolTipRole:
            if not how:
                return self.tr("{operator} is not authorised for {machine} (Space or click: authorise)").format(
                    operator=op.label, machine=machine)
            tip = self.tr("{operator} for {machine}: {how}").format(operator=op.label, machine=machine,
                                                                    how=self._how_text(how))
            if left is not None:
                tip += (self.tr(", expired %n day(s) ago (counts as none)", "", -left) if left < 0
                        else self.tr(", expires in %n day(s)", "", left))
            if how.startswith("through"):
                tip += self.tr("; the group's authorisation is given or withdrawn from the cell's menu")
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
            return self.tr(LEADING[section])
        if section - FIRST_MACHINE >= self._doc.n_machines():
            return None
        m = self._doc.machine_at(section - FIRST_MACHINE)
        unattended = m.id in set(self._doc.shop.crew.unattended)
        if role == Qt.ItemDataRole.ToolTipRole:
            tip = self.tr("{machine}: runs unattended (needs no operator)").format(machine=m.name) \
                if unattended else m.name
            groups = [name for name, members in self._doc.shop.crew.groups.items() if m.id in members]
            if groups:
                tip += "\n" + self.tr("Machine groups: {groups}").format(groups=", ".join(groups))
            return tip + "\n" + self.tr("Right-click: runs unattended or needs an operator; machine groups")
        return m.name + ("\n" + self.tr("(unattended)") if unattended else "")

    # ---- edits ----------------------------------------------------------------------------
    def setData(self, index: QModelIndex, value, role: int = Qt.ItemDataRole.EditRole) -> bool:
        if not index.isValid():
            return False
        doc, row, col = self._doc, index.row(), index.column()
        op = doc.shop.crew.operators[row]
        if col == COL_LABEL and role == Qt.ItemDataRole.EditRole:
            label = str(value).strip()
            if label == op.label:
                return False
            try:
                with_operator_text(doc.shop, op.id, "label", label)
            except ShopError as exc:
                self.refused.emit(self.tr("renaming {operator} refused: {problem}; nothing changed").format(
                    operator=op.label, problem=exc.summary(3)))
                return False
            doc.undo_stack.push(SetOperatorField(doc, row, "label", label, self.tr("Rename {operator}").format(
                operator=op.label)))
            return True
        if col in TIME_COLUMNS and role == Qt.ItemDataRole.EditRole:
            key, text = TIME_COLUMNS[col], str(value).strip()
            old = getattr(op, key)
            if text == ("" if old is None else old.strftime("%H:%M")):
                return False
            try:
                crew = with_times(doc.shop, op.id, **{key: text})
            except ShopError as exc:
                self.refused.emit(self.tr("time refused: {problem}; nothing changed").format(
                    problem=exc.summary(3)))
                return False
            t = getattr(crew.operator(op.id), key)
            if col == COL_ARRIVES:
                what = (self.tr("{operator} arrives at {time}") if t is not None else
                        self.tr("{operator} arrives at the shift's start"))
            else:
                what = (self.tr("{operator} leaves at {time}") if t is not None else
                        self.tr("{operator} leaves at the shift's end"))
            doc.undo_stack.push(SetCrew(doc, crew, what.format(
                operator=op.label, time="" if t is None else when_text(t))))
            return True
        if col == COL_MINDS and role == Qt.ItemDataRole.EditRole:
            try:
                n = int(str(value).strip())
            except ValueError:
                return False
            if not 1 <= n <= MAX_MINDING or n == op.capacity:
                return False
            doc.undo_stack.push(SetOperatorField(doc, row, "capacity", n,
                                                 self.tr("{operator} minds %n machine(s)", "", n).format(
                                                     operator=op.label)))
            return True
        if role != Qt.ItemDataRole.CheckStateRole:
            return False
        on = Qt.CheckState(value) == Qt.CheckState.Checked if not isinstance(value, bool) else value
        if col == COL_PRESENT:
            doc.undo_stack.push(SetOperatorField(doc, row, "attendance", PRESENT if on else ABSENT,
                                                 (self.tr("{operator} present") if on else
                                                  self.tr("{operator} absent")).format(operator=op.label)))
            return True
        if col < FIRST_MACHINE:
            return False
        k = col - FIRST_MACHINE
        machine = doc.machine_at(k).name
        doc.undo_stack.push(SetAuthorisations(
            doc, [(row, k, on)], (self.tr("Authorise {operator} for {machine}") if on else
                                  self.tr("Withdraw {operator} for {machine}")).format(operator=op.label,
                                                                                       machine=machine)))
        return True

    def paste_cells(self, text: str, row: int, col: int) -> list[tuple[int, int, bool]]:
        """Authorisation changes from a tab-separated block pasted at (row, col).

        Raises ValueError naming the block's row and column of a cell that is neither a
        yes nor a no, or of a block that does not fit the machine columns.
        """
        lines = text.replace("\r\n", "\n").replace("\r", "\n").rstrip("\n").split("\n")
        if col < FIRST_MACHINE:
            raise ValueError(self.tr("paste authorisations into the machine columns"))
        out = []
        for r, line in enumerate(lines):
            for c, cell in enumerate(line.split("\t")):
                rr, kk = row + r, col - FIRST_MACHINE + c
                if rr >= self.rowCount() or kk >= self._doc.n_machines():
                    raise ValueError(self.tr("the pasted block (row {row}, column {column}) reaches past "
                                             "the last operator or machine").format(row=r + 1, column=c + 1))
                word = cell.strip().lower()
                if word in YES:
                    out.append((rr, kk, True))
                elif word in NO:
                    out.append((rr, kk, False))
                else:
                    raise ValueError(self.tr("pasted row {row}, column {column}: {cell} is neither "
                                             "yes (1, x, yes) nor no (0, empty, no)").format(
                        row=r + 1, column=c + 1, cell=repr(cell)))
        return out
