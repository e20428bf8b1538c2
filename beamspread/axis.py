"""The on-axis field of flat pistons and the near-field length.

Amplitudes are normalised to :math:`\\rho c U_0` (the plane-wave pressure for
the same face velocity), so the on-axis maxima of a disc reach 2.

Disc (exact, Kinsler & Frey):

.. math:: |p(z)| = 2\\left|\\sin\\left(\\frac{k}{2}
   \\left(\\sqrt{z^2 + a^2} - z\\right)\\right)\\right|

with its last maximum at :math:`N = (D^2 - \\lambda^2) / (4\\lambda)`.

Rectangle (exact): in the on-axis Rayleigh integral
:math:`p = \\frac{i k \\rho c U_0}{2\\pi} \\iint e^{-ikR}/R\\, dS` write the face in
polar coordinates about the axis. The radial integral is closed,
:math:`\\int_0^{\\rho(\\phi)} e^{-ik\\sqrt{r^2+z^2}} r\\,dr / \\sqrt{r^2+z^2}
= (e^{-ikz} - e^{-ikR(\\phi)})/(ik)`, leaving one integral over the polar angle
to the edge:

.. math:: \\frac{|p(z)|}{\\rho c U_0} = \\left|\\frac{1}{2\\pi}\\oint
   \\left(1 - e^{-ik(R(\\phi) - z)}\\right) d\\phi\\right|, \\quad
   R(\\phi) = \\sqrt{z^2 + \\rho(\\phi)^2},

where :math:`\\rho(\\phi)` is the distance from the centre to the edge. The
integrand is smooth on each edge, so Gauss-Legendre quadrature converges
exponentially. The last maximum is found by scanning and then refining with a
golden-section search; no table of correction factors is used.

References
----------
L. E. Kinsler, A. R. Frey, A. B. Coppens and J. V. Sanders, *Fundamentals of
Acoustics*, the baffled circular piston, on-axis response.
J. Zemanek, "Beam behavior within the nearfield of a vibrating piston",
J. Acoust. Soc. Am. 49, 181 (1971), for the on-axis integral form.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from ._checks import check_positive
from ._search import golden_max

__all__ = [
    "disc_axial_pressure",
    "disc_near_field",
    "ellipse_axial_pressure",
    "ellipse_near_field",
    "rectangle_axial_pressure",
    "rectangle_near_field",
    "simple_near_field",
]


def simple_near_field(aperture: np.ndarray | float, wavelength: np.ndarray | float) -> np.ndarray:
    """The common estimate ``D**2 / (4 lambda)`` (or ``L**2 / (4 lambda)``), m."""
    a = np.asarray(aperture, dtype=float)
    return a * a / (4.0 * np.asarray(wavelength, dtype=float))


def disc_near_field(diameter: np.ndarray | float, wavelength: np.ndarray | float) -> np.ndarray:
    """Position of the last on-axis maximum of a disc, ``(D**2 - lambda**2) / (4 lambda)``, m.

    NaN where ``D <= lambda``: the on-axis field then has no maximum in front
    of the face and falls from the face outward.

    Examples
    --------
    >>> round(float(disc_near_field(0.010, 0.001184)) * 1e3, 2)
    20.82
    """
    d = np.asarray(diameter, dtype=float)
    lam = np.asarray(wavelength, dtype=float)
    with np.errstate(invalid="ignore"):
        return np.where(d > lam, (d * d - lam * lam) / (4.0 * lam), np.nan)


def disc_axial_pressure(
    z: np.ndarray | float, diameter: np.ndarray | float, wavelength: np.ndarray | float
) -> np.ndarray:
    """Exact on-axis pressure amplitude of a baffled disc, in units of rho c U0.

    Examples
    --------
    >>> float(disc_axial_pressure(0.0208188, 0.010, 0.001184)) > 1.999999
    True
    """
    z = np.asarray(z, dtype=float)
    a = 0.5 * np.asarray(diameter, dtype=float)
    k = 2.0 * np.pi / np.asarray(wavelength, dtype=float)
    path = a * a / (np.sqrt(z * z + a * a) + z)  # sqrt(z^2 + a^2) - z without cancellation
    return 2.0 * np.abs(np.sin(0.5 * k * path))


@lru_cache(maxsize=64)
def _edge_nodes(half_long: float, half_short: float, k: float):
    """Gauss-Legendre nodes and weights for the polar angle to each edge of a quarter face.

    Returns the edge distances rho (per node) and weights that sum to pi/2
    over the quarter; symmetry gives the other three quarters. Kept per
    element and wavenumber (a search calls it dozens of times); read-only.
    """
    corner = np.arctan2(half_short, half_long)
    diagonal = np.hypot(half_long, half_short)
    # Enough nodes for the oscillation of k*rho along the edge, plus a margin.
    n = 2 * int(np.ceil(k * (diagonal - half_short) / np.pi)) + 32
    x, w = np.polynomial.legendre.leggauss(n)
    # Edge 1: x = half_long, angle 0..corner.  Edge 2: y = half_short, corner..pi/2.
    phi1 = 0.5 * corner * (x + 1.0)
    phi2 = corner + 0.5 * (0.5 * np.pi - corner) * (x + 1.0)
    rho = np.concatenate([half_long / np.cos(phi1), half_short / np.sin(phi2)])
    return _read_only(rho, np.concatenate([0.5 * corner * w, 0.5 * (0.5 * np.pi - corner) * w]))


def _read_only(*arrays: np.ndarray) -> tuple[np.ndarray, ...]:
    """``arrays``, made read-only (they are kept in a cache and shared)."""
    for array in arrays:
        array.flags.writeable = False
    return arrays


def rectangle_axial_pressure(
    z: np.ndarray | float, length: float, width: float, wavelength: float
) -> np.ndarray:
    """Exact on-axis pressure amplitude of a baffled rectangle, in units of rho c U0.

    Parameters
    ----------
    z : array_like
        Distances from the face along the axis, m (above 0).
    length, width : float
        Sides of the element, m.
    wavelength : float
        Wavelength, m.

    Notes
    -----
    See the module notes. With :math:`\\theta = k(R - z)`,
    :math:`1 - e^{-i\\theta} = 2i\\sin(\\theta/2)e^{-i\\theta/2}` is used so
    that nothing cancels far from the face.
    """
    return _edge_integral(z, length, width, wavelength, _rectangle_nodes)


def _rectangle_nodes(half_x: float, half_y: float, k: float):
    return _edge_nodes(max(half_x, half_y), min(half_x, half_y), k)


def _edge_integral(z, length, width, wavelength, nodes) -> np.ndarray:
    """The polar integral to the edge (module notes) over the quarter ``nodes`` gives.

    ``nodes(half_length, half_width, k)`` returns the edge distances and the
    weights of one quarter of the face; symmetry gives the other three.
    """
    length = check_positive(length, "length", "m")
    width = check_positive(width, "width", "m")
    wavelength = check_positive(wavelength, "wavelength", "m")
    z = np.asarray(z, dtype=float)
    k = 2.0 * np.pi / wavelength
    rho, weights = nodes(0.5 * length, 0.5 * width, k)
    zz = z[..., None]
    theta = k * rho * rho / (np.sqrt(zz * zz + rho * rho) + zz)  # k (R - z)
    half = 0.5 * theta
    s = np.sin(half)
    # (1/2pi) * 4 quarters * sum of 2i sin(t/2) exp(-i t/2): real and imaginary parts.
    re = (2.0 * s * np.sin(half)) @ weights
    im = (2.0 * s * np.cos(half)) @ weights
    return (4.0 / (2.0 * np.pi)) * np.hypot(re, im)


def rectangle_near_field(length: float, width: float, wavelength: float) -> float:
    """Position of the last on-axis maximum of a rectangle, m; NaN where there is none.

    The on-axis pressure is scanned on a logarithmic grid from 1e-4 to 4
    times ``L**2 / (4 lambda)`` (L the longer side), the farthest local
    maximum is bracketed, and a golden-section search refines it to a
    relative 1e-10.

    Examples
    --------
    A square's last maximum lies about 1.37 times beyond ``L**2/(4 lambda)``
    (common practice) where the side is many wavelengths; like the disc's
    :math:`(D^2 - \\lambda^2)/4\\lambda` it falls short of that as the side shrinks:

    >>> side = 0.01
    >>> for lam in (1e-5, 0.001184):
    ...     print(round(rectangle_near_field(side, side, lam) / (side**2 / (4 * lam)), 2))
    1.37
    1.35
    """
    return _rectangle_near_field(float(length), float(width), float(wavelength))


@lru_cache(maxsize=4096)
def _rectangle_near_field(length: float, width: float, wavelength: float) -> float:
    """:func:`rectangle_near_field`, kept per (length, width, wavelength)."""
    return _last_maximum(
        lambda z: rectangle_axial_pressure(z, length, width, wavelength),
        max(length, width),
        wavelength,
    )


def _last_maximum(pressure, longer: float, wavelength: float) -> float:
    """The farthest local maximum of ``pressure(z)`` (on-axis, exact), m; NaN where none.

    The grid is scanned from its far end: the farthest 600 points first, all
    4001 only where those hold no maximum. The farthest local maximum of the
    whole grid is the farthest of any tail that holds one, so the bracket,
    and the result, are the same either way.
    """
    scale = float(simple_near_field(longer, wavelength))
    z = np.geomspace(1e-4 * scale, 4.0 * scale, 4001)
    for start in (z.size - 600, 0):
        p = pressure(z[start:])
        peaks = np.flatnonzero((p[1:-1] > p[:-2]) & (p[1:-1] >= p[2:])) + 1
        if peaks.size:
            break
    if peaks.size == 0:
        return float("nan")
    i = start + int(peaks[-1])

    def amplitude(zi: float) -> float:
        return float(pressure(zi))

    return float(golden_max(amplitude, float(z[i - 1]), float(z[i + 1]), 1e-10 * float(z[i])))


@lru_cache(maxsize=64)
def _ellipse_nodes(half_x: float, half_y: float, k: float):
    """Gauss-Legendre nodes in the polar angle over a quarter ellipse: edge distances, weights.

    The edge lies at :math:`\rho(\\phi) = ab / \\sqrt{(b\\cos\\phi)^2 + (a\\sin\\phi)^2}`,
    smooth in :math:`\\phi`; the node count follows the phase change
    :math:`k|a - b|` along the edge, as the rectangle's does.
    """
    n = 2 * int(np.ceil(k * abs(half_x - half_y) / np.pi)) + 32
    x, w = np.polynomial.legendre.leggauss(n)
    phi = 0.25 * np.pi * (x + 1.0)
    rho = half_x * half_y / np.hypot(half_y * np.cos(phi), half_x * np.sin(phi))
    return _read_only(rho, 0.25 * np.pi * w)


def ellipse_axial_pressure(
    z: np.ndarray | float, length: float, width: float, wavelength: float
) -> np.ndarray:
    """Exact on-axis pressure amplitude of a baffled ellipse (axes ``length``, ``width``), rho c U0.

    The same polar integral to the edge as :func:`rectangle_axial_pressure`
    (module notes), with the ellipse's edge distance.
    """
    return _edge_integral(z, length, width, wavelength, _ellipse_nodes)


@lru_cache(maxsize=1024)
def ellipse_near_field(length: float, width: float, wavelength: float) -> float:
    r"""Position of the last on-axis maximum of an ellipse, m; NaN where there is none.

    Found as :func:`rectangle_near_field` finds a rectangle's, on
    :func:`ellipse_axial_pressure`. A circle gives the disc's
    :math:`(D^2 - \lambda^2) / 4\lambda`:

    >>> round(ellipse_near_field(0.01, 0.01, 0.001184) / float(disc_near_field(0.01, 0.001184)), 6)
    1.0
    """
    return _last_maximum(
        lambda z: ellipse_axial_pressure(z, length, width, wavelength),
        max(float(length), float(width)),
        float(wavelength),
    )
