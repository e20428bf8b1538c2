"""One broken plug-in never takes beamspread down; every hook is documented and tested.

Two ways of bringing a plug-in in are used here:

* the ``plugin`` fixture registers an object on the live plug-in manager, for
  failures inside a hook call;
* for failures while *loading* (an import error, a misspelled hook name that
  only ``check_pending`` catches, ``BEAMSPREAD_LOAD_PLUGINS``), the plug-in
  must come through the entry-point path. ``beamspread.plugins._state`` looks
  entry points up with ``importlib.metadata.entry_points`` at the moment it
  builds the manager, so the least invasive simulation is to monkeypatch that
  one function to add fake entry points for the ``beamspread`` group (every
  other group goes to the real function) and rebuild the manager. Nothing of
  beamspread's own is patched, and nothing is installed.

Tables and media here are SYNTHETIC, made up to exercise the mechanics.
"""

from __future__ import annotations

import importlib.metadata
import inspect
import sys
import types

import pytest
from synthetic_plugins import Media, Tables

from beamspread import ComputedMedium, hookimpl, hookspecs, plugins
from beamspread.media.registry import build_registry

GOOD_TABLE = (
    'format = 1\n[[material]]\nname = "synthetic-from-table"\nstate = "liquid"\n'
    'longitudinal = { value = 1234, unit = "m/s", source = "synthetic test value" }\n'
)
BROKEN_TABLE = (
    'format = 1\n[[material]]\nname = "synthetic-broken"\nstate = "liquid"\n'
    'longitudinal = { value = -5, unit = "m/s", source = "synthetic test value" }\n'
)


def synthetic_medium(name="synthetic-medium", speed=1111.0):
    return ComputedMedium(name, "liquid", lambda: speed, source="synthetic law")


def builtins_still_work(registry):
    assert registry.get("reference-steel").medium.evaluate().speed == 5920.0
    assert registry.get("water").level_name == "built-in"


def beam_still_works(run):
    result = run(
        "beam",
        "--diameter",
        "10mm",
        "--frequency",
        "5MHz",
        "--material",
        "reference-steel",
        "--json",
    )
    assert result.code == 0, result.stderr
    assert result.json()["medium"]["speed_m_s"] == 5920.0
    return result


def failures(registry, name):
    return [w for w in registry.warnings if w.startswith(f"plug-in {name} ")]


# ------------------------------------------------------------------ failures inside a hook


class RaisingMedia:
    """Registers one medium, then fails."""

    @hookimpl
    def register_media(self, register):
        register(synthetic_medium("synthetic-partial"))
        raise RuntimeError("synthetic failure in media")


class RaisingTables:
    def __init__(self, location):
        self.location = location

    @hookimpl
    def register_tables(self, register):
        register(self.location)
        raise RuntimeError("synthetic failure in tables")


def test_hook_register_media_raising_is_reported_and_discarded(plugin, run):
    plugin(RaisingMedia(), "synthetic-raiser")
    registry = build_registry()
    [line] = failures(registry, "synthetic-raiser")
    assert line.startswith("plug-in synthetic-raiser failed in register_media")
    assert "RuntimeError: synthetic failure in media" in line
    assert line.endswith("skipped")
    # What it registered before failing is dropped with it.
    with pytest.raises(LookupError):
        registry.get("synthetic-partial")
    builtins_still_work(registry)

    result = run("materials", "list", "--json")
    assert result.code == 0
    assert "synthetic-partial" not in {row["name"] for row in result.json()}
    assert "plug-in synthetic-raiser failed in register_media" in result.stderr
    assert "plug-in synthetic-raiser failed in register_media" in beam_still_works(run).stderr


def test_hook_register_media_failure_does_not_affect_the_next_plugin(plugin):
    plugin(RaisingMedia(), "synthetic-raiser")
    plugin(Media(synthetic_medium("synthetic-survivor", 2222.0)), "synthetic-good")
    registry = build_registry()
    assert registry.get("synthetic-survivor").medium.evaluate().speed == 2222.0
    assert registry.get("synthetic-survivor").plugin == "synthetic-good"
    assert failures(registry, "synthetic-raiser")
    assert not failures(registry, "synthetic-good")


