"""The sonar trade's conventions, which differ from an inspector's.

What the sonar trade quotes differs from what an inspector quotes: one-way
(transmit only) rather than pulse-echo, -3 dB rather than -6 dB, the full
angle rather than the half-angle. :data:`SONAR_MODE` and :data:`SONAR_LEVELS`
hold those defaults; every function of :mod:`beamspread.sonar` still takes the
mode and level explicitly, and every result says which it used.

Everything is in SI units (m, Hz, rad, W) except levels, in dB, and the
figures of :class:`~beamspread.sonar.figures.SonarFigures`, whose angles are
in degrees like those of :class:`beamspread.BeamResult`.
"""

from __future__ import annotations

SONAR_MODE = "one-way"
SONAR_LEVELS = (3.0,)
SONAR_BANDWIDTH = 0.1  # a resonant sonar transducer's -6 dB fractional bandwidth (common practice)
SONAR_LEVELS_SHOWN = (3.0, 10.0)  # what --sonar shows by default: -3 dB, and -10 dB beside it
"""The sonar trade's default: the one-way -3 dB beam, quoted as a full angle."""
