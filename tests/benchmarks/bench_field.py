"""Field-engine benchmark: the Fast Nearfield Method against a brute-force Rayleigh summation.

Prints a JSON list, one object per case ("disc-cw", "disc-broadband", "rect-cw",
"rect-broadband"): a 10 mm 5 MHz disc and a 20 x 10 mm 5 MHz rectangle in steel (5920 m/s), a
map of 128 lateral x 256 depth points in the x-z plane (lateral over +-D or +-L, depth from 0.1 N
to 3 N), continuous wave and a 32-frequency Gaussian pulse of 0.5 fractional bandwidth,
pulse-echo. Keys:

- ``ours_s``: median wall time of ``beamspread.field.field_map`` over several runs;
- ``reference_s``: a vectorised numpy (float32) Rayleigh summation with point sources at lambda/16
  (lambda of the highest frequency in the spectrum) over the same map. Like ours it computes the
  half-plane x >= 0 only (the field is symmetric). It is timed on every 16th depth row and
  scaled by 16: its cost is exactly proportional to the number of points;
- ``ratio``: reference_s / ours_s;
- ``max_error_db``: the largest |ours - reference| in dB, inside the -20 dB region (relative to
  the maximum at each depth), on every 16th depth row and every 4th lateral point, against the
  summation at lambda/32 (which carries its own error of about 0.02 dB, see tests/test_field.py);
- ``peak_memory_mb``: tracemalloc's peak during one of our runs;
- ``matched_ratio``: the ratio against the coarsest summation (lambda/4 ... lambda/16) that
  still reaches 0.1 dB of the lambda/32 one on the same points, timed the same way.

Run: ``python tests/benchmarks/bench_field.py`` (takes a few minutes).
"""

from __future__ import annotations

import json
import math
import statistics
import time
import tracemalloc

import numpy as np

from beamspread.axis import rectangle_near_field
from beamspread.field import field_map, gaussian_spectrum
from beamspread.probes import Disc, Rectangle

SPEED = 5920.0
RUNS = 7
BANDWIDTH = 0.5
FREQUENCIES = 32
ROW_STEP = 16
COLUMN_STEP = 4


def sources(probe, spacing):
    """Point sources and their areas over the face (rings for a disc, cells for a rectangle)."""
    if isinstance(probe, Disc):
        radius = 0.5 * probe.diameter
        rings = math.ceil(radius / spacing)
        dr = radius / rings
        xs, ys, ws = [], [], []
        for i in range(rings):
            r = (i + 0.5) * dr
            count = max(8, math.ceil(2 * math.pi * r / spacing))
            phi = (np.arange(count) + 0.5) * 2 * math.pi / count
            xs.append(r * np.cos(phi))
            ys.append(r * np.sin(phi))
            ws.append(np.full(count, math.pi * ((i + 1) ** 2 - i**2) * dr * dr / count))
        return np.concatenate(xs), np.concatenate(ys), np.concatenate(ws)
    nx, ny = math.ceil(probe.length / spacing), math.ceil(probe.width / spacing)
    x = (np.arange(nx) + 0.5) * probe.length / nx - 0.5 * probe.length
    y = (np.arange(ny) + 0.5) * probe.width / ny - 0.5 * probe.width
    gx, gy = np.meshgrid(x, y)
    return gx.ravel(), gy.ravel(), np.full(gx.size, probe.length * probe.width / (nx * ny))


