"""``beamspread beam`` and the command line's contracts, through click's CliRunner."""

from __future__ import annotations

import csv
import io
import math
import subprocess
import sys

import pytest
import scipy.special

BASE = ("beam", "--diameter", "10mm", "--frequency", "5MHz", "--speed", "5920m/s")


def test_acceptance_command_json(run):
    r = run(*BASE, "--depth", "100mm", "--json")
    assert r.code == 0, r.stderr
    data = r.json()
    # wavelength c/f; near field (D^2 - lambda^2)/(4 lambda), simple D^2/(4 lambda)
    # (Kinsler & Frey); the half-angles are checked against scipy in test_pattern.py.
    assert round(data["wavelength_m"] * 1e3, 3) == 1.184
    assert round(data["near_field_m"] * 1e3, 2) == 20.82
    assert round(data["near_field_simple_m"] * 1e3, 2) == 21.11
    plane = data["planes"][0]
    assert round(plane["half_angle_deg"]["-6"], 3) == 3.487
    # first null at sin(theta) = j(1,1)/pi lambda/D, j(1,1) from scipy.special.jn_zeros
    null = math.degrees(math.asin(scipy.special.jn_zeros(1, 1)[0] / math.pi * 0.1184))
    assert plane["half_angle_deg"]["null"] == pytest.approx(null, rel=1e-12)
    spot = plane["spots"][0]
    # far-field width 2 z tan(theta), by definition
    assert spot["width_m"] == pytest.approx(
        2 * 0.1 * math.tan(math.radians(plane["half_angle_deg"]["-6"]))
    )
    assert spot == {
        "depth_m": 0.1,
        "level_db": -6.0,
        "width_m": spot["width_m"],
        "far_field_valid": True,
        "method": "far-field",
        "leg": 1,
        "sound_path_m": 0.1,
        "surface_distance_m": 0.0,
        "footprint_m": spot["width_m"],
    }
    assert data["convention"]["mode"] == "pulse-echo" and data["convention"]["angle"] == "half"
    assert data["medium"]["speed_m_s"] == 5920.0 and data["medium"]["wave"] == "longitudinal"
    assert data["warnings"] == [] and r.stderr == ""


def test_json_contract_keys(run):
    data = run(*BASE, "--depth", "5mm", "--json").json()
    assert {
        "probe",
        "medium",
        "convention",
        "wavelength_m",
        "near_field_m",
        "near_field_simple_m",
        "planes",
        "warnings",
    } <= set(data)
    assert {"name", "wave", "speed_m_s", "source", "conditions"} <= set(data["medium"])
    assert set(data["planes"][0]) >= {"aperture_m", "half_angle_deg", "spots", "name"}


def test_warnings_go_to_stderr_and_json_never_to_stdout_text(run):
    r = run(*BASE, "--depth", "5mm", "--json")
    data = r.json()  # stdout parses: nothing else is on it
    assert data["planes"][0]["spots"][0]["far_field_valid"] is False
    assert any("inside the near field" in w for w in data["warnings"])
    assert "inside the near field" in r.stderr


def test_rectangle_has_two_planes_and_the_factor(run):
    data = run(
        "beam",
        "--length",
        "20",
        "--width",
        "10",
        "--frequency",
        "2.25",
        "--material",
        "reference-steel",
        "--json",
    ).json()
    assert [p["name"] for p in data["planes"]] == ["length", "width"]
    assert data["near_field_factor"] == pytest.approx(
        data["near_field_m"] / data["near_field_simple_m"]
    )
    # L^2/(4 lambda) with L the longer side and lambda = 5920 / 2.25e6 (ISO 22232-2 steel)
    assert data["near_field_simple_m"] == pytest.approx(0.02**2 / (4 * 5920 / 2.25e6))


@pytest.mark.parametrize("spelling", ["-6", "6", "6dB", "-6dB", "6 dB"])
def test_level_spellings_mean_six_db_down(run, spelling):
    data = run(*BASE, "--level", spelling, "--json").json()
    assert list(data["planes"][0]["half_angle_deg"]) == ["-6", "null"]


