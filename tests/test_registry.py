"""Where media come from, which source wins a clash, and the conditions they take.

Tables written here are SYNTHETIC (invented speeds chosen to tell the sources
apart); they test the precedence mechanics, not material data.
"""

from __future__ import annotations

import itertools
import os
import sys
from pathlib import Path

import pytest
from synthetic_plugins import Media, Tables

from beamspread import ComputedMedium, Material, MaterialError, Parameter, Value
from beamspread.media.registry import ENV_VAR, build_registry, config_dir

SOURCE = "synthetic test value"
BUILTIN_STEEL = 5920.0  # reference-steel, ISO 22232-2:2020


def table_text(name, speed, *, aliases=(), state="liquid"):
    alias_line = f"aliases = {list(aliases)!r}\n".replace("'", '"') if aliases else ""
    return (
        'format = 1\ntitle = "synthetic"\n\n[[material]]\n'
        f'name = "{name}"\n{alias_line}state = "{state}"\n'
        f'longitudinal = {{ value = {speed}, unit = "m/s", source = "{SOURCE} {speed}" }}\n'
    )


def user_dir(path, name, speed, filename="synthetic.toml", **kw):
    path.mkdir(parents=True, exist_ok=True)
    (path / filename).write_text(table_text(name, speed, **kw), encoding="utf-8")
    return path


@pytest.fixture
def config_materials(monkeypatch, tmp_path):
    """The per-user table directory, inside a temporary home whatever the platform."""
    monkeypatch.setenv("HOME", str(tmp_path / "home"))
    return config_dir() / "materials"


def speed(registry, name):
    return registry.get(name).medium.evaluate("longitudinal").speed


# ------------------------------------------------------------------ precedence


def test_user_table_overrides_builtin_with_a_warning(tmp_path):
    directory = user_dir(tmp_path / "mine", "reference-steel", 5000)
    registry = build_registry([directory])
    entry = registry.get("reference-steel")
    assert entry.level_name == "user"
    assert speed(registry, "reference-steel") == 5000.0
    path = str(directory / "synthetic.toml")
    [warning] = [w for w in registry.warnings if "reference-steel" in w]
    assert path in warning
    assert "built-in table metals.toml" in warning
    assert "overrides" in warning
    # The built-in's aliases went with it: they no longer reach anything.
    with pytest.raises(MaterialError):
        registry.get("iso-22232-steel")


def test_user_table_override_warns_on_the_cli(run, tmp_path):
    directory = user_dir(tmp_path / "mine", "reference-steel", 5000)
    result = run("materials", "list", "--materials-dir", str(directory), "--json")
    assert result.code == 0
    rows = {row["name"]: row for row in result.json()}
    assert rows["reference-steel"]["longitudinal_m_s"]["value"] == 5000.0
    warnings = result.stderr.strip().splitlines()
    assert len(warnings) == 1
    assert "warning" in warnings[0] and "built-in table metals.toml" in warnings[0]


def test_user_alias_of_a_builtin_name_is_ignored_with_a_warning(tmp_path):
    directory = user_dir(tmp_path / "mine", "synthetic-new", 1234, aliases=["carbon steel"])
    registry = build_registry([directory])
    assert registry.get("carbon steel").name == "carbon-steel"
    assert registry.get("synthetic-new").medium.evaluate().speed == 1234.0
    assert any("alias 'carbon steel'" in w and "ignored" in w for w in registry.warnings)


def test_user_alias_replaces_a_builtin_alias(tmp_path):
    directory = user_dir(tmp_path / "mine", "synthetic-new", 1234, aliases=["mild steel"])
    registry = build_registry([directory])
    assert registry.get("mild steel").name == "synthetic-new"
    assert registry.get("carbon-steel").name == "carbon-steel"
    assert any("alias 'mild steel'" in w and "replaces" in w for w in registry.warnings)


def test_env_var_is_a_path_list(monkeypatch, tmp_path):
    a = user_dir(tmp_path / "a", "synthetic-a", 1111)
    b = user_dir(tmp_path / "b", "synthetic-b", 2222)
    monkeypatch.setenv(ENV_VAR, os.pathsep.join([str(a), str(b)]))
    registry = build_registry()
    assert speed(registry, "synthetic-a") == 1111.0
    assert speed(registry, "synthetic-b") == 2222.0
    assert registry.get("synthetic-a").level_name == "user"


def test_env_var_missing_directory_warns(monkeypatch, tmp_path):
    monkeypatch.setenv(ENV_VAR, str(tmp_path / "nowhere"))
    registry = build_registry()
    assert any(ENV_VAR in w and "nowhere" in w for w in registry.warnings)
    assert speed(registry, "reference-steel") == BUILTIN_STEEL


