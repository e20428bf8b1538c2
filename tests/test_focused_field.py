"""The computed field of a focused element (beamspread.field.focused) and its use in ``beam``.

Each check names the reference outside the project it is held to: O'Neil's (1949) on-axis
pressure of a focused disc (exact, and its paraxial form), the focal-plane patterns 2 J1(x)/x
and sin(u)/u with scipy, the Fresnel integrals (scipy.special.fresnel) for the cylindrical
focus, scipy's J0 for the Bessel function, and for F -> infinity the exact field of the flat
element (the Fast Nearfield Method, itself checked against Kinsler & Frey and a brute-force
Rayleigh sum in test_field.py).
"""

from __future__ import annotations

import math

import numpy as np
import pytest
import scipy.optimize
import scipy.special

from beamspread._bessel import j0
from beamspread.field import beam_widths, focused_amplitude, focused_beam_widths, focused_pressure
from beamspread.probes import Disc, Rectangle
from beamspread.setups import focused_disc_axial_pressure, focused_rectangle_axial_pressure

C_WATER = 1482.4  # m/s, any fixed speed will do for the field checks
F0 = 5e6
LAM = C_WATER / F0
K = 2 * math.pi / LAM
DISC = Disc(0.0127, F0)
A = 0.5 * DISC.diameter
F = 0.075  # radius / F = 0.085: gentle focusing
RECT = Rectangle(0.020, 0.010, F0)
F_RECT = 0.060
# Abramowitz & Stegun 9.4.1 states |error| < 5e-8 for its J0 polynomial (|x| <= 3), and 9.4.3
# about as much for |x| > 3 (from memory); the integrals inherit at most 5e-8 of their peak.
J0_BOUND = 5e-8


def _pattern_root(pattern, power, level_db, hi):
    """x where pattern(x)**power falls to level_db below 1 (scipy brentq)."""
    return scipy.optimize.brentq(lambda x: pattern(x) ** power - 10 ** (-level_db / 20), 1e-6, hi)


def _jinc(x):
    return 2 * scipy.special.j1(x) / x


def test_j0_against_scipy():
    # Abramowitz & Stegun 9.4.1 / 9.4.3 against scipy.special.j0, within their stated 5e-8.
    x = np.concatenate([np.linspace(0, 3, 30001), np.linspace(3, 400, 400001)])
    assert np.abs(j0(x) - scipy.special.j0(x)).max() < J0_BOUND
    assert np.array_equal(j0(-x), j0(x))


def test_disc_axis_is_oneils_paraxial_form():
    # O'Neil (1949), paraxial: |p| = 2 |sin(k a^2 (1/z - 1/F) / 4)| / |1 - z/F|. On the axis
    # J0 = 1 exactly, so only the quadrature is left: agreement to rounding.
    z = np.linspace(0.2 * F, 3 * F, 1000)  # the grid misses z = F itself (0/0 in the form)
    ours = focused_pressure(DISC, C_WATER, F, [0.0], z)[:, 0]
    oneil = 2 * np.abs(np.sin(K * A * A * (1 / z - 1 / F) / 4)) / np.abs(1 - z / F)
    assert np.abs(ours - oneil).max() < 1e-12 * oneil.max()
    # at the focus itself the paraxial limit is k a^2 / 2F (O'Neil)
    at_focus = focused_pressure(DISC, C_WATER, F, [0.0], [F])[0, 0]
    assert at_focus == pytest.approx(K * A * A / (2 * F), rel=1e-12)


