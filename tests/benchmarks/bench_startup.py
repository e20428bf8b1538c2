"""Start-up benchmark: `beamspread beam ... --json` against `python -c "import numpy"`.

Prints JSON: the median wall time of 5 runs of each (after one warm-up run) and their ratio.
Aim: a ratio of at most 3. Also the README's first example (computed field included) against
the same with ``--far-field-only``, run alternately, median of 7 (aim: at most 1.5), and the
1-minute load average at the start (the machine may be shared). Run from an environment where
beamspread is installed; no thread variable is set.
"""

from __future__ import annotations

import json
import os
import statistics
import subprocess
import sys
import time
from pathlib import Path

RUNS = 5
PROBE = ["beam", "--diameter", "10mm", "--frequency", "5MHz", "--depth", "100mm", "--json"]
BEAM = [*PROBE, "--speed", "5920m/s"]
BEAM_MATERIAL = [*PROBE, "--material", "reference-steel"]
FIRST_EXAMPLE = [
    "beam", "--diameter", "12.7mm", "--frequency", "2.25MHz", "--material", "carbon-steel",
    "--depth", "25mm", "--depth", "75mm",
]  # fmt: skip


def alternate(first: list[str], second: list[str], runs: int = 7) -> tuple[float, float]:
    """Median wall times of two commands, run one after the other, ``runs`` times."""
    subprocess.run(first, check=True, capture_output=True)
    subprocess.run(second, check=True, capture_output=True)
    a, b = [], []
    for _ in range(runs):
        for command, times in ((first, a), (second, b)):
            start = time.perf_counter()
            subprocess.run(command, check=True, capture_output=True)
            times.append(time.perf_counter() - start)
    return statistics.median(a), statistics.median(b)


def median_time(command: list[str]) -> float:
    subprocess.run(command, check=True, capture_output=True)  # warm the file cache
    times = []
    for _ in range(RUNS):
        start = time.perf_counter()
        subprocess.run(command, check=True, capture_output=True)
        times.append(time.perf_counter() - start)
    return statistics.median(times)


def main() -> None:
    script = Path(sys.executable).with_name("beamspread")  # the console script of this venv
    tool = [str(script)] if script.exists() else [sys.executable, "-m", "beamspread"]
    load = os.getloadavg()[0]
    numpy_s = median_time([sys.executable, "-c", "import numpy"])
    beam_s = median_time([*tool, *BEAM])
    material_s = median_time([*tool, *BEAM_MATERIAL])
    field_s, far_s = alternate([*tool, *FIRST_EXAMPLE], [*tool, *FIRST_EXAMPLE, "--far-field-only"])
    print(
        json.dumps(
            {
                "runs": RUNS,
                "import_numpy_s": round(numpy_s, 4),
                "beam_speed_json_s": round(beam_s, 4),
                "beam_material_json_s": round(material_s, 4),
                "ratio": round(beam_s / numpy_s, 2),
                "ratio_with_material": round(material_s / numpy_s, 2),
                "first_example_s": round(field_s, 4),
                "first_example_far_field_only_s": round(far_s, 4),
                "field_over_far_field_only": round(field_s / far_s, 2),
                "load_average": round(load, 2),
            },
            indent=2,
        )
    )


if __name__ == "__main__":
    main()
