"""``--setup FILE`` and ``--save FILE``: a technique read from, or written to, a setup file.

The group splices the file's options into the command line *before* the
options typed, so a typed option wins (the last of a single-valued option
counts) and repeatable ones (``--depth``, ``--level``, ``--condition``) add
to the file's. Options a command does not take are left out. ``--save``
records the options of the command line as typed, with their units.
"""

from __future__ import annotations

import click

_SETUP, _SAVE = "--setup", "--save"


def setup_file_options(f):
    f = click.option(
        _SAVE,
        "save_path",
        type=click.Path(dir_okay=False),
        default=None,
        help="Write the setup this command line uses to FILE (TOML; never overwrites).",
    )(f)
    f = click.option(
        _SETUP,
        "setup_path",
        type=click.Path(dir_okay=False),
        default=None,
        help="Read probe, medium, setup, depths, levels and conventions from a "
        "setup FILE; options given here win.",
    )(f)
    return f


def _take(args: list[str], name: str) -> tuple[list[str], str | None]:
    """Remove ``name VALUE`` (or ``name=VALUE``) from ``args``; return the rest and VALUE."""
    out, value, i = [], None, 0
    while i < len(args):
        token = args[i]
        if token == name:
            if i + 1 >= len(args):
                raise click.UsageError(f"{name} needs a FILE")
            value = args[i + 1]
            i += 2
            continue
        if token.startswith(name + "="):
            value = token.split("=", 1)[1]
            i += 1
            continue
        out.append(token)
        i += 1
    return out, value


def _accepted(command: click.Command) -> dict[str, click.Parameter]:
    return {opt: p for p in command.params for opt in (*p.opts, *p.secondary_opts)}


def _with_unit(value, param):
    """A bare number as typed, with the unit the command line gives it (mm, MHz, deg...)."""
    import re

    from ..units import KINDS
    from .params import Angle, Quantity

    number = r"\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*"
    if not isinstance(value, str) or not re.fullmatch(number, value):
        return value
    if isinstance(param.type, Quantity) and KINDS[param.type.kind].default:
        return f"{value.strip()} {KINDS[param.type.kind].default}"
    if isinstance(param.type, Angle):
        return f"{value.strip()} deg"
    return value


def _typed_options(args: list[str], command: click.Command) -> dict[str, object]:
    """The options of ``args`` that a setup file records, as typed (strings with units)."""
    from ..setupfile import recordable_options

    known = recordable_options()
    accepted = _accepted(command)
    options: dict[str, object] = {}
    i = 0
    while i < len(args):
        token = args[i]
        name, _, inline = token.partition("=")
        param = accepted.get(name)
        if param is None or not name.startswith("--"):
            i += 1
            continue
        is_flag = getattr(param, "is_flag", False)
        value: object = (
            True
            if is_flag
            else (inline if inline else (args[i + 1] if i + 1 < len(args) else None))
        )
        i += 1 if (is_flag or inline) else 2
        if name not in known or value is None:
            continue
        value = _with_unit(value, param)
        if getattr(param, "multiple", False):
            options.setdefault(name, []).append(value)
        else:
            options[name] = value
    return options


def expand(command: click.Command, name: str, args: list[str]):
    """The command's arguments with ``--setup`` spliced in, and what ``--save`` must do.

    Returns ``(args, save)``: ``save`` is None, or a function to call once the
    command has succeeded (a setup is only written for a command line that works,
    and an existing file is refused before anything is computed).
    """
    from pathlib import Path

    args, setup_path = _take(list(args), _SETUP)
    args, save_path = _take(args, _SAVE)
    if setup_path is None and save_path is None:
        return args, None
    if "-h" in args or "--help" in args:
        return args, None
    from ..setupfile import Setup, load_setup, save_setup

    spliced: list[str] = []
    if setup_path is not None:
        setup = load_setup(setup_path)
        accepted = _accepted(command)
        unused = []
        for option, value in setup.to_options().items():
            param = accepted.get(option)
            if param is None:
                unused.append(option)
                continue
            if value is True:
                spliced.append(option)
            elif isinstance(value, list):
                for item in value if getattr(param, "multiple", False) else value[:1]:
                    spliced += [option, item]
            else:
                spliced += [option, str(value)]
            if isinstance(value, list) and len(value) > 1 and not getattr(param, "multiple", False):
                click.echo(
                    f"beamspread: warning: {name} takes one {option}; the setup's "
                    f"first ({value[0]}) is used",
                    err=True,
                )
        if unused:
            click.echo(
                f"beamspread: warning: {name} does not use the setup's "
                f"{', '.join(unused)}; its result leaves them out",
                err=True,
            )
    full = spliced + args
    if save_path is None:
        return full, None
    target = Path(save_path)
    if target.exists():
        raise click.UsageError(
            f"--save: {save_path!r} exists; a setup is never overwritten: "
            "remove it or choose another name"
        )
    if not target.parent.is_dir():
        raise click.UsageError(f"--save: the folder {str(target.parent)!r} does not exist")
    typed = _typed_options(full, command)
    setup = Setup.from_options(typed)  # checked now: a bad value fails before computing

    def save() -> None:
        save_setup(setup, target)
        click.echo(f"beamspread: saved the setup to {save_path}", err=True)

    return full, save
