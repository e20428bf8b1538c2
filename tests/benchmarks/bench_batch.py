"""Batch benchmark: far-field rows, single analyse() calls and computed widths for many probes.

Prints a JSON object. Keys:

- ``far_field_rows``, ``far_field_s``: median wall time of one :func:`beamspread.far_field_beams`
  call over 10**6 random probe/depth rows (diameter, frequency, speed, depth), of 7 runs;
- ``analyse_far_field_ms``: median time of one far-field :func:`beamspread.analyse` call (a
  10 mm 5 MHz disc in steel, one depth), from 7 runs of 2000 calls; ``analyse_rectangle_ms``
  the same for a 20 x 10 mm rectangle (its last on-axis maximum is kept per element);
- ``computed_width_probes``, ``computed_widths_s``: 1000 different discs (3-25 mm, 1-10 MHz),
  computed-field widths at -6 and -20 dB at 100 mm in steel, broadband pulse-echo (0.5
  bandwidth, 32 frequencies, :func:`beamspread.field.beam_widths`), one run;
- ``load_average``: the 1-minute load average when the run started (the machine is shared).

Run: ``python tests/benchmarks/bench_batch.py``.
"""

from __future__ import annotations

import json
import os
import statistics
import time

import numpy as np

from beamspread import Disc, Rectangle, analyse, far_field_beams
from beamspread.field import beam_widths

SPEED = 5920.0


def median_time(function, runs=7, number=1):
    times = []
    for _ in range(runs):
        start = time.perf_counter()
        for _ in range(number):
            function()
        times.append((time.perf_counter() - start) / number)
    return statistics.median(times)


def main() -> None:
    load = os.getloadavg()[0]
    rng = np.random.default_rng(13)
    rows = 10**6
    diameter = rng.uniform(0.003, 0.03, rows)
    frequency = rng.uniform(1e6, 1e7, rows)
    speed = rng.uniform(1400.0, 6300.0, rows)
    depth = rng.uniform(0.01, 0.5, rows)
    far_field_beams(diameter[:10], frequency[:10], speed[:10], depth[:10])
    far = median_time(lambda: far_field_beams(diameter, frequency, speed, depth))

    disc, rect = Disc(0.010, 5e6), Rectangle(0.020, 0.010, 5e6)
    analyse(disc, SPEED, depths=[0.1])
    analyse(rect, SPEED, depths=[0.1])
    single = median_time(lambda: analyse(disc, SPEED, depths=[0.1]), number=2000)
    single_rect = median_time(lambda: analyse(rect, SPEED, depths=[0.1]), number=2000)

    probes = 1000
    diameters = rng.uniform(0.003, 0.025, probes)
    frequencies = rng.uniform(1e6, 1e7, probes)
    start = time.perf_counter()
    for d, f in zip(diameters, frequencies, strict=True):
        beam_widths(Disc(float(d), float(f)), SPEED, 0.1, [6, 20], bandwidth=0.5)
    widths_s = time.perf_counter() - start

    print(
        json.dumps(
            {
                "far_field_rows": rows,
                "far_field_s": round(far, 4),
                "analyse_far_field_ms": round(single * 1e3, 4),
                "analyse_rectangle_ms": round(single_rect * 1e3, 4),
                "computed_width_probes": probes,
                "computed_widths_s": round(widths_s, 2),
                "load_average": round(load, 2),
            },
            indent=2,
        )
    )


if __name__ == "__main__":
    main()
