"""The conventions a result is stated in, as types: the mode, the method and the coupling.

Each is a ``str`` enumeration, so its value is what the JSON, the tables and
the setup files write ("pulse-echo", "far-field", "wedge"), and a renderer
asks ``result.coupling is Coupling.WEDGE`` instead of reading a text.
Levels are dB down, positive (6.0 is 6 dB below the peak); only what is
printed carries the sign.
"""

from __future__ import annotations

from enum import Enum

from .errors import InputError

__all__ = ["Coupling", "Method", "Mode", "level_key"]


class _Named(str, Enum):
    """A str enumeration that prints and formats as its value."""

    def __str__(self) -> str:
        return self.value

    def __format__(self, spec: str) -> str:
        return format(self.value, spec)

    @classmethod
    def parse(cls, value):
        """The member named ``value`` (a member passes through); InputError listing the names."""
        try:
            return cls(value)
        except ValueError:
            names = ", ".join(m.value for m in cls)
            raise InputError(
                f"{cls.__name__.lower()}: {value!r} is unknown; use one of {names}"
            ) from None


class Mode(_Named):
    """One-way (transmit only) or pulse-echo (transmit x receive, the pattern squared)."""

    PULSE_ECHO = "pulse-echo"
    ONE_WAY = "one-way"


class Method(_Named):
    """Where a width comes from: the far-field formula, or the computed field."""

    FAR_FIELD = "far-field"
    FIELD = "field"


class Coupling(_Named):
    """How the beam gets into the part."""

    CONTACT = "contact"  # the element on the part (a focus is then in the part itself)
    WEDGE = "wedge"  # an angle-beam wedge
    IMMERSION = "immersion"  # a water path (or a delay line) at normal incidence


def level_key(level_db: float) -> str:
    """The key of a level in results: 6 -> "-6", 6.5 -> "-6.5"."""
    return f"-{abs(level_db):g}"
