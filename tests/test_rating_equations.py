"""Rating equations: LRFR strength and service, LFR and ASR, worked by hand on invented numbers.

The equations' form is confirmed (Khan 2010, ch. 5 p. 187; see the validation tests); the factors
below are typed in, so these tests check the arithmetic, the sense convention and the terms the
result carries for the report (computed: each expected value is worked out in the test).
"""

from __future__ import annotations

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from influence.errors import ModelError
from influence.rating import (
    SectionEffects,
    asr_rating,
    lfr_rating,
    lrfr_rating,
    lrfr_service_rating,
)

EXACT = 1e-12

# An invented girder section, kip-ft: DC 1200, DW 300, HL-93 truck 1000 and lane 400 per lane,
# distribution 0.6 lanes, Rn 5000 kip-ft, phi 1.0, phi_c 0.95 (fair), phi_s 1.0.
SAGGING = SectionEffects("positive", dead_components=1200.0, dead_wearing=300.0, live=1000.0,
                         lane=400.0, distribution=0.6)


def strength(effects=SAGGING, **changes):
    inputs = {"nominal": 5000.0, "resistance_factor": 1.0, "dead_components_factor": 1.25,
              "dead_wearing_factor": 1.5, "live_factor": 1.75, "impact": 0.33,
              "condition_factor": 0.95} | changes
    return lrfr_rating(effects, **inputs)


def test_lrfr_strength_by_hand():
    result = strength()
    # C = 0.95 x 1.0 x 1.0 x 5000 = 4750
    # dead = 1.25 x 1200 + 1.5 x 300 = 1500 + 450 = 1950
    # LL + IM = 0.6 x (1000 x 1.33 + 400) = 0.6 x 1730 = 1038
    # RF = (4750 - 1950) / (1.75 x 1038) = 2800 / 1816.5
    assert result.capacity == pytest.approx(4750.0, rel=EXACT)
    assert result.factored_dead == pytest.approx(1950.0, rel=EXACT)
    assert result.live_with_impact == pytest.approx(1038.0, rel=EXACT)
    assert result.factored_live == pytest.approx(1816.5, rel=EXACT)
    assert result.rating_factor == pytest.approx(2800.0 / 1816.5, rel=EXACT)
    assert [(t.name, t.factor, t.effect) for t in result.dead] == [
        ("DC", 1.25, 1200.0), ("DW", 1.5, 300.0)]
    assert (result.method, result.level, result.limit_state) == (
        "LRFR", "design inventory", "Strength I")
    assert (result.member_factor, result.floor_applied) == (0.95, False)
    assert result.arithmetic().endswith("= 1.541")


def test_lrfr_negative_moment_in_the_magnitude_of_the_sense():
    hogging = SectionEffects("negative", dead_components=-1800.0, dead_wearing=-250.0,
                             permanent=150.0, live=-900.0, distribution=0.7)
    result = strength(hogging, nominal=-6000.0, resistance_factor=0.9, condition_factor=1.0)
    # C = 0.9 x 6000 = 5400
    # DC 1800 and DW 250 add to the hogging; the secondary moment P = +150 relieves it: -150
    # dead = 1.25 x 1800 + 1.5 x 250 + 1.0 x (-150) = 2250 + 375 - 150 = 2475
    # LL + IM = 0.7 x 900 x 1.33 = 837.9
    assert result.capacity == pytest.approx(5400.0, rel=EXACT)
    assert result.factored_dead == pytest.approx(2475.0, rel=EXACT)
    assert result.rating_factor == pytest.approx((5400.0 - 2475.0) / (1.75 * 837.9), rel=EXACT)
    assert [t.name for t in result.dead if t.relieving] == ["P"]
    assert any("P relieves the negative sense" in note for note in result.notes)


def test_relieving_factor_replaces_the_factor_on_relieving_terms_only():
    effects = SectionEffects("positive", dead_components=1000.0, permanent=-200.0, live=500.0)
    result = strength(effects, relieving_factor=0.0)
    # the relieving P gets no credit: dead = 1.25 x 1000 + 0 x (-200) = 1250
    assert result.factored_dead == pytest.approx(1250.0, rel=EXACT)
    assert result.rating_factor == pytest.approx((4750.0 - 1250.0) / (1.75 * 500.0 * 1.33),
                                                 rel=EXACT)


