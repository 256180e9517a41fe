"""One section rated from the [rating] settings: the factors each level and method picks.

The factor values come from the MBE tables (from memory, unconfirmed; see
tests/validation/test_mbe_factor_tables.py); here each expected RF is worked out by hand
(computed) to show which factor went where.
"""

from __future__ import annotations

import pytest

from influence.errors import ModelError
from influence.rating import (
    Capacity,
    SectionEffects,
    distribution_factors,
    distribution_for,
    rate_section,
    rating_settings,
)

EXACT = 1e-12
SPAN = 60.0
GIRDER = {"girder": "interior", "spacing": 8.0, "span": SPAN, "slab_thickness": 8.0,
          "stiffness_parameter": 500_000.0, "girders": 5, "edge_distance": 2.0}
MOMENT = Capacity("moment", "positive", 6000.0, 0.9, service=4500.0, start=0.0, end=SPAN,
                  allowable=(("inventory", 3000.0), ("operating", 4000.0)))
SHEAR = Capacity("shear", "positive", 500.0, 1.0, start=0.0, end=SPAN)
EFFECTS = SectionEffects("positive", dead_components=1500.0, dead_wearing=200.0, live=900.0)


def settings(**rating):
    return rating_settings({"rating": {"material": "steel"} | rating}, "kip-ft")


def rate(s, capacity=MOMENT, effects=EFFECTS, **kwargs):
    return rate_section(s, capacity, effects, span_length=SPAN, units="kip-ft", **kwargs)


def test_design_inventory_strength_i():
    result = rate(settings(condition_factor="fair", system_factor=0.9), level="design inventory",
                  limit_state="Strength I")
    # C = 0.95 x 0.9 x 0.9 x 6000 = 4617 (phi_c phi_s = 0.855 stays above 0.85)
    # RF = (4617 - 1.25 x 1500 - 1.5 x 200) / (1.75 x 900 x 1.33)
    assert result.rating_factor == pytest.approx((4617.0 - 2175.0) / (1.75 * 1197.0), rel=EXACT)
    assert not result.floor_applied


def test_shear_takes_no_system_factor():
    effects = SectionEffects("positive", dead_components=100.0, live=80.0)
    result = rate(settings(system_factor=0.85), SHEAR, effects, level="design operating",
                  limit_state="Strength I")
    assert result.system_factor == 1.0
    assert result.rating_factor == pytest.approx((500.0 - 125.0) / (1.35 * 80.0 * 1.33),
                                                 rel=EXACT)


def test_legal_level_takes_the_adtt_factor_and_the_surface_reduction():
    result = rate(settings(adtt=3000, edition="MBE 1st", surface="smooth riding surface"),
                  level="legal", limit_state="Strength I")
    gamma = 1.65 + (3000.0 - 1000.0) / 4000.0 * (1.80 - 1.65)
    assert result.live_factor == pytest.approx(gamma, rel=EXACT)
    assert result.impact == 0.10                              # span 60 ft >= 40 ft
    assert result.rating_factor == pytest.approx((5400.0 - 2175.0) / (gamma * 900.0 * 1.10),
                                                 rel=EXACT)


def test_impact_override():
    result = rate(settings(impact=0.2), level="design inventory", limit_state="Strength I")
    assert result.impact == 0.2


def test_service_ii_uses_the_service_capacity():
    result = rate(settings(), level="legal", limit_state="Service II")
    assert result.rating_factor == pytest.approx((4500.0 - 1700.0) / (1.3 * 900.0 * 1.33),
                                                 rel=EXACT)
    assert rate(settings(), SHEAR, level="legal", limit_state="Service II") is None


def test_special_permit_rating_and_its_distribution():
    s = settings(adtt=500, distribution=GIRDER,
                 permit={"type": "special", "loading": "escorted, no other vehicles"})
    result = rate(s, level="permit", limit_state="Strength II")
    assert result.live_factor == 1.10                         # MBE 2nd, escorted single trip
    one_lane = distribution_factors(s.distribution.geometry, "interior", "moment").one_lane
    assert distribution_for(s, "moment", "permit") == pytest.approx(one_lane / 1.2, rel=EXACT)
    assert distribution_for(s, "moment", "legal") == pytest.approx(
        distribution_factors(s.distribution.geometry, "interior", "moment").governing)


def test_distribution_for_a_number_or_nothing():
    assert distribution_for(settings(distribution=0.55), "shear", "permit") == 0.55
    assert distribution_for(settings(), "moment", "legal") == 1.0


def test_lfr_and_asr_levels():
    lfr = rating_settings({"rating": {"method": "LFR"}}, "kip-ft")
    impact = 50.0 / (SPAN + 125.0)
    inventory = rate(lfr, level="inventory")
    # C = phi Rn = 5400; RF = (5400 - 1.3 x 1700) / (2.17 x 900 x (1 + I))
    assert inventory.rating_factor == pytest.approx(
        (5400.0 - 2210.0) / (2.17 * 900.0 * (1.0 + impact)), rel=EXACT)
    asr = rating_settings({"rating": {"method": "ASR"}}, "kip-ft")
    operating = rate(asr, level="operating")
    assert operating.rating_factor == pytest.approx((4000.0 - 1700.0) / (900.0 * (1.0 + impact)),
                                                    rel=EXACT)
    assert rate(asr, SHEAR, level="inventory") is None


def test_errors():
    with pytest.raises(ModelError, match="negative effects"):
        rate(settings(), effects=SectionEffects("negative", live=-10.0),
             level="legal", limit_state="Strength I")
    with pytest.raises(ModelError, match="needs a permit"):
        rate(settings(), level="permit", limit_state="Strength II")
    with pytest.raises(ModelError, match="needs a permit"):
        distribution_for(settings(distribution=GIRDER), "moment", "permit")
    with pytest.raises(ModelError, match="limit state"):
        rate(settings(), level="legal", limit_state="Strength II")
