"""Rating a model file on its exact effects: every section, capacity, vehicle and level.

:func:`rate` reads the ``[rating]`` settings, the ``[[capacity]]`` entries and the dead loads of a
model file; takes every envelope section (supports, both sides where shear jumps, tenth points,
extras) for each response that has a capacity; finds each section's capacity in each sense
(:func:`~influence.rating.capacity.capacity_at`; none: the section is reported "not rated");
integrates the dead loads exactly and places them in DC, DW and P; places every vehicle exactly
with the level's dynamic allowance set on its cases (so the allowance is applied once, and the
search governs the load as rated); distributes the lane to the girder; and rates each section,
response, sense, vehicle, level and limit state with :func:`~influence.rating.rate_section`.
Postings follow from the legal vehicles' lowest factors.

The dynamic allowance of a section at a level: the ``[rating]`` impact when given; LRFR IM =
33 % on the vehicle (reduced for legal and permit loads on smooth decks and spans of 40 ft or
more; none for an escorted crawl crossing), none on the lane load; LFR and ASR
I = 50/(L + 125) <= 0.30 from the section's span, on vehicle and lane load alike (AASHTO Standard
Specifications 3.8.2; the rules are :mod:`influence.rating.impact`'s).

Example (the bundled Pellow Brook bridge: the HL-93 inventory factor is governed by shear
beside the pier; Type 3's posting, RT = RF x 25 tons):
    >>> from pathlib import Path
    >>> bridge = Path(__file__).resolve().parents[2] / "examples" / "pellow-brook-bridge.toml"
    >>> ratings = rate(bridge, ("HL-93", "Type 3"), ("inventory", "legal"))
    >>> low = ratings.lowest("HL-93", "design inventory")
    >>> low.section[:2], low.response, low.limit_state, round(low.rating_factor, 3)  # symmetric
    ('P1', 'shear', 'Strength I', 0.514)
    >>> type3 = ratings.postings.legal[0]
    >>> type3.vehicle, type3.posting.action, round(type3.posting.rating, 2)
    ('Type 3', 'none', 32.01)
"""

from __future__ import annotations

import dataclasses
from collections.abc import Sequence
from dataclasses import dataclass
from pathlib import Path

from influence.analysis.lines import analyse_model
from influence.design.loading import vehicles_for
from influence.design.sections import Section
from influence.errors import ModelError
from influence.model.path import trace
from influence.model.reader import ModelFile, read_model_file
from influence.rating.capacity import Capacity, capacities, capacity_at, check_on_structure
from influence.rating.dead_terms import DeadLoadTerms, dead_load_terms
from influence.rating.demands import (
    RATED_RESPONSES,
    LiveEffect,
    LiveSearch,
    RatedSection,
    rated_sections,
)
from influence.rating.impact import ImpactAllowance, lfr_impact, lrfr_impact
from influence.rating.live_factors import checked_adtt
from influence.rating.load_factors import limit_states
from influence.rating.rating_vehicles import default_vehicles, levels_of, rating_levels
from influence.rating.ratings import (
    ConcurrentMoment,
    NotRated,
    RatedVehicle,
    Ratings,
    SectionRating,
)
from influence.rating.result import SENSES, SectionEffects
from influence.rating.section_rating import rate_section
from influence.rating.settings import RatingSettings, rating_settings
from influence.rating.traceability import distribution_basis, live_factor_basis
from influence.rating.vehicle_postings import postings_of
from vehicles.errors import VehicleError
from vehicles.loadmodel import KIP_PER_TON, LoadModel
from vehicles.search.concurrent import concurrent

MEMORY_CATEGORIES = ("legal", "specialized hauling", "notional", "emergency")
"""Library categories whose axle data the outputs label with their confidence."""


@dataclass(frozen=True)
class RatingInputs:
    """A model file read for rating: its settings, capacities and dead-load terms, checked.

    Attributes:
        model_file: the model file.
        settings: the ``[rating]`` settings.
        capacities: the ``[[capacity]]`` entries, checked against the structure.
        terms: the load names of ``[[loads]]`` in DC, DW and P.
    """

    model_file: ModelFile
    settings: RatingSettings
    capacities: tuple[Capacity, ...]
    terms: DeadLoadTerms


