"""The aperture integrals of a focused element's paraxial field (see :mod:`.focused`).

Each element type composes its focused field from these
(:meth:`beamspread.probes.Element.focused_pressures`).
"""

from __future__ import annotations

import math

import numpy as np

from .._bessel import j0
from ._boundary import gauss_legendre, node_ladder
from ._threads import one_blas_thread

__all__ = ["aperture_integrals"]

_BUDGET = 1 << 18  # real elements of one (depth x frequency x offset x node) block


def _node_count(phase: float) -> int:
    """Gauss-Legendre nodes for a total phase change across the half-aperture."""
    return int(
        node_ladder(
            np.array([math.ceil(0.5 * phase) + 24]),
            "the focused element's field here (the depth is too close to the face for its "
            "paraxial field to be of use)",
        )[0]
    )


def aperture_integrals(half, radial, alpha, beta):
    """The aperture integrals of :mod:`beamspread.field.focused`, complex, shape (D, F, R).

    ``alpha`` (D, F) is the quadratic phase coefficient per depth and
    frequency, ``beta`` (D, F, R) the linear one (:math:`k r / z`) per offset.
    ``radial`` true for the radial integral of a disc
    (:math:`\\int_0^a ... J_0(\\beta\\rho)\\rho\\,d\\rho`), false for a line across a side
    (:math:`\\int_{-a}^{a} ... e^{i\\beta\\xi} d\\xi`).
    """
    phase = float(np.max(np.abs(alpha))) * half * half + float(np.max(np.abs(beta))) * half
    t, w = gauss_legendre(_node_count(phase))
    rho = half * t
    weight = half * w * (rho if radial else 2.0)
    arg = alpha[..., None] * (rho * rho)  # (D, F, n)
    e_re = weight * np.cos(arg)
    e_im = -weight * np.sin(arg)
    d, f, r = beta.shape
    out = np.empty((d, f, r), dtype=complex)
    kernel = j0 if radial else np.cos
    step = max(1, _BUDGET // (f * rho.size))
    with one_blas_thread():
        for i in range(0, d):
            for j in range(0, r, step):
                k = kernel(beta[i, :, j : j + step, None] * rho)  # (F, Rc, n)
                out[i, :, j : j + step].real = np.matmul(k, e_re[i][:, :, None])[..., 0]
                out[i, :, j : j + step].imag = np.matmul(k, e_im[i][:, :, None])[..., 0]
    return out
