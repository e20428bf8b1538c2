"""The hooks of the Fairlead example plug-in, found through its entry point.

``pyproject.toml`` names this module in the ``beamspread`` entry-point group::

    [project.entry-points.beamspread]
    fairlead = "beamspread_fairlead.plugin"

beamspread imports it and calls each function marked ``@hookimpl`` with a
``register`` callback. The numbers here are invented for the example; they
describe no real material.
"""

from __future__ import annotations

from importlib.resources import files

from beamspread import ComputedMedium, Parameter, hookimpl

__all__ = [
    "GEL",
    "GEL_DENSITY",
    "gel_density",
    "gel_longitudinal",
    "register_media",
    "register_tables",
]

INVENTED = "invented demo law for the example plug-in, not a measurement"

# The invented law: 1610 m/s at 20 degC, falling by 3.1 m/s per kelvin.
GEL_SPEED_20C = 1610.0  # m/s
GEL_SLOPE = -3.1  # m/s per degC
GEL_DENSITY = 1050.0  # kg/m3


def gel_longitudinal(temperature: float) -> float:
    """Longitudinal speed of the couplant gel in m/s, ``temperature`` in degC."""
    return GEL_SPEED_20C + GEL_SLOPE * (temperature - 20.0)


def gel_density(temperature: float) -> float:
    """Density of the couplant gel in kg/m3: a constant, whatever the temperature."""
    return GEL_DENSITY


GEL = ComputedMedium(
    name="fairlead-couplant-gel",
    state="liquid",
    longitudinal=gel_longitudinal,
    source=f"1610 - 3.1 (T - 20) m/s; {INVENTED}",
    parameters=(
        Parameter(
            "temperature",
            "temperature",
            "degC",
            default=20.0,
            valid=(0.0, 40.0),
            limits=(-10.0, 60.0),
            description="gel temperature",
        ),
    ),
    density=gel_density,
    density_source=f"1050 kg/m3 at any temperature; {INVENTED}",
    aliases=("fairlead gel",),
    category="couplant",
    description="the workshop's contact gel (invented example), by temperature",
    note="invented demo data for the Fairlead example plug-in; not a measurement",
)


@hookimpl
def register_tables(register):
    """Hand over the tables shipped inside the package (found inside an installed wheel)."""
    register(files("beamspread_fairlead") / "tables")


@hookimpl
def register_media(register):
    """Hand over the media computed by code."""
    register(GEL)
