"""Beam widths over a range of depths: from the computed field or the far-field cone.

:func:`depth_widths` samples a depth range and says which widths it gives
(:class:`DepthWidths`: the level, the plane and the method), so that a scan
plan (:mod:`beamspread.scan`) records them. Lengths are in m.
"""

from __future__ import annotations

import math
from collections.abc import Iterator, Mapping
from dataclasses import dataclass

import numpy as np

from .errors import InputError
from .probes import check_element, check_positive, plane_name

__all__ = [
    "MAX_DEPTHS",
    "DepthWidths",
    "depth_widths",
    "far_field_widths",
    "field_widths",
    "sample_widths",
    "scan_depths",
]

MAX_DEPTHS = 2000


@dataclass(frozen=True, eq=False)
class DepthWidths(Mapping):
    """Full beam widths by depth (m -> m, in depth order), and which widths they are.

    A mapping like a dict; ``level_db`` (dB down), ``plane`` and ``method``
    (``"field"``, ``"far-field"``) name the width, as a
    :class:`beamspread.scan.ScanPlan` records it.
    """

    widths: Mapping[float, float]
    level_db: float | str
    plane: str
    method: str

    def __getitem__(self, depth: float) -> float:
        return self.widths[depth]

    def __iter__(self) -> Iterator[float]:
        return iter(self.widths)

    def __len__(self) -> int:
        return len(self.widths)


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


def depth_widths(
    probe,
    speed: float,
    start: float,
    stop: float,
    *,
    method: str = "field",
    count: int = 16,
    level_db: float = 6.0,
    plane: str | None = None,
    mode: str = "pulse-echo",
    **field,
) -> DepthWidths:
    """Beam widths over a depth range, m, by depth (m): computed or far-field.

    ``count`` depths from ``start`` to ``stop`` (:func:`scan_depths`).
    ``method`` ``"field"``: each width from
    :func:`beamspread.field.beam_widths` (NaN where the level is not reached);
    the keywords ``refine`` (default True), ``bandwidth``, ``frequencies`` and
    ``spectrum`` go to the field. With ``refine``, the narrowest sample is
    refined by a golden-section search between its neighbours, and that depth
    added, so that the governing width does not depend on the sampling.

    ``method`` ``"far-field"``: the cone ``2 z tan(theta)``. It widens with
    depth, so the first depth governs; it does not hold in the near field
    (the computed field does). NaN where the pattern has no half-angle at the
    level.
    """
    plane = plane_name(check_element(probe), plane)
    if method == "field":
        widths = _field_widths(probe, speed, start, stop, count, level_db, plane, mode, **field)
    elif method == "far-field":
        speed = check_positive(speed, "speed", "m/s")
        theta = float(probe.half_angle(level_db, speed / probe.frequency, mode, plane))
        depths = dict.fromkeys(scan_depths(start, stop, count).tolist())
        widths = {float(d): 2.0 * float(d) * math.tan(theta) for d in depths}
    else:
        raise InputError(f"method: {method!r} is unknown; use field or far-field")
    return DepthWidths(widths, level_db, plane, method)


def field_widths(probe, speed: float, start: float, stop: float, **options) -> DepthWidths:
    """:func:`depth_widths` of the computed field."""
    return depth_widths(probe, speed, start, stop, method="field", **options)


def far_field_widths(probe, speed: float, start: float, stop: float, **options) -> DepthWidths:
    """:func:`depth_widths` of the far-field cone."""
    return depth_widths(probe, speed, start, stop, method="far-field", **options)


def _field_widths(
    probe, speed, start, stop, count, level_db, plane, mode, *, refine=True, **spectrum
) -> dict[float, float]:
    """The computed widths of :func:`depth_widths`; ``spectrum``: the pulse's keywords."""
    from .field import beam_widths

    def width(depth: float) -> float:
        widths = beam_widths(probe, speed, depth, [level_db], plane=plane, mode=mode, **spectrum)
        return float(widths[0].width)

    return sample_widths(width, start, stop, count, refine)


def sample_widths(width, start: float, stop: float, count: int, refine: bool) -> dict[float, float]:
    """``width(depth)`` at ``count`` depths, m, the narrowest refined (:func:`depth_widths`)."""
    from ._search import golden_max

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
