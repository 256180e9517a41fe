"""The exact effect of a fixed arrangement of loads as a function of the lead position.

Conventions (DESIGN.md): loads act downward and are positive; the influence function gives the
response per unit downward load at path chainage x [length] and is zero outside its breakpoints
[x0, xn] (the train enters from off the structure and leaves completely). The lead position is
the chainage of the train's reference point (offset 0, see :mod:`vehicles.train`). Travelling
``"forward"`` (toward increasing chainage) an item at offset d stands at x - d; travelling
``"reverse"`` it stands at x + d.

For lead position x the effect of a load case is

    E(x) = factor * [ (1 + axle_allowance) * sum_i P_i IL(pos_i)
                      + (1 + patch_allowance) * sum_j q_j * integral of IL over patch j
                      + (1 + lane_allowance) * (w * integral of the adverse part of IL off the
                                                 train's cleared footprint + K * extreme ordinate) ]

where the adverse part is the positive part of IL for the largest effect and the negative part
for the smallest, with zero crossings found exactly from the piece polynomials. Every term is a
shifted copy of IL, of its integral or of the integral of its adverse part, so E is an exact
piecewise polynomial with breakpoints at the IL breakpoints shifted by every offset.

Example:
    >>> from scipy.interpolate import PPoly
    >>> from vehicles.loadmodel import LoadCase
    >>> from vehicles.train import Axle, Train
    >>> span = 10.0  # [m]; moment at midspan of a simple span: peak ordinate L/4 [m]
    >>> moment = PPoly([[0.5, -0.5], [0.0, 2.5]], [0.0, 5.0, 10.0])
    >>> case = LoadCase("one axle", Train("P", (Axle(100.0),)))
    >>> e = effect_function(moment, case, kind="moment", sense="max", direction="forward")
    >>> float(e.ppoly()(5.0))  # the axle over midspan [kN m]
    250.0
    >>> float(e.ppoly()(10.0))  # the axle over the far support
    0.0
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass
from functools import cached_property

import numpy as np
from scipy.interpolate import PPoly

from vehicles.errors import VehicleError
from vehicles.extremes import Skeleton, skeleton
from vehicles.loadmodel import RESPONSE_KINDS, SENSES, LoadCase
from vehicles.piecewise import (
    Pieces,
    horner,
)
from vehicles.ragged import TableBatch, shifted_sums
from vehicles.train import Arrangement

DIRECTIONS = ("forward", "reverse")

# rows of PreparedInfluence.tables
_LINE, _AREA, _POSITIVE_AREA, _NEGATIVE_AREA, _POSITIVE_LINE, _NEGATIVE_LINE = range(6)


@dataclass(frozen=True)
class Ordinate:
    """An extreme ordinate of an influence function: its value and chainage [length]."""

    value: float
    position: float


@dataclass(frozen=True)
class PreparedInfluence:
    """An influence function made ready for many placements (build once, reuse for every case).

    Attributes:
        line: the influence function split at its zero crossings.
        tables: extended coefficient tables of the line, its integral and the integrals of its
            positive and negative parts, on the breakpoints of ``line``.
        area, positive_area, negative_area: integrals over the path [response x length].
        largest, smallest: extreme ordinates (one-sided limits at jumps count).
        jumps: chainages where the line jumps [length].
    """

    line: Pieces
    tables: np.ndarray
    area: float
    positive_area: float
    negative_area: float
    largest: Ordinate
    smallest: Ordinate
    jumps: np.ndarray

    @cached_property
    def batch(self) -> TableBatch:
        """The tables as a batch of one, for :func:`vehicles.ragged.shifted_sums`."""
        return TableBatch.of([self.line.breaks], [self.tables])

    @property
    def start(self) -> float:
        """First chainage of the loaded path [length]."""
        return float(self.line.breaks[0])

    @property
    def end(self) -> float:
        """Last chainage of the loaded path [length]."""
        return float(self.line.breaks[-1])

    def adverse_area(self, sense: str) -> float:
        """Integral of the positive (max) or negative (min) part [response x length]."""
        return self.positive_area if sense == "max" else self.negative_area

    def adverse_ordinate(self, sense: str) -> Ordinate | None:
        """The extreme ordinate of the sought sign, or None if the line never has that sign."""
        ordinate = self.largest if sense == "max" else self.smallest
        return ordinate if (ordinate.value > 0 if sense == "max" else ordinate.value < 0) else None

    def adverse_segments(self, sense: str) -> tuple[tuple[float, float], ...]:
        """Maximal chainage intervals [length] where the line has the sought sign."""
        middle = horner(self.line.coeffs, 0.5 * self.line.widths)
        adverse = middle > 0 if sense == "max" else middle < 0
        breaks = self.line.breaks
        segments: list[tuple[float, float]] = []
        for j in np.flatnonzero(adverse):
            if segments and segments[-1][1] == breaks[j]:
                segments[-1] = (segments[-1][0], float(breaks[j + 1]))
            else:
                segments.append((float(breaks[j]), float(breaks[j + 1])))
        return tuple(segments)


def prepare(influence: PPoly | PreparedInfluence) -> PreparedInfluence:
    """Split an influence function at its zeros and tabulate its integrals (exact).

    Args:
        influence: response per unit downward load [response/force] against chainage [length].
    """
    if isinstance(influence, PreparedInfluence):
        return influence
    # the batched code with a batch of one, so that a line prepared alone or with others is
    # the same to the last bit (imported here: vehicles.preparation builds on this module)
    from vehicles.preparation import prepare_many

    return prepare_many([influence])[0]


@dataclass(frozen=True)
class EffectFunction:
    """The exact effect of one load case in one arrangement against the lead position.

    Attributes:
        pieces: E(x) [response x force] on its breakpoints (lead positions [length]), with a
            constant piece before the train reaches the path and after it has left.
        case: the load case.
        kind: response kind (see ``vehicles.loadmodel.RESPONSE_KINDS``).
        sense: "max" or "min": which part of the line the lane load covers.
        direction: "forward" or "reverse".
        arrangement: the train with every range fixed (None for a case without a train).
    """

    pieces: Pieces
    case: LoadCase
    kind: str
    sense: str
    direction: str
    arrangement: Arrangement | None

    def ppoly(self) -> PPoly:
        """E as a scipy ``PPoly`` in the lead position [length]; constant beyond its ends."""
        return self.pieces.ppoly()

    @cached_property
    def skeleton(self) -> Skeleton:
        """Every piece's end limits and stationary points (computed once, on first use)."""
        return skeleton(self.pieces)

    @property
    def travel_sign(self) -> float:
        """-1 forward (items trail behind the lead), +1 reverse."""
        return -1.0 if self.direction == "forward" else 1.0


