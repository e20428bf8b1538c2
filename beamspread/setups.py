"""Inspection setups: what a wedge, a water path or a focusing lens does to the beam.

All functions take SI floats (angles in radians) or numpy arrays and broadcast.
Nothing here reads tables or prints; the media come in as speeds.

References
----------
Snell's law and the critical angles: any UT text, e.g. J. and H. Krautkramer,
*Ultrasonic Testing of Materials*, chapter on oblique incidence.
Focused disc: H. T. O'Neil, "Theory of focusing radiators", J. Acoust. Soc.
Am. 21, 516 (1949).
Near field after a water path or wedge, focal depth in the part: common
practice (see the function notes).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ._checks import check_positive
from .errors import InputError

__all__ = [
    "Refraction",
    "cone_footprint",
    "critical_angles",
    "effective_aperture",
    "focal_depth_in_part",
    "focal_spot_width",
    "focused_disc_axial_pressure",
    "focused_rectangle_axial_pressure",
    "immersion_near_field",
    "leg_geometry",
    "normalised_focal_length",
    "refract",
    "transmission_coefficient",
    "wedge_near_field",
]

_RIGHT = math.pi / 2


def _snell(sin_in: np.ndarray, c_in: float, c_out: float) -> np.ndarray:
    """The refracted angle for sin(incident) in a medium of speed c_in; NaN past critical."""
    s = np.asarray(sin_in, dtype=float) * c_out / c_in
    with np.errstate(invalid="ignore"):
        return np.where(s < 1.0, np.arcsin(np.minimum(s, 1.0)), np.nan)


def critical_angles(c_wedge: float, c_longitudinal: float | None, c_shear: float | None):
    """First and second critical angles (rad) in the wedge; None where there is none.

    First: the refracted longitudinal wave reaches 90 degrees, sin a1 = c_wedge / c_L.
    Second: the refracted shear wave reaches 90 degrees, sin a2 = c_wedge / c_S.
    A wave faster in the wedge than in the part has no critical angle.

    Examples
    --------
    Acrylic (2730 m/s) on the ISO 22232-2 reference steel (5920, 3255 m/s):

    >>> [round(math.degrees(a), 2) for a in critical_angles(2730.0, 5920.0, 3255.0)]
    [27.46, 57.0]
    """
    c_wedge = check_positive(c_wedge, "wedge speed", "m/s")
    first = None
    if c_longitudinal is not None and c_wedge < c_longitudinal:
        first = math.asin(c_wedge / c_longitudinal)
    second = None
    if c_shear is not None and c_wedge < c_shear:
        second = math.asin(c_wedge / c_shear)
    return first, second


@dataclass(frozen=True)
class Refraction:
    """Angles (rad) of a wedge on a part: the incident angle and the refracted ones."""

    incident: float
    longitudinal: float | None  # None: past the first critical angle (no longitudinal wave)
    shear: float | None  # None: past the second critical angle, or no shear in the part
    first_critical: float | None
    second_critical: float | None

    def refracted(self, wave: str) -> float | None:
        return self.longitudinal if wave == "longitudinal" else self.shear


def refract(
    c_wedge: float,
    c_longitudinal: float | None,
    c_shear: float | None,
    *,
    incident: float | None = None,
    refracted: float | None = None,
    wave: str = "shear",
) -> Refraction:
    """Snell's law for a wedge on a part, from the incident angle or a refracted one.

    Parameters
    ----------
    c_wedge : float
        Longitudinal speed in the wedge, m/s.
    c_longitudinal, c_shear : float or None
        Speeds in the part, m/s (``c_shear`` None for a liquid; either None
        where it is not known, and then that mode is not reported).
    incident : float, optional
        Incident angle in the wedge, rad, in [0, 90 degrees).
    refracted : float, optional
        The refracted angle wanted for ``wave`` in the part, rad; the incident
        angle is solved.
    wave : {"shear", "longitudinal"}
        The mode of ``refracted``.

    Raises
    ------
    InputError
        Neither or both angles given; an angle outside [0, 90) degrees; a
        refracted angle that no incident angle reaches (the wave is slower in
        the wedge).

    Notes
    -----
    :math:`\\sin\\alpha / c_{wedge} = \\sin\\beta_L / c_L = \\sin\\beta_S / c_S`.

    Examples
    --------
    The incident angle in acrylic for a 45 degree shear wave in steel:

    >>> r = refract(2730.0, 5920.0, 3255.0, refracted=math.radians(45))
    >>> round(math.degrees(r.incident), 2)
    36.37
    """
    if (incident is None) == (refracted is None):
        raise InputError("give either the incident angle or the refracted angle")
    first, second = critical_angles(c_wedge, c_longitudinal, c_shear)
    if refracted is not None:
        if not 0.0 <= refracted < _RIGHT:
            raise InputError(
                f"refracted angle {math.degrees(refracted):g} deg is not allowed; "
                "it must lie from 0 up to (not at) 90 degrees"
            )
        c_mode = c_longitudinal if wave == "longitudinal" else c_shear
        if c_mode is None:
            raise InputError(f"the part's {wave} speed is not known (or it carries no shear wave)")
        s = c_wedge * math.sin(refracted) / c_mode
        if s >= 1.0:  # only where the mode is slower in the part than in the wedge
            largest = math.degrees(math.asin(c_mode / c_wedge))
            raise InputError(
                f"no incident angle gives a {math.degrees(refracted):g} deg {wave} wave: "
                f"with a {c_wedge:g} m/s wedge the largest reachable is {largest:.1f} deg"
            )
        incident = math.asin(s)
    assert incident is not None
    if not 0.0 <= incident < _RIGHT:
        raise InputError(
            f"incident angle {math.degrees(incident):g} deg is not allowed; "
            "it must lie from 0 up to (not at) 90 degrees"
        )
    sin_in = math.sin(incident)
    beta_l = (
        float(_snell(sin_in, c_wedge, c_longitudinal)) if c_longitudinal is not None else math.nan
    )
    beta_s = float(_snell(sin_in, c_wedge, c_shear)) if c_shear is not None else math.nan
    return Refraction(
        incident=incident,
        longitudinal=None if math.isnan(beta_l) else beta_l,
        shear=None if math.isnan(beta_s) else beta_s,
        first_critical=first,
        second_critical=second,
    )


def effective_aperture(aperture: float, incident: float, refracted: float) -> float:
    """The element's aperture in the incidence plane as seen from the part, m.

    The beam's cross-section changes at refraction by cos(refracted)/cos(incident)
    (common practice): ``aperture * cos(refracted) / cos(incident)``.
    """
    return aperture * math.cos(refracted) / math.cos(incident)


def wedge_near_field(
    near_field_in_part: float, wedge_path: float, c_wedge: float, c_part: float
) -> float:
    """Near field left in the part after a wedge, m (may be negative: then none is left).

    Common practice: the wedge path counts as ``wedge_path * c_wedge / c_part``
    of the part's near field, ``N_part - wedge_path * c_wedge / c_part``.
    """
    return near_field_in_part - wedge_path * c_wedge / c_part


def immersion_near_field(
    near_field_in_water: float, water_path: float, c_water: float, c_part: float
) -> float | None:
    """Near field in the part after a water path, m; None where the part lies in the far field.

    Common practice: ``(N_water - WP) * c_water / c_part`` for ``WP < N_water``.

    >>> round(immersion_near_field(0.100, 0.040, 1483.0, 5920.0) * 1e3, 3)
    15.03
    """
    if water_path >= near_field_in_water:
        return None
    return (near_field_in_water - water_path) * c_water / c_part


def transmission_coefficient(z1: float, z2: float) -> float:
    """Pressure transmission coefficient at normal incidence, ``2 Z2 / (Z1 + Z2)``.

    From medium 1 (impedance z1) into medium 2 (z2); any acoustics text.
    """
    return 2.0 * z2 / (z1 + z2)


def leg_geometry(depth: float, refracted: float, thickness: float | None = None, leg: int = 1):
    """Sound path and surface distance from the exit point to a depth on a leg.

    Leg 1 goes down from the exit point; leg 2 comes back up after the
    back-wall bounce, when the unfolded depth is ``2 t - depth``.

    Returns
    -------
    (sound_path, surface_distance, unfolded_depth) in m.
    """
    if leg == 1:
        unfolded = depth
    elif leg == 2:
        if thickness is None:
            raise InputError("the second leg needs the part thickness")
        unfolded = 2.0 * thickness - depth
    else:
        raise InputError(f"leg {leg} is not allowed; use 1 or 2")
    return unfolded / math.cos(refracted), unfolded * math.tan(refracted), unfolded


def cone_footprint(
    unfolded_depth: float, refracted: float, half_angle: float, offset: float = 0.0
) -> tuple[float, float | None, float, float | None]:
    """Where the far-field cone's edges in the incidence plane cross a depth.

    The cone's apex sits on the beam axis ``offset`` (m) behind the exit
    point, at the virtual element (the wedge path's equivalent in the part,
    common practice); its edges leave the apex at ``refracted -+ half_angle``
    (rad) from the surface normal. Unfolded, the path is straight, so the
    second leg is the same with ``unfolded_depth = 2 t - depth``
    (:func:`leg_geometry`).

    Returns
    -------
    (near, far, near_path, far_path)
        ``near`` and ``far``: the edges' positions along the surface from the
        exit point, m, at the unfolded depth; ``far`` is None where the edge
        ahead of the axis runs at or above the surface (``refracted +
        half_angle`` of 90 degrees or more) and never reaches a depth.
        ``near_path`` and ``far_path``: the sound paths along the axis (m,
        from the exit point) of the points across the axis where each edge
        crosses the depth.

    Notes
    -----
    With the apex at :math:`(-o\\sin\\beta, -o\\cos\\beta)` (along the surface,
    depth) an edge at angle :math:`\\beta \\pm \\theta` crosses the depth
    :math:`u` at :math:`x = (u + o\\cos\\beta)\\tan(\\beta \\pm \\theta) - o\\sin\\beta`,
    so the footprint is
    :math:`(u + o\\cos\\beta)\\,(\\tan(\\beta + \\theta) - \\tan(\\beta - \\theta))`;
    the point lies :math:`(u + o\\cos\\beta)\\cos\\theta / \\cos(\\beta \\pm \\theta) - o`
    along the axis (plane geometry).

    Examples
    --------
    A 60 degree beam with a 5 degree half-angle, 15 mm down, the apex 10 mm behind
    the exit point:

    >>> near, far, _, _ = cone_footprint(0.015, math.radians(60), math.radians(5), 0.010)
    >>> round((far - near) * 1e3, 2)
    14.33
    """
    b, t, o = float(refracted), float(half_angle), float(offset)
    reach = unfolded_depth + o * math.cos(b)
    back = o * math.sin(b)

    def edge(angle):
        if angle >= _RIGHT:
            return None, None
        return reach * math.tan(angle) - back, reach * math.cos(t) / math.cos(angle) - o

    near, near_path = edge(b - t)
    far, far_path = edge(b + t)
    return near, far, near_path, far_path


def normalised_focal_length(focal_length: float, near_field: float) -> float:
    """S = F / N: focusing narrows the beam only for S < 1 (useful below about 0.6-0.7)."""
    return focal_length / near_field


def focal_spot_width(focal_length: float, wavelength: float, aperture: float, x: float) -> float:
    """Full width of the focal spot where the focal-plane pattern falls to a level.

    In the focal plane the paraxial pattern is the far-field one with
    ``sin(theta)`` replaced by ``r / F`` (O'Neil 1949): a disc gives
    ``2 J1(k a r/F) / (k a r/F)``, a cylindrical lens ``sin(u)/u`` in its plane.
    With ``x`` the pattern argument at the level (:func:`beamspread.pattern.pattern_x`),
    the full width is ``2 x F lambda / (pi D)``: at -6 dB pulse-echo for a disc
    about 1.03 F lambda / D.
    """
    return 2.0 * x * focal_length * wavelength / (math.pi * aperture)


def focused_disc_axial_pressure(z, diameter: float, focal_length: float, wavelength: float):
    """On-axis pressure of a spherically focused disc (a spherical cap), in units of rho c U0.

    O'Neil (1949): with the cap's depth ``h = F - sqrt(F^2 - a^2)``,

    .. math:: \\frac{|p(z)|}{\\rho c U_0} = \\frac{2}{|1 - z/F|}
       \\left|\\sin\\left(\\frac{k}{2}\\left(\\sqrt{(z - h)^2 + a^2} - z\\right)\\right)\\right|,

    with the limit :math:`k h` at ``z = F``; ``z`` is measured along the axis
    from the cap's apex (the centre of the element's face). The brute-force
    check in the tests integrates the Rayleigh integral over the cap.
    """
    z = np.asarray(z, dtype=float)
    a = 0.5 * diameter
    if focal_length <= a:
        raise InputError(
            f"focal length {focal_length * 1e3:g} mm is not allowed; it must "
            f"exceed the element's radius ({a * 1e3:g} mm)"
        )
    k = 2.0 * np.pi / wavelength
    h = focal_length - math.sqrt(focal_length**2 - a * a)
    r1 = np.sqrt((z - h) ** 2 + a * a)
    num = 2.0 * np.abs(np.sin(0.5 * k * (r1 - z)))
    den = np.abs(1.0 - z / focal_length)
    near = den < 1e-9
    with np.errstate(divide="ignore", invalid="ignore"):
        return np.where(near, k * h, num / np.where(near, 1.0, den))


def focal_depth_in_part(
    focal_length: float, water_path: float, c_water: float, c_part: float
) -> float | None:
    """Paraxial focal depth in the part after a water path, m; None if the focus lies in water.

    Common practice: ``(F - WP) * c_water / c_part``.
    """
    if focal_length <= water_path:
        return None
    return (focal_length - water_path) * c_water / c_part


def _fresnel_span(alpha, half):
    """Integral of exp(-i alpha x^2) over [-half, half], for real alpha (any sign)."""
    from scipy.special import fresnel  # only when a cylindrical focus is asked for

    alpha = np.asarray(alpha, dtype=float)
    small = np.abs(alpha) * half * half < 1e-12
    safe = np.where(small, 1.0, np.abs(alpha))
    scale = np.sqrt(np.pi / (2.0 * safe))
    s_val, c_val = fresnel(half / scale)
    value = 2.0 * scale * (c_val - 1j * np.sign(alpha) * s_val)
    return np.where(small, 2.0 * half + 0j, value)


def focused_rectangle_axial_pressure(
    z, length: float, width: float, focal_length: float, wavelength: float
):
    """On-axis pressure of a rectangle focused cylindrically in its length plane, rho c U0 units.

    Fresnel (paraxial) form: the lens adds the phase :math:`k x^2 / 2F` across the
    length, so the Rayleigh integral separates into two Fresnel integrals,

    .. math:: \\frac{|p(z)|}{\\rho c U_0} = \\frac{k}{2\\pi z}
       \\left|\\int_{-a}^{a} e^{-i k x^2 (1/z - 1/F)/2} dx\\right|
       \\left|\\int_{-b}^{b} e^{-i k y^2 / 2z} dy\\right| ,

    with the half-sides ``a`` (length) and ``b`` (width), evaluated with
    ``scipy.special.fresnel``. It holds where the Fresnel approximation does:
    depths well beyond the element's half-length (z > about 2 a) and gentle
    focusing (a / F below about 0.3); the callers warn outside that.
    """
    z = np.asarray(z, dtype=float)
    k = 2.0 * np.pi / wavelength
    a, b = 0.5 * length, 0.5 * width
    ix = _fresnel_span(0.5 * k * (1.0 / z - 1.0 / focal_length), a)
    iy = _fresnel_span(0.5 * k / z, b)
    return k / (2.0 * np.pi * z) * np.abs(ix) * np.abs(iy)
