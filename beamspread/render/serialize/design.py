"""JSON and CSV of a sized probe."""

from __future__ import annotations

from typing import Any

from .common import _clean, _csv, wave_to_dict


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
    if found.other_side is None:  # a disc: one size
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
