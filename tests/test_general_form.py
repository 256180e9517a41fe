"""The general form: nodes, members and a path; checks, equilibrium and reciprocity on frames.

- Equilibrium of a rigid body (statics, common practice): the vertical reaction lines sum to one,
  the horizontal ones to zero, and the reactions' moments about the origin balance the load's.
- Maxwell-Betti reciprocal theorem (Maxwell 1864, Betti 1872): the deflection of node j for a unit
  load at node k equals that of node k for a unit load at node j.
- An inclined simple beam carries a vertical load by lever arms measured horizontally
  (textbook statics): R_B = x/(L cos a) = c/L for a load at chainage c along the member.
"""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pytest
from click.testing import CliRunner

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.cli import main
from influence.errors import LocationError, MechanismError, ModelError
from influence.model.reader import read_model
from influence.model.structure import Member, Model, Node, PathLeg, Support
from tests.beams import close
from tests.frames import portal_frame, pratt_truss

EXAMPLES = Path(__file__).resolve().parent.parent / "examples"


def test_beam_form_and_general_form_give_the_same_lines(tmp_path: Path) -> None:
    beam = read_model(EXAMPLES / "overpass.toml")
    general = tmp_path / "general.toml"
    general.write_text("""
title = "overpass written node by node"
units = "kN-m"
nodes = [
  { name = "A1", x = 0.0, y = 0.0, support = "pinned" },
  { name = "P1", x = 24.0, y = 0.0, support = "roller" },
  { name = "P2", x = 56.0, y = 0.0, support = "roller" },
  { name = "A2", x = 80.0, y = 0.0, support = "roller" },
]
members = [
  { name = "s1", start = "A1", end = "P1", EI = 4.0e6, EA = 1.0e7, deck = true },
  { name = "s2", start = "P1", end = "P2", EI = 6.4e6, EA = 1.0e7, deck = true },
  { name = "s3", start = "P2", end = "A2", EI = 4.0e6, EA = 1.0e7, deck = true },
]
[path]
start = "A1"
end = "A2"
""")
    loads = np.linspace(0.0, 80.0, 81)
    first, second = analyse_model(beam), analyse_model(read_model(general))
    for response in (Response("moment", "P1"), Response("shear", "30", side="left"),
                     Response("reaction", "P2"), Response("deflection", "40"),
                     Response("rotation", "A1")):
        expected = first.line(response).values(loads)
        scale = float(np.abs(expected).max())
        assert close(second.line(response).values(loads), expected, scale=scale)


@pytest.mark.parametrize("model", [portal_frame("fixed"), portal_frame("pinned"),
                                   pratt_truss(6, 5.0, 6.0)])
def test_reaction_lines_balance_the_unit_load(model: Model) -> None:
    analysis = analyse_model(model)
    path = analysis.path
    loads = np.linspace(0.0, path.total_length, 23)
    x_of_load = loads + model.node(path.legs[0].entry_node).x  # these paths are horizontal
    totals = {"vertical": 0.0, "horizontal": 0.0}
    moment = np.zeros_like(loads)
    for node in model.nodes:
        for component, direction in (("vertical", "uy"), ("horizontal", "ux"), ("moment", "rz")):
            if node.support.restraint(direction) == "free":
                continue
            values = analysis.line(Response("reaction", node.name, component=component)).values(
                loads)
            if component == "moment":
                moment = moment + values
            else:
                totals[component] = totals[component] + values
                moment = moment + (node.x * values if component == "vertical"
                                   else -node.y * values)
    assert close(totals["vertical"], np.ones_like(loads))
    assert close(totals["horizontal"], np.zeros_like(loads))
    assert close(moment, x_of_load, scale=path.total_length)


@pytest.mark.parametrize(("model", "first", "second"), [
    (portal_frame("fixed"), "WK", "M"), (portal_frame("pinned"), "M", "EK"),
    (pratt_truss(6, 5.0, 6.0), "L2", "L5"),
])
def test_maxwell_betti_between_nodes(model: Model, first: str, second: str) -> None:
    analysis = analyse_model(model)
    at_first = analysis.line(Response("deflection", first))
    at_second = analysis.line(Response("deflection", second))
    c_first, c_second = analysis.path.node_chainage(first), analysis.path.node_chainage(second)
    a = float(at_first.values([c_second])[0])
    b = float(at_second.values([c_first])[0])
    assert abs(a - b) <= 1e-9 * max(abs(a), abs(b))


