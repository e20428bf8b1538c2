"""Quantities with units in, SI floats out.

Each ``parse_*`` function takes a number (already SI, passed through) or a
string such as ``"10mm"``, ``"5 MHz"`` or ``"68degF"`` and returns a float in
SI units (temperature: degrees Celsius, the unit every medium equation uses).
A bare number in a string takes the documented default unit of its kind.
The command line's parameter types call these functions; the physics never
sees a string.
"""

from __future__ import annotations

import math
import re
from collections.abc import Callable
from dataclasses import dataclass

from .errors import InputError

__all__ = [
    "KINDS",
    "format_length",
    "parse_density",
    "parse_frequency",
    "parse_length",
    "parse_level",
    "parse_quantity",
    "parse_speed",
    "parse_temperature",
]

_NUMBER = re.compile(r"^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*?)\s*$")


@dataclass(frozen=True)
class _Kind:
    name: str
    default: str
    to_si: dict[str, Callable[[float], float]]

    @property
    def units(self) -> str:
        return ", ".join(dict.fromkeys(self.to_si))


def _scale(factor: float) -> Callable[[float], float]:
    return lambda v: v * factor


_INCH = 0.0254
KINDS: dict[str, _Kind] = {
    "length": _Kind(
        "length",
        "mm",
        {
            "m": _scale(1.0),
            "cm": _scale(1e-2),
            "mm": _scale(1e-3),
            "um": _scale(1e-6),
            "µm": _scale(1e-6),
            "in": _scale(_INCH),
            "ft": _scale(12 * _INCH),
        },
    ),
    "frequency": _Kind(
        "frequency",
        "MHz",
        {"Hz": _scale(1.0), "kHz": _scale(1e3), "MHz": _scale(1e6), "GHz": _scale(1e9)},
    ),
    "speed": _Kind(
        "speed",
        "m/s",
        {
            "m/s": _scale(1.0),
            "km/s": _scale(1e3),
            "mm/us": _scale(1e3),
            "mm/µs": _scale(1e3),
            "in/us": _scale(_INCH * 1e6),
            "in/µs": _scale(_INCH * 1e6),
            "ft/s": _scale(12 * _INCH),
        },
    ),
    "temperature": _Kind(
        "temperature",
        "degC",
        {
            "degC": lambda v: v,
            "°C": lambda v: v,
            "C": lambda v: v,
            "degF": lambda v: (v - 32.0) * 5.0 / 9.0,
            "°F": lambda v: (v - 32.0) * 5.0 / 9.0,
            "F": lambda v: (v - 32.0) * 5.0 / 9.0,
            "K": lambda v: v - 273.15,
        },
    ),
    "density": _Kind(
        "density",
        "kg/m3",
        {"kg/m3": _scale(1.0), "kg/m^3": _scale(1.0), "g/cm3": _scale(1e3), "g/cm^3": _scale(1e3)},
    ),
    "salinity": _Kind(
        "salinity",
        "g/kg",
        {"g/kg": _scale(1.0), "ppt": _scale(1.0), "psu": _scale(1.0), "‰": _scale(1.0)},
    ),
    "pressure": _Kind(
        "pressure",
        "dbar",
        {
            "dbar": _scale(1.0),
            "bar": _scale(10.0),
            "kPa": _scale(0.1),
            "MPa": _scale(100.0),
            "Pa": _scale(1e-4),
        },
    ),
    "percent": _Kind("percent", "%", {"%": _scale(1.0)}),
    "number": _Kind("number", "", {}),
}
# Case-insensitive aliases, built once: "mhz" -> "MHz". Ambiguous spellings
# ("mm" vs "Mm") do not exist among the units above.
_FOLDED = {
    kind: {unit.lower(): unit for unit in k.to_si} for kind, k in KINDS.items()
}


