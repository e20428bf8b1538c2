"""The far-field directivity, one-way and pulse-echo: a polar half-plane or a Cartesian plot."""

from __future__ import annotations

import math
from collections.abc import Mapping
from pathlib import Path
from typing import TYPE_CHECKING

import numpy as np

from ...errors import InputError
from .figure import (
    _PALETTE,
    FIGSIZE,
    _line,
    _polar_figure,
    _strip_legend,
    _with_strip,
    new_figure,
    write_figure,
)
from .scales import _MINUS, FLOOR_DB, _db, _length, _level_text, _levels

if TYPE_CHECKING:
    from matplotlib.axes import Axes
    from matplotlib.figure import Figure


def _pattern_shape(shape: str) -> str:
    aliases = {"disc": "disc", "side": "side", "rectangle": "side"}
    if shape not in aliases:
        raise InputError(f"shape: {shape!r} is unknown; use disc, rectangle or side")
    return aliases[shape]


def _title(shape: str, angles: str) -> str:
    named = "full angles (2 x half-angle)" if angles == "full" else "half-angles from the axis"
    kind = _pattern_shape(shape)
    return f"Far-field directivity, {kind} pattern, one-way and pulse-echo: {named}"


def draw_directivity(
    ax: Axes,
    aperture_by_plane: Mapping[str, float],
    wavelength: float,
    shape: str = "disc",
    *,
    levels_db=(6.0,),
    max_angle: float | None = None,
    angles: str = "half",
) -> list:
    """Draw the far-field pattern into ``ax``; return the legend handles.

    A polar ``ax`` (``projection="polar"``) gets the half-plane in front of
    the face, the beam axis downward and the radius in dB; any other gets a
    Cartesian plot up to ``max_angle`` with its labels and title. No legend
    is drawn. See :func:`plot_directivity` for the parameters.
    """
    from ... import pattern
    from ...probes import check_positive

    polar = ax.name == "polar"
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
    if polar:
        ax.set_theta_zero_location("S")  # the beam points down, as on the map
        ax.set_thetamin(-top)
        ax.set_thetamax(top)
        ax.set_ylim(FLOOR_DB, 0.0)
        ax.set_yticks(np.arange(FLOOR_DB + 10.0, 0.1, 10.0))  # the centre is the floor
        ax.set_yticklabels([f"{v:g}".replace("-", _MINUS) for v in ax.get_yticks()], fontsize=7)
    else:
        ax.set_xlim(-top, top)
        ax.set_ylim(FLOOR_DB, 3.0)
        ax.set_xlabel("angle from the beam axis, deg")
        ax.set_ylabel("dB re the on-axis amplitude")
        ax.set_title(_title(kind, angles), fontsize=10)
        ax.grid(True, color="0.88", lw=0.6)
    return handles


def directivity_figure(
    aperture_by_plane: Mapping[str, float],
    wavelength: float,
    shape: str = "disc",
    *,
    polar: bool = True,
    angles: str = "half",
    caption: str = "",
    size: tuple[float, float] = FIGSIZE,
    **options,
) -> Figure:
    """:func:`plot_directivity`'s picture as a Figure.

    ``options`` as for :func:`draw_directivity`.
    """
    options["angles"] = angles
    if not polar:
        fig = new_figure(size, caption=caption)
        grid, strip = _with_strip(fig)
        handles = draw_directivity(
            fig.add_subplot(grid[0]), aperture_by_plane, wavelength, shape, **options
        )
        _strip_legend(strip, handles, ncol=1)  # below the plot: the labels are long
        return fig
    rows = len(dict(aperture_by_plane)) * 2 + 1
    fig, legend_bottom = _polar_figure(size, caption, rows)
    handles = draw_directivity(fig.axes[0], aperture_by_plane, wavelength, shape, **options)
    fig.text(
        0.5,
        1.0 - 6.0 / (72.0 * fig.get_figheight()),
        _title(shape, angles) + "\nradius: dB re the on-axis amplitude (centre "
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
    return fig


def plot_directivity(
    aperture_by_plane: Mapping[str, float], wavelength: float, shape: str, path, **options
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
    return write_figure(path, directivity_figure, aperture_by_plane, wavelength, shape, **options)


def _angle_text(level: float, half: float, angles: str) -> str:
    """``-3 dB full 8.78° (±4.39°)`` or ``-3 dB ±4.39° (full 8.78°)``; none past 90°."""
    if math.isnan(half):
        return f"{_level_text(level)} none"
    h = math.degrees(half)
    if angles == "full":
        return f"{_level_text(level)} full {2 * h:.2f}\u00b0 (\u00b1{h:.2f}\u00b0)"
    return f"{_level_text(level)} \u00b1{h:.2f}\u00b0 (full {2 * h:.2f}\u00b0)"
