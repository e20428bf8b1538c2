"""Click parameter types: values with units in, SI floats out."""

from __future__ import annotations

import click

from ..errors import InputError
from ..units import KINDS, is_bare, parse_level, parse_quantity

__all__ = ["CONDITION", "LEVEL", "Condition", "Level", "Quantity"]


class _Parsed(click.ParamType):
    """A parameter type that parses text and passes a value already parsed straight through.

    Defaults and a setup file's values may come already converted (``done``).
    Subclasses give ``parse``; an :class:`InputError` it raises fails the
    parameter with its message, less the kind that opens it (``prefix``).
    """

    metavar = ""
    done: type | tuple[type, ...] = float
    prefix = ""

    def get_metavar(self, param, ctx=None) -> str:
        return self.metavar

    def convert(self, value, param, ctx):
        if isinstance(value, self.done):
            return value
        try:
            return self.parse(value, param, ctx)
        except InputError as exc:
            self.fail(str(exc).removeprefix(self.prefix), param, ctx)

    def parse(self, value, param, ctx):
        raise NotImplementedError


class Quantity(_Parsed):
    """A number with an optional unit suffix; bare numbers take the kind's default unit."""

    def __init__(
        self,
        kind: str,
        positive: bool = True,
        zero: bool = False,
        plausible: tuple[float, float, str] | None = None,
        bare_hint: str = "",
    ) -> None:
        self.kind = kind
        self.positive = positive
        self.zero = zero  # with positive: 0 is allowed too
        # (low, high, "what that range is") in SI: outside, a mistake rather than a probe
        self.plausible = plausible
        self.bare_hint = bare_hint  # the unit a bare number was probably meant in
        self.name = kind
        self.metavar = kind.upper()
        self.prefix = f"{kind}: "

    def parse(self, value, param, ctx):
        result = parse_quantity(value, self.kind, what=None)
        if self.positive and (result < 0 or (result == 0 and not self.zero)):
            allowed = "0 or more" if self.zero else "above 0"
            self.fail(f"{value!r} is not allowed; it must be {allowed}", param, ctx)
        if self.plausible is not None and result != 0:
            low, high, what = self.plausible
            if not low <= abs(result) <= high:
                text = str(value).strip()
                bare = is_bare(text)
                hint = (
                    f"; a bare number is in {KINDS[self.kind].default}: did you mean "
                    f"{text}{self.bare_hint}?"
                    if bare and self.bare_hint
                    else ""
                )
                self.fail(f"{value!r} is outside {what}{hint}", param, ctx)
        return result

    def __repr__(self) -> str:
        return f"Quantity({self.kind!r})"


class Level(_Parsed):
    """A level in dB below the peak: -6, 6 and 6dB all mean 6 dB down."""

    name, metavar, prefix = "level", "DB", "level: "

    def parse(self, value, param, ctx):
        return parse_level(value)


class Condition(_Parsed):
    """NAME=VALUE; the value is converted once the medium says what unit NAME takes."""

    name, metavar, done = "condition", "NAME=VALUE", tuple

    def parse(self, value, param, ctx):
        name, sep, text = str(value).partition("=")
        name = name.strip().lower()
        if not sep or not name or not text.strip():
            self.fail(f"{value!r} is not NAME=VALUE (e.g. salinity=35 or depth=100m)", param, ctx)
        return name, text.strip()


class DepthList(_Parsed):
    """A depth, or a range START:STOP:STEP (each with a unit; bare numbers in ``unit``)."""

    name, metavar, done, prefix = "depths", "DEPTH|START:STOP:STEP", tuple, "length: "

    def __init__(self, unit: str = "m") -> None:
        self.unit = unit

    def parse(self, value, param, ctx):
        from ..sonar.footprint import depth_range

        parts = str(value).split(":")
        numbers = [parse_quantity(p, "length", default=self.unit) for p in parts]
        if len(numbers) == 1:
            if numbers[0] <= 0:
                raise InputError(f"{value!r} is not allowed; a depth must be above 0")
            return (numbers[0],)
        if len(numbers) == 3:
            return depth_range(*numbers)
        self.fail(f"{value!r} is neither a depth nor START:STOP:STEP (e.g. 5m:50m:5m)", param, ctx)


class Angle(_Parsed):
    """An angle in degrees, from 0 up to (not at) 90: "45", "45deg" or "45°"."""

    name, metavar = "angle", "DEG"

    def parse(self, value, param, ctx):
        import math

        text = str(value).strip().removesuffix("deg").removesuffix("°").strip()
        try:
            degrees = float(text)
        except ValueError:
            self.fail(f"{value!r} is not an angle in degrees", param, ctx)
        if not (math.isfinite(degrees) and 0.0 <= degrees < 90.0):
            self.fail(
                f"{value!r} is not allowed; give an angle from 0 up to (not at) 90 degrees",
                param,
                ctx,
            )
        return math.radians(degrees)


LEVEL = Level()
ANGLE = Angle()
DEPTHS = DepthList("m")  # water depths, bare numbers in m
RANGE_DEPTHS = DepthList("mm")  # depths in a part, bare numbers in mm
CONDITION = Condition()
# What beamspread models: from infrasonic sonar to acoustic microscopy, and every medium from
# heavy gases (about 130 m/s) to diamond (about 18000 m/s). A value outside is a slip of units.
LENGTH = Quantity("length", plausible=(1e-6, 2e4, "the 1 um to 20 km beamspread models"))
PATH_LENGTH = Quantity(
    "length", zero=True, plausible=(1e-6, 2e4, "the 1 um to 20 km beamspread models")
)
ELEMENT = Quantity("length", plausible=(1e-5, 10.0, "the 10 um to 10 m of transducer elements"))
FREQUENCY = Quantity(
    "frequency", plausible=(1.0, 2e9, "the 1 Hz to 2 GHz beamspread models"), bare_hint="Hz"
)
SPEED = Quantity(
    "speed", plausible=(50.0, 25000.0, "the 50 to 25000 m/s of real media"), bare_hint="km/s"
)
TEMPERATURE = Quantity("temperature", positive=False)
POWER = Quantity("power", plausible=(1e-3, 1e6, "the 1 mW to 1 MW of transducer drives"))
DECIBEL = Quantity("decibel", zero=True)

UNIT_HELP = {kind: f"{k.units} (bare number: {k.default})" for kind, k in KINDS.items()}
