"""Each element type answers for itself, checked against references outside the package.

References: the far-field patterns 2 J1(x)/x and sin(x)/x and their zeros and levels from
scipy.special (Kinsler & Frey, the baffled piston); the disc's near field (D² - λ²)/4λ
(Kinsler & Frey) and D²/4λ (common practice); on-axis fields of a rectangle and an ellipse
by scipy.integrate.quad of the edge integral (Zemanek 1971), written here; O'Neil's paraxial
focal amplitude k a²/2F and the Fresnel integrals of scipy.special for a cylindrical focus;
the directivity factor (ka)²/(1 - J1(2ka)/ka) (Kinsler & Frey) and Urick's equivalent beam
angle by scipy quadrature; the wedge's cos(refracted)/cos(incident) aperture (common
practice). The last test scans the package source: no module outside beamspread/probes/
asks which element type it has.
"""

from __future__ import annotations

import ast
import math
from dataclasses import dataclass
from pathlib import Path

import numpy as np
import pytest
import scipy.integrate
import scipy.optimize
import scipy.special

import beamspread
from beamspread import Disc, InputError, Rectangle, analyse
from beamspread.field import field_map, focused_pressure, pressure
from beamspread.field.interface import Crossing
from beamspread.probes import Element, Ellipse, check_element, element_class, kinds
from beamspread.scan import plan_scan_for
from beamspread.sonar.directivity import directivity_index

LAM = 5920.0 / 5e6  # 1.184 mm: 5 MHz in steel
EXAMPLES = {
    "disc": Disc(0.0127, 5e6),
    "rectangle": Rectangle(0.020, 0.010, 5e6),
    "ellipse": Ellipse(0.009, 0.0127, 5e6),
}


def test_every_known_type_has_an_example_and_answers_every_question():
    assert set(kinds()) == set(EXAMPLES)
    assert set(kinds(probe=True)) == {"disc", "rectangle"}
    for element in EXAMPLES.values():
        assert element.planes and element.sizes() and element.area > 0
        assert element.near_field(LAM).simple > 0
        assert element.lateral(np.array([0.001]), np.array([0.002]), 1e-14)[1].size == 1
        assert element.symmetry in ("axial", "two-plane")
        assert element.noun and element.near_field_label and element.simple_near_field_label


# ---- far field: first nulls and levels against scipy.special -------------------------


def test_disc_first_null_is_1_2197_lambda_over_d():
    # scipy.special.jn_zeros: the first zero of J1 is 3.8317; sin(theta) = j11/pi lambda/D.
    j11 = scipy.special.jn_zeros(1, 1)[0]
    disc = EXAMPLES["disc"]
    assert math.sin(disc.first_null(LAM)) == pytest.approx(j11 / math.pi * LAM / 0.0127, 1e-12)
    assert j11 / math.pi == pytest.approx(1.2197, abs=1e-4)


@pytest.mark.parametrize("plane, side", [("length", 0.020), ("width", 0.010)])
def test_rectangle_first_null_is_lambda_over_side_in_each_plane(plane, side):
    rect = EXAMPLES["rectangle"]
    assert math.sin(rect.first_null(LAM, plane)) == pytest.approx(LAM / side, 1e-12)


@pytest.mark.parametrize("mode, power", [("one-way", 1), ("pulse-echo", 2)])
@pytest.mark.parametrize("level", [3.0, 6.0, 20.0])
def test_level_crossings_against_scipy_root_finding(level, mode, power):
    target = 10 ** (-level / 20)

    def jinc(x):
        return 2 * scipy.special.j1(x) / x

    def sinc(x):
        return np.sin(x) / x

    for element, pattern, plane, zero in (
        (EXAMPLES["disc"], jinc, "diameter", scipy.special.jn_zeros(1, 1)[0]),
        (EXAMPLES["rectangle"], sinc, "width", math.pi),
    ):
        x = scipy.optimize.brentq(lambda x, f=pattern: f(x) ** power - target, 1e-9, zero)
        expected = math.asin(x * LAM / (math.pi * element.aperture(plane)))
        got = float(element.half_angle(level, LAM, mode, plane))
        assert got == pytest.approx(expected, rel=1e-9)
        assert float(element.level_x(level, mode)) == pytest.approx(x, rel=1e-9)
        theta = np.array([0.01, 0.03])
        values = pattern(math.pi * element.aperture(plane) * np.sin(theta) / LAM) ** power
        assert element.directivity(theta, LAM, mode, plane) == pytest.approx(values, rel=1e-9)


