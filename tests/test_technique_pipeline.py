"""One technique, the same numbers everywhere: every command that takes a technique agrees.

A table of techniques (contact disc and rectangle, two wedges, a water path, a focus behind a
water path, a focus in contact) runs through ``beam --json``, ``compute(technique).to_dict()``,
``report --json``, ``across`` at each depth and ``index-step``: their computed -6 dB widths
must agree to 1e-9 relative, as they read one field source. ``map``'s width, read from its
grid independently here (the outermost samples at or above the level in each row), must agree
to the map's lateral step. The physics of each width is checked elsewhere against outside
references (test_field, test_focused_field, test_cli_setups); this checks that no command
computes another technique than the one it was given.
"""

from __future__ import annotations

import json
import math

import numpy as np
import pytest

STEEL = ("--frequency", "5MHz", "--material", "reference-steel")
TECHNIQUES = {
    "disc-contact": (("--diameter", "10mm", *STEEL), ("15mm", "30mm")),
    "rectangle-contact": (("--length", "20mm", "--width", "10mm", *STEEL), ("20mm", "40mm")),
    "disc-wedge-60": (
        (
            "--diameter",
            "12.7mm",
            "--frequency",
            "2.25MHz",
            "--material",
            "reference-steel",
            "--wedge",
            "acrylic",
            "--refracted",
            "60",
            "--wedge-path",
            "10mm",
            "--thickness",
            "25mm",
        ),
        ("10mm", "20mm"),
    ),
    "rectangle-wedge-45": (
        (
            "--length",
            "20mm",
            "--width",
            "22mm",
            "--frequency",
            "2.25MHz",
            "--material",
            "reference-steel",
            "--wedge",
            "acrylic",
            "--refracted",
            "45",
            "--wedge-path",
            "12mm",
        ),
        ("20mm", "40mm"),
    ),
    "water-path": (("--diameter", "10mm", *STEEL, "--water-path", "30mm"), ("10mm", "20mm")),
    "focus-in-water": (
        ("--diameter", "12.7mm", *STEEL, "--water-path", "50mm", "--focus", "75mm"),
        ("5mm", "10mm"),
    ),
    "focus-in-contact": (("--diameter", "12.7mm", *STEEL, "--focus", "75mm"), ("30mm", "60mm")),
}
LEVEL = 6.0


def _mm(text: str) -> float:
    return float(text.removesuffix("mm")) * 1e-3


def _beam_widths(data) -> dict[tuple[str, float], float]:
    """(plane, depth) -> the computed -6 dB width on the first leg, from beam's JSON."""
    out = {}
    for plane in data["planes"]:
        for s in plane["spots"]:
            if s["method"] == "field" and s.get("leg", 1) == 1 and s["level_db"] == -LEVEL:
                out[plane["name"], s["depth_m"]] = s["width_m"]
    return out


def _close(a, b, rel=1e-9):
    return a is not None and b is not None and math.isclose(a, b, rel_tol=rel)


def _saved(run, tmp_path, name):
    """The technique saved as a setup file by beam (with its depths), and beam's JSON of it."""
    args, depths = TECHNIQUES[name]
    path = tmp_path / f"{name}.toml"
    depth_args = [a for d in depths for a in ("--depth", d)]
    r = run("beam", *args, *depth_args, "--save", str(path))
    assert r.code == 0, r.stderr
    r = run("beam", "--setup", str(path), "--json")
    assert r.code == 0, r.stderr
    return path, json.loads(r.stdout)


@pytest.mark.parametrize("name", list(TECHNIQUES))
def test_beam_compute_and_report_give_one_object(run, tmp_path, name):
    import beamspread as bs

    path, data = _saved(run, tmp_path, name)
    widths = _beam_widths(data)
    assert len(widths) == 2 * len(data["planes"])  # every depth has a computed width
    assert all(w is not None and w > 0 for w in widths.values())
    computed = bs.compute(bs.Technique.from_toml(path)).to_dict()
    assert computed == data
    page = tmp_path / "page.png"
    r = run("report", str(path), "--output", str(page), "--json")
    assert r.code == 0, r.stderr
    assert page.exists()
    reported = json.loads(r.stdout)
    assert reported == data
    # The focus in contact: the report's S and widths are beam's (they were not, when the
    # report read the part as a couplant behind a water path that did not exist).
    if data.get("focus"):
        assert reported["focus"] == data["focus"]


@pytest.mark.parametrize("name", list(TECHNIQUES))
def test_across_and_index_step_read_the_same_field(run, tmp_path, name):
    args, depths = TECHNIQUES[name]
    _, data = _saved(run, tmp_path, name)
    widths = _beam_widths(data)
    first = data["planes"][0]["name"]
    for depth in depths:
        r = run("across", *args, "--depth", depth, "--points", "11", "--level", "6", "--json")
        assert r.code == 0, r.stderr
        for plane in json.loads(r.stdout)["planes"]:
            (found,) = [w["width_m"] for w in plane["widths"] if w["level_db"] == -LEVEL]
            assert _close(found, widths[plane["name"], _mm(depth)]), (plane["name"], depth)
    start, stop = depths
    r = run("index-step", *args, "--from", start, "--to", stop, "--count", "2", "--json")
    assert r.code == 0, r.stderr
    plan = json.loads(r.stdout)
    assert plan["plane"] == first
    for depth, width in zip(plan["depths_m"], plan["widths_m"], strict=True):
        assert _close(width, widths[first, depth]), depth


@pytest.mark.parametrize("name", list(TECHNIQUES))
def test_map_width_agrees_to_its_lateral_step(run, tmp_path, name):
    args, depths = TECHNIQUES[name]
    _, data = _saved(run, tmp_path, name)
    widths = _beam_widths(data)
    first = data["planes"][0]["name"]
    wedge = data.get("refraction") is not None
    beta = math.radians(data["refraction"]["refracted_deg"]["shear"]) if wedge else 0.0
    span = 1.5 * max(widths[first, _mm(d)] for d in depths)
    # The map's coordinate is the sound path along the refracted axis on a wedge.
    paths = [_mm(d) / math.cos(beta) for d in depths]
    r = run(
        "map",
        *args,
        "--from",
        f"{paths[0] * 1e3!r}mm",
        "--to",
        f"{paths[1] * 1e3!r}mm",
        "--depth-points",
        "2",
        "--lateral-points",
        "801",
        "--span",
        f"{span * 1e3!r}mm",
        "--json",
    )
    assert r.code == 0, r.stderr
    grid = json.loads(r.stdout)
    lateral = np.asarray(grid["lateral_m"])
    step = lateral[1] - lateral[0]
    for row, depth in zip(grid["amplitude"], depths, strict=True):
        row = np.asarray(row)
        inside = np.nonzero(row >= row.max() * 10 ** (-LEVEL / 20))[0]
        # The samples at or above the level span ``read``; each true crossing lies within the
        # next step outward, so the width lies in [read, read + 2 steps] (float32 map: 1e-6).
        read = lateral[inside[-1]] - lateral[inside[0]]
        width = widths[first, _mm(depth)]
        assert read - 1e-6 * width <= width <= read + 2 * step + 1e-6 * width, (depth, read)
