"""ASTM E1049-85 (reapproved 2017), Standard Practices for Cycle Counting in Fatigue Analysis,
ASTM International: the load history of its rainflow examples and the counts it prints.

- 5.4.4 and Fig. 6, rainflow counting (3-point method with half cycles) of the history
  -2, 1, -3, 5, -1, 3, -4, 4, -2: range 3: 0.5 cycle, 4: 1.5, 6: 0.5, 8: 1.0, 9: 0.5
  (confirmed: the standard's table as reproduced in the tests of two fatigue libraries).
- 5.4.5 and Fig. 7, simplified rainflow counting for repeating histories, the same history
  repeated and started at its largest peak (5): ranges 3, 4, 7 and 9, one full cycle each
  (confirmed, as above).
- The cycles of Fig. 6 one by one (from, to, count): (-2, 1, 1/2), (1, -3, 1/2), (-1, 3, 1),
  (-3, 5, 1/2), (5, -4, 1/2), (-4, 4, 1/2), (4, -2, 1/2) (confirmed, as above).

The tool implements 5.4.4 with half cycles (single passages of vehicles) and 5.4.5 separately.
"""

from __future__ import annotations

import pytest

from influence.fatigue import Histories, count_cycles, count_many, turning_points

HISTORY = (-2.0, 1.0, -3.0, 5.0, -1.0, 3.0, -4.0, 4.0, -2.0)
"""ASTM E1049-85 Fig. 6 and Fig. 7 load history [load units]."""

RAINFLOW_COUNTS = ((3.0, 0.5), (4.0, 1.5), (6.0, 0.5), (8.0, 1.0), (9.0, 0.5))
"""5.4.4 (Fig. 6 table): range and cycles."""

REPEATING_COUNTS = ((3.0, 1.0), (4.0, 1.0), (7.0, 1.0), (9.0, 1.0))
"""5.4.5 (Fig. 7 table): range and cycles."""

FIG6_CYCLES = ((-2.0, 1.0, 0.5), (1.0, -3.0, 0.5), (-1.0, 3.0, 1.0), (-3.0, 5.0, 0.5),
               (5.0, -4.0, 0.5), (-4.0, 4.0, 0.5), (4.0, -2.0, 0.5))
"""5.4.4, Fig. 6: each cycle as (from, to, count)."""


def test_rainflow_counting_5_4_4():
    """ASTM E1049-85 5.4.4: the printed table, 4.0 cycles in all."""
    result = count_cycles(HISTORY)
    assert result.by_range() == RAINFLOW_COUNTS
    assert result.total == 4.0
    assert result.method == "rainflow"
    assert "5.4.4" in result.practice


def test_rainflow_cycles_one_by_one_fig_6():
    """ASTM E1049-85 Fig. 6: the same cycles, each with its peak and valley (as a mean)."""
    found = sorted((c.range, c.mean, c.count) for c in count_cycles(HISTORY).cycles)
    expected = sorted((abs(b - a), (a + b) / 2, n) for a, b, n in FIG6_CYCLES)
    assert found == expected


def test_counts_are_halves_or_wholes():
    assert {c.count for c in count_cycles(HISTORY).cycles} <= {0.5, 1.0}
    assert {c.count for c in count_cycles(HISTORY, method="repeating").cycles} == {1.0}


def test_repeating_history_5_4_5():
    """ASTM E1049-85 5.4.5: the repeated history, started at its largest peak."""
    result = count_cycles(HISTORY, method="repeating")
    assert result.by_range() == REPEATING_COUNTS
    assert "5.4.5" in result.practice


@pytest.mark.parametrize("shift", range(len(HISTORY) - 1))
def test_repeating_history_does_not_depend_on_where_it_is_cut(shift):
    """A repeating history has no start (5.4.5): any rotation of one period counts the same."""
    period = list(HISTORY[:-1])  # the last point -2 joins the first one
    rotated = period[shift:] + period[:shift]
    assert count_cycles(rotated, method="repeating").by_range() == REPEATING_COUNTS


def test_batch_counter_prints_the_standards_counts():
    """The batched counter on the same history, alone and among others."""
    batch = count_many(Histories.of([[0.0, 1.0], HISTORY, [2.0, -2.0, 2.0]]))
    totals: dict[float, float] = {}
    for size, count, _ in batch.per_history(1):
        totals[size] = totals.get(size, 0.0) + count
    assert tuple(sorted(totals.items())) == RAINFLOW_COUNTS


def test_end_points_are_reversals():
    """Dropping the end points loses the half cycles (a pitfall reported against a library:
    interior points only give (4, 1.5), (8, 1.0), (9, 0.5))."""
    assert turning_points(HISTORY) == HISTORY
    assert count_cycles(HISTORY[1:-1]).by_range() == ((4.0, 1.5), (8.0, 1.0), (9.0, 0.5))
