"""The technique: everything that defines an inspection, in one object.

A :class:`Technique` holds the element (a disc or a rectangle; a focus is
the element's own), the part's medium, the coupling (contact, an angle-beam
wedge, or a water path), the part's thickness, and what is asked (depths,
levels, the mode and the pulse; for a bare transducer in water, the sonar
figures, the bottom and an echo budget). Values are SI (m, Hz, m/s, degC,
radians; levels in dB down, positive). :func:`beamspread.compute` runs it.

A technique is read from and written to a setup file (TOML, format 1; see
:mod:`beamspread.setupfile` for its sections and keys)::

    t = Technique.from_toml("weld.toml")
    t.to_toml()          # the text of the same setup file

Nothing here computes, prints or draws.
"""

from __future__ import annotations

import math
import os
from dataclasses import dataclass, field, replace

from .conventions import Coupling, Mode
from .errors import InputError
from .media.resolve import check_part_medium
from .probes import Disc, Rectangle, check_element, element_class
from .units import parse_level, parse_quantity

__all__ = [
    "Contact",
    "PartMedium",
    "Pulse",
    "Request",
    "Sonar",
    "Technique",
    "WaterCoupling",
    "WedgeCoupling",
]

DEFAULT_LEVELS = (6.0, 20.0)
DEFAULT_BANDWIDTH = 0.5


@dataclass(frozen=True)
class PartMedium:
    """The part's medium: a material by name (with its conditions) or a speed, and the wave.

    ``conditions`` are (name, value as written) pairs; the medium says what
    unit a bare value takes. ``wave`` None is longitudinal, shear on a wedge.
    """

    material: str | None = None
    speed: float | None = None  # m/s
    wave: str | None = None
    temperature: float | None = None  # degC
    conditions: tuple[tuple[str, str], ...] = ()

    def __post_init__(self) -> None:
        check_part_medium(self.material, self.speed, self.temperature, self.conditions)
        if self.wave is not None and self.wave not in ("longitudinal", "shear"):
            raise InputError(f"wave: {self.wave!r} is unknown; use longitudinal or shear")


@dataclass(frozen=True)
class Contact:
    """The element straight on the part (or, for a sonar, in the water)."""

    kind = Coupling.CONTACT


@dataclass(frozen=True)
class WedgeCoupling:
    """An angle-beam wedge: by material or speed, an incident or a refracted angle, its path.

    Angles in radians from the normal; ``refracted`` is the nominal angle of
    the part's wave (the incident angle is then solved); ``path`` is the mean
    sound path in the wedge along the beam axis, m (None: not given);
    ``temperature`` the wedge's, degC, where its material's speed depends on it.
    """

    material: str | None = None
    speed: float | None = None  # m/s, longitudinal
    incident: float | None = None  # rad
    refracted: float | None = None  # rad
    path: float | None = None  # m
    temperature: float | None = None  # degC

    kind = Coupling.WEDGE

    def __post_init__(self) -> None:
        if (self.material is None) == (self.speed is None):
            raise InputError("wedge: give either its material or its speed")
        if (self.incident is None) == (self.refracted is None):
            raise InputError("wedge: give either the incident or the refracted angle")
        for name in ("incident", "refracted"):
            angle = getattr(self, name)
            if angle is not None and not (math.isfinite(angle) and 0 <= angle < math.pi / 2):
                raise InputError(
                    f"wedge {name} angle: {math.degrees(angle):g} deg is not allowed; "
                    "give 0 up to (not at) 90 degrees"
                )


@dataclass(frozen=True)
class WaterCoupling:
    """A water path (or a delay line) at normal incidence, m, through a named couplant.

    ``temperature`` is the couplant's, degC (None: the couplant's default).
    """

    path: float
    couplant: str = "water"
    temperature: float | None = None  # degC

    kind = Coupling.IMMERSION


@dataclass(frozen=True)
class Pulse:
    """The pulse the computed field is formed with (see :class:`beamspread.FieldSettings`).

    ``bandwidth`` None takes the default: 0.5, or 0.1 with the sonar conventions.
    """

    bandwidth: float | None = None
    spectrum: str = "gaussian"
    frequencies: int = 32


@dataclass(frozen=True)
class Request:
    """What is asked: depths (m below the surface), levels (dB down), the mode and the pulse.

    ``levels`` empty takes the defaults (6 and 20 dB; 3 and 10 with the sonar
    conventions); ``mode`` None is pulse-echo (one-way with them); ``pulse``
    None asks for the far-field widths only.
    """

    depths: tuple[float, ...] = ()
    levels: tuple[float, ...] = ()
    mode: Mode | None = None
    pulse: Pulse | None = field(default_factory=Pulse)


