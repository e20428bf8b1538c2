"""The spectrum of a broadband pulse: a Gaussian sampled at a few frequencies.

The amplitude spectrum is

.. math:: W(f) = \\exp\\left(-\\frac{(f - f_0)^2}{2\\sigma^2}\\right), \\quad
   \\sigma = \\frac{B f_0}{2\\sqrt{2\\ln 2}},

so that it falls to one half (-6 dB) at :math:`f_0 (1 \\pm B/2)`: :math:`B` is the
-6 dB fractional bandwidth. It is sampled at the midpoints of ``count`` equal
bins over :math:`[\\max(f_0 - 3\\sigma, f_0/4), f_0 + 3\\sigma]`, where the energy
weight :math:`W^2` has fallen to :math:`e^{-9}`. The cut at :math:`f_0/4`
matters only above a bandwidth of about 0.6: a real probe's spectrum falls
faster than a Gaussian toward 0 Hz, and the drive below (see next paragraph)
would grow without bound there. A bandwidth of 0 is a continuous wave at
:math:`f_0` alone.

:math:`W` is the spectrum as it is measured: for pulse-echo, the spectrum of
the echo from a small reflector on the beam axis in the far field; one-way,
the spectrum of the pressure on the axis in the far field (a hydrophone far
away). Far from a piston the on-axis pressure grows in proportion to the
frequency (:math:`|p| = k a^2 / 2z`), so the element itself is driven with
:math:`W(f)\\,(f_0/f)^m`, ``m = 2`` pulse-echo and ``m = 1`` one-way
(:meth:`Spectrum.source_weights`); with this choice the far-field beam of a
broadband pulse is centred on :math:`f_0`, as the probe's quoted centre
frequency means.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from ..errors import InputError
from ..probes import check_positive

__all__ = [
    "MAX_BANDWIDTH",
    "SPECTRA",
    "Spectrum",
    "flat_spectrum",
    "gaussian_spectrum",
    "make_spectrum",
]

MAX_BANDWIDTH = 2.0
"""Fractional bandwidths must lie in [0, 2): at 2 the -6 dB point reaches 0 Hz."""

_SPAN = 3.0  # half-span of the sampled band, in sigma
_LOWEST = 0.25  # the band is cut at a quarter of the centre frequency


@dataclass(frozen=True)
class Spectrum:
    """Frequencies (Hz) and the amplitude spectrum at them (1 at the centre)."""

    frequencies: np.ndarray
    amplitude: np.ndarray
    centre: float
    bandwidth: float

    @property
    def energy_weights(self) -> np.ndarray:
        """:math:`W^2` normalised to sum to 1."""
        w2 = self.amplitude * self.amplitude
        return w2 / w2.sum()

    def source_weights(self, mode: str) -> np.ndarray:
        """Energy weights of the element's drive, :math:`(W (f_0/f)^m)^2`, summing to 1.

        ``m = 2`` for ``"pulse-echo"``, 1 for ``"one-way"``: the measured far-field
        spectrum :math:`W` divided by the far-field growth of the on-axis pressure.
        """
        m = 2 if mode == "pulse-echo" else 1
        w = self.amplitude * (self.centre / self.frequencies) ** m
        w2 = w * w
        return w2 / w2.sum()


def check_bandwidth(bandwidth: float) -> float:
    """Return ``bandwidth`` as a float if it lies in [0, 2), else raise InputError."""
    try:
        value = float(bandwidth)
    except (TypeError, ValueError):
        raise InputError(f"bandwidth: {bandwidth!r} is not a number") from None
    if not math.isfinite(value) or value < 0.0 or value >= MAX_BANDWIDTH:
        raise InputError(
            f"bandwidth: {bandwidth!r} is not allowed; the -6 dB fractional bandwidth "
            f"must lie in [0, {MAX_BANDWIDTH:g}) (0 means a continuous wave)"
        )
    return value


def _check_count(count) -> int:
    if isinstance(count, bool) or not isinstance(count, (int, np.integer)) or count < 1:
        raise InputError(f"frequencies: {count!r} is not allowed; it must be a whole number >= 1")
    return int(count)


def gaussian_spectrum(centre: float, bandwidth: float, count: int = 32) -> Spectrum:
    """A Gaussian spectrum of -6 dB fractional bandwidth ``bandwidth`` about ``centre``.

    Parameters
    ----------
    centre : float
        Centre frequency, Hz.
    bandwidth : float
        -6 dB fractional bandwidth, in [0, 2); 0 gives the single frequency
        ``centre``.
    count : int
        Number of frequencies (at least 1) when ``bandwidth > 0``.

    Returns
    -------
    Spectrum

    Examples
    --------
    >>> s = gaussian_spectrum(5e6, 0.5, 32)
    >>> s.frequencies.size, round(float(s.energy_weights.sum()), 12)
    (32, 1.0)
    """
    centre = check_positive(centre, "frequency", "Hz")
    bandwidth = check_bandwidth(bandwidth)
    count = _check_count(count)
    if bandwidth == 0.0 or count == 1:
        return Spectrum(np.array([centre]), np.array([1.0]), centre, bandwidth)
    sigma = bandwidth * centre / (2.0 * math.sqrt(2.0 * math.log(2.0)))
    low = max(centre - _SPAN * sigma, _LOWEST * centre)
    high = centre + _SPAN * sigma
    step = (high - low) / count
    f = low + step * (np.arange(count) + 0.5)
    amplitude = np.exp(-((f - centre) ** 2) / (2.0 * sigma * sigma))
    return Spectrum(f, amplitude, centre, bandwidth)


def flat_spectrum(centre: float, bandwidth: float, count: int = 32) -> Spectrum:
    """A flat (rectangular) spectrum of full width ``bandwidth * centre`` about ``centre``.

    Equal amplitude over :math:`[f_0(1 - B/2), f_0(1 + B/2)]` (cut at
    :math:`f_0/4` like the Gaussian), sampled at the midpoints of ``count``
    equal bins; every level of its edges is at the same place, so ``B`` is
    also its -6 dB fractional bandwidth.

    >>> s = flat_spectrum(1e6, 0.5, 4)
    >>> s.frequencies.tolist()
    [812500.0, 937500.0, 1062500.0, 1187500.0]
    """
    centre = check_positive(centre, "frequency", "Hz")
    bandwidth = check_bandwidth(bandwidth)
    count = _check_count(count)
    if bandwidth == 0.0 or count == 1:
        return Spectrum(np.array([centre]), np.array([1.0]), centre, bandwidth)
    low = max(centre * (1.0 - 0.5 * bandwidth), _LOWEST * centre)
    high = centre * (1.0 + 0.5 * bandwidth)
    step = (high - low) / count
    f = low + step * (np.arange(count) + 0.5)
    return Spectrum(f, np.ones(count), centre, bandwidth)


SPECTRA = {"gaussian": gaussian_spectrum, "flat": flat_spectrum}


def make_spectrum(kind: str, centre: float, bandwidth: float, count: int = 32) -> Spectrum:
    """The spectrum of shape ``kind`` (one of :data:`SPECTRA`)."""
    try:
        build = SPECTRA[kind]
    except KeyError:
        raise InputError(f"spectrum {kind!r} is unknown; use one of {', '.join(SPECTRA)}") from None
    return build(centre, bandwidth, count)
