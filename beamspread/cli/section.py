"""``beamspread section``: the beam drawn on the part's section, angled or straight."""

from __future__ import annotations

import click

from .options import output_options, pass_output, plot_option
from .params import LENGTH, LEVEL
from .setupargs import setup_file_options
from .techniqueargs import technique_from, technique_options


@click.command()
@technique_options
@click.option("--depth", type=LENGTH, help="Flaw depth: the footprint is drawn there on both legs.")
@click.option(
    "--level", "levels", type=LEVEL, multiple=True, help="Edge levels, dB down (default 6 and 20)."
)
@click.option(
    "--plane",
    type=click.Choice(["length", "width"]),
    help="A rectangle's plane drawn (default: its length, the plane a wedge's incidence "
    "plane holds).",
)
@click.option("--far-field-only", is_flag=True, help="Edges from the far-field cone only.")
@plot_option("Draw the section to FILE (.png, .svg, .pdf).")
@setup_file_options
@output_options
@pass_output
def section(depth, levels, plane, far_field_only, plot_path, force_plot, fmt, units, **options):
    """The beam on the part's section: the plate, where the beam enters, the axis and
    its level edges down to the back wall and back up (the mirror leg), and the
    footprint at the flaw depth on both legs.

    Needs the part's --thickness. In contact the beam goes straight down; on a
    wedge (--wedge or --wedge-speed, with --incident or --refracted) it is the
    refracted beam; behind a --water-path (and with a --focus) it is the beam in
    the part, the water path noted. The edges come from the computed field (of
    the virtual element on a wedge), or the far-field cone with --far-field-only.
    """
    from ..conventions import Coupling
    from ..edges import straight_footprints
    from ..pipeline import compute
    from .options import check_plot, emit_warnings, load_registry

    check_plot(plot_path, force_plot)
    thickness = options["thickness"]
    if thickness is None:
        raise click.UsageError("the section needs the part --thickness")
    technique = technique_from(
        options, depths=[depth] if depth else [], levels=levels, far_field_only=far_field_only
    )
    on_wedge = technique.coupling.kind is Coupling.WEDGE
    if far_field_only and technique.element.focus is not None:
        raise click.UsageError(
            "--far-field-only: a focused probe has no far-field edges (the flat element's "
            "cone does not converge); drop it to draw the computed edges"
        )
    if plane is not None and len(technique.element.planes) == 1:
        raise click.UsageError(
            f"--plane chooses between an element's planes; a {technique.element.shape} has one"
        )
    if plane == "width" and on_wedge:
        raise click.UsageError(
            "on a wedge the section is the incidence plane, which holds the rectangle's "
            "length: --plane width cannot be drawn there"
        )
    computed = compute(technique, registry=load_registry(options["materials_dirs"]))
    method = "far-field" if computed.settings is None else "field"
    name = computed.beam.planes[0].name if plane is None else plane
    if on_wedge:
        setup = computed.setup
        prints = [p for p in setup.footprints if p.method == method]
        setup_warnings = set(setup.warnings)
        warnings = [w for w in computed.warnings if w not in setup_warnings]
        other = {text for m, text in setup.method_warnings if m != method}
        warnings.extend(w for w in setup.warnings if w not in other)
        warnings = list(dict.fromkeys(warnings))
    else:
        prints = list(straight_footprints(computed, thickness, name))
        warnings = list(computed.warnings)
    if depth is None and fmt != "table":
        warnings.append("no --depth: the section has no flaw depth, so no footprint is given")
    emit_warnings(warnings)
    if plot_path is not None:  # the edges along both legs are computed for the drawing only
        from ..render import plots
        from ..render.captions import caption_of

        geometry = plots.section_of(computed, thickness, depth, plane=name)
        plots.plot_section(
            geometry, plot_path, caption=_caption(computed, name, caption_of), units=units
        )
        click.echo(f"beamspread: drew {plot_path}", err=True)
    if fmt == "json":
        from ..render.serialize.common import dumps
        from ..render.serialize.section import section_to_dict

        click.echo(dumps(section_to_dict(computed, thickness, depth, prints, name, warnings)))
    elif fmt == "csv":
        from ..render.serialize.setup import section_to_csv

        click.echo(section_to_csv(prints, computed.mode), nl=False)
    else:
        from ..render.serialize.section import section_rows
        from ..render.text.section import section_text

        rows = section_rows(prints)
        click.echo(section_text(computed, thickness, depth, rows, name, plot_path, units))


def _caption(result, plane: str, caption_of) -> str:
    """The picture's caption: the beam's, the wedge or water path, and the plane drawn."""
    text = caption_of(result.beam)
    if result.wedge is not None:
        text += f"; wedge {result.wedge.name}"
    elif result.couplant is not None and result.couplant.path > 0:
        text += f"; water path {result.couplant.path * 1e3:g} mm of {result.couplant.wave.medium}"
    if len(result.beam.planes) > 1:
        text += f"; the {plane} plane drawn"
    return text
