"""Plain-text tables for people: every table states its convention."""

from __future__ import annotations

import textwrap

from ..beam import BeamResult, level_key
from ..probes import Disc
from ..units import format_length

__all__ = ["CAUTION", "beam_table", "columns"]

CAUTION = (
    "Estimates from an ideal baffled-piston model, not a measured beam profile. Inspections "
    "follow a qualified procedure under the applicable code, by certified personnel."
)


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


def _probe_line(result: BeamResult, units: str) -> str:
    p = result.probe
    f = p.frequency
    freq = f"{f / 1e6:g} MHz" if f >= 1e6 else f"{f / 1e3:g} kHz"
    if isinstance(p, Disc):
        return f"disc element, diameter {format_length(p.diameter, units)}, {freq}"
    return (f"rectangular element, length {format_length(p.length, units)} x width "
            f"{format_length(p.width, units)}, {freq}")


def _medium_line(result: BeamResult, units: str) -> str:
    w = result.wave
    if w.medium == "given":
        return f"speed given by the user, {_speed(w.speed, units)}, {w.wave} wave"
    name = w.medium
    conditions = ", ".join(
        f"{k} {v:g} {w.condition_units.get(k, '')}".rstrip() for k, v in w.conditions.items()
    )
    where = f" at {conditions}" if conditions else ""
    return f"{name}{where}: {w.wave} wave, {_speed(w.speed, units)}  [{w.source}]"


def beam_table(result: BeamResult, units: str = "mm") -> str:
    """The human-readable report of ``beamspread beam``."""
    out: list[str] = []
    out.append(f"Beam of a {_probe_line(result, units)}")
    out.extend(textwrap.wrap(f"Medium: {_medium_line(result, units)}", 100,
                             subsequent_indent="        "))
    out.append("")
    near = result.near_field
    simple_label = "D²/4λ" if isinstance(result.probe, Disc) else "L²/4λ, L the longer side"
    rows = [
        ["wavelength", format_length(result.wavelength, units, 3), ""],
        ["near field", "none" if near is None else format_length(near, units),
         "last on-axis maximum, " + ("exact (D² − λ²)/4λ" if isinstance(result.probe, Disc)
                                     else "from the exact on-axis integral")],
        ["near field, simple", format_length(result.near_field_simple, units), simple_label],
    ]
    if result.near_field_factor is not None:
        rows.append(["near-field factor k", f"{result.near_field_factor:.3f}",
                     "near field / simple"])
    out.append(columns([["quantity", "value", "how"], *rows]))
    out.append("")
    mode = result.convention.mode
    out.append(f"Half-angles from the beam axis, {mode} "
               f"({'transmit x receive' if mode == 'pulse-echo' else 'transmit only'}), "
               "levels in dB below the on-axis peak")
    keys = [level_key(level) for level in result.levels]
    head = ["plane", "aperture", *[f"{k} dB" for k in keys], "first null"]
    rows = [
        [pl.name, format_length(pl.aperture, units),
         *[_angle(pl.half_angles[k]) for k in keys], _angle(pl.half_angles["null"])]
        for pl in result.planes
    ]
    out.append(columns([head, *rows]))
    if result.depths:
        out.append("")
        out.append(f"Beam width at depth: full width 2·z·tan(half-angle), far-field model, {mode}")
        head = ["depth", "plane", *[f"{k} dB" for k in keys]]
        rows = []
        inside = False
        for depth in result.depths:
            for pl in result.planes:
                spots = {level_key(s.level_db): s for s in pl.spots if s.depth == depth}
                flag = "" if spots[keys[0]].far_field_valid else " *"
                inside = inside or bool(flag)
                rows.append([
                    format_length(depth, units) + flag, pl.name,
                    *["none" if spots[k].width is None else format_length(spots[k].width, units)
                      for k in keys],
                ])
        out.append(columns([head, *rows]))
        if inside:
            out.append("  * inside the near field: the far-field width does not hold there")
    out.append("")
    out.extend(textwrap.wrap(CAUTION, 100))
    return "\n".join(out)