@pytest.mark.parametrize(
    "thing", ["water", 1500.0, None, object()], ids=["str", "float", "none", "object"]
)
def test_hook_register_media_non_medium_is_reported(plugin, thing):
    plugin(Media(synthetic_medium("synthetic-before"), thing), "synthetic-confused")
    registry = build_registry()
    [line] = failures(registry, "synthetic-confused")
    assert "failed in register_media: TypeError" in line
    assert type(thing).__name__ in line
    with pytest.raises(LookupError):
        registry.get("synthetic-before")
    builtins_still_work(registry)


def test_hook_register_tables_broken_table_is_reported_and_skipped(plugin, run, tmp_path):
    good = tmp_path / "good.toml"
    good.write_text(GOOD_TABLE, encoding="utf-8")
    broken = tmp_path / "broken.toml"
    broken.write_text(BROKEN_TABLE, encoding="utf-8")
    plugin(Tables(good, broken), "synthetic-tables")
    registry = build_registry()
    [line] = failures(registry, "synthetic-tables")
    assert "failed in register_tables: TableError" in line
    assert f"{broken.name}:5" in line
    assert "entry 'synthetic-broken'" in line
    # The good table handed over in the same call goes too: all or nothing.
    with pytest.raises(LookupError):
        registry.get("synthetic-from-table")
    builtins_still_work(registry)
    result = run("materials", "list")
    assert result.code == 0
    assert "plug-in synthetic-tables failed in register_tables" in result.stderr
    beam_still_works(run)


def test_hook_register_tables_directory_with_a_broken_file(plugin, tmp_path):
    (tmp_path / "a-good.toml").write_text(GOOD_TABLE, encoding="utf-8")
    (tmp_path / "b-broken.toml").write_text("format = 1\n[[material]\n", encoding="utf-8")
    plugin(Tables(tmp_path), "synthetic-dir")
    registry = build_registry()
    [line] = failures(registry, "synthetic-dir")
    assert "b-broken.toml:2" in line and "invalid TOML" in line
    with pytest.raises(LookupError):
        registry.get("synthetic-from-table")


def test_hook_register_tables_raising_is_reported(plugin, tmp_path):
    good = tmp_path / "good.toml"
    good.write_text(GOOD_TABLE, encoding="utf-8")
    plugin(RaisingTables(good), "synthetic-raising-tables")
    registry = build_registry()
    [line] = failures(registry, "synthetic-raising-tables")
    assert "failed in register_tables: RuntimeError: synthetic failure in tables" in line
    with pytest.raises(LookupError):
        registry.get("synthetic-from-table")


def test_hook_register_tables_good_plugin_table(plugin, tmp_path):
    good = tmp_path / "good.toml"
    good.write_text(GOOD_TABLE, encoding="utf-8")
    plugin(Tables(good), "synthetic-tables")
    registry = build_registry()
    entry = registry.get("synthetic-from-table")
    assert entry.level_name == "plug-in"
    assert entry.plugin == "synthetic-tables"
    assert entry.origin.startswith("plug-in synthetic-tables (test 0) table ")
    assert entry.origin.endswith(good.name)
    assert registry.warnings == []


def test_hook_register_media_good_plugin(plugin, run):
    plugin(Media(synthetic_medium("synthetic-ok", 3333.0)), "synthetic-media")
    result = run(
        "beam", "--diameter", "10mm", "--frequency", "1MHz", "--material", "synthetic-ok", "--json"
    )
    assert result.code == 0, result.stderr
    assert result.json()["wavelength_m"] == pytest.approx(3333.0 / 1e6, rel=1e-12)
    assert result.stderr == ""


# ------------------------------------------------------------------ failures while loading


class FakeDistribution:
    def __init__(self, name, version):
        self.metadata = {"Name": name}
        self.version = version


