"""Invariants of beam influence lines on random girders (hypothesis).

- Equilibrium (statics, common practice): the vertical reaction lines sum to one, and the moments
  of the reactions about chainage 0 balance the unit load's moment a.
- Maxwell-Betti reciprocal theorem (J. C. Maxwell, 1864; E. Betti, 1872): the deflection at x_j
  for a unit load at x_k equals the deflection at x_k for a unit load at x_j.
- Mueller-Breslau principle (H. Mueller-Breslau, 1886), as facts of the trade: a shear line jumps
  by exactly one at its section; a moment line's slope changes by exactly one there.
"""

from __future__ import annotations

import numpy as np
from hypothesis import given, settings
from hypothesis import strategies as st

from influence.analysis.lines import analyse_model
from influence.analysis.responses import Response
from influence.model.beamform import continuous_beam

TOLERANCE = 1e-9


@st.composite
def girders(draw):  # type: ignore[no-untyped-def]
    count = draw(st.integers(1, 4))
    spans = draw(st.lists(st.floats(2.0, 40.0), min_size=count, max_size=count))
    EI = draw(st.lists(st.floats(1.0e4, 1.0e7), min_size=count, max_size=count))
    supports = ["pinned"] + ["roller"] * count
    if draw(st.booleans()):
        supports[0] = "fixed"
    if draw(st.booleans()):
        supports[-1] = "fixed"
    if count >= 2 and draw(st.booleans()) and supports[-2] != "free":
        supports[-1] = "free"  # an overhang
    springs = draw(st.booleans())
    if springs and count >= 2:
        supports[1] = "roller"
    return continuous_beam(spans, EI, supports)


def _loads(model, fractions):  # type: ignore[no-untyped-def]
    total = model.nodes[-1].x
    return np.array(fractions) * total


@settings(max_examples=30, deadline=None)
@given(girders(), st.lists(st.floats(0.0, 1.0), min_size=3, max_size=6))
def test_reactions_balance_the_unit_load(model, fractions) -> None:  # type: ignore[no-untyped-def]
    analysis = analyse_model(model)
    loads = _loads(model, fractions)
    supports = [n for n in model.nodes if n.support.is_support]
    vertical = [analysis.line(Response("reaction", n.name)).values(loads) for n in supports]
    assert np.allclose(np.sum(vertical, axis=0), 1.0, atol=TOLERANCE, rtol=0)
    moment = sum(n.x * v for n, v in zip(supports, vertical, strict=True))
    for node in supports:
        if node.support.rz == "fixed":
            moment = moment + analysis.line(
                Response("reaction", node.name, component="moment")).values(loads)
    scale = model.nodes[-1].x
    assert np.allclose(moment, loads, atol=TOLERANCE * scale, rtol=0)


@settings(max_examples=30, deadline=None)
@given(girders(), st.floats(0.0, 1.0), st.floats(0.0, 1.0))
def test_maxwell_betti_reciprocity(model, first, second) -> None:  # type: ignore[no-untyped-def]
    analysis = analyse_model(model)
    xj, xk = _loads(model, [first, second])
    at_j = analysis.line(Response("deflection", repr(float(xj))))
    at_k = analysis.line(Response("deflection", repr(float(xk))))
    a, b = float(at_j.values([xk])[0]), float(at_k.values([xj])[0])
    # deflections are of the order L^3 / EI; at a support they vanish, so measure against that
    flexibility = model.nodes[-1].x ** 3 / min(member.EI for member in model.members)
    scale = max(abs(at_j.extremes().largest.value), abs(at_k.extremes().largest.value),
                flexibility)
    assert abs(a - b) <= TOLERANCE * scale


@settings(max_examples=30, deadline=None)
@given(girders(), st.floats(0.01, 0.99))
def test_shear_jumps_by_one_and_moment_kinks_by_one(model, fraction) -> None:  # type: ignore[no-untyped-def]
    analysis = analyse_model(model)
    section = float(_loads(model, [fraction])[0])
    if any(abs(n.x - section) < 1e-6 for n in model.nodes):
        return  # a node: the jump there includes the support's own reaction line
    shear = analysis.line(Response("shear", repr(section)))
    jump = shear.values([section], side="right") - shear.values([section], side="left")
    assert abs(float(jump[0]) - 1.0) <= TOLERANCE

    moment = analysis.line(Response("moment", repr(section)))
    index = int(np.argmin(np.abs(moment.breakpoints - section)))
    assert np.isclose(moment.breakpoints[index], section, rtol=0, atol=1e-9)
    left_piece = moment.coefficients[index - 1]
    right_piece = moment.coefficients[index]
    width = moment.breakpoints[index] - moment.breakpoints[index - 1]
    polynomial = np.polynomial.polynomial
    slope_left = polynomial.polyval(width, polynomial.polyder(left_piece))
    slope_right = right_piece[1]
    assert abs((slope_right - slope_left) + 1.0) <= TOLERANCE * max(1.0, abs(slope_left))
