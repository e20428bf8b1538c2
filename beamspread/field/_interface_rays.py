"""Fermat rays through a flat interface, many at once, and the transmission along them.

:func:`snell_sine` finds :math:`\\sin\\theta_1` of the ray from a point at
height :math:`h_1` above the interface to a point at depth :math:`h_2` below
it, a horizontal distance :math:`d` away, where

.. math:: g(s) = h_1 \\tan\\theta_1 + h_2 \\tan\\theta_2 - d = 0, \\quad
   \\sin\\theta_2 = n s, \\quad n = c_2 / c_1 .

The root depends on two ratios only, :math:`q = h_2 / (h_1 + h_2)` and
:math:`D = d / (h_1 + h_2)`, so it is tabulated once per speed ratio on a grid
in :math:`q` and :math:`x = D / (1 + D)` (both in [0, 1]), read by bilinear
interpolation (within about 3e-5), and polished by two Newton steps, which take
it to rounding (quadratic convergence) for nearly every pair; the few whose
last step was still above 1e-7 (rays grazing the interface, where :math:`g`
is steep) go on alone until they converge. A
paraxial start instead (tangents as sines) needs up to 30 steps on a field
map, every pair paying for the slowest.

:class:`TransmissionTable` samples the plane-wave transmission coefficient
once per crossing in :math:`\\sin\\theta_1` (a linear system per angle in
:mod:`beamspread.coupling.transmission`, about 4 us each) and interpolates it
linearly: 8192 intervals hold it to about 1e-8 away from the critical angles,
and to about 1e-3 within a few intervals of one, a share of the face too small
to show in the sum.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

__all__ = ["TransmissionTable", "ray_terms", "snell_sine"]

_Q = 128  # table intervals in q = h2 / (h1 + h2)
_X = 1024  # table intervals in x = D / (1 + D)
_POLISH = 2  # Newton steps every pair takes
_LATE = 1e-7  # a last step above this: the error after it may exceed rounding, go on
_TOLERANCE = 1e-14


def _newton(s, h1, h2, d, n, s_max, iterations):
    """Newton steps on g(s); returns (s, |last step|)."""
    step = np.zeros_like(s)
    for _ in range(iterations):
        c1 = np.sqrt(1.0 - s * s)
        ns = n * s
        c2 = np.sqrt(1.0 - ns * ns)
        g = h1 * s / c1 + h2 * ns / c2 - d
        dg = h1 / (c1 * c1 * c1) + h2 * n / (c2 * c2 * c2)
        step = g / dg
        s = np.clip(s - step, 0.0, s_max)
    return s, np.abs(step)


@lru_cache(maxsize=16)
def _table(n: float) -> np.ndarray:
    """sin(theta_1) on the (q, x) grid, shape (_Q + 1, _X + 1), converged from a paraxial start."""
    s_max = (1.0 if n <= 1.0 else 1.0 / n) * (1.0 - 1e-12)
    q = np.linspace(0.0, 1.0, _Q + 1)[:, None]
    x = np.linspace(0.0, 1.0, _X + 1)[None, :]
    h1 = np.broadcast_to(1.0 - q, (_Q + 1, _X + 1))
    h2 = np.broadcast_to(q, (_Q + 1, _X + 1))
    with np.errstate(divide="ignore"):
        d = np.broadcast_to(np.where(x < 1.0, x / np.maximum(1.0 - x, 1e-300), np.inf), h1.shape)
    s = np.where(np.isfinite(d), np.minimum(d / (h1 + n * h2), s_max), s_max)
    finite = np.isfinite(d)
    sub = s[finite]
    for _ in range(200):
        sub, step = _newton(sub, h1[finite], h2[finite], d[finite], n, s_max, 1)
        if step.max() < _TOLERANCE:
            break
    s[finite] = sub
    return s


def snell_sine(h1, h2, d, n: float) -> np.ndarray:
    """sin(theta_1) of the Fermat ray, broadcasting h1 (> 0), h2 (> 0) and d (>= 0), m."""
    s_max = (1.0 if n <= 1.0 else 1.0 / n) * (1.0 - 1e-12)
    h1, h2, d = np.broadcast_arrays(h1, h2, d)
    total = h1 + h2
    q = h2 / total * _Q
    x = d / (total + d) * _X
    iq = np.minimum(q.astype(np.intp), _Q - 1)
    ix = np.minimum(x.astype(np.intp), _X - 1)
    wq = q - iq
    wx = x - ix
    table = _table(float(n)).ravel()
    flat = iq * (_X + 1) + ix
    s = (1.0 - wq) * ((1.0 - wx) * table[flat] + wx * table[flat + 1]) + wq * (
        (1.0 - wx) * table[flat + _X + 1] + wx * table[flat + _X + 2]
    )
    s, step = _newton(s, h1, h2, d, n, s_max, _POLISH)
    late = step > _LATE
    if late.any():
        sub = s[late]
        args = h1[late], h2[late], d[late]
        for _ in range(100):
            sub, more = _newton(sub, *args, n, s_max, 1)
            if more.max() < _TOLERANCE:
                break
        s[late] = sub
    return s


class TransmissionTable:
    """A transmission coefficient sampled in sin(theta_1) on [0, s_max] and read linearly.

    Parameters
    ----------
    transmission : callable
        ``T(theta_1)`` (array of incident angles, rad) -> complex array.
    s_max : float
        The largest sine asked for (1, or c1 / c2 when the part is faster).
    intervals : int
        Sampling intervals.
    """

    def __init__(self, transmission, s_max: float, intervals: int = 8192):
        self.s_max = float(s_max)
        self.intervals = intervals
        s = np.linspace(0.0, self.s_max, intervals + 1)
        t = np.asarray(transmission(np.arcsin(s)), dtype=complex)
        self.real = np.ascontiguousarray(t.real)
        self.imag = np.ascontiguousarray(t.imag)

    def __call__(self, sine: np.ndarray) -> np.ndarray:
        u = np.clip(sine * (self.intervals / self.s_max), 0.0, self.intervals)
        i = np.minimum(u.astype(np.intp), self.intervals - 1)
        w = u - i
        re = self.real[i] + w * (self.real[i + 1] - self.real[i])
        im = self.imag[i] + w * (self.imag[i + 1] - self.imag[i])
        return re + 1j * im


def ray_terms(crossing, sources: np.ndarray, targets: np.ndarray):
    """``(delay (s), spreading (1/m), sin theta_1)`` of the Fermat rays, each (M, N)."""
    c1, c2 = crossing.upper_speed, crossing.lower_speed
    n = c2 / c1
    h1 = -sources[None, :, 2]
    h2 = targets[:, None, 2]
    dx = targets[:, None, 0] - sources[None, :, 0]
    dy = targets[:, None, 1] - sources[None, :, 1]
    d = np.sqrt(dx * dx + dy * dy)
    s = snell_sine(h1, h2, d, n)
    cos1 = np.sqrt(1.0 - s * s)
    s2 = n * s
    cos2 = np.sqrt(1.0 - s2 * s2)
    r1 = h1 / cos1
    r2 = h2 / cos2
    delay = r1 / c1 + r2 / c2
    nr2 = r2 * n
    ratio = cos1 / cos2
    amplitude = 1.0 / np.sqrt((r1 + nr2) * (r1 + nr2 * ratio * ratio))
    return delay, amplitude, s
