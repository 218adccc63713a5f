"""Grid edits: copy, paste, cannot-run, pins, jobs and machines.

:class:`GridEdits` is a part of the main window, created in its constructor: every method
turns a user action into one undoable edit on the document (see :mod:`dispatcher.ui.edits`).
"""

from __future__ import annotations

from datetime import datetime, timezone

from PySide6.QtCore import QObject
from PySide6.QtGui import QGuiApplication

from dispatcher.limits import name_problem
from dispatcher.shop import DONE, MAINTENANCE, MUST, MUST_NOT, UP, Job, Machine
from dispatcher.ui import asking
from dispatcher.ui.clipboard import PasteError, copy_block, paste_changes
from dispatcher.ui.edits import (AddJob, AddMachine, SetJobField, SetJobsState, SetMachineFields, SetPin,
                                 SetValues, UseTable)
from dispatcher.ui.grid_model import FIRST_MACHINE_COL


def _new_id(prefix: str, taken: list[str]) -> str:
    """The first ``prefix<n>`` not in ``taken``."""
    used = set(taken)
    n = len(used) + 1
    while f"{prefix}{n}" in used:
        n += 1
    return f"{prefix}{n}"


class GridEdits(QObject):
    """The grid's edit actions. Reads the window's document, grid view and model; reports
    refusals with ``window.show_warning`` and progress in its status bar."""

    def __init__(self, window):
        super().__init__(window)
        self.window = window
        self.doc = window.doc
        self.view = window.view
        self.model = window.model

    def show_warning(self, text: str) -> None:
        self.window.show_warning(text)

    def status(self, text: str, ms: int = 4000) -> None:
        self.window.statusBar().showMessage(text, ms)

    def copy(self, with_names: bool = False) -> None:
        rows, cols = self.view.selected_block()
        if rows and cols:
            QGuiApplication.clipboard().setText(copy_block(self.doc.shop, rows, cols, with_names))
            self.status(self.tr("Copied {rows} x {columns} cells").format(rows=len(rows), columns=len(cols)))

    def paste_text(self, text: str) -> bool:
        """Paste a tab-separated block at the current cell (one undoable edit)."""
        cell = self.view.current_cell() or (0, 0)
        if not self.doc.n_jobs() or not self.doc.n_machines():
            self.show_warning(self.tr("nothing to paste into: the shop has no jobs or machines"))
            return False
        try:
            changes = paste_changes(text, self.doc.shop, *cell)
        except PasteError as exc:
            self.show_warning(str(exc))
            return False
        changes = [c for c in changes if self.doc.value_at(c[0], c[1]) != c[2]]
        if changes:
            self.doc.undo_stack.push(SetValues(self.doc, changes, self.tr("Paste %n cell(s)", "", len(changes))))
        self.status(self.tr("Pasted; %n cell(s) changed", "", len(changes)))
        return True

    def paste(self) -> None:
        self.paste_text(QGuiApplication.clipboard().text())

    def cannot_run(self) -> None:
        rows, cols = self.view.selected_block()
        changes = [(r, c, None) for r in rows for c in cols if self.doc.value_at(r, c) is not None]
        if changes:
            self.doc.undo_stack.push(SetValues(self.doc, changes,
                                               self.tr("Mark %n cell(s) cannot run", "", len(changes))))

    def pin(self, kind: str | None) -> None:
        cell = self.view.current_cell()
        if cell is None:
            self.show_warning(self.tr("choose a cell in a machine column first"))
            return
        row, col = cell
        job, machine = self.doc.job_at(row), self.doc.machine_at(col)
        if self.doc.pin_at(row, col) == kind:
            return
        text = {MUST: self.tr("Pin {job} to {machine}"),
                MUST_NOT: self.tr("Forbid {job} on {machine}"),
                None: self.tr("Clear pin of {job} on {machine}")}[kind].format(job=job.name, machine=machine.name)
        self.doc.undo_stack.push(SetPin(self.doc, row, col, kind, text))

    def ask_add_job(self) -> None:
        name, ok = asking.get_text(self.window, self.tr("Add job"), self.tr("Name of the new job (unique):"),
                                   self.tr("A new row: the job cannot run anywhere until values are typed in"))
        if ok:
            self.add_job(name)

    def add_job(self, name: str) -> bool:
        """Append a waiting job (every machine 'cannot run' until values are typed in)."""
        name = name.strip()
        if not name or name in self.doc.shop.job_names():
            self.show_warning(self.tr("job name {name} is empty or already used").format(name=repr(name)))
            return False
        job = Job(id=_new_id("J", [j.id for j in self.doc.shop.jobs]), name=name)
        self.doc.undo_stack.push(AddJob(self.doc, job, self.tr("Add job {name}").format(name=name)))
        self.view.setCurrentIndex(self.model.index(self.doc.n_jobs() - 1, FIRST_MACHINE_COL))
        self.status(self.tr("Added {name}: type its values; Ctrl+R if it is a rush job").format(name=name), 8000)
        return True

    def ask_add_machine(self) -> None:
        name, ok = asking.get_text(self.window, self.tr("Add machine"),
                                   self.tr("Name of the new machine (unique):"),
                                   self.tr("A new column: no job can run on it until values are typed in"))
        if ok:
            self.add_machine(name)

    def add_machine(self, name: str) -> bool:
        name = name.strip()
        if not name or name in self.doc.shop.machine_names():
            self.show_warning(self.tr("machine name {name} is empty or already used").format(name=repr(name)))
            return False
        machine = Machine(id=_new_id("M", [m.id for m in self.doc.shop.machines]), name=name)
        self.doc.undo_stack.push(AddMachine(self.doc, machine, self.tr("Add machine {name}").format(name=name)))
        return True

    def job_done(self) -> None:
        row = self.view.current_row()
        if row is None:
            return
        job = self.doc.job_at(row)
        if job.state == DONE:
            return
        self.doc.undo_stack.push(SetJobsState(self.doc, [(row, {"state": DONE, "machine": None,
                                                                "since": None})],
                                              self.tr("{job} done").format(job=job.name)))

    def ask_penalty(self) -> None:
        row = self.view.current_row()
        if row is None:
            return
        job = self.doc.job_at(row)
        value, ok = asking.get_double(self.window, self.tr("Wait penalty"),
                                      self.tr("Cost of leaving {job} waiting:").format(job=job.name),
                                      self.tr("Added to the plan's total when the job waits"),
                                      job.wait_penalty, 0.0, 1e12, 2)
        if ok and value != job.wait_penalty:
            self.doc.undo_stack.push(SetJobField(self.doc, row, "wait_penalty", value,
                                                 self.tr("Wait penalty of {job}").format(job=job.name)))

    def ask_slots(self) -> None:
        col = self.view.current_machine()
        if col is None:
            self.show_warning(self.tr("choose a cell in a machine column first"))
            return
        m = self.doc.machine_at(col)
        value, ok = asking.get_int(self.window, self.tr("Slots"),
                                   self.tr("Jobs {machine} takes per round:").format(machine=m.name),
                                   self.tr("How many jobs the machine runs at once, 1 to 100"), m.slots, 1, 100)
        if ok:
            self.set_slots(col, value)

    def set_slots(self, col: int, slots: int) -> None:
        m = self.doc.machine_at(col)
        if slots != m.slots:
            self.doc.undo_stack.push(SetMachineFields(self.doc, col, {"slots": slots},
                                                      self.tr("{machine} takes %n job(s)", "", slots).format(
                                                          machine=m.name)))

    def toggle_maintenance(self) -> None:
        col = self.view.current_machine()
        if col is None:
            return
        m = self.doc.machine_at(col)
        state = UP if m.state == MAINTENANCE else MAINTENANCE
        self.doc.undo_stack.push(SetMachineFields(
            self.doc, col, {"state": state, "state_changed": datetime.now(timezone.utc)},
            (self.tr("{machine}: in maintenance") if state == MAINTENANCE else
             self.tr("{machine}: up")).format(machine=m.name)))


    # ---- changeovers ----------------------------------------------------------------------
    def use_table(self) -> None:
        """Drop the values typed in the selected cells: they follow the changeover table."""
        rows, cols = self.view.selected_block()
        cells = [(r, c) for r in rows for c in cols if self.doc.cell_state(r, c) != (None, False)
                 and self.doc.shop.table_of(self.doc.machine_ids[c]) is not None]
        if not cells:
            self.show_warning(self.tr("nothing typed over a changeover table in the selection"))
            return
        self.doc.undo_stack.push(UseTable(self.doc, cells, self.tr(
            "Use changeover table in %n cell(s)", "", len(cells))))

    def families_of(self, col: int) -> list[str]:
        """The families the machine's changeover table lists (empty: no table)."""
        table = self.doc.shop.table_of(self.doc.machine_ids[col])
        return list(table.families) if table is not None else []

    def ask_mounted(self, field: str = "mounted") -> None:
        """Ask which family the current machine has mounted now (``field`` "mounted") or
        must end the shift in ("end_family")."""
        col = self.view.current_machine()
        if col is None:
            self.show_warning(self.tr("choose a cell in a machine column first"))
            return
        m = self.doc.machine_at(col)
        nothing = self.tr("(nothing mounted)") if field == "mounted" else self.tr("(any family)")
        choices = [nothing, *self.families_of(col)]
        current = getattr(m, field)
        title = self.tr("Mounted family") if field == "mounted" else self.tr("End family")
        label = (self.tr("Family {machine} has mounted now:") if field == "mounted"
                 else self.tr("Family {machine} must end the shift in:")).format(machine=m.name)
        text, ok = asking.get_item(self.window, title, label,
                                   self.tr("A family of the machine's changeover table"), choices,
                                   choices.index(current) if current in choices else 0, True)
        if ok:
            self.set_machine_family(col, None if text == nothing else text, field)

    def set_machine_family(self, col: int, family: str | None, field: str = "mounted") -> bool:
        """Set what the machine has mounted (or must end in); a family its table does not
        list is refused, naming the machine and the table."""
        m = self.doc.machine_at(col)
        family = family.strip() if family else None
        family = family or None
        if family is not None:
            problem = name_problem(family)
            known = self.families_of(col)
            if problem is not None:
                self.show_warning(self.tr("{machine}: the family name {problem}").format(
                    machine=m.name, problem=problem))
                return False
            if family not in known:
                table = self.doc.shop.table_of(m.id)
                self.show_warning(
                    self.tr("{machine}: family {family} is not in changeover table {table}").format(
                        machine=m.name, family=family, table=table.name or table.id) if table is not None
                    else self.tr("{machine} has no changeover table; add it to one first").format(machine=m.name))
                return False
        if family == getattr(m, field):
            return True
        text = (self.tr("{machine} has {family} mounted") if field == "mounted"
                else self.tr("{machine} ends the shift in {family}")).format(
                    machine=m.name, family=family if family is not None else "-")
        self.doc.undo_stack.push(SetMachineFields(self.doc, col, {field: family}, text))
        return True
