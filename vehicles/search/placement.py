"""Where a load case stands to give an extreme, and everything it places there.

A :class:`Placement` describes one peak of an effect function: the lead position, every axle's
chainage and factored load, the ranged values used, the train's patches and the lane segments
on the path, the knife-edge load, which axle stands over the section, and the side taken where
the effect jumps. Chainages [length], loads [force], intensities [force/length], values
[response x force].
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from piecewise.skeleton import Peak, Skeleton, distinct_peaks
from piecewise.tolerances import VALUE
from vehicles.search.effects import Effects
from vehicles.search.prepared import PreparedLines
from vehicles.search.terms import travel_sign
from vehicles.train import RangedValue

POSITION_TOLERANCE_FRACTION = 1e-9
"""An axle within this fraction of the path length of the section (or of a jump of the line)
is reported as standing over it."""


@dataclass(frozen=True)
class Placement:
    """Where a load case stands to give one extreme effect, and what it places.

    Attributes:
        value: the effect [response x force], e.g. [kN m] for a moment.
        sense: "max" or "min".
        model: load model name.
        case: load case name.
        direction: "forward" or "reverse" ("forward" for a case without a train).
        lead_position: chainage of the train's reference point [length].
        axle_positions: chainage of every axle, front to rear as the train is described [length].
        axle_loads: every axle's load as placed: factored, P x factor x (1 + axle_allowance)
            [force].
        ranged_values: the values used for the train's ranged gaps and lengths.
        patch_segments: (start, end, intensity) of the train's patches on the path: chainages
            [length] and factored intensity [force/length].
        lane_segments: (start, end) chainages [length] where the lane load acts.
        lane_intensity: factored lane load, lane x factor x (1 + lane_allowance) [force/length].
        knife_edge_position: chainage of the knife-edge load [length], None if there is none.
        knife_edge_load: factored knife-edge load [force] (0 if none).
        section_axle: index of the axle standing over ``section``, None if none does.
        limit_side: "left" or "right" when the effect jumps at this lead position and the value
            is that one-sided limit (every load nudged toward lower or higher chainage), else
            None.
        axles_at_jump: indices of the axles standing exactly on a jump of the influence line.
        neglected_axles: indices of the axles left off because they stand where the line is not
            adverse (cases that neglect relieving axles); their ``axle_loads`` are 0.
    """

    value: float
    sense: str
    model: str
    case: str
    direction: str
    lead_position: float
    axle_positions: tuple[float, ...]
    axle_loads: tuple[float, ...]
    ranged_values: tuple[RangedValue, ...]
    patch_segments: tuple[tuple[float, float, float], ...]
    lane_segments: tuple[tuple[float, float], ...]
    lane_intensity: float
    knife_edge_position: float | None
    knife_edge_load: float
    section_axle: int | None
    limit_side: str | None
    axles_at_jump: tuple[int, ...]
    neglected_axles: tuple[int, ...] = ()


def is_loaded(peak_position: float, peak_side: str | None, breaks: np.ndarray) -> bool:
    """Whether a peak of an effect function lies where it varies (not on an outer constant)."""
    return bool(breaks[1] <= peak_position < breaks[-2]
                or (peak_position == breaks[-2] and peak_side == "left"))


def chosen_peaks(sk: Skeleton, breaks: np.ndarray, count: int) -> list[Peak]:
    """Up to ``count`` distinct peaks of a skeleton signed so that larger is more adverse, on an
    effect function with breakpoints ``breaks`` (lead positions [length]).

    Peaks where the train is entirely off the path are listed only when nothing on the path is
    as adverse; the train is then reported standing just off it.
    """
    peaks = distinct_peaks(sk, count + 2)
    loaded = [p for p in peaks if is_loaded(p.position, p.side, breaks)]
    unloaded = [p for p in peaks if not is_loaded(p.position, p.side, breaks)]
    chosen = loaded[:count]
    if unloaded and (not loaded or unloaded[0].value >= loaded[0].value - sk.tolerance):
        # nothing on the path is as adverse as any loaded position: say so with the train off
        edge = float(breaks[1] if unloaded[0].position < breaks[1] else breaks[-2])
        chosen = [Peak(edge, unloaded[0].value, None), *loaded[: count - 1]]
    return chosen


def placement_at(effects: Effects, k: int, prepared: PreparedLines, model: str, peak: Peak,
                 *, section: float | None = None) -> Placement:
    """Describe the loads of function ``k`` of ``effects`` with the lead at ``peak.position``.

    Args:
        effects: the effect functions.
        k: which of them.
        prepared: the prepared batch the effects were built on.
        model: load model name.
        peak: the peak: lead position [length], value (signed as the effect), side.
        section: chainage of the section [length], to report the axle over it.
    """
    case = effects.case
    line = int(effects.lines[k])
    arrangement = effects.arrangement(k)
    lead = peak.position
    sign = travel_sign(effects.direction)
    start, end = float(prepared.starts[line]), float(prepared.ends[line])
    scale = case.factor
    ranged: tuple[RangedValue, ...] = ()
    patch_segments: list[tuple[float, float, float]] = []
    footprint = None
    positions = loads = np.zeros(0)
    if arrangement is not None:
        positions = lead + sign * arrangement.axle_offsets
        loads = scale * (1 + case.axle_allowance) * arrangement.axle_loads
        ranged = arrangement.ranged_values
        for a, b, q in zip(arrangement.patch_starts, arrangement.patch_ends,
                           arrangement.patch_intensities, strict=True):
            low, high = sorted((lead + sign * a, lead + sign * b))
            low, high = max(low, start), min(high, end)
            if low < high:
                patch_segments.append((low, high, scale * (1 + case.patch_allowance) * q))
        if case.lane_clear_of_train is not None:
            front, rear = arrangement.extent
            clear = case.lane_clear_of_train
            ends = sorted((lead + sign * (front - clear), lead + sign * (rear + clear)))
            footprint = (ends[0], ends[1])
    neglected: tuple[int, ...] = ()
    if case.neglect_relieving_axles and positions.size:
        ordinates = prepared.split.values(np.full(positions.size, line), positions,
                                          side=peak.side or "right")
        adverse = ordinates > 0 if effects.sense == "max" else ordinates < 0
        neglected = tuple(int(i) for i in np.flatnonzero(~adverse))
        loads = np.where(adverse, loads, 0.0)
    lane_intensity = scale * (1 + case.lane_allowance) * case.lane
    lane_segments = (_cleared(prepared.adverse_segments(line, effects.sense), footprint)
                     if case.lane > 0 else ())
    ordinates, where = prepared.adverse_ordinates(effects.sense)
    knife = case.knife_edge_for(effects.kind)
    has_knife = ordinates[line] != 0 and knife > 0
    tol = POSITION_TOLERANCE_FRACTION * max(end - start, 1.0)
    section_axle = None
    if section is not None and positions.size:
        distance = np.abs(positions - section)
        if distance.min() <= tol:
            section_axle = int(np.argmin(distance))
    jumps = prepared.jumps[line]
    at_jump = tuple(int(i) for i in np.flatnonzero(
        (np.abs(positions[:, None] - jumps[None, :]) <= tol).any(axis=1)))
    return Placement(
        value=peak.value,
        sense=effects.sense,
        model=model,
        case=case.name,
        direction=effects.direction,
        lead_position=lead if arrangement is not None else start,
        axle_positions=tuple(float(p) for p in positions),
        axle_loads=tuple(float(p) for p in loads),
        ranged_values=ranged,
        patch_segments=tuple(patch_segments),
        lane_segments=lane_segments,
        lane_intensity=lane_intensity,
        knife_edge_position=float(where[line]) if has_knife else None,
        knife_edge_load=scale * (1 + case.lane_allowance) * knife if has_knife else 0.0,
        section_axle=section_axle,
        limit_side=peak.side,
        axles_at_jump=at_jump,
        neglected_axles=neglected,
    )


def _cleared(segments: tuple[tuple[float, float], ...],
             footprint: tuple[float, float] | None) -> tuple[tuple[float, float], ...]:
    if footprint is None:
        return segments
    kept: list[tuple[float, float]] = []
    for start, end in segments:
        for piece in ((start, min(end, footprint[0])), (max(start, footprint[1]), end)):
            if piece[1] > piece[0]:
                kept.append(piece)
    return tuple(kept)


def is_mirror(first: Placement, second: Placement, tolerance: float) -> bool:
    """Whether two placements of one case are one placement seen twice: the same loads at the
    same chainages, or at chainages mirrored about one point (a forward placement and its reverse
    on a symmetric line, or a symmetric train's two halves), with the same value.

    Args:
        first, second: the placements.
        tolerance: positions closer than this are one [length]; values closer than
            :data:`~piecewise.tolerances.VALUE` of the larger are one.

    Example (a 10-unit two-axle train on a line symmetric about 40: forward with the heavy axle
    at 40, and reverse with it at 40, stand as mirror images):
        >>> def at(lead, direction, positions):
        ...     return Placement(5.0, "max", "M", "pair", direction, lead, positions,
        ...                      (2.0, 8.0), (), (), (), 0.0, None, 0.0, 1, None, ())
        >>> is_mirror(at(44.0, "forward", (44.0, 40.0)), at(36.0, "reverse", (36.0, 40.0)),
        ...           1e-9)
        True
        >>> is_mirror(at(44.0, "forward", (44.0, 40.0)), at(45.0, "reverse", (45.0, 41.0)),
        ...           1e-9)
        False
    """
    if (first.model, first.case) != (second.model, second.case):
        return False
    if abs(first.value - second.value) > VALUE * max(abs(first.value), abs(second.value)):
        return False
    own = _loads_placed(first)
    other = _loads_placed(second)
    if len(own) != len(other):
        return False
    if _same(own, other, tolerance):
        return True
    if not own:
        return False
    centre = 0.5 * (min(x for x, _ in own) + max(x for x, _ in other))
    return _same(sorted((2 * centre - x, w) for x, w in own), other, tolerance)


def _loads_placed(placement: Placement) -> list[tuple[float, float]]:
    """(chainage, load) of every axle, patch end and knife edge, and the lane's ends, sorted."""
    found = [(x, w) for x, w in zip(placement.axle_positions, placement.axle_loads, strict=True)
             if w != 0.0]
    for start, end, q in placement.patch_segments:
        found += [(start, q), (end, q)]
    for start, end in placement.lane_segments:
        found += [(start, -1.0), (end, -1.0)]
    if placement.knife_edge_position is not None:
        found.append((placement.knife_edge_position, placement.knife_edge_load))
    return sorted(found)


def _same(first: list[tuple[float, float]], second: list[tuple[float, float]],
          tolerance: float) -> bool:
    return len(first) == len(second) and all(
        abs(a - c) <= tolerance and abs(b - d) <= VALUE * max(abs(b), abs(d), 1.0)
        for (a, b), (c, d) in zip(first, second, strict=True))


def distinct(placements: Sequence[Placement], tolerance: float) -> list[Placement]:
    """The placements without those that mirror an earlier one (see :func:`is_mirror`)."""
    kept: list[Placement] = []
    for placement in placements:
        if not any(is_mirror(earlier, placement, tolerance) for earlier in kept):
            kept.append(placement)
    return kept


def ranked(found: list[Placement], sense: str) -> list[Placement]:
    """Placements most adverse first (stable: ties keep model, case and direction order)."""
    sign = -1.0 if sense == "max" else 1.0
    return sorted(found, key=lambda p: sign * p.value)


def best_placements(effects: Effects, functions: np.ndarray, prepared: PreparedLines,
                    model: str, sections: Sequence[float | None]) -> list[Placement]:
    """The most adverse placement of each of the ``functions`` of ``effects``, as
    :func:`chosen_peaks` picks it with ``count=1``, found for all of them at once.

    Args:
        effects: effect functions of one case, direction and sense.
        functions: which of them (indices into ``effects``).
        prepared: the prepared batch the effects were built on.
        model: load model name.
        sections: the section chainage [length] of each chosen function's line, or None.
    """
    functions = np.asarray(functions, dtype=np.int64)
    sign = 1.0 if effects.sense == "max" else -1.0
    sk = effects.skeletons
    owner = sk.owner
    values = sign * sk.values
    tolerance = sk.tolerances[owner]
    sides = _entry_sides(sk.positions, values, sk.sides, owner, tolerance)
    offsets = effects.functions.offsets
    entry_before = effects.functions.breaks[offsets[:-1] + 1][owner]
    entry_after = effects.functions.breaks[offsets[1:] - 2][owner]
    positions = sk.positions
    loaded = ((positions >= entry_before) & (positions < entry_after)) | (
        (positions == entry_after) & (sides < 0))
    count = effects.functions.count
    loaded_best = _segment_best(np.where(loaded, values, -np.inf), sk.offsets, count)
    unloaded_best = _segment_best(np.where(loaded, -np.inf, values), sk.offsets, count)
    tol = sk.tolerances
    edge = ~np.isfinite(loaded_best) | (unloaded_best >= loaded_best - tol)
    # the first entry, in order of lead position, as adverse as the best within the tolerance
    target = np.where(edge, unloaded_best, loaded_best)
    candidate = (loaded != edge[owner]) & (values >= target[owner] - tolerance)
    first = np.full(count, -1)
    hits = np.flatnonzero(candidate)
    firsts, where = np.unique(owner[hits], return_index=True)
    first[firsts] = hits[where]
    index = first[functions]
    chosen_values = values[index]
    at_edge = edge[functions]
    leads = np.where(at_edge, np.where(positions[index] < entry_before[index],
                                       entry_before[index], entry_after[index]),
                     positions[index])
    codes = np.where(at_edge, 0, sides[index])
    return _described(effects, functions, prepared, model, leads, sign * chosen_values, codes,
                      sections)


def _described(effects: Effects, functions: np.ndarray, prepared: PreparedLines, model: str,
               leads: np.ndarray, values: np.ndarray, codes: np.ndarray,
               sections: Sequence[float | None]) -> list[Placement]:
    """:func:`placement_at` for many functions of one effects object at once: the arrays are
    computed together, only the values are made per placement."""
    case = effects.case
    lines = effects.lines[functions]
    sign = travel_sign(effects.direction)
    starts, ends = prepared.starts[lines], prepared.ends[lines]
    scale = case.factor
    count = functions.size
    side_names = np.array([None, "right", "left"], dtype=object)[np.where(codes < 0, 2, codes)]
    arrangements = [effects.arrangement(int(k)) for k in functions]
    has_train = arrangements[0] is not None
    if has_train:
        offsets = np.stack([a.axle_offsets for a in arrangements])  # type: ignore[union-attr]
        positions = leads[:, None] + sign * offsets
        loads = np.broadcast_to(scale * (1 + case.axle_allowance)
                                * arrangements[0].axle_loads,  # type: ignore[union-attr]
                                positions.shape).copy()
    else:
        positions = loads = np.zeros((count, 0))
    axles = positions.shape[1]
    neglected: list[tuple[int, ...]] = [()] * count
    if case.neglect_relieving_axles and axles:
        owner = np.repeat(lines, axles)
        flat = positions.ravel()
        left = prepared.split.values(owner, flat, side="left").reshape(positions.shape)
        right = prepared.split.values(owner, flat, side="right").reshape(positions.shape)
        ordinates = np.where((codes < 0)[:, None], left, right)
        adverse = ordinates > 0 if effects.sense == "max" else ordinates < 0
        loads = np.where(adverse, loads, 0.0)
        neglected = [tuple(np.flatnonzero(~row).tolist()) for row in adverse]
    tolerance = POSITION_TOLERANCE_FRACTION * np.maximum(ends - starts, 1.0)
    section_axle: list[int | None] = [None] * count
    if axles:
        wanted = np.array([np.nan if s is None else s for s in sections], dtype=float)
        distance = np.abs(positions - wanted[:, None])
        nearest = np.argmin(np.where(np.isnan(distance), np.inf, distance), axis=1)
        over = np.take_along_axis(distance, nearest[:, None], axis=1)[:, 0] <= tolerance
        section_axle = [int(n) if o else None for n, o in zip(nearest, over, strict=True)]
    ordinates, where = prepared.adverse_ordinates(effects.sense)
    knife = case.knife_edge_for(effects.kind)
    has_knife = (ordinates[lines] != 0) & (knife > 0)
    knife_load = scale * (1 + case.lane_allowance) * knife
    lane_intensity = scale * (1 + case.lane_allowance) * case.lane
    jumps = prepared.jumps
    found = []
    for i in range(count):
        line = int(lines[i])
        arrangement = arrangements[i]
        lead = float(leads[i])
        row = positions[i]
        patch_segments: list[tuple[float, float, float]] = []
        footprint = None
        if arrangement is not None:
            for a, b, q in zip(arrangement.patch_starts, arrangement.patch_ends,
                               arrangement.patch_intensities, strict=True):
                low, high = sorted((lead + sign * a, lead + sign * b))
                low, high = max(low, starts[i]), min(high, ends[i])
                if low < high:
                    patch_segments.append((float(low), float(high),
                                           scale * (1 + case.patch_allowance) * q))
            if case.lane_clear_of_train is not None:
                front, rear = arrangement.extent
                clear = case.lane_clear_of_train
                reach = sorted((lead + sign * (front - clear), lead + sign * (rear + clear)))
                footprint = (reach[0], reach[1])
        own_jumps = jumps[line]
        at_jump: tuple[int, ...] = ()
        if own_jumps.size and axles:
            at_jump = tuple(np.flatnonzero((np.abs(row[:, None] - own_jumps[None, :])
                                            <= tolerance[i]).any(axis=1)).tolist())
        found.append(Placement(
            value=float(values[i]),
            sense=effects.sense,
            model=model,
            case=case.name,
            direction=effects.direction,
            lead_position=lead if arrangement is not None else float(starts[i]),
            axle_positions=tuple(row.tolist()),
            axle_loads=tuple(loads[i].tolist()),
            ranged_values=arrangement.ranged_values if arrangement is not None else (),
            patch_segments=tuple(patch_segments),
            lane_segments=(_cleared(prepared.adverse_segments(line, effects.sense), footprint)
                           if case.lane > 0 else ()),
            lane_intensity=lane_intensity,
            knife_edge_position=float(where[line]) if has_knife[i] else None,
            knife_edge_load=knife_load if has_knife[i] else 0.0,
            section_axle=section_axle[i],
            limit_side=side_names[i],
            axles_at_jump=at_jump,
            neglected_axles=neglected[i],
        ))
    return found


def _entry_sides(positions: np.ndarray, values: np.ndarray, codes: np.ndarray,
                 owner: np.ndarray, tolerance: np.ndarray) -> np.ndarray:
    """-1 or +1 where an entry is the left or right limit of a jump (the two limits differ),
    else 0: :func:`piecewise.skeleton.side_at` for every entry at once."""
    result = np.zeros(positions.size, dtype=int)
    size = positions.size
    for code, step in ((-1, 1), (1, -1)):
        index = np.flatnonzero(codes == code)
        partner = index + step
        valid = (partner >= 0) & (partner < size)
        index, partner = index[valid], partner[valid]
        jump = ((owner[partner] == owner[index]) & (positions[partner] == positions[index])
                & (codes[partner] == -code)
                & (np.abs(values[partner] - values[index]) > tolerance[index]))
        result[index[jump]] = code
    return result


def _segment_best(values: np.ndarray, offsets: np.ndarray, count: int) -> np.ndarray:
    return np.maximum.reduceat(values, offsets[:-1]) if count else np.zeros(0)
