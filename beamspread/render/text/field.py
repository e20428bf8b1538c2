"""Text tables of the computed field: along the axis and across the beam."""

from __future__ import annotations

import textwrap

from ...units import format_length
from .common import caution_for, columns, field_description, medium_and_probe_lines


def _bar(level_db: float, floor: float = -40.0, width: int = 32) -> str:
    """A text bar for a level in dB between ``floor`` and 0."""
    if not level_db > floor:
        return ""
    return "#" * max(1, round(width * (1.0 - level_db / floor)))


def _profile_rows(coordinate, amplitude, units, limit=41):
    import numpy as np

    peak = float(np.max(amplitude))
    step = max(1, int(np.ceil(len(coordinate) / limit)))
    rows = []
    for c, a in zip(coordinate[::step], amplitude[::step], strict=True):
        level = 20.0 * np.log10(a / peak) if a > 0 else float("-inf")
        rows.append(
            [
                format_length(float(c), units),
                f"{a:.4g}",
                "-inf" if not np.isfinite(level) else f"{level:.1f}",
                _bar(level),
            ]
        )
    return rows, step


def axial_table(
    probe, wave, settings, mode, profile, near, simple, axial, units="mm", *, coordinate="depth"
) -> str:
    """The human-readable report of ``beamspread axis``."""
    out = medium_and_probe_lines(probe, wave, units)
    out.append(f"Field: {field_description(settings, mode)}")
    out.append("")
    rows = [
        ["near field (continuous wave)", "none" if near is None else format_length(near, units)],
        ["near field, simple", format_length(simple, units)],
        [
            "last on-axis maximum of this pulse",
            "none" if axial is None else format_length(axial, units),
        ],
    ]
    out.append(columns([["quantity", "value"], *rows]))
    out.append("")
    table, step = _profile_rows(profile.depth, profile.amplitude, units)
    out.append("On-axis amplitude; dB relative to the largest in the profile")
    out.append(columns([[coordinate, "amplitude", "dB", ""], *table]))
    if step > 1:
        out.append(
            f"  every {step}th of {len(profile.depth)} points shown; --format csv gives them all"
        )
    out.append("")
    out.extend(textwrap.wrap(caution_for(wave.state), 100))
    return "\n".join(out)


def across_table(probe, wave, settings, mode, depth, profiles, widths, units="mm") -> str:
    """The human-readable report of ``beamspread across``."""
    out = medium_and_probe_lines(probe, wave, units)
    out.append(f"Field: {field_description(settings, mode)}; depth {format_length(depth, units)}")
    for profile in profiles:
        out.append("")
        found = ", ".join(
            f"-{w.level_db:g} dB: "
            + ("none" if w.width != w.width else format_length(w.width, units))
            for w in widths[profile.plane]
        )
        out.append(f"Plane {profile.plane}: full width {found}")
        table, step = _profile_rows(profile.offset, profile.amplitude, units)
        out.append(columns([["offset", "amplitude", "dB", ""], *table]))
        if step > 1:
            out.append(
                f"  every {step}th of {len(profile.offset)} offsets shown; "
                "--format csv gives them all"
            )
    out.append("")
    out.append(
        "dB relative to the largest amplitude across the beam at this depth; widths "
        "between the outermost crossings."
    )
    out.extend(textwrap.wrap(caution_for(wave.state), 100))
    return "\n".join(out)