def test_lrfr_service_by_hand():
    effects = SectionEffects("positive", dead_components=20.0, dead_wearing=4.0, live=9.0,
                             distribution=0.5)
    result = lrfr_service_rating(effects, service_capacity=34.0, live_factor=1.3, impact=0.33)
    # f_R = 34 (ksi, say); dead = 20 + 4 = 24; LL + IM = 0.5 x 9 x 1.33 = 5.985
    assert result.rating_factor == pytest.approx((34.0 - 24.0) / (1.3 * 5.985), rel=EXACT)
    assert (result.capacity, result.resistance_factor, result.member_factor) == (34.0, 1.0, 1.0)
    assert result.limit_state == "Service II"


def test_lfr_by_hand():
    effects = SectionEffects("positive", dead_components=500.0, dead_wearing=100.0, live=400.0)
    result = lfr_rating(effects, capacity=2500.0, dead_factor=1.3, live_factor=2.17, impact=0.25)
    # RF = (2500 - 1.3 x 600) / (2.17 x 400 x 1.25) = 1720 / 1085
    assert result.rating_factor == pytest.approx(1720.0 / 1085.0, rel=EXACT)
    assert [(t.name, t.factor, t.effect) for t in result.dead] == [("D", 1.3, 600.0)]
    operating = lfr_rating(effects, capacity=2500.0, dead_factor=1.3, live_factor=1.3,
                           impact=0.25, level="operating")
    # operating/inventory = A2 inventory / A2 operating = 2.17 / 1.3
    assert operating.rating_factor / result.rating_factor == pytest.approx(2.17 / 1.3, rel=EXACT)


def test_asr_by_hand():
    effects = SectionEffects("negative", dead_components=-300.0, dead_wearing=-50.0, live=-200.0)
    result = asr_rating(effects, allowable=-900.0, impact=0.25, level="operating")
    # RF = (900 - 350) / (200 x 1.25) = 2.2
    assert result.rating_factor == pytest.approx(2.2, rel=EXACT)
    assert result.method == "ASR"


def test_live_load_of_the_other_sense_does_not_govern():
    effects = SectionEffects("negative", dead_components=-100.0, live=50.0)
    result = lfr_rating(effects, capacity=-800.0, dead_factor=1.3, live_factor=2.17, impact=0.3)
    assert math.isinf(result.rating_factor)
    assert any("not governing" in note for note in result.notes)


@pytest.mark.parametrize(("sense", "nominal"), [("positive", -5000.0), ("negative", 5000.0),
                                                ("positive", 0.0)])
def test_capacity_of_the_wrong_sign(sense, nominal):
    with pytest.raises(ModelError, match="wrong sign") as caught:
        strength(SectionEffects(sense, live=100.0), nominal=nominal)
    assert "\n" not in str(caught.value)


@pytest.mark.parametrize("bad", [{"resistance_factor": 0.0}, {"condition_factor": -0.9},
                                 {"system_factor": 0.0}, {"live_factor": 0.0}])
def test_factors_must_be_positive(bad):
    with pytest.raises(ModelError):
        strength(**bad)


def test_bad_section_effects():
    with pytest.raises(ModelError, match="sense"):
        SectionEffects("sagging")
    with pytest.raises(ModelError, match="distribution"):
        SectionEffects("positive", distribution=0.0)


live_factors = st.floats(0.5, 3.0, allow_nan=False)
added = st.floats(1.0, 5000.0, allow_nan=False)


@given(live_factors, live_factors)
def test_rating_factor_scales_as_one_over_the_live_factor(g1, g2):
    for rate in (lambda g: strength(live_factor=g),
                 lambda g: lfr_rating(SAGGING, capacity=5000.0, dead_factor=1.3, live_factor=g,
                                      impact=0.2),
                 lambda g: lrfr_service_rating(SAGGING, service_capacity=4000.0, live_factor=g,
                                               impact=0.33)):
        assert rate(g1).rating_factor * g1 == pytest.approx(rate(g2).rating_factor * g2,
                                                            rel=1e-9)


@given(added, st.sampled_from(["positive", "negative"]))
def test_more_capacity_raises_every_factor(more, sense):
    sign = 1.0 if sense == "positive" else -1.0
    effects = SectionEffects(sense, dead_components=sign * 800.0, dead_wearing=sign * 100.0,
                             live=sign * 600.0, lane=sign * 150.0, distribution=0.8)

    def factors(capacity: float) -> list[float]:
        c = sign * capacity
        return [
            strength(effects, nominal=c).rating_factor,
            lrfr_service_rating(effects, service_capacity=c, live_factor=0.8,
                                impact=0.33).rating_factor,
            lfr_rating(effects, capacity=c, dead_factor=1.3, live_factor=2.17,
                       impact=0.3).rating_factor,
            asr_rating(effects, allowable=c, impact=0.3).rating_factor,
        ]

    for before, after in zip(factors(3000.0), factors(3000.0 + more), strict=True):
        assert after > before
