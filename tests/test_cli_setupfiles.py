"""Setup files on the command line: exact round trips, techniques a command cannot model
refused, commands without setup files refused, and scan plans that say what does not hold."""

from __future__ import annotations

import json
import sys

import pytest

if sys.version_info >= (3, 11):
    import tomllib
else:  # Python 3.10
    import tomli as tomllib

# The README's sonar command (an invented echo sounder).
SOUNDER = (
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
    "10m:40m:10m",
)
ANGLE = (
    "--diameter",
    "10mm",
    "--frequency",
    "5MHz",
    "--material",
    "reference-steel",
    "--wedge",
    "acrylic",
    "--refracted",
    "60",
)
IMMERSION = (
    "--diameter",
    "10mm",
    "--frequency",
    "5MHz",
    "--material",
    "reference-steel",
    "--water-path",
    "40mm",
    "--focus",
    "60mm",
)
DISC = ("--diameter", "10mm", "--frequency", "5MHz", "--material", "reference-steel")
SIZE = ("size", "--frequency", "5MHz", "--material", "steel", "--spot", "6mm", "--at", "40mm")


def _saved(run, tmp_path, *args, name="s.toml"):
    path = tmp_path / name
    r = run(*args, "--save", str(path))
    assert r.code == 0, r.stderr
    return path, r


@pytest.mark.parametrize("form", [("--json",), ()], ids=["json", "table"])
def test_the_readme_sonar_command_is_repeated_exactly(run, tmp_path, form):
    # Reference: the original command line; its replay from the file must print the same.
    path, first = _saved(run, tmp_path, "beam", *SOUNDER, *form)
    again = run("beam", "--setup", str(path), *form)
    assert again.code == 0, again.stderr
    assert again.stdout == first.stdout
    data = tomllib.loads(path.read_text(encoding="utf-8"))
    assert data["conventions"]["sonar"] is True
    assert data["bottom"]["depths"] == ["10m:40m:10m"]
    if form:
        replay = again.json()
        assert replay["convention"]["mode"] == "one-way"
        assert [f["depth_m"] for f in replay["footprints"]][:1] == [10.0]


def test_the_echo_budget_is_recorded_and_repeated(run, tmp_path):
    args = ("--power", "150", "--efficiency", "0.4", "--bottom-loss", "12")
    path, first = _saved(run, tmp_path, "beam", *SOUNDER, *args, "--json")
    data = tomllib.loads(path.read_text(encoding="utf-8"))
    assert data["bottom"] == {
        "depths": ["10m:40m:10m"],
        "power": "150 W",
        "efficiency": 0.4,
        "loss": "12 dB",
    }
    again = run("beam", "--setup", str(path), "--json")
    assert again.code == 0, again.stderr
    assert again.json() == first.json()


def test_bare_depth_ranges_are_saved_with_the_units_the_command_gave_them(run, tmp_path):
    path, _ = _saved(
        run,
        tmp_path,
        "beam",
        "--diameter",
        "25mm",
        "--frequency",
        "200kHz",
        "--material",
        "seawater",
        "--bottom-depth",
        "10:30:10",
        "--far-field-only",
    )
    assert tomllib.loads(path.read_text())["bottom"]["depths"] == ["10 m:30 m:10 m"]
    path, _ = _saved(run, tmp_path, "beam", *DISC, "--depth", "10:30:10", name="d.toml")
    assert tomllib.loads(path.read_text())["inspection"]["depths"] == ["10 mm:30 mm:10 mm"]


def test_a_sonar_setup_gives_other_commands_its_one_way_narrow_band_beam(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *SOUNDER, "--far-field-only")
    depths = ("--from", "50mm", "--to", "150mm", "--count", "4", "--json")
    r = run("index-step", "--setup", str(path), *depths)
    assert r.code == 0, r.stderr
    assert "--bottom-depth" in r.stderr and "--sonar" in r.stderr and "does not use" in r.stderr
    # Reference: the same plan asked for explicitly with --sonar's conventions
    # (one-way, a 0.1 bandwidth).
    explicit = run("index-step", *SOUNDER[:10], "--one-way", "--bandwidth", "0.1", *depths)
    assert r.json()["mode"] == "one-way"
    assert r.json()["widths_m"] == explicit.json()["widths_m"]


