"""Absorption in seawater, fresh water and air against published forms, tables and limits.

The seawater equation is checked against the check table of Francois & Garrison (1982), Part II,
Table IV, and against the independent simplified form of Ainslie & McColm (1998) with the
agreement those authors state (about 10 %).
"""

from __future__ import annotations

import numpy as np
import pytest

from beamspread import InputError, build_registry
from beamspread import absorption as ab

FREQUENCIES = np.geomspace(100.0, 1e6, 41)  # Ainslie & McColm's stated band, 100 Hz to 1 MHz


# Francois & Garrison (1982), J. Acoust. Soc. Am. 72, 1879 (Part II), Table IV: total absorption
# in dB/km at the surface (z = 0) and pH 8. 21 points spanning 0.4 kHz to 1 MHz, -1.8 to 30 degC
# and both tabulated salinities. We did not see the printed page: the values are as transcribed
# from it in the public test suite of jmrplens/phonometry
# (tests/underwater/test_underwater_propagation.py), which says they were read from the printed
# table. Rows: (f kHz, T degC, S, alpha dB/km as printed, so its last digit is kept).
_FG_TABLE_IV = [
    (0.4, 10.0, 30.0, "0.015"),
    (2.0, 10.0, 35.0, "0.123"),
    (10.0, 30.0, 35.0, "0.606"),
    (10.0, -1.8, 35.0, "1.36"),
    (14.0, 20.0, 35.0, "1.29"),
    (20.0, -1.8, 35.0, "4.40"),
    (20.0, 10.0, 35.0, "3.35"),
    (40.0, 4.0, 35.0, "11.5"),
    (50.0, 20.0, 35.0, "13.0"),
    (60.0, -1.8, 30.0, "13.6"),
    (80.0, 16.0, 35.0, "28.6"),
    (100.0, 0.0, 30.0, "21.0"),
    (100.0, 10.0, 35.0, "33.6"),
    (140.0, 25.0, 35.0, "58.4"),
    (200.0, 0.0, 35.0, "40.6"),
    (200.0, 30.0, 30.0, "79.3"),
    (300.0, 10.0, 35.0, "73.1"),
    (500.0, 10.0, 35.0, "125"),
    (700.0, 4.0, 35.0, "228"),
    (1000.0, 0.0, 30.0, "513"),
    (1000.0, 30.0, 35.0, "344"),
]


def _half_unit_of_last_digit(printed: str) -> float:
    """Half a unit in the last printed digit: "0.015" -> 0.0005, "13.6" -> 0.05, "228" -> 0.5."""
    decimals = len(printed.partition(".")[2])
    return 0.5 * 10.0**-decimals


@pytest.mark.parametrize(("f_khz", "t", "s", "printed"), _FG_TABLE_IV)
def test_francois_garrison_against_their_table_iv(f_khz, t, s, printed):
    ours = float(ab.francois_garrison(f_khz * 1e3, t, s, 0.0, 8.0))
    # Always within the print's own rounding; and within the 1 % the issue asks for wherever
    # the print has three figures (the two-figure 0.015 is itself rounded by up to 3.3 %).
    assert abs(ours - float(printed)) <= _half_unit_of_last_digit(printed)
    if float(printed) >= 0.1:
        assert ours == pytest.approx(float(printed), rel=0.01)


def test_table_iv_pins_the_boric_acid_coefficient():
    # Francois & Garrison's boric acid A1 = 8.86/c x 10^(0.78 pH - 5) (Part II). A copy with
    # 8.68 circulates; at 2 kHz, 10 degC (boric acid dominant) it would miss Table IV's 0.123 by
    # more than the print's rounding, so the row above tells the two apart.
    boric, magnesium, water = ab.francois_garrison_terms(2e3, 10.0, 35.0, 0.0, 8.0)
    transposed = float(boric) * 8.68 / 8.86 + float(magnesium + water)
    assert abs(transposed - 0.123) > _half_unit_of_last_digit("0.123")


