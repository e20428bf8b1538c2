"""``beamspread scan-plan``: the largest index step that keeps an overlap over a depth range."""

from __future__ import annotations

import click

from .options import (
    emit_warnings,
    field_options,
    field_settings,
    make_probe,
    medium_options,
    output_options,
    pass_output,
    probe_options,
    resolve_wave,
)
from .params import LENGTH, LEVEL
from .setupargs import setup_file_options


@click.command("scan-plan")
@probe_options
@medium_options
@click.option("--from", "start", type=LENGTH, required=True, help="Shallowest depth to cover.")
@click.option("--to", "stop", type=LENGTH, required=True, help="Deepest depth to cover.")
@click.option(
    "--overlap",
    default="10%",
    show_default=True,
    metavar="FRACTION|PERCENT",
    help="Overlap between neighbouring passes, e.g. 10% or 0.25 (as the code or procedure asks).",
)
@click.option(
    "--level",
    type=LEVEL,
    default=6.0,
    show_default=True,
    help="Level of the beam width, dB below the maximum at each depth.",
)
@click.option(
    "--plane",
    default=None,
    metavar="NAME",
    help="The plane across the index direction (default the first: diameter or length).",
)
@click.option(
    "--method",
    type=click.Choice(["field", "far-field"]),
    default="field",
    show_default=True,
    help="Widths from the computed field or the far-field cone.",
)
@click.option(
    "--count",
    type=click.IntRange(2, 400),
    default=16,
    show_default=True,
    help="Depths sampled over the range (the narrowest is then refined).",
)
@field_options
@setup_file_options
@output_options
@pass_output
def scan_plan(
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
    start,
    stop,
    overlap,
    level,
    plane,
    method,
    count,
    bandwidth,
    spectrum,
    frequency_count,
    pulse_echo,
    setup_path,
    save_path,
    fmt,
    units,
):
    """The largest scan index step that keeps the overlap over a depth range.

    The beam is narrowest somewhere in the range (near the near-field length
    for a focused-like natural beam); the step is that narrowest width times
    (1 - overlap), so neighbouring passes overlap by at least the fraction
    asked for at every depth covered.
    """
    from ..scan import parse_overlap, plan_scan_for
    from ..units import format_length

    if stop <= start:
        raise click.UsageError(
            f"scan-plan: --to ({stop * 1e3:g} mm) must lie beyond --from ({start * 1e3:g} mm)"
        )
    fraction = parse_overlap(overlap)
    probe = make_probe(diameter, length, width, frequency)
    settings = field_settings(bandwidth, spectrum, frequency_count)
    resolved = resolve_wave(material, wave, speed, temperature, conditions, materials_dirs)
    mode = "one-way" if pulse_echo is False else "pulse-echo"
    extra = (
        {
            "bandwidth": settings.bandwidth,
            "frequencies": settings.frequencies,
            "spectrum": settings.spectrum,
        }
        if method == "field"
        else {}
    )
    plan = plan_scan_for(
        probe,
        resolved.wave.speed,
        start,
        stop,
        fraction,
        count=count,
        level_db=level,
        plane=plane,
        method=method,
        mode=mode,
        **extra,
    )
    warnings = [*resolved.warnings, *plan.warnings]
    emit_warnings(warnings)
    if fmt == "json":
        from ..render.serialize.common import dumps, probe_to_dict, wave_to_dict

        click.echo(
            dumps(
                {
                    "probe": probe_to_dict(probe),
                    "medium": wave_to_dict(resolved.wave),
                    "index_step_m": plan.index_step,
                    "governing_depth_m": plan.governing_depth,
                    "governing_width_m": plan.governing_width,
                    "governing_far_field_valid": plan.governing_far_field_valid,
                    "overlap": plan.overlap,
                    "level_db": -abs(level),
                    "plane": plan.plane,
                    "method": plan.method,
                    "mode": mode,
                    "near_field_m": plan.near_field,
                    "depths_m": list(plan.depths),
                    "widths_m": list(plan.widths),
                    "far_field_valid": (
                        None if plan.far_field_valid is None else list(plan.far_field_valid)
                    ),
                    "rule": plan.rule,
                    "warnings": warnings,
                }
            )
        )
        return
    if fmt == "csv":
        from ..render.serialize.setup import scan_plan_to_csv

        click.echo(scan_plan_to_csv(plan, mode), nl=False)
        return
    import textwrap

    from ..render.text.common import caution_for, columns, medium_and_probe_lines

    wave = resolved.wave
    mark = " *" if plan.governing_far_field_valid is False else ""
    near = "none" if plan.near_field is None else format_length(plan.near_field, units)
    lines = [
        *medium_and_probe_lines(probe, wave, units, lead="Scan plan for a"),
        *textwrap.wrap(
            f"Depths {format_length(start, units)} to {format_length(stop, units)}; "
            f"-{abs(level):g} dB {mode} width ({plan.method}), plane {plan.plane}; overlap "
            f"{plan.overlap:.0%}",
            100,
        ),
        "",
        columns(
            [
                ["quantity", "value"],
                ["index step", format_length(plan.index_step, units)],
                ["narrowest width", format_length(plan.governing_width, units) + mark],
                ["at depth", format_length(plan.governing_depth, units)],
                ["near field", near],
            ]
        ),
        f"  {plan.rule}",
    ]
    if mark:
        lines.append(
            f"  * inside the near field ({near}): the far-field width does not hold there."
        )
    lines.append("")
    lines.extend(textwrap.wrap(caution_for(wave.state), 100))
    click.echo("\n".join(lines))
