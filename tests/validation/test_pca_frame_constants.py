"""Frame constants of haunched members in the conventions of the published haunch tables.

Reference: Portland Cement Association, "Handbook of Frame Constants: Beam Factors and Moment
Coefficients for Members of Variable Section", Chicago, 1947 (later printings 1958); its tables
for straight and parabolic haunches of constant width are reproduced in J. C. McCormac,
"Design of Reinforced Concrete" (Wiley), appendix tables, and in R. C. Hibbeler, "Structural
Analysis" (Pearson), chapter on the displacement method for nonprismatic members.

What is checked here, and what is not. The conventions (haunch length aL, end depth hc(1 + r),
I proportional to depth^3, stiffness factor k in units of E Ic / L, carry-over factor C_AB the
moment induced at B over the moment at A, fixed-end moments m w L^2 and m P L) are those the
tables print. Their prismatic row (r = 0: k = 4, C = 0.5, m = 1/12, and P L / 8 at midspan,
P a b^2 / L^2 in general) is a textbook closed form checked to 1e-12; symmetry and reciprocity
are facts of every table. No printed table value is asserted: none could be read from a copy
here, and values recalled from memory were not trusted enough to assert (from memory,
unconfirmed). Values printed by the tool for the grid a = 0.1 ... 0.4, r = 0.4 ... 2.0 are
for comparison with a copy by whoever holds one.
"""

from __future__ import annotations

import numpy as np
import pytest

from influence.analysis.frame_constants import frame_constants, point_load_coefficients
from influence.analysis.haunch import Haunch, haunched_section

PRISMATIC_TOLERANCE = 1e-12
SYMMETRY_TOLERANCE = 1e-12
QUADRATURE_AGREEMENT = 1e-12

GRID_A = (0.1, 0.2, 0.3, 0.4)
GRID_R = (0.4, 0.6, 1.0, 1.5, 2.0)
SHAPES = ("straight", "parabolic")


@pytest.mark.parametrize("start", [None, Haunch("straight", 0.0, length_fraction=0.3),
                                   Haunch("parabolic", 0.0, length_fraction=0.4)])
def test_prismatic_row(start: Haunch | None) -> None:
    section = haunched_section(7.5, 3.0, 1.0, start=start, end=start)
    c = frame_constants(section)
    assert c.stiffness_start == pytest.approx(4.0, rel=PRISMATIC_TOLERANCE)
    assert c.stiffness_end == pytest.approx(4.0, rel=PRISMATIC_TOLERANCE)
    assert c.carry_over_start == pytest.approx(0.5, rel=PRISMATIC_TOLERANCE)
    assert c.carry_over_end == pytest.approx(0.5, rel=PRISMATIC_TOLERANCE)
    assert c.uniform_start == pytest.approx(1 / 12, rel=PRISMATIC_TOLERANCE)
    assert c.uniform_end == pytest.approx(1 / 12, rel=PRISMATIC_TOLERANCE)
    b = np.array([0.1, 0.25, 0.5, 0.9])
    m_AB, m_BA = point_load_coefficients(section, b)
    # P a b^2 / L^2 and P a^2 b / L^2, divided by P L
    assert np.allclose(m_AB, b * (1 - b) ** 2, rtol=PRISMATIC_TOLERANCE)
    assert np.allclose(m_BA, b**2 * (1 - b), rtol=PRISMATIC_TOLERANCE)
    assert m_AB[2] == pytest.approx(1 / 8, rel=PRISMATIC_TOLERANCE)


@pytest.mark.parametrize("shape", SHAPES)
@pytest.mark.parametrize("a", GRID_A)
@pytest.mark.parametrize("r", GRID_R)
def test_symmetric_haunches_give_equal_ends(shape: str, a: float, r: float) -> None:
    haunch = Haunch(shape, r, length_fraction=a)
    c = frame_constants(haunched_section(1.0, 1.0, 1.0, start=haunch, end=haunch))
    assert c.stiffness_start == pytest.approx(c.stiffness_end, rel=SYMMETRY_TOLERANCE)
    assert c.carry_over_start == pytest.approx(c.carry_over_end, rel=SYMMETRY_TOLERANCE)
    assert c.uniform_start == pytest.approx(c.uniform_end, rel=SYMMETRY_TOLERANCE)
    # a haunch stiffens the member and draws moment to its ends (as every table shows)
    assert c.stiffness_start > 4.0 and c.carry_over_start > 0.5 and c.uniform_start > 1 / 12


@pytest.mark.parametrize("shape", SHAPES)
@pytest.mark.parametrize("a", GRID_A)
def test_one_haunch_mirrored_swaps_the_ends(shape: str, a: float) -> None:
    haunch = Haunch(shape, 1.0, length_fraction=a)
    at_a = frame_constants(haunched_section(1.0, 1.0, 1.0, start=haunch))
    at_b = frame_constants(haunched_section(1.0, 1.0, 1.0, end=haunch))
    assert at_a.stiffness_start == pytest.approx(at_b.stiffness_end, rel=SYMMETRY_TOLERANCE)
    assert at_a.carry_over_start == pytest.approx(at_b.carry_over_end, rel=SYMMETRY_TOLERANCE)
    assert at_a.uniform_start == pytest.approx(at_b.uniform_end, rel=SYMMETRY_TOLERANCE)
    # Maxwell: k_AB C_AB = k_BA C_BA
    assert at_a.stiffness_start * at_a.carry_over_start == pytest.approx(
        at_a.stiffness_end * at_a.carry_over_end, rel=SYMMETRY_TOLERANCE)


@pytest.mark.parametrize("shape", SHAPES)
def test_stiffness_grows_with_depth_and_length_of_haunch(shape: str) -> None:
    def k(a: float, r: float) -> float:
        haunch = Haunch(shape, r, length_fraction=a)
        return frame_constants(haunched_section(1.0, 1.0, 1.0, start=haunch,
                                                end=haunch)).stiffness_start
    for a in GRID_A:
        values = [k(a, r) for r in GRID_R]
        assert values == sorted(values)
    for r in GRID_R:
        values = [k(a, r) for a in GRID_A]
        assert values == sorted(values)


def test_point_loads_sum_to_the_uniform_load() -> None:
    """The uniform-load coefficient is the integral of the point-load coefficient over b."""
    haunch = Haunch("parabolic", 1.5, length_fraction=0.3)
    section = haunched_section(1.0, 1.0, 1.0, start=haunch)
    nodes, weights = np.polynomial.legendre.leggauss(40)
    # the point-load coefficient has a kink nowhere inside a depth piece: integrate piecewise
    total_AB = total_BA = 0.0
    for lo, hi in ((0.0, 0.3), (0.3, 1.0)):
        b = (lo + hi) / 2 + (hi - lo) / 2 * nodes
        m_AB, m_BA = point_load_coefficients(section, b)
        total_AB += (hi - lo) / 2 * float(weights @ m_AB)
        total_BA += (hi - lo) / 2 * float(weights @ m_BA)
    c = frame_constants(section)
    assert total_AB == pytest.approx(c.uniform_start, rel=QUADRATURE_AGREEMENT)
    assert total_BA == pytest.approx(c.uniform_end, rel=QUADRATURE_AGREEMENT)