def test_config_dir_tables_are_read(config_materials, run):
    if sys.platform.startswith("linux"):
        expected = Path(os.environ["XDG_CONFIG_HOME"]) / "beamspread" / "materials"
        assert config_materials == expected
    user_dir(config_materials, "synthetic-config", 3333)
    registry = build_registry()
    assert speed(registry, "synthetic-config") == 3333.0
    result = run("materials", "show", "synthetic-config", "--json")
    assert result.code == 0
    assert str(config_materials) in result.json()["origin"]


SOURCES = ("config", "env", "dir", "plugin")
SPEEDS = {"config": 4100.0, "env": 4200.0, "dir": 4300.0, "plugin": 4050.0}


@pytest.mark.parametrize(
    "present",
    [c for n in range(len(SOURCES) + 1) for c in itertools.combinations(SOURCES, n)],
    ids=lambda c: "+".join(c) or "builtin-only",
)
def test_precedence_order(present, config_materials, monkeypatch, tmp_path, plugin):
    # Highest first: --materials-dir, BEAMSPREAD_MATERIALS, the config dir, a
    # plug-in, the built-in table.
    dirs = []
    if "config" in present:
        user_dir(config_materials, "reference-steel", SPEEDS["config"])
    if "env" in present:
        env_dir = user_dir(tmp_path / "env", "reference-steel", SPEEDS["env"])
        monkeypatch.setenv(ENV_VAR, str(env_dir))
    if "dir" in present:
        dirs.append(user_dir(tmp_path / "dir", "reference-steel", SPEEDS["dir"]))
    if "plugin" in present:
        location = user_dir(tmp_path / "plugin", "reference-steel", SPEEDS["plugin"])
        plugin(Tables(location), "synthetic-plugin")
    registry = build_registry(dirs)
    winner = next((s for s in ("dir", "env", "config", "plugin") if s in present), None)
    expected = SPEEDS[winner] if winner else BUILTIN_STEEL
    assert speed(registry, "reference-steel") == expected
    assert len(registry.shadowed.get("reference-steel", [])) == len(present)


def test_last_materials_dir_wins(tmp_path):
    first = user_dir(tmp_path / "first", "synthetic-x", 1000)
    second = user_dir(tmp_path / "second", "synthetic-x", 2000)
    assert speed(build_registry([first, second]), "synthetic-x") == 2000.0
    assert speed(build_registry([second, first]), "synthetic-x") == 1000.0


def test_materials_paths_lists_highest_precedence_first(
    run, monkeypatch, tmp_path, config_materials
):
    d = user_dir(tmp_path / "dir", "synthetic-d", 1000)
    e = user_dir(tmp_path / "env", "synthetic-e", 1000)
    monkeypatch.setenv(ENV_VAR, str(e))
    result = run("materials", "paths", "--materials-dir", str(d), "--json")
    assert result.code == 0
    rows = result.json()
    paths = [row["path"] for row in rows]
    order = [paths.index(str(d)), paths.index(str(e)), paths.index(str(config_materials))]
    assert order == sorted(order)
    assert rows[-1]["source"] == "built-in"
    assert {row["path"]: row["exists"] for row in rows}[str(config_materials)] is False


def test_plugin_overrides_builtin_and_user_overrides_plugin(run, plugin, tmp_path):
    location = user_dir(tmp_path / "plugin", "reference-steel", 4444)
    plugin(Tables(location), "synthetic-plugin")
    registry = build_registry()
    entry = registry.get("reference-steel")
    assert entry.level_name == "plug-in"
    assert entry.plugin == "synthetic-plugin"
    assert speed(registry, "reference-steel") == 4444.0
    assert any(
        "plug-in synthetic-plugin" in w and "built-in table metals.toml" in w
        for w in registry.warnings
    )

    mine = user_dir(tmp_path / "mine", "reference-steel", 5555)
    result = run("materials", "show", "reference-steel", "--materials-dir", str(mine), "--json")
    assert result.code == 0
    data = result.json()
    assert data["longitudinal_m_s"]["value"] == 5555.0
    assert data["precedence"] == "user"
    assert str(mine / "synthetic.toml") in data["origin"]
    assert len(data["shadows"]) == 2
    assert any("plug-in synthetic-plugin" in s for s in data["shadows"])
    assert any("built-in table metals.toml" in s for s in data["shadows"])


