"""Plane-wave reflection and transmission at a flat interface, against outside checks.

Media (typical handbook values, from memory): water 1000 kg/m3, 1480 m/s; steel 7850 kg/m3,
5920 / 3255 m/s; acrylic 1180 kg/m3, 2730 / 1430 m/s.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from beamspread.coupling.transmission import Side, plane_wave_coefficients
from beamspread.errors import InputError

WATER = Side(1000.0, 1480.0)
STEEL = Side(7850.0, 5920.0, 3255.0)
ACRYLIC = Side(1180.0, 2730.0, 1430.0)
ANGLES = np.radians(np.linspace(0.0, 89.0, 179))


def test_normal_incidence_water_to_steel_is_the_impedance_formula():
    # Sound pressure at normal incidence: T = 2 Z2 / (Z1 + Z2), R = (Z2 - Z1) / (Z1 + Z2)
    # (Krautkraemer, Ultrasonic Testing of Materials, reflection and transmission at normal
    # incidence; any acoustics textbook).
    z1, z2 = 1000.0 * 1480.0, 7850.0 * 5920.0
    c = plane_wave_coefficients(0.0, WATER, STEEL)
    assert c.stress["transmitted longitudinal"].real == pytest.approx(2 * z2 / (z1 + z2), 1e-12)
    assert c.stress["reflected longitudinal"].real == pytest.approx((z2 - z1) / (z1 + z2), 1e-12)
    assert abs(c.stress["transmitted longitudinal"]) == pytest.approx(1.938, abs=5e-4)
    assert c.energy["transmitted longitudinal"] == pytest.approx(4 * z1 * z2 / (z1 + z2) ** 2)
    assert c.energy["transmitted shear"] == pytest.approx(0.0, abs=1e-24)


def test_liquid_to_solid_matches_the_closed_form():
    # Liquid-solid interface (Brekhovskikh, Waves in Layered Media, the liquid-solid boundary;
    # from memory): with Z = rho c / cos(angle) for the liquid (Z1), the longitudinal (Zp) and
    # the shear (Zs) wave, and D = Zp cos^2 2ts + Zs sin^2 2ts + Z1, the stress ratios are
    # |Tp| = 2 Zp cos 2ts / D, |Ts| = 2 Zs sin 2ts / D and R = (D - 2 Z1) / D.
    t = np.radians(np.linspace(0.5, 14.0, 28))  # below the first critical angle
    p = np.sin(t) / 1480.0
    tp, ts = np.arcsin(p * 5920.0), np.arcsin(p * 3255.0)
    z1 = 1000.0 * 1480.0 / np.cos(t)
    zp, zs = 7850.0 * 5920.0 / np.cos(tp), 7850.0 * 3255.0 / np.cos(ts)
    d = zp * np.cos(2 * ts) ** 2 + zs * np.sin(2 * ts) ** 2 + z1
    c = plane_wave_coefficients(t, WATER, STEEL)
    np.testing.assert_allclose(
        np.abs(c.stress["transmitted longitudinal"]), 2 * zp * np.cos(2 * ts) / d, rtol=1e-12
    )
    np.testing.assert_allclose(
        np.abs(c.stress["transmitted shear"]), 2 * zs * np.sin(2 * ts) / d, rtol=1e-12
    )
    np.testing.assert_allclose(np.abs(c.stress["reflected longitudinal"]), (d - 2 * z1) / d)
    np.testing.assert_allclose(np.degrees(c.angles["transmitted longitudinal"]), np.degrees(tp))


@pytest.mark.parametrize(
    ("upper", "lower", "boundary", "wave"),
    [
        (WATER, STEEL, "welded", "longitudinal"),
        (ACRYLIC, STEEL, "welded", "longitudinal"),
        (ACRYLIC, STEEL, "slip", "longitudinal"),
        (STEEL, WATER, "welded", "shear"),
        (STEEL, ACRYLIC, "slip", "shear"),
        (STEEL, ACRYLIC, "welded", "longitudinal"),
    ],
)
def test_energy_is_conserved_at_every_angle(upper, lower, boundary, wave):
    # Conservation of energy: the power flux through the interface of the reflected and
    # transmitted waves equals the incident wave's (evanescent waves carry none).
    c = plane_wave_coefficients(ANGLES, upper, lower, boundary=boundary, incident_wave=wave)
    np.testing.assert_allclose(sum(c.energy.values()), 1.0, atol=1e-12)


def test_past_the_critical_angles_the_waves_become_evanescent():
    # Snell's law: first critical angle arcsin(c_water / c_long) = 14.48 deg, second
    # arcsin(c_water / c_shear) = 27.04 deg for water on steel (common practice).
    first, second = math.asin(1480 / 5920), math.asin(1480 / 3255)
    assert math.degrees(first) == pytest.approx(14.48, abs=0.005)
    assert math.degrees(second) == pytest.approx(27.04, abs=0.005)
    c = plane_wave_coefficients(np.array([first + 0.01, second + 0.01]), WATER, STEEL)
    assert np.all(c.energy["transmitted longitudinal"] == 0.0)
    assert np.isnan(c.angles["transmitted longitudinal"]).all()
    assert c.energy["transmitted shear"][0] > 0.0
    assert abs(c.stress["reflected longitudinal"][1]) == pytest.approx(1.0, 1e-12)


@pytest.mark.parametrize("boundary", ["welded", "slip"])
def test_energy_coefficients_are_reciprocal(boundary):
    # Reciprocity (Auld, Acoustic Fields and Waves in Solids; from memory): the energy share
    # carried from mode a on side 1 into mode b on side 2 equals that from b into a at the
    # angles Snell's law pairs.
    t = np.radians(np.linspace(1.0, 25.0, 13))
    forward = plane_wave_coefficients(t, ACRYLIC, STEEL, boundary=boundary)
    back_angle = np.arcsin(np.sin(t) / 2730.0 * 3255.0)
    back = plane_wave_coefficients(
        back_angle, STEEL, ACRYLIC, boundary=boundary, incident_wave="shear"
    )
    np.testing.assert_allclose(
        forward.energy["transmitted shear"], back.energy["transmitted longitudinal"], rtol=1e-10
    )


def test_a_boundary_between_like_media_lets_everything_through():
    # Identical media: no interface, no reflection (welded); a fluid on a fluid likewise.
    for side in (STEEL, WATER):
        c = plane_wave_coefficients(ANGLES, side, side)
        np.testing.assert_allclose(c.displacement["transmitted longitudinal"], 1.0, atol=1e-12)
        np.testing.assert_allclose(np.abs(c.displacement["reflected longitudinal"]), 0, atol=1e-12)
        np.testing.assert_allclose(np.abs(c.displacement["transmitted shear"]), 0, atol=1e-12)


def test_a_slip_boundary_transmits_no_shear_at_normal_incidence_and_differs_off_it():
    # A thin liquid layer carries no shear traction: at normal incidence both boundaries give
    # the impedance formula; obliquely, welded and slip differ (Schmerr, Fundamentals of
    # Ultrasonic NDE, the solid-solid interface; from memory).
    z1, z2 = 1180.0 * 2730.0, 7850.0 * 5920.0
    for boundary in ("welded", "slip"):
        c = plane_wave_coefficients(0.0, ACRYLIC, STEEL, boundary=boundary)
        assert c.stress["transmitted longitudinal"].real == pytest.approx(2 * z2 / (z1 + z2))
    t = np.radians(40.0)
    welded = plane_wave_coefficients(t, ACRYLIC, STEEL, boundary="welded")
    slip = plane_wave_coefficients(t, ACRYLIC, STEEL, boundary="slip")
    assert abs(welded.energy["transmitted shear"] - slip.energy["transmitted shear"]) > 0.01


@settings(max_examples=60, deadline=None)
@given(
    st.floats(1000, 9000),
    st.floats(0.2, 0.65),
    st.floats(500, 20000),
    st.floats(1000, 9000),
    st.floats(0.2, 0.65),
    st.floats(500, 20000),
    st.floats(0.0, 1.55),
    st.sampled_from(["welded", "slip"]),
)
def test_energy_balance_holds_for_any_pair_of_solids(c1, r1, rho1, c2, r2, rho2, angle, boundary):
    # Conservation of energy, for random solids (shear speed below c / sqrt 2).
    upper, lower = Side(rho1, c1, c1 * r1), Side(rho2, c2, c2 * r2)
    c = plane_wave_coefficients(angle, upper, lower, boundary=boundary)
    assert sum(c.energy.values()) == pytest.approx(1.0, abs=1e-9)


def test_bad_input_is_refused_with_what_is_allowed():
    with pytest.raises(InputError, match="welded or slip"):
        plane_wave_coefficients(0.1, ACRYLIC, STEEL, boundary="glued")
    with pytest.raises(InputError, match="shear is not allowed from a fluid"):
        plane_wave_coefficients(0.1, WATER, STEEL, incident_wave="shear")
    with pytest.raises(InputError, match=r"\[0, 90\)"):
        plane_wave_coefficients(math.pi / 2, WATER, STEEL)
    with pytest.raises(InputError, match="below longitudinal / sqrt"):
        Side(7850.0, 5920.0, 5000.0)
