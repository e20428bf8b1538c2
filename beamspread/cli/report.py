"""``beamspread report``: a one-page report of a setup file (PDF or PNG)."""

from __future__ import annotations

from dataclasses import replace
from pathlib import Path

import click

from ..errors import InputError

A4 = (8.27, 11.69)  # inches, portrait
MAP_HEIGHT = 2.2  # inches: the least the map keeps beside a section
PICTURE_ROOM = 3.0  # inches below the text: the least for the picture, its legend and the foot
SECTION_ROOM = 1.5  # inches more for an angle beam's section
PAGE_COLUMNS = 150  # characters of the page's text: 5.2 pt monospace, 0.047 in each, in 7.4 in


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
        params["given"] = {
            name
            for name in params
            if ctx.get_parameter_source(name) is not click.core.ParameterSource.DEFAULT
        }
    text, result, view, geometry, warnings = _compute(params, units)
    fig = _page(setup, text, result, view, geometry, units, warnings, name=setup_file)
    plots.save_figure(fig, target)
    click.echo(f"beamspread: wrote {target}", err=True)


def _compute(p, units):
    """The analysis a setup stands for: the text, the result, and what the map needs."""
    from ..beam import DEFAULT_LEVELS, analyse
    from ..render.text.beam import beam_table
    from ..render.text.setup import setup_lines
    from ..sonar.conventions import SONAR_BANDWIDTH, SONAR_LEVELS_SHOWN, SONAR_MODE
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


def _page(setup, text, result, view, geometry, units, warnings, *, name="the setup"):
    """The page: the text at the top, then the picture (the map, or a sonar setup's
    footprint on the bottom), the section (angle beam), the cautions.

    The text is set first and measured; the rest is laid out (constrained) in
    the space left below it, each picture with its legend in a strip of its
    own beneath, the strips and the section sized to what they hold.
    """
    from ..render.text.common import CAUTION
    from ..report import plots
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
    body = _fit_width(body)
    notes = _fit_width([f"note: {w}" for w in warnings[:4]])
    block = fig.text(
        margin,
        1.0 - 0.62 / height,
        "\n".join(body + notes),
        family="monospace",
        fontsize=5.2,
        va="top",
        ha="left",
    )
    bottom = fig.get_layout_engine().get()["rect"][1]
    room = PICTURE_ROOM + (SECTION_ROOM if geometry else 0.0)

    def below(block) -> float:
        fig.draw_without_rendering()
        return block.get_window_extent().y0 / (height * fig.dpi) - 0.06 / height

    below_text = below(block)
    if (below_text - bottom) * height < room and view.get("budgets"):
        body = _compact_budgets(body, view["budgets"], units)  # one row per range
        block.set_text("\n".join(body + notes))
        below_text = below(block)
    if (below_text - bottom) * height < room:
        count = len("\n".join(body).splitlines())
        raise InputError(
            f"report: the results of {name} ({count} lines) "
            "leave no room on one page for the picture; give fewer depths or bottom depths "
            f"(beamspread beam --setup {name} prints them all)"
        )
    fig.get_layout_engine().set(rect=(0.0, bottom, 1.0, below_text - bottom))

    # Rows: the picture (the map and its legend, or the footprint with its own),
    # the section and its legend, the cautions.
    footprint = view.get("footprint")
    picture = ["footprint"] if footprint else ["map", "map legend"]
    parts = picture + (["section", "section legend"] if geometry else []) + ["foot"]
    grid = fig.add_gridspec(len(parts), 1, height_ratios=[1.0] * len(parts))
    axes = {name: fig.add_subplot(grid[i]) for i, name in enumerate(parts)}
    for name in parts:
        if name != "map" and name != "section":
            axes[name].axis("off")

    strips = (
        {} if footprint else {"map legend": _draw_map(axes["map"], view, result, geometry, units)}
    )
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
    if footprint:
        _draw_footprint(fig, axes["footprint"], footprint, result, units)
    return fig