def test_inclined_simple_beam_uses_horizontal_lever_arms() -> None:
    nodes = (Node("A", 0.0, 0.0, Support.named("pinned")), Node("B", 8.0, 6.0,
                                                                 Support.named("roller")))
    model = Model("ramp", "kN-m", nodes, (Member("AB", "A", "B", EA=1e6, EI=1e4, deck=True),),
                  (PathLeg("AB"),))
    analysis = analyse_model(model)
    c = np.linspace(0.0, 10.0, 11)
    assert close(analysis.line(Response("reaction", "B")).values(c), c / 10.0)
    # the pinned end takes the rest vertically and nothing horizontally (the roller is vertical)
    assert close(analysis.line(Response("reaction", "A", component="horizontal")).values(c),
                 np.zeros_like(c))


GOOD = """
title = "frame"
nodes = [
  { name = "A", x = 0.0, y = 0.0, support = "pinned" },
  { name = "B", x = 10.0, y = 0.0, support = "roller" },
  { name = "C", x = 20.0, y = 0.0, support = "roller" },
]
members = [
  { name = "AB", start = "A", end = "B", EI = 1.0e5, EA = 1.0e6 },
  { name = "BC", start = "B", end = "C", EI = 1.0e5, EA = 1.0e6 },
]
[path]
members = ["AB", "BC"]
"""


@pytest.mark.parametrize(("change", "error", "expected"), [
    (('members = ["AB", "BC"]', 'members = ["AB", "XY"]'), ModelError, "unknown member 'XY'"),
    (('end = "C", EI', 'end = "Q", EI'), ModelError, "unknown node 'Q'"),
    (('x = 20.0, y = 0.0', 'x = 10.0, y = 0.0'), ModelError, "length 0, less than"),
    (('name = "C", x', 'name = "B", x'), ModelError, "node name 'B' is used twice"),
    (('[path]\nmembers = ["AB", "BC"]', '[path]\nstart = "A"\nend = "C"'), ModelError,
     "not on any deck member"),
])
def test_general_form_errors(tmp_path: Path, change: tuple[str, str], error: type,
                             expected: str) -> None:
    path = tmp_path / "frame.toml"
    path.write_text(GOOD.replace(*change))
    with pytest.raises(error) as caught:
        analyse_model(read_model(path))
    assert expected in str(caught.value)
    result = CliRunner().invoke(main, ["check", str(path)])
    assert result.exit_code == 1 and len(result.output.strip().splitlines()) == 1


def test_path_that_is_not_a_chain(tmp_path: Path) -> None:
    text = GOOD.replace('{ name = "BC", start = "B"', '{ name = "BC", start = "C"').replace(
        'end = "C", EI', 'end = "D", EI').replace(
        '{ name = "C", x = 20.0, y = 0.0, support = "roller" },',
        '{ name = "C", x = 20.0, y = 0.0, support = "roller" },\n'
        '  { name = "D", x = 30.0, y = 0.0, support = "roller" },')
    path = tmp_path / "broken.toml"
    path.write_text(text)
    with pytest.raises(ModelError, match="not a connected chain"):
        read_model(path)


def test_unstable_truss_is_named() -> None:
    truss = pratt_truss(4, 5.0, 5.0)
    without_diagonal = tuple(m for m in truss.members if m.name != "U1L2")
    broken = Model("truss", "kN-m", truss.nodes, without_diagonal, truss.path)
    with pytest.raises(MechanismError, match="can move") as caught:
        analyse_model(broken)
    assert "add" in str(caught.value)


def test_all_bar_truss_without_diagonal_says_unstable() -> None:
    nodes = (Node("A", 0, 0, Support.named("pinned")), Node("B", 4, 0, Support.named("roller")),
             Node("C", 4, 3), Node("D", 0, 3))
    bars = tuple(Member(n, a, b, EA=1e5, EI=1.0, release_start=True, release_end=True,
                        deck=n == "AB")
                 for n, a, b in (("AB", "A", "B"), ("BC", "B", "C"), ("CD", "C", "D"),
                                 ("DA", "D", "A")))
    with pytest.raises(MechanismError, match="the truss is unstable"):
        analyse_model(Model("square", "kN-m", nodes, bars, (PathLeg("AB"),)))


def test_section_not_on_the_member() -> None:
    analysis = analyse_model(portal_frame())
    with pytest.raises(LocationError, match="is not on member WL"):
        analysis.line(Response("moment", "WL@7.5"))
    with pytest.raises(LocationError, match="node WB is not on the travel path"):
        analysis.line(Response("moment", "WB"))


def test_examples_check_and_draw(tmp_path: Path) -> None:
    for name in ("truss-rail-bridge", "portal-footbridge", "gerber-girder"):
        target = tmp_path / f"{name}.png"
        result = CliRunner().invoke(main, ["check", str(EXAMPLES / f"{name}.toml"), "--plot",
                                           str(target)])
        assert result.exit_code == 0, result.output
        assert target.stat().st_size > 10_000
