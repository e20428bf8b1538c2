"""``beamspread beam``: near field, divergence and spot size of one probe in one medium."""

from __future__ import annotations

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
from .params import (
    ANGLE,
    DECIBEL,
    DEPTHS,
    LENGTH,
    LEVEL,
    PATH_LENGTH,
    POWER,
    RANGE_DEPTHS,
    SPEED,
)
from .setupargs import setup_file_options


def wedge_options(f):
    """An angle-beam wedge on the part, and the part's thickness."""
    for decorator in reversed(
        (
            click.option(
                "--wedge",
                default=None,
                metavar="NAME",
                help="Angle-beam wedge material by name (its longitudinal speed).",
            ),
            click.option(
                "--wedge-speed",
                type=SPEED,
                default=None,
                help="Angle-beam wedge: a measured longitudinal speed instead of --wedge.",
            ),
            click.option(
                "--incident", type=ANGLE, default=None, help="Incident angle in the wedge, degrees."
            ),
            click.option(
                "--refracted",
                type=ANGLE,
                default=None,
                help="Nominal refracted angle in the part for --wave, degrees (the "
                "incident angle is solved).",
            ),
            click.option(
                "--wedge-path",
                type=PATH_LENGTH,
                default=None,
                help="Mean sound path in the wedge along the beam axis.",
            ),
            click.option(
                "--thickness",
                type=LENGTH,
                default=None,
                help="Part thickness: each depth then gets the second leg too.",
            ),
        )
    ):
        f = decorator(f)
    return f


def setup_options(f):
    """The inspection setup: a wedge, or a water path, and a focus."""
    f = wedge_options(f)
    for decorator in reversed(
        (
            click.option(
                "--water-path",
                type=PATH_LENGTH,
                default=None,
                help="Immersion: couplant path from the probe to the part surface.",
            ),
            click.option(
                "--couplant",
                default="water",
                show_default=True,
                metavar="NAME",
                help="Immersion couplant (at --temperature).",
            ),
            click.option(
                "--focus",
                type=LENGTH,
                default=None,
                help="Focal length of a spherically focused disc, in the couplant.",
            ),
        )
    ):
        f = decorator(f)
    return f


