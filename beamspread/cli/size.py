"""``beamspread size``: the element that gives a wanted beam (inverse design)."""

from __future__ import annotations

import click

from .options import emit_warnings, medium_options, output_options, pass_output, resolve_wave
from .params import ELEMENT, FREQUENCY, LENGTH, LEVEL


def _angle(text: str, name: str) -> float:
    import math

    try:
        value = float(str(text).strip().removesuffix("deg").removesuffix("°"))
    except ValueError:
        raise click.BadParameter(f"{text!r} is not an angle in degrees", param_hint=name) from None
    if not math.isfinite(value) or value <= 0:
        raise click.BadParameter(
            f"{text!r} is not allowed; give an angle above 0 degrees", param_hint=name
        )
    return value


@click.command()
@click.option(
    "--frequency",
    type=FREQUENCY,
    help="Centre frequency (solve the diameter, or a rectangle's side).",
)
@click.option(
    "--diameter", type=ELEMENT, default=None, help="Disc diameter (solve the frequency instead)."
)
@click.option(
    "--other-side",
    type=ELEMENT,
    help="For a rectangle: the side across the target plane; solves the side in it.",
)
@medium_options
@click.option("--full-angle", metavar="DEG", help="Target full angle, degrees.")
@click.option("--half-angle", metavar="DEG", help="Target half-angle, degrees.")
@click.option("--spot", type=LENGTH, help="Target full width at --at.")
@click.option(
    "--at",
    "depth",
    type=LENGTH,
    help="Depth of --spot (or of the footprint reported with an angle target); bare "
    "numbers in mm, so write 30m for a water depth.",
)
@click.option(
    "--level",
    type=LEVEL,
    help="Level of the target, dB below the peak (default 3 for an angle, 6 for a spot).",
)
@click.option(
    "--one-way/--pulse-echo",
    "one_way",
    default=None,
    help="Convention of the target (default one-way for an angle, as the sonar "
    "trade quotes cones; pulse-echo for a spot, as inspections measure it).",
)
@output_options
@pass_output
def size(
    frequency,
    diameter,
    other_side,
    material,
    wave,
    speed,
    temperature,
    conditions,
    materials_dirs,
    full_angle,
    half_angle,
    spot,
    depth,
    level,
    one_way,
    fmt,
    units,
):
    """Solve the element for a target cone or spot.

    Give the --frequency to solve the disc diameter (or, with --other-side, a
    rectangle's side), or the --diameter to solve the frequency; and one
    target: --full-angle or --half-angle (at --level), or --spot WIDTH --at
    DEPTH. The answer reports its near field, directivity index and footprint.

    \b
    Examples:
      beamspread size --frequency 200kHz --material seawater --full-angle 20
      beamspread size --frequency 5MHz --material reference-steel --spot 6mm --at 40mm
    """
    from ..design import solvers

    angles = [a for a in (full_angle, half_angle) if a is not None]
    if len(angles) + (spot is not None) != 1:
        raise click.UsageError("give one target: --full-angle, --half-angle, or --spot with --at")
    if spot is not None and depth is None:
        raise click.UsageError("--spot needs --at DEPTH")
    if (frequency is None) == (diameter is None):
        raise click.UsageError(
            "give --frequency (to solve the size) or --diameter (to solve the frequency)"
            + (", not both" if frequency is not None else "")
        )
    if other_side is not None and frequency is None:
        raise click.UsageError("--other-side (a rectangle) needs --frequency")
    target = {
        "full_angle_deg": None if full_angle is None else _angle(full_angle, "--full-angle"),
        "half_angle_deg": None if half_angle is None else _angle(half_angle, "--half-angle"),
        "spot": spot,
        "depth": depth,
    }
    if target["full_angle_deg"] is not None and target["full_angle_deg"] >= 180:
        raise click.BadParameter(
            f"{full_angle!r} is not allowed; a full angle must be below 180 degrees",
            param_hint="--full-angle",
        )
    if target["half_angle_deg"] is not None and target["half_angle_deg"] >= 90:
        raise click.BadParameter(
            f"{half_angle!r} is not allowed; a half-angle must be below 90 degrees",
            param_hint="--half-angle",
        )
    if one_way is None:
        one_way = spot is None
    mode = "one-way" if one_way else "pulse-echo"
    level = level if level is not None else (3.0 if spot is None else 6.0)
    resolved = resolve_wave(material, wave, speed, temperature, conditions, materials_dirs)
    c = resolved.wave.speed
    common = {"level_db": level, "mode": mode, **target}
    if diameter is not None:
        found = solvers.size_frequency(diameter, c, **common)
    elif other_side is not None:
        found = solvers.size_rectangle_side(frequency, c, other_side, **common)
    else:
        found = solvers.size_disc(frequency, c, **common)
    warnings = resolved.warnings
    if found.depth == found.depth and not found.far_field_at_depth:
        warnings.append(
            "the depth lies inside the near field of the solution: the far-field "
            "cone does not hold there"
        )
    emit_warnings(warnings)
    if fmt == "json":
        from ..render.serialize.common import dumps
        from ..render.serialize.design import design_to_dict

        click.echo(dumps(design_to_dict(found, resolved.wave, warnings)))
    elif fmt == "csv":
        from ..render.serialize.design import design_to_csv

        click.echo(design_to_csv(found, resolved.wave), nl=False)
    else:
        from ..render.text.design import design_table

        click.echo(design_table(found, resolved.wave, units))
