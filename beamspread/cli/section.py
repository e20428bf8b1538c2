"""``beamspread section``: an angle beam drawn on the part's section."""

from __future__ import annotations

import math

import click

from .beam import wedge_options
from .options import (
    check_plot,
    emit_warnings,
    field_options,
    field_settings,
    make_probe,
    medium_options,
    output_options,
    pass_output,
    plot_option,
    probe_options,
    resolve_wave,
)
from .params import LENGTH, LEVEL
from .setupargs import setup_file_options


def section_geometry(result, thickness, depth, settings, wedge_path):
    """The SectionGeometry of a wedge result: axis, level edges and the flaw depth."""
    from ..report.plots import BeamEdge, SectionGeometry

    beta = result.refraction.refracted(result.beam.wave.wave)
    length = 2 * thickness / math.cos(beta) * 1.4  # past the second leg's return to the surface
    at = () if depth is None else (depth / math.cos(beta), (2 * thickness - depth) / math.cos(beta))
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
    diameter,
    length,
    width,
    frequency,
    material,
    wave,
    speed,
    temperature,
    conditions,
    materials_dirs,
    wedge,
    wedge_speed,
    incident,
    refracted,
    wedge_path,
    thickness,
    depth,
    levels,
    bandwidth,
    spectrum,
    frequency_count,
    pulse_echo,
    far_field_only,
    plot_path,
    force_plot,
    setup_path,
    save_path,
    fmt,
    units,
):
    """The angle beam on the part's section: the plate, the exit point, the beam axis
    and its level edges over both legs, and the footprint at the flaw depth.

    Needs a wedge (--wedge or --wedge-speed, with --incident or --refracted)
    and the --thickness. The edges come from the computed field of the
    virtual element in the part (or the far-field cone with --far-field-only).
    """
    from ..beam import DEFAULT_LEVELS
    from ..report import plots
    from .setup import _named_speed, _part_speeds, load_registry

    check_plot(plot_path, force_plot)
    if wedge is None and wedge_speed is None:
        raise click.UsageError("the section needs a wedge: --wedge NAME or --wedge-speed SPEED")
    if thickness is None:
        raise click.UsageError("the section needs the part --thickness")
    if (incident is None) == (refracted is None):
        raise click.UsageError(
            "give the wedge's --incident angle or the --refracted angle, one of them"
        )
    from ..inspection import Wedge, analyse_wedge

    probe = make_probe(diameter, length, width, frequency)
    settings = None if far_field_only else field_settings(bandwidth, spectrum, frequency_count)
    resolved = resolve_wave(
        material, wave or "shear", speed, temperature, conditions, materials_dirs
    )
    registry = resolved.registry or load_registry(materials_dirs)
    if wedge is not None:
        w = _named_speed(registry, wedge, temperature)
        wedge_c, name = w.speed, w.medium
    else:
        wedge_c, name = wedge_speed, "given"
    c_long, c_shear = _part_speeds(resolved)
    mode = "one-way" if pulse_echo is False else "pulse-echo"
    result = analyse_wedge(
        probe,
        resolved.wave,
        c_long,
        c_shear,
        Wedge(wedge_c, wedge_path or 0.0, incident, refracted, name),
        thickness=thickness,
        depths=[depth] if depth else [],
        levels=levels or DEFAULT_LEVELS,
        mode=mode,
        field=None,
    )
    geometry = section_geometry(result, thickness, depth, settings, wedge_path)
    prints = plots.section_footprints(geometry) if depth is not None else []
    warnings = list(dict.fromkeys([*registry.warnings, *result.warnings]))
    emit_warnings(warnings)
    if plot_path is not None:
        from .beam import caption_of

        plots.plot_section(
            geometry, plot_path, caption=caption_of(result.beam) + f"; wedge {name}", units=units
        )
        click.echo(f"beamspread: drew {plot_path}", err=True)
    beta = math.degrees(geometry.refracted)
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
        for p in prints
    ]
    if fmt == "json":
        from ..report.serialize import dumps, setup_to_dict

        data = {
            "refracted_deg": beta,
            "thickness_m": thickness,
            "flaw_depth_m": depth,
            "skip_m": geometry.skip,
            "edges": "field" if settings else "far-field",
            "footprints": rows,
            **setup_to_dict(result),
            "warnings": warnings,
        }
        click.echo(dumps(data))
        return
    from ..report.text import columns
    from ..units import format_length

    click.echo(
        f"Angle beam on the section: {result.beam.wave.wave} at {beta:.2f}° in a "
        f"{format_length(thickness, units)} plate; full skip "
        f"{format_length(geometry.skip, units)}"
    )
    if rows:
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
                    format_length(r["near_m"], units),
                    format_length(r["far_m"], units),
                    format_length(r["footprint_m"], units),
                ]
            )
        click.echo(
            f"Footprint at the flaw depth {format_length(depth, units)} (positions along "
            "the surface from the exit point, where the drawn edges cross the depth):"
        )
        click.echo(columns(table))
