"""Exact worst-case placement of load models on an influence function.

For every case of every load model that applies to the response (its scope, given the response
kind, the sense and whether a reaction is at an interior support), in both travel directions,
the effect function E(lead position) is built exactly (:mod:`vehicles.effect`) and every piece
is examined: its two end limits and its interior stationary points (:mod:`vehicles.extremes`).
The train enters from off the structure and leaves completely; no sampling step.

Ranged gaps and lengths (:mod:`vehicles.gaps`): a single range is solved exactly; several
ranges by a numeric search whose bracket width is ``gap_tolerance`` [length]. The values used are
reported with every placement.

Sign conventions are DESIGN.md's (loads down; sagging moment positive); values carry the units of
the influence function times those of the load model ([kN m], [kip ft], ...).

Example:
    >>> from scipy.interpolate import PPoly
    >>> from vehicles.loadmodel import LoadCase, LoadModel
    >>> from vehicles.train import Axle, Train
    >>> L = 20.0  # [ft]; H20 truck on the midspan moment line, peak ordinate L/4
    >>> moment = PPoly([[0.5, -0.5], [0.0, L / 4]], [0.0, L / 2, L])
    >>> h20 = LoadModel("H20", "H20 truck", "kip-ft",
    ...                 (LoadCase("truck", Train("H20", (Axle(8.0), Axle(32.0, 14.0)))),))
    >>> result = govern(moment, h20, kind="moment", section=L / 2)
    >>> round(result.max.value, 6), result.max.section_axle  # the 32 kip axle over the section
    (160.0, 1)
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from dataclasses import dataclass

import numpy as np
from scipy.interpolate import PPoly

from vehicles.effect import DIRECTIONS, EffectFunction, PreparedInfluence, check_request, prepare
from vehicles.errors import VehicleError
from vehicles.extremes import Peak, Skeleton, distinct_peaks
from vehicles.gaps import best_effects
from vehicles.loadmodel import LoadCase, LoadModel

POSITION_TOLERANCE_FRACTION = 1e-9
"""An axle within this fraction of the path length of the section stands over it."""


@dataclass(frozen=True)
class ChosenRange:
    """The value used for one ranged gap or patch length of the train.

    Attributes:
        item: index of the train item (0 = the first) whose gap or length it is.
        attribute: "gap" or "length".
        low, high: the range [length].
        value: the value used [length].
    """

    item: int
    attribute: str
    low: float
    high: float
    value: float


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
        gaps: the values used for the train's ranged gaps and lengths.
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
    gaps: tuple[ChosenRange, ...]
    patch_segments: tuple[tuple[float, float, float], ...]
    lane_segments: tuple[tuple[float, float], ...]
    lane_intensity: float
    knife_edge_position: float | None
    knife_edge_load: float
    section_axle: int | None
    limit_side: str | None
    axles_at_jump: tuple[int, ...]
    neglected_axles: tuple[int, ...] = ()


@dataclass(frozen=True)
class Governing:
    """The governing placements of one or more load models for one response.

    Attributes:
        kind: response kind.
        max, min: the largest and the smallest effect, None when no case applies.
        top_max, top_min: distinct local extremes (separate peaks), largest (smallest) first;
            every applicable case and direction contributes its own peaks.
        gap_tolerance: the bracket width used for trains with several ranges [length] (None:
            ``vehicles.gaps.GAP_TOLERANCE_FRACTION`` of each range); a single range is exact.
    """

    kind: str
    max: Placement | None
    min: Placement | None
    top_max: tuple[Placement, ...]
    top_min: tuple[Placement, ...]
    gap_tolerance: float | None


def govern(
    influence: PPoly | PreparedInfluence,
    models: LoadModel | Sequence[LoadModel],
    *,
    kind: str,
    interior: bool = False,
    section: float | None = None,
    top: int = 1,
    directions: Sequence[str] = DIRECTIONS,
    gap_tolerance: float | None = None,
) -> Governing:
    """The exact largest and smallest effects of load models on an influence function.

    Args:
        influence: response per unit downward load against path chainage [length].
        models: one load model or several; the worst case of all governs.
        kind: response kind ("moment", "shear", ...): picks scopes and knife-edge loads.
        interior: the response is a reaction at a support that is not at an end of the path.
        section: chainage of the section [length], to report which axle stands over it.
        top: how many distinct local extremes to list for each sense.
        directions: travel directions to try.
        gap_tolerance: Brent bracket width for ranged gaps and lengths [length].

    Returns:
        The governing placements; ``max``/``min`` are None when no case applies to that sense.
    """
    if isinstance(models, LoadModel):
        models = (models,)
    if top < 1:
        raise VehicleError(f"top = {top}", item="top", fix="ask for at least one placement")
    for direction in directions:
        check_request(kind, "max", direction)
    prepared = prepare(influence)
    found: dict[str, list[Placement]] = {"max": [], "min": []}
    for model, case, senses, direction in visits(models, kind, interior, directions):
        effects = best_effects(prepared, case, kind=kind, senses=senses, direction=direction,
                               gap_tolerance=gap_tolerance)
        for sense, effect in effects.items():
            found[sense].extend(
                placements(effect, prepared, model.name, section=section, count=top)
            )
    tops = {sense: ranked(found[sense], sense)[:top] for sense in ("max", "min")}
    return Governing(
        kind,
        tops["max"][0] if tops["max"] else None,
        tops["min"][0] if tops["min"] else None,
        tuple(tops["max"]),
        tuple(tops["min"]),
        gap_tolerance,
    )


def visits(
    models: Sequence[LoadModel], kind: str, interior: bool, directions: Sequence[str]
) -> Iterator[tuple[LoadModel, LoadCase, list[str], str]]:
    """(model, case, senses it applies to, direction) in the order the search tries them."""
    for model in models:
        for case in model.cases:
            senses = [s for s in ("max", "min") if case.applies_to(kind, s, interior=interior)]
            if not senses:
                continue
            ways = tuple(directions) if case.train is not None else ("forward",)
            for direction in ways:
                yield model, case, senses, direction


def ranked(found: list[Placement], sense: str) -> list[Placement]:
    """Placements most adverse first."""
    sign = -1.0 if sense == "max" else 1.0
    # stable: ties keep model, case and direction order
    return sorted(found, key=lambda p: sign * p.value)


def _signed_skeleton(effect: EffectFunction, sense: str) -> Skeleton:
    sk = effect.skeleton
    return sk if sense == "max" else sk.negated()


def placements(
    effect: EffectFunction,
    influence: PPoly | PreparedInfluence,
    model: str,
    *,
    section: float | None = None,
    count: int = 1,
) -> list[Placement]:
    """Up to ``count`` distinct local extremes of an effect function, most adverse first.

    Peaks where the train is entirely off the path are listed only when nothing else is.
    """
    prepared = prepare(influence)
    sign = 1.0 if effect.sense == "max" else -1.0
    return [
        placement_at(effect, prepared, model, Peak(p.position, sign * p.value, p.side),
                     section=section)
        for p in chosen_peaks(_signed_skeleton(effect, effect.sense), effect.pieces.breaks, count)
    ]


def chosen_peaks(sk: Skeleton, breaks: np.ndarray, count: int) -> list[Peak]:
    """The peaks :func:`placements` describes, of a skeleton signed so that larger is more
    adverse, on an effect function with breakpoints ``breaks`` (lead positions [length])."""
    peaks = distinct_peaks(sk, count + 2)
    loaded = [p for p in peaks if _is_loaded(p, breaks)]
    unloaded = [p for p in peaks if not _is_loaded(p, breaks)]
    chosen = loaded[:count]
    if unloaded and (not loaded or unloaded[0].value >= loaded[0].value - sk.tolerance):
        # nothing on the path is as adverse as any loaded position: say so with the train off
        edge = float(breaks[1] if unloaded[0].position < breaks[1] else breaks[-2])
        chosen = [Peak(edge, unloaded[0].value, None), *loaded[: count - 1]]
    return chosen


def _is_loaded(peak: Peak, breaks: np.ndarray) -> bool:
    """Whether a peak of an effect function lies where it varies (not on an outer constant)."""
    return bool(breaks[1] <= peak.position < breaks[-2]
                or (peak.position == breaks[-2] and peak.side == "left"))


def placement_at(
    effect: EffectFunction,
    prepared: PreparedInfluence,
    model: str,
    peak: Peak,
    *,
    section: float | None = None,
) -> Placement:
    """Describe the loads of ``effect`` with the lead at ``peak.position`` [length]."""
    case = effect.case
    arrangement = effect.arrangement
    lead = peak.position
    sign = effect.travel_sign
    length = prepared.end - prepared.start
    scale = case.factor
    gaps: tuple[ChosenRange, ...] = ()
    patch_segments: tuple[tuple[float, float, float], ...] = ()
    footprint = None
    if arrangement is not None and case.train is not None:
        positions = lead + sign * arrangement.axle_offsets
        loads = scale * (1 + case.axle_allowance) * arrangement.axle_loads
        gaps = tuple(ChosenRange(r.item, r.attribute, r.low, r.high, v)
                     for r, v in zip(case.train.ranges, arrangement.choices, strict=True))
        patch_segments = tuple(
            (*_on_path(lead, sign, a, b, prepared), scale * (1 + case.patch_allowance) * q)
            for a, b, q in zip(arrangement.patch_starts, arrangement.patch_ends,
                               arrangement.patch_intensities, strict=True)
            if _on_path(lead, sign, a, b, prepared)[0] < _on_path(lead, sign, a, b, prepared)[1]
        )
        if case.lane_clear_of_train is not None:
            front, rear = arrangement.extent
            clear = case.lane_clear_of_train
            ends = sorted((lead + sign * (front - clear), lead + sign * (rear + clear)))
            footprint = (ends[0], ends[1])
    else:
        positions = loads = np.zeros(0)
    neglected: tuple[int, ...] = ()
    if case.neglect_relieving_axles and positions.size:
        ordinates = prepared.line.values_at(positions, side=peak.side or "right")
        adverse = ordinates > 0 if effect.sense == "max" else ordinates < 0
        neglected = tuple(int(i) for i in np.flatnonzero(~adverse))
        loads = np.where(adverse, loads, 0.0)
    lane_intensity = scale * (1 + case.lane_allowance) * case.lane
    lane_segments = (_cleared(prepared.adverse_segments(effect.sense), footprint)
                     if case.lane > 0 else ())
    ordinate = prepared.adverse_ordinate(effect.sense)
    knife = case.knife_edge_for(effect.kind)
    has_knife = ordinate is not None and knife > 0
    tol = POSITION_TOLERANCE_FRACTION * max(length, 1.0)
    section_axle = None
    if section is not None and positions.size:
        distance = np.abs(positions - section)
        if distance.min() <= tol:
            section_axle = int(np.argmin(distance))
    at_jump = tuple(int(i) for i in np.flatnonzero(
        (np.abs(positions[:, None] - prepared.jumps[None, :]) <= tol).any(axis=1)))
    return Placement(
        value=peak.value,
        sense=effect.sense,
        model=model,
        case=case.name,
        direction=effect.direction,
        lead_position=lead if arrangement is not None else prepared.start,
        axle_positions=tuple(float(p) for p in positions),
        axle_loads=tuple(float(p) for p in loads),
        gaps=gaps,
        patch_segments=patch_segments,
        lane_segments=lane_segments,
        lane_intensity=lane_intensity,
        knife_edge_position=ordinate.position if has_knife and ordinate else None,
        knife_edge_load=scale * (1 + case.lane_allowance) * knife if has_knife else 0.0,
        section_axle=section_axle,
        limit_side=peak.side,
        axles_at_jump=at_jump,
        neglected_axles=neglected,
    )


def _on_path(
    lead: float, sign: float, start: float, end: float, prepared: PreparedInfluence
) -> tuple[float, float]:
    low, high = sorted((lead + sign * start, lead + sign * end))
    return max(low, prepared.start), min(high, prepared.end)


def _cleared(
    segments: tuple[tuple[float, float], ...], footprint: tuple[float, float] | None
) -> tuple[tuple[float, float], ...]:
    if footprint is None:
        return segments
    kept: list[tuple[float, float]] = []
    for start, end in segments:
        for piece in ((start, min(end, footprint[0])), (max(start, footprint[1]), end)):
            if piece[1] > piece[0]:
                kept.append(piece)
    return tuple(kept)
