"""All the sonar figures of an analysed beam in one result."""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass

from ..beam import level_key
from ..units import positive_numbers
from .beam_angle import equivalent_beam_angle
from .directivity import directivity_factor, rayleigh_distance
from .footprint import Footprint, footprint_width
from .side_lobes import SideLobe, first_side_lobe


@dataclass(frozen=True)
class SonarFigures:
    """The sonar figures of an analysed beam (see :func:`sonar_figures`).

    Angles in degrees; lengths in m. ``full_angles`` maps each plane name to
    the level keys of the :class:`beamspread.BeamResult` ("-3", "null") and
    full angles (None where there is none).
    """

    mode: str
    directivity_factor: float
    directivity_index_db: float
    directivity_method: str
    rayleigh_distance: float
    full_angles: dict[str, dict[str, float | None]]
    side_lobes: tuple[SideLobe, ...]
    equivalent_beam_angle_sr: float
    equivalent_beam_angle_db: float
    footprints: tuple[Footprint, ...]
    absorption_db_per_km: float | None = None


def sonar_figures(
    result, *, bottom_depths: Sequence[float] = (), absorption_db_per_km: float | None = None
) -> SonarFigures:
    """Directivity, full angles, side lobes, psi and footprints of an analysed beam.

    Parameters
    ----------
    result : BeamResult
        From :func:`beamspread.analyse`, with the levels and mode wanted
        (the sonar trade's: ``levels=SONAR_LEVELS, mode=SONAR_MODE``).
    bottom_depths : sequence of float
        Water depths for footprints, m (above 0); see :func:`depth_range`.
    absorption_db_per_km : float, optional
        Passed through, for reports (the medium's
        :meth:`~beamspread.ComputedMedium.absorption_db_per_km`).

    Returns
    -------
    SonarFigures
        Footprints for every depth, level and plane, in that order, using the
        result's half-angles (so its mode and levels).

    Examples
    --------
    >>> from beamspread import Disc, analyse
    >>> r = analyse(Disc(0.025, 200e3), 1500.0, levels=[3], mode="one-way")
    >>> f = sonar_figures(r, bottom_depths=[30.0])
    >>> round(f.full_angles["diameter"]["-3"], 2), round(f.footprints[0].width, 2)
    (17.73, 9.36)
    """
    probe, wavelength = result.probe, result.wavelength
    shape = probe.pattern
    q = directivity_factor(probe, wavelength)
    method = probe.directivity_factor_method
    full = {
        plane.name: {
            key: (None if value is None else 2.0 * value)
            for key, value in plane.half_angles.items()
        }
        for plane in result.planes
    }
    lobes = tuple(
        first_side_lobe(aperture, wavelength, shape, result.convention.mode, name)
        for name, aperture in probe.planes
    )
    psi = equivalent_beam_angle(probe, wavelength)
    depths = positive_numbers(bottom_depths, "bottom depth", "give a depth above 0")
    near = result.near_field
    prints = []
    for depth in depths:
        for level in result.levels:
            key = level_key(level)
            for plane in result.planes:
                angle = plane.half_angles.get(key)
                width = (
                    None if angle is None else float(footprint_width(depth, math.radians(angle)))
                )
                prints.append(
                    Footprint(
                        depth, -abs(level), plane.name, width, near is not None and depth < near
                    )
                )
    return SonarFigures(
        mode=result.convention.mode,
        directivity_factor=q,
        directivity_index_db=10.0 * math.log10(q),
        directivity_method=method,
        rayleigh_distance=rayleigh_distance(probe, wavelength),
        full_angles=full,
        side_lobes=lobes,
        equivalent_beam_angle_sr=psi,
        equivalent_beam_angle_db=10.0 * math.log10(psi),
        footprints=tuple(prints),
        absorption_db_per_km=absorption_db_per_km,
    )
