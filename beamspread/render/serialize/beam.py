"""JSON and CSV of a beam result and of its sonar figures."""

from __future__ import annotations

import csv
import io
from typing import Any

from ...beam import BeamResult
from .common import _cell, _clean, field_settings_to_dict, probe_to_dict, wave_to_dict


def _spot(spot) -> dict[str, Any]:
    out = {"depth_m": spot.depth, "level_db": spot.level_db, "width_m": spot.width}
    if spot.method == "far-field":
        out["far_field_valid"] = spot.far_field_valid
    out["method"] = spot.method
    out.update(
        {
            "leg": spot.leg,
            "sound_path_m": spot.sound_path,
            "surface_distance_m": spot.surface_distance,
            "footprint_m": spot.footprint,
        }
    )
    return out


def beam_to_dict(result: BeamResult) -> dict[str, Any]:
    """The JSON contract of ``beamspread beam``."""
    probe_dict = probe_to_dict(result.probe)
    planes = [
        {
            "name": plane.name,
            "aperture_m": plane.aperture,
            "half_angle_deg": dict(plane.half_angles),
            "full_angle_deg": {
                key: None if value is None else 2.0 * value
                for key, value in plane.half_angles.items()
            },
            "spots": [_spot(spot) for spot in plane.spots],
        }
        for plane in result.planes
    ]
    return _clean(
        {
            "probe": probe_dict,
            "medium": wave_to_dict(result.wave),
            "convention": beam_to_dict_convention(result),
            "wavelength_m": result.wavelength,
            "near_field_m": result.near_field,
            "near_field_simple_m": result.near_field_simple,
            "near_field_method": result.near_field_method,
            "near_field_simple_method": result.near_field_simple_method,
            "near_field_factor": result.near_field_factor,
            "planes": planes,
            "field": None
            if result.field is None
            else {
                **field_settings_to_dict(result.field.settings, result.convention.mode),
                "width_reference": "between the outermost crossings of the level below the "
                "largest amplitude across the beam at that depth",
                "axial_maximum_m": result.field.axial_maximum,
            },
            "warnings": list(result.warnings),
        }
    )


CSV_COLUMNS = (
    "mode",
    "wavelength_m",
    "near_field_m",
    "plane",
    "aperture_m",
    "level",
    "half_angle_deg",
    "depth_m",
    "width_m",
    "far_field_valid",
    "method",
    "leg",
    "sound_path_m",
    "surface_distance_m",
    "footprint_m",
    "full_angle_deg",
)


def beam_to_csv(result: BeamResult, footprints=()) -> str:
    """CSV of a beam result: one row per plane, level and depth (SI units).

    The first-null row and, without depths, every level row leave the depth
    columns empty. Each footprint on a flat bottom (see
    :func:`beamspread.sonar.figures.sonar_figures`) adds a row whose method is
    "bottom footprint", its depth the water depth.
    """
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(CSV_COLUMNS)
    common = (result.convention.mode, result.wavelength, result.near_field)
    for plane in result.planes:
        rows: dict[str, list] = {}
        for spot in plane.spots:
            rows.setdefault(f"-{abs(spot.level_db):g}", []).append(
                (
                    spot.depth,
                    spot.width,
                    spot.far_field_valid,
                    spot.method,
                    spot.leg,
                    spot.sound_path,
                    spot.surface_distance,
                    spot.footprint,
                )
            )
        for f in footprints:
            if f.plane == plane.name:
                # a straight beam down: the sound path is the depth, the footprint the width
                valid = not f.inside_near_field
                rows.setdefault(f"-{abs(f.level_db):g}", []).append(
                    (f.depth, f.width, valid, "bottom footprint", 1, f.depth, 0.0, f.width)
                )
        for key, angle in plane.half_angles.items():
            head = (*common, plane.name, plane.aperture, key, angle)
            full = None if angle is None else 2.0 * angle
            for tail in rows.get(key) or [(None,) * 8]:
                writer.writerow([_cell(v) for v in (*head, *tail, full)])
    return buffer.getvalue()


def sonar_to_dict(
    result, directivity_index_db, absorption, figures, budgets, sonar: bool
) -> dict[str, Any]:
    """The keys the sonar figures add to the JSON of ``beamspread beam``."""
    out: dict[str, Any] = {"directivity_index_db": directivity_index_db}
    if absorption is not None:
        out["absorption_db_per_km"] = absorption.db_per_km
        out["absorption_source"] = absorption.source
    if sonar:
        out["convention"] = {**beam_to_dict_convention(result), "angle": "full"}
    if figures is not None:
        out["sonar"] = {
            "directivity_factor": figures.directivity_factor,
            "directivity_method": figures.directivity_method,
            "rayleigh_distance_m": figures.rayleigh_distance,
            "side_lobes": [
                {
                    "plane": lobe.plane,
                    "level_db": lobe.level_db,
                    "angle_deg": lobe.angle_deg,
                    "mode": lobe.mode,
                }
                for lobe in figures.side_lobes
            ],
            "equivalent_beam_angle_sr": figures.equivalent_beam_angle_sr,
            "equivalent_beam_angle_db": figures.equivalent_beam_angle_db,
        }
        out["footprints"] = [
            {
                "depth_m": f.depth,
                "level_db": f.level_db,
                "width_m": f.width,
                "plane": f.plane,
                "inside_near_field": f.inside_near_field,
            }
            for f in figures.footprints
        ]
    if budgets is not None:
        out["echo_budget"] = [
            {
                "range_m": b.range_m,
                "power_w": b.power_w,
                "efficiency": b.efficiency,
                "bottom_loss_db": b.bottom_loss.value_db,
                "terms": [
                    {
                        "name": t.name,
                        "value_db": t.value_db,
                        "formula": t.formula,
                        "reference": t.reference,
                    }
                    for t in b.terms
                ],
            }
            for b in budgets
        ]
    return _clean(out)


def beam_to_dict_convention(result) -> dict[str, Any]:
    return {
        "mode": result.convention.mode,
        "angle": result.convention.angle,
        "levels_db": [-level for level in result.levels],
        "level_reference": result.convention.reference,
    }
