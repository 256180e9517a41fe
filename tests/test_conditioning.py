"""Girders of extreme stiffness contrast: equilibrium, reciprocity and the mechanism detector.

Random girders (hypothesis) with EI from 1e3 to 1e11 (ratios up to 1e8), EI steps anywhere in a
span (down to 0.05 % of it from a support), vertical springs from 1 to 1e12 and fixed ends. The
facts checked are the trade's own:
- statics (common practice): the vertical reactions balance the unit load for every load position;
- the Maxwell-Betti reciprocal theorem (J. C. Maxwell, 1864; E. Betti, 1872): the deflection at
  x_j for a unit load at x_k equals the deflection at x_k for a unit load at x_j;
- none of these girders can move without straining (a pinned end and at least one more vertical
  restraint), so the mechanism detector must never report one; girders that are mechanisms
  (no horizontal restraint, two hinges in one span) must be reported whatever their stiffness.
The numerical facts are checked against what the solver states (influence.analysis.solve):
reactions balance to EQUILIBRIUM_LIMIT or the model is refused with a ConditioningError naming
the contrast; girders of ordinary proportions are never refused and balance to 1e-9 whatever
their springs; reciprocity holds to 1e-9.
"""

from __future__ import annotations

import numpy as np
import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from influence.analysis.lines import EQUILIBRIUM_LIMIT, Analysis, analyse_model
from influence.analysis.responses import Response
from influence.errors import ConditioningError, MechanismError
from influence.model.beamform import continuous_beam
from influence.model.structure import Model, Support

READING = 1e-10
"""Round-off of reading a line at a load position, relative to the largest reaction [-]."""
RECIPROCITY = 1e-9
"""Maxwell-Betti agreement the solver states, relative to the lines' largest ordinates [-]."""
ORDINARY = 1e-9
"""Equilibrium reached by girders of ordinary proportions (EI within 1e4 from span to span,
spans of 2 to 40 m), whatever their springs (1 to 1e12) [-]."""
PLENTY = settings(max_examples=1000, deadline=None, derandomize=True,
                  suppress_health_check=[HealthCheck.too_slow])
"""Thousands of girders in all (about a minute on a CI machine); derandomised so that every run
checks the same girders."""

stiffness = st.floats(3.0, 11.0).map(lambda p: 10.0**p)  # EI [kN m^2], 1e3 to 1e11
ordinary_stiffness = st.floats(3.0, 7.0).map(lambda p: 10.0**p)  # EI ratios up to 1e4
near_an_end = st.one_of(st.floats(0.0005, 0.01), st.floats(0.99, 0.9995))


@st.composite
def span_EI(draw, span: float):  # type: ignore[no-untyped-def]
    """One EI for the span, or two EI ranges meeting anywhere in it (often right by a support)."""
    if not draw(st.booleans()):
        return draw(stiffness)
    cut = span * draw(st.one_of(near_an_end, st.floats(0.05, 0.95)))
    return [[0.0, cut, draw(stiffness)], [cut, span, draw(stiffness)]]


@st.composite
def girders(draw, stepped: bool = True) -> Model:  # type: ignore[no-untyped-def]
    count = draw(st.integers(1, 4))
    spans = draw(st.lists(st.floats(1.0 if stepped else 2.0, 40.0), min_size=count,
                          max_size=count))
    EI = [draw(span_EI(span)) if stepped else draw(ordinary_stiffness) for span in spans]
    supports: list[str | Support] = ["pinned"]
    for _ in range(count):
        kind = draw(st.sampled_from(["roller", "roller", "spring", "fixed"]))
        supports.append(Support(uy=10.0 ** draw(st.floats(0.0, 12.0))) if kind == "spring"
                        else kind)
    if draw(st.booleans()):
        supports[0] = "fixed"
    return continuous_beam(spans, EI, supports)


def analysed(model: Model) -> Analysis | None:
    """The analysis, or None when the solver refuses the contrast (never a mechanism)."""
    try:
        return analyse_model(model)
    except ConditioningError as error:
        assert "stiffness contrast" in str(error) and "EI" in str(error)
        return None


def measured_residual(analysis: Analysis, fractions: list[float]) -> float:
    """|sum of vertical reactions - 1| at the load positions, over the largest reaction
    ordinate."""
    model = analysis.model
    loads = np.array(fractions) * model.nodes[-1].x
    held = [n for n in model.nodes if n.support.uy != "free"]
    lines = analysis.lines([Response("reaction", n.name) for n in held])
    vertical = [line.values(loads) for line in lines]
    # the largest reaction ordinate anywhere (as the solver states its bound), at least 1
    largest = max(1.0, max(max(abs(e.largest.value), abs(e.smallest.value))
                           for e in (line.extremes() for line in lines)))
    return float(np.abs(np.sum(vertical, axis=0) - 1.0).max()) / largest


@PLENTY
@given(girders(), st.lists(st.floats(0.0, 1.0), min_size=4, max_size=8))
def test_reactions_balance_the_unit_load_or_the_contrast_is_refused(model, fractions) -> None:  # type: ignore[no-untyped-def]
    analysis = analysed(model)  # never a mechanism: a pinned end and a second restraint
    if analysis is None:
        return
    # accepted: the residual the analysis measured of itself is within the limit ...
    assert analysis.equilibrium_residual <= EQUILIBRIUM_LIMIT
    # ... and no load position shows more than it, up to the round-off of reading the lines
    # (a residual this small is itself round-off, so where it peaks shifts a little)
    assert measured_residual(analysis, fractions) <= 2 * analysis.equilibrium_residual + READING


