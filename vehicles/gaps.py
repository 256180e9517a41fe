"""The governing values of a train's ranged gaps and lengths.

One range (the usual case: the AASHTO truck's rear spacing, a headway) is solved exactly. A range
splits the train's terms into a front group that stays put and a rear group that moves rigidly
with the chosen value v: E(x; v) = A(x) + B(x + s (v - low)) with s = -1 forward, +1 reverse.
The largest E over the lead position x and v in [low, high] is either at a range end (two exact
one-dimensional searches) or at an interior v, where x must be a local maximum of A and
y = x + s (v - low) one of B: both lie among the skeleton entries of A and B (piece ends and
stationary points, :mod:`vehicles.extremes`), so the best pair within the window of v is exact.

Several ranges (two trucks with a headway and a ranged spacing) use a numeric search: a grid
that includes every range end, then bounded Brent refinements coordinate by coordinate, with a
bracket width ``gap_tolerance`` [length] (default ``GAP_TOLERANCE_FRACTION`` of each range).

Units: offsets and ranges [length]; effects [response x force].

Example:
    >>> from scipy.interpolate import PPoly
    >>> from vehicles.loadmodel import LoadCase
    >>> from vehicles.train import Axle, Train
    >>> L = 10.0  # two equal spans; M_B = -a b (L + a) / (4 L^2) in each span
    >>> hog = PPoly([[0.25 / L**2, -0.25 / L**2], [0.0, 0.75 / L], [-0.25, -0.5], [0.0, 0.0]],
    ...             [0.0, L, 2 * L])
    >>> pair = LoadCase("pair", Train("pair", (Axle(1.0), Axle(1.0, (1.0, 19.0)))))
    >>> e = best_effect(hog, pair, kind="moment", sense="min", direction="forward")
    >>> round(e.arrangement.choices[0], 9) == round(2 * L - 2 * L / 3**0.5, 9)
    True
"""

from __future__ import annotations

import itertools
from collections.abc import Callable, Sequence

import numpy as np
from scipy.interpolate import PPoly
from scipy.optimize import minimize_scalar

from vehicles.effect import (
    EffectFunction,
    PreparedInfluence,
    constant_terms,
    effect_function,
    effect_terms,
    prepare,
    resensed,
    sense_dependent,
    summed,
)
from vehicles.extremes import skeleton
from vehicles.loadmodel import LoadCase
from vehicles.train import Choice

GAP_TOLERANCE_FRACTION = 1e-4
"""Default Brent bracket for a ranged gap or length (several ranges), a fraction of its width."""

RIGID_TOLERANCE = 1e-9
"""Relative tolerance when checking that a range moves its group of terms rigidly."""


def best_effect(
    influence: PPoly | PreparedInfluence,
    case: LoadCase,
    *,
    kind: str,
    sense: str,
    direction: str,
    gap_tolerance: float | None = None,
) -> EffectFunction:
    """The effect function at the ranged values that give the most adverse extreme.

    Args:
        influence: response per unit downward load against chainage [length].
        case: the load case.
        kind, sense, direction: as for :func:`vehicles.effect.effect_function`.
        gap_tolerance: Brent bracket width [length] when the train has several ranges.
    """
    return best_effects(influence, case, kind=kind, senses=(sense,), direction=direction,
                        gap_tolerance=gap_tolerance)[sense]


def best_effects(
    influence: PPoly | PreparedInfluence,
    case: LoadCase,
    *,
    kind: str,
    senses: Sequence[str],
    direction: str,
    gap_tolerance: float | None = None,
) -> dict[str, EffectFunction]:
    """:func:`best_effect` for several senses, sharing every effect function built.

    Unless :func:`vehicles.effect.sense_dependent`, the effect functions for the largest and the
    smallest effect differ by a constant, so one build per set of ranged values serves both.
    """
    prepared = prepare(influence)
    shared = not sense_dependent(case)
    built: dict[tuple[str, tuple[float, ...] | None], tuple[EffectFunction, float, float]] = {}
    min_shift = 0.0
    if shared:
        min_shift = (constant_terms(prepared, case, kind, "min")
                     - constant_terms(prepared, case, kind, "max"))

    def evaluated(sense: str, choices: tuple[float, ...] | None) -> tuple[EffectFunction, float]:
        """An effect function for these values and its most adverse value for ``sense``
        (for "min", minus the smallest value, so that larger is more adverse either way)."""
        key = ("max" if shared else sense, choices)
        if key not in built:
            effect = effect_function(prepared, case, kind=kind, sense=key[0],
                                     direction=direction, choices=choices)
            values = effect.skeleton.values
            built[key] = (effect, float(values.max()), float(values.min()))
        effect, high, low = built[key]
        if sense == "max":
            return effect, high
        return effect, -(low + (min_shift if effect.sense != sense else 0.0))

    ranges = case.train.ranges if case.train is not None else ()
    best: dict[str, tuple[float, ...] | None] = dict.fromkeys(senses)
    if ranges:
        # gains below rounding of the effect's magnitude do not move the choice off a range end
        value_tolerance = evaluated(senses[0], None)[0].skeleton.tolerance
        for sense in senses:

            def objective(choices: tuple[float, ...], sense: str = sense) -> float:
                return evaluated(sense, choices)[1]

            def end_value(v: float, sense: str = sense) -> float:
                return evaluated(sense, (v,))[1]

            exact = None
            if len(ranges) == 1:
                exact = single_range_optimum(
                    prepared, case, kind=kind, sense=sense, direction=direction,
                    end_value=end_value, value_tolerance=value_tolerance)
            if exact is not None:
                best[sense] = (exact,)
                continue
            best[sense] = optimal_choices(objective, ranges, gap_tolerance, value_tolerance)
    return {sense: resensed(evaluated(sense, best[sense])[0], prepared, sense)
            for sense in senses}


