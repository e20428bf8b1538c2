"""``beamspread materials``: list, show and check material tables."""

from __future__ import annotations

import click

from .options import emit_warnings, load_registry, materials_dir_option

_SCHEMA = """\b
Table format (TOML, format 1; a table never runs code):
  format = 1
  title = "My plant's alloys"                       # optional
  [[material]]
  name = "duplex-2205"                              # lower case, digits, hyphens
  aliases = ["2205", "duplex stainless"]            # optional
  state = "solid"                                   # solid | liquid | gas
  category = "metal"                                # optional
  description = "solution annealed"                 # optional
  note = "measured on plate from heat 1234"         # optional
  longitudinal = { value = 5750, unit = "m/s", source = "measured, block 7" }
  shear = { value = 3180, unit = "m/s", source = "measured, block 7" }  # solids only
  density = { value = 7800, unit = "kg/m3", source = "mill certificate" }
\b
A value may be a curve against temperature instead of a constant:
  longitudinal = { unit = "m/s", source = "...", temperature = [10, 20, 30],
                   values = [2755, 2730, 2705] }     # degC unless temperature_unit
Units: speed m/s, km/s, mm/us, in/us; density kg/m3, g/cm3. Every value
needs a source: the published table named, "common practice" or "from memory".
\b
Where tables are read, highest precedence first:
  --materials-dir DIR (the last given first), BEAMSPREAD_MATERIALS (a list of
  directories), the per-user directory (beamspread materials paths),
  plug-ins, then the built-in tables. A clash warns, naming both sources."""


@click.group(
    help=f"""List, show and check material tables.

{_SCHEMA}"""
)
def materials() -> None:
    pass


def _reference(medium) -> dict:
    """Longitudinal and shear speed and density for listings: constants, curve middles,
    or a computed medium at its default conditions."""
    from ..media.material import Material

    if isinstance(medium, Material):
        return {
            "longitudinal": medium.longitudinal.reference,
            "shear": medium.shear.reference if medium.shear else None,
            "density": medium.density.reference if medium.density else None,
        }
    state = medium.evaluate("longitudinal")
    return {"longitudinal": state.speed, "shear": None, "density": state.density}


def _describe(entry) -> dict:
    """The JSON form of a registry entry."""
    from ..media.material import Material
    from ..render.serialize.common import conditions_to_dict

    m = entry.medium
    out = {
        "name": m.name,
        "aliases": list(m.aliases),
        "state": m.state,
        "category": m.category,
        "kind": m.kind,
        "description": m.description,
        "origin": entry.origin,
        "path": entry.path,
        "precedence": entry.level_name,
    }
    if isinstance(m, Material):

        def value(v):
            if v is None:
                return None
            d = {"source": v.source}
            if v.curve is None:
                d["value"] = v.value
            else:
                d["temperature_c"] = list(v.curve.temperature_c)
                d["values"] = list(v.curve.values)
            if v.note:
                d["note"] = v.note
            return d

        out["longitudinal_m_s"] = value(m.longitudinal)
        out["shear_m_s"] = value(m.shear)
        out["density_kg_m3"] = value(m.density)
        out["source"] = m.longitudinal.source
        out["note"] = m.note
    else:
        state = m.evaluate("longitudinal")
        out["source"] = m.source
        out["density_source"] = m.density_source
        out["parameters"] = [
            {
                "name": p.name,
                "unit": p.unit,
                "default": p.default,
                "valid": list(p.valid),
                "limits": list(p.limits),
                "description": p.description,
                "for": "speed" if p in m.parameters else "absorption",
            }
            for p in (*m.parameters, *m.absorption_parameters)
        ]
        if m.absorption is not None:
            out["absorption_source"] = m.absorption_source
        out["at_defaults"] = {
            "conditions": conditions_to_dict(state),
            "longitudinal_m_s": state.speed,
            "density_kg_m3": state.density,
        }
        out["note"] = m.note
    reference = _reference(m)
    out["impedance_rayl"] = (
        reference["density"] * reference["longitudinal"] if reference["density"] else None
    )
    return out


def _fmt(value: float | None, scale: float = 1.0, digits: int = 0) -> str:
    return "-" if value is None else f"{value * scale:.{digits}f}"


@materials.command("list")
@materials_dir_option
@click.option("--json", "as_json", is_flag=True, help="JSON to stdout.")
def list_(materials_dirs, as_json):
    """Every material and medium, with its speeds, density, impedance and origin."""
    registry = load_registry(materials_dirs)
    emit_warnings(registry.warnings)
    rows = [_describe(entry) for entry in registry]
    if as_json:
        from ..render.serialize.common import dumps

        click.echo(dumps(rows))
        return
    from ..render.text.common import columns

    table = [["name", "state", "cL m/s", "cS m/s", "density kg/m3", "Z MRayl", "origin"]]
    for entry, row in zip(registry, rows, strict=True):
        ref = _reference(entry.medium)
        speed = _fmt(ref["longitudinal"])
        if row["kind"] == "computed":
            speed += " *"
        table.append(
            [
                row["name"],
                row["state"],
                speed,
                _fmt(ref["shear"]),
                _fmt(ref["density"]),
                _fmt(row["impedance_rayl"], 1e-6, 2),
                row["origin"],
            ]
        )
    click.echo(columns(table, indent=0))
    click.echo(
        f"\n{_entries(len(rows))}. * computed from conditions, shown at their defaults "
        "(beamspread materials show NAME)."
    )


