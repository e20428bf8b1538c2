"""``beamspread demo``: the main job end to end on invented scenarios."""

from __future__ import annotations

import textwrap

import click

from .options import emit_warnings, load_registry

CAUTIONS = """\
Cautions
  - These are estimates from an idealised piston model, not a measured beam profile.
  - Inspections follow a qualified procedure under the applicable code, carried out
    by certified personnel; verify beam coverage on reference blocks.
  - Ultrasonic pulsers carry high voltage: follow the instrument's safety instructions.
  - Underwater sound can harm marine life and may be regulated locally."""

# Invented scenarios: the yard, the boat and the workshop do not exist.
SCENARIOS = (
    {
        "title": "Kittiwake Ferry Yard: a lamination check in a 40 mm carbon-steel deck plate",
        "story": "An inspector scans a deck plate with a 10 mm, 5 MHz straight-beam contact "
                 "probe and wants the beam width at the suspect depths of 12 and 30 mm.",
        "probe": ("disc", 0.010, 5e6),
        "material": "carbon-steel", "wave": "longitudinal", "conditions": {},
        "depths": (0.012, 0.030), "levels": (6.0, 20.0), "mode": "pulse-echo",
        "command": "beamspread beam --diameter 10mm --frequency 5MHz --material carbon-steel "
                   "--depth 12mm --depth 30mm",
    },
    {
        "title": "Kittiwake Ferry Yard: a 20 x 10 mm element on an aluminium hull casting",
        "story": "The same inspector checks a thick aluminium casting with a rectangular "
                 "2.25 MHz element and needs both planes of the beam at 150 mm.",
        "probe": ("rectangle", 0.020, 0.010, 2.25e6),
        "material": "aluminium-6061", "wave": "longitudinal", "conditions": {},
        "depths": (0.150,), "levels": (6.0, 20.0), "mode": "pulse-echo",
        "command": "beamspread beam --length 20mm --width 10mm --frequency 2.25MHz "
                   "--material aluminium-6061 --depth 150mm",
    },
    {
        "title": "The sloop Marram: a 200 kHz echo-sounder disc over 30 m of cold sea",
        "story": "Her owner wants the -3 dB one-way cone of a 25 mm transducer disc and its "
                 "footprint on a bottom 30 m down, in 12 degC water of salinity 34.",
        "probe": ("disc", 0.025, 200e3),
        "material": "seawater", "wave": "longitudinal",
        "conditions": {"temperature": 12.0, "salinity": 34.0, "depth": 15.0},
        "depths": (30.0,), "levels": (3.0, 10.0), "mode": "one-way",
        "command": "beamspread beam --diameter 25mm --frequency 200kHz --material seawater "
                   "--temperature 12 --condition salinity=34 --condition depth=15m "
                   "--depth 30m --level 3 --level 10 --one-way",
    },
)


@click.command()
@click.option("--units", type=click.Choice(["mm", "in"]), default="mm", show_default=True)
def demo(units):
    """Run three invented scenarios (an inspector's and a sonar hobbyist's) end to end."""
    from ..beam import analyse
    from ..probes import Disc, Rectangle
    from ..report.text import beam_table

    registry = load_registry(())
    emit_warnings(registry.warnings)
    for number, s in enumerate(SCENARIOS, 1):
        kind, *dims = s["probe"]
        probe = Disc(*dims) if kind == "disc" else Rectangle(*dims)
        medium = registry.get(s["material"]).medium.evaluate(s["wave"], s["conditions"])
        result = analyse(probe, medium, levels=s["levels"], depths=s["depths"], mode=s["mode"])
        click.echo(f"{'=' * 100}\n{number}. {s['title']}")
        click.echo(textwrap.fill(s["story"], 100, initial_indent="   ",
                                 subsequent_indent="   "))
        lines = textwrap.wrap(s["command"], 90, break_on_hyphens=False)
        click.echo("   $ " + " \\\n       ".join(lines) + "\n")
        table = beam_table(result, units).split("\n")
        click.echo("\n".join(table[:-2]).rstrip())  # the cautions follow once, below
        for line in result.warnings:
            click.echo(f"  note: {line}")
        click.echo("")
    click.echo("=" * 100)
    click.echo(CAUTIONS)
