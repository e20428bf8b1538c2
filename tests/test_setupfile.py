"""Setup files: round trips, refusals naming file, key and line, no overwrite without force."""

from __future__ import annotations

import sys

import pytest

from beamspread.errors import InputError
from beamspread.setupfile import Setup, dumps_setup, load_setup, parse_setup, save_setup
from beamspread.units import parse_quantity

if sys.version_info >= (3, 11):
    import tomllib
else:  # Python 3.10
    import tomli as tomllib

FULL = Setup(  # an invented technique
    frequency="5 MHz",
    diameter="10 mm",
    focus="60 mm",
    material="reference-steel",
    wave="shear",
    temperature="20 degC",
    conditions=(("pressure", "1 bar"),),
    wedge="acrylic",
    refracted="45 deg",
    wedge_path="12.5 mm",
    thickness="25 mm",
    depths=("20 mm", "40 mm"),
    levels=("-6 dB", "20"),
    mode="one-way",
    bandwidth=0.5,
    spectrum="flat",
    frequencies=24,
    title='Plate "A", 45°',
    description="line 1\nline 2",
)
SMALL = Setup(
    frequency="200 kHz",
    shape="rectangle",
    length="40 mm",
    width="20 mm",
    speed="1480 m/s",
    water_path="30 mm",
    couplant="water",
)
SONAR = Setup(  # an invented echo sounder over a flat bottom
    frequency="200 kHz",
    diameter="25 mm",
    material="seawater",
    temperature="12 degC",
    conditions=(("salinity", "34"),),
    bottom_depths=("10 m:40 m:10 m", "55 m"),
    power="150 W",
    efficiency=0.4,
    bottom_loss="12 dB",
    sonar=True,
    mode="one-way",
    bandwidth=0.1,
)


@pytest.mark.parametrize("setup", [FULL, SMALL, SONAR], ids=["full", "small", "sonar"])
def test_round_trip_through_a_file(tmp_path, setup):
    path = save_setup(setup, tmp_path / "s.toml")
    assert load_setup(path) == setup
    # The file is plain TOML that tomllib (not our reader) reads back to the same values.
    data = tomllib.loads(path.read_text(encoding="utf-8"))
    assert data["format"] == 1
    assert data["probe"]["frequency"] == setup.frequency


@pytest.mark.parametrize("setup", [FULL, SMALL, SONAR], ids=["full", "small", "sonar"])
def test_round_trip_through_the_options(setup):
    options = setup.to_options()
    again = Setup.from_options(options, title=setup.title, description=setup.description)
    assert again == setup


def test_options_name_the_command_line():
    options = FULL.to_options()
    assert options["--diameter"] == "10 mm"
    assert options["--frequency"] == "5 MHz"
    assert options["--refracted"] == "45 deg"
    assert options["--wedge"] == "acrylic"
    assert options["--wedge-path"] == "12.5 mm"
    assert options["--thickness"] == "25 mm"
    assert options["--focus"] == "60 mm"
    assert options["--depth"] == ["20 mm", "40 mm"]
    assert options["--condition"] == ["pressure=1 bar"]
    assert options["--one-way"] is True and "--pulse-echo" not in options
    assert SMALL.to_options()["--water-path"] == "30 mm"
    args = SMALL.to_args()
    assert args[args.index("--couplant") + 1] == "water"
    # No mode recorded: none is passed, and the command's own default applies.
    assert "--pulse-echo" not in args and "--one-way" not in args


def test_si_numbers_from_a_command_line_keep_their_value():
    setup = Setup.from_options(
        {
            "--diameter": 0.0127,
            "--frequency": 2.25e6,
            "--speed": 5920.0,
            "--depth": (0.05,),
            "--bandwidth": "0.4",
        }
    )
    assert parse_quantity(setup.diameter, "length") == pytest.approx(0.0127, rel=1e-12)
    assert parse_quantity(setup.frequency, "frequency") == pytest.approx(2.25e6, rel=1e-12)
    assert setup.bandwidth == 0.4
    with pytest.raises(InputError, match="--plot"):
        Setup.from_options({"--plot": "x.png", "--frequency": "1 MHz"})


