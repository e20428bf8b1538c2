"""Element shapes: the flat circular and the flat rectangular piston.

A probe is geometry plus a centre frequency, in SI units. Values are checked
(positive, finite) when the probe is made, so everything downstream may
assume them sound.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from .errors import InputError

__all__ = ["Disc", "Ellipse", "Probe", "Rectangle", "check_positive", "plane_name"]


def plane_name(probe, plane: str | None) -> str:
    """The probe's plane ``plane`` (its first plane when None), refused if it has no such plane."""
    names = [name for name, _ in probe.planes]
    if plane is None:
        return names[0]
    if plane not in names:
        raise InputError(
            f"plane: {plane!r} is not a plane of this probe; use one of {', '.join(names)}"
        )
    return plane


def check_positive(value: float, name: str, unit: str = "") -> float:
    """Return ``value`` as a float if it is finite and above zero, else raise.

    Raises
    ------
    InputError
        Naming the value and what is allowed.
    """
    try:
        number = float(value)
    except (TypeError, ValueError):
        raise InputError(f"{name}: {value!r} is not a number") from None
    if not math.isfinite(number) or number <= 0.0:
        shown = f"{value!r}{(' ' + unit) if unit else ''}"
        raise InputError(f"{name}: {shown} is not allowed; it must be a finite number above 0")
    return number


def _check_focus(element) -> None:
    if element.focus is not None:
        object.__setattr__(element, "focus", check_positive(element.focus, "focus", "m"))


@dataclass(frozen=True)
class Disc:
    """A flat circular piston.

    Parameters
    ----------
    diameter : float
        Element diameter, m.
    frequency : float
        Centre frequency, Hz.
    focus : float, optional
        Focal length of a spherically focused element (in the medium it
        touches: the couplant, or the part in contact), m; None for a flat one.
    """

    diameter: float
    frequency: float
    focus: float | None = None

    shape = "disc"
    pattern = "disc"  # the far-field pattern's kind (pattern.half_angle's ``shape``)

    def dimensions(self) -> dict[str, float]:
        """The element's sizes, m, keyed as the JSON writes them."""
        return {"diameter_m": self.diameter}

    def __post_init__(self) -> None:
        object.__setattr__(self, "diameter", check_positive(self.diameter, "diameter", "m"))
        object.__setattr__(self, "frequency", check_positive(self.frequency, "frequency", "Hz"))
        _check_focus(self)

    @property
    def planes(self) -> tuple[tuple[str, float], ...]:
        """The planes of the beam, as (name, aperture in m): one for a disc."""
        return (("diameter", self.diameter),)

    @property
    def longest_side(self) -> float:
        return self.diameter


@dataclass(frozen=True)
class _TwoSided:
    """An element with a size along x (``length``) and along y (``width``)."""

    length: float
    width: float
    frequency: float

    def __post_init__(self) -> None:
        object.__setattr__(self, "length", check_positive(self.length, "length", "m"))
        object.__setattr__(self, "width", check_positive(self.width, "width", "m"))
        object.__setattr__(self, "frequency", check_positive(self.frequency, "frequency", "Hz"))

    def dimensions(self) -> dict[str, float]:
        """The element's sizes, m, keyed as the JSON writes them."""
        return {"length_m": self.length, "width_m": self.width}

    @property
    def planes(self) -> tuple[tuple[str, float], ...]:
        """The planes of the beam, as (name, aperture in m): length (x), then width (y)."""
        return (("length", self.length), ("width", self.width))

    @property
    def longest_side(self) -> float:
        return max(self.length, self.width)


@dataclass(frozen=True)
class Rectangle(_TwoSided):
    """A flat rectangular piston.

    Parameters
    ----------
    length : float
        The side that lies in the plane a plot draws (the x-z plane), m.
    width : float
        The other side (the y-z plane), m.
    frequency : float
        Centre frequency, Hz.
    focus : float, optional
        Focal length of a cylindrical focus in the length plane, m; None for a flat element.
    """

    focus: float | None = None

    shape = "rectangle"
    pattern = "side"  # each plane's pattern is a side's sinc

    def __post_init__(self) -> None:
        super().__post_init__()
        _check_focus(self)


@dataclass(frozen=True)
class Ellipse(_TwoSided):
    """A flat elliptical piston: the element a disc looks like from inside a part.

    A disc on an angle-beam wedge is seen from the part as an ellipse whose
    axis in the incidence plane is shortened by cos(refracted)/cos(incident);
    :mod:`beamspread.coupling.wedge` builds it.

    Parameters
    ----------
    length : float
        The axis along x (the plotted, incidence plane), m.
    width : float
        The axis along y, m.
    frequency : float
        Centre frequency, Hz.
    """

    shape = "ellipse"
    pattern = "disc"  # its planes' patterns are taken as a disc's of that aperture


Probe = Disc | Rectangle | Ellipse
