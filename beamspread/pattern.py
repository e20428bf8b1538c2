"""Far-field directivity of flat pistons, and the angles where it falls to a level.

One-way (transmit only) the amplitude pattern of a baffled piston is

.. math:: D_{disc}(\\theta) = \\frac{2 J_1(x)}{x}, \\quad x = \\frac{\\pi D \\sin\\theta}{\\lambda}

for a disc of diameter :math:`D`, and in each plane of a rectangle of side
:math:`L` (the pattern is separable)

.. math:: D_{side}(\\theta) = \\frac{\\sin x}{x}, \\quad x = \\frac{\\pi L \\sin\\theta}{\\lambda}.

Pulse-echo (transmit x receive, the same element) the pattern is squared, so a
level of -N dB pulse-echo is -N/2 dB one-way. Angles are found by bisection on
the exact pattern inside the main lobe; nothing here uses rounded constants.

References
----------
L. E. Kinsler, A. R. Frey, A. B. Coppens and J. V. Sanders, *Fundamentals of
Acoustics*, chapter on radiation from a baffled piston.
J. Krautkramer and H. Krautkramer, *Ultrasonic Testing of Materials*
(Springer), section on the sound field of a circular oscillator, Table 4.2.
"""

from __future__ import annotations

from functools import cache, lru_cache

import numpy as np

from ._bessel import j1, jinc

__all__ = [
    "MODES",
    "SHAPES",
    "directivity",
    "first_null",
    "first_null_x",
    "half_angle",
    "level_amplitude",
    "pattern_x",
]

MODES = ("pulse-echo", "one-way")
SHAPES = ("disc", "side")


def _check_shape(shape: str) -> None:
    if shape not in SHAPES:
        raise ValueError(f"shape {shape!r} is unknown; use one of {', '.join(SHAPES)}")


def _check_mode(mode: str) -> None:
    if mode not in MODES:
        raise ValueError(f"mode {mode!r} is unknown; use one of {', '.join(MODES)}")


def _sinc(x) -> np.ndarray:
    return np.sinc(np.asarray(x) / np.pi)  # numpy's sinc is sin(pi t)/(pi t)


_PATTERNS = {"disc": jinc, "side": _sinc}  # one-way amplitude by pattern family


def _pattern(shape: str, x: np.ndarray) -> np.ndarray:
    return _PATTERNS[shape](x)


def _bisect(f, lo: np.ndarray, hi: np.ndarray, iterations: int = 64) -> np.ndarray:
    """Vectorised bisection for f(lo) > 0 > f(hi); returns the midpoint."""
    lo = np.array(lo, dtype=float, copy=True)
    hi = np.array(hi, dtype=float, copy=True)
    for _ in range(iterations):
        mid = 0.5 * (lo + hi)
        positive = f(mid) > 0.0
        lo = np.where(positive, mid, lo)
        hi = np.where(positive, hi, mid)
    return 0.5 * (lo + hi)


@cache
def first_null_x(shape: str) -> float:
    """The argument ``x`` of the pattern's first zero: j(1,1) for a disc, pi for a side.

    j(1,1) = 3.8317... is found here by bisection on J1 between 3 and 4.5,
    where J1 has its first positive zero.
    """
    _check_shape(shape)
    return _FIRST_ZERO[shape]()


_FIRST_ZERO = {
    "side": lambda: float(np.pi),
    "disc": lambda: float(_bisect(lambda x: j1(x), np.array(3.0), np.array(4.5))),
}


def level_amplitude(level_db: np.ndarray | float, mode: str = "pulse-echo") -> np.ndarray:
    """The one-way pattern amplitude that corresponds to ``level_db`` dB down.

    One-way: ``10**(-L/20)``. Pulse-echo, where the pattern is squared:
    ``10**(-L/40)``.
    """
    _check_mode(mode)
    level = np.abs(np.asarray(level_db, dtype=float))
    return 10.0 ** (-level / (40.0 if mode == "pulse-echo" else 20.0))


def directivity(
    theta: np.ndarray | float,
    aperture: np.ndarray | float,
    wavelength: np.ndarray | float,
    shape: str = "disc",
    mode: str = "one-way",
) -> np.ndarray:
    """The far-field amplitude pattern at angle ``theta`` (radians) from the axis.

    Parameters
    ----------
    theta : array_like
        Angle from the beam axis, rad.
    aperture : array_like
        Diameter of a disc, or the side of a rectangle in the plane of ``theta``, m.
    wavelength : array_like
        Wavelength in the medium, m.
    shape : {"disc", "side"}
        ``"disc"`` for 2 J1(x)/x, ``"side"`` for sin(x)/x.
    mode : {"one-way", "pulse-echo"}
        Pulse-echo squares the one-way pattern.

    Returns
    -------
    ndarray
        Signed amplitude relative to the axis (negative in odd side lobes
        one-way).

    Examples
    --------
    >>> float(directivity(0.0, 0.01, 0.001))
    1.0
    """
    _check_shape(shape)
    _check_mode(mode)
    x = np.pi * np.asarray(aperture) * np.sin(theta) / np.asarray(wavelength)
    d = _pattern(shape, x)
    return d * d if mode == "pulse-echo" else d


