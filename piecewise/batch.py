"""Many piecewise polynomials at once, laid end to end in flat arrays.

A :class:`Batch` holds the pieces of several functions (one per influence line, say) one after
another, each on its own breakpoints, all of one degree. Every operation here is elementwise
over pieces or runs along one function at a time, so a function computed in a batch is bit for
bit the function computed alone: :class:`piecewise.Piecewise` is a batch of one.

Piece j of a function holds on ``breaks[j] <= x <= breaks[j+1]`` with ascending coefficients in
the local coordinate ``u = x - breaks[j]``; where neighbouring pieces disagree at a breakpoint
the function jumps and both one-sided limits are meaningful. Outside its first and last
breakpoints a function is zero. Units are the caller's: breakpoints [length], values whatever
the function measures.

Example (a hat and a bump, together):
    >>> hat = Batch.of_arrays([np.array([0.0, 1.0, 2.0])], [np.array([[0.0, 1.0], [1.0, -1.0]])])
    >>> bump = Batch.of_arrays([np.array([0.0, 2.0])], [np.array([[0.0], [2.0], [-1.0]])])
    >>> both = Batch.joined([hat.raised(2), bump])
    >>> both.count, both.values(np.array([0, 1]), np.array([1.0, 1.0])).tolist()
    (2, [1.0, 1.0])
    >>> [float(a) for a in both.antiderivative()[1]]  # the areas
    [1.0, 1.3333333333333335]
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from functools import cached_property

import numpy as np

from piecewise.polynomial import derivative, horner, powers, taylor_shift, unit_roots
from piecewise.tolerances import NOISE, POSITION, VALUE


@dataclass(frozen=True)
class Batch:
    """Piecewise polynomials end to end.

    Attributes:
        breaks: every function's breakpoints, concatenated [length].
        coeffs: (degree+1, pieces of all functions) ascending local coefficients.
        offsets: (functions+1,) where each function's breakpoints start in ``breaks``; function
            k has ``offsets[k+1] - offsets[k] - 1`` pieces (at least one).
    """

    breaks: np.ndarray
    coeffs: np.ndarray
    offsets: np.ndarray

    @staticmethod
    def of_arrays(breaks: Sequence[np.ndarray], coeffs: Sequence[np.ndarray]) -> Batch:
        """Functions given as (breakpoints (n+1,), coefficients (degree+1, n)) of one degree."""
        sizes = [b.size for b in breaks]
        return Batch(np.concatenate(list(breaks)).astype(float),
                     np.concatenate(list(coeffs), axis=1).astype(float),
                     np.concatenate([[0], np.cumsum(sizes)]).astype(np.int64))

    @staticmethod
    def joined(batches: Sequence[Batch]) -> Batch:
        """Several batches of one degree as one, in order."""
        return Batch(np.concatenate([b.breaks for b in batches]),
                     np.concatenate([b.coeffs for b in batches], axis=1),
                     np.concatenate([[0], np.cumsum(np.concatenate(
                         [np.diff(b.offsets) for b in batches]))]).astype(np.int64))

    # ------------------------------------------------------------------------- layout

    @property
    def count(self) -> int:
        """Number of functions."""
        return int(self.offsets.size - 1)

    @property
    def degree(self) -> int:
        return int(self.coeffs.shape[0] - 1)

    @cached_property
    def piece_offsets(self) -> np.ndarray:
        """(functions+1,) where each function's pieces start in ``coeffs``."""
        return self.offsets - np.arange(self.offsets.size)

    @cached_property
    def piece_owner(self) -> np.ndarray:
        """Which function each piece belongs to."""
        return np.repeat(np.arange(self.count), np.diff(self.piece_offsets))

    @cached_property
    def break_owner(self) -> np.ndarray:
        """Which function each breakpoint belongs to."""
        return np.repeat(np.arange(self.count), np.diff(self.offsets))

    @cached_property
    def starts(self) -> np.ndarray:
        """Left end of every piece [length]."""
        mask = np.ones(self.breaks.size, dtype=bool)
        mask[self.offsets[1:] - 1] = False
        return self.breaks[mask]

    @cached_property
    def ends(self) -> np.ndarray:
        """Right end of every piece [length]."""
        mask = np.ones(self.breaks.size, dtype=bool)
        mask[self.offsets[:-1]] = False
        return self.breaks[mask]

    @property
    def widths(self) -> np.ndarray:
        return self.ends - self.starts

    @property
    def firsts(self) -> np.ndarray:
        """First breakpoint of each function [length]."""
        return self.breaks[self.offsets[:-1]]

    @property
    def lasts(self) -> np.ndarray:
        """Last breakpoint of each function [length]."""
        return self.breaks[self.offsets[1:] - 1]

    @property
    def extents(self) -> np.ndarray:
        """Each function's extent, at least 1 [length]: the unit of position tolerances."""
        return np.maximum(self.lasts - self.firsts, 1.0)

    def function(self, k: int) -> tuple[np.ndarray, np.ndarray]:
        """(breakpoints, coefficients) of function ``k`` alone."""
        first, last = self.piece_offsets[k], self.piece_offsets[k + 1]
        return self.breaks[self.offsets[k] : self.offsets[k + 1]], self.coeffs[:, first:last]

    def subset(self, functions: np.ndarray) -> Batch:
        """The functions with these indices, in that order."""
        functions = np.asarray(functions, dtype=np.int64)
        sizes = np.diff(self.offsets)[functions]
        breaks = np.concatenate([self.breaks[self.offsets[k] : self.offsets[k + 1]]
                                 for k in functions]) if functions.size else np.zeros(0)
        pieces = np.concatenate([np.arange(self.piece_offsets[k], self.piece_offsets[k + 1])
                                 for k in functions]) if functions.size else np.zeros(0, int)
        return Batch(breaks, self.coeffs[:, pieces], np.concatenate([[0], np.cumsum(sizes)]))

    def raised(self, degree: int) -> Batch:
        """The same functions with zero coefficients up to ``degree``."""
        extra = degree - self.degree
        if extra <= 0:
            return self
        return Batch(self.breaks, np.vstack([self.coeffs, np.zeros((extra, self.coeffs.shape[1]))]),
                     self.offsets)

    def with_coeffs(self, coeffs: np.ndarray) -> Batch:
        """Other coefficients on the same breakpoints."""
        return Batch(self.breaks, coeffs, self.offsets)

    # ------------------------------------------------------------------------- values

    @cached_property
    def scales(self) -> np.ndarray:
        """Each function's largest term over its pieces: the size of its values."""
        reach = np.abs(self.coeffs) * powers(self.widths, self.degree + 1)
        largest = reach.max(axis=0) if reach.size else np.zeros(0)
        return _segment_max(largest, self.piece_offsets, self.count)

    def cleaned(self, magnitudes: np.ndarray | None = None) -> Batch:
        """Terms below :data:`~piecewise.tolerances.NOISE` of their function's scale set to 0.

        Args:
            magnitudes: for each function, the size of the terms it was summed from, where the
                caller knows it (a line that cancels to nothing is round-off of those terms, not
                of itself); the larger of it and the function's own scale is used.
        """
        reach = np.abs(self.coeffs) * powers(self.widths, self.degree + 1)
        scales = self.scales if magnitudes is None else np.maximum(self.scales, magnitudes)
        return self.with_coeffs(np.where(reach < NOISE * scales[self.piece_owner], 0.0,
                                         self.coeffs))

    def snapped(self, owner: np.ndarray, x: np.ndarray) -> np.ndarray:
        """Positions within :data:`~piecewise.tolerances.POSITION` of a breakpoint of their own
        function moved onto it (so that one-sided limits are honoured there)."""
        index = self._searched(owner, x, "left")
        sizes = np.diff(self.offsets)[owner]
        base = self.offsets[owner]
        tolerance = POSITION * self.extents[owner]
        result = np.array(x, dtype=float)
        for candidate in (index - 1, index):
            safe = base + np.clip(candidate, 0, sizes - 1)
            near = np.abs(result - self.breaks[safe]) <= tolerance
            result = np.where(near, self.breaks[safe], result)
        return result

    def values(self, owner: np.ndarray, x: np.ndarray, side: str = "right") -> np.ndarray:
        """Function ``owner[i]`` at ``x[i]``; at a jump ``side`` picks the left or right limit;
        zero outside the function's breakpoints. The domain is closed: at the first and last
        breakpoints both sides give the value from inside (a load on the tip of a cantilever
        stands on the structure).

        Positions within the position tolerance of a breakpoint stand on it.
        """
        owner = np.asarray(owner, dtype=np.int64)
        x = self.snapped(owner, np.asarray(x, dtype=float))
        index = self._searched(owner, x, "left" if side == "left" else "right") - 1
        pieces = np.diff(self.piece_offsets)[owner]
        inside = (x >= self.firsts[owner]) & (x <= self.lasts[owner])
        safe = self.piece_offsets[owner] + np.clip(index, 0, pieces - 1)
        local = x - self.starts[safe]
        return np.where(inside, horner(self.coeffs[:, safe], local), 0.0)

    def _searched(self, owner: np.ndarray, x: np.ndarray, side: str) -> np.ndarray:
        """searchsorted(breaks of owner, x, side) within each point's own function."""
        if self.count == 1:
            found = np.searchsorted(self.breaks, x, side=side)  # type: ignore[call-overload]
            return found  # type: ignore[no-any-return]
        # order (function, position) pairs as complex numbers: numpy sorts by real part first
        keys = self.break_owner + 1j * self.breaks
        found = np.searchsorted(keys, owner + 1j * x, side=side)  # type: ignore[call-overload]
        return found - self.offsets[owner]  # type: ignore[no-any-return]

    def limits(self) -> tuple[np.ndarray, np.ndarray]:
        """Left and right limits at every breakpoint (zero beyond each function's ends)."""
        left = np.zeros(self.breaks.size)
        right = np.zeros(self.breaks.size)
        not_first = np.ones(self.breaks.size, dtype=bool)
        not_first[self.offsets[:-1]] = False
        not_last = np.ones(self.breaks.size, dtype=bool)
        not_last[self.offsets[1:] - 1] = False
        left[not_first] = horner(self.coeffs, self.widths)
        right[not_last] = self.coeffs[0]
        return left, right

    @cached_property
    def magnitudes(self) -> np.ndarray:
        """Each function's largest absolute limit at its breakpoints: the unit of value
        tolerances for jumps."""
        left, right = self.limits()
        return np.maximum(_segment_max(np.abs(left), self.offsets, self.count),
                          _segment_max(np.abs(right), self.offsets, self.count))

    def jumps(self) -> list[np.ndarray]:
        """Positions where each function jumps: one-sided limits further apart than
        :data:`~piecewise.tolerances.VALUE` of its largest limit (ends included, where it
        starts or stops at a value other than zero)."""
        left, right = self.limits()
        scale = np.maximum(self.magnitudes, 1e-300)[self.break_owner]
        jumped = np.abs(left - right) > VALUE * scale
        return [self.breaks[a:b][jumped[a:b]] for a, b in zip(self.offsets[:-1],
                                                              self.offsets[1:], strict=True)]

    # ------------------------------------------------------------------------- roots

    def roots(self, coeffs: np.ndarray | None = None) -> tuple[np.ndarray, np.ndarray]:
        """(function, position) of every real root strictly inside a piece, function by
        function in increasing position; of these functions or, given ``coeffs``, of other
        polynomials on the same pieces (a derivative, say)."""
        coeffs = self.coeffs if coeffs is None else coeffs
        widths = self.widths
        column, v = unit_roots(coeffs * powers(widths, coeffs.shape[0]))
        inside = (v > 0.0) & (v < 1.0)
        column, v = column[inside], v[inside]
        return self.piece_owner[column], self.starts[column] + v * widths[column]

    def stationary_points(self) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """(piece, local coordinate, value) of every interior stationary point."""
        if self.degree < 2:
            return np.zeros(0, dtype=int), np.zeros(0), np.zeros(0)
        widths = self.widths
        slope = derivative(self.coeffs)
        column, v = unit_roots(slope * powers(widths, slope.shape[0]))
        inside = (v > 0.0) & (v < 1.0)
        column, v = column[inside], v[inside]
        u = v * widths[column]
        return column, u, horner(self.coeffs[:, column], u)

    def split_at_zeros(self) -> Batch:
        """The same functions with a breakpoint at every zero crossing inside a piece (roots
        within the position tolerance of a breakpoint merge with it). A function without such
        a root keeps its breakpoints and coefficients as they are."""
        owner, roots = self.roots()
        if roots.size == 0:
            return self
        points = np.concatenate([self.breaks, roots])
        owners = np.concatenate([self.break_owner, owner])
        order = np.lexsort((points, owners))
        points, owners = points[order], owners[order]
        keep = np.ones(points.size, dtype=bool)
        keep[1:] = np.diff(points) > POSITION * self.extents[owners[1:]]
        counts = np.bincount(owners, minlength=self.count)
        keep[np.concatenate([[0], np.cumsum(counts)[:-1]])] = True
        points, owners = points[keep], owners[keep]
        new_offsets = np.concatenate([[0], np.cumsum(np.bincount(owners,
                                                                  minlength=self.count))])
        grown = np.diff(new_offsets) != np.diff(self.offsets)
        if not grown.any():
            return self
        # a function with no crossing keeps its own breakpoints and coefficients, as it does alone
        kept = ~grown[owners]
        points[kept] = self.breaks[~grown[self.break_owner]]
        split = Batch(points, np.zeros((0, 0)), new_offsets)
        starts = split.starts
        piece_owner = split.piece_owner
        middles = 0.5 * (starts + split.ends)
        pieces = np.diff(self.offsets)[piece_owner] - 1
        parent = np.clip(self._searched(piece_owner, middles, "right") - 1, 0, pieces - 1)
        first_piece = self.piece_offsets[piece_owner]
        shift = starts - self.breaks[self.offsets[piece_owner] + parent]
        coeffs = taylor_shift(self.coeffs[:, first_piece + parent], shift)
        same = ~grown[piece_owner]
        coeffs[:, same] = self.coeffs[:, ~grown[self.piece_owner]]
        return Batch(points, coeffs, new_offsets)

    def signed_part(self, sign: float) -> Batch:
        """Pieces whose middle has the sign of ``sign`` kept, the others zeroed: the positive
        (or negative) part of functions already split at their zeros."""
        middle = horner(self.coeffs, 0.5 * self.widths)
        keep = (sign * middle > 0)[None, :]
        return self.with_coeffs(np.where(keep, self.coeffs, 0.0))

    # ------------------------------------------------------------------------- integrals

    def antiderivative(self) -> tuple[Batch, np.ndarray]:
        """The integral of each function from its first breakpoint (one degree higher,
        continuous) and each integral's value at the function's last breakpoint."""
        degree = self.degree
        widths = self.widths
        coeffs = np.zeros((degree + 2, self.coeffs.shape[1]))
        coeffs[1:] = self.coeffs / np.arange(1, degree + 2)[:, None]
        increments = horner(coeffs, widths)
        counts = np.diff(self.piece_offsets)
        owner = self.piece_owner
        column = np.arange(owner.size) - self.piece_offsets[owner]
        table = np.zeros((self.count, int(counts.max(initial=1))))
        table[owner, column] = increments
        running = np.cumsum(table, axis=1)  # along each function, as one function's cumsum
        coeffs[0] = np.where(column > 0, running[owner, np.maximum(column - 1, 0)], 0.0)
        integral = self.with_coeffs(coeffs)
        last = self.piece_offsets[1:] - 1
        totals = horner(coeffs[:, last], widths[last])
        return integral, totals

    def areas(self) -> tuple[np.ndarray, np.ndarray]:
        """(positive area, negative area) of each function [value x length], exact."""
        split = self.split_at_zeros()
        positive = split.signed_part(1.0).antiderivative()[1]
        negative = split.signed_part(-1.0).antiderivative()[1]
        return positive, negative

    # ------------------------------------------------------------------------- extremes

    def extremes(self) -> tuple[tuple[np.ndarray, np.ndarray], tuple[np.ndarray, np.ndarray]]:
        """((largest value, where), (smallest value, where)) of each function: piece ends (both
        limits at jumps) and interior stationary points; the first in chainage order of equal
        values."""
        starts, ends = self.starts, self.ends
        piece, u, at_stationary = self.stationary_points()
        xs = np.concatenate([starts, ends, starts[piece] + u])
        values = np.concatenate([self.coeffs[0], horner(self.coeffs, self.widths),
                                 at_stationary])
        owners = np.concatenate([self.piece_owner, self.piece_owner, self.piece_owner[piece]])
        kind = np.concatenate([np.zeros(starts.size), np.ones(ends.size),
                               np.full(piece.size, 2)])
        order = np.lexsort((np.arange(owners.size), kind, owners))
        xs, values, owners = xs[order], values[order], owners[order]
        bounds = np.concatenate([[0], np.cumsum(np.bincount(owners, minlength=self.count))])
        found = []
        for pick in (np.maximum, np.minimum):
            best = pick.reduceat(values, bounds[:-1])
            hits = np.flatnonzero(values == best[owners])
            first = hits[np.unique(owners[hits], return_index=True)[1]]
            found.append((values[first], xs[first]))
        return found[0], found[1]

    def zero_crossings(self) -> list[np.ndarray]:
        """Positions where each function changes sign: roots inside pieces, and breakpoints
        where it jumps across zero or passes through zero from one piece to the next. Values
        below :data:`~piecewise.tolerances.VALUE` of the function's magnitude count as zero."""
        owner, roots = self.roots()
        points = np.concatenate([self.breaks, roots])
        owners = np.concatenate([self.break_owner, owner])
        order = np.lexsort((points, owners))
        points, owners = points[order], owners[order]
        fresh = np.ones(points.size, dtype=bool)
        fresh[1:] = (np.diff(points) > 0) | (np.diff(owners) != 0)
        points, owners = points[fresh], owners[fresh]
        last = np.ones(points.size, dtype=bool)
        last[:-1] = owners[1:] != owners[:-1]
        middles = 0.5 * (points[:-1] + points[1:])[~last[:-1]]
        stretch_owner = owners[:-1][~last[:-1]]
        starts = points[:-1][~last[:-1]]
        values = self.values(stretch_owner, middles)
        scale = VALUE * np.maximum(self.magnitudes, self.scales)[stretch_owner]
        signs = np.where(np.abs(values) <= scale, 0.0, np.sign(values))
        found: list[list[float]] = [[] for _ in range(self.count)]
        previous = np.zeros(self.count)
        for where, sign, k in zip(starts, signs, stretch_owner, strict=True):
            if sign == 0:
                continue
            if previous[k] and sign != previous[k]:
                found[k].append(float(where))
            previous[k] = sign
        return [np.array(f, dtype=float) for f in found]


def _segment_max(values: np.ndarray, offsets: np.ndarray, count: int) -> np.ndarray:
    """Largest of each segment of ``values`` (segments given by ``offsets``; empty -> 0)."""
    if count == 0:
        return np.zeros(0)
    sizes = np.diff(offsets)
    result = np.zeros(count)
    filled = sizes > 0
    if values.size:
        result[filled] = np.maximum.reduceat(values, offsets[:-1][filled])
    return result
