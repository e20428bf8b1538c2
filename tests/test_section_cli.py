"""``beamspread section`` and ``index-step``: what they state, their CSV, grazing beams, and
straight beams on the section (contact, water path, focus, a rectangle's plane)."""

from __future__ import annotations

import csv
import io
import math

import pytest
import scipy.optimize
import scipy.special

# ISO 22232-2:2020 reference steel 5920 / 3255 m/s; acrylic wedges 2730 m/s (common practice).
STEEL = ("--material", "reference-steel")
CL, CS, ACRYLIC = 5920.0, 3255.0, 2730.0
PROBE = ("--diameter", "10mm", "--frequency", "4MHz")
PLATE = ("--thickness", "20mm")


def _wedge(angle: float, path: str = "10mm") -> tuple[str, ...]:
    return ("--wedge", "acrylic", "--refracted", f"{angle:g}", "--wedge-path", path)


def _warnings(stderr: str) -> list[str]:
    return [line for line in stderr.splitlines() if line.startswith("beamspread: warning:")]


@pytest.mark.parametrize(
    ("extra", "edges", "mode"),
    [
        ((), "field", "pulse-echo"),
        (("--far-field-only",), "far-field", "pulse-echo"),
        (("--far-field-only", "--one-way"), "far-field", "one-way"),
    ],
)
def test_section_states_what_it_computed(run, extra, edges, mode):
    args = ("section", *PROBE, *STEEL, *_wedge(60), *PLATE, "--depth", "10mm", *extra)
    data = run(*args, "--json").json()
    assert data["probe"] == {"shape": "disc", "diameter_m": 0.010, "frequency_hz": 4e6}
    assert data["medium"]["name"] == "reference-steel" and data["medium"]["wave"] == "shear"
    assert data["medium"]["speed_m_s"] == CS and data["medium"]["longitudinal_m_s"] == CL
    assert data["convention"]["mode"] == mode and data["convention"]["edges"] == edges
    assert data["convention"]["levels_db"] == [-6.0, -20.0]
    assert data["wedge"] == {"name": "acrylic-pmma", "speed_m_s": ACRYLIC, "path_m": 0.010}
    # the virtual element's set-back: the wedge path's equivalent (common practice)
    assert data["virtual_element_offset_m"] == pytest.approx(0.010 * ACRYLIC / CS)
    if edges == "field":
        assert data["field"]["mode"] == mode and data["field"]["bandwidth"] == 0.5
        assert "across the beam" in data["convention"]["level_reference"]
    else:
        assert data["field"] is None
        assert "on-axis" in data["convention"]["level_reference"]
    text = run(*args).stdout
    assert "disc element, diameter 10.00 mm, 4 MHz" in text
    assert "Medium: reference-steel: shear wave, 3255.0 m/s" in text
    assert "Setup: wedge acrylic-pmma (2730.0 m/s), wedge path 10.00 mm" in text
    assert mode in text
    assert ("computed field" if edges == "field" else "far-field cone") in text


def test_section_csv_is_one_row_per_leg_and_level_in_si(run):
    args = ("section", *PROBE, *STEEL, *_wedge(60), *PLATE, "--depth", "10mm")
    data = run(*args, "--far-field-only", "--json").json()
    r = run(*args, "--far-field-only", "--format", "csv")
    assert r.code == 0
    rows = list(csv.DictReader(io.StringIO(r.stdout)))
    assert len(rows) == 4 == len(data["footprints"])
    for row, ref in zip(rows, data["footprints"], strict=True):
        assert row["mode"] == "pulse-echo" and row["method"] == "far-field"
        assert int(row["leg"]) == ref["leg"] and float(row["level_db"]) == ref["level_db"]
        assert float(row["depth_m"]) == 0.010
        for key in ("sound_path_m", "surface_distance_m", "near_m", "far_m", "footprint_m"):
            assert float(row[key]) == ref[key]
        # geometry: the axis to the flaw depth on each leg (unfolded through the back wall)
        unfolded = 0.010 if ref["leg"] == 1 else 0.030
        assert float(row["sound_path_m"]) == pytest.approx(unfolded / math.cos(math.radians(60)))
        assert float(row["footprint_m"]) == pytest.approx(
            float(row["far_m"]) - float(row["near_m"])
        )


