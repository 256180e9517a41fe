"""Many piecewise polynomials at once, laid end to end: shifted sums and skeletons for a batch.

A :class:`Ragged` holds the pieces of several functions (one per influence line of a batch) one
after another in flat arrays, each with its own breakpoints. Every operation here is elementwise
over pieces or over (term, piece) pairs, so a function computed in a batch is bit for bit the
function computed alone: the single-line code (:func:`vehicles.effect.summed`,
:func:`vehicles.extremes.skeleton`) is this code with a batch of one. Units are the caller's:
breakpoints [length], values whatever the functions measure.

Example:
    >>> hat = Pieces(np.array([0.0, 1.0, 2.0]), np.array([[0.0, 1.0], [1.0, -1.0], [0.0, 0.0]]))
    >>> bump = Pieces(np.array([0.0, 2.0]), np.array([[0.0], [2.0], [-1.0]]))  # 2u - u^2
    >>> sk = skeletons(Ragged.of([hat, bump]))
    >>> sk.offsets.tolist()  # the hat's four entries, then the bump's three
    [0, 4, 7]
    >>> sk.values.tolist(), sk.highest().tolist()
    ([0.0, 1.0, 1.0, 0.0, 0.0, 1.0, 0.0], [1.0, 1.0])
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from functools import cached_property

import numpy as np

from vehicles.piecewise import RELATIVE_BREAK_TOLERANCE, Pieces, horner, unit_roots


@dataclass(frozen=True)
class Ragged:
    """Piecewise polynomials end to end.

    Attributes:
        breaks: every function's breakpoints, concatenated [length].
        coeffs: (degree+1, pieces of all functions) ascending local coefficients.
        offsets: (functions+1,) where each function's breakpoints start in ``breaks``; function
            k has ``offsets[k+1] - offsets[k] - 1`` pieces.
    """

    breaks: np.ndarray
    coeffs: np.ndarray
    offsets: np.ndarray

    @staticmethod
    def of(functions: Sequence[Pieces]) -> Ragged:
        """Functions with equal degree laid end to end."""
        sizes = [f.breaks.size for f in functions]
        return Ragged(np.concatenate([f.breaks for f in functions]),
                      np.concatenate([f.coeffs for f in functions], axis=1),
                      np.concatenate([[0], np.cumsum(sizes)]))

    @property
    def count(self) -> int:
        """Number of functions."""
        return self.offsets.size - 1

    @property
    def piece_offsets(self) -> np.ndarray:
        """(functions+1,) where each function's pieces start in ``coeffs``."""
        return self.offsets - np.arange(self.offsets.size)

    @property
    def piece_function(self) -> np.ndarray:
        """Which function each piece belongs to."""
        return np.repeat(np.arange(self.count), np.diff(self.piece_offsets))

    @property
    def interior(self) -> np.ndarray:
        """Mask over ``breaks``: True except at each function's last breakpoint."""
        mask = np.ones(self.breaks.size, dtype=bool)
        mask[self.offsets[1:] - 1] = False
        return mask

    def starts(self) -> np.ndarray:
        """Left end of every piece [length]."""
        return self.breaks[self.interior]

    def ends(self) -> np.ndarray:
        """Right end of every piece [length]."""
        mask = np.ones(self.breaks.size, dtype=bool)
        mask[self.offsets[:-1]] = False
        return self.breaks[mask]

    def function(self, k: int) -> Pieces:
        """Function ``k`` alone."""
        first, last = self.piece_offsets[k], self.piece_offsets[k + 1]
        return Pieces(self.breaks[self.offsets[k] : self.offsets[k + 1]],
                      self.coeffs[:, first:last])


@dataclass(frozen=True)
class RaggedSkeletons:
    """The skeletons (:class:`vehicles.extremes.Skeleton`) of a batch, end to end.

    Attributes:
        positions, values, sides: as in a skeleton, every function's entries in turn.
        offsets: (functions+1,) where each function's entries start.
        tolerances: each function's value tolerance (see ``Skeleton.tolerance``).
    """

    positions: np.ndarray
    values: np.ndarray
    sides: np.ndarray
    offsets: np.ndarray
    tolerances: np.ndarray

    def highest(self) -> np.ndarray:
        """Largest value of each function."""
        return np.maximum.reduceat(self.values, self.offsets[:-1])

    def lowest(self) -> np.ndarray:
        """Smallest value of each function."""
        return np.minimum.reduceat(self.values, self.offsets[:-1])

    def padded(self, fill: float) -> tuple[np.ndarray, np.ndarray]:
        """(positions, values) as (functions, longest) arrays; missing entries hold ``fill``."""
        counts = np.diff(self.offsets)
        width = int(counts.max())
        row = np.repeat(np.arange(counts.size), counts)
        column = np.arange(self.values.size) - self.offsets[row]
        positions = np.full((counts.size, width), fill)
        values = np.full((counts.size, width), fill)
        positions[row, column] = self.positions
        values[row, column] = self.values
        return positions, values


