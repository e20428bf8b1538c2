"""The beam on a plate's section, angled or straight: the picture of a SectionGeometry."""

from __future__ import annotations

import math
from pathlib import Path
from typing import TYPE_CHECKING

import numpy as np

from .figure import (
    _MARKS,
    _PALETTE,
    _STYLES,
    FIGSIZE,
    _line,
    _strip_legend,
    _with_strip,
    check_target,
    new_figure,
    save_figure,
)
from .scales import _length, _level_text, _scale
from .section_geometry import SectionGeometry, _trace_section

if TYPE_CHECKING:
    from matplotlib.axes import Axes
    from matplotlib.figure import Figure


def draw_section(ax: Axes, geometry: SectionGeometry, *, units: str = "mm") -> list:
    """Draw the beam on the plate's section into ``ax``; return the legend handles.

    The plate to scale (depth downward), the exit point, the beam axis and
    each level's edges through the legs (mirrored at the back wall), the main
    level's beam shaded between its edges, and at the flaw depth each level's
    footprint on each leg (:func:`section_footprints`): leg 1's bars just
    above the flaw-depth line, leg 2's just below, one row per level, so that
    no two run together. The x range holds every edge and footprint drawn.

    Every edge starts on the scanning surface: an edge from the computed
    field, whose samples begin a little way into the part, is continued back
    to the surface at its first width, drawn lighter; nothing is drawn above
    the surface, and the shading stays between the edges.
    """
    from matplotlib.patches import Rectangle as Box
    from matplotlib.transforms import offset_copy

    s, unit = _scale(units)
    g = geometry
    t = g.thickness
    beta = g.refracted
    traced = _trace_section(g)
    left, right = traced.left, traced.right
    plate = Box(
        (left * s, 0.0),
        (right - left) * s,
        t * s,
        facecolor="#e9ecef",
        edgecolor="0.25",
        lw=1.2,
        zorder=0,
    )
    ax.add_patch(plate)
    handles = [_line(color="#e9ecef", lw=8, label=f"plate, {_length(t, units)} thick")]
    clip = plate
    if g.mirror:  # leg 2 unfolded, in the plate's mirror image below the back wall
        ax.add_patch(
            Box(
                (left * s, t * s),
                (right - left) * s,
                (g.drawn_depth - t) * s,
                facecolor="#f5f6f7",
                edgecolor="0.78",
                hatch="//",
                lw=0.8,
                ls="--",
                zorder=0,
            )
        )
        handles.append(
            _line(color="0.7", lw=8, alpha=0.4, label="below the back wall: its mirror, leg 2")
        )
        clip = Box((left * s, 0.0), (right - left) * s, g.drawn_depth * s, visible=False)
        ax.add_patch(clip)

    # The axis, folded at the back wall.
    ends = np.linspace(0.0, g.path_length, g.legs + 1)
    ax_x, ax_y = g.unfolded(ends, 0.0)
    ax.plot(ax_x * s, g.fold(ax_y) * s, color=_PALETTE[0], lw=1.3, ls="-.", zorder=3)
    handles.append(
        _line(
            color=_PALETTE[0],
            lw=1.3,
            ls="-.",
            label=f"beam axis, {math.degrees(beta):.1f}\u00b0 {g.wave}"
            if beta > 0
            else f"beam axis, straight down, {g.wave}",
        )
    )
    colours, rows = {}, {}
    any_held = False
    for i, (edge, sides) in enumerate(traced.edges):
        colour = colours[edge.level_db] = _PALETTE[1 + i % (len(_PALETTE) - 1)]
        rows[edge.level_db] = i
        ls = _STYLES[i % len(_STYLES)]
        for x, y, held in sides:
            n = int(held.sum())  # the held stretch comes first, and joins the rest at index n
            if n:
                any_held = True
                (line,) = ax.plot(
                    x[: n + 1] * s, y[: n + 1] * s, color=colour, lw=1.3, ls=ls, alpha=0.45
                )
                line.set_clip_path(clip)
            (line,) = ax.plot(x[n:] * s, y[n:] * s, color=colour, lw=1.3, ls=ls, zorder=3)
            line.set_clip_path(clip)  # an edge that leaves the plate is not drawn outside
        if i == 0:  # shade the main beam between its first pair of edges
            (x1, y1, _), (x2, y2, _) = sides
            ok1, ok2 = np.isfinite(x1), np.isfinite(x2)
            (shade,) = ax.fill(
                np.concatenate([x1[ok1], x2[ok2][::-1]]) * s,
                np.concatenate([y1[ok1], y2[ok2][::-1]]) * s,
                color=colour,
                alpha=0.12,
                lw=0,
                zorder=2,
            )
            shade.set_clip_path(clip)
        handles.append(
            _line(color=colour, lw=1.3, ls=ls, label=f"{_level_text(edge.level_db)} beam edges")
        )
    if any_held:
        handles.append(
            _line(
                color="0.3",
                lw=1.3,
                alpha=0.45,
                label="lighter: held at the first computed width",
            )
        )
    ax.plot(  # the triangle's tip on the exit point
        [g.exit_point * s],
        [0.0],
        marker="v",
        ms=8,
        color=_PALETTE[0],
        zorder=4,
        ls="none",
        clip_on=False,
        transform=offset_copy(ax.transData, fig=ax.figure, y=4.0, units="points"),
    )
    handles.append(
        _line(
            marker="v",
            ms=7,
            color=_PALETTE[0],
            ls="none",
            label=f"{_entry(g)}, {_length(g.exit_point, units)}",
        )
    )
    if g.water_path is not None:
        handles.append(
            _line(
                color="none",
                label=f"above it (not drawn): a water path of {_length(g.water_path, units)} "
                f"in {g.couplant}",
            )
        )
    if g.flaw_depth is not None:
        y = g.flaw_depth * s
        ax.axhline(y, color=_MARKS, lw=1.0, ls=(0, (2, 2)), zorder=1)
        where = "(leg 1 above, leg 2 below):"
        if g.mirror:
            ax.axhline((2 * t - g.flaw_depth) * s, color=_MARKS, lw=1.0, ls=(0, (2, 2)), zorder=1)
            where = "(leg 1 above it, leg 2 below its mirror):"
        handles.append(
            _line(
                color=_MARKS,
                lw=1.0,
                ls=(0, (2, 2)),
                label=f"flaw depth {_length(g.flaw_depth, units)}; footprints {where}",
            )
        )
        for fp in traced.footprints:
            colour = colours[fp.level_db]
            y = (g.flaw_depth if fp.leg == 1 or not g.mirror else 2 * t - g.flaw_depth) * s
            up = 2.5 + 4.0 * rows[fp.level_db]  # points off the line: a row per level
            shifted = offset_copy(
                ax.transData, fig=ax.figure, y=up if fp.leg == 1 else -up, units="points"
            )
            ax.plot(
                [fp.near * s, fp.far * s],
                [y, y],
                color=colour,
                lw=2.2,
                marker="|",
                ms=5,
                mew=1.8,
                solid_capstyle="butt",
                zorder=4,
                transform=shifted,
            )
            handles.append(
                _line(
                    color=colour,
                    lw=2.2,
                    marker="|",
                    ms=7,
                    mew=1.8,
                    label=f"  leg {fp.leg}, {_level_text(fp.level_db)}: "
                    f"{_length(fp.width, units)} "
                    f"(path {_length(fp.sound_path, units)})",
                )
            )
    ax.set_xlim(left * s, right * s)
    # Room above the surface for the exit point's mark: 10 points at about 6.3 in of width.
    above = max(0.06 * t, 10.0 * (right - left) / (6.3 * 72.0))
    ax.set_ylim(g.drawn_depth * s * (1.02 if g.mirror else 1.04), -above * s)
    ax.set_aspect("equal", adjustable="box")  # the section to scale
    if beta > 0:
        ax.set_xlabel(f"surface distance from the exit point's origin, {unit}")
    else:
        ax.set_xlabel(f"distance across the beam axis, {unit}")
    ax.set_ylabel(f"depth, {unit}")
    levels = ", ".join(_level_text(e.level_db) for e in g.edges)
    kind = "Angle beam" if beta > 0 else "Straight beam"
    ax.set_title(
        f"{kind} on the section: {g.legs} leg{'s' if g.legs > 1 else ''}"
        + (f", {g.plane} plane" if g.plane else "")
        + (f", edges at {levels}" if levels else ""),
        fontsize=10,
    )
    return handles


