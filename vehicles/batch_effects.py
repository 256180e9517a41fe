"""The governing effect functions of one load case for many influence lines at once.

:func:`best_effects_many` does for a batch of lines what :func:`vehicles.gaps.best_effects` does
for one, with the same arithmetic (the single-line code runs the same batched primitives of
:mod:`vehicles.ragged` with a batch of one), so every line gets the same effect functions, values
and ranged values bit for bit. The terms of a case (axle offsets, patch ends, lane footprint)
depend on the arrangement and not on the line: they are built once for the batch. A train with
one ranged gap or length is solved exactly for every line in one pass (pairing the candidates of
the front and rear groups line by line); trains with several ranges, and ranges that do not move
a group rigidly, use the single-line numeric search line by line.

Units: lead positions and ranges [length]; effects [response x force].
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from functools import cached_property

import numpy as np

from vehicles.effect import (
    EffectFunction,
    PreparedInfluence,
    Terms,
    lane_constants,
    sense_dependent,
    terms_of,
)
from vehicles.extremes import RELATIVE_VALUE_TOLERANCE, Skeleton
from vehicles.gaps import RIGID_TOLERANCE, best_effects
from vehicles.loadmodel import LoadCase
from vehicles.ragged import Ragged, RaggedSkeletons, TableBatch, shifted_sums, skeletons
from vehicles.train import Arrangement, Train

PAIR_BLOCK = 2_000_000
"""Most (front, rear) candidate pairs held at once when solving a ranged gap for many lines."""

Choices = tuple[float, ...] | None


@dataclass(frozen=True)
class LineGroup:
    """Prepared influence lines of one response kind, batched.

    Attributes:
        prepared: the lines.
        kind: their response kind (picks knife-edge loads).
    """

    prepared: tuple[PreparedInfluence, ...]
    kind: str

    @cached_property
    def batch(self) -> TableBatch:
        return TableBatch.of([p.line.breaks for p in self.prepared],
                             [p.tables for p in self.prepared])

    @cached_property
    def row_totals(self) -> np.ndarray:
        """(table rows, lines): each row's value past the path's end."""
        return np.stack([self.batch.totals(row) for row in range(self.batch.tables.shape[0])])

    @property
    def count(self) -> int:
        return len(self.prepared)

    def lane_constants(self, case: LoadCase, sense: str) -> np.ndarray:
        """:func:`vehicles.effect.constant_terms` of every line."""
        areas = np.array([p.adverse_area(sense) for p in self.prepared])
        ordinates = np.array([o.value if (o := p.adverse_ordinate(sense)) is not None else 0.0
                              for p in self.prepared])
        return lane_constants(case, self.kind, areas, ordinates)


@dataclass(frozen=True)
class ManyEffects:
    """One case's effect functions in one direction for every line of a group.

    Attributes:
        case, kind, sense, direction: as for :class:`vehicles.effect.EffectFunction`.
        pieces: the effect functions, line after line.
        skeletons: their skeletons, line after line.
        choices: the ranged values of each line's arrangement [length].
    """

    case: LoadCase
    kind: str
    sense: str
    direction: str
    pieces: Ragged
    skeletons: RaggedSkeletons
    choices: tuple[Choices, ...]

    def signed_highest(self) -> np.ndarray:
        """Each line's most adverse skeleton value (larger is more adverse for both senses)."""
        return self.skeletons.highest() if self.sense == "max" else -self.skeletons.lowest()

    def breaks(self, k: int) -> np.ndarray:
        return self.pieces.breaks[self.pieces.offsets[k] : self.pieces.offsets[k + 1]]

    def skeleton(self, k: int) -> Skeleton:
        """Line ``k``'s skeleton, as :attr:`EffectFunction.skeleton` gives it."""
        first, last = self.skeletons.offsets[k], self.skeletons.offsets[k + 1]
        return Skeleton(self.skeletons.positions[first:last], self.skeletons.values[first:last],
                        self.skeletons.sides[first:last])

    def effect(self, k: int) -> EffectFunction:
        """Line ``k``'s effect function, its skeleton already in place."""
        train = self.case.train
        arrangement = None if train is None else _arranged(train, self.choices[k])
        effect = EffectFunction(self.pieces.function(k), self.case, self.kind, self.sense,
                                self.direction, arrangement)
        effect.__dict__["skeleton"] = self.skeleton(k)
        return effect

    def resensed(self, sense: str, shifts: np.ndarray) -> ManyEffects:
        """The same arrangements for another sense, where only constants differ (see
        :func:`vehicles.effect.resensed`): every line's function moved by ``shifts[k]``."""
        coeffs = self.pieces.coeffs.copy()
        coeffs[0] += shifts[self.pieces.piece_function]
        sk = self.skeletons
        owner = np.repeat(np.arange(sk.offsets.size - 1), np.diff(sk.offsets))
        values = sk.values + shifts[owner]
        largest = np.maximum.reduceat(np.abs(values), sk.offsets[:-1])
        tolerances = RELATIVE_VALUE_TOLERANCE * np.maximum(largest, 1e-300)
        return ManyEffects(
            self.case, self.kind, sense, self.direction,
            Ragged(self.pieces.breaks, coeffs, self.pieces.offsets),
            RaggedSkeletons(sk.positions, values, sk.sides, sk.offsets, tolerances),
            self.choices,
        )


