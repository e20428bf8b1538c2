"""The field of a focused element in the paraxial (Fresnel) approximation.

A spherically focused disc of radius :math:`a` and focal length :math:`F` is
taken as a flat disc whose face carries the focusing delay: the rim fires
early by the path :math:`\\rho^2/2F` (the depth of the sphere at radius
:math:`\\rho`, paraxially). In the Fresnel approximation of the Rayleigh
integral (time dependence :math:`e^{i\\omega t}`, as in
:mod:`beamspread.field.engine`) the angle round the axis integrates to
:math:`2\\pi J_0`, and at depth :math:`z` and distance :math:`r` from the axis

.. math:: \\frac{p(r, z)}{\\rho c U_0} = \\frac{i k}{z}\\,
   e^{-ik(z + r^2/2z)} \\int_0^a e^{-i\\alpha\\rho^2}\\,
   J_0\\!\\left(\\frac{k r \\rho}{z}\\right) \\rho\\,d\\rho, \\qquad
   \\alpha = \\frac{k}{2}\\left(\\frac{1}{z} - \\frac{1}{F}\\right).

On the axis this is O'Neil's (1949) paraxial result
:math:`|p| = 2|\\sin(k a^2(1/z - 1/F)/4)| / |1 - z/F|`, and in the focal plane
:math:`|p| = (k a^2/2F)\\,|2 J_1(x)/x|`, :math:`x = k a r/F`. ``F = inf`` gives
the unfocused disc's Fresnel field.

A rectangle of half-sides :math:`a` (length, along x) and :math:`b` (width,
along y) focused cylindrically in its length plane separates into two line
integrals,

.. math:: \\frac{p}{\\rho c U_0} = \\frac{i k}{2\\pi z} e^{-ik(z + (x^2 + y^2)/2z)}
   \\int_{-a}^{a} e^{-i\\alpha\\xi^2} e^{ikx\\xi/z} d\\xi
   \\int_{-b}^{b} e^{-ik\\eta^2/2z} e^{iky\\eta/z} d\\eta ,

the first with the focusing term in :math:`\\alpha`, the second without.

Each integral is summed by Gauss-Legendre quadrature over the half-aperture
with enough nodes for its phase: :math:`\\lceil\\Phi/2\\rceil + 24`, where
:math:`\\Phi = |\\alpha| a^2 + k r a / z` is the largest phase the integrand
turns through at the highest frequency (Gauss-Legendre integrates a wave of
total phase :math:`\\Phi` to rounding level from about :math:`\\Phi/2` nodes). The
Bessel function is that of Abramowitz and Stegun 9.4.1 and 9.4.3 (absolute
error below 5e-8), so no scipy is needed. Broadband pulses and pulse-echo are
formed exactly as for the flat element (:mod:`beamspread.field.engine`): the
drive :math:`W(f)(f_0/f)^m` and the spectral RMS of :math:`|p|^m`. The
paraxial pressure at the geometric focus, :math:`k a^2/2F`, grows with the
frequency as a flat element's far-field pressure does, so with this drive the
echo from a small reflector at the focus has the measured spectrum
:math:`W`.

Limits: the Fresnel approximation holds where the depth is large beside the
aperture (beyond about one diameter; within it the neglected phase
:math:`k a^4/8z^3` grows past a radian) and for gentle focusing (radius / F
below about 0.3).

References
----------
H. T. O'Neil, "Theory of focusing radiators", J. Acoust. Soc. Am. 21, 516
(1949). J. W. Goodman, *Introduction to Fourier Optics*, the Fresnel
approximation and the lens's quadratic phase. M. Abramowitz and I. A. Stegun,
*Handbook of Mathematical Functions*, 9.4.1 and 9.4.3.
"""

from __future__ import annotations

import math

import numpy as np

from ..errors import InputError
from ..probes import check_element, check_positive, element_class, kinds, plane_name
from ..units import parse_level
from .engine import check_mode
from .profiles import BeamWidth
from .spectrum import check_bandwidth, make_spectrum

__all__ = ["focused_amplitude", "focused_beam_widths", "focused_pressure"]

_MAX_ROUNDS = 12  # the scan across the beam doubles its extent at most this often


def _check_focus(probe, focal_length) -> float:
    try:
        big_f = float(focal_length)
    except (TypeError, ValueError):
        raise InputError(f"focal length: {focal_length!r} is not a number") from None
    half = probe.focused_half_aperture
    if not big_f > half:  # also refuses NaN; inf (no focus) is allowed
        raise InputError(
            f"focal length: {big_f * 1e3:g} mm is not allowed; it must lie in front of the "
            f"element, beyond its {probe.focus_half_name} ({half * 1e3:g} mm)"
        )
    return big_f


def _check_probe(probe):
    check_element(probe)
    if probe.focus_kind is None:
        focusable = [f"a {k} ({element_class(k).focus_kind} focus)" for k in kinds(probe=True)]
        raise InputError(f"probe: {probe!r} cannot be focused here; give {' or '.join(focusable)}")


