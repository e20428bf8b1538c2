"""``beamspread report``: a one-page report of a setup file (PDF or PNG)."""

from __future__ import annotations

from dataclasses import replace
from pathlib import Path

import click

A4 = (8.27, 11.69)  # inches, portrait
MAP_HEIGHT = 2.2  # inches: the least the map keeps beside a section


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
    table, the beam map (and the section for an angle beam) and the cautions."""
    from ..report import plots
    from ..setupfile import load_setup
    from .beam import beam as beam_command

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
    text, result, view, geometry, warnings = _compute(params, units)
    fig = _page(setup, text, result, view, geometry, units, warnings)
    plots.save_figure(fig, target)
    click.echo(f"beamspread: wrote {target}", err=True)


def _compute(p, units):
    """The analysis a setup stands for: the text, the result, and what the map needs."""
    from ..beam import DEFAULT_LEVELS, analyse
    from ..report.text import beam_table, setup_lines
    from ..sonar import SONAR_LEVELS_SHOWN
    from .options import field_settings, make_probe, resolve_wave

    probe = make_probe(p["diameter"], p["length"], p["width"], p["frequency"])
    p = {**p, "depths": [d for group in p["depth_groups"] for d in group]}
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
    mode = "one-way" if p["pulse_echo"] is False else "pulse-echo"
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
        result = analyse(
            probe, resolved.wave, levels=levels, depths=p["depths"], mode=mode, field=settings
        )
        text = beam_table(result, units)
        warnings.extend(result.warnings)
        view = {
            "probe": probe,
            "speed": resolved.wave.speed,
            "start": 0.0,
            "stretch": 1.0,
            "axis": "depth from the probe face",
            "source": "",
        }
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


def _page(setup, text, result, view, geometry, units, warnings):
    """The page: the text at the top, then the map, the section (angle beam), the cautions.

    The text is set first and measured; the rest is laid out (constrained) in
    the space left below it, each picture with its legend in a strip of its
    own beneath, the strips and the section sized to what they hold.
    """
    import numpy as np

    from ..field import field_map
    from ..report import plots
    from ..report.text import CAUTION
    from .beam import caption_of

    fig = plots.new_figure(A4, caption=caption_of(result))
    width, height = A4
    margin = 0.45 / width
    fig.text(
        margin, 1.0 - 0.3 / height, setup.title or "beamspread: beam report", fontsize=12, va="top"
    )
    # The table's closing caution (an inspection's or, in water or air, the underwater one)
    # goes to the foot of the page, whole; the rest is the body.
    lines = text.split("\n")
    end = next((i for i, line in enumerate(lines) if line.startswith("Estimates from")), None)
    body = lines if end is None else lines[:end]
    caution = " ".join(lines[end:]) if end is not None else CAUTION
    if caution.startswith(CAUTION[:60]) and "high voltage" not in caution:
        caution += " Pulsers carry high voltage."
    notes = [f"note: {w}" for w in warnings[:4]]
    block = fig.text(
        margin,
        1.0 - 0.62 / height,
        "\n".join(body + notes),
        family="monospace",
        fontsize=5.2,
        va="top",
        ha="left",
    )
    fig.draw_without_rendering()
    below_text = block.get_window_extent().y0 / (height * fig.dpi) - 0.06 / height
    bottom = fig.get_layout_engine().get()["rect"][1]
    fig.get_layout_engine().set(rect=(0.0, bottom, 1.0, below_text - bottom))

    # Rows: the map and its legend, the section and its legend, the cautions.
    parts = ["map", "map legend"] + (["section", "section legend"] if geometry else []) + ["foot"]
    grid = fig.add_gridspec(len(parts), 1, height_ratios=[1.0] * len(parts))
    axes = {name: fig.add_subplot(grid[i]) for i, name in enumerate(parts)}
    for name in parts:
        if name != "map" and name != "section":
            axes[name].axis("off")

    probe, speed = view["probe"], view["speed"]
    wavelength = speed / probe.frequency
    longest = max(a for _, a in probe.planes)
    near = view["near"] or longest**2 / (4 * wavelength * view["stretch"])
    deepest = max([*view["marks"], 2.5 * near])
    first = 0.0 if view["start"] > 0 else 0.1 * near
    depth = np.linspace(first, 1.2 * deepest, 160)
    ranges = view["start"] + view["stretch"] * depth  # from the element the map is drawn of
    aperture = probe.planes[0][1]
    half = max(aperture, 4 * wavelength * ranges[-1] / aperture)
    settings = result.field.settings if result.field else None
    kwargs = {
        "plane": probe.planes[0][0],
        "bandwidth": settings.bandwidth if settings else 0.0,
        "mode": result.convention.mode,
        "frequencies": settings.frequencies if settings else 32,
        "spectrum": settings.spectrum if settings else "gaussian",
    }
    lateral = np.linspace(-half, half, 96)
    if view.get("focus") is not None:
        from ..field import FieldMap, focused_amplitude

        amplitude = focused_amplitude(probe, speed, view["focus"], lateral, ranges, **kwargs)
        fm = FieldMap(
            kwargs["plane"], lateral, ranges, amplitude, kwargs["mode"], kwargs["bandwidth"]
        )
    else:
        fm = field_map(probe, speed, lateral, ranges, **kwargs)
    fm = replace(fm, depth=depth)  # drawn against the depth (or sound path) in the part
    plane = result.planes[0].name
    ax = axes["map"]
    drawn = plots.draw_map(
        ax,
        fm,
        levels_db=result.levels,
        near_field=view["near"],
        axial_maximum=view["pulse_maximum"],
        axial_label=view["pulse_label"],
        depths=view["marks"],
        depth_labels=view["labels"],
        depth_legend="the table's depths" + (" (sound path, both legs)" if geometry else ""),
        near_label="near field in the part" if view["source"] else "near field",
        plane=plane,
        units=units,
        legend=False,
    )
    ax.set_ylabel(f"{view['axis']}, {units}", fontsize=8)
    drawn.colorbar.set_label("dB re the map's maximum", fontsize=8)  # the mode is in the title
    where = " in the part" if view["source"] else ""
    source = _wrap(f"({view['source']})", 100) if view["source"] else []
    ax.set_title(
        "\n".join([f"Computed beam, {plane} plane, {result.convention.mode}{where}", *source]),
        fontsize=9,
    )
    strips = {"map legend": drawn.handles}
    if geometry is not None:
        strips["section legend"] = plots.draw_section(axes["section"], geometry, units=units)
    foot = axes["foot"].text(
        0.0, 0.5, "\n".join(_wrap(caution, 150)), fontsize=6.5, va="center", ha="left", color="0.15"
    )
    foot.set_in_layout(False)  # its row is sized to it; its width is the page's
    legends = []
    for name, handles in strips.items():
        legend = axes[name].legend(
            handles=handles,
            loc="center",
            ncol=2,
            fontsize=7.0,
            frameon=False,
            borderaxespad=0.0,
            handlelength=2.6,
            columnspacing=1.6,
        )
        legend.set_in_layout(False)  # its strip is sized to it
        legends.append((name, legend))
    _fit_rows(fig, grid, axes, legends)
    return fig


def _fit_rows(fig, grid, axes, legends):
    """Size the rows: each legend strip and the foot to their text; the section to its
    plate drawn to scale, but at most 3.2 in and at most the larger of 45 % of the room
    left and what leaves the map MAP_HEIGHT; the map to the rest. A few passes settle it."""
    import numpy as np

    names = list(axes)
    for _ in range(5):
        fig.draw_without_rendering()
        cells = {n: axes[n].get_position(original=True) for n in names}
        total = sum(c.height for c in cells.values()) * fig.get_figheight()
        per_unit = total / sum(grid.get_height_ratios())  # inches per unit of ratio
        want = {n: legend.get_window_extent().height / fig.dpi + 0.04 for n, legend in legends}
        want["foot"] = axes["foot"].texts[0].get_window_extent().height / fig.dpi + 0.05
        left = total - sum(want.values())  # for the map and the section
        if "section" in axes:
            ax = axes["section"]
            (x0, x1), (y0, y1) = ax.get_xlim(), ax.get_ylim()
            plate = abs(y1 - y0) / abs(x1 - x0) * cells["section"].width * fig.get_figwidth()
            want["section"] = min(plate, 3.2, max(0.9, left - MAP_HEIGHT, 0.45 * left))
        want["map"] = max(1.5, total - sum(want.values()))
        ratios = [want[n] / per_unit for n in names]
        if np.allclose(ratios, grid.get_height_ratios(), rtol=0.01):
            break
        grid.set_height_ratios(ratios)


def _wrap(text, width):
    import textwrap

    return textwrap.wrap(text, width)
