"""Quadrature tables over the boundary of a piston, one row per lateral position.

The Fast Nearfield Method writes the Rayleigh integral over the face of a flat
baffled piston as a single integral over its boundary (the rim of a disc, the
four edges of a rectangle). For a field point whose projection on the plane of
the face is :math:`\\mathbf{r}`, every boundary node :math:`j` contributes
through two numbers that do not depend on the depth or the frequency:

* :math:`q_j`, the squared lateral distance from :math:`\\mathbf{r}` to the node;
* :math:`W_j`, the Gauss-Legendre weight times the smooth kernel of the method.

The field then follows from :math:`p = e^{-ikz}\\sum_j W_j (1 - e^{-ik\\Delta_j})`
with :math:`\\Delta_j = \\sqrt{z^2 + q_j} - z` (see :mod:`beamspread.field.engine`).
This module builds the tables; the engine sums them.

Node counts are chosen per boundary piece from the largest phase change
:math:`\\Phi = k (R_{max} - R_{min})` along the piece at the shallowest depth
asked for (deeper points see a smaller change), plus a term for the curvature
of the integrand near the foot of the perpendicular, whose width shrinks with
depth. Gauss-Legendre quadrature of these smooth integrands converges
exponentially; the constants below give a relative error near 1e-7 in the
checks of ``tests/test_field.py``.
"""

from __future__ import annotations

from functools import cache

import numpy as np

from ..errors import InputError

# n = ceil(per radian * phase change + base), at least _MIN, in steps of _STEP; the rim of a
# disc is one long piece, the edges of a rectangle are cut in eight shorter ones.
_DISC = (0.45, 10.0)
_RECTANGLE = (0.4, 6.0)
_FOOT = 4.0  # nodes x sqrt(piece length / width of the feature at the foot)
_MIN = 8
_STEP = 4
# Above _LADDER_START nodes a piece takes the next rung of a ladder rising by a quarter, so a
# large problem needs few distinct Gauss-Legendre rules (each costs O(n^3) to build, and is
# cached); the extra nodes cost at most a quarter more work in the sums.
_LADDER_START = 64
_GROUPED_FROM = 1024  # nodes per distinct count from which a table is laid count by count
_MAX_NODES = 16384  # about 5000 wavelengths of phase along one piece


@cache
def gauss_legendre(n: int) -> tuple[np.ndarray, np.ndarray]:
    """Gauss-Legendre nodes and weights mapped to [0, 1].

    Up to 100 nodes numpy's rule (an eigenvalue problem, O(n^3)); beyond, Newton's method on
    the three-term recurrence from Tricomi's asymptotic first guess, O(n^2), which agrees with
    it to rounding (tests/test_field.py) and stays fast for thousands of nodes.
    """
    if n <= 100:
        x, w = np.polynomial.legendre.leggauss(n)
        return 0.5 * (x + 1.0), 0.5 * w
    half = (n + 1) // 2
    k = np.arange(1, half + 1)
    x = np.cos(np.pi * (k - 0.25) / (n + 0.5)) * (1.0 - 1.0 / (8.0 * n**2) + 1.0 / (8.0 * n**3))
    for _ in range(100):
        p0, p1 = np.ones_like(x), x.copy()
        for m in range(2, n + 1):  # P_m from P_{m-1} and P_{m-2}
            p0, p1 = p1, ((2 * m - 1) * x * p1 - (m - 1) * p0) / m
        dp = n * (x * p1 - p0) / (x * x - 1.0)
        step = p1 / dp
        x = x - step
        if np.max(np.abs(step)) < 1e-15:
            break
    p0, p1 = np.ones_like(x), x.copy()
    for m in range(2, n + 1):
        p0, p1 = p1, ((2 * m - 1) * x * p1 - (m - 1) * p0) / m
    dp = n * (x * p1 - p0) / (x * x - 1.0)
    w = 2.0 / ((1.0 - x * x) * dp * dp)
    # x runs from near +1 down; mirror the other half (the middle node once when n is odd)
    nodes = np.concatenate([-x, x[::-1][n % 2 :]])
    weights = np.concatenate([w, w[::-1][n % 2 :]])
    return 0.5 * (nodes + 1.0), 0.5 * weights


