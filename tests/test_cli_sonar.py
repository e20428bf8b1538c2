"""Sonar conventions and inverse design on the command line."""

from __future__ import annotations

import csv
import io
import math

import pytest
import scipy.special

SEA = ("--material", "seawater", "--temperature", "12", "--condition", "salinity=34")
SOUNDER = ("beam", "--diameter", "25mm", "--frequency", "200kHz", *SEA)


def test_sonar_defaults_and_full_angles(run):
    data = run(*SOUNDER, "--sonar", "--far-field-only", "--json").json()
    assert data["convention"]["mode"] == "one-way" and data["convention"]["angle"] == "full"
    assert data["convention"]["levels_db"] == [-3.0, -10.0]
    plane = data["planes"][0]
    assert plane["full_angle_deg"]["-3"] == pytest.approx(2 * plane["half_angle_deg"]["-3"])
    # Common practice (sonar texts): the -3 dB one-way full beamwidth of a disc is about
    # 58.9 deg x lambda / D for small angles; here lambda/D = 0.3, so within 1 %.
    lam = data["wavelength_m"]
    assert plane["full_angle_deg"]["-3"] == pytest.approx(58.9 * lam / 0.025, rel=0.01)


def test_directivity_index_is_the_exact_disc_formula(run):
    data = run(*SOUNDER, "--sonar", "--far-field-only", "--json").json()
    # Baffled-disc directivity factor Q = (ka)^2 / (1 - J1(2ka)/(ka)) from the radiation
    # resistance (Kinsler & Frey, the piston chapter), evaluated with scipy.special.j1.
    ka = math.pi * 0.025 / data["wavelength_m"]
    q = ka**2 / (1 - scipy.special.j1(2 * ka) / ka)
    assert data["directivity_index_db"] == pytest.approx(10 * math.log10(q), abs=1e-9)
    assert data["sonar"]["side_lobes"][0]["level_db"] == pytest.approx(-17.57, abs=0.01)


def test_absorption_of_seawater_against_ainslie_mccolm(run):
    # Ainslie & McColm (1998), J. Acoust. Soc. Am. 103, 1671, written out here (f in kHz,
    # T degC, S ppt, D km, pH 8); the paper puts it within about 10 % of Francois & Garrison.
    data = run(*SOUNDER, "--far-field-only", "--json").json()
    f, t, s, d, ph = 200.0, 12.0, 34.0, 0.0, 8.0
    f1 = 0.78 * math.sqrt(s / 35) * math.exp(t / 26)
    f2 = 42 * math.exp(t / 17)
    alpha = (
        0.106 * f1 * f * f / (f1 * f1 + f * f) * math.exp((ph - 8) / 0.56)
        + 0.52 * (1 + t / 43) * (s / 35) * f2 * f * f / (f2 * f2 + f * f) * math.exp(-d / 6)
        + 0.00049 * f * f * math.exp(-(t / 27 + d / 17))
    )
    assert data["absorption_db_per_km"] == pytest.approx(alpha, rel=0.10)


def test_footprints_over_a_depth_range(run):
    data = run(
        *SOUNDER, "--sonar", "--far-field-only", "--bottom-depth", "10m:30m:10m", "--json"
    ).json()
    half = data["planes"][0]["half_angle_deg"]
    prints = {(p["depth_m"], p["level_db"]): p["width_m"] for p in data["footprints"]}
    assert sorted({d for d, _ in prints}) == [10.0, 20.0, 30.0]
    for (depth, level), width in prints.items():
        # footprint on a flat bottom: 2 D tan(half-angle) (geometry)
        key = f"{level:g}"
        assert width == pytest.approx(2 * depth * math.tan(math.radians(half[key])))


