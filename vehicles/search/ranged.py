"""The governing values of a train's ranged gaps and lengths, for many lines at once.

One range (the usual case: the AASHTO truck's rear spacing, a headway) is solved exactly. A range
splits the train's terms into a front group that stays put and a rear group that moves rigidly
with the chosen value v: E(x; v) = F(x) + R(x + s (v - low)) with s = -1 forward, +1 reverse.
The largest E over the lead position x and v in [low, high] is either at a range end (two exact
searches) or at an interior v, where x must be a local maximum of F and y = x + s (v - low) one of
R: both lie among the skeleton entries of F and R that are (weak) local maxima, so the best pair
with y inside the window of x is exact. For each candidate x the best y in its window is found by
a range-maximum query (a sparse table over R's candidates), not by pairing every x with every y.

Several ranges (two trucks with a headway and a ranged spacing) use a numeric search, line by
line: a grid that includes every range end, then bounded Brent refinements coordinate by
coordinate, with a bracket width ``tolerance`` [length] (default :data:`TOLERANCE_FRACTION` of
each range). The value used is reported with every placement.

Units: offsets and ranges [length]; effects [response x force].
"""

from __future__ import annotations

import itertools
from collections.abc import Callable, Sequence

import numpy as np

from piecewise.shifted import shifted_sums
from piecewise.skeleton import Skeletons, skeletons
from vehicles.errors import VehicleError
from vehicles.limits import MAX_RANGED
from vehicles.loadmodel import LoadCase
from vehicles.search.effects import Effects, RangedValues, build_effects
from vehicles.search.prepared import PreparedLines
from vehicles.search.terms import lane_constants, terms_of, travel_sign
from vehicles.train import RangedValue

TOLERANCE_FRACTION = 1e-4
"""Default Brent bracket for a ranged gap or length (several ranges), a fraction of its width."""

RIGID_TOLERANCE = 1e-9
"""Relative tolerance when checking that a range moves its group of terms rigidly."""


def adverse_values(effects: Effects) -> np.ndarray:
    """Each function's most adverse value: its largest (max) or minus its smallest (min)."""
    if effects.sense == "max":
        return effects.skeletons.highest()
    return -effects.skeletons.lowest()  # type: ignore[no-any-return]


def single_range_values(
    prepared: PreparedLines,
    lines: np.ndarray,
    case: LoadCase,
    *,
    kind: str,
    sense: str,
    direction: str,
    ends: tuple[Effects, Effects],
) -> np.ndarray | None:
    """The exact governing value [length] of a train's only range for each line, or None when
    the range does not move a group of terms rigidly (then the numeric search is used).

    Args:
        ends: the effect functions with the range at its low and at its high value, for
            ``sense`` and these lines.
    """
    train = case.train
    assert train is not None
    (ranged,) = train.ranged_values
    low, high = ranged.low, ranged.high
    count = lines.size
    if high <= low:
        return np.full(count, low)
    sign = travel_sign(direction)
    at_low = terms_of(case, train.arranged((low,)), direction, sense)
    at_high = terms_of(case, train.arranged((high,)), direction, sense)
    rows, shifts, weights = at_low.rows, at_low.shifts, at_low.weights
    if rows.size != at_high.rows.size or not np.array_equal(rows, at_high.rows):
        return None
    moved_by = (at_high.shifts - shifts) * sign
    width = high - low
    tol = RIGID_TOLERANCE * max(width, float(np.abs(shifts).max(initial=0.0)), 1.0)
    moved = np.abs(moved_by - width) <= tol
    row_totals = np.stack([prepared.tables.totals(row)[lines] for row in range(6)])
    constant = at_low.constant(row_totals)
    if (not np.all(moved | (np.abs(moved_by) <= tol))
            or np.any(np.abs(at_high.constant(row_totals) - constant) > tol)):
        return None
    sense_sign = 1.0 if sense == "max" else -1.0
    constant = constant + lane_constants(case, kind, prepared, sense)[lines]
    tables = prepared.tables.subset(lines)
    front, rear = (
        skeletons(shifted_sums(tables, rows[mask],
                               np.broadcast_to(shifts[mask], (count, int(mask.sum()))),
                               weights[mask], start))
        for mask, start in ((~moved, constant), (moved, np.zeros(count)))
    )
    end_values = (adverse_values(ends[0]), adverse_values(ends[1]))
    value_tolerance = ends[0].skeletons.tolerances
    best_end = np.where(end_values[0] >= end_values[1] - value_tolerance, low, high)
    top = np.maximum(end_values[0], end_values[1]) + value_tolerance
    return _paired(front, rear, sense_sign, sign, low, high, top, best_end)


def _weak_maxima(sk: Skeletons, sense_sign: float) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """(owner, position, signed value) of every entry no lower than its neighbours (within the
    tolerance): every local maximum of the function, plateau ends included."""
    values = sense_sign * sk.values
    owner = sk.owner
    tol = sk.tolerances[owner]
    before = np.concatenate([[-np.inf], values[:-1]])
    after = np.concatenate([values[1:], [-np.inf]])
    first = np.zeros(values.size, dtype=bool)
    first[sk.offsets[:-1]] = True
    last = np.zeros(values.size, dtype=bool)
    last[sk.offsets[1:] - 1] = True
    before = np.where(first, -np.inf, before)
    after = np.where(last, -np.inf, after)
    keep = (values >= before - tol) & (values >= after - tol)
    return owner[keep], sk.positions[keep], values[keep]


