"""One pipeline: a technique in, its beam in the part out.

:func:`compute` resolves the part's medium, brings the beam in through the
coupling (contact, wedge, water path; a focus is the element's), runs one
analysis and returns a :class:`Result`: plain data that every command, the
report page and the Python API render. ``compute(t).to_dict()`` is exactly
the object ``beamspread beam --json`` prints for the same technique.
"""

from __future__ import annotations

from dataclasses import dataclass, replace
from typing import Any

from .beam import Asked, FieldSettings, analyse
from .conventions import Coupling, Mode
from .errors import InputError
from .media.resolve import Resolved, named_wave, resolve_part
from .source import FieldSource
from .technique import Technique, WaterCoupling

__all__ = ["CouplantUsed", "Result", "WedgeUsed", "compute"]


@dataclass(frozen=True)
class WedgeUsed:
    """The wedge as computed: its name ("given" for a speed), longitudinal speed and path."""

    name: str
    speed: float  # m/s
    path: float  # m (0 where none was given)


@dataclass(frozen=True)
class CouplantUsed:
    """The couplant as computed: its wave (speed, density, conditions) and the water path.

    A focused element in contact radiates straight into the part: its couplant
    is the part's own wave, at a path of 0.
    """

    wave: Any  # beamspread.media.Wave
    path: float  # m


@dataclass(frozen=True)
class Result:
    """What :func:`compute` found for a technique, in SI units, with its conventions.

    ``beam`` holds the near field, half-angles and widths in the part;
    ``setup`` what a wedge or a water path adds (refraction, the virtual
    element, footprints, transmission, the focus); ``sonar`` the sonar figures
    of a bare transducer; ``source`` the element whose computed field is the
    beam (see :class:`beamspread.source.FieldSource`); ``warnings`` every
    caveat, in order, each once.
    """

    technique: Technique
    coupling: Coupling
    mode: Mode
    settings: FieldSettings | None  # None: far-field widths only
    beam: Any  # beamspread.BeamResult
    part: Resolved
    speeds: tuple[float | None, float | None]  # the part's longitudinal and shear speeds
    source: FieldSource
    setup: Any = None  # beamspread.SetupResult for a wedge, a water path or a focus
    wedge: WedgeUsed | None = None
    couplant: CouplantUsed | None = None
    sonar: Any = None  # beamspread.sonar.results.SonarResults for a bare transducer
    warnings: tuple[str, ...] = ()

    @property
    def focused(self) -> bool:
        return self.technique.element.focus is not None

    def to_dict(self) -> dict[str, Any]:
        """The JSON object of ``beamspread beam --json`` for this technique."""
        from .render.serialize.result import result_to_dict

        return result_to_dict(self)


def compute(technique: Technique, *, registry=None) -> Result:
    """Run a technique through the pipeline: resolve, couple, analyse.

    Parameters
    ----------
    technique : Technique
    registry : beamspread.Registry, optional
        Where material names are looked up (default: :func:`beamspread.build_registry`).

    Returns
    -------
    Result

    Raises
    ------
    InputError
        Anything the technique asks that cannot be modelled (angles past
        critical, a depth below the part, a focus behind the element...).
    MaterialError
        A material, wedge or couplant name that no table holds.

    Examples
    --------
    >>> import beamspread as bs
    >>> t = bs.Technique(bs.Disc(0.010, 5e6), bs.PartMedium(speed=5920.0))
    >>> round(bs.compute(t).beam.near_field * 1e3, 2)
    20.82
    """
    t = technique
    coupling = t.coupling.kind
    if registry is None and t.names_a_medium:
        from .media.registry import build_registry

        registry = build_registry(())
    on_wedge = coupling is Coupling.WEDGE
    elsewhere = on_wedge or isinstance(t.coupling, WaterCoupling)
    part = resolve_part(
        registry,
        t.medium.material,
        t.medium.wave or ("shear" if on_wedge else None),
        t.medium.speed,
        t.medium.temperature,
        t.medium.conditions,
        temperature_elsewhere=elsewhere,
    )
    mode = t.mode
    settings = None
    if t.request.pulse is not None:
        from .field.spectrum import check_bandwidth

        pulse = t.request.pulse
        settings = FieldSettings(check_bandwidth(t.bandwidth), pulse.spectrum, pulse.frequencies)
    common = {"part": part, "mode": mode, "settings": settings, "technique": t}
    if on_wedge:
        return _wedge(registry, **common)
    if isinstance(t.coupling, WaterCoupling) or t.element.focus is not None:
        return _immersion(registry, **common)
    return _contact(**common)


def _flat(element):
    return replace(element, focus=None)


def _registry_warnings(part: Resolved, registry) -> list[str]:
    return list((part.registry or registry).warnings) if (part.registry or registry) else []


