"""The LFR/ASR impact fraction of the AASHTO Standard Specifications.

Reference: AASHTO, *Standard Specifications for Highway Bridges*, 17th ed., 2002, Art. 3.8.2.1:
I = 50/(L + 125) with L the loaded length in feet, and I not more than 0.30. The 30 % cap is
confirmed (a public reproduction of the AASHTO load-rating provisions); the formula is from
memory, unconfirmed. A model in metres is converted at 1 ft = 0.3048 m (exact).
"""

from __future__ import annotations

import pytest
from hypothesis import given
from hypothesis import strategies as st

from influence.errors import ModelError
from influence.rating import lfr_impact

EXACT = 1e-12
CAP_LENGTH_FT = 50.0 / 0.30 - 125.0   # 41.67 ft: the formula reaches the cap here


@pytest.mark.parametrize("span_ft", [50.0, 75.0, 100.0, 200.0, 400.0])
def test_formula_above_the_cap_length(span_ft):
    assert lfr_impact(span_ft, "kip-ft").fraction == pytest.approx(50.0 / (span_ft + 125.0),
                                                                   rel=EXACT)


@pytest.mark.parametrize("span_ft", [5.0, 20.0, 40.0, CAP_LENGTH_FT])
def test_cap_at_030_for_short_spans(span_ft):
    assert lfr_impact(span_ft, "kip-ft").fraction == pytest.approx(0.30, rel=EXACT)


def test_metres_are_converted_to_feet():
    span_m = 30.0
    feet = span_m / 0.3048
    assert lfr_impact(span_m, "kN-m").fraction == pytest.approx(50.0 / (feet + 125.0), rel=EXACT)
    assert lfr_impact(span_m, "kN-m").fraction == pytest.approx(
        lfr_impact(feet, "kip-ft").fraction, rel=EXACT)


@given(st.floats(1.0, 1000.0), st.floats(0.0, 500.0))
def test_never_above_the_cap_and_never_rising_with_length(span, more):
    short = lfr_impact(span, "kip-ft").fraction
    long = lfr_impact(span + more, "kip-ft").fraction
    assert 0.0 < long <= short <= 0.30


@pytest.mark.parametrize(("span", "units"), [(0.0, "kip-ft"), (-3.0, "kN-m"), (10.0, "m")])
def test_bad_input_is_one_line_error(span, units):
    with pytest.raises(ModelError) as caught:
        lfr_impact(span, units)
    assert "\n" not in str(caught.value)