def _pressures(probe, focal_length, offsets, depths, wavenumbers, plane):
    """|p| / (rho c U0) on offsets in ``plane`` x depths, per wavenumber: shape (D, F, R)."""
    return probe.focused_pressures(focal_length, offsets, depths, wavenumbers, plane)


def focused_pressure(
    probe,
    speed: float,
    focal_length: float,
    offset,
    depth,
    *,
    plane: str | None = None,
    frequency: float | None = None,
) -> np.ndarray:
    """Continuous-wave paraxial pressure amplitude of a focused element, in units of rho c U0.

    Parameters
    ----------
    probe : Disc or Rectangle
        A disc is focused spherically, a rectangle cylindrically in its length plane.
    speed : float
        Sound speed of the medium the focal length is given in, m/s.
    focal_length : float
        m, beyond the element's radius (half-length); ``math.inf`` for no focus.
    offset, depth : array_like
        Distance from the axis in ``plane`` and depth from the face, m, 1-D.
    plane : str, optional
        ``"diameter"`` for a disc; ``"length"`` (the focused plane, the
        default) or ``"width"`` for a rectangle.
    frequency : float, optional
        Hz; the probe's frequency by default.

    Returns
    -------
    ndarray, shape (depths, offsets)
        :math:`|p| / \\rho c U_0` from the formulas of the module notes.

    Examples
    --------
    At the focus of a disc the paraxial amplitude is :math:`k a^2 / 2F`:

    >>> from beamspread import Disc
    >>> disc = Disc(0.0127, 5e6)
    >>> k = 2 * math.pi * 5e6 / 1480.0
    >>> p = focused_pressure(disc, 1480.0, 0.05, [0.0], [0.05])
    >>> round(float(p[0, 0] / (k * 0.00635**2 / (2 * 0.05))), 9)
    1.0
    """
    speed, big_f, plane = _checked(probe, speed, focal_length, plane)
    f = probe.frequency if frequency is None else check_positive(frequency, "frequency", "Hz")
    offsets, depths = _points(offset, depth)
    k = np.array([2.0 * math.pi * f / speed])
    return _pressures(probe, big_f, offsets, depths, k, plane)[:, 0, :]


def _checked(probe, speed, focal_length, plane):
    """The public functions' shared checks: the probe, the speed, the focus and the plane."""
    _check_probe(probe)
    speed = check_positive(speed, "speed", "m/s")
    return speed, _check_focus(probe, focal_length), plane_name(probe, plane)


def _points(offset, depth):
    offsets = np.abs(np.atleast_1d(np.asarray(offset, dtype=float))).ravel()
    depths = np.atleast_1d(np.asarray(depth, dtype=float)).ravel()
    if not (np.isfinite(offsets).all() and np.isfinite(depths).all()):
        raise InputError("field points: every coordinate must be a finite number")
    if depths.size and depths.min() <= 0.0:
        raise InputError(
            f"depth: {depths.min()!r} m is not allowed; field points must lie in front of the "
            "face (z above 0)"
        )
    return offsets, depths