@settings(max_examples=500, deadline=None, derandomize=True,
          suppress_health_check=[HealthCheck.too_slow])
@given(girders(stepped=False), st.lists(st.floats(0.0, 1.0), min_size=4, max_size=8))
def test_ordinary_girders_with_any_springs_are_solved_to_round_off(model, fractions) -> None:  # type: ignore[no-untyped-def]
    analysis = analyse_model(model)
    assert measured_residual(analysis, fractions) <= ORDINARY
    assert analysis.equilibrium_residual <= ORDINARY


@settings(max_examples=400, deadline=None, derandomize=True,
          suppress_health_check=[HealthCheck.too_slow])
@given(girders(), st.floats(0.0, 1.0), st.floats(0.0, 1.0))
def test_maxwell_betti_reciprocity(model, first, second) -> None:  # type: ignore[no-untyped-def]
    analysis = analysed(model)
    if analysis is None:
        return
    total = model.nodes[-1].x
    xj, xk = (f * total for f in (first, second))
    if any(0 < abs(x - n.x) <= 1e-6 * total for x in (xj, xk) for n in model.nodes):
        return  # a section within the position tolerance of a node is read as the node
    supports = [n.x for n in model.nodes if n.support.is_support]
    middles = [0.5 * (a + b) for a, b in zip(supports, supports[1:], strict=False)]
    at_j, at_k, *spans = analysis.lines([Response("deflection", repr(float(x)))
                                         for x in (xj, xk, *middles)])
    a, b = float(at_j.values([xk])[0]), float(at_k.values([xj])[0])
    # deflections vanish at supports: measure against the girder's own largest ones
    scale = max(max(abs(e.largest.value), abs(e.smallest.value))
                for e in (line.extremes() for line in (at_j, at_k, *spans)))
    assert abs(a - b) <= RECIPROCITY * scale


@settings(max_examples=150, deadline=None, derandomize=True)
@given(st.lists(st.floats(1.0, 40.0), min_size=1, max_size=3), st.data())
def test_a_girder_on_rollers_alone_slides_whatever_its_stiffness(spans, data) -> None:  # type: ignore[no-untyped-def]
    EI = [data.draw(span_EI(span)) for span in spans]
    with pytest.raises(MechanismError, match="slide"):
        analyse_model(continuous_beam(spans, EI, ["roller"] * (len(spans) + 1)))


@settings(max_examples=150, deadline=None, derandomize=True)
@given(st.floats(5.0, 40.0), st.data())
def test_two_hinges_in_a_simple_span_are_a_mechanism_whatever_its_stiffness(span, data) -> None:  # type: ignore[no-untyped-def]
    EI = data.draw(span_EI(span))
    hinges = sorted(data.draw(st.lists(st.floats(0.1, 0.9), min_size=2, max_size=2,
                                       unique=True)))
    if hinges[1] - hinges[0] < 0.01:
        return
    with pytest.raises(MechanismError):
        analyse_model(continuous_beam([span], [EI], ["pinned", "roller"],
                                      hinges=[h * span for h in hinges]))


@pytest.mark.parametrize("step", [0.02, 0.2])
@pytest.mark.parametrize(("near", "far"), [(1e7, 1e3), (1e3, 1e11), (1e5, 1e11)])
def test_an_EI_step_right_by_a_pinned_support_is_no_mechanism(step, near, far) -> None:
    # the girder of issue 15: an EI step 0.02 m from the pinned support was reported as sliding
    model = continuous_beam([25.0, 25.0], [[[0.0, step, near], [step, 25.0, far]], far],
                            ["pinned", "roller", "roller"])
    analysis = analyse_model(model)
    assert analysis.equilibrium_residual <= EQUILIBRIUM_LIMIT
    assert measured_residual(analysis, [0.0, 0.001, 0.3, 0.5, 0.77, 1.0]) <= EQUILIBRIUM_LIMIT


def test_a_contrast_beyond_double_precision_is_refused_in_one_line() -> None:
    # EI 1e11 over 2 mm beside EI 1e3: 12 EI / L^3 differ by about 2e20
    model = continuous_beam([25.0, 25.0], [[[0.0, 0.002, 1e11], [0.002, 25.0, 1e3]], 1e3],
                            ["pinned", "roller", "roller"], source="stepped.toml")
    with pytest.raises(ConditioningError) as caught:
        analyse_model(model)
    text = caught.value.one_line()
    assert "stepped.toml" in text and "0.002 long with EI 1e+11" in text and "\n" not in text


def test_a_stiff_spring_beside_a_soft_girder_balances_to_round_off() -> None:
    # a spring of 1e12 beside EI 1e3: the equilibration keeps the system well conditioned
    model = continuous_beam([12.0, 12.0], 1.0e3, ["pinned", Support(uy=1.0e12), "roller"])
    analysis = analyse_model(model)
    assert analysis.structure.condition < 1e6
    assert analysis.equilibrium_residual < 1e-12
