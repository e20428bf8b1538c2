"""Sonar figures: directivity index, beam widths, side lobes, psi, footprints, echo budget."""

from __future__ import annotations

import math

import numpy as np
import pytest
from scipy import integrate, optimize, special

from beamspread import Disc, InputError, Rectangle, analyse
from beamspread.sonar.beam_angle import equivalent_beam_angle
from beamspread.sonar.conventions import SONAR_LEVELS, SONAR_MODE
from beamspread.sonar.directivity import (
    directivity_index,
    disc_directivity_factor,
    full_angle,
    rayleigh_distance,
    rectangle_directivity_factor,
)
from beamspread.sonar.echo import echo_budget, source_level_constant
from beamspread.sonar.figures import sonar_figures
from beamspread.sonar.footprint import depth_range, footprint_width
from beamspread.sonar.side_lobes import first_side_lobe, side_lobe_level


def _exact_disc_q(ka):
    # The directivity factor of a baffled disc, written with scipy's J1:
    # Q = (ka)^2 / (1 - J1(2ka)/(ka)) (Kinsler et al., the piston chapter).
    return ka**2 / (1.0 - special.j1(2.0 * ka) / ka)


# ----------------------------------------------------------------- beam widths


@pytest.mark.parametrize("d_over_lambda", [20.0, 50.0, 100.0])
def test_minus_3_db_full_beamwidth_against_the_sonar_rule(d_over_lambda):
    # Common practice: the one-way -3 dB full beamwidth of a disc is 58.9 degrees x lambda / D
    # (small angles). The rule's last digit is rounded (+-0.05 in 58.9, 0.085 %); the
    # small-angle error is below 0.01 % at these sizes.
    wavelength = 1e-3
    diameter = d_over_lambda * wavelength
    full = math.degrees(float(full_angle(3.0, diameter, wavelength, "disc", "one-way")))
    assert full == pytest.approx(58.9 / d_over_lambda, rel=1e-3)


def test_sonar_defaults_are_the_trades():
    # The trade quotes the one-way -3 dB beam (issue 5; common practice).
    assert SONAR_MODE == "one-way" and SONAR_LEVELS == (3.0,)


# ----------------------------------------------------------------- directivity index


@pytest.mark.parametrize("ka", [0.05, 0.3, 1.0, 2.5, 7.0, 20.0, 80.0, 300.0])
def test_disc_directivity_factor_against_scipy(ka):
    wavelength = 1e-3
    diameter = 2.0 * ka * wavelength / (2.0 * np.pi)
    assert float(disc_directivity_factor(diameter, wavelength)) == pytest.approx(
        _exact_disc_q(ka), rel=1e-10
    )


@pytest.mark.parametrize("ka", [50.0, 120.0, 400.0])
def test_disc_directivity_index_large_ka_limit(ka):
    # DI -> 20 log10(ka) for ka >> 1 (Urick, Principles of Underwater Sound; from memory):
    # J1(2ka)/(ka) falls as ka^-1.5, so the two are within 0.01 dB from ka = 50.
    wavelength = 1e-3
    probe = Disc(ka * wavelength / np.pi, 1.0)
    assert directivity_index(probe, wavelength) == pytest.approx(20.0 * math.log10(ka), abs=0.01)


def test_small_pistons_fill_the_half_space():
    # A baffled point source radiates into the half space: Q = 2, DI = 3.01 dB (common
    # practice). Here for a disc and a rectangle 1e-4 wavelengths across, where the first
    # correction, of order (ka)^2, is near 1e-7.
    assert float(disc_directivity_factor(1e-7, 1e-3)) == pytest.approx(2.0, rel=1e-6)
    assert rectangle_directivity_factor(1e-7, 1e-7, 1e-3) == pytest.approx(2.0, rel=1e-6)


