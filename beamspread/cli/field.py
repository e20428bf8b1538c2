"""``beamspread axis``, ``across`` and ``map``: profiles and maps of the computed field."""

from __future__ import annotations

import os
import tempfile
from pathlib import Path

import click

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


def _caption(probe, wave, settings, mode):
    from ..render.text.common import field_description

    size = (
        f"disc {probe.diameter * 1e3:g} mm"
        if probe.shape == "disc"
        else f"{probe.shape} {probe.length * 1e3:g} x {probe.width * 1e3:g} mm"
    )
    where = "given speed" if wave.medium == "given" else wave.medium
    from .beam import frequency_text

    return (
        f"{size}, {frequency_text(probe.frequency)}; {where}, {wave.wave} "
        f"{wave.speed:.1f} m/s; "
        f"{field_description(settings, mode)}; beamspread model estimate"
    )


MAX_PROFILE_POINTS = 100_000
MAX_MAP_POINTS = 4_194_304  # 32 MB of float64 amplitudes; the engine works in bounded blocks


def _setup(
    *,
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
    bandwidth,
    spectrum,
    frequency_count,
    pulse_echo,
):
    """What the probe, medium and field options of a field command describe."""
    probe = make_probe(diameter, length, width, frequency)
    settings = field_settings(bandwidth, spectrum, frequency_count)
    resolved = resolve_wave(material, wave, speed, temperature, conditions, materials_dirs)
    mode = "one-way" if pulse_echo is False else "pulse-echo"
    return probe, settings, resolved.wave, mode, resolved.warnings


def _near_fields(probe, wavelength):
    import math

    from ..axis import disc_near_field, rectangle_near_field, simple_near_field
    from ..probes import Disc

    simple = float(simple_near_field(probe.longest_side, wavelength))
    if isinstance(probe, Disc):
        exact = float(disc_near_field(probe.diameter, wavelength))
    else:
        exact = rectangle_near_field(probe.length, probe.width, wavelength)
    return (None if math.isnan(exact) else exact), simple


def _check_plane(probe, plane: str) -> str:
    names = [name for name, _ in probe.planes]
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
@probe_options
@medium_options
@click.option(
    "--from",
    "start",
    type=LENGTH,
    default=None,
    help="First depth (default 0.05 N, N = D²/4λ or L²/4λ).",
)
@click.option("--to", "stop", type=LENGTH, default=None, help="Last depth (default 3 N).")
@_points_option(400, MAX_PROFILE_POINTS, help_text="Number of depths")
@field_options
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

    from ..field import axial_profile, last_maximum

    check_plot(plot_path, force_plot)
    probe, settings, medium, mode, warnings = _setup(**common)
    near, simple = _near_fields(probe, medium.speed / probe.frequency)
    start = 0.05 * simple if start is None else start
    stop = 3.0 * simple if stop is None else stop
    _check_range(start, stop, points, "axis")
    _check_validity(warnings, start, simple)
    kwargs = {
        "bandwidth": settings.bandwidth,
        "mode": mode,
        "frequencies": settings.frequencies,
        "spectrum": settings.spectrum,
    }
    profile = axial_profile(probe, medium.speed, np.linspace(start, stop, points), **kwargs)
    axial = last_maximum(probe, medium.speed, **kwargs)
    axial = None if np.isnan(axial) else axial
    if plot_path is not None:
        from ..report.plots import plot_axis

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

        click.echo(
            dumps(
                axial_to_dict(probe, medium, settings, mode, profile, near, simple, axial, warnings)
            )
        )
    elif fmt == "csv":
        from ..render.serialize.field import axial_to_csv

        click.echo(axial_to_csv(profile), nl=False)
    else:
        from ..render.text.field import axial_table

        click.echo(axial_table(probe, medium, settings, mode, profile, near, simple, axial, units))


@click.command()
@probe_options
@medium_options
@click.option("--depth", type=LENGTH, required=True, help="Depth of the profile.")
@click.option(
    "--plane",
    default=None,
    metavar="NAME",
    help="diameter (disc), length or width (rectangle); default every plane.",
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
@field_options
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

    from ..beam import DEFAULT_LEVELS
    from ..field import beam_widths, transverse_profile

    check_plot(plot_path, force_plot)
    probe, settings, medium, mode, warnings = _setup(**common)
    chosen = [_check_plane(probe, plane)] if plane else [name for name, _ in probe.planes]
    _, simple = _near_fields(probe, medium.speed / probe.frequency)
    _check_validity(warnings, depth, simple)
    wavelength = medium.speed / probe.frequency
    kwargs = {
        "bandwidth": settings.bandwidth,
        "mode": mode,
        "frequencies": settings.frequencies,
        "spectrum": settings.spectrum,
    }
    profiles, widths = [], {}
    for name in chosen:
        aperture = dict(probe.planes)[name]
        half = span if span is not None else max(aperture, 4 * wavelength * depth / aperture)
        offsets = np.linspace(-half, half, points)
        profiles.append(
            transverse_profile(probe, medium.speed, depth, offsets, plane=name, **kwargs)
        )
        widths[name] = beam_widths(
            probe, medium.speed, depth, levels or DEFAULT_LEVELS, plane=name, **kwargs
        )
    if plot_path is not None:
        from ..report.plots import plot_across

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

        click.echo(
            dumps(across_to_dict(probe, medium, settings, mode, depth, profiles, widths, warnings))
        )
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
@probe_options
@medium_options
@click.option(
    "--plane",
    default=None,
    metavar="NAME",
    help="diameter (disc), length or width (rectangle); default the first.",
)
@click.option("--from", "start", type=LENGTH, default=None, help="First depth (default 0.1 N).")
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
@field_options
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

    from ..field import field_map

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
    probe, settings, medium, mode, warnings = _setup(**common)
    plane = _check_plane(probe, plane or probe.planes[0][0])
    _, simple = _near_fields(probe, medium.speed / probe.frequency)
    start = 0.1 * simple if start is None else start
    stop = 3.0 * simple if stop is None else stop
    _check_range(start, stop, depth_points, "map")
    _check_validity(warnings, start, simple)
    aperture = dict(probe.planes)[plane]
    wavelength = medium.speed / probe.frequency
    half = span if span is not None else max(aperture, 4 * wavelength * stop / aperture)
    result = field_map(
        probe,
        medium.speed,
        np.linspace(-half, half, lateral_points),
        np.linspace(start, stop, depth_points),
        plane=plane,
        bandwidth=settings.bandwidth,
        mode=mode,
        frequencies=settings.frequencies,
        spectrum=settings.spectrum,
    )
    if plot_path is not None:
        from ..field import last_maximum
        from ..report.plots import plot_map

        # The near field is known for every probe (the continuous-wave last on-axis maximum);
        # a pulse's own last on-axis maximum, where the map's beam is strongest, is marked too.
        near, _ = _near_fields(probe, wavelength)
        pulse_maximum = None
        if settings.bandwidth > 0:
            pulse_maximum = last_maximum(
                probe,
                medium.speed,
                bandwidth=settings.bandwidth,
                mode=mode,
                frequencies=settings.frequencies,
                spectrum=settings.spectrum,
            )
        plot_map(
            result,
            plot_path,
            near_field=near,
            axial_maximum=pulse_maximum,
            near_label="near field (continuous wave)" if settings.bandwidth > 0 else "near field",
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
            return dumps(serialize.map_to_dict(probe, medium, settings, mode, result, warnings))
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