def _one_line_refusal(r):
    assert r.code == 2
    lines = r.stderr.strip().splitlines()
    assert len(lines) == 1 and lines[0].startswith("beamspread: error: ")
    assert r.stdout == ""
    return lines[0]


@pytest.mark.parametrize(
    "command",
    [
        ("index-step", "--from", "10mm", "--to", "50mm"),
        ("map", "--depth-points", "8", "--lateral-points", "8"),
        ("axis", "--points", "8"),
        ("across", "--depth", "30mm", "--points", "8"),
    ],
    ids=lambda c: c[0],
)
def test_the_field_commands_take_a_wedge_setup(run, tmp_path, command):
    # Every command that computes a beam takes every technique that makes physical sense:
    # a field command reads the wedge's beam in the part, along the refracted axis.
    path, _ = _saved(run, tmp_path, "beam", *ANGLE, "--far-field-only")
    r = run(command[0], "--setup", str(path), *command[1:], "--json")
    assert r.code == 0, r.stderr
    assert json.loads(r.stdout)["source"]["coupling"] == "wedge"


def test_the_commands_that_can_model_a_wedge_take_it(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *ANGLE, "--far-field-only")
    r = run("section", "--setup", str(path), "--thickness", "25mm", "--far-field-only", "--json")
    assert r.code == 0, r.stderr
    out = tmp_path / "r.png"
    assert run("report", str(path), "--output", str(out)).code == 0


def test_every_command_reading_setups_models_a_water_path_and_focus(run, tmp_path):
    # section draws a straight beam too: no command that reads a setup file refuses one.
    path, _ = _saved(run, tmp_path, "beam", *IMMERSION, "--far-field-only")
    beam = run("beam", "--setup", str(path), "--json").json()
    r = run("section", "--setup", str(path), "--thickness", "30mm", "--json")
    assert r.code == 0, r.stderr
    data = json.loads(r.stdout)
    assert data["coupling"] == "immersion" and data["couplant"]["path_m"] == 0.040
    assert data["focus"] == beam["focus"]


def test_options_that_do_not_change_the_beam_only_warn(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *DISC, "--depth", "30mm", "--far-field-only")
    r = run("axis", "--setup", str(path), "--points", "8", "--json")
    assert r.code == 0
    assert "axis does not use the setup's --depth" in r.stderr


@pytest.mark.parametrize(
    "args, words",
    [
        (("size", "--spot", "6mm", "--at", "40mm", "--setup", "X"), "size does not take --setup"),
        ((*SIZE, "--save", "X"), "size does not take --save"),
        (("report", "--setup", "X", "--output", "r.pdf"), "report takes the setup file as its"),
        (("materials", "list", "--setup", "X"), "materials does not take --setup"),
    ],
    ids=["size-setup", "size-save", "report", "materials"],
)
def test_commands_without_setup_files_refuse_them(run, tmp_path, args, words):
    path, _ = _saved(run, tmp_path, "beam", *ANGLE, "--far-field-only")
    target = str(path) if "--setup" in args else str(tmp_path / "new.toml")
    line = _one_line_refusal(run(*[target if a == "X" else a for a in args]))
    assert words in line
    assert not (tmp_path / "new.toml").exists()


def test_scan_plan_round_trip(run, tmp_path):
    args = ("--from", "20mm", "--to", "60mm", "--count", "4", "--level", "12", "--json")
    path, first = _saved(
        run, tmp_path, "index-step", *DISC, "--one-way", "--bandwidth", "0.3", *args
    )
    again = run("index-step", "--setup", str(path), *args)
    assert again.code == 0, again.stderr
    assert again.json() == first.json()


