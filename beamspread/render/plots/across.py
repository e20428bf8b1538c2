"""Transverse profiles: amplitude in dB across the beam at one depth, one panel per plane."""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from pathlib import Path
from typing import TYPE_CHECKING

import numpy as np

from ...errors import InputError
from .figure import _PALETTE, FIGSIZE, new_figure, write_figure
from .scales import FLOOR_DB, _db, _length, _level_text, _mode_text, _scale

if TYPE_CHECKING:
    from matplotlib.axes import Axes
    from matplotlib.figure import Figure


def draw_across(ax: Axes, profile, widths: Sequence = (), *, units: str = "mm") -> list:
    """Draw one :class:`~beamspread.field.TransverseProfile` in dB into ``ax``.

    Each :class:`~beamspread.field.BeamWidth` of ``widths`` is marked at its
    level from -width/2 to +width/2. No legend is drawn; returns its handles.
    """
    s, unit = _scale(units)
    offset = np.asarray(profile.offset, dtype=float)
    amp = np.asarray(profile.amplitude, dtype=float)
    order = np.argsort(offset)
    offset, amp = offset[order], amp[order]
    peak = float(np.abs(amp).max()) if amp.size else 0.0
    if offset.size < 2 or not peak > 0:
        raise InputError(
            f"across: the {profile.plane} profile needs at least 2 offsets and some amplitude"
        )
    ax.plot(offset * s, _db(amp, peak), color=_PALETTE[0], lw=1.5, label="amplitude")
    for i, w in enumerate(widths):
        colour = _PALETTE[1 + i % (len(_PALETTE) - 1)]
        level = abs(w.level_db)
        ax.axhline(-level, color="0.65", lw=0.8, ls=":")
        if w.width is None or not math.isfinite(w.width):
            ax.plot([], [], ls="none", label=f"{_level_text(level)}: not reached")
            continue
        half = 0.5 * w.width * s
        ax.plot(
            [-half, half],
            [-level, -level],
            color=colour,
            lw=1.2,
            marker="|",
            ms=12,
            mew=1.8,
            label=f"{_level_text(level)} width {_length(w.width, units)}",
        )
    ax.set_xlim(offset[0] * s, offset[-1] * s)
    ax.set_ylim(FLOOR_DB, 3.0)
    ax.set_xlabel(f"offset in the {profile.plane} plane, {unit}")
    ax.set_title(f"{profile.plane} plane at depth {_length(profile.depth, units)}", fontsize=9)
    ax.grid(True, color="0.88", lw=0.6)
    return ax.get_legend_handles_labels()[0]


def across_figure(
    profiles,
    widths: Mapping[str, Sequence] | None = None,
    *,
    caption: str = "",
    units: str = "mm",
    size: tuple[float, float] = FIGSIZE,
) -> Figure:
    """:func:`plot_across`'s picture as a Figure."""
    _scale(units)
    profiles = list(profiles)
    if not profiles:
        raise InputError("across: give at least one transverse profile")
    widths = dict(widths or {})
    fig = new_figure(size, caption=caption)
    axes = fig.subplots(1, len(profiles), sharey=True, squeeze=False)[0]
    for ax, profile in zip(axes, profiles, strict=True):
        draw_across(ax, profile, widths.get(profile.plane, ()), units=units)
        ax.legend(loc="lower center", fontsize=7.5, framealpha=0.9)
    first = profiles[0]
    axes[0].set_ylabel(f"dB re the maximum at this depth ({first.mode})")
    if len(profiles) > 1:
        fig.suptitle(f"Across the beam: {_mode_text(first.mode, first.bandwidth)}", fontsize=10)
    else:
        axes[0].set_title(
            f"Across the beam, {first.plane} plane at depth "
            f"{_length(first.depth, units)}: "
            f"{_mode_text(first.mode, first.bandwidth)}",
            fontsize=10,
        )
    return fig


def plot_across(
    profiles, widths: Mapping[str, Sequence] | None, path, *, caption: str = "", units: str = "mm"
) -> Path:
    """Draw transverse profiles in dB, one panel per plane, to ``path``; return the path.

    Parameters
    ----------
    profiles : list of TransverseProfile
        From :func:`beamspread.field.transverse_profile`, one per plane.
    widths : dict
        Plane name -> list of :class:`~beamspread.field.BeamWidth` at that
        depth; each is marked at its level from -width/2 to +width/2.
    """
    return write_figure(path, across_figure, profiles, widths, caption=caption, units=units)
