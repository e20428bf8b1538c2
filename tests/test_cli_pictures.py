"""Pictures, scan plans, setup files and the report on the command line."""

from __future__ import annotations

import itertools
import json

import numpy as np
import pytest

DISC = ("--diameter", "10mm", "--frequency", "5MHz", "--speed", "5920m/s")
WELD = (
    "--diameter",
    "12.7mm",
    "--frequency",
    "2.25MHz",
    "--material",
    "reference-steel",
    "--wedge",
    "acrylic",
    "--refracted",
    "60",
    "--wedge-path",
    "12mm",
    "--thickness",
    "25mm",
    "--depth",
    "15mm",
)


def _not_blank(path):
    data = path.read_bytes()
    assert len(data) > 5000
    if path.suffix == ".png":
        import matplotlib.image

        image = matplotlib.image.imread(path)
        assert len(np.unique(image.reshape(-1, image.shape[-1]), axis=0)) > 50


@pytest.mark.parametrize("suffix", [".png", ".svg", ".pdf"])
@pytest.mark.parametrize(
    "args",
    [
        ("beam", *DISC),
        (
            "beam",
            "--diameter",
            "25mm",
            "--frequency",
            "200kHz",
            "--material",
            "seawater",
            "--sonar",
            "--bottom-depth",
            "5m:40m:5m",
            "--far-field-only",
        ),
        ("axis", *DISC, "--points", "80"),
        ("across", *DISC, "--depth", "40mm", "--points", "61"),
        ("map", *DISC, "--depth-points", "40", "--lateral-points", "30"),
        ("section", *WELD, "--far-field-only"),
    ],
)
def test_plot_is_written_in_each_format(run, tmp_path, args, suffix):
    out = tmp_path / f"picture{suffix}"
    r = run(*args, "--plot", str(out))
    assert r.code == 0, r.stderr
    _not_blank(out)
    assert [p.name for p in tmp_path.iterdir()] == [out.name]  # no temporary file left


@pytest.mark.parametrize(
    ("target", "needle"), [("beam.bmp", ".png"), ("nowhere/beam.png", "folder")]
)
def test_bad_plot_path_is_refused_before_computing(run, tmp_path, monkeypatch, target, needle):
    monkeypatch.chdir(tmp_path)
    r = run("beam", *DISC, "--plot", target)
    assert r.code == 2 and needle in r.stderr and len(r.stderr.strip().splitlines()) == 1
    assert list(tmp_path.iterdir()) == []


def test_scan_plan_follows_the_overlap_rule(run):
    data = run(
        "index-step", *DISC, "--from", "10mm", "--to", "60mm", "--overlap", "25%", "--json"
    ).json()
    # common practice: index step = narrowest width over the depths x (1 - overlap)
    assert data["governing_width_m"] == pytest.approx(min(data["widths_m"]))
    assert data["index_step_m"] == pytest.approx(0.75 * data["governing_width_m"])
    assert data["overlap"] == 0.25 and data["level_db"] == -6.0


def test_scan_plan_far_field_governs_at_the_shallowest_depth(run):
    # The far-field cone only grows with depth (2 z tan theta): the first depth governs.
    data = run(
        "index-step",
        *DISC,
        "--from",
        "30mm",
        "--to",
        "90mm",
        "--overlap",
        "0.1",
        "--method",
        "far-field",
        "--json",
    ).json()
    assert data["governing_depth_m"] == pytest.approx(0.030)
    assert data["index_step_m"] == pytest.approx(0.9 * data["governing_width_m"])


def test_scan_plan_bad_overlap(run):
    r = run("index-step", *DISC, "--from", "10mm", "--to", "60mm", "--overlap", "120%")
    assert r.code == 2 and "overlap" in r.stderr


def test_setup_file_round_trip(run, tmp_path):
    saved = tmp_path / "weld.toml"
    first = run("beam", *WELD, "--far-field-only", "--json", "--save", str(saved))
    assert first.code == 0, first.stderr and saved.exists()
    again = run("beam", "--setup", str(saved), "--far-field-only", "--json")
    assert again.code == 0, again.stderr
    assert again.json() == first.json()
    # a typed option wins over the file's
    other = run(
        "beam", "--setup", str(saved), "--refracted", "45", "--far-field-only", "--json"
    ).json()
    assert other["refraction"]["refracted_deg"]["shear"] == pytest.approx(45.0)


def test_save_never_overwrites(run, tmp_path):
    saved = tmp_path / "keep.toml"
    saved.write_text("precious\n")
    r = run("beam", *DISC, "--save", str(saved))
    assert r.code == 2 and saved.read_text() == "precious\n"


