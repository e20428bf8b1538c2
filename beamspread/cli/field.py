"""What ``beamspread axis``, ``across`` and ``map`` share: the computed technique and its checks.

The commands themselves live in :mod:`beamspread.cli.profiles` (axis and
across) and :mod:`beamspread.cli.fieldmap` (map).
"""

from __future__ import annotations

import click

from .options import check_plot, load_registry
from .techniqueargs import technique_from

MAX_PROFILE_POINTS = 100_000
MAX_MAP_POINTS = 4_194_304  # 32 MB of float64 amplitudes; the engine works in bounded blocks


class FieldRun:
    """A field command's technique, computed: the result, its pulse and the warnings so far.

    The field commands read the beam in the part through the result's
    :class:`beamspread.source.FieldSource`: the element itself in contact, the
    virtual element on a wedge (along the sound path), the element in the
    couplant at the water-equivalent range behind a water path, focused or not.
    """

    def __init__(self, options: dict, plot_path, force_plot: bool):
        from ..pipeline import compute
        from ..render.captions import inputs_caption
        from ..render.text.common import field_description

        check_plot(plot_path, force_plot)
        technique = technique_from(options)
        registry = load_registry(options["materials_dirs"]) if technique.names_a_medium else None
        self.result = result = compute(technique, registry=registry)
        self.settings, self.mode, self.source = result.settings, result.mode, result.source
        self.warnings = list(result.warnings)
        self.reference = _reference_length(result)
        # What the renderers name the inputs by: the element, the part's wave, the pulse, the mode.
        self.inputs = (result.technique.element, result.beam.wave, self.settings, self.mode)
        self.caption = inputs_caption(
            result.technique.element, result.beam.wave, field_description(self.settings, self.mode)
        )

    def depth_range(self, start, stop, points: int, what: str, first: float):
        """``--from`` and ``--to``, by default ``first`` N and 3 N, checked.

        A range that starts closer to the face than the computed field is
        validated adds a warning.
        """
        start = first * self.reference if start is None else start
        stop = 3.0 * self.reference if stop is None else stop
        _check_range(start, stop, points, what)
        self.check_validity(start)
        return start, stop

    def check_validity(self, start: float) -> None:
        if self.result.coupling == "contact" and not self.result.focused:
            _check_validity(self.warnings, start, self.reference)

    def last_maximum(self):
        return _last_maximum(self.result, self.settings, self.mode)

    def axis_label(self) -> str:
        return _axis_label(self.result)

    def json(self, data: dict) -> str:
        """``data`` as JSON text, with the technique's coupling and coordinate beyond contact."""
        from ..render.serialize.common import dumps

        return dumps(_note(data, self.result))


def drew(path) -> None:
    click.echo(f"beamspread: drew {path}", err=True)


def _reference_length(result) -> float:
    """The near field the default ranges are scaled by, in the part's coordinate (m)."""
    beam, source = result.beam, result.source
    if beam.near_field_simple is not None:
        return beam.near_field_simple
    element = source.element
    return element.longest_side**2 * element.frequency / (4 * source.speed)


def _last_maximum(result, settings, mode):
    """The pulse's last on-axis maximum in the part's coordinate (m), None where none."""
    import math

    from ..field import last_maximum

    source = result.source
    if source.focus is not None:
        return None
    found = last_maximum(
        source.element,
        source.speed,
        bandwidth=settings.bandwidth,
        mode=mode,
        frequencies=settings.frequencies,
        spectrum=settings.spectrum,
    )
    if math.isnan(found) or found <= source.start:
        return None
    return (found - source.start) / source.stretch


def _axis_label(result) -> str:
    """What the field commands' depth axis is, for the technique."""
    if result.source.coordinate == "sound path":
        return "sound path in the part from the exit point"
    if result.setup is not None and result.source.start > 0:
        return "depth in the part"
    return "depth from the probe face"


def _note(data: dict, result) -> dict:
    """``data`` with the technique's coupling and coordinate added (beyond contact)."""
    from ..render.serialize.result import source_to_dict

    if result.coupling != "contact" or result.focused:
        data["source"] = source_to_dict(result)
    return data


def _check_plane(source, plane: str) -> str:
    names = list(source.planes)
    if plane not in names:
        raise click.BadParameter(
            f"{plane!r} is not a plane of this probe; use {' or '.join(names)}",
            param_hint="--plane",
        )
    return plane


def _check_range(start, stop, points, what):
    if stop <= start:
        raise click.UsageError(
            f"{what}: the range {start * 1e3:g} to {stop * 1e3:g} mm is "
            "empty; --to must lie beyond --from"
        )
    if points < 2:
        raise click.UsageError(f"{what}: at least 2 points are needed")


def _points_option(default, maximum, name="--points", help_text="Number of points."):
    return click.option(
        name,
        type=click.IntRange(2, maximum),
        default=default,
        show_default=True,
        help=f"{help_text} (2 to {maximum}).",
    )


def _check_validity(warnings, start, near_simple):
    if start < 0.05 * near_simple:
        warnings.append(
            f"depths from {start * 1e3:.4g} mm lie closer than 0.05 N "
            f"({0.05 * near_simple * 1e3:.4g} mm) to the face, where the computed field is "
            "not validated"
        )
