"""The crew tab: who is here this shift and what each operator may run.

:class:`CrewTab` is a part of the main window, created in its constructor. Its table
(:class:`~dispatcher.ui.crew_model.CrewModel`) edits the label, attendance, arrival and
leaving times, minding capacity, notes and authorisations, each an undoable edit; Space
(or a click) toggles the current cell, Edit > Paste (Ctrl+V) on this tab pastes a block of
yes/no cells from a spreadsheet. F2 (or a double-click) on a notes cell edits the notes, on
a machine cell the expiry date of the authorisation. A cell's context menu also gives or
withdraws a whole machine group and removes the operator; a machine header's context menu
says whether the machine runs unattended. The machine groups dialog
(:mod:`dispatcher.ui.crew_groups`) changes the groups. Every change is checked by the core
(:mod:`dispatcher.shop.crew_edit`), refused with a message when it breaks a rule, and
re-solves the plan, which then puts a present, authorised operator on every running machine.
"""

from __future__ import annotations

from PySide6.QtCore import QT_TRANSLATE_NOOP, QEvent, QModelIndex, QObject, QPoint, Qt
from PySide6.QtGui import QGuiApplication
from PySide6.QtWidgets import (
    QHBoxLayout,
    QLabel,
    QLineEdit,
    QMenu,
    QPushButton,
    QSpinBox,
    QStyledItemDelegate,
    QTableView,
    QVBoxLayout,
    QWidget,
)

from dispatcher.limits import MAX_NAME_CHARS
from dispatcher.shop.crew import Operator
from dispatcher.shop.crew_edit import (
    authorisation_for,
    group_authorised,
    with_expiry,
    with_group_authorisation,
    with_operator_text,
    with_unattended,
    with_warn_days,
    without_operator,
)
from dispatcher.shop.model import ShopError
from dispatcher.ui import asking
from dispatcher.ui.crew_groups import GroupsDialog
from dispatcher.ui.crew_model import COL_LABEL, COL_NOTES, FIRST_MACHINE, TIME_COLUMNS, CrewModel
from dispatcher.ui.edits import AddOperator, SetAuthorisations, SetCrew

CAUTION = QT_TRANSLATE_NOOP("CrewTab", "Operators run only machines they are trained and authorised for; "
                            "the site's training records decide, this table only repeats them.")
#: Widest the notes column starts (the full notes are in the tooltip and the dialog).
NOTES_WIDTH = 180


class CrewDelegate(QStyledItemDelegate):
    """Editors held to the limits: a label at most a name long, a time as HH:MM."""

    def createEditor(self, parent, option, index):
        editor = super().createEditor(parent, option, index)
        if isinstance(editor, QLineEdit):
            model = index.model()
            editor.setAccessibleName(str(model.headerData(index.column(), Qt.Orientation.Horizontal)))
            editor.setAccessibleDescription(str(model.data(index, Qt.ItemDataRole.ToolTipRole) or ""))
            if index.column() == COL_LABEL:
                editor.setMaxLength(MAX_NAME_CHARS)
            elif index.column() in TIME_COLUMNS:
                editor.setMaxLength(5)
                editor.setPlaceholderText(self.tr("HH:MM"))
        return editor


