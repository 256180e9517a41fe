"""Exact extremes of a piecewise polynomial: every piece's ends and interior stationary points.

The *skeleton* of a function lists, in order of chainage, the right limit at the start of each
piece, the interior stationary points of the piece, and the left limit at its end. Between two
consecutive entries the function is monotone, so the largest entry is the exact maximum and the
local maxima of the skeleton are exactly the local maxima of the function (at a jump the larger
one-sided limit is the one a load standing exactly there may take). No sampling step.

Example:
    >>> from vehicles.piecewise import Pieces
    >>> bump = Pieces(np.array([0.0, 2.0]), np.array([[0.0], [2.0], [-1.0]]))  # 2u - u^2
    >>> peaks = distinct_peaks(skeleton(bump), count=3)
    >>> [(float(p.position), float(p.value)) for p in peaks]
    [(1.0, 1.0)]
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from vehicles.piecewise import Pieces
from vehicles.ragged import Ragged, skeletons

RELATIVE_VALUE_TOLERANCE = 1e-9
"""Values closer than this fraction of the largest magnitude count as equal (plateaus, jumps)."""


@dataclass(frozen=True)
class Skeleton:
    """Candidate points of a piecewise polynomial in chainage order.

    Attributes:
        positions: chainage of each entry [length].
        values: the function's value (one-sided limit at breakpoints) at each entry.
        sides: -1 left limit at a piece end, +1 right limit at a piece start, 0 stationary point.
    """

    positions: np.ndarray
    values: np.ndarray
    sides: np.ndarray

    @property
    def tolerance(self) -> float:
        """Absolute tolerance for comparing values."""
        return RELATIVE_VALUE_TOLERANCE * max(float(np.abs(self.values).max()), 1e-300)

    def negated(self) -> Skeleton:
        """The skeleton of -f (its peaks are the troughs of f)."""
        return Skeleton(self.positions, -self.values, self.sides)


@dataclass(frozen=True)
class Peak:
    """One local maximum: chainage [length], value, and the one-sided limit it takes.

    ``side`` is "left" or "right" when the function jumps there and the peak is that one-sided
    limit, else None.
    """

    position: float
    value: float
    side: str | None


def skeleton(pieces: Pieces) -> Skeleton:
    """Every piece's two end limits and interior stationary points, in chainage order."""
    found = skeletons(Ragged.of([pieces]), RELATIVE_VALUE_TOLERANCE)
    return Skeleton(found.positions, found.values, found.sides)


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
    # values equal within the tolerance keep chainage order
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
    return [_peak_at(sk, i) for i in chosen]


def _peak_at(sk: Skeleton, index: int) -> Peak:
    side_code = int(sk.sides[index])
    side = None
    if side_code != 0:
        partner = index + (1 if side_code < 0 else -1)
        at_same_place = 0 <= partner < sk.values.size and (
            sk.positions[partner] == sk.positions[index] and sk.sides[partner] == -side_code
        )
        if at_same_place and abs(sk.values[partner] - sk.values[index]) > sk.tolerance:
            side = "left" if side_code < 0 else "right"
    return Peak(float(sk.positions[index]), float(sk.values[index]), side)
