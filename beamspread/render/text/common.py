"""What every text table shares: cautions, columns, the probe, medium and field lines."""

from __future__ import annotations

import textwrap

from ...units import format_length

CAUTION = (
    "Estimates from an ideal baffled-piston model, not a measured beam profile. Inspections "
    "follow a qualified procedure under the applicable code, by certified personnel."
)
SONAR_CAUTION = (
    "Estimates from an ideal baffled-piston model, not a measured beam. Underwater sound can "
    "harm aquatic life and its use may be regulated locally; transmitters carry high voltage."
)
AIRBORNE_CAUTION = (
    "Estimates from an ideal baffled-piston model, not a measured beam. Intense airborne "
    "ultrasound can harm hearing and disturb animals; transmitters carry high voltage."
)


def caution_for(state: str | None) -> str:
    """The closing caution that fits the medium: a part (solid), water (liquid) or air (gas)."""
    if state == "gas":
        return AIRBORNE_CAUTION
    if state == "liquid":
        return SONAR_CAUTION
    return CAUTION


def columns(rows: list[list[str]], indent: int = 2, gap: int = 3) -> str:
    """Left-aligned columns, the first row a heading."""
    widths = [max(len(r[i]) for r in rows) for i in range(len(rows[0]))]
    lines = []
    for row in rows:
        cells = [cell.ljust(widths[i]) for i, cell in enumerate(row)]
        lines.append(" " * indent + (" " * gap).join(cells).rstrip())
    return "\n".join(lines)


def _angle(value: float | None) -> str:
    return "none" if value is None else f"{value:.2f}°"


def _speed(speed: float, units: str) -> str:
    if units == "in":
        return f"{speed / 0.0254 / 1e6:.4f} in/µs"
    return f"{speed:.1f} m/s" if speed < 1e4 else f"{speed:.0f} m/s"


def _probe_line(p, units: str) -> str:
    f = p.frequency
    freq = f"{f / 1e6:g} MHz" if f >= 1e6 else f"{f / 1e3:g} kHz"
    sizes = " x ".join(f"{name} {format_length(v, units)}" for name, v in p.sizes().items())
    return f"{p.noun} element, {sizes}, {freq}"


def _wave_line(w, units: str) -> str:
    """The medium, its conditions, the wave and its speed, with the speed's source."""
    if w.medium == "given":
        return f"speed given by the user, {_speed(w.speed, units)}, {w.wave} wave"
    conditions = conditions_text(w)
    where = f" at {conditions}" if conditions else ""
    return f"{w.medium}{where}: {w.wave} wave, {_speed(w.speed, units)}  [{w.source}]"


def conditions_text(w) -> str:
    """A wave's conditions as text: "temperature 12 degC, salinity 35 g/kg"."""
    return ", ".join(
        f"{k} {v:g} {w.condition_units.get(k, '')}".rstrip() for k, v in w.conditions.items()
    )


def field_description(settings, mode: str) -> str:
    """One phrase naming how a computed field was formed."""
    if settings.bandwidth == 0:
        pulse = "a continuous wave"
    else:
        pulse = (
            f"a {settings.spectrum} spectrum of -6 dB bandwidth {settings.bandwidth:g} "
            f"({settings.frequencies} frequencies)"
        )
    return f"{mode}, {pulse}"


def medium_and_probe_lines(probe, wave, units, lead: str = "Computed field of a") -> list[str]:
    """The probe line and the medium line that head a result: what was computed, in what."""
    lines = [f"{lead} {_probe_line(probe, units)}"]
    lines.extend(
        textwrap.wrap(f"Medium: {_wave_line(wave, units)}", 100, subsequent_indent="        ")
    )
    return lines


def _len_or_none(value, units):
    return "none" if value is None else format_length(value, units)
