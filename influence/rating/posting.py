"""Load posting from rating factors: the LRFR posting law, SHV screening, EV posting limits.

- Rating in tons RT = RF x W, W the rating vehicle's weight in tons; safe posting load
  W/0.7 (RF - 0.3) for 0.3 <= RF < 1.0; below 0.3 the bridge should be considered for closing;
  none at RF >= 1.0 (MBE 6A.8.3; confirmed by M. A. Khan, *Bridge and Highway Structure
  Rehabilitation and Repair*, McGraw-Hill 2010, ch. 5 p. 187). The law maps RF = 1 to W and
  RF = 0.3 to 0, so the posted load falls faster than RT.
- Specialized hauling vehicles: the NRL is a screening load; NRL RF >= 1.0 means SU4 to SU7 need
  no posting, otherwise each SU vehicle with RF < 1.0 is posted (FHWA Questions and Answers on
  SHVs, March 2014: confirmed in substance).
- Emergency vehicles: when an operating RF of EV2 or EV3 is below 1.0, post a single-axle limit
  RF(EV2) x 33.5 kip, a tandem limit RF(EV3) x 62 kip and a gross limit RF x GVW (the lesser of
  the two vehicles) (FHWA memorandum of 3 Nov 2016 as quoted by the TxDOT Bridge Inspection
  Manual: confirmed; the arithmetic of the limits from memory, unconfirmed).
- Posted values may be rounded down to a sign increment (common practice).

Example:
    >>> posting(0.65, 40.0).load            # 40/0.7 x 0.35 = 20 tons
    20.0
    >>> posting(0.82, 36.0, increment=1.0).load      # 26.74 rounded down
    26.0
    >>> posting(0.2, 36.0).action, posting(1.0, 36.0).action
    ('consider closing', 'none')
"""

from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass

from influence.errors import ModelError
from influence.rating.tables import POSTING_FILE, data_file


@dataclass(frozen=True)
class Posting:
    """The posting for one vehicle.

    Attributes:
        rating_factor: RF [-].
        weight: the vehicle's weight W [tons, or the unit given].
        rating: RT = RF x W [as weight].
        action: "none" (RF >= 1), "post" or "consider closing" (RF < 0.3).
        exact_load: W/0.7 (RF - 0.3) before rounding [as weight]; None unless posted.
        load: the posted load, rounded down to the increment if one was given; None unless
            posted.
        mark: source and confidence.
    """

    rating_factor: float
    weight: float
    rating: float
    action: str
    exact_load: float | None
    load: float | None
    mark: str


def _rounded_down(value: float, increment: float | None) -> float:
    if increment is None:
        return value
    # a value a hair under a whole increment from floating-point noise still counts as whole
    return increment * math.floor(value / increment + 1e-9)


def rating_tons(rating_factor: float, weight: float) -> float:
    """RT = RF x W [tons when W is in tons].

    Example:
        >>> rating_tons(0.9, 36.0)
        32.4
    """
    return round(rating_factor * weight, 12)


def posting(rating_factor: float, weight: float, increment: float | None = None) -> Posting:
    """The posting for one legal vehicle of weight W (LRFR posting law).

    Args:
        rating_factor: RF of the vehicle at the level used for posting [-].
        weight: W [tons, or any weight unit; the result is in the same].
        increment: sign increment to round the posted load down to (None: no rounding).

    Raises:
        ModelError: for a weight or increment that is not positive.
    """
    if not weight > 0.0:
        raise ModelError(f"vehicle weight {weight!r}", item="weight",
                         fix="give the rating vehicle's weight, greater than 0")
    if increment is not None and not increment > 0.0:
        raise ModelError(f"sign increment {increment!r}", item="increment",
                         fix="give a positive increment, or none for no rounding")
    law = data_file(POSTING_FILE)["law"]
    rating = rating_tons(rating_factor, weight)
    if rating_factor >= 1.0:
        return Posting(rating_factor, weight, rating, "none", None, None, law["mark"])
    if rating_factor < law["lower"]:
        return Posting(rating_factor, weight, rating, "consider closing", None, None,
                       law["mark"])
    exact = round(weight / law["spread"] * (rating_factor - law["lower"]), 12)
    return Posting(rating_factor, weight, rating, "post", exact, _rounded_down(exact, increment),
                   law["mark"])