def rating_inputs(source: ModelFile | str | Path) -> RatingInputs:
    """Read and check what a rating needs from a model file.

    Raises:
        ModelError: one line naming the file, the key and the fix (no ``[rating]``, no
            capacities, a capacity of the wrong sign, off the path or overlapping another, an
            unknown method or edition, a negative ADTT, a load name in no rating term, ...).
    """
    model_file = source if isinstance(source, ModelFile) else read_model_file(source)
    document, name, model = model_file.document, model_file.source, model_file.model
    if "rating" not in document:
        raise ModelError("the model file has no [rating] table", source=name, item="rating",
                         fix="add [rating] (method, edition, material, ...) and [[capacity]] "
                             "entries")
    settings = rating_settings_of(model_file)
    entries = capacities(document, settings.method, name)
    if not entries:
        raise ModelError("no [[capacity]] entries: nothing can be rated", source=name,
                         item="capacity", fix="give the resistance of the members to rate")
    path = trace(model)
    check_on_structure(entries, path.total_length,
                       {leg.member: (leg.start_chainage, leg.end_chainage) for leg in path.legs},
                       name)
    terms = dead_load_terms(settings.dead_loads, model_file.basis.load_names, name)
    return RatingInputs(model_file, settings, entries, terms)


def rating_settings_of(model_file: ModelFile) -> RatingSettings:
    """The ``[rating]`` settings of a model file, read in its units."""
    return rating_settings(model_file.document, model_file.model.units, model_file.source)


def rate(source: ModelFile | RatingInputs | str | Path, vehicles: Sequence[str] = (),
         levels: Sequence[str] = (), *, concurrent_moment: bool = False,
         adtt: float | None = None, sections: Sequence[Section] | None = None) -> Ratings:
    """Rate every section of a model file for vehicles at levels.

    Args:
        source: a model file (path or read), or its rating inputs.
        vehicles: library names or vehicle files; none: the defaults of each level.
        levels: rating levels ("inventory", "operating", "legal", "permit", or the method's
            own names); none: the ``[rating]`` levels.
        concurrent_moment: report, for every shear rating, the moment at the section under the
            same loads.
        adtt: trucks a day in one direction, instead of the ``[rating]`` value.
        sections: where to rate (default: the envelope sections of the model file).

    Raises:
        ModelError, VehicleError: one line naming what was wrong and the fix.
    """
    inputs = source if isinstance(source, RatingInputs) else rating_inputs(source)
    settings = inputs.settings if adtt is None else _with_adtt(inputs.settings, adtt)
    return rate_inputs(inputs, settings, vehicles, levels, concurrent_moment=concurrent_moment,
                       sections=sections)


def _with_adtt(settings: RatingSettings, adtt: float) -> RatingSettings:
    checked_adtt(adtt, "adtt")
    return dataclasses.replace(settings, adtt=float(adtt))


