"""The peak of a pulse's envelope, from its spectrum sampled at equally spaced frequencies.

An inspector reads the height of an echo on the screen: the largest value of its
envelope in time, not its energy. With the element driven by amplitudes
:math:`a_f` at frequencies :math:`f_n = f_0 + n\\,\\Delta f` and the field's
response :math:`q_f` at a point (:math:`p_f` one-way, :math:`p_f^2` pulse-echo),
the analytic signal is

.. math:: s(t) = \\sum_n a_n q_n e^{i 2\\pi f_n t}, \\qquad
   |s(t)| = \\left|\\sum_n a_n q_n e^{i 2\\pi n \\Delta f t}\\right| ,

periodic in :math:`1/\\Delta f` (the sampled spectrum sees the pulse through that
window: the echo's arrivals at a point must spread over less than it, which the
spectra of :mod:`beamspread.field.spectrum` give with room to spare at their
default count). The peak is found on a zero-padded FFT (eight samples a period of
the highest difference frequency), then polished by Newton's method on
:math:`|s|^2` with its exact derivatives, to 1e-9 relative. It is normalised so
that a flat unit response (:math:`q_n = 1`, a plane wave) gives 1, as the
energy amplitude (the spectral RMS) does. For a single frequency it is
:math:`|q|`, the same as the energy amplitude.
"""

from __future__ import annotations

import numpy as np

from ..errors import InputError

__all__ = ["envelope_peak"]


def _check_uniform(frequencies: np.ndarray) -> float:
    if frequencies.size < 2:
        return 0.0
    steps = np.diff(frequencies)
    if not (steps > 0).all() or np.ptp(steps) > 1e-9 * steps.mean():
        raise InputError("frequencies: the peak needs equally spaced, increasing frequencies")
    return float(steps.mean())


def envelope_peak(responses, drive, frequencies) -> np.ndarray:
    """The largest value of the envelope in time at each point.

    Parameters
    ----------
    responses : array_like, complex, shape (..., F)
        The field's response at each point and frequency (``p`` one-way, ``p**2``
        pulse-echo).
    drive : array_like, shape (F,)
        The amplitude of each frequency in the pulse (not its energy).
    frequencies : array_like, shape (F,)
        Equally spaced, increasing, Hz.

    Returns
    -------
    ndarray, shape (...)
    """
    q = np.asarray(responses, dtype=complex)
    a = np.asarray(drive, dtype=float)
    f = np.asarray(frequencies, dtype=float)
    if q.shape[-1:] != a.shape or a.shape != f.shape:
        raise InputError("responses, drive and frequencies: one value per frequency")
    step = _check_uniform(f)
    c = q * (a / a.sum())
    if f.size == 1:
        return np.abs(c[..., 0])
    shape = c.shape[:-1]
    c = c.reshape(-1, f.size)
    size = 1 << int(np.ceil(np.log2(8 * f.size)))
    samples = np.fft.ifft(c, n=size, axis=-1) * size  # s at t_j = j / (size * step)
    j = np.argmax(np.abs(samples), axis=-1)
    t = j / (size * step)
    omega = 2.0 * np.pi * step * np.arange(f.size)
    half_cell = 0.5 / (size * step)
    lo, hi = t - half_cell * 2, t + half_cell * 2
    for _ in range(8):
        phase = np.exp(1j * np.outer(t, omega))
        s = (c * phase).sum(axis=-1)
        ds = (c * (1j * omega) * phase).sum(axis=-1)
        d2s = (c * (-(omega**2)) * phase).sum(axis=-1)
        g1 = 2.0 * (s.conj() * ds).real
        g2 = 2.0 * ((ds.conj() * ds).real + (s.conj() * d2s).real)
        with np.errstate(divide="ignore", invalid="ignore"):
            move = np.where(g2 < 0.0, -g1 / g2, 0.0)
        t = np.clip(t + move, lo, hi)
    peak = np.abs((c * np.exp(1j * np.outer(t, omega))).sum(axis=-1))
    peak = np.maximum(peak, np.abs(samples[np.arange(j.size), j]))
    return peak.reshape(shape)
