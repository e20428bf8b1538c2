"""beamspread: how wide an ultrasonic or sonar transducer's beam is where it matters.

The core computes in SI units and never prints: build a probe, resolve a
medium, and call :func:`analyse`::

    >>> import beamspread as bs
    >>> steel = bs.build_registry().get("reference-steel").medium.evaluate("longitudinal")
    >>> result = bs.analyse(bs.Disc(0.010, 5e6), steel, depths=[0.1])
    >>> round(result.near_field * 1e3, 1)
    20.8
"""

from .axis import (
    disc_axial_pressure,
    disc_near_field,
    rectangle_axial_pressure,
    rectangle_near_field,
    simple_near_field,
)
from .beam import (
    BeamResult,
    Convention,
    FieldSettings,
    FieldSummary,
    PlaneResult,
    Spot,
    analyse,
    level_key,
)
from .errors import BeamspreadError, InputError, MaterialError, PluginError, TableError
from .field import (
    AxialProfile,
    BeamWidth,
    FieldMap,
    TransverseProfile,
    axial_profile,
    beam_width,
    beam_widths,
    field_amplitude,
    field_map,
    last_maximum,
    transverse_profile,
)
from .hookspecs import hookimpl
from .media import (
    ComputedMedium,
    Curve,
    Entry,
    Material,
    Parameter,
    Registry,
    Value,
    Wave,
    build_registry,
    load_table,
    parse_table,
)
from .pattern import directivity, first_null, half_angle, level_amplitude, pattern_x
from .probes import Disc, Rectangle

__version__ = "0.1.0"

__all__ = [
    "AxialProfile",
    "BeamResult",
    "BeamWidth",
    "BeamspreadError",
    "ComputedMedium",
    "Convention",
    "Curve",
    "Disc",
    "Entry",
    "FieldMap",
    "FieldSettings",
    "FieldSummary",
    "InputError",
    "Material",
    "MaterialError",
    "Parameter",
    "PlaneResult",
    "PluginError",
    "Rectangle",
    "Registry",
    "Spot",
    "TableError",
    "TransverseProfile",
    "Value",
    "Wave",
    "__version__",
    "analyse",
    "axial_profile",
    "beam_width",
    "beam_widths",
    "build_registry",
    "directivity",
    "disc_axial_pressure",
    "disc_near_field",
    "field_amplitude",
    "field_map",
    "first_null",
    "half_angle",
    "hookimpl",
    "last_maximum",
    "level_amplitude",
    "level_key",
    "load_table",
    "parse_table",
    "pattern_x",
    "rectangle_axial_pressure",
    "rectangle_near_field",
    "simple_near_field",
    "transverse_profile",
]