def rate_inputs(inputs: RatingInputs, settings: RatingSettings, vehicles: Sequence[str] = (),
                levels: Sequence[str] = (), *, concurrent_moment: bool = False,
                sections: Sequence[Section] | None = None, crawl: bool = False,
                permit_levels: tuple[str, ...] = ("permit",),
                vehicle_models: Sequence[tuple[LoadModel, tuple[str, ...]]] = (),
                vehicle_notes: Sequence[str] = ()) -> Ratings:
    """:func:`rate` with the settings given (overridden by the caller, as a permit check does).

    Args:
        crawl: an escorted permit crossing at 10 mph or less: no dynamic allowance at the
            permit levels.
        permit_levels: levels at which the permit's distribution rule applies.
        vehicle_models: load models already in the model's units, each with its levels,
            rated instead of ``vehicles`` (a permit vehicle at the permit level, whatever its
            category).
        vehicle_notes: notes on those models (unit conversions).
    """
    model_file = inputs.model_file
    model, source = model_file.model, model_file.source
    asked = rating_levels(tuple(levels), settings.method, source) if levels else settings.levels
    if "permit" in asked and settings.permit is None:
        raise ModelError("the permit level needs a permit", source=source, item="rating.permit",
                         fix="describe it in [rating.permit], or use `influence permit`")
    if vehicle_models:
        chosen, notes = list(vehicle_models), list(vehicle_notes)
    else:
        chosen, notes = _vehicles(tuple(vehicles), asked, settings.method, model.units,
                                  explicit=bool(levels))
    analysis = analyse_model(model)
    kinds = tuple(k for k in RATED_RESPONSES if any(c.response == k for c in inputs.capacities))
    rated = rated_sections(analysis, model_file.basis, kinds, sections=sections,
                           concurrent_moment=concurrent_moment)
    run = _Run(inputs, settings, rated, crawl, permit_levels)
    for vehicle, vehicle_levels in chosen:
        for level in vehicle_levels:
            run.rate_vehicle(vehicle, level)
    found = tuple(r for _, r in sorted(run.found, key=lambda item: item[0]))
    rated_vehicles = tuple(_rated_vehicle(m, lv) for m, lv in chosen)
    notes += _vehicle_notes(rated_vehicles) + run.notes() + _own_allowances(chosen)
    missing = tuple(entry for key, entry in sorted(
        run.not_rated.items(), key=lambda item: (item[0][0], SENSES.index(item[0][1]))))
    return Ratings(model.title, model.units, source, settings, asked, rated_vehicles, found,
                   missing,
                   postings_of(found, rated_vehicles, settings.method, settings.sign_increment),
                   tuple(dict.fromkeys(notes)))


def _vehicles(names: tuple[str, ...], asked: tuple[str, ...], method: str, units: str,
              explicit: bool) -> tuple[list[tuple[LoadModel, tuple[str, ...]]], list[str]]:
    """Each load model with the levels it is rated at, and the notes of their loading."""
    if names:
        models, notes = vehicles_for(tuple(dict.fromkeys(names)), units)
        chosen = []
        for vehicle in models:
            own = levels_of(vehicle, method)
            fits = tuple(level for level in asked if level in own)
            if not fits:
                raise ModelError(
                    f"{vehicle.name} ({vehicle.category or 'no category'}) is rated at "
                    f"{', '.join(own)}, not at {', '.join(asked)}", item="vehicle",
                    fix="ask for one of its levels, or name a vehicle for these levels")
            chosen.append((vehicle, fits))
        return chosen, notes
    by_name: dict[str, list[str]] = {}
    notes = []
    for level in asked:
        defaults = default_vehicles(method, level)
        if not defaults:
            if explicit:
                raise ModelError(f"the {level} level has no default vehicle", item="vehicle",
                                 fix="name the vehicle (a permit vehicle file, for example)")
            notes.append(f"{level} level: no vehicle named, so none rated there")
        for name in defaults:
            by_name.setdefault(name, []).append(level)
    models, more = vehicles_for(tuple(by_name), units)
    return [(m, tuple(by_name[n])) for m, n in zip(models, by_name, strict=True)], notes + more


def _rated_vehicle(vehicle: LoadModel, levels: tuple[str, ...]) -> RatedVehicle:
    try:
        weight: float | None = vehicle.gross_weight_tons
    except VehicleError:
        weight = None
    return RatedVehicle(vehicle.name, vehicle.category, levels, weight, vehicle.standard,
                        vehicle.notes)


def _own_allowances(chosen: Sequence[tuple[LoadModel, tuple[str, ...]]]) -> list[str]:
    """Which load models carried allowances of their own, now set aside."""
    own = []
    for vehicle, _ in chosen:
        values = sorted({v for c in vehicle.cases for v in
                         (c.axle_allowance, c.patch_allowance, c.lane_allowance) if v})
        if values:
            own.append(f"{vehicle.name} {'/'.join(f'{v:g}' for v in values)}")
    if not own:
        return []
    return ["the load models' own dynamic allowances are set aside and the rating's used in "
            "their place, so none is applied twice: " + ", ".join(own)]


