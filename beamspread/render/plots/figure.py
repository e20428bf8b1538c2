"""What every picture shares: the headless figure, the atomic write, the small helpers.

Each ``plot_*`` function of :mod:`beamspread.render.plots` draws one picture
and writes it to a path whose suffix chooses the format (``.png``, ``.svg``
or ``.pdf``) through :func:`save_figure`: a temporary file in the same folder,
so that nothing half-written is ever left. Each has a ``*_figure`` twin that
returns the :class:`matplotlib.figure.Figure` instead, and a ``draw_*``
function that draws on a given Axes and returns its legend handles (for a
page that gathers several).

Conventions drawn on every picture: lengths in ``units`` and levels in dB
(:mod:`.scales`), and the mode (pulse-echo or one-way) in the title or the
labels. A ``caption`` is drawn as a line (wrapped if long) along the foot of
the picture.

matplotlib is imported inside the functions that draw, with the Agg canvas
attached to each figure directly: nothing here touches pyplot's global state
or needs a display, and importing this module costs nothing.
"""

from __future__ import annotations

import os
import textwrap
from pathlib import Path
from typing import TYPE_CHECKING

from ...atomic import write_atomically
from ...errors import InputError

if TYPE_CHECKING:
    from matplotlib.figure import Figure

FORMATS = (".png", ".svg", ".pdf")
FIGSIZE = (7.0, 4.5)  # inches: half a printed page
DPI = 150
COLORMAP = "cividis"  # perceptually uniform, readable in grey and by most colour-blind readers
CAPTION_SIZE = 7.0  # points

# Lines on white: a dark blue, a brick red, a sea green, an ochre and a grey, in that order.
_PALETTE = ("#1d3557", "#b5473a", "#2a7f62", "#c28a1e", "#6c6c6c")
_STYLES = ("-", "--", ":", "-.")
_MARKS = "#e9724c"  # depth lines and footprints on the map and the section


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
    return write_atomically(
        target, lambda name: fig.savefig(name, format=target.suffix.lower()[1:], dpi=fig.dpi)
    )


def write_figure(path: str | os.PathLike, make, *args, **kwargs) -> Path:
    """Check ``path`` (:func:`check_target`), then write ``make(*args, **kwargs)`` there.

    The ``plot_*`` functions are this over their ``*_figure`` twins: a bad
    path is refused before anything is drawn.
    """
    check_target(path)
    return save_figure(make(*args, **kwargs), path)


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
