"""The Gauss-Legendre rules behind the field engine, and its refusal of impossible sizes."""

from __future__ import annotations

import numpy as np
import pytest
from scipy.special import roots_legendre

from beamspread import Disc, InputError
from beamspread.field import field_amplitude
from beamspread.field._boundary import gauss_legendre


@pytest.mark.parametrize("n", [8, 100, 101, 256, 1000])
def test_legendre_rule_matches_scipy(n):
    # Reference: scipy.special.roots_legendre, mapped to [0, 1]. Nodes to rounding; weights to
    # 1e-10 of the largest, far below the 1e-7 relative error the engine is built to (numpy's
    # own rule differs from scipy's by about 1e-11 of the largest weight at n = 1000).
    x, w = roots_legendre(n)
    t, v = gauss_legendre(n)
    assert np.max(np.abs(t - 0.5 * (x + 1.0))) < 1e-14
    assert np.max(np.abs(v - 0.5 * w)) < 1e-10 * np.max(0.5 * w)


def test_large_rule_integrates_a_fast_oscillation():
    # The integral of cos(200 pi t) over [0, 1] is sin(200 pi) / (200 pi) = 0 (calculus), a
    # hundred periods: 1000 nodes resolve it to rounding.
    t, w = gauss_legendre(1000)
    assert abs(np.sum(w * np.cos(200 * np.pi * t))) < 1e-12


def test_an_element_of_millions_of_wavelengths_is_refused_not_attempted():
    # A bare 2250000 taken as MHz: a 12.7 mm disc of about 5 million wavelengths in steel.
    with pytest.raises(InputError, match="quadrature nodes"):
        field_amplitude(Disc(0.0127, 2.25e12), 5920.0, 0.003, 0.0, 0.025)
