"""The dispatch grid as a Qt table model: jobs as rows, machines as columns.

Leading columns describe the job (rush flag, wait penalty, run hours, setup family, where
the plan puts it); machine columns follow from :data:`FIRST_MACHINE_COL`. Where a machine
has a changeover table and the job a family, a cell's value is derived from the table
(the change from the machine's mounted family to the job's); a value typed over it carries
the pencil mark and says so in its tooltip. The model reads the shop through
:class:`~dispatcher.ui.document.ShopDocument` and the current plan; every edit becomes an
undoable command on the document's stack. Planned cells carry a check mark, pins a
diamond, forbidden pairs a cross and cannot-run pairs a dash, besides their colour.

Painting asks ``data()`` for about seven roles per visible cell, so a page of a big shop is
several thousand calls. The model keeps what it derives per cell (text, colour, font,
alignment and the plain values) in a small cache filled on the first role asked and
emptied on every change of the document or the plan shown; tooltips are built only when
asked. ``benchmarks/gui_stall.py`` measures the effect.
"""

from __future__ import annotations

from PySide6.QtCore import QT_TRANSLATE_NOOP, QAbstractTableModel, QModelIndex, QPersistentModelIndex, Qt, Signal

from dispatcher.limits import name_problem
from dispatcher.shop.staffed import operators_by_machine
from dispatcher.shop import DONE, DOWN, MAINTENANCE, MUST, MUST_NOT, RUNNING, UP, Plan
from dispatcher.ui import palette
from dispatcher.ui.document import ShopDocument
from dispatcher.ui.edits import SetJobField, SetValues
from dispatcher.ui.format import CellTextError, fmt, parse_cell, unit_text, waiting_text, when_text

COL_RUSH = 0
COL_PENALTY = 1
COL_HOURS = 2
COL_FAMILY = 3
COL_PLAN = 4
FIRST_MACHINE_COL = 5
#: Heads of the leading columns (English; the model shows them translated).
LEADING_HEADERS = {COL_RUSH: QT_TRANSLATE_NOOP("GridModel", "Rush"),
                   COL_PENALTY: QT_TRANSLATE_NOOP("GridModel", "Wait penalty"),
                   COL_HOURS: QT_TRANSLATE_NOOP("GridModel", "Run hours"),
                   COL_FAMILY: QT_TRANSLATE_NOOP("GridModel", "Family"),
                   COL_PLAN: QT_TRANSLATE_NOOP("GridModel", "Plan puts it on")}

ValueRole = Qt.ItemDataRole.UserRole + 1      # float | None: the grid value (None = cannot run)
PlannedRole = Qt.ItemDataRole.UserRole + 2    # bool: the plan shown uses this pair
PinRole = Qt.ItemDataRole.UserRole + 3        # "must" | "must_not" | None
RunningRole = Qt.ItemDataRole.UserRole + 4    # bool: the job already runs on this machine
SourceRole = Qt.ItemDataRole.UserRole + 5     # "typed" | "derived" | None (see Shop.value_source)

_CELL_ROLES = [Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.EditRole,
               Qt.ItemDataRole.BackgroundRole, Qt.ItemDataRole.ToolTipRole,
               Qt.ItemDataRole.AccessibleTextRole, Qt.ItemDataRole.FontRole, ValueRole, PinRole,
               SourceRole]
#: The roles a heading answers (:meth:`GridModel.headerData`).
_HEADER_ROLES = frozenset({Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole,
                           Qt.ItemDataRole.ToolTipRole, Qt.ItemDataRole.BackgroundRole})
_PLAN_ROLES = [Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.BackgroundRole,
               Qt.ItemDataRole.ToolTipRole, Qt.ItemDataRole.AccessibleTextRole, PlannedRole]

_DISPLAY = int(Qt.ItemDataRole.DisplayRole)
_DECORATION = int(Qt.ItemDataRole.DecorationRole)
_EDIT = int(Qt.ItemDataRole.EditRole)
_TOOLTIP = int(Qt.ItemDataRole.ToolTipRole)
_FONT = int(Qt.ItemDataRole.FontRole)
_ALIGNMENT = int(Qt.ItemDataRole.TextAlignmentRole)
_BACKGROUND = int(Qt.ItemDataRole.BackgroundRole)
_FOREGROUND = int(Qt.ItemDataRole.ForegroundRole)
_CHECK = int(Qt.ItemDataRole.CheckStateRole)
_ACCESSIBLE = int(Qt.ItemDataRole.AccessibleTextRole)
_VALUE, _PIN, _PLANNED, _RUNNING = int(ValueRole), int(PinRole), int(PlannedRole), int(RunningRole)
_SOURCE = int(SourceRole)
#: The roles kept per cell (a role not listed, such as the tooltip, is computed when asked).
CACHED_ROLES = (_DISPLAY, _DECORATION, _EDIT, _FONT, _ALIGNMENT, _BACKGROUND, _FOREGROUND,
                _CHECK, _ACCESSIBLE, _VALUE, _PIN, _SOURCE, _PLANNED, _RUNNING)
