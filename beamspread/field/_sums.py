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
_REACH = 16  # stepped phasors go at most this many steps up or down from a seed
# node x depth evaluations from which stepping pays for its Python loop over wavenumbers
_STEPPED_FROM = {np.float32: 4096, np.float64: 256}
_DEPTH_LAST = 1  # depths go last in a block when there are at least this many times the nodes


def _row_chunks(used: np.ndarray, depths: int):
    """Rows in order of node count, cut so a block holds at most about _BUDGET elements."""
    order = np.argsort(used, kind="stable")
    width = np.maximum(used[order], 1)
    start = 0
    while start < order.size:
        # rows start..i in one block cost (i - start + 1) x depths x width[i], growing with i
        cost = np.arange(1, order.size - start + 1) * depths * width[start:]
        stop = start + max(1, int(np.searchsorted(cost, _BUDGET, side="right")))
        yield order[start:stop], int(width[stop - 1])
        start = stop


def _block_size(q, z, count: int) -> int:
    """The most elements a block can hold: the budget, or the whole problem if smaller."""
    return min(
        _BUDGET, q.shape[0] * max(q.shape[1], 1) * (z.shape[1] if z.shape[0] == 1 else 1) * count
    )


def _seeds(count: int) -> list[tuple[int, int, int]]:
    """(first, seed, stop) of each run of wavenumbers stepped from one seed in its middle."""
    span = 2 * _REACH + 1
    runs = []
    for first in range(0, count, span):
        stop = min(count, first + span)
        runs.append((first, min(first + _REACH, stop - 1), stop))
    return runs


def node_sums(q, weight, used, z, wavenumbers, dtype, reduce):
    """Evaluate the boundary sums, with BLAS on one thread (:mod:`._threads`).

    ``z`` has shape (1, D) (the same depths for every row) or (L, 1) (one
    depth per row). ``reduce(rows, depth_slice, k_slice, re, im)`` receives
    the real and imaginary parts of :math:`S/2`,
    :math:`S = \\sum_j W_j(1 - e^{-ik\\Delta_j})`, with shape
    (wavenumbers in ``k_slice``, rows, depths in ``depth_slice``).
    """
    ks = np.asarray(wavenumbers, dtype=float)
    evaluations = int(used.sum()) * (z.shape[1] if z.shape[0] == 1 else 1)
    stepped = (
        ks.size > 2
        and evaluations >= _STEPPED_FROM[dtype]
        and bool(np.all(np.abs(np.diff(ks) - (ks[1] - ks[0])) <= 1e-9 * abs(ks[1] - ks[0])))
    )
    with one_blas_thread():
        if stepped:
            _stepped_sums(q, weight, used, z, ks, dtype, reduce)
        else:
            _direct_sums(q, weight, used, z, ks, dtype, reduce)


def _layout(q, weight, z, rows, nodes, sl, per_row, dtype):
    """q, W and z of a block, shaped so that the longer of depths and nodes is the last axis.

    numpy's broadcasting loops pay per pass over the last axis; with few nodes
    and many depths (a map), depths go last: q (rows, nodes, 1), W (rows, 1,
    nodes), z (rows or 1, 1, depths), and a sum over nodes is ``W @ x``. Otherwise
    nodes go last: q (rows, 1, nodes), W (rows, nodes, 1), z (rows or 1,
    depths, 1), and the sum is ``x @ W``.
    """
    zc = (z[rows] if per_row else z)[:, sl].astype(dtype)
    qc = q[rows, :nodes].astype(dtype)
    wc = weight[rows, :nodes].astype(dtype)
    if zc.shape[1] >= _DEPTH_LAST * nodes:
        return qc[:, :, None], wc[:, None, :], zc[:, None, :], True
    return qc[:, None, :], wc[:, :, None], zc[:, :, None], False


def _delta(qc, zc, out):
    """sqrt(z^2 + q) - z without cancellation, q / (sqrt(z^2 + q) + z), into ``out``."""
    np.add(qc, zc * zc, out=out)
    np.sqrt(out, out=out)
    out += zc
    np.divide(qc, out, out=out)
    return out


def _node_sum(x, w, depth_last):
    """Sum of W x over nodes, shape (..., depths)."""
    return np.matmul(w, x)[..., 0, :] if depth_last else np.matmul(x, w)[..., 0]