def _within_ten_percent(**conditions):
    fg = ab.francois_garrison(FREQUENCIES, **conditions)
    am = ab.ainslie_mccolm(FREQUENCIES, **conditions)
    return np.max(np.abs(am / fg - 1.0))


# Ainslie & McColm (1998) state agreement with Francois & Garrison within about 10 % from
# 100 Hz to 1 MHz, varying one condition at a time about T = 10 degC, S = 35, pH = 8, z = 0.
# Temperatures are kept to -2..30 degC and depths to 6 km, inside Francois & Garrison's own
# data; at the far ends of Ainslie & McColm's ranges (-6 or 35 degC, 7 km) the two differ by
# up to 10.5 %.
@pytest.mark.parametrize("t", [-2.0, 0.0, 5.0, 10.0, 15.0, 20.0, 25.0, 30.0])
def test_francois_garrison_and_ainslie_mccolm_agree_over_temperature(t):
    assert _within_ten_percent(temperature=t) <= 0.10


@pytest.mark.parametrize("ph", [7.7, 7.9, 8.0, 8.1, 8.3])
def test_francois_garrison_and_ainslie_mccolm_agree_over_ph(ph):
    assert _within_ten_percent(temperature=10.0, ph=ph) <= 0.10


@pytest.mark.parametrize("s", [5.0, 20.0, 30.0, 35.0, 40.0, 50.0])
def test_francois_garrison_and_ainslie_mccolm_agree_over_salinity(s):
    assert _within_ten_percent(temperature=10.0, salinity=s) <= 0.10


@pytest.mark.parametrize("z", [0.0, 1000.0, 3000.0, 6000.0])
def test_francois_garrison_and_ainslie_mccolm_agree_over_depth(z):
    assert _within_ten_percent(temperature=10.0, depth=z) <= 0.10


def test_pure_water_coefficient_is_not_the_typo():
    # Francois & Garrison (1982): A3 for T <= 20 degC begins 4.937e-4 dB/(km kHz^2) (from memory)
    # (a copy with 4.397e-4 circulates). At 0 degC and the surface the pure-water term is A3 f^2.
    _, _, water = ab.francois_garrison_terms(1e6, temperature=0.0, depth=0.0)
    assert float(water) / 1000.0**2 == pytest.approx(4.937e-4, rel=1e-12)


def test_fresh_water_against_the_classical_pure_water_value():
    # Pure water at 20 degC: alpha / f^2 = 25.3e-15 Np s^2/m (Pinkerton's measurements, the
    # textbook value; from memory), i.e. 0.22 dB/m at 1 MHz. Francois & Garrison's fit to it
    # agrees within the few per cent the measurements scatter; 5 % bounds that.
    expected_db_per_km = 25.3e-15 * (1e6) ** 2 * 20.0 / np.log(10.0) * 1e3
    assert float(ab.fresh_water(1e6, 20.0)) == pytest.approx(expected_db_per_km, rel=0.05)


def test_absorption_grows_with_frequency_squared_at_high_frequency():
    # Above both relaxation frequencies every term goes as f^2 (Francois & Garrison, the form
    # of their equation): doubling from 5 to 10 MHz multiplies alpha by 4 within 1 %.
    a5, a10 = ab.francois_garrison(np.array([5e6, 10e6]), 10.0)
    assert a10 / a5 == pytest.approx(4.0, rel=0.01)


# ISO 9613-2:1996 Table 2 tabulates ISO 9613-1 at the exact octave mid-band frequencies
# (1000 * 10^(n/10) Hz) for 101.325 kPa (values from memory). Each printed value is rounded
# to 0.1 dB/km (three figures above 100), so each must lie within half a unit of its last digit.
_MIDBAND = 1000.0 * 10.0 ** (np.arange(-12, 10, 3) / 10.0)  # 63 Hz ... 8 kHz
_ISO_9613_2_TABLE_2 = {
    (10.0, 70.0): [0.1, 0.4, 1.0, 1.9, 3.7, 9.7, 32.8, 117.0],
    (20.0, 70.0): [0.1, 0.3, 1.1, 2.8, 5.0, 9.0, 22.9, 76.6],
    (30.0, 70.0): [0.1, 0.3, 1.0, 3.1, 7.4, 12.7, 23.1, 59.3],
    (15.0, 20.0): [0.3, 0.6, 1.2, 2.7, 8.2, 28.2, 88.8, 202.0],
    (15.0, 50.0): [0.1, 0.5, 1.2, 2.2, 4.2, 10.8, 36.2, 129.0],
}


