"""The field of an element radiating through a flat interface (beamspread.field.interface).

Every check is against something outside the module: closed forms of the
Rayleigh integral on the axis (the flat piston; O'Neil's spherical cap), an
independent Fermat search by scipy's bounded minimiser, a ray-tube area traced
numerically in the test, and a brute-force midpoint sum over the face with its
own rays.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from scipy.optimize import minimize_scalar

from beamspread.coupling.transmission import Side, plane_wave_coefficients
from beamspread.errors import InputError
from beamspread.field.engine import field_amplitude
from beamspread.field.interface import Crossing, crossing_amplitude, crossing_pressure
from beamspread.probes import Disc, Rectangle

ACRYLIC, STEEL_L, STEEL_S, WATER = 2730.0, 5920.0, 3230.0, 1480.0  # m/s, handbook round values


def _db(a, b):
    return 20.0 * np.log10(np.abs(a) / np.abs(b))


def test_flat_disc_on_axis_is_the_closed_form_piston():
    # Kinsler & Frey, on-axis pressure of a baffled piston:
    # |p| / (rho c U0) = 2 |sin(k/2 (sqrt(z^2 + a^2) - z))|.
    disc = Disc(0.010, 2e6)
    crossing = Crossing(disc, WATER, WATER, 0.0, 0.020)
    z = np.array([0.005, 0.012, 0.030, 0.060])
    k = 2 * math.pi * disc.frequency / WATER
    d = z + 0.020
    expected = 2 * np.abs(np.sin(0.5 * k * (np.sqrt(d * d + 0.005**2) - d)))
    got = crossing_pressure(crossing, np.c_[0 * z, 0 * z, z], [k])[:, 0]
    np.testing.assert_allclose(np.abs(got), expected, rtol=1e-7, atol=1e-9)


def test_spherical_cap_on_axis_is_oneils_closed_form():
    # O'Neil (1949): on the axis of a spherical cap of radius of curvature R,
    # |p| / (rho c U0) = 2 |sin(k (r_e - z) / 2)| / |1 - z / R|, z from the apex,
    # r_e the distance to the cap's rim (exact for the Rayleigh integral over the cap).
    disc = Disc(0.0127, 5e6, focus=0.050)
    path = 0.020
    crossing = Crossing(disc, WATER, WATER, 0.0, path)
    z_part = np.array([0.010, 0.025, 0.029, 0.040])
    z = z_part + path  # from the apex
    a, big_r = 0.5 * disc.diameter, disc.focus
    h = big_r - math.sqrt(big_r * big_r - a * a)
    r_e = np.sqrt((z - h) ** 2 + a * a)
    k = 2 * math.pi * disc.frequency / WATER
    expected = 2 * np.abs(np.sin(0.5 * k * (r_e - z))) / np.abs(1 - z / big_r)
    got = crossing_pressure(crossing, np.c_[0 * z, 0 * z, z_part], [k])[:, 0]
    np.testing.assert_allclose(np.abs(got), expected, rtol=2e-6)


def _fermat(source, target, c1, c2):
    """The least-time crossing point on z = 0, by scipy's bounded minimiser along the plane
    of incidence (an independent search)."""
    horizontal = target[:2] - source[:2]
    d = float(np.hypot(*horizontal))
    h1, h2 = -source[2], target[2]

    def time(x):
        return math.hypot(x, h1) / c1 + math.hypot(d - x, h2) / c2

    best = minimize_scalar(time, bounds=(0.0, d), method="bounded", options={"xatol": 1e-13})
    return best.fun, math.atan2(best.x, h1)


def test_rays_take_the_least_time_path():
    crossing = Crossing(Disc(0.0127, 5e6), ACRYLIC, STEEL_S, math.radians(50.0), 0.015)
    rng = np.random.default_rng(7)
    sources = crossing.centre + rng.uniform(-0.006, 0.006, (5, 3)) * [1, 1, 0.3]
    targets = np.c_[
        rng.uniform(-0.01, 0.05, 6), rng.uniform(-0.01, 0.01, 6), rng.uniform(0.002, 0.05, 6)
    ]
    delay, _, incident = crossing.rays(sources, targets)
    for i, t in enumerate(targets):
        for j, s in enumerate(sources):
            time, angle = _fermat(s, t, ACRYLIC, STEEL_S)
            assert delay[i, j] == pytest.approx(time, rel=1e-9)
            assert incident[i, j] == pytest.approx(angle, abs=2e-6)


def _refract(direction, n):
    """Snell's law in vector form at the plane z = 0 (normal +z), n = c2 / c1."""
    cos1 = direction[2]
    tangential = direction - cos1 * np.array([0.0, 0.0, 1.0])
    t = n * tangential
    return t + math.sqrt(1.0 - t @ t) * np.array([0.0, 0.0, 1.0])


