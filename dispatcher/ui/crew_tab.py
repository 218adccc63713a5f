"""The crew tab: who is here this shift and what each operator may run.

:class:`CrewTab` is a part of the main window, created in its constructor. Its table
(:class:`~dispatcher.ui.crew_model.CrewModel`) edits attendance, minding capacity and
authorisations, each an undoable edit; Space (or a click) toggles the current cell,
Edit > Paste (Ctrl+V) on this tab pastes a block of yes/no cells from a spreadsheet.
Every change re-solves the plan, which then puts a present, authorised operator on every
running machine.
"""

from __future__ import annotations

from PySide6.QtCore import QT_TRANSLATE_NOOP, QEvent, QObject
from PySide6.QtGui import QGuiApplication
from PySide6.QtWidgets import QHBoxLayout, QLabel, QPushButton, QTableView, QVBoxLayout, QWidget

from dispatcher.shop.crew import Operator
from dispatcher.ui.crew_model import FIRST_MACHINE, CrewModel
from dispatcher.ui.edits import AddOperator, SetAuthorisations

CAUTION = QT_TRANSLATE_NOOP("CrewTab", "Operators run only machines they are trained and authorised for; "
                            "the site's training records decide, this table only repeats them.")


class CrewTab(QObject):
    """``view`` (the widget the window puts in its tabs), ``table`` and ``model``."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.doc = window.doc
        self.model = CrewModel(self.doc, self)
        self.view = QWidget(window)
        self.view.setObjectName("crewTab")
        self.view.setAccessibleName(self.tr("Crew"))
        self.view.setAccessibleDescription(self.tr("Operators of this shift, who is present, and what "
                                                   "each is authorised to run"))
        self.table = QTableView(self.view)
        self.table.setObjectName("crewTable")
        self.table.setAccessibleName(self.tr("Crew table"))
        self.table.setAccessibleDescription(self.tr("One row per operator: present, machines minded at "
                                                    "once, and a check for each machine they may run"))
        self.table.setModel(self.model)
        self.table.setAlternatingRowColors(True)
        self.empty = QLabel(self.tr("This shop has no crew: plans do not staff machines. Add an operator "
                                    "to plan with who is here."), self.view)
        self.empty.setWordWrap(True)
        self.empty.setAccessibleName(self.tr("No crew"))
        self.empty.setAccessibleDescription(self.empty.text())
        self.add = QPushButton(self.tr("Add &operator"), self.view)
        self.add.setAccessibleName(self.tr("Add operator"))
        self.add.setAccessibleDescription(self.tr("Add an operator to the crew (Ctrl+Z takes it back)"))
        self.add.clicked.connect(self.add_operator)
        caution = QLabel(self.tr(CAUTION), self.view)
        caution.setWordWrap(True)
        caution.setAccessibleName(self.tr("Safety caution"))
        caution.setAccessibleDescription(caution.text())
        row = QHBoxLayout()
        row.addWidget(self.add)
        row.addStretch(1)
        layout = QVBoxLayout(self.view)
        layout.addWidget(self.empty)
        layout.addWidget(self.table, 1)
        layout.addLayout(row)
        layout.addWidget(caution)
        self._size_pending = False
        self.view.installEventFilter(self)
        self.model.modelReset.connect(self._refresh)
        self._refresh()

    def _refresh(self) -> None:
        has_crew = bool(self.doc.shop.crew.operators)
        self.empty.setVisible(not has_crew)
        # Sizing measures every cell (a machine column each): done when the tab is seen,
        # not while a big shop opens behind another tab.
        self._size_pending = has_crew
        if self.view.isVisible():
            self._size_columns()

    def _size_columns(self) -> None:
        if self._size_pending:
            self._size_pending = False
            self.table.resizeColumnsToContents()

    def eventFilter(self, watched, event) -> bool:
        if watched is self.view and event.type() == QEvent.Type.Show:
            self._size_columns()
        return False

    def add_operator(self) -> None:
        crew = self.doc.shop.crew
        ids = {o.id for o in crew.operators}
        labels = {o.label for o in crew.operators}
        n = len(crew.operators) + 1
        while f"O{n}" in ids or f"Operator {n}" in labels:
            n += 1
        self.doc.undo_stack.push(AddOperator(self.doc, Operator(f"O{n}", f"Operator {n}"),
                                             self.tr("Add Operator {n}").format(n=n)))

    def is_current(self) -> bool:
        return self.window.tabs.currentWidget() is self.view

    def paste(self) -> bool:
        index = self.table.currentIndex()
        row, col = (index.row(), index.column()) if index.isValid() else (0, FIRST_MACHINE)
        try:
            cells = self.model.paste_cells(QGuiApplication.clipboard().text(), row, col)
        except ValueError as exc:
            self.window.show_warning(self.tr("paste into the crew refused: {problem}; nothing changed").format(
                problem=exc))
            return False
        if cells:
            self.doc.undo_stack.push(SetAuthorisations(self.doc, cells,
                                                       self.tr("Paste %n authorisation(s)", "", len(cells))))
        return True
