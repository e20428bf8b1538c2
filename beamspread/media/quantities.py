"""What a medium gives and is described by: names, values with sources, curves, parameters, waves.

A *medium* is anything that can give a sound speed for a wave mode under
given conditions. Two kinds exist and both present the same interface,
:meth:`evaluate`, which returns a :class:`Wave`: a
:class:`~beamspread.media.material.Material` read from a TOML table, and a
:class:`~beamspread.media.computed.ComputedMedium` given by a plug-in.

Units inside: m/s, kg/m3, and each parameter in the unit it declares
(temperature in degC).
"""

from __future__ import annotations

import math
import re
from collections.abc import Mapping
from dataclasses import dataclass, field

import numpy as np

from ..errors import InputError, MaterialError

WAVES = ("longitudinal", "shear")
STATES = ("solid", "liquid", "gas")
NAME_PATTERN = re.compile(r"^[a-z][a-z0-9]*(?:-[a-z0-9]+)*$")


def normalise_name(name: str) -> str:
    """The lookup key of a name: lower case, runs of spaces, '_' and '/' become '-'.

    >>> normalise_name("Stainless Steel_316")
    'stainless-steel-316'
    """
    return re.sub(r"[\s_/]+", "-", name.strip().lower())


@dataclass(frozen=True, kw_only=True)
class Listing:
    """How a medium is listed (the base of every kind of medium; keywords only).

    ``aliases``: other names it is found by; ``category`` (metal, plastic,
    liquid...), a one-line ``description`` and a ``note`` for the listing.
    """

    aliases: tuple[str, ...] = ()
    category: str | None = None
    description: str | None = None
    note: str | None = None


@dataclass(frozen=True)
class Curve:
    """A quantity tabulated against temperature (degC), interpolated linearly.

    Outside the tabulated range the value is refused, not extrapolated.
    """

    temperature_c: tuple[float, ...]
    values: tuple[float, ...]

    def at(self, temperature_c: float, what: str) -> float:
        lo, hi = self.temperature_c[0], self.temperature_c[-1]
        if not lo <= temperature_c <= hi:
            raise InputError(
                f"temperature {temperature_c:g} degC is outside the table of {what}, "
                f"which covers {lo:g} to {hi:g} degC"
            )
        return float(np.interp(temperature_c, self.temperature_c, self.values))


@dataclass(frozen=True)
class Value:
    """A constant (``value``) or a temperature curve (``curve``), in SI, with its source."""

    source: str
    value: float | None = None
    curve: Curve | None = None
    note: str | None = None

    def at(self, temperature_c: float | None, what: str) -> float:
        if self.curve is None:
            assert self.value is not None
            return self.value
        if temperature_c is None:
            raise InputError(
                f"{what} depends on temperature; give the temperature", remedy=("temperature", None)
            )
        return self.curve.at(temperature_c, what)

    @property
    def reference(self) -> float:
        """The constant, or the curve's value at its middle point (for listings)."""
        if self.curve is None:
            assert self.value is not None
            return self.value
        return self.curve.values[len(self.curve.values) // 2]


@dataclass(frozen=True)
class Parameter:
    """A condition a computed medium depends on.

    Parameters
    ----------
    name : str
        The condition's name as the user gives it (``temperature``, ``salinity``...).
    kind : str
        One of :data:`beamspread.units.KINDS`; decides which units the user may give.
    unit : str
        The unit the equation takes (e.g. ``"degC"``, ``"g/kg"``, ``"m"``).
    default : float
        Used when the user gives nothing, in ``unit``.
    valid : (float, float)
        The range the equation was fitted to: outside it, a warning.
    limits : (float, float)
        Where the equation stops meaning anything: outside it, a refusal.
    description : str
        One line for listings.
    """

    name: str
    kind: str
    unit: str
    default: float
    valid: tuple[float, float]
    limits: tuple[float, float]
    description: str = ""

    def __post_init__(self) -> None:
        lo, hi = self.limits
        vlo, vhi = self.valid
        if not lo <= vlo < vhi <= hi:
            raise ValueError(f"parameter {self.name}: the valid range must lie within the limits")
        if not vlo <= self.default <= vhi:
            raise ValueError(f"parameter {self.name}: the default must lie in the valid range")

    def check(self, value: float, medium: str, quantity: str = "speed") -> list[str]:
        """Refuse a value outside the limits; return warnings for one outside the valid range.

        ``quantity`` names what the equation gives ("speed", "absorption") in the warning.
        """
        unit = f" {self.unit}" if self.unit else ""
        lo, hi = self.limits
        if not math.isfinite(value) or not lo <= value <= hi:
            raise InputError(
                f"{self.name} {value:g}{unit} is not allowed for {medium}; "
                f"its equation means nothing outside {lo:g} to {hi:g}{unit}"
            )
        vlo, vhi = self.valid
        if not vlo <= value <= vhi:
            return [
                f"{self.name} {value:g}{unit} lies outside the range {vlo:g} to "
                f"{vhi:g}{unit} that the {medium} {quantity} equation was fitted to; "
                f"the {quantity} is an extrapolation"
            ]
        return []


@dataclass(frozen=True)
class Wave:
    """A sound speed resolved for one medium, wave mode and set of conditions."""

    medium: str
    wave: str
    speed: float
    source: str
    state: str | None = None
    conditions: Mapping[str, float] = field(default_factory=dict)
    condition_units: Mapping[str, str] = field(default_factory=dict)
    density: float | None = None
    warnings: tuple[str, ...] = ()

    @classmethod
    def given(cls, speed: float, wave: str = "longitudinal") -> Wave:
        """A speed given directly by the user."""
        from ..probes import check_positive

        return cls(
            medium="given",
            wave=wave,
            speed=check_positive(speed, "speed", "m/s"),
            source="given by the user",
        )


def check_wave(wave: str) -> None:
    if wave not in WAVES:
        raise InputError(f"wave mode {wave!r} is unknown; use one of {', '.join(WAVES)}")


def of_wave(medium, wave: str, longitudinal, shear, where: str = ""):
    """``longitudinal`` or ``shear``, as ``wave`` asks; a medium without shear refuses it.

    ``medium`` gives its name and state to the message; ``where`` says where the
    shear wave is missing (" in its table").
    """
    chosen = longitudinal if wave == "longitudinal" else shear
    if chosen is None:
        raise MaterialError(
            f"{medium.name} is a {medium.state} and carries no shear wave{where}; "
            "use the longitudinal wave",
            remedy=("wave", "longitudinal"),
        )
    return chosen


@dataclass(frozen=True)
class Absorption:
    """The absorption of sound in a medium at one frequency and set of conditions."""

    medium: str
    frequency: float  # Hz
    db_per_km: float
    source: str
    conditions: Mapping[str, float] = field(default_factory=dict)
    condition_units: Mapping[str, str] = field(default_factory=dict)
    warnings: tuple[str, ...] = ()

    @property
    def db_per_m(self) -> float:
        return self.db_per_km / 1e3