def test_section_without_a_depth_says_what_it_did(run):
    args = ("section", *PROBE, *STEEL, *_wedge(60), *PLATE, "--far-field-only")
    r = run(*args)
    assert r.code == 0
    assert "No flaw depth (--depth), so no footprint" in r.stdout
    # the plate's geometry: half skip t tan(beta), full skip 2 t tan(beta) (geometry)
    assert f"{0.020 * math.tan(math.radians(60)) * 1e3:.2f} mm" in r.stdout
    data = run(*args, "--json").json()
    assert data["footprints"] == [] and data["flaw_depth_m"] is None
    assert data["skip_m"] == pytest.approx(2 * 0.020 * math.tan(math.radians(60)))
    assert any("no --depth" in w for w in data["warnings"])
    csv_out = run(*args, "--format", "csv")
    assert csv_out.code == 0 and len(csv_out.stdout.strip().splitlines()) == 1  # the header


def test_section_refuses_two_wedges(run):
    r = run("section", *PROBE, *STEEL, *_wedge(60), "--wedge-speed", "2700", *PLATE)
    assert r.code == 2
    lines = r.stderr.strip().splitlines()
    assert len(lines) == 1 and "not both" in lines[0]


def _pulse_echo_half_angle(level_db: float, diameter: float, wavelength: float) -> float:
    # A disc's far-field pattern 2 J1(x)/x (Kinsler & Frey), squared for pulse-echo, solved
    # with scipy; x = pi D sin(theta) / lambda.
    x = scipy.optimize.brentq(
        lambda u: (2 * scipy.special.j1(u) / u) ** 2 - 10 ** (-level_db / 20), 1e-6, 3.8
    )
    return math.asin(x * wavelength / (math.pi * diameter))


def test_grazing_beam_warns_of_the_second_critical_angle_and_missing_footprints(run):
    # At 80 deg shear in steel from acrylic, Snell's law puts the incident angle 1.3 deg
    # short of the second critical angle asin(c_wedge / c_S); the real element's -6 dB
    # pulse-echo half-angle in the wedge (scipy, above) is wider than that.
    args = ("beam", *PROBE, *STEEL, *_wedge(80), *PLATE, "--depth", "10mm", "--far-field-only")
    r = run(*args, "--json")
    data = r.json()
    alpha = math.asin(ACRYLIC * math.sin(math.radians(80)) / CS)
    second = math.asin(ACRYLIC / CS)
    theta_wedge = _pulse_echo_half_angle(6.0, 0.010, ACRYLIC / 4e6)
    assert alpha + theta_wedge > second
    straddle = [w for w in data["warnings"] if "second critical angle" in w]
    assert len(straddle) == 1 and "-6 dB" in straddle[0]
    assert f"± {math.degrees(theta_wedge):.2f} deg" in straddle[0]
    # geometry: the -20 dB edge ahead of the axis leaves at beta + theta >= 90 deg
    theta20 = data["planes"][0]["half_angle_deg"]["-20"]
    assert 80 + theta20 >= 90
    for spot in data["planes"][0]["spots"]:
        if spot["level_db"] == -20:
            assert spot["footprint_m"] is None
        else:
            assert spot["footprint_m"] > 0
    edge = [w for w in data["warnings"] if "far-field -20 dB edge" in w]
    assert len(edge) == 1 and "never comes down" in edge[0]
    # one line each, on stderr as in JSON
    table = run(*args)
    lines = _warnings(table.stderr)
    assert any("second critical angle" in line for line in lines)
    assert any("far-field -20 dB edge" in line for line in lines)
    assert len(table.stderr.strip().splitlines()) == len(lines)
    # the section shows the row, with none, rather than dropping it
    section = run("section", *args[1:], "--json").json()
    rows = {(f["leg"], f["level_db"]): f for f in section["footprints"]}
    assert rows[(1, -20.0)]["footprint_m"] is None and rows[(1, -20.0)]["far_m"] is None
    assert rows[(1, -20.0)]["near_m"] is not None
    assert any("far-field -20 dB edge" in w for w in section["warnings"])
    text = run("section", *args[1:]).stdout
    (row,) = [line for line in text.splitlines() if line.strip().startswith("1     -20 dB")]
    assert row.split()[-1] == "none"


