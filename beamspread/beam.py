"""The far-field beam of a probe in a medium: near field, half-angles, spot sizes.

:func:`analyse` is the one entry point the command line uses; it returns a
:class:`BeamResult` that states its convention and carries every warning as
text. Nothing here prints, draws or reads files.
"""

from __future__ import annotations

import math
from collections.abc import Iterable, Sequence
from dataclasses import dataclass, field

import numpy as np

from . import pattern
from .conventions import Coupling, level_key
from .errors import InputError
from .media.quantities import Wave
from .probes import Probe, check_element, check_positive
from .units import length_text as _mm
from .units import parse_level, positive_numbers

__all__ = [
    "DEFAULT_BANDWIDTH",
    "DEFAULT_LEVELS",
    "Asked",
    "BeamResult",
    "Convention",
    "FieldSettings",
    "FieldSummary",
    "PlaneResult",
    "Spot",
    "analyse",
    "level_key",
]

DEFAULT_LEVELS = (6.0, 20.0)


@dataclass(frozen=True)
class Convention:
    """How the angles and widths of a result are meant."""

    mode: str  # "pulse-echo" or "one-way"
    angle: str = "half"
    reference: str = "dB below the on-axis amplitude at the same range"

    def describe(self) -> str:
        how = (
            "pulse-echo (transmit x receive: the one-way pattern squared)"
            if self.mode == "pulse-echo"
            else "one-way (transmit only)"
        )
        return f"{how}; {self.angle}-angles from the beam axis; levels in {self.reference}"


@dataclass(frozen=True)
class Spot:
    """The beam's full width at a depth and level, from the far-field model or the field."""

    depth: float  # m
    level_db: float  # negative: -6.0 means 6 dB down
    width: float | None  # m; None where the half-angle (or the crossing) does not exist
    far_field_valid: bool | None  # None for a width from the computed field
    method: str = "far-field"  # or "field"
    leg: int = 1  # 1 down from the probe; 2 after the back-wall bounce (angle beam)
    sound_path: float | None = None  # m along the beam axis (= depth straight down)
    surface_distance: float | None = None  # m from the probe's exit point along the surface
    footprint: float | None = None  # m: the width on the horizontal plane at the depth


DEFAULT_BANDWIDTH = 0.5


@dataclass(frozen=True)
class FieldSettings:
    """How the computed field is formed (see :mod:`beamspread.field`).

    ``bandwidth`` is the -6 dB fractional bandwidth of the measured spectrum
    (0: continuous wave); ``spectrum`` its shape; ``frequencies`` how many
    frequencies sample it.
    """

    bandwidth: float = DEFAULT_BANDWIDTH
    spectrum: str = "gaussian"
    frequencies: int = 32

    amplitude = (
        "spectral RMS of the echo of a small reflector at the point (pulse-echo), "
        "or of the transmitted pulse there (one-way)"
    )


@dataclass(frozen=True)
class Asked:
    """What a beam is asked for, as the keywords of :func:`analyse` say it.

    ``depths`` (m), ``levels`` (dB below the peak), ``mode`` (``"pulse-echo"``
    or ``"one-way"``) and ``field``, the computed field's settings (None: the
    far field only). The couplings (:func:`beamspread.analyse_wedge`,
    :func:`beamspread.analyse_immersion`) take it whole.
    """

    depths: Sequence[float] = ()
    levels: Sequence[float | str] = DEFAULT_LEVELS
    mode: str = "pulse-echo"
    field: FieldSettings | None = None


@dataclass(frozen=True)
class FieldSummary:
    """What the computed field adds to a result beside the widths."""

    settings: FieldSettings
    axial_maximum: float | None  # m: the last on-axis maximum of the computed amplitude


@dataclass(frozen=True)
class PlaneResult:
    """One plane of the beam: a disc has one (diameter), a rectangle two (length, width)."""

    name: str
    aperture: float  # m
    half_angles: dict[str, float | None]  # level key or "null" -> degrees
    spots: tuple[Spot, ...] = ()