class FakeEntryPoint:
    """Just what ``beamspread.plugins`` uses of an entry point: name, dist, load()."""

    def __init__(self, name, load, dist=None):
        self.name = name
        self.dist = dist
        self._load = load
        self.loads = 0

    def load(self):
        self.loads += 1
        return self._load()


@pytest.fixture
def entry_points(monkeypatch):
    """Install fake entry points for the ``beamspread`` group; rebuild the manager."""

    def install(*eps, selected=None):
        real = importlib.metadata.entry_points

        def fake(**params):
            if params.get("group") == plugins.ENTRY_POINT_GROUP:
                return list(eps)
            return real(**params)

        monkeypatch.setattr(importlib.metadata, "entry_points", fake)
        if selected is None:
            monkeypatch.delenv("BEAMSPREAD_LOAD_PLUGINS", raising=False)
        else:
            monkeypatch.setenv("BEAMSPREAD_LOAD_PLUGINS", selected)
        plugins.reset_plugin_manager()
        return eps

    return install


def module_with(name, **functions):
    module = types.ModuleType(name)
    for attr, fn in functions.items():
        setattr(module, attr, fn)
    return module


def media_module(name, medium):
    @hookimpl
    def register_media(register):
        register(medium)

    return module_with(name, register_media=register_media)


def test_hook_register_media_misspelled_hook_name_is_caught(entry_points, run):
    @hookimpl
    def register_mediums(register):  # one letter too many: no such hook
        register(synthetic_medium("synthetic-misspelled"))

    entry_points(
        FakeEntryPoint(
            "synthetic-typo",
            lambda: module_with("synthetic_typo", register_mediums=register_mediums),
        )
    )
    failed = plugins.plugin_failures()
    assert len(failed) == 1
    assert failed[0].startswith("plug-in synthetic-typo failed to load")
    assert "register_mediums" in failed[0]
    assert "synthetic-typo" not in {i.name for i in plugins.plugin_infos()}
    assert plugins.get_plugin_manager().get_plugin("synthetic-typo") is None
    registry = build_registry()
    assert failed[0] in registry.warnings
    builtins_still_work(registry)
    result = run("plugins", "--json")
    assert result.code == 0
    data = result.json()
    assert any("synthetic-typo failed to load" in f for f in data["failures"])
    assert [p["name"] for p in data["plugins"]] == ["beamspread.media.builtin"]


def test_hook_register_tables_misspelled_argument_is_caught(entry_points):
    @hookimpl
    def register_tables(registrar):  # the hook passes `register`
        raise AssertionError("must never be called")

    entry_points(
        FakeEntryPoint(
            "synthetic-badarg",
            lambda: module_with("synthetic_badarg", register_tables=register_tables),
        )
    )
    [line] = plugins.plugin_failures()
    assert line.startswith("plug-in synthetic-badarg failed to load")
    builtins_still_work(build_registry())


@pytest.mark.parametrize(
    "error",
    [
        ImportError("No module named 'synthetic_missing'"),
        SyntaxError("invalid syntax"),
        RuntimeError("synthetic import-time failure"),
    ],
    ids=["import", "syntax", "runtime"],
)
def test_entry_point_failing_on_import(entry_points, run, error):
    def load():
        raise error

    entry_points(
        FakeEntryPoint("synthetic-broken", load),
        FakeEntryPoint(
            "synthetic-fine",
            lambda: media_module("synthetic_fine", synthetic_medium("synthetic-fine", 4321.0)),
        ),
    )
    expected = f"plug-in synthetic-broken failed to load: {type(error).__name__}: {error}"
    assert plugins.plugin_failures() == [expected]
    result = run("materials", "list", "--json")
    assert result.code == 0
    assert expected in result.stderr
    assert "synthetic-fine" in {row["name"] for row in result.json()}
    beam_still_works(run)


