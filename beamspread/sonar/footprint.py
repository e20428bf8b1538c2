"""Where the beam meets a flat bottom: footprint widths and the depths they are quoted at."""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ..errors import InputError
from ..probes import check_positive


def footprint_width(depth, half_angle) -> np.ndarray:
    """Width of the cone's footprint on a flat bottom: ``2 depth tan(half_angle)``, m.

    ``half_angle`` in rad; NaN passes through (no angle at that level).

    >>> round(float(footprint_width(30.0, np.radians(8.79))), 3)
    9.278
    """
    return 2.0 * np.asarray(depth, dtype=float) * np.tan(np.asarray(half_angle, dtype=float))


def depth_range(start: float, stop: float, step: float) -> tuple[float, ...]:
    """Depths from ``start`` to ``stop`` inclusive in steps of ``step``, m.

    Raises
    ------
    InputError
        Unless 0 < start <= stop and step > 0, with at most 10000 depths.

    >>> depth_range(10, 30, 10)
    (10.0, 20.0, 30.0)
    """
    start = check_positive(start, "depth range start", "m")
    stop = check_positive(stop, "depth range stop", "m")
    step = check_positive(step, "depth range step", "m")
    if stop < start:
        raise InputError(f"depth range: the stop {stop:g} m lies before the start {start:g} m")
    count = math.floor((stop - start) / step * (1.0 + 1e-12)) + 1
    if count > 10000:
        raise InputError(
            f"depth range: {count} depths is too many; use a larger step (at most 10000 depths)"
        )
    return tuple(float(start + i * step) for i in range(count))


@dataclass(frozen=True)
class Footprint:
    """The width of the beam's footprint on a flat bottom at one depth, level and plane."""

    depth: float  # m
    level_db: float  # negative: -3.0 means 3 dB down
    plane: str
    width: float | None  # m; None where the beam has no angle at that level
    inside_near_field: bool  # the far-field cone does not hold there
