"""``beamspread axis``, ``across`` and ``map``: profiles and maps of the computed field."""

from __future__ import annotations

import os
import tempfile
from pathlib import Path

import click

from .options import (
    check_plot,
    emit_warnings,
    load_registry,
    output_options,
    pass_output,
    plot_option,
)
from .params import LENGTH, LEVEL
from .setupargs import setup_file_options
from .techniqueargs import technique_from, technique_options


def _caption(probe, wave, settings, mode):
    from ..render.text.common import field_description

    size = (
        f"disc {probe.diameter * 1e3:g} mm"
        if probe.shape == "disc"
        else f"{probe.shape} {probe.length * 1e3:g} x {probe.width * 1e3:g} mm"
    )
    where = "given speed" if wave.medium == "given" else wave.medium
    from ..render.captions import frequency_text

    return (
        f"{size}, {frequency_text(probe.frequency)}; {where}, {wave.wave} "
        f"{wave.speed:.1f} m/s; "
        f"{field_description(settings, mode)}; beamspread model estimate"
    )


MAX_PROFILE_POINTS = 100_000
MAX_MAP_POINTS = 4_194_304  # 32 MB of float64 amplitudes; the engine works in bounded blocks


def _setup(options):
    """The technique the options describe, computed: (result, its pulse, the warnings).

    The field commands read the beam in the part through the result's
    :class:`beamspread.source.FieldSource`: the element itself in contact, the
    virtual element on a wedge (along the sound path), the element in the
    couplant at the water-equivalent range behind a water path, focused or not.
    """
    from ..pipeline import compute

    technique = technique_from(options)
    registry = load_registry(options["materials_dirs"]) if technique.names_a_medium else None
    result = compute(technique, registry=registry)
    return result, result.settings, list(result.warnings)


def _reference_length(result) -> float:
    """The near field the default ranges are scaled by, in the part's coordinate (m)."""
    beam, source = result.beam, result.source
    if beam.near_field_simple is not None:
        return beam.near_field_simple
    element = source.element
    return element.longest_side**2 * element.frequency / (4 * source.speed)


def _last_maximum(result, settings, mode):
    """The pulse's last on-axis maximum in the part's coordinate (m), None where none."""
    import math

    from ..field import last_maximum

    source = result.source
    if source.focus is not None:
        return None
    found = last_maximum(
        source.element,
        source.speed,
        bandwidth=settings.bandwidth,
        mode=mode,
        frequencies=settings.frequencies,
        spectrum=settings.spectrum,
    )
    if math.isnan(found) or found <= source.start:
        return None
    return (found - source.start) / source.stretch


def _axis_label(result) -> str:
    """What the field commands' depth axis is, for the technique."""
    if result.source.coordinate == "sound path":
        return "sound path in the part from the exit point"
    if result.setup is not None and result.source.start > 0:
        return "depth in the part"
    return "depth from the probe face"


def _note(data: dict, result) -> dict:
    """``data`` with the technique's coupling and coordinate added (beyond contact)."""
    from ..render.serialize.result import source_to_dict

    if result.coupling != "contact" or result.focused:
        data["source"] = source_to_dict(result)
    return data


def _check_plane(source, plane: str) -> str:
    names = list(source.planes)
    if plane not in names:
        raise click.BadParameter(
            f"{plane!r} is not a plane of this probe; use {' or '.join(names)}",
            param_hint="--plane",
        )
    return plane


def _check_range(start, stop, points, what):
    if stop <= start:
        raise click.UsageError(
            f"{what}: the range {start * 1e3:g} to {stop * 1e3:g} mm is "
            "empty; --to must lie beyond --from"
        )
    if points < 2:
        raise click.UsageError(f"{what}: at least 2 points are needed")


def _points_option(default, maximum, name="--points", help_text="Number of points."):
    return click.option(
        name,
        type=click.IntRange(2, maximum),
        default=default,
        show_default=True,
        help=f"{help_text} (2 to {maximum}).",
    )


def _check_validity(warnings, start, near_simple):
    if start < 0.05 * near_simple:
        warnings.append(
            f"depths from {start * 1e3:.4g} mm lie closer than 0.05 N "
            f"({0.05 * near_simple * 1e3:.4g} mm) to the face, where the computed field is "
            "not validated"
        )


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

        click.echo(axial_table(probe, medium, settings, mode, profile, near, simple, axial, units))


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


