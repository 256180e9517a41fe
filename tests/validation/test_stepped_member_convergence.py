"""A stepped member (many prismatic pieces) converges to the exact haunched member.

Reference: the composite midpoint rule integrates a twice-differentiable function with error
O(h^2) (e.g. R. L. Burden and J. D. Faires, "Numerical Analysis", 9th ed., 2011, sec. 4.4,
composite midpoint rule; section number from memory, unconfirmed). A stepped member whose
flexibility 1/EI on each step is the mid-step value is that rule applied to 1/EI against the
exact polynomial weights (1 - x/L)^2, (x/L)^2, x/L (1 - x/L); with the step's average 1/EI
instead the error is also O(h^2). Steps are aligned with the haunch ends, where 1/EI has a kink.
The stepped flexibilities are summed here in closed form, independently of the module.
"""

from __future__ import annotations

import math

import numpy as np
import pytest

from influence.analysis.compliance import Compliance
from influence.analysis.frame_constants import frame_constants
from influence.analysis.haunch import Haunch, VariableSection, haunched_section

EXPECTED_ORDER = 2.0
ORDER_TOLERANCE = 0.1
"""Allowed departure [-] of the measured order from 2."""

STEP_COUNTS = (10, 20, 40, 80, 160)


def stepped_flexibilities(section: VariableSection, steps: int,
                          average: bool) -> np.ndarray:
    L = section.length
    cuts = np.linspace(0.0, L, steps + 1)
    lo, hi = cuts[:-1], cuts[1:]
    if average:
        F0 = Compliance(section).bending(0, cuts)
        weight = np.diff(F0) / (hi - lo)
    else:
        weight = 1.0 / section.EI((lo + hi) / 2)
    # exact integrals of the polynomial weights over each step, in xi = x / L
    a, b = lo / L, hi / L
    start = ((1 - a) ** 3 - (1 - b) ** 3) / 3 * L
    end = (b**3 - a**3) / 3 * L
    cross = ((b**2 - a**2) / 2 - (b**3 - a**3) / 3) * L
    return np.array([weight @ start, weight @ end, weight @ cross])


@pytest.mark.parametrize("average", [False, True])
@pytest.mark.parametrize("shape", ["straight", "parabolic"])
def test_order_of_convergence(shape: str, average: bool) -> None:
    section = haunched_section(10.0, 1.0, 1.0, start=Haunch(shape, 1.5, length_fraction=0.2),
                               end=Haunch(shape, 0.8, length_fraction=0.3))
    c = frame_constants(section)
    exact = np.array([c.flexibility_start, c.flexibility_end, c.flexibility_cross])
    errors = [np.abs(stepped_flexibilities(section, m, average) - exact).max()
              for m in STEP_COUNTS]
    orders = [math.log2(errors[i] / errors[i + 1]) for i in range(len(errors) - 1)]
    assert all(e_next < e for e, e_next in zip(errors, errors[1:], strict=False))
    assert all(abs(order - EXPECTED_ORDER) < ORDER_TOLERANCE for order in orders[-2:])
    assert errors[-1] < 1e-3 * np.abs(exact).max()
