"""Setup files: a technique recorded in TOML, so that it can be repeated exactly.

The format is beamspread's own. Quantities are strings with their unit
(``"10 mm"``, ``"5 MHz"``), so a file never depends on a default unit::

    format = 1
    title = "Plate weld, 45 degree shear"        # optional
    description = "..."                          # optional

    [probe]
    shape = "disc"              # disc: diameter; rectangle: length and width
    diameter = "10 mm"
    frequency = "5 MHz"
    focus = "50 mm"             # optional: focal length

    [medium]
    material = "reference-steel"   # or: speed = "5920 m/s"
    wave = "longitudinal"          # or "shear" (default: longitudinal; shear on a wedge)
    temperature = "20 degC"        # optional, with a material
    conditions = { salinity = "35", depth = "30 m" }   # optional, as the medium declares

    [wedge]                  # optional
    material = "acrylic"     # or: speed = "2730 m/s"
    incident = "36.4 deg"    # or: refracted = "45 deg"
    path = "12 mm"

    [immersion]              # optional
    water_path = "40 mm"
    couplant = "water"

    [part]                   # optional
    thickness = "25 mm"

    [inspection]             # optional
    depths = ["20 mm", "40 mm", "50 mm:90 mm:10 mm"]   # a depth, or START:STOP:STEP
    levels = ["-6 dB", "-20 dB"]

    [bottom]                 # optional: a bare transducer in water over a flat bottom
    depths = ["10 m:40 m:10 m"]   # water depths (--bottom-depth), or START:STOP:STEP
    power = "100 W"               # electrical power, for an echo budget (--power)
    efficiency = 0.5              # electro-acoustic, above 0 and at most 1 (--efficiency)
    loss = "10 dB"                # the bottom's reflection loss, 0 or more (--bottom-loss)

    [conventions]            # optional
    sonar = true             # the sonar trade's conventions and figures (--sonar)
    mode = "pulse-echo"      # or "one-way" (default: the command's, one-way with sonar)
    bandwidth = 0.5          # -6 dB fractional bandwidth; 0 is a continuous wave
    spectrum = "gaussian"
    frequencies = 32

Unknown sections and keys are errors, named with the file and line.
:meth:`Setup.to_options` gives the command-line options the setup stands for.
"""

from __future__ import annotations

import json
import math
import os
import re
import sys
import tempfile
from dataclasses import dataclass, fields
from pathlib import Path

from .errors import InputError
from .units import parse_level, parse_quantity

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover - Python 3.10
    import tomli as tomllib

__all__ = ["FORMAT", "Setup", "dumps_setup", "load_setup", "parse_setup", "save_setup"]

FORMAT = 1


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
        from .field.spectrum import check_bandwidth

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
        from .sonar.footprint import depth_range

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


