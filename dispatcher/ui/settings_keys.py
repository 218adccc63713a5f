"""Every QSettings key the app reads or writes, in one place (values are stored per user).

Kept free of Qt imports so any part of ui/ can use it without an import cycle.
"""

KEY_HISTORY = "history/path"  # the history file chosen in Edit > Settings
KEY_SUPERVISOR = "history/supervisor"  # default name for "decided by"
KEY_STATION = "history/station"  # station label recorded with each decision (empty: host name)
KEY_AUTOSAVE = "autosave/minutes"  # autosave interval
KEY_RECENT = "files/recent"  # recently opened shop documents, newest first

ALL_KEYS = (KEY_HISTORY, KEY_SUPERVISOR, KEY_STATION, KEY_AUTOSAVE, KEY_RECENT)
