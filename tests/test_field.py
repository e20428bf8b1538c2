"""The computed field (beamspread.field) against references outside the project.

References used below:

* Kinsler, Frey, Coppens & Sanders, *Fundamentals of Acoustics*, the baffled
  circular piston: exact on-axis pressure |p| = 2 rho c U0 |sin(k/2 (sqrt(z^2 + a^2) - z))|,
  zeros at (a^2 - n^2 lambda^2) / (2 n lambda).
* The Rayleigh integral p = (i k rho c U0 / 2 pi) * integral of exp(-ikR)/R dS, summed here by
  brute force over point sources a small fraction of a wavelength apart (written in this file).
* The far-field directivity of the first tool (beamspread.pattern.directivity: 2 J1(x)/x and
  sin(x)/x), with the Fresnel phase it neglects bounding the difference.
* beamspread.axis.rectangle_near_field, the exact on-axis integral of the first tool.
* Common practice: broadband pulses smooth the near field (minima fill in, the last on-axis
  maximum moves toward the element, widths in the far field barely change).
"""

from __future__ import annotations

import itertools
import math

import numpy as np
import pytest

from beamspread.axis import disc_axial_pressure, rectangle_near_field
from beamspread.errors import InputError
from beamspread.field import (
    MAX_POINTS,
    axial_profile,
    beam_width,
    field_amplitude,
    field_map,
    gaussian_spectrum,
    last_maximum,
    pressure,
    transverse_profile,
)
from beamspread.pattern import directivity
from beamspread.probes import Disc, Ellipse, Rectangle

STEEL = 5920.0  # m/s, ISO 22232-2 reference steel


def _db(a):
    return 20.0 * np.log10(a)


# --- brute-force Rayleigh summation (the reference for off-axis points) ----------------------


def _disc_sources(radius: float, spacing: float):
    """Point sources over a disc: rings of width ``spacing``, points ``spacing`` apart on each.

    Each source carries the exact area of its share of its ring, so the face's area and rim are
    represented exactly (midpoint rule across the rings, periodic trapezoid round them).
    """
    rings = math.ceil(radius / spacing)
    dr = radius / rings
    xs, ys, ws = [], [], []
    for i in range(rings):
        r = (i + 0.5) * dr
        count = max(8, math.ceil(2.0 * math.pi * r / spacing))
        phi = (np.arange(count) + 0.5) * 2.0 * math.pi / count
        area = math.pi * ((i + 1) ** 2 - i**2) * dr * dr
        xs.append(r * np.cos(phi))
        ys.append(r * np.sin(phi))
        ws.append(np.full(count, area / count))
    return np.concatenate(xs), np.concatenate(ys), np.concatenate(ws)


def _rectangle_sources(length: float, width: float, spacing: float):
    """Point sources at the centres of equal cells over a rectangle (midpoint rule)."""
    nx, ny = math.ceil(length / spacing), math.ceil(width / spacing)
    x = (np.arange(nx) + 0.5) * length / nx - 0.5 * length
    y = (np.arange(ny) + 0.5) * width / ny - 0.5 * width
    gx, gy = np.meshgrid(x, y)
    return gx.ravel(), gy.ravel(), np.full(gx.size, length * width / (nx * ny))