def test_plugin_computed_medium_overrides_builtin(plugin):
    medium = ComputedMedium("water", "liquid", lambda: 1000.0, source="synthetic law")
    plugin(Media(medium), "synthetic-water")
    registry = build_registry()
    assert registry.get("water").medium is medium
    assert speed(registry, "water") == 1000.0


def test_show_text_reports_origin_and_shadows(run, tmp_path):
    mine = user_dir(tmp_path / "mine", "reference-steel", 5555)
    result = run("materials", "show", "reference-steel", "--materials-dir", str(mine))
    assert result.code == 0
    assert f"from: user table {mine / 'synthetic.toml'}" in result.stdout
    assert "shadows the entry of the same name from built-in table metals.toml" in result.stdout


def test_show_of_an_unshadowed_builtin(run):
    result = run("materials", "show", "reference-steel", "--json")
    assert result.code == 0
    data = result.json()
    assert data["origin"] == "built-in table metals.toml"
    assert data["shadows"] == []


# ------------------------------------------------------------------ lookup


@pytest.mark.parametrize(
    ("typo", "suggested"),
    [
        ("stainles-steel-304", "stainless-steel-304"),
        ("refrence-steel", "reference-steel"),
        ("see-water", "sea-water"),
    ],
)
def test_unknown_material_suggests_close_names(run, typo, suggested):
    with pytest.raises(MaterialError, match=f"'{suggested}'"):
        build_registry().get(typo)
    result = run("materials", "show", typo)
    assert result.code == 2
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1
    assert typo in lines[0] and suggested in lines[0]


@pytest.mark.parametrize(
    ("label", "name"),
    [
        ("Mild Steel", "carbon-steel"),
        ("  mild   steel ", "carbon-steel"),
        ("MILD_STEEL", "carbon-steel"),
        ("Carbon-Steel", "carbon-steel"),
        ("ISO 22232-2 Reference Steel", "reference-steel"),
        ("Stainless Steel", "stainless-steel-304"),
        ("SeaWater", "seawater-mackenzie"),
        ("Sea Water", "seawater-mackenzie"),
    ],
)
def test_alias_lookup_ignores_case_and_spacing(label, name):
    assert build_registry().get(label).name == name


def test_nonexistent_materials_dir_exits_2(run, tmp_path):
    missing = tmp_path / "nowhere"
    for args in (
        ("materials", "list"),
        ("beam", "--diameter", "10mm", "--frequency", "5MHz", "--material", "reference-steel"),
    ):
        result = run(*args, "--materials-dir", str(missing))
        assert result.code == 2
        lines = result.stderr.strip().splitlines()
        assert len(lines) == 1
        assert str(missing) in lines[0]


# ------------------------------------------------------------------ beam with user tables


@pytest.mark.parametrize(("frequency", "hz"), [("5MHz", 5e6), ("2.25MHz", 2.25e6), ("500kHz", 5e5)])
def test_beam_uses_the_user_speed(run, tmp_path, frequency, hz):
    mine = user_dir(tmp_path / "mine", "synthetic-block", 3210)
    result = run(
        "beam",
        "--diameter",
        "10mm",
        "--frequency",
        frequency,
        "--material",
        "synthetic-block",
        "--materials-dir",
        str(mine),
        "--json",
    )
    assert result.code == 0, result.stderr
    data = result.json()
    assert data["medium"]["name"] == "synthetic-block"
    assert data["medium"]["speed_m_s"] == 3210.0
    assert data["wavelength_m"] == pytest.approx(3210.0 / hz, rel=1e-12)


def test_beam_json_carries_registry_warnings_and_stays_pure(run, tmp_path):
    mine = user_dir(tmp_path / "mine", "reference-steel", 5000)
    result = run(
        "beam",
        "--diameter",
        "10mm",
        "--frequency",
        "5MHz",
        "--material",
        "reference-steel",
        "--materials-dir",
        str(mine),
        "--json",
    )
    assert result.code == 0
    data = result.json()
    assert data["medium"]["speed_m_s"] == 5000.0
    assert any("overrides" in w for w in data["warnings"])
    assert "overrides" in result.stderr


