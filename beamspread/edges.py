"""The beam's edges along its path in the part, from a computed technique.

A :class:`beamspread.pipeline.Result` is plain data; what is worked out from
it for a drawing or a plate's section is worked out here, by functions:

* :func:`far_field_widths`: the far-field cone's full widths at coordinates
  (depths, or sound paths under a wedge) in one plane, per level;
* :func:`computed_widths`: the computed field's full widths there, read
  through the result's field source (:class:`beamspread.source.FieldSource`),
  so they are ``beam``'s computed widths;
* :func:`beam_edges`: both, sampled along the beam for a picture;
* :func:`straight_footprints`: a straight beam's footprints at each depth
  asked for in a plate, on the way down (leg 1) and back up after the back
  wall (leg 2, the unfolded path ``2 t - d``).

The far-field cone starts at the element as the part sees it: in contact the
element itself (``2 z tan(theta)``); behind a wedge the virtual element set
back by the wedge path's equivalent (``2 (s + offset) tan(theta)``); behind a
water path the element in the couplant, whose edges leave it at the half-angle
in the couplant and refract at the surface (``2 (WP tan(theta_couplant) + d
tan(theta_part))``, Snell's law). Each is the formula of the ``beam`` command's
far-field rows (common practice). A focused element has no far-field width.
"""

from __future__ import annotations

import math

import numpy as np

from .conventions import level_key
from .errors import InputError
from .source import source_widths

__all__ = [
    "beam_edges",
    "computed_widths",
    "far_field_widths",
    "plane_of",
    "straight_footprints",
]

_SHORTEST = 1e-4  # m: computed edges are sampled no nearer the surface than this


def plane_of(result, plane: str | None = None):
    """The result's :class:`beamspread.beam.PlaneResult` named ``plane`` (default: the first).

    The first plane is a disc's only one, a rectangle's length plane, and
    under a wedge the incidence plane.
    """
    planes = result.beam.planes
    if plane is None:
        return planes[0]
    for p in planes:
        if p.name == plane:
            return p
    names = ", ".join(p.name for p in planes)
    raise InputError(f"plane {plane!r} is not one of this beam's: {names}", remedy=("plane", None))


def far_field_widths(result, coordinates, plane: str | None = None) -> dict[float, np.ndarray]:
    """The far-field cone's full widths at ``coordinates`` (m), per level in dB down.

    The coordinates are the result's own: depths below the surface, or sound
    paths from the exit point under a wedge. NaN where the level has no
    half-angle (in the part). See the module notes for the formulas.

    Raises
    ------
    InputError
        A focused element: its beam converges, the flat element's cone does not.
    """
    source, beam = result.source, result.beam
    if source.focus is not None:
        raise InputError(
            "a focused element has no far-field width: the flat element's cone does not "
            "converge; its widths come from the computed field"
        )
    half = plane_of(result, plane).half_angles
    c = np.asarray(coordinates, dtype=float)
    out = {}
    for level in beam.levels:
        angle = half[level_key(level)]
        if angle is None:
            out[level] = np.full(c.shape, math.nan)
            continue
        theta = math.radians(angle)
        # the edge in the medium the element radiates into (Snell's law at the surface)
        before = math.asin(math.sin(theta) / source.stretch)
        out[level] = 2.0 * (source.start * math.tan(before) + c * math.tan(theta))
    return out


def computed_widths(result, coordinates, plane: str | None = None) -> dict[float, np.ndarray]:
    """The computed field's full widths at ``coordinates`` (m), per level in dB down.

    Read through the result's field source, exactly as ``beam`` computes its
    widths (NaN where a level is not reached, or where a focused element's
    paraxial field does not hold).
    """
    if result.settings is None:
        raise InputError("the computed widths need the computed field: it was not asked for")
    name = plane_of(result, plane).name
    levels = result.beam.levels
    table = {level: [] for level in levels}
    for c in np.atleast_1d(np.asarray(coordinates, dtype=float)):
        found = source_widths(result.source, float(c), levels, name, result.mode, result.settings)
        for level, w in zip(levels, found, strict=True):
            table[level].append(w.width)
    return {level: np.asarray(v, dtype=float) for level, v in table.items()}


