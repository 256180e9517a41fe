"""Influence functions made ready for placement, many at once.

:func:`prepare_many` splits every function at its zero crossings, integrates it, its positive
part and its negative part, tabulates them for shifted sums and finds the extreme ordinates and
jumps, for a whole batch in a few numpy passes. Every step is elementwise over pieces (or runs
along one function at a time, as the running sums of the integrals do), so each function comes
out exactly as it would alone: :func:`vehicles.effect.prepare` is this with a batch of one.
Units: chainage [length]; ordinates per unit load; integrals [ordinate x length].

Example:
    >>> from scipy.interpolate import PPoly
    >>> hat = PPoly([[1.0, -1.0], [0.0, 1.0]], [0.0, 1.0, 2.0])  # [m]; peak 1 at 1 m
    >>> dip = PPoly([[-1.0, 1.0], [0.0, -1.0]], [0.0, 1.0, 2.0])
    >>> first, second = prepare_many([hat, dip])
    >>> first.area, first.largest.position, second.smallest.value
    (1.0, 1.0, -1.0)
"""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np
from scipy.interpolate import PPoly

from vehicles.effect import Ordinate, PreparedInfluence
from vehicles.piecewise import (
    RELATIVE_BREAK_TOLERANCE,
    Pieces,
    horner,
    pieces_from_ppoly,
    taylor_shift,
    unit_roots,
)
from vehicles.ragged import Ragged, powers

JUMP_TOLERANCE = 1e-9
"""Neighbouring limits further apart than this fraction of the largest ordinate are a jump."""


def prepare_many(influences: Sequence[PPoly | PreparedInfluence]) -> list[PreparedInfluence]:
    """:func:`vehicles.effect.prepare` for every function, computed together.

    Args:
        influences: responses per unit downward load against chainage [length].
    """
    found: list[PreparedInfluence | None] = [
        i if isinstance(i, PreparedInfluence) else None for i in influences]
    groups: dict[int, list[int]] = {}
    pieces: dict[int, Pieces] = {}
    for index, influence in enumerate(influences):
        if not isinstance(influence, PreparedInfluence):
            pieces[index] = pieces_from_ppoly(influence)
            groups.setdefault(pieces[index].coeffs.shape[0], []).append(index)
    for members in groups.values():
        for index, prepared in zip(members, _prepared([pieces[i] for i in members]),
                                   strict=True):
            found[index] = prepared
    return [p for p in found if p is not None]


def _owner_of_breaks(functions: Ragged) -> np.ndarray:
    return np.repeat(np.arange(functions.count), np.diff(functions.offsets))


def _searched(functions: Ragged, owner: np.ndarray, x: np.ndarray) -> np.ndarray:
    """searchsorted(breaks, x, side="right") within each point's own function."""
    keys = _owner_of_breaks(functions) + 1j * functions.breaks
    return np.searchsorted(keys, owner + 1j * x, side="right") - functions.offsets[owner]


