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

from dataclasses import dataclass

import numpy as np

from . import axis, pattern
from .errors import InputError
from .probes import Rectangle
from .sonar.conventions import SONAR_MODE
from .sonar.directivity import directivity_index, disc_directivity_factor
from .sonar.footprint import footprint_width
from .units import length_text as _mm
from .units import parse_level

__all__ = ["Design", "size_disc", "size_frequency", "size_rectangle_side", "smallest_spot"]


@dataclass(frozen=True)
class Design:
    """A solved element, in SI units with its convention.

    Attributes
    ----------
    shape : {"disc", "rectangle"}
    solved : {"diameter", "frequency", "side"}
        What was solved for.
    mode : {"one-way", "pulse-echo"}
    level_db : float
        Negative: -3.0 means the main lobe 3 dB down.
    aperture : float or ndarray
        The diameter, or the solved side of a rectangle, m.
    other_side : float, ndarray or None
        The given other side of a rectangle, m.
    frequency, speed, wavelength : float or ndarray
        Hz, m/s, m.
    half_angle_deg, full_angle_deg : float or ndarray
        The angles the solution gives (in the plane of ``aperture``).
    other_half_angle_deg : float, ndarray or None
        Rectangles: the half-angle at the same level in the other plane
        (NaN where the pattern does not fall to the level there).
    near_field : float or ndarray
        The last on-axis maximum, m; NaN where the element is too small to have one.
    directivity_index_db : float or ndarray
        :func:`beamspread.sonar.directivity.directivity_index` of the solution.
    depth : float or ndarray
        The depth of the footprint, m (NaN where none was asked for).
    footprint_width : float or ndarray
        The full width of the cone at ``depth``, ``2 depth tan(half_angle)``, m.
    far_field_at_depth : bool or ndarray
        Whether ``depth`` lies at or beyond the near field (the cone holds).
    """

    shape: str
    solved: str
    mode: str
    level_db: float
    aperture: float | np.ndarray
    other_side: float | np.ndarray | None
    frequency: float | np.ndarray
    speed: float | np.ndarray
    wavelength: float | np.ndarray
    half_angle_deg: float | np.ndarray
    full_angle_deg: float | np.ndarray
    other_half_angle_deg: float | np.ndarray | None
    near_field: float | np.ndarray
    directivity_index_db: float | np.ndarray
    depth: float | np.ndarray
    footprint_width: float | np.ndarray
    far_field_at_depth: bool | np.ndarray

    @property
    def diameter(self) -> float | np.ndarray:
        """The diameter of a disc solution, m."""
        if self.shape != "disc":
            raise AttributeError("a rectangle has no diameter; see aperture and other_side")
        return self.aperture


def _positive(value, name: str, unit: str) -> np.ndarray:
    try:
        array = np.asarray(value, dtype=float)
    except (TypeError, ValueError):
        raise InputError(f"{name}: {value!r} is not a number") from None
    bad = ~np.isfinite(array) | (array <= 0)
    if np.any(bad):
        shown = array[bad].flat[0] if array.ndim else float(array)
        raise InputError(
            f"{name}: {shown:g} {unit} is not allowed; it must be a finite number above 0"
        )
    return array


def _mode(mode: str) -> str:
    if mode not in pattern.MODES:
        raise InputError(f"mode {mode!r} is unknown; use one of {', '.join(pattern.MODES)}")
    return mode


