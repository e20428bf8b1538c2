"""The report's page: the setup's text, its picture (the beam map, or a sonar setup's
footprint on the bottom), an angle beam's section and the cautions, laid out on one A4 sheet.

:func:`report_page` builds the page as a Figure from what ``beamspread report``
computed; :func:`~beamspread.render.plots.save_figure` writes it (PDF or PNG).
Every picture on it is drawn in vector form by the ``draw_*`` functions of
:mod:`beamspread.render.plots`, except the map's image of the field.
"""

from __future__ import annotations

from dataclasses import replace

from ..errors import InputError

A4 = (8.27, 11.69)  # inches, portrait
MAP_HEIGHT = 2.2  # inches: the least the map keeps beside a section
PICTURE_ROOM = 3.0  # inches below the text: the least for the picture, its legend and the foot
SECTION_ROOM = 1.5  # inches more for an angle beam's section
PAGE_COLUMNS = 150  # characters of the page's text: 5.2 pt monospace, 0.047 in each, in 7.4 in


def report_page(
    setup, text, result, view, geometry, units, warnings, *, caption="", name="the setup"
):
    """The report's page as a :class:`matplotlib.figure.Figure`.

    Parameters
    ----------
    setup : Technique or Setup
        What the page reports (its ``title`` heads the page).
    text : str
        The results as ``beam`` prints them for the setup.
    result : BeamResult
        The beam's result (levels, mode, near field, the field settings).
    view : dict
        What the picture needs: the element and speed the map is computed for,
        where its ranges start and how they stretch, the depths marked and
        their labels, the near field and the pulse's last maximum (m), the
        names of the axes; ``footprint`` (depths, widths by level) for a
        sonar setup's bottom and ``budgets`` for its echo budget.
    geometry : SectionGeometry or None
        An angle beam's section, drawn below the map.
    units : {"mm", "in"}
    warnings : list of str
        The first four are printed below the text as notes.
    caption : str
        Along the foot of the page.
    name : str
        The setup's name, in the message if the results leave no room.

    Raises
    ------
    InputError
        The results are too long to leave room for the picture.
    """
    return _page(setup, text, result, view, geometry, units, warnings, caption=caption, name=name)


def _page(setup, text, result, view, geometry, units, warnings, *, caption, name):
    """The page: the text at the top, then the picture (the map, or a sonar setup's
    footprint on the bottom), the section (angle beam), the cautions.

    The text is set first and measured; the rest is laid out (constrained) in
    the space left below it, each picture with its legend in a strip of its
    own beneath, the strips and the section sized to what they hold.
    """
    from ..render.text.common import CAUTION
    from . import plots

    fig = plots.new_figure(A4, caption=caption)
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

    # Rows: the picture (the map and its legend, or the footprint and its legend),
    # the section and its legend, the cautions.
    footprint = view.get("footprint")
    picture = ["footprint", "footprint legend"] if footprint else ["map", "map legend"]
    parts = picture + (["section", "section legend"] if geometry else []) + ["foot"]
    grid = fig.add_gridspec(len(parts), 1, height_ratios=[1.0] * len(parts))
    axes = {name: fig.add_subplot(grid[i]) for i, name in enumerate(parts)}
    for name in parts:
        if name not in ("map", "section", "footprint"):
            axes[name].axis("off")

    if footprint:
        # Drawn once for its legend and its share of the layout, and again once the rows
        # are fitted: the widths' labels are placed for the plot's final shape.
        strips = {"footprint legend": _draw_footprint(axes["footprint"], footprint, result, units)}
    else:
        strips = {"map legend": _draw_map(axes["map"], view, result, geometry, units)}
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
        axes["footprint"].clear()
        _draw_footprint(axes["footprint"], footprint, result, units)
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
    from . import plots

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
        depth_legend="the table's depths"
        + (" (sound path, both legs)" if geometry and geometry.refracted > 0 else ""),
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


def _draw_footprint(ax, footprint, result, units):
    """The footprint picture of ``beam --plot`` (the table's footprints, the first plane),
    drawn into ``ax`` in vector form, its legend left to the page; its legend handles."""
    from . import plots

    depths, by_level = footprint
    handles = plots.draw_footprint(
        ax,
        depths,
        by_level,
        near_field=result.near_field,
        mode=result.convention.mode,
        units="m" if units == "mm" else "ft",
        in_air=result.wave.state == "gas",
        legend=False,
    )
    ax.title.set_fontsize(9)  # as the map's
    ax.yaxis.label.set_fontsize(8)
    return handles


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
