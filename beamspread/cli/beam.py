"""``beamspread beam``: near field, divergence and spot size of one technique."""

from __future__ import annotations

import click

from .options import (
    check_plot,
    emit_warnings,
    load_registry,
    output_options,
    pass_output,
    plot_option,
)
from .params import DECIBEL, DEPTHS, LEVEL, POWER, RANGE_DEPTHS
from .setupargs import setup_file_options
from .techniqueargs import given, technique_from, technique_options


@click.command()
@technique_options(sonar=True)
@click.option(
    "--depth",
    "depth_groups",
    type=RANGE_DEPTHS,
    multiple=True,
    help="Depth (range from the face) for a spot size, or a range START:STOP:STEP "
    "(bare numbers in mm); repeatable.",
)
@click.option(
    "--level",
    "levels",
    type=LEVEL,
    multiple=True,
    help="Level in dB below the peak (-6, 6 and 6dB all mean 6 dB down); "
    "repeatable; default 6 and 20.",
)
@click.option(
    "--far-field-only", is_flag=True, help="Only the far-field widths, without the computed field."
)
@click.option(
    "--sonar",
    is_flag=True,
    help="The sonar trade's conventions: one-way, -3 and -10 dB, full angles; adds "
    "the directivity index, side lobes, the equivalent beam angle and absorption.",
)
@click.option(
    "--bottom-depth",
    "bottom_depths",
    type=DEPTHS,
    multiple=True,
    help="Water depth for the footprint on a flat bottom, or a range "
    "START:STOP:STEP (bare numbers in m); repeatable.",
)
@click.option(
    "--power",
    type=POWER,
    metavar="WATTS",
    help="Electrical power for an echo budget at each --bottom-depth.",
)
@click.option(
    "--efficiency",
    type=float,
    default=0.5,
    show_default=True,
    metavar="FRACTION",
    help="Electro-acoustic efficiency for the echo budget.",
)
@click.option(
    "--bottom-loss",
    type=DECIBEL,
    default=10.0,
    show_default=True,
    metavar="DB",
    help="Reflection loss of the bottom for the echo budget.",
)
@plot_option(
    "Draw to FILE (.png, .svg, .pdf): the far-field directivity; with "
    "--bottom-depth the footprint on the bottom; with --thickness the section."
)
@setup_file_options
@output_options
@pass_output
def beam(
    depth_groups,
    levels,
    far_field_only,
    sonar,
    bottom_depths,
    power,
    efficiency,
    bottom_loss,
    plot_path,
    force_plot,
    fmt,
    units,
    **options,
):
    """Near-field length, half-angles and spot sizes of one probe.

    Give a disc (--diameter) or a rectangle (--length and --width), a
    --frequency, and a --material (with --wave) or a --speed. Each spot is
    given twice: from the far-field formula, and from the computed field
    (near field included) of a pulse of the given --bandwidth.

    \b
    Examples:
      beamspread beam --diameter 10mm --frequency 5MHz --material reference-steel --depth 50mm
      beamspread beam --diameter 25mm --frequency 200kHz --material seawater \\
          --temperature 12 --condition depth=30m --one-way --level 3
    """
    from ..pipeline import compute
    from ..technique import Sonar

    depths = [d for group in depth_groups for d in group]
    if power is None and (given("efficiency") or given("bottom_loss")):
        raise click.UsageError(
            "--efficiency and --bottom-loss belong to the echo budget: give --power "
            "and --bottom-depth too"
        )
    check_plot(plot_path, force_plot)
    bottoms = tuple(sorted({d for group in bottom_depths for d in group}))
    asked = Sonar(sonar, bottoms, power, efficiency, bottom_loss)
    technique = technique_from(
        options, depths=depths, levels=levels, far_field_only=far_field_only, sonar=asked
    )
    if power is not None and not bottoms:
        raise click.UsageError("--power gives an echo budget at each --bottom-depth; give one")
    registry = load_registry(options["materials_dirs"]) if technique.names_a_medium else None
    result = compute(technique, registry=registry)
    warnings = list(result.warnings)
    if sonar and technique.element.frequency > 5e6:
        warnings.append("a bare --frequency is in MHz (write 200kHz for 200 kHz)")
    if plot_path is not None:
        warnings.extend(_plot(plot_path, result, units))
    emit_warnings(warnings)
    if fmt == "json":
        from ..render.serialize.common import dumps

        data = result.to_dict()
        data["warnings"] = warnings
        click.echo(dumps(data))
    elif fmt == "csv":
        from ..render.serialize.beam import beam_to_csv

        figures = result.sonar.figures if result.sonar is not None else None
        if figures is not None:
            click.echo(
                "beamspread: the CSV holds the angles, widths and footprints; the directivity "
                "index, absorption, side lobes and echo budget are in the table and JSON forms",
                err=True,
            )
        click.echo(beam_to_csv(result.beam, figures.footprints if figures else ()), nl=False)
    else:
        from ..render.text.result import result_table

        click.echo(result_table(result, units))


def _plot(path, result, units) -> list[str]:
    """Draw the technique's picture; the warnings it adds.

    The footprint on the bottom (a sonar's bottom depths), the section (a
    thickness, angled or straight), or the far-field directivity (in the part).
    """
    from ..render import plots
    from ..render.captions import caption_of

    beam, warnings = result.beam, []
    figures = result.sonar.figures if result.sonar is not None else None
    if figures is not None and figures.footprints:
        depths, by_level = result.sonar.footprint_widths(beam)
        plots.plot_footprint(
            depths,
            by_level,
            path,
            near_field=beam.near_field,
            mode=beam.convention.mode,
            caption=caption_of(beam),
            units="m" if units == "mm" else "ft",
            in_air=beam.wave.state == "gas",
        )
    elif result.technique.thickness:
        depths = result.technique.request.depths
        geometry = plots.section_of(
            result, result.technique.thickness, depths[0] if depths else None
        )
        plots.plot_section(geometry, path, caption=caption_of(beam), units=units)
    else:
        if result.focused:
            warnings.append(
                "--plot draws the flat element's far-field directivity: the focus is not in it"
            )
        probe = result.source.element
        plots.plot_directivity(
            {pl.name: pl.aperture for pl in beam.planes},
            beam.wavelength,
            probe.pattern,
            path,
            levels_db=beam.levels,
            caption=caption_of(beam),
            angles="full" if figures is not None else "half",
        )
    click.echo(f"beamspread: drew {path}", err=True)
    return warnings
