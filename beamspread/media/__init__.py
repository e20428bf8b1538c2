"""Materials and media: types, the TOML table loader, equations and the registry."""

from .computed import ComputedMedium
from .material import Material
from .quantities import Curve, Parameter, Value, Wave, normalise_name
from .registry import Entry, Registry, build_registry, config_dir, user_table_dirs
from .tables import load_table, parse_table

__all__ = [
    "ComputedMedium",
    "Curve",
    "Entry",
    "Material",
    "Parameter",
    "Registry",
    "Value",
    "Wave",
    "build_registry",
    "config_dir",
    "load_table",
    "normalise_name",
    "parse_table",
    "user_table_dirs",
]
