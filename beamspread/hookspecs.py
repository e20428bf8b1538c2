"""The plug-in hooks of beamspread.

A plug-in is a module (or any object) with functions marked
``@beamspread.hookimpl`` and named as below, registered through the
``beamspread`` entry-point group::

    [project.entry-points.beamspread]
    my-tables = "my_package.plugin"

Each hook receives a ``register`` callback and calls it once per thing it
provides. Precedence on a name clash: a user's own tables win over plug-ins,
and plug-ins win over the built-in tables (see ``beamspread materials show``).
"""

from __future__ import annotations

import pluggy

__all__ = ["PROJECT", "hookimpl", "hookspec"]

PROJECT = "beamspread"
hookspec = pluggy.HookspecMarker(PROJECT)
hookimpl = pluggy.HookimplMarker(PROJECT)


@hookspec
def register_tables(register):
    """Hand over material tables (TOML files in beamspread's table format).

    Call ``register(location)`` once per location. ``location`` is a
    directory, whose ``*.toml`` files are all read, or a single ``.toml``
    file; a :class:`pathlib.Path` or an ``importlib.resources`` Traversable
    (use ``importlib.resources.files("my_package") / "tables"`` so the files
    are found inside an installed wheel). Values in the files are SI or carry
    their units; see DEVELOPERS.md for the format.
    """


@hookspec
def register_media(register):
    """Hand over media computed by code, such as a sound-speed equation.

    Call ``register(medium)`` once per medium, with a
    :class:`beamspread.ComputedMedium` (or a :class:`beamspread.Material`).
    A computed medium declares its parameters (name, unit, default, the
    range its equation was fitted to, and the limits beyond which it means
    nothing); its speed functions take each parameter by keyword in the
    declared unit and return m/s.
    """
