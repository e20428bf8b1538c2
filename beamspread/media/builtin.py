"""The built-in media, registered as a plug-in exactly like a third-party one.

Tables: every ``*.toml`` in the ``materials/`` folder shipped inside the
wheel. Computed media: fresh water, seawater and air by their conditions,
each with its absorption.

Seawater comes by three equations. ``seawater`` (and ``sea-water``) names
Mackenzie (1981): it takes the depth a sonar user knows, and over 0-1000 m it
lies within a few tenths of a m/s of TEOS-10 -- far below anything a beam
width can show. ``seawater-unesco`` is the UNESCO equation (Chen & Millero
1977, Fofonoff & Millard 1983), the reference of the older oceanographic
literature, and ``seawater-del-grosso`` Del Grosso's (1974) NRL II equation,
which lies closest to TEOS-10; both take sea pressure. Give them ``pressure``
(dbar) or ``depth`` (m, converted by Saunders 1981 at ``latitude``), not both: a
condition left at 0 counts as not given, and two non-zero values are refused
rather than one silently preferred.
"""

from __future__ import annotations

from dataclasses import replace
from importlib.resources import files
from pathlib import Path

from .. import absorption as ab
from ..errors import InputError
from ..hookspecs import hookimpl
from . import equations as eq
from .computed import ComputedMedium
from .quantities import Parameter

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
    "temperature",
    "temperature",
    "degC",
    20.0,
    (0.0, 95.0),
    (-5.0, 100.0),
    "water temperature (ITS-90)",
)
_SEA_T = Parameter(
    "temperature", "temperature", "degC", 10.0, (-2.0, 30.0), (-3.0, 40.0), "water temperature"
)
_SEA_S = Parameter(
    "salinity", "salinity", "g/kg", 35.0, (25.0, 40.0), (0.0, 50.0), "salinity, parts per thousand"
)
_SEA_D = Parameter(
    "depth", "length", "m", 0.0, (0.0, 8000.0), (0.0, 11000.0), "depth below the surface"
)
_AIR_T = Parameter(
    "temperature", "temperature", "degC", 20.0, (-40.0, 60.0), (-100.0, 300.0), "air temperature"
)
_KELL = "Kell (1975), J. Chem. Eng. Data 20, 97 (coefficients from memory)"

# UNESCO (Chen & Millero 1977): 0-40 degC, salinity 0-40, 0-10000 dbar.
_UN_T = Parameter(
    "temperature",
    "temperature",
    "degC",
    10.0,
    (0.0, 40.0),
    (-3.0, 45.0),
    "water temperature (ITS-90; converted to IPTS-68 for the equation)",
)
_UN_S = Parameter(
    "salinity", "salinity", "g/kg", 35.0, (0.0, 40.0), (0.0, 50.0), "practical salinity"
)
_UN_P = Parameter(
    "pressure",
    "pressure",
    "dbar",
    0.0,
    (0.0, 10000.0),
    (0.0, 11500.0),
    "sea pressure above the atmosphere; give this or depth, not both",
)
_UN_D = Parameter(
    "depth",
    "length",
    "m",
    0.0,
    (0.0, 9800.0),
    (0.0, 11300.0),
    "depth below the surface, converted to pressure by Saunders (1981); "
    "give this or pressure, not both",
)
_UN_LAT = Parameter(
    "latitude",
    "angle",
    "deg",
    45.0,
    (-90.0, 90.0),
    (-90.0, 90.0),
    "latitude in degrees, for the depth-to-pressure conversion",
)
# Del Grosso (1974): 0-30 degC, salinity 30-40, 0-1000 kg/cm2 (9800 dbar).
_DG_T = replace(_UN_T, valid=(0.0, 30.0), limits=(-3.0, 40.0))
_DG_S = replace(_SEA_S, valid=(30.0, 40.0))
_DG_P = replace(_UN_P, valid=(0.0, 9800.0))
# Absorption only: the pH of seawater (Francois & Garrison; Ainslie & McColm's stated range).
_PH = Parameter("ph", "number", "", 8.0, (7.7, 8.3), (6.0, 9.0), "pH of the seawater")
_SEA_ABSORPTION_BAND = (200.0, 1e6)  # Hz, Francois & Garrison's measurements (from memory)

