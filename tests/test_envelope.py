"""The peak of a pulse's envelope from a sampled spectrum (beamspread.field.envelope).

Checked against closed forms of Gaussian pulses (the analytic signal of a Gaussian
spectrum is a Gaussian envelope, Bracewell's transform pairs) sampled densely in time
here, and against a direct time-domain synthesis of the pulse-echo on the axis of a disc
(Kinsler & Frey's on-axis piston field: a plane wave and an edge wave) by an inverse FFT
over 512 frequencies written in the test.
"""

from __future__ import annotations

import math

import numpy as np
import pytest

from beamspread.errors import InputError
from beamspread.field.envelope import envelope_peak
from beamspread.field.spectrum import gaussian_spectrum

F0 = 5e6


def _gaussian_pulse_peak(delays, amplitudes, sigma):
    """max_t |sum_k A_k g(t - tau_k)|, g(t) = exp(-2 pi^2 sigma^2 t^2) exp(i 2 pi f0 t):
    the analytic signal of exp(-(f - f0)^2 / (2 sigma^2)) (up to a constant), sampled densely."""
    t = np.linspace(min(delays) - 4 / sigma, max(delays) + 4 / sigma, 400_001)
    s = sum(
        a * np.exp(-2 * (math.pi * sigma * (t - d)) ** 2) * np.exp(2j * math.pi * F0 * (t - d))
        for a, d in zip(amplitudes, delays, strict=True)
    )
    return np.abs(s).max()


@pytest.mark.parametrize("bandwidth", [0.3, 0.5])  # bands not cut at f0/4 (B < 0.59)
@pytest.mark.parametrize("tau", [0.0, 0.05e-6, 0.15e-6, 0.4e-6])
def test_two_arrivals_match_the_gaussian_closed_form(bandwidth, tau):
    spec = gaussian_spectrum(F0, bandwidth, 64)
    f, drive = spec.frequencies, spec.amplitude
    sigma = bandwidth * F0 / (2 * math.sqrt(2 * math.log(2)))
    q = 1.0 - 0.8 * np.exp(-2j * math.pi * f * tau)  # a direct wave and a weaker, later one
    got = envelope_peak(q, drive, f)
    unit = _gaussian_pulse_peak([0.0], [1.0], sigma)
    expected = _gaussian_pulse_peak([0.0, tau], [1.0, -0.8], sigma) / unit
    # The sampled band stops at +-3 sigma: its cut tails hold ~0.3 % of the amplitude.
    assert 20 * math.log10(got / expected) == pytest.approx(0.0, abs=0.05)


def test_a_delay_does_not_change_the_peak_and_a_flat_response_gives_one():
    spec = gaussian_spectrum(F0, 0.5, 32)
    f = spec.frequencies
    flat = envelope_peak(np.ones_like(f), spec.amplitude, f)
    delayed = envelope_peak(np.exp(-2j * math.pi * f * 1.3e-6), spec.amplitude, f)
    assert flat == pytest.approx(1.0, rel=1e-12)
    assert delayed == pytest.approx(1.0, rel=1e-9)


@pytest.mark.parametrize("bandwidth", [0.3, 0.6, 1.0])
def test_pulse_echo_on_a_disc_axis_matches_a_direct_synthesis(bandwidth):
    speed, radius = 5920.0, 0.005
    near_field = (2 * radius) ** 2 * F0 / (4 * speed)
    z = near_field * np.array([0.2, 0.35, 0.5, 0.75, 1.0, 2.0])
    edge = np.sqrt(z * z + radius * radius)

    def echo(f):  # the on-axis one-way field squared, at frequencies f, per depth
        k = 2 * math.pi * np.asarray(f)[None, :] / speed
        p = np.exp(-1j * k * z[:, None]) - np.exp(-1j * k * edge[:, None])
        return p * p

    spec = gaussian_spectrum(F0, bandwidth, 32)
    drive = np.sqrt(spec.source_weights("pulse-echo"))
    got = envelope_peak(echo(spec.frequencies), drive, spec.frequencies)
    # Direct synthesis: the same band and drive (W(f) (f0/f)^2) on 512 frequencies, an
    # inverse FFT padded to 2^17 samples, the envelope's largest sample.
    half_bin = 0.5 * (spec.frequencies[1] - spec.frequencies[0])
    fine = np.linspace(spec.frequencies[0] - half_bin, spec.frequencies[-1] + half_bin, 512)
    sigma = bandwidth * F0 / (2 * math.sqrt(2 * math.log(2)))
    fine_drive = np.exp(-((fine - F0) ** 2) / (2 * sigma**2)) * (F0 / fine) ** 2
    signal = np.fft.ifft(echo(fine) * fine_drive, n=1 << 17, axis=-1)
    expected = np.abs(signal).max(axis=-1) * (1 << 17) / fine_drive.sum()
    np.testing.assert_allclose(20 * np.log10(got / expected), 0.0, atol=0.05)


def test_one_frequency_is_the_magnitude_and_uneven_frequencies_are_refused():
    q = np.array([[0.3 + 0.4j], [2.0]])
    np.testing.assert_allclose(envelope_peak(q, [1.0], [5e6]), [0.5, 2.0])
    with pytest.raises(InputError, match="equally spaced"):
        envelope_peak(np.ones(3), np.ones(3), [1e6, 2e6, 4e6])
