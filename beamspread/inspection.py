"""Inspection setups end to end: an angle-beam wedge, an immersion water path, a focus.

Each ``analyse_*`` function returns a :class:`SetupResult`: the beam in the
part as a :class:`beamspread.BeamResult` (half-angles and spots per plane and
leg), and what the setup adds (refraction, effective aperture, near field in
the part, transmission, focus). SI units, angles in radians at the inputs and
degrees in results, as elsewhere.

Models and their limits
-----------------------
* Wedge: the beam in the part is that of a *virtual element* in the part,
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
from dataclasses import dataclass, replace
from dataclasses import field as _field

import numpy as np

from . import pattern, setups
from .beam import (
    BeamResult,
    Convention,
    FieldSettings,
    PlaneResult,
    Spot,
    analyse,
    field_spots,
    level_key,
    straight_field_spots,
)
from .errors import InputError
from .media.quantities import Wave
from .probes import Disc, Ellipse, Rectangle, check_positive
from .units import length_text as _mm

__all__ = [
    "Focus",
    "FocusResult",
    "SetupResult",
    "WaterPath",
    "Wedge",
    "WedgeFootprint",
    "analyse_immersion",
    "analyse_wedge",
]

MAX_WATER_PATH = 2.0  # m: longer than any immersion tank or bubbler
_SHORTEST_PATH = 1e-4  # m: computed edges are sought no nearer the exit point than this
_LONGEST_PATH = 5.0  # m: nor farther (an edge that meets a depth only beyond never does)
_CROSSING_TOLERANCE = 1e-7  # m: an edge crossing is found to this depth


@dataclass(frozen=True)
class Wedge:
    """An angle-beam wedge: its longitudinal speed, mean path and angle."""

    speed: float  # m/s
    path: float = 0.0  # m, mean sound path in the wedge along the beam axis
    incident: float | None = None  # rad
    refracted: float | None = None  # rad, nominal, for the wave mode asked for
    name: str = "given"


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


@dataclass(frozen=True)
class FocusResult:
    """What a focus does, in the couplant and (after a water path) in the part."""

    normalised_focal_length: float  # S = F / N in the couplant
    axial_maximum: float  # m from the face, in the couplant: the true on-axis maximum
    spot_width: float  # m, the focal spot at the first level (diffraction)
    zone: tuple[float, float] | None  # m from the face: on-axis amplitude at or above the level
    zone_rule_of_thumb: float  # m: N S^2 2/(1 + 0.5 S), common practice, for comparison
    focal_depth_in_part: float | None = None  # m below the surface, paraxial
    axial_maximum_in_part: float | None = None
    zone_in_part: tuple[float, float] | None = None
    paraxial_poor: bool = False


@dataclass(frozen=True)
class WedgeFootprint:
    """Where one level's edges in the incidence plane cross a depth on one leg.

    The edges lie at half the beam's full width either side of the axis,
    across it (perpendicular to it); ``near`` and ``far`` are where they cross
    the depth, m along the surface from the exit point (``far`` ahead of the
    axis); None where that edge does not reach the depth. ``near_path`` and
    ``far_path`` are the sound paths (m along the axis, unfolded) of the
    crossings. ``method`` is "far-field" (the cone from the virtual element)
    or "field" (the computed field).
    """

    depth: float  # m below the scanning surface
    leg: int
    level_db: float  # negative: -6.0 means 6 dB down
    method: str
    sound_path: float  # m, exit point to the depth along the axis
    surface_distance: float  # m, exit point to the axis at the depth
    near: float | None
    far: float | None
    near_path: float | None = None
    far_path: float | None = None

    @property
    def width(self) -> float | None:
        """The footprint along the depth, m (None where an edge does not reach it)."""
        if self.near is None or self.far is None:
            return None
        return self.far - self.near


@dataclass(frozen=True)
class SetupResult:
    """The beam in the part and what the setup did to it."""

    beam: BeamResult
    setup: str  # "wedge", "immersion"
    refraction: setups.Refraction | None = None
    effective_aperture: float | None = None  # m, in the incidence plane
    near_field_in_part: float | None = None  # m
    transmission: float | None = None  # pressure, couplant to part, normal incidence
    focus: FocusResult | None = None
    warnings: tuple[str, ...] = ()
    virtual: Disc | Rectangle | Ellipse | None = None  # the element as the part sees it
    offset: float = 0.0  # m: how far the virtual element sits behind the exit point
    footprints: tuple[WedgeFootprint, ...] = ()  # incidence plane, per depth, leg, level, method
    # (method, warning): the warnings (also in ``warnings``) that concern only the
    # far-field ("far-field") or the computed ("field") widths and footprints
    method_warnings: tuple[tuple[str, str], ...] = ()
    _widths: dict = _field(default_factory=dict, repr=False, compare=False)

    def edges(self, path_length: float, field: FieldSettings | None, *, samples: int = 24, at=()):
        """The beam's full width in the incidence plane along the sound path, per level.

        Returns ``{level_db: (sound_paths, widths)}``, m: from the computed field
        of the virtual element when ``field`` is given, else the far-field cone
        ``2 (s + offset) tan(half-angle)`` from the virtual element, the same
        widths the beam's far-field rows give (and, like them, not valid inside
        the near field). The sound paths in ``at`` (m) are sampled too, so a
        footprint read there is computed, not interpolated: pass the flaw's
        sound paths and the crossings in :attr:`footprints`.
        """
        if self.virtual is None:
            raise InputError("the beam's edges along the path need a wedge setup")
        plane = self.virtual.planes[0][0]
        beam = self.beam
        paths = np.linspace(0.0, path_length, samples)
        out = {}
        if field is None:
            half = beam.planes[0].half_angles
            for level in beam.levels:
                angle = half[level_key(level)]
                if angle is not None:
                    widths = 2.0 * (paths + self.offset) * math.tan(math.radians(angle))
                    out[level] = (tuple(paths), tuple(widths))
            return out
        first = max(0.05 * (beam.near_field or beam.near_field_simple or path_length), 1e-4)
        extra = [float(s) for s in at if _SHORTEST_PATH <= s < path_length]
        paths = np.unique(np.concatenate([np.linspace(first, path_length, samples), extra]))
        widths = _ComputedWidths(
            self.virtual,
            beam.wave.speed,
            self.offset,
            beam.levels,
            beam.convention.mode,
            field,
            self._widths,
        )
        table = {level: [] for level in beam.levels}
        for s in paths:
            for level, width in widths(plane, s).items():
                table[level].append(width)
        for level, values in table.items():
            if all(math.isfinite(w) for w in values):
                out[level] = (tuple(paths), tuple(values))
        return out


class _ComputedWidths:
    """The computed field's full widths per level at sound paths from the exit point.

    The virtual element's field at ``s + offset`` (see the module notes),
    kept in ``cache`` (the result's), so a section drawn from a result reuses
    the widths its footprints were found with.
    """

    def __init__(self, virtual, speed, offset, levels, mode, field: FieldSettings, cache: dict):
        self.virtual, self.speed, self.offset = virtual, speed, offset
        self.levels, self.mode, self.field, self.cache = levels, mode, field, cache

    def __call__(self, plane: str, path: float) -> dict[float, float]:
        from .field import beam_widths

        key = (plane, float(path), self.field, self.mode, self.levels)
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
    *,
    thickness: float | None = None,
    depths=(),
    levels=(6.0, 20.0),
    mode: str = "pulse-echo",
    field: FieldSettings | None = None,
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
    depths, levels, mode, field
        As :func:`beamspread.analyse`; depths are below the scanning surface.

    Raises
    ------
    InputError
        Angles outside [0, 90) degrees or past critical for the mode, a
        refracted angle no incident angle reaches, a depth below the part.
    """
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
    if isinstance(probe, Disc):
        inc = setups.effective_aperture(probe.diameter, alpha, beta)
        virtual = Ellipse(inc, probe.diameter, f)
        names = {"length": "incidence", "width": "transverse"}
        shape = "disc"
    else:
        inc = setups.effective_aperture(probe.length, alpha, beta)
        virtual = Rectangle(inc, probe.width, f)
        names = {"length": "length", "width": "width"}
        shape = "side"
    from .field import last_maximum

    n_virtual = last_maximum(virtual, c_part, bandwidth=0.0, mode="one-way")
    offset = wedge.path * wedge.speed / c_part
    near = None if math.isnan(n_virtual) else n_virtual - offset
    if near is not None and near <= 0:
        warnings.append(
            f"the near field ({_mm(n_virtual)} for the virtual element) ends "
            f"inside the wedge (its path counts as {_mm(offset)} of the part)"
        )
        near = None
    if shape == "disc":  # the disc of the virtual ellipse's area: D² cos(beta) / cos(alpha)
        simple = inc * virtual.width / (4 * wavelength) - offset
        simple_formula = (
            "a disc of the virtual ellipse's area, D²·cos(refracted)/(4λ·cos(incident))"
        )
    else:
        simple = max(inc, probe.width) ** 2 / (4 * wavelength) - offset
        simple_formula = "L²/4λ, L the virtual rectangle's longer side"
    level_list = _levels(levels)
    warnings.extend(_incident_spread_warnings(probe, wedge.speed, r, wave, level_list, mode))
    cache: dict = {}
    computed = (
        None
        if field is None
        else _ComputedWidths(virtual, c_part, offset, level_list, mode, field, cache)
    )
    legs = (1, 2) if thickness is not None else (1,)
    planes, prints = [], []
    for index, (vname, aperture) in enumerate(virtual.planes):
        in_plane = index == 0  # the incidence plane: footprints where the edges cross the depth
        angles = np.degrees(pattern.half_angle(level_list, aperture, wavelength, shape, mode))
        null = float(np.degrees(pattern.first_null(aperture, wavelength, shape)))
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
    beam = BeamResult(
        probe=probe,
        wave=part,
        convention=Convention(mode),
        levels=level_list,
        wavelength=wavelength,
        near_field=near,
        near_field_simple=simple if simple > 0 else None,
        near_field_method="last on-axis maximum of the virtual element in the part, less "
        "the wedge path's equivalent (common practice)",
        near_field_simple_method=f"{simple_formula}, less the wedge path's equivalent",
        near_field_factor=None,
        planes=tuple(planes),
        depths=depth_list,
        warnings=tuple(warnings),
        field=None,
    )
    if field is not None:
        from .beam import FieldSummary

        beam = replace(beam, field=FieldSummary(field, None))
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
        _widths=cache,
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
    disc = isinstance(probe, Disc)
    aperture = probe.diameter if disc else probe.length
    lam = c_wedge / probe.frequency
    angles = pattern.half_angle(levels, aperture, lam, "disc" if disc else "side", mode)
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


def analyse_immersion(
    probe: Disc | Rectangle,
    part: Wave,
    water: WaterPath,
    *,
    focus: Focus | None = None,
    depths=(),
    levels=(6.0, 20.0),
    mode: str = "pulse-echo",
    field: FieldSettings | None = None,
) -> SetupResult:
    """The beam in the part of an immersion probe at normal incidence, optionally focused.

    The water path may be 0 (a focus directly in the couplant with ``part``
    the couplant itself). See the module notes for the model.

    Raises
    ------
    InputError
        A water path below 0 or over 2 m, a focus at or behind the element
        (not beyond its radius), a focus on a rectangle.
    """
    wp = float(water.path)
    if not math.isfinite(wp) or wp < 0 or wp > MAX_WATER_PATH:
        raise InputError(
            f"water path: {wp * 1e3:g} mm is not allowed; give 0 to {MAX_WATER_PATH * 1e3:g} mm"
        )
    c_w, c_p, f = water.speed, part.speed, probe.frequency
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
            equivalent = wp + depth * c_p / c_w
            if focus is not None:  # no far-field row: the flat element's cone does not converge
                if field is not None:
                    spots.extend(
                        _focused_spots(
                            probe,
                            c_w,
                            focus,
                            depth,
                            equivalent,
                            level_list,
                            plane.name,
                            mode,
                            field,
                        )
                    )
                continue
            valid = n_w is None or equivalent >= n_w
            for lv in level_list:
                key = level_key(lv)
                width = None
                if half[key] is not None:
                    width = 2 * (
                        wp * math.tan(math.radians(plane.half_angles[key]))
                        + depth * math.tan(math.radians(half[key]))
                    )
                spots.append(
                    Spot(
                        depth,
                        -lv,
                        width,
                        valid,
                        sound_path=depth,
                        surface_distance=0.0,
                        footprint=width,
                    )
                )
            if field is not None:
                spots.extend(
                    field_spots(
                        probe, c_w, depth, level_list, plane.name, mode, field, at=equivalent
                    )
                )
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
    beam = BeamResult(
        probe=probe,
        wave=part,
        convention=Convention(mode),
        levels=level_list,
        wavelength=c_p / f,
        near_field=near,
        near_field_simple=simple_part,
        near_field_method=method,
        near_field_factor=None,
        planes=tuple(planes),
        depths=depth_list,
        warnings=tuple(warnings),
    )
    if field is not None:
        from .beam import FieldSummary

        beam = replace(beam, field=FieldSummary(field, None))
    return SetupResult(
        beam,
        "focused" if direct else "immersion",
        near_field_in_part=near,
        transmission=transmission,
        focus=focus_result,
        warnings=tuple(warnings),
    )


def _focused_spots(probe, c_water, focus, depth, equivalent, levels, plane, mode, settings):
    """Widths of the focused element's computed field at ``depth`` in the part.

    The field is that in the couplant at the equivalent water path
    ``equivalent`` (m), with the lateral scale unchanged (see the module notes).
    Within one element size of the face the paraxial field does not hold (and
    its quadrature grows without bound): no width is given there.
    """
    from .field import focused_beam_widths

    if equivalent < probe.longest_side:
        return [
            Spot(depth, -lv, None, None, method="field", sound_path=depth, surface_distance=0.0)
            for lv in levels
        ]
    found = focused_beam_widths(
        probe,
        c_water,
        focus.focal_length,
        equivalent,
        levels,
        plane=plane,
        bandwidth=settings.bandwidth,
        mode=mode,
        frequencies=settings.frequencies,
        spectrum=settings.spectrum,
    )
    return straight_field_spots(found, depth)


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
    disc = isinstance(probe, Disc)
    a = 0.5 * (probe.diameter if disc else probe.length)  # the focused aperture
    if not math.isfinite(big_f) or big_f <= a:
        raise InputError(
            f"focus: {big_f * 1e3:g} mm is not allowed; a focal length must lie in "
            f"front of the element, beyond its radius ({a * 1e3:g} mm)"
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
    if disc:
        z = np.linspace(0.02 * big_f, 3.0 * big_f, 20001)
        amp = setups.focused_disc_axial_pressure(z, probe.diameter, big_f, lam) ** power
    else:  # cylindrical, in the length plane: the Fresnel form, from 2 half-lengths out
        z = np.linspace(max(0.02 * big_f, 2.0 * a), 3.0 * big_f, 20001)
        amp = (
            setups.focused_rectangle_axial_pressure(z, probe.length, probe.width, big_f, lam)
            ** power
        )
    if a / big_f > 0.3:
        what = "radius" if disc else "half-length"
        kind = "spherical" if disc else "cylindrical"
        warnings.append(
            f"the {kind} focus is strong ({what} / F = {a / big_f:.2f}): the "
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
    x = float(pattern.pattern_x(level, "disc" if disc else "side", mode))
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
