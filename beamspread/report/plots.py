"""Pictures of the beam: maps, profiles, directivity, the angle beam on a section, sonar cones.

Each ``plot_*`` function draws one picture and writes it to a path whose
suffix chooses the format (``.png``, ``.svg`` or ``.pdf``), through a
temporary file in the same folder so that nothing half-written is ever left;
it returns the path. Each has a ``*_figure`` twin that returns the
:class:`matplotlib.figure.Figure` instead (for a page that gathers several),
and :func:`save_figure` writes any such figure the same way.

Conventions drawn on every picture: lengths in ``units`` (``"mm"`` or
``"in"``; a sonar cone also takes ``"m"`` or ``"ft"``), levels in dB as
:math:`20\\log_{10}` of the amplitude relative to a stated reference, and the
mode (pulse-echo or one-way) in the title or the labels. A ``caption`` is
drawn as a line (wrapped if long) along the foot of the picture.

matplotlib is imported inside the functions that draw, with the Agg canvas
attached to each figure directly: nothing here touches pyplot's global state
or needs a display, and importing this module costs nothing.
"""

from __future__ import annotations

import math
import os
import tempfile
import textwrap
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from pathlib import Path
from typing import TYPE_CHECKING, Any

import numpy as np

from ..errors import InputError
from ..units import format_length

if TYPE_CHECKING:
    from matplotlib.axes import Axes
    from matplotlib.figure import Figure

__all__ = [
    "COLORMAP",
    "DPI",
    "FIGSIZE",
    "FLOOR_DB",
    "FORMATS",
    "BeamEdge",
    "MapArtists",
    "SectionFootprint",
    "SectionGeometry",
    "across_figure",
    "axis_figure",
    "check_target",
    "directivity_figure",
    "draw_map",
    "draw_section",
    "footprint_figure",
    "map_figure",
    "new_figure",
    "plot_across",
    "plot_axis",
    "plot_directivity",
    "plot_footprint",
    "plot_map",
    "plot_section",
    "save_figure",
    "section_figure",
    "section_footprints",
]

FORMATS = (".png", ".svg", ".pdf")
FIGSIZE = (7.0, 4.5)  # inches: half a printed page
DPI = 150
FLOOR_DB = -40.0  # the foot of every dB scale
COLORMAP = "cividis"  # perceptually uniform, readable in grey and by most colour-blind readers
CAPTION_SIZE = 7.0  # points

# Lines on white: a dark blue, a brick red, a sea green, an ochre and a grey, in that order.
_PALETTE = ("#1d3557", "#b5473a", "#2a7f62", "#c28a1e", "#6c6c6c")
_STYLES = ("-", "--", ":", "-.")
_MARKS = "#e9724c"  # depth lines and footprints on the map and the section

_LENGTHS = {"mm": 1e3, "in": 1.0 / 0.0254, "m": 1.0, "ft": 1.0 / 0.3048}
_MINUS = "\u2212"


# ----------------------------------------------------------------- shared helpers


def check_target(path: str | os.PathLike) -> Path:
    """The plot path as a :class:`~pathlib.Path`, if its suffix and folder are usable.

    Raises
    ------
    InputError
        An unknown suffix (naming the allowed ones), a folder that does not
        exist, or a path that is a folder.
    """
    target = Path(path)
    if target.suffix.lower() not in FORMATS:
        raise InputError(f"plot: {str(path)!r}: the suffix must be one of {', '.join(FORMATS)}")
    if not target.parent.is_dir():
        raise InputError(f"plot: {str(path)!r}: the folder {str(target.parent)!r} does not exist")
    if target.is_dir():
        raise InputError(f"plot: {str(path)!r} is a folder, not a file")
    return target


def _scale(units: str, allowed: Sequence[str] = ("mm", "in")) -> tuple[float, str]:
    """Metres-to-units factor and the unit's label."""
    if units not in allowed:
        raise InputError(f"units: {units!r} is unknown; use one of {', '.join(allowed)}")
    return _LENGTHS[units], units


def _db(amplitude, reference) -> np.ndarray:
    """``20 log10(amplitude / reference)``, floored at :data:`FLOOR_DB` (zeros included)."""
    a = np.abs(np.asarray(amplitude, dtype=float))
    ref = np.asarray(reference, dtype=float)
    tiny = 10.0 ** (FLOOR_DB / 20.0) * 1e-3
    with np.errstate(divide="ignore", invalid="ignore"):
        ratio = np.where(ref > 0, a / np.where(ref > 0, ref, 1.0), 0.0)
    return np.maximum(20.0 * np.log10(np.maximum(ratio, tiny)), FLOOR_DB)


