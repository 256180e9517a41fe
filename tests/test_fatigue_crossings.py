"""Crossing histories: the batched kernel against the effect function's skeleton, both against a
dense sampling, turning points of many histories against one at a time, vehicles in a row.

The reference of the batched histories is the general effect function of the placement search
(:func:`vehicles.search.effects.effect_function`, its pieces formed by
:func:`piecewise.shifted.shifted_sums`), an independent way of forming the same sum; a dense
sampling of that function can never reach beyond the exact turning points (computed).
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.errors import ModelError
from influence.fatigue import count_cycles
from influence.fatigue.crossings import crossing, crossing_histories
from influence.fatigue.fleet import Fleet, platoon
from influence.fatigue.reversals import reversal_mask, turning_points
from influence.model.beamform import continuous_beam
from piecewise import Piecewise
from vehicles.train import Axle, Patch, Train

AGREE = 1e-9
"""Relative to the largest effect: the batched and the general sums agree to rounding."""

SAMPLES = 4001
"""Lead positions of the dense sampling."""


def _train(loads: list[float], gaps: list[float]) -> Train:
    return Train("truck", tuple(Axle(p, g) for p, g in zip(loads, [0.0, *gaps], strict=True)))


trucks = st.integers(1, 6).flatmap(lambda n: st.tuples(
    st.lists(st.floats(2.0, 40.0), min_size=n, max_size=n),
    st.lists(st.sampled_from([1.0, 4.0, 4.3, 10.0, 14.0, 20.0, 30.0]) | st.floats(1.0, 40.0),
             min_size=n - 1, max_size=n - 1)))
responses = st.sampled_from([("moment", 0.37), ("moment", 0.97), ("shear", 0.5), ("shear", 0.0),
                             ("reaction", None)])


@settings(max_examples=40, deadline=None)
@given(spans=st.lists(st.floats(8.0, 40.0), min_size=1, max_size=3), truck=trucks,
       response=responses, direction=st.sampled_from(["forward", "reverse"]))
def test_exact_turning_points_agree_and_bound_a_dense_sampling(spans, truck, response,
                                                              direction):
    model = continuous_beam(spans, 1.0, ["pinned"] + ["roller"] * len(spans))
    kind, fraction = response
    location = "S1" if fraction is None else repr(fraction * spans[0])
    line = analyse_model(model).line(Response(kind, location))
    train = _train(*truck)
    one = crossing(line, train, direction)
    batch = crossing_histories(line, Fleet.of_trains([train, train], [1.0, 1.0], "kN-m"),
                               direction)
    scale = max(np.abs(one.values).max(), 1e-12)
    for k in range(2):
        assert batch.history(k).size == one.values.size
        assert np.all(np.abs(batch.history(k) - one.values) <= AGREE * scale)
    # every turning point is a value of the history, at its position (one limit or the other)
    right = one.effect.values(one.positions)
    left = one.effect.values(one.positions, side="left")
    assert np.all(np.minimum(np.abs(right - one.values), np.abs(left - one.values))
                  <= AGREE * scale)
    # a dense sampling reaches no further than the exact turning points
    leads = np.linspace(one.positions[0], one.positions[-1], SAMPLES)
    sampled = one.effect.values(leads)
    assert sampled.max() <= one.values.max() + AGREE * scale
    assert sampled.min() >= one.values.min() - AGREE * scale
    largest = max((c.range for c in count_cycles(turning_points(sampled)).cycles), default=0.0)
    assert largest <= np.ptp(one.values) + AGREE * scale


def test_pieces_above_cubic_agree_with_the_general_sum():
    rng = np.random.default_rng(5)
    breaks = np.array([0.0, 3.0, 7.5, 10.0])
    line = Piecewise(breaks, rng.uniform(-1.0, 1.0, (6, 3)) * np.array([[1, 1, 0.3, 0.1, 0.02,
                                                                          0.004]]).T)
    train = _train([10.0, 25.0, 25.0], [2.5, 1.2])
    one = crossing(line, train)
    (history,) = [crossing_histories(line, Fleet.of_trains([train], [1.0], "kN-m")).history(0)]
    scale = np.abs(one.values).max()
    assert history.size == one.values.size
    assert np.all(np.abs(history - one.values) <= AGREE * scale)


@settings(max_examples=200, deadline=None)
@given(st.lists(st.lists(st.integers(-4, 4), min_size=1, max_size=12), min_size=1,
                max_size=6))
def test_turning_points_of_many_histories_are_those_of_each_alone(rows):
    width = max(len(r) for r in rows)
    padded = np.array([r + [r[-1]] * (width - len(r)) for r in rows], dtype=float)
    keep = reversal_mask(padded, tolerance=0.0)
    for row, mask in zip(padded, keep, strict=True):
        points = row[mask]
        alone = turning_points(row, tolerance=0.0)
        # both ends are kept even where the history never moves (one entry: once)
        expected = alone if len(alone) > 1 or width == 1 else (row[0], row[-1])
        assert tuple(points.tolist()) == tuple(expected)


def test_two_vehicles_in_a_row_give_two_humps_and_two_cycles():
    span, at, load = 20.0, 8.0, 100.0
    line = analyse_model(continuous_beam([span], 1.0, ["pinned", "roller"])).line(
        Response("moment", repr(at)))
    one = Train("axle", (Axle(load),))
    pair = platoon([one, one], [span + 5.0])  # the second enters after the first has left
    history = crossing(line, pair)
    peak = load * at * (span - at) / span
    assert np.allclose(history.values, [0.0, peak, 0.0, peak, 0.0], atol=AGREE * peak)
    assert np.allclose(history.positions, [0.0, at, span, span + 5.0 + at, 2 * span + 5.0])
    assert count_cycles(history.values).total == 2.0


def test_vehicles_with_uniform_loads_or_ranged_gaps_are_refused():
    with pytest.raises(ModelError, match="uniform load"):
        Fleet.of_trains([Train("wagon", (Axle(10.0), Patch(5.0, 3.0, 1.0)))], [1.0], "kN-m")
    with pytest.raises(ModelError, match="range"):
        Fleet.of_trains([Train("design", (Axle(8.0), Axle(32.0, (14.0, 30.0))))], [1.0],
                        "kip-ft")
    with pytest.raises(ModelError, match="headways"):
        platoon([Train("a", (Axle(1.0),))] * 2, [])