def check_request(kind: str, sense: str, direction: str) -> None:
    """Raise a VehicleError for an unknown response kind, sense or direction."""
    for value, allowed, what in ((kind, RESPONSE_KINDS, "kind"), (sense, SENSES, "sense"),
                                 (direction, DIRECTIONS, "direction")):
        if value not in allowed:
            raise VehicleError(f"unknown {what} '{value}'", item=what,
                               fix="use one of: " + ", ".join(allowed))


def effect_function(
    influence: PPoly | PreparedInfluence,
    case: LoadCase,
    *,
    kind: str,
    sense: str,
    direction: str,
    choices: Sequence[float] | None = None,
) -> EffectFunction:
    """The exact effect function E(lead position) of ``case`` on ``influence``.

    Args:
        influence: response per unit downward load against chainage [length].
        case: load case (train, factors, lane and knife-edge loads).
        kind: response kind, which picks the knife-edge load.
        sense: "max" or "min", which picks the adverse parts for the lane and knife-edge loads.
        direction: "forward" or "reverse".
        choices: values of the train's ranged gaps and lengths [length] (default the minima).
    """
    check_request(kind, sense, direction)
    prepared = prepare(influence)
    arrangement = case.train.arranged(choices) if case.train is not None else None
    which, shifts, weights, constant = effect_terms(prepared, case, arrangement, direction, sense)
    constant += constant_terms(prepared, case, kind, sense)
    return EffectFunction(
        summed(prepared, which, shifts, weights, constant), case, kind, sense, direction,
        arrangement,
    )


def lane_is_cleared(case: LoadCase) -> bool:
    """Whether the lane is taken off the train's footprint (then E depends on the sense)."""
    return case.lane > 0 and case.lane_clear_of_train is not None and case.train is not None


def sense_dependent(case: LoadCase) -> bool:
    """Whether the varying terms of E differ between the largest and the smallest effect: the
    lane is cleared around the train, or axles act only on the adverse part of the line."""
    return lane_is_cleared(case) or (case.neglect_relieving_axles and case.train is not None)


def resensed(effect: EffectFunction, prepared: PreparedInfluence, sense: str) -> EffectFunction:
    """The same arrangement's effect function for another sense.

    Unless :func:`sense_dependent`, only the constant terms (lane on the adverse area,
    knife-edge load) depend on the sense; otherwise the function is built again.
    """
    if sense == effect.sense:
        return effect
    case, kind = effect.case, effect.kind
    if sense_dependent(case):
        choices = effect.arrangement.choices if effect.arrangement is not None else None
        return effect_function(prepared, case, kind=kind, sense=sense,
                               direction=effect.direction, choices=choices)
    shift = constant_terms(prepared, case, kind, sense) - constant_terms(prepared, case, kind,
                                                                          effect.sense)
    coeffs = effect.pieces.coeffs.copy()
    coeffs[0] += shift
    other = EffectFunction(Pieces(effect.pieces.breaks, coeffs), case, kind, sense,
                           effect.direction, effect.arrangement)
    if "skeleton" in effect.__dict__:
        # a constant moves no breakpoint or stationary point: reuse the skeleton, shifted
        sk = effect.skeleton
        other.__dict__["skeleton"] = Skeleton(sk.positions, sk.values + shift, sk.sides)
    return other


