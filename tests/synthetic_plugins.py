"""Test plug-ins shared by the registry and isolation tests (their data is synthetic)."""

from __future__ import annotations

from beamspread import hookimpl


class Tables:
    """A test plug-in that hands over table locations."""

    def __init__(self, *locations):
        self.locations = locations

    @hookimpl
    def register_tables(self, register):
        for location in self.locations:
            register(location)


class Media:
    """A test plug-in that hands over media objects."""

    def __init__(self, *media):
        self.media = media

    @hookimpl
    def register_media(self, register):
        for medium in self.media:
            register(medium)