def _target(half_angle_deg, full_angle_deg, spot, depth):
    """The target half-angle (rad), the footprint depth (m, NaN for none) and its kind."""
    given = [v is not None for v in (half_angle_deg, full_angle_deg, spot)]
    if sum(given) != 1:
        raise InputError("give one target: a half angle, a full angle, or a spot width at a depth")
    if spot is not None:
        if depth is None:
            raise InputError("a spot target needs the depth it is wanted at")
        w = _positive(spot, "spot", "m")
        z = _positive(depth, "depth", "m")
        return np.arctan(w / (2.0 * z)), z, "spot"
    if half_angle_deg is not None:
        half = np.asarray(half_angle_deg, dtype=float)
        if np.any(~np.isfinite(half)) or np.any(half <= 0):
            raise InputError("half angle: give an angle above 0 degrees")
        if np.any(half >= 90.0):
            raise InputError(
                f"half angle {np.max(half):g} degrees is not possible: even a point source "
                "(an element far smaller than the wavelength) only fills the half space in "
                "front of it, up to 90 degrees half angle; ask for less than 90"
            )
    else:
        full = np.asarray(full_angle_deg, dtype=float)
        if np.any(~np.isfinite(full)) or np.any(full <= 0):
            raise InputError("full angle: give an angle above 0 degrees")
        if np.any(full >= 180.0):
            raise InputError(
                f"full angle {np.max(full):g} degrees is not possible: even a point source "
                "(an element far smaller than the wavelength) only fills the half space in "
                "front of it, up to 180 degrees full angle; ask for less than 180"
            )
        half = 0.5 * full
    z = np.nan if depth is None else _positive(depth, "depth", "m")
    return np.radians(half), np.asarray(z, dtype=float), "angle"


def _out(array):
    array = np.asarray(array)
    if array.ndim == 0:
        return bool(array) if array.dtype == bool else float(array)
    return array


def _check_on_impossible(on_impossible: str) -> None:
    if on_impossible not in ("raise", "nan"):
        raise InputError(f"on_impossible {on_impossible!r} is unknown; use 'raise' or 'nan'")


def _inside_near_field(kind: str, depth: np.ndarray, near: np.ndarray) -> np.ndarray:
    """Where a spot target's depth lies inside its own solution's near field."""
    if kind != "spot":
        return np.zeros(near.shape, dtype=bool)
    with np.errstate(invalid="ignore"):
        return np.isfinite(near) & (depth < near)


def _spot_message(depth, spot_w, solution, near, smallest) -> str:
    return (
        f"no far-field solution for a {_mm(spot_w)} spot at {_mm(depth)}: {solution} "
        f"has its near field out to {_mm(near)}, beyond the depth, where the far-field cone "
        "does not hold"
        + (
            f"; the smallest far-field spot at that depth is {_mm(smallest)}"
            if np.isfinite(smallest)
            else ""
        )
    )


def _disc_di(diameter, wavelength):
    return 10.0 * np.log10(disc_directivity_factor(diameter, wavelength))


