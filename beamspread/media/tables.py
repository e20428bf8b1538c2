"""Reading material tables: TOML files in a format of our own.

A table never executes code. The format (documented in DEVELOPERS.md and in
``beamspread materials --help``)::

    format = 1                       # required
    title = "..."                    # optional
    description = "..."              # optional

    [[material]]
    name = "carbon-steel"            # required: lower case, digits, hyphens
    aliases = ["mild steel"]         # optional
    state = "solid"                  # required: solid | liquid | gas
    category = "metal"               # optional
    description = "AISI 1020"        # optional
    note = "..."                     # optional
    longitudinal = { value = 5920, unit = "m/s", source = "..." }   # required
    shear = { value = 3255, unit = "m/s", source = "..." }          # solids only
    density = { value = 7850, unit = "kg/m3", source = "..." }      # optional

A value is either a constant (``value``) or a curve against temperature
(``temperature = [...]`` in ``temperature_unit``, default degC, with
``values = [...]``), interpolated linearly and refused outside its range.
Every value carries a ``unit`` and a ``source`` and may carry a ``note``.
"""

from __future__ import annotations

import itertools
import math
import re
import sys
from collections.abc import Iterable
from dataclasses import dataclass
from pathlib import Path
from typing import Any

from ..errors import InputError, TableError
from ..units import KINDS, parse_quantity, unit_of
from .material import Material
from .quantities import NAME_PATTERN, STATES, Curve, Value

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover - exercised on Python 3.10 only
    import tomli as tomllib

__all__ = ["FORMAT", "TableFile", "load_table", "parse_table"]

FORMAT = 1
TOP_KEYS = {"format", "title", "description", "material"}
ENTRY_KEYS = {
    "name",
    "aliases",
    "state",
    "category",
    "description",
    "note",
    "longitudinal",
    "shear",
    "density",
}
VALUE_KEYS = {"value", "unit", "source", "note", "temperature", "temperature_unit", "values"}
_QUANTITY_KIND = {"longitudinal": "speed", "shear": "speed", "density": "density"}


@dataclass(frozen=True)
class TableFile:
    """One parsed table file."""

    path: str
    title: str | None
    description: str | None
    materials: tuple[Material, ...]


class _Context:
    """Where an error is: the file, and the line of the entry being read (``index``)."""

    def __init__(self, path: str, text: str) -> None:
        self.path = path
        self.lines = text.splitlines()
        self.headers = [
            i for i, line in enumerate(self.lines) if re.match(r"^\s*\[\[\s*material\s*\]\]", line)
        ]
        self.index: int | None = None  # the [[material]] being read

    def line_of(self, entry: str | None, key: str | None = None) -> int | None:
        """1-based line of ``key`` in the current entry, else of its name, else its header."""
        if entry is None or self.index is None or self.index >= len(self.headers):
            return None
        start = self.headers[self.index]
        stop = (
            self.headers[self.index + 1] if self.index + 1 < len(self.headers) else len(self.lines)
        )
        for wanted in (key, "name"):  # the key's line, else the entry's name line
            if wanted is None:
                continue
            pattern = re.compile(r"^\s*" + re.escape(wanted) + r"\s*=")
            for i in range(start, stop):
                if pattern.match(self.lines[i]):
                    return i + 1
        return start + 1

    def error(
        self,
        message: str,
        entry: str | None = None,
        key: str | None = None,
        line: int | None = None,
    ) -> TableError:
        return TableError(
            message, path=self.path, line=line or self.line_of(entry, key), entry=entry, key=key
        )


def _closest(word: str, allowed: Iterable[str]) -> str:
    import difflib

    match = difflib.get_close_matches(word, sorted(allowed), n=1)
    return f" (did you mean '{match[0]}'?)" if match else ""


def _positive(number: Any, ctx: _Context, entry: str, key: str) -> float:
    if isinstance(number, bool) or not isinstance(number, (int, float)):
        raise ctx.error(f"{number!r} is not a number", entry, key)
    if not math.isfinite(number) or number <= 0:
        raise ctx.error(f"{number!r} is not allowed; values must be finite and above 0", entry, key)
    return float(number)


