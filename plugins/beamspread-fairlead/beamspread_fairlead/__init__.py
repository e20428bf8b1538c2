"""Example beamspread plug-in for Fairlead Marine Fabrication, an invented workshop.

It shows both plug-in hooks: a material table shipped inside the package
(``tables/fairlead.toml``) and a medium computed by code (a couplant gel
whose speed follows a linear law in temperature). Every number in it is
invented demo data for this example, not a measurement.
"""

__version__ = "0.1.0"
