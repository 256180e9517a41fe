"""The exact effect function: shifted lines, patch integrals, lane and knife-edge terms, factors.

Expected values are evaluated independently of vehicles.effect: scipy's PPoly evaluation and
PPoly.integrate on the closed-form lines of tests/influence_forms.py.
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from tests.influence_forms import continuous_moment, simple_moment, simple_reaction
from vehicles.errors import VehicleError
from vehicles.loadmodel import LoadCase
from vehicles.search.effects import effect_function
from vehicles.search.prepared import prepare
from vehicles.train import Axle, Patch, Train

EXACT = 1e-9
SPANS = (30.0, 40.0, 30.0)  # three-span continuous beam [m]
LINE = continuous_moment(SPANS, 47.0)  # cubic pieces; sagging and hogging parts
LEADS = np.linspace(-20.0, 160.0, 181)


def direct_axles(line, offsets, loads, leads, sign):
    """Sum of P_i IL(x + sign d_i), with the line zero off the path."""
    start, end = line.x[0], line.x[-1]
    total = np.zeros_like(leads)
    for d, p in zip(offsets, loads, strict=True):
        at = leads + sign * d
        inside = (at >= start) & (at <= end)
        total += p * np.where(inside, line(np.clip(at, start, end)), 0.0)
    return total


def direct_integral(line, low, high):
    start, end = line.x[0], line.x[-1]
    low, high = np.clip(low, start, end), np.clip(high, start, end)
    return np.array([line.integrate(a, b) for a, b in zip(low, high, strict=True)])


@given(
    loads=st.lists(st.floats(1.0, 300.0), min_size=1, max_size=5),
    gaps=st.lists(st.floats(0.5, 25.0), min_size=4, max_size=4),
    direction=st.sampled_from(["forward", "reverse"]),
)
@settings(max_examples=25, deadline=None)
def test_superposition_of_axles(loads, gaps, direction):
    """E of a train equals the sum of its axles' shifted ordinates (common practice)."""
    items = tuple(Axle(p, g) for p, g in zip(loads, [0.0, *gaps], strict=False))
    offsets = np.concatenate([[0.0], np.cumsum(gaps[: len(loads) - 1])])
    effect = effect_function(LINE, LoadCase("t", Train("t", items)), kind="moment",
                             sense="max", direction=direction)
    sign = -1.0 if direction == "forward" else 1.0
    expected = direct_axles(LINE, offsets, loads, LEADS + 1e-7, sign)  # off the breakpoints
    got = effect.ppoly()(LEADS + 1e-7)
    assert np.allclose(got, expected, rtol=EXACT, atol=EXACT * np.abs(expected).max())


def test_patch_is_the_exact_integral_under_it():
    """A fixed patch 12 m long, 6 m behind an axle: q times the integral of the line under it."""
    train = Train("p", (Axle(100.0), Patch(20.0, 12.0, 6.0)))
    effect = effect_function(LINE, LoadCase("p", train), kind="moment", sense="max",
                             direction="forward")
    axle = direct_axles(LINE, [0.0], [100.0], LEADS, -1.0)
    patch = 20.0 * direct_integral(LINE, LEADS - 18.0, LEADS - 6.0)
    assert np.allclose(effect.ppoly()(LEADS + 0.0), axle + patch, rtol=EXACT, atol=1e-7)


def test_unlimited_trailing_patch_reaches_back_off_the_path():
    """An unlimited patch behind the axle covers everything behind it; far past the path's end
    it covers the whole line: q times the total area."""
    train = Train("p", (Axle(100.0), Patch(10.0, None, 2.0)))
    effect = effect_function(LINE, LoadCase("p", train), kind="moment", sense="max",
                             direction="forward")
    expected = direct_axles(LINE, [0.0], [100.0], LEADS, -1.0) + 10.0 * direct_integral(
        LINE, np.full_like(LEADS, -1e3), LEADS - 2.0)
    assert np.allclose(effect.ppoly()(LEADS), expected, rtol=EXACT, atol=1e-7)
    assert effect.ppoly()(1e4) == pytest.approx(10.0 * LINE.integrate(0.0, 100.0), rel=EXACT)