@materials.command()
@click.argument("name")
@materials_dir_option
@click.option("--json", "as_json", is_flag=True, help="JSON to stdout.")
def show(name, materials_dirs, as_json):
    """One material or medium: every value with its source, and what it shadows."""
    registry = load_registry(materials_dirs)
    emit_warnings(registry.warnings)
    entry = registry.get(name)
    from ..media.quantities import normalise_name

    data = _describe(entry)
    data["shadows"] = [e.origin for e in registry.shadowed.get(normalise_name(entry.name), [])]
    if as_json:
        from ..render.serialize.common import dumps

        click.echo(dumps(data))
        return
    kind = data["state"]
    if data["category"] and data["category"] != kind:
        kind += f", {data['category']}"
    lines = [f"{data['name']}  ({kind})"]
    if data["aliases"]:
        lines.append(f"  aliases: {', '.join(data['aliases'])}")
    if data["description"]:
        lines.append(f"  {data['description']}")
    lines.append(f"  from: {data['origin']}")
    if data["kind"] == "table":
        for key, label, unit in (
            ("longitudinal_m_s", "longitudinal", "m/s"),
            ("shear_m_s", "shear", "m/s"),
            ("density_kg_m3", "density", "kg/m3"),
        ):
            v = data[key]
            if v is None:
                continue
            if "value" in v:
                shown = f"{v['value']:g} {unit}"
            else:
                pairs = ", ".join(
                    f"{t:g} degC: {x:g}"
                    for t, x in zip(v["temperature_c"], v["values"], strict=True)
                )
                shown = f"{unit} by temperature ({pairs})"
            lines.append(f"  {label}: {shown}")
            lines.append(f"      source: {v['source']}")
            if v.get("note"):
                lines.append(f"      note: {v['note']}")
    else:
        lines.append(f"  speed: {data['source']}")
        if data.get("absorption_source"):
            lines.append(f"  absorption: {data['absorption_source']}")
        if data["density_source"]:
            lines.append(f"  density: {data['density_source']}")
        lines.append("  conditions (give with --temperature or --condition NAME=VALUE):")
        for p in data["parameters"]:
            unit = f" [{p['unit']}]" if p["unit"] else ""
            unit += " (absorption only)" if p["for"] == "absorption" else ""
            lines.append(
                f"    {p['name']}{unit}, default {p['default']:g}; fitted for "
                f"{p['valid'][0]:g} to {p['valid'][1]:g} (warns outside); refused outside "
                f"{p['limits'][0]:g} to {p['limits'][1]:g}"
            )
        at = data["at_defaults"]
        lines.append(
            f"  at the defaults: longitudinal {at['longitudinal_m_s']:.2f} m/s"
            + (f", density {at['density_kg_m3']:.1f} kg/m3" if at["density_kg_m3"] else "")
        )
    if data["impedance_rayl"]:
        z = data["impedance_rayl"]
        shown = f"{z / 1e6:.3f} MRayl" if z >= 1e4 else f"{z:.0f} Rayl"
        lines.append(f"  acoustic impedance (density x longitudinal speed): {shown}")
    if data["note"]:
        lines.append(f"  note: {data['note']}")
    for origin in data["shadows"]:
        lines.append(f"  shadows the entry of the same name from {origin}")
    click.echo("\n".join(lines))


@materials.command()
@click.argument("file", type=click.Path(dir_okay=False))
def check(file):
    """Check one table FILE; exit 0 if it is sound, 2 with the file and line if not."""
    from ..media.tables import load_table

    table = load_table(file)
    names = ", ".join(m.name for m in table.materials)
    click.echo(f"{file}: ok, {_entries(len(table.materials))} ({names})")


@materials.command()
@materials_dir_option
@click.option("--json", "as_json", is_flag=True, help="JSON to stdout.")
def paths(materials_dirs, as_json):
    """Where tables are read from, highest precedence first."""
    registry = load_registry(materials_dirs)
    emit_warnings(registry.warnings)
    rows = [
        {
            "source": what.replace("given directory", "--materials-dir"),
            "path": path,
            "exists": exists,
        }
        for what, path, exists in reversed(registry.locations)
    ]
    if as_json:
        from ..render.serialize.common import dumps

        click.echo(dumps(rows))
        return
    for row in rows:
        state = "" if row["exists"] else "  (does not exist)"
        click.echo(f"{row['source']}: {row['path']}{state}")


def _entries(count: int) -> str:
    return f"{count} entry" if count == 1 else f"{count} entries"
