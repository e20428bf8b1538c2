"""``beamspread section``: an angle beam drawn on the part's section."""

from __future__ import annotations

import math

import click

from .options import (
    check_plot,
    emit_warnings,
    field_options,
    load_registry,
    medium_options,
    output_options,
    pass_output,
    plot_option,
    probe_options,
)
from .params import LENGTH, LEVEL
from .setupargs import setup_file_options
from .techniqueargs import technique_from, wedge_options


def section_geometry(result, thickness, depth, settings, wedge_path):
    """The SectionGeometry of a wedge result: axis, level edges and the flaw depth.

    The edges are sampled at the flaw's sound paths on both legs and at the
    sound paths where the result's footprints found the edges crossing the
    depth, so the drawn footprints are those of the table.
    """
    from ..render.plots import BeamEdge, SectionGeometry

    beta = result.refraction.refracted(result.beam.wave.wave)
    length = 2 * thickness / math.cos(beta) * 1.4  # past the second leg's return to the surface
    at = []
    if depth is not None:
        at = [depth / math.cos(beta), (2 * thickness - depth) / math.cos(beta)]
        at += [
            s
            for p in result.footprints
            if p.depth == depth
            for s in (p.near_path, p.far_path)
            if s is not None
        ]
    edges = tuple(
        BeamEdge(level, paths, widths)
        for level, (paths, widths) in result.edges(length, settings, at=at).items()
    )
    return SectionGeometry(thickness, beta, 0.0, edges, depth, 2, result.beam.wave.wave)


@click.command()
@probe_options
@medium_options
@wedge_options
@click.option(
    "--depth",
    type=LENGTH,
    default=None,
    help="Flaw depth: the footprint is drawn there on both legs.",
)
@click.option(
    "--level",
    "levels",
    type=LEVEL,
    multiple=True,
    help="Levels of the edges drawn, dB below the axis (default 6 and 20).",
)
@field_options
@click.option("--far-field-only", is_flag=True, help="Edges from the far-field cone only.")
@plot_option("Draw the section to FILE (.png, .svg, .pdf).")
@setup_file_options
@output_options
@pass_output
def section(
    depth,
    levels,
    far_field_only,
    plot_path,
    force_plot,
    setup_path,
    save_path,
    fmt,
    units,
    **options,
):
    """The angle beam on the part's section: the plate, the exit point, the beam axis
    and its level edges over both legs, and the footprint at the flaw depth.

    Needs a wedge (--wedge or --wedge-speed, with --incident or --refracted)
    and the --thickness. The edges come from the computed field of the
    virtual element in the part (or the far-field cone with --far-field-only).
    """
    from ..pipeline import compute
    from ..render import plots

    check_plot(plot_path, force_plot)
    wedge, wedge_speed = options["wedge"], options["wedge_speed"]
    incident, refracted = options["incident"], options["refracted"]
    thickness, wedge_path = options["thickness"], options["wedge_path"]
    if wedge is None and wedge_speed is None:
        raise click.UsageError("the section needs a wedge: --wedge NAME or --wedge-speed SPEED")
    if wedge is not None and wedge_speed is not None:
        raise click.UsageError("give --wedge NAME or --wedge-speed SPEED, not both")
    if thickness is None:
        raise click.UsageError("the section needs the part --thickness")
    if (incident is None) == (refracted is None):
        raise click.UsageError(
            "give the wedge's --incident angle or the --refracted angle, one of them"
        )
    technique = technique_from(
        options, depths=[depth] if depth else [], levels=levels, far_field_only=far_field_only
    )
    registry = load_registry(options["materials_dirs"])
    computed = compute(technique, registry=registry)
    result, settings = computed.setup, computed.settings
    method = "far-field" if settings is None else "field"
    name, wedge_c = computed.wedge.name, computed.wedge.speed
    mode, probe, (c_long, c_shear) = computed.mode, technique.element, computed.speeds
    setup_warnings = set(result.warnings)
    warnings = [w for w in computed.warnings if w not in setup_warnings]
    other = {text for m, text in result.method_warnings if m != method}
    warnings.extend(w for w in result.warnings if w not in other)
    warnings = list(dict.fromkeys(warnings))
    if depth is None and fmt != "table":
        warnings.append("no --depth: the section has no flaw depth, so no footprint is given")
    emit_warnings(warnings)
    if plot_path is not None:  # the edges along both legs are computed for the drawing only
        from ..render.captions import caption_of

        geometry = section_geometry(result, thickness, depth, settings, wedge_path)
        plots.plot_section(
            geometry, plot_path, caption=caption_of(result.beam) + f"; wedge {name}", units=units
        )
        click.echo(f"beamspread: drew {plot_path}", err=True)
    beta_rad = result.refraction.refracted(result.beam.wave.wave)
    beta = math.degrees(beta_rad)
    skip = 2 * thickness * math.tan(beta_rad)  # full skip along the surface (geometry)
    prints = [p for p in result.footprints if p.method == method]
    rows = [
        {
            "leg": p.leg,
            "level_db": -abs(p.level_db),
            "sound_path_m": p.sound_path,
            "surface_distance_m": p.surface_distance,
            "near_m": p.near,
            "far_m": p.far,
            "footprint_m": p.width,
        }
        for p in sorted(prints, key=lambda p: (p.leg, abs(p.level_db)))
    ]
    wedge_dict = {"name": name, "speed_m_s": wedge_c, "path_m": wedge_path or 0.0}
    if fmt == "json":
        from ..render.serialize.beam import beam_to_dict_convention
        from ..render.serialize.common import (
            dumps,
            field_settings_to_dict,
            probe_to_dict,
            wave_to_dict,
        )
        from ..render.serialize.setup import setup_to_dict

        medium = wave_to_dict(computed.part.wave)
        medium["longitudinal_m_s"], medium["shear_m_s"] = c_long, c_shear
        data = {
            "probe": probe_to_dict(probe),
            "medium": medium,
            "convention": {
                **beam_to_dict_convention(result.beam),
                **({} if settings is None else {"level_reference": FIELD_REFERENCE}),
                "edges": method,
                "footprint_rule": FOOTPRINT_RULE,
            },
            "field": None if settings is None else field_settings_to_dict(settings, mode),
            "wedge": wedge_dict,
            "virtual_element_offset_m": result.offset,
            "refracted_deg": beta,
            "thickness_m": thickness,
            "flaw_depth_m": depth,
            "half_skip_m": skip / 2,
            "skip_m": skip,
            "edges": method,
            "footprints": rows,
            **setup_to_dict(result),
            "near_field_simple_in_part_m": result.beam.near_field_simple,
            "near_field_method": result.beam.near_field_method,
            "warnings": warnings,
        }
        click.echo(dumps(data))
        return
    if fmt == "csv":
        from ..render.serialize.setup import section_to_csv

        click.echo(section_to_csv(prints, mode), nl=False)
        return
    click.echo(
        _section_text(
            result, thickness, skip, settings, wedge_dict, rows, depth, mode, plot_path, units
        )
    )


