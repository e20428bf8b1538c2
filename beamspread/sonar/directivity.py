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
from .._bessel import jinc
from ..errors import InputError
from ..probes import Disc, Probe, Rectangle, check_positive
from .conventions import SONAR_MODE


def _one_minus_jinc(x: np.ndarray) -> np.ndarray:
    """``1 - 2 J1(x)/x`` without cancellation for small ``x``."""
    x = np.asarray(x, dtype=float)
    x2 = x * x
    series = x2 / 8.0 * (1.0 - x2 / 24.0 * (1.0 - x2 / 48.0))
    return np.where(np.abs(x) < 0.05, series, 1.0 - jinc(np.where(np.abs(x) < 0.05, 1.0, x)))


def disc_directivity_factor(diameter, wavelength) -> np.ndarray:
    """Directivity factor Q of a baffled disc, exact: ``(ka)^2 / (1 - J1(2ka)/(ka))``.

    Parameters
    ----------
    diameter, wavelength : array_like
        m; broadcast.

    Returns
    -------
    ndarray
        Q (dimensionless); 2 for a disc small against the wavelength (a
        baffled point source fills the half space), :math:`(ka)^2` for a large one.

    Examples
    --------
    A 25 mm disc at 200 kHz in water (ka = 10.5) is within 0.1 dB of
    20 log10(ka):

    >>> ka = np.pi * 0.025 / (1500 / 200e3)
    >>> q = disc_directivity_factor(0.025, 1500 / 200e3)
    >>> round(float(10 * np.log10(q)), 2), round(float(20 * np.log10(ka)), 2)
    (20.47, 20.4)
    """
    a = 0.5 * np.asarray(diameter, dtype=float)
    ka = 2.0 * np.pi * a / np.asarray(wavelength, dtype=float)
    return ka * ka / _one_minus_jinc(2.0 * ka)


def _sin_moments(x: np.ndarray):
    """``F_n(x) = integral_0^x t^n sin t dt`` for n = 0, 1, 2, stable for small x."""
    x = np.asarray(x, dtype=float)
    s, c = np.sin(x), np.cos(x)
    f0 = 2.0 * np.sin(0.5 * x) ** 2
    f1 = s - x * c
    f2 = 2.0 * x * s - (x * x - 2.0) * c - 2.0
    small = x < 1.0
    if np.any(small):
        xs = np.where(small, x, 0.0)
        g1 = np.zeros_like(xs)
        g2 = np.zeros_like(xs)
        factorial = 1.0
        for n in range(10):  # t^n sin t = sum (-1)^m t^(2m+1+n) / (2m+1)!
            if n:
                factorial *= (2 * n) * (2 * n + 1)
            sign = -1.0 if n % 2 else 1.0
            g1 += sign * xs ** (2 * n + 3) / (factorial * (2 * n + 3))
            g2 += sign * xs ** (2 * n + 4) / (factorial * (2 * n + 4))
        f1 = np.where(small, g1, f1)
        f2 = np.where(small, g2, f2)
    return f0, f1, f2


def rectangle_directivity_factor(length: float, width: float, wavelength: float) -> float:
    """Directivity factor Q of a baffled rectangle, from its radiation resistance.

    Parameters
    ----------
    length, width, wavelength : float
        m.

    Returns
    -------
    float
        Q; 2 for a small face, :math:`4\\pi A/\\lambda^2` for a large one.

    Notes
    -----
    :math:`Q = 2 k A^2 / T` with :math:`T = \\iint \\Lambda \\sin(kr)/r\\,dx\\,dy`
    (see the module notes). Along the ray at angle :math:`\\phi`,
    :math:`\\Lambda = LW - r(W\\cos\\phi + L\\sin\\phi) + r^2\\cos\\phi\\sin\\phi`
    up to the edge of the support :math:`r_e(\\phi) = \\min(L/\\cos\\phi, W/\\sin\\phi)`,
    so that

    .. math:: T = 4\\int_0^{\\pi/2}\\left[\\frac{LW F_0}{k} - \\frac{(W\\cos\\phi +
       L\\sin\\phi) F_1}{k^2} + \\frac{\\cos\\phi \\sin\\phi\\, F_2}{k^3}\\right] d\\phi,
       \\quad F_n = \\int_0^{k r_e} t^n \\sin t\\, dt .

    Examples
    --------
    A face of 50 by 50 wavelengths is near the large-aperture limit
    :math:`4\\pi A/\\lambda^2` (common practice):

    >>> q = rectangle_directivity_factor(0.05, 0.05, 0.001)
    >>> round(float(q / (4 * np.pi * 2500)), 3)
    1.0
    """
    length = check_positive(length, "length", "m")
    width = check_positive(width, "width", "m")
    wavelength = check_positive(wavelength, "wavelength", "m")
    k = 2.0 * np.pi / wavelength
    corner = math.atan2(width, length)
    n = 2 * math.ceil(k * math.hypot(length, width) / math.pi) + 64
    x, w = np.polynomial.legendre.leggauss(n)
    phi1 = 0.5 * corner * (x + 1.0)
    phi2 = corner + 0.5 * (0.5 * np.pi - corner) * (x + 1.0)
    phi = np.concatenate([phi1, phi2])
    weights = np.concatenate([0.5 * corner * w, 0.5 * (0.5 * np.pi - corner) * w])
    c, s = np.cos(phi), np.sin(phi)
    edge = np.concatenate([length / np.cos(phi1), width / np.sin(phi2)])
    f0, f1, f2 = _sin_moments(k * edge)
    integrand = length * width * f0 / k - (width * c + length * s) * f1 / k**2 + c * s * f2 / k**3
    total = 4.0 * float(integrand @ weights)
    area = length * width
    return 2.0 * k * area * area / total


def directivity_factor(probe: Probe, wavelength: float) -> float:
    """Directivity factor Q of a disc or rectangle (see the module notes)."""
    wavelength = check_positive(wavelength, "wavelength", "m")
    if isinstance(probe, Disc):
        return float(disc_directivity_factor(probe.diameter, wavelength))
    if isinstance(probe, Rectangle):
        return rectangle_directivity_factor(probe.length, probe.width, wavelength)
    raise InputError(f"probe: {probe!r} is not a Disc or a Rectangle")


def directivity_index(probe: Probe, wavelength: float) -> float:
    """Directivity index ``DI = 10 log10 Q``, dB, of a disc or rectangle.

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

    >>> round(rayleigh_distance(Disc(0.025, 200e3), 1500 / 200e3), 4)
    0.0654
    """
    wavelength = check_positive(wavelength, "wavelength", "m")
    if isinstance(probe, Disc):
        area = 0.25 * math.pi * probe.diameter**2
    elif isinstance(probe, Rectangle):
        area = probe.length * probe.width
    else:
        raise InputError(f"probe: {probe!r} is not a Disc or a Rectangle")
    return area / wavelength


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