def test_setup_with_unknown_key_is_refused_with_its_line(run, tmp_path):
    bad = tmp_path / "bad.toml"
    bad.write_text(
        'format = 1\n[probe]\nshape = "disc"\ndiamter = "10 mm"\nfrequency = "5 MHz"\n'
        '[medium]\nspeed = "5920 m/s"\n'
    )
    r = run("beam", "--setup", str(bad))
    assert r.code == 2
    line = r.stderr.strip()
    assert "diamter" in line and ":4" in line


def test_setup_with_wrong_units_is_refused(run, tmp_path):
    bad = tmp_path / "bad.toml"
    bad.write_text(
        'format = 1\n[probe]\nshape = "disc"\ndiameter = "10 MHz"\n'
        'frequency = "5 MHz"\n[medium]\nspeed = "5920 m/s"\n'
    )
    r = run("axis", "--setup", str(bad))
    assert r.code == 2 and "diameter" in r.stderr


@pytest.mark.parametrize("suffix", [".pdf", ".png"])
def test_report_is_one_page_and_never_overwrites(run, tmp_path, suffix):
    setup = tmp_path / "weld.toml"
    assert run("beam", *WELD, "--far-field-only", "--save", str(setup)).code == 0
    out = tmp_path / f"report{suffix}"
    r = run("report", str(setup), "--output", str(out))
    assert r.code == 0, r.stderr
    _not_blank(out)
    if suffix == ".pdf":
        assert (
            out.read_bytes().count(b"/Type /Page\n") + out.read_bytes().count(b"/Type /Page ") == 1
        )
    before = out.read_bytes()
    r = run("report", str(setup), "--output", str(out))
    assert r.code == 2 and "--force" in r.stderr and out.read_bytes() == before
    assert run("report", str(setup), "--output", str(out), "--force").code == 0


def test_report_bad_suffix(run, tmp_path):
    setup = tmp_path / "s.toml"
    assert run("beam", *DISC, "--save", str(setup)).code == 0
    r = run("report", str(setup), "--output", str(tmp_path / "r.docx"))
    assert r.code == 2 and ".pdf" in r.stderr


def test_saved_setup_is_readable_toml(run, tmp_path):
    import tomllib

    saved = tmp_path / "s.toml"
    assert run("beam", *DISC, "--depth", "30mm", "--level", "6", "--save", str(saved)).code == 0
    data = tomllib.loads(saved.read_text())
    assert data["probe"]["diameter"].endswith("mm") and data["inspection"]["depths"]
    assert json.dumps(data)  # plain data, nothing executable


def test_plot_never_overwrites_without_force(run, tmp_path):
    out = tmp_path / "keep.png"
    out.write_bytes(b"precious")
    r = run("axis", *DISC, "--points", "20", "--plot", str(out))
    assert r.code == 2 and "--force" in r.stderr and out.read_bytes() == b"precious"
    assert run("axis", *DISC, "--points", "20", "--plot", str(out), "--force").code == 0
    _not_blank(out)


def test_save_happens_only_after_the_command_works(run, tmp_path):
    saved = tmp_path / "s.toml"
    r = run(
        "beam",
        "--diameter",
        "10",
        "--frequency",
        "5",
        "--material",
        "unobtanium",
        "--save",
        str(saved),
    )
    assert r.code == 2 and len(r.stderr.strip().splitlines()) == 1
    assert not saved.exists()


def test_section_takes_a_water_path_setup(run, tmp_path):
    saved = tmp_path / "tank.toml"
    tank = ("--diameter", "10mm", "--frequency", "5MHz", "--material", "reference-steel")
    args = (*tank, "--water-path", "30mm", "--far-field-only", "--save", str(saved))
    assert run("beam", *args).code == 0
    # section models a water path: it draws the beam in the part, and asks for the plate
    r = run("section", "--setup", str(saved), "--json")
    assert r.code == 2 and "--thickness" in r.stderr
    r = run("section", "--setup", str(saved), "--thickness", "20mm", "--json")
    assert r.code == 0 and r.json()["couplant"]["path_m"] == 0.030


def test_map_picture_marks_the_near_field(run, tmp_path, monkeypatch):
    # A disc's near field (its last on-axis maximum) is known in closed form,
    # N = (D^2 - lambda^2) / (4 lambda) (Kinsler & Frey, the baffled piston's axial field);
    # a pulse's own last maximum is marked too.
    from beamspread.render import plots

    seen = {}
    monkeypatch.setattr(plots, "plot_map", lambda field_map, path, **kw: seen.update(kw))
    for bandwidth in ("0", "0.5"):
        seen.clear()
        r = run(
            "map",
            *DISC,
            "--bandwidth",
            bandwidth,
            "--depth-points",
            "20",
            "--lateral-points",
            "16",
            "--plot",
            str(tmp_path / f"map{bandwidth}.png"),
        )
        assert r.code == 0, r.stderr
        wavelength = 5920.0 / 5e6
        assert seen["near_field"] == pytest.approx((0.01**2 - wavelength**2) / (4 * wavelength))
        assert (seen["axial_maximum"] is None) is (bandwidth == "0")


