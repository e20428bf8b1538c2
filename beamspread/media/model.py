"""Materials and media: what a sound speed is, where it came from, what it depends on.

A *medium* is anything that can give a sound speed for a wave mode under
given conditions. Two kinds exist and both present the same interface,
:meth:`evaluate`, which returns a :class:`Wave`:

* :class:`Material`, read from a TOML table: constants, or a curve against
  temperature, each value with its source;
* :class:`ComputedMedium`, given by Python code in a plug-in: a speed
  equation with declared parameters, units, defaults and ranges.

Units inside: m/s, kg/m3, and each parameter in the unit it declares
(temperature in degC).
"""

from __future__ import annotations

import math
import re
import warnings
from collections.abc import Callable, Mapping
from dataclasses import dataclass, field

import numpy as np

from ..errors import InputError, MaterialError

__all__ = [
    "STATES",
    "WAVES",
    "Absorption",
    "ComputedMedium",
    "Curve",
    "Material",
    "Parameter",
    "Value",
    "Wave",
    "normalise_name",
]

WAVES = ("longitudinal", "shear")
STATES = ("solid", "liquid", "gas")
NAME_PATTERN = re.compile(r"^[a-z][a-z0-9]*(?:-[a-z0-9]+)*$")


def normalise_name(name: str) -> str:
    """The lookup key of a name: lower case, runs of spaces, '_' and '/' become '-'.

    >>> normalise_name("Stainless Steel_316")
    'stainless-steel-316'
    """
    return re.sub(r"[\s_/]+", "-", name.strip().lower())


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
            raise InputError(f"{what} depends on temperature; give --temperature")
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


def _check_wave(wave: str) -> None:
    if wave not in WAVES:
        raise InputError(f"wave mode {wave!r} is unknown; use one of {', '.join(WAVES)}")


@dataclass(frozen=True)
class Material:
    """An entry of a material table: constants or temperature curves, each with a source.

    Speeds in m/s, density in kg/m3.
    """

    name: str
    state: str
    longitudinal: Value
    shear: Value | None = None
    density: Value | None = None
    aliases: tuple[str, ...] = ()
    category: str | None = None
    description: str | None = None
    note: str | None = None

    kind = "table"

    @property
    def parameters(self) -> tuple[Parameter, ...]:
        return ()

    def parameter(self, name: str) -> Parameter | None:
        """A table declares no computed conditions (temperature is handled by its curves)."""
        return None

    def evaluate_absorption(self, frequency: float, conditions=None) -> None:
        """Tables carry no absorption."""
        return None

    @property
    def depends_on_temperature(self) -> bool:
        return any(
            v is not None and v.curve is not None
            for v in (self.longitudinal, self.shear, self.density)
        )

    def evaluate(
        self, wave: str = "longitudinal", conditions: Mapping[str, float] | None = None
    ) -> Wave:
        """The speed of ``wave`` in this material.

        Only ``temperature`` (degC) is understood, and only where the table
        gives a curve; otherwise a given temperature is reported as ignored.
        """
        _check_wave(wave)
        conditions = dict(conditions or {})
        temperature = conditions.pop("temperature", None)
        if conditions:
            raise MaterialError(
                f"{self.name} takes no condition {', '.join(sorted(conditions))}; "
                "a table material depends at most on temperature"
            )
        value = self.longitudinal if wave == "longitudinal" else self.shear
        if value is None:
            raise MaterialError(
                f"{self.name} is a {self.state} and carries no shear wave in its table; "
                "use --wave longitudinal"
            )
        notes: list[str] = []
        used: dict[str, float] = {}
        if temperature is not None:
            if self.depends_on_temperature:
                used["temperature"] = temperature
            else:
                notes.append(
                    f"{self.name} has constant values in its table; "
                    f"temperature {temperature:g} degC ignored"
                )
        return Wave(
            medium=self.name,
            wave=wave,
            speed=value.at(temperature, f"{self.name} {wave} speed"),
            source=value.source,
            state=self.state,
            conditions=used,
            condition_units={"temperature": "degC"} if used else {},
            density=(
                None
                if self.density is None
                else self.density.at(temperature, f"{self.name} density")
            ),
            warnings=tuple(notes),
        )


