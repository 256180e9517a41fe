"""Dead-load effects from influence-line areas against textbook formulas.

Source: the standard beam tables (e.g. AISC Manual "Beam diagrams and formulas": simple beam,
uniformly distributed load; continuous beam, two equal spans, uniform load on both spans;
recalled from memory, and derivable by statics and the three-moment equation):
    simple span: M(L/2) = wL^2/8, R = V(0) = wL/2, M(x) = wx(L - x)/2;
    two equal spans: M over the middle support = -wL^2/8, end reactions 3wL/8, middle 10wL/8.
    simple span, point load P at a: M(a) = Pab/L.
"""

from __future__ import annotations

import pytest

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.design.deadload import dead_load_effect
from influence.model.basis import DeadLoad
from influence.model.beamform import continuous_beam, simple_beam

RELATIVE = 1e-9
w, L = 18.0, 14.0


def effect(model, response: Response, load: DeadLoad) -> float:  # type: ignore[no-untyped-def]
    analysis = analyse_model(model)
    return dead_load_effect(analysis.line(response), load, analysis.path)


def test_simple_span_uniform_load() -> None:
    deck = DeadLoad("deck", "DC", uniform=w)
    model = simple_beam(L)
    assert effect(model, Response("moment", str(L / 2)), deck) == pytest.approx(
        w * L**2 / 8, rel=RELATIVE)
    assert effect(model, Response("reaction", "S1"), deck) == pytest.approx(w * L / 2, rel=RELATIVE)
    assert effect(model, Response("shear", "0"), deck) == pytest.approx(w * L / 2, rel=RELATIVE)
    x = 3.5
    assert effect(model, Response("moment", str(x)), deck) == pytest.approx(
        w * x * (L - x) / 2, rel=RELATIVE)


def test_partial_uniform_load_and_point_load() -> None:
    model = simple_beam(L)
    # a uniform load on the left half only: R_B = w(L/2)(L/4)/L = wL/8
    half = DeadLoad("half", "DC", uniform=w, end=L / 2)
    assert effect(model, Response("reaction", "S2"), half) == pytest.approx(w * L / 8, rel=RELATIVE)
    a = 4.0
    point = DeadLoad("diaphragm", "DC", point=30.0, at=a)
    assert effect(model, Response("moment", str(a)), point) == pytest.approx(
        30.0 * a * (L - a) / L, rel=RELATIVE)


def test_two_equal_spans_uniform_load() -> None:
    deck = DeadLoad("deck", "DC", uniform=w)
    model = continuous_beam([L, L], 5.0e5, ["pinned", "roller", "roller"])
    assert effect(model, Response("moment", "S2"), deck) == pytest.approx(
        -w * L**2 / 8, rel=RELATIVE)
    assert effect(model, Response("reaction", "S1"), deck) == pytest.approx(
        3 * w * L / 8, rel=RELATIVE)
    assert effect(model, Response("reaction", "S2"), deck) == pytest.approx(
        10 * w * L / 8, rel=RELATIVE)


def test_load_on_named_members_only() -> None:
    # two equal spans, span 1 loaded only: M_B = -wL^2/16 (three-moment equation)
    model = continuous_beam([L, L], 5.0e5, ["pinned", "roller", "roller"])
    first = DeadLoad("span 1 only", "DC", uniform=w, members=("span1",))
    assert effect(model, Response("moment", "S2"), first) == pytest.approx(
        -w * L**2 / 16, rel=RELATIVE)
