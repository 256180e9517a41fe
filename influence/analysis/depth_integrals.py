"""Exact integrals of x^k / d(x)^n over one piece of a member whose relative depth d is a
polynomial of degree two at most: the bricks of every flexibility integral of a haunched member.

With t the distance from the piece start and T the upper limit:

- d linear, d = c0 (1 + e t): u = 1 + e t turns t^j u^-n into a sum of powers of u, so
  the integral is elementary for any real n (a logarithm where a power is -1);
- d a parabola with its vertex at t_v, d = d_v (1 + q tau^2), tau = t - t_v: an odd power of tau
  becomes the linear case in w = tau^2; an even power, for integer n, follows the reduction
  formula from arctan(sqrt(q) tau) / sqrt(q), lowering n then the power;
- where the piece is short against the distance to the poles of 1/d (|e T| or q tau^2 below
  :data:`SERIES_LIMIT`) the closed forms subtract nearly equal terms, so the binomial series of
  (1 + z)^-n is summed instead (it converges geometrically there);
- everything else (a non-integer n with a parabola, a parabola with real roots off the member) is
  integrated by adaptive quadrature, scipy.integrate.quad, to :data:`QUADRATURE_TOLERANCE`.

Each function returns the values and an error estimate: for the closed forms the stated accuracy
:data:`CLOSED_FORM_ACCURACY` times the sum of the magnitudes of the terms added (measured against
50-digit quadrature in the tests); for quadrature the error estimate quad reports.

Reference: I. S. Gradshteyn and I. M. Ryzhik, *Table of Integrals, Series, and Products*, 7th ed.
(2007), 2.11-2.14 (powers of a linear binomial) and 2.17 (the reduction formula for
(a + b x^2)^-n).

Example (∫_0^2 t (1 + t)^-3 dt = 2/9; a constant depth gives T^(k+1)/(k+1)):
    >>> values, errors = piece_moments((1.0, 1.0, 0.0), 3.0, 0.0, 1, np.array([2.0]))
    >>> round(float(values[0]), 15), float(errors[0]) < 1e-13
    (0.222222222222222, True)
    >>> piece_moments((1.0, 0.0, 0.0), 3.0, 0.0, 2, np.array([3.0]))[0].tolist()
    [9.0]
"""

from __future__ import annotations

import math

import numpy as np

SERIES_LIMIT = 0.8
"""Size [-] of |e T| (linear depth) or q tau^2 (parabolic) below which the binomial series is used
instead of the closed form, whose terms cancel there."""

ALTERNATING_LIMIT = 0.5
"""The same limit where the series alternates (z > 0): there its own terms cancel, as
((1 + z) / (1 - z))^n, and the closed form is the better of the two beyond about 0.5."""

SERIES_TERMS = 300
"""Terms of the binomial series; at |z| < 0.8 the remainder is below 1e-16 of the sum for n <= 6."""

CLOSED_FORM_ACCURACY = 2e-15
"""Relative accuracy [-] of the closed forms and series, as a fraction of the sum of the magnitudes
of the terms they add (the tests measure it against 50-digit quadrature)."""

INPUT_ROUNDING = 2 * float(np.finfo(float).eps)
"""Relative rounding [-] of a derived input (e T, the vertex depth), magnified by the integral's
sensitivity to it."""

QUADRATURE_TOLERANCE = 1e-13
"""Relative tolerance [-] asked of scipy.integrate.quad where no closed form is used."""

QUADRATURE_SUBDIVISIONS = 200
"""Most subintervals quad may use."""


def _binomial_series(exponent: float) -> np.ndarray:
    """Coefficients of (1 + z)^-exponent, lowest power first."""
    series = np.ones(SERIES_TERMS)
    for i in range(1, SERIES_TERMS):
        series[i] = series[i - 1] * (-exponent - (i - 1)) / i
    return series