def _levels(levels_db) -> list[float]:
    """Levels as positive dB below the reference, in the order given, without repeats."""
    out: list[float] = []
    for level in levels_db:
        try:
            value = abs(float(level))
        except (TypeError, ValueError):
            raise InputError(f"level: {level!r} is not a number of dB") from None
        if not math.isfinite(value) or value == 0.0 or value >= -FLOOR_DB:
            raise InputError(
                f"level: {level!r} dB is not allowed; give a level from above 0 "
                f"to below {-FLOOR_DB:g} dB down"
            )
        if value not in out:
            out.append(value)
    return out


def _level_text(level: float) -> str:
    return f"{_MINUS}{abs(level):g} dB"


def _length(metres: float, units: str) -> str:
    if units in ("mm", "in"):
        return format_length(metres, units)
    value = metres * _LENGTHS[units]
    return f"{value:.3g} {units}"


def _mode_text(mode: str, bandwidth: float | None = None) -> str:
    text = mode
    if bandwidth is not None:
        text += ", continuous wave" if bandwidth == 0 else f", {bandwidth:g} fractional bandwidth"
    return text


def new_figure(
    size: tuple[float, float] = FIGSIZE, *, caption: str = "", dpi: float = DPI
) -> Figure:
    """A figure on its own Agg canvas with constrained layout, the caption along its foot.

    The layout leaves room below for the caption (wrapped to the figure's
    width); nothing is drawn through pyplot.
    """
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    fig = Figure(figsize=size, dpi=dpi)
    FigureCanvasAgg(fig)
    bottom = _caption(fig, caption)
    fig.set_layout_engine("constrained", rect=(0.0, bottom, 1.0, 1.0 - bottom))
    return fig


def _caption(fig: Figure, caption: str) -> float:
    """Draw the caption along the foot of ``fig``; return the height it takes (a fraction)."""
    width, height = fig.get_size_inches()
    text = " ".join(str(caption).split())
    if not text:
        return 0.0
    per_line = max(20, int((width * 72.0 - 14.0) / (0.56 * CAPTION_SIZE)))
    lines = textwrap.wrap(text, per_line)
    points = len(lines) * CAPTION_SIZE * 1.3 + 8.0
    fig.text(
        0.012,
        4.0 / (height * 72.0),
        "\n".join(lines),
        fontsize=CAPTION_SIZE,
        ha="left",
        va="bottom",
        color="0.2",
        linespacing=1.3,
    )
    return min(0.4, points / (height * 72.0))


def save_figure(fig: Figure, path: str | os.PathLike) -> Path:
    """Write ``fig`` to ``path`` (format by suffix) atomically; return the path.

    The picture goes to a temporary file in the same folder, which replaces
    ``path`` only once complete; on any failure it is removed.
    """
    target = check_target(path)
    fd, temporary = tempfile.mkstemp(dir=target.parent, prefix=f".{target.name}.", suffix=".part")
    os.close(fd)
    try:
        fig.savefig(temporary, format=target.suffix.lower()[1:], dpi=fig.dpi)
        mask = os.umask(0)
        os.umask(mask)
        os.chmod(temporary, 0o666 & ~mask)  # as an ordinary new file, not mkstemp's 0600
        os.replace(temporary, target)
    except BaseException:
        Path(temporary).unlink(missing_ok=True)
        raise
    return target


def _outline(width: float = 2.6):
    from matplotlib import patheffects

    return [patheffects.withStroke(linewidth=width, foreground="black")]


def _polar_figure(size, caption: str, rows: int) -> tuple[Figure, float]:
    """A figure holding one polar axes whose lower half-disc fills the space left.

    Placed by hand: a layout engine would keep room for the whole (square)
    box around the half-disc. Returns the figure and where (a fraction of its
    height) the legend's foot goes.
    """
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    fig = Figure(figsize=size, dpi=DPI)
    FigureCanvasAgg(fig)
    width, height = size
    caption_in = _caption(fig, caption) * height
    legend_in = (rows * 7.5 * 1.55 + 6.0) / 72.0
    below = caption_in + legend_in + 0.38  # the angle labels under the half-disc
    above = 0.62 + 0.2  # two lines of title, the radius labels
    side = max(1.0, min(2.0 * (height - below - above), width - 1.1))  # the half-disc's width
    box_bottom = below - side / 4.0  # the half-disc sits in the middle of its square box
    fig.add_axes(
        (0.5 - side / (2.0 * width), box_bottom / height, side / width, side / height),
        projection="polar",
    )
    return fig, (caption_in + 2.0 / 72.0) / height