def _known_keys(raw: dict, allowed, ctx: _Context, entry: str, key: str | None = None) -> None:
    """Refuse a key not in ``allowed``: of the value under ``key``, or of the entry itself."""
    unknown = sorted(set(raw) - allowed)
    if unknown:
        where = "" if key is None else f" '{unknown[0]}' in the value"
        raise ctx.error(
            f"unknown key{where}{_closest(unknown[0], allowed)}; "
            f"allowed: {', '.join(sorted(allowed))}",
            entry,
            key or unknown[0],
        )


def _value(raw: Any, ctx: _Context, entry: str, key: str) -> Value:
    if not isinstance(raw, dict):
        raise ctx.error(
            "a value must be an inline table such as "
            '{ value = 5920, unit = "m/s", source = "..." }',
            entry,
            key,
        )
    _known_keys(raw, VALUE_KEYS, ctx, entry, key)
    kind = _QUANTITY_KIND[key]
    unit = raw.get("unit")
    if not isinstance(unit, str) or not unit.strip():
        raise ctx.error(f"the value needs a unit; allowed: {KINDS[kind].units}", entry, key)
    if unit_of(kind, unit) is None:
        raise ctx.error(f"unknown unit {unit!r}; allowed: {KINDS[kind].units}", entry, key)
    source = raw.get("source")
    if not isinstance(source, str) or not source.strip():
        raise ctx.error(
            "the value needs a source (a published table, 'common practice' or 'from memory')",
            entry,
            key,
        )
    note = raw.get("note")

    def convert(number: Any) -> float:
        number = _positive(number, ctx, entry, key)
        try:
            return parse_quantity(f"{number!r} {unit}", kind)
        except InputError:
            raise ctx.error(
                f"{number!r} {unit} is not a finite value in SI units", entry, key
            ) from None

    has_value = "value" in raw
    has_curve = "temperature" in raw or "values" in raw
    if has_value == has_curve:
        raise ctx.error(
            "give either 'value', or 'temperature' and 'values' for a curve", entry, key
        )
    if has_value:
        return Value(source=source, value=convert(raw["value"]), note=note)
    temps, values = raw.get("temperature"), raw.get("values")
    if not isinstance(temps, list) or not isinstance(values, list):
        raise ctx.error("a curve needs lists 'temperature' and 'values'", entry, key)
    if len(temps) != len(values) or len(temps) < 2:
        raise ctx.error(
            "a curve needs 'temperature' and 'values' of the same length, at least 2", entry, key
        )
    t_unit = raw.get("temperature_unit", "degC")
    try:
        temps_c = tuple(parse_quantity(f"{float(t)!r} {t_unit}", "temperature") for t in temps)
    except (InputError, TypeError, ValueError):
        raise ctx.error(
            f"curve temperatures must be numbers in a temperature unit "
            f"({KINDS['temperature'].units})",
            entry,
            key,
        ) from None
    if any(b <= a for a, b in itertools.pairwise(temps_c)):
        raise ctx.error("curve temperatures must increase", entry, key)
    curve = Curve(temps_c, tuple(convert(v) for v in values))
    return Value(source=source, curve=curve, note=note)


def _span(value: Value) -> tuple[float, ...]:
    return value.curve.values if value.curve is not None else (value.reference,)


