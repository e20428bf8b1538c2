"""The beam table: a probe's near field, divergence and spots at depth, with sonar figures."""

from __future__ import annotations

import textwrap
from collections.abc import Sequence

from ...beam import BeamResult, level_key
from ...conventions import Coupling
from ...units import format_length
from .common import _angle, caution_for, columns, field_description, medium_and_probe_lines


def _sonar_lines(di, absorption, figures, units) -> list[str]:
    rows = []
    if di is not None:
        rows.append(
            ["directivity index", f"{di:.2f} dB", figures.directivity_method if figures else ""]
        )
    if absorption is not None:
        rows.append(
            ["absorption", f"{absorption.db_per_km:.4g} dB/km", absorption.source.split(":")[0]]
        )
    if figures is not None:
        rows.append(
            [
                "far-field (Rayleigh) distance",
                format_length(figures.rayleigh_distance, units),
                "area / wavelength",
            ]
        )
        for lobe in figures.side_lobes:
            if lobe.level_db is None:
                level, how = "none", "the aperture is too small to have one (it would lie past 90°)"
            else:
                level, how = f"{lobe.level_db:.2f} dB", f"{lobe.mode} at {lobe.angle_deg:.1f}°"
            rows.append([f"first side lobe, {lobe.plane}", level, how])
        rows.append(
            [
                "equivalent two-way beam angle",
                f"{figures.equivalent_beam_angle_db:.2f} dB re 1 sr",
                "integral of b² over the half space",
            ]
        )
    return [columns([["figure", "value", "how"], *rows])]


def _field_line(result: BeamResult, units: str) -> str:
    f = result.field
    pulse = field_description(f.settings, result.convention.mode)
    if not result.depths:  # no widths to explain: only the pulse's own near field
        if f.axial_maximum is None:
            return ""
        return (
            f"Last on-axis maximum of the pulse (computed field: {pulse}): "
            f"{format_length(f.axial_maximum, units)}."
        )
    text = (
        f"computed field: {pulse}; width between the outermost crossings of the level below "
        "the maximum across the beam at that depth"
    )
    if f.axial_maximum is not None:
        text += f"; last on-axis maximum of this pulse at {format_length(f.axial_maximum, units)}"
    return text + "."