_CACHED_SET = frozenset(CACHED_ROLES)
#: At most this many cells are kept (a few pages of a big shop); the cache starts afresh.
CACHE_CELLS = 20_000
_RIGHT = int(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
_CENTRE = int(Qt.AlignmentFlag.AlignCenter)
_FLAGS_BASE = Qt.ItemFlag.ItemIsEnabled | Qt.ItemFlag.ItemIsSelectable
_FLAGS_CHECK = _FLAGS_BASE | Qt.ItemFlag.ItemIsUserCheckable
_FLAGS_EDIT = _FLAGS_BASE | Qt.ItemFlag.ItemIsEditable


#: A machine's state in its column head, after its mark (English; shown translated).
STATE_TEXT = {UP: (palette.MARK_UP, QT_TRANSLATE_NOOP("GridModel", "up")),
              DOWN: (palette.MARK_DOWN, QT_TRANSLATE_NOOP("GridModel", "DOWN")),
              MAINTENANCE: (palette.MARK_MAINT, QT_TRANSLATE_NOOP("GridModel", "maintenance"))}
#: A machine's state in a sentence (English; shown translated).
STATE_WORDS = {UP: QT_TRANSLATE_NOOP("GridModel", "up"),
               DOWN: QT_TRANSLATE_NOOP("GridModel", "down"),
               MAINTENANCE: QT_TRANSLATE_NOOP("GridModel", "in maintenance")}


class GridModel(QAbstractTableModel):
    """Table model over a :class:`ShopDocument` and the plan shown.

    ``warning(str)`` reports typed text that was refused (the edit is not made).
    """

    warning = Signal(str)

    def __init__(self, doc: ShopDocument, parent=None):
        super().__init__(parent)
        self._doc = doc
        self._plan: Plan | None = None
        self._operators: dict[str, str] = {}   # machine name -> who minds it (crewed shops)
        self._planned: dict[int, int] = {}     # row -> machine col (newly dispatched)
        self._running: dict[int, int] = {}     # row -> machine col (already running)
        self._waiting: set[int] = set()
        self._rush_text = self.tr("{mark} RUSH").format(mark=palette.MARK_RUSH)  # painted per row
        self._cache: dict[tuple[int, int], dict] = {}
        # Connected first, so that the cache is empty before any view hears of a change.
        for signal in (doc.reset, doc.cells_changed, doc.jobs_changed, doc.machines_changed,
                       doc.crew_changed, doc.tables_changed, doc.edited, doc.job_inserting, doc.job_removing,
                       doc.machine_inserting, doc.machine_removing):
            signal.connect(self._forget)
        doc.reset.connect(self._on_reset)
        doc.cells_changed.connect(self._on_cells)
        doc.jobs_changed.connect(self._on_jobs)
        doc.machines_changed.connect(self._on_machines)
        doc.job_inserting.connect(lambda r: self.beginInsertRows(QModelIndex(), r, r))
        doc.job_inserted.connect(lambda r: self._after_rows(r, +1))
        doc.job_removing.connect(lambda r: self.beginRemoveRows(QModelIndex(), r, r))
        doc.job_removed.connect(lambda r: self._after_rows(r, -1))
        doc.machine_inserting.connect(lambda k: self.beginInsertColumns(
            QModelIndex(), FIRST_MACHINE_COL + k, FIRST_MACHINE_COL + k))
        doc.machine_inserted.connect(lambda k: self._after_columns(k, +1))
        doc.machine_removing.connect(lambda k: self.beginRemoveColumns(
            QModelIndex(), FIRST_MACHINE_COL + k, FIRST_MACHINE_COL + k))
        doc.machine_removed.connect(lambda k: self._after_columns(k, -1))

    # ---- shape ----------------------------------------------------------------------------
    def rowCount(self, parent: QModelIndex | QPersistentModelIndex = QModelIndex()) -> int:
        return 0 if parent.isValid() else self._doc.n_jobs()

    def columnCount(self, parent: QModelIndex | QPersistentModelIndex = QModelIndex()) -> int:
        return 0 if parent.isValid() else FIRST_MACHINE_COL + self._doc.n_machines()

    @staticmethod
    def machine_col(column: int) -> int | None:
        """Machine index of a view column, None for the leading job columns."""
        return column - FIRST_MACHINE_COL if column >= FIRST_MACHINE_COL else None

    # ---- the plan shown -------------------------------------------------------------------
    @property
    def plan(self) -> Plan | None:
        return self._plan

    def set_plan(self, plan: Plan | None) -> None:
        """Show ``plan`` (None: no plan). Emits dataChanged for the cells whose mark changed."""
        shop = self._doc.shop
        rows = {j.name: i for i, j in enumerate(shop.jobs)}
        cols = {m.name: k for k, m in enumerate(shop.machines)}
        planned: dict[int, int] = {}
        running: dict[int, int] = {}
        waiting: set[int] = set()
        if plan is not None:
            for a in plan.assignments:
                if a.job in rows and a.machine in cols:
                    planned[rows[a.job]] = cols[a.machine]
            for r in plan.running:
                if r.job in rows and r.machine in cols:
                    running[rows[r.job]] = cols[r.machine]
            waiting = {rows[n] for n in plan.waiting_jobs if n in rows}
        touched = (set(self._planned.items()) ^ set(planned.items())) | \
            (set(self._running.items()) ^ set(running.items()))
        self._plan, self._planned, self._running, self._waiting = plan, planned, running, waiting
        # Only the cells whose mark changed and the plan column depend on the plan: the rest
        # of the cache stays, so a plan arriving repaints the page without recomputing it.
        cache = self._cache
        for r, c in touched:
            cache.pop((r, FIRST_MACHINE_COL + c), None)
        for r in range(self.rowCount()):
            cache.pop((r, COL_PLAN), None)
        operators = operators_by_machine(getattr(plan, "staffing", None))
        if operators != self._operators:
            self._operators = operators
            if self._doc.n_machines():
                self.headerDataChanged.emit(Qt.Orientation.Horizontal, FIRST_MACHINE_COL,
                                            FIRST_MACHINE_COL + self._doc.n_machines() - 1)
        for r, c in touched:
            idx = self.index(r, FIRST_MACHINE_COL + c)
            self.dataChanged.emit(idx, idx, _PLAN_ROLES)
        if self.rowCount():
            self.dataChanged.emit(self.index(0, COL_PLAN), self.index(self.rowCount() - 1, COL_PLAN),
                                  _PLAN_ROLES)

    def planned_col(self, row: int) -> int | None:
        """Machine index the plan shown gives this job (None if it waits or runs already)."""
        return self._planned.get(row)

    # ---- data -----------------------------------------------------------------------------
    def data(self, index: QModelIndex | QPersistentModelIndex, role: int = Qt.ItemDataRole.DisplayRole):
        if not index.isValid():
            return None
        key = (index.row(), index.column())
        entry = self._cache.get(key)
        if entry is None:
            # Machine cells: every cached role in one pass. Job columns: each role when it is
            # first asked for (painting and column sizing ask for a few roles, and the
            # others - a rush tick, a wait penalty's value - cost a lookup each).
            entry = self._cell_entry(key[0], key[1] - FIRST_MACHINE_COL) if key[1] >= FIRST_MACHINE_COL else {}
            if len(self._cache) >= CACHE_CELLS:
                self._cache.clear()
            self._cache[key] = entry
        role = int(role)
        if role in entry:
            return entry[role]
        value = self.computed_data(key[0], key[1], role)
        if role in _CACHED_SET and key[1] < FIRST_MACHINE_COL:
            entry[role] = value
        return value

    def _cell_entry(self, row: int, col: int) -> dict:
        """The cached roles of one machine cell, as :meth:`_cell_data` gives them."""
        doc = self._doc
        value = doc.value_at(row, col)
        pin = doc.pin_at(row, col)
        source = self._source(row, col)
        planned = self._planned.get(row) == col
        running = self._running.get(row) == col
        typed = palette.MARK_TYPED if source == "typed" else ""
        if value is None:
            text = f"{typed}{palette.MARK_CANNOT}"
        else:
            marks = typed
            if pin == MUST:
                marks += palette.MARK_PINNED
            elif pin == MUST_NOT:
                marks += palette.MARK_FORBIDDEN
            if planned:
                marks += palette.MARK_PLANNED
            elif running:
                marks += "\u25b6"
            text = f"{marks} {fmt(value)}" if marks else fmt(value)
        if planned or running:
            background = _colour("planned", 150)
        elif pin == MUST_NOT:
            background = _colour("forbidden", 60)
        elif value is None:
            background = _colour("cannot", 28)
        elif doc.machine_at(col).state != UP:
            background = _colour("down", 28)
        else:
            background = None
        bold, italic = planned or running, source == "derived"
        # text readable on the cell's shade in whatever palette (dark, high contrast)
        foreground = palette.text_over(background) if background is not None else None
        return {_DISPLAY: text, _ACCESSIBLE: text, _DECORATION: None, _FOREGROUND: foreground,
                _CHECK: None, _EDIT: "x" if value is None else fmt(value),
                _ALIGNMENT: _CENTRE if value is None else _RIGHT, _BACKGROUND: background,
                _FONT: _font(bold, italic) if bold or italic else None,
                _VALUE: value, _PIN: pin, _SOURCE: source, _PLANNED: planned, _RUNNING: running}

    def _forget(self, *_args) -> None:
        """Drop what was derived per cell (the document or the plan shown changed)."""
        self._cache.clear()

    def computed_data(self, row: int, column: int, role: int):
        """``data()`` worked out from the document and the plan, without the cache."""
        if role == _FOREGROUND:
            # Text readable on the cell's shade in whatever palette (dark, high contrast)
            background = self.computed_data(row, column, _BACKGROUND)
            return palette.text_over(background) if background is not None else None
        if column == COL_RUSH:
            return self._rush_data(row, role)
        if column == COL_PENALTY:
            return self._penalty_data(row, role)
        if column == COL_PLAN:
            return self._plan_data(row, role)
        if column == COL_HOURS:
            return self._hours_data(row, role)
        if column == COL_FAMILY:
            return self._family_data(row, role)
        return self._cell_data(row, column - FIRST_MACHINE_COL, role)

    def _rush_data(self, row: int, role: int):
        job = self._doc.job_at(row)
        if role == Qt.ItemDataRole.CheckStateRole:
            return Qt.CheckState.Checked if job.rush else Qt.CheckState.Unchecked
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
            return self._rush_text if job.rush else ""
        if role == Qt.ItemDataRole.BackgroundRole and job.rush:
            return palette.colour("rush", 110)
        if role == Qt.ItemDataRole.ToolTipRole:
            return (self.tr("{job} is a rush job: the plan must place it this round") if job.rush else
                    self.tr("{job} may wait if the machines are needed elsewhere (tick to make it a rush "
                            "job)")).format(job=job.name)
        return None

    def _penalty_data(self, row: int, role: int):
        job = self._doc.job_at(row)
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
            return fmt(job.wait_penalty)
        if role == Qt.ItemDataRole.EditRole:
            return fmt(job.wait_penalty)
        if role == ValueRole:
            return job.wait_penalty
        if role == Qt.ItemDataRole.TextAlignmentRole:
            return int(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
        if role == Qt.ItemDataRole.ToolTipRole:
            return self.tr("Wait penalty of {job}: {value} ({unit}) added to the total if it is left "
                           "waiting").format(job=job.name, value=fmt(job.wait_penalty),
                                             unit=unit_text(self._doc.shop.unit.label()))
        return None

    def _hours_data(self, row: int, role: int):
        job = self._doc.job_at(row)
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.EditRole,
                    Qt.ItemDataRole.AccessibleTextRole):
            return fmt(job.run_hours)
        if role == ValueRole:
            return job.run_hours
        if role == Qt.ItemDataRole.TextAlignmentRole:
            return int(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
        if role == Qt.ItemDataRole.ToolTipRole:
            if job.run_hours is None:
                return self.tr("Run hours of {job}: not given (needed only to fill the whole shift)").format(
                    job=job.name)
            return self.tr("Run hours of {job}: {hours} h (times each machine's speed factor; used when "
                           "filling the whole shift)").format(job=job.name, hours=fmt(job.run_hours))
        return None

    def _family_data(self, row: int, role: int):
        job = self._doc.job_at(row)
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.EditRole,
                    Qt.ItemDataRole.AccessibleTextRole):
            return job.family or ""
        if role == Qt.ItemDataRole.ToolTipRole:
            if job.family is None:
                return self.tr("{job} names no setup family: its values are typed in the grid "
                               "(type a family to price it by the changeover tables)").format(job=job.name)
            tables = [t.name or t.id for t in self._doc.shop.changeover_tables if job.family in t.families]
            if not tables:
                return self.tr("{job} needs family {family}, which no changeover table lists: "
                               "it waits unless values are typed").format(job=job.name, family=job.family)
            return self.tr("{job} needs family {family} (changeover tables: {tables})").format(
                job=job.name, family=job.family, tables=", ".join(tables))
        return None

    def _plan_data(self, row: int, role: int):
        job = self._doc.job_at(row)
        shop = self._doc.shop
        if row in self._running:
            m = shop.machines[self._running[row]].name
            text = self.tr("\u25b6 runs on {machine}").format(machine=m)
            tip = self.tr("{job} is already running on {machine}; it stays there").format(job=job.name, machine=m)
        elif row in self._planned:
            m = shop.machines[self._planned[row]].name
            v = self._doc.value_at(row, self._planned[row])
            text = f"{palette.MARK_PLANNED} {m}"
            tip = self.tr("The plan puts {job} on {machine} (value {value} {unit})").format(
                job=job.name, machine=m, value=fmt(v), unit=unit_text(shop.unit.label()))
        elif job.state == DONE:
            text, tip = self.tr("done"), self.tr("{job} is done and takes no part").format(job=job.name)
        elif row in self._waiting:
            text = self.tr("\u25cb waits")
            reason = self._plan.waiting_reasons.get(job.name) if self._plan else None
            tip = (self.tr("{job} waits this round: {reason}") if reason else
                   self.tr("{job} waits this round")).format(job=job.name, reason=waiting_text(self._plan, job.name))
        else:
            text, tip = "", self.tr("no plan yet")
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
            return text
        if role == Qt.ItemDataRole.ToolTipRole:
            return tip
        if role == Qt.ItemDataRole.BackgroundRole and row in self._waiting:
            return palette.colour("waiting", 45)
        return None

    def _cell_data(self, row: int, col: int, role: int):
        doc = self._doc
        value = doc.value_at(row, col)
        if role == ValueRole:
            return value
        pin = doc.pin_at(row, col)
        if role == PinRole:
            return pin
        source = self._source(row, col)
        if role == SourceRole:
            return source
        planned = self._planned.get(row) == col
        running = self._running.get(row) == col
        if role == PlannedRole:
            return planned
        if role == RunningRole:
            return running
        if role == Qt.ItemDataRole.EditRole:
            return "x" if value is None else fmt(value)
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
            typed = palette.MARK_TYPED if source == "typed" else ""
            if value is None:
                return f"{typed}{palette.MARK_CANNOT}"
            marks = typed
            if pin == MUST:
                marks += palette.MARK_PINNED
            elif pin == MUST_NOT:
                marks += palette.MARK_FORBIDDEN
            if planned:
                marks += palette.MARK_PLANNED
            elif running:
                marks += "\u25b6"
            return f"{marks} {fmt(value)}" if marks else fmt(value)
        if role == Qt.ItemDataRole.TextAlignmentRole:
            if value is None:
                return int(Qt.AlignmentFlag.AlignCenter)
            return int(Qt.AlignmentFlag.AlignRight | Qt.AlignmentFlag.AlignVCenter)
        if role == Qt.ItemDataRole.BackgroundRole:
            if planned or running:
                return palette.colour("planned", 150)
            if pin == MUST_NOT:
                return palette.colour("forbidden", 60)
            if value is None:
                return palette.colour("cannot", 28)
            if doc.machine_at(col).state != UP:
                return palette.colour("down", 28)
            return None
        if role == Qt.ItemDataRole.FontRole and (planned or running or source == "derived"):
            from PySide6.QtGui import QFont
            f = QFont()
            f.setBold(planned or running)
            f.setItalic(source == "derived")
            return f
        if role == Qt.ItemDataRole.ToolTipRole:
            return "\n".join([self._cell_tip(row, col, value, pin, planned, running),
                              *self._source_tip(row, col, source)])
        return None

    def _source(self, row: int, col: int) -> str | None:
        """``"typed"`` or ``"derived"`` where the pair could come from a changeover table
        (the machine has one and the job a family), else None: a plain grid's typed values
        carry no mark."""
        shop = self._doc.shop
        if not shop.changeover_tables:
            return None
        job, machine = self._doc.job_at(row), self._doc.machine_at(col)
        table = shop.table_of(machine.id)
        if job.family is None or table is None:
            return None
        typed, blocked = self._doc.cell_state(row, col)
        if typed is not None or blocked:
            return "typed"
        return "derived" if table.change(machine.mounted, job.family) is not None else None

    def _source_tip(self, row: int, col: int, source: str | None) -> list[str]:
        if source is None:
            return []
        shop = self._doc.shop
        job, machine = self._doc.job_at(row), self._doc.machine_at(col)
        table = shop.table_of(machine.id)
        name = table.name or table.id
        mounted = machine.mounted if machine.mounted is not None else self.tr("nothing mounted")
        derived = table.change(machine.mounted, job.family)
        if source == "derived":
            return [self.tr("Derived from changeover table {table}: change from {mounted} to "
                            "{family}").format(table=name, mounted=mounted, family=job.family)]
        table_says = (self.tr("the table gives {value}").format(value=fmt(derived)) if derived is not None
                      else self.tr("the table does not allow this change"))
        return [self.tr("{mark} typed over changeover table {table} ({table_says}); "
                        "Use changeover table puts the table's value back").format(
                            mark=palette.MARK_TYPED, table=name, table_says=table_says)]

    def _cell_tip(self, row: int, col: int, value, pin, planned: bool, running: bool) -> str:
        shop = self._doc.shop
        job, machine = self._doc.job_at(row), self._doc.machine_at(col)
        names = {"job": job.name, "machine": machine.name}
        if value is None:
            lines = [self.tr("{machine} cannot run {job} (type a number to allow it)").format(**names)]
        else:
            lines = [self.tr("Value of {job} on {machine}: {value} ({unit})").format(
                value=fmt(value), unit=unit_text(shop.unit.label()), **names)]
        if planned:
            lines.append(self.tr("{mark} the plan shown puts {job} here").format(mark=palette.MARK_PLANNED, **names))
        if running:
            lines.append(self.tr("{mark} {job} is already running here").format(mark="\u25b6", **names))
        if pin == MUST:
            lines.append(self.tr("{mark} pinned: {job} must go to {machine}").format(
                mark=palette.MARK_PINNED, **names))
        elif pin == MUST_NOT:
            lines.append(self.tr("{mark} forbidden: {job} must not go to {machine}").format(
                mark=palette.MARK_FORBIDDEN, **names))
        if machine.state != UP:
            lines.append(self.tr("{machine} is {state} and takes no jobs").format(
                state=self._state_word(machine.state), **names))
            if machine.state == DOWN:
                lines.append(self.tr("Lockout/tagout before any work on {machine}").format(**names))
        return "\n".join(lines)

    def _state_word(self, state: str) -> str:
        return self.tr(STATE_WORDS[state]) if state in STATE_WORDS else state

    def headerData(self, section: int, orientation: Qt.Orientation, role: int = Qt.ItemDataRole.DisplayRole):
        # The header asks for a dozen roles per section when it measures or paints; only
        # these four have answers, and building a machine's heading costs a few string
        # formats, so the others return at once (a 1000 x 200 shop measures 200 headings).
        if role not in _HEADER_ROLES:
            return None
        shop = self._doc.shop
        if orientation == Qt.Orientation.Horizontal:
            if section < FIRST_MACHINE_COL:
                if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
                    return self.tr(LEADING_HEADERS[section])
                if role == Qt.ItemDataRole.ToolTipRole:
                    return {COL_RUSH: self.tr("Rush jobs must be placed this round"),
                            COL_HOURS: self.tr("Hours each job runs (to fill the whole shift)"),
                            COL_FAMILY: self.tr("Setup family each job needs (mould, die, colour "
                                                "group); prices its changeovers"),
                            COL_PENALTY: self.tr("Added to the total ({unit}) when the job waits").format(
                                unit=unit_text(shop.unit.label())),
                            COL_PLAN: self.tr("Where the plan shown puts each job")}[section]
                return None
            if section - FIRST_MACHINE_COL >= self._doc.n_machines():
                return None
            m = self._doc.machine_at(section - FIRST_MACHINE_COL)
            mark, word = STATE_TEXT.get(m.state, ("", m.state))
            state = f"{mark} {self.tr(word)}" if m.state in STATE_TEXT else m.state
            slots = f" \u00d7{m.slots}" if m.slots != 1 else ""
            who = self._operators.get(m.name)
            if who == "unattended":   # operators_by_machine's word for a machine needing no one
                who = self.tr("unattended")
            table = shop.table_of(m.id) if shop.changeover_tables else None
            mounted = ""
            if table is not None or m.mounted is not None or m.end_family is not None:
                mounted = f"\n{palette.MARK_MOUNTED} {m.mounted if m.mounted is not None else '-'}"
                if m.end_family is not None:
                    mounted += f"\n{palette.MARK_END} {m.end_family}"
            if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
                return f"{m.name}\n{state}{slots}" + mounted + (f"\n{who}" if who else "")
            if role == Qt.ItemDataRole.ToolTipRole:
                tip = self.tr("{machine}: {state}, takes %n job(s) per round", "", m.slots).format(
                    machine=m.name, state=self._state_word(m.state))
                if mounted:
                    tip += "\n" + self.tr("{mark} mounted now: {family}").format(
                        mark=palette.MARK_MOUNTED,
                        family=m.mounted if m.mounted is not None else self.tr("nothing (cleaned)"))
                    if m.end_family is not None:
                        tip += "\n" + self.tr("{mark} must end the shift in: {family}").format(
                            mark=palette.MARK_END, family=m.end_family)
                    tip += "\n" + (self.tr("Changeover table: {table}").format(table=table.name or table.id)
                                   if table is not None else self.tr("No changeover table: values are typed"))
                if m.state == DOWN:
                    tip += "\n" + self.tr("Lockout/tagout before any work on {machine}").format(machine=m.name)
                if who:
                    tip += "\n" + self.tr("Operator in the plan shown: {operator}").format(operator=who)
                if m.state_note:
                    tip += "\n" + self.tr("Note: {note}").format(note=m.state_note)
                return tip + "\n" + self.tr("Right-click (or Shift+F10) for machine actions")
            if role == Qt.ItemDataRole.BackgroundRole and m.state != UP:
                return palette.colour(m.state if m.state == DOWN else "maintenance", 90)
            return None
        if section >= self._doc.n_jobs():
            return None
        job = self._doc.job_at(section)
        if role in (Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.AccessibleTextRole):
            if job.state == DONE:
                return self.tr("(done) {job}").format(job=job.name)
            return f"\u25b6 {job.name}" if job.state == RUNNING else job.name
        if role == Qt.ItemDataRole.ToolTipRole:
            parts = [job.name]
            if job.work_order:
                parts.append(self.tr("work order {work_order}").format(work_order=job.work_order))
            if job.due:
                parts.append(self.tr("due {time}").format(time=when_text(job.due)))
            parts.append(self.tr("state: {state}").format(state=self._job_state_word(job.state)))
            if job.notes:
                parts.append(job.notes)
            return "\n".join(parts)
        return None

    def _job_state_word(self, state: str) -> str:
        words = {"waiting": self.tr("waiting"), "running": self.tr("running"), "done": self.tr("done")}
        return words.get(state, state)

    def flags(self, index: QModelIndex | QPersistentModelIndex) -> Qt.ItemFlag:
        if not index.isValid():
            return Qt.ItemFlag.NoItemFlags
        column = index.column()
        if column == COL_RUSH:
            return _FLAGS_CHECK
        if column == COL_PLAN:
            return _FLAGS_BASE
        return _FLAGS_EDIT

    def setData(self, index: QModelIndex | QPersistentModelIndex, value, role: int = Qt.ItemDataRole.EditRole) -> bool:
        if not index.isValid():
            return False
        row, column = index.row(), index.column()
        job = self._doc.job_at(row)
        stack = self._doc.undo_stack
        if column == COL_RUSH and role == Qt.ItemDataRole.CheckStateRole:
            rush = Qt.CheckState(value) == Qt.CheckState.Checked
            if rush != job.rush:
                stack.push(SetJobField(self._doc, row, "rush", rush,
                                       (self.tr("Mark {job} as rush") if rush else
                                        self.tr("Unmark {job} as rush")).format(job=job.name)))
            return True
        if role != Qt.ItemDataRole.EditRole:
            return False
        if column == COL_FAMILY:
            return self._set_family(row, str(value))
        try:
            number = parse_cell(str(value))
        except CellTextError as exc:
            self.warning.emit(self.tr("{job}: {problem}").format(job=job.name, problem=exc))
            return False
        if column == COL_HOURS:
            if number is not None and number <= 0:
                self.warning.emit(self.tr("{job}: run hours must be a number > 0 (or empty)").format(job=job.name))
                return False
            if number != job.run_hours:
                stack.push(SetJobField(self._doc, row, "run_hours", number,
                                       self.tr("Run hours of {job} = {hours}").format(
                                           job=job.name, hours=fmt(number) or self.tr("none"))))
            return True
        if column == COL_PENALTY:
            if number is None:
                self.warning.emit(self.tr("{job}: the wait penalty must be a number >= 0").format(job=job.name))
                return False
            if number != job.wait_penalty:
                stack.push(SetJobField(self._doc, row, "wait_penalty", number,
                                       self.tr("Wait penalty of {job} = {value}").format(
                                           job=job.name, value=fmt(number))))
            return True
        col = column - FIRST_MACHINE_COL
        if col < 0:
            return False
        if number != self._doc.value_at(row, col):
            m = self._doc.machine_at(col)
            what = self.tr("cannot run") if number is None else fmt(number)
            stack.push(SetValues(self._doc, [(row, col, number)], self.tr("{job} on {machine} = {value}").format(
                job=job.name, machine=m.name, value=what)))
        return True

    def _set_family(self, row: int, text: str) -> bool:
        job = self._doc.job_at(row)
        family = text.strip() or None
        problem = name_problem(family) if family is not None else None
        if problem is not None:
            self.warning.emit(self.tr("{job}: the family name {problem}").format(job=job.name, problem=problem))
            return False
        if family != job.family:
            text = (self.tr("Family of {job} = {family}").format(job=job.name, family=family)
                    if family is not None else self.tr("Family of {job} cleared").format(job=job.name))
            self._doc.undo_stack.push(SetJobField(self._doc, row, "family", family, text))
        return True

    # ---- document signals -----------------------------------------------------------------
    def _after_rows(self, row: int, step: int) -> None:
        """Shift the plan marks past an inserted (+1) or removed (-1) job row, then end the
        insert or remove (the next solve brings the new plan)."""
        def moved(r: int) -> int:
            return r + step if r >= row else r
        gone = row if step < 0 else -1
        self._planned = {moved(r): c for r, c in self._planned.items() if r != gone}
        self._running = {moved(r): c for r, c in self._running.items() if r != gone}
        self._waiting = {moved(r) for r in self._waiting if r != gone}
        self._cache.clear()
        if step > 0:
            self.endInsertRows()
        else:
            self.endRemoveRows()

    def _after_columns(self, col: int, step: int) -> None:
        def moved(c: int) -> int:
            return c + step if c >= col else c
        gone = col if step < 0 else -1
        self._planned = {r: moved(c) for r, c in self._planned.items() if c != gone}
        self._running = {r: moved(c) for r, c in self._running.items() if c != gone}
        self._cache.clear()
        if step > 0:
            self.endInsertColumns()
        else:
            self.endRemoveColumns()

    def _on_reset(self) -> None:
        self.beginResetModel()
        self._plan, self._planned, self._running, self._waiting = None, {}, {}, set()
        self._cache.clear()
        self.endResetModel()

    def _on_cells(self, rows: list[int], cols: list[int]) -> None:
        if not rows:
            return
        top = self.index(min(rows), FIRST_MACHINE_COL + min(cols))
        bottom = self.index(max(rows), FIRST_MACHINE_COL + max(cols))
        self.dataChanged.emit(top, bottom, _CELL_ROLES)

    def _on_jobs(self, rows: list[int]) -> None:
        if not rows:
            return
        lo, hi = min(rows), max(rows)
        self.dataChanged.emit(self.index(lo, 0), self.index(hi, FIRST_MACHINE_COL - 1),
                              [Qt.ItemDataRole.DisplayRole, Qt.ItemDataRole.CheckStateRole,
                               Qt.ItemDataRole.BackgroundRole, Qt.ItemDataRole.ToolTipRole,
                               ValueRole])
        self.headerDataChanged.emit(Qt.Orientation.Vertical, lo, hi)

    def _on_machines(self, cols: list[int]) -> None:
        if not cols or not self.rowCount():
            return
        lo, hi = FIRST_MACHINE_COL + min(cols), FIRST_MACHINE_COL + max(cols)
        self.headerDataChanged.emit(Qt.Orientation.Horizontal, lo, hi)
        self.dataChanged.emit(self.index(0, lo), self.index(self.rowCount() - 1, hi),
                              _CELL_ROLES)


_COLOURS: dict[tuple[str, int], object] = {}
_FONTS: dict[tuple[bool, bool], object] = {}


def _font(bold: bool, italic: bool):
    """A bold and/or italic font, made once (QFont is copied on return)."""
    f = _FONTS.get((bold, italic))
    if f is None:
        from PySide6.QtGui import QFont
        f = _FONTS[(bold, italic)] = QFont()
        f.setBold(bold)
        f.setItalic(italic)
    return f


def _colour(role: str, alpha: int):
    """:func:`palette.colour`, made once per role and alpha (QColor is copied on return)."""
    key = (role, alpha)
    c = _COLOURS.get(key)
    if c is None:
        c = _COLOURS[key] = palette.colour(role, alpha)
    return c
