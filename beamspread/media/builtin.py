"""The built-in media, registered as a plug-in exactly like a third-party one.

Tables: every ``*.toml`` in the ``materials/`` folder shipped inside the
wheel. Computed media: fresh water, seawater and air by their conditions.
"""

from __future__ import annotations

from importlib.resources import files
from pathlib import Path

from ..hookspecs import hookimpl
from . import equations as eq
from .model import ComputedMedium, Parameter

__all__ = ["MEDIA", "materials_location", "register_media", "register_tables"]


def materials_location():
    """The built-in tables: ``beamspread/materials`` inside an installed wheel.

    Running from a source checkout (or an editable install, which does not
    copy data), the tables are the top-level ``materials/`` folder beside
    the package.
    """
    packaged = files("beamspread") / "materials"
    if packaged.is_dir():
        return packaged
    return Path(str(files("beamspread"))).parent / "materials"


_WATER_T = Parameter(
    "temperature", "temperature", "degC", 20.0, (0.0, 95.0), (-5.0, 100.0),
    "water temperature (ITS-90)",
)
_SEA_T = Parameter("temperature", "temperature", "degC", 10.0, (-2.0, 30.0), (-3.0, 40.0),
                   "water temperature")
_SEA_S = Parameter("salinity", "salinity", "g/kg", 35.0, (25.0, 40.0), (0.0, 50.0),
                   "salinity, parts per thousand")
_SEA_D = Parameter("depth", "length", "m", 0.0, (0.0, 8000.0), (0.0, 11000.0),
                   "depth below the surface")
_AIR_T = Parameter("temperature", "temperature", "degC", 20.0, (-40.0, 60.0), (-100.0, 300.0),
                   "air temperature")
_KELL = "Kell (1975), J. Chem. Eng. Data 20, 97 (coefficients from memory)"

MEDIA = (
    ComputedMedium(
        "water", "liquid", eq.water_marczak,
        source="Marczak (1997), J. Acoust. Soc. Am. 102, 2776: pure water, 0-95 degC",
        parameters=(_WATER_T,), density=eq.water_density_kell, density_source=_KELL,
        aliases=("fresh-water", "water-marczak"), category="liquid",
        description="pure water at atmospheric pressure, by temperature",
    ),
    ComputedMedium(
        "water-bilaniuk-wong", "liquid", eq.water_bilaniuk_wong,
        source="Bilaniuk & Wong (1993, erratum 1996), J. Acoust. Soc. Am. 93, 1609: "
        "148-point fit, 0-100 degC",
        parameters=(Parameter("temperature", "temperature", "degC", 20.0, (0.0, 100.0),
                              (-5.0, 100.0), "water temperature (ITS-90)"),),
        density=eq.water_density_kell, density_source=_KELL, category="liquid",
        description="pure water at atmospheric pressure, by temperature",
    ),
    ComputedMedium(
        "seawater-mackenzie", "liquid", eq.seawater_mackenzie,
        source="Mackenzie (1981), J. Acoust. Soc. Am. 70, 807: nine-term equation",
        parameters=(_SEA_T, _SEA_S, _SEA_D),
        density=lambda temperature, salinity, depth: 1025.0,
        density_source="typical surface seawater, 1025 kg/m3 (common practice)",
        aliases=("seawater", "sea-water"), category="liquid",
        description="seawater by temperature, salinity and depth",
    ),
    ComputedMedium(
        "air", "gas", eq.air_speed_ideal,
        source="ideal-gas form 331.3 sqrt(1 + T/273.15) m/s for dry air (common practice)",
        parameters=(_AIR_T,), density=eq.air_density_ideal,
        density_source="ideal-gas law for dry air at 101.325 kPa (common practice)",
        aliases=("dry-air",), category="gas",
        description="dry air at sea-level pressure, by temperature",
    ),
)


@hookimpl
def register_tables(register):
    register(materials_location())


@hookimpl
def register_media(register):
    for medium in MEDIA:
        register(medium)