def _fit_width(lines: list[str], width: int = PAGE_COLUMNS) -> list[str]:
    """The lines, each longer than the page wrapped: a table row's continuation under
    its last cell (the cells after a run of three spaces), other lines indented by 4."""
    import re
    import textwrap

    out = []
    for line in lines:
        if len(line) <= width:
            out.append(line)
            continue
        cells = [m.end() for m in re.finditer(r"\S {3,}(?=\S)", line[: width // 2])]
        indent = cells[-1] if cells else len(line) - len(line.lstrip()) + 4
        out.extend(
            textwrap.wrap(
                line,
                width,
                initial_indent="",
                subsequent_indent=" " * indent,
                drop_whitespace=True,
                break_on_hyphens=False,
            )
            or [line]
        )
    return out


def _compact_budgets(body: list[str], budgets, units: str) -> list[str]:
    """``body`` with beam's echo budget (five rows per range) set as one row per range,
    each term's formula given once below; the same figures in fewer lines."""
    from ..render.text.common import columns
    from ..units import format_length

    start = next((i for i, line in enumerate(body) if line.startswith("Echo budget of")), None)
    if start is None:
        return body
    end = next((i for i in range(start + 1, len(body)) if not body[i].strip()), len(body))
    terms = budgets[0].terms
    rows = [["range", *(t.name for t in terms)]]
    rows += [
        [format_length(b.range_m, units), *(f"{t.value_db:.1f} dB" for t in b.terms)]
        for b in budgets
    ]
    formulas = [f"  {t.name}: {t.formula}, {t.reference}" for t in terms]
    return [*body[: start + 1], columns(rows), *formulas, *body[end:]]


def _draw_map(ax, view, result, geometry, units):
    """The computed beam in the part, on the table's terms, into ``ax``; its legend handles."""
    import numpy as np

    from ..field import field_map
    from ..report import plots

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
    return drawn.handles


FOOTPRINT_DPI = 300  # the footprint picture's resolution on the page
FOOTPRINT_HEIGHT = 4.5  # inches: the least height the picture is drawn at (plots.FIGSIZE's)


def _draw_footprint(fig, ax, footprint, result, units):
    """The footprint picture of ``beam --plot`` (the table's footprints, the first plane),
    drawn to the shape of its row and set into ``ax`` as an image.

    The page's layout is fixed first, so the picture is made for the row's final
    shape; a row lower than FOOTPRINT_HEIGHT gets the picture drawn at that height
    and scaled down (its legend sits below the plot by a fraction of the plot's
    height, which a lower picture leaves too small for the axis label).
    """
    import numpy as np

    from ..report import plots

    fig.set_layout_engine("none")  # keep the rows where _fit_rows put them
    box = ax.get_position()
    inset = 0.3 / fig.get_figwidth()  # clear of the page's edges, as the text
    ax.set_position((box.x0 + inset, box.y0, box.width - 2 * inset, box.height))
    box = ax.get_position()
    size = (box.width * fig.get_figwidth(), box.height * fig.get_figheight())
    scale = max(1.0, FOOTPRINT_HEIGHT / size[1])
    size = (size[0] * scale, size[1] * scale)
    depths, by_level = footprint
    picture = plots.footprint_figure(
        depths,
        by_level,
        near_field=result.near_field,
        mode=result.convention.mode,
        units="m" if units == "mm" else "ft",
        size=size,
        in_air=result.wave.state == "gas",
    )
    picture.set_dpi(FOOTPRINT_DPI / scale)
    picture.canvas.draw()
    pixels = np.asarray(picture.canvas.buffer_rgba())
    ax.imshow(pixels, extent=(0, 1, 0, 1), aspect="auto", interpolation="antialiased")
    ax.set_xlim(0, 1)
    ax.set_ylim(0, 1)
    ax.axis("off")


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
        picture = "footprint" if "footprint" in axes else "map"
        want[picture] = max(1.5, total - sum(want.values()))
        ratios = [want[n] / per_unit for n in names]
        if np.allclose(ratios, grid.get_height_ratios(), rtol=0.01):
            break
        grid.set_height_ratios(ratios)


def _wrap(text, width):
    import textwrap

    return textwrap.wrap(text, width)
