"""Vehicle and model files: reading, every kind of bad input, and write -> read round trips.

Loads are the invented quarry hauler of the vehicle-file example; expected totals are the sums
written in the test.
"""

from __future__ import annotations

import math
from pathlib import Path

import pytest
from hypothesis import assume, given, settings
from hypothesis import strategies as st

from vehicles import Axle, LoadCase, LoadModel, Patch, Scope, Train, VehicleError
from vehicles.library.catalog import library_models
from vehicles.library.files import parse_load_model, read_load_model
from vehicles.library.writer import model_to_toml, write_model
from vehicles.limits import MAX_RANGED

EXACT = 1e-12
"""Relative tolerance for sums of a few decimal numbers."""

HAULER = """
[vehicle]
name = "quarry hauler, 6 axles"
units = "kN-m"
loads = [60, 110, 110, 95, 95, 95]        # front to rear
spacings = [3.4, 1.35, [4.0, 7.5], 1.3, 1.3]   # gap to the previous axle; a pair is a range
dynamic_allowance = 0.25
lane = 9.3
"""


def test_the_example_vehicle_file(tmp_path: Path) -> None:
    path = tmp_path / "hauler.toml"
    path.write_text(HAULER)
    model = read_load_model(path)
    (case,) = model.cases
    assert model.units == "kN-m" and model.name == "quarry hauler, 6 axles"
    assert case.train is not None
    assert case.train.total_load() == 60 + 2 * 110 + 3 * 95
    assert math.isclose(case.train.length(), 3.4 + 1.35 + 4.0 + 1.3 + 1.3, rel_tol=EXACT)
    assert math.isclose(case.train.length([7.5]), 3.4 + 1.35 + 7.5 + 1.3 + 1.3, rel_tol=EXACT)
    assert (case.axle_allowance, case.lane, case.lane_allowance) == (0.25, 9.3, 0.0)


def test_a_lane_alone_is_a_load() -> None:
    model = parse_load_model('[vehicle]\nname = "lane"\nunits = "kip-ft"\nlane = 0.64\n')
    assert model.cases[0].train is None and model.cases[0].lane == 0.64


def test_patches_in_the_vehicle_form() -> None:
    text = """
    [vehicle]
    name = "pushed wagons"
    units = "kN-m"
    loads = [200, 200]
    spacings = [2.0]
    leading_uniform = { intensity = 50, length = [10, 30], gap = 1.5 }
    trailing_uniform = { intensity = 60, gap = 2.5 }
    """
    train = parse_load_model(text).cases[0].train
    assert train is not None
    assert train.items[0] == Patch(50.0, (10.0, 30.0))
    assert train.items[1] == Axle(200.0, 1.5)
    assert train.items[-1] == Patch(60.0, None, 2.5)


MODEL = """
[model]
name = "two-truck demo"
units = "kip-ft"

[[train]]
name = "truck"
loads = [8, 32, 32]
spacings = [14, 14]

[[train]]
name = "pair"
vehicles = ["truck", "truck"]
headways = [[50, 400]]

[[case]]
name = "pair"
train = "pair"
factor = 0.9
scope = ["negative moment", "interior reaction"]

[[case]]
name = "blocks"
items = [{ uniform = 133, length = 15 }, { uniform = 133, length = 15, gap = 5.3 }]

[[case]]
name = "own"
lane = 1.0
knife_edge_for_shear = 26

[case.train]
name = "single axle"
loads = [20]
"""


def test_a_model_file_with_references_headways_and_items() -> None:
    pair, blocks, own = parse_load_model(MODEL, "demo.toml").cases
    assert pair.train is not None and pair.train.ranged_values[0].low == 50.0
    assert pair.train.total_load() == 2 * 72.0 and pair.factor == 0.9
    assert pair.scope == Scope(("negative moment", "interior reaction"))
    assert blocks.train is not None
    assert math.isclose(blocks.train.total_load(), 2 * 15 * 133, rel_tol=EXACT)
    assert own.train == Train("single axle", (Axle(20.0),)) and own.knife_edge_shear == 26.0