def _with_strip(fig: Figure):
    """A main cell and, below it, an empty strip for a legend (see :func:`_strip_legend`)."""
    grid = fig.add_gridspec(2, 1, height_ratios=(1.0, 0.0))
    strip = fig.add_subplot(grid[1])
    strip.axis("off")
    return grid, strip


def _strip_legend(strip, handles, ncol: int = 2, fontsize: float = 7.5) -> None:
    """Fill the strip with a legend of ``handles`` in ``ncol`` columns, sized to fit."""
    fig = strip.figure
    rows = -(-len(handles) // ncol)
    needed = (rows * fontsize * 1.55 + 4.0) / 72.0  # inches
    grid = strip.get_subplotspec().get_gridspec()
    main = max(0.5, fig.get_figheight() * 0.75 - needed)
    grid.set_height_ratios((main, needed))
    legend = strip.legend(
        handles=handles,
        loc="center",
        ncol=ncol,
        fontsize=fontsize,
        frameon=False,
        borderaxespad=0.0,
        handlelength=2.6,
        columnspacing=1.6,
    )
    legend.set_in_layout(False)  # the strip's height is set for it, and layout ignores its width


def _line(**kwargs):
    from matplotlib.lines import Line2D

    return Line2D([], [], **kwargs)


# ----------------------------------------------------------------- the beam map


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
    ax.set_ylabel(f"depth from the probe face, {unit}")
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
    field_map,
    *,
    levels_db=(6.0, 20.0),
    near_field: float | None = None,
    depths: Sequence[float] = (),
    caption: str = "",
    units: str = "mm",
    size: tuple[float, float] = FIGSIZE,
    axial_maximum: float | None = None,
    near_label: str = "near field",
) -> Figure:
    """:func:`plot_map`'s picture as a Figure."""
    fig = new_figure(size, caption=caption)
    grid, strip = _with_strip(fig)
    drawn = draw_map(
        fig.add_subplot(grid[0]),
        field_map,
        levels_db=levels_db,
        near_field=near_field,
        depths=depths,
        units=units,
        legend=False,
        axial_maximum=axial_maximum,
        near_label=near_label,
    )
    _strip_legend(strip, drawn.handles)
    return fig


def plot_map(
    field_map,
    path,
    *,
    levels_db=(6.0, 20.0),
    near_field: float | None = None,
    depths: Sequence[float] = (),
    caption: str = "",
    units: str = "mm",
    axial_maximum: float | None = None,
    near_label: str = "near field",
) -> Path:
    """Draw the beam map (see :func:`draw_map`) to ``path``; return the path.

    Raises
    ------
    InputError
        An unknown suffix, a missing folder, unknown units, a level outside
        (0, 40) dB, or a map with fewer than 2 points a side.
    """
    check_target(path)
    return save_figure(
        map_figure(
            field_map,
            levels_db=levels_db,
            near_field=near_field,
            depths=depths,
            caption=caption,
            units=units,
            axial_maximum=axial_maximum,
            near_label=near_label,
        ),
        path,
    )


# ----------------------------------------------------------------- profiles


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


def axis_figure(
    profile,
    *,
    near_field: float | None = None,
    axial_maximum: float | None = None,
    levels_db=(6.0,),
    caption: str = "",
    units: str = "mm",
    size: tuple[float, float] = FIGSIZE,
) -> Figure:
    """:func:`plot_axis`'s picture as a Figure."""
    s, unit = _scale(units)
    depth = np.asarray(profile.depth, dtype=float)
    amp = np.asarray(profile.amplitude, dtype=float)
    if depth.size < 2 or amp.shape != depth.shape:
        raise InputError("axis: a picture needs at least 2 depths, one amplitude each")
    peak = float(np.abs(amp).max())
    if not peak > 0:
        raise InputError("axis: the amplitude is zero everywhere; there is nothing to draw")
    db = _db(amp, peak)
    fig = new_figure(size, caption=caption)
    ax = fig.add_subplot()
    ax.plot(depth * s, db, color=_PALETTE[0], lw=1.5, label="on-axis amplitude")
    if near_field is not None and math.isfinite(near_field):
        ax.axvline(
            near_field * s,
            color=_PALETTE[1],
            lw=1.1,
            ls="--",
            label=f"near field N = {_length(near_field, units)}",
        )
    if axial_maximum is not None and math.isfinite(axial_maximum):
        ax.axvline(
            axial_maximum * s,
            color=_PALETTE[2],
            lw=1.1,
            ls=":",
            label=f"last on-axis maximum {_length(axial_maximum, units)}",
        )
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
    ax.set_xlabel(f"depth on the beam axis, {unit}")
    ax.set_ylabel(f"dB re the largest on-axis amplitude ({profile.mode})")
    ax.set_title(f"On-axis profile: {_mode_text(profile.mode, profile.bandwidth)}", fontsize=10)
    ax.grid(True, color="0.88", lw=0.6)
    ax.legend(loc="lower right", fontsize=8, framealpha=0.9)
    return fig


