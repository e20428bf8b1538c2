"""far_field_beams against the scalar analyse() and against scipy.special.j1 (reference library)."""

import math

import numpy as np
import pytest
from scipy.optimize import brentq
from scipy.special import j1

from beamspread import Disc, InputError, Rectangle, analyse, far_field_beams


def test_matches_scalar_analyse_disc_and_rectangle():
    diameters = np.array([0.006, 0.010, 0.025])
    depths = np.array([0.05, 0.1, 0.2])
    beams = far_field_beams(diameters[:, None], 5e6, 5920.0, depths[None, :], level_db=6.0)
    for i, d in enumerate(diameters):
        result = analyse(Disc(float(d), 5e6), 5920.0, levels=[6], depths=list(depths))
        plane = result.planes[0]
        assert math.degrees(beams.half_angle[i, 0]) == pytest.approx(
            plane.half_angles["-6"], rel=1e-12
        )
        assert math.degrees(beams.first_null[i, 0]) == pytest.approx(
            plane.half_angles["null"], rel=1e-12
        )
        widths = [s.width for s in plane.spots if s.method == "far-field"]
        np.testing.assert_allclose(beams.width[i], widths, rtol=1e-12)
    rect = analyse(Rectangle(0.02, 0.008, 2.25e6), 1480.0, levels=[20], mode="one-way")
    for name, side in (("length", 0.02), ("width", 0.008)):
        beam = far_field_beams(side, 2.25e6, 1480.0, 1.0, level_db=20, shape="side", mode="one-way")
        plane = next(p for p in rect.planes if p.name == name)
        assert math.degrees(float(beam.half_angle)) == pytest.approx(
            plane.half_angles["-20"], rel=1e-12
        )


def test_disc_angle_against_scipy_j1():
    # Independent: solve 2 J1(x)/x = 10**(-L/40) (pulse-echo) with scipy's J1 and brentq.
    rng = np.random.default_rng(3)
    d = rng.uniform(0.003, 0.03, 50)
    f = rng.uniform(1e6, 1e7, 50)
    c = rng.uniform(1400.0, 6300.0, 50)
    for level in (3.0, 6.0, 20.0):
        target = 10 ** (-level / 40)
        x = brentq(lambda t, g=target: 2 * j1(t) / t - g, 1e-9, 3.8317, xtol=1e-15)
        expected = np.arcsin(np.minimum(x * c / (f * math.pi * d), 2.0))
        expected = np.where(x * c / (f * math.pi * d) <= 1, expected, np.nan)
        got = far_field_beams(d, f, c, 0.1, level_db=level).half_angle
        np.testing.assert_allclose(got, expected, rtol=1e-10, equal_nan=True)


def test_small_aperture_gives_nan_and_bad_input_raises():
    beam = far_field_beams(0.0005, 1e6, 5920.0, 0.1)  # a tenth of a wavelength
    assert math.isnan(float(beam.half_angle)) and math.isnan(float(beam.width))
    with pytest.raises(InputError):
        far_field_beams(-0.01, 5e6, 5920.0, 0.1)
    with pytest.raises(InputError):
        far_field_beams([0.01, 0.02], 5e6, 5920.0, [0.1, 0.2, 0.3])
    with pytest.raises(InputError):
        far_field_beams(0.01, 5e6, 5920.0, 0.1, shape="triangle")