def test_no_critical_angle_warning_well_inside_the_window(run):
    # 45 deg shear: the incident angle (Snell) and the -20 dB spread stay short of 57 deg.
    data = run("beam", *PROBE, *STEEL, *_wedge(45), "--far-field-only", "--json").json()
    alpha = math.asin(ACRYLIC * math.sin(math.radians(45)) / CS)
    assert alpha + _pulse_echo_half_angle(20.0, 0.010, ACRYLIC / 4e6) < math.asin(ACRYLIC / CS)
    assert not any("critical angle" in w for w in data["warnings"])


def test_wedge_simple_near_field_is_the_disc_of_the_virtual_element_area(run):
    # Common practice: N = D² cos(beta) / (4 lambda cos(alpha)) - L c_wedge / c_part, the
    # near field of a disc with the virtual ellipse's area (D x D cos(beta)/cos(alpha)).
    data = run("beam", *PROBE, *STEEL, *_wedge(70), "--far-field-only", "--json").json()
    alpha = math.radians(data["refraction"]["incident_deg"])
    lam = CS / 4e6
    expected = 0.010**2 * math.cos(math.radians(70)) / (4 * lam * math.cos(alpha))
    expected -= 0.010 * ACRYLIC / CS
    assert data["near_field_simple_m"] == pytest.approx(expected, rel=1e-12)
    assert "a disc of the virtual ellipse's area" in data["near_field_simple_method"]
    # a wedge path longer than that near field leaves none (not a negative length)
    long = run("beam", *PROBE, *STEEL, *_wedge(70, "40mm"), "--far-field-only", "--json").json()
    assert long["near_field_simple_m"] is None


def test_wedge_simple_near_field_of_a_rectangle(run):
    # Common practice: L²/4λ with L the longer side of the virtual rectangle (the length
    # projected by cos(beta)/cos(alpha), or the width), less the wedge path's equivalent.
    args = ("--length", "12mm", "--width", "8mm", "--frequency", "4MHz", *STEEL)
    data = run("beam", *args, *_wedge(45, "5mm"), "--far-field-only", "--json").json()
    alpha = math.radians(data["refraction"]["incident_deg"])
    side = max(0.012 * math.cos(math.radians(45)) / math.cos(alpha), 0.008)
    expected = side**2 / (4 * CS / 4e6) - 0.005 * ACRYLIC / CS
    assert data["near_field_simple_m"] == pytest.approx(expected, rel=1e-12)
    assert "longer side" in data["near_field_simple_method"]


def test_scan_plan_csv_is_one_row_per_depth_with_the_step(run):
    args = (
        "index-step",
        *PROBE,
        "--material",
        "water",
        "--from",
        "20mm",
        "--to",
        "120mm",
        "--overlap",
        "25%",
        "--count",
        "5",
        "--method",
        "far-field",
    )
    data = run(*args, "--json").json()
    r = run(*args, "--format", "csv")
    assert r.code == 0
    rows = list(csv.DictReader(io.StringIO(r.stdout)))
    assert [float(row["depth_m"]) for row in rows] == data["depths_m"]
    assert [float(row["width_m"]) for row in rows] == data["widths_m"]
    (governing,) = [row for row in rows if row["governing"] == "true"]
    assert float(governing["depth_m"]) == data["governing_depth_m"]
    for row in rows:
        assert float(row["index_step_m"]) == data["index_step_m"]
        assert row["mode"] == "pulse-echo" and row["method"] == "far-field"
        assert float(row["level_db"]) == -6.0 and float(row["overlap"]) == 0.25
    # common practice: the step is the narrowest width times (1 - overlap)
    assert float(governing["index_step_m"]) == pytest.approx(
        min(float(row["width_m"]) for row in rows) * 0.75
    )