def _text(**replace):
    text = dumps_setup(FULL)
    for old, new in replace.items():
        text = text.replace(old, new)
    return text


def test_unknown_key_is_named_with_its_line(tmp_path):
    path = tmp_path / "bad.toml"
    path.write_text(dumps_setup(FULL).replace("diameter =", "diamter ="), encoding="utf-8")
    line = path.read_text().splitlines().index('diamter = "10 mm"') + 1
    with pytest.raises(InputError) as info:
        load_setup(path)
    message = str(info.value)
    assert f"{path}:{line}:" in message
    assert "probe.diamter" in message and "unknown key" in message


def test_unknown_section_and_top_level_key():
    with pytest.raises(InputError, match="key 'extras': unknown section"):
        parse_setup(dumps_setup(SMALL) + "\n[extras]\nx = 1\n")
    with pytest.raises(InputError, match="key 'colour': unknown key"):
        parse_setup('format = 1\ncolour = "red"\n' + dumps_setup(SMALL).split("\n", 1)[1])


@pytest.mark.parametrize(
    "old, new, message",
    [
        ('"10 mm"', '"10 MHz"', "probe.diameter.*unknown length unit 'MHz'"),
        ('"5 MHz"', "5", "probe.frequency.*has no unit"),
        ('"5 MHz"', '"5"', "probe.frequency.*has no unit"),
        ('"45 deg"', '"45 mm"', "wedge.refracted.*unknown angle unit"),
        ('"20 degC"', '"20 m/s"', "medium.temperature.*unknown temperature unit"),
        ('mode = "one-way"', 'mode = "both"', "conventions.mode.*one-way"),
        ("bandwidth = 0.5", "bandwidth = 7.0", "conventions.bandwidth"),
        ('"-6 dB"', '"-6 dBm"', "inspection.levels"),
    ],
)
def test_wrong_units_and_values_are_named(old, new, message):
    text = dumps_setup(FULL)
    assert old in text
    bad = text.replace(old, new, 1)
    with pytest.raises(InputError, match=message) as info:
        parse_setup(bad, "t.toml")
    line = next(i for i, s in enumerate(bad.splitlines(), 1) if s.endswith(new) or f"[{new}," in s)
    assert str(info.value).startswith(f"t.toml:{line}:")


def test_format_syntax_and_combinations():
    with pytest.raises(InputError, match="format"):
        parse_setup(dumps_setup(SMALL).replace("format = 1", "format = 2"))
    with pytest.raises(InputError, match="'format' is missing"):
        parse_setup(dumps_setup(SMALL).replace("format = 1\n", ""))
    with pytest.raises(InputError, match="not valid TOML"):
        parse_setup("format = 1\n[probe\n")
    with pytest.raises(InputError, match="either a material or a speed"):
        parse_setup(
            dumps_setup(SMALL).replace(
                'speed = "1480 m/s"', 'material = "water"\nspeed = "1480 m/s"'
            )
        )
    with pytest.raises(InputError, match="rectangle takes a length and a width"):
        Setup(frequency="1 MHz", shape="rectangle", length="10 mm", speed="1480 m/s")
    with pytest.raises(InputError, match="disc takes a diameter"):
        Setup(frequency="1 MHz", speed="1480 m/s")


def test_save_refuses_to_overwrite_without_force(tmp_path):
    path = tmp_path / "s.toml"
    path.write_text("keep me", encoding="utf-8")
    with pytest.raises(InputError, match="exists; it is kept") as refused:
        save_setup(SMALL, path)
    assert refused.value.remedy == ("force", None)  # the CLI names its flag, the core does not
    assert path.read_text() == "keep me"
    save_setup(SMALL, path, force=True)
    assert load_setup(path) == SMALL
    with pytest.raises(InputError, match="does not exist"):
        save_setup(SMALL, tmp_path / "no" / "s.toml")
    assert sorted(p.name for p in tmp_path.iterdir()) == ["s.toml"]
    with pytest.raises(InputError, match="no such setup file"):
        load_setup(tmp_path / "missing.toml")


