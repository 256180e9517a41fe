"""Exact sums of shifted copies of piecewise polynomials, for many functions at once.

The effect of a load train on an influence line is a sum of shifted, weighted copies of the
line (one per axle) and of its integrals (patches and lanes). :func:`shifted_sums` forms such
sums exactly, on the union of the shifted breakpoints, for a whole batch of functions in a few
numpy passes. The terms are added one after another in a fixed order, so a function summed in
a batch rounds exactly as it does alone.

Example (two unit loads 2 m apart on the hat of a 4 m span's midspan reaction line):
    >>> hat = Tables.of([np.array([0.0, 2.0, 4.0])],
    ...                 [np.array([[[0.0, 0.0, 1.0, 0.0], [0.0, 0.5, -0.5, 0.0]]])])
    >>> total = shifted_sums(hat, np.array([0, 0]), np.array([[0.0, 2.0]]),
    ...                      np.array([1.0, 1.0]), np.array([0.0]))
    >>> total.values(np.zeros(3, dtype=int), np.array([0.0, 1.0, 2.0])).tolist()
    [1.0, 1.0, 1.0]
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from functools import cached_property

import numpy as np

from piecewise.batch import Batch
from piecewise.tolerances import POSITION


@dataclass(frozen=True)
class Tables:
    """Functions with several rows on shared breakpoints, each row extended by a constant
    before its first breakpoint and another after its last, end to end.

    Attributes:
        breaks: every function's breakpoints, concatenated [length].
        offsets: (functions+1,) where each function's breakpoints start.
        tables: (rows, degree+1, sum over functions of pieces+2): for each function and row,
            a column of the constant before it (its coefficient 0 holds the value), one
            column per piece (ascending local coefficients), and a column of the constant
            after it.
        pads: constant stretch added before and after each sum [length].
    """

    breaks: np.ndarray
    offsets: np.ndarray
    tables: np.ndarray
    pads: np.ndarray

    @staticmethod
    def of(breaks: Sequence[np.ndarray], tables: Sequence[np.ndarray]) -> Tables:
        """Batch functions given by their breakpoints and (rows, degree+1, n+2) tables."""
        offsets = np.concatenate([[0], np.cumsum([b.size for b in breaks])])
        pads = np.array([max(float(b[-1] - b[0]), 1.0) for b in breaks])
        return Tables(np.concatenate(list(breaks)), offsets,
                      np.concatenate(list(tables), axis=2), pads)

    @staticmethod
    def of_batches(rows: Sequence[Batch], after: Sequence[np.ndarray | None]) -> Tables:
        """Rows given as batches on the same breakpoints (of any degrees), each zero before its
        functions and, after them, zero or the constant in ``after`` (one a function)."""
        first = rows[0]
        owner = first.piece_owner
        columns = np.arange(owner.size) + 2 * owner + 1
        sizes = np.diff(first.offsets) + 1
        offsets = np.concatenate([[0], np.cumsum(sizes)])
        height = max(row.degree for row in rows) + 1
        tables = np.zeros((len(rows), height, int(offsets[-1])))
        last_columns = offsets[1:] - 1
        for index, (row, total) in enumerate(zip(rows, after, strict=True)):
            tables[index, : row.degree + 1, columns] = row.coeffs.T
            if total is not None:
                tables[index, 0, last_columns] = total
        pads = np.maximum(first.lasts - first.firsts, 1.0)
        return Tables(first.breaks, first.offsets, tables, pads)

    def subset(self, functions: np.ndarray) -> Tables:
        """The functions with these indices, in that order."""
        functions = np.asarray(functions, dtype=np.int64)
        starts = self.offsets[functions]
        sizes = np.diff(self.offsets)[functions]
        breaks = np.concatenate([self.breaks[a : a + n] for a, n in zip(starts, sizes,
                                                                         strict=True)])
        columns = np.concatenate([np.arange(a + k, a + k + n + 1)
                                  for a, k, n in zip(starts, functions, sizes, strict=True)])
        return Tables(breaks, np.concatenate([[0], np.cumsum(sizes)]),
                      self.tables[:, :, columns], self.pads[functions])

    @property
    def count(self) -> int:
        return int(self.offsets.size - 1)

    @cached_property
    def by_degree(self) -> np.ndarray:
        """The tables as (degree+1, rows, columns), for gathering terms."""
        return np.ascontiguousarray(np.moveaxis(self.tables, 1, 0))

    @cached_property
    def row_degrees(self) -> np.ndarray:
        """The highest power with a non-zero coefficient in each row (over every function)."""
        nonzero = np.any(self.tables != 0, axis=2)  # (rows, degree+1)
        powers = np.arange(self.tables.shape[1])
        return np.where(nonzero, powers, 0).max(axis=1)  # type: ignore[no-any-return]

    def degree_used(self, rows: np.ndarray) -> int:
        """The highest power with a non-zero coefficient in any of these table rows."""
        return int(self.row_degrees[rows].max(initial=0))

    @property
    def firsts(self) -> np.ndarray:
        """First breakpoint of each function [length]."""
        return self.breaks[self.offsets[:-1]]

    @property
    def lasts(self) -> np.ndarray:
        """Last breakpoint of each function [length]."""
        return self.breaks[self.offsets[1:] - 1]

    def totals(self, row: int) -> np.ndarray:
        """Each function's table ``row`` past its end (the full integral for integral rows)."""
        return self.tables[row, 0, self.offsets[1:] + np.arange(self.count)]


