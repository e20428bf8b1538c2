"""``beamspread index-step``: the largest index step that keeps an overlap over a depth range."""

from __future__ import annotations

import click

from .options import (
    depth_range_options,
    emit_warnings,
    load_registry,
    output_options,
    pass_output,
    plane_option,
)
from .params import LEVEL
from .setupargs import setup_file_options
from .techniqueargs import technique_from, technique_options


@click.command("index-step")
@technique_options
@depth_range_options("Shallowest depth to cover.", "Deepest depth to cover.", required=True)
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
@plane_option("The plane across the index direction (default the first: diameter or length).")
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
@setup_file_options
@output_options
@pass_output
def index_step(
    start,
    stop,
    overlap,
    level,
    plane,
    method,
    count,
    fmt,
    units,
    **options,
):
    """The largest scan index step that keeps the overlap over a depth range.

    The beam is narrowest somewhere in the range (near the near-field length
    for a focused-like natural beam); the step is that narrowest width times
    (1 - overlap), so neighbouring passes overlap by at least the fraction
    asked for at every depth covered.
    """
    from ..pipeline import compute
    from ..scan import index_step as plan_index_step
    from ..scan import parse_overlap
    from ..units import format_length

    if stop <= start:
        raise click.UsageError(
            f"index-step: --to ({stop * 1e3:g} mm) must lie beyond --from ({start * 1e3:g} mm)"
        )
    fraction = parse_overlap(overlap)
    technique = technique_from(options, levels=[level])
    registry = load_registry(options["materials_dirs"]) if technique.names_a_medium else None
    result = compute(technique, registry=registry)
    probe, mode = technique.element, result.mode
    plan = plan_index_step(
        result, start, stop, fraction, count=count, level_db=level, plane=plane, method=method
    )
    warnings = list(dict.fromkeys([*result.warnings, *plan.warnings]))
    emit_warnings(warnings)
    if fmt == "json":
        from ..render.serialize.common import dumps, probe_to_dict, wave_to_dict
        from ..render.serialize.result import source_to_dict

        click.echo(
            dumps(
                {
                    "probe": probe_to_dict(probe),
                    "medium": wave_to_dict(result.beam.wave),
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
                    **({} if result.setup is None else {"source": source_to_dict(result)}),
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

    wave = result.beam.wave
    mark = " *" if plan.governing_far_field_valid is False else ""
    near = "none" if plan.near_field is None else format_length(plan.near_field, units)
    lines = [
        *medium_and_probe_lines(probe, wave, units, lead="Index step for a"),
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
