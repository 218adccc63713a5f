"""Settings of the app: the history file or PostgreSQL server, the default supervisor name,
the station label, the autosave interval.

Stored in QSettings (``history/path``, ``history/supervisor``, ``history/station``,
``autosave/minutes``). A
new history file is checked with the Qt-free store before it is used (a file that is not
a dispatcher history, cut short, read-only or written by a newer version is refused and
the current file kept); once accepted, the open window records into it at once and the
history panel shows its decisions. The file dialog goes through a replaceable
:class:`FileChooser`, so tests never block on a native dialog.
"""

from __future__ import annotations

import os
from pathlib import Path

from PySide6.QtCore import QCoreApplication, QObject, Signal
from PySide6.QtWidgets import (
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QFileDialog,
    QFormLayout,
    QHBoxLayout,
    QLabel,
    QLineEdit,
    QPushButton,
    QSpinBox,
    QVBoxLayout,
    QWidget,
)

from dispatcher.history import (
    HistoryError,
    HistoryStore,
    default_history_path,
    default_station,
    is_postgres_location,
    missing_driver,
    open_history,
)
from dispatcher.translation import KEY_LANGUAGE, LANGUAGE_NAMES
from dispatcher.ui.settings_keys import KEY_AUTOSAVE, KEY_HISTORY, KEY_STATION, KEY_SUPERVISOR

AUTOSAVE_DEFAULT_MIN, AUTOSAVE_MAX_MIN = 1, 60
translate = QCoreApplication.translate   # the name pyside6-lupdate collects


class FileChooser:
    """Asks the user for a history file (existing, or a new name) with a Qt file dialog."""

    def __init__(self, parent: QWidget | None = None):
        self.parent = parent

    def history_file(self, current: str) -> str | None:
        path, _ = QFileDialog.getSaveFileName(
            self.parent, translate("SettingsDialog", "History file: choose an existing one or name a new one"),
            current, translate("SettingsDialog", "Decision histories (*.sqlite);;All files (*)"),
            options=QFileDialog.Option.DontConfirmOverwrite)
        return path or None


class ScriptedChooser(FileChooser):
    """Answers from a list (for tests); records what it was asked."""

    def __init__(self, answers: list[str | None]):
        super().__init__(None)
        self.answers = list(answers)
        self.asked: list[str] = []

    def history_file(self, current: str) -> str | None:
        self.asked.append(current)
        return self.answers.pop(0) if self.answers else None


def station_label(settings) -> str:
    """The station label stored in ``settings`` ("" when unset: the host name is recorded)."""
    return str(settings.value(KEY_STATION, "") or "").strip()


def station_of(settings) -> str:
    """The station every decision recorded from the app carries: the label, else the
    store's default (``$DISPATCHER_STATION``, else the host name)."""
    return station_label(settings) or default_station()


def usable_history(path: str | os.PathLike, station: str | None = None) -> HistoryStore:
    """A store for ``path`` after checking decisions can be read from and recorded into it.

    An existing file must be a dispatcher history this version reads (header, identity,
    schema version and a quick integrity check, as the store does on first use; an older
    schema is backed up and upgraded) and must be writable. A new file is created on the
    first decision, so its folder must exist and be writable. Raises :class:`HistoryError`
    with a message naming the file; the file is never changed by a refusal. A PostgreSQL
    location (``postgresql://...``, ``service=NAME``) must reach its server and hold no
    history of a newer schema.
    """
    if is_postgres_location(path):
        store = open_history(str(path), station=station)
        store.list(limit=1)
        return store
    p = Path(path).expanduser()
    if p.is_dir():
        raise HistoryError(translate("SettingsDialog", "{path}: is a folder, not a history file").format(path=p))
    store = HistoryStore(p, station=station)
    if p.exists():
        if store.read_only():
            raise HistoryError(translate("SettingsDialog",
                                         "{path}: the file is read-only, so no decision could be recorded "
                                         "in it; it was left as it is. Make it writable or choose "
                                         "another file").format(path=p))
        store.list(limit=1)
    else:
        folder = p.parent
        if not folder.is_dir():
            raise HistoryError(translate("SettingsDialog", "{path}: the folder {folder} does not exist").format(
                path=p, folder=folder))
        if not os.access(folder, os.W_OK):
            raise HistoryError(translate("SettingsDialog", "{path}: the folder {folder} is not writable, so "
                                         "the history cannot be created there").format(path=p, folder=folder))
    return store


def _same_place(a: str | os.PathLike, b: str | os.PathLike) -> bool:
    """Whether two history locations (files or PostgreSQL locations) are the same."""
    def key(x):
        return str(x).strip() if isinstance(x, str) else str(Path(x).absolute())
    return key(a) == key(b)


def autosave_minutes(settings) -> int:
    """The autosave interval stored in ``settings`` (minutes, within 1..60)."""
    try:
        value = int(settings.value(KEY_AUTOSAVE, AUTOSAVE_DEFAULT_MIN))
    except (TypeError, ValueError):
        value = AUTOSAVE_DEFAULT_MIN
    return min(max(value, 1), AUTOSAVE_MAX_MIN)