def node_ladder(n: np.ndarray, what: str = "the computed field here") -> np.ndarray:
    """Node counts raised to multiples of _STEP and, past _LADDER_START, to the next rung.

    Raises InputError past _MAX_NODES, naming ``what`` would need them.
    """
    n = np.maximum(np.asarray(n, dtype=float), _MIN)
    if n.size and float(np.max(n)) > _MAX_NODES:
        raise InputError(
            f"{what} would need {float(np.max(n)):.3g} quadrature nodes on one piece (at most "
            f"{_MAX_NODES}): the element is too many wavelengths across or the point too close "
            "to its face; check the units, or use the far-field formulas alone",
            remedy=("far_field_only", None),
        )
    big = n > _LADDER_START
    rung = np.ceil(np.log(np.where(big, n, _LADDER_START) / _LADDER_START) / np.log(1.25))
    n = np.where(big, _LADDER_START * 1.25**rung, n)
    return (np.ceil(n / _STEP) * _STEP).astype(np.int64)


def _node_count(phase: np.ndarray, length_ratio: np.ndarray, rule: tuple) -> np.ndarray:
    """Nodes for each piece from its phase change and the ratio length / foot width."""
    per_radian, base = rule
    with np.errstate(divide="ignore", invalid="ignore"):
        foot = _FOOT * np.sqrt(np.where(np.isfinite(length_ratio), length_ratio, 0.0))
    return node_ladder(np.ceil(np.maximum(per_radian * phase + base, foot)))