def _paired(front: Skeletons, rear: Skeletons, sense_sign: float, sign: float, low: float,
            high: float, top: np.ndarray, best_end: np.ndarray) -> np.ndarray:
    """For every line, the range value of the best feasible (front, rear) pair of local maxima,
    or the better range end when no interior pair beats both ends."""
    result = best_end.astype(float)
    bound = (np.maximum.reduceat(sense_sign * front.values, front.offsets[:-1])
             + np.maximum.reduceat(sense_sign * rear.values, rear.offsets[:-1]))
    if not np.any(bound > top):
        return result
    x_owner, x, x_value = _weak_maxima(front, sense_sign)
    y_owner, y, y_value = _weak_maxima(rear, sense_sign)
    if x.size == 0 or y.size == 0:
        return result
    width = high - low
    # y - x = sign (v - low) for v in [low, high]
    window_low, window_high = (x - width, x) if sign < 0 else (x, x + width)
    keys = y_owner + 1j * y
    first = np.searchsorted(keys, x_owner + 1j * window_low, side="left")
    stop = np.searchsorted(keys, x_owner + 1j * window_high, side="right")
    feasible = stop > first
    best_y = _range_argmax(y_value, first[feasible], stop[feasible])
    total = x_value[feasible] + y_value[best_y]
    owner = x_owner[feasible]
    chosen = np.clip(sign * (y[best_y] - x[feasible]) + low, low, high)
    # the best pair of each line, the first on ties
    order = np.lexsort((-total, owner))
    owner, total, chosen = owner[order], total[order], chosen[order]
    lead = np.ones(owner.size, dtype=bool)
    lead[1:] = owner[1:] != owner[:-1]
    owner, total, chosen = owner[lead], total[lead], chosen[lead]
    beats = total > top[owner]
    result[owner[beats]] = chosen[beats]
    return result


def _range_argmax(values: np.ndarray, first: np.ndarray, stop: np.ndarray) -> np.ndarray:
    """Index of the largest of ``values[first[i]:stop[i]]`` for every i (non-empty ranges):
    a sparse table of maxima over power-of-two stretches, two look-ups a query."""
    levels = [np.arange(values.size)]
    span = 1
    while 2 * span <= max(int((stop - first).max(initial=1)), 1):
        previous = levels[-1]
        head, tail = previous[:-span], previous[span:]
        levels.append(np.where(values[tail] > values[head], tail, head))
        span *= 2
    length = stop - first
    level = np.floor(np.log2(length)).astype(int)
    # guard the float logarithm at exact powers of two
    level = np.where(2 ** (level + 1) <= length, level + 1, level)
    level = np.where(2**level > length, level - 1, level)
    left = np.empty(first.size, dtype=np.int64)
    right = np.empty(first.size, dtype=np.int64)
    for k in np.unique(level):
        mask = level == k
        table = levels[k]
        left[mask] = table[first[mask]]
        right[mask] = table[stop[mask] - 2**k]
    return np.where(values[right] > values[left], right, left)


def numeric_values(
    prepared: PreparedLines,
    line: int,
    case: LoadCase,
    *,
    kind: str,
    sense: str,
    direction: str,
    tolerance: float | None,
) -> RangedValues:
    """The ranged values of one line by the numeric search (several ranges).

    Raises:
        VehicleError: for more than :data:`MAX_RANGED` ranges (the search would not end).
    """
    train = case.train
    assert train is not None
    if len(train.ranged_values) > MAX_RANGED:
        raise VehicleError(f"{len(train.ranged_values)} ranged gaps and lengths are more than "
                           f"{MAX_RANGED}", item=f"case {case.name}",
                           fix="fix some of them: the search for the governing values grows as "
                               "3 to the power of their number")
    lines = np.array([line])
    built: dict[RangedValues, float] = {}

    def objective(values: RangedValues) -> float:
        if values not in built:
            effects = build_effects(prepared, lines, case, kind=kind, sense=sense,
                                    direction=direction, ranged_values=[values])
            built[values] = float(adverse_values(effects)[0])
        return built[values]

    lows = tuple(r.low for r in train.ranged_values)
    first = build_effects(prepared, lines, case, kind=kind, sense=sense, direction=direction,
                          ranged_values=[lows])
    return optimal_values(objective, train.ranged_values, tolerance,
                          float(first.skeletons.tolerances[0]))


def optimal_values(
    objective: Callable[[RangedValues], float],
    ranges: Sequence[RangedValue],
    tolerance: float | None = None,
    value_tolerance: float = 0.0,
) -> RangedValues:
    """The values in the box of ``ranges`` that maximise ``objective`` (numeric).

    A grid that includes every range end (7 points for one range, 5 a range for two, 3 for
    more), then bounded Brent searches one coordinate at a time around the best point, repeated
    while a sweep improves the objective. Every value tried is remembered; the best is returned,
    the first one tried among those within ``value_tolerance`` of it (range ends come first).
    """
    from scipy.optimize import minimize_scalar

    lows = np.array([r.low for r in ranges])
    highs = np.array([r.high for r in ranges])
    tolerances = (np.full(len(ranges), tolerance) if tolerance is not None
                  else TOLERANCE_FRACTION * np.maximum(highs - lows, 1e-12))
    seen: dict[RangedValues, float] = {}

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

    def best_seen() -> RangedValues:
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

            def along(t: float, i: int = i, start: RangedValues = best) -> float:
                return -value((*start[:i], float(t), *start[i + 1 :]))

            minimize_scalar(along, bounds=bracket, method="bounded",
                            options={"xatol": float(tolerances[i])})
            best = best_seen()
        if seen[best] <= start + value_tolerance:
            break
    return best
