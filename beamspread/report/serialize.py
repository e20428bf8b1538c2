"""JSON and CSV forms of results: SI values, unit-suffixed keys.

The JSON form of a beam result is a contract that scripts rely on; it is
documented in README.md ("JSON output") and checked by the tests.
"""

from __future__ import annotations

import csv
import io
import json
import math
from typing import Any

from ..beam import BeamResult
from ..media.model import Wave
from ..probes import Disc

__all__ = [
    "beam_to_csv",
    "beam_to_dict",
    "conditions_to_dict",
    "design_to_csv",
    "dumps",
    "field_settings_to_dict",
    "scan_plan_to_csv",
    "section_to_csv",
    "sonar_to_dict",
    "unit_suffix",
    "wave_to_dict",
]

_SUFFIX = {
    "degC": "c",
    "g/kg": "g_kg",
    "m": "m",
    "dbar": "dbar",
    "%": "percent",
    "m/s": "m_s",
    "kg/m3": "kg_m3",
    "": "",
}


def unit_suffix(unit: str) -> str:
    """The key suffix of a unit: "degC" -> "c", "g/kg" -> "g_kg"."""
    return _SUFFIX.get(unit, unit.replace("/", "_").replace(" ", "_").lower())


def _key(name: str, unit: str) -> str:
    suffix = unit_suffix(unit)
    return f"{name}_{suffix}" if suffix else name


