"""Seawater (UNESCO), depth to pressure, and air (Cramer) against check values and references."""

from __future__ import annotations

import gsw
import iapws
import numpy as np
import pytest

from beamspread import InputError, build_registry
from beamspread.media import equations as eq

# ----------------------------------------------------------------- UNESCO


def test_unesco_check_value():
    # Fofonoff & Millard (1983), UNESCO Tech. Pap. Mar. Sci. 44, the published check value of
    # the sound-speed algorithm: 1731.995 m/s at S = 40, T68 = 40 degC, 10000 dbar. Our
    # function takes ITS-90, so T90 = 40 / 1.00024.
    assert float(eq.seawater_unesco(40.0 / 1.00024, 40.0, 10000.0)) == pytest.approx(
        1731.995, abs=5e-4
    )


def test_t68_conversion():
    # T68 = 1.00024 T90 (the conversion the UNESCO algorithms adopted for ITS-90).
    assert float(eq.t68_from_t90(25.0)) == pytest.approx(25.006, abs=1e-12)


@pytest.mark.parametrize("p", [0.0, 50.0, 200.0])
@pytest.mark.parametrize("t", [0.0, 5.0, 10.0, 20.0, 30.0])
@pytest.mark.parametrize("s", [30.0, 35.0, 40.0])
def test_unesco_near_the_surface_against_teos10(p, t, s):
    # Reference: TEOS-10 through gsw.sound_speed_t_exact (absolute salinity from practical
    # salinity by gsw.SR_from_SP). The older equations differ from TEOS-10 by a few tenths of a
    # m/s (the TEOS-10 manual's comparison, from memory); near the surface 0.3 m/s bounds
    # "a few tenths".
    reference = float(gsw.sound_speed_t_exact(gsw.SR_from_SP(s), t, p))
    assert float(eq.seawater_unesco(t, s, p)) == pytest.approx(reference, abs=0.3)


@pytest.mark.parametrize("p", [2000.0, 4000.0, 6000.0])
@pytest.mark.parametrize("t", [0.0, 2.0, 4.0])
@pytest.mark.parametrize("s", [34.5, 35.0])
def test_unesco_runs_high_at_depth_against_teos10(p, t, s):
    # Reference: TEOS-10 (gsw). The known spread at depth: UNESCO runs 0.3-0.7 m/s above
    # TEOS-10 in cold deep water (from memory; the excess found by Dushaw et al. 1993 from
    # ocean travel times, from memory).
    reference = float(gsw.sound_speed_t_exact(gsw.SR_from_SP(s), t, p))
    excess = float(eq.seawater_unesco(t, s, p)) - reference
    assert 0.3 <= excess <= 0.7


@pytest.mark.parametrize("lat", [0.0, 30.0, 45.0, 80.0])
@pytest.mark.parametrize("z", [10.0, 100.0, 1000.0, 5000.0, 10000.0])
def test_saunders_pressure_against_gsw(z, lat):
    # Reference: gsw.p_from_z (TEOS-10, with its own gravity and standard ocean). Saunders
    # (1981) assumes a standard ocean of salinity 35 at 0 degC; the two agree within 0.1 %.
    assert float(eq.pressure_from_depth_saunders(z, lat)) == pytest.approx(
        float(gsw.p_from_z(-z, lat)), rel=1e-3
    )


def test_saunders_published_example():
    # Saunders (1981) as coded in the CSIRO sea-water library: the example of its 'pres'
    # function (python-seawater's documentation) gives 7500.0065 dbar for 7321.45 m at 30 N.
    p = float(eq.pressure_from_depth_saunders(7321.45, 30.0))
    assert p == pytest.approx(7500.0065, abs=5e-4)


def test_saunders_inverse_round_trips():
    # The inverse is the quadratic the formula solves: exact up to rounding.
    z = np.array([1.0, 100.0, 3000.0, 11000.0])
    p = eq.pressure_from_depth_saunders(z, 20.0)
    assert np.allclose(eq.depth_from_pressure_saunders(p, 20.0), z, rtol=1e-12)