def test_entry_point_plugin_is_listed_with_its_distribution(entry_points, run):
    entry_points(
        FakeEntryPoint(
            "synthetic-dist",
            lambda: media_module("synthetic_dist", synthetic_medium("synthetic-dist-medium")),
            dist=FakeDistribution("synthetic-package", "1.2.3"),
        )
    )
    registry = build_registry()
    entry = registry.get("synthetic-dist-medium")
    assert entry.origin == "plug-in synthetic-dist (synthetic-package 1.2.3)"
    result = run("plugins", "--json")
    assert result.code == 0
    rows = {row["name"]: row for row in result.json()["plugins"]}
    assert rows["synthetic-dist"]["distribution"] == "synthetic-package"
    assert rows["synthetic-dist"]["version"] == "1.2.3"
    assert rows["synthetic-dist"]["hooks"] == ["register_media"]
    assert rows["synthetic-dist"]["provides"] == ["synthetic-dist-medium"]
    assert rows["beamspread.media.builtin"]["builtin"] is True


@pytest.mark.parametrize(
    ("selected", "loaded"),
    [
        (None, {"synthetic-a", "synthetic-b"}),
        ("", set()),
        ("synthetic-a", {"synthetic-a"}),
        (" synthetic-b , ", {"synthetic-b"}),
        ("synthetic-a,synthetic-b", {"synthetic-a", "synthetic-b"}),
        ("synthetic-c", set()),
    ],
    ids=["unset", "empty", "one", "spaces", "both", "unknown-name"],
)
def test_load_plugins_env_restricts_loading(entry_points, selected, loaded):
    eps = entry_points(
        FakeEntryPoint(
            "synthetic-a", lambda: media_module("synthetic_a", synthetic_medium("synthetic-ma"))
        ),
        FakeEntryPoint(
            "synthetic-b", lambda: media_module("synthetic_b", synthetic_medium("synthetic-mb"))
        ),
        selected=selected,
    )
    registry = build_registry()
    names = {i.name for i in plugins.plugin_infos() if not i.builtin}
    assert names == loaded
    for ep in eps:
        # An entry point not selected is not even imported.
        assert ep.loads == (1 if ep.name in loaded else 0)
    media = {e.plugin for e in registry if e.plugin and e.plugin.startswith("synthetic")}
    assert media == loaded
    builtins_still_work(registry)


def test_trace_plugins_reports_hook_calls(run, monkeypatch):
    monkeypatch.setenv("BEAMSPREAD_TRACE_PLUGINS", "1")
    plugins.reset_plugin_manager()
    result = run("materials", "list", "--json")
    assert result.code == 0
    assert "loaded plug-in beamspread.media.builtin" in result.stderr
    assert "calling register_media of plug-in beamspread.media.builtin" in result.stderr
    assert "calling register_tables of plug-in beamspread.media.builtin" in result.stderr
    assert len(result.json()) >= 25


# ------------------------------------------------------------------ every hook


def hook_specs():
    marker = f"{hookspecs.PROJECT}_spec"
    return sorted(
        name
        for name, fn in vars(hookspecs).items()
        if callable(fn) and getattr(fn, marker, None) is not None
    )


def test_hook_specs_found():
    pm = plugins.get_plugin_manager()
    on_manager = sorted(
        name for name, caller in vars(pm.hook).items() if getattr(caller, "spec", None) is not None
    )
    assert hook_specs() == on_manager
    assert hook_specs()


@pytest.mark.parametrize("name", hook_specs())
def test_every_hook_is_documented_and_tested(name):
    spec = getattr(hookspecs, name)
    doc = inspect.getdoc(spec)
    assert doc, f"hook {name} has no docstring"
    assert "register(" in doc, f"hook {name}'s docstring does not say how to call register"
    assert list(inspect.signature(spec).parameters) == ["register"]
    # The hook is described in the module docstring's promise of a register callback.
    assert "register" in (hookspecs.__doc__ or "")
    # Exercised here: a test named after the hook, that registers a plug-in with it.
    module = sys.modules[__name__]
    tests = [
        fn for n, fn in vars(module).items() if n.startswith(f"test_hook_{name}_") and callable(fn)
    ]
    assert len(tests) >= 2, f"hook {name} needs tests named test_hook_{name}_..."
    # ...and some test plug-in in this file implements it with the documented signature.
    source = inspect.getsource(module)
    assert f"def {name}(self, register)" in source or f"def {name}(register)" in source
