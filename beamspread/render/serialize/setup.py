"""JSON and CSV of a wedge or immersion set-up, its section footprints and its scan plan."""

from __future__ import annotations

import math
from typing import Any

from .common import _clean, _csv


def setup_to_dict(setup) -> dict[str, Any]:
    """The keys an inspection setup adds to the JSON of ``beamspread beam``."""

    def deg(rad):
        return None if rad is None else math.degrees(rad)

    out: dict[str, Any] = {"setup": setup.setup, "near_field_in_part_m": setup.near_field_in_part}
    r = setup.refraction
    if r is not None:
        out["refraction"] = {
            "incident_deg": deg(r.incident),
            "refracted_deg": {"longitudinal": deg(r.longitudinal), "shear": deg(r.shear)},
            "critical_deg": {"first": deg(r.first_critical), "second": deg(r.second_critical)},
        }
        out["effective_aperture_m"] = setup.effective_aperture
    if setup.transmission is not None:
        out["transmission_coefficient"] = setup.transmission
    f = setup.focus
    if f is not None:
        out["focus"] = {
            "normalised_focal_length": f.normalised_focal_length,
            "axial_maximum_m": f.axial_maximum,
            "axial_maximum_in_part_m": f.axial_maximum_in_part,
            "focal_depth_in_part_m": f.focal_depth_in_part,
            "spot_width_m": f.spot_width,
            "zone_m": None if f.zone is None else list(f.zone),
            "zone_in_part_m": None if f.zone_in_part is None else list(f.zone_in_part),
            "zone_rule_of_thumb_m": f.zone_rule_of_thumb,
            "paraxial_poor": f.paraxial_poor,
            "width_method": "computed field only: the paraxial (Fresnel) field of the focused "
            "element at the equivalent water path (water path + depth c_part / c_water); no "
            "far-field width, the flat element's cone does not describe a converging beam",
        }
    return _clean(out)


SECTION_CSV_COLUMNS = (
    "mode",
    "method",
    "leg",
    "level_db",
    "depth_m",
    "sound_path_m",
    "surface_distance_m",
    "near_m",
    "far_m",
    "footprint_m",
    "near_sound_path_m",
    "far_sound_path_m",
)


def section_to_csv(footprints, mode: str) -> str:
    """CSV of ``beamspread section``: one row per leg and level footprint (SI units).

    ``footprints`` are :class:`beamspread.coupling.result.WedgeFootprint`; ``near_m``
    and ``far_m`` are where the level's edges cross the flaw depth, along the
    surface from the exit point, empty where an edge does not reach it.
    """
    rows = [
        (
            mode,
            p.method,
            p.leg,
            -abs(p.level_db),
            p.depth,
            p.sound_path,
            p.surface_distance,
            p.near,
            p.far,
            p.width,
            p.near_path,
            p.far_path,
        )
        for p in sorted(footprints, key=lambda p: (p.leg, abs(p.level_db)))
    ]
    return _csv(SECTION_CSV_COLUMNS, rows)


SCAN_PLAN_CSV_COLUMNS = (
    "depth_m",
    "width_m",
    "far_field_valid",
    "governing",
    "index_step_m",
    "overlap",
    "level_db",
    "plane",
    "method",
    "mode",
)


def scan_plan_to_csv(plan, mode: str) -> str:
    """CSV of ``beamspread scan-plan``: one row per depth considered (SI units).

    Each row gives the width there, whether a far-field width holds there
    (empty for computed widths), whether it is the narrowest that sets the
    step, and the plan's index step, overlap, level, plane, method and mode.
    """
    valid = plan.far_field_valid or (None,) * len(plan.depths)
    level = None if plan.level_db is None else -abs(plan.level_db)
    rows = [
        (
            depth,
            width,
            ok,
            depth == plan.governing_depth,
            plan.index_step,
            plan.overlap,
            level,
            plan.plane,
            plan.method,
            mode,
        )
        for depth, width, ok in zip(plan.depths, plan.widths, valid, strict=True)
    ]
    return _csv(SCAN_PLAN_CSV_COLUMNS, rows)
