"""The ``beamspread`` command line: a thin layer over the library.

Commands load lazily, so ``beamspread beam`` imports only what it needs.
Exit status: 0 on success; 2 on bad input, with one line on stderr naming the
value and what is allowed; 1 on an internal error, one line unless
``BEAMSPREAD_DEBUG=1`` asks for the traceback.
"""

from __future__ import annotations

import importlib
import os
import sys

import click

from ..errors import BeamspreadError, InputError, TableError

__all__ = ["cli", "main"]

_COMMANDS = {
    "across": "beamspread.cli.profiles:across",
    "axis": "beamspread.cli.profiles:axis",
    "beam": "beamspread.cli.beam:beam",
    "demo": "beamspread.cli.demo:demo",
    "map": "beamspread.cli.fieldmap:map_",
    "materials": "beamspread.cli.materials:materials",
    "plugins": "beamspread.cli.plugins:plugins",
    "report": "beamspread.cli.report:report",
    "index-step": "beamspread.cli.indexstep:index_step",
    "section": "beamspread.cli.section:section",
    "size": "beamspread.cli.size:size",
}


def _fail(message: str, code: int) -> None:
    line = " ".join(str(message).split())
    click.echo(f"beamspread: error: {line}", err=True)
    sys.exit(code)


_FLAGS = {"materials_dirs": "--materials-dir"}  # library parameter names that are not the flag's


def error_text(exc: Exception) -> str:
    """An error's message, with the option that mends it where the library suggests one."""
    remedy = getattr(exc, "remedy", None)
    if not remedy:
        return str(exc)
    name, value = remedy
    flag = _FLAGS.get(name, "--" + name.replace("_", "-"))
    return f"{exc} ({flag}{'' if value is None else ' ' + value})"


class _Group(click.Group):
    """A group whose commands import on first use, and which reports errors in one line."""

    def list_commands(self, ctx: click.Context) -> list[str]:
        return sorted(_COMMANDS)

    def get_command(self, ctx: click.Context, name: str) -> click.Command | None:
        target = _COMMANDS.get(name)
        if target is None:
            return None
        module, attribute = target.split(":")
        return getattr(importlib.import_module(module), attribute)

    def resolve_command(self, ctx, args):
        name = args[0] if args else None
        if name is not None and name not in _COMMANDS and not name.startswith("-"):
            import difflib

            close = difflib.get_close_matches(name, list(_COMMANDS), n=1)
            hint = f"; did you mean '{close[0]}'?" if close else ""
            raise click.UsageError(
                f"no command '{name}'{hint} Commands: {', '.join(sorted(_COMMANDS))}"
            )
        return super().resolve_command(ctx, args)

    def main(self, args=None, prog_name=None, complete_var=None, standalone_mode=True, **extra):
        debug = os.environ.get("BEAMSPREAD_DEBUG") == "1"
        try:
            rv = super().main(
                args, prog_name or "beamspread", complete_var, standalone_mode=False, **extra
            )
        except click.NoSuchOption as exc:
            from .setupargs import refusal

            _fail(refusal(exc) or exc.format_message(), 2)
        except click.UsageError as exc:
            _fail(exc.format_message(), 2)
        except click.ClickException as exc:
            _fail(exc.format_message(), exc.exit_code)
        except click.exceptions.Abort:
            _fail("aborted", 1)
        except (InputError, TableError) as exc:
            _fail(error_text(exc), 2)
        except BeamspreadError as exc:
            if debug:
                raise
            _fail(str(exc), 1)
        except BrokenPipeError:
            sys.stderr.close()
            sys.exit(1)
        except Exception as exc:
            if debug:
                raise
            _fail(
                f"internal error: {type(exc).__name__}: {exc} "
                "(set BEAMSPREAD_DEBUG=1 to see the traceback)",
                1,
            )
        code = rv if isinstance(rv, int) else 0
        if standalone_mode:
            sys.exit(code)
        return code


@click.group(
    cls=_Group, context_settings={"help_option_names": ["-h", "--help"], "max_content_width": 100}
)
@click.version_option(package_name="beamspread", prog_name="beamspread")
def cli() -> None:
    """How wide an ultrasonic or sonar transducer's beam is where it matters.

    Near-field length, divergence half-angles at any dB level (one-way or
    pulse-echo) and the spot size at depth, for a disc or rectangular element
    in any material or medium. Results are estimates from an ideal piston
    model, not a measured beam profile.

    Start with: beamspread demo
    """


def main() -> None:
    """Console-script entry point."""
    cli.main(prog_name="beamspread")
