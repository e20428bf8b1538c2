"""Quantities with units in, SI out: checked against the exact definitions of the units.

Definitions used (all exact): 1 in = 25.4 mm (NIST SP 811, appendix B);
the SI prefixes k = 1e3, M = 1e6, m = 1e-3, u = 1e-6; t/degF = (t/degC) * 9/5 + 32
and T/K = t/degC + 273.15 by definition of the scales; 1 g/cm3 = 1000 kg/m3.
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from beamspread import InputError
from beamspread.units import (
    KINDS,
    format_length,
    parse_density,
    parse_frequency,
    parse_length,
    parse_level,
    parse_quantity,
    parse_speed,
    parse_temperature,
)

INCH = 25.4e-3  # m, exact


@pytest.mark.parametrize(
    ("text", "metres"),
    [
        ("1m", 1.0),
        ("0.5 m", 0.5),
        ("10mm", 10e-3),
        ("10 mm", 10e-3),
        ("250um", 250e-6),
        ("250 µm", 250e-6),
        ("1in", INCH),
        ("0.5 in", 0.5 * INCH),
        ("2.5cm", 25e-3),
        ("1ft", 12 * INCH),
        ("10", 10e-3),
        ("1e1mm", 10e-3),
        (".5in", 0.5 * INCH),
        ("  12.7mm  ", 12.7e-3),
        ("10MM", 10e-3),
        ("3IN", 3 * INCH),
    ],
)
def test_lengths(text, metres):
    assert parse_length(text) == pytest.approx(metres, rel=1e-15)


def test_inch_is_exactly_25_4_mm():
    assert parse_length("1in") == pytest.approx(parse_length("25.4mm"), rel=1e-15)
    assert parse_length("100in") == pytest.approx(2.54, rel=1e-15)


@pytest.mark.parametrize(
    ("text", "hz"),
    [
        ("1Hz", 1.0),
        ("500 Hz", 500.0),
        ("200kHz", 200e3),
        ("200 kHz", 200e3),
        ("5MHz", 5e6),
        ("2.25 MHz", 2.25e6),
        ("5", 5e6),
        ("0.5", 5e5),
        ("5mhz", 5e6),
        ("1GHz", 1e9),
    ],
)
def test_frequencies(text, hz):
    assert parse_frequency(text) == pytest.approx(hz, rel=1e-15)


@pytest.mark.parametrize(
    ("text", "m_s"),
    [
        ("5920m/s", 5920.0),
        ("5920 m/s", 5920.0),
        ("5.92km/s", 5920.0),
        ("5.92 mm/us", 5920.0),
        ("5.92mm/µs", 5920.0),
        ("0.2331in/us", 0.2331 * INCH * 1e6),
        ("1in/µs", INCH * 1e6),
        ("1500", 1500.0),
        ("1000ft/s", 1000 * 12 * INCH),
    ],
)
def test_speeds(text, m_s):
    assert parse_speed(text) == pytest.approx(m_s, rel=1e-14)


@pytest.mark.parametrize(
    ("text", "deg_c"),
    [
        ("20degC", 20.0),
        ("20 °C", 20.0),
        ("20", 20.0),
        ("-5", -5.0),
        ("68degF", 20.0),
        ("32 degF", 0.0),
        ("-40degF", -40.0),
        ("212°F", 100.0),
        ("273.15K", 0.0),
        ("293.15 K", 20.0),
        ("0K", -273.15),
        ("20C", 20.0),
        ("50F", 10.0),
    ],
)
def test_temperatures(text, deg_c):
    assert parse_temperature(text) == pytest.approx(deg_c, abs=1e-12)


@pytest.mark.parametrize(
    ("text", "kg_m3"),
    [("7850", 7850.0), ("7.85 g/cm3", 7850.0), ("1000kg/m3", 1000.0), ("1 g/cm^3", 1000.0)],
)
def test_densities(text, kg_m3):
    assert parse_density(text) == pytest.approx(kg_m3, rel=1e-14)


@pytest.mark.parametrize(
    ("kind", "default"),
    [
        ("length", "mm"),
        ("frequency", "MHz"),
        ("speed", "m/s"),
        ("temperature", "degC"),
        ("density", "kg/m3"),
    ],
)
def test_bare_numbers_take_the_documented_default(kind, default):
    assert KINDS[kind].default == default
    assert parse_quantity("7", kind) == parse_quantity(f"7{default}", kind)
    assert parse_quantity("7", kind) == parse_quantity(f"7 {default}", kind)


def test_an_explicit_default_unit_for_bare_numbers():
    assert parse_quantity("3", "length", default="m") == 3.0
    assert parse_quantity("3mm", "length", default="m") == pytest.approx(3e-3, rel=1e-15)


def test_numbers_pass_through_as_si():
    assert parse_length(0.01) == 0.01
    assert parse_frequency(5e6) == 5e6
    assert parse_temperature(-3) == -3.0


@pytest.mark.parametrize(
    ("parse", "text", "allowed"),
    [
        (parse_length, "10 furlongs", ("m", "mm", "um", "in")),
        (parse_length, "10 km/s", ("mm", "in")),
        (parse_frequency, "5 MHzz", ("Hz", "kHz", "MHz")),
        (parse_speed, "5920 mph", ("m/s", "km/s", "mm/us", "in/us")),
        (parse_temperature, "20 degR", ("degC", "degF", "K")),
        (parse_density, "7 lb/ft3", ("kg/m3", "g/cm3")),
    ],
)
def test_unknown_unit_lists_allowed_units(parse, text, allowed):
    with pytest.raises(InputError) as info:
        parse(text)
    message = str(info.value)
    assert "unknown" in message and repr(text) in message
    for unit in allowed:
        assert unit in message


@pytest.mark.parametrize("text", ["abc", "", "mm", "1,5mm", "ten mm", "1..2mm", "--1mm"])
def test_not_a_number_lists_allowed_units(text):
    with pytest.raises(InputError, match=r"allowed( units)?: m, km, cm, mm"):
        parse_length(text)


@pytest.mark.parametrize("value", [float("nan"), float("inf"), "1e400mm", "1e400"])
def test_non_finite_refused(value):
    with pytest.raises(InputError, match="finite"):
        parse_length(value)


@pytest.mark.parametrize("value", [True, False])
def test_booleans_refused(value):
    with pytest.raises(InputError):
        parse_length(value)


def test_error_names_the_option():
    with pytest.raises(InputError, match=r"^--diameter: "):
        parse_length("10 furlongs", what="--diameter")


def test_input_error_is_a_value_error():
    with pytest.raises(ValueError):
        parse_speed("fast")


# ------------------------------------------------------------------ levels


@pytest.mark.parametrize(
    "text", ["-6", "6", "6dB", "-6 dB", "6 db", " -6dB ", "+6", "6.0", -6, 6, 6.0, -6.0]
)
def test_levels_mean_dB_down(text):
    assert parse_level(text) == 6.0


@pytest.mark.parametrize(
    "text",
    [
        "0",
        "-0",
        "0dB",
        0,
        0.0,
        "abc",
        "6 dBm",
        "dB",
        "",
        float("nan"),
        "nan",
        float("inf"),
        "-inf",
        "200.001",
        201,
        "-250dB",
        "1e3",
    ],
)
def test_bad_levels_refused(text):
    with pytest.raises(InputError):
        parse_level(text)


def test_level_limits_are_inclusive_at_200():
    assert parse_level("200") == 200.0
    assert parse_level("-200 dB") == 200.0
    assert parse_level("1e-3") == 1e-3


def test_level_error_names_the_option():
    with pytest.raises(InputError, match=r"^--level: .*200"):
        parse_level(0, what="--level")


# ------------------------------------------------------------------ formatting


def test_format_length():
    assert format_length(0.0254, "in") == "1.000 in"
    assert format_length(0.0123456, "mm") == "12.35 mm"


# ------------------------------------------------------------------ properties

finite = st.floats(min_value=-1e6, max_value=1e6, allow_nan=False, allow_infinity=False)
positive = st.floats(min_value=1e-6, max_value=1e6, allow_nan=False, allow_infinity=False)


@given(positive)
def test_mm_and_m_agree(value):
    assert parse_length(f"{value * 1000!r}mm") == pytest.approx(
        parse_length(f"{value!r}m"), rel=1e-12
    )


@given(positive)
def test_inches_are_25_4_mm(value):
    assert parse_length(f"{value!r} in") == pytest.approx(
        parse_length(f"{value * 25.4!r} mm"), rel=1e-12
    )


@given(positive)
def test_frequency_prefixes(value):
    hz = parse_frequency(f"{value!r}Hz")
    assert parse_frequency(f"{value / 1e3!r}kHz") == pytest.approx(hz, rel=1e-12)
    assert parse_frequency(f"{value / 1e6!r}MHz") == pytest.approx(hz, rel=1e-12)


@given(finite)
def test_temperature_scales_agree(deg_c):
    deg_f = deg_c * 9.0 / 5.0 + 32.0
    kelvin = deg_c + 273.15
    assert parse_temperature(f"{deg_f!r}degF") == pytest.approx(deg_c, rel=1e-12, abs=1e-9)
    assert parse_temperature(f"{kelvin!r}K") == pytest.approx(deg_c, rel=1e-12, abs=1e-9)
    assert parse_temperature(f"{deg_c!r}") == deg_c


@given(positive)
def test_speed_units_agree(value):
    m_s = parse_speed(f"{value!r}m/s")
    assert parse_speed(f"{value / 1e3!r}km/s") == pytest.approx(m_s, rel=1e-12)
    assert parse_speed(f"{value / 1e3!r} mm/us") == pytest.approx(m_s, rel=1e-12)
    assert parse_speed(f"{value / (INCH * 1e6)!r} in/us") == pytest.approx(m_s, rel=1e-12)


@given(st.floats(min_value=1e-3, max_value=200, allow_nan=False))
def test_level_sign_and_suffix_do_not_matter(level):
    text = repr(level)
    assert parse_level(text) == parse_level(f"-{text}") == parse_level(f"{text} dB") == level
    assert math.isfinite(parse_level(level))
