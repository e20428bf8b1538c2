"""Results derived from the computed field: profiles, the last on-axis maximum, widths, maps.

Every result carries its coordinates (m), the amplitude as defined by
:func:`beamspread.field.engine.field_amplitude` (continuous wave or the
spectral RMS of a broadband pulse; pulse-echo or one-way) and the convention
it was computed with. Levels in dB are :math:`20\\log_{10}` of that amplitude
relative to the stated reference; a pulse-echo amplitude already holds the
transmit and the receive field, so "-6 dB pulse-echo" is half the pulse-echo
amplitude.

Planes: a disc has one, ``"diameter"`` (offsets along x); a rectangle has
``"length"`` (the x-z plane, offsets along x) and ``"width"`` (the y-z plane,
offsets along y).
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

from .._search import golden_max
from ..axis import simple_near_field
from ..errors import InputError
from ..probes import check_element, check_positive, plane_name
from ..units import parse_level
from ._crossings import crossings
from .engine import _grid_amplitude, check_mode
from .spectrum import check_bandwidth

__all__ = [
    "AxialProfile",
    "BeamWidth",
    "FieldMap",
    "TransverseProfile",
    "axial_profile",
    "beam_width",
    "beam_widths",
    "field_map",
    "last_maximum",
    "transverse_profile",
]


@dataclass(frozen=True)
class AxialProfile:
    """The amplitude along the beam axis."""

    depth: np.ndarray
    amplitude: np.ndarray
    mode: str
    bandwidth: float


@dataclass(frozen=True)
class TransverseProfile:
    """The amplitude across the beam at one depth, in one plane."""

    plane: str
    depth: float
    offset: np.ndarray
    amplitude: np.ndarray
    mode: str
    bandwidth: float


@dataclass(frozen=True)
class BeamWidth:
    """The full width of the beam at ``level_db`` below the maximum at ``depth``.

    Measured between the outermost crossings of the level on either side of
    the axis (the field is symmetric), so a side lobe above the level widens
    it. ``width`` is NaN when the level is not reached within the search
    range.
    """

    plane: str
    depth: float
    level_db: float
    width: float
    mode: str
    bandwidth: float


@dataclass(frozen=True)
class FieldMap:
    """The amplitude in a plane through the axis.

    ``amplitude[i, j]`` is at ``depth[i]``, ``lateral[j]``.
    """

    plane: str
    lateral: np.ndarray
    depth: np.ndarray
    amplitude: np.ndarray
    mode: str
    bandwidth: float


def _along(probe, plane: str, offset: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Lateral (x, y) for offsets in a plane of the element."""
    zero = np.zeros_like(offset)
    return (zero, offset) if probe.lateral_axis(plane) == 1 else (offset, zero)


def _across(
    probe, speed, depth, plane, offsets, bandwidth, mode, frequencies, spectrum, single=False
) -> np.ndarray:
    """The amplitude at ``offsets`` (m) across the beam in ``plane``, at one depth."""
    x, y = _along(probe, plane, np.atleast_1d(np.asarray(offsets, dtype=float)))
    return _grid_amplitude(
        probe,
        speed,
        x,
        y,
        [depth],
        bandwidth=bandwidth,
        mode=mode,
        frequencies=frequencies,
        spectrum=spectrum,
        single=single,
    )[0]


def _options(probe, speed, bandwidth, mode):
    check_element(probe)
    speed = check_positive(speed, "speed", "m/s")
    return speed, check_bandwidth(bandwidth), check_mode(mode)


