"""On-axis field and near-field length, against closed forms and brute-force integration."""

from __future__ import annotations

import itertools
import math

import numpy as np
import pytest
import scipy.integrate
import scipy.optimize

from beamspread import (
    Rectangle,
    analyse,
    disc_axial_pressure,
    disc_near_field,
    rectangle_axial_pressure,
    rectangle_near_field,
)

LAM = 5920.0 / 5e6  # 10 mm, 5 MHz in the ISO 22232-2 reference steel


def kinsler_frey(z, diameter, lam):
    """Kinsler & Frey, Fundamentals of Acoustics: |p|/(rho c U0) = 2|sin(k/2 (sqrt(z^2+a^2)-z))|."""
    a = diameter / 2
    k = 2 * math.pi / lam
    return 2 * np.abs(np.sin(k / 2 * (np.sqrt(z * z + a * a) - z)))


def test_disc_axis_matches_kinsler_frey():
    z = np.geomspace(1e-4, 0.5, 2000)
    assert np.allclose(
        disc_axial_pressure(z, 0.010, LAM), kinsler_frey(z, 0.010, LAM), rtol=0, atol=1e-9
    )


@pytest.mark.parametrize("m", [0, 1, 2, 3])
def test_disc_axis_maxima_and_zeros_where_kinsler_frey_put_them(m):
    # Kinsler & Frey: maxima at (a^2 - ((m+1/2) lambda)^2) / ((2m+1) lambda), zeros at
    # (a^2 - n^2 lambda^2) / (2 n lambda).
    a = 0.005
    z_max = (a * a - ((m + 0.5) * LAM) ** 2) / ((2 * m + 1) * LAM)
    n = m + 1
    z_zero = (a * a - (n * LAM) ** 2) / (2 * n * LAM)
    assert float(disc_axial_pressure(z_max, 0.010, LAM)) == pytest.approx(2.0, abs=1e-12)
    assert float(disc_axial_pressure(z_zero, 0.010, LAM)) == pytest.approx(0.0, abs=1e-12)


def test_disc_near_field_is_the_last_maximum():
    # (D^2 - lambda^2)/(4 lambda) is the m = 0 maximum of Kinsler & Frey's closed form.
    found = scipy.optimize.minimize_scalar(
        lambda z: -kinsler_frey(z, 0.010, LAM),
        bounds=(0.015, 0.03),
        method="bounded",
        options={"xatol": 1e-12},
    )
    assert float(disc_near_field(0.010, LAM)) == pytest.approx(found.x, rel=1e-7)
    assert math.isnan(float(disc_near_field(0.001, LAM)))  # D < lambda: no maximum


def rayleigh_brute_force(z, length, width, lam):
    """|p|/(rho c U0) on axis from the 2-D Rayleigh integral, scipy.integrate.dblquad.

    p = (i k rho c U0 / 2 pi) * integral of exp(-i k R)/R over the face (a quarter, x4).
    """
    k = 2 * math.pi / lam
    a, b = length / 2, width / 2

    def part(f):
        return scipy.integrate.dblquad(
            lambda y, x: f(k * math.sqrt(x * x + y * y + z * z)) / math.sqrt(x * x + y * y + z * z),
            0,
            a,
            0,
            b,
            epsabs=1e-11,
            epsrel=1e-11,
        )[0]

    re = part(math.cos)
    im = part(math.sin)
    return 4 * k / (2 * math.pi) * math.hypot(re, im)


@pytest.mark.parametrize(
    ("length", "width", "z"),
    [
        (0.010, 0.010, 0.005),
        (0.010, 0.010, 0.0285),
        (0.010, 0.010, 0.08),
        (0.020, 0.005, 0.02),
        (0.020, 0.005, 0.09),
        (0.003, 0.002, 0.001),
    ],
)
def test_rectangle_axis_matches_brute_force_rayleigh(length, width, z):
    ours = float(rectangle_axial_pressure(z, length, width, LAM))
    assert ours == pytest.approx(rayleigh_brute_force(z, length, width, LAM), rel=1e-7)


