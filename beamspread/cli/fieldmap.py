"""``beamspread map``: a 2-D map of the computed amplitude in a plane through the axis."""

from __future__ import annotations

from pathlib import Path

import click

from ..atomic import write_atomically
from ..source import source_map
from .field import MAX_MAP_POINTS, FieldRun, _check_plane, _points_option, drew
from .options import (
    depth_range_options,
    emit_warnings,
    output_file_option,
    plane_option,
    plot_option,
    refuse_existing,
    span_option,
    units_option,
)
from .setupargs import setup_file_options
from .techniqueargs import technique_options


@click.command("map")
@technique_options
@plane_option(
    "diameter (disc), length or width (rectangle); on a wedge the incidence plane "
    "of a disc; default the first."
)
@depth_range_options(
    "First depth (on a wedge: sound path along the refracted axis) (default 0.1 N).",
    "Last depth (default 3 N).",
)
@span_option(
    "Half-extent either side of the axis (default: the larger of the aperture "
    "and 4 λ z / aperture at the last depth)."
)
@_points_option(256, 16384, "--depth-points", "Number of depths")
@_points_option(128, 16384, "--lateral-points", "Number of lateral offsets")
@output_file_option(
    "Write to FILE: .csv, .json or .npz by its suffix (default: CSV to stdout).",
    force_help="Overwrite an existing --output or --plot file.",
)
@click.option("--json", "as_json", is_flag=True, help="JSON to stdout instead of CSV.")
@plot_option(
    "Draw the map to FILE (.png, .svg, .pdf); without --output, only the picture.", force=False
)
@units_option("Lengths on the picture.")
@setup_file_options
def map_(
    plane,
    start,
    stop,
    span,
    depth_points,
    lateral_points,
    output,
    force,
    as_json,
    plot_path,
    units,
    **common,
):
    """A 2-D map of the computed amplitude in a plane through the axis.

    \b
    CSV: one row per point, columns depth_m, lateral_m, amplitude, level_db
    (dB relative to the largest amplitude of the map).
    JSON: depth_m, lateral_m, and amplitude[i][j] at depth_m[i], lateral_m[j].
    NPZ: arrays depth_m, lateral_m, amplitude, level_db and a JSON string
    "metadata" with the probe, medium and field settings.
    """
    import numpy as np

    target = None
    if output is not None:
        target = Path(output)
        if target.suffix.lower() not in (".csv", ".json", ".npz"):
            raise click.BadParameter(
                f"{output!r}: the suffix must be .csv, .json or .npz", param_hint="--output"
            )
        if not target.parent.is_dir():
            raise click.BadParameter(
                f"{output!r}: the folder {str(target.parent)!r} does not exist",
                param_hint="--output",
            )
        refuse_existing(output, force, "--output")
    if depth_points * lateral_points > MAX_MAP_POINTS:
        raise click.UsageError(
            f"map: {depth_points} x {lateral_points} = {depth_points * lateral_points} points "
            f"would exceed the {MAX_MAP_POINTS} a map may hold in memory"
        )
    run = FieldRun(common, plot_path, force)
    source, mode, settings = run.source, run.mode, run.settings
    plane = _check_plane(source, plane or source.planes[0])
    start, stop = run.depth_range(start, stop, depth_points, "map", first=0.1)
    aperture = dict(source.element.planes)[source.element_plane(plane)]
    wavelength = source.speed / source.element.frequency
    far = float(source.ranges(stop))
    half = span if span is not None else max(aperture, 4 * wavelength * far / aperture)
    result = source_map(
        source,
        np.linspace(-half, half, lateral_points),
        np.linspace(start, stop, depth_points),
        plane,
        mode,
        settings,
    )
    if plot_path is not None:
        from ..render.plots import plot_map

        # The near field in the part (the continuous-wave last on-axis maximum) is marked
        # where there is one; a pulse's own last on-axis maximum, where the map's beam is
        # strongest, too.
        pulse = settings.bandwidth > 0
        plot_map(
            result,
            plot_path,
            near_field=run.result.beam.near_field,
            axial_maximum=run.last_maximum() if pulse else None,
            near_label="near field (continuous wave)" if pulse else "near field",
            axis_label=run.axis_label(),
            caption=run.caption,
            units=units,
        )
        drew(plot_path)
        if target is None:  # the picture was what was asked for
            emit_warnings(run.warnings)
            return
    emit_warnings(run.warnings)
    from ..render.serialize import field as serialize

    def text(kind):
        if kind == ".json":
            return run.json(serialize.map_to_dict(*run.inputs, result, run.warnings))
        return serialize.map_to_csv(result)

    if target is None:
        click.echo(text(".json" if as_json else ".csv"), nl=False)
        return
    suffix = target.suffix.lower()
    if suffix == ".npz":

        def write(path):
            with open(path, "wb") as handle:
                serialize.map_to_npz(handle, *run.inputs, result)
    else:

        def write(path):
            Path(path).write_text(text(suffix), encoding="utf-8")

    write_atomically(target, write)
    click.echo(
        f"wrote {target} ({depth_points} depths x {lateral_points} offsets, plane {plane})",
        err=True,
    )
