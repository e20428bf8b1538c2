"""The computed field on the command line: beam's field widths, axis, across and map."""

from __future__ import annotations

import csv
import io
import json
import math

import numpy as np
import pytest

from beamspread.pattern import half_angle

DISC = ("--diameter", "10mm", "--frequency", "5MHz", "--speed", "5920m/s")
RECT = ("--length", "20mm", "--width", "10mm", "--frequency", "5MHz", "--speed", "5920")
LAM = 5920.0 / 5e6


def kinsler_frey(z, diameter=0.010, lam=LAM):
    """Kinsler & Frey: on-axis |p|/(rho c U0) of a baffled disc."""
    a = diameter / 2
    return 2 * np.abs(np.sin(math.pi / lam * (np.sqrt(z * z + a * a) - z)))


def test_beam_reports_field_widths_beside_far_field(run):
    data = run("beam", *DISC, "--depth", "250mm", "--json").json()
    spots = data["planes"][0]["spots"]
    field = [s for s in spots if s["method"] == "field"]
    far = [s for s in spots if s["method"] == "far-field"]
    assert len(field) == len(far) == 2
    assert {"depth_m", "level_db", "width_m", "method"} <= set(field[0])
    assert "far_field_valid" not in field[0]
    assert data["field"]["bandwidth"] == 0.5 and data["field"]["mode"] == "pulse-echo"
    # Far away (12 N) the computed -6 dB width approaches the far-field one of the exact
    # pattern (Krautkramer's 0.51 lambda/D); the field width runs a little wider at finite
    # range, within 3 %.
    ff = 2 * 0.25 * math.tan(float(half_angle(6, 0.010, LAM)))
    assert field[0]["width_m"] == pytest.approx(ff, rel=0.03)


def test_far_field_only_and_continuous_wave(run):
    data = run("beam", *DISC, "--depth", "50mm", "--far-field-only", "--json").json()
    assert data["field"] is None
    assert {s["method"] for s in data["planes"][0]["spots"]} == {"far-field"}
    cw = run("beam", *DISC, "--depth", "50mm", "--bandwidth", "0", "--json").json()
    assert cw["field"]["spectrum"] == "continuous wave"
    # CW on-axis maximum: the last maximum (D^2 - lambda^2)/(4 lambda) (Kinsler & Frey).
    assert cw["field"]["axial_maximum_m"] == pytest.approx((0.01**2 - LAM**2) / (4 * LAM), rel=1e-6)


def test_axis_continuous_wave_matches_kinsler_frey(run):
    data = run("axis", *DISC, "--bandwidth", "0", "--one-way", "--points", "300", "--json").json()
    z = np.array(data["profile"]["depth_m"])
    amp = np.array(data["profile"]["amplitude"])
    assert len(z) == 300
    assert np.allclose(amp, kinsler_frey(z), rtol=0, atol=1e-9)
    assert data["axial_maximum_m"] == pytest.approx(data["near_field_m"], rel=1e-6)
    assert max(v for v in data["profile"]["level_db"] if v is not None) == pytest.approx(0.0)
    assert data["amplitude_unit"] == "rho c U0"


def test_axis_broadband_maximum_moves_toward_the_element(run):
    # Common practice: the on-axis pulse-echo maximum of a broadband pulse moves toward the
    # element as the bandwidth grows.
    narrow = run("axis", *DISC, "--bandwidth", "0.2", "--json").json()["axial_maximum_m"]
    wide = run("axis", *DISC, "--bandwidth", "0.6", "--json").json()["axial_maximum_m"]
    assert wide < narrow < (0.01**2 - LAM**2) / (4 * LAM)


def test_axis_csv_and_table(run):
    r = run("axis", *DISC, "--points", "50", "--format", "csv")
    rows = list(csv.DictReader(io.StringIO(r.stdout)))
    assert len(rows) == 50 and set(rows[0]) == {"depth_m", "amplitude", "level_db"}
    t = run("axis", *DISC)
    assert "On-axis amplitude" in t.stdout and "last on-axis maximum" in t.stdout


