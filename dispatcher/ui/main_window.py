"""The main window: the dispatch grid, the live plan, its menus and keys.

Every number shown comes from the Qt-free core (``dispatcher.shop``, ``dispatcher.engine``,
``dispatcher.history``). The window owns the document, the grid and the plan (re-solved in
the background after each edit) and creates its parts in its constructor, each with its
own widgets, signals and worker:

* ``edits`` (:class:`~dispatcher.ui.grid_edits.GridEdits`): copy, paste, pins, jobs, machines;
* ``decisions`` (:class:`~dispatcher.ui.decision_flow.DecisionFlow`): breakdowns, repairs,
  rush and pulled jobs, putting a plan in force;
* ``whatif_tab``, ``alternatives_tab`` (:mod:`~dispatcher.ui.whatif_tab`,
  :mod:`~dispatcher.ui.alternatives_tab`): the two tabs beside the grid;
* ``changeover_tab`` (:class:`~dispatcher.ui.changeover_tab.ChangeoverTab`): the changeover
  tables, families x families;
* ``timeline_tab`` (:class:`~dispatcher.ui.timeline_view.TimelineTab`): the whole-shift
  plan drawn per machine;
* ``history_dock`` (:class:`~dispatcher.ui.history_dock.HistoryDock`);
* ``printing`` (:class:`~dispatcher.ui.printing.SheetPrinting`);
* ``settings_ctl`` (:class:`~dispatcher.ui.settings_dialog.SettingsController`).

The window builds every action and menu in one place and connects them to the parts.
"""

from __future__ import annotations

import os
from pathlib import Path

from PySide6.QtCore import QSettings, Qt, Signal
from PySide6.QtGui import QAction, QActionGroup, QCloseEvent, QKeySequence
from PySide6.QtWidgets import QDockWidget, QFileDialog, QLabel, QMainWindow, QMenu, QTabWidget, QWidget

from dispatcher.history import HistoryStore, open_history
from dispatcher.io.shopfile import SHOP_SUFFIX
from dispatcher.shop import MUST, MUST_NOT, Plan, Shop
from dispatcher.shop.fill_shift import ShiftFill
from dispatcher.ui import palette
from dispatcher.ui.alternatives_tab import AlternativesTab
from dispatcher.ui.changeover_tab import ChangeoverTab
from dispatcher.ui.column_sizing import ColumnSizer
from dispatcher.ui.crew_tab import CrewTab
from dispatcher.ui.decision_flow import DecisionFlow
from dispatcher.ui.document import ShopDocument
from dispatcher.ui.files import FileController
from dispatcher.ui.grid_model import FIRST_MACHINE_COL, GridModel
from dispatcher.ui.grid_edits import GridEdits
from dispatcher.ui.grid_view import GridView
from dispatcher.ui.history_dock import HistoryDock
from dispatcher.ui.job_import import JobImport
from dispatcher.ui.messages import Messenger
from dispatcher.ui.plan_panel import PlanPanel
from dispatcher.ui.printing import SheetPrinting
from dispatcher.ui.settings_dialog import SettingsController, station_of
from dispatcher.shop.planning import MODE_ROUND, MODE_SHIFT
from dispatcher.shop.proposal import EVENT_DOWN, EVENT_UP
from dispatcher.ui.solving import SolveOutcome, solve_outcome, solve_round_in_process
from dispatcher.ui.timeline_view import TimelineTab
from dispatcher.ui.whatif_tab import WhatIfTab
from dispatcher.ui.worker import BackgroundRunner
from dispatcher.ui.settings_keys import KEY_HISTORY

APP_TITLE = "Dispatcher"
GRID_PATTERNS = "*.csv *.tsv *.txt *.xlsx"


