"""The README's examples are real: each console block is the command's whole actual output."""

from __future__ import annotations

import doctest
import math
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
    assert r.stdout.rstrip("\n").split("\n") == expected


def test_readme_sonar_footprint_follows_the_cone(run):
    # The footprint the README shows at 30 m is 2 D tan(half-angle) of the -3 dB cone
    # (geometry), as the JSON of the same command gives it.
    data = run(
        "beam",
        "--diameter",
        "25mm",
        "--frequency",
        "200kHz",
        "--material",
        "seawater",
        "--temperature",
        "12",
        "--condition",
        "salinity=34",
        "--sonar",
        "--bottom-depth",
        "30m",
        "--far-field-only",
        "--json",
    ).json()
    half = data["planes"][0]["half_angle_deg"]["-3"]
    width = 2 * 30.0 * math.tan(math.radians(half))
    assert data["footprints"][0]["width_m"] == pytest.approx(width)
    assert f"{width:.2f} m" in README.read_text(encoding="utf-8")


@pytest.mark.skipif(not README.exists(), reason="README.md is not beside the tests")
def test_readme_python_examples_run():
    text = README.read_text(encoding="utf-8")
    blocks = re.findall(r"```pycon\n(.*?)```", text, flags=re.S)
    assert blocks, "the README shows the Python API"
    parser, runner = doctest.DocTestParser(), doctest.DocTestRunner()
    for i, block in enumerate(blocks):
        runner.run(parser.get_doctest(block, {}, f"README block {i}", str(README), 0))
    assert runner.failures == 0
