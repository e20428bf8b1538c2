"""``beamspread axis`` and ``across``: the computed amplitude along the beam and across it."""

from __future__ import annotations

import click

from .field import (
    MAX_PROFILE_POINTS,
    _axis_label,
    _caption,
    _check_plane,
    _check_range,
    _check_validity,
    _last_maximum,
    _note,
    _points_option,
    _reference_length,
    _setup,
)
from .options import check_plot, emit_warnings, output_options, pass_output, plot_option
from .params import LENGTH, LEVEL
from .setupargs import setup_file_options
from .techniqueargs import technique_options


@click.command()
@technique_options
@click.option(
    "--from",
    "start",
    type=LENGTH,
    default=None,
    help="First depth (on a wedge: sound path) (default 0.05 N, N = D²/4λ or L²/4λ in the part).",
)
@click.option("--to", "stop", type=LENGTH, default=None, help="Last depth (default 3 N).")
@_points_option(400, MAX_PROFILE_POINTS, help_text="Number of depths")
@plot_option("Also draw to FILE (.png, .svg, .pdf).")
@setup_file_options
@output_options
@pass_output
def axis(start, stop, points, plot_path, force_plot, setup_path, save_path, fmt, units, **common):
    """The computed amplitude along the beam axis, and its last maximum.

    For a continuous wave (--bandwidth 0) the last maximum is the near-field
    length; for a broadband pulse it is where the on-axis echo peaks, nearer
    the element as the bandwidth grows.
    """
    import numpy as np

    check_plot(plot_path, force_plot)
    result, settings, warnings = _setup(common)
    probe, medium, mode = result.technique.element, result.beam.wave, result.mode
    near, simple = result.beam.near_field, _reference_length(result)
    start = 0.05 * simple if start is None else start
    stop = 3.0 * simple if stop is None else stop
    _check_range(start, stop, points, "axis")
    if result.coupling == "contact" and not result.focused:
        _check_validity(warnings, start, simple)
    profile = result.source.axial(np.linspace(start, stop, points), mode, settings)
    axial = _last_maximum(result, settings, mode)
    if plot_path is not None:
        from ..render.plots import plot_axis

        plot_axis(
            profile,
            plot_path,
            near_field=near,
            axial_maximum=axial,
            caption=_caption(probe, medium, settings, mode),
            units=units,
            **({} if result.coupling == "contact" else {"axis_label": _axis_label(result)}),
        )
        click.echo(f"beamspread: drew {plot_path}", err=True)
    emit_warnings(warnings)
    if fmt == "json":
        from ..render.serialize.common import dumps
        from ..render.serialize.field import axial_to_dict

        data = axial_to_dict(probe, medium, settings, mode, profile, near, simple, axial, warnings)
        click.echo(dumps(_note(data, result)))
    elif fmt == "csv":
        from ..render.serialize.field import axial_to_csv

        click.echo(axial_to_csv(profile), nl=False)
    else:
        from ..render.text.field import axial_table

        click.echo(
            axial_table(
                probe,
                medium,
                settings,
                mode,
                profile,
                near,
                simple,
                axial,
                units,
                coordinate=result.source.coordinate,
            )
        )


@click.command()
@technique_options
@click.option(
    "--depth",
    type=LENGTH,
    required=True,
    help="Depth of the profile below the surface (on a wedge, on the first leg).",
)
@click.option(
    "--plane",
    default=None,
    metavar="NAME",
    help="diameter (disc), length or width (rectangle), incidence or transverse (a disc "
    "on a wedge); default every plane.",
)
@click.option(
    "--span",
    type=LENGTH,
    default=None,
    help="Half-extent either side of the axis (default: the larger of the aperture "
    "and 4 λ z / aperture).",
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
def across(
    depth,
    plane,
    span,
    points,
    levels,
    plot_path,
    force_plot,
    setup_path,
    save_path,
    fmt,
    units,
    **common,
):
    """The computed amplitude across the beam at one depth, per plane, with its widths."""
    import numpy as np

    check_plot(plot_path, force_plot)
    result, settings, warnings = _setup(common)
    probe, medium, mode, source = (
        result.technique.element,
        result.beam.wave,
        result.mode,
        result.source,
    )
    chosen = [_check_plane(source, plane)] if plane else list(source.planes)
    if result.coupling == "contact" and not result.focused:
        _check_validity(warnings, depth, _reference_length(result))
    wavelength = source.speed / source.element.frequency
    at = source.coordinate_of_depth(depth)
    distance = float(source.ranges(at))
    profiles, widths = [], {}
    for name in chosen:
        aperture = dict(source.element.planes)[source.element_plane(name)]
        half = span if span is not None else max(aperture, 4 * wavelength * distance / aperture)
        offsets = np.linspace(-half, half, points)
        profiles.append(source.across(at, offsets, name, mode, settings))
        widths[name] = source.widths(at, levels or result.technique.levels, name, mode, settings)
    if plot_path is not None:
        from ..render.plots import plot_across

        plot_across(
            profiles,
            widths,
            plot_path,
            caption=_caption(probe, medium, settings, mode),
            units=units,
        )
        click.echo(f"beamspread: drew {plot_path}", err=True)
    emit_warnings(warnings)
    if fmt == "json":
        from ..render.serialize.common import dumps
        from ..render.serialize.field import across_to_dict

        data = across_to_dict(probe, medium, settings, mode, depth, profiles, widths, warnings)
        click.echo(dumps(_note(data, result)))
    elif fmt == "csv":
        from ..render.serialize.field import across_to_csv

        click.echo(across_to_csv(profiles), nl=False)
    else:
        from ..render.text.field import across_table

        click.echo(across_table(probe, medium, settings, mode, depth, profiles, widths, units))
