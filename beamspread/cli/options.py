"""Option bundles shared by several commands, and the medium they resolve to."""

from __future__ import annotations

import functools

import click

from .params import CONDITION, ELEMENT, FREQUENCY, LENGTH, SPEED, TEMPERATURE

__all__ = [
    "emit_warnings",
    "field_options",
    "load_registry",
    "make_probe",
    "materials_dir_option",
    "medium_options",
    "output_options",
    "probe_options",
    "resolve_wave",
]


def probe_options(f):
    f = click.option(
        "--frequency",
        type=FREQUENCY,
        required=True,
        help="Centre frequency: Hz, kHz, MHz (bare number: MHz).",
    )(f)
    f = click.option("--width", type=ELEMENT, help="Rectangular element: the other side.")(f)
    f = click.option(
        "--length", type=ELEMENT, help="Rectangular element: the side in the plotted plane."
    )(f)
    f = click.option(
        "--diameter", type=ELEMENT, help="Disc element diameter: m, mm, um, in (bare number: mm)."
    )(f)
    return f


def make_probe(diameter, length, width, frequency):
    """The Disc or Rectangle the probe options describe."""
    from ..probes import Disc, Rectangle

    if diameter is not None and (length is not None or width is not None):
        raise click.UsageError(
            "give --diameter for a disc, or --length and --width for a rectangle, not both"
        )
    if diameter is None and (length is None or width is None):
        raise click.UsageError(
            "give --diameter for a disc, or both --length and --width for a rectangle"
        )
    if diameter is not None:
        return Disc(diameter, frequency)
    return Rectangle(length, width, frequency)


def field_options(f=None, *, sonar: bool = False):
    """--bandwidth, --spectrum, --frequencies and --pulse-echo/--one-way."""
    if f is None:
        return lambda g: field_options(g, sonar=sonar)
    from ..beam import DEFAULT_BANDWIDTH

    default = "the default; with --sonar, one-way" if sonar else "the default"
    f = click.option(
        "--pulse-echo/--one-way",
        "pulse_echo",
        default=None,
        help=f"Pulse-echo ({default}) squares the one-way pattern: transmit x receive.",
    )(f)
    f = click.option(
        "--frequencies",
        "frequency_count",
        type=click.IntRange(1, 256),
        default=32,
        show_default=True,
        help="How many frequencies sample a broadband spectrum.",
    )(f)
    f = click.option(
        "--spectrum",
        type=click.Choice(["gaussian", "flat"]),
        default="gaussian",
        show_default=True,
        help="Shape of the pulse's spectrum.",
    )(f)
    f = click.option(
        "--bandwidth",
        type=float,
        default=DEFAULT_BANDWIDTH,
        show_default=True,
        metavar="FRACTION",
        help="-6 dB fractional bandwidth of the pulse-echo spectrum, as measured "
        "on a small reflector in the far field; 0 is a continuous wave. The "
        "default 0.5 is a typical broadband contact probe (such probes lie near "
        "0.4-0.8); with --sonar it is 0.1, as sonar transducers are narrow.",
    )(f)
    return f


def field_settings(bandwidth, spectrum, frequency_count):
    from ..beam import FieldSettings
    from ..field.spectrum import check_bandwidth

    return FieldSettings(check_bandwidth(bandwidth), spectrum, frequency_count)


def materials_dir_option(f):
    return click.option(
        "--materials-dir",
        "materials_dirs",
        multiple=True,
        metavar="DIR",
        type=click.Path(file_okay=False),
        help="Also read the material tables (*.toml) in DIR; "
        "repeatable; wins over plug-ins and built-ins.",
    )(f)


def units_option(help_text: str | None = None):
    """``--units mm|in`` (default mm): the lengths of tables or pictures."""
    return click.option(
        "--units", type=click.Choice(["mm", "in"]), default="mm", show_default=True, help=help_text
    )


def output_options(f):
    f = units_option("Lengths in tables (JSON and CSV are always SI).")(f)
    f = click.option("--json", "as_json", is_flag=True, help="Shorthand for --format json.")(f)
    f = click.option(
        "--format",
        "fmt",
        type=click.Choice(["table", "json", "csv"]),
        default="table",
        show_default=True,
        help="Output format.",
    )(f)
    return f


