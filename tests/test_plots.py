"""Pictures: each format written and not blank, what is drawn agrees with the numbers, bad paths.

The numbers a picture must agree with come from the field engine
(:func:`beamspread.field.beam_widths`), not from the picture code: the test
finds the drawn -6 dB contour in the saved PNG's pixels and compares it with
the computed width at the depth of that pixel row.
"""

from __future__ import annotations

import itertools
import math
import re
import zlib

import numpy as np
import pytest

from beamspread.axis import disc_near_field
from beamspread.errors import InputError
from beamspread.field import (
    axial_profile,
    beam_widths,
    field_map,
    last_maximum,
    transverse_profile,
)
from beamspread.probes import Disc, Rectangle
from beamspread.render import plots
from beamspread.render.plots.figure import _PALETTE

SPEED = 5920.0  # m/s, an invented steel
DISC = Disc(0.010, 5e6)
LAM = SPEED / DISC.frequency
NEAR = float(disc_near_field(DISC.diameter, LAM))


@pytest.fixture(scope="module")
def beam_map():
    return field_map(
        DISC, SPEED, np.linspace(-0.012, 0.012, 128), np.linspace(0.1 * NEAR, 3 * NEAR, 256)
    )


def _pictures(beam_map):
    """One call per picture: name -> function(path)."""
    rect = Rectangle(0.02, 0.01, 5e6)
    profiles = [
        transverse_profile(rect, SPEED, 0.08, np.linspace(-0.012, 0.012, 121), plane=n)
        for n in ("length", "width")
    ]
    widths = {n: beam_widths(rect, SPEED, 0.08, [6, 20], plane=n) for n in ("length", "width")}
    axial = axial_profile(DISC, SPEED, np.linspace(0.05 * NEAR, 3 * NEAR, 300))
    edges = tuple(
        plots.BeamEdge.from_half_angle(level, math.radians(angle), 0.1, start_width=0.006)
        for level, angle in ((6, 5.0), (20, 9.0))
    )
    section = plots.SectionGeometry(0.025, math.radians(45), 0.0, edges, flaw_depth=0.015)
    caption = "Invented example: disc 10 mm, 5 MHz, 5920 m/s, pulse-echo, continuous wave"
    return {
        "map": lambda p: plots.plot_map(
            beam_map, p, near_field=NEAR, depths=[0.04], caption=caption
        ),
        "axis": lambda p: plots.plot_axis(
            axial, p, near_field=NEAR, axial_maximum=last_maximum(DISC, SPEED), caption=caption
        ),
        "across": lambda p: plots.plot_across(profiles, widths, p, caption=caption, units="in"),
        "polar": lambda p: plots.plot_directivity(
            dict(DISC.planes), LAM, "disc", p, caption=caption
        ),
        "cartesian": lambda p: plots.plot_directivity(
            dict(rect.planes), LAM, "rectangle", p, polar=False, levels_db=(6, 20)
        ),
        "section": lambda p: plots.plot_section(section, p, caption=caption),
        "footprint": lambda p: plots.plot_footprint(
            [5.0, 10.0, 20.0],
            {3: [0.8, 1.6, 3.2], "-10 dB, length plane": [1.4, 2.8, 5.6]},
            p,
            near_field=2.0,
            caption="Invented widths",
        ),
    }


NAMES = ["map", "axis", "across", "polar", "cartesian", "section", "footprint"]


def _read_png(path) -> np.ndarray:
    from matplotlib.image import imread

    return imread(str(path))


@pytest.mark.parametrize("name", NAMES)
@pytest.mark.parametrize("suffix", [".png", ".svg", ".pdf"])
def test_each_picture_in_each_format_is_written_and_not_blank(tmp_path, beam_map, name, suffix):
    target = tmp_path / f"{name}{suffix}"
    written = _pictures(beam_map)[name](target)
    assert written == target and target.is_file()
    assert [p.name for p in tmp_path.iterdir()] == [target.name]  # no temporary left
    data = target.read_bytes()
    if suffix == ".png":
        image = _read_png(target)
        assert image.shape[:2] == (round(4.5 * plots.DPI), round(7 * plots.DPI)) or (
            name == "section"
        )
        colours = np.unique((image[..., :3] * 255).astype(np.uint8).reshape(-1, 3), axis=0)
        assert len(colours) > 200
    elif suffix == ".svg":
        text = data.decode("utf-8")
        assert text.lstrip().startswith("<?xml") and "<svg" in text
        assert len(re.findall(r"<path ", text)) > 20
    else:
        assert data.startswith(b"%PDF")
        streams = re.findall(rb"stream\r?\n(.*?)endstream", data, re.S)
        content = b"".join(zlib.decompress(s) if s[:1] == b"x" else s for s in streams)
        assert content.count(b" l") + content.count(b" c") > 50  # lines and curves drawn


