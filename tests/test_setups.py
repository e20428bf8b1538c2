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
    cone_footprint,
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


def _ray_crossing(start, angle, depth):
    """Where a ray from ``start`` (along the surface, depth) at ``angle`` from the normal,
    heading down, meets ``depth``: plane geometry, written out independently."""
    x0, y0 = start
    direction = (math.sin(angle), math.cos(angle))
    t = (depth - y0) / direction[1]
    return x0 + t * direction[0], t


@pytest.mark.parametrize("offset", [0.0, 0.004, 0.010])
@pytest.mark.parametrize(("beta_deg", "theta_deg"), [(45, 3.0), (60, 5.0), (70, 7.2), (30, 12.0)])
def test_far_field_cone_footprint_from_the_virtual_element_leg_1(beta_deg, theta_deg, offset):
    # Geometry; the virtual element set back by the wedge path's equivalent (common practice).
    # The apex sits `offset` up the axis behind the exit point; the edges leave it at
    # beta -+ theta and are followed as rays to the depth.
    beta, theta, depth = math.radians(beta_deg), math.radians(theta_deg), 0.015
    apex = (-offset * math.sin(beta), -offset * math.cos(beta))
    near_x, _ = _ray_crossing(apex, beta - theta, depth)
    far_x, _ = _ray_crossing(apex, beta + theta, depth)
    near, far, near_path, far_path = cone_footprint(depth, beta, theta, offset)
    assert near == pytest.approx(near_x, rel=1e-12, abs=1e-15)
    assert far == pytest.approx(far_x, rel=1e-12)
    # the brief's closed form (d + o cos b)(tan(b + t) - tan(b - t))
    closed = (depth + offset * math.cos(beta)) * (math.tan(beta + theta) - math.tan(beta - theta))
    assert far - near == pytest.approx(closed, rel=1e-12)
    if offset == 0:  # the cone from the exit point: d (tan(b + t) - tan(b - t))
        assert far - near == pytest.approx(
            depth * (math.tan(beta + theta) - math.tan(beta - theta)), rel=1e-12
        )
    # the crossing's sound path: the point (s + o) tan(theta) across the axis at path s is
    # on the edge, at the depth (coordinates of a point off the axis)
    for s, side, x in ((near_path, -1, near), (far_path, 1, far)):
        across = side * (s + offset) * math.tan(theta)
        assert s * math.cos(beta) - across * math.sin(beta) == pytest.approx(depth, rel=1e-12)
        assert s * math.sin(beta) + across * math.cos(beta) == pytest.approx(x, rel=1e-12)


@pytest.mark.parametrize("offset", [0.0, 0.008])
def test_far_field_cone_footprint_on_leg_2_is_the_unfolded_one(offset):
    # Geometry: follow each edge ray down to the back wall, mirror it there (angle of
    # reflection equals angle of incidence) and on up to the flaw depth; the crossing equals
    # the straight (unfolded) ray's at 2t - d.
    beta, theta = math.radians(60), math.radians(6.0)
    t, d = 0.025, 0.015
    apex = (-offset * math.sin(beta), -offset * math.cos(beta))
    ends = []
    for angle in (beta - theta, beta + theta):
        x_wall, _ = _ray_crossing(apex, angle, t)
        x = x_wall + (t - d) * math.tan(angle)  # back up at the same angle
        ends.append(x)
    near, far, _, _ = cone_footprint(2 * t - d, beta, theta, offset)
    assert near == pytest.approx(ends[0], rel=1e-12)
    assert far == pytest.approx(ends[1], rel=1e-12)
    assert far - near == pytest.approx(
        (2 * t - d + offset * math.cos(beta)) * (math.tan(beta + theta) - math.tan(beta - theta)),
        rel=1e-12,
    )


def test_far_field_cone_edge_at_or_past_the_surface_has_no_footprint():
    # Geometry: an edge at 80 + 13 = 93 degrees from the normal heads up into the wedge.
    near, far, near_path, far_path = cone_footprint(
        0.010, math.radians(80), math.radians(13), 0.008
    )
    assert far is None and far_path is None
    assert near is not None and near_path is not None
