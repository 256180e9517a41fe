"""What a rating run returns: every rating factor with the terms it came from, the sections not
rated and why, the lowest factor per vehicle and level, and the postings.

Each :class:`SectionRating` keeps what a checker needs to redo the number by hand: the capacity
entry and C, each dead load's effect by name and its term (DC, DW, P), the vehicle's static
effect and the lane part, the dynamic allowance used and why, the distribution factor and its
basis, the live-load factor and its basis, and the placement exactly as the governing search
gave it. Signs as in the README (sagging moment positive); values in the model's units.
"""

from __future__ import annotations

import math
from dataclasses import dataclass, field

from influence.rating.capacity import Capacity
from influence.rating.demands import LiveEffect, RatedSection
from influence.rating.impact import ImpactAllowance
from influence.rating.posting import EmergencyVehicleLimits, Posting, SingleUnitPosting
from influence.rating.result import RatingResult
from influence.rating.settings import RatingSettings


@dataclass(frozen=True)
class ConcurrentMoment:
    """The moment at a shear section under the governing shear placement.

    Attributes:
        live: the vehicle's moment as placed (allowance included), times the distribution
            factor [moment], signed.
        dead: each dead load's moment at the section, by load name [moment], signed.
    """

    live: float
    dead: tuple[tuple[str, float], ...]


@dataclass(frozen=True)
class SectionRating:
    """One rating factor: a section, response and sense, a vehicle, a level, a limit state.

    Attributes:
        rated: the section, its response, influence line and dead-load effects by name.
        sense: "positive" or "negative".
        vehicle: load model name.
        level: rating level.
        limit_state: LRFR limit state ("" for LFR and ASR).
        capacity: the ``[[capacity]]`` entry that applies.
        result: the rating equation with every term (C, factored dead terms, gL, IM, RF).
        live: the governing placement and its vehicle and lane parts.
        impact: the dynamic allowance used, with its basis and mark.
        distribution_basis: how the distribution factor was found.
        live_factor_basis: the table entry of the live-load factor and its mark.
        dead_terms: (load name, term) for the loads of the model file.
        concurrent_moment: for shear, the moment under the same loads, if asked for.
    """

    rated: RatedSection = field(repr=False)
    sense: str
    vehicle: str
    level: str
    limit_state: str
    capacity: Capacity
    result: RatingResult
    live: LiveEffect = field(repr=False)
    impact: ImpactAllowance
    distribution_basis: str
    live_factor_basis: str
    dead_terms: tuple[tuple[str, str], ...]
    concurrent_moment: ConcurrentMoment | None = None

    @property
    def rating_factor(self) -> float:
        return self.result.rating_factor

    @property
    def section(self) -> str:
        return self.rated.section.label

    @property
    def chainage(self) -> float | None:
        return self.rated.section.chainage

    @property
    def response(self) -> str:
        return self.rated.response.kind

    @property
    def live_with_impact(self) -> float:
        """LL + IM after distribution, in the magnitude of the sense [as the effect]."""
        return self.result.live_with_impact


@dataclass(frozen=True)
class NotRated:
    """A section, response and sense (and where it applies a vehicle, level or limit state)
    that has no rating factor, and why."""

    section: str
    chainage: float | None
    response: str
    side: str
    sense: str
    reason: str
    level: str = ""
    limit_state: str = ""


@dataclass(frozen=True)
class RatedVehicle:
    """A load model as the rating used it.

    Attributes:
        name: library name or the vehicle file's name.
        category: what the model is for ("legal", "design", ...; "" when unsaid).
        levels: the levels it was rated at.
        gross_weight_tons: W for posting [ton of 2000 lb], None for models without a train of
            axles (HL-93, lane loads).
        standard: the standard it comes from ("" for a user's vehicle).
        notes: the model's own notes on its data and their confidence.
    """

    name: str
    category: str
    levels: tuple[str, ...]
    gross_weight_tons: float | None
    standard: str
    notes: tuple[str, ...]


@dataclass(frozen=True)
class VehiclePosting:
    """The posting of one legal vehicle from its lowest rating factor at the posting level.

    Attributes:
        vehicle: load model name.
        weight_tons: W [ton].
        weight_basis: where W comes from.
        posting: RT, the action and the posted load [ton].
        governing: the rating that gave the factor.
    """

    vehicle: str
    weight_tons: float
    weight_basis: str
    posting: Posting
    governing: SectionRating = field(repr=False)


@dataclass(frozen=True)
class Postings:
    """Postings from the ratings at the posting level.

    Attributes:
        level: the level postings rest on ("legal" for LRFR, "operating" for LFR and ASR).
        legal: per legal vehicle rated.
        single_unit: the NRL screening of SU4-SU7, None when the NRL was not rated.
        emergency: the EV2/EV3 limits, None unless both were rated.
        notes: what was assumed or could not be done.
    """

    level: str
    legal: tuple[VehiclePosting, ...] = ()
    single_unit: SingleUnitPosting | None = None
    emergency: EmergencyVehicleLimits | None = None
    notes: tuple[str, ...] = ()


@dataclass(frozen=True)
class Ratings:
    """Everything a rating run found.

    Attributes:
        title: the model's title.
        units: "kN-m" or "kip-ft".
        source: the model file.
        settings: the ``[rating]`` settings used (with any overrides).
        levels: the levels rated.
        vehicles: the load models rated.
        ratings: every rating factor, in section order.
        not_rated: sections, responses and senses (or limit states) without a factor, and why.
        postings: postings at the posting level.
        notes: conversions, rules applied, confidence of the vehicles' data.
    """

    title: str
    units: str
    source: str
    settings: RatingSettings
    levels: tuple[str, ...]
    vehicles: tuple[RatedVehicle, ...]
    ratings: tuple[SectionRating, ...]
    not_rated: tuple[NotRated, ...]
    postings: Postings
    notes: tuple[str, ...] = ()

    def lowest(self, vehicle: str, level: str) -> SectionRating | None:
        """The lowest rating factor of a vehicle at a level (the first in section order on a
        tie), or None when it has none."""
        found = [r for r in self.ratings if (r.vehicle, r.level) == (vehicle, level)]
        return min(found, key=lambda r: r.rating_factor) if found else None

    def summary(self) -> tuple[SectionRating, ...]:
        """The lowest factor of every vehicle at every level it was rated at."""
        found = []
        for vehicle in self.vehicles:
            for level in vehicle.levels:
                low = self.lowest(vehicle.name, level)
                if low is not None:
                    found.append(low)
        return tuple(found)

    @property
    def lowest_factor(self) -> float:
        """The lowest rating factor of the run (inf when none is finite)."""
        return min((r.rating_factor for r in self.ratings), default=math.inf)
