"""AASHTO LRFD fatigue of steel details: categories, load factors, truck frequency, resistance.

Reference: AASHTO LRFD Bridge Design Specifications, 6.6.1.2 (load-induced fatigue), Tables
6.6.1.2.5-1 to -3, Table 3.4.1-1 (load factors Fatigue I and II), 3.6.1.4.2 ((ADTT)SL),
Table 3.6.2.1-1 (IM). The values, their clauses and confidence marks are in
``data/aashto_lrfd.toml``, keyed by edition.

The checks, as the specification states them: Fatigue I (infinite life),
gamma_I (delta f)max <= (delta F)TH; Fatigue II (finite life), gamma_II (delta f) <= (delta F)n =
(A / N)^(1/3) with N = 365 x 75 x n x (ADTT)SL. For a spectrum of ranges the finite-life check is
the Miner sum on the slope-3 line extended below the threshold (the threshold protects only a
spectrum whose largest factored range stays below it); see :mod:`influence.fatigue.damage`.

Example:
    >>> curve = aashto_curve("C'")
    >>> curve.reference_range, curve.fatigue_limit
    (12.0, 12.0)
    >>> round(fatigue_ii_resistance("C'", cycles_per_passage=1.0, adtt_sl=1000.0), 3)
    5.437
"""

from __future__ import annotations

from typing import Any

from influence.errors import ModelError
from influence.fatigue.sn_curve import Resistance, SNCurve
from influence.fatigue.tables import edition_key, table

STANDARD = "AASHTO"
DATA = "aashto_lrfd"


def _data() -> dict[str, Any]:
    return table(DATA)


def categories() -> tuple[str, ...]:
    """The detail categories, A to E'."""
    return tuple(_data()["categories"])


def _category(name: str) -> dict[str, Any]:
    known = _data()["categories"]
    if name not in known:
        raise ModelError(f"unknown AASHTO detail category {name!r}", item="category",
                         fix="use one of " + ", ".join(known))
    entry: dict[str, Any] = known[name]
    return entry


def edition(year: int | None = None) -> dict[str, Any]:
    """The edition's load factors (fatigue_I, fatigue_II), dynamic_allowance, label, clause and
    confidence, for the edition in force in ``year`` (the latest when None).

    Example:
        >>> edition(2010)["fatigue_I"], edition()["fatigue_II"]
        (1.5, 0.8)
    """
    data = _data()
    entry: dict[str, Any] = data["editions"][edition_key(data, year)]
    return entry


def aashto_curve(category: str, stress_unit: str = "ksi") -> SNCurve:
    """The S-N curve of a detail category: N = A / S^3, threshold (delta F)TH.

    Args:
        category: "A", "B", "B'", "C", "C'", "D", "E" or "E'".
        stress_unit: "ksi" (US customary tables) or "MPa" (SI edition tables).

    Raises:
        ModelError: for an unknown category or stress unit.
    """
    entry = _category(category)
    keys = {"ksi": ("constant_ksi3", "threshold_ksi"), "MPa": ("constant_mpa3", "threshold_mpa")}
    if stress_unit not in keys:
        raise ModelError(f"unknown stress unit {stress_unit!r}", item="stress unit",
                         fix="use ksi or MPa")
    constant_key, threshold_key = keys[stress_unit]
    threshold = float(entry[threshold_key])
    return SNCurve(STANDARD, category, stress_unit, threshold,
                   float(entry[constant_key]) / threshold**3, 3.0, 3.0, 0.0, 0.0, threshold,
                   None)


def aashto_resistance(category: str, stress_unit: str = "ksi", year: int | None = None,
                      dynamic_allowance: float | None = None) -> Resistance:
    """The curve with the edition's Fatigue I and II load factors and the dynamic allowance.

    Args:
        category: detail category.
        stress_unit: "ksi" or "MPa".
        year: edition year (None: the latest).
        dynamic_allowance: IM applied to the stress ranges (None: the edition's 15 %; 0 when
            the histories already include it).

    Example:
        >>> r = aashto_resistance("C", year=2020)
        >>> round(r.damage_factor, 4), round(r.limit_factor, 4), round(r.limit_range, 4)
        (0.92, 2.0125, 4.9689)
    """
    factors = edition(year)
    allowance = factors["dynamic_allowance"] if dynamic_allowance is None else dynamic_allowance
    impact = 1.0 + float(allowance)
    basis = (f"AASHTO LRFD {factors['label']}: Fatigue I {factors['fatigue_I']}, Fatigue II "
             f"{factors['fatigue_II']} ({factors['clause']}), IM {allowance:g}")
    return Resistance(aashto_curve(category, stress_unit), factors["fatigue_II"] * impact,
                      factors["fatigue_I"] * impact, basis)