def _dark_runs(row: np.ndarray) -> list[float]:
    """Centres of runs of near-black pixels in one PNG row."""
    dark = row[:, :3].sum(axis=1) < 0.45
    centres, start = [], None
    for i, flag in enumerate([*dark, False]):
        if flag and start is None:
            start = i
        elif not flag and start is not None:
            centres.append(0.5 * (start + i - 1))
            start = None
    return centres


@pytest.mark.parametrize("depth_mm", [30.0, 37.0, 43.0, 50.0, 58.0])
def test_the_map_contour_crosses_each_depth_at_the_computed_width(tmp_path, beam_map, depth_mm):
    fig = plots.map_figure(beam_map, levels_db=(6, 20), near_field=NEAR, depths=[0.04])
    path = plots.save_figure(fig, tmp_path / "map.png")
    image = _read_png(path)
    ax = next(a for a in fig.axes if a.images)  # the map, as laid out when it was saved
    height = image.shape[0]
    # The pixel row nearest the depth, and the depth that row shows (mm -> m).
    _, y = ax.transData.transform((0.0, depth_mm))
    row = round(height - y - 0.5)
    depth = ax.transData.inverted().transform((0.0, height - row - 0.5))[1] * 1e-3
    width = beam_widths(DISC, SPEED, depth, [6.0])[0].width
    expected = [ax.transData.transform((side * width / 2 * 1e3, 0.0))[0] - 0.5 for side in (-1, 1)]
    runs = _dark_runs(image[row])
    for x in expected:
        nearest = min(runs, key=lambda c: abs(c - x))
        assert abs(nearest - x) <= 2.0, (depth, x, nearest)


def test_the_depth_line_and_the_near_field_are_where_asked(beam_map):
    fig = plots.new_figure()
    ax = fig.add_subplot()
    drawn = plots.draw_map(ax, beam_map, near_field=NEAR, depths=[0.04], units="in")
    assert drawn.depth_lines[0].get_ydata()[0] == pytest.approx(0.04 / 0.0254)
    assert drawn.near_field.get_ydata()[0] == pytest.approx(NEAR / 0.0254)
    assert set(drawn.contours) == {6.0, 20.0}
    assert ax.get_ylim()[0] > ax.get_ylim()[1]  # depth grows downward
    assert "in" in ax.get_xlabel() and "in" in ax.get_ylabel()


def test_section_footprint_is_where_the_edges_cross_the_flaw_depth():
    # Far-field cone edges from the exit point: at unfolded depth d along an axis at
    # beta from the normal, the edges at beta -+ theta meet the depth at d tan(beta -+ theta).
    beta, theta, d, t = math.radians(45), math.radians(6), 0.015, 0.025
    edge = plots.BeamEdge.from_half_angle(6, theta, 0.2)
    g = plots.SectionGeometry(t, beta, 0.002, (edge,), flaw_depth=d)
    one, two = plots.section_footprints(g)

    # Edges leave at beta -+ theta only approximately for a cone of width 2 s tan(theta)
    # measured across the axis; compute the exact crossing of the offset line instead.
    def crossing(depth, side):
        # x = s sin b + o cos b, y = s cos b - o sin b, o = side s tan(theta)
        s = depth / (math.cos(beta) - side * math.tan(theta) * math.sin(beta))
        return 0.002 + s * math.sin(beta) + side * s * math.tan(theta) * math.cos(beta)

    assert (one.near, one.far) == pytest.approx((crossing(d, -1), crossing(d, 1)), abs=1e-9)
    assert (two.near, two.far) == pytest.approx(
        sorted([crossing(2 * t - d, -1), crossing(2 * t - d, 1)]), abs=1e-9
    )
    assert one.sound_path == pytest.approx(d / math.cos(beta))
    assert two.surface_distance == pytest.approx((2 * t - d) * math.tan(beta))


