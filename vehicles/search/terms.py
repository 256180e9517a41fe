"""What a load case puts on an influence line, as terms of an exact sum, and a proven upper
bound on what it can do.

Conventions (README): loads act downward and are positive; an influence line gives the response
per unit downward load at chainage x [length] and is zero off the path, so a train enters from
off the structure and leaves completely. The lead position is the chainage of the train's
reference point (offset 0, see :mod:`vehicles.train`). Travelling ``"forward"`` (toward
increasing chainage) an item at offset d stands at x - d; travelling ``"reverse"`` at x + d.

For lead position x the effect of a load case is

    E(x) = factor * [ (1 + axle_allowance) * sum_i P_i IL(pos_i)
                      + (1 + patch_allowance) * sum_j q_j * integral of IL over patch j
                      + (1 + lane_allowance) * (w * integral of the adverse part of IL off the
                                                 train's cleared footprint + K * extreme ordinate) ]

where the adverse part is the positive part of IL for the largest effect and the negative part
for the smallest. Every term is a shifted copy of a row of the prepared tables
(:mod:`vehicles.search.prepared`): the line (or its adverse part alone, for cases that neglect
relieving axles), its integral, or the integral of its adverse part.

Example (two axles 4 m apart, forward: the rear one trails 4 m behind the lead):
    >>> from vehicles.loadmodel import LoadCase
    >>> from vehicles.train import Axle, Train
    >>> case = LoadCase("pair", Train("P", (Axle(10.0), Axle(20.0, 4.0))), axle_allowance=0.5)
    >>> t = terms_of(case, case.train.arranged(), "forward", "max")
    >>> t.shifts.tolist(), t.weights.tolist()
    ([-0.0, -4.0], [15.0, 30.0])
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np

from vehicles.loadmodel import LoadCase
from vehicles.search.prepared import (
    AREA,
    LINE,
    NEGATIVE_AREA,
    NEGATIVE_LINE,
    POSITIVE_AREA,
    POSITIVE_LINE,
    PreparedLines,
)
from vehicles.train import Arrangement

DIRECTIONS = ("forward", "reverse")


@dataclass(frozen=True)
class Terms:
    """The varying terms of an effect function, the same for every influence line.

    Attributes:
        rows: table row of each term.
        shifts: shift of each term [length].
        weights: multiplier of each term [force] or [force/length].
        totals: (multiplier, table row) of the constant parts: an integral whose end reaches
            past the path adds ``multiplier`` times that row's full value.
    """

    rows: np.ndarray
    shifts: np.ndarray
    weights: np.ndarray
    totals: tuple[tuple[float, int], ...]

    def constant(self, row_totals: np.ndarray) -> np.ndarray:
        """The constant parts for lines whose full row values are ``row_totals[row]``
        (rows, lines)."""
        constant = np.zeros(row_totals.shape[1:])
        for multiplier, row in self.totals:
            constant = constant + multiplier * row_totals[row]
        return constant


def travel_sign(direction: str) -> float:
    """-1 forward (items trail behind the lead), +1 reverse."""
    return -1.0 if direction == "forward" else 1.0


def lane_is_cleared(case: LoadCase) -> bool:
    """Whether the lane is taken off the train's footprint (then E depends on the sense)."""
    return case.lane > 0 and case.lane_clear_of_train is not None and case.train is not None


def sense_dependent(case: LoadCase) -> bool:
    """Whether the varying terms of E differ between the largest and the smallest effect: the
    lane is cleared around the train, or axles act only on the adverse part of the line."""
    return lane_is_cleared(case) or (case.neglect_relieving_axles and case.train is not None)


