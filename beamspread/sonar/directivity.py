"""Directivity factor and index, Rayleigh distance and full beam angle of a flat piston.

Directivity factor and index
----------------------------
The directivity factor of a baffled piston radiating into the half space in
front of it is the on-axis intensity over the intensity the same power would
give spread over the whole sphere, :math:`Q = 4\\pi r^2 I(0) / W`, and
:math:`DI = 10 \\log_{10} Q`. From the radiation resistance,
:math:`Q = k^2 A / (\\pi R_1)` with :math:`R_1` the resistance normalised to
:math:`\\rho c A`. For a disc of radius :math:`a`, :math:`R_1 = 1 - J_1(2ka)/(ka)`:

.. math:: Q = \\frac{(ka)^2}{1 - J_1(2ka)/(ka)} \\to (ka)^2 \\quad (ka \\gg 1).

For a rectangle the resistance is the integral of the mutual resistance
:math:`\\sin(kr)/r` over the autocorrelation of the face,
:math:`\\Lambda(x, y) = (L - |x|)(W - |y|)`:

.. math:: R_1 = \\frac{k}{2\\pi A} \\iint \\Lambda(x, y) \\frac{\\sin kr}{r}\\,dx\\,dy .

In polar coordinates :math:`\\Lambda` is a quadratic in :math:`r` along each
ray, so the radial integral is closed and one integral over the polar angle
remains, done here by Gauss-Legendre quadrature on each of the two edges that
bound the support. The limits: :math:`Q \\to 2` for a point source in a
baffle, and :math:`Q \\to 4\\pi A/\\lambda^2` for a large face.

References
----------
L. E. Kinsler, A. R. Frey, A. B. Coppens and J. V. Sanders, *Fundamentals of
Acoustics*, the baffled piston: radiation impedance, directivity factor,
Rayleigh distance.
R. J. Urick, *Principles of Underwater Sound*, the sonar equations, the
directivity index and the equivalent two-way beam width.
"""

from __future__ import annotations

import math

import numpy as np

from .. import pattern
from .._checks import check_positive
from ..probes import Probe, check_element
from ._piston import disc_directivity_factor, rectangle_directivity_factor
from .conventions import SONAR_MODE

__all__ = [
    "directivity_factor",
    "directivity_index",
    "disc_directivity_factor",
    "full_angle",
    "rayleigh_distance",
    "rectangle_directivity_factor",
]


def directivity_factor(probe: Probe, wavelength: float) -> float:
    """Directivity factor Q of a disc or rectangle (see the module notes)."""
    check_element(probe)
    wavelength = check_positive(wavelength, "wavelength", "m")
    return probe.directivity_factor(wavelength)


def directivity_index(probe: Probe, wavelength: float) -> float:
    """Directivity index ``DI = 10 log10 Q``, dB, of a disc or rectangle.

    >>> from beamspread import Disc
    >>> round(directivity_index(Disc(0.025, 200e3), 1500 / 200e3), 2)
    20.47
    """
    return 10.0 * math.log10(directivity_factor(probe, wavelength))


def rayleigh_distance(probe: Probe, wavelength: float) -> float:
    """The Rayleigh distance ``A / lambda``, m: beyond it the far field holds.

    For a disc of radius :math:`a` this is :math:`\\pi a^2/\\lambda = k a^2/2`,
    :math:`\\pi` times the near-field length :math:`D^2/(4\\lambda)`. Kinsler et
    al. name it the Rayleigh distance; on-axis pressure there is within about
    10 % of the spherical-spreading (far-field) law.

    >>> from beamspread import Disc
    >>> round(rayleigh_distance(Disc(0.025, 200e3), 1500 / 200e3), 4)
    0.0654
    """
    check_element(probe)
    wavelength = check_positive(wavelength, "wavelength", "m")
    return probe.area / wavelength


def full_angle(
    level_db, aperture, wavelength, shape: str = "disc", mode: str = SONAR_MODE
) -> np.ndarray:
    """Full angle (rad) of the main lobe at ``level_db`` dB down: twice :func:`pattern.half_angle`.

    NaN where the pattern has not fallen to the level by 90 degrees.

    The trade's rule 58.9 degrees x lambda / D gives 17.67 degrees here:

    >>> round(float(np.degrees(full_angle(3, 0.025, 1500 / 200e3))), 2)
    17.73
    """
    return 2.0 * pattern.half_angle(level_db, aperture, wavelength, shape, mode)
