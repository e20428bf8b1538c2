"""The far field of a beam refracted through a flat interface, in the incidence plane.

Far from the exit point, every point source of the element reaches a point in
the direction :math:`\\theta_2` (from the surface normal, in the part) along
parallel rays that left the element at the same incident angle
:math:`\\theta_1`, :math:`\\sin\\theta_1 = (c_1/c_2)\\sin\\theta_2` (Snell's
law). The sum over the face is then the element's own far-field pattern at
:math:`\\theta_1 - \\alpha` from its axis (wavenumber of the upper medium), and
the spreading of a point source through the interface
(:mod:`beamspread.field.interface`) tends to
:math:`\\cos\\theta_2 / (n\\, r_2 \\cos\\theta_1)`, :math:`n = c_2/c_1`. So the
one-way pattern is

.. math:: F(\\theta_2) = |T(\\theta_1)|\\,
   \\frac{\\cos\\theta_2}{\\cos\\theta_1}\\,|D(\\theta_1 - \\alpha)| ,

relative to its largest value: the lobe is asymmetric and its peak leans off
the refracted angle of the axis (toward the normal, where the obliquity
factor and the transmission grow). Pulse-echo squares it (reciprocity).
The virtual element's closed form (the element seen from the part, set back
along the refracted axis) is the quick estimate that this replaces in the
incidence plane; in the transverse plane the two agree.

This holds for a flat element in the far field of the refracted beam; a
focused element's far field is not its beam at working depths, and is refused.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np
from scipy.optimize import brentq, minimize_scalar

from ..errors import InputError
from ..pattern import directivity, first_null
from .interface import Crossing

__all__ = ["RefractedLobe", "refracted_lobe", "refracted_pattern"]


def _check(crossing: Crossing) -> None:
    if crossing.element.focus is not None:
        raise InputError(
            "focus: a focused element has no far-field half-angles in the part; "
            "use the computed field's widths at depth"
        )
    if math.isnan(crossing.refracted):
        raise InputError(
            f"incidence: {math.degrees(crossing.incidence):g} deg is past the critical angle; "
            "no refracted beam of this mode"
        )


def refracted_pattern(crossing: Crossing, angles, mode: str = "one-way") -> np.ndarray:
    """The far-field amplitude at refracted angles ``angles`` (rad, from the normal, in the
    incidence plane, positive toward the beam), relative to the axis of the element's own
    pattern (not normalised: divide by the lobe's peak, see :func:`refracted_lobe`)."""
    _check(crossing)
    theta2 = np.asarray(angles, dtype=float)
    e = crossing.element
    c1, c2 = crossing.upper_speed, crossing.lower_speed
    s1 = np.sin(theta2) * c1 / c2
    inside = np.abs(s1) < 1.0
    theta1 = np.arcsin(np.where(inside, s1, 0.0))
    lam1 = c1 / e.frequency
    aperture = e.planes[0][1]  # the size in the incidence plane
    d = np.abs(directivity(theta1 - crossing.incidence, aperture, lam1, e.pattern))
    t = 1.0 if crossing.transmission is None else np.abs(crossing.transmission(np.abs(theta1)))
    f = np.where(inside, t * np.cos(theta2) / np.cos(theta1) * d, 0.0)
    return f * f if mode == "pulse-echo" else f


@dataclass(frozen=True)
class RefractedLobe:
    """The main lobe of a refracted beam in the incidence plane, at one level.

    Angles in rad, from the surface normal. ``toward_normal`` and ``away`` are the
    half-angles from the refracted angle of the axis (``refracted``) to the level's
    edges on each side; ``tilt`` is the lobe peak's angle minus ``refracted``
    (negative: leaning toward the normal).
    """

    level_db: float
    mode: str
    refracted: float
    peak: float
    toward_normal: float
    away: float

    @property
    def tilt(self) -> float:
        return self.peak - self.refracted

    @property
    def full_angle(self) -> float:
        return self.toward_normal + self.away


def refracted_lobe(crossing: Crossing, level_db: float, mode: str = "pulse-echo") -> RefractedLobe:
    """The level's edges of the refracted beam's far-field lobe, both sides (see module notes).

    NaN on a side where the lobe does not fall to the level before the surface
    (90 deg) or the normal's far side.
    """
    _check(crossing)
    beta = crossing.refracted
    e = crossing.element
    lam1 = crossing.upper_speed / e.frequency
    # The element's first null, seen from the part, bounds the main lobe on each side.
    null1 = float(first_null(e.planes[0][1], lam1, e.pattern))
    c1, c2 = crossing.upper_speed, crossing.lower_speed

    def part_angle(theta1):
        s = math.sin(theta1) * c2 / c1
        return math.copysign(math.pi / 2, s) if abs(s) >= 1.0 else math.asin(s)

    low = part_angle(crossing.incidence - null1) if null1 == null1 else -math.pi / 2
    high = part_angle(crossing.incidence + null1) if null1 == null1 else math.pi / 2
    low, high = max(low, -math.pi / 2 + 1e-12), min(high, math.pi / 2 - 1e-12)

    def f(theta):
        return float(refracted_pattern(crossing, theta, mode))

    best = minimize_scalar(
        lambda t: -f(t), bounds=(low, high), method="bounded", options={"xatol": 1e-10}
    )
    peak, top = float(best.x), f(float(best.x))
    target = top * 10.0 ** (-abs(level_db) / 20.0)  # f is in the mode's own units

    def edge(end):
        if f(end) > target:
            return math.nan
        a, b = sorted((peak, end))
        return brentq(lambda t: f(t) - target, a, b, xtol=1e-12)

    near, far = edge(low), edge(high)
    return RefractedLobe(abs(level_db), mode, beta, peak, beta - near, far - beta)