def test_grazing_beam_computed_edge_that_never_comes_down(run):
    # At 80 deg the computed -20 dB edge ahead of the axis climbs: far out, the width grows
    # faster than 2 cot(beta), so the edge's depth s cos b - (w/2) sin b falls with the sound
    # path (geometry; widths from the field engine at two far paths).
    from beamspread.field import beam_widths
    from beamspread.probes import Ellipse

    data = run("beam", *PROBE, *STEEL, *_wedge(80), *PLATE, "--depth", "10mm", "--json").json()
    beta = math.radians(80)
    aperture = data["effective_aperture_m"]
    offset = 0.010 * ACRYLIC / CS
    far = [
        beam_widths(
            Ellipse(aperture, 0.010, 4e6), CS, s + offset, [20.0], plane="length", bandwidth=0.5
        )[0]
        for s in (0.5, 1.0)
    ]
    growth = (far[1].width - far[0].width) / 0.5
    assert math.cos(beta) - 0.5 * growth * math.sin(beta) < 0
    computed = [s for s in data["planes"][0]["spots"] if s["method"] == "field"]
    assert all(s["footprint_m"] is None for s in computed if s["level_db"] == -20)
    assert all(s["footprint_m"] > 0 for s in computed if s["level_db"] == -6)
    (line,) = [w for w in data["warnings"] if "computed -20 dB edge" in w]
    assert "on leg 1" in line and "on leg 2" in line


# --- Straight beams on the section: contact, water path, focus, a rectangle's plane --------


def _drawn(monkeypatch, run, *args):
    """The section's JSON and the SectionGeometry it draws (the picture is not written)."""
    from beamspread.render import plots

    seen = {}
    monkeypatch.setattr(plots, "plot_section", lambda g, path, **kw: seen.update(g=g, **kw))
    data = run("section", *args, "--plot", "unused.png", "--json").json()
    return data, seen["g"], seen["caption"]


def _rows(data) -> dict[tuple[int, float], dict]:
    return {(f["leg"], f["level_db"]): f for f in data["footprints"]}


def test_contact_disc_far_field_edges_are_the_bessel_cone(run, monkeypatch):
    # A 10 mm 4 MHz disc in steel: N = D^2/4lambda = 16.9 mm, so 80 mm and the mirror leg's
    # 2t - d = 120 mm lie in the far field. The drawn edges lie z tan(theta) either side of
    # the axis, theta from the disc's pulse-echo pattern (2 J1(x)/x)^2 solved with scipy;
    # common practice: sin(theta_-6) = 0.514 lambda / D for a disc, pulse-echo.
    from beamspread.render import plots

    t, d = 0.100, 0.080
    args = (*PROBE, *STEEL, "--thickness", "100mm", "--depth", "80mm", "--far-field-only")
    data, geometry, caption = _drawn(monkeypatch, run, *args)
    assert data["coupling"] == "contact" and data["wedge"] is None
    assert data["refracted_deg"] == 0.0 and data["edges"] == "far-field"
    lam = CL / 4e6
    theta6 = _pulse_echo_half_angle(6.0, 0.010, lam)
    assert math.sin(theta6) == pytest.approx(0.514 * lam / 0.010, rel=2e-3)
    rows = _rows(data)
    drawn = {(f.leg, f.level_db): f for f in plots.section_footprints(geometry)}
    assert geometry.refracted == 0.0 and geometry.mirror
    for level in (6.0, 20.0):
        theta = _pulse_echo_half_angle(level, 0.010, lam)
        # leg 1 at the depth d; leg 2 back up after the back wall, at the sound path 2t - d
        for leg, path in ((1, d), (2, 2 * t - d)):
            row = rows[(leg, -level)]
            assert row["sound_path_m"] == pytest.approx(path, rel=1e-12)
            assert row["far_m"] == pytest.approx(path * math.tan(theta), rel=1e-9)
            assert row["near_m"] == pytest.approx(-path * math.tan(theta), rel=1e-9)
            edge = drawn[(leg, level)]
            assert edge.far == pytest.approx(path * math.tan(theta), rel=1e-9)
            assert edge.near == pytest.approx(-path * math.tan(theta), rel=1e-9)
    assert "the length plane" not in caption  # a disc has one plane: none is named


