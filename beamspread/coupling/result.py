"""The results of a setup: the beam in the part and what the setup did to it.

:class:`SetupResult` carries the beam in the part and what the coupling adds;
:class:`FocusResult` what a focus does; :class:`WedgeFootprint` where one
level's edges cross a depth under a wedge. The computed field's widths along
the sound path are kept on the result (:class:`_ComputedWidths`), so a section
drawn from it reuses the widths its footprints were found with.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from dataclasses import field as _field

import numpy as np

from .. import setups
from ..beam import BeamResult, FieldSettings, level_key
from ..errors import InputError
from ..probes import Disc, Ellipse, Rectangle
from .crossing import _SHORTEST_PATH

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
    _widths: dict = _field(default_factory=dict, repr=False, compare=False)

    def edges(self, path_length: float, field: FieldSettings | None, *, samples: int = 24, at=()):
        """The beam's full width in the incidence plane along the sound path, per level.

        Returns ``{level_db: (sound_paths, widths)}``, m: from the computed field
        of the virtual element when ``field`` is given, else the far-field cone
        ``2 (s + offset) tan(half-angle)`` from the virtual element, the same
        widths the beam's far-field rows give (and, like them, not valid inside
        the near field). The sound paths in ``at`` (m) are sampled too, so a
        footprint read there is computed, not interpolated: pass the flaw's
        sound paths and the crossings in :attr:`footprints`.
        """
        if self.virtual is None:
            raise InputError("the beam's edges along the path need a wedge setup")
        plane = self.virtual.planes[0][0]
        beam = self.beam
        paths = np.linspace(0.0, path_length, samples)
        out = {}
        if field is None:
            half = beam.planes[0].half_angles
            for level in beam.levels:
                angle = half[level_key(level)]
                if angle is not None:
                    widths = 2.0 * (paths + self.offset) * math.tan(math.radians(angle))
                    out[level] = (tuple(paths), tuple(widths))
            return out
        first = max(0.05 * (beam.near_field or beam.near_field_simple or path_length), 1e-4)
        extra = [float(s) for s in at if _SHORTEST_PATH <= s < path_length]
        paths = np.unique(np.concatenate([np.linspace(first, path_length, samples), extra]))
        widths = _ComputedWidths(
            self.virtual,
            beam.wave.speed,
            self.offset,
            beam.levels,
            beam.convention.mode,
            field,
            self._widths,
        )
        table = {level: [] for level in beam.levels}
        for s in paths:
            for level, width in widths(plane, s).items():
                table[level].append(width)
        for level, values in table.items():
            if all(math.isfinite(w) for w in values):
                out[level] = (tuple(paths), tuple(values))
        return out


class _ComputedWidths:
    """The computed field's full widths per level at sound paths from the exit point.

    The virtual element's field at ``s + offset`` (see :mod:`beamspread.coupling.wedge`),
    kept in ``cache`` (the result's), so a section drawn from a result reuses
    the widths its footprints were found with.
    """

    def __init__(self, virtual, speed, offset, levels, mode, field: FieldSettings, cache: dict):
        self.virtual, self.speed, self.offset = virtual, speed, offset
        self.levels, self.mode, self.field, self.cache = levels, mode, field, cache

    def __call__(self, plane: str, path: float) -> dict[float, float]:
        from ..field import beam_widths

        key = (plane, float(path), self.field, self.mode, self.levels)
        found = self.cache.get(key)
        if found is None:
            widths = beam_widths(
                self.virtual,
                self.speed,
                path + self.offset,
                self.levels,
                plane=plane,
                bandwidth=self.field.bandwidth,
                mode=self.mode,
                frequencies=self.field.frequencies,
                spectrum=self.field.spectrum,
            )
            found = {level: w.width for level, w in zip(self.levels, widths, strict=True)}
            self.cache[key] = found
        return found
