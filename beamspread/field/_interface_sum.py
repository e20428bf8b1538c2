"""The sum over the face for a crossing, block by block of targets (beamspread.field.interface).

How it is made fast, against one Gauss rule for every point and Newton from a
paraxial start on every pair (each measured on a 128 x 256 broadband map
through a wedge, ``tests/benchmarks/bench_interface.py``):

* **Nodes per block.** The targets are taken ``_BLOCK`` at a time, in the
  order given (a map's rows are neighbours). For each block the path lengths
  from a coarse set of face points are fitted by a plane across the face; the
  plane's slope times the half-size is the phase the rule must follow, the
  residual's range is the wavefront curvature on top. A block far down the
  beam needs a few hundred nodes where the whole map's bound needed ten
  thousand.
* **The mirror plane.** The incidence plane is a plane of symmetry of the
  nodes: a block whose targets all lie in it (``y = 0``) sums the nodes with
  ``v > 0`` once, with their weight doubled.
* **Rays.** :func:`beamspread.field._interface_rays.snell_sine` starts from a
  table of the Fermat sine and polishes it by two Newton steps.
* **Transmission.** The coefficient is sampled once per crossing and read
  linearly (:class:`beamspread.field._interface_rays.TransmissionTable`),
  instead of a linear system per pair.
* **Frequencies.** For equally spaced wavenumbers (the sampled spectra) the
  phase factor is stepped, :math:`e^{i(k + \\Delta k)\\phi} =
  e^{ik\\phi}e^{i\\Delta k\\phi}`, one complex product per pair and
  frequency instead of an exponential, in double precision (the products'
  rounding grows as the number of steps times 1e-16; re-seeded by the
  exponential every ``_RESEED`` steps).

Limit: where the rays from the face to a point straddle a critical angle of the
transmission (the transmitted longitudinal wave's, 27.5 deg in acrylic on
steel, seen by a 45 deg shear beam's points near the exit), the coefficient
has a square-root kink across the face and the Gauss rule converges slowly:
ripples of about 0.3 % (up to 1.5 % in the first 10 mm) remain there. A rule
split along the kink's curve on the face would remove them.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from ._interface_rays import TransmissionTable, ray_terms

__all__ = ["face_sum"]

_BLOCK = 32  # targets per block (nodes are chosen per block)
_PAIRS = 262_144  # target x node pairs per chunk (a few MB: the stepping stays in cache)
_RESEED = 64


@lru_cache(maxsize=8)
def _table(transmission, s_max: float) -> TransmissionTable:
    """The sampled coefficient, kept for the next calls with the same one (a width's search)."""
    return TransmissionTable(transmission, s_max)


def _samples(crossing) -> tuple[np.ndarray, np.ndarray, np.ndarray, float]:
    """Coarse face points for the phase fit (the element's rule at 5 nodes a half-size)."""
    e = crossing.element
    u, v, _, curved = e.face_nodes(1.0, 0.0, lambda phase: 5)
    points, _ = crossing.face(u, v, curved)
    return points, u, v, 0.5 * e.longest_side


def block_spread(crossing, targets: np.ndarray, samples=None) -> tuple[float, float]:
    """The linear and curved phases per unit ``k * half-size`` the targets see across the face.

    The largest over the targets of each (see :meth:`Crossing.nodes`).
    """
    points, u, v, half = samples if samples is not None else _samples(crossing)
    delay, _, _ = ray_terms(crossing, points, targets)
    path = delay * crossing.upper_speed  # (M, S), m of upper-medium path
    design = np.c_[np.ones_like(u), u, v]
    coef, *_ = np.linalg.lstsq(design, path.T, rcond=None)  # (3, M)
    residual = path - (design @ coef).T
    slope = np.hypot(coef[1], coef[2]) * half
    curvature = residual.max(axis=1) - residual.min(axis=1)
    return float(np.max(slope)) / half, float(np.max(curvature)) / half


def _phase_sums(a: np.ndarray, phase: np.ndarray, ks: np.ndarray, out: np.ndarray) -> None:
    """out[:, j] = sum_n a e^{i k_j phase} for wavenumbers ks (stepped when equally spaced)."""
    steps = np.diff(ks)
    stepped = ks.size > 2 and np.allclose(steps, steps[0], rtol=1e-9, atol=0.0)
    e = r = None
    for j, k in enumerate(ks):
        if not stepped or j % _RESEED == 0:
            e = np.exp(1j * k * phase)
            if stepped and r is None:
                r = np.exp(1j * steps[0] * phase)
        else:
            e *= r
        out[:, j] = np.einsum("mn,mn->m", a, e)


def face_sum(crossing, targets: np.ndarray, ks: np.ndarray) -> np.ndarray:
    """:math:`\\sum_n w_n T_n A_n e^{ik\\phi_n}` for every target and wavenumber, (M, F) complex."""
    out = np.zeros((targets.shape[0], ks.size), dtype=complex)
    k_max = float(ks.max())
    c1 = crossing.upper_speed
    n = crossing.lower_speed / c1
    table = None
    if crossing.transmission is not None:
        table = _table(crossing.transmission, 1.0 if n <= 1.0 else 1.0 / n)
    samples = _samples(crossing)
    for start in range(0, targets.shape[0], _BLOCK):
        block = targets[start : start + _BLOCK]
        sources, weight = crossing.nodes(k_max, *block_spread(crossing, block, samples))
        if not block[:, 1].any():  # all in the incidence plane, the nodes' mirror plane
            v = sources[:, 1]
            keep = v >= 0.0
            sources = sources[keep]
            weight = np.where(v[keep] > 0.0, 2.0 * weight[keep], weight[keep])
        chunk = max(1, _PAIRS // sources.shape[0])
        for first in range(0, block.shape[0], chunk):
            part = block[first : first + chunk]
            delay, amplitude, sine = ray_terms(crossing, sources, part)
            a = amplitude * weight[None, :]
            a = a * table(sine) if table is not None else a.astype(complex)
            rows = slice(start + first, start + first + part.shape[0])
            _phase_sums(a, delay * c1, ks, out[rows])
    return out
