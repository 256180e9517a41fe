"""Polynomials in ascending coefficients, many at once: evaluation, Taylor shifts, powers and
the real roots inside the unit interval.

Coefficient arrays have shape (degree+1, ...): row k multiplies u^k. Everything is vectorised
over the trailing axes, and every step is elementwise, so a polynomial evaluated in a batch is
bit for bit the polynomial evaluated alone.

Example:
    >>> b = np.array([[-0.25, 0.0], [0.0, -1.0], [1.0, 0.0], [0.0, 1.0]])  # v^2 - 1/4, v^3 - v
    >>> column, v = unit_roots(b)
    >>> [(int(c), round(float(r), 12)) for c, r in zip(column, v)]
    [(0, 0.5), (1, 0.0), (1, 1.0)]
"""

from __future__ import annotations

import numpy as np

from piecewise.tolerances import DEGREE, ROOT_MARGIN


def horner(coeffs: np.ndarray, u: np.ndarray | float) -> np.ndarray:
    """Evaluate ascending coefficients (degree+1, ...) at ``u`` (broadcast against ``...``)."""
    result = np.zeros(np.broadcast_shapes(coeffs.shape[1:], np.shape(u))) + coeffs[-1]
    for a in coeffs[-2::-1]:
        result = result * u + a
    return result


def derivative(coeffs: np.ndarray) -> np.ndarray:
    """Coefficients of the derivative (one row fewer; a constant gives one zero row)."""
    if coeffs.shape[0] == 1:
        return np.zeros_like(coeffs)
    return coeffs[1:] * np.arange(1, coeffs.shape[0]).reshape((-1,) + (1,) * (coeffs.ndim - 1))


def powers(x: np.ndarray, count: int) -> np.ndarray:
    """(count, ...) rows 1, x, x^2, ... by repeated multiplication: correctly rounded steps, so
    the same for an element whatever the length of the array (``**`` need not be)."""
    rows = [np.ones_like(x)]
    for _ in range(count - 1):
        rows.append(rows[-1] * x)
    return np.stack(rows)


def taylor_shift(coeffs: np.ndarray, h: np.ndarray | float) -> np.ndarray:
    """Coefficients of p(u + h) from those of p(u), both ascending (degree+1, ...)."""
    a = np.array(np.broadcast_to(coeffs, np.broadcast_shapes(coeffs.shape,
                                                             (1, *np.shape(h)))))
    degree = a.shape[0] - 1
    for i in range(degree):
        for j in range(degree - 1, i - 1, -1):
            a[j] = a[j] + h * a[j + 1]
    return a


