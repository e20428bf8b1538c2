"""The keys of a setup file: where each lives, the option it stands for, and checks of its values.

A value is checked as written (a string with its unit, a list, a table) and
kept as written; the errors name the key but not the file, which
:mod:`beamspread.setupfile.io` adds.
"""

from __future__ import annotations

import math
import re
from dataclasses import dataclass

from ..errors import InputError
from ..units import parse_level, parse_quantity


@dataclass(frozen=True)
class _Key:
    field: str  # attribute of Setup
    section: str  # "" for the top level
    key: str
    kind: str  # a units kind, or "text", "choice", "list-length", "levels", "conditions", ...
    option: str | None  # the command-line option, None where there is none
    choices: tuple[str, ...] = ()


_KEYS = (
    _Key("title", "", "title", "text", None),
    _Key("description", "", "description", "text", None),
    _Key("shape", "probe", "shape", "choice", None, ("disc", "rectangle")),
    _Key("diameter", "probe", "diameter", "length", "--diameter"),
    _Key("length", "probe", "length", "length", "--length"),
    _Key("width", "probe", "width", "length", "--width"),
    _Key("frequency", "probe", "frequency", "frequency", "--frequency"),
    _Key("focus", "probe", "focus", "length", "--focus"),
    _Key("material", "medium", "material", "text", "--material"),
    _Key("speed", "medium", "speed", "speed", "--speed"),
    _Key("wave", "medium", "wave", "choice", "--wave", ("longitudinal", "shear")),
    _Key("temperature", "medium", "temperature", "temperature", "--temperature"),
    _Key("conditions", "medium", "conditions", "conditions", "--condition"),
    _Key("wedge", "wedge", "material", "text", "--wedge"),
    _Key("wedge_speed", "wedge", "speed", "speed", "--wedge-speed"),
    _Key("incident", "wedge", "incident", "angle", "--incident"),
    _Key("refracted", "wedge", "refracted", "angle", "--refracted"),
    _Key("wedge_path", "wedge", "path", "length", "--wedge-path"),
    _Key("water_path", "immersion", "water_path", "length", "--water-path"),
    _Key("couplant", "immersion", "couplant", "text", "--couplant"),
    _Key("thickness", "part", "thickness", "length", "--thickness"),
    _Key("depths", "inspection", "depths", "lengths", "--depth"),
    _Key("levels", "inspection", "levels", "levels", "--level"),
    _Key("bottom_depths", "bottom", "depths", "water-depths", "--bottom-depth"),
    _Key("power", "bottom", "power", "power", "--power"),
    _Key("efficiency", "bottom", "efficiency", "efficiency", "--efficiency"),
    _Key("bottom_loss", "bottom", "loss", "loss", "--bottom-loss"),
    _Key("sonar", "conventions", "sonar", "flag", "--sonar"),
    _Key("mode", "conventions", "mode", "choice", None, ("pulse-echo", "one-way")),
    _Key("bandwidth", "conventions", "bandwidth", "fraction", "--bandwidth"),
    _Key("spectrum", "conventions", "spectrum", "choice", "--spectrum", ("gaussian", "flat")),
    _Key("frequencies", "conventions", "frequencies", "count", "--frequencies"),
)
_SECTIONS = (
    "probe",
    "medium",
    "wedge",
    "immersion",
    "part",
    "inspection",
    "bottom",
    "conventions",
)
_BY_FIELD = {k.field: k for k in _KEYS}
_BY_OPTION = {k.option: k for k in _KEYS if k.option}
_MODE_FLAGS = {"--pulse-echo": "pulse-echo", "--one-way": "one-way"}


def _where(key: _Key) -> str:
    return f"{key.section}.{key.key}" if key.section else key.key


def _check(key: _Key, value):
    """The value as stored (strings kept as written), or an InputError without a location."""
    name = _where(key)
    kind = key.kind
    if kind in ("text", "choice"):
        if not isinstance(value, str) or not value.strip():
            raise InputError(f"{name}: {value!r} is not allowed; give a non-empty string")
        if kind == "choice" and value not in key.choices:
            raise InputError(f"{name}: {value!r} is unknown; use one of {', '.join(key.choices)}")
        return value
    if kind == "fraction":
        from ..field.spectrum import check_bandwidth

        if isinstance(value, bool) or not isinstance(value, (int, float)):
            raise InputError(f"{name}: {value!r} is not a number (e.g. 0.5)")
        return check_bandwidth(float(value))
    if kind == "count":
        if isinstance(value, bool) or not isinstance(value, int) or not 1 <= value <= 256:
            raise InputError(f"{name}: {value!r} is not allowed; give a whole number 1 to 256")
        return value
    if kind == "flag":
        if not isinstance(value, bool):
            raise InputError(f"{name}: {value!r} is not allowed; write true or false")
        return value
    if kind == "efficiency":
        if (
            isinstance(value, bool)
            or not isinstance(value, (int, float))
            or not (math.isfinite(value) and 0.0 < value <= 1.0)
        ):
            raise InputError(
                f"{name}: {value!r} is not allowed; give a number above 0 and at most 1 (e.g. 0.5)"
            )
        return float(value)
    if kind in ("power", "loss"):
        _in_unit(name, kind, value)
        return value
    if kind == "conditions":
        if not isinstance(value, dict):
            raise InputError(f'{name}: give a table such as {{ salinity = "35" }}')
        out = []
        for cname, text in value.items():
            if not re.fullmatch(r"[a-z][a-z0-9_-]*", str(cname)):
                raise InputError(f"{name}: {cname!r} is not a condition name (lower case)")
            if not isinstance(text, str) or not text.strip():
                raise InputError(f'{name}.{cname}: give the value as a string, e.g. "35"')
            out.append((str(cname), text))
        return tuple(out)
    if kind in ("lengths", "levels", "water-depths"):
        if not isinstance(value, (list, tuple)):
            example = '"10 m", "20 m"' if kind == "water-depths" else '"20 mm", "40 mm"'
            raise InputError(f"{name}: give a list, e.g. [{example}]")
        return tuple(_one(name, kind, v) for v in value)
    return _one(name, kind, value)


