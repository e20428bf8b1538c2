"""The registry of media: every table and plug-in, merged by precedence.

Sources, lowest precedence first:

1. the built-in tables and media (a plug-in like any other);
2. third-party plug-ins (by entry-point name; a later name wins a clash);
3. the user's own tables: the per-user configuration directory, then the
   directories in ``BEAMSPREAD_MATERIALS``, then each ``--materials-dir``
   (the last given wins).

A name or alias given by two sources goes to the higher one, with a warning
naming both. A broken user table is an error (the user asked for it); a
broken plug-in table or a failing plug-in is reported and skipped.
"""

from __future__ import annotations

import difflib
import os
import sys
from collections.abc import Iterator, Sequence
from dataclasses import dataclass, field
from pathlib import Path

from ..errors import InputError, MaterialError, TableError
from .computed import ComputedMedium
from .material import Material
from .quantities import normalise_name
from .tables import load_table

__all__ = [
    "ENV_VAR",
    "Entry",
    "Registry",
    "build_registry",
    "config_dir",
    "user_table_dirs",
]

ENV_VAR = "BEAMSPREAD_MATERIALS"
_GIVEN = "given directory"  # a directory the caller named (the CLI: --materials-dir)
BUILTIN, PLUGIN, USER = 0, 1, 2
LEVEL_NAMES = {BUILTIN: "built-in", PLUGIN: "plug-in", USER: "user"}
Medium = Material | ComputedMedium


@dataclass(frozen=True)
class Entry:
    """A medium and where it came from."""

    medium: Medium
    origin: str  # human-readable: "built-in table metals.toml", "plug-in x (dist 1.0)", ...
    level: int
    plugin: str | None = None
    path: str | None = None

    @property
    def name(self) -> str:
        return self.medium.name

    @property
    def level_name(self) -> str:
        return LEVEL_NAMES[self.level]


@dataclass
class Registry:
    """Media by name, with aliases, what each clash shadowed, and load warnings."""

    entries: dict[str, Entry] = field(default_factory=dict)
    aliases: dict[str, str] = field(default_factory=dict)
    shadowed: dict[str, list[Entry]] = field(default_factory=dict)
    warnings: list[str] = field(default_factory=list)
    locations: list[tuple[str, str, bool]] = field(default_factory=list)  # (what, path, exists)

    def __iter__(self) -> Iterator[Entry]:
        return iter(sorted(self.entries.values(), key=lambda e: e.name))

    def __len__(self) -> int:
        return len(self.entries)

    def _owner(self, label: str) -> Entry | None:
        if label in self.entries:
            return self.entries[label]
        if label in self.aliases:
            return self.entries[self.aliases[label]]
        return None

    def _drop(self, key: str) -> None:
        del self.entries[key]
        for alias in [a for a, target in self.aliases.items() if target == key]:
            del self.aliases[alias]

    def _add(self, entry: Entry) -> None:
        """Add an entry; on a clash the higher source wins, or the later at the same level."""
        key = normalise_name(entry.name)
        owner = self._owner(key)
        if owner is not None:
            if owner.level > entry.level:
                self.warnings.append(
                    f"'{entry.name}' from {entry.origin} is shadowed by "
                    f"'{owner.name}' from {owner.origin}"
                )
                self.shadowed.setdefault(normalise_name(owner.name), []).append(entry)
                return
            self.warnings.append(
                f"'{entry.name}' from {entry.origin} overrides '{owner.name}' from {owner.origin}"
            )
            if key in self.entries:
                self._drop(key)
                self.shadowed.setdefault(key, []).append(owner)
            else:
                del self.aliases[key]
        self.entries[key] = entry
        for alias in entry.medium.aliases:
            label = normalise_name(alias)
            owner = self._owner(label)
            if owner is None:
                self.aliases[label] = key
            elif owner is not entry:
                if label in self.entries or owner.level > entry.level:
                    self.warnings.append(
                        f"alias '{alias}' of '{entry.name}' ({entry.origin}) is ignored: "
                        f"'{owner.name}' from {owner.origin} holds it"
                    )
                else:
                    self.warnings.append(
                        f"alias '{alias}' of '{entry.name}' ({entry.origin}) replaces "
                        f"that of '{owner.name}' from {owner.origin}"
                    )
                    self.aliases[label] = key

    def get(self, name: str) -> Entry:
        """The entry for a name or alias.

        Raises
        ------
        MaterialError
            With the closest names suggested.
        """
        key = normalise_name(name)
        if key in self.entries:
            return self.entries[key]
        if key in self.aliases:
            return self.entries[self.aliases[key]]
        known = list(self.entries) + list(self.aliases)
        close = difflib.get_close_matches(key, known, n=3, cutoff=0.5)
        if not close:
            close = [k for k in known if key in k][:3]
        hint = f"; did you mean {', '.join(repr(c) for c in close)}?" if close else ""
        raise MaterialError(
            f"no material or medium named {name!r}{hint} (see 'beamspread materials list')"
        )