def _clean(value: Any) -> Any:
    """Floats that are not finite become None, so the JSON never holds NaN."""
    if isinstance(value, float) and not math.isfinite(value):
        return None
    if isinstance(value, dict):
        return {k: _clean(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [_clean(v) for v in value]
    return value


def conditions_to_dict(wave: Wave) -> dict[str, float]:
    """A wave's conditions keyed with their units: ``{"temperature_c": 12.0}``."""
    return {
        _key(name, wave.condition_units.get(name, "")): value
        for name, value in wave.conditions.items()
    }


def wave_to_dict(wave: Wave) -> dict[str, Any]:
    """The ``medium`` object of the JSON contract."""
    out: dict[str, Any] = {
        "name": wave.medium,
        "wave": wave.wave,
        "speed_m_s": wave.speed,
        "source": wave.source,
        "state": wave.state,
        "conditions": conditions_to_dict(wave),
    }
    if wave.density is not None:
        out["density_kg_m3"] = wave.density
        out["impedance_rayl"] = wave.density * wave.speed
    return out


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


def field_settings_to_dict(settings, mode: str) -> dict[str, Any]:
    """How a computed field was formed: the ``field`` object of the JSON forms."""
    return {
        "mode": mode,
        "bandwidth": settings.bandwidth,
        "spectrum": settings.spectrum if settings.bandwidth > 0 else "continuous wave",
        "frequencies": settings.frequencies if settings.bandwidth > 0 else 1,
        "amplitude": settings.amplitude,
    }


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


def dumps(data: Any) -> str:
    """JSON text as beamspread writes it: indented, no NaN allowed."""
    return json.dumps(data, indent=2, allow_nan=False)


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


def _cell(value: Any) -> Any:
    if value is None:
        return ""
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, float):
        return repr(value)
    return value


def beam_to_csv(result: BeamResult, footprints=()) -> str:
    """CSV of a beam result: one row per plane, level and depth (SI units).

    The first-null row and, without depths, every level row leave the depth
    columns empty. Each footprint on a flat bottom (see
    :func:`beamspread.sonar.sonar_figures`) adds a row whose method is
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


def design_to_csv(found, wave) -> str:
    """CSV of ``beamspread size``: a header and one row (SI units, named as the JSON keys)."""
    data = design_to_dict(found, wave, [])
    row = {
        "medium": wave.medium,
        "wave": wave.wave,
        "speed_m_s": wave.speed,
        "mode": found.mode,
        "level_db": found.level_db,
        **{k: v for k, v in data.items() if k not in ("medium", "convention", "warnings")},
    }
    return _csv(tuple(row), [tuple(row.values())])


def probe_to_dict(probe) -> dict[str, Any]:
    """The ``probe`` object of the JSON forms."""
    if isinstance(probe, Disc):
        out: dict[str, Any] = {"shape": "disc", "diameter_m": probe.diameter}
    else:
        out = {"shape": "rectangle", "length_m": probe.length, "width_m": probe.width}
    out["frequency_hz"] = probe.frequency
    return out


def amplitude_unit(mode: str) -> str:
    return "(rho c U0)^2" if mode == "pulse-echo" else "rho c U0"


def _db(amplitude, reference: float):
    import numpy as np

    with np.errstate(divide="ignore"):
        level = 20.0 * np.log10(np.asarray(amplitude) / reference)
    return [None if not math.isfinite(v) else float(v) for v in level]


def axial_to_dict(
    probe, wave, settings, mode, profile, near_field, near_simple, axial_max, warnings
) -> dict[str, Any]:
    """The JSON form of ``beamspread axis``."""
    peak = float(profile.amplitude.max())
    return _clean(
        {
            "probe": probe_to_dict(probe),
            "medium": wave_to_dict(wave),
            "field": field_settings_to_dict(settings, mode),
            "near_field_m": near_field,
            "near_field_simple_m": near_simple,
            "axial_maximum_m": axial_max,
            "amplitude_unit": amplitude_unit(mode),
            "level_reference": "dB relative to the largest amplitude of the profile",
            "profile": {
                "depth_m": profile.depth.tolist(),
                "amplitude": profile.amplitude.tolist(),
                "level_db": _db(profile.amplitude, peak),
            },
            "warnings": list(warnings),
        }
    )


def axial_to_csv(profile) -> str:
    peak = float(profile.amplitude.max())
    rows = zip(
        profile.depth.tolist(),
        profile.amplitude.tolist(),
        _db(profile.amplitude, peak),
        strict=True,
    )
    return _csv(("depth_m", "amplitude", "level_db"), rows)


def across_to_dict(
    probe, wave, settings, mode, depth, profiles, widths, warnings
) -> dict[str, Any]:
    """The JSON form of ``beamspread across``: one entry per plane."""
    planes = []
    for profile in profiles:
        peak = float(profile.amplitude.max())
        planes.append(
            {
                "name": profile.plane,
                "offset_m": profile.offset.tolist(),
                "amplitude": profile.amplitude.tolist(),
                "level_db": _db(profile.amplitude, peak),
                "widths": [
                    {"level_db": -w.level_db, "width_m": w.width} for w in widths[profile.plane]
                ],
            }
        )
    return _clean(
        {
            "probe": probe_to_dict(probe),
            "medium": wave_to_dict(wave),
            "field": field_settings_to_dict(settings, mode),
            "depth_m": depth,
            "amplitude_unit": amplitude_unit(mode),
            "level_reference": "dB relative to the largest amplitude across the beam at this depth",
            "planes": planes,
            "warnings": list(warnings),
        }
    )


def across_to_csv(profiles) -> str:
    rows = []
    for profile in profiles:
        peak = float(profile.amplitude.max())
        rows.extend(
            (profile.plane, o, a, d)
            for o, a, d in zip(
                profile.offset.tolist(),
                profile.amplitude.tolist(),
                _db(profile.amplitude, peak),
                strict=True,
            )
        )
    return _csv(("plane", "offset_m", "amplitude", "level_db"), rows)


def map_to_dict(probe, wave, settings, mode, field_map, warnings) -> dict[str, Any]:
    """The JSON form of ``beamspread map``: amplitude[i][j] at depth_m[i], lateral_m[j]."""
    peak = float(field_map.amplitude.max())
    return _clean(
        {
            "probe": probe_to_dict(probe),
            "medium": wave_to_dict(wave),
            "field": field_settings_to_dict(settings, mode),
            "plane": field_map.plane,
            "amplitude_unit": amplitude_unit(mode),
            "level_reference": "dB relative to the largest amplitude of the map",
            "depth_m": field_map.depth.tolist(),
            "lateral_m": field_map.lateral.tolist(),
            "amplitude": field_map.amplitude.astype(float).tolist(),
            "warnings": list(warnings),
        }
        | {"peak_amplitude": peak}
    )


def map_to_csv(field_map) -> str:
    """Long form: one row per point, depth then lateral offset."""
    peak = float(field_map.amplitude.max())
    rows = []
    for i, z in enumerate(field_map.depth.tolist()):
        amps = field_map.amplitude[i].astype(float)
        rows.extend(
            (z, x, a, d)
            for x, a, d in zip(
                field_map.lateral.tolist(), amps.tolist(), _db(amps, peak), strict=True
            )
        )
    return _csv(("depth_m", "lateral_m", "amplitude", "level_db"), rows)


def map_to_npz(path, probe, wave, settings, mode, field_map) -> None:
    """Write a map as ``.npz``: arrays depth_m, lateral_m, amplitude, level_db, and metadata."""
    import numpy as np

    peak = float(field_map.amplitude.max())
    with np.errstate(divide="ignore"):
        level = (20.0 * np.log10(field_map.amplitude / peak)).astype(np.float32)
    meta = {
        "probe": probe_to_dict(probe),
        "medium": wave_to_dict(wave),
        "field": field_settings_to_dict(settings, mode),
        "plane": field_map.plane,
        "amplitude_unit": amplitude_unit(mode),
        "level_reference": "dB relative to the largest amplitude of the map",
    }
    np.savez_compressed(
        path,
        depth_m=field_map.depth,
        lateral_m=field_map.lateral,
        amplitude=field_map.amplitude.astype(np.float32),
        level_db=level,
        metadata=np.array(json.dumps(_clean(meta))),
    )


def _csv(header, rows) -> str:
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(header)
    for row in rows:
        writer.writerow([_cell(v) for v in row])
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


def design_to_dict(found, wave, warnings) -> dict[str, Any]:
    """The JSON form of ``beamspread size``."""
    out: dict[str, Any] = {
        "solved": found.solved,
        "shape": found.shape,
        "medium": wave_to_dict(wave),
        "convention": {"mode": found.mode, "level_db": found.level_db},
        "frequency_hz": float(found.frequency),
        "wavelength_m": float(found.wavelength),
    }
    if found.shape == "disc":
        out["diameter_m"] = float(found.aperture)
    else:
        out["side_m"] = float(found.aperture)
        out["other_side_m"] = float(found.other_side)
        out["other_half_angle_deg"] = float(found.other_half_angle_deg)
    out.update(
        {
            "half_angle_deg": float(found.half_angle_deg),
            "full_angle_deg": float(found.full_angle_deg),
            "near_field_m": float(found.near_field),
            "directivity_index_db": float(found.directivity_index_db),
            "depth_m": float(found.depth),
            "footprint_m": float(found.footprint_width),
            "far_field_at_depth": (
                bool(found.far_field_at_depth) if found.depth == found.depth else None
            ),
            "warnings": list(warnings),
        }
    )
    return _clean(out)


def setup_to_dict(setup) -> dict[str, Any]:
    """The keys an inspection setup adds to the JSON of ``beamspread beam``."""
    import math

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

    ``footprints`` are :class:`beamspread.inspection.WedgeFootprint`; ``near_m``
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
    """CSV of ``beamspread index-step``: one row per depth considered (SI units).

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
