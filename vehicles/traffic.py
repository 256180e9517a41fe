"""Traffic data that a fatigue load model carries beside its lorries.

A traffic type gives each lorry (a case of the model, by name) its share of the heavy vehicles,
as EN 1991-2 does for its set of equivalent lorries (long distance, medium distance, local
traffic). A traffic category gives the number of heavy vehicles a year on one slow lane for a
class of road. A fatigue calculation runs each lorry alone and weights its damage by its share.

Example:
    >>> local = TrafficType("local", (("lorry 1", 0.8), ("lorry 2", 0.2)))
    >>> local.share("lorry 1"), local.share("lorry 3")
    (0.8, 0.0)
    >>> TrafficCategory("category 4", 5.0e4).heavy_vehicles_per_year
    50000.0
    >>> try:
    ...     TrafficType("short", (("lorry 1", 0.5),))
    ... except VehicleError as error:
    ...     print(error.problem)
    the shares add up to 0.5, not 1
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from vehicles.errors import VehicleError

SHARE_SUM_TOLERANCE = 1e-9
"""How far the shares of a traffic type may add up away from 1 (rounding of decimal fractions)."""


@dataclass(frozen=True)
class TrafficType:
    """The composition of heavy traffic: each lorry's share of the heavy vehicles.

    Args:
        name: such as "long distance".
        shares: (case name, fraction of the heavy vehicles [-]) pairs, adding up to 1.
        note: clause and confidence mark.
    """

    name: str
    shares: tuple[tuple[str, float], ...]
    note: str = ""

    def __post_init__(self) -> None:
        shares = tuple((str(case), float(share)) for case, share in self.shares)
        object.__setattr__(self, "shares", shares)
        where = f"traffic type {self.name}"
        cases = [case for case, _ in shares]
        for case, share in shares:
            if not (math.isfinite(share) and 0.0 <= share <= 1.0):
                raise VehicleError(f"share {share:g} of '{case}' is not a fraction", item=where,
                                   fix="give a share from 0 to 1 (0.2 for 20 %)")
            if cases.count(case) > 1:
                raise VehicleError(f"'{case}' has two shares", item=where,
                                   fix="give each lorry one share")
        total = math.fsum(share for _, share in shares)
        if abs(total - 1.0) > SHARE_SUM_TOLERANCE:
            raise VehicleError(f"the shares add up to {total:g}, not 1", item=where,
                               fix="give fractions of the heavy vehicles that add up to 1")

    def share(self, case: str) -> float:
        """The fraction of the heavy vehicles that are lorry ``case`` [-] (0 if not named)."""
        return dict(self.shares).get(case, 0.0)


@dataclass(frozen=True)
class TrafficCategory:
    """A class of road and its heavy traffic on one slow lane.

    Args:
        name: such as "category 1".
        heavy_vehicles_per_year: heavy vehicles a year on one slow lane [1/year].
        note: what roads it covers, clause and confidence mark.
    """

    name: str
    heavy_vehicles_per_year: float
    note: str = ""

    def __post_init__(self) -> None:
        count = float(self.heavy_vehicles_per_year)
        object.__setattr__(self, "heavy_vehicles_per_year", count)
        if not (math.isfinite(count) and count > 0):
            raise VehicleError(f"heavy_vehicles_per_year = {count:g} is not allowed",
                               item=f"traffic category {self.name}",
                               fix="give a positive number of heavy vehicles a year")
