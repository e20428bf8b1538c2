"""The :class:`Setup` a setup file records, and its command-line options both ways."""

from __future__ import annotations

import math
import re
from dataclasses import dataclass, fields

from ..errors import InputError
from ..media.resolve import check_part_medium
from ..probes import check_sizes
from .keys import _BY_FIELD, _BY_OPTION, _KEYS, _MODE_FLAGS, _NUMBER, _check, _in_unit, _Key, _where

__all__ = ["Setup"]


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
        sizes = ("diameter", "length", "width")
        check_sizes(self.shape, [name for name in sizes if getattr(self, name) is not None])
        check_part_medium(self.material, self.speed, self.temperature, self.conditions)
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