@pytest.mark.parametrize(("length", "width"), [(0.05, 0.05), (0.2, 0.02), (0.1, 0.07)])
def test_rectangle_large_aperture_limit(length, width):
    # Common practice: DI = 10 log10(4 pi A / lambda^2) for a face large against the
    # wavelength (here at least 20 wavelengths a side): within 0.01 dB.
    wavelength = 1e-3
    di = directivity_index(Rectangle(length, width, 1.0), wavelength)
    assert di == pytest.approx(
        10.0 * math.log10(4.0 * math.pi * length * width / wavelength**2), abs=0.01
    )


def _q_by_pattern_integral(pattern_sq):
    # The definition: Q = 4 pi / (integral over the front half space of D^2 dOmega), D = 1 on
    # the axis, integrated by scipy over the polar angle and azimuth.
    value, _ = integrate.dblquad(
        lambda theta, phi: pattern_sq(theta, phi) * np.sin(theta),
        0.0,
        2.0 * np.pi,
        0.0,
        np.pi / 2.0,
        epsabs=1e-12,
        epsrel=1e-10,
    )
    return 4.0 * np.pi / value


@pytest.mark.parametrize(("length", "width"), [(1.0, 1.0), (3.0, 2.0), (0.4, 2.5)])
def test_rectangle_directivity_against_the_pattern_integral(length, width):
    # Two independent routes to Q: our radiation-resistance integral, and scipy's quadrature
    # of the far-field pattern sinc(k L u / 2) sinc(k W v / 2) over the half space.
    wavelength = 1.0
    k = 2.0 * np.pi

    def pattern_sq(theta, phi):
        u, v = np.sin(theta) * np.cos(phi), np.sin(theta) * np.sin(phi)
        return (np.sinc(k * length * u / (2 * np.pi)) * np.sinc(k * width * v / (2 * np.pi))) ** 2

    assert rectangle_directivity_factor(length, width, wavelength) == pytest.approx(
        _q_by_pattern_integral(pattern_sq), rel=1e-7
    )


@pytest.mark.parametrize("ka", [0.5, 2.0, 6.0])
def test_disc_directivity_against_the_pattern_integral(ka):
    # The exact Q of a disc equals 4 pi over the half-space integral of (2 J1(x)/x)^2,
    # x = ka sin(theta) (scipy quadrature of the definition).
    def pattern_sq(theta, phi):
        x = ka * np.sin(theta)
        return 1.0 if x == 0 else (2.0 * special.j1(x) / x) ** 2

    assert _exact_disc_q(ka) == pytest.approx(_q_by_pattern_integral(pattern_sq), rel=1e-7)


def test_rayleigh_distance_of_a_disc():
    # Kinsler et al.: the Rayleigh distance is A / lambda = pi a^2 / lambda (from memory),
    # pi times the near-field length D^2 / (4 lambda).
    probe, wavelength = Disc(0.025, 200e3), 1500.0 / 200e3
    assert rayleigh_distance(probe, wavelength) == pytest.approx(
        math.pi * 0.0125**2 / wavelength, rel=1e-14
    )


# ----------------------------------------------------------------- side lobes


def test_disc_first_side_lobe_against_scipy():
    # d/dx [J1(x)/x] = -J2(x)/x, so the first side lobe of 2 J1(x)/x sits at the first zero of
    # J2 (scipy.special.jn_zeros). Its one-way level is -17.57 dB (computed here from the
    # pattern; UT texts quote -17.6 dB).
    x = special.jn_zeros(2, 1)[0]
    level = 20.0 * math.log10(abs(2.0 * special.j1(x) / x))
    assert side_lobe_level("disc", "one-way") == pytest.approx(level, abs=1e-6)
    assert level == pytest.approx(-17.57, abs=0.005)
    assert side_lobe_level("disc", "pulse-echo") == pytest.approx(2 * level, abs=2e-6)


def test_rectangle_first_side_lobe_against_scipy():
    # sin(x)/x has its first side lobe where tan x = x, between pi and 3 pi / 2 (scipy brentq
    # on sin x - x cos x). Its level is -13.26 dB.
    x = optimize.brentq(lambda t: math.sin(t) - t * math.cos(t), math.pi + 0.1, 1.5 * math.pi)
    level = 20.0 * math.log10(abs(math.sin(x) / x))
    assert side_lobe_level("side", "one-way") == pytest.approx(level, abs=1e-6)
    assert level == pytest.approx(-13.26, abs=0.005)