def test_disc_axis_against_oneils_exact_cap_within_the_paraxial_error():
    # O'Neil's exact on-axis pressure of the spherical cap (setups.focused_disc_axial_pressure)
    # has the phase (k/2)(sqrt((z - h)^2 + a^2) - z) where the paraxial one has
    # (k/2) a^2 (1/z - 1/F)/2. With eps their difference, |sin(u + eps) - sin(u)| <= |eps|
    # bounds the two amplitudes' difference by 2 |eps| / |1 - z/F| at every depth.
    z = np.linspace(0.2 * F, 3 * F, 1000)
    ours = focused_pressure(DISC, C_WATER, F, [0.0], z)[:, 0]
    exact = focused_disc_axial_pressure(z, DISC.diameter, F, LAM)
    h = F - math.sqrt(F * F - A * A)
    eps = 0.5 * K * np.abs((np.sqrt((z - h) ** 2 + A * A) - z) - 0.5 * A * A * (1 / z - 1 / F))
    assert np.all(np.abs(ours - exact) <= 2 * eps / np.abs(1 - z / F) + 1e-12 * exact.max())
    # In the focal zone (0.5 F to 1.5 F) this gentle focus (a/F = 0.085) is within 0.5 % of
    # the exact peak, and the on-axis maximum lies where O'Neil's does, short of F.
    zone = (z > 0.5 * F) & (z < 1.5 * F)
    assert np.abs(ours - exact)[zone].max() < 5e-3 * exact.max()
    assert z[np.argmax(ours)] == pytest.approx(z[np.argmax(exact)], abs=2 * (z[1] - z[0]))
    assert z[np.argmax(ours)] < F


def test_disc_focal_plane_is_the_airy_pattern():
    # O'Neil (1949), paraxial: in the focal plane |p| = (k a^2 / 2F) |2 J1(x)/x|, x = k a r / F
    # (scipy.special.j1); our J0 quadrature carries at most J0_BOUND of the peak.
    r = np.linspace(1e-9, 0.01, 2001)
    ours = focused_pressure(DISC, C_WATER, F, r, [F])[0]
    peak = K * A * A / (2 * F)
    airy = peak * np.abs(_jinc(K * A * r / F))
    assert np.abs(ours - airy).max() < J0_BOUND * peak


@pytest.mark.parametrize(
    ("level", "mode", "power"), [(6, "pulse-echo", 2), (20, "pulse-echo", 2), (6, "one-way", 1)]
)
def test_disc_focal_spot(level, mode, power):
    # The focal spot is 2 x F lambda / (pi D) with x where (2 J1(x)/x)^power falls to the level
    # (O'Neil's focal-plane pattern; x from scipy). A 5e-8 error in the amplitude moves the
    # crossing by about 1e-7 of the width.
    x = _pattern_root(_jinc, power, level, 3.8)
    expected = 2 * x * F * LAM / (math.pi * DISC.diameter)
    w = focused_beam_widths(DISC, C_WATER, F, F, [level], bandwidth=0.0, mode=mode)[0]
    assert w.width == pytest.approx(expected, rel=1e-6)


def test_pulse_echo_focal_spot_constant():
    # -6 dB pulse-echo: (2 J1(x)/x)^2 = 10^(-6/20) gives the spot 2x/pi F lambda / D = 1.027
    # F lambda / D (scipy); taking -6 dB as exactly one half would give 1.029 instead.
    x = _pattern_root(_jinc, 2, 6, 3.8)
    assert round(2 * x / math.pi, 3) == 1.027
    half = scipy.optimize.brentq(lambda u: _jinc(u) ** 2 - 0.5, 1e-6, 3.8)
    assert round(2 * half / math.pi, 3) == 1.029


def test_cylindrical_focus_axis_against_fresnel_integrals():
    # The separable Fresnel form with scipy.special.fresnel (setups.focused_rectangle_axial_
    # pressure): on the axis our quadrature has no Bessel function, so agreement to rounding.
    z = np.linspace(0.2 * F_RECT, 3 * F_RECT, 500)
    ours = focused_pressure(RECT, C_WATER, F_RECT, [0.0], z)[:, 0]
    fresnel = focused_rectangle_axial_pressure(z, RECT.length, RECT.width, F_RECT, LAM)
    assert np.abs(ours - fresnel).max() < 1e-12 * fresnel.max()


