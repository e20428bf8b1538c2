"""The equivalent two-way beam angle of a flat piston, by quadrature of its pattern."""

from __future__ import annotations

from .._checks import check_positive
from ..probes import Probe, check_element


def equivalent_beam_angle(probe: Probe, wavelength: float) -> float:
    """Equivalent two-way beam angle psi, sr: the integral of b^2 over the half space.

    Parameters
    ----------
    probe : Disc or Rectangle
    wavelength : float
        m.

    Returns
    -------
    float
        :math:`\\psi = \\int b^2\\, d\\Omega` with :math:`b = D^2` the one-way
        intensity pattern (so :math:`b^2 = D^4`, transmit times receive), in
        steradians; :math:`10\\log_{10}\\psi` is the figure echo-sounder
        volume-backscatter work quotes.

    Notes
    -----
    The definition is Urick's (*Principles of Underwater Sound*, the
    equivalent two-way beam width of a transducer). For a large disc
    :math:`\\psi \\approx 5.78/(ka)^2` (from memory; the tests check it
    numerically). Computed by Gauss-Legendre quadrature over the polar angle
    (and the azimuth, for a rectangle), out to where the pattern argument
    reaches 400 (the fourth power of the pattern is below 1e-9 of its peak
    there and the remaining tail below 1e-5 of the integral).

    Examples
    --------
    >>> import numpy as np
    >>> ka = np.pi * 0.1 / 0.001
    >>> from beamspread import Disc
    >>> round(equivalent_beam_angle(Disc(0.1, 1.0), 0.001) * ka**2, 2)
    5.78
    """
    check_element(probe)
    wavelength = check_positive(wavelength, "wavelength", "m")
    return probe.equivalent_beam_angle(wavelength)
