"""The governing search: cases and scopes, directions, distinct peaks, ranged gaps, jumps.

Closed forms: the two-equal-span support moment M_B = -ab(L + a)/(4L^2), extreme ordinate
-L/(6 sqrt 3) at a = L/sqrt 3 in each span (AISC *Steel Construction Manual*, beam diagrams, two
equal spans with a concentrated load at any point, re-derived by the three-moment equation:
computed); simple-span lines by statics (R. C. Hibbeler, *Structural Analysis*, ch. 6).
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from tests.influence_forms import (
    continuous_moment,
    continuous_reaction,
    simple_moment,
    simple_reaction,
    simple_shear,
)
from tests.section_scan import axle_train, one_case
from vehicles.errors import VehicleError
from vehicles.loadmodel import LoadCase, LoadModel, Scope
from vehicles.search.govern import govern
from vehicles.search.placement import is_mirror
from vehicles.train import Axle, Patch, Train

EXACT = 1e-9
L = 20.0  # [m]
SUPPORT_MOMENT = continuous_moment([L, L], L)  # M_B of two equal spans
PEAK_ORDINATE = -L / (6 * math.sqrt(3))  # at L/sqrt(3) from either end support


def test_worst_case_of_a_model_is_chosen_and_named():
    model = LoadModel("M", "two cases", "kN-m", (
        LoadCase("light", axle_train([10.0], [])),
        LoadCase("heavy", axle_train([25.0], [])),
    ))
    result = govern(simple_moment(L, 5.0), model, kind="moment")
    assert result.max.case == "heavy"
    assert result.max.model == "M"
    assert result.max.value == pytest.approx(25.0 * 5.0 * 15.0 / L, rel=EXACT)


def test_scope_limits_a_case_to_its_responses():
    """A case scoped to negative moment and interior reactions (the form of AASHTO LRFD
    3.6.1.3.1's truck pair, from memory) counts only there."""
    pair = LoadCase("pair", axle_train([100.0, 100.0], [8.0]), factor=0.9,
                    scope=Scope(("negative moment", "interior reaction")))
    single = LoadCase("single", axle_train([100.0], []))
    model = LoadModel("M", "scoped", "kN-m", (single, pair))
    result = govern(SUPPORT_MOMENT, model, kind="moment")
    assert result.max is None  # M_B never sags (a zero extreme is none); the pair is not asked
    assert result.min.case == "pair"
    sagging = govern(continuous_moment([L, L], L / 2), model, kind="moment")
    assert sagging.max.case == "single"  # the pair is not asked for sagging moments
    end_reaction = govern(continuous_reaction([L, L], 0), model, kind="reaction")
    assert {p.case for p in (end_reaction.max, end_reaction.min)} == {"single"}
    inner = govern(continuous_reaction([L, L], 1), model, kind="reaction", interior=True)
    assert inner.max.case == "pair"


def test_no_applicable_case_gives_none():
    only_negative = LoadModel("M", "neg", "kN-m", (
        LoadCase("c", axle_train([1.0], []), scope=Scope(("negative moment",))),))
    result = govern(SUPPORT_MOMENT, only_negative, kind="moment")
    assert result.max is None and result.top_max == ()
    assert result.min is not None


def test_support_moment_peaks_are_distinct_one_per_span():
    """One axle on M_B: a separate trough in each span, each P L/(6 sqrt 3). On equal spans the
    two are mirror images of one placement about the support and are listed once; on unequal
    spans both are listed."""
    P = 100.0
    axle = one_case(axle_train([P], []))
    result = govern(SUPPORT_MOMENT, axle, kind="moment", top=4, directions=("forward",))
    (trough,) = result.top_min
    assert min(trough.axle_positions[0], 2 * L - trough.axle_positions[0]) == pytest.approx(
        L / math.sqrt(3), rel=1e-9)
    assert trough.value == pytest.approx(P * PEAK_ORDINATE, rel=EXACT)
    unequal = govern(continuous_moment([L, 1.5 * L], L), axle, kind="moment", top=4,
                     directions=("forward",))
    spans = sorted(int(t.axle_positions[0] > L) for t in unequal.top_min)
    assert spans == [0, 1]


def test_ranged_gap_is_optimised_and_reported():
    """Two equal axles with a gap range on M_B: the worst gap puts each axle over its span's
    extreme ordinate, 2L - 2L/sqrt 3 apart; the effect is 2 P L/(6 sqrt 3). One range is
    solved exactly (stationary points of each axle group, paired)."""
    P = 100.0
    train = Train("pair", (Axle(P), Axle(P, (2.0, 30.0))))
    best = govern(SUPPORT_MOMENT, one_case(train), kind="moment").min
    assert best.value == pytest.approx(2 * P * PEAK_ORDINATE, rel=1e-12)
    assert best.ranged_values[0].value == pytest.approx(2 * L - 2 * L / math.sqrt(3), rel=1e-9)
    assert (best.ranged_values[0].low, best.ranged_values[0].high) == (2.0, 30.0)


def test_several_ranges_beat_every_fixed_choice_on_a_grid():
    """Two ranged gaps (numeric search): no fixed pair of gaps on a grid does better."""
    line = continuous_moment([L, 1.2 * L, L], 1.6 * L)
    train = Train("three", (Axle(60.0), Axle(100.0, (3.0, 25.0)), Axle(40.0, (3.0, 25.0))))
    found = govern(line, one_case(train), kind="moment", ranged_tolerance=1e-5)
    grid = np.linspace(3.0, 25.0, 12)
    for sense, placement in (("max", found.max), ("min", found.min)):
        sign = 1.0 if sense == "max" else -1.0
        for g1 in grid:
            for g2 in grid:
                fixed = axle_train([60.0, 100.0, 40.0], [g1, g2])
                other = getattr(govern(line, one_case(fixed), kind="moment"), sense)
                assert sign * placement.value >= sign * other.value - 1e-9 * abs(other.value)


def test_range_end_is_kept_when_it_governs():
    """Positive moment at midspan of a simple span: the tighter the rear axles, the larger, so
    the range minimum is used (AASHTO truck rear spacing 14-30 ft; common practice)."""
    truck = Train("truck", (Axle(8.0), Axle(32.0, 14.0), Axle(32.0, (14.0, 30.0))))
    result = govern(simple_moment(100.0, 50.0), one_case(truck, units="kip-ft"), kind="moment")
    assert result.max.ranged_values[0].value == 14.0


def test_shear_at_the_section_takes_the_worse_limit_and_says_so():
    """Simple span shear at c: an axle exactly over the section takes (L - c)/L, not -c/L."""
    c, P = 5.0, 10.0
    result = govern(simple_shear(L, c), one_case(axle_train([P], [])), kind="shear", section=c)
    assert result.max.value == pytest.approx(P * (L - c) / L, rel=EXACT)
    assert result.max.section_axle == 0
    assert result.max.axles_at_jump == (0,)
    assert result.max.limit_side == "right"
    assert result.min.value == pytest.approx(-P * c / L, rel=EXACT)
    assert result.min.limit_side == "left"


def test_reaction_with_axle_on_the_support():
    """The first axle standing exactly on the end support gives the full reaction."""
    result = govern(simple_reaction(L), one_case(axle_train([10.0, 10.0], [4.0])),
                    kind="reaction", directions=("reverse",))
    assert result.max.value == pytest.approx(10.0 + 10.0 * (L - 4.0) / L, rel=EXACT)
    assert 0.0 in result.max.axle_positions


def test_lane_segments_are_the_adverse_parts():
    """Lane on M_B for the minimum: both spans are hogging (the whole path)."""
    result = govern(SUPPORT_MOMENT, one_case(None, lane=10.0), kind="moment")
    assert result.min.lane_segments == ((0.0, 2 * L),)
    # integral of -ab(L + a)/(4L^2) over a span is -L^2/16; two spans
    assert result.min.value == pytest.approx(10.0 * -(L**2) / 8, rel=EXACT)
    assert result.max is None  # nothing sags: a zero extreme is none


def test_knife_edge_at_the_extreme_ordinate():
    result = govern(SUPPORT_MOMENT, one_case(None, lane=1.0, knife_edge_moment=50.0),
                    kind="moment")
    position = result.min.knife_edge_position
    assert min(position, 2 * L - position) == pytest.approx(L / math.sqrt(3), rel=1e-9)
    assert result.min.value == pytest.approx(-(L**2) / 8 + 50.0 * PEAK_ORDINATE, rel=EXACT)


def test_factored_loads_are_reported():
    case = LoadCase("c", axle_train([10.0, 20.0], [3.0]), factor=0.9, axle_allowance=0.33)
    found = govern(simple_moment(L, 7.0), LoadModel("M", "m", "kN-m", (case,)),
                   kind="moment").max
    assert found.axle_loads == pytest.approx((10.0 * 0.9 * 1.33, 20.0 * 0.9 * 1.33), rel=EXACT)


@given(
    loads=st.lists(st.floats(1.0, 100.0), min_size=1, max_size=4),
    gaps=st.lists(st.floats(0.5, 15.0), min_size=3, max_size=3),
)
@settings(max_examples=20, deadline=None)
def test_reversal_symmetry_of_a_symmetric_line(loads, gaps):
    """On a line symmetric about midspan, running forward equals running in reverse (the mirror
    image of the placement), for both extremes."""
    train = axle_train(loads, gaps[: len(loads) - 1])
    model = one_case(train)
    ahead = govern(SUPPORT_MOMENT, model, kind="moment", directions=("forward",))
    back = govern(SUPPORT_MOMENT, model, kind="moment", directions=("reverse",))
    for a, b in ((ahead.max, back.max), (ahead.min, back.min)):
        if a is None or b is None:  # M_B never sags: no largest either way
            assert a is None and b is None
            continue
        assert a.value == pytest.approx(b.value, rel=1e-9, abs=1e-9)
        # the mirror image of the forward placement is a reverse placement of the same value
        mirrored = np.array([2 * L - x for x in a.axle_positions])
        on = (mirrored >= 0) & (mirrored <= 2 * L)
        direct = float(np.sum(np.array(a.axle_loads)[on] * SUPPORT_MOMENT(mirrored[on])))
        assert direct == pytest.approx(b.value, rel=1e-9, abs=1e-9)


def test_bad_request_is_a_clear_error():
    with pytest.raises(VehicleError, match="top"):
        govern(SUPPORT_MOMENT, one_case(axle_train([1.0], [])), kind="moment", top=0)
    with pytest.raises(VehicleError, match="unknown kind 'torque'"):
        govern(SUPPORT_MOMENT, one_case(axle_train([1.0], [])), kind="torque")


def test_values_match_the_effect_at_the_reported_positions():
    """Every top placement's value is the sum of its axle loads times ordinates."""
    line = continuous_moment([L, 1.3 * L, L], 1.5 * L)
    result = govern(line, one_case(axle_train([30.0, 60.0, 60.0], [4.0, 6.0])),
                    kind="moment", top=3)
    for placement in (*result.top_max, *result.top_min):
        positions = np.array(placement.axle_positions)
        inside = (positions >= 0) & (positions <= line.x[-1])
        direct = float(np.sum(np.array(placement.axle_loads)[inside] * line(positions[inside])))
        assert placement.value == pytest.approx(direct, rel=1e-9, abs=1e-9)
    assert len({round(p.lead_position, 6) for p in result.top_max}) == len(result.top_max)


def test_one_range_with_cleared_lane_beats_every_fixed_gap():
    """The exact single-range search with a lane cleared around the train and a trailing patch
    (all three kinds of term move with the range) against a grid of fixed gaps."""
    line = continuous_moment([L, 1.2 * L, L], 1.6 * L)
    ranged = Train("t", (Axle(250.0), Axle(250.0, (1.6, 12.0)), Patch(30.0, 8.0, 2.0)))
    case = dict(lane=80.0, lane_clear_of_train=0.8)
    found = govern(line, one_case(ranged, **case), kind="moment")
    for sense, placement in (("max", found.max), ("min", found.min)):
        sign = 1.0 if sense == "max" else -1.0
        for gap in np.linspace(1.6, 12.0, 27):
            fixed = Train("t", (Axle(250.0), Axle(250.0, float(gap)), Patch(30.0, 8.0, 2.0)))
            other = getattr(govern(line, one_case(fixed, **case), kind="moment"), sense)
            assert sign * placement.value >= sign * other.value - 1e-9 * abs(other.value)


@settings(max_examples=60, deadline=None)
@given(st.lists(st.floats(5.0, 50.0), min_size=2, max_size=4),
       st.lists(st.floats(1.0, 6.0), min_size=3, max_size=3))
def test_top_positions_are_distinct_on_a_symmetric_line(loads, gaps):
    """On the symmetric support-moment line of two equal spans every forward placement has a
    reverse mirror image of the same value: --top lists each placement once, most adverse
    first, and the first is still the governing one."""
    train = axle_train(loads, gaps[: len(loads) - 1])
    found = govern(SUPPORT_MOMENT, one_case(train), kind="moment", top=5)
    listed = found.top_min
    assert listed and listed[0].value == pytest.approx(found.min.value, rel=EXACT)
    tolerance = 1e-9 * 2 * L
    for i, first in enumerate(listed):
        for second in listed[i + 1:]:
            assert not is_mirror(first, second, tolerance)
    assert [p.value for p in listed] == sorted(p.value for p in listed)