def _assemble(
    rows: int, pieces: np.ndarray, start: np.ndarray, stop: np.ndarray, counts: np.ndarray, rule
) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Lay the nodes of every piece into padded tables.

    Parameters
    ----------
    rows : int
        Number of lateral positions.
    pieces : ndarray of int, shape (P,)
        The lateral position (row) of each piece.
    start, stop : ndarray, shape (P,)
        The interval of each piece in its own variable.
    counts : ndarray of int, shape (P,)
        Nodes per piece.
    rule : callable
        ``rule(index, t, w, spread)`` returns ``(q, weight)`` at nodes ``t``
        with weights ``w``, already mapped to the interval of their pieces
        ``index`` (all of shape (m,), one entry a node; or, pieces laid count
        by count, ``index`` (m, 1) and ``t``, ``w`` (m, n)); ``spread(f)`` gives
        ``f`` of each node's position in [0, 1], computed once per rule.

    Returns
    -------
    q, weight : ndarray, shape (rows, M)
        Padded with ``q = 0, weight = 0`` (a node that contributes nothing).
    used : ndarray of int, shape (rows,)
        Nodes in use per row.
    """
    used = np.bincount(pieces, weights=counts, minlength=rows).astype(np.int64)
    width = int(used.max(initial=0))
    q = np.zeros((rows, width))
    weight = np.zeros((rows, width))
    if pieces.size == 0:
        return q, weight, used
    # Every node of every piece at once: pieces grouped row by row, in order, so that a row's
    # nodes are contiguous and its columns follow its pieces.
    order = np.lexsort((np.arange(pieces.size), pieces))
    n = counts[order]
    total = int(n.sum())
    piece = np.repeat(order, n)
    first = np.cumsum(n) - n  # where each piece's nodes start among all nodes
    sizes = np.flatnonzero(np.bincount(counts))  # (np.unique would load numpy.ma)
    rules = [gauss_legendre(int(m)) for m in sizes]
    t_all = np.concatenate([t for t, _ in rules])
    w_all = np.concatenate([w for _, w in rules])
    row_start = np.cumsum(used) - used
    owner = pieces[order]
    if total >= _GROUPED_FROM * sizes.size:  # few large groups: each count's pieces at once
        offset = np.empty_like(counts)
        offset[order] = first - row_start[owner]  # each piece's first column in its row
        for m in sizes:
            index = np.flatnonzero(counts == m)
            t, w = gauss_legendre(int(m))
            span = (stop - start)[index, None]
            qn, wn = rule(
                index[:, None], start[index, None] + span * t, span * w, lambda f, t=t: f(t)
            )
            cols = offset[index, None] + np.arange(m)
            q[pieces[index, None], cols] = qn
            weight[pieces[index, None], cols] = wn
        return q, weight, used
    rule_start = np.zeros(int(sizes[-1]) + 1, dtype=np.int64)
    rule_start[sizes] = np.cumsum([0, *sizes[:-1]])
    node = np.arange(total)
    at = node + np.repeat(rule_start[n] - first, n)  # each node's place in its rule
    span = (stop - start)[piece]
    qn, wn = rule(piece, start[piece] + span * t_all[at], span * w_all[at], lambda f: f(t_all)[at])
    # flat place in the table: row * width + the node's column in its row
    flat = node + np.repeat(owner * width - row_start[owner], n)
    q.ravel()[flat] = qn
    weight.ravel()[flat] = wn
    return q, weight, used


def disc_table(r: np.ndarray, radius: float, k_max: float, z_min: float):
    """Rim nodes of a disc for lateral distances ``r`` from the axis.

    The rim point at angle :math:`\\psi` from the direction of the field point
    lies at squared lateral distance
    :math:`q = a^2 + r^2 - 2ar\\cos\\psi`; the kernel of the method is
    :math:`a(a - r\\cos\\psi)/(\\pi q) = (1 + (a^2 - r^2)/q) / (2\\pi)`, integrated
    over :math:`\\psi \\in [0, \\pi]` (the rim is symmetric about the line from
    the centre to the point).
    """
    a = float(radius)
    r = np.asarray(r, dtype=float)
    rows = r.size
    r_near = np.sqrt(z_min * z_min + (a - r) ** 2)
    r_far = np.sqrt(z_min * z_min + (a + r) ** 2)
    foot_width = r_near / np.sqrt(np.maximum(a * r, 1e-300))  # in radians of psi
    counts = _node_count(k_max * (r_far - r_near), np.pi / foot_width, _DISC)
    pieces = np.arange(rows)
    start = np.zeros(rows)
    stop = np.full(rows, np.pi)

    # Per row first, then spread over the nodes (the same operations in the same order):
    # q = a^2 + r^2 - 2 a r cos(psi), weight = w (1 + (a^2 - r^2) / q) / (2 pi), and
    # psi = pi t on every row, so cos(psi) is computed once per rule.
    square, double, difference = a * a + r * r, 2.0 * a * r, a * a - r * r

    def rule(index, _psi, w, spread):
        q = square[index] - double[index] * spread(lambda t: np.cos(np.pi * t))
        return q, w * (1.0 + difference[index] / q) / (2.0 * np.pi)

    return _assemble(rows, pieces, start, stop, counts, rule)


def rectangle_table(
    x: np.ndarray, y: np.ndarray, half_x: float, half_y: float, k_max: float, z_min: float
):
    """Edge nodes of a rectangle ``|x| <= half_x, |y| <= half_y`` for lateral positions (x, y).

    Each edge lies at signed distance :math:`d` from the projection of the
    field point (positive on the element's side of the edge line) and runs over
    :math:`\\sigma \\in [\\sigma_0, \\sigma_1]`, measured from the foot of the
    perpendicular. The kernel :math:`d / (2\\pi (d^2 + \\sigma^2))` and the
    squared distance :math:`q = d^2 + \\sigma^2` are even in :math:`\\sigma`, so
    an edge whose foot lies on it is split there into ``[0, |sigma_0|]`` and
    ``[0, sigma_1]`` (the splitting of the method into corner rectangles), and
    an edge whose foot lies beyond it is integrated over
    ``[min |sigma|, max |sigma|]`` in two halves.
    """
    x = np.asarray(x, dtype=float)
    y = np.asarray(y, dtype=float)
    rows = x.size
    edges = (
        (half_x - x, -half_y - y, half_y - y),  # edge x = +half_x
        (half_x + x, -half_y - y, half_y - y),  # edge x = -half_x
        (half_y - y, -half_x - x, half_x - x),  # edge y = +half_y
        (half_y + y, -half_x - x, half_x - x),  # edge y = -half_y
    )
    d_list, s_list, e_list, row_list = [], [], [], []
    for d, lo, hi in edges:
        across = (lo < 0.0) & (hi > 0.0)
        u_min = np.minimum(np.abs(lo), np.abs(hi))
        u_max = np.maximum(np.abs(lo), np.abs(hi))
        middle = 0.5 * (u_min + u_max)
        first = (np.where(across, 0.0, u_min), np.where(across, -lo, middle))
        second = (np.where(across, 0.0, middle), np.where(across, hi, u_max))
        for s, e in (first, second):
            d_list.append(d)
            s_list.append(s)
            e_list.append(e)
            row_list.append(np.arange(rows))
    d = np.concatenate(d_list)
    start = np.concatenate(s_list)
    stop = np.concatenate(e_list)
    pieces = np.concatenate(row_list)
    z_piece = np.broadcast_to(np.asarray(z_min, dtype=float), (rows,))[pieces]
    base = z_piece * z_piece + d * d
    phase = k_max * (np.sqrt(base + stop * stop) - np.sqrt(base + start * start))
    with np.errstate(divide="ignore"):
        ratio = np.where(start == 0.0, stop / np.sqrt(base), 0.0)
    counts = _node_count(phase, ratio, _RECTANGLE)
    keep = (stop > start) & (d != 0.0)  # an empty piece, or an edge line through the point
    pieces, d, start, stop, counts = pieces[keep], d[keep], start[keep], stop[keep], counts[keep]
    # Pieces that coincide (both halves of an edge centred on the point, the two edges of a
    # point on a centre line) are computed once, with their weight multiplied.
    order = np.lexsort((stop, start, d, pieces))
    same = (
        (pieces[order][1:] == pieces[order][:-1])
        & (d[order][1:] == d[order][:-1])
        & (start[order][1:] == start[order][:-1])
        & (stop[order][1:] == stop[order][:-1])
    )
    first = order[np.r_[True, ~same]]
    multiplicity = np.diff(np.r_[np.flatnonzero(np.r_[True, ~same]), order.size])
    pieces, d, counts = pieces[first], d[first], counts[first]
    start, stop = start[first], stop[first]

    def rule(index, sigma, w, _spread):
        dd = d[index]
        q = dd * dd + sigma * sigma
        return q, w * (multiplicity[index] * dd) / (2.0 * np.pi * q)

    return _assemble(rows, pieces, start, stop, counts, rule)


def ellipse_table(
    x: np.ndarray, y: np.ndarray, half_x: float, half_y: float, k_max: float, z_min: float
):
    """Rim nodes of an ellipse ``(x/a)^2 + (y/b)^2 <= 1`` for lateral positions (x, y).

    The rim point :math:`s(t) = (a\\cos t, b\\sin t)` seen from the projection
    :math:`P` of the field point subtends :math:`d\\Phi = (s - P) \\times s'\\,dt / q`
    with :math:`q = |s - P|^2`, and :math:`(s - P)\\times s' = ab - b x\\cos t - a y\\sin t`;
    the kernel is :math:`d\\Phi / 2\\pi`, the same edge form as the disc's (to
    which it reduces for :math:`a = b`). The rim is cut into its four quarter
    arcs, each given nodes for its phase change and for the sharpness of the
    kernel near the point of the rim closest to :math:`P`.
    """
    x = np.asarray(x, dtype=float)
    y = np.asarray(y, dtype=float)
    a, b = float(half_x), float(half_y)
    rows = x.size
    quarter = 0.5 * np.pi
    coarse = np.linspace(0.0, 2.0 * np.pi, 257)
    q_coarse = (a * np.cos(coarse) - x[:, None]) ** 2 + (b * np.sin(coarse) - y[:, None]) ** 2
    pieces, start, stop, counts = [], [], [], []
    for j in range(4):
        part = q_coarse[:, 64 * j : 64 * (j + 1) + 1]
        r_near = np.sqrt(z_min * z_min + part.min(axis=1))
        r_far = np.sqrt(z_min * z_min + part.max(axis=1))
        foot_width = r_near / max(a, b)  # in radians of t
        counts.append(_node_count(k_max * (r_far - r_near), quarter / foot_width, _DISC))
        pieces.append(np.arange(rows))
        start.append(np.full(rows, j * quarter))
        stop.append(np.full(rows, (j + 1) * quarter))
    pieces = np.concatenate(pieces)
    start, stop, counts = np.concatenate(start), np.concatenate(stop), np.concatenate(counts)

    def rule(index, t, w, _spread):
        px, py = x[pieces[index]], y[pieces[index]]
        dx, dy = a * np.cos(t) - px, b * np.sin(t) - py
        q = dx * dx + dy * dy
        cross = a * b - b * px * np.cos(t) - a * py * np.sin(t)
        with np.errstate(divide="ignore", invalid="ignore"):
            kernel = np.where(q > 0.0, cross / (2.0 * np.pi * q), 0.0)
        return q, w * kernel

    return _assemble(rows, pieces, start, stop, counts, rule)