def _tube_spreading(source, direction, r2, c1, c2, step=1e-7):
    """|p| / |T| at a distance r2 past the surface along a ray, from the area of a traced ray
    tube: p = T (1 / r1) sqrt(A_surface / A_target), the areas normal to the transmitted ray."""
    n = c2 / c1

    def trace(u):
        u = u / np.linalg.norm(u)
        r1 = -source[2] / u[2]
        hit = source + r1 * u
        v = _refract(u, n)
        return r1, hit, hit + r2 * v, v

    r1, hit, end, v = trace(direction)
    e1 = np.cross(direction, [0.0, 1.0, 0.0])
    e1 /= np.linalg.norm(e1)
    e2 = np.cross(direction, e1)
    areas = []
    for at in (1, 2):
        legs = []
        for e in (e1, e2):
            moved = trace(direction + step * e)[at]
            leg = moved - (hit if at == 1 else end)
            legs.append(leg - (leg @ v) * v)  # the tube's section normal to the ray
        areas.append(np.linalg.norm(np.cross(*legs)))
    return (1.0 / r1) * math.sqrt(areas[0] / areas[1]), end


@pytest.mark.parametrize("upper,lower", [(ACRYLIC, STEEL_S), (ACRYLIC, STEEL_L), (WATER, STEEL_L)])
def test_ray_spreading_is_the_traced_ray_tube(upper, lower):
    crossing = Crossing(Disc(0.010, 5e6), upper, lower, math.radians(20.0), 0.02)
    source = crossing.centre + np.array([0.001, 0.002, 0.0])
    for theta, phi in [(0.05, 0.3), (0.2, 1.1), (0.25, -2.0)]:
        direction = np.array(
            [math.sin(theta) * math.cos(phi), math.sin(theta) * math.sin(phi), math.cos(theta)]
        )
        expected, end = _tube_spreading(source, direction, 0.03, upper, lower)
        _, amplitude, _ = crossing.rays(source[None, :], end[None, :])
        assert amplitude[0, 0] == pytest.approx(expected, rel=1e-5)


def _brute_pressure(element_half, centre, incidence, points, k1, c1, c2, transmission, m=160):
    """A midpoint sum over a rectangle's face, rays by bisection (apart from the module)."""
    a = incidence
    u_axis = np.array([math.cos(a), 0.0, -math.sin(a)])
    v_axis = np.array([0.0, 1.0, 0.0])
    hu, hv = element_half
    cu = (np.arange(m) + 0.5) / m * 2 * hu - hu
    cv = (np.arange(m) + 0.5) / m * 2 * hv - hv
    area = (2 * hu / m) * (2 * hv / m)
    sources = centre + cu[:, None, None] * u_axis + cv[None, :, None] * v_axis
    sources = sources.reshape(-1, 3)
    n = c2 / c1
    out = []
    for t in points:
        d_vec = t[:2] - sources[:, :2]
        d = np.hypot(d_vec[:, 0], d_vec[:, 1])
        h1, h2 = -sources[:, 2], t[2]
        # Snell's law by bisection on x, the horizontal run in the upper medium.
        lo, hi = np.zeros_like(d), d.copy()
        for _ in range(80):
            x = 0.5 * (lo + hi)
            s1 = x / np.hypot(x, h1)
            s2 = (d - x) / np.hypot(d - x, h2)
            too_far = s1 * n > s2
            hi = np.where(too_far, x, hi)
            lo = np.where(too_far, lo, x)
        x = 0.5 * (lo + hi)
        r1, r2 = np.hypot(x, h1), np.hypot(d - x, h2)
        cos1, cos2 = h1 / r1, h2 / r2
        # Schmerr's spreading of a point source through a plane interface, written out here.
        spread = 1 / np.sqrt((r1 + r2 * n) * (r1 + r2 * n * cos1**2 / cos2**2))
        phase = k1 * (r1 + r2 / n)
        tr = transmission(np.arccos(cos1))
        out.append((-1j * k1 / (2 * math.pi)) * np.sum(tr * spread * np.exp(1j * phase)) * area)
    return np.array(out)


