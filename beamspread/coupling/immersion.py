"""An immersion water path and a focus: the beam in the part at normal incidence.

:func:`analyse_immersion` returns a :class:`~beamspread.coupling.result.SetupResult`
with the near field in the part, the transmission and, for a focused probe, a
:class:`~beamspread.coupling.result.FocusResult`.

Models and their limits
-----------------------
* Immersion at normal incidence: the field in the part at depth ``d`` is
  taken as the element's field in water at the equivalent water path
  ``WP + d * c_part / c_water`` (paraxial; the lateral scale is unchanged),
  which reproduces the near-field relation ``(N_water - WP) c_water / c_part``
  (common practice). It holds for small beam angles in the part.
* Focus: a disc is focused spherically (O'Neil's exact on-axis field of a
  spherical cap), a rectangle cylindrically in its length plane (the Fresnel,
  paraxial, on-axis form, from two half-lengths out); the diffraction focal
  spot; the paraxial focal depth in the part. The widths at depth come from
  the paraxial (Fresnel) field of the focused element
  (:mod:`beamspread.field.focused`) at the same equivalent water path
  ``WP + d * c_part / c_water``, which is where the paraxial focal depth
  ``(F - WP) c_water / c_part`` comes from too. A focused probe has no
  far-field width: the flat element's cone does not describe a converging
  beam, so none is given.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from .. import setups
from ..beam import (
    Asked,
    BeamResult,
    FieldSummary,
    PlaneResult,
    analyse,
    beam_result,
    level_key,
    straight_field_spots,
    straight_spot,
)
from ..errors import InputError
from ..media.quantities import Wave
from ..probes import Disc, Rectangle, check_element, check_positive
from ..source import FieldSource, source_widths
from ..units import length_text as _mm
from .result import FocusResult, SetupResult

__all__ = ["Focus", "WaterPath", "analyse_immersion"]

MAX_WATER_PATH = 2.0  # m: longer than any immersion tank or bubbler


@dataclass(frozen=True)
class WaterPath:
    """The couplant column between an immersion probe and the part."""

    speed: float  # m/s
    path: float  # m
    density: float | None = None  # kg/m3
    name: str = "water"


@dataclass(frozen=True)
class Focus:
    """A focus (spherical for a disc, cylindrical in the length plane for a rectangle)."""

    focal_length: float  # m


def analyse_immersion(
    probe: Disc | Rectangle,
    part: Wave,
    water: WaterPath,
    asked: Asked | None = None,
    *,
    focus: Focus | None = None,
) -> SetupResult:
    """The beam in the part of an immersion probe at normal incidence, optionally focused.

    The water path may be 0 (a focus directly in the couplant with ``part``
    the couplant itself). ``asked``: the depths (below the part's surface),
    levels, mode and computed field, as for :func:`beamspread.analyse_wedge`.
    See the module notes for the model.

    Raises
    ------
    InputError
        A water path below 0 or over 2 m, a focus at or behind the element
        (not beyond its radius), a focus on a rectangle.
    """
    asked = asked or Asked()
    depths, levels, mode, field = asked.depths, asked.levels, asked.mode, asked.field
    check_element(probe, probe=True)
    wp = float(water.path)
    if not math.isfinite(wp) or wp < 0 or wp > MAX_WATER_PATH:
        raise InputError(
            f"water path: {wp * 1e3:g} mm is not allowed; give 0 to {MAX_WATER_PATH * 1e3:g} mm"
        )
    c_w, c_p = water.speed, part.speed
    in_water = analyse(
        probe, Wave(water.name, "longitudinal", c_w, "couplant"), levels=levels, mode=mode
    )
    n_w = in_water.near_field
    warnings: list[str] = list(part.warnings)
    near = None if n_w is None else setups.immersion_near_field(n_w, wp, c_w, c_p)
    if n_w is not None and near is None and wp > 0:
        warnings.append(
            f"the water path ({_mm(wp)}) is longer than the near field in water "
            f"({_mm(n_w)}): the part lies wholly in the far field"
        )
    level_list = in_water.levels
    depth_list = tuple(dict.fromkeys(check_positive(d, "depth", "m") for d in depths))
    focus_result = None
    if focus is not None:
        focus_result = _focus(probe, focus, in_water, water, c_p, level_list[0], mode, warnings)
        warnings.extend(_focused_field_warnings(probe, focus, wp, c_w, c_p, depth_list, field))
    # The computed field in the part: the element in the couplant at the equivalent water
    # path WP + d c_part / c_water (see the module notes), focused or not.
    source = FieldSource(
        probe,
        c_w,
        start=wp,
        stretch=c_p / c_w,
        focus=None if focus is None else focus.focal_length,
        plane_names=tuple((name, name) for name, _ in probe.planes),
    )
    planes = []
    for plane in in_water.planes:
        half = {}
        for key, angle in plane.half_angles.items():
            if angle is None:
                half[key] = None
                continue
            s = math.sin(math.radians(angle)) * c_p / c_w
            half[key] = math.degrees(math.asin(s)) if s < 1 else None
            if s >= 1 and key != "null":
                warnings.append(
                    f"the {key} dB edge of the beam ({angle:.2f} deg in water) "
                    "meets the surface past the critical angle: no width in the "
                    "part at that level"
                )
        spots = []
        for depth in depth_list:
            if field is not None:
                computed = straight_field_spots(
                    source_widths(source, depth, level_list, plane.name, mode, field), depth
                )
            if focus is not None:  # no far-field row: the flat element's cone does not converge
                spots.extend(computed if field is not None else [])
                continue
            equivalent = float(source.ranges(depth))
            valid = n_w is None or equivalent >= n_w
            for lv in level_list:
                key = level_key(lv)
                width = None
                if half[key] is not None:
                    width = 2 * (
                        wp * math.tan(math.radians(plane.half_angles[key]))
                        + depth * math.tan(math.radians(half[key]))
                    )
                spots.append(straight_spot(depth, lv, width, valid))
            if field is not None:
                spots.extend(computed)
        planes.append(PlaneResult(plane.name, plane.aperture, half, tuple(spots)))
    direct = wp == 0 and water.speed == c_p  # a focused probe straight in the medium
    transmission = None
    if not direct and water.density is not None and part.density is not None:
        transmission = setups.transmission_coefficient(water.density * c_w, part.density * c_p)
    simple_part = None
    if wp < in_water.near_field_simple:
        simple_part = (in_water.near_field_simple - wp) * c_w / c_p
    method = (
        "last on-axis maximum of the element in the medium"
        if direct
        else "(N_water - water path) c_water / c_part (common practice)"
    )
    beam = beam_result(
        (probe, part, mode, level_list, depth_list, planes, warnings),
        near_field=near,
        near_field_simple=simple_part,
        near_field_method=method,
        near_field_factor=None,
        field=None if field is None else FieldSummary(field, None),
    )
    return SetupResult(
        beam,
        "focused" if direct else "immersion",
        near_field_in_part=near,
        transmission=transmission,
        focus=focus_result,
        warnings=tuple(warnings),
    )


def _focused_field_warnings(probe, focus, wp, c_water, c_part, depths, field) -> list[str]:
    """What limits the focused element's widths at these depths (or why there are none)."""
    if not depths:
        return []
    if field is None:
        return [
            "a focused probe's widths at depth come from its computed field only (the "
            "flat element's far-field cone does not describe a converging beam): none are given"
        ]
    size = probe.longest_side
    close = [d for d in depths if wp + d * c_part / c_water < size]
    if close:
        where = "" if wp == 0 else " (the water path and the depth counted as couplant)"
        return [
            f"depth {_mm(close[0])} lies within one element size ({_mm(size)}) of the "
            f"face{where}: the paraxial field of the focus does not hold there, so no "
            "computed width is given"
        ]
    return []


def _focus(
    probe,
    focus: Focus,
    in_water: BeamResult,
    water: WaterPath,
    c_part: float,
    level: float,
    mode: str,
    warnings: list[str],
) -> FocusResult:
    big_f = float(focus.focal_length)
    a = probe.focused_half_aperture  # half the focused aperture
    if not math.isfinite(big_f) or big_f <= a:
        raise InputError(
            f"focus: {big_f * 1e3:g} mm is not allowed; a focal length must lie in "
            f"front of the element, beyond its {probe.focus_half_name} ({a * 1e3:g} mm)"
        )
    lam = water.speed / probe.frequency
    n_w = in_water.near_field or in_water.near_field_simple
    s = setups.normalised_focal_length(big_f, n_w)
    if s >= 1:
        warnings.append(
            f"S = F/N = {s:.2f} is not below 1: focusing does nothing useful, the "
            "beam's narrowest point lies at the near field anyway"
        )
    power = 2 if mode == "pulse-echo" else 1
    z, one_way = probe.focused_axis(big_f, lam)
    amp = one_way**power
    if a / big_f > 0.3:
        warnings.append(
            f"the {probe.focus_kind} focus is strong ({probe.focus_half_name} / F = "
            f"{a / big_f:.2f}): the "
            "Fresnel (paraxial) form of its field is rough here"
        )
    i = int(np.argmax(amp))
    target = amp[i] * 10 ** (-level / 20)
    above = amp >= target
    lo = i
    while lo > 0 and above[lo - 1]:
        lo -= 1
    hi = i
    while hi < z.size - 1 and above[hi + 1]:
        hi += 1
    zone = None if lo == 0 or hi == z.size - 1 else (float(z[lo]), float(z[hi]))
    x = float(probe.level_x(level, mode))
    spot = setups.focal_spot_width(big_f, lam, 2.0 * a, x)
    rule = n_w * s * s * 2.0 / (1.0 + 0.5 * s)
    wp = water.path
    depth = axial = zone_part = None
    poor = False
    if wp > 0:
        depth = setups.focal_depth_in_part(big_f, wp, water.speed, c_part)
        if depth is None:
            warnings.append(
                f"the focus ({_mm(big_f)} in the couplant) lies in the water path "
                f"({_mm(wp)}): it never reaches the part"
            )
        else:
            rim = a / big_f * c_part / water.speed  # sine of the rim ray's angle in the part
            poor = rim >= 1 or math.degrees(math.asin(rim)) > 20
            if poor:
                warnings.append(
                    "the paraxial focal depth in the part, and any computed width "
                    "there, is a poor estimate: the rim rays refract steeply (or "
                    "totally reflect) at the surface"
                )
        if z[i] > wp:
            axial = (float(z[i]) - wp) * water.speed / c_part
        if zone is not None and zone[0] > wp:
            zone_part = tuple((v - wp) * water.speed / c_part for v in zone)
    return FocusResult(s, float(z[i]), spot, zone, rule, depth, axial, zone_part, poor)