def beam_edges(
    result, length: float, *, plane: str | None = None, samples: int = 24, at=()
) -> dict[float, tuple[tuple[float, ...], tuple[float, ...]]]:
    """The beam's full width along its axis, per level: ``{level: (coordinates, widths)}``, m.

    From the computed field when the result has one (sampled from a little
    way into the part, 5 % of the near field, to ``length``, half the samples
    within 1.5 near fields; a focused element from one element size from its
    face, where its paraxial field starts to hold), else the far-field cone
    from the surface (which, like the far-field rows, does not hold inside
    the near field). The
    coordinates in ``at`` (m) are sampled too, so a width read there is
    computed, not interpolated. A level is left out where its widths are not
    found along one unbroken stretch of at least two samples.
    """
    end = float(length)
    if not (math.isfinite(end) and end > 0):
        raise InputError(f"length: {length!r} m is not allowed; give a length above 0")
    if result.settings is None:
        paths = np.linspace(0.0, end, samples)
        widths = far_field_widths(result, paths, plane)
        return {
            level: (tuple(paths), tuple(w)) for level, w in widths.items() if np.all(np.isfinite(w))
        }
    beam, source = result.beam, result.source
    first = max(0.05 * (beam.near_field or beam.near_field_simple or end), _SHORTEST)
    if source.focus is not None:  # the paraxial field holds from one element size out
        first = max(first, (1.001 * source.element.longest_side - source.start) / source.stretch)
    extra = [float(s) for s in at if first <= s < end]
    # half the samples within 1.5 near fields, where the width changes most
    near = min(end, 1.5 * (beam.near_field or beam.near_field_simple or end))
    close = np.linspace(first, near, samples // 2) if near > first else []
    spread = np.linspace(first, end, samples - len(close))
    paths = np.unique(np.concatenate([close, spread, extra]))
    out = {}
    for level, w in computed_widths(result, paths, plane).items():
        ok = np.flatnonzero(np.isfinite(w))
        if ok.size >= 2 and ok[-1] - ok[0] + 1 == ok.size:
            keep = slice(ok[0], ok[-1] + 1)
            out[level] = (tuple(paths[keep]), tuple(w[keep]))
    return out


def straight_footprints(result, thickness: float, plane: str | None = None) -> tuple:
    """A straight beam's footprints in a plate at each depth the result was asked for.

    On leg 1 the beam meets the depth ``d`` at the sound path ``d``, and the
    footprint is the result's own width there (its far-field or computed
    row, whichever the result holds: computed where it has the field); on
    leg 2, back up after the back wall, at the unfolded sound path
    ``2 t - d``, the width there by the same rule (geometry: the back wall
    mirrors the beam). The edges lie half the width either side of the
    axis, so ``near`` and ``far`` are -w/2 and +w/2 from it.

    Returns
    -------
    tuple of :class:`beamspread.coupling.result.WedgeFootprint`
        Per depth, leg and level; ``near``/``far`` None where the width is.

    Raises
    ------
    InputError
        A beam that is not straight (under a wedge), a thickness not above 0,
        or a depth below the part.
    """
    from .coupling.result import WedgeFootprint
    from .probes import check_positive
    from .units import length_text

    if result.source.coordinate != "depth" or result.source.refracted != 0.0:
        raise InputError("straight footprints are for a beam at normal incidence, not a wedge's")
    t = check_positive(thickness, "thickness", "m")
    chosen = plane_of(result, plane)
    method = "far-field" if result.settings is None else "field"
    depths = result.beam.depths
    for d in depths:
        if d > t:
            raise InputError(
                f"depth {length_text(d)} lies below the part, which is {length_text(t)} thick"
            )
    mirrored = [2.0 * t - d for d in depths]
    if method == "field":
        second = computed_widths(result, mirrored, chosen.name)
    else:
        second = far_field_widths(result, mirrored, chosen.name)
    out = []
    for i, d in enumerate(depths):
        first = {
            abs(s.level_db): s.width
            for s in chosen.spots
            if s.depth == d and s.method == method and s.leg == 1
        }
        for leg, path in ((1, d), (2, mirrored[i])):
            for level in result.beam.levels:
                w = first.get(level) if leg == 1 else float(second[level][i])
                half = None if w is None or not math.isfinite(w) else 0.5 * w
                near, far = (None, None) if half is None else (-half, half)
                out.append(WedgeFootprint(d, leg, -level, method, path, 0.0, near, far, path, path))
    return tuple(out)