def _vehicle_notes(vehicles: tuple[RatedVehicle, ...]) -> list[str]:
    return [f"{v.name} ({v.category}): {v.notes[0]}" for v in vehicles
            if v.category in MEMORY_CATEGORIES and v.standard and v.notes]


class _Run:
    """The rating of one model file: capacities found once, searches shared across levels."""

    def __init__(self, inputs: RatingInputs, settings: RatingSettings,
                 rated: tuple[RatedSection, ...], crawl: bool,
                 permit_levels: tuple[str, ...]) -> None:
        self.inputs = inputs
        self.settings = settings
        self.rated = rated
        self.units = inputs.model_file.model.units
        self.crawl = crawl
        self.permit_levels = permit_levels
        self.search = LiveSearch(rated, self.units)
        self.found: list[tuple[tuple[int, int, int], SectionRating]] = []
        self.not_rated: dict[tuple[int, str, str, str], NotRated] = {}
        self.capacity: dict[tuple[int, str], Capacity | None] = {}
        self.allowances: dict[tuple[str, float], ImpactAllowance] = {}
        self.counter = 0
        for index, section in enumerate(rated):
            for sense in SENSES:
                found = _capacity(inputs.capacities, section, sense)
                self.capacity[(index, sense)] = found
                if found is None:
                    self._not_rated(index, sense, "no capacity covers this section")

    def notes(self) -> list[str]:
        used = sorted({(a.fraction, a.basis, a.mark) for a in self.allowances.values()})
        return [f"dynamic allowance {f:g}: {basis} ({mark}); set on every case of the load "
                "models in place of their own" for f, basis, mark in used]

    def _not_rated(self, index: int, sense: str, reason: str, level: str = "",
                   limit_state: str = "") -> None:
        section = self.rated[index]
        self.not_rated.setdefault((index, sense, level, limit_state), NotRated(
            section.label, section.section.chainage, section.response.kind,
            section.response.side, sense, reason, level, limit_state))

    def _allowance(self, level: str, span: float) -> ImpactAllowance:
        key = (level, span)
        if key not in self.allowances:
            self.allowances[key] = allowance(self.settings, level, span, self.units,
                                             crawl=self.crawl and level in self.permit_levels)
        return self.allowances[key]

    def _limit_states(self, level: str) -> tuple[str, ...]:
        settings = self.settings
        if settings.method != "LRFR" or settings.material is None:
            return ("",)
        here = {row.limit_state for row in limit_states(settings.material, level)}
        return tuple(ls for ls in settings.limit_states if ls in here)

    def _vehicle_settings(self, vehicle: LoadModel, impact: float) -> RatingSettings:
        permit = self.settings.permit
        if permit is not None and permit.gross_weight_kip is None:
            try:
                weight = vehicle.gross_weight_tons * KIP_PER_TON
                permit = dataclasses.replace(permit, gross_weight_kip=weight)
            except VehicleError:
                pass
        return dataclasses.replace(self.settings, impact=impact, permit=permit)

    def rate_vehicle(self, vehicle: LoadModel, level: str) -> None:
        """Rate every section with a capacity for one vehicle at one level."""
        indices = [i for i in range(len(self.rated))
                   if any(self.capacity[(i, s)] is not None for s in SENSES)]
        used = [self._allowance(level, self.rated[i].span_length) for i in indices]
        lane = [0.0 if self.settings.method == "LRFR" else a.fraction for a in used]
        effects = self.search.effects(vehicle, indices,
                                      [(a.fraction, b) for a, b in zip(used, lane, strict=True)])
        states = self._limit_states(level)
        for index, pair, impact in zip(indices, effects, used, strict=True):
            if pair is None:
                continue
            for sense, live in zip(SENSES, pair, strict=True):
                capacity = self.capacity[(index, sense)]
                if capacity is None or live is None:
                    continue
                for order, state in enumerate(states):
                    self._rate(index, sense, vehicle, level, state, order, capacity, live,
                               impact)
        self.counter += 1

    def _rate(self, index: int, sense: str, vehicle: LoadModel, level: str, limit_state: str,
              order: int, capacity: Capacity, live: LiveEffect, impact: ImpactAllowance) -> None:
        section = self.rated[index]
        settings = self._vehicle_settings(vehicle, impact.fraction)
        permit_rule = level in self.permit_levels
        g, g_basis = distribution_basis(settings, section.response.kind, permit_rule,
                                        self.inputs.model_file.basis.live.scale)
        dc, dw, p = self.inputs.terms.split(dict(section.dead))
        if settings.method == "LRFR":
            effects = SectionEffects(sense, dc, dw, p, live=live.vehicle, lane=live.lane,
                                     distribution=g)
        else:  # I acts on the lane load too: the whole live effect is multiplied by (1 + I)
            effects = SectionEffects(sense, dc, dw, p, distribution=g,
                                     live=live.vehicle + live.lane / (1.0 + live.lane_allowance))
        result = rate_section(settings, capacity, effects, level=level, limit_state=limit_state,
                              span_length=section.span_length, units=self.units)
        if result is None:
            what = "service" if limit_state.startswith("Service") else f"{level} allowable"
            self._not_rated(index, sense, f"no {what} capacity given: {limit_state or level} "
                            "not checked", "" if limit_state else level, limit_state)
            return
        moment = None
        if section.moment_line is not None:
            moment = ConcurrentMoment(
                concurrent(live.placement, section.moment_line.function).value * g,
                section.dead_moment)
        entry = SectionRating(
            section, sense, vehicle.name, level, limit_state, capacity, result, live, impact,
            g_basis, live_factor_basis(settings, level, limit_state), self.inputs.terms.terms,
            moment)
        self.found.append(((index, SENSES.index(sense), self.counter * 16 + order), entry))