def _field_widths(beam: dict) -> dict:
    """(depth, level) -> the computed width in ``beam --json``'s first plane."""
    return {
        (s["depth_m"], s["level_db"]): s["width_m"]
        for s in beam["planes"][0]["spots"]
        if s["method"] == "field"
    }


def test_mirror_leg_is_the_width_at_the_unfolded_sound_path(run, monkeypatch):
    # The computed field: the back wall mirrors the beam, so at depth d on the way back up
    # the width is the beam's width at the sound path 2t - d (geometry), here read from
    # `beam --depth` at that path; leg 1 is `beam`'s own width at d.
    from beamspread.render import plots

    args = (*PROBE, *STEEL, "--bandwidth", "0.5")
    data, geometry, _ = _drawn(monkeypatch, run, *args, "--thickness", "25mm", "--depth", "15mm")
    beam = run("beam", *args, "--depth", "15mm", "--depth", "35mm", "--json").json()
    widths = _field_widths(beam)
    rows = _rows(data)
    assert data["edges"] == "field" and len(rows) == 4
    for level in (-6.0, -20.0):
        assert rows[(1, level)]["footprint_m"] == widths[(0.015, level)]
        assert rows[(2, level)]["sound_path_m"] == pytest.approx(2 * 0.025 - 0.015, rel=1e-12)
        assert rows[(2, level)]["footprint_m"] == pytest.approx(widths[(0.035, level)], rel=1e-12)
    # the drawn edges are sampled at both paths: the picture's footprints are the table's
    for f in plots.section_footprints(geometry):
        assert f.width == pytest.approx(rows[(f.leg, -f.level_db)]["footprint_m"], rel=1e-9)
    # and leg 2 is drawn unfolded, in the plate's mirror image below the back wall
    edge = geometry.edges[0]
    assert max(edge.sound_path) >= 2 * 0.025 and geometry.drawn_depth == 2 * 0.025


def test_immersion_widths_in_the_part_are_the_beam_commands(run, monkeypatch):
    # Behind a 30 mm water path the section's widths in the part are `beam`'s computed widths
    # at those depths (leg 2 at 2t - d); the water path is noted, not drawn.
    from beamspread.render import plots

    probe = ("--diameter", "12.7mm", "--frequency", "5MHz", *STEEL, "--water-path", "30mm")
    data, geometry, caption = _drawn(
        monkeypatch, run, *probe, "--thickness", "25mm", "--depth", "15mm"
    )
    beam = run("beam", *probe, "--depth", "15mm", "--depth", "35mm", "--json").json()
    widths = _field_widths(beam)
    rows = _rows(data)
    for level in (-6.0, -20.0):
        assert rows[(1, level)]["footprint_m"] == widths[(0.015, level)]
        assert rows[(2, level)]["footprint_m"] == pytest.approx(widths[(0.035, level)], rel=1e-12)
    assert data["coupling"] == "immersion" and data["couplant"]["path_m"] == 0.030
    assert data["couplant"]["speed_m_s"] == beam["couplant"]["speed_m_s"]
    assert data["transmission_coefficient"] == beam["transmission_coefficient"]
    assert geometry.water_path == 0.030 and "water path 30 mm" in caption
    for f in plots.section_footprints(geometry):
        assert f.width == pytest.approx(rows[(f.leg, -f.level_db)]["footprint_m"], rel=1e-9)
    text = run("section", *probe, "--thickness", "25mm", "--depth", "15mm").stdout
    assert "Straight beam on the section" in text and "water path 30.00 mm" in text


