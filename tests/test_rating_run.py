"""``rate`` over a model file: invariants, the not-rated report, the dynamic allowance applied
once, span rules, distribution and concurrent moments."""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from influence.errors import ModelError
from influence.rating.run import rate, rating_inputs
from tests.rating_files import model_file, simple_span, vehicle_file

EXACT = 1e-9
"""Relative tolerance of exact arithmetic (round-off only)."""

SPAN = 20.0


def _tandem(tmp_path_factory, weight=17.0):
    folder = tmp_path_factory.mktemp("vehicles")
    return str(vehicle_file(folder, "tandem", [weight, weight], [4.0]))


@pytest.fixture(scope="module")
def tandem(tmp_path_factory):
    return _tandem(tmp_path_factory)


def _factors(ratings):
    return {(r.section, r.sense, r.limit_state): r.rating_factor for r in ratings.ratings}


def _two_senses(span, nominal):
    return [{"response": "moment", "sense": "positive", "from": 0.0, "to": span,
             "nominal": nominal},
            {"response": "shear", "sense": "positive", "from": 0.0, "to": span,
             "nominal": nominal / 5},
            {"response": "shear", "sense": "negative", "from": 0.0, "to": span,
             "nominal": -nominal / 5}]


@settings(max_examples=12, deadline=None)
@given(g=st.floats(0.2, 2.0), k=st.floats(0.5, 3.0), adtt=st.floats(0.0, 8000.0))
def test_rating_factor_scales_as_one_over_g_gamma_l(tmp_path_factory, tandem, g, k, adtt):
    """RF x g x gL x (live load) is fixed: distribution, live-load factor and axle loads enter
    the rating only as the product in the denominator (MBE 6A.4.2.1)."""
    base_rating = {"method": "LRFR", "material": "steel", "adtt": 1000, "distribution": 1.0,
                   "limit_states": ["Strength I"]}
    base = rate(model_file(simple_span(SPAN, rating=base_rating,
                                       capacities=_two_senses(SPAN, 1000.0))),
                (tandem,), ("legal",))
    heavier = _tandem(tmp_path_factory, 17.0 * k)
    changed = rate(model_file(simple_span(SPAN, rating={**base_rating, "distribution": g,
                                                        "adtt": adtt},
                                          capacities=_two_senses(SPAN, 1000.0))),
                   (heavier,), ("legal",))
    gamma = changed.ratings[0].result.live_factor
    before, after = _factors(base), _factors(changed)
    assert before.keys() == after.keys()
    for key, value in before.items():
        if math.isinf(value):
            assert math.isinf(after[key])
        else:
            assert after[key] * g * k * gamma == pytest.approx(value * 1.3, rel=EXACT)


@settings(max_examples=12, deadline=None)
@given(extra=st.floats(1.0, 2000.0))
def test_more_capacity_raises_every_factor(tandem, extra):
    low = rate(model_file(simple_span(SPAN, capacities=_two_senses(SPAN, 600.0))),
               (tandem,), ("legal",))
    high = rate(model_file(simple_span(SPAN, capacities=_two_senses(SPAN, 600.0 + extra))),
                (tandem,), ("legal",))
    before, after = _factors(low), _factors(high)
    assert before.keys() == after.keys()
    for key, value in before.items():
        assert after[key] > value or math.isinf(value)


def test_every_section_is_rated_or_reported(tandem):
    capacities = [{"response": "moment", "sense": "positive", "from": 4.0, "to": 12.0,
                   "nominal": 800.0}]
    ratings = rate(model_file(simple_span(SPAN, capacities=capacities)), (tandem,),
                   ("legal",))
    rated = {(r.section, r.sense) for r in ratings.ratings}
    missing = {(n.section, n.sense) for n in ratings.not_rated}
    assert rated == {(s, "positive") for s in ("4", "6", "8", "10", "12")}
    assert missing >= {("S1", "positive"), ("2", "positive"), ("14", "positive"),
                       ("S2", "positive"), ("10", "negative")}
    assert not rated & missing
    sections = {"S1", "S2"} | {f"{x:g}" for x in range(2, 20, 2)}
    assert {s for s, _ in rated | missing} == sections
    assert all(n.reason == "no capacity covers this section" for n in ratings.not_rated)