def single_range_optimum(
    prepared: PreparedInfluence,
    case: LoadCase,
    *,
    kind: str,
    sense: str,
    direction: str,
    end_value: Callable[[float], float],
    value_tolerance: float = 0.0,
) -> float | None:
    """The exact governing value [length] of a train's only range, or None if the range does not
    move a group of terms rigidly (then a numeric search is used).

    Args:
        end_value: the most adverse effect with the range at a given value (the largest E, or
            minus the smallest for "min"), used at the two range ends.
    """
    train = case.train
    if train is None or len(train.ranges) != 1:
        return None
    (choice,) = train.ranges
    low, high = choice.low, choice.high
    if high <= low:
        return low
    sign = -1.0 if direction == "forward" else 1.0
    at_low = effect_terms(prepared, case, train.arranged((low,)), direction, sense)
    at_high = effect_terms(prepared, case, train.arranged((high,)), direction, sense)
    rows, shifts, weights, constant = at_low
    if rows.size != at_high[0].size or not np.array_equal(rows, at_high[0]):
        return None
    moved_by = (at_high[1] - shifts) * sign
    width = high - low
    tol = RIGID_TOLERANCE * max(width, float(np.abs(shifts).max(initial=0.0)), 1.0)
    moved = np.abs(moved_by - width) <= tol
    if not np.all(moved | (np.abs(moved_by) <= tol)) or abs(at_high[3] - constant) > tol:
        return None
    sense_sign = 1.0 if sense == "max" else -1.0
    constant += constant_terms(prepared, case, kind, sense)
    front = skeleton(summed(prepared, rows[~moved], shifts[~moved], weights[~moved], constant))
    rear = skeleton(summed(prepared, rows[moved], shifts[moved], weights[moved], 0.0))
    # pair every candidate of the front group with every candidate of the rear group whose
    # lead position y = x + sign (v - low) puts v inside the range
    value = sense_sign * (front.values[:, None] + rear.values[None, :])
    chosen = sign * (rear.positions[None, :] - front.positions[:, None]) + low
    feasible = (chosen >= low) & (chosen <= high)
    ends = [end_value(low), end_value(high)]
    best_end = low if ends[0] >= ends[1] - value_tolerance else high
    if not feasible.any():
        return best_end
    interior = np.where(feasible, value, -np.inf)
    i, j = np.unravel_index(int(np.argmax(interior)), interior.shape)
    if interior[i, j] <= max(ends) + value_tolerance:
        return best_end
    return float(np.clip(chosen[i, j], low, high))


def optimal_choices(
    objective: Callable[[tuple[float, ...]], float],
    ranges: Sequence[Choice],
    gap_tolerance: float | None = None,
    value_tolerance: float = 0.0,
) -> tuple[float, ...]:
    """The values in the box of ``ranges`` that maximise ``objective`` (numeric).

    A grid that includes every range end (7 points for one range, 5 a range for two, 3 for
    more), then bounded Brent searches one coordinate at a time around the best point, repeated
    while a sweep improves the objective. Every value tried is remembered; the best is returned,
    the first one tried among those within ``value_tolerance`` of it (range ends come first).
    """
    lows = np.array([r.low for r in ranges])
    highs = np.array([r.high for r in ranges])
    tolerances = (np.full(len(ranges), gap_tolerance) if gap_tolerance is not None
                  else GAP_TOLERANCE_FRACTION * np.maximum(highs - lows, 1e-12))
    seen: dict[tuple[float, ...], float] = {}

    def value(point: Sequence[float]) -> float:
        key = tuple(float(v) for v in point)
        if key not in seen:
            seen[key] = objective(key)
        return seen[key]

    per_range = {1: 7, 2: 5}.get(len(ranges), 3)
    axes = [np.unique(np.linspace(lo, hi, per_range)) for lo, hi in zip(lows, highs, strict=True)]
    inner = [set(axis[1:-1].tolist()) for axis in axes]
    for point in sorted(itertools.product(*axes),
                        key=lambda p: sum(v in s for v, s in zip(p, inner, strict=True))):
        value(point)

    def best_seen() -> tuple[float, ...]:
        top = max(seen.values())
        return next(k for k, v in seen.items() if v >= top - value_tolerance)

    best = best_seen()
    for _ in range(4):
        start = seen[best]
        for i, axis in enumerate(axes):
            k = int(np.searchsorted(axis, best[i]))
            bracket = (axis[max(k - 1, 0)], axis[min(k + 1, axis.size - 1)])
            if bracket[1] - bracket[0] <= tolerances[i]:
                continue

            def along(t: float, i: int = i, start: tuple[float, ...] = best) -> float:
                return -value((*start[:i], float(t), *start[i + 1 :]))

            minimize_scalar(along, bounds=bracket, method="bounded",
                            options={"xatol": float(tolerances[i])})
            best = best_seen()
        if seen[best] <= start + value_tolerance:
            break
    return best
