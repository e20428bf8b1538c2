"""Scan planning: the largest index step that keeps neighbouring passes overlapping.

A probe moved in parallel passes covers a band as wide as its beam; for the
passes to overlap by a fraction ``overlap`` of that band everywhere in the
depth range to be covered, the index step (the distance between passes) must
be at most

.. math:: \\Delta = w_{min} (1 - f),

with :math:`w_{min}` the narrowest beam width (at the chosen level, in the
plane across the passes) over the depths and :math:`f` the overlap fraction
(common practice; codes and procedures commonly ask for 10 % to 25 %). The
depth where the beam is narrowest governs.

Nothing here prints or reads files; lengths are in m, the overlap a fraction.
"""

from __future__ import annotations

import math
import re
from collections.abc import Mapping
from dataclasses import dataclass

import numpy as np

from .errors import InputError
from .probes import check_positive

__all__ = [
    "RULE",
    "ScanPlan",
    "check_overlap",
    "far_field_widths",
    "field_widths",
    "parse_overlap",
    "plan_scan",
    "plan_scan_for",
    "scan_depths",
]

RULE = "index step = narrowest beam width over the depths x (1 - overlap) (common practice)"

MAX_DEPTHS = 2000


@dataclass(frozen=True)
class ScanPlan:
    """The index step for a depth range, and the depth and width that set it.

    ``depths`` and ``widths`` are the samples considered (m), in depth order;
    ``level_db`` (positive, dB down) and ``plane`` say which width was used,
    where known; ``method`` is ``"field"``, ``"far-field"`` or ``"given"``.
    """

    index_step: float
    governing_depth: float
    governing_width: float
    overlap: float
    depths: tuple[float, ...]
    widths: tuple[float, ...]
    level_db: float | None = None
    plane: str | None = None
    method: str = "given"
    rule: str = RULE


def check_overlap(overlap) -> float:
    """The overlap as a float fraction in [0, 1), or an InputError naming the value."""
    if isinstance(overlap, bool):
        raise InputError(f"overlap: {overlap!r} is not a fraction")
    try:
        value = float(overlap)
    except (TypeError, ValueError):
        raise InputError(f"overlap: {overlap!r} is not a number") from None
    if not math.isfinite(value) or not 0.0 <= value < 1.0:
        raise InputError(
            f"overlap: {overlap!r} is not allowed; give a fraction from 0 up to "
            "(not including) 1, e.g. 0.1 or '10%'"
        )
    return value


_PERCENT = re.compile(r"^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(%?)\s*$")


def parse_overlap(value) -> float:
    """An overlap as a fraction: ``"10%"`` and ``0.1`` both give 0.1.

    A number without ``%`` is a fraction; with ``%``, a percentage.

    >>> parse_overlap("25 %"), parse_overlap("0.1")
    (0.25, 0.1)
    """
    if isinstance(value, str):
        m = _PERCENT.match(value)
        if not m:
            raise InputError(
                f"overlap: {value!r} is not a fraction or a percentage (e.g. 0.1 or 10%)"
            )
        number = float(m.group(1))
        return check_overlap(number / 100.0 if m.group(2) else number)
    return check_overlap(value)


def plan_scan(
    widths_by_depth: Mapping[float, float | None],
    overlap,
    *,
    level_db: float | None = None,
    plane: str | None = None,
    method: str = "given",
) -> ScanPlan:
    """The largest index step keeping ``overlap`` between passes over the depths given.

    Parameters
    ----------
    widths_by_depth : mapping
        Depth (m, above 0) -> full beam width there (m, above 0), across the passes.
    overlap : float
        Fraction of the beam width neighbouring passes share, 0 <= overlap < 1.

    Raises
    ------
    InputError
        No depths; a depth or width that is not a finite number above 0 (a
        width the level never reaches, None or NaN, is named with its depth);
        an overlap outside [0, 1).

    Examples
    --------
    >>> plan = plan_scan({0.02: 0.006, 0.04: 0.005, 0.06: 0.007}, 0.25)
    >>> round(plan.index_step * 1e3, 6), plan.governing_depth
    (3.75, 0.04)
    """
    f = check_overlap(overlap)
    if not widths_by_depth:
        raise InputError("scan plan: give at least one depth with its beam width")
    pairs = []
    for depth, width in widths_by_depth.items():
        d = check_positive(depth, "scan depth", "m")
        if width is None or (isinstance(width, float) and math.isnan(width)):
            raise InputError(
                f"scan plan: no beam width at depth {d * 1e3:g} mm (the level is "
                "not reached there); choose other depths or another level"
            )
        pairs.append((d, check_positive(width, f"beam width at depth {d * 1e3:g} mm", "m")))
    pairs.sort()
    depth, width = min(pairs, key=lambda p: (p[1], p[0]))
    return ScanPlan(
        index_step=width * (1.0 - f),
        governing_depth=depth,
        governing_width=width,
        overlap=f,
        depths=tuple(p[0] for p in pairs),
        widths=tuple(p[1] for p in pairs),
        level_db=None if level_db is None else abs(float(level_db)),
        plane=plane,
        method=method,
    )


