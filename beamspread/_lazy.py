"""Names a package loads on first use (PEP 562's module ``__getattr__``)."""

from __future__ import annotations

from importlib import import_module


def lazy_names(package: str, table: dict[str, str], namespace: dict):
    """``(__getattr__, __dir__)`` for a package whose ``table`` maps a name to the submodule
    (relative to ``package``) that defines it; a loaded name is kept in ``namespace``."""

    def __getattr__(name: str):
        if name in table:
            value = getattr(import_module(f".{table[name]}", package), name)
            namespace[name] = value
            return value
        raise AttributeError(f"module {package!r} has no attribute {name!r}")

    def __dir__() -> list[str]:
        return sorted({*namespace, *table})

    return __getattr__, __dir__
