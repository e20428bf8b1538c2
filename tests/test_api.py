"""The public API: every name in ``beamspread.__all__`` is there, and importing it stays light."""

from __future__ import annotations

import json
import subprocess
import sys

import pytest

import beamspread


@pytest.mark.parametrize("name", beamspread.__all__)
def test_every_public_name_resolves(name):
    assert getattr(beamspread, name) is not None
    assert name in dir(beamspread)


def test_an_unknown_name_is_an_attribute_error():
    with pytest.raises(AttributeError, match="no attribute 'size_sphere'"):
        beamspread.size_sphere  # noqa: B018


def test_import_loads_the_later_tools_only_on_use():
    code = (
        "import json, sys, beamspread\n"
        "late = ('design', 'sonar', 'coupling', 'scan', 'setups', 'absorption')\n"
        "before = [m for m in late if 'beamspread.' + m in sys.modules]\n"
        "beamspread.size_disc\n"
        "after = [m for m in late if 'beamspread.' + m in sys.modules]\n"
        "print(json.dumps([before, after]))\n"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    before, after = json.loads(out.stdout)
    assert before == [] and "design" in after


def test_library_errors_name_no_command_line_option_and_the_cli_adds_it():
    """The core speaks in its own terms; the CLI names the option that mends the error."""
    from click.testing import CliRunner

    from beamspread.cli import cli, error_text

    registry = beamspread.build_registry()
    with pytest.raises(beamspread.MaterialError) as caught:
        registry.get("water").medium.evaluate("shear")
    assert "--" not in str(caught.value)
    assert caught.value.remedy == ("wave", "longitudinal")
    assert error_text(caught.value).endswith("(--wave longitudinal)")
    with pytest.raises(beamspread.InputError) as caught:
        beamspread.build_registry(["/no/such/directory"])
    assert "--" not in str(caught.value)
    assert error_text(caught.value).endswith("(--materials-dir)")
    result = CliRunner().invoke(
        cli, ["beam", "--diameter", "10mm", "--frequency", "5MHz", "--material", "water",
              "--wave", "shear"]
    )  # fmt: skip
    assert result.exit_code == 2
    assert "(--wave longitudinal)" in result.output