@dataclass(frozen=True)
class Setup:
    """A recorded setup: quantities as strings with their units, exactly as written.

    Values are checked when the setup is made (units of the right kind,
    choices known, a disc or a rectangle, a material or a speed); the
    command that uses it checks the rest (a material's existence, angles the
    wedge can reach).
    """

    frequency: str
    shape: str = "disc"
    diameter: str | None = None
    length: str | None = None
    width: str | None = None
    focus: str | None = None
    material: str | None = None
    speed: str | None = None
    wave: str | None = None  # None: the command's default (longitudinal; shear on a wedge)
    temperature: str | None = None
    conditions: tuple[tuple[str, str], ...] = ()
    wedge: str | None = None
    wedge_speed: str | None = None
    incident: str | None = None
    refracted: str | None = None
    wedge_path: str | None = None
    water_path: str | None = None
    couplant: str | None = None
    thickness: str | None = None
    depths: tuple[str, ...] = ()
    levels: tuple[str, ...] = ()
    bottom_depths: tuple[str, ...] = ()
    power: str | None = None
    efficiency: float | None = None
    bottom_loss: str | None = None
    sonar: bool | None = None  # None and False alike: not the sonar conventions
    mode: str | None = None  # None: the command's default (pulse-echo; one-way with sonar)
    bandwidth: float | None = None
    spectrum: str | None = None
    frequencies: int | None = None
    title: str | None = None
    description: str | None = None

    def __post_init__(self) -> None:
        for f in fields(self):
            value = getattr(self, f.name)
            if value is None or value == ():
                continue
            if f.name == "conditions":
                value = dict(value)
            object.__setattr__(self, f.name, _check(_BY_FIELD[f.name], value))
        if self.sonar is False:
            object.__setattr__(self, "sonar", None)
        if self.shape == "disc":
            if self.diameter is None or self.length is not None or self.width is not None:
                raise InputError("probe: a disc takes a diameter (and no length or width)")
        elif self.length is None or self.width is None or self.diameter is not None:
            raise InputError("probe: a rectangle takes a length and a width (and no diameter)")
        if (self.material is None) == (self.speed is None):
            raise InputError("medium: give either a material or a speed")
        if self.speed is not None and (self.temperature is not None or self.conditions):
            raise InputError(
                "medium: temperature and conditions describe a material; with a "
                "speed they mean nothing"
            )
        if self.wedge is not None and self.wedge_speed is not None:
            raise InputError("wedge: give either its material or its speed, not both")
        if self.incident is not None and self.refracted is not None:
            raise InputError("wedge: give either the incident or the refracted angle, not both")
        if self.power is None and (self.efficiency is not None or self.bottom_loss is not None):
            raise InputError(
                "bottom: efficiency and loss belong to the echo budget; give its power too"
            )
        if self.power is not None and not self.bottom_depths:
            raise InputError("bottom: the echo budget (power) needs the bottom's depths")
        in_water = self.sonar or self.bottom_depths
        on_setup = any(
            v is not None for v in (self.wedge, self.wedge_speed, self.water_path, self.focus)
        )
        if in_water and on_setup:
            section = "bottom" if self.bottom_depths else "conventions"
            raise InputError(
                f"{section}: sonar and a bottom describe a bare transducer in water, not "
                "a wedge, a water path or a focus"
            )

    # -------------------------------------------------------------- options

    def to_options(self) -> dict[str, object]:
        """Command-line option -> value (strings with units; lists for repeatable options).

        The mode is a flag: ``{"--pulse-echo": True}`` or ``{"--one-way": True}``,
        and so is ``{"--sonar": True}``; the power and the bottom loss are bare
        numbers in W and dB, as the command line takes them. Values not set
        are left out (the command's defaults then apply).
        """
        out: dict[str, object] = {}
        for key in _KEYS:
            value = getattr(self, key.field)
            if key.option is None or value is None or value == ():
                continue
            if key.kind == "conditions":
                out[key.option] = [f"{name}={text}" for name, text in value]
            elif key.kind in ("lengths", "levels", "water-depths"):
                out[key.option] = [str(v) for v in value]
            elif key.kind == "flag":
                out[key.option] = True
            elif key.kind in ("power", "loss"):  # the command line takes bare W and dB
                out[key.option] = f"{_in_unit(_where(key), key.kind, value):.12g}"
            else:
                out[key.option] = str(value)
        if self.mode is not None:
            out["--one-way" if self.mode == "one-way" else "--pulse-echo"] = True
        return out

    def to_args(self) -> list[str]:
        """:meth:`to_options` as an argument list: ``["--diameter", "10 mm", ...]``."""
        args: list[str] = []
        for option, value in self.to_options().items():
            if value is True:
                args.append(option)
            elif isinstance(value, list):
                for item in value:
                    args += [option, item]
            else:
                args += [option, str(value)]
        return args

    @classmethod
    def from_options(
        cls, options: dict[str, object], *, title: str | None = None, description: str | None = None
    ) -> Setup:
        """The setup a command line describes: the inverse of :meth:`to_options`.

        Values are strings with units as typed; numbers are taken in the SI
        unit the command line converts to (m, Hz, m/s, degC; angles in deg)
        and written in mm, MHz, m/s, degC or deg to 12 digits (water depths
        in m). --power and --bottom-loss, bare numbers on the command line,
        are written in W and dB. Unknown options are refused; the shape
        follows from --diameter or --length.
        """
        values: dict[str, object] = {"title": title, "description": description}
        for option, value in options.items():
            if option in _MODE_FLAGS:
                if value:
                    values["mode"] = _MODE_FLAGS[option]
                continue
            key = _BY_OPTION.get(option)
            if key is None:
                known = ", ".join(sorted([*_BY_OPTION, *_MODE_FLAGS]))
                raise InputError(
                    f"option {option}: a setup file cannot record it; it records {known}"
                )
            if value is None or value == () or value == [] or value is False:
                continue
            if key.kind == "flag":
                values[key.field] = True
            elif key.kind == "conditions":
                pairs = []
                for item in value:
                    name, text = item if isinstance(item, tuple) else str(item).split("=", 1)
                    pairs.append((name.strip(), str(text).strip()))
                values[key.field] = tuple(pairs)
            elif key.kind in ("lengths", "levels", "water-depths"):
                items = value if isinstance(value, (list, tuple)) else [value]  # one, or a list
                values[key.field] = tuple(_text(key, v) for v in items)
            else:
                values[key.field] = _text(key, value)
        values["shape"] = "rectangle" if values.get("length") is not None else "disc"
        if "frequency" not in values:
            raise InputError("setup: a probe needs a frequency")
        return cls(**{k: v for k, v in values.items() if v is not None})