@dataclass(frozen=True)
class Sonar:
    """A bare transducer in water or air: the sonar conventions, a flat bottom, an echo budget."""

    conventions: bool = False  # full angles, -3/-10 dB, one-way, directivity index...
    bottom_depths: tuple[float, ...] = ()  # m
    power: float | None = None  # W, electrical: an echo budget at each bottom depth
    efficiency: float = 0.5
    bottom_loss: float = 10.0  # dB

    @property
    def asked(self) -> bool:
        """Whether any sonar work is asked for."""
        return self.conventions or bool(self.bottom_depths) or self.power is not None


@dataclass(frozen=True)
class Technique:
    """An inspection technique: element, part, coupling and what is asked (SI units)."""

    element: Disc | Rectangle
    medium: PartMedium
    coupling: Contact | WedgeCoupling | WaterCoupling = field(default_factory=Contact)
    thickness: float | None = None  # m: the part's, for the second leg and the back wall
    request: Request = field(default_factory=Request)
    sonar: Sonar = field(default_factory=Sonar)
    title: str | None = None
    description: str | None = None

    def __post_init__(self) -> None:
        check_element(self.element, probe=True)
        if self.sonar.asked and (
            self.coupling.kind is not Coupling.CONTACT or self.element.focus is not None
        ):
            raise InputError(
                "sonar and a bottom describe a bare transducer in water, not a wedge, "
                "a water path or a focus"
            )

    @property
    def names_a_medium(self) -> bool:
        """Whether a material, wedge or couplant is named (and a registry must look it up)."""
        c = self.coupling
        wedge = isinstance(c, WedgeCoupling) and c.material is not None
        return self.medium.material is not None or wedge or isinstance(c, WaterCoupling)

    @property
    def mode(self) -> Mode:
        """The mode asked for, or the default: pulse-echo, one-way with the sonar conventions."""
        if self.request.mode is not None:
            return Mode(self.request.mode)
        return Mode.ONE_WAY if self.sonar.conventions else Mode.PULSE_ECHO

    @property
    def levels(self) -> tuple[float, ...]:
        """The levels asked for, or the defaults (dB down)."""
        if self.request.levels:
            return tuple(self.request.levels)
        if self.sonar.conventions:
            from .sonar.conventions import SONAR_LEVELS_SHOWN

            return SONAR_LEVELS_SHOWN
        return DEFAULT_LEVELS

    @property
    def bandwidth(self) -> float:
        """The pulse's bandwidth asked for, or the default (0.5; 0.1 with the sonar conventions)."""
        pulse = self.request.pulse or Pulse()
        if pulse.bandwidth is not None:
            return pulse.bandwidth
        if self.sonar.conventions:
            from .sonar.conventions import SONAR_BANDWIDTH

            return SONAR_BANDWIDTH
        return DEFAULT_BANDWIDTH

    def with_request(self, **changes) -> Technique:
        """The same technique asking something else (depths, levels, mode, pulse)."""
        return replace(self, request=replace(self.request, **changes))

    # ------------------------------------------------------------- setup files

    @classmethod
    def from_setup(cls, setup) -> Technique:
        """The technique a :class:`beamspread.setupfile.Setup` records (its strings read in SI)."""
        return _from_setup(setup)

    def to_setup(self):
        """The :class:`beamspread.setupfile.Setup` that records this technique."""
        from .setupfile import Setup

        return Setup.from_options(self.to_options(), title=self.title, description=self.description)

    @classmethod
    def from_toml(cls, path: str | os.PathLike) -> Technique:
        """Read a setup file (format 1); InputError naming the file, key and line if it is wrong."""
        from .setupfile import load_setup

        return cls.from_setup(load_setup(path))

    def to_toml(self) -> str:
        """The text of the setup file that records this technique (format 1)."""
        from .setupfile import dumps_setup

        return dumps_setup(self.to_setup())

    def to_options(self) -> dict[str, object]:
        """The technique as the setup file's option names -> SI values (None left out)."""
        e, m, c, r, s = self.element, self.medium, self.coupling, self.request, self.sonar
        out: dict[str, object] = {"--frequency": e.frequency, "--focus": e.focus}
        out.update({f"--{name}": size for name, size in e.sizes().items()})
        out.update(
            {
                "--material": m.material,
                "--speed": m.speed,
                "--wave": m.wave,
                "--temperature": m.temperature
                if m.temperature is not None
                else getattr(c, "temperature", None),
                "--condition": [f"{n}={v}" for n, v in m.conditions],
                "--thickness": self.thickness,
                "--depth": list(r.depths),
                "--level": [f"{lv:g}" for lv in r.levels],
            }
        )
        if isinstance(c, WedgeCoupling):
            out.update(
                {
                    "--wedge": c.material,
                    "--wedge-speed": c.speed,
                    "--incident": None if c.incident is None else math.degrees(c.incident),
                    "--refracted": None if c.refracted is None else math.degrees(c.refracted),
                    "--wedge-path": c.path,
                }
            )
        elif isinstance(c, WaterCoupling):
            out.update({"--water-path": c.path, "--couplant": c.couplant})
        if s.asked:
            out.update({"--sonar": s.conventions, "--bottom-depth": list(s.bottom_depths)})
            if s.power is not None:
                out.update(
                    {
                        "--power": s.power,
                        "--efficiency": s.efficiency,
                        "--bottom-loss": s.bottom_loss,
                    }
                )
        out["--pulse-echo" if self.mode is Mode.PULSE_ECHO else "--one-way"] = True
        pulse = r.pulse or Pulse()
        out.update(
            {
                "--bandwidth": self.bandwidth,
                "--spectrum": pulse.spectrum,
                "--frequencies": pulse.frequencies,
            }
        )
        return {k: v for k, v in out.items() if v is not None and v != [] and v is not False}