@pytest.mark.parametrize("name", NAMES)
def test_bad_suffix_and_missing_folder_leave_nothing(tmp_path, beam_map, name):
    draw = _pictures(beam_map)[name]
    with pytest.raises(InputError, match=r"\.png, \.svg, \.pdf"):
        draw(tmp_path / "picture.jpg")
    with pytest.raises(InputError, match="does not exist"):
        draw(tmp_path / "missing" / "picture.png")
    assert list(tmp_path.iterdir()) == []


def test_a_failure_while_saving_leaves_nothing(tmp_path, monkeypatch, beam_map):
    fig = plots.map_figure(beam_map)

    def broken(*args, **kwargs):
        raise RuntimeError("disk full")

    monkeypatch.setattr(fig, "savefig", broken)
    target = tmp_path / "map.pdf"
    target.write_bytes(b"old")
    with pytest.raises(RuntimeError):
        plots.save_figure(fig, target)
    assert [p.name for p in tmp_path.iterdir()] == ["map.pdf"]
    assert target.read_bytes() == b"old"


def test_bad_inputs_are_refused(tmp_path, beam_map):
    with pytest.raises(InputError, match="units"):
        plots.plot_map(beam_map, tmp_path / "m.png", units="cm")
    with pytest.raises(InputError, match="level"):
        plots.plot_map(beam_map, tmp_path / "m.png", levels_db=(0,))
    with pytest.raises(InputError, match="shape"):
        plots.plot_directivity({"x": 0.01}, LAM, "hexagon", tmp_path / "d.png")
    with pytest.raises(InputError, match="flaw depth"):
        plots.SectionGeometry(0.02, 0.5, flaw_depth=0.03)
    with pytest.raises(InputError, match="widths"):
        plots.plot_footprint([1.0, 2.0], {3: [0.5]}, tmp_path / "f.png")
    assert list(tmp_path.iterdir()) == []


def test_matplotlib_is_not_imported_by_the_module_alone():
    import subprocess
    import sys

    code = (
        "import sys, beamspread.render.plots, beamspread.scan, beamspread.setupfile; "
        "print('matplotlib' in sys.modules)"
    )
    out = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, check=True
    ).stdout.strip()
    assert out == "False"


@pytest.mark.parametrize(("near_field", "drawn"), [(0.5, True), (0.019, False)])
def test_footprint_near_field_is_hatched_or_named(near_field, drawn):
    # The near field is a hatched band where it can be seen (never the tint of the cone), and
    # named in the legend as too thin to draw where it is under 1 % of the depth shown.
    fig = plots.footprint_figure([10.0, 30.0], {3: [3.1, 9.3]}, near_field=near_field)
    ax = fig.axes[0]
    texts = [t.get_text() for t in ax.get_legend().get_texts()]
    (entry,) = [t for t in texts if t.startswith("near field")]
    assert ("too thin" in entry) is not drawn
    assert any(p.get_hatch() == "///" for p in ax.patches) is drawn


# ----------------------------------------------------------------- what a reader must see


def _display_points(line) -> np.ndarray:
    """A line's finite points in display coordinates (pixels), through its own transform."""
    xy = np.column_stack([line.get_xdata(), line.get_ydata()]).astype(float)
    xy = xy[np.all(np.isfinite(xy), axis=1)]
    return line.get_transform().transform(xy) if xy.size else xy.reshape(0, 2)


def _j1_root(value: float) -> float:
    """x where the disc's pattern 2 J1(x)/x falls to ``value`` (with scipy.special.j1)."""
    from scipy.optimize import brentq
    from scipy.special import j1

    return brentq(lambda x: 2 * j1(x) / x - value, 1e-6, 3.8317)


