"""Reading and writing setup files: TOML text to a :class:`Setup` and back, files atomically."""

from __future__ import annotations

import json
import os
import re
import sys
from pathlib import Path

from ..atomic import write_atomically
from ..errors import InputError
from .keys import _KEYS, _SECTIONS, _check, _where
from .model import Setup

if sys.version_info >= (3, 11):
    import tomllib
else:  # pragma: no cover - Python 3.10
    import tomli as tomllib

__all__ = ["FORMAT", "dumps_setup", "load_setup", "parse_setup", "save_setup"]

FORMAT = 1


# ----------------------------------------------------------------- reading


def _line_of(text: str, section: str, key: str | None) -> int | None:
    """The 1-based line of ``key`` in ``[section]`` (or of the header), where it can be found."""
    current = ""
    header = re.compile(r"^\s*\[\s*([A-Za-z0-9_.\"-]+)\s*\]\s*(#.*)?$")
    for number, line in enumerate(text.splitlines(), 1):
        m = header.match(line)
        if m:
            current = m.group(1).strip('"')
            if key is None and current == section:
                return number
            continue
        if (
            key is not None
            and current == section
            and re.match(rf"^\s*(\"{re.escape(key)}\"|{re.escape(key)})\s*=", line)
        ):
            return number
    return None


def _fail(path: str, text: str, section: str, key: str | None, message: str) -> InputError:
    line = _line_of(text, section, key)
    where = path if line is None else f"{path}:{line}"
    name = f"{section}.{key}" if section and key else (key or section)
    return InputError(f"{where}: key '{name}': {message}")


def parse_setup(text: str, path: str = "<setup>") -> Setup:
    """A :class:`Setup` from TOML text; errors name ``path``, the key and its line."""
    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise InputError(f"{path}: not valid TOML: {exc}") from None
    if "format" not in data:
        raise InputError(
            f"{path}: key 'format' is missing; the first line should read format = {FORMAT}"
        )
    if data["format"] != FORMAT or isinstance(data["format"], bool):
        raise _fail(
            path,
            text,
            "",
            "format",
            f"{data['format']!r} is not a format this version reads (it reads {FORMAT})",
        )
    values: dict[str, object] = {}
    keys = {(k.section, k.key): k for k in _KEYS}
    for name, value in data.items():
        if name == "format":
            continue
        if isinstance(value, dict) and name in _SECTIONS:
            for sub, item in value.items():
                key = keys.get((name, sub))
                if key is None:
                    allowed = ", ".join(k.key for k in _KEYS if k.section == name)
                    raise _fail(path, text, name, sub, f"unknown key; [{name}] takes {allowed}")
                try:
                    values[key.field] = _check(key, item)
                except InputError as exc:
                    raise _fail(
                        path, text, name, sub, str(exc).removeprefix(f"{_where(key)}: ")
                    ) from None
            continue
        key = keys.get(("", name))
        if key is None:
            what = "section" if isinstance(value, dict) else "key"
            raise _fail(
                path,
                text,
                name if what == "section" else "",
                None if what == "section" else name,
                f"unknown {what}; a setup has format, title, "
                f"description and the sections {', '.join(_SECTIONS)}",
            )
        try:
            values[key.field] = _check(key, value)
        except InputError as exc:
            raise _fail(path, text, "", name, str(exc).removeprefix(f"{name}: ")) from None
    if "conditions" in values:
        values["conditions"] = tuple(values["conditions"])
    if "frequency" not in values:
        raise _fail(path, text, "probe", None, "the probe needs a frequency")
    try:
        return Setup(**values)
    except InputError as exc:
        section = str(exc).split(":", 1)[0]
        raise _fail(
            path, text, section if section in _SECTIONS else "", None, str(exc).split(": ", 1)[-1]
        ) from None


def load_setup(path: str | os.PathLike) -> Setup:
    """Read a setup file; InputError naming the file, key and line for anything wrong."""
    name = str(path)
    try:
        text = Path(path).read_text(encoding="utf-8")
    except FileNotFoundError:
        raise InputError(f"{name}: no such setup file") from None
    except (OSError, UnicodeDecodeError) as exc:
        raise InputError(f"{name}: cannot read the setup file: {exc}") from None
    return parse_setup(text, name)


# ----------------------------------------------------------------- writing


def _toml(value) -> str:
    if isinstance(value, str):
        return json.dumps(value, ensure_ascii=False).replace("\x7f", "\\u007f")
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, (int, float)):
        return repr(value)
    if isinstance(value, tuple) and value and isinstance(value[0], tuple):  # conditions
        return "{ " + ", ".join(f"{_toml_key(k)} = {_toml(v)}" for k, v in value) + " }"
    if isinstance(value, (tuple, list)):
        return "[" + ", ".join(_toml(v) for v in value) + "]"
    raise TypeError(f"cannot write {value!r}")  # pragma: no cover - Setup checks its values


def _toml_key(key: str) -> str:
    return key if re.fullmatch(r"[A-Za-z0-9_-]+", key) else _toml(key)


def dumps_setup(setup: Setup) -> str:
    """The TOML text of ``setup`` (what :func:`save_setup` writes)."""
    lines = [f"format = {FORMAT}"]
    for key in _KEYS:
        if key.section == "" and getattr(setup, key.field) is not None:
            lines.append(f"{key.key} = {_toml(getattr(setup, key.field))}")
    for section in _SECTIONS:
        body = []
        for key in _KEYS:
            if key.section != section:
                continue
            value = getattr(setup, key.field)
            if value is None or value == ():
                continue
            body.append(f"{key.key} = {_toml(value)}")
        if body:
            lines += ["", f"[{section}]", *body]
    return "\n".join(lines) + "\n"


def save_setup(setup: Setup, path: str | os.PathLike, *, force: bool = False) -> Path:
    """Write ``setup`` to ``path`` atomically; refuse to overwrite unless ``force``.

    Raises
    ------
    InputError
        The file exists (and not ``force``), or its folder does not.
    """
    target = Path(path)
    if not target.parent.is_dir():
        raise InputError(f"{str(path)!r}: the folder {str(target.parent)!r} does not exist")
    if target.is_dir():
        raise InputError(f"{str(path)!r} is a folder, not a file")
    if target.exists() and not force:
        raise InputError(
            f"{str(path)!r} exists; it is kept unless overwriting is forced", remedy=("force", None)
        )
    text = dumps_setup(setup)
    return write_atomically(
        target, lambda name: Path(name).write_text(text, encoding="utf-8", newline="\n")
    )
