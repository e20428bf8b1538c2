"""``beamspread axis`` and ``across``: the computed amplitude along the beam and across it."""

from __future__ import annotations

import click

from ..source import source_across, source_axial, source_widths
from .field import MAX_PROFILE_POINTS, FieldRun, _check_plane, _points_option, drew
from .options import (
    depth_range_options,
    emit_warnings,
    output_options,
    pass_output,
    plane_option,
    plot_option,
    span_option,
)
from .params import LENGTH, LEVEL
from .setupargs import setup_file_options
from .techniqueargs import technique_options


@click.command()
@technique_options
@depth_range_options(
    "First depth (on a wedge: sound path) (default 0.05 N, N = D²/4λ or L²/4λ in the part).",
    "Last depth (default 3 N).",
)
@_points_option(400, MAX_PROFILE_POINTS, help_text="Number of depths")
@plot_option("Also draw to FILE (.png, .svg, .pdf).")
@setup_file_options
@output_options
@pass_output
def axis(start, stop, points, plot_path, force_plot, fmt, units, **common):
    """The computed amplitude along the beam axis, and its last maximum.

    For a continuous wave (--bandwidth 0) the last maximum is the near-field
    length; for a broadband pulse it is where the on-axis echo peaks, nearer
    the element as the bandwidth grows.
    """
    import numpy as np

    run = FieldRun(common, plot_path, force_plot)
    start, stop = run.depth_range(start, stop, points, "axis", first=0.05)
    profile = source_axial(run.source, np.linspace(start, stop, points), run.mode, run.settings)
    near, axial = run.result.beam.near_field, run.last_maximum()
    if plot_path is not None:
        from ..render.plots import plot_axis

        contact = run.result.coupling == "contact"
        plot_axis(
            profile,
            plot_path,
            near_field=near,
            axial_maximum=axial,
            caption=run.caption,
            units=units,
            **({} if contact else {"axis_label": run.axis_label()}),
        )
        drew(plot_path)
    emit_warnings(run.warnings)
    figures = (profile, near, run.reference, axial)
    if fmt == "json":
        from ..render.serialize.field import axial_to_dict

        click.echo(run.json(axial_to_dict(*run.inputs, *figures, run.warnings)))
    elif fmt == "csv":
        from ..render.serialize.field import axial_to_csv

        click.echo(axial_to_csv(profile), nl=False)
    else:
        from ..render.text.field import axial_table

        coordinate = run.source.coordinate
        click.echo(axial_table(*run.inputs, *figures, units, coordinate=coordinate))


@click.command()
@technique_options
@click.option(
    "--depth",
    type=LENGTH,
    required=True,
    help="Depth of the profile below the surface (on a wedge, on the first leg).",
)
@plane_option(
    "diameter (disc), length or width (rectangle), incidence or transverse (a disc "
    "on a wedge); default every plane."
)
@span_option(
    "Half-extent either side of the axis (default: the larger of the aperture "
    "and 4 λ z / aperture)."
)
@_points_option(201, MAX_PROFILE_POINTS, help_text="Number of offsets across the beam")
@click.option(
    "--level",
    "levels",
    type=LEVEL,
    multiple=True,
    help="Levels for the widths (dB below the maximum at this depth); default 6 and 20.",
)
@plot_option("Also draw to FILE (.png, .svg, .pdf).")
@setup_file_options
@output_options
@pass_output
def across(depth, plane, span, points, levels, plot_path, force_plot, fmt, units, **common):
    """The computed amplitude across the beam at one depth, per plane, with its widths."""
    import numpy as np

    run = FieldRun(common, plot_path, force_plot)
    source, mode, settings = run.source, run.mode, run.settings
    chosen = [_check_plane(source, plane)] if plane else list(source.planes)
    run.check_validity(depth)
    wavelength = source.speed / source.element.frequency
    at = source.coordinate_of_depth(depth)
    distance = float(source.ranges(at))
    profiles, widths = [], {}
    for name in chosen:
        aperture = dict(source.element.planes)[source.element_plane(name)]
        half = span if span is not None else max(aperture, 4 * wavelength * distance / aperture)
        offsets = np.linspace(-half, half, points)
        profiles.append(source_across(source, at, offsets, name, mode, settings))
        widths[name] = source_widths(
            source, at, levels or run.result.technique.levels, name, mode, settings
        )
    if plot_path is not None:
        from ..render.plots import plot_across

        plot_across(profiles, widths, plot_path, caption=run.caption, units=units)
        drew(plot_path)
    emit_warnings(run.warnings)
    if fmt == "json":
        from ..render.serialize.field import across_to_dict

        data = across_to_dict(*run.inputs, depth, profiles, widths, run.warnings)
        click.echo(run.json(data))
    elif fmt == "csv":
        from ..render.serialize.field import across_to_csv

        click.echo(across_to_csv(profiles), nl=False)
    else:
        from ..render.text.field import across_table

        click.echo(across_table(*run.inputs, depth, profiles, widths, units))
