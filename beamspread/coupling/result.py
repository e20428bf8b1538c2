"""The results of a setup: the beam in the part and what the setup did to it.

:class:`SetupResult` carries the beam in the part and what the coupling adds;
:class:`FocusResult` what a focus does; :class:`WedgeFootprint` where one
level's edges cross a depth under a wedge. Results are plain data: the
beam's edges along its path are worked out by :mod:`beamspread.edges`.
"""

from __future__ import annotations

from dataclasses import dataclass

from .. import setups
from ..beam import BeamResult
from ..probes import Disc, Ellipse, Rectangle

__all__ = ["FocusResult", "SetupResult", "WedgeFootprint"]


@dataclass(frozen=True)
class FocusResult:
    """What a focus does, in the couplant and (after a water path) in the part."""

    normalised_focal_length: float  # S = F / N in the couplant
    axial_maximum: float  # m from the face, in the couplant: the true on-axis maximum
    spot_width: float  # m, the focal spot at the first level (diffraction)
    zone: tuple[float, float] | None  # m from the face: on-axis amplitude at or above the level
    zone_rule_of_thumb: float  # m: N S^2 2/(1 + 0.5 S), common practice, for comparison
    focal_depth_in_part: float | None = None  # m below the surface, paraxial
    axial_maximum_in_part: float | None = None
    zone_in_part: tuple[float, float] | None = None
    paraxial_poor: bool = False


@dataclass(frozen=True)
class WedgeFootprint:
    """Where one level's edges in the incidence plane cross a depth on one leg.

    Under a wedge, from :func:`~beamspread.coupling.wedge.analyse_wedge`; for a
    straight beam in a plate (where the surface distance is 0 and the edges
    cross at the sound path itself), from :func:`beamspread.edges.straight_footprints`.

    The edges lie at half the beam's full width either side of the axis,
    across it (perpendicular to it); ``near`` and ``far`` are where they cross
    the depth, m along the surface from the exit point (``far`` ahead of the
    axis); None where that edge does not reach the depth. ``near_path`` and
    ``far_path`` are the sound paths (m along the axis, unfolded) of the
    crossings. ``method`` is "far-field" (the cone from the virtual element)
    or "field" (the computed field).
    """

    depth: float  # m below the scanning surface
    leg: int
    level_db: float  # negative: -6.0 means 6 dB down
    method: str
    sound_path: float  # m, exit point to the depth along the axis
    surface_distance: float  # m, exit point to the axis at the depth
    near: float | None
    far: float | None
    near_path: float | None = None
    far_path: float | None = None

    @property
    def width(self) -> float | None:
        """The footprint along the depth, m (None where an edge does not reach it)."""
        if self.near is None or self.far is None:
            return None
        return self.far - self.near


@dataclass(frozen=True)
class SetupResult:
    """The beam in the part and what the setup did to it."""

    beam: BeamResult
    setup: str  # "wedge", "immersion"
    refraction: setups.Refraction | None = None
    effective_aperture: float | None = None  # m, in the incidence plane
    near_field_in_part: float | None = None  # m
    transmission: float | None = None  # pressure, couplant to part, normal incidence
    focus: FocusResult | None = None
    warnings: tuple[str, ...] = ()
    virtual: Disc | Rectangle | Ellipse | None = None  # the element as the part sees it
    offset: float = 0.0  # m: how far the virtual element sits behind the exit point
    footprints: tuple[WedgeFootprint, ...] = ()  # incidence plane, per depth, leg, level, method
    # (method, warning): the warnings (also in ``warnings``) that concern only the
    # far-field ("far-field") or the computed ("field") widths and footprints
    method_warnings: tuple[tuple[str, str], ...] = ()