def test_immersion_far_field_cone_refracts_at_the_surface(run):
    # The far-field edge leaves the element at the half-angle in water and refracts at the
    # surface (Snell's law): width 2 (WP tan(theta_w) + z tan(theta_p)), sin(theta_p) =
    # sin(theta_w) c_p / c_w, theta_w from scipy's Bessel J1 (pulse-echo, 2 J1(x)/x squared).
    probe = ("--diameter", "12.7mm", "--frequency", "5MHz", *STEEL, "--water-path", "30mm")
    args = (*probe, "--thickness", "25mm", "--depth", "15mm", "--far-field-only")
    data = run("section", *args, "--json").json()
    c_w = data["couplant"]["speed_m_s"]
    rows = _rows(data)
    for level in (6.0, 20.0):
        theta_w = _pulse_echo_half_angle(level, 0.0127, c_w / 5e6)
        theta_p = math.asin(math.sin(theta_w) * CL / c_w)
        for leg, z in ((1, 0.015), (2, 0.035)):
            want = 2 * (0.030 * math.tan(theta_w) + z * math.tan(theta_p))
            assert rows[(leg, -level)]["footprint_m"] == pytest.approx(want, rel=1e-9)


def test_focus_in_contact_and_behind_water_are_drawn_from_the_computed_field(run, monkeypatch):
    # A focused probe's section: leg 1 is `beam`'s computed width of the focused element.
    for coupling in (("--focus", "60mm"), ("--water-path", "50mm", "--focus", "75mm")):
        probe = ("--diameter", "12.7mm", "--frequency", "5MHz", *STEEL, *coupling)
        data, geometry, _ = _drawn(
            monkeypatch, run, *probe, "--thickness", "40mm", "--depth", "20mm"
        )
        beam = run("beam", *probe, "--depth", "20mm", "--json").json()
        widths = {s["level_db"]: s["width_m"] for s in beam["planes"][0]["spots"]}
        rows = _rows(data)
        assert data["focus"] == beam["focus"]
        for level in (-6.0, -20.0):
            assert rows[(1, level)]["footprint_m"] == widths[level]
        assert {e.level_db for e in geometry.edges} == {6.0, 20.0}


def test_rectangle_plane_is_chosen_and_stated(run, monkeypatch):
    # A 20 x 10 mm rectangle: the length plane by default, the width plane with --plane;
    # each the beam command's width in that plane, the plane named in caption and text.
    probe = ("--length", "20mm", "--width", "10mm", "--frequency", "5MHz", *STEEL)
    where = ("--thickness", "30mm", "--depth", "20mm", "--far-field-only")
    beam = run("beam", *probe, "--depth", "20mm", "--far-field-only", "--json").json()
    for plane in ("length", "width"):
        chosen = () if plane == "length" else ("--plane", "width")
        data, geometry, caption = _drawn(monkeypatch, run, *probe, *where, *chosen)
        (spots,) = [p["spots"] for p in beam["planes"] if p["name"] == plane]
        widths = {s["level_db"]: s["width_m"] for s in spots}
        assert data["plane"] == plane and geometry.plane == plane
        assert f"the {plane} plane drawn" in caption
        for level in (-6.0, -20.0):
            assert _rows(data)[(1, level)]["footprint_m"] == widths[level]
        text = run("section", *probe, *where, *chosen).stdout
        assert f"drawn in the {plane} plane" in text


@pytest.mark.parametrize(
    ("args", "words"),
    [
        ((*PROBE, *STEEL, *PLATE, "--plane", "width"), "a disc has one"),
        (
            ("--length", "20mm", "--width", "22mm", "--frequency", "4MHz", *STEEL, *_wedge(45)),
            "--plane width cannot be drawn",
        ),
        ((*PROBE, *STEEL, *PLATE, "--focus", "60mm", "--far-field-only"), "no far-field edges"),
        ((*PROBE, *STEEL, *PLATE, "--depth", "30mm"), "lies below the part"),
        ((*PROBE, *STEEL), "needs the part --thickness"),
    ],
    ids=["disc-plane", "wedge-width-plane", "focus-far-field", "below-the-part", "no-plate"],
)
def test_section_refusals_are_one_line(run, args, words):
    extra = ("--plane", "width", *PLATE) if "22mm" in args else ()
    r = run("section", *args, *extra)
    assert r.code == 2
    lines = r.stderr.strip().splitlines()
    assert len(lines) == 1 and words in lines[0] and r.stdout == ""


def test_straight_section_pictures_are_drawn(run, tmp_path):
    for name, coupling in (("contact", ()), ("immersion", ("--water-path", "30mm"))):
        out = tmp_path / f"{name}.png"
        r = run("section", *PROBE, *STEEL, *PLATE, *coupling, "--depth", "12mm", "--plot", out)
        assert r.code == 0, r.stderr
        assert out.stat().st_size > 10_000


