"""Wedges, water paths and focusing: Snell's law, the immersion relation, O'Neil's focus."""

from __future__ import annotations

import math

import numpy as np
import pytest
import scipy.integrate
import scipy.optimize
import scipy.special

from beamspread import InputError
from beamspread.pattern import pattern_x
from beamspread.setups import (
    critical_angles,
    effective_aperture,
    focal_depth_in_part,
    focal_spot_width,
    focused_disc_axial_pressure,
    immersion_near_field,
    leg_geometry,
    refract,
    transmission_coefficient,
    wedge_near_field,
)

# ISO 22232-2:2020 reference steel; acrylic wedges at 2730 m/s (common practice).
CL, CS, ACRYLIC = 5920.0, 3255.0, 2730.0


def test_critical_angles_acrylic_on_steel():
    # Snell's law: sin a1 = c_wedge / c_L, sin a2 = c_wedge / c_S. Common practice quotes
    # about 27.5 and 57 degrees for acrylic on steel.
    first, second = critical_angles(ACRYLIC, CL, CS)
    assert first == pytest.approx(math.asin(ACRYLIC / CL), rel=1e-15)
    assert second == pytest.approx(math.asin(ACRYLIC / CS), rel=1e-15)
    assert round(math.degrees(first), 1) == 27.5 and round(math.degrees(second)) == 57


def test_critical_angles_water_on_steel():
    # Water at about 1483 m/s (Marczak 1997 at 20 degC): common practice quotes about
    # 14.5 and 27 degrees for immersion on steel.
    first, second = critical_angles(1483.0, CL, CS)
    assert round(math.degrees(first), 1) == 14.5
    assert round(math.degrees(second)) == 27


@pytest.mark.parametrize("beta_deg", [45.0, 60.0, 70.0])
def test_incident_angles_for_nominal_shear_angles(beta_deg):
    # Snell's law solved for the incident angle, then checked forward.
    r = refract(ACRYLIC, CL, CS, refracted=math.radians(beta_deg), wave="shear")
    assert math.sin(r.incident) / ACRYLIC == pytest.approx(math.sin(math.radians(beta_deg)) / CS)
    assert math.degrees(r.shear) == pytest.approx(beta_deg)
    assert r.longitudinal is None  # all three lie past the first critical angle (27.5 deg)


def test_below_first_critical_both_modes_propagate():
    r = refract(ACRYLIC, CL, CS, incident=math.radians(20.0))
    assert r.longitudinal is not None and r.shear is not None
    assert math.sin(r.longitudinal) / CL == pytest.approx(math.sin(math.radians(20)) / ACRYLIC)


def test_unreachable_and_bad_angles_are_refused():
    with pytest.raises(InputError, match="largest reachable"):
        refract(7000.0, CL, CS, refracted=math.radians(70), wave="shear")
    with pytest.raises(InputError, match="90 degrees"):
        refract(ACRYLIC, CL, CS, refracted=math.radians(95))
    with pytest.raises(InputError, match="either"):
        refract(ACRYLIC, CL, CS)


def test_past_the_second_critical_angle_no_wave_enters():
    r = refract(ACRYLIC, CL, CS, incident=math.radians(60.0))
    assert r.longitudinal is None and r.shear is None


def test_effective_aperture_and_wedge_near_field():
    # Common practice: aperture x cos(beta)/cos(alpha); N_part - wedge path x c_w / c_part.
    r = refract(ACRYLIC, CL, CS, refracted=math.radians(60))
    assert effective_aperture(0.010, r.incident, r.shear) == pytest.approx(
        0.010 * math.cos(math.radians(60)) / math.cos(r.incident)
    )
    expected = 0.030 - 0.012 * ACRYLIC / CS
    assert wedge_near_field(0.030, 0.012, ACRYLIC, CS) == pytest.approx(expected)


