"""Sound-speed equations of the built-in media against reference libraries and check values."""

from __future__ import annotations

import gsw
import iapws
import numpy as np
import pytest

from beamspread import build_registry
from beamspread.media import equations as eq


@pytest.mark.parametrize("t", [0.5, 5.0, 10.0, 20.0, 30.0, 50.0, 70.0, 90.0])
@pytest.mark.parametrize("fn", [eq.water_marczak, eq.water_bilaniuk_wong])
def test_fresh_water_against_iapws95(fn, t):
    # Reference: IAPWS-95 through the iapws package at 0.101325 MPa. Marczak (1997) and
    # Bilaniuk & Wong (1993) are fits to measurements that agree with IAPWS-95 within about
    # 0.1 m/s (0.007 %) over 0-90 degC; 0.12 m/s is that agreement, not a loosened bound.
    reference = iapws.IAPWS95(T=t + 273.15, P=0.101325).w
    assert float(fn(t)) == pytest.approx(reference, abs=0.12)


def test_iapws95_release_check_value():
    # The IAPWS-95 release's own check value: w = 1501.51914 m/s at 300 K, 996.556 kg/m3.
    # Confirms the reference library before we rely on it.
    assert iapws.IAPWS95(T=300.0, rho=996.556).w == pytest.approx(1501.51914, abs=1e-4)


@pytest.mark.parametrize("t", [0.0, 4.0, 20.0, 40.0, 80.0, 95.0])
def test_water_density_against_iapws95(t):
    # Reference: IAPWS-95 density at 0.101325 MPa; Kell (1975) agrees to about 10 ppm.
    reference = iapws.IAPWS95(T=t + 273.15, P=0.101325).rho
    assert float(eq.water_density_kell(t)) == pytest.approx(reference, rel=2e-5)


def test_mackenzie_check_value():
    # Mackenzie (1981) J. Acoust. Soc. Am. 70, 807, the paper's check value:
    # 1550.744 m/s at 25 degC, 35 ppt, 1000 m (from memory; equal to the formula).
    assert float(eq.seawater_mackenzie(25.0, 35.0, 1000.0)) == pytest.approx(1550.744, abs=5e-4)


@pytest.mark.parametrize(
    ("t", "s", "d"),
    [
        (0.0, 35.0, 0.0),
        (10.0, 35.0, 0.0),
        (25.0, 35.0, 0.0),
        (10.0, 30.0, 100.0),
        (4.0, 34.7, 1000.0),
        (2.0, 34.7, 3000.0),
        (20.0, 38.0, 50.0),
        (28.0, 36.0, 0.0),
    ],
)
def test_mackenzie_against_teos10(t, s, d):
    # Reference: TEOS-10 through gsw (sound_speed_t_exact, pressure from depth at 45 N,
    # absolute salinity from practical salinity). The published comparisons put Mackenzie
    # within about 0.1-0.6 m/s of the newer equations in its range; 0.7 m/s bounds that.
    p = float(gsw.p_from_z(-d, 45.0))
    sa = float(gsw.SR_from_SP(s))
    reference = float(gsw.sound_speed_t_exact(sa, t, p))
    assert float(eq.seawater_mackenzie(t, s, d)) == pytest.approx(reference, abs=0.7)


def test_air_at_zero_against_cramer():
    # Cramer (1993) J. Acoust. Soc. Am. 93, 2510: 331.45 m/s for dry air at 0 degC
    # (314 ppm CO2); the ideal-gas form 331.3 sqrt(1 + T/273.15) gives 331.3 (0.05 % low).
    assert float(eq.air_speed_ideal(0.0)) == pytest.approx(331.45, rel=6e-4)


def test_air_follows_the_square_root_of_absolute_temperature():
    # Ideal gas (any acoustics text): c proportional to sqrt(T in kelvin).
    t = np.array([-20.0, 0.0, 20.0, 40.0])
    c = eq.air_speed_ideal(t)
    assert np.allclose(c / c[1], np.sqrt((t + 273.15) / 273.15), rtol=1e-14)


def test_built_in_media_use_these_equations_and_declare_ranges():
    # The registered media report the same speeds as the published equations above.
    registry = build_registry()
    water = registry.get("water").medium
    assert water.evaluate("longitudinal", {"temperature": 37.0}).speed == pytest.approx(
        float(eq.water_marczak(37.0))
    )
    sea = registry.get("seawater").medium
    wave = sea.evaluate("longitudinal", {"temperature": 12.0, "salinity": 34.0, "depth": 15.0})
    assert wave.speed == pytest.approx(float(eq.seawater_mackenzie(12.0, 34.0, 15.0)))
    assert {p.name for p in sea.parameters} == {"temperature", "salinity", "depth"}
    warned = water.evaluate("longitudinal", {"temperature": 98.0})
    assert any("outside the range 0 to 95" in w for w in warned.warnings)
    from beamspread import InputError

    with pytest.raises(InputError, match="means nothing outside"):
        water.evaluate("longitudinal", {"temperature": 150.0})
