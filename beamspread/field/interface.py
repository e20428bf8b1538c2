"""The field in a part of an element that radiates through a flat interface.

An element in an upper medium (a wedge, or a water path) radiates across a
flat interface into the part below. Each point of the element is a point
source (the Rayleigh integral); its contribution reaches a point in the part
along its Fermat ray, refracted at the interface by Snell's law, and carries

* the phase of the whole ray, :math:`\\omega (r_1 / c_1 + r_2 / c_2)`;
* the plane-wave transmission coefficient :math:`T(\\theta_1)` of the mode
  (:mod:`beamspread.coupling.transmission`), at the ray's incident angle;
* the exact geometrical spreading of a point source through a plane
  interface, one factor per principal plane of the ray tube (Coddington's
  equations for a plane interface; Schmerr, *Fundamentals of Ultrasonic
  Nondestructive Evaluation*, the chapter on transmission through
  interfaces):

.. math:: \\frac{p}{\\rho_1 c_1 U_0} = \\frac{-i k_1}{2\\pi}\\iint_S
   \\frac{T(\\theta_1)\\, e^{i(k_1 r_1 + k_2 r_2)}}
   {\\sqrt{\\left(r_1 + r_2\\frac{c_2}{c_1}\\right)
   \\left(r_1 + r_2\\frac{c_2\\cos^2\\theta_1}{c_1\\cos^2\\theta_2}\\right)}}\\,dS .

With :math:`c_2 = c_1` and :math:`T = 1` this is the Rayleigh integral of
the element in one medium, so the field of the contact engine
(:mod:`beamspread.field.engine`) is its limit. The integral over the face is
a Gauss rule (Gauss-Legendre across a rectangle; Gauss-Legendre in radius and
the periodic trapezoid rule round a disc), with as many nodes as the phase
across the face seen from the asked points needs. A focused element is its
curved face (a spherical cap for a disc, a cylinder in the length plane for a
rectangle), its nodes on that face: the integral is then O'Neil's for a
focused radiator, with no paraxial approximation.

The ray (high-frequency) transmission holds where each point source's ray is
many wavelengths long on both sides; it misses head waves and the field right
at a critical angle.

Broadband amplitudes follow the engine (the spectral RMS of
:mod:`beamspread.field.engine`), the pulse-echo field being the square of
the one-way field at each frequency (reciprocity).
"""

from __future__ import annotations

import math
from collections.abc import Callable
from dataclasses import dataclass

import numpy as np

from ..errors import InputError
from ..probes import Disc, Rectangle, check_element, check_positive
from .spectrum import make_spectrum

__all__ = ["Crossing", "crossing_amplitude", "crossing_pressure"]

_PAIRS = 1_500_000  # field point x node pairs per chunk (memory ~ 100 MB at most)


