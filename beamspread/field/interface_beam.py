"""Widths and the on-axis maximum of the beam through an interface, from its computed field.

The field is :func:`beamspread.field.interface.crossing_amplitude` (the
Rayleigh integral over the element, each contribution along its Fermat ray).
Positions are given by the sound path ``s`` along the refracted axis from the
exit point (the origin), whose direction in the incidence plane is
:math:`(\\sin\\beta, 0, \\cos\\beta)`, :math:`\\beta` the refracted angle.

* **Incidence plane.** Across the axis at ``s`` along
  :math:`(\\cos\\beta, 0, -\\sin\\beta)`: offsets above zero lie on the side
  away from the normal (the larger angles, toward the surface), below zero on
  the side toward the normal. The level is taken from the largest amplitude on
  that line (the lobe's peak, which the astigmatic refraction and the
  angle-dependent transmission move off the axis), and each side's edge is the
  outermost crossing of that level: the two half-widths differ. The tilt is the
  angle, seen from the exit point, from the refracted axis to the midpoint of
  the two edges (positive away from the normal).
* **Transverse plane.** Across the axis at ``s`` along :math:`y`; the field is
  even in :math:`y` (the incidence plane is a plane of symmetry), so one
  half-width.

Every line is first sampled (``_SAMPLES`` offsets a side, the reach doubled
until the field at the ends lies below the level), all lines in one call; a
second call samples ``_FINE`` offsets round each line's largest sample, whose
peak is refined by the parabola through the best three. Each edge is bracketed
between the outermost sample at or above the level and the next one out (moved
a sample at a time if a point's own evaluation disagrees with the scan's), then
found by Brent's method (``scipy.optimize.brentq``) on the level in dB to
``_XTOL`` m. The on-axis maximum is the last local maximum of the amplitude
along the refracted axis (the near field in the part), refined by a bounded
scalar search. Levels are dB down, positive; amplitudes continuous wave or
broadband, one-way or pulse-echo, as :func:`crossing_amplitude`.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ..errors import InputError
from ..probes import check_positive
from .interface import Crossing, crossing_amplitude

__all__ = ["CrossingMaximum", "CrossingWidth", "crossing_axis_maximum", "crossing_widths"]

_SAMPLES = 32  # offsets per side on the first scan
_FINE = 17  # samples of the second scan round each peak
_XTOL = 1e-7  # m, the edges' tolerance
_WIDEN = 6  # times the reach may double before giving up


@dataclass(frozen=True)
class CrossingWidth:
    """The beam's -``level`` dB edges at sound path ``path`` (m, rad).

    ``toward_normal`` and ``away_from_normal`` are the half-widths in the
    incidence plane measured from the refracted axis; ``tilt`` is the angle of
    their midpoint from the axis seen from the exit point (positive away from the
    normal); ``peak_offset`` is where the largest amplitude on that line lies;
    ``transverse`` is the half-width across the incidence plane; ``reference``
    and ``transverse_reference`` the largest amplitudes on each line.
    """

    path: float
    level: float
    toward_normal: float
    away_from_normal: float
    tilt: float
    peak_offset: float
    reference: float
    transverse: float
    transverse_reference: float

    @property
    def incidence_width(self) -> float:
        """The full width in the incidence plane, m."""
        return self.toward_normal + self.away_from_normal


@dataclass(frozen=True)
class CrossingMaximum:
    """The last on-axis maximum: sound path (m) and amplitude."""

    path: float
    amplitude: float


def _frame(crossing: Crossing) -> tuple[np.ndarray, np.ndarray]:
    beta = crossing.refracted
    if not math.isfinite(beta):
        raise InputError(
            f"incidence: {math.degrees(crossing.incidence):g} deg is past the critical angle; "
            "no refracted beam to measure"
        )
    return np.array([math.sin(beta), 0.0, math.cos(beta)]), np.array(
        [math.cos(beta), 0.0, -math.sin(beta)]
    )


def _parabola_top(offsets: np.ndarray, values: np.ndarray) -> tuple[float, float]:
    """The largest sample, refined by the parabola through it and its neighbours."""
    i = int(np.argmax(values))
    if i == 0 or i == values.size - 1:
        return float(offsets[i]), float(values[i])
    h = offsets[i + 1] - offsets[i]
    y0, y1, y2 = values[i - 1], values[i], values[i + 1]
    curve = y0 - 2.0 * y1 + y2
    if curve >= 0.0:
        return float(offsets[i]), float(y1)
    t = 0.5 * (y0 - y2) / curve
    return float(offsets[i] + t * h), float(y1 - 0.25 * (y0 - y2) * t)


def _outermost(level, offsets: np.ndarray, values: np.ndarray) -> float:
    """The outermost root of ``level`` (dB over the floor) along ``offsets`` (ordered outward).

    ``values`` are the scan's samples over the floor's amplitude; the bracket is
    the outermost sample at or above it and the next one out. A point's own
    evaluation may differ from the scan's by the quadrature's error (its nodes
    follow its own block), so the bracket's ends are checked and moved one
    sample at a time until they hold a sign change.
    """
    from scipy.optimize import brentq

    above = np.flatnonzero(values >= values[0])
    j = int(above.max()) if above.size else 0
    if j + 1 >= offsets.size:
        return math.nan
    lo, hi = j, j + 1
    f_lo, f_hi = level(offsets[lo]), level(offsets[hi])
    while f_hi >= 0.0 and hi + 1 < offsets.size:  # still above the level: move out
        lo, f_lo = hi, f_hi
        hi += 1
        f_hi = level(offsets[hi])
    while f_lo < 0.0 and lo > 0:  # already below: move in
        hi, f_hi = lo, f_lo
        lo -= 1
        f_lo = level(offsets[lo])
    if f_lo < 0.0 or f_hi >= 0.0:
        return math.nan
    return float(brentq(level, offsets[lo], offsets[hi], xtol=_XTOL))


class _Lines:
    """Points along straight lines through the part, evaluated together."""

    def __init__(self, crossing: Crossing, options: dict):
        self.crossing = crossing
        self.options = options

    def sample(self, lines) -> list[np.ndarray]:
        """Amplitudes at offsets along each (centre, direction, offsets) line, in one call."""
        pts = np.vstack([c + o[:, None] * d for c, d, o in lines])
        values = crossing_amplitude(self.crossing, pts, **self.options)
        cuts = np.cumsum([o.size for _, _, o in lines])[:-1]
        return np.split(values, cuts)

    def level(self, centre, direction, floor):
        """The level in dB relative to ``floor`` at an offset, for Brent's method."""

        def f(o: float) -> float:
            point = (centre + o * direction)[None, :]
            a = float(crossing_amplitude(self.crossing, point, **self.options)[0])
            return 20.0 * math.log10(max(a, 1e-300) / floor)

        return f


