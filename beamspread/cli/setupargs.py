"""``--setup FILE`` and ``--save FILE``: a technique read from, or written to, a setup file.

The group splices the file's options into the command line *before* the
options typed, leaving out every option the command line types itself, so a
typed option replaces the setup's:

- a single-valued option (``--frequency``, ``--one-way`` for the setup's
  ``--pulse-echo``) replaces the setup's value;
- a repeatable option replaces the setup's whole list: ``--depth``,
  ``--bottom-depth`` and ``--level`` typed once give those depths or levels
  alone; ``--condition`` replaces the setup's condition of the same name and
  keeps the others;
- an option typed in place of another replaces it: ``--speed`` the setup's
  material (with its conditions, and its temperature unless a named wedge or
  a water path needs it), ``--material`` the setup's speed (and, for another
  material, its conditions), ``--wedge-speed`` and ``--wedge`` each other,
  ``--incident`` and ``--refracted`` each other, ``--diameter`` a rectangle's
  sides and ``--length``/``--width`` a disc's diameter.

A command that cannot model the setup's wedge, water path or focus refuses
the file (it would compute another technique and present it as this one);
other options it does not take (depths, levels, the bottom, the sonar
figures) are named in a warning. A command without ``--setup`` (``size``,
``report``, ...) refuses ``--setup`` and ``--save`` with one line.

``--save`` records the options of the command line as typed, with their
units, and the mode every command defaults to (pulse-echo; with ``--sonar``,
one-way and its narrow-band pulse), so another command computes the same beam.
It writes a ``.toml`` file only, and never overwrites one.
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
    from .params import Angle, DepthList, Quantity

    number = r"\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*"
    if isinstance(value, str) and isinstance(param.type, DepthList):
        return ":".join(
            f"{part.strip()} {param.type.unit}" if re.fullmatch(number, part) else part
            for part in value.split(":")
        )
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
        elif is_flag:  # the last of --pulse-echo/--one-way counts: keep the order typed
            for flag in (*param.opts, *param.secondary_opts):
                options.pop(flag, None)
            options[name] = value
        else:
            options[name] = value
    return options


# What a setup can record that changes the beam itself, with the options that record it.
# A command that cannot model one refuses the setup instead of computing another technique.
_TECHNIQUES = (
    (
        "an angle-beam wedge",
        ("--wedge", "--wedge-speed", "--incident", "--refracted", "--wedge-path"),
    ),
    ("a water path", ("--water-path", "--couplant")),
    ("a focus", ("--focus",)),
)
_READ_AS = {"report": "beam"}  # report reads a setup file as beam's options


def _reads_setups(command: click.Command) -> bool:
    return any(p.name == "setup_path" for p in command.params)


def _commands_that(can) -> list[str]:
    """The commands reading setup files for which ``can(accepted options)`` holds."""
    from . import _COMMANDS, cli

    names = []
    for other in sorted(_COMMANDS):
        command = cli.get_command(None, _READ_AS.get(other, other))
        if _reads_setups(command) and can(_accepted(command)):
            names.append(other)
    return names


def _listed(names: list[str], last: str = "or") -> str:
    return names[0] if len(names) == 1 else f"{', '.join(names[:-1])} {last} {names[-1]}"


def _refuse_unreadable(name: str, setup_path, save_path) -> None:
    """A command without --setup and --save: one line saying what to do instead."""
    which = " and ".join(o for o, v in ((_SETUP, setup_path), (_SAVE, save_path)) if v)
    if setup_path is not None:
        others = f"setup files are read by {_listed(_commands_that(lambda a: True), 'and')}"
    else:
        writers = [n for n in _commands_that(lambda a: True) if n not in _READ_AS]
        others = f"setup files are written by {_listed(writers, 'and')}"
    if name == "report":
        message = (
            "report takes the setup file as its argument, not --setup or --save: "
            "beamspread report FILE --output REPORT.pdf"
        )
    elif name == "size":
        message = (
            f"size does not take {which}: it solves for the element that a setup "
            f"file records; give it the medium and the target on its command line ({others})"
        )
    else:
        message = f"{name} does not take {which}; {others}"
    raise click.UsageError(message)


def _refuse_techniques(name: str, path: str, options: dict, accepted) -> None:
    """Refuse a setup whose wedge, water path or focus the command cannot model."""
    missing = [
        (what, [o for o in opts if o in options])
        for what, opts in _TECHNIQUES
        if any(o in options for o in opts) and not all(o in accepted for o in opts)
    ]
    if not missing:
        return
    needed = {o for _, opts in missing for o in opts}
    details = ", ".join(f"{o} {options[o]}" for _, opts in missing for o in opts)
    straight = not any(o in accepted for _, opts in _TECHNIQUES for o in opts)
    can = _commands_that(lambda accepted: needed <= set(accepted))
    raise click.UsageError(
        f"{path} records {' and '.join(what for what, _ in missing)} ({details}), which "
        f"{name} cannot model"
        + (" (it computes a contact beam straight from the probe's face)" if straight else "")
        + (f"; use {_listed(can)} with this setup" if can else "")
    )


# Options that stand in for others: typing the key replaces the setup's options listed.
_INSTEAD = {
    "--speed": ("--material", "--condition"),
    "--material": ("--speed",),
    "--wedge": ("--wedge-speed",),
    "--wedge-speed": ("--wedge",),
    "--incident": ("--refracted",),
    "--refracted": ("--incident",),
    "--diameter": ("--length", "--width"),
    "--length": ("--diameter",),
    "--width": ("--diameter",),
}
# What a setup's temperature also sets besides the part's medium (a wedge's or a couplant's
# speed by name): with these, a typed --speed leaves the setup's --temperature in place.
_TEMPERATURE_ELSEWHERE = ("--wedge", "--water-path")


def _typed_values(args: list[str], accepted) -> dict[str, list]:
    """Each parameter typed in ``args`` (by its name) -> the values typed (True for a flag)."""
    typed: dict[str, list] = {}
    i = 0
    while i < len(args):
        name, equals, inline = args[i].partition("=")
        param = accepted.get(name) if name.startswith("--") else None
        if param is None:
            i += 1
            continue
        if getattr(param, "is_flag", False):
            value, i = True, i + 1
        elif equals:
            value, i = inline, i + 1
        else:
            value, i = (args[i + 1] if i + 1 < len(args) else None), i + 2
        typed.setdefault(param.name, []).append(value)
    return typed


def _condition_name(text) -> str:
    return str(text).partition("=")[0].strip().lower()


def _medium_key(name) -> str:
    """A material's name as lookups compare it (case, spaces, '_' and '/' ignored)."""
    import re

    return re.sub(r"[\s_/]", "", str(name).lower())