def shifted_sums(
    batch: Tables,
    which: np.ndarray,
    shifts: np.ndarray,
    weights: np.ndarray,
    constants: np.ndarray,
) -> Batch:
    """For every function k of ``batch``: the exact sum over terms t of
    ``weights[t] * f_k,which[t](x + shifts[k, t])`` plus ``constants[k]``.

    Args:
        batch: the functions' tables.
        which: table row of each term (T,).
        shifts: finite shift of each term for each function [length] (functions, T).
        weights: multiplier of each term (T,).
        constants: added to each sum (functions,).

    Returns:
        Each sum on the union of its shifted breakpoints (near-coincident ones merged), with a
        constant piece of length ``batch.pads[k]`` at each end.
    """
    count = batch.count
    pads = batch.pads
    sizes = np.diff(batch.offsets)  # breakpoints of each function
    terms = which.size
    if terms == 0:
        grid = np.stack([batch.firsts - pads, batch.lasts + pads], axis=1).ravel()
        coeffs = np.zeros((batch.tables.shape[1], count))
        coeffs[0] = constants
        return Batch(grid, coeffs, 2 * np.arange(count + 1))
    # every breakpoint of every function shifted by every term, sorted function by function
    owner = np.repeat(np.arange(count), terms * sizes)
    local = np.arange(owner.size) - np.repeat(terms * batch.offsets[:-1], terms * sizes)
    term, j = np.divmod(local, sizes[owner])
    points = batch.breaks[batch.offsets[owner] + j] - shifts[owner, term]
    points = points[np.lexsort((points, owner))]
    extents = np.maximum(batch.lasts - batch.firsts, 1.0)
    keep = np.empty(points.size, dtype=bool)
    keep[1:] = np.diff(points) > POSITION * extents[owner[1:]]
    keep[terms * batch.offsets[:-1]] = True  # each function's first point
    kept, owner = points[keep], owner[keep]
    kept_counts = np.bincount(owner, minlength=count)
    # add the constant pieces before and after
    out_offsets = np.concatenate([[0], np.cumsum(kept_counts + 2)])
    grid = np.empty(int(out_offsets[-1]))
    grid[np.arange(kept.size) + 2 * owner + 1] = kept
    firsts = out_offsets[:-1]
    lasts = out_offsets[1:] - 1
    grid[firsts] = grid[firsts + 1] - pads
    grid[lasts] = grid[lasts - 1] + pads
    result = Batch(grid, np.zeros((0, 0)), out_offsets)
    starts, ends = result.starts, result.ends
    piece_owner = result.piece_owner
    mids = 0.5 * (starts + ends)
    # the piece of each function that every term's shifted position falls in: an exact
    # searchsorted on all functions at once, ordering (function, chainage) pairs as complex
    # numbers (numpy orders complex numbers by real part, then imaginary part)
    keys = np.repeat(np.arange(count), sizes) + 1j * batch.breaks
    term_shifts = shifts[piece_owner].T  # (T, P)
    positions = starts[None, :] + term_shifts
    queries = piece_owner[None, :] + 1j * (mids[None, :] + term_shifts)
    pieces = sizes[piece_owner] - 1
    index = np.searchsorted(keys, queries, side="right") - batch.offsets[piece_owner] - 1
    inside = (index >= 0) & (index < pieces)
    safe = np.clip(index, 0, pieces - 1)
    base = batch.breaks[batch.offsets[piece_owner] + safe]
    h = np.where(inside, positions - base, 0.0)
    # table columns: each function's table has its pieces + 2 columns
    columns = batch.offsets[piece_owner] + piece_owner + index + 1
    used = batch.degree_used(which) + 1
    # coefficients above the highest non-zero one stay zero under a shift: leave them out
    a = batch.by_degree[:used, which[:, None], columns]  # (used, T, P)
    for low in range(used - 1):  # Taylor shift p(u) -> p(u + h), as piecewise.taylor_shift
        for row in range(used - 2, low - 1, -1):
            a[row] += h * a[row + 1]
    # the terms are added one after another, in order, so that a batch rounds as one function
    total = np.zeros((batch.tables.shape[1], a.shape[2]))
    total[:used] = a[:, 0] * weights[0]
    for t in range(1, terms):
        total[:used] += a[:, t] * weights[t]
    total[0] += constants[piece_owner]
    return Batch(grid, total, out_offsets)
