"""A permit check: one permit vehicle over one bridge, both directions, every rated section.

The vehicle is placed exactly, travelling both ways, at every section that has a capacity; each
section, response, sense and limit state is rated at the permit level (LRFR, MBE 6A.4.5: Strength
II and the service checks of the material) or at operating (LFR and ASR). A section passes when
every factor there is 1.0 or more; the permit passes when every rated section does (common
practice; MBE 6A.4.5, from memory, unconfirmed). The result names the governing section, the
vehicle's position and direction there, the factor, and the restrictions the check assumed.

The crossing: ``escorted`` and ``trips`` make it a special (limited-crossing) permit, escorted
with no other vehicles on the bridge or mixed with traffic, one trip or several; otherwise the
``[rating.permit]`` table, else a routine permit mixed with traffic. ``crawl`` (escorted only)
drops the dynamic allowance for a crossing at 10 mph or less (MBE 6A.4.5.5, from memory,
unconfirmed). The distribution and live-load factor follow the permit type (see
:mod:`influence.rating.traceability` and :mod:`influence.rating.live_factors`).
"""

from __future__ import annotations

import dataclasses
from dataclasses import dataclass
from pathlib import Path

from influence.design.loading import vehicles_for
from influence.errors import ModelError
from influence.model.reader import ModelFile
from influence.rating.live_factors import PermitCrossing, checked_adtt
from influence.rating.load_factors import limit_states
from influence.rating.ratings import NotRated, Ratings, SectionRating
from influence.rating.run import RatingInputs, rate_inputs, rating_inputs
from influence.rating.settings import RatingSettings
from vehicles.errors import VehicleError
from vehicles.loadmodel import KIP_PER_TON, LoadModel

VERDICTS = ("PASS", "FAIL", "NOT CHECKED")


@dataclass(frozen=True)
class SectionVerdict:
    """The permit at one section: its lowest factor and whether it passes.

    Attributes:
        section: section label.
        chainage: [length], None off the path.
        governing: the lowest rating there (response, sense, limit state, placement).
    """

    section: str
    chainage: float | None
    governing: SectionRating

    @property
    def rating_factor(self) -> float:
        return self.governing.rating_factor

    @property
    def passes(self) -> bool:
        return self.rating_factor >= 1.0


@dataclass(frozen=True)
class PermitCheck:
    """A permit vehicle over the bridge.

    Attributes:
        vehicle: the permit vehicle's name.
        gross_weight_tons: its weight [ton of 2000 lb].
        crossing: permit type, frequency and loading condition.
        crawl: whether the dynamic allowance was dropped for a crawl crossing.
        level: the level rated ("permit" for LRFR, "operating" for LFR and ASR).
        sections: one verdict a rated section, in section order.
        restrictions: what the check assumed, in words.
        ratings: the full rating run behind the verdicts.
    """

    vehicle: str
    gross_weight_tons: float
    crossing: PermitCrossing
    crawl: bool
    level: str
    sections: tuple[SectionVerdict, ...]
    restrictions: tuple[str, ...]
    ratings: Ratings

    @property
    def governing(self) -> SectionVerdict | None:
        """The section with the lowest factor (the first on a tie), None if none is rated."""
        return min(self.sections, key=lambda s: s.rating_factor) if self.sections else None

    @property
    def verdict(self) -> str:
        """"PASS" (every rated section at 1.0 or more), "FAIL", or "NOT CHECKED" (no section
        rated)."""
        if not self.sections:
            return "NOT CHECKED"
        return "PASS" if all(s.passes for s in self.sections) else "FAIL"

    @property
    def not_rated(self) -> tuple[NotRated, ...]:
        return self.ratings.not_rated


def permit_crossing(settings: RatingSettings, *, escorted: bool = False,
                    trips: str | None = None) -> PermitCrossing:
    """The crossing of a check: the flags given, else ``[rating.permit]``, else a routine
    permit mixed with traffic.

    Example:
        >>> from influence.rating.settings import rating_settings
        >>> settings = rating_settings({"rating": {"material": "steel"}}, "kip-ft")
        >>> permit_crossing(settings, escorted=True).loading
        'escorted, no other vehicles'
        >>> permit_crossing(settings).kind
        'routine'

    Raises:
        ModelError: for a trip count other than "single" or "multiple".
    """
    if trips is not None and trips not in ("single", "multiple"):
        raise ModelError(f"trips {trips!r}", item="trips", fix='use "single" or "multiple"')
    if escorted or trips is not None:
        frequency = "multiple trips" if trips == "multiple" else "single trip"
        loading = "escorted, no other vehicles" if escorted else "mixed with traffic"
        return PermitCrossing("special", frequency, loading)
    if settings.permit is not None:
        return settings.permit
    return PermitCrossing("routine")


