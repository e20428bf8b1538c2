"""Closed forms and integrals of a baffled disc's and rectangle's radiation, by size.

The element types call these (:meth:`beamspread.probes.Element.directivity_factor`,
:meth:`~beamspread.probes.Element.equivalent_beam_angle`); the public functions
that take an element are in :mod:`.directivity` and :mod:`.beam_angle`, whose
notes give the formulas and references.
"""

from __future__ import annotations

import math

import numpy as np

from .._bessel import jinc
from .._checks import check_positive

__all__ = [
    "disc_beam_angle",
    "disc_directivity_factor",
    "rectangle_beam_angle",
    "rectangle_directivity_factor",
]


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


def _gauss(n: int, lo: float, hi: float):
    x, w = np.polynomial.legendre.leggauss(n)
    return lo + 0.5 * (hi - lo) * (x + 1.0), 0.5 * (hi - lo) * w


_X_TAIL = 400.0  # beyond this pattern argument the fourth power of the pattern is negligible


def disc_beam_angle(diameter: float, wavelength: float) -> float:
    """The equivalent two-way beam angle of a disc, sr (see :mod:`.beam_angle`)."""
    k = 2.0 * np.pi / wavelength
    half_k = 0.5 * k * diameter  # ka
    top = math.asin(min(1.0, _X_TAIL / half_k))
    n = int(8.0 * min(half_k, _X_TAIL) / np.pi) + 64
    theta, w = _gauss(n, 0.0, top)
    d = jinc(half_k * np.sin(theta))
    return float(2.0 * np.pi * ((d**4 * np.sin(theta)) @ w))


def rectangle_beam_angle(length: float, width: float, wavelength: float) -> float:
    """The equivalent two-way beam angle of a rectangle, sr (the same definition)."""
    k = 2.0 * np.pi / wavelength
    kl, kw = 0.5 * k * length, 0.5 * k * width
    top = math.asin(min(1.0, _X_TAIL / min(kl, kw)))
    reach = max(kl, kw) * math.sin(top)
    n = int(8.0 * reach / np.pi) + 64
    theta, wt = _gauss(n, 0.0, top)
    phi, wp = _gauss(n, 0.0, 0.5 * np.pi)
    total = 0.0
    step = max(1, (1 << 20) // n)
    for start in range(0, n, step):
        st = np.sin(theta[start : start + step, None])
        u, v = st * np.cos(phi), st * np.sin(phi)
        d = np.sinc(kl * u / np.pi) * np.sinc(kw * v / np.pi)
        total += float(((d**4 * st) @ wp) @ wt[start : start + step])
    return 4.0 * total