@dataclass(frozen=True)
class Crossing:
    """An element in an upper medium, its beam crossing a flat interface into the part.

    The part's surface is the plane ``z = 0``, the part below (``z > 0``); the
    element's axis meets the surface at the origin (the exit point, or the
    point under a water-path probe), at ``incidence`` from the normal, in the
    ``x-z`` plane (the incidence plane), heading towards ``+x``.

    Parameters
    ----------
    element : Disc or Rectangle
        The element; a rectangle's ``length`` lies in the incidence plane. Its
        ``focus`` (if any) is measured in the upper medium.
    upper_speed : float
        Speed of the upper medium (the wedge's longitudinal speed, the
        couplant's), m/s.
    lower_speed : float
        Speed in the part of the mode asked for, m/s.
    incidence : float
        The element axis's angle from the surface normal, rad, in [0, pi/2).
    path : float
        From the element's centre to the surface along its axis, m.
    transmission : callable, optional
        ``T(theta_1)`` (array of incident angles, rad) -> complex array, the
        plane-wave transmission coefficient of the mode; None for 1.
    """

    element: Disc | Rectangle
    upper_speed: float
    lower_speed: float
    incidence: float = 0.0
    path: float = 0.0
    transmission: Callable[[np.ndarray], np.ndarray] | None = None

    def __post_init__(self) -> None:
        check_element(self.element, probe=True)
        check_positive(self.upper_speed, "upper speed", "m/s")
        check_positive(self.lower_speed, "lower speed", "m/s")
        check_positive(self.path, "path", "m")
        if not 0.0 <= self.incidence < math.pi / 2:
            raise InputError(
                f"incidence: {math.degrees(self.incidence):g} deg is not allowed; "
                "it must be in [0, 90) degrees"
            )

    @property
    def refracted(self) -> float:
        """The refracted angle of the axis by Snell's law, rad (NaN past the critical angle)."""
        s = math.sin(self.incidence) * self.lower_speed / self.upper_speed
        return math.asin(s) if s < 1.0 else math.nan

    @property
    def centre(self) -> np.ndarray:
        """The element's centre, m."""
        a = self.incidence
        return np.array([-self.path * math.sin(a), 0.0, -self.path * math.cos(a)])

    def nodes(self, wavenumber: float, spread: float):
        """Quadrature nodes on the face and their weights (area, m2).

        ``spread`` bounds the sine of the ray angles from the element axis
        (plus the curvature of the wavefronts across the face) that the asked
        points see; the node count follows ``wavenumber * half-size * spread``.
        Returns ``(points (N, 3), weights (N,))``.
        """
        e = self.element
        a = self.incidence
        u_axis = np.array([math.cos(a), 0.0, -math.sin(a)])
        v_axis = np.array([0.0, 1.0, 0.0])
        w_axis = np.array([math.sin(a), 0.0, math.cos(a)])  # the element's axis, towards the part
        focus = e.focus
        u, v, weight, lateral2 = e.face_nodes(wavenumber, spread, _count)
        sag = np.zeros_like(u)
        if focus is not None:
            if lateral2.max() >= focus * focus:
                raise InputError(
                    f"focus: {focus * 1e3:g} mm is not allowed; it must exceed the element's "
                    "half-aperture"
                )
            sag = focus - np.sqrt(focus * focus - lateral2)
            weight = weight * focus / np.sqrt(focus * focus - lateral2)  # the curved face's area
        points = self.centre + u[:, None] * u_axis + v[:, None] * v_axis + sag[:, None] * w_axis
        return points, weight

    def rays(self, sources: np.ndarray, targets: np.ndarray):
        """The Fermat rays from each source (N, 3) to each target (M, 3).

        Returns ``(delay, amplitude, incident)``, each (M, N): the travel time
        r1/c1 + r2/c2 (s), the spreading and transmission factor (1/m), and
        the ray's incident angle at the surface (rad).
        """
        c1, c2 = self.upper_speed, self.lower_speed
        n = c2 / c1
        h1 = -sources[None, :, 2]
        h2 = targets[:, None, 2]
        dx = targets[:, None, 0] - sources[None, :, 0]
        dy = targets[:, None, 1] - sources[None, :, 1]
        d = np.sqrt(dx * dx + dy * dy)
        s = _snell_sine(h1, h2, d, n)
        cos1 = np.sqrt(1.0 - s * s)
        s2 = n * s
        cos2 = np.sqrt(1.0 - s2 * s2)
        r1 = h1 / cos1
        r2 = h2 / cos2
        delay = r1 / c1 + r2 / c2
        sagittal = r1 + r2 * n
        tangential = r1 + r2 * n * (cos1 * cos1) / (cos2 * cos2)
        amplitude = 1.0 / np.sqrt(sagittal * tangential)
        incident = np.arcsin(s)
        return delay, amplitude, incident


def _count(phase: float) -> int:
    """Gauss nodes for a phase of ``phase`` rad across a half-size (converged to ~1e-7)."""
    return math.ceil(0.6 * phase + 12)


def _snell_sine(h1, h2, d, n, iterations: int = 60):
    """sin(theta_1) of the ray that crosses at Snell's law, by Newton's method.

    Solves g(s) = h1 tan(theta_1) + h2 tan(theta_2) - d = 0 with
    sin(theta_2) = n s. g is increasing and convex on [0, s_max), and the
    paraxial root (tangents as sines) lies at or above the root, so Newton's
    iterates fall monotonically onto it.
    """
    s_max = 1.0 if n <= 1.0 else 1.0 / n
    s = np.minimum(d / (h1 + n * h2), s_max * (1.0 - 1e-12))
    for _ in range(iterations):
        c1 = np.sqrt(1.0 - s * s)
        c2 = np.sqrt(1.0 - (n * s) ** 2)
        g = h1 * s / c1 + h2 * n * s / c2 - d
        dg = h1 / (c1 * c1 * c1) + h2 * n / (c2 * c2 * c2)
        step = g / dg
        s = s - step
        if np.max(np.abs(step)) < 1e-14:
            break
    return np.maximum(s, 0.0)