def permit_vehicle(name_or_path: str | Path, units: str) -> tuple[LoadModel, list[str]]:
    """The permit vehicle in the model's units (it must be a train of axles), and a note if it
    was converted.

    Raises:
        VehicleError: for a file that cannot be read or has no axles.
    """
    models, notes = vehicles_for((str(name_or_path),), units)
    vehicle = models[0]
    try:
        vehicle.gross_weight  # noqa: B018 (the property checks there is a train of axles)
    except VehicleError:
        raise VehicleError("the permit vehicle has no axles", source=str(name_or_path),
                           item="vehicle",
                           fix="give the permit's axle loads and spacings (loads = [...], "
                               "spacings = [...])") from None
    return vehicle, notes


def _restrictions(crossing: PermitCrossing, crawl: bool, settings: RatingSettings,
                  level: str) -> tuple[str, ...]:
    found = [f"{crossing.kind} permit, {crossing.frequency}, {crossing.loading}",
             "the vehicle travels both ways; one permit vehicle on the structure at a time"]
    if crossing.loading.startswith("escorted"):
        found.append("escort vehicles keep all other traffic off the bridge while it crosses")
    if crawl:
        found.append("crossing at 10 mph or less: no dynamic allowance")
    if settings.method == "LRFR":
        found.append(f"rated at the {level} level: the permit live-load factor of "
                     f"{settings.edition}, ADTT "
                     + ("unknown" if settings.adtt is None else f"{settings.adtt:g}"))
    else:
        found.append(f"rated at the {level} level of {settings.method}")
    return tuple(found)


def check_permit(source: ModelFile | RatingInputs | str | Path, vehicle: str | Path, *,
                 escorted: bool = False, crawl: bool = False, trips: str | None = None,
                 adtt: float | None = None) -> PermitCheck:
    """Check one permit vehicle over a model file's structure.

    Args:
        source: the model file (path or read) or its rating inputs.
        vehicle: the permit vehicle: a vehicle file, or a library name.
        escorted: escorted, no other vehicles on the bridge (a special permit).
        crawl: escorted crossing at 10 mph or less: no dynamic allowance.
        trips: "single" or "multiple" trips (a special permit); None: as ``[rating.permit]``,
            or a routine permit.
        adtt: trucks a day in one direction, instead of the ``[rating]`` value.

    Raises:
        ModelError, VehicleError: one line (crawl without an escort, a negative ADTT, a vehicle
            without axles, a crossing the permit table does not hold, ...).

    Example (the bundled Pellow Brook bridge and crane carrier: the escorted crossing passes,
    the routine permit does not; shear just beside the pier governs both):
        >>> from pathlib import Path
        >>> examples = Path(__file__).resolve().parents[2] / "examples"
        >>> bridge = rating_inputs(examples / "pellow-brook-bridge.toml")
        >>> carrier = examples / "vehicles" / "crane-carrier-5-axle.toml"
        >>> check = check_permit(bridge, carrier, escorted=True)
        >>> check.verdict, check.governing.section[:2], round(check.governing.rating_factor, 3)
        ('PASS', 'P1', 1.092)
        >>> check_permit(bridge, carrier).verdict
        'FAIL'
    """
    inputs = source if isinstance(source, RatingInputs) else rating_inputs(source)
    settings = inputs.settings
    if adtt is not None:
        checked_adtt(adtt, "adtt")
        settings = dataclasses.replace(settings, adtt=float(adtt))
    if crawl and not escorted:
        raise ModelError("a crawl crossing is an escorted permit rule", item="crawl",
                         fix="add escorted, or drop crawl")
    model = inputs.model_file.model
    permit, notes = permit_vehicle(vehicle, model.units)
    crossing = dataclasses.replace(permit_crossing(settings, escorted=escorted, trips=trips),
                                   gross_weight_kip=permit.gross_weight_tons * KIP_PER_TON)
    level = "permit" if settings.method == "LRFR" else "operating"
    permitted = dataclasses.replace(settings, permit=crossing,
                                    limit_states=_permit_limit_states(settings))
    ratings = rate_inputs(inputs, permitted, (), (level,), crawl=crawl, permit_levels=(level,),
                          vehicle_models=((permit, (level,)),), vehicle_notes=notes)
    by_section: dict[tuple[str, float | None], SectionRating] = {}
    for rating in ratings.ratings:
        key = (rating.section, rating.chainage)
        if key not in by_section or rating.rating_factor < by_section[key].rating_factor:
            by_section[key] = rating
    order = {key: n for n, key in enumerate(by_section)}
    keys = sorted(by_section, key=lambda k: (_along(k[1]), order[k]))
    verdicts = tuple(SectionVerdict(label, chainage, by_section[(label, chainage)])
                     for label, chainage in keys)
    return PermitCheck(permit.name, permit.gross_weight_tons, crossing, crawl, level, verdicts,
                       _restrictions(crossing, crawl, permitted, level), ratings)


def _along(chainage: float | None) -> float:
    """Sections in chainage order, those off the path last."""
    return float("inf") if chainage is None else chainage


def _permit_limit_states(settings: RatingSettings) -> tuple[str, ...]:
    """The limit states at the permit level: those the MBE requires there, and the optional
    ones the settings name."""
    if settings.method != "LRFR" or settings.material is None:
        return settings.limit_states
    rows = limit_states(settings.material, "permit")
    return tuple(r.limit_state for r in rows
                 if not r.optional or r.limit_state in settings.limit_states)