def _contact(*, technique, part, mode, settings) -> Result:
    from .sonar.results import sonar_results

    t = technique
    beam = analyse(
        t.element, part.wave, depths=t.request.depths, mode=mode, field=settings, levels=t.levels
    )
    warnings = [*(part.registry.warnings if part.registry else []), *beam.warnings]
    if t.sonar.conventions and t.element.frequency > 5e6:
        warnings.append(
            f"the sonar conventions at {t.element.frequency / 1e6:g} MHz: sonar and "
            "rangefinder transducers work below a few MHz"
        )
    sonar = sonar_results(
        beam,
        part,
        list(t.sonar.bottom_depths),
        sonar=t.sonar.conventions,
        power=t.sonar.power,
        efficiency=t.sonar.efficiency,
        bottom_loss=t.sonar.bottom_loss,
        warnings=warnings,
    )
    names = tuple((name, name) for name, _ in t.element.planes)
    source = FieldSource(t.element, part.wave.speed, plane_names=names)
    return Result(
        t,
        Coupling.CONTACT,
        mode,
        settings,
        beam,
        part,
        part.speeds(),
        source,
        sonar=sonar,
        warnings=tuple(warnings),
    )


def _wedge(registry, *, technique, part, mode, settings) -> Result:
    from .coupling.wedge import Wedge, analyse_wedge

    t, w = technique, technique.coupling
    warnings = _registry_warnings(part, registry)
    if w.material is not None:
        wave = named_wave(registry, w.material, w.temperature)
        warnings.extend(wave.warnings)
        speed, name = wave.speed, wave.medium
    else:
        speed, name = w.speed, "given"
    if w.path is None:
        warnings.append(
            "no wedge path given: the near field in the part is not shortened by the wedge, "
            "and the far-field cone starts at the exit point"
        )
    c_long, c_shear = part.speeds()
    setup = analyse_wedge(
        t.element,
        part.wave,
        c_long,
        c_shear,
        Wedge(speed, w.path or 0.0, w.incident, w.refracted, name),
        Asked(t.request.depths, t.levels, mode, settings),
        thickness=t.thickness,
    )
    warnings = list(dict.fromkeys([*warnings, *setup.warnings]))
    names = tuple(
        (plane.name, vname)
        for plane, (vname, _) in zip(setup.beam.planes, setup.virtual.planes, strict=True)
    )
    source = FieldSource(
        setup.virtual,
        part.wave.speed,
        start=setup.offset,
        refracted=setup.refraction.refracted(part.wave.wave),
        coordinate="sound path",
        plane_names=names,
    )
    return Result(
        t,
        Coupling.WEDGE,
        mode,
        settings,
        replace(setup.beam, coupling=Coupling.WEDGE),
        part,
        (c_long, c_shear),
        source,
        setup=setup,
        wedge=WedgeUsed(name, speed, w.path or 0.0),
        warnings=tuple(warnings),
    )


def _immersion(registry, *, technique, part, mode, settings) -> Result:
    from .coupling.immersion import Focus, WaterPath, analyse_immersion

    t = technique
    element = t.element
    water_path = t.coupling.path if isinstance(t.coupling, WaterCoupling) else None
    if element.focus is not None and settings is None and t.request.depths:
        raise InputError(
            "a focused probe has no far-field width (the flat element's cone does not "
            "converge): ask for the computed field to get its widths at depth"
        )
    warnings = _registry_warnings(part, registry)
    if water_path is None:  # a focus straight in the part
        couplant = part.wave
    else:
        couplant = named_wave(registry, t.coupling.couplant, t.coupling.temperature)
        warnings.extend(couplant.warnings)
    water = WaterPath(couplant.speed, water_path or 0.0, couplant.density, couplant.medium)
    setup = analyse_immersion(
        _flat(element),
        part.wave,
        water,
        Asked(t.request.depths, t.levels, mode, settings),
        focus=None if element.focus is None else Focus(element.focus),
    )
    warnings = list(dict.fromkeys([*warnings, *setup.warnings]))
    names = tuple((name, name) for name, _ in element.planes)
    source = FieldSource(
        _flat(element),
        couplant.speed,
        start=water.path,
        stretch=part.wave.speed / couplant.speed,
        focus=element.focus,
        plane_names=names,
    )
    coupling = Coupling.IMMERSION if water_path is not None else Coupling.CONTACT
    return Result(
        t,
        coupling,
        mode,
        settings,
        replace(setup.beam, coupling=coupling, focus=element.focus),
        part,
        part.speeds(),
        source,
        setup=setup,
        couplant=CouplantUsed(couplant, water.path),
        warnings=tuple(warnings),
    )
