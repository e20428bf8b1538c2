"""The one family of errors beamspread raises.

Every error derives from :class:`BeamspreadError` and also from the matching
builtin, so callers may catch either ``BeamspreadError`` or ``ValueError``.
"""

from __future__ import annotations

__all__ = [
    "BeamspreadError",
    "InputError",
    "MaterialError",
    "PluginError",
    "TableError",
]


class BeamspreadError(Exception):
    """Base class of every error raised on purpose by beamspread."""


class InputError(BeamspreadError, ValueError):
    """A value given by the caller is outside what is allowed.

    The message names the value and says what is allowed, in the library's
    words: it never names a command-line option.

    Attributes
    ----------
    remedy : tuple of (str, str or None), or None
        Where the message suggests giving a parameter, the parameter's name
        (as the library spells it, e.g. ``"temperature"``) and the value to
        give (None for "give one"); a front end names its own option from it.
    """

    def __init__(self, message: str = "", *, remedy: tuple[str, str | None] | None = None):
        super().__init__(message)
        self.remedy = remedy


class MaterialError(InputError, LookupError):
    """No such material or medium, or a condition it does not declare."""


class TableError(BeamspreadError, ValueError):
    """A material table is malformed.

    Attributes
    ----------
    path : str
        The file, as given.
    line : int or None
        1-based line number where known.
    entry : str or None
        The entry (material name) concerned, where known.
    key : str or None
        The key concerned, where known.
    """

    def __init__(
        self,
        message: str,
        *,
        path: str,
        line: int | None = None,
        entry: str | None = None,
        key: str | None = None,
    ) -> None:
        self.path = path
        self.line = line
        self.entry = entry
        self.key = key
        self.reason = message
        where = path if line is None else f"{path}:{line}"
        parts = [where]
        if entry is not None:
            parts.append(f"entry '{entry}'")
        if key is not None:
            parts.append(f"key '{key}'")
        super().__init__(f"{', '.join(parts)}: {message}")


class PluginError(BeamspreadError, RuntimeError):
    """A plug-in could not be loaded or failed inside a hook."""