def test_immersion_near_field_relation():
    # Common practice: N_part = (N_water - WP) c_water / c_part; none once WP >= N_water.
    assert immersion_near_field(0.1, 0.04, 1483.0, CL) == pytest.approx(0.06 * 1483.0 / CL)
    assert immersion_near_field(0.1, 0.12, 1483.0, CL) is None
    assert focal_depth_in_part(0.1, 0.04, 1483.0, CL) == pytest.approx(0.06 * 1483.0 / CL)


def test_transmission_water_to_steel():
    # 2 Z2 / (Z1 + Z2): water 1.48 MRayl, steel 46.5 MRayl gives about 1.94 (common practice,
    # the pressure doubling at a hard boundary).
    t = transmission_coefficient(1.48e6, 46.5e6)
    assert t == pytest.approx(2 * 46.5 / (1.48 + 46.5))
    assert round(t, 2) == 1.94


def test_leg_geometry():
    path, surface, unfolded = leg_geometry(0.015, math.radians(60), thickness=0.025, leg=2)
    assert unfolded == pytest.approx(0.035)
    assert path == pytest.approx(0.035 / math.cos(math.radians(60)))
    assert surface == pytest.approx(0.035 * math.tan(math.radians(60)))


def test_focal_spot_about_1_03_f_lambda_over_d():
    # O'Neil (1949) focal-plane pattern 2 J1(x)/x; pulse-echo -6 dB where (2J1(x)/x)^2 = 1/2
    # (x from scipy brentq on scipy.special.j1): width = 2 x F lambda / (pi D), the "1.02"
    # of common practice is 1.027 pulse-echo (computed here).
    x = scipy.optimize.brentq(
        lambda u: (2 * scipy.special.j1(u) / u) ** 2 - 10 ** (-6 / 20), 0.1, 3.8
    )
    width = focal_spot_width(0.05, 0.0003, 0.0127, float(pattern_x(6, "disc", "pulse-echo")))
    assert width == pytest.approx(2 * x * 0.05 * 0.0003 / (math.pi * 0.0127), rel=1e-10)
    assert round(width / (0.05 * 0.0003 / 0.0127), 2) == 1.03


def cap_brute_force(z, diameter, focal, lam):
    """|p|/(rho c U0) on axis from the Rayleigh integral over the spherical cap (scipy dblquad
    over the cap's polar angle psi and azimuth), surface element F^2 sin(psi)."""
    k = 2 * math.pi / lam
    psi0 = math.asin(diameter / 2 / focal)

    def dist(psi):
        return math.sqrt((focal * math.sin(psi)) ** 2 + (z - focal + focal * math.cos(psi)) ** 2)

    def part(f):
        return scipy.integrate.quad(
            lambda psi: 2 * math.pi * f(k * dist(psi)) / dist(psi) * focal**2 * math.sin(psi),
            0,
            psi0,
            limit=500,
            epsabs=1e-13,
        )[0]

    return k / (2 * math.pi) * math.hypot(part(math.cos), part(math.sin))


@pytest.mark.parametrize("z", [0.01, 0.03, 0.045, 0.06, 0.09])
def test_focused_disc_axis_against_cap_integral(z):
    d, f, lam = 0.0127, 0.05, 1483.0 / 5e6
    ours = float(focused_disc_axial_pressure(z, d, f, lam))
    assert ours == pytest.approx(cap_brute_force(z, d, f, lam), rel=1e-7)


def test_focused_axial_maximum_lies_short_of_the_focus():
    # O'Neil (1949): the on-axis maximum of a focused source lies between the face and F.
    d, f, lam = 0.0127, 0.05, 1483.0 / 5e6
    z = np.linspace(0.01, 0.08, 20001)
    p = focused_disc_axial_pressure(z, d, f, lam)
    assert z[np.argmax(p)] < f
    assert float(focused_disc_axial_pressure(f, d, f, lam)) == pytest.approx(
        2 * math.pi / lam * (f - math.sqrt(f * f - (d / 2) ** 2))
    )
