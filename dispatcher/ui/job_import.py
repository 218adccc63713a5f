"""Import a job list (CSV/XLSX from a planning system) into the open shop, with a column
mapping dialog.

:class:`JobImportDialog` shows the file's header row and, for each field of a job
(work order, job name, family, run hours, due, rush, wait penalty), which column holds
it: preselected by the header names the core recognises, changeable, or *not in the
file*. :class:`JobImport` is the main window's part behind *File > Import job list*: it
reads the list with the same core functions as ``dispatcher import-jobs``
(:func:`dispatcher.io.joblist.read_job_list`, :func:`~dispatcher.io.joblist.apply_job_list`)
and swaps the shop in as one undoable edit. A problem names the file, row and column and
changes nothing.
"""

from __future__ import annotations

from pathlib import Path

from PySide6.QtCore import QObject
from PySide6.QtWidgets import (
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QFileDialog,
    QFormLayout,
    QLabel,
    QVBoxLayout,
    QWidget,
)

from dispatcher.errors import BadInputError
from dispatcher.io.joblist import FIELDS, apply_job_list, guess_columns, read_job_list, read_job_list_header
from dispatcher.ui.edits import ReplaceShop


class JobImportDialog(QDialog):
    """Column mapping for one job list file. ``combos[field]`` picks the column (index 0:
    not in the file); :meth:`mapping` gives what the core reads."""

    def __init__(self, path: Path, header: list[str], n_rows: int, parent: QWidget | None = None):
        super().__init__(parent)
        self.setObjectName("jobImportDialog")
        self.setWindowTitle(self.tr("Import job list"))
        self.setAccessibleName(self.tr("Import job list"))
        self.setAccessibleDescription(self.tr("Which column of the file holds each field of a job"))
        self.setMinimumWidth(440)
        self.path, self.header = Path(path), header
        intro = QLabel(
            self.tr(
                "{file}: %n job row(s). Choose the column that holds each field; jobs whose name is "
                "already in the shop are updated, the others added, waiting.",
                "",
                n_rows,
            ).format(file=self.path.name),
            self,
        )
        intro.setWordWrap(True)
        form = QFormLayout()
        guessed = guess_columns(header)
        self.combos: dict[str, QComboBox] = {}
        label_text = {
            "work_order": self.tr("Work order"),
            "name": self.tr("Job name"),
            "family": self.tr("Setup family"),
            "run_hours": self.tr("Run hours"),
            "due": self.tr("Due"),
            "rush": self.tr("Rush (yes/no)"),
            "wait_penalty": self.tr("Wait penalty"),
        }
        for field in FIELDS:
            combo = QComboBox(self)
            combo.setObjectName(f"column_{field}")
            combo.addItem(self.tr("(not in the file)"))
            for k, h in enumerate(header):
                combo.addItem(h or self.tr("column {n}").format(n=k + 1))
            combo.setCurrentIndex(guessed[field] + 1 if field in guessed else 0)
            combo.setAccessibleName(label_text[field])
            combo.setAccessibleDescription(
                self.tr("The column of the file holding {field}").format(field=label_text[field])
            )
            label = QLabel(label_text[field] + ":", self)
            label.setBuddy(combo)
            form.addRow(label, combo)
            self.combos[field] = combo
        self.buttons = QDialogButtonBox(
            QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel, self
        )
        self.buttons.button(QDialogButtonBox.StandardButton.Ok).setText(self.tr("&Import"))
        self.buttons.accepted.connect(self.accept)
        self.buttons.rejected.connect(self.reject)
        layout = QVBoxLayout(self)
        layout.addWidget(intro)
        layout.addLayout(form)
        layout.addWidget(self.buttons)

    def choose(self, field: str, header: str | None) -> None:
        """Pick the column named ``header`` for ``field`` (None: not in the file)."""
        combo = self.combos[field]
        combo.setCurrentIndex(0 if header is None else self.header.index(header) + 1)

    def mapping(self) -> tuple[dict[str, str], list[str]]:
        """``(field -> column header, fields not to read)`` for
        :func:`dispatcher.io.joblist.read_job_list`."""
        columns, ignore = {}, []
        for field, combo in self.combos.items():
            k = combo.currentIndex() - 1
            if k < 0:
                ignore.append(field)
            else:
                columns[field] = self.header[k]
        return columns, ignore


class JobImport(QObject):
    """The window's part behind File > Import job list. ``dialog`` is the one shown (tests
    answer it); ``run_dialog`` is replaced by tests to accept it without a modal loop."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.doc = window.doc
        self.dialog: JobImportDialog | None = None

    def ask(self) -> None:
        path, _ = QFileDialog.getOpenFileName(
            self.window,
            self.tr("Import job list"),
            self.window.folder(),
            self.tr("Job lists (*.csv *.tsv *.txt *.xlsx)"),
        )
        if path:
            self.open(path)

    def open(self, path) -> bool:
        """Show the mapping dialog for ``path``; on OK import it. False when refused."""
        try:
            header, n_rows = read_job_list_header(path)
        except BadInputError as exc:
            self.window.show_warning(self.tr("job list not imported: {problem}").format(problem=exc))
            return False
        self.dialog = JobImportDialog(Path(path), header, n_rows, self.window)
        self.dialog.accepted.connect(lambda d=self.dialog: self.apply(d))
        self.dialog.open()
        return True

    def apply(self, dialog: JobImportDialog) -> bool:
        """Read the list with the dialog's mapping and swap the shop in (one undoable edit)."""
        columns, ignore = dialog.mapping()
        try:
            rows = read_job_list(dialog.path, columns, ignore)
            shop = apply_job_list(self.doc.shop, rows)
        except BadInputError as exc:
            self.window.show_warning(self.tr("job list not imported, nothing changed: {problem}").format(problem=exc))
            return False
        known = set(self.doc.shop.job_names())
        added = sum(1 for r in rows if r.name not in known)
        self.doc.undo_stack.push(
            ReplaceShop(self.doc, shop, self.tr("Import job list {file}").format(file=dialog.path.name))
        )
        self.window.statusBar().showMessage(
            self.tr("Job list imported: %n job(s) added", "", added)
            + "; "
            + self.tr("%n updated", "", len(rows) - added),
            8000,
        )
        return True
