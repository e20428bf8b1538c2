"""Refine where a beam's amplitude crosses a level, for :func:`beamspread.field.beam_widths`."""

from __future__ import annotations

import numpy as np

__all__ = ["crossings"]


def crossings(amplitude, brackets, aperture) -> dict[float, float]:
    """Twice the outermost crossing of each level, to 1e-9 of the larger of it and the aperture.

    ``brackets`` maps a level to (threshold, lo, hi) with the amplitude at or
    above the threshold at ``lo`` and below it at ``hi``. One round samples
    63 points inside every bracket at once (64-fold narrower); a second
    evaluates two points a tolerance apart about the linear interpolate of
    the crossing, which closes the bracket where the amplitude is smooth;
    any bracket still open is then narrowed 64-fold a round as before.
    """
    if not brackets:
        return {}
    levels = list(brackets)
    inner = [np.linspace(lo, hi, 65)[1:-1] for _, lo, hi in brackets.values()]
    values = amplitude(np.concatenate(inner))
    probes = []
    state = {}
    for j, level in enumerate(levels):
        threshold, lo, hi = brackets[level]
        a = values[63 * j : 63 * (j + 1)]
        keep = np.flatnonzero(a >= threshold)
        if keep.size == 0:
            lo, hi, guess = lo, float(inner[j][0]), None
        elif keep[-1] == 62:
            lo, hi, guess = float(inner[j][-1]), hi, None
        else:
            k = int(keep[-1])
            lo, hi = float(inner[j][k]), float(inner[j][k + 1])
            # inverse quadratic interpolation through three samples about the crossing
            m = min(max(k, 1), 61)
            xs, ys = inner[j][m - 1 : m + 2], a[m - 1 : m + 2] - threshold
            guess = float(
                xs[0] * ys[1] * ys[2] / ((ys[0] - ys[1]) * (ys[0] - ys[2]))
                + xs[1] * ys[0] * ys[2] / ((ys[1] - ys[0]) * (ys[1] - ys[2]))
                + xs[2] * ys[0] * ys[1] / ((ys[2] - ys[0]) * (ys[2] - ys[1]))
            )
            if not lo < guess < hi:
                guess = None
        state[level] = (threshold, lo, hi)
        tol = 1e-9 * max(hi, aperture)
        guess = 0.5 * (lo + hi) if guess is None else guess
        probes.append((max(lo, guess - 0.25 * tol), min(hi, guess + 0.25 * tol)))
    values = amplitude(np.array(probes).ravel())
    out = {}
    for j, level in enumerate(levels):
        threshold, lo, hi = state[level]
        left, right = probes[j]
        if values[2 * j] >= threshold > values[2 * j + 1]:
            lo, hi = left, right
        while hi - lo > 1e-9 * max(hi, aperture):
            points = np.linspace(lo, hi, 65)[1:-1]
            keep = np.flatnonzero(amplitude(points) >= threshold)
            if keep.size:
                lo = float(points[keep[-1]])
                hi = float(points[keep[-1] + 1]) if keep[-1] + 1 < points.size else hi
            else:
                hi = float(points[0])
        out[level] = lo + hi  # twice the midpoint
    return out