def test_lane_load_is_intensity_times_adverse_area():
    """Lane on the adverse parts only: w times the integral of the positive part (max) or the
    negative part (min); zero crossings of the cubic pieces found exactly (common practice)."""
    case = LoadCase("lane", None, lane=9.0)
    grid = np.linspace(0.0, 100.0, 400_001)
    values = LINE(grid)
    positive = np.trapezoid(np.maximum(values, 0.0), grid)
    negative = np.trapezoid(np.minimum(values, 0.0), grid)
    top = effect_function(LINE, case, kind="moment", sense="max", direction="forward")
    bottom = effect_function(LINE, case, kind="moment", sense="min", direction="forward")
    assert top.ppoly()(50.0) == pytest.approx(9.0 * positive, rel=1e-8)
    assert bottom.ppoly()(50.0) == pytest.approx(9.0 * negative, rel=1e-8)
    # the parts add up to the whole integral exactly
    prepared = prepare([LINE])
    assert prepared.positive_areas[0] + prepared.negative_areas[0] == pytest.approx(
        LINE.integrate(0.0, 100.0), rel=EXACT)


def test_factors_and_allowances_scale_their_own_terms():
    """factor x [(1 + IM_axle) axles + (1 + IM_patch) patches + (1 + IM_lane)(lane + knife)]."""
    L = 20.0
    line = simple_moment(L, 8.0)
    train = Train("t", (Axle(50.0), Patch(4.0, 3.0, 1.0)))
    case = LoadCase("c", train, factor=0.9, axle_allowance=0.33, patch_allowance=0.2,
                    lane=2.0, lane_allowance=0.1, knife_edge_moment=30.0, knife_edge_shear=99.0)
    effect = effect_function(line, case, kind="moment", sense="max", direction="forward")
    lead = 13.0
    axle = 50.0 * line(lead)
    patch = 4.0 * line.integrate(lead - 4.0, lead - 1.0)
    lane = 2.0 * line.integrate(0.0, L)
    knife = 30.0 * 8.0 * (L - 8.0) / L  # peak ordinate c(L - c)/L
    expected = 0.9 * (1.33 * axle + 1.2 * patch + 1.1 * (lane + knife))
    assert effect.ppoly()(lead) == pytest.approx(expected, rel=EXACT)


def test_lane_clear_of_the_train_is_removed_under_its_footprint():
    """Lane stopped a clear distance c before the first and after the last axle (the form of
    EN 1991-2 Load Model 71's uniform load, clause 6.3.2; distances here invented)."""
    L, c = 30.0, 0.8
    line = simple_reaction(L)  # positive everywhere: the lane covers all but the footprint
    train = Train("4 axles", tuple([Axle(250.0)] + [Axle(250.0, 1.6)] * 3))
    case = LoadCase("lm", train, lane=80.0, lane_clear_of_train=c)
    effect = effect_function(line, case, kind="reaction", sense="max", direction="forward")
    leads = np.linspace(-5.0, 40.0, 91)
    axles = direct_axles(line, [0.0, 1.6, 3.2, 4.8], [250.0] * 4, leads, -1.0)
    lane = 80.0 * (line.integrate(0.0, L) - direct_integral(line, leads - 4.8 - c, leads + c))
    assert np.allclose(effect.ppoly()(leads), axles + lane, rtol=EXACT, atol=1e-7)


def test_an_axle_on_a_jump_has_both_limits():
    """The reaction line jumps from 0 to 1 at the path's start: a single axle entering gives
    E = 0 just before and P just after (the two one-sided limits)."""
    effect = effect_function(simple_reaction(10.0), LoadCase("a", Train("a", (Axle(7.0),))),
                             kind="reaction", sense="max", direction="forward")
    assert effect.values([0.0], side="left")[0] == 0.0
    assert effect.values([0.0], side="right")[0] == pytest.approx(7.0, rel=EXACT)


def test_unknown_direction_is_a_clear_error():
    with pytest.raises(VehicleError, match="unknown direction 'sideways'"):
        effect_function(LINE, LoadCase("a", Train("a", (Axle(7.0),))), kind="moment",
                        sense="max", direction="sideways")