def _entry(g: SectionGeometry) -> str:
    """What the mark on the surface is: a wedge's exit point, or where a straight beam enters."""
    if g.refracted > 0:
        return "exit point"
    return "beam entry point" if g.water_path is not None else "probe's centre"


def section_figure(
    geometry: SectionGeometry,
    *,
    caption: str = "",
    units: str = "mm",
    size: tuple[float, float] | None = None,
) -> Figure:
    """:func:`plot_section`'s picture as a Figure (default: 7 in wide, as tall as needed)."""
    if size is None:  # the plate to scale in about 6.3 in of width, plus the rest
        traced = _trace_section(geometry)
        ratio = geometry.drawn_depth / (traced.right - traced.left)
        rows = -(-(len(geometry.edges) * (geometry.legs + 1) + 4) // 2)  # legend rows
        size = (FIGSIZE[0], min(7.0, 6.3 * 1.1 * ratio + 1.45 + rows * 0.15))
    fig = new_figure(size, caption=caption)
    grid, strip = _with_strip(fig)
    handles = draw_section(fig.add_subplot(grid[0]), geometry, units=units)
    _strip_legend(strip, handles, fontsize=7.0)
    return fig


def plot_section(geometry: SectionGeometry, path, *, caption: str = "", units: str = "mm") -> Path:
    """Draw the angle beam on the plate's section to ``path``; return the path.

    The plate (depth downward, to scale), the exit point, the beam axis and
    each level's edges through the legs (mirrored at the back wall), the
    flaw depth and each level's footprint there (:func:`section_footprints`).
    """
    check_target(path)
    return save_figure(section_figure(geometry, caption=caption, units=units), path)
