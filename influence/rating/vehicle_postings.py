"""Postings from a rating run: each legal vehicle's lowest factor at the posting level through the
posting law, the NRL screening of SU4-SU7 and the emergency-vehicle limits.

The posting level is "legal" for LRFR and "operating" for LFR and ASR (TxDOT Bridge Inspection
Manual ch. 6 sec. 2: posting rests on the operating rating of the legal loads, confirmed). The
factor of a vehicle is its lowest over every section, response, sense and limit state rated at
that level (the adverse choice; common practice). The lane-type legal load is posted with the
weight of the Type 3-3 trucks it is made of (from memory, unconfirmed). The rules themselves are
:mod:`influence.rating.posting`'s (the posting law confirmed by M. A. Khan, *Bridge and Highway
Structure Rehabilitation and Repair*, McGraw-Hill 2010, ch. 5 p. 187).
"""

from __future__ import annotations

from collections.abc import Sequence

from influence.rating.posting import (
    EmergencyVehicleLimits,
    SingleUnitPosting,
    emergency_vehicle_limits,
    posting,
    single_unit_posting,
)
from influence.rating.rating_vehicles import lane_type_rule
from influence.rating.ratings import Postings, RatedVehicle, SectionRating, VehiclePosting
from influence.rating.tables import POSTING_FILE, data_file
from vehicles.library.catalog import get_model
from vehicles.loadmodel import KIP_PER_TON


def posting_level(method: str) -> str:
    """The level postings rest on: "legal" (LRFR) or "operating" (LFR, ASR)."""
    return "legal" if method == "LRFR" else "operating"


def _lowest(ratings: Sequence[SectionRating], vehicle: str, level: str) -> SectionRating | None:
    found = [r for r in ratings if (r.vehicle, r.level) == (vehicle, level)]
    return min(found, key=lambda r: r.rating_factor) if found else None


def _weight(vehicle: RatedVehicle) -> tuple[float | None, str]:
    rule = lane_type_rule()
    if vehicle.name == rule.model:
        weight = get_model(rule.posting_weight_of).gross_weight_tons
        return weight, f"{rule.posting_weight_of} weight: {rule.marks[1]}"
    if vehicle.gross_weight_tons is None:
        return None, ""
    return vehicle.gross_weight_tons, "gross weight of the vehicle's axles"


def postings_of(ratings: Sequence[SectionRating], vehicles: Sequence[RatedVehicle],
                method: str, increment: float | None = None) -> Postings:
    """Postings from the ratings at the posting level.

    Args:
        ratings: every rating factor of the run.
        vehicles: the load models rated.
        method: "LRFR", "LFR" or "ASR".
        increment: sign increment to round posted loads down to [ton] (None: exact).
    """
    level = posting_level(method)
    notes: list[str] = []
    legal = []
    for vehicle in vehicles:
        low = _lowest(ratings, vehicle.name, level)
        if vehicle.category != "legal" or low is None:
            continue
        weight, basis = _weight(vehicle)
        if weight is None:
            notes.append(f"{vehicle.name}: no posting, the model has no gross weight of axles")
            continue
        legal.append(VehiclePosting(vehicle.name, weight, basis,
                                    posting(low.rating_factor, weight, increment), low))
    return Postings(level, tuple(legal), _single_unit(ratings, vehicles, level, increment, notes),
                    _emergency(ratings, level, increment, notes), tuple(notes))


def _single_unit(ratings: Sequence[SectionRating], vehicles: Sequence[RatedVehicle], level: str,
                 increment: float | None, notes: list[str]) -> SingleUnitPosting | None:
    table = data_file(POSTING_FILE)["shv"]
    screening = _lowest(ratings, table["screening_vehicle"], level)
    if screening is None:
        return None
    weights = {v.name: v.gross_weight_tons for v in vehicles}
    units = {}
    for name in table["single_unit_vehicles"]:
        low = _lowest(ratings, name, level)
        weight = weights.get(name)
        if low is not None and weight is not None:
            units[name] = (low.rating_factor, weight)
    missing = [n for n in table["single_unit_vehicles"] if n not in units]
    if screening.rating_factor < 1.0 and missing:
        notes.append(f"NRL rating factor {screening.rating_factor:.3g} is below 1.0 and "
                     f"{', '.join(missing)} were not rated: rate them for the single-unit "
                     "posting")
        return None
    return single_unit_posting(screening.rating_factor, units, increment)


def _emergency(ratings: Sequence[SectionRating], level: str, increment: float | None,
               notes: list[str]) -> EmergencyVehicleLimits | None:
    ev2, ev3 = (_lowest(ratings, name, level) for name in ("EV2", "EV3"))
    if ev2 is None and ev3 is None:
        return None
    if ev2 is None or ev3 is None:
        notes.append("emergency-vehicle limits need both EV2 and EV3 rated")
        return None
    return emergency_vehicle_limits(ev2.rating_factor, ev3.rating_factor,
                                    None if increment is None else increment * KIP_PER_TON)
