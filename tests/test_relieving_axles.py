"""Cases that neglect relieving axles (AASHTO LRFD 3.6.1.3.1: axles that do not contribute to the
extreme force effect under consideration are neglected; that part of the clause is recalled
from memory, unconfirmed).

Hand calculation on two equal continuous spans L (tests/influence_forms.py builds the line from the
three-moment equation), moment at the middle of span 2:
- a unit load at the section gives 13 L / 64 (AISC Manual, beam diagrams, "two equal spans,
  concentrated load at center of one span": M under the load = 13 P L / 64; recalled from memory);
- a unit load at a in span 1 gives half the support moment, M_B / 2, with
  M_B = -a (L^2 - a^2) / (4 L^2) (three-moment equation), least at a = L / sqrt(3):
  -L / (12 sqrt(3)).
A two-axle vehicle whose axles are further apart than a span can never have both axles on span 2
(the positive part) or both on span 1 (the negative part), so with relieving axles neglected the
largest moment is the heavier axle times 13 L / 64 and the smallest the heavier axle times
-L / (12 sqrt(3)).
"""

from __future__ import annotations

import math

import pytest

from tests.influence_forms import continuous_moment
from vehicles import Axle, LoadCase, LoadModel, Train, VehicleError
from vehicles.library.files import parse_load_model
from vehicles.library.writer import model_to_toml
from vehicles.search.concurrent import concurrent
from vehicles.search.govern import govern

L = 10.0  # [m] each span
HEAVY, LIGHT, SPACING = 100.0, 60.0, 12.0  # [kN], [kN], [m]; SPACING > L
RELATIVE = 1e-12


def _model(neglect: bool) -> LoadModel:
    train = Train("pair", (Axle(HEAVY), Axle(LIGHT, SPACING)))
    return LoadModel("pair", "two axles", "kN-m",
                     (LoadCase("pair", train, neglect_relieving_axles=neglect),))


def test_largest_moment_neglects_the_axle_on_the_other_span() -> None:
    line = continuous_moment([L, L], 1.5 * L)
    result = govern(line, _model(True), kind="moment", section=1.5 * L, directions=("forward",))
    assert result.max is not None
    expected = HEAVY * 13 * L / 64
    assert result.max.value == pytest.approx(expected, rel=RELATIVE)
    assert result.max.section_axle == 0
    # the light axle trails on span 1, where the line is negative: left off, load 0
    assert result.max.neglected_axles == (1,)
    assert result.max.axle_loads == (HEAVY, 0.0)
    assert concurrent(result.max, line).value == pytest.approx(expected, rel=RELATIVE)
    # counting it would relieve the section: the same vehicle without the rule gives less
    plain = govern(line, _model(False), kind="moment", directions=("forward",))
    assert plain.max is not None and plain.max.value < expected * (1 - 1e-6)


def test_smallest_moment_neglects_the_axle_on_the_loaded_span() -> None:
    line = continuous_moment([L, L], 1.5 * L)
    result = govern(line, _model(True), kind="moment", directions=("forward",))
    assert result.min is not None
    assert result.min.value == pytest.approx(-HEAVY * L / (12 * math.sqrt(3)), rel=1e-9)
    heavy_at = result.min.axle_positions[0]
    assert heavy_at == pytest.approx(L / math.sqrt(3), rel=1e-9)
    assert result.min.neglected_axles == (1,)


def test_the_flag_is_read_and_written_by_name() -> None:
    text = model_to_toml(_model(True))
    assert "neglect_relieving_axles = true" in text
    assert parse_load_model(text).cases[0].neglect_relieving_axles
    assert "neglect_relieving_axles" not in model_to_toml(_model(False))
    with pytest.raises(VehicleError, match="neglect_relieving_axles.*true or false"):
        parse_load_model(text.replace("neglect_relieving_axles = true",
                                 'neglect_relieving_axles = "yes"'))
