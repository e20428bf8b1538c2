"""Far-field half-angles and spot widths for many probes, depths and levels at once.

One call takes arrays of apertures, frequencies, speeds and depths (numpy
broadcasting) and returns arrays: a million probe/depth rows take a fraction
of a second. The level constants (the main-lobe argument where the pattern
falls to a level) are solved once per level, shape and mode and kept
(:func:`beamspread.pattern.pattern_x`), so the rows cost only arithmetic.

For a disc the aperture is its diameter; for a rectangle, call once per
plane with the side in that plane (the pattern is separable). The near
field of many discs at once is :func:`beamspread.axis.disc_near_field`,
which broadcasts the same way; :class:`beamspread.Disc` and
:class:`beamspread.Rectangle` describe one element each, so build arrays
of their dimensions rather than arrays of them.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from . import pattern
from .errors import InputError

__all__ = ["FarFieldBeams", "far_field_beams"]


@dataclass(frozen=True)
class FarFieldBeams:
    """Arrays of far-field results, all in the broadcast shape of the inputs.

    ``half_angle`` and ``first_null`` are in radians, ``width`` in metres
    (:math:`2 z \\tan\\theta`); NaN where the pattern does not fall to the
    level (or reach zero) before 90 degrees.
    """

    half_angle: np.ndarray
    width: np.ndarray
    first_null: np.ndarray


def _positive(value, name: str, unit: str) -> np.ndarray:
    array = np.asarray(value, dtype=float)
    if not (np.isfinite(array).all() and (array > 0.0).all()):
        raise InputError(f"{name}: every value must be a finite number above 0 {unit}")
    return array


def far_field_beams(
    aperture,
    frequency,
    speed,
    depth,
    *,
    level_db: float = 6.0,
    shape: str = "disc",
    mode: str = "pulse-echo",
) -> FarFieldBeams:
    """Far-field half-angle, spot width and first null for arrays of probes and depths.

    Parameters
    ----------
    aperture : array_like
        Disc diameters, or rectangle sides in the plane of interest, m.
    frequency : array_like
        Centre frequencies, Hz.
    speed : array_like
        Sound speeds, m/s.
    depth : array_like
        Depths for the spot widths, m (above 0).
    level_db : float
        Level below the on-axis amplitude, dB (6 and -6 both mean 6 dB down).
    shape : {"disc", "side"}
        ``"disc"`` for a disc (2 J1(x)/x), ``"side"`` for a side of a rectangle (sin x / x).
    mode : {"pulse-echo", "one-way"}
        Pulse-echo squares the one-way pattern.

    Returns
    -------
    FarFieldBeams
        ``half_angle`` (rad), ``width`` (m) and ``first_null`` (rad), broadcast
        over the four array inputs.

    Raises
    ------
    InputError
        A value that is not finite and above 0, inputs that do not broadcast,
        an unknown shape or mode.

    Notes
    -----
    :math:`\\sin\\theta = x_L \\lambda / (\\pi a)`, :math:`\\lambda = c/f`, with
    :math:`x_L` the main-lobe argument of the level (solved once and kept);
    :math:`w = 2 z \\tan\\theta`, the same as :func:`beamspread.analyse`'s
    far-field spots.

    Examples
    --------
    Three discs at 5 MHz in steel, each at 100 mm:

    >>> import numpy as np
    >>> beams = far_field_beams([0.006, 0.010, 0.020], 5e6, 5920.0, 0.1)
    >>> np.round(np.degrees(beams.half_angle), 3)
    array([5.818, 3.487, 1.743])
    >>> np.round(beams.width * 1e3, 2)
    array([20.38, 12.19,  6.08])
    """
    if shape not in pattern.SHAPES:
        raise InputError(f"shape {shape!r} is unknown; use one of {', '.join(pattern.SHAPES)}")
    if mode not in pattern.MODES:
        raise InputError(f"mode {mode!r} is unknown; use one of {', '.join(pattern.MODES)}")
    level = float(level_db)
    if not np.isfinite(level):
        raise InputError(f"level: {level_db!r} dB is not a finite number")
    arrays = (
        _positive(aperture, "aperture", "m"),
        _positive(frequency, "frequency", "Hz"),
        _positive(speed, "speed", "m/s"),
        _positive(depth, "depth", "m"),
    )
    try:
        aperture, frequency, speed, depth = np.broadcast_arrays(*arrays)
    except ValueError as error:
        raise InputError(f"far-field beams: the inputs do not broadcast ({error})") from None
    # lambda / (pi a), once for both angles
    scale = speed / (np.pi * frequency * aperture)
    x_level = float(pattern.pattern_x(level, shape, mode))
    with np.errstate(invalid="ignore"):
        s = x_level * scale
        half = np.where(s <= 1.0, np.arcsin(np.minimum(s, 1.0)), np.nan)
        s_null = pattern.first_null_x(shape) * scale
        null = np.where(s_null <= 1.0, np.arcsin(np.minimum(s_null, 1.0)), np.nan)
    return FarFieldBeams(half, 2.0 * depth * np.tan(half), null)
