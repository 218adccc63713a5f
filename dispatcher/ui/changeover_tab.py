"""The changeover tab: edit the shop's changeover tables, one families x families grid each.

:class:`ChangeoverTab` is a part of the main window, created in its constructor. A list
picks the table; its grid (:class:`~dispatcher.ui.changeover_model.ChangeoverModel`) has a
row per family changed from plus the "nothing mounted" row, a column per family changed
to. Typing a number sets a change, an empty cell (Delete) makes it not allowed; Edit >
Paste (Ctrl+V) on this tab pastes a block from a spreadsheet. Every edit is undoable and
moves the derived values of the grid with it.
"""

from __future__ import annotations

from PySide6.QtCore import QObject
from PySide6.QtGui import QGuiApplication
from PySide6.QtWidgets import QComboBox, QHBoxLayout, QLabel, QTableView, QVBoxLayout, QWidget

from dispatcher.ui.changeover_model import ChangeoverModel, ChangePasteError
from dispatcher.ui.edits import SetChanges


class ChangeoverTab(QObject):
    """``view`` (the widget the window puts in its tabs), ``chooser``, ``table``, ``model``."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.doc = window.doc
        self.model = ChangeoverModel(self.doc, self)
        self.view = QWidget(window)
        self.view.setObjectName("changeoverTab")
        self.view.setAccessibleName(self.tr("Changeover tables"))
        self.view.setAccessibleDescription(
            self.tr("The time or cost of changing a group of machines from one setup family to another")
        )
        self.chooser = QComboBox(self.view)
        self.chooser.setObjectName("changeoverTableChooser")
        self.chooser.setAccessibleName(self.tr("Changeover table"))
        self.chooser.setAccessibleDescription(self.tr("Which changeover table the grid below edits"))
        label = QLabel(self.tr("&Table:"), self.view)
        label.setBuddy(self.chooser)
        self.machines = QLabel(self.view)
        self.machines.setWordWrap(True)
        self.table = QTableView(self.view)
        self.table.setObjectName("changeoverTable")
        self.table.setAccessibleName(self.tr("Changeover grid"))
        self.table.setAccessibleDescription(
            self.tr(
                "Rows: the family mounted now, last the nothing-mounted row; columns: the family "
                "changed to; an empty cell means the change is not allowed"
            )
        )
        self.table.setModel(self.model)
        self.empty = QLabel(
            self.tr(
                "This shop has no changeover table: every value is typed in the "
                "grid. Import one with dispatcher import-jobs --changeovers FILE."
            ),
            self.view,
        )
        self.empty.setWordWrap(True)
        note = QLabel(
            self.tr(
                "Changes need not add up: a change through a wash-up can be cheaper "
                "than the direct one, and the plans never assume otherwise. Follow "
                "each machine's setup instructions."
            ),
            self.view,
        )
        note.setWordWrap(True)
        row = QHBoxLayout()
        row.addWidget(label)
        row.addWidget(self.chooser, 1)
        layout = QVBoxLayout(self.view)
        layout.addLayout(row)
        layout.addWidget(self.machines)
        layout.addWidget(self.empty)
        layout.addWidget(self.table, 1)
        layout.addWidget(note)
        self.chooser.currentIndexChanged.connect(self._choose)
        self.model.warning.connect(window.show_warning)
        self.doc.reset.connect(self._fill)
        self._fill()

    def _fill(self) -> None:
        tables = self.doc.shop.changeover_tables
        self.chooser.blockSignals(True)
        self.chooser.clear()
        for t in tables:
            self.chooser.addItem(t.name or t.id)
        self.chooser.blockSignals(False)
        self.chooser.setEnabled(bool(tables))
        self.empty.setVisible(not tables)
        self._choose(0 if tables else -1)

    def _choose(self, index: int) -> None:
        self.model.set_table(index if index >= 0 else None)
        t = self.model.table()
        if t is None:
            self.machines.setText("")
        else:
            names = [self.doc.shop.machine(m).name for m in t.machines if m in self.doc.machine_col]
            self.machines.setText(self.tr("Shared by: {machines}").format(machines=", ".join(names) or "-"))
        self.table.resizeColumnsToContents()

    def is_current(self) -> bool:
        return self.window.tabs.currentWidget() is self.view

    def _anchor(self) -> tuple[int, int]:
        index = self.table.currentIndex()
        return (index.row(), index.column()) if index.isValid() else (0, 0)

    def paste_text(self, text: str) -> bool:
        row, column = self._anchor()
        try:
            n = self.model.paste(text, row, column)
        except ChangePasteError as exc:
            self.window.show_warning(
                self.tr("paste into the changeover table refused: {problem}; nothing changed").format(problem=exc)
            )
            return False
        self.window.statusBar().showMessage(self.tr("Pasted; %n changeover(s) changed", "", n), 4000)
        return True

    def paste(self) -> bool:
        return self.paste_text(QGuiApplication.clipboard().text())

    def clear(self) -> None:
        """Make the selected changes not allowed (Delete on this tab)."""
        t = self.model.table()
        if t is None:
            return
        cells = []
        for index in self.table.selectionModel().selectedIndexes():
            frm, to = self.model.from_family(index.row()), t.families[index.column()]
            if t.change(frm, to) is not None:
                cells.append((frm, to, None))
        if cells:
            self.doc.undo_stack.push(
                SetChanges(
                    self.doc, self.model.table_index, cells, self.tr("Disallow %n changeover(s)", "", len(cells))
                )
            )
