"""The numbers on every picture and their words: lengths in units, dB with its floor, levels.

Lengths are drawn in ``units`` (``"mm"`` or ``"in"``; a sonar cone also
takes ``"m"`` or ``"ft"``) and levels in dB as :math:`20\\log_{10}` of the
amplitude relative to a stated reference, from :data:`FLOOR_DB` up.
"""

from __future__ import annotations

import math
from collections.abc import Sequence

import numpy as np

from ...errors import InputError
from ...units import format_length

FLOOR_DB = -40.0  # the foot of every dB scale

_LENGTHS = {"mm": 1e3, "in": 1.0 / 0.0254, "m": 1.0, "ft": 1.0 / 0.3048}
_MINUS = "\u2212"


def _scale(units: str, allowed: Sequence[str] = ("mm", "in")) -> tuple[float, str]:
    """Metres-to-units factor and the unit's label."""
    if units not in allowed:
        raise InputError(f"units: {units!r} is unknown; use one of {', '.join(allowed)}")
    return _LENGTHS[units], units


def _db(amplitude, reference) -> np.ndarray:
    """``20 log10(amplitude / reference)``, floored at :data:`FLOOR_DB` (zeros included)."""
    a = np.abs(np.asarray(amplitude, dtype=float))
    ref = np.asarray(reference, dtype=float)
    tiny = 10.0 ** (FLOOR_DB / 20.0) * 1e-3
    with np.errstate(divide="ignore", invalid="ignore"):
        ratio = np.where(ref > 0, a / np.where(ref > 0, ref, 1.0), 0.0)
    return np.maximum(20.0 * np.log10(np.maximum(ratio, tiny)), FLOOR_DB)


def _levels(levels_db) -> list[float]:
    """Levels as positive dB below the reference, in the order given, without repeats."""
    out: list[float] = []
    for level in levels_db:
        try:
            value = abs(float(level))
        except (TypeError, ValueError):
            raise InputError(f"level: {level!r} is not a number of dB") from None
        if not math.isfinite(value) or value == 0.0 or value >= -FLOOR_DB:
            raise InputError(
                f"level: {level!r} dB is not allowed; give a level from above 0 "
                f"to below {-FLOOR_DB:g} dB down"
            )
        if value not in out:
            out.append(value)
    return out


def _level_text(level: float) -> str:
    return f"{_MINUS}{abs(level):g} dB"


def _length(metres: float, units: str) -> str:
    if units in ("mm", "in"):
        return format_length(metres, units)
    value = metres * _LENGTHS[units]
    return f"{value:.3g} {units}"


def _mode_text(mode: str, bandwidth: float | None = None) -> str:
    text = mode
    if bandwidth is not None:
        text += ", continuous wave" if bandwidth == 0 else f", {bandwidth:g} fractional bandwidth"
    return text