def rayleigh_map(src, ks, energy, lateral, depth, power):
    """Spectral RMS of |p|^power by brute force, float32, shape (depth, lateral)."""
    sx, sy, sw = (np.asarray(v, dtype=np.float32) for v in src)
    gx, gz = np.meshgrid(lateral, depth)
    px, pz = gx.ravel().astype(np.float32), gz.ravel().astype(np.float32)
    total = np.zeros(px.size)
    step = max(1, (1 << 22) // sx.size)
    for i in range(0, px.size, step):
        sl = slice(i, i + step)
        r = np.sqrt((px[sl, None] - sx) ** 2 + sy * sy + pz[sl, None] ** 2)
        amplitude = sw / r
        for k, w in zip(ks, energy, strict=True):
            phase = np.float32(k) * r
            re = (np.cos(phase) * amplitude).sum(axis=1, dtype=np.float64)
            im = (np.sin(phase) * amplitude).sum(axis=1, dtype=np.float64)
            p2 = (re * re + im * im) * (k / (2 * math.pi)) ** 2
            total[sl] += w * p2**power
    return np.sqrt(total).reshape(gz.shape)


def to_db_error(ours, reference):
    inside = reference >= 0.1 * reference.max(axis=1, keepdims=True)
    return float(np.abs(20 * np.log10(ours[inside] / reference[inside])).max())


def case(name, probe, near_field, half_width, bandwidth):
    lateral = np.linspace(-half_width, half_width, 128)
    depth = np.linspace(0.1 * near_field, 3.0 * near_field, 256)

    def ours():
        return field_map(
            probe, SPEED, lateral, depth, bandwidth=bandwidth, frequencies=FREQUENCIES
        ).amplitude

    result = ours()
    times = []
    for _ in range(RUNS):
        start = time.perf_counter()
        ours()
        times.append(time.perf_counter() - start)
    ours_s = statistics.median(times)
    tracemalloc.start()
    ours()
    peak = tracemalloc.get_traced_memory()[1]
    tracemalloc.stop()

    spectrum = gaussian_spectrum(probe.frequency, bandwidth, FREQUENCIES)
    ks = 2 * math.pi * spectrum.frequencies / SPEED
    # the element's drive for a measured far-field echo spectrum W: S = W (f0/f)^2
    drive = spectrum.amplitude * (probe.frequency / spectrum.frequencies) ** 2
    energy = drive**2 / np.sum(drive**2)
    lam = SPEED / spectrum.frequencies.max()
    half = lateral[lateral >= 0.0]
    rows = depth[::ROW_STEP]
    scale = depth.size / rows.size * (lateral.size / 2) / half.size

    def timed_reference(spacing, columns, depths):
        src = sources(probe, spacing)
        start = time.perf_counter()
        amp = rayleigh_map(src, ks, energy, columns, depths, 2)
        return amp, time.perf_counter() - start

    _, t16 = timed_reference(lam / 16, half, rows)
    reference_s = t16 * scale
    columns = lateral[::COLUMN_STEP]
    fine, _ = timed_reference(lam / 32, columns, rows)
    ours_sub = result[::ROW_STEP, ::COLUMN_STEP]
    matched_s = reference_s
    for divisions in (4, 6, 8, 11, 16):
        coarse, _ = timed_reference(lam / divisions, columns, rows)
        if to_db_error(coarse, fine) <= 0.1:
            _, t = timed_reference(lam / divisions, half, rows)
            matched_s = t * scale
            break
    return {
        "case": name,
        "ours_s": round(ours_s, 5),
        "reference_s": round(reference_s, 3),
        "ratio": round(reference_s / ours_s, 1),
        "max_error_db": round(to_db_error(ours_sub, fine), 4),
        "peak_memory_mb": round(peak / 2**20, 2),
        "matched_ratio": round(matched_s / ours_s, 1),
    }


def main() -> None:
    disc = Disc(0.010, 5e6)
    lam = SPEED / 5e6
    disc_n = (0.010**2 - lam**2) / (4 * lam)
    rect = Rectangle(0.020, 0.010, 5e6)
    rect_n = rectangle_near_field(0.020, 0.010, lam)
    out = [
        case("disc-cw", disc, disc_n, 0.010, 0.0),
        case("disc-broadband", disc, disc_n, 0.010, BANDWIDTH),
        case("rect-cw", rect, rect_n, 0.020, 0.0),
        case("rect-broadband", rect, rect_n, 0.020, BANDWIDTH),
    ]
    print(json.dumps(out, indent=2))


if __name__ == "__main__":
    main()
