"""A slab-on-girder cross-section for the AASHTO LRFD 4.6.2.2 distribution factors.

Inputs are in the units the formulas are written in: S, L and de in ft, ts in in, Kg in in^4.
:func:`girder_geometry_from_metric` converts a kN-m model's metres and millimetres (exact:
1 ft = 0.3048 m, 1 in = 25.4 mm). Girders are equally spaced, the deck symmetric: the roadway
runs from barrier face to barrier face, de beyond each exterior web.

Also here: the multiple presence factor m (LRFD Table 3.6.1.1.2-1: 1.20 for one lane confirmed;
1.00, 0.85, 0.65 for two, three, more lanes from memory, unconfirmed), the number of design
lanes (12 ft each, LRFD 3.6.1.1.1) and the range of applicability of the formulas.

Example:
    >>> geometry = GirderGeometry(spacing=8.0, span=60.0, slab_thickness=8.0,
    ...                           stiffness_parameter=500_000.0, girders=5, edge_distance=2.0)
    >>> geometry.roadway_width, design_lanes(geometry)       # 4 x 8 + 2 x 2 = 36 ft
    (36.0, 3)
    >>> multiple_presence(1), multiple_presence(6)
    (1.2, 0.65)
    >>> round(longitudinal_stiffness(8.0, 20_000.0, 40.0, 25.0), 1)   # n (I + A eg^2)
    360000.0
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from influence.errors import ModelError
from influence.rating.impact import FOOT
from influence.rating.tables import DISTRIBUTION_FILE, data_file

INCH = 0.0254
"""Metres in one inch (exact by definition)."""


@dataclass(frozen=True)
class GirderGeometry:
    """The cross-section parameters of the LRFD distribution formulas.

    Attributes:
        spacing: girder spacing S [ft].
        span: span length L [ft].
        slab_thickness: depth of the concrete slab ts [in].
        stiffness_parameter: longitudinal stiffness parameter Kg = n (I + A eg^2) [in^4].
        girders: number of girders Nb.
        edge_distance: de, exterior web centreline to the inside face of the barrier [ft],
            positive when the web is inboard of the barrier face.
        skew: skew angle theta [degrees].
    """

    spacing: float
    span: float
    slab_thickness: float
    stiffness_parameter: float
    girders: int
    edge_distance: float = 0.0
    skew: float = 0.0

    def __post_init__(self) -> None:
        for name in ("spacing", "span", "slab_thickness", "stiffness_parameter"):
            value = getattr(self, name)
            if not (math.isfinite(value) and value > 0.0):
                raise ModelError(f"{name} = {value!r}", item=f"distribution.{name}",
                                 fix="give a positive number")
        if isinstance(self.girders, bool) or not isinstance(self.girders, int) or \
                self.girders < 3:
            raise ModelError(f"girders = {self.girders!r}", item="distribution.girders",
                             fix="give the number of girders, 3 or more (the 4.6.2.2 cases)")
        if not 0.0 <= self.skew < 90.0:
            raise ModelError(f"skew = {self.skew!r} degrees", item="distribution.skew",
                             fix="give the skew angle in degrees, 0 to under 90")
        if not self.roadway_width > 0.0:
            raise ModelError(f"roadway width {self.roadway_width:g} ft", item="distribution",
                             fix="check edge_distance: the barriers leave no roadway")

    @property
    def roadway_width(self) -> float:
        """Width between barrier faces, (Nb - 1) S + 2 de [ft]."""
        return (self.girders - 1) * self.spacing + 2.0 * self.edge_distance

    @property
    def slab_stiffness_ratio(self) -> float:
        """Kg / (12 L ts^3) [-], the stiffness term of the moment and skew formulas."""
        return self.stiffness_parameter / (12.0 * self.span * self.slab_thickness ** 3)


def girder_geometry_from_metric(*, spacing: float, span: float, slab_thickness: float,
                                stiffness_parameter: float, girders: int,
                                edge_distance: float = 0.0, skew: float = 0.0) -> GirderGeometry:
    """A geometry given in a kN-m model's units, converted to the formulas' units.

    Args:
        spacing: S [m].
        span: L [m].
        slab_thickness: ts [mm].
        stiffness_parameter: Kg [mm^4].
        girders: Nb.
        edge_distance: de [m].
        skew: theta [degrees].

    Example:
        >>> g = girder_geometry_from_metric(spacing=2.4384, span=18.288, slab_thickness=203.2,
        ...                                 stiffness_parameter=0.416231426e12, girders=5)
        >>> round(g.spacing, 9), round(g.span, 9), round(g.slab_thickness, 9)
        (8.0, 60.0, 8.0)
        >>> round(g.stiffness_parameter)
        1000000
    """
    inch_mm = INCH * 1000.0
    return GirderGeometry(spacing / FOOT, span / FOOT, slab_thickness / inch_mm,
                          stiffness_parameter / inch_mm ** 4, girders, edge_distance / FOOT, skew)


def longitudinal_stiffness(modular_ratio: float, inertia: float, area: float,
                           eccentricity: float) -> float:
    """Kg = n (I + A eg^2) (LRFD Eq. 4.6.2.2.1-1, from memory, unconfirmed).

    Args:
        modular_ratio: n = E_beam / E_deck [-].
        inertia: I of the beam alone [length^4].
        area: A of the beam alone [length^2].
        eccentricity: eg, between the centroids of beam and deck [length].

    Returns:
        Kg [length^4, in the units given].
    """
    return modular_ratio * (inertia + area * eccentricity ** 2)


def multiple_presence(lanes: int) -> float:
    """m for a number of loaded lanes (LRFD Table 3.6.1.1.2-1)."""
    if lanes < 1:
        raise ModelError(f"{lanes} loaded lanes", item="lanes", fix="load one lane or more")
    rows = data_file(DISTRIBUTION_FILE)["multiple_presence"]
    return float(rows[min(lanes, len(rows)) - 1]["factor"])


def design_lanes(geometry: GirderGeometry) -> int:
    """Number of 12-ft design lanes on the roadway, at least one (LRFD 3.6.1.1.1)."""
    width = data_file(DISTRIBUTION_FILE)["wheels"]["lane_width_ft"]
    return max(1, math.floor(geometry.roadway_width / width + 1e-9))


def check_range(geometry: GirderGeometry, use: str) -> None:
    """Refuse a geometry outside the formulas' range of applicability for ``use``.

    Args:
        geometry: the cross-section.
        use: "moment", "shear", "skew" or "exterior".

    Raises:
        ModelError: naming the quantity, its value and the range.
    """
    for row in data_file(DISTRIBUTION_FILE)["range"]:
        if use not in row["applies_to"]:
            continue
        value = float(getattr(geometry, row["key"]))
        low = row.get("low", -math.inf)
        high = row.get("high", math.inf)
        if row["key"] == "girders":
            low = 3.0  # Nb = 3 has its own rule (lever rule, or the lesser of the two)
        if not low <= value <= high:
            limits = f"{row['low']:g} to {row['high']:g}" if "high" in row else (
                f"at least {row['low']:g}")
            raise ModelError(
                f"{row['quantity']} = {value:g} is outside the range {limits} of the LRFD "
                f"4.6.2.2 {use} formulas", item=f"distribution.{row['key']}",
                fix="use a refined analysis or give the distribution factor as a number")