def test_service_check_without_a_service_capacity_is_reported(tandem):
    rating = {"method": "LRFR", "material": "steel", "adtt": 1000,
              "limit_states": ["Strength I", "Service II"]}
    ratings = rate(model_file(simple_span(SPAN, rating=rating)), (tandem,), ("legal",))
    assert {r.limit_state for r in ratings.ratings} == {"Strength I"}
    reasons = {n.reason for n in ratings.not_rated if n.limit_state == "Service II"}
    assert reasons == {"no service capacity given: Service II not checked"}


def test_library_allowance_is_replaced_not_doubled():
    document = simple_span(SPAN, rating={"method": "LRFR", "material": "steel",
                                         "limit_states": ["Strength I"], "impact": 0.10})
    ratings = rate(model_file(document), ("Type 3",), ("legal",))
    rating = ratings.lowest("Type 3", "legal")
    placement = rating.live.placement
    static = sum(load for load in placement.axle_loads) / 1.10
    assert static <= 50.0 + EXACT                       # Type 3: 16 + 17 + 17 kip at most
    assert {round(x / 1.10, 9) for x in placement.axle_loads if x} <= {16.0, 17.0}
    assert rating.result.impact == 0.10
    assert rating.live_with_impact == pytest.approx(placement.value, rel=EXACT)
    assert any("set aside" in note and "Type 3 0.33" in note for note in ratings.notes)


def test_hl93_lane_load_takes_no_allowance():
    ratings = rate(model_file(simple_span(SPAN)), ("HL-93",), ("inventory",))
    rating = next(r for r in ratings.ratings if r.section == "10")
    lane = 0.64 * SPAN**2 / 8
    assert rating.live.lane == pytest.approx(lane, rel=EXACT)
    assert rating.live_with_impact == pytest.approx(
        0.5 * (rating.live.vehicle * 1.33 + lane), rel=EXACT)


def test_lfr_impact_from_the_span_of_each_section():
    spans = [50.0, 100.0]
    document = simple_span(0.0, spans=spans, rating={"method": "LFR"}, capacities=[
        {"response": "moment", "sense": "positive", "from": 0.0, "to": 150.0,
         "nominal": 9000.0},
        {"response": "moment", "sense": "negative", "from": 0.0, "to": 150.0,
         "nominal": -9000.0}])
    ratings = rate(model_file(document), ("HS20-44",), ("inventory",))
    impact = {r.section: r.result.impact for r in ratings.ratings}
    assert impact["25"] == pytest.approx(50.0 / (50.0 + 125.0))      # span 1
    assert impact["100"] == pytest.approx(50.0 / (100.0 + 125.0))    # span 2
    assert impact["S2"] == pytest.approx(50.0 / (75.0 + 125.0))      # over the pier: mean


def test_lane_type_load_only_where_its_rule_applies():
    def run(spans):
        total = sum(spans)
        document = simple_span(0.0, spans=spans, capacities=[
            {"response": "moment", "sense": "positive", "from": 0.0, "to": total,
             "nominal": 90000.0},
            {"response": "moment", "sense": "negative", "from": 0.0, "to": total,
             "nominal": -90000.0}])
        return rate(model_file(document), ("Type 3-3 lane-type",), ("legal",))

    short = run([100.0, 100.0])
    cases = {(r.sense, r.live.placement.case) for r in short.ratings}
    assert cases == {("negative", "two Type 3-3 x 0.75 + lane")}
    long = run([210.0, 210.0])
    assert ("positive", "Type 3-3 x 0.75 + lane") in {
        (r.sense, r.live.placement.case) for r in long.ratings}