def terms_of(case: LoadCase, arrangement: Arrangement | None, direction: str,
             sense: str) -> Terms:
    """The varying terms of E, which do not depend on the influence line.

    Axles are shifted copies of the line (of its adverse part alone when the case neglects
    relieving axles); a patch over offsets [a, b] is the difference of two shifted copies of
    its integral (a copy shifted to infinity is a constant). With ``lane_clear_of_train`` the
    lane is taken off the cleared footprint the same way, using the integral of the adverse
    part.
    """
    if arrangement is None:
        return Terms(np.zeros(0, dtype=int), np.zeros(0), np.zeros(0), ())
    sign = travel_sign(direction)
    axle_row = LINE
    if case.neglect_relieving_axles:
        # an axle on the relieving part of the line is left off: it acts on the adverse part only
        axle_row = POSITIVE_LINE if sense == "max" else NEGATIVE_LINE
    rows: list[np.ndarray] = [np.full(arrangement.axle_offsets.size, axle_row)]
    shifts: list[np.ndarray] = [sign * arrangement.axle_offsets]
    weights: list[np.ndarray] = [case.factor * (1 + case.axle_allowance) * arrangement.axle_loads]
    patch_weights = case.factor * (1 + case.patch_allowance) * arrangement.patch_intensities
    intervals: list[tuple[np.ndarray, np.ndarray, np.ndarray, int]] = [
        (arrangement.patch_starts, arrangement.patch_ends, patch_weights, AREA)
    ]
    if lane_is_cleared(case):
        front, rear = arrangement.extent
        clear = float(case.lane_clear_of_train or 0.0)
        intensity = -case.factor * (1 + case.lane_allowance) * case.lane
        row = POSITIVE_AREA if sense == "max" else NEGATIVE_AREA
        intervals.append((np.array([front - clear]), np.array([rear + clear]),
                          np.array([intensity]), row))
    totals: list[tuple[float, int]] = []
    for starts, ends, intensities, row in intervals:
        low = np.minimum(sign * starts, sign * ends)
        high = np.maximum(sign * starts, sign * ends)
        for ends_at, side in ((high, 1.0), (low, -1.0)):
            finite = np.isfinite(ends_at)
            rows.append(np.full(int(finite.sum()), row))
            shifts.append(ends_at[finite])
            weights.append(side * intensities[finite])
            # an end at +infinity reaches past the path: the integral's full value
            totals.append((float((side * intensities[~finite] * (ends_at[~finite] > 0)).sum()),
                           row))
    return Terms(np.concatenate(rows).astype(int), np.concatenate(shifts),
                 np.concatenate(weights), tuple(totals))


def lane_constants(case: LoadCase, kind: str, lines: PreparedLines, sense: str) -> np.ndarray:
    """The lane load on each line's whole adverse area and the knife-edge load at its extreme
    ordinate [response x force] (a cleared footprint is taken off by the varying terms)."""
    scale = case.factor * (1 + case.lane_allowance)
    total = scale * case.lane * lines.adverse_areas(sense)
    knife = case.knife_edge_for(kind)
    if knife > 0:
        ordinates, _ = lines.adverse_ordinates(sense)
        total = total + scale * knife * ordinates
    return total  # type: ignore[no-any-return]


def upper_bounds(case: LoadCase, kind: str, lines: PreparedLines, sense: str) -> np.ndarray:
    """A proven bound on each line's most adverse effect of ``case`` (the largest E for "max",
    minus the smallest for "min") [response x force], whatever the train's position and ranged
    values.

    Every axle contributes at most its factored load times the line's extreme ordinate of the
    sought sign; the train's patches, which never overlap, at most the largest factored
    intensity times the adverse area; the lane and knife-edge loads at most their value on the
    whole adverse area and at the extreme ordinate.
    """
    sign = 1.0 if sense == "max" else -1.0
    bound = sign * lane_constants(case, kind, lines, sense)
    train = case.train
    if train is None:
        return bound  # type: ignore[no-any-return]
    arrangement = train.arranged()
    ordinates, _ = lines.adverse_ordinates(sense)
    axles = case.factor * (1 + case.axle_allowance) * float(arrangement.axle_loads.sum())
    bound = bound + axles * sign * ordinates
    if arrangement.patch_intensities.size:
        patch = case.factor * (1 + case.patch_allowance) * float(
            arrangement.patch_intensities.max())
        bound = bound + patch * sign * lines.adverse_areas(sense)
    return bound  # type: ignore[no-any-return]


def check_request(kind: str, sense: str, direction: str) -> None:
    """Raise a VehicleError for an unknown response kind, sense or direction."""
    from vehicles.errors import VehicleError
    from vehicles.loadmodel import RESPONSE_KINDS, SENSES

    for value, allowed, what in ((kind, RESPONSE_KINDS, "kind"), (sense, SENSES, "sense"),
                                 (direction, DIRECTIONS, "direction")):
        if value not in allowed:
            raise VehicleError(f"unknown {what} '{value}'", item=what,
                               fix="use one of: " + ", ".join(allowed))


def arrangement_of(case: LoadCase, values: Sequence[float] | None) -> Arrangement | None:
    """The case's train with its ranged values fixed (None for a case without a train)."""
    return None if case.train is None else case.train.arranged(values)
