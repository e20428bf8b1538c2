"""The engine's node sums over lateral rows x depths x wavenumbers (:mod:`.engine`).

The boundary tables of :mod:`._boundary` give, per lateral row, squared
distances ``q`` and weights ``W``; here they become :math:`S/2` with
:math:`S = \\sum_j W_j(1 - e^{-ik\\Delta_j})` at every depth and wavenumber,
block after block within a memory budget, BLAS held to one thread.
"""

from __future__ import annotations

import numpy as np

from ._threads import one_blas_thread

__all__ = ["node_sums"]

_BUDGET = 1 << 18  # elements of one (lateral x depth x node) block: about 1 MB in float32
_RESEED = 8  # stepped phasors are recomputed from sin and cos this often


def _row_chunks(used: np.ndarray, depths: int):
    """Rows in order of node count, cut so a block holds at most about _BUDGET elements."""
    order = np.argsort(used, kind="stable")
    start = 0
    while start < order.size:
        stop = start + 1
        nodes = max(int(used[order[start]]), 1)
        while stop < order.size:
            wider = max(int(used[order[stop]]), 1)
            if (stop + 1 - start) * depths * wider > _BUDGET:
                break
            nodes = wider
            stop += 1
        yield order[start:stop], nodes
        start = stop


def node_sums(q, weight, used, z, wavenumbers, dtype, reduce):
    """Evaluate the boundary sums, with BLAS on one thread (:mod:`._threads`)."""
    with one_blas_thread():
        _threaded_sums(q, weight, used, z, wavenumbers, dtype, reduce)


def _threaded_sums(q, weight, used, z, wavenumbers, dtype, reduce):
    """Evaluate the boundary sums over lateral rows x depths for each wavenumber.

    ``z`` has shape (1, D) (the same depths for every row) or (L, 1) (one
    depth per row). ``reduce(rows, depth_slice, k_index, re, im)`` receives the
    real and imaginary parts of :math:`S/2`, :math:`S = \\sum_j W_j(1 - e^{-ik\\Delta_j})`.
    Work arrays are allocated once and reused, block after block.

    In float32 with several evenly spaced wavenumbers the phasors
    :math:`e^{-ik\\Delta}` are stepped from one wavenumber to the next by one
    complex multiplication, re-seeded from sin and cos every ``_RESEED``
    steps; otherwise :math:`S/2 = \\sum W(\\sin^2 h + i \\sin h \\cos h)`,
    :math:`h = k\\Delta/2`, at each wavenumber.
    """
    per_row = z.shape[0] != 1
    depths = z.shape[1]
    ks = np.asarray(wavenumbers, dtype=float)
    stepped = (
        dtype is np.float32
        and ks.size > 2
        and np.allclose(np.diff(ks), ks[1] - ks[0], rtol=1e-9, atol=0.0)
    )
    work = np.empty((4, _BUDGET), dtype=dtype)
    phasors = np.empty((2, _BUDGET), dtype=np.complex64) if stepped else None
    half_k = [dtype(0.5 * k) for k in ks]
    for rows, nodes in _row_chunks(used, 1 if per_row else depths):
        qc = q[rows, :nodes].astype(dtype)[:, None, :]
        wc = weight[rows, :nodes].astype(dtype)[:, :, None]
        total_weight = weight[rows, :nodes].sum(axis=1)[:, None]
        wz = wc.astype(np.complex64) if stepped else None
        step = max(1, _BUDGET // (rows.size * nodes))
        for d0 in range(0, depths, step):
            sl = slice(d0, min(depths, d0 + step))
            zc = (z[rows] if per_row else z)[:, sl].astype(dtype)[:, :, None]
            shape = (rows.size, zc.shape[1], nodes)
            size = shape[0] * shape[1] * shape[2]
            delta, h, s, c = (work[i, :size].reshape(shape) for i in range(4))
            np.add(qc, zc * zc, out=delta)
            np.sqrt(delta, out=delta)
            delta += zc
            np.divide(qc, delta, out=delta)  # sqrt(z^2 + q) - z without cancellation
            if stepped:
                u, rotate = (phasors[i, :size].reshape(shape) for i in range(2))
                np.multiply(delta, dtype(ks[1] - ks[0]), out=h)
                np.cos(h, out=rotate.real)
                np.sin(h, out=rotate.imag)
                np.negative(rotate.imag, out=rotate.imag)
            for i, hk in enumerate(half_k):
                if stepped and i % _RESEED:
                    u *= rotate
                elif stepped:
                    np.multiply(delta, dtype(2.0 * hk), out=h)
                    np.cos(h, out=u.real)
                    np.sin(h, out=u.imag)
                    np.negative(u.imag, out=u.imag)
                if stepped:
                    total = np.matmul(u, wz)[..., 0]
                    reduce(rows, sl, i, 0.5 * (total_weight - total.real), -0.5 * total.imag)
                    continue
                np.multiply(delta, hk, out=h)
                np.sin(h, out=s)
                np.cos(h, out=c)
                c *= s
                s *= s
                re = np.matmul(s, wc)[..., 0]
                im = np.matmul(c, wc)[..., 0]
                reduce(rows, sl, i, re, im)