def _rayleigh(sources, k: float, x, y, z) -> np.ndarray:
    """|p| / (rho c U0) = |(i k / 2 pi) sum w exp(-ikR)/R| at the points, by brute force."""
    sx, sy, sw = sources
    x, y, z = (np.ravel(v).astype(float) for v in np.broadcast_arrays(x, y, z))
    out = np.empty(x.size)
    step = max(1, 2_000_000 // sx.size)
    for i in range(0, x.size, step):
        sl = slice(i, i + step)
        r = np.sqrt((x[sl, None] - sx) ** 2 + (y[sl, None] - sy) ** 2 + z[sl, None] ** 2)
        out[sl] = np.abs((np.exp(-1j * k * r) / r) @ sw) * k / (2.0 * math.pi)
    return out


def _ellipse_sources(length: float, width: float, spacing: float):
    """The disc's rings mapped onto an ellipse by scaling x and y (areas scale by a b)."""
    a, b = 0.5 * length, 0.5 * width
    x, y, w = _disc_sources(1.0, spacing / max(a, b))
    return a * x, b * y, a * b * w


def _sources(probe, spacing):
    if isinstance(probe, Disc):
        return _disc_sources(0.5 * probe.diameter, spacing)
    if isinstance(probe, Ellipse):
        return _ellipse_sources(probe.length, probe.width, spacing)
    return _rectangle_sources(probe.length, probe.width, spacing)


# --- on axis -------------------------------------------------------------------------------


def test_disc_on_axis_matches_the_exact_closed_form():
    # Kinsler & Frey: |p| = 2 |sin(k/2 (sqrt(z^2 + a^2) - z))|, from 0.1 N to 10 N.
    diameter, f = 0.010, 5e6
    lam = STEEL / f
    n = (diameter**2 - lam**2) / (4 * lam)
    z = np.geomspace(0.1 * n, 10 * n, 3001)
    exact = disc_axial_pressure(z, diameter, lam)
    disc = Disc(diameter, f)
    for ours in (
        np.abs(pressure(disc, STEEL, 0.0, 0.0, z)),
        field_amplitude(disc, STEEL, 0.0, 0.0, z, mode="one-way"),
        np.sqrt(field_amplitude(disc, STEEL, 0.0, 0.0, z)),  # pulse-echo is |p|^2
        field_map(disc, STEEL, [0.0], z, mode="one-way").amplitude[:, 0],  # float32 path
    ):
        away = exact > 0.1  # dB is undefined at the exact zeros: compare amplitudes there
        assert np.abs(_db(ours[away]) - _db(exact[away])).max() < 0.01
        assert np.abs(ours[~away] - exact[~away]).max() < 2 * (10 ** (0.01 / 20) - 1) * 0.1


def test_disc_phase_on_axis_matches_the_closed_form():
    # Kinsler & Frey, complex form: p = exp(-ikz) - exp(-ik sqrt(z^2 + a^2)) (time exp(+i w t)).
    disc, lam = Disc(0.010, 5e6), STEEL / 5e6
    k = 2 * math.pi / lam
    z = np.linspace(0.002, 0.2, 200)
    exact = np.exp(-1j * k * z) - np.exp(-1j * k * np.sqrt(z * z + 0.005**2))
    assert np.abs(pressure(disc, STEEL, 0.0, 0.0, z) - exact).max() < 1e-9


def test_rectangle_last_maximum_matches_the_on_axis_integral():
    # beamspread.axis.rectangle_near_field: the exact on-axis integral of the first tool.
    for length, width, f in ((0.020, 0.010, 5e6), (0.010, 0.010, 2.25e6), (0.006, 0.024, 4e6)):
        lam = STEEL / f
        ours = last_maximum(Rectangle(length, width, f), STEEL, mode="one-way")
        assert ours == pytest.approx(rectangle_near_field(length, width, lam), rel=1e-6)


def test_disc_last_maximum_matches_the_closed_form():
    # Kinsler & Frey: the last maximum at (D^2 - lambda^2) / (4 lambda).
    for diameter, f in ((0.010, 5e6), (0.025, 1e6), (0.006, 10e6)):
        lam = STEEL / f
        ours = last_maximum(Disc(diameter, f), STEEL)
        assert ours == pytest.approx((diameter**2 - lam**2) / (4 * lam), rel=1e-6)


# --- off axis: brute-force Rayleigh ---------------------------------------------------------


def _near_field_points(probe, near_field):
    half = 0.5 * max(d for _, d in probe.planes)
    z = np.array([0.2, 0.35, 0.6, 0.9]) * near_field
    lateral = np.linspace(0.0, 1.4 * half, 29)
    return z, lateral


@pytest.mark.parametrize(
    ("probe", "line"),
    [
        (Disc(0.010, 5e6), "x"),
        (Disc(0.004, 3e6), "x"),
        (Rectangle(0.008, 0.004, 5e6), "x"),
        (Rectangle(0.008, 0.004, 5e6), "y"),
        (Rectangle(0.008, 0.004, 5e6), "diagonal"),
        (Ellipse(0.008, 0.005, 5e6), "x"),
        (Ellipse(0.008, 0.005, 5e6), "y"),
        (Ellipse(0.008, 0.005, 5e6), "diagonal"),
    ],
)
def test_off_axis_matches_brute_force_rayleigh(probe, line):
    # Brute-force Rayleigh summation at lambda/32 (written above), inside the near field,
    # to 0.1 dB wherever the field is within 20 dB of the maximum at that depth.
    lam = STEEL / probe.frequency
    k = 2 * math.pi / lam
    if isinstance(probe, Disc):
        near_field = (probe.diameter**2 - lam**2) / (4 * lam)
    elif isinstance(probe, Ellipse):
        near_field = last_maximum(probe, STEEL, bandwidth=0.0, mode="one-way")
    else:
        near_field = rectangle_near_field(probe.length, probe.width, lam)
    z, lateral = _near_field_points(probe, near_field)
    if not isinstance(probe, Disc):
        # include points on the edge lines and beyond them
        lateral = np.union1d(lateral, [0.5 * probe.length, 0.5 * probe.width])
    x = lateral if line in ("x", "diagonal") else 0.0 * lateral
    y = lateral if line == "y" else (0.6 * lateral if line == "diagonal" else 0.0 * lateral)
    sources = _sources(probe, lam / 32)
    for depth in z:
        reference = _rayleigh(sources, k, x, y, depth)
        ours = np.abs(pressure(probe, STEEL, x, y, depth))
        inside = reference >= 0.1 * reference.max()
        assert inside.sum() >= 5
        assert np.abs(_db(ours[inside]) - _db(reference[inside])).max() < 0.1


def test_scattered_points_match_brute_force_rayleigh():
    # Points at unrelated lateral positions and depths (the per-point path), Rayleigh reference.
    probe = Rectangle(0.006, 0.005, 4e6)
    lam = STEEL / probe.frequency
    rng = np.random.default_rng(3)
    x = rng.uniform(-0.004, 0.004, 40)
    y = rng.uniform(-0.004, 0.004, 40)
    z = rng.uniform(0.002, 0.012, 40)
    reference = _rayleigh(_sources(probe, lam / 32), 2 * math.pi / lam, x, y, z)
    ours = np.abs(pressure(probe, STEEL, x, y, z))
    strong = reference > 0.1 * reference.max()
    assert np.abs(_db(ours[strong]) - _db(reference[strong])).max() < 0.1


def test_broadband_pulse_echo_matches_brute_force_rayleigh():
    # The spectral RMS sqrt(sum_f S^2 |p_f|^4 / sum_f S^2), S = W (f0/f)^2 the drive for a
    # measured far-field echo spectrum W, with p_f from brute-force Rayleigh
    # at lambda/32 of the highest frequency in the spectrum.
    probe = Disc(0.006, 5e6)
    spectrum = gaussian_spectrum(5e6, 0.6, 16)
    lam_min = STEEL / spectrum.frequencies.max()
    sources = _sources(probe, lam_min / 32)
    x = np.linspace(0.0, 0.004, 17)
    depth = 0.004
    # the element's drive: the measured far-field echo spectrum W divided by (f/f0)^2
    drive = spectrum.amplitude * (5e6 / spectrum.frequencies) ** 2
    energy = drive**2 / np.sum(drive**2)
    total = np.zeros_like(x)
    for f, w in zip(spectrum.frequencies, energy, strict=True):
        total += w * _rayleigh(sources, 2 * math.pi * f / STEEL, x, 0.0, depth) ** 4
    reference = np.sqrt(total)
    ours = field_amplitude(probe, STEEL, x, 0.0, depth, bandwidth=0.6, frequencies=16)
    strong = reference > 0.1 * reference.max()
    assert np.abs(_db(ours[strong]) - _db(reference[strong])).max() < 0.1


def test_map_matches_brute_force_rayleigh():
    # The float32 map path against brute-force Rayleigh at lambda/32, pulse-echo CW (|p|^2).
    probe = Rectangle(0.008, 0.004, 5e6)
    lam = STEEL / probe.frequency
    lateral = np.linspace(-0.006, 0.006, 25)
    depth = np.array([0.002, 0.005, 0.011])
    m = field_map(probe, STEEL, lateral, depth, plane="width")
    sources = _sources(probe, lam / 32)
    for i, z in enumerate(depth):
        reference = _rayleigh(sources, 2 * math.pi / lam, 0.0, lateral, z) ** 2
        strong = reference > 0.1 * reference.max()
        assert np.abs(_db(m.amplitude[i][strong]) - _db(reference[strong])).max() < 0.1


@pytest.mark.parametrize("probe", [Disc(0.006, 5e6), Rectangle(0.006, 0.004, 5e6)])
def test_broadband_map_over_many_depths_matches_brute_force_rayleigh(probe):
    # The float32 broadband map over 0.1 to 3 near fields (large enough to get a node table
    # per band of depths; phasors stepped between frequencies) against brute-force Rayleigh
    # sums written in this file on a sample of its points: the midpoint rule at lambda/16 and
    # lambda/32 of the highest frequency, Richardson-extrapolated (its error falls as h^2).
    spectrum = gaussian_spectrum(5e6, 0.5, 16)
    lam_min = STEEL / spectrum.frequencies.max()
    near = (probe.longest_side**2) / (4 * STEEL / 5e6)
    lateral = np.linspace(0.0, 0.6 * probe.longest_side, 96)
    depth = near * np.linspace(0.1, 3.0, 160)
    m = field_map(probe, STEEL, lateral, depth, bandwidth=0.5, frequencies=16)
    rows, columns = np.arange(3, 160, 26), np.arange(0, 96, 12)
    drive = spectrum.amplitude * (5e6 / spectrum.frequencies) ** 2
    energy = drive**2 / np.sum(drive**2)
    sums = []
    for divisions in (16, 32):
        sources = _sources(probe, lam_min / divisions)
        total = np.zeros((rows.size, columns.size))
        for f, w in zip(spectrum.frequencies, energy, strict=True):
            k = 2 * math.pi * f / STEEL
            p = _rayleigh(sources, k, lateral[None, columns], 0.0, depth[rows, None])
            total += w * p.reshape(total.shape) ** 4
        sums.append(np.sqrt(total))
    reference = sums[1] + (sums[1] - sums[0]) / 3.0
    ours = m.amplitude[np.ix_(rows, columns)]
    strong = reference > 0.1 * reference.max(axis=1, keepdims=True)
    assert np.abs(_db(ours[strong]) - _db(reference[strong])).max() < 0.001


# --- far field ------------------------------------------------------------------------------


@pytest.mark.parametrize(
    ("probe", "plane", "shape"),
    [
        (Disc(0.010, 5e6), "diameter", "disc"),
        (Rectangle(0.020, 0.010, 5e6), "length", "side"),
        (Rectangle(0.020, 0.010, 5e6), "width", "side"),
    ],
)
@pytest.mark.parametrize("depth_in_n", [12.0, 40.0])
def test_far_transverse_profile_matches_the_directivity(probe, plane, shape, depth_in_n):
    # Far-field directivity of the first tool. At a fixed depth z the point at offset x lies at
    # R = z / cos(theta), so the relative amplitude is D(theta) cos(theta). The Fraunhofer form
    # drops the phase k rho^2 / (2R) across the face (rho up to the half-diagonal), so
    # |p - p_far| / p_far(axis) <= k rho_max^2 / (2 z) (|exp(-i phi) - 1| <= phi); the 1/R
    # variation across the face adds at most rho_max / z.
    lam = STEEL / probe.frequency
    k = 2 * math.pi / lam
    aperture = dict(probe.planes)[plane]
    half_diagonal = 0.5 * math.hypot(*[d for _, d in probe.planes])
    n = max(d for _, d in probe.planes) ** 2 / (4 * lam)
    z = depth_in_n * n
    bound = k * half_diagonal**2 / (2 * z) + half_diagonal / z
    theta_null = math.asin(min(1.0, (1.22 if shape == "disc" else 1.0) * lam / aperture))
    offsets = z * np.tan(np.linspace(0.0, 1.5 * theta_null, 61))
    profile = transverse_profile(probe, STEEL, z, offsets, plane=plane, mode="one-way")
    theta = np.arctan(offsets / z)
    expected = np.abs(directivity(theta, aperture, lam, shape)) * np.cos(theta)
    ours = profile.amplitude / profile.amplitude[0]
    assert np.abs(ours - expected).max() < bound


def test_far_field_error_falls_with_depth_as_the_fresnel_phase():
    # The neglected Fresnel phase is proportional to 1/z: from 12 N to 48 N the largest
    # deviation from the directivity must shrink by well over half (the bound shrinks fourfold).
    lam = STEEL / 5e6
    n = 0.010**2 / (4 * lam)
    errors = []
    for z in (12 * n, 48 * n):
        offsets = z * np.tan(np.linspace(0.0, 1.3 * lam / 0.010, 41))
        p = transverse_profile(Disc(0.010, 5e6), STEEL, z, offsets, mode="one-way")
        theta = np.arctan(offsets / z)
        expected = np.abs(directivity(theta, 0.010, lam, "disc")) * np.cos(theta)
        errors.append(np.abs(p.amplitude / p.amplitude[0] - expected).max())
    assert errors[1] < 0.5 * errors[0]


def test_far_beam_width_matches_the_directivity():
    # -6 dB pulse-echo full width at 40 N against 2 z tan(theta) from the first tool's
    # half-angle (sin theta = 0.51 lambda / D, Krautkramer Table 4.2, computed exactly here).
    # Finite range shifts it by about the Fresnel bound of the test above (a few per cent).
    from beamspread.pattern import half_angle

    probe, lam = Disc(0.010, 5e6), STEEL / 5e6
    z = 40 * 0.010**2 / (4 * lam)
    expected = 2 * z * math.tan(float(half_angle(6.0, 0.010, lam, "disc", "pulse-echo")))
    width = beam_width(probe, STEEL, z, 6.0).width
    assert width == pytest.approx(expected, rel=0.03)


# --- broadband ------------------------------------------------------------------------------


def test_broadband_fills_the_on_axis_minima():
    # Common practice: broadband pulses smooth the near field. The first on-axis zero of the
    # continuous wave (Kinsler & Frey, z = (a^2 - lambda^2) / (2 lambda)) fills in steadily.
    diameter, f = 0.010, 5e6
    lam = STEEL / f
    a = 0.5 * diameter
    zero = (a * a - lam * lam) / (2 * lam)
    disc = Disc(diameter, f)
    values = [
        float(axial_profile(disc, STEEL, [zero], bandwidth=b).amplitude[0])
        for b in (0.0, 0.2, 0.4, 0.7, 1.0)
    ]
    assert values[0] < 1e-9
    assert all(later > earlier for earlier, later in itertools.pairwise(values))
    assert values[-1] > 0.5  # pulse-echo units: the on-axis maximum is 4


def test_broadband_last_maximum_matches_the_closed_form_over_the_spectrum():
    # Kinsler & Frey on axis at each frequency, |p_f|^4 summed with the drive's energy
    # weights, maximised by scipy.optimize.minimize_scalar near the continuous-wave N.
    from scipy.optimize import minimize_scalar

    diameter, f0, bandwidth = 0.010, 5e6, 0.6
    spectrum = gaussian_spectrum(f0, bandwidth, 32)
    drive = spectrum.amplitude * (f0 / spectrum.frequencies) ** 2  # S = W (f0/f)^2
    energy = drive**2 / np.sum(drive**2)
    lams = STEEL / spectrum.frequencies

    def minus_rms(z):
        p = disc_axial_pressure(z, diameter, lams)
        return -math.sqrt(float(np.sum(energy * p**4)))

    n = (diameter**2 - (STEEL / f0) ** 2) / (4 * STEEL / f0)
    best = minimize_scalar(
        minus_rms, bounds=(0.7 * n, 1.5 * n), method="bounded", options={"xatol": 1e-10}
    )
    ours = last_maximum(Disc(diameter, f0), STEEL, bandwidth=bandwidth)
    assert ours == pytest.approx(best.x, rel=1e-5)


def test_narrow_band_tends_to_the_continuous_wave():
    # As the bandwidth goes to 0 the spectral RMS tends to |p(f0)|^2 (its definition).
    disc = Disc(0.010, 5e6)
    x = np.linspace(0.0, 0.008, 9)
    cw = field_amplitude(disc, STEEL, x, 0.0, 0.015)
    narrow = field_amplitude(disc, STEEL, x, 0.0, 0.015, bandwidth=1e-4)
    assert np.abs(narrow - cw).max() < 1e-5


def test_gaussian_spectrum_is_half_at_the_band_edges():
    # The -6 dB fractional bandwidth B: W = 1/2 at f0 (1 +- B/2) for the Gaussian
    # W = exp(-(f - f0)^2 / (2 sigma^2)), sigma = B f0 / (2 sqrt(2 ln 2)).
    s = gaussian_spectrum(5e6, 0.5, 64)
    w = np.interp([3.75e6, 6.25e6], s.frequencies, s.amplitude)
    assert w == pytest.approx([0.5, 0.5], abs=2e-3)
    assert s.frequencies.min() > 0


# --- maps and input -------------------------------------------------------------------------


def test_map_is_symmetric_and_has_its_coordinates():
    probe = Rectangle(0.020, 0.010, 5e6)
    lateral = np.linspace(-0.02, 0.02, 41)
    depth = np.linspace(0.01, 0.2, 30)
    m = field_map(probe, STEEL, lateral, depth, bandwidth=0.5)
    assert m.amplitude.shape == (30, 41)
    assert m.plane == "length" and m.mode == "pulse-echo" and m.bandwidth == 0.5
    np.testing.assert_allclose(m.amplitude, m.amplitude[:, ::-1], rtol=1e-6)


@pytest.mark.parametrize(
    "call",
    [
        lambda: pressure(Disc(0.01, 5e6), STEEL, 0.0, 0.0, 0.0),
        lambda: pressure(Disc(0.01, 5e6), STEEL, 0.0, 0.0, -0.01),
        lambda: field_amplitude(Disc(0.01, 5e6), STEEL, 0.0, 0.0, 0.01, bandwidth=-0.1),
        lambda: field_amplitude(Disc(0.01, 5e6), STEEL, 0.0, 0.0, 0.01, bandwidth=2.0),
        lambda: field_amplitude(Disc(0.01, 5e6), STEEL, 0.0, 0.0, 0.01, mode="two-way"),
        lambda: field_amplitude(Disc(0.01, 5e6), STEEL, 0.0, 0.0, 0.01, frequencies=0),
        lambda: field_amplitude(Disc(0.01, 5e6), STEEL, np.nan, 0.0, 0.01),
        lambda: field_map(Disc(0.01, 5e6), STEEL, np.zeros(MAX_POINTS), [0.01, 0.02]),
        lambda: field_map(Disc(0.01, 5e6), STEEL, [], [0.01]),
        lambda: transverse_profile(Disc(0.01, 5e6), STEEL, 0.01, [0.0], plane="width"),
        lambda: beam_width(Disc(0.01, 5e6), STEEL, 0.01, 0.0),
    ],
)
def test_bad_input_is_refused(call):
    with pytest.raises(InputError):
        call()


def test_broadband_on_axis_maximum_moves_toward_the_element():
    # Common practice: for a broadband pulse the last on-axis pulse-echo maximum lies closer
    # to the element than the continuous-wave N = (D^2 - lambda^2)/(4 lambda) (Kinsler &
    # Frey), and moves closer as the bandwidth grows.
    disc = Disc(0.010, 5e6)
    lam = STEEL / 5e6
    n_cw = (0.010**2 - lam**2) / (4 * lam)
    positions = [last_maximum(disc, STEEL, bandwidth=b) for b in (0.2, 0.4, 0.6)]
    assert positions[0] < n_cw
    assert all(later < earlier for earlier, later in itertools.pairwise(positions))


@pytest.mark.parametrize("probe", [Disc(0.010, 5e6), Rectangle(0.020, 0.010, 5e6)])
def test_broadband_width_at_five_near_fields_is_close_to_the_cw_one(probe):
    # Common practice: broadband pulses smooth the near field but leave the far-field beam
    # of the centre frequency; at 5 N the -6 dB width is within a few per cent (here 5 %).
    lam = STEEL / probe.frequency
    if isinstance(probe, Disc):
        n = (probe.diameter**2 - lam**2) / (4 * lam)
    else:
        n = rectangle_near_field(probe.length, probe.width, lam)
    for plane, _aperture in probe.planes:
        cw = beam_width(probe, STEEL, 5 * n, 6.0, plane=plane).width
        broad = beam_width(probe, STEEL, 5 * n, 6.0, plane=plane, bandwidth=0.6).width
        assert broad == pytest.approx(cw, rel=0.05)


def test_ellipse_of_equal_axes_is_the_disc():
    # An ellipse with a = b is a disc: the rim integral must reduce to the disc's
    # (checked against the disc path, itself checked against Kinsler & Frey above).
    x = np.linspace(0.0, 0.008, 17)
    for z in (0.004, 0.02, 0.08):
        disc = pressure(Disc(0.010, 5e6), STEEL, x, 0.0, z)
        ellipse = pressure(Ellipse(0.010, 0.010, 5e6), STEEL, x, 0.0, z)
        assert np.abs(disc - ellipse).max() < 1e-6