def test_cylindrical_focal_plane_is_sinc_and_its_spot():
    # In the focal plane of a cylindrical focus the length plane's pattern is sin(u)/u,
    # u = k a x / F (the Fraunhofer pattern of the slit, O'Neil's paraxial result in 1-D).
    x = np.linspace(0.0, 0.005, 1001)
    ours = focused_pressure(RECT, C_WATER, F_RECT, x, [F_RECT], plane="length")[0]
    peak = focused_rectangle_axial_pressure(
        np.array([F_RECT]), RECT.length, RECT.width, F_RECT, LAM
    )[0]
    u = K * 0.5 * RECT.length * x / F_RECT
    assert np.abs(ours - peak * np.abs(np.sinc(u / np.pi))).max() < 1e-12 * peak
    # pulse-echo -6 dB: (sin u / u)^2 = 10^(-6/20), width 2 u F lambda / (pi L) (scipy brentq)
    root = _pattern_root(lambda v: math.sin(v) / v, 2, 6, 3.0)
    w = focused_beam_widths(RECT, C_WATER, F_RECT, F_RECT, [6], bandwidth=0.0)[0]
    assert w.width == pytest.approx(2 * root * F_RECT * LAM / (math.pi * RECT.length), rel=1e-9)


# F -> infinity: the unfocused element's Fresnel field against its exact field. At these depths
# the Fresnel criterion holds (the neglected phase k a^4 / 8 z^3, a the half-aperture, is below
# 0.01 rad at the highest frequency of the band, for the disc and the rectangle's length), and
# the widths agree within 1 % (measured: 0.1 % for the disc, 0.2 % for the rectangle).
@pytest.mark.parametrize("depth", [0.1, 0.136, 0.3])  # 0.136 m is about the disc's near field
@pytest.mark.parametrize("focal_length", [math.inf, 1e4])
def test_disc_focus_at_infinity_tends_to_the_flat_disc(depth, focal_length):
    ours = focused_beam_widths(DISC, C_WATER, focal_length, depth, [6, 20], bandwidth=0.5)
    exact = beam_widths(DISC, C_WATER, depth, [6, 20], bandwidth=0.5)
    for w, e in zip(ours, exact, strict=True):
        assert w.width == pytest.approx(e.width, rel=0.01)


@pytest.mark.parametrize("plane", ["length", "width"])
@pytest.mark.parametrize("depth", [0.2, 0.34, 0.6])  # 0.34 m is about the near field
def test_rectangle_focus_at_infinity_tends_to_the_flat_rectangle(plane, depth):
    ours = focused_beam_widths(RECT, C_WATER, math.inf, depth, [6, 20], plane=plane)
    exact = beam_widths(RECT, C_WATER, depth, [6, 20], plane=plane)
    for w, e in zip(ours, exact, strict=True):
        assert w.width == pytest.approx(e.width, rel=0.01)


def test_continuous_wave_is_a_narrow_band_pulse():
    # The spectral RMS (as the flat engine's) of a very narrow band is the continuous wave,
    # pulse-echo |p|^2 (the transmit field times the receive field).
    r = np.linspace(0.0, 0.004, 9)
    cw = focused_pressure(DISC, C_WATER, F, r, [0.06])[0]
    narrow = focused_amplitude(DISC, C_WATER, F, r, [0.06], bandwidth=1e-6, frequencies=8)[0]
    assert narrow == pytest.approx(cw**2, rel=1e-6)


@pytest.mark.parametrize(
    ("args", "kwargs", "needle"),
    [
        ((C_WATER, 0.006, 0.05), {}, "focal length"),  # inside the element's radius
        ((C_WATER, float("nan"), 0.05), {}, "focal length"),
        ((-1.0, F, 0.05), {}, "speed"),
        ((C_WATER, F, 0.0), {}, "depth"),
        ((C_WATER, F, 0.05), {"plane": "width"}, "plane"),  # a disc has one plane
        ((C_WATER, F, 0.05), {"bandwidth": 2.0}, "bandwidth"),
    ],
)
def test_bad_input_names_the_value(args, kwargs, needle):
    with pytest.raises(ValueError, match=needle):
        focused_beam_widths(DISC, *args, [6], **kwargs)


# Through the command line.

STEEL = ("--material", "reference-steel")
CL = 5920.0  # ISO 22232-2:2020 reference steel, longitudinal
FOCUSED = ("--diameter", "12.7mm", "--frequency", "5MHz", "--water-path", "50mm", "--focus", "75mm")