def _expand(texts, default_unit: str) -> tuple[float, ...]:
    """Depths as a setup file writes them (a depth, or START:STOP:STEP), m, each once."""
    from .sonar.footprint import depth_range

    out: list[float] = []
    for text in texts:
        parts = [parse_quantity(p, "length", default=default_unit) for p in str(text).split(":")]
        out.extend(depth_range(*parts) if len(parts) == 3 else parts)
    return tuple(dict.fromkeys(out))


def _from_setup(setup) -> Technique:
    def q(text, kind):
        return None if text is None else parse_quantity(text, kind)

    def angle(text):
        return None if text is None else math.radians(parse_quantity(text, "angle"))

    frequency, focus = q(setup.frequency, "frequency"), q(setup.focus, "length")
    kind = element_class(setup.shape)
    sizes = {name: q(getattr(setup, name), "length") for name in kind.size_names}
    element = kind(**sizes, frequency=frequency, focus=focus)
    medium = PartMedium(
        material=setup.material,
        speed=q(setup.speed, "speed"),
        wave=setup.wave,
        temperature=q(setup.temperature, "temperature"),
        conditions=tuple(setup.conditions),
    )
    coupling: Contact | WedgeCoupling | WaterCoupling = Contact()
    if setup.wedge is not None or setup.wedge_speed is not None:
        coupling = WedgeCoupling(
            setup.wedge,
            q(setup.wedge_speed, "speed"),
            angle(setup.incident),
            angle(setup.refracted),
            q(setup.wedge_path, "length"),
            medium.temperature,
        )
    elif setup.water_path is not None:
        coupling = WaterCoupling(
            q(setup.water_path, "length"), setup.couplant or "water", medium.temperature
        )
    pulse = Pulse(
        setup.bandwidth,
        setup.spectrum or "gaussian",
        setup.frequencies if setup.frequencies is not None else 32,
    )
    request = Request(
        depths=_expand(setup.depths, "mm"),
        levels=tuple(dict.fromkeys(parse_level(v) for v in setup.levels)),
        mode=None if setup.mode is None else Mode(setup.mode),
        pulse=pulse,
    )
    sonar = Sonar()
    if setup.sonar or setup.bottom_depths or setup.power is not None:
        sonar = Sonar(
            conventions=bool(setup.sonar),
            bottom_depths=tuple(sorted(_expand(setup.bottom_depths, "m"))),
            power=q(setup.power, "power"),
            efficiency=0.5 if setup.efficiency is None else setup.efficiency,
            bottom_loss=10.0 if setup.bottom_loss is None else q(setup.bottom_loss, "decibel"),
        )
    return Technique(
        element,
        medium,
        coupling,
        q(setup.thickness, "length"),
        request,
        sonar,
        setup.title,
        setup.description,
    )