FIELD_REFERENCE = "dB below the largest amplitude across the beam at the same sound path"
FOOTPRINT_RULE = (
    "where each level's edges, half the full width either side of the axis and across it, "
    "cross the flaw depth (on leg 2 the unfolded depth 2t - d)"
)


def _section_text(
    result, thickness, skip, settings, wedge, rows, depth, mode, plot_path, units
) -> str:
    """The text form: what was computed, the plate's geometry and the footprints."""
    import textwrap

    from ..render.text.common import caution_for, columns, field_description, medium_and_probe_lines
    from ..render.text.setup import setup_lines
    from ..units import format_length

    beam = result.beam
    lead = "Angle beam on the section: a"
    lines = medium_and_probe_lines(beam.probe, beam.wave, units, lead=lead)
    lines += setup_lines(result, {"wedge": wedge}, units)
    beta = result.refraction.refracted(beam.wave.wave)
    plate = (
        f"Plate {format_length(thickness, units)} thick, {beam.wave.wave} at "
        f"{math.degrees(beta):.2f}°: the axis meets the back wall "
        f"{format_length(skip / 2, units)} and the surface again "
        f"{format_length(skip, units)} (full skip) from the exit point"
    )
    lines += textwrap.wrap(plate, 100, subsequent_indent="       ")
    if settings is None:
        how = (
            f"Edges: the far-field cone of the {mode} half-angles, its apex at the virtual "
            f"element {format_length(result.offset, units)} behind the exit point; levels in "
            f"{result.beam.convention.reference}"
        )
    else:
        how = (
            f"Edges: the computed field of the virtual element ({field_description(settings, mode)}"
            f"); levels in {FIELD_REFERENCE}"
        )
    lines += textwrap.wrap(how, 100, subsequent_indent="       ")
    lines.append("")
    if depth is None:
        drawn = "the edges alone are drawn" if plot_path else "--plot FILE draws the edges"
        lines.append(f"No flaw depth (--depth), so no footprint: {drawn}.")
    else:
        lines.append(
            f"Footprint at the flaw depth {format_length(depth, units)}, positions along the "
            "surface from the exit point"
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
            f"  footprint: {FOOTPRINT_RULE}; none where an edge does not reach it.",
            100,
            subsequent_indent="  ",
        )
    lines.append("")
    lines += textwrap.wrap(caution_for(beam.wave.state), 100)
    return "\n".join(lines)
