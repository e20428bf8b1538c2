"""The sonar cone: the footprint's full width on a flat bottom (or surface) against depth."""

from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from pathlib import Path
from typing import TYPE_CHECKING, Any

import numpy as np

from ...errors import InputError
from .figure import _PALETTE, _STYLES, FIGSIZE, new_figure, write_figure
from .scales import _length, _level_text, _scale

if TYPE_CHECKING:
    from matplotlib.axes import Axes
    from matplotlib.figure import Figure


def draw_footprint(
    ax: Axes,
    depths: Sequence[float],
    widths_by_level: Mapping[Any, Sequence],
    *,
    near_field: float | None = None,
    mode: str = "one-way",
    units: str = "m",
    in_air: bool = False,
    legend: bool = True,
) -> list:
    """Draw the cone and its footprint widths into ``ax``; return the legend handles.

    See :func:`plot_footprint` for the parameters. With ``legend`` the legend
    goes below the plot, in two columns; without it the caller places one.
    The widths at a few depths are labelled beside the cone last, with the
    figure's layout as it then stands (see :func:`_width_labels`).
    """
    s, unit = _scale(units, ("m", "ft", "mm", "in"))
    depth = np.asarray([float(d) for d in depths], dtype=float)
    if depth.size < 1 or np.any(~np.isfinite(depth)) or np.any(depth <= 0):
        raise InputError("footprint: give at least one water depth, each above 0")
    order = np.argsort(depth)
    depth = depth[order]
    widest = 0.0
    labelled = np.unique(np.linspace(0, depth.size - 1, min(depth.size, 6)).round().astype(int))
    notes: dict[int, list[tuple[str, str, float]]] = {}  # depth index -> (text, colour, half)
    for i, (key, values) in enumerate(dict(widths_by_level).items()):
        width = np.array([np.nan if v is None else float(v) for v in values])
        if width.size != depth.size:
            raise InputError(f"footprint: {width.size} widths for {key!r} but {depth.size} depths")
        width = width[order]
        label = _level_text(key) if isinstance(key, (int, float)) else str(key)
        colour = _PALETTE[i % len(_PALETTE)]
        half = 0.5 * width * s
        zs = np.concatenate([[0.0], depth * s])
        hs = np.concatenate([[0.0], half])
        ax.plot(hs, zs, color=colour, lw=1.4, ls=_STYLES[i % 4], label=label)
        ax.plot(-hs, zs, color=colour, lw=1.4, ls=_STYLES[i % 4])
        if i == 0:
            ax.fill_betweenx(zs, -hs, hs, color=colour, alpha=0.1, lw=0)
        for j in labelled:
            if not math.isfinite(width[j]):
                continue
            ax.plot(
                [-half[j], half[j]],
                [depth[j] * s] * 2,
                color=colour,
                ls="none",
                marker="|",
                ms=9,
                mew=1.5,
            )
            ax.axhline(depth[j] * s, color="0.7", lw=0.6, ls=":", zorder=0)
            notes.setdefault(j, []).append(
                (f"{label}: {_length(width[j], units)}", colour, half[j])
            )
        if np.any(np.isfinite(width)):
            widest = max(widest, float(np.nanmax(width)))
    if widest == 0.0:
        raise InputError("footprint: no level has a width at any depth; nothing to draw")
    top = depth[-1] * s
    if near_field is not None and math.isfinite(near_field) and near_field > 0:
        text = f"near field {_length(near_field, units)} (cone not valid there)"
        if near_field * s >= 0.01 * top:
            # hatched, so it cannot be mistaken for the tint inside the first cone
            ax.axhspan(
                0.0,
                min(near_field * s, top * 1.05),
                facecolor="none",
                edgecolor="0.45",
                hatch="///",
                lw=0,
                label=text,
            )
        else:  # too thin to see at this scale: say so instead of drawing a hairline
            ax.plot([], [], ls="none", label=f"{text}: too thin to draw here")
    ax.plot([0, 0], [0, top], color="0.4", lw=0.8, ls="-.", label="beam axis")
    ax.set_xlim(-0.8 * widest * s, 0.8 * widest * s)
    ax.set_ylim(top * 1.05, 0.0)
    ax.set_xlabel(f"across the footprint, {unit} (width = distance between the edges)")
    if in_air:
        ax.set_ylabel(f"range to a flat surface facing the transducer, {unit}")
        ax.set_title(f"Beam footprint on a flat surface: full width, {mode}", fontsize=10)
    else:
        ax.set_ylabel(f"water depth below the transducer, {unit}")
        ax.set_title(f"Beam footprint on a flat bottom: full width, {mode}", fontsize=10)
    ax.grid(True, color="0.9", lw=0.6)
    handles = ax.get_legend_handles_labels()[0]
    if legend:
        # below the plot, so it hides no marker or label of the shallow depths
        ax.legend(
            loc="upper center", bbox_to_anchor=(0.5, -0.12), ncol=2, fontsize=7.5, frameon=False
        )
    _width_labels(ax, notes, depth * s)
    return handles