def _write_atomically(path: Path, write) -> None:
    """Write through a temporary file in the same folder, so nothing half-made is left."""
    fd, temporary = tempfile.mkstemp(dir=path.parent, prefix=f".{path.name}.", suffix=".part")
    os.close(fd)
    try:
        write(temporary)
        mask = os.umask(0)
        os.umask(mask)
        os.chmod(temporary, 0o666 & ~mask)  # as an ordinary new file, not mkstemp's 0600
        os.replace(temporary, path)
    except BaseException:
        Path(temporary).unlink(missing_ok=True)
        raise


@click.command("map")
@technique_options
@click.option(
    "--plane",
    default=None,
    metavar="NAME",
    help="diameter (disc), length or width (rectangle); on a wedge the incidence plane "
    "of a disc; default the first.",
)
@click.option(
    "--from",
    "start",
    type=LENGTH,
    default=None,
    help="First depth (on a wedge: sound path along the refracted axis) (default 0.1 N).",
)
@click.option("--to", "stop", type=LENGTH, default=None, help="Last depth (default 3 N).")
@click.option(
    "--span",
    type=LENGTH,
    default=None,
    help="Half-extent either side of the axis (default: the larger of the aperture "
    "and 4 λ z / aperture at the last depth).",
)
@_points_option(256, 16384, "--depth-points", "Number of depths")
@_points_option(128, 16384, "--lateral-points", "Number of lateral offsets")
@click.option(
    "--output",
    "-o",
    type=click.Path(dir_okay=False),
    default=None,
    help="Write to FILE: .csv, .json or .npz by its suffix (default: CSV to stdout).",
)
@click.option("--force", is_flag=True, help="Overwrite an existing --output or --plot file.")
@click.option("--json", "as_json", is_flag=True, help="JSON to stdout instead of CSV.")
@plot_option(
    "Draw the map to FILE (.png, .svg, .pdf); without --output, only the picture.", force=False
)
@click.option(
    "--units",
    type=click.Choice(["mm", "in"]),
    default="mm",
    show_default=True,
    help="Lengths on the picture.",
)
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
    setup_path,
    save_path,
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
        if target.exists() and not force:
            raise click.BadParameter(
                f"{output!r} exists; add --force to overwrite it", param_hint="--output"
            )
    if depth_points * lateral_points > MAX_MAP_POINTS:
        raise click.UsageError(
            f"map: {depth_points} x {lateral_points} = {depth_points * lateral_points} points "
            f"would exceed the {MAX_MAP_POINTS} a map may hold in memory"
        )
    check_plot(plot_path, force)
    computed, settings, warnings = _setup(common)
    probe, medium, mode = computed.technique.element, computed.beam.wave, computed.mode
    source = computed.source
    plane = _check_plane(source, plane or source.planes[0])
    simple = _reference_length(computed)
    start = 0.1 * simple if start is None else start
    stop = 3.0 * simple if stop is None else stop
    _check_range(start, stop, depth_points, "map")
    if computed.coupling == "contact" and not computed.focused:
        _check_validity(warnings, start, simple)
    aperture = dict(source.element.planes)[source.element_plane(plane)]
    wavelength = source.speed / source.element.frequency
    far = float(source.ranges(stop))
    half = span if span is not None else max(aperture, 4 * wavelength * far / aperture)
    result = source.map(
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
        near = computed.beam.near_field
        pulse_maximum = _last_maximum(computed, settings, mode) if settings.bandwidth > 0 else None
        plot_map(
            result,
            plot_path,
            near_field=near,
            axial_maximum=pulse_maximum,
            near_label="near field (continuous wave)" if settings.bandwidth > 0 else "near field",
            axis_label=_axis_label(computed),
            caption=_caption(probe, medium, settings, mode),
            units=units,
        )
        click.echo(f"beamspread: drew {plot_path}", err=True)
        if target is None:  # the picture was what was asked for
            emit_warnings(warnings)
            return
    emit_warnings(warnings)
    from ..render.serialize import field as serialize
    from ..render.serialize.common import dumps

    def text(kind):
        if kind == ".json":
            data = serialize.map_to_dict(probe, medium, settings, mode, result, warnings)
            return dumps(_note(data, computed))
        return serialize.map_to_csv(result)

    if target is None:
        click.echo(text(".json" if as_json else ".csv"), nl=False)
        return
    suffix = target.suffix.lower()
    if suffix == ".npz":

        def write(path):
            with open(path, "wb") as handle:
                serialize.map_to_npz(handle, probe, medium, settings, mode, result)
    else:

        def write(path):
            Path(path).write_text(text(suffix), encoding="utf-8")

    _write_atomically(target, write)
    click.echo(
        f"wrote {target} ({depth_points} depths x {lateral_points} offsets, plane {plane})",
        err=True,
    )