def pattern_x(level_db: np.ndarray | float, shape: str = "disc", mode: str = "pulse-echo"):
    """The main-lobe argument ``x`` where the pattern falls to ``level_db`` dB down.

    The constant ``k`` of the form ``sin(theta) = k lambda / D`` is ``x / pi``.
    Each distinct (level, shape, mode) is solved once by bisection and kept,
    so repeated calls cost a dictionary look-up.

    Examples
    --------
    >>> round(float(pattern_x(6.0, "disc", "pulse-echo")) / 3.141592653589793, 2)
    0.51
    """
    _check_shape(shape)
    _check_mode(mode)
    level = np.abs(np.asarray(level_db, dtype=float))
    if level.ndim == 0:
        return np.asarray(_level_x(float(level), shape, mode))
    if level.size <= _FEW:  # a handful of levels (a beam's): look each up
        found = [_level_x(float(value), shape, mode) for value in level.ravel()]
        return np.array(found).reshape(level.shape)
    distinct, inverse = np.unique(level, return_inverse=True)
    found = np.array([_level_x(float(value), shape, mode) for value in distinct])
    return found[inverse.reshape(level.shape)]


_FEW = 16  # up to this many levels are looked up one by one rather than sorted first


@lru_cache(maxsize=1024)
def _level_x(level_db: float, shape: str, mode: str) -> float:
    """The main-lobe argument for one level, found once per (level, shape, mode)."""
    target = level_amplitude(level_db, mode)
    lo = np.zeros_like(target)
    hi = np.full_like(target, first_null_x(shape))
    return float(_bisect(lambda x: _pattern(shape, x) - target, lo, hi))


def _angle_from_x(x, aperture, wavelength) -> np.ndarray:
    s = np.asarray(x) * np.asarray(wavelength) / (np.pi * np.asarray(aperture))
    if s.ndim == 0 and -1.0 <= s <= 1.0:  # one angle: the same value without the masking
        return np.asarray(np.arcsin(s))
    with np.errstate(invalid="ignore"):
        return np.where(s <= 1.0, np.arcsin(np.minimum(s, 1.0)), np.nan)


def half_angle(
    level_db: np.ndarray | float,
    aperture: np.ndarray | float,
    wavelength: np.ndarray | float,
    shape: str = "disc",
    mode: str = "pulse-echo",
) -> np.ndarray:
    """Half-angle (rad) at which the main lobe falls to ``level_db`` dB below the axis.

    Parameters
    ----------
    level_db : array_like
        Level below the peak, dB (the sign is ignored: 6 and -6 both mean 6 dB down).
    aperture : array_like
        Diameter of a disc, or the side of a rectangle in the plane, m.
    wavelength : array_like
        Wavelength, m.
    shape : {"disc", "side"}
    mode : {"pulse-echo", "one-way"}

    Returns
    -------
    ndarray
        The half-angle in radians, broadcast over the inputs; NaN where the
        pattern has not fallen to the level by 90 degrees (an element small
        against the wavelength). Callers that show results turn NaN into
        "none" with a note.

    Notes
    -----
    Solves :math:`D(x) = 10^{-L/20}` one-way, or :math:`D(x)^2 = 10^{-L/20}`
    pulse-echo, for :math:`x` in the main lobe, then
    :math:`\\sin\\theta = x\\lambda/(\\pi a)`.

    Examples
    --------
    Krautkramer's echo-field constant for -6 dB, sin(theta) = 0.51 lambda/D:

    >>> import numpy as np
    >>> round(float(np.sin(half_angle(6, 0.01, 0.001)) * 0.01 / 0.001), 2)
    0.51
    """
    x = pattern_x(level_db, shape, mode)
    return _angle_from_x(x, aperture, wavelength)


def first_null(
    aperture: np.ndarray | float, wavelength: np.ndarray | float, shape: str = "disc"
) -> np.ndarray:
    """Half-angle (rad) of the first zero of the pattern; NaN where it lies past 90 degrees.

    ``sin(theta) = 1.2197 lambda / D`` for a disc (j(1,1)/pi), ``lambda / L`` for a side.
    """
    return _angle_from_x(first_null_x(shape), aperture, wavelength)