def footprint_figure(
    depths: Sequence[float],
    widths_by_level: Mapping[Any, Sequence],
    *,
    caption: str = "",
    size: tuple[float, float] = FIGSIZE,
    **options,
) -> Figure:
    """:func:`plot_footprint`'s picture as a Figure; ``options`` as for :func:`draw_footprint`."""
    fig = new_figure(size, caption=caption)
    draw_footprint(fig.add_subplot(), depths, widths_by_level, **options)
    return fig


def _width_labels(ax, notes, depth) -> None:
    """Label the widths at each marked depth, clear of every line of the cone.

    The labels of one depth are stacked above its line, just right of the
    outermost edge there: the cone widens with depth, so above the line every
    edge lies to the left and none can cross a label. The x range grows until
    each label fits; a depth too near the top to hold its stack, or whose stack
    would lie under the legend, goes unlabelled.
    """
    fig = ax.figure
    groups = []
    for j, entries in notes.items():
        outer = max(h for _, _, h in entries)
        group = []
        for k, (text, colour, _) in enumerate(entries):
            group.append(
                ax.annotate(
                    text,
                    (outer, depth[j]),
                    xytext=(6, 2 + 9.5 * (len(entries) - 1 - k)),
                    textcoords="offset points",
                    fontsize=7,
                    color=colour,
                    va="bottom",
                    zorder=4,
                    bbox={"boxstyle": "square,pad=0.1", "fc": "white", "ec": "none"},
                )
            )
        groups.append(group)
    for _ in range(4):  # the layout moves as the range changes: settle it
        fig.draw_without_rendering()
        inverse = ax.transData.inverted()
        right = max(
            (
                inverse.transform(a.get_window_extent().corners())[:, 0].max()
                for g in groups
                for a in g
            ),
            default=-np.inf,
        )
        high = ax.get_xlim()[1]
        if right <= high:
            break
        high = 1.04 * right
        ax.set_xlim(-high, high)
    top = ax.get_window_extent().y1
    legend = ax.get_legend()
    hidden = legend.get_window_extent() if legend is not None else None
    for group in groups:
        boxes = [a.get_window_extent() for a in group]
        if any(b.y1 > top or (hidden is not None and b.overlaps(hidden)) for b in boxes):
            for a in group:
                a.remove()


def plot_footprint(
    depths: Sequence[float], widths_by_level: Mapping[Any, Sequence], path, **options
) -> Path:
    """Draw the sonar cone and its footprint width against water depth to ``path``.

    Parameters
    ----------
    depths : sequence of float
        Water depths, m.
    widths_by_level : dict
        A level in dB (e.g. 3 or -3, drawn "-3 dB") or any label (e.g.
        "-3 dB, length plane") -> the full footprint width (m, or None where
        the level has none) at each depth, from
        :func:`beamspread.sonar.footprint_width` or the computed field.
    near_field : float, optional
        Shades the depths where the far-field cone does not hold, m.
    mode : str
        Named in the title.
    units : {"m", "ft", "mm", "in"}
    in_air : bool
        Label the distances as ranges to a flat surface (a rangefinder in air), not depths.
    """
    return write_figure(path, footprint_figure, depths, widths_by_level, **options)
