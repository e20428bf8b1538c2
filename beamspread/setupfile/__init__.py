"""Setup files: a technique recorded in TOML, so that it can be repeated exactly.

The format is beamspread's own. Quantities are strings with their unit
(``"10 mm"``, ``"5 MHz"``), so a file never depends on a default unit::

    format = 1
    title = "Plate weld, 45 degree shear"        # optional
    description = "..."                          # optional

    [probe]
    shape = "disc"              # disc: diameter; rectangle: length and width
    diameter = "10 mm"
    frequency = "5 MHz"
    focus = "50 mm"             # optional: focal length

    [medium]
    material = "reference-steel"   # or: speed = "5920 m/s"
    wave = "longitudinal"          # or "shear" (default: longitudinal; shear on a wedge)
    temperature = "20 degC"        # optional, with a material
    conditions = { salinity = "35", depth = "30 m" }   # optional, as the medium declares

    [wedge]                  # optional
    material = "acrylic"     # or: speed = "2730 m/s"
    incident = "36.4 deg"    # or: refracted = "45 deg"
    path = "12 mm"

    [immersion]              # optional
    water_path = "40 mm"
    couplant = "water"

    [part]                   # optional
    thickness = "25 mm"

    [inspection]             # optional
    depths = ["20 mm", "40 mm", "50 mm:90 mm:10 mm"]   # a depth, or START:STOP:STEP
    levels = ["-6 dB", "-20 dB"]

    [bottom]                 # optional: a bare transducer in water over a flat bottom
    depths = ["10 m:40 m:10 m"]   # water depths (--bottom-depth), or START:STOP:STEP
    power = "100 W"               # electrical power, for an echo budget (--power)
    efficiency = 0.5              # electro-acoustic, above 0 and at most 1 (--efficiency)
    loss = "10 dB"                # the bottom's reflection loss, 0 or more (--bottom-loss)

    [conventions]            # optional
    sonar = true             # the sonar trade's conventions and figures (--sonar)
    mode = "pulse-echo"      # or "one-way" (default: the command's, one-way with sonar)
    bandwidth = 0.5          # -6 dB fractional bandwidth; 0 is a continuous wave
    spectrum = "gaussian"
    frequencies = 32

Unknown sections and keys are errors, named with the file and line.
:meth:`Setup.to_options` gives the command-line options the setup stands for.
"""

from __future__ import annotations

from .io import FORMAT, dumps_setup, load_setup, parse_setup, save_setup
from .keys import recordable_options
from .model import Setup

__all__ = [
    "FORMAT",
    "Setup",
    "dumps_setup",
    "load_setup",
    "parse_setup",
    "recordable_options",
    "save_setup",
]