def config_dir() -> Path:
    """The per-user configuration directory of beamspread.

    ``%APPDATA%\\beamspread`` on Windows, ``~/Library/Application Support/beamspread``
    on macOS, else ``$XDG_CONFIG_HOME/beamspread`` (default ``~/.config/beamspread``).
    """
    if sys.platform == "win32":
        base = Path(os.environ.get("APPDATA") or Path.home() / "AppData" / "Roaming")
    elif sys.platform == "darwin":
        base = Path.home() / "Library" / "Application Support"
    else:
        base = Path(os.environ.get("XDG_CONFIG_HOME") or Path.home() / ".config")
    return base / "beamspread"


def user_table_dirs(extra: Sequence[str | Path] = ()) -> list[tuple[str, Path]]:
    """The user's table directories, lowest precedence first, each with how it was named."""
    dirs: list[tuple[str, Path]] = [("configuration directory", config_dir() / "materials")]
    for part in os.environ.get(ENV_VAR, "").split(os.pathsep):
        if part.strip():
            dirs.append((ENV_VAR, Path(part)))
    for d in extra:
        dirs.append((_GIVEN, Path(d)))
    return dirs


def _table_files(location) -> list:
    if location.is_dir():
        return sorted(
            (p for p in location.iterdir() if p.name.endswith(".toml")), key=lambda p: p.name
        )
    return [location]


def _plugin_origin(name: str, builtin: bool, dist: str | None, version: str | None) -> str:
    if builtin:
        return "built-in"
    about = f" ({dist} {version})" if dist else ""
    return f"plug-in {name}{about}"


def build_registry(materials_dirs: Sequence[str | Path] = ()) -> Registry:
    """Collect every medium from the plug-ins and the user's tables.

    Parameters
    ----------
    materials_dirs : sequence of path
        Directories given with ``--materials-dir``; each must exist.

    Raises
    ------
    InputError
        A ``--materials-dir`` that is not a directory.
    TableError
        A broken user table (file and line, or file, entry and key).
    """
    from ..plugins import call_each, plugin_failures, plugin_infos

    registry = Registry()
    registry.warnings.extend(plugin_failures())
    infos = {i.name: i for i in plugin_infos()}

    for hook in ("register_media", "register_tables"):
        for plugin_name, error in _collect(registry, infos, hook, call_each):
            if error is not None:
                registry.warnings.append(
                    f"plug-in {plugin_name} failed in {hook}: {type(error).__name__}: "
                    f"{error}; skipped"
                )

    for how, directory in user_table_dirs(materials_dirs):
        exists = directory.is_dir()
        registry.locations.append((f"user ({how})", str(directory), exists))
        if not exists:
            if how == _GIVEN:
                raise InputError(
                    f"materials directory: {str(directory)!r} is not a directory",
                    remedy=("materials_dirs", None),
                )
            if how == ENV_VAR:
                registry.warnings.append(f"{ENV_VAR}: {str(directory)!r} is not a directory")
            continue
        for path in _table_files(directory):
            table = load_table(path)
            for material in table.materials:
                registry._add(Entry(material, f"user table {path}", USER, path=str(path)))
    return registry


def _collect(registry: Registry, infos, hook: str, call_each):
    """Run one hook for every plug-in; keep a plug-in's entries only if its hook succeeded."""
    pending: dict[str, list[Entry]] = {}

    def make_kwargs(plugin_name: str):
        info = infos.get(plugin_name)
        builtin = info.builtin if info else False
        origin = _plugin_origin(
            plugin_name, builtin, info and info.distribution, info and info.version
        )
        level = BUILTIN if builtin else PLUGIN
        batch = pending.setdefault(plugin_name, [])

        def register_medium(medium):
            if not isinstance(medium, (Material, ComputedMedium)):
                raise TypeError(
                    f"register_media expects a ComputedMedium or Material, "
                    f"not {type(medium).__name__}"
                )
            where = "built-in medium" if builtin else origin
            batch.append(Entry(medium, where, level, plugin=plugin_name))

        def register_table(location):
            registry.locations.append((origin, str(location), True))
            for path in _table_files(location):
                shown = path.name
                where = f"{'built-in' if builtin else origin} table {shown}"
                try:
                    table = load_table(path, display=shown)
                except TableError as exc:
                    raise TableError(
                        exc.reason,
                        path=f"{origin}: {exc.path}",
                        line=exc.line,
                        entry=exc.entry,
                        key=exc.key,
                    ) from None
                for material in table.materials:
                    batch.append(Entry(material, where, level, plugin=plugin_name, path=str(path)))

        return {"register": register_medium if hook == "register_media" else register_table}

    for plugin_name, error in call_each(hook, make_kwargs):
        batch = pending.pop(plugin_name, [])
        if error is None:
            for entry in batch:
                registry._add(entry)
        yield plugin_name, error
