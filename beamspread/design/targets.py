"""The checks a design's inputs pass: positive sizes, a known mode, one target, a reachable spot."""

from __future__ import annotations

import numpy as np

from .. import pattern
from ..errors import InputError
from ..units import length_text as _mm
from ..units import parse_level


def positive(value, name: str, unit: str) -> np.ndarray:
    try:
        array = np.asarray(value, dtype=float)
    except (TypeError, ValueError):
        raise InputError(f"{name}: {value!r} is not a number") from None
    bad = ~np.isfinite(array) | (array <= 0)
    if np.any(bad):
        shown = array[bad].flat[0] if array.ndim else float(array)
        raise InputError(
            f"{name}: {shown:g} {unit} is not allowed; it must be a finite number above 0"
        )
    return array


def check_mode(mode: str) -> str:
    if mode not in pattern.MODES:
        raise InputError(f"mode {mode!r} is unknown; use one of {', '.join(pattern.MODES)}")
    return mode


def _angle(value, name: str, limit: float) -> np.ndarray:
    """A target angle (degrees) above 0 and below ``limit``, which even a point source reaches."""
    angle = np.asarray(value, dtype=float)
    if np.any(~np.isfinite(angle)) or np.any(angle <= 0):
        raise InputError(f"{name}: give an angle above 0 degrees")
    if np.any(angle >= limit):
        raise InputError(
            f"{name} {np.max(angle):g} degrees is not possible: even a point source "
            "(an element far smaller than the wavelength) only fills the half space in "
            f"front of it, up to {limit:g} degrees {name}; ask for less than {limit:g}"
        )
    return angle


def parse_target(half_angle_deg, full_angle_deg, spot, depth):
    """The target half-angle (rad), the footprint depth (m, NaN for none) and its kind."""
    given = [v is not None for v in (half_angle_deg, full_angle_deg, spot)]
    if sum(given) != 1:
        raise InputError("give one target: a half angle, a full angle, or a spot width at a depth")
    if spot is not None:
        if depth is None:
            raise InputError("a spot target needs the depth it is wanted at")
        w = positive(spot, "spot", "m")
        z = positive(depth, "depth", "m")
        return np.arctan(w / (2.0 * z)), z, "spot"
    if half_angle_deg is not None:
        half = _angle(half_angle_deg, "half angle", 90.0)
    else:
        half = 0.5 * _angle(full_angle_deg, "full angle", 180.0)
    z = np.nan if depth is None else positive(depth, "depth", "m")
    return np.radians(half), np.asarray(z, dtype=float), "angle"


def check_options(level_db, mode: str, on_impossible: str) -> tuple[float, str]:
    """The level (dB down, positive) and the mode a solver was given, both checked."""
    level = parse_level(level_db, "level")
    mode = check_mode(mode)
    check_on_impossible(on_impossible)
    return level, mode


def check_on_impossible(on_impossible: str) -> None:
    if on_impossible not in ("raise", "nan"):
        raise InputError(f"on_impossible {on_impossible!r} is unknown; use 'raise' or 'nan'")


def inside_near_field(kind: str, depth: np.ndarray, near: np.ndarray) -> np.ndarray:
    """Where a spot target's depth lies inside its own solution's near field."""
    if kind != "spot":
        return np.zeros(near.shape, dtype=bool)
    with np.errstate(invalid="ignore"):
        return np.isfinite(near) & (depth < near)


def spot_message(depth, spot_w, solution, near, smallest) -> str:
    return (
        f"no far-field solution for a {_mm(spot_w)} spot at {_mm(depth)}: {solution} "
        f"has its near field out to {_mm(near)}, beyond the depth, where the far-field cone "
        "does not hold"
        + (
            f"; the smallest far-field spot at that depth is {_mm(smallest)}"
            if np.isfinite(smallest)
            else ""
        )
    )
