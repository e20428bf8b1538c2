"""The computed field of flat baffled pistons, near field included.

Continuous wave and broadband, one-way and pulse-echo, by the Fast Nearfield
Method (see :mod:`beamspread.field.engine`), and what follows from it: the
on-axis profile and its last maximum, transverse profiles, beam widths at any
level and depth, and maps in a plane through the axis
(:mod:`beamspread.field.profiles`); the paraxial field of a focused element and
its widths (:mod:`beamspread.field.focused`). numpy only.
"""

from typing import TYPE_CHECKING

from .._lazy import lazy_names
from .engine import MAX_POINTS, MODES, field_amplitude, pressure
from .profiles import (
    AxialProfile,
    BeamWidth,
    FieldMap,
    TransverseProfile,
    axial_profile,
    beam_width,
    beam_widths,
    field_map,
    last_maximum,
    transverse_profile,
)
from .spectrum import MAX_BANDWIDTH, SPECTRA, Spectrum, gaussian_spectrum, make_spectrum

if TYPE_CHECKING:
    from .focused import focused_amplitude, focused_beam_widths, focused_pressure

__all__ = [
    "MAX_BANDWIDTH",
    "MAX_POINTS",
    "MODES",
    "SPECTRA",
    "AxialProfile",
    "BeamWidth",
    "FieldMap",
    "Spectrum",
    "TransverseProfile",
    "axial_profile",
    "beam_width",
    "beam_widths",
    "field_amplitude",
    "field_map",
    "focused_amplitude",
    "focused_beam_widths",
    "focused_pressure",
    "gaussian_spectrum",
    "last_maximum",
    "make_spectrum",
    "pressure",
    "transverse_profile",
]

# The focused field loads on first use (flat elements, most of the command line, never need it).
_LAZY = dict.fromkeys(("focused_amplitude", "focused_beam_widths", "focused_pressure"), "focused")


__getattr__, __dir__ = lazy_names(__name__, _LAZY, globals())
