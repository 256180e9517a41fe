"""Closed forms and series of ∫ x^k / d(x)^n against 40-digit quadrature (mpmath), and their
error estimates honest: every actual error within the stated estimate.

Reference: mpmath's tanh-sinh quadrature (F. Johansson et al., mpmath 1.3) at 40 digits.
"""

from __future__ import annotations

import mpmath
import numpy as np
import pytest

from influence.analysis.depth_integrals import piece_moments

PIECES = [
    (1.4, -0.4 / 3, 0.0), (1.0, 0.4 / 3, 0.0), (11.0, -10 / 3, 0.0), (1.0, 5.0, 0.0),
    (1.0, 1e-9, 0.0), (2.0, -2 / 3, 1 / 9), (1.0, 0.0, 1 / 9), (1.0, 0.0, 1e-8),
    (1.0, 0.0, 3.0), (5.0, -8 / 3, 4 / 9), (1.5, -1 / 3, 1 / 18), (1.0, -0.1, -0.05),
]
"""(c0, c1, c2) of depth laws on a piece of length 3: tapers both ways, steep and nearly flat,
start and end parabolic haunches, a parabola with real roots off the piece (quadrature)."""


@pytest.mark.parametrize("coefficients", PIECES)
@pytest.mark.parametrize("exponent", [1.0, 2.0, 3.0, 2.5, 6.0])
def test_against_high_precision(coefficients: tuple[float, float, float],
                                exponent: float) -> None:
    mpmath.mp.dps = 40
    c0, c1, c2 = coefficients
    T = np.array([0.0, 0.1, 1.0, 2.9, 3.0])
    for power in (0, 1, 2, 3, 6):
        for origin in (0.0, 7.0):
            values, errors = piece_moments(coefficients, exponent, origin, power, T)
            for upper, value, error in zip(T, values, errors, strict=True):
                exact = mpmath.quad(lambda t, o=origin, k=power: (o + t) ** k
                                    * (c0 + c1 * t + c2 * t * t) ** (-exponent), [0, upper])
                assert abs(value - float(exact)) <= max(error, 1e-300)
