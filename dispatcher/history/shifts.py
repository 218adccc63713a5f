"""Which shift a moment belongs to.

Decisions are stored with their UTC time and, alongside, the local shift date and shift
label, because supervisors ask about "Tuesday's night shift", not about UTC instants. A
shift that starts before midnight and ends after it belongs to the date it started on.

The default pattern is three eight-hour shifts starting at 06:00, 14:00 and 22:00 local
time (common practice in continuous shop-floor operation); callers may pass their own.
"""

from __future__ import annotations

from dataclasses import dataclass
from datetime import date, datetime, time, timedelta, timezone, tzinfo


@dataclass(frozen=True)
class ShiftStart:
    """A shift named ``label`` starting every day at local time ``start``."""

    label: str
    start: time


DEFAULT_SHIFTS: tuple[ShiftStart, ...] = (
    ShiftStart("early", time(6, 0)),
    ShiftStart("late", time(14, 0)),
    ShiftStart("night", time(22, 0)),
)


def utc_now() -> datetime:
    return datetime.now(timezone.utc)


def as_utc(moment: datetime) -> datetime:
    """``moment`` in UTC; a naive datetime is taken as local time of this computer."""
    if moment.tzinfo is None:
        moment = moment.astimezone()
    return moment.astimezone(timezone.utc)


def shift_of(moment: datetime, shifts: tuple[ShiftStart, ...] = DEFAULT_SHIFTS,
             tz: tzinfo | None = None) -> tuple[date, str]:
    """The (shift date, shift label) of ``moment`` in time zone ``tz`` (default: local).

    The shift is the last one started at or before the local time; before the first start
    of the day it is the previous day's last shift.
    """
    if not shifts:
        raise ValueError("at least one shift start is needed")
    ordered = sorted(shifts, key=lambda s: s.start)
    local = as_utc(moment).astimezone(tz) if tz is not None else as_utc(moment).astimezone()
    clock = local.time().replace(tzinfo=None)
    started = [s for s in ordered if s.start <= clock]
    if started:
        return local.date(), started[-1].label
    return local.date() - timedelta(days=1), ordered[-1].label


def format_utc(moment: datetime) -> str:
    """Fixed-width ISO 8601 text in UTC that sorts in time order: 2026-12-02T01:31:05.123456Z."""
    return as_utc(moment).strftime("%Y-%m-%dT%H:%M:%S.%fZ")


def parse_utc(text: str) -> datetime:
    """Inverse of :func:`format_utc` (also accepts any ISO 8601 text with an offset)."""
    value = datetime.fromisoformat(text.replace("Z", "+00:00"))
    return as_utc(value)
