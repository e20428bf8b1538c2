"""Plane-wave reflection and transmission at a flat interface between two media.

Each side is a fluid (longitudinal waves only) or an isotropic solid
(longitudinal and shear, SV). A plane wave of slowness ``p`` along the
interface meets it from side 1; the reflected and transmitted waves follow
Snell's law (they share ``p``), and their amplitudes solve the boundary
conditions at the interface:

* a **welded** boundary (two solids bonded): displacement and traction
  continuous, four conditions;
* a **slip** boundary (two solids coupled by a thin liquid layer, as a wedge
  on a part with couplant between): normal displacement and normal stress
  continuous, no shear traction on either side;
* a fluid on either side: normal displacement and normal stress continuous,
  no shear traction on the solid.

This is the standard plane-wave analysis of an elastic interface (Schmerr,
*Fundamentals of Ultrasonic Nondestructive Evaluation*, chapter on
reflection and transmission at plane interfaces; Brekhovskikh, *Waves in
Layered Media*), solved here as a small linear system per angle rather
than from closed forms, so every pairing of fluid and solid sides and both
boundaries share one method. Amplitudes are **displacement** ratios to the
incident wave's (the same as particle-velocity ratios); ``stress`` gives the
ratios of plane-wave stress amplitude (pressure, in a fluid), ``rho c`` times
the displacement amplitude times ``omega``. ``energy`` gives the share of the
incident wave's power through the interface that each wave carries (zero for
an evanescent wave), which sums to 1.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from ..errors import InputError

__all__ = ["Coefficients", "Side", "plane_wave_coefficients"]

_WAVES = (
    "reflected longitudinal",
    "reflected shear",
    "transmitted longitudinal",
    "transmitted shear",
)


@dataclass(frozen=True)
class Side:
    """One side of the interface.

    Parameters
    ----------
    density : float
        kg/m3.
    longitudinal : float
        Longitudinal speed, m/s.
    shear : float or None
        Shear speed, m/s; None for a fluid.
    """

    density: float
    longitudinal: float
    shear: float | None = None

    def __post_init__(self) -> None:
        for name in ("density", "longitudinal") + (() if self.shear is None else ("shear",)):
            value = getattr(self, name)
            if not np.isfinite(value) or value <= 0.0:
                raise InputError(f"{name}: {value!r} is not allowed; it must be above 0")
        if self.shear is not None and not self.shear < self.longitudinal / np.sqrt(2.0):
            raise InputError(
                f"shear: {self.shear!r} m/s is not allowed for a solid with a longitudinal "
                f"speed of {self.longitudinal!r} m/s; it must be below longitudinal / sqrt(2) "
                "(a positive Lame constant lambda)"
            )

    @property
    def solid(self) -> bool:
        return self.shear is not None

    def speed(self, wave: str) -> float:
        return self.longitudinal if wave == "longitudinal" else self.shear


@dataclass(frozen=True)
class Coefficients:
    """Reflection and transmission of a plane wave, per incident angle.

    Every array has the incident angles' shape. A wave that the sides do not
    carry (shear in a fluid) has zeros.

    Attributes
    ----------
    incident : ndarray
        Incident angle from the interface normal, rad.
    angles : dict of str to ndarray
        Each wave's angle from the normal, rad (NaN where it is evanescent).
    displacement : dict of str to ndarray (complex)
        Each wave's displacement amplitude over the incident wave's.
    stress : dict of str to ndarray (complex)
        Each wave's stress (pressure) amplitude over the incident wave's.
    energy : dict of str to ndarray
        Each wave's share of the incident power flux through the interface.
    boundary : str
        "welded", "slip" or "fluid" (a fluid on one side at least).
    """

    incident: np.ndarray
    angles: dict
    displacement: dict
    stress: dict
    energy: dict
    boundary: str


def _vertical(slowness: np.ndarray, speed: float) -> np.ndarray:
    """Vertical slowness, with a positive imaginary part where the wave is evanescent."""
    return np.sqrt((1.0 / speed**2 - slowness**2).astype(complex))


def _rows(side: Side, wave: str, p: np.ndarray, eta: np.ndarray) -> dict[str, np.ndarray]:
    """u_x, u_z, sigma_zz/(i omega), sigma_xz/(i omega) of a unit-amplitude wave."""
    c = side.speed(wave)
    if wave == "longitudinal":
        dx, dz = c * p, c * eta
    else:
        dx, dz = c * eta, -c * p
    shear = 0.0 if side.shear is None else side.shear
    mu = side.density * shear**2
    lam = side.density * side.longitudinal**2 - 2.0 * mu
    return {
        "ux": dx + 0j * p,
        "uz": dz + 0j * p,
        "szz": lam * (p * dx + eta * dz) + 2.0 * mu * eta * dz,
        "sxz": mu * (eta * dx + p * dz),
    }


def plane_wave_coefficients(
    incident_angles,
    upper: Side,
    lower: Side,
    *,
    boundary: str = "welded",
    incident_wave: str = "longitudinal",
) -> Coefficients:
    """Reflection and transmission of a plane wave from ``upper`` into ``lower``.

    Parameters
    ----------
    incident_angles : float or array_like
        Angles of the incident wave from the interface normal, rad, in [0, pi/2).
    upper, lower : Side
        The side the wave comes from, and the other.
    boundary : {"welded", "slip"}
        How two solids are joined (ignored when a side is a fluid).
    incident_wave : {"longitudinal", "shear"}
        The incident wave's mode (shear needs a solid upper side).

    Returns
    -------
    Coefficients
    """
    if boundary not in ("welded", "slip"):
        raise InputError(f"boundary: {boundary!r} is not allowed; use welded or slip")
    if incident_wave not in ("longitudinal", "shear"):
        raise InputError(
            f"incident wave: {incident_wave!r} is not allowed; use longitudinal or shear"
        )
    if incident_wave == "shear" and not upper.solid:
        raise InputError("incident wave: shear is not allowed from a fluid; use longitudinal")
    theta = np.asarray(incident_angles, dtype=float)
    if theta.size and not (np.all(theta >= 0.0) and np.all(theta < np.pi / 2)):
        raise InputError("incident angle: every angle must be in [0, 90) degrees")
    shape = theta.shape
    theta = theta.reshape(-1)
    p = np.sin(theta) / upper.speed(incident_wave)

    waves = [("reflected longitudinal", upper, "longitudinal", -1.0)]
    if upper.solid:
        waves.append(("reflected shear", upper, "shear", -1.0))
    waves.append(("transmitted longitudinal", lower, "longitudinal", 1.0))
    if lower.solid:
        waves.append(("transmitted shear", lower, "shear", 1.0))
    eta = {name: sign * _vertical(p, side.speed(w)) for name, side, w, sign in waves}
    rows = {name: _rows(side, w, p, eta[name]) for name, side, w, _ in waves}
    incident = _rows(upper, incident_wave, p, _vertical(p, upper.speed(incident_wave)))

    if upper.solid and lower.solid:
        kind = boundary
        if boundary == "welded":
            conditions = [("ux", None), ("uz", None), ("szz", None), ("sxz", None)]
        else:
            conditions = [("uz", None), ("szz", None), ("sxz", "upper"), ("sxz", "lower")]
    else:
        kind = "fluid"
        conditions = [("uz", None), ("szz", None)]
        conditions += [("sxz", "upper")] if upper.solid else []
        conditions += [("sxz", "lower")] if lower.solid else []

    n = len(waves)
    matrix = np.zeros((theta.size, n, n), dtype=complex)
    rhs = np.zeros((theta.size, n), dtype=complex)
    for i, (quantity, only) in enumerate(conditions):
        for j, (name, _, _, sign) in enumerate(waves):
            on_upper = sign < 0
            if only is not None and (only == "upper") != on_upper:
                continue
            matrix[:, i, j] = rows[name][quantity] * (1.0 if on_upper else -1.0)
        if only != "lower":
            rhs[:, i] = -incident[quantity]
    amplitude = np.linalg.solve(matrix, rhs[..., None])[..., 0]

    c_in = upper.speed(incident_wave)
    flux_in = upper.density * c_in**2 * np.real(_vertical(p, c_in))
    angles, displacement, stress, energy = {}, {}, {}, {}
    for name in _WAVES:
        angles[name] = np.full(shape, np.nan)
        for key in (displacement, stress):
            key[name] = np.zeros(shape, dtype=complex)
        energy[name] = np.zeros(shape)
    for j, (name, side, w, _) in enumerate(waves):
        c = side.speed(w)
        a = amplitude[:, j]
        q = np.abs(eta[name])
        real = np.abs(np.imag(eta[name])) < 1e-12 * np.abs(eta[name]).max(initial=1.0)
        angles[name] = np.where(real, np.arcsin(np.clip(p * c, -1.0, 1.0)), np.nan).reshape(shape)
        displacement[name] = a.reshape(shape)
        stress[name] = (a * side.density * c / (upper.density * c_in)).reshape(shape)
        flux = side.density * c**2 * np.where(real, q, 0.0) * np.abs(a) ** 2
        energy[name] = (flux / flux_in).reshape(shape)
    return Coefficients(theta.reshape(shape), angles, displacement, stress, energy, kind)