def _report_figure(run, tmp_path, monkeypatch, *args):
    """The report's page as a Figure (and the file written), for a setup saved from ``args``."""
    from beamspread.render import plots

    setup = tmp_path / "setup.toml"
    assert run("beam", *args, "--far-field-only", "--save", str(setup)).code == 0
    pages = []
    save = plots.save_figure
    monkeypatch.setattr(
        plots, "save_figure", lambda fig, path: pages.append(fig) or save(fig, path)
    )
    r = run("report", str(setup), "--output", str(tmp_path / "report.png"))
    assert r.code == 0, r.stderr
    (fig,) = pages
    return fig


def test_report_page_is_consistent_with_its_table_and_laid_out(run, tmp_path, monkeypatch):
    import math

    table = run("beam", *WELD, "--far-field-only", "--json").json()
    fig = _report_figure(run, tmp_path, monkeypatch, *WELD)
    renderer = fig.canvas.get_renderer()
    (map_ax,) = [a for a in fig.axes if a.images and a.get_xlabel()]
    # One plane, named alike on the axis and in the title (a disc on a wedge: incidence).
    assert "incidence plane" in map_ax.get_xlabel() and "incidence plane" in map_ax.get_title()
    # The near field drawn is the table's: in the part, measured from the exit point.
    near_mm = table["near_field_m"] * 1e3
    (label,) = [t.get_text() for t in map_ax.texts if t.get_text().startswith("N ")]
    assert label.strip() == f"N {near_mm:.2f} mm"
    # The depth line sits at the sound path of 15 mm deep at 60 degrees: 15 / cos 60 = 30 mm.
    marks = [t.get_text().strip() for t in map_ax.texts if t.get_text().strip().startswith("path")]
    assert f"path {15 / math.cos(math.radians(60)):.2f} mm: 15.00 mm deep, leg 1" in marks
    # Every line type of the map is in its legend.
    legends = [a.get_legend() for a in fig.axes if a.get_legend()]
    texts = [t.get_text() for legend in legends for t in legend.get_texts()]
    for needle in ("\u22126 dB re max.", "\u221220 dB re max.", f"N = {near_mm:.2f} mm"):
        assert any(needle in t for t in texts), needle
    # Nothing overlaps, nothing leaves the page, and no blank band is left between the parts.
    (section,) = [a for a in fig.axes if a.get_title().startswith("Angle beam")]
    (block,) = [t for t in fig.texts if t.get_text().startswith("Beam of")]
    boxes = [
        block.get_window_extent(renderer),
        map_ax.get_tightbbox(renderer),
        legends[0].get_window_extent(renderer),
        section.get_tightbbox(renderer),
        legends[1].get_window_extent(renderer),
    ]
    page = fig.bbox
    for box in boxes:
        assert page.x0 <= box.x0 and box.x1 <= page.x1 and page.y0 <= box.y0 and box.y1 <= page.y1
    for upper, lower in itertools.pairwise(boxes):
        gap = (upper.y0 - lower.y1) / fig.dpi  # inches; the page is laid out top to bottom
        assert 0 <= gap < 0.5, gap


# An invented lake sounder: a 25 mm, 200 kHz disc in fresh water at 8 degC over 5-30 m.
LAKE = (
    "--diameter",
    "25mm",
    "--frequency",
    "200kHz",
    "--material",
    "water",
    "--temperature",
    "8",
    "--sonar",
    "--bottom-depth",
    "5m:30m:5m",
    "--power",
    "100",
)


def _page_text(fig):
    (block,) = [t for t in fig.texts if t.get_text().startswith("Beam of")]
    return block