class CrewTab(QObject):
    """``view`` (the widget the window puts in its tabs), ``table`` and ``model``."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.doc = window.doc
        self.model = CrewModel(self.doc, self)
        self.model.refused.connect(self.refuse)
        self.view = QWidget(window)
        self.view.setObjectName("crewTab")
        self.view.setAccessibleName(self.tr("Crew"))
        self.view.setAccessibleDescription(self.tr("Operators of this shift, who is present, and what "
                                                   "each is authorised to run"))
        self.table = QTableView(self.view)
        self.table.setObjectName("crewTable")
        self.table.setAccessibleName(self.tr("Crew table"))
        self.table.setAccessibleDescription(self.tr("One row per operator: present, arrives, leaves, machines "
                                                    "minded at once, notes, and a check for each machine they "
                                                    "may run; F2 on a machine cell sets the expiry date, the "
                                                    "context menu gives machine groups and removes an operator"))
        self.table.setModel(self.model)
        self.table.setItemDelegate(CrewDelegate(self.table))
        self.table.setAlternatingRowColors(True)
        self.table.setWordWrap(False)
        self.table.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        self.table.customContextMenuRequested.connect(self._cell_menu)
        header = self.table.horizontalHeader()
        header.setContextMenuPolicy(Qt.ContextMenuPolicy.CustomContextMenu)
        header.customContextMenuRequested.connect(self._header_menu)
        self.table.doubleClicked.connect(self._double_clicked)
        self.table.installEventFilter(self)
        self._size_pending = False
        self.view.installEventFilter(self)
        self.empty = QLabel(self.tr("This shop has no crew: plans do not staff machines. Add an operator "
                                    "to plan with who is here."), self.view)
        self.empty.setWordWrap(True)
        self.empty.setAccessibleName(self.tr("No crew"))
        self.empty.setAccessibleDescription(self.empty.text())
        self.add = QPushButton(self.tr("Add &operator"), self.view)
        self.add.setAccessibleName(self.tr("Add operator"))
        self.add.setAccessibleDescription(self.tr("Add an operator to the crew (Ctrl+Z takes it back)"))
        self.add.clicked.connect(self.add_operator)
        self.remove = QPushButton(self.tr("Remove opera&tor"), self.view)
        self.remove.setAccessibleName(self.tr("Remove operator"))
        self.remove.setAccessibleDescription(self.tr("Remove the operator of the current row with their "
                                                     "authorisations (Ctrl+Z puts them back)"))
        self.remove.clicked.connect(lambda: self.remove_operator(self.table.currentIndex().row()))
        self.groups = QPushButton(self.tr("Machine gro&ups\u2026"), self.view)
        self.groups.setAccessibleName(self.tr("Machine groups"))
        self.groups.setAccessibleDescription(self.tr("See, create, rename and delete machine groups and "
                                                     "choose their machines"))
        self.groups.clicked.connect(self.open_groups)
        warn_label = QLabel(self.tr("Warn about authorisations expiring within"), self.view)
        self.warn = QSpinBox(self.view)
        self.warn.setRange(0, 366)
        self.warn.setSuffix(self.tr(" days"))
        self.warn.setAccessibleName(self.tr("Warning days"))
        self.warn.setAccessibleDescription(self.tr("Authorisations that run out within this many days of "
                                                   "the shift's day are marked here and listed in the plan "
                                                   "and on the sheet"))
        warn_label.setBuddy(self.warn)
        self.warn.valueChanged.connect(self.set_warn_days)
        caution = QLabel(self.tr(CAUTION), self.view)
        caution.setWordWrap(True)
        caution.setAccessibleName(self.tr("Safety caution"))
        caution.setAccessibleDescription(caution.text())
        row = QHBoxLayout()
        row.addWidget(self.add)
        row.addWidget(self.remove)
        row.addWidget(self.groups)
        row.addStretch(1)
        row.addWidget(warn_label)
        row.addWidget(self.warn)
        layout = QVBoxLayout(self.view)
        layout.addWidget(self.empty)
        layout.addWidget(self.table, 1)
        layout.addLayout(row)
        layout.addWidget(caution)
        self._kept = (-1, -1)
        self.model.modelAboutToBeReset.connect(self._keep_place)
        self.model.modelReset.connect(self._refresh)
        self.table.selectionModel().currentChanged.connect(self._enable)
        self._refresh()

    # ---- showing ----------------------------------------------------------------------------
    def _keep_place(self) -> None:
        index = self.table.currentIndex()
        self._kept = (index.row(), index.column()) if index.isValid() else (-1, -1)

    def _refresh(self) -> None:
        crew = self.doc.shop.crew
        row, col = self._kept
        if row >= 0:   # the cell being worked on stays current after an edit
            row = min(row, self.model.rowCount() - 1)
            if row >= 0 and col < self.model.columnCount():
                self.table.setCurrentIndex(self.model.index(row, col))
        self.empty.setVisible(not crew.operators)
        # Sizing measures every cell (a machine column each): done when the tab is seen,
        # not while a big shop opens behind another tab.
        self._size_pending = bool(crew.operators)
        if self.view.isVisible():
            self._size_columns()
        self.warn.blockSignals(True)
        self.warn.setValue(crew.warn_days)
        self.warn.blockSignals(False)
        self._enable()

    def _size_columns(self) -> None:
        if self._size_pending:
            self._size_pending = False
            self.table.resizeColumnsToContents()
            if self.table.columnWidth(COL_NOTES) > NOTES_WIDTH:
                self.table.setColumnWidth(COL_NOTES, NOTES_WIDTH)

    def _enable(self, *_args) -> None:
        self.remove.setEnabled(self.table.currentIndex().isValid() and bool(self.doc.shop.crew.operators))

    def refuse(self, text: str) -> None:
        self.window.show_warning(text)

    def is_current(self) -> bool:
        return self.window.tabs.currentWidget() is self.view

    def _push(self, make, text: str, what: str, merge: str | None = None) -> bool:
        """Push ``make()`` (a checked crew from the core) as one undoable edit named ``text``;
        on a refusal say why (``what`` was refused) and change nothing."""
        try:
            crew = make()
        except ShopError as exc:
            self.refuse(self.tr("{what} refused: {problem}; nothing changed").format(
                what=what, problem=exc.summary(3)))
            return False
        self.doc.undo_stack.push(SetCrew(self.doc, crew, text, merge))
        return True

    # ---- keys, clicks and menus -------------------------------------------------------------
    def eventFilter(self, watched, event) -> bool:
        if watched is self.view and event.type() == QEvent.Type.Show:
            self._size_columns()
        if watched is self.table and event.type() == QEvent.Type.KeyPress and event.key() == Qt.Key.Key_F2:
            index = self.table.currentIndex()
            if index.isValid() and (index.column() == COL_NOTES or index.column() >= FIRST_MACHINE):
                self._double_clicked(index)
                return True
        return super().eventFilter(watched, event)

    def _double_clicked(self, index: QModelIndex) -> None:
        if index.column() == COL_NOTES:
            self.edit_notes(index.row())
        elif index.column() >= FIRST_MACHINE:
            self.edit_expiry(index.row(), index.column() - FIRST_MACHINE)

    def _cell_menu(self, pos: QPoint) -> None:
        index = self.table.indexAt(pos)
        if not index.isValid():
            return
        menu = self.cell_menu(index.row(), index.column())
        menu.exec(self.table.viewport().mapToGlobal(pos))

    def cell_menu(self, row: int, col: int) -> QMenu:
        """The context menu of a cell (built fresh, deleted when closed)."""
        crew = self.doc.shop.crew
        op = crew.operators[row]
        menu = QMenu(self.table)
        menu.setAttribute(Qt.WidgetAttribute.WA_DeleteOnClose)
        menu.setAccessibleName(self.tr("Operator {operator}").format(operator=op.label))
        if col >= FIRST_MACHINE:
            a = menu.addAction(self.tr("&Expiry date\u2026") + "\tF2")
            a.triggered.connect(lambda: self.edit_expiry(row, col - FIRST_MACHINE))
        a = menu.addAction(self.tr("&Notes\u2026"))
        a.triggered.connect(lambda: self.edit_notes(row))
        sub = menu.addMenu(self.tr("Authorised for &group"))
        sub.setAccessibleName(self.tr("Authorised for group"))
        for name in crew.groups:
            g = sub.addAction(name)
            g.setCheckable(True)
            g.setChecked(group_authorised(crew, op.id, name))
            g.toggled.connect(lambda on, n=name: self.set_group_authorisation(row, n, on))
        if not crew.groups:
            sub.addAction(self.tr("(no machine groups)")).setEnabled(False)
        menu.addSeparator()
        a = menu.addAction(self.tr("Remove opera&tor"))
        a.triggered.connect(lambda: self.remove_operator(row))
        a = menu.addAction(self.tr("Machine gro&ups\u2026"))
        a.triggered.connect(self.open_groups)
        return menu

    def _header_menu(self, pos: QPoint) -> None:
        col = self.table.horizontalHeader().logicalIndexAt(pos)
        if col < FIRST_MACHINE:
            return
        self.header_menu(col - FIRST_MACHINE).exec(self.table.horizontalHeader().mapToGlobal(pos))

    def header_menu(self, k: int) -> QMenu:
        """The context menu of machine ``k``'s header."""
        machine = self.doc.machine_at(k)
        menu = QMenu(self.table)
        menu.setAttribute(Qt.WidgetAttribute.WA_DeleteOnClose)
        menu.setAccessibleName(machine.name)
        a = menu.addAction(self.tr("Runs una&ttended (needs no operator)"))
        a.setCheckable(True)
        a.setChecked(machine.id in self.doc.shop.crew.unattended)
        a.toggled.connect(lambda on: self.set_unattended(k, on))
        a = menu.addAction(self.tr("Machine gro&ups\u2026"))
        a.triggered.connect(self.open_groups)
        return menu

    # ---- edits ------------------------------------------------------------------------------
    def add_operator(self) -> None:
        crew = self.doc.shop.crew
        ids = {o.id for o in crew.operators}
        labels = {o.label for o in crew.operators}
        n = len(crew.operators) + 1
        while f"O{n}" in ids or f"Operator {n}" in labels:
            n += 1
        self.doc.undo_stack.push(AddOperator(self.doc, Operator(f"O{n}", f"Operator {n}"),
                                             self.tr("Add Operator {n}").format(n=n)))

    def remove_operator(self, row: int) -> None:
        crew = self.doc.shop.crew
        if not 0 <= row < len(crew.operators):
            return
        op = crew.operators[row]
        self._push(lambda: without_operator(self.doc.shop, op.id),
                   self.tr("Remove {operator}").format(operator=op.label), self.tr("removing the operator"))

    def edit_notes(self, row: int) -> None:
        op = self.doc.shop.crew.operators[row]
        text, ok = asking.get_long_text(
            self.window, self.tr("Notes"), self.tr("Notes on {operator}:").format(operator=op.label),
            self.tr("Free text kept with the operator (shown in the crew table's tooltip)"), op.notes)
        if ok and text != op.notes:
            self._push(lambda: with_operator_text(self.doc.shop, op.id, "notes", text),
                       self.tr("Notes on {operator}").format(operator=op.label), self.tr("notes"))

    def _for_what(self, a, machine_name: str) -> str:
        return machine_name if a.machine else self.tr("group {group} (all its machines)").format(group=a.group)

    def edit_expiry(self, row: int, k: int) -> None:
        crew = self.doc.shop.crew
        op, machine = crew.operators[row], self.doc.machine_at(k)
        index = authorisation_for(crew, op.id, machine.id)
        if index is None:
            self.refuse(self.tr("{operator} is not authorised for {machine}: authorise first (Space), "
                                "then set the expiry date").format(operator=op.label, machine=machine.name))
            return
        a = crew.authorisations[index]
        what = self._for_what(a, machine.name)
        text, ok = asking.get_text(
            self.window, self.tr("Authorisation expiry"),
            self.tr("{operator} for {what} expires on (YYYY-MM-DD; empty: never):").format(
                operator=op.label, what=what),
            self.tr("The last day the authorisation counts; after it the operator is not planned on "
                    "these machines"), "" if a.expires is None else a.expires.isoformat())
        if not ok:
            return
        old = "" if a.expires is None else a.expires.isoformat()
        if text.strip() == old:
            return
        label = (self.tr("{operator} for {what}: expires {date}").format(operator=op.label, what=what,
                                                                         date=text.strip())
                 if text.strip() else self.tr("{operator} for {what}: no expiry").format(operator=op.label,
                                                                                       what=what))
        self._push(lambda: with_expiry(self.doc.shop, index, text), label, self.tr("expiry date"))

    def set_unattended(self, k: int, on: bool) -> None:
        machine = self.doc.machine_at(k)
        if (machine.id in self.doc.shop.crew.unattended) == on:
            return
        self._push(lambda: with_unattended(self.doc.shop, machine.id, on),
                   (self.tr("{machine} runs unattended") if on else
                    self.tr("{machine} needs an operator")).format(machine=machine.name),
                   self.tr("unattended machine"))

    def set_group_authorisation(self, row: int, group: str, on: bool) -> None:
        op = self.doc.shop.crew.operators[row]
        if group_authorised(self.doc.shop.crew, op.id, group) == on:
            return
        self._push(lambda: with_group_authorisation(self.doc.shop, op.id, group, on),
                   (self.tr("Authorise {operator} for group {group}") if on else
                    self.tr("Withdraw {operator} from group {group}")).format(operator=op.label, group=group),
                   self.tr("group authorisation"))

    def set_warn_days(self, days: int) -> None:
        if days == self.doc.shop.crew.warn_days:
            return
        if not self._push(lambda: with_warn_days(self.doc.shop, days),
                          self.tr("Warn %n day(s) before an authorisation expires", "", days),
                          self.tr("warning days"), merge="warn_days"):
            self._refresh()

    def open_groups(self) -> GroupsDialog:
        """Open the machine groups dialog (window-modal); OK makes its change one undoable edit."""
        dialog = GroupsDialog(self.doc.shop, self.window)
        dialog.setAttribute(Qt.WidgetAttribute.WA_DeleteOnClose)

        def done() -> None:
            if dialog.crew is not None and dialog.crew != self.doc.shop.crew:
                self.doc.undo_stack.push(SetCrew(self.doc, dialog.crew, self.tr("Change machine groups")))

        dialog.accepted.connect(done)
        dialog.open()
        return dialog

    def clear(self) -> None:
        """Delete on this tab: withdraw the selected authorisations (one undoable edit)."""
        picked = sorted({(i.row(), i.column() - FIRST_MACHINE) for i in self.table.selectionModel().selectedIndexes()
                         if i.column() >= FIRST_MACHINE})
        cells = []
        for row, k in picked:
            # an operator's own authorisations; one through a machine group stays (the
            # groups window changes it)
            authorised, how, _left = self.model.authorisation(row, k)
            if authorised and not how.startswith("through"):
                cells.append((row, k, False))
        if cells:
            self.doc.undo_stack.push(SetAuthorisations(self.doc, cells,
                                                       self.tr("Withdraw %n authorisation(s)", "", len(cells))))

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