def test_one_way_and_material_with_shear(run):
    data = run(
        "beam",
        "--diameter",
        "0.5in",
        "--frequency",
        "2.25MHz",
        "--material",
        "reference-steel",
        "--wave",
        "shear",
        "--one-way",
        "--json",
    ).json()
    assert data["medium"]["speed_m_s"] == 3255.0  # ISO 22232-2 reference steel, shear
    assert data["convention"]["mode"] == "one-way"
    assert data["probe"]["diameter_m"] == pytest.approx(0.0127)  # 1 in = 25.4 mm exactly


def test_csv_rows(run):
    r = run(*BASE, "--depth", "50", "--depth", "100", "--format", "csv")
    rows = list(csv.DictReader(io.StringIO(r.stdout)))
    assert len(rows) == 2 * 2 * 2 + 1  # two levels at two depths by two methods, and the null
    assert {row["level"] for row in rows} == {"-6", "-20", "null"}
    assert {row["method"] for row in rows if row["depth_m"]} == {"far-field", "field"}
    assert float(rows[0]["wavelength_m"]) == pytest.approx(1.184e-3)
    assert float(rows[0]["full_angle_deg"]) == pytest.approx(2 * float(rows[0]["half_angle_deg"]))


def test_table_output_states_its_convention(run):
    r = run(*BASE, "--depth", "5mm", "--depth", "100mm", "--units", "in")
    assert r.code == 0
    assert "pulse-echo" in r.stdout and "Half-angles" in r.stdout
    assert "in" in r.stdout and "inside the near field" in r.stdout
    assert "not a measured beam profile" in r.stdout


@pytest.mark.parametrize(
    ("args", "needle"),
    [
        (("beam", "--diameter", "-10mm", "--frequency", "5MHz", "--speed", "5920"), "--diameter"),
        (("beam", "--diameter", "10furlong", "--frequency", "5MHz", "--speed", "5920"), "furlong"),
        (("beam", "--diameter", "10mm", "--frequency", "0", "--speed", "5920"), "--frequency"),
        (("beam", "--diameter", "10mm", "--frequency", "5MHz", "--speed", "nan"), "--speed"),
        (("beam", "--diameter", "10mm", "--frequency", "5MHz"), "--material"),
        (
            (
                "beam",
                "--diameter",
                "10mm",
                "--length",
                "5",
                "--width",
                "5",
                "--frequency",
                "5",
                "--speed",
                "5920",
            ),
            "not both",
        ),
        (("beam", "--length", "5", "--frequency", "5", "--speed", "5920"), "--width"),
        # unit slips: Hz typed bare (read as MHz), km/s typed bare (read as m/s), a kilometre disc
        (("beam", "--diameter", "10", "--frequency", "2250000", "--speed", "5920"), "2250000Hz"),
        (("beam", "--diameter", "10", "--frequency", "5", "--speed", "5.9"), "5.9km/s"),
        (("beam", "--diameter", "1e6mm", "--frequency", "5", "--speed", "5920"), "10 m"),
        ((*BASE, "--level", "0"), "level"),
        ((*BASE, "--level", "loud"), "loud"),
        ((*BASE, "--depth", "0"), "--depth"),
        ((*BASE, "--temperature", "20"), "--temperature"),
        (
            ("beam", "--diameter", "10", "--frequency", "5", "--material", "unobtainium"),
            "unobtainium",
        ),
        (
            (
                "beam",
                "--diameter",
                "10",
                "--frequency",
                "5",
                "--material",
                "water",
                "--wave",
                "shear",
            ),
            "shear",
        ),
        (
            (
                "beam",
                "--diameter",
                "10",
                "--frequency",
                "5",
                "--material",
                "water",
                "--temperature",
                "300K",
                "--condition",
                "depth=3",
            ),
            "depth",
        ),
        (
            (
                "beam",
                "--diameter",
                "10",
                "--frequency",
                "5",
                "--material",
                "water",
                "--temperature",
                "150",
            ),
            "150",
        ),
        (
            (
                "beam",
                "--diameter",
                "10",
                "--frequency",
                "5",
                "--material",
                "water",
                "--condition",
                "salinity",
            ),
            "NAME=VALUE",
        ),
        (("bem",), "beam"),
    ],
)
def test_bad_input_is_one_line_and_exit_2(run, args, needle):
    r = run(*args)
    assert r.code == 2, (r.stdout, r.stderr)
    lines = r.stderr.strip().splitlines()
    assert len(lines) == 1, r.stderr
    assert needle in lines[0]
    assert "Traceback" not in r.stderr and r.stdout == ""