@pytest.mark.parametrize(("angles", "level_db"), [("half", 6.0), ("full", 3.0)])
def test_directivity_states_half_and_full_angles_against_the_disc_pattern(angles, level_db):
    # The one-way far field of a baffled disc is 2 J1(x)/x with x = pi D sin(theta) / lambda
    # (Kinsler & Frey, Fundamentals of Acoustics, the baffled circular piston); the level's
    # half-angle is found here with scipy, not with beamspread.pattern.
    diameter, wavelength = 0.05, 1489.8 / 200e3
    x = _j1_root(10 ** (-level_db / 20))
    half = math.degrees(math.asin(x * wavelength / (math.pi * diameter)))
    fig = plots.directivity_figure(
        {"diameter": diameter}, wavelength, "disc", levels_db=(level_db,), angles=angles
    )
    labels = [t.get_text() for t in fig.legends[0].get_texts()]
    (one_way,) = [t for t in labels if "one-way" in t]
    assert f"\u00b1{half:.2f}\u00b0" in one_way and f"full {2 * half:.2f}\u00b0" in one_way
    title = " ".join(t.get_text() for t in fig.texts)
    assert ("full angles" in title) is (angles == "full")
    assert ("half-angles" in title) is (angles == "half")
    # The lead value is the convention asked for.
    first = one_way.split(": ", 1)[1]
    assert first.startswith(
        f"{_MINUS}{level_db:g} dB " + ("full" if angles == "full" else "\u00b1")
    )


_MINUS = "\u2212"


def test_axis_markers_at_the_ends_are_drawn_whole(tmp_path):
    # A profile falling through -6 dB in its very last step: the crossing sits at the last depth.
    depth = np.linspace(0.01, 0.06, 51)
    amplitude = np.ones_like(depth)
    amplitude[-1] = 10 ** (-6.01 / 20)
    profile = plots_profile(depth, amplitude)
    fig = plots.axis_figure(profile, levels_db=(6,))
    fig.draw_without_rendering()
    ax = fig.axes[0]
    box = ax.get_window_extent()
    (markers,) = [line for line in ax.lines if line.get_marker() == "o"]
    radius = (markers.get_markersize() + markers.get_markeredgewidth()) / 2 * fig.dpi / 72
    for x, y in _display_points(markers):
        assert box.x0 + radius <= x <= box.x1 - radius
        assert box.y0 + radius <= y <= box.y1 - radius


def plots_profile(depth, amplitude):
    from beamspread.field import AxialProfile

    return AxialProfile(depth=depth, amplitude=amplitude, mode="one-way", bandwidth=0.0)


def _computed_like_section(flaw_depth=0.015):
    """Edges like the computed field's: samples begin a little way into the part, already wide."""
    paths = np.linspace(0.003, 0.14, 30)
    edges = (
        plots.BeamEdge(6, paths, 0.009 + 2 * paths * math.tan(math.radians(4.5))),
        plots.BeamEdge(20, paths, 0.016 + 2 * paths * math.tan(math.radians(7.7))),
    )
    return plots.SectionGeometry(0.025, math.radians(60), 0.0, edges, flaw_depth=flaw_depth)


def test_section_edges_start_on_the_surface_and_everything_is_inside_the_axes():
    g = _computed_like_section()
    fig = plots.section_figure(g)
    fig.draw_without_rendering()
    ax = next(a for a in fig.axes if a.get_title())  # the section; the other holds the legend
    (x0, x1), (y1, y0) = ax.get_xlim(), ax.get_ylim()  # depth grows downward
    for line in ax.lines:
        x, y = np.asarray(line.get_xdata(), float), np.asarray(line.get_ydata(), float)
        ok = np.isfinite(x) & np.isfinite(y)
        assert np.all((x[ok] >= x0) & (x[ok] <= x1)), line.get_label()
        assert np.all((y[ok] >= y0) & (y[ok] <= y1)), line.get_label()
    box = ax.get_window_extent()
    for line in ax.lines:  # the footprint bars and the exit mark are shifted in points
        for px, py in _display_points(line):
            assert box.x0 - 0.5 <= px <= box.x1 + 0.5 and box.y0 - 0.5 <= py <= box.y1 + 0.5
    # Each level's two edges leave the scanning surface (depth 0) and never rise above it.
    tol = 1e-9
    edges = [line for line in ax.lines if len(line.get_xdata()) > 3]
    held = [line for line in edges if line.get_alpha() is not None]
    assert held  # these edges begin in the part: their first stretch is held, drawn lighter
    for i in range(len(g.edges)):
        colour = _PALETTE[1 + i]
        mine = [line for line in edges if line.get_color() == colour]
        assert all(_data(line)[:, 1].min() >= -tol for line in mine)
        assert sum(abs(_data(line)[0, 1]) < tol for line in mine) == 2  # one start per side
    # The shading lies between the main level's two edges: its vertices are their points.
    (shade,) = [p for p in ax.patches if p.get_alpha() == 0.12]
    main = np.concatenate([_data(line) for line in edges if line.get_color() == _PALETTE[1]])
    for vx, vy in shade.get_xy():
        assert vy >= -tol
        assert np.min(np.hypot(main[:, 0] - vx, main[:, 1] - vy)) < tol


