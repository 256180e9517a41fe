"""Piecewise polynomials as plain arrays: evaluation, Taylor shifts, integrals, roots in a piece.

A :class:`Pieces` holds increasing breakpoints ``breaks`` (n+1,) and coefficients ``coeffs``
(degree+1, n) in *ascending* powers of the local coordinate ``u = x - breaks[j]`` (scipy's
``PPoly`` stores descending powers; :func:`pieces_from_ppoly` and :meth:`Pieces.ppoly` convert).
Piece j holds on ``breaks[j] <= x <= breaks[j+1]``; where neighbouring pieces disagree at a
breakpoint the function jumps and both one-sided limits are meaningful. Units are those of the
caller: ``x`` in [length], values in whatever the function measures.

Everything here is vectorised over pieces: no loop over points. Shifted sums of many copies and
the preparation of many lines at once live in :mod:`vehicles.ragged` and
:mod:`vehicles.preparation`.

Example:
    >>> from scipy.interpolate import PPoly
    >>> hat = pieces_from_ppoly(PPoly([[1.0, -1.0], [0.0, 1.0]], [0.0, 1.0, 2.0]))
    >>> [float(v) for v in hat.values_at(np.array([0.5, 1.0, 2.0]), side="left")]
    [0.5, 1.0, 0.0]
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
from scipy.interpolate import PPoly

from vehicles.errors import VehicleError

RELATIVE_BREAK_TOLERANCE = 1e-11
"""Breakpoints closer than this fraction of the function's extent are treated as one."""

RELATIVE_DEGREE_TOLERANCE = 1e-11
"""A normalised coefficient below this fraction of the largest one in its piece counts as zero."""


@dataclass(frozen=True)
class Pieces:
    """A piecewise polynomial: breakpoints [length] and ascending local coefficients."""

    breaks: np.ndarray
    coeffs: np.ndarray

    @property
    def widths(self) -> np.ndarray:
        """Length of every piece [length]."""
        return np.diff(self.breaks)

    def values_at(self, x: np.ndarray, *, side: str = "right") -> np.ndarray:
        """One-sided limits at chainages ``x`` [length]; zero outside the breakpoints.

        ``side="left"`` takes the limit approaching from lower chainage, ``"right"`` from higher.
        """
        x = np.asarray(x, dtype=float)
        n = self.coeffs.shape[1]
        index = np.searchsorted(self.breaks, x, side="left" if side == "left" else "right") - 1
        inside = (index >= 0) & (index < n)
        safe = np.clip(index, 0, n - 1)
        values = horner(self.coeffs[:, safe], x - self.breaks[safe])
        return np.where(inside, values, 0.0)

    def ppoly(self) -> PPoly:
        """The same function as a scipy ``PPoly`` (extrapolating its end pieces)."""
        return PPoly(self.coeffs[::-1].copy(), self.breaks.copy())


def pieces_from_ppoly(influence: PPoly) -> Pieces:
    """Check a scipy ``PPoly`` (one curve, increasing finite breakpoints) and convert it."""
    breaks = np.asarray(influence.x, dtype=float)
    coeffs = np.asarray(influence.c, dtype=float)
    if coeffs.ndim != 2 or breaks.ndim != 1 or breaks.size < 2:
        raise VehicleError(
            f"influence function has coefficient shape {coeffs.shape}",
            item="influence",
            fix="give one curve: a PPoly with c of shape (degree+1, pieces)",
        )
    if not (np.all(np.isfinite(breaks)) and np.all(np.isfinite(coeffs))):
        raise VehicleError("influence function holds inf or nan", item="influence",
                           fix="give finite breakpoints and coefficients")
    if np.any(np.diff(breaks) <= 0):
        raise VehicleError("influence breakpoints are not increasing", item="influence",
                           fix="give breakpoints in increasing chainage")
    return Pieces(breaks, coeffs[::-1].copy())


def horner(coeffs: np.ndarray, u: np.ndarray) -> np.ndarray:
    """Evaluate ascending coefficients (degree+1, ...) at local coordinates ``u`` (...)."""
    result = np.zeros(np.broadcast_shapes(coeffs.shape[1:], np.shape(u))) + coeffs[-1]
    for a in coeffs[-2::-1]:
        result = result * u + a
    return result


def taylor_shift(coeffs: np.ndarray, h: np.ndarray) -> np.ndarray:
    """Coefficients of p(u + h) from those of p(u), both ascending (degree+1, ...)."""
    a = np.array(np.broadcast_to(coeffs, np.broadcast_shapes(coeffs.shape, (1, *np.shape(h)))))
    degree = a.shape[0] - 1
    for i in range(degree):
        for j in range(degree - 1, i - 1, -1):
            a[j] = a[j] + h * a[j + 1]
    return a


def unit_roots(b: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Real roots in [0, 1] of the polynomials with ascending coefficients ``b`` (D+1, m).

    Each column is one polynomial in a normalised variable v. Closed forms for degree 1 and 2,
    batched companion-matrix eigenvalues above, polished by two Newton steps on the full
    polynomial.
    A column that vanishes identically has no roots reported.

    Returns:
        (column index, v) of every root found, as two arrays.
    """
    degree_max = b.shape[0] - 1
    scale = np.abs(b).max(axis=0)
    significant = np.abs(b) > RELATIVE_DEGREE_TOLERANCE * scale
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
            found = _quadratic_roots(c)
        else:
            companion = np.zeros((cols.size, d, d))
            companion[:, 1:, :-1] = np.eye(d - 1)
            companion[:, :, -1] = -(c[:d] / c[d]).T
            eig = np.linalg.eigvals(companion)
            near_real = np.abs(eig.imag) <= 1e-7 * (1.0 + np.abs(eig.real))
            found = np.where(near_real, eig.real, np.nan).T
        columns.append(np.broadcast_to(cols, found.shape).ravel())
        roots.append(found.ravel())
    if not columns:
        return np.zeros(0, dtype=int), np.zeros(0)
    column = np.concatenate(columns)
    v = np.concatenate(roots)
    ok = np.isfinite(v) & (v >= -1e-6) & (v <= 1.0 + 1e-6)
    column, v = column[ok], np.clip(v[ok], 0.0, 1.0)
    if degree_max >= 3:  # eigenvalues are less accurate than the closed forms
        v = _polished(b[:, column], v)
    return column, v


def _quadratic_roots(c: np.ndarray) -> np.ndarray:
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


def _polished(b: np.ndarray, v: np.ndarray) -> np.ndarray:
    derivative = b[1:] * np.arange(1, b.shape[0])[:, None]
    for _ in range(2):
        slope = horner(derivative, v)
        with np.errstate(divide="ignore", invalid="ignore"):
            step = np.where(slope != 0, horner(b, v) / slope, 0.0)
        v = np.clip(v - np.where(np.abs(step) < 1e-3, step, 0.0), 0.0, 1.0)
    return v


def antiderivative(pieces: Pieces) -> Pieces:
    """The integral from breaks[0], one degree higher; continuous across breakpoints."""
    degree = pieces.coeffs.shape[0] - 1
    coeffs = np.zeros((degree + 2, pieces.coeffs.shape[1]))
    coeffs[1:] = pieces.coeffs / np.arange(1, degree + 2)[:, None]
    increments = horner(coeffs, pieces.widths)
    coeffs[0] = np.concatenate([[0.0], np.cumsum(increments)[:-1]])
    return Pieces(pieces.breaks, coeffs)