def axial_profile(
    probe,
    speed: float,
    depth,
    *,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> AxialProfile:
    """The amplitude on the axis at ``depth`` (m, above 0).

    Examples
    --------
    >>> from beamspread.probes import Disc
    >>> profile = axial_profile(Disc(0.010, 5e6), 5920, [0.01, 0.02], mode="one-way")
    >>> profile.amplitude.shape
    (2,)
    """
    speed, bandwidth, mode = _options(probe, speed, bandwidth, mode)
    depth = np.atleast_1d(np.asarray(depth, dtype=float))
    amp = _grid_amplitude(
        probe,
        speed,
        [0.0],
        [0.0],
        depth,
        bandwidth=bandwidth,
        mode=mode,
        frequencies=frequencies,
        spectrum=spectrum,
        single=False,
    )[:, 0]
    return AxialProfile(depth, amp, mode, bandwidth)


def last_maximum(
    probe,
    speed: float,
    *,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> float:
    """Depth of the last maximum of the on-axis amplitude, m; NaN if there is none.

    For a continuous wave this is the near-field length; for a broadband pulse
    it is where the on-axis echo (or transmitted pulse) is strongest last,
    which lies nearer the element as the bandwidth grows.

    The axis is scanned (in float32) on 1201 logarithmically spaced depths
    from 0.05 to 4 times ``L**2 / (4 lambda)`` (L the longest side or the
    diameter, lambda at the centre frequency), and, only where that holds no
    maximum, on 801 more from 1e-3 to 0.06 times it; the last local maximum is
    refined in float64 by a golden-section search to a relative 1e-9.

    Examples
    --------
    >>> from beamspread.probes import Disc
    >>> lam = 5920 / 5e6
    >>> n = last_maximum(Disc(0.010, 5e6), 5920)
    >>> round(n / ((0.01**2 - lam**2) / (4 * lam)), 6)
    1.0
    """
    speed, bandwidth, mode = _options(probe, speed, bandwidth, mode)
    wavelength = speed / probe.frequency
    scale = max(float(simple_near_field(probe.longest_side, wavelength)), wavelength)

    def amplitude(depths, single=False):
        return _grid_amplitude(
            probe,
            speed,
            [0.0],
            [0.0],
            np.atleast_1d(depths),
            bandwidth=bandwidth,
            mode=mode,
            frequencies=frequencies,
            spectrum=spectrum,
            single=single,
        )[:, 0]

    # The far part first: its quadrature needs few nodes. Only if it holds no
    # maximum is the part near the face (which needs many) scanned too.
    for lo, hi, count in ((0.05, 4.0, 1201), (1e-3, 0.06, 801)):
        z = np.geomspace(lo * scale, hi * scale, count)
        a = amplitude(z, single=True)
        peaks = np.flatnonzero((a[1:-1] > a[:-2]) & (a[1:-1] >= a[2:])) + 1
        if peaks.size:
            break
    else:
        return float("nan")
    i = int(peaks[-1])
    return golden_max(
        lambda zi: float(amplitude(zi)[0]), float(z[i - 1]), float(z[i + 1]), 1e-9 * float(z[i])
    )


def transverse_profile(
    probe,
    speed: float,
    depth: float,
    offset,
    *,
    plane: str | None = None,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> TransverseProfile:
    """The amplitude at ``depth`` (m) across the beam at lateral ``offset`` (m) in ``plane``.

    Examples
    --------
    >>> from beamspread.probes import Rectangle
    >>> p = transverse_profile(Rectangle(0.02, 0.01, 5e6), 5920, 0.05, [0.0, 0.002], plane="width")
    >>> bool(p.amplitude[0] > p.amplitude[1])
    True
    """
    speed, bandwidth, mode = _options(probe, speed, bandwidth, mode)
    plane = plane_name(probe, plane)
    depth = check_positive(depth, "depth", "m")
    offset = np.atleast_1d(np.asarray(offset, dtype=float))
    amp = _across(probe, speed, depth, plane, offset, bandwidth, mode, frequencies, spectrum)
    return TransverseProfile(plane, depth, offset, amp, mode, bandwidth)


def beam_width(
    probe,
    speed: float,
    depth: float,
    level_db: float = 6.0,
    *,
    plane: str | None = None,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> BeamWidth:
    """Full beam width at ``level_db`` dB below the maximum at ``depth``, in ``plane``.

    Parameters
    ----------
    level_db : float
        dB below the maximum across the beam at that depth (the sign is
        ignored: 6 and -6 both mean 6 dB down).

    Notes
    -----
    The half-plane is sampled from the axis outward (512 offsets, at most a
    quarter of :math:`\\min(\\sqrt{\\lambda z}, \\lambda z / D)` apart so that no lobe
    is missed, widened until the far end lies below the level), the outermost
    sample at or above the level is found, and the crossing beyond it is
    refined, 64-fold a round on 63 samples, to 1e-9 of the width. The width is
    twice that offset. :func:`beam_widths` does several levels on one scan.

    Examples
    --------
    >>> from beamspread.probes import Disc
    >>> w = beam_width(Disc(0.010, 5e6), 5920, 0.1, 6.0)
    >>> 0.010 < w.width < 0.014
    True
    """
    return beam_widths(
        probe,
        speed,
        depth,
        [level_db],
        plane=plane,
        bandwidth=bandwidth,
        mode=mode,
        frequencies=frequencies,
        spectrum=spectrum,
    )[0]


def beam_widths(
    probe,
    speed: float,
    depth: float,
    levels_db,
    *,
    plane: str | None = None,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> list[BeamWidth]:
    """:func:`beam_width` at several levels, sharing the scans across the beam."""
    speed, bandwidth, mode = _options(probe, speed, bandwidth, mode)
    plane = plane_name(probe, plane)
    depth = check_positive(depth, "depth", "m")
    levels = [parse_level(level) for level in levels_db]
    aperture = dict(probe.planes)[plane]
    wavelength = speed / probe.frequency
    spacing = 0.25 * min(math.sqrt(wavelength * depth), wavelength * depth / aperture)

    def amplitude(offsets, single=False):
        return _across(
            probe, speed, depth, plane, offsets, bandwidth, mode, frequencies, spectrum, single
        )

    widths = {}
    extent = max(aperture, 8.0 * wavelength * depth / aperture)
    pending = sorted(set(levels))
    for _ in range(12):
        count = int(min(max(512, math.ceil(extent / spacing)), 8192))
        offsets = np.linspace(0.0, extent, count)
        a = amplitude(offsets, single=True)  # the scan in float32, the crossings in float64
        peak = float(amplitude(offsets[int(np.argmax(a))])[0])
        brackets = {}
        for level in pending:
            threshold = 10.0 ** (-level / 20.0) * peak
            above = np.flatnonzero(a >= threshold)
            if above[-1] < count - 1:  # else not reached yet: widen the scan
                i = int(above[-1])
                brackets[level] = (threshold, float(offsets[i]), float(offsets[i + 1]))
        for level, width in crossings(amplitude, brackets, aperture).items():
            widths[level] = width
            pending.remove(level)
        if not pending:
            break
        extent *= 2.0
    return [
        BeamWidth(plane, depth, level, widths.get(level, float("nan")), mode, bandwidth)
        for level in levels
    ]


def field_map(
    probe,
    speed: float,
    lateral,
    depth,
    *,
    plane: str | None = None,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> FieldMap:
    """The amplitude in the plane through the axis, at ``lateral`` x ``depth`` (1-D arrays, m).

    Computed in float32 (about 1e-6 relative), in blocks of bounded size.

    Examples
    --------
    >>> from beamspread.probes import Disc
    >>> m = field_map(Disc(0.010, 5e6), 5920, [-0.002, 0.0, 0.002], [0.01, 0.02])
    >>> m.amplitude.shape
    (2, 3)
    """
    speed, bandwidth, mode = _options(probe, speed, bandwidth, mode)
    plane = plane_name(probe, plane)
    lateral = np.asarray(lateral, dtype=float).ravel()
    depth = np.asarray(depth, dtype=float).ravel()
    if lateral.size == 0 or depth.size == 0:
        raise InputError("grid: the lateral and depth axes must each hold at least one point")
    x, y = _along(probe, plane, lateral)
    amp = _grid_amplitude(
        probe,
        speed,
        x,
        y,
        depth,
        bandwidth=bandwidth,
        mode=mode,
        frequencies=frequencies,
        spectrum=spectrum,
        single=True,
    )
    return FieldMap(plane, lateral, depth, amp, mode, bandwidth)