def _data(line) -> np.ndarray:
    xy = np.column_stack([line.get_xdata(), line.get_ydata()]).astype(float)
    return xy[np.all(np.isfinite(xy), axis=1)]


def test_section_footprints_are_inside_the_range_on_rows_of_their_own():
    g = _computed_like_section()
    prints = plots.section_footprints(g)
    assert {(fp.leg, fp.level_db) for fp in prints} == {(1, 6), (1, 20), (2, 6), (2, 20)}
    fig = plots.section_figure(g)
    fig.draw_without_rendering()
    ax = next(a for a in fig.axes if a.get_title())  # the section; the other holds the legend
    low, high = ax.get_xlim()
    assert all(low < fp.near * 1e3 and fp.far * 1e3 < high for fp in prints)
    bars = [line for line in ax.lines if line.get_marker() == "|"]
    assert len(bars) == len(prints)
    rows = [_display_points(bar)[0][1] for bar in bars]
    # No two bars share a row: legs 1 and 2 of one level never run together.
    gaps = np.diff(np.sort(rows)) * 72 / fig.dpi
    assert np.all(gaps >= 3.5), gaps
    _, flaw = ax.transData.transform((0.0, g.flaw_depth * 1e3))
    for fp, y in zip(prints, rows, strict=True):
        assert bool(y > flaw) is (fp.leg == 1)  # leg 1 above the flaw-depth line, leg 2 below
    (strip,) = [a for a in fig.axes if a is not ax]
    legend = [t.get_text() for t in strip.get_legend().get_texts()]
    assert any("leg 1 above, leg 2 below" in t for t in legend)


def test_footprint_width_labels_are_clear_of_every_line(tmp_path):
    # Widths of an invented -3 dB and -10 dB cone, labelled at four depths.
    depths = [10.0, 20.0, 30.0, 40.0]
    fig = plots.footprint_figure(
        depths,
        {3: [1.54, 3.07, 4.61, 6.14], 10: [2.61, 5.23, 7.84, 10.5]},
        near_field=0.08,
    )
    fig.draw_without_rendering()
    ax = fig.axes[0]
    from matplotlib.text import Annotation

    labels = [t for t in ax.texts if isinstance(t, Annotation)]
    assert len(labels) == 8
    box = ax.get_window_extent()
    cone = [line for line in ax.lines if len(line.get_xdata()) > 2]
    assert len(cone) == 4
    for label in labels:
        b = label.get_window_extent()
        assert box.x0 <= b.x0 and b.x1 <= box.x1 and box.y0 <= b.y0 and b.y1 <= box.y1
        for line in cone:  # sample each straight piece densely on screen
            p = _display_points(line)
            for (ax0, ay0), (ax1, ay1) in itertools.pairwise(p):
                u = np.linspace(0, 1, 400)
                xs, ys = ax0 + u * (ax1 - ax0), ay0 + u * (ay1 - ay0)
                inside = (xs > b.x0) & (xs < b.x1) & (ys > b.y0) & (ys < b.y1)
                assert not inside.any(), (label.get_text(), line.get_label())
    assert all(t.get_text().startswith(_MINUS) for t in labels)  # each names its level


def test_map_marks_and_names_the_near_field_and_the_pulse_maximum(beam_map):
    fig = plots.map_figure(beam_map, near_field=NEAR, axial_maximum=0.9 * NEAR)
    (legend,) = [a.get_legend() for a in fig.axes if a.get_legend()]
    texts = [t.get_text() for t in legend.get_texts()]
    assert any(t.startswith(f"{_MINUS}6 dB") for t in texts)
    assert any(t.startswith(f"{_MINUS}20 dB") for t in texts)
    assert any(t.startswith("near field N = ") for t in texts)
    assert any(t.startswith("last on-axis maximum of the pulse") for t in texts)
    ax = plots.new_figure().add_subplot()
    plots.draw_map(ax, beam_map, plane="incidence")
    assert "incidence plane" in ax.get_xlabel()