@dataclass(frozen=True)
class LineByLine:
    """Effect functions found one line at a time (the numeric search for several ranges)."""

    effects: tuple[EffectFunction, ...]
    sense: str

    def signed_highest(self) -> np.ndarray:
        values = [e.skeleton.values for e in self.effects]
        if self.sense == "max":
            return np.array([v.max() for v in values])
        return np.array([-v.min() for v in values])

    def breaks(self, k: int) -> np.ndarray:
        return self.effects[k].pieces.breaks

    def skeleton(self, k: int) -> Skeleton:
        return self.effects[k].skeleton

    def effect(self, k: int) -> EffectFunction:
        return self.effects[k]


Effects = ManyEffects | LineByLine


def _arranged(train: Train, choices: Choices) -> Arrangement:
    return train.arranged(choices)


def best_effects_many(
    group: LineGroup,
    case: LoadCase,
    *,
    senses: Sequence[str],
    direction: str,
    gap_tolerance: float | None = None,
) -> dict[str, Effects]:
    """:func:`vehicles.gaps.best_effects` for every line of ``group``."""
    ranges = case.train.ranges if case.train is not None else ()
    solver = _Solver(group, case, direction)
    best: dict[str, list[Choices]] = {sense: [None] * group.count for sense in senses}
    if ranges:
        exact = _single_range(solver, senses) if len(ranges) == 1 else None
        if exact is None:
            return _line_by_line(group, case, senses, direction, gap_tolerance)
        best = exact
    return {sense: solver.result(sense, best[sense]) for sense in senses}


def _line_by_line(group: LineGroup, case: LoadCase, senses: Sequence[str], direction: str,
                  gap_tolerance: float | None) -> dict[str, Effects]:
    found = [best_effects(p, case, kind=group.kind, senses=senses, direction=direction,
                          gap_tolerance=gap_tolerance) for p in group.prepared]
    return {sense: LineByLine(tuple(f[sense] for f in found), sense) for sense in senses}


class _Solver:
    """Builds and remembers effect functions of one case and direction for a group of lines,
    as ``evaluated`` does inside :func:`vehicles.gaps.best_effects`."""

    def __init__(self, group: LineGroup, case: LoadCase, direction: str) -> None:
        self.group, self.case, self.direction = group, case, direction
        self.shared = not sense_dependent(case)
        self.built: dict[tuple[str, tuple[Choices, ...]], ManyEffects] = {}
        self.constants = {s: group.lane_constants(case, s) for s in ("max", "min")}
        self.min_shift = self.constants["min"] - self.constants["max"]

    def terms(self, choices: Choices, sense: str) -> Terms:
        train = self.case.train
        arrangement = None if train is None else _arranged(train, choices)
        return terms_of(self.case, arrangement, self.direction, sense)

    def effects(self, sense: str, choices: Sequence[Choices]) -> ManyEffects:
        """The effect functions (built for "max" when both senses share them)."""
        train = self.case.train
        if train is not None and train.ranges:
            # no choice means every range at its minimum: one arrangement, one build
            low = tuple(r.low for r in train.ranges)
            choices = [low if c is None else c for c in choices]
        key = ("max" if self.shared else sense, tuple(choices))
        if key not in self.built:
            self.built[key] = self._build(key[0], key[1])
        return self.built[key]

    def value(self, sense: str, choices: Sequence[Choices]) -> np.ndarray:
        """Each line's most adverse value (minus the smallest for "min")."""
        effects = self.effects(sense, choices)
        if sense == "max":
            return effects.skeletons.highest()
        shift = self.min_shift if effects.sense != sense else 0.0
        return -(effects.skeletons.lowest() + shift)

    def result(self, sense: str, choices: Sequence[Choices]) -> ManyEffects:
        effects = self.effects(sense, choices)
        if effects.sense == sense:
            return effects
        return effects.resensed(sense, self.min_shift)

    def _build(self, sense: str, choices: tuple[Choices, ...]) -> ManyEffects:
        group = self.group
        distinct = list(dict.fromkeys(choices))
        terms = {c: self.terms(c, sense) for c in distinct}
        first = terms[distinct[0]]
        for other in terms.values():
            if not (np.array_equal(other.rows, first.rows)
                    and np.array_equal(other.weights, first.weights)):
                raise AssertionError("ranged values changed the terms of a case")
        shifts = np.stack([terms[c].shifts for c in choices]) if first.rows.size else np.zeros(
            (group.count, 0))
        constants = np.empty(group.count)
        for c in distinct:
            lines = np.array([i for i, own in enumerate(choices) if own == c])
            constants[lines] = terms[c].constant(group.row_totals[:, lines])
        constants = constants + self.constants[sense]
        pieces = shifted_sums(group.batch, first.rows, shifts, first.weights, constants)
        return ManyEffects(self.case, group.kind, sense, self.direction, pieces,
                           skeletons(pieces, RELATIVE_VALUE_TOLERANCE), choices)