@pytest.mark.parametrize(
    ("text", "marker"),
    [
        (
            'format = 1\n\n[[material]]\nname = "synthetic-broken"\nstate = "liquid"\n'
            "longitudinal = { value = 1400 unit }\n",
            "longitudinal",
        ),
        (
            'format = 1\n\n[[material]]\nname = "synthetic-broken"\nstate = "liquid"\n'
            'longitudinal = { value = -1, unit = "m/s", source = "s" }\n',
            "longitudinal",
        ),
    ],
    ids=["syntax", "negative"],
)
def test_broken_user_table_stops_beam(run, tmp_path, text, marker):
    mine = tmp_path / "mine"
    mine.mkdir()
    path = mine / "broken.toml"
    path.write_text(text, encoding="utf-8")
    line = next(i for i, s in enumerate(text.splitlines(), 1) if marker in s)
    result = run(
        "beam",
        "--diameter",
        "10mm",
        "--frequency",
        "5MHz",
        "--material",
        "reference-steel",
        "--materials-dir",
        str(mine),
    )
    assert result.code == 2
    assert result.stdout == ""
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1
    assert f"{path}:{line}" in lines[0]


def test_broken_table_in_env_dir_is_an_error(run, monkeypatch, tmp_path):
    mine = tmp_path / "mine"
    mine.mkdir()
    (mine / "broken.toml").write_text("format = 1\n[[material]\n", encoding="utf-8")
    monkeypatch.setenv(ENV_VAR, str(mine))
    result = run("materials", "list")
    assert result.code == 2
    assert f"{mine / 'broken.toml'}:2" in result.stderr


def test_non_toml_files_are_ignored(tmp_path):
    mine = user_dir(tmp_path / "mine", "synthetic-x", 1000)
    (mine / "README.txt").write_text("not a table", encoding="utf-8")
    (mine / "old.toml.bak").write_text("[[[", encoding="utf-8")
    assert speed(build_registry([mine]), "synthetic-x") == 1000.0


# ------------------------------------------------------------------ conditions


def mackenzie(t, s, d):
    """Mackenzie (1981), J. Acoust. Soc. Am. 70, 807, nine-term equation (m/s)."""
    return (
        1448.96
        + 4.591 * t
        - 5.304e-2 * t**2
        + 2.374e-4 * t**3
        + 1.340 * (s - 35)
        + 1.630e-2 * d
        + 1.675e-7 * d**2
        - 1.025e-2 * t * (s - 35)
        - 7.139e-13 * t * d**3
    )


def beam_json(run, *args):
    result = run("beam", "--diameter", "25mm", "--frequency", "200kHz", *args, "--json")
    return result


@pytest.mark.parametrize(
    ("args", "t", "s", "d"),
    [
        ((), 10.0, 35.0, 0.0),  # the declared defaults
        (("--condition", "salinity=30"), 10.0, 30.0, 0.0),
        (("--condition", "salinity=30ppt", "--condition", "depth=100m"), 10.0, 30.0, 100.0),
        (("--temperature", "12", "--condition", "depth=30"), 12.0, 35.0, 30.0),
        (("--temperature", "53.6degF"), 12.0, 35.0, 0.0),
        (("--condition", "temperature=285.15K"), 12.0, 35.0, 0.0),
        (("--condition", "depth=1000ft"), 10.0, 35.0, 304.8),
    ],
)
def test_seawater_conditions(run, args, t, s, d):
    result = beam_json(run, "--material", "seawater", *args)
    assert result.code == 0, result.stderr
    medium = result.json()["medium"]
    assert medium["speed_m_s"] == pytest.approx(mackenzie(t, s, d), rel=1e-12)
    assert medium["conditions"]["temperature_c"] == pytest.approx(t, abs=1e-9)
    assert medium["conditions"]["salinity_g_kg"] == pytest.approx(s, abs=1e-9)
    assert medium["conditions"]["depth_m"] == pytest.approx(d, abs=1e-9)


def test_seawater_depth_in_km(run):
    # Sonar depths are naturally given in km; the brief's example is depth=1km.
    result = beam_json(run, "--material", "seawater", "--condition", "depth=1km")
    assert result.code == 0, result.stderr
    assert result.json()["medium"]["speed_m_s"] == pytest.approx(mackenzie(10, 35, 1000), rel=1e-12)


def test_unknown_condition_names_the_declared_ones(run):
    result = beam_json(run, "--material", "seawater", "--condition", "pressure=10")
    assert result.code == 2
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1
    for name in ("pressure", "temperature", "salinity", "depth"):
        assert name in lines[0]


def test_condition_on_a_table_material_is_refused(run):
    result = beam_json(run, "--material", "reference-steel", "--condition", "salinity=35")
    assert result.code == 2
    assert len(result.stderr.strip().splitlines()) == 1
    assert "salinity" in result.stderr and "none" in result.stderr


