"""The sonar results beside a bare transducer's beam: directivity index, figures, echo budget.

:func:`beamspread.compute` calls :func:`sonar_results` for a technique in
contact with water or air, so every command and the report page carry the same
figures.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from ..errors import InputError


@dataclass(frozen=True)
class SonarResults:
    """The sonar side of a beam: its directivity index, absorption, figures and budgets.

    ``figures`` (:class:`beamspread.sonar.SonarFigures`) and ``budgets`` (one
    :class:`beamspread.sonar.EchoBudget` per bottom depth) are None unless sonar
    work was asked for (``--sonar``, a bottom depth or a power).
    """

    directivity_index_db: float
    absorption: Any  # beamspread.media.quantities.Absorption, or None
    figures: Any
    budgets: list | None

    def table_options(self, sonar: bool) -> dict[str, Any]:
        """The keyword arguments of :func:`beamspread.render.text.beam.beam_table`.

        The directivity index and the absorption are shown with the sonar
        figures only: they belong to sonar work.
        """
        shown = self.figures is not None
        return {
            "di": self.directivity_index_db if shown else None,
            "absorption": self.absorption if shown else None,
            "figures": self.figures,
            "budgets": self.budgets,
            "sonar": sonar,
        }

    def footprint_widths(self, result) -> tuple[list[float], dict[float, list]]:
        """What the footprint picture draws: the bottom depths (m) and, per level in dB
        down, the first plane's full footprint width at each (m, None where none)."""
        footprints = self.figures.footprints if self.figures is not None else ()
        depths = sorted({f.depth for f in footprints})
        first = result.planes[0].name
        by_level: dict[float, list] = {}
        for f in footprints:
            if f.plane == first:
                by_level.setdefault(-f.level_db, []).append(f.width)
        return depths, by_level


def bottom_list(groups) -> list[float]:
    """The bottom depths of the repeatable ``--bottom-depth`` (each a depth or a range),
    sorted, each once."""
    return sorted({d for group in groups for d in group})


def sonar_results(
    result, resolved, bottoms, *, sonar, power, efficiency, bottom_loss, warnings
) -> SonarResults:
    """The directivity index, the absorption and, for sonar work, the figures and budgets.

    Parameters
    ----------
    result : BeamResult
        The analysed beam (with the sonar levels and mode where ``sonar``).
    resolved : beamspread.media.resolve.Resolved
        The medium and wave.
    bottoms : list of float
        Bottom depths, m (see :func:`bottom_list`).
    power : float or None
        Electrical power, W: an echo budget at each bottom depth.
    efficiency, bottom_loss : float
        The budget's electro-acoustic efficiency and the bottom's loss, dB.
    warnings : list of str
        Appended to: the absorption's own, and what the figures and budgets assume.

    Raises
    ------
    InputError
        An echo budget in a gas.
    """
    from .directivity import directivity_index

    absorption = resolved.absorption(result.probe.frequency)
    if absorption is not None:
        warnings.extend(absorption.warnings)
    figures = budgets = None
    if sonar or bottoms or power is not None:
        figures, budgets = _figures(
            result, resolved, bottoms, absorption, power, efficiency, bottom_loss, warnings
        )
    di = (
        figures.directivity_index_db
        if figures
        else directivity_index(result.probe, result.wavelength)
    )
    return SonarResults(di, absorption, figures, budgets)


def _figures(result, resolved, bottoms, absorption, power, efficiency, bottom_loss, warnings):
    """The sonar figures and, with a power, an echo budget at each bottom depth."""
    from .echo import echo_budget, source_level_constant
    from .figures import sonar_figures

    alpha = None if absorption is None else absorption.db_per_km
    figures = sonar_figures(result, bottom_depths=bottoms, absorption_db_per_km=alpha)
    if any(f.inside_near_field for f in figures.footprints):
        warnings.append(
            "a bottom depth lies inside the near field: the far-field cone does not hold there"
        )
    budgets = None
    if power is not None:
        wave = resolved.wave
        if wave.state == "gas":
            raise InputError(f"the echo budget (dB re 1 uPa) is for water; {wave.medium} is a gas")
        if wave.density is None:
            constant = 170.8
            warnings.append(
                "echo budget: no density for this medium; the seawater "
                "source-level constant 170.8 dB is used"
            )
        else:
            constant = source_level_constant(wave.density * wave.speed)
        if alpha is None:
            warnings.append("echo budget: this medium has no absorption; taken as 0")
        budgets = [
            echo_budget(
                power=power,
                efficiency=efficiency,
                directivity_index_db=figures.directivity_index_db,
                range_m=depth,
                absorption_db_per_km=alpha or 0.0,
                bottom_loss_db=bottom_loss,
                constant=constant,
            )
            for depth in bottoms
        ]
    return figures, budgets