def _direct_sums(q, weight, used, z, ks, dtype, reduce):
    """:math:`S/2 = \\sum W(\\sin^2 h + i \\sin h \\cos h)`, :math:`h = k\\Delta/2`.

    Every wavenumber of a block at once (one product per row over wavenumbers
    x depths x nodes), so that small problems make few numpy calls.
    """
    per_row = z.shape[0] != 1
    depths = z.shape[1]
    count = ks.size
    half_k = np.array([dtype(0.5 * k) for k in ks], dtype=dtype)
    work = np.empty((4, _block_size(q, z, count)), dtype=dtype)
    for rows, nodes in _row_chunks(used, (1 if per_row else depths) * count):
        per_depth = rows.size * nodes
        group = count if per_depth * count <= _BUDGET else max(1, _BUDGET // per_depth)
        step = max(1, _BUDGET // (per_depth * group))
        for d0 in range(0, depths, step):
            sl = slice(d0, min(depths, d0 + step))
            qc, wc, zc, depth_last = _layout(q, weight, z, rows, nodes, sl, per_row, dtype)
            dd = zc.shape[-1] if depth_last else zc.shape[1]
            inner = (nodes, dd) if depth_last else (dd, nodes)
            delta = _delta(qc, zc, work[0, : per_depth * dd].reshape(rows.size, *inner))
            for f0 in range(0, count, group):
                fs = slice(f0, min(count, f0 + group))
                g = fs.stop - fs.start
                shape = (rows.size, g, *inner)
                size = shape[0] * shape[1] * shape[2] * shape[3]
                h, s, c = (work[i, :size].reshape(shape) for i in (1, 2, 3))
                np.multiply(delta[:, None], half_k[fs, None, None], out=h)
                np.sin(h, out=s)
                np.cos(h, out=c)
                c *= s
                s *= s
                if depth_last:
                    re = _node_sum(s, wc[:, None], True)
                    im = _node_sum(c, wc[:, None], True)
                else:
                    flat = (rows.size, g * dd, nodes)
                    re = _node_sum(s.reshape(flat), wc, False).reshape(rows.size, g, dd)
                    im = _node_sum(c.reshape(flat), wc, False).reshape(rows.size, g, dd)
                reduce(rows, sl, fs, re.transpose(1, 0, 2), im.transpose(1, 0, 2))


def _stepped_sums(q, weight, used, z, ks, dtype, reduce):
    """Evenly spaced wavenumbers: the phasors stepped between them.

    :math:`e^{-ik\\Delta}` is computed from sin and cos at a seed wavenumber
    in the middle of each run of ``2 _REACH + 1`` and carried to its
    neighbours, up and down, by one complex multiplication a step;
    :math:`S/2 = (\\sum W - \\sum W e^{-ik\\Delta}) / 2`.
    """
    per_row = z.shape[0] != 1
    depths = z.shape[1]
    count = ks.size
    complex_type = np.complex64 if dtype is np.float32 else np.complex128
    runs = _seeds(count)
    size = _block_size(q, z, 1)
    real = np.empty((2, size), dtype=dtype)
    phasors = np.empty((4, size), dtype=complex_type)
    k_seed = [dtype(2.0 * dtype(0.5 * k)) for k in ks]
    dk = dtype(ks[1] - ks[0])
    for rows, nodes in _row_chunks(used, 1 if per_row else depths):
        total_weight = weight[rows, :nodes].sum(axis=1)[:, None].astype(dtype)
        step = max(1, _BUDGET // (rows.size * nodes))
        for d0 in range(0, depths, step):
            sl = slice(d0, min(depths, d0 + step))
            qc, wc, zc, depth_last = _layout(q, weight, z, rows, nodes, sl, per_row, dtype)
            wz = wc.astype(complex_type)
            dd = zc.shape[-1] if depth_last else zc.shape[1]
            shape = (rows.size, nodes, dd) if depth_last else (rows.size, dd, nodes)
            size = shape[0] * shape[1] * shape[2]
            delta, h = (real[i, :size].reshape(shape) for i in range(2))
            seed, u, up, down = (phasors[i, :size].reshape(shape) for i in range(4))
            _delta(qc, zc, delta)
            np.multiply(delta, dk, out=h)
            np.cos(h, out=up.real)
            np.sin(h, out=up.imag)
            np.negative(up.imag, out=up.imag)
            np.conjugate(up, out=down)
            totals = np.empty((count, rows.size, dd), dtype=complex_type)
            for first, centre, stop in runs:
                np.multiply(delta, k_seed[centre], out=h)
                np.cos(h, out=seed.real)
                np.sin(h, out=seed.imag)
                np.negative(seed.imag, out=seed.imag)
                totals[centre] = _node_sum(seed, wz, depth_last)
                if centre > first:
                    np.multiply(seed, down, out=u)
                    totals[centre - 1] = _node_sum(u, wz, depth_last)
                    for i in range(centre - 2, first - 1, -1):
                        u *= down
                        totals[i] = _node_sum(u, wz, depth_last)
                for i in range(centre + 1, stop):
                    seed *= up
                    totals[i] = _node_sum(seed, wz, depth_last)
            re = 0.5 * (total_weight - totals.real)
            reduce(rows, sl, slice(0, count), re, -0.5 * totals.imag)
