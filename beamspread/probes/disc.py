"""The flat circular piston, focused spherically or flat."""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from .._checks import check_positive
from ._base import Element, NearField, WedgeView, check_focus, register_kind

__all__ = ["Disc"]


@register_kind
@dataclass(frozen=True)
class Disc(Element):
    """A flat circular piston.

    Parameters
    ----------
    diameter : float
        Element diameter, m.
    frequency : float
        Centre frequency, Hz.
    focus : float, optional
        Focal length of a spherically focused element (in the medium it
        touches: the couplant, or the part in contact), m; None for a flat one.
    """

    diameter: float
    frequency: float
    focus: float | None = None

    shape = "disc"
    pattern = "disc"  # 2 J1(x)/x (pattern.half_angle's ``shape``)
    symmetry = "axial"  # the field depends on the distance from the axis only
    noun = "disc"
    focus_kind = "spherical"
    focused_plane = "diameter"
    focus_half_name = "radius"
    size_names = ("diameter",)
    near_field_label = "exact (D² − λ²)/4λ"
    simple_near_field_label = "D²/4λ"
    directivity_factor_method = "exact: (ka)^2 / (1 - J1(2ka)/(ka))"

    def __post_init__(self) -> None:
        object.__setattr__(self, "diameter", check_positive(self.diameter, "diameter", "m"))
        object.__setattr__(self, "frequency", check_positive(self.frequency, "frequency", "Hz"))
        check_focus(self)

    @property
    def planes(self) -> tuple[tuple[str, float], ...]:
        """The planes of the beam, as (name, aperture in m): one for a disc."""
        return (("diameter", self.diameter),)

    def sizes(self) -> dict[str, float]:
        return {"diameter": self.diameter}

    @property
    def longest_side(self) -> float:
        return self.diameter

    @property
    def area(self) -> float:
        return 0.25 * math.pi * self.diameter**2

    @property
    def focus_description(self) -> str:
        return "a spherically focused disc"

    def near_field(self, wavelength: float) -> NearField:
        """Kinsler & Frey's closed form, :math:`(D^2 - \\lambda^2) / 4\\lambda`."""
        from .. import axis

        return NearField(
            float(axis.disc_near_field(self.diameter, wavelength)),
            self._simple_near_field(wavelength),
            "last on-axis maximum, exact: (D^2 - lambda^2) / (4 lambda)",
        )

    def lateral(self, x, y, quantum):
        """Radii from the axis (the field is symmetric about it)."""
        r = np.round(np.hypot(x, y) / quantum) * quantum
        unique, inverse = np.unique(r, return_inverse=True)
        return (unique,), inverse.reshape(-1)

    def boundary_table(self, lateral, k_max, z_min):
        from ..field._boundary import disc_table

        return disc_table(lateral[0], 0.5 * self.diameter, k_max, z_min)

    def face_nodes(self, wavenumber, spread, count):
        """Gauss-Legendre in the radius, the midpoint rule in the azimuth."""
        radius = 0.5 * self.diameter
        n_r = count(wavenumber * radius * spread)
        n_phi = 2 * count(math.pi * wavenumber * radius * spread)
        t, w = np.polynomial.legendre.leggauss(n_r)
        rho = 0.5 * radius * (t + 1.0)
        w_rho = 0.5 * radius * w * rho
        phi = (np.arange(n_phi) + 0.5) * (2.0 * math.pi / n_phi)
        u = (rho[:, None] * np.cos(phi)).ravel()
        v = (rho[:, None] * np.sin(phi)).ravel()
        weight = np.repeat(w_rho, n_phi) * (2.0 * math.pi / n_phi)
        return u, v, weight, u * u + v * v  # a spherical focus curves both directions

    def focused_pressures(self, focal_length, offsets, depths, wavenumbers, plane):
        """:math:`(k/z) |\\int_0^a e^{-i\\alpha\\rho^2} J_0(\\beta\\rho)\\rho\\,d\\rho|`."""
        from ..field._aperture import aperture_integrals

        z = depths[:, None]  # (D, 1)
        k = wavenumbers[None, :]  # (1, F)
        inv_f = 0.0 if math.isinf(focal_length) else 1.0 / focal_length
        beta = (k / z)[:, :, None] * offsets  # (D, F, R)
        alpha = 0.5 * k * (1.0 / z - inv_f)
        half = 0.5 * self.diameter
        return (k / z)[:, :, None] * np.abs(aperture_integrals(half, True, alpha, beta))

    def focused_axis(self, focal_length, wavelength):
        """O'Neil's on-axis pressure from 0.02 F to 3 F (:mod:`beamspread.setups`)."""
        from .. import setups

        z = np.linspace(0.02 * focal_length, 3.0 * focal_length, 20001)
        return z, setups.focused_disc_axial_pressure(z, self.diameter, focal_length, wavelength)

    def seen_through_wedge(self, incident, refracted):
        """An ellipse: the diameter in the incidence plane shortened, the other kept."""
        from .. import setups
        from .sided import Ellipse

        inc = setups.effective_aperture(self.diameter, incident, refracted)
        return WedgeView(
            Ellipse(inc, self.diameter, self.frequency),
            {"length": "incidence", "width": "transverse"},
            inc * self.diameter,
            "a disc of the virtual ellipse's area, D²·cos(refracted)/(4λ·cos(incident))",
        )

    def directivity_factor(self, wavelength):
        from ..sonar._piston import disc_directivity_factor

        return float(disc_directivity_factor(self.diameter, wavelength))

    def equivalent_beam_angle(self, wavelength):
        from ..sonar._piston import disc_beam_angle

        return disc_beam_angle(self.diameter, wavelength)
