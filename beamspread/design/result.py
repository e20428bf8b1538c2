"""The solved element (:class:`Design`) and how a solver's arrays become one."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from ..sonar.footprint import footprint_width

__all__ = ["Design"]


@dataclass(frozen=True)
class Design:
    """A solved element, in SI units with its convention.

    Attributes
    ----------
    shape : {"disc", "rectangle"}
    solved : {"diameter", "frequency", "side"}
        What was solved for.
    mode : {"one-way", "pulse-echo"}
    level_db : float
        Negative: -3.0 means the main lobe 3 dB down.
    aperture : float or ndarray
        The diameter, or the solved side of a rectangle, m.
    other_side : float, ndarray or None
        The given other side of a rectangle, m.
    frequency, speed, wavelength : float or ndarray
        Hz, m/s, m.
    half_angle_deg, full_angle_deg : float or ndarray
        The angles the solution gives (in the plane of ``aperture``).
    other_half_angle_deg : float, ndarray or None
        Rectangles: the half-angle at the same level in the other plane
        (NaN where the pattern does not fall to the level there).
    near_field : float or ndarray
        The last on-axis maximum, m; NaN where the element is too small to have one.
    directivity_index_db : float or ndarray
        :func:`beamspread.sonar.directivity.directivity_index` of the solution.
    depth : float or ndarray
        The depth of the footprint, m (NaN where none was asked for).
    footprint_width : float or ndarray
        The full width of the cone at ``depth``, ``2 depth tan(half_angle)``, m.
    far_field_at_depth : bool or ndarray
        Whether ``depth`` lies at or beyond the near field (the cone holds).
    """

    shape: str
    solved: str
    mode: str
    level_db: float
    aperture: float | np.ndarray
    other_side: float | np.ndarray | None
    frequency: float | np.ndarray
    speed: float | np.ndarray
    wavelength: float | np.ndarray
    half_angle_deg: float | np.ndarray
    full_angle_deg: float | np.ndarray
    other_half_angle_deg: float | np.ndarray | None
    near_field: float | np.ndarray
    directivity_index_db: float | np.ndarray
    depth: float | np.ndarray
    footprint_width: float | np.ndarray
    far_field_at_depth: bool | np.ndarray

    @property
    def diameter(self) -> float | np.ndarray:
        """The diameter of a disc solution, m."""
        if self.other_side is not None:
            raise AttributeError("a rectangle has no diameter; see aperture and other_side")
        return self.aperture


def scalar_or_array(array):
    array = np.asarray(array)
    if array.ndim == 0:
        return bool(array) if array.dtype == bool else float(array)
    return array


def make_design(shape, solved, mode, level, element, beam, depth, impossible) -> Design:
    """A solver's arrays as a :class:`Design`, NaN where the target is impossible.

    ``element`` is (aperture, other side or None, frequency, speed, wavelength) and
    ``beam`` (half-angle in rad, the other plane's half-angle or None, near field, DI in dB).
    """
    aperture, other, frequency, speed, wavelength = element
    theta, other_half, near, di = beam
    aperture = np.where(impossible, np.nan, aperture)
    frequency = np.where(impossible, np.nan, frequency)
    wavelength = np.where(impossible, np.nan, wavelength)
    theta = np.where(impossible, np.nan, theta)
    near = np.where(impossible, np.nan, near)
    di = np.where(impossible, np.nan, di)
    width = footprint_width(depth, theta)
    with np.errstate(invalid="ignore"):
        far = np.isfinite(depth) & (np.isnan(near) | (depth >= near)) & ~impossible
    half_deg = np.degrees(theta)
    return Design(
        shape=shape,
        solved=solved,
        mode=mode,
        level_db=-level,
        aperture=scalar_or_array(aperture),
        other_side=None if other is None else scalar_or_array(other),
        frequency=scalar_or_array(frequency),
        speed=scalar_or_array(speed),
        wavelength=scalar_or_array(wavelength),
        half_angle_deg=scalar_or_array(half_deg),
        full_angle_deg=scalar_or_array(2.0 * half_deg),
        other_half_angle_deg=None
        if other_half is None
        else scalar_or_array(np.where(impossible, np.nan, np.degrees(other_half))),
        near_field=scalar_or_array(near),
        directivity_index_db=scalar_or_array(di),
        depth=scalar_or_array(depth),
        footprint_width=scalar_or_array(width),
        far_field_at_depth=scalar_or_array(far),
    )
