"""Focused-probe benchmark: the compute of `beam --focus` with a few depths, in-process.

Prints JSON: for a 12.7 mm, 5 MHz disc focused at 75 mm through 50 mm of water into steel,
the median time of 5 runs (after one warm-up) of analyse_immersion with the computed field
(32 frequencies, pulse-echo, -6 and -20 dB) for 1, 3 and 6 depths, with and without the
focus (the flat element's widths come from the Fast Nearfield Method), and the median wall time
of the whole command line with 3 depths. Aim: well under a second of compute for a few depths.
"""

from __future__ import annotations

import json
import statistics
import subprocess
import sys
import time
from pathlib import Path

from beamspread.beam import Asked, FieldSettings
from beamspread.coupling.immersion import Focus, WaterPath, analyse_immersion
from beamspread.media.quantities import Wave
from beamspread.probes import Disc

RUNS = 5
DEPTHS = (0.004, 0.006, 0.008, 0.010, 0.015, 0.020)  # m
COMMAND = [
    "beam",
    "--diameter",
    "12.7mm",
    "--frequency",
    "5MHz",
    "--material",
    "reference-steel",
    "--water-path",
    "50mm",
    "--focus",
    "75mm",
    "--depth",
    "4mm",
    "--depth",
    "6mm",
    "--depth",
    "10mm",
    "--json",
]


def median(job) -> float:
    job()
    times = []
    for _ in range(RUNS):
        start = time.perf_counter()
        job()
        times.append(time.perf_counter() - start)
    return statistics.median(times)


def main() -> None:
    probe = Disc(0.0127, 5e6)
    part = Wave("reference-steel", "longitudinal", 5920.0, "ISO 22232-2:2020", "solid")
    water = WaterPath(1482.4, 0.05, 998.0)
    out = []
    for count in (1, 3, 6):
        for focus in (Focus(0.075), None):

            def job(focus=focus, count=count):
                asked = Asked(depths=DEPTHS[:count], field=FieldSettings())
                analyse_immersion(probe, part, water, asked, focus=focus)

            out.append(
                {
                    "case": f"{'focused' if focus else 'flat'}, {count} depths",
                    "median_s": round(median(job), 4),
                }
            )
    script = Path(sys.executable).with_name("beamspread")
    tool = [str(script)] if script.exists() else [sys.executable, "-m", "beamspread"]
    wall = median(lambda: subprocess.run([*tool, *COMMAND], check=True, capture_output=True))
    out.append({"case": "command line, focused, 3 depths (wall)", "median_s": round(wall, 4)})
    print(json.dumps(out, indent=2))


if __name__ == "__main__":
    main()
