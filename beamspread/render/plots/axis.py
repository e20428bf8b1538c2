"""The on-axis profile: amplitude in dB against depth, with the level crossings."""

from __future__ import annotations

import math
from pathlib import Path
from typing import TYPE_CHECKING

import numpy as np

from ...errors import InputError
from .figure import _PALETTE, _STYLES, FIGSIZE, new_figure, write_figure
from .scales import FLOOR_DB, _db, _length, _level_text, _levels, _mode_text, _scale

if TYPE_CHECKING:
    from matplotlib.axes import Axes
    from matplotlib.figure import Figure


def _crossings(x: np.ndarray, db: np.ndarray, level: float) -> np.ndarray:
    """Where ``db`` crosses ``-level``, linearly interpolated in dB between samples."""
    d = db + level
    idx = np.flatnonzero(np.sign(d[:-1]) * np.sign(d[1:]) < 0)
    exact = x[:-1][d[:-1] == 0.0]
    t = d[idx] / (d[idx] - d[idx + 1])
    return np.sort(np.concatenate([x[idx] + t * (x[idx + 1] - x[idx]), exact]))


def _list(values, units, most=3) -> str:
    shown = [_length(v, units) for v in values[:most]]
    return ", ".join(shown) + (", ..." if len(values) > most else "")


def _checked(profile) -> tuple[np.ndarray, np.ndarray, float]:
    """The profile's depths and amplitudes as arrays, and its largest amplitude."""
    depth = np.asarray(profile.depth, dtype=float)
    amp = np.asarray(profile.amplitude, dtype=float)
    if depth.size < 2 or amp.shape != depth.shape:
        raise InputError("axis: a picture needs at least 2 depths, one amplitude each")
    peak = float(np.abs(amp).max())
    if not peak > 0:
        raise InputError("axis: the amplitude is zero everywhere; there is nothing to draw")
    return depth, amp, peak


def draw_axis(
    ax: Axes,
    profile,
    *,
    near_field: float | None = None,
    axial_maximum: float | None = None,
    levels_db=(6.0,),
    units: str = "mm",
    axis_label: str = "depth on the beam axis",
) -> list:
    """Draw an :class:`~beamspread.field.AxialProfile` in dB into ``ax``; return the legend handles.

    See :func:`plot_axis`; no legend is drawn (the caller places it).
    """
    s, unit = _scale(units)
    depth, amp, peak = _checked(profile)
    db = _db(amp, peak)
    ax.plot(depth * s, db, color=_PALETTE[0], lw=1.5, label="on-axis amplitude")
    marks = (
        (near_field, _PALETTE[1], "--", "near field N = "),
        (axial_maximum, _PALETTE[2], ":", "last on-axis maximum "),
    )
    for where, colour, ls, name in marks:
        if where is not None and math.isfinite(where):
            label = f"{name}{_length(where, units)}"
            ax.axvline(where * s, color=colour, lw=1.1, ls=ls, label=label)
    for i, level in enumerate(_levels(levels_db)):
        where = _crossings(depth, db, level)
        ax.axhline(-level, color="0.6", lw=0.8, ls=_STYLES[(i + 1) % len(_STYLES)])
        if where.size:
            ax.plot(
                where * s,
                np.full(where.size, -level),
                ls="none",
                marker="o",
                ms=5,
                mfc="white",
                mec=_PALETTE[3 + i % 2],
                mew=1.5,
                label=f"{_level_text(level)} crossings: {_list(where, units)}",
            )
    # A little room past both ends, so a crossing at the first or last depth shows whole.
    pad = 0.02 * (depth[-1] - depth[0]) * s
    ax.set_xlim(depth[0] * s - pad, depth[-1] * s + pad)
    ax.set_ylim(FLOOR_DB, 3.0)
    ax.set_xlabel(f"{axis_label}, {unit}")
    ax.set_ylabel(f"dB re the largest on-axis amplitude ({profile.mode})")
    ax.set_title(f"On-axis profile: {_mode_text(profile.mode, profile.bandwidth)}", fontsize=10)
    ax.grid(True, color="0.88", lw=0.6)
    return ax.get_legend_handles_labels()[0]


def axis_figure(
    profile, *, caption: str = "", size: tuple[float, float] = FIGSIZE, **options
) -> Figure:
    """:func:`plot_axis`'s picture as a Figure; ``options`` as for :func:`draw_axis`."""
    fig = new_figure(size, caption=caption)
    ax = fig.add_subplot()
    draw_axis(ax, profile, **options)
    ax.legend(loc="lower right", fontsize=8, framealpha=0.9)
    return fig


def plot_axis(profile, path, **options) -> Path:
    """Draw an :class:`~beamspread.field.AxialProfile` in dB to ``path``; return the path.

    The amplitude is in dB relative to the largest on the profile; the
    near-field length and the last on-axis maximum (m) are vertical lines,
    and every crossing of each level is marked (interpolated linearly in dB
    between samples). ``options``: ``caption`` and ``size`` (:func:`axis_figure`),
    and those of :func:`draw_axis`.
    """
    return write_figure(path, axis_figure, profile, **options)
