"""Elements with a size along x and along y: the rectangle and the ellipse a disc looks like."""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from .._checks import check_positive
from ._base import Element, NearField, WedgeView, check_focus, register_kind

__all__ = ["Ellipse", "Rectangle"]


@dataclass(frozen=True)
class _TwoSided(Element):
    """An element with a size along x (``length``) and along y (``width``).

    Its field is mirror-symmetric in x and in y.
    """

    length: float
    width: float
    frequency: float

    symmetry = "two-plane"  # mirror-symmetric about the x-z and the y-z planes
    size_names = ("length", "width")

    def __post_init__(self) -> None:
        object.__setattr__(self, "length", check_positive(self.length, "length", "m"))
        object.__setattr__(self, "width", check_positive(self.width, "width", "m"))
        object.__setattr__(self, "frequency", check_positive(self.frequency, "frequency", "Hz"))

    def sizes(self) -> dict[str, float]:
        return {"length": self.length, "width": self.width}

    @property
    def planes(self) -> tuple[tuple[str, float], ...]:
        """The planes of the beam, as (name, aperture in m): length (x), then width (y)."""
        return (("length", self.length), ("width", self.width))

    @property
    def longest_side(self) -> float:
        return max(self.length, self.width)

    def lateral(self, x, y, quantum):
        """(|x|, |y|) pairs (the field is mirror-symmetric in x and in y)."""
        key = np.round(np.abs(x) / quantum) + 1j * np.round(np.abs(y) / quantum)
        unique, inverse = np.unique(key * quantum, return_inverse=True)
        return (unique.real, unique.imag), inverse.reshape(-1)