# Air, Cramer (1993): 0-30 degC, 75-102 kPa as commonly quoted, humidity 0-100 %, CO2 to 1 %.
_CR_T = Parameter(
    "temperature", "temperature", "degC", 20.0, (0.0, 30.0), (-40.0, 60.0), "air temperature"
)
_CR_H = Parameter("humidity", "percent", "%", 50.0, (0.0, 100.0), (0.0, 100.0), "relative humidity")
_CR_P = Parameter(
    "pressure", "pressure", "kPa", 101.325, (75.0, 102.0), (10.0, 200.0), "atmospheric pressure"
)
_CR_C = Parameter(
    "co2", "percent", "%", 0.04, (0.0, 1.0), (0.0, 1.0), "carbon dioxide mole fraction"
)
# ISO 9613-1: 4e-4 to 10 Hz/Pa, i.e. about 40 Hz to 1 MHz at sea level (from memory).
_AIR_ABSORPTION_BAND = (50.0, 1e6)


def _sea_pressure(pressure, depth, latitude, medium="seawater-unesco"):
    """The sea pressure in dbar: as given, or from a depth by Saunders (1981).

    A condition at 0 counts as not given; both above 0 are refused.
    """
    if pressure > 0.0 and depth > 0.0:
        raise InputError(
            f"{medium} takes pressure or depth, not both: "
            f"pressure {pressure:g} dbar and depth {depth:g} m were given"
        )
    if depth > 0.0:
        return float(eq.pressure_from_depth_saunders(depth, latitude))
    return pressure


def _pressure_and_depth(medium):
    """The sea pressure and depth a pressure-based medium works with, whichever was given."""

    def derived(temperature, salinity, pressure, depth, latitude):
        p = _sea_pressure(pressure, depth, latitude, medium)
        z = depth if depth > 0.0 else float(eq.depth_from_pressure_saunders(p, latitude))
        return {"pressure": p, "depth": z}

    return derived


def _unesco_speed(temperature, salinity, pressure, depth, latitude):
    return eq.seawater_unesco(temperature, salinity, _sea_pressure(pressure, depth, latitude))


def _del_grosso_speed(temperature, salinity, pressure, depth, latitude):
    return eq.seawater_del_grosso(
        temperature, salinity, _sea_pressure(pressure, depth, latitude, "seawater-del-grosso")
    )


def _pressure_absorption(medium):
    """Francois & Garrison for a pressure-based medium: depth from the pressure (Saunders)."""

    def absorption(frequency, temperature, salinity, pressure, depth, latitude, ph):
        p = _sea_pressure(pressure, depth, latitude, medium)
        z = float(eq.depth_from_pressure_saunders(p, latitude))
        return ab.francois_garrison(frequency, temperature, salinity, z, ph)

    return absorption


def _air_absorption(frequency, temperature, humidity, pressure, co2):
    del co2  # ISO 9613-1 is written for air of normal composition
    return ab.air_iso9613(frequency, temperature, humidity, pressure)


def _sea_density(temperature, salinity, pressure, depth, latitude):
    return 1025.0


# What the two equations of pure water share: density, absorption, description.
_FRESH_WATER = dict(
    density=eq.water_density_kell,
    density_source=_KELL,
    category="liquid",
    description="pure water at atmospheric pressure, by temperature",
    absorption=lambda frequency, temperature: ab.fresh_water(frequency, temperature),
    absorption_source=ab.FRESH_WATER,
    absorption_frequency=_SEA_ABSORPTION_BAND,
)
_SEA_DENSITY_SOURCE = "typical surface seawater, 1025 kg/m3 (common practice)"


def _pressure_seawater(name, speed, source, parameters, aliases):
    """A seawater equation by sea pressure (or depth), with Francois & Garrison's absorption."""
    return ComputedMedium(
        name,
        "liquid",
        speed,
        source=source,
        parameters=parameters,
        density=_sea_density,
        density_source=_SEA_DENSITY_SOURCE,
        aliases=aliases,
        category="liquid",
        description="seawater by temperature, salinity and pressure (or depth)",
        absorption=_pressure_absorption(name),
        derived=_pressure_and_depth(name),
        absorption_source=ab.FRANCOIS_GARRISON,
        absorption_parameters=(_PH,),
        absorption_frequency=_SEA_ABSORPTION_BAND,
    )


