"""Singularity (Macaulay) terms, written as polynomials in the load position.

A unit load at ``a`` inside a member is an impulse, a Dirac delta of area 1. Integrated once it is a
Heaviside step H(x - a), then Macaulay brackets <x - a>^n / n! for n = 1, 2, 3: the shear, moment,
slope and deflection terms of the load. For an influence line the section ``x`` is fixed and the
load position ``a`` varies, so each term is a polynomial in ``a`` wherever the load lies on one side
of the section, and zero on the other:

    <x - a>^n / n! = (x - a)^n / n!   for a < x   (the load is behind the section)
                   = 0                for a > x

Polynomials in ``a`` are coefficient arrays of length :data:`TERMS`, lowest power first (numpy's
``polynomial`` convention); cubic is the highest degree a prismatic member produces.

Reference: W. H. Macaulay, "Note on the deflection of beams", Messenger of Mathematics 48 (1919)
129-130.

Example:
    >>> bracket(5.0, 2).tolist()          # (5 - a)^2 / 2
    [12.5, -5.0, 0.5, 0.0]
    >>> round(float(evaluate(bracket(5.0, 3), 2.0)), 12)   # (5 - 2)^3 / 6
    4.5
"""

from __future__ import annotations

import math

import numpy as np
from numpy.polynomial import polynomial as P

from piecewise.polynomial import taylor_shift

TERMS = 4
"""Coefficients kept per polynomial in the load position (degree 3 at most)."""


def bracket(x: float, power: int) -> np.ndarray:
    """Coefficients in ``a`` of <x - a>^power / power! on the side a < x.

    Args:
        x: section position along the member [length].
        power: 0 for the Heaviside step, 1 to 3 for the Macaulay ramps.

    Returns:
        Array of :data:`TERMS` coefficients, lowest power of ``a`` first.
    """
    if not 0 <= power < TERMS:
        raise ValueError(f"bracket power {power} outside 0..{TERMS - 1}")
    coefficients = P.polypow([x, -1.0], power) / math.factorial(power)
    return pad(coefficients)


def pad(coefficients: np.ndarray) -> np.ndarray:
    """Zero-pad a coefficient array to :data:`TERMS` entries."""
    out = np.zeros(TERMS)
    out[: len(coefficients)] = coefficients
    return out


def evaluate(coefficients: np.ndarray, a: float | np.ndarray) -> np.ndarray:
    """Value of a polynomial in ``a`` (lowest power first)."""
    return np.asarray(P.polyval(a, coefficients))


def substitute(coefficients: np.ndarray, offset: float, scale: float) -> np.ndarray:
    """Coefficients in ``t`` of p(offset + scale * t): re-express a polynomial in a new variable.

    Used to turn a polynomial in the member's load position into one in path chainage measured
    from a piece's start (scale is +1 or -1 as the path runs along or against the member).

    Example:
        >>> substitute(np.array([0.0, 0.0, 1.0, 0.0]), 1.0, -1.0).tolist()   # (1 - t)^2
        [1.0, -2.0, 1.0, 0.0]
    """
    shifted = taylor_shift(pad(np.asarray(coefficients, dtype=float)), offset)
    return shifted * scale ** np.arange(TERMS) + 0.0  # type: ignore[no-any-return]
