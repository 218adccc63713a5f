"""Colours and marks for the app: the Okabe-Ito colour-blind-safe palette, never colour alone.

Every state the app shows with a colour also carries a text mark or a shape, so the grid
and the panels read the same in grayscale and for colour-blind users.

References
----------
M. Okabe and K. Ito, "Color Universal Design (CUD): how to make figures and presentations
that are friendly to colorblind people" (2002; revised 2008), the eight-colour palette.
"""

from __future__ import annotations

from PySide6.QtGui import QColor, QGuiApplication, QPalette

#: The eight Okabe-Ito colours (Okabe and Ito 2002), by their published names.
OKABE_ITO = {
    "black": "#000000",
    "orange": "#E69F00",
    "sky_blue": "#56B4E9",
    "bluish_green": "#009E73",
    "yellow": "#F0E442",
    "blue": "#0072B2",
    "vermillion": "#D55E00",
    "reddish_purple": "#CC79A7",
}

#: What each colour means in this app (role -> palette name).
ROLE_COLOURS = {
    "planned": "sky_blue",       # a cell the plan in force uses (also marked with a check)
    "pinned": "blue",            # a pair forced by a pin (also marked with a pin symbol)
    "forbidden": "vermillion",   # a pair forbidden by a pin (also marked with a cross)
    "cannot": "black",           # the machine cannot run the job (shown as a dash)
    "rush": "orange",            # rush job (also the word RUSH)
    "down": "vermillion",        # machine down (also the word DOWN and a stop symbol)
    "maintenance": "reddish_purple",
    "up": "bluish_green",
    "moved": "orange",
    "started": "bluish_green",
    "waiting": "vermillion",
}

#: Text marks that carry the same meaning as the colours.
MARK_PLANNED = "\u2713"      # check mark
MARK_PINNED = "\u25c6"       # black diamond
MARK_FORBIDDEN = "\u2715"    # multiplication x
MARK_CANNOT = "\u2014"       # em dash
MARK_DOWN = "\u25a0"         # black square
MARK_UP = "\u25b2"           # triangle up
MARK_MAINT = "\u25d2"        # circle with lower half black
MARK_RUSH = "\u203c"         # double exclamation
MARK_TYPED = "\u270e"        # pencil: a value typed over the changeover table
MARK_MOUNTED = "\u2699"      # gear: the family a machine has mounted
MARK_END = "\u21e5"          # arrow to bar: the family a machine must end the shift in


def colour(role: str, alpha: int = 255) -> QColor:
    """The Okabe-Ito colour for an app role, with optional transparency."""
    c = QColor(OKABE_ITO[ROLE_COLOURS.get(role, role)])
    c.setAlpha(alpha)
    return c


def heat_colour(fraction: float) -> QColor:
    """A sequential light-to-dark ramp between white and Okabe-Ito blue.

    A single-hue lightness ramp stays readable in grayscale and for every kind of colour
    vision; ``fraction`` is clamped to [0, 1] (0 = no extra cost, 1 = the largest).
    """
    f = min(1.0, max(0.0, float(fraction)))
    base = QColor(OKABE_ITO["blue"])
    r = round(255 + (base.red() - 255) * f)
    g = round(255 + (base.green() - 255) * f)
    b = round(255 + (base.blue() - 255) * f)
    return QColor(r, g, b)


def _linear(channel: float) -> float:
    return channel / 12.92 if channel <= 0.03928 else ((channel + 0.055) / 1.055) ** 2.4


def relative_luminance(c: QColor) -> float:
    """WCAG 2.x relative luminance of an opaque colour (sRGB channels made linear)."""
    return 0.2126 * _linear(c.redF()) + 0.7152 * _linear(c.greenF()) + 0.0722 * _linear(c.blueF())


def text_on(background: QColor) -> QColor:
    """Black or white text, whichever has the higher WCAG 2.x contrast ratio with the
    opaque ``background`` (one of the two always reaches 4.5 : 1, the AA minimum)."""
    lum = relative_luminance(background)
    on_black = (lum + 0.05) / 0.05      # contrast of black text
    on_white = 1.05 / (lum + 0.05)      # contrast of white text
    return QColor("#000000") if on_black >= on_white else QColor("#FFFFFF")


def over(colour: QColor, base: QColor) -> QColor:
    """``colour`` (possibly translucent) as painted over the opaque ``base``."""
    a = colour.alphaF()
    return QColor(round(colour.red() * a + base.red() * (1 - a)),
                  round(colour.green() * a + base.green() * (1 - a)),
                  round(colour.blue() * a + base.blue() * (1 - a)))


def text_over(background: QColor, base_role: QPalette.ColorRole = QPalette.ColorRole.Base) -> QColor:
    """Readable text for a translucent ``background`` painted over the application
    palette's ``base_role`` (Base for cells, Button for headings): the marks stay
    readable in a dark or high-contrast scheme as in the default light one."""
    return text_on(over(QColor(background), QGuiApplication.palette().color(base_role)))
