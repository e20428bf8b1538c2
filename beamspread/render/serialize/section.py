"""The JSON object of ``beamspread section``: the beam on a plate's section and its footprints."""

from __future__ import annotations

import math
from typing import Any

from .beam import beam_to_dict_convention
from .common import conditions_to_dict, field_settings_to_dict, probe_to_dict, wave_to_dict
from .setup import setup_to_dict

__all__ = ["FIELD_REFERENCE", "footprint_rule", "section_rows", "section_to_dict"]

FIELD_REFERENCE = "dB below the largest amplitude across the beam at the same sound path"
_ANGLE_RULE = (
    "where each level's edges, half the full width either side of the axis and across it, "
    "cross the flaw depth (on leg 2 the unfolded depth 2t - d)"
)
_STRAIGHT_RULE = (
    "the level's full width at the flaw depth d on leg 1, and at the unfolded sound path "
    "2t - d on leg 2 (back up after the back wall), half of it either side of the axis"
)


def footprint_rule(result) -> str:
    """How a footprint is read off the beam: where angled edges cross the depth, or straight."""
    return _ANGLE_RULE if result.wedge is not None else _STRAIGHT_RULE


def section_rows(footprints) -> list[dict[str, Any]]:
    """One row per leg and level (sorted so), as the JSON and the table give them."""
    return [
        {
            "leg": p.leg,
            "level_db": -abs(p.level_db),
            "sound_path_m": p.sound_path,
            "surface_distance_m": p.surface_distance,
            "near_m": p.near,
            "far_m": p.far,
            "footprint_m": p.width,
        }
        for p in sorted(footprints, key=lambda p: (p.leg, abs(p.level_db)))
    ]


def section_to_dict(result, thickness, depth, footprints, plane, warnings) -> dict[str, Any]:
    """The JSON object of ``beamspread section`` for a computed technique.

    ``footprints`` are those drawn (one method); ``plane`` the plane's name.
    """
    beam, settings = result.beam, result.settings
    setup = result.setup
    method = "far-field" if settings is None else "field"
    medium = wave_to_dict(result.part.wave)
    medium["longitudinal_m_s"], medium["shear_m_s"] = result.speeds
    data: dict[str, Any] = {
        "probe": probe_to_dict(result.technique.element),
        "medium": medium,
        "convention": {
            **beam_to_dict_convention(beam),
            **({} if settings is None else {"level_reference": FIELD_REFERENCE}),
            "edges": method,
            "footprint_rule": footprint_rule(result),
        },
        "field": None if settings is None else field_settings_to_dict(settings, result.mode),
    }
    beta = result.source.refracted
    if result.wedge is not None:
        w = result.wedge
        skip = 2 * thickness * math.tan(beta)  # full skip along the surface (geometry)
        data["wedge"] = {"name": w.name, "speed_m_s": w.speed, "path_m": w.path}
        data["virtual_element_offset_m"] = setup.offset
    else:
        data["wedge"] = None
        c = result.couplant
        data["couplant"] = (
            None
            if c is None or c.path == 0
            else {
                "name": c.wave.medium,
                "speed_m_s": c.wave.speed,
                "path_m": c.path,
                "conditions": conditions_to_dict(c.wave),
            }
        )
    data["refracted_deg"] = math.degrees(beta)
    data["thickness_m"] = thickness
    data["flaw_depth_m"] = depth
    if result.wedge is not None:
        data["half_skip_m"], data["skip_m"] = skip / 2, skip
    data["edges"] = method
    data["footprints"] = section_rows(footprints)
    if setup is not None:
        data.update(setup_to_dict(setup))
        data["near_field_simple_in_part_m"] = beam.near_field_simple
    else:
        data["near_field_m"] = beam.near_field
        data["near_field_simple_m"] = beam.near_field_simple
    data["near_field_method"] = beam.near_field_method
    data["coupling"] = str(result.coupling)
    data["plane"] = plane
    data["warnings"] = warnings
    return data