def test_unknown_material_suggests_close_names(run):
    r = run("beam", "--diameter", "10", "--frequency", "5", "--material", "titanium-6al4v")
    assert r.code == 2 and "titanium-6al-4v" in r.stderr


def test_internal_error_is_one_line_unless_debug(run, monkeypatch):
    import beamspread.pipeline

    def broken(*args, **kwargs):
        raise ZeroDivisionError("synthetic failure")

    monkeypatch.setattr(beamspread.pipeline, "analyse", broken)
    r = run(*BASE)
    assert r.code == 1
    assert r.stderr.strip().splitlines() == [
        "beamspread: error: internal error: ZeroDivisionError: synthetic failure "
        "(set BEAMSPREAD_DEBUG=1 to see the traceback)"
    ]
    with pytest.raises(ZeroDivisionError):
        run(*BASE, env={"BEAMSPREAD_DEBUG": "1"})


def test_help_and_version(run):
    assert run("--help").code == 0
    r = run("materials", "--help")
    assert r.code == 0 and "[[material]]" in r.stdout and "source" in r.stdout
    assert run("--version").code == 0


def test_demo_runs(run):
    r = run("demo")
    assert r.code == 0, r.stderr
    assert r.stdout.count("Beam of a") == 3 and "Cautions" in r.stdout
    assert "aquatic life" in r.stdout and "high voltage" in r.stdout


def test_cli_start_up_imports_nothing_heavy():
    # Start-up stays light: the beam command with a given speed imports neither
    # matplotlib nor scipy.
    code = (
        "import sys\n"
        "from beamspread.cli import cli\n"
        "try:\n"
        "    cli.main(['beam', '--diameter', '10', '--frequency', '5', '--speed', '5920',"
        " '--json'], standalone_mode=False)\n"
        "except SystemExit:\n"
        "    pass\n"
        "heavy = sorted(m for m in ('matplotlib', 'scipy') if m in sys.modules)\n"
        "sys.stderr.write(repr(heavy))\n"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stderr.endswith("[]"), out.stderr


def test_depth_ranges_and_conflicting_outputs(run):
    data = run(*BASE, "--depth", "20:60:20", "--far-field-only", "--json").json()
    # 20, 40 and 60 mm (bare numbers in mm), each at two levels
    assert sorted({s["depth_m"] for s in data["planes"][0]["spots"]}) == pytest.approx(
        [0.02, 0.04, 0.06]
    )
    r = run(*BASE, "--json", "--format", "csv")
    assert r.code == 2 and "--json" in r.stderr


def test_far_field_rows_between_one_and_three_near_fields_are_marked(run):
    # Common practice: the far-field cone is only approximate within about 3 N of the face.
    # Here N = 20.7 mm: 12 mm is inside N (*), 30 mm between N and 3N (~), 100 mm beyond.
    r = run(*BASE, "--depth", "12", "--depth", "30", "--depth", "100")
    rows = {line.split()[0]: line for line in r.stdout.splitlines() if "far field" in line}
    assert "far field *" in rows["12.00"] and "far field ~" in rows["30.00"]
    assert "*" not in rows["100.00"] and "~" not in rows["100.00"]
    assert "within 3 near-field lengths" in r.stdout