def test_the_ellipse_takes_each_planes_pattern_as_a_discs():
    ellipse = EXAMPLES["ellipse"]
    j11 = scipy.special.jn_zeros(1, 1)[0]
    for plane, aperture in ellipse.planes:
        assert math.sin(ellipse.first_null(LAM, plane)) == pytest.approx(
            j11 / math.pi * LAM / aperture
        )


# ---- near field ------------------------------------------------------------------------


def _edge_axis(edge, z, lam):
    """|p|/(rho c U0) on the axis by the edge integral (Zemanek 1971), with scipy.integrate.quad.

    |p| = |(1/2 pi) * integral over phi of (1 - exp(-ik(R(phi) - z)))|, R = sqrt(z² + rho(phi)²),
    rho(phi) the distance from the centre to the edge; a quarter times four (mirror symmetry).
    """
    k = 2 * math.pi / lam

    def part(f):
        return scipy.integrate.quad(f, 0, math.pi / 2, limit=400, epsabs=1e-12)[0]

    def theta(phi):
        r = edge(phi)
        return k * (math.sqrt(z * z + r * r) - z)

    re = part(lambda p: 1 - math.cos(theta(p)))
    im = part(lambda p: math.sin(theta(p)))
    return 4 / (2 * math.pi) * math.hypot(re, im)


def _last_maximum(edge, guess, lam):
    found = scipy.optimize.minimize_scalar(
        lambda z: -_edge_axis(edge, z, lam),
        bracket=(0.9 * guess, guess, 1.1 * guess),
        options={"xtol": 1e-10},
    )
    return found.x


def test_disc_near_field_is_kinsler_frey_closed_form():
    d = 0.0127
    found = EXAMPLES["disc"].near_field(LAM)
    assert found.length == pytest.approx((d * d - LAM * LAM) / (4 * LAM), rel=1e-12)
    assert found.simple == pytest.approx(d * d / (4 * LAM), rel=1e-12)  # common practice
    assert found.factor is None


def test_rectangle_near_field_against_scipy_edge_integral():
    a, b = 0.010, 0.005

    def edge(phi):
        return min(a / math.cos(phi), b / math.sin(phi)) if 0 < phi < math.pi / 2 else a

    found = EXAMPLES["rectangle"].near_field(LAM)
    expected = _last_maximum(edge, found.length, LAM)
    assert found.length == pytest.approx(expected, rel=1e-6)
    assert found.simple == pytest.approx(0.020**2 / (4 * LAM), rel=1e-12)
    assert found.factor == pytest.approx(found.length / found.simple, rel=1e-12)


def test_ellipse_near_field_against_scipy_edge_integral_and_a_circle():
    a, b = 0.0045, 0.00635

    def edge(phi):
        return a * b / math.hypot(b * math.cos(phi), a * math.sin(phi))

    found = EXAMPLES["ellipse"].near_field(LAM)
    assert found.length == pytest.approx(_last_maximum(edge, found.length, LAM), rel=1e-6)
    circle = Ellipse(0.0127, 0.0127, 5e6).near_field(LAM).length
    assert circle == pytest.approx((0.0127**2 - LAM**2) / (4 * LAM), rel=1e-7)  # Kinsler & Frey


# ---- the field engine: boundary tables and symmetry ----------------------------------