def test_rectangle_on_a_wedge_matches_a_brute_force_sum():
    upper, lower = Side(1190.0, ACRYLIC), Side(7850.0, STEEL_L, STEEL_S)
    incidence = math.radians(39.0)

    def transmission(theta):
        return plane_wave_coefficients(theta, upper, lower).stress["transmitted shear"]

    element = Rectangle(0.010, 0.008, 2.25e6)
    crossing = Crossing(element, ACRYLIC, STEEL_S, incidence, 0.012, transmission)
    beta = crossing.refracted
    paths = np.array([0.010, 0.025, 0.040])
    on_axis = np.c_[paths * math.sin(beta), 0 * paths, paths * math.cos(beta)]
    off = on_axis + np.array([0.002, 0.0015, 0.001])
    points = np.vstack([on_axis, off])
    k1 = 2 * math.pi * element.frequency / ACRYLIC
    got = crossing_pressure(crossing, points, [k1])[:, 0]
    brute = _brute_pressure(
        (0.005, 0.004), crossing.centre, incidence, points, k1, ACRYLIC, STEEL_S, transmission
    )
    # The midpoint rule's error falls as 1/m^2 (measured: 2.1e-3, 5.3e-4, 1.3e-4 dB at
    # m = 80, 160, 320 cells a side): the module agrees with the brute force's limit.
    assert np.max(np.abs(_db(got, brute))) < 1e-3
    assert np.max(np.abs(np.angle(got / brute))) < 2e-3


@pytest.mark.parametrize("element", [Disc(0.0127, 5e6), Rectangle(0.014, 0.010, 4e6)])
@pytest.mark.parametrize("bandwidth,mode", [(0.0, "one-way"), (0.6, "pulse-echo")])
def test_one_medium_limit_is_the_contact_engine(element, bandwidth, mode):
    # c2 = c1 and T = 1: the crossing is the element in one medium, whose field the
    # contact engine computes by the Fast Nearfield Method (a different quadrature).
    path = 0.01
    crossing = Crossing(element, STEEL_L, STEEL_L, 0.0, path)
    x = np.array([0.0, 0.002, 0.004, 0.001])
    y = np.array([0.0, 0.0, 0.003, -0.002])
    z = np.array([0.005, 0.02, 0.03, 0.05])
    got = crossing_amplitude(crossing, np.c_[x, y, z], bandwidth=bandwidth, mode=mode)
    expected = field_amplitude(element, STEEL_L, x, y, z + path, bandwidth=bandwidth, mode=mode)
    assert np.max(np.abs(_db(got, expected))) < 1e-4


def test_the_field_is_mirror_symmetric_about_the_incidence_plane():
    crossing = Crossing(Rectangle(0.012, 0.010, 2.25e6), ACRYLIC, STEEL_S, math.radians(45.0), 0.01)
    points = np.array([[0.01, 0.003, 0.012], [0.02, 0.004, 0.02]])
    mirrored = points * [1, -1, 1]
    k = 2 * math.pi * 2.25e6 / ACRYLIC
    a = crossing_pressure(crossing, points, [k])
    b = crossing_pressure(crossing, mirrored, [k])
    np.testing.assert_allclose(a, b, rtol=1e-10)


def test_bad_input_is_refused_with_one_line():
    with pytest.raises(InputError, match="incidence"):
        Crossing(Disc(0.01, 5e6), ACRYLIC, STEEL_S, math.radians(95), 0.01)
    crossing = Crossing(Disc(0.01, 5e6), ACRYLIC, STEEL_S, 0.3, 0.01)
    with pytest.raises(InputError, match="in the part"):
        crossing_pressure(crossing, [[0.0, 0.0, -0.01]], [1000.0])
    with pytest.raises(InputError, match="focus"):
        Crossing(Disc(0.01, 5e6, focus=0.004), ACRYLIC, STEEL_S, 0.0, 0.01).nodes(1e4, 1.0)