def scan_depths(start: float, stop: float, count: int) -> np.ndarray:
    """``count`` evenly spaced depths from ``start`` to ``stop`` inclusive, m."""
    start = check_positive(start, "first depth", "m")
    stop = check_positive(stop, "last depth", "m")
    if stop < start:
        raise InputError(
            f"depth range: the last depth {stop * 1e3:g} mm lies before the first "
            f"{start * 1e3:g} mm"
        )
    if (
        isinstance(count, bool)
        or not isinstance(count, (int, np.integer))
        or not (1 <= count <= MAX_DEPTHS)
    ):
        raise InputError(
            f"depths: {count!r} is not allowed; give a whole number from 1 to {MAX_DEPTHS}"
        )
    if count == 1 or stop == start:
        return np.array([start] * (1 if stop == start else count))
    return np.linspace(start, stop, int(count))


def _plane(probe, plane):
    names = [name for name, _ in probe.planes]
    if plane is None:
        return names[0]
    if plane not in names:
        raise InputError(
            f"plane: {plane!r} is not a plane of this probe; use one of {', '.join(names)}"
        )
    return plane


def field_widths(
    probe,
    speed: float,
    start: float,
    stop: float,
    *,
    count: int = 16,
    level_db: float = 6.0,
    plane: str | None = None,
    refine: bool = True,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> dict[float, float]:
    """Beam widths of the computed field over a depth range, m, by depth (m).

    ``count`` depths from ``start`` to ``stop`` (:func:`scan_depths`), each
    width from :func:`beamspread.field.beam_widths` (NaN where the level is
    not reached). With ``refine``, the narrowest sample is refined by a
    golden-section search between its neighbours, and that depth added, so
    that the governing width does not depend on the sampling.
    """
    from ._search import golden_max
    from .field import beam_widths

    plane = _plane(probe, plane)
    kwargs = {
        "plane": plane,
        "bandwidth": bandwidth,
        "mode": mode,
        "frequencies": frequencies,
        "spectrum": spectrum,
    }

    def width(depth: float) -> float:
        return float(beam_widths(probe, speed, depth, [level_db], **kwargs)[0].width)

    depths = scan_depths(start, stop, count)
    out = {float(d): width(float(d)) for d in dict.fromkeys(depths.tolist())}
    found = {d: w for d, w in out.items() if math.isfinite(w)}
    if refine and len(found) == len(out) and len(out) >= 3:
        keys = list(out)
        i = min(range(len(keys)), key=lambda k: out[keys[k]])
        lo, hi = keys[max(0, i - 1)], keys[min(len(keys) - 1, i + 1)]
        best = golden_max(lambda z: -width(z), lo, hi, 1e-6 * hi)
        w = width(best)
        if math.isfinite(w) and w < out[keys[i]]:
            out[best] = w
        out = dict(sorted(out.items()))
    return out


def far_field_widths(
    probe,
    speed: float,
    start: float,
    stop: float,
    *,
    count: int = 16,
    level_db: float = 6.0,
    plane: str | None = None,
    mode: str = "pulse-echo",
) -> dict[float, float]:
    """Far-field widths ``2 z tan(theta)`` over a depth range, m, by depth (m).

    The far-field cone widens with depth, so the first depth governs; it
    does not hold in the near field (use :func:`field_widths` there). NaN
    where the pattern has no half-angle at the level.
    """
    from .pattern import half_angle

    plane = _plane(probe, plane)
    aperture = dict(probe.planes)[plane]
    shape = "disc" if probe.shape == "disc" else "side"
    speed = check_positive(speed, "speed", "m/s")
    theta = float(half_angle(level_db, aperture, speed / probe.frequency, shape, mode))
    depths = scan_depths(start, stop, count)
    return {float(d): 2.0 * float(d) * math.tan(theta) for d in dict.fromkeys(depths.tolist())}


def plan_scan_for(
    probe,
    speed: float,
    start: float,
    stop: float,
    overlap,
    *,
    count: int = 16,
    level_db: float = 6.0,
    plane: str | None = None,
    method: str = "field",
    mode: str = "pulse-echo",
    **field,
) -> ScanPlan:
    """:func:`plan_scan` over widths from :func:`field_widths` or :func:`far_field_widths`.

    ``method`` is ``"field"`` (the computed field, near field included; extra
    keywords go to :func:`field_widths`) or ``"far-field"``.
    """
    check_overlap(overlap)
    plane = _plane(probe, plane)
    if method == "field":
        widths = field_widths(
            probe,
            speed,
            start,
            stop,
            count=count,
            level_db=level_db,
            plane=plane,
            mode=mode,
            **field,
        )
    elif method == "far-field":
        widths = far_field_widths(
            probe, speed, start, stop, count=count, level_db=level_db, plane=plane, mode=mode
        )
    else:
        raise InputError(f"method: {method!r} is unknown; use field or far-field")
    return plan_scan(widths, overlap, level_db=level_db, plane=plane, method=method)
