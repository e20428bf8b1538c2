"""``--setup FILE`` and ``--save FILE``: a technique read from, or written to, a setup file.

``--setup`` is eager: it reads the file first and makes its options the
defaults of the command's (click's ``default_map``), so click takes a typed
option over the setup's; once parsed, the options typed (by their parameter
source) replace the setup's options they stand in for. A typed option replaces:

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

Every command that reads setup files models every technique (a wedge, a
water path, a focus); the options it does not take (depths, levels, the
bottom, the sonar figures) are named in a warning. A command without ``--setup`` (``size``,
``report``, ...) refuses ``--setup`` and ``--save`` with one line (:func:`refusal`).

``--save`` records the options the command line resolves to (typed, with
their units, or kept from the setup) and the mode every command defaults to
(pulse-echo; with ``--sonar``, one-way and its narrow-band pulse), so another
command computes the same beam: to a new ``.toml`` file, once the command succeeds.
"""

from __future__ import annotations

import functools

import click
from click.core import ParameterSource

_SETUP, _SAVE = "--setup", "--save"
_PARSED = "beamspread.parsed"  # ctx.meta: click's parse of the command line (text as typed)
_OPTIONS = "beamspread.setup"  # ctx.meta: the setup file's options (strings with units)


class _SetupFileOption(click.Option):
    """``--setup``/``--save``: they keep click's parse (each option's text as typed, by name)."""

    def handle_parse_result(self, ctx, opts, args):
        ctx.meta[_PARSED] = dict(opts)
        return super().handle_parse_result(ctx, opts, args)


def setup_file_options(f):
    """``--setup FILE`` and ``--save FILE`` for a command that computes a technique."""

    @functools.wraps(f)
    def command(*args, **params):
        ctx = click.get_current_context()
        save_path = params["save_path"]
        if save_path is not None:
            _check_target(save_path)
        kept = _lay_over(ctx, params) if _OPTIONS in ctx.meta else {}
        setup = _resolved_setup(ctx, params, kept) if save_path is not None else None
        rv = f(*args, **params)
        if setup is not None and not (isinstance(rv, int) and rv):
            from ..setupfile import save_setup

            save_setup(setup, save_path)
            click.echo(f"beamspread: saved the setup to {save_path}", err=True)
        return rv

    command = click.option(
        _SAVE,
        "save_path",
        cls=_SetupFileOption,
        type=click.Path(dir_okay=False),
        help="Write the setup this command line uses to FILE (TOML; never overwrites).",
    )(command)
    return click.option(
        _SETUP,
        "setup_path",
        cls=_SetupFileOption,
        type=click.Path(dir_okay=False),
        is_eager=True,
        callback=_read_setup,
        help="Read probe, medium, setup, depths, levels and conventions from a "
        "setup FILE; options given here win.",
    )(command)


def _accepted(command: click.Command) -> dict[str, click.Parameter]:
    return {opt: p for p in command.params for opt in (*p.opts, *p.secondary_opts)}


def _read_setup(ctx: click.Context, param, path):
    """Read the setup file: its options become the defaults of the command's options."""
    if path is None or ctx.resilient_parsing:
        return path
    asks_help = ctx.command.get_help_option(ctx)
    if asks_help is not None and ctx.meta.get(_PARSED, {}).get(asks_help.name):
        return path  # the help is shown, the file is not read
    from ..setupfile import load_setup

    options = load_setup(path).to_options()
    accepted = _accepted(ctx.command)
    defaults: dict[str, object] = {}
    for option, value in options.items():
        p = accepted.get(option)
        if p is None:
            continue  # named in a warning once the command line is parsed
        if value is True:  # a flag: --sonar, or one of --pulse-echo/--one-way
            defaults[p.name] = option in p.opts
        elif isinstance(value, list):
            defaults[p.name] = value if getattr(p, "multiple", False) else value[0]
        else:
            defaults[p.name] = value
    ctx.default_map = {**(ctx.default_map or {}), **defaults}
    ctx.meta[_OPTIONS] = options
    return path


_READ_AS = {"report": "beam"}  # report reads a setup file as beam's options


def _setup_readers(root: click.Context) -> list[str]:
    """The commands of the root context's group that read setup files."""
    group = root.command
    names = []
    for other in group.list_commands(root):
        command = group.get_command(root, _READ_AS.get(other, other))
        if any(p.name == "setup_path" for p in command.params):
            names.append(other)
    return names


def _listed(names: list[str], last: str = "or") -> str:
    return names[0] if len(names) == 1 else f"{', '.join(names[:-1])} {last} {names[-1]}"


def refusal(error: click.NoSuchOption) -> str | None:
    """The one line for ``--setup`` or ``--save`` given to a command without them, or None."""
    ctx, option = error.ctx, error.option_name
    if option not in (_SETUP, _SAVE) or ctx is None or ctx.parent is None:
        return None
    while ctx.parent.parent is not None:  # the command under beamspread (materials, not list)
        ctx = ctx.parent
    name = ctx.info_name
    readers = _setup_readers(ctx.find_root())
    writers = [n for n in readers if n not in _READ_AS]
    verb, names = ("read", readers) if option == _SETUP else ("written", writers)
    others = f"setup files are {verb} by {_listed(names, 'and')}"
    if name == "report":
        return (
            "report takes the setup file as its argument, not --setup or --save: "
            "beamspread report FILE --output REPORT.pdf"
        )
    if name == "size":
        return (
            f"size does not take {option}: it solves for the element that a setup "
            f"file records; give it the medium and the target on its command line ({others})"
        )
    return f"{name} does not take {option}; {others}"


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