def plot_axis(
    profile,
    path,
    *,
    near_field: float | None = None,
    axial_maximum: float | None = None,
    levels_db=(6.0,),
    caption: str = "",
    units: str = "mm",
) -> Path:
    """Draw an :class:`~beamspread.field.AxialProfile` in dB to ``path``; return the path.

    The amplitude is in dB relative to the largest on the profile; the
    near-field length and the last on-axis maximum (m) are vertical lines,
    and every crossing of each level is marked (interpolated linearly in dB
    between samples).
    """
    check_target(path)
    return save_figure(
        axis_figure(
            profile,
            near_field=near_field,
            axial_maximum=axial_maximum,
            levels_db=levels_db,
            caption=caption,
            units=units,
        ),
        path,
    )


def across_figure(
    profiles,
    widths: Mapping[str, Sequence] | None = None,
    *,
    caption: str = "",
    units: str = "mm",
    size: tuple[float, float] = FIGSIZE,
) -> Figure:
    """:func:`plot_across`'s picture as a Figure."""
    s, unit = _scale(units)
    profiles = list(profiles)
    if not profiles:
        raise InputError("across: give at least one transverse profile")
    widths = dict(widths or {})
    fig = new_figure(size, caption=caption)
    axes = fig.subplots(1, len(profiles), sharey=True, squeeze=False)[0]
    for ax, profile in zip(axes, profiles, strict=True):
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
        for i, w in enumerate(widths.get(profile.plane, ())):
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
    check_target(path)
    return save_figure(across_figure(profiles, widths, caption=caption, units=units), path)


# ----------------------------------------------------------------- directivity


def _pattern_shape(shape: str) -> str:
    aliases = {"disc": "disc", "side": "side", "rectangle": "side"}
    if shape not in aliases:
        raise InputError(f"shape: {shape!r} is unknown; use disc, rectangle or side")
    return aliases[shape]


