"""From a medium's name (or a speed) and its conditions to the wave the physics uses."""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

from ..errors import BeamspreadError, InputError
from ..units import from_si, parse_quantity

__all__ = ["Resolved", "check_part_medium", "named_wave", "resolve_part"]


@dataclass(frozen=True)
class Resolved:
    """A resolved medium: the wave, and where it came from.

    ``medium`` and ``registry`` are None for a given speed; ``conditions`` are
    the values used, each in the unit the medium declares.
    """

    wave: Any  # beamspread.media.Wave
    registry: Any = None
    medium: Any = None  # Material or ComputedMedium
    conditions: dict = field(default_factory=dict)

    @property
    def warnings(self) -> list[str]:
        return list(self.registry.warnings if self.registry else []) + list(self.wave.warnings)

    def absorption(self, frequency: float):
        """The :class:`~beamspread.media.quantities.Absorption` at ``frequency``, or None."""
        if self.medium is None:
            return None
        return self.medium.evaluate_absorption(frequency, self.conditions)

    def speeds(self) -> tuple[float | None, float | None]:
        """The longitudinal and shear speeds, m/s (None where the medium has no such wave)."""
        wave = self.wave
        if self.medium is None:
            return (wave.speed, None) if wave.wave == "longitudinal" else (None, wave.speed)
        out = []
        for mode in ("longitudinal", "shear"):
            if mode == wave.wave:
                out.append(wave.speed)
                continue
            try:
                out.append(self.medium.evaluate(mode, self.conditions).speed)
            except BeamspreadError:  # a liquid, or a table without that wave
                out.append(None)
        return tuple(out)


def check_part_medium(material, speed, temperature, conditions) -> None:
    """A part's medium is a material by name or a speed; a speed takes no temperature or conditions.

    Raises
    ------
    InputError
        Neither or both of a material and a speed, or a speed with a
        temperature or conditions.
    """
    if (material is None) == (speed is None):
        raise InputError("medium: give either a material or a speed")
    if speed is not None and (temperature is not None or conditions):
        raise InputError(
            "medium: temperature and conditions describe a material; with a speed they mean nothing"
        )


def resolve_part(
    registry,
    material: str | None,
    wave: str | None,
    speed: float | None,
    temperature: float | None,
    conditions=(),
    *,
    temperature_elsewhere: bool = False,
) -> Resolved:
    """The part's wave from a material (at its temperature and conditions) or a speed.

    ``temperature_elsewhere``: the temperature also sets another medium (a
    wedge's or a couplant's speed by name), so a part that does not depend on
    it takes no notice of it.

    Raises
    ------
    InputError
        Neither or both of a material and a speed; a condition the medium does
        not declare, or one given twice.
    MaterialError
        No material of that name.
    """
    from .quantities import Wave

    wave = wave or "longitudinal"
    if (material is None) == (speed is None):
        raise InputError("medium: give either a material by name or a speed")
    if speed is not None:
        if temperature_elsewhere:
            temperature = None
        if temperature is not None or conditions:
            raise InputError(
                "medium: a temperature and conditions describe a material; "
                "with a speed they mean nothing"
            )
        return Resolved(Wave.given(speed, wave))
    medium = registry.get(material).medium
    values: dict[str, float] = {}
    if (
        temperature is not None
        and temperature_elsewhere
        and medium.parameter("temperature") is None
        and not getattr(medium, "depends_on_temperature", False)
    ):
        temperature = None  # it is the couplant's or the wedge's
    if temperature is not None:
        declared = medium.parameter("temperature")
        unit = declared.unit if declared is not None else "degC"
        values["temperature"] = from_si(temperature, "temperature", unit)
    for name, text in conditions:
        if name in values:
            raise InputError(f"condition {name}: given twice (or with the temperature)")
        parameter = medium.parameter(name)
        if parameter is None and name == "temperature":
            values[name] = parse_quantity(text, "temperature", what=f"condition {name}")
            continue
        if parameter is None:
            declared = ", ".join(p.name for p in medium.parameters) or "none"
            raise InputError(
                f"condition {name}: {medium.name} does not depend on {name}; "
                f"it declares: {declared}"
            )
        si = parse_quantity(text, parameter.kind, what=f"condition {name}", default=parameter.unit)
        values[name] = from_si(si, parameter.kind, parameter.unit)
    return Resolved(medium.evaluate(wave, values), registry, medium, values)


def named_wave(registry, name: str, temperature: float | None):
    """The longitudinal wave of a named wedge or couplant (at ``temperature`` where it varies)."""
    medium = registry.get(name).medium
    conditions = {}
    if temperature is not None and (
        medium.parameter("temperature") is not None
        or getattr(medium, "depends_on_temperature", False)
    ):
        conditions["temperature"] = temperature
    return medium.evaluate("longitudinal", conditions)
