"""Dynamic load allowance for rating: LRFR IM and the LFR/ASR impact fraction I.

LRFR: IM = 33 % on the vehicle, not the lane load (AASHTO LRFD Table 3.6.2.1-1, confirmed).
For legal and permit loads on spans of 40 ft or more the MBE allows 20 % where the riding
surface has minor deviations and 10 % where it is smooth, approaches and joints included (MBE
Table C6A.4.4.3-1, from memory, unconfirmed); for an escorted permit crossing at 10 mph or less
it may be neglected (MBE 6A.4.5.5, from memory, unconfirmed).

LFR and ASR: I = 50/(L + 125) <= 0.30, L the loaded length in ft (AASHTO Standard
Specifications 3.8.2.1: the 0.30 cap confirmed, the formula from memory, unconfirmed). A model
in metres is converted to feet first.

Example:
    >>> lfr_impact(50.0, "kip-ft").fraction             # 50 / 175
    0.285714285714
    >>> lfr_impact(10.0, "kN-m").fraction               # 32.8 ft: the cap governs
    0.3
    >>> lrfr_impact("legal", 60.0, "kip-ft", surface="smooth riding surface").fraction
    0.1
    >>> lrfr_impact("legal", 30.0, "kip-ft", surface="smooth riding surface").fraction
    0.33
"""

from __future__ import annotations

from dataclasses import dataclass

from influence.errors import ModelError
from influence.rating.tables import FACTORS_FILE, data_file
from vehicles.units import M_PER_FT as FOOT
from vehicles.units import SYSTEMS

UNIT_SYSTEMS = tuple(SYSTEMS)
SURFACES = ("standard", "minor surface deviations", "smooth riding surface")


@dataclass(frozen=True)
class ImpactAllowance:
    """A dynamic load allowance and why.

    Attributes:
        fraction: IM or I as a fraction of the vehicle's static effect [-].
        basis: the rule applied, in words.
        mark: clause and confidence.
    """

    fraction: float
    basis: str
    mark: str


def span_in_feet(length: float, units: str) -> float:
    """A length of a model in ``units`` ("kN-m" or "kip-ft") in feet [ft].

    Raises:
        ModelError: for another unit system.
    """
    if units not in UNIT_SYSTEMS:
        raise ModelError(f"units {units!r} are not known", item="units",
                         fix="use " + " or ".join(f'"{u}"' for u in UNIT_SYSTEMS))
    return length / FOOT if units == "kN-m" else length


def _positive_span(length: float) -> None:
    if not length > 0.0:
        raise ModelError(f"span length {length!r}", item="span",
                         fix="give the loaded span length, greater than 0")


def lfr_impact(span_length: float, units: str) -> ImpactAllowance:
    """I = 50/(L + 125) <= 0.30 with L in ft (AASHTO Standard Specifications 3.8.2.1).

    Args:
        span_length: loaded length L [length of ``units``].
        units: "kip-ft" or "kN-m".
    """
    _positive_span(span_length)
    rule = data_file(FACTORS_FILE)["impact"]["lfr"]
    feet = span_in_feet(span_length, units)
    formula = rule["numerator_ft"] / (feet + rule["offset_ft"])
    capped = formula > rule["cap"]
    fraction = rule["cap"] if capped else formula
    basis = (f"50/({feet:.4g} ft + 125) = {formula:.4f}"
             + (f", capped at {rule['cap']:g}" if capped else ""))
    return ImpactAllowance(round(fraction, 12), basis, rule["mark"])


def lrfr_impact(level: str, span_length: float, units: str, *, surface: str = "standard",
                escorted_crawl: bool = False) -> ImpactAllowance:
    """IM for an LRFR rating level.

    Args:
        level: "design inventory", "design operating", "legal" or "permit".
        span_length: span length [length of ``units``]; reductions need 40 ft or more.
        units: "kip-ft" or "kN-m".
        surface: "standard", "minor surface deviations" or "smooth riding surface".
        escorted_crawl: an escorted permit crossing at 10 mph or less (IM neglected).

    Raises:
        ModelError: for an unknown surface, a reduction asked for at a design level, or a
            crawl crossing asked for at another level than "permit".
    """
    _positive_span(span_length)
    rule = data_file(FACTORS_FILE)["impact"]["lrfr"]
    if surface not in SURFACES:
        raise ModelError(f"unknown riding surface {surface!r}", item="rating.surface",
                         fix="use one of: " + ", ".join(f'"{s}"' for s in SURFACES))
    if level.startswith("design") and (surface != "standard" or escorted_crawl):
        raise ModelError(f"IM is 33 % at the {level} level", item="rating.surface",
                         fix="reductions apply to legal and permit loads only")
    if escorted_crawl:
        if level != "permit":
            raise ModelError("a crawl crossing is an escorted permit rule",
                             item="rating.escorted_crawl", fix="use it at the permit level only")
        return ImpactAllowance(float(rule["escorted_crawl"]), "escorted permit at 10 mph or less",
                               rule["escorted_crawl_mark"])
    if surface == "standard":
        return ImpactAllowance(float(rule["standard"]), "33 % on the vehicle",
                               rule["standard_mark"])
    feet = span_in_feet(span_length, units)
    if feet < rule["reduced_minimum_span_ft"]:
        return ImpactAllowance(float(rule["standard"]),
                               f"span {feet:.4g} ft under 40 ft: no reduction",
                               rule["reduced_mark"])
    return ImpactAllowance(float(rule["reduced"][surface]), f"{surface}, span {feet:.4g} ft",
                           rule["reduced_mark"])
