"""Live-load distribution factors of AASHTO LRFD 4.6.2.2 for slab-on-girder types a, e and k.

Reference: AASHTO, *LRFD Bridge Design Specifications*, Art. 4.6.2.2 (Tables 4.6.2.2.2b-1,
4.6.2.2.2d-1, 4.6.2.2.2e-1, 4.6.2.2.3a-1, 4.6.2.2.3b-1, 4.6.2.2.3c-1, Eq. 4.6.2.2.2d-1),
Art. 3.6.1.1.2 (multiple presence: 1.20 for one lane confirmed; 1.00, 0.85, 0.65 from memory)
and Art. 3.6.1.3.1 (wheels 2 ft from the barrier face, from memory). The formulas are from
memory, unconfirmed: each test writes the formula out and checks the package against it
(computed). The lever rule is checked against the statics of a deck hinged over the interior
girder, and the rigid-section method against a rigid deck on equal springs solved numerically
(both computed: derived a second, independent way). No published worked example is used: none
was recalled reliably enough to quote.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given
from hypothesis import strategies as st

from influence.errors import ModelError
from influence.rating import (
    GirderGeometry,
    distribution_factors,
    girder_geometry_from_metric,
)
from influence.rating.girder_geometry import multiple_presence
from influence.rating.lever_rule import lever_rule, rigid_section

EXACT = 1e-12
SPRING_SOLVE = 1e-9

S, L, TS, KG = 8.0, 60.0, 8.0, 500_000.0
GEOMETRY = GirderGeometry(S, L, TS, KG, girders=5, edge_distance=2.0)


def stiffness_term(s=S, length=L, ts=TS, kg=KG):
    return kg / (12.0 * length * ts**3)


def test_multiple_presence_factors():
    assert multiple_presence(1) == 1.20                       # confirmed
    assert [multiple_presence(n) for n in (2, 3, 4, 7)] == [1.00, 0.85, 0.65, 0.65]   # memory


def test_interior_moment_formulas():
    factors = distribution_factors(GEOMETRY, "interior", "moment")
    one = 0.06 + (S / 14.0) ** 0.4 * (S / L) ** 0.3 * stiffness_term() ** 0.1
    many = 0.075 + (S / 9.5) ** 0.6 * (S / L) ** 0.2 * stiffness_term() ** 0.1
    assert factors.one_lane == pytest.approx(one, rel=EXACT)
    assert factors.several_lanes == pytest.approx(many, rel=EXACT)
    assert factors.governing == pytest.approx(max(one, many), rel=EXACT)


def test_interior_shear_formulas():
    factors = distribution_factors(GEOMETRY, "interior", "shear")
    assert factors.one_lane == pytest.approx(0.36 + S / 25.0, rel=EXACT)
    assert factors.several_lanes == pytest.approx(0.2 + S / 12.0 - (S / 35.0) ** 2, rel=EXACT)


@given(st.floats(3.5, 16.0), st.floats(-1.0, 5.5))
def test_exterior_one_lane_lever_rule_is_the_statics_of_a_hinged_deck(spacing, de):
    """Moments about the first interior girder: R S = sum of P (S - x) for wheels inside S."""
    geometry = GirderGeometry(spacing, L, TS, KG, girders=5, edge_distance=de)
    wheels = np.array([2.0 - de, 8.0 - de])          # 2 ft from the barrier face, 6 ft gauge
    reaction = sum(0.5 * (spacing - x) / spacing for x in wheels if x < spacing)
    assert lever_rule(geometry, "exterior", 1) == pytest.approx(1.2 * reaction, rel=EXACT)


def test_exterior_moment_and_shear_several_lanes():
    de = GEOMETRY.edge_distance
    interior_moment = distribution_factors(GEOMETRY, "interior", "moment").several_lanes
    interior_shear = distribution_factors(GEOMETRY, "interior", "shear").several_lanes
    moment = distribution_factors(GEOMETRY, "exterior", "moment")
    shear = distribution_factors(GEOMETRY, "exterior", "shear")
    assert moment.several_lanes == pytest.approx((0.77 + de / 9.1) * interior_moment, rel=EXACT)
    assert shear.several_lanes == pytest.approx((0.6 + de / 10.0) * interior_shear, rel=EXACT)
    # de = 2 ft: wheels over the exterior web and 6 ft inboard, m = 1.2
    assert moment.one_lane == pytest.approx(1.2 * 0.5 * (1.0 + (S - 6.0) / S), rel=EXACT)


def _rigid_deck_share(geometry: GirderGeometry, wheels: np.ndarray) -> float:
    """Exterior girder's share of unit wheels on a rigid deck over equal springs (k = 1)."""
    x = geometry.spacing * np.arange(geometry.girders)
    # unknowns: deck deflection w and rotation t; spring force at girder i is w + t x_i
    matrix = np.array([[len(x), x.sum()], [x.sum(), (x**2).sum()]])
    load = np.array([len(wheels), wheels.sum()])
    w, t = np.linalg.solve(matrix, load)
    return float(w + t * x[0])


