"""Girders with haunched members, end to end: influence lines, their statics, and the exact
search on them.

Outside facts used (common practice; structural analysis texts such as R. C. Hibbeler,
*Structural Analysis*, chapters on influence lines and on nonprismatic members):
- the vertical reaction lines of any girder sum to the unit load, at every load position
  (statics);
- deflection lines are reciprocal, d(x at a) = d(a at x) (Maxwell-Betti);
- a girder modelled with many prismatic steps, each with the stiffness at its middle, converges
  to the girder of varying section as the steps are refined, at second order (the midpoint rule
  for the flexibility integrals, computed here);
- a haunch of vanishing depth leaves the member prismatic.
The governing placement must equal or beat a dense sampling of its own effect function.
"""

from __future__ import annotations

import math

import numpy as np
import pytest

from influence.analysis.haunch import section_of
from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.model.structure import Member, Model, Node, PathLeg, Support
from influence.model.variation import Haunch, SectionVariation
from vehicles import get_model, govern
from vehicles.search.effects import effect_function

SPAN = 30.0  # [m]
EI, EA = 1.0e6, 1.0e7  # [kN m2], [kN] of the prismatic parts
HAUNCH = Haunch("parabolic", 1.0, length_fraction=0.25)  # depth doubles over the pier
EXACT = 1e-9
"""Relative tolerance of statics and reciprocity on certified lines (their bound is ~1e-11)."""


def two_spans(start: SectionVariation | None, end: SectionVariation | None) -> Model:
    nodes = (Node("A", 0.0, 0.0, Support.named("pinned")),
             Node("B", SPAN, 0.0, Support.named("roller")),
             Node("C", 2 * SPAN, 0.0, Support.named("roller")))
    members = (Member("AB", "A", "B", EA, EI, deck=True, variation=start),
               Member("BC", "B", "C", EA, EI, deck=True, variation=end))
    return Model("two spans", "kN-m", nodes, members, (PathLeg("AB"), PathLeg("BC")))


@pytest.fixture(scope="module")
def haunched():  # type: ignore[no-untyped-def]
    return analyse_model(two_spans(SectionVariation(end=HAUNCH), SectionVariation(start=HAUNCH)))


def stepped(steps: int) -> Model:
    """The haunched girder as prismatic steps, each with EI and EA at its middle."""
    nodes = [Node("A", 0.0, 0.0, Support.named("pinned"))]
    members = []
    sections = [(section_of(SectionVariation(end=HAUNCH), SPAN, EI, EA), 0.0),
                (section_of(SectionVariation(start=HAUNCH), SPAN, EI, EA), SPAN)]
    for span, (section, origin) in enumerate(sections):
        for i in range(steps):
            a, b = i * SPAN / steps, (i + 1) * SPAN / steps
            middle = [(a + b) / 2]
            name = "B" if (span == 0 and i == steps - 1) else f"N{span}_{i}"
            support = Support.named("roller") if i == steps - 1 else Support()
            nodes.append(Node(name, origin + b, 0.0, support))
            members.append(Member(f"M{span}_{i}", nodes[-2].name, name,
                                  float(section.EA(middle)[0]), float(section.EI(middle)[0]),
                                  deck=True))
    return Model("stepped", "kN-m", tuple(nodes), tuple(members),
                 tuple(PathLeg(m.name) for m in members))


def test_reaction_lines_sum_to_the_unit_load(haunched) -> None:  # type: ignore[no-untyped-def]
    x = np.linspace(0.0, 2 * SPAN, 1201)
    total = sum(haunched.line(Response("reaction", n)).values(x) for n in ("A", "B", "C"))
    assert np.abs(total - 1.0).max() <= EXACT
    assert haunched.equilibrium_residual <= EXACT


def test_deflection_lines_are_reciprocal(haunched) -> None:  # type: ignore[no-untyped-def]
    points = [5.0, 17.5, 29.0, 36.0, 52.0]
    lines = haunched.lines([Response("deflection", repr(p)) for p in points])
    scale = max(abs(line.extremes().largest.value) for line in lines)
    for i, first in enumerate(points):
        for j, second in enumerate(points):
            a = lines[i].values([second])[0]
            b = lines[j].values([first])[0]
            assert abs(a - b) <= EXACT * scale


def test_a_vanishing_haunch_leaves_the_member_prismatic() -> None:
    faint = Haunch("straight", 1e-12, length_fraction=0.25)
    near = analyse_model(two_spans(SectionVariation(end=faint), SectionVariation(start=faint)))
    plain = analyse_model(two_spans(None, None))
    x = np.linspace(0.0, 2 * SPAN, 241)
    for response in (Response("moment", "B"), Response("shear", "12"), Response("reaction", "A")):
        expected = plain.line(response).values(x)
        assert near.line(response).values(x) == pytest.approx(expected, rel=1e-9, abs=1e-9)


def test_stepped_girders_converge_to_the_exact_one_at_second_order(haunched) -> None:  # type: ignore[no-untyped-def]
    x = np.linspace(0.0, 2 * SPAN, 241)
    exact = haunched.line(Response("moment", "B")).values(x)
    errors = []
    steps = (8, 16, 32)
    for count in steps:
        line = analyse_model(stepped(count)).line(Response("moment", "B"))
        errors.append(float(np.abs(line.values(x) - exact).max() / np.abs(exact).max()))
    orders = [math.log2(errors[i] / errors[i + 1]) for i in range(len(errors) - 1)]
    assert all(1.8 <= order <= 2.3 for order in orders), (errors, orders)


def test_the_pier_moment_line_is_certified_pieces_of_modest_degree(haunched) -> None:  # type: ignore[no-untyped-def]
    line = haunched.line(Response("moment", "B"))
    assert 3 < line.function.degree <= 12
    # inside the haunches the line is no cubic: more pieces than the two spans alone
    assert line.breakpoints.size > 10


@pytest.mark.parametrize("response", [Response("moment", "B"), Response("moment", "15"),
                                      Response("shear", "B", "left"), Response("deflection", "15")])
def test_the_search_equals_or_beats_dense_sampling_on_a_haunched_girder(haunched, response) -> None:  # type: ignore[no-untyped-def]
    hl93 = get_model("HL-93", units="kN-m")
    line = haunched.line(response)
    found = govern(line, hl93, kind=response.kind, interior=line.scope_interior)
    for placement in (found.max, found.min):
        if placement is None:
            continue
        case = next(c for c in hl93.cases if c.name == placement.case)
        values = [r.value for r in placement.ranged_values if r.value is not None]
        effect = effect_function(line, case, kind=response.kind, sense=placement.sense,
                                 direction=placement.direction, ranged_values=values or None)
        leads = np.linspace(effect.function.start, effect.function.end, 20001)
        sampled = effect.values(leads)
        if placement.sense == "max":
            assert placement.value >= sampled.max() - 1e-9 * abs(sampled.max())
        else:
            assert placement.value <= sampled.min() + 1e-9 * abs(sampled.min())
