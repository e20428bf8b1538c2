"""The example plug-in (plugins/beamspread-fairlead), found through its entry point.

These tests check the plug-in mechanism: an installed distribution is
discovered through the ``beamspread`` entry-point group, its table (shipped
inside its wheel) and its computed medium are registered, and the CLI uses
them. The reference for every expected number is the example plug-in's own
table (invented demo data) or its own code, read back here, never a retyped
figure.

Skipped unless the example is installed: ``pip install plugins/beamspread-fairlead``.
"""

from __future__ import annotations

import sys
from importlib.metadata import version
from importlib.resources import files

import numpy as np
import pytest

from beamspread import plugins

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover - exercised on Python 3.10 only
    import tomli as tomllib

# the example plug-in's hook module, as its entry point names it
fairlead = pytest.importorskip("beamspread_fairlead.plugin")

PLUGIN = "fairlead"
DISTRIBUTION = "beamspread-fairlead"
GEL = fairlead.GEL.name
PROBE = ("--diameter", "10mm", "--frequency", "2.25MHz")


def _table() -> dict:
    """The example plug-in's own table (invented demo data), as shipped in its wheel."""
    text = (files("beamspread_fairlead") / "tables" / "fairlead.toml").read_text("utf-8")
    return tomllib.loads(text)


TABLE = _table()
TABLE_NAMES = sorted(m["name"] for m in TABLE["material"])


def _curve_wedge() -> dict:
    """The first solid of the table whose longitudinal speed is a temperature curve."""
    return next(
        m for m in TABLE["material"] if m["state"] == "solid" and "temperature" in m["longitudinal"]
    )


@pytest.fixture
def load_fairlead(monkeypatch):
    """Let the entry point named ``fairlead`` load (conftest blocks every plug-in)."""
    monkeypatch.setenv("BEAMSPREAD_LOAD_PLUGINS", PLUGIN)
    plugins.reset_plugin_manager()


def _one_line_error(result) -> None:
    assert result.code == 2
    assert result.stdout == ""
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1, result.stderr
    assert lines[0].startswith("beamspread: error: ")


def test_table_is_invented_demo_data():
    assert len(TABLE_NAMES) >= 5
    for material in TABLE["material"]:
        assert material["name"].startswith("fairlead-")
        for key in ("longitudinal", "shear", "density"):
            if key in material:
                assert "invented" in material[key]["source"]
        if material["state"] == "solid":
            assert "shear" in material and "density" in material
    assert "invented" in fairlead.GEL.source


def test_blocked_when_not_selected(run):
    # conftest sets BEAMSPREAD_LOAD_PLUGINS empty: the entry point is not loaded
    data = run("plugins", "--json").json()
    assert PLUGIN not in {row["name"] for row in data["plugins"]}
    names = {row["name"] for row in run("materials", "list", "--json").json()}
    assert not names & {*TABLE_NAMES, GEL}


def test_plugins_lists_the_example(load_fairlead, run):
    result = run("plugins", "--json")
    assert result.code == 0
    assert result.stderr == ""
    data = result.json()
    assert data["failures"] == []
    row = next(r for r in data["plugins"] if r["name"] == PLUGIN)
    assert row["builtin"] is False
    assert row["distribution"] == DISTRIBUTION
    assert row["version"] == version(DISTRIBUTION)
    assert row["hooks"] == ["register_media", "register_tables"]
    assert sorted(row["provides"]) == sorted([*TABLE_NAMES, GEL])


def test_materials_list_names_the_plugin(load_fairlead, run):
    rows = {row["name"]: row for row in run("materials", "list", "--json").json()}
    for name in [*TABLE_NAMES, GEL]:
        assert name in rows
        assert rows[name]["origin"].startswith(f"plug-in {PLUGIN} ({DISTRIBUTION} ")
        assert rows[name]["precedence"] == "plug-in"
    assert rows[GEL]["kind"] == "computed"
    assert all(rows[name]["kind"] == "table" for name in TABLE_NAMES)
    # the table is read from inside the installed package, not from a source checkout
    wedge = _curve_wedge()["name"]
    assert "beamspread_fairlead" in rows[wedge]["path"]


def test_aliases_resolve_without_clash(load_fairlead, run):
    material = next(m for m in TABLE["material"] if m.get("aliases"))
    result = run("materials", "show", material["aliases"][0], "--json")
    assert result.code == 0
    assert result.stderr == ""  # no clash with the built-in names or aliases
    assert result.json()["name"] == material["name"]


def test_curve_wedge_is_interpolated(load_fairlead, run):
    wedge = _curve_wedge()
    curve = wedge["longitudinal"]
    for temperature in (30.0, 27.5):
        expected = float(np.interp(temperature, curve["temperature"], curve["values"]))
        result = run(
            "beam", *PROBE, "--material", wedge["name"], "--temperature", str(temperature), "--json"
        )
        assert result.code == 0, result.stderr
        medium = result.json()["medium"]
        assert medium["name"] == wedge["name"]
        assert medium["speed_m_s"] == pytest.approx(expected)
        assert medium["conditions"] == {"temperature_c": temperature}
        assert medium["source"] == curve["source"]


def test_curve_wedge_refuses_temperature_outside_its_table(load_fairlead, run):
    wedge = _curve_wedge()
    above = max(wedge["longitudinal"]["temperature"]) + 5
    result = run("beam", *PROBE, "--material", wedge["name"], "--temperature", str(above))
    _one_line_error(result)
    assert wedge["name"] in result.stderr


def test_computed_gel_follows_its_law(load_fairlead, run):
    result = run("beam", *PROBE, "--material", GEL, "--temperature", "30", "--json")
    assert result.code == 0, result.stderr
    assert result.stderr == ""
    medium = result.json()["medium"]
    assert medium["speed_m_s"] == pytest.approx(fairlead.gel_longitudinal(temperature=30.0))
    assert medium["density_kg_m3"] == pytest.approx(fairlead.gel_density(temperature=30.0))
    assert medium["conditions"] == {"temperature_c": 30.0}
    assert medium["source"] == fairlead.GEL.source


def test_computed_gel_refuses_outside_limits(load_fairlead, run):
    parameter = fairlead.GEL.parameter("temperature")
    above = parameter.limits[1] + 10
    result = run("beam", *PROBE, "--material", GEL, "--temperature", str(above))
    _one_line_error(result)
    assert "temperature" in result.stderr


def test_computed_gel_warns_outside_valid_range(load_fairlead, run):
    parameter = fairlead.GEL.parameter("temperature")
    temperature = (parameter.valid[1] + parameter.limits[1]) / 2
    result = run("beam", *PROBE, "--material", GEL, "--temperature", str(temperature), "--json")
    assert result.code == 0, result.stderr
    assert "beamspread: warning:" in result.stderr
    assert "outside the range" in result.stderr
    medium = result.json()["medium"]
    assert medium["speed_m_s"] == pytest.approx(fairlead.gel_longitudinal(temperature=temperature))
