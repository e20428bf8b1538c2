"""The text of ``beamspread section``: setup, plate, how the edges were found, footprints."""

from __future__ import annotations

import math
import textwrap

from ...units import format_length
from ..serialize.section import FIELD_REFERENCE, footprint_rule
from .common import caution_for, columns, field_description, medium_and_probe_lines
from .result import setup_shown
from .setup import setup_lines

__all__ = ["section_text"]


def section_text(result, thickness, depth, rows, plane, plot_path, units="mm") -> str:
    """The text form: what was computed, the plate's geometry and the footprints (``rows``,
    as :func:`beamspread.render.serialize.section.section_rows` gives them)."""
    beam = result.beam
    angled = result.wedge is not None
    lead = ("Angle" if angled else "Straight") + " beam on the section: a"
    lines = medium_and_probe_lines(beam.probe, beam.wave, units, lead=lead)
    if result.setup is not None:
        lines += setup_lines(result.setup, setup_shown(result), units)
    lines += _wrap(_plate(result, thickness, plane, units))
    lines += _wrap(_how(result, units))
    lines.append("")
    if depth is None:
        drawn = "the edges alone are drawn" if plot_path else "--plot FILE draws the edges"
        lines.append(f"No flaw depth (--depth), so no footprint: {drawn}.")
    else:
        origin = "the exit point" if angled else "the beam axis"
        lines.append(
            f"Footprint at the flaw depth {format_length(depth, units)}, positions along the "
            f"surface from {origin}"
        )

        def length(value):
            return "none" if value is None else format_length(value, units)

        table = [
            ["leg", "level", "sound path", "surface distance", "footprint from", "to", "width"]
        ]
        for r in rows:
            table.append(
                [
                    str(r["leg"]),
                    f"{r['level_db']:g} dB",
                    format_length(r["sound_path_m"], units),
                    format_length(r["surface_distance_m"], units),
                    length(r["near_m"]),
                    length(r["far_m"]),
                    length(r["footprint_m"]),
                ]
            )
        lines.append(columns(table))
        lines += textwrap.wrap(
            f"  footprint: {footprint_rule(result)}; none where an edge does not reach it.",
            100,
            subsequent_indent="  ",
        )
    lines.append("")
    lines += textwrap.wrap(caution_for(beam.wave.state), 100)
    return "\n".join(lines)


def _wrap(text: str) -> list[str]:
    return textwrap.wrap(text, 100, subsequent_indent="       ")


def _plate(result, thickness, plane, units) -> str:
    """The plate's line: where the axis meets the back wall and the surface again."""
    t = format_length(thickness, units)
    wave = result.beam.wave.wave
    beta = result.source.refracted
    if result.wedge is not None:
        skip = 2 * thickness * math.tan(beta)  # full skip along the surface (geometry)
        return (
            f"Plate {t} thick, {wave} at {math.degrees(beta):.2f}°: the axis meets the back "
            f"wall {format_length(skip / 2, units)} and the surface again "
            f"{format_length(skip, units)} (full skip) from the exit point"
        )
    drawn = "" if len(result.beam.planes) == 1 else f"; drawn in the {plane} plane"
    return (
        f"Plate {t} thick, {wave} wave straight down: the axis meets the back wall at a sound "
        f"path of {t} and the surface again at {format_length(2 * thickness, units)}{drawn}"
    )


def _how(result, units) -> str:
    """How the edges were found: the far-field cone or the computed field, and from what."""
    settings, mode, setup = result.settings, result.mode, result.setup
    where = ""
    focused = "focused element" if result.source.focus is not None else "element"
    if result.wedge is not None:
        element = "virtual element"
        apex = (
            f"its apex at the virtual element {format_length(setup.offset, units)} behind "
            "the exit point"
        )
    elif result.couplant is not None and result.couplant.path > 0:
        element = focused
        where = ", read at the equivalent water path (water path + depth c_part / c_water)"
        apex = "its edges leaving the element and refracted at the surface (Snell's law)"
    else:
        element = focused
        apex = "its apex at the probe's face"
    if settings is None:
        return (
            f"Edges: the far-field cone of the {mode} half-angles, {apex}; levels in "
            f"{result.beam.convention.reference}"
        )
    return (
        f"Edges: the computed field of the {element} ({field_description(settings, mode)})"
        f"{where}; levels in {FIELD_REFERENCE}"
    )