def test_special_permit_distribution_divides_out_the_multiple_presence(tmp_path):
    from influence.rating.permit_check import check_permit

    geometry = {"girder": "interior", "spacing": 8.0, "span": 60.0, "slab_thickness": 8.0,
                "stiffness_parameter": 500000.0, "girders": 5, "edge_distance": 2.0}
    document = simple_span(60.0, rating={"method": "LRFR", "material": "steel",
                                         "distribution": geometry},
                           capacities=_two_senses(60.0, 3000.0))
    permit = vehicle_file(tmp_path, "crane", [20.0, 30.0, 30.0], [12.0, 4.5], "permit")
    special = check_permit(model_file(document), permit, escorted=True)
    routine = check_permit(model_file(document), permit)
    shear = next(r for r in special.ratings.ratings if r.response == "shear")
    assert shear.result.effects.distribution == pytest.approx((0.36 + 8.0 / 25.0) / 1.2)
    shear = next(r for r in routine.ratings.ratings if r.response == "shear")
    assert shear.result.effects.distribution == pytest.approx(
        0.2 + 8.0 / 12.0 - (8.0 / 35.0) ** 2)


def test_concurrent_moment_with_shear(tmp_path):
    one = vehicle_file(tmp_path, "one axle", [10.0], [], "legal")
    document = simple_span(SPAN, capacities=_two_senses(SPAN, 1000.0))
    ratings = rate(model_file(document), (str(one),), ("legal",), concurrent_moment=True)
    rating = next(r for r in ratings.ratings if r.response == "shear" and r.section == "4"
                  and r.sense == "positive")
    # the axle just right of x = 4 gives V = P (L - x)/L and M = P x (L - x)/L (statics)
    x = 4.0
    assert rating.live.vehicle == pytest.approx(10.0 * (SPAN - x) / SPAN, rel=EXACT)
    assert rating.concurrent_moment is not None
    assert rating.concurrent_moment.live == pytest.approx(
        0.5 * 1.33 * 10.0 * x * (SPAN - x) / SPAN, rel=EXACT)
    assert dict(rating.concurrent_moment.dead)["DC"] == pytest.approx(1.0 * x * (SPAN - x) / 2)


def test_dead_loads_by_name_in_their_terms(tandem):
    document = simple_span(SPAN, loads=[
        {"name": "deck", "load": "slab", "uniform": 1.0},
        {"name": "asphalt", "load": "wearing", "uniform": 0.2}])
    document["rating"]["dead_loads"] = {"DC": ["slab"], "DW": ["wearing"]}
    ratings = rate(model_file(document), (tandem,), ("legal",))
    rating = next(r for r in ratings.ratings if r.section == "10")
    assert dict(rating.rated.dead) == pytest.approx({"slab": 50.0, "wearing": 10.0})
    assert {t.name: t.factor for t in rating.result.dead} == {"DC": 1.25, "DW": 1.5}


def test_a_load_name_in_no_term_is_refused(tandem):
    document = simple_span(SPAN, loads=[{"name": "deck", "load": "slab", "uniform": 1.0}])
    with pytest.raises(ModelError, match="'slab' is in none of DC, DW, P"):
        rating_inputs(model_file(document))


def test_legal_level_of_lfr_is_refused(tandem):
    with pytest.raises(ModelError, match="not a LFR rating level"):
        rate(model_file(simple_span(SPAN, rating={"method": "LFR"})), (tandem,), ("legal",))


def test_a_vehicle_outside_the_levels_asked_is_refused():
    with pytest.raises(ModelError, match="HL-93 .design. is rated at"):
        rate(model_file(simple_span(SPAN)), ("HL-93",), ("legal",))


def test_live_load_distribution_when_rating_gives_none(tandem):
    document = simple_span(SPAN, rating={"method": "LRFR", "material": "steel",
                                         "limit_states": ["Strength I"]})
    document["live_load"] = {"distribution": 0.4, "multiple_presence": 1.2}
    ratings = rate(model_file(document), (tandem,), ("legal",))
    rating = ratings.ratings[0]
    assert rating.result.effects.distribution == pytest.approx(0.48)
    assert "[live_load]" in rating.distribution_basis
