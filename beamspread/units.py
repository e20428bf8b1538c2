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
from dataclasses import dataclass

from .errors import InputError

__all__ = [
    "KINDS",
    "format_length",
    "from_si",
    "length_text",
    "parse_density",
    "parse_frequency",
    "parse_length",
    "parse_level",
    "parse_quantity",
    "parse_speed",
    "parse_temperature",
    "positive_numbers",
    "unit_of",
]

_NUMBER = re.compile(r"^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*?)\s*$")


@dataclass(frozen=True)
class _Kind:
    """A kind of quantity: its default unit and, per unit, ``si = value * factor + offset``."""

    name: str
    default: str
    to_si: dict[str, tuple[float, float]]

    @property
    def units(self) -> str:
        return ", ".join(dict.fromkeys(self.to_si))


_INCH = 0.0254
_FT = 12 * _INCH
_IN_US = _INCH * 1e6
_F9 = 5.0 / 9.0
_F = (_F9, -32.0 * _F9)  # degF: (factor, offset); the other units convert by a factor alone
_K = (1.0, -273.15)
# kind: (the unit of a bare number, each unit's factor to SI)
_UNITS = {
    "length": (
        "mm",
        {
            "m": 1.0,
            "km": 1e3,
            "cm": 1e-2,
            "mm": 1e-3,
            "um": 1e-6,
            "µm": 1e-6,
            "in": _INCH,
            "ft": _FT,
        },
    ),
    "frequency": ("MHz", {"Hz": 1.0, "kHz": 1e3, "MHz": 1e6, "GHz": 1e9}),
    "speed": (
        "m/s",
        {
            "m/s": 1.0,
            "km/s": 1e3,
            "mm/us": 1e3,
            "mm/µs": 1e3,
            "in/us": _IN_US,
            "in/µs": _IN_US,
            "ft/s": _FT,
        },
    ),
    "temperature": (
        "degC",
        {"degC": 1.0, "°C": 1.0, "C": 1.0, "degF": _F, "°F": _F, "F": _F, "K": _K},
    ),
    "density": ("kg/m3", {"kg/m3": 1.0, "kg/m^3": 1.0, "g/cm3": 1e3, "g/cm^3": 1e3}),
    "salinity": ("g/kg", {"g/kg": 1.0, "ppt": 1.0, "psu": 1.0, "‰": 1.0}),
    "pressure": ("dbar", {"dbar": 1.0, "bar": 10.0, "kPa": 0.1, "MPa": 100.0, "Pa": 1e-4}),
    "power": ("W", {"W": 1.0, "kW": 1e3}),
    "decibel": ("dB", {"dB": 1.0}),
    "percent": ("%", {"%": 1.0}),
    "angle": ("deg", {"deg": 1.0, "°": 1.0}),
    "number": ("", {}),
}
KINDS: dict[str, _Kind] = {
    kind: _Kind(
        kind, default, {u: f if isinstance(f, tuple) else (f, 0.0) for u, f in factors.items()}
    )
    for kind, (default, factors) in _UNITS.items()
}
# Case-insensitive aliases, built once: "mhz" -> "MHz". Ambiguous spellings
# ("mm" vs "Mm") do not exist among the units above.
_FOLDED = {kind: {unit.lower(): unit for unit in k.to_si} for kind, k in KINDS.items()}


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
                + (f" (bare numbers are {default or k.default})" if default or k.default else "")
            )
        number = float(m.group(1))
        unit = m.group(2)
        if unit == "":
            unit = default if default is not None else k.default
        if unit == "" and not k.to_si:
            result = number
        else:
            canonical = unit_of(kind, unit)
            if canonical is None:
                raise InputError(
                    f"{label}: unknown {kind} unit {unit!r} in {text!r}; allowed: {k.units}"
                )
            factor, offset = k.to_si[canonical]
            result = number * factor + offset
    if not math.isfinite(result):
        raise InputError(f"{label}: {value!r} is not finite")
    return result


def is_bare(text: object) -> bool:
    """Whether ``text`` is a number without a unit (so it takes the default unit).

    >>> is_bare("5"), is_bare("5MHz"), is_bare(" 2.5e3 ")
    (True, False, True)
    """
    m = _NUMBER.match(str(text))
    return m is not None and m.group(2) == ""


def unit_of(kind: str, unit: str) -> str | None:
    """The canonical spelling of ``unit`` among the units of ``kind``, or None."""
    k = KINDS[kind]
    return unit if unit in k.to_si else _FOLDED[kind].get(unit.lower())


def from_si(value: float, kind: str, unit: str) -> float:
    """Express an SI value (degC for temperature) in ``unit`` of ``kind``.

    >>> round(from_si(100.0, "pressure", "bar"), 12), round(from_si(20.0, "temperature", "degF"), 9)
    (10.0, 68.0)
    """
    if not KINDS[kind].to_si:
        return value
    canonical = unit_of(kind, unit)
    if canonical is None:
        raise InputError(f"unknown {kind} unit {unit!r}; allowed: {KINDS[kind].units}")
    factor, offset = KINDS[kind].to_si[canonical]
    return (value - offset) / factor


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


def positive_numbers(values, what: str, rule: str) -> list[float]:
    """Each of ``values`` (m) as a float, refusing one that is not a finite number above 0.

    ``what`` names the values and ``rule`` says what is allowed, in the messages.

    >>> positive_numbers(["0.1", 2], "depth", "give a depth above 0")
    [0.1, 2.0]
    """
    out = []
    for item in values:
        try:
            value = float(item)
        except (TypeError, ValueError):
            raise InputError(f"{what}: {item!r} is not a number") from None
        if not math.isfinite(value) or value <= 0:
            raise InputError(f"{what}: {item!r} m is not allowed; {rule}")
        out.append(value)
    return out


def length_text(metres: float) -> str:
    """A length for messages, four significant figures: mm below a metre, m above.

    >>> length_text(0.02082), length_text(21.11)
    ('20.82 mm', '21.11 m')
    """
    if abs(metres) >= 1.0:
        return f"{metres:.4g} m"
    return f"{metres * 1e3:.4g} mm"


def format_length(
    metres: float, units: str = "mm", digits: int = 2, like: float | None = None
) -> str:
    """Format a length in metres for display in ``"mm"`` or ``"in"`` (large values in m or ft).

    ``like`` (m) chooses the unit instead of the value itself, so that a column of a table
    keeps one unit: pass the column's largest value.

    >>> format_length(0.0254, "in"), format_length(30.0), format_length(0.0123)
    ('1.000 in', '30.00 m', '12.30 mm')
    >>> format_length(0.929, like=1.24)
    '0.93 m'
    """
    scale = abs(metres if like is None else like)
    if units == "in":
        inches = metres / _INCH
        if scale / _INCH >= 120:
            return f"{inches / 12:.{digits}f} ft"
        return f"{inches:.{digits + 1}f} in"
    if scale >= 1.0:
        return f"{metres:.{digits}f} m"
    return f"{metres * 1e3:.{digits}f} mm"