def _material(raw: Any, index: int, ctx: _Context) -> Material:
    ctx.index = index
    if not isinstance(raw, dict):
        raise ctx.error(f"[[material]] number {index + 1} is not a table")
    name = raw.get("name")
    if not isinstance(name, str):
        raise ctx.error(f"[[material]] number {index + 1} has no name", key="name")
    if not NAME_PATTERN.match(name):
        raise ctx.error(
            "names use lower-case letters, digits and single hyphens, starting with a letter",
            name,
            "name",
        )
    _known_keys(raw, ENTRY_KEYS, ctx, name)
    state = raw.get("state")
    if state not in STATES:
        raise ctx.error(
            f"state {state!r} is not allowed; use one of {', '.join(STATES)}", name, "state"
        )
    if "longitudinal" not in raw:
        raise ctx.error("the longitudinal velocity is missing", name, "longitudinal")
    longitudinal = _value(raw["longitudinal"], ctx, name, "longitudinal")
    shear = None
    if "shear" in raw:
        if state != "solid":
            raise ctx.error(f"a {state} carries no shear wave; remove 'shear'", name, "shear")
        shear = _value(raw["shear"], ctx, name, "shear")
        if max(_span(shear)) >= min(_span(longitudinal)):
            raise ctx.error("the shear velocity must be below the longitudinal one", name, "shear")
    density = _value(raw["density"], ctx, name, "density") if "density" in raw else None
    aliases = raw.get("aliases", [])
    if not isinstance(aliases, list) or not all(isinstance(a, str) and a.strip() for a in aliases):
        raise ctx.error("aliases must be a list of non-empty strings", name, "aliases")
    text = {key: raw.get(key) for key in ("category", "description", "note")}
    for key, value in text.items():
        if value is not None and not isinstance(value, str):
            raise ctx.error("must be a string", name, key)
    return Material(name, state, longitudinal, shear, density, aliases=tuple(aliases), **text)


def parse_table(text: str, path: str = "<table>") -> TableFile:
    """Parse and check the text of a table file.

    Raises
    ------
    TableError
        Naming the file and line (for TOML syntax errors), or the file, entry
        and key (for a value that breaks the format).
    """
    from .quantities import normalise_name

    ctx = _Context(path, text)
    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        message = str(exc)
        m = re.search(r"\(at line (\d+), column (\d+)\)", message)
        line = int(m.group(1)) if m else getattr(exc, "lineno", None)
        reason = re.sub(r"\s*\(at line \d+, column \d+\)", "", message)
        raise TableError(f"invalid TOML: {reason}", path=path, line=line) from None
    unknown = sorted(set(data) - TOP_KEYS)
    if unknown:
        raise ctx.error(
            f"unknown top-level key{_closest(unknown[0], TOP_KEYS)}; allowed: "
            f"{', '.join(sorted(TOP_KEYS))}",
            key=unknown[0],
        )
    fmt = data.get("format")
    if type(fmt) is not int or fmt != FORMAT:
        raise ctx.error(
            f"format = {data.get('format')!r} is not understood; this version "
            f"reads format = {FORMAT}",
            key="format",
            line=1 if "format" not in data else None,
        )
    entries = data.get("material", [])
    if not isinstance(entries, list):
        raise ctx.error("'material' must be an array of tables: write [[material]]", key="material")
    materials = []
    seen: dict[str, str] = {}
    for index, raw in enumerate(entries):
        material = _material(raw, index, ctx)
        for label in (material.name, *material.aliases):
            key = normalise_name(label)
            if key in seen:
                what = "name" if label == material.name else "aliases"
                raise ctx.error(
                    f"'{label}' is already used by entry '{seen[key]}' in this file",
                    material.name,
                    what,
                )
            seen[key] = material.name
        materials.append(material)
    for key in ("title", "description"):
        if key in data and not isinstance(data[key], str):
            raise ctx.error("must be a string", key=key)
    return TableFile(path, data.get("title"), data.get("description"), tuple(materials))


def load_table(path: str | Path, *, display: str | None = None) -> TableFile:
    """Read and check one table file (a path, or an ``importlib.resources`` Traversable)."""
    shown = display or str(path)
    try:
        raw = path.read_bytes() if hasattr(path, "read_bytes") else Path(path).read_bytes()
    except OSError as exc:
        raise TableError(f"cannot read: {exc.strerror or exc}", path=shown) from None
    try:
        text = raw.decode("utf-8")
    except UnicodeDecodeError as exc:
        raise TableError(f"not UTF-8 text (byte {exc.start})", path=shown) from None
    return parse_table(text, shown)
