"""A load model's category, the traffic data of fatigue lorries, and the gross weight for posting:
built, read, written back and listed."""

from __future__ import annotations

import re
from pathlib import Path

import pytest
from hypothesis import given
from hypothesis import strategies as st

from tests.cli import invoke
from vehicles import (
    LoadCase,
    LoadModel,
    TrafficCategory,
    TrafficType,
    VehicleError,
    get_model,
    library_names,
    model_in,
    read_load_model,
    write_model,
)
from vehicles.library.files import parse_load_model
from vehicles.library.writer import model_to_toml
from vehicles.loadmodel import CATEGORIES
from vehicles.train import Axle, Patch, Train
from vehicles.units import KN_PER_KIP

TRUCK = Train("truck", (Axle(8.0), Axle(32.0, 14.0), Axle(32.0, (14.0, 30.0))))
LORRIES = (LoadCase("lorry 1", Train("a", (Axle(70.0), Axle(130.0, 4.5)))),
           LoadCase("lorry 2", Train("b", (Axle(70.0), Axle(120.0, 4.2), Axle(120.0, 1.3)))))

NEW_MODELS = ("Type 3", "Type 3S2", "Type 3-3", "Type 3-3 lane-type", "SU4", "SU5", "SU6", "SU7",
              "NRL", "EV2", "EV3", "FLM3", "FLM4")


def test_category_defaults_to_unsaid_and_must_be_known() -> None:
    truck = (LoadCase("truck", TRUCK),)
    assert LoadModel("t", "t", "kip-ft", truck).category == ""
    with pytest.raises(VehicleError) as raised:
        LoadModel("t", "t", "kip-ft", truck, category="rating")
    message = str(raised.value)
    assert "\n" not in message and "unknown category 'rating'" in message
    assert all(category in message for category in CATEGORIES)


def test_category_is_read_from_a_model_file_and_a_vehicle_file() -> None:
    model = parse_load_model('[model]\nname = "m"\nunits = "kN-m"\ncategory = "permit"\n'
                        '[[case]]\nname = "c"\nloads = [100]\n', "m.toml")
    assert model.category == "permit"
    vehicle = parse_load_model('[vehicle]\nname = "v"\nunits = "kN-m"\ncategory = "legal"\n'
                          "loads = [100]\n", "v.toml")
    assert vehicle.category == "legal"
    with pytest.raises(VehicleError, match=r"v\.toml: \[vehicle\].*: unknown category 'Legal'"):
        parse_load_model('[vehicle]\nname = "v"\nunits = "kN-m"\ncategory = "Legal"\n'
                    "loads = [100]\n", "v.toml")


def test_traffic_type_shares_must_be_fractions_adding_to_one() -> None:
    with pytest.raises(VehicleError, match="add up to 1.1, not 1"):
        TrafficType("t", (("lorry 1", 0.6), ("lorry 2", 0.5)))
    with pytest.raises(VehicleError, match="share -0.2 of 'lorry 2' is not a fraction"):
        TrafficType("t", (("lorry 1", 1.0), ("lorry 2", -0.2)))
    with pytest.raises(VehicleError, match="'lorry 1' has two shares"):
        TrafficType("t", (("lorry 1", 0.5), ("lorry 1", 0.5)))
    with pytest.raises(VehicleError, match="heavy_vehicles_per_year = 0 is not allowed"):
        TrafficCategory("c", 0.0)


def test_traffic_types_name_cases_of_the_model() -> None:
    mix = TrafficType("local", (("lorry 1", 0.8), ("lorry 3", 0.2)))
    with pytest.raises(VehicleError, match="no case named 'lorry 3'"):
        LoadModel("FLM", "lorries", "kN-m", LORRIES, traffic_types=(mix,))
    twice = (TrafficCategory("category 1", 2.0e6), TrafficCategory("category 1", 0.5e6))
    with pytest.raises(VehicleError, match="traffic category name 'category 1' is used twice"):
        LoadModel("FLM", "lorries", "kN-m", LORRIES, traffic_categories=twice)


def test_traffic_tables_in_a_file_name_the_file_and_the_table() -> None:
    text = ('[model]\nname = "m"\nunits = "kN-m"\n[[case]]\nname = "lorry 1"\nloads = [100]\n'
            '[[traffic_type]]\nname = "local"\nshares = { "lorry 1" = 0.9 }\n')
    with pytest.raises(VehicleError, match=r"f\.toml: \[\[traffic_type\]\] 1 .*add up to 0\.9"):
        parse_load_model(text, "f.toml")
    text = text.replace("shares = { \"lorry 1\" = 0.9 }", "shares = 0.9")
    with pytest.raises(VehicleError, match="shares: expected a table"):
        parse_load_model(text, "f.toml")