def summed(
    prepared: PreparedInfluence,
    which: np.ndarray,
    shifts: np.ndarray,
    weights: np.ndarray,
    constant: float,
) -> Pieces:
    """The exact sum of the shifted terms plus a constant, as padded pieces."""
    ragged = shifted_sums(prepared.batch, which, shifts[None, :], weights, np.array([constant]))
    return ragged.function(0)


@dataclass(frozen=True)
class Terms:
    """The varying terms of an effect function, the same for every influence line.

    Attributes:
        rows: table row of each term (the line, its integral, or the integral of its positive
            or negative part).
        shifts: shift of each term [length].
        weights: multiplier of each term [force] or [force/length].
        totals: (multiplier, table row) of the constant parts: an integral whose end reaches
            past the path adds ``multiplier`` times that row's full value.
    """

    rows: np.ndarray
    shifts: np.ndarray
    weights: np.ndarray
    totals: tuple[tuple[float, int], ...]

    def constant(self, row_totals: Sequence[np.ndarray] | np.ndarray) -> np.ndarray:
        """The constant parts for lines whose full row values are ``row_totals[row]``."""
        constant = np.zeros(np.shape(row_totals[0]))
        for multiplier, row in self.totals:
            constant = constant + multiplier * row_totals[row]
        return constant


def effect_terms(
    prepared: PreparedInfluence,
    case: LoadCase,
    arrangement: Arrangement | None,
    direction: str,
    sense: str,
) -> tuple[np.ndarray, np.ndarray, np.ndarray, float]:
    """The varying terms of E: (table row, shift [length], weight) per term, plus constants.

    See :func:`terms_of`; the constant is evaluated for this line.
    """
    terms = terms_of(case, arrangement, direction, sense)
    constant = float(terms.constant(prepared.tables[:, 0, -1]))
    return terms.rows, terms.shifts, terms.weights, constant


def terms_of(
    case: LoadCase,
    arrangement: Arrangement | None,
    direction: str,
    sense: str,
) -> Terms:
    """The varying terms of E, which do not depend on the influence line.

    Axles are shifted copies of the line (of its adverse part alone when the case neglects
    relieving axles); a patch over offsets [a, b] is the difference of two
    shifted copies of its integral (a copy shifted to infinity is a constant). With
    ``lane_clear_of_train`` the lane is taken off the cleared footprint the same way, using the
    integral of the adverse part.
    """
    if arrangement is None:
        return Terms(np.zeros(0, dtype=int), np.zeros(0), np.zeros(0), ())
    sign = -1.0 if direction == "forward" else 1.0
    axle_row = _LINE
    if case.neglect_relieving_axles:
        # an axle on the relieving part of the line is left off: it acts on the adverse part only
        axle_row = _POSITIVE_LINE if sense == "max" else _NEGATIVE_LINE
    rows: list[np.ndarray] = [np.full(arrangement.axle_offsets.size, axle_row)]
    shifts: list[np.ndarray] = [sign * arrangement.axle_offsets]
    weights: list[np.ndarray] = [case.factor * (1 + case.axle_allowance) * arrangement.axle_loads]
    patch_weights = case.factor * (1 + case.patch_allowance) * arrangement.patch_intensities
    intervals: list[tuple[np.ndarray, np.ndarray, np.ndarray, int]] = [
        (arrangement.patch_starts, arrangement.patch_ends, patch_weights, _AREA)
    ]
    if lane_is_cleared(case):
        front, rear = arrangement.extent
        clear = float(case.lane_clear_of_train or 0.0)
        intensity = -case.factor * (1 + case.lane_allowance) * case.lane
        row = _POSITIVE_AREA if sense == "max" else _NEGATIVE_AREA
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
    return Terms(np.concatenate(rows), np.concatenate(shifts), np.concatenate(weights),
                 tuple(totals))


def constant_terms(prepared: PreparedInfluence, case: LoadCase, kind: str, sense: str) -> float:
    """The lane load on the whole adverse area and the knife-edge load at the extreme ordinate.

    A cleared footprint is subtracted by the varying terms of :func:`effect_terms`.
    """
    ordinate = prepared.adverse_ordinate(sense)
    return float(lane_constants(case, kind, np.array(prepared.adverse_area(sense)),
                                np.array(0.0 if ordinate is None else ordinate.value)))


def lane_constants(case: LoadCase, kind: str, areas: np.ndarray,
                   ordinates: np.ndarray) -> np.ndarray:
    """:func:`constant_terms` for lines with these adverse areas [response x length] and
    adverse extreme ordinates (0 where a line never has the sought sign)."""
    scale = case.factor * (1 + case.lane_allowance)
    total = scale * case.lane * areas
    knife = case.knife_edge_for(kind)
    if knife > 0:
        total = np.where(ordinates != 0, total + scale * knife * ordinates, total)
    return total