def directivity_figure(
    aperture_by_plane: Mapping[str, float],
    wavelength: float,
    shape: str = "disc",
    *,
    polar: bool = True,
    levels_db=(6.0,),
    max_angle: float | None = None,
    caption: str = "",
    size: tuple[float, float] = FIGSIZE,
    angles: str = "half",
) -> Figure:
    """:func:`plot_directivity`'s picture as a Figure."""
    from .. import pattern
    from ..probes import check_positive

    kind = _pattern_shape(shape)
    if angles not in ("half", "full"):
        raise InputError(f"angles: {angles!r} is unknown; use half or full")
    wavelength = check_positive(wavelength, "wavelength", "m")
    planes = {
        name: check_positive(a, f"aperture of the {name} plane", "m")
        for name, a in dict(aperture_by_plane).items()
    }
    if not planes:
        raise InputError("directivity: give the aperture of at least one plane")
    levels = _levels(levels_db)
    if polar:
        top = 90.0  # the whole half-plane in front of the face
    elif max_angle is None:  # three first-null angles, or 90 degrees for a small element
        nulls = [
            float(np.degrees(pattern.first_null(a, wavelength, kind))) for a in planes.values()
        ]
        top = 90.0 if any(math.isnan(n) for n in nulls) else min(90.0, 3.0 * max(nulls))
    else:
        top = float(max_angle)
        if not 0.0 < top <= 90.0:
            raise InputError(f"max_angle: {max_angle!r} deg is not allowed; give 0 to 90")
    largest = max(planes.values()) / wavelength
    count = int(min(200_001, 2001 + 400 * largest * math.sin(math.radians(top))))
    theta = np.radians(np.linspace(-top, top, count))

    if polar:
        fig, legend_bottom = _polar_figure(size, caption, len(planes) * 2 + 1)
        ax = fig.axes[0]
    else:
        fig = new_figure(size, caption=caption)
        grid, strip = _with_strip(fig)
        ax = fig.add_subplot(grid[0])
    for i, (name, aperture) in enumerate(planes.items()):
        colour = _PALETTE[i % len(_PALETTE)]
        for mode, ls in (("one-way", "-"), ("pulse-echo", "--")):
            d = pattern.directivity(theta, aperture, wavelength, kind, mode)
            found = [
                float(pattern.half_angle(level, aperture, wavelength, kind, mode))
                for level in levels
            ]
            ax.plot(
                theta if polar else np.degrees(theta),
                _db(d, 1.0),
                color=colour,
                lw=1.3,
                ls=ls,
                label=f"{name} plane ({_length(aperture, 'mm')}), {mode}: "
                + ", ".join(
                    _angle_text(level, half, angles)
                    for level, half in zip(levels, found, strict=True)
                ),
            )
            for level, half in zip(levels, found, strict=True):
                if math.isnan(half) or math.degrees(half) > top:
                    continue
                where = np.array([-half, half])
                ax.plot(
                    where if polar else np.degrees(where),
                    [-level, -level],
                    ls="none",
                    marker="o",
                    ms=4.5,
                    mfc="white",
                    mec=colour,
                    mew=1.3,
                )
    marker = _line(
        ls="none",
        marker="o",
        ms=4.5,
        mfc="white",
        mec="0.3",
        mew=1.3,
        label=", ".join(_level_text(v) for v in levels)
        + " points, one each side of the axis at the half-angle: a pair spans the full angle",
    )
    handles = [*ax.get_legend_handles_labels()[0], marker]
    named = "full angles (2 x half-angle)" if angles == "full" else "half-angles from the axis"
    title = f"Far-field directivity, {kind} pattern, one-way and pulse-echo: {named}"
    if polar:
        ax.set_theta_zero_location("S")  # the beam points down, as on the map
        ax.set_thetamin(-top)
        ax.set_thetamax(top)
        ax.set_ylim(FLOOR_DB, 0.0)
        ax.set_yticks(np.arange(FLOOR_DB + 10.0, 0.1, 10.0))  # the centre is the floor
        ax.set_yticklabels([f"{v:g}".replace("-", _MINUS) for v in ax.get_yticks()], fontsize=7)
        fig.text(
            0.5,
            1.0 - 6.0 / (72.0 * fig.get_figheight()),
            title + "\nradius: dB re the on-axis amplitude (centre "
            f"{_MINUS}{-FLOOR_DB:g} dB); angle from the axis, deg",
            fontsize=9,
            ha="center",
            va="top",
        )
        fig.legend(
            handles=handles,
            loc="lower center",
            ncol=1,
            fontsize=7.5,
            frameon=False,
            bbox_to_anchor=(0.5, legend_bottom),
        )
    else:
        ax.set_xlim(-top, top)
        ax.set_ylim(FLOOR_DB, 3.0)
        ax.set_xlabel("angle from the beam axis, deg")
        ax.set_ylabel("dB re the on-axis amplitude")
        ax.set_title(title, fontsize=10)
        ax.grid(True, color="0.88", lw=0.6)
        _strip_legend(strip, handles, ncol=1)  # below the plot: the labels are long
    return fig


def plot_directivity(
    aperture_by_plane: Mapping[str, float],
    wavelength: float,
    shape: str,
    path,
    *,
    polar: bool = True,
    levels_db=(6.0,),
    max_angle: float | None = None,
    caption: str = "",
    angles: str = "half",
) -> Path:
    """Draw the far-field pattern, one-way and pulse-echo, in dB to ``path``; return the path.

    Parameters
    ----------
    aperture_by_plane : dict
        Plane name -> aperture (m): ``dict(probe.planes)``.
    wavelength : float
        m.
    shape : {"disc", "rectangle", "side"}
        ``2 J1(x)/x`` for a disc, ``sin(x)/x`` in each plane of a rectangle
        (:func:`beamspread.pattern.directivity`).
    polar : bool
        A polar half-plane (beam axis downward, radius in dB) or a Cartesian plot.
    levels_db : sequence
        Levels marked, in each mode, at +- the half-angle; the legend gives each
        angle's value both ways (half-angle and full angle).
    max_angle : float, optional
        Largest angle drawn, deg (default 90 in polar, else three first-null angles).
    angles : {"half", "full"}
        The convention the picture leads with (title and the first value in the
        legend): ``"full"`` where the tables beside it give full angles (sonar).
    """
    check_target(path)
    return save_figure(
        directivity_figure(
            aperture_by_plane,
            wavelength,
            shape,
            polar=polar,
            levels_db=levels_db,
            max_angle=max_angle,
            caption=caption,
            angles=angles,
        ),
        path,
    )


def _angle_text(level: float, half: float, angles: str) -> str:
    """``-3 dB full 8.78° (±4.39°)`` or ``-3 dB ±4.39° (full 8.78°)``; none past 90°."""
    if math.isnan(half):
        return f"{_level_text(level)} none"
    h = math.degrees(half)
    if angles == "full":
        return f"{_level_text(level)} full {2 * h:.2f}\u00b0 (\u00b1{h:.2f}\u00b0)"
    return f"{_level_text(level)} \u00b1{h:.2f}\u00b0 (full {2 * h:.2f}\u00b0)"


