"""The desktop app (PySide6 widgets). The only package that imports Qt widgets."""
