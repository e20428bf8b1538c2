"""The inverse solver round-trips through the forward model and refuses what has no answer."""

from __future__ import annotations

import math

import numpy as np
import pytest

from beamspread import Disc, InputError, Rectangle, analyse, disc_near_field
from beamspread.design import solvers


@pytest.mark.parametrize("mode", ["one-way", "pulse-echo"])
@pytest.mark.parametrize("level", [3.0, 6.0, 10.0, 20.0])
@pytest.mark.parametrize(
    ("frequency", "speed", "full"),
    [
        (200e3, 1500.0, 20.0),
        (50e3, 1480.0, 45.0),
        (40e3, 343.0, 60.0),
        (5e6, 5920.0, 8.0),
    ],
)
def test_disc_diameter_round_trips(frequency, speed, full, level, mode):
    # Forward model: beamspread.analyse of the solved disc gives back the target angle.
    solved = solvers.size_disc(frequency, speed, full_angle_deg=full, level_db=level, mode=mode)
    result = analyse(Disc(solved.diameter, frequency), speed, levels=[level], mode=mode)
    half = result.planes[0].half_angles[f"-{level:g}"]
    assert 2.0 * half == pytest.approx(full, rel=1e-9)
    assert solved.full_angle_deg == pytest.approx(full, rel=1e-12)
    if result.near_field is None:  # an element no larger than the wavelength
        assert math.isnan(solved.near_field)
    else:
        assert solved.near_field == pytest.approx(result.near_field, rel=1e-12)


@pytest.mark.parametrize(("diameter", "half"), [(0.025, 10.0), (0.01, 3.0), (0.05, 30.0)])
def test_frequency_round_trips(diameter, half):
    solved = solvers.size_frequency(
        diameter, 1500.0, half_angle_deg=half, level_db=6, mode="pulse-echo"
    )
    result = analyse(Disc(diameter, solved.frequency), 1500.0, levels=[6], mode="pulse-echo")
    assert result.planes[0].half_angles["-6"] == pytest.approx(half, rel=1e-9)


def test_rectangle_side_round_trips():
    solved = solvers.size_rectangle_side(
        2.25e6, 5920.0, 0.01, half_angle_deg=5.0, level_db=6, mode="pulse-echo"
    )
    result = analyse(
        Rectangle(solved.aperture, 0.01, 2.25e6), 5920.0, levels=[6], mode="pulse-echo"
    )
    length, width = result.planes
    assert length.half_angles["-6"] == pytest.approx(5.0, rel=1e-9)
    assert width.half_angles["-6"] == pytest.approx(solved.other_half_angle_deg, rel=1e-12)
    assert solved.near_field == pytest.approx(result.near_field, rel=1e-12)


def test_spot_at_depth_round_trips():
    # An inspector's question: a -6 dB pulse-echo spot of 6 mm at 40 mm in water at 5 MHz.
    solved = solvers.size_disc(5e6, 1480.0, spot=0.006, depth=0.040, level_db=6, mode="pulse-echo")
    result = analyse(
        Disc(solved.diameter, 5e6), 1480.0, levels=[6], depths=[0.040], mode="pulse-echo"
    )
    spot = result.planes[0].spots[0]
    assert spot.width == pytest.approx(0.006, rel=1e-9) and spot.far_field_valid
    assert solved.footprint_width == pytest.approx(0.006, rel=1e-12)
    assert solved.far_field_at_depth


def test_spot_against_krautkramer_constant():
    # Krautkramer & Krautkramer Table 4.2: echo field -6 dB, sin(theta) = 0.51 lambda / D
    # (two decimals, so within 1 %).
    solved = solvers.size_disc(5e6, 1480.0, spot=0.006, depth=0.040, level_db=6, mode="pulse-echo")
    theta = math.atan(0.003 / 0.040)
    assert solved.diameter == pytest.approx(0.51 * (1480.0 / 5e6) / math.sin(theta), rel=0.01)


def test_vectorised_over_targets():
    angles = np.array([10.0, 20.0, 40.0])
    frequencies = np.array([[100e3], [200e3]])
    solved = solvers.size_disc(frequencies, 1500.0, full_angle_deg=angles)
    assert solved.diameter.shape == (2, 3)
    for i, f in enumerate(frequencies[:, 0]):
        for j, a in enumerate(angles):
            one = solvers.size_disc(f, 1500.0, full_angle_deg=a)
            assert solved.diameter[i, j] == pytest.approx(one.diameter, rel=1e-14)
    # Halving the wavelength halves the diameter (sin(theta) = k lambda / D).
    assert np.allclose(solved.diameter[1] / solved.diameter[0], 0.5, rtol=1e-12)


@pytest.mark.parametrize(
    "bad",
    [
        dict(full_angle_deg=180.0),
        dict(full_angle_deg=200.0),
        dict(half_angle_deg=90.0),
        dict(half_angle_deg=-5.0),
    ],
)
def test_angles_no_element_gives_are_refused(bad):
    with pytest.raises(InputError) as info:
        solvers.size_disc(200e3, 1500.0, **bad)
    assert "\n" not in str(info.value)


def test_spot_inside_the_near_field_is_refused_and_the_smallest_is_named():
    args = dict(level_db=6, mode="pulse-echo")
    with pytest.raises(InputError, match="near field") as info:
        solvers.size_disc(5e6, 1480.0, spot=0.001, depth=0.040, **args)
    smallest = solvers.smallest_spot(5e6, 1480.0, 0.040, **args)
    assert f"{smallest * 1e3:.4g} mm" in str(info.value)
    # The smallest far-field spot is that of the disc whose near field (the exact last
    # on-axis maximum, (D^2 - lambda^2) / (4 lambda), Kinsler et al.) ends at the depth.
    edge = solvers.size_disc(5e6, 1480.0, spot=smallest * (1 + 1e-9), depth=0.040, **args)
    assert float(disc_near_field(edge.diameter, 1480.0 / 5e6)) == pytest.approx(0.040, rel=1e-6)
    with pytest.raises(InputError):
        solvers.size_disc(5e6, 1480.0, spot=smallest * (1 - 1e-6), depth=0.040, **args)


def test_impossible_spots_give_nan_when_asked():
    solved = solvers.size_disc(
        5e6,
        1480.0,
        spot=[0.001, 0.006],
        depth=0.040,
        level_db=6,
        mode="pulse-echo",
        on_impossible="nan",
    )
    assert math.isnan(solved.diameter[0]) and solved.diameter[1] > 0
    assert list(solved.far_field_at_depth) == [False, True]


def test_one_target_only():
    with pytest.raises(InputError, match="one target"):
        solvers.size_disc(200e3, 1500.0, full_angle_deg=20.0, half_angle_deg=10.0)
    with pytest.raises(InputError, match="depth"):
        solvers.size_disc(200e3, 1500.0, spot=0.5)


def test_footprint_and_directivity_of_an_angle_solution():
    # The footprint of the solved cone at a depth is 2 z tan(half) (geometry), and the DI is
    # that of the solved disc.
    from beamspread.sonar.directivity import directivity_index

    solved = solvers.size_disc(200e3, 1500.0, full_angle_deg=20.0, depth=30.0)
    assert solved.footprint_width == pytest.approx(2 * 30.0 * math.tan(math.radians(10.0)))
    assert solved.directivity_index_db == pytest.approx(
        directivity_index(Disc(solved.diameter, 200e3), 1500.0 / 200e3), rel=1e-12
    )
