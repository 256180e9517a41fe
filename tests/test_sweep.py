"""Sweeps: the exact effect against the lead position, tabulated with every breakpoint."""

from __future__ import annotations

import numpy as np
import pytest

from tests.influence_forms import continuous_moment, simple_reaction, simple_shear
from tests.section_scan import axle_train
from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.search.govern import govern
from vehicles.search.sweep import sweep, sweeps
from vehicles.train import Axle, Train

EXACT = 1e-9
SPANS = (25.0, 35.0)
LINE = continuous_moment(SPANS, 12.0)
CASE = LoadCase("truck", axle_train([35.0, 145.0, 145.0], [4.3, 4.3]))


def test_table_values_are_the_direct_sum_of_axle_effects():
    result = sweep(LINE, CASE, "forward", kind="moment", step=0.5)
    offsets = np.array([0.0, 4.3, 8.6])
    loads = np.array([35.0, 145.0, 145.0])
    middle = 0.5 * (result.lead_positions[:-1] + result.lead_positions[1:])
    positions = middle[:, None] - offsets[None, :]
    on = (positions >= 0) & (positions <= sum(SPANS))
    direct = (loads * np.where(on, LINE(np.clip(positions, 0, sum(SPANS))), 0.0)).sum(axis=1)
    assert np.allclose(result.effect.values(middle), direct, rtol=EXACT, atol=1e-7)


def test_table_runs_from_entry_to_exit_and_holds_every_breakpoint():
    result = sweep(LINE, CASE, "forward", kind="moment", step=1.0)
    x = result.lead_positions
    assert x[0] == pytest.approx(0.0)  # the lead axle reaches the path
    assert x[-1] == pytest.approx(sum(SPANS) + 8.6)  # the last axle leaves it
    assert np.all(np.diff(x) >= 0)
    for offset in (0.0, 4.3, 8.6):
        for support in (0.0, 25.0, 60.0):
            assert np.isclose(x, support + offset, atol=1e-9).any()


def test_a_jump_is_tabulated_with_both_limits():
    """Shear at 10 m of a 20 m span: the single axle crossing the section drops by P."""
    result = sweep(simple_shear(20.0, 10.0), LoadCase("a", axle_train([8.0], [])), "forward",
                   kind="shear", step=2.0)
    at = np.flatnonzero(np.isclose(result.lead_positions, 10.0))
    assert at.size == 2
    assert result.values[at].tolist() == pytest.approx([-4.0, 4.0], rel=EXACT)


def test_reverse_sweep_mirrors_on_the_end_reaction():
    """Reaction at the start: forward the lead axle enters at full ordinate; reverse the train
    comes from the far end and the last axle arrives last."""
    forward, reverse = sweeps(simple_reaction(10.0), LoadCase("pair", axle_train([5.0, 5.0],
                              [2.0])), kind="reaction", step=1.0)
    assert (forward.direction, reverse.direction) == ("forward", "reverse")
    assert forward.values.max() == pytest.approx(5.0 + 5.0 * 0.8, rel=EXACT)
    assert reverse.values.max() == pytest.approx(forward.values.max(), rel=EXACT)


def test_governing_maximum_is_the_sweep_maximum():
    model = LoadModel("m", "m", "kN-m", (CASE,))
    best = govern(LINE, model, kind="moment", directions=("reverse",)).max
    result = sweep(LINE, CASE, "reverse", kind="moment", step=0.25)
    assert best.value >= result.values.max() - EXACT * abs(best.value)
    at_best = float(result.effect.values(best.lead_position)[0])
    assert at_best == pytest.approx(best.value, rel=EXACT)


def test_ranged_gap_defaults_to_the_governing_value():
    train = Train("pair", (Axle(10.0), Axle(10.0, (2.0, 40.0))))
    hogging = continuous_moment((25.0, 25.0), 25.0)  # equal spans: one axle in each is worst
    result = sweep(hogging, LoadCase("pair", train), "forward", kind="moment", sense="min")
    assert 2.0 < result.ranged_values[0].value < 40.0  # one axle in each span
    assert result.sense == "min"