BAD_INPUTS = [
    ("[vehicle\nname = 1\n", "not valid TOML.*line 1"),
    (HAULER.replace("[60,", "[-60,"), r"loads\[1\].*-60 is not allowed"),
    (HAULER.replace("[60,", "[0,"), r"loads\[1\].*0 is not allowed.*positive"),
    (HAULER.replace("[3.4,", "[0,"), r"spacings\[1\].*0 is not allowed"),
    (HAULER.replace("[4.0, 7.5]", "[7.5, 4.0]"), r"min above max.*\[4, 7.5\]"),
    (HAULER.replace("1.3, 1.3]", "1.3]"), "4 spacings for 6 loads"),
    (HAULER.replace("lane =", "lanes ="), "unknown key 'lanes'.*did you mean 'lane'"),
    (HAULER.replace('"kN-m"', '"kN-mm"'), "unknown units 'kN-mm'"),
    (HAULER.replace("dynamic_allowance = 0.25", "dynamic_allowance = -0.25"),
     "dynamic_allowance.*-0.25 is not allowed"),
    (HAULER.replace('"kN-m"', "5"), "units.*expected text"),
    ('[vehicle]\nname = "x"\nunits = "kN-m"\n', "nothing to place"),
    ('title = "x"\n', "structure model file.*title.*a vehicle file holds"),
    ("", "no \\[vehicle\\] or \\[model\\]"),
    (MODEL.replace('train = "pair"', 'train = "pairs"'), "no train named 'pairs'.*'pair'"),
    (MODEL.replace('"negative moment",', '"hogging",'), "unknown scope 'hogging'"),
    (MODEL.replace("headways = [[50, 400]]", "headways = []"), "0 headways for 2 vehicles"),
    (MODEL.replace("length = 15 }", "length = 15, axle = 4 }", 1), "one of axle or uniform"),
]


@pytest.mark.parametrize(("text", "pattern"), BAD_INPUTS)
def test_bad_input_is_one_line_naming_the_file(text: str, pattern: str) -> None:
    with pytest.raises(VehicleError, match=pattern) as caught:
        parse_load_model(text, "bad.toml")
    message = str(caught.value)
    assert message.startswith("bad.toml: ") and "\n" not in message


def test_missing_file_is_a_vehicle_error(tmp_path: Path) -> None:
    with pytest.raises(VehicleError, match="file not found"):
        read_load_model(tmp_path / "absent.toml")


def test_every_library_model_round_trips(tmp_path: Path) -> None:
    for model in (*library_models(), *library_models("kN-m"), *library_models("kip-ft")):
        path = write_model(model, tmp_path / "model.toml")
        assert read_load_model(path) == model, model.name
    assert [p.name for p in tmp_path.iterdir()] == ["model.toml"]  # no temporary left behind


positive = st.floats(0.001, 1e4, allow_nan=False)
span = st.one_of(positive, st.tuples(positive, positive).map(lambda p: (min(p), max(p))))
names = st.text(min_size=1, max_size=12)


@st.composite
def trains(draw: st.DrawFn) -> Train:
    inner = st.one_of(st.builds(Axle, positive, span), st.builds(Patch, positive, span, span))
    items = draw(st.lists(inner, min_size=1, max_size=6))
    if draw(st.booleans()):
        items.insert(0, Patch(draw(positive)))
    if draw(st.booleans()) and len(items) > 1:
        items.append(Patch(draw(positive), None, draw(span)))
    train = Train(draw(names), tuple(items))
    # files refuse trains of more ranged values than the search takes (vehicles.limits)
    assume(len(train.ranged_values) <= MAX_RANGED)
    return train


@st.composite
def models(draw: st.DrawFn) -> LoadModel:
    case_names = draw(st.lists(names, min_size=1, max_size=3, unique=True))
    cases = tuple(
        LoadCase(
            name,
            draw(trains()),
            factor=draw(st.floats(0.1, 2.0)),
            axle_allowance=draw(st.floats(0.0, 1.0)),
            lane=draw(st.floats(0.0, 100.0)),
            lane_clear_of_train=draw(st.none() | st.floats(0.0, 5.0)),
            knife_edge_moment=draw(st.floats(0.0, 100.0)),
            scope=Scope(tuple(draw(st.sets(st.sampled_from(["negative moment", "shear"]))))),
            note=draw(st.text(max_size=20)),
        )
        for name in case_names
    )
    return LoadModel(draw(names), draw(names), draw(st.sampled_from(["kN-m", "kip-ft"])), cases,
                     standard=draw(st.text(max_size=20)),
                     notes=tuple(draw(st.lists(st.text(max_size=20), max_size=2))))


@settings(max_examples=60, deadline=None)
@given(models())
def test_generated_models_round_trip_through_the_file_format(model: LoadModel) -> None:
    assert parse_load_model(model_to_toml(model)) == model


@settings(max_examples=40, deadline=None)
@given(trains())
def test_generated_trains_keep_their_totals_through_the_file_format(train: Train) -> None:
    model = LoadModel("t", "t", "kN-m", (LoadCase("c", train),))
    back = parse_load_model(model_to_toml(model)).cases[0].train
    assert back is not None
    total, again = train.total_load(), back.total_load()
    assert total == again or (math.isinf(total) and math.isinf(again))
