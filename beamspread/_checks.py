"""The one check every module of the core shares: a finite value above zero."""

from __future__ import annotations

import math

from .errors import InputError

__all__ = ["check_positive"]


def check_positive(value: float, name: str, unit: str = "") -> float:
    """Return ``value`` as a float if it is finite and above zero, else raise.

    Raises
    ------
    InputError
        Naming the value and what is allowed.
    """
    try:
        number = float(value)
    except (TypeError, ValueError):
        raise InputError(f"{name}: {value!r} is not a number") from None
    if not math.isfinite(number) or number <= 0.0:
        shown = f"{value!r}{(' ' + unit) if unit else ''}"
        raise InputError(f"{name}: {shown} is not allowed; it must be a finite number above 0")
    return number
