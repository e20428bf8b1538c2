"""Start-up benchmark: `beamspread beam ... --json` against `python -c "import numpy"`.

Prints JSON: the median wall time of 5 runs of each (after one warm-up run) and their ratio.
Aim: a ratio of at most 3. Run from an environment where beamspread is installed.
"""

from __future__ import annotations

import json
import statistics
import subprocess
import sys
import time
from pathlib import Path

RUNS = 5
PROBE = ["beam", "--diameter", "10mm", "--frequency", "5MHz", "--depth", "100mm", "--json"]
BEAM = [*PROBE, "--speed", "5920m/s"]
BEAM_MATERIAL = [*PROBE, "--material", "reference-steel"]


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
    numpy_s = median_time([sys.executable, "-c", "import numpy"])
    beam_s = median_time([*tool, *BEAM])
    material_s = median_time([*tool, *BEAM_MATERIAL])
    print(
        json.dumps(
            {
                "runs": RUNS,
                "import_numpy_s": round(numpy_s, 4),
                "beam_speed_json_s": round(beam_s, 4),
                "beam_material_json_s": round(material_s, 4),
                "ratio": round(beam_s / numpy_s, 2),
                "ratio_with_material": round(material_s / numpy_s, 2),
            },
            indent=2,
        )
    )


if __name__ == "__main__":
    main()