def test_side_lobe_angle_and_its_absence():
    # The lobe lies at sin(theta) = x lambda / (pi D) with x = j(2,1) (scipy); a disc of one
    # wavelength has it beyond 90 degrees.
    x = special.jn_zeros(2, 1)[0]
    lobe = first_side_lobe(0.01, 0.001, "disc")
    assert lobe.angle_deg == pytest.approx(math.degrees(math.asin(x * 0.1 / math.pi)), rel=1e-9)
    none = first_side_lobe(0.001, 0.001, "disc")  # x = 5.136 needs D > 1.63 lambda
    assert none.angle_deg is None and none.level_db is None


# ----------------------------------------------------------------- equivalent beam angle


def _psi_disc_scipy(ka):
    # Urick's equivalent two-way beam angle: psi = integral of b^2 dOmega over the half space,
    # b = (2 J1(x)/x)^2 the one-way intensity pattern (scipy quadrature).
    def f(theta):
        x = ka * np.sin(theta)
        d = 1.0 if x == 0 else 2.0 * special.j1(x) / x
        return d**4 * np.sin(theta)

    value, _ = integrate.quad(f, 0.0, np.pi / 2.0, limit=2000, epsabs=1e-14, epsrel=1e-11)
    return 2.0 * np.pi * value


@pytest.mark.parametrize("ka", [1.0, 5.0, 30.0])
def test_equivalent_beam_angle_of_a_disc_against_scipy(ka):
    wavelength = 1e-3
    probe = Disc(ka * wavelength / np.pi, 1.0)
    assert equivalent_beam_angle(probe, wavelength) == pytest.approx(_psi_disc_scipy(ka), rel=1e-7)


def test_equivalent_beam_angle_large_disc_constant():
    # For ka >> 1, psi (ka)^2 -> 2 pi * integral_0^inf (2 J1(x)/x)^4 x dx, quoted as 5.78
    # (Urick's table; from memory). The integral by scipy, and our psi at ka = 300.
    value, _ = integrate.quad(
        lambda x: (2.0 * special.j1(x) / x) ** 4 * x, 1e-12, np.inf, limit=5000
    )
    constant = 2.0 * np.pi * value
    assert constant == pytest.approx(5.78, abs=0.005)
    ka = 300.0
    psi = equivalent_beam_angle(Disc(ka * 1e-3 / np.pi, 1.0), 1e-3)
    assert psi * ka**2 == pytest.approx(constant, rel=1e-3)  # the (ka)^-2 correction is ~1e-5


def test_equivalent_beam_angle_large_rectangle():
    # For a large face psi -> (integral of sinc^4)^2 lambda^2 / (L W), the integral being
    # 2/3 (scipy quadrature of (sin(pi t)/(pi t))^4 over the line).
    value, _ = integrate.quad(lambda t: np.sinc(t) ** 4, -np.inf, np.inf, limit=5000)
    length, width, wavelength = 0.2, 0.1, 1e-3
    psi = equivalent_beam_angle(Rectangle(length, width, 1.0), wavelength)
    assert psi == pytest.approx(value**2 * wavelength**2 / (length * width), rel=1e-3)


# ----------------------------------------------------------------- footprints


def test_footprint_is_the_cone_on_a_flat_bottom():
    # Geometry: a cone of half-angle theta meets a flat bottom at depth D in a circle of
    # diameter 2 D tan(theta): 45 degrees at 10 m gives 20 m; 30 degrees gives 20/sqrt(3) m.
    assert float(footprint_width(10.0, math.radians(45.0))) == pytest.approx(20.0)
    assert float(footprint_width(10.0, math.radians(30.0))) == pytest.approx(20.0 / math.sqrt(3.0))


