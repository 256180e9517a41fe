"""Two equal moving loads on a simple span, carried through the LRFR rating to a rating factor.

Reference: AISC, *Steel Construction Manual*, "Beam diagrams and formulas", simple beam with two
equal concentrated moving loads (case 44; the case number and the formula from memory,
unconfirmed): with loads P a distance a apart, the largest moment is
M = (P / 2L) (L - a/2)^2, under the load nearer midspan when midspan halves the distance between
that load and the resultant, i.e. at x = L/2 - a/4, as long as a < (2 - sqrt 2) L; for a longer
spacing one load alone at midspan governs, M = P L / 4. The same result follows from Barre's
theorem (T. G. Hicks, *Civil Engineering Formulas*, ch. 2: computed two ways).

The rating arithmetic is the LRFR equation (AASHTO Manual for Bridge Evaluation 6A.4.2.1; its
form confirmed by M. A. Khan, *Bridge and Highway Structure Rehabilitation and Repair*, 2010,
p. 187) with factors recalled from the MBE tables (from memory, unconfirmed): Strength I
gDC = 1.25, gDW = 1.50; legal gL = 1.30 at ADTT 1000 (2nd edition); IM = 0.33 on the vehicle.
The dead-load moment of a uniform load w at x is w x (L - x) / 2 (statics).
"""

from __future__ import annotations

import math

import pytest

from influence.rating.run import rate
from tests.rating_files import model_file, simple_span, vehicle_file

EXACT = 1e-9
"""Relative tolerance: exact placement and arithmetic against the closed form (round-off)."""

P = 17.0  # each axle of the tandem [kip]
A = 4.0  # axle spacing [ft]
L = 20.0  # span [ft]
W_DC, W_DW = 1.0, 0.2  # dead loads [kip/ft]
CAPACITY = 1000.0  # phi_c phi_s phi Rn [kip-ft], all factors 1.0
G = 0.5  # lanes per girder
GAMMA_DC, GAMMA_DW, GAMMA_L, IM = 1.25, 1.50, 1.30, 0.33


def _dead(w: float, x: float) -> float:
    return w * x * (L - x) / 2.0


def _hand_factor(x: float, live: float) -> float:
    return (CAPACITY - GAMMA_DC * _dead(W_DC, x) - GAMMA_DW * _dead(W_DW, x)) / (
        GAMMA_L * G * live * (1.0 + IM))


@pytest.fixture(scope="module")
def ratings(tmp_path_factory):
    folder = tmp_path_factory.mktemp("vehicles")
    tandem = vehicle_file(folder, "tandem", [P, P], [A])
    x = L / 2.0 - A / 4.0
    return rate(model_file(simple_span(L, extra=(f"{x:g}",))), (str(tandem),), ("legal",))


def _at(ratings, section):
    return next(r for r in ratings.ratings if r.section == section and r.response == "moment"
                and r.sense == "positive")


def test_largest_moment_is_the_handbook_value_at_its_section(ratings):
    x = L / 2.0 - A / 4.0
    moment = P / (2.0 * L) * (L - A / 2.0) ** 2  # case 44: 137.7 kip-ft at 9 ft
    rating = _at(ratings, f"{x:g}")
    assert rating.live.vehicle == pytest.approx(moment, rel=EXACT)
    assert rating.live.lane == 0.0
    assert rating.rating_factor == pytest.approx(_hand_factor(x, moment), rel=EXACT)


def test_lowest_factor_of_the_run_stands_at_x_l2_minus_a4(ratings):
    low = ratings.lowest("tandem", "legal")
    assert low.section == f"{L / 2.0 - A / 4.0:g}"
    assert low.chainage == pytest.approx(L / 2.0 - A / 4.0, rel=EXACT)


def test_midspan_moment_one_axle_over_midspan(ratings):
    # statics: ordinate L/4 under one axle, L/4 - a/2 under the other
    moment = P * L / 4.0 + P * (L / 4.0 - A / 2.0)
    rating = _at(ratings, f"{L / 2.0:g}")
    assert rating.live.vehicle == pytest.approx(moment, rel=EXACT)
    assert rating.rating_factor == pytest.approx(_hand_factor(L / 2.0, moment), rel=EXACT)
    assert rating.live.placement.section_axle in (0, 1)


def test_placement_is_reported_with_the_allowance_on_the_axles(ratings):
    rating = _at(ratings, f"{L / 2.0 - A / 4.0:g}")
    placement = rating.live.placement
    assert placement.axle_loads == pytest.approx((P * (1 + IM), P * (1 + IM)), rel=EXACT)
    assert placement.value == pytest.approx(rating.live.vehicle * (1 + IM), rel=EXACT)
    assert rating.live_with_impact == pytest.approx(G * placement.value, rel=EXACT)


def test_spacing_beyond_0586_l_one_axle_governs(tmp_path):
    span = 6.0
    assert (2.0 - math.sqrt(2.0)) * span < A  # 4 ft > 3.51 ft
    tandem = vehicle_file(tmp_path, "tandem", [P, P], [A])
    document = simple_span(span, capacities=[{"response": "moment", "sense": "positive",
                                              "from": 0.0, "to": span, "nominal": 1000.0}])
    ratings = rate(model_file(document), (str(tandem),), ("legal",))
    midspan = next(r for r in ratings.ratings if r.section == f"{span / 2:g}")
    assert midspan.live.vehicle == pytest.approx(P * span / 4.0, rel=EXACT)
