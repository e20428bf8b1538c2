"""The JSON object of a :class:`beamspread.pipeline.Result` (``beamspread beam --json``)."""

from __future__ import annotations

import math
from typing import Any

from .beam import beam_to_dict, sonar_to_dict
from .common import conditions_to_dict, probe_to_dict
from .setup import setup_to_dict

__all__ = ["result_to_dict"]


def result_to_dict(result) -> dict[str, Any]:
    """The JSON contract of ``beamspread beam`` for a computed technique."""
    data = beam_to_dict(result.beam)
    if result.setup is None:
        if result.part.medium is not None:
            data["medium"]["longitudinal_m_s"], data["medium"]["shear_m_s"] = result.speeds
        data["warnings"] = list(result.warnings)
        sr = result.sonar
        data.update(
            sonar_to_dict(
                result.beam,
                sr.directivity_index_db,
                sr.absorption,
                sr.figures,
                sr.budgets,
                result.technique.sonar.conventions,
            )
        )
        return data
    data["medium"]["longitudinal_m_s"], data["medium"]["shear_m_s"] = result.speeds
    data.update(setup_to_dict(result.setup))
    if result.wedge is not None:
        w = result.wedge
        data["wedge"] = {"name": w.name, "speed_m_s": w.speed, "path_m": w.path}
    else:
        c = result.couplant
        data["couplant"] = {
            "name": c.wave.medium,
            "speed_m_s": c.wave.speed,
            "path_m": c.path,
            "conditions": conditions_to_dict(c.wave),
        }
    data["warnings"] = list(result.warnings)
    return data


def source_to_dict(result) -> dict[str, Any]:
    """Where a field command's profile or map lies in the part, beyond a flat contact probe.

    The computed field is that of ``element`` radiating into the medium of
    ``speed_m_s``; the coordinate (a depth, or a sound path along the refracted
    axis) ``c`` lies at the range ``start_m + stretch * c`` from it.
    """
    s = result.source
    return {
        "coupling": str(result.coupling),
        "coordinate": s.coordinate,
        "element": probe_to_dict(s.element),
        "speed_m_s": s.speed,
        "start_m": s.start,
        "stretch": s.stretch,
        "focus_m": s.focus,
        "refracted_deg": math.degrees(s.refracted),
    }
