"""Where a computed level edge of the beam under a wedge crosses a depth.

The computed field gives the beam's full width at any sound path but not in
closed form, so the ends of a computed footprint are found by root finding
(:func:`_edge_crossing`), within the sound paths set here, on the widths of
:class:`_ComputedWidths`.
"""

from __future__ import annotations

import math

_SHORTEST_PATH = 1e-4  # m: computed edges are sought no nearer the exit point than this
_LONGEST_PATH = 5.0  # m: nor farther (an edge that meets a depth only beyond never does)
_CROSSING_TOLERANCE = 1e-7  # m: an edge crossing is found to this depth


def _edge_crossing(
    width_at, unfolded: float, beta: float, side: float, s0: float, w0: float, slope: float
):
    """The sound path where one computed level edge crosses an unfolded depth.

    ``width_at(s)`` is the beam's full width (m; NaN where the level is not
    reached) at sound path ``s``; the edge's point at ``s`` lies ``side * w/2``
    across the axis (``side`` +1 ahead of the axis, toward the surface, -1
    behind), at the unfolded depth ``s cos(beta) - side (w/2) sin(beta)``.
    From the axis point ``s0`` (width ``w0``) the first guess takes the width
    as growing at ``slope`` (the far-field cone's), then secant steps search
    outward until the crossing is bracketed and regula falsi (the Illinois
    variant) closes on it to :data:`_CROSSING_TOLERANCE` in depth.

    Returns ``(s, w)`` at the crossing, or None where the edge does not reach
    the depth between :data:`_SHORTEST_PATH` and :data:`_LONGEST_PATH`.
    """
    c, n = math.cos(beta), math.sin(beta)

    def depth_error(s, w):
        return s * c - side * 0.5 * w * n - unfolded

    def clamp(s):
        return min(max(s, _SHORTEST_PATH), _LONGEST_PATH)

    a, ga = s0, depth_error(s0, w0)
    if abs(ga) <= _CROSSING_TOLERANCE:
        return s0, w0
    den = c - side * 0.5 * slope * n
    guess = (unfolded + side * 0.5 * (w0 - slope * s0) * n) / den if den > 0 else math.nan
    if not (math.isfinite(guess) and (guess - s0) * side > 0):
        guess = s0 + side * abs(ga) / c  # the width held constant
    b = clamp(guess)
    bracket = None  # (p, gp, q, gq): depth errors of opposite signs, q the latest point
    for _ in range(60):
        wb = width_at(b)
        if not math.isfinite(wb):
            return None
        gb = depth_error(b, wb)
        if abs(gb) <= _CROSSING_TOLERANCE:
            return b, wb
        if bracket is not None:
            p, gp, q, gq = bracket
            if gb * gq < 0:
                p, gp = q, gq
            else:
                gp *= 0.5  # Illinois: the stale end's weight halved
            bracket = (p, gp, b, gb)
        elif gb * ga < 0:
            bracket = (a, ga, b, gb)
        else:  # not bracketed yet: a secant step outward, or a longer stride
            ahead = math.nan if gb == ga else b - gb * (b - a) / (gb - ga)
            if not math.isfinite(ahead) or (ahead - b) * side <= 0:
                ahead = b + side * 2.0 * abs(b - s0)
            nxt = clamp(ahead)
            if nxt == b:
                return None  # at the end of the search and still short of the depth
            a, ga, b = b, gb, nxt
            continue
        p, gp, q, gq = bracket
        if abs(q - p) <= _CROSSING_TOLERANCE:
            return b, wb
        b = (p * gq - q * gp) / (gq - gp)
    return None


class _ComputedWidths:
    """The computed field's full widths per level at sound paths from the exit point.

    The virtual element's field at ``s + offset`` (see :mod:`beamspread.coupling.wedge`),
    kept while one analysis runs, so the footprints' root finding reuses the
    widths at the depths asked for.
    """

    def __init__(self, virtual, speed, offset, levels, mode, field):
        self.virtual, self.speed, self.offset = virtual, speed, offset
        self.levels, self.mode, self.field = levels, mode, field
        self.cache: dict = {}

    def __call__(self, plane: str, path: float) -> dict[float, float]:
        from ..field import beam_widths

        key = (plane, float(path))
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
