"""The continuous-beam lines of the test helpers against the published two-span formulas.

Reference: AISC *Steel Construction Manual*, "Beam Diagrams and Formulas", continuous beam of
two equal spans with a concentrated load at any point (case number from memory, unconfirmed).
The formulas below are re-derived by the three-moment equation (A. Kassimali, *Structural
Analysis*, the force method for continuous beams): computed. Load at a in span AB, b = L - a.
"""

from __future__ import annotations

import numpy as np
import pytest

from tests.influence_forms import continuous_moment, continuous_reaction

L = 8.0
A = np.linspace(0.0, L, 17)
B = L - A


def test_reactions_and_support_moment():
    R_A = B * (4 * L**2 - A * (L + A)) / (4 * L**3)
    R_B = A * (2 * L**2 + B * (L + A)) / (2 * L**3)
    assert continuous_reaction([L, L], 0)(A) == pytest.approx(R_A)
    assert continuous_reaction([L, L], 1)(A) == pytest.approx(R_B)
    assert continuous_reaction([L, L], 2)(A) == pytest.approx(-A * B * (L + A) / (4 * L**3))
    assert continuous_moment([L, L], L)(A) == pytest.approx(-A * B * (L + A) / (4 * L**2))


def test_moment_under_the_load():
    for a in A[1:-1]:
        b = L - a
        expected = a * b * (4 * L**2 - a * (L + a)) / (4 * L**3)
        assert continuous_moment([L, L], a)(a) == pytest.approx(expected)