def _one(name: str, kind: str, value):
    if kind == "levels":
        if isinstance(value, bool) or not isinstance(value, (str, int, float)):
            raise InputError(f"{name}: {value!r} is not a level in dB")
        parse_level(value, name)
        return str(value)  # kept as written, as text
    if kind in ("lengths", "water-depths"):
        return _depths(name, kind, value)
    if not isinstance(value, str):
        raise InputError(
            f"{name}: {value!r} has no unit; write it as a string with its unit, "
            f'e.g. "{_EXAMPLES[kind]}"'
        )
    m = re.fullmatch(_NUMBER + r"\s*(.*?)\s*", value)
    if m is not None and not m.group(2):
        raise InputError(f'{name}: {value!r} has no unit; write e.g. "{_EXAMPLES[kind]}"')
    number = parse_quantity(value, kind, what=name)
    if kind != "temperature" and not number > 0 and not (kind == "angle" and number == 0):
        raise InputError(f"{name}: {value!r} is not allowed; it must be above 0")
    return value


def _depths(name: str, kind: str, value):
    """A depth, or a range START:STOP:STEP, each part a length with its unit; kept as written."""
    example = _EXAMPLES[kind]
    if not isinstance(value, str):
        raise InputError(
            f"{name}: {value!r} has no unit; write it as a string with its unit, "
            f'e.g. "{example}" or "{example}:{_RANGES[kind]}"'
        )
    parts = value.split(":")
    if len(parts) not in (1, 3):
        raise InputError(
            f"{name}: {value!r} is neither a depth nor START:STOP:STEP "
            f'(e.g. "{example}:{_RANGES[kind]}")'
        )
    numbers = []
    for part in parts:
        m = re.fullmatch(_NUMBER + r"\s*(.*?)\s*", part)
        if m is not None and not m.group(2):
            raise InputError(f'{name}: {value!r} has no unit; write e.g. "{example}"')
        number = parse_quantity(part, "length", what=name)
        if not number > 0:
            raise InputError(f"{name}: {value!r} is not allowed; a depth must be above 0")
        numbers.append(number)
    if len(numbers) == 3:
        from ..sonar.footprint import depth_range

        try:
            depth_range(*numbers)
        except InputError as exc:
            raise InputError(f"{name}: {value!r}: {exc}") from None
    return value


_NUMBER = r"\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)"
_EXAMPLES = {
    "length": "10 mm",
    "lengths": "10 mm",
    "water-depths": "10 m",
    "frequency": "5 MHz",
    "speed": "5920 m/s",
    "temperature": "20 degC",
    "angle": "45 deg",
    "power": "100 W",
    "loss": "10 dB",
}
_RANGES = {"lengths": "50 mm:5 mm", "water-depths": "40 m:10 m"}
_POWER_UNITS = {"W": 1.0, "kW": 1e3}


def _in_unit(name: str, kind: str, value) -> float:
    """A power (W or kW, above 0) in W, or a loss (dB, 0 or more) in dB, from its text."""
    units = "W or kW" if kind == "power" else "dB"
    m = re.fullmatch(_NUMBER + r"\s*(.*?)\s*", value) if isinstance(value, str) else None
    if m is None:
        raise InputError(
            f"{name}: {value!r} is not allowed; write it as a string with its unit ({units}), "
            f'e.g. "{_EXAMPLES[kind]}"'
        )
    unit = m.group(2)
    if not unit:
        raise InputError(f'{name}: {value!r} has no unit; write e.g. "{_EXAMPLES[kind]}"')
    factor = _POWER_UNITS.get(unit) if kind == "power" else (1.0 if unit == "dB" else None)
    if factor is None:
        raise InputError(f"{name}: unknown {kind} unit {unit!r} in {value!r}; allowed: {units}")
    number = float(m.group(1)) * factor
    if not math.isfinite(number) or (number <= 0 if kind == "power" else number < 0):
        allowed = "above 0" if kind == "power" else "0 or more"
        raise InputError(f"{name}: {value!r} is not allowed; it must be {allowed}")
    return number


def recordable_options() -> frozenset[str]:
    """The command-line options a setup file records (with the mode flags)."""
    return frozenset([*_BY_OPTION, *_MODE_FLAGS])