_SI_UNITS = {
    "length": (1e3, "mm"),
    "lengths": (1e3, "mm"),
    "water-depths": (1.0, "m"),
    "power": (1.0, "W"),
    "loss": (1.0, "dB"),
    "frequency": (1e-6, "MHz"),
    "speed": (1.0, "m/s"),
    "temperature": (1.0, "degC"),
    "angle": (1.0, "deg"),
}


def _text(key: _Key, value):
    """A value for the file: strings as they are, SI numbers with their unit."""
    if isinstance(value, str) and key.kind in ("fraction", "efficiency", "count"):
        try:
            return int(value) if key.kind == "count" else float(value)
        except ValueError:
            raise InputError(f"{key.option}: {value!r} is not a number") from None
    if isinstance(value, str) and key.kind in ("power", "loss"):
        bare = re.fullmatch(_NUMBER + r"\s*", value)
        return f"{bare.group(1)} {_SI_UNITS[key.kind][1]}" if bare else value
    if isinstance(value, str) or key.kind in ("fraction", "efficiency", "count", "levels"):
        return value
    if key.kind in _SI_UNITS and isinstance(value, (int, float)) and not isinstance(value, bool):
        if not math.isfinite(value):
            raise InputError(f"{key.option}: {value!r} is not finite")
        factor, unit = _SI_UNITS[key.kind]
        return f"{float(value) * factor:.12g} {unit}"  # 12 digits: exact for any measured value
    return value


# ----------------------------------------------------------------- reading


def _line_of(text: str, section: str, key: str | None) -> int | None:
    """The 1-based line of ``key`` in ``[section]`` (or of the header), where it can be found."""
    current = ""
    header = re.compile(r"^\s*\[\s*([A-Za-z0-9_.\"-]+)\s*\]\s*(#.*)?$")
    for number, line in enumerate(text.splitlines(), 1):
        m = header.match(line)
        if m:
            current = m.group(1).strip('"')
            if key is None and current == section:
                return number
            continue
        if (
            key is not None
            and current == section
            and re.match(rf"^\s*(\"{re.escape(key)}\"|{re.escape(key)})\s*=", line)
        ):
            return number
    return None


def _fail(path: str, text: str, section: str, key: str | None, message: str) -> InputError:
    line = _line_of(text, section, key)
    where = path if line is None else f"{path}:{line}"
    name = f"{section}.{key}" if section and key else (key or section)
    return InputError(f"{where}: key '{name}': {message}")


def parse_setup(text: str, path: str = "<setup>") -> Setup:
    """A :class:`Setup` from TOML text; errors name ``path``, the key and its line."""
    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise InputError(f"{path}: not valid TOML: {exc}") from None
    if "format" not in data:
        raise InputError(
            f"{path}: key 'format' is missing; the first line should read format = {FORMAT}"
        )
    if data["format"] != FORMAT or isinstance(data["format"], bool):
        raise _fail(
            path,
            text,
            "",
            "format",
            f"{data['format']!r} is not a format this version reads (it reads {FORMAT})",
        )
    values: dict[str, object] = {}
    keys = {(k.section, k.key): k for k in _KEYS}
    for name, value in data.items():
        if name == "format":
            continue
        if isinstance(value, dict) and name in _SECTIONS:
            for sub, item in value.items():
                key = keys.get((name, sub))
                if key is None:
                    allowed = ", ".join(k.key for k in _KEYS if k.section == name)
                    raise _fail(path, text, name, sub, f"unknown key; [{name}] takes {allowed}")
                try:
                    values[key.field] = _check(key, item)
                except InputError as exc:
                    raise _fail(
                        path, text, name, sub, str(exc).removeprefix(f"{_where(key)}: ")
                    ) from None
            continue
        key = keys.get(("", name))
        if key is None:
            what = "section" if isinstance(value, dict) else "key"
            raise _fail(
                path,
                text,
                name if what == "section" else "",
                None if what == "section" else name,
                f"unknown {what}; a setup has format, title, "
                f"description and the sections {', '.join(_SECTIONS)}",
            )
        try:
            values[key.field] = _check(key, value)
        except InputError as exc:
            raise _fail(path, text, "", name, str(exc).removeprefix(f"{name}: ")) from None
    if "conditions" in values:
        values["conditions"] = tuple(values["conditions"])
    if "frequency" not in values:
        raise _fail(path, text, "probe", None, "the probe needs a frequency")
    try:
        return Setup(**values)
    except InputError as exc:
        section = str(exc).split(":", 1)[0]
        raise _fail(
            path, text, section if section in _SECTIONS else "", None, str(exc).split(": ", 1)[-1]
        ) from None