class SettingsDialog(QDialog):
    """Non-blocking (``open()``); OK asks the controller to apply, and stays open if it refuses."""

    def __init__(self, window, controller: SettingsController):
        super().__init__(window)
        self.setObjectName("settingsDialog")
        self.controller = controller
        self.setWindowTitle(self.tr("Settings"))
        layout = QVBoxLayout(self)
        form = QFormLayout()

        self.history_path = QLineEdit(str(window.history.path))
        self.history_path.setObjectName("historyPathEdit")
        self.history_path.setToolTip(self.tr("The file every confirmed decision is recorded in"))
        self.history_path.setAccessibleName(self.tr("History file"))
        self.history_path.setAccessibleDescription(self.history_path.toolTip())
        self.history_path.setMinimumWidth(480)
        self.history_path.setCursorPosition(0)
        self.choose_button = QPushButton(self.tr("&Choose\u2026"))
        self.choose_button.setToolTip(self.tr("Pick an existing history file, or name a new one"))
        self.choose_button.setAccessibleName(self.tr("Choose history file"))
        self.choose_button.setAccessibleDescription(self.choose_button.toolTip())
        self.default_button = QPushButton(self.tr("Use &default"))
        self.default_button.setToolTip(self.tr("The per-user file: {path}").format(path=default_history_path()))
        self.default_button.setAccessibleName(self.tr("Use the default history file"))
        self.default_button.setAccessibleDescription(self.default_button.toolTip())
        row = QHBoxLayout()
        row.addWidget(self.history_path, 1)
        row.addWidget(self.choose_button)
        row.addWidget(self.default_button)
        label = QLabel(self.tr("&History file:"))
        label.setBuddy(self.history_path)
        form.addRow(label, row)
        hint = QLabel(self.tr("Confirmed decisions are recorded in this file. Another file takes "
                              "effect at once: the history panel then lists its decisions. A new "
                              "name starts an empty history; nothing is copied or deleted."))
        hint.setWordWrap(True)
        hint.setObjectName("historyHint")
        hint.setAccessibleName(self.tr("About the history file"))
        hint.setAccessibleDescription(hint.text())
        form.addRow("", hint)
        self.server_hint = QLabel(self.tr(
            "Several stations share one history on a PostgreSQL server: enter "
            "postgresql://host/database or service=NAME instead of a file (the password "
            "comes from the password or service file, never from here)."))
        self.server_hint.setWordWrap(True)
        self.server_hint.setObjectName("historyServerHint")
        self.server_hint.setAccessibleName(self.tr("About a shared history"))
        self.server_hint.setAccessibleDescription(self.server_hint.text())
        form.addRow("", self.server_hint)
        self.driver_note = QLabel()
        self.driver_note.setWordWrap(True)
        self.driver_note.setObjectName("historyDriverNote")
        self.driver_note.setAccessibleName(self.tr("PostgreSQL driver"))
        self.driver_note.setAccessibleDescription(self.tr(
            "Says when the chosen PostgreSQL history cannot be used because its driver is "
            "not installed"))
        self.driver_note.setVisible(False)
        form.addRow("", self.driver_note)
        self.history_path.textChanged.connect(self._check_driver)

        self.supervisor = QLineEdit(str(window.settings.value(KEY_SUPERVISOR, "")))
        self.supervisor.setObjectName("supervisorEdit")
        self.supervisor.setPlaceholderText(self.tr("for example: A. Supervisor"))
        self.supervisor.setToolTip(self.tr("Filled in when you confirm a decision (you can change it there)"))
        self.supervisor.setAccessibleName(self.tr("Default supervisor"))
        self.supervisor.setAccessibleDescription(self.supervisor.toolTip())
        form.addRow(self.tr("Default &supervisor:"), self.supervisor)

        self.station = QLineEdit(station_label(window.settings))
        self.station.setObjectName("stationEdit")
        host = default_station()
        self.station.setPlaceholderText(self.tr("empty: {host}").format(host=host))
        self.station.setToolTip(self.tr(
            "Recorded with every decision made here, so other stations see where it was "
            "decided; empty records {host}").format(host=host))
        self.station.setAccessibleName(self.tr("Station label"))
        self.station.setAccessibleDescription(self.tr(
            "The name of this station recorded with every decision; empty records the "
            "host name"))
        station_row = QLabel(self.tr("Station &label:"))
        station_row.setBuddy(self.station)
        form.addRow(station_row, self.station)

        self.autosave = QSpinBox()
        self.autosave.setObjectName("autosaveSpin")
        self.autosave.setRange(1, AUTOSAVE_MAX_MIN)
        self.autosave.setSuffix(self.tr(" min"))
        self.autosave.setValue(autosave_minutes(window.settings))
        self.autosave.setToolTip(self.tr("How often unsaved changes are copied to the recovery folder"))
        self.autosave.setAccessibleName(self.tr("Autosave interval"))
        self.autosave.setAccessibleDescription(self.autosave.toolTip())
        form.addRow(self.tr("&Autosave every:"), self.autosave)

        self.language = QComboBox()
        self.language.setObjectName("languageCombo")
        self.language.addItem(self.tr("System language"), "")
        for code, name in LANGUAGE_NAMES.items():
            self.language.addItem(name, code)
        chosen = str(window.settings.value(KEY_LANGUAGE, "") or "")
        self.language.setCurrentIndex(max(0, self.language.findData(chosen)))
        self.language.setToolTip(self.tr("The interface and printed sheet language; applies at the "
                                         "next start"))
        self.language.setAccessibleName(self.tr("Language"))
        self.language.setAccessibleDescription(self.language.toolTip())
        form.addRow(self.tr("&Language:"), self.language)
        layout.addLayout(form)

        self.buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Ok
                                        | QDialogButtonBox.StandardButton.Cancel)
        ok = self.buttons.button(QDialogButtonBox.StandardButton.Ok)
        ok.setAccessibleName(self.tr("Apply settings"))
        ok.setAccessibleDescription(self.tr("Use these settings; a refused history file keeps the dialog open"))
        cancel = self.buttons.button(QDialogButtonBox.StandardButton.Cancel)
        cancel.setAccessibleName(self.tr("Cancel"))
        cancel.setAccessibleDescription(self.tr("Close without changing anything"))
        self.buttons.accepted.connect(self.apply)
        self.buttons.rejected.connect(self.reject)
        layout.addWidget(self.buttons)
        self.choose_button.clicked.connect(self.choose)
        self.default_button.clicked.connect(
            lambda: self.history_path.setText(str(default_history_path())))
        self.resize(max(self.sizeHint().width(), 640), self.sizeHint().height())

    def _check_driver(self, text: str) -> None:
        problem = missing_driver(text.strip())
        self.driver_note.setText(self.tr("Cannot be used here: {problem}").format(problem=problem)
                                 if problem else "")
        self.driver_note.setVisible(bool(problem))

    def choose(self) -> None:
        path = self.controller.chooser.history_file(self.history_path.text())
        if path:
            self.history_path.setText(path)
            self.history_path.setCursorPosition(0)

    def apply(self) -> bool:
        """What OK does: apply through the controller; close only if it accepted."""
        ok = self.controller.apply(self.history_path.text(), self.supervisor.text(),
                                   self.autosave.value(), language=self.language.currentData(),
                                   station=self.station.text())
        if ok:
            self.accept()
        return ok