def radial_form(z, length, width, lam):
    """The on-axis integral over the radius (an independent 1-D form), scipy.integrate.quad.

    |p| = (k / 2 pi) |integral_z^Rc Theta(r(R)) exp(-i k R) dR|, Theta the angle of the
    circle of radius r that lies on the face, r = sqrt(R^2 - z^2).
    """
    a, b = max(length, width) / 2, min(length, width) / 2
    k = 2 * math.pi / lam

    def theta(big_r):
        r = math.sqrt(max(big_r * big_r - z * z, 0.0))
        if r <= b:
            return 2 * math.pi
        if r <= a:
            return 4 * math.asin(b / r)
        return 4 * (math.asin(b / r) - math.acos(a / r))

    ends = [z, math.hypot(z, b), math.hypot(z, a), math.hypot(z, math.hypot(a, b))]
    re = im = 0.0
    for lo, hi in itertools.pairwise(ends):
        re += scipy.integrate.quad(
            lambda x: theta(x) * math.cos(k * x), lo, hi, limit=400, epsabs=1e-13
        )[0]
        im += scipy.integrate.quad(
            lambda x: theta(x) * math.sin(k * x), lo, hi, limit=400, epsabs=1e-13
        )[0]
    return k / (2 * math.pi) * math.hypot(re, im)


@pytest.mark.parametrize(
    ("length", "width"),
    [
        (0.010, 0.010),
        (0.020, 0.010),
        (0.020, 0.004),
        (0.006, 0.012),
    ],
)
def test_rectangle_last_maximum_against_brute_force(length, width):
    # Reference: the farthest maximum of the radius form integrated by scipy.integrate.quad,
    # located by scipy.optimize.minimize_scalar around our value (and checked on a coarse
    # independent scan that no later maximum exists).
    ours = rectangle_near_field(length, width, LAM)
    zs = np.linspace(0.5 * ours, 3.0 * ours, 60)
    values = np.array([radial_form(z, length, width, LAM) for z in zs])
    peak = int(np.argmax(values))
    assert np.all(np.diff(values[peak:]) < 0)  # monotone beyond the maximum
    found = scipy.optimize.minimize_scalar(
        lambda z: -radial_form(z, length, width, LAM),
        bounds=(zs[max(peak - 1, 0)], zs[min(peak + 1, len(zs) - 1)]),
        method="bounded",
        options={"xatol": 1e-9},
    )
    assert ours == pytest.approx(found.x, rel=1e-5)


def test_square_factor_about_1_37():
    # Common practice: a square element's near field is about 1.37 x L^2/(4 lambda)
    # (for an element large against the wavelength).
    lam = 0.01 / 200
    n = rectangle_near_field(0.01, 0.01, lam)
    assert round(n / (0.01**2 / (4 * lam)), 2) == 1.37


def test_long_rectangle_factor_about_1():
    # Common practice: for a side ratio of 0.5 and below, k is about 1.0 (L the longer side).
    lam = 0.02 / 100
    n = rectangle_near_field(0.02, 0.005, lam)
    assert n / (0.02**2 / (4 * lam)) == pytest.approx(1.0, abs=0.02)


def test_rectangle_result_reports_factor_and_longer_side():
    r = analyse(Rectangle(0.010, 0.020, 5e6), 5920.0)
    assert r.near_field_simple == pytest.approx(0.020**2 / (4 * LAM))
    assert r.near_field_factor == pytest.approx(r.near_field / r.near_field_simple)
    assert [p.name for p in r.planes] == ["length", "width"]


def test_tiny_rectangle_has_no_near_field():
    # Smaller than a wavelength on both sides: the on-axis field only falls (radius form).
    r = analyse(Rectangle(0.0008, 0.0005, 5e6), 5920.0, depths=[0.01])
    assert r.near_field is None and r.near_field_factor is None
    assert any("no near field" in w for w in r.warnings)
    z = np.geomspace(1e-5, 0.01, 50)
    values = [radial_form(zi, 0.0008, 0.0005, LAM) for zi in z]
    assert np.all(np.diff(values) < 0)