@dataclass(frozen=True)
class BeamResult:
    """Everything :func:`analyse` found, in SI units with its convention."""

    probe: Probe
    wave: Wave
    convention: Convention
    levels: tuple[float, ...]
    wavelength: float
    near_field: float | None
    near_field_simple: float | None  # None where the part lies wholly in the far field
    near_field_method: str
    near_field_factor: float | None
    planes: tuple[PlaneResult, ...]
    depths: tuple[float, ...] = ()
    warnings: tuple[str, ...] = field(default_factory=tuple)
    near_field_simple_method: str | None = None  # where not the plain D²/4λ or L²/4λ
    field: FieldSummary | None = None
    coupling: Coupling = Coupling.CONTACT  # how the beam got into the part
    focus: float | None = None  # m: the element's focal length, None for a flat element


def _levels(levels: Iterable[float | str]) -> tuple[float, ...]:
    out: list[float] = []
    for level in levels:
        value = parse_level(level, "level")
        if value not in out:
            out.append(value)
    if not out:
        raise InputError("level: give at least one level in dB below the peak")
    return tuple(out)


def _depths(depths: Iterable[float]) -> tuple[float, ...]:
    rule = "a depth must lie in front of the face (above 0)"
    return tuple(dict.fromkeys(positive_numbers(depths, "depth", rule)))


def analyse(
    probe: Probe,
    wave: Wave | float,
    *,
    levels: Sequence[float | str] = DEFAULT_LEVELS,
    depths: Sequence[float] = (),
    mode: str = "pulse-echo",
    field: FieldSettings | None = None,
) -> BeamResult:
    """Near field, half-angles and spot sizes of ``probe`` in a medium.

    Parameters
    ----------
    probe : Disc or Rectangle
    wave : Wave or float
        The resolved medium (see :meth:`beamspread.Material.evaluate`) or a speed in m/s.
    levels : sequence
        Levels in dB below the peak (6, "-6" and "6dB" all mean 6 dB down).
    depths : sequence of float
        Depths for spot sizes, m (in front of the face, above 0).
    mode : {"pulse-echo", "one-way"}
    field : FieldSettings, optional
        Also compute each spot from the real field (:func:`beamspread.field.beam_width`),
        near field included, beside the far-field estimate.

    Returns
    -------
    BeamResult

    Notes
    -----
    Spot width at depth :math:`z` is the far-field estimate
    :math:`w = 2 z \\tan\\theta` per plane and level; it is flagged
    ``far_field_valid = False`` inside the near field, where it does not hold.
    With ``field``, a second spot per depth, level and plane carries the width
    of the computed field between the outermost crossings of the level below
    the maximum at that depth (``method = "field"``).

    Examples
    --------
    >>> from beamspread import Disc
    >>> r = analyse(Disc(0.010, 5e6), 5920.0, depths=[0.1])
    >>> round(r.wavelength * 1e3, 3), round(r.near_field * 1e3, 2)
    (1.184, 20.82)
    >>> r.planes[0].half_angles["-6"]  # doctest: +ELLIPSIS
    3.486...
    """
    check_element(probe, probe=True)
    if mode not in pattern.MODES:
        raise InputError(f"mode {mode!r} is unknown; use one of {', '.join(pattern.MODES)}")
    if not isinstance(wave, Wave):
        wave = Wave.given(check_positive(wave, "speed", "m/s"))
    level_list = _levels(levels)
    depth_list = _depths(depths)
    wavelength = wave.speed / probe.frequency
    warnings: list[str] = list(wave.warnings)

    longest = probe.longest_side
    found = probe.near_field(wavelength)
    near, near_simple, method, factor = found.length, found.simple, found.method, found.factor
    if math.isnan(near):
        warnings.append(
            f"no near field: the element ({_mm(longest)}) is no larger than a wavelength "
            f"({_mm(wavelength)}), so the on-axis field has no maximum in front of the face"
        )
        near_field = None
    else:
        near_field = near

    planes = []
    for name, aperture in probe.planes:
        angles = np.degrees(probe.half_angle(level_list, wavelength, mode, name))
        null = float(np.degrees(probe.first_null(wavelength, name)))
        half_angles: dict[str, float | None] = {}
        for level, angle in zip(level_list, angles, strict=True):
            if math.isnan(angle):
                half_angles[level_key(level)] = None
                warnings.append(
                    f"no {level_key(level)} dB half-angle in the {name} plane: the {mode} "
                    f"pattern of a {_mm(aperture)} aperture ({aperture / wavelength:.3g} "
                    f"wavelengths) does not fall to {level_key(level)} dB before 90 degrees"
                )
            else:
                half_angles[level_key(level)] = float(angle)
        if math.isnan(null):
            half_angles["null"] = None
            warnings.append(
                f"no first null in the {name} plane: a {_mm(aperture)} aperture is too small "
                "against the wavelength for the pattern to reach zero before 90 degrees"
            )
        else:
            half_angles["null"] = null
        spots = []
        for depth in depth_list:
            valid = near_field is None or depth >= near_field
            for level in level_list:
                angle = half_angles[level_key(level)]
                width = None if angle is None else 2.0 * depth * math.tan(math.radians(angle))
                spots.append(straight_spot(depth, level, width, valid))
            if field is not None:
                spots.extend(field_spots(probe, wave.speed, depth, level_list, name, mode, field))
        planes.append(PlaneResult(name, aperture, half_angles, tuple(spots)))

    summary = None
    if field is not None:
        from .field import last_maximum

        axial = last_maximum(
            probe,
            wave.speed,
            bandwidth=field.bandwidth,
            mode=mode,
            frequencies=field.frequencies,
            spectrum=field.spectrum,
        )
        summary = FieldSummary(field, None if math.isnan(axial) else axial)
        shallow = [d for d in depth_list if d < 0.05 * near_simple]
        if shallow:
            warnings.append(
                f"depth {_mm(shallow[0])} lies closer than 0.05 N ({_mm(0.05 * near_simple)}) "
                "to the face, where the computed field is not validated"
            )

    inside = [d for d in depth_list if near_field is not None and d < near_field]
    if len(inside) == 1:
        warnings.append(
            f"depth {_mm(inside[0])} lies inside the near field ({_mm(near_field)}): "
            "the far-field spot size does not hold there"
        )
    elif inside:
        warnings.append(
            f"{len(inside)} depths, {_mm(min(inside))} to {_mm(max(inside))}, lie inside the "
            f"near field ({_mm(near_field)}): the far-field spot size does not hold there"
        )
    return beam_result(
        (probe, wave, mode, level_list, depth_list, planes, warnings),
        near_field=near_field,
        near_field_simple=near_simple,
        near_field_method=method,
        near_field_factor=factor,
        field=summary,
    )