@pytest.mark.parametrize("lanes", [1, 2, 3])
def test_rigid_section_matches_a_rigid_deck_on_springs(lanes):
    trucks = -GEOMETRY.edge_distance + 5.0 + 12.0 * np.arange(lanes)   # 5 ft into each lane
    wheels = np.concatenate([trucks - 3.0, trucks + 3.0])
    share = _rigid_deck_share(GEOMETRY, wheels) / 2.0                  # two wheels a lane
    expected = multiple_presence(lanes) * share
    assert rigid_section(GEOMETRY, lanes) == pytest.approx(expected, rel=SPRING_SOLVE)


def test_rigid_section_minimum_governs_the_exterior_girder_when_larger():
    plain = distribution_factors(GEOMETRY, "exterior", "moment")
    rigid = distribution_factors(GEOMETRY, "exterior", "moment", rigid_section=True)
    assert rigid.one_lane == pytest.approx(max(plain.one_lane, rigid_section(GEOMETRY, 1)))
    assert rigid.several_lanes == pytest.approx(max(
        plain.several_lanes, *(rigid_section(GEOMETRY, n) for n in (2, 3))))


def test_three_girders_interior_moment_takes_the_lesser_of_formula_and_lever_rule():
    spacing = 10.0
    geometry = GirderGeometry(spacing, L, TS, KG, girders=3, edge_distance=2.0)
    formula = 0.06 + (spacing / 14.0) ** 0.4 * (spacing / L) ** 0.3 * stiffness_term(
        spacing) ** 0.1
    lever = 1.2 * (1.0 - 3.0 / spacing)     # wheels 3 ft either side of the girder
    factors = distribution_factors(geometry, "interior", "moment")
    assert factors.one_lane == pytest.approx(min(formula, lever), rel=EXACT)


def test_three_girders_interior_shear_is_the_lever_rule():
    spacing = 10.0
    geometry = GirderGeometry(spacing, L, TS, KG, girders=3, edge_distance=2.0)
    assert distribution_factors(geometry, "interior", "shear").one_lane == pytest.approx(
        1.2 * (1.0 - 3.0 / spacing), rel=EXACT)


@pytest.mark.parametrize("theta", [30.0, 45.0, 60.0, 75.0])
def test_skew_reduction_of_moment(theta):
    geometry = GirderGeometry(S, L, TS, KG, girders=5, edge_distance=2.0, skew=theta)
    c1 = 0.25 * stiffness_term() ** 0.25 * (S / L) ** 0.5
    used = min(theta, 60.0)
    reduction = 1.0 - c1 * math.tan(math.radians(used)) ** 1.5
    straight = distribution_factors(GEOMETRY, "interior", "moment")
    skewed = distribution_factors(geometry, "interior", "moment")
    assert skewed.skew_factor == pytest.approx(reduction, rel=EXACT)
    assert skewed.one_lane == pytest.approx(reduction * straight.one_lane, rel=EXACT)


def test_no_moment_reduction_below_30_degrees():
    geometry = GirderGeometry(S, L, TS, KG, girders=5, edge_distance=2.0, skew=29.0)
    assert distribution_factors(geometry, "interior", "moment").skew_factor == 1.0


