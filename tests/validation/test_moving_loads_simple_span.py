"""Moving concentrated loads on a simple beam: handbook cases and published worked examples.

References:
- AISC *Steel Construction Manual*, "Beam Diagrams and Formulas", moving-load cases (case
  numbers 42-45 from memory, unconfirmed); the formulas confirmed in substance by T. G. Hicks,
  *Civil Engineering Formulas*, McGraw-Hill, ch. 2, p. 64, Figs. 2.18-2.20, and
  re-derived here (computed).
- J. M. Gere, *Mechanics of Materials*, 7th ed., Cengage, 2009, Prob. 4.5-36 (confirmed).
- T. G. Hicks, *Handbook of Civil Engineering Calculations*, 2nd ed., McGraw-Hill, 2007,
  p. 1.77 (confirmed).
- AASHTO *LRFD Bridge Design Specifications*, Art. 3.6.1.2.2 and 3.6.1.2.4 (HL-93 truck 8-32-32
  kip at 14 ft, lane 0.64 klf; confirmed).

Closed forms are written in the assertions; the span, loads and spacings are the handbook's
symbols given numbers.
"""

from __future__ import annotations

import math

import pytest

from tests.influence_forms import (
    simple_midspan_deflection,
    simple_moment,
    simple_reaction,
    simple_shear,
)
from tests.section_scan import axle_train, largest_over_sections, one_case, section_grid
from vehicles.search.govern import govern
from vehicles.train import Axle, Train

EXACT = 1e-9  # relative: closed form against exact placement
L = 12.0  # span [m]


def close(value: float, expected: float, rel: float = EXACT) -> bool:
    return math.isclose(value, expected, rel_tol=rel, abs_tol=rel)


def test_one_load_shear_and_moment():
    """AISC one moving load: V_max = R_max = P (at the support); M_max = PL/4 (at midspan)."""
    P = 40.0
    model = one_case(axle_train([P], []))
    assert close(govern(simple_reaction(L), model, kind="reaction").max.value, P)
    assert close(govern(simple_shear(L, 1e-9 * L), model, kind="shear").max.value, P, 1e-8)
    midspan = govern(simple_moment(L, L / 2), model, kind="moment").max
    assert close(midspan.value, P * L / 4)
    assert close(midspan.axle_positions[0], L / 2)


@pytest.mark.parametrize("a", [0.2 * L, 0.5 * L])
def test_two_equal_loads_moment_below_limit(a):
    """AISC two equal loads, a < (2 - sqrt 2) L: M_max = (P/2L)(L - a/2)^2 under a load at
    x = (L - a/2)/2 from the nearer support."""
    P = 30.0
    x = (L - a / 2) / 2
    model = one_case(axle_train([P, P], [a]))
    found = govern(simple_moment(L, x), model, kind="moment", section=x).max
    assert close(found.value, P / (2 * L) * (L - a / 2) ** 2)
    assert found.section_axle is not None


def test_two_equal_loads_moment_above_limit():
    """AISC two equal loads, a >= 0.5858 L: one load at midspan governs, M_max = PL/4."""
    P, a = 30.0, 0.7 * L
    model = one_case(axle_train([P, P], [a]))
    midspan = govern(simple_moment(L, L / 2), model, kind="moment").max
    assert close(midspan.value, P * L / 4)
    # and no other section does better: the pair formula is lower here
    best = largest_over_sections(L, model, section_grid(L, 59))
    assert best.value <= P * L / 4 * (1 + EXACT)
    assert P / (2 * L) * (L - a / 2) ** 2 < P * L / 4


@pytest.mark.parametrize("a", [0.25 * L, 0.8 * L])
def test_two_equal_loads_end_shear(a):
    """AISC two equal loads: V_max = P(2 - a/L)."""
    P = 30.0
    found = govern(simple_reaction(L), one_case(axle_train([P, P], [a])), kind="reaction").max
    assert close(found.value, P * (2 - a / L))


@pytest.mark.parametrize(("P1", "P2", "a"), [(50.0, 20.0, 3.0), (30.0, 10.0, 10.0)])
def test_two_unequal_loads(P1, P2, a):
    """AISC two unequal loads P1 > P2: V_max = P1 + P2(L - a)/L; M_max = (P1 + P2) x^2 / L
    under P1 at x = (L - P2 a/(P1 + P2))/2, but never less than P1 L/4 (P1 alone)."""
    model = one_case(axle_train([P1, P2], [a]))
    shear = govern(simple_reaction(L), model, kind="reaction").max
    assert close(shear.value, P1 + P2 * (L - a) / L)
    x = (L - P2 * a / (P1 + P2)) / 2
    at_x = govern(simple_moment(L, x), model, kind="moment", section=x).max
    pair = (P1 + P2) * x**2 / L
    expected = max(pair, P1 * x * (L - x) / L)
    assert close(at_x.value, expected)
    midspan = govern(simple_moment(L, L / 2), model, kind="moment").max
    assert close(max(at_x.value, midspan.value), max(pair, P1 * L / 4))


