"""The lines that describe a wedge or immersion set-up above its beam table."""

from __future__ import annotations

import textwrap

from ...units import format_length
from .common import _len_or_none


def setup_lines(setup, extra, units="mm") -> list[str]:
    """The lines that describe an inspection setup, for the top of the beam table."""
    import math

    def deg(rad):
        return "none" if rad is None else f"{math.degrees(rad):.2f}°"

    lines = []
    if setup.refraction is not None:
        r, w = setup.refraction, extra["wedge"]
        lines.append(
            f"Setup: wedge {w['name']} ({w['speed_m_s']:.1f} m/s), wedge path "
            f"{format_length(w['path_m'], units)}; incident {deg(r.incident)}; "
            f"refracted longitudinal {deg(r.longitudinal)}, shear {deg(r.shear)}; "
            f"critical angles {deg(r.first_critical)} and {deg(r.second_critical)}"
        )
        lines.append(
            f"       effective aperture in the incidence plane "
            f"{format_length(setup.effective_aperture, units)}; near field in the "
            f"part {_len_or_none(setup.near_field_in_part, units)}"
        )
    elif setup.setup == "focused":
        kind = setup.beam.probe.focus_description
        lines.append(f"Setup: {kind} straight in {setup.beam.wave.medium}, no water path")
    else:
        c = extra["couplant"]
        at = c.get("at", "")
        lines.append(
            f"Setup: immersion in {c['name']}{' at ' + at if at else ''} "
            f"({c['speed_m_s']:.1f} m/s), water path "
            f"{format_length(c['path_m'], units)}; near field in the part "
            f"{_len_or_none(setup.near_field_in_part, units)}"
            + (
                ""
                if setup.transmission is None
                else f"; pressure transmission into the part {setup.transmission:.3f}"
            )
        )
    f = setup.focus
    if f is not None:
        zone = (
            "none"
            if f.zone is None
            else f"{format_length(f.zone[0], units)} to {format_length(f.zone[1], units)}"
        )
        where = "from the face" if setup.setup == "focused" else "in the couplant"
        lines.append(
            f"       focus: S = F/N {f.normalised_focal_length:.3f}; on-axis maximum "
            f"at {format_length(f.axial_maximum, units)} {where}; focal spot "
            f"{format_length(f.spot_width, units)}; zone {zone} (rule of thumb "
            f"N·S²·2/(1 + S/2): {format_length(f.zone_rule_of_thumb, units)} long)"
        )
        if f.focal_depth_in_part is not None:
            lines.append(
                f"       focal depth in the part (paraxial) "
                f"{format_length(f.focal_depth_in_part, units)}"
                + (" - a poor estimate here" if f.paraxial_poor else "")
            )
    return [
        line for text in lines for line in textwrap.wrap(text, 100, subsequent_indent="       ")
    ]