def focused_amplitude(
    probe,
    speed: float,
    focal_length: float,
    offset,
    depth,
    *,
    plane: str | None = None,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> np.ndarray:
    """Continuous-wave or broadband amplitude of a focused element's paraxial field.

    As :func:`beamspread.field.field_amplitude` (the same spectrum, drive and
    spectral RMS; pulse-echo is :math:`|p|^2` at each frequency) for the
    field of :func:`focused_pressure`, on ``offset`` x ``depth`` (1-D, m).

    Returns
    -------
    ndarray, shape (depths, offsets)

    Examples
    --------
    >>> from beamspread import Disc
    >>> a = focused_amplitude(Disc(0.0127, 5e6), 1480.0, 0.05, [0.0, 0.001], [0.05])
    >>> a.shape, bool(a[0, 0] > a[0, 1])
    ((1, 2), True)
    """
    speed, big_f, plane = _checked(probe, speed, focal_length, plane)
    bandwidth = check_bandwidth(bandwidth)
    mode = check_mode(mode)
    offsets, depths = _points(offset, depth)
    spec = make_spectrum(spectrum, probe.frequency, bandwidth, frequencies)
    return _amplitude(probe, speed, big_f, offsets, depths, plane, spec, mode)


def _amplitude(probe, speed, focal_length, offsets, depths, plane, spec, mode):
    ks = 2.0 * math.pi * spec.frequencies / speed
    p = _pressures(probe, focal_length, offsets, depths, ks, plane)  # (D, F, R)
    power = 2 if mode == "pulse-echo" else 1
    energy = spec.source_weights(mode)
    return np.sqrt(np.einsum("f,dfr->dr", energy, p ** (2 * power)))


def focused_beam_widths(
    probe,
    speed: float,
    focal_length: float,
    depth: float,
    levels_db,
    *,
    plane: str | None = None,
    bandwidth: float = 0.0,
    mode: str = "pulse-echo",
    frequencies: int = 32,
    spectrum: str = "gaussian",
) -> list[BeamWidth]:
    """Full widths of a focused element's beam at ``depth`` (m), at each level below the maximum.

    The width lies between the outermost crossings of the level below the
    largest amplitude across the beam at that depth (:func:`focused_amplitude`),
    as :func:`beamspread.field.beam_widths` measures the flat element's.

    Notes
    -----
    The half-plane is sampled from the axis out to the geometric edge of the
    converging (or diverging) cone, :math:`a|1 - z/F|`, plus four diffraction
    widths :math:`\\lambda z / a` (a jinc's first null lies at
    :math:`0.61\\lambda z / a`), at least 64 samples and at most
    :math:`\\lambda z / 8a` apart (four a lobe), :math:`\\lambda` at the centre
    frequency as :func:`beamspread.field.beam_widths` takes it; the extent is
    doubled until the far end lies below every level.
    The largest sample off the axis is refined by a golden-section search; each
    outermost crossing is bracketed by the samples and refined by the Illinois
    (modified regula falsi) method to 1e-10 of the aperture.

    Examples
    --------
    The -6 dB pulse-echo focal spot of a disc, about 1.027 F lambda / D:

    >>> from beamspread import Disc
    >>> disc = Disc(0.0127, 5e6)
    >>> w = focused_beam_widths(disc, 1480.0, 0.05, 0.05, [6], bandwidth=0.0)[0]
    >>> round(w.width / (0.05 * 1480.0 / 5e6 / 0.0127), 3)
    1.027
    """
    speed, big_f, plane = _checked(probe, speed, focal_length, plane)
    bandwidth = check_bandwidth(bandwidth)
    mode = check_mode(mode)
    depth = check_positive(depth, "depth", "m")
    levels = [parse_level(level) for level in levels_db]
    spec = make_spectrum(spectrum, probe.frequency, bandwidth, frequencies)
    half = 0.5 * dict(probe.planes)[plane]
    lam = speed / probe.frequency
    z = np.array([depth])

    def amplitude(offsets):
        return _amplitude(probe, speed, big_f, np.atleast_1d(offsets), z, plane, spec, mode)[0]

    focused = plane == probe.focused_plane
    converge = depth / big_f if focused and not math.isinf(big_f) else 0.0
    spacing = lam * depth / (8.0 * half)
    extent = half * abs(1.0 - converge) + 4.0 * lam * depth / half
    tol = 1e-10 * half
    widths: dict[float, float] = {}
    pending = sorted(set(levels))
    peak = None
    for _ in range(_MAX_ROUNDS):
        count = int(min(max(64, math.ceil(extent / spacing) + 1), 8192))
        offsets = np.linspace(0.0, extent, count)
        a = amplitude(offsets)
        if peak is None:
            peak = _peak(amplitude, offsets, a)
        for level in list(pending):
            threshold = 10.0 ** (-level / 20.0) * peak
            above = np.flatnonzero(a >= threshold)
            last = int(above[-1])
            if last == count - 1:
                continue  # not reached yet: widen the scan
            widths[level] = 2.0 * _crossing(
                lambda r, t=threshold: float(amplitude(r)[0]) - t,
                float(offsets[last]),
                float(offsets[last + 1]),
                float(a[last]) - threshold,
                float(a[last + 1]) - threshold,
                tol,
            )
            pending.remove(level)
        if not pending:
            break
        extent *= 2.0
    return [
        BeamWidth(plane, depth, level, widths.get(level, float("nan")), mode, bandwidth)
        for level in levels
    ]


def _peak(amplitude, offsets, a) -> float:
    """The largest amplitude across the beam: the largest sample, refined if off the axis."""
    from .._search import golden_max

    i = int(np.argmax(a))
    if i == 0:
        return float(a[0])
    lo, hi = float(offsets[i - 1]), float(offsets[min(i + 1, offsets.size - 1)])
    at = golden_max(lambda r: float(amplitude(r)[0]), lo, hi, 1e-9 * hi)
    return max(float(a[i]), float(amplitude(at)[0]))


def _crossing(g, lo, hi, g_lo, g_hi, tol) -> float:
    """A root of ``g`` in [lo, hi] with g(lo) >= 0 > g(hi): the Illinois method."""
    kept = 0
    for _ in range(200):
        if hi - lo <= tol:
            break
        m = (lo * g_hi - hi * g_lo) / (g_hi - g_lo)
        if not lo < m < hi:
            m = 0.5 * (lo + hi)
        g_m = g(m)
        if g_m >= 0.0:
            lo, g_lo = m, g_m
            if kept == 1:
                g_hi *= 0.5
            kept = 1
        else:
            hi, g_hi = m, g_m
            if kept == -1:
                g_lo *= 0.5
            kept = -1
        if g_m == 0.0:
            return m
    return 0.5 * (lo + hi)
