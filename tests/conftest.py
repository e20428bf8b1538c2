"""Shared fixtures: every test runs with no user tables and no third-party plug-ins.

Entry-point plug-ins are blocked (BEAMSPREAD_LOAD_PLUGINS is set empty) and
the per-user configuration directory points into a temporary folder, so a
developer's own setup never leaks into a test. Tests that need a plug-in
register it with the ``plugin`` fixture, which always unregisters it.
"""

from __future__ import annotations

import json
from collections.abc import Iterator

import pytest
from click.testing import CliRunner

from beamspread import plugins
from beamspread.cli import cli


@pytest.fixture(autouse=True)
def isolated(monkeypatch, tmp_path_factory) -> Iterator[None]:
    config = tmp_path_factory.mktemp("config")
    monkeypatch.setenv("XDG_CONFIG_HOME", str(config))
    monkeypatch.setenv("APPDATA", str(config))
    monkeypatch.setenv("BEAMSPREAD_LOAD_PLUGINS", "")
    monkeypatch.delenv("BEAMSPREAD_MATERIALS", raising=False)
    monkeypatch.delenv("BEAMSPREAD_DEBUG", raising=False)
    monkeypatch.delenv("BEAMSPREAD_TRACE_PLUGINS", raising=False)
    plugins.reset_plugin_manager()
    yield
    plugins.reset_plugin_manager()


@pytest.fixture
def plugin():
    """Register a plug-in object under a name for one test: ``plugin(obj, "name")``."""
    registered = []

    def register(obj, name):
        pm = plugins.get_plugin_manager()
        pm.register(obj, name=name)
        plugins._state().info[name] = plugins.PluginInfo(
            name, builtin=False, distribution="test", version="0"
        )
        registered.append(name)
        return obj

    try:
        yield register
    finally:
        pm = plugins.get_plugin_manager()
        for name in registered:
            if pm.get_plugin(name) is not None:
                pm.unregister(name=name)
            plugins._state().info.pop(name, None)


class Run:
    """The result of one CLI call, with stdout parsed as JSON on demand."""

    def __init__(self, result):
        self.result = result
        self.code = result.exit_code
        self.stdout = result.stdout
        self.stderr = result.stderr

    def json(self):
        return json.loads(self.stdout)


@pytest.fixture
def run():
    """Run the CLI in-process: ``run("beam", "--diameter", "10mm", ...)``."""
    runner = CliRunner()

    def invoke(*args: str, env: dict[str, str] | None = None) -> Run:
        return Run(runner.invoke(cli, list(args), env=env, catch_exceptions=False))

    return invoke
