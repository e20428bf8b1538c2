"""The text table of a :class:`beamspread.pipeline.Result` (what ``beamspread beam`` prints)."""

from __future__ import annotations

from .beam import beam_table
from .common import conditions_text
from .setup import setup_lines

__all__ = ["result_table", "setup_shown"]


def result_table(result, units: str = "mm") -> str:
    """The human-readable table of a computed technique, with its setup lines and sonar figures."""
    if result.setup is None:
        options = result.sonar.table_options(result.technique.sonar.conventions)
        return beam_table(result.beam, units, **options)
    shown = setup_lines(result.setup, setup_shown(result), units)
    return beam_table(result.beam, units, setup=shown)


def setup_shown(result) -> dict:
    """The wedge or couplant as :func:`~beamspread.render.text.setup.setup_lines` names it."""
    if result.wedge is not None:
        w = result.wedge
        return {"wedge": {"name": w.name, "speed_m_s": w.speed, "path_m": w.path}}
    c = result.couplant
    return {
        "couplant": {
            "name": c.wave.medium,
            "speed_m_s": c.wave.speed,
            "path_m": c.path,
            "at": conditions_text(c.wave),
        }
    }
