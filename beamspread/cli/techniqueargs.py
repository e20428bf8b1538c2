"""The options that describe a technique, and the :class:`beamspread.Technique` they build.

Every command that computes a beam takes the same probe, medium, coupling and
pulse options (``technique_options``) and turns them into a Technique with
:func:`technique_from`; the checks that name options live here, once.
"""

from __future__ import annotations

import click

from .options import field_options, make_probe, medium_options, probe_options
from .params import ANGLE, LENGTH, PATH_LENGTH, SPEED


def coupling_options(f):
    """An angle-beam wedge, or a water path and a focus, and the part's thickness."""
    return wedge_options(immersion_options(f))


def wedge_options(f):
    """An angle-beam wedge, and the part's thickness."""
    for decorator in reversed(_WEDGE):
        f = decorator(f)
    return f


def immersion_options(f):
    """A water path through a couplant, and a focus."""
    for decorator in reversed(_IMMERSION):
        f = decorator(f)
    return f


_WEDGE = (
    click.option(
        "--wedge",
        metavar="NAME",
        help="Angle-beam wedge material by name (its longitudinal speed).",
    ),
    click.option(
        "--wedge-speed",
        type=SPEED,
        help="Angle-beam wedge: a measured longitudinal speed instead of --wedge.",
    ),
    click.option(
        "--incident", type=ANGLE, default=None, help="Incident angle in the wedge, degrees."
    ),
    click.option(
        "--refracted",
        type=ANGLE,
        help="Nominal refracted angle in the part for --wave, degrees (the "
        "incident angle is solved).",
    ),
    click.option(
        "--wedge-path", type=PATH_LENGTH, help="Mean sound path in the wedge along the beam axis."
    ),
    click.option(
        "--thickness",
        type=LENGTH,
        help="Part thickness: the back wall (on a wedge each depth also gets the second leg).",
    ),
)
_IMMERSION = (
    click.option(
        "--water-path",
        type=PATH_LENGTH,
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
        help="Focal length of a spherically focused disc (cylindrically, in the "
        "length plane, for a rectangle), in the couplant.",
    ),
)


def technique_options(f=None, *, sonar: bool = False):
    """Probe, medium, pulse and coupling options (the pulse's help mentions --sonar if asked)."""
    if f is None:
        return lambda g: technique_options(g, sonar=sonar)
    f = coupling_options(f)
    f = field_options(f, sonar=sonar)
    f = medium_options(f)
    return probe_options(f)


def given(name: str) -> bool:
    """Whether the option ``name`` was typed or came from a setup file (not its default)."""
    ctx = click.get_current_context()
    return ctx.get_parameter_source(name) not in (None, click.core.ParameterSource.DEFAULT)


def technique_from(p: dict, *, depths=(), levels=(), far_field_only=False, sonar=None):
    """The :class:`beamspread.Technique` the options ``p`` (the command's params) describe.

    Raises
    ------
    click.UsageError
        Options that do not go together (a wedge and a water path, an angle
        without a wedge...), named as typed.
    """
    from .. import technique as t
    from ..conventions import Mode

    get = p.get
    sonar = sonar or t.Sonar()
    on_wedge = get("wedge") is not None or get("wedge_speed") is not None
    immersed = get("water_path") is not None or get("focus") is not None
    if on_wedge and immersed:
        raise click.UsageError(
            "give a wedge (--wedge/--wedge-speed) or a water path (--water-path/--focus), not both"
        )
    if (on_wedge or immersed) and sonar.asked:
        raise click.UsageError(
            "--sonar, --bottom-depth and --power describe a bare transducer "
            "in water, not an inspection setup"
        )
    if get("water_path") is None and get("focus") is None and given("couplant"):
        raise click.UsageError("--couplant describes the water path: give --water-path too")
    if not on_wedge and any(get(k) is not None for k in ("incident", "refracted", "wedge_path")):
        raise click.UsageError(
            "--incident, --refracted and --wedge-path need --wedge or --wedge-speed"
        )
    if on_wedge:
        if get("wedge") is not None and get("wedge_speed") is not None:
            raise click.UsageError("give --wedge NAME or --wedge-speed SPEED, not both")
        if get("incident") is not None and get("refracted") is not None:
            raise click.UsageError(
                "give the wedge's --incident angle or the --refracted angle in the part, not both"
            )
        if get("incident") is None and get("refracted") is None:
            raise click.UsageError(
                "give the wedge's --incident angle or the --refracted angle in the part"
            )
    element = make_probe(get("diameter"), get("length"), get("width"), get("frequency"))
    if get("focus") is not None:
        from dataclasses import replace

        element = replace(element, focus=get("focus"))
    if (get("material") is None) == (get("speed") is None):
        raise click.UsageError("give either --material NAME or --speed SPEED")
    temperature = get("temperature")
    if get("speed") is not None:
        if on_wedge or get("water_path") is not None:
            temperature = None  # it is the wedge's or the couplant's
        if temperature is not None or get("conditions"):
            raise click.UsageError(
                "--temperature and --condition describe a --material; "
                "with --speed they mean nothing"
            )
    medium = t.PartMedium(
        material=get("material"),
        speed=get("speed"),
        wave=get("wave"),
        temperature=temperature if get("speed") is None else None,
        conditions=tuple(get("conditions") or ()),
    )
    coupling = t.Contact()
    if on_wedge:
        coupling = t.WedgeCoupling(
            get("wedge"),
            get("wedge_speed"),
            get("incident"),
            get("refracted"),
            get("wedge_path"),
            get("temperature"),
        )
    elif get("water_path") is not None:
        coupling = t.WaterCoupling(
            get("water_path"), get("couplant") or "water", get("temperature")
        )
    pulse_echo = get("pulse_echo")
    mode = None if pulse_echo is None else (Mode.PULSE_ECHO if pulse_echo else Mode.ONE_WAY)
    pulse = None
    if not far_field_only:
        bandwidth = get("bandwidth") if given("bandwidth") or not sonar.conventions else None
        pulse = t.Pulse(bandwidth, get("spectrum") or "gaussian", get("frequency_count") or 32)
    if get("focus") is not None and pulse is None and depths:
        raise click.UsageError(
            "--far-field-only: a focused probe has no far-field width (the flat "
            "element's cone does not converge); drop it to get the computed widths at --depth"
        )
    request = t.Request(tuple(depths), tuple(levels), mode, pulse)
    return t.Technique(element, medium, coupling, get("thickness"), request, sonar)
