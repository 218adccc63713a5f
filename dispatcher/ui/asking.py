"""Input dialogs for one value (a name, a number, a choice) whose controls carry accessible
names and descriptions, unlike the ones ``QInputDialog``'s static functions build.

Each function returns ``(value, ok)`` as ``QInputDialog.getText`` and its siblings do, and
runs the dialog modally, so tests answer it as any other modal dialog.
"""

from __future__ import annotations

from PySide6.QtCore import QCoreApplication
from PySide6.QtWidgets import (
    QAbstractSpinBox,
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QInputDialog,
    QLineEdit,
    QPlainTextEdit,
    QWidget,
)

__all__ = ["get_double", "get_int", "get_item", "get_long_text", "get_text"]


def _dialog(parent: QWidget | None, title: str, label: str) -> QInputDialog:
    dialog = QInputDialog(parent)
    dialog.setWindowTitle(title)
    dialog.setLabelText(label)
    return dialog


def _describe(dialog: QInputDialog, label: str, description: str) -> None:
    """Name the value's field by the dialog's question and describe it; describe OK and Cancel."""
    dialog.minimumSizeHint()  # QInputDialog builds its layout (the buttons) on first need
    for field in dialog.findChildren(QWidget):
        if isinstance(field, (QLineEdit, QPlainTextEdit, QAbstractSpinBox, QComboBox)):
            if isinstance(field.parentWidget(), (QAbstractSpinBox, QComboBox)):
                continue  # the line edit inside a spin box or combo box
            field.setAccessibleName(label.rstrip(":"))
            field.setAccessibleDescription(description)
    for buttons in dialog.findChildren(QDialogButtonBox):
        for button in buttons.buttons():
            accepts = buttons.buttonRole(button) == QDialogButtonBox.ButtonRole.AcceptRole
            button.setAccessibleDescription(
                QCoreApplication.translate("Asking", "Use this value") if accepts else
                QCoreApplication.translate("Asking", "Close without changing anything"))


def _run(dialog: QInputDialog, label: str, description: str) -> bool:
    _describe(dialog, label, description)
    try:
        return dialog.exec() == QDialog.DialogCode.Accepted
    finally:
        dialog.deleteLater()


def get_text(parent, title: str, label: str, description: str, text: str = "") -> tuple[str, bool]:
    dialog = _dialog(parent, title, label)
    dialog.setInputMode(QInputDialog.InputMode.TextInput)
    dialog.setTextValue(text)
    ok = _run(dialog, label, description)
    return dialog.textValue(), ok


def get_long_text(parent, title: str, label: str, description: str, text: str = "") -> tuple[str, bool]:
    """Free text over several lines (notes): Return starts a new line, Tab reaches OK."""
    dialog = _dialog(parent, title, label)
    dialog.setInputMode(QInputDialog.InputMode.TextInput)
    dialog.setOption(QInputDialog.InputDialogOption.UsePlainTextEditForTextInput, True)
    dialog.setTextValue(text)
    dialog.minimumSizeHint()  # builds the text field
    for field in dialog.findChildren(QPlainTextEdit):
        field.setTabChangesFocus(True)
    ok = _run(dialog, label, description)
    return dialog.textValue(), ok


def get_int(parent, title: str, label: str, description: str, value: int, minimum: int,
            maximum: int) -> tuple[int, bool]:
    dialog = _dialog(parent, title, label)
    dialog.setInputMode(QInputDialog.InputMode.IntInput)
    dialog.setIntRange(minimum, maximum)
    dialog.setIntValue(value)
    ok = _run(dialog, label, description)
    return dialog.intValue(), ok


def get_double(parent, title: str, label: str, description: str, value: float, minimum: float,
               maximum: float, decimals: int) -> tuple[float, bool]:
    dialog = _dialog(parent, title, label)
    dialog.setInputMode(QInputDialog.InputMode.DoubleInput)
    dialog.setDoubleDecimals(decimals)
    dialog.setDoubleRange(minimum, maximum)
    dialog.setDoubleValue(value)
    ok = _run(dialog, label, description)
    return dialog.doubleValue(), ok


def get_item(parent, title: str, label: str, description: str, items: list[str], current: int = 0,
             editable: bool = True) -> tuple[str, bool]:
    dialog = _dialog(parent, title, label)
    dialog.setComboBoxItems(items)
    dialog.setComboBoxEditable(editable)
    if items:
        dialog.setTextValue(items[current])
    ok = _run(dialog, label, description)
    return dialog.textValue(), ok
