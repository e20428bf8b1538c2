"""The beam on a plate's section, in numbers: edges, legs, footprints at a depth.

What :mod:`.section` draws is traced here, in metres, without matplotlib; a
computed technique's section is built by :func:`section_of` (its edges from
:mod:`beamspread.edges`).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ...errors import InputError


@dataclass(frozen=True)
class BeamEdge:
    """The full width of the beam at one level along its sound path in the part.

    ``sound_path`` (m, from the exit point, unfolded through the back-wall
    bounce) and ``width`` (m, across the axis) are sampled together; the
    edges lie at +-width/2 either side of the axis, and are interpolated
    linearly between samples.
    """

    level_db: float
    sound_path: tuple[float, ...]
    width: tuple[float, ...]

    def __post_init__(self) -> None:
        path = tuple(float(v) for v in self.sound_path)
        width = tuple(float(v) for v in self.width)
        if len(path) < 2 or len(path) != len(width):
            raise InputError("beam edge: give at least 2 sound paths, each with its width")
        if any(not math.isfinite(v) or v < 0 for v in path + width):
            raise InputError("beam edge: sound paths and widths must be finite and not negative")
        if np.any(np.diff(path) <= 0):
            raise InputError("beam edge: the sound paths must increase")
        object.__setattr__(self, "level_db", abs(float(self.level_db)))
        object.__setattr__(self, "sound_path", path)
        object.__setattr__(self, "width", width)

    @classmethod
    def from_half_angle(
        cls,
        level_db: float,
        half_angle: float,
        sound_path: float,
        *,
        start: float = 0.0,
        start_width: float = 0.0,
    ) -> BeamEdge:
        """Straight edges diverging at ``half_angle`` (rad) from ``start_width`` at ``start``.

        The far-field cone (common practice): ``width = start_width + 2 (s - start) tan(half)``.
        """
        if not 0.0 <= half_angle < math.pi / 2:
            raise InputError(
                f"beam edge: a half-angle of {math.degrees(half_angle):g} deg is not allowed"
            )
        grow = 2.0 * (sound_path - start) * math.tan(half_angle)
        return cls(level_db, (start, sound_path), (start_width, start_width + grow))


@dataclass(frozen=True)
class SectionGeometry:
    """An angle beam in a plate, for :func:`~beamspread.render.plots.plot_section`.

    Parameters
    ----------
    thickness : float
        Plate thickness, m.
    refracted : float
        Angle of the beam axis in the part from the surface normal, rad (0 to
        below 90 degrees), e.g. from :func:`beamspread.setups.refract`.
    exit_point : float
        Where the axis leaves the probe on the scanning surface, m along it.
    edges : tuple of BeamEdge
        The beam's level edges along the sound path (from the computed field,
        or :meth:`BeamEdge.from_half_angle` for the far-field cone).
    flaw_depth : float, optional
        Depth below the scanning surface at which to draw the footprint, m.
    legs : int
        1 (down to the back wall) or 2 (and back up after the bounce).
    wave : str
        Named in the title: "shear" or "longitudinal".
    water_path : float, optional
        Behind a water path, its length, m: noted, not drawn (the beam is
        drawn from where it enters the part).
    couplant : str
        The water path's couplant, named with it.
    plane : str
        The plane drawn, named in the title where it is not the only one.
    mirror : bool
        Draw leg 2 unfolded, in the plate's mirror image below the back wall,
        rather than folded back into the plate: for a straight beam, whose
        second leg would fold back onto its first.
    """

    thickness: float
    refracted: float
    exit_point: float = 0.0
    edges: tuple[BeamEdge, ...] = ()
    flaw_depth: float | None = None
    legs: int = 2
    wave: str = "shear"
    water_path: float | None = None
    couplant: str = ""
    plane: str = ""
    mirror: bool = False

    def __post_init__(self) -> None:
        from ...probes import check_positive

        object.__setattr__(self, "thickness", check_positive(self.thickness, "thickness", "m"))
        if not 0.0 <= self.refracted < math.radians(89.0):
            raise InputError(
                f"refracted angle {math.degrees(self.refracted):g} deg is not "
                "allowed for a section; give 0 to 89 degrees"
            )
        if self.legs not in (1, 2):
            raise InputError(f"legs: {self.legs!r} is not allowed; use 1 or 2")
        if self.flaw_depth is not None and not 0.0 < self.flaw_depth <= self.thickness:
            raise InputError(
                f"flaw depth {self.flaw_depth * 1e3:g} mm is not allowed; it must "
                f"lie in the plate (0 to {self.thickness * 1e3:g} mm)"
            )
        object.__setattr__(self, "edges", tuple(self.edges))

    @property
    def skip(self) -> float:
        """Surface distance of a full skip (two legs), m: ``2 t tan(refracted)``."""
        return 2.0 * self.thickness * math.tan(self.refracted)

    @property
    def path_length(self) -> float:
        """Unfolded sound path drawn, m: the legs to the back wall and back."""
        return self.legs * self.thickness / math.cos(self.refracted)

    def unfolded(self, sound_path, offset) -> tuple[np.ndarray, np.ndarray]:
        """Surface position and unfolded depth of points off the axis, m.

        ``offset`` is measured across the axis, positive toward the surface
        ahead of the beam (the far edge).
        """
        b = self.refracted
        s = np.asarray(sound_path, dtype=float)
        o = np.asarray(offset, dtype=float)
        x = self.exit_point + s * math.sin(b) + o * math.cos(b)
        return x, s * math.cos(b) - o * math.sin(b)

    def fold(self, y) -> np.ndarray:
        """Unfolded depth to depth in the plate: mirrored at the back wall (unchanged,
        in the plate's mirror image, with ``mirror``)."""
        y = np.asarray(y, dtype=float)
        t = self.thickness
        if self.mirror:
            return y
        return np.where(y > t, 2.0 * t - y, y)

    @property
    def drawn_depth(self) -> float:
        """How deep the drawing goes, m: the plate, and its mirror image with ``mirror``."""
        return self.legs * self.thickness if self.mirror else self.thickness


@dataclass(frozen=True)
class SectionFootprint:
    """Where a level's edges cross the flaw depth on one leg, m along the surface."""

    leg: int
    level_db: float
    near: float
    far: float
    sound_path: float  # m along the axis to the flaw depth on this leg
    surface_distance: float  # m from the exit point to the axis at the flaw depth

    @property
    def width(self) -> float:
        """The footprint along the flaw depth (horizontal), m."""
        return self.far - self.near


def _edge_polyline(
    geometry: SectionGeometry,
    edge: BeamEdge,
    side: float,
    samples: int = 400,
    *,
    to_surface: bool = False,
):
    """Unfolded (x, y) of one edge, sampled densely; NaN beyond the last leg drawn.

    The exact points where the edge meets the back wall (and, for two legs,
    returns to the surface) are added, so the fold has a sharp corner.

    With ``to_surface`` the edge starts on the scanning surface, as the beam
    in the part does: an edge whose first sample lies below the surface is
    continued back up to it at its first width (the third array returned,
    ``held``, is True there), and whatever lies above the surface (in the
    wedge) is NaN. Without it, only the given samples are used.
    """
    b = geometry.refracted
    first = edge.sound_path[0]
    start = first
    if to_surface:  # the held line meets the surface where s cos b - o sin b = 0
        start = min(first, side * 0.5 * edge.width[0] * math.tan(b))
    dense = np.linspace(start, edge.sound_path[-1], samples)
    s = np.unique(np.concatenate([dense, edge.sound_path]))  # its own samples: exact there

    def at(s):
        return geometry.unfolded(s, side * 0.5 * np.interp(s, edge.sound_path, edge.width))

    t = geometry.thickness
    walls = ((0.0,) if to_surface else ()) + (t, 2.0 * t)[: geometry.legs]
    for wall in walls:
        _, y = at(s)
        d = y - wall
        idx = np.flatnonzero((d[:-1] <= 0) != (d[1:] <= 0))
        if idx.size:
            hit = s[idx] + (s[idx + 1] - s[idx]) * d[idx] / (d[idx] - d[idx + 1])
            s = np.unique(np.concatenate([s, hit]))
    x, y = at(s)
    beyond = y > geometry.legs * t * (1.0 + 1e-12)
    if to_surface:
        beyond |= y < -1e-12 * t
    x, y = np.where(beyond, np.nan, x), np.where(beyond, np.nan, y)
    if to_surface:
        return x, y, s < first
    return x, y


def _cross_level(x: np.ndarray, y: np.ndarray, level: float) -> list[float]:
    d = y - level
    idx = np.flatnonzero((d[:-1] <= 0) != (d[1:] <= 0))
    return [float(x[i] + (x[i + 1] - x[i]) * d[i] / (d[i] - d[i + 1])) for i in idx]


def section_footprints(geometry: SectionGeometry) -> list[SectionFootprint]:
    """The footprint of each level at the flaw depth on each drawn leg (none without a depth).

    On leg 1 the flaw depth ``d`` is unfolded depth ``d``; on leg 2 it is
    ``2 t - d`` (:func:`beamspread.setups.leg_geometry`). A level whose
    edges do not both reach that depth gives no footprint.
    """
    from ...setups import leg_geometry

    if geometry.flaw_depth is None:
        return []
    out = []
    for leg in range(1, geometry.legs + 1):
        path, surface, unfolded = leg_geometry(
            geometry.flaw_depth, geometry.refracted, geometry.thickness, leg
        )
        for edge in geometry.edges:
            ends = []
            for side in (-1.0, 1.0):
                x, y = _edge_polyline(geometry, edge, side)
                hits = _cross_level(x, y, unfolded)
                ends.append(hits[0] if hits else None)
            if None in ends:
                continue
            a, b = ends  # folding keeps the surface position, so leg 2 reads the same way
            out.append(SectionFootprint(leg, edge.level_db, min(a, b), max(a, b), path, surface))
    return out


@dataclass(frozen=True)
class _Traced:
    """What the section shows, in metres: each edge's two sides (folded) and the x range."""

    edges: list  # [(edge, [(x, depth, held), (x, depth, held)])]
    footprints: list[SectionFootprint]
    left: float
    right: float


def _trace_section(g: SectionGeometry) -> _Traced:
    edges = []
    xs = [g.exit_point, *g.unfolded(np.linspace(0.0, g.path_length, g.legs + 1), 0.0)[0]]
    for edge in g.edges:
        sides = []
        for side in (-1.0, 1.0):
            x, y, held = _edge_polyline(g, edge, side, to_surface=True)
            sides.append((x, g.fold(y), held))
            if np.any(np.isfinite(x)):
                xs += [float(np.nanmin(x)), float(np.nanmax(x))]
        edges.append((edge, sides))
    prints = section_footprints(g)
    xs += [v for fp in prints for v in (fp.near, fp.far)]
    low, high = min(xs), max(xs)
    margin = 0.03 * (high - low) + 0.1 * g.thickness
    low, high = low - margin, high + margin
    if g.mirror:  # a straight beam: symmetric about its axis, and not a sliver
        half = max(high - g.exit_point, g.exit_point - low, 0.3 * g.drawn_depth)
        low, high = g.exit_point - half, g.exit_point + half
    return _Traced(edges, prints, low, high)


def section_of(result, thickness: float, depth: float | None = None, *, plane=None):
    """The :class:`SectionGeometry` of a computed technique (:func:`beamspread.compute`).

    The beam axis (refracted under a wedge, straight down otherwise), each
    level's edges over both legs (:func:`beamspread.edges.beam_edges`, in
    ``plane``: default the first, a rectangle's length plane, a wedge's
    incidence plane), and the flaw ``depth``. The edges are sampled at the
    flaw's sound paths on both legs and, under a wedge, at the sound paths
    where the result's footprints found the edges crossing the depth, so the
    drawn footprints are those of the table. Behind a water path the beam is
    drawn from where it enters the part, and the water path is noted.
    """
    from ...edges import beam_edges, plane_of

    source = result.source
    beta = source.refracted
    name = plane_of(result, plane).name
    at = []
    if depth is not None:
        at = [depth / math.cos(beta), (2 * thickness - depth) / math.cos(beta)]
    if source.coordinate == "sound path":  # past the second leg's return to the surface
        length = 2 * thickness / math.cos(beta) * 1.4
        footprints = result.setup.footprints
        at += [
            s
            for p in footprints
            if p.depth == depth
            for s in (p.near_path, p.far_path)
            if s is not None
        ]
    else:
        length = 2 * thickness * 1.05
    edges = tuple(
        BeamEdge(level, paths, widths)
        for level, (paths, widths) in beam_edges(result, length, plane=name, at=at).items()
    )
    couplant = result.couplant
    water = None if couplant is None or couplant.path == 0 else couplant
    return SectionGeometry(
        thickness,
        beta,
        0.0,
        edges,
        depth,
        2,
        result.beam.wave.wave,
        water_path=None if water is None else water.path,
        couplant="" if water is None else water.wave.medium,
        plane=name if len(result.beam.planes) > 1 else "",
        mirror=beta == 0.0,
    )