def test_unesco_medium_takes_pressure_or_depth_not_both():
    medium = build_registry().get("seawater-unesco").medium
    by_depth = medium.evaluate(
        "longitudinal", {"temperature": 4.0, "depth": 1000.0, "latitude": 45.0}
    )
    # The same point given as pressure, converted with gsw (TEOS-10) instead of Saunders:
    p = float(gsw.p_from_z(-1000.0, 45.0))
    by_pressure = medium.evaluate("longitudinal", {"temperature": 4.0, "pressure": p})
    # dc/dp is about 0.017 m/s per dbar; Saunders and gsw differ by under 0.3 dbar here.
    assert by_depth.speed == pytest.approx(by_pressure.speed, abs=0.017 * 0.3)
    with pytest.raises(InputError, match="not both"):
        medium.evaluate("longitudinal", {"depth": 10.0, "pressure": 10.0})
    # 0 counts as not given.
    assert medium.evaluate("longitudinal", {"depth": 0.0, "pressure": 100.0}).speed == (
        pytest.approx(float(eq.seawater_unesco(10.0, 35.0, 100.0)))
    )


@pytest.mark.parametrize("name", ["seawater-unesco", "seawater-del-grosso"])
def test_pressure_media_show_the_pressure_and_depth_they_used(name):
    # A result never shows a depth of 0 beside a pressure of 1000 dbar: whichever is given, the
    # other is shown as converted. Reference: gsw.p_from_z (TEOS-10); Saunders (1981) agrees
    # with it within 0.3 dbar at 1000 m and 45 degrees (see the tests above).
    medium = build_registry().get(name).medium
    shown = medium.evaluate("longitudinal", {"depth": 1000.0}).conditions
    assert shown["depth"] == 1000.0
    assert shown["pressure"] == pytest.approx(float(gsw.p_from_z(-1000.0, 45.0)), abs=0.3)
    shown = medium.evaluate("longitudinal", {"pressure": 1000.0}).conditions
    assert shown["pressure"] == 1000.0
    assert float(gsw.p_from_z(-shown["depth"], 45.0)) == pytest.approx(1000.0, abs=0.3)
    absorbed = medium.evaluate_absorption(50e3, {"pressure": 1000.0}).conditions
    assert absorbed["depth"] == pytest.approx(shown["depth"])


def test_seawater_default_is_mackenzie_and_unesco_refuses_outside_limits():
    registry = build_registry()
    assert registry.get("seawater").name == "seawater-mackenzie"
    unesco = registry.get("seawater-unesco").medium
    with pytest.raises(InputError, match="means nothing outside"):
        unesco.evaluate("longitudinal", {"salinity": 60.0})
    warned = unesco.evaluate("longitudinal", {"pressure": 10500.0})
    assert any("outside the range 0 to 10000" in w for w in warned.warnings)


# ----------------------------------------------------------------- Del Grosso

# The ocean's own conditions: warm water only near the surface, cold water at depth.
_OCEAN = (
    [(p, t) for p in (0.0, 200.0) for t in (0.0, 10.0, 20.0, 30.0)]
    + [(1000.0, t) for t in (2.0, 5.0, 8.0, 12.0)]
    + [(p, t) for p in (2000.0, 5000.0, 9000.0) for t in (0.0, 2.0, 4.0)]
)


@pytest.mark.parametrize(("p", "t"), _OCEAN)
@pytest.mark.parametrize("s", [34.0, 35.0, 37.0])
def test_del_grosso_against_teos10(p, t, s):
    # Reference: TEOS-10 (gsw.sound_speed_t_exact). The published equations differ from it by a
    # few tenths of a m/s (from memory); 0.3 m/s bounds that.
    reference = float(gsw.sound_speed_t_exact(gsw.SR_from_SP(s), t, p))
    assert float(eq.seawater_del_grosso(t, s, p)) == pytest.approx(reference, abs=0.3)


