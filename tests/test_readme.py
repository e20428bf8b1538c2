"""The README's examples are real: each console block is the command's actual output."""

from __future__ import annotations

import re
import shlex
from pathlib import Path

import pytest

README = Path(__file__).resolve().parent.parent / "README.md"


def console_blocks():
    text = README.read_text(encoding="utf-8")
    for block in re.findall(r"```console\n(.*?)```", text, flags=re.S):
        first, *rest = block.rstrip("\n").split("\n")
        assert first.startswith("$ beamspread ")
        yield shlex.split(first[2:])[1:], rest


@pytest.mark.skipif(not README.exists(), reason="README.md is not beside the tests")
@pytest.mark.parametrize(("args", "expected"), list(console_blocks()) if README.exists() else [])
def test_readme_console_blocks_match_the_tool(run, args, expected):
    r = run(*args)
    assert r.code == 0, r.stderr
    produced = r.stdout.rstrip("\n").split("\n")
    assert produced[: len(expected)] == expected


def test_readme_sonar_figures(run):
    # The figures quoted in the README's hobbyist example come from this command.
    data = run("beam", "--diameter", "25mm", "--frequency", "200kHz", "--material", "seawater",
               "--temperature", "12", "--condition", "salinity=34", "--condition", "depth=15m",
               "--depth", "30m", "--level", "3", "--level", "10", "--one-way", "--json").json()
    plane = data["planes"][0]
    text = README.read_text(encoding="utf-8")
    assert f"{plane['half_angle_deg']['-3']:.2f}°" in text
    assert f"a {2 * plane['half_angle_deg']['-3']:.1f}° cone" in text
    assert f"{plane['spots'][0]['width_m']:.2f} m across" in text
