"""Field-engine benchmark: the Fast Nearfield Method against a careful brute-force Rayleigh sum.

Prints a JSON list, one object per case ("disc-cw", "disc-broadband", "rect-cw",
"rect-broadband"): a 10 mm 5 MHz disc and a 20 x 10 mm 5 MHz rectangle in steel (5920 m/s), a
map of 128 lateral x 256 depth points in the x-z plane (lateral over +-D or +-L, depth from 0.1 N
to 3 N), continuous wave and a 32-frequency Gaussian pulse of 0.5 fractional bandwidth,
pulse-echo. Both sides run in the same process with the same (default) thread settings, and
ours and the reference are timed alternately, run after run. Keys:

- ``ours_s``: median wall time of ``beamspread.field.field_map`` over the runs;
- ``reference_s``: the brute force a careful user would write: point sources at lambda/16
  (lambda of the highest frequency) folded about the symmetry plane y = 0 (each pair once,
  the field points lie in that plane), exp(ikR) stepped from one frequency to the next by one
  complex multiplication, float32, the half-map x >= 0 only (the field is symmetric). Timed
  on every ``ROW_STEP``-th depth row and scaled: its cost is proportional to the points;
- ``ratio``: reference_s / ours_s, at lambda/16;
- ``max_error_db``: the largest |ours - truth| in dB inside the -20 dB region (relative to the
  maximum at each depth) on the sampled points, where "truth" is Richardson's extrapolation
  of the summations at lambda/64 and lambda/128 (A128 + (A128 - A64) / 3, the midpoint rule
  converging as h**2); ``reference_error_db``: the lambda/16 summation's error the same way;
- ``matched_spacing``, ``matched_ratio``: the coarsest summation (lambda/4 ... lambda/32) within
  0.01 dB of the extrapolation on the sampled points, and reference time at it / ours_s;
- ``peak_memory_mb``: tracemalloc's peak during one of our runs;
- ``kernel``: the path our engine ran (``beamspread.field._threads.KERNEL``);
- ``runs``, ``load_average`` (1-minute, at the start of the case: the machine may be shared).

Run: ``python tests/benchmarks/bench_field.py --json`` (takes several minutes).
"""

from __future__ import annotations

import json
import math
import os
import statistics
import sys
import time
import tracemalloc

import numpy as np

from beamspread.axis import rectangle_near_field
from beamspread.field import field_map, gaussian_spectrum
from beamspread.field._threads import KERNEL
from beamspread.probes import Disc, Rectangle

SPEED = 5920.0
RUNS = 7
BANDWIDTH = 0.5
FREQUENCIES = 32
ROW_STEP = 32  # timed and sampled depth rows
COLUMN_STEP = 8  # sampled lateral points (on the half-map)
MATCH_DB = 0.01