def test_sonar_and_bottom_are_recorded_in_our_keys():
    data = tomllib.loads(dumps_setup(SONAR))
    assert data["conventions"] == {"sonar": True, "mode": "one-way", "bandwidth": 0.1}
    assert data["bottom"] == {
        "depths": ["10 m:40 m:10 m", "55 m"],
        "power": "150 W",
        "efficiency": 0.4,
        "loss": "12 dB",
    }
    options = SONAR.to_options()
    # The command line takes --power in W and --bottom-loss in dB as bare numbers.
    assert options["--sonar"] is True
    assert options["--bottom-depth"] == ["10 m:40 m:10 m", "55 m"]
    assert (options["--power"], options["--efficiency"], options["--bottom-loss"]) == (
        "150",
        "0.4",
        "12",
    )
    # A file may say 2 kW (SI prefix: 2000 W); the command line gets 2000, and a
    # command line's bare 2000 is written back as 2000 W.
    assert Setup(**{**_fields(SONAR), "power": "2 kW"}).to_options()["--power"] == "2000"
    assert Setup.from_options({**options, "--power": "2000"}).power == "2000 W"


def _fields(setup):
    from dataclasses import fields

    return {f.name: getattr(setup, f.name) for f in fields(setup)}


def test_sonar_false_and_no_mode_mean_the_commands_defaults():
    plain = Setup(frequency="1 MHz", diameter="10 mm", speed="1480 m/s", sonar=False)
    assert plain.sonar is None and plain.mode is None
    assert plain.to_options() == {
        "--diameter": "10 mm",
        "--frequency": "1 MHz",
        "--speed": "1480 m/s",
    }
    assert "[conventions]" not in dumps_setup(plain)


def test_depth_ranges_keep_their_units():
    setup = Setup(
        frequency="5 MHz", diameter="10 mm", speed="5920 m/s", depths=("10 mm:50 mm:10 mm",)
    )
    assert parse_setup(dumps_setup(setup)).depths == ("10 mm:50 mm:10 mm",)


@pytest.mark.parametrize(
    "old, new, message",
    [
        ('power = "150 W"', 'power = "150"', "bottom.power.*has no unit"),
        ('power = "150 W"', "power = 150", "bottom.power.*with its unit"),
        ('power = "150 W"', 'power = "150 hp"', "bottom.power.*unknown power unit 'hp'"),
        ('power = "150 W"', 'power = "0 W"', "bottom.power.*above 0"),
        ("efficiency = 0.4", "efficiency = 1.5", "bottom.efficiency.*at most 1"),
        ('loss = "12 dB"', 'loss = "-3 dB"', "bottom.loss.*0 or more"),
        ('"55 m"', '"55"', "bottom.depths.*has no unit"),
        ('"10 m:40 m:10 m"', '"40 m:10 m:10 m"', "bottom.depths.*lies before the start"),
        ('"10 m:40 m:10 m"', '"10 m:40 m"', "bottom.depths.*START:STOP:STEP"),
        ("sonar = true", 'sonar = "yes"', "conventions.sonar.*true or false"),
    ],
)
def test_wrong_bottom_and_sonar_values_are_named_with_their_line(old, new, message):
    text = dumps_setup(SONAR)
    assert old in text
    bad = text.replace(old, new, 1)
    with pytest.raises(InputError, match=message) as info:
        parse_setup(bad, "t.toml")
    line = next(i for i, s in enumerate(bad.splitlines(), 1) if new in s)
    assert str(info.value).startswith(f"t.toml:{line}:")


def test_bottom_combinations_are_refused():
    with pytest.raises(InputError, match="give its power too"):
        Setup(**{**_fields(SONAR), "power": None})
    with pytest.raises(InputError, match="needs the bottom's depths"):
        Setup(**{**_fields(SONAR), "bottom_depths": ()})
    with pytest.raises(InputError, match="bare transducer in water"):
        Setup(**{**_fields(SONAR), "wedge": "acrylic"})
