"""Degenerate models and ambiguous locations are refused when the model is read: a hinge given
twice, a path that travels a member twice or comes back to a node, dead loads, sections,
capacities and fatigue details off the structure, node names that read as chainages or hold
``@``, and support names that clash with generated node names."""

from __future__ import annotations

from pathlib import Path

import pytest

from influence.errors import ModelError
from influence.model.beamform import continuous_beam
from influence.model.reader import read_model_file
from influence.model.structure import Member, Model, Node, PathLeg, Support
from tests.cli import refused
from tests.input_texts import FRAME, GIRDER, RATING

FATIGUE = """
[fatigue]
standard = "AASHTO"
[[fatigue_detail]]
name = "flange"
response = "moment"
category = "E"
section_modulus = 1450.0
"""

# (file text, item in the message, words)
DEGENERATE = {
    "a point load off the girder": (
        GIRDER + '[[loads]]\nname = "lamp"\nload = "DC"\npoint = 5.0\nat = 99.0\n',
        "load 'lamp'.at", "point load at 99 is off the path (0 to 22)"),
    "a point load before the start": (
        GIRDER + '[[loads]]\nname = "lamp"\nload = "DC"\npoint = 5.0\nat = -1.0\n',
        "load 'lamp'.at", "off the path"),
    "a uniform load wholly off": (
        GIRDER + '[[loads]]\nname = "w"\nload = "DC"\nuniform = 5.0\nfrom = 30.0\nto = 40.0\n',
        "load 'w'.from", "from 30 is off the path"),
    "a uniform load partly off": (
        GIRDER + '[[loads]]\nname = "w"\nload = "DC"\nuniform = 5.0\nfrom = 10.0\nto = 40.0\n',
        "load 'w'.to", "to 40 is off the path"),
    "a uniform range outside its members": (
        GIRDER + '[[loads]]\nname = "w"\nload = "DC"\nuniform = 5.0\nmembers = ["span1"]\n'
                 "from = 12.0\nto = 20.0\n", "load 'w'", "outside the members named"),
    "the same hinge twice": (GIRDER.replace("EI = 2.0e5", "EI = 2.0e5\nhinges = [4.0, 4.0]"),
                             "beam.hinges", "a hinge at 4 is given twice"),
    "a path travelling a member twice": (FRAME.replace('["AB", "BC"]', '["AB", "BC", "BC"]'),
                                         "path item 3", "lists member 'BC' twice"),
    "a section off the path": (GIRDER + '[sections]\nextra = ["30.0"]\n', "sections.extra[1]",
                               "chainage 30 is off the path"),
    "a section on no member": (GIRDER + '[sections]\nextra = ["X9@1.0"]\n',
                               "sections.extra[1]", "no member named 'X9'"),
    "a capacity range off the path": (GIRDER + RATING + "from = 0.0\nto = 30.0\n"
                                      "nominal = 100.0\n", "capacity (moment, positive)",
                                      "runs off the path"),
    "a capacity at a missing section": (GIRDER + RATING + 'sections = ["Q"]\nnominal = 100.0\n',
                                        "capacity (moment, positive).sections",
                                        "'Q' is not a chainage, a node or MEMBER@DISTANCE"),
    "a fatigue detail off the structure": (GIRDER + FATIGUE + 'location = "span9@1.0"\n',
                                           "fatigue_detail 'flange'.location",
                                           "no member named 'span9'"),
    "a fatigue detail beyond the end": (GIRDER + FATIGUE + 'location = "25.0"\n',
                                        "fatigue_detail 'flange'.location", "off the path"),
    "a node named like a chainage": (GIRDER.replace('["A", "B", "C"]', '["A", "20", "C"]'),
                                     "beam.names[2]", "node name '20' reads as a chainage"),
    "a node named nan": (FRAME.replace('name = "B"', 'name = "nan"').replace(
        'end = "B"', 'end = "nan"').replace('start = "B"', 'start = "nan"'),
        "nodes[2].name", "reads as a chainage"),
    "a node name holding @": (GIRDER.replace('["A", "B", "C"]', '["A", "A@1", "C"]'),
                              "beam.names[2]", "holds @"),
    "a member name holding @": (FRAME.replace('name = "AB"', 'name = "A@B"'),
                                "members[1].name", "holds @"),
    "a support named as a generated hinge": (
        GIRDER.replace('["A", "B", "C"]', '["A", "H1", "C"]').replace(
            "EI = 2.0e5", "EI = 2.0e5\nhinges = [4.0]"),
        "beam.names", "support name 'H1' is also the name of a generated node"),
    "a support named as a generated EI step": (
        GIRDER.replace('["A", "B", "C"]', '["A", "J1", "C"]').replace(
            "EI = 2.0e5", "EI = [[[0, 4, 2.0e5], [4, 10, 3.0e5]], 2.0e5]"),
        "beam.names", "support name 'J1' is also the name of a generated node"),
    "a name with spaces at its ends": (GIRDER.replace('["A", "B", "C"]', '["A", " B", "C"]'),
                                       "beam.names[2]", "spaces at its ends"),
}


@pytest.mark.parametrize("case", DEGENERATE, ids=list(DEGENERATE))
def test_a_degenerate_model_is_refused_when_read(tmp_path: Path, case: str) -> None:
    text, item, words = DEGENERATE[case]
    path = tmp_path / "model.toml"
    path.write_text(text)
    with pytest.raises(ModelError) as caught:
        read_model_file(path)
    assert caught.value.item == item and words in caught.value.problem, str(caught.value)
    assert caught.value.fix and caught.value.source == str(path)
    plot = tmp_path / "drawing.png"
    message = refused("check", str(path), "--plot", str(plot))
    assert str(path) in message and words in message
    assert not plot.exists()


def test_a_load_on_the_structure_end_is_kept(tmp_path: Path) -> None:
    path = tmp_path / "model.toml"
    path.write_text(GIRDER + '[[loads]]\nname = "lamp"\nload = "DC"\npoint = 5.0\nat = 22.0\n'
                    '[[loads]]\nname = "w"\nload = "DC"\nuniform = 5.0\nfrom = 0.0\nto = 22.0\n')
    loads = read_model_file(path).basis.loads
    assert loads[0].at == 22.0 and (loads[1].start, loads[1].end) == (0.0, 22.0)


def test_a_node_name_that_reads_as_a_number_is_refused_in_python_too() -> None:
    with pytest.raises(ModelError, match="reads as a chainage"):
        continuous_beam([10.0, 10.0], 1.0, ["pinned", "roller", "roller"],
                        names=["A", "10", "C"])
    with pytest.raises(ModelError, match="holds @"):
        Model("m", "kN-m", (Node("A", 0, 0, Support.named("pinned")),
                            Node("B@2", 10, 0, Support.named("roller"))),
              (Member("AB", "A", "B@2", 1.0, 1.0),), (PathLeg("AB"),))


def test_a_routed_path_that_comes_back_is_refused(tmp_path: Path) -> None:
    from influence.model.path import trace

    nodes = (Node("A", 0, 0, Support.named("pinned")), Node("B", 10, 0),
             Node("C", 10, 5, Support.named("roller")))
    members = (Member("AB", "A", "B", 1.0, 1.0), Member("BC", "B", "C", 1.0, 1.0),
               Member("CA", "C", "A", 1.0, 1.0))
    model = Model("loop", "kN-m", nodes, members,
                  (PathLeg("AB"), PathLeg("BC"), PathLeg("CA")))
    with pytest.raises(ModelError, match="comes back to node A"):
        trace(model)
