"""The one governing search: exact worst-case placement of load models on influence lines, a
whole batch at once (one line is a batch of one).

For every case of every load model that applies to a line (its scope, given the response kind,
the sense and whether the line is interior), in both travel directions, the effect function
E(lead position) is built exactly (:mod:`vehicles.search.effects`) and every piece is examined:
its two end limits and its interior stationary points. The train enters from off the structure
and leaves completely; nothing is sampled. Ranged gaps and lengths are chosen as
:mod:`vehicles.search.ranged` explains, and the values used are reported.

A case is searched on a line only if a proven upper bound of what it can do there
(:func:`vehicles.search.terms.upper_bounds`) reaches the best effect already found: the case
with the largest bound is searched first, the others only where they could still govern. The
result is the same as searching every case; only the work is less.

Sign conventions are the README's (loads down; sagging moment positive); values carry the units
of the influence line times those of the load model ([kN m], [kip ft], ...).

Example:
    >>> from piecewise import Piecewise
    >>> from vehicles.loadmodel import LoadCase, LoadModel
    >>> from vehicles.train import Axle, Train
    >>> L = 20.0  # [ft]; H20 truck on the midspan moment line, peak ordinate L/4
    >>> moment = Piecewise(np.array([0.0, L / 2, L]), np.array([[0.0, L / 4], [0.5, -0.5]]))
    >>> h20 = LoadModel("H20", "H20 truck", "kip-ft",
    ...                 (LoadCase("truck", Train("H20", (Axle(8.0), Axle(32.0, 14.0)))),))
    >>> result = govern(moment, h20, kind="moment", section=L / 2)
    >>> round(result.max.value, 6), result.max.section_axle  # the 32 kip axle over the section
    (160.0, 1)
    >>> result.min is None  # the line is never negative: no smallest effect
    True
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from piecewise.skeleton import Peak
from vehicles.errors import VehicleError
from vehicles.loadmodel import LoadCase, LoadModel
from vehicles.search.effects import Effects, RangedValues, build_effects
from vehicles.search.placement import (
    POSITION_TOLERANCE_FRACTION,
    Placement,
    best_placements,
    chosen_peaks,
    distinct,
    placement_at,
    ranked,
)
from vehicles.search.prepared import PreparedLines, prepare
from vehicles.search.ranged import adverse_values, numeric_values, single_range_values
from vehicles.search.terms import DIRECTIONS, check_request, sense_dependent, upper_bounds

CHUNK = 1024
"""Lines searched together: bounds the memory of a batch."""

BOUND_MARGIN = 1e-9
"""A case is skipped on a line only when its bound falls short of the best effect found by
more than this fraction [-] of that effect (rounding of the bound's arithmetic)."""

SENSES = ("max", "min")


@dataclass(frozen=True)
class Governing:
    """The governing placements of one or more load models for one response.

    Attributes:
        kind: response kind.
        max, min: the largest and the smallest effect; None when no case applies, or when the
            extreme is zero (no load position gives an effect of that sign beyond round-off:
            no governing vehicle is placed).
        top_max, top_min: distinct local extremes (separate peaks, none the mirror image of
            another, none zero), largest (smallest) first; every applicable case and direction
            contributes its own peaks.
        ranged_tolerance: the bracket width used for trains with several ranges [length] (None:
            :data:`vehicles.search.ranged.TOLERANCE_FRACTION` of each range); a single range is
            exact.
    """

    kind: str
    max: Placement | None
    min: Placement | None
    top_max: tuple[Placement, ...]
    top_min: tuple[Placement, ...]
    ranged_tolerance: float | None


@dataclass(frozen=True)
class Visit:
    """One (model, case, direction) the search tries, and the senses the case applies to."""

    index: int
    model: LoadModel
    case: LoadCase
    senses: tuple[str, ...]
    direction: str


def visits(models: Sequence[LoadModel], kind: str, interior: bool,
           directions: Sequence[str]) -> Iterator[Visit]:
    """Every (model, case, direction) in the order the search ranks ties."""
    index = 0
    for model in models:
        for case in model.cases:
            senses = tuple(s for s in SENSES if case.applies_to(kind, s, interior=interior))
            if not senses:
                continue
            ways = tuple(directions) if case.train is not None else ("forward",)
            for direction in ways:
                yield Visit(index, model, case, senses, direction)
                index += 1


def govern(
    line: Any,
    models: LoadModel | Sequence[LoadModel],
    *,
    kind: str,
    interior: bool = False,
    section: float | None = None,
    top: int = 1,
    directions: Sequence[str] = DIRECTIONS,
    ranged_tolerance: float | None = None,
) -> Governing:
    """The exact largest and smallest effects of load models on one influence line.

    Args:
        line: response per unit downward load against path chainage [length]: a
            :class:`piecewise.Piecewise`, a scipy PPoly or an influence-line object.
        models: one load model or several; the worst case of all governs.
        kind: response kind ("moment", "shear", ...): picks scopes and knife-edge loads.
        interior: the response lies in the interior region a case's scope may name (a reaction
            at a support that is not at an end of the path; a moment between the points of
            contraflexure).
        section: chainage of the section [length], to report which axle stands over it.
        top: how many distinct local extremes to list for each sense.
        directions: travel directions to try.
        ranged_tolerance: Brent bracket width for trains with several ranges [length].

    Returns:
        The governing placements; ``max``/``min`` are None when no case applies to that sense.
    """
    return govern_many([line], models, kinds=[kind], interiors=[interior], sections=[section],
                       top=top, directions=directions, ranged_tolerance=ranged_tolerance)[0]


def govern_many(
    lines: Sequence[Any],
    models: LoadModel | Sequence[LoadModel],
    *,
    kinds: Sequence[str],
    interiors: Sequence[bool] | None = None,
    sections: Sequence[float | None] | None = None,
    top: int = 1,
    directions: Sequence[str] = DIRECTIONS,
    ranged_tolerance: float | None = None,
) -> list[Governing]:
    """:func:`govern` for every line, computed together.

    Args:
        lines: responses per unit downward load against path chainage [length].
        models: one load model or several; the worst case of all governs each line.
        kinds: each line's response kind.
        interiors: whether each line is interior (see :func:`govern`; default none is).
        sections: each line's section chainage [length] (to report the axle over it).
        top, directions, ranged_tolerance: as for :func:`govern`.

    Returns:
        One :class:`Governing` a line, in order.
    """
    if isinstance(models, LoadModel):
        models = (models,)
    count = len(lines)
    interiors = [False] * count if interiors is None else list(interiors)
    sections = [None] * count if sections is None else list(sections)
    if not len(kinds) == len(interiors) == len(sections) == count:
        raise VehicleError(
            f"{count} lines with {len(kinds)} kinds, {len(interiors)} interior flags and "
            f"{len(sections)} sections", item="govern_many", fix="give one of each a line")
    if top < 1:
        raise VehicleError(f"top = {top}", item="top", fix="ask for at least one placement")
    if not directions:
        raise VehicleError("no travel direction given", item="directions",
                           fix="give forward, reverse or both")
    for kind in set(kinds):
        for direction in directions:
            check_request(kind, "max", direction)
    found: list[Governing | None] = [None] * count
    groups: dict[tuple[str, bool], list[int]] = {}
    for i in range(count):
        groups.setdefault((kinds[i], bool(interiors[i])), []).append(i)
    for (kind, interior), members in groups.items():
        for start in range(0, len(members), CHUNK):
            chunk = members[start : start + CHUNK]
            search = _Search(prepare([lines[i] for i in chunk]), kind,
                             list(visits(models, kind, interior, directions)), ranged_tolerance)
            results = search.governing(top, [sections[i] for i in chunk])
            for i, result in zip(chunk, results, strict=True):
                found[i] = result
    return [g for g in found if g is not None]


@dataclass
class _Best:
    """The best effect found so far for every line, for one sense."""

    values: np.ndarray
    visit: np.ndarray
    effects: list[Effects | None] = field(default_factory=list)
    position: np.ndarray = field(default_factory=lambda: np.zeros(0, dtype=int))

    def offer(self, visit: int, effects: Effects, values: np.ndarray) -> None:
        """Take the candidates that beat the best, or tie it from an earlier visit."""
        lines = effects.lines
        better = (values > self.values[lines]) | (
            (values == self.values[lines]) & (visit < self.visit[lines]))
        for k in np.flatnonzero(better):
            line = int(lines[k])
            self.values[line] = values[k]
            self.visit[line] = visit
            self.effects[line] = effects
            self.position[line] = k


class _Search:
    """The search of one group of lines (one kind, one interior flag)."""

    def __init__(self, prepared: PreparedLines, kind: str, visits: list[Visit],
                 ranged_tolerance: float | None) -> None:
        self.prepared = prepared
        self.kind = kind
        self.visits = visits
        self.ranged_tolerance = ranged_tolerance

    # ---------------------------------------------------------------- evaluation

    def evaluate(self, visit: Visit, wanted: dict[str, np.ndarray]) -> dict[str, Effects]:
        """The effect functions of ``visit`` on the lines wanted for each sense, at the ranged
        values that govern each line and sense."""
        case = visit.case
        ranges = case.train.ranged_values if case.train is not None else ()
        wanted = {s: lines for s, lines in wanted.items() if lines.size}
        if not ranges:
            return self._fixed(visit, wanted)
        found = {}
        for sense, lines in wanted.items():
            values = self._ranged(visit, sense, lines)
            found[sense] = self._build(visit, sense, lines, values)
        return found

    def _fixed(self, visit: Visit, wanted: dict[str, np.ndarray]) -> dict[str, Effects]:
        """Cases without ranges: one build serves both senses unless the varying terms differ."""
        case = visit.case
        if sense_dependent(case) or len(wanted) < 2:
            return {s: self._build(visit, s, lines, [()] * lines.size)
                    for s, lines in wanted.items()}
        union = np.union1d(wanted["max"], wanted["min"])
        shared = self._build(visit, "max", union, [()] * union.size)
        return {"max": self._pick(shared, wanted["max"]),
                "min": self._pick(self._min_of(shared), wanted["min"])}

    def _min_of(self, shared: Effects) -> Effects:
        from vehicles.search.terms import lane_constants

        lines = shared.lines
        shift = (lane_constants(shared.case, self.kind, self.prepared, "min")
                 - lane_constants(shared.case, self.kind, self.prepared, "max"))[lines]
        return shared.shifted("min", shift)

    @staticmethod
    def _pick(effects: Effects, lines: np.ndarray) -> Effects:
        """The functions of ``effects`` for these lines (a subset of its own)."""
        if np.array_equal(effects.lines, lines):
            return effects
        where = np.searchsorted(effects.lines, lines)
        functions = effects.functions.subset(where)
        sk = effects.skeletons
        owner = sk.owner
        keep = np.isin(owner, where)
        sizes = np.diff(sk.offsets)[where]
        from piecewise.skeleton import Skeletons

        skeletons = Skeletons(sk.positions[keep], sk.values[keep], sk.sides[keep],
                              np.concatenate([[0], np.cumsum(sizes)]), sk.tolerances[where])
        return Effects(effects.case, effects.kind, effects.sense, effects.direction, lines,
                       tuple(effects.ranged_values[i] for i in where), functions, skeletons)

    def _build(self, visit: Visit, sense: str, lines: np.ndarray,
               values: Sequence[RangedValues]) -> Effects:
        return build_effects(self.prepared, lines, visit.case, kind=self.kind, sense=sense,
                             direction=visit.direction, ranged_values=values)

    def _ranged(self, visit: Visit, sense: str, lines: np.ndarray) -> list[RangedValues]:
        case = visit.case
        assert case.train is not None
        ranges = case.train.ranged_values
        if len(ranges) == 1:
            low, high = ranges[0].low, ranges[0].high
            ends = (self._build(visit, sense, lines, [(low,)] * lines.size),
                    self._build(visit, sense, lines, [(high,)] * lines.size))
            exact = single_range_values(self.prepared, lines, case, kind=self.kind,
                                        sense=sense, direction=visit.direction, ends=ends)
            if exact is not None:
                return [(float(v),) for v in exact]
        return [numeric_values(self.prepared, int(line), case, kind=self.kind, sense=sense,
                               direction=visit.direction, tolerance=self.ranged_tolerance)
                for line in lines]

    # ---------------------------------------------------------------- the search

    def governing(self, top: int, sections: Sequence[float | None]) -> list[Governing]:
        count = self.prepared.count
        tops: dict[str, list[list[Placement]]] = {}
        for sense in SENSES:
            applicable = [v for v in self.visits if sense in v.senses]
            if not applicable:
                tops[sense] = [[] for _ in range(count)]
            elif top == 1:
                tops[sense] = self._described(self._best(sense, applicable), sections)
            else:
                tops[sense] = self._tops(sense, applicable, top, sections)
        return [Governing(self.kind, tops["max"][k][0] if tops["max"][k] else None,
                          tops["min"][k][0] if tops["min"][k] else None,
                          tuple(tops["max"][k]), tuple(tops["min"][k]), self.ranged_tolerance)
                for k in range(count)]

    def _best(self, sense: str, applicable: list[Visit]) -> _Best:
        """The most adverse effect of every line, searching a case only where its bound can
        reach the best found so far."""
        count = self.prepared.count
        bounds = np.stack([self._bounds(v.case, sense) for v in applicable])
        best = _Best(np.full(count, -np.inf), np.full(count, len(self.visits)),
                     [None] * count, np.zeros(count, dtype=int))
        searched = np.zeros(bounds.shape, dtype=bool)
        # first the case with the largest bound on each line ...
        first = np.argmax(bounds, axis=0)
        for i in np.unique(first):
            self._search(applicable[int(i)], sense, np.flatnonzero(first == i), best)
            searched[i, first == i] = True
        # ... then every other case, on the lines where its bound can reach the best found
        for i, visit in enumerate(applicable):
            reach = bounds[i] >= best.values - BOUND_MARGIN * np.abs(best.values)
            lines = np.flatnonzero(~searched[i] & reach)
            if lines.size:
                self._search(visit, sense, lines, best)
        return best

    def _search(self, visit: Visit, sense: str, lines: np.ndarray, best: _Best) -> None:
        effects = self.evaluate(visit, {sense: lines})[sense]
        best.offer(visit.index, effects, adverse_values(effects))

    def _bounds(self, case: LoadCase, sense: str) -> np.ndarray:
        return upper_bounds(case, self.kind, self.prepared, sense)

    def _described(self, best: _Best, sections: Sequence[float | None]) -> list[list[Placement]]:
        """The winning placement of every line, described a winning effects object at a time."""
        found: list[list[Placement]] = [[] for _ in range(self.prepared.count)]
        groups: dict[int, tuple[Effects, list[int]]] = {}
        for line, effects in enumerate(best.effects):
            if effects is not None:
                groups.setdefault(id(effects), (effects, []))[1].append(line)
        for effects, lines in groups.values():
            sign = 1.0 if effects.sense == "max" else -1.0
            model = self.visits[int(best.visit[lines[0]])].model.name
            placements = best_placements(effects, best.position[lines], self.prepared, model,
                                         [sections[line] for line in lines])
            tolerances = effects.skeletons.tolerances[best.position[lines]]
            for line, placement, tolerance in zip(lines, placements, tolerances, strict=True):
                if sign * placement.value > tolerance:  # a zero extreme is none
                    found[line] = [placement]
        return found

    def _tops(self, sense: str, applicable: list[Visit], top: int,
              sections: Sequence[float | None]) -> list[list[Placement]]:
        count = self.prepared.count
        every: list[list[Placement]] = [[] for _ in range(count)]
        lines = np.arange(count)
        sign = 1.0 if sense == "max" else -1.0
        for visit in applicable:
            effects = self.evaluate(visit, {sense: lines})[sense]
            for k in range(count):
                sk = effects.skeletons.function(k)
                signed = sk if sense == "max" else sk.negated()
                breaks, _ = effects.functions.function(k)
                # twice as many as wanted: mirror images of one placement count once
                for peak in chosen_peaks(signed, breaks, 2 * top):
                    if peak.value <= sk.tolerance:
                        continue  # not beyond zero: no extreme
                    every[k].append(placement_at(
                        effects, k, self.prepared, visit.model.name,
                        Peak(peak.position, sign * peak.value, peak.side), section=sections[k]))
        tolerances = POSITION_TOLERANCE_FRACTION * np.maximum(
            self.prepared.ends - self.prepared.starts, 1.0)
        return [distinct(ranked(found, sense), float(tolerances[k]))[:top]
                for k, found in enumerate(every)]
