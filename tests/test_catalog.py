"""The library: lookup by name, unit conversion, adjustments and descriptions.

Unit factors are checked against their definitions: 1 ft = 0.3048 m and 1 lbf = 0.45359237 kg
x 9.80665 m/s^2 (NIST SP 811, Appendix B; the international yard and pound agreement, 1959).
"""

from __future__ import annotations

import dataclasses
import json
from collections.abc import Iterator
from pathlib import Path

import pytest

from vehicles import VehicleError, adjusted, get_model, library_names, load_model, model_in
from vehicles.output.describe import details, summary
from vehicles.output.tables import library_table, model_text
from vehicles.units import KN_PER_KIP, M_PER_FT, factors

ROUND_TRIP = 1e-12
"""Relative tolerance of a kN-m -> kip-ft -> kN-m round trip (a few float multiplications)."""

CATEGORY = {
    "HL-93": "design", "HL-93 deflection": "deflection", "HL-93 fatigue": "fatigue",
    "HS20-44": "design", "LM1": "design", "LM2": "design", "LM71": "design", "SW/0": "design",
    "SW/2": "design", "Cooper E80": "design",
    "Type 3": "legal", "Type 3S2": "legal", "Type 3-3": "legal", "Type 3-3 lane-type": "legal",
    "SU4": "specialized hauling", "SU5": "specialized hauling", "SU6": "specialized hauling",
    "SU7": "specialized hauling", "NRL": "notional", "EV2": "emergency", "EV3": "emergency",
    "FLM3": "fatigue", "FLM4": "fatigue",
}
"""Every library model and what it is for."""

LIBRARY = tuple(CATEGORY)


def numbers(value: object) -> Iterator[float]:
    """Every number inside a model, in a fixed order."""
    if dataclasses.is_dataclass(value):
        for field in dataclasses.fields(value):
            yield from numbers(getattr(value, field.name))
    elif isinstance(value, tuple):
        for part in value:
            yield from numbers(part)
    elif isinstance(value, int | float) and not isinstance(value, bool):
        yield float(value)


def test_unit_factors_are_exact_by_definition() -> None:
    assert abs(KN_PER_KIP - 0.45359237 * 9.80665) <= 1e-15 * KN_PER_KIP
    assert M_PER_FT == 0.3048
    assert factors("kip-ft", "kN-m").force_per_length == pytest.approx(KN_PER_KIP / M_PER_FT)
    converted = factors("kN-m", "kip-ft")
    assert converted.force * KN_PER_KIP == pytest.approx(1.0, rel=1e-15)


def test_the_library_holds_every_model() -> None:
    assert set(LIBRARY) <= set(library_names())


def test_every_library_model_has_its_category() -> None:
    assert {name: get_model(name).category for name in library_names()} == CATEGORY


@pytest.mark.parametrize("name", LIBRARY)
def test_units_round_trip(name: str) -> None:
    model = get_model(name)
    other = "kip-ft" if model.units == "kN-m" else "kN-m"
    there = model_in(model, other)
    back = model_in(there, model.units)
    assert there.units == other and back.units == model.units
    assert list(numbers(back)) == pytest.approx(list(numbers(model)), rel=ROUND_TRIP)


def test_names_ignore_case_spaces_and_hyphens() -> None:
    assert get_model("hl93") == get_model("HL-93") == get_model("Hl - 93")
    assert get_model("cooper e80").name == "Cooper E80"


def test_unknown_name_lists_close_matches() -> None:
    with pytest.raises(VehicleError, match="did you mean: Cooper E80"):
        get_model("Cooper E-88")


def test_unknown_units_are_an_error() -> None:
    with pytest.raises(VehicleError, match="unknown units 'kN-mm'"):
        get_model("LM2", units="kN-mm")


def test_load_model_reads_a_file_or_the_library(tmp_path: Path) -> None:
    path = tmp_path / "own.toml"
    path.write_text('[vehicle]\nname = "crane"\nunits = "kN-m"\nloads = [120, 120]\n'
                    "spacings = [3.2]\n")
    own = load_model(path, units="kip-ft")
    assert own.units == "kip-ft"
    assert own.cases[0].train is not None
    assert own.cases[0].train.total_load() == pytest.approx(240.0 / KN_PER_KIP)
    assert load_model(str(path)).units == "kN-m"
    assert load_model("LM2").name == "LM2"


def test_alpha_scales_lm71_axles_and_line_load_and_can_be_undone() -> None:
    # EN 1991-2 6.3.2(3): alpha multiplies the characteristic values (alpha = 1.21 confirmed)
    lm71 = get_model("LM71")
    heavy = adjusted(lm71, {"alpha": 1.21})
    case = heavy.cases[0]
    assert case.train is not None
    assert [axle.load for axle in case.train.items] == pytest.approx([1.21 * 250.0] * 4)
    assert case.lane == pytest.approx(1.21 * 80.0)
    assert case.lane_clear_of_train == 0.8
    back = adjusted(heavy, {"alpha": 1.0})
    assert list(numbers(back)) == pytest.approx(list(numbers(lm71)), rel=ROUND_TRIP)


def test_lm1_alpha_factors_act_separately() -> None:
    lm1 = adjusted(get_model("LM1"), {"alpha_Q1": 0.8, "alpha_q1": 0.6})
    case = lm1.cases[0]
    assert case.train is not None and case.train.total_load() == pytest.approx(0.8 * 600.0)
    assert case.lane == pytest.approx(0.6 * 27.0)


def test_hs20_impact_is_an_input_set_on_truck_and_lane() -> None:
    # AASHTO Standard 3.8.2 (from memory): I = 50 / (L + 125) <= 0.30, here L = 75 ft
    impact = min(50.0 / (75.0 + 125.0), 0.30)
    truck, lane = adjusted(get_model("HS20-44"), {"impact": impact}).cases
    assert truck.axle_allowance == lane.lane_allowance == impact == 0.25


def test_cooper_class_scales_the_whole_train() -> None:
    e72 = adjusted(get_model("Cooper E80"), {"cooper_class": 72.0})
    locomotives = e72.cases[0].train
    assert locomotives is not None
    assert locomotives.items[1].load == pytest.approx(72.0)  # the driver axle load is the class
    assert locomotives.items[-1].intensity == pytest.approx(0.9 * 8.0)  # type: ignore[union-attr]


def test_bad_adjustments_are_errors() -> None:
    with pytest.raises(VehicleError, match="no adjustment named 'alpha'.*none"):
        adjusted(get_model("HL-93"), {"alpha": 1.1})
    with pytest.raises(VehicleError, match="value 0 is not allowed"):
        adjusted(get_model("LM71"), {"alpha": 0.0})


def test_descriptions_carry_units_and_serialise() -> None:
    rows = [summary(get_model(name)) for name in LIBRARY]
    table = library_table(rows)
    for name in LIBRARY:
        assert name in table
    e80 = details(get_model("Cooper E80"))
    assert json.loads(json.dumps(e80)) == e80  # plain JSON values only (no infinities)
    assert e80["cases"][0]["train"]["unlimited_uniform"] == 8.0
    text = model_text(details(get_model("HL-93", units="kN-m")))
    assert "kN/m" in text and "4.2672 to 9.144 m" in text
