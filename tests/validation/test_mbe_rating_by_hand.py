"""The LRFR, LFR and ASR arithmetic by hand on one section, end to end through ``rate``.

References:
- AASHTO, *The Manual for Bridge Evaluation*, 2nd ed. (2011): Art. 6A.4.2.1, RF =
  (C - gDC DC - gDW DW - gP P) / (gL (LL + IM)), C = phi_c phi_s phi Rn with phi_c phi_s >= 0.85
  (the form and the floor confirmed by M. A. Khan, *Bridge and Highway Structure Rehabilitation
  and Repair*, 2010, p. 187); Table 6A.4.2.2-1, steel Strength I: gDC = 1.25, gDW = 1.50,
  gL = 1.75 at design inventory (from memory, unconfirmed); Table 6A.4.2.3-1, phi_c = 0.85 for
  poor condition (from memory, unconfirmed); Part B, 6B.4.1: RF = (C - A1 D) / (A2 L (1 + I)),
  A1 = 1.3, A2 = 2.17 inventory and 1.3 operating, and A1 = A2 = 1 for ASR (from memory,
  unconfirmed).
- AASHTO LRFD Bridge Design Specifications 3.6.1.2: design tandem 2 x 25 kip at 4 ft, lane
  0.64 kip/ft, IM 33 % on the tandem only (confirmed).
- AASHTO Standard Specifications for Highway Bridges, 17th ed., 3.7: HS20 truck 8, 32, 32 kip at
  14 ft (confirmed); lane 0.64 kip/ft with 18 kip for moment (confirmed); 3.8.2.1:
  I = 50/(L + 125) <= 0.30 (cap confirmed, formula from memory).
- Statics of the simple span (common practice): the midspan moment line has ordinate L/4 at
  midspan, falling 1/2 per unit distance; a uniform load w gives w L^2 / 8, a point load P at
  midspan P L / 4.
"""

from __future__ import annotations

import pytest

from influence.rating.run import rate
from tests.rating_files import model_file, simple_span

EXACT = 1e-9
"""Relative tolerance of the run against the hand arithmetic (round-off only)."""


def _midspan(ratings, vehicle, level):
    return next(r for r in ratings.ratings if r.section == "10" and r.vehicle == vehicle
                and r.level == level and r.sense == "positive")


def test_lrfr_design_inventory_by_hand():
    span = 20.0
    document = simple_span(span, loads=[
        {"name": "girder", "load": "DC", "uniform": 1.0},
        {"name": "surfacing", "load": "DW", "uniform": 0.2},
        {"name": "locked-in erection force", "load": "EL", "point": 5.0, "at": 10.0}],
        rating={"method": "LRFR", "material": "steel", "distribution": 0.6,
                "condition_factor": "poor", "system_factor": 0.9,
                "limit_states": ["Strength I"]},
        capacities=[{"response": "moment", "sense": "positive", "from": 0.0, "to": span,
                     "nominal": 1200.0, "resistance_factor": 0.9}])
    ratings = rate(model_file(document), ("HL-93",), ("inventory",))
    rating = _midspan(ratings, "HL-93", "design inventory")
    dc, dw, p = 1.0 * span**2 / 8, 0.2 * span**2 / 8, 5.0 * span / 4     # 50, 10, 25
    tandem = 25.0 * span / 4 + 25.0 * (span / 4 - 4.0 / 2)                # 200 kip-ft
    lane = 0.64 * span**2 / 8                                              # 32 kip-ft
    member = max(0.85 * 0.9, 0.85)                                        # floor: 0.85
    capacity = member * 0.9 * 1200.0
    expected = (capacity - 1.25 * dc - 1.50 * dw - 1.0 * p) / (
        1.75 * 0.6 * (tandem * 1.33 + lane))
    assert rating.live.placement.case == "design tandem + lane"
    assert rating.live.vehicle == pytest.approx(tandem, rel=EXACT)
    assert rating.live.lane == pytest.approx(lane, rel=EXACT)
    assert rating.result.floor_applied
    assert rating.result.capacity == pytest.approx(capacity, rel=EXACT)
    assert dict((t.name, t.effect) for t in rating.result.dead) == pytest.approx(
        {"DC": dc, "DW": dw, "P": p}, rel=EXACT)
    assert rating.rating_factor == pytest.approx(expected, rel=EXACT)


def test_lfr_hs20_inventory_and_operating_by_hand():
    span = 50.0
    document = simple_span(span, rating={"method": "LFR"}, capacities=[
        {"response": "moment", "sense": "positive", "from": 0.0, "to": span,
         "nominal": 3000.0, "resistance_factor": 0.9}])
    ratings = rate(model_file(document), ("HS20-44",))
    dead = 1.2 * span**2 / 8                                               # D = DC + DW
    truck = 32.0 * span / 4 + (32.0 + 8.0) * (span / 4 - 14.0 / 2)         # 620 kip-ft
    lane = 0.64 * span**2 / 8 + 18.0 * span / 4                            # 425: not governing
    assert lane < truck
    impact = 50.0 / (span + 125.0)
    for level, a2 in (("inventory", 2.17), ("operating", 1.3)):
        rating = next(r for r in ratings.ratings if r.section == "25" and r.level == level)
        assert rating.live.placement.case == "HS20 truck"
        assert rating.live.placement.ranged_values[0].value == pytest.approx(14.0)
        assert rating.result.impact == pytest.approx(impact, rel=EXACT)
        assert rating.live.vehicle + rating.live.lane == pytest.approx(truck, rel=EXACT)
        expected = (0.9 * 3000.0 - 1.3 * dead) / (a2 * truck * (1.0 + impact))
        assert rating.rating_factor == pytest.approx(expected, rel=EXACT)


def test_lfr_impact_acts_on_the_lane_loading_too():
    span = 200.0  # long enough for the HS20 lane loading to govern the midspan moment
    document = simple_span(span, rating={"method": "LFR"}, capacities=[
        {"response": "moment", "sense": "positive", "from": 0.0, "to": span,
         "nominal": 30000.0}])
    ratings = rate(model_file(document), ("HS20-44",), ("inventory",))
    rating = next(r for r in ratings.ratings if r.section == "100")
    lane = 0.64 * span**2 / 8 + 18.0 * span / 4                            # 4100 kip-ft
    impact = 50.0 / (span + 125.0)
    assert rating.live.placement.case == "HS20 lane loading"
    assert rating.live_with_impact == pytest.approx(lane * (1 + impact), rel=EXACT)


def test_asr_by_hand():
    span = 50.0
    document = simple_span(span, rating={"method": "ASR"}, capacities=[
        {"response": "moment", "sense": "positive", "from": 0.0, "to": span,
         "allowable": {"inventory": 1500.0, "operating": 2000.0}}])
    ratings = rate(model_file(document), ("HS20-44",))
    dead = 1.2 * span**2 / 8
    truck = 32.0 * span / 4 + (32.0 + 8.0) * (span / 4 - 14.0 / 2)
    impact = 50.0 / (span + 125.0)
    for level, allowable in (("inventory", 1500.0), ("operating", 2000.0)):
        rating = next(r for r in ratings.ratings if r.section == "25" and r.level == level)
        assert rating.rating_factor == pytest.approx(
            (allowable - dead) / (truck * (1.0 + impact)), rel=EXACT)