MEDIA = (
    ComputedMedium(
        "water",
        "liquid",
        eq.water_marczak,
        source="Marczak (1997), J. Acoust. Soc. Am. 102, 2776: pure water, 0-95 degC",
        parameters=(_WATER_T,),
        aliases=("fresh-water", "water-marczak"),
        **_FRESH_WATER,
    ),
    ComputedMedium(
        "water-bilaniuk-wong",
        "liquid",
        eq.water_bilaniuk_wong,
        source="Bilaniuk & Wong (1993, erratum 1996), J. Acoust. Soc. Am. 93, 1609: "
        "148-point fit, 0-100 degC",
        parameters=(replace(_WATER_T, valid=(0.0, 100.0)),),
        **_FRESH_WATER,
    ),
    ComputedMedium(
        "seawater-mackenzie",
        "liquid",
        eq.seawater_mackenzie,
        source="Mackenzie (1981), J. Acoust. Soc. Am. 70, 807: nine-term equation",
        parameters=(_SEA_T, _SEA_S, _SEA_D),
        density=lambda temperature, salinity, depth: 1025.0,
        density_source=_SEA_DENSITY_SOURCE,
        aliases=("seawater", "sea-water"),
        category="liquid",
        description="seawater by temperature, salinity and depth (the default seawater)",
        absorption=ab.francois_garrison,
        absorption_source=ab.FRANCOIS_GARRISON,
        absorption_parameters=(_PH,),
        absorption_frequency=_SEA_ABSORPTION_BAND,
    ),
    _pressure_seawater(
        "seawater-unesco",
        _unesco_speed,
        "UNESCO equation: Chen & Millero (1977), J. Acoust. Soc. Am. 62, 1129, as coded "
        "by Fofonoff & Millard (1983), UNESCO Tech. Pap. Mar. Sci. 44 (T68 = 1.00024 T90); "
        "depth to pressure by Saunders (1981), J. Phys. Oceanogr. 11, 573",
        (_UN_T, _UN_S, _UN_P, _UN_D, _UN_LAT),
        ("seawater-chen-millero",),
    ),
    _pressure_seawater(
        "seawater-del-grosso",
        _del_grosso_speed,
        "Del Grosso (1974), J. Acoust. Soc. Am. 56, 1084: the NRL II equation "
        "(T68 = 1.00024 T90, pressure in kg/cm2 = dbar / 9.80665); depth to pressure by "
        "Saunders (1981), J. Phys. Oceanogr. 11, 573",
        (_DG_T, _DG_S, _DG_P, _UN_D, _UN_LAT),
        ("seawater-nrl2",),
    ),
    ComputedMedium(
        "air",
        "gas",
        eq.air_cramer,
        source="Cramer (1993), J. Acoust. Soc. Am. 93, 2510: humid air by temperature, "
        "pressure, humidity and CO2",
        parameters=(_CR_T, _CR_H, _CR_P, _CR_C),
        density=eq.air_density_humid,
        density_source="ideal-gas law for the mixture of dry air and water vapour "
        "(common practice)",
        aliases=("air-cramer", "humid-air"),
        category="gas",
        description="air by temperature, humidity and pressure",
        absorption=_air_absorption,
        absorption_source=ab.ISO_9613_1,
        absorption_frequency=_AIR_ABSORPTION_BAND,
    ),
    ComputedMedium(
        "air-ideal",
        "gas",
        eq.air_speed_ideal,
        source="ideal-gas form 331.3 sqrt(1 + T/273.15) m/s for dry air (common practice)",
        parameters=(_AIR_T,),
        density=eq.air_density_ideal,
        density_source="ideal-gas law for dry air at 101.325 kPa (common practice)",
        aliases=("dry-air",),
        category="gas",
        description="dry air at sea-level pressure, by temperature",
        absorption=lambda frequency, temperature: ab.air_iso9613(frequency, temperature, 0.0),
        absorption_source=ab.ISO_9613_1 + ", dry air at 101.325 kPa",
        absorption_frequency=_AIR_ABSORPTION_BAND,
    ),
)


@hookimpl
def register_tables(register):
    register(materials_location())


@hookimpl
def register_media(register):
    for medium in MEDIA:
        register(medium)
