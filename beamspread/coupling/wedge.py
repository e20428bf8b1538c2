"""An angle-beam wedge: the beam in the part of a contact probe on a wedge.

:func:`analyse_wedge` returns a :class:`~beamspread.coupling.result.SetupResult`
with the refraction, the virtual element, the near field in the part and, in
the incidence plane, where the beam's edges cross each depth asked for.

Model and its limits
--------------------
The beam in the part is that of a *virtual element* in the part,
the real element projected by cos(refracted)/cos(incident) in the
incidence plane (common practice), set back behind the exit point by the
wedge path's equivalent ``wedge_path * c_wedge / c_part`` (common practice).
A disc becomes an ellipse, a rectangle a shorter rectangle. The computed
field is that virtual element's (:mod:`beamspread.field`): it omits the
angle dependence of the transmission coefficient across the beam and the
mode-converted wave, so it is an estimate for the main lobe. The far-field
cone starts at the virtual element too: across the axis its width is
``2 (s + offset) tan(half-angle)`` at sound path ``s`` from the exit point.
A footprint in the incidence plane is where the beam's edges (at half the
width either side of the axis, across it) cross the depth: in closed form
for the cone (:func:`beamspread.setups.cone_footprint`), by root finding
on the computed width for the field.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, replace

import numpy as np

from .. import setups
from ..beam import Asked, FieldSummary, PlaneResult, Spot, beam_result, level_key
from ..errors import InputError
from ..media.quantities import Wave
from ..probes import Disc, Rectangle, check_element, check_positive
from ..units import length_text as _mm
from .crossing import _ComputedWidths, _edge_crossing
from .result import SetupResult, WedgeFootprint

__all__ = ["Wedge", "analyse_wedge"]


@dataclass(frozen=True)
class Wedge:
    """An angle-beam wedge: its longitudinal speed, mean path and angle."""

    speed: float  # m/s
    path: float = 0.0  # m, mean sound path in the wedge along the beam axis
    incident: float | None = None  # rad
    refracted: float | None = None  # rad, nominal, for the wave mode asked for
    name: str = "given"


def _deg(rad: float) -> str:
    return f"{math.degrees(rad):.2f} deg"


def _levels(levels):
    return tuple(dict.fromkeys(abs(float(level)) for level in levels))


def analyse_wedge(
    probe: Disc | Rectangle,
    part: Wave,
    c_longitudinal: float,
    c_shear: float | None,
    wedge: Wedge,
    asked: Asked | None = None,
    *,
    thickness: float | None = None,
) -> SetupResult:
    """The beam in the part of a contact probe on an angle-beam wedge.

    Parameters
    ----------
    probe : Disc or Rectangle
        The element; a rectangle's ``length`` lies in the incidence plane.
    part : Wave
        The part's wave of the mode used (its ``wave`` names the mode).
    c_longitudinal, c_shear : float
        Both speeds of the part, m/s (``c_shear`` None for a liquid).
    wedge : Wedge
    thickness : float, optional
        Part thickness, m: each depth then gets the first and the second leg.
    asked : Asked, optional
        Depths (below the scanning surface), levels, mode and the computed
        field; the default asks for the 6 and 20 dB far-field beam, pulse-echo.

    Raises
    ------
    InputError
        Angles outside [0, 90) degrees or past critical for the mode, a
        refracted angle no incident angle reaches, a depth below the part.
    """
    asked = asked or Asked()
    depths, levels, mode, field = asked.depths, asked.levels, asked.mode, asked.field
    check_element(probe, probe=True)
    check_positive(wedge.speed, "wedge speed", "m/s")
    if not (math.isfinite(wedge.path) and wedge.path >= 0):
        raise InputError(f"wedge path: {wedge.path!r} m is not allowed; give 0 or more")
    wave = part.wave
    r = setups.refract(
        wedge.speed,
        c_longitudinal,
        c_shear,
        incident=wedge.incident,
        refracted=wedge.refracted,
        wave=wave,
    )
    beta = r.refracted(wave)
    if beta is None:
        which = r.first_critical if wave == "longitudinal" else r.second_critical
        past = (
            f"past the {'first' if wave == 'longitudinal' else 'second'} critical angle "
            f"({_deg(which)})"
            if which is not None
            else "where it cannot refract"
        )
        raise InputError(
            f"no {wave} wave enters the part at an incident angle of "
            f"{_deg(r.incident)}: that lies {past}"
        )
    warnings: list[str] = list(part.warnings)
    if wave == "shear" and r.longitudinal is not None:
        warnings.append(
            f"a longitudinal wave also enters, at {_deg(r.longitudinal)}: the "
            f"incident angle lies below the first critical angle "
            f"({_deg(r.first_critical)})"
        )
    if math.degrees(beta) > 80:
        warnings.append(
            f"the refracted angle {_deg(beta)} grazes the surface: the model of "
            "the beam in the part is poor there"
        )
    alpha, c_part, f = r.incident, part.speed, probe.frequency
    wavelength = c_part / f
    if thickness is not None:
        check_positive(thickness, "thickness", "m")
    depth_list = tuple(dict.fromkeys(check_positive(d, "depth", "m") for d in depths))
    for d in depth_list:
        if thickness is not None and d > thickness:
            raise InputError(f"depth {_mm(d)} lies below the part, which is {_mm(thickness)} thick")
    view = probe.seen_through_wedge(alpha, beta)
    virtual, names = view.virtual, view.plane_names
    inc = virtual.aperture()  # the virtual element's size in the incidence plane (its first)
    from ..field import last_maximum

    n_virtual = last_maximum(virtual, c_part, bandwidth=0.0, mode="one-way")
    offset = wedge.path * wedge.speed / c_part
    near = None if math.isnan(n_virtual) else n_virtual - offset
    if near is not None and near <= 0:
        warnings.append(
            f"the near field ({_mm(n_virtual)} for the virtual element) ends "
            f"inside the wedge (its path counts as {_mm(offset)} of the part)"
        )
        near = None
    simple = view.simple_square / (4 * wavelength) - offset
    simple_formula = view.simple_formula
    level_list = _levels(levels)
    warnings.extend(_incident_spread_warnings(probe, wedge.speed, r, wave, level_list, mode))
    computed = (
        None if field is None else _ComputedWidths(virtual, c_part, offset, level_list, mode, field)
    )
    legs = (1, 2) if thickness is not None else (1,)
    planes, prints = [], []
    for index, (vname, aperture) in enumerate(virtual.planes):
        in_plane = index == 0  # the incidence plane: footprints where the edges cross the depth
        angles = np.degrees(virtual.half_angle(level_list, wavelength, mode, vname))
        null = float(np.degrees(virtual.first_null(wavelength, vname)))
        half = {
            level_key(lv): (None if math.isnan(a) else float(a))
            for lv, a in zip(level_list, angles, strict=True)
        }
        half["null"] = None if math.isnan(null) else null
        spots = []
        for depth in depth_list:
            for leg in legs:
                path, surface, unfolded = setups.leg_geometry(depth, beta, thickness, leg)
                valid = near is None or path >= near
                for lv in level_list:
                    angle = half[level_key(lv)]
                    width = footprint = None
                    if angle is not None:
                        theta = math.radians(angle)
                        width = 2 * (path + offset) * math.tan(theta)  # from the virtual element
                        footprint = width
                    if in_plane:
                        cone = (
                            setups.cone_footprint(unfolded, beta, theta, offset)
                            if angle is not None
                            else (None, None, None, None)
                        )
                        found = WedgeFootprint(depth, leg, -lv, "far-field", path, surface, *cone)
                        prints.append(found)
                        footprint = found.width
                    spots.append(
                        Spot(
                            depth,
                            -lv,
                            width,
                            valid,
                            leg=leg,
                            sound_path=path,
                            surface_distance=surface,
                            footprint=footprint,
                        )
                    )
                if computed is None:
                    continue
                at_path = computed(vname, path)
                for lv in level_list:
                    w0 = at_path[lv]
                    width = None if math.isnan(w0) else w0
                    foot = width
                    if in_plane:
                        angle = half[level_key(lv)]
                        slope = 0.0 if angle is None else 2 * math.tan(math.radians(angle))
                        found = _computed_footprint(
                            lambda s, lv=lv, plane=vname: computed(plane, s)[lv],
                            WedgeFootprint(depth, leg, -lv, "field", path, surface, None, None),
                            unfolded,
                            beta,
                            w0,
                            slope,
                        )
                        prints.append(found)
                        foot = found.width
                    spots.append(
                        Spot(
                            depth,
                            -lv,
                            width,
                            None,
                            method="field",
                            leg=leg,
                            sound_path=path,
                            surface_distance=surface,
                            footprint=foot,
                        )
                    )
        planes.append(PlaneResult(names[vname], aperture, half, tuple(spots)))
    by_method = _footprint_warnings(prints, beta, planes[0].half_angles)
    for depth in depth_list:
        path = depth / math.cos(beta)
        if near is not None and path < near:
            by_method.append(
                (
                    "far-field",
                    f"depth {_mm(depth)} (sound path {_mm(path)}) lies inside the near "
                    f"field in the part ({_mm(near)}): the far-field width does not "
                    "hold there",
                )
            )
    warnings.extend(text for _, text in by_method)
    beam = beam_result(
        (probe, part, mode, level_list, depth_list, planes, warnings),
        near_field=near,
        near_field_simple=simple if simple > 0 else None,
        near_field_method="last on-axis maximum of the virtual element in the part, less "
        "the wedge path's equivalent (common practice)",
        near_field_simple_method=f"{simple_formula}, less the wedge path's equivalent",
        near_field_factor=None,
        field=None if field is None else FieldSummary(field, None),
    )
    return SetupResult(
        beam,
        "wedge",
        refraction=r,
        effective_aperture=inc,
        near_field_in_part=near,
        warnings=tuple(warnings),
        virtual=virtual,
        offset=offset,
        footprints=tuple(prints),
        method_warnings=tuple(by_method),
    )


def _computed_footprint(width_at, where, unfolded, beta, w0, slope) -> WedgeFootprint:
    """The computed field's footprint at one depth, leg and level (see :func:`_edge_crossing`).

    ``where`` is the footprint without its ends, filled in here.
    """
    ends = []
    for side in (-1.0, 1.0):
        hit = None
        if math.isfinite(w0):
            hit = _edge_crossing(width_at, unfolded, beta, side, where.sound_path, w0, slope)
        if hit is None:
            ends.append((None, None))
        else:
            s, w = hit
            ends.append((s * math.sin(beta) + side * 0.5 * w * math.cos(beta), s))
    (near, near_path), (far, far_path) = ends
    return replace(where, near=near, far=far, near_path=near_path, far_path=far_path)


def _incident_spread_warnings(probe, c_wedge, r, wave, levels, mode) -> list[str]:
    """Whether the incident beam's spread in the wedge straddles the critical angle that bounds
    the mode used: past it, that part of the beam sends no such wave into the part.

    The real element's half-angles in the wedge (its aperture in the incidence
    plane, the wedge's wavelength) either side of the incident angle.
    """
    if wave == "shear":
        bound, which = r.second_critical, "second"
    else:
        bound, which = r.first_critical, "first"
    if bound is None:
        return []
    lam = c_wedge / probe.frequency
    angles = probe.half_angle(levels, lam, mode)  # in the incidence plane, the first
    for level, angle in sorted(zip(levels, angles, strict=True)):
        reach = math.pi / 2 if math.isnan(angle) else r.incident + float(angle)
        if reach > bound:
            spread = "spreading to 90 deg" if math.isnan(angle) else f"± {_deg(float(angle))}"
            return [
                f"the incident beam straddles the {which} critical angle "
                f"({_deg(bound)}): its -{level:g} dB edges in the wedge lie at "
                f"{_deg(r.incident)} {spread}, and past {_deg(bound)} no {wave} wave "
                "enters, so the beam in the part is cut and weakened on its far side, "
                "which the model does not show"
            ]
    return []


def _footprint_warnings(prints, beta, half) -> list[tuple[str, str]]:
    """(method, line): one line per level, method and edge that does not reach a depth asked for."""
    out = []
    for method in ("far-field", "field"):
        for level in dict.fromkeys(p.level_db for p in prints):
            mine = [p for p in prints if p.method == method and p.level_db == level]
            for side in ("far", "near"):
                missed = [p for p in mine if getattr(p, side) is None]
                if not missed:
                    continue
                ahead = "ahead of" if side == "far" else "behind"
                angle = half[level_key(level)]
                if method == "far-field" and angle is None:
                    continue  # no half-angle at that level: the table says none already
                if method == "far-field":
                    out.append(
                        (
                            method,
                            f"the far-field {level:g} dB edge {ahead} the axis leaves the "
                            f"virtual element at {_deg(beta + math.radians(angle))} from the "
                            f"normal ({_deg(beta)} + {angle:.2f} deg), at or past the surface: "
                            "it never comes down to a depth, so there is no far-field "
                            f"{level:g} dB footprint",
                        )
                    )
                    continue
                places = ", ".join(f"{_mm(p.depth)} on leg {p.leg}" for p in missed)
                why = (
                    "it climbs toward the surface as fast as the axis descends"
                    if side == "far"
                    else "the depth lies inside the beam from where it enters the part"
                )
                out.append(
                    (
                        method,
                        f"the computed {level:g} dB edge {ahead} the axis does not reach the "
                        f"depth {places} ({why}): no computed {level:g} dB footprint there",
                    )
                )
    return out