def beam_result(analysed, **figures) -> BeamResult:
    """A :class:`BeamResult` from what every analysis finds and its near-field ``figures``.

    ``analysed`` is (probe, wave in the part, mode, levels, depths, planes, warnings); the
    figures are the near-field keywords of :class:`BeamResult` and its ``field`` summary.
    """
    probe, wave, mode, levels, depths, planes, warnings = analysed
    return BeamResult(
        probe=probe,
        wave=wave,
        convention=Convention(mode),
        levels=levels,
        wavelength=wave.speed / probe.frequency,
        planes=tuple(planes),
        depths=depths,
        warnings=tuple(warnings),
        **figures,
    )


def field_spots(probe, speed, depth, levels, plane, mode, settings: FieldSettings, at=None):
    """Field spots at ``depth``, computed at range ``at`` (default ``depth``) from the element."""
    from .field import beam_widths

    found = beam_widths(
        probe,
        speed,
        depth if at is None else at,
        levels,
        plane=plane,
        bandwidth=settings.bandwidth,
        mode=mode,
        frequencies=settings.frequencies,
        spectrum=settings.spectrum,
    )
    return straight_field_spots(found, depth)


def straight_field_spots(widths, depth: float) -> list[Spot]:
    """The computed-field Spots of a straight beam at ``depth`` from its BeamWidths."""
    return [
        straight_spot(depth, w.level_db, None if math.isnan(w.width) else w.width, None, "field")
        for w in widths
    ]


def straight_spot(depth, level_db, width, valid, method="far-field") -> Spot:
    """The spot of a beam straight down at ``depth`` (m) and ``level_db`` (dB down, positive):
    its sound path is the depth, its footprint its width."""
    return Spot(
        depth,
        -abs(level_db),
        width,
        valid,
        method=method,
        sound_path=depth,
        surface_distance=0.0,
        footprint=width,
    )
