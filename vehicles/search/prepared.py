"""Influence lines made ready for placement, many at once.

:func:`prepare` splits every line at its zero crossings, integrates it, its positive part and
its negative part, tabulates the six for shifted sums, and finds the extreme ordinates, the
jumps and the areas, for a whole batch in a few numpy passes (:mod:`piecewise`). A line
prepared in a batch is bit for bit the line prepared alone.

Units: chainage [length]; ordinates per unit load; integrals [ordinate x length].

Example:
    >>> from piecewise import Piecewise
    >>> hat = Piecewise(np.array([0.0, 1.0, 2.0]), np.array([[0.0, 1.0], [1.0, -1.0]]))
    >>> dip = Piecewise(np.array([0.0, 1.0, 2.0]), np.array([[0.0, -1.0], [-1.0, 1.0]]))
    >>> lines = prepare([hat, dip])
    >>> float(lines.areas[0]), float(lines.largest_at[0]), float(lines.smallest[1])
    (1.0, 1.0, -1.0)
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from functools import cached_property
from typing import Any

import numpy as np

from piecewise import Batch, Piecewise
from piecewise.polynomial import horner
from piecewise.shifted import Tables
from vehicles.errors import VehicleError

LINE, AREA, POSITIVE_AREA, NEGATIVE_AREA, POSITIVE_LINE, NEGATIVE_LINE = range(6)
"""Rows of the tables: the line, its integral, the integrals of its positive and negative
parts, and those parts themselves."""


def as_piecewise(line: Any) -> Piecewise:
    """An influence line as a :class:`~piecewise.Piecewise`: one already, or scipy's PPoly, or
    anything with a ``function`` attribute that is one (an influence line object)."""
    if isinstance(line, Piecewise):
        return line
    function = getattr(line, "function", None)
    if isinstance(function, Piecewise):
        return function
    if hasattr(line, "x") and hasattr(line, "c"):
        try:
            return Piecewise.from_ppoly(line)
        except ValueError as error:
            raise VehicleError(str(error), item="influence line",
                               fix="give one curve with increasing finite breakpoints") from None
    raise VehicleError(f"cannot read an influence line from {type(line).__name__}",
                       item="influence line", fix="give a piecewise.Piecewise or a scipy PPoly")


@dataclass(frozen=True)
class PreparedLines:
    """A batch of influence lines ready for placement.

    Attributes:
        split: the lines, split at their zero crossings (the form every search uses).
        tables: the six rows (see :data:`LINE` ...) on the breakpoints of ``split``.
        areas, positive_areas, negative_areas: integrals over the path [ordinate x length].
        largest, largest_at, smallest, smallest_at: extreme ordinates and where [length]
            (one-sided limits at jumps count).
    """

    split: Batch
    tables: Tables
    areas: np.ndarray
    positive_areas: np.ndarray
    negative_areas: np.ndarray
    largest: np.ndarray
    largest_at: np.ndarray
    smallest: np.ndarray
    smallest_at: np.ndarray

    @property
    def count(self) -> int:
        return self.split.count

    @property
    def starts(self) -> np.ndarray:
        """First chainage of each loaded path [length]."""
        return self.split.firsts

    @property
    def ends(self) -> np.ndarray:
        """Last chainage of each loaded path [length]."""
        return self.split.lasts

    @cached_property
    def jumps(self) -> list[np.ndarray]:
        """Chainages where each line jumps [length]."""
        return self.split.jumps()

    def adverse_areas(self, sense: str) -> np.ndarray:
        """Integral of the positive (max) or negative (min) part of each line."""
        return self.positive_areas if sense == "max" else self.negative_areas

    def adverse_ordinates(self, sense: str) -> tuple[np.ndarray, np.ndarray]:
        """(ordinate, chainage) of each line's extreme of the sought sign; 0 where the line
        never has that sign."""
        if sense == "max":
            return np.where(self.largest > 0, self.largest, 0.0), self.largest_at
        return np.where(self.smallest < 0, self.smallest, 0.0), self.smallest_at

    def adverse_segments(self, k: int, sense: str) -> tuple[tuple[float, float], ...]:
        """Maximal chainage intervals [length] where line ``k`` has the sought sign."""
        return self._segments[sense][k]

    @cached_property
    def _segments(self) -> dict[str, list[tuple[tuple[float, float], ...]]]:
        """The adverse segments of every line, for both senses, in one pass."""
        split = self.split
        middle = horner(split.coeffs, 0.5 * split.widths)
        owner = split.piece_owner
        first = np.zeros(owner.size, dtype=bool)
        first[split.piece_offsets[:-1]] = True
        last = np.zeros(owner.size, dtype=bool)
        last[split.piece_offsets[1:] - 1] = True
        found = {}
        for sense, adverse in (("max", middle > 0), ("min", middle < 0)):
            before = np.concatenate([[False], adverse[:-1]]) & ~first
            after = np.concatenate([adverse[1:], [False]]) & ~last
            opens = np.flatnonzero(adverse & ~before)
            closes = np.flatnonzero(adverse & ~after)
            segments: list[list[tuple[float, float]]] = [[] for _ in range(self.count)]
            for line, start, end in zip(owner[opens].tolist(), split.starts[opens].tolist(),
                                        split.ends[closes].tolist(), strict=True):
                segments[line].append((start, end))
            found[sense] = [tuple(s) for s in segments]
        return found

    def subset(self, lines: np.ndarray) -> PreparedLines:
        """The lines with these indices, in that order."""
        return PreparedLines(self.split.subset(lines), self.tables.subset(lines),
                             self.areas[lines], self.positive_areas[lines],
                             self.negative_areas[lines], self.largest[lines],
                             self.largest_at[lines], self.smallest[lines],
                             self.smallest_at[lines])


def prepare(lines: Sequence[Any]) -> PreparedLines:
    """Prepare influence lines for placement (see the module docstring).

    Args:
        lines: responses per unit downward load against chainage [length]: Piecewise, PPoly
            or influence-line objects, any mix of degrees.
    """
    functions = [as_piecewise(line) for line in lines]
    if not functions:
        raise VehicleError("no influence lines given", item="lines", fix="give at least one")
    degree = max(f.degree for f in functions)
    batch = Batch.joined([f.batch.raised(degree) for f in functions])
    line = batch.split_at_zeros()
    area, area_totals = line.antiderivative()
    positive_part, negative_part = line.signed_part(1.0), line.signed_part(-1.0)
    positive, positive_totals = positive_part.antiderivative()
    negative, negative_totals = negative_part.antiderivative()
    tables = Tables.of_batches(
        (line, area, positive, negative, positive_part, negative_part),
        (None, area_totals, positive_totals, negative_totals, None, None))
    (largest, largest_at), (smallest, smallest_at) = line.extremes()
    return PreparedLines(line, tables, area_totals, positive_totals, negative_totals,
                         largest, largest_at, smallest, smallest_at)
