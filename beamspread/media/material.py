"""A material from a TOML table: constants or temperature curves, each with a source."""

from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass

from ..errors import MaterialError
from .quantities import Listing, Parameter, Value, Wave, check_wave, of_wave


@dataclass(frozen=True)
class Material(Listing):
    """An entry of a material table: constants or temperature curves, each with a source.

    Speeds in m/s, density in kg/m3; the listing (aliases, category,
    description, note) by keyword, as :class:`~beamspread.media.quantities.Listing`.
    """

    name: str
    state: str
    longitudinal: Value
    shear: Value | None = None
    density: Value | None = None

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
        check_wave(wave)
        conditions = dict(conditions or {})
        temperature = conditions.pop("temperature", None)
        if conditions:
            raise MaterialError(
                f"{self.name} takes no condition {', '.join(sorted(conditions))}; "
                "a table material depends at most on temperature"
            )
        value = of_wave(self, wave, self.longitudinal, self.shear, " in its table")
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