def test_scan_plan_far_field_inside_the_near_field_is_marked(run):
    r = run(
        "index-step",
        *DISC,
        "--from",
        "10mm",
        "--to",
        "50mm",
        "--count",
        "5",
        "--overlap",
        "25%",
        "--method",
        "far-field",
        "--json",
    )
    assert r.code == 0
    data = r.json()
    # Reference: a disc's last on-axis maximum lies at (D^2 - lambda^2) / (4 lambda)
    # (Kinsler, Frey et al., Fundamentals of Acoustics, the baffled piston; from memory).
    lam = 5920.0 / 5e6
    near = (0.010**2 - lam**2) / (4 * lam)
    assert data["near_field_m"] == pytest.approx(near, rel=1e-12)
    assert data["far_field_valid"] == [d >= near for d in data["depths_m"]]
    assert data["far_field_valid"] == [False, False, True, True, True]  # 10, 20 mm inside 20.8
    assert data["governing_depth_m"] == pytest.approx(0.010)
    assert data["governing_far_field_valid"] is False
    warning = "depths 10 mm to 20 mm lie inside the near field (20.82 mm)"
    assert warning in r.stderr and any(warning in w for w in data["warnings"])
    table = run("index-step", *DISC, "--from", "10mm", "--to", "50mm", "--method", "far-field")
    assert "* inside the near field (20.82 mm)" in table.stdout
    assert "narrowest width   1.22 mm *" in table.stdout


def test_scan_plan_far_field_beyond_the_near_field_is_not_marked(run):
    r = run(
        "index-step", *DISC, "--from", "30mm", "--to", "60mm", "--method", "far-field", "--json"
    )
    data = r.json()
    assert data["governing_far_field_valid"] is True and all(data["far_field_valid"])
    assert "near field" not in r.stderr and data["warnings"] == []
    field = run("index-step", *DISC, "--from", "30mm", "--to", "60mm", "--count", "3", "--json")
    assert field.json()["far_field_valid"] is None
    assert field.json()["governing_far_field_valid"] is None


def test_scan_plan_text_is_wrapped_and_names_its_medium(run):
    r = run("index-step", *DISC, "--from", "30mm", "--to", "60mm", "--count", "3")
    assert r.code == 0
    lines = r.stdout.splitlines()
    assert max(len(line) for line in lines) <= 100  # the width beam's table uses
    assert lines[0] == "Index step for a disc element, diameter 10.00 mm, 5 MHz"
    assert lines[1].startswith("Medium: reference-steel: longitudinal wave, 5920.0 m/s")
    assert "not a measured beam profile" in r.stdout
    sonar = run("index-step", *SOUNDER[:10], "--from", "0.1m", "--to", "0.3m", "--count", "3")
    assert "Underwater sound" in sonar.stdout


def test_a_save_message_is_prefixed(run, tmp_path):
    _, r = _saved(
        run, tmp_path, "index-step", *DISC, "--from", "30mm", "--to", "60mm", "--count", "3"
    )
    assert r.stderr.strip().splitlines()[-1].startswith("beamspread: saved the setup to ")


def test_the_readme_shows_the_file_its_sonar_command_saves(run, tmp_path):
    import re
    import textwrap
    from pathlib import Path

    readme = Path(__file__).resolve().parent.parent / "README.md"
    if not readme.exists():
        pytest.skip("README.md is not beside the tests")
    blocks = re.findall(r"```toml\n(.*?)```", readme.read_text(encoding="utf-8"), flags=re.S)
    (block,) = [b for b in blocks if "[bottom]" in b]
    path, _ = _saved(run, tmp_path, "beam", *SOUNDER, "--far-field-only")
    assert path.read_text(encoding="utf-8") == textwrap.dedent(block)


# ------------------------------------------------- typed options replace the setup's
#
# Reference for each: the same command typed in full, with the typed value in place
# of the setup's (what the README promises: options typed on the command line win).


def _same_as_typed(run, path, typed, explicit, command="beam", extra=("--far-field-only",)):
    replay = run(command, "--setup", str(path), *typed, *extra, "--json")
    assert replay.code == 0, replay.stderr
    alone = run(command, *explicit, *extra, "--json")
    assert alone.code == 0, alone.stderr
    assert replay.json() == alone.json()
    return replay.json()


@pytest.mark.parametrize("form", ["separate", "inline"])
def test_typed_depths_replace_the_setups_depths(run, tmp_path, form):
    path, _ = _saved(run, tmp_path, "beam", *DISC, "--depth", "20mm", "--depth", "40mm")
    typed = ("--depth", "12mm") if form == "separate" else ("--depth=12mm",)
    data = _same_as_typed(run, path, typed, (*DISC, "--depth", "12mm"))
    assert {s["depth_m"] for p in data["planes"] for s in p["spots"]} == {0.012}


