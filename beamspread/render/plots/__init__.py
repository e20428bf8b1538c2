"""Pictures of the beam: maps, profiles, directivity, the angle beam on a section, sonar cones.

One module per picture, each with a ``draw_*`` function that draws on a
given matplotlib Axes and returns its legend handles, a ``*_figure``
function that builds the picture's Figure around it, and a ``plot_*``
function that writes that figure to a file (see :mod:`.figure` for the
conventions shared by all). Importing this package does not import
matplotlib.
"""

from .across import across_figure, draw_across, plot_across
from .axis import axis_figure, draw_axis, plot_axis
from .directivity import directivity_figure, draw_directivity, plot_directivity
from .figure import (
    COLORMAP,
    DPI,
    FIGSIZE,
    FORMATS,
    check_target,
    new_figure,
    save_figure,
)
from .footprint import draw_footprint, footprint_figure, plot_footprint
from .map import MapArtists, draw_map, map_figure, plot_map
from .scales import FLOOR_DB
from .section import draw_section, plot_section, section_figure
from .section_geometry import (
    BeamEdge,
    SectionFootprint,
    SectionGeometry,
    section_footprints,
    section_of,
)

__all__ = [
    "COLORMAP",
    "DPI",
    "FIGSIZE",
    "FLOOR_DB",
    "FORMATS",
    "BeamEdge",
    "MapArtists",
    "SectionFootprint",
    "SectionGeometry",
    "across_figure",
    "axis_figure",
    "check_target",
    "directivity_figure",
    "draw_across",
    "draw_axis",
    "draw_directivity",
    "draw_footprint",
    "draw_map",
    "draw_section",
    "footprint_figure",
    "map_figure",
    "new_figure",
    "plot_across",
    "plot_axis",
    "plot_directivity",
    "plot_footprint",
    "plot_map",
    "plot_section",
    "save_figure",
    "section_figure",
    "section_footprints",
    "section_of",
]