def test_each_boundary_table_gives_kinsler_frey_on_the_axis_of_a_circle():
    """A disc and a circular ellipse: 2|sin(k/2 (sqrt(z² + a²) - z))| (Kinsler & Frey)."""
    z = np.array([0.005, 0.02, 0.034, 0.08])
    a = 0.00635
    k = 2 * math.pi / LAM
    expected = 2 * np.abs(np.sin(k / 2 * (np.sqrt(z * z + a * a) - z)))
    for element in (Disc(0.0127, 5e6), Ellipse(0.0127, 0.0127, 5e6)):
        got = np.abs(pressure(element, 5920.0, 0.0, 0.0, z))
        assert got == pytest.approx(expected, abs=1e-6)


def test_lateral_positions_reduce_by_the_symmetry_each_type_states():
    rng = np.random.default_rng(3)
    x, y = rng.uniform(-0.01, 0.01, (2, 50))
    xs = np.concatenate([x, -x, y, x])
    ys = np.concatenate([y, y, x, -y])
    disc_keys, disc_back = EXAMPLES["disc"].lateral(xs, ys, 1e-14)
    assert disc_keys[0].size == 50  # axial: (x, y), (-x, y), (y, x), (x, -y) share a radius
    assert disc_keys[0][disc_back] == pytest.approx(np.hypot(xs, ys), abs=1e-13)
    rect_keys, rect_back = EXAMPLES["rectangle"].lateral(xs, ys, 1e-14)
    assert rect_keys[0].size == 100  # mirrors only: (y, x) is another position
    assert rect_keys[0][rect_back] == pytest.approx(np.abs(xs), abs=1e-13)
    assert rect_keys[1][rect_back] == pytest.approx(np.abs(ys), abs=1e-13)


@pytest.mark.parametrize("kind", ["disc", "rectangle"])
def test_face_nodes_integrate_the_face_area(kind):
    element = EXAMPLES[kind]
    u, v, weight, curved = element.face_nodes(2 * math.pi / LAM, 0.5, lambda p: int(p) + 12)
    assert weight.sum() == pytest.approx(element.area, rel=1e-12)
    assert element.area == pytest.approx(
        math.pi / 4 * 0.0127**2 if kind == "disc" else 0.020 * 0.010, rel=1e-15
    )
    # a spherical focus curves the face in both directions, a cylindrical one along x only
    assert curved == pytest.approx(u * u + v * v if kind == "disc" else u * u)


# ---- the focus -------------------------------------------------------------------------


def test_spherical_focus_at_the_focal_point_is_k_a2_over_2f():
    disc, f, c = Disc(0.0127, 5e6), 0.05, 1480.0
    k = 2 * math.pi * 5e6 / c
    got = disc.focused_pressures(f, np.array([0.0]), np.array([f]), np.array([k]), "diameter")
    assert float(got[0, 0, 0]) == pytest.approx(k * 0.00635**2 / (2 * f), rel=1e-9)  # O'Neil
    assert disc.focus_kind == "spherical" and disc.focused_half_aperture == 0.00635


def test_cylindrical_focus_at_the_focal_line_against_fresnel_integrals():
    """Paraxial: |p| = k/(2 pi F) * 2a * |integral over the width of exp(-i k eta²/2F)|."""
    rect, f, c = Rectangle(0.020, 0.010, 5e6, focus=0.05), 0.05, 1480.0
    k = 2 * math.pi * 5e6 / c
    b = 0.005
    scale = math.sqrt(k / (math.pi * f))  # scipy's fresnel: S, C of sqrt(2/pi) * sqrt(k/2F) eta
    s, cc = scipy.special.fresnel(b * scale)
    width_integral = 2 * math.hypot(cc, s) / scale
    expected = k / (2 * math.pi * f) * 0.020 * width_integral
    got = rect.focused_pressures(f, np.array([0.0]), np.array([f]), np.array([k]), "length")
    assert float(got[0, 0, 0]) == pytest.approx(expected, rel=1e-9)
    assert rect.focus_kind == "cylindrical" and rect.focused_plane == "length"


