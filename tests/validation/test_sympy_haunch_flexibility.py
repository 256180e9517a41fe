"""Flexibilities of a straight and a parabolic haunch integrated exactly by sympy.

Reference: SymPy's symbolic integration (SymPy Development Team, SymPy 1.12+,
sympy.integrate) of f_AA = ∫(1 - x/L)^2/EI, f_BB = ∫(x/L)^2/EI, f_AB = ∫(x/L)(1 - x/L)/EI
over a member with EI = EIc (h/hc)^3 (the PCA convention, I proportional to depth^3, constant
width): exact rationals, logarithms and arctangents, evaluated to 30 digits. Computed two ways.
"""

from __future__ import annotations

import pytest
from sympy import Rational, Symbol, integrate

from influence.analysis.frame_constants import frame_constants
from influence.analysis.haunch import Haunch, haunched_section

AGREEMENT = 1e-13
x = Symbol("x", real=True)


@pytest.mark.parametrize("shape", ["straight", "parabolic"])
def test_exact_flexibilities(shape: str) -> None:
    L, c, r = Rational(10), Rational(3), Rational(3, 2)
    power = 1 if shape == "straight" else 2
    depth = 1 + r * (1 - x / c) ** power
    weights = {
        "start": (1 - x / L) ** 2,
        "end": (x / L) ** 2,
        "cross": x / L * (1 - x / L),
    }
    exact = {
        name: float((integrate(w / depth**3, (x, 0, c)) + integrate(w, (x, c, L))).evalf(30))
        for name, w in weights.items()
    }
    constants = frame_constants(haunched_section(
        10.0, 1.0, 1.0, start=Haunch(shape, 1.5, length=3.0)))
    assert constants.flexibility_start == pytest.approx(exact["start"], rel=AGREEMENT)
    assert constants.flexibility_end == pytest.approx(exact["end"], rel=AGREEMENT)
    assert constants.flexibility_cross == pytest.approx(exact["cross"], rel=AGREEMENT)