def _finish(
    shape,
    solved,
    mode,
    level,
    aperture,
    other,
    frequency,
    speed,
    wavelength,
    theta,
    other_half,
    near,
    di,
    depth,
    impossible,
) -> Design:
    aperture = np.where(impossible, np.nan, aperture)
    frequency = np.where(impossible, np.nan, frequency)
    wavelength = np.where(impossible, np.nan, wavelength)
    theta = np.where(impossible, np.nan, theta)
    near = np.where(impossible, np.nan, near)
    di = np.where(impossible, np.nan, di)
    width = footprint_width(depth, theta)
    with np.errstate(invalid="ignore"):
        far = np.isfinite(depth) & (np.isnan(near) | (depth >= near)) & ~impossible
    half_deg = np.degrees(theta)
    return Design(
        shape=shape,
        solved=solved,
        mode=mode,
        level_db=-level,
        aperture=_out(aperture),
        other_side=None if other is None else _out(other),
        frequency=_out(frequency),
        speed=_out(speed),
        wavelength=_out(wavelength),
        half_angle_deg=_out(half_deg),
        full_angle_deg=_out(2.0 * half_deg),
        other_half_angle_deg=None
        if other_half is None
        else _out(np.where(impossible, np.nan, np.degrees(other_half))),
        near_field=_out(near),
        directivity_index_db=_out(di),
        depth=_out(depth),
        footprint_width=_out(width),
        far_field_at_depth=_out(far),
    )


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
    mode = _mode(mode)
    wavelength = _positive(speed, "speed", "m/s") / _positive(frequency, "frequency", "Hz")
    z = _positive(depth, "depth", "m")
    x = float(pattern.pattern_x(level, "disc", mode))
    largest = np.sqrt(wavelength * wavelength + 4.0 * wavelength * z)
    s = x * wavelength / (np.pi * largest)
    with np.errstate(invalid="ignore"):
        return _out(np.where(s < 1.0, 2.0 * z * np.tan(np.arcsin(np.minimum(s, 1.0))), np.nan))


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
    level = parse_level(level_db, "level")
    mode = _mode(mode)
    _check_on_impossible(on_impossible)
    frequency = _positive(frequency, "frequency", "Hz")
    speed = _positive(speed, "speed", "m/s")
    theta, depth, kind = _target(half_angle_deg, full_angle_deg, spot, depth)
    x = float(pattern.pattern_x(level, "disc", mode))
    wavelength = speed / frequency
    theta, depth, wavelength, frequency, speed = np.broadcast_arrays(
        theta, depth, wavelength, frequency, speed
    )
    diameter = x * wavelength / (np.pi * np.sin(theta))
    near = axis.disc_near_field(diameter, wavelength)
    impossible = _inside_near_field(kind, depth, near)
    if on_impossible == "raise" and np.any(impossible):
        i = np.flatnonzero(impossible)[0]
        z = depth.flat[i]
        smallest = smallest_spot(frequency.flat[i], speed.flat[i], z, level_db=level, mode=mode)
        solution = f"the disc that gives it ({_mm(diameter.flat[i])})"
        raise InputError(
            _spot_message(z, 2.0 * z * np.tan(theta.flat[i]), solution, near.flat[i], smallest)
        )
    return _finish(
        "disc",
        "diameter",
        mode,
        level,
        diameter,
        None,
        frequency,
        speed,
        wavelength,
        theta,
        None,
        near,
        _disc_di(diameter, wavelength),
        depth,
        impossible,
    )


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
    level = parse_level(level_db, "level")
    mode = _mode(mode)
    _check_on_impossible(on_impossible)
    diameter = _positive(diameter, "diameter", "m")
    speed = _positive(speed, "speed", "m/s")
    theta, depth, kind = _target(half_angle_deg, full_angle_deg, spot, depth)
    x = float(pattern.pattern_x(level, "disc", mode))
    theta, depth, diameter, speed = np.broadcast_arrays(theta, depth, diameter, speed)
    wavelength = np.pi * diameter * np.sin(theta) / x
    frequency = speed / wavelength
    near = axis.disc_near_field(diameter, wavelength)
    impossible = _inside_near_field(kind, depth, near)
    if on_impossible == "raise" and np.any(impossible):
        i = np.flatnonzero(impossible)[0]
        d, z = diameter.flat[i], depth.flat[i]
        lam = -2.0 * z + np.sqrt(4.0 * z * z + d * d)  # the wavelength whose N is z
        s = x * lam / (np.pi * d)
        smallest = 2.0 * z * np.tan(np.arcsin(s)) if s < 1 else np.nan
        solution = (
            f"a {_mm(d)} disc at the frequency that gives it ({frequency.flat[i] / 1e6:.4g} MHz)"
        )
        message = _spot_message(
            z, 2.0 * z * np.tan(theta.flat[i]), solution, near.flat[i], smallest
        )
        raise InputError(message + (" with this diameter" if np.isfinite(smallest) else ""))
    return _finish(
        "disc",
        "frequency",
        mode,
        level,
        diameter,
        None,
        frequency,
        speed,
        wavelength,
        theta,
        None,
        near,
        _disc_di(diameter, wavelength),
        depth,
        impossible,
    )


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
    level = parse_level(level_db, "level")
    mode = _mode(mode)
    _check_on_impossible(on_impossible)
    frequency = _positive(frequency, "frequency", "Hz")
    speed = _positive(speed, "speed", "m/s")
    other = _positive(other_side, "other side", "m")
    theta, depth, kind = _target(half_angle_deg, full_angle_deg, spot, depth)
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
    impossible = _inside_near_field(kind, depth, near)
    if on_impossible == "raise" and np.any(impossible):
        i = np.flatnonzero(impossible)[0]
        z = depth.flat[i]
        solution = f"the {_mm(side.flat[i])} by {_mm(other.flat[i])} rectangle that gives it"
        raise InputError(
            _spot_message(z, 2.0 * z * np.tan(theta.flat[i]), solution, near.flat[i], np.nan)
        )
    return _finish(
        "rectangle",
        "side",
        mode,
        level,
        side,
        other,
        frequency,
        speed,
        wavelength,
        theta,
        other_half,
        near,
        di,
        depth,
        impossible,
    )