def crossing_widths(
    crossing: Crossing,
    paths,
    level_db: float = 6.0,
    *,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
    reach: float | None = None,
) -> list[CrossingWidth]:
    """The -``level_db`` dB edges in both planes at each sound path along the refracted axis.

    Parameters
    ----------
    crossing : Crossing
    paths : array_like
        Sound paths along the refracted axis from the exit point, m (> 0).
    level_db : float
        dB below the largest amplitude on each line (the sign is ignored).
    reach : float, optional
        Half-length of the first scan across the axis, m; by default the
        element's longest side plus the path times 0.27 (15 deg), doubled while
        the field at an end is above the level.

    Returns
    -------
    list of CrossingWidth, one per path

    Raises
    ------
    InputError
        A path not above 0, a level not above 0, or no refracted beam.
    """
    axis, across = _frame(crossing)
    level = abs(float(level_db))
    if not level > 0.0:
        raise InputError(f"level: {level_db!r} dB is not allowed; it must be above 0 dB down")
    paths = [check_positive(p, "path", "m") for p in np.atleast_1d(paths)]
    options = {
        "bandwidth": bandwidth,
        "mode": mode,
        "frequencies": frequencies,
        "spectrum": spectrum,
    }
    lines = _Lines(crossing, options)
    ratio = 10.0 ** (-level / 20.0)
    side = np.array([0.0, 1.0, 0.0])
    beta = crossing.refracted
    # Offsets away from the normal raise the point toward the surface: stay in the part.
    limits = [s / math.tan(beta) * (1.0 - 1e-6) if beta > 0.0 else math.inf for s in paths]
    halves = [
        reach if reach is not None else crossing.element.longest_side + 0.27 * s for s in paths
    ]
    scans: list = [None] * len(paths)
    todo = list(range(len(paths)))
    for _ in range(_WIDEN):
        asked = []
        for i in todo:
            hi = min(halves[i], limits[i])
            asked.append((paths[i] * axis, across, np.linspace(-halves[i], hi, 2 * _SAMPLES + 1)))
            asked.append((paths[i] * axis, side, np.linspace(0.0, halves[i], _SAMPLES + 1)))
        got = lines.sample(asked)
        again = []
        for n, i in enumerate(todo):
            o_in, v_in, o_tr, v_tr = (
                asked[2 * n][2],
                got[2 * n],
                asked[2 * n + 1][2],
                got[2 * n + 1],
            )
            scans[i] = (o_in, v_in, o_tr, v_tr)
            end = max(v_in[0], v_in[-1] if o_in[-1] < limits[i] else 0.0)
            if end >= ratio * v_in.max() or v_tr[-1] >= ratio * v_tr.max():
                halves[i] *= 2.0
                again.append(i)
        todo = again
        if not todo:
            break
    # Second scan, all lines at once: finer samples round each peak and inside each bracket.
    fine, what = [], []
    for i, (o_in, v_in, o_tr, v_tr) in enumerate(scans):
        centre = paths[i] * axis
        for direction, o, v in ((across, o_in, v_in), (side, o_tr, v_tr)):
            j = int(np.argmax(v))
            lo, hi = o[max(j - 1, 0)], o[min(j + 1, o.size - 1)]
            fine.append((centre, direction, np.linspace(lo, hi, _FINE)))
            what.append((i, direction is across))
    tops = {}
    for (i, incidence), (_, _, o), v in zip(what, fine, lines.sample(fine), strict=True):
        v_c = scans[i][1] if incidence else scans[i][3]
        peak, top = _parabola_top(o, v)
        tops[i, incidence] = (peak, max(top, float(v_c.max())))
    out = []
    for i, s in enumerate(paths):
        o_in, v_in, o_tr, v_tr = scans[i]
        centre = s * axis
        peak, top = tops[i, True]
        _, top_tr = tops[i, False]
        edges = []
        for direction, o, v, floor, start in (
            (across, o_in[o_in >= peak], v_in[o_in >= peak], ratio * top, peak),
            (across, o_in[o_in <= peak][::-1], v_in[o_in <= peak][::-1], ratio * top, peak),
            (side, o_tr, v_tr, ratio * top_tr, 0.0),
        ):
            f = lines.level(centre, direction, floor)
            edges.append(_outermost(f, np.r_[start, o[o != start]], np.r_[floor, v[o != start]]))
        away, toward, transverse = edges
        middle = 0.5 * (away + toward)
        out.append(
            CrossingWidth(
                path=s,
                level=level,
                toward_normal=-toward,
                away_from_normal=away,
                tilt=math.atan2(middle, s),
                peak_offset=peak,
                reference=top,
                transverse=transverse,
                transverse_reference=top_tr,
            )
        )
    return out


