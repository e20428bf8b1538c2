"""Rewrite the README's console blocks with the tool's real output (run after changing it).

    python tests/update_readme.py

Each block's first line is the command; the rest is replaced by what the command prints on
stdout, whole (its closing caution included).
"""

from __future__ import annotations

import re
import shlex
from pathlib import Path

from click.testing import CliRunner

from beamspread.cli import cli

README = Path(__file__).resolve().parent.parent / "README.md"


def render(command: str) -> str:
    result = CliRunner().invoke(cli, shlex.split(command)[1:])
    return result.stdout.rstrip("\n")


def main() -> None:
    text = README.read_text(encoding="utf-8")

    def replace(match: re.Match) -> str:
        command = match.group(1)
        return f"```console\n$ {command}\n{render(command)}\n```"

    README.write_text(
        re.sub(r"```console\n\$ (.*?)\n.*?```", replace, text, flags=re.S), encoding="utf-8"
    )


if __name__ == "__main__":
    main()