def _spread_bound(crossing: Crossing, targets: np.ndarray) -> float:
    """The largest ray angle sine (from the axis) plus face curvature that the targets see."""
    centre = crossing.centre[None, :]
    _, _, incident = crossing.rays(centre, targets)
    # The ray's direction in the upper medium, and its angle from the element axis.
    dx = targets[:, 0] - centre[0, 0]
    dy = targets[:, 1] - centre[0, 1]
    d = np.hypot(dx, dy)
    s = np.sin(incident[:, 0])
    c = np.cos(incident[:, 0])
    with np.errstate(invalid="ignore", divide="ignore"):
        ux = np.where(d > 0, dx / d, 1.0) * s
    a = crossing.incidence
    along = ux * math.sin(a) + c * math.cos(a)
    off = np.sqrt(np.maximum(1.0 - along * along, 0.0))
    half = 0.5 * crossing.element.longest_side
    curvature = half / crossing.path
    if crossing.element.focus is not None:
        curvature += half / crossing.element.focus
    return float(min(1.0, off.max() + curvature)) if off.size else 1.0


def crossing_pressure(crossing: Crossing, points, wavenumbers) -> np.ndarray:
    """The one-way field :math:`p / (\\rho_1 c_1 U_0)` at points in the part, per wavenumber.

    Parameters
    ----------
    crossing : Crossing
    points : array_like, shape (M, 3)
        Points in the part, m (``z > 0``).
    wavenumbers : array_like
        Wavenumbers in the upper medium, rad/m.

    Returns
    -------
    ndarray, complex, shape (M, F)
    """
    targets = np.atleast_2d(np.asarray(points, dtype=float))
    if targets.shape[-1] != 3 or targets.ndim != 2:
        raise InputError("points: give an array of (x, y, z) rows, m")
    if targets.size and not (targets[:, 2] > 0).all():
        raise InputError("points: every point must lie in the part (z above 0)")
    ks = np.atleast_1d(np.asarray(wavenumbers, dtype=float))
    out = np.zeros((targets.shape[0], ks.size), dtype=complex)
    if targets.shape[0] == 0:
        return out
    spread = _spread_bound(crossing, targets)
    sources, weight = crossing.nodes(float(ks.max()), spread)
    omega_over_c1 = ks  # k1 = omega / c1, and the delay is in seconds: phase = k1 c1 tau
    c1 = crossing.upper_speed
    chunk = max(1, _PAIRS // sources.shape[0])
    for start in range(0, targets.shape[0], chunk):
        block = targets[start : start + chunk]
        delay, amplitude, incident = crossing.rays(sources, block)
        a = amplitude * weight[None, :]
        if crossing.transmission is not None:
            a = a * crossing.transmission(incident)
        phase = delay * c1  # m of upper-medium path: the phase is k1 times it
        for j, k in enumerate(omega_over_c1):
            out[start : start + chunk, j] = (-1j * k / (2.0 * math.pi)) * (
                a * np.exp(1j * k * phase)
            ).sum(axis=1)
    return out


def crossing_amplitude(
    crossing: Crossing,
    points,
    *,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> np.ndarray:
    """The amplitude at points in the part, as :func:`beamspread.field.engine.field_amplitude`.

    Continuous wave (``bandwidth`` 0): ``|p|`` one-way, ``|p|^2`` pulse-echo.
    Broadband: the spectral RMS over the sampled spectrum, with the same
    source weights as the contact engine.
    """
    from .engine import check_mode

    check_mode(mode)
    spec = make_spectrum(spectrum, crossing.element.frequency, bandwidth, frequencies)
    ks = 2.0 * math.pi * spec.frequencies / crossing.upper_speed
    p = crossing_pressure(crossing, points, ks)
    p2 = (p * p.conj()).real
    power = p2 * p2 if mode == "pulse-echo" else p2
    return np.sqrt(power @ spec.source_weights(mode))