def powers(x: np.ndarray, count: int) -> np.ndarray:
    """(count, ...) rows 1, x, x^2, ... by repeated multiplication: correctly rounded steps, so
    the same for an element whatever the length of the array (``**`` need not be)."""
    rows = [np.ones_like(x)]
    for _ in range(count - 1):
        rows.append(rows[-1] * x)
    return np.stack(rows)


def _segment_max(values: np.ndarray, offsets: np.ndarray) -> np.ndarray:
    return np.maximum.reduceat(values, offsets[:-1])


def skeletons(functions: Ragged, relative_tolerance: float = 1e-9) -> RaggedSkeletons:
    """Every piece's two end limits and interior stationary points, function by function.

    See :func:`vehicles.extremes.skeleton`, which is this with one function.
    """
    coeffs = functions.coeffs
    starts, ends = functions.starts(), functions.ends()
    widths = ends - starts
    count = coeffs.shape[1]
    degree = coeffs.shape[0] - 1
    if degree >= 2:
        # E'(u) in the normalised variable v = u / width: (q+1) a_{q+1} width^(q+1)
        q = np.arange(1, degree + 1)[:, None]
        column, v = unit_roots(coeffs[1:] * q * powers(widths, degree + 1)[1:])
        inside = (v > 0.0) & (v < 1.0)
        column, v = column[inside], v[inside]
    else:
        column, v = np.zeros(0, dtype=int), np.zeros(0)
    u = v * widths[column]
    piece = np.concatenate([np.arange(count), column, np.arange(count)])
    order_in_piece = np.concatenate([np.full(count, -1.0), v, np.full(count, 2.0)])
    positions = np.concatenate([starts, starts[column] + u, ends])
    values = np.concatenate([coeffs[0], horner(coeffs[:, column], u), horner(coeffs, widths)])
    sides = np.concatenate([np.ones(count, int), np.zeros(column.size, int), -np.ones(count, int)])
    order = np.lexsort((order_in_piece, piece))
    owner = functions.piece_function[piece]
    offsets = np.concatenate([[0], np.cumsum(np.bincount(owner, minlength=functions.count))])
    values = values[order]
    largest = _segment_max(np.abs(values), offsets)
    return RaggedSkeletons(positions[order], values, sides[order], offsets,
                           relative_tolerance * np.maximum(largest, 1e-300))


@dataclass(frozen=True)
class TableBatch:
    """Influence functions made ready for shifted sums, end to end.

    Attributes:
        breaks: every function's breakpoints, concatenated [length].
        offsets: (functions+1,) where each function's breakpoints start.
        tables: (rows, degree+1, sum of pieces+2) extended coefficient tables (see
            :mod:`vehicles.preparation`), function after function.
        pads: constant stretch added before and after each effect function [length].
    """

    breaks: np.ndarray
    offsets: np.ndarray
    tables: np.ndarray
    pads: np.ndarray

    @staticmethod
    def of(breaks: Sequence[np.ndarray], tables: Sequence[np.ndarray]) -> TableBatch:
        """Batch functions given by their breakpoints and (rows, degree+1, n+2) tables."""
        offsets = np.concatenate([[0], np.cumsum([b.size for b in breaks])])
        pads = np.array([max(float(b[-1] - b[0]), 1.0) for b in breaks])
        return TableBatch(np.concatenate(list(breaks)), offsets,
                          np.concatenate(list(tables), axis=2), pads)

    @property
    def count(self) -> int:
        return self.offsets.size - 1

    @cached_property
    def by_degree(self) -> np.ndarray:
        """The tables as (degree+1, rows, columns), for gathering terms."""
        return np.ascontiguousarray(np.moveaxis(self.tables, 1, 0))

    def degree_used(self, rows: np.ndarray) -> int:
        """The highest power with a non-zero coefficient in any of these table rows."""
        nonzero = np.flatnonzero(np.any(self.tables[np.unique(rows)] != 0, axis=(0, 2)))
        return int(nonzero.max()) if nonzero.size else 0

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
    batch: TableBatch,
    which: np.ndarray,
    shifts: np.ndarray,
    weights: np.ndarray,
    constants: np.ndarray,
) -> Ragged:
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
        return Ragged(grid, coeffs, 2 * np.arange(count + 1))
    # every breakpoint of every function shifted by every term, sorted function by function
    owner = np.repeat(np.arange(count), terms * sizes)
    local = np.arange(owner.size) - np.repeat(terms * batch.offsets[:-1], terms * sizes)
    term, j = np.divmod(local, sizes[owner])
    points = batch.breaks[batch.offsets[owner] + j] - shifts[owner, term]
    points = points[np.lexsort((points, owner))]
    extents = np.maximum(batch.lasts - batch.firsts, 1.0)
    keep = np.empty(points.size, dtype=bool)
    keep[1:] = np.diff(points) > RELATIVE_BREAK_TOLERANCE * extents[owner[1:]]
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
    result = Ragged(grid, np.zeros((0, 0)), out_offsets)
    starts, ends = result.starts(), result.ends()
    piece_owner = result.piece_function
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
    return Ragged(grid, total, out_offsets)
