"""Closed-form flexibility integrals of haunched members against scipy's adaptive quadrature.

Reference: scipy.integrate.quad (QUADPACK's qags: R. Piessens, E. de Doncker-Kapenga,
C. W. Ueberhuber and D. K. Kahaner, "QUADPACK", Springer, 1983), applied directly to
f_AA = ∫(1 - x/L)^2/EI, f_BB = ∫(x/L)^2/EI, f_AB = ∫(x/L)(1 - x/L)/EI and to the fixed-end
moments by the flexibility method (the standard unit-load formulas, e.g. W. Weaver Jr. and
J. M. Gere, "Matrix Analysis of Framed Structures", 3rd ed., 1990, sec. 6.3). Computed two ways.
"""

from __future__ import annotations

import numpy as np
import pytest
from scipy import integrate

from influence.analysis.frame_constants import frame_constants, point_load_coefficients
from influence.analysis.haunch import Haunch, VariableSection, haunched_section, tapered_section

AGREEMENT = 1e-12
"""Relative agreement [-] of closed forms and quadrature (quad asked for 2e-14)."""

POINT_AGREEMENT = 1e-11
"""The same for point loads, whose simple-span moment has a kink quad meets inside a piece."""

STATED_ERROR = 1e-12
"""Largest relative error [-] the frame constants may state for these members."""


def quad(f, section: VariableSection) -> float:  # type: ignore[no-untyped-def]
    total = 0.0
    cuts = section.profile.breakpoints
    for lo, hi in zip(cuts[:-1], cuts[1:], strict=True):
        value, _ = integrate.quad(lambda x: f(x) / float(section.EI(x)), lo, hi,
                                  epsabs=0.0, epsrel=2e-14, limit=200)
        total += value
    return total


CASES = [
    haunched_section(10.0, 2.0, 1.0, start=Haunch("straight", 1.0, length_fraction=0.3)),
    haunched_section(10.0, 2.0, 1.0, start=Haunch("parabolic", 2.0, length_fraction=0.2),
                     end=Haunch("straight", 0.4, length_fraction=0.1)),
    haunched_section(8.0, 1.0, 1.0, start=Haunch("parabolic", 1.5, length_fraction=0.4),
                     end=Haunch("parabolic", 0.6, length_fraction=0.4), inertia_exponent=2.0),
    haunched_section(8.0, 1.0, 1.0, end=Haunch("parabolic", 1.0, length_fraction=0.3),
                     inertia_exponent=2.6),
    haunched_section(8.0, 1.0, 1.0, start=Haunch("straight", 1e-7, length_fraction=0.3)),
    tapered_section(6.0, 1.0, 1.0, 2.5),
    tapered_section(6.0, 1.0, 1.0, 0.3, inertia_exponent=4.0),
]


@pytest.mark.parametrize("section", CASES)
def test_flexibilities(section: VariableSection) -> None:
    L = section.length
    c = frame_constants(section)
    assert c.flexibility_start == pytest.approx(quad(lambda x: (1 - x / L) ** 2, section),
                                                rel=AGREEMENT)
    assert c.flexibility_end == pytest.approx(quad(lambda x: (x / L) ** 2, section),
                                              rel=AGREEMENT)
    assert c.flexibility_cross == pytest.approx(quad(lambda x: x / L * (1 - x / L), section),
                                                rel=AGREEMENT)
    assert c.relative_error < STATED_ERROR


@pytest.mark.parametrize("section", CASES)
def test_fixed_end_moments(section: VariableSection) -> None:
    L = section.length
    c = frame_constants(section)
    flex = np.array([[c.flexibility_start, c.flexibility_cross],
                     [c.flexibility_cross, c.flexibility_end]])

    def moments(M0) -> np.ndarray:  # type: ignore[no-untyped-def]
        rotations = [quad(lambda x: M0(x) * (1 - x / L), section),
                     quad(lambda x: M0(x) * x / L, section)]
        return np.linalg.solve(flex, rotations)

    uniform = moments(lambda x: x * (L - x) / 2) / L**2
    assert uniform == pytest.approx([c.uniform_start, c.uniform_end], rel=AGREEMENT)
    b = 0.35
    point = moments(lambda x: (1 - b) * x if x <= b * L else b * (L - x)) / L
    m_AB, m_BA = point_load_coefficients(section, [b])
    assert point == pytest.approx([m_AB[0], m_BA[0]], rel=POINT_AGREEMENT)


def test_method_is_stated() -> None:
    assert frame_constants(CASES[0]).method == "closed form"
    assert frame_constants(CASES[3]).method == "quadrature"