# ----------------------------------------------------------------- the angle beam on a plate


@dataclass(frozen=True)
class BeamEdge:
    """The full width of the beam at one level along its sound path in the part.

    ``sound_path`` (m, from the exit point, unfolded through the back-wall
    bounce) and ``width`` (m, across the axis) are sampled together; the
    edges lie at +-width/2 either side of the axis, and are interpolated
    linearly between samples.
    """

    level_db: float
    sound_path: tuple[float, ...]
    width: tuple[float, ...]

    def __post_init__(self) -> None:
        path = tuple(float(v) for v in self.sound_path)
        width = tuple(float(v) for v in self.width)
        if len(path) < 2 or len(path) != len(width):
            raise InputError("beam edge: give at least 2 sound paths, each with its width")
        if any(not math.isfinite(v) or v < 0 for v in path + width):
            raise InputError("beam edge: sound paths and widths must be finite and not negative")
        if np.any(np.diff(path) <= 0):
            raise InputError("beam edge: the sound paths must increase")
        object.__setattr__(self, "level_db", abs(float(self.level_db)))
        object.__setattr__(self, "sound_path", path)
        object.__setattr__(self, "width", width)

    @classmethod
    def from_half_angle(
        cls,
        level_db: float,
        half_angle: float,
        sound_path: float,
        *,
        start: float = 0.0,
        start_width: float = 0.0,
    ) -> BeamEdge:
        """Straight edges diverging at ``half_angle`` (rad) from ``start_width`` at ``start``.

        The far-field cone (common practice): ``width = start_width + 2 (s - start) tan(half)``.
        """
        if not 0.0 <= half_angle < math.pi / 2:
            raise InputError(
                f"beam edge: a half-angle of {math.degrees(half_angle):g} deg is not allowed"
            )
        grow = 2.0 * (sound_path - start) * math.tan(half_angle)
        return cls(level_db, (start, sound_path), (start_width, start_width + grow))


@dataclass(frozen=True)
class SectionGeometry:
    """An angle beam in a plate, for :func:`plot_section`.

    Parameters
    ----------
    thickness : float
        Plate thickness, m.
    refracted : float
        Angle of the beam axis in the part from the surface normal, rad (0 to
        below 90 degrees), e.g. from :func:`beamspread.setups.refract`.
    exit_point : float
        Where the axis leaves the probe on the scanning surface, m along it.
    edges : tuple of BeamEdge
        The beam's level edges along the sound path (from the computed field,
        or :meth:`BeamEdge.from_half_angle` for the far-field cone).
    flaw_depth : float, optional
        Depth below the scanning surface at which to draw the footprint, m.
    legs : int
        1 (down to the back wall) or 2 (and back up after the bounce).
    wave : str
        Named in the title: "shear" or "longitudinal".
    """

    thickness: float
    refracted: float
    exit_point: float = 0.0
    edges: tuple[BeamEdge, ...] = ()
    flaw_depth: float | None = None
    legs: int = 2
    wave: str = "shear"

    def __post_init__(self) -> None:
        from ..probes import check_positive

        object.__setattr__(self, "thickness", check_positive(self.thickness, "thickness", "m"))
        if not 0.0 <= self.refracted < math.radians(89.0):
            raise InputError(
                f"refracted angle {math.degrees(self.refracted):g} deg is not "
                "allowed for a section; give 0 to 89 degrees"
            )
        if self.legs not in (1, 2):
            raise InputError(f"legs: {self.legs!r} is not allowed; use 1 or 2")
        if self.flaw_depth is not None and not 0.0 < self.flaw_depth <= self.thickness:
            raise InputError(
                f"flaw depth {self.flaw_depth * 1e3:g} mm is not allowed; it must "
                f"lie in the plate (0 to {self.thickness * 1e3:g} mm)"
            )
        object.__setattr__(self, "edges", tuple(self.edges))

    @property
    def skip(self) -> float:
        """Surface distance of a full skip (two legs), m: ``2 t tan(refracted)``."""
        return 2.0 * self.thickness * math.tan(self.refracted)

    @property
    def path_length(self) -> float:
        """Unfolded sound path drawn, m: the legs to the back wall and back."""
        return self.legs * self.thickness / math.cos(self.refracted)

    def unfolded(self, sound_path, offset) -> tuple[np.ndarray, np.ndarray]:
        """Surface position and unfolded depth of points off the axis, m.

        ``offset`` is measured across the axis, positive toward the surface
        ahead of the beam (the far edge).
        """
        b = self.refracted
        s = np.asarray(sound_path, dtype=float)
        o = np.asarray(offset, dtype=float)
        x = self.exit_point + s * math.sin(b) + o * math.cos(b)
        return x, s * math.cos(b) - o * math.sin(b)

    def fold(self, y) -> np.ndarray:
        """Unfolded depth to depth in the plate: mirrored at the back wall."""
        y = np.asarray(y, dtype=float)
        t = self.thickness
        return np.where(y > t, 2.0 * t - y, y)