def test_beam_with_focus_gives_computed_widths_at_every_depth(run):
    r = run("beam", *FOCUSED, *STEEL, "--depth", "5mm", "--depth", "10mm", "--json")
    assert r.code == 0, r.stderr
    data = r.json()
    assert data["field"] is not None and data["field"]["bandwidth"] == 0.5
    spots = data["planes"][0]["spots"]
    assert {s["method"] for s in spots} == {"field"}  # no far-field row
    assert sorted((s["depth_m"], s["level_db"]) for s in spots) == [
        (0.005, -20.0),
        (0.005, -6.0),
        (0.01, -20.0),
        (0.01, -6.0),
    ]
    assert all(s["width_m"] > 0 for s in spots)
    assert not any("far field" in w for w in data["warnings"])
    # common practice: the part at depth d is the water field at WP + d c_part / c_water
    c_w = data["couplant"]["speed_m_s"]
    probe = Disc(0.0127, 5e6)
    for d in (0.005, 0.01):
        expected = focused_beam_widths(
            probe, c_w, 0.075, 0.05 + d * CL / c_w, [6, 20], bandwidth=0.5
        )
        got = {s["level_db"]: s["width_m"] for s in spots if s["depth_m"] == d}
        assert got[-6.0] == pytest.approx(expected[0].width, rel=1e-12)
        assert got[-20.0] == pytest.approx(expected[1].width, rel=1e-12)
    text = run("beam", *FOCUSED, *STEEL, "--depth", "5mm").stdout
    assert "computed field" in text and "no far-field row" in text
    assert "far field *" not in text and "2·(water path·tan" not in text
    assert "focus: S = F/N" in text  # the focus summary stays


def test_focal_depth_in_the_part_holds_the_airy_spot(run):
    # At the paraxial focal depth (F - WP) c_water / c_part (common practice) the equivalent
    # water path is F, so the continuous-wave pulse-echo -6 dB width is O'Neil's focal spot
    # 2 x F lambda_water / (pi D), x from scipy.
    c_w = run("beam", *FOCUSED, *STEEL, "--json").json()["couplant"]["speed_m_s"]
    depth = (0.075 - 0.05) * c_w / CL
    data = run(
        "beam", *FOCUSED, *STEEL, "--depth", f"{depth * 1e3!r}mm", "--bandwidth", "0", "--json"
    ).json()
    assert data["focus"]["focal_depth_in_part_m"] == pytest.approx(depth, rel=1e-12)
    width = next(s["width_m"] for s in data["planes"][0]["spots"] if s["level_db"] == -6.0)
    x = _pattern_root(_jinc, 2, 6, 3.8)
    assert width == pytest.approx(2 * x * 0.075 * (c_w / 5e6) / (math.pi * 0.0127), rel=1e-6)
    assert width == pytest.approx(data["focus"]["spot_width_m"], rel=1e-6)


def test_focus_with_far_field_only_and_depths_is_refused(run):
    r = run("beam", *FOCUSED, *STEEL, "--depth", "5mm", "--far-field-only")
    assert r.code == 2
    lines = r.stderr.strip().splitlines()
    assert len(lines) == 1 and "--far-field-only" in lines[0] and "focused" in lines[0]


def test_no_width_within_one_element_size_of_the_face(run):
    # A focus straight in water, a depth within one element size of the face: the Fresnel
    # approximation does not hold there, so that depth gets no width (and a warning says why).
    r = run(
        "beam",
        "--diameter",
        "12.7mm",
        "--frequency",
        "5MHz",
        "--material",
        "water",
        "--focus",
        "50mm",
        "--depth",
        "5mm",
        "--depth",
        "50mm",
        "--json",
    )
    assert r.code == 0
    spots = r.json()["planes"][0]["spots"]
    assert all(s["width_m"] is None for s in spots if s["depth_m"] == 0.005)
    assert all(s["width_m"] > 0 for s in spots if s["depth_m"] == 0.05)
    assert "does not hold there" in r.stderr and "5 mm" in r.stderr