@pytest.mark.parametrize("name", NEW_MODELS + ("HL-93", "HL-93 fatigue"))
def test_library_models_write_and_read_back_equal(name: str, tmp_path: Path) -> None:
    model = get_model(name)
    path = write_model(model, tmp_path / "model.toml")
    back = read_load_model(path)
    assert back.category == model.category
    assert back.traffic_types == model.traffic_types
    assert back.traffic_categories == model.traffic_categories
    assert [c.train.total_load() for c in back.cases if c.train is not None] == [
        c.train.total_load() for c in model.cases if c.train is not None]


@given(st.lists(st.integers(min_value=1, max_value=1000), min_size=1, max_size=6),
       st.floats(min_value=1.0, max_value=1e7, allow_nan=False))
def test_any_traffic_mix_survives_writing(weights: list[int], per_year: float) -> None:
    cases = tuple(LoadCase(f"lorry {i + 1}", Train("l", (Axle(100.0),)))
                  for i in range(len(weights)))
    total = sum(weights)
    mix = TrafficType("mix", tuple((c.name, w / total) for c, w in zip(cases, weights,
                                                                        strict=True)))
    model = LoadModel("mix", "mix", "kN-m", cases, category="fatigue", traffic_types=(mix,),
                      traffic_categories=(TrafficCategory("road", per_year, "a note"),))
    assert parse_load_model(model_to_toml(model)) == model


def test_gross_weight_is_the_first_vehicle_unfactored_in_force_and_tons() -> None:
    hl93 = get_model("HL-93")  # design truck 8 + 32 + 32 kip = 36 tons (AASHTO LRFD 3.6.1.2.2)
    assert hl93.gross_weight == 72.0 and hl93.gross_weight_tons == 36.0
    lm2 = get_model("LM2")  # 400 kN in tons of 2000 lb: 1 lbf = 0.45359237 kg x 9.80665 m/s2
    assert lm2.gross_weight == 400.0
    assert lm2.gross_weight_tons == pytest.approx(400.0 / KN_PER_KIP / 2.0, rel=1e-12)
    assert model_in(lm2, "kip-ft").gross_weight_tons == pytest.approx(lm2.gross_weight_tons,
                                                                      rel=1e-12)


def test_gross_weight_needs_a_train_of_axles() -> None:
    lane = LoadModel("lane", "lane only", "kip-ft", (LoadCase("lane", lane=0.64),))
    with pytest.raises(VehicleError, match="no case has a train of axles alone"):
        _ = lane.gross_weight
    with pytest.raises(VehicleError, match="no case has a train of axles alone"):
        _ = get_model("Cooper E80").gross_weight  # locomotives with an unlimited uniform load
    wagon = Train("wagon", (Axle(10.0), Patch(2.0, 5.0, 1.0)))
    with pytest.raises(VehicleError):
        _ = LoadModel("w", "w", "kN-m", (LoadCase("w", wagon),)).gross_weight


def listed_rows(output: str) -> dict[str, list[str]]:
    """The listing's rows by name: columns are separated by two spaces or more."""
    rows = [re.split(r"\s{2,}", line.strip()) for line in output.splitlines()[1:]]
    return {row[0]: row for row in rows}


def test_the_listing_shows_every_model_with_its_category() -> None:
    code, out = invoke("vehicles")
    assert code == 0
    rows = listed_rows(out)
    assert set(rows) == set(library_names())
    for name in library_names():
        assert rows[name][1] == get_model(name).category
    assert rows["Type 3S2"][4] == "72 kip" and rows["FLM3"][4] == "480 kN"


def test_the_listing_filters_by_category() -> None:
    code, out = invoke("vehicles", "--category", "specialized hauling")
    assert code == 0 and set(listed_rows(out)) == {"SU4", "SU5", "SU6", "SU7"}
    code, out = invoke("vehicles", "--category", "emergency", "--format", "json")
    assert code == 0 and '"EV2"' in out and '"category": "emergency"' in out
    assert '"EV3"' in out and "Type 3" not in out
    assert invoke("vehicles", "--category", "rating")[0] == 2
    assert invoke("vehicles", "NRL", "--category", "legal")[0] == 2


def test_a_description_shows_the_category_and_the_traffic() -> None:
    code, out = invoke("vehicles", "FLM4")
    assert code == 0 and "category: fatigue" in out
    assert re.search(r"long distance\s+20 %\s+5 %\s+50 %\s+15 %\s+10 %", out)
    assert "category 4: 50000" in out
    code, out = invoke("vehicles", "FLM4", "--format", "json")
    assert '"long distance"' in out and '"heavy_vehicles_per_year": 2000000.0' in out
    code, out = invoke("vehicles", "Type 3-3 lane-type")
    assert code == 0 and "category: legal" in out
    assert "applies to: negative moment, interior reaction" in out
