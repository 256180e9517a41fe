"""Concurrent effects: other responses under exactly the loads of a governing placement.

Checks by statics (common practice): the reactions of a simple span under any placement add up
to the loads on it; the same influence line gives back the placement's own value.
"""

from __future__ import annotations

import pytest

from tests.influence_forms import X, continuous_moment, polynomial_line, simple_moment, simple_shear
from tests.section_scan import axle_train, one_case
from vehicles.search.concurrent import concurrent
from vehicles.search.govern import govern
from vehicles.train import Axle, Patch, Train

EXACT = 1e-9
L = 30.0


def test_same_line_gives_the_placement_value():
    line = continuous_moment([L, L], 40.0)
    train = Train("t", (Axle(50.0), Axle(80.0, 4.0), Patch(20.0, 10.0, 3.0)))
    best = govern(line, one_case(train, lane=5.0, knife_edge_moment=40.0), kind="moment").min
    assert concurrent(best, line).value == pytest.approx(best.value, rel=EXACT)


def test_reactions_concurrent_with_max_moment_balance_the_loads():
    train = Train("t", (Axle(50.0), Axle(80.0, 4.0), Patch(20.0, 6.0, 3.0)))
    best = govern(simple_moment(L, 11.0), one_case(train), kind="moment").max
    left = concurrent(best, polynomial_line([0.0, L], [(L - X) / L]))
    right = concurrent(best, polynomial_line([0.0, L], [X / L]))
    on_span = sum(p for x, p in zip(best.axle_positions, best.axle_loads, strict=True)
                  if 0 <= x <= L)
    on_span += sum((b - a) * q for a, b, q in best.patch_segments)
    assert left.value + right.value == pytest.approx(on_span, rel=EXACT)


def test_shear_concurrent_with_max_moment_is_ambiguous_under_the_axle():
    """At the section of maximum moment an axle stands exactly on the shear jump: both sides."""
    c, P = 12.0, 10.0
    best = govern(simple_moment(L, c), one_case(axle_train([P], [])), kind="moment").max
    shear = concurrent(best, simple_shear(L, c))
    assert shear.ambiguous
    assert (shear.left, shear.right) == pytest.approx((-P * c / L, P * (L - c) / L), rel=EXACT)
