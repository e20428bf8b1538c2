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

Widths (:mod:`beamspread.depthwidths`) come from the computed field (near
field included) or from the far-field cone :math:`2 z \tan\theta`. The cone does not hold inside the
near field, and it only widens with depth, so when the range starts inside
the near field the step is set there by a width that does not hold. Such a
plan is still made (as ``beam`` still gives a far-field spot there), but each
depth is marked (``far_field_valid``) and a warning names the depths and the
near field, pointing to the computed field, which holds there.

Nothing here prints or reads files; lengths are in m, the overlap a fraction.
"""

from __future__ import annotations

import math
import re
from collections.abc import Mapping
from dataclasses import dataclass, replace

from .depthwidths import (
    DepthWidths,
    depth_widths,
    far_field_widths,
    field_widths,
    sample_widths,
    scan_depths,
)
from .errors import InputError
from .probes import check_positive
from .source import source_widths
from .units import length_text as _mm

__all__ = [
    "RULE",
    "ScanPlan",
    "check_overlap",
    "depth_widths",
    "far_field_widths",
    "field_widths",
    "index_step",
    "parse_overlap",
    "plan_scan",
    "plan_scan_for",
    "scan_depths",
]

RULE = "index step = narrowest beam width over the depths x (1 - overlap) (common practice)"


@dataclass(frozen=True)
class ScanPlan:
    """The index step for a depth range, and the depth and width that set it.

    ``depths`` and ``widths`` are the samples considered (m), in depth order;
    ``level_db`` (positive, dB down) and ``plane`` say which width was used,
    where known; ``method`` is ``"field"``, ``"far-field"`` or ``"given"``.
    ``near_field`` is the last on-axis maximum (m; None where unknown or
    there is none); with far-field widths, ``far_field_valid`` says for each
    depth whether it lies beyond the near field, where the cone holds (None
    for other methods). ``warnings`` say what does not hold.
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
    near_field: float | None = None
    far_field_valid: tuple[bool, ...] | None = None
    warnings: tuple[str, ...] = ()

    @property
    def governing_far_field_valid(self) -> bool | None:
        """Whether the far-field width that sets the step holds (None: not a far-field plan)."""
        if self.far_field_valid is None:
            return None
        return self.far_field_valid[self.depths.index(self.governing_depth)]


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


def plan_scan(widths_by_depth: Mapping[float, float | None], overlap) -> ScanPlan:
    """The largest index step keeping ``overlap`` between passes over the depths given.

    Parameters
    ----------
    widths_by_depth : mapping
        Depth (m, above 0) -> full beam width there (m, above 0), across the
        passes. A :class:`~beamspread.depthwidths.DepthWidths` also gives the
        plan its level, plane and method; any other mapping is ``"given"``.
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
        **_described(widths_by_depth),
    )


def _described(widths) -> dict:
    """The plan's level, plane and method from ``widths`` where it says them."""
    if not isinstance(widths, DepthWidths):
        return {}
    return {"level_db": abs(float(widths.level_db)), "plane": widths.plane, "method": widths.method}


def plan_scan_for(probe, speed: float, start: float, stop: float, overlap, **options) -> ScanPlan:
    """:func:`plan_scan` over the widths of :func:`depth_widths`, with the near field.

    ``options`` are those of :func:`depth_widths`: ``method`` ``"field"`` (the
    computed field, near field included, the default) or ``"far-field"``, the
    depth count, level, plane and mode, and the field's keywords.

    The plan carries the probe's near field in the medium. Far-field widths
    inside it are marked invalid and warned about (the cone does not hold
    there); computed widths closer than 0.05 N to the face are warned about
    as ``analyse`` does (the field is not validated there).

    Examples
    --------
    >>> from beamspread.probes import Disc
    >>> plan = plan_scan_for(Disc(0.010, 5e6), 5920.0, 0.010, 0.050, 0.1, method="far-field")
    >>> round(plan.near_field * 1e3, 2), plan.governing_far_field_valid
    (20.82, False)
    >>> plan.warnings[0].split(":")[0]
    'depths 10 mm to 20.67 mm lie inside the near field (20.82 mm)'
    """
    check_overlap(overlap)
    speed = check_positive(speed, "speed", "m/s")
    plan = plan_scan(depth_widths(probe, speed, start, stop, **options), overlap)
    near, near_simple = _near_field(probe, speed / probe.frequency)
    return _with_near_field(plan, near, near_simple)