@dataclass(frozen=True)
class SingleUnitPosting:
    """The specialized-hauling-vehicle screening and the postings it leads to.

    Attributes:
        screening_factor: RF of the NRL [-].
        screened_out: True when NRL RF >= 1.0: no single-unit posting needed.
        postings: (vehicle name, posting) for each SU vehicle rated (empty when screened out).
        mark: source and confidence.
    """

    screening_factor: float
    screened_out: bool
    postings: tuple[tuple[str, Posting], ...]
    mark: str

    @property
    def posted(self) -> tuple[tuple[str, Posting], ...]:
        """The SU vehicles that need a posting (RF < 1.0)."""
        return tuple((name, p) for name, p in self.postings if p.action != "none")


def single_unit_posting(nrl_rating_factor: float,
                        single_units: Mapping[str, tuple[float, float]] | None = None,
                        increment: float | None = None) -> SingleUnitPosting:
    """Screen with the NRL; if it fails, post each SU vehicle with RF < 1.0.

    Args:
        nrl_rating_factor: RF of the notional rating load [-].
        single_units: vehicle name -> (RF, weight [tons]) for SU4, SU5, SU6 and SU7; needed
            only when the NRL RF is below 1.0.
        increment: sign increment for rounding down (None: no rounding).

    Raises:
        ModelError: when the NRL fails and an SU vehicle's rating is missing.

    Example:
        >>> single_unit_posting(1.05).screened_out
        True
        >>> result = single_unit_posting(0.9, {"SU4": (1.1, 27.0), "SU5": (0.95, 31.0),
        ...                                    "SU6": (0.9, 34.75), "SU7": (0.85, 38.75)})
        >>> [name for name, _ in result.posted]
        ['SU5', 'SU6', 'SU7']
    """
    table = data_file(POSTING_FILE)["shv"]
    if nrl_rating_factor >= 1.0:
        return SingleUnitPosting(nrl_rating_factor, True, (), table["mark"])
    given = dict(single_units or {})
    missing = [name for name in table["single_unit_vehicles"] if name not in given]
    if missing:
        raise ModelError(
            f"the NRL rating factor {nrl_rating_factor:g} is below 1.0 and "
            f"{', '.join(missing)} are not rated", item="SHV posting",
            fix="rate SU4, SU5, SU6 and SU7 and give their rating factors and weights")
    postings = tuple((name, posting(rf, weight, increment))
                     for name, (rf, weight) in given.items())
    return SingleUnitPosting(nrl_rating_factor, False, postings, table["mark"])


@dataclass(frozen=True)
class EmergencyVehicleLimits:
    """Emergency-vehicle posting limits (all None when both operating RFs are 1.0 or more).

    Attributes:
        single_axle_kip: RF(EV2) x 33.5 [kip].
        tandem_kip: RF(EV3) x 62 [kip].
        gross_kip: the lesser of RF(EV2) x 57.5 and RF(EV3) x 86 [kip].
        mark: source and confidence.
    """

    single_axle_kip: float | None
    tandem_kip: float | None
    gross_kip: float | None
    mark: str

    @property
    def posted(self) -> bool:
        return self.gross_kip is not None


def emergency_vehicle_limits(ev2_rating_factor: float, ev3_rating_factor: float,
                             increment_kip: float | None = None) -> EmergencyVehicleLimits:
    """Single-axle, tandem and gross limits from the operating RFs of EV2 and EV3.

    Args:
        ev2_rating_factor: operating RF of EV2 (single drive axle) [-].
        ev3_rating_factor: operating RF of EV3 (tandem axle) [-].
        increment_kip: sign increment for rounding down [kip] (None: no rounding).

    Example:
        >>> limits = emergency_vehicle_limits(0.8, 0.9)
        >>> limits.single_axle_kip, limits.tandem_kip, limits.gross_kip   # 0.8 x 57.5 governs
        (26.8, 55.8, 46.0)
        >>> emergency_vehicle_limits(1.0, 1.2).posted
        False
    """
    table = data_file(POSTING_FILE)["ev"]
    if min(ev2_rating_factor, ev3_rating_factor) >= 1.0:
        return EmergencyVehicleLimits(None, None, None, table["mark"])
    if increment_kip is not None and not increment_kip > 0.0:
        raise ModelError(f"sign increment {increment_kip!r}", item="increment",
                         fix="give a positive increment, or none for no rounding")
    ev2, ev3 = (next(v for v in table["vehicle"] if v["name"] == name) for name in ("EV2", "EV3"))
    gross = min(ev2_rating_factor * ev2["gross_kip"], ev3_rating_factor * ev3["gross_kip"])
    return EmergencyVehicleLimits(
        _rounded_down(round(ev2_rating_factor * ev2["axle_group_kip"], 12), increment_kip),
        _rounded_down(round(ev3_rating_factor * ev3["axle_group_kip"], 12), increment_kip),
        _rounded_down(round(gross, 12), increment_kip), table["mark"])
