"""Inverse design: the element size (or frequency) that gives a wanted beam.

The forward model (:mod:`beamspread.pattern`) says that the main lobe of a
flat piston falls to a level :math:`L` at

.. math:: \\sin\\theta = \\frac{x_L \\lambda}{\\pi a}

where :math:`a` is the diameter of a disc (or the side of a rectangle in the
plane of :math:`\\theta`) and :math:`x_L` is the pattern argument at that level,
one-way or pulse-echo (:func:`beamspread.pattern.pattern_x`). Solving it for
:math:`a` (given the frequency) or for the frequency (given :math:`a`) is
exact; there is no rounded constant. A target is one of

* a half-angle or a full angle at the level;
* a spot: a full width :math:`w` at a depth :math:`z`, i.e. the half-angle
  :math:`\\arctan(w / 2z)` of the far-field cone. The cone holds only beyond
  the near field, so a spot whose solution puts the depth inside its own near
  field has no far-field answer: the solver refuses it and says how small a
  spot the far field allows at that depth (the element whose near field
  reaches exactly to the depth).

Every function broadcasts over its inputs (targets, frequencies, speeds,
sizes) and returns a :class:`Design` whose fields have the broadcast shape
(plain floats for scalar inputs). A target no element can meet raises
:class:`beamspread.InputError` with a plain message, or gives NaN with
``on_impossible="nan"``.
"""

from __future__ import annotations

import numpy as np

from .. import axis, pattern
from ..errors import InputError
from ..probes import Rectangle
from ..sonar.conventions import SONAR_MODE
from ..sonar.directivity import directivity_index, disc_directivity_factor
from ..units import length_text as _mm
from ..units import parse_level
from .result import Design, make_design, scalar_or_array
from .targets import (
    check_mode,
    check_options,
    inside_near_field,
    parse_target,
    positive,
    spot_message,
)

__all__ = ["size_disc", "size_frequency", "size_rectangle_side", "smallest_spot"]


def _disc_di(diameter, wavelength):
    return 10.0 * np.log10(disc_directivity_factor(diameter, wavelength))


def smallest_spot(frequency, speed, depth, *, level_db=3.0, mode: str = SONAR_MODE):
    """The smallest far-field spot (m) a disc can give at ``depth`` and ``frequency``.

    A larger disc gives a narrower cone but a longer near field; the narrowest
    cone that still holds at ``depth`` is that of the disc whose near field
    :math:`(D^2 - \\lambda^2)/(4\\lambda)` ends exactly there,
    :math:`D = \\sqrt{\\lambda^2 + 4\\lambda z}`. NaN where even that disc's
    pattern does not fall to the level before 90 degrees.

    >>> round(smallest_spot(5e6, 1480.0, 0.040, level_db=6, mode="pulse-echo") * 1e3, 3)
    1.766
    """
    level = parse_level(level_db, "level")
    mode = check_mode(mode)
    wavelength = positive(speed, "speed", "m/s") / positive(frequency, "frequency", "Hz")
    z = positive(depth, "depth", "m")
    x = float(pattern.pattern_x(level, "disc", mode))
    largest = np.sqrt(wavelength * wavelength + 4.0 * wavelength * z)
    s = x * wavelength / (np.pi * largest)
    with np.errstate(invalid="ignore"):
        return scalar_or_array(
            np.where(s < 1.0, 2.0 * z * np.tan(np.arcsin(np.minimum(s, 1.0))), np.nan)
        )


def size_disc(
    frequency,
    speed,
    *,
    half_angle_deg=None,
    full_angle_deg=None,
    spot=None,
    depth=None,
    level_db=3.0,
    mode: str = SONAR_MODE,
    on_impossible: str = "raise",
) -> Design:
    """The disc diameter that gives a target beam at a frequency.

    Parameters
    ----------
    frequency : array_like
        Hz.
    speed : array_like
        Sound speed of the medium, m/s.
    half_angle_deg, full_angle_deg : array_like, optional
        The target angle at ``level_db``, degrees.
    spot, depth : array_like, optional
        The target full width (m) at a depth (m). With an angle target,
        ``depth`` only asks for the footprint there.
    level_db : float
        dB below the peak (3, -3 and "3dB" all mean 3 dB down).
    mode : {"one-way", "pulse-echo"}
        One-way by default, as the sonar trade quotes beams.
    on_impossible : {"raise", "nan"}

    Returns
    -------
    Design

    Raises
    ------
    InputError
        For a half angle of 90 degrees or more (full 180 or more), which no
        element gives, and for a spot whose solution has the depth inside its
        own near field.

    Examples
    --------
    A 20 degree one-way -3 dB cone at 200 kHz in seawater:

    >>> d = size_disc(200e3, 1500.0, full_angle_deg=20.0)
    >>> round(d.diameter * 1e3, 1), round(d.full_angle_deg, 6)
    (22.2, 20.0)
    """
    level, mode = check_options(level_db, mode, on_impossible)
    frequency = positive(frequency, "frequency", "Hz")
    speed = positive(speed, "speed", "m/s")
    theta, depth, kind = parse_target(half_angle_deg, full_angle_deg, spot, depth)
    x = float(pattern.pattern_x(level, "disc", mode))
    wavelength = speed / frequency
    theta, depth, wavelength, frequency, speed = np.broadcast_arrays(
        theta, depth, wavelength, frequency, speed
    )
    diameter = x * wavelength / (np.pi * np.sin(theta))
    near = axis.disc_near_field(diameter, wavelength)
    impossible = inside_near_field(kind, depth, near)
    if on_impossible == "raise" and np.any(impossible):
        i = np.flatnonzero(impossible)[0]
        z = depth.flat[i]
        smallest = smallest_spot(frequency.flat[i], speed.flat[i], z, level_db=level, mode=mode)
        solution = f"the disc that gives it ({_mm(diameter.flat[i])})"
        raise InputError(
            spot_message(z, 2.0 * z * np.tan(theta.flat[i]), solution, near.flat[i], smallest)
        )
    element = (diameter, None, frequency, speed, wavelength)
    beam = (theta, None, near, _disc_di(diameter, wavelength))
    return make_design("disc", "diameter", mode, level, element, beam, depth, impossible)