def test_across_rectangle_has_both_planes_and_is_symmetric(run):
    data = run("across", *RECT, "--depth", "60mm", "--points", "101", "--json").json()
    assert [p["name"] for p in data["planes"]] == ["length", "width"]
    for plane in data["planes"]:
        amp = np.array(plane["amplitude"])
        # A uniform piston's field is symmetric about the axis in each plane (Rayleigh
        # integral symmetry).
        assert np.allclose(amp, amp[::-1], rtol=1e-9)
        assert [w["level_db"] for w in plane["widths"]] == [-6.0, -20.0]
        assert all(w["width_m"] > 0 for w in plane["widths"])


def test_across_plane_choice_and_bad_plane(run):
    data = run("across", *DISC, "--depth", "30mm", "--plane", "diameter", "--json").json()
    assert len(data["planes"]) == 1
    r = run("across", *DISC, "--depth", "30mm", "--plane", "width")
    assert r.code == 2 and "diameter" in r.stderr


def test_map_npz_csv_and_json(run, tmp_path):
    out = tmp_path / "beam.npz"
    r = run(
        "map",
        *DISC,
        "--bandwidth",
        "0",
        "--depth-points",
        "20",
        "--lateral-points",
        "9",
        "-o",
        str(out),
    )
    assert r.code == 0, r.stderr
    with np.load(out) as data:
        assert data["amplitude"].shape == (20, 9)
        meta = json.loads(str(data["metadata"]))
        centre = data["amplitude"][:, 4].astype(float)
        # pulse-echo CW on the axis: |p|^2 from Kinsler & Frey; float32 map, 1e-5 relative.
        assert np.allclose(centre, kinsler_frey(data["depth_m"]) ** 2, rtol=1e-5, atol=1e-6)
    assert meta["plane"] == "diameter" and meta["field"]["mode"] == "pulse-echo"
    rows = run("map", *DISC, "--depth-points", "5", "--lateral-points", "4").stdout
    assert len(rows.strip().splitlines()) == 5 * 4 + 1
    data = run("map", *DISC, "--depth-points", "5", "--lateral-points", "4", "--json").json()
    assert np.array(data["amplitude"]).shape == (5, 4)


def test_map_never_overwrites_without_force(run, tmp_path):
    out = tmp_path / "keep.csv"
    out.write_text("precious\n")
    r = run("map", *DISC, "--depth-points", "4", "--lateral-points", "4", "-o", str(out))
    assert r.code == 2 and "--force" in r.stderr
    assert out.read_text() == "precious\n"
    r = run("map", *DISC, "--depth-points", "4", "--lateral-points", "4", "-o", str(out), "--force")
    assert r.code == 0 and out.read_text().startswith("depth_m,lateral_m")


@pytest.mark.parametrize(
    ("args", "needle"),
    [
        (("map", *DISC, "--from", "30mm", "--to", "20mm"), "--to"),
        (("map", *DISC, "--span", "0"), "--span"),
        (("map", *DISC, "--depth-points", "1"), "--depth-points"),
        (("map", *DISC, "--depth-points", "16384", "--lateral-points", "16384"), "exceed"),
        (("map", *DISC, "-o", "picture.png"), "suffix"),
        (("map", *DISC, "-o", "no/such/folder/m.csv"), "does not exist"),
        (("axis", *DISC, "--from", "-5mm"), "--from"),
        (("axis", *DISC, "--bandwidth", "-0.1"), "bandwidth"),
        (("axis", *DISC, "--bandwidth", "2"), "bandwidth"),
        (("axis", *DISC, "--bandwidth", "2.5"), "bandwidth"),
        (("across", *DISC, "--depth", "0"), "--depth"),
        (("across", *DISC), "--depth"),
        (("beam", *DISC, "--bandwidth", "3"), "bandwidth"),
        (("beam", *DISC, "--spectrum", "pink"), "--spectrum"),
    ],
)
def test_field_bad_input_is_one_line_exit_2_and_leaves_nothing(
    run, tmp_path, monkeypatch, args, needle
):
    monkeypatch.chdir(tmp_path)
    r = run(*args)
    assert r.code == 2, (r.stdout, r.stderr)
    lines = r.stderr.strip().splitlines()
    assert len(lines) == 1 and needle in lines[0]
    assert list(tmp_path.iterdir()) == []  # nothing half-made left on disk