def test_report_of_a_sonar_setup_carries_beams_sonar_results_and_its_footprint(
    run, tmp_path, monkeypatch
):
    import math

    from scipy.optimize import brentq
    from scipy.special import j1

    from beamspread.render import plots

    drawn = {}
    make = plots.draw_footprint

    def spy(ax, depths, widths, **kw):
        drawn.update(depths=list(depths), widths=dict(widths), **kw)
        return make(ax, depths, widths, **kw)

    monkeypatch.setattr(plots, "draw_footprint", spy)
    fig = _report_figure(run, tmp_path, monkeypatch, *LAKE)
    setup = tmp_path / "setup.toml"
    # The page carries what beam prints for the same setup (its closing caution goes
    # to the foot of the page).
    table = run("beam", "--setup", str(setup))
    assert table.code == 0, table.stderr
    block = _page_text(fig)
    text = block.get_text()
    assert text.rstrip("\n") == table.stdout.split("\nEstimates from")[0].rstrip("\n")
    for needle in (
        "Full angles of the cone",
        "directivity index",
        "absorption",
        "Footprint on a flat bottom",
        "Echo budget of a flat, smooth bottom",
        "P = 100 W, eta = 0.5",
        "bottom reflection loss    10.0 dB",
    ):
        assert needle in text, needle
    # The picture answers the question (the bottom at 5-30 m): the footprint, no map.
    assert drawn["depths"] == pytest.approx([5.0, 10.0, 15.0, 20.0, 25.0, 30.0])
    assert drawn["mode"] == "one-way" and drawn["units"] == "m"
    assert not [a for a in fig.axes if a.images and a.get_xlabel()]  # the map's axes
    # Reference: a disc's one-way far-field directivity 2 J1(x)/x, x = k a sin(theta)
    # (Kinsler & Frey, the baffled piston), its level points found with scipy.special.j1;
    # the footprint is 2 z tan(theta) (common practice).
    speed = run("beam", "--setup", str(setup), "--far-field-only", "--json").json()["medium"]
    wavelength = speed["speed_m_s"] / 200e3
    assert set(drawn["widths"]) == {3.0, 10.0}
    for level, widths in drawn["widths"].items():
        x = brentq(lambda x, lv=level: 2 * j1(x) / x - 10 ** (-lv / 20), 0.1, 3.8317)
        theta = math.asin(x * wavelength / (math.pi * 0.025))
        expected = [2 * z * math.tan(theta) for z in drawn["depths"]]
        assert widths == pytest.approx(expected, rel=1e-6)
    # Laid out: the picture below the text, above the cautions, on the page.
    renderer = fig.canvas.get_renderer()
    (picture,) = [a for a in fig.axes if a.get_title().startswith("Beam footprint")]
    assert not picture.images  # drawn in vector form, not set in as a picture
    text_box = block.get_window_extent(renderer)
    box = picture.get_window_extent(renderer)
    (foot,) = [t for a in fig.axes for t in a.texts if t.get_text().startswith("Estimates")]
    assert box.y1 <= text_box.y0 and foot.get_window_extent(renderer).y1 <= box.y0
    assert fig.bbox.x0 <= box.x0 and box.x1 <= fig.bbox.x1


def test_report_sets_a_long_echo_budget_one_row_per_range(run, tmp_path, monkeypatch):
    import math

    many = (*LAKE[:-4], "--bottom-depth", "2m:40m:2m", "--power", "1kW")
    fig = _report_figure(run, tmp_path, monkeypatch, *many)
    lines = _page_text(fig).get_text().splitlines()
    start = lines.index(next(line for line in lines if line.startswith("Echo budget of")))
    assert "P = 1000 W" in lines[start]
    assert lines[start + 1].split()[:3] == ["range", "source", "level"]
    rows = [line.split() for line in lines[start + 2 : start + 22]]
    assert [float(r[0]) for r in rows] == pytest.approx([2.0 * i for i in range(1, 21)])
    for r in rows:
        source, spreading, absorption, loss, received = (float(v) for v in r[2::2])
        # Reference: the sonar equation's two-way spherical spreading 20 log10(2R / 1 m)
        # and EL = SL - TL - BL (Urick, Principles of Underwater Sound; from memory).
        assert spreading == pytest.approx(20 * math.log10(2 * float(r[0])), abs=0.05)
        assert received == pytest.approx(source - spreading - absorption - loss, abs=0.2)
    assert lines[start + 22].startswith("  source level: ")  # each formula once


def test_report_refuses_results_longer_than_a_page(run, tmp_path):
    setup = tmp_path / "long.toml"
    many = ("--length", "40mm", "--width", "20mm", *LAKE[2:-4], "--bottom-depth", "2m:60m:2m")
    assert run("beam", *many, "--power", "1kW", "--far-field-only", "--save", str(setup)).code == 0
    out = tmp_path / "long.png"
    r = run("report", str(setup), "--output", str(out))
    assert r.code == 2 and r.stdout == ""
    (line,) = r.stderr.strip().splitlines()
    assert "leave no room on one page" in line and "give fewer depths or bottom depths" in line
    assert not out.exists()
