"""The computed field's source: the element whose field is the beam in the part.

Every coupling comes down to one flat (or focused) element radiating into one
medium, and a mapping from where the part is asked about (a depth below the
surface, or a sound path along a refracted axis) to the range from that
element:

* contact: the element itself in the part; the range is the depth;
* wedge: the virtual element in the part (the real one projected by
  cos(refracted)/cos(incident) in the incidence plane) set back behind the
  exit point by the wedge path's equivalent; the range is the sound path plus
  that offset (common practice, see :mod:`beamspread.coupling.wedge`);
* water path (and a focus): the element in the couplant at the equivalent
  water path ``WP + d c_part / c_couplant`` (paraxial; the lateral scale is
  unchanged).

:class:`FieldSource` holds that, as plain data (it runs nothing); the
functions below give the widths, profiles and maps of the computed field on
the part's terms from it, so ``beam``, ``across``, ``axis``, ``map`` and the
index step all read the same field.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

import numpy as np

from .probes import Element, check_element

__all__ = ["FieldSource", "source_across", "source_axial", "source_map", "source_widths"]


@dataclass(frozen=True)
class FieldSource:
    """The element whose computed field is the beam, and where the part lies in that field.

    Parameters
    ----------
    element : Disc, Rectangle or Ellipse
        The flat element the field engine computes (a focus is in ``focus``).
    speed : float
        The speed of the medium the element radiates into, m/s.
    start, stretch : float
        The range from the element at the coordinate ``c`` is ``start + stretch c``, m.
    focus : float, optional
        Focal length, m: the paraxial field of the focused element.
    refracted : float
        The beam axis's angle from the surface normal in the part, rad.
    coordinate : {"depth", "sound path"}
        What the coordinate is: the depth below the surface (normal incidence),
        or the sound path along the refracted axis from the exit point.
    plane_names : tuple of (str, str)
        The result's plane names with the element's: ("incidence", "length")...
    """

    element: Element
    speed: float
    start: float = 0.0
    stretch: float = 1.0
    focus: float | None = None
    refracted: float = 0.0
    coordinate: str = "depth"
    plane_names: tuple[tuple[str, str], ...] = ()

    def __post_init__(self) -> None:
        check_element(self.element)

    @property
    def planes(self) -> tuple[str, ...]:
        """The result's plane names, in the element's order."""
        return tuple(name for name, _ in self.plane_names)

    def element_plane(self, plane: str) -> str:
        """The element's plane for a result plane name (or an element plane name)."""
        return dict(self.plane_names).get(plane, plane)

    def ranges(self, coordinates):
        """Range from the element at each coordinate (depth or sound path), m."""
        c = np.asarray(coordinates, dtype=float)
        if self.stretch == 1.0:
            return self.start + c
        return self.start + c * self.stretch

    def coordinate_of_depth(self, depth: float) -> float:
        """The coordinate of a depth below the surface on the first leg, m."""
        if self.coordinate == "depth":
            return depth
        return depth / math.cos(self.refracted)


def source_widths(
    source: FieldSource, coordinate: float, levels, plane: str, mode: str, settings
) -> list:
    """The computed field's widths (:class:`beamspread.BeamWidth`) at a coordinate, m.

    A focused element within one element size of the face gives none
    (NaN widths): its paraxial field does not hold there.
    """
    from .field import BeamWidth, beam_widths, focused_beam_widths

    at = float(source.ranges(coordinate))
    kwargs = _kwargs(settings, mode, source.element_plane(plane))
    if source.focus is None:
        return beam_widths(source.element, source.speed, at, levels, **kwargs)
    if at < source.element.longest_side:
        name = source.element_plane(plane)
        return [
            BeamWidth(name, at, abs(float(lv)), math.nan, str(mode), settings.bandwidth)
            for lv in levels
        ]
    return focused_beam_widths(source.element, source.speed, source.focus, at, levels, **kwargs)


def source_map(source: FieldSource, lateral, coordinates, plane: str, mode: str, settings):
    """The computed amplitude on ``lateral`` x ``coordinates`` (1-D, m), as a
    :class:`beamspread.FieldMap` whose ``depth`` is the coordinates."""
    from .field import FieldMap, field_map, focused_amplitude

    kwargs = _kwargs(settings, mode, source.element_plane(plane))
    ranges = source.ranges(coordinates)
    if source.focus is None:
        found = field_map(source.element, source.speed, lateral, ranges, **kwargs)
    else:
        amplitude = focused_amplitude(
            source.element, source.speed, source.focus, lateral, ranges, **kwargs
        )
        lateral = np.asarray(lateral, dtype=float)
        found = FieldMap(kwargs["plane"], lateral, ranges, amplitude, str(mode), settings.bandwidth)
    return replace(found, plane=plane, depth=np.asarray(coordinates, dtype=float))


def source_across(source: FieldSource, coordinate: float, offsets, plane: str, mode: str, settings):
    """The computed amplitude across the beam at one coordinate, as a
    :class:`beamspread.TransverseProfile` whose ``depth`` is the coordinate."""
    from .field import TransverseProfile, focused_amplitude, transverse_profile

    kwargs = _kwargs(settings, mode, source.element_plane(plane))
    at = float(source.ranges(coordinate))
    if source.focus is None:
        found = transverse_profile(source.element, source.speed, at, offsets, **kwargs)
    else:
        offsets = np.atleast_1d(np.asarray(offsets, dtype=float))
        amplitude = focused_amplitude(
            source.element, source.speed, source.focus, offsets, [at], **kwargs
        )[0]
        found = TransverseProfile(
            kwargs["plane"], at, offsets, amplitude, str(mode), settings.bandwidth
        )
    return replace(found, plane=plane, depth=float(coordinate))


def source_axial(source: FieldSource, coordinates, mode: str, settings):
    """The computed on-axis amplitude at the coordinates, as a
    :class:`beamspread.AxialProfile` whose ``depth`` is the coordinates."""
    from .field import AxialProfile, axial_profile, focused_amplitude

    kwargs = _kwargs(settings, mode, source.element_plane(source.planes[0]))
    ranges = source.ranges(coordinates)
    if source.focus is None:
        kwargs.pop("plane")
        found = axial_profile(source.element, source.speed, ranges, **kwargs)
    else:
        amplitude = focused_amplitude(
            source.element, source.speed, source.focus, [0.0], ranges, **kwargs
        )
        found = AxialProfile(ranges, amplitude[:, 0], str(mode), settings.bandwidth)
    return replace(found, depth=np.asarray(coordinates, dtype=float))


def _kwargs(settings, mode, plane) -> dict:
    return {
        "plane": plane,
        "bandwidth": settings.bandwidth,
        "mode": str(mode),
        "frequencies": settings.frequencies,
        "spectrum": settings.spectrum,
    }
