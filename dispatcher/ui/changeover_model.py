"""One changeover table as a Qt table model: from-families as rows, to-families as columns.

Rows are the table's families in order, then the "nothing mounted" row (an empty or
cleaned machine); columns are the families changed to. A cell holds the change's time or
cost; an empty cell (shown as a dash) means the change is not allowed. Every edit is an
undoable :class:`~dispatcher.ui.edits.SetChanges` on the document's stack, and the grid's
derived values follow through the document's signals.
"""

from __future__ import annotations

from PySide6.QtCore import QAbstractTableModel, QCoreApplication, QModelIndex, QPersistentModelIndex, Qt, Signal

from dispatcher.ui import palette
from dispatcher.ui.document import ShopDocument
from dispatcher.ui.edits import SetChanges
from dispatcher.ui.format import CellTextError, fmt, parse_cell, unit_text

ChangeRole = Qt.ItemDataRole.UserRole + 1  # float | None: the entry (None = not allowed)
translate = QCoreApplication.translate  # the name pyside6-lupdate collects


class ChangePasteError(ValueError):
    """A pasted block that cannot go into the table; the message names the cell."""


def _rows_of(text: str) -> list[list[str]]:
    text = text.replace("\r\n", "\n").replace("\r", "\n")
    if text.endswith("\n"):
        text = text[:-1]
    return [line.split("\t") for line in text.split("\n")]


def paste_entries(
    text: str, families: list[str], anchor_row: int, anchor_col: int, empty_name: str = "nothing mounted"
) -> list[tuple[str | None, str, float | None]]:
    """The entries a tab-separated block sets, ``(from or None, to, value or None)``.

    A block whose first row names families of the table (a matrix copied with its headers)
    goes to those families wherever they are, its first column naming the from-families
    (``empty_name`` or an empty first cell for "nothing mounted"); any other block goes
    from the anchor cell right and down. An empty cell or ``x`` means "not allowed".
    Raises :class:`ChangePasteError` naming the block's row and column and the change.
    """
    rows = _rows_of(text)
    if not rows or rows == [[""]]:
        raise ChangePasteError(translate("ChangeoverModel", "the clipboard holds no text to paste"))
    from_names = [*families, None]
    header = [c.strip() for c in rows[0][1:]]
    named = len(rows) > 1 and any(header) and all(h in families for h in header if h)
    out: list[tuple[str | None, str, float | None]] = []
    if named:
        for r, row in enumerate(rows[1:], start=2):
            label = row[0].strip() if row else ""
            if label.lower() in ("", empty_name.lower(), "nothing mounted", "(nothing mounted)"):
                frm = None
            elif label in families:
                frm = label
            else:
                raise ChangePasteError(
                    translate(
                        "ChangeoverModel", "pasted block: row {row}, column 1: {label} is not a family of this table"
                    ).format(row=r, label=repr(label))
                )
            for c, to in enumerate(header, start=2):
                if not to:
                    continue
                cell = row[c - 1] if c - 1 < len(row) else ""
                out.append((frm, to, _number(cell, r, c, frm, to, empty_name)))
        return out
    width = max(len(r) for r in rows)
    if anchor_row + len(rows) > len(from_names) or anchor_col + width > len(families):
        raise ChangePasteError(
            translate(
                "ChangeoverModel",
                "pasted block: {rows} x {width} cells do not fit from the current cell: the table has "
                "{free_rows} rows and {free_columns} columns from there",
            ).format(
                rows=len(rows),
                width=width,
                free_rows=len(from_names) - anchor_row,
                free_columns=len(families) - anchor_col,
            )
        )
    for r, row in enumerate(rows):
        for c in range(width):
            frm, to = from_names[anchor_row + r], families[anchor_col + c]
            cell = row[c] if c < len(row) else ""
            out.append((frm, to, _number(cell, r + 1, c + 1, frm, to, empty_name)))
    return out


def _number(cell: str, row: int, column: int, frm: str | None, to: str, empty_name: str) -> float | None:
    try:
        return parse_cell(cell)
    except CellTextError as exc:
        raise ChangePasteError(
            translate(
                "ChangeoverModel", "pasted block: row {row}, column {column} (change from {a} to {b}): {problem}"
            ).format(row=row, column=column, a=frm if frm is not None else empty_name, b=to, problem=exc)
        ) from None