@click.command()
@probe_options
@medium_options
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
@field_options(sonar=True)
@click.option(
    "--far-field-only", is_flag=True, help="Only the far-field widths, without the computed field."
)
@setup_options
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
    default=None,
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
    "--bottom-depth the footprint on the bottom; with a wedge and --thickness the "
    "section."
)
@setup_file_options
@output_options
@pass_output
def beam(
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
    depth_groups,
    levels,
    pulse_echo,
    bandwidth,
    spectrum,
    frequency_count,
    far_field_only,
    wedge,
    wedge_speed,
    incident,
    refracted,
    wedge_path,
    thickness,
    water_path,
    couplant,
    focus,
    sonar,
    bottom_depths,
    power,
    efficiency,
    bottom_loss,
    plot_path,
    force_plot,
    setup_path,
    save_path,
    fmt,
    units,
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
    from ..beam import DEFAULT_LEVELS, analyse
    from ..sonar.conventions import SONAR_BANDWIDTH, SONAR_LEVELS_SHOWN, SONAR_MODE

    probe = make_probe(diameter, length, width, frequency)
    depths = [d for group in depth_groups for d in group]
    if sonar and not _given("bandwidth"):
        bandwidth = SONAR_BANDWIDTH
    if power is None and (_given("efficiency") or _given("bottom_loss")):
        raise click.UsageError(
            "--efficiency and --bottom-loss belong to the echo budget: give --power "
            "and --bottom-depth too"
        )
    settings = None if far_field_only else field_settings(bandwidth, spectrum, frequency_count)
    check_plot(plot_path, force_plot)
    on_wedge = wedge is not None or wedge_speed is not None
    immersed = water_path is not None or focus is not None
    if on_wedge and immersed:
        raise click.UsageError(
            "give a wedge (--wedge/--wedge-speed) or a water path (--water-path/--focus), not both"
        )
    if (on_wedge or immersed) and (sonar or bottom_depths or power is not None):
        raise click.UsageError(
            "--sonar, --bottom-depth and --power describe a bare transducer "
            "in water, not an inspection setup"
        )
    if water_path is None and focus is None and _given("couplant"):
        raise click.UsageError("--couplant describes the water path: give --water-path too")
    if not on_wedge and any(v is not None for v in (incident, refracted, wedge_path)):
        raise click.UsageError(
            "--incident, --refracted and --wedge-path need --wedge or --wedge-speed"
        )
    if thickness is not None and not on_wedge:
        raise click.UsageError("--thickness (for the second leg) needs a wedge")
    resolved = resolve_wave(
        material,
        wave or ("shear" if on_wedge else None),
        speed,
        temperature,
        conditions,
        materials_dirs,
        temperature_elsewhere=water_path is not None or on_wedge,
    )
    if on_wedge or immersed:
        from .setup import run_setup

        return run_setup(
            probe,
            resolved,
            settings,
            depths,
            levels,
            pulse_echo,
            fmt,
            units,
            plot_path=plot_path,
            wedge=wedge,
            wedge_speed=wedge_speed,
            incident=incident,
            refracted=refracted,
            wedge_path=wedge_path,
            thickness=thickness,
            water_path=water_path,
            couplant=couplant,
            focus=focus,
            temperature=temperature,
            materials_dirs=materials_dirs,
        )
    if pulse_echo is None:
        mode = SONAR_MODE if sonar else "pulse-echo"
    else:
        mode = "pulse-echo" if pulse_echo else "one-way"
    from .sonarargs import bottom_list, sonar_results

    bottoms = bottom_list(bottom_depths)
    if power is not None and not bottoms:
        raise click.UsageError("--power gives an echo budget at each --bottom-depth; give one")
    result = analyse(
        probe,
        resolved.wave,
        depths=depths,
        mode=mode,
        field=settings,
        levels=levels or (SONAR_LEVELS_SHOWN if sonar else DEFAULT_LEVELS),
    )
    warnings = [*(resolved.registry.warnings if resolved.registry else []), *result.warnings]
    if sonar and probe.frequency > 5e6:
        warnings.append(
            f"--sonar at {frequency_text(probe.frequency)}: sonar and rangefinder transducers work "
            "below a few MHz; a bare --frequency is in MHz (write 200kHz for 200 kHz)"
        )
    sr = sonar_results(
        result,
        resolved,
        bottoms,
        sonar=sonar,
        power=power,
        efficiency=efficiency,
        bottom_loss=bottom_loss,
        warnings=warnings,
    )
    figures = sr.figures
    if plot_path is not None:
        _plot(plot_path, result, sr, units)
    emit_warnings(warnings)
    if fmt == "json":
        from ..render.serialize.beam import beam_to_dict, sonar_to_dict
        from ..render.serialize.common import dumps

        data = beam_to_dict(result)
        from .setup import _part_speeds

        if resolved.medium is not None:
            data["medium"]["longitudinal_m_s"], data["medium"]["shear_m_s"] = _part_speeds(resolved)
        data["warnings"] = warnings
        di, absorption = sr.directivity_index_db, sr.absorption
        data.update(sonar_to_dict(result, di, absorption, figures, sr.budgets, sonar))
        click.echo(dumps(data))
    elif fmt == "csv":
        from ..render.serialize.beam import beam_to_csv

        if figures is not None:
            click.echo(
                "beamspread: the CSV holds the angles, widths and footprints; the directivity "
                "index, absorption, side lobes and echo budget are in the table and JSON forms",
                err=True,
            )
        click.echo(beam_to_csv(result, figures.footprints if figures else ()), nl=False)
    else:
        from ..render.text.beam import beam_table

        click.echo(beam_table(result, units, **sr.table_options(sonar)))


def _given(name: str) -> bool:
    """Whether the option ``name`` was typed (not its default)."""
    ctx = click.get_current_context()
    return ctx.get_parameter_source(name) not in (None, click.core.ParameterSource.DEFAULT)


def caption_of(result) -> str:
    """A one-line caption naming the inputs of a result, for pictures."""
    from ..probes import Disc

    p, w = result.probe, result.wave
    size = (
        f"disc {p.diameter * 1e3:g} mm"
        if isinstance(p, Disc)
        else f"rectangle {p.length * 1e3:g} x {p.width * 1e3:g} mm"
    )
    where = "given speed" if w.medium == "given" else w.medium
    return (
        f"{size}, {frequency_text(p.frequency)}; {where}, {w.wave} {w.speed:.1f} m/s; "
        f"{result.convention.mode}; beamspread model estimate"
    )


def frequency_text(hertz: float) -> str:
    return f"{hertz / 1e6:g} MHz" if hertz >= 1e6 else f"{hertz / 1e3:g} kHz"


def _plot(path, result, sr, units):
    from ..report import plots

    figures = sr.figures
    if figures is not None and figures.footprints:
        depths, by_level = sr.footprint_widths(result)
        plots.plot_footprint(
            depths,
            by_level,
            path,
            near_field=result.near_field,
            mode=result.convention.mode,
            caption=caption_of(result),
            units="m" if units == "mm" else "ft",
            in_air=result.wave.state == "gas",
        )
    else:
        shape = "disc" if result.probe.shape == "disc" else "rectangle"
        plots.plot_directivity(
            dict(result.probe.planes),
            result.wavelength,
            shape,
            path,
            levels_db=result.levels,
            caption=caption_of(result),
            angles="full" if figures is not None else "half",
        )
    click.echo(f"beamspread: drew {path}", err=True)