def _not_typed(options: dict, typed: dict, accepted) -> dict:
    """The setup's options less those the command line replaces (see the module's notes)."""

    def was_typed(option: str) -> bool:
        param = accepted.get(option)
        return param is not None and param.name in typed

    out = {o: v for o, v in options.items() if o == "--condition" or not was_typed(o)}
    for option, others in _INSTEAD.items():
        if was_typed(option):
            for other in others:
                out.pop(other, None)
    if was_typed("--speed") and not any(o in out or was_typed(o) for o in _TEMPERATURE_ELSEWHERE):
        out.pop("--temperature", None)  # it described the setup's material, now replaced
    if was_typed("--material") and "--material" in options:
        material = typed[accepted["--material"].name][-1]
        if _medium_key(material) != _medium_key(options["--material"]):
            out.pop("--condition", None)  # the setup's conditions were its own material's
    if "--condition" in out and was_typed("--condition"):
        names = {_condition_name(v) for v in typed[accepted["--condition"].name]}
        kept = [c for c in out["--condition"] if _condition_name(c) not in names]
        if kept:
            out["--condition"] = kept
        else:
            del out["--condition"]
    return out


def _unused_warning(name: str, unused: list[str], options: dict, accepted) -> str:
    """The warning naming the setup's options the command leaves out, and only those.

    ``--sonar`` is named for what it adds that the command does not compute (the
    sonar figures, and its levels where the setup records none); the one-way mode
    and the narrow-band pulse recorded with it are options of their own, which the
    command does use: the warning says so.
    """
    from ..sonar.conventions import SONAR_LEVELS_SHOWN

    named = [o for o in unused if o != "--sonar"]
    parts = [f"the setup's {_listed(named, 'or')}"] if named else []
    if "--sonar" in unused:
        sonar = "--sonar figures (full angles, directivity index, side lobes, absorption)"
        if "--level" not in options:  # the setup records no levels: --sonar's would apply
            levels = " and ".join(f"-{level:g}" for level in SONAR_LEVELS_SHOWN)
            sonar += f" and levels ({levels} dB)"
        parts.append(f"nor its {sonar}" if named else f"the setup's {sonar}")
    them = "it" if unused == named and len(named) == 1 else "them"
    message = f"{name} does not use {', '.join(parts)}: its result leaves {them} out"
    if "--sonar" in unused:
        kept = [
            f"the {o.removeprefix('--')} mode" if options[o] is True else f"bandwidth {options[o]}"
            for o in ("--one-way", "--pulse-echo", "--bandwidth")
            if o in options and o in accepted
        ]
        if kept:
            message += f"; it does use {_listed(kept, 'and')}, recorded with --sonar"
    return message


def _check_save_suffix(save_path: str) -> None:
    """A setup is written to a ``.toml`` file only (the name says what the file holds)."""
    from pathlib import Path

    target = Path(save_path)
    if target.suffix.lower() != ".toml":
        raise click.UsageError(
            f"--save: {save_path!r} must end in .toml, as a setup file is TOML "
            f"(e.g. {str(target.with_suffix('.toml'))!r})"
        )


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
    if not _reads_setups(command):
        _refuse_unreadable(name, setup_path, save_path)
    from ..setupfile import Setup, load_setup, save_setup

    spliced: list[str] = []
    if save_path is not None:
        _check_save_suffix(save_path)
    if setup_path is not None:
        setup = load_setup(setup_path)
        accepted = _accepted(command)
        options = setup.to_options()
        _refuse_techniques(name, setup_path, options, accepted)
        unused = []
        kept = _not_typed(options, _typed_values(args, accepted), accepted)
        for option, value in kept.items():
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
                f"beamspread: warning: {_unused_warning(name, unused, kept, accepted)}", err=True
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
    if "--pulse-echo" not in typed and "--one-way" not in typed:
        # Every command's default, written down so that the file says which it is.
        typed["--one-way" if "--sonar" in typed else "--pulse-echo"] = True
    if "--sonar" in typed and "--bandwidth" not in typed:
        from ..sonar.conventions import SONAR_BANDWIDTH

        typed["--bandwidth"] = SONAR_BANDWIDTH  # --sonar's pulse, for commands without --sonar
    setup = Setup.from_options(typed)  # checked now: a bad value fails before computing

    def save() -> None:
        save_setup(setup, target)
        click.echo(f"beamspread: saved the setup to {save_path}", err=True)

    return full, save