def test_the_ellipse_cannot_be_focused_or_sit_on_a_wedge():
    ellipse = EXAMPLES["ellipse"]
    assert ellipse.focus_kind is None
    with pytest.raises(InputError, match="ellipse cannot be focused"):
        _ = ellipse.focused_half_aperture
    with pytest.raises(InputError, match="cannot sit on a wedge"):
        ellipse.seen_through_wedge(0.3, 0.6)


# ---- through a wedge: the virtual element ---------------------------------------------


def test_wedge_view_shortens_the_incidence_plane_by_cos_refracted_over_cos_incident():
    alpha, beta = math.radians(36.7), math.radians(60.0)
    ratio = math.cos(beta) / math.cos(alpha)  # common practice
    view = EXAMPLES["disc"].seen_through_wedge(alpha, beta)
    assert isinstance(view.virtual, Ellipse)
    assert view.virtual.length == pytest.approx(0.0127 * ratio, rel=1e-12)
    assert view.virtual.width == 0.0127
    assert view.simple_square == pytest.approx(0.0127**2 * ratio, rel=1e-12)  # equal area
    view = EXAMPLES["rectangle"].seen_through_wedge(alpha, beta)
    assert isinstance(view.virtual, Rectangle)
    assert (view.virtual.length, view.virtual.width) == pytest.approx((0.020 * ratio, 0.010))
    assert view.simple_square == pytest.approx(max(0.020 * ratio, 0.010) ** 2)


# ---- sonar figures -------------------------------------------------------------------


def test_disc_directivity_factor_and_beam_angle_against_scipy():
    disc, lam = Disc(0.025, 200e3), 1500.0 / 200e3
    ka = math.pi * 0.025 / lam
    q = ka**2 / (1 - scipy.special.j1(2 * ka) / ka)  # Kinsler & Frey
    assert disc.directivity_factor(lam) == pytest.approx(q, rel=1e-10)

    def integrand(theta):
        x = ka * math.sin(theta)
        d = 1.0 if x == 0 else 2 * scipy.special.j1(x) / x
        return d**4 * math.sin(theta)

    psi = 2 * math.pi * scipy.integrate.quad(integrand, 0, math.pi / 2, limit=400)[0]  # Urick
    assert disc.equivalent_beam_angle(lam) == pytest.approx(psi, rel=1e-6)


def test_rectangle_directivity_factor_tends_to_4_pi_area_over_lambda2():
    rect = Rectangle(0.5, 0.4, 200e3)  # 67 x 53 wavelengths
    lam = 1500.0 / 200e3
    assert rect.directivity_factor(lam) == pytest.approx(4 * math.pi * rect.area / lam**2, rel=1e-3)


# ---- words, sizes and the register of types -------------------------------------------


def test_sizes_captions_and_words():
    disc, rect = EXAMPLES["disc"], EXAMPLES["rectangle"]
    assert disc.dimensions() == {"diameter_m": 0.0127}
    assert rect.dimensions() == {"length_m": 0.020, "width_m": 0.010}
    assert disc.caption() == "disc 12.7 mm"
    assert rect.caption() == "rectangle 20 x 10 mm"
    assert element_class("rectangle") is Rectangle
    assert element_class("disc")(**disc.sizes(), frequency=5e6) == disc


@dataclass(frozen=True)
class Square:
    """An element type the package does not know."""

    side: float = 0.01
    frequency: float = 5e6


class Hexagon(Element):
    """A subclass the register does not hold is no known type either."""

    shape = "hexagon"