def unit_roots(b: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Real roots in [0, 1] of the polynomials with ascending coefficients ``b`` (D+1, m).

    Each column is one polynomial in a normalised variable v. Degrees 1 to 3 are solved in
    closed form (the cubic by Viete's trigonometric form or Cardano's, as its discriminant
    says), higher degrees by the eigenvalues of the companion matrix; every root is then
    polished by Newton steps on the full polynomial. A column that vanishes identically has no
    roots reported, and a double root that the polynomial only touches may be reported once,
    twice or not at all (it changes no sign).

    Returns:
        (column index, v) of every root found, as two arrays, column by column.
    """
    degree_max = b.shape[0] - 1
    scale = np.abs(b).max(axis=0) if b.size else np.zeros(b.shape[1:])
    significant = np.abs(b) > DEGREE * scale
    degree = np.where(significant.any(axis=0),
                      degree_max - np.argmax(significant[::-1], axis=0), 0)
    degree = np.where(scale > 0, degree, 0)
    columns: list[np.ndarray] = []
    roots: list[np.ndarray] = []
    for d in range(1, degree_max + 1):
        cols = np.flatnonzero(degree == d)
        if cols.size == 0:
            continue
        c = b[: d + 1, cols]
        if d == 1:
            found = (-c[0] / c[1])[None, :]
        elif d == 2:
            found = quadratic_roots(c)
        elif d == 3:
            found = _cubic_roots(c)
        else:
            found = _eigen_roots(c)
        columns.append(np.broadcast_to(cols, found.shape).ravel())
        roots.append(found.ravel())
    if not columns:
        return np.zeros(0, dtype=int), np.zeros(0)
    column = np.concatenate(columns)
    v = np.concatenate(roots)
    ok = np.isfinite(v) & (v >= -ROOT_MARGIN) & (v <= 1.0 + ROOT_MARGIN)
    column, v = column[ok], np.clip(v[ok], 0.0, 1.0)
    if degree_max >= 3:
        v = _polished(b[:, column], v)
    order = np.lexsort((v, column))
    return column[order], v[order]


def quadratic_roots(c: np.ndarray) -> np.ndarray:
    """Both roots of each column of ascending quadratic coefficients (3, m), NaN where complex
    (a slightly negative discriminant counts as a double root); a vanishing leading
    coefficient gives an infinite or NaN first root and the linear root second."""
    a2, a1, a0 = c[2], c[1], c[0]
    disc = a1 * a1 - 4.0 * a2 * a0
    # a slightly negative discriminant is a double root lost to rounding; keep it as a candidate
    real = disc >= -1e-12 * (a1 * a1 + np.abs(4.0 * a2 * a0))
    root = np.sqrt(np.maximum(disc, 0.0))
    q = -0.5 * (a1 + np.where(a1 >= 0, root, -root))
    with np.errstate(divide="ignore", invalid="ignore"):
        first = np.where(q != 0, q / a2, -a1 / (2.0 * a2))
        second = np.where(q != 0, a0 / q, first)
    return np.where(real, np.stack([first, second]), np.nan)


def _cubic_roots(c: np.ndarray) -> np.ndarray:
    """Three candidate roots per column of a cubic (NaN where a root is complex)."""
    with np.errstate(divide="ignore", invalid="ignore", over="ignore"):
        a = c[2] / c[3]
        b = c[1] / c[3]
        d = c[0] / c[3]
        # depressed cubic t^3 + p t + q = 0 with v = t - a/3
        shift = a / 3.0
        p = b - a * shift
        q = 2.0 * shift**3 - b * shift + d
        half_q = q / 2.0
        third_p = p / 3.0
        disc = half_q * half_q + third_p**3
        # one real root (Cardano): t = cbrt(-q/2 + sqrt(disc)) + cbrt(-q/2 - sqrt(disc)),
        # the larger-magnitude cube root taken first and the other from their product -p/3
        root = np.sqrt(np.maximum(disc, 0.0))
        big = np.cbrt(-half_q - np.where(half_q >= 0, root, -root))
        small = np.where(big != 0, -third_p / big, 0.0)
        single = big + small - shift
        # three real roots (Viete): t_k = 2 sqrt(-p/3) cos(phi/3 - 2 pi k / 3)
        radius = np.sqrt(np.maximum(-third_p, 0.0))
        cosine = np.where(radius > 0, -half_q / np.maximum(radius, 1e-300) ** 3, 0.0)
        phi = np.arccos(np.clip(cosine, -1.0, 1.0))
        three = np.stack([2.0 * radius * np.cos((phi - 2.0 * np.pi * k) / 3.0) - shift
                          for k in range(3)])
    trigonometric = disc <= 0
    nan = np.full_like(single, np.nan)
    return np.where(trigonometric, three, np.stack([single, nan, nan]))


def _eigen_roots(c: np.ndarray) -> np.ndarray:
    d = c.shape[0] - 1
    companion = np.zeros((c.shape[1], d, d))
    companion[:, 1:, :-1] = np.eye(d - 1)
    companion[:, :, -1] = -(c[:d] / c[d]).T
    eig = np.linalg.eigvals(companion)
    near_real = np.abs(eig.imag) <= 1e-7 * (1.0 + np.abs(eig.real))
    return np.where(near_real, eig.real, np.nan).T  # type: ignore[no-any-return]


def _polished(b: np.ndarray, v: np.ndarray) -> np.ndarray:
    slope_coeffs = derivative(b)
    for _ in range(3):
        slope = horner(slope_coeffs, v)
        with np.errstate(divide="ignore", invalid="ignore"):
            step = np.where(slope != 0, horner(b, v) / slope, 0.0)
        v = np.clip(v - np.where(np.abs(step) < 1e-3, step, 0.0), 0.0, 1.0)
    return v
