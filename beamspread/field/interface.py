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
from ._interface_rays import ray_terms
from ._interface_sum import face_sum
from .spectrum import make_spectrum

__all__ = ["Crossing", "crossing_amplitude", "crossing_pressure"]


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

    def face(self, u: np.ndarray, v: np.ndarray, curved: np.ndarray):
        """Points on the face at element coordinates (u in the incidence plane, v across), m.

        ``curved`` is the squared distance the focus curves the face over (the
        element's ``face_nodes`` gives it). Returns ``(points (N, 3), area factor
        (N,))``: a focused face is curved, and its area per unit of (u, v) is the
        factor.
        """
        a = self.incidence
        u_axis = np.array([math.cos(a), 0.0, -math.sin(a)])
        v_axis = np.array([0.0, 1.0, 0.0])
        w_axis = np.array([math.sin(a), 0.0, math.cos(a)])  # the element's axis, towards the part
        focus = self.element.focus
        sag = np.zeros_like(u)
        factor = np.ones_like(u)
        if focus is not None:
            if curved.max() >= focus * focus:
                raise InputError(
                    f"focus: {focus * 1e3:g} mm is not allowed; it must exceed the element's "
                    "half-aperture"
                )
            sag = focus - np.sqrt(focus * focus - curved)
            factor = focus / np.sqrt(focus * focus - curved)  # the curved face's area
        points = self.centre + u[:, None] * u_axis + v[:, None] * v_axis + sag[:, None] * w_axis
        return points, factor

    def nodes(self, wavenumber: float, spread: float, curvature: float | None = None):
        """Quadrature nodes on the face and their weights (area, m2).

        ``spread`` times ``wavenumber`` times the element's half-size is the
        phase (rad) the asked points see across that half-size: the linear part
        (the ray angle from the element axis) plus the curvature of the
        wavefronts across the face; the element's rule (``face_nodes``) takes
        ``0.6 phase + 12`` Gauss nodes for it. Given ``curvature`` apart (the
        same units), ``spread`` is the linear part alone and the rule is asked
        for the linear phase plus twice the curvature's (the quadratic's slope
        at the ends of a half-size).
        Returns ``(points (N, 3), weights (N,))``.
        """
        total = spread if curvature is None else spread + 2.0 * curvature
        u, v, weight, curved = self.element.face_nodes(wavenumber, total, _count)
        points, factor = self.face(u, v, curved)
        return points, weight * factor

    def rays(self, sources: np.ndarray, targets: np.ndarray):
        """The Fermat rays from each source (N, 3) to each target (M, 3).

        Returns ``(delay, amplitude, incident)``, each (M, N): the travel time
        r1/c1 + r2/c2 (s), the spreading factor (1/m, without the transmission
        coefficient), and the ray's incident angle at the surface (rad).
        """
        delay, amplitude, s = ray_terms(self, sources, targets)
        return delay, amplitude, np.arcsin(s)


def _count(phase: float) -> int:
    """Gauss nodes for a phase of ``phase`` rad across a half-size (converged to ~1e-7)."""
    return math.ceil(0.6 * phase + 12)


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
    if targets.shape[0] == 0:
        return np.zeros((0, ks.size), dtype=complex)
    return (-1j / (2.0 * math.pi)) * ks[None, :] * face_sum(crossing, targets, ks)


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
