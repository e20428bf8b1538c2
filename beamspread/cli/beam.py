"""``beamspread beam``: near field, divergence and spot size of one probe in one medium."""

from __future__ import annotations

import click

from .options import emit_warnings, medium_options, output_options, pass_output, resolve_wave
from .params import FREQUENCY, LENGTH, LEVEL


@click.command()
@click.option("--diameter", type=LENGTH, help="Disc element diameter: m, mm, um, in "
              "(bare number: mm).")
@click.option("--length", type=LENGTH, help="Rectangular element: the side in the plotted plane.")
@click.option("--width", type=LENGTH, help="Rectangular element: the other side.")
@click.option("--frequency", type=FREQUENCY, required=True,
              help="Centre frequency: Hz, kHz, MHz (bare number: MHz).")
@medium_options
@click.option("--depth", "depths", type=LENGTH, multiple=True,
              help="Depth (range from the face) for a spot size; repeatable.")
@click.option("--level", "levels", type=LEVEL, multiple=True,
              help="Level in dB below the peak (-6, 6 and 6dB all mean 6 dB down); "
              "repeatable; default 6 and 20.")
@click.option("--pulse-echo/--one-way", "pulse_echo", default=True, show_default=True,
              help="Pulse-echo squares the one-way pattern.")
@output_options
@pass_output
def beam(diameter, length, width, frequency, material, wave, speed, temperature, conditions,
         materials_dirs, depths, levels, pulse_echo, fmt, units):
    """Near-field length, half-angles and far-field spot sizes of one probe.

    Give a disc (--diameter) or a rectangle (--length and --width), a
    --frequency, and a --material (with --wave) or a --speed.

    \b
    Examples:
      beamspread beam --diameter 10mm --frequency 5MHz --material reference-steel --depth 50mm
      beamspread beam --diameter 25mm --frequency 200kHz --material seawater \\
          --temperature 12 --condition depth=30m --one-way --level 3
    """
    from ..beam import DEFAULT_LEVELS, analyse
    from ..probes import Disc, Rectangle

    if diameter is not None and (length is not None or width is not None):
        raise click.UsageError("give --diameter for a disc, or --length and --width for a "
                               "rectangle, not both")
    if diameter is None and (length is None or width is None):
        raise click.UsageError("give --diameter for a disc, or both --length and --width for "
                               "a rectangle")
    probe = Disc(diameter, frequency) if diameter is not None else Rectangle(length, width,
                                                                             frequency)
    medium, registry = resolve_wave(material, wave, speed, temperature, conditions,
                                    materials_dirs)
    result = analyse(probe, medium, levels=levels or DEFAULT_LEVELS, depths=depths,
                     mode="pulse-echo" if pulse_echo else "one-way")
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
