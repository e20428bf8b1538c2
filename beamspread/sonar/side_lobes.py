"""The first side lobe of a disc or a rectangle's side: its level and its angle."""

from __future__ import annotations

import math
from dataclasses import dataclass
from functools import cache

import numpy as np

from .. import pattern
from .._bessel import jinc
from ..errors import InputError
from ..probes import check_positive
from .conventions import SONAR_MODE


def _j0(x: float) -> float:
    """J0 from Bessel's integral (1/pi) int_0^pi cos(x sin t) dt, trapezoidal rule.

    The integrand is smooth and periodic, so 64 nodes reach rounding level for
    the small arguments used here (|x| < 8).
    """
    tau = np.linspace(0.0, np.pi, 65)
    values = np.cos(x * np.sin(tau))
    return float((values[1:-1].sum() + 0.5 * (values[0] + values[-1])) / 64.0)


@cache
def _side_lobe_x(shape: str) -> tuple[float, float]:
    """The argument x of the first side lobe and its one-way amplitude (positive).

    The lobe's peak is where the pattern's derivative vanishes between its
    first two zeros: for 2 J1(x)/x (derivative -2 J2(x)/x) at the first zero
    of :math:`J_2 = 2J_1/x - J_0`; for sin(x)/x where :math:`\\sin x = x\\cos x`.
    Both are found by bisection.
    """
    if shape not in pattern.SHAPES:
        raise InputError(f"shape {shape!r} is unknown; use one of {', '.join(pattern.SHAPES)}")
    lo = pattern.first_null_x(shape) + 1e-3
    if shape == "side":

        def slope(x: float) -> float:
            return math.sin(x) - x * math.cos(x)

        hi = 1.5 * math.pi - 1e-3
    else:

        def slope(x: float) -> float:
            return float(jinc(x)) - _j0(x)

        hi = 7.0  # below the second zero of J1, 7.0156
    f_lo = slope(lo)
    for _ in range(200):
        mid = 0.5 * (lo + hi)
        if (slope(mid) > 0) == (f_lo > 0):
            lo = mid
        else:
            hi = mid
        if hi - lo < 1e-15 * hi:
            break
    x = 0.5 * (lo + hi)
    value = np.sinc(x / np.pi) if shape == "side" else jinc(x)
    return x, float(abs(value))


def side_lobe_level(shape: str = "disc", mode: str = SONAR_MODE) -> float:
    """Level of the first side lobe relative to the axis, dB (negative).

    A property of the pattern alone: -17.57 dB one-way for a disc (2 J1(x)/x),
    -13.26 dB for each plane of a rectangle (sin x / x); twice that pulse-echo.

    >>> round(side_lobe_level("disc"), 2), round(side_lobe_level("side"), 2)
    (-17.57, -13.26)
    """
    if mode not in pattern.MODES:
        raise InputError(f"mode {mode!r} is unknown; use one of {', '.join(pattern.MODES)}")
    _, amplitude = _side_lobe_x(shape)
    one_way = 20.0 * math.log10(amplitude)
    return 2.0 * one_way if mode == "pulse-echo" else one_way


@dataclass(frozen=True)
class SideLobe:
    """The first side lobe in one plane."""

    plane: str
    level_db: float | None  # negative, in the mode below; None where there is no lobe
    mode: str
    angle_deg: float | None  # from the axis; None where it would lie beyond 90 degrees


def first_side_lobe(
    aperture: float,
    wavelength: float,
    shape: str = "disc",
    mode: str = SONAR_MODE,
    plane: str = "diameter",
) -> SideLobe:
    """Level and angle of the first side lobe of an aperture.

    Where the lobe would lie beyond 90 degrees (an aperture of fewer than
    about 1.6 wavelengths for a disc, 1.4 for a side) the element radiates
    no side lobe: the angle and the level are None.
    """
    aperture = check_positive(aperture, "aperture", "m")
    wavelength = check_positive(wavelength, "wavelength", "m")
    x, _ = _side_lobe_x(shape)
    s = x * wavelength / (np.pi * aperture)
    if s > 1.0:
        return SideLobe(plane, None, mode, None)
    return SideLobe(plane, side_lobe_level(shape, mode), mode, math.degrees(math.asin(s)))
