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
from .beam import BeamResult, Convention, PlaneResult, Spot, analyse, level_key
from .errors import BeamspreadError, InputError, MaterialError, PluginError, TableError
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
    "BeamResult",
    "BeamspreadError",
    "ComputedMedium",
    "Convention",
    "Curve",
    "Disc",
    "Entry",
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
    "Value",
    "Wave",
    "__version__",
    "analyse",
    "build_registry",
    "directivity",
    "disc_axial_pressure",
    "disc_near_field",
    "first_null",
    "half_angle",
    "hookimpl",
    "level_amplitude",
    "level_key",
    "load_table",
    "parse_table",
    "pattern_x",
    "rectangle_axial_pressure",
    "rectangle_near_field",
    "simple_near_field",
]
