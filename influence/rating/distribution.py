"""Live-load distribution factors, AASHTO LRFD 4.6.2.2, slab-on-girder types a, e and k.

Lanes carried by one girder, for moment and shear, interior and exterior girders, one loaded lane
and two or more. The formulas (from memory, unconfirmed, LRFD Tables 4.6.2.2.2b-1, 2d-1, 2e-1,
3a-1, 3b-1, 3c-1) include the multiple presence factor; the lever rule and the rigid-section
method apply it explicitly (:mod:`influence.rating.lever_rule`). Units as the formulas: S, L,
de in ft; ts in in; Kg in in^4.

Interior moment: 0.06 + (S/14)^0.4 (S/L)^0.3 (Kg/12 L ts^3)^0.1 (one lane),
0.075 + (S/9.5)^0.6 (S/L)^0.2 (Kg/12 L ts^3)^0.1 (two or more); Nb = 3: the lesser of the
formula and the lever rule. Interior shear: 0.36 + S/25; 0.2 + S/12 - (S/35)^2; Nb = 3: the
lever rule. Exterior, one lane: the lever rule; two or more: e g_interior with
e = 0.77 + de/9.1 (moment) or 0.6 + de/10 (shear). Steel beams with diaphragms: the exterior
factor is not less than the rigid-section value. Skew: moment x (1 - c1 (tan theta)^1.5),
shear x (1 + 0.20 (12 L ts^3/Kg)^0.3 tan theta).

Permits and fatigue (confirmed, NCHRP 20-07/Task 285 project statement; TxDOT LRFD Bridge Design
Manual ch. 3 sec. 13): special permits and fatigue take the one-lane factor with the 1.2
multiple presence factor divided out; routine permits take the factor for two or more lanes.

Example:
    >>> geometry = GirderGeometry(8.0, 60.0, 8.0, 500_000.0, girders=5, edge_distance=2.0)
    >>> factors = distribution_factors(geometry, "interior", "shear")
    >>> factors.one_lane, round(factors.several_lanes, 6)     # 0.36 + 8/25; 0.2 + 8/12 - (8/35)^2
    (0.68, 0.814422)
    >>> permit_distribution(factors, "special")                # 0.68 / 1.2
    0.566666666667
    >>> distribution_factors(GirderGeometry(18.0, 60.0, 8.0, 5e5, 5), "interior", "shear")
    Traceback (most recent call last):
    ...
    influence.errors.ModelError: distribution.spacing: girder spacing S [ft] = 18 is outside \
the range 3.5 to 16 of the LRFD 4.6.2.2 shear formulas (use a refined analysis or give the \
distribution factor as a number)
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from influence.errors import ModelError
from influence.rating.girder_geometry import (
    GirderGeometry,
    check_range,
    design_lanes,
    multiple_presence,
)
from influence.rating.lever_rule import GIRDERS, lever_rule, rigid_section
from influence.rating.tables import DISTRIBUTION_FILE, data_file

RESPONSES = ("moment", "shear")
PERMIT_KINDS = ("special", "routine")


@dataclass(frozen=True)
class DistributionFactors:
    """Lanes per girder for one girder and response.

    Attributes:
        girder: "interior" or "exterior".
        response: "moment" or "shear".
        one_lane: one loaded lane, multiple presence 1.2 included, skew applied [lanes].
        several_lanes: two or more loaded lanes, skew applied [lanes]; None when the roadway
            holds one design lane only.
        skew_factor: the skew reduction (moment) or correction (shear) applied [-].
        basis: how each value was found, in words, for the report.
    """

    girder: str
    response: str
    one_lane: float
    several_lanes: float | None
    skew_factor: float
    basis: tuple[str, ...]

    @property
    def governing(self) -> float:
        """The larger of the one-lane and several-lane factors [lanes]."""
        return max(self.one_lane, self.several_lanes or 0.0)


def _several(geometry: GirderGeometry) -> range:
    return range(2, design_lanes(geometry) + 1)


def _interior(geometry: GirderGeometry, response: str) -> tuple[float, float, list[str]]:
    s, length = geometry.spacing, geometry.span
    check_range(geometry, response)
    if response == "moment":
        stiffness = geometry.slab_stiffness_ratio ** 0.1
        one = 0.06 + (s / 14.0) ** 0.4 * (s / length) ** 0.3 * stiffness
        many = 0.075 + (s / 9.5) ** 0.6 * (s / length) ** 0.2 * stiffness
        basis = [f"interior moment, one lane: 0.06 + (S/14)^0.4 (S/L)^0.3 (Kg/12Lts^3)^0.1 "
                 f"= {one:.4f}",
                 f"interior moment, two or more lanes: 0.075 + (S/9.5)^0.6 (S/L)^0.2 "
                 f"(Kg/12Lts^3)^0.1 = {many:.4f}"]
    else:
        one = 0.36 + s / 25.0
        many = 0.2 + s / 12.0 - (s / 35.0) ** 2
        basis = [f"interior shear, one lane: 0.36 + S/25 = {one:.4f}",
                 f"interior shear, two or more lanes: 0.2 + S/12 - (S/35)^2 = {many:.4f}"]
    if geometry.girders == 3:
        lever_one = lever_rule(geometry, "interior", 1)
        lever_many = max((lever_rule(geometry, "interior", n) for n in _several(geometry)),
                         default=lever_one)
        if response == "moment":
            one, many = min(one, lever_one), min(many, lever_many)
            basis.append(f"three girders: the lesser of the formula and the lever rule "
                         f"({lever_one:.4f}, {lever_many:.4f})")
        else:
            one, many = lever_one, lever_many
            basis.append("three girders: the lever rule")
    return one, many, basis


def _exterior(geometry: GirderGeometry, response: str,
              rigid: bool) -> tuple[float, float, list[str]]:
    check_range(geometry, "exterior")
    _, interior_many, basis = _interior(geometry, response)
    de = geometry.edge_distance
    e = 0.77 + de / 9.1 if response == "moment" else 0.6 + de / 10.0
    formula = "0.77 + de/9.1" if response == "moment" else "0.6 + de/10"
    one = lever_rule(geometry, "exterior", 1)
    many = e * interior_many
    basis = basis[1:] + [f"exterior {response}, one lane: lever rule with m = 1.2 = {one:.4f}",
                         f"exterior {response}, two or more lanes: e = {formula} = {e:.4f}, "
                         f"e g_interior = {many:.4f}"]
    if rigid:
        rigid_one = rigid_section(geometry, 1)
        rigid_many = max((rigid_section(geometry, n) for n in _several(geometry)), default=0.0)
        one, many = max(one, rigid_one), max(many, rigid_many)
        basis.append(f"rigid-section minimum with m (steel beams with diaphragms): "
                     f"one lane {rigid_one:.4f}, two or more {rigid_many:.4f}")
    return one, many, basis


def skew_factor(geometry: GirderGeometry, response: str) -> tuple[float, str]:
    """Skew reduction of moment or correction of shear (obtuse corner), and its basis.

    Raises:
        ModelError: for a shear skew over 60 degrees or a geometry outside the skew range.
    """
    theta = geometry.skew
    rule = data_file(DISTRIBUTION_FILE)["skew"]
    if response == "moment":
        if theta < rule["moment_from_deg"]:
            return 1.0, "skew under 30 degrees: no moment reduction"
        check_range(geometry, "skew")
        used = min(theta, rule["moment_cap_deg"])
        c1 = 0.25 * geometry.slab_stiffness_ratio ** 0.25 * (
            geometry.spacing / geometry.span) ** 0.5
        factor = 1.0 - c1 * math.tan(math.radians(used)) ** 1.5
        return factor, (f"skew {used:g} degrees: 1 - c1 (tan theta)^1.5 with c1 = {c1:.4f} "
                        f"= {factor:.4f}")
    if theta == 0.0:
        return 1.0, "no skew"
    if theta > rule["shear_limit_deg"]:
        raise ModelError(f"skew {theta:g} degrees is over the 60 degrees of the shear correction",
                         item="distribution.skew", fix="use a refined analysis")
    check_range(geometry, "skew")
    factor = 1.0 + 0.20 * (1.0 / geometry.slab_stiffness_ratio) ** 0.3 * math.tan(
        math.radians(theta))
    return factor, (f"skew {theta:g} degrees, obtuse corner: 1 + 0.20 (12Lts^3/Kg)^0.3 tan theta "
                    f"= {factor:.4f}")


def distribution_factors(geometry: GirderGeometry, girder: str, response: str, *,
                         rigid_section: bool = False) -> DistributionFactors:
    """Lanes per girder by the LRFD 4.6.2.2 formulas.

    Args:
        geometry: the cross-section, in ft, in and in^4.
        girder: "interior" or "exterior".
        response: "moment" or "shear".
        rigid_section: steel beams with diaphragms or cross-frames: the exterior factor is
            not less than the rigid-section value.

    Raises:
        ModelError: for an unknown girder or response, or a geometry outside the range of
            applicability (one line naming the quantity and the range).
    """
    if girder not in GIRDERS:
        raise ModelError(f"unknown girder {girder!r}", item="distribution.girder",
                         fix='use "interior" or "exterior"')
    if response not in RESPONSES:
        raise ModelError(f"no LRFD distribution formula for {response!r}",
                         item="distribution", fix='use "moment" or "shear"')
    if girder == "interior":
        one, many, basis = _interior(geometry, response)
    else:
        one, many, basis = _exterior(geometry, response, rigid_section)
    factor, skew_basis = skew_factor(geometry, response)
    several = None if design_lanes(geometry) < 2 else round(many * factor, 12)
    return DistributionFactors(girder, response, round(one * factor, 12), several, factor,
                               (*basis, skew_basis))


def permit_distribution(factors: DistributionFactors, kind: str) -> float:
    """The distribution factor a permit is rated with [lanes].

    Special (limited-crossing) permits: the one-lane factor with the one-lane multiple
    presence factor (1.2) divided out; routine (annual) permits: the factor for two or more
    lanes, or the one-lane factor where the roadway holds one lane only.

    Raises:
        ModelError: for another permit kind.
    """
    if kind not in PERMIT_KINDS:
        raise ModelError(f"unknown permit type {kind!r}", item="permit.type",
                         fix='use "special" or "routine"')
    if kind == "special":
        return round(factors.one_lane / multiple_presence(1), 12)
    return factors.one_lane if factors.several_lanes is None else factors.several_lanes


def fatigue_distribution(factors: DistributionFactors) -> float:
    """The one-lane factor with the 1.2 multiple presence factor removed, for fatigue [lanes].

    Example:
        >>> f = DistributionFactors("interior", "moment", 0.6, 0.8, 1.0, ())
        >>> fatigue_distribution(f)
        0.5
    """
    return round(factors.one_lane / multiple_presence(1), 12)
