"""Turning points and rainflow counting: the batched counter against the ``rainflow`` library
(an independent implementation of ASTM E1049-85 5.4.4), and invariants of counting."""

from __future__ import annotations

import math

import numpy as np
import pytest
import rainflow
from hypothesis import given, settings
from hypothesis import strategies as st

from influence.errors import InfluenceError
from influence.fatigue import Histories, count_cycles, count_many, turning_points

EXACT = 1e-12

values = st.floats(min_value=-100.0, max_value=100.0, allow_nan=False).map(lambda v: round(v, 1))
history = st.lists(values, min_size=0, max_size=14)


def library_cycles(history: list[float]) -> list[tuple[float, float, float]]:
    """The library's cycles of a history's exact turning points, (range, count, mean).

    The library's own reversal search is bypassed where it differs from ASTM E1049-85 5.4.4: a
    two-point series loses its end point (one half cycle by 5.4.4), and a constant series gives a
    zero-range half cycle (none here)."""
    points = list(turning_points(history, tolerance=0.0))
    if len(points) == 2:
        return [(abs(points[1] - points[0]), 0.5, (points[0] + points[1]) / 2)]
    return [(float(r), float(c), float(m)) for r, m, c, _, _ in rainflow.extract_cycles(points)]


@settings(max_examples=300, deadline=None)
@given(st.lists(history, min_size=1, max_size=12))
def test_batch_counts_are_the_library_counts(histories):
    """Same cycles in the same order for every history (rounded values make ties common)."""
    batch = count_many(Histories.of(histories), tolerance=0.0)
    for k, one in enumerate(histories):
        assert list(batch.per_history(k)) == library_cycles(one)


@settings(max_examples=200, deadline=None)
@given(history)
def test_single_counter_is_the_library(one):
    found = [(c.range, c.count, c.mean) for c in count_cycles(one).cycles]
    assert found == library_cycles(one)


@settings(max_examples=200, deadline=None)
@given(history, st.floats(min_value=0.1, max_value=1e3), st.floats(min_value=-50, max_value=50))
def test_counting_scales_and_shifts(one, factor, shift):
    """Ranges scale with the history and ignore a constant offset; counts do not change."""
    base = count_cycles(one)
    moved = count_cycles([factor * v + shift for v in one])
    assert [c.count for c in moved.cycles] == [c.count for c in base.cycles]
    for a, b in zip(moved.cycles, base.cycles, strict=True):
        assert math.isclose(a.range, factor * b.range, rel_tol=1e-9, abs_tol=1e-9)


@settings(max_examples=200, deadline=None)
@given(history)
def test_rainflow_keeps_the_largest_range(one):
    """The overall range max - min is always counted (at least as a half cycle)."""
    if len(set(one)) < 2:
        assert count_cycles(one).cycles == ()
        return
    ranges = [c.range for c in count_cycles(one).cycles]
    assert math.isclose(max(ranges), max(one) - min(one), rel_tol=EXACT)


@settings(max_examples=200, deadline=None)
@given(history)
def test_turning_points_alternate_and_keep_the_ends(one):
    points = turning_points(one)
    if not one:
        assert points == ()
        return
    assert points[0] == one[0]
    steps = np.diff(points)
    assert np.all(steps != 0)
    assert np.all(steps[:-1] * steps[1:] < 0)
    if len(points) > 1:
        assert points[-1] == one[-1] or points[-1] in (max(one), min(one))


def test_noise_below_the_gate_is_not_counted():
    noisy = [0.0, 1e-12, -1e-12, 50.0, 50.0 - 1e-11, 50.0, 0.0]
    batch = count_many(Histories.of([noisy]))
    counted = batch.per_history(0)
    assert [c for _, c, _ in counted] == [0.5, 0.5]  # tiny cycles dropped by the gate
    assert all(math.isclose(r, 50.0, abs_tol=1e-9 * 50.0) for r, _, _ in counted)
    assert turning_points(noisy) == (0.0, 50.0, 0.0)


def test_empty_and_single_point_histories():
    batch = count_many(Histories.of([[], [3.0], [1.0, 1.0, 1.0], [0.0, 2.0]]))
    assert [batch.per_history(k) for k in range(4)] == [(), (), (), ((2.0, 0.5, 1.0),)]
    assert count_many(Histories.of([])).counts.shape[0] == 0


def test_batches_larger_than_one_chunk():
    from influence.fatigue import batch_counting
    histories = [[0.0, float(k % 7) + 1.0, -1.0, 0.0] for k in range(batch_counting.CHUNK + 3)]
    batch = count_many(Histories.of(histories))
    last = batch.per_history(batch_counting.CHUNK + 2)
    assert [tuple(c) for c in last] == [tuple(c) for c in library_cycles(histories[-1])]


def test_histories_refuse_bad_offsets_and_values():
    with pytest.raises(InfluenceError, match="offsets"):
        Histories(np.zeros(3), np.array([0, 2]))
    with pytest.raises(InfluenceError, match="history 1"):
        Histories.of([[0.0, 1.0], [0.0, float("nan")]])


def test_unknown_method():
    with pytest.raises(InfluenceError, match="rainflow or repeating"):
        count_cycles([0.0, 1.0], method="range-pair")  # type: ignore[arg-type]