def size_frequency(
    diameter,
    speed,
    *,
    half_angle_deg=None,
    full_angle_deg=None,
    spot=None,
    depth=None,
    level_db=3.0,
    mode: str = SONAR_MODE,
    on_impossible: str = "raise",
) -> Design:
    """The frequency at which a disc of ``diameter`` (m) gives a target beam.

    Parameters and results as :func:`size_disc`, with the diameter given.

    Examples
    --------
    >>> d = size_frequency(0.025, 1500.0, full_angle_deg=20.0)
    >>> round(d.frequency / 1e3, 1)
    177.5
    """
    level, mode = check_options(level_db, mode, on_impossible)
    diameter = positive(diameter, "diameter", "m")
    speed = positive(speed, "speed", "m/s")
    theta, depth, kind = parse_target(half_angle_deg, full_angle_deg, spot, depth)
    x = float(pattern.pattern_x(level, "disc", mode))
    theta, depth, diameter, speed = np.broadcast_arrays(theta, depth, diameter, speed)
    wavelength = np.pi * diameter * np.sin(theta) / x
    frequency = speed / wavelength
    near = axis.disc_near_field(diameter, wavelength)
    impossible = inside_near_field(kind, depth, near)
    if on_impossible == "raise" and np.any(impossible):
        i = np.flatnonzero(impossible)[0]
        d, z = diameter.flat[i], depth.flat[i]
        lam = -2.0 * z + np.sqrt(4.0 * z * z + d * d)  # the wavelength whose N is z
        s = x * lam / (np.pi * d)
        smallest = 2.0 * z * np.tan(np.arcsin(s)) if s < 1 else np.nan
        solution = (
            f"a {_mm(d)} disc at the frequency that gives it ({frequency.flat[i] / 1e6:.4g} MHz)"
        )
        message = spot_message(z, 2.0 * z * np.tan(theta.flat[i]), solution, near.flat[i], smallest)
        raise InputError(message + (" with this diameter" if np.isfinite(smallest) else ""))
    element = (diameter, None, frequency, speed, wavelength)
    beam = (theta, None, near, _disc_di(diameter, wavelength))
    return make_design("disc", "frequency", mode, level, element, beam, depth, impossible)


def size_rectangle_side(
    frequency,
    speed,
    other_side,
    *,
    half_angle_deg=None,
    full_angle_deg=None,
    spot=None,
    depth=None,
    level_db=3.0,
    mode: str = SONAR_MODE,
    on_impossible: str = "raise",
) -> Design:
    """One side of a rectangle that gives a target beam in its plane, the other side given.

    The pattern of a rectangle is separable: the angle in the plane of a side
    depends on that side alone, so the side follows from the target as for a
    disc (with sin x / x). The other side (m) sets the beam in the other plane
    (``other_half_angle_deg``), the near field and the directivity index.

    Parameters and results otherwise as :func:`size_disc`; the near field is
    the last on-axis maximum of the exact on-axis integral of the rectangle
    (:func:`beamspread.rectangle_near_field`).

    Examples
    --------
    >>> d = size_rectangle_side(200e3, 1500.0, 0.01, full_angle_deg=20.0)
    >>> round(d.aperture * 1e3, 1)
    19.1
    """
    level, mode = check_options(level_db, mode, on_impossible)
    frequency = positive(frequency, "frequency", "Hz")
    speed = positive(speed, "speed", "m/s")
    other = positive(other_side, "other side", "m")
    theta, depth, kind = parse_target(half_angle_deg, full_angle_deg, spot, depth)
    x = float(pattern.pattern_x(level, "side", mode))
    wavelength = speed / frequency
    theta, depth, wavelength, frequency, speed, other = np.broadcast_arrays(
        theta, depth, wavelength, frequency, speed, other
    )
    side = x * wavelength / (np.pi * np.sin(theta))
    other_half = pattern.half_angle(level, other, wavelength, "side", mode)
    near = np.empty(side.shape)
    di = np.empty(side.shape)
    for i in np.ndindex(side.shape):
        near[i] = axis.rectangle_near_field(side[i], other[i], wavelength[i])
        di[i] = directivity_index(Rectangle(side[i], other[i], frequency[i]), wavelength[i])
    impossible = inside_near_field(kind, depth, near)
    if on_impossible == "raise" and np.any(impossible):
        i = np.flatnonzero(impossible)[0]
        z = depth.flat[i]
        solution = f"the {_mm(side.flat[i])} by {_mm(other.flat[i])} rectangle that gives it"
        raise InputError(
            spot_message(z, 2.0 * z * np.tan(theta.flat[i]), solution, near.flat[i], np.nan)
        )
    element = (side, other, frequency, speed, wavelength)
    beam = (theta, other_half, near, di)
    return make_design("rectangle", "side", mode, level, element, beam, depth, impossible)