def sources(probe, spacing):
    """Point sources with y >= 0 and their areas (doubled where the mirror image is folded in)."""
    if isinstance(probe, Disc):
        radius = 0.5 * probe.diameter
        rings = math.ceil(radius / spacing)
        dr = radius / rings
        xs, ys, ws = [], [], []
        for i in range(rings):
            r = (i + 0.5) * dr
            count = 2 * max(4, math.ceil(math.pi * r / spacing))  # even: pairs about y = 0
            phi = (np.arange(count // 2) + 0.5) * 2 * math.pi / count  # upper half, 0..pi
            xs.append(r * np.cos(phi))
            ys.append(r * np.sin(phi))
            ws.append(np.full(count // 2, 2 * math.pi * ((i + 1) ** 2 - i**2) * dr * dr / count))
        return np.concatenate(xs), np.concatenate(ys), np.concatenate(ws)
    nx, ny = math.ceil(probe.length / spacing), 2 * math.ceil(0.5 * probe.width / spacing)
    x = (np.arange(nx) + 0.5) * probe.length / nx - 0.5 * probe.length
    y = (np.arange(ny // 2) + 0.5) * probe.width / ny  # upper half; each stands for a pair
    gx, gy = np.meshgrid(x, y)
    return gx.ravel(), gy.ravel(), np.full(gx.size, 2 * probe.length * probe.width / (nx * ny))


def rayleigh_map(src, ks, energy, lateral, depth, power):
    """Spectral RMS of |p|^power by brute force, float32, shape (depth, lateral)."""
    sx, sy, sw = (np.asarray(v, dtype=np.float32) for v in src)
    gx, gz = np.meshgrid(lateral, depth)
    px, pz = gx.ravel().astype(np.float32), gz.ravel().astype(np.float32)
    total = np.zeros(px.size)
    step = max(1, (1 << 21) // sx.size)
    dk = np.float32(ks[1] - ks[0]) if len(ks) > 1 else np.float32(0.0)
    scale = [(k / (2 * math.pi)) ** 2 for k in ks]
    for i in range(0, px.size, step):
        sl = slice(i, i + step)
        r = np.sqrt((px[sl, None] - sx) ** 2 + sy * sy + pz[sl, None] ** 2)
        phasor = (sw / r) * np.exp(-1j * np.float32(ks[0]) * r).astype(np.complex64)
        rotate = np.exp(-1j * dk * r).astype(np.complex64) if len(ks) > 1 else None
        for j, w in enumerate(energy):
            if j:
                phasor *= rotate
            p = phasor.sum(axis=1, dtype=np.complex128)
            p2 = (p.real**2 + p.imag**2) * scale[j]
            total[sl] += w * p2**power
    return np.sqrt(total).reshape(gz.shape)


def db_error(ours, truth):
    inside = truth >= 0.1 * truth.max(axis=1, keepdims=True)
    return float(np.abs(20 * np.log10(ours[inside] / truth[inside])).max())


def case(name, probe, near_field, half_width, bandwidth):
    load = os.getloadavg()[0]
    lateral = np.linspace(-half_width, half_width, 128)
    depth = np.linspace(0.1 * near_field, 3.0 * near_field, 256)

    def ours():
        return field_map(
            probe, SPEED, lateral, depth, bandwidth=bandwidth, frequencies=FREQUENCIES
        ).amplitude

    result = ours()
    spectrum = gaussian_spectrum(probe.frequency, bandwidth, FREQUENCIES)
    ks = 2 * math.pi * spectrum.frequencies / SPEED
    # the element's drive for a measured far-field echo spectrum W: S = W (f0/f)^2
    drive = spectrum.amplitude * (probe.frequency / spectrum.frequencies) ** 2
    energy = drive**2 / np.sum(drive**2)
    lam = SPEED / spectrum.frequencies.max()
    half_index = np.flatnonzero(lateral >= 0.0)
    half = lateral[half_index]
    rows = depth[::ROW_STEP]
    scale = depth.size / rows.size * (lateral.size / 2) / half.size
    columns = half[::COLUMN_STEP]
    ours_sub = result[::ROW_STEP][:, half_index[::COLUMN_STEP]]

    cache = {}

    def reference(divisions, cols):
        key = (divisions, cols is columns)
        if key not in cache:
            cache[key] = sources(probe, lam / divisions)
        start = time.perf_counter()
        amp = rayleigh_map(cache[key], ks, energy, cols, rows, 2)
        return amp, time.perf_counter() - start

    a64, _ = reference(64, columns)
    a128, _ = reference(128, columns)
    truth = a128 + (a128 - a64) / 3.0
    a16, _ = reference(16, columns)
    matched, reached = 32, False
    for divisions in (4, 6, 8, 11, 16, 22, 32):
        coarse, _ = reference(divisions, columns)
        if db_error(coarse, truth) <= MATCH_DB:
            matched, reached = divisions, True
            break

    times, ref_times, matched_times = [], [], []
    for _ in range(RUNS):
        start = time.perf_counter()
        ours()
        times.append(time.perf_counter() - start)
        ref_times.append(reference(16, half)[1] * scale)
        matched_times.append(reference(matched, half)[1] * scale)
    ours_s = statistics.median(times)
    reference_s = statistics.median(ref_times)
    tracemalloc.start()
    ours()
    peak = tracemalloc.get_traced_memory()[1]
    tracemalloc.stop()
    return {
        "case": name,
        "ours_s": round(ours_s, 5),
        "reference_s": round(reference_s, 3),
        "ratio": round(reference_s / ours_s, 1),
        "max_error_db": float(f"{db_error(ours_sub, truth):.2g}"),
        "reference_error_db": round(db_error(a16, truth), 4),
        "matched_spacing": f"lambda/{matched} "
        + (f"(within {MATCH_DB} dB)" if reached else f"(finest tried; not within {MATCH_DB} dB)"),
        "matched_ratio": round(statistics.median(matched_times) / ours_s, 1),
        "peak_memory_mb": round(peak / 2**20, 2),
        "kernel": KERNEL,
        "runs": RUNS,
        "load_average": round(load, 2),
    }


def main() -> None:
    disc = Disc(0.010, 5e6)
    lam = SPEED / 5e6
    disc_n = (0.010**2 - lam**2) / (4 * lam)
    rect = Rectangle(0.020, 0.010, 5e6)
    rect_n = rectangle_near_field(0.020, 0.010, lam)
    wanted = sys.argv[2:] if len(sys.argv) > 2 else None
    cases = [
        ("disc-cw", disc, disc_n, 0.010, 0.0),
        ("disc-broadband", disc, disc_n, 0.010, BANDWIDTH),
        ("rect-cw", rect, rect_n, 0.020, 0.0),
        ("rect-broadband", rect, rect_n, 0.020, BANDWIDTH),
    ]
    out = [case(*c) for c in cases if wanted is None or c[0] in wanted]
    print(json.dumps(out, indent=2))


if __name__ == "__main__":
    main()