def _single_range(solver: _Solver, senses: Sequence[str]) -> dict[str, list[Choices]] | None:
    """The exact ranged value for every line and sense (see
    :func:`vehicles.gaps.single_range_optimum`), or None when the range does not move a group
    of terms rigidly."""
    group, case = solver.group, solver.case
    count = group.count
    none = [None] * count
    value_tolerance = solver.effects(senses[0], none).skeletons.tolerances
    train = case.train
    assert train is not None
    (choice,) = train.ranges
    low, high = choice.low, choice.high
    found: dict[str, list[Choices]] = {}
    for sense in senses:
        if high <= low:
            found[sense] = [(low,)] * count
            continue
        sign = -1.0 if solver.direction == "forward" else 1.0
        at_low, at_high = solver.terms((low,), sense), solver.terms((high,), sense)
        rows, shifts, weights = at_low.rows, at_low.shifts, at_low.weights
        if rows.size != at_high.rows.size or not np.array_equal(rows, at_high.rows):
            return None
        moved_by = (at_high.shifts - shifts) * sign
        width = high - low
        tol = RIGID_TOLERANCE * max(width, float(np.abs(shifts).max(initial=0.0)), 1.0)
        moved = np.abs(moved_by - width) <= tol
        constant = at_low.constant(group.row_totals)
        if (not np.all(moved | (np.abs(moved_by) <= tol))
                or np.any(np.abs(at_high.constant(group.row_totals) - constant) > tol)):
            return None
        sense_sign = 1.0 if sense == "max" else -1.0
        constant = constant + solver.constants[sense]
        front, rear = (
            skeletons(shifted_sums(group.batch, rows[mask],
                                   np.broadcast_to(shifts[mask], (count, int(mask.sum()))),
                                   weights[mask], start), RELATIVE_VALUE_TOLERANCE)
            for mask, start in ((~moved, constant), (moved, np.zeros(count)))
        )
        ends = (solver.value(sense, [(low,)] * count), solver.value(sense, [(high,)] * count))
        best_end = np.where(ends[0] >= ends[1] - value_tolerance, low, high)
        top = np.maximum(ends[0], ends[1]) + value_tolerance
        values = _paired(front, rear, sense_sign, sign, low, high, top, best_end)
        found[sense] = [(float(v),) for v in values]
    return found


def _paired(front: RaggedSkeletons, rear: RaggedSkeletons, sense_sign: float, sign: float,
            low: float, high: float, top: np.ndarray, best_end: np.ndarray) -> np.ndarray:
    """For every line, the range value of the best feasible (front, rear) pair, or the better
    range end when no interior pair beats both ends."""
    result = best_end.astype(float)
    # no pair can beat the ends where the best front plus the best rear does not (rounding is
    # monotonic, so the bound holds in floating point too): pair only the other lines
    bound = (np.maximum.reduceat(sense_sign * front.values, front.offsets[:-1])
             + np.maximum.reduceat(sense_sign * rear.values, rear.offsets[:-1]))
    open_lines = np.flatnonzero(bound > top)
    if open_lines.size == 0:
        return result
    front_positions, front_values = front.padded(np.nan)
    rear_positions, rear_values = rear.padded(np.nan)
    wide = front_values.shape[1]
    block = max(1, PAIR_BLOCK // max(wide * rear_values.shape[1], 1))
    for start in range(0, open_lines.size, block):
        rows = open_lines[start : start + block]
        value = sense_sign * (front_values[rows, :, None] + rear_values[rows, None, :])
        chosen = sign * (rear_positions[rows, None, :] - front_positions[rows, :, None]) + low
        feasible = (chosen >= low) & (chosen <= high)
        interior = np.where(feasible, value, -np.inf).reshape(rows.size, -1)
        best = np.argmax(interior, axis=1)
        lines = np.arange(rows.size)
        winning = interior[lines, best]
        take = feasible.reshape(rows.size, -1).any(axis=1) & (winning > top[rows])
        picked = np.clip(chosen.reshape(rows.size, -1)[lines, best], low, high)
        result[rows] = np.where(take, picked, result[rows])
    return result
