"""The text table of a :class:`beamspread.pipeline.Result` (what ``beamspread beam`` prints)."""

from __future__ import annotations

from .beam import beam_table
from .common import conditions_text
from .setup import setup_lines

__all__ = ["result_table"]


def result_table(result, units: str = "mm") -> str:
    """The human-readable table of a computed technique, with its setup lines and sonar figures."""
    if result.setup is None:
        options = result.sonar.table_options(result.technique.sonar.conventions)
        return beam_table(result.beam, units, **options)
    if result.wedge is not None:
        w = result.wedge
        shown = {"wedge": {"name": w.name, "speed_m_s": w.speed, "path_m": w.path}}
    else:
        c = result.couplant
        shown = {
            "couplant": {
                "name": c.wave.medium,
                "speed_m_s": c.wave.speed,
                "path_m": c.path,
                "at": conditions_text(c.wave),
            }
        }
    return beam_table(result.beam, units, setup=setup_lines(result.setup, shown, units))
