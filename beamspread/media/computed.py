"""A medium given by plug-in code: speed (and absorption) equations with declared parameters."""

from __future__ import annotations

import math
import warnings
from collections.abc import Callable, Mapping
from dataclasses import dataclass

from ..errors import InputError, MaterialError
from .quantities import (
    NAME_PATTERN,
    STATES,
    Absorption,
    Listing,
    Parameter,
    Wave,
    check_wave,
    of_wave,
)

SpeedFunction = Callable[..., float]


@dataclass(frozen=True)
class ComputedMedium(Listing):
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
    aliases, category, description, note : optional, keywords only
        As :class:`~beamspread.media.quantities.Listing`.
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
        check_wave(wave)
        values, notes = self._conditions(conditions, self.parameters)
        fn = of_wave(self, wave, self.longitudinal, self.shear)
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