@pytest.mark.parametrize("theta", [10.0, 45.0, 60.0])
def test_skew_correction_of_shear(theta):
    geometry = GirderGeometry(S, L, TS, KG, girders=5, edge_distance=2.0, skew=theta)
    correction = 1.0 + 0.20 * (12.0 * L * TS**3 / KG) ** 0.3 * math.tan(math.radians(theta))
    factors = distribution_factors(geometry, "exterior", "shear")
    assert factors.skew_factor == pytest.approx(correction, rel=EXACT)


def test_metric_geometry_gives_the_same_factors():
    metric = girder_geometry_from_metric(
        spacing=S * 0.3048, span=L * 0.3048, slab_thickness=TS * 25.4,
        stiffness_parameter=KG * 25.4**4, girders=5, edge_distance=2.0 * 0.3048)
    for girder in ("interior", "exterior"):
        for response in ("moment", "shear"):
            a = distribution_factors(GEOMETRY, girder, response)
            b = distribution_factors(metric, girder, response)
            assert b.one_lane == pytest.approx(a.one_lane, rel=1e-9)
            assert b.several_lanes == pytest.approx(a.several_lanes, rel=1e-9)


@pytest.mark.parametrize(("change", "key", "use"), [
    ({"spacing": 3.0}, "spacing", "moment"),
    ({"spacing": 16.5}, "spacing", "shear"),
    ({"slab_thickness": 4.0}, "slab_thickness", "moment"),
    ({"slab_thickness": 12.5}, "slab_thickness", "shear"),
    ({"span": 19.0}, "span", "moment"),
    ({"span": 250.0}, "span", "shear"),
    ({"stiffness_parameter": 9_000.0}, "stiffness_parameter", "moment"),
    ({"stiffness_parameter": 8.0e6}, "stiffness_parameter", "moment"),
])
def test_outside_the_range_is_a_one_line_error(change, key, use):
    values = {"spacing": S, "span": L, "slab_thickness": TS, "stiffness_parameter": KG} | change
    geometry = GirderGeometry(**values, girders=5, edge_distance=2.0)
    with pytest.raises(ModelError) as caught:
        distribution_factors(geometry, "interior", use)
    assert caught.value.item == f"distribution.{key}"
    assert "outside the range" in str(caught.value) and "\n" not in str(caught.value)


@pytest.mark.parametrize("de", [-1.5, 6.0])
def test_edge_distance_outside_its_range(de):
    geometry = GirderGeometry(S, L, TS, KG, girders=5, edge_distance=de)
    with pytest.raises(ModelError, match="de"):
        distribution_factors(geometry, "exterior", "moment")
    assert distribution_factors(geometry, "interior", "moment").one_lane > 0.0


def test_shear_skew_beyond_60_degrees_is_refused():
    geometry = GirderGeometry(S, L, TS, KG, girders=5, edge_distance=2.0, skew=65.0)
    with pytest.raises(ModelError, match="60 degrees"):
        distribution_factors(geometry, "interior", "shear")


@pytest.mark.parametrize("bad", [
    {"girders": 2}, {"girders": 4.0}, {"spacing": -1.0}, {"skew": 95.0},
    {"edge_distance": -20.0},
])
def test_bad_geometry_is_refused_when_built(bad):
    values = {"spacing": S, "span": L, "slab_thickness": TS, "stiffness_parameter": KG,
              "girders": 5, "edge_distance": 2.0} | bad
    with pytest.raises(ModelError):
        GirderGeometry(**values)


def test_unknown_girder_or_response():
    with pytest.raises(ModelError, match="girder"):
        distribution_factors(GEOMETRY, "middle", "moment")
    with pytest.raises(ModelError, match="torsion"):
        distribution_factors(GEOMETRY, "interior", "torsion")


def test_one_lane_roadway_has_no_several_lane_factor():
    narrow = GirderGeometry(3.5, L, TS, KG, girders=4, edge_distance=0.0)   # 10.5 ft roadway
    factors = distribution_factors(narrow, "interior", "shear")
    assert factors.several_lanes is None
    assert factors.governing == factors.one_lane
    with pytest.raises(ModelError, match="do not fit"):
        lever_rule(narrow, "exterior", 2)
    with pytest.raises(ModelError, match="lanes"):
        rigid_section(narrow, 2)
