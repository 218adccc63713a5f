"""How the app asks and tells the user things, replaceable so tests never block on a modal.

The window talks to a :class:`Messenger`; the default one shows Qt message boxes. Tests
pass a :class:`RecordingMessenger` that records every message and answers from a script.
"""

from __future__ import annotations

from PySide6.QtCore import QCoreApplication
from PySide6.QtWidgets import QMessageBox, QWidget

SAVE, DISCARD, CANCEL = "save", "discard", "cancel"


class Messenger:
    """Message boxes parented to ``parent``."""

    def __init__(self, parent: QWidget | None = None):
        self.parent = parent

    def error(self, title: str, text: str, detail: str = "") -> None:
        """A warning; ``detail`` (every problem of a long list) goes in the scrollable details."""
        self.error_box(title, text, detail).exec()

    def error_box(self, title: str, text: str, detail: str = "") -> QMessageBox:
        box = QMessageBox(QMessageBox.Icon.Warning, title, text, QMessageBox.StandardButton.Ok,
                          self.parent)
        if detail:
            box.setDetailedText(detail)
        return box

    def info(self, title: str, text: str) -> None:
        QMessageBox.information(self.parent, title, text)

    def ask_yes_no(self, title: str, text: str) -> bool:
        answer = QMessageBox.question(self.parent, title, text,
                                      QMessageBox.StandardButton.Yes | QMessageBox.StandardButton.No)
        return answer == QMessageBox.StandardButton.Yes

    def ask_save(self, text: str) -> str:
        """Save / discard / cancel for unsaved changes."""
        box = QMessageBox(QMessageBox.Icon.Question, QCoreApplication.translate("Messenger", "Unsaved changes"), text,
                          QMessageBox.StandardButton.Save | QMessageBox.StandardButton.Discard
                          | QMessageBox.StandardButton.Cancel, self.parent)
        box.setDefaultButton(QMessageBox.StandardButton.Save)
        answer = box.exec()
        return {QMessageBox.StandardButton.Save: SAVE,
                QMessageBox.StandardButton.Discard: DISCARD}.get(QMessageBox.StandardButton(answer), CANCEL)


class RecordingMessenger(Messenger):
    """Records messages; answers questions from ``answers`` (default: yes / discard)."""

    def __init__(self, yes: bool = True, save_answer: str = DISCARD):
        super().__init__(None)
        self.messages: list[tuple[str, str, str]] = []
        self.details: list[str] = []
        self.yes = yes
        self.save_answer = save_answer

    def error(self, title: str, text: str, detail: str = "") -> None:
        self.messages.append(("error", title, text))
        self.details.append(detail)

    def info(self, title: str, text: str) -> None:
        self.messages.append(("info", title, text))

    def ask_yes_no(self, title: str, text: str) -> bool:
        self.messages.append(("question", title, text))
        return self.yes

    def ask_save(self, text: str) -> str:
        self.messages.append(("save?", "Unsaved changes", text))
        return self.save_answer