def test_gere_4_5_36():
    """Gere 7th ed. Prob. 4.5-36: P = 10 kN and 2P at d = 2.4 m, L = 12 m.
    Published: V_max = 28 kN; M_max = 78.4 kN m at x = 4.0 m (P at 4.0 m, 2P at 6.4 m)."""
    P, d, span = 10.0, 2.4, 12.0
    model = one_case(axle_train([P, 2 * P], [d]))
    assert close(govern(simple_reaction(span), model, kind="reaction").max.value, 28.0)
    # the section of the published maximum is under the 2P load, 6.4 m from A
    found = govern(simple_moment(span, 6.4), model, kind="moment", section=6.4).max
    assert close(found.value, 78.4)
    assert sorted(round(x, 9) for x in found.axle_positions) == [4.0, 6.4]


def test_hicks_midspan_deflection_position():
    """Hicks, Handbook of Civil Engineering Calculations p. 1.77: 20 kip + 12 kip, 7 ft apart,
    L = 40 ft; maximum midspan deflection with the 20-kip load 17.46 ft from the left support
    (published; 17.461 exact). Deflection line a(3L^2 - 4a^2)/(48EI) is cubic: the maximum is an
    interior stationary point."""
    span, EI = 40.0, 1.0
    found = govern(simple_midspan_deflection(span, EI), one_case(axle_train([20.0, 12.0], [7.0]),
                   units="kip-ft"), kind="deflection").max
    heavy = found.axle_positions[0]
    a = min(heavy, span - heavy)  # from the nearer support
    assert a == pytest.approx(17.46, abs=0.005)
    # the 12-kip load stands past midspan, on the mirrored branch y(L - a - 7); stationarity of
    # 20 y(a) + 12 y(L - a - 7) with y'(t) = (3L^2 - 12 t^2)/(48 EI):
    lhs = 20 * (3 * span**2 - 12 * a**2)
    rhs = 12 * (3 * span**2 - 12 * (span - a - 7) ** 2)
    assert lhs == pytest.approx(rhs, rel=1e-9)


def test_hl93_lane_on_simple_span_midspan():
    """AASHTO LRFD 3.6.1.2.4: lane 0.64 klf, no dynamic allowance; on a simple span the midspan
    moment is 0.64 x the influence area L^2/8 (= 800 kip-ft on 100 ft)."""
    span = 100.0
    found = govern(simple_moment(span, span / 2), one_case(None, units="kip-ft", lane=0.64,
                   lane_allowance=0.0), kind="moment").max
    assert close(found.value, 0.64 * span**2 / 8)
    assert found.lane_segments == ((0.0, span),)


def test_hl93_truck_midspan_and_absolute_maximum():
    """HL-93 design truck (AASHTO LRFD Fig. 3.6.1.2.2-1) on a 100 ft simple span.

    At midspan: middle axle over midspan, rear gap 14 ft: 32(25) + 8(18) + 32(18) = 1520 kip-ft.
    Absolute maximum (Barre, closed form of REFERENCES 2.2 with the middle axle critical):
    72(L - s - 18.667)(s + 14)/L - 112 at s = (L - 18.667 - 14)/2, about 1524 kip-ft, as in
    published live-load tables (value recalled from memory, unconfirmed).
    """
    span = 100.0
    truck = Train("HL-93 truck", (Axle(8.0), Axle(32.0, 14.0), Axle(32.0, (14.0, 30.0))))
    ranged = one_case(truck, units="kip-ft")
    midspan = govern(simple_moment(span, span / 2), ranged, kind="moment", section=span / 2).max
    assert close(midspan.value, 32 * 25 + 8 * 18 + 32 * 18)
    assert midspan.ranged_values[0].value == 14.0
    W, centroid = 72.0, (32 * 14 + 32 * 28) / 72
    s = (span - centroid - 14) / 2
    barre = W * (span - s - centroid) * (s + 14) / span - 8 * 14
    section = s + 14
    at_barre = govern(simple_moment(span, section), ranged, kind="moment").max
    assert close(at_barre.value, barre)
    assert barre == pytest.approx(1524, abs=1.0)
