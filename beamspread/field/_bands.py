"""Depth-banded node tables: fewer boundary nodes for the deeper points of a grid.

The node count of a boundary table (:mod:`._boundary`) is set by the phase
change along each piece of the boundary at the shallowest depth it serves;
deeper, the phase changes less and fewer nodes reach the same accuracy. A large
enough grid of depths is therefore cut into bands growing by ``_RATIO``; each
band gets a table built for its own shallowest depth, except that a band whose
table would save less than ``_MERGE`` node evaluations over its shallower
neighbour's (judged on ``_SAMPLE`` of the rows) joins that neighbour. The kept
bands' tables are built in one call.
"""

from __future__ import annotations

import numpy as np

__all__ = ["banded"]

_RATIO = 1.5  # each band starts this many times deeper than the one before
_MAX_BANDS = 12
_MERGE = 16384  # node x depth evaluations a separate band must save
_BANDED_FROM = 100_000  # lateral x depth x frequency points from which bands pay
_SAMPLE = 8  # lateral rows on which the bands' node counts are judged


def banded(table, lateral, depths, evaluate, wavenumbers: int = 1) -> np.ndarray:
    """Evaluate lateral rows x ``depths`` band by band; returns shape (rows, depths).

    Parameters
    ----------
    table : callable
        ``table(lateral, z_min)`` returns ``(q, weight, used)`` for lateral
        positions (a tuple of arrays) and one shallowest depth per row.
    lateral : tuple of ndarray
        The distinct lateral positions (each component shape (rows,)).
    depths : ndarray, shape (D,)
        Depths, m, above 0, in any order.
    evaluate : callable
        ``evaluate(q, weight, used, z)`` with ``z`` of shape (1, d) returns
        the result on rows x d.
    wavenumbers : int
        Frequencies each evaluation sums over. Below ``_BANDED_FROM`` points x
        frequencies the tables would cost more than they save: one table serves
        every depth.
    """
    depths = np.asarray(depths, dtype=float).ravel()
    rows = lateral[0].size
    if rows * depths.size * wavenumbers < _BANDED_FROM:
        return evaluate(*table(lateral, float(depths.min())), depths[None, :])
    order = np.argsort(depths, kind="stable")
    z = depths[order]
    edges = z[0] * _RATIO ** np.arange(1, _MAX_BANDS)
    band = np.searchsorted(edges[edges <= z[-1]], z, side="right")
    firsts = np.flatnonzero(np.r_[True, band[1:] != band[:-1]])
    bounds = np.r_[firsts, z.size]
    lows = z[firsts]
    groups = [[0, bounds[0], bounds[1]]]
    if lows.size > 1:  # which bands pay for their own table, judged on a few rows
        sample = np.arange(0, rows, -(-rows // _SAMPLE))
        picked = tuple(np.tile(component[sample], lows.size) for component in lateral)
        cost = table(picked, np.repeat(lows, sample.size))[2].reshape(lows.size, -1)
        cost = cost.sum(axis=1) * (rows / sample.size)
    for j in range(1, lows.size):
        if (cost[groups[-1][0]] - cost[j]) * (bounds[j + 1] - bounds[j]) <= _MERGE:
            groups[-1][2] = bounds[j + 1]
        else:
            groups.append([j, bounds[j], bounds[j + 1]])
    chosen = lows[[j for j, _, _ in groups]]
    tiled = tuple(np.tile(component, chosen.size) for component in lateral)
    q, weight, used = table(tiled, np.repeat(chosen, rows))
    used = used.reshape(chosen.size, rows)
    out = np.empty((rows, depths.size))
    for j, (_, first, stop) in enumerate(groups):
        part = slice(j * rows, (j + 1) * rows)
        width = int(used[j].max(initial=0))
        out[:, order[first:stop]] = evaluate(
            q[part, :width], weight[part, :width], used[j], z[None, first:stop]
        )
    return out
