"""Load trains: arrangement of ranged gaps, headways, reversal, totals, centroid.

Expected values are closed forms written in the test (sums of loads and gaps); the truck is the
HL-93 design truck (AASHTO LRFD 3.6.1.2.2, confirmed: 8, 32, 32 kip at 14 and 14 to 30 ft).
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from vehicles import Axle, Patch, Train, VehicleError

EXACT = 1e-12
"""Tolerance for sums of a few exactly representable numbers [same unit as the quantity]."""

TRUCK = Train("design truck", (Axle(8.0), Axle(32.0, 14.0), Axle(32.0, (14.0, 30.0))))


def test_ranged_gap_is_chosen_and_clipped() -> None:
    (choice,) = TRUCK.ranged_values
    assert (choice.item, choice.attribute, choice.low, choice.high) == (2, "gap", 14.0, 30.0)
    assert TRUCK.arranged().axle_offsets.tolist() == [0.0, 14.0, 28.0]  # minimum by default
    assert TRUCK.arranged([22.5]).axle_offsets.tolist() == [0.0, 14.0, 36.5]
    assert TRUCK.arranged([99.0]).values == (30.0,)  # clipped to the range
    assert TRUCK.length([30.0]) == 44.0


def test_wrong_number_of_choices_is_an_error() -> None:
    with pytest.raises(VehicleError, match="1 ranged"):
        TRUCK.arranged([14.0, 14.0])


def test_headway_range_joins_two_trucks() -> None:
    fixed = Train("truck", (Axle(8.0), Axle(32.0, 14.0), Axle(32.0, 14.0)))
    pair = fixed.followed_by(fixed, (50.0, 200.0))
    assert [r.item for r in pair.ranged_values] == [3]
    offsets = pair.arranged([75.0]).axle_offsets
    assert offsets.tolist() == [0.0, 14.0, 28.0, 103.0, 117.0, 131.0]
    assert pair.total_load() == 2 * (8.0 + 32.0 + 32.0)


def test_centroid_of_the_truck() -> None:
    # resultant position = sum(P_i d_i) / sum(P_i), rear gap at its minimum
    expected = (32.0 * 14.0 + 32.0 * 28.0) / 72.0
    assert math.isclose(TRUCK.centroid(), expected, rel_tol=EXACT)


def test_trailing_unlimited_patch() -> None:
    loco = Train("loco", (Axle(250.0), Axle(250.0, 1.6), Patch(80.0, None, 0.8)))
    a = loco.arranged()
    assert math.isclose(a.patch_starts[0], 1.6 + 0.8, rel_tol=EXACT)
    assert a.patch_ends.tolist() == [math.inf]
    assert loco.total_load() == math.inf
    with pytest.raises(VehicleError, match="no centroid"):
        loco.centroid()


def test_leading_unlimited_patch_lies_ahead_of_the_reference_point() -> None:
    train = Train("pushed", (Patch(10.0), Axle(100.0, 2.0), Axle(100.0, 3.0)))
    a = train.arranged()
    assert a.axle_offsets.tolist() == [0.0, 3.0]
    assert (a.patch_starts[0], a.patch_ends[0]) == (-math.inf, -2.0)


def test_unlimited_patch_inside_a_train_is_an_error() -> None:
    with pytest.raises(VehicleError, match="first or last"):
        Train("bad", (Axle(1.0), Patch(1.0, None, 1.0), Axle(1.0, 1.0)))


@pytest.mark.parametrize("gap", [(3.0, 2.0), (1.0, math.nan), (1.0, math.inf), -1.0])
def test_bad_gaps_are_errors(gap: object) -> None:
    with pytest.raises(VehicleError):
        Axle(10.0, gap)  # type: ignore[arg-type]


def test_first_gap_means_nothing() -> None:
    assert Train("t", (Axle(5.0, 7.0),)) == Train("t", (Axle(5.0),))


finite_items = st.one_of(
    st.builds(Axle, st.floats(0.5, 500.0), st.floats(0.1, 20.0)),
    st.builds(Patch, st.floats(0.5, 200.0), st.floats(0.1, 30.0), st.floats(0.0, 20.0)),
)


@settings(max_examples=60, deadline=None)
@given(st.lists(finite_items, min_size=1, max_size=7))
def test_reversal_mirrors_every_load(items: list[Axle | Patch]) -> None:
    """Reversal symmetry (common practice): a load at d behind the front of a train of length
    L sits at L - d behind the front of the reversed train; totals are equal."""
    train = Train("random", tuple(items))
    back = train.reversed()
    length = train.length()
    a, b = train.arranged(), back.arranged()
    assert np.allclose(np.sort(length - a.axle_offsets), np.sort(b.axle_offsets), atol=1e-9)
    assert np.allclose(np.sort(length - a.patch_ends), np.sort(b.patch_starts), atol=1e-9)
    assert math.isclose(back.total_load(), train.total_load(), rel_tol=1e-12)
    assert math.isclose(back.length(), length, rel_tol=1e-12)
    assert back.reversed() == train