def test_a_straight_section_setup_is_read_by_beam_which_draws_the_same_section(
    run, tmp_path, monkeypatch
):
    # A straight setup with a plate, saved by section: beam reads it (the thickness no longer
    # needs a wedge) and its --plot draws the section section draws (the same geometry).
    from beamspread.render import plots

    saved = tmp_path / "plate.toml"
    args = (*PROBE, *STEEL, *PLATE, "--depth", "12mm", "--far-field-only")
    assert run("section", *args, "--save", str(saved)).code == 0
    _, geometry, _ = _drawn(monkeypatch, run, "--setup", str(saved))
    seen = {}
    monkeypatch.setattr(plots, "plot_section", lambda g, path, **kw: seen.update(g=g))
    r = run("beam", "--setup", str(saved), "--plot", str(tmp_path / "b.png"))
    assert r.code == 0, r.stderr
    assert seen["g"] == geometry and geometry.flaw_depth == 0.012


def test_edges_module_reads_a_computed_result_without_running_it_again():
    # beamspread.edges on a wedge result: the far-field widths at sound paths s are the cone
    # 2 (s + offset) tan(theta) from the virtual element (common practice), offset the wedge
    # path's equivalent L c_wedge / c_part; a focus has no far-field width; an unknown plane
    # is named. Results stay plain data: SetupResult has no edges method and no cache.
    import beamspread as bs
    from beamspread.edges import far_field_widths, plane_of
    from beamspread.errors import InputError

    wedge = bs.WedgeCoupling(material="acrylic", refracted=math.radians(60), path=0.010)
    technique = bs.Technique(bs.Disc(0.010, 4e6), bs.PartMedium("reference-steel"), wedge)
    result = bs.compute(technique)
    offset = 0.010 * ACRYLIC / CS
    paths = [0.01, 0.05]
    widths = far_field_widths(result, paths)
    # the virtual ellipse's aperture in the incidence plane, D cos(beta) / cos(alpha) (common
    # practice), alpha by Snell's law; its pattern there is a disc's of that aperture (scipy)
    beta = math.radians(60)
    alpha = math.asin(ACRYLIC * math.sin(beta) / CS)
    aperture = 0.010 * math.cos(beta) / math.cos(alpha)
    for level in (6.0, 20.0):
        theta = _pulse_echo_half_angle(level, aperture, CS / 4e6)
        for s, w in zip(paths, widths[level], strict=True):
            assert w == pytest.approx(2 * (s + offset) * math.tan(theta), rel=1e-9)
    assert not hasattr(result.setup, "edges") and not hasattr(result.setup, "_widths")
    with pytest.raises(InputError, match="not one of this beam's"):
        plane_of(result, "sideways")
    focused = bs.Technique(bs.Disc(0.010, 4e6, focus=0.05), bs.PartMedium(speed=1480.0))
    with pytest.raises(InputError, match="no far-field width"):
        far_field_widths(bs.compute(focused), paths)


def test_report_of_a_straight_plate_setup_draws_its_section(run, tmp_path, monkeypatch):
    # The report page draws the section a setup with a plate records, straight as angled:
    # the same geometry as the section command's.
    from beamspread.render import plots

    saved = tmp_path / "plate.toml"
    args = (*PROBE, *STEEL, *PLATE, "--depth", "12mm", "--far-field-only")
    assert run("section", *args, "--save", str(saved)).code == 0
    _, geometry, _ = _drawn(monkeypatch, run, "--setup", str(saved), "--bandwidth", "0.5")
    drawn, real = [], plots.draw_section

    def spy(ax, g, **kw):
        drawn.append(g)
        return real(ax, g, **kw)

    monkeypatch.setattr(plots, "draw_section", spy)
    r = run("report", str(saved), "--output", str(tmp_path / "r.png"))
    assert r.code == 0, r.stderr
    (page,) = drawn
    assert page.mirror and page.flaw_depth == 0.012 and page.thickness == 0.020
    assert page.edges == geometry.edges