SpeedFunction = Callable[..., float]


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


@dataclass(frozen=True)
class ComputedMedium:
    """A medium whose speed comes from an equation in its conditions.

    Parameters
    ----------
    name : str
        Lookup name (lower case, digits, hyphens).
    state : {"solid", "liquid", "gas"}
    longitudinal : callable
        ``f(**conditions) -> speed in m/s``, called with every declared
        parameter by keyword, each in its declared unit.
    source : str
        The published equation, named.
    parameters : tuple of Parameter
    shear : callable, optional
        As ``longitudinal``, for solids.
    density : callable, optional
        ``f(**conditions) -> kg/m3``.
    density_source : str, optional
    aliases, description : optional
    absorption : callable, optional
        ``f(frequency, **conditions) -> dB/km``: the absorption coefficient at
        ``frequency`` (Hz), called with every parameter and absorption
        parameter by keyword, each in its declared unit.
    absorption_source : str, optional
        The published absorption equation, named.
    absorption_parameters : tuple of Parameter, optional
        Conditions only the absorption depends on (the pH of seawater, say).
        :meth:`evaluate` accepts and range-checks them but does not pass them
        to the speed equation.
    absorption_frequency : (float, float), optional
        The frequencies (Hz) the absorption equation was fitted to: outside,
        a warning.
    derived : callable, optional
        ``f(**conditions) -> {name: value}``: conditions the medium works out
        from the others (the sea pressure from a depth, say), called as the
        speed is; results show these values in place of the defaults, so a
        record never shows a depth of 0 beside a pressure of 1000 dbar.

    Examples
    --------
    >>> m = ComputedMedium("demo-gas", "gas", lambda temperature: 331.3 + 0.6 * temperature,
    ...     source="a linear demo law", parameters=(Parameter("temperature", "temperature",
    ...     "degC", 20.0, (-40.0, 60.0), (-200.0, 500.0)),))
    >>> m.evaluate().speed
    343.3
    """

    name: str
    state: str
    longitudinal: SpeedFunction
    source: str
    parameters: tuple[Parameter, ...] = ()
    shear: SpeedFunction | None = None
    density: SpeedFunction | None = None
    density_source: str | None = None
    aliases: tuple[str, ...] = ()
    description: str | None = None
    category: str | None = None
    note: str | None = None
    absorption: Callable[..., float] | None = None
    absorption_source: str | None = None
    absorption_parameters: tuple[Parameter, ...] = ()
    absorption_frequency: tuple[float, float] | None = None
    derived: Callable[..., Mapping[str, float]] | None = None

    kind = "computed"

    def __post_init__(self) -> None:
        if not NAME_PATTERN.match(self.name):
            raise ValueError(
                f"medium name {self.name!r}: use lower-case letters, digits and hyphens"
            )
        if self.state not in STATES:
            raise ValueError(f"medium {self.name}: state must be one of {', '.join(STATES)}")
        object.__setattr__(self, "aliases", tuple(self.aliases))
        object.__setattr__(self, "parameters", tuple(self.parameters))
        object.__setattr__(self, "absorption_parameters", tuple(self.absorption_parameters))
        names = [p.name for p in (*self.parameters, *self.absorption_parameters)]
        if len(set(names)) != len(names):
            raise ValueError(f"medium {self.name}: a parameter is declared twice")

    def parameter(self, name: str) -> Parameter | None:
        """The declared condition ``name`` (speed or absorption), or None."""
        return next(
            (p for p in (*self.parameters, *self.absorption_parameters) if p.name == name), None
        )

    def _conditions(self, conditions, parameters) -> tuple[dict[str, float], list[str]]:
        """Check names and ranges; fill defaults. Returns the values and the warnings."""
        conditions = dict(conditions or {})
        known = {p.name for p in (*self.parameters, *self.absorption_parameters)}
        unknown = sorted(set(conditions) - known)
        if unknown:
            declared = (
                ", ".join(p.name for p in (*self.parameters, *self.absorption_parameters)) or "none"
            )
            raise MaterialError(
                f"{self.name} takes no condition {', '.join(unknown)}; it declares: {declared}"
            )
        notes: list[str] = []
        values: dict[str, float] = {}
        for p in self.parameters:
            v = float(conditions.get(p.name, p.default))
            warned = p.check(v, self.name)
            if p in parameters:
                values[p.name] = v
                notes.extend(warned)
        for p in self.absorption_parameters:
            v = float(conditions.get(p.name, p.default))
            warned = p.check(v, self.name, "absorption")  # refuses beyond the limits
            if p in parameters:
                values[p.name] = v
                notes.extend(warned)
        return values, notes

    def _shown(self, values: dict[str, float]) -> dict[str, float]:
        """The conditions as results show them: the given ones and what they imply."""
        if self.derived is None:
            return values
        speed_values = {p.name: values[p.name] for p in self.parameters}
        return {**values, **{k: float(v) for k, v in self.derived(**speed_values).items()}}

    def evaluate_absorption(
        self, frequency: float, conditions: Mapping[str, float] | None = None
    ) -> Absorption | None:
        """The absorption at ``frequency`` (Hz) under ``conditions``; None if not declared.

        Defaults fill the conditions not given. Every condition is refused
        outside its limits, as :meth:`evaluate` refuses it; the warnings are
        those of the absorption-only conditions and of a frequency outside
        ``absorption_frequency`` (the speed conditions warn in :meth:`evaluate`,
        so a caller that shows both does not see them twice).
        """
        if self.absorption is None:
            return None
        from ..probes import check_positive

        frequency = check_positive(frequency, "frequency", "Hz")
        every = (*self.parameters, *self.absorption_parameters)
        values, _ = self._conditions(conditions, every)
        notes = [
            w
            for p in self.absorption_parameters
            for w in p.check(values[p.name], self.name, "absorption")
        ]
        if self.absorption_frequency is not None:
            lo, hi = self.absorption_frequency
            if not lo <= frequency <= hi:
                notes.append(
                    f"frequency {frequency:g} Hz lies outside the range {lo:g} to {hi:g} Hz "
                    f"that the {self.name} absorption equation was fitted to; "
                    "the absorption is an extrapolation"
                )
        with warnings.catch_warnings():
            warnings.simplefilter("error")
            alpha = float(self.absorption(frequency, **values))
        if not math.isfinite(alpha) or alpha < 0:
            raise InputError(
                f"{self.name}: the absorption equation gives no valid value "
                f"for {values} at {frequency:g} Hz"
            )
        return Absorption(
            medium=self.name,
            frequency=frequency,
            db_per_km=alpha,
            source=self.absorption_source or "",
            conditions=self._shown(values),
            condition_units={p.name: p.unit for p in every},
            warnings=tuple(notes),
        )

    def absorption_db_per_km(
        self, frequency: float, conditions: Mapping[str, float] | None = None
    ) -> float | None:
        """The absorption coefficient at ``frequency`` (Hz), dB/km; None if not declared.

        See :meth:`evaluate_absorption` for the same with its source and warnings.
        """
        result = self.evaluate_absorption(frequency, conditions)
        return None if result is None else result.db_per_km

    def evaluate(
        self, wave: str = "longitudinal", conditions: Mapping[str, float] | None = None
    ) -> Wave:
        """The speed of ``wave`` under ``conditions`` (defaults fill the rest)."""
        _check_wave(wave)
        values, notes = self._conditions(conditions, self.parameters)
        fn = self.longitudinal if wave == "longitudinal" else self.shear
        if fn is None:
            raise MaterialError(
                f"{self.name} is a {self.state} and carries no shear wave; use --wave longitudinal"
            )
        with warnings.catch_warnings():
            warnings.simplefilter("error")
            speed = float(fn(**values))
        if not math.isfinite(speed) or speed <= 0:
            raise InputError(f"{self.name}: the equation gives no valid speed for {values}")
        density = None if self.density is None else float(self.density(**values))
        if density is not None and (not math.isfinite(density) or density <= 0):
            raise InputError(
                f"{self.name}: the density equation gives no valid density for {values}"
            )
        return Wave(
            medium=self.name,
            wave=wave,
            speed=speed,
            source=self.source,
            state=self.state,
            conditions=self._shown(values),
            condition_units={p.name: p.unit for p in self.parameters},
            density=density,
            warnings=tuple(notes),
        )