def lane_fraction(lanes: int) -> float:
    """p of (ADTT)SL = p x ADTT for the number of lanes available to trucks (3 or more: 0.80).

    Example:
        >>> lane_fraction(1), lane_fraction(2), lane_fraction(5)
        (1.0, 0.85, 0.8)
    """
    if isinstance(lanes, bool) or not isinstance(lanes, int) or lanes < 1:
        raise ModelError(f"lanes must be a whole number from 1, got {lanes!r}", item="lanes",
                         fix="give the number of lanes available to trucks")
    rows = _data()["lane_fraction"]
    fitting = [row for row in rows if row["lanes"] <= lanes]
    return float(fitting[-1]["p"])


def single_lane_adtt(adtt: float, lanes: int) -> float:
    """(ADTT)SL = p x ADTT [trucks per day in one lane]."""
    return lane_fraction(lanes) * adtt


def cycles_per_passage(member: str, span: float, length_unit: str = "ft",
                       near_interior_support: bool = False) -> float:
    """n, the cycles per truck passage (Table 6.6.1.2.5-2).

    Args:
        member: a row of the table: "simple-span girder", "continuous girder",
            "cantilever girder", "orthotropic deck plate connection", "truss",
            "transverse member".
        span: the span length (for transverse members, their spacing) [length_unit].
        length_unit: "ft" (40 ft split) or "m" (12.0 m split, SI edition).
        near_interior_support: for continuous girders, the detail lies within
            :func:`near_support_distance` of an interior support.

    Example:
        >>> cycles_per_passage("continuous girder", 90.0, near_interior_support=True)
        1.5
        >>> cycles_per_passage("simple-span girder", 40.0)  # the split itself is "short"
        2.0
    """
    members = _data()["cycles_per_passage"]["members"]
    if member not in members:
        raise ModelError(f"unknown member kind {member!r}", item="member",
                         fix="use one of " + ", ".join(members))
    if length_unit not in ("ft", "m"):
        raise ModelError(f"unknown length unit {length_unit!r}", item="length unit",
                         fix="use ft or m")
    row = members[member]
    length = "short" if span <= row[f"split_{length_unit}"] else "long"
    near = "near_support_" + length
    return float(row[near] if near_interior_support and near in row else row[length])


def near_support_distance(span: float) -> float:
    """How far either side of an interior support a detail counts as near it: 0.1 x the span
    on that side [unit of span]."""
    return float(_data()["cycles_per_passage"]["near_support_fraction"]) * span


def design_life_cycles(cycles_per_passage: float, adtt_sl: float,
                       years: float | None = None) -> float:
    """N = 365 x years x n x (ADTT)SL (years: 75 by default)."""
    data = _data()["standard"]
    life = data["design_life_years"] if years is None else years
    return float(data["days_per_year"] * life * cycles_per_passage * adtt_sl)


def fatigue_ii_resistance(category: str, cycles_per_passage: float, adtt_sl: float,
                          stress_unit: str = "ksi", years: float | None = None) -> float:
    """(delta F)n = (A / N)^(1/3) [stress unit], N from :func:`design_life_cycles`."""
    curve = aashto_curve(category, stress_unit)
    constant = curve.reference_cycles * curve.reference_range**3
    return float((constant / design_life_cycles(cycles_per_passage, adtt_sl, years)) ** (1 / 3))


def infinite_life_adtt(category: str, year: int | None = None, cycles_per_passage: float = 1.0,
                       stress_unit: str = "ksi") -> float:
    """The (ADTT)SL above which Fatigue I governs over Fatigue II for the design life
    (Table 6.6.1.2.3-2): A / [365 x 75 x n x ((delta F)TH gamma_II / gamma_I)^3].

    Example:
        >>> round(infinite_life_adtt("A", year=2020), 1), round(infinite_life_adtt("A", 2010), 1)
        (691.5, 528.5)
    """
    factors = edition(year)
    curve = aashto_curve(category, stress_unit)
    constant = curve.reference_cycles * curve.reference_range**3
    finite_range = curve.fatigue_limit * factors["fatigue_II"] / factors["fatigue_I"]
    return float(constant / (design_life_cycles(cycles_per_passage, 1.0) * finite_range**3))
