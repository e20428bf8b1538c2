"""beamspread: how wide an ultrasonic or sonar transducer's beam is where it matters.

The core computes in SI units and never prints: build a probe, resolve a
medium, and call :func:`analyse`::

    >>> import beamspread as bs
    >>> steel = bs.build_registry().get("reference-steel").medium.evaluate("longitudinal")
    >>> result = bs.analyse(bs.Disc(0.010, 5e6), steel, depths=[0.1])
    >>> round(result.near_field * 1e3, 1)
    20.8
"""

from typing import TYPE_CHECKING

from ._lazy import lazy_names
from .axis import (
    disc_axial_pressure,
    disc_near_field,
    rectangle_axial_pressure,
    rectangle_near_field,
    simple_near_field,
)
from .beam import (
    Asked,
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
from .pattern import directivity, first_null, half_angle, level_amplitude, pattern_x
from .probes import Disc, Rectangle

if TYPE_CHECKING:
    from .absorption import ainslie_mccolm, air_iso9613, francois_garrison, fresh_water
    from .batch import FarFieldBeams, far_field_beams
    from .conventions import Coupling, Method, Mode
    from .coupling.immersion import Focus, WaterPath, analyse_immersion
    from .coupling.result import SetupResult
    from .coupling.wedge import Wedge, analyse_wedge
    from .design.result import Design
    from .design.solvers import size_disc, size_frequency, size_rectangle_side, smallest_spot
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
    from .pipeline import Result, compute
    from .scan import ScanPlan, plan_scan
    from .setups import critical_angles, refract
    from .sonar.beam_angle import equivalent_beam_angle
    from .sonar.directivity import directivity_index
    from .sonar.echo import EchoBudget, echo_budget
    from .sonar.figures import SonarFigures, sonar_figures
    from .sonar.footprint import footprint_width
    from .source import FieldSource
    from .technique import (
        Contact,
        PartMedium,
        Pulse,
        Request,
        Sonar,
        Technique,
        WaterCoupling,
        WedgeCoupling,
    )

__version__ = "0.1.0"

__all__ = [
    "Asked",
    "AxialProfile",
    "BeamResult",
    "BeamWidth",
    "BeamspreadError",
    "ComputedMedium",
    "Contact",
    "Convention",
    "Coupling",
    "Curve",
    "Design",
    "Disc",
    "EchoBudget",
    "Entry",
    "FarFieldBeams",
    "FieldMap",
    "FieldSettings",
    "FieldSource",
    "FieldSummary",
    "Focus",
    "InputError",
    "Material",
    "MaterialError",
    "Method",
    "Mode",
    "Parameter",
    "PartMedium",
    "PlaneResult",
    "PluginError",
    "Pulse",
    "Rectangle",
    "Registry",
    "Request",
    "Result",
    "ScanPlan",
    "SetupResult",
    "Sonar",
    "SonarFigures",
    "Spot",
    "TableError",
    "Technique",
    "TransverseProfile",
    "Value",
    "WaterCoupling",
    "WaterPath",
    "Wave",
    "Wedge",
    "WedgeCoupling",
    "__version__",
    "ainslie_mccolm",
    "air_iso9613",
    "analyse",
    "analyse_immersion",
    "analyse_wedge",
    "axial_profile",
    "beam_width",
    "beam_widths",
    "build_registry",
    "compute",
    "critical_angles",
    "directivity",
    "directivity_index",
    "disc_axial_pressure",
    "disc_near_field",
    "echo_budget",
    "equivalent_beam_angle",
    "far_field_beams",
    "field_amplitude",
    "field_map",
    "first_null",
    "footprint_width",
    "francois_garrison",
    "fresh_water",
    "half_angle",
    "hookimpl",
    "last_maximum",
    "level_amplitude",
    "level_key",
    "load_table",
    "parse_table",
    "pattern_x",
    "plan_scan",
    "rectangle_axial_pressure",
    "rectangle_near_field",
    "refract",
    "simple_near_field",
    "size_disc",
    "size_frequency",
    "size_rectangle_side",
    "smallest_spot",
    "sonar_figures",
    "transverse_profile",
]

# The later tools' headline names, the computed field, the media registry and the plug-in
# marker (pluggy) load on first use, so that `import beamspread` (and with it the command
# line's start-up) does not pay for modules a command may never touch.
_LAZY = {
    **dict.fromkeys(
        (
            "AxialProfile",
            "BeamWidth",
            "FieldMap",
            "TransverseProfile",
            "axial_profile",
            "beam_width",
            "beam_widths",
            "field_amplitude",
            "field_map",
            "last_maximum",
            "transverse_profile",
        ),
        "field",
    ),
    "hookimpl": "hookspecs",  # pluggy loads with it
    **dict.fromkeys(
        (
            "ComputedMedium",
            "Curve",
            "Entry",
            "Material",
            "Parameter",
            "Registry",
            "Value",
            "Wave",
            "build_registry",
            "load_table",
            "parse_table",
        ),
        "media",
    ),
    "Technique": "technique",
    "PartMedium": "technique",
    "Contact": "technique",
    "WedgeCoupling": "technique",
    "WaterCoupling": "technique",
    "Pulse": "technique",
    "Request": "technique",
    "Sonar": "technique",
    "compute": "pipeline",
    "Result": "pipeline",
    "FieldSource": "source",
    "Mode": "conventions",
    "Method": "conventions",
    "Coupling": "conventions",
    "FarFieldBeams": "batch",
    "far_field_beams": "batch",
    "ainslie_mccolm": "absorption",
    "air_iso9613": "absorption",
    "francois_garrison": "absorption",
    "fresh_water": "absorption",
    "Design": "design.result",
    "size_disc": "design.solvers",
    "size_frequency": "design.solvers",
    "size_rectangle_side": "design.solvers",
    "smallest_spot": "design.solvers",
    "Focus": "coupling.immersion",
    "SetupResult": "coupling.result",
    "WaterPath": "coupling.immersion",
    "Wedge": "coupling.wedge",
    "analyse_immersion": "coupling.immersion",
    "analyse_wedge": "coupling.wedge",
    "ScanPlan": "scan",
    "plan_scan": "scan",
    "critical_angles": "setups",
    "refract": "setups",
    "EchoBudget": "sonar.echo",
    "SonarFigures": "sonar.figures",
    "directivity_index": "sonar.directivity",
    "echo_budget": "sonar.echo",
    "equivalent_beam_angle": "sonar.beam_angle",
    "footprint_width": "sonar.footprint",
    "sonar_figures": "sonar.figures",
}


__getattr__, __dir__ = lazy_names(__name__, _LAZY, globals())