@pytest.mark.parametrize(("t", "rh"), list(_ISO_9613_2_TABLE_2))
def test_air_against_iso_9613_2_table(t, rh):
    table = np.array(_ISO_9613_2_TABLE_2[(t, rh)])
    half_unit = np.where(table >= 100.0, 0.5, 0.05)
    ours = ab.air_iso9613(_MIDBAND, t, rh, 101.325)
    assert np.all(np.abs(ours - table) <= half_unit + 1e-9)


def test_air_at_40_khz_rangefinder_frequency():
    # A 40 kHz rangefinder in room air loses about 1.3 dB/m to absorption (common practice,
    # from memory: "about 1 to 1.5 dB/m" at 20 degC and 40-60 % humidity).
    assert 1.0 < float(ab.air_iso9613(40e3, 20.0, 50.0)) / 1e3 < 1.5


# ----------------------------------------------------------------- the media


def test_media_wire_their_absorption():
    registry = build_registry()
    sea = registry.get("seawater").medium
    assert sea.absorption_db_per_km(200e3) == pytest.approx(
        float(ab.francois_garrison(200e3, 10.0, 35.0, 0.0, 8.0))
    )
    got = sea.absorption_db_per_km(50e3, {"temperature": 4.0, "depth": 100.0, "ph": 7.9})
    assert got == pytest.approx(float(ab.francois_garrison(50e3, 4.0, 35.0, 100.0, 7.9)))
    water = registry.get("water").medium
    assert water.absorption_db_per_km(2e6, {"temperature": 30.0}) == pytest.approx(
        float(ab.fresh_water(2e6, 30.0))
    )
    air = registry.get("air").medium
    assert air.absorption_db_per_km(40e3, {"humidity": 30.0}) == pytest.approx(
        float(ab.air_iso9613(40e3, 20.0, 30.0, 101.325))
    )
    unesco = registry.get("seawater-unesco").medium
    # depth given as pressure: the same absorption within the depth-to-pressure round trip
    by_depth = unesco.absorption_db_per_km(20e3, {"depth": 2000.0})
    assert by_depth == pytest.approx(
        float(ab.francois_garrison(20e3, 10.0, 35.0, 2000.0)), rel=1e-9
    )


def test_absorption_conditions_are_checked():
    sea = build_registry().get("seawater").medium
    with pytest.raises(InputError, match="means nothing outside"):
        sea.absorption_db_per_km(200e3, {"ph": 12.0})
    result = sea.evaluate_absorption(200e3, {"ph": 7.5})
    assert any("ph 7.5 lies outside" in w and "absorption" in w for w in result.warnings)
    # the absorption warns of its own conditions; the speed does not repeat it
    assert sea.evaluate("longitudinal", {"ph": 7.5}).warnings == ()
    outside = sea.evaluate_absorption(5e6)
    assert any("frequency" in w for w in outside.warnings)
    with pytest.raises(InputError):
        sea.absorption_db_per_km(-1.0)
    # pH is an absorption condition: the speed accepts it and does not change with it.
    assert sea.evaluate("longitudinal", {"ph": 7.8}).speed == sea.evaluate().speed


def test_a_medium_without_absorption_says_none():
    from beamspread import ComputedMedium, Parameter

    medium = ComputedMedium(
        "demo-gel",
        "liquid",
        lambda temperature: 1500.0,
        source="demo",
        parameters=(
            Parameter("temperature", "temperature", "degC", 20.0, (0.0, 40.0), (-10.0, 60.0)),
        ),
    )
    assert medium.absorption_db_per_km(1e6) is None
    assert medium.evaluate_absorption(1e6) is None
