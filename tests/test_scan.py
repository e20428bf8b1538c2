"""Scan planning: index step = narrowest width x (1 - overlap) (common practice)."""

from __future__ import annotations

import math

import pytest

from beamspread.errors import InputError
from beamspread.field import beam_widths
from beamspread.probes import Disc, Rectangle
from beamspread.scan import (
    far_field_widths,
    field_widths,
    parse_overlap,
    plan_scan,
    plan_scan_for,
)


@pytest.mark.parametrize("overlap", [0.0, 0.1, 0.25, 0.5, 0.9])
def test_step_follows_the_overlap_rule_at_the_narrowest_depth(overlap):
    widths = {0.010: 0.0071, 0.020: 0.0052, 0.030: 0.0049, 0.045: 0.0063}  # invented
    plan = plan_scan(widths, overlap)
    assert plan.governing_depth == 0.030
    assert plan.governing_width == 0.0049
    assert plan.index_step == pytest.approx(0.0049 * (1.0 - overlap), rel=1e-15)
    assert plan.depths == (0.010, 0.020, 0.030, 0.045)
    # No pass spacing larger than the step keeps the overlap at the governing depth.
    assert all(w * (1 - overlap) >= plan.index_step for w in widths.values())


@pytest.mark.parametrize("overlap", [-0.1, 1.0, 1.5, float("nan"), "a", True])
def test_overlap_outside_zero_to_one_is_refused(overlap):
    with pytest.raises(InputError, match="overlap"):
        plan_scan({0.02: 0.005}, overlap)


def test_percentages_and_fractions():
    assert parse_overlap("10%") == pytest.approx(0.10)
    assert parse_overlap("25 %") == pytest.approx(0.25)
    assert parse_overlap("0.1") == pytest.approx(0.1)
    assert parse_overlap(0.25) == 0.25
    for bad in ("100%", "10 percent", "1"):
        with pytest.raises(InputError, match="overlap"):
            parse_overlap(bad)


@pytest.mark.parametrize(
    "widths, message",
    [
        ({}, "at least one depth"),
        ({0.02: None}, "no beam width at depth 20 mm"),
        ({0.02: float("nan")}, "no beam width at depth 20 mm"),
        ({0.02: -1.0}, "beam width at depth 20 mm"),
        ({-0.02: 0.005}, "scan depth"),
    ],
)
def test_bad_widths_are_refused(widths, message):
    with pytest.raises(InputError, match=message):
        plan_scan(widths, 0.1)


def test_field_widths_are_those_of_the_field_engine():
    probe = Disc(0.010, 5e6)
    widths = field_widths(probe, 5920.0, 0.03, 0.06, count=4, refine=False)
    assert list(widths) == pytest.approx([0.03, 0.04, 0.05, 0.06])
    for depth, width in widths.items():
        assert width == beam_widths(probe, 5920.0, depth, [6.0])[0].width


def test_refinement_finds_a_width_no_wider_than_the_samples():
    probe = Disc(0.010, 5e6)
    coarse = field_widths(probe, 5920.0, 0.016, 0.06, count=5, refine=False)
    fine = field_widths(probe, 5920.0, 0.016, 0.06, count=5, refine=True)
    assert min(fine.values()) <= min(coarse.values())
    plan = plan_scan(fine, 0.1)
    assert plan.index_step == pytest.approx(min(fine.values()) * 0.9, rel=1e-15)


def test_far_field_widths_follow_the_cone_and_the_first_depth_governs():
    # Reference: the -6 dB pulse-echo point of the disc pattern, (2 J1(x)/x)^2 = 1/2,
    # solved with scipy; sin(theta) = x lambda / (pi D).
    from scipy.optimize import brentq
    from scipy.special import j1

    x = brentq(lambda x: (2 * j1(x) / x) ** 2 - 10 ** (-6 / 20), 0.1, 3.8)
    probe = Disc(0.010, 5e6)
    lam = 5920.0 / 5e6
    widths = far_field_widths(probe, 5920.0, 0.05, 0.1, count=3)
    theta = math.asin(x * lam / (math.pi * 0.010))
    for depth, width in widths.items():
        assert width == pytest.approx(2 * depth * math.tan(theta), rel=1e-9)
    plan = plan_scan_for(probe, 5920.0, 0.05, 0.1, 0.25, count=3, method="far-field")
    assert plan.governing_depth == pytest.approx(0.05)
    assert plan.method == "far-field" and plan.plane == "diameter" and plan.level_db == 6.0


def test_rectangle_plane_and_bad_inputs():
    probe = Rectangle(0.02, 0.01, 5e6)
    plan = plan_scan_for(probe, 5920.0, 0.08, 0.1, 0.1, count=2, plane="width", refine=False)
    assert plan.plane == "width"
    want = beam_widths(probe, 5920.0, 0.08, [6.0], plane="width")[0].width
    assert plan.governing_width <= want
    with pytest.raises(InputError, match="plane"):
        plan_scan_for(probe, 5920.0, 0.08, 0.1, 0.1, plane="diameter")
    with pytest.raises(InputError, match="method"):
        plan_scan_for(probe, 5920.0, 0.08, 0.1, 0.1, method="guess")
    with pytest.raises(InputError, match="before the first"):
        field_widths(probe, 5920.0, 0.1, 0.08)
    with pytest.raises(InputError, match="depths"):
        field_widths(probe, 5920.0, 0.08, 0.1, count=0)


def test_far_field_widths_inside_the_near_field_are_marked_and_warned():
    # Reference: a disc's last on-axis maximum lies at (D^2 - lambda^2) / (4 lambda)
    # (Kinsler, Frey et al., Fundamentals of Acoustics, the baffled piston; from memory).
    probe = Disc(0.010, 5e6)
    lam = 5920.0 / 5e6
    near = (0.010**2 - lam**2) / (4 * lam)
    plan = plan_scan_for(probe, 5920.0, 0.010, 0.050, 0.25, count=5, method="far-field")
    assert plan.near_field == pytest.approx(near, rel=1e-12)
    assert plan.far_field_valid == tuple(d >= near for d in plan.depths)
    assert plan.far_field_valid == (False, False, True, True, True)
    assert plan.governing_depth == pytest.approx(0.010)
    assert plan.governing_far_field_valid is False
    (warning,) = plan.warnings
    assert warning.startswith("depths 10 mm to 20 mm lie inside the near field (20.82 mm)")
    beyond = plan_scan_for(probe, 5920.0, 0.030, 0.050, 0.25, count=3, method="far-field")
    assert beyond.governing_far_field_valid is True and beyond.warnings == ()


def test_field_plans_carry_the_near_field_and_warn_only_very_close_to_the_face():
    probe = Disc(0.010, 5e6)
    plan = plan_scan_for(probe, 5920.0, 0.016, 0.030, 0.1, count=3, refine=False)
    assert plan.far_field_valid is None and plan.governing_far_field_valid is None
    assert plan.near_field is not None and plan.warnings == ()
    # Below 0.05 N = 0.05 D^2 / (4 lambda) the computed field is not validated
    # (the limit beam's results use for the same engine).
    simple = 0.010**2 / (4 * 5920.0 / 5e6)
    close = plan_scan_for(probe, 5920.0, 0.5 * 0.05 * simple, 0.030, 0.1, count=3, refine=False)
    (warning,) = close.warnings
    assert "closer than 0.05 N" in warning
