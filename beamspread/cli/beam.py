"""``beamspread beam``: near field, divergence and spot size of one probe in one medium."""

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


@click.command()
@probe_options
@medium_options
@click.option("--depth", "depths", type=LENGTH, multiple=True,
              help="Depth (range from the face) for a spot size; repeatable.")
@click.option("--level", "levels", type=LEVEL, multiple=True,
              help="Level in dB below the peak (-6, 6 and 6dB all mean 6 dB down); "
              "repeatable; default 6 and 20.")
@field_options
@click.option("--far-field-only", is_flag=True,
              help="Only the far-field widths, without the computed field.")
@output_options
@pass_output
def beam(diameter, length, width, frequency, material, wave, speed, temperature, conditions,
         materials_dirs, depths, levels, pulse_echo, bandwidth, spectrum, frequency_count,
         far_field_only, fmt, units):
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
    from ..beam import DEFAULT_LEVELS, analyse

    probe = make_probe(diameter, length, width, frequency)
    settings = None if far_field_only else field_settings(bandwidth, spectrum, frequency_count)
    medium, registry = resolve_wave(material, wave, speed, temperature, conditions,
                                    materials_dirs)
    result = analyse(probe, medium, levels=levels or DEFAULT_LEVELS, depths=depths,
                     mode="pulse-echo" if pulse_echo else "one-way", field=settings)
    emit_warnings((registry.warnings if registry else []) + list(result.warnings))
    if fmt == "json":
        from ..report.serialize import beam_to_dict, dumps

        data = beam_to_dict(result)
        if registry:
            data["warnings"] = registry.warnings + data["warnings"]
        click.echo(dumps(data))
    elif fmt == "csv":
        from ..report.serialize import beam_to_csv

        click.echo(beam_to_csv(result), nl=False)
    else:
        from ..report.text import beam_table

        click.echo(beam_table(result, units))
