"""JSON, CSV and NPZ of the computed field: axial and transverse profiles, field maps."""

from __future__ import annotations

import json
from typing import Any

from .common import (
    _clean,
    _csv,
    _db,
    amplitude_unit,
    field_settings_to_dict,
    probe_to_dict,
    wave_to_dict,
)


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


def _map_head(probe, wave, settings, mode, field_map) -> dict[str, Any]:
    """What a map's JSON and its ``.npz`` metadata both start with: what was computed, and how."""
    return {
        "probe": probe_to_dict(probe),
        "medium": wave_to_dict(wave),
        "field": field_settings_to_dict(settings, mode),
        "plane": field_map.plane,
        "amplitude_unit": amplitude_unit(mode),
        "level_reference": "dB relative to the largest amplitude of the map",
    }


def map_to_dict(probe, wave, settings, mode, field_map, warnings) -> dict[str, Any]:
    """The JSON form of ``beamspread map``: amplitude[i][j] at depth_m[i], lateral_m[j]."""
    peak = float(field_map.amplitude.max())
    return _clean(
        _map_head(probe, wave, settings, mode, field_map)
        | {
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
    meta = _map_head(probe, wave, settings, mode, field_map)
    np.savez_compressed(
        path,
        depth_m=field_map.depth,
        lateral_m=field_map.lateral,
        amplitude=field_map.amplitude.astype(np.float32),
        level_db=level,
        metadata=np.array(json.dumps(_clean(meta))),
    )