def _with_near_field(plan: ScanPlan, near: float | None, near_simple: float | None) -> ScanPlan:
    """The plan with the near field, far-field rows inside it marked, and the warnings."""
    warnings = []
    valid = None
    if plan.method == "far-field":
        valid = tuple(near is None or d >= near for d in plan.depths)
        inside = [d for d, ok in zip(plan.depths, valid, strict=True) if not ok]
        if inside:
            which = (
                f"depth {_mm(inside[0])} lies"
                if len(inside) == 1
                else f"depths {_mm(inside[0])} to {_mm(inside[-1])} lie"
            )
            warnings.append(
                f"{which} inside the near field ({_mm(near)}): the far-field width does "
                f"not hold there, and the step is set by the width at "
                f"{_mm(plan.governing_depth)}; the computed field (method 'field') holds there"
            )
    elif near_simple is not None and plan.depths[0] < 0.05 * near_simple:
        warnings.append(
            f"depth {_mm(plan.depths[0])} lies closer than 0.05 N ({_mm(0.05 * near_simple)}) "
            "to the face, where the computed field is not validated"
        )
    return replace(plan, near_field=near, far_field_valid=valid, warnings=tuple(warnings))


def index_step(
    result,
    start: float,
    stop: float,
    overlap,
    *,
    count: int = 16,
    level_db: float = 6.0,
    plane: str | None = None,
    method: str = "field",
    refine: bool = True,
) -> ScanPlan:
    """:func:`plan_scan` for a computed technique (:func:`beamspread.compute`'s result).

    Depths are below the scanning surface (on a wedge, on the first leg).
    ``method`` "field" takes each width from the technique's computed field
    (:class:`beamspread.source.FieldSource`, as ``beam`` does); "far-field" from
    the far-field widths ``beam`` gives at those depths.
    """
    from .pipeline import compute

    check_overlap(overlap)
    source = result.source
    plane = plane or source.planes[0]
    if plane not in source.planes:
        raise InputError(
            f"plane: {plane!r} is not a plane of this probe; use one of {', '.join(source.planes)}"
        )
    if method == "field":
        if result.settings is None:
            raise InputError("method field: the technique asks for the far field only")

        def width(depth: float) -> float:
            at = source.coordinate_of_depth(depth)
            found = source_widths(source, at, [level_db], plane, result.mode, result.settings)
            return float(found[0].width)

        widths = sample_widths(width, start, stop, count, refine)
    elif method == "far-field":
        depths = tuple(dict.fromkeys(scan_depths(start, stop, count).tolist()))
        technique = result.technique.with_request(depths=depths, levels=(level_db,), pulse=None)
        beam = compute(technique, registry=result.part.registry).beam
        (spots,) = [p.spots for p in beam.planes if p.name == plane]
        widths = {s.depth: s.width for s in spots if s.leg == 1}
    else:
        raise InputError(f"method: {method!r} is unknown; use field or far-field")
    plan = plan_scan(DepthWidths(widths, level_db, plane, method), overlap)
    return _with_near_field(plan, result.beam.near_field, result.beam.near_field_simple)


def _near_field(probe, wavelength: float) -> tuple[float | None, float]:
    """The last on-axis maximum (None where there is none) and D^2/4 lambda, m, as ``analyse``."""
    found = probe.near_field(wavelength)
    return (None if math.isnan(found.length) else found.length), found.simple
