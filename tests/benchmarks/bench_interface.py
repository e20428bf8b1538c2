"""Interface-field benchmark: the beam through a wedge, ours against the tests' brute force.

The case (issue 14): a 12.7 mm 2.25 MHz disc on acrylic (2730 m/s) into steel shear
(3255 m/s) at 60 deg refracted, wedge path 10 mm, a Gaussian pulse of 0.5 fractional
bandwidth at 32 frequencies, pulse-echo. Two jobs:

- ``widths``: -6 dB edges in both planes at five sound paths (10, 20, 40, 60, 80 mm) by
  ``crossing_widths``; ``ours_s`` is the median wall time over ``RUNS`` runs; the brute force
  (``Brute`` and ``_brute_edges`` of ``tests/test_interface_beam.py``: polar midpoint cells,
  rays by bisection, the exact transmission per ray, scipy's searches) runs once (it takes
  a minute or more), ``reference_s``; ``max_width_error_pct`` the largest difference of the
  five paths' half-widths (both sides in the incidence plane, the transverse one).
- ``map``: 128 lateral x 256 sound-path points in the incidence plane (sound path 3 to 80 mm
  along the refracted axis, +-12.7 mm across it, points above the surface dropped), by
  ``crossing_amplitude``; ``ours_s`` the median over ``RUNS`` runs, each followed by one run
  of the brute force on the sampled points (every ``ROW_STEP``-th path, every
  ``COLUMN_STEP``-th offset), its time scaled to the whole map (``reference_s``, its cost
  is proportional to the points); ``max_error_db`` the largest |ours - brute| in dB on the
  sampled points inside the -20 dB region (relative to the map's maximum), the brute force
  at ``FINE`` cells (its own midpoint error about 1e-3 dB there).

Each job records the 1-minute load average before it (``load_average``; the machine may be
shared). Run: ``python tests/benchmarks/bench_interface.py [--json]``.
"""

from __future__ import annotations

import json
import math
import os
import statistics
import sys
import time
from pathlib import Path

import numpy as np

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from test_interface_beam import Brute, _brute_edges, _crossing

from beamspread.field.interface import crossing_amplitude
from beamspread.field.interface_beam import crossing_widths
from beamspread.field.spectrum import gaussian_spectrum

RUNS = 5
BANDWIDTH = 0.5
FREQUENCIES = 32
PATHS = [0.010, 0.020, 0.040, 0.060, 0.080]
ROW_STEP = 32
COLUMN_STEP = 8
FINE = (80, 320)


def _load() -> float:
    return os.getloadavg()[0]


def widths_case(crossing) -> dict:
    load = _load()
    times = []
    for _ in range(RUNS):
        t = time.perf_counter()
        ours = crossing_widths(crossing, PATHS, 6.0, bandwidth=BANDWIDTH, frequencies=FREQUENCIES)
        times.append(time.perf_counter() - t)
    spectrum = gaussian_spectrum(crossing.element.frequency, BANDWIDTH, FREQUENCIES)
    brute = Brute(crossing)
    t = time.perf_counter()
    reference = [_brute_edges(brute, crossing, s, 6.0, spectrum) for s in PATHS]
    reference_s = time.perf_counter() - t
    errors = [
        100 * abs(a / b - 1)
        for w, (toward, away, transverse) in zip(ours, reference, strict=True)
        for a, b in (
            (w.toward_normal, toward),
            (w.away_from_normal, away),
            (w.transverse, transverse),
        )
    ]
    return {
        "case": "widths",
        "paths_mm": [1e3 * s for s in PATHS],
        "ours_s": statistics.median(times),
        "ours_runs_s": times,
        "reference_s": reference_s,
        "ratio": reference_s / statistics.median(times),
        "max_width_error_pct": max(errors),
        "widths_mm": [
            {
                "path": 1e3 * w.path,
                "toward_normal": 1e3 * w.toward_normal,
                "away_from_normal": 1e3 * w.away_from_normal,
                "tilt_deg": math.degrees(w.tilt),
                "transverse": 1e3 * w.transverse,
            }
            for w in ours
        ],
        "load_average": load,
    }


def map_points(crossing):
    beta = crossing.refracted
    paths = np.linspace(0.003, 0.080, 256)
    offsets = np.linspace(-0.0127, 0.0127, 128)
    s, o = np.meshgrid(paths, offsets, indexing="ij")
    x = s * math.sin(beta) + o * math.cos(beta)
    z = s * math.cos(beta) - o * math.sin(beta)
    sampled = np.zeros(s.shape, dtype=bool)
    sampled[::ROW_STEP, ::COLUMN_STEP] = True
    inside = z > 1e-4
    points = np.c_[x[inside], 0 * x[inside], z[inside]]
    return points, sampled[inside]


def map_case(crossing) -> dict:
    load = _load()
    points, sampled = map_points(crossing)
    spectrum = gaussian_spectrum(crossing.element.frequency, BANDWIDTH, FREQUENCIES)
    brute = Brute(crossing, *FINE)
    ours_times, reference_times = [], []
    for _ in range(RUNS):
        t = time.perf_counter()
        ours = crossing_amplitude(crossing, points, bandwidth=BANDWIDTH, frequencies=FREQUENCIES)
        ours_times.append(time.perf_counter() - t)
        t = time.perf_counter()
        reference = np.array([brute.amplitude(p, spectrum) for p in points[sampled]])
        reference_times.append((time.perf_counter() - t) * points.shape[0] / sampled.sum())
    top = ours.max()
    inside = ours[sampled] >= 0.1 * top
    error = np.abs(20 * np.log10(ours[sampled][inside] / reference[inside]))
    return {
        "case": "map",
        "points": int(points.shape[0]),
        "ours_s": statistics.median(ours_times),
        "ours_runs_s": ours_times,
        "reference_s": statistics.median(reference_times),
        "ratio": statistics.median(reference_times) / statistics.median(ours_times),
        "sampled_points": int(sampled.sum()),
        "max_error_db": float(error.max()),
        "load_average": load,
    }


def main() -> None:
    crossing = _crossing(60.0)
    results = [widths_case(crossing), map_case(crossing)]
    if "--json" in sys.argv[1:]:
        print(json.dumps(results, indent=2))
        return
    for r in results:
        line = (
            f"{r['case']:7s} ours {r['ours_s']:.3f} s (median of {RUNS}), brute force "
            f"{r['reference_s']:.1f} s, ratio {r['ratio']:.0f}, load {r['load_average']:.2f}"
        )
        if r["case"] == "widths":
            line += f", largest width difference {r['max_width_error_pct']:.2f} %"
        else:
            line += f", largest level difference {r['max_error_db']:.4f} dB (-20 dB region)"
        print(line)


if __name__ == "__main__":
    main()
