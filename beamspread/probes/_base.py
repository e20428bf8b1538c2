"""What every element type answers, and the checks they share.

An element type is a class derived from :class:`Element` and registered with
:func:`register_kind`. The rest of the package never asks which type an
element has: it asks the element (its planes, far-field pattern, near field,
field-engine boundary, symmetry, focus, the element it looks like through a
wedge) and refuses, with :func:`check_element`, an object that is not one.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import TYPE_CHECKING, ClassVar

import numpy as np

from .. import pattern
from .._checks import check_positive
from ..errors import InputError

if TYPE_CHECKING:
    from collections.abc import Callable

__all__ = [
    "Element",
    "NearField",
    "WedgeView",
    "check_element",
    "check_focus",
    "check_sizes",
    "element_class",
    "kinds",
    "plane_name",
    "register_kind",
]

_KINDS: dict[str, type[Element]] = {}


def register_kind(cls: type[Element]) -> type[Element]:
    """Class decorator: make ``cls`` an element type the package knows, by its ``shape``."""
    _KINDS[cls.shape] = cls
    return cls


def kinds(*, probe: bool = False) -> tuple[str, ...]:
    """The names of the known element types (``probe``: those a probe may have)."""
    return tuple(name for name, cls in _KINDS.items() if cls.probe or not probe)


def element_class(kind: str) -> type[Element]:
    """The element type named ``kind`` (a probe's: ``"disc"`` or ``"rectangle"``)."""
    if kind not in _KINDS or not _KINDS[kind].probe:
        raise InputError(
            f"shape: {kind!r} is not an element type; use one of {', '.join(kinds(probe=True))}"
        )
    return _KINDS[kind]


def check_sizes(kind: str, given) -> None:
    """Refuse a probe of type ``kind`` given sizes (by name) it does not take, or not its own."""
    cls = element_class(kind)
    every = dict.fromkeys(n for k in kinds(probe=True) for n in _KINDS[k].size_names)
    if set(given) != set(cls.size_names):
        takes = " and ".join(f"a {name}" for name in cls.size_names)
        others = " or ".join(name for name in every if name not in cls.size_names)
        raise InputError(f"probe: a {kind} takes {takes} (and no {others})")


def check_element(element, *, probe: bool = False) -> Element:
    """Return ``element`` if it is a known element type, else raise one line.

    With ``probe``, only the types a real probe may have (not a virtual element).
    """
    known = tuple(cls for cls in _KINDS.values() if cls.probe or not probe)
    if type(element) not in known:
        raise InputError(
            f"element: {element!r} is not an element type beamspread models; use one of "
            f"{', '.join(cls.shape for cls in known)}"
        )
    return element


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


def check_focus(element) -> None:
    """Check a dataclass element's ``focus`` (None, or a length above 0) in place."""
    if element.focus is not None:
        object.__setattr__(element, "focus", check_positive(element.focus, "focus", "m"))


@dataclass(frozen=True)
class NearField:
    """An element's near field in a medium, as the element works it out.

    Attributes
    ----------
    length : float
        The last on-axis maximum, m; NaN where the element has none (no larger
        than a wavelength).
    simple : float
        The common estimate ``L**2 / (4 lambda)`` on the longest side, m.
    method : str
        How ``length`` was found.
    factor : float or None
        ``length / simple`` where the type reports it (a rectangle), else None.
    """

    length: float
    simple: float
    method: str
    factor: float | None = None


@dataclass(frozen=True)
class WedgeView:
    """An element as the part sees it through an angle-beam wedge.

    Attributes
    ----------
    virtual : Element
        The element with its incidence-plane size shortened by
        cos(refracted)/cos(incident).
    plane_names : dict
        The virtual element's plane names -> the names the results give them.
    simple_square : float
        The squared size whose ``/ (4 lambda)`` is the simple near field, m².
    simple_formula : str
        That estimate in words.
    """

    virtual: Element
    plane_names: dict[str, str]
    simple_square: float
    simple_formula: str


class Element:
    """The answers every element type gives (the base of :class:`Disc`, :class:`Rectangle`...).

    Class attributes name the type: ``shape`` (its name in results and setup
    files), ``pattern`` (the far-field pattern family of
    :mod:`beamspread.pattern`: ``"disc"`` or ``"side"``), ``symmetry``,
    ``focus_kind`` (``"spherical"``, ``"cylindrical"`` or None where the type
    cannot be focused), ``focused_plane`` (the plane the focus curves) and
    ``probe`` (whether a real probe may have this type).
    """

    shape: ClassVar[str]
    pattern: ClassVar[str]
    symmetry: ClassVar[str]
    probe: ClassVar[bool] = True
    noun: ClassVar[str]  # the adjective of "... element" in a probe line
    size_names: ClassVar[tuple[str, ...]]  # the sizes that make one (sizes() keys)
    focus_kind: ClassVar[str | None] = None
    focused_plane: ClassVar[str | None] = None
    focus_half_name: ClassVar[str] = "half-aperture"  # radius, half-length
    near_field_label: ClassVar[str] = ""  # how the near field is found, in a table
    simple_near_field_label: ClassVar[str] = ""  # the simple estimate, in a table
    directivity_factor_method: ClassVar[str] = ""  # how directivity_factor is found
    focus = None  # no focus unless the type has one
    frequency: float

    # ---- sizes and words -------------------------------------------------
    @property
    def planes(self) -> tuple[tuple[str, float], ...]:
        """The planes of the beam, as (name, aperture in m); the first is the x-z plane.

        The x-z plane is the one a picture draws and a wedge's incidence plane.
        """
        raise NotImplementedError

    def sizes(self) -> dict[str, float]:
        """The element's sizes by name (diameter; length and width), m."""
        raise NotImplementedError

    def dimensions(self) -> dict[str, float]:
        """The element's sizes, m, keyed as the JSON writes them."""
        return {f"{name}_m": value for name, value in self.sizes().items()}

    @property
    def longest_side(self) -> float:
        return max(aperture for _, aperture in self.planes)

    @property
    def area(self) -> float:
        """The face's area, m²."""
        raise NotImplementedError

    @property
    def plane_names(self) -> tuple[str, ...]:
        return tuple(name for name, _ in self.planes)

    def aperture(self, plane: str | None = None) -> float:
        """The aperture in ``plane`` (the first plane when None), m."""
        return dict(self.planes)[plane_name(self, plane)]

    def lateral_axis(self, plane: str | None = None) -> int:
        """0 where ``plane`` holds the x axis, 1 where it holds y."""
        return self.plane_names.index(plane_name(self, plane))

    def caption(self) -> str:
        """The element in a few words for a caption: "disc 12.7 mm"."""
        values = " x ".join(f"{v * 1e3:g}" for v in self.sizes().values())
        return f"{self.shape} {values} mm"

    @property
    def focus_description(self) -> str:
        """The focused element in words: "a spherically focused disc"."""
        raise InputError(f"element: a {self.shape} cannot be focused")

    # ---- the far field ---------------------------------------------------
    def level_x(self, level_db, mode: str = "pulse-echo"):
        """The pattern argument where the main lobe falls to ``level_db`` (:func:`pattern_x`)."""
        return pattern.pattern_x(level_db, self.pattern, mode)

    def directivity(self, theta, wavelength, mode: str = "one-way", plane: str | None = None):
        """The far-field amplitude pattern in ``plane`` at ``theta`` rad from the axis."""
        return pattern.directivity(theta, self.aperture(plane), wavelength, self.pattern, mode)

    def half_angle(self, level_db, wavelength, mode: str = "pulse-echo", plane=None):
        """Half-angles (rad) in ``plane`` where the main lobe falls to ``level_db`` dB down."""
        aperture = self.aperture(plane)
        return pattern.half_angle(level_db, aperture, wavelength, self.pattern, mode)

    def first_null(self, wavelength, plane: str | None = None):
        """The half-angle (rad) of the pattern's first zero in ``plane``; NaN past 90 degrees."""
        return pattern.first_null(self.aperture(plane), wavelength, self.pattern)

    # ---- the near field --------------------------------------------------
    def near_field(self, wavelength: float) -> NearField:
        """The last on-axis maximum and the simple estimate, with the method used."""
        raise NotImplementedError

    def _simple_near_field(self, wavelength: float) -> float:
        from .. import axis

        return float(axis.simple_near_field(self.longest_side, wavelength))

    # ---- the computed field ---------------------------------------------
    def lateral(self, x: np.ndarray, y: np.ndarray, quantum: float):
        """Distinct lateral positions up to the element's symmetry, and the map back.

        Returns ``(components, inverse)``: the coordinates the boundary table
        needs for each distinct position, and the index of each input point.
        """
        raise NotImplementedError

    def boundary_table(self, lateral, k_max: float, z_min: float):
        """The field engine's node table (q, W, used) for ``lateral`` (see ``field._boundary``)."""
        raise NotImplementedError

    def face_nodes(self, wavenumber: float, spread: float, count: Callable[[float], int]):
        """Quadrature nodes on the flat face and their area weights.

        ``count(phase)`` gives the node count across a half-size for a phase.
        Returns ``(u, v, weight, curved)``: positions along x and y, m, weights,
        m², and the squared distance the focus curves the face over, m².
        """
        raise NotImplementedError

    # ---- the focus -------------------------------------------------------
    @property
    def focused_half_aperture(self) -> float:
        """Half the aperture the focus curves (a disc's radius, a half-length), m."""
        if self.focused_plane is None:
            raise InputError(f"element: a {self.shape} cannot be focused")
        return 0.5 * self.aperture(self.focused_plane)

    def focused_pressures(self, focal_length, offsets, depths, wavenumbers, plane):
        """Paraxial |p| / (rho c U0) of the focused element, shape (depths, k, offsets)."""
        raise InputError(f"element: a {self.shape} cannot be focused")

    def focused_axis(self, focal_length: float, wavelength: float):
        """Depths (m) and the one-way paraxial on-axis amplitude of the focused element."""
        raise InputError(f"element: a {self.shape} cannot be focused")

    # ---- through a wedge -------------------------------------------------
    def seen_through_wedge(self, incident: float, refracted: float) -> WedgeView:
        """The element as the part sees it through a wedge (angles in rad)."""
        raise InputError(f"element: a {self.shape} cannot sit on a wedge")

    # ---- sonar figures ---------------------------------------------------
    def directivity_factor(self, wavelength: float) -> float:
        """The directivity factor Q (see :mod:`beamspread.sonar.directivity`)."""
        raise InputError(f"element: no directivity factor is modelled for a {self.shape}")

    def equivalent_beam_angle(self, wavelength: float) -> float:
        """The equivalent two-way beam angle, sr (see :mod:`beamspread.sonar.beam_angle`)."""
        raise InputError(f"element: no equivalent beam angle is modelled for a {self.shape}")
