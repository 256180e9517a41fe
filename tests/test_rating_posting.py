"""Posting: rounding to a sign increment, SHV screening and emergency-vehicle limits.

The posting law itself is checked against its source in tests/validation/test_khan_rating_posting
.py. SHV screening: FHWA, *Load Rating of Specialized Hauling Vehicles, Questions and Answers*
(March 2014), confirmed in substance. EV limits: FHWA memorandum of 3 Nov 2016 (as quoted by the
TxDOT Bridge Inspection Manual, ch. 6 sec. 2, confirmed) with the FAST Act axle limits 33.5 kip
single and 62 kip tandem, 86 kip gross (confirmed, J. J. Keller, 2 Mar 2016); the arithmetic
limit = RF x weight is from memory, unconfirmed.
"""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from influence.errors import ModelError
from influence.rating import emergency_vehicle_limits, posting, single_unit_posting

EXACT = 1e-12
SU = {"SU4": (1.10, 27.0), "SU5": (0.95, 31.0), "SU6": (0.90, 34.75), "SU7": (0.25, 38.75)}


@given(st.floats(0.3, 0.99), st.floats(5.0, 80.0), st.sampled_from([0.5, 1.0, 5.0]))
def test_rounding_down_to_the_increment(rf, weight, increment):
    result = posting(rf, weight, increment)
    assert result.load is not None and result.exact_load is not None
    assert result.load <= result.exact_load + 1e-9
    assert result.exact_load - result.load < increment + 1e-9
    assert (result.load / increment) == pytest.approx(round(result.load / increment), abs=1e-9)


def test_a_whole_increment_is_not_rounded_down_by_noise():
    # 0.65 x ... : W/0.7 (RF - 0.3) = 40/0.7 x 0.35 = 20 exactly in decimal arithmetic
    assert posting(0.65, 40.0, increment=5.0).load == 20.0


@pytest.mark.parametrize(("weight", "increment"), [(0.0, None), (-2.0, None), (36.0, 0.0),
                                                   (36.0, -1.0)])
def test_posting_bad_input(weight, increment):
    with pytest.raises(ModelError):
        posting(0.8, weight, increment)


def test_nrl_screening_passes():
    result = single_unit_posting(1.0)
    assert result.screened_out and result.postings == () and result.posted == ()


def test_nrl_fails_each_su_below_one_is_posted():
    result = single_unit_posting(0.92, SU, increment=1.0)
    assert not result.screened_out
    actions = {name: p.action for name, p in result.postings}
    assert actions == {"SU4": "none", "SU5": "post", "SU6": "post", "SU7": "consider closing"}
    loads = {name: p.load for name, p in result.posted}
    # SU5: 31/0.7 x 0.65 = 28.79 -> 28; SU6: 34.75/0.7 x 0.6 = 29.79 -> 29
    assert loads == {"SU5": 28.0, "SU6": 29.0, "SU7": None}


def test_nrl_fails_without_su_ratings():
    with pytest.raises(ModelError, match="SU6, SU7"):
        single_unit_posting(0.8, {"SU4": (1.0, 27.0), "SU5": (1.0, 31.0)})


def test_emergency_vehicle_limits():
    limits = emergency_vehicle_limits(0.75, 0.95)
    assert limits.posted
    assert limits.single_axle_kip == pytest.approx(0.75 * 33.5, rel=EXACT)
    assert limits.tandem_kip == pytest.approx(0.95 * 62.0, rel=EXACT)
    # gross: the lesser of 0.75 x 57.5 = 43.1 and 0.95 x 86 = 81.7
    assert limits.gross_kip == pytest.approx(0.75 * 57.5, rel=EXACT)
    rounded = emergency_vehicle_limits(0.75, 0.95, increment_kip=1.0)
    assert (rounded.single_axle_kip, rounded.tandem_kip, rounded.gross_kip) == (25.0, 58.0, 43.0)


def test_no_ev_posting_when_both_rate_one_or_more():
    limits = emergency_vehicle_limits(1.0, 1.3)
    assert not limits.posted
    assert (limits.single_axle_kip, limits.tandem_kip, limits.gross_kip) == (None, None, None)
    with pytest.raises(ModelError):
        emergency_vehicle_limits(0.9, 0.9, increment_kip=0.0)