@pytest.mark.parametrize("condition", ["salinity=45", "depth=9000m", "temperature=35"])
def test_condition_outside_valid_range_warns(run, condition):
    result = beam_json(run, "--material", "seawater", "--condition", condition)
    assert result.code == 0, result.stderr
    data = result.json()  # stdout is JSON and nothing else
    name = condition.split("=")[0]
    json_warnings = [w for w in data["warnings"] if w.startswith(name)]
    assert len(json_warnings) == 1
    assert "fitted" in json_warnings[0]
    assert json_warnings[0] in result.stderr
    assert "warning" in result.stderr


@pytest.mark.parametrize(
    "condition", ["salinity=60", "depth=12000m", "temperature=-10", "temperature=50"]
)
def test_condition_outside_limits_is_refused(run, condition):
    result = beam_json(run, "--material", "seawater", "--condition", condition)
    assert result.code == 2
    assert result.stdout == ""
    lines = result.stderr.strip().splitlines()
    assert len(lines) == 1
    assert condition.split("=")[0] in lines[0] and "not allowed" in lines[0]


def test_temperature_on_a_constant_table_material_warns(run):
    result = beam_json(run, "--material", "reference-steel", "--temperature", "30")
    assert result.code == 0
    data = result.json()
    assert data["medium"]["speed_m_s"] == BUILTIN_STEEL
    assert data["medium"]["conditions"] == {}
    assert any("ignored" in w for w in data["warnings"])
    assert "ignored" in result.stderr


def test_temperature_with_a_curve_table_material(run, tmp_path):
    mine = tmp_path / "mine"
    mine.mkdir()
    (mine / "curve.toml").write_text(
        'format = 1\n[[material]]\nname = "synthetic-curve"\nstate = "liquid"\n'
        'longitudinal = { temperature = [10, 30], values = [1000, 1200], unit = "m/s", '
        f'source = "{SOURCE}" }}\n',
        encoding="utf-8",
    )
    result = beam_json(
        run,
        "--material",
        "synthetic-curve",
        "--materials-dir",
        str(mine),
        "--temperature",
        "68degF",
    )
    assert result.code == 0, result.stderr
    # 68 degF = 20 degC, the middle of the synthetic line from 1000 to 1200 m/s.
    assert result.json()["medium"]["speed_m_s"] == pytest.approx(1100.0, rel=1e-12)
    outside = beam_json(
        run, "--material", "synthetic-curve", "--materials-dir", str(mine), "--temperature", "40"
    )
    assert outside.code == 2
    assert "10 to 30 degC" in outside.stderr


@pytest.mark.parametrize("extra", [("--temperature", "20"), ("--condition", "salinity=35")])
def test_temperature_or_condition_with_speed_is_a_usage_error(run, extra):
    result = beam_json(run, "--speed", "1500", *extra)
    assert result.code == 2
    assert result.stdout == ""
    assert len(result.stderr.strip().splitlines()) == 1


def test_material_and_speed_together_is_a_usage_error(run):
    result = beam_json(run, "--speed", "1500", "--material", "water")
    assert result.code == 2
    assert len(result.stderr.strip().splitlines()) == 1


def test_plugin_condition_in_its_declared_unit(run, plugin):
    # A plug-in declares a parameter in bar (the kind's SI unit is dbar). A bare
    # number must reach the equation in bar, and a value with a unit must be
    # converted to bar: 1 MPa = 10 bar by definition.
    seen = []

    def law(pressure):
        seen.append(pressure)
        return 1000.0 + pressure

    medium = ComputedMedium(
        "synthetic-pressurised",
        "liquid",
        law,
        source="synthetic law",
        parameters=(Parameter("pressure", "pressure", "bar", 1.0, (0.0, 50.0), (0.0, 100.0)),),
    )
    plugin(Media(medium), "synthetic-pressure")
    for text in ("10", "10bar", "1MPa"):
        seen.clear()
        result = beam_json(
            run, "--material", "synthetic-pressurised", "--condition", f"pressure={text}"
        )
        assert result.code == 0, result.stderr
        assert seen == [pytest.approx(10.0, rel=1e-12)], text
        assert result.json()["medium"]["speed_m_s"] == pytest.approx(1010.0, rel=1e-12)


def test_registry_entries_have_an_origin():
    registry = build_registry()
    for entry in registry:
        assert entry.origin.startswith("built-in")
        assert isinstance(entry.medium, (Material, ComputedMedium))


def test_value_of_a_table_material_used_through_the_library(tmp_path):
    mine = user_dir(tmp_path / "mine", "synthetic-lib", 2500, state="solid")
    registry = build_registry([mine])
    material = registry.get("synthetic-lib").medium
    assert isinstance(material, Material)
    assert material.longitudinal == Value(source=f"{SOURCE} 2500", value=2500.0)
