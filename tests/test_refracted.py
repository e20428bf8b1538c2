"""The far-field lobe of a beam refracted through a flat interface (beamspread.field.refracted).

Checked against the field itself far away: the Rayleigh integral over the element with
each point source's Fermat ray through the interface (beamspread.field.interface, itself
checked against a brute-force face sum in test_interface_field), evaluated 32 m from the
exit point, and its -6 dB edges found here by scipy's brentq. In one medium the lobe is the
piston's (scipy.special's Bessel zeros; Krautkramer's 0.51 lambda/D at -6 dB pulse-echo).
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from scipy.optimize import brentq
from scipy.special import j1

from beamspread.coupling.transmission import Side, plane_wave_coefficients
from beamspread.errors import InputError
from beamspread.field.interface import Crossing, crossing_pressure
from beamspread.field.refracted import refracted_lobe, refracted_pattern
from beamspread.probes import Disc, Rectangle

ACRYLIC, STEEL_L, STEEL_S = 2730.0, 5920.0, 3255.0  # m/s, handbook round values
FAR = 32.0  # m from the exit point: the far-field limit is reached as 1/FAR


def _wedge(element, refracted_deg):
    upper, lower = Side(1190.0, ACRYLIC), Side(7850.0, STEEL_L, STEEL_S)

    def transmission(theta):
        return plane_wave_coefficients(theta, upper, lower).stress["transmitted shear"]

    incidence = math.asin(math.sin(math.radians(refracted_deg)) * ACRYLIC / STEEL_S)
    return Crossing(element, ACRYLIC, STEEL_S, incidence, 0.010, transmission)


def _far_field(crossing, angles):
    angles = np.atleast_1d(angles)
    points = np.c_[FAR * np.sin(angles), 0 * angles, FAR * np.cos(angles)]
    k = 2 * math.pi * crossing.element.frequency / crossing.upper_speed
    return np.abs(crossing_pressure(crossing, points, [k])[:, 0])


@pytest.mark.parametrize("refracted", [45.0, 60.0, 70.0])
def test_pattern_is_the_field_far_away(refracted):
    crossing = _wedge(Disc(0.0127, 2.25e6), refracted)
    beta = crossing.refracted
    angles = beta + np.radians(np.linspace(-6.0, 6.0, 13))
    angles = angles[angles < math.radians(89.0)]
    field = _far_field(crossing, angles)
    pattern = refracted_pattern(crossing, angles)
    ratio_db = 20 * np.log10((field / field[6]) / (pattern / pattern[6]))
    # Measured at 45 deg: 0.042, 0.011, 0.0026 dB at 2, 8 and 32 m (falling as 1/distance).
    assert np.max(np.abs(ratio_db)) < 0.005


@pytest.mark.parametrize("element", [Disc(0.0127, 2.25e6), Rectangle(0.020, 0.022, 2.25e6)])
@pytest.mark.parametrize("refracted", [45.0, 60.0, 70.0])
def test_lobe_edges_are_the_far_fields_edges(element, refracted):
    crossing = _wedge(element, refracted)
    lobe = refracted_lobe(crossing, 6.0, "pulse-echo")
    peak_field = _far_field(crossing, lobe.peak)[0]

    def down(theta):  # pulse-echo: the one-way field squared, 6 dB down
        return (_far_field(crossing, theta)[0] / peak_field) ** 2 - 10 ** (-6 / 20)

    near = brentq(down, lobe.peak - math.radians(15), lobe.peak, xtol=1e-9)
    far_end = min(lobe.peak + math.radians(15), math.radians(89.9))
    far = brentq(down, lobe.peak, far_end, xtol=1e-9)
    assert math.degrees(lobe.toward_normal) == pytest.approx(
        math.degrees(lobe.refracted - near), abs=0.02
    )
    assert math.degrees(lobe.away) == pytest.approx(math.degrees(far - lobe.refracted), abs=0.02)
    # The field's peak leans toward the normal (obliquity and transmission grow there).
    assert lobe.tilt < 0


def test_in_one_medium_the_lobe_is_the_pistons():
    # Kinsler & Frey's piston pattern 2 J1(x)/x; -6 dB pulse-echo is -3 dB one-way:
    # solve 2 J1(x)/x = 10^(-3/20) with scipy's J1, sin(theta) = x lambda / (pi D).
    disc = Disc(0.010, 5e6)
    crossing = Crossing(disc, STEEL_L, STEEL_L, 0.0, 0.01)
    lobe = refracted_lobe(crossing, 6.0, "pulse-echo")
    x = brentq(lambda x: 2 * j1(x) / x - 10 ** (-3 / 20), 0.1, 3.8)
    expected = math.asin(x * (STEEL_L / 5e6) / (math.pi * 0.010))
    assert lobe.toward_normal == pytest.approx(expected, rel=1e-7)
    assert lobe.away == pytest.approx(expected, rel=1e-7)
    assert lobe.tilt == pytest.approx(0.0, abs=1e-7)
    # Krautkramer's echo-field constant: sin(theta_-6dB) = 0.51 lambda / D (common practice).
    assert math.sin(expected) * 0.010 / (STEEL_L / 5e6) == pytest.approx(0.51, abs=0.005)


def test_a_focused_element_and_a_critical_angle_are_refused():
    with pytest.raises(InputError, match="focus"):
        refracted_lobe(Crossing(Disc(0.0127, 5e6, focus=0.05), ACRYLIC, STEEL_S, 0.3, 0.01), 6.0)
    past = Crossing(Disc(0.0127, 5e6), ACRYLIC, STEEL_S, math.radians(60.0), 0.01)
    with pytest.raises(InputError, match="critical"):
        refracted_pattern(past, [0.5])
