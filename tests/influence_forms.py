"""Influence lines from textbook closed forms, as scipy PPoly, for the placement tests.

Built here from the formulas themselves (not from the ``influence`` package), so that the
placement code is checked against something outside it. Sign conventions as the README's:
unit load downward, reactions positive upward, sagging moment positive, shear at section c =
sum of the vertical forces left of c.

Sources (listed in full in docs/references.md):
- simple beam R, V, M: statics of a simple beam, as R. C. Hibbeler, *Structural Analysis*,
  ch. 6 (influence lines for statically determinate structures) derives them.
- continuous beams: the three-moment equation (Clapeyron; A. Kassimali, *Structural Analysis*,
  the chapter on the three-moment equation / force method), whose two-equal-span case gives the
  AISC *Steel Construction Manual* beam diagram "continuous beam, two equal spans, concentrated
  load at any point" (case number from memory, unconfirmed; the formulas are re-derived in
  tests/validation/test_two_span_formulas.py: computed).
- truss panel shear: T. G. Hicks, *Handbook of Civil Engineering Calculations*, 2nd ed.,
  McGraw-Hill, 2007, pp. 1.72-1.73.
"""

from __future__ import annotations

from collections.abc import Callable, Sequence

import numpy as np
from numpy.polynomial import Polynomial
from scipy.interpolate import PPoly

X = Polynomial([0.0, 1.0])
"""The load chainage a, as a polynomial to build closed forms with."""


def polynomial_line(breaks: Sequence[float] | np.ndarray, pieces: Sequence[Polynomial]) -> PPoly:
    """A PPoly whose piece j is the polynomial ``pieces[j]`` of the global chainage."""
    degree = max(p.degree() for p in pieces)
    coeffs = np.zeros((degree + 1, len(pieces)))
    for j, p in enumerate(pieces):
        local = p(Polynomial([breaks[j], 1.0])).coef  # p(x_j + u), ascending in u
        coeffs[degree + 1 - local.size :, j] = local[::-1]
    return PPoly(coeffs, np.asarray(breaks, dtype=float))


def simple_reaction(L: float) -> PPoly:
    """R_A of a simple span [0, L]: (L - a)/L."""
    return polynomial_line([0.0, L], [(L - X) / L])


def simple_shear(L: float, c: float) -> PPoly:
    """V at section c of a simple span: -a/L left of c, (L - a)/L right of c."""
    return polynomial_line([0.0, c, L], [-X / L, (L - X) / L])


def simple_moment(L: float, c: float) -> PPoly:
    """M at section c of a simple span: a(L - c)/L for a <= c, c(L - a)/L for a >= c."""
    return polynomial_line([0.0, c, L], [X * (L - c) / L, c * (L - X) / L])


def simple_midspan_deflection(L: float, EI: float) -> PPoly:
    """Midspan deflection (down) of a simple span: a(3L^2 - 4a^2)/(48 EI), mirrored (Hicks)."""
    rising = X * (3 * L**2 - 4 * X**2) / (48 * EI)
    return polynomial_line([0.0, L / 2, L], [rising, rising(L - X)])


def truss_panel_shear(span: float, left: float, right: float) -> PPoly:
    """Panel shear V between panel points ``left`` and ``right`` with floor beams (Hicks)."""
    between = (-left / span) + ((span - right) / span + left / span) * (X - left) / (right - left)
    return polynomial_line([0.0, left, right, span],
                           [-X / span, between, (span - X) / span])


def _support_moments(spans: Sequence[float] | np.ndarray) -> Callable[[int], list[Polynomial]]:
    """Support moments of a continuous beam on pinned supports, for a unit load in span k.

    Three-moment equation, constant EI, zero end moments: for a load at a in span k (b = L - a),
    the load terms are a b (L + b)/L at its left support and a b (L + a)/L at its right support.
    Returns, for span k, the moment at every support as a cubic polynomial in the local a.
    """
    lengths = np.asarray(spans, dtype=float)
    n = lengths.size
    inner = n - 1
    matrix = np.zeros((inner, inner))
    for i in range(inner):
        matrix[i, i] = 2 * (lengths[i] + lengths[i + 1])
        if i > 0:
            matrix[i, i - 1] = lengths[i]
        if i < inner - 1:
            matrix[i, i + 1] = lengths[i + 1]
    inverse = np.linalg.inv(matrix) if inner else np.zeros((0, 0))

    def moments(k: int) -> list[Polynomial]:
        L = lengths[k]
        b = L - X
        rhs = [Polynomial([0.0]) for _ in range(inner)]
        if k - 1 >= 0:  # left support of span k is inner support k - 1
            rhs[k - 1] = -X * b * (L + b) / L
        if k < inner:  # right support of span k is inner support k
            rhs[k] = -X * b * (L + X) / L
        inner_moments = [sum((inverse[i, j] * rhs[j] for j in range(inner)), Polynomial([0.0]))
                         for i in range(inner)]
        return [Polynomial([0.0]), *inner_moments, Polynomial([0.0])]

    return moments


def continuous_moment(spans: Sequence[float], at: float) -> PPoly:
    """Bending moment at chainage ``at`` of a continuous beam on pinned supports (cubic pieces)."""
    lengths = np.asarray(spans, dtype=float)
    supports = np.concatenate([[0.0], np.cumsum(lengths)])
    home = int(np.clip(np.searchsorted(supports, at, side="right") - 1, 0, lengths.size - 1))
    t = (at - supports[home]) / lengths[home]
    moments = _support_moments(lengths)
    breaks, pieces = [], []
    for k, L in enumerate(lengths):
        m = moments(k)
        interpolated = m[home] * (1 - t) + m[home + 1] * t
        local_pieces = []
        if k == home:
            c = at - supports[k]
            local = [X * (L - c) / L, c * (L - X) / L]
            local_pieces = [(supports[k], local[0] + interpolated)]
            if 0 < c < L:
                local_pieces.append((at, local[1] + interpolated))
            elif c == 0:
                local_pieces = [(supports[k], local[1] + interpolated)]
        else:
            local_pieces = [(supports[k], interpolated)]
        for start, poly in local_pieces:
            breaks.append(start)
            pieces.append(poly(Polynomial([-supports[k], 1.0])))  # local a -> global chainage
    breaks.append(supports[-1])
    return polynomial_line(breaks, pieces)


def continuous_reaction(spans: Sequence[float], support: int) -> PPoly:
    """Upward reaction at support index ``support`` (0 = the start) of a continuous beam.

    Each span next to the support gives its statical end reaction plus the couple of its end
    moments: left end (M_right - M_left)/L, right end (M_left - M_right)/L.
    """
    lengths = np.asarray(spans, dtype=float)
    supports = np.concatenate([[0.0], np.cumsum(lengths)])
    moments = _support_moments(lengths)
    pieces = []
    for k in range(lengths.size):
        m = moments(k)
        reaction = Polynomial([0.0])
        j = support - 1  # the span ending at the support
        if j >= 0:
            statics = X / lengths[j] if k == j else Polynomial([0.0])
            reaction = reaction + statics + (m[j] - m[j + 1]) / lengths[j]
        j = support  # the span starting at the support
        if j < lengths.size:
            statics = (lengths[j] - X) / lengths[j] if k == j else Polynomial([0.0])
            reaction = reaction + statics + (m[j + 1] - m[j]) / lengths[j]
        pieces.append(reaction(Polynomial([-supports[k], 1.0])))
    return polynomial_line(supports, pieces)