@register_kind
@dataclass(frozen=True)
class Rectangle(_TwoSided):
    """A flat rectangular piston.

    Parameters
    ----------
    length : float
        The side that lies in the plane a plot draws (the x-z plane), m.
    width : float
        The other side (the y-z plane), m.
    frequency : float
        Centre frequency, Hz.
    focus : float, optional
        Focal length of a cylindrical focus in the length plane, m; None for a flat element.
    """

    focus: float | None = None

    shape = "rectangle"
    pattern = "side"  # each plane's pattern is a side's sinc
    noun = "rectangular"
    focus_kind = "cylindrical"
    focused_plane = "length"
    focus_half_name = "half-length"
    near_field_label = "from the exact on-axis integral"
    simple_near_field_label = "L²/4λ, L the longer side"
    directivity_factor_method = (
        "exact: from the radiation resistance (integral over the face autocorrelation)"
    )

    def __post_init__(self) -> None:
        super().__post_init__()
        check_focus(self)

    @property
    def area(self) -> float:
        return self.length * self.width

    @property
    def focus_description(self) -> str:
        return "a rectangle focused cylindrically in its length plane"

    def near_field(self, wavelength: float) -> NearField:
        """The last maximum of the exact on-axis Rayleigh integral (:mod:`beamspread.axis`)."""
        from .. import axis

        near = axis.rectangle_near_field(self.length, self.width, wavelength)
        simple = self._simple_near_field(wavelength)
        return NearField(
            near,
            simple,
            "last on-axis maximum of the exact on-axis Rayleigh integral",
            None if math.isnan(near) else near / simple,
        )

    def boundary_table(self, lateral, k_max, z_min):
        from ..field._boundary import rectangle_table

        a, b = 0.5 * self.length, 0.5 * self.width
        return rectangle_table(lateral[0], lateral[1], a, b, k_max, z_min)

    def face_nodes(self, wavenumber, spread, count):
        """A Gauss-Legendre product rule along the length and the width."""
        half_u, half_v = 0.5 * self.length, 0.5 * self.width
        tu, wu = np.polynomial.legendre.leggauss(count(wavenumber * half_u * spread))
        tv, wv = np.polynomial.legendre.leggauss(count(wavenumber * half_v * spread))
        u = np.repeat(half_u * tu, tv.size)
        v = np.tile(half_v * tv, tu.size)
        weight = np.repeat(half_u * wu, tv.size) * np.tile(half_v * wv, tu.size)
        return u, v, weight, u * u  # a cylindrical focus curves the length plane only

    def focused_pressures(self, focal_length, offsets, depths, wavenumbers, plane):
        """:math:`(k/2\\pi z)` times the line integrals along the length and the width."""
        from ..field._aperture import aperture_integrals

        z = depths[:, None]  # (D, 1)
        k = wavenumbers[None, :]  # (1, F)
        inv_f = 0.0 if math.isinf(focal_length) else 1.0 / focal_length
        beta = (k / z)[:, :, None] * offsets  # (D, F, R)
        a, b = 0.5 * self.length, 0.5 * self.width
        focused = 0.5 * k * (1.0 / z - inv_f)  # the length plane carries the focus
        plain = 0.5 * k / z
        zero = np.zeros((*beta.shape[:2], 1))
        if plane == self.focused_plane:
            along = aperture_integrals(a, False, focused, beta)
            other = aperture_integrals(b, False, plain, zero)
        else:
            along = aperture_integrals(b, False, plain, beta)
            other = aperture_integrals(a, False, focused, zero)
        return (k / (2.0 * math.pi * z))[:, :, None] * np.abs(along) * np.abs(other)

    def focused_axis(self, focal_length, wavelength):
        """The Fresnel form on the axis, from two half-lengths out to 3 F."""
        from .. import setups

        a = 0.5 * self.length
        z = np.linspace(max(0.02 * focal_length, 2.0 * a), 3.0 * focal_length, 20001)
        amp = setups.focused_rectangle_axial_pressure(
            z, self.length, self.width, focal_length, wavelength
        )
        return z, amp

    def seen_through_wedge(self, incident, refracted):
        """A rectangle: the length (in the incidence plane) shortened, the width kept."""
        from .. import setups

        inc = setups.effective_aperture(self.length, incident, refracted)
        return WedgeView(
            Rectangle(inc, self.width, self.frequency),
            {"length": "length", "width": "width"},
            max(inc, self.width) ** 2,
            "L²/4λ, L the virtual rectangle's longer side",
        )

    def directivity_factor(self, wavelength):
        from ..sonar._piston import rectangle_directivity_factor

        return rectangle_directivity_factor(self.length, self.width, wavelength)

    def equivalent_beam_angle(self, wavelength):
        from ..sonar._piston import rectangle_beam_angle

        return rectangle_beam_angle(self.length, self.width, wavelength)


@register_kind
@dataclass(frozen=True)
class Ellipse(_TwoSided):
    """A flat elliptical piston: the element a disc looks like from inside a part.

    A disc on an angle-beam wedge is seen from the part as an ellipse whose
    axis in the incidence plane is shortened by cos(refracted)/cos(incident);
    :meth:`Disc.seen_through_wedge` builds it.

    Parameters
    ----------
    length : float
        The axis along x (the plotted, incidence plane), m.
    width : float
        The axis along y, m.
    frequency : float
        Centre frequency, Hz.
    """

    shape = "ellipse"
    pattern = "disc"  # its planes' patterns are taken as a disc's of that aperture
    probe = False  # a virtual element only
    noun = "elliptical"
    near_field_label = "from the exact on-axis integral"
    simple_near_field_label = "L²/4λ, L the longer axis"

    @property
    def area(self) -> float:
        return 0.25 * math.pi * self.length * self.width

    def near_field(self, wavelength: float) -> NearField:
        """The last maximum of the exact on-axis Rayleigh integral (:mod:`beamspread.axis`)."""
        from .. import axis

        return NearField(
            axis.ellipse_near_field(self.length, self.width, wavelength),
            self._simple_near_field(wavelength),
            "last on-axis maximum of the exact on-axis Rayleigh integral",
        )

    def boundary_table(self, lateral, k_max, z_min):
        from ..field._boundary import ellipse_table

        a, b = 0.5 * self.length, 0.5 * self.width
        return ellipse_table(lateral[0], lateral[1], a, b, k_max, z_min)