def _medium_key(name) -> str:
    """A material's name as lookups compare it (case, spaces, '_' and '/' ignored)."""
    return "".join(c for c in str(name).lower() if not (c.isspace() or c in "_/"))


def _not_typed(options: dict, typed: set[str], params: dict, accepted) -> dict:
    """The setup's options less those the parameters ``typed`` (by name) replace."""

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
        material = params[accepted["--material"].name]
        if _medium_key(material) != _medium_key(options["--material"]):
            out.pop("--condition", None)  # the setup's conditions were its own material's
    if "--condition" in out and was_typed("--condition"):
        names = {name for name, _ in params[accepted["--condition"].name]}
        kept = [c for c in out["--condition"] if c.partition("=")[0].strip().lower() not in names]
        if kept:
            out["--condition"] = kept
        else:
            del out["--condition"]
    return out


def _lay_over(ctx: click.Context, params: dict) -> dict:
    """Lay the typed options over the setup's (see the module's notes); the setup's kept.

    What the typed options replace goes back to its default in ``params`` and
    ``ctx.params``; a typed ``--condition`` joins the setup's others; warns.
    """
    options, accepted = ctx.meta[_OPTIONS], _accepted(ctx.command)
    typed = {n for n in ctx.params if ctx.get_parameter_source(n) is ParameterSource.COMMANDLINE}
    kept = _not_typed(options, typed, params, accepted)
    for option in options:
        p = accepted.get(option)
        if p is None or p.name in typed or option in kept:
            continue
        params[p.name] = () if getattr(p, "multiple", False) else None
        ctx.set_parameter_source(p.name, ParameterSource.DEFAULT)
    if "--condition" in kept and accepted["--condition"].name in typed:
        p = accepted["--condition"]
        params[p.name] = p.type_cast_value(ctx, kept["--condition"]) + tuple(params[p.name])
    ctx.params.update(params)
    unused = []
    for option, value in kept.items():
        p = accepted.get(option)
        if p is None:
            unused.append(option)
        elif isinstance(value, list) and len(value) > 1 and not getattr(p, "multiple", False):
            click.echo(
                f"beamspread: warning: {ctx.info_name} takes one {option}; the setup's "
                f"first ({value[0]}) is used",
                err=True,
            )
    if unused:
        message = _unused_warning(ctx.info_name, unused, kept, accepted)
        click.echo(f"beamspread: warning: {message}", err=True)
    return kept


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


def _check_target(save_path: str) -> None:
    """A setup is written to a new ``.toml`` file (the name says what the file holds)."""
    from pathlib import Path

    target = Path(save_path)
    if target.suffix.lower() != ".toml":
        raise click.UsageError(
            f"--save: {save_path!r} must end in .toml, as a setup file is TOML "
            f"(e.g. {str(target.with_suffix('.toml'))!r})"
        )
    if target.exists():
        raise click.UsageError(
            f"--save: {save_path!r} exists; a setup is never overwritten: "
            "remove it or choose another name"
        )
    if not target.parent.is_dir():
        raise click.UsageError(f"--save: the folder {str(target.parent)!r} does not exist")


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


def _resolved_setup(ctx: click.Context, params: dict, kept: dict):
    """The :class:`~beamspread.setupfile.Setup` of the command line as click resolved it.

    The setup's options ``kept`` and each option typed, as typed with its unit
    (from click's parse); checked now, so a bad value fails before computing.
    """
    from ..setupfile import Setup, recordable_options

    known, accepted = recordable_options(), _accepted(ctx.command)
    record: dict[str, object] = {}
    for option, value in kept.items():
        p = accepted.get(option)
        if p is not None:  # one value for a single-valued option, as the command used
            many = isinstance(value, list) and not getattr(p, "multiple", False)
            record[option] = value[:1] if many else value
    parsed = ctx.meta.get(_PARSED, {})
    for p in ctx.command.params:
        names = [o for o in (*p.opts, *p.secondary_opts) if o in known]
        if not names or ctx.get_parameter_source(p.name) is not ParameterSource.COMMANDLINE:
            continue
        if getattr(p, "is_flag", False):  # the last of --pulse-echo/--one-way typed counts
            for name in names:
                record.pop(name, None)
            on = p.opts[0] if params[p.name] else (p.secondary_opts or [None])[0]
            if on in known:
                record[on] = True
            continue
        typed = parsed[p.name]
        texts = [_with_unit(t, p) for t in (typed if isinstance(typed, list) else [typed])]
        if getattr(p, "multiple", False):  # a --condition joins the setup's others kept
            record[names[0]] = [*record.get(names[0], []), *texts]
        else:
            record[names[0]] = texts[-1]
    if "--pulse-echo" not in record and "--one-way" not in record:
        # Every command's default, written down so that the file says which it is.
        record["--one-way" if "--sonar" in record else "--pulse-echo"] = True
    if "--sonar" in record and "--bandwidth" not in record:
        from ..sonar.conventions import SONAR_BANDWIDTH

        record["--bandwidth"] = SONAR_BANDWIDTH  # --sonar's pulse, for commands without --sonar
    return Setup.from_options(record)
