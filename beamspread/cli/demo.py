"""``beamspread demo``: the main job end to end on invented scenarios."""

from __future__ import annotations

import shlex
import textwrap

import click

from .options import units_option

CAUTIONS = """\
Cautions
  - These are estimates from an idealised piston model, not a measured beam profile.
  - Inspections follow a qualified procedure under the applicable code, carried out
    by certified personnel; verify beam coverage on reference blocks.
  - Ultrasonic pulsers and sonar transmitters carry high voltage: follow the
    instrument's safety instructions.
  - Underwater sound can harm aquatic life and may be regulated locally; intense
    airborne ultrasound can harm hearing and disturb animals."""

# Invented scenarios: the yard, the boat and the workshop do not exist.
SCENARIOS = (
    (
        "Kittiwake Ferry Yard: a lamination check in a 40 mm carbon-steel deck plate",
        "An inspector scans a deck plate with a 10 mm, 5 MHz straight-beam contact probe and wants "
        "the beam width at the suspect depths of 12 and 30 mm, from the far-field formula and from "
        "the computed field of the broadband pulse.",
        "beamspread beam --diameter 10mm --frequency 5MHz --material carbon-steel --depth 12mm "
        "--depth 30mm",
    ),
    (
        "Kittiwake Ferry Yard: a 60 degree shear-wave check of a 25 mm butt weld",
        "The same inspector puts a 12.7 mm, 2.25 MHz element on an acrylic wedge for 60 degree "
        "shear waves, and needs the beam at 15 mm depth on both legs, with the surface distance "
        "from the exit point.",
        "beamspread beam --diameter 12.7mm --frequency 2.25MHz --material reference-steel "
        "--wedge acrylic --refracted 60 --wedge-path 12mm --thickness 25mm --depth 15mm",
    ),
    (
        "The sloop Marram: a 200 kHz echo-sounder disc over a cold sea",
        "Her owner wants the one-way cone of a 25 mm transducer disc and its footprint on the "
        "bottom from 10 to 40 m, in 12 degC water of salinity 34.",
        "beamspread beam --diameter 25mm --frequency 200kHz --material seawater --temperature 12 "
        "--condition salinity=34 --sonar --bottom-depth 10m:40m:10m --far-field-only",
    ),
)


@click.command()
@units_option()
def demo(units):
    """Run three invented scenarios (an inspector's and a sonar hobbyist's) end to end."""
    from .beam import beam

    for number, (title, story, command) in enumerate(SCENARIOS, 1):
        click.echo(f"{'=' * 100}\n{number}. {title}")
        click.echo(textwrap.fill(story, 100, initial_indent="   ", subsequent_indent="   "))
        lines = textwrap.wrap(
            command + ("" if units == "mm" else " --units in"), 90, break_on_hyphens=False
        )
        click.echo("   $ " + " \\\n       ".join(lines) + "\n")
        args = shlex.split(command)[2:] + ([] if units == "mm" else ["--units", "in"])
        beam.main(args=args, prog_name="beamspread beam", standalone_mode=False)
        click.echo("")
    click.echo("=" * 100)
    click.echo(CAUTIONS)
