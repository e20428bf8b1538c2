"""``beamspread plugins``: what is loaded, from where, and what it provides."""

from __future__ import annotations

import click

from .options import emit_warnings, load_registry


@click.command()
@click.option("--json", "as_json", is_flag=True, help="JSON to stdout.")
def plugins(as_json):
    """Loaded plug-ins: distribution, version, hooks and the media each provides.

    BEAMSPREAD_LOAD_PLUGINS=name,name loads only those entry points (empty:
    none but the built-ins); BEAMSPREAD_TRACE_PLUGINS=1 traces loading and
    hook calls to stderr.
    """
    from ..plugins import plugin_infos

    registry = load_registry(())
    emit_warnings(registry.warnings)
    provided: dict[str, list[str]] = {}
    for entry in registry:
        if entry.plugin:
            provided.setdefault(entry.plugin, []).append(entry.name)
    rows = [
        {
            "name": info.name,
            "builtin": info.builtin,
            "distribution": info.distribution,
            "version": info.version,
            "hooks": info.hooks,
            "provides": provided.get(info.name, []),
        }
        for info in plugin_infos()
    ]
    failures = [w for w in registry.warnings if w.startswith("plug-in ")]
    if as_json:
        from ..render.serialize.common import dumps

        click.echo(dumps({"plugins": rows, "failures": failures}))
        return
    for row in rows:
        about = "built-in" if row["builtin"] else f"{row['distribution']} {row['version']}"
        click.echo(f"{row['name']}  ({about})")
        click.echo(f"  hooks: {', '.join(row['hooks']) or 'none'}")
        click.echo(f"  provides {len(row['provides'])}: {', '.join(row['provides']) or '-'}")
    for line in failures:
        click.echo(f"failed: {line}")
