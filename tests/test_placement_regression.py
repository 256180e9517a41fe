"""Regression cases that catch shortcuts in moving-load searches (not validation).

An exact search must consider subsets of axles on the span, not only Barre's placement of the
whole train (Barre's rule holds for the axles then on the span: T. G. Hicks, *Civil Engineering
Formulas*, ch. 2; trying every group of axles on the span is common practice). Expected values are
closed forms (one axle at midspan: P L / 4), computed.
"""

from __future__ import annotations

import pytest

from tests.section_scan import axle_train, largest_over_sections, one_case, section_grid

EXACT = 1e-9


@pytest.mark.parametrize(
    ("L", "loads", "gaps", "expected", "shortcut"),
    [
        # H20 (8 + 32 kip at 14 ft) on 20 ft: 32 x 20/4 = 160, not the whole-truck 147.92
        (20.0, [8.0, 32.0], [14.0], 32 * 20 / 4, 147.92),
        # two equal loads at a/L = 0.60: P L / 4 beats (P/2L)(L - a/2)^2
        (10.0, [1.0, 1.0], [6.0], 1 * 10 / 4, 1 / 20 * (10 - 3) ** 2),
        # 30 + 10 kip at 10 ft on 12 ft: 30 x 12/4 = 90
        (12.0, [30.0, 10.0], [10.0], 30 * 12 / 4, None),
    ],
)
def test_absolute_maximum_with_one_axle_governing(L, loads, gaps, expected, shortcut):
    best = largest_over_sections(L, one_case(axle_train(loads, gaps)), section_grid(L, 39))
    assert best.value == pytest.approx(expected, rel=EXACT)
    if shortcut is not None:
        assert best.value > shortcut