def test_del_grosso_medium_by_depth():
    medium = build_registry().get("seawater-del-grosso").medium
    wave = medium.evaluate("longitudinal", {"temperature": 3.0, "depth": 3000.0})
    p = float(eq.pressure_from_depth_saunders(3000.0, 45.0))
    assert wave.speed == pytest.approx(float(eq.seawater_del_grosso(3.0, 35.0, p)), rel=1e-14)
    with pytest.raises(InputError, match="seawater-del-grosso takes pressure or depth"):
        medium.absorption_db_per_km(10e3, {"depth": 10.0, "pressure": 10.0})


# ----------------------------------------------------------------- air


def test_cramer_reference_value():
    # Cramer (1993), J. Acoust. Soc. Am. 93, 2510: 331.45 m/s for dry air at 0 degC,
    # 101.325 kPa and 314 ppm CO2 (0.0314 %).
    assert float(eq.air_cramer(0.0, 0.0, 101.325, 0.0314)) == pytest.approx(331.45, abs=5e-3)


def test_air_medium_at_cramer_conditions():
    air = build_registry().get("air").medium
    wave = air.evaluate(
        "longitudinal", {"temperature": 0.0, "humidity": 0.0, "pressure": 101.325, "co2": 0.0314}
    )
    assert wave.speed == pytest.approx(331.45, abs=5e-3)  # Cramer (1993), as above


@pytest.mark.parametrize("t", [5.0, 10.0, 20.0, 30.0])
def test_cramer_dry_air_follows_the_ideal_gas_law(t):
    # Ideal gas (any acoustics text): c proportional to sqrt(T in kelvin). Real dry air departs
    # from it by its slowly varying heat-capacity ratio, under 0.01 % over 0-30 degC (common
    # practice, from memory).
    ratio = float(eq.air_cramer(t, 0.0) / eq.air_cramer(0.0, 0.0))
    assert ratio == pytest.approx(np.sqrt((t + 273.15) / 273.15), rel=1e-4)


@pytest.mark.parametrize("t", [5.0, 15.0, 25.0, 30.0])
def test_cramer_humidity_through_iapws_saturation_pressure(t):
    # Reference: the saturation vapour pressure of IAPWS-IF97 (iapws.IAPWS97, x = 0), in place
    # of the older formula Cramer's appendix gives. Through the speed the two agree within
    # 0.002 m/s at 100 % humidity, far inside Cramer's own uncertainty of about 300 ppm
    # (0.1 m/s, from memory).
    kelvin = t + 273.15
    psat = iapws.IAPWS97(T=kelvin, x=0).P * 1e6  # Pa
    p = 101325.0
    f = 1.00062 + 3.14e-8 * p + 5.6e-7 * t * t  # Cramer's enhancement factor
    xw = f * psat / p
    ours = float(eq.water_vapour_mole_fraction(t, 100.0, 101.325))
    dc_dxw = 51.471935 + 0.1495874 * t - 0.000782 * t * t  # Cramer's a3 + a4 t + a5 t^2
    assert abs(ours - xw) * dc_dxw < 2e-3


def test_humid_air_is_faster():
    # Water vapour is lighter than air: humidity raises the speed (any acoustics text); at
    # 20 degC, 100 % humidity adds about 1.2 m/s (common practice, from memory).
    dry, wet = eq.air_cramer(20.0, 0.0), eq.air_cramer(20.0, 100.0)
    assert 0.9 < float(wet - dry) < 1.5


def test_dry_air_density():
    # Dry air at 0 degC and 101.325 kPa: 1.2922 kg/m3 (common practice, from memory); the
    # ideal-gas mixture neglects compressibility (0.06 %).
    assert float(eq.air_density_humid(0.0, 0.0)) == pytest.approx(1.2922, rel=1e-3)


def test_air_medium_ranges():
    air = build_registry().get("air").medium
    with pytest.raises(InputError, match="means nothing outside"):
        air.evaluate("longitudinal", {"humidity": 120.0})
    warned = air.evaluate("longitudinal", {"temperature": 45.0})
    assert any("outside the range 0 to 30" in w for w in warned.warnings)
    assert build_registry().get("dry-air").name == "air-ideal"