def _capacity(entries: tuple[Capacity, ...], section: RatedSection,
              sense: str) -> Capacity | None:
    """The capacity at a section: by its label, then its place (node or chainage), member and
    range."""
    kind, where = section.response.kind, section.section
    found = capacity_at(entries, kind, sense, chainage=where.chainage, member=section.member,
                        label=where.label)
    if found is None and where.location != where.label:
        found = capacity_at(entries, kind, sense, chainage=where.chainage,
                            member=section.member, label=where.location)
    return found


def allowance(settings: RatingSettings, level: str, span_length: float, units: str, *,
              crawl: bool = False) -> ImpactAllowance:
    """The dynamic allowance on the vehicle at a level and span.

    Args:
        settings: the ``[rating]`` settings (their ``impact`` overrides the rules).
        level: rating level.
        span_length: the section's span [length of ``units``].
        units: "kip-ft" or "kN-m".
        crawl: an escorted permit crossing at 10 mph or less: none.

    Example:
        >>> from influence.rating.settings import rating_settings
        >>> lfr = rating_settings({"rating": {"method": "LFR"}}, "kip-ft")
        >>> allowance(lfr, "inventory", 50.0, "kip-ft").fraction      # 50 / 175
        0.285714285714
    """
    if crawl and settings.method == "LRFR":
        return lrfr_impact("permit", span_length, units, escorted_crawl=True)
    if crawl:
        return ImpactAllowance(0.0, "escorted permit at 10 mph or less: impact neglected",
                               "as MBE 6A.4.5.5 allows for LRFR (from memory, unconfirmed); "
                               "taken for LFR and ASR too (common practice)")
    if settings.impact is not None:
        return ImpactAllowance(settings.impact, "as [rating] impact sets it", "model file")
    if settings.method == "LRFR":
        surface = "standard" if level.startswith("design") else settings.surface
        return lrfr_impact(level, span_length, units, surface=surface)
    return lfr_impact(span_length, units)