def crossing_axis_maximum(
    crossing: Crossing,
    up_to: float,
    *,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
    samples: int = 256,
) -> CrossingMaximum:
    """The last local maximum of the amplitude along the refracted axis, up to ``up_to`` m.

    The axis is sampled at ``samples`` paths from ``up_to / samples`` to
    ``up_to``; the last sample larger than both its neighbours is refined by a
    bounded scalar search to 1e-8 m. Returns NaNs where the samples hold no
    maximum (the amplitude only falls, or still rises at ``up_to``).
    """
    from scipy.optimize import minimize_scalar

    axis, _ = _frame(crossing)
    up_to = check_positive(up_to, "up_to", "m")
    options = {
        "bandwidth": bandwidth,
        "mode": mode,
        "frequencies": frequencies,
        "spectrum": spectrum,
    }
    s = np.linspace(up_to / samples, up_to, samples)
    values = crossing_amplitude(crossing, s[:, None] * axis, **options)
    peaks = np.flatnonzero((values[1:-1] > values[:-2]) & (values[1:-1] >= values[2:])) + 1
    if not peaks.size:
        return CrossingMaximum(math.nan, math.nan)
    i = int(peaks.max())
    best = minimize_scalar(
        lambda p: -float(crossing_amplitude(crossing, (p * axis)[None, :], **options)[0]),
        bounds=(s[i - 1], s[i + 1]),
        method="bounded",
        options={"xatol": _XTOL},
    )
    if -best.fun >= values[i]:
        return CrossingMaximum(float(best.x), float(-best.fun))
    return CrossingMaximum(float(s[i]), float(values[i]))