@dataclass(frozen=True)
class SectionFootprint:
    """Where a level's edges cross the flaw depth on one leg, m along the surface."""

    leg: int
    level_db: float
    near: float
    far: float
    sound_path: float  # m along the axis to the flaw depth on this leg
    surface_distance: float  # m from the exit point to the axis at the flaw depth

    @property
    def width(self) -> float:
        """The footprint along the flaw depth (horizontal), m."""
        return self.far - self.near


def _edge_polyline(
    geometry: SectionGeometry,
    edge: BeamEdge,
    side: float,
    samples: int = 400,
    *,
    to_surface: bool = False,
):
    """Unfolded (x, y) of one edge, sampled densely; NaN beyond the last leg drawn.

    The exact points where the edge meets the back wall (and, for two legs,
    returns to the surface) are added, so the fold has a sharp corner.

    With ``to_surface`` the edge starts on the scanning surface, as the beam
    in the part does: an edge whose first sample lies below the surface is
    continued back up to it at its first width (the third array returned,
    ``held``, is True there), and whatever lies above the surface (in the
    wedge) is NaN. Without it, only the given samples are used.
    """
    b = geometry.refracted
    first = edge.sound_path[0]
    start = first
    if to_surface:  # the held line meets the surface where s cos b - o sin b = 0
        start = min(first, side * 0.5 * edge.width[0] * math.tan(b))
    s = np.unique(np.concatenate([np.linspace(start, edge.sound_path[-1], samples), [first]]))

    def at(s):
        return geometry.unfolded(s, side * 0.5 * np.interp(s, edge.sound_path, edge.width))

    t = geometry.thickness
    walls = ((0.0,) if to_surface else ()) + (t, 2.0 * t)[: geometry.legs]
    for wall in walls:
        _, y = at(s)
        d = y - wall
        idx = np.flatnonzero((d[:-1] <= 0) != (d[1:] <= 0))
        if idx.size:
            hit = s[idx] + (s[idx + 1] - s[idx]) * d[idx] / (d[idx] - d[idx + 1])
            s = np.unique(np.concatenate([s, hit]))
    x, y = at(s)
    beyond = y > geometry.legs * t * (1.0 + 1e-12)
    if to_surface:
        beyond |= y < -1e-12 * t
    x, y = np.where(beyond, np.nan, x), np.where(beyond, np.nan, y)
    if to_surface:
        return x, y, s < first
    return x, y


def _cross_level(x: np.ndarray, y: np.ndarray, level: float) -> list[float]:
    d = y - level
    idx = np.flatnonzero((d[:-1] <= 0) != (d[1:] <= 0))
    return [float(x[i] + (x[i + 1] - x[i]) * d[i] / (d[i] - d[i + 1])) for i in idx]


def section_footprints(geometry: SectionGeometry) -> list[SectionFootprint]:
    """The footprint of each level at the flaw depth on each drawn leg (none without a depth).

    On leg 1 the flaw depth ``d`` is unfolded depth ``d``; on leg 2 it is
    ``2 t - d`` (:func:`beamspread.setups.leg_geometry`). A level whose
    edges do not both reach that depth gives no footprint.
    """
    from ..setups import leg_geometry

    if geometry.flaw_depth is None:
        return []
    out = []
    for leg in range(1, geometry.legs + 1):
        path, surface, unfolded = leg_geometry(
            geometry.flaw_depth, geometry.refracted, geometry.thickness, leg
        )
        for edge in geometry.edges:
            ends = []
            for side in (-1.0, 1.0):
                x, y = _edge_polyline(geometry, edge, side)
                hits = _cross_level(x, y, unfolded)
                ends.append(hits[0] if hits else None)
            if None in ends:
                continue
            a, b = ends  # folding keeps the surface position, so leg 2 reads the same way
            out.append(SectionFootprint(leg, edge.level_db, min(a, b), max(a, b), path, surface))
    return out


@dataclass(frozen=True)
class _Traced:
    """What the section shows, in metres: each edge's two sides (folded) and the x range."""

    edges: list  # [(edge, [(x, depth, held), (x, depth, held)])]
    footprints: list[SectionFootprint]
    left: float
    right: float