def _roots_inside(functions: Ragged, coeffs: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """(function, chainage) of every real root strictly inside a piece of ``coeffs`` on the
    pieces of ``functions``, sorted function by function (the roots of a piecewise polynomial)."""
    starts = functions.starts()
    widths = functions.ends() - starts
    column, v = unit_roots(coeffs * powers(widths, coeffs.shape[0]))
    inside = (v > 0.0) & (v < 1.0)
    roots = starts[column[inside]] + v[inside] * widths[column[inside]]
    owner = functions.piece_function[column[inside]]
    order = np.lexsort((roots, owner))
    return owner[order], roots[order]


def _split_at_zeros(functions: Ragged) -> Ragged:
    """A breakpoint at every zero crossing inside a piece."""
    owner, roots = _roots_inside(functions, functions.coeffs)
    break_owner = _owner_of_breaks(functions)
    points = np.concatenate([functions.breaks, roots])
    owners = np.concatenate([break_owner, owner])
    order = np.lexsort((points, owners))
    points, owners = points[order], owners[order]
    firsts = functions.breaks[functions.offsets[:-1]]
    lasts = functions.breaks[functions.offsets[1:] - 1]
    extents = np.maximum(lasts - firsts, 1.0)
    keep = np.ones(points.size, dtype=bool)
    keep[1:] = np.diff(points) > RELATIVE_BREAK_TOLERANCE * extents[owners[1:]]
    counts = np.bincount(owners, minlength=functions.count)
    keep[np.concatenate([[0], np.cumsum(counts)[:-1]])] = True
    points, owners = points[keep], owners[keep]
    new_offsets = np.concatenate([[0], np.cumsum(np.bincount(owners,
                                                              minlength=functions.count))])
    grown = np.diff(new_offsets) != np.diff(functions.offsets)
    if not grown.any():
        return functions
    # a function with no crossing keeps its own breakpoints and coefficients, as it does alone
    kept = ~grown[owners]
    points[kept] = functions.breaks[~grown[_owner_of_breaks(functions)]]
    split = Ragged(points, np.zeros((0, 0)), new_offsets)
    starts = split.starts()
    piece_owner = split.piece_function
    mids = 0.5 * (starts + split.ends())
    pieces = np.diff(functions.offsets)[piece_owner] - 1
    parent = np.clip(_searched(functions, piece_owner, mids) - 1, 0, pieces - 1)
    first_piece = functions.piece_offsets[piece_owner]
    shift = starts - functions.breaks[functions.offsets[piece_owner] + parent]
    coeffs = taylor_shift(functions.coeffs[:, first_piece + parent], shift)
    same = ~grown[piece_owner]
    coeffs[:, same] = functions.coeffs[:, ~grown[functions.piece_function]]
    return Ragged(points, coeffs, new_offsets)


def _signed_part(functions: Ragged, sign: float) -> Ragged:
    widths = functions.ends() - functions.starts()
    middle = horner(functions.coeffs, 0.5 * widths)
    keep = (sign * middle > 0)[None, :]
    return Ragged(functions.breaks, np.where(keep, functions.coeffs, 0.0), functions.offsets)


def _antiderivative(functions: Ragged) -> tuple[Ragged, np.ndarray]:
    """The integral of each function from its start (as piecewise.antiderivative) and each
    integral's value at the function's end."""
    degree = functions.coeffs.shape[0] - 1
    widths = functions.ends() - functions.starts()
    coeffs = np.zeros((degree + 2, functions.coeffs.shape[1]))
    coeffs[1:] = functions.coeffs / np.arange(1, degree + 2)[:, None]
    increments = horner(coeffs, widths)
    counts = np.diff(functions.piece_offsets)
    owner = functions.piece_function
    column = np.arange(owner.size) - functions.piece_offsets[owner]
    table = np.zeros((functions.count, int(counts.max())))
    table[owner, column] = increments
    running = np.cumsum(table, axis=1)  # along each function, as one function's cumsum
    coeffs[0] = np.where(column > 0, running[owner, np.maximum(column - 1, 0)], 0.0)
    integral = Ragged(functions.breaks, coeffs, functions.offsets)
    last = functions.piece_offsets[1:] - 1
    totals = horner(coeffs[:, last], widths[last])
    return integral, totals


def _prepared(lines: list[Pieces]) -> list[PreparedInfluence]:
    line = _split_at_zeros(Ragged.of(lines))
    area, area_totals = _antiderivative(line)
    positive_part, negative_part = _signed_part(line, 1.0), _signed_part(line, -1.0)
    positive, positive_totals = _antiderivative(positive_part)
    negative, negative_totals = _antiderivative(negative_part)
    degree = area.coeffs.shape[0] - 1
    count = line.count
    # extended tables laid end to end: a zero column, the pieces, the value past the end
    piece_owner = line.piece_function
    table_columns = np.arange(piece_owner.size) + 2 * piece_owner + 1
    widths = np.diff(line.offsets) + 1
    table_offsets = np.concatenate([[0], np.cumsum(widths)])
    tables = np.zeros((6, degree + 1, int(table_offsets[-1])))
    after = table_offsets[1:] - 1
    rows = (line, area, positive, negative, positive_part, negative_part)
    for row, (functions, total) in enumerate(zip(
            rows, (None, area_totals, positive_totals, negative_totals, None, None),
            strict=True)):
        height = functions.coeffs.shape[0]
        tables[row, :height, table_columns] = functions.coeffs.T
        if total is not None:
            tables[row, 0, after] = total
    largest, smallest = _extreme_ordinates(line)
    jumps = _jumps(line)
    return [
        PreparedInfluence(line.function(k), tables[:, :, table_offsets[k] : table_offsets[k + 1]],
                          float(area_totals[k]), float(positive_totals[k]),
                          float(negative_totals[k]), largest[k], smallest[k], jumps[k])
        for k in range(count)
    ]


def _extreme_ordinates(line: Ragged) -> tuple[list[Ordinate], list[Ordinate]]:
    """Largest and smallest ordinate of each function : piece
    ends and interior stationary points, the first of equal values in the same order."""
    starts, ends = line.starts(), line.ends()
    widths = ends - starts
    degree = line.coeffs.shape[0] - 1
    piece_owner = line.piece_function
    if degree >= 2:
        derivative = line.coeffs[1:] * np.arange(1, degree + 1)[:, None]
        owner, stationary = _roots_inside(line, derivative)
    else:
        owner, stationary = np.zeros(0, dtype=int), np.zeros(0)
    index = _searched(line, owner, stationary) - 1
    pieces = np.diff(line.offsets)[owner] - 1
    inside = (index >= 0) & (index < pieces)
    safe = line.piece_offsets[owner] + np.clip(index, 0, pieces - 1)
    at_stationary = np.where(inside, horner(line.coeffs[:, safe],
                                            stationary - starts[safe]), 0.0)
    xs = np.concatenate([starts, ends, stationary])
    values = np.concatenate([line.coeffs[0], horner(line.coeffs, widths), at_stationary])
    owners = np.concatenate([piece_owner, piece_owner, owner])
    # candidates of each function in the order one function lists them
    kind = np.concatenate([np.zeros(starts.size), np.ones(ends.size), np.full(owner.size, 2)])
    order = np.lexsort((np.arange(owners.size), kind, owners))
    xs, values, owners = xs[order], values[order], owners[order]
    bounds = np.concatenate([[0], np.cumsum(np.bincount(owners, minlength=line.count))])
    found = []
    for pick in (np.maximum, np.minimum):
        best = pick.reduceat(values, bounds[:-1])
        hits = np.flatnonzero(values == best[owners])
        first = hits[np.unique(owners[hits], return_index=True)[1]]
        found.append([Ordinate(float(values[i]), float(xs[i])) for i in first])
    return found[0], found[1]


def _jumps(line: Ragged) -> list[np.ndarray]:
    """Chainages where each function jumps (limits differ beyond the tolerance)."""
    widths = line.ends() - line.starts()
    owner = _owner_of_breaks(line)
    firsts = line.offsets[:-1]
    lasts = line.offsets[1:] - 1
    left = np.zeros(line.breaks.size)
    right = np.zeros(line.breaks.size)
    not_first = np.ones(line.breaks.size, dtype=bool)
    not_first[firsts] = False
    left[not_first] = horner(line.coeffs, widths)
    right[line.interior] = line.coeffs[0]
    largest = np.maximum(np.maximum.reduceat(np.abs(left), firsts),
                         np.maximum.reduceat(np.abs(right), firsts))
    scale = np.maximum(largest, 1e-300)
    jumped = np.abs(left - right) > JUMP_TOLERANCE * scale[owner]
    return [line.breaks[first : last + 1][jumped[first : last + 1]]
            for first, last in zip(firsts, lasts, strict=True)]