def test_typed_levels_replace_the_setups_levels(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *DISC, "--level", "6", "--level", "20")
    data = _same_as_typed(run, path, ("--level", "3"), (*DISC, "--level", "3"))
    assert set(data["planes"][0]["half_angle_deg"]) == {"-3", "null"}


def test_typed_bottom_depths_replace_the_setups(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *SOUNDER, "--far-field-only")
    data = _same_as_typed(
        run, path, ("--bottom-depth", "50m"), (*SOUNDER[:-2], "--bottom-depth", "50m")
    )
    assert {f["depth_m"] for f in data["footprints"]} == {50.0}


def test_a_typed_condition_replaces_the_setups_condition_of_that_name(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *SOUNDER, "--condition", "depth=10m")
    data = _same_as_typed(
        run,
        path,
        ("--condition", "depth=50m"),
        (*SOUNDER, "--condition", "depth=50m"),  # salinity=34 kept, the depth replaced
    )
    assert data["medium"]["conditions"]["salinity_g_kg"] == 34.0
    assert data["medium"]["conditions"]["depth_m"] == 50.0


@pytest.mark.parametrize(
    "typed, explicit",
    [
        # a speed in place of the material, its temperature and conditions
        (("--speed", "1500"), ("--speed", "1500")),
        # another material: the setup's conditions were seawater's; the temperature stays
        (("--material", "water"), ("--material", "water", "--temperature", "12")),
    ],
    ids=["speed", "material"],
)
def test_a_typed_medium_replaces_the_setups(run, tmp_path, typed, explicit):
    path, _ = _saved(run, tmp_path, "beam", *SOUNDER, "--far-field-only")
    probe = SOUNDER[:4]  # diameter and frequency
    rest = SOUNDER[10:]  # --sonar and the bottom
    _same_as_typed(run, path, typed, (*probe, *explicit, *rest))


def test_a_typed_mode_replaces_the_setups(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *SOUNDER, "--far-field-only")  # one-way
    data = _same_as_typed(
        run, path, ("--pulse-echo",), (*SOUNDER, "--pulse-echo", "--bandwidth", "0.1")
    )
    assert data["convention"]["mode"] == "pulse-echo"


def test_a_typed_disc_replaces_the_setups_rectangle(run, tmp_path):
    rectangle = ("--length", "20mm", "--width", "10mm", *DISC[2:])
    path, _ = _saved(run, tmp_path, "beam", *rectangle)
    _same_as_typed(run, path, ("--diameter", "12mm"), ("--diameter", "12mm", *DISC[2:]))


def test_section_takes_the_typed_flaw_depth_without_a_warning(run, tmp_path):
    path, _ = _saved(
        run, tmp_path, "beam", *ANGLE, "--thickness", "25mm", "--depth", "10mm", "--depth", "20mm"
    )
    typed = run("section", "--setup", str(path), "--depth", "18mm", "--far-field-only", "--json")
    assert typed.code == 0, typed.stderr
    assert typed.json()["flaw_depth_m"] == pytest.approx(0.018)
    assert "section takes one --depth" not in typed.stderr
    # Without a typed depth the setup's first is used, and the warning says so.
    first = run("section", "--setup", str(path), "--far-field-only", "--json")
    assert first.json()["flaw_depth_m"] == pytest.approx(0.010)
    assert "section takes one --depth; the setup's first (10mm) is used" in first.stderr


def test_save_records_the_typed_options_in_place_of_the_setups(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *DISC, "--depth", "20mm", "--level", "6")
    again, _ = _saved(
        run, tmp_path, "beam", "--setup", str(path), "--depth", "12mm", name="again.toml"
    )
    data = tomllib.loads(again.read_text(encoding="utf-8"))
    assert data["inspection"] == {"depths": ["12mm"], "levels": ["6"]}


# ------------------------------------------------- --save writes .toml files only


@pytest.mark.parametrize("name", ["x.json", "x", "x.toml.bak"])
def test_save_refuses_a_name_that_is_not_toml(run, tmp_path, name):
    target = tmp_path / name
    line = _one_line_refusal(run("beam", *DISC, "--save", str(target)))
    assert f"--save: {str(target)!r} must end in .toml" in line
    assert not target.exists() and list(tmp_path.iterdir()) == []


