"""``beamspread report``: a one-page report of a setup file (PDF or PNG)."""

from __future__ import annotations

from pathlib import Path

import click


@click.command()
@click.argument("setup_file", type=click.Path(dir_okay=False))
@click.option(
    "--output",
    "-o",
    type=click.Path(dir_okay=False),
    required=True,
    help="The report: .pdf (a page) or .png (the page as a picture).",
)
@click.option("--force", is_flag=True, help="Overwrite an existing --output file.")
@click.option("--units", type=click.Choice(["mm", "in"]), default="mm", show_default=True)
def report(setup_file, output, force, units):
    """A one-page report of the technique in SETUP_FILE: inputs, conventions, the results
    table, the beam map (and the section for an angle beam) and the cautions.

    A sonar setup's page carries what beam prints for it (full angles, the
    directivity index, absorption, footprints and the echo budget); with bottom
    depths its picture is the footprint against water depth."""
    from ..render import plots
    from ..render.page import report_page
    from ..setupfile import load_setup
    from .beam import beam as beam_command
    from .beam import caption_of

    target = Path(output)
    if target.suffix.lower() not in (".pdf", ".png"):
        raise click.BadParameter(f"{output!r}: a report is .pdf or .png", param_hint="--output")
    plots.check_target(target)
    if target.exists() and not force:
        raise click.BadParameter(
            f"{output!r} exists; add --force to overwrite it", param_hint="--output"
        )
    setup = load_setup(setup_file)
    with beam_command.make_context("beam", setup.to_args()) as ctx:
        params = dict(ctx.params)
        params["given"] = {
            name
            for name in params
            if ctx.get_parameter_source(name) is not click.core.ParameterSource.DEFAULT
        }
    text, result, view, geometry, warnings = _compute(params, units)
    fig = report_page(
        setup,
        text,
        result,
        view,
        geometry,
        units,
        warnings,
        caption=caption_of(result),
        name=setup_file,
    )
    plots.save_figure(fig, target)
    click.echo(f"beamspread: wrote {target}", err=True)


