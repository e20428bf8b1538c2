"""The text table of a sized probe (disc, frequency, rectangle side or smallest spot)."""

from __future__ import annotations

import textwrap

from ...units import format_length
from .common import _angle, _wave_line, caution_for, columns


def design_table(found, wave, units="mm") -> str:
    """The human-readable answer of ``beamspread size``."""
    f = found.frequency
    freq = f"{f / 1e6:.4g} MHz" if f >= 1e6 else f"{f / 1e3:.4g} kHz"
    if found.solved == "diameter":
        answer = f"disc diameter {format_length(found.aperture, units)}"
    elif found.solved == "frequency":
        answer = f"frequency {freq}"
    else:
        answer = (
            f"side {format_length(found.aperture, units)} (beside the given "
            f"{format_length(found.other_side, units)})"
        )
    rows = [
        ["frequency", freq],
        ["wavelength", format_length(found.wavelength, units, 3)],
        ["half-angle", f"{found.half_angle_deg:.2f}°"],
        ["full angle", f"{found.full_angle_deg:.2f}°"],
        [
            "near field",
            "none"
            if found.near_field != found.near_field
            else format_length(found.near_field, units),
        ],
        ["directivity index", f"{found.directivity_index_db:.2f} dB"],
    ]
    if found.other_half_angle_deg is not None:
        rows.append(
            [
                "half-angle in the other plane",
                _angle(
                    None
                    if found.other_half_angle_deg != found.other_half_angle_deg
                    else float(found.other_half_angle_deg)
                ),
            ]
        )
    if found.depth == found.depth:
        flag = "" if found.far_field_at_depth else "  (inside the near field: does not hold)"
        rows.append(
            [
                f"width at {format_length(found.depth, units)}",
                format_length(found.footprint_width, units) + flag,
            ]
        )
    out = [
        f"Solution: {answer}",
        f"for -{found.level_db if found.level_db > 0 else -found.level_db:g} dB, {found.mode}",
        *textwrap.wrap(f"Medium: {_wave_line(wave, units)}", 100, subsequent_indent="        "),
        "",
        columns([["quantity", "value"], *rows]),
        "",
    ]
    caution = caution_for(wave.state)
    out.extend(textwrap.wrap(caution, 100))
    return "\n".join(out)