def output_file_option(help_text: str, *, required: bool = False, force_help: str):
    """``--output``/``-o FILE`` and its ``--force``."""

    def decorate(f):
        f = click.option("--force", is_flag=True, help=force_help)(f)
        return click.option(
            "--output", "-o", type=click.Path(dir_okay=False), required=required, help=help_text
        )(f)

    return decorate


def plane_option(help_text: str):
    """``--plane NAME``: one of the element's planes (the command says which by default)."""
    return click.option("--plane", metavar="NAME", help=help_text)


def span_option(help_text: str):
    """``--span``: the half-extent of a field command's offsets either side of the axis."""
    return click.option("--span", type=LENGTH, help=help_text)


def depth_range_options(from_help: str, to_help: str, *, required: bool = False):
    """``--from`` and ``--to``: the depths a command covers (``start`` and ``stop``)."""

    def decorate(f):
        f = click.option("--to", "stop", type=LENGTH, required=required, help=to_help)(f)
        return click.option("--from", "start", type=LENGTH, required=required, help=from_help)(f)

    return decorate


def medium_options(f):
    f = materials_dir_option(f)
    f = click.option(
        "--condition",
        "conditions",
        multiple=True,
        type=CONDITION,
        help="A condition the medium declares, NAME=VALUE (salinity=35, depth=100m); "
        "repeatable. A bare value takes the unit the medium declares "
        "(beamspread materials show NAME).",
    )(f)
    f = click.option(
        "--temperature",
        type=TEMPERATURE,
        help="Temperature of the medium: degC, degF or K (bare number: degC).",
    )(f)
    f = click.option(
        "--speed",
        type=SPEED,
        help="Sound speed given directly: m/s, km/s, mm/us, in/us (bare: m/s).",
    )(f)
    f = click.option(
        "--wave",
        type=click.Choice(["longitudinal", "shear"]),
        help="Wave mode in the medium (default longitudinal; shear on a wedge).",
    )(f)
    f = click.option(
        "--material",
        metavar="NAME",
        help="Material or medium by name or alias (beamspread materials list).",
    )(f)
    return f


def load_registry(materials_dirs):
    from ..media.registry import build_registry

    return build_registry(materials_dirs)


def resolve_wave(material, wave, speed, temperature, conditions, materials_dirs):
    """The part's medium from the medium options (:func:`beamspread.media.resolve.resolve_part`).

    Options that do not go together are refused here, named as typed.
    """
    from ..media.resolve import resolve_part

    if (material is None) == (speed is None):
        raise click.UsageError("give either --material NAME or --speed SPEED")
    if speed is not None and (temperature is not None or conditions):
        raise click.UsageError(
            "--temperature and --condition describe a --material; with --speed they mean nothing"
        )
    registry = None if material is None else load_registry(materials_dirs)
    return resolve_part(registry, material, wave, speed, temperature, conditions)


def emit_warnings(lines) -> None:
    for line in lines:
        click.echo(f"beamspread: warning: {line}", err=True)


def resolved_format(fmt: str, as_json: bool) -> str:
    return "json" if as_json else fmt


def pass_output(f):
    """Fold --json into --format for the command body."""

    @functools.wraps(f)
    def wrapper(*args, fmt, as_json, **kwargs):
        if as_json and fmt not in ("table", "json"):
            raise click.UsageError(f"--json and --format {fmt} ask for two outputs; give one")
        return f(*args, fmt=resolved_format(fmt, as_json), **kwargs)

    return wrapper


def plot_option(help_text: str, *, force: bool = True):
    """``--plot FILE`` (and, unless the command has its own, ``--force``)."""

    def decorate(f):
        if force:
            f = click.option(
                "--force", "force_plot", is_flag=True, help="Overwrite an existing --plot file."
            )(f)
        return click.option("--plot", "plot_path", type=click.Path(dir_okay=False), help=help_text)(
            f
        )

    return decorate


def check_plot(path, force: bool) -> None:
    """Refuse a bad --plot path, or an existing file without --force, before computing."""
    if path is None:
        return
    from ..render.plots import check_target

    check_target(path)
    refuse_existing(path, force, "--plot")


def refuse_existing(path: str, force: bool, hint: str) -> None:
    """Refuse to overwrite the file ``path`` (as typed) without ``--force``."""
    from pathlib import Path

    if Path(path).exists() and not force:
        raise click.BadParameter(f"{path!r} exists; add --force to overwrite it", param_hint=hint)