@pytest.mark.parametrize("thing", [Square(), Hexagon(), (0.01, 5e6), None])
def test_an_unknown_element_type_is_refused_in_one_line(thing):
    with pytest.raises(InputError) as caught:
        check_element(thing)
    message = str(caught.value)
    assert "\n" not in message
    assert message.startswith("element: ") and "disc, rectangle" in message
    with pytest.raises(InputError, match="not an element type"):
        analyse(thing, 5920.0)
    with pytest.raises(InputError, match="not an element type"):
        pressure(thing, 5920.0, 0.0, 0.0, 0.01)
    with pytest.raises(InputError, match="not an element type"):
        beamspread.Technique(thing, beamspread.PartMedium(speed=5920.0))
    for call in (
        lambda: focused_pressure(thing, 1480.0, 0.05, [0.0], [0.05]),
        lambda: field_map(thing, 5920.0, [0.0, 0.001], [0.01, 0.02]),
        lambda: plan_scan_for(thing, 5920.0, 0.01, 0.05, 0.1, method="far-field"),
        lambda: directivity_index(thing, 0.0075),
        lambda: Crossing(thing, 2730.0, 5920.0, 0.3, 0.01),
    ):
        with pytest.raises(InputError, match="not an element type"):
            call()


def test_a_virtual_element_is_refused_where_a_probe_is_asked_for():
    with pytest.raises(InputError, match=r"use one of disc, rectangle$"):
        analyse(EXAMPLES["ellipse"], 5920.0)
    with pytest.raises(InputError, match="shape: 'ellipse' is not an element type"):
        element_class("ellipse")


# ---- nothing outside the element modules asks which type it has -----------------------

_PACKAGE = Path(beamspread.__file__).parent
_CLASSES = {"Disc", "Rectangle", "Ellipse", "Element", "_TwoSided", "Probe"}
_KINDS = {"disc", "rectangle", "ellipse"}


def _type_questions(tree: ast.AST) -> list[int]:
    """Lines that test an object against an element class, or compare an element-kind string."""
    lines = []
    for node in ast.walk(tree):
        if (
            isinstance(node, ast.Call)
            and isinstance(node.func, ast.Name)
            and node.func.id in ("isinstance", "issubclass")
            and len(node.args) == 2
        ):
            named = {n.id for n in ast.walk(node.args[1]) if isinstance(n, ast.Name)}
            named |= {n.attr for n in ast.walk(node.args[1]) if isinstance(n, ast.Attribute)}
            if named & _CLASSES:
                lines.append(node.lineno)
        elif isinstance(node, ast.Compare):
            for operand in [node.left, *node.comparators]:
                values = [operand, *getattr(operand, "elts", [])]
                strings = {v.value for v in values if isinstance(v, ast.Constant)}
                names = {v.id for v in values if isinstance(v, ast.Name)}
                names |= {v.attr for v in values if isinstance(v, ast.Attribute)}
                if strings & _KINDS or names & _CLASSES:
                    lines.append(node.lineno)
                    break
        elif isinstance(node, ast.match_case):
            patterns = {n.id for n in ast.walk(node.pattern) if isinstance(n, ast.Name)}
            if patterns & _CLASSES:
                lines.append(node.pattern.lineno)
    return lines


def test_the_scan_finds_type_questions():
    source = (
        "if isinstance(p, (Disc, Rectangle)): pass\n"
        "if p.shape == 'disc': pass\n"
        "if kind in ('rectangle', 'side'): pass\n"
        "if type(p) is probes.Ellipse: pass\n"
        "if p.pattern == 'side' and isinstance(p, int): pass\n"
    )
    assert _type_questions(ast.parse(source)) == [1, 2, 3, 4]


def test_no_module_outside_the_element_modules_asks_which_type_it_has():
    found = []
    for path in sorted(_PACKAGE.rglob("*.py")):
        relative = path.relative_to(_PACKAGE)
        if relative.parts[0] == "probes":
            continue
        for line in _type_questions(ast.parse(path.read_text(encoding="utf-8"))):
            found.append(f"{relative}:{line}")
    assert found == []