def _trace_section(g: SectionGeometry) -> _Traced:
    edges = []
    xs = [g.exit_point, *g.unfolded(np.linspace(0.0, g.path_length, g.legs + 1), 0.0)[0]]
    for edge in g.edges:
        sides = []
        for side in (-1.0, 1.0):
            x, y, held = _edge_polyline(g, edge, side, to_surface=True)
            sides.append((x, g.fold(y), held))
            if np.any(np.isfinite(x)):
                xs += [float(np.nanmin(x)), float(np.nanmax(x))]
        edges.append((edge, sides))
    prints = section_footprints(g)
    xs += [v for fp in prints for v in (fp.near, fp.far)]
    low, high = min(xs), max(xs)
    margin = 0.03 * (high - low) + 0.1 * g.thickness
    return _Traced(edges, prints, low - margin, high + margin)


def draw_section(ax: Axes, geometry: SectionGeometry, *, units: str = "mm") -> list:
    """Draw the angle beam on the plate's section into ``ax``; return the legend handles.

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

    # The axis, folded at the back wall.
    ends = np.linspace(0.0, g.path_length, g.legs + 1)
    ax_x, ax_y = g.unfolded(ends, 0.0)
    ax.plot(ax_x * s, g.fold(ax_y) * s, color=_PALETTE[0], lw=1.3, ls="-.", zorder=3)
    handles.append(
        _line(
            color=_PALETTE[0],
            lw=1.3,
            ls="-.",
            label=f"beam axis, {math.degrees(beta):.1f}\u00b0 {g.wave}",
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
                line.set_clip_path(plate)
            (line,) = ax.plot(x[n:] * s, y[n:] * s, color=colour, lw=1.3, ls=ls, zorder=3)
            line.set_clip_path(plate)  # an edge that leaves the plate is not drawn outside
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
            shade.set_clip_path(plate)
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
            label=f"exit point, {_length(g.exit_point, units)}",
        )
    )
    if g.flaw_depth is not None:
        y = g.flaw_depth * s
        ax.axhline(y, color=_MARKS, lw=1.0, ls=(0, (2, 2)), zorder=1)
        handles.append(
            _line(
                color=_MARKS,
                lw=1.0,
                ls=(0, (2, 2)),
                label=f"flaw depth {_length(g.flaw_depth, units)}; footprints "
                "(leg 1 above, leg 2 below):",
            )
        )
        for fp in traced.footprints:
            colour = colours[fp.level_db]
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
    ax.set_ylim(t * s * 1.04, -above * s)
    ax.set_aspect("equal", adjustable="box")  # the section to scale
    ax.set_xlabel(f"surface distance from the exit point's origin, {unit}")
    ax.set_ylabel(f"depth, {unit}")
    levels = ", ".join(_level_text(e.level_db) for e in g.edges)
    ax.set_title(
        f"Angle beam on the section: {g.legs} leg{'s' if g.legs > 1 else ''}"
        + (f", edges at {levels}" if levels else ""),
        fontsize=10,
    )
    return handles


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
        ratio = geometry.thickness / (traced.right - traced.left)
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


# ----------------------------------------------------------------- the sonar cone


def footprint_figure(
    depths: Sequence[float],
    widths_by_level: Mapping[Any, Sequence],
    *,
    near_field: float | None = None,
    mode: str = "one-way",
    caption: str = "",
    units: str = "m",
    size: tuple[float, float] = FIGSIZE,
    in_air: bool = False,
) -> Figure:
    """:func:`plot_footprint`'s picture as a Figure."""
    s, unit = _scale(units, ("m", "ft", "mm", "in"))
    depth = np.asarray([float(d) for d in depths], dtype=float)
    if depth.size < 1 or np.any(~np.isfinite(depth)) or np.any(depth <= 0):
        raise InputError("footprint: give at least one water depth, each above 0")
    order = np.argsort(depth)
    depth = depth[order]
    fig = new_figure(size, caption=caption)
    ax = fig.add_subplot()
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
    # below the plot, so it hides no marker or label of the shallow depths
    ax.legend(loc="upper center", bbox_to_anchor=(0.5, -0.12), ncol=2, fontsize=7.5, frameon=False)
    _width_labels(ax, notes, depth * s)
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
    depths: Sequence[float],
    widths_by_level: Mapping[Any, Sequence],
    path,
    *,
    near_field: float | None = None,
    mode: str = "one-way",
    caption: str = "",
    units: str = "m",
    in_air: bool = False,
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
    check_target(path)
    return save_figure(
        footprint_figure(
            depths,
            widths_by_level,
            near_field=near_field,
            mode=mode,
            caption=caption,
            units=units,
            in_air=in_air,
        ),
        path,
    )