def load_setup(path: str | os.PathLike) -> Setup:
    """Read a setup file; InputError naming the file, key and line for anything wrong."""
    name = str(path)
    try:
        text = Path(path).read_text(encoding="utf-8")
    except FileNotFoundError:
        raise InputError(f"{name}: no such setup file") from None
    except (OSError, UnicodeDecodeError) as exc:
        raise InputError(f"{name}: cannot read the setup file: {exc}") from None
    return parse_setup(text, name)


# ----------------------------------------------------------------- writing


def _toml(value) -> str:
    if isinstance(value, str):
        return json.dumps(value, ensure_ascii=False).replace("\x7f", "\\u007f")
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, (int, float)):
        return repr(value)
    if isinstance(value, tuple) and value and isinstance(value[0], tuple):  # conditions
        return "{ " + ", ".join(f"{_toml_key(k)} = {_toml(v)}" for k, v in value) + " }"
    if isinstance(value, (tuple, list)):
        return "[" + ", ".join(_toml(v) for v in value) + "]"
    raise TypeError(f"cannot write {value!r}")  # pragma: no cover - Setup checks its values


def _toml_key(key: str) -> str:
    return key if re.fullmatch(r"[A-Za-z0-9_-]+", key) else _toml(key)


def dumps_setup(setup: Setup) -> str:
    """The TOML text of ``setup`` (what :func:`save_setup` writes)."""
    lines = [f"format = {FORMAT}"]
    for key in _KEYS:
        if key.section == "" and getattr(setup, key.field) is not None:
            lines.append(f"{key.key} = {_toml(getattr(setup, key.field))}")
    for section in _SECTIONS:
        body = []
        for key in _KEYS:
            if key.section != section:
                continue
            value = getattr(setup, key.field)
            if value is None or value == ():
                continue
            body.append(f"{key.key} = {_toml(value)}")
        if body:
            lines += ["", f"[{section}]", *body]
    return "\n".join(lines) + "\n"


def save_setup(setup: Setup, path: str | os.PathLike, *, force: bool = False) -> Path:
    """Write ``setup`` to ``path`` atomically; refuse to overwrite unless ``force``.

    Raises
    ------
    InputError
        The file exists (and not ``force``), or its folder does not.
    """
    target = Path(path)
    if not target.parent.is_dir():
        raise InputError(f"{str(path)!r}: the folder {str(target.parent)!r} does not exist")
    if target.is_dir():
        raise InputError(f"{str(path)!r} is a folder, not a file")
    if target.exists() and not force:
        raise InputError(f"{str(path)!r} exists; use --force to overwrite it")
    text = dumps_setup(setup)
    fd, temporary = tempfile.mkstemp(dir=target.parent, prefix=f".{target.name}.", suffix=".part")
    try:
        with os.fdopen(fd, "w", encoding="utf-8", newline="\n") as handle:
            handle.write(text)
        mask = os.umask(0)
        os.umask(mask)
        os.chmod(temporary, 0o666 & ~mask)
        os.replace(temporary, target)
    except BaseException:
        Path(temporary).unlink(missing_ok=True)
        raise
    return target


def recordable_options() -> frozenset[str]:
    """The command-line options a setup file records (with the mode flags)."""
    return frozenset([*_BY_OPTION, *_MODE_FLAGS])
