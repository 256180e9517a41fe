"""``influence check`` reads and checks the whole file (loads, combinations, live-load and section
settings, rating and fatigue tables) and says what it checked; and random damage to any example
file ends in our own one-line error or in a model that solves, never in another exception."""

from __future__ import annotations

import copy
import json
import tomllib
from pathlib import Path
from typing import Any

import pytest
import tomli_w
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from influence.design.input_check import check_model_file
from influence.errors import InfluenceError
from tests.cli import invoke, refused
from tests.input_texts import RATING
from vehicles.errors import VehicleError
from vehicles.library.files import read_load_model

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"
MODEL_FILES = sorted(EXAMPLES.glob("*.toml"))
VEHICLE_FILES = sorted((EXAMPLES / "vehicles").glob("*.toml")) + sorted(
    (EXAMPLES.parent / "vehicles" / "data").glob("*.toml"))

RATED = """title = "rated girder"
units = "kip-ft"
[beam]
spans = ["60 ft", "60 ft"]
EI = 2.0e6
supports = ["pinned", "roller", "roller"]
names = ["A", "P", "B"]
[[loads]]
name = "deck"
load = "DC"
uniform = "1.1 kip/ft"
[live_load]
vehicles = ["HL-93"]
[sections]
extra = ["P"]
[project]
job_number = "FC-12"
""" + RATING + """from = 0.0
to = 120.0
nominal = 5400.0
[fatigue]
standard = "AASHTO"
[[fatigue_detail]]
name = "cover plate end"
location = "span1@20.0"
response = "moment"
category = "E'"
section_modulus = 1450.0
"""


def test_check_reports_every_part_it_checked(tmp_path: Path) -> None:
    path = tmp_path / "rated.toml"
    path.write_text(RATED)
    status, output = invoke("check", str(path))
    assert status == 0
    checked = output.split("Checked:")[1]
    for words in ("dead loads: 1 (DC)", "live load: HL-93 found", "sections:",
                  "rating: LRFR; 1 capacities on the structure",
                  "fatigue: AASHTO; 1 details located", "project: 1 title-block fields"):
        assert words in checked
    status, output = invoke("check", str(path), "--format", "json")
    assert status == 0 and "structure: beam form" in json.loads(output)["checked"][0]


@pytest.mark.parametrize(("change", "words"), [
    (('vehicles = ["HL-93"]', 'vehicles = ["HL-39"]'), "no load model named 'HL-39'"),
    (('vehicles = ["HL-93"]', 'vehicles = ["missing.toml"]'), "file not found"),
    (('material = "steel"', 'material = "cheese"'), "rating.material"),
    (("nominal = 5400.0", "nominal = -5400.0"), "wrong sign"),
    (('category = "E\'"', 'category = "Z"'), "unknown AASHTO detail category"),
    (('standard = "AASHTO"', 'standard = "AASHTO"\ncolour = "red"'), "unknown key 'colour'"),
    (('job_number = "FC-12"', "job_number = 12"), "project.job_number"),
    (('extra = ["P"]', 'extra = ["Q"]'), "sections.extra[1]"),
])
def test_check_refuses_a_problem_in_any_part(tmp_path: Path, change: tuple[str, str],
                                             words: str) -> None:
    path = tmp_path / "rated.toml"
    path.write_text(RATED.replace(*change))
    with pytest.raises((InfluenceError, VehicleError)):
        check_model_file(path)
    assert words in refused("check", str(path))


def _paths(document: Any, prefix: tuple[Any, ...] = ()) -> list[tuple[Any, ...]]:
    found = []
    if isinstance(document, dict):
        items: Any = document.items()
    elif isinstance(document, list):
        items = enumerate(document)
    else:
        return found
    for key, value in items:
        found.append((*prefix, key))
        found += _paths(value, (*prefix, key))
    return found


def _damaged(document: dict[str, Any], path: tuple[Any, ...], value: Any,
             remove: bool) -> dict[str, Any]:
    document = copy.deepcopy(document)
    target = document
    for key in path[:-1]:
        target = target[key]
    if remove:
        del target[path[-1]]
    else:
        target[path[-1]] = value
    return document


HOSTILE = st.sampled_from([
    0, -1, 2.5, 1.0e14, 1.0e-300, True, False, "", "x", "20", "A@1", "H1", "12 ft", "3 kip",
    "1e300 m", [], [1], ["a"], [[1, 2, 3]], {}, {"a": 1}, [{}], "pinned", "span1@2", "P1",
    "L0", "Pratt", "top", "unlimited"])


def _damaged_copy(data: st.DataObject, files: list[Path], folder: Path) -> Path:
    """One of ``files`` with one to three keys given hostile values or removed, written."""
    document = tomllib.loads(data.draw(st.sampled_from(files), label="example").read_text())
    for _ in range(data.draw(st.integers(1, 3))):
        spots = _paths(document)
        if not spots:
            break
        spot = data.draw(st.sampled_from(spots), label="place")
        document = _damaged(document, spot, data.draw(HOSTILE, label="value"),
                            data.draw(st.booleans(), label="remove"))
    path = folder / "damaged.toml"
    path.write_text(tomli_w.dumps(document))
    return path


@settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(data=st.data())
def test_damaged_model_files_end_in_our_errors(tmp_path_factory: pytest.TempPathFactory,
                                               data: st.DataObject) -> None:
    path = _damaged_copy(data, MODEL_FILES, tmp_path_factory.mktemp("damaged"))
    try:
        check_model_file(path)
    except (InfluenceError, VehicleError) as error:
        assert "\n" not in str(error) and str(error)


@settings(max_examples=150, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(data=st.data())
def test_damaged_vehicle_files_end_in_our_errors(tmp_path_factory: pytest.TempPathFactory,
                                                 data: st.DataObject) -> None:
    path = _damaged_copy(data, VEHICLE_FILES, tmp_path_factory.mktemp("damaged"))
    try:
        read_load_model(path)
    except VehicleError as error:
        assert "\n" not in str(error) and str(error)


@pytest.mark.parametrize("key", ["standard", "section_units"])
@pytest.mark.parametrize("value", [[], {"a": 1}, 3])
def test_fatigue_choices_of_the_wrong_type_are_our_errors(tmp_path: Path, key: str,
                                                          value: Any) -> None:
    # found by the damaged-file property test: a list where a name belongs was a TypeError
    document = tomllib.loads((EXAMPLES / "wrenfield-girder.toml").read_text(encoding="utf-8"))
    document["fatigue"][key] = value
    path = tmp_path / "bad.toml"
    path.write_text(tomli_w.dumps(document))
    with pytest.raises(InfluenceError, match=f"fatigue.{key}"):
        check_model_file(path)
