"""The exact effect of a load case against the lead position, for many influence lines at once.

An effect function E(lead position) is a sum of shifted copies of table rows of a prepared
line (:mod:`vehicles.search.terms`), formed exactly by :func:`piecewise.shifted.shifted_sums`
with a constant stretch before the train reaches the path and after it has left. Its skeleton
(every piece's end limits and interior stationary points) holds its exact extremes.

Units: lead positions [length]; effects [response x force].

Example:
    >>> from piecewise import Piecewise
    >>> from vehicles.loadmodel import LoadCase
    >>> from vehicles.train import Axle, Train
    >>> moment = Piecewise(np.array([0.0, 5.0, 10.0]), np.array([[0.0, 2.5], [0.5, -0.5]]))
    >>> case = LoadCase("one axle", Train("P", (Axle(100.0),)))
    >>> e = effect_function(moment, case, kind="moment", sense="max", direction="forward")
    >>> e.values([5.0, 10.0]).tolist()  # the axle over midspan, then over the far support
    [250.0, 0.0]
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from functools import cached_property
from typing import Any

import numpy as np

from piecewise import Batch, Piecewise
from piecewise.shifted import shifted_sums
from piecewise.skeleton import Skeleton, Skeletons, skeletons
from vehicles.loadmodel import LoadCase
from vehicles.search.prepared import PreparedLines, prepare
from vehicles.search.terms import (
    arrangement_of,
    check_request,
    lane_constants,
    terms_of,
    travel_sign,
)
from vehicles.train import Arrangement

RangedValues = tuple[float, ...]
"""The value of every ranged gap or length of a train, in order [length] (empty for none)."""


@dataclass(frozen=True)
class Effects:
    """Effect functions of one case, in one direction, for some lines of a prepared batch.

    Attributes:
        case: the load case.
        kind: response kind (picks the knife-edge load).
        sense: "max" or "min": which adverse parts the lane covers in these functions.
        direction: "forward" or "reverse".
        lines: index in the prepared batch of each function's line.
        ranged_values: the ranged values each function was built with.
        functions: E of each line against the lead position [length], with constant ends.
        skeletons: their skeletons.
    """

    case: LoadCase
    kind: str
    sense: str
    direction: str
    lines: np.ndarray
    ranged_values: tuple[RangedValues, ...]
    functions: Batch
    skeletons: Skeletons

    def arrangement(self, k: int) -> Arrangement | None:
        """The train as placed for function ``k``."""
        values = self.ranged_values[k]
        if values not in self._arrangements:
            self._arrangements[values] = arrangement_of(self.case, values)
        return self._arrangements[values]

    @cached_property
    def _arrangements(self) -> dict[RangedValues, Arrangement | None]:
        return {}

    def shifted(self, sense: str, shift: np.ndarray) -> Effects:
        """The same functions plus a constant per line, labelled with another sense (for cases
        whose varying terms do not depend on the sense)."""
        per_entry = shift[self.skeletons.owner]
        sk = self.skeletons
        coeffs = self.functions.coeffs.copy()
        coeffs[0] += shift[self.functions.piece_owner]
        return Effects(self.case, self.kind, sense, self.direction, self.lines,
                       self.ranged_values, self.functions.with_coeffs(coeffs),
                       Skeletons(sk.positions, sk.values + per_entry, sk.sides, sk.offsets,
                                 sk.tolerances))


def build_effects(
    prepared: PreparedLines,
    lines: np.ndarray,
    case: LoadCase,
    *,
    kind: str,
    sense: str,
    direction: str,
    ranged_values: Sequence[RangedValues],
) -> Effects:
    """Effect functions of ``case`` on the prepared lines ``lines``, each with its own ranged
    values, and their skeletons.

    Args:
        prepared: the prepared batch.
        lines: which of its lines (indices).
        case: the load case.
        kind, sense, direction: as in :class:`Effects`.
        ranged_values: one tuple of ranged values a line (empty for a train without ranges).
    """
    lines = np.asarray(lines, dtype=np.int64)
    ranged_values = tuple(tuple(v) for v in ranged_values)
    distinct = list(dict.fromkeys(ranged_values))
    terms = {v: terms_of(case, arrangement_of(case, v), direction, sense) for v in distinct}
    first = terms[distinct[0]]
    row_totals = np.stack([prepared.tables.totals(row)[lines] for row in range(6)])
    if len(distinct) == 1:
        shifts = np.broadcast_to(first.shifts, (lines.size, first.shifts.size))
        constants = first.constant(row_totals)
    else:
        shifts = np.stack([terms[v].shifts for v in ranged_values])
        constants = np.empty(lines.size)
        for v in distinct:
            own = np.array([i for i, other in enumerate(ranged_values) if other == v])
            constants[own] = terms[v].constant(row_totals[:, own])
    constants = constants + lane_constants(case, kind, prepared, sense)[lines]
    tables = prepared.tables if lines.size == prepared.count and np.array_equal(
        lines, np.arange(prepared.count)) else prepared.tables.subset(lines)
    functions = shifted_sums(tables, first.rows, np.asarray(shifts), first.weights, constants)
    return Effects(case, kind, sense, direction, lines, ranged_values, functions,
                   skeletons(functions))


@dataclass(frozen=True)
class EffectFunction:
    """The exact effect of one load case in one arrangement on one line, against the lead
    position.

    Attributes:
        function: E [response x force] against the lead position [length], with a constant
            stretch before the train reaches the path and after it has left (beyond those it is
            the same constants: see :meth:`values`).
        case, kind, sense, direction: as in :class:`Effects`.
        arrangement: the train with every range fixed (None for a case without a train).
    """

    function: Piecewise
    case: LoadCase
    kind: str
    sense: str
    direction: str
    arrangement: Arrangement | None

    def values(self, leads: np.ndarray | list[float] | float, side: str = "right") -> np.ndarray:
        """E at lead positions [length] (the constants continue beyond the padded ends)."""
        x = np.clip(np.atleast_1d(np.asarray(leads, dtype=float)), self.function.start,
                    self.function.end)
        return self.function.values(x, side)

    def ppoly(self) -> Any:
        """E as scipy's PPoly, constant beyond its ends."""
        return self.function.to_ppoly(extrapolate=True)

    @cached_property
    def skeleton(self) -> Skeleton:
        return skeletons(self.function.batch).function(0)

    @property
    def travel_sign(self) -> float:
        return travel_sign(self.direction)


def effect_function(
    line: Any,
    case: LoadCase,
    *,
    kind: str,
    sense: str,
    direction: str,
    ranged_values: Sequence[float] | None = None,
) -> EffectFunction:
    """The exact effect function E(lead position) of ``case`` on one influence line.

    Args:
        line: response per unit downward load against chainage [length] (a Piecewise, a
            PPoly, or prepared lines holding one line).
        case: load case (train, factors, lane and knife-edge loads).
        kind: response kind, which picks the knife-edge load.
        sense: "max" or "min", which picks the adverse parts for the lane and knife-edge loads.
        direction: "forward" or "reverse".
        ranged_values: values of the train's ranged gaps and lengths [length] (default the
            minima).
    """
    check_request(kind, sense, direction)
    prepared = line if isinstance(line, PreparedLines) else prepare([line])
    arrangement = arrangement_of(case, ranged_values)
    values = arrangement.values if arrangement is not None else ()
    effects = build_effects(prepared, np.array([0]), case, kind=kind, sense=sense,
                            direction=direction, ranged_values=[values])
    return EffectFunction(Piecewise.from_batch(effects.functions), case, kind, sense, direction,
                          arrangement)