def test_echo_budget_terms(run):
    data = run(
        *SOUNDER,
        "--sonar",
        "--far-field-only",
        "--bottom-depth",
        "20m",
        "--power",
        "100",
        "--efficiency",
        "0.4",
        "--bottom-loss",
        "12",
        "--json",
    ).json()
    terms = {t["name"]: t["value_db"] for t in data["echo_budget"][0]["terms"]}
    z = data["medium"]["impedance_rayl"]
    # SL = 10 log10(rho c 1e12 / 4 pi) + 10 log10 P + 10 log10 eta + DI (170.8 dB for
    # rho c = 1.5 MRayl: the common sonar-equation form); spreading to the image source of a
    # flat bottom at 2R, 20 log10 2R (method of images; from memory); absorption 2 alpha R.
    sl = (
        10 * math.log10(z * 1e12 / (4 * math.pi))
        + 10 * math.log10(100)
        + 10 * math.log10(0.4)
        + data["directivity_index_db"]
    )
    assert terms["source level"] == pytest.approx(sl)
    assert terms["two-way spreading loss"] == pytest.approx(20 * math.log10(40))
    assert terms["two-way absorption loss"] == pytest.approx(
        2 * data["absorption_db_per_km"] * 0.020
    )
    assert terms["received echo level"] == pytest.approx(
        sl - 20 * math.log10(40) - terms["two-way absorption loss"] - 12
    )


def test_explicit_pulse_echo_wins_over_sonar_default(run):
    data = run(*SOUNDER, "--sonar", "--pulse-echo", "--far-field-only", "--json").json()
    assert data["convention"]["mode"] == "pulse-echo"


def test_size_round_trips_through_beam(run):
    found = run("size", "--frequency", "200kHz", *SEA, "--full-angle", "20", "--json").json()
    d = found["diameter_m"]
    data = run(
        "beam",
        "--diameter",
        f"{d}m",
        "--frequency",
        "200kHz",
        *SEA,
        "--one-way",
        "--level",
        "3",
        "--far-field-only",
        "--json",
    ).json()
    assert data["planes"][0]["full_angle_deg"]["-3"] == pytest.approx(20.0, rel=1e-9)


def test_size_spot_round_trips(run):
    found = run(
        "size",
        "--frequency",
        "5MHz",
        "--material",
        "reference-steel",
        "--spot",
        "6mm",
        "--at",
        "40mm",
        "--json",
    ).json()
    assert found["convention"] == {"mode": "pulse-echo", "level_db": -6.0}
    data = run(
        "beam",
        "--diameter",
        f"{found['diameter_m']}m",
        "--frequency",
        "5MHz",
        "--material",
        "reference-steel",
        "--depth",
        "40mm",
        "--far-field-only",
        "--level",
        "6",
        "--json",
    ).json()
    assert data["planes"][0]["spots"][0]["width_m"] == pytest.approx(0.006, rel=1e-9)


def test_sonar_computes_the_field_of_a_narrow_band_transducer(run):
    # Resonant sonar transducers are narrow-band, about 0.1 fractional bandwidth (common
    # practice): --sonar takes that as the default; a given --bandwidth still wins.
    data = run(*SOUNDER, "--sonar", "--depth", "100mm", "--json").json()
    assert data["field"]["bandwidth"] == 0.1
    data = run(*SOUNDER, "--sonar", "--depth", "100mm", "--bandwidth", "0.3", "--json").json()
    assert data["field"]["bandwidth"] == 0.3


def test_sonar_csv_keeps_full_angles_and_footprints(run):
    r = run(*SOUNDER, "--sonar", "--bottom-depth", "10m:30m:10m", "--format", "csv")
    assert r.code == 0
    rows = list(csv.DictReader(io.StringIO(r.stdout)))
    prints = [row for row in rows if row["method"] == "bottom footprint"]
    assert len(prints) == 3 * 2  # three depths at -3 and -10 dB
    for row in rows:
        if row["half_angle_deg"]:
            assert float(row["full_angle_deg"]) == pytest.approx(2 * float(row["half_angle_deg"]))
    for row in prints:
        # footprint on a flat bottom: 2 D tan(half-angle) (geometry)
        half = math.radians(float(row["half_angle_deg"]))
        assert float(row["width_m"]) == pytest.approx(2 * float(row["depth_m"]) * math.tan(half))
    # what CSV cannot hold is named on stderr, not dropped silently
    assert "echo budget" in r.stderr and "JSON" in r.stderr


def test_size_csv_and_json_agree(run):
    args = ("size", "--frequency", "200kHz", *SEA, "--full-angle", "20")
    data = run(*args, "--json").json()
    (row,) = csv.DictReader(io.StringIO(run(*args, "--format", "csv").stdout))
    assert float(row["diameter_m"]) == data["diameter_m"]
    assert row["mode"] == "one-way" and float(row["level_db"]) == -3.0
    # without --at there is no depth, so nothing is said of the far field there
    assert data["depth_m"] is None and data["far_field_at_depth"] is None
    assert row["far_field_at_depth"] == ""