class SettingsController(QObject):
    """Edit ▸ Settings: opens :class:`SettingsDialog` and applies what it asks for.

    ``chooser`` asks for a history file (tests put a :class:`ScriptedChooser` there);
    ``dialog`` is the last dialog opened. ``history_changed(store)`` when another history
    file was accepted (the window records into it from then on).
    """

    history_changed = Signal(object)

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.chooser: FileChooser = FileChooser(window)
        self.dialog: SettingsDialog | None = None
        window.files.set_autosave_minutes(autosave_minutes(window.settings))

    def open(self) -> SettingsDialog:
        dialog = SettingsDialog(self.window, self)
        self.dialog = dialog
        dialog.open()
        return dialog

    def apply(self, history_path: str, supervisor: str, minutes: int,
              language: str | None = None, station: str | None = None) -> bool:
        """Use these settings; False (with a message, nothing changed) when refused.
        ``station`` None keeps the stored label; "" records the host name."""
        window = self.window
        text = history_path.strip()
        if not text:
            window.messenger.error(self.tr("Settings not changed"), self.tr("Choose a history file."))
            return False
        label = station_label(window.settings) if station is None else station.strip()
        recorded_as = label or default_station()
        new = text if is_postgres_location(text) else Path(text).expanduser()
        if not _same_place(new, window.history.path):
            try:
                store = usable_history(new, station=recorded_as)
            except HistoryError as exc:  # its message says what to do, not which option
                window.messenger.error(
                    self.tr("History file not changed"),
                    self.tr("{error}\n\nDecisions are still recorded in {path}.").format(
                        error=exc, path=window.history.path))
                return False
            window.settings.setValue(KEY_HISTORY, str(new))
            self.history_changed.emit(store)
            window.statusBar().showMessage(self.tr("Decisions are now recorded in {path}").format(path=new), 8000)
        window.settings.setValue(KEY_SUPERVISOR, supervisor.strip())
        window.settings.setValue(KEY_STATION, label)
        window.history.station = recorded_as
        minutes = min(max(int(minutes), 1), AUTOSAVE_MAX_MIN)
        window.settings.setValue(KEY_AUTOSAVE, minutes)
        window.files.set_autosave_minutes(minutes)
        if language is not None and language != str(window.settings.value(KEY_LANGUAGE, "") or ""):
            # the language is installed at start (ui.app.install_language): say so
            window.settings.setValue(KEY_LANGUAGE, language)
            window.statusBar().showMessage(self.tr("The new language applies at the next start"), 8000)
        return True