def test_sonar_figures_of_an_analysed_beam():
    # A 25 mm disc at 200 kHz in water, the one-way -3 dB beam: its footprint at 30 m is
    # 2 x 30 m x tan(half-angle) (geometry), the half-angle from sin(theta) = x lambda/(pi D)
    # with x the -3 dB argument of 2 J1(x)/x (scipy brentq).
    wavelength = 1500.0 / 200e3
    result = analyse(Disc(0.025, 200e3), 1500.0, levels=[3, 10], mode="one-way")
    figures = sonar_figures(result, bottom_depths=[5.0, 30.0])
    x = optimize.brentq(lambda t: 2 * special.j1(t) / t - 10 ** (-3 / 20), 0.5, 3.0)
    half = math.asin(x * wavelength / (math.pi * 0.025))
    assert figures.full_angles["diameter"]["-3"] == pytest.approx(2 * math.degrees(half))
    deep = [f for f in figures.footprints if f.depth == 30.0 and f.level_db == -3.0]
    assert deep[0].width == pytest.approx(2 * 30.0 * math.tan(half), rel=1e-9)
    assert len(figures.footprints) == 4 and not deep[0].inside_near_field
    assert figures.directivity_index_db == pytest.approx(
        10 * math.log10(_exact_disc_q(math.pi * 0.025 / wavelength))
    )
    assert figures.side_lobes[0].level_db == pytest.approx(-17.57, abs=0.005)
    with pytest.raises(InputError):
        sonar_figures(result, bottom_depths=[-1.0])


def test_depth_range():
    assert depth_range(5.0, 20.0, 5.0) == (5.0, 10.0, 15.0, 20.0)
    assert depth_range(1.0, 1.95, 0.5) == (1.0, 1.5)
    with pytest.raises(InputError):
        depth_range(10.0, 5.0, 1.0)
    with pytest.raises(InputError):
        depth_range(1.0, 1e6, 1.0)


# ----------------------------------------------------------------- echo budget


def test_source_level_constant():
    # The common sonar-equation form SL = 170.8 + 10 log10 P + ... is 10 log10(rho c 1e12 /
    # 4 pi) for seawater's rho c of about 1.5 MRayl (common practice).
    assert source_level_constant(1.5e6) == pytest.approx(170.8, abs=0.05)


def test_echo_budget_terms():
    # The sonar equation term by term: SL = 170.8 + 10 log P + 10 log eta + DI (the common
    # sonar-equation form); a flat bottom as a mirror, so spherical spreading to the image source
    # at 2R, 20 log 2R (method of images, Kinsler & Frey, reflection at a plane boundary; from
    # memory); two-way absorption 2 alpha R.
    budget = echo_budget(
        power=250.0,
        efficiency=0.4,
        directivity_index_db=18.0,
        range_m=60.0,
        absorption_db_per_km=40.0,
        bottom_loss_db=12.0,
    )
    sl = 170.8 + 10 * math.log10(250.0) + 10 * math.log10(0.4) + 18.0
    assert budget.source_level.value_db == pytest.approx(sl)
    assert budget.spreading_loss.value_db == pytest.approx(20 * math.log10(120.0))
    assert budget.absorption_loss.value_db == pytest.approx(2 * 40.0 * 0.060)
    assert budget.received_level.value_db == pytest.approx(
        sl - 20 * math.log10(120.0) - 2 * 40.0 * 0.060 - 12.0
    )
    assert [t.name for t in budget.terms] == [
        "source level",
        "two-way spreading loss",
        "two-way absorption loss",
        "bottom reflection loss",
        "received echo level",
    ]
    assert "1 uPa at 1 m" in budget.source_level.reference


@pytest.mark.parametrize(
    "bad",
    [
        dict(efficiency=1.5),
        dict(efficiency=0.0),
        dict(power=0.0),
        dict(range_m=0.5),
        dict(bottom_loss_db=-1.0),
    ],
)
def test_echo_budget_refuses_nonsense(bad):
    kwargs = dict(power=100.0, efficiency=0.5, directivity_index_db=20.0, range_m=50.0)
    kwargs.update(bad)
    with pytest.raises(InputError):
        echo_budget(**kwargs)
