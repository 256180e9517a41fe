"""The ``[rating]`` table of a model file: method, edition, traffic, factors, distribution.

::

    [rating]
    method = "LRFR"                 # LRFR | LFR | ASR
    edition = "MBE 2nd"             # factor tables (LRFR live-load factors by edition)
    adtt = 2500                     # trucks a day, one direction; leave out when unknown
    material = "steel"              # steel | reinforced concrete | prestressed concrete | wood
    condition_factor = "fair"       # a factor, or good | satisfactory | fair | poor
    # condition_rating = 5          #   or the NBI superstructure rating 0-9
    system_factor = 1.0             # a factor or a superstructure type of the MBE table
    limit_states = ["Strength I", "Service II"]   # default: those the MBE requires
    levels = ["design inventory", "design operating", "legal"]   # default: these three
    overlay_measured = false        # true: gDW = 1.25 at the strength limit states
    impact = 0.33                   # override IM (LRFR) or I (LFR, ASR) as a fraction
    surface = "standard"            # or "minor surface deviations", "smooth riding surface"
    sign_increment = 1.0            # round posted loads down to this [tons]
    distribution = 0.62             # lanes per girder, or a girder geometry table:
    [rating.distribution]           # lengths in ft/in (kip-ft) or m/mm (kN-m)
    girder = "interior"             # interior | exterior
    spacing = 8.0                   # S [ft | m]
    span = 60.0                     # L [ft | m]
    slab_thickness = 8.0            # ts [in | mm]
    stiffness_parameter = 5.0e5     # Kg [in^4 | mm^4]
    girders = 5                     # Nb
    edge_distance = 2.0             # de [ft | m], web to barrier face, + when web inboard
    skew = 0.0                      # [degrees]
    rigid_section = false           # steel beams with diaphragms: rigid-section minimum
    [rating.permit]
    type = "special"                # routine (annual) | special (limited crossing)
    frequency = "single trip"       # unlimited crossings | single trip | multiple trips
    loading = "escorted, no other vehicles"   # or "mixed with traffic"
    gross_weight = 120.0            # [kip | kN], for 1st-edition routine permits
    [rating.dead_loads]             # load names of [[loads]] in each rating term; names DC,
    DC = ["girder", "deck"]         #   DW, P, PS, EL, CR, SH place themselves
    DW = ["surfacing"]

Example:
    >>> settings = rating_settings({"rating": {"material": "steel", "adtt": 3000,
    ...                                        "condition_factor": "fair"}}, "kip-ft")
    >>> settings.edition, settings.condition_factor, settings.limit_states
    ('MBE 2nd', 0.95, ('Strength I', 'Service II'))
    >>> rating_settings({"rating": {"method": "LFR"}}, "kip-ft").levels
    ('inventory', 'operating')
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from influence.errors import ModelError
from influence.rating.dead_terms import listed_dead_loads
from influence.rating.distribution import RESPONSES, DistributionFactors, distribution_factors
from influence.rating.girder_geometry import GirderGeometry, girder_geometry_from_metric
from influence.rating.impact import SURFACES, UNIT_SYSTEMS
from influence.rating.live_factors import PermitCrossing
from influence.rating.load_factors import (
    ALLOWABLE_LEVELS,
    LRFR_LEVELS,
    MATERIALS,
    METHODS,
    limit_states,
)
from influence.rating.member_factors import condition_factor, system_factor
from influence.rating.reading import (
    check_keys,
    choice,
    flag,
    fraction,
    names,
    number,
    positive,
    table,
)
from influence.rating.tables import edition_table, known_editions

KN_PER_KIP = 4.4482216152605
"""Kilonewtons in one kip (exact by definition of the pound-force)."""
LRFR_ONLY = ("condition_factor", "condition_rating", "system_factor", "limit_states",
             "overlay_measured", "surface", "permit", "material")
DEFAULT_LRFR_LEVELS = ("design inventory", "design operating", "legal")


@dataclass(frozen=True)
class GirderDistribution:
    """A girder's geometry for the LRFD 4.6.2.2 formulas (in ft, in, in^4).

    Attributes:
        geometry: the cross-section.
        girder: "interior" or "exterior".
        rigid_section: apply the rigid-section minimum to the exterior girder.
    """

    geometry: GirderGeometry
    girder: str
    rigid_section: bool = False

    def factors(self, response: str) -> DistributionFactors:
        """Lanes per girder for "moment" or "shear" (axial force takes the moment factor)."""
        return distribution_factors(self.geometry, self.girder,
                                    "shear" if response == "shear" else "moment",
                                    rigid_section=self.rigid_section)


@dataclass(frozen=True)
class RatingSettings:
    """What ``[rating]`` asks for.

    Attributes:
        method: "LRFR", "LFR" or "ASR".
        edition: MBE edition of the factor tables.
        adtt: trucks a day in one direction, None when unknown.
        material: bridge material (LRFR), None for LFR and ASR.
        condition_factor: phi_c [-] (1.0 for LFR and ASR).
        system_factor: phi_s for flexure and axial force [-] (shear takes 1.0).
        limit_states: LRFR limit states to check (empty for LFR and ASR).
        levels: rating levels.
        overlay_measured: wearing surface measured (gDW = 1.25 at strength).
        impact: IM or I override as a fraction, None to use the rules.
        surface: riding surface for the LRFR IM reduction.
        distribution: lanes per girder, a girder geometry, or None (a rating run then takes
            the model file's [live_load] distribution x multiple presence, 1 by default).
        permit: the permit crossing, None when no permit is checked.
        sign_increment: posted loads rounded down to this [tons], None for no rounding.
        dead_loads: (load name, "DC" | "DW" | "P") as ``[rating.dead_loads]`` places them
            (see :mod:`influence.rating.dead_terms`).
    """

    method: str = "LRFR"
    edition: str = "MBE 2nd"
    adtt: float | None = None
    material: str | None = None
    condition_factor: float = 1.0
    system_factor: float = 1.0
    limit_states: tuple[str, ...] = ()
    levels: tuple[str, ...] = DEFAULT_LRFR_LEVELS
    overlay_measured: bool = False
    impact: float | None = None
    surface: str = "standard"
    distribution: float | GirderDistribution | None = None
    permit: PermitCrossing | None = None
    sign_increment: float | None = None
    dead_loads: tuple[tuple[str, str], ...] = ()

    def system_factor_for(self, response: str) -> float:
        """phi_s for a response: 1.0 for shear (MBE 6A.4.2.4, from memory, unconfirmed)."""
        return 1.0 if response == "shear" else self.system_factor


def _condition(rating: dict[str, Any], source: str) -> float:
    if "condition_factor" in rating and "condition_rating" in rating:
        raise ModelError("both condition_factor and condition_rating are given", source=source,
                         item="rating", fix="keep one of them")
    if "condition_rating" in rating:
        value = rating["condition_rating"]
        if isinstance(value, bool) or not isinstance(value, int):
            raise ModelError(f"condition_rating = {value!r}", source=source,
                             item="rating.condition_rating", fix="give a whole number 0 to 9")
        return condition_factor(value, source, "rating.condition_rating")
    value = rating.get("condition_factor", 1.0)
    if isinstance(value, str):
        return condition_factor(value, source)
    return fraction(value, "rating.condition_factor", source)


def _system(rating: dict[str, Any], source: str) -> float:
    value = rating.get("system_factor", 1.0)
    if isinstance(value, str):
        return system_factor(value, source=source)
    return fraction(value, "rating.system_factor", source)


def _distribution(value: Any, units: str, source: str) -> float | GirderDistribution | None:
    if value is None:
        return None
    if not isinstance(value, dict):
        return positive(value, "rating.distribution", source)
    item = "rating.distribution"
    check_keys(value, "[rating.distribution]", source, item)
    required = ("girder", "spacing", "span", "slab_thickness", "stiffness_parameter", "girders")
    for key in required:
        if key not in value:
            raise ModelError(f"missing key {key!r}", source=source, item=item,
                             fix=f"add {item}.{key}, or give the distribution as a number")
    girder = choice(value["girder"], ("interior", "exterior"), f"{item}.girder", source)
    girders = value["girders"]
    if isinstance(girders, bool) or not isinstance(girders, int):
        raise ModelError(f"girders = {girders!r}", source=source, item=f"{item}.girders",
                         fix="give the number of girders as a whole number")
    lengths = {key: number(value[key], f"{item}.{key}", source) for key in
               ("spacing", "span", "slab_thickness", "stiffness_parameter")}
    edge = number(value.get("edge_distance", 0.0), f"{item}.edge_distance", source)
    skew = number(value.get("skew", 0.0), f"{item}.skew", source)
    rigid = flag(value.get("rigid_section", False), f"{item}.rigid_section", source)
    try:
        if units == "kN-m":
            geometry = girder_geometry_from_metric(**lengths, girders=girders,
                                                   edge_distance=edge, skew=skew)
        else:
            geometry = GirderGeometry(**lengths, girders=girders, edge_distance=edge, skew=skew)
        distribution = GirderDistribution(geometry, girder, rigid)
        for response in RESPONSES:  # the range of applicability, checked while reading
            distribution.factors(response)
    except ModelError as error:
        raise _in_file(error, source) from None
    return distribution


def _in_file(error: ModelError, source: str) -> ModelError:
    """An error of a value type, placed in the file's ``[rating]`` table."""
    return ModelError(error.problem, source=source, item=f"rating.{error.item}", fix=error.fix)


def _permit(value: Any, units: str, source: str) -> PermitCrossing | None:
    if value is None:
        return None
    item = "rating.permit"
    check_keys(table(value, item, source), "[rating.permit]", source, item)
    if "type" not in value:
        raise ModelError("missing key 'type'", source=source, item=item,
                         fix='add type = "routine" or "special"')
    weight = value.get("gross_weight")
    if weight is not None:
        weight = positive(weight, f"{item}.gross_weight", source)
        weight = weight / KN_PER_KIP if units == "kN-m" else weight
    kind = str(value["type"])
    default_frequency = "unlimited crossings" if kind in ("routine", "annual") else "single trip"
    try:
        return PermitCrossing(kind, str(value.get("frequency", default_frequency)),
                              str(value.get("loading", "mixed with traffic")), weight)
    except ModelError as error:
        raise _in_file(error, source) from None


def _levels(rating: dict[str, Any], method: str, has_permit: bool, source: str) -> tuple[str, ...]:
    allowed = LRFR_LEVELS if method == "LRFR" else ALLOWABLE_LEVELS
    if "levels" not in rating:
        if method != "LRFR":
            return ALLOWABLE_LEVELS
        return DEFAULT_LRFR_LEVELS + (("permit",) if has_permit else ())
    levels = names(rating["levels"], "rating.levels", source)
    for level in levels:
        choice(level, allowed, "rating.levels", source)
    if "permit" in levels and not has_permit:
        raise ModelError("the permit level needs a permit", source=source, item="rating.levels",
                         fix="describe it in [rating.permit]")
    return levels


def _limit_states(rating: dict[str, Any], material: str, levels: tuple[str, ...],
                  source: str) -> tuple[str, ...]:
    rows = [row for level in levels for row in limit_states(material, level, source=source)]
    known = tuple(dict.fromkeys(row.limit_state for row in rows))
    if "limit_states" not in rating:
        return tuple(dict.fromkeys(row.limit_state for row in rows if not row.optional))
    wanted = names(rating["limit_states"], "rating.limit_states", source)
    for name in wanted:
        choice(name, known, f"rating.limit_states (for {material})", source)
    return wanted


def rating_settings(document: dict[str, Any], units: str, source: str = "") -> RatingSettings:
    """The ``[rating]`` table of a parsed model file, validated.

    Args:
        document: the parsed TOML file.
        units: the model's unit system, "kip-ft" or "kN-m" (for the distribution geometry and
            the permit weight).
        source: file name for errors.

    Raises:
        ModelError: one line naming the file, the key and the fix.
    """
    choice(units, UNIT_SYSTEMS, "units", source)
    rating = table(document.get("rating", {}), "rating", source)
    check_keys(rating, "[rating]", source, "rating")
    method = choice(rating.get("method", "LRFR"), METHODS, "rating.method", source)
    edition = str(rating.get("edition", known_editions()[-1]))
    edition_table(edition, source, "rating.edition")
    adtt = None if "adtt" not in rating else number(rating["adtt"], "rating.adtt", source)
    if adtt is not None and adtt < 0.0:
        raise ModelError(f"adtt = {rating['adtt']!r} is negative", source=source,
                         item="rating.adtt",
                         fix="give the trucks a day in one direction, 0 or more, or leave it "
                             "out when unknown")
    impact = rating.get("impact")
    impact = None if impact is None else number(impact, "rating.impact", source)
    if impact is not None and not 0.0 <= impact <= 1.0:
        raise ModelError(f"impact = {impact!r}", source=source, item="rating.impact",
                         fix="give the dynamic allowance as a fraction, e.g. 0.33")
    increment = rating.get("sign_increment")
    increment = None if increment is None else positive(increment, "rating.sign_increment",
                                                        source)
    distribution = _distribution(rating.get("distribution"), units, source)
    dead_loads = listed_dead_loads(rating.get("dead_loads", {}), source)
    if method != "LRFR":
        for key in LRFR_ONLY:
            if key in rating:
                raise ModelError(f"{key} is an LRFR setting, the method is {method}",
                                 source=source, item=f"rating.{key}",
                                 fix='remove it, or set method = "LRFR"')
        return RatingSettings(method, edition, adtt, levels=_levels(rating, method, False,
                                                                    source),
                              impact=impact, distribution=distribution, sign_increment=increment,
                              dead_loads=dead_loads)
    if "material" not in rating:
        raise ModelError("LRFR needs the bridge material", source=source, item="rating",
                         fix="add material = " + " | ".join(f'"{m}"' for m in MATERIALS))
    material = choice(rating["material"], MATERIALS, "rating.material", source)
    permit = _permit(rating.get("permit"), units, source)
    levels = _levels(rating, method, permit is not None, source)
    return RatingSettings(
        method, edition, adtt, material, _condition(rating, source), _system(rating, source),
        _limit_states(rating, material, levels, source), levels,
        flag(rating.get("overlay_measured", False), "rating.overlay_measured", source), impact,
        choice(rating.get("surface", "standard"), SURFACES, "rating.surface", source),
        distribution, permit, increment, dead_loads)