def beam_table(
    result: BeamResult,
    units: str = "mm",
    *,
    di=None,
    absorption=None,
    figures=None,
    budgets=None,
    sonar: bool = False,
    setup: Sequence[str] = (),
) -> str:
    """The human-readable report of ``beamspread beam`` (with its sonar figures if given).

    ``setup`` holds the lines that describe a wedge or a water path, shown
    under the probe and medium lines. A focused probe's result has no
    far-field width: its widths come from its computed field alone, and the
    notes under the width table say so.
    """
    out = [*medium_and_probe_lines(result.probe, result.wave, units, "Beam of a"), *setup]
    out.append("")
    near = result.near_field
    contact = result.coupling is Coupling.CONTACT and result.focus is None
    if contact:
        method = "last on-axis maximum, " + result.probe.near_field_label
        simple_label = result.probe.simple_near_field_label
    else:  # an inspection setup states its own method
        method = result.near_field_method
        simple_label = result.near_field_simple_method or "the same from the simple formula"
    rows = [
        ["wavelength", format_length(result.wavelength, units, 3), ""],
        ["near field", "none" if near is None else format_length(near, units), method],
        [
            "near field, simple",
            "none"
            if result.near_field_simple is None
            else format_length(result.near_field_simple, units),
            simple_label,
        ],
    ]
    if result.near_field_factor is not None:
        rows.append(
            ["near-field factor k", f"{result.near_field_factor:.3f}", "near field / simple"]
        )
    out.append(columns([["quantity", "value", "how"], *rows]))
    out.append("")
    mode = result.convention.mode
    out.append(
        f"Half-angles from the beam axis, {mode} "
        f"({'transmit x receive' if mode == 'pulse-echo' else 'transmit only'}), "
        "levels in dB below the on-axis peak"
    )
    keys = [level_key(level) for level in result.levels]
    head = ["plane", "aperture", *[f"{k} dB" for k in keys], "first null"]
    rows = [
        [
            pl.name,
            format_length(pl.aperture, units),
            *[_angle(pl.half_angles[k]) for k in keys],
            _angle(pl.half_angles["null"]),
        ]
        for pl in result.planes
    ]
    out.append(columns([head, *rows]))
    if sonar:
        out.append("")
        out.append(f"Full angles of the cone (twice the half-angle), {mode}")
        head = ["plane", *[f"{k} dB" for k in keys], "first null"]
        rows = [
            [
                pl.name,
                *[
                    _angle(None if pl.half_angles[k] is None else 2 * pl.half_angles[k])
                    for k in [*keys, "null"]
                ],
            ]
            for pl in result.planes
        ]
        out.append(columns([head, *rows]))
    if di is not None or absorption is not None or figures is not None:
        out.append("")
        out.extend(_sonar_lines(di, absorption, figures, units))
    if figures is not None and figures.footprints:
        out.append("")
        if result.wave.state == "gas":
            out.append(f"Footprint on a flat surface facing it: 2·range·tan(half-angle), {mode}")
            head = ["range", "plane", *[f"{k} dB" for k in keys]]
        else:
            out.append(f"Footprint on a flat bottom: 2·depth·tan(half-angle), {mode}")
            head = ["water depth", "plane", *[f"{k} dB" for k in keys]]
        rows = []
        deepest = max(f.depth for f in figures.footprints)
        widest = max((f.width for f in figures.footprints if f.width is not None), default=None)
        for depth in sorted({f.depth for f in figures.footprints}):
            for pl in result.planes:
                prints = {
                    level_key(f.level_db): f
                    for f in figures.footprints
                    if f.depth == depth and f.plane == pl.name
                }
                flag = " *" if prints[keys[0]].inside_near_field else ""
                rows.append(
                    [
                        format_length(depth, units, like=deepest) + flag,
                        pl.name,
                        *[
                            "none"
                            if prints[k].width is None
                            else format_length(prints[k].width, units, like=widest)
                            for k in keys
                        ],
                    ]
                )
        out.append(columns([head, *rows]))
        if any(f.inside_near_field for f in figures.footprints):
            out.append("  * inside the near field: the far-field cone does not hold there.")
    if budgets:
        out.append("")
        first = budgets[0]
        out.append(
            "Echo budget of a flat, smooth bottom (sonar equation; the bottom as a mirror): "
            f"P = {first.power_w:g} W, eta = {first.efficiency:g}"
        )
        for budget in budgets:
            out.append(f"  range {format_length(budget.range_m, units)}")
            out.append(
                columns(
                    [
                        [t.name, f"{t.value_db:.1f} dB", t.formula, t.reference]
                        for t in budget.terms
                    ],
                    indent=4,
                )
            )
    focused = bool(result.depths) and result.focus is not None
    if result.depths:
        out.append("")
        angled = any(s.surface_distance for pl in result.planes for s in pl.spots)
        out.append(f"Beam width at depth (full width across the beam, {mode})")
        head = [
            "depth",
            *(["leg", "sound path", "surface"] if angled else []),
            "plane",
            "method",
            *[f"{k} dB" for k in keys],
        ]
        rows, prints = [], []
        inside = near_three = False
        legs = sorted({s.leg for pl in result.planes for s in pl.spots})
        spots_all = [s for pl in result.planes for s in pl.spots]

        def largest(values):
            return max((v for v in values if v is not None), default=None)

        # one unit per column: each column's lengths are shown in the unit of its largest
        deepest = largest(result.depths)
        longest = largest(s.sound_path for s in spots_all)
        farthest = largest(s.surface_distance for s in spots_all)
        widest = largest(s.width for s in spots_all)
        widest_print = largest(s.footprint for s in spots_all)
        for depth in result.depths:
            for leg in legs:
                for pl in result.planes:
                    for method in ("far-field", "field"):
                        spots = {
                            level_key(s.level_db): s
                            for s in pl.spots
                            if s.depth == depth and s.method == method and s.leg == leg
                        }
                        if not spots:
                            continue
                        first = spots[keys[0]]
                        flag = " *" if first.far_field_valid is False else ""
                        inside = inside or bool(flag)
                        reach = first.sound_path if first.sound_path is not None else depth
                        if (
                            method == "far-field"
                            and not flag
                            and result.near_field is not None
                            and reach < 3.0 * result.near_field
                        ):
                            flag = " ~"
                            near_three = True
                        label = "far field" + flag if method == "far-field" else "computed field"
                        where = (
                            [
                                str(leg),
                                format_length(first.sound_path, units, like=longest),
                                format_length(first.surface_distance, units, like=farthest),
                            ]
                            if angled
                            else []
                        )
                        rows.append(
                            [
                                format_length(depth, units, like=deepest),
                                *where,
                                pl.name,
                                label,
                                *[
                                    "none"
                                    if spots[k].width is None
                                    else format_length(spots[k].width, units, like=widest)
                                    for k in keys
                                ],
                            ]
                        )
                        if angled:
                            prints.append(
                                [
                                    format_length(depth, units, like=deepest),
                                    str(leg),
                                    pl.name,
                                    label,
                                    *[
                                        "none"
                                        if spots[k].footprint is None
                                        else format_length(
                                            spots[k].footprint, units, like=widest_print
                                        )
                                        for k in keys
                                    ],
                                ]
                            )
        if rows:
            out.append(columns([head, *rows]))
        if prints:
            out.append("")
            out.append("Footprint on the horizontal plane at the depth")
            out.append(
                columns([["depth", "leg", "plane", "method", *[f"{k} dB" for k in keys]], *prints])
            )
        if angled:
            out.append(
                "  far field: across the axis 2·(sound path + wedge path·c_wedge/c_part)·"
                "tan(half-angle), the\n  cone's apex at the virtual element; footprint in the "
                "incidence plane where its edges cross the depth."
            )
            if result.field is not None:
                out.append(
                    "  footprint from the computed field, incidence plane: where the edges at half "
                    "the width either\n  side of the axis, across it, cross the depth."
                )
        elif focused:
            out.extend(_focused_notes(result))
        elif result.coupling is Coupling.IMMERSION:
            out.append(
                "  far field: 2·(water path·tan(half-angle in water) + z·tan(half-angle "
                "in the part))."
            )
        else:
            out.append("  far field: 2·z·tan(half-angle).")
        if inside:
            out.append("  * inside the near field: the far-field width does not hold there.")
        if near_three:
            out.append(
                "  ~ within 3 near-field lengths: the far-field width is only approximate there "
                "(common practice)."
            )
        if result.field is not None and not focused:
            out.append(
                "  far-field rows: a continuous wave at the centre frequency; computed rows: the "
                "pulse."
            )
        if result.field is not None:
            out.extend(
                textwrap.wrap(
                    _field_line(result, units), 98, initial_indent="  ", subsequent_indent="  "
                )
            )
    elif result.field is not None and (line := _field_line(result, units)):
        out.append("")
        out.extend(textwrap.wrap(line, 100))
    out.append("")
    state = result.wave.state
    if (sonar or figures) and state not in ("liquid", "gas"):
        state = "liquid"  # sonar work on a medium given by its speed alone: water
    out.extend(textwrap.wrap(caution_for(state), 100))
    return "\n".join(out)


def _focused_notes(result: BeamResult) -> list[str]:
    """Why a focused probe's width table has no far-field row, and what its rows are."""
    immersed = result.coupling is Coupling.IMMERSION
    where = (
        "at the equivalent water path (water path + z·c_part/c_water)" if immersed else "at depth z"
    )
    lines = [
        "  no far-field row: 2·z·tan(half-angle) is the flat element's cone (as are the "
        "half-angles above), which does not describe a focused, converging beam.",
    ]
    if result.field is not None:
        lines.append(f"  computed field of the focused element: paraxial (Fresnel), {where}.")
    else:
        lines.append("  no computed field was asked for (far field only), so no width is given.")
    return [
        line
        for text in lines
        for line in textwrap.wrap(text, 100, initial_indent="", subsequent_indent="  ")
    ]
