"""The machine groups dialog of the crew tab: which groups exist and which machines each
holds; new, renamed and deleted groups.

The dialog edits a copy; OK hands the whole change to the core
(:func:`dispatcher.shop.crew_edit.with_groups`), which checks it (names, machines) and
carries the authorisations through a renamed group along, or drops those through a deleted
one. A refusal is shown in the dialog and nothing changes; an accepted change is one
undoable edit (the crew tab pushes it).
"""

from __future__ import annotations

from PySide6.QtCore import Qt
from PySide6.QtWidgets import (
    QDialog,
    QDialogButtonBox,
    QGridLayout,
    QHBoxLayout,
    QLabel,
    QLineEdit,
    QListWidget,
    QListWidgetItem,
    QPushButton,
    QVBoxLayout,
)

from dispatcher.limits import MAX_NAME_CHARS
from dispatcher.shop.crew_edit import with_groups
from dispatcher.shop.model import ShopError
from dispatcher.ui import palette


class GroupsDialog(QDialog):
    """``crew`` is the accepted result (a new Crew), None until OK succeeds."""

    def __init__(self, shop, parent=None):
        super().__init__(parent)
        self.shop = shop
        self.crew = None
        self.groups = {name: list(members) for name, members in shop.crew.groups.items()}
        self.origin: dict[str, str | None] = {name: name for name in self.groups}
        used: dict[str, int] = {}
        for a in shop.crew.authorisations:
            if a.group and not a.machine:
                used[a.group] = used.get(a.group, 0) + 1
        self.used = used
        self.setWindowTitle(self.tr("Machine groups"))
        self.setAccessibleName(self.tr("Machine groups"))
        self.setAccessibleDescription(self.tr("Groups of machines an operator can be authorised for at once"))

        self.group_list = QListWidget(self)
        self.group_list.setAccessibleName(self.tr("Groups"))
        self.group_list.setAccessibleDescription(self.tr("The machine groups of this shop; choose one to see "
                                                         "and change its machines"))
        self.machine_list = QListWidget(self)
        self.machine_list.setAccessibleName(self.tr("Machines of the group"))
        self.machine_list.setAccessibleDescription(self.tr("A check for each machine in the chosen group "
                                                           "(Space toggles)"))
        self.name = QLineEdit(self)
        self.name.setMaxLength(MAX_NAME_CHARS)
        self.name.setPlaceholderText(self.tr("Group name"))
        self.name.setAccessibleName(self.tr("Group name"))
        self.name.setAccessibleDescription(self.tr("The name for a new group, or the new name of the "
                                                   "chosen group"))
        self.new_button = QPushButton(self.tr("&New group"), self)
        self.new_button.setAccessibleName(self.tr("New group"))
        self.new_button.setAccessibleDescription(self.tr("Add a group with the name typed, without machines"))
        self.rename_button = QPushButton(self.tr("&Rename"), self)
        self.rename_button.setAccessibleName(self.tr("Rename group"))
        self.rename_button.setAccessibleDescription(self.tr("Give the chosen group the name typed; its "
                                                            "authorisations keep it"))
        self.delete_button = QPushButton(self.tr("&Delete"), self)
        self.delete_button.setAccessibleName(self.tr("Delete group"))
        self.delete_button.setAccessibleDescription(self.tr("Delete the chosen group and the authorisations "
                                                            "through it"))
        self.problem = QLabel(self)
        self.problem.setWordWrap(True)
        self.problem.setAccessibleName(self.tr("Problem"))
        self.buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok
                                        | QDialogButtonBox.StandardButton.Cancel, self)
        for button in self.buttons.buttons():
            accepts = self.buttons.buttonRole(button) == QDialogButtonBox.ButtonRole.AcceptRole
            button.setAccessibleDescription(self.tr("Use these groups (Ctrl+Z takes the change back)") if accepts
                                            else self.tr("Close without changing anything"))

        lists = QGridLayout()
        groups_label = QLabel(self.tr("Groups:"), self)
        groups_label.setBuddy(self.group_list)
        machines_label = QLabel(self.tr("Machines in the group:"), self)
        machines_label.setBuddy(self.machine_list)
        lists.addWidget(groups_label, 0, 0)
        lists.addWidget(machines_label, 0, 1)
        lists.addWidget(self.group_list, 1, 0)
        lists.addWidget(self.machine_list, 1, 1)
        row = QHBoxLayout()
        row.addWidget(self.name, 1)
        row.addWidget(self.new_button)
        row.addWidget(self.rename_button)
        row.addWidget(self.delete_button)
        layout = QVBoxLayout(self)
        layout.addLayout(lists, 1)
        layout.addLayout(row)
        layout.addWidget(self.problem)
        layout.addWidget(self.buttons)

        self.group_list.currentTextChanged.connect(self._show_group)
        self.machine_list.itemChanged.connect(self._member_changed)
        self.new_button.clicked.connect(self.new_group)
        self.rename_button.clicked.connect(self.rename_group)
        self.delete_button.clicked.connect(self.delete_group)
        self.buttons.accepted.connect(self.accept)
        self.buttons.rejected.connect(self.reject)
        self._fill_groups()
        self.resize(560, 360)

    # ---- showing ----------------------------------------------------------------------------
    def _fill_groups(self, current: str | None = None) -> None:
        self.group_list.blockSignals(True)
        self.group_list.clear()
        for name in self.groups:
            self.group_list.addItem(name)
        self.group_list.blockSignals(False)
        names = list(self.groups)
        if names:
            self.group_list.setCurrentRow(names.index(current) if current in names else 0)
        self._show_group(self.current())

    def current(self) -> str | None:
        item = self.group_list.currentItem()
        return item.text() if item is not None else None

    def _show_group(self, name: str | None) -> None:
        self.machine_list.blockSignals(True)
        self.machine_list.clear()
        members = set(self.groups.get(name, [])) if name else set()
        for m in self.shop.machines:
            item = QListWidgetItem(m.name, self.machine_list)
            item.setData(Qt.ItemDataRole.UserRole, m.id)
            item.setFlags(Qt.ItemFlag.ItemIsEnabled | Qt.ItemFlag.ItemIsSelectable
                          | (Qt.ItemFlag.ItemIsUserCheckable if name else Qt.ItemFlag.NoItemFlags))
            item.setCheckState(Qt.CheckState.Checked if m.id in members else Qt.CheckState.Unchecked)
        self.machine_list.blockSignals(False)
        has = name is not None
        self.rename_button.setEnabled(has)
        self.delete_button.setEnabled(has)
        if has:
            self.name.setText(name)

    def _member_changed(self, item: QListWidgetItem) -> None:
        name = self.current()
        if name is None:
            return
        mid = item.data(Qt.ItemDataRole.UserRole)
        members = [m for m in self.groups[name] if m != mid]
        if item.checkState() == Qt.CheckState.Checked:
            members.append(mid)
        self.groups[name] = members

    def _refuse(self, text: str) -> None:
        self.problem.setText(f"{palette.MARK_FORBIDDEN} {text}")
        self.problem.setAccessibleDescription(text)

    def _try(self, groups: dict, origin: dict) -> bool:
        """Let the core check ``groups``; keep them when it accepts, else say why."""
        try:
            with_groups(self.shop, groups, self._renamed(origin))
        except ShopError as exc:
            self._refuse(self.tr("refused: {problem}; nothing changed").format(problem=exc.summary(3)))
            return False
        self.groups, self.origin = groups, origin
        self.problem.clear()
        return True

    @staticmethod
    def _renamed(origin: dict) -> dict[str, str]:
        return {old: new for new, old in origin.items() if old is not None and old != new}

    # ---- changes ----------------------------------------------------------------------------
    def new_group(self) -> None:
        name = self.name.text().strip()
        if name in self.groups:
            self._refuse(self.tr("a group named {name} exists already; nothing changed").format(name=name))
            return
        if self._try({**self.groups, name: []}, {**self.origin, name: None}):
            self._fill_groups(name)

    def rename_group(self) -> None:
        old, new = self.current(), self.name.text().strip()
        if old is None or new == old:
            return
        if new in self.groups:
            self._refuse(self.tr("a group named {name} exists already; nothing changed").format(name=new))
            return
        groups = {(new if k == old else k): v for k, v in self.groups.items()}
        origin = {(new if k == old else k): v for k, v in self.origin.items()}
        if self._try(groups, origin):
            self._fill_groups(new)

    def delete_group(self) -> None:
        name = self.current()
        if name is None:
            return
        original = self.origin.get(name)
        groups = {k: v for k, v in self.groups.items() if k != name}
        origin = {k: v for k, v in self.origin.items() if k != name}
        if self._try(groups, origin):
            self._fill_groups()
            n = self.used.get(original, 0) if original is not None else 0
            if n:
                self.problem.setText(self.tr("%n authorisation(s) through the deleted group go with it", "", n))

    def accept(self) -> None:
        try:
            self.crew = with_groups(self.shop, self.groups, self._renamed(self.origin))
        except ShopError as exc:
            self._refuse(self.tr("refused: {problem}; nothing changed").format(problem=exc.summary(3)))
            return
        super().accept()
