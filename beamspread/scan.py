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

Widths come from the computed field (near field included) or from the
far-field cone :math:`2 z \tan\theta`. The cone does not hold inside the
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

import numpy as np

from .errors import InputError
from .probes import check_element, check_positive, plane_name
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

MAX_DEPTHS = 2000


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
) -> dict[float, float]:
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
        return _field_widths(probe, speed, start, stop, count, level_db, plane, mode, **field)
    if method == "far-field":
        speed = check_positive(speed, "speed", "m/s")
        theta = float(probe.half_angle(level_db, speed / probe.frequency, mode, plane))
        depths = scan_depths(start, stop, count)
        return {float(d): 2.0 * float(d) * math.tan(theta) for d in dict.fromkeys(depths.tolist())}
    raise InputError(f"method: {method!r} is unknown; use field or far-field")


def field_widths(probe, speed: float, start: float, stop: float, **options) -> dict[float, float]:
    """:func:`depth_widths` of the computed field."""
    return depth_widths(probe, speed, start, stop, method="field", **options)


def far_field_widths(probe, speed: float, start: float, stop: float, **options):
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

    return _sampled(width, start, stop, count, refine)


def _sampled(width, start: float, stop: float, count: int, refine: bool) -> dict[float, float]:
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
    """:func:`plan_scan` over the widths of :func:`depth_widths`.

    ``method`` is ``"field"`` (the computed field, near field included; extra
    keywords go to the field) or ``"far-field"``.

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
    plane = plane_name(check_element(probe), plane)
    speed = check_positive(speed, "speed", "m/s")
    widths = depth_widths(
        probe,
        speed,
        start,
        stop,
        method=method,
        count=count,
        level_db=level_db,
        plane=plane,
        mode=mode,
        **field,
    )
    plan = plan_scan(widths, overlap, level_db=level_db, plane=plane, method=method)
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
            found = source.widths(at, [level_db], plane, result.mode, result.settings)
            return float(found[0].width)

        widths = _sampled(width, start, stop, count, refine)
    elif method == "far-field":
        depths = tuple(dict.fromkeys(scan_depths(start, stop, count).tolist()))
        technique = result.technique.with_request(depths=depths, levels=(level_db,), pulse=None)
        beam = compute(technique, registry=result.part.registry).beam
        (spots,) = [p.spots for p in beam.planes if p.name == plane]
        widths = {s.depth: s.width for s in spots if s.leg == 1}
    else:
        raise InputError(f"method: {method!r} is unknown; use field or far-field")
    plan = plan_scan(widths, overlap, level_db=level_db, plane=plane, method=method)
    return _with_near_field(plan, result.beam.near_field, result.beam.near_field_simple)


def _near_field(probe, wavelength: float) -> tuple[float | None, float]:
    """The last on-axis maximum (None where there is none) and D^2/4 lambda, m, as ``analyse``."""
    found = probe.near_field(wavelength)
    return (None if math.isnan(found.length) else found.length), found.simple