def linear_moment(power: int, exponent: float, slope: float,
                  upper: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """∫_0^T t^power (1 + slope t)^-exponent dt for each T in ``upper`` (1 + slope T > 0)."""
    T = np.asarray(upper, dtype=float)
    z = slope * T
    values = np.zeros_like(T)
    sizes = np.zeros_like(T)
    small = np.where(z > 0, z < ALTERNATING_LIMIT, -z < SERIES_LIMIT)
    if np.any(small):
        # T^(j+1) sum_i binom(-n, i) z^i / (j + i + 1)
        terms = _binomial_series(exponent)[:, None] * z[small] ** np.arange(SERIES_TERMS)[:, None]
        terms /= (power + 1 + np.arange(SERIES_TERMS))[:, None]
        scale = T[small] ** (power + 1)
        values[small] = scale * terms.sum(axis=0)
        sizes[small] = np.abs(scale) * np.abs(terms).sum(axis=0)
    big = ~small
    if np.any(big):
        zb = z[big]
        log_u = np.log1p(zb)
        total = np.zeros_like(zb)
        size = np.zeros_like(zb)
        for i in range(power + 1):
            rise = i - exponent + 1  # ∫_1^U u^(i - n) du
            piece = log_u if rise == 0 else np.expm1(rise * log_u) / rise
            term = math.comb(power, i) * (-1.0) ** (power - i) * piece
            total += term
            size += np.abs(term)
        # (1/e)^(j+1) written as (T/z)^(j+1) keeps the scale of the answer
        factor = (T[big] / zb) ** (power + 1)
        values[big] = factor * total
        sizes[big] = np.abs(factor) * size
    # the rounding of z = e T itself, magnified where 1 + z is small (a steep taper)
    conditioning = INPUT_ROUNDING * np.abs(values) * exponent * np.abs(z) / (1 + z)
    return values, CLOSED_FORM_ACCURACY * sizes + conditioning


def _even_series(half_power: int, exponent: float, curvature: float,
                 T: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    z = curvature * T * T
    terms = _binomial_series(exponent)[:, None] * z ** np.arange(SERIES_TERMS)[:, None]
    terms /= (2 * half_power + 1 + 2 * np.arange(SERIES_TERMS))[:, None]
    scale = T ** (2 * half_power + 1)
    return scale * terms.sum(axis=0), scale * np.abs(terms).sum(axis=0)


def _even_reduction(half_power: int, exponent: int, curvature: float,
                    T: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """∫_0^T tau^(2 half_power) (1 + q tau^2)^-exponent by the reduction formulas (integer n)."""
    q = curvature
    if exponent <= 0:
        total = np.zeros_like(T)
        size = np.zeros_like(T)
        for l in range(-exponent + 1):
            term = math.comb(-exponent, l) * q**l * T ** (2 * half_power + 2 * l + 1)
            term = term / (2 * half_power + 2 * l + 1)
            total += term
            size += np.abs(term)
        return total, size
    if half_power == 0:
        root = math.sqrt(q)
        value = np.arctan(root * T) / root
        size = np.abs(value)
        u = 1 + q * T * T
        for k in range(1, exponent):
            # Q(0, k + 1) = [T / u^k + (2k - 1) Q(0, k)] / (2k)
            head = T / u**k
            value = (head + (2 * k - 1) * value) / (2 * k)
            size = (np.abs(head) + (2 * k - 1) * size) / (2 * k)
        return value, size
    lower, lower_size = _even_reduction(half_power - 1, exponent - 1, q, T)
    same, same_size = _even_reduction(half_power - 1, exponent, q, T)
    return (lower - same) / q, (lower_size + same_size) / q


def _quadrature(integrand: object, upper: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Cumulative ∫_0^T by quad between consecutive sorted limits (T >= 0)."""
    order = np.argsort(upper)
    values = np.zeros(len(upper))
    errors = np.zeros(len(upper))
    running, running_error, previous = 0.0, 0.0, 0.0
    for index in order:
        limit = float(upper[index])
        if limit > previous:
            from scipy import integrate  # only where no closed form serves

            part, error = integrate.quad(integrand, previous, limit,  # type: ignore[arg-type]
                                         epsabs=0.0, epsrel=QUADRATURE_TOLERANCE,
                                         limit=QUADRATURE_SUBDIVISIONS)
            running += part
            running_error += error
            previous = limit
        values[index] = running
        errors[index] = running_error
    return values, errors


def parabolic_moment(power: int, exponent: float, curvature: float,
                     upper: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """∫_0^tau s^power (1 + q s^2)^-exponent ds for each (signed) tau in ``upper``, q >= 0."""
    tau = np.asarray(upper, dtype=float)
    T = np.abs(tau)
    # the integrand has the parity of s^power, so the integral has the opposite one
    sign = np.where(tau < 0, (-1.0) ** (power + 1), 1.0)
    if power % 2 == 1:
        values, errors = linear_moment(power // 2, exponent, curvature, T * T)
        return sign * values / 2, errors / 2
    half = power // 2
    values = np.zeros_like(T)
    errors = np.zeros_like(T)
    small = curvature * T * T < ALTERNATING_LIMIT
    if np.any(small):
        v, size = _even_series(half, exponent, curvature, T[small])
        values[small], errors[small] = v, CLOSED_FORM_ACCURACY * size
    big = ~small
    if np.any(big):
        if float(exponent).is_integer():
            v, size = _even_reduction(half, int(exponent), curvature, T[big])
            values[big], errors[big] = v, CLOSED_FORM_ACCURACY * size
        else:
            def integrand(s: float) -> float:
                return float(s**power * (1 + curvature * s * s) ** -exponent)
            values[big], errors[big] = _quadrature(integrand, T[big])
    return sign * values, errors


def uses_quadrature(coefficients: tuple[float, float, float], exponent: float) -> bool:
    """Whether a piece's integrals may need quadrature (no closed form for its depth law)."""
    c0, c1, c2 = coefficients
    if c2 == 0:
        return False
    vertex_depth = c0 - c1 * c1 / (4 * c2)
    return not (c2 > 0 and vertex_depth > 0 and float(exponent).is_integer())


def piece_moments(coefficients: tuple[float, float, float], exponent: float, origin: float,
                  power: int, upper: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """∫ x^power d(x - origin)^-exponent dx from ``origin`` to ``origin + T``, T in ``upper``.

    Args:
        coefficients: (c0, c1, c2) of the relative depth d(t) = c0 + c1 t + c2 t^2 [-], t the
            distance from the piece start [length], positive on the piece.
        exponent: n [-], real and positive.
        origin: the piece start x_s, measured from the member start [length], >= 0.
        power: k, a non-negative integer.
        upper: distances T >= 0 from the piece start [length].

    Returns:
        The integrals [length^(k+1)] and an error estimate for each.
    """
    c0, c1, c2 = coefficients
    T = np.asarray(upper, dtype=float)
    values = np.zeros_like(T)
    errors = np.zeros_like(T)
    if c2 != 0 and not (c2 > 0 and c0 - c1 * c1 / (4 * c2) > 0):
        # a parabola with real roots off the piece: no closed form kept for it
        def integrand(t: float) -> float:
            return float((origin + t) ** power * (c0 + c1 * t + c2 * t * t) ** -exponent)
        return _quadrature(integrand, T)
    if c2 == 0:
        # x^k = (origin + t)^k: every binomial term is positive, nothing cancels
        for i in range(power + 1):
            weight = math.comb(power, i) * origin ** (power - i) * c0**-exponent
            v, e = linear_moment(i, exponent, c1 / c0, T)
            values += weight * v
            errors += weight * e
        return values, errors
    vertex = -c1 / (2 * c2)
    vertex_depth = c0 - c1 * c1 / (4 * c2)
    curvature = c2 / vertex_depth
    centre = origin + vertex
    # x^k = (centre + tau)^k with tau = t - vertex
    for i in range(power + 1):
        weight = math.comb(power, i) * centre ** (power - i) * vertex_depth**-exponent
        high, high_error = parabolic_moment(i, exponent, curvature, T - vertex)
        low, low_error = parabolic_moment(i, exponent, curvature, np.array([-vertex]))
        values += weight * (high - low)
        errors += abs(weight) * (high_error + low_error)
    # the vertex depth d_v = c0 - c1^2 / (4 c2) is a difference: its rounding, raised to -n
    condition = exponent * (abs(c0) + c1 * c1 / (4 * c2)) / vertex_depth
    return values, errors + INPUT_ROUNDING * condition * np.abs(values)
