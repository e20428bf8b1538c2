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

__all__ = ["beam_to_csv", "beam_to_dict", "dumps", "unit_suffix", "wave_to_dict"]

_SUFFIX = {"degC": "c", "g/kg": "g_kg", "m": "m", "dbar": "dbar", "%": "percent", "m/s": "m_s",
           "kg/m3": "kg_m3", "": ""}


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


def wave_to_dict(wave: Wave) -> dict[str, Any]:
    """The ``medium`` object of the JSON contract."""
    out: dict[str, Any] = {
        "name": wave.medium,
        "wave": wave.wave,
        "speed_m_s": wave.speed,
        "source": wave.source,
        "state": wave.state,
        "conditions": {
            _key(name, wave.condition_units.get(name, "")): value
            for name, value in wave.conditions.items()
        },
    }
    if wave.density is not None:
        out["density_kg_m3"] = wave.density
        out["impedance_rayl"] = wave.density * wave.speed
    return out


def beam_to_dict(result: BeamResult) -> dict[str, Any]:
    """The JSON contract of ``beamspread beam``."""
    probe = result.probe
    if isinstance(probe, Disc):
        probe_dict = {"shape": "disc", "diameter_m": probe.diameter}
    else:
        probe_dict = {"shape": "rectangle", "length_m": probe.length, "width_m": probe.width}
    probe_dict["frequency_hz"] = probe.frequency
    planes = [
        {
            "name": plane.name,
            "aperture_m": plane.aperture,
            "half_angle_deg": dict(plane.half_angles),
            "spots": [
                {
                    "depth_m": spot.depth,
                    "level_db": spot.level_db,
                    "width_m": spot.width,
                    "far_field_valid": spot.far_field_valid,
                    "method": spot.method,
                }
                for spot in plane.spots
            ],
        }
        for plane in result.planes
    ]
    return _clean(
        {
            "probe": probe_dict,
            "medium": wave_to_dict(result.wave),
            "convention": {
                "mode": result.convention.mode,
                "angle": result.convention.angle,
                "levels_db": [-level for level in result.levels],
                "level_reference": result.convention.reference,
            },
            "wavelength_m": result.wavelength,
            "near_field_m": result.near_field,
            "near_field_simple_m": result.near_field_simple,
            "near_field_method": result.near_field_method,
            "near_field_factor": result.near_field_factor,
            "planes": planes,
            "warnings": list(result.warnings),
        }
    )


def dumps(data: Any) -> str:
    """JSON text as beamspread writes it: indented, no NaN allowed."""
    return json.dumps(data, indent=2, allow_nan=False)


CSV_COLUMNS = (
    "mode", "wavelength_m", "near_field_m", "plane", "aperture_m", "level", "half_angle_deg",
    "depth_m", "width_m", "far_field_valid", "method",
)


def _cell(value: Any) -> Any:
    if value is None:
        return ""
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, float):
        return repr(value)
    return value


def beam_to_csv(result: BeamResult) -> str:
    """CSV of a beam result: one row per plane, level and depth (SI units).

    The first-null row and, without depths, every level row leave the depth
    columns empty.
    """
    buffer = io.StringIO()
    writer = csv.writer(buffer, lineterminator="\n")
    writer.writerow(CSV_COLUMNS)
    common = (result.convention.mode, result.wavelength, result.near_field)
    for plane in result.planes:
        spots = {}
        for spot in plane.spots:
            spots.setdefault(f"-{abs(spot.level_db):g}", []).append(spot)
        for key, angle in plane.half_angles.items():
            head = (*common, plane.name, plane.aperture, key, angle)
            rows = spots.get(key) or [None]
            for spot in rows:
                tail = (
                    ("", "", "", "") if spot is None
                    else (spot.depth, spot.width, spot.far_field_valid, spot.method)
                )
                writer.writerow([_cell(v) for v in (*head, *tail)])
    return buffer.getvalue()