class ChangeoverModel(QAbstractTableModel):
    """Table model over changeover table ``index`` of the document (None: no table).

    ``warning(str)`` reports typed text that was refused (the table is not changed).
    """

    warning = Signal(str)

    def __init__(self, doc: ShopDocument, parent=None):
        super().__init__(parent)
        self._doc = doc
        self._index: int | None = 0 if doc.shop.changeover_tables else None
        doc.reset.connect(self._on_reset)
        doc.tables_changed.connect(self._on_table)

    # ---- which table ----------------------------------------------------------------------
    @property
    def table_index(self) -> int | None:
        return self._index

    def set_table(self, index: int | None) -> None:
        self.beginResetModel()
        tables = self._doc.shop.changeover_tables
        self._index = index if index is not None and 0 <= index < len(tables) else None
        self.endResetModel()

    def table(self):
        return None if self._index is None else self._doc.shop.changeover_tables[self._index]

    def empty_name(self) -> str:
        return self.tr("nothing mounted")

    def from_family(self, row: int) -> str | None:
        families = self.table().families
        return families[row] if row < len(families) else None

    # ---- shape ----------------------------------------------------------------------------
    def rowCount(self, parent: QModelIndex | QPersistentModelIndex = QModelIndex()) -> int:
        t = self.table()
        return 0 if parent.isValid() or t is None else len(t.families) + 1

    def columnCount(self, parent: QModelIndex | QPersistentModelIndex = QModelIndex()) -> int:
        t = self.table()
        return 0 if parent.isValid() or t is None else len(t.families)

    # ---- data -----------------------------------------------------------------------------
    def data(self, index: QModelIndex | QPersistentModelIndex, role: int = Qt.ItemDataRole.DisplayRole):
        if not index.isValid() or self.table() is None:
            return None
        t = self.table()
        frm, to = self.from_family(index.row()), t.families[index.column()]
        value = t.change(frm, to)
        if role == ChangeRole:
            return value
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
            return palette.MARK_CANNOT if value is None else fmt(value)
        if role == Qt.ItemDataRole.EditRole:
            return "" if value is None else fmt(value)
        if role == Qt.ItemDataRole.TextAlignmentRole:
            return int(
                (Qt.AlignmentFlag.AlignCenter if value is None else Qt.AlignmentFlag.AlignRight)
                | Qt.AlignmentFlag.AlignVCenter
            )
        if role == Qt.ItemDataRole.BackgroundRole:
            if value is None:
                return palette.colour("cannot", 28)
            if frm == to:
                return palette.colour("up", 40)
            return None
        if role == Qt.ItemDataRole.ToolTipRole:
            what = frm if frm is not None else self.empty_name()
            unit = unit_text(self._doc.shop.unit.label())
            if value is None:
                return self.tr(
                    "Change from {a} to {b}: not allowed (a job of {b} cannot follow {a} on "
                    "these machines); type a number to allow it"
                ).format(a=what, b=to)
            if frm == to:
                return self.tr("No change: {b} stays mounted, {value} ({unit})").format(
                    b=to, value=fmt(value), unit=unit
                )
            return self.tr("Change from {a} to {b}: {value} ({unit}); empty: not allowed").format(
                a=what, b=to, value=fmt(value), unit=unit
            )
        return None

    def headerData(self, section: int, orientation: Qt.Orientation, role: int = Qt.ItemDataRole.DisplayRole):
        t = self.table()
        if t is None:
            return None
        if orientation == Qt.Orientation.Horizontal:
            if section >= len(t.families):
                return None
            if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
                return self.tr("to {family}").format(family=t.families[section])
            if role == Qt.ItemDataRole.ToolTipRole:
                return self.tr("Changes to family {family}").format(family=t.families[section])
            return None
        if section > len(t.families):
            return None
        frm = self.from_family(section)
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
            return (
                self.tr("from {family}").format(family=frm)
                if frm is not None
                else f"{palette.MARK_CANNOT} {self.empty_name()}"
            )
        if role == Qt.ItemDataRole.ToolTipRole:
            return (
                self.tr("Changes from family {family} (mounted now)").format(family=frm)
                if frm is not None
                else self.tr("Changes from an empty or cleaned machine")
            )
        return None

    def flags(self, index: QModelIndex | QPersistentModelIndex) -> Qt.ItemFlag:
        if not index.isValid():
            return Qt.ItemFlag.NoItemFlags
        return Qt.ItemFlag.ItemIsEnabled | Qt.ItemFlag.ItemIsSelectable | Qt.ItemFlag.ItemIsEditable

    def setData(self, index: QModelIndex | QPersistentModelIndex, value, role: int = Qt.ItemDataRole.EditRole) -> bool:
        if not index.isValid() or role != Qt.ItemDataRole.EditRole or self.table() is None:
            return False
        t = self.table()
        frm, to = self.from_family(index.row()), t.families[index.column()]
        what = frm if frm is not None else self.empty_name()
        try:
            number = parse_cell(str(value))
        except CellTextError as exc:
            self.warning.emit(
                self.tr("{table}: change from {a} to {b}: {problem}").format(
                    table=t.name or t.id, a=what, b=to, problem=exc
                )
            )
            return False
        if number != t.change(frm, to):
            shown = fmt(number) if number is not None else self.tr("not allowed")
            self._doc.undo_stack.push(
                SetChanges(
                    self._doc,
                    self._index,
                    [(frm, to, number)],
                    self.tr("Change from {a} to {b} = {value}").format(a=what, b=to, value=shown),
                )
            )
        return True

    def paste(self, text: str, row: int, column: int) -> int:
        """Paste a tab-separated block at (row, column) as one undoable edit; returns the
        number of entries changed. Raises :class:`ChangePasteError` (nothing changed)."""
        t = self.table()
        if t is None:
            raise ChangePasteError(self.tr("this shop has no changeover table to paste into"))
        cells = paste_entries(text, t.families, row, column, self.empty_name())
        cells = [c for c in cells if t.change(c[0], c[1]) != c[2]]
        if cells:
            self._doc.undo_stack.push(
                SetChanges(self._doc, self._index, cells, self.tr("Paste %n changeover(s)", "", len(cells)))
            )
        return len(cells)

    # ---- document signals -----------------------------------------------------------------
    def _on_reset(self) -> None:
        self.set_table(0 if self._doc.shop.changeover_tables else None)

    def _on_table(self, index: int) -> None:
        if index == self._index and self.rowCount() and self.columnCount():
            self.dataChanged.emit(
                self.index(0, 0),
                self.index(self.rowCount() - 1, self.columnCount() - 1),
                [
                    Qt.ItemDataRole.DisplayRole,
                    Qt.ItemDataRole.EditRole,
                    Qt.ItemDataRole.AccessibleTextRole,
                    Qt.ItemDataRole.ToolTipRole,
                    Qt.ItemDataRole.BackgroundRole,
                    Qt.ItemDataRole.TextAlignmentRole,
                    ChangeRole,
                ],
            )
