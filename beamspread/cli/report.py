"""``beamspread report``: a one-page report of a setup file (PDF or PNG)."""

from __future__ import annotations

from pathlib import Path

import click

from .options import output_file_option, units_option


@click.command()
@click.argument("setup_file", type=click.Path(dir_okay=False))
@output_file_option(
    "The report: .pdf (a page) or .png (the page as a picture).",
    required=True,
    force_help="Overwrite an existing --output file.",
)
@units_option()
@click.option(
    "--json",
    "as_json",
    is_flag=True,
    help="Also print the results as JSON (the object beam --setup FILE --json prints).",
)
def report(setup_file, output, force, units, as_json):
    """A one-page report of the technique in SETUP_FILE: inputs, conventions, the results
    table, the beam map (and the section for an angle beam) and the cautions.

    A sonar setup's page carries what beam prints for it (full angles, the
    directivity index, absorption, footprints and the echo budget); with bottom
    depths its picture is the footprint against water depth."""
    from ..pipeline import compute
    from ..render import plots
    from ..render.captions import caption_of
    from ..render.page import report_page
    from ..render.text.result import result_table
    from ..technique import Technique
    from .options import emit_warnings, load_registry, refuse_existing

    target = Path(output)
    if target.suffix.lower() not in (".pdf", ".png"):
        raise click.BadParameter(f"{output!r}: a report is .pdf or .png", param_hint="--output")
    plots.check_target(target)
    refuse_existing(output, force, "--output")
    technique = Technique.from_toml(setup_file)
    registry = load_registry(()) if technique.names_a_medium else None
    result = compute(technique, registry=registry)
    view, geometry = _view(result, units)
    fig = report_page(
        technique,
        result_table(result, units),
        result.beam,
        view,
        geometry,
        units,
        list(result.warnings),
        caption=caption_of(result.beam),
        name=setup_file,
    )
    plots.save_figure(fig, target)
    click.echo(f"beamspread: wrote {target}", err=True)
    if as_json:
        from ..render.serialize.common import dumps

        emit_warnings(result.warnings)
        click.echo(dumps(result.to_dict()))


def _view(result, units):
    """What the page's pictures need, on the table's terms: the map's source (the element,
    the medium, where the part's ranges start and how they stretch), the depths marked,
    the near field; the plate's section, angled or straight; a sonar's footprint and budgets."""
    from ..conventions import Coupling

    source, beam, setup = result.source, result.beam, result.setup
    view = {
        "probe": source.element,
        "speed": source.speed,
        "start": source.start,
        "stretch": source.stretch,
        "axis": "depth from the probe face",
        "source": "",
    }
    geometry = None
    if result.coupling is Coupling.WEDGE:
        # The virtual element in the part, set back behind the exit point by the wedge
        # path's equivalent: the map's ranges are that offset plus the sound path.
        view["axis"] = "sound path in the part"
        view["source"] = "sound path from the exit point" + (
            f"; the virtual element sits {_mm(setup.offset, units)} behind it"
            if setup.offset > 0
            else ""
        )
    elif setup is not None:
        # As the table's computed widths: the element in the couplant at the water-equivalent
        # range, water path + depth c_part / c_water (paraxial), drawn at the depth.
        couplant = result.couplant
        view["axis"] = "depth in the part"
        if result.coupling is Coupling.IMMERSION:
            view["source"] = (
                f"the element in {couplant.wave.medium} at range water path "
                f"{_mm(couplant.path, units)} + depth x c_part / c_water"
            )
        else:
            view["source"] = f"the element straight in {couplant.wave.medium}"
        if source.focus is not None:  # the focused element's paraxial field, as the table's
            view["source"] = view["source"].replace("the element", "the focused element")
            view["focus"] = source.focus
    else:
        sonar = result.sonar
        if sonar.figures is not None and sonar.figures.footprints:
            # The question is the bottom: the footprint against water depth, as beam --plot.
            view["footprint"] = sonar.footprint_widths(beam)
        view["budgets"] = sonar.budgets
    thickness = result.technique.thickness
    if thickness is not None and "footprint" not in view:  # the plate's section, as section's
        from ..render.plots import section_of

        depths = result.technique.request.depths
        geometry = section_of(result, thickness, depths[0] if depths else None)
    # The marks: each depth of the table; for an angle beam at its sound path on each leg.
    marks = {}
    for pl in beam.planes:
        for s in pl.spots:
            if view["axis"].startswith("sound path"):
                name = f"path {_mm(s.sound_path, units)}: {_mm(s.depth, units)} deep, leg {s.leg}"
                marks.setdefault(s.sound_path, name)
            else:
                marks.setdefault(s.depth, _mm(s.depth, units))
    view["marks"] = sorted(marks)
    view["labels"] = [marks[m] for m in view["marks"]]
    view["near"] = beam.near_field
    view["pulse_maximum"] = beam.field.axial_maximum if beam.field else None
    view["pulse_label"] = "last on-axis maximum of the pulse"
    if view.get("focus") is not None:  # the flat element's near field is not this beam's
        view["near"] = None
        view["pulse_maximum"] = setup.focus.focal_depth_in_part
        view["pulse_label"] = "focal depth in the part (paraxial)"
    return view, geometry


def _mm(metres, units):
    from ..units import format_length

    return format_length(metres, units)