def parse_quantity(
    value: object, kind: str, *, what: str | None = None, default: str | None = None
) -> float:
    """Convert ``value`` of the given kind to its SI unit (degC for temperature).

    Parameters
    ----------
    value : float, int or str
        A number (taken as already SI) or a string of a number and an
        optional unit suffix, with or without a space.
    kind : str
        One of ``KINDS``: length, frequency, speed, temperature, density,
        salinity, pressure, percent, number.
    what : str, optional
        The name used in error messages, e.g. ``"--diameter"``.
    default : str, optional
        The unit of a bare number, instead of the kind's default.

    Raises
    ------
    InputError
        When the string is not a number with a known unit, or is not finite.

    Examples
    --------
    >>> parse_quantity("10mm", "length")
    0.01
    >>> parse_quantity("5 MHz", "frequency")
    5000000.0
    """
    k = KINDS[kind]
    label = what or kind
    if isinstance(value, bool):
        raise InputError(f"{label}: {value!r} is not a {kind}")
    if isinstance(value, (int, float)):
        result = float(value)
    else:
        text = str(value)
        m = _NUMBER.match(text)
        if not m:
            raise InputError(
                f"{label}: {text!r} is not a number with a unit; "
                f"allowed units: {k.units or 'none'}"
                + (f" (bare numbers are {k.default})" if k.default else "")
            )
        number = float(m.group(1))
        unit = m.group(2)
        if unit == "":
            unit = default if default is not None else k.default
        if unit == "" and not k.to_si:
            result = number
        else:
            canonical = unit if unit in k.to_si else _FOLDED[kind].get(unit.lower())
            if canonical is None:
                raise InputError(
                    f"{label}: unknown {kind} unit {unit!r} in {text!r}; allowed: {k.units}"
                )
            result = k.to_si[canonical](number)
    if not math.isfinite(result):
        raise InputError(f"{label}: {value!r} is not finite")
    return result


def parse_length(value: object, what: str | None = None) -> float:
    """A length in metres; bare numbers are millimetres."""
    return parse_quantity(value, "length", what=what)


def parse_frequency(value: object, what: str | None = None) -> float:
    """A frequency in hertz; bare numbers are megahertz."""
    return parse_quantity(value, "frequency", what=what)


def parse_speed(value: object, what: str | None = None) -> float:
    """A speed in m/s; bare numbers are m/s."""
    return parse_quantity(value, "speed", what=what)


def parse_temperature(value: object, what: str | None = None) -> float:
    """A temperature in degrees Celsius; bare numbers are degC."""
    return parse_quantity(value, "temperature", what=what)


def parse_density(value: object, what: str | None = None) -> float:
    """A density in kg/m3; bare numbers are kg/m3."""
    return parse_quantity(value, "density", what=what)


_LEVEL = re.compile(r"^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(?:dB)?\s*$", re.I)


def parse_level(value: object, what: str | None = None) -> float:
    """A level below the peak, in dB, returned as a positive number.

    ``"-6"``, ``"6"``, ``"6dB"`` and ``"-6 dB"`` all mean 6 dB down.

    Raises
    ------
    InputError
        Unless the level is a finite number above 0 dB and at most 200 dB.

    Examples
    --------
    >>> parse_level("-6dB"), parse_level(20)
    (6.0, 20.0)
    """
    label = what or "level"
    if isinstance(value, (int, float)) and not isinstance(value, bool):
        number = float(value)
    else:
        m = _LEVEL.match(str(value))
        if not m:
            raise InputError(f"{label}: {value!r} is not a level in dB (e.g. 6, -6 or 6dB)")
        number = float(m.group(1))
    level = abs(number)
    if not math.isfinite(level) or level == 0.0 or level > 200.0:
        raise InputError(
            f"{label}: {value!r} is not allowed; "
            "give a level from above 0 up to 200 dB below the peak"
        )
    return level


def format_length(metres: float, units: str = "mm", digits: int = 2) -> str:
    """Format a length in metres for display in ``"mm"`` or ``"in"`` (large values in m or ft).

    >>> format_length(0.0254, "in"), format_length(30.0), format_length(0.0123)
    ('1.000 in', '30.00 m', '12.30 mm')
    """
    if units == "in":
        inches = metres / _INCH
        if abs(inches) >= 120:
            return f"{inches / 12:.{digits}f} ft"
        return f"{inches:.{digits + 1}f} in"
    if abs(metres) >= 1.0:
        return f"{metres:.{digits}f} m"
    return f"{metres * 1e3:.{digits}f} mm"
