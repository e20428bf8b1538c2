"""The inspection-setup branch of ``beamspread beam``: wedge, water path, focus."""

from __future__ import annotations

import click

from ..errors import BeamspreadError
from .options import emit_warnings, load_registry


def _named_speed(registry, name, temperature):
    """The longitudinal wave of a named wedge or couplant (at --temperature where it varies)."""
    medium = registry.get(name).medium
    conditions = {}
    if temperature is not None and (
        medium.parameter("temperature") is not None
        or getattr(medium, "depends_on_temperature", False)
    ):
        conditions["temperature"] = temperature
    return medium.evaluate("longitudinal", conditions)


def _part_speeds(resolved):
    """Both speeds of the part: from the material, or the one --speed gives."""
    wave = resolved.wave
    if resolved.medium is None:
        return (wave.speed, None) if wave.wave == "longitudinal" else (None, wave.speed)
    speeds = []
    for mode in ("longitudinal", "shear"):
        if mode == wave.wave:  # already evaluated
            speeds.append(wave.speed)
            continue
        try:
            speeds.append(resolved.medium.evaluate(mode, resolved.conditions).speed)
        except BeamspreadError:  # a liquid, or a table without that wave
            speeds.append(None)
    return tuple(speeds)


def run_setup(
    probe,
    resolved,
    settings,
    depths,
    levels,
    pulse_echo,
    fmt,
    units,
    *,
    plot_path,
    wedge,
    wedge_speed,
    incident,
    refracted,
    wedge_path,
    thickness,
    water_path,
    couplant,
    focus,
    temperature,
    materials_dirs,
):
    from ..beam import DEFAULT_LEVELS
    from ..inspection import Focus, WaterPath, Wedge, analyse_immersion, analyse_wedge

    mode = "one-way" if pulse_echo is False else "pulse-echo"
    levels = levels or DEFAULT_LEVELS
    registry = resolved.registry or load_registry(materials_dirs)
    warnings = list(registry.warnings)
    c_long, c_shear = _part_speeds(resolved)
    if wedge is not None or wedge_speed is not None:
        if wedge is not None and wedge_speed is not None:
            raise click.UsageError("give --wedge NAME or --wedge-speed SPEED, not both")
        if incident is not None and refracted is not None:
            raise click.UsageError(
                "give the wedge's --incident angle or the --refracted angle in the part, not both"
            )
        if incident is None and refracted is None:
            raise click.UsageError(
                "give the wedge's --incident angle or the --refracted angle in the part"
            )
        if wedge is not None:
            wave = _named_speed(registry, wedge, temperature)
            warnings.extend(wave.warnings)
            speed, name = wave.speed, wave.medium
        else:
            speed, name = wedge_speed, "given"
        if wedge_path is None:
            warnings.append(
                "no --wedge-path: the near field in the part is not shortened by the wedge, "
                "and the far-field cone starts at the exit point"
            )
        result = analyse_wedge(
            probe,
            resolved.wave,
            c_long,
            c_shear,
            Wedge(speed, wedge_path or 0.0, incident, refracted, name),
            thickness=thickness,
            depths=depths,
            levels=levels,
            mode=mode,
            field=settings,
        )
        extra = {"wedge": {"name": name, "speed_m_s": speed, "path_m": wedge_path or 0.0}}
    else:
        if focus is not None and settings is None and depths:
            raise click.UsageError(
                "--far-field-only: a focused probe has no far-field width (the flat "
                "element's cone does not converge); drop it to get the computed widths at --depth"
            )
        couplant_wave = (
            resolved.wave
            if water_path is None and focus is not None
            else _named_speed(registry, couplant, temperature)
        )
        warnings.extend(couplant_wave.warnings if couplant_wave is not resolved.wave else [])
        water = WaterPath(
            couplant_wave.speed, water_path or 0.0, couplant_wave.density, couplant_wave.medium
        )
        result = analyse_immersion(
            probe,
            resolved.wave,
            water,
            focus=None if focus is None else Focus(focus),
            depths=depths,
            levels=levels,
            mode=mode,
            field=settings,
        )
        from ..render.serialize.common import conditions_to_dict
        from ..render.text.common import conditions_text

        extra = {
            "couplant": {
                "name": water.name,
                "speed_m_s": water.speed,
                "path_m": water.path,
                "conditions": conditions_to_dict(couplant_wave),
            }
        }
        couplant_at = conditions_text(couplant_wave)
    warnings.extend(result.warnings)
    warnings = list(dict.fromkeys(warnings))
    if plot_path is not None and result.focus is not None and result.refraction is None:
        warnings.append(
            "--plot draws the flat element's far-field directivity: the focus is not in it"
        )
    if plot_path is not None:
        _plot(plot_path, result, settings, thickness, depths, units)
    emit_warnings(warnings)
    if fmt == "json":
        from ..render.serialize.beam import beam_to_dict
        from ..render.serialize.common import dumps
        from ..render.serialize.setup import setup_to_dict

        data = beam_to_dict(result.beam)
        data["medium"]["longitudinal_m_s"] = c_long
        data["medium"]["shear_m_s"] = c_shear
        data.update(setup_to_dict(result))
        data.update(extra)
        data["warnings"] = warnings
        click.echo(dumps(data))
    elif fmt == "csv":
        from ..render.serialize.beam import beam_to_csv

        click.echo(beam_to_csv(result.beam), nl=False)
    else:
        from ..render.text.beam import beam_table
        from ..render.text.setup import setup_lines

        table = beam_table(result.beam, units).split("\n")
        head = 3 if table[2].startswith(" ") else 2  # after the probe and medium lines
        shown = extra
        if "couplant" in extra:
            shown = {"couplant": {**extra["couplant"], "at": couplant_at}}
        click.echo("\n".join(table[:head] + setup_lines(result, shown, units) + table[head:]))


def _plot(path, result, settings, thickness, depths, units):
    """A wedge with a thickness: the section; otherwise the directivity in the part."""
    from ..report import plots
    from .beam import caption_of

    if result.refraction is not None and thickness is not None:
        from .section import section_geometry

        geometry = section_geometry(
            result, thickness, depths[0] if depths else None, settings, None
        )
        plots.plot_section(geometry, path, caption=caption_of(result.beam), units=units)
    else:
        beam = result.beam
        probe = result.virtual or beam.probe
        shape = "disc" if probe.shape in ("disc", "ellipse") else "rectangle"
        planes = {pl.name: pl.aperture for pl in beam.planes}
        plots.plot_directivity(
            planes, beam.wavelength, shape, path, levels_db=beam.levels, caption=caption_of(beam)
        )
    click.echo(f"beamspread: drew {path}", err=True)
