"""The LRFR rating equation, its phi_c phi_s floor, the rating in tons and the posting law.

Reference: M. A. Khan, *Bridge and Highway Structure Rehabilitation and Repair*, McGraw-Hill,
New York, 2010, ch. 5, p. 187. Confirmed there: RF = (C - gDC DC - gDW DW +/- gP P) /
(gL (LL + IM)) with C = phi_c phi_s phi Rn and the lower limit phi_c phi_s >= 0.85; the gamma
factors take the place of the LFR factors A1 and A2; RT = RF x W; safe posting load
W/0.7 (RF - 0.3) for 0.3 <= RF < 1.0, closing considered below 0.3, no posting at RF >= 1.0.
The closed forms are written in each test.
"""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from influence.rating import SectionEffects, lfr_rating, lrfr_rating, posting, rating_tons

EXACT = 1e-12

rating_factors = st.floats(0.3, 0.999999, allow_nan=False)
weights = st.floats(1.0, 100.0, allow_nan=False)


def _strength(effects: SectionEffects, condition: float, system: float):
    return lrfr_rating(effects, nominal=5000.0, resistance_factor=0.9,
                       dead_components_factor=1.25, dead_wearing_factor=1.5, live_factor=1.75,
                       impact=0.33, condition_factor=condition, system_factor=system)


@given(rating_factors, weights)
def test_posting_load_is_w_over_07_times_rf_minus_03(rf, w):
    result = posting(rf, w)
    assert result.action == "post"
    assert result.load == pytest.approx(w / 0.7 * (rf - 0.3), rel=EXACT, abs=EXACT)


def test_posting_law_ends_and_regions():
    assert posting(0.3, 36.0).load == 0.0                       # RF = 0.3 posts nothing left
    assert posting(0.999999999, 36.0).load == pytest.approx(36.0, rel=1e-8)   # RF -> 1: W
    assert posting(1.0, 36.0).action == "none"
    assert posting(1.0, 36.0).load is None
    assert posting(0.299, 36.0).action == "consider closing"
    assert posting(0.299, 36.0).load is None


def test_posted_load_falls_faster_than_the_rating_in_tons():
    rf, w = 0.65, 40.0
    assert rating_tons(rf, w) == pytest.approx(rf * w)           # RT = RF W = 26 tons
    assert posting(rf, w).load == pytest.approx(40.0 / 0.7 * 0.35)   # 20 tons
    assert posting(rf, w).load < rating_tons(rf, w)


@pytest.mark.parametrize(("condition", "system"), [(0.85, 0.85), (0.85, 0.9), (0.95, 0.85)])
def test_member_factor_floor_is_applied_and_reported(condition, system):
    assert condition * system < 0.85
    result = _strength(SectionEffects("positive", dead_components=1000.0, live=800.0),
                       condition, system)
    assert result.floor_applied
    assert result.member_factor == 0.85
    assert result.capacity == pytest.approx(0.85 * 0.9 * 5000.0)
    assert any("0.85" in note for note in result.notes)


def test_member_factor_above_the_floor_is_the_product():
    result = _strength(SectionEffects("positive", dead_components=1000.0, live=800.0), 0.95, 0.95)
    assert not result.floor_applied
    assert result.member_factor == pytest.approx(0.95 * 0.95)
    assert result.capacity == pytest.approx(0.9025 * 0.9 * 5000.0)


@given(st.floats(0.5, 3.0), st.floats(0.8, 2.5), st.floats(0.0, 0.5))
def test_gamma_factors_take_the_place_of_a1_and_a2(dead_factor, live_factor, impact):
    """With gDC = gDW = A1, gL = A2 and phi_c = phi_s = 1 both equations give one number."""
    effects = SectionEffects("positive", dead_components=700.0, dead_wearing=150.0, live=500.0)
    lrfr = lrfr_rating(effects, nominal=4000.0, resistance_factor=1.0,
                       dead_components_factor=dead_factor, dead_wearing_factor=dead_factor,
                       live_factor=live_factor, impact=impact)
    lfr = lfr_rating(effects, capacity=4000.0, dead_factor=dead_factor, live_factor=live_factor,
                     impact=impact)
    assert lrfr.rating_factor == pytest.approx(lfr.rating_factor, rel=EXACT)
    expected = (4000.0 - dead_factor * 850.0) / (live_factor * 500.0 * (1.0 + impact))
    assert lfr.rating_factor == pytest.approx(expected, rel=EXACT)


# --- the same rules through a whole rating run (``rate``) on a simple span -------------------

SPAN = 20.0  # [ft]


def _run(rating: dict, nominal: float, tmp_path, weight: float = 17.0):
    from influence.rating.run import rate
    from tests.rating_files import model_file, simple_span, vehicle_file

    truck = vehicle_file(tmp_path, "test truck", [weight, weight], [4.0])
    document = simple_span(SPAN, rating=rating, capacities=[
        {"response": "moment", "sense": "positive", "from": 0.0, "to": SPAN,
         "nominal": nominal}])
    return rate(model_file(document), (str(truck),), ("legal",))


def test_rate_applies_the_member_factor_floor(tmp_path):
    rating = {"method": "LRFR", "material": "steel", "limit_states": ["Strength I"],
              "condition_factor": "poor", "system_factor": 0.9, "adtt": 1000}
    ratings = _run(rating, 1000.0, tmp_path)
    for result in (r.result for r in ratings.ratings):
        assert 0.85 * 0.9 < 0.85
        assert result.floor_applied
        assert result.capacity == pytest.approx(0.85 * 1000.0, rel=EXACT)


def test_rate_posts_a_legal_vehicle_by_the_posting_law(tmp_path):
    rating = {"method": "LRFR", "material": "steel", "limit_states": ["Strength I"],
              "adtt": 1000}
    ratings = _run(rating, 250.0, tmp_path)   # a weak girder: RF between 0.3 and 1
    posted = ratings.postings.legal[0]
    rf, w = posted.posting.rating_factor, 17.0   # two 17-kip axles: W = 34 kip = 17 tons
    assert rf == pytest.approx(ratings.lowest("test truck", "legal").rating_factor)
    assert 0.3 <= rf < 1.0
    assert posted.weight_tons == pytest.approx(w)
    assert posted.posting.rating == pytest.approx(rf * w, rel=EXACT)          # RT = RF W
    assert posted.posting.load == pytest.approx(w / 0.7 * (rf - 0.3), rel=EXACT)


def test_rate_advises_closing_below_03(tmp_path):
    rating = {"method": "LRFR", "material": "steel", "limit_states": ["Strength I"],
              "adtt": 1000}
    ratings = _run(rating, 130.0, tmp_path)
    posted = ratings.postings.legal[0]
    assert posted.posting.rating_factor < 0.3
    assert posted.posting.action == "consider closing"
