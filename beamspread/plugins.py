"""The plug-in manager: built-in tables and third-party plug-ins, the same path.

Plug-ins come from the ``beamspread`` entry-point group. One broken plug-in
never takes the tool down: a failure to load, a hook with a misspelled name,
or an exception inside a hook is reported by plug-in name and that plug-in is
skipped.

Environment:

``BEAMSPREAD_LOAD_PLUGINS``
    Comma-separated entry-point names to load; the rest are not imported.
    Set it empty to load no third-party plug-in (the built-ins always load).
``BEAMSPREAD_TRACE_PLUGINS``
    Set to 1 to print every hook call to stderr.
"""

from __future__ import annotations

import importlib
import os
import sys
from collections.abc import Callable, Iterator
from dataclasses import dataclass, field
from functools import cache
from typing import Any

import pluggy

from . import hookspecs

__all__ = [
    "DEFAULT_PLUGINS",
    "ENTRY_POINT_GROUP",
    "PluginInfo",
    "call_each",
    "get_plugin_manager",
    "plugin_failures",
    "plugin_infos",
    "reset_plugin_manager",
]

ENTRY_POINT_GROUP = "beamspread"
DEFAULT_PLUGINS = ("beamspread.media.builtin",)


@dataclass
class PluginInfo:
    """What is known of one registered plug-in."""

    name: str
    builtin: bool
    distribution: str | None = None
    version: str | None = None
    hooks: list[str] = field(default_factory=list)


@dataclass
class _State:
    manager: pluggy.PluginManager
    info: dict[str, PluginInfo]
    failures: list[str]


def _distribution_of(entry_point) -> tuple[str | None, str | None]:
    dist = getattr(entry_point, "dist", None)
    if dist is None:
        return None, None
    return dist.metadata["Name"], dist.version


def _selected(name: str) -> bool:
    wanted = os.environ.get("BEAMSPREAD_LOAD_PLUGINS")
    if wanted is None:
        return True
    return name in {w.strip() for w in wanted.split(",") if w.strip()}


def _check_pending(pm: pluggy.PluginManager, info: dict[str, PluginInfo], failures: list[str]):
    """Unregister every plug-in whose hook names match no specification."""
    while True:
        try:
            pm.check_pending()
            return
        except pluggy.PluginValidationError as exc:
            name = pm.get_name(exc.plugin) or str(exc.plugin)
            failures.append(f"plug-in {name} failed to load: {exc}")
            pm.unregister(exc.plugin)
            info.pop(name, None)


@cache
def _state() -> _State:
    pm = pluggy.PluginManager(hookspecs.PROJECT)
    pm.add_hookspecs(hookspecs)
    info: dict[str, PluginInfo] = {}
    failures: list[str] = []
    for module_name in DEFAULT_PLUGINS:
        module = importlib.import_module(module_name)
        pm.register(module, name=module_name)
        info[module_name] = PluginInfo(module_name, builtin=True, distribution="beamspread")
    from importlib.metadata import entry_points

    for ep in sorted(entry_points(group=ENTRY_POINT_GROUP), key=lambda e: e.name):
        if not _selected(ep.name):
            continue
        dist, version = _distribution_of(ep)
        try:
            plugin = ep.load()
            pm.register(plugin, name=ep.name)
        except Exception as exc:  # one broken plug-in must not stop the rest
            failures.append(f"plug-in {ep.name} failed to load: {type(exc).__name__}: {exc}")
            continue
        info[ep.name] = PluginInfo(ep.name, builtin=False, distribution=dist, version=version)
    _check_pending(pm, info, failures)
    for name, plugin_info in info.items():
        plugin = pm.get_plugin(name)
        plugin_info.hooks = sorted(caller.name for caller in pm.get_hookcallers(plugin) or ())
    if _tracing():
        for name in info:
            sys.stderr.write(f"beamspread: loaded plug-in {name}\n")
        for line in failures:
            sys.stderr.write(f"beamspread: {line}\n")
    return _State(pm, info, failures)


def _tracing() -> bool:
    return os.environ.get("BEAMSPREAD_TRACE_PLUGINS") == "1"


def get_plugin_manager() -> pluggy.PluginManager:
    """The plug-in manager, built once per process (call :func:`reset_plugin_manager` to redo)."""
    return _state().manager


def plugin_failures() -> list[str]:
    """One line per plug-in that failed to load, naming it and the reason."""
    return list(_state().failures)


def plugin_infos() -> list[PluginInfo]:
    """Every plug-in that loaded, built-ins first."""
    return list(_state().info.values())


def reset_plugin_manager() -> None:
    """Forget the plug-in manager, so the next call loads plug-ins again."""
    _state.cache_clear()


def call_each(
    hook: str, make_kwargs: Callable[[str], dict[str, Any]]
) -> Iterator[tuple[str, Exception | None]]:
    """Call one hook's implementations one by one, built-ins first.

    ``make_kwargs(plugin_name)`` gives the keyword arguments for each call (so
    each plug-in gets a ``register`` callback that knows who is calling).
    Yields ``(plugin_name, None)`` after a successful call and
    ``(plugin_name, exception)`` after a failed one; the caller decides what
    to keep.
    """
    pm = get_plugin_manager()
    caller = getattr(pm.hook, hook)
    # pluggy keeps implementations in registration order and calls the last
    # first; here the built-ins come first so that later sources can win.
    for impl in caller.get_hookimpls():
        name = impl.plugin_name
        if _tracing():
            sys.stderr.write(f"beamspread: calling {hook} of plug-in {name}\n")
        try:
            kwargs = make_kwargs(name)
            impl.function(*[kwargs[arg] for arg in impl.argnames])
        except Exception as exc:  # isolate the plug-in
            yield name, exc
        else:
            yield name, None
