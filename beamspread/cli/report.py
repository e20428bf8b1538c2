"""``beamspread report``: a one-page report of a setup file (PDF or PNG)."""

from __future__ import annotations

from pathlib import Path

import click

A4 = (8.27, 11.69)  # inches, portrait


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
    from .options import field_settings, make_probe, resolve_wave

    offset = 0.0
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
    levels = p["levels"] or DEFAULT_LEVELS
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
            virtual = setup.virtual
            offset = setup.offset
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
            virtual = None  # the map is drawn for the contact beam in the part
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
        virtual = None
        warnings.extend(result.warnings)
    near = None if result.near_field is None else result.near_field + offset
    paths = sorted(
        {
            s.sound_path + offset
            for pl in result.planes
            for s in pl.spots
            if s.leg == 1 and s.sound_path is not None
        }
    )
    view = {
        "probe": virtual or probe,
        "speed": result.wave.speed,
        "near": near,
        "marks": paths or list(result.depths),
        "axis": "sound path from the virtual element" if virtual else "depth",
    }
    return text, result, view, geometry, list(dict.fromkeys(warnings))


def _page(setup, text, result, view, geometry, units, warnings):
    import numpy as np

    from ..field import field_map
    from ..report import plots
    from ..report.text import CAUTION
    from .beam import caption_of

    fig = plots.new_figure(A4, caption=caption_of(result))
    rows = [3.2, 3.0] + ([2.6] if geometry is not None else []) + [0.3]
    grid = fig.add_gridspec(len(rows), 1, height_ratios=rows)
    top = fig.add_subplot(grid[0])
    top.axis("off")
    title = setup.title or "beamspread: beam report"
    top.set_title(title, fontsize=12, loc="left")
    body = [
        line
        for line in text.split("\n")
        if not line.startswith(("Estimates from", "qualified procedure"))
    ]
    notes = [f"note: {w}" for w in warnings[:4]]
    top.text(
        0.0,
        1.0,
        "\n".join(body + notes),
        family="monospace",
        fontsize=5.2,
        va="top",
        ha="left",
        transform=top.transAxes,
    )
    ax = fig.add_subplot(grid[1])
    probe, speed = view["probe"], view["speed"]
    wavelength = speed / probe.frequency
    longest = max(a for _, a in probe.planes)
    near = view["near"] or longest**2 / (4 * wavelength)
    deepest = max([*view["marks"], 2.5 * near])
    depth = np.linspace(0.1 * near, 1.2 * deepest, 160)
    aperture = probe.planes[0][1]
    half = max(aperture, 4 * wavelength * depth[-1] / aperture)
    settings = result.field.settings if result.field else None
    fm = field_map(
        probe,
        speed,
        np.linspace(-half, half, 96),
        depth,
        plane=probe.planes[0][0],
        bandwidth=settings.bandwidth if settings else 0.0,
        mode=result.convention.mode,
        frequencies=settings.frequencies if settings else 32,
        spectrum=settings.spectrum if settings else "gaussian",
    )
    plots.draw_map(
        ax,
        fm,
        levels_db=result.levels,
        near_field=view["near"],
        depths=view["marks"],
        units=units,
        legend=False,
    )
    if view["axis"] != "depth":
        ax.set_ylabel(f"{view['axis']}, {units}")
    where = "in the part" if view["axis"] != "depth" else ""
    ax.set_title(
        f"Computed beam, {result.planes[0].name} plane, {result.convention.mode} {where}".strip(),
        fontsize=9,
    )
    if geometry is not None:
        picture = plots.section_figure(geometry, units=units, size=(7.0, 3.2))
        picture.canvas.draw()
        image = np.asarray(picture.canvas.buffer_rgba())
        sax = fig.add_subplot(grid[2])
        sax.imshow(image)
        sax.axis("off")
    foot = fig.add_subplot(grid[-1])
    foot.axis("off")
    foot.text(
        0.0,
        0.5,
        "\n".join(_wrap(CAUTION + " Pulsers carry high voltage.", 150)),
        fontsize=6.5,
        va="center",
        ha="left",
        color="0.15",
        transform=foot.transAxes,
    )
    return fig


def _wrap(text, width):
    import textwrap

    return textwrap.wrap(text, width)
