"""Stepped girders (EI changing inside and between spans) against the force method.

Reference: the unit-load (virtual work) form of the force method, e.g. R. C. Hibbeler,
"Structural Analysis", ch. 10 (analysis of statically indeterminate structures by the force
method): with the interior support reaction X as the redundant of a two-span girder,
    delta_10 + X delta_11 = 0,   delta_ij = integral of m_i m_j / EI dx,
where m_0 is the simple-span moment of the unit load and m_1 that of a unit upward force at the
interior support. The integrals are evaluated here by Gauss-Legendre quadrature on every interval
where EI and both moment diagrams are smooth (exact: the integrands are quadratics).
SymPy's beam module is not used for stepped EI: its reaction solver has been seen to ignore
varying stiffness in indeterminate beams.
"""

from __future__ import annotations

import numpy as np
import pytest

from tests.beams import beam_line, close

GAUSS_POINTS, GAUSS_WEIGHTS = np.polynomial.legendre.leggauss(4)


def simple_moment(x: np.ndarray, at: float, length: float, force: float) -> np.ndarray:
    """Sagging moment of a simple span carrying an upward ``force`` at ``at``."""
    return -force * np.where(x <= at, x * (length - at), at * (length - x)) / length


def integral(f, cuts: list[float]) -> float:  # type: ignore[no-untyped-def]
    total = 0.0
    for lo, hi in zip(cuts, cuts[1:], strict=False):
        middle, half = (lo + hi) / 2, (hi - lo) / 2
        total += half * float(np.sum(GAUSS_WEIGHTS * f(middle + half * GAUSS_POINTS)))
    return total


@pytest.mark.parametrize("load_at", [3.0, 11.0, 16.0, 27.5])
def test_interior_reaction_of_a_stepped_two_span_girder(load_at: float) -> None:
    spans = [16.0, 20.0]
    length = sum(spans)
    # span 1: 2e5 for 0..10 then 5e5; span 2: 5e5 for 0..6 then 2.5e5
    EI = [[[0.0, 10.0, 2.0e5], [10.0, 16.0, 5.0e5]], [[0.0, 6.0, 5.0e5], [6.0, 20.0, 2.5e5]]]
    steps = [0.0, 10.0, 16.0, 22.0, length]
    stiffness = [2.0e5, 5.0e5, 5.0e5, 2.5e5]

    def flexibility(x: np.ndarray) -> np.ndarray:
        return 1.0 / np.array(stiffness)[np.searchsorted(steps, x, side="right") - 1]

    cuts = sorted({*steps, load_at})
    d10 = integral(lambda x: simple_moment(x, spans[0], length, 1.0)
                   * simple_moment(x, load_at, length, -1.0) * flexibility(x), cuts)
    d11 = integral(lambda x: simple_moment(x, spans[0], length, 1.0) ** 2 * flexibility(x), cuts)
    expected = -d10 / d11

    line = beam_line(spans, ["pinned", "roller", "roller"], "reaction", "S2", EI=EI)
    assert close(line.values([load_at]), [expected])
    if load_at == spans[0]:
        return  # on the support every girder gives 1
    # the uniform girder gives a different answer: the steps matter
    uniform = beam_line(spans, ["pinned", "roller", "roller"], "reaction", "S2", EI=3.0e5)
    assert abs(float(uniform.values([load_at])[0]) - expected) > 1e-4