def test_save_takes_toml_in_any_case(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *DISC, name="Setup.TOML")
    assert tomllib.loads(path.read_text(encoding="utf-8"))["probe"]["diameter"] == "10mm"


# ------------------------------------------------- the warning names only what is unused


def test_map_names_only_what_it_leaves_out_of_a_sonar_setup(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *SOUNDER, "--far-field-only")
    size = ("--depth-points", "6", "--lateral-points", "6", "--json")
    r = run("map", "--setup", str(path), *size)
    assert r.code == 0, r.stderr
    (line,) = [w for w in r.stderr.splitlines() if w.startswith("beamspread: warning: map")]
    assert "--bottom-depth" in line
    assert "--sonar figures (full angles, directivity index, side lobes, absorption)" in line
    assert "levels (-3 and -10 dB)" in line
    assert line.endswith("it does use the one-way mode and bandwidth 0.1, recorded with --sonar")
    # ... and that is true: the map is the one-way, 0.1-bandwidth beam typed in full.
    explicit = run("map", *SOUNDER[:10], "--one-way", "--bandwidth", "0.1", *size)
    assert r.json()["field"] == explicit.json()["field"]
    assert r.json()["field"]["mode"] == "one-way" and r.json()["field"]["bandwidth"] == 0.1
    assert r.json()["amplitude"] == explicit.json()["amplitude"]


# ------------------------------------------------- what --save records, as click resolved it


def test_a_single_valued_option_is_saved_as_one_value(run, tmp_path):
    # index-step takes one --level and section one --depth: each is one item of the file's list.
    path, _ = _saved(
        run, tmp_path, "index-step", *DISC, "--from", "20mm", "--to", "60mm", "--level", "12"
    )
    assert tomllib.loads(path.read_text(encoding="utf-8"))["inspection"] == {"levels": ["12"]}
    wedge = (*ANGLE, "--thickness", "25mm", "--depth", "18mm", "--far-field-only")
    path, _ = _saved(run, tmp_path, "section", *wedge, name="w.toml")
    assert tomllib.loads(path.read_text(encoding="utf-8"))["inspection"] == {"depths": ["18mm"]}


def test_a_setups_first_value_is_saved_where_the_command_takes_one(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *DISC, "--level", "6", "--level", "20")
    again, r = _saved(
        run,
        tmp_path,
        "index-step",
        "--setup",
        str(path),
        "--from",
        "20mm",
        "--to",
        "60mm",
        name="again.toml",
    )
    assert "index-step takes one --level; the setup's first (6) is used" in r.stderr
    assert tomllib.loads(again.read_text(encoding="utf-8"))["inspection"] == {"levels": ["6"]}


def test_a_typed_condition_is_saved_beside_the_setups_others(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *SOUNDER, "--condition", "depth=10m")
    again, _ = _saved(
        run, tmp_path, "beam", "--setup", str(path), "--condition", "depth=50m", name="b.toml"
    )
    medium = tomllib.loads(again.read_text(encoding="utf-8"))["medium"]
    assert medium["conditions"] == {"salinity": "34", "depth": "50m"}
    assert medium["temperature"] == "12 degC"


def test_a_typed_speed_saves_no_material_temperature_or_conditions(run, tmp_path):
    path, _ = _saved(run, tmp_path, "beam", *SOUNDER, "--far-field-only")
    again, _ = _saved(run, tmp_path, "beam", "--setup", str(path), "--speed", "1500", name="b.toml")
    assert tomllib.loads(again.read_text(encoding="utf-8"))["medium"] == {"speed": "1500 m/s"}


def test_help_with_a_setup_reads_no_file(run, tmp_path):
    r = run("beam", "--setup", str(tmp_path / "none.toml"), "--help")
    assert r.code == 0 and "--setup FILE" in r.stdout


def test_save_is_refused_in_its_inline_form_too(run, tmp_path):
    target = tmp_path / "new.toml"
    line = _one_line_refusal(run(*SIZE, f"--save={target}"))
    assert "size does not take --save" in line and not target.exists()