@pytest.mark.parametrize(
    ("args", "needle"),
    [
        (("size", "--frequency", "200kHz", *SEA, "--full-angle", "180"), "180"),
        (("size", "--frequency", "200kHz", *SEA, "--half-angle", "95"), "90"),
        (
            ("size", "--frequency", "5MHz", "--speed", "5920", "--spot", "0.5mm", "--at", "40mm"),
            "smallest",
        ),
        (("size", "--frequency", "5MHz", "--speed", "5920"), "one target"),
        (("size", "--frequency", "5MHz", "--speed", "5920", "--spot", "6mm"), "--at"),
        (("size", "--speed", "5920", "--full-angle", "10"), "--frequency"),
        ((*SOUNDER, "--bottom-depth", "30m:10m:5m"), "stop"),
        ((*SOUNDER, "--bottom-depth", "-5m"), "--bottom-depth"),
        ((*SOUNDER, "--power", "100"), "--bottom-depth"),
        ((*SOUNDER, "--sonar", "--efficiency", "0.3"), "--power"),
        ((*SOUNDER, "--bottom-depth", "20m", "--bottom-loss", "6"), "--power"),
        ((*SOUNDER, "--condition", "salinity=80"), "salinity"),
        ((*SOUNDER, "--condition", "ph=12"), "ph"),
    ],
)
def test_sonar_bad_input(run, args, needle):
    r = run(*args)
    assert r.code == 2, (r.stdout, r.stderr)
    lines = r.stderr.strip().splitlines()
    assert len(lines) == 1 and needle in lines[0]


def test_water_results_carry_the_underwater_caution_and_state_their_conditions(run):
    # The caution that fits the medium (the project's rule for results that can hurt): a
    # transducer in seawater gets the underwater one even without --sonar.
    beam = run(*SOUNDER, "--far-field-only")
    caution = " ".join(beam.stdout.split())
    assert "harm aquatic life" in caution and "certified personnel" not in caution
    size = run("size", "--frequency", "200kHz", *SEA, "--full-angle", "20")
    assert "temperature 12 degC" in size.stdout and "salinity 34 g/kg" in size.stdout
    # without a depth there is no width table, so no note explaining one
    pulse = run(*SOUNDER)
    assert "Last on-axis maximum of the pulse" in pulse.stdout
    assert "width between the outermost crossings" not in pulse.stdout


def test_a_rangefinder_in_air_speaks_of_ranges_and_of_hearing(run):
    # A 40 kHz rangefinder looks at a wall, not a sea bottom: its footprint is by range, and its
    # caution is about airborne ultrasound, not aquatic life.
    r = run(
        "beam",
        "--diameter",
        "16mm",
        "--frequency",
        "40kHz",
        "--material",
        "air",
        "--sonar",
        "--bottom-depth",
        "1m:3m:1m",
        "--far-field-only",
    )
    assert r.code == 0
    assert "Footprint on a flat surface" in r.stdout and "water depth" not in r.stdout
    text = " ".join(r.stdout.split())
    assert "airborne ultrasound" in text and "aquatic" not in text


def test_echo_budget_takes_units_and_records_its_inputs(run):
    data = run(
        *SOUNDER,
        "--sonar",
        "--far-field-only",
        "--bottom-depth",
        "20m",
        "--power",
        "0.1kW",
        "--bottom-loss",
        "12dB",
        "--json",
    ).json()
    (budget,) = data["echo_budget"]
    assert budget["power_w"] == 100.0 and budget["efficiency"] == 0.5
    assert budget["bottom_loss_db"] == 12.0


def test_sonar_at_megahertz_says_a_bare_frequency_is_in_mhz(run):
    # "--frequency 200" is 200 MHz (bare numbers are MHz); with --sonar that is surely a slip.
    r = run("beam", "--diameter", "25mm", "--frequency", "200", *SEA, "--sonar", "--far-field-only")
    assert r.code == 0 and "a bare --frequency is in MHz" in r.stderr
