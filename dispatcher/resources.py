"""Where the app's installed data files are: icon, desktop entry, metainfo, translations.

The files live in the checkout's top-level ``resources/`` folder, which installs as the
package ``dispatcher_resources`` (setup.py). They are found with
:mod:`importlib.resources`, so they work from a wheel, an editable install or a zip
alike. In a checkout that is run without being installed (``PYTHONPATH=.``), the folder
beside the ``dispatcher`` package is registered under that package name first, so the
same lookup applies. Qt-free: the app loads icons and translators from these files.
"""

from __future__ import annotations

import importlib.util
import sys
from importlib import resources
from importlib.abc import Traversable
from pathlib import Path

from dispatcher.errors import InternalError

__all__ = [
    "APP_ID",
    "ICON_SIZES",
    "LANGUAGES",
    "PACKAGE",
    "ResourceMissing",
    "all_resources",
    "desktop_entry",
    "icon_png",
    "icon_svg",
    "metainfo",
    "resource_root",
    "translation",
]

PACKAGE = "dispatcher_resources"
#: Reverse-DNS id of the desktop entry, the metainfo and the icon's theme name.
APP_ID = "org.shiftdispatch.Dispatcher"
#: Sizes (pixels, square) of the rendered PNG icons.
ICON_SIZES = (16, 24, 32, 48, 64, 128, 256)
#: Languages of the translation files: English (the source language; its file carries
#: only the plural forms) and the translations.
LANGUAGES: tuple[str, ...] = ("en", "de", "es")


class ResourceMissing(InternalError, FileNotFoundError):
    """An installed data file is missing: the installation is incomplete (not a user
    error: exit code 1 with its traceback on the command line)."""


def _register_checkout() -> None:
    """Make an uninstalled checkout's ``resources/`` importable as :data:`PACKAGE`."""
    folder = Path(__file__).resolve().parent.parent / "resources"
    init = folder / "__init__.py"
    if not init.is_file():
        return
    spec = importlib.util.spec_from_file_location(PACKAGE, init,
                                                  submodule_search_locations=[str(folder)])
    if spec is None or spec.loader is None:
        return
    module = importlib.util.module_from_spec(spec)
    sys.modules[PACKAGE] = module
    spec.loader.exec_module(module)


def resource_root() -> Traversable:
    """The installed resources folder."""
    if PACKAGE not in sys.modules and importlib.util.find_spec(PACKAGE) is None:
        _register_checkout()
    try:
        return resources.files(PACKAGE)
    except ModuleNotFoundError:
        raise ResourceMissing(f"the package {PACKAGE} is not installed: "
                              "reinstall the application") from None


def _existing(*parts: str) -> Traversable:
    item = resource_root().joinpath(*parts)
    if not item.is_file():
        raise ResourceMissing(f"{'/'.join(parts)}: missing from the installed {PACKAGE}")
    return item


def icon_svg() -> Traversable:
    """The app icon's SVG source."""
    return _existing("icons", "dispatcher.svg")


def icon_png(size: int) -> Traversable:
    """The app icon rendered at ``size`` pixels (one of :data:`ICON_SIZES`)."""
    if size not in ICON_SIZES:
        raise ValueError(f"no icon of size {size}: sizes are {', '.join(map(str, ICON_SIZES))}")
    return _existing("icons", f"dispatcher-{size}.png")


def desktop_entry() -> Traversable:
    """The freedesktop desktop entry."""
    return _existing(f"{APP_ID}.desktop")


def metainfo() -> Traversable:
    """The AppStream metainfo file."""
    return _existing(f"{APP_ID}.metainfo.xml")


def translation(language: str, compiled: bool = True) -> Traversable:
    """The compiled ``.qm`` (or with ``compiled=False`` the ``.ts`` source) of ``language``."""
    if language not in LANGUAGES:
        raise ValueError(f"no translation for {language!r}: languages are {', '.join(LANGUAGES)}")
    return _existing("translations", f"dispatcher_{language}.{'qm' if compiled else 'ts'}")


def all_resources() -> list[Traversable]:
    """Every data file the app ships (raises :class:`ResourceMissing` if one is absent)."""
    out = [icon_svg(), *(icon_png(s) for s in ICON_SIZES), desktop_entry(), metainfo()]
    for lang in LANGUAGES:
        out += [translation(lang), translation(lang, compiled=False)]
    return out
