"""Skeletons of many sums of weighted, shifted copies of one piecewise polynomial.

A vehicle crossing a line gives the effect E(x) = sum_i w_i f(x + s_i) against the lead position
x, one term an axle. A fatigue run needs the exact turning points of that sum for a great many
weight and shift sets (one a truck) on the same function f. :func:`copy_skeletons` finds them
without forming each sum on the union of its breakpoints by sorting and searching: E changes
polynomial only where a term crosses a breakpoint of f (an *event*), and there it changes by that
term's weight times the jump polynomial of f at the breakpoint (next piece minus previous piece,
zero beyond the ends). Walking the sorted events, each piece of E is the previous one re-expanded
at the event (a Taylor shift by the distance between events) plus the jump there, so its
coefficients stay local and keep their accuracy however long the crossing.

The skeleton of each sum lists, in order of position, at every event the left limit and the right
limit, then the interior stationary points of the piece that follows (see
:mod:`piecewise.skeleton`). Between entries E is monotone, so its turning points are among them.
Events closer than :data:`~piecewise.tolerances.POSITION` of the function's extent are one
position: the value between them belongs to no load position and is left out.

Units are the caller's: positions [length], weights [force], values [weight x ordinate].

Example (two unit axles 2 apart crossing the triangle of a 4 long simple span's midspan moment):
    >>> f = Piecewise(np.array([0.0, 2.0, 4.0]), np.array([[0.0, 1.0], [0.5, -0.5]]))
    >>> sk = copy_skeletons(f, np.array([[0.0, -2.0]]), np.array([[1.0, 1.0]]))
    >>> sk.positions[:, 0].tolist()  # the events, the axles standing together at 2 and 4
    [0.0, 2.0, 2.0, 4.0, 4.0, 6.0]
    >>> sk.values[:, 0].tolist()  # the middle limits, at one position, repeat the first
    [0.0, 1.0, 1.0, 1.0, 1.0, 0.0]
    >>> copy_skeletons(f, np.zeros((0, 2)), np.zeros((0, 2))).values.shape  # no sums
    (6, 0)
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from piecewise.function import Piecewise
from piecewise.polynomial import horner, quadratic_roots, taylor_shift, unit_roots
from piecewise.tolerances import POSITION, VALUE


@dataclass(frozen=True)
class CopySkeletons:
    """The skeletons of K sums, one column a sum, in position order, padded by repetition.

    Each event t owns ``rows`` entries: the left limit there (only for a function with jumps),
    the right limit, then the interior stationary points of the piece from event t to event
    t+1 in increasing position. An entry that is no point of the skeleton (a stationary point
    a piece does not have, a limit inside a group of events at one position) repeats the entry
    before it, value and position, so every column is a sequence of skeleton points in order
    with some points repeated. The first entry is the value before anything reaches the
    function (0) and the last the value after everything has left it (0, up to rounding).

    Attributes:
        values: (entries, K) the sums there.
        positions: (entries, K) where [length] (empty when not asked for).
        rows: entries an event owns.
    """

    values: np.ndarray
    positions: np.ndarray
    rows: int


def jump_polynomials(function: Piecewise) -> np.ndarray:
    """(degree+1, breakpoints) the change of ``function`` at each breakpoint, as a polynomial
    in the distance past it: the next piece less the previous one (zero beyond the ends)."""
    coeffs = function.coeffs
    before = taylor_shift(coeffs, function.widths)
    jumps = np.zeros((coeffs.shape[0], coeffs.shape[1] + 1))
    jumps[:, :-1] += coeffs
    jumps[:, 1:] -= before
    return jumps


def copy_skeletons(function: Piecewise, shifts: np.ndarray, weights: np.ndarray,
                   positions: bool = True) -> CopySkeletons:
    """The skeletons of ``E_k(x) = sum_i weights[k, i] * function(x + shifts[k, i])``.

    Args:
        function: f [ordinate] against position [length], zero outside its breakpoints.
        shifts: (K, n) shift of each term of each sum [length].
        weights: (K, n) weight of each term [force].
        positions: also give where each entry stands (skip to save time when only values
            matter).

    Returns:
        The K skeletons, from the first event to the last.
    """
    shifts = np.asarray(shifts, dtype=float)
    weights = np.asarray(weights, dtype=float)
    count, terms = shifts.shape
    breaks = function.breaks
    jumps = jump_polynomials(function)
    # every event: term i reaches breakpoint j at x = b_j - s_i; sorted sum by sum
    at = (breaks[None, None, :] - shifts[:, :, None]).reshape(count, terms * breaks.size)
    order = np.argsort(at, axis=1, kind="stable")
    x = np.take_along_axis(at, order, axis=1).T  # (events, K)
    term, which = np.divmod(order.T, breaks.size)
    weight = np.take_along_axis(weights.T, term, axis=0)
    events = x.shape[0]
    width = np.zeros((events, count))  # piece t runs from event t over width[t]
    width[:-1] = np.diff(x, axis=0)
    merged = width <= POSITION * max(function.length, 1.0)  # event t+1 stands on event t
    merged[-1] = False
    limits = 2 if _jumps(function, jumps) else 1
    degree = jumps.shape[0] - 1
    slots = 0 if degree < 2 else 2 if degree <= 3 else degree - 1
    rows = limits + slots
    values = np.empty((events, rows, count))
    coeffs = np.zeros((degree + 1, events, count))
    current = np.zeros((degree + 1, count))
    before = np.zeros(count)  # the value at the start of a group of merged events
    for t in range(events):
        if t:
            h = width[t - 1]
            for low in range(degree):
                for row in range(degree - 1, low - 1, -1):
                    current[row] += h * current[row + 1]
            before = np.where(merged[t - 1], before, current[0])
        current += weight[t] * jumps[:, which[t]]
        coeffs[:, t] = current
        if limits == 2:
            values[t, 0] = before
        values[t, limits - 1] = np.where(merged[t], before, current[0])
    where = x[:, None].repeat(rows, axis=1) if positions else np.zeros((0, 0, count))
    if slots:
        fraction, at_stationary = _stationary(coeffs, width, slots)
        previous = values[:, limits - 1]
        for slot in range(slots):
            found = ~np.isnan(fraction[slot]) & ~merged
            values[:, limits + slot] = np.where(found, at_stationary[slot], previous)
            previous = values[:, limits + slot]
            if positions:
                where[:, limits + slot] = np.where(found, x + fraction[slot] * width,
                                                   where[:, limits + slot - 1])
    return CopySkeletons(values.reshape(events * rows, count),
                         where.reshape(where.shape[0] * where.shape[1], count), rows)


def _jumps(function: Piecewise, jumps: np.ndarray) -> bool:
    """Whether the function jumps anywhere, its ends included (values beyond noise)."""
    scale = max(float(np.max(np.abs(function.limits()[0]), initial=0.0)),
                float(np.max(np.abs(function.limits()[1]), initial=0.0)), 1e-300)
    return bool(np.any(np.abs(jumps[0]) > VALUE * scale))


def _stationary(coeffs: np.ndarray, width: np.ndarray,
                slots: int) -> tuple[np.ndarray, np.ndarray]:
    """(slots, events, K) interior stationary points of each piece as a fraction of its width,
    in increasing order (NaN where none), and the values there."""
    degree = coeffs.shape[0] - 1
    shape = coeffs.shape[1:]
    if degree > 3:
        return _stationary_general(coeffs, width, slots)
    # E'(width v) in v = u / width: a + b v + c v^2; only pieces whose slope changes sign
    # inside, at an end or about the vertex, can hold a root: solve those alone
    a = coeffs[1].ravel()
    b = (2.0 * coeffs[2] * width).ravel()
    c = (3.0 * coeffs[3] * width * width).ravel() if degree == 3 else np.zeros(a.size)
    end = a + b + c
    with np.errstate(invalid="ignore", divide="ignore"):
        vertex = -b / (2.0 * c)
        inner = (vertex > 0.0) & (vertex < 1.0)
        at_vertex = a + vertex * (b + vertex * c)
    maybe = np.flatnonzero((a * end <= 0.0) | (inner & (a * at_vertex <= 0.0)))
    roots = np.full((2, a.size), np.nan)
    if maybe.size:
        with np.errstate(invalid="ignore", divide="ignore"):
            found = quadratic_roots(np.stack([a[maybe], b[maybe], c[maybe]]))
        found[~((found > 0.0) & (found < 1.0))] = np.nan
        low, high = np.fmin(found[0], found[1]), np.fmax(found[0], found[1])
        high[high == low] = np.nan
        roots[0, maybe], roots[1, maybe] = low, high
    fraction = roots.reshape(2, *shape)
    flat = coeffs.reshape(degree + 1, -1)
    values = np.full((2, a.size), np.nan)
    span = width.ravel()
    for slot in range(2):
        where = np.flatnonzero(~np.isnan(roots[slot]))
        values[slot, where] = horner(flat[:, where], roots[slot, where] * span[where])
    return fraction, values.reshape(2, *shape)


def _stationary_general(coeffs: np.ndarray, width: np.ndarray,
                        slots: int) -> tuple[np.ndarray, np.ndarray]:
    """:func:`_stationary` for pieces of degree above 3 (by :func:`unit_roots`)."""
    degree = coeffs.shape[0] - 1
    shape = coeffs.shape[1:]
    scaled = coeffs * np.stack([width**k for k in range(degree + 1)])
    slope = (scaled[1:] * np.arange(1, degree + 1).reshape((-1, 1, 1))).reshape(degree, -1)
    found = np.full((slots, slope.shape[1]), np.nan)
    column, v = unit_roots(slope)
    inside = (v > 0.0) & (v < 1.0)
    column, v = column[inside], v[inside]
    rank = np.arange(column.size) - np.searchsorted(column, column)
    found[rank, column] = v
    found = found.reshape(slots, *shape)
    values = horner(coeffs[:, None], np.nan_to_num(found) * width[None])
    return found, np.where(np.isnan(found), np.nan, values)
