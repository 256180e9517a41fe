"""Every key has one type, checked: a flag written as text, a name written as a number, a table
written as an array of tables, a range holding text, a list written as one text are refused in
one line naming the file, the key, the type expected and the fix; misplaced keys say where they
belong; a model file given as a vehicle file says what it is."""

from __future__ import annotations

from pathlib import Path

import pytest

from influence.errors import ModelError
from influence.model.reader import read_model_file
from tests.cli import refused
from tests.input_texts import FRAME
from tests.input_texts import GIRDER as TEXT_GIRDER
from vehicles.errors import VehicleError
from vehicles.library.files import read_load_model

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"

GIRDER = TEXT_GIRDER + '[live_load]\nvehicles = ["HL-93"]\n'

# (file, change, item in the message, words of the message)
LOOSE = {
    "bar as text": (FRAME, ("deck = true", 'deck = true\nbar = "no"'), "member AB.bar",
                    "expected true or false"),
    "release as text": (FRAME, ("deck = true", 'deck = true\nrelease_end = "false"'),
                        "member AB.release_end", "expected true or false"),
    "flag as a number": (FRAME, ("deck = true", "deck = 1"), "member AB.deck",
                         "expected true or false"),
    "node name as a number": (FRAME, ('name = "B"', "name = 2"), "nodes[2].name",
                              "expected text"),
    "member end as a number": (FRAME, ('end = "B"', "end = 2"), "member AB.end",
                               "expected text"),
    "path as one text": (FRAME, ('members = ["AB", "BC"]', 'members = "AB"'), "path.members",
                         "expected a list"),
    "support name as a number": (GIRDER, ('names = ["A", "B", "C"]', 'names = ["A", 2, "C"]'),
                                 "beam.names[2]", "expected text"),
    "beam as an array of tables": (GIRDER, ("[beam]", "[[beam]]"), "beam",
                                   "expected a table"),
    "EI range holding text": (GIRDER, ("EI = 2.0e5", 'EI = [[[0, 5, 2.0e5], [5, 10, "x"]], 2e5]'),
                              "beam.EI[1][2]", "not a number with a unit"),
    "EI range of two numbers": (GIRDER, ("EI = 2.0e5", "EI = [[[0, 10]], 2e5]"),
                                "beam.EI[1][1]", "is not [from, to, EI]"),
    "span as a flag": (GIRDER, ("spans = [10.0, 12.0]", "spans = [10.0, true]"),
                       "beam.spans[2]", "expected a number or a quantity"),
    "vehicles as one text": (GIRDER, ('vehicles = ["HL-93"]', 'vehicles = "HL-93"'),
                             "live_load.vehicles", "expected a list of load model names"),
    "title as a number": (GIRDER, ('title = "22 m girder"', "title = 5"), "title",
                          "expected text"),
    "per_span as a float": (GIRDER + "[sections]\nper_span = 2.5\n", ("", ""),
                            "sections.per_span", "whole number"),
    "load name as a number": (GIRDER + '[[loads]]\nload = 5\nuniform = 1.0\n', ("", ""),
                              "load 'load 1'.load", "expected text"),
    "support kind as a number": (GIRDER, ('"pinned", "roller", "roller"', '"pinned", 5, "roller"'),
                                 "beam.supports[2]", "neither a kind nor a table"),
}

MISPLACED = {
    "spans at the top": (("[beam]", "spans = [1.0]\n[beam]"), "move spans into [beam]"),
    "per_span in [live_load]": (('vehicles = ["HL-93"]', "per_span = 4"),
                                "per_span belongs in [sections]"),
    "bar in [beam]": (("[beam]", "[beam]\nbar = true"), "bar belongs in [[members]]"),
    "panels at the top": (("[beam]", "panels = 8\n[beam]"), "move panels into [truss]"),
    "adtt at the top": (("[beam]", "adtt = 100\n[beam]"), "[rating]"),
    "gamma_Mf at the top": (("[beam]", "gamma_Mf = 1.35\n[beam]"),
                            "move gamma_Mf into [fatigue]"),
}


def _write(tmp_path: Path, text: str) -> Path:
    path = tmp_path / "model.toml"
    path.write_text(text)
    return path


@pytest.mark.parametrize("case", LOOSE, ids=list(LOOSE))
def test_a_loosely_typed_key_is_refused(tmp_path: Path, case: str) -> None:
    text, change, item, words = LOOSE[case]
    path = _write(tmp_path, text.replace(*change) if change[0] else text)
    with pytest.raises(ModelError) as caught:
        read_model_file(path)
    error = caught.value
    assert (error.source, error.item) == (str(path), item) and words in error.problem
    assert error.fix
    message = refused("check", str(path))
    assert str(path) in message and item in message and words in message


@pytest.mark.parametrize("case", MISPLACED, ids=list(MISPLACED))
def test_a_misplaced_key_says_where_it_belongs(tmp_path: Path, case: str) -> None:
    change, words = MISPLACED[case]
    path = _write(tmp_path, GIRDER.replace(*change, 1))
    with pytest.raises(ModelError) as caught:
        read_model_file(path)
    assert words in str(caught.value)
    assert words in refused("check", str(path))


def test_a_model_file_given_as_a_vehicle_says_what_it_is() -> None:
    model = EXAMPLES / "overpass.toml"
    with pytest.raises(VehicleError, match="structure model file.*a vehicle file holds"):
        read_load_model(model)
    message = refused("govern", str(model), "moment", "--at", "P1", "--vehicle", str(model))
    assert "structure model file" in message and "[vehicle]" in message


def test_a_vehicle_file_given_as_a_model_says_where_its_keys_go() -> None:
    message = refused("check", str(EXAMPLES / "vehicles" / "crane-pair.toml"))
    assert "unknown key 'vehicle'" in message


@pytest.mark.parametrize(("change", "item"), [
    (("loads = [100.0, 100.0]", 'loads = ["100", 100.0]'), "[vehicle] loads[1]"),
    (("loads = [100.0, 100.0]", "loads = [true, 100.0]"), "[vehicle] loads[1]"),
    (('name = "pair"', "name = 5"), "name"),
])
def test_vehicle_keys_are_typed(tmp_path: Path, change: tuple[str, str], item: str) -> None:
    path = tmp_path / "v.toml"
    path.write_text('[vehicle]\nname = "pair"\nunits = "kN-m"\nloads = [100.0, 100.0]\n'
                    "spacings = [3.0]\n".replace(*change))
    with pytest.raises(VehicleError) as caught:
        read_load_model(path)
    assert item in str(caught.value) and str(path) in str(caught.value)