def _compute(p, units):
    """The analysis a setup stands for: the text, the result, and what the map needs."""
    from ..beam import DEFAULT_LEVELS, analyse
    from ..report.text import beam_table, setup_lines
    from ..sonar import SONAR_BANDWIDTH, SONAR_LEVELS_SHOWN, SONAR_MODE
    from .options import field_settings, make_probe, resolve_wave

    probe = make_probe(p["diameter"], p["length"], p["width"], p["frequency"])
    p = {**p, "depths": [d for group in p["depth_groups"] for d in group]}
    if p["sonar"] and "bandwidth" not in p["given"]:
        p["bandwidth"] = SONAR_BANDWIDTH  # as beam --sonar: a narrow-band pulse
    settings = field_settings(p["bandwidth"], p["spectrum"], p["frequency_count"])
    on_wedge = p["wedge"] is not None or p["wedge_speed"] is not None
    resolved = resolve_wave(
        p["material"],
        p["wave"] or ("shear" if on_wedge else None),
        p["speed"],
        p["temperature"],
        p["conditions"],
        p["materials_dirs"],
    )
    if p["pulse_echo"] is None:
        mode = SONAR_MODE if p["sonar"] else "pulse-echo"
    else:
        mode = "pulse-echo" if p["pulse_echo"] else "one-way"
    levels = p["levels"] or (SONAR_LEVELS_SHOWN if p.get("sonar") else DEFAULT_LEVELS)
    geometry = None
    warnings = list(resolved.warnings)
    if on_wedge or p["water_path"] is not None or p["focus"] is not None:
        from ..inspection import Focus, WaterPath, Wedge, analyse_immersion, analyse_wedge
        from .section import section_geometry
        from .setup import _named_speed, _part_speeds, load_registry

        registry = resolved.registry or load_registry(p["materials_dirs"])
        c_long, c_shear = _part_speeds(resolved)
        if on_wedge:
            if p["wedge"] is not None:
                w = _named_speed(registry, p["wedge"], p["temperature"])
                speed, name = w.speed, w.medium
            else:
                speed, name = p["wedge_speed"], "given"
            setup = analyse_wedge(
                probe,
                resolved.wave,
                c_long,
                c_shear,
                Wedge(speed, p["wedge_path"] or 0.0, p["incident"], p["refracted"], name),
                thickness=p["thickness"],
                depths=p["depths"],
                levels=levels,
                mode=mode,
                field=settings,
            )
            extra = {"wedge": {"name": name, "speed_m_s": speed, "path_m": p["wedge_path"] or 0.0}}
            if p["thickness"] is not None:
                depth = p["depths"][0] if p["depths"] else None
                geometry = section_geometry(setup, p["thickness"], depth, settings, None)
            # The virtual element in the part, set back behind the exit point by the wedge
            # path's equivalent: the map's ranges are that offset plus the sound path.
            view = {
                "probe": setup.virtual,
                "speed": resolved.wave.speed,
                "start": setup.offset,
                "stretch": 1.0,
                "axis": "sound path in the part",
                "source": "sound path from the exit point"
                + (
                    f"; the virtual element sits {_mm(setup.offset, units)} behind it"
                    if setup.offset > 0
                    else ""
                ),
            }
        else:
            couplant = _named_speed(registry, p["couplant"], p["temperature"])
            water = WaterPath(
                couplant.speed, p["water_path"] or 0.0, couplant.density, couplant.medium
            )
            setup = analyse_immersion(
                probe,
                resolved.wave,
                water,
                focus=None if p["focus"] is None else Focus(p["focus"]),
                depths=p["depths"],
                levels=levels,
                mode=mode,
                field=settings,
            )
            extra = {
                "couplant": {"name": water.name, "speed_m_s": water.speed, "path_m": water.path}
            }
            # As the table's computed widths: the element in water at the water-equivalent
            # range, water path + depth c_part / c_water (paraxial), drawn at the depth.
            view = {
                "probe": probe,
                "speed": water.speed,
                "start": water.path,
                "stretch": resolved.wave.speed / water.speed,
                "axis": "depth in the part",
                "source": f"the element in {water.name} at range water path "
                f"{_mm(water.path, units)} + depth x c_part / c_water",
            }
            if setup.focus is not None:  # the focused element's paraxial field, as the table's
                view["source"] = view["source"].replace("the element", "the focused element")
                view["focus"] = p["focus"]
        result = setup.beam
        lines = beam_table(result, units).split("\n")
        head = 3 if lines[2].startswith(" ") else 2
        text = "\n".join(lines[:head] + setup_lines(setup, extra, units) + lines[head:])
        warnings.extend(setup.warnings)
    else:
        from .sonarargs import bottom_list, sonar_results

        result = analyse(
            probe, resolved.wave, levels=levels, depths=p["depths"], mode=mode, field=settings
        )
        warnings.extend(result.warnings)
        sonar = sonar_results(
            result,
            resolved,
            bottom_list(p["bottom_depths"]),
            sonar=p["sonar"],
            power=p["power"],
            efficiency=p["efficiency"],
            bottom_loss=p["bottom_loss"],
            warnings=warnings,
        )
        text = beam_table(result, units, **sonar.table_options(p["sonar"]))
        view = {
            "probe": probe,
            "speed": resolved.wave.speed,
            "start": 0.0,
            "stretch": 1.0,
            "axis": "depth from the probe face",
            "source": "",
        }
        if sonar.figures is not None and sonar.figures.footprints:
            # The question is the bottom: the footprint against water depth, as beam --plot.
            view["footprint"] = sonar.footprint_widths(result)
        view["budgets"] = sonar.budgets
    # The marks: each depth of the table; for an angle beam at its sound path on each leg.
    marks = {}
    for pl in result.planes:
        for s in pl.spots:
            if view["axis"].startswith("sound path"):
                name = f"path {_mm(s.sound_path, units)}: {_mm(s.depth, units)} deep, leg {s.leg}"
                marks.setdefault(s.sound_path, name)
            else:
                marks.setdefault(s.depth, _mm(s.depth, units))
    view["marks"] = sorted(marks)
    view["labels"] = [marks[m] for m in view["marks"]]
    view["near"] = result.near_field
    view["pulse_maximum"] = result.field.axial_maximum if result.field else None
    view["pulse_label"] = "last on-axis maximum of the pulse"
    if view.get("focus") is not None:  # the flat element's near field is not this beam's
        view["near"] = None
        view["pulse_maximum"] = setup.focus.focal_depth_in_part
        view["pulse_label"] = "focal depth in the part (paraxial)"
    return text, result, view, geometry, list(dict.fromkeys(warnings))


def _mm(metres, units):
    from ..units import format_length

    return format_length(metres, units)