class MainWindow(QMainWindow):
    """The app window. ``plan_shown(plan)`` after each fresh plan; ``warning(str)`` for
    refused input (also shown in the status bar)."""

    plan_shown = Signal(object)
    warning = Signal(str)
    decision_recorded = Signal(int)

    def __init__(self, shop: Shop | None = None, *, settings: QSettings | None = None,
                 messenger: Messenger | None = None, history_path: str | os.PathLike | None = None,
                 parent: QWidget | None = None):
        super().__init__(parent)
        self.setObjectName("mainWindow")
        self.settings = settings or QSettings()
        self._messenger = messenger or Messenger(self)
        self.doc = ShopDocument(shop, self)
        self.files = FileController(self.doc, self._messenger, self.settings, self)
        self.history = open_history(history_path or self.settings.value(KEY_HISTORY) or None,
                                    station=station_of(self.settings))
        self.objective = "total"
        self.mode = MODE_ROUND
        self.plan: Plan | ShiftFill | None = None
        self.last_problem = ""

        self.model = GridModel(self.doc, self)
        self.view = GridView(self)
        self.view.setModel(self.model)
        self.columns = ColumnSizer(self.view, self.doc.n_machines, self)
        self.view.setAccessibleName(self.tr("Dispatch grid"))
        self.view.setAccessibleDescription(self.tr(
            "Jobs as rows, machines as columns: each cell is the value of a job on a machine; "
            "Shift+F10 opens the actions of the current cell"))
        self.plan_panel = PlanPanel(self)
        self.runner = BackgroundRunner(self)

        self.tabs = QTabWidget(self)
        self.tabs.setObjectName("centralTabs")
        self.tabs.addTab(self.view, self.tr("&Grid"))
        self.setCentralWidget(self.tabs)
        plan_dock = QDockWidget(self.tr("Plan"), self)
        plan_dock.setObjectName("planDock")
        plan_dock.setWidget(self.plan_panel)
        self.addDockWidget(Qt.DockWidgetArea.RightDockWidgetArea, plan_dock)
        self.plan_dock = plan_dock
        self._legend = QLabel(
            self.tr("{planned} planned   {running} running   {pinned} pinned   {forbidden} forbidden   "
                    "{cannot} cannot run   {down} machine down   {rush} rush").format(
                planned=palette.MARK_PLANNED, running="\u25b6", pinned=palette.MARK_PINNED,
                forbidden=palette.MARK_FORBIDDEN, cannot=palette.MARK_CANNOT, down=palette.MARK_DOWN,
                rush=palette.MARK_RUSH)
            + "   " + self.tr("{typed} typed over the changeover table   {mounted} mounted").format(
                typed=palette.MARK_TYPED, mounted=palette.MARK_MOUNTED))
        self._legend.setToolTip(self.tr("What the marks in the grid mean (colours repeat them)"))
        self._legend.setAccessibleName(self.tr("Legend of the grid's marks"))
        self._legend.setAccessibleDescription(self.tr("What the marks in the grid mean (colours repeat them)"))
        self.statusBar().addPermanentWidget(self._legend)

        # The parts of the window.
        self.edits = GridEdits(self)
        self.decisions = DecisionFlow(self)
        self.whatif_tab = WhatIfTab(self)
        self.tabs.addTab(self.whatif_tab.view, self.tr("&What-if map"))
        self.alternatives_tab = AlternativesTab(self)
        self.tabs.addTab(self.alternatives_tab.view, self.tr("&Alternatives"))
        self.crew_tab = CrewTab(self)
        self.changeover_tab = ChangeoverTab(self)
        self.tabs.addTab(self.crew_tab.view, self.tr("C&rew"))
        self.tabs.addTab(self.changeover_tab.view, self.tr("C&hangeovers"))
        self.job_import = JobImport(self)
        self.timeline_tab = TimelineTab(self)
        self.tabs.addTab(self.timeline_tab.view, self.tr("Time&line"))
        bar = self.tabs.tabBar()
        bar.setAccessibleName(self.tr("Views"))
        bar.setAccessibleDescription(self.tr("Switch between the grid, the what-if map, the alternatives, "
                                             "the crew, the changeover tables and the timeline "
                                             "(Alt and the underlined letter)"))
        for page, tip in ((self.view, self.tr("Jobs as rows, machines as columns: type setup values, pin or "
                                              "forbid pairs")),
                          (self.whatif_tab.view, self.tr("How much worse the plan gets if a job is forced onto "
                                                         "a machine")),
                          (self.alternatives_tab.view, self.tr("The best few plans, best first, and what each "
                                                               "changes")),
                          (self.crew_tab.view, self.tr("Operators: present, how many machines each minds, what "
                                                       "they are authorised to run")),
                          (self.changeover_tab.view, self.tr("Changeover tables: the setup between job families "
                                                             "on each machine")),
                          (self.timeline_tab.view, self.tr("Each machine's jobs over the shift in run order, "
                                                           "with their changeovers"))):
            self.tabs.setTabToolTip(self.tabs.indexOf(page), tip)
        self.tabs.setAccessibleName(self.tr("Views of the shop"))
        self.tabs.setAccessibleDescription(self.tr(
            "The grid, the what-if map, the alternatives, the crew, the changeover tables and the timeline"))
        self.plan_dock.setAccessibleName(self.tr("Plan"))
        self.plan_dock.setAccessibleDescription(self.tr("The plan for the grid as it is now"))
        self.history_dock = HistoryDock(self)
        self.addDockWidget(Qt.DockWidgetArea.BottomDockWidgetArea, self.history_dock)
        self.history_dock.hide()
        self.printing = SheetPrinting(self)
        self.settings_ctl = SettingsController(self)

        self._build_actions()
        self._build_menus()
        self._connect()
        self._update_title()
        self.resize(1280, 760)
        self.view.setFocus()
        self.request_solve()

    def _paste(self) -> None:
        """Edit > Paste: into the crew table on the Crew tab, else into the grid."""
        if self.crew_tab.is_current():
            self.crew_tab.paste()
        elif self.changeover_tab.is_current():
            self.changeover_tab.paste()
        else:
            self.edits.paste()

    def _cannot_run(self) -> None:
        """Delete: on the Grid tab the selected cells cannot run; on the Changeovers tab the
        selected changes are not allowed; on the Crew tab the selected authorisations are
        withdrawn; elsewhere nothing (the grid is not in sight)."""
        if self.changeover_tab.is_current():
            self.changeover_tab.clear()
        elif self.crew_tab.is_current():
            self.crew_tab.clear()
        elif self.tabs.currentWidget() is self.view:
            self.edits.cannot_run()

    @property
    def messenger(self) -> Messenger:
        """Where messages and questions go (tests and the command line replace it)."""
        return self._messenger

    @messenger.setter
    def messenger(self, messenger: Messenger) -> None:
        self._messenger = messenger
        self.files.messenger = messenger

    # ---- construction ---------------------------------------------------------------------
    def _action(self, text: str, slot, shortcut=None, tip: str = "", checkable: bool = False) -> QAction:
        a = QAction(text, self)
        if shortcut is not None:
            a.setShortcut(QKeySequence(shortcut))
        if tip:
            a.setStatusTip(tip)
            a.setToolTip(tip)
        a.setCheckable(checkable)
        a.triggered.connect(slot)
        self.addAction(a)
        return a

    def _build_actions(self) -> None:
        S = QKeySequence.StandardKey
        self.act_new = self._action(self.tr("&New"), self.on_new, S.New, self.tr("Start an empty shop"))
        self.act_open = self._action(self.tr("&Open\u2026"), self.on_open, S.Open,
                                     self.tr("Open a shop document or grid file"))
        self.act_save = self._action(self.tr("&Save"), self.on_save, S.Save, self.tr("Save the shop document"))
        self.act_save_as = self._action(self.tr("Save &As\u2026"), self.on_save_as, S.SaveAs,
                                        self.tr("Save under a new name"))
        self.act_import = self._action(self.tr("&Import grid (CSV/XLSX)\u2026"), self.on_import, None,
                                       self.tr("Start a shop from a grid file"))
        self.act_export = self._action(self.tr("&Export grid (CSV/XLSX)\u2026"), self.on_export, None,
                                       self.tr("Write the grid to a CSV or XLSX file"))
        self.act_import_into = self._action(self.tr("Import grid in&to this shop\u2026"), self.on_import_into, None,
                                            self.tr("Merge a grid file into this shop by job and machine names"))
        self.act_import_jobs = self._action(self.tr("Import &job list (CSV/XLSX)\u2026"), self.job_import.ask, None,
                                            self.tr("Add or update jobs from a planning system's job list, "
                                                    "choosing which column holds each field"))
        self.act_export_plan = self._action(self.tr("Export p&lan (CSV/XLSX)\u2026"), self.on_export_plan, None,
                                            self.tr("Write the plan shown to a CSV or XLSX file"))
        self.act_quit = self._action(self.tr("&Quit"), self.close, S.Quit, self.tr("Close the app"))
        self.act_undo = self.doc.undo_stack.createUndoAction(self, self.tr("&Undo"))
        self.act_undo.setShortcut(S.Undo)
        self.act_redo = self.doc.undo_stack.createRedoAction(self, self.tr("&Redo"))
        redo_keys = QKeySequence.keyBindings(S.Redo)
        if QKeySequence("Ctrl+Y") not in redo_keys:
            redo_keys.append(QKeySequence("Ctrl+Y"))
        self.act_redo.setShortcuts(redo_keys)
        self.addAction(self.act_undo)
        self.addAction(self.act_redo)
        self.act_copy = self._action(self.tr("&Copy"), self.edits.copy, S.Copy, self.tr("Copy the selected values"))
        self.act_copy_names = self._action(self.tr("Copy with &names"), lambda: self.edits.copy(True), "Ctrl+Shift+C",
                                           self.tr("Copy the selection with job and machine names"))
        self.act_paste = self._action(self.tr("&Paste"), self._paste, S.Paste,
                                      self.tr("Paste a tab-separated block from a spreadsheet"))
        self.act_cannot = self._action(self.tr("Mar&k cannot run"), self._cannot_run, S.Delete,
                                       self.tr("The machine cannot run the job (selected cells)"))
        self.act_pin = self._action(self.tr("P&in job to this machine"), lambda: self.edits.pin(MUST), "Ctrl+Shift+M",
                                    self.tr("The job must go to this machine"))
        self.act_forbid = self._action(self.tr("&Forbid this pair"), lambda: self.edits.pin(MUST_NOT), "Ctrl+Shift+F",
                                       self.tr("The job must not go to this machine"))
        self.act_unpin = self._action(self.tr("C&lear pin"), lambda: self.edits.pin(None), "Ctrl+Shift+U",
                                      self.tr("Remove the pin or ban of this pair"))
        self.act_rush = self._action(self.tr("&Rush job arrived\u2026"), lambda: self.decisions.rush(), "Ctrl+R",
                                     self.tr("Make the current job a rush job and re-dispatch"))
        self.act_use_table = self._action(self.tr("Use changeover ta&ble"), self.edits.use_table, "Ctrl+Shift+T",
                                          self.tr("Drop the values typed in the selected cells: "
                                                  "they follow the changeover table again"))
        self.act_mounted = self._action(self.tr("Mounted &family\u2026"), lambda: self.edits.ask_mounted(), None,
                                        self.tr("Which setup family the current machine has mounted now"))
        self.act_end_family = self._action(self.tr("&End family\u2026"),
                                           lambda: self.edits.ask_mounted("end_family"), None,
                                           self.tr("Which family the current machine must end the shift in"))
        self.act_add_job = self._action(self.tr("&Add job\u2026"), self.edits.ask_add_job, "Ctrl+Shift+J",
                                        self.tr("Add a job (for example a rush order that just arrived)"))
        self.act_add_machine = self._action(self.tr("Add &machine\u2026"), self.edits.ask_add_machine, None,
                                            self.tr("Add a machine column"))
        self.act_done = self._action(self.tr("Mark job &done"), self.edits.job_done, None,
                                     self.tr("The current job is finished: it takes no part any more"))
        self.act_pull = self._action(self.tr("Job &pulled\u2026"), lambda: self.decisions.pull(), None,
                                     self.tr("The current job is cancelled or put on hold: re-dispatch "
                                             "without it and take it out of the shop"))
        self.act_penalty = self._action(self.tr("Set &wait penalty\u2026"), self.edits.ask_penalty, "Ctrl+W",
                                        self.tr("Cost of leaving the current job waiting"))
        self.act_down = self._action(self.tr("Machine &down\u2026"), lambda: self.decisions.machine_event(EVENT_DOWN),
                                     "Ctrl+D", self.tr("Mark the current machine down and re-dispatch"))
        self.act_up = self._action(self.tr("Machine back &up\u2026"), lambda: self.decisions.machine_event(EVENT_UP),
                                   "Ctrl+U", self.tr("Mark the current machine up again and re-dispatch"))
        self.act_maint = self._action(self.tr("Machine in mai&ntenance"), self.edits.toggle_maintenance, None,
                                      self.tr("The current machine takes no jobs (planned maintenance)"))
        self.act_slots = self._action(self.tr("Set &slots\u2026"), self.edits.ask_slots, None,
                                      self.tr("How many jobs the current machine takes per round"))
        self.act_confirm = self._action(self.tr("&Put plan in force\u2026"), lambda: self.decisions.confirm_plan(),
                                        "Ctrl+Return", self.tr("Record the plan shown as the decision in force"))
        self.act_resolve = self._action(self.tr("Re-s&olve now"), self.request_solve, "F5", self.tr("Solve again"))
        self.act_cancel = self._action(self.tr("&Cancel solve"), self.cancel_solve, "Esc",
                                       self.tr("Stop waiting for a long solve"))
        self.objective_group = QActionGroup(self)
        self.act_objectives = {}
        for key, label, keyseq in (("total", self.tr("Least &total"), "Ctrl+1"),
                                   ("maximize", self.tr("Most &value"), "Ctrl+2"),
                                   ("bottleneck", self.tr("Smallest &largest value"), "Ctrl+3")):
            a = self._action(label, lambda _=False, k=key: self.set_objective(k), keyseq,
                             self.tr("Objective: {objective}").format(objective=label.replace("&", "")),
                             checkable=True)
            self.objective_group.addAction(a)
            self.act_objectives[key] = a
        self.act_objectives["total"].setChecked(True)
        self.mode_group = QActionGroup(self)
        self.act_modes = {}
        mode_tips = {MODE_ROUND: self.tr("One round: one job per free machine slot"),
                     MODE_SHIFT: self.tr("Whole shift: several jobs per machine within its hours")}
        for key, label, keyseq in ((MODE_ROUND, self.tr("One &round (one job per machine)"), "Ctrl+4"),
                                   (MODE_SHIFT, self.tr("Whole &shift (several jobs per machine)"), "Ctrl+5")):
            a = self._action(label, lambda _=False, k=key: self.set_mode(k), keyseq, mode_tips[key],
                             checkable=True)
            self.mode_group.addAction(a)
            self.act_modes[key] = a
        self.act_modes[MODE_ROUND].setChecked(True)
        self.act_preview = self._action(self.tr("Print pre&view\u2026"), self.printing.preview, None,
                                        self.tr("See the dispatch sheet as it will print"))
        self.act_print = self._action(self.tr("&Print sheet\u2026"), self.printing.print_now, S.Print,
                                      self.tr("Print the dispatch sheet"))
        self.act_export_pdf = self._action(self.tr("Export sheet as P&DF\u2026"), self.printing.ask_export_pdf,
                                           None, self.tr("Write the dispatch sheet to a PDF"))
        self.act_settings = self._action(self.tr("Se&ttings\u2026"), self.settings_ctl.open, None,
                                         self.tr("History file, default supervisor name, autosave interval"))
        # The platform's Preferences keys; Ctrl+, where the platform defines none.
        self.act_settings.setShortcuts(QKeySequence.keyBindings(S.Preferences)
                                       or [QKeySequence("Ctrl+,")])
        self.act_history = self.history_dock.toggleViewAction()
        self.addAction(self.act_history)

    def _build_menus(self) -> None:
        bar = self.menuBar()
        m = bar.addMenu(self.tr("&File"))
        for a in (self.act_new, self.act_open, self.act_save, self.act_save_as):
            m.addAction(a)
        self.recent_menu = m.addMenu(self.tr("Open &recent"))
        m.addSeparator()
        m.addAction(self.act_import)
        m.addAction(self.act_import_into)
        m.addAction(self.act_import_jobs)
        m.addAction(self.act_export)
        m.addAction(self.act_export_plan)
        m.addSeparator()
        for a in (self.act_preview, self.act_print, self.act_export_pdf):
            m.addAction(a)
        m.addSeparator()
        m.addAction(self.act_quit)
        self.file_menu = m
        m = bar.addMenu(self.tr("&Edit"))
        self.edit_menu = m
        for a in (self.act_undo, self.act_redo, None, self.act_copy, self.act_copy_names,
                  self.act_paste, None, self.act_cannot, self.act_use_table, self.act_pin, self.act_forbid,
                  self.act_unpin, None, self.act_settings):
            m.addSeparator() if a is None else m.addAction(a)
        m = bar.addMenu(self.tr("&Job"))
        m.addAction(self.act_add_job)
        m.addAction(self.act_rush)
        m.addAction(self.act_pull)
        m.addAction(self.act_penalty)
        m.addAction(self.act_done)
        m = bar.addMenu(self.tr("&Machine"))
        m.addAction(self.act_add_machine)
        for a in (self.act_down, self.act_up, self.act_maint, self.act_slots, self.act_mounted,
                  self.act_end_family):
            m.addAction(a)
        m = bar.addMenu(self.tr("&Plan"))
        for a in self.act_objectives.values():
            m.addAction(a)
        m.addSeparator()
        for a in self.act_modes.values():
            m.addAction(a)
        m.addSeparator()
        for a in (self.act_resolve, self.act_cancel, self.act_confirm):
            m.addAction(a)
        self.plan_menu = m
        self.view_menu = bar.addMenu(self.tr("&View"))
        self.view_menu.addAction(self.plan_dock.toggleViewAction())
        self.view_menu.addAction(self.act_history)
        self._fill_recent()

    def _connect(self) -> None:
        self.doc.edited.connect(self.request_solve)
        self.doc.dirty_changed.connect(self._update_title)
        self.doc.path_changed.connect(self._update_title)
        self.doc.reset.connect(self._on_reset)
        self.model.warning.connect(self.show_warning)
        self.files.status.connect(lambda t: self.statusBar().showMessage(t, 8000))
        self.files.problem.connect(self._remember_problem)
        self.files.recent_changed.connect(self._fill_recent)
        self.runner.started.connect(lambda _: self.plan_panel.show_busy(True))
        self.runner.slow.connect(lambda _: self.plan_panel.show_busy(True, slow=True))
        self.runner.finished.connect(self._on_solved)
        self.runner.failed.connect(self._on_solve_failed)
        self.runner.cancelled.connect(self.plan_panel.show_cancelled)
        self.plan_panel.objective_changed.connect(self.set_objective)
        self.plan_panel.mode_changed.connect(self.set_mode)
        self.runner.progress.connect(self.plan_panel.show_progress_text)
        self.plan_panel.cancel_requested.connect(self.cancel_solve)
        self.view.cell_menu_requested.connect(self._cell_menu)
        self.view.machine_menu_requested.connect(self._machine_menu)
        self.view.job_menu_requested.connect(self._job_menu)
        self.decisions.recorded.connect(self.decision_recorded)
        self.decision_recorded.connect(lambda _: self.history_dock.refresh())
        self.settings_ctl.history_changed.connect(self._use_history)
        self.tabs.currentChanged.connect(lambda _: self.whatif_tab.refresh())
        self.plan_shown.connect(lambda _: self.whatif_tab.refresh())

    # ---- title, status ----------------------------------------------------------------------
    def _update_title(self, *_args) -> None:
        name = self.doc.path.name if self.doc.path else (self.doc.shop.name or self.tr("Untitled"))
        self.setWindowTitle(f"{name}[*] - {APP_TITLE}")
        self.setWindowModified(self.doc.dirty)

    def _remember_problem(self, text: str) -> None:
        self.last_problem = text

    def show_warning(self, text: str) -> None:
        self.statusBar().showMessage(f"{palette.MARK_FORBIDDEN} {text}", 10000)
        self.warning.emit(text)

    def _fill_recent(self) -> None:
        self.recent_menu.clear()
        recent = self.files.recent()
        for n, path in enumerate(recent, 1):
            a = self.recent_menu.addAction(f"&{n} {path}")
            a.triggered.connect(lambda _=False, p=path: self.open_path(p))
        self.recent_menu.setEnabled(bool(recent))

    def _use_history(self, store: HistoryStore) -> None:
        """Record into ``store`` from now on (accepted in the settings)."""
        self.history = store
        self.history_dock.set_store(store)

    # ---- solving ----------------------------------------------------------------------------
    def request_solve(self) -> None:
        """Re-solve the current shop in the background; older results will be discarded.

        The shop is copied and handed over :data:`~dispatcher.ui.worker.DEFER_MS` after the
        first request of a burst of edits, so a burst is copied and solved once."""
        self.runner.submit_deferred(self._solve_job, "solving", with_progress=self.mode != MODE_ROUND)

    def _solve_job(self):
        """The computation for the shop as it is now (a copy: the user keeps editing)."""
        shop = self.doc.shop.copy()
        objective, mode = self.objective, self.mode
        if mode == MODE_ROUND:
            # In a worker process: the solve never competes with the window for Python.
            return lambda cancel: solve_round_in_process(shop, objective)
        return lambda cancel, report: solve_outcome(shop, objective, cancel, report, mode)

    def set_mode(self, mode: str) -> None:
        """One dispatch round, or the whole shift (several jobs per machine)."""
        if mode == self.mode:
            return
        self.mode = mode
        self.act_modes[mode].setChecked(True)
        self.plan_panel.set_mode(mode)
        self.request_solve()

    def set_objective(self, objective: str) -> None:
        if objective == self.objective:
            return
        self.objective = objective
        self.act_objectives[objective].setChecked(True)
        self.plan_panel.set_objective(objective)
        self.request_solve()

    def _on_solved(self, outcome: SolveOutcome) -> None:
        if outcome.plan is None:
            self.plan_panel.show_problem(outcome.problem)
            self.model.set_plan(None)
            self.plan = None
            self.plan_shown.emit(None)
            return
        self.plan = outcome.plan
        self.model.set_plan(outcome.plan)
        self.columns.size_soon()
        self.plan_panel.show_plan(outcome.plan, self.doc.shop.unit.label(), outcome.seconds,
                                  self.doc.shop.machine_names())
        if outcome.problem:
            self.plan_panel.show_note(outcome.problem)
        self.plan_shown.emit(outcome.plan)

    def runners(self) -> list[BackgroundRunner]:
        """The background runners of the window and its parts (the file being read too)."""
        return [self.runner, self.whatif_tab.runner, self.alternatives_tab.runner, self.files.loader]

    def cancel_solve(self) -> None:
        """Stop the solve running now, the what-if and ranking jobs and the reading of a
        file being opened (Esc, the plan panel's Cancel)."""
        for runner in self.runners():
            runner.cancel()

    def show_plan_in_force(self, plan: Plan | ShiftFill, what: str) -> None:
        """Show the plan just put in force (not a fresh solve of the same shop, which would
        ignore the move penalties a re-dispatch paid) until the next edit."""
        self.runner.discard()
        self._on_solved(SolveOutcome(self.objective, plan, "", False, 0.0))
        self.plan_panel.show_note(self.tr("Plan in force: {what}. Any edit re-solves from scratch.").format(what=what))

    def _on_solve_failed(self, exc: Exception) -> None:
        self.plan_panel.show_problem(self.tr("internal error while solving: {error}").format(error=exc))
        self.show_warning(self.tr("Solving failed: {error}").format(error=exc))

    def _on_reset(self) -> None:
        self.plan = None
        self.columns.start_over()

    # ---- files ------------------------------------------------------------------------------
    def file_filter(self) -> str:
        """The Open dialog's file types."""
        return self.tr("Shop documents (*{suffix});;Grid files ({grids});;All files (*)").format(
            suffix=SHOP_SUFFIX, grids=GRID_PATTERNS)

    def grid_filter(self) -> str:
        return self.tr("Grid files ({grids})").format(grids=GRID_PATTERNS)

    def on_new(self) -> None:
        self.files.new()

    def open_path(self, path: str | os.PathLike, wait: bool = False) -> bool:
        """Open a file (read in the background; ``files.loaded(bool)`` tells how it ended;
        see :meth:`~dispatcher.ui.files.FileController.open_path`)."""
        return self.files.open_path(path, wait)

    def on_open(self) -> None:
        path, _ = QFileDialog.getOpenFileName(self, self.tr("Open"), self.folder(), self.file_filter())
        if path:
            self.open_path(path)

    def on_import(self) -> None:
        path, _ = QFileDialog.getOpenFileName(self, self.tr("Import grid"), self.folder(), self.grid_filter())
        if path:
            self.open_path(path)

    def on_save(self) -> bool:
        if self.doc.path is None or self.doc.path.suffix.lower() != SHOP_SUFFIX:
            return self.on_save_as()
        return self.files.save()

    def on_save_as(self) -> bool:
        path, _ = QFileDialog.getSaveFileName(self, self.tr("Save shop"), self.folder(),
                                              self.tr("Shop documents (*{suffix})").format(suffix=SHOP_SUFFIX))
        return self.files.save_as(path) if path else False

    def on_export(self) -> None:
        path, _ = QFileDialog.getSaveFileName(self, self.tr("Export grid"), self.folder(), self.grid_filter())
        if path:
            self.files.export_grid(path)

    def on_import_into(self) -> None:
        path, _ = QFileDialog.getOpenFileName(self, self.tr("Import grid into this shop"), self.folder(),
                                              self.grid_filter())
        if path:
            self.files.import_into(path)

    def on_export_plan(self) -> None:
        if self.plan is None:
            self.show_warning(self.tr("there is no plan to export yet"))
            return
        path, _ = QFileDialog.getSaveFileName(self, self.tr("Export plan"), self.folder(),
                                              self.tr("Plan (*.csv *.xlsx)"))
        if path:
            self.files.export_plan(self.plan, path)

    def folder(self) -> str:
        return str(self.doc.path.parent) if self.doc.path else str(Path.cwd())

    def closeEvent(self, event: QCloseEvent) -> None:
        if not self.files.maybe_keep_changes():
            event.ignore()
            return
        # Every runner stops at once; a job still finishing emits into nothing (see
        # worker.BackgroundRunner), so closing never waits for a long solve.
        for runner in self.runners():
            runner.shutdown()
        self.history_dock.stop_listening()
        self.files.shutdown()
        self.files.discard_autosave()
        event.accept()

    # ---- context menus ---------------------------------------------------------------------------
    def _popup(self, actions, pos) -> QMenu:
        """A context menu of ``actions`` (None: separator), deleted once it closes."""
        menu = QMenu(self)
        menu.setAttribute(Qt.WidgetAttribute.WA_DeleteOnClose)
        for a in actions:
            menu.addSeparator() if a is None else menu.addAction(a)
        menu.popup(pos)
        return menu

    def _cell_menu(self, pos) -> QMenu:
        return self._popup((self.act_pin, self.act_forbid, self.act_unpin, self.act_cannot,
                            self.act_use_table, None,
                            self.act_copy, self.act_copy_names, self.act_paste, None,
                            self.act_rush, self.act_pull, self.act_penalty, self.act_done, None,
                            self.act_down, self.act_up, self.act_slots), pos)

    def _machine_menu(self, col: int, pos) -> QMenu:
        self.view.setCurrentIndex(self.model.index(max(self.view.current_row() or 0, 0),
                                                    FIRST_MACHINE_COL + col))
        return self._popup((self.act_down, self.act_up, self.act_maint, self.act_slots, None,
                            self.act_mounted, self.act_end_family), pos)

    def _job_menu(self, row: int, pos) -> QMenu:
        self.view.setCurrentIndex(self.model.index(row, max(self.view.currentIndex().column(), 0)))
        return self._popup((self.act_rush, self.act_pull, self.act_penalty, self.act_done), pos)
