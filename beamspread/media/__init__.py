"""Materials and media: types, the TOML table loader, equations and the registry."""

from typing import TYPE_CHECKING

from .._lazy import lazy_names
from .quantities import Curve, Parameter, Value, Wave, normalise_name

if TYPE_CHECKING:
    from .computed import ComputedMedium
    from .material import Material
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

# The registry, the table loader and the media types load on first use: a quantity type (what
# most of the core needs from here) does not pay for them.
_LAZY = {
    "ComputedMedium": "computed",
    "Material": "material",
    "Entry": "registry",
    "Registry": "registry",
    "build_registry": "registry",
    "config_dir": "registry",
    "user_table_dirs": "registry",
    "load_table": "tables",
    "parse_table": "tables",
}


__getattr__, __dir__ = lazy_names(__name__, _LAZY, globals())
