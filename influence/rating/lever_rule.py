"""The lever rule and the rigid-section method for live-load distribution to girders.

Lever rule (common practice; AASHTO LRFD 4.6.2.2 names it): the deck is taken as hinged over
every interior girder, so a girder's share of a wheel is the reaction of a simple deck span (with
the overhang beyond an exterior girder). Trucks have wheels 6 ft apart; the outer wheel stays
2 ft or more from the barrier face; trucks in neighbouring lanes stand with adjacent wheels 4 ft
apart (LRFD 3.6.1.3.1, from memory, unconfirmed). The ordinate sum is piecewise linear in the
trucks' position, so its largest value is found exactly at a kink (a wheel over a girder) or at
an end of the roadway. The multiple presence factor of the number of loaded lanes is applied.

Rigid section (LRFD Eq. 4.6.2.2.2d-1, from memory, unconfirmed), for steel beam-slab bridges
with diaphragms or cross-frames: R = NL/Nb + X_ext sum(e)/sum(x^2) for NL loaded lanes, trucks in
12-ft lanes side by side from the barrier face, each 5 ft from its lane's outer edge; times m.

Example (S = 8 ft, de = 2 ft: wheels at 0 and 6 ft from the exterior web):
    >>> geometry = GirderGeometry(8.0, 60.0, 8.0, 500_000.0, girders=5, edge_distance=2.0)
    >>> lever_rule(geometry, "exterior", lanes=1)          # 1.2 x (1 + 2/8) / 2
    0.75
    >>> round(rigid_section(geometry, lanes=1), 6)           # 1.2 (1/5 + 16 x 13/640)
    0.63
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from influence.errors import ModelError
from influence.rating.girder_geometry import GirderGeometry, design_lanes, multiple_presence
from influence.rating.tables import DISTRIBUTION_FILE, data_file

GIRDERS = ("interior", "exterior")


@dataclass(frozen=True)
class _Wheels:
    gauge: float
    clearance: float
    between: float
    lane_width: float
    truck_from_lane_edge: float


def _wheels() -> _Wheels:
    w = data_file(DISTRIBUTION_FILE)["wheels"]
    return _Wheels(w["gauge_ft"], w["barrier_clearance_ft"], w["between_trucks_ft"],
                   w["lane_width_ft"], w["rigid_truck_from_lane_edge_ft"])


def _girder_positions(geometry: GirderGeometry) -> np.ndarray:
    return geometry.spacing * np.arange(geometry.girders, dtype=float)


def reaction_ordinates(geometry: GirderGeometry, girder: int, x: np.ndarray) -> np.ndarray:
    """Share of a unit wheel at ``x`` taken by ``girder`` (0 = exterior) under the lever rule.

    Args:
        geometry: the cross-section.
        girder: girder number from the exterior one, 0 to Nb - 1.
        x: wheel positions measured from girder 0 [ft].
    """
    s = geometry.spacing
    at = girder * s
    share = np.clip(1.0 - np.abs(x - at) / s, 0.0, None)
    last = geometry.girders - 1
    if girder == 0:
        share = np.where(x < at, 1.0 + (at - x) / s, share)   # the overhang: lever beyond
    if girder == last:
        share = np.where(x > at, 1.0 + (x - at) / s, share)
    return share


def _wheel_offsets(lanes: int, wheels: _Wheels) -> np.ndarray:
    pitch = wheels.gauge + wheels.between
    starts = pitch * np.arange(lanes, dtype=float)
    return np.sort(np.concatenate([starts, starts + wheels.gauge]))


def lever_rule(geometry: GirderGeometry, girder: str, lanes: int) -> float:
    """Lanes carried by a girder under the lever rule with ``lanes`` trucks, m applied.

    The interior girder is the first one inboard of the exterior girder (the one the lever rule
    loads most with the deck's overhang on one side only).

    Args:
        geometry: the cross-section.
        girder: "interior" or "exterior".
        lanes: number of loaded lanes (trucks side by side).

    Raises:
        ModelError: for an unknown girder, or more trucks than the roadway holds.
    """
    if girder not in GIRDERS:
        raise ModelError(f"unknown girder {girder!r}", item="distribution.girder",
                         fix='use "interior" or "exterior"')
    wheels = _wheels()
    offsets = _wheel_offsets(lanes, wheels)
    first = -geometry.edge_distance + wheels.clearance
    last = geometry.roadway_width - geometry.edge_distance - wheels.clearance - offsets[-1]
    if lanes > design_lanes(geometry) or last < first - 1e-9:
        raise ModelError(f"{lanes} trucks do not fit on a {geometry.roadway_width:g} ft roadway",
                         item="distribution", fix="load fewer lanes")
    number = 0 if girder == "exterior" else 1
    kinks = _girder_positions(geometry)
    starts = np.concatenate([[first, last], (kinks[:, None] - offsets[None, :]).ravel()])
    starts = starts[(starts >= first - 1e-9) & (starts <= last + 1e-9)]
    positions = starts[:, None] + offsets[None, :]
    shares = reaction_ordinates(geometry, number, positions).sum(axis=1)
    return round(multiple_presence(lanes) * float(shares.max()) / 2.0, 12)


def rigid_section(geometry: GirderGeometry, lanes: int) -> float:
    """Exterior girder's lanes by the rigid-section method with ``lanes`` loaded lanes, m applied.

    Raises:
        ModelError: for more lanes than the roadway holds.
    """
    if not 1 <= lanes <= design_lanes(geometry):
        raise ModelError(f"{lanes} lanes on a {geometry.roadway_width:g} ft roadway",
                         item="distribution", fix=f"load 1 to {design_lanes(geometry)} lanes")
    wheels = _wheels()
    girders = _girder_positions(geometry)
    centre = girders.mean()
    x_ext = centre - girders[0]
    truck_centres = (-geometry.edge_distance + wheels.truck_from_lane_edge
                     + wheels.lane_width * np.arange(lanes, dtype=float))
    eccentricities = centre - truck_centres
    ratio = float(lanes / geometry.girders
                  + x_ext * eccentricities.sum() / ((girders - centre) ** 2).sum())
    return round(multiple_presence(lanes) * ratio, 12)
