"""The beam map: the computed field in dB, lateral across and depth downward."""

from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import TYPE_CHECKING, Any

import numpy as np

from ...errors import InputError
from .figure import (
    _MARKS,
    _STYLES,
    COLORMAP,
    FIGSIZE,
    _line,
    _outline,
    _strip_legend,
    _with_strip,
    new_figure,
    write_figure,
)
from .scales import FLOOR_DB, _db, _length, _level_text, _levels, _mode_text, _scale

if TYPE_CHECKING:
    from matplotlib.axes import Axes
    from matplotlib.figure import Figure


@dataclass
class MapArtists:
    """What :func:`draw_map` drew: the image, one contour set per level (dB down), the lines."""

    image: Any
    contours: dict[float, Any]
    near_field: Any | None
    depth_lines: list[Any]
    handles: list[Any]
    colorbar: Any | None = None


def draw_map(
    ax: Axes,
    field_map,
    *,
    levels_db=(6.0, 20.0),
    near_field: float | None = None,
    depths: Sequence[float] = (),
    units: str = "mm",
    colorbar: bool = True,
    legend: bool = True,
    axial_maximum: float | None = None,
    plane: str | None = None,
    near_label: str = "near field",
    depth_labels: Sequence[str] | None = None,
    depth_legend: str = "requested depths",
    axial_label: str = "last on-axis maximum of the pulse",
    axis_label: str = "depth from the probe face",
) -> MapArtists:
    """Draw a :class:`~beamspread.field.FieldMap` into ``ax``: lateral across, depth downward.

    The image is the amplitude in dB relative to the map's maximum, from
    :data:`FLOOR_DB` to 0 dB. The contours are drawn at ``levels_db`` below
    the maximum *at each depth* (the convention of
    :func:`beamspread.field.beam_widths`), so a contour crosses a depth line
    at the beam's width there. ``near_field``, ``axial_maximum`` (the last
    on-axis maximum of a pulse, or what ``axial_label`` names) and ``depths``
    (m) are marked as horizontal lines, each named in the legend
    (``near_label``, ``axial_label``, ``depth_legend``) and the depths beside
    their lines (``depth_labels``, default their lengths).
    ``plane`` names the plane on the lateral axis (default the map's own).
    """
    s, unit = _scale(units)
    amp = np.abs(np.asarray(field_map.amplitude, dtype=float))
    lateral = np.asarray(field_map.lateral, dtype=float) * s
    depth = np.asarray(field_map.depth, dtype=float) * s
    if amp.shape != (depth.size, lateral.size) or depth.size < 2 or lateral.size < 2:
        raise InputError(
            "map: a picture needs at least 2 depths and 2 lateral offsets, with "
            "amplitude[depth, lateral]"
        )
    peak = float(amp.max())
    if not peak > 0.0:
        raise InputError("map: the amplitude is zero everywhere; there is nothing to draw")
    image_db = _db(amp, peak)
    across_db = _db(amp, amp.max(axis=1, keepdims=True))
    dx, dz = np.diff(lateral), np.diff(depth)
    uniform = (
        np.allclose(dx, dx[0], rtol=1e-6)
        and np.allclose(dz, dz[0], rtol=1e-6)
        and dx[0] > 0
        and dz[0] > 0
    )
    style = {"cmap": COLORMAP, "vmin": FLOOR_DB, "vmax": 0.0}
    if uniform:
        extent = (
            lateral[0] - dx[0] / 2,
            lateral[-1] + dx[0] / 2,
            depth[0] - dz[0] / 2,
            depth[-1] + dz[0] / 2,
        )
        image = ax.imshow(
            image_db,
            extent=extent,
            origin="lower",
            aspect="auto",
            interpolation="bilinear",
            **style,
        )
    else:
        image = ax.pcolormesh(lateral, depth, image_db, shading="nearest", **style)
        extent = (lateral.min(), lateral.max(), depth.min(), depth.max())
    ax.set_xlim(extent[0], extent[1])
    ax.set_ylim(extent[3], extent[2])  # depth grows downward, as the beam enters the part
    ax.set_xlabel(f"lateral offset in the {plane or field_map.plane} plane, {unit}")
    ax.set_ylabel(f"{axis_label}, {unit}")
    ax.set_title(
        f"Computed beam map: {_mode_text(field_map.mode, field_map.bandwidth)}", fontsize=10
    )
    bar = None
    if colorbar:
        bar = ax.figure.colorbar(image, ax=ax, pad=0.02, fraction=0.06)
        bar.set_label(f"dB re the map's maximum ({field_map.mode})")

    handles = []
    contours = {}
    for i, level in enumerate(_levels(levels_db)):
        ls = _STYLES[i % len(_STYLES)]
        if across_db.min() < -level:
            contours[level] = ax.contour(
                lateral,
                depth,
                across_db,
                levels=[-level],
                colors="black",
                linewidths=1.4,
                linestyles=ls,
            )
        handles.append(
            _line(color="black", lw=1.4, ls=ls, label=f"{_level_text(level)} re max. at each depth")
        )
    right = extent[1]
    near_line = None
    if near_field is not None and math.isfinite(near_field) and near_field > 0:
        near_line = ax.axhline(
            near_field * s, color="white", lw=1.2, ls=(0, (6, 3)), path_effects=_outline()
        )
        # The label sits on the side of the line away from the pulse's maximum, if any,
        # so that line never runs through it.
        below = axial_maximum is not None and 0 < axial_maximum < near_field
        ax.text(
            right,
            near_field * s,
            f"N {_length(near_field, units)} ",
            color="white",
            fontsize=8,
            ha="right",
            va="top" if below else "bottom",
            path_effects=_outline(2.2),
        )
        handles.append(
            _line(
                color="white",
                lw=1.2,
                ls=(0, (6, 3)),
                path_effects=_outline(),
                label=f"{near_label} N = {_length(near_field, units)}",
            )
        )
    if axial_maximum is not None and math.isfinite(axial_maximum) and axial_maximum > 0:
        ax.axhline(axial_maximum * s, color="white", lw=1.2, ls=":", path_effects=_outline())
        handles.append(
            _line(
                color="white",
                lw=1.2,
                ls=":",
                path_effects=_outline(),
                label=f"{axial_label} {_length(axial_maximum, units)}",
            )
        )
    lines = []
    depths = list(depths)
    if depth_labels is None:
        depth_labels = [_length(d, units) for d in depths]
    elif len(depth_labels) != len(depths):
        raise InputError("map: give one label per depth line")
    for d, text in zip(depths, depth_labels, strict=True):
        lines.append(ax.axhline(d * s, color=_MARKS, lw=1.1, path_effects=_outline(2.4)))
        ax.text(
            extent[0],
            d * s,
            f" {text}",
            color=_MARKS,
            fontsize=8,
            ha="left",
            va="bottom",
            path_effects=_outline(2.2),
        )
    if lines:
        handles.append(_line(color=_MARKS, lw=1.1, path_effects=_outline(2.4), label=depth_legend))
    if legend:
        leg = ax.legend(
            handles=handles,
            loc="lower right",
            fontsize=7.5,
            framealpha=0.85,
            facecolor="white",
            edgecolor="0.5",
        )
        leg.set_zorder(5)
    return MapArtists(image, contours, near_line, lines, handles, bar)


def map_figure(
    field_map, *, caption: str = "", size: tuple[float, float] = FIGSIZE, **options
) -> Figure:
    """:func:`plot_map`'s picture as a Figure (the legend in a strip below the map).

    ``options`` as for :func:`draw_map`.
    """
    fig = new_figure(size, caption=caption)
    grid, strip = _with_strip(fig)
    drawn = draw_map(fig.add_subplot(grid[0]), field_map, legend=False, **options)
    _strip_legend(strip, drawn.handles)
    return fig


def plot_map(field_map, path, **options) -> Path:
    """Draw the beam map (see :func:`draw_map`) to ``path``; return the path.

    ``options``: ``caption`` and ``size`` (:func:`map_figure`), and those of
    :func:`draw_map`.

    Raises
    ------
    InputError
        An unknown suffix, a missing folder, unknown units, a level outside
        (0, 40) dB, or a map with fewer than 2 points a side.
    """
    return write_figure(path, map_figure, field_map, **options)
