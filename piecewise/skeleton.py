"""Every candidate for an extreme of piecewise polynomials, and their distinct peaks.

The *skeleton* of a function lists, in order of position, the right limit at the start of each
piece, the interior stationary points of the piece, and the left limit at its end. Between two
consecutive entries the function is monotone, so the largest entry is the exact maximum and the
local maxima of the skeleton are exactly the local maxima of the function (at a jump the larger
one-sided limit is the one a load standing exactly there may take). No sampling step.

Example (the bump 2u - u^2 on [0, 2]: one peak of 1 at 1):
    >>> bump = Batch.of_arrays([np.array([0.0, 2.0])], [np.array([[0.0], [2.0], [-1.0]])])
    >>> peaks = distinct_peaks(skeletons(bump).function(0), count=3)
    >>> [(p.position, p.value) for p in peaks]
    [(1.0, 1.0)]
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from piecewise.batch import Batch
from piecewise.polynomial import horner
from piecewise.tolerances import VALUE


@dataclass(frozen=True)
class Skeleton:
    """Candidate points of one piecewise polynomial in position order.

    Attributes:
        positions: position of each entry [length].
        values: the function's value (one-sided limit at breakpoints) at each entry.
        sides: -1 left limit at a piece end, +1 right limit at a piece start, 0 stationary point.
        tolerance: values closer than this are equal (see :data:`~piecewise.tolerances.VALUE`).
    """

    positions: np.ndarray
    values: np.ndarray
    sides: np.ndarray
    tolerance: float

    def negated(self) -> Skeleton:
        """The skeleton of -f (its peaks are the troughs of f)."""
        return Skeleton(self.positions, -self.values, self.sides, self.tolerance)

    def shifted(self, amount: float) -> Skeleton:
        """The skeleton of f + amount (a constant moves no candidate)."""
        return Skeleton(self.positions, self.values + amount, self.sides, self.tolerance)


@dataclass(frozen=True)
class Skeletons:
    """The skeletons of a batch, end to end.

    Attributes:
        positions, values, sides: as in :class:`Skeleton`, every function's entries in turn.
        offsets: (functions+1,) where each function's entries start.
        tolerances: each function's value tolerance.
    """

    positions: np.ndarray
    values: np.ndarray
    sides: np.ndarray
    offsets: np.ndarray
    tolerances: np.ndarray

    @property
    def count(self) -> int:
        return int(self.offsets.size - 1)

    @property
    def owner(self) -> np.ndarray:
        """Which function each entry belongs to."""
        return np.repeat(np.arange(self.count), np.diff(self.offsets))

    def highest(self) -> np.ndarray:
        """Largest value of each function."""
        return np.maximum.reduceat(self.values, self.offsets[:-1])

    def lowest(self) -> np.ndarray:
        """Smallest value of each function."""
        return np.minimum.reduceat(self.values, self.offsets[:-1])

    def function(self, k: int, shift: float = 0.0) -> Skeleton:
        """Function ``k``'s skeleton alone (plus a constant ``shift``)."""
        a, b = self.offsets[k], self.offsets[k + 1]
        return Skeleton(self.positions[a:b], self.values[a:b] + shift, self.sides[a:b],
                        float(self.tolerances[k]))


def skeletons(functions: Batch) -> Skeletons:
    """Every piece's two end limits and interior stationary points, function by function."""
    coeffs = functions.coeffs
    starts, ends = functions.starts, functions.ends
    widths = ends - starts
    count = coeffs.shape[1]
    column, u, at_stationary = functions.stationary_points()
    piece = np.concatenate([np.arange(count), column, np.arange(count)])
    order_in_piece = np.concatenate([np.full(count, -1.0), u / np.maximum(widths[column], 1e-300),
                                     np.full(count, 2.0)])
    positions = np.concatenate([starts, starts[column] + u, ends])
    values = np.concatenate([coeffs[0], at_stationary, horner(coeffs, widths)])
    sides = np.concatenate([np.ones(count, int), np.zeros(column.size, int), -np.ones(count, int)])
    order = np.lexsort((order_in_piece, piece))
    owner = functions.piece_owner[piece]
    offsets = np.concatenate([[0], np.cumsum(np.bincount(owner, minlength=functions.count))])
    values = values[order]
    largest = np.maximum.reduceat(np.abs(values), offsets[:-1]) if values.size else np.zeros(0)
    return Skeletons(positions[order], values, sides[order], offsets,
                     VALUE * np.maximum(largest, 1e-300))


@dataclass(frozen=True)
class Peak:
    """One local maximum: position [length], value, and the one-sided limit it takes.

    ``side`` is "left" or "right" when the function jumps there and the peak is that one-sided
    limit, else None.
    """

    position: float
    value: float
    side: str | None


def peak_indices(sk: Skeleton) -> np.ndarray:
    """Indices of the skeleton's local maxima, one per plateau (its first entry)."""
    values = sk.values
    tol = sk.tolerance
    # collapse runs of equal values so that a plateau is judged by its neighbours
    change = np.concatenate([[True], np.abs(np.diff(values)) > tol])
    first = np.flatnonzero(change)
    run_values = values[first]
    before = np.concatenate([[-np.inf], run_values[:-1]])
    after = np.concatenate([run_values[1:], [-np.inf]])
    return first[(run_values >= before) & (run_values >= after)]


def distinct_peaks(sk: Skeleton, count: int) -> list[Peak]:
    """Up to ``count`` local maxima, largest first, each on a separate peak.

    Two local maxima belong to one peak unless the function dips below the lower of them (by more
    than the tolerance) somewhere between them; the higher one then stands for both.
    """
    candidates = peak_indices(sk)
    tol = sk.tolerance
    # values equal within the tolerance keep position order
    candidates = candidates[np.argsort(-np.round(sk.values[candidates] / tol), kind="stable")]
    chosen: list[int] = []
    for index in candidates:
        if len(chosen) == count:
            break
        level = sk.values[index] - tol
        separate = True
        for other in chosen:
            low, high = sorted((index, other))
            if sk.values[low : high + 1].min() >= level:
                separate = False
                break
        if separate:
            chosen.append(int(index))
    return [peak_at(sk, i) for i in chosen]


def peak_at(sk: Skeleton, index: int) -> Peak:
    """The entry ``index`` as a peak, with the side it takes where the function jumps."""
    return Peak(float(sk.positions[index]), float(sk.values[index]), side_at(sk, index))


def side_at(sk: Skeleton, index: int) -> str | None:
    """"left" or "right" where entry ``index`` is one of two limits that differ, else None."""
    side_code = int(sk.sides[index])
    if side_code == 0:
        return None
    partner = index + (1 if side_code < 0 else -1)
    at_same_place = 0 <= partner < sk.values.size and (
        sk.positions[partner] == sk.positions[index] and sk.sides[partner] == -side_code)
    if at_same_place and abs(sk.values[partner] - sk.values[index]) > sk.tolerance:
        return "left" if side_code < 0 else "right"
    return None
