"""The member law's stiffness and fixed-end forces against the classical tables.

Sources:
- Beam element stiffness 12EI/L^3, 6EI/L^2, 4EI/L, 2EI/L and EA/L: W. McGuire, R. H. Gallagher
  and R. D. Ziemian, "Matrix Structural Analysis", 2nd ed. (2000), eq. 4.34; with a moment release
  at one end 3EI/L^3, 3EI/L^2, 3EI/L (same text, section 7.2, condensation).
- Fixed-end forces of a point load P at a (b = L - a): fixed both ends M_A = Pab^2/L^2,
  M_B = Pa^2b/L^2, R_A = Pb^2(3a + b)/L^3; fixed at A, pinned at B M_A = Pb(L^2 - b^2)/(2L^2),
  R_B = Pa^2(3L - a)/(2L^3). AISC Manual "Beam diagrams and formulas" (case numbers recalled from
  memory; the formulas are the textbook ones, e.g. Hibbeler, "Structural Analysis", inside cover).
"""

from __future__ import annotations

import numpy as np
import pytest

from influence.analysis.element import MemberLaw
from influence.analysis.singularity import evaluate

L, EA, EI = 6.0, 3.0e6, 2.5e4
TOLERANCE = 1e-12


def test_stiffness_of_a_continuous_member() -> None:
    k = MemberLaw(L, EA, EI).stiffness
    expected = np.array([
        [EA / L, 0, 0, -EA / L, 0, 0],
        [0, 12 * EI / L**3, 6 * EI / L**2, 0, -12 * EI / L**3, 6 * EI / L**2],
        [0, 6 * EI / L**2, 4 * EI / L, 0, -6 * EI / L**2, 2 * EI / L],
        [-EA / L, 0, 0, EA / L, 0, 0],
        [0, -12 * EI / L**3, -6 * EI / L**2, 0, 12 * EI / L**3, -6 * EI / L**2],
        [0, 6 * EI / L**2, 2 * EI / L, 0, -6 * EI / L**2, 4 * EI / L],
    ])
    assert np.allclose(k, expected, rtol=TOLERANCE, atol=TOLERANCE * EA)


def test_stiffness_with_a_released_end() -> None:
    k = MemberLaw(L, EA, EI, release_end=True).stiffness
    assert k[1, 1] == pytest.approx(3 * EI / L**3, rel=TOLERANCE)
    assert k[1, 2] == pytest.approx(3 * EI / L**2, rel=TOLERANCE)
    assert k[2, 2] == pytest.approx(3 * EI / L, rel=TOLERANCE)
    assert np.allclose(k[5], 0.0) and np.allclose(k[:, 5], 0.0)


@pytest.mark.parametrize("a", [0.0, 1.5, 3.0, 4.2, 6.0])
def test_fixed_end_forces_of_a_point_load(a: float) -> None:
    b = L - a
    forces = MemberLaw(L, EA, EI).end_forces_from_load(0.0, -1.0)  # unit load downward
    values = [float(evaluate(row, a)) for row in forces]
    # the nodes push up and resist with counter-clockwise (start) and clockwise (end) moments
    assert values[1] == pytest.approx(b**2 * (3 * a + b) / L**3, abs=TOLERANCE)
    assert values[2] == pytest.approx(a * b**2 / L**2, abs=TOLERANCE)
    assert values[4] == pytest.approx(a**2 * (a + 3 * b) / L**3, abs=TOLERANCE)
    assert values[5] == pytest.approx(-(a**2) * b / L**2, abs=TOLERANCE)


@pytest.mark.parametrize("a", [1.0, 2.5, 5.0])
def test_fixed_end_forces_with_the_far_end_pinned(a: float) -> None:
    b = L - a
    forces = MemberLaw(L, EA, EI, release_end=True).end_forces_from_load(0.0, -1.0)
    values = [float(evaluate(row, a)) for row in forces]
    assert values[2] == pytest.approx(b * (L**2 - b**2) / (2 * L**2), abs=TOLERANCE)
    assert values[4] == pytest.approx(a**2 * (3 * L - a) / (2 * L**3), abs=TOLERANCE)
    assert values[5] == pytest.approx(0.0, abs=TOLERANCE)


def test_axial_load_splits_by_lever_arms() -> None:
    # a load along the axis of a bar fixed at both ends goes b/L to the start and a/L to the end
    forces = MemberLaw(L, EA, EI).end_forces_from_load(-1.0, 0.0)
    a = 2.0
    assert float(evaluate(forces[0], a)) == pytest.approx((L - a) / L, abs=TOLERANCE)
    assert float(evaluate(forces[3], a)) == pytest.approx(a / L, abs=TOLERANCE)
